"""Shared pieces of the benchmarks: a row of the report and whole-process timing."""

from __future__ import annotations

import statistics
import subprocess
import sys
import time
from collections.abc import Sequence
from dataclasses import dataclass
from pathlib import Path

VENV_BIN = Path(sys.executable).parent


@dataclass(frozen=True)
class BenchRow:
    """One line of the `make bench` table.

    ``measured`` and ``reference`` are in ``unit``; ``budget`` is the largest allowed
    ratio measured/reference (or, when ``reference`` is None, the largest allowed
    measured value itself).
    """

    what: str
    measured: float
    reference: float | None
    budget: float
    unit: str = "s"
    extra: str = ""

    @property
    def ratio(self) -> float | None:
        return None if self.reference is None else self.measured / self.reference

    @property
    def passed(self) -> bool:
        value = self.ratio if self.ratio is not None else self.measured
        return value <= self.budget


def time_process(command: Sequence[str], repeats: int = 7) -> float:
    """Median wall time (s) of running ``command`` to completion, after one warm-up run."""
    subprocess.run(command, check=True, capture_output=True)
    times = []
    for _ in range(repeats):
        start = time.perf_counter()
        subprocess.run(command, check=True, capture_output=True)
        times.append(time.perf_counter() - start)
    return statistics.median(times)
