"""Chart of `machine`: the severity zone against r.m.s. velocity as steps, the measured velocity marked."""

from __future__ import annotations

from helpers.charts import draw_panels, plot_area

from fieldmode.tui.charts.common import OPERATING_MARKER

CHART_VIEW = (49, 16)
"""About the plot of the chart view at 80x24."""


def test_the_zones_are_labelled_and_the_measured_value_marked_at_80x24() -> None:
    picture, _ = draw_panels("machine", size=CHART_VIEW)
    assert "Zone by r.m.s. velocity, X measured" in picture and "velocity r.m.s. (mm/s)" in picture
    rows = picture.splitlines()
    for zone in "ABCD":
        assert any(row.startswith(f"{zone}┤") for row in rows), zone
    marked = [row for row in plot_area(picture) if OPERATING_MARKER in row]
    assert marked
    # the demo's 3.1 mm/s is in zone B: the X is on the B row
    assert next(row for row in rows if OPERATING_MARKER in row and "┤" in row).startswith("B┤")


def test_us_units_and_no_velocity() -> None:
    picture, _ = draw_panels("machine", system="us", size=CHART_VIEW)
    assert "velocity r.m.s. (in/s)" in picture
    picture, _ = draw_panels("machine", {"velocity": ""}, size=CHART_VIEW)
    assert "No measured velocity given" in picture


def test_balance_panel_draws_the_grade_its_neighbours_and_the_speed() -> None:
    _, picture = draw_panels("machine", size=CHART_VIEW)
    assert "Permissible eccentricity, . next grades" in picture and "e_per (µm)" in picture and "speed (rpm)" in picture
    area = plot_area(picture)
    assert any(OPERATING_MARKER in row for row in area)
    assert sum(row.count(".") for row in area) > 40  # the grades either side, dotted
    _, picture = draw_panels("machine", {"grade": ""}, size=CHART_VIEW)
    assert "No balance grade given" in picture
