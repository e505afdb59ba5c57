"""Every chart panel of every check draws from its demo result, in SI and US units."""

from __future__ import annotations

import re

import plotext
import plotext as plt
import pytest

from fieldmode.calc.checks import BY_ID
from fieldmode.tui.charts import panels_of
from fieldmode.tui.charts.common import OPERATING_MARKER

CASES = [
    ("sdof", {}),
    ("sdof", {"damping": "150 %"}),
    ("sdof", {"damping": ""}),
    ("forced", {}),
    ("forced", {"unbalance": "", "force": "2 kN", "frequency": "4 Hz"}),
    ("forced", {"frequency": "6000 rpm"}),
    ("isolate", {}),
    ("isolate", {"target_isolation": "", "stiffness": "42 kN/mm"}),
]


def _canvas(text: str) -> list[str]:
    """The rows inside the chart frame, without the y tick labels."""
    rows = plotext.uncolorize(text).splitlines()
    top = next(i for i, row in enumerate(rows) if "┌" in row)
    bottom = next(i for i, row in enumerate(rows) if "└" in row)
    return [row[min(row.index(c) for c in "│┤├" if c in row):] for row in rows[top + 1:bottom]]


def build(check: str, texts: dict[str, str], system: str = "si") -> list[str]:
    spec = BY_ID[check]
    result = spec.evaluate(texts)
    pictures = []
    for draw in panels_of(check):
        plt.clf()
        plt.plotsize(70, 18)
        plt.theme("clear")
        draw(plt, result, system)
        pictures.append(plt.build())
    return pictures


@pytest.mark.parametrize("check", ["storeys", "tmd", "footfall"])
@pytest.mark.parametrize("system", ["si", "us"])
def test_charts_build_at_80x24(check: str, system: str) -> None:
    spec = BY_ID[check]
    result = spec.evaluate(spec.demo_texts())
    assert panels_of(check)
    for draw in panels_of(check):
        plotext.clf()
        plotext.plotsize(70, 18)
        draw(plotext, result, system)
        canvas = re.sub(r"\x1b\[[0-9;]*m", "", plotext.build())
        assert len(canvas.splitlines()) == 18
        assert max(len(line) for line in canvas.splitlines()) <= 70


@pytest.mark.parametrize(("check", "change"), CASES)
@pytest.mark.parametrize("system", ["si", "us"])
def test_each_panel_draws_with_its_marker(check: str, change: dict[str, str], system: str) -> None:
    spec = BY_ID[check]
    result = spec.evaluate({**spec.demo_texts(), **change})
    for draw in panels_of(check):
        plotext.clf()
        plotext.plotsize(70, 18)
        draw(plotext, result, system)
        canvas = _canvas(plotext.build())
        assert any(OPERATING_MARKER in row for row in canvas), draw.__name__


def test_every_registered_check_has_charts_and_they_are_callables() -> None:
    for check in ("sdof", "forced", "isolate"):
        assert panels_of(check) and all(callable(draw) for draw in panels_of(check))


@pytest.mark.parametrize("system", ["si", "us"])
@pytest.mark.parametrize("check", ["period", "design-spectrum", "spectrum"])
def test_demo_charts_draw_with_marked_period(check: str, system: str) -> None:
    pictures = build(check, BY_ID[check].demo_texts(), system)
    assert pictures
    first = pictures[0]
    assert "X" in first  # the marked period is a distinct marker, readable without colour
    assert len(first.splitlines()) <= 18
