"""The app: start to first full frame against a bare Textual app, and keystroke to updated results."""

from __future__ import annotations

import asyncio
import statistics
import sys
import tempfile
import time
from pathlib import Path

from common import VENV_BIN, BenchRow, time_process

HERE = Path(__file__).resolve().parent
KEYS = 25
"""Keystrokes timed for the median."""


def _first_frame() -> BenchRow:
    python = str(VENV_BIN / "python")
    app = time_process([python, str(HERE / "app_first_frame.py"), "field"])
    bare = time_process([python, str(HERE / "app_first_frame.py"), "bare"])
    floor = time_process([python, str(HERE / "app_first_frame.py"), "floor"])
    return BenchRow("app start to first full frame (headless) vs one-label app", app, bare, 2.0,
                    extra=f"for scale: the one-label app after importing the core (pint, numpy) takes "
                          f"{floor * 1000:.0f} ms = {floor / bare:.2f}x")


async def _keystrokes(chart: bool) -> list[float]:
    """Milliseconds from a key reaching the app to the results (and chart) being updated.

    Each key comes after a quiet spell, as when correcting one field: the throttle lets it
    through at once. (A burst of keys is coalesced; its last key is shown at most one
    throttle window, 150 ms, later.)
    """
    from textual import events

    from tui.field_app import FieldApp
    from tui.widgets.chart_view import ChartPane
    from tui.widgets.check_view import THROTTLE

    with tempfile.TemporaryDirectory() as folder:
        app = FieldApp(state_folder=Path(folder))
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
