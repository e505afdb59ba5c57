"""Check `storeys`: modes through the check, the EN 1998-1 spectrum per mode, and bad input."""

from __future__ import annotations

import math

import numpy as np
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from fieldmode.calc.checks import BY_ID
from fieldmode.calc.framework.units import InputError

SPEC = BY_ID["storeys"]


def evaluate(**texts: str):  # noqa: ANN201
    given_texts = SPEC.demo_texts()
    given_texts.update(texts)
    return SPEC.evaluate({k: v for k, v in given_texts.items() if v})


ITEM = st.one_of(st.floats(allow_nan=True, allow_infinity=True).map(lambda v: f"{v} t"),
                 st.sampled_from(["0", "-3 t", "1e-300 t", "5 kN", "x", "", "1e15 t", "2 kN/mm"]),
                 st.text(max_size=8))


G0 = 9.80665  # Source: 3rd CGPM (1901), standard gravity


# Chopra's two-storey frame (m1 = 2m, m2 = m, k1 = 2k, k2 = k) with m = 100 t, k = 20 kN/mm:
# omega = sqrt(k/2m) = 10 rad/s and sqrt(2k/m) = 20 rad/s (From memory: Chopra, Dynamics of Structures, ch. 10)
TWO_STOREYS = {"masses": "200 t, 100 t", "stiffnesses": "40 kN/mm, 20 kN/mm", "heights": "4 m, 3 m",
               "damping": "5 %", "design_ground_acceleration": "0.2 g", "ground_type": "C", "spectrum_type": "1"}


OMEGA = np.array([10.0, 20.0])


PERIODS = 2 * math.pi / OMEGA


def _elastic_type1_ground_c(period: float, ag: float) -> float:
    # Source: EN 1998-1:2004 3.2.2.2, eq. 3.2-3.4, Table 3.2 ground C: S 1.15, TB 0.20, TC 0.6, TD 2.0; eta 1 at 5 %
    s, tb, tc = 1.15, 0.20, 0.6
    if period < tb:
        return ag * s * (1 + period / tb * 1.5)
    return ag * s * 2.5 * (1.0 if period <= tc else tc / period)


def evaluate_two_storeys(**texts: str):  # noqa: ANN201
    given = dict(TWO_STOREYS)
    given.update(texts)
    return SPEC.evaluate({k: v for k, v in given.items() if v})


M, K = 100e3, 20e6


def test_demo_two_storey_textbook_case_through_the_check() -> None:
    result = evaluate(masses="200 t, 100 t", stiffnesses="40 kN/mm, 20 kN/mm", heights="", rayleigh_modes="")
    m, k = 100e3, 20e6
    # From memory: Chopra, Dynamics of Structures, ch. 10: omega = sqrt(k/2m), sqrt(2k/m)
    expected = [2 * math.pi / math.sqrt(k / (2 * m)), 2 * math.pi / math.sqrt(2 * k / m)]
    np.testing.assert_allclose(result.values["periods"].si(), expected, rtol=1e-10)
    assert result.values["period"].si() == pytest.approx(expected[0])
    np.testing.assert_allclose(result.values["mode_shapes"].si(), [[0.5, 1.0], [-1.0, 1.0]], atol=1e-12)
    # Source: Chopra, ch. 13: effective masses sum to the total, so the last cumulative ratio is 1
    assert result.values["cumulative_mass_ratio"].si()[-1] == pytest.approx(1.0)
    assert "storey" in result.series and "mode_2" in result.series


def test_weights_and_us_units_give_the_same_modes() -> None:
    si = evaluate(masses="310 t, 300 t, 240 t", stiffnesses="180, 160, 120 kN/mm")
    # Source: NIST SP 811: 1 kip = 4448.2216152605 N, 1 in = 0.0254 m; g0 = 9.80665 m/s^2
    weights = ", ".join(f"{m * 9.80665 / 4448.2216152605:.10g} kip" for m in (310e3, 300e3, 240e3))
    stiff = ", ".join(f"{k * 0.0254 / 4448.2216152605:.10g} kip/in" for k in (180e6, 160e6, 120e6))
    us = evaluate(masses=weights, stiffnesses=stiff)
    np.testing.assert_allclose(us.values["periods"].si(), si.values["periods"].si(), rtol=1e-8)
    assert any("read as weight" in flag.text for flag in us.flags)


def test_rayleigh_modes_choice() -> None:
    result = evaluate(rayleigh_modes="1, 3", damping="5 %")
    ratios = result.values["rayleigh_damping"].si()
    # From memory: Chopra, ch. 11: Rayleigh damping equals the chosen ratio at both chosen modes
    assert ratios[0] == pytest.approx(0.05) and ratios[2] == pytest.approx(0.05)
    assert ratios[1] < 0.05


def test_soft_storey_is_flagged_and_one_storey_skips_rayleigh() -> None:
    soft = evaluate(masses="300 t, 300 t, 300 t", stiffnesses="100, 160, 160 kN/mm")
    # From memory: ASCE 7-16 Table 12.3-2 type 1a: 100/160 = 62 % < 70 %
    assert any(f.level == "warning" and "soft storey 1" in f.text for f in soft.flags)
    single = evaluate(masses="300 t", stiffnesses="100 kN/mm", heights="4 m", rayleigh_modes="")
    assert "rayleigh_alpha" not in single.values
    assert single.values["effective_mass_ratio"].si() == pytest.approx([1.0])


def test_mass_flag_counts_modes() -> None:
    result = evaluate()
    needed = int(result.values["modes_for_90_percent"].si())
    cumulative = result.values["cumulative_mass_ratio"].si()
    # Source: EN 1998-1:2004 4.3.3.3.1(3) (from memory): the first modes reaching 90 % of the mass
    assert cumulative[needed - 1] >= 0.9 and (needed == 1 or cumulative[needed - 2] < 0.9)


@pytest.mark.parametrize(("texts", "field", "words"), [
    ({"masses": ""}, "Storey masses", "required"),
    ({"masses": " , "}, "Storey masses", "empty item"),
    ({"masses": "310 t,, 240 t"}, "Storey masses", "empty item"),
    ({"masses": "310 t, 300 t"}, "Storey stiffnesses", "3 stiffnesses for 2 masses"),
    ({"stiffnesses": "180 kN/mm"}, "Storey stiffnesses", "1 stiffnesses for 3 masses"),
    ({"masses": "310 t, 0 t, 240 t"}, "Storey masses", "greater than zero"),
    ({"masses": "310 t, -300 t, 240 t"}, "Storey masses", "greater than zero"),
    ({"stiffnesses": "180, 0, 120 kN/mm"}, "Storey stiffnesses", "greater than zero"),
    ({"stiffnesses": "180, -160, 120 kN/mm"}, "Storey stiffnesses", "greater than zero"),
    ({"stiffnesses": "180, 160, 120 kg"}, "Storey stiffnesses #1", "not a unit of stiffness"),
    ({"stiffnesses": "1e12, 1, 1 kN/mm"}, "Storey stiffnesses", "differ more than"),
    ({"heights": "4 m, 3 m"}, "Storey heights", "2 heights for 3 storeys"),
    ({"heights": "4 m, 0 m, 3 m"}, "Storey heights", "greater than zero"),
    ({"rayleigh_modes": "1"}, "Rayleigh modes", "two different"),
    ({"rayleigh_modes": "2, 2"}, "Rayleigh modes", "two different"),
    ({"rayleigh_modes": "1, 4"}, "Rayleigh modes", "only 3 modes"),
    ({"rayleigh_modes": "0, 2"}, "Rayleigh modes", "greater than zero"),
    ({"rayleigh_modes": "1.5, 2"}, "Rayleigh modes #1", "whole number"),
    ({"damping": "60 %"}, "Damping ratio", "at most"),
    ({"damping": "-1 %"}, "Damping ratio", "at least"),
])
def test_bad_inputs_name_the_field(texts: dict[str, str], field: str, words: str) -> None:
    with pytest.raises(InputError) as caught:
        given_texts = SPEC.demo_texts()
        given_texts.update(texts)
        SPEC.evaluate(given_texts)
    assert str(caught.value).startswith(field)
    assert words in str(caught.value)


@settings(max_examples=120, deadline=None)
@given(masses=st.lists(ITEM, max_size=6), stiffnesses=st.lists(ITEM, max_size=6), heights=st.lists(ITEM, max_size=6))
def test_any_lists_only_raise_input_error(masses: list[str], stiffnesses: list[str], heights: list[str]) -> None:
    try:
        result = SPEC.evaluate({"masses": ", ".join(masses), "stiffnesses": ", ".join(stiffnesses),
                                "heights": ", ".join(heights), "damping": "5 %"})
    except InputError:
        return
    assert np.all(np.isfinite(result.values["periods"].si()))


def test_spectral_accelerations_per_mode() -> None:
    result = evaluate_two_storeys()
    expected = [_elastic_type1_ground_c(t, 0.2 * G0) for t in PERIODS]
    np.testing.assert_allclose(result.values["spectral_acceleration"].si(), expected, rtol=1e-12)
    assert "elastic" in result.values["spectrum_used"].si()


def test_two_storey_base_shear_and_roof_displacement_by_hand() -> None:
    result = evaluate_two_storeys()
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
    result = evaluate_two_storeys(behaviour_factor="4")
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
    result = evaluate_two_storeys(masses="100 t, 1 t", stiffnesses="40 kN/mm, 0.41 kN/mm")
    periods = result.values["periods"].si()
    close = periods[1] > 0.9 * periods[0]
    # Source: EN 1998-1:2004 4.3.3.3.2(2): modes independent only when T_j <= 0.9 T_i
    assert close == any("within 10 %" in flag.text for flag in result.flags)
    assert close


def test_modes_only_without_ground_acceleration() -> None:
    result = evaluate_two_storeys(design_ground_acceleration="")
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
    result = evaluate_two_storeys(corner_period_tc="0.7 s")
    # Source: EN 1998-1:2004 3.2.2.2, eq. 3.3: with TC = 0.7 s a 0.628 s mode is on the plateau
    assert result.values["spectral_acceleration"].si()[0] == pytest.approx(0.2 * G0 * 1.15 * 2.5, rel=1e-12)
    assert "TC 0.7 s" in result.values["spectrum_used"].si()


def _hand_drifts_cqc(sa: np.ndarray) -> np.ndarray:
    """CQC interstorey drifts (m) of the textbook two-storey frame from spectral accelerations per mode."""
    first = np.array([4 / 3 * 0.5 * sa[0] / OMEGA[0] ** 2, -1 / 3 * -1 * sa[1] / OMEGA[1] ** 2])
    roof = np.array([4 / 3 * sa[0] / OMEGA[0] ** 2, -1 / 3 * sa[1] / OMEGA[1] ** 2])
    r, z = 2.0, 0.05
    # Source: Der Kiureghian (1981), equal damping
    rho = 8 * z**2 * (1 + r) * r**1.5 / ((1 - r**2) ** 2 + 4 * z**2 * r * (1 + r) ** 2)
    return np.array([math.sqrt(d @ d + 2 * rho * d[0] * d[1]) for d in (first, roof - first)])


# From memory: EN 1998-1:2004 4.4.3.2(1), eq. 4.31-4.33: d_r nu <= alpha h, alpha 0.005 (brittle non-structural
# elements attached), 0.0075 (ductile), 0.010 (not interfering, or none); 4.4.3.2(2): nu recommended 0.5 for
# importance classes I and II, 0.4 for III and IV
@pytest.mark.parametrize(("texts", "alpha", "nu"), [
    ({}, 0.005, 0.5),
    ({"non_structural": "brittle", "importance_class": "I"}, 0.005, 0.5),
    ({"non_structural": "ductile", "importance_class": "III"}, 0.0075, 0.4),
    ({"non_structural": "separated-or-none", "importance_class": "IV"}, 0.010, 0.4),
    ({"non_structural": "sep", "reduction_factor": "0.45"}, 0.010, 0.45),  # a National Annex nu
])
def test_damage_limitation_by_hand(texts: dict[str, str], alpha: float, nu: float) -> None:
    result = evaluate_two_storeys(**texts)
    sa = np.array([_elastic_type1_ground_c(t, 0.2 * G0) for t in PERIODS])
    expected = _hand_drifts_cqc(sa) * nu / np.array([4.0, 3.0])
    np.testing.assert_allclose(result.values["damage_drift_ratio"].si(), expected, rtol=1e-12)
    assert result.values["damage_largest_ratio"].si() == pytest.approx(expected.max(), rel=1e-12)
    assert result.values["damage_limit"].si() == pytest.approx(alpha)
    assert result.values["reduction_factor"].si() == pytest.approx(nu)
    warnings = [flag.text for flag in result.flags if flag.level == "warning" and "damage limitation" in flag.text]
    over = [n + 1 for n in range(2) if expected[n] > alpha]
    if over:
        assert len(warnings) == 1
        assert all(f"storey {n} (" in warnings[0] for n in over)
        assert all(f"storey {n} (" not in warnings[0] for n in (1, 2) if n not in over)
    else:
        assert not warnings and any("damage limitation met" in flag.text for flag in result.flags)
    assert any("4.4.3.2" in ref.source for ref in result.references)


def test_the_two_storey_frame_exceeds_the_brittle_limit_in_its_top_storey() -> None:
    sa = np.array([_elastic_type1_ground_c(t, 0.2 * G0) for t in PERIODS])
    ratios = _hand_drifts_cqc(sa) * 0.5 / np.array([4.0, 3.0])
    # Source: hand calculation above; the case has one storey on each side of alpha = 0.5 %
    assert ratios[0] < 0.005 < ratios[1]
    result = evaluate_two_storeys()
    warning = next(flag.text for flag in result.flags if flag.level == "warning" and "damage" in flag.text)
    assert f"storey 2 ({100 * ratios[1]:.3g} %)" in warning and "storey 1" not in warning


def test_damage_limitation_uses_q_times_the_design_drifts() -> None:
    q = 4.0
    result = evaluate_two_storeys(behaviour_factor="4")
    ag, s, tc = 0.2 * G0, 1.15, 0.6
    # Source: EN 1998-1:2004 3.2.2.5 eq. 3.14-3.15 and 4.3.4(1) d_s = q d_e; 4.4.3.2 (from memory) d_r nu / h
    sa = np.array([max(ag * s * 2.5 / q * min(1.0, tc / t), 0.2 * ag) for t in PERIODS])
    expected = q * _hand_drifts_cqc(sa) * 0.5 / np.array([4.0, 3.0])
    np.testing.assert_allclose(result.values["damage_drift_ratio"].si(), expected, rtol=1e-12)


def test_damage_limitation_needs_the_storey_heights() -> None:
    result = evaluate_two_storeys(heights="")
    assert "damage_drift_ratio" not in result.values
    assert any("needs the storey heights" in flag.text for flag in result.flags)


def test_the_demo_shows_the_damage_limitation() -> None:
    result = evaluate()
    ratios = result.values["damage_drift_ratio"].si()
    assert len(ratios) == 3 and result.values["damage_limit"].si() == pytest.approx(0.005)
    assert any("damage limitation" in flag.text for flag in result.flags)


@pytest.mark.parametrize(("texts", "words"), [
    ({"reduction_factor": "0"}, "greater than zero"),
    ({"reduction_factor": "1.5"}, "at most 1"),
    ({"importance_class": "V"}, "not one of the choices"),
    ({"non_structural": "glass"}, "not one of the choices"),
])
def test_bad_damage_inputs(texts: dict[str, str], words: str) -> None:
    with pytest.raises(InputError) as caught:
        evaluate_two_storeys(**texts)
    label = SPEC.field(next(iter(texts))).label
    assert str(caught.value).startswith(label) and words in str(caught.value)
