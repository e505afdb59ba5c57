"""Member stiffness and beam frequency against beam theory and handbooks."""

from __future__ import annotations

import math

import numpy as np
import pytest
from scipy.integrate import dblquad, solve_bvp
from scipy.optimize import brentq

from fieldmode.calc.framework.units import STANDARD_GRAVITY
from fieldmode.calc.physics import member

ENDS = {"fixed": (0, 1), "pinned": (0, 2), "free": (2, 3), "guided": (1, 3)}


def _euler_bernoulli_deflection(left: str, right: str, load_at: float) -> float:
    """Deflection at the load point of a unit beam (EI = 1, L = 1) under a unit point load.

    EI y'''' = 0 on each side of the load, with y, y', y'' continuous and y''' jumping by the load.
    A load at the end (``load_at`` = 1) enters as the shear at that end.
    """
    if load_at == 1.0:
        def rhs(_x: np.ndarray, s: np.ndarray) -> np.ndarray:
            return np.vstack([s[1], s[2], s[3], np.zeros_like(s[0])])

        def bc(a: np.ndarray, b: np.ndarray) -> np.ndarray:
            i, j = ENDS[left]
            k = 1 if right == "guided" else 2  # free top: no moment; guided top: no rotation
            return np.array([a[i], a[j], b[k], b[3] - 1.0])

        x = np.linspace(0.0, 1.0, 11)
        solution = solve_bvp(rhs, bc, x, np.zeros((4, x.size)), tol=1e-10)
        assert solution.success
        return abs(float(solution.sol(1.0)[0]))
    a_len, b_len = load_at, 1.0 - load_at

    def rhs2(_x: np.ndarray, s: np.ndarray) -> np.ndarray:
        # two segments mapped onto [0, 1]: left state s[0:4] over a_len, right state s[4:8] over b_len
        left_part = a_len * np.vstack([s[1], s[2], s[3], np.zeros_like(s[0])])
        right_part = b_len * np.vstack([s[5], s[6], s[7], np.zeros_like(s[0])])
        return np.vstack([left_part, right_part])

    def bc2(a: np.ndarray, b: np.ndarray) -> np.ndarray:
        i, j = ENDS[left]
        k, m = ENDS[right]
        joint = [b[0] - a[4], b[1] - a[5], b[2] - a[6], b[3] - a[7] - 1.0]
        return np.array([a[i], a[j], b[4 + k], b[4 + m], *joint])

    x = np.linspace(0.0, 1.0, 11)
    solution = solve_bvp(rhs2, bc2, x, np.zeros((8, x.size)), tol=1e-10)
    assert solution.success
    return abs(float(solution.sol(1.0)[0]))


# Demo beam: steel, 7.2 m span, I = 29000 cm^4, 1.2 t/m.
E, I, L, M = 210e9, 29000e-8, 7.2, 1200.0  # noqa: E741 (I is the second moment of area)


def _second_moment_by_integration(outer: float, inner: float = 0.0) -> float:
    # Oracle: scipy.integrate.dblquad of y^2 over the section in polar coordinates
    value, _ = dblquad(lambda r, t: (r * math.sin(t)) ** 2 * r, 0.0, 2 * math.pi, inner, outer, epsabs=1e-16)
    return float(value)


@pytest.mark.parametrize(("support", "left", "right"), [
    ("simply-supported", "pinned", "pinned"),
    ("fixed-fixed", "fixed", "fixed"),
    ("fixed-pinned", "fixed", "pinned"),
])
def test_beam_midspan_stiffness_against_beam_theory(support: str, left: str, right: str) -> None:
    # Oracle: scipy.integrate.solve_bvp on EI y'''' = 0 with a unit point load at midspan
    expected = 1.0 / _euler_bernoulli_deflection(left, right, 0.5)
    assert member.beam_stiffness(1.0, 1.0, 1.0, support) == pytest.approx(expected, rel=1e-6)


@pytest.mark.parametrize(("support", "top"), [
    ("fixed-fixed", "guided"), ("fixed-pinned", "free"), ("cantilever", "free"),
])
def test_column_lateral_stiffness_against_beam_theory(support: str, top: str) -> None:
    # Oracle: scipy.integrate.solve_bvp on EI y'''' = 0, fixed base, unit shear at the top
    # (a pinned top of a column under a rigid beam carries no moment, like a free top)
    expected = 1.0 / _euler_bernoulli_deflection("fixed", top, 1.0)
    assert member.column_stiffness(1.0, 1.0, 1.0, support) == pytest.approx(expected, rel=1e-6)


@pytest.mark.parametrize(("support", "coefficient"), [
    ("simply-supported", 48.0), ("fixed-fixed", 192.0), ("fixed-pinned", 768.0 / 7.0),
])
def test_beam_stiffness_handbook_coefficients(support: str, coefficient: float) -> None:
    # From memory: AISC Steel Construction Manual Table 3-23, cases 7, 16 and 13 (PL^3/48EI, PL^3/192EI, 7PL^3/768EI)
    assert member.beam_stiffness(E, I, L, support) == pytest.approx(coefficient * E * I / L**3)


def test_circle_second_moments_against_integration() -> None:
    assert member.circle_second_moment(0.2) == pytest.approx(_second_moment_by_integration(0.1), rel=1e-8)
    assert member.circle_second_moment(0.2, 0.012) == pytest.approx(
        _second_moment_by_integration(0.1, 0.088), rel=1e-8)


def test_rectangle_second_moment_against_integration() -> None:
    # Oracle: scipy.integrate.dblquad of y^2 over a 100 x 300 rectangle, y across the depth
    value, _ = dblquad(lambda y, x: y**2, -0.05, 0.05, -0.15, 0.15, epsabs=1e-16)
    assert member.rectangle_second_moment(0.1, 0.3) == pytest.approx(value, rel=1e-8)


@pytest.mark.parametrize(("support", "equation", "bracket"), [
    ("fixed-fixed", lambda b: math.cos(b) * math.cosh(b) - 1.0, (4.0, 5.0)),
    ("fixed-pinned", lambda b: math.tan(b) - math.tanh(b), (3.5, 4.5)),
])
def test_beam_frequency_coefficients_from_the_frequency_equation(support, equation, bracket) -> None:  # noqa: ANN001
    # Oracle: scipy.optimize.brentq on the textbook frequency equation (Blevins, Table 8-1)
    beta_l = brentq(equation, *bracket, xtol=1e-14)
    expected = beta_l**2 / (2 * math.pi * L**2) * math.sqrt(E * I / M)
    assert member.beam_frequency(E, I, L, M, support) == pytest.approx(expected, rel=1e-9)


@pytest.mark.parametrize("support", ["fixed-fixed", "fixed-pinned"])
def test_rule_of_thumb_holds_for_other_end_conditions(support: str) -> None:
    # From memory: SCI P354: the 18/sqrt(delta) rule covers the usual support cases within a few per cent
    frequency = member.beam_frequency(E, I, L, M, support)
    delta = member.self_weight_deflection(E, I, L, M, support)
    assert member.frequency_rule_of_thumb(delta) == pytest.approx(frequency, rel=0.02)


def test_fixed_pinned_largest_deflection() -> None:
    # From memory: AISC Steel Construction Manual Table 3-23 case 12: propped cantilever w L^4 / (185 EI)
    assert member.self_weight_deflection(E, I, L, M, "fixed-pinned") == pytest.approx(
        M * STANDARD_GRAVITY * L**4 / (185 * E * I), rel=3e-3)
