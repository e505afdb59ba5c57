"""Chart of `isolate`: transmissibility against frequency ratio, operating point marked."""

from __future__ import annotations

from typing import Any

from calc.isolation import AMPLIFYING_RATIO
from calc.result import Result
from tui.charts.common import LINE_MARKER, OPERATING_MARKER, downsample, value


def draw_transmissibility(plt: Any, result: Result, system: str) -> None:
    """Transmissibility T against r = f/fn (log scale), with T = 1 and r = sqrt(2) drawn."""
    ratio, transmitted = downsample(result.series["frequency_ratio"], result.series["transmissibility"])
    plt.plot(ratio, transmitted, marker=LINE_MARKER)
    plt.hline(1.0)
    plt.vline(AMPLIFYING_RATIO)
    plt.scatter([value(result, "frequency_ratio")], [value(result, "transmissibility")], marker=OPERATING_MARKER)
    plt.yscale("log")
    plt.xlim(0.0, ratio[-1])
    plt.title(f"Transmissibility T ({OPERATING_MARKER} = operating; T = 1, r = 1.41)")
    plt.xlabel("r = f/fn")
