"""Chart of `storeys`: mode shapes told apart by marker."""

from __future__ import annotations

import re

import plotext

from fieldmode.calc.checks import BY_ID
from fieldmode.tui.charts import panels_of


def test_chart_markers_tell_curves_apart_without_colour() -> None:
    spec = BY_ID["storeys"]
    result = spec.evaluate(spec.demo_texts())
    plotext.clf()
    plotext.plotsize(70, 18)
    panels_of("storeys")[0](plotext, result, "si")
    canvas = re.sub(r"\x1b\[[0-9;]*m", "", plotext.build())
    body = "\n".join(canvas.splitlines()[1:-2])
    assert all(marker in body for marker in "ox+")
