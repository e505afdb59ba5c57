"""Every registered check: its demo answers, its fields are well formed, hostile text is refused cleanly."""

from __future__ import annotations

import json
import math

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from fieldmode.calc.checks import SPECS
from fieldmode.calc.framework.kinds import KINDS
from fieldmode.calc.framework.spec import CheckSpec
from fieldmode.calc.framework.units import InputError

HOSTILE = st.one_of(
    st.text(max_size=40),
    st.sampled_from(["", "0", "-1", "1e308", "1e-308", "nan", "inf", "9**9**9", "1 m^4^4", "x" * 5000,
                     "5", "3 %", "0.25 g", "12 t", "42 kN/mm", "740 rpm", "1, 2, 3", "1,,2", "/etc/passwd",
                     "\x00", "😀 Hz", "1e15 t, 1e-15 t"]),
)


@pytest.mark.parametrize("spec", SPECS, ids=lambda spec: spec.id)
def test_demo_scenario_answers(spec: CheckSpec) -> None:
    result = spec.evaluate(spec.demo_texts())
    assert result.check == spec.id
    assert result.values
    json.dumps(result.to_dict(), allow_nan=False)
    assert "licensed" in result.caution


@pytest.mark.parametrize("spec", SPECS, ids=lambda spec: spec.id)
def test_fields_are_well_formed(spec: CheckSpec) -> None:
    for field in spec.fields:
        assert field.kind in KINDS or field.kind in ("choice", "path", "text"), field.name
        assert not field.choices or field.kind == "choice"
        assert field.label_with_unit


@pytest.mark.parametrize("spec", SPECS, ids=lambda spec: spec.id)
@settings(max_examples=60, deadline=None)
@given(data=st.data())
def test_any_text_in_any_field_raises_only_input_error(spec: CheckSpec, data: st.DataObject) -> None:
    texts = spec.demo_texts()
    field = data.draw(st.sampled_from(spec.fields))
    texts[field.name] = data.draw(HOSTILE)
    try:
        result = spec.evaluate(texts)
    except InputError:
        return
    for value in result.values.values():
        magnitude = value.si()
        if isinstance(magnitude, float):
            assert math.isfinite(magnitude), value.label


def test_one_meaning_is_one_physical_kind_everywhere() -> None:
    # Common practice (no source): a value can only move where it means the same quantity, so a meaning has
    # one physical kind wherever a field or a result has it
    kinds: dict[str, set[str]] = {}
    for spec in SPECS:
        for field in spec.fields:
            if field.meaning is not None:
                kinds.setdefault(field.meaning.key, set()).add(field.kind)
        result = spec.evaluate(spec.demo_texts())
        for value in result.values.values():
            if value.meaning is not None:
                kinds.setdefault(value.meaning.key, set()).add(value.kind)
    assert {key: found for key, found in kinds.items() if len(found) > 1} == {}
