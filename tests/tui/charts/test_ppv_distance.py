"""Chart of `ppv-distance`: predicted PPV against distance on log-log axes, the limit and the distance given."""

from __future__ import annotations

from helpers.charts import draw_panels, plot_area

from fieldmode.tui.charts.common import OPERATING_MARKER, log_ticks

CHART_VIEW = (49, 16)
"""About the plot of the chart view at 80x24."""


def test_the_panel_shows_the_limit_the_distance_and_its_units_at_80x24() -> None:
    # Common practice (no source): a limit is a line, the point asked about a letter, readable without colour
    (picture,) = draw_panels("ppv-distance", size=CHART_VIEW)
    assert "Predicted PPV, X given, - limit" in picture and "distance (m)" in picture and "PPV (mm/s)" in picture
    area = plot_area(picture)
    assert any(row.count("-") > 30 for row in area)
    assert any(OPERATING_MARKER in row for row in area)
    # log axes labelled 1-2-5
    assert all(label in picture for label in ("1", "2", "5", "10", "20", "50", "100"))


def test_us_units() -> None:
    (picture,) = draw_panels("ppv-distance", system="us", size=CHART_VIEW)
    assert "PPV (in/s)" in picture and "distance (ft)" in picture


def test_without_a_limit_or_distance_the_curve_is_still_drawn() -> None:
    (picture,) = draw_panels("ppv-distance", {"limit": ""}, size=CHART_VIEW)
    assert not any(row.count("-") > 30 for row in plot_area(picture))
    (picture,) = draw_panels("ppv-distance", {"distance": ""}, size=CHART_VIEW)
    assert not any(OPERATING_MARKER in row for row in plot_area(picture))


def test_log_ticks_step_one_two_five() -> None:
    # Common practice (no source): log axes are labelled 1, 2, 5 per decade
    assert log_ticks(1.0, 100.0) == [1, 2, 5, 10, 20, 50, 100]
    assert log_ticks(0.3, 4.0) == [0.5, 1, 2]
    assert log_ticks(0.01, 1000.0) == [0.01, 0.1, 1, 10, 100, 1000]
