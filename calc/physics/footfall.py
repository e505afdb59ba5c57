"""Forcing-frequency bands of people walking, running and jumping, and where a structure's frequencies fall.

Frequencies in Hz. Harmonic h of an activity covers h times its pacing-rate range: the
force of a periodic gait is a Fourier series at whole multiples of the pacing rate, and
the lateral force of walking repeats once every two steps (half the pacing rate).

One walking band is used everywhere in the product (this check, the floor's default pacing
rates, the footbridge and the typical values of F7): :data:`WALKING`, with its source.
Each source's ranges are read on their own: a frequency gets one verdict per row of
ranges (the most severe range containing it) and one margin per source.
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np

WALKING_SOURCE = "Eurocode footbridge serviceability teaching material, pacing rate (confirmed in one copy)"
BACHMANN = "Bachmann & Ammann, Vibrations in Structures Induced by Man and Machines, IABSE 1987 (from memory)"
SETRA = "Setra, Footbridges: assessment of vibrational behaviour, October 2006, risk ranges (from memory)"
HIVOSS = "HiVoSS, Design of Footbridges guideline (JRC), critical ranges (from memory)"
EN1990 = "EN 1990 Annex A2, A2.4.3.2 (as quoted in two secondary sources)"
SCI_P354 = "SCI P354, Design of Floors for Vibration: low/high-frequency cut-off (confirmed in a quotation)"
AISC_DG11 = "AISC Design Guide 11 (2nd ed.) 4.1: walking criterion up to 9 Hz (confirmed in a quotation)"

WALKING = (1.7, 2.4)
"""Pacing rate of walking, Hz: the one walking band of the product (:data:`WALKING_SOURCE`)."""
RUNNING = (2.0, 3.5)
"""Pacing rate of running, Hz (:data:`BACHMANN`)."""
JUMPING = (1.8, 3.4)
"""Rate of jumping, Hz (:data:`BACHMANN`)."""

FOOTBRIDGE_VERTICAL_LIMIT = 5.0
"""Below this vertical frequency (Hz) a footbridge's comfort is to be verified (:data:`EN1990`)."""
FOOTBRIDGE_LATERAL_LIMIT = 2.5
"""Below this lateral or torsional frequency (Hz) a footbridge's comfort is to be verified (:data:`EN1990`)."""
LOW_FREQUENCY_FLOOR = 10.0
"""SCI P354: below this frequency (Hz) a floor is a low-frequency floor (resonant response to walking)."""
DG11_LOW_FREQUENCY_FLOOR = 9.0
"""AISC Design Guide 11 (2nd ed.) 4.1: its walking criterion applies to floors up to this frequency (Hz)."""
LOW_FREQUENCY_LIMITS: tuple[tuple[str, float, str], ...] = (
    ("AISC DG11", DG11_LOW_FREQUENCY_FLOOR, AISC_DG11),
    ("SCI P354", LOW_FREQUENCY_FLOOR, SCI_P354),
)
"""(guide, limit in Hz, source): the low-frequency floor limit differs by guide."""


def low_frequency_floor(frequency: float, limit: float) -> bool:
    """Whether a floor of ``frequency`` (Hz) is a low-frequency floor for the guide of this limit: AISC DG11
    applies its walking criterion up to and including 9 Hz, SCI P354 below 10 Hz."""
    return frequency <= limit if limit == DG11_LOW_FREQUENCY_FLOOR else frequency < limit

LEVELS = ("warning", "caution", "info")
"""How strongly a range is reported, most severe first."""


@dataclass(frozen=True)
class Band:
    """A range of forcing frequencies (Hz) in one direction, with its source.

    ``guide`` bands are a guide's risk ranges for footbridges rather than an activity's forcing.
    ``level`` is how a frequency inside it is reported: "warning" for first harmonics and maximum-risk
    (critical) ranges, "caution" for higher harmonics and medium risk, "info" for low risk.
    ``row`` and ``mark`` place the band on a chart: one row per activity or guide, marked by
    harmonic or risk number; a frequency gets one verdict per row.
    """

    name: str
    direction: str
    low: float
    high: float
    source: str
    row: str
    mark: str
    level: str = "caution"
    guide: bool = False

    @property
    def severe(self) -> bool:
        """Whether a frequency inside deserves a warning."""
        return self.level == "warning"

    def contains(self, frequency: float) -> bool:
        """Whether ``frequency`` lies in the band, edges included."""
        return self.low <= frequency <= self.high

    def shown(self) -> str:
        return f"{self.name} {self.low:g}-{self.high:g}"


def _harmonics(row: str, activity: str, rate: tuple[float, float], count: int, source: str) -> tuple[Band, ...]:
    return tuple(Band(f"{activity} h{h}", "vertical", h * rate[0], h * rate[1], source, row, str(h),
                      level="warning" if h == 1 else "caution") for h in range(1, count + 1))


def _guide(name: str, direction: str, low: float, high: float, mark: str, level: str = "caution") -> Band:
    source, row = (SETRA, "S") if name.startswith("Setra") else (HIVOSS, "H")
    return Band(name, direction, low, high, source, row, mark, level=level, guide=True)


BANDS: tuple[Band, ...] = (
    *_harmonics("W", "walking", WALKING, 4, WALKING_SOURCE),
    *_harmonics("R", "running", RUNNING, 2, BACHMANN),
    *_harmonics("J", "jumping", JUMPING, 3, BACHMANN),
    _guide("Setra 1 max risk", "vertical", 1.7, 2.1, "1", level="warning"),
    _guide("Setra 2 medium risk", "vertical", 1.0, 1.7, "2"),
    _guide("Setra 2 medium risk", "vertical", 2.1, 2.6, "2"),
    _guide("Setra 3 low risk", "vertical", 2.6, 5.0, "3", level="info"),
    _guide("HiVoSS critical", "vertical", 1.25, 2.3, "1", level="warning"),
    _guide("HiVoSS 2nd harmonic", "vertical", 2.5, 4.6, "2"),
    Band("walking lateral", "lateral", WALKING[0] / 2, WALKING[1] / 2, WALKING_SOURCE, "W", "1", level="warning"),
    _guide("Setra lateral 1 max risk", "lateral", 0.5, 1.1, "1", level="warning"),
    _guide("Setra lateral 2 medium risk", "lateral", 0.3, 0.5, "2"),
    _guide("Setra lateral 2 medium risk", "lateral", 1.1, 1.3, "2"),
    _guide("Setra lateral 3 low risk", "lateral", 1.3, 2.5, "3", level="info"),
    _guide("HiVoSS lateral critical", "lateral", 0.5, 1.2, "1", level="warning"),
)
"""Every band, vertical first. Guides' footbridge ranges apply to footbridges only. Lateral walking
forces repeat at half the pacing rate."""


def bands_for(direction: str, structure: str) -> tuple[Band, ...]:
    """The bands that apply to a direction ('vertical' or 'lateral') of a structure ('footbridge' or 'floor')."""
    return tuple(b for b in BANDS if b.direction == direction and (structure == "footbridge" or not b.guide))


def bands_containing(frequency: float, bands: tuple[Band, ...]) -> tuple[Band, ...]:
    """The bands that contain ``frequency``."""
    return tuple(b for b in bands if b.contains(frequency))


def sources_of(bands: tuple[Band, ...]) -> tuple[str, ...]:
    """The sources of these bands, each once, in the order of :data:`BANDS`."""
    return tuple(dict.fromkeys(b.source for b in bands))


def verdicts(frequency: float, bands: tuple[Band, ...]) -> tuple[Band, ...]:
    """One range per row (activity or guide) that contains ``frequency``: the most severe one, and of
    those the lowest harmonic or range. A frequency on the edge between two ranges of one guide
    (1.1 Hz lateral, Setra 1 and 2) is given the higher risk."""
    chosen: dict[tuple[str, str], Band] = {}
    for band in bands_containing(frequency, bands):
        key = (band.source, band.row)
        held = chosen.get(key)
        if held is None or LEVELS.index(band.level) < LEVELS.index(held.level):
            chosen[key] = band
    return tuple(chosen.values())


def forcing_margin(frequency: float, bands: tuple[Band, ...]) -> float:
    """Signed distance (Hz) from ``frequency`` to the nearest edge of these bands, overlapping or touching
    bands merged: positive when clear of them all; when inside, minus the shift that would clear the
    merged range containing it. Pass the bands of one source (:func:`source_margin`) to read that
    source's ranges on their own."""
    merged: list[list[float]] = []
    for band in sorted(bands, key=lambda b: b.low):
        if merged and band.low <= merged[-1][1]:
            merged[-1][1] = max(merged[-1][1], band.high)
        else:
            merged.append([band.low, band.high])
    for low, high in merged:
        if low <= frequency <= high:
            return 0.0 - min(frequency - low, high - frequency)  # 0.0 - 0.0 is 0.0, not -0.0
    return min(min(abs(frequency - low), abs(frequency - high)) for low, high in merged)


def source_margin(frequency: float, bands: tuple[Band, ...], source: str) -> float:
    """:func:`forcing_margin` to the ranges of one source only."""
    return forcing_margin(frequency, tuple(b for b in bands if b.source == source))


def nearest_band(frequency: float, bands: tuple[Band, ...]) -> Band:
    """The band whose nearer edge is closest to ``frequency``."""
    return min(bands, key=lambda b: min(abs(frequency - b.low), abs(frequency - b.high)))


def comfort_check_needed(frequency: float, direction: str, structure: str,
                         floor_limit: float = LOW_FREQUENCY_FLOOR) -> tuple[bool, str, str]:
    """Whether a comfort (acceleration) check is needed, the rule applied in words, and its source.

    For a floor's vertical direction this is the resonant (low-frequency) check below ``floor_limit``
    (SCI P354's 10 Hz by default; AISC DG11's is 9 Hz); above it a transient check still applies."""
    if structure == "footbridge":
        limit = FOOTBRIDGE_VERTICAL_LIMIT if direction == "vertical" else FOOTBRIDGE_LATERAL_LIMIT
        return frequency < limit, f"{direction} frequency below {limit:g} Hz", EN1990
    if direction == "vertical":
        source = AISC_DG11 if floor_limit == DG11_LOW_FREQUENCY_FLOOR else SCI_P354
        return (low_frequency_floor(frequency, floor_limit),
                f"floor below {floor_limit:g} Hz responds resonantly to walking harmonics", source)
    inside = bool(bands_containing(frequency, bands_for(direction, structure)))
    return inside, "inside a lateral forcing band", "Common practice (no floor limit known)"


def chart_rows(bands: tuple[Band, ...]) -> dict[str, np.ndarray]:
    """Series for a band chart: one row per band, index into :data:`BANDS`, low and high edge (Hz)."""
    index = np.array([BANDS.index(b) for b in bands], dtype=float)
    return {"band_index": index, "band_low": np.array([b.low for b in bands]),
            "band_high": np.array([b.high for b in bands])}
