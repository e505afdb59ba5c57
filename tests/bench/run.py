"""`make bench`: byte-compile the package, run every tests/bench/bench_*.py and print one table with pass/fail.

Each bench module defines ``rows() -> list[BenchRow]``. Exit status 1 if a budget is missed.
"""

from __future__ import annotations

import compileall
import importlib
import sys
from pathlib import Path

HERE = Path(__file__).resolve().parent
sys.path.insert(0, str(HERE))
sys.path.insert(0, str(HERE.parent.parent))

from common import BenchRow  # noqa: E402


def _format(value: float | None, unit: str) -> str:
    if value is None:
        return "-"
    return f"{value * 1000:.1f} ms" if unit == "s" and value < 10 else f"{value:.4g} {unit}"


def main() -> int:
    # An installed package is byte-compiled when pip installs it; an editable one when it is first
    # imported, unless PYTHONDONTWRITEBYTECODE is set. Compile it here, so no run times compiling.
    for folder in ("calc", "tui"):
        compileall.compile_dir(str(HERE.parent.parent / folder), quiet=1)
    rows: list[BenchRow] = []
    for path in sorted(HERE.glob("bench_*.py")):
        module = importlib.import_module(path.stem)
        rows.extend(module.rows())
    header = f"{'what':<58} {'measured':>11} {'reference':>11} {'ratio':>7} {'budget':>8}  result"
    print(header)
    print("-" * len(header))
    for row in rows:
        ratio = "-" if row.ratio is None else f"{row.ratio:.2f}x"
        budget = f"{row.budget:.2f}x" if row.reference is not None else _format(row.budget, row.unit)
        verdict = "pass" if row.passed else "FAIL"
        print(f"{row.what:<58} {_format(row.measured, row.unit):>11} {_format(row.reference, row.unit):>11} "
              f"{ratio:>7} {budget:>8}  {verdict}")
        if row.extra:
            print(f"    {row.extra}")
    return 0 if all(row.passed for row in rows) else 1


if __name__ == "__main__":
    sys.exit(main())
