"""One input of a check: its label with the unit, the text box, and how the text was read."""

from __future__ import annotations

from collections.abc import Callable
from typing import Any

from rich.text import Text
from textual import events
from textual.app import ComposeResult
from textual.containers import Horizontal, Vertical
from textual.suggester import SuggestFromList
from textual.widgets import Input, Static

from calc.spec import Field
from tui.widgets.path_suggester import PathSuggester

MAX_INPUT = 4096
"""Characters accepted in a text box (the parser refuses long text with a clear message)."""


class FieldInput(Input):
    """A text box that keeps a burst of keys in the order typed.

    Textual runs the key bindings of a focused widget only after the key has bubbled up
    to the app, so when keystrokes arrive together (over SSH they often do) typed
    characters overtook a Home, Backspace, Tab or F-key typed before them. Here every
    bound key runs as it arrives, and characters that arrive after a key moved the
    focus elsewhere follow the focus.
    """

    def __init__(self, value: str, edited: Callable[[str], None], **options: Any) -> None:
        self._edited: Callable[[str], None] | None = None  # the first value is not an edit
        super().__init__(value, **options)
        self._edited = edited

    def watch_value(self, value: str) -> None:
        """Report every change at once to the check pane (a message would hop through five containers)."""
        if self._edited is not None:
            self._edited(value)

    async def _on_key(self, event: events.Key) -> None:
        focused = self.app.focused
        if focused is not None and focused is not self:
            event.stop()
            event.prevent_default()
            focused.post_message(events.Key(event.key, event.character))
            return
        if not event.is_printable:
            active = self.screen.active_bindings.get(event.key)
            if active is not None and active.enabled and not active.binding.priority:
                event.stop()
                event.prevent_default()
                await self.app.run_action(active.binding.action, active.node)
                return
        await super()._on_key(event)


def input_id(check_id: str, field_name: str) -> str:
    """DOM id of a field's text box."""
    return f"in-{check_id}--{field_name}"


class FieldRow(Vertical):
    """Label line, then the text box with the reading beside it, then an error if any."""

    def __init__(self, check_id: str, spec_field: Field, text: str, edited: Callable[[str, str], None]) -> None:
        super().__init__(classes="field-row" + (" -path" if spec_field.kind == "path" else ""))
        self.check_id = check_id
        self._edited = edited
        self.field = spec_field
        self._text = text
        self._shown: tuple[str, str] | None = None

    def compose(self) -> ComposeResult:
        yield Static(self._label(False), classes="field-label", markup=False)
        with Horizontal(classes="field-line"):
            yield FieldInput(self._text, lambda value: self._edited(self.field.name, value),
                             id=input_id(self.check_id, self.field.name), compact=True,
                             suggester=self._suggester(), max_length=MAX_INPUT, select_on_focus=False)
            yield Static("", classes="field-note", markup=False)
        yield Static("", classes="field-error", markup=False)

    def _suggester(self) -> SuggestFromList | PathSuggester | None:
        if self.field.kind == "choice":
            return SuggestFromList(self.field.choices, case_sensitive=False)
        if self.field.kind == "path":
            return PathSuggester()
        return None

    def _label(self, focused: bool) -> Text:
        label = self.field.shown_label
        if self.field.many:
            label += ", list"
        return Text(("> " if focused else "  ") + label)

    @property
    def input(self) -> Input:
        return self.query_one(Input)

    def on_descendant_focus(self) -> None:
        self.query_one(".field-label", Static).update(self._label(True))
        self.add_class("-focused")

    def on_descendant_blur(self) -> None:
        self.query_one(".field-label", Static).update(self._label(False))
        self.remove_class("-focused")

    def show(self, note: str, error: str) -> None:
        """Show how the text was read, or what is wrong with it (marked with '!')."""
        if (note, error) == self._shown:
            return
        self._shown = (note, error)
        self.query_one(".field-note", Static).update(Text(note if not error else "! not read"))
        error_box = self.query_one(".field-error", Static)
        error_box.update(Text("! " + error) if error else Text(""))
        error_box.display = bool(error)
        self.set_class(bool(error), "-error")

    def set_text(self, text: str) -> None:
        """Put ``text`` in the box; the pane ignores it as an edit (the session holds it already)."""
        box = self.input
        if box.value != text:
            box.value = text
            box.cursor_position = len(text)
