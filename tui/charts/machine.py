"""Chart of `machine`: the severity zone against r.m.s. velocity as steps (log axis), the measured velocity
marked `X`."""

from __future__ import annotations

from typing import Any

import numpy as np

from fieldmode.calc.framework.result import Result
from fieldmode.tui.charts.common import OPERATING_MARKER, axis_scale, log_ticks, tick_labels

ZONES = ("A", "B", "C", "D")


def draw_zones(plt: Any, result: Result, system: str) -> None:
    """Zone A-D against r.m.s. velocity, stepping at the class's boundaries; the measured velocity marked X."""
    if "velocity_grid" not in result.series:
        plt.title("No measured velocity given")
        return
    velocity = np.asarray(result.series["velocity_grid"])
    zone = np.asarray(result.series["zone_number"])
    measured = result.inputs["velocity"].value if "velocity" in result.inputs else None
    measured = measured or float(np.median(velocity))
    scale, unit = axis_scale("velocity", system, measured)
    plt.plot((velocity * scale).tolist(), zone.tolist(), marker="braille")
    plt.scatter([measured * scale], [float(np.interp(measured, velocity, zone))], marker=OPERATING_MARKER)
    plt.xscale("log")
    ticks = log_ticks(float(velocity[0] * scale), float(velocity[-1] * scale))
    plt.xticks(ticks, tick_labels(ticks))
    plt.yticks([1, 2, 3, 4], list(ZONES))
    plt.ylim(0.5, 4.5)
    plt.title(f"Zone by r.m.s. velocity, {OPERATING_MARKER} measured")
    plt.xlabel(f"velocity r.m.s. ({unit})")
    plt.ylabel("zone")


def draw_balance(plt: Any, result: Result, system: str) -> None:
    """Permissible eccentricity against speed (log-log) for the grade, the grades either side dotted, and the
    operating speed marked X."""
    if "speed_grid" not in result.series:
        plt.title("No balance grade given")
        return
    speed = np.asarray(result.series["speed_grid"]) * 60.0
    own = np.asarray(result.series["grade_eccentricity"])
    at = result.number("grade_eccentricity") or float(np.median(own))
    scale, unit = axis_scale("length", system, at)
    for name in ("coarser_eccentricity", "finer_eccentricity"):
        if name in result.series:
            plt.plot(speed.tolist(), (np.asarray(result.series[name]) * scale).tolist(), marker=".")
    plt.plot(speed.tolist(), (own * scale).tolist(), marker="braille")
    operating = result.inputs["speed"].value if "speed" in result.inputs else None
    if operating is not None:
        plt.scatter([operating * 60.0], [at * scale], marker=OPERATING_MARKER)
    plt.xscale("log")
    plt.yscale("log")
    ticks = log_ticks(float(speed[0]), float(speed[-1]))
    plt.xticks(ticks, tick_labels(ticks))
    low = min(float(np.min(result.series[name])) for name in result.series if name.endswith("eccentricity"))
    high = max(float(np.max(result.series[name])) for name in result.series if name.endswith("eccentricity"))
    ticks = log_ticks(low * scale, high * scale)
    plt.yticks(ticks, tick_labels(ticks))
    plt.title("Permissible eccentricity, . next grades")
    plt.xlabel("speed (rpm)")
    plt.ylabel(f"e_per ({unit})")


PANELS = (draw_zones, draw_balance)
"""The chart panels of the check, in the order they are shown."""
