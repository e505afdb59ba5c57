"""Charts of check `spectrum`: psa on a log period axis with the EN 1998-1 overlay, the response at the
marked period, and the record."""

from __future__ import annotations

from typing import Any

from calc.result import Result
from tui.charts._seismic import acceleration_scale, log_period_axis, mark_period
from tui.charts.common import LINE_MARKER, downsample, optional_value


def draw_psa(plt: Any, result: Result, system: str) -> None:
    """Pseudo-acceleration against period (log), the design spectrum dotted, the period marked with X."""
    scale, unit = acceleration_scale(system)
    period = result.series["period"]
    x, y = downsample(period, result.series["psa"] / scale)
    plt.plot(x, y, marker=LINE_MARKER, label="psa")
    if "design_psa" in result.series:
        x, y = downsample(period, result.series["design_psa"] / scale)
        plt.plot(x, y, marker="dot", label="EN 1998-1")
    psa = optional_value(result, "psa")
    at = result.inputs["period"].value if "period" in result.inputs else None
    if at is not None and period[0] <= at <= period[-1]:
        mark_period(plt, at, None if psa is None else psa / scale)
    log_period_axis(plt, float(period[0]), float(period[-1]))
    plt.title(f"psa ({unit})")


def draw_history(plt: Any, result: Result, system: str) -> None:
    """Relative displacement of the single mass with the marked period against time."""
    time = result.series["time"]
    factor, unit = (1000.0, "mm") if system != "us" else (1.0 / 0.0254, "in")
    if "response_displacement" not in result.series:
        plt.title("no period marked: give one for its time history")
        return
    x, y = downsample(time, result.series["response_displacement"] * factor)
    plt.plot(x, y, marker=LINE_MARKER)
    peak = optional_value(result, "sd")
    if peak is not None:
        plt.hline(peak * factor)
        plt.hline(-peak * factor)
    plt.title(f"u at T ({unit}), +-sd")
    plt.xlabel("t (s)")


def draw_record(plt: Any, result: Result, system: str) -> None:
    """Ground acceleration of the record as analysed (baseline-corrected)."""
    scale, unit = acceleration_scale(system)
    x, y = downsample(result.series["time"], result.series["ground_acceleration"] / scale)
    plt.plot(x, y, marker=LINE_MARKER)
    plt.title(f"ground acceleration ({unit})")
    plt.xlabel("t (s)")
