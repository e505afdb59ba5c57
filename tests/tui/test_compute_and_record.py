"""What the app shows for typed text, and the calc record built from it."""

from __future__ import annotations

import json
import time

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from fieldmode.calc.checks import SPECS, sdof
from fieldmode.tui.calc_record import Entry, as_json, default_name, markdown, record_paths, write_record
from fieldmode.tui.evaluation import evaluate, evaluate_guarded, field_of_error
from fieldmode.tui.widgets.path_suggester import suggest_path

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
    assert outcome.notes["mass"].startswith("read as weight: m = W/g0 = 12.0")
    # Source: NIST SP 811 B.8: 1 kip = 4448.2216152605 N, 1 in = 0.0254 m -> 45 kip/in = 7.881 kN/mm
    assert outcome.notes["stiffness"] == "= 7.881 kN/mm"
    assert "did you mean 3 %?" in outcome.notes["damping"]


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


def test_record_paths_and_names():
    assert [p.name for p in record_paths(__import__("pathlib").Path("a/b.md"))] == ["b.md", "b.json"]
    assert [p.name for p in record_paths(__import__("pathlib").Path("minutes"))] == ["minutes.md", "minutes.json"]
    assert default_name("sdof", time.strptime("2026-05-04", "%Y-%m-%d")) == "fieldmode-sdof-2026-05-04.md"


def test_record_written_atomically_with_every_part(tmp_path):
    texts = sdof.SPEC.demo_texts()
    entries = [Entry(sdof.SPEC, texts, evaluate(sdof.SPEC, texts, "us"))]
    md_path, json_path = write_record(tmp_path / "rec.md", entries, "us")
    text = md_path.read_text()
    for part in ("- Date: ", "- Tool: fieldmode", "### Inputs", "### Results", "### Flags",
                 "### Method and sources", "Caution: " + sdof.SPEC.caution, "kip/in", "| Stiffness (kN/mm) | 42 kN/mm"):
        assert part in text
    data = json.loads(json_path.read_text())
    assert data["checks"][0]["results"]["stiffness"] == {"value": pytest.approx(42e6), "unit": "N/m"}


def test_record_json_has_no_nan():
    texts = sdof.SPEC.demo_texts()
    outcome = evaluate(sdof.SPEC, texts, "si")
    data = as_json([Entry(sdof.SPEC, texts, outcome)], time.localtime())
    json.dumps(data, allow_nan=False)
    assert markdown([Entry(sdof.SPEC, texts, outcome)], "si", time.localtime()).startswith("# fieldmode calc record")


def test_path_completion(tmp_path, monkeypatch):
    (tmp_path / "decay-01.csv").write_text("t,a\n")
    (tmp_path / "data").mkdir()
    monkeypatch.chdir(tmp_path)
    assert suggest_path("dec") == "decay-01.csv"
    assert suggest_path("da") == "data/"
    assert suggest_path(str(tmp_path) + "/dec") == str(tmp_path / "decay-01.csv")
    assert suggest_path("zzz") is None and suggest_path("") is None
