"""Whole-process time of `fieldmode sdof --json` against importing pint and numpy."""

from __future__ import annotations

from common import VENV_BIN, BenchRow, time_process


def rows() -> list[BenchRow]:
    check = time_process([str(VENV_BIN / "fieldmode"), "sdof", "--mass", "9.6 t", "--stiffness", "42 kN/mm",
                          "--damping", "2 %", "--json"])
    baseline = time_process([str(VENV_BIN / "python"), "-c", "import pint, numpy"])
    return [BenchRow("fieldmode sdof --json, whole process vs import pint, numpy", check, baseline, 1.3)]
