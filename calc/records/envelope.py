"""Peaks of a free decay, the log decrement, and least-squares fits of ln(peak amplitude) against time.

Pure functions: time in s, frequency in Hz, amplitudes in the signal's own unit.
"""

from __future__ import annotations

import math
from dataclasses import dataclass

import numpy as np

from fieldmode.calc.physics.sdof import damping_ratio_from_log_decrement


@dataclass(frozen=True)
class Peaks:
    """Alternating positive and negative peaks: times (s) and signed amplitudes."""

    time: np.ndarray
    amplitude: np.ndarray

    def __len__(self) -> int:
        return len(self.time)

    def take(self, count: int) -> Peaks:
        return Peaks(self.time[:count], self.amplitude[:count])


def pick_peaks(x: np.ndarray, fs: float, frequency: float, t0: float = 0.0) -> Peaks:
    """Positive and negative peaks of an oscillation of about ``frequency`` Hz, alternating in sign.

    Peaks closer than 0.3 of a period are merged (noise wiggles); amplitudes and times are refined
    with a parabola through the three samples around each peak. ``t0`` is the time of ``x[0]``.
    """
    from scipy.signal import find_peaks

    distance = max(1, int(0.3 * fs / frequency))
    upper, _ = find_peaks(x, distance=distance)
    lower, _ = find_peaks(-x, distance=distance)
    index = np.concatenate([upper[x[upper] > 0], lower[x[lower] < 0]])
    index.sort()
    keep: list[int] = []
    for i in index:
        if keep and np.sign(x[i]) == np.sign(x[keep[-1]]):
            if abs(x[i]) > abs(x[keep[-1]]):
                keep[-1] = int(i)
            continue
        keep.append(int(i))
    chosen = np.asarray(keep, dtype=int)
    if chosen.size == 0:
        return Peaks(np.empty(0), np.empty(0))
    left, centre, right = x[chosen - 1], x[chosen], x[chosen + 1]
    denominator = left - 2 * centre + right
    safe = np.where(denominator == 0, 1.0, denominator)
    offset = np.where(denominator == 0, 0.0, np.clip(0.5 * (left - right) / safe, -0.5, 0.5))
    amplitude = centre - 0.25 * (left - right) * offset
    return Peaks(t0 + (chosen + offset) / fs, amplitude)


@dataclass(frozen=True)
class EnvelopeFit:
    """ln|A| = intercept - sigma t fitted by least squares, with the 95 % interval of sigma (1/s)."""

    sigma: float
    sigma_low: float
    sigma_high: float
    intercept: float
    r_squared: float
    count: int

    def envelope(self, time: np.ndarray) -> np.ndarray:
        """Fitted envelope amplitude at ``time``."""
        return np.exp(self.intercept - self.sigma * time)


def fit_envelope(time: np.ndarray, amplitude: np.ndarray) -> EnvelopeFit:
    """Weighted least-squares line through ln|amplitude| against time; needs at least 3 peaks.

    Weights A^2: noise of a given size disturbs ln A by about noise/A, so small peaks count less.
    The 95 % interval uses Student's t with n - 2 degrees of freedom on the slope's standard error,
    widened by (1 + r1) / (1 - r1) for the lag-one correlation r1 of the residuals (neighbouring
    peaks share filtered noise), never narrowed.
    """
    from scipy.stats import t as student_t

    count = len(time)
    if count < 3:
        raise ValueError("at least 3 peaks are needed for a fit")
    log_amplitude = np.log(np.abs(amplitude))
    weight = amplitude**2 / np.mean(amplitude**2)
    t_mean = float(np.sum(weight * time) / np.sum(weight))
    y_mean = float(np.sum(weight * log_amplitude) / np.sum(weight))
    centred = time - t_mean
    sxx = float(np.sum(weight * centred**2))
    slope = float(np.sum(weight * centred * (log_amplitude - y_mean)) / sxx)
    intercept = y_mean - slope * t_mean
    residual = log_amplitude - (intercept + slope * time)
    total = float(np.sum(weight * (log_amplitude - y_mean) ** 2))
    squares = float(np.sum(weight * residual**2))
    r_squared = 1.0 - squares / total if total > 0 else 1.0
    inflation = 1.0
    if count > 3 and np.any(residual):
        lag_one = float(np.sum(residual[1:] * residual[:-1]) / np.sum(residual**2))
        lag_one = min(max(lag_one, 0.0), 0.9)
        inflation = (1.0 + lag_one) / (1.0 - lag_one)
    standard_error = math.sqrt(squares / (count - 2) / sxx * inflation)
    spread = float(student_t.ppf(0.975, count - 2)) * standard_error
    return EnvelopeFit(-slope, -slope - spread, -slope + spread, intercept, r_squared, count)


def damping_from_sigma(sigma: float, damped_frequency: float) -> tuple[float, float]:
    """Log decrement delta = sigma T_d and the exact damping ratio delta / sqrt(4 pi^2 + delta^2)."""
    decrement = sigma / damped_frequency
    return decrement, damping_ratio_from_log_decrement(decrement)


def damping_by_halves(peaks: Peaks) -> tuple[EnvelopeFit, EnvelopeFit] | None:
    """Envelope fits over the first (larger) and second (smaller) half of the peaks; None under 8 peaks."""
    half = len(peaks) // 2
    if half < 4:
        return None
    return (fit_envelope(peaks.time[:half], peaks.amplitude[:half]),
            fit_envelope(peaks.time[half:], peaks.amplitude[half:]))
