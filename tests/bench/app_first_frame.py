"""Run an app in the terminal it is given until its first results are on screen, then exit; report
when each stage was drawn.

    python app_first_frame.py bare  REPORT   a Textual app showing one label (the reference)
    python app_first_frame.py field REPORT   fieldmode's app on the demo, started as `fieldmode` starts it

Writes ``frame <t>`` to the file REPORT when the first frame is on screen (fieldmode: the fields and
labels drawn) and, for fieldmode, ``results <t>`` when the first results are on screen; ``t`` is
``time.monotonic()``, the system-wide clock, comparable with the parent's (bench_app starts this
process in a pseudo-terminal of 80x24 and times from just before it started it).
"""

from __future__ import annotations

import sys
import tempfile
import time
from pathlib import Path
from typing import Any

stages: dict[str, float] = {}


def bare() -> None:
    from textual.app import App, ComposeResult
    from textual.widgets import Label

    class Bare(App[None]):
        def compose(self) -> ComposeResult:
            yield Label("fieldmode")

        def on_mount(self) -> None:
            self.call_after_refresh(self.shown)

        def shown(self) -> None:
            stages["frame"] = time.monotonic()
            self.exit()

    Bare().run()


def field(state: Path) -> None:
    from fieldmode.tui import cli  # the console script's module, as `fieldmode` loads it

    cli.pause_garbage_collection()  # as cli.main does for the console script
    from fieldmode.tui.app import run_app

    def frame(app: Any) -> None:
        stages["frame"] = time.monotonic()

    def results(app: Any) -> None:
        stages["results"] = time.monotonic()
        app.exit()

    run_app(state, on_first_frame=frame, on_first_results=results)


if __name__ == "__main__":
    mode, report = sys.argv[1], Path(sys.argv[2])
    if mode == "bare":
        bare()
    else:
        with tempfile.TemporaryDirectory() as folder:
            field(Path(folder))
    report.write_text("".join(f"{stage} {when!r}\n" for stage, when in stages.items()))
