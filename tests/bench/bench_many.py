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
from dataclasses import dataclass
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
BUDGET_CPU = 1.2
"""Largest ratio of CPU time allowed: running in workers may cost little more work than one by one."""


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


@dataclass(frozen=True)
class Timing:
    """Medians over the rounds of one command: wall time and CPU time (itself and its workers), s."""

    wall: float
    cpu: float

    @property
    def share(self) -> float:
        """Cores the command kept busy on average (over 1: records ran side by side)."""
        return self.cpu / self.wall


def time_alternately(first: Sequence[str], second: Sequence[str]) -> tuple[Timing, Timing]:
    """Two commands run in turn, ``ROUNDS`` times after a warm-up round, so a busy spell hits both."""
    walls: tuple[list[float], list[float]] = ([], [])
    cpus: tuple[list[float], list[float]] = ([], [])
    for round_ in range(ROUNDS + 1):
        for index, command in enumerate((first, second)):
            used = _children_cpu()
            start = time.perf_counter()
            subprocess.run(command, check=True, capture_output=True)
            if round_:
                walls[index].append(time.perf_counter() - start)
                cpus[index].append(_children_cpu() - used)
    first_timing, second_timing = (Timing(statistics.median(walls[i]), statistics.median(cpus[i])) for i in (0, 1))
    return first_timing, second_timing


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
        folder_run, one_by_one_run = time_alternately(parallel, one_by_one)
    budget = BUDGET_PARALLEL if cores > 1 else BUDGET_ONE_CORE
    busy = " (other work shared the cores)" if one_by_one_run.share < 0.9 else ""
    extra = (f"{cores} cores; {SAMPLES:,} samples per record; the folder run kept {folder_run.share:.2f} cores "
             f"busy, one by one {one_by_one_run.share:.2f}{busy}")
    return [BenchRow(f"fieldmode decay FOLDER, {RECORDS} records, vs one by one in a process", folder_run.wall,
                     one_by_one_run.wall, budget, extra=extra),
            BenchRow("the same, CPU time (workers included) vs one by one", folder_run.cpu, one_by_one_run.cpu,
                     BUDGET_CPU)]
