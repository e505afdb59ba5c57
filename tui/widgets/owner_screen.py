"""Another app saves this session: open read-only, take over, or quit."""

from __future__ import annotations

from rich.text import Text
from textual.app import ComposeResult
from textual.binding import Binding
from textual.containers import Vertical
from textual.widgets import Static

from fieldmode.tui.widgets.dialog import Dialog

READ_ONLY, TAKE_OVER, QUIT = "read-only", "take over", "quit"


class OwnerScreen(Dialog[str]):
    """R opens read-only, T takes the session over, Q (or Escape) quits this window."""

    BINDINGS = [
        Binding("r", "choose('read-only')", "read-only", id="owner.read_only"),
        Binding("t", "choose('take over')", "take over", id="owner.take_over"),
        Binding("q,escape", "choose('quit')", "quit", id="owner.quit"),
    ]

    def __init__(self, holder: int, folder: str) -> None:
        super().__init__()
        self.holder = holder
        self.folder = folder

    def compose(self) -> ComposeResult:
        with Vertical(classes="dialog", id="owner") as box:
            box.can_focus = True  # keys reach the dialog's bindings once something in it has the focus
            yield Static(Text("This session is open in another fieldmode window", style="bold"))
            yield Static(Text(f"Process {self.holder} saves the session in {self.folder}. Two windows saving one "
                              "session would overwrite each other's inputs."))
            yield Static(Text("R  open read-only: nothing typed here is saved (F9 writes a calc record)\n"
                              "T  take over: this window saves the session, the other stops saving\n"
                              "Q  quit this window"))

    def on_mount(self) -> None:
        self.query_one("#owner").focus()

    def action_choose(self, choice: str) -> None:
        self.dismiss(choice)
