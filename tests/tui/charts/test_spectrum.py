"""Charts of `spectrum` (and the design spectrum's) with and without optional inputs."""

from __future__ import annotations

import plotext as plt

from fieldmode.calc.checks import BY_ID
from fieldmode.tui.charts import panels_of


def build(check: str, texts: dict[str, str], system: str = "si") -> list[str]:
    spec = BY_ID[check]
    result = spec.evaluate(texts)
    pictures = []
    for draw in panels_of(check):
        plt.clf()
        plt.plotsize(70, 18)
        plt.theme("clear")
        draw(plt, result, system)
        pictures.append(plt.build())
    return pictures


def test_spectrum_chart_log_axis_and_overlay() -> None:
    picture = build("spectrum", BY_ID["spectrum"].demo_texts())[0]
    assert "psa (m/s^2)" in picture
    for tick in ("0.1", "1", "10"):
        assert tick in picture.splitlines()[-2]


def test_charts_without_optional_inputs() -> None:
    spec = BY_ID["spectrum"]
    texts = {**spec.demo_texts(), "period": "", "design_ground_acceleration": "", "period_count": "30"}
    pictures = build("spectrum", texts)
    assert len(pictures) == 3 and "no period marked" in pictures[1]
    design = {**BY_ID["design-spectrum"].demo_texts(), "behaviour_factor": "", "mass": ""}
    assert build("design-spectrum", design)
