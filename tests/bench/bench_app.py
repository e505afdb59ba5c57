"""The app: start to first full frame against a bare Textual app, and keystroke to updated results."""

from __future__ import annotations

import asyncio
import fcntl
import os
import pty
import statistics
import struct
import subprocess
import sys
import tempfile
import termios
import time
from pathlib import Path

from common import VENV_BIN, BenchRow

HERE = Path(__file__).resolve().parent
KEYS = 25
"""Keystrokes timed for the median."""
ROUNDS = 9
"""Interleaved rounds of the start-up processes; the medians are taken over them."""


def _start(mode: str) -> dict[str, float]:
    """Seconds from starting ``app_first_frame.py mode`` in an 80x24 pseudo-terminal to each stage it
    reports, and to its exit."""
    with tempfile.TemporaryDirectory() as folder:
        report = Path(folder) / "stages"
        command = [str(VENV_BIN / "python"), str(HERE / "app_first_frame.py"), mode, str(report)]
        start = time.monotonic()
        _run_in_terminal(command)
        end = time.monotonic()
        stages = {line.split()[0]: float(line.split()[1]) - start for line in report.read_text().splitlines()}
    return {**stages, "exit": end - start}


def _run_in_terminal(command: list[str]) -> None:
    """Run ``command`` with a pseudo-terminal of 80x24 as its terminal, reading what it draws."""
    main, child = pty.openpty()
    fcntl.ioctl(child, termios.TIOCSWINSZ, struct.pack("HHHH", 24, 80, 0, 0))
    environment = {**os.environ, "TERM": "xterm-256color", "COLUMNS": "80", "LINES": "24"}
    process = subprocess.Popen(command, stdin=child, stdout=child, stderr=child, env=environment,
                               start_new_session=True)
    os.close(child)
    while True:  # the terminal's side: take everything the app writes until it closes
        try:
            if not os.read(main, 65536):
                break
        except OSError:
            break
    os.close(main)
    if process.wait() != 0:
        raise RuntimeError(f"{command} ended with status {process.returncode}")


def _start_up() -> list[BenchRow]:
    """Start to the first frame (fields and labels drawn) and to the first results, against a bare app.

    Method: the two processes (a Textual app showing one label, and fieldmode's app started as
    `fieldmode` starts it) run one after the other in an 80x24 pseudo-terminal, round after round
    (ROUNDS rounds after one warm-up round), so a busy spell on the shared machine hits both alike;
    each figure is the median over the rounds. Each process reports when its stages were on
    screen; the time counts from just before the process was started, so it holds the
    interpreter's start, every import and the drawing, but not the exit.
    """
    samples: dict[str, list[dict[str, float]]] = {"bare": [], "field": []}
    for round_ in range(ROUNDS + 1):
        for mode in samples:
            timing = _start(mode)
            if round_:
                samples[mode].append(timing)

    def median(mode: str, stage: str) -> float:
        return statistics.median(t[stage] for t in samples[mode])

    bare = median("bare", "frame")
    note = f"medians of {ROUNDS} interleaved rounds in an 80x24 pseudo-terminal; whole processes to exit: app " \
           f"{median('field', 'exit') * 1000:.0f} ms, one-label app {median('bare', 'exit') * 1000:.0f} ms"
    return [
        BenchRow("app start to first frame (fields drawn) vs one-label Textual app", median("field", "frame"), bare,
                 1.8, extra=note),
        BenchRow("app start to first results on screen vs one-label Textual app", median("field", "results"), bare,
                 2.5),
    ]


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
        *_start_up(),
        BenchRow("keystroke to updated results, median (sdof)", results, None, 30.0, unit="ms"),
        BenchRow("keystroke to updated results and chart, median (sdof)", chart, None, 30.0, unit="ms"),
    ]
