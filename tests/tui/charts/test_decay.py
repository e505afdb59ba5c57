"""Charts of `decay`: the record with its envelope and peaks, and the spectrum."""

from __future__ import annotations

import pytest

from fieldmode.calc.checks import BY_ID
from fieldmode.tui.charts import panels_of


@pytest.mark.parametrize("system", ["si", "us"])
def test_decay_charts_draw_with_plotext(system: str) -> None:
    import plotext as plt

    result = BY_ID["decay"].evaluate(BY_ID["decay"].demo_texts())
    assert len(panels_of("decay")) == 2
    texts = []
    for draw in panels_of("decay"):
        plt.clf()
        plt.plotsize(49, 16)  # the chart pane at 80x24: plotext drops a title wider than the chart
        draw(plt, result, system)
        texts.append(plt.build())
    record, spectrum = texts
    assert "Record (" in record and "envelope" in record and "peaks x" in record
    assert "half-power" in spectrum and "6.6" in spectrum
    assert "(m/s^2)" in record or "(mm/s^2)" in record or "(g)" in record


def test_decay_charts_survive_a_result_without_series() -> None:
    import plotext as plt

    result = BY_ID["decrement"].evaluate(BY_ID["decrement"].demo_texts())
    for draw in panels_of("decay"):
        plt.clf()
        plt.plotsize(60, 18)
        draw(plt, result, "si")
        assert isinstance(plt.build(), str)
