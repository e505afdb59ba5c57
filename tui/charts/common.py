"""Helpers shared by the chart panels: markers, axis units, peak-keeping downsampling, log-period axes."""

from __future__ import annotations

from typing import Any

import numpy as np

from fieldmode.calc.framework.units import display_unit, unit_factor, unit_name

OPERATING_MARKER = "X"
"""Marker of the operating point: a letter, so it reads without colour and on any terminal."""

LINE_MARKER = "braille"
"""Marker of response curves (fine dots)."""

POINTS = 120
"""Points kept per curve: about twice the width of a chart at 80x24."""


def downsample(x: np.ndarray, y: np.ndarray, points: int = POINTS) -> tuple[list[float], list[float]]:
    """Keep about ``points`` samples of a curve, including the lowest and highest of each stretch."""
    x = np.asarray(x, dtype=float)
    y = np.asarray(y, dtype=float)
    if x.size <= points:
        return x.tolist(), y.tolist()
    keep = {0, x.size - 1}
    for chunk in np.array_split(np.arange(x.size), points // 2):
        keep.add(int(chunk[np.argmin(y[chunk])]))
        keep.add(int(chunk[np.argmax(y[chunk])]))
    index = np.array(sorted(keep))
    return x[index].tolist(), y[index].tolist()


def axis_scale(kind: str, system: str, values: np.ndarray | float) -> tuple[float, str]:
    """Factor from SI to the display unit of ``kind`` for these values, and the unit as written.

    The same engineering unit the results show for values of this size (e.g. 1000 and 'mm' for
    displacements of a few millimetres in SI, 1 / 9.80665 and 'g' for accelerations in US units).
    """
    unit = display_unit(values, kind, system)
    return unit_factor(unit, kind), unit_name(unit, kind)


LOG_TICKS = (0.01, 0.02, 0.05, 0.1, 0.2, 0.5, 1.0, 2.0, 5.0, 10.0, 20.0)
"""Tick values of a log period axis (s): 1-2-5 steps."""


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
