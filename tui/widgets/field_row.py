"""One input of a check: its label with the unit, the text box, and how the text was read."""

from __future__ import annotations

from collections.abc import Callable
from typing import Any

from rich.text import Text
from textual import events
from textual.app import ComposeResult
from textual.containers import Horizontal, Vertical
from textual.content import Content
from textual.suggester import SuggestFromList
from textual.widgets import Input, Static

from fieldmode.calc.framework.spec import Field
from fieldmode.tui.widgets.dialog import hand_to_dialog
from fieldmode.tui.widgets.path_suggester import PathSuggester

MAX_INPUT = 4096
"""Characters accepted in a text box (the parser refuses long text with a clear message)."""


class FieldInput(Input):
    """A text box that keeps a burst of keys in the order typed.

    Textual runs the key bindings of a focused widget only after the key has bubbled up
    to the app, so when keystrokes arrive together (over SSH they often do) typed
    characters overtook a Home, Backspace, Tab or F-key typed before them. Here every
    bound key runs as it arrives, and characters that arrive after a key moved the
    focus elsewhere follow the focus, into a dialog that key opened too.
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
        if hand_to_dialog(self, event):  # typed after the key that opened a dialog
            return
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
    """Label line, then the text box with the reading beside it, then an error if any.

    The row draws its label line itself (the field line below it covers the rest of
    the row), and the error line is made the first time the field has an error: every
    widget costs start-up time.
    """

    def __init__(self, check_id: str, spec_field: Field, text: str, edited: Callable[[str, str], None]) -> None:
        super().__init__(classes="field-row" + (" -path" if spec_field.kind == "path" else ""))
        self.check_id = check_id
        self.field = spec_field
        self.input: Input = FieldInput(text, lambda value: edited(spec_field.name, value),
                                       id=input_id(check_id, spec_field.name), compact=True,
                                       suggester=self._suggester(), max_length=MAX_INPUT, select_on_focus=False)
        self._note = Static("", classes="field-note", markup=False)
        self._error: Static | None = None
        self._composed = False
        self._focused = False
        self._shown: tuple[str, str] | None = None

    def compose(self) -> ComposeResult:
        self._composed = True
        with Horizontal(classes="field-line"):
            yield self.input
            yield self._note
        if self._error is not None:
            yield self._error

    def _suggester(self) -> SuggestFromList | PathSuggester | None:
        if self.field.kind == "choice":
            return SuggestFromList(self.field.choices, case_sensitive=False)
        if self.field.kind == "path":
            return PathSuggester()
        return None

    def render(self) -> Content:
        """The label line: a '>' marker on the field in focus, the label with its unit."""
        label = self.field.label_with_unit
        if self.field.many:
            label += ", list"
        return Content.styled(("> " if self._focused else "  ") + label, "bold")

    def on_descendant_focus(self) -> None:
        self._focused = True
        self.refresh()

    def on_descendant_blur(self) -> None:
        self._focused = False
        self.refresh()

    def show(self, note: str, error: str) -> None:
        """Show how the text was read, or what is wrong with it (marked with '!')."""
        if (note, error) == self._shown:
            return
        self._shown = (note, error)
        self._note.update(Text(note if not error else "! not read"))
        if self._error is None:
            if not error:
                return
            self._error = Static(Text("! " + error), classes="field-error", markup=False)
            if self._composed:
                self.mount(self._error)
        else:
            self._error.update(Text("! " + error) if error else Text(""))
        self._error.display = bool(error)
        self.set_class(bool(error), "-error")

    def set_text(self, text: str) -> None:
        """Put ``text`` in the box; the pane ignores it as an edit (the session holds it already)."""
        box = self.input
        if box.value != text:
            box.value = text
            box.cursor_position = len(text)
