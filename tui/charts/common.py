"""Helpers shared by the chart panels: the operating-point marker and peak-keeping downsampling."""

from __future__ import annotations

import math

import numpy as np

from calc.result import Result

OPERATING_MARKER = "X"
"""Marker of the operating point: a letter, so it reads without colour and on any terminal."""

LINE_MARKER = "braille"
"""Marker of response curves (fine dots)."""

POINTS = 120
"""Points kept per curve: about twice the width of a chart at 80x24."""


def downsample(x: np.ndarray, y: np.ndarray, points: int = POINTS) -> tuple[list[float], list[float]]:
    """Keep about ``points`` samples of a curve, including the lowest and highest of each stretch."""
    x = np.asarray(x, dtype=float)
    y = np.asarray(y, dtype=float)
    if x.size <= points:
        return x.tolist(), y.tolist()
    keep = {0, x.size - 1}
    for chunk in np.array_split(np.arange(x.size), points // 2):
        keep.add(int(chunk[np.argmin(y[chunk])]))
        keep.add(int(chunk[np.argmax(y[chunk])]))
    index = np.array(sorted(keep))
    return x[index].tolist(), y[index].tolist()


def value(result: Result, name: str) -> float:
    """SI magnitude of a scalar result value."""
    return float(result.values[name].si())


def optional_value(result: Result, name: str) -> float | None:
    """SI magnitude of a scalar result, or None when it is absent, a word, or not finite."""
    item = result.values.get(name)
    if item is None or isinstance(item.quantity, str):
        return None
    magnitude = float(item.si())
    return magnitude if math.isfinite(magnitude) else None
