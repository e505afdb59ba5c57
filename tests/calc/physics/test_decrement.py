"""Log decrement from two peaks against the textbook and a computed response."""

from __future__ import annotations

import math

import numpy as np
import pytest

from fieldmode.calc.physics.decrement import decrement_from_peaks


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
