"""Charts of `occupants`: band spectra on log-log axes against the base curve x factor, the running RMS with the
MTVV marked."""

from __future__ import annotations

from helpers.charts import draw_panels, plot_area

from fieldmode.tui.charts.common import OPERATING_MARKER
from fieldmode.tui.charts.occupants import RAW_MARKER, WEIGHTED_MARKER, steps_125

CHART_VIEW = (49, 16)
"""About the plot of the chart view at 80x24."""


def test_band_panel_is_log_log_with_1_2_5_ticks_and_labelled_axes() -> None:
    bands, _ = draw_panels("occupants", size=CHART_VIEW)
    rows = bands.splitlines()
    # Common practice (no source): log axes ticked at 1-2-5
    assert rows[-2].split() == ["1", "2", "5", "10", "20", "50"]
    assert "band centre (Hz)" in bands and "RMS (mm/s^2)" in bands
    assert f"{RAW_MARKER} raw, {WEIGHTED_MARKER} Wb, line base x 4" in bands
    area = "".join(plot_area(bands))
    assert RAW_MARKER in area and WEIGHTED_MARKER in area


def test_running_panel_marks_the_mtvv() -> None:
    _, running = draw_panels("occupants", size=CHART_VIEW)
    assert "Running RMS, X MTVV" in running and "time (s)" in running and "a_w (mm/s^2)" in running
    assert any(OPERATING_MARKER in row for row in plot_area(running))


def test_the_line_follows_the_use_and_us_units_show_g() -> None:
    # From memory: ISO 10137 Annex C workshop factor 8
    bands, _ = draw_panels("occupants", {"use": "workshop"}, size=CHART_VIEW)
    assert "line base x 8" in bands
    bands, running = draw_panels("occupants", {"direction": "horizontal"}, system="us", size=CHART_VIEW)
    assert "RMS (g)" in bands and "x Wd" in bands and "a_w (g)" in running


def test_steps_125() -> None:
    # Common practice (no source): 1-2-5 ticks within the range
    assert steps_125(0.3, 60.0) == [0.5, 1.0, 2.0, 5.0, 10.0, 20.0, 50.0]
