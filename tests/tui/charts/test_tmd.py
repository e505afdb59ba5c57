"""Charts of `tmd`: the structure with and without the damper, and the damper mistuned."""

from __future__ import annotations

from helpers.charts import draw_panels, plot_area


def test_curves_are_told_apart_by_marker() -> None:
    response, mistuning = draw_panels("tmd")
    assert all(marker in "".join(plot_area(response)) for marker in ".*")
    assert all(marker in "".join(plot_area(mistuning)) for marker in "*-+")
