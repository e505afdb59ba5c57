"""A record's time: its unit from the column's header, and a uniform sampling made of it.

Steps within :data:`UNIFORM_TOLERANCE` of the median step are taken as uniform; steps within
:data:`RESAMPLE_LIMITS` times the median are resampled linearly onto the median step (with a note);
anything else is refused with the line that breaks it.
"""

from __future__ import annotations

import re

import numpy as np

from fieldmode.calc.records import table
from fieldmode.calc.records.layout import Layout, RecordError

MIN_SAMPLE_RATE, MAX_SAMPLE_RATE = 0.01, 1e6
"""Sample rates accepted (Hz), given or found from the time column."""
UNIFORM_TOLERANCE = 0.01
"""Steps within this fraction of the median step count as uniform sampling."""
RESAMPLE_LIMITS = (0.5, 2.0)
"""Steps within these multiples of the median step are resampled; beyond them the record is refused."""
RATE_AGREEMENT = 0.01
"""A sample rate given beside a time column must agree with it within this fraction."""

TIME_UNITS: dict[str, float] = {
    **dict.fromkeys(("s", "sec", "secs", "second", "seconds"), 1.0),
    **dict.fromkeys(("ms", "msec", "msecs", "millisecond", "milliseconds"), 1e-3),
    **dict.fromkeys(("us", "µs", "μs", "usec", "microsecond", "microseconds"), 1e-6),
    **dict.fromkeys(("min", "mins", "minute", "minutes"), 60.0),
    **dict.fromkeys(("h", "hr", "hrs", "hour", "hours"), 3600.0),
}
"""Spellings of time units in a time column's header, and seconds per unit."""
TIME_WORDS = ("time", "t", "zeit", "temps", "tiempo")
"""Words that name a time column (with or without a unit)."""
_TIME_HEADER = re.compile(r"^\s*(?P<word>[a-zA-Zµμ]+)\s*(?:[\[(/,_\-\s]\s*(?P<unit>[^\])]*?)\s*[\])]?)?\s*$")


def is_time_name(name: str) -> bool:
    """True for a column header that names a time ('time', 't [ms]', 'Time (milliseconds)', 'sec')."""
    match = _TIME_HEADER.match(name)
    if match is None:
        return False
    word = match.group("word").lower()
    return word in TIME_WORDS or (word in TIME_UNITS and not match.group("unit"))


def seconds_per_unit(name: str, shown: str) -> tuple[float, str]:
    """Seconds per unit of a time column, from its header, and how it was read.

    A header with no unit ('time', 't') is in seconds; a unit this reader does not know is refused,
    never taken as seconds.
    """
    match = _TIME_HEADER.match(name)
    word = match.group("word").lower() if match else ""
    unit = (match.group("unit") or "").strip() if match else ""
    if not unit and word in TIME_UNITS:
        unit = word
    if not unit:
        return 1.0, f"time column {name!r} read in s (no unit in its header)"
    factor = TIME_UNITS.get(unit) or TIME_UNITS.get(unit.lower())
    if factor is None:
        raise RecordError(shown, f"time column {name!r}: unknown time unit {unit!r} "
                          "(s, ms, us, min or h, e.g. 'time [ms]')")
    return factor, f"time column {name!r} read in {unit}" if factor != 1.0 else ""


def uniform(data: bytes, layout: Layout, time: np.ndarray, signals: np.ndarray,
            notes: list[str]) -> tuple[np.ndarray, np.ndarray, float]:
    """Check the time steps; return a uniform time (s), the signals on it and the sample rate (Hz)."""
    steps = np.diff(time)
    bad = np.flatnonzero(steps <= 0)
    if bad.size:
        row = int(bad[0]) + 1
        word = "duplicate time" if steps[row - 1] == 0 else "time goes back"
        raise RecordError(layout.shown, f"{word}: {time[row]:g} s after {time[row - 1]:g} s; "
                          "time must increase", table.line_of_row(data, layout, row))
    shortest, longest = float(steps.min()), float(steps.max())
    median = float(np.median(steps, overwrite_input=True))  # no copy of a long record's steps
    del steps
    check_rate(1.0 / median, layout.shown, "the time column gives")
    low, high = shortest / median, longest / median
    if max(abs(low - 1), abs(high - 1)) <= UNIFORM_TOLERANCE:
        fs = (len(time) - 1) / float(time[-1] - time[0])
        even = np.arange(len(time), dtype=float)
        even /= fs
        even += time[0]
        return even, signals, fs
    if low < RESAMPLE_LIMITS[0] or high > RESAMPLE_LIMITS[1]:
        steps = np.diff(time)
        ratio = steps / median
        worst = int(np.argmax(np.abs(np.log(ratio)))) + 1
        raise RecordError(layout.shown, f"sampling too uneven: a step of {steps[worst - 1]:.4g} s is "
                          f"{ratio[worst - 1]:.2g} x the median step {median:.4g} s (resampling allowed "
                          f"for {RESAMPLE_LIMITS[0]:g}-{RESAMPLE_LIMITS[1]:g} x)",
                          table.line_of_row(data, layout, worst))
    count = int(np.floor((time[-1] - time[0]) / median + 1e-9)) + 1
    even = time[0] + np.arange(count) * median
    notes.append(f"sampling uneven (steps {low:.2f}-{high:.2f} x the median): "
                 f"resampled linearly to {1 / median:.4g} Hz")
    resampled = np.column_stack([np.interp(even, time, column) for column in signals.T])
    return even, resampled, 1.0 / median


def check_rate(rate: float, shown: str, what: str) -> None:
    """Refuse a sample rate outside the accepted range."""
    if not MIN_SAMPLE_RATE <= rate <= MAX_SAMPLE_RATE:
        raise RecordError(shown, f"{what} a sample rate of {rate:.3g} Hz, outside {MIN_SAMPLE_RATE:g} to "
                          f"{MAX_SAMPLE_RATE:g} Hz; check the time column and its unit")


def agree(given: float, found: float, shown: str) -> None:
    """A sample rate given beside a time column must agree with it: refuse naming both when not."""
    if abs(given - found) > RATE_AGREEMENT * found:
        raise RecordError(shown, f"the sample rate given, {given:.6g} Hz, disagrees with the time column's "
                          f"{found:.6g} Hz: give one or the other, or correct it", about="sample_rate")
