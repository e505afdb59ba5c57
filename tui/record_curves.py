"""The curves of a result in the calc record: Markdown tables thinned to a readable size, and JSON in full.

Curves drawn against the same abscissa (``Series.against``) share one table, the abscissa first;
a series that is neither drawn against another nor an abscissa of one is a table of its own. A table
longer than :data:`MAX_ROWS` keeps every Nth point plus the first, the last, and the largest and
smallest value of each curve, and says so under it. Values are in the display units of the record's
unit system; the JSON file holds every point in SI.
"""

from __future__ import annotations

import math
from collections.abc import Sequence
from dataclasses import dataclass

import numpy as np

from fieldmode.calc.framework.result import Result
from fieldmode.calc.framework.spec import CheckSpec, Series
from fieldmode.tui.present import column_text

MAX_ROWS = 25
"""Most rows of a curve table."""
MAX_CURVES = (MAX_ROWS - 2) // 2
"""Most curves in one table: the first and last rows and each curve's largest and smallest must fit."""


@dataclass(frozen=True)
class Table:
    """Curves shown together: the abscissa (None for a series on its own) and the curves."""

    abscissa: Series | None
    curves: tuple[Series, ...]


def tables(spec: CheckSpec, result: Result) -> list[Table]:
    """The tables of a result's curves, in the order the check declares them."""
    present = [curve for curve in spec.series if curve.name in result.series]
    names = {curve.name for curve in present}
    by_name = {curve.name: curve for curve in present}
    groups: dict[str, list[Series]] = {}
    alone: list[Series] = []
    for curve in present:
        against = by_name.get(curve.against or "")
        if against is not None and len(result.series[curve.name]) == len(result.series[against.name]):
            groups.setdefault(against.name, []).append(curve)
        elif not any(other.against == curve.name and other.against in names for other in present):
            alone.append(curve)
    found = [Table(by_name[name], tuple(curves[start:start + MAX_CURVES]))
             for name, curves in groups.items() for start in range(0, len(curves), MAX_CURVES)]
    return found + [Table(None, (curve,)) for curve in alone]


def kept_rows(curves: Sequence[np.ndarray], limit: int = MAX_ROWS) -> tuple[list[int], int]:
    """Rows kept of curves of one length, and the step N of 'every Nth point' (1 when all are kept).

    The first and last rows and each curve's largest and smallest finite value are always kept
    (at most ``limit`` rows when there are at most (limit - 2) / 2 curves).
    """
    count = len(curves[0])
    if count <= limit:
        return list(range(count)), 1
    must = {0, count - 1}
    for values in curves:
        finite = np.flatnonzero(np.isfinite(values))
        if finite.size:
            must |= {int(finite[np.argmax(values[finite])]), int(finite[np.argmin(values[finite])])}
    step = max(1, math.ceil((count - 1) / (limit - 1)))
    while True:
        rows = sorted(must | set(range(0, count, step)))
        if len(rows) <= limit or step >= count:
            return rows, step
        step += 1


def _ordinal(number: int) -> str:
    suffix = "th" if 10 <= number % 100 <= 20 else {1: "st", 2: "nd", 3: "rd"}.get(number % 10, "th")
    return f"{number}{suffix}"


def _cell(text: str) -> str:
    return text.replace("|", "\\|")


def table_markdown(table: Table, result: Result, system: str) -> list[str]:
    """One table as Markdown lines: a heading, the header with units, the kept rows and how they were kept."""
    columns = ([table.abscissa] if table.abscissa is not None else []) + list(table.curves)
    rows, step = kept_rows([np.asarray(result.series[curve.name], dtype=float) for curve in table.curves])
    header, cells = [], []
    for curve in columns:
        unit, texts = column_text(np.asarray(result.series[curve.name], dtype=float),
                                  result.series_kinds[curve.name], system)
        header.append(_cell(f"{curve.label} ({unit})" if unit else curve.label))
        cells.append(texts)
    count = len(cells[0])
    heading = "#### " + (f"Against {table.abscissa.label}" if table.abscissa is not None else table.curves[0].label)
    if step == 1:
        said = "1 point." if count == 1 else f"All {count} points."
    else:
        said = (f"Every {_ordinal(step)} of {count} points, with the first, the last, and the largest and smallest "
                f"of each curve ({len(rows)} rows); the JSON file has every point.")
    return [heading, "", "| " + " | ".join(header) + " |", "|" + " --- |" * len(header),
            *("| " + " | ".join(_cell(column[row]) for column in cells) + " |" for row in rows), "", said, ""]


def curves_markdown(spec: CheckSpec, result: Result, system: str) -> list[str]:
    """Every curve table of a result ([] when it has no curves)."""
    lines: list[str] = []
    for table in tables(spec, result):
        lines += table_markdown(table, result, system)
    return lines
