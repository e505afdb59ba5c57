"""The shipped demo decay record, generated from invented parameters with a fixed seed.

Scenario (invented): a heel drop on the steel mezzanine of the Lowmoor bottling hall, recorded
by an accelerometer at mid-bay. Two modes respond to a 50 ms half-sine heel force; an offset and
white noise are added. Regenerate the file with::

    python -m fieldmode.calc.demo.heel_drop     # writes calc/demo/data/heel_drop_demo.csv

Only numpy is used, so the file is the same wherever it is regenerated (a test checks it).
"""

from __future__ import annotations

import math
import sys
from dataclasses import dataclass

import numpy as np

from fieldmode.calc.demo import HEEL_DROP, write_demo


@dataclass(frozen=True)
class HeelDrop:
    """Invented parameters of the demo record (SI: Hz, s, m/s^2)."""

    sample_rate: float = 200.0
    duration: float = 10.0
    impact_time: float = 0.6
    pulse: float = 0.05
    frequency: float = 6.8
    damping: float = 0.025
    amplitude: float = 0.32
    second_frequency: float = 17.2
    second_damping: float = 0.035
    second_amplitude: float = 0.07
    offset: float = 0.045
    noise: float = 0.003
    seed: int = 4721


def _mode_acceleration(t: np.ndarray, force: np.ndarray, dt: float, frequency: float, damping: float) -> np.ndarray:
    """Acceleration of a unit-mass mode under ``force`` (closed-form impulse responses, convolved)."""
    omega = 2 * math.pi * frequency
    sigma, omega_d = damping * omega, omega * math.sqrt(1 - damping**2)
    decay = np.exp(-sigma * t)
    h_displacement = decay * np.sin(omega_d * t) / omega_d
    h_velocity = decay * (np.cos(omega_d * t) - sigma / omega_d * np.sin(omega_d * t))
    start = int(np.argmax(force != 0))
    pulse = force[start:start + int(np.count_nonzero(force[start:])) + 1]
    displacement, velocity = np.zeros_like(t), np.zeros_like(t)
    displacement[start:] = np.convolve(pulse, h_displacement)[:len(t) - start] * dt
    velocity[start:] = np.convolve(pulse, h_velocity)[:len(t) - start] * dt
    return force - 2 * damping * omega * velocity - omega**2 * displacement


def heel_drop(params: HeelDrop = HeelDrop()) -> tuple[np.ndarray, np.ndarray]:
    """Time (s) and acceleration (m/s^2) of the demo heel drop."""
    fine = 10
    dt = 1.0 / (params.sample_rate * fine)
    t = np.arange(int(round(params.duration / dt))) * dt
    local = t - params.impact_time
    force = np.where((local >= 0) & (local < params.pulse), np.sin(math.pi * local / params.pulse), 0.0)
    total = np.zeros_like(t)
    for frequency, damping, amplitude in ((params.frequency, params.damping, params.amplitude),
                                          (params.second_frequency, params.second_damping,
                                           params.second_amplitude)):
        response = _mode_acceleration(t, force, dt, frequency, damping)
        after = local > params.pulse + 1.0 / frequency
        total += response * amplitude / np.max(np.abs(response[after]))
    time = t[::fine]
    rng = np.random.default_rng(params.seed)
    return time, total[::fine] + params.offset + params.noise * rng.standard_normal(len(time))


def demo_text(params: HeelDrop = HeelDrop()) -> str:
    """The demo record as CSV text."""
    time, acceleration = heel_drop(params)
    lines = ["# Lowmoor bottling hall, mezzanine bay 2: heel drop at mid-bay (generated demo record)",
             f"# invented: {params.frequency} Hz at {params.damping:.1%}, second mode {params.second_frequency} Hz, "
             f"offset {params.offset} m/s^2, noise {params.noise} m/s^2 RMS, seed {params.seed}",
             "# regenerate: python -m fieldmode.calc.demo.heel_drop",
             "time [s],acceleration [m/s^2]"]
    lines += [f"{t:.3f},{a:.5f}" for t, a in zip(time, acceleration, strict=True)]
    return "\n".join(lines) + "\n"


if __name__ == "__main__":
    sys.exit(write_demo(HEEL_DROP, demo_text()))
