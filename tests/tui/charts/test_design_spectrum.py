"""Chart of `design-spectrum`: the EN 1998-1 spectrum in the display unit of the system."""

from __future__ import annotations

from helpers.charts import draw_panels


def test_title_names_the_code_and_the_unit() -> None:
    assert "Se (m/s^2)" in draw_panels("design-spectrum")[0]
    assert "Se (g)" in draw_panels("design-spectrum", system="us")[0]


def test_draws_without_the_design_spectrum() -> None:
    assert draw_panels("design-spectrum", {"behaviour_factor": "", "mass": ""})[0]
