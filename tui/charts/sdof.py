"""Chart of `sdof`: free response u(t), with its decay envelope when underdamped."""

from __future__ import annotations

from typing import Any

import numpy as np

from calc.result import Result
from calc.units import Q_
from tui.charts.common import LINE_MARKER, OPERATING_MARKER, downsample

DISPLACEMENT_UNIT = {"si": "mm", "us": "in"}
ENVELOPE_MARKER = "dot"


def draw_free_response(plt: Any, result: Result, system: str) -> None:
    """Displacement (mm or in) against time (s); the start is marked, the envelope dotted."""
    unit = DISPLACEMENT_UNIT[system]
    scale = float(Q_(1.0, "m").to(unit).magnitude)
    time = np.asarray(result.series["time"])
    shown = np.asarray(result.series["displacement"]) * scale
    plt.plot(*downsample(time, shown), marker=LINE_MARKER)
    if "envelope" in result.series:
        envelope = np.asarray(result.series["envelope"]) * scale
        plt.plot(*downsample(time, envelope, 40), marker=ENVELOPE_MARKER)
        plt.plot(*downsample(time, -envelope, 40), marker=ENVELOPE_MARKER)
    plt.scatter([float(time[0])], [float(shown[0])], marker=OPERATING_MARKER)
    plt.xlim(0.0, float(time[-1]))
    plt.title(f"Free response u, {unit} ({OPERATING_MARKER} = start)")
    plt.xlabel("t (s)")
