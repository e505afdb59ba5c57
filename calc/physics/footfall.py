"""Forcing-frequency bands of people walking, running and jumping, and where a structure's frequencies fall.

Frequencies in Hz. Harmonic h of an activity covers h times its pacing-rate range: the
force of a periodic gait is a Fourier series at whole multiples of the pacing rate, and
the lateral force of walking repeats once every two steps (half the pacing rate).
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np

BACHMANN = "Bachmann & Ammann, Vibrations in Structures Induced by Man and Machines, IABSE 1987 (from memory)"
SETRA = "Setra, Footbridges: assessment of vibrational behaviour, October 2006, risk ranges (from memory)"
HIVOSS = "HiVoSS, Design of Footbridges guideline (JRC), critical ranges (from memory)"
EN1990 = "EN 1990 Annex A2, A2.4.3.2 (from memory)"
SCI_P354 = "SCI P354, Design of Floors for Vibration (from memory)"

WALKING = (1.6, 2.4)
"""Pacing rate of walking, Hz."""
RUNNING = (2.0, 3.5)
"""Pacing rate of running, Hz."""
JUMPING = (1.8, 3.4)
"""Rate of jumping, Hz."""

FOOTBRIDGE_VERTICAL_LIMIT = 5.0
"""Below this vertical frequency (Hz) a footbridge's comfort is to be verified."""
FOOTBRIDGE_LATERAL_LIMIT = 2.5
"""Below this lateral or torsional frequency (Hz) a footbridge's comfort is to be verified."""
LOW_FREQUENCY_FLOOR = 10.0
"""Below this frequency (Hz) a floor can respond resonantly to walking harmonics."""



@dataclass(frozen=True)
class Band:
    """A range of forcing frequencies (Hz) in one direction, with its source.

    ``guide`` bands are a guide's risk ranges for footbridges rather than an activity's forcing.
    ``severe`` bands deserve a warning (first harmonics, maximum-risk ranges), the rest a caution.
    ``row`` and ``mark`` place the band on a chart: one row per activity or guide, marked by
    harmonic or risk number.
    """

    name: str
    direction: str
    low: float
    high: float
    source: str
    row: str
    mark: str
    severe: bool = False
    guide: bool = False

    def contains(self, frequency: float) -> bool:
        """Whether ``frequency`` lies in the band, edges included."""
        return self.low <= frequency <= self.high

    def shown(self) -> str:
        return f"{self.name} {self.low:g}-{self.high:g}"


def _harmonics(row: str, activity: str, rate: tuple[float, float], count: int) -> tuple[Band, ...]:
    return tuple(Band(f"{activity} h{h}", "vertical", h * rate[0], h * rate[1], BACHMANN, row, str(h),
                      severe=h == 1) for h in range(1, count + 1))


def _guide(name: str, direction: str, low: float, high: float, mark: str, severe: bool = False) -> Band:
    source, row = (SETRA, "S") if name.startswith("Setra") else (HIVOSS, "H")
    return Band(name, direction, low, high, source, row, mark, severe=severe, guide=True)


BANDS: tuple[Band, ...] = (
    *_harmonics("W", "walking", WALKING, 4),
    *_harmonics("R", "running", RUNNING, 2),
    *_harmonics("J", "jumping", JUMPING, 3),
    _guide("Setra 1 max risk", "vertical", 1.7, 2.1, "1", severe=True),
    _guide("Setra 2 medium risk", "vertical", 1.0, 1.7, "2"),
    _guide("Setra 2 medium risk", "vertical", 2.1, 2.6, "2"),
    _guide("Setra 3 low risk", "vertical", 2.6, 5.0, "3"),
    _guide("HiVoSS critical", "vertical", 1.25, 2.3, "1", severe=True),
    _guide("HiVoSS 2nd harmonic", "vertical", 2.5, 4.6, "2"),
    Band("walking lateral", "lateral", WALKING[0] / 2, WALKING[1] / 2, BACHMANN, "W", "1", severe=True),
    _guide("Setra lateral 1 max risk", "lateral", 0.5, 1.1, "1", severe=True),
    _guide("Setra lateral 2 medium risk", "lateral", 0.3, 0.5, "2"),
    _guide("Setra lateral 2 medium risk", "lateral", 1.1, 1.3, "2"),
    _guide("Setra lateral 3 low risk", "lateral", 1.3, 2.5, "3"),
    _guide("HiVoSS lateral critical", "lateral", 0.5, 1.2, "1", severe=True),
)
"""Every band, vertical first. Guides' footbridge ranges apply to footbridges only. Lateral walking
forces repeat at half the pacing rate."""


def bands_for(direction: str, structure: str) -> tuple[Band, ...]:
    """The bands that apply to a direction ('vertical' or 'lateral') of a structure ('footbridge' or 'floor')."""
    return tuple(b for b in BANDS if b.direction == direction and (structure == "footbridge" or not b.guide))


def bands_containing(frequency: float, bands: tuple[Band, ...]) -> tuple[Band, ...]:
    """The bands that contain ``frequency``."""
    return tuple(b for b in bands if b.contains(frequency))


def forcing_margin(frequency: float, bands: tuple[Band, ...]) -> float:
    """Signed distance (Hz) from ``frequency`` to the edge of the activity bands (not the guides' ranges),
    overlapping bands merged: positive when clear of them all; when inside, minus the shift that
    would clear the merged range containing it."""
    merged: list[list[float]] = []
    for band in sorted((b for b in bands if not b.guide), key=lambda b: b.low):
        if merged and band.low <= merged[-1][1]:
            merged[-1][1] = max(merged[-1][1], band.high)
        else:
            merged.append([band.low, band.high])
    for low, high in merged:
        if low <= frequency <= high:
            return -min(frequency - low, high - frequency)
    return min(min(abs(frequency - low), abs(frequency - high)) for low, high in merged)


def comfort_check_needed(frequency: float, direction: str, structure: str) -> tuple[bool, str, str]:
    """Whether a comfort (acceleration) check is needed, the rule applied in words, and its source."""
    if structure == "footbridge":
        limit = FOOTBRIDGE_VERTICAL_LIMIT if direction == "vertical" else FOOTBRIDGE_LATERAL_LIMIT
        return frequency < limit, f"{direction} frequency below {limit:g} Hz", EN1990
    if direction == "vertical":
        return (frequency < LOW_FREQUENCY_FLOOR,
                f"floor below {LOW_FREQUENCY_FLOOR:g} Hz responds resonantly to walking harmonics", SCI_P354)
    inside = bool(bands_containing(frequency, bands_for(direction, structure)))
    return inside, "inside a lateral forcing band", "Common practice (no floor limit known)"


def chart_rows(bands: tuple[Band, ...]) -> dict[str, np.ndarray]:
    """Series for a band chart: one row per band, index into :data:`BANDS`, low and high edge (Hz)."""
    index = np.array([BANDS.index(b) for b in bands], dtype=float)
    return {"band_index": index, "band_low": np.array([b.low for b in bands]),
            "band_high": np.array([b.high for b in bands])}
