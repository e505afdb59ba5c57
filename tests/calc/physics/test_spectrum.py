"""The response-spectrum recurrence against scipy's ODE solver, lsim and the matrix exponential."""

from __future__ import annotations

import math

import numpy as np
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st
from scipy import signal
from scipy.integrate import solve_ivp
from scipy.linalg import expm

from fieldmode.calc.physics import spectrum as core
from fieldmode.calc.records import accelerogram


def sample_record(seconds: float = 6.0, dt: float = 0.01, seed: int = 7) -> np.ndarray:
    """A broadband test record (m/s^2) that ends while still shaking."""
    rng = np.random.default_rng(seed)
    count = int(round(seconds / dt)) + 1
    t = np.arange(count) * dt
    noise = np.convolve(rng.standard_normal(count), np.ones(3) / 3, mode="same")
    return 2.0 * noise * np.minimum(1.0, t / 1.0) + 1.5 * np.sin(2 * math.pi * 0.7 * t)


def oracle_peaks(acc: np.ndarray, dt: float, period: float, zeta: float) -> np.ndarray:
    """Peak |u|, |u'|, |total acceleration| by solve_ivp on the linearly interpolated record, then at rest."""
    omega = 2 * math.pi / period
    times = np.arange(len(acc) + 1) * dt
    ground = np.append(acc, 0.0)

    last = len(ground) - 1

    def rates(t: float, x: np.ndarray) -> list[float]:
        position = t / dt
        i = min(int(position), last)
        a = ground[i] + (ground[i + 1] - ground[i]) * (position - i) if i < last else 0.0
        return [x[1], -omega**2 * x[0] - 2 * zeta * omega * x[1] - a]

    end = times[-1] + period
    solution = solve_ivp(rates, (0.0, end), [0.0, 0.0], method="DOP853", rtol=1e-11, atol=1e-14,
                         dense_output=True, max_step=dt)
    fine = np.linspace(0.0, end, int(end / period * 2000) + 1)
    u, v = solution.sol(fine)
    total = -omega**2 * u - 2 * zeta * omega * v
    return np.array([np.abs(u).max(), np.abs(v).max(), np.abs(total).max()])


@pytest.mark.parametrize("zeta", [0.0, 0.05, 0.2])
@pytest.mark.parametrize("period", [0.03, 0.07, 0.4, 2.5])
def test_peaks_match_solve_ivp(period: float, zeta: float) -> None:
    dt = 0.01
    acc = sample_record(seconds=3.0, dt=dt)
    got = core.response_spectrum(acc, dt, np.array([period]), zeta)
    expected = oracle_peaks(acc, dt, period, zeta)
    # Oracle: scipy.integrate.solve_ivp (DOP853, rtol 1e-11) on the same piecewise-linear record
    assert got.psa[0] == pytest.approx((2 * math.pi / period) ** 2 * expected[0], rel=0.005)
    np.testing.assert_allclose([got.sd[0], got.sv[0], got.total_acceleration[0]], expected, rtol=0.005)


def test_short_periods_need_substeps() -> None:
    dt, period, zeta = 0.01, 0.03, 0.05
    acc = sample_record(seconds=3.0, dt=dt)
    expected = oracle_peaks(acc, dt, period, zeta)[0]
    history = core.response_history(acc, dt, period, zeta)
    # Oracle: scipy.integrate.solve_ivp; peaks read only at the record's samples (dt/T = 0.33) miss the true peak
    assert np.abs(history.displacement).max() < 0.995 * expected
    spectrum = core.response_spectrum(acc, dt, np.array([period]), zeta)
    assert spectrum.substeps[0] == math.ceil(core.STEPS_PER_PERIOD * dt / period)
    assert spectrum.sd[0] == pytest.approx(expected, rel=0.005)


@pytest.mark.parametrize("zeta", [0.0, 0.05, 0.3])
@pytest.mark.parametrize("period", [0.02, 0.15, 1.0, 6.0])
def test_history_matches_lsim(period: float, zeta: float) -> None:
    dt = 0.01
    acc = sample_record(seconds=4.0, dt=dt, seed=3)
    omega = 2 * math.pi / period
    system = (np.array([[0.0, 1.0], [-omega**2, -2 * zeta * omega]]), np.array([[0.0], [-1.0]]),
              np.eye(2), np.zeros((2, 1)))
    time = np.arange(len(acc)) * dt
    _, _, states = signal.lsim(system, acc, time)
    history = core.response_history(acc, dt, period, zeta)
    scale = np.abs(states).max(axis=0)
    # Oracle: scipy.signal.lsim (linear interpolation between samples), equal to round-off
    np.testing.assert_allclose(history.displacement, states[:, 0], rtol=0, atol=1e-9 * scale[0])
    np.testing.assert_allclose(history.velocity, states[:, 1], rtol=0, atol=1e-9 * scale[1])
    total = -omega**2 * states[:, 0] - 2 * zeta * omega * states[:, 1]
    np.testing.assert_allclose(history.total_acceleration, total, rtol=0, atol=1e-9 * np.abs(total).max())


@pytest.mark.parametrize("period", [0.02, 0.3, 5.0])
def test_step_coefficients_match_matrix_exponential(period: float) -> None:
    omega, zeta, h = 2 * math.pi / period, 0.05, period / core.STEPS_PER_PERIOD
    augmented = np.zeros((4, 4))
    augmented[:2, :2] = np.array([[0.0, 1.0], [-omega**2, -2 * zeta * omega]]) * h
    augmented[1, 2] = -h
    augmented[2, 3] = 1.0
    exact = expm(augmented)
    a, g0, g1 = core.foh_coefficients(np.array([omega]), zeta, h)
    # Oracle: scipy.linalg.expm of the first-order-hold augmented matrix
    np.testing.assert_allclose(a[0], exact[:2, :2], rtol=1e-13, atol=1e-15)
    np.testing.assert_allclose(g1[0], exact[:2, 3], rtol=1e-12, atol=1e-18)
    np.testing.assert_allclose(g0[0], exact[:2, 2] - exact[:2, 3], rtol=1e-12, atol=1e-18)


def test_chopra_table_5_2_1_coefficients() -> None:
    period, zeta, dt = 1.0, 0.05, 0.1
    w = 2 * math.pi / period
    wd = w * math.sqrt(1 - zeta**2)
    e, s, c = math.exp(-zeta * w * dt), math.sin(wd * dt), math.cos(wd * dt)
    r = zeta / math.sqrt(1 - zeta**2)
    k = w**2  # unit mass: p = -ag, k = omega^2
    # From memory: Chopra, Dynamics of Structures, Table 5.2.1 (recurrence for linear interpolation of p)
    a_ = (2 * zeta / (w * dt) + e * (((1 - 2 * zeta**2) / (wd * dt) - r) * s - (1 + 2 * zeta / (w * dt)) * c)) / k
    b_ = (1 - 2 * zeta / (w * dt) + e * ((2 * zeta**2 - 1) / (wd * dt) * s + 2 * zeta / (w * dt) * c)) / k
    c_ = e * (r * s + c)
    d_ = e * s / wd
    a1, g0, g1 = core.foh_coefficients(np.array([w]), zeta, dt)
    np.testing.assert_allclose(a1[0, 0], [c_, d_], rtol=1e-12)
    np.testing.assert_allclose([-g0[0, 0], -g1[0, 0]], [a_, b_], rtol=1e-10)


def test_free_vibration_after_the_record_counts() -> None:
    dt, period, zeta = 0.01, 4.0, 0.02
    acc = np.zeros(300)
    acc[250:290] = 3.0  # a pulse just before the end: the long period peaks after the record
    got = core.response_spectrum(acc, dt, np.array([period]), zeta)
    # Oracle: scipy.integrate.solve_ivp over the record and one period of rest
    np.testing.assert_allclose([got.sd[0], got.sv[0], got.total_acceleration[0]],
                               oracle_peaks(acc, dt, period, zeta), rtol=0.005)


def test_spectrum_long_and_short_limits() -> None:
    dt = 0.005
    acc = sample_record(seconds=8.0, dt=dt, seed=11)
    acc = accelerogram.baseline_corrected(acc, dt)
    pga, _, pgd = accelerogram.ground_peaks(acc, dt)
    rigid = core.response_spectrum(acc, dt, np.array([0.002]), 0.05)
    # Common practice (no source): a very stiff mass moves with the ground, psa -> pga
    assert rigid.total_acceleration[0] == pytest.approx(pga, rel=0.02)
    assert rigid.psa[0] == pytest.approx(pga, rel=0.02)


def test_work_limit() -> None:
    with pytest.raises(core.WorkLimitError):
        core.response_spectrum(np.ones(40_000), 0.01, np.full(200, 0.0005), 0.05)


@settings(max_examples=25, deadline=None)
@given(scale=st.floats(-50, 50).filter(lambda x: abs(x) > 1e-3), period=st.floats(0.01, 12.0),
       zeta=st.floats(0.0, 0.9), seed=st.integers(0, 1000))
def test_spectrum_is_linear_in_the_record(scale: float, period: float, zeta: float, seed: int) -> None:
    acc = sample_record(seconds=1.0, dt=0.01, seed=seed)
    base = core.response_spectrum(acc, 0.01, np.array([period]), zeta)
    scaled = core.response_spectrum(scale * acc, 0.01, np.array([period]), zeta)
    # Common practice (no source): the single mass is linear, so peaks scale with |scale|
    np.testing.assert_allclose([scaled.sd, scaled.sv, scaled.total_acceleration],
                               np.abs(scale) * np.array([base.sd, base.sv, base.total_acceleration]), rtol=1e-9)
    assert np.all(np.isfinite(base.psa)) and base.psa[0] >= 0


def test_grid_and_substeps() -> None:
    grid = core.period_grid()
    assert len(grid) == 200 and grid[0] == pytest.approx(0.02) and grid[-1] == pytest.approx(10.0)
    # Common practice (no source): at least 20 steps per period
    assert np.all(0.01 / core.substeps(grid, 0.01) <= grid / 20 + 1e-12)
