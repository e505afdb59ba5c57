"""Reading recorded time series (decay records, accelerograms, vibration logs) from text.

API
---
``read_channels(path, time_column=None, signal_columns=None, sample_rate=None, signal_unit=None)``
returns a :class:`Record`: a uniform ``time`` (s), one or more ``signals`` (a column each, SI of
the channel's kind: m/s^2, m/s or m, or as in the file when its unit is unknown), ``sample_rate``
(Hz), ``notes`` (how the record was read), ``channel_names``, ``kinds`` ("acceleration",
"velocity", "length" or "" per channel), ``columns`` and ``source`` (as typed, size, SHA-256).
``read_record(...)`` is the same for one signal column.

- ``path`` is a file, ``-`` for standard input, a pipe, or ``demo:<name>`` for a shipped demo
  record; it is read once (:mod:`fieldmode.calc.records.source`). A regular file's record is kept
  (by path, size and modification time) so reading it again costs nothing.
- Text with or without header and comment lines (``#``, ``%``, ``//``), blank lines, separated by
  commas, semicolons, tabs or spaces; decimal commas where the separator is not a comma; UTF-8,
  UTF-16 (with its byte-order mark) or Latin-1.
- Columns are chosen by header name or 1-based number. The time is the column named like time (else
  the first); its unit is read from its header (s, ms, us, min, h; none means s; an unknown unit is
  refused). ``sample_rate`` replaces a missing time column; beside a time column it must agree with
  it within 1 %.
- ``signal_unit`` is unit text (``g``, ``mg`` for milli-g, ``m/s^2``, ``mm/s``, ``mm``); without it a
  unit in a signal column's header (``acc [g]``) is used if there is one.

Every problem raises :class:`RecordError` (an :class:`~fieldmode.calc.framework.units.InputError`)
with one line naming the file and, where there is one, the line number.
"""

from __future__ import annotations

import os
import re
from collections import OrderedDict
from collections.abc import Sequence
from dataclasses import dataclass, replace

import numpy as np

from fieldmode.calc.framework.units import InputError, read
from fieldmode.calc.physics.constants import STANDARD_GRAVITY
from fieldmode.calc.records import layout as layout_mod
from fieldmode.calc.records import sampling, source, table
from fieldmode.calc.records.layout import Layout, RecordError
from fieldmode.calc.records.sampling import MAX_SAMPLE_RATE, MIN_SAMPLE_RATE
from fieldmode.calc.records.source import Source

__all__ = ["MAX_SAMPLE_RATE", "MIN_SAMPLE_RATE", "Record", "RecordError", "read_channels", "read_record"]

MAX_FILE_BYTES = 256 * 1024 * 1024
"""Largest record read (bytes): about 7 million rows of two columns."""
MAX_SAMPLES = 4_000_000
"""Most samples (rows) read from one record: an hour at 1 kHz."""
MIN_SAMPLES = 32
"""Fewest samples accepted."""
KEPT = 2
"""Records of regular files kept after reading, most recent first."""

SIGNAL_KINDS = ("acceleration", "velocity", "length")
MILLI_G = ("mg", "milli-g", "millig")
"""Spellings of milli-g (0.001 standard gravity), which pint would read as milligram."""
_UNIT_IN_NAME = re.compile(r"[\[(]\s*([^\])]+?)\s*[\])]\s*$")


@dataclass(frozen=True)
class Record:
    """A uniformly sampled record: time (s), signals (SI of each channel's kind), and how it was read."""

    time: np.ndarray
    signals: np.ndarray
    """(samples, channels)."""
    sample_rate: float
    notes: tuple[str, ...]
    channel_names: tuple[str, ...]
    kinds: tuple[str, ...]
    """Physical kind of each channel: 'acceleration', 'velocity', 'length', or '' when its unit is unknown."""
    columns: tuple[str, ...]
    source: Source

    @property
    def signal(self) -> np.ndarray:
        """The first (for a one-signal record, the only) channel."""
        return self.signals[:, 0]

    @property
    def channel_name(self) -> str:
        return self.channel_names[0]

    @property
    def kind(self) -> str:
        return self.kinds[0]


_kept: OrderedDict[tuple[object, ...], Record] = OrderedDict()


def read_record(path: str | os.PathLike[str], time_column: int | str | None = None,
                signal_column: int | str | None = None, sample_rate: float | None = None,
                signal_unit: str | None = None) -> Record:
    """Read a record with one signal column (default: the first column that is not the time)."""
    return read_channels(path, time_column, None if signal_column is None else [signal_column], sample_rate,
                         signal_unit, single=True)


def read_channels(path: str | os.PathLike[str], time_column: int | str | None = None,
                  signal_columns: Sequence[int | str] | None = None, sample_rate: float | None = None,
                  signal_unit: str | None = None, single: bool = False) -> Record:
    """Read a record's signal columns (default: every column that is not the time, or the first with
    ``single``); see the module docstring for what is accepted."""
    path = os.fspath(path)
    if sample_rate is not None:
        sampling.check_rate(sample_rate, path, "you gave")
    key = (source.file_identity(path), path, time_column, tuple(signal_columns or ()), sample_rate, signal_unit,
           single)
    if key[0] is not None and key in _kept:
        _kept.move_to_end(key)
        return _kept[key]
    origin = source.read_source(path, MAX_FILE_BYTES)
    found = _read(origin, time_column, signal_columns, sample_rate, signal_unit, single)
    del origin  # the file's bytes go before the signals are copied out of the table read: a long record
    found = replace(found, signals=np.ascontiguousarray(found.signals))  # never holds all three at once
    if key[0] is not None and found.source.identity == key[0]:
        _kept[key] = found
        while len(_kept) > KEPT:
            _kept.popitem(last=False)
    return found


def _read(origin: Source, time_column: int | str | None, signal_columns: Sequence[int | str] | None,
          sample_rate: float | None, signal_unit: str | None, single: bool) -> Record:
    data, notes = _text(origin)
    layout = layout_mod.sniff(data, origin.shown)
    notes += layout.notes
    names = layout.names
    time_index = _time_index(layout, time_column, sample_rate)
    signals = ([_column(layout, wanted, "signal") for wanted in signal_columns] if signal_columns
               else _signal_guess(names, time_index, single))
    if time_index in signals:
        which = "the signal" if len(signals) == 1 else "a signal"
        raise RecordError(layout.shown, f"the time and {which} are both column {time_index + 1}")
    used = signals if time_index is None else [time_index, *signals]
    values = table.load_columns(data, layout, used, MAX_SAMPLES)
    if len(values) < MIN_SAMPLES:
        raise RecordError(layout.shown, f"only {len(values)} samples; at least {MIN_SAMPLES} are needed")
    channels = values[:, -len(signals):]
    if time_index is None:
        assert sample_rate is not None
        fs = float(sample_rate)
        time = np.arange(len(channels)) / fs
    else:
        scale, how = sampling.seconds_per_unit(names[time_index], layout.shown)
        notes += [how] if how else []
        stamps = values[:, 0] if scale == 1.0 else values[:, 0] * scale
        time, channels, fs = sampling.uniform(data, layout, stamps, channels, notes)
        del stamps
        if sample_rate is not None:
            sampling.agree(sample_rate, fs, layout.shown)
    kinds = []
    for position, index in enumerate(signals):
        kind, factor = _signal_unit(signal_unit, names[index], notes)
        if factor != 1.0:
            channels[:, position] *= factor
        kinds.append(kind)
    return Record(time, channels, fs, tuple(dict.fromkeys(notes)), tuple(names[i] for i in signals), tuple(kinds),
                  names, origin.released())


def _text(origin: Source) -> tuple[bytes, list[str]]:
    """The record's bytes as UTF-8 or Latin-1 text, and a note when they were UTF-16."""
    data = origin.data
    if data[:2] in (b"\xff\xfe", b"\xfe\xff"):
        try:
            return data.decode("utf-16").encode("utf-8"), ["file is UTF-16: read as text"]
        except UnicodeDecodeError as error:
            raise RecordError(origin.shown, "starts like UTF-16 text but is not: export it as UTF-8 text") from error
    return data, []


def _time_index(layout: Layout, time_column: int | str | None, sample_rate: float | None) -> int | None:
    """The time column: asked for, or named like time, or the first; None with a sample rate and no time."""
    if time_column is not None:
        return _column(layout, time_column, "time")
    named = next((i for i, n in enumerate(layout.names) if sampling.is_time_name(n)), None)
    if sample_rate is not None:
        return named
    if layout.width < 2:
        raise RecordError(layout.shown, "only one column and no sample rate: give the sample rate or add a time "
                          "column")
    return 0 if named is None else named


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
                          f"{layout.width} columns ({listing})", about=f"{what}_column")
    lowered = text.lower()
    for candidates in ([n.lower() for n in names], [_bare_name(n).lower() for n in names]):
        if lowered in candidates:
            return candidates.index(lowered)
    starts = [i for i, n in enumerate(names) if n.lower().startswith(lowered)]
    if len(starts) == 1:
        return starts[0]
    raise RecordError(layout.shown, f"no {what} column named {text!r} (columns: {listing})", about=f"{what}_column")


def _bare_name(name: str) -> str:
    """A column name without its unit, e.g. 'acc [g]' -> 'acc'."""
    return _UNIT_IN_NAME.sub("", name).strip()


def _signal_guess(names: tuple[str, ...], time_index: int | None, single: bool) -> list[int]:
    """Every column that is not the time (nor named like time), or only the first of them."""
    found = [i for i, name in enumerate(names)
             if i != time_index and not (len(names) > 1 and sampling.is_time_name(name))]
    if not found:
        found = [0 if time_index != 0 else 1]
    return found[:1] if single else found


def signal_unit_scale(text: str) -> tuple[str, float]:
    """Physical kind and SI factor of unit text such as 'g', 'mg', 'm/s^2', 'mm/s' or 'mm'."""
    if text.strip().lower() in MILLI_G:
        return "acceleration", 1e-3 * STANDARD_GRAVITY
    for kind in SIGNAL_KINDS:
        try:
            return kind, read(f"1 {text.strip()}", kind, "signal unit").si
        except InputError:
            continue
    raise InputError("signal unit", text, "not a unit of acceleration, velocity or displacement",
                     "'g', 'mg', 'm/s^2', 'mm/s' or 'mm'")


def _signal_unit(text: str | None, name: str, notes: list[str]) -> tuple[str, float]:
    """Kind and SI factor of a signal: from ``text``, else from its header, else unknown."""
    if text:
        kind, factor = signal_unit_scale(text)
        if text.strip().lower() in MILLI_G:
            notes.append(f"signal {name!r}: {text.strip()} read as milli-g, 0.001 g")
        return kind, factor
    match = _UNIT_IN_NAME.search(name)
    if match:
        try:
            kind, factor = signal_unit_scale(match.group(1))
        except InputError:
            pass
        else:
            milli = " (milli-g, 0.001 g)" if match.group(1).strip().lower() in MILLI_G else ""
            notes.append(f"signal {name!r}: unit {match.group(1)!r} taken from the header{milli}")
            return kind, factor
    notes.append(f"signal {name!r}: no unit given, amplitudes as in the file")
    return "", 1.0
