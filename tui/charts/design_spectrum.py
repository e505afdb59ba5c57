"""Chart of check `design-spectrum`: EN 1998-1 elastic (and design) spectrum with the period marked."""

from __future__ import annotations

from typing import Any

from fieldmode.calc.framework.result import Result
from fieldmode.tui.charts.common import LINE_MARKER, axis_scale, downsample, mark_period


def draw_spectrum(plt: Any, result: Result, system: str) -> None:
    """Se(T) (and Sd(T) with q) against period, linear axis; the period marked with X."""
    period = result.series["period"]
    scale, unit = axis_scale("acceleration", system, result.series["spectral_acceleration"])
    x, y = downsample(period, result.series["spectral_acceleration"] * scale)
    plt.plot(x, y, marker=LINE_MARKER, label="Se")
    if "design_spectral_acceleration" in result.series:
        x, y = downsample(period, result.series["design_spectral_acceleration"] * scale)
        plt.plot(x, y, marker="dot", label="Sd")
    marked = result.number("spectral_acceleration")
    at = result.inputs["period"].value if "period" in result.inputs else None
    mark_period(plt, at, None if marked is None else marked * scale)
    plt.title("EN 1998-1 spectrum, X period")
    plt.xlabel("T (s)")
    plt.ylabel(f"Se ({unit})")


PANELS = (draw_spectrum,)
"""The chart panels of the check, in the order they are shown."""
