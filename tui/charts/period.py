"""Chart of check `period`: approximate period against height, EN 1998-1 and ASCE 7, building marked."""

from __future__ import annotations

from typing import Any

from fieldmode.calc.framework.result import Result
from fieldmode.tui.charts.common import LINE_MARKER, OPERATING_MARKER, axis_scale


def draw_period(plt: Any, result: Result, system: str) -> None:
    """T1 (EN 1998-1) and Ta (ASCE 7) against height; the building marked with X on both."""
    factor, unit = axis_scale("length", system, result.series["height"])
    height = (result.series["height"] * factor).tolist()
    plt.plot(height, result.series["period_en"].tolist(), marker=LINE_MARKER, label="EN")
    plt.plot(height, result.series["period_asce"].tolist(), marker="dot", label="ASCE")
    h = result.inputs["height"].value if "height" in result.inputs else None
    en, asce = result.number("period"), result.number("period_asce")
    if h is not None and en is not None and asce is not None:
        plt.vline(h * factor)
        plt.scatter([h * factor, h * factor], [en, asce], marker=OPERATING_MARKER)
    plt.title(f"Approximate period, {OPERATING_MARKER} building")
    plt.xlabel(f"height ({unit})")
    plt.ylabel("T (s)")


PANELS = (draw_period,)
"""The chart panels of the check, in the order they are shown."""
