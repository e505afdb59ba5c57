"""Jump to any check by picking it from a list."""

from __future__ import annotations

from collections.abc import Sequence

from rich.text import Text
from textual.app import ComposeResult
from textual.binding import Binding
from textual.containers import Vertical
from textual.widgets import OptionList, Static
from textual.widgets.option_list import Option

from fieldmode.calc.framework.spec import CheckSpec
from fieldmode.tui.widgets.dialog import Dialog


class CheckListScreen(Dialog[str | None]):
    """Up/Down and Enter pick a check; Escape stays where you were."""

    BINDINGS = [Binding("escape", "dismiss", "close", id="go.close")]

    def __init__(self, specs: Sequence[CheckSpec], current: str) -> None:
        super().__init__()
        self.specs = specs
        self.current = current

    def compose(self) -> ComposeResult:
        with Vertical(classes="dialog"):
            yield Static(Text("Go to check (Enter picks, Escape closes)", style="bold"))
            yield OptionList(*(Option(_line(s, False), id=s.id) for s in self.specs))

    def on_mount(self) -> None:
        options = self.query_one(OptionList)
        options.highlighted = next(i for i, s in enumerate(self.specs) if s.id == self.current)
        options.focus()

    def on_option_list_option_highlighted(self, event: OptionList.OptionHighlighted) -> None:
        """Mark the check at the cursor with '>' (the highlight alone is a colour, lost with NO_COLOR)."""
        options = event.option_list
        for index, spec in enumerate(self.specs):
            options.replace_option_prompt_at_index(index, _line(spec, index == event.option_index))

    def on_option_list_option_selected(self, event: OptionList.OptionSelected) -> None:
        self.dismiss(event.option.id)


def _line(spec: CheckSpec, at_cursor: bool) -> Text:
    return Text(f"{'>' if at_cursor else ' '} {spec.id:<16}{spec.title}")
