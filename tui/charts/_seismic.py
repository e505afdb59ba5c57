"""Pieces shared by the earthquake charts: display units, thinning and log-period ticks."""

from __future__ import annotations

import math
from typing import Any

import numpy as np

from calc.units import STANDARD_GRAVITY

LOG_TICKS = (0.01, 0.02, 0.05, 0.1, 0.2, 0.5, 1.0, 2.0, 5.0, 10.0, 20.0)
MARK = "x"
"""Marker of the marked period (not colour alone)."""


def acceleration_scale(system: str) -> tuple[float, str]:
    """Divisor and unit text for accelerations: m/s^2 in SI, g in US customary."""
    return (STANDARD_GRAVITY, "g") if system == "us" else (1.0, "m/s^2")


def thin(x: np.ndarray, y: np.ndarray, points: int = 140) -> tuple[list[float], list[float]]:
    """At most ``points`` samples, keeping the largest |y| of each stretch (peaks stay visible)."""
    if len(x) <= points:
        return np.asarray(x, float).tolist(), np.asarray(y, float).tolist()
    edges = np.linspace(0, len(x), points + 1).astype(int)
    picks = [start + int(np.argmax(np.abs(y[start:stop]))) for start, stop in zip(edges[:-1], edges[1:], strict=True)]
    return np.asarray(x)[picks].tolist(), np.asarray(y)[picks].tolist()


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
