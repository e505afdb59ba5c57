"""The seismic part of `storeys`: EN 1998-1 spectral values per mode and SRSS/CQC by hand on two storeys."""

from __future__ import annotations

import math

import numpy as np
import pytest

from fieldmode.calc.checks import BY_ID
from fieldmode.calc.framework.units import InputError

SPEC = BY_ID["storeys"]
G0 = 9.80665  # Source: 3rd CGPM (1901), standard gravity

# Chopra's two-storey frame (m1 = 2m, m2 = m, k1 = 2k, k2 = k) with m = 100 t, k = 20 kN/mm:
# omega = sqrt(k/2m) = 10 rad/s and sqrt(2k/m) = 20 rad/s (From memory: Chopra, Dynamics of Structures, ch. 10)
TWO_STOREYS = {"masses": "200 t, 100 t", "stiffnesses": "40 kN/mm, 20 kN/mm", "heights": "4 m, 3 m",
               "damping": "5 %", "design_ground_acceleration": "0.2 g", "ground_type": "C", "spectrum_type": "1"}
M, K = 100e3, 20e6
OMEGA = np.array([10.0, 20.0])
PERIODS = 2 * math.pi / OMEGA


def _elastic_type1_ground_c(period: float, ag: float) -> float:
    # Source: EN 1998-1:2004 3.2.2.2, eq. 3.2-3.4, Table 3.2 ground C: S 1.15, TB 0.20, TC 0.6, TD 2.0; eta 1 at 5 %
    s, tb, tc = 1.15, 0.20, 0.6
    if period < tb:
        return ag * s * (1 + period / tb * 1.5)
    return ag * s * 2.5 * (1.0 if period <= tc else tc / period)


def evaluate(**texts: str):  # noqa: ANN201
    given = dict(TWO_STOREYS)
    given.update(texts)
    return SPEC.evaluate({k: v for k, v in given.items() if v})


def test_spectral_accelerations_per_mode() -> None:
    result = evaluate()
    expected = [_elastic_type1_ground_c(t, 0.2 * G0) for t in PERIODS]
    np.testing.assert_allclose(result.values["spectral_acceleration"].si(), expected, rtol=1e-12)
    assert "elastic" in result.values["spectrum_used"].si()


def test_two_storey_base_shear_and_roof_displacement_by_hand() -> None:
    result = evaluate()
    sa = np.array([_elastic_type1_ground_c(t, 0.2 * G0) for t in PERIODS])
    # Source: hand calculation; Gamma = 4/3, -1/3 and effective masses 8m/3, m/3 of the textbook modes
    base = np.array([8 * M / 3 * sa[0], M / 3 * sa[1]])
    roof = np.array([4 / 3 * sa[0] / OMEGA[0] ** 2, -1 / 3 * sa[1] / OMEGA[1] ** 2])
    first = np.array([4 / 3 * 0.5 * sa[0] / OMEGA[0] ** 2, -1 / 3 * -1 * sa[1] / OMEGA[1] ** 2])
    r, z = 2.0, 0.05
    # Source: Der Kiureghian (1981), equal damping
    rho = 8 * z**2 * (1 + r) * r**1.5 / ((1 - r**2) ** 2 + 4 * z**2 * r * (1 + r) ** 2)
    assert result.values["base_shear_srss"].si() == pytest.approx(math.hypot(*base), rel=1e-12)
    # base-shear modal values have the same sign (Gamma_n L_n > 0), so CQC adds 2 rho V1 V2
    assert result.values["base_shear_cqc"].si() == pytest.approx(
        math.sqrt(base @ base + 2 * rho * base[0] * base[1]), rel=1e-12)
    assert result.values["displacement_srss"].si()[1] == pytest.approx(math.hypot(*roof), rel=1e-12)
    assert result.values["displacement_cqc"].si()[1] == pytest.approx(
        math.sqrt(roof @ roof + 2 * rho * roof[0] * roof[1]), rel=1e-12)
    drift = roof - first
    assert result.values["drift_srss"].si()[1] == pytest.approx(math.hypot(*drift), rel=1e-12)
    assert result.values["drift_ratio_cqc"].si()[0] == pytest.approx(
        result.values["drift_cqc"].si()[0] / 4.0, rel=1e-12)


def test_design_spectrum_and_displacements_times_q() -> None:
    q = 4.0
    result = evaluate(behaviour_factor="4")
    ag, s, tc = 0.2 * G0, 1.15, 0.6
    # Source: EN 1998-1:2004 3.2.2.5, eq. 3.14-3.15 (TB <= T <= TD), lower bound beta ag = 0.2 ag
    expected = [max(ag * s * 2.5 / q * min(1.0, tc / t), 0.2 * ag) for t in PERIODS]
    np.testing.assert_allclose(result.values["spectral_acceleration"].si(), expected, rtol=1e-12)
    roof = np.array([4 / 3 * expected[0] / OMEGA[0] ** 2, -1 / 3 * expected[1] / OMEGA[1] ** 2])
    # Source: EN 1998-1:2004 4.3.4(1): d_s = q d_e
    assert result.values["displacement_srss"].si()[1] == pytest.approx(q * math.hypot(*roof), rel=1e-12)
    assert any("q = 4" in flag.text for flag in result.flags)


def test_close_modes_are_flagged() -> None:
    # a light top storey tuned near the storey below (sqrt(k/m) 20 and 20.2 rad/s) gives two close modes
    result = evaluate(masses="100 t, 1 t", stiffnesses="40 kN/mm, 0.41 kN/mm")
    periods = result.values["periods"].si()
    close = periods[1] > 0.9 * periods[0]
    # Source: EN 1998-1:2004 4.3.3.3.2(2): modes independent only when T_j <= 0.9 T_i
    assert close == any("within 10 %" in flag.text for flag in result.flags)
    assert close


def test_modes_only_without_ground_acceleration() -> None:
    result = evaluate(design_ground_acceleration="")
    assert "base_shear_cqc" not in result.values and "periods" in result.values


@pytest.mark.parametrize(("texts", "field", "words"), [
    ({"design_ground_acceleration": "-0.1 g"}, "Ground acceleration agR", "greater than zero"),
    ({"design_ground_acceleration": "0 g"}, "Ground acceleration agR", "greater than zero"),
    ({"design_ground_acceleration": "0.2 kg"}, "Ground acceleration agR", "not a unit of acceleration"),
    ({"ground_type": ""}, "Ground type", "give the ground type"),
    ({"behaviour_factor": "0.5"}, "Behaviour factor q", "at least 1"),
    ({"importance": "0"}, "Importance factor", "greater than zero"),
    ({"ground_type": "F"}, "Ground type", "not one of the choices"),
    ({"spectrum_type": "3"}, "Spectrum type", "not one of the choices"),
    ({"corner_period_tb": "0.7 s"}, "Corner period TB", "corner periods must rise"),
])
def test_bad_spectrum_inputs(texts: dict[str, str], field: str, words: str) -> None:
    given = dict(TWO_STOREYS)
    given.update(texts)
    with pytest.raises(InputError) as caught:
        SPEC.evaluate({k: v for k, v in given.items() if v})
    assert str(caught.value).startswith(field)
    assert words in str(caught.value)


def test_national_annex_corner_period_is_used() -> None:
    result = evaluate(corner_period_tc="0.7 s")
    # Source: EN 1998-1:2004 3.2.2.2, eq. 3.3: with TC = 0.7 s a 0.628 s mode is on the plateau
    assert result.values["spectral_acceleration"].si()[0] == pytest.approx(0.2 * G0 * 1.15 * 2.5, rel=1e-12)
    assert "TC 0.7 s" in result.values["spectrum_used"].si()
