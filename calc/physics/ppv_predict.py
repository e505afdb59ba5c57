"""Empirical prediction of the resultant peak particle velocity from piling and vibratory compaction,
after BS 5228-2:2009+A1:2014 Annex E, Table E.1, and the inverse: the distance at which a chosen
PPV is reached.

SI in and out: distances in m, hammer energy in J, drum amplitude in m, PPV in m/s. The published
formulas work in mm/s, mm and m; the conversion happens inside. Every constant, exponent and range
here is from memory of Table E.1 and was not confirmed against a copy: check it before relying on it.

- Percussive piling: v = k_p sqrt(W) / r^1.3 (mm/s); W hammer energy per blow (J), r slope distance
  from the pile toe (m); k_p by the ground at the toe (no probability level is attached).
- Vibratory piling: v = k_v / x^delta (mm/s), delta = 1.3; x horizontal distance (m).
- Vibratory compaction, steady running: v = k_s sqrt(n_d) (A / (x + L_d))^1.5 (mm/s); start-up and
  run-down: v = k_t sqrt(n_d) A^1.5 / (x + L_d)^1.3 (mm/s); n_d drums, A nominal drum amplitude (mm),
  L_d drum width (m), x distance (m).
- Probability levels: the chance that the predicted value is exceeded, 50 %, 33.3 % or 5 %.

Outside the ranges of the data behind each formula the prediction is refused (ValueError).
"""

from __future__ import annotations

import math
from dataclasses import dataclass

SOURCE = "BS 5228-2:2009+A1:2014 Annex E, Table E.1 (from memory)"
MM = 1e-3
"""One mm (or mm/s) in m (or m/s)."""

PROBABILITIES = (0.5, 0.333, 0.05)
"""Chance that the predicted PPV is exceeded, for the scaling factors below."""
VIBRATORY_PILING_K = {0.5: 60.0, 0.333: 126.0, 0.05: 266.0}
VIBRATORY_PILING_EXPONENT = 1.3
COMPACTION_STEADY_K = {0.5: 75.0, 0.333: 143.0, 0.05: 276.0}
COMPACTION_TRANSIENT_K = {0.5: 65.0, 0.333: 106.0, 0.05: 177.0}
PERCUSSIVE_EXPONENT = 1.3
PERCUSSIVE_K = {
    "refusal": 5.0,
    "very stiff or dense": 3.0,
    "stiff or medium dense": 1.5,
    "soft or loose": 1.0,
}
"""k_p by the ground at the pile toe: driven to refusal; very stiff cohesive, dense granular or fill with
obstructions; stiff cohesive, medium dense granular or compact fill; soft cohesive, loose granular, loose
fill or organic soils."""


@dataclass(frozen=True)
class Range:
    """Range of one input over which a formula was fitted (SI)."""

    name: str
    low: float
    high: float
    unit: str
    shown_scale: float = 1.0
    """Factor from SI to the unit shown in messages."""

    def check(self, value: float) -> float:
        """``value`` as a float, refused outside [low, high] with a message naming the formula's range."""
        number = float(value)
        if not math.isfinite(number) or not self.low <= number <= self.high:
            raise ValueError(f"{self.name} {number * self.shown_scale:g} {self.unit} is outside the range of the "
                             f"formula ({self.low * self.shown_scale:g} to {self.high * self.shown_scale:g} "
                             f"{self.unit}; {SOURCE})")
        return number


PERCUSSIVE_DISTANCE = Range("slope distance from the pile toe", 1.0, 100.0, "m")
PERCUSSIVE_ENERGY = Range("hammer energy", 85.0, 85_000.0, "J")
VIBRATORY_PILING_DISTANCE = Range("distance", 1.0, 100.0, "m")
COMPACTION_DISTANCE = Range("distance", 2.0, 110.0, "m")
COMPACTION_AMPLITUDE = Range("drum amplitude", 0.4e-3, 1.72e-3, "mm", 1e3)
COMPACTION_WIDTH = Range("drum width", 0.75, 2.2, "m")
COMPACTION_DRUMS = (1, 2)
PHASES = ("steady", "transient")
"""Vibratory compaction: steady running, or start-up and run-down."""


def _k(table: dict[float, float], probability: float) -> float:
    """Scaling factor for a probability of exceedance (0.5, 0.333 or 0.05; 1/3 is read as 0.333)."""
    for level, k in table.items():
        if abs(float(probability) - level) < 1e-3:
            return k
    raise ValueError(f"the probability of exceedance must be one of 0.5, 0.333 or 0.05, not {probability!r}")


def _ground(ground: str) -> float:
    if ground not in PERCUSSIVE_K:
        raise ValueError(f"unknown ground at the pile toe {ground!r}: choose one of {', '.join(PERCUSSIVE_K)}")
    return PERCUSSIVE_K[ground]


def _positive_ppv(ppv: float) -> float:
    value = float(ppv)
    if not math.isfinite(value) or value <= 0:
        raise ValueError(f"the PPV must be a positive number of m/s, not {ppv!r}")
    return value


def _reached(distance: float, valid: Range, ppv: float) -> float:
    """The distance at which ``ppv`` is reached, refused with the reason if outside the formula's range
    (a distance within rounding of an end of the range is put on it)."""
    slack = 1e-9 * valid.high
    if valid.low - slack <= distance < valid.low or valid.high < distance <= valid.high + slack:
        return min(max(distance, valid.low), valid.high)
    if distance < valid.low:
        raise ValueError(f"{ppv / MM:g} mm/s would be reached only {distance:.3g} m away, closer than the formula's "
                         f"range starts ({valid.low:g} m): it is not exceeded anywhere in that range")
    if distance > valid.high:
        raise ValueError(f"{ppv / MM:g} mm/s would be reached {distance:.4g} m away, beyond the formula's range "
                         f"(up to {valid.high:g} m): the prediction does not reach that far")
    return distance


def percussive_piling(energy: float, distance: float, ground: str) -> float:
    """Predicted resultant PPV (m/s) at slope ``distance`` (m) from the toe of a pile driven with ``energy``
    (J per blow) in the given ground (a key of :data:`PERCUSSIVE_K`)."""
    k = _ground(ground)
    w = PERCUSSIVE_ENERGY.check(energy)
    r = PERCUSSIVE_DISTANCE.check(distance)
    return k * math.sqrt(w) / r**PERCUSSIVE_EXPONENT * MM


def percussive_piling_distance(ppv: float, energy: float, ground: str) -> float:
    """Slope distance (m) from the pile toe beyond which the predicted PPV is below ``ppv`` (m/s)."""
    k = _ground(ground)
    w = PERCUSSIVE_ENERGY.check(energy)
    v = _positive_ppv(ppv)
    return _reached((k * math.sqrt(w) / (v / MM)) ** (1 / PERCUSSIVE_EXPONENT), PERCUSSIVE_DISTANCE, v)


def vibratory_piling(distance: float, probability: float = 0.5) -> float:
    """Predicted resultant PPV (m/s) at ``distance`` (m) from vibratory piling, for a probability of exceedance."""
    k = _k(VIBRATORY_PILING_K, probability)
    x = VIBRATORY_PILING_DISTANCE.check(distance)
    return k / x**VIBRATORY_PILING_EXPONENT * MM


def vibratory_piling_distance(ppv: float, probability: float = 0.5) -> float:
    """Distance (m) beyond which the predicted PPV of vibratory piling is below ``ppv`` (m/s)."""
    k = _k(VIBRATORY_PILING_K, probability)
    v = _positive_ppv(ppv)
    return _reached((k / (v / MM)) ** (1 / VIBRATORY_PILING_EXPONENT), VIBRATORY_PILING_DISTANCE, v)


def _compaction_inputs(amplitude: float, drum_width: float, drums: int, probability: float,
                       phase: str) -> tuple[float, float, float, int]:
    """(k, A in mm, L_d in m, n_d) for vibratory compaction, each checked."""
    if phase not in PHASES:
        raise ValueError(f"the compaction phase must be 'steady' or 'transient' (start-up and run-down), not {phase!r}")
    k = _k(COMPACTION_STEADY_K if phase == "steady" else COMPACTION_TRANSIENT_K, probability)
    if isinstance(drums, bool) or drums not in COMPACTION_DRUMS:
        raise ValueError(f"the number of vibrating drums must be 1 or 2 for the formula, not {drums!r}")
    a = COMPACTION_AMPLITUDE.check(amplitude) / MM
    return k, a, COMPACTION_WIDTH.check(drum_width), int(drums)


def vibratory_compaction(distance: float, amplitude: float, drum_width: float, drums: int = 1,
                         probability: float = 0.5, phase: str = "steady") -> float:
    """Predicted resultant PPV (m/s) at ``distance`` (m) from a vibratory roller with ``drums`` drums of
    nominal ``amplitude`` (m) and width ``drum_width`` (m); ``phase`` 'steady' or 'transient'."""
    k, a, width, n = _compaction_inputs(amplitude, drum_width, drums, probability, phase)
    x = COMPACTION_DISTANCE.check(distance)
    if phase == "steady":
        return k * math.sqrt(n) * (a / (x + width)) ** 1.5 * MM
    return k * math.sqrt(n) * a**1.5 / (x + width) ** 1.3 * MM


def vibratory_compaction_distance(ppv: float, amplitude: float, drum_width: float, drums: int = 1,
                                  probability: float = 0.5, phase: str = "steady") -> float:
    """Distance (m) beyond which the predicted PPV (m/s) of vibratory compaction is below ``ppv``."""
    k, a, width, n = _compaction_inputs(amplitude, drum_width, drums, probability, phase)
    v = _positive_ppv(ppv) / MM
    if phase == "steady":
        reach = a * (k * math.sqrt(n) / v) ** (1 / 1.5)
    else:
        reach = (k * math.sqrt(n) * a**1.5 / v) ** (1 / 1.3)
    return _reached(reach - width, COMPACTION_DISTANCE, v * MM)
