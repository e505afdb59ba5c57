"""Single-mass (single-degree-of-freedom) oscillator: properties and free response.

All functions take and return SI magnitudes (kg, N/m, N s/m, m, s, rad/s).
"""

from __future__ import annotations

import math

import numpy as np

from fieldmode.calc.physics.constants import STANDARD_GRAVITY

CRITICAL_TOLERANCE = 1e-9
"""Damping ratios this close to 1 are treated as critically damped."""


def angular_frequency(stiffness: float, mass: float) -> float:
    """Undamped natural angular frequency omega_n = sqrt(k/m) in rad/s."""
    return math.sqrt(stiffness / mass)


def stiffness_from_static_deflection(mass: float, deflection: float) -> float:
    """Stiffness k = m g0 / delta (N/m) of a mass whose weight deflects its support by ``deflection`` (m)."""
    return mass * STANDARD_GRAVITY / deflection


def critical_damping(stiffness: float, mass: float) -> float:
    """Critical damping coefficient c_cr = 2 sqrt(k m) in N s/m."""
    return 2.0 * math.sqrt(stiffness * mass)


def regime(damping_ratio: float) -> str:
    """Name of the damping regime for a damping ratio."""
    if damping_ratio == 0:
        return "undamped"
    if abs(damping_ratio - 1.0) <= CRITICAL_TOLERANCE:
        return "critically damped"
    return "underdamped" if damping_ratio < 1.0 else "overdamped"


def log_decrement(damping_ratio: float) -> float:
    """Logarithmic decrement delta = 2 pi zeta / sqrt(1 - zeta^2) (underdamped only)."""
    return 2.0 * math.pi * damping_ratio / math.sqrt(1.0 - damping_ratio**2)


def damping_ratio_from_log_decrement(decrement: float) -> float:
    """Exact inverse of :func:`log_decrement`: zeta = delta / sqrt(4 pi^2 + delta^2)."""
    return decrement / math.sqrt(4.0 * math.pi**2 + decrement**2)


def free_response(time: np.ndarray, omega_n: float, zeta: float, u0: float, v0: float) -> np.ndarray:
    """Displacement u(t) in m of the free single mass, closed form of its damping regime."""
    t = np.asarray(time, dtype=float)
    kind = regime(zeta)
    if kind in ("undamped", "underdamped"):
        omega_d = omega_n * math.sqrt(1.0 - zeta**2)
        envelope = np.exp(-zeta * omega_n * t)
        return envelope * (u0 * np.cos(omega_d * t) + (v0 + zeta * omega_n * u0) / omega_d * np.sin(omega_d * t))
    if kind == "critically damped":
        return (u0 + (v0 + omega_n * u0) * t) * np.exp(-omega_n * t)
    root = math.sqrt(zeta**2 - 1.0)
    s1 = omega_n * (-zeta + root)
    s2 = omega_n * (-zeta - root)
    a1 = (v0 - s2 * u0) / (s1 - s2)
    a2 = (s1 * u0 - v0) / (s1 - s2)
    return a1 * np.exp(s1 * t) + a2 * np.exp(s2 * t)


def free_envelope(time: np.ndarray, omega_n: float, zeta: float, u0: float, v0: float) -> np.ndarray:
    """Envelope A e^(-zeta omega_n t) (m) of the under- or undamped free response, A its amplitude at t = 0."""
    omega_d = omega_n * math.sqrt(1.0 - zeta**2)
    amplitude = math.hypot(u0, (v0 + zeta * omega_n * u0) / omega_d)
    return amplitude * np.exp(-zeta * omega_n * np.asarray(time, dtype=float))


def response_duration(omega_n: float, zeta: float) -> float:
    """A span (s) that shows the free response: the decay to about 5 %, 3 to 30 periods."""
    period = 2.0 * math.pi / omega_n
    if zeta == 0:
        return 5.0 * period
    if zeta < 1.0:
        return min(max(3.0 / (zeta * omega_n), 3.0 * period), 30.0 * period)
    slow = omega_n / (zeta + math.sqrt(zeta**2 - 1.0))  # = omega_n (zeta - sqrt(zeta^2 - 1)), no cancellation
    return min(3.0 / slow, 30.0 * period)
