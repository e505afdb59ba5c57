"""Charts of `decay`: the record with its envelope and peaks, and the spectrum."""

from __future__ import annotations

import pytest
from helpers.charts import draw_panels

from fieldmode.calc.checks import BY_ID


@pytest.mark.parametrize("system", ["si", "us"])
def test_record_and_spectrum_at_the_pane_size(system: str) -> None:
    # the chart pane at 80x24 in chart view: plotext drops a title wider than the chart
    record, spectrum = draw_panels("decay", system=system, size=(49, 16))
    assert "Record:" in record and "envelope" in record and "peaks x" in record
    assert "half-power" in spectrum and "6.6" in spectrum
    assert "signal (m/s^2)" in record or "signal (mm/s^2)" in record or "signal (g)" in record


def test_decay_charts_survive_a_result_without_series() -> None:
    result = BY_ID["decrement"].evaluate(BY_ID["decrement"].demo_texts())
    assert all(isinstance(picture, str) for picture in draw_panels("decay", result=result))
