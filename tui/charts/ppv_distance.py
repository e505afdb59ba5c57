"""Chart of `ppv-distance`: the predicted PPV against distance on log-log axes, the limit as a line, the
distance given marked `X`."""

from __future__ import annotations

from typing import Any

import numpy as np

from fieldmode.calc.framework.result import Result
from fieldmode.tui.charts.common import LINE_MARKER, OPERATING_MARKER, axis_scale, downsample, log_ticks, tick_labels


def draw_ppv(plt: Any, result: Result, system: str) -> None:
    """Predicted PPV against distance (log-log), the limit PPV as a line, the distance given marked X."""
    distance = np.asarray(result.series["distance"])
    ppv = np.asarray(result.series["ppv"])
    limit = result.inputs["limit"].value if "limit" in result.inputs else None
    given = result.number("ppv")
    reference = given if given is not None else limit if limit is not None else float(np.median(ppv))
    y_scale, y_unit = axis_scale("velocity", system, reference)
    x_scale, x_unit = axis_scale("length", system, distance)
    x, y = distance * x_scale, ppv * y_scale
    plt.plot(*downsample(x, y), marker=LINE_MARKER)
    low, high = float(y.min()), float(y.max())
    if limit is not None:
        plt.plot([float(x[0]), float(x[-1])], [limit * y_scale] * 2, marker="-")
        low, high = min(low, limit * y_scale), max(high, limit * y_scale)
    at = result.inputs["distance"].value if "distance" in result.inputs else None
    if given is not None and at is not None:
        plt.scatter([at * x_scale], [given * y_scale], marker=OPERATING_MARKER)
    plt.xscale("log")
    plt.yscale("log")
    x_ticks, y_ticks = log_ticks(float(x[0]), float(x[-1])), log_ticks(low, high)
    plt.xticks(x_ticks, tick_labels(x_ticks))
    plt.yticks(y_ticks, tick_labels(y_ticks))
    plt.title(f"Predicted PPV, {OPERATING_MARKER} given, - limit")
    plt.xlabel(f"distance ({x_unit})")
    plt.ylabel(f"PPV ({y_unit})")


PANELS = (draw_ppv,)
"""The chart panels of the check, in the order they are shown."""
