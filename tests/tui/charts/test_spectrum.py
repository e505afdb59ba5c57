"""Charts of `spectrum`: psa on a log period axis with the overlay, the response at the period, the record."""

from __future__ import annotations

from helpers.charts import draw_panels


def test_psa_on_a_log_axis_with_1_2_5_ticks() -> None:
    picture = draw_panels("spectrum")[0]
    assert "psa (m/s^2)" in picture
    for tick in ("0.1", "1", "10"):
        assert tick in picture.splitlines()[-2]


def test_without_a_period_the_history_panel_says_so() -> None:
    pictures = draw_panels("spectrum", {"period": "", "design_ground_acceleration": "", "period_count": "30"})
    assert len(pictures) == 3 and "no period marked" in pictures[1].lower()


def test_us_units_show_accelerations_in_g() -> None:
    assert "psa (g)" in draw_panels("spectrum", system="us")[0]
