"""Check `footbridge`: one pedestrian and streams, EN 1990 A2 limits, comfort classes, lock-in, the damping and
damper a comfort class needs, bad input, units and where its results can be sent."""

from __future__ import annotations

import math

import pytest

from fieldmode.calc.checks import BY_ID, SPECS
from fieldmode.calc.framework.units import InputError

SPEC = BY_ID["footbridge"]
LB = 0.45359237
FT = 0.3048
ZETA, MASS, AREA = 0.006, 18e3, 2.5 * 40.0


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


def sparse_stream(force: float, psi: float, damping: float, mass: float, count: float) -> float:
    """From memory: HiVoSS / Setra, n' = 10.8 sqrt(zeta n) in step with the mode, acting with the mean 2 / pi of a
    half-sine mode: a = P psi n' (2 / pi) / (2 zeta M)."""
    return force * psi * 10.8 * math.sqrt(damping * count) * (2 / math.pi) / (2 * damping * mass)


def test_demo_footbridge_by_hand() -> None:
    result = evaluate()
    # From memory: HiVoSS TC2 0.2 pedestrians/m^2; P = 280 N vertical, 35 N lateral; psi = 1 on 1.7-2.1 Hz
    # vertical, lateral psi falls from 1 at 1.0 Hz to 0 at 1.2 Hz (0.75 at 1.05 Hz)
    assert si(result, "pedestrians") == pytest.approx(20.0)
    assert si(result, "vertical_stream") == pytest.approx(sparse_stream(280.0, 1.0, ZETA, MASS, 20.0), rel=1e-12)
    assert si(result, "lateral_reduction") == pytest.approx(0.75)
    assert si(result, "lateral_stream") == pytest.approx(sparse_stream(35.0, 0.75, ZETA, MASS, 20.0), rel=1e-12)
    # From memory: Dallard et al. 2001, N = 8 pi zeta f M / k, k = 300 N s/m
    assert si(result, "critical_pedestrians") == pytest.approx(8 * math.pi * ZETA * 1.05 * MASS / 300.0, rel=1e-12)
    assert result.values["lock_in"].magnitude == "EXCEEDED"
    # From memory: HiVoSS comfort classes, vertical above 2.5 m/s^2 CL4, lateral 0.1-0.3 m/s^2 CL2
    assert result.values["vertical_comfort"].magnitude == "CL4 unacceptable"
    assert result.values["lateral_comfort"].magnitude == "CL2 medium"
    assert "decay" in result.caution and "licensed" in result.caution


def test_one_pedestrian_at_resonance_crossing_the_deck() -> None:
    from fieldmode.calc.physics.floor_walking import crossing_cycles, crossing_factor

    result = evaluate()
    # Source: Chopra ch. 3, resonant amplitude P / (2 zeta M); From memory: 280 N (HiVoSS); the build-up of a
    # walker crossing the 40 m deck at 0.75 m per step (checked against solve_ivp in the physics tests)
    share = crossing_factor(ZETA, crossing_cycles(2.1, 40.0, 2.1))
    assert si(result, "vertical_single") == pytest.approx(share * 280.0 / (2 * ZETA * MASS), rel=1e-12)


@pytest.mark.parametrize(("direction", "limit", "use"), [("vertical", 0.7, "normal"), ("lateral", 0.2, "normal"),
                                                         ("lateral", 0.4, "exceptional crowd")])
def test_en1990_limits_at_their_boundaries(direction: str, limit: float, use: str) -> None:
    force, psi = (280.0, 1.0) if direction == "vertical" else (35.0, 0.75)
    boundary = sparse_stream(force, psi, ZETA, 1.0, 20.0) / limit  # the modal mass at which a equals the limit
    # Source: EN 1990 Annex A2, A2.4.3.2 recommended 0.7 m/s^2 vertical, 0.2 m/s^2 horizontal, 0.4 m/s^2 for
    # exceptional crowds (as quoted)
    above = evaluate(modal_mass=f"{boundary * 1.0001:.6f} kg", use=use)
    below = evaluate(modal_mass=f"{boundary * 0.9999:.6f} kg", use=use)
    assert si(above, f"{direction}_limit") == limit
    assert above.values[f"{direction}_met"].magnitude == "met"
    assert below.values[f"{direction}_met"].magnitude == "NOT MET"
    assert f"exceeds the EN 1990 recommended {limit:g} m/s^2" in flags_text(below)


def test_dense_stream_is_inversely_proportional_to_damping_sparse_to_its_root() -> None:
    # From memory: HiVoSS n' = 1.85 sqrt(n) from 1 pedestrian/m^2 (TC4), 10.8 sqrt(zeta n) below;
    # Source: Chopra ch. 3, resonant amplitude inversely proportional to damping
    dense = si(evaluate(traffic_class="TC4"), "vertical_stream")
    assert si(evaluate(traffic_class="TC4", damping="1.2 %"), "vertical_stream") == pytest.approx(dense / 2, rel=1e-12)
    sparse = si(evaluate(), "vertical_stream")
    assert si(evaluate(damping="2.4 %"), "vertical_stream") == pytest.approx(sparse / 2, rel=1e-12)


def test_traffic_class_or_density_and_mass_or_mass_per_length() -> None:
    base = evaluate(traffic_class="TC3")
    # From memory: HiVoSS TC3 is 0.5 pedestrians/m^2
    assert si(evaluate(traffic_class="", density="0.5"), "vertical_stream") == si(base, "vertical_stream")
    # Source: a simply supported span's modal mass is m L / 2 (Clough & Penzien, modal mass of sin(pi x / L))
    by_length = evaluate(traffic_class="TC3", modal_mass="", mass_per_length="0.9 t/m")
    assert si(by_length, "modal_mass") == pytest.approx(18e3)
    assert si(by_length, "vertical_stream") == pytest.approx(si(base, "vertical_stream"), rel=1e-12)
    # From memory: HiVoSS TC1 is a group of 15 pedestrians, whatever the deck
    assert si(evaluate(traffic_class="TC1"), "pedestrians") == pytest.approx(15.0)


def test_damping_and_damper_for_the_comfort_class_sought() -> None:
    result = evaluate()
    # From memory: HiVoSS CL2 vertical up to 1.0 m/s^2; a sparse stream falls as zeta^-1/2 (n' grows as sqrt zeta)
    needed = ZETA * (sparse_stream(280.0, 1.0, ZETA, MASS, 20.0) / 1.0) ** 2
    assert si(result, "damping_needed") == pytest.approx(needed, rel=1e-9)
    again = evaluate(damping=f"{needed * 1.000001}")
    assert si(again, "vertical_stream") == pytest.approx(1.0, rel=1e-5)
    assert again.values["vertical_comfort"].magnitude == "CL2 medium"
    # Source: Den Hartog, peak sqrt(1 + 2/mu) of an undamped mode equal to a single mass's 1/(2 zeta sqrt(1-zeta^2));
    # the mode's own 0.6 % damping lowers the mass ratio needed
    closed = 2 / ((1 / (2 * needed * math.sqrt(1 - needed**2))) ** 2 - 1)
    assert 0.5 * closed < si(result, "damper_mass_ratio") < closed
    # From memory: Dallard et al. 2001: the damping at which the 20 pedestrians are the critical number
    assert si(result, "lateral_damping_needed") == pytest.approx(300.0 * 20 / (8 * math.pi * 1.05 * MASS), rel=1e-12)
    assert "smallest damper considered" in flags_text(result) and "tmd" in flags_text(result)


def test_a_damping_out_of_reach_is_said_so() -> None:
    result = evaluate(traffic_class="TC5", comfort="maximum")
    # Common practice (no source): a damping ratio above 20 % is no footbridge's
    assert "damping_needed" not in result.values
    assert "no vertical damping ratio up to 20%" in flags_text(result)


def test_comfort_classes_of_the_setra_guide() -> None:
    result = evaluate(guide="Setra")
    # From memory: Setra 2006 lateral classes up to 0.15 maximum, 0.3 mean, 0.8 minimum; psi = 1 on 0.5-1.1 Hz
    assert si(result, "lateral_stream") == pytest.approx(sparse_stream(35.0, 1.0, ZETA, MASS, 20.0), rel=1e-12)
    assert result.values["lateral_comfort"].magnitude == "minimum"


def test_frequencies_outside_the_ranges_are_said_so() -> None:
    result = evaluate(frequency="6 Hz", lateral_frequency="3 Hz")
    # Source: EN 1990 A2.4.3.2 comfort verified below 5 Hz vertical, 2.5 Hz lateral (confirmed in quotations)
    assert "asks a comfort check only for a vertical frequency below 5 Hz" in flags_text(result)
    assert "asks a comfort check only for a lateral frequency below 2.5 Hz" in flags_text(result)
    assert si(result, "vertical_stream") == 0.0 and "damping_needed" not in result.values


def test_without_a_lateral_frequency_lateral_checks_are_skipped() -> None:
    result = evaluate(lateral_frequency="")
    assert "lateral_stream" not in result.values and "critical_pedestrians" not in result.values
    assert "no lateral frequency" in flags_text(result)


@pytest.mark.parametrize(("texts", "field", "words"), [
    ({"damping": "0 %"}, "Damping ratio", "unbounded"),
    ({"damping": "100 %"}, "Damping ratio", "below 1"),
    ({"frequency": "0 Hz"}, "Vertical frequency", "greater than zero"),
    ({"lateral_frequency": "-1 Hz"}, "Lateral frequency", "greater than zero"),
    ({"mass_per_length": "1 t/m"}, "Mass per length", "give only one"),
    ({"modal_mass": ""}, "Modal mass", "give modal mass or mass per length"),
    ({"density": "0.5"}, "Crowd density", "give only one"),
    ({"traffic_class": "", "density": "6"}, "Crowd density", "at most 5"),
    ({"traffic_class": "", "density": "0"}, "Crowd density", "greater than zero"),
    ({"traffic_class": "TC1", "deck_width": "1 m", "deck_length": "2 m"}, "Traffic class", "denser than 5"),
    ({"traffic_class": "TC9"}, "Traffic class", "not one of the choices"),
    ({"deck_width": "0 m"}, "Deck width", "greater than zero"),
    ({"deck_length": ""}, "Deck length", "required"),
    ({"guide": "elsewhere"}, "Guide", "not one of the choices"),
    ({"comfort": "luxury"}, "Comfort class sought", "not one of the choices"),
])
def test_bad_inputs_name_the_field(texts: dict[str, str], field: str, words: str) -> None:
    # Common practice (no source): inputs outside their physical range are refused with the field named
    with pytest.raises(InputError) as caught:
        evaluate(**texts)
    assert str(caught.value).startswith(field)
    assert words in str(caught.value)


def test_zero_damping_message_gives_the_usual_footbridge_values() -> None:
    with pytest.raises(InputError) as caught:
        evaluate(damping="0")
    # Source: ISO 10137 / BS 5400-2 footbridge damping 0.5 % steel, 0.6 % composite, 0.8 % concrete
    assert "0.5 % steel" in str(caught.value) and "0.8 % concrete" in str(caught.value)


def test_us_input_gives_the_same_si_results() -> None:
    si_result = evaluate(traffic_class="", density="0.3")
    # Source: NIST SP 811 Appendix B: 1 lb = 0.45359237 kg, 1 ft = 0.3048 m
    us_result = evaluate(traffic_class="", density=f"{0.3 * FT**2:.9g} 1/ft^2", modal_mass=f"{MASS / LB:.9g} lb",
                         deck_width=f"{2.5 / FT:.9g} ft", deck_length=f"{40 / FT:.9g} ft")
    for name, value in si_result.values.items():
        if not value.is_word:
            assert us_result.values[name].si() == pytest.approx(value.si(), rel=1e-7), name


def test_f8_offers_the_damping_needed_to_tmd() -> None:
    from fieldmode.tui.workspace import Workspace

    space = Workspace(SPECS)
    result = SPEC.evaluate(space.texts["footbridge"])
    reached = {(check, name) for target in space.send_targets("footbridge", result) for check, name in target.fields}
    # Common practice (no source): the vertical mode's damping needed is the equivalent damping a damper must give
    assert ("tmd", "target_damping") in reached
    assert not reached & {("forced", "frequency"), ("isolate", "frequency"), ("isolate", "damping")}
