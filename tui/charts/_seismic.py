"""Pieces shared by the earthquake charts: acceleration display unit, log-period ticks, the marked period."""

from __future__ import annotations

from typing import Any

from calc.units import STANDARD_GRAVITY
from tui.charts.common import OPERATING_MARKER

LOG_TICKS = (0.01, 0.02, 0.05, 0.1, 0.2, 0.5, 1.0, 2.0, 5.0, 10.0, 20.0)


def acceleration_scale(system: str) -> tuple[float, str]:
    """Divisor and unit text for accelerations: m/s^2 in SI, g in US customary."""
    return (STANDARD_GRAVITY, "g") if system == "us" else (1.0, "m/s^2")


def log_period_axis(plt: Any, shortest: float, longest: float) -> None:
    """Log period axis with short tick labels inside [shortest, longest] (s)."""
    plt.xscale("log")
    ticks = [t for t in LOG_TICKS if shortest * 0.999 <= t <= longest * 1.001]
    if len(ticks) >= 2:
        plt.xticks(ticks, [f"{t:g}" for t in ticks])
    plt.xlabel("T (s)")


def mark_period(plt: Any, period: float | None, ordinate: float | None) -> None:
    """Mark the chosen period (s) with a vertical line and X at ``ordinate`` (already in display units)."""
    if period is None or ordinate is None:
        return
    plt.vline(period)
    plt.scatter([period], [ordinate], marker=OPERATING_MARKER)
