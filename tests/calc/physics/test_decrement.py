"""Log decrement from two peaks against the textbook and a computed response."""

from __future__ import annotations

import math
from functools import cache

import numpy as np
import pytest

from fieldmode.calc.physics.decrement import decrement_from_peaks
from fieldmode.calc.records.decay import analyse


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


def test_half_power_agrees_with_the_decrement_on_the_same_record() -> None:
    for params in (dict(), dict(zeta=0.01, duration=30.0), dict(zeta=0.05), dict(noise=0.01, seed=2)):
        found = analyse(*record(**params))
        assert found.half_power.damping_ratio is not None
        # Source: Chopra, Dynamics of Structures, ch. 3 (half-power bandwidth), from memory: zeta = (f2 - f1)/(2 fn)
        # for light damping; on one record both methods measure the same zeta: within 5 %
        assert found.half_power.damping_ratio == pytest.approx(found.damping_ratio, rel=0.05)
        assert not any("half-power" in flag.text for flag in found.flags)


def test_log_decrement_against_the_textbook() -> None:
    # From memory: Chopra, Dynamics of Structures, sec. 2.2: delta = ln(u_i / u_(i+1)) = 2 pi zeta / sqrt(1 - zeta^2)
    for zeta in (0.005, 0.02, 0.05, 0.1, 0.3):
        delta = 2 * math.pi * zeta / math.sqrt(1 - zeta**2)
        for cycles in (1, 5, 12):
            got_delta, got_zeta = decrement_from_peaks(1.0, math.exp(-delta * cycles), cycles)
            assert got_delta == pytest.approx(delta, rel=1e-12)
            assert got_zeta == pytest.approx(zeta, rel=1e-12)
    # From memory: Chopra, sec. 2.2: the small-damping form zeta ~ delta / (2 pi) errs by under 1 % up to 10 %
    delta_10 = 2 * math.pi * 0.1 / math.sqrt(1 - 0.01)
    assert delta_10 / (2 * math.pi) == pytest.approx(0.1, rel=0.01)


def test_decrement_of_peaks_of_a_computed_response() -> None:
    from scipy.integrate import solve_ivp

    omega, zeta = 2 * math.pi * 4.0, 0.035

    def rates(_: float, state: np.ndarray) -> list[float]:
        return [state[1], -2 * zeta * omega * state[1] - omega**2 * state[0]]

    def turning(_: float, state: np.ndarray) -> float:
        return state[1]

    turning.direction = 1.0  # type: ignore[attr-defined]  # velocity rising through zero: a trough
    # Oracle: scipy.integrate.solve_ivp; troughs of u found as events, 5 cycles apart
    solution = solve_ivp(rates, (0, 3.0), [1.0, 0.0], method="DOP853", rtol=1e-11, atol=1e-13, events=turning)
    troughs = -solution.y_events[0][:, 0]
    _, got = decrement_from_peaks(float(troughs[0]), float(troughs[5]), 5)
    assert got == pytest.approx(zeta, rel=1e-6)
