"""Transmissibility and the mounts a target isolation needs."""

from __future__ import annotations

import math

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st
from scipy.optimize import brentq, minimize_scalar

from fieldmode.calc.physics import forced, isolate


@settings(max_examples=200, deadline=None)
@given(zeta=st.floats(min_value=0.0, max_value=10.0))
def test_transmissibility_is_one_at_root_two_for_every_damping(zeta: float) -> None:
    # Source: Chopra, Dynamics of Structures, sec. 3.5 (Fig. 3.5.2): all curves pass T = 1 at r = sqrt(2)
    assert forced.transmissibility(math.sqrt(2.0), zeta) == pytest.approx(1.0, rel=1e-12)


@pytest.mark.parametrize(("r", "zeta"), [(0.5, 0.05), (1.0, 0.1), (3.0, 0.02), (5.0, 0.3)])
def test_transmissibility_closed_form(r: float, zeta: float) -> None:
    # Source: Chopra, Dynamics of Structures, eq. 3.5.3: T = sqrt(1+(2 zeta r)^2) / sqrt((1-r^2)^2+(2 zeta r)^2)
    expected = math.sqrt(1 + (2 * zeta * r) ** 2) / math.sqrt((1 - r**2) ** 2 + (2 * zeta * r) ** 2)
    assert forced.transmissibility(r, zeta) == pytest.approx(expected)


@pytest.mark.parametrize("target", [0.5, 0.1, 0.02])
@pytest.mark.parametrize("zeta", [0.0, 0.01, 0.05, 0.2, 1.5])
def test_required_ratio_solves_the_damped_transmissibility(target: float, zeta: float) -> None:
    # Oracle: scipy.optimize.brentq on T(r) - target above r = sqrt(2)
    expected = brentq(lambda r: forced.transmissibility(r, zeta) - target, math.sqrt(2), 1e4, xtol=1e-14)
    assert isolate.ratio_for_transmissibility(target, zeta) == pytest.approx(expected, rel=1e-9)


def test_undamped_formula() -> None:
    # Source: Chopra, Dynamics of Structures, sec. 3.5: undamped T = 1/(r^2 - 1) above resonance
    assert isolate.undamped_ratio_for_transmissibility(0.1) == pytest.approx(math.sqrt(11.0))
    assert isolate.ratio_for_transmissibility(0.1, 0.0) == pytest.approx(math.sqrt(11.0))


def test_damping_demands_softer_mounts() -> None:
    # From memory: Den Hartog, Mechanical Vibrations, ch. 2: above sqrt(2) damping raises T, so a
    # damped mount needs a higher ratio than the undamped formula says
    assert isolate.ratio_for_transmissibility(0.1, 0.1) > isolate.undamped_ratio_for_transmissibility(0.1)


@pytest.mark.parametrize("zeta", [0.005, 0.02, 0.1, 0.5])
def test_peak_transmissibility(zeta: float) -> None:
    # Oracle: scipy.optimize.minimize_scalar (bounded) on -T
    found = minimize_scalar(lambda r: -forced.transmissibility(r, zeta), bounds=(0.3, 1.2), method="bounded",
                            options={"xatol": 1e-12})
    assert isolate.peak_transmissibility_ratio(zeta) == pytest.approx(found.x, abs=1e-5)
    assert isolate.peak_transmissibility(zeta) == pytest.approx(-found.fun, rel=1e-9)
    # From memory: Rao, Mechanical Vibrations, sec. 9.10: r_peak^2 = (sqrt(1+8 zeta^2) - 1)/(4 zeta^2)
    assert isolate.peak_transmissibility_ratio(zeta) ** 2 == pytest.approx(
        (math.sqrt(1 + 8 * zeta**2) - 1) / (4 * zeta**2))


@pytest.mark.parametrize("r", [0.3, 0.7, 1.6, 3.0])
def test_undamped_transmissibility_against_a_mass_on_a_spring(r: float) -> None:
    import numpy as np
    from scipy.integrate import solve_ivp

    m, k = 1200.0, 4.7e6
    omega = r * math.sqrt(k / m)
    steady = 1.0 / (k - m * omega**2)  # particular solution u = steady sin(w t) under F = sin(w t)

    def motion(t: float, state: np.ndarray) -> list[float]:
        return [state[1], (math.sin(omega * t) - k * state[0]) / m]

    # started on the particular solution (u = 0, u' = steady w), so no free vibration is mixed in
    times = np.linspace(0.0, 6 * 2 * math.pi / omega, 3001)
    # Oracle: scipy.integrate.solve_ivp (DOP853) on m u'' + k u = sin(w t), no damping, away from resonance
    solution = solve_ivp(motion, (0.0, times[-1]), [0.0, steady * omega], t_eval=times, method="DOP853",
                         rtol=1e-11, atol=1e-16)
    support_force = float(np.max(np.abs(k * solution.y[0])))
    assert forced.transmissibility(r, 0.0) == pytest.approx(support_force, rel=1e-6)
    # Source: Chopra, Dynamics of Structures, sec. 3.5: with zeta = 0, T = 1 / |1 - r^2|
    assert forced.transmissibility(r, 0.0) == pytest.approx(1.0 / abs(1.0 - r**2), rel=1e-12)
