"""Ask before replacing a file: Y replaces, N or Escape keeps it."""

from __future__ import annotations

from rich.text import Text
from textual.app import ComposeResult
from textual.binding import Binding
from textual.containers import Horizontal, Vertical
from textual.widgets import Button, Static

from fieldmode.tui.widgets.dialog import Dialog


class ConfirmScreen(Dialog[bool]):
    """A yes/no question; the safe answer (no) has the focus."""

    BINDINGS = [
        Binding("y", "answer(True)", "replace", id="confirm.yes"),
        Binding("n,escape", "answer(False)", "keep", id="confirm.no"),
    ]

    def __init__(self, question: str) -> None:
        super().__init__()
        self.question = question

    def compose(self) -> ComposeResult:
        with Vertical(classes="dialog confirm"):
            yield Static(Text(self.question), classes="confirm-question")
            with Horizontal(classes="confirm-buttons"):
                yield Button("Y replace", id="yes", compact=True)
                yield Button("N keep", id="no", compact=True)

    def on_mount(self) -> None:
        self.query_one("#no", Button).focus()

    def action_answer(self, answer: bool) -> None:
        self.dismiss(answer)

    def on_button_pressed(self, event: Button.Pressed) -> None:
        self.dismiss(event.button.id == "yes")
