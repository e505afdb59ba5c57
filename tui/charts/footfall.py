"""Charts of the `footfall` check: forcing bands and the structure's frequencies.

Rows: W walking, R running, J jumping (marked by harmonic number), S Setra ranges (marked by
risk range 1-3), H HiVoSS ranges (1 critical, 2 second harmonic).
"""

from __future__ import annotations

from typing import Any

from fieldmode.calc.framework.result import Result
from fieldmode.calc.physics.footfall import BANDS

AXIS_MIN_HZ = 3.0
"""The frequency axis reaches at least this far (Hz)."""


def _draw(plt: Any, result: Result, direction: str, frequencies_name: str) -> None:
    series = result.series
    rows: dict[str, int] = {}
    for index, low, high in zip(series.get("band_index", ()), series.get("band_low", ()),
                                series.get("band_high", ()), strict=True):
        band = BANDS[int(index)]
        if band.direction != direction:
            continue
        row = rows.setdefault(band.row, len(rows) + 1)
        plt.plot([float(low), float(high)], [row, row], marker=band.mark)
    frequencies = [float(f) for f in series.get(frequencies_name, ())]
    top = max(len(rows), 1)
    for frequency in frequencies:
        plt.vline(frequency)
        plt.plot([frequency] * top, list(range(1, top + 1)), marker="#")
    highest = max([*frequencies, *(BANDS[int(i)].high for i in series.get("band_index", ())
                                   if BANDS[int(i)].direction == direction)], default=AXIS_MIN_HZ)
    plt.xlim(0, max(AXIS_MIN_HZ, 1.1 * highest))
    plt.ylim(0.5, top + 0.5)
    plt.yticks(list(rows.values()), list(rows))
    shown = ", ".join(f"{f:.3g}" for f in frequencies) or "none"
    plt.title(f"{direction.capitalize()} bands, # {shown} Hz")
    plt.xlabel("frequency (Hz)")
    plt.ylabel("activity/guide")


def draw_vertical(plt: Any, result: Result, system: str) -> None:
    """Vertical forcing bands with the vertical frequencies marked."""
    _draw(plt, result, "vertical", "frequencies")


def draw_lateral(plt: Any, result: Result, system: str) -> None:
    """Lateral forcing bands with the lateral frequencies marked."""
    _draw(plt, result, "lateral", "lateral_frequencies")


PANELS = (draw_vertical, draw_lateral)
"""The chart panels of the check, in the order they are shown."""
