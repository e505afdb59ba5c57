"""Charts of `footbridge`: stream acceleration against crowd density, vertical and lateral, with the limits."""

from __future__ import annotations

from helpers.charts import draw_panels, plot_area

from fieldmode.tui.charts.common import OPERATING_MARKER

CHART_VIEW = (49, 16)
"""About the plot of the chart view at 80x24."""


def test_both_directions_show_their_limit_and_the_crowd_at_80x24() -> None:
    # Common practice (no source): a limit is a line, the crowd given a letter, readable without colour
    vertical, lateral = draw_panels("footbridge", size=CHART_VIEW)
    assert "Vertical a (m/s^2), X crowd" in vertical and "Lateral a (mm/s^2), X crowd, | lock-in" in lateral
    for picture in (vertical, lateral):
        assert any(row.count("─") > 30 for row in plot_area(picture))
        assert any(OPERATING_MARKER in row for row in plot_area(picture))
        assert "crowd density (1/m^2)" in picture


def test_us_units_on_both_axes() -> None:
    # Common practice (no source): US customary results show accelerations in g, densities per square foot
    vertical, _ = draw_panels("footbridge", system="us", size=CHART_VIEW)
    assert "Vertical a (g)" in vertical and "crowd density (1/ft^2)" in vertical


def test_without_a_lateral_frequency_the_lateral_panel_says_so() -> None:
    assert "No lateral frequency given" in draw_panels("footbridge", {"lateral_frequency": ""}, size=CHART_VIEW)[1]
