"""A low-frequency floor's predicted response to walking, and what it would take to meet a limit.

Two methods, SI throughout (N, kg, m, s, Hz, m/s^2):

- AISC Design Guide 11 (2nd ed.) walking criterion, floors up to 9 Hz:
  a_p / g = P0 exp(-0.35 fn) / (beta W), W the effective weight of the panel (N).
- Resonant response from first principles, floors below the low/high-frequency cutoff of a guide:
  the walking force is a Fourier series at the pacing rate fp, F(t) = Q [1 + sum_h alpha_h sin(2 pi h fp t)];
  the harmonic h nearest the floor's frequency drives the mode (modal mass M, damping ratio zeta) to a
  steady acceleration amplitude alpha_h Q mu r^2 / (M sqrt((1 - r^2)^2 + (2 zeta r)^2)), r = h fp / fn
  (alpha_h Q mu / (2 zeta M) at resonance), less the part the walker has no time to build up: the share
  1 - exp(-2 pi zeta N) of the resonant amplitude after N cycles at the antinode, or the crossing factor
  of a walker crossing a half-sine mode.

The cutoff between low- and high-frequency floors differs by guide: 9 Hz in AISC Design Guide 11 (2nd ed.)
4.1, 10 Hz in SCI P354. Above it a floor answers each footfall as an impulse (:mod:`floor_impulse`).
"""

from __future__ import annotations

import math
from dataclasses import dataclass
from typing import Any

import numpy as np

from fieldmode.calc.physics import base_curves, footfall
from fieldmode.calc.physics.constants import STANDARD_GRAVITY

AISC_DG11 = "AISC DG11"
SCI_P354 = "SCI P354"
GUIDES = (AISC_DG11, SCI_P354)
CUTOFF_HZ: dict[str, float] = {AISC_DG11: footfall.DG11_LOW_FREQUENCY_FLOOR, SCI_P354: footfall.LOW_FREQUENCY_FLOOR}
"""Low/high-frequency floor cutoff by guide (Hz): AISC Design Guide 11 (2nd ed.) 4.1 applies its walking
criterion up to 9 Hz; SCI P354 puts the cutoff at 10 Hz."""

DG11_SOURCE = "AISC Design Guide 11, 2nd ed., chapter 4"
DG11_LIMITS_SOURCE = "AISC Design Guide 11, tolerance limits by occupancy (from memory)"
P354_SOURCE = "SCI P354, Design of Floors for Vibration, 2007 (from memory)"
ALLEN_MURRAY = "Allen & Murray, Design criterion for vibrations due to walking, AISC Engineering Journal 1993"

DG11_FORCE: dict[str, float] = {"floor": 290.0, "footbridge": 410.0}
"""Constant force P0 (N) of the walking criterion: 65 lb (0.29 kN) for floors, 92 lb (about 0.41 kN)
for pedestrian bridges (AISC Design Guide 11, 2nd ed., chapter 4)."""
DG11_EXPONENT = 0.35
"""Decay of the walking force with frequency in the criterion, 1/Hz (from memory)."""
DG11_FOOTBRIDGE_LATERAL_MIN_HZ = 1.3
"""Least lateral frequency of a pedestrian bridge in AISC Design Guide 11, 2nd ed., chapter 4 (Hz)."""

DG11_LIMITS: dict[str, tuple[str, float]] = {
    "office": ("floor", 0.005),
    "residence": ("floor", 0.005),
    "mall": ("floor", 0.015),
    "dining": ("floor", 0.015),
    "indoor footbridge": ("footbridge", 0.015),
    "outdoor footbridge": ("footbridge", 0.05),
}
"""Occupancy -> (structure, peak-acceleration tolerance as a fraction of g), AISC Design Guide 11
(from memory)."""

FLOOR_DAMPING: dict[str, tuple[float, str]] = {
    "bare": (0.02, "few non-structural components (ceilings, ducts)"),
    "fitted out": (0.03, "offices, residences, churches with their fit-out"),
    "full-height partitions": (0.05, "partitions from floor to floor"),
    "mall": (0.02, "shopping malls"),
    "footbridge": (0.01, "pedestrian bridges"),
}
"""Typical damping ratio of a floor by fit-out, with what it covers (Allen & Murray 1993)."""
FLOOR_DAMPING_SOURCE = ALLEN_MURRAY

PERSON_WEIGHT = 700.0
"""Weight of a walker Q, N (0.7 kN, as in AISC Design Guide 11 and the footbridge guides; from memory)."""
STRIDE = 0.75
"""Length of a walking step, m (Bachmann & Ammann 1987, walking at about 2 Hz; from memory)."""
MIN_DAMPING = 1e-4
"""Least damping ratio a resonant response is computed for (0.01 %): less is no floor or footbridge, and the
build-up would take longer than any crossing (common practice, no source)."""
MAX_DAMPING = 0.2
"""Largest damping ratio a damping target may ask for: beyond it no floor or footbridge is plausible."""
LOWEST_FLOOR_HZ = base_curves.LOWEST_HZ
"""Lowest floor frequency a frequency target searches from (Hz): where the base curves begin."""

DLF_SOURCES: dict[str, str] = {
    SCI_P354: "SCI P354, Fourier coefficients of walking by harmonic (from memory)",
    AISC_DG11: "Allen & Murray / AISC Design Guide 11, 1st ed., dynamic coefficients of walking (from memory)",
}
_P354_DLF = ((0.436, -0.95), (0.006, 12.3), (0.007, 5.2), (0.007, 2.0))
"""alpha_h = a (h fp + b) for harmonics 1-4, h fp in Hz (SCI P354, from memory)."""
_DG11_DLF = (0.5, 0.2, 0.1, 0.05)
"""alpha_h for harmonics 1-4 (Allen & Murray; AISC Design Guide 11 1st ed., from memory)."""
HARMONICS = 4
"""Harmonics of the walking force taken into account."""


def typical_damping_text() -> str:
    """The typical floor damping ratios in words, for messages."""
    return ", ".join(f"{100 * zeta:g} % {name}" for name, (zeta, _) in FLOOR_DAMPING.items())


def check_damping(damping: float, resonant: bool = True) -> None:
    """Refuse a damping ratio outside MIN_DAMPING <= zeta < 1 (0 allowed when ``resonant`` is False)."""
    if not math.isfinite(damping) or damping >= 1.0 or damping < 0.0 or (resonant and damping < MIN_DAMPING):
        unbounded = " (a resonant response is unbounded without damping)" if resonant and damping == 0.0 else ""
        raise ValueError(f"damping ratio must be {'above' if resonant else 'at least'} 0 and below 1, "
                         f"not {damping:g}{unbounded}; typical floors: {typical_damping_text()} ({ALLEN_MURRAY})")


def check_positive(name: str, value: float) -> None:
    """Refuse a value that is not finite and above zero."""
    if not (math.isfinite(value) and value > 0.0):
        raise ValueError(f"{name} must be a finite number above 0, not {value:g}")


def _guide(guide: str) -> str:
    if guide not in GUIDES:
        raise ValueError(f"guide must be one of {GUIDES}, not {guide!r}")
    return guide


# --- AISC Design Guide 11 walking criterion -------------------------------------------------------------

def _dg11_force(frequency: float, structure: str) -> float:
    """g P0 exp(-0.35 fn) (N m/s^2) after checking the criterion's range."""
    if structure not in DG11_FORCE:
        raise ValueError(f"structure must be one of {tuple(DG11_FORCE)}, not {structure!r}")
    check_positive("natural frequency", frequency)
    if frequency > CUTOFF_HZ[AISC_DG11]:
        raise ValueError(f"the AISC Design Guide 11 walking criterion applies up to {CUTOFF_HZ[AISC_DG11]:g} Hz; "
                         f"a {frequency:g} Hz floor is a high-frequency floor: use the transient footfall-impulse "
                         "method")
    return STANDARD_GRAVITY * DG11_FORCE[structure] * math.exp(-DG11_EXPONENT * frequency)


def dg11_limit(occupancy: str) -> float:
    """Peak-acceleration tolerance (m/s^2) of an occupancy in AISC Design Guide 11 (from memory)."""
    if occupancy not in DG11_LIMITS:
        raise ValueError(f"occupancy must be one of {tuple(DG11_LIMITS)}, not {occupancy!r}")
    return DG11_LIMITS[occupancy][1] * STANDARD_GRAVITY


def dg11_acceleration(frequency: float, damping: float, effective_weight: float, structure: str = "floor") -> float:
    """Peak acceleration a_p (m/s^2) of a floor or pedestrian bridge (``structure``) to walking, AISC Design
    Guide 11: g P0 exp(-0.35 fn) / (beta W); frequency in Hz, effective weight W in N."""
    force = _dg11_force(frequency, structure)
    check_damping(damping)
    check_positive("effective weight", effective_weight)
    return force / (damping * effective_weight)


def dg11_damping_for_limit(frequency: float, effective_weight: float, limit: float,
                           structure: str = "floor") -> float | None:
    """Damping ratio that brings the AISC Design Guide 11 acceleration to ``limit`` (m/s^2), closed form;
    None when it would exceed :data:`MAX_DAMPING`."""
    force = _dg11_force(frequency, structure)
    check_positive("effective weight", effective_weight)
    check_positive("acceleration limit", limit)
    damping = force / (limit * effective_weight)
    return damping if damping <= MAX_DAMPING else None


def dg11_weight_for_limit(frequency: float, damping: float, limit: float, structure: str = "floor") -> float:
    """Effective weight W (N) that brings the AISC Design Guide 11 acceleration to ``limit`` (m/s^2)."""
    force = _dg11_force(frequency, structure)
    check_damping(damping)
    check_positive("acceleration limit", limit)
    return force / (limit * damping)


def dg11_frequency_for_limit(damping: float, effective_weight: float, limit: float,
                             structure: str = "floor") -> float | None:
    """Lowest natural frequency (Hz) from which the AISC Design Guide 11 acceleration stays within ``limit``
    (m/s^2): fn = ln(g P0 / (limit beta W)) / 0.35; 0.0 when every frequency complies, None when only a
    floor above the criterion's 9 Hz would."""
    if structure not in DG11_FORCE:
        raise ValueError(f"structure must be one of {tuple(DG11_FORCE)}, not {structure!r}")
    check_damping(damping)
    check_positive("effective weight", effective_weight)
    check_positive("acceleration limit", limit)
    frequency = math.log(STANDARD_GRAVITY * DG11_FORCE[structure] / (limit * damping * effective_weight))
    frequency /= DG11_EXPONENT
    if frequency > CUTOFF_HZ[AISC_DG11]:
        return None
    return max(frequency, 0.0)


# --- resonant response from first principles -----------------------------------------------------------

def dynamic_load_factor(harmonic: int, pacing_rate: float, guide: str = SCI_P354) -> float:
    """Dynamic load factor alpha_h of harmonic ``harmonic`` (1-4) of walking at ``pacing_rate`` (Hz): the
    harmonic's force amplitude per body weight (:data:`DLF_SOURCES`)."""
    if not 1 <= harmonic <= HARMONICS:
        raise ValueError(f"harmonic must be 1 to {HARMONICS}, not {harmonic}")
    if _guide(guide) == AISC_DG11:
        return _DG11_DLF[harmonic - 1]
    a, b = _P354_DLF[harmonic - 1]
    return a * (harmonic * pacing_rate + b)


def steady_acceleration(force: float, frequency: float, damping: float, modal_mass: float,
                        forcing_frequency: float | None = None) -> float:
    """Steady acceleration amplitude (m/s^2) of a mode (frequency Hz, modal mass kg) under a harmonic force
    of amplitude ``force`` (N) at ``forcing_frequency`` (Hz, default resonance): F/(2 zeta M) at resonance,
    else (F/M) r^2 / sqrt((1 - r^2)^2 + (2 zeta r)^2)."""
    check_damping(damping)
    check_positive("modal mass", modal_mass)
    ratio = 1.0 if forcing_frequency is None else forcing_frequency / frequency
    return force / modal_mass * _amplification(ratio, damping)


def _pacing_rates(frequency: float, band: tuple[float, float]) -> list[tuple[int, float]]:
    """For each harmonic h, the pacing rate (Hz) in ``band`` nearest fn / h."""
    return [(h, float(np.clip(frequency / h, *band))) for h in range(1, HARMONICS + 1)]


def _amplification(ratio: float, damping: float) -> float:
    """Acceleration amplification r^2 / sqrt((1 - r^2)^2 + (2 zeta r)^2) of a force at r = f / fn."""
    return ratio**2 / math.hypot(1.0 - ratio**2, 2.0 * damping * ratio)


def driving_harmonic(frequency: float, damping: float, guide: str = SCI_P354,
                     band: tuple[float, float] = footfall.WALKING) -> tuple[int, float]:
    """The walking harmonic h and pacing rate fp (Hz, within ``band``) that drive a mode of ``frequency``
    (Hz) hardest in the steady state: for each h the pacing rate nearest fn / h, the one of largest
    alpha_h times the amplification."""
    return max(_pacing_rates(frequency, band),
               key=lambda hp: dynamic_load_factor(hp[0], hp[1], guide) * _amplification(hp[0] * hp[1] / frequency,
                                                                                         damping))


def crossing_cycles(frequency: float, path_length: float, pacing_rate: float, stride: float = STRIDE) -> float:
    """Cycles of a mode of ``frequency`` (Hz) while a walker covers ``path_length`` (m) at ``pacing_rate`` (Hz)
    with steps of ``stride`` (m): fn L / (stride fp)."""
    check_positive("path length", path_length)
    check_positive("stride", stride)
    return frequency * path_length / (stride * pacing_rate)


def buildup_factor(damping: float, cycles: float) -> float:
    """Share of the steady resonant amplitude reached after ``cycles`` cycles from rest with the walker at
    the antinode: 1 - exp(-2 pi zeta N)."""
    return -math.expm1(-2.0 * math.pi * damping * cycles)


def crossing_factor(damping: float, cycles: float) -> float:
    """Share of the steady resonant amplitude reached by a walker crossing a half-sine mode in ``cycles``
    cycles of the mode, from rest.

    The resonant force seen by the mode is F sin(pi t / T); its slowly varying amplitude gives the
    envelope x (x sin(pi s) - pi cos(pi s) + pi exp(-x s)) / (x^2 + pi^2), s = t / T, x = 2 pi zeta N,
    whose largest value over the crossing (0 < s <= 1) is returned.
    """
    from scipy.optimize import brentq

    x = 2.0 * math.pi * damping * cycles
    if not x > 0.0:
        return 0.0
    if math.isinf(x):
        return 1.0

    def envelope(s: float) -> float:
        return x * (x * math.sin(math.pi * s) - math.pi * math.cos(math.pi * s) + math.pi * math.exp(-x * s)) / (
            x**2 + math.pi**2)

    def slope(s: float) -> float:
        return x * math.cos(math.pi * s) + math.pi * math.sin(math.pi * s) - x * math.exp(-x * s)

    return envelope(brentq(slope, 1e-9, 1.0, xtol=1e-13))


@dataclass(frozen=True)
class WalkingResponse:
    """A mode's resonant response to one walker: the driving harmonic and pacing rate (Hz), its force
    amplitude (N), the steady acceleration amplitude (m/s^2), the share reached on the walker's path,
    peak and r.m.s. acceleration (m/s^2) and the response factor against the vertical base curve."""

    harmonic: int
    pacing_rate: float
    force: float
    steady_peak: float
    buildup: float
    peak: float
    rms: float
    response_factor: float


def _check_low_frequency(frequency: float, guide: str, cutoff: float | None) -> float:
    check_positive("natural frequency", frequency)
    limit = CUTOFF_HZ[_guide(guide)] if cutoff is None else cutoff
    if frequency >= limit:
        raise ValueError(f"{frequency:g} Hz is at or above the {limit:g} Hz low/high-frequency floor cutoff: a "
                         "high-frequency floor answers each footfall as an impulse: use the transient "
                         "footfall-impulse method")
    return limit


def check_band(band: tuple[float, float]) -> tuple[float, float]:
    """Refuse a pacing-rate band (Hz) that is not 0 < low <= high, finite."""
    low, high = band
    check_positive("slowest pacing rate", low)
    check_positive("fastest pacing rate", high)
    if high < low:
        raise ValueError(f"fastest pacing rate {high:g} Hz is below the slowest {low:g} Hz")
    return low, high


def resonant_response(frequency: float, damping: float, modal_mass: float, *, path_length: float | None = None,
                      crossing: bool = False, weight: float = PERSON_WEIGHT, mode_factor: float = 1.0,
                      guide: str = SCI_P354, cutoff: float | None = None, stride: float = STRIDE,
                      band: tuple[float, float] = footfall.WALKING) -> WalkingResponse:
    """Resonant response of a low-frequency floor mode (frequency Hz, modal mass kg) to one walker.

    ``path_length`` (m) limits the build-up to the cycles of the mode while the walker covers it (None: the
    steady state); ``crossing`` says the walker crosses a half-sine mode along that path rather than staying
    near its antinode. A force off resonance builds up no faster than at resonance (the detuned envelope
    |int exp((-zeta wn + i dw) u) du| is at most int exp(-zeta wn u) du), so the peak of each harmonic is the
    lesser of its steady amplitude and the resonant amplitude F / (2 zeta M) times the build-up share; the
    harmonic and pacing rate of the largest peak are kept. The overshoot of a detuned start (beats) is not
    counted. ``mode_factor`` is the product of the mode's amplitudes at the walker and at the receiver (1 at
    the antinode; with ``crossing``, the receiver's alone). ``cutoff`` (Hz) defaults to the guide's
    (:data:`CUTOFF_HZ`). ``band`` (Hz) is the range of pacing rates walkers may choose (default
    :data:`footfall.WALKING`); a band of one rate, (fp, fp), gives the response to walking at fp. The r.m.s. is
    that of a sinusoid at the peak amplitude.
    """
    _check_low_frequency(frequency, guide, cutoff)
    check_band(band)
    check_damping(damping)
    check_positive("modal mass", modal_mass)
    check_positive("walker's weight", weight)
    best: tuple[int, float, float, float, float] | None = None
    for harmonic, pacing in _pacing_rates(frequency, band):
        force = dynamic_load_factor(harmonic, pacing, guide) * weight * mode_factor
        steady = steady_acceleration(force, frequency, damping, modal_mass, harmonic * pacing)
        peak = steady
        if path_length is not None:
            cycles = crossing_cycles(frequency, path_length, pacing, stride)
            share = crossing_factor(damping, cycles) if crossing else buildup_factor(damping, cycles)
            peak = min(steady, share * force / (2.0 * damping * modal_mass))
        if best is None or peak > best[4]:
            best = (harmonic, pacing, force, steady, peak)
    assert best is not None
    harmonic, pacing, force, steady, peak = best
    rms = peak / math.sqrt(2.0)
    factor = float(base_curves.response_factor(rms, frequency, "vertical"))
    return WalkingResponse(harmonic, pacing, force, steady, peak / steady if steady > 0 else 1.0, peak, rms, factor)


def resonant_response_factors(frequencies: np.ndarray, damping: float, modal_mass: float, *,
                              path_length: float | None = None, crossing: bool = False,
                              weight: float = PERSON_WEIGHT, mode_factor: float = 1.0, guide: str = SCI_P354,
                              cutoff: float | None = None, stride: float = STRIDE,
                              band: tuple[float, float] = footfall.WALKING) -> np.ndarray:
    """Response factors of :func:`resonant_response` (same options) for modes of many ``frequencies`` (Hz) at
    once: the same harmonics, pacing rates, build-up and base curve, evaluated on arrays."""
    f = np.asarray(frequencies, dtype=float)
    for value in np.ravel(f):
        _check_low_frequency(float(value), guide, cutoff)
    check_damping(damping)
    check_positive("modal mass", modal_mass)
    check_positive("walker's weight", weight)
    low, high = check_band(band)
    best = np.zeros_like(f)
    for harmonic in range(1, HARMONICS + 1):
        pacing = np.clip(f / harmonic, low, high)
        if guide == AISC_DG11:
            alpha = np.full_like(f, _DG11_DLF[harmonic - 1])
        else:
            a, b = _P354_DLF[harmonic - 1]
            alpha = a * (harmonic * pacing + b)
        force = alpha * weight * mode_factor
        ratio = harmonic * pacing / f
        peak = force / modal_mass * ratio**2 / np.hypot(1.0 - ratio**2, 2.0 * damping * ratio)
        if path_length is not None:
            check_positive("path length", path_length)
            check_positive("stride", stride)
            cycles = f * path_length / (stride * pacing)
            share = (np.vectorize(crossing_factor)(damping, cycles) if crossing
                     else -np.expm1(-2.0 * np.pi * damping * cycles))
            peak = np.minimum(peak, share * force / (2.0 * damping * modal_mass))
        best = np.maximum(best, peak)
    return np.asarray(base_curves.response_factor(best / math.sqrt(2.0), f, "vertical"))


def resonant_damping_for_limit(response_factor: float, frequency: float, modal_mass: float,
                               **options: Any) -> float | None:
    """Least damping ratio that brings the resonant response factor to ``response_factor`` (brentq; the
    response falls as damping rises). 0.0 when a short path keeps it within the limit at the least damping
    :data:`MIN_DAMPING`, None when more than :data:`MAX_DAMPING` would be needed. ``options`` as
    :func:`resonant_response`."""
    from scipy.optimize import brentq

    check_positive("response factor limit", response_factor)

    def excess(zeta: float) -> float:
        return resonant_response(frequency, zeta, modal_mass, **options).response_factor / response_factor - 1.0

    if excess(MAX_DAMPING) > 0.0:
        return None
    low = MIN_DAMPING
    if excess(low) <= 0.0:
        return 0.0
    return brentq(excess, low, MAX_DAMPING, xtol=1e-12, rtol=1e-12)


def resonant_mass_for_limit(response_factor: float, frequency: float, damping: float, **options: Any) -> float:
    """Modal mass (kg) that brings the resonant response factor to ``response_factor``: the response is
    inversely proportional to the modal mass. ``options`` as :func:`resonant_response`."""
    check_positive("response factor limit", response_factor)
    reference = resonant_response(frequency, damping, 1.0, **options)
    return reference.response_factor / response_factor


def resonant_frequency_for_limit(response_factor: float, damping: float, modal_mass: float,
                                 **options: Any) -> float | None:
    """Lowest natural frequency (Hz) from which the resonant response factor stays within ``response_factor``
    up to the cutoff; :data:`LOWEST_FLOOR_HZ` when it does everywhere, None when it exceeds the limit just
    below the cutoff (only a high-frequency floor complies). Scans 1200 frequencies, then brentq."""
    from scipy.optimize import brentq

    check_positive("response factor limit", response_factor)
    guide = str(options.get("guide", SCI_P354))
    cutoff = options.get("cutoff")
    top = CUTOFF_HZ[_guide(guide)] if cutoff is None else float(cutoff)

    def excess(f: float) -> float:
        return resonant_response(f, damping, modal_mass, **options).response_factor / response_factor - 1.0

    grid = np.linspace(LOWEST_FLOOR_HZ, top, 1201)[:-1]
    over = resonant_response_factors(grid, damping, modal_mass, **options) > response_factor
    if over[-1]:
        return None
    if not over.any():
        return LOWEST_FLOOR_HZ
    last = int(np.nonzero(over)[0][-1])
    return brentq(excess, grid[last], grid[last + 1], xtol=1e-10)
