"""Chart of check `period`: approximate period against height, EN 1998-1 and ASCE 7, building marked."""

from __future__ import annotations

from typing import Any

from calc.result import Result
from tui.charts.common import LINE_MARKER, OPERATING_MARKER, optional_value


def draw_period(plt: Any, result: Result, system: str) -> None:
    """T1 (EN 1998-1) and Ta (ASCE 7) against height; the building marked with X on both."""
    metres = system != "us"
    factor, unit = (1.0, "m") if metres else (1.0 / 0.3048, "ft")
    height = (result.series["height"] * factor).tolist()
    plt.plot(height, result.series["period_en"].tolist(), marker=LINE_MARKER, label="EN")
    plt.plot(height, result.series["period_asce"].tolist(), marker="dot", label="ASCE")
    h = result.inputs["height"].value if "height" in result.inputs else None
    en, asce = optional_value(result, "period"), optional_value(result, "period_asce")
    if h is not None and en is not None and asce is not None:
        plt.vline(h * factor)
        plt.scatter([h * factor, h * factor], [en, asce], marker=OPERATING_MARKER)
    plt.title("period T (s)")
    plt.xlabel(f"height ({unit})")
