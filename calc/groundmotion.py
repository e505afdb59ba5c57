"""Ground motion records: baseline correction, peak ground values, and the invented demo record.

The demo accelerogram is filtered white noise under an envelope, from a fixed seed; no recorded
earthquake is used. Gaussian white noise (numpy PCG64, seed ``SEED``) is passed
through a Kanai-Tajimi ground filter and a Clough-Penzien high-pass filter, multiplied by a
Saragoni-Hart type envelope, baseline-corrected and scaled to a peak of ``PEAK_G`` g.
Regenerate the shipped file with ``python -m calc.groundmotion [PATH]``.
"""

from __future__ import annotations

import math
import sys
from dataclasses import dataclass
from pathlib import Path

import numpy as np

from calc.shipped import shipped_file

SEED = 4117
"""Seed of the demo noise (invented)."""
PEAK_G = 0.18
"""Peak of the demo record in g (about ag S of the demo site: 0.16 g x 1.15)."""
DEMO_FILE = "ground_motion_demo.csv"


@dataclass(frozen=True)
class MotionParameters:
    """Invented parameters of the synthetic motion (SI)."""

    time_step: float = 0.01
    duration: float = 40.0
    ground_frequency: float = 2.5
    """Kanai-Tajimi ground filter frequency (Hz)."""
    ground_damping: float = 0.6
    highpass_frequency: float = 0.2
    """Clough-Penzien high-pass frequency (Hz)."""
    highpass_damping: float = 0.7
    envelope_peak_time: float = 7.0
    """Time of the envelope's peak (s)."""
    envelope_shape: float = 2.0
    """Exponent b of the envelope (t/tp)^b exp(b (1 - t/tp))."""


def synthetic_motion(parameters: MotionParameters = MotionParameters(), seed: int = SEED,
                     peak_g: float = PEAK_G) -> tuple[np.ndarray, np.ndarray]:
    """Time (s) and ground acceleration (g) of the invented demo motion."""
    from scipy import signal

    p = parameters
    count = int(round(p.duration / p.time_step)) + 1
    time = np.arange(count) * p.time_step
    noise = np.random.default_rng(seed).standard_normal(count)
    wg, wf = 2 * math.pi * p.ground_frequency, 2 * math.pi * p.highpass_frequency
    ground = ([2 * p.ground_damping * wg, wg**2], [1.0, 2 * p.ground_damping * wg, wg**2])
    highpass = ([1.0, 0.0, 0.0], [1.0, 2 * p.highpass_damping * wf, wf**2])
    numerator = np.polymul(ground[0], highpass[0])
    denominator = np.polymul(ground[1], highpass[1])
    b, a = signal.bilinear(numerator, denominator, fs=1.0 / p.time_step)
    filtered = signal.lfilter(b, a, noise)
    ratio = time / p.envelope_peak_time
    envelope = ratio**p.envelope_shape * np.exp(p.envelope_shape * (1.0 - ratio))
    acceleration = baseline_corrected(filtered * envelope, p.time_step)
    return time, acceleration * (peak_g / np.max(np.abs(acceleration)))


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


def demo_path() -> str:
    """Path of the shipped demo accelerogram."""
    return str(shipped_file(DEMO_FILE))


def demo_text(parameters: MotionParameters = MotionParameters()) -> str:
    """The demo file's text: comment lines with its parameters, a header, then time and acceleration."""
    time, acceleration = synthetic_motion(parameters)
    lines = [
        "# fieldmode demo accelerogram: synthetic, invented (not a recorded earthquake)",
        f"# white noise seed {SEED}; Kanai-Tajimi filter {parameters.ground_frequency} Hz, "
        f"damping {parameters.ground_damping}; high-pass {parameters.highpass_frequency} Hz, "
        f"damping {parameters.highpass_damping}",
        f"# envelope (t/tp)^b exp(b(1-t/tp)), tp {parameters.envelope_peak_time} s, "
        f"b {parameters.envelope_shape}; baseline-corrected; peak {PEAK_G} g",
        "# regenerate: python -m calc.groundmotion",
        "time [s],ground acceleration [g]",
    ]
    lines += [f"{t:.2f},{a:.6f}" for t, a in zip(time, acceleration, strict=True)]
    return "\n".join(lines) + "\n"


def main(argv: list[str]) -> int:
    """Write the demo accelerogram to ``argv[0]`` or to the package's data folder."""
    target = Path(argv[0]) if argv else Path(__file__).parent / "data" / DEMO_FILE
    target.write_text(demo_text(), encoding="utf-8")
    print(f"wrote {target}")
    return 0


if __name__ == "__main__":
    sys.exit(main(sys.argv[1:]))
