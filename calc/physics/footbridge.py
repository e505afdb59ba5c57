"""A footbridge's predicted response to pedestrians and crowds, its limits, lock-in and the damping it needs.

One mode at a time: natural frequency f (Hz), damping ratio zeta, modal mass M (kg, mode scaled to 1 at its
largest). The footbridge guides' load model is a harmonic force P psi cos(2 pi f t) per pedestrian, P the
amplitude of one walker's force in the direction and psi the reduction for how likely walkers pace near f
(the guides' frequency ranges, :mod:`footfall`). A stream of n pedestrians is replaced by n' equivalent
pedestrians in step with the mode, spread over the deck with the sign of the mode shape; the resonant modal
acceleration is then P psi n' s / (2 zeta M), s the mean of |mode shape| over the deck (2 / pi for a half
sine). Directions are 'vertical' and 'lateral' (horizontal, across the deck). SI throughout.
"""

from __future__ import annotations

import math
from dataclasses import dataclass
from typing import Any

import numpy as np

from fieldmode.calc.physics import footfall, tmd
from fieldmode.calc.physics.floor_walking import (
    MAX_DAMPING,
    MIN_DAMPING,
    STRIDE,
    check_damping,
    check_positive,
    crossing_cycles,
    crossing_factor,
)

SETRA = "Setra"
HIVOSS = "HiVoSS"
GUIDES = (SETRA, HIVOSS)
DIRECTIONS = ("vertical", "lateral")
GUIDE_SOURCES: dict[str, str] = {
    SETRA: "Setra, Footbridges: assessment of vibrational behaviour, October 2006 (from memory)",
    HIVOSS: "HiVoSS, Design of Footbridges guideline, JRC (from memory)",
}
EN1990_SOURCE = "EN 1990 Annex A2, A2.4.3.2, recommended values as quoted; National Annexes may change them"
LOCK_IN_SOURCE = ("Dallard et al. 2001, The Structural Engineer 79(22), as used by the Setra and HiVoSS "
                  "footbridge guides (from memory)")
MATERIAL_DAMPING_SOURCE = "ISO 10137 / BS 5400-2, footbridges under service loads"

PEDESTRIAN_FORCE: dict[str, float] = {"vertical": 280.0, "lateral": 35.0}
"""Force amplitude P of one walker, N: 280 N vertical, 35 N lateral (Setra 2006 and HiVoSS; from memory)."""
SPARSE_FACTOR = 10.8
"""n' = 10.8 sqrt(zeta n) for streams sparser than :data:`DENSE_DENSITY` (Setra, HiVoSS; from memory)."""
DENSE_FACTOR = 1.85
"""n' = 1.85 sqrt(n) for streams of :data:`DENSE_DENSITY` and above (Setra, HiVoSS; from memory)."""
DENSE_DENSITY = 1.0
"""Density (pedestrians/m^2) from which a stream counts as dense (HiVoSS, from memory)."""
HALF_SINE_SHAPE_MEAN = 2.0 / math.pi
"""Mean of |sin(pi x / L)| over the span: the shape factor of a simply supported span's first mode."""

TRAFFIC_CLASSES: dict[str, tuple[float, str]] = {
    "TC1": (15.0, "a group of 15 pedestrians (count, not density)"),
    "TC2": (0.2, "weak traffic"),
    "TC3": (0.5, "dense traffic"),
    "TC4": (1.0, "very dense traffic"),
    "TC5": (1.5, "exceptionally dense traffic"),
}
"""HiVoSS traffic classes: density in pedestrians/m^2 (TC1: a count) and what it is (from memory)."""

EN1990_LIMITS: dict[str, float] = {"vertical": 0.7, "lateral": 0.2}
"""EN 1990 Annex A2 (A2.4.3.2) recommended largest deck accelerations in normal use, m/s^2 (as quoted)."""
EN1990_CROWD_LATERAL = 0.4
"""EN 1990 Annex A2 (A2.4.3.2) recommended largest horizontal acceleration for exceptional crowds, m/s^2."""


@dataclass(frozen=True)
class ComfortClass:
    """A comfort class: its name and the largest vertical and lateral peak accelerations in it (m/s^2)."""

    name: str
    vertical: float
    lateral: float

    def upper(self, direction: str) -> float:
        """Largest peak acceleration (m/s^2) of the class in ``direction``."""
        return self.vertical if direction == "vertical" else self.lateral


COMFORT_CLASSES: dict[str, tuple[ComfortClass, ...]] = {
    HIVOSS: (ComfortClass("CL1 maximum", 0.5, 0.1), ComfortClass("CL2 medium", 1.0, 0.3),
             ComfortClass("CL3 minimum", 2.5, 0.8), ComfortClass("CL4 unacceptable", math.inf, math.inf)),
    SETRA: (ComfortClass("maximum", 0.5, 0.15), ComfortClass("mean", 1.0, 0.3), ComfortClass("minimum", 2.5, 0.8),
            ComfortClass("unacceptable", math.inf, math.inf)),
}
"""Comfort classes by guide, best first, each including its upper bounds (from memory)."""

LATERAL_PEDESTRIAN_DAMPING = 300.0
"""Lateral force per unit deck velocity that one pedestrian feeds into a lateral mode of about 0.5 to 1 Hz,
N s/m (Dallard et al. 2001; from memory)."""

MATERIAL_DAMPING: dict[str, float] = {"steel": 0.005, "composite": 0.006, "concrete": 0.008}
"""Typical damping ratio of a footbridge under service loads by construction (ISO 10137 / BS 5400-2)."""


def _band_edges(name: str, direction: str) -> tuple[float, float]:
    found = [b for b in footfall.BANDS if b.name == name and b.direction == direction]
    return min(b.low for b in found), max(b.high for b in found)


def _reduction_points() -> dict[tuple[str, str], tuple[tuple[float, float], ...]]:
    """Corners (Hz, psi) of each guide's reduction factor: the ranges of :mod:`footfall`, with psi = 1 on
    1.7-2.1 Hz vertical (HiVoSS: 0.7-1.0 Hz lateral) and 0.25 on 3.4-4.2 Hz for the second harmonic."""
    s_medium = _band_edges("Setra 2 medium risk", "vertical")
    s_max = _band_edges("Setra 1 max risk", "vertical")
    s_low = _band_edges("Setra 3 low risk", "vertical")
    s_lat_medium = _band_edges("Setra lateral 2 medium risk", "lateral")
    s_lat_max = _band_edges("Setra lateral 1 max risk", "lateral")
    h_first = _band_edges("HiVoSS critical", "vertical")
    h_second = _band_edges("HiVoSS 2nd harmonic", "vertical")
    h_lat = _band_edges("HiVoSS lateral critical", "lateral")
    second = ((3.4, 0.25), (4.2, 0.25))
    return {
        (SETRA, "vertical"): ((s_medium[0], 0.0), (s_max[0], 1.0), (s_max[1], 1.0), (s_medium[1], 0.0),
                              *second, (s_low[1], 0.0)),
        (HIVOSS, "vertical"): ((h_first[0], 0.0), (1.7, 1.0), (2.1, 1.0), (h_first[1], 0.0), (h_second[0], 0.0),
                               *second, (h_second[1], 0.0)),
        (SETRA, "lateral"): ((s_lat_medium[0], 0.0), (s_lat_max[0], 1.0), (s_lat_max[1], 1.0),
                             (s_lat_medium[1], 0.0)),
        (HIVOSS, "lateral"): ((h_lat[0], 0.0), (0.7, 1.0), (1.0, 1.0), (h_lat[1], 0.0)),
    }


REDUCTION_POINTS = _reduction_points()
"""(guide, direction) -> corners (Hz, psi) of the reduction factor, linear between them, 0 outside (from
memory)."""


def _direction(direction: str) -> str:
    if direction not in DIRECTIONS:
        raise ValueError(f"direction must be one of {DIRECTIONS}, not {direction!r}")
    return direction


def _guide(guide: str) -> str:
    if guide not in GUIDES:
        raise ValueError(f"guide must be one of {GUIDES}, not {guide!r}")
    return guide


def modal_mass_simply_supported(mass_per_length: float, span: float) -> float:
    """Modal mass (kg) of any vertical or lateral mode sin(n pi x / L) of a simply supported span of uniform
    ``mass_per_length`` (kg/m) and ``span`` (m): m L / 2."""
    check_positive("mass per length", mass_per_length)
    check_positive("span", span)
    return mass_per_length * span / 2.0


def frequency_reduction(frequency: float, direction: str = "vertical", guide: str = HIVOSS) -> float:
    """The guide's reduction factor psi (0 to 1) for a mode of ``frequency`` (Hz) in ``direction``."""
    check_positive("natural frequency", frequency)
    corners = np.array(REDUCTION_POINTS[(_guide(guide), _direction(direction))])
    return float(np.interp(frequency, corners[:, 0], corners[:, 1], left=0.0, right=0.0))


def single_pedestrian_acceleration(frequency: float, damping: float, modal_mass: float, direction: str = "vertical",
                                   *, span: float | None = None, mode_factor: float = 1.0, guide: str | None = None,
                                   stride: float = STRIDE) -> float:
    """Peak acceleration (m/s^2) of a mode under one walker at resonance: P mu / (2 zeta M), P of
    :data:`PEDESTRIAN_FORCE`, mu = ``mode_factor`` (the mode's amplitude where the walker is).

    The walker paces at the mode's frequency (twice it laterally). With ``span`` (m) the walker crosses a
    half-sine mode along it, so only :func:`floor_walking.crossing_factor` of the steady amplitude builds up
    (then mu is the amplitude at midspan). With ``guide`` its reduction psi for the frequency is applied.
    """
    check_positive("natural frequency", frequency)
    check_damping(damping)
    check_positive("modal mass", modal_mass)
    force = PEDESTRIAN_FORCE[_direction(direction)] * mode_factor
    if guide is not None:
        force *= frequency_reduction(frequency, direction, guide)
    share = 1.0
    if span is not None:
        pacing = frequency if direction == "vertical" else 2.0 * frequency
        share = crossing_factor(damping, crossing_cycles(frequency, span, pacing, stride))
    return share * force / (2.0 * damping * modal_mass)


def traffic_density(traffic_class: str, deck_area: float) -> float:
    """Density (pedestrians/m^2) of a HiVoSS traffic class on a deck of ``deck_area`` (m^2)."""
    if traffic_class not in TRAFFIC_CLASSES:
        raise ValueError(f"traffic class must be one of {tuple(TRAFFIC_CLASSES)}, not {traffic_class!r}")
    check_positive("deck area", deck_area)
    value = TRAFFIC_CLASSES[traffic_class][0]
    return value / deck_area if traffic_class == "TC1" else value


def equivalent_pedestrians(count: float, damping: float, density: float) -> float:
    """Equivalent number n' of pedestrians in step with the mode for ``count`` pedestrians at ``density``
    (pedestrians/m^2): 10.8 sqrt(zeta n) below :data:`DENSE_DENSITY`, 1.85 sqrt(n) from it."""
    if not (math.isfinite(count) and count >= 0.0):
        raise ValueError(f"number of pedestrians must be 0 or more, not {count:g}")
    check_damping(damping)
    check_positive("density", density)
    if density < DENSE_DENSITY:
        return SPARSE_FACTOR * math.sqrt(damping * count)
    return DENSE_FACTOR * math.sqrt(count)


@dataclass(frozen=True)
class StreamResponse:
    """A mode's resonant response to a stream: pedestrians on the deck, equivalent pedestrians, reduction
    psi, modal force amplitude (N) and peak acceleration (m/s^2)."""

    count: float
    equivalent: float
    reduction: float
    force: float
    acceleration: float


def stream_acceleration(frequency: float, damping: float, modal_mass: float, deck_area: float, density: float,
                        direction: str = "vertical", guide: str = HIVOSS,
                        shape_mean: float = HALF_SINE_SHAPE_MEAN) -> StreamResponse:
    """Peak acceleration of a mode (frequency Hz, modal mass kg) under a stream of ``density``
    (pedestrians/m^2) on ``deck_area`` (m^2): P psi n' s / (2 zeta M), s = ``shape_mean``."""
    check_positive("natural frequency", frequency)
    check_positive("modal mass", modal_mass)
    check_positive("deck area", deck_area)
    check_positive("mode shape mean", shape_mean)
    count = density * deck_area
    equivalent = equivalent_pedestrians(count, damping, density)
    reduction = frequency_reduction(frequency, direction, guide)
    force = PEDESTRIAN_FORCE[direction] * reduction * equivalent * shape_mean
    return StreamResponse(count, equivalent, reduction, force, force / (2.0 * damping * modal_mass))


def en1990_limit(direction: str, exceptional_crowd: bool = False) -> float:
    """EN 1990 Annex A2 (A2.4.3.2) recommended largest deck acceleration (m/s^2), as quoted: 0.7 vertical,
    0.2 lateral in normal use, 0.4 lateral for exceptional crowds. National Annexes may change them."""
    if _direction(direction) == "lateral" and exceptional_crowd:
        return EN1990_CROWD_LATERAL
    return EN1990_LIMITS[direction]


def meets_en1990(acceleration: float, direction: str, exceptional_crowd: bool = False) -> bool:
    """Whether a deck acceleration (m/s^2) is within the EN 1990 Annex A2 recommended limit (equal passes)."""
    return acceleration <= en1990_limit(direction, exceptional_crowd)


def comfort_class(acceleration: float, direction: str = "vertical", guide: str = HIVOSS) -> str:
    """The guide's comfort class of a peak acceleration (m/s^2): the best whose upper bound it does not pass."""
    if not (acceleration >= 0.0):
        raise ValueError(f"acceleration must be 0 or more, not {acceleration:g}")
    _direction(direction)
    return next(c.name for c in COMFORT_CLASSES[_guide(guide)] if acceleration <= c.upper(direction))


def comfort_limit(comfort: str, direction: str = "vertical", guide: str = HIVOSS) -> float:
    """Largest peak acceleration (m/s^2) of a comfort class of the guide in ``direction``."""
    _direction(direction)
    for row in COMFORT_CLASSES[_guide(guide)]:
        if row.name == comfort:
            return row.upper(direction)
    raise ValueError(f"comfort class must be one of {[c.name for c in COMFORT_CLASSES[guide]]}, not {comfort!r}")


@dataclass(frozen=True)
class LockIn:
    """Pedestrians on the deck, the critical number for lateral lock-in, and whether the stream exceeds it."""

    count: float
    critical: float
    exceeded: bool


def lock_in_pedestrians(frequency: float, damping: float, modal_mass: float,
                        coefficient: float = LATERAL_PEDESTRIAN_DAMPING) -> float:
    """Critical number of pedestrians for lateral lock-in of a lateral mode (frequency Hz, modal mass kg):
    N_L = 8 pi zeta f M / k, k = ``coefficient`` (N s/m per pedestrian)."""
    check_positive("natural frequency", frequency)
    check_damping(damping, resonant=False)
    check_positive("modal mass", modal_mass)
    check_positive("pedestrian lateral damping coefficient", coefficient)
    return 8.0 * math.pi * damping * frequency * modal_mass / coefficient


def lock_in(frequency: float, damping: float, modal_mass: float, deck_area: float, density: float,
            coefficient: float = LATERAL_PEDESTRIAN_DAMPING) -> LockIn:
    """Whether a stream of ``density`` (pedestrians/m^2) on ``deck_area`` (m^2) exceeds the critical number."""
    check_positive("deck area", deck_area)
    check_positive("density", density)
    critical = lock_in_pedestrians(frequency, damping, modal_mass, coefficient)
    count = density * deck_area
    return LockIn(count, critical, count > critical)


def damping_for_lock_in(count: float, frequency: float, modal_mass: float,
                        coefficient: float = LATERAL_PEDESTRIAN_DAMPING) -> float | None:
    """Damping ratio at which ``count`` pedestrians are the critical number: k N / (8 pi f M); None when it
    would exceed :data:`floor_walking.MAX_DAMPING`."""
    check_positive("number of pedestrians", count)
    check_positive("natural frequency", frequency)
    check_positive("modal mass", modal_mass)
    damping = coefficient * count / (8.0 * math.pi * frequency * modal_mass)
    return damping if damping <= MAX_DAMPING else None


def stream_damping_for_limit(limit: float, frequency: float, modal_mass: float, deck_area: float, density: float,
                             direction: str = "vertical", guide: str = HIVOSS,
                             shape_mean: float = HALF_SINE_SHAPE_MEAN) -> float | None:
    """Damping ratio that brings a stream's acceleration to ``limit`` (m/s^2), closed form: the response goes
    as zeta^-1/2 for sparse streams (n' grows as sqrt(zeta)) and as 1/zeta for dense ones. 0.0 when the
    stream does not excite the mode (psi = 0); None when more than :data:`floor_walking.MAX_DAMPING`."""
    check_positive("acceleration limit", limit)
    check_positive("density", density)
    unit = stream_acceleration(frequency, 0.5, modal_mass, deck_area, density, direction, guide, shape_mean)
    if unit.reduction == 0.0:
        return 0.0
    at_half = unit.acceleration / limit
    damping = 0.5 * at_half**2 if density < DENSE_DENSITY else 0.5 * at_half
    return damping if damping <= MAX_DAMPING else None


def single_pedestrian_damping_for_limit(limit: float, frequency: float, modal_mass: float,
                                        direction: str = "vertical", **options: Any) -> float | None:
    """Damping ratio that brings one walker's acceleration (:func:`single_pedestrian_acceleration`, same
    options) to ``limit`` (m/s^2): closed form at steady state, brentq with a crossing. 0.0 when the walker
    cannot excite the mode or a crossing keeps it within the limit at the least damping MIN_DAMPING; None
    beyond MAX_DAMPING."""
    from scipy.optimize import brentq

    check_positive("acceleration limit", limit)

    def excess(zeta: float) -> float:
        return single_pedestrian_acceleration(frequency, zeta, modal_mass, direction, **options) / limit - 1.0

    if excess(MAX_DAMPING) > 0.0:
        return None
    low = MIN_DAMPING
    if excess(low) <= 0.0:
        return 0.0
    return brentq(excess, low, MAX_DAMPING, xtol=1e-13, rtol=1e-12)


def damper_damping(required: float, structural: float) -> float:
    """Equivalent damping ratio a damper must add to the structure's own: required - structural, at least 0."""
    check_damping(required, resonant=False)
    check_damping(structural, resonant=False)
    return max(required - structural, 0.0)


def damper_mass_ratio(required: float, structural: float) -> float:
    """Mass ratio of an optimally tuned mass damper giving the mode an equivalent damping ``required``
    (:func:`tmd.mass_ratio_for_damping`, harmonic force on the mode); ValueError when over 50 % is needed."""
    check_damping(required)
    check_damping(structural, resonant=False)
    return tmd.mass_ratio_for_damping(required, structural, "force")
