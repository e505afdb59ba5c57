"""Charts of `forced`: amplification and phase against frequency ratio, operating point marked."""

from __future__ import annotations

from typing import Any

from fieldmode.calc.framework.result import Result
from fieldmode.calc.physics.forced import RESONANCE_BAND
from fieldmode.tui.charts.common import LINE_MARKER, OPERATING_MARKER, downsample


def _band(plt: Any) -> None:
    """The +/-20 % resonance band as two vertical lines."""
    plt.vline(1.0 - RESONANCE_BAND)
    plt.vline(1.0 + RESONANCE_BAND)


def draw_amplification(plt: Any, result: Result, system: str) -> None:
    """Dynamic amplification R_d against r = f/fn (log scale), band at r = 0.8 and 1.2."""
    ratio, gain = downsample(result.series["frequency_ratio"], result.series["amplification"])
    plt.plot(ratio, gain, marker=LINE_MARKER)
    _band(plt)
    plt.scatter([result.number("frequency_ratio")], [result.number("amplification")], marker=OPERATING_MARKER)
    plt.yscale("log")
    plt.xlim(0.0, ratio[-1])
    plt.title(f"Amplification R_d, {OPERATING_MARKER} operating, | +/-20 %")
    plt.xlabel("r = f/fn (-)")
    plt.ylabel("R_d (-)")


def draw_phase(plt: Any, result: Result, system: str) -> None:
    """Phase lag (deg) against r = f/fn."""
    ratio, lag = downsample(result.series["frequency_ratio"], result.series["phase"])
    plt.plot(ratio, lag, marker=LINE_MARKER)
    _band(plt)
    plt.scatter([result.number("frequency_ratio")], [result.number("phase")], marker=OPERATING_MARKER)
    plt.xlim(0.0, ratio[-1])
    plt.ylim(0.0, 180.0)
    plt.yticks([0, 45, 90, 135, 180])
    plt.title(f"Phase lag, deg: {OPERATING_MARKER} operating")
    plt.xlabel("r = f/fn (-)")
    plt.ylabel("phase (deg)")


PANELS = (draw_amplification, draw_phase)
"""The chart panels of the check, in the order they are shown."""
