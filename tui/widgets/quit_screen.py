"""Quitting with inputs that are not saved: save the session to another file, quit anyway, or stay."""

from __future__ import annotations

import os
from collections.abc import Callable
from pathlib import Path

from rich.text import Text
from textual.app import ComposeResult
from textual.binding import Binding
from textual.containers import Vertical
from textual.widgets import Input, Static

from fieldmode.tui.widgets.dialog import Dialog
from fieldmode.tui.widgets.ordered_input import OrderedInput

Saver = Callable[[Path], str]
"""save(path) -> '' when the session was written there, else a one-line problem."""


class QuitScreen(Dialog[bool]):
    """Enter saves the session to the file typed and quits; F10 again quits without saving; Escape stays."""

    BINDINGS = [Binding("escape", "dismiss(False)", "stay", id="quit.stay")]

    def __init__(self, problem: str, suggested: str, save: Saver) -> None:
        super().__init__()
        self.problem = problem
        self.suggested = suggested
        self.save = save

    def compose(self) -> ComposeResult:
        with Vertical(classes="dialog"):
            yield Static(Text("Your inputs are not saved", style="bold"))
            yield Static(Text(self.problem))
            yield Static(Text("Enter saves the session to this file and quits; F10 again quits without saving; "
                              "Escape stays."))
            yield OrderedInput(self.suggested, id="quit-path", compact=True)
            yield Static("", id="quit-problem", markup=False)

    def on_mount(self) -> None:
        self.query_one(Input).focus()

    def on_input_submitted(self, event: Input.Submitted) -> None:
        event.stop()
        text = event.value.strip()
        problem = self.save(Path(os.path.expanduser(text))) if text else "give a file name"
        if problem:
            self.query_one("#quit-problem", Static).update(Text("! " + problem))
        else:
            self.dismiss(True)
