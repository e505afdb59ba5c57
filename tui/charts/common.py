"""Helpers shared by the chart panels: markers, axis units, peak-keeping downsampling, log-period axes."""

from __future__ import annotations

import functools
import math
from collections.abc import Callable
from typing import Any

import numpy as np

from fieldmode.calc.framework.units import display_unit, unit_factor, unit_name

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


def axis_scale(kind: str, system: str, values: np.ndarray | float) -> tuple[float, str]:
    """Factor from SI to the display unit of ``kind`` for these values, and the unit as written.

    The same engineering unit the results show for values of this size (e.g. 1000 and 'mm' for
    displacements of a few millimetres in SI, 1 / 9.80665 and 'g' for accelerations in US units).
    """
    unit = display_unit(values, kind, system)
    return unit_factor(unit, kind), unit_name(unit, kind)


LOG_TICKS = (0.01, 0.02, 0.05, 0.1, 0.2, 0.5, 1.0, 2.0, 5.0, 10.0, 20.0)
"""Tick values of a log period axis (s): 1-2-5 steps."""


def log_period_axis(plt: Any, shortest: float, longest: float) -> None:
    """Log period axis with short tick labels inside [shortest, longest] (s)."""
    plt.xscale("log")
    ticks = [t for t in LOG_TICKS if shortest * 0.999 <= t <= longest * 1.001]
    if len(ticks) >= 2:
        plt.xticks(ticks, [f"{t:g}" for t in ticks])
    plt.xlabel("T (s)")


def mark_period(plt: Any, period: float | None, ordinate: float | None) -> None:
    """Mark the chosen period (s) with a vertical line and X at ``ordinate`` (already in display units)."""
    if period is None or ordinate is None:
        return
    plt.vline(period)
    plt.scatter([period], [ordinate], marker=OPERATING_MARKER)


NICE_STEPS = (1.0, 2.0, 2.5, 5.0)
"""Steps between the ticks of a linear axis, times a power of ten."""
MOST_TICKS = 7
"""At most this many ticks on an axis: about one per 7 columns of a pane at 80x24."""
LOG_MANTISSAS = (1.0, 2.0, 5.0)
"""Ticks of a log axis: 1-2-5 steps (decades alone when those are too many)."""


def _round(value: float) -> float:
    """A tick value without the float noise of a sum of steps (0.30000000000000004 -> 0.3)."""
    return float(f"{value:.12g}")


def linear_ticks(low: float, high: float, most: int = MOST_TICKS) -> list[float]:
    """Ticks at whole multiples of a step of 1, 2, 2.5 or 5 times a power of ten within [low, high], at most
    ``most`` of them (at least two when the range is not empty)."""
    if not (math.isfinite(low) and math.isfinite(high)) or high <= low:
        return []
    exponent = math.floor(math.log10((high - low) / most))
    for power in (exponent, exponent + 1, exponent + 2):
        for step in (mantissa * 10.0**power for mantissa in NICE_STEPS):
            first, last = math.ceil(low / step - 1e-9), math.floor(high / step + 1e-9)
            if last - first + 1 <= most:
                return [_round(k * step) + 0.0 for k in range(first, last + 1)]
    return []


def log_ticks(low: float, high: float, most: int = MOST_TICKS + 1) -> list[float]:
    """Ticks of a log axis within [low, high] (both > 0): 1-2-5 steps, or decades when those are too many
    (every second or third decade on a very wide axis)."""
    if not (math.isfinite(low) and math.isfinite(high)) or low <= 0 or high <= low:
        return []
    decades = range(math.floor(math.log10(low)), math.ceil(math.log10(high)) + 1)
    inside = [_round(m * 10.0**d) for d in decades for m in LOG_MANTISSAS if low * 0.999 <= m * 10.0**d <= high * 1.001]
    if len(inside) <= most:
        return inside
    tens = [t for t in inside if f"{t:e}".startswith("1.")]
    stride = max(1, math.ceil(len(tens) / most))
    return tens[::stride]


def tick_labels(ticks: list[float]) -> list[str]:
    """Short labels of tick values: 0.5, 2, 2.5, 1000, 1e-05."""
    return [f"{t:g}" for t in ticks]


class ReadableAxes:
    """Stands in for ``plt`` while a panel draws: passes every call on, remembers what was drawn, and
    :meth:`finish` gives each axis the panel did not tick itself ticks at round values (1-2-2.5-5 steps,
    1-2-5 on a log axis), so no axis reads 25.01, 10.34, 4.28. Also remembers the title and axis labels."""

    def __init__(self, plt: Any) -> None:
        self._plt = plt
        self._data: dict[str, list[float]] = {"x": [], "y": []}
        self._scale = {"x": "linear", "y": "linear"}
        self._limits: dict[str, tuple[float | None, float | None]] = {}
        self.ticks: dict[str, list[float] | None] = {}
        """Ticks of each axis: those the panel set (None when set as words) or those :meth:`finish` gave."""
        self.titles: list[str] = []
        self.labels: dict[str, str] = {}

    def __getattr__(self, name: str) -> Any:
        return getattr(self._plt, name)

    def _remember(self, axis: str, values: Any) -> None:
        try:
            numbers = np.asarray(values, dtype=float).ravel()
        except (TypeError, ValueError):
            return
        self._data[axis].extend(numbers[np.isfinite(numbers)].tolist())

    def _points(self, args: tuple[Any, ...]) -> None:
        if len(args) >= 2:
            self._remember("x", args[0])
            self._remember("y", args[1])
        elif len(args) == 1:
            self._remember("y", args[0])

    def plot(self, *args: Any, **kwargs: Any) -> Any:
        self._points(args)
        return self._plt.plot(*args, **kwargs)

    def scatter(self, *args: Any, **kwargs: Any) -> Any:
        self._points(args)
        return self._plt.scatter(*args, **kwargs)

    def hline(self, y: float, *args: Any, **kwargs: Any) -> Any:
        self._remember("y", [y])
        return self._plt.hline(y, *args, **kwargs)

    def vline(self, x: float, *args: Any, **kwargs: Any) -> Any:
        self._remember("x", [x])
        return self._plt.vline(x, *args, **kwargs)

    def xlim(self, low: float | None = None, high: float | None = None) -> Any:
        self._limits["x"] = (low, high)
        return self._plt.xlim(low, high)

    def ylim(self, low: float | None = None, high: float | None = None) -> Any:
        self._limits["y"] = (low, high)
        return self._plt.ylim(low, high)

    def xscale(self, scale: str = "linear") -> Any:
        self._scale["x"] = scale
        return self._plt.xscale(scale)

    def yscale(self, scale: str = "linear") -> Any:
        self._scale["y"] = scale
        return self._plt.yscale(scale)

    def _ticked(self, axis: str, ticks: Any, labels: Any) -> None:
        given = [float(t) for t in ticks] if ticks is not None else []
        numeric = labels is None or bool(labels) and all(_is_number(text) for text in labels)
        self.ticks[axis] = given if numeric else None

    def xticks(self, ticks: Any = None, labels: Any = None) -> Any:
        self._ticked("x", ticks, labels)
        return self._plt.xticks(ticks, labels)

    def yticks(self, ticks: Any = None, labels: Any = None) -> Any:
        self._ticked("y", ticks, labels)
        return self._plt.yticks(ticks, labels)

    def title(self, text: str) -> Any:
        self.titles.append(text)
        return self._plt.title(text)

    def xlabel(self, text: str) -> Any:
        self.labels["x"] = text
        return self._plt.xlabel(text)

    def ylabel(self, text: str) -> Any:
        self.labels["y"] = text
        return self._plt.ylabel(text)

    def span(self, axis: str) -> tuple[float, float] | None:
        """The range an axis shows: its limits where the panel set both, else the extent of what was drawn."""
        values = [v for v in self._data[axis] if self._scale[axis] != "log" or v > 0]
        low, high = self._limits.get(axis, (None, None))
        low = min(values) if low is None and values else low
        high = max(values) if high is None and values else high
        return None if low is None or high is None else (float(low), float(high))

    def finish(self) -> None:
        """Give round ticks to each axis the panel did not tick itself."""
        for axis in ("x", "y"):
            if axis in self.ticks:
                continue
            span = self.span(axis)
            if span is None:
                continue
            ticks = log_ticks(*span) if self._scale[axis] == "log" else linear_ticks(*span)
            if len(ticks) < 2:
                continue
            self.ticks[axis] = ticks
            (self._plt.xticks if axis == "x" else self._plt.yticks)(ticks, tick_labels(ticks))


def _is_number(text: str) -> bool:
    try:
        float(text)
    except ValueError:
        return False
    return True


def readable(draw: Callable[[Any, Any, str], None]) -> Callable[[Any, Any, str], None]:
    """A panel's draw function that ends with round ticks on its axes (:class:`ReadableAxes`)."""

    @functools.wraps(draw)
    def drawn(plt: Any, result: Any, system: str) -> None:
        axes = ReadableAxes(plt)
        draw(axes, result, system)
        axes.finish()

    return drawn
