"""The shipped demo construction-vibration record, generated from invented parameters with a fixed seed.

Scenario (invented): sheet piles are driven by a vibratory hammer for a culvert wall beside Orrin
Terrace, a row of two-storey brick houses; a triaxial geophone stands on the foundation of no. 6
and logs velocity in mm/s (x along the terrace, y across it, z vertical). The record holds two
drives of 20-24 s (the hammer ramps up through the ground's resonance to about 30 Hz, holds, and
runs down through the resonance again, which is when the ground moves most), a quiet spell between,
and the short knock of a pile set down afterwards, over background noise. It is sampled at 200 Hz
(a real logger samples faster) so that the file stays small. Regenerate it with::

    python -m fieldmode.calc.demo.sheet_piling     # writes calc/demo/data/sheet_piling_demo.csv

Only numpy is used, so the file is the same wherever it is regenerated (a test checks it).
"""

from __future__ import annotations

import math
import sys
from dataclasses import dataclass

import numpy as np

from fieldmode.calc.demo import SHEET_PILING, write_demo


@dataclass(frozen=True)
class Drive:
    """One drive of the vibratory hammer (s, Hz, mm/s)."""

    start: float
    length: float
    operating_frequency: float
    amplitude: float
    """Velocity at the operating frequency, before the ground's resonance magnifies it (mm/s)."""


@dataclass(frozen=True)
class SheetPiling:
    """Invented parameters of the demo record (s, Hz, mm/s)."""

    sample_rate: float = 200.0
    duration: float = 57.0
    drives: tuple[Drive, ...] = (Drive(2.0, 20.0, 30.0, 2.6), Drive(28.0, 22.0, 32.0, 3.0))
    ramp: float = 3.0
    """Time the hammer takes to reach its operating frequency, and to run down (s)."""
    ground_frequency: float = 12.5
    ground_damping: float = 0.3
    axis_shares: tuple[float, float, float] = (0.8, 0.55, 1.0)
    """Share of the vertical amplitude seen along x, y and z."""
    axis_phases: tuple[float, float, float] = (0.9, 2.1, 0.0)
    """Phase of each axis behind the hammer (rad)."""
    harmonic: float = 0.12
    """Second harmonic relative to the fundamental."""
    knock_time: float = 53.5
    knock_frequency: float = 14.0
    knock_damping: float = 0.06
    knock_amplitude: tuple[float, float, float] = (0.9, 0.6, 1.7)
    noise: float = 0.025
    seed: int = 6021


def _drive(t: np.ndarray, drive: Drive, params: SheetPiling) -> tuple[np.ndarray, np.ndarray]:
    """Amplitude (mm/s) and phase (rad) of the ground velocity during one drive: the hammer ramps up,
    holds and runs down; its force grows as f^2 and the ground magnifies it near its resonance."""
    local = t - drive.start
    ramp, length, f0 = params.ramp, drive.length, drive.operating_frequency
    rise = np.clip(local / ramp, 0.0, 1.0)
    fall = np.clip((length - local) / ramp, 0.0, 1.0)
    frequency = f0 * np.minimum(rise, fall)
    phase = 2 * math.pi * np.cumsum(frequency) / params.sample_rate
    ratio = frequency / params.ground_frequency
    gain = 1.0 / np.sqrt((1 - ratio**2) ** 2 + (2 * params.ground_damping * ratio) ** 2)
    steady = 1.0 / math.sqrt((1 - (f0 / params.ground_frequency) ** 2) ** 2
                             + (2 * params.ground_damping * f0 / params.ground_frequency) ** 2)
    weight = np.where((local >= 0) & (local <= length), ratio ** 2 * gain / (f0 / params.ground_frequency) ** 2
                      / steady, 0.0)
    return drive.amplitude * weight, phase


def sheet_piling(params: SheetPiling = SheetPiling()) -> tuple[np.ndarray, np.ndarray]:
    """Time (s) and velocities (mm/s; columns x, y, z) of the demo record."""
    t = np.arange(int(round(params.duration * params.sample_rate))) / params.sample_rate
    velocity = np.zeros((t.size, 3))
    for drive in params.drives:
        amplitude, phase = _drive(t, drive, params)
        for axis in range(3):
            lag = params.axis_phases[axis]
            wave = np.sin(phase - lag) + params.harmonic * np.sin(2 * phase - 2 * lag)
            velocity[:, axis] += params.axis_shares[axis] * amplitude * wave
    local = t - params.knock_time
    wd = 2 * math.pi * params.knock_frequency
    knock = np.where(local >= 0, np.exp(-params.knock_damping * wd * local) * np.sin(wd * local), 0.0)
    velocity += knock[:, None] * np.asarray(params.knock_amplitude)
    rng = np.random.default_rng(params.seed)
    velocity += params.noise * rng.standard_normal(velocity.shape)
    return t, velocity


def demo_text(params: SheetPiling = SheetPiling()) -> str:
    """The demo record as CSV text."""
    time, velocity = sheet_piling(params)
    lines = ["# Orrin Terrace no. 6, foundation: vibratory sheet piling for the culvert wall (generated demo record)",
             f"# invented: two drives at {params.drives[0].operating_frequency:g} and "
             f"{params.drives[1].operating_frequency:g} Hz, ground resonance {params.ground_frequency:g} Hz, "
             f"noise {params.noise} mm/s RMS, seed {params.seed}; sampled at {params.sample_rate:g} Hz",
             "# regenerate: python -m fieldmode.calc.demo.sheet_piling",
             "time [s],x [mm/s],y [mm/s],z [mm/s]"]
    lines += [f"{t:.3f},{x:.2f},{y:.2f},{z:.2f}".replace("-0.00", "0.00")
              for t, (x, y, z) in zip(time, velocity, strict=True)]
    return "\n".join(lines) + "\n"


if __name__ == "__main__":
    sys.exit(write_demo(SHEET_PILING, demo_text()))
