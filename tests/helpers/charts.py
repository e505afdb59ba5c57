"""Draw a check's chart panels with plotext as the app does, and read what they draw."""

from __future__ import annotations

import dataclasses
from collections.abc import Mapping

import plotext

from fieldmode.calc.checks import BY_ID
from fieldmode.calc.framework.result import Result
from fieldmode.tui.charts import panels_of

SIZE = (70, 18)
"""About the plot area of the chart pane at 80x24."""


def draw_panels(check: str, texts: Mapping[str, str] | None = None, system: str = "si",
                result: Result | None = None, size: tuple[int, int] = SIZE) -> list[str]:
    """Every panel of ``check`` drawn for ``texts`` (default the demo) or a given result, as plain text."""
    if result is None:
        spec = BY_ID[check]
        result = spec.evaluate({**spec.demo_texts(), **(texts or {})})
    pictures = []
    for draw in panels_of(check):
        plotext.clf()
        plotext.plotsize(*size)
        plotext.theme("clear")
        draw(plotext, result, system)
        pictures.append(plotext.uncolorize(plotext.build()))
    return pictures


def plot_area(picture: str) -> list[str]:
    """The rows inside the chart frame, without the tick labels on the left."""
    rows = picture.splitlines()
    top = next(i for i, row in enumerate(rows) if "┌" in row)
    bottom = next(i for i, row in enumerate(rows) if "└" in row)
    return [row[min(row.index(c) for c in "│┤├" if c in row):] for row in rows[top + 1:bottom]]


class ReadSeries(dict):  # type: ignore[type-arg]
    """A result's series that remembers every name a chart asked for (read or tested)."""

    def __init__(self, series: Mapping[str, object]) -> None:
        super().__init__(series)
        self.asked: set[str] = set()

    def __getitem__(self, name: str) -> object:
        self.asked.add(name)
        return super().__getitem__(name)

    def get(self, name: str, default: object = None) -> object:  # type: ignore[override]
        self.asked.add(name)
        return super().get(name, default)

    def __contains__(self, name: object) -> bool:
        self.asked.add(str(name))
        return super().__contains__(name)


def watched(result: Result) -> tuple[Result, ReadSeries]:
    """A copy of ``result`` whose series record the names read."""
    series = ReadSeries(result.series)
    return dataclasses.replace(result, series=series), series
