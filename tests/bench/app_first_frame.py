"""Run an app headless until its first results are on screen, then exit; print when each stage was drawn.

    python app_first_frame.py bare    a Textual app showing one label (the reference)
    python app_first_frame.py field   fieldmode's app on the demo, started as `fieldmode` starts it

Prints ``frame <t>`` when the first frame is on screen (fieldmode: the fields and labels drawn) and,
for fieldmode, ``results <t>`` when the first results are on screen; ``t`` is ``time.monotonic()``,
the system-wide clock, comparable with the parent's (bench_app times from just before it started
this process).
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

    Bare().run(headless=True, size=(80, 24))


def field(state: Path) -> None:
    import fieldmode.tui.cli  # noqa: F401  (the console script's module, as `fieldmode` loads it)
    from fieldmode.tui.app import run_app

    def frame(app: Any) -> None:
        stages["frame"] = time.monotonic()

    def results(app: Any) -> None:
        stages["results"] = time.monotonic()
        app.exit()

    run_app(state, on_first_frame=frame, on_first_results=results, headless=True, size=(80, 24))


if __name__ == "__main__":
    if sys.argv[1] == "bare":
        bare()
    else:
        with tempfile.TemporaryDirectory() as folder:
            field(Path(folder))
    for stage, when in stages.items():
        print(f"{stage} {when!r}")
