"""Charts of the `ppv` check: each axis's PPV at its frequency on the guideline's line (log-log), and the
velocity time history with each axis's peak marked."""

from __future__ import annotations

from typing import Any

import numpy as np

from fieldmode.calc.framework.result import Result
from fieldmode.calc.physics.vibration_limits import HUMAN_LEVELS
from fieldmode.tui.charts.common import LINE_MARKER, axis_scale, downsample, log_ticks, tick_labels

AXIS_MARKERS = ("x", "o", "+")
"""Marker of axis 1, 2 and 3 (letters and signs: they read without colour)."""
AXES = ("axis_1", "axis_2", "axis_3")


def draw_guideline(plt: Any, result: Result, system: str) -> None:
    """PPV of each axis against the frequency compared, on log-log axes, with the guideline's line (or the
    BS 5228-2 human-response levels)."""
    series = result.series
    ppv, frequency = series["axis_ppv"], series["axis_frequency"]
    limit = series.get("guideline_limit")
    scale, unit = axis_scale("velocity", system, ppv if limit is None else limit)
    if limit is not None:
        x, y = downsample(series["guideline_frequency"], limit * scale)
        plt.plot(x, y, marker=LINE_MARKER)
        line = "guideline line"
        low, high = float(series["guideline_frequency"][0]), float(series["guideline_frequency"][-1])
    else:
        low, high = 1.0, 150.0
        for level in HUMAN_LEVELS:
            plt.plot([low, high], [level.level * scale] * 2, marker=LINE_MARKER)
        line = "BS 5228-2 levels"
    shown = [k for k in range(len(ppv)) if np.isfinite(frequency[k]) and ppv[k] > 0]
    for k in shown:
        plt.scatter([float(frequency[k])], [float(ppv[k] * scale)], marker=AXIS_MARKERS[k])
    plt.xscale("log")
    plt.yscale("log")
    f_values = [low, high, *(float(frequency[k]) for k in shown)]
    _log_axis(plt.xticks, f_values)
    levels = list(limit * scale) if limit is not None else [level.level * scale for level in HUMAN_LEVELS]
    v_values = [*levels, *(float(ppv[k] * scale) for k in shown)]
    _log_axis(plt.yticks, v_values)
    plt.title(f"PPV by axis {' '.join(AXIS_MARKERS[:len(ppv)])} on the {line}")
    plt.xlabel("frequency at the peak (Hz)")
    plt.ylabel(f"PPV ({unit})")


def _log_axis(set_ticks: Any, values: list[float]) -> None:
    """1-2-5 ticks over the values drawn on a log axis."""
    ticks = log_ticks(min(values), max(values))
    if len(ticks) >= 2:
        set_ticks(ticks, tick_labels(ticks))


def draw_history(plt: Any, result: Result, system: str) -> None:
    """Velocity of each axis against time, each axis's peak marked with its marker."""
    series = result.series
    time = series["time"]
    axes = [series[name] for name in AXES if name in series]
    scale, unit = axis_scale("velocity", system, series["peak_ppv"])
    for velocity in axes:
        x, y = downsample(time, velocity * scale)
        plt.plot(x, y, marker=LINE_MARKER)
    for k, (at, velocity) in enumerate(zip(series["peak_time"], axes, strict=False)):
        signed = float(np.interp(at, time, velocity))
        plt.scatter([float(at)], [signed * scale], marker=AXIS_MARKERS[k])
    plt.title(f"Velocity by axis, peaks {' '.join(AXIS_MARKERS[:len(axes)])}")
    plt.xlabel("time (s)")
    plt.ylabel(f"v ({unit})")


PANELS = (draw_guideline, draw_history)
"""The chart panels of the check, in the order they are shown."""
