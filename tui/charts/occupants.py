"""Charts of the `occupants` check: one-third-octave spectra against the base curve times the use's factor
(log-log), and the weighted running RMS with the MTVV marked `X`."""

from __future__ import annotations

import math
from typing import Any

import numpy as np

from fieldmode.calc.framework.result import Result
from fieldmode.tui.charts.common import LINE_MARKER, OPERATING_MARKER, axis_scale, downsample

RAW_MARKER, WEIGHTED_MARKER = "o", "x"
"""Markers of the unweighted and weighted band values: letters, so they read without colour."""
DEPTH = 1e-3
"""Band values below this fraction of the largest value drawn sit on the bottom of the log axis."""


def steps_125(low: float, high: float) -> list[float]:
    """The 1-2-5 values from ``low`` to ``high`` (both > 0), for ticks on a log axis."""
    ticks = []
    for exponent in range(math.floor(math.log10(low)), math.ceil(math.log10(high)) + 1):
        ticks += [step * 10.0**exponent for step in (1.0, 2.0, 5.0)]
    return [t for t in ticks if low * 0.999 <= t <= high * 1.001]


def _label(value: float) -> str:
    return f"{value:g}"


def draw_bands(plt: Any, result: Result, system: str) -> None:
    """Unweighted (o, drawn over x where they meet) and weighted (x) band RMS against band centre, and the base
    curve x factor as a line."""
    frequency = np.asarray(result.series["band_frequency"])
    limit = np.asarray(result.series["base_curve_limit"])
    raw = np.asarray(result.series["band_rms"])
    weighted = np.asarray(result.series["band_rms_weighted"])
    scale, unit = axis_scale("acceleration", system, np.concatenate([raw, limit]))
    top = float(max(raw.max(), weighted.max(), limit.max())) * scale
    bottom = top * DEPTH
    plt.plot(frequency.tolist(), (limit * scale).tolist(), marker=LINE_MARKER)
    plt.scatter(frequency.tolist(), np.maximum(weighted * scale, bottom).tolist(), marker=WEIGHTED_MARKER)
    plt.scatter(frequency.tolist(), np.maximum(raw * scale, bottom).tolist(), marker=RAW_MARKER)
    plt.xscale("log")
    plt.yscale("log")
    x_ticks = steps_125(float(frequency[0]), float(frequency[-1]))
    plt.xticks(x_ticks, [_label(t) for t in x_ticks])
    y_ticks = steps_125(bottom, top)
    plt.yticks(y_ticks, [_label(t) for t in y_ticks])
    factor = result.number("use_factor")
    weighting = result.values["weighting"].magnitude if "weighting" in result.values else "weighted"
    shown = f"{factor:g}" if factor is not None else "factor"
    plt.title(f"{RAW_MARKER} raw, {WEIGHTED_MARKER} {weighting}, line base x {shown}")
    plt.xlabel("band centre (Hz)")
    plt.ylabel(f"RMS ({unit})")


def draw_running(plt: Any, result: Result, system: str) -> None:
    """Weighted running RMS (1 s) against time, the MTVV marked X."""
    time = np.asarray(result.series["running_time"])
    running = np.asarray(result.series["running_rms"])
    scale, unit = axis_scale("acceleration", system, running)
    plt.plot(*downsample(time, running * scale), marker=LINE_MARKER)
    mtvv, at = result.number("mtvv"), result.number("mtvv_time")
    if mtvv is not None and at is not None:
        plt.scatter([at], [mtvv * scale], marker=OPERATING_MARKER)
    plt.ylim(0.0, float(running.max()) * scale * 1.1)
    plt.title(f"Running RMS, {OPERATING_MARKER} MTVV")
    plt.xlabel("time (s)")
    plt.ylabel(f"a_w ({unit})")


PANELS = (draw_bands, draw_running)
"""The chart panels of the check, in the order they are shown."""
