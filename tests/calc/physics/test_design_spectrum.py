"""The EN 1998-1 elastic and design spectra at every branch."""

from __future__ import annotations

import math

import numpy as np
import pytest

from fieldmode.calc.physics import design_spectrum

# Source: EN 1998-1:2004 3.2.2.2, Table 3.2 (Type 1, recommended values): S, TB, TC, TD
TABLE_3_2 = {"A": (1.0, 0.15, 0.4, 2.0), "B": (1.2, 0.15, 0.5, 2.0), "C": (1.15, 0.20, 0.6, 2.0),
             "D": (1.35, 0.20, 0.8, 2.0), "E": (1.4, 0.15, 0.5, 2.0)}


# Source: EN 1998-1:2004 3.2.2.2, Table 3.3 (Type 2, recommended values): S, TB, TC, TD
TABLE_3_3 = {"A": (1.0, 0.05, 0.25, 1.2), "B": (1.35, 0.05, 0.25, 1.2), "C": (1.5, 0.10, 0.25, 1.2),
             "D": (1.8, 0.10, 0.30, 1.2), "E": (1.6, 0.05, 0.25, 1.2)}


CASES = [(kind, ground, table[ground]) for kind, table in (("1", TABLE_3_2), ("2", TABLE_3_3))
         for ground in "ABCDE"]


G0 = 9.80665  # Source: NIST SP 811 (2008), standard gravity


def clause_se(t: float, ag: float, s: float, tb: float, tc: float, td: float, eta: float) -> float:
    """Source: EN 1998-1:2004 3.2.2.2, eq. 3.2-3.5, written out branch by branch."""
    if t <= tb:
        return ag * s * (1 + t / tb * (eta * 2.5 - 1))  # eq. 3.2
    if t <= tc:
        return ag * s * eta * 2.5  # eq. 3.3
    if t <= td:
        return ag * s * eta * 2.5 * (tc / t)  # eq. 3.4
    return ag * s * eta * 2.5 * (tc * td / t**2)  # eq. 3.5


def clause_sd(t: float, ag: float, s: float, tb: float, tc: float, td: float, q: float) -> float:
    """Source: EN 1998-1:2004 3.2.2.5(4), eq. 3.13-3.16, beta = 0.2 (recommended)."""
    if t <= tb:
        return ag * s * (2 / 3 + t / tb * (2.5 / q - 2 / 3))  # eq. 3.13
    if t <= tc:
        return ag * s * 2.5 / q  # eq. 3.14
    if t <= td:
        return max(ag * s * 2.5 / q * tc / t, 0.2 * ag)  # eq. 3.15
    return max(ag * s * 2.5 / q * tc * td / t**2, 0.2 * ag)  # eq. 3.16


@pytest.mark.parametrize(("kind", "ground", "row"), CASES)
def test_recommended_tables(kind: str, ground: str, row: tuple[float, float, float, float]) -> None:
    shape = design_spectrum.recommended_shape(kind, ground)
    # Source: EN 1998-1:2004 3.2.2.2, Table 3.2 / Table 3.3
    assert (shape.soil_factor, shape.tb, shape.tc, shape.td) == row


@pytest.mark.parametrize("damping", [0.0, 0.02, 0.05, 0.10, 0.30])
@pytest.mark.parametrize(("kind", "ground", "row"), CASES)
def test_elastic_spectrum_boundaries_and_branches(kind: str, ground: str, row: tuple[float, ...],
                                                  damping: float) -> None:
    s, tb, tc, td = row
    ag = 0.16 * G0
    eta = max(math.sqrt(10 / (5 + 100 * damping)), 0.55)  # Source: EN 1998-1:2004 3.2.2.2(3), eq. 3.6
    shape = design_spectrum.recommended_shape(kind, ground)
    periods = [0.0, tb / 2, tb, (tb + tc) / 2, tc, (tc + td) / 2, td, (td + 4.0) / 2, 4.0]
    got = design_spectrum.elastic_spectrum(np.array(periods), ag, shape, design_spectrum.damping_correction(damping))
    expected = [clause_se(t, ag, s, tb, tc, td, eta) for t in periods]
    # Source: EN 1998-1:2004 3.2.2.2, eq. 3.2-3.5, Table 3.2 / 3.3
    np.testing.assert_allclose(got, expected, rtol=1e-12)
    # Source: EN 1998-1:2004 3.2.2.2, eq. 3.2 at T = 0 gives ag S; eq. 3.3 plateau ag S eta 2.5
    assert got[0] == pytest.approx(ag * s)
    assert got[2] == pytest.approx(ag * s * eta * 2.5) and got[4] == pytest.approx(ag * s * eta * 2.5)


@pytest.mark.parametrize(("damping", "eta"), [
    (0.05, 1.0),                       # Source: EN 1998-1:2004 3.2.2.2(3): eta = 1 at 5 %
    (0.0, math.sqrt(2.0)),             # Source: EN 1998-1:2004 3.2.2.2(3), eq. 3.6 at xi = 0
    (0.10, math.sqrt(10 / 15)),        # Source: EN 1998-1:2004 3.2.2.2(3), eq. 3.6
    (0.2806, 0.55),                    # Source: EN 1998-1:2004 3.2.2.2(3): eta >= 0.55
    (0.50, 0.55),                      # Source: EN 1998-1:2004 3.2.2.2(3): eta >= 0.55
])
def test_damping_correction(damping: float, eta: float) -> None:
    assert design_spectrum.damping_correction(damping) == pytest.approx(eta, rel=1e-4)


@pytest.mark.parametrize("q", [1.0, 1.5, 4.0, 6.5])
@pytest.mark.parametrize(("kind", "ground", "row"), CASES)
def test_design_spectrum(kind: str, ground: str, row: tuple[float, ...], q: float) -> None:
    s, tb, tc, td = row
    ag = 0.25 * G0
    shape = design_spectrum.recommended_shape(kind, ground)
    periods = [0.0, tb / 2, tb, (tb + tc) / 2, tc, (tc + td) / 2, td, 3.0, 4.0]
    got = design_spectrum.design_spectrum(np.array(periods), ag, shape, q)
    # Source: EN 1998-1:2004 3.2.2.5, eq. 3.13-3.16, Table 3.2 / 3.3, beta = 0.2
    np.testing.assert_allclose(got, [clause_sd(t, ag, s, tb, tc, td, q) for t in periods], rtol=1e-12)
    # Source: EN 1998-1:2004 3.2.2.5(4): never below beta ag
    assert np.all(got >= 0.2 * ag - 1e-12)


def test_design_spectrum_lower_bound_governs_long_periods() -> None:
    shape = design_spectrum.recommended_shape("1", "A")
    ag = 0.2 * G0
    # Source: EN 1998-1:2004 3.2.2.5(4), eq. 3.16: ag S 2.5/q TC TD / T^2 = 0.03125 ag < 0.2 ag at T = 4 s, q = 4
    assert float(design_spectrum.design_spectrum(4.0, ag, shape, 4.0)) == pytest.approx(0.2 * ag)


def test_demo_site_plateau() -> None:
    shape = design_spectrum.recommended_shape("1", "C")
    # Source: EN 1998-1:2004 3.2.2.2, eq. 3.3, Table 3.2 ground C: 0.16 g x 1.15 x 2.5 = 4.511 m/s^2
    assert float(design_spectrum.elastic_spectrum(0.4, 0.16 * G0, shape)) == pytest.approx(4.5110, abs=1e-4)
    # Source: EN 1998-1:2004 3.2.2.4, eq. 3.7: SDe = Se (T / 2 pi)^2
    expected = 4.5110 * (0.53 / (2 * math.pi)) ** 2
    assert float(design_spectrum.spectral_displacement(4.5110, 0.53)) == pytest.approx(expected)


@pytest.mark.parametrize(("period", "expected"), [
    (0.1, "ascending"), (0.2, "constant acceleration"), (0.6, "constant acceleration"),
    (0.61, "constant velocity"), (2.0, "constant velocity"), (2.5, "constant displacement"),
])
def test_branch_names(period: float, expected: str) -> None:
    # Source: EN 1998-1:2004 3.2.2.2, eq. 3.2-3.5 ranges, Table 3.2 ground C (TB 0.2, TC 0.6, TD 2.0)
    assert design_spectrum.branch(period, design_spectrum.recommended_shape("1", "C")) == expected
