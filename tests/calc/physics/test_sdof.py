"""Single mass: free response in every damping regime, log decrement, static deflection."""

from __future__ import annotations

import math

import numpy as np
import pytest
from scipy.integrate import solve_ivp

from fieldmode.calc.physics import sdof


@pytest.mark.parametrize("zeta", [0.0, 0.02, 0.3, 1.0, 2.5])
@pytest.mark.parametrize(("u0", "v0"), [(0.01, 0.0), (0.0, 0.2), (-0.004, 0.05)])
def test_free_response_matches_ode_solver_in_every_regime(zeta: float, u0: float, v0: float) -> None:
    omega_n = 2 * math.pi * 3.7
    time = np.linspace(0.0, 3.0, 400)
    closed = sdof.free_response(time, omega_n, zeta, u0, v0)

    def motion(_t: float, state: np.ndarray) -> list[float]:
        u, v = state
        return [v, -2 * zeta * omega_n * v - omega_n**2 * u]

    # Oracle: scipy.integrate.solve_ivp (DOP853, tight tolerances) on m u'' + c u' + k u = 0
    oracle = solve_ivp(motion, (0.0, 3.0), [u0, v0], t_eval=time, method="DOP853", rtol=1e-11, atol=1e-14)
    assert np.allclose(closed, oracle.y[0], rtol=0, atol=1e-8 * max(abs(u0), abs(v0) / omega_n))


@pytest.mark.parametrize(("zeta", "regime"), [
    (0.0, "undamped"), (0.05, "underdamped"), (1.0, "critically damped"), (1.5, "overdamped"),
])
def test_regimes(zeta: float, regime: str) -> None:
    # Source: Chopra, Dynamics of Structures, sec. 2.2 (damping regimes by zeta against 1)
    assert sdof.regime(zeta) == regime


def test_log_decrement_closed_form_and_inverse() -> None:
    # Source: Chopra, Dynamics of Structures, eq. 2.2.11: delta = 2 pi zeta / sqrt(1 - zeta^2)
    assert sdof.log_decrement(0.05) == pytest.approx(2 * math.pi * 0.05 / math.sqrt(1 - 0.0025))
    # Common practice (no source): small-damping form delta ~ 2 pi zeta within 0.2 % at 5 %
    assert sdof.log_decrement(0.05) == pytest.approx(2 * math.pi * 0.05, rel=2e-3)
    assert sdof.damping_ratio_from_log_decrement(sdof.log_decrement(0.137)) == pytest.approx(0.137)
