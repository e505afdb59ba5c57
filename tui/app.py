"""The terminal app (placeholder until the app screens land)."""

from __future__ import annotations


def launch() -> int:
    """Open the app; return the exit status."""
    from textual.app import App, ComposeResult
    from textual.widgets import Footer, Static

    from calc.result import CAUTION

    class Placeholder(App[None]):
        BINDINGS = [("f10", "quit", "Quit")]

        def compose(self) -> ComposeResult:
            yield Static("fieldmode: the checks are on the command line for now (fieldmode checks).")
            yield Static(CAUTION)
            yield Footer()

    Placeholder().run()
    return 0
