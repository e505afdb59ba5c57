"""Run an app headless until its first full frame, then exit (timed as a whole process by bench_app).

    python app_first_frame.py bare   a Textual app showing one label
    python app_first_frame.py floor  the same app after importing the core (calc.checks: pint, numpy)
    python app_first_frame.py field  fieldmode's app on the demo, until the first results are on screen
"""

from __future__ import annotations

import sys
import tempfile
from pathlib import Path


def bare() -> None:
    from textual.app import App, ComposeResult
    from textual.widgets import Label

    class Bare(App[None]):
        def compose(self) -> ComposeResult:
            yield Label("fieldmode")

        def on_mount(self) -> None:
            self.call_after_refresh(self.exit)

    Bare().run(headless=True, size=(80, 24))


def field(state: Path) -> None:
    sys.path.insert(0, str(Path(__file__).resolve().parents[2]))
    from tui.field_app import FieldApp
    from tui.widgets.check_view import CheckView

    class FirstFrame(FieldApp):
        def on_check_view_computed(self, event: CheckView.Computed) -> None:
            super().on_check_view_computed(event)
            self.call_after_refresh(self.exit)

    FirstFrame(state_folder=state).run(headless=True, size=(80, 24))


if __name__ == "__main__":
    if sys.argv[1] == "bare":
        bare()
    elif sys.argv[1] == "floor":
        sys.path.insert(0, str(Path(__file__).resolve().parents[2]))
        import calc.checks  # noqa: F401  (what any screen of results needs first)

        bare()
    else:
        with tempfile.TemporaryDirectory() as folder:
            field(Path(folder))
