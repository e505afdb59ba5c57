"""Chart of `isolate`: transmissibility against the frequency ratio."""

from __future__ import annotations

from helpers.charts import draw_panels


def test_transmissibility_panel_names_its_lines() -> None:
    (picture,) = draw_panels("isolate")
    assert "Transmissibility T" in picture and "r = 1.41" in picture and "r = f/fn" in picture
