"""Chart of `isolate`: transmissibility against frequency ratio, operating point marked."""

from __future__ import annotations

from typing import Any

from fieldmode.calc.framework.result import Result
from fieldmode.calc.physics.isolate import AMPLIFYING_RATIO
from fieldmode.tui.charts.common import LINE_MARKER, OPERATING_MARKER, downsample


def draw_transmissibility(plt: Any, result: Result, system: str) -> None:
    """Transmissibility T against r = f/fn (log scale), with T = 1 and r = sqrt(2) drawn."""
    ratio, transmitted = downsample(result.series["frequency_ratio"], result.series["transmissibility"])
    plt.plot(ratio, transmitted, marker=LINE_MARKER)
    plt.hline(1.0)
    plt.vline(AMPLIFYING_RATIO)
    plt.scatter([result.number("frequency_ratio")], [result.number("transmissibility")], marker=OPERATING_MARKER)
    plt.yscale("log")
    plt.xlim(0.0, ratio[-1])
    plt.title(f"Transmissibility T, {OPERATING_MARKER} operating, | r = 1.41")
    plt.xlabel("r = f/fn (-)")
    plt.ylabel("T (-)")


PANELS = (draw_transmissibility,)
"""The chart panels of the check, in the order they are shown."""
