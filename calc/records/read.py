"""Reading recorded time series (decay records, accelerograms) from text files.

API
---
``read_record(path, time_column=None, signal_column=None, sample_rate=None, signal_unit=None)``
returns a :class:`Record` with a uniform ``time`` (s), the ``signal`` in SI (m/s^2, m/s or m;
as in the file when no unit is known), ``sample_rate`` (Hz), ``notes`` (how the file was read),
``channel_name``, ``kind`` ("acceleration", "velocity", "length" or ""), ``columns``, and the
file's ``size`` (bytes) and ``sha256`` (of its content). ``demo:NAME`` is the shipped demo record NAME.

- Text with or without header and comment lines (``#``, ``%``, ``//``), blank lines, separated
  by commas, semicolons, tabs or spaces; decimal commas where the separator is not a comma.
- Columns are chosen by header name or 1-based number. Without a sample rate the time is the
  first column (or the one named like time); with ``sample_rate`` no time column is read.
- Time in seconds, or milliseconds when its header says ms.
- ``signal_unit`` is unit text read by :mod:`calc.units` (``g``, ``m/s^2``, ``mm/s``, ``mm``);
  without it a unit in the signal column's header (``acc [g]``) is used if there is one.
- Sampling: steps within 1 % of the median step are taken as uniform; steps within 0.5-2 x the
  median are resampled linearly onto the median step (with a note); anything else is refused.

Every problem raises :class:`RecordError` (an :class:`~calc.units.InputError`) with one line
naming the file and, where there is one, the line number. The fast path sniffs the layout from
the first 64 KiB and reads with ``numpy.loadtxt`` (C); a line-by-line scan runs only to locate
an error.
"""

from __future__ import annotations

import io
import os
import re
import warnings
from collections.abc import Iterator
from dataclasses import dataclass
from pathlib import Path

import numpy as np

from fieldmode.calc.demo import demo_path
from fieldmode.calc.framework.units import InputError, read
from fieldmode.calc.records import layout as layout_mod
from fieldmode.calc.records.fingerprint import check_unchanged, fingerprint
from fieldmode.calc.records.layout import Layout, RecordError, cells_of

MAX_FILE_BYTES = 256 * 1024 * 1024
"""Largest file read (bytes): about 10 million rows of two columns."""
MAX_SAMPLES = 2_000_000
"""Most samples read from one record."""
MIN_SAMPLES = 32
"""Fewest samples accepted."""
MIN_SAMPLE_RATE, MAX_SAMPLE_RATE = 0.01, 1e6
"""Sample rates accepted (Hz), given or found from the time column."""
UNIFORM_TOLERANCE = 0.01
"""Steps within this fraction of the median step count as uniform sampling."""
RESAMPLE_LIMITS = (0.5, 2.0)
"""Steps within these multiples of the median step are resampled; beyond them the file is refused."""

SIGNAL_KINDS = ("acceleration", "velocity", "length")
_TIME_NAMES = re.compile(r"^\s*(t|time|zeit|temps|tiempo|sec|seconds?|s|ms)\b", re.IGNORECASE)
_UNIT_IN_NAME = re.compile(r"[\[(]\s*([^\])]+?)\s*[\])]\s*$")


@dataclass(frozen=True)
class Record:
    """A uniformly sampled record: time (s), signal (SI of its ``kind``), and how it was read."""

    time: np.ndarray
    signal: np.ndarray
    sample_rate: float
    notes: tuple[str, ...]
    channel_name: str
    kind: str
    """Physical kind of the signal: 'acceleration', 'velocity', 'length', or '' when its unit is unknown."""
    columns: tuple[str, ...]
    size: int
    """Bytes in the file."""
    sha256: str
    """SHA-256 of the file's content, as hex."""


def read_record(path: str | os.PathLike[str], time_column: int | str | None = None,
                signal_column: int | str | None = None, sample_rate: float | None = None,
                signal_unit: str | None = None) -> Record:
    """Read a time series from a text file; see the module docstring for what is accepted.

    ``sample_rate`` in Hz replaces the time column; ``time_column`` and ``signal_column`` are a
    header name or a 1-based column number (int or digit text).
    """
    shown = str(path)
    if sample_rate is not None and not (MIN_SAMPLE_RATE <= sample_rate <= MAX_SAMPLE_RATE):
        raise InputError("sample rate", f"{sample_rate}", f"must be {MIN_SAMPLE_RATE:g} to {MAX_SAMPLE_RATE:g} Hz",
                         "'200 Hz'")
    if sample_rate is not None and time_column is not None:
        raise RecordError(shown, "give a time column or a sample rate, not both")
    layout = layout_mod.sniff(_file(shown), shown, MAX_FILE_BYTES)
    names = layout.names
    notes = list(layout.notes)
    time_index = None
    if sample_rate is None:
        if layout.width < 2 and time_column is None:
            raise RecordError(shown, "only one column and no sample rate: give the sample rate "
                              "or add a time column")
        time_index = _column(layout, time_column, "time") if time_column is not None else _time_guess(names)
    signal_index = (_column(layout, signal_column, "signal") if signal_column is not None
                    else _signal_guess(names, time_index))
    if signal_index == time_index:
        raise RecordError(shown, f"the time and the signal are both column {signal_index + 1}")
    used = [signal_index] if time_index is None else [time_index, signal_index]
    content = fingerprint(layout.path, shown)
    data = _load(layout, used)
    signal = data[:, -1]
    if len(signal) < MIN_SAMPLES:
        raise RecordError(shown, f"only {len(signal)} samples; at least {MIN_SAMPLES} are needed")
    if time_index is None:
        assert sample_rate is not None
        fs = float(sample_rate)
        time = np.arange(len(signal)) / fs
    else:
        scale = _time_scale(names[time_index], notes)
        time, signal, fs = _uniform(layout, used, data[:, 0] * scale, signal, notes)
    kind, factor = _signal_unit(signal_unit, names[signal_index], notes)
    if factor != 1.0:
        signal = signal * factor
    check_unchanged(layout.path, shown, content)
    return Record(time, signal, fs, tuple(notes), names[signal_index], kind, names, content.size, content.sha256)


def _file(shown: str) -> Path:
    """The file a typed path names: the shipped demo record for 'demo:NAME', else the path itself."""
    try:
        demo = demo_path(shown)
    except LookupError as error:
        raise RecordError(shown, str(error)) from error
    return Path(shown) if demo is None else demo


def _column(layout: Layout, wanted: int | str, what: str) -> int:
    """0-based index of the column asked for by 1-based number or by header name."""
    names = layout.names
    listing = ", ".join(names[:12]) + (" ..." if len(names) > 12 else "")
    text = str(wanted).strip()
    if isinstance(wanted, int) or text.isdecimal():
        number = int(text)
        if 1 <= number <= layout.width:
            return number - 1
        raise RecordError(layout.shown, f"there is no {what} column {number}: the file has "
                          f"{layout.width} columns ({listing})")
    lowered = text.lower()
    for candidates in ([n.lower() for n in names], [_bare_name(n).lower() for n in names]):
        if lowered in candidates:
            return candidates.index(lowered)
    starts = [i for i, n in enumerate(names) if n.lower().startswith(lowered)]
    if len(starts) == 1:
        return starts[0]
    raise RecordError(layout.shown, f"no {what} column named {text!r} (columns: {listing})")


def _bare_name(name: str) -> str:
    """A column name without its unit, e.g. 'acc [g]' -> 'acc'."""
    return _UNIT_IN_NAME.sub("", name).strip()


def _time_guess(names: tuple[str, ...]) -> int:
    """The column named like time, else the first column."""
    return next((i for i, n in enumerate(names) if _TIME_NAMES.match(n)), 0)


def _signal_guess(names: tuple[str, ...], time_index: int | None) -> int:
    """The first column that is not the time (nor named like time when there is no time column)."""
    for index, name in enumerate(names):
        if index != time_index and not (len(names) > 1 and _TIME_NAMES.match(name)):
            return index
    return 0 if time_index != 0 else 1


def _load(layout: Layout, used: list[int]) -> np.ndarray:
    """Read the used columns with numpy's C reader; on any fault find the line and say why."""
    order = sorted(set(used))
    source: str | io.StringIO = str(layout.path)
    if layout.decimal_comma or layout.quoted:
        with open(layout.path, encoding=layout.encoding) as handle:
            text = handle.read()
        if layout.decimal_comma:
            text = text.replace(",", ".")
        source = io.StringIO(text.replace('"', "") if layout.quoted else text)
    comments = layout.comments[0] if len(layout.comments) == 1 else layout.comments
    try:
        with warnings.catch_warnings():
            warnings.filterwarnings("ignore", message="Input line", category=UserWarning)  # blank lines
            data = np.loadtxt(source, delimiter=layout.delimiter, skiprows=layout.first_line - 1,
                              usecols=order, comments=comments, ndmin=2, quotechar=None,
                              encoding=None if isinstance(source, io.StringIO) else layout.encoding,
                              max_rows=MAX_SAMPLES + 1, dtype=float)
    except (ValueError, IndexError) as error:
        raise _scan(layout, used) or RecordError(layout.shown, f"unreadable data ({error})") from error
    if len(data) > MAX_SAMPLES:
        raise RecordError(layout.shown, f"more than {MAX_SAMPLES:,} samples; shorten the record")
    data = data[:, [order.index(i) for i in used]]
    if not np.isfinite(data).all():
        raise _scan(layout, used) or RecordError(layout.shown, "a value is not a finite number")
    return data


def _data_lines(layout: Layout) -> Iterator[tuple[int, list[str]]]:
    """(line number, cells) of every data line, read slowly: only used to locate problems."""
    with open(layout.path, encoding=layout.encoding, errors="replace") as handle:
        for number, line in enumerate(handle, start=1):
            if number < layout.first_line:
                continue
            cells = cells_of(line, layout.delimiter, layout.comments)
            if cells:
                yield number, cells


def _scan(layout: Layout, used: list[int]) -> RecordError | None:
    """The first line whose used cells are missing, not numbers, NaN or infinite."""
    for number, cells in _data_lines(layout):
        for index in used:
            name = layout.names[index]
            if index >= len(cells) or not cells[index]:
                return RecordError(layout.shown, f"no value in column {name!r} "
                                   f"({len(cells)} cells; fill or remove the row)", number)
            text = cells[index].replace(",", ".") if layout.decimal_comma else cells[index]
            try:
                value = float(text)
            except ValueError:
                return RecordError(layout.shown, f"{cells[index][:20]!r} in column {name!r} "
                                   "is not a number", number)
            if not np.isfinite(value):
                return RecordError(layout.shown, f"{cells[index]!r} in column {name!r}: a NaN or "
                                   "infinite row; remove or fill it", number)
    return None


def _line_number(layout: Layout, row: int) -> int:
    """File line number of data row ``row`` (0-based)."""
    for index, (number, _) in enumerate(_data_lines(layout)):
        if index == row:
            return number
    return 0


def _time_scale(name: str, notes: list[str]) -> float:
    """Seconds per time unit of the time column, from its header (ms or s)."""
    unit = _UNIT_IN_NAME.search(name)
    if (unit and unit.group(1).strip().lower() == "ms") or re.search(r"(_|\b)ms$", name.strip()):
        notes.append("time read in ms")
        return 1e-3
    return 1.0


def _uniform(layout: Layout, used: list[int], time: np.ndarray, signal: np.ndarray,
             notes: list[str]) -> tuple[np.ndarray, np.ndarray, float]:
    """Check the time steps; return a uniform time, the signal on it and the sample rate (Hz)."""
    steps = np.diff(time)
    bad = np.flatnonzero(steps <= 0)
    if bad.size:
        row = int(bad[0]) + 1
        line = _line_number(layout, row)
        word = "duplicate time" if steps[row - 1] == 0 else "time goes back"
        raise RecordError(layout.shown, f"{word}: {time[row]:g} s after {time[row - 1]:g} s; "
                          "time must increase", line)
    median = float(np.median(steps))
    if not MIN_SAMPLE_RATE <= 1.0 / median <= MAX_SAMPLE_RATE:
        raise RecordError(layout.shown, f"a sample rate of {1 / median:.3g} Hz is outside "
                          f"{MIN_SAMPLE_RATE:g} to {MAX_SAMPLE_RATE:g} Hz; check the time column and its unit")
    ratio = steps / median
    low, high = float(ratio.min()), float(ratio.max())
    if max(abs(low - 1), abs(high - 1)) <= UNIFORM_TOLERANCE:
        fs = (len(time) - 1) / float(time[-1] - time[0])
        return time[0] + np.arange(len(time)) / fs, signal, fs
    if low < RESAMPLE_LIMITS[0] or high > RESAMPLE_LIMITS[1]:
        worst = int(np.argmax(np.abs(np.log(ratio)))) + 1
        line = _line_number(layout, worst)
        raise RecordError(layout.shown, f"sampling too uneven: a step of {steps[worst - 1]:.4g} s is "
                          f"{ratio[worst - 1]:.2g} x the median step {median:.4g} s (resampling allowed "
                          f"for {RESAMPLE_LIMITS[0]:g}-{RESAMPLE_LIMITS[1]:g} x)", line)
    count = int(np.floor((time[-1] - time[0]) / median + 1e-9)) + 1
    uniform = time[0] + np.arange(count) * median
    notes.append(f"sampling uneven (steps {low:.2f}-{high:.2f} x the median): "
                 f"resampled linearly to {1 / median:.4g} Hz")
    return uniform, np.interp(uniform, time, signal), 1.0 / median


def signal_unit_scale(text: str) -> tuple[str, float]:
    """Physical kind and SI factor of unit text such as 'g', 'm/s^2', 'mm/s' or 'mm'."""
    for kind in SIGNAL_KINDS:
        try:
            return kind, read(f"1 {text.strip()}", kind, "signal unit").si
        except InputError:
            continue
    raise InputError("signal unit", text, "not a unit of acceleration, velocity or displacement",
                     "'g', 'm/s^2', 'mm/s' or 'mm'")


def _signal_unit(text: str | None, name: str, notes: list[str]) -> tuple[str, float]:
    """Kind and SI factor of the signal: from ``text``, else from its header, else unknown."""
    if text:
        return signal_unit_scale(text)
    match = _UNIT_IN_NAME.search(name)
    if match:
        try:
            kind, factor = signal_unit_scale(match.group(1))
        except InputError:
            pass
        else:
            notes.append(f"signal unit {match.group(1)!r} taken from the header")
            return kind, factor
    notes.append("signal unit not given: amplitudes as in the file")
    return "", 1.0
