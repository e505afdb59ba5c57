"""Charts of the `tmd` check: response with and without the damper, and with the damper mistuned."""

from __future__ import annotations

from typing import Any

import numpy as np

from fieldmode.calc.framework.result import Result

CLIP = 10.0
"""Without-damper curves are cut at this multiple of the damped peak, so the damped curve stays readable."""


def _axes(plt: Any, result: Result, title: str) -> tuple[list[float], float]:
    ratio = result.series["frequency_ratio"]
    top = CLIP * float(np.max(result.series["amplification"]))
    plt.title(title)
    plt.xlabel("f / f mode (-)")
    plt.ylabel("A (-)")
    plt.vline(1.0)
    return list(ratio), top


def draw_response(plt: Any, result: Result, system: str) -> None:
    """Amplification of the structure without the damper (.) and with it (*)."""
    ratio, top = _axes(plt, result, "Amplification A: without . with *")
    without = np.minimum(result.series["amplification_without"], top)
    plt.plot(ratio, list(without), marker=".")
    plt.plot(ratio, list(result.series["amplification"]), marker="*")
    plt.ylim(0, float(max(without.max(), result.series["amplification"].max())) * 1.05)


def draw_mistuning(plt: Any, result: Result, system: str) -> None:
    """Amplification with the damper tuned (*), 5 % low (-) and 5 % high (+)."""
    ratio, _ = _axes(plt, result, "Damper tuned *, 5 % low -, 5 % high +")
    plt.plot(ratio, list(result.series["amplification_mistuned_low"]), marker="-")
    plt.plot(ratio, list(result.series["amplification_mistuned_high"]), marker="+")
    plt.plot(ratio, list(result.series["amplification"]), marker="*")


PANELS = (draw_response, draw_mistuning)
"""The chart panels of the check, in the order they are shown."""
