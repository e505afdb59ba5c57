"""Check `decrement`: the textbook case, refusals and hostile text."""

from __future__ import annotations

import math

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from fieldmode.calc.checks import BY_ID
from fieldmode.calc.framework.result import Result
from fieldmode.calc.framework.units import InputError

DECREMENT = BY_ID["decrement"]


def si(result: Result, name: str) -> float:
    return float(result.values[name].si())


numbers = st.floats(min_value=1e-6, max_value=1e6, allow_nan=False)


def all_finite(result: Result) -> bool:
    return all(math.isfinite(value.si()) for value in result.values.values() if isinstance(value.si(), float))


def test_decrement_against_the_textbook() -> None:
    # From memory: Chopra, Dynamics of Structures, sec. 2.2: zeta = delta / sqrt(4 pi^2 + delta^2),
    # delta = (1/j) ln(u_i / u_(i+j)); and cycles to halve the amplitude j_50% ~ 0.11 / zeta
    result = DECREMENT.evaluate({"first_peak": "1.0", "later_peak": f"{math.exp(-5 * 0.3):.12f}", "cycles": "5"})
    assert si(result, "log_decrement") == pytest.approx(0.3, rel=1e-9)
    assert si(result, "damping_ratio") == pytest.approx(0.3 / math.sqrt(4 * math.pi**2 + 0.09), rel=1e-9)
    zeta = si(result, "damping_ratio")
    assert si(result, "cycles_to_halve") == pytest.approx(0.11 / zeta, rel=0.01)


def test_decrement_refuses_a_growing_trace() -> None:
    with pytest.raises(InputError, match="smaller than the first peak"):
        DECREMENT.evaluate({"first_peak": "0.2", "later_peak": "0.3", "cycles": "4"})


@pytest.mark.parametrize(("first", "later", "kind", "unit"), [
    ("2.5 mm", "1.1 mm", "length", "m"),
    ("0.3 in", "0.132 in", "length", "m"),
    ("5 mil", "2.2 mil", "length", "m"),  # machine amplitudes in mils
    ("12 mm/s", "5.28 mm/s", "velocity", "m/s"),
    ("0.5 in/s", "0.22 in/s", "velocity", "m/s"),
    ("0.05 g", "0.022 g", "acceleration", "m/s^2"),
    ("0.4 m/s^2", "0.176 m/s^2", "acceleration", "m/s^2"),
    ("2.5", "1.1", "number", "1"),
])
def test_peaks_with_units_give_a_unitless_ratio(first: str, later: str, kind: str, unit: str) -> None:
    result = DECREMENT.evaluate({"first_peak": first, "later_peak": later, "cycles": "5"})
    # From memory: Chopra, Dynamics of Structures, sec. 2.2: delta = (1/j) ln(u_i / u_(i+j)); the peaks' unit cancels
    assert si(result, "amplitude_ratio") == pytest.approx(2.5 / 1.1, rel=1e-12)
    assert si(result, "log_decrement") == pytest.approx(math.log(2.5 / 1.1) / 5, rel=1e-12)
    assert result.values["amplitude_ratio"].kind == "number"
    inputs = result.to_dict()["inputs"]
    assert inputs["first_peak"]["unit"] == unit and inputs["later_peak"]["unit"] == unit


@pytest.mark.parametrize(("first", "later", "words"), [
    ("2.5 mm", "1.1 mm/s", "is a velocity but the first peak is a length"),
    ("0.05 g", "1.1 mm", "is a length but the first peak is an acceleration"),
    ("2.5", "1.1 mm", "is a length but the first peak is a plain number"),
    ("12 mm/s", "0.5", "is a plain number but the first peak is a velocity"),
])
def test_peaks_of_different_kinds_are_refused_naming_the_later_peak(first: str, later: str, words: str) -> None:
    with pytest.raises(InputError) as caught:
        DECREMENT.evaluate({"first_peak": first, "later_peak": later, "cycles": "5"})
    assert str(caught.value).startswith("Later peak amplitude: ")
    assert words in str(caught.value)


@pytest.mark.parametrize("text", ["2 kN", "3 t", "4 Hz", "2 kN/mm"])
def test_a_peak_that_is_no_amplitude_is_refused(text: str) -> None:
    with pytest.raises(InputError) as caught:
        DECREMENT.evaluate({"first_peak": text, "later_peak": "1", "cycles": "5"})
    assert str(caught.value).startswith("First peak amplitude: expected a number, length, velocity or acceleration")


@settings(max_examples=200, deadline=None)
@given(first=numbers, ratio=st.floats(min_value=1.0001, max_value=1e6), cycles=st.floats(min_value=0.5,
                                                                                          max_value=1e4))
def test_decrement_fields_round_trip(first: float, ratio: float, cycles: float) -> None:
    texts = {"first_peak": repr(first), "later_peak": repr(first / ratio), "cycles": repr(cycles)}
    try:
        result = DECREMENT.evaluate(texts)
    except InputError:
        return  # e.g. the later peak rounded to the first one, or out of the parser's range
    delta, zeta = si(result, "log_decrement"), si(result, "damping_ratio")
    # From memory: Chopra sec. 2.2: u_i / u_(i+j) = exp(j delta) and zeta = delta / sqrt(4 pi^2 + delta^2)
    assert math.exp(delta * float(texts["cycles"])) == pytest.approx(float(texts["first_peak"]) / float(
        texts["later_peak"]), rel=1e-9)
    assert 0 < zeta < 1
    assert zeta == pytest.approx(delta / math.sqrt(4 * math.pi**2 + delta**2), rel=1e-12)


@settings(max_examples=200, deadline=None)
@given(name=st.sampled_from(["first_peak", "later_peak", "cycles"]),
       text=st.one_of(st.text(max_size=30), st.from_regex(r"-?\d{0,5}(\.\d{0,4})?(e-?\d{1,3})?( ?[a-z%]{0,3})?")))
def test_any_text_in_the_decrement_fields_raises_only_input_error(name: str, text: str) -> None:
    try:
        result = DECREMENT.evaluate({**DECREMENT.demo_texts(), name: text})
    except InputError:
        return
    assert all_finite(result)
