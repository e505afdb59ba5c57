"""Chart panels drawn with the real plotext at 70 x 18: they run and show the marked point."""

from __future__ import annotations

import numpy as np
import plotext
import pytest

from fieldmode.calc.checks import BY_ID
from fieldmode.tui.charts import panels_of
from fieldmode.tui.charts.common import OPERATING_MARKER, downsample

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


def test_free_response_is_shown_in_the_chosen_units() -> None:
    result = BY_ID["sdof"].evaluate(BY_ID["sdof"].demo_texts())
    for system, unit in (("si", "mm"), ("us", "in")):
        plotext.clf()
        plotext.plotsize(70, 18)
        panels_of("sdof")[0](plotext, result, system)
        assert f", {unit} " in plotext.uncolorize(plotext.build())


def test_every_registered_check_has_charts_and_they_are_callables() -> None:
    for check in ("sdof", "forced", "isolate"):
        assert panels_of(check) and all(callable(draw) for draw in panels_of(check))


def test_downsample_keeps_the_peak_and_the_ends() -> None:
    x = np.linspace(0.0, 3.0, 5001)
    y = 1.0 / np.hypot(1 - x**2, 0.02 * x)
    kept_x, kept_y = downsample(x, y, 120)
    assert len(kept_x) <= 122
    # Common practice (no source): min-max decimation keeps every extreme of the curve
    assert max(kept_y) == y.max()
    assert kept_x[0] == 0.0 and kept_x[-1] == 3.0
