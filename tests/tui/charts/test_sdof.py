"""Chart of `sdof`: the free response in the chosen units."""

from __future__ import annotations

from helpers.charts import draw_panels


def test_free_response_is_shown_in_the_chosen_units() -> None:
    # Common practice (no source): millimetres in SI, inches in US customary for a 1 mm response
    for system, unit in (("si", "mm"), ("us", "in")):
        assert f"u ({unit})" in draw_panels("sdof", system=system)[0]
