"""Check `decay`: the demo record, signal units, columns, bands and hostile text."""

from __future__ import annotations

import math
from pathlib import Path

import numpy as np
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from fieldmode.calc.checks import BY_ID
from fieldmode.calc.demo import HEEL_DROP, demo_file
from fieldmode.calc.demo.heel_drop import HeelDrop
from fieldmode.calc.framework.meaning import STRUCTURE, Meaning
from fieldmode.calc.framework.reading import read_field
from fieldmode.calc.framework.result import Result
from fieldmode.calc.framework.spec import Field
from fieldmode.calc.framework.units import InputError

DECAY = BY_ID["decay"]


def si(result: Result, name: str) -> float:
    return float(result.values[name].si())


DECREMENT = BY_ID["decrement"]


def all_finite(result: Result) -> bool:
    return all(math.isfinite(value.si()) for value in result.values.values() if isinstance(value.si(), float))


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


def test_measured_frequency_and_damping_are_the_structures() -> None:
    # Common practice (no source): a decay test measures the structure's own mode, not a machine or a code value
    result = DECAY.evaluate(DECAY.demo_texts())
    assert result.values["natural_frequency"].meaning == Meaning("natural frequency", STRUCTURE)
    assert result.values["damping_ratio"].meaning == Meaning("damping ratio", STRUCTURE)
    decrement = DECREMENT.evaluate(DECREMENT.demo_texts())
    assert decrement.values["damping_ratio"].meaning == Meaning("damping ratio", STRUCTURE)


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


@settings(max_examples=60, deadline=None)
@given(name=st.sampled_from(["time_column", "signal_column", "sample_rate", "signal_unit", "band"]),
       text=st.one_of(st.text(max_size=20), st.from_regex(r"-?\d{0,4}(\.\d{0,3})?( \d{0,3})?( ?[a-zA-Z/^%]{0,6})?")))
def test_any_text_in_the_decay_options_raises_only_input_error(name: str, text: str) -> None:
    try:
        result = DECAY.evaluate({**DECAY.demo_texts(), name: text})
    except InputError:
        return
    assert all_finite(result)
