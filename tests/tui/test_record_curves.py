"""Curves in the calc record: thinned tables that keep the extremes, in display units; every point in JSON."""

from __future__ import annotations

import re

import numpy as np
import pint
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from fieldmode.calc.checks import SPECS
from fieldmode.calc.framework.kinds import KINDS
from fieldmode.tui.record_curves import MAX_ROWS, kept_rows, table_markdown, tables

UNITS = pint.UnitRegistry()


def markdown_tables(lines: list[str]) -> list[tuple[str, list[str], list[list[str]], str]]:
    """(heading, header cells, body rows, line under the table) of every '####' table in Markdown lines."""
    found = []
    for index, line in enumerate(lines):
        if not line.startswith("#### "):
            continue
        assert lines[index + 1] == "" and lines[index + 3].startswith("| ---")
        body, row = [], index + 4
        while lines[row].startswith("|"):
            body.append([cell.strip() for cell in re.split(r"(?<!\\)\|", lines[row])[1:-1]])
            row += 1
        found.append((line, [cell.strip() for cell in lines[index + 2].split("|")[1:-1]], body, lines[row + 1]))
    return found


@settings(max_examples=200, deadline=None)
@given(st.lists(st.floats(-1e6, 1e6), min_size=1, max_size=400), st.integers(1, 6))
def test_kept_rows_fit_and_keep_first_last_and_extremes(values: list[float], curves: int) -> None:
    rng = np.random.default_rng(len(values))
    columns = [np.array(values)] + [rng.permutation(values) for _ in range(curves - 1)]
    rows, step = kept_rows(columns)
    # Common practice (no source): a table of a curve keeps its ends and its extremes
    assert len(rows) <= MAX_ROWS and rows == sorted(set(rows))
    assert rows[0] == 0 and rows[-1] == len(values) - 1
    for column in columns:
        assert column[rows].max() == column.max() and column[rows].min() == column.min()  # Oracle: numpy max/min
    if len(values) <= MAX_ROWS:
        assert rows == list(range(len(values))) and step == 1
    else:
        assert set(range(0, len(values), step)) <= set(rows)


def test_non_finite_points_are_not_taken_for_extremes() -> None:
    values = np.array([1.0, np.nan, 7.0, np.inf, -3.0] * 20)
    rows, _ = kept_rows([values])
    finite = values[rows][np.isfinite(values[rows])]
    assert finite.max() == 7.0 and finite.min() == -3.0


@pytest.mark.parametrize("system", ["si", "us"])
@pytest.mark.parametrize("spec", [s for s in SPECS if s.series], ids=[s.id for s in SPECS if s.series])
def test_every_curve_is_in_a_table_of_at_most_the_row_limit_with_its_largest_value(spec, system) -> None:
    result = spec.evaluate(spec.demo_texts())
    shown = set()
    for table in tables(spec, result):
        lines = table_markdown(table, result, system)
        [(heading, header, body, under)] = markdown_tables(lines)
        assert 1 <= len(body) <= MAX_ROWS
        count = len(result.series[table.curves[0].name])
        assert under in ("1 point.", f"All {count} points.") or re.match(
            rf"Every \d+(st|nd|rd|th) of {count} points", under), under
        columns = ([table.abscissa] if table.abscissa else []) + list(table.curves)
        assert len(header) == len(columns)
        for position, (curve, title) in enumerate(zip(columns, header, strict=True)):
            shown.add(curve.name)
            assert title.startswith(curve.label)
            values = np.asarray(result.series[curve.name], dtype=float)
            if curve in table.curves and np.isfinite(values).any():
                unit = re.fullmatch(r" \((.+)\)", title[len(curve.label):])  # the unit after the label, if any
                kind = result.series_kinds[curve.name]
                cells = np.array([float(row[position]) for row in body])
                named = {"g": "standard_gravity"}.get(unit.group(1), unit.group(1)) if unit else ""
                # Oracle: pint converts the unit named in the header to the kind's SI unit
                scale = UNITS.Quantity(1.0, named).to(KINDS[kind].si or "dimensionless").magnitude if named else 1.0
                finite = values[np.isfinite(values)]
                # Common practice (no source): 4 significant figures keep the largest value within 0.05 %
                assert np.nanmax(cells) * scale == pytest.approx(finite.max(), rel=5e-4, abs=1e-12)
                assert np.nanmin(cells) * scale == pytest.approx(finite.min(), rel=5e-4, abs=1e-12)
    assert shown == set(result.series), set(result.series) - shown
