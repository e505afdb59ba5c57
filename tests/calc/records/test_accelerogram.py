"""Baseline correction and peak ground values of accelerograms."""

from __future__ import annotations

import math

import numpy as np
import pytest
from scipy.integrate import cumulative_trapezoid

from fieldmode.calc.records import accelerogram


def sample_record(seconds: float = 6.0, dt: float = 0.01, seed: int = 7) -> np.ndarray:
    """A broadband test record (m/s^2) that ends while still shaking."""
    rng = np.random.default_rng(seed)
    count = int(round(seconds / dt)) + 1
    t = np.arange(count) * dt
    noise = np.convolve(rng.standard_normal(count), np.ones(3) / 3, mode="same")
    return 2.0 * noise * np.minimum(1.0, t / 1.0) + 1.5 * np.sin(2 * math.pi * 0.7 * t)


def test_ground_peaks_against_cumulative_trapezoid() -> None:
    dt = 0.002
    acc = sample_record(seconds=5.0, dt=dt, seed=5)
    pga, pgv, pgd = accelerogram.ground_peaks(acc, dt)
    velocity = cumulative_trapezoid(acc, dx=dt, initial=0.0)
    displacement = cumulative_trapezoid(velocity, dx=dt, initial=0.0)
    # Oracle: scipy.integrate.cumulative_trapezoid (exact for velocity, O(dt^2) for displacement)
    assert pga == np.abs(acc).max()
    assert pgv == pytest.approx(np.abs(velocity).max(), rel=1e-12)
    assert pgd == pytest.approx(np.abs(displacement).max(), rel=1e-4)


def test_ground_peaks_of_a_sine() -> None:
    dt, omega, amplitude = 0.001, 2 * math.pi, 2.0
    t = np.arange(0, 2.0 + dt / 2, dt)
    _, pgv, pgd = accelerogram.ground_peaks(amplitude * np.sin(omega * t), dt)
    # From memory: calculus: v = A/w (1 - cos w t), peak 2A/w; d = A/w (t - sin(w t)/w), at t = 2 s: 2A/w
    assert pgv == pytest.approx(2 * amplitude / omega, rel=1e-5)
    assert pgd == pytest.approx(amplitude / omega * 2.0, rel=1e-5)


def test_baseline_correction_removes_a_drift() -> None:
    dt = 0.01
    t = np.arange(2001) * dt
    line = 0.03 - 0.002 * t
    # Oracle: numpy.polynomial fit; a straight line in acceleration is a quadratic velocity through zero
    assert np.abs(accelerogram.baseline_corrected(line, dt)).max() < 1e-12
    corrected = accelerogram.baseline_corrected(sample_record(seconds=20.0, dt=dt) + line, dt)
    velocity = cumulative_trapezoid(corrected, dx=dt, initial=0.0)
    fit, *_ = np.linalg.lstsq(np.stack([t, t**2], axis=1), velocity, rcond=None)
    np.testing.assert_allclose(fit, 0.0, atol=1e-12)
