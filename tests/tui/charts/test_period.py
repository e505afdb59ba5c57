"""Chart of `period`: both codes' periods against height, in the unit system chosen."""

from __future__ import annotations

from helpers.charts import draw_panels


def test_height_axis_in_metres_or_feet() -> None:
    assert "height (m)" in draw_panels("period")[0]
    assert "height (ft)" in draw_panels("period", system="us")[0]
