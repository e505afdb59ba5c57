"""Guideline values of peak particle velocity (PPV) for buildings near construction work, and the
human response levels of construction vibration.

Velocities in m/s, frequencies in Hz, displacements in m. Each guideline line says where it
applies and cites its clause or table; "(from memory)" marks values not confirmed against a copy.

- DIN 4150-3:1999 Table 1, short-term vibration: at the foundation by frequency (lines 1-3), and
  horizontally on the uppermost floor at all frequencies. Within 1-10, 10-50 and 50-100 Hz the
  foundation value runs linearly in f; above 100 Hz the 100 Hz value holds (the table allows "at
  least" it). Long-term vibration, uppermost floor horizontal (from memory).
- BS 7385-2:1993 Table 1, transient vibration, cosmetic damage: line 1 (reinforced or framed) and
  line 2 (unreinforced or light framed); between the tabulated points the value is taken linearly in
  f. Below 4 Hz line 2 is a displacement of 0.6 mm zero to peak, shown as the velocity
  2 pi f x 0.6 mm (from memory). Continuous vibration may call for lower values: choose a reduction
  factor yourself (``factor``); none is applied unless asked.
- BS 5228-2:2009+A1:2014 Annex B Table B.1: PPV levels at which people in buildings notice,
  complain about or cannot bear construction vibration (descriptions in our words).
"""

from __future__ import annotations

import math
from dataclasses import dataclass

import numpy as np

MM_S = 1e-3
"""One mm/s in m/s."""


@dataclass(frozen=True)
class GuidelineLine:
    """One line of a guideline: PPV limit (m/s) at the tabulated frequencies (Hz), linear between them
    and constant beyond the last; ``lowest`` is the lowest frequency covered (0: any frequency).

    Below ``lowest`` a ``displacement_below`` (m, zero to peak) gives the limit 2 pi f d where the
    guideline has one; otherwise frequencies below ``lowest`` are refused.
    """

    key: str
    title: str
    applies_to: str
    frequencies: tuple[float, ...]
    values: tuple[float, ...]
    lowest: float
    source: str
    displacement_below: float | None = None
    notes: tuple[str, ...] = ()


_DIN = "DIN 4150-3:1999 Table 1, short-term vibration (confirmed in two reproductions)"
_DIN_LONG = "DIN 4150-3:1999 Table 3, long-term vibration (from memory)"
_DIN_FOUNDATION = "foundation, each of the three axes (the largest governs), with the frequency at the peak"
_DIN_TOP = "uppermost full floor, horizontal axes, any frequency"
_DIN_KINDS = {
    1: "commercial and industrial buildings and buildings of similar design",
    2: "dwellings and buildings of similar design or use",
    3: "buildings so sensitive to vibration, and of such value (e.g. listed buildings), that lines 1 and 2 "
       "do not fit",
}
_DIN_FOUNDATION_VALUES = {1: (20.0, 20.0, 40.0, 50.0), 2: (5.0, 5.0, 15.0, 20.0), 3: (3.0, 3.0, 8.0, 10.0)}
_DIN_TOP_VALUES = {1: 40.0, 2: 15.0, 3: 8.0}
_DIN_LONG_VALUES = {1: 10.0, 2: 5.0, 3: 2.5}

CONTINUOUS_NOTE = ("BS 7385-2 values are for transient vibration; continuous vibration can amplify the "
                   "response and may need lower values. Any reduction (a 50 % cut is sometimes quoted) is "
                   "a choice made by the user, not applied here by default.")


def _din_lines() -> dict[str, GuidelineLine]:
    lines = {}
    for number, kind in _DIN_KINDS.items():
        lines[f"din4150-3-short-{number}-foundation"] = GuidelineLine(
            f"din4150-3-short-{number}-foundation", f"DIN 4150-3 short-term, line {number}, foundation", kind,
            (1.0, 10.0, 50.0, 100.0), tuple(v * MM_S for v in _DIN_FOUNDATION_VALUES[number]), 1.0,
            f"{_DIN}, line {number}, foundation", notes=(_DIN_FOUNDATION,))
        lines[f"din4150-3-short-{number}-top-floor"] = GuidelineLine(
            f"din4150-3-short-{number}-top-floor", f"DIN 4150-3 short-term, line {number}, uppermost floor", kind,
            (0.0,), (_DIN_TOP_VALUES[number] * MM_S,), 0.0, f"{_DIN}, line {number}, uppermost floor",
            notes=(_DIN_TOP,))
        lines[f"din4150-3-long-{number}"] = GuidelineLine(
            f"din4150-3-long-{number}", f"DIN 4150-3 long-term, line {number}, uppermost floor", kind,
            (0.0,), (_DIN_LONG_VALUES[number] * MM_S,), 0.0, f"{_DIN_LONG}, line {number}", notes=(_DIN_TOP,))
    return lines


LINES: dict[str, GuidelineLine] = {
    **_din_lines(),
    "bs7385-2-line-1": GuidelineLine(
        "bs7385-2-line-1", "BS 7385-2 transient, line 1",
        "reinforced or framed structures; industrial and heavy commercial buildings",
        (4.0,), (50.0 * MM_S,), 4.0, "BS 7385-2:1993 Table 1, line 1 (from memory)",
        notes=("at the base of the building, the largest of the three axes; no value below 4 Hz",
               CONTINUOUS_NOTE)),
    "bs7385-2-line-2": GuidelineLine(
        "bs7385-2-line-2", "BS 7385-2 transient, line 2",
        "unreinforced or light framed structures; residential or light commercial buildings",
        (4.0, 15.0, 40.0), (15.0 * MM_S, 20.0 * MM_S, 50.0 * MM_S), 4.0,
        "BS 7385-2:1993 Table 1, line 2 (confirmed in a summary); below 4 Hz 0.6 mm zero to peak (from memory)",
        displacement_below=0.6e-3,
        notes=("at the base of the building, the largest of the three axes", CONTINUOUS_NOTE)),
}
"""Every guideline line by key."""


def guideline_line(key: str | GuidelineLine) -> GuidelineLine:
    """The guideline line with this key (see :data:`LINES`); a :class:`GuidelineLine` is returned as is."""
    if isinstance(key, GuidelineLine):
        return key
    if key not in LINES:
        raise ValueError(f"unknown guideline line {key!r}: choose one of {', '.join(LINES)}")
    return LINES[key]


def limit(key: str | GuidelineLine, frequency: np.ndarray | float, factor: float = 1.0) -> np.ndarray:
    """PPV limit (m/s) of a guideline line at ``frequency`` (Hz), times a reduction ``factor`` (0 to 1)
    that the user chooses (1: none)."""
    line = guideline_line(key)
    scale = float(factor)
    if not 0.0 < scale <= 1.0:
        raise ValueError(f"the reduction factor must be above 0 and at most 1, not {factor!r}")
    f = np.asarray(frequency, dtype=float)
    if not np.isfinite(f).all() or (f < 0).any():
        raise ValueError("frequencies must be finite and not negative (Hz)")
    low = f < line.lowest
    if low.any() and line.displacement_below is None:
        raise ValueError(f"{line.title} starts at {line.lowest:g} Hz; {float(f[low].min()):g} Hz is below it "
                         f"and the guideline gives no value there")
    values = np.interp(f, line.frequencies, line.values)
    if line.displacement_below is not None:
        values = np.where(low, 2 * math.pi * f * line.displacement_below, values)
    return values * scale


def curve(key: str | GuidelineLine, f_min: float = 1.0, f_max: float = 150.0,
          points: int = 200) -> tuple[np.ndarray, np.ndarray]:
    """Frequencies (Hz, log-spaced, with the tabulated points added) and the limit (m/s) there, for a chart.

    ``f_min`` is raised to the line's lowest frequency where the guideline has nothing below it.
    """
    line = guideline_line(key)
    start = f_min if line.displacement_below is not None else max(f_min, line.lowest)
    if not (0 < start < f_max and math.isfinite(f_max)) or points < 2:
        raise ValueError(f"a chart needs 0 < f_min < f_max (got {f_min!r}, {f_max!r}) and at least 2 points")
    grid = np.geomspace(start, f_max, points)
    corners = [f for f in (*line.frequencies, line.lowest) if start < f < f_max]
    frequency = np.unique(np.concatenate([grid, corners]))
    return frequency, limit(line, frequency)


@dataclass(frozen=True)
class Assessment:
    """A PPV against a guideline line: limit (m/s), PPV / limit, and whether the limit is met (PPV <= limit,
    with a PPV equal to the limit within rounding counted as met)."""

    limit: np.ndarray
    ratio: np.ndarray
    met: np.ndarray
    key: str
    source: str


def assess(ppv: np.ndarray | float, frequency: np.ndarray | float, key: str | GuidelineLine,
           factor: float = 1.0) -> Assessment:
    """Compare PPVs (m/s) at their frequencies (Hz) with a guideline line (optionally reduced by ``factor``)."""
    line = guideline_line(key)
    value = np.asarray(ppv, dtype=float)
    if not np.isfinite(value).all() or (value < 0).any():
        raise ValueError("PPVs must be finite and not negative (m/s)")
    allowed = limit(line, frequency, factor)
    ratio = value / allowed
    return Assessment(allowed, ratio, ratio <= 1.0 + 1e-12, line.key, line.source)


@dataclass(frozen=True)
class HumanLevel:
    """A BS 5228-2 Table B.1 level (m/s) and what people in buildings are likely to make of it."""

    level: float
    description: str


HUMAN_LEVELS = (
    HumanLevel(0.14 * MM_S, "may just be felt where people are most sensitive, at the frequencies usual for "
                            "construction work; low frequencies are felt less"),
    HumanLevel(0.3 * MM_S, "may just be felt in homes"),
    HumanLevel(1.0 * MM_S, "likely to draw complaints in homes, though residents may accept it when told in "
                           "advance what will happen and why"),
    HumanLevel(10.0 * MM_S, "likely to be intolerable in most buildings for more than a very short exposure"),
)
HUMAN_SOURCE = "BS 5228-2:2009+A1:2014 Annex B, Table B.1 (from memory)"
BELOW_HUMAN_LEVELS = "below the lowest level of the table: unlikely to be felt"


def human_response_level(ppv: float) -> tuple[HumanLevel | None, str]:
    """The highest BS 5228-2 Table B.1 level a PPV (m/s) reaches (None below 0.14 mm/s) and its description."""
    value = float(ppv)
    if not math.isfinite(value) or value < 0:
        raise ValueError(f"a PPV must be a finite, non-negative number of m/s, not {ppv!r}")
    reached = [level for level in HUMAN_LEVELS if value >= level.level]
    if not reached:
        return None, BELOW_HUMAN_LEVELS
    return reached[-1], reached[-1].description
