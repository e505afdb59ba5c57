"""Reading a check's texts: damping fields read a bare number as a percentage, the unit system in use."""

from __future__ import annotations

import numpy as np
import pytest

from fieldmode.calc.checks import SPECS
from fieldmode.calc.framework.meaning import DAMPING_RATIO
from fieldmode.calc.framework.reading import read_field, read_inputs
from fieldmode.calc.framework.units import Reading

DAMPING_FIELDS = [(spec, field) for spec in SPECS for field in spec.fields
                  if field.meaning is not None and field.meaning.quantity == DAMPING_RATIO]
OTHER_RATIO_FIELDS = [(spec, field) for spec in SPECS for field in spec.fields
                      if field.kind == "ratio" and (spec, field) not in DAMPING_FIELDS]


def _name(pair: object) -> str:
    spec, field = pair  # type: ignore[misc]
    return f"{spec.id}.{field.name}"


def test_every_damping_field_is_found() -> None:
    assert {_name(pair) for pair in DAMPING_FIELDS} == {
        "sdof.damping", "forced.damping", "isolate.damping", "design-spectrum.damping", "spectrum.damping",
        "storeys.damping", "tmd.damping", "floor.damping", "footbridge.damping"}
    assert {_name(pair) for pair in OTHER_RATIO_FIELDS} == {
        "isolate.target_isolation", "tmd.mass_ratio", "tmd.target_damping", "ppv-distance.probability"}


def _same(left: object, right: object) -> bool:
    if isinstance(left, str) or isinstance(right, str):
        return left == right
    return bool(np.allclose(np.asarray(left, dtype=float), np.asarray(right, dtype=float), rtol=1e-12,
                            equal_nan=True))


@pytest.mark.parametrize("pair", DAMPING_FIELDS, ids=_name)
def test_a_bare_number_above_one_in_a_damping_field_is_a_percentage(pair) -> None:  # noqa: ANN001
    spec, field = pair
    reading = read_field(field, "5")
    assert isinstance(reading, Reading)
    # Common practice (no source): damping ratios are quoted in per cent; 5 means 5 %, never 500 %
    assert reading.si == pytest.approx(0.05) and reading.note == "read as 5 %"
    texts = spec.demo_texts()
    bare = spec.evaluate(texts | {field.name: "5"})
    typed = spec.evaluate(texts | {field.name: "5 %"})
    for name, value in typed.values.items():
        assert _same(bare.values[name].si(), value.si()), name
    assert any(flag.text == f"{field.label}: read as 5 %" and flag.level == "info" for flag in bare.flags)


@pytest.mark.parametrize("pair", DAMPING_FIELDS, ids=_name)
@pytest.mark.parametrize(("text", "ratio"), [("0.05", 0.05), ("1", 1.0), ("5 %", 0.05), ("0.5 %", 0.005)])
def test_a_damping_field_keeps_fractions_and_percent(pair, text: str, ratio: float) -> None:  # noqa: ANN001
    reading = read_field(pair[1], text)
    assert isinstance(reading, Reading)
    assert reading.si == pytest.approx(ratio) and reading.note == ""


@pytest.mark.parametrize("pair", OTHER_RATIO_FIELDS, ids=_name)
def test_other_ratio_fields_keep_the_caution(pair) -> None:  # noqa: ANN001
    reading = read_field(pair[1], "5")
    assert isinstance(reading, Reading)
    assert reading.si == pytest.approx(5.0) and reading.note == "did you mean 5 %?"


def test_a_damping_list_item_is_read_the_same_way() -> None:
    import dataclasses

    spec, field = DAMPING_FIELDS[0]
    listed = dataclasses.replace(field, many=True)
    readings = read_field(listed, "2, 0.03")
    assert isinstance(readings, tuple)
    assert [r.si for r in readings] == pytest.approx([0.02, 0.03])
    assert [r.note for r in readings] == ["read as 2 %", ""]


@pytest.mark.parametrize("system", ["si", "us"])
def test_the_unit_system_reaches_the_inputs(system: str) -> None:
    spec = SPECS[0]
    inputs, errors = read_inputs(spec, spec.demo_texts(), system)
    assert not errors and inputs.system == system
    assert spec.read(spec.demo_texts())[0].system == "si"  # the default


def test_an_unknown_unit_system_is_a_bug() -> None:
    with pytest.raises(ValueError, match="unit system"):
        read_inputs(SPECS[0], SPECS[0].demo_texts(), "metric")
