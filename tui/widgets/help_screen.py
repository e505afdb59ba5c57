"""The key list: every key of the app and of its dialogs, with what it does."""

from __future__ import annotations

from collections.abc import Sequence

from rich.table import Table
from rich.text import Text
from textual.app import ComposeResult
from textual.binding import Binding
from textual.containers import Vertical, VerticalScroll
from textual.widgets import Static

from fieldmode.tui.widgets.dialog import Dialog

EXTRA_KEYS: tuple[tuple[str, str], ...] = (
    ("Tab / Shift+Tab", "next / previous field"),
    ("Right arrow", "accept the completion of a choice or file path"),
    ("Enter", "in a dialog: pick the row / save"),
    ("Escape", "close a dialog without doing anything"),
)


def key_rows(bindings: Sequence[Binding]) -> list[tuple[str, str, str]]:
    """(keys, what, id) for every binding, then the fixed keys of fields and dialogs."""
    rows = [(", ".join(k.strip().upper() for k in b.key.split(",")), b.tooltip or b.description, b.id or "")
            for b in bindings]
    return rows + [(keys, what, "") for keys, what in EXTRA_KEYS]


class HelpScreen(Dialog[None]):
    """Lists every key; Escape or F1 closes it."""

    BINDINGS = [Binding("escape,f1", "dismiss", "close", id="help.close")]

    def __init__(self, rows: list[tuple[str, str, str]]) -> None:
        super().__init__()
        self._rows = rows
        """(keys, what, binding id) as listed."""

    def compose(self) -> ComposeResult:
        with Vertical(classes="dialog"):
            yield Static(Text("Keys (Up/Down scroll, Escape closes)", style="bold"))
            table = Table(box=None, show_header=True, expand=True, padding=(0, 1, 0, 0))
            table.add_column("key", no_wrap=True)
            table.add_column("what it does", ratio=1)
            for keys, what, _ in self._rows:
                table.add_row(Text(keys), Text(what))
            with VerticalScroll(classes="help-keys") as self._keys:
                yield Static(table, id="help-table")

    def on_mount(self) -> None:
        if self._keys.is_mounted:
            self._keys.focus()
