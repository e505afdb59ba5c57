"""Chart of `sdof`: free response u(t), with its decay envelope when underdamped."""

from __future__ import annotations

from typing import Any

import numpy as np

from fieldmode.calc.framework.result import Result
from fieldmode.tui.charts.common import LINE_MARKER, OPERATING_MARKER, axis_scale, downsample

ENVELOPE_MARKER = "dot"

CYCLES_SHOWN = 6
"""Cycles of an oscillating response drawn: about 8 columns per cycle in the chart pane at 80x24 (49 columns),
so each cycle reads as a wave, not a solid block. The CSV and JSON keep the whole response."""


def shown_until(result: Result, time: np.ndarray) -> float:
    """The end (s) of the part of the free response drawn: :data:`CYCLES_SHOWN` cycles of the damped (or,
    undamped, the natural) frequency, or all of it for a response that does not oscillate."""
    frequency = result.number("damped_frequency")
    if frequency is None and (result.number("damping_ratio") or 0.0) == 0.0:
        frequency = result.number("frequency")
    end = float(time[-1])
    return min(end, CYCLES_SHOWN / frequency) if frequency else end


def draw_free_response(plt: Any, result: Result, system: str) -> None:
    """Displacement against time (s); the start is marked, the envelope dotted."""
    time = np.asarray(result.series["time"])
    keep = time <= shown_until(result, time) * (1 + 1e-9)
    time = time[keep]
    displacement = np.asarray(result.series["displacement"])[keep]
    scale, unit = axis_scale("length", system, displacement)
    shown = displacement * scale
    plt.plot(*downsample(time, shown), marker=LINE_MARKER)
    if "envelope" in result.series:
        envelope = np.asarray(result.series["envelope"])[keep] * scale
        plt.plot(*downsample(time, envelope, 40), marker=ENVELOPE_MARKER)
        plt.plot(*downsample(time, -envelope, 40), marker=ENVELOPE_MARKER)
    plt.scatter([float(time[0])], [float(shown[0])], marker=OPERATING_MARKER)
    plt.xlim(0.0, float(time[-1]))
    plt.title(f"Free response, {OPERATING_MARKER} start, envelope .")
    plt.xlabel("t (s)")
    plt.ylabel(f"u ({unit})")


PANELS = (draw_free_response,)
"""The chart panels of the check, in the order they are shown."""
