"""Check `machine`: severity zones at their boundaries, the margin to the next one, balance grades worked by hand
(alone and through `forced` and `isolate`), the command line and bad input."""

from __future__ import annotations

import json
import math

import pytest

from fieldmode.calc.checks import BY_ID
from fieldmode.calc.framework.units import InputError
from fieldmode.tui.cli import main

SPEC = BY_ID["machine"]
MM_S = 1e-3

# Source: ISO 21940-11:2016 Table 1 (confirmed in two reproductions): U_per = 9549 G m / n (g mm, kg, r/min).
# G 6.3, 250 kg at 1450 rpm: U = 9549 x 6.3 x 250 / 1450 = 10 372 g mm; e_per = U / m = 41.49 um;
# Omega = 2 pi 1450 / 60 = 151.8 rad/s, force U Omega^2 = 0.010372 kg m x 23 057 /s^2 = 239.2 N
HAND_UNBALANCE = 9549 * 6.3 * 250 / 1450 * 1e-6  # kg m
HAND_ECCENTRICITY = 9549 * 6.3 / 1450 * 1e-6  # m
HAND_FORCE = HAND_UNBALANCE * (2 * math.pi * 1450 / 60) ** 2  # N
BALANCE = {"velocity": "", "grade": "G 6.3", "rotor_mass": "250 kg", "speed": "1450 rpm"}


def test_hand_figures_are_those_of_the_text() -> None:
    grams_mm, micrometres, newtons = HAND_UNBALANCE * 1e6, HAND_ECCENTRICITY * 1e6, HAND_FORCE
    assert grams_mm == pytest.approx(10372, abs=1)
    assert micrometres == pytest.approx(41.49, abs=0.01)
    assert newtons == pytest.approx(239.2, abs=0.1)


def test_balance_grade_by_hand() -> None:
    result = SPEC.evaluate(BALANCE)
    # 9549 is 30000 / pi rounded: the exact 1000 G m / Omega differs by 3e-5
    assert result.number("grade_unbalance") == pytest.approx(HAND_UNBALANCE, rel=1e-4)
    assert result.number("grade_eccentricity") == pytest.approx(HAND_ECCENTRICITY, rel=1e-4)
    assert result.number("grade_force") == pytest.approx(HAND_FORCE, rel=1e-4)
    assert "zone" not in result.values and "velocity_grid" not in result.series


def test_grade_curves_fall_as_one_over_speed() -> None:
    # Source: ISO 21940-11:2016 (confirmed in two reproductions): e_per = G / Omega; G 16 and G 2.5 are the grades
    # either side of G 6.3
    result = SPEC.evaluate(BALANCE)
    speed = result.series["speed_grid"]
    omega = 2 * math.pi * speed
    assert result.series["grade_eccentricity"] == pytest.approx(6.3e-3 / omega, rel=1e-12)
    assert result.series["coarser_eccentricity"] == pytest.approx(16e-3 / omega, rel=1e-12)
    assert result.series["finer_eccentricity"] == pytest.approx(2.5e-3 / omega, rel=1e-12)
    coarsest = SPEC.evaluate(BALANCE | {"grade": "G 4000"})
    assert "coarser_eccentricity" not in coarsest.series and "finer_eccentricity" in coarsest.series


@pytest.mark.parametrize("text", ["G 6.3", "g6.3", "6.3", " G 6.3 mm/s "])
def test_the_grade_is_written_with_or_without_g(text: str) -> None:
    result = SPEC.evaluate(BALANCE | {"grade": text})
    assert result.number("grade_unbalance") == pytest.approx(HAND_UNBALANCE, rel=1e-4)


@pytest.mark.parametrize(("key", "ab", "bc", "cd"), [
    # From memory: ISO 10816-1:1995 Annex B, classes I-IV (mm/s r.m.s.)
    ("class I", 0.71, 1.8, 4.5),
    ("class II", 1.12, 2.8, 7.1),
    ("class III", 1.8, 4.5, 11.2),
    ("class IV", 2.8, 7.1, 18.0),
    # From memory: ISO 10816-3:2009 Annex A, Table A.1 (mm/s r.m.s.)
    ("group 1 rigid", 2.3, 4.5, 7.1),
    ("group 1 flexible", 3.5, 7.1, 11.0),
    ("group 2 rigid", 1.4, 2.8, 4.5),
    ("group 2 flexible", 2.3, 4.5, 7.1),
])
def test_zone_boundaries_at_their_edges(key: str, ab: float, bc: float, cd: float) -> None:
    # Source: ISO 10816-3 zone definitions: a value on a boundary is in the upper zone (the boundary is where
    # the zone starts)
    for velocity, zone in ((0.99 * ab, "A"), (ab, "B"), (0.99 * bc, "B"), (bc, "C"), (0.99 * cd, "C"), (cd, "D")):
        result = SPEC.evaluate({"velocity": f"{velocity!r} mm/s", "machine_class": key})
        assert result.values["zone"].magnitude == zone, (key, velocity)
        assert result.number("boundary_ab") == pytest.approx(ab * MM_S)
        assert result.number("boundary_bc") == pytest.approx(bc * MM_S)
        assert result.number("boundary_cd") == pytest.approx(cd * MM_S)


def test_margin_to_the_next_boundary() -> None:
    # From memory: ISO 10816-3:2009 Table A.1, group 2 flexible: B/C at 4.5 mm/s; 3.1 mm/s is 1.4 mm/s below it
    result = SPEC.evaluate({"velocity": "3.1 mm/s", "machine_class": "group 2 flexible"})
    assert result.values["zone"].magnitude == "B"
    assert result.values["margin"].label == "Margin to zone C"
    assert result.number("margin") == pytest.approx(1.4 * MM_S)
    assert result.number("margin_ratio") == pytest.approx(3.1 / 4.5)
    over = SPEC.evaluate({"velocity": "9 mm/s", "machine_class": "group 2 flexible"})
    assert over.values["margin"].label == "Over C/D boundary by"
    assert over.number("margin") == pytest.approx(1.9 * MM_S)
    assert any(flag.level == "warning" and "zone D" in flag.text for flag in over.flags)


def test_zone_series_steps_at_the_boundaries() -> None:
    result = SPEC.evaluate({"velocity": "3.1 mm/s", "machine_class": "group 2 flexible"})
    velocity, zone = result.series["velocity_grid"], result.series["zone_number"]
    # From memory: ISO 10816-3:2009 Table A.1, group 2 flexible 2.3 / 4.5 / 7.1 mm/s
    for edge, below, above in ((2.3, 1, 2), (4.5, 2, 3), (7.1, 3, 4)):
        assert zone[velocity < edge * MM_S].max() <= below and zone[velocity >= edge * MM_S].min() == above
    assert set(zone.tolist()) == {1.0, 2.0, 3.0, 4.0}


def test_in_inches_per_second() -> None:
    # Source: NIST SP 811: 1 in = 25.4 mm; 0.177 in/s = 4.496 mm/s is just below B/C of group 2 flexible
    result = SPEC.evaluate({"velocity": "0.177 in/s", "machine_class": "group 2 flexible"})
    assert result.values["zone"].magnitude == "B"


def test_the_zone_boundaries_are_said_to_be_from_memory() -> None:
    result = SPEC.evaluate(SPEC.demo_texts())
    assert any(flag.level == "caution" and "from memory" in flag.text for flag in result.flags)
    assert any("r.m.s." in flag.text and "peak" in flag.text for flag in result.flags)


def test_the_permissible_unbalance_is_sent_as_the_machine_unbalance() -> None:
    # the unbalance a grade gives is the unbalance m e forced and isolate take: same quantity, same machine
    sent = SPEC.evaluate(SPEC.demo_texts()).values["grade_unbalance"].meaning
    assert sent == BY_ID["forced"].field("unbalance").meaning == BY_ID["isolate"].field("unbalance").meaning
    # a rotor mass is not the machine's mass on its mounts, nor the structure's mass
    rotor = SPEC.field("rotor_mass").meaning
    assert rotor is not None and rotor not in (BY_ID["isolate"].field("mass").meaning,
                                                BY_ID["forced"].field("mass").meaning)
    assert rotor == BY_ID["forced"].field("rotor_mass").meaning == BY_ID["isolate"].field("rotor_mass").meaning


FAN = {"mass": "2.4 t", "stiffness": "42 kN/mm", "damping": "2 %", "frequency": "1450 rpm"}


def test_forced_takes_a_grade_and_a_rotor_mass_as_the_unbalance() -> None:
    spec = BY_ID["forced"]
    by_grade = spec.evaluate(FAN | {"grade": "G 6.3", "rotor_mass": "250 kg"})
    assert by_grade.number("force_amplitude") == pytest.approx(HAND_FORCE, rel=1e-4)
    assert by_grade.number("grade_unbalance") == pytest.approx(HAND_UNBALANCE, rel=1e-4)
    assert any("G 6.3" in flag.text and "250 kg" in flag.text for flag in by_grade.flags)
    # the same unbalance typed as m e gives the same response
    by_me = spec.evaluate(FAN | {"unbalance": f"{by_grade.number('grade_unbalance')!r} kg m"})
    for name in ("amplitude", "transmitted_force", "peak_amplitude", "unbalance_amplification"):
        assert by_grade.number(name) == pytest.approx(by_me.number(name), rel=1e-12), name


def test_isolate_gives_the_force_into_the_support_from_a_grade() -> None:
    spec = BY_ID["isolate"]
    texts = {"frequency": "1450 rpm", "mass": "2.4 t", "mounts": "4", "damping": "5 %", "stiffness": "3 kN/mm"}
    result = spec.evaluate(texts | {"grade": "G 6.3", "rotor_mass": "250 kg"})
    assert result.number("force_amplitude") == pytest.approx(HAND_FORCE, rel=1e-4)
    # Source: Chopra sec. 3.5, the force through the mounts is T times the force on the machine
    transmitted = result.number("transmissibility")
    assert transmitted is not None
    assert result.number("transmitted_force") == pytest.approx(transmitted * HAND_FORCE, rel=1e-4)
    assert result.number("transmitted_per_mount") == pytest.approx(transmitted * HAND_FORCE / 4, rel=1e-4)
    without = spec.evaluate(texts)
    assert "force_amplitude" not in without.values


@pytest.mark.parametrize(("check", "texts", "field", "words"), [
    ("machine", {"velocity": ""}, "Measured velocity, r.m.s.", "give the measured r.m.s. velocity"),
    ("machine", BALANCE | {"grade": "G 7"}, "Balance grade", "not an ISO 21940-11 grade"),
    ("machine", BALANCE | {"grade": "fans"}, "Balance grade", "write it as G 6.3"),
    ("machine", BALANCE | {"rotor_mass": ""}, "Rotor mass", "give the rotor mass"),
    ("machine", BALANCE | {"speed": ""}, "Operating frequency", "give the operating speed"),
    ("machine", {"velocity": "3 mm/s"}, "Machine class or group", "give the machine class"),
    ("forced", FAN | {"grade": "G 6.3", "rotor_mass": "3 t"}, "Rotor mass", "heavier than the mass"),
    ("forced", FAN | {"grade": "G 6.3", "unbalance": "1 kg m", "rotor_mass": "250 kg"}, "Balance grade",
     "give only one of"),
    ("isolate", {"frequency": "1450 rpm", "mass": "2.4 t", "mounts": "4", "stiffness": "3 kN/mm",
                 "grade": "G 2.5"}, "Rotor mass", "give the rotor mass"),
])
def test_bad_input_names_the_field(check: str, texts: dict[str, str], field: str, words: str) -> None:
    with pytest.raises(InputError) as caught:
        BY_ID[check].evaluate(texts)
    assert caught.value.field == field and words in str(caught.value)


def test_command_line_worked_example(capsys: pytest.CaptureFixture[str]) -> None:
    assert main(["machine", "--grade", "G 6.3", "--rotor-mass", "250 kg", "--speed", "1450 rpm", "--json"]) == 0
    data = json.loads(capsys.readouterr().out)
    assert data["results"]["grade_unbalance"]["value"] == pytest.approx(HAND_UNBALANCE, rel=1e-4)
    assert data["results"]["grade_force"]["value"] == pytest.approx(HAND_FORCE, rel=1e-4)
    assert main(["forced", "--mass", "2.4 t", "--stiffness", "42 kN/mm", "--damping", "2 %", "--frequency",
                 "1450 rpm", "--grade", "G 6.3", "--rotor-mass", "250 kg"]) == 0
    lines = [" ".join(line.split()) for line in capsys.readouterr().out.splitlines()]
    assert "Force amplitude 239.2 N" in lines and "Permissible unbalance 10.37 kg mm" in lines


@pytest.mark.parametrize("argv", [
    ["machine", "--velocity", "3 mm/s"],
    ["machine", "--grade", "G 5", "--rotor-mass", "250 kg", "--speed", "1450 rpm"],
    ["forced", "--mass", "2.4 t", "--stiffness", "42 kN/mm", "--damping", "2 %", "--frequency", "1450 rpm",
     "--grade", "G 6.3"],
])
def test_bad_input_on_the_command_line_exits_2_with_one_line(capsys: pytest.CaptureFixture[str],
                                                             argv: list[str]) -> None:
    assert main(argv) == 2
    captured = capsys.readouterr()
    assert captured.out == "" and len(captured.err.strip().splitlines()) == 1
