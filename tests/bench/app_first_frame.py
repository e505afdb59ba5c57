"""Run an app headless until its first full frame, then exit; print when that frame was done.

    python app_first_frame.py bare   a Textual app showing one label
    python app_first_frame.py floor  the same app after importing the core (calc.checks: pint, numpy)
    python app_first_frame.py field  fieldmode's app on the demo, started as `fieldmode` starts it
                                     (tui.cli, then tui.app.launch), until the first results are on screen

The last line printed is ``first-frame <time.monotonic()>`` taken when the frame is on
screen (the system-wide monotonic clock, comparable with the parent's; bench_app times
from just before it started this process).
"""

from __future__ import annotations

import sys
import tempfile
import time
from pathlib import Path
from typing import Any

ROOT = Path(__file__).resolve().parents[2]
shown_at: list[float] = []


def bare() -> None:
    from textual.app import App, ComposeResult
    from textual.widgets import Label

    class Bare(App[None]):
        def compose(self) -> ComposeResult:
            yield Label("fieldmode")

        def on_mount(self) -> None:
            self.call_after_refresh(self.shown)

        def shown(self) -> None:
            shown_at.append(time.monotonic())
            self.exit()

    Bare().run(headless=True, size=(80, 24))


def field(state: Path) -> None:
    sys.path.insert(0, str(ROOT))
    import fieldmode.tui.cli  # noqa: F401  (the console script's module, as `fieldmode` loads it)
    from fieldmode.tui.launch_old import launch

    def shown(app: Any) -> None:  # the FieldmodeApp, not imported here: launch() imports it
        shown_at.append(time.monotonic())
        app.exit()

    launch(state, on_first_frame=shown, headless=True, size=(80, 24))


if __name__ == "__main__":
    if sys.argv[1] == "bare":
        bare()
    elif sys.argv[1] == "floor":
        sys.path.insert(0, str(ROOT))
        import fieldmode.calc.checks  # noqa: F401  (what any screen of results needs first)

        bare()
    else:
        with tempfile.TemporaryDirectory() as folder:
            field(Path(folder))
    print(f"first-frame {shown_at[0]!r}")
