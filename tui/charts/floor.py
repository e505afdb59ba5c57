"""Charts of the `floor` check: the response factor against pacing rate and against floor frequency.

The occupancy's limit is a horizontal line; the floor itself is marked `X`.
"""

from __future__ import annotations

from typing import Any

import numpy as np

from fieldmode.calc.framework.result import Result
from fieldmode.tui.charts.common import LINE_MARKER, OPERATING_MARKER, downsample

HEADROOM = 2.5
"""The response axis reaches this multiple of the limit (or 1.3 times the floor's response, if higher), so the
peaks of low floors do not flatten the rest."""


def _limit(plt: Any, result: Result) -> float:
    limit = result.number("response_limit") or 1.0
    plt.hline(limit)
    return limit


def draw_by_pace(plt: Any, result: Result, system: str) -> None:
    """Response factor against the pacing rate (Hz), the limit as a line, the worst pace marked X."""
    pace = np.asarray(result.series["pacing_rate_grid"])
    response = np.asarray(result.series["response_by_pace"])
    limit = _limit(plt, result)
    plt.plot(*downsample(pace, response), marker=LINE_MARKER)
    worst = int(np.argmax(response))
    plt.scatter([float(pace[worst])], [float(response[worst])], marker=OPERATING_MARKER)
    plt.ylim(0.0, 1.1 * max(float(response.max()), limit))
    if pace[-1] > pace[0]:
        plt.xlim(float(pace[0]), float(pace[-1]))
    plt.title(f"Response factor by pace, limit {limit:g}")
    plt.xlabel("pacing rate (Hz)")
    plt.ylabel("R (-)")


def draw_by_frequency(plt: Any, result: Result, system: str) -> None:
    """Response factor of floors of other frequencies (same mass and damping), this floor marked X."""
    frequency = np.asarray(result.series["frequency_grid"])
    response = np.asarray(result.series["response_by_frequency"])
    limit = _limit(plt, result)
    own = result.number("response_factor") or 0.0
    top = max(HEADROOM * limit, 1.3 * own)
    plt.plot(*downsample(frequency, np.minimum(response, top)), marker=LINE_MARKER)
    floor = result.number("frequency")
    if floor is not None:
        plt.vline(floor)
        plt.scatter([floor], [min(own, top)], marker=OPERATING_MARKER)
    plt.ylim(0.0, top)
    plt.xlim(0.0, float(frequency[-1]))
    plt.title(f"R by floor frequency, {OPERATING_MARKER} this floor")
    plt.xlabel("floor frequency (Hz)")
    plt.ylabel("R (-)")


PANELS = (draw_by_pace, draw_by_frequency)
"""The chart panels of the check, in the order they are shown."""
