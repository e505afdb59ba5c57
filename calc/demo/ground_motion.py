"""The invented demo accelerogram: filtered white noise under an envelope, from a fixed seed.

No recorded earthquake is used. Gaussian white noise (numpy PCG64, seed ``SEED``) is passed
through a Kanai-Tajimi ground filter and a Clough-Penzien high-pass filter, multiplied by a
Saragoni-Hart type envelope, baseline-corrected and scaled to a peak of ``PEAK_G`` g.
Regenerate the shipped file with ``python -m fieldmode.calc.demo.ground_motion [PATH]``.
"""

from __future__ import annotations

import math
import sys
from dataclasses import dataclass
from pathlib import Path

import numpy as np

from fieldmode.calc.demo import GROUND_MOTION
from fieldmode.calc.records.accelerogram import baseline_corrected

SEED = 4117
"""Seed of the demo noise (invented)."""
PEAK_G = 0.18
"""Peak of the demo record in g (about ag S of the demo site: 0.16 g x 1.15)."""


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
        "# regenerate: python -m fieldmode.calc.demo.ground_motion",
        "time [s],ground acceleration [g]",
    ]
    lines += [f"{t:.2f},{a:.6f}" for t, a in zip(time, acceleration, strict=True)]
    return "\n".join(lines) + "\n"


def main(argv: list[str]) -> int:
    """Write the demo accelerogram to ``argv[0]`` or to the package's data folder."""
    target = Path(argv[0]) if argv else Path(__file__).parent / "data" / GROUND_MOTION
    target.write_text(demo_text(), encoding="utf-8")
    print(f"wrote {target}")
    return 0


if __name__ == "__main__":
    sys.exit(main(sys.argv[1:]))
