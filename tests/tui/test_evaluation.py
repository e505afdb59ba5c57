"""Evaluating a check from its texts: readings, errors on their field, faults to report."""

from __future__ import annotations

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from fieldmode.calc.checks import SPECS, sdof, storeys
from fieldmode.tui.evaluation import evaluate, evaluate_guarded, field_of_error

ALL_FIELDS = [(spec, f) for spec in SPECS for f in spec.fields]


@pytest.mark.parametrize(("spec", "spec_field"), ALL_FIELDS, ids=[f"{s.id}.{f.name}" for s, f in ALL_FIELDS])
def test_every_prefix_of_a_demo_value_is_answered_not_raised(spec, spec_field):
    """Typing a value key by key passes through texts such as '42 kN/': each must give an outcome."""
    texts = spec.demo_texts()
    for end in range(len(spec_field.default) + 1):
        texts[spec_field.name] = spec_field.default[:end]
        outcome = evaluate(spec, texts, "si")
        assert outcome.result is not None or outcome.errors or outcome.problem


@settings(max_examples=60, deadline=None)
@given(st.sampled_from(ALL_FIELDS), st.text(max_size=30))
def test_any_text_in_any_field_gives_an_outcome(pair, text):
    spec, spec_field = pair
    texts = spec.demo_texts() | {spec_field.name: text}
    outcome = evaluate(spec, texts, "us")
    assert outcome.texts == texts
    assert outcome.result is not None or outcome.errors or outcome.problem


def test_interpretations_beside_the_fields():
    texts = sdof.SPEC.demo_texts() | {"mass": "117.7 kN", "stiffness": "45 kip/in", "damping": "3"}
    outcome = evaluate(sdof.SPEC, texts, "si")
    # Source: CGPM 1901, standard gravity g0 = 9.80665 m/s^2 -> 117.7 kN / g0 = 12.00 t
    assert outcome.notes["mass"] == "= 117.7 kN, read as weight: m = W/g0 = 12.00 t"
    # Source: NIST SP 811 B.8: 1 kip = 4448.2216152605 N, 1 in = 0.0254 m -> 45 kip/in = 7.881 kN/mm
    assert outcome.notes["stiffness"] == "= 7.881 kN/mm"
    assert outcome.notes["damping"] == "= 3.000 %; read as 3 %"  # a damping field reads a bare 3 as 3 %


@pytest.mark.parametrize(("spec", "name"), [(spec, f.name) for spec in SPECS for f in spec.fields
                                             if f.meaning is not None and f.meaning.quantity == "damping ratio"],
                         ids=lambda item: getattr(item, "id", item))
def test_the_reading_beside_a_damping_field_says_a_bare_number_is_a_percentage(spec, name):
    outcome = evaluate(spec, spec.demo_texts() | {name: "5"}, "si")
    assert outcome.notes[name] == "= 5.000 %; read as 5 %"
    assert outcome.result is not None, (outcome.errors, outcome.problem)


def test_errors_from_the_compute_step_land_on_their_field():
    outcome = evaluate(sdof.SPEC, sdof.SPEC.demo_texts() | {"mass": "-2 t"}, "si")
    assert "greater than zero" in outcome.errors["mass"] and outcome.result is None
    assert not outcome.errors["mass"].startswith("Mass:")
    from fieldmode.calc.framework.units import InputError

    assert field_of_error(sdof.SPEC, InputError("Mass", "x", "bad")).name == "mass"
    assert field_of_error(sdof.SPEC, InputError("Nothing", "x", "bad")) is None


def test_a_fault_in_a_check_becomes_a_problem_to_report():
    import dataclasses

    def broken(inputs):
        raise RuntimeError("boom")

    faulty = dataclasses.replace(sdof.SPEC, compute=broken)
    outcome = evaluate_guarded(faulty, faulty.demo_texts(), "si")
    assert outcome.result is None and "internal fault in sdof (RuntimeError: boom)" in outcome.problem


def test_a_demo_name_reads_as_the_shipped_record_and_a_wrong_one_is_said():
    from fieldmode.calc.checks import BY_ID
    from fieldmode.calc.demo import HEEL_DROP, demo_file

    decay = BY_ID["decay"]
    outcome = evaluate(decay, decay.demo_texts(), "si")
    assert outcome.notes["file"] == "shipped demo record"
    assert outcome.result is not None and outcome.result.files[0].size == demo_file(HEEL_DROP).stat().st_size
    wrong = evaluate(decay, {**decay.demo_texts(), "file": "demo:heel.csv"}, "si")
    assert wrong.notes["file"] == "no such demo record"
    assert "no demo record 'heel.csv'" in wrong.errors["file"] and "demo:heel_drop_demo.csv" in wrong.errors["file"]


BAD_LINE_62 = "t,a\n" + "".join(f"{i / 100},{i % 7}\n" for i in range(60)) + "0.6,x\n"


@pytest.mark.parametrize(("content", "said"), [(None, "no such file"), (BAD_LINE_62, "line 62"),
                                               ("t,a\n0,1\n", "samples")])
def test_a_record_that_cannot_be_read_is_said_beside_its_path_field(tmp_path, content, said):
    from fieldmode.calc.checks import decay, spectrum

    path = tmp_path / "rec.csv"
    if content is not None:
        path.write_text(content)
    for spec in (decay.SPEC, spectrum.SPEC):
        outcome = evaluate(spec, {**spec.demo_texts(), "file": str(path)}, "si")
        assert outcome.result is None and outcome.problem == ""
        assert said in outcome.errors["file"]
        assert not outcome.errors["file"].startswith("record file")  # the label is beside it already


def test_a_path_field_gives_its_own_check_as_the_example():
    from fieldmode.calc.checks import spectrum

    outcome = evaluate(spectrum.SPEC, {**spectrum.SPEC.demo_texts(), "file": ""}, "si")
    assert "decay.csv" not in outcome.errors["file"]
    assert "demo:ground_motion_demo.csv" in outcome.errors["file"]


@pytest.mark.parametrize(("field", "text"), [("time_column", "clock"), ("signal_column", "9"),
                                             ("sample_rate", "333 Hz")])
def test_a_column_or_rate_the_record_refuses_is_said_beside_that_field(field, text):
    from fieldmode.calc.checks import decay

    outcome = evaluate(decay.SPEC, {**decay.SPEC.demo_texts(), field: text}, "si")
    assert list(outcome.errors) == [field], outcome.errors


def test_a_weight_in_a_mass_field_is_echoed_in_the_unit_typed_with_the_mass_in_the_unit_system():
    # Source: NIST SP 811 B.8: 1 kip = 1000 lbf, 1 lbf = 1 lb x g0, so 26 kip / g0 = 26000 lb (11.79 t)
    texts = sdof.SPEC.demo_texts() | {"mass": "26 kip"}
    assert evaluate(sdof.SPEC, texts, "us").notes["mass"] == "= 26.00 kip, read as weight: m = W/g0 = 26000 lb"
    assert evaluate(sdof.SPEC, texts, "si").notes["mass"] == "= 26.00 kip, read as weight: m = W/g0 = 11.79 t"
    # a list of storey weights: each in the unit typed, then the masses
    # Source: CGPM 1901, g0 = 9.80665 m/s^2: 3040 kN / g0 = 310.0 t, 2940 kN / g0 = 299.8 t
    texts = storeys.SPEC.demo_texts() | {"masses": "3040, 2940 kN"}
    texts["stiffnesses"], texts["heights"] = "180, 160 kN/mm", "4.5, 3.5 m"
    assert evaluate(storeys.SPEC, texts, "si").notes["masses"] == (
        "= 3040 kN, 2940 kN, read as weights: m = W/g0 = 310.0 t, 299.8 t")
    # a mass stays a mass. Source: NIST SP 811 B.8, 1 lb = 0.45359237 kg exactly: 12 t = 26455 lb
    assert evaluate(sdof.SPEC, sdof.SPEC.demo_texts() | {"mass": "12 t"}, "us").notes["mass"] == "= 26455 lb"
