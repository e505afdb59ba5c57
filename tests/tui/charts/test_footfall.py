"""Charts of `footfall`: band rows and the structure's frequencies."""

from __future__ import annotations

import re

import plotext
import pytest

from fieldmode.calc.checks import BY_ID
from fieldmode.tui.charts import panels_of


def test_footfall_chart_without_lateral_frequencies() -> None:
    spec = BY_ID["footfall"]
    result = spec.evaluate({"frequency": "7.5 Hz", "structure": "floor"})
    for draw in panels_of("footfall"):
        plotext.clf()
        plotext.plotsize(70, 18)
        draw(plotext, result, "si")
        assert plotext.build()


@pytest.mark.parametrize(("size", "rows"), [((70, 18), "WRJSH"), ((47, 11), "WRJSH")])
def test_footfall_rows_stay_visible_in_a_small_panel(size: tuple[int, int], rows: str) -> None:
    spec = BY_ID["footfall"]
    result = spec.evaluate(spec.demo_texts())
    plotext.clf()
    plotext.plotsize(*size)
    panels_of("footfall")[0](plotext, result, "si")
    canvas = re.sub(r"\x1b\[[0-9;]*m", "", plotext.build())
    labels = {line.split("┤")[0].strip() for line in canvas.splitlines() if "┤" in line}
    assert set(rows) <= labels
