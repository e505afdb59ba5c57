"""`ppv` on long triaxial records at 1 kHz, whole process, against reading the same file with numpy.loadtxt in a
process that imports numpy, scipy.signal and pint: a 20-minute record (1.2 million rows) and a one-hour record
(3.6 million rows), with the peak memory of the one-hour run against the size of its samples as float64."""

from __future__ import annotations

import math
import statistics
import subprocess
import sys
import tempfile
import time
from pathlib import Path

import numpy as np
from common import VENV_BIN, BenchRow

RATE = 1000.0
"""Samples per second (Hz)."""
AXES = 3
COLUMNS = AXES + 1
"""Columns of the file: the time and three axes."""
MEMORY_FACTOR = 3.0
"""Peak memory allowed, as a multiple of the file's numbers as float64 (rows x columns x 8 bytes)."""


def write_record(folder: Path, minutes: float) -> tuple[Path, int]:
    """A triaxial velocity record (mm/s): background noise and a 30 s vibratory drive every 2 minutes."""
    rows = int(minutes * 60 * RATE)
    time = np.arange(rows) / RATE
    rng = np.random.default_rng(11)
    velocity = 0.03 * rng.standard_normal((rows, AXES))
    local = np.mod(time, 120.0) - 30.0
    inside = (local >= 0) & (local < 30.0)
    envelope = np.where(inside, np.sin(math.pi * np.clip(local, 0, 30.0) / 30.0) ** 0.5, 0.0)
    for axis, share in enumerate((0.8, 0.55, 1.0)):
        velocity[:, axis] += share * 3.0 * envelope * np.sin(2 * math.pi * 28.0 * time + axis)
    path = folder / f"ppv_{minutes:g}min.csv"
    with path.open("w") as stream:
        stream.write("time [s],x [mm/s],y [mm/s],z [mm/s]\n")
        np.savetxt(stream, np.column_stack([time, velocity]), fmt=("%.3f", "%.3f", "%.3f", "%.3f"), delimiter=",")
    return path, rows


def peak_memory_mib(command: list[str]) -> float:
    """Peak resident memory (MiB) of ``command``, measured as the only child of a fresh process."""
    probe = ("import resource, subprocess, sys; subprocess.run(sys.argv[1:], check=True, capture_output=True); "
             "print(resource.getrusage(resource.RUSAGE_CHILDREN).ru_maxrss)")
    done = subprocess.run([sys.executable, "-c", probe, *command], check=True, capture_output=True, text=True)
    return int(done.stdout.strip()) / 1024.0


def time_pair(check: list[str], baseline: list[str], repeats: int) -> tuple[float, float]:
    """Median wall times (s) of the two commands, run in turn (after one warm-up each), so that a machine
    shared with other work slows both alike."""
    subprocess.run(check, check=True, capture_output=True)
    subprocess.run(baseline, check=True, capture_output=True)
    times: tuple[list[float], list[float]] = ([], [])
    for _ in range(repeats):
        for command, kept in ((check, times[0]), (baseline, times[1])):
            start = time.perf_counter()
            subprocess.run(command, check=True, capture_output=True)
            kept.append(time.perf_counter() - start)
    return statistics.median(times[0]), statistics.median(times[1])


def commands(path: Path) -> tuple[list[str], list[str]]:
    """The `ppv` process and the numpy.loadtxt process for one record."""
    check = [str(VENV_BIN / "fieldmode"), "ppv", str(path), "--guideline", "din-foundation-2",
             "--threshold", "0.5 mm/s", "--quiet-gap", "3 s", "--json"]
    baseline = [str(VENV_BIN / "python"), "-c",
                "import sys, numpy, scipy.signal, pint; numpy.loadtxt(sys.argv[1], delimiter=',', skiprows=1)",
                str(path)]
    return check, baseline


def rows() -> list[BenchRow]:
    with tempfile.TemporaryDirectory() as folder:
        short, _ = write_record(Path(folder), 20.0)
        check, baseline = commands(short)
        measured, reference = time_pair(check, baseline, repeats=5)
        short.unlink()
        long, count = write_record(Path(folder), 60.0)
        check_long, baseline_long = commands(long)
        measured_long, reference_long = time_pair(check_long, baseline_long, repeats=3)
        memory, baseline_memory = peak_memory_mib(check_long), peak_memory_mib(baseline_long)
    samples_mib = count * COLUMNS * 8 / 2**20
    axes_mib = count * AXES * 8 / 2**20
    return [
        BenchRow("fieldmode ppv, 20 min x 3 axes at 1 kHz vs numpy.loadtxt", measured, reference, 1.5),
        BenchRow("fieldmode ppv, 60 min x 3 axes at 1 kHz vs numpy.loadtxt", measured_long, reference_long, 1.5),
        BenchRow("fieldmode ppv, 60 min: peak memory", memory, None, MEMORY_FACTOR * samples_mib, unit="MiB",
                 extra=f"time and axes as float64 {samples_mib:.0f} MiB, budget {MEMORY_FACTOR:g}x (the axes alone "
                       f"{axes_mib:.0f} MiB: {memory / axes_mib:.2f}x); the numpy.loadtxt process peaks at "
                       f"{baseline_memory:.0f} MiB"),
    ]
