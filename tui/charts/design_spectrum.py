"""Chart of check `design-spectrum`: EN 1998-1 elastic (and design) spectrum with the period marked."""

from __future__ import annotations

from typing import Any

from calc.result import Result
from tui.charts._seismic import MARK, acceleration_scale, thin, value


def draw_spectrum(plt: Any, result: Result, system: str) -> None:
    """Se(T) (and Sd(T) with q) against period, linear axis; the period marked with x."""
    scale, unit = acceleration_scale(system)
    period = result.series["period"]
    x, y = thin(period, result.series["spectral_acceleration"] / scale)
    plt.plot(x, y, marker="braille", label="Se")
    if "design_spectral_acceleration" in result.series:
        x, y = thin(period, result.series["design_spectral_acceleration"] / scale)
        plt.plot(x, y, marker="dot", label="Sd")
    marked = value(result, "spectral_acceleration")
    at = result.inputs["period"].value if "period" in result.inputs else None
    if marked is not None and at is not None:
        plt.vline(at)
        plt.scatter([at], [marked / scale], marker=MARK)
    plt.title(f"EN 1998-1 spectrum ({unit})")
    plt.xlabel("T (s)")
