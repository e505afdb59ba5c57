"""Charts of `footfall`: band rows and the structure's frequencies."""

from __future__ import annotations

import pytest
from helpers.charts import draw_panels


def test_footfall_chart_without_lateral_frequencies() -> None:
    assert all(draw_panels("footfall", {"frequency": "7.5 Hz", "lateral_frequency": "", "structure": "floor"}))


@pytest.mark.parametrize("size", [(70, 18), (47, 11)])
def test_footfall_rows_stay_visible_in_a_small_panel(size: tuple[int, int]) -> None:
    vertical = draw_panels("footfall", size=size)[0]
    labels = {line.split("┤")[0].strip() for line in vertical.splitlines() if "┤" in line}
    assert set("WRJSH") <= labels
