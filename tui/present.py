"""The one presenter: how results, flags and readings are written for people and for fields.

The command line, the app and the calc record all write values through these functions, so a
value reads the same wherever it appears: 4 significant figures in an engineering unit of the
chosen system (SI or US customary), a list in one unit, and SI with 6 figures where SI is asked.
"""

from __future__ import annotations

import numpy as np

from fieldmode.calc.framework.kinds import KINDS
from fieldmode.calc.framework.result import Flag, Result, Value, si_unit
from fieldmode.calc.framework.units import Reading, display_unit, format_number, format_value, unit_factor, unit_name
from fieldmode.tui.printable import printable

LEVEL_MARKS: dict[str, str] = {"info": "i", "caution": "!", "warning": "!!"}
"""A symbol per flag level, so meaning never rests on colour alone."""
LEVEL_WORDS: dict[str, str] = {"info": "note", "caution": "caution", "warning": "WARNING"}
"""Flag levels as words, written beside their mark."""
MOST_READINGS = 4
"""A list field's reading lists at most this many values."""


def value_lines(value: Value, system: str, most: int | None = None) -> list[str]:
    """A result in engineering units: one line, or one line per row of a table (mode shapes).

    A list is written in one unit; with ``most`` it is cut after that many items and the
    count is added ('0.57, 0.23 ... (12)').
    """
    if isinstance(value.magnitude, str):
        return [printable(value.magnitude)]
    magnitude = np.asarray(value.magnitude, dtype=float)
    if magnitude.ndim == 1 and most is not None and magnitude.size > most:
        return [format_value(magnitude[:most], value.kind, system) + f" ... ({magnitude.size})"]
    return format_value(magnitude, value.kind, system).split("; ")


def value_text(value: Value, system: str, most: int | None = None) -> str:
    """A result in engineering units on one line (table rows separated by '; ')."""
    return "; ".join(value_lines(value, system, most))


def table_columns(result: Result, system: str) -> list[tuple[str, str, list[str]]]:
    """The curves ``result.table`` names, as (name, display unit, cells) per column, abscissa first.

    Each column is in one engineering unit of ``system`` chosen by its largest value (as a list
    result is), 4 significant figures; an empty list when the result names no table.
    """
    columns = []
    for name in result.table:
        kind = result.series_kinds[name]
        values = np.asarray(result.series[name], dtype=float)
        unit = display_unit(values, kind, system)
        scaled = (values * unit_factor(unit, kind)).tolist()
        cells = [f"{v:.0f}" if KINDS[kind].integer else format_number(v) for v in scaled]
        columns.append((name, unit_name(unit, kind), cells))
    return columns


def table_lines(result: Result, system: str) -> list[str]:
    """``result.table`` as aligned text: a line of names, a line of units, then one line per point."""
    columns = table_columns(result, system)
    if not columns:
        return []
    rows = zip(*([name, unit, *cells] for name, unit, cells in columns), strict=True)
    widths = [max(len(name), len(unit), *map(len, cells)) for name, unit, cells in columns]
    return ["  ".join(cell.rjust(width) for cell, width in zip(row, widths, strict=True)).rstrip() for row in rows]


def si_text(value: Value) -> str:
    """A result in SI with 6 significant figures and its unit ('' for ratios), for the calc record."""
    if isinstance(value.magnitude, str):
        return value.magnitude
    unit = "" if si_unit(value.kind) == "1" else f" {si_unit(value.kind)}"
    numbers = np.ravel(np.asarray(value.magnitude, dtype=float))
    return ", ".join(f"{number:.6g}" for number in numbers) + unit


def typed_si_text(si: float | None, unit: str | None) -> str:
    """An input's SI value as the calc record writes it ('' when the input has none)."""
    if si is None:
        return ""
    return f"{si:.6g}" + ("" if unit in (None, "1") else f" {unit}")


def column_text(values: np.ndarray, kind: str, system: str) -> tuple[str, list[str]]:
    """A curve's values in one engineering unit (chosen by the largest), 4 significant figures: (unit, texts)."""
    unit = display_unit(values, kind, system)
    scaled = np.asarray(values, dtype=float) * unit_factor(unit, kind)
    texts = [f"{v:.0f}" if KINDS[kind].integer and np.isfinite(v) else format_number(float(v)) for v in scaled]
    return unit_name(unit, kind), texts


def field_text(si: float, kind: str, system: str) -> str:
    """An SI magnitude as text to type into a field: 6 significant figures in an engineering unit."""
    unit = display_unit(si, kind, system)
    return f"{si * unit_factor(unit, kind):.6g} {unit_name(unit, kind)}".strip()


def flag_heading(level: str) -> str:
    """The mark and word of a flag level, e.g. '!  caution' (marks padded so the words line up)."""
    return f"{LEVEL_MARKS[level]:<2} {LEVEL_WORDS[level]}"


def flag_text(flag: Flag) -> str:
    """A flag on one line: mark, level word, text ('!  caution: ...')."""
    return f"{flag_heading(flag.level)}: {printable(flag.text)}"


def reading_text(reading: Reading | tuple[Reading, ...] | str, system: str) -> str:
    """How a field's text was read, e.g. '= 24.17 Hz', or a weight in a mass field in the unit typed
    with the mass beside it in ``system``: '= 26.00 kip, read as weight: m = W/g0 = 26000 lb'."""
    if isinstance(reading, str):
        return f"= {printable(reading)}"
    if isinstance(reading, tuple):
        items = [format_value(r.si, r.kind, system) for r in reading]
        if len(items) > MOST_READINGS:
            return f"{len(items)} values: {items[0]} ... {items[-1]}"
        if reading and all(r.weight for r in reading):
            weights = ", ".join(printable(r.weight) for r in reading)
            return f"= {weights}, read as weights: m = W/g0 = {', '.join(items)}"
        return "= " + ", ".join(items)
    if reading.weight:
        mass = format_value(reading.si, reading.kind, system)
        return f"= {printable(reading.weight)}, read as weight: m = W/g0 = {mass}"
    if KINDS[reading.kind].integer:
        return f"= {reading.si:.0f}"
    if reading.note and "=" in reading.note:
        return reading.note
    written = "= " + format_value(reading.si, reading.kind, system)
    return f"{written}; {reading.note}" if reading.note else written
