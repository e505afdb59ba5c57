"""The app: start to first full frame against a bare Textual app, and keystroke to updated results."""

from __future__ import annotations

import asyncio
import statistics
import subprocess
import sys
import tempfile
import time
from pathlib import Path

from common import VENV_BIN, BenchRow

HERE = Path(__file__).resolve().parent
KEYS = 25
"""Keystrokes timed for the median."""
ROUNDS = 9
"""Interleaved rounds of the start-up processes; the medians are taken over them."""


def _start(mode: str) -> tuple[float, float]:
    """Seconds from starting ``app_first_frame.py mode`` to its first full frame, and to its exit."""
    command = [str(VENV_BIN / "python"), str(HERE / "app_first_frame.py"), mode]
    start = time.monotonic()
    done = subprocess.run(command, check=True, capture_output=True, text=True)
    end = time.monotonic()
    shown = float(done.stdout.split()[-1])  # "first-frame <time.monotonic()>", the system-wide clock
    return shown - start, end - start


def _first_frame() -> BenchRow:
    """Start to first full frame, fieldmode's app against a one-label Textual app.

    Method: the three processes (one-label app, the same after importing the core,
    fieldmode's app) run one after the other, round after round (ROUNDS rounds after one
    warm-up round), so a busy spell on the shared machine hits all three alike; each
    figure is the median over the rounds. Each process reports when its first full frame
    was on screen (headless, 80x24); the time counts from just before the process was
    started, so it holds the interpreter's start, every import and the first frame, but
    not the exit, which is shown beside it (whole process, to exit).
    """
    modes = ("bare", "floor", "field")
    samples: dict[str, list[tuple[float, float]]] = {mode: [] for mode in modes}
    for round_ in range(ROUNDS + 1):
        for mode in modes:
            timing = _start(mode)
            if round_:
                samples[mode].append(timing)
    shown = {mode: statistics.median(t[0] for t in samples[mode]) for mode in modes}
    whole = {mode: statistics.median(t[1] for t in samples[mode]) for mode in modes}
    return BenchRow("app start to first full frame (headless) vs one-label app", shown["field"], shown["bare"], 2.0,
                    extra=f"medians of {ROUNDS} interleaved rounds; whole processes, to exit: app "
                          f"{whole['field'] * 1000:.0f} ms, one-label app {whole['bare'] * 1000:.0f} ms "
                          f"= {whole['field'] / whole['bare']:.2f}x; for scale: the one-label app after importing "
                          f"the core (pint, numpy) shows its frame at {shown['floor'] * 1000:.0f} ms "
                          f"= {shown['floor'] / shown['bare']:.2f}x")


async def _keystrokes(chart: bool) -> list[float]:
    """Milliseconds from a key reaching the app to the results (and chart) being updated.

    Each key comes after a quiet spell, as when correcting one field: the throttle lets it
    through at once. (A burst of keys is coalesced; its last key is shown at most one
    throttle window, 150 ms, later.)
    """
    from textual import events

    from fieldmode.tui.app import FieldmodeApp
    from fieldmode.tui.widgets.chart_view import ChartPane
    from fieldmode.tui.widgets.check_view import THROTTLE

    with tempfile.TemporaryDirectory() as folder:
        app = FieldmodeApp(state_folder=Path(folder))
        async with app.run_test(size=(80, 24)) as pilot:
            view = app.current_view
            while not view.up_to_date:
                await pilot.pause(0.01)
            if chart:
                await pilot.press("f6")
                await pilot.pause(0.2)
            await pilot.press("end")
            times = []
            for index in range(KEYS):
                await asyncio.sleep(THROTTLE + 0.02)
                key = "backspace" if index % 2 else "0"
                expected = view.row("mass").input.value[:-1] if index % 2 else view.row("mass").input.value + "0"
                start = time.perf_counter()
                app.post_message(events.Key(key, None if index % 2 else "0"))
                while not (view.outcome and view.outcome.texts.get("mass") == expected):
                    await asyncio.sleep(0.0005)
                if chart:
                    view.query_one(ChartPane)._plot.render()
                times.append((time.perf_counter() - start) * 1000)
            await pilot.press("f10")
    return times


def rows() -> list[BenchRow]:
    sys.path.insert(0, str(HERE.parent.parent))
    results = statistics.median(asyncio.run(_keystrokes(chart=False)))
    chart = statistics.median(asyncio.run(_keystrokes(chart=True)))
    return [
        _first_frame(),
        BenchRow("keystroke to updated results, median (sdof)", results, None, 30.0, unit="ms"),
        BenchRow("keystroke to updated results and chart, median (sdof)", chart, None, 30.0, unit="ms"),
    ]
