"""Median time from changed text to new results and chart panels of the checks that compute most per keystroke
(storeys, tmd, footfall, floor, footbridge; in process)."""

from __future__ import annotations

import statistics
import time

import plotext
from common import BenchRow

from fieldmode.calc.checks import BY_ID
from fieldmode.tui.charts import panels_of

KEYSTROKE_BUDGET = 0.030
"""One keystroke to updated results and chart, median (s), per check (budget in DEVELOPERS.md)."""

EDITS = {
    "storeys": ("masses", ["310 t, 300 t, 24 t", "310 t, 300 t, 240 t", "310 t, 300 t, 245 t"]),
    "tmd": ("target_damping", ["5 %", "4 %", "6 %"]),
    "footfall": ("frequency", ["2.1 Hz", "2.15 Hz", "2.2 Hz"]),
    "floor": ("damping", ["3 %", "2.5 %", "3.5 %"]),
    "footbridge": ("damping", ["0.5 %", "0.6 %", "0.7 %"]),
}


def _update(check: str, texts: dict[str, str]) -> float:
    """Seconds to compute the results and draw the slowest of the check's panels (the chart view draws the one
    panel on screen)."""
    start = time.perf_counter()
    result = BY_ID[check].evaluate(texts)
    computed = time.perf_counter() - start
    slowest = 0.0
    for draw in panels_of(check):
        start = time.perf_counter()
        plotext.clf()
        plotext.plotsize(70, 18)
        draw(plotext, result, "si")
        plotext.build()
        slowest = max(slowest, time.perf_counter() - start)
    return computed + slowest


def rows() -> list[BenchRow]:
    found = []
    for check, (name, texts) in EDITS.items():
        base = BY_ID[check].demo_texts()
        if check == "tmd":
            base["mass_ratio"] = ""
        times = []
        for repeat in range(10):
            base[name] = texts[repeat % len(texts)]
            times.append(_update(check, base))
        found.append(BenchRow(f"{check}: typed text to results and its slowest chart panel (median)",
                              statistics.median(times[1:]), None, KEYSTROKE_BUDGET))
    return found
