"""Free-decay records computed with scipy's ODE solver, for the decay and decrement tests."""

from __future__ import annotations

import math
from functools import cache

import numpy as np


@cache
def oscillator(frequency: float, zeta: float, fs: float, duration: float, quadratic: float = 0.0) -> np.ndarray:
    """Free response u(t), u(0) = 1, v(0) = 0, sampled at fs for ``duration`` s.

    Oracle: scipy.integrate.solve_ivp (DOP853, rtol 1e-10) on u'' + 2 zeta w u' + q |u'| u' + w^2 u = 0.
    """
    from scipy.integrate import solve_ivp

    omega = 2 * math.pi * frequency

    def rates(_: float, state: np.ndarray) -> list[float]:
        u, v = state
        return [v, -2 * zeta * omega * v - quadratic * abs(v) * v - omega**2 * u]

    grid = np.arange(int(round(duration * fs))) / fs
    solution = solve_ivp(rates, (0.0, grid[-1]), [1.0, 0.0], method="DOP853", t_eval=grid, rtol=1e-10, atol=1e-12)
    return solution.y[0]


def record(frequency: float = 6.8, zeta: float = 0.025, fs: float = 200.0, duration: float = 12.0,
           noise: float = 0.0, offset: float = 0.0, drift: float = 0.0,
           second: tuple[float, float, float] | None = None, seed: int = 0, quiet: float = 0.5,
           quadratic: float = 0.0) -> tuple[np.ndarray, np.ndarray, float]:
    """A pull-and-release record: ``quiet`` s at rest, then the free decay (plus an optional second mode),
    offset, linear drift and white noise (RMS ``noise``, relative to the initial amplitude 1)."""
    lead = int(quiet * fs)
    signal = np.concatenate([np.zeros(lead), oscillator(frequency, zeta, fs, duration - quiet, quadratic)])
    if second is not None:
        f2, z2, a2 = second
        signal[lead:] += a2 * oscillator(f2, z2, fs, duration - quiet)
    time = np.arange(len(signal)) / fs
    rng = np.random.default_rng(seed)
    return time, signal + offset + drift * time + noise * rng.standard_normal(len(time)), fs
