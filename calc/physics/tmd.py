"""Tuned mass damper on one structural mode: optimum parameters and the two-mass frequency response.

The primary mode is a single mass M (kg) with natural angular frequency omega_p (rad/s)
and damping ratio zeta_p; the damper is a mass m = mu M on a spring and dashpot. Tuning
f = omega_d / omega_p; the damper's damping ratio is zeta_d = c / (2 m omega_d), on the
damper's own frequency. Responses are the primary's displacement amplitude divided by its
static displacement (F0 / K for a force on the primary, M a_g / K for a ground acceleration).
"""

from __future__ import annotations

import math
from dataclasses import dataclass

import numpy as np

ZOOMS = 3
"""Refinements of each peak, each 50 times finer (relative error of the peak about 1e-12)."""
MIN_MASS_RATIO = 0.001
"""Smallest mass ratio accepted (0.1 %): below it the damper does nothing measurable."""
MAX_MASS_RATIO = 0.5
"""Largest mass ratio accepted: beyond it the damper is no longer an added mass."""


@dataclass(frozen=True)
class Optimum:
    """Optimum tuning ratio f = omega_d / omega_p, damper damping ratio (own frequency) and the
    closed-form peak amplification for an undamped primary."""

    tuning: float
    damping: float
    peak: float


def den_hartog(mu: float) -> Optimum:
    """Den Hartog's optimum for a harmonic force on an undamped primary.

    f = 1 / (1 + mu), zeta_d = sqrt(3 mu / (8 (1 + mu))), peak sqrt(1 + 2 / mu).
    """
    return Optimum(1.0 / (1.0 + mu), math.sqrt(3.0 * mu / (8.0 * (1.0 + mu))), math.sqrt(1.0 + 2.0 / mu))


def warburton_ground(mu: float) -> Optimum:
    """Warburton's (1982) optimum for harmonic ground acceleration, minimising the primary's displacement.

    f = sqrt(1 - mu/2) / (1 + mu), zeta_d = sqrt(3 mu / (8 (1 + mu) (1 - mu/2))), peak (1 + mu) sqrt(2 / mu).
    """
    return Optimum(math.sqrt(1.0 - mu / 2.0) / (1.0 + mu),
                   math.sqrt(3.0 * mu / (8.0 * (1.0 + mu) * (1.0 - mu / 2.0))),
                   (1.0 + mu) * math.sqrt(2.0 / mu))


def optimum(mu: float, excitation: str) -> Optimum:
    """The closed-form optimum for ``excitation`` ('force' or 'ground')."""
    return den_hartog(mu) if excitation == "force" else warburton_ground(mu)


def response(ratio: np.ndarray, mu: float, tuning: float, zeta_d: float, zeta_p: float,
             excitation: str = "force") -> tuple[np.ndarray, np.ndarray]:
    """Complex amplitudes of the primary's displacement and of the damper's stroke (relative to the
    primary), both per static displacement, at forcing ratios ``ratio`` = omega / omega_p.

    Solves the two-mass equations (K - w^2 M + i w C) x = F at every ratio (Cramer's rule on the
    2 x 2 complex system, vectorised), in units where M = 1, K = 1, omega_p = 1. With ``mu`` = 0
    the damper is absent and the stroke is zero.
    """
    w = np.atleast_1d(np.asarray(ratio, dtype=float))
    iw = 1j * w
    coupling = mu * tuning**2 + iw * (2.0 * zeta_d * mu * tuning)
    primary_row = 1.0 - w**2 + iw * (2.0 * zeta_p) + coupling
    damper_row = coupling - mu * w**2
    load_damper = mu if excitation == "ground" else 0.0
    if mu == 0.0:
        return 1.0 / primary_row, np.zeros_like(primary_row)
    determinant = primary_row * damper_row - coupling**2
    primary = (damper_row + coupling * load_damper) / determinant
    damper = (primary_row * load_damper + coupling) / determinant
    return primary, damper - primary


def peak(mu: float, tuning: float, zeta_d: float, zeta_p: float, excitation: str = "force",
         which: str = "primary") -> tuple[float, float]:
    """Largest amplitude of the primary (or the stroke, ``which='stroke'``) over all forcing ratios.

    A fine grid over r = 0.2 ... 3 finds the local maxima; the three highest are refined by
    zooming twice into a finer grid between their neighbours. Returns (peak, ratio at the peak).
    """

    def amplitude(r: np.ndarray) -> np.ndarray:
        primary, stroke = response(r, mu, tuning, zeta_d, zeta_p, excitation)
        return np.abs(stroke if which == "stroke" else primary)

    grid = np.geomspace(0.2, 3.0, 3001)
    values = amplitude(grid)
    if not np.all(np.isfinite(values)):
        return math.inf, float(grid[np.argmax(~np.isfinite(values))])
    inner = [int(i) + 1 for i in np.nonzero((values[1:-1] >= values[:-2]) & (values[1:-1] >= values[2:]))[0]]
    candidates = sorted(inner, key=lambda i: -float(values[i]))[:3] or [int(np.argmax(values))]
    best, best_ratio = float(values.max()), float(grid[np.argmax(values)])
    for index in candidates:
        low, high = grid[max(index - 1, 0)], grid[min(index + 1, grid.size - 1)]
        for _ in range(ZOOMS):
            fine = np.linspace(low, high, 101)
            fine_values = amplitude(fine)
            top = int(np.argmax(fine_values))
            low, high = fine[max(top - 1, 0)], fine[min(top + 1, fine.size - 1)]
        if fine_values[top] > best:
            best, best_ratio = float(fine_values[top]), float(fine[top])
    return best, best_ratio


def bare_peak(zeta_p: float) -> float:
    """Peak amplification of the primary alone, 1 / (2 zeta sqrt(1 - zeta^2)) (1 when zeta >= 1/sqrt 2)."""
    if zeta_p <= 0:
        return math.inf
    if zeta_p >= math.sqrt(0.5):
        return 1.0
    return 1.0 / (2.0 * zeta_p * math.sqrt(1.0 - zeta_p**2))


def equivalent_damping(peak_amplification: float) -> float:
    """Damping ratio of a single mass whose resonant peak equals ``peak_amplification`` (>= 1)."""
    if peak_amplification <= 1.0:
        return math.sqrt(0.5)
    inverse = 1.0 / peak_amplification
    return math.sqrt((1.0 - math.sqrt(1.0 - inverse**2)) / 2.0)


def mass_ratio_for_damping(target: float, zeta_p: float, excitation: str) -> float:
    """Mass ratio whose optimally tuned damper gives the primary an equivalent damping ``target``.

    Equivalent damping is that of a single mass with the same resonant peak (numerical peak,
    closed-form optimum tuning). Returns :data:`MIN_MASS_RATIO` if that already reaches it; raises
    ValueError if no mass ratio up to :data:`MAX_MASS_RATIO` does.
    """
    from scipy.optimize import brentq

    def excess(log_mu: float) -> float:
        mu = math.exp(log_mu)
        best = optimum(mu, excitation)
        return equivalent_damping(peak(mu, best.tuning, best.damping, zeta_p, excitation)[0]) - target

    low, high = math.log(MIN_MASS_RATIO), math.log(MAX_MASS_RATIO)
    if excess(high) < 0:
        raise ValueError("not reached with a mass ratio up to 50 %")
    if excess(low) >= 0:
        return math.exp(low)
    return math.exp(brentq(excess, low, high, xtol=1e-6))
