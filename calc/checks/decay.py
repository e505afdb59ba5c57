"""Check `decay`: natural frequency and damping ratio from a recorded free decay."""

from __future__ import annotations

from typing import TYPE_CHECKING

from fieldmode.calc.demo import HEEL_DROP, demo_name
from fieldmode.calc.framework.guard import overflow_guard
from fieldmode.calc.framework.meaning import STRUCTURE, Meaning
from fieldmode.calc.framework.result import Flag, InputFile, Reference, Result, Value, quantity
from fieldmode.calc.framework.spec import SIGNAL, CheckSpec, Field, Series
from fieldmode.calc.records.columns import RECORD_COLUMN_FIELDS

if TYPE_CHECKING:
    from fieldmode.calc.framework.reading import Inputs
    from fieldmode.calc.records.decay import Decay

FIELDS = (
    Field("file", "Record file", "path", demo_name(HEEL_DROP), positional=True,
          help="CSV or text: a time column and a signal column, or a signal and --sample-rate"),
    *RECORD_COLUMN_FIELDS,
    Field("signal_unit", "Signal unit", "text", "", required=False,
          help="g, m/s^2, mm/s or mm; default from the header, else as in the file"),
    Field("band", "Band-pass", "frequency", "", "Hz", many=True, required=False,
          help="two frequencies, low and high, e.g. '5 10'; default automatic"),
)

REFERENCES = (
    Reference("Logarithmic decrement over n cycles, zeta = delta / sqrt(4 pi^2 + delta^2)",
              "Chopra, Dynamics of Structures, sec. 2.2 (free vibration tests)"),
    Reference("Weighted least-squares fit of ln(peak amplitude) against time; 95 % interval from "
              "Student's t with n - 2 degrees of freedom", "ordinary linear regression"),
    Reference("Half-power bandwidth of the decay's spectrum as a cross-check",
              "Chopra, Dynamics of Structures, ch. 3; Clough & Penzien, Dynamics of Structures, ch. 3"),
    Reference("Zero-phase Butterworth band-pass in second-order sections", "scipy.signal butter / sosfiltfilt"),
)

_SIGNAL_KIND = {"acceleration": "acceleration", "velocity": "velocity", "length": "length"}


@overflow_guard("file")
def compute(inputs: Inputs) -> Result:
    # The analysis modules are imported here, not at the top: every other command starts faster.
    from fieldmode.calc.records.decay import DecayError, analyse
    from fieldmode.calc.records.read import MAX_SAMPLE_RATE, MIN_SAMPLE_RATE, RecordError, read_record

    path = inputs.text("file")
    rate = inputs.optional("sample_rate", None, minimum=MIN_SAMPLE_RATE, maximum=MAX_SAMPLE_RATE)
    band = None
    if inputs.has("band"):
        edges = inputs.array("band", positive=True)
        if len(edges) != 2 or edges[0] >= edges[1]:
            raise inputs.error("band", "give two frequencies, the low edge first")
        band = (float(edges[0]), float(edges[1]))
    record = read_record(path, time_column=inputs.optional_text("time_column"),
                         signal_column=inputs.optional_text("signal_column"), sample_rate=rate,
                         signal_unit=inputs.optional_text("signal_unit"))
    try:
        found = analyse(record.time, record.signal, record.sample_rate, band)
    except DecayError as error:
        others = [name for name in record.columns if name != record.channel_name]
        hint = f"; other columns: {', '.join(others[:6])} (--signal-column)" if len(others) > 1 else ""
        raise RecordError(path, f"signal column {record.channel_name!r}: {error}{hint}") from error
    kind = _SIGNAL_KIND.get(record.kind, "number")
    values = _values(found, kind)
    values["sample_rate"] = quantity("Sample rate", "frequency", record.sample_rate)
    values["samples"] = quantity("Samples", "count", float(len(record.signal)))
    notes = tuple(Flag("info", note) for note in record.notes)
    return inputs.result(values, series=found.series, flags=notes + found.flags, references=REFERENCES,
                         signal_kind=kind, files=(InputFile(path, record.source.size, record.source.sha256),))


def _values(found: Decay, kind: str) -> dict[str, Value]:
    """Result values of the decay analysis (SI)."""
    from fieldmode.calc.records.envelope import damping_from_sigma

    values = {
        "natural_frequency": quantity("Natural frequency", "frequency", found.natural_frequency,
                                      meaning=Meaning("natural frequency", STRUCTURE)),
        "damping_ratio": quantity("Damping ratio, decay fit", "ratio", found.damping_ratio,
                                  meaning=Meaning("damping ratio", STRUCTURE)),
        "damping_ratio_low": quantity("Damping ratio, 95 % low", "ratio", found.damping_ratio_low),
        "damping_ratio_high": quantity("Damping ratio, 95 % high", "ratio", found.damping_ratio_high),
        "log_decrement": quantity("Log decrement per cycle", "number", found.log_decrement),
        "cycles": quantity("Cycles fitted", "number", found.cycles),
        "peaks": quantity("Peaks fitted", "count", float(found.fit.count)),
        "fit_r_squared": quantity("Fit R^2 (ln amplitude)", "number", found.fit.r_squared),
        "damped_frequency": quantity("Damped frequency", "frequency", found.damped_frequency),
        "spectral_frequency": quantity("Spectral peak frequency", "frequency", found.spectral_frequency),
    }
    if found.zero_crossing_frequency is not None:
        values["zero_crossing_frequency"] = quantity("Zero-crossing frequency", "frequency",
                                                     found.zero_crossing_frequency)
    line = found.half_power
    if line.damping_ratio is not None and line.low is not None and line.high is not None:
        values["half_power_damping_ratio"] = quantity("Half-power damping ratio", "ratio", line.damping_ratio)
        values["half_power_low"] = quantity("Half-power band, low", "frequency", line.low)
        values["half_power_high"] = quantity("Half-power band, high", "frequency", line.high)
    if found.halves is not None:
        large, small = found.halves
        values["damping_ratio_large_amplitude"] = quantity(
            "Damping, larger peaks", "ratio", damping_from_sigma(large.sigma, found.damped_frequency)[1])
        values["damping_ratio_small_amplitude"] = quantity(
            "Damping, smaller peaks", "ratio", damping_from_sigma(small.sigma, found.damped_frequency)[1])
    values["decay_start"] = quantity("Decay start", "time", found.decay_start)
    values["decay_end"] = quantity("Decay end (into noise)", "time", found.decay_end)
    values["initial_amplitude"] = quantity("First peak amplitude", kind, found.initial_amplitude)
    values["noise_rms"] = quantity("Noise RMS in the band", kind, found.noise_rms)
    if found.band is not None:
        values["band_low"] = quantity("Band-pass low edge", "frequency", found.band[0])
        values["band_high"] = quantity("Band-pass high edge", "frequency", found.band[1])
    return values


SPEC = CheckSpec(
    id="decay",
    title="Measured decay",
    summary="natural frequency and damping ratio from a recorded free decay (heel drop, tap, release)",
    fields=FIELDS,
    compute=compute,
    key_results=("natural_frequency", "damping_ratio", "fit_r_squared"),
    series=(
        Series("time", "Time", "time"),
        Series("signal", "Record as analysed", SIGNAL, "time"),
        Series("peak_time", "Time of a fitted peak", "time"),
        Series("peak_amplitude", "Fitted peak", SIGNAL, "peak_time"),
        Series("envelope_time", "Time on the envelope", "time"),
        Series("envelope", "Fitted envelope", SIGNAL, "envelope_time"),
        Series("frequency", "Frequency", "frequency"),
        Series("amplitude_spectrum", "Amplitude spectrum", SIGNAL, "frequency"),
        Series("half_power_frequency", "Half-power band edges", "frequency"),
    ),
)
