"""Send results into other checks (F8): every place a value can go, ticked or not before anything changes."""

from __future__ import annotations

from rich.text import Text
from textual.app import ComposeResult
from textual.binding import Binding
from textual.containers import Vertical
from textual.widgets import OptionList, Static

from fieldmode.tui.widgets.dialog import Dialog
from fieldmode.tui.workspace import Target

TICKED, UNTICKED = "[x]", "[ ]"
"""Marks of a line that will be sent or not: readable without colour."""


def target_line(target: Target) -> Text:
    """'[x] tmd, footfall: Mode frequency 2.1 Hz -> 6.80297 Hz (natural frequency of the structure)'."""
    mark = TICKED if target.ticked else UNTICKED
    line = Text(f"{mark} {', '.join(target.checks)}: {target.label} ")
    line.append(target.current or "(empty)", style="dim")
    line.append(" -> ")
    line.append(target.text, style="bold")
    if target.clears:
        line.append(f" (empties {', '.join(name.replace('_', ' ') for _, name in target.clears)})")
    return line


class SendScreen(Dialog[list[Target] | None]):
    """Up/Down to move, Space ticks or unticks a line, A and N tick or untick all, Enter sends the ticked lines,
    Escape sends nothing."""

    BINDINGS = [
        Binding("escape", "dismiss", "send nothing", id="send.cancel"),
        Binding("space", "tick", "tick or untick", id="send.tick"),
        Binding("a", "tick_all(True)", "tick all", id="send.all"),
        Binding("n", "tick_all(False)", "untick all", id="send.none"),
    ]

    def __init__(self, source: str, targets: list[Target], notes: list[str]) -> None:
        super().__init__()
        self.source = source
        self.targets = targets
        self.notes = notes

    def compose(self) -> ComposeResult:
        with Vertical(classes="dialog"):
            yield Static(Text(f"Send results of {self.source}", style="bold"))
            yield Static(Text("Space ticks or unticks a line, A ticks all, N unticks all; Enter sends the ticked "
                              "lines, Escape sends nothing. Several structures in one session? Tick only this "
                              "one's."), classes="dialog-note")
            yield OptionList(*(target_line(target) for target in self.targets), id="send-targets")
            for note in self.notes:
                yield Static(Text("i " + note), classes="dialog-note")

    def on_mount(self) -> None:
        self.query_one(OptionList).focus()

    def action_tick(self) -> None:
        options = self.query_one(OptionList)
        index = options.highlighted
        if index is None:
            return
        target = self.targets[index]
        target.ticked = not target.ticked
        options.replace_option_prompt_at_index(index, target_line(target))

    def action_tick_all(self, ticked: bool) -> None:
        options = self.query_one(OptionList)
        for index, target in enumerate(self.targets):
            target.ticked = ticked
            options.replace_option_prompt_at_index(index, target_line(target))

    def on_option_list_option_selected(self, event: OptionList.OptionSelected) -> None:
        event.stop()
        self.dismiss(self.targets)
