"""Charts of `floor`: the response factor by pacing rate and by floor frequency, the limit and the floor marked."""

from __future__ import annotations

import pytest
from helpers.charts import draw_panels, plot_area

from fieldmode.tui.charts.common import OPERATING_MARKER

CHART_VIEW = (49, 16)
"""About the plot of the chart view at 80x24."""


def limit_row(picture: str) -> bool:
    """Whether a horizontal line crosses the plot (the limit)."""
    return any(row.count("─") > 30 for row in plot_area(picture))


@pytest.mark.parametrize("texts", [{}, {"frequency": "12 Hz", "damping": "0 %", "effective_weight": ""}])
def test_both_panels_show_the_limit_and_mark_the_floor_at_80x24(texts: dict[str, str]) -> None:
    # Common practice (no source): a limit is a line, the floor a letter, readable without colour
    by_pace, by_frequency = draw_panels("floor", texts, size=CHART_VIEW)
    for picture, title in ((by_pace, "Response factor by pace, limit 4"), (by_frequency, "R by floor frequency")):
        assert title in picture
        assert limit_row(picture)
        assert any(OPERATING_MARKER in row for row in plot_area(picture))
    assert "pacing rate (Hz)" in by_pace and "floor frequency (Hz)" in by_frequency


def test_the_limit_follows_the_occupancy() -> None:
    # From memory: ISO 10137 Annex C workshop factor 8
    assert "limit 8" in draw_panels("floor", {"occupancy": "workshop"}, size=CHART_VIEW)[0]
