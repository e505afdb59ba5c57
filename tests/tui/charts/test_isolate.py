"""Chart of `isolate`: transmissibility against the frequency ratio."""

from __future__ import annotations

from helpers.charts import draw_panels


def test_transmissibility_panel_names_its_lines() -> None:
    (picture,) = draw_panels("isolate")
    assert "Transmissibility T" in picture and "r = 1.41" in picture and "r = f/fn" in picture


def test_an_undamped_mount_is_drawn_with_a_finite_curve() -> None:
    # without damping T = 1/|1 - r^2| has no bound at r = 1: the curve is drawn up to T = 1000
    (picture,) = draw_panels("isolate", {"damping": "0", "target_isolation": "", "stiffness": "42 kN/mm"})
    assert "Transmissibility T" in picture and "r = f/fn" in picture
    assert "inf" not in picture.lower() and "nan" not in picture.lower()
