"""Eight decay records through `fieldmode decay FOLDER --json` (parallel on the machine's cores) against the
same eight run one after another in one process (the command line's `main` called per file)."""

from __future__ import annotations

import math
import os
import resource
import statistics
import subprocess
import tempfile
import time
from collections.abc import Sequence
from pathlib import Path

import numpy as np
from common import VENV_BIN, BenchRow

ROUNDS = 5
"""Rounds after a warm-up; each runs both commands, one after the other, so a busy spell hits both."""
RECORDS = 8
SAMPLES = 500_000
"""Samples per record (500 s at 1 kHz): each record's analysis outweighs starting a worker."""
BUDGET_PARALLEL = 0.8
"""Largest ratio allowed with two or more cores: the records share the cores, the start-up is paid once."""
BUDGET_ONE_CORE = 1.1
"""Largest ratio allowed on one core: nothing runs in parallel, the pool must cost little."""


def write_records(folder: Path) -> None:
    """Heel drops in long records at 1 kHz, each mode a little apart, with a second mode, noise and an offset."""
    fs = 1000.0
    time = np.arange(SAMPLES) / fs
    after = np.clip(time - 20.0, 0.0, None)
    started = time >= 20.0
    for index in range(RECORDS):
        frequency = 5.0 + 0.4 * index
        signal = np.where(started, np.exp(-0.025 * 2 * math.pi * frequency * after)
                          * np.sin(2 * math.pi * frequency * after), 0.0)
        signal += np.where(started, 0.2 * np.exp(-0.035 * 2 * math.pi * 17.2 * after)
                           * np.sin(2 * math.pi * 17.2 * after), 0.0)
        signal += 0.04 + 0.003 * np.random.default_rng(index).standard_normal(SAMPLES)
        np.savetxt(folder / f"bay_{index:02d}.csv", np.column_stack([time, signal]), fmt=("%.3f", "%.5f"),
                   delimiter=",", header="time [s],acceleration [m/s^2]", comments="")


def time_alternately(first: Sequence[str], second: Sequence[str]) -> tuple[float, float, float]:
    """Median wall times (s) of two commands run in turn, ``ROUNDS`` times after a warm-up round, and the
    median share of one core the first got (CPU time of it and its workers over its wall time)."""
    times: tuple[list[float], list[float]] = ([], [])
    shares = []
    for round_ in range(ROUNDS + 1):
        for command, kept in zip((first, second), times, strict=True):
            used = _children_cpu()
            start = time.perf_counter()
            subprocess.run(command, check=True, capture_output=True)
            wall = time.perf_counter() - start
            if round_:
                kept.append(wall)
                if command is first:
                    shares.append((_children_cpu() - used) / wall)
    return statistics.median(times[0]), statistics.median(times[1]), statistics.median(shares)


def _children_cpu() -> float:
    """CPU time (s, user and system) of every child process waited for so far."""
    usage = resource.getrusage(resource.RUSAGE_CHILDREN)
    return usage.ru_utime + usage.ru_stime


def rows() -> list[BenchRow]:
    cores = os.cpu_count() or 1
    with tempfile.TemporaryDirectory() as folder:
        write_records(Path(folder))
        files = sorted(str(path) for path in Path(folder).glob("*.csv"))
        parallel = [str(VENV_BIN / "fieldmode"), "decay", folder, "--json"]
        one_by_one = [str(VENV_BIN / "python"), "-c",
                      "import sys\nfrom fieldmode.tui.cli import main\n"
                      "for path in sys.argv[1:]:\n    assert main(['decay', path, '--json']) == 0",
                      *files]
        measured, reference, share = time_alternately(parallel, one_by_one)
    budget = BUDGET_PARALLEL if cores > 1 else BUDGET_ONE_CORE
    extra = (f"{cores} cores; {SAMPLES:,} samples per record; the folder run got {share:.0%} of one core "
             "(over 100 %: records ran side by side)")
    return [BenchRow(f"fieldmode decay FOLDER, {RECORDS} records, vs one by one in a process", measured,
                     reference, budget, extra=extra)]
