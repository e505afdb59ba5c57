"""Chart of check `design-spectrum`: EN 1998-1 elastic (and design) spectrum with the period marked."""

from __future__ import annotations

from typing import Any

from calc.result import Result
from tui.charts._seismic import acceleration_scale, mark_period
from tui.charts.common import LINE_MARKER, downsample, optional_value


def draw_spectrum(plt: Any, result: Result, system: str) -> None:
    """Se(T) (and Sd(T) with q) against period, linear axis; the period marked with X."""
    scale, unit = acceleration_scale(system)
    period = result.series["period"]
    x, y = downsample(period, result.series["spectral_acceleration"] / scale)
    plt.plot(x, y, marker=LINE_MARKER, label="Se")
    if "design_spectral_acceleration" in result.series:
        x, y = downsample(period, result.series["design_spectral_acceleration"] / scale)
        plt.plot(x, y, marker="dot", label="Sd")
    marked = optional_value(result, "spectral_acceleration")
    at = result.inputs["period"].value if "period" in result.inputs else None
    mark_period(plt, at, None if marked is None else marked / scale)
    plt.title(f"EN 1998-1 spectrum ({unit})")
    plt.xlabel("T (s)")
