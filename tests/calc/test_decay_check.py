"""The `decay` and `decrement` checks: demo record, fields, band parsing, unit invariance, manual decrement."""

from __future__ import annotations

import math
from pathlib import Path

import numpy as np
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from fieldmode.calc.checks import BY_ID
from fieldmode.calc.demo import HEEL_DROP, demo_file
from fieldmode.calc.demo.heel_drop import HeelDrop, demo_text
from fieldmode.calc.framework.reading import read_field
from fieldmode.calc.framework.result import Result
from fieldmode.calc.framework.spec import Field
from fieldmode.calc.framework.units import InputError

DECAY = BY_ID["decay"]
DECREMENT = BY_ID["decrement"]


def si(result: Result, name: str) -> float:
    return float(result.values[name].si())


def all_finite(result: Result) -> bool:
    return all(math.isfinite(value.si()) for value in result.values.values() if isinstance(value.si(), float))


def test_demo_record_ships_and_is_reproducible() -> None:
    path = demo_file(HEEL_DROP)
    assert path.is_absolute() and path.is_file()
    assert DECAY.field("file").default == str(path)
    shipped = path.read_text(encoding="utf-8")
    regenerated = demo_text()
    assert shipped.splitlines()[:4] == regenerated.splitlines()[:4]
    ours = np.loadtxt(path, delimiter=",", comments="#", skiprows=4)
    again = np.loadtxt(regenerated.splitlines()[4:], delimiter=",")
    # Common practice (no source): regenerated within one unit of the last printed digit
    np.testing.assert_allclose(ours, again, atol=1.5e-5, rtol=0)
    assert 1000 <= len(ours) <= 5000


def test_demo_record_gives_back_its_invented_mode() -> None:
    result = DECAY.evaluate(DECAY.demo_texts())
    truth = HeelDrop()
    # Oracle: the generator's invented parameters (closed-form modal responses, known f and zeta); noise,
    # the second mode and the heel pulse leave the analysis within 1 % on f and 5 % on zeta
    assert si(result, "natural_frequency") == pytest.approx(truth.frequency, rel=0.01)
    assert si(result, "damping_ratio") == pytest.approx(truth.damping, rel=0.05)
    assert si(result, "half_power_damping_ratio") == pytest.approx(truth.damping, rel=0.10)
    assert si(result, "damping_ratio_low") <= truth.damping <= si(result, "damping_ratio_high")
    for name in ("log_decrement", "cycles", "fit_r_squared", "zero_crossing_frequency"):
        assert name in result.values
    assert any("other mode" in flag.text for flag in result.flags)
    for series in ("time", "signal", "peak_time", "peak_amplitude", "envelope", "frequency", "amplitude_spectrum",
                   "half_power_frequency"):
        assert len(result.series[series]) > 0, series
    assert len(result.series["time"]) <= 400


def test_sends_name_real_results() -> None:
    result = DECAY.evaluate(DECAY.demo_texts())
    assert set(DECAY.sends) <= set(result.values)
    assert DECAY.sends == {"natural_frequency": "frequency", "damping_ratio": "damping"}
    assert set(DECREMENT.sends) <= set(DECREMENT.evaluate(DECREMENT.demo_texts()).values)


def test_signal_unit_scales_amplitudes_only(tmp_path: Path) -> None:
    texts = DECAY.demo_texts()
    in_file_unit = DECAY.evaluate(texts)
    in_g = DECAY.evaluate({**texts, "signal_unit": "g"})
    # Source: NIST SP 811 (2008): 1 g = 9.80665 m/s^2; the file's header says m/s^2
    assert si(in_g, "initial_amplitude") == pytest.approx(9.80665 * si(in_file_unit, "initial_amplitude"), rel=1e-9)
    for name in ("natural_frequency", "damping_ratio"):
        assert si(in_g, name) == pytest.approx(si(in_file_unit, name), rel=1e-9)


def test_sample_rate_and_column_options(tmp_path: Path) -> None:
    data = np.loadtxt(demo_file(HEEL_DROP), delimiter=",", comments="#", skiprows=4)
    single = tmp_path / "single.txt"
    np.savetxt(single, data[:, 1], fmt="%.5f")
    by_rate = DECAY.evaluate({"file": str(single), "sample_rate": "12000 cpm"})
    demo = DECAY.evaluate(DECAY.demo_texts())
    assert si(by_rate, "sample_rate") == pytest.approx(200.0)
    assert si(by_rate, "damping_ratio") == pytest.approx(si(demo, "damping_ratio"), rel=1e-6)
    by_column = DECAY.evaluate({"file": str(demo_file(HEEL_DROP)), "time_column": "time", "signal_column": "2"})
    assert si(by_column, "damping_ratio") == pytest.approx(si(demo, "damping_ratio"), rel=1e-9)


@pytest.mark.parametrize(("text", "expected"), [
    ("5 10", (5.0, 10.0)), ("5, 10", (5.0, 10.0)), ("5 10 Hz", (5.0, 10.0)), ("300 rpm, 600 rpm", (5.0, 10.0)),
    ("5 Hz, 10 Hz", (5.0, 10.0)),
])
def test_band_is_two_frequencies(text: str, expected: tuple[float, float]) -> None:
    result = DECAY.evaluate({**DECAY.demo_texts(), "band": text})
    # Common practice (no source): 1 rpm = 1/60 Hz
    assert (si(result, "band_low"), si(result, "band_high")) == pytest.approx(expected)


@pytest.mark.parametrize("text", ["5", "10 5", "5 10 20", "5 Hz 10 Hz", "0 10", "5 150"])
def test_bad_bands_are_refused(text: str) -> None:
    with pytest.raises(InputError):
        DECAY.evaluate({**DECAY.demo_texts(), "band": text})


def test_blank_separated_numbers_in_list_fields() -> None:
    field = Field("storeys", "Storey masses", "mass", unit="t", many=True)
    readings = read_field(field, "310 300 240 t")
    assert [r.si for r in readings] == pytest.approx([310e3, 300e3, 240e3])  # type: ignore[union-attr]
    assert len(read_field(field, "310 t, 300 t")) == 2  # type: ignore[arg-type]


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


numbers = st.floats(min_value=1e-6, max_value=1e6, allow_nan=False)


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


@settings(max_examples=60, deadline=None)
@given(name=st.sampled_from(["time_column", "signal_column", "sample_rate", "signal_unit", "band"]),
       text=st.one_of(st.text(max_size=20), st.from_regex(r"-?\d{0,4}(\.\d{0,3})?( \d{0,3})?( ?[a-zA-Z/^%]{0,6})?")))
def test_any_text_in_the_decay_options_raises_only_input_error(name: str, text: str) -> None:
    try:
        result = DECAY.evaluate({**DECAY.demo_texts(), name: text})
    except InputError:
        return
    assert all_finite(result)
