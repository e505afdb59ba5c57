"""Check `ppv`: construction vibration from a measured velocity (or acceleration) record.

Per axis the peak particle velocity (PPV), its time and the frequency at the peak (zero crossings
and spectrum); the peak vector sum; events split from a long record; and the assessment against
the guideline line chosen (DIN 4150-3, BS 7385-2) or the human-response levels of BS 5228-2.
"""

from __future__ import annotations

import re
from typing import TYPE_CHECKING

import numpy as np

from fieldmode.calc.demo import SHEET_PILING, demo_name
from fieldmode.calc.framework.guard import overflow_guard
from fieldmode.calc.framework.result import MEASURED_CAUTION, Flag, InputFile, Reference, Result, Value, quantity, word
from fieldmode.calc.framework.spec import CheckSpec, Field, Series
from fieldmode.calc.physics import vibration_limits as limits
from fieldmode.calc.records.columns import RECORD_COLUMN_FIELDS

if TYPE_CHECKING:
    from fieldmode.calc.framework.reading import Inputs
    from fieldmode.calc.records.ppv import AxisPeak, Event
    from fieldmode.calc.records.read import Record


PEOPLE = "bs5228-people"
"""The guideline choice that compares with the BS 5228-2 human-response levels (no limit)."""
GUIDELINES: dict[str, str | None] = {
    **{f"din-foundation-{n}": f"din4150-3-short-{n}-foundation" for n in (1, 2, 3)},
    **{f"din-top-floor-{n}": f"din4150-3-short-{n}-top-floor" for n in (1, 2, 3)},
    **{f"din-long-term-{n}": f"din4150-3-long-{n}" for n in (1, 2, 3)},
    "bs7385-line-1": "bs7385-2-line-1",
    "bs7385-line-2": "bs7385-2-line-2",
    PEOPLE: None,
}
"""Guideline choice -> key of the line in :data:`fieldmode.calc.physics.vibration_limits.LINES`."""
HORIZONTAL_ONLY = ("din-top-floor-", "din-long-term-")
"""Choices whose values are for horizontal vibration of the uppermost floor."""
MAX_AXES = 3
LARGEST_EVENTS = 3
"""Events listed as result values (every event is in the series)."""
THIN_BUCKETS = 300
"""The time history is thinned to the lowest and highest sample of each axis in this many stretches."""
SPECTRUM_LOWER = 0.8
"""A spectral frequency below this share of the zero-crossing one is said, with the ratio it would give."""
MAX_HIGH_PASS = 20.0
"""Highest high-pass corner accepted (Hz): above it the filter would take construction vibration away."""
LABEL_NAME = 10
"""Characters of an axis name kept in result labels (labels stay within 24 characters)."""
_UNIT_IN_NAME = re.compile(r"\s*[\[(][^\])]*[\])]\s*$")

FIELDS = (
    Field("file", "Record file", "path", demo_name(SHEET_PILING), positional=True,
          help="CSV or text: a time column and one to three velocity (or acceleration) columns"),
    Field("axes", "Axis columns", "text", "", required=False,
          help="one to three header names or numbers, comma-separated; default every signal column"),
    RECORD_COLUMN_FIELDS[0],
    RECORD_COLUMN_FIELDS[2],
    Field("signal_unit", "Signal unit", "text", "", required=False,
          help="mm/s, in/s, m/s^2 or g for every axis; default from the headers"),
    Field("high_pass", "High-pass corner", "frequency", "", "Hz", required=False,
          help="an acceleration record is integrated to velocity with this high-pass, e.g. 1 Hz"),
    Field("guideline", "Guideline", "choice", "bs7385-line-2", choices=tuple(GUIDELINES),
          help="DIN 4150-3 line 1-3 (foundation, top floor, long-term), BS 7385-2 line 1-2, BS 5228-2 people"),
    Field("threshold", "Event threshold", "velocity", "0.5 mm/s", "mm/s", required=False,
          help="an event runs while any axis exceeds it; empty: the whole record is one event"),
    Field("quiet_gap", "Quiet gap", "time", "3 s", "s", required=False,
          help="an event ends after this long below the threshold; default 2 s"),
)

QUIET_GAP = 2.0
"""Quiet gap (s) when a threshold is given without one."""

REFERENCES = (
    Reference("PPV: the largest |v| of each axis; peak vector sum: the largest instantaneous "
              "sqrt(vx^2 + vy^2 + vz^2)", "DIN 4150-3:1999; BS 7385-2:1993 (definitions, from memory)"),
    Reference("Frequency at the peak: 1 / (2 x the half cycle between the zero crossings about it), and the "
              "highest line of the spectrum of a 1 s Hann-windowed stretch about it (a cross-check); the "
              "zero-crossing frequency is compared with the guideline", "Common practice (no source)"),
    Reference("Events: stretches where an axis exceeds the threshold, split by the quiet gap",
              "Common practice (no source)"),
)


@overflow_guard("file")
def compute(inputs: Inputs) -> Result:
    # The analysis modules are imported here, not at the top: every other command starts faster.
    from fieldmode.calc.records import ppv as analysis

    record, axes, names, flags = _velocities(inputs)
    rate, t0 = record.sample_rate, float(record.time[0])
    try:
        peaks = [analysis.axis_peak(v, rate, t0) for v in axes]
        total, total_time = analysis.peak_vector_sum(axes, rate, t0)
        events = _events(inputs, axes, rate, t0, float(record.time[-1]), peaks, total, total_time)
    except ValueError as error:
        raise inputs.error("threshold" if inputs.has("threshold") else "file", str(error)) from error
    choice = inputs.text("guideline")
    key = GUIDELINES[choice]
    series = {**_history(record.time, axes), **_peak_series(peaks), **_event_series(events)}
    found = [p for p in peaks if np.isfinite(_governing_frequency(p))]
    series["axis_frequency"] = np.array([_governing_frequency(p) for p in found])
    series["axis_ppv"] = np.array([p.ppv for p in found])
    if key is None:
        values = _people(peaks, names, flags)
    else:
        values = _assessment(key, choice, peaks, names, flags)
        series.update(_guideline_series(key))
        series["event_ratio"] = np.array([_event_ratio(key, e) for e in events])
    values["vector_sum"] = quantity("Vector sum PPV", "velocity", total)
    values["vector_sum_time"] = quantity("Time of vector sum PPV", "time", total_time)
    for number, (name, peak) in enumerate(zip(names, peaks, strict=True), start=1):
        values.update(_axis_values(number, name, peak))
    values["events"] = quantity("Events", "count", float(len(events)))
    values.update(_largest_events(events))
    values["sample_rate"] = quantity("Sample rate", "frequency", rate)
    values["duration"] = quantity("Record length", "time", float(record.time[-1] - record.time[0]))
    series = {name: curve for name, curve in series.items() if np.isfinite(curve).all()}  # a curve with a gap
    references = REFERENCES + _guideline_references(key)
    return inputs.result(values, series=series, flags=tuple(flags), references=references,
                         files=(InputFile(inputs.text("file"), record.source.size, record.source.sha256),))


def _velocities(inputs: Inputs) -> tuple[Record, list[np.ndarray], list[str], list[Flag]]:
    """The record, its axes as velocities (m/s), their short names and the reading notes as flags."""
    from fieldmode.calc.records.read import MAX_SAMPLE_RATE, MIN_SAMPLE_RATE, RecordError, read_channels

    path = inputs.text("file")
    rate = inputs.optional("sample_rate", None, minimum=MIN_SAMPLE_RATE, maximum=MAX_SAMPLE_RATE)
    wanted = _axis_names(inputs)
    try:
        record = read_channels(path, time_column=inputs.optional_text("time_column"), signal_columns=wanted,
                               sample_rate=rate, signal_unit=inputs.optional_text("signal_unit"))
    except RecordError as error:
        if error.about == "signal_column":
            raise RecordError(path, error.problem, error.line, about="axes") from error
        raise
    count = record.signals.shape[1]
    if count > MAX_AXES:
        raise inputs.error("axes", f"the record has {count} signal columns ({', '.join(record.channel_names)}): "
                                   "name one to three of them")
    flags = [Flag("info", note) for note in record.notes]
    kinds = set(record.kinds)
    if len(kinds) > 1:
        described = ", ".join(f"{n} {k or 'no unit'}" for n, k in zip(record.channel_names, record.kinds,
                                                                     strict=True))
        raise inputs.error("signal_unit", f"the axes are of different kinds ({described}): give one unit")
    kind = record.kinds[0]
    choice = inputs.text("guideline")
    if kind == "":
        raise inputs.error("signal_unit", f"column {record.channel_names[0]!r} has no unit in its header: give "
                                          "the velocity unit (e.g. mm/s) or an acceleration unit")
    if kind == "length":
        raise inputs.error("signal_unit", f"the guideline {choice} is a velocity and the record is a "
                                          "displacement: give a velocity or acceleration record")
    axes = [record.signals[:, i] for i in range(count)]  # views: a long record is not copied again
    if kind == "acceleration":
        axes, how = _integrated(inputs, choice, axes, record.sample_rate)
        flags.append(Flag("info", f"acceleration integrated: {how}"))
        corner = inputs.value("high_pass")
        flags.append(Flag("caution", f"the first and last {1 / corner:.3g} s of the velocity carry the start and "
                                     "end of the filter: a peak there may be off"))
    elif inputs.has("high_pass"):
        raise inputs.error("high_pass", "the record is already a velocity; leave the high-pass empty")
    names = [_UNIT_IN_NAME.sub("", n) or n for n in record.channel_names]
    return record, axes, names, flags


def _integrated(inputs: Inputs, choice: str, axes: list[np.ndarray], rate: float) -> tuple[list[np.ndarray], str]:
    """Velocities (m/s) from acceleration axes with the high-pass typed, and how they were made."""
    from fieldmode.calc.records.ppv import velocity_from_acceleration

    if not inputs.has("high_pass"):
        raise inputs.error("high_pass", f"the guideline {choice} is a velocity and the record is an acceleration: "
                                        "give a high-pass corner (e.g. 1 Hz) to integrate it")
    corner = inputs.value("high_pass", positive=True, maximum=MAX_HIGH_PASS)
    made = []
    how = ""
    for a in axes:
        try:
            velocity, how = velocity_from_acceleration(a, rate, corner)
        except ValueError as error:
            raise inputs.error("high_pass", str(error)) from error
        made.append(velocity)
    return made, how


def _axis_names(inputs: Inputs) -> list[str] | None:
    """The axis columns typed (names or numbers), or None for every signal column."""
    if not inputs.has("axes"):
        return None
    names = [part.strip() for part in inputs.text("axes").split(",")]
    if not names or any(not name for name in names):
        raise inputs.error("axes", "give one to three column names or numbers separated by commas")
    if len(names) > MAX_AXES:
        raise inputs.error("axes", f"{len(names)} columns given: name one to three")
    if len({name.lower() for name in names}) != len(names):
        raise inputs.error("axes", "a column is named twice")
    return names


def _events(inputs: Inputs, axes: list[np.ndarray], rate: float, t0: float, t_end: float,
            peaks: list[AxisPeak], total: float, total_time: float) -> list[Event]:
    """Events above the threshold, or the whole record as one event when no threshold is given."""
    from fieldmode.calc.records.ppv import Event, find_events

    if not inputs.has("threshold"):
        if inputs.has("quiet_gap"):
            raise inputs.error("quiet_gap", "give the event threshold too, or leave both empty")
        return [Event(t0, t_end, tuple(peaks), total, total_time)]
    threshold = inputs.value("threshold", positive=True)
    gap = inputs.optional("quiet_gap", QUIET_GAP, positive=True, maximum=3600.0)
    assert gap is not None
    return find_events(axes, rate, threshold, gap, t0)


def _governing_frequency(peak: AxisPeak) -> float:
    """The frequency (Hz) compared with the guideline: from the zero crossings about the peak, else from the
    spectrum about it (NaN if neither was found)."""
    for found in (peak.frequency_crossings, peak.frequency_spectrum):
        if found is not None:
            return found
    return float("nan")


def _short(name: str) -> str:
    return name if len(name) <= LABEL_NAME else name[:LABEL_NAME - 1] + "~"


def _axis_values(number: int, name: str, peak: AxisPeak) -> dict[str, Value]:
    shown = _short(name)
    values = {f"ppv_{number}": quantity(f"{shown}: PPV", "velocity", peak.ppv),
              f"time_{number}": quantity(f"{shown}: time of PPV", "time", peak.time)}
    if peak.frequency_crossings is not None:
        values[f"frequency_crossings_{number}"] = quantity(f"{shown}: f crossings", "frequency",
                                                           peak.frequency_crossings)
    if peak.frequency_spectrum is not None:
        values[f"frequency_spectrum_{number}"] = quantity(f"{shown}: f spectrum", "frequency",
                                                          peak.frequency_spectrum)
    return values


def _limit_at(key: str, frequency: float) -> float | None:
    """The guideline value (m/s) at a frequency (Hz); None where the line gives none (below its range)."""
    line = limits.guideline_line(key)
    if not np.isfinite(frequency):
        frequency = max(line.lowest, line.frequencies[0])
    if frequency < line.lowest and line.displacement_below is None:
        return None
    return float(limits.limit(line, frequency))


def _assessment(key: str, choice: str, peaks: list[AxisPeak], names: list[str],
                flags: list[Flag]) -> dict[str, Value]:
    """Each axis against the guideline line; the largest ratio governs."""
    line = limits.guideline_line(key)
    ratios: list[tuple[float, int, float, float]] = []
    for index, peak in enumerate(peaks):
        frequency = _governing_frequency(peak)
        allowed = _limit_at(key, frequency)
        if not np.isfinite(frequency) and len(line.values) > 1:
            flags.append(Flag("caution", f"{names[index]}: no frequency found at the peak; compared with the "
                                         f"value at {max(line.lowest, line.frequencies[0]):g} Hz"))
        if allowed is None:
            flags.append(Flag("caution", f"{names[index]}: {frequency:.3g} Hz at the peak is below "
                                         f"{line.lowest:g} Hz, where {line.title} gives no value"))
            continue
        ratios.append((peak.ppv / allowed, index, allowed, frequency))
        other = peak.frequency_spectrum
        if len(line.values) > 1 and other is not None and other < SPECTRUM_LOWER * frequency:
            at_other = _limit_at(key, other)
            judged = "no value there" if at_other is None else f"PPV / value there {peak.ppv / at_other:.3g}"
            flags.append(Flag("caution", f"{names[index]}: the spectrum about the peak puts it at {other:.3g} Hz, "
                                         f"below the {frequency:.3g} Hz of its half cycle ({judged})"))
    if choice.startswith(HORIZONTAL_ONLY):
        flags.append(Flag("info", f"{line.title}: values for horizontal vibration; every axis given was "
                                  "compared (name only the horizontal columns in Axis columns)"))
    for note in line.notes:
        if note == limits.CONTINUOUS_NOTE:
            flags.append(Flag("caution", note))
    if not ratios:
        return {"verdict": word("Assessment", "no guideline value at these frequencies")}
    ratio, index, allowed, frequency = max(ratios)
    met = ratio <= 1.0 + 1e-12
    shown = f"{peaks[index].ppv * 1e3:.3g} mm/s on {names[index]}"
    at = f" at {frequency:.3g} Hz" if len(line.values) > 1 and np.isfinite(frequency) else ""
    if met:
        flags.append(Flag("info", f"{line.title}: {shown}{at} is {ratio:.0%} of {allowed * 1e3:.3g} mm/s"))
    else:
        flags.append(Flag("warning", f"{line.title}: {shown}{at} exceeds {allowed * 1e3:.3g} mm/s "
                                     f"({ratio:.0%} of the guideline value)"))
    values = {"verdict": word("Assessment", "met" if met else "NOT met"),
              "ratio": quantity("PPV / guideline value", "number", ratio),
              "limit": quantity("Guideline value", "velocity", allowed),
              "governing_axis": word("Governing axis", names[index])}
    if np.isfinite(frequency):
        values["governing_frequency"] = quantity("Frequency compared", "frequency", frequency)
    return values


def _people(peaks: list[AxisPeak], names: list[str], flags: list[Flag]) -> dict[str, Value]:
    """The BS 5228-2 Table B.1 level the largest PPV reaches, and what people are likely to make of it."""
    index = int(np.argmax([p.ppv for p in peaks]))
    level, description = limits.human_response_level(peaks[index].ppv)
    values: dict[str, Value] = {"governing_axis": word("Governing axis", names[index])}
    if level is not None:
        values["human_level"] = quantity("BS 5228-2 level reached", "velocity", level.level)
    values["human_response"] = word("Likely response", description)
    flags.append(Flag("info", "BS 5228-2 Table B.1 levels describe how people are likely to respond; they are "
                              "not limits"))
    if level is not None and level.level >= limits.HUMAN_LEVELS[2].level:
        flags.append(Flag("caution", f"{peaks[index].ppv * 1e3:.3g} mm/s on {names[index]}: {description}"))
    return values


def _event_ratio(key: str, event: Event) -> float:
    """The largest PPV / guideline value over the axes of an event (NaN where the line gives no value)."""
    ratios = []
    for peak in event.axes:
        allowed = _limit_at(key, _governing_frequency(peak))
        if allowed is not None:
            ratios.append(peak.ppv / allowed)
    return max(ratios) if ratios else float("nan")


def _largest_events(events: list[Event]) -> dict[str, Value]:
    """The largest events as values (every event is in the series), when there is more than one."""
    if len(events) < 2:
        return {}
    order = sorted(range(len(events)), key=lambda k: -max(p.ppv for p in events[k].axes))[:LARGEST_EVENTS]
    return {f"event_{k + 1}": quantity(f"Event {k + 1} at {events[k].start:.0f} s PPV", "velocity",
                                       max(p.ppv for p in events[k].axes)) for k in sorted(order)}


def _history(time: np.ndarray, axes: list[np.ndarray]) -> dict[str, np.ndarray]:
    """Each axis's velocity, thinned to the lowest and highest sample of every axis in each stretch
    (every point kept is a sample as recorded, at its own time)."""
    size = len(time) // THIN_BUCKETS
    if size < 2:
        index = np.arange(len(time))
    else:
        usable = size * THIN_BUCKETS
        base = np.arange(THIN_BUCKETS) * size
        picks = []
        for v in axes:
            blocks = v[:usable].reshape(THIN_BUCKETS, size)
            picks += [base + np.argmin(blocks, axis=1), base + np.argmax(blocks, axis=1)]
        index = np.unique(np.concatenate([*picks, np.arange(usable, len(time))[:: max(1, size // 2)],
                                          [0, len(time) - 1]]))
    series = {"time": time[index]}
    for number, v in enumerate(axes, start=1):
        series[f"axis_{number}"] = v[index]
    return series


def _peak_series(peaks: list[AxisPeak]) -> dict[str, np.ndarray]:
    return {"peak_time": np.array([p.time for p in peaks]), "peak_ppv": np.array([p.ppv for p in peaks])}


def _event_series(events: list[Event]) -> dict[str, np.ndarray]:
    """Each event's start, end, largest PPV with its frequency, vector sum, and every axis's peak."""
    largest = [int(np.argmax([p.ppv for p in e.axes])) for e in events]
    per_axis: dict[str, np.ndarray] = {}
    for k in range(len(events[0].axes) if events else 0):
        peaks = [e.axes[k] for e in events]
        per_axis[f"event_time_{k + 1}"] = np.array([p.time for p in peaks])
        per_axis[f"event_ppv_{k + 1}"] = np.array([p.ppv for p in peaks])
        per_axis[f"event_crossings_{k + 1}"] = np.array([_or_nan(p.frequency_crossings) for p in peaks])
        per_axis[f"event_spectrum_{k + 1}"] = np.array([_or_nan(p.frequency_spectrum) for p in peaks])
    return {**per_axis, "event_start": np.array([e.start for e in events]),
            "event_end": np.array([e.end for e in events]),
            "event_ppv": np.array([e.axes[k].ppv for e, k in zip(events, largest, strict=True)]),
            "event_frequency": np.array([_governing_frequency(e.axes[k]) for e, k in zip(events, largest,
                                                                                          strict=True)]),
            "event_vector_sum": np.array([e.vector_sum for e in events])}


def _or_nan(value: float | None) -> float:
    return float("nan") if value is None else value


def _guideline_series(key: str) -> dict[str, np.ndarray]:
    frequency, allowed = limits.curve(key, 1.0, 150.0, 120)
    return {"guideline_frequency": frequency, "guideline_limit": allowed}


def _guideline_references(key: str | None) -> tuple[Reference, ...]:
    if key is None:
        return (Reference("Human response to construction vibration by PPV", limits.HUMAN_SOURCE),)
    line = limits.guideline_line(key)
    return (Reference(f"{line.title}: {line.applies_to}", line.source),)


SPEC = CheckSpec(
    id="ppv",
    title="Construction vibration (PPV)",
    summary="peak particle velocity per axis and vector sum from a measured record, events, frequency at the "
            "peak, against DIN 4150-3, BS 7385-2 or BS 5228-2",
    fields=FIELDS,
    compute=compute,
    caution=MEASURED_CAUTION,
    key_results=("verdict", "ratio", "vector_sum", "events"),
    series=(
        Series("time", "Time", "time"),
        Series("axis_1", "Velocity, axis 1", "velocity", "time"),
        Series("axis_2", "Velocity, axis 2", "velocity", "time"),
        Series("axis_3", "Velocity, axis 3", "velocity", "time"),
        Series("peak_time", "Time of an axis's PPV", "time"),
        Series("peak_ppv", "PPV of the axis", "velocity", "peak_time"),
        Series("axis_frequency", "Frequency at an axis's peak (compared)", "frequency"),
        Series("axis_ppv", "PPV of the axis", "velocity", "axis_frequency"),
        Series("guideline_frequency", "Frequency", "frequency"),
        Series("guideline_limit", "Guideline value", "velocity", "guideline_frequency"),
        Series("event_start", "Event start", "time"),
        Series("event_end", "Event end", "time", "event_start"),
        Series("event_ppv", "Event PPV (largest axis)", "velocity", "event_start"),
        Series("event_frequency", "Event frequency at the peak", "frequency", "event_start"),
        Series("event_vector_sum", "Event vector sum PPV", "velocity", "event_start"),
        Series("event_ratio", "Event PPV / guideline value", "number", "event_start"),
        *(curve for n in (1, 2, 3) for curve in (
            Series(f"event_time_{n}", f"Event peak time, axis {n}", "time"),
            Series(f"event_ppv_{n}", f"Event PPV, axis {n}", "velocity", f"event_time_{n}"),
            Series(f"event_crossings_{n}", f"Event f crossings, axis {n}", "frequency", f"event_time_{n}"),
            Series(f"event_spectrum_{n}", f"Event f spectrum, axis {n}", "frequency", f"event_time_{n}"))),
    ),
)
