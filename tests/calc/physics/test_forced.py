"""Harmonic response: amplification, phase, peaks and unbalance against closed forms."""

from __future__ import annotations

import math

import pytest
from scipy.optimize import minimize_scalar

from fieldmode.calc.physics import forced


@pytest.mark.parametrize(("r", "zeta", "gain", "lag"), [
    (0.0, 0.05, 1.0, 0.0),  # Source: Chopra, Dynamics of Structures, sec. 3.2: static at r = 0
    (1.0, 0.05, 10.0, 90.0),  # Source: Chopra sec. 3.2: R_d = 1/(2 zeta), phase 90 deg at resonance
    (2.0, 0.0, 1 / 3, 180.0),  # Source: Chopra sec. 3.1: undamped 1/|1 - r^2|, out of phase above resonance
    (0.5, 0.1, 1 / math.sqrt(0.75**2 + 0.1**2), math.degrees(math.atan2(0.1, 0.75))),  # Source: Chopra eq. 3.2.11
])
def test_amplification_and_phase_closed_forms(r: float, zeta: float, gain: float, lag: float) -> None:
    assert forced.amplification(r, zeta) == pytest.approx(gain)
    assert forced.phase(r, zeta) == pytest.approx(lag, abs=1e-9)


@pytest.mark.parametrize("zeta", [0.005, 0.02, 0.05, 0.1, 0.3, 0.6])
def test_peak_amplification_and_where(zeta: float) -> None:
    # Source: Chopra, Dynamics of Structures, sec. 3.2.5: peak 1/(2 zeta sqrt(1-zeta^2)) at r = sqrt(1-2 zeta^2)
    assert forced.peak_amplification(zeta) == pytest.approx(1 / (2 * zeta * math.sqrt(1 - zeta**2)))
    assert forced.peak_ratio(zeta) == pytest.approx(math.sqrt(1 - 2 * zeta**2))
    # Oracle: scipy.optimize.minimize_scalar (bounded) on -R_d
    found = minimize_scalar(lambda r: -forced.amplification(r, zeta), bounds=(0.0, 1.5), method="bounded",
                            options={"xatol": 1e-12})
    assert forced.peak_ratio(zeta) == pytest.approx(found.x, abs=1e-5)
    assert forced.peak_amplification(zeta) == pytest.approx(-found.fun, rel=1e-9)
