"""Ask where to write the calc record, and of what: this check or the whole session."""

from __future__ import annotations

import os
from collections.abc import Callable
from pathlib import Path

from rich.text import Text
from textual.app import ComposeResult
from textual.binding import Binding
from textual.containers import Vertical
from textual.widgets import Input, RadioButton, RadioSet, Static

from fieldmode.tui.calc_record import record_paths
from fieldmode.tui.widgets.confirm_screen import ConfirmScreen
from fieldmode.tui.widgets.dialog import Dialog

Writer = Callable[[Path, str], str]
"""write(path, scope) -> '' when written, else a one-line problem; scope is 'check' or 'session'."""


class ExportScreen(Dialog[str | None]):
    """Path box and scope choice; Enter writes (asking before replacing), Escape cancels.

    Dismisses with a line saying what was written, or None when cancelled. A failed
    write keeps the dialog open with the problem shown and the path as typed.
    """

    BINDINGS = [Binding("escape", "dismiss", "cancel", id="record.cancel")]

    def __init__(self, names: dict[str, str], write: Writer) -> None:
        super().__init__()
        self.names = names
        """Scope -> default file name."""
        self.write = write
        self.scope = "check"

    def compose(self) -> ComposeResult:
        with Vertical(classes="dialog"):
            yield Static(Text("Calc record: Markdown and JSON (Enter writes, Escape cancels)", style="bold"))
            yield Static(Text("File (.md; a .json is written beside it):"))
            yield Input(self.names["check"], id="record-path", compact=True)
            with RadioSet(id="record-scope"):
                yield RadioButton("this check", value=True, id="scope-check")
                yield RadioButton("whole session", id="scope-session")
            yield Static("", id="record-problem", markup=False)

    def on_mount(self) -> None:
        self.query_one(Input).focus()

    def on_radio_set_changed(self, event: RadioSet.Changed) -> None:
        new_scope = "session" if event.pressed.id == "scope-session" else "check"
        box = self.query_one(Input)
        if box.value == self.names[self.scope]:
            box.value = self.names[new_scope]
        self.scope = new_scope

    def on_input_submitted(self, event: Input.Submitted) -> None:
        event.stop()
        text = event.value.strip()
        if not text:
            self._problem("give a file name")
            return
        path = Path(os.path.expanduser(text))
        existing = [p for p in record_paths(path) if p.exists()]
        if existing:
            names = " and ".join(str(p) for p in existing)
            self.app.push_screen(ConfirmScreen(f"{names} already exists. Replace?"),
                                 lambda yes: self._write(path) if yes else self._problem("not written: file kept"))
        else:
            self._write(path)

    def _write(self, path: Path) -> None:
        problem = self.write(path, self.scope)
        if problem:
            self._problem(problem)
        else:
            md_path, json_path = record_paths(path)
            self.dismiss(f"Calc record written: {md_path} and {json_path.name}")

    def _problem(self, text: str) -> None:
        self.query_one("#record-problem", Static).update(Text("! " + text))
