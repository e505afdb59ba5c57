"""A high-frequency floor's transient response to footfalls, and what it would take to meet a limit.

Above the low/high-frequency cutoff (9 Hz in AISC Design Guide 11, 2nd ed.; 10 Hz in SCI P354:
:data:`floor_walking.CUTOFF_HZ`) walking harmonics cannot reach resonance and each footfall acts on a
mode as an effective impulse I (N s). The mode (modal mass M, damping ratio zeta) starts at the peak
velocity v0 = mu I / M and decays: v(t) = v0 exp(-zeta wn t) (cos wd t - zeta / sqrt(1 - zeta^2) sin wd t).
Its r.m.s. over a window (1 s by default) is judged against the constant-velocity part of the vertical
ISO 10137 base curve (8 to 80 Hz). SI throughout: N, kg, m, s, Hz, m/s.
"""

from __future__ import annotations

import cmath
import math
from dataclasses import dataclass
from typing import Any

from fieldmode.calc.physics import base_curves, footfall
from fieldmode.calc.physics.floor_walking import (
    AISC_DG11,
    CUTOFF_HZ,
    GUIDES,
    MAX_DAMPING,
    PERSON_WEIGHT,
    SCI_P354,
    check_damping,
    check_positive,
)

IMPULSE_PER_WEIGHT: dict[str, float] = {SCI_P354: 54.0 / 700.0, AISC_DG11: 1.0 / 17.8}
"""Effective impulse per newton of body weight at fp = fn = 1 Hz (s): SCI P354 I = 54 (Q / 700 N)
fp^1.43 / fn^1.3 N s; AISC Design Guide 11 (2nd ed.) I = (Q / 17.8) fp^1.43 / fn^1.3 (from memory)."""
IMPULSE_SOURCES: dict[str, str] = {
    SCI_P354: "SCI P354, Design of Floors for Vibration, effective impulse (from memory)",
    AISC_DG11: "AISC Design Guide 11, 2nd ed., high-frequency floors, effective impulse (from memory)",
}
PACING_EXPONENT = 1.43
"""Power of the pacing rate in the effective impulse (from memory)."""
FREQUENCY_EXPONENT = 1.30
"""Power of the floor frequency in the effective impulse (from memory)."""
WINDOW = 1.0
"""Time over which the r.m.s. velocity is taken, s (common practice)."""
BASE_VELOCITY = float(base_curves.base_acceleration(8.0, "vertical")) / (2.0 * math.pi * 8.0)
"""Vertical base curve as an r.m.s. velocity (m/s), constant from 8 to 80 Hz: 6.25e-4 / (2 pi), about 0.1 mm/s."""
HIGHEST_HZ = base_curves.HIGHEST_HZ
"""Highest floor frequency the method judges (Hz): where the base curves end."""


def _check_high_frequency(frequency: float, guide: str, cutoff: float | None) -> float:
    check_positive("natural frequency", frequency)
    if guide not in GUIDES:
        raise ValueError(f"guide must be one of {GUIDES}, not {guide!r}")
    limit = CUTOFF_HZ[guide] if cutoff is None else cutoff
    if frequency < limit:
        raise ValueError(f"{frequency:g} Hz is below the {limit:g} Hz low/high-frequency floor cutoff: a "
                         "low-frequency floor responds resonantly to walking: use the resonant walking method "
                         f"(or the AISC Design Guide 11 walking criterion, up to {CUTOFF_HZ[AISC_DG11]:g} Hz)")
    if frequency > HIGHEST_HZ:
        raise ValueError(f"{frequency:g} Hz is above {HIGHEST_HZ:g} Hz, where the base curves end")
    return limit


def effective_impulse(pacing_rate: float, frequency: float, weight: float = PERSON_WEIGHT,
                      guide: str = SCI_P354) -> float:
    """Effective impulse (N s) of one footfall at ``pacing_rate`` (Hz) on a mode of ``frequency`` (Hz),
    walker's weight in N: c Q fp^1.43 / fn^1.3 (:data:`IMPULSE_PER_WEIGHT`)."""
    if guide not in IMPULSE_PER_WEIGHT:
        raise ValueError(f"guide must be one of {GUIDES}, not {guide!r}")
    check_positive("pacing rate", pacing_rate)
    check_positive("natural frequency", frequency)
    check_positive("walker's weight", weight)
    return IMPULSE_PER_WEIGHT[guide] * weight * pacing_rate**PACING_EXPONENT / frequency**FREQUENCY_EXPONENT


def impulse_velocity_rms(peak_velocity: float, frequency: float, damping: float, window: float = WINDOW) -> float:
    """R.m.s. over ``window`` (s) of the velocity (m/s) of a mode (frequency Hz, damping ratio) set moving by
    an impulse to ``peak_velocity`` (m/s), exact: v0^2 [(1 + c^2)/2 E0 + (1 - c^2)/2 Re Z - c Im Z] / T with
    a = zeta wn, c = zeta / sqrt(1 - zeta^2), E0 = int exp(-2 a t), Z = int exp((-2 a + 2 i wd) t) over 0..T."""
    check_damping(damping, resonant=False)
    check_positive("natural frequency", frequency)
    check_positive("window", window)
    omega = 2.0 * math.pi * frequency
    decay = damping * omega
    omega_d = omega * math.sqrt(1.0 - damping**2)
    c = damping / math.sqrt(1.0 - damping**2)
    plain = window if decay == 0.0 else -math.expm1(-2.0 * decay * window) / (2.0 * decay)
    rate = complex(-2.0 * decay, 2.0 * omega_d)
    swing = cmath.exp(rate * window) - 1.0
    swing /= rate
    mean_square = ((1.0 + c**2) / 2.0 * plain + (1.0 - c**2) / 2.0 * swing.real - c * swing.imag) / window
    return abs(peak_velocity) * math.sqrt(max(mean_square, 0.0))


@dataclass(frozen=True)
class FootfallResponse:
    """A mode's response to one footfall: effective impulse (N s), peak and r.m.s. velocity (m/s), and the
    response factor against the constant-velocity base curve."""

    impulse: float
    peak_velocity: float
    rms_velocity: float
    response_factor: float


def transient_response(frequency: float, damping: float, modal_mass: float, *,
                       pacing_rate: float = footfall.WALKING[1], weight: float = PERSON_WEIGHT,
                       mode_factor: float = 1.0, guide: str = SCI_P354, cutoff: float | None = None,
                       window: float = WINDOW) -> FootfallResponse:
    """Transient response of a high-frequency floor mode (frequency Hz, modal mass kg, damping ratio) to one
    footfall at ``pacing_rate`` (Hz; default the fastest walking, :data:`footfall.WALKING`).

    ``mode_factor`` is the product of the mode's amplitudes at the walker and at the receiver; ``cutoff``
    (Hz) defaults to the guide's (:data:`floor_walking.CUTOFF_HZ`). Zero damping is allowed: the response
    stays bounded.
    """
    _check_high_frequency(frequency, guide, cutoff)
    check_damping(damping, resonant=False)
    check_positive("modal mass", modal_mass)
    impulse = effective_impulse(pacing_rate, frequency, weight, guide)
    peak = mode_factor * impulse / modal_mass
    rms = impulse_velocity_rms(peak, frequency, damping, window)
    return FootfallResponse(impulse, peak, rms, rms / BASE_VELOCITY)


def transient_mass_for_limit(response_factor: float, frequency: float, damping: float, **options: Any) -> float:
    """Modal mass (kg) that brings the transient response factor to ``response_factor``: the response is
    inversely proportional to the modal mass. ``options`` as :func:`transient_response`."""
    check_positive("response factor limit", response_factor)
    return transient_response(frequency, damping, 1.0, **options).response_factor / response_factor


def transient_damping_for_limit(response_factor: float, frequency: float, modal_mass: float,
                                **options: Any) -> float | None:
    """Least damping ratio that brings the transient response factor to ``response_factor`` (brentq; the
    r.m.s. falls as the decay quickens). 0.0 when the undamped floor already complies, None when more than
    :data:`floor_walking.MAX_DAMPING` would be needed."""
    from scipy.optimize import brentq

    check_positive("response factor limit", response_factor)

    def excess(zeta: float) -> float:
        return transient_response(frequency, zeta, modal_mass, **options).response_factor / response_factor - 1.0

    if excess(0.0) <= 0.0:
        return 0.0
    if excess(MAX_DAMPING) > 0.0:
        return None
    return brentq(excess, 0.0, MAX_DAMPING, xtol=1e-12, rtol=1e-12)


def transient_frequency_for_limit(response_factor: float, damping: float, modal_mass: float,
                                  **options: Any) -> float | None:
    """Lowest natural frequency (Hz) from the cutoff up to 80 Hz whose transient response factor is within
    ``response_factor`` (brentq; the impulse falls as fn^-1.3 and the decay quickens): the cutoff when every
    high-frequency floor complies, None when none up to 80 Hz does."""
    from scipy.optimize import brentq

    check_positive("response factor limit", response_factor)
    guide = str(options.get("guide", SCI_P354))
    cutoff = options.get("cutoff")
    low = _check_high_frequency(HIGHEST_HZ, guide, cutoff)

    def excess(f: float) -> float:
        return transient_response(f, damping, modal_mass, **options).response_factor / response_factor - 1.0

    if excess(low) <= 0.0:
        return low
    if excess(HIGHEST_HZ) > 0.0:
        return None
    return brentq(excess, low, HIGHEST_HZ, xtol=1e-10)
