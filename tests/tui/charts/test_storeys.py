"""Chart of `storeys`: mode shapes told apart by marker."""

from __future__ import annotations

from helpers.charts import draw_panels, plot_area


def test_chart_markers_tell_curves_apart_without_colour() -> None:
    body = "\n".join(plot_area(draw_panels("storeys")[0]))
    assert all(marker in body for marker in "ox+")


def test_height_axis_or_floor_numbers() -> None:
    assert "height (m)" in draw_panels("storeys")[0]
    assert "floor" in draw_panels("storeys", {"heights": ""})[0]
