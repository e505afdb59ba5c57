"""The shipped demo record of a lively office floor, generated from invented parameters with a fixed seed.

Scenario (invented): the open-plan office on level 4 of Tallowby House, bay C, which the people
who sit there call lively. An accelerometer on the floor at mid-bay records a minute of the
working day: walkers cross the bay now and then, and one of them paces at a third of the floor's
5.3 Hz mode, which answers at resonance. Each walker is a moving harmonic force (three harmonics
of the pacing rate, weighted by the half-sine mode shape along the path) on one mode; the
response is the mode's exact impulse response convolved with the force (numpy FFT), sampled at
the logger's rate, with white noise added, written in milli-g. Regenerate the file with::

    python -m fieldmode.calc.demo.lively_floor     # writes calc/demo/data/lively_floor_demo.csv

Only numpy is used, so the file is the same wherever it is regenerated (a test checks it).
"""

from __future__ import annotations

import math
import sys
from dataclasses import dataclass

import numpy as np

from fieldmode.calc.demo import LIVELY_FLOOR, write_demo

STANDARD_GRAVITY = 9.80665
"""m/s^2 in one g; the file is written in milli-g."""


@dataclass(frozen=True)
class Walker:
    """One invented crossing of the bay: start time (s), pacing rate (Hz), weight (N)."""

    start: float
    pace: float
    weight: float


@dataclass(frozen=True)
class LivelyFloor:
    """Invented parameters of the demo record (SI: Hz, s, kg, m, m/s^2)."""

    sample_rate: float = 250.0
    duration: float = 60.0
    frequency: float = 5.3
    damping: float = 0.02
    modal_mass: float = 14_000.0
    span: float = 10.8
    """Length of the walking path across the bay (m); the mode shape is a half sine along it."""
    stride: float = 0.75
    """Step length (m): the walking speed is stride x pacing rate."""
    harmonics: tuple[float, ...] = (0.4, 0.1, 0.07)
    """Dynamic load factors of the first three harmonics of the pacing rate."""
    walkers: tuple[Walker, ...] = (Walker(3.0, 1.92, 700.0), Walker(19.5, 1.767, 760.0),
                                   Walker(40.0, 1.78, 820.0))
    noise: float = 0.0004
    """White noise r.m.s. (m/s^2)."""
    seed: int = 6113


def _force(t: np.ndarray, params: LivelyFloor) -> np.ndarray:
    """Modal force (N) of the walkers crossing the bay, at times ``t`` (s)."""
    force = np.zeros_like(t)
    for walker in params.walkers:
        local = t - walker.start
        position = local * params.stride * walker.pace
        on = (local >= 0) & (position <= params.span)
        shape = np.sin(math.pi * position[on] / params.span)
        load = sum(factor * np.sin(2 * math.pi * (h + 1) * walker.pace * local[on])
                   for h, factor in enumerate(params.harmonics))
        force[on] += walker.weight * load * shape
    return force


def floor_acceleration(params: LivelyFloor = LivelyFloor()) -> tuple[np.ndarray, np.ndarray]:
    """Time (s) and floor acceleration (m/s^2) of the demo record, noise included."""
    fine = 8
    dt = 1.0 / (params.sample_rate * fine)
    t = np.arange(int(round(params.duration / dt))) * dt
    omega = 2 * math.pi * params.frequency
    sigma, omega_d = params.damping * omega, omega * math.sqrt(1 - params.damping**2)
    decay = np.exp(-sigma * t)
    h_displacement = decay * np.sin(omega_d * t) / omega_d
    h_velocity = decay * (np.cos(omega_d * t) - sigma / omega_d * np.sin(omega_d * t))
    p = _force(t, params) / params.modal_mass
    size = 2 * t.size
    spectrum = np.fft.rfft(p, size)
    displacement = np.fft.irfft(spectrum * np.fft.rfft(h_displacement, size), size)[:t.size] * dt
    velocity = np.fft.irfft(spectrum * np.fft.rfft(h_velocity, size), size)[:t.size] * dt
    acceleration = p - 2 * params.damping * omega * velocity - omega**2 * displacement
    time = t[::fine]
    rng = np.random.default_rng(params.seed)
    return time, acceleration[::fine] + params.noise * rng.standard_normal(time.size)


def demo_text(params: LivelyFloor = LivelyFloor()) -> str:
    """The demo record as CSV text, acceleration in milli-g."""
    time, acceleration = floor_acceleration(params)
    paces = ", ".join(f"{walker.pace:g}" for walker in params.walkers)
    lines = ["# Tallowby House, level 4 open-plan office, bay C: floor at mid-bay, walkers passing "
             "(generated demo record)",
             f"# invented: mode {params.frequency} Hz at {params.damping:.1%}, modal mass {params.modal_mass:g} kg, "
             f"walkers at {paces} Hz, noise {params.noise} m/s^2 RMS, seed {params.seed}",
             "# regenerate: python -m fieldmode.calc.demo.lively_floor",
             "time [s],acceleration [mg]"]
    milli_g = acceleration / STANDARD_GRAVITY * 1000.0
    lines += [f"{t:.3f},{a:.3f}" for t, a in zip(time, milli_g, strict=True)]
    return "\n".join(lines) + "\n"


if __name__ == "__main__":
    sys.exit(write_demo(LIVELY_FLOOR, demo_text()))
