"""Steady-state response of a damped single mass to a harmonic force.

Frequency ratio r = f / f_n and damping ratio zeta are plain numbers; angles in degrees.
Functions accept floats or numpy arrays of r and return the same shape.
"""

from __future__ import annotations

import math
from typing import TypeVar, cast

import numpy as np

Ratio = TypeVar("Ratio", float, np.ndarray)

RESONANCE_BAND = 0.2
"""Operation within this fraction of the natural frequency counts as near resonance."""


def amplification(r: Ratio, zeta: float) -> Ratio:
    """Dynamic amplification R_d = 1 / sqrt((1 - r^2)^2 + (2 zeta r)^2) of the static deflection F0/k."""
    with np.errstate(over="ignore"):  # r^2 beyond float range: R_d is 0, its limit
        return cast(Ratio, 1.0 / np.hypot(1.0 - np.square(r), 2.0 * zeta * np.asarray(r)))


def phase(r: Ratio, zeta: float) -> Ratio:
    """Phase lag (deg) of the displacement behind the force: atan2(2 zeta r, 1 - r^2), 0 to 180."""
    with np.errstate(over="ignore"):  # r^2 beyond float range: 180 deg, its limit
        return cast(Ratio, np.degrees(np.arctan2(2.0 * zeta * np.asarray(r), 1.0 - np.square(r))))


def transmissibility(r: Ratio, zeta: float) -> Ratio:
    """Force transmissibility T = sqrt(1 + (2 zeta r)^2) R_d: support force over applied force.

    Also the motion transmissibility of a mass on a shaken base; T = 1 at r = sqrt(2) for any damping.
    """
    return cast(Ratio, np.hypot(1.0, 2.0 * zeta * np.asarray(r)) * amplification(r, zeta))


def has_peak(zeta: float) -> bool:
    """True when R_d has a peak above r = 0 (zeta < 1/sqrt(2))."""
    return zeta < 1.0 / math.sqrt(2.0)


def peak_ratio(zeta: float) -> float:
    """Frequency ratio r = sqrt(1 - 2 zeta^2) where R_d peaks (0 when it has no peak)."""
    return math.sqrt(1.0 - 2.0 * zeta**2) if has_peak(zeta) else 0.0


def peak_amplification(zeta: float) -> float:
    """Largest R_d over all r: 1 / (2 zeta sqrt(1 - zeta^2)), or 1 (at r = 0) when there is no peak."""
    return 1.0 / (2.0 * zeta * math.sqrt(1.0 - zeta**2)) if has_peak(zeta) else 1.0


def unbalance_peak_ratio(zeta: float) -> float:
    """Frequency ratio r = 1 / sqrt(1 - 2 zeta^2) where the displacement under a rotating unbalance peaks.

    There the normalised amplitude r^2 R_d reaches the same 1 / (2 zeta sqrt(1 - zeta^2)).
    Infinite when there is no peak (the amplitude only rises towards m e / M).
    """
    return 1.0 / math.sqrt(1.0 - 2.0 * zeta**2) if has_peak(zeta) else math.inf


def unbalance_force(unbalance: float, frequency: float) -> float:
    """Force amplitude (N) of a rotating unbalance m e (kg m) at ``frequency`` (Hz): m e (2 pi f)^2."""
    return unbalance * (2.0 * math.pi * frequency) ** 2


def ratio_grid(operating: float, zeta: float, points: int = 601) -> np.ndarray:
    """Frequency ratios for a response curve: 0 to max(3, 1.25 x operating), with the peak and operating point."""
    top = max(3.0, 1.25 * operating)
    extra = [operating]
    if has_peak(zeta):
        extra += [peak_ratio(zeta), 1.0]
    return np.union1d(np.linspace(0.0, top, points), np.array(extra))
