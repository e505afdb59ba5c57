"""Chart of `sdof`: free response u(t), with its decay envelope when underdamped."""

from __future__ import annotations

from typing import Any

import numpy as np

from fieldmode.calc.framework.result import Result
from fieldmode.tui.charts.common import LINE_MARKER, OPERATING_MARKER, axis_scale, downsample

ENVELOPE_MARKER = "dot"


def draw_free_response(plt: Any, result: Result, system: str) -> None:
    """Displacement against time (s); the start is marked, the envelope dotted."""
    time = np.asarray(result.series["time"])
    displacement = np.asarray(result.series["displacement"])
    scale, unit = axis_scale("length", system, displacement)
    shown = displacement * scale
    plt.plot(*downsample(time, shown), marker=LINE_MARKER)
    if "envelope" in result.series:
        envelope = np.asarray(result.series["envelope"]) * scale
        plt.plot(*downsample(time, envelope, 40), marker=ENVELOPE_MARKER)
        plt.plot(*downsample(time, -envelope, 40), marker=ENVELOPE_MARKER)
    plt.scatter([float(time[0])], [float(shown[0])], marker=OPERATING_MARKER)
    plt.xlim(0.0, float(time[-1]))
    plt.title(f"Free response u, {unit} ({OPERATING_MARKER} = start)")
    plt.xlabel("t (s)")


PANELS = (draw_free_response,)
"""The chart panels of the check, in the order they are shown."""
