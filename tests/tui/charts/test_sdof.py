"""Chart of `sdof`: the free response in the chosen units."""

from __future__ import annotations

import plotext

from fieldmode.calc.checks import BY_ID
from fieldmode.tui.charts import panels_of


def test_free_response_is_shown_in_the_chosen_units() -> None:
    result = BY_ID["sdof"].evaluate(BY_ID["sdof"].demo_texts())
    for system, unit in (("si", "mm"), ("us", "in")):
        plotext.clf()
        plotext.plotsize(70, 18)
        panels_of("sdof")[0](plotext, result, system)
        assert f", {unit} " in plotext.uncolorize(plotext.build())
