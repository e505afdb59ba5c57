"""Vibration isolation of a machine on resilient mounts over a rigid support.

Frequency ratio r = f / f_n and damping ratio zeta are plain numbers; isolation is 1 - T.
"""

from __future__ import annotations

import math

from fieldmode.calc.physics.forced import transmissibility

AMPLIFYING_RATIO = math.sqrt(2.0)
"""Below this frequency ratio the mounts transmit more force than they receive (T > 1)."""


def ratio_for_transmissibility(target: float, zeta: float) -> float:
    """Frequency ratio r > sqrt(2) at which the damped transmissibility equals ``target`` (0 < target < 1).

    T^2 ((1 - x)^2 + 4 zeta^2 x) = 1 + 4 zeta^2 x with x = r^2 is a quadratic in x:
    T^2 x^2 + (4 zeta^2 (T^2 - 1) - 2 T^2) x + (T^2 - 1) = 0, whose one positive root is taken.
    With zeta = 0 it gives the undamped r^2 = 1 + 1/T.
    """
    t2 = target**2
    b = 4.0 * zeta**2 * (t2 - 1.0) - 2.0 * t2
    c = t2 - 1.0
    x = (-b + math.sqrt(b * b - 4.0 * t2 * c)) / (2.0 * t2)
    return math.sqrt(x)


def undamped_ratio_for_transmissibility(target: float) -> float:
    """Frequency ratio r = sqrt(1 + 1/T) from the undamped formula T = 1/(r^2 - 1)."""
    return math.sqrt(1.0 + 1.0 / target)


def peak_transmissibility_ratio(zeta: float) -> float:
    """Frequency ratio where T peaks: r^2 = (sqrt(1 + 8 zeta^2) - 1) / (4 zeta^2) (r = 1 when undamped).

    Written as r^2 = 2 / (1 + sqrt(1 + 8 zeta^2)), which keeps its precision at small damping.
    """
    return math.sqrt(2.0 / (1.0 + math.sqrt(1.0 + 8.0 * zeta**2)))


def peak_transmissibility(zeta: float) -> float:
    """Largest transmissibility over all r, passed through when the machine starts and stops (zeta > 0)."""
    return float(transmissibility(peak_transmissibility_ratio(zeta), zeta))


def stiffness_for_frequency(mass: float, natural_frequency: float) -> float:
    """Total stiffness (N/m) that puts ``mass`` (kg) at ``natural_frequency`` (Hz): m (2 pi f)^2."""
    return mass * (2.0 * math.pi * natural_frequency) ** 2
