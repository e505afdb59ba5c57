"""Chart of the `storeys` check: the first mode shapes against height."""

from __future__ import annotations

from typing import Any

from fieldmode.calc.framework.result import Result
from fieldmode.tui.charts.common import axis_scale

MARKERS = ("o", "x", "+")
"""One marker per mode, so the modes stay apart without colour."""


def draw_mode_shapes(plt: Any, result: Result, system: str) -> None:
    """Mode shapes 1-3 (roof = 1) against floor level, the base at 0."""
    if "height" in result.series:
        factor, unit = axis_scale("length", system, result.series["height"])
        level = result.series["height"] * factor
        plt.ylabel(f"height ({unit})")
    else:
        level = result.series["storey"]
        plt.ylabel("floor (no.)")
    plt.vline(0.0)
    for n, marker in enumerate(MARKERS, start=1):
        shape = result.series.get(f"mode_{n}")
        if shape is not None:
            plt.plot(list(shape), list(level), marker=marker)
    plt.title("Mode shapes: 1 o, 2 x, 3 +")
    plt.xlabel("shape, roof = 1 (-)")


PANELS = (draw_mode_shapes,)
"""The chart panels of the check, in the order they are shown."""
