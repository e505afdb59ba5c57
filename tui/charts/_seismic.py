"""Pieces shared by the earthquake charts: acceleration display unit, log-period ticks, optional values."""

from __future__ import annotations

import math
from typing import Any

from calc.units import STANDARD_GRAVITY

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


def value(result: Any, name: str) -> float | None:
    """SI magnitude of a scalar result, or None when absent."""
    item = result.values.get(name)
    if item is None or isinstance(item.quantity, str):
        return None
    magnitude = float(item.si())
    return magnitude if math.isfinite(magnitude) else None
