"""Decay analysis of a 1,000,000-sample CSV, whole process, against reading the same file with numpy.loadtxt
in a process that imports numpy, scipy.signal and pint; and the peak memory of both."""

from __future__ import annotations

import math
import subprocess
import sys
import tempfile
from pathlib import Path

import numpy as np
from common import VENV_BIN, BenchRow, time_process

SAMPLES = 1_000_000
MEMORY_BUDGET_MIB = 400.0
"""Largest peak resident memory allowed for the decay process (MiB)."""


def write_record(folder: Path) -> Path:
    """A heel drop in a long record at 1 kHz: 6.8 Hz, 2.5 %, a second mode, noise and an offset."""
    fs = 1000.0
    time = np.arange(SAMPLES) / fs
    after = np.clip(time - 20.0, 0.0, None)
    started = time >= 20.0
    signal = np.where(started, np.exp(-0.025 * 2 * math.pi * 6.8 * after) * np.sin(2 * math.pi * 6.8 * after), 0.0)
    signal += np.where(started, 0.2 * np.exp(-0.035 * 2 * math.pi * 17.2 * after)
                       * np.sin(2 * math.pi * 17.2 * after), 0.0)
    signal += 0.04 + 0.003 * np.random.default_rng(7).standard_normal(SAMPLES)
    path = folder / "long_record.csv"
    np.savetxt(path, np.column_stack([time, signal]), fmt=("%.3f", "%.5f"), delimiter=",",
               header="time [s],acceleration [m/s^2]", comments="")
    return path


def peak_memory_mib(command: list[str]) -> float:
    """Peak resident memory (MiB) of ``command``, measured as the only child of a fresh process."""
    probe = ("import resource, subprocess, sys; subprocess.run(sys.argv[1:], check=True, capture_output=True); "
             "print(resource.getrusage(resource.RUSAGE_CHILDREN).ru_maxrss)")
    done = subprocess.run([sys.executable, "-c", probe, *command], check=True, capture_output=True, text=True)
    return int(done.stdout.strip()) / 1024.0


def rows() -> list[BenchRow]:
    with tempfile.TemporaryDirectory() as folder:
        path = write_record(Path(folder))
        decay = [str(VENV_BIN / "fieldmode"), "decay", str(path), "--json"]
        baseline = [str(VENV_BIN / "python"), "-c",
                    "import sys, numpy, scipy.signal, pint; numpy.loadtxt(sys.argv[1], delimiter=',', skiprows=1)",
                    str(path)]
        measured, reference = time_process(decay, repeats=5), time_process(baseline, repeats=5)
        memory, baseline_memory = peak_memory_mib(decay), peak_memory_mib(baseline)
    return [
        BenchRow("fieldmode decay, 1e6-sample CSV vs numpy.loadtxt process", measured, reference, 1.5),
        BenchRow("fieldmode decay, 1e6-sample CSV: peak memory", memory, None, MEMORY_BUDGET_MIB, unit="MiB",
                 extra=f"the numpy.loadtxt process peaks at {baseline_memory:.0f} MiB"),
    ]
