"""Check `floor`: a floor's response to walking by the three methods, its limits, what would meet them, bad
input, units and where its results can be sent."""

from __future__ import annotations

import math

import pytest

from fieldmode.calc.checks import BY_ID, SPECS
from fieldmode.calc.framework.units import InputError

SPEC = BY_ID["floor"]
G0 = 9.80665
LB = 0.45359237
LBF = 4.4482216152605
FT = 0.3048


def evaluate(**texts: str):  # noqa: ANN201
    given = SPEC.demo_texts()
    given.update(texts)
    return SPEC.evaluate({k: v for k, v in given.items() if v})


def si(result, name: str) -> float:  # noqa: ANN001
    value = result.number(name)
    assert value is not None, name
    return value


def flags_text(result) -> str:  # noqa: ANN001
    return " | ".join(flag.text for flag in result.flags)


def test_demo_office_floor_fails_the_office_limits_by_a_modest_margin() -> None:
    result = evaluate()
    # From memory: SCI P354 alpha_3 = 0.007 (3 fp + 5.2): the third harmonic at fp = 5.4 / 3 = 1.8 Hz drives it;
    # Source: Chopra ch. 3, resonant amplitude F / (2 zeta M)
    force = 0.007 * (5.4 + 5.2) * 700.0
    assert si(result, "pacing_rate") == pytest.approx(1.8)
    assert si(result, "peak_acceleration") == pytest.approx(force / (2 * 0.03 * 27e3), rel=1e-12)
    # From memory: ISO 10137 Annex C, vertical base curve 5e-3 m/s^2 r.m.s. from 4 to 8 Hz, office factor 4
    factor = force / (2 * 0.03 * 27e3) / math.sqrt(2) / 5e-3
    assert si(result, "response_factor") == pytest.approx(factor, rel=1e-12)
    assert si(result, "response_limit") == 4.0
    assert result.values["response_met"].magnitude == "NOT MET"
    assert 1.0 < factor / 4.0 < 1.2
    # From memory: AISC Design Guide 11, a_p/g = P0 exp(-0.35 fn) / (beta W), office limit 0.5 % g
    dg11 = 290.0 * math.exp(-0.35 * 5.4) / (0.03 * 280e3)
    assert si(result, "dg11_acceleration") / G0 == pytest.approx(dg11, rel=1e-12)
    assert si(result, "dg11_limit") / G0 == pytest.approx(0.005)
    assert result.values["dg11_met"].magnitude == "NOT MET"
    assert 1.0 < dg11 / 0.005 < 1.2
    assert [flag.level for flag in result.flags].count("warning") == 2
    assert "decay" in result.caution and "licensed" in result.caution and "project's" in result.caution


@pytest.mark.parametrize(("frequency", "damping", "weight", "occupancy", "ratio_of_g", "met"), [
    ("5 Hz", "3 %", "500 kN", "office", 0.0033596, "met"),      # 290 e^-1.75 / (0.03 x 500 kN)
    ("3 Hz", "2 %", "200 kN", "office", 0.0253705, "NOT MET"),  # 290 e^-1.05 / (0.02 x 200 kN)
    ("3 Hz", "2 %", "200 kN", "mall", 0.0253705, "NOT MET"),
    ("4 Hz", "3 %", "150 kN", "mall", 0.0158918, "NOT MET"),    # 290 e^-1.4 / (0.03 x 150 kN), e^-1.4 = 0.246597
    ("4 Hz", "3 %", "160 kN", "dining", 0.0148985, "met"),
])
def test_dg11_criterion_at_hand_worked_points(frequency: str, damping: str, weight: str, occupancy: str,
                                              ratio_of_g: float, met: str) -> None:
    result = evaluate(frequency=frequency, damping=damping, effective_weight=weight, occupancy=occupancy)
    # From memory: AISC Design Guide 11, a_p/g = P0 exp(-0.35 fn) / (beta W), P0 = 0.29 kN, worked by hand;
    # limits 0.5 % g offices, 1.5 % g malls and dining
    assert si(result, "dg11_acceleration") / G0 == pytest.approx(ratio_of_g, rel=2e-5)
    assert result.values["dg11_met"].magnitude == met


def test_dg11_limit_is_met_up_to_its_boundary() -> None:
    # From memory: AISC Design Guide 11 office limit 0.5 % g; the weight at which a_p equals it, worked by hand:
    # W = 290 N e^-1.75 / (0.03 x 0.005) = 335.96 kN
    boundary = 290.0 * math.exp(-1.75) / (0.03 * 0.005)
    def verdict(weight: float) -> object:
        return evaluate(frequency="5 Hz", effective_weight=f"{weight:.6f} N").values["dg11_met"].magnitude

    assert verdict(boundary * 1.0001) == "met"
    assert verdict(boundary * 0.9999) == "NOT MET"


def test_resonant_acceleration_is_inversely_proportional_to_damping_through_the_check() -> None:
    # Source: Chopra ch. 3, the resonant amplitude F / (2 zeta M)
    base = si(evaluate(damping="2 %"), "peak_acceleration")
    assert si(evaluate(damping="4 %"), "peak_acceleration") == pytest.approx(base / 2, rel=1e-12)
    assert si(evaluate(damping="1 %"), "peak_acceleration") == pytest.approx(base * 2, rel=1e-12)


def test_a_short_walking_path_limits_the_build_up() -> None:
    result = evaluate(frequency="2 Hz", path_length="6 m", effective_weight="")
    # From memory: SCI P354 build-up 1 - exp(-2 pi zeta N), N = fn L / (stride fp), stride 0.75 m
    # (Bachmann & Ammann); the first harmonic at fp = fn = 2 Hz
    cycles = 2.0 * 6.0 / (0.75 * 2.0)
    assert si(result, "buildup") == pytest.approx(1 - math.exp(-2 * math.pi * 0.03 * cycles), rel=1e-12)
    steady = si(evaluate(frequency="2 Hz", effective_weight=""), "peak_acceleration")
    assert si(result, "peak_acceleration") == pytest.approx(steady * si(result, "buildup"), rel=1e-12)


def test_high_frequency_floor_answers_each_footfall() -> None:
    result = evaluate(frequency="12 Hz", effective_weight="")
    # From memory: SCI P354 effective impulse 54 (Q / 700 N) fp^1.43 / fn^1.3 N s at the fastest pace 2.4 Hz;
    # the peak velocity of the mode I / M
    impulse = 54.0 * 2.4**1.43 / 12.0**1.3
    assert si(result, "peak_velocity") == pytest.approx(impulse / 27e3, rel=1e-12)
    assert si(result, "peak_acceleration") == pytest.approx(2 * math.pi * 12.0 * impulse / 27e3, rel=1e-12)
    assert result.values["method"].magnitude == "footfall impulse"
    # From memory: ISO 10137 Annex C, vertical base curve above 8 Hz is a constant r.m.s. velocity 6.25e-4/(2 pi)
    assert si(result, "response_factor") == pytest.approx(si(result, "rms_velocity") / (6.25e-4 / (2 * math.pi)),
                                                          rel=1e-12)


@pytest.mark.parametrize(("texts", "refused", "applies"), [
    ({"frequency": "5 Hz"}, "transient footfall-impulse method not used", "use the resonant walking method"),
    ({"frequency": "12 Hz"}, "resonant walking method not used", "use the transient footfall-impulse method"),
    ({"frequency": "9.5 Hz", "guide": "AISC DG11"}, "resonant walking method not used",
     "use the transient footfall-impulse method"),
    ({"frequency": "9.5 Hz"}, "AISC Design Guide 11 criterion not used", "use the transient footfall-impulse method"),
])
def test_a_frequency_outside_a_methods_range_names_the_method_that_applies(texts: dict[str, str], refused: str,
                                                                         applies: str) -> None:
    # Source: AISC Design Guide 11 (2nd ed.) 4.1 criterion up to 9 Hz; SCI P354 cut-off 10 Hz (confirmed in
    # quotations)
    notes = [flag.text for flag in evaluate(**texts).flags if refused in flag.text]
    assert notes and applies in notes[0]


@pytest.mark.parametrize("texts", [{}, {"frequency": "9.5 Hz"}, {"frequency": "8.5 Hz", "guide": "AISC DG11"}])
def test_zero_damping_is_refused_where_the_resonance_is_unbounded(texts: dict[str, str]) -> None:
    with pytest.raises(InputError) as caught:
        evaluate(damping="0 %", **texts)
    # Source: Chopra ch. 3, the undamped resonant amplitude is unbounded; Allen & Murray 1993 typical damping
    message = str(caught.value)
    assert message.startswith("Damping ratio") and "unbounded" in message
    assert "3 % fitted out" in message and "5 % full-height partitions" in message


def test_zero_damping_is_accepted_where_the_response_stays_bounded() -> None:
    # From memory: SCI P354, a footfall impulse on an undamped high-frequency floor keeps a bounded r.m.s.
    result = evaluate(damping="0 %", frequency="12 Hz", effective_weight="")
    assert si(result, "response_factor") > 0
    # Source: AISC Design Guide 11 (2nd ed.) 4.1: above 9 Hz neither its criterion nor a resonance applies
    result = evaluate(damping="0 %", frequency="9.5 Hz", guide="AISC DG11")
    assert si(result, "response_factor") > 0 and "dg11_acceleration" not in result.values


@pytest.mark.parametrize(("texts", "field", "words"), [
    ({"frequency": "0 Hz"}, "Vertical frequency", "greater than zero"),
    ({"frequency": "120 Hz"}, "Vertical frequency", "base curves"),
    ({"modal_mass": "0 t"}, "Modal mass", "greater than zero"),
    ({"modal_mass": ""}, "Modal mass", "required"),
    ({"effective_weight": "-3 kN"}, "Effective weight", "greater than zero"),
    ({"effective_weight": "30 t"}, "Effective weight", "not a unit of force"),
    ({"damping": "100 %"}, "Damping ratio", "below 1"),
    ({"damping": "-1 %"}, "Damping ratio", "at least 0"),
    ({"walker_weight": "0 kN"}, "Walker's weight", "greater than zero"),
    ({"pacing_low": "2.2 Hz", "pacing_high": "2.0 Hz"}, "Fastest pacing rate", "at least the slowest"),
    ({"pacing_high": "4 Hz"}, "Fastest pacing rate", "at most 3"),
    ({"pacing_low": "0.5 Hz"}, "Slowest pacing rate", "at least 1"),
    ({"path_length": "0 m"}, "Walking path length", "greater than zero"),
    ({"occupancy": "ballroom"}, "Occupancy", "not one of the choices"),
    ({"guide": "elsewhere"}, "Cut-off guide", "not one of the choices"),
])
def test_bad_inputs_name_the_field(texts: dict[str, str], field: str, words: str) -> None:
    # Common practice (no source): inputs outside their physical range are refused with the field named
    with pytest.raises(InputError) as caught:
        evaluate(**texts)
    assert str(caught.value).startswith(field)
    assert words in str(caught.value)


def test_what_would_meet_the_limits_meets_them() -> None:
    result = evaluate()
    damping, mass, frequency = si(result, "damping_needed"), si(result, "modal_mass_needed"), si(
        result, "frequency_needed")
    weight = si(result, "effective_weight_needed")
    # Common practice (no source): each change found, made alone, brings the floor to its limit
    again = evaluate(damping=f"{damping * 1.000001}")
    assert again.values["response_met"].magnitude == "met" and again.values["dg11_met"].magnitude == "met"
    assert si(evaluate(damping=f"{damping * 1.000001}"), "response_factor") == pytest.approx(4.0, rel=1e-5)
    assert si(evaluate(modal_mass=f"{mass} kg"), "response_factor") == pytest.approx(4.0, rel=1e-9)
    assert si(evaluate(effective_weight=f"{weight} N"), "dg11_acceleration") == pytest.approx(0.005 * G0, rel=1e-9)
    assert evaluate(frequency=f"{frequency * 1.001} Hz").values["response_met"].magnitude == "met"
    assert evaluate(frequency=f"{frequency * 0.999} Hz").values["response_met"].magnitude == "NOT MET"
    assert "tmd" in flags_text(result)


def test_no_plausible_change_is_said_so() -> None:
    result = evaluate(modal_mass="1 t", effective_weight="", occupancy="critical")
    # Common practice (no source): a damping ratio above 20 % is no floor's
    assert "damping_needed" not in result.values
    assert "no damping ratio up to 20%" in flags_text(result)


def test_a_floor_within_its_limits_needs_nothing() -> None:
    result = evaluate(modal_mass="60 t", effective_weight="", damping="5 %")
    assert result.values["response_met"].magnitude == "met"
    assert not {"damping_needed", "modal_mass_needed", "frequency_needed"} & set(result.values)


@pytest.mark.parametrize(("occupancy", "factor", "dg11"), [
    ("office", 4.0, 0.005), ("residence", 2.0, 0.005), ("mall", 4.0, 0.015), ("dining", 4.0, 0.015),
    ("workshop", 8.0, None), ("critical", 1.0, None),
])
def test_occupancy_limits(occupancy: str, factor: float, dg11: float | None) -> None:
    result = evaluate(occupancy=occupancy)
    # From memory: ISO 10137 Annex C / BS 6472 Table 5 multiplying factors (office 4, residential by day 2 to 4,
    # workshop 8, critical 1); mall and dining take the office factor (our choice); AISC Design Guide 11
    # tolerance limits 0.5 % g offices and residences, 1.5 % g malls and dining, none for workshops
    assert si(result, "response_limit") == factor
    if dg11 is None:
        assert "dg11_limit" not in result.values and "no walking limit" in flags_text(result)
    else:
        assert si(result, "dg11_limit") == pytest.approx(dg11 * G0)
    if occupancy == "residence":
        assert "1.4 at night" in flags_text(result)


def test_without_the_effective_weight_the_dg11_criterion_is_not_computed() -> None:
    result = evaluate(effective_weight="")
    assert "dg11_acceleration" not in result.values
    assert "give the effective weight" in flags_text(result)


def test_us_input_gives_the_same_si_results() -> None:
    si_result = evaluate(path_length="10 m", walker_weight="0.8 kN")
    # Source: NIST SP 811 Appendix B: 1 lb = 0.45359237 kg, 1 lbf = 4.4482216152605 N, 1 ft = 0.3048 m
    us_result = evaluate(modal_mass=f"{27e3 / LB:.9g} lb", effective_weight=f"{280e3 / LBF / 1e3:.9g} kip",
                         walker_weight=f"{800 / LBF:.9g} lbf", path_length=f"{10 / FT:.9g} ft")
    for name, value in si_result.values.items():
        if not value.is_word:
            assert us_result.values[name].si() == pytest.approx(value.si(), rel=1e-7), name


def test_f8_offers_the_mode_and_the_damping_needed_to_tmd_and_never_a_machines_frequency() -> None:
    from fieldmode.tui.workspace import Workspace

    space = Workspace(SPECS)
    result = SPEC.evaluate(space.texts["floor"])
    reached = {(check, name) for target in space.send_targets("floor", result) for check, name in target.fields}
    # Common practice (no source): the floor's mode is the structure's mode a damper is sized for
    assert {("tmd", "frequency"), ("tmd", "modal_mass"), ("tmd", "damping"), ("tmd", "target_damping")} <= reached
    assert not reached & {("forced", "frequency"), ("isolate", "frequency"), ("isolate", "damping")}
    damping_needed = next(t for t in space.send_targets("floor", result) if ("tmd", "target_damping") in t.fields)
    assert ("tmd", "mass_ratio") in damping_needed.clears
