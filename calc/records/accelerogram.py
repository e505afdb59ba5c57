"""Accelerograms: baseline correction and peak ground acceleration, velocity and displacement."""

from __future__ import annotations

import numpy as np


def baseline_corrected(acc: np.ndarray, dt: float) -> np.ndarray:
    """Acceleration (m/s^2) less the baseline: the derivative c1 + 2 c2 t of the least-squares fit
    c1 t + c2 t^2 to the velocity (velocity by the trapezoid rule, zero at the first sample)."""
    acc = np.asarray(acc, dtype=float)
    t = np.arange(len(acc)) * dt
    velocity = _cumulative(acc, dt)
    basis = np.stack([t, t**2], axis=1)
    (c1, c2), *_ = np.linalg.lstsq(basis, velocity, rcond=None)
    return acc - (c1 + 2.0 * c2 * t)


def _cumulative(acc: np.ndarray, dt: float) -> np.ndarray:
    """Velocity (m/s) of a piecewise-linear acceleration, zero at the first sample (trapezoid rule, exact)."""
    return np.concatenate([[0.0], np.cumsum((acc[1:] + acc[:-1]) * (0.5 * dt))])


def ground_peaks(acc: np.ndarray, dt: float) -> tuple[float, float, float]:
    """Peak ground acceleration (m/s^2), velocity (m/s) and displacement (m) of ``acc`` as given.

    Velocity by the trapezoid rule and displacement by exact integration of the piecewise-linear
    acceleration, both from rest at the first sample.
    """
    acc = np.asarray(acc, dtype=float)
    velocity = _cumulative(acc, dt)
    increments = velocity[:-1] * dt + (2.0 * acc[:-1] + acc[1:]) * (dt * dt / 6.0)
    displacement = np.concatenate([[0.0], np.cumsum(increments)])
    return float(np.max(np.abs(acc))), float(np.max(np.abs(velocity))), float(np.max(np.abs(displacement)))
