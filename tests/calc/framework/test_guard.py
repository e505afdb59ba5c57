"""Extreme but parseable inputs: an answer or a clear refusal, never an overflow."""

from __future__ import annotations

import json

import pytest

from fieldmode.calc.checks import BY_ID
from fieldmode.calc.framework.units import InputError
from fieldmode.tui.cli import main

EXTREMES = [
    ("sdof", {"mass": "1e-304 kg"}),
    ("sdof", {"damping": "1e15"}),
    ("member", {"length": "1e-15 qm", "modulus": "1e15 QPa", "material": "", "second_moment": "1e15 Qm^4"}),
    ("member", {"length": "1e-300 m"}),
    ("forced", {"mass": "1e15 Qt", "stiffness": "1e-15 qN/Qm", "frequency": "1e15 QHz"}),
    ("forced", {"damping": "1e15"}),
    ("isolate", {"mass": "1e15 Qt", "frequency": "1e15 QHz"}),
    ("isolate", {"target_isolation": "99.9999999999999 %"}),
]


@pytest.mark.parametrize(("check", "change"), EXTREMES)
def test_extreme_inputs_answer_or_refuse_cleanly(check: str, change: dict[str, str]) -> None:
    spec = BY_ID[check]
    try:
        result = spec.evaluate({**spec.demo_texts(), **change})
    except InputError:
        return
    json.dumps(result.to_dict(), allow_nan=False)


def test_a_value_that_would_underflow_is_exit_2_with_one_line_on_its_own_field(
        capsys: pytest.CaptureFixture[str]) -> None:
    code = main(["sdof", "--mass", "1e-304 kg", "--stiffness", "42 kN/mm", "--json"])
    err = capsys.readouterr().err
    assert code == 2
    assert len(err.strip().splitlines()) == 1 and err.startswith("fieldmode: Mass: number out of range")


@pytest.mark.parametrize("outcome", ["overflow", "nan"])
def test_the_guard_turns_a_non_finite_answer_into_an_error_on_its_field(outcome: str) -> None:
    """What the readers' ranges cannot foresee (a formula overflowing on ordinary inputs) is still refused."""
    import dataclasses
    import math

    from fieldmode.calc.framework.guard import overflow_guard

    spec = BY_ID["sdof"]

    @overflow_guard("stiffness")
    def compute(inputs):  # noqa: ANN001, ANN202
        if outcome == "overflow":
            return math.exp(1e6)
        result = spec.compute(inputs)
        broken = {**result.series, "displacement": result.series["displacement"] * math.nan}
        return dataclasses.replace(result, series=broken)

    inputs, errors = spec.read(spec.demo_texts())
    assert not errors
    with pytest.raises(InputError, match="^Stiffness: the values given are too extreme to compute"):
        compute(inputs)
