"""Charts of check `spectrum`: psa on a log period axis with the EN 1998-1 overlay, the response at the
marked period, and the record."""

from __future__ import annotations

from typing import Any

from fieldmode.calc.framework.result import Result
from fieldmode.tui.charts.common import LINE_MARKER, axis_scale, downsample, log_period_axis, mark_period


def draw_psa(plt: Any, result: Result, system: str) -> None:
    """Pseudo-acceleration against period (log), the design spectrum dotted, the period marked with X."""
    period = result.series["period"]
    scale, unit = axis_scale("acceleration", system, result.series["psa"])
    x, y = downsample(period, result.series["psa"] * scale)
    plt.plot(x, y, marker=LINE_MARKER, label="psa")
    if "design_psa" in result.series:
        x, y = downsample(period, result.series["design_psa"] * scale)
        plt.plot(x, y, marker="dot", label="EN 1998-1")
    psa = result.number("psa")
    at = result.inputs["period"].value if "period" in result.inputs else None
    if at is not None and period[0] <= at <= period[-1]:
        mark_period(plt, at, None if psa is None else psa * scale)
    log_period_axis(plt, float(period[0]), float(period[-1]))
    plt.title("psa, EN 1998-1 dotted, X period")
    plt.ylabel(f"psa ({unit})")


def draw_history(plt: Any, result: Result, system: str) -> None:
    """Relative displacement of the single mass with the marked period against time."""
    time = result.series["time"]
    plt.xlabel("t (s)")
    if "response_displacement" not in result.series:
        plt.title("No period marked: give one")
        plt.ylabel(f"u ({axis_scale('length', system, 0.01)[1]})")
        return
    displacement = result.series["response_displacement"]
    factor, unit = axis_scale("length", system, displacement)
    x, y = downsample(time, displacement * factor)
    plt.plot(x, y, marker=LINE_MARKER)
    peak = result.number("sd")
    if peak is not None:
        plt.hline(peak * factor)
        plt.hline(-peak * factor)
    plt.title("Response at the marked T, lines +-sd")
    plt.ylabel(f"u ({unit})")


def draw_record(plt: Any, result: Result, system: str) -> None:
    """Ground acceleration of the record as analysed (baseline-corrected)."""
    acceleration = result.series["ground_acceleration"]
    scale, unit = axis_scale("acceleration", system, acceleration)
    x, y = downsample(result.series["time"], acceleration * scale)
    plt.plot(x, y, marker=LINE_MARKER)
    plt.title("Ground acceleration, corrected")
    plt.xlabel("t (s)")
    plt.ylabel(f"ag ({unit})")


PANELS = (draw_psa, draw_history, draw_record)
"""The chart panels of the check, in the order they are shown."""
