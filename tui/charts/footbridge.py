"""Charts of the `footbridge` check: the stream's acceleration against crowd density, vertical and lateral.

The EN 1990 limit is a horizontal line, the crowd given is marked `X`; on the lateral panel a vertical line
marks the density at which the crowd reaches the critical number for lock-in.
"""

from __future__ import annotations

from typing import Any

import numpy as np

from fieldmode.calc.framework.result import Result
from fieldmode.tui.charts.common import LINE_MARKER, OPERATING_MARKER, axis_scale, downsample

HEADROOM = 4.0
"""The acceleration axis reaches this multiple of the limit (or 1.3 times the crowd's response, if higher)."""


def _draw(plt: Any, result: Result, system: str, direction: str) -> None:
    name = f"{direction}_by_density"
    if name not in result.series:
        plt.title(f"No {direction} frequency given")
        plt.xlabel(f"crowd density ({axis_scale('crowd_density', system, 1.0)[1]})")
        plt.ylabel(f"a ({axis_scale('acceleration', system, 1.0)[1]})")
        return
    density = np.asarray(result.series["density_grid"])
    acceleration = np.asarray(result.series[name])
    limit = result.number(f"{direction}_limit") or 0.0
    own = result.number(f"{direction}_stream") or 0.0
    top = max(HEADROOM * limit, 1.3 * own)
    y_scale, y_unit = axis_scale("acceleration", system, top)
    x_scale, x_unit = axis_scale("crowd_density", system, density)
    plt.plot(*downsample(density * x_scale, np.minimum(acceleration, top) * y_scale), marker=LINE_MARKER)
    plt.hline(limit * y_scale)
    crowd = result.number("density")
    if crowd is not None:
        plt.scatter([crowd * x_scale], [min(own, top) * y_scale], marker=OPERATING_MARKER)
    critical = result.number("critical_pedestrians")
    count = result.number("pedestrians")
    if direction == "lateral" and critical is not None and count and crowd:
        plt.vline(critical / count * crowd * x_scale)
    plt.ylim(0.0, top * y_scale)
    plt.xlim(0.0, float(density[-1]) * x_scale)
    shown = "" if direction == "vertical" else ", | lock-in"
    plt.title(f"{direction.capitalize()} a ({y_unit}), {OPERATING_MARKER} crowd{shown}")
    plt.xlabel(f"crowd density ({x_unit})")
    plt.ylabel(f"a ({y_unit})")


def draw_vertical(plt: Any, result: Result, system: str) -> None:
    """Vertical stream acceleration against crowd density, with the EN 1990 limit."""
    _draw(plt, result, system, "vertical")


def draw_lateral(plt: Any, result: Result, system: str) -> None:
    """Lateral stream acceleration against crowd density, with the EN 1990 limit and the lock-in density."""
    _draw(plt, result, system, "lateral")


PANELS = (draw_vertical, draw_lateral)
"""The chart panels of the check, in the order they are shown."""
