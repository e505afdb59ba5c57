"""Charts of `ppv`: each axis's PPV at its frequency on the guideline's line, and the time history."""

from __future__ import annotations

import pytest
from helpers.charts import draw_panels, plot_area

from fieldmode.calc.checks import BY_ID

PANE = (49, 16)
"""The chart pane at 80x24 in chart view: plotext drops a title wider than the chart."""


@pytest.mark.parametrize("system", ["si", "us"])
def test_guideline_panel_has_title_axis_label_units_and_a_marker_per_axis(system: str) -> None:
    guideline, history = draw_panels("ppv", {"guideline": "din-foundation-2"}, system=system, size=PANE)
    unit = "(mm/s)" if system == "si" else "(in/s)"
    assert "PPV by axis x o + on the guideline line" in guideline
    assert "frequency at the peak (Hz)" in guideline and f"PPV {unit}" in guideline
    # Source: DIN 4150-3:1999 Table 1 runs from 1 to 100 Hz: the log axis carries 1-2-5 ticks over it
    ticks = guideline.splitlines()[-2].split()
    assert ticks[0] == "1" and "10" in ticks and ticks[-1] == "100"
    area = "\n".join(plot_area(guideline))
    assert "x" in area or "+" in area
    assert "Velocity by axis, peaks x o +" in history and "time (s)" in history and f"v {unit}" in history
    assert sum(marker in "\n".join(plot_area(history)) for marker in "xo+") >= 2


def test_people_panel_draws_the_bs5228_levels() -> None:
    guideline, _ = draw_panels("ppv", {"guideline": "bs5228-people"}, size=PANE)
    assert "BS 5228-2 levels" in guideline
    # From memory: BS 5228-2 Annex B Table B.1 levels 0.14, 0.3, 1.0 and 10 mm/s: the 1-2-5 ticks span them
    assert "10" in guideline and "0.2" in guideline


def test_a_record_of_one_axis_draws_one_marker() -> None:
    result = BY_ID["ppv"].evaluate({**BY_ID["ppv"].demo_texts(), "axes": "z"})
    guideline, history = draw_panels("ppv", result=result, size=PANE)
    assert "by axis x on" in guideline and "peaks x" in history
