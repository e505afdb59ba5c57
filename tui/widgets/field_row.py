"""One input of a check: its label with the unit, the text box, and how the text was read."""

from __future__ import annotations

import textwrap
from collections.abc import Callable
from typing import Any

from rich.text import Text
from textual import events
from textual.app import ComposeResult
from textual.suggester import SuggestFromList
from textual.widget import Widget

from fieldmode.calc.framework.spec import Field
from fieldmode.tui.printable import printable
from fieldmode.tui.widgets.ordered_input import OrderedInput
from fieldmode.tui.widgets.path_suggester import PathSuggester

INDENT = 2
"""Cells before the text box (the '>' focus marker sits in them on the label line)."""
BOX_WIDTH, PATH_BOX_WIDTH = 16, 19
"""Width of a text box, and of a file path's (cells)."""
DEFAULT_WIDTH = 36
"""Width assumed before the row has been laid out (the field pane at 80 columns)."""


class FieldInput(OrderedInput):
    """A field's text box: keys kept in the order typed, every change reported at once, pastes cut
    to what the field holds with a note."""

    def __init__(self, value: str, edited: Callable[[str], None], **options: Any) -> None:
        self._edited: Callable[[str], None] | None = None  # the first value is not an edit
        super().__init__(value, **options)
        self._edited = edited
        self.cut = 0
        """Characters of the last paste left out because the field holds no more (0: none)."""

    def watch_value(self, value: str) -> None:
        """Report every change at once to the check pane (a message would hop through five containers)."""
        if self._edited is not None:
            self._edited(value)

    def _on_paste(self, event: events.Paste) -> None:
        """Paste the first line, without control characters, cut to what the field holds (and say so)."""
        line = printable(event.text.splitlines()[0]) if event.text else ""
        start, end = sorted(self.selection)
        room = max(0, self.max_length - len(self.value) + (end - start)) if self.max_length else len(line)
        self.cut = max(0, len(line) - room)
        if line[:room]:
            self.replace(line[:room], start, end)
        event.stop()
        if self.cut and self._edited is not None:
            self._edited(self.value)  # the row says the paste was cut

    async def _on_key(self, event: events.Key) -> None:
        self.cut = 0  # typed after a paste: the note of the cut paste has served
        await super()._on_key(event)


def input_id(check_id: str, field_name: str) -> str:
    """DOM id of a field's text box."""
    return f"in-{check_id}--{field_name}"


class FieldRow(Widget):
    """One field: its label, then the text box with how the text was read beside it, then any error.

    The row draws its label, the reading and the error itself around its one child, the text
    box, and sets its own height from the lines it shows: a row is two widgets, which keeps the
    first frame quick. The label folds onto more lines where the pane is narrow.
    """

    def __init__(self, check_id: str, spec_field: Field, text: str, edited: Callable[[str, str], None]) -> None:
        super().__init__(classes="field-row" + (" -path" if spec_field.kind == "path" else ""))
        self.check_id = check_id
        self.field = spec_field
        self.input: FieldInput = FieldInput(printable(text), lambda value: edited(spec_field.name, value),
                                            id=input_id(check_id, spec_field.name), compact=True,
                                            suggester=self._suggester(), max_length=spec_field.max_length,
                                            select_on_focus=False)
        self.note = ""
        """How the text was read, as shown beside the box."""
        self.error = ""
        """What is wrong with the text ('' when it was read)."""
        self.notes_shown = True
        """False in chart view, where the pane is too narrow for the readings."""
        self.alternative = ""
        """The line under the label naming the alternatives not shown and the key that switches ('' none)."""
        self._focused = False
        self._shape: tuple[int, int] | None = None
        self._cut_shown = 0

    def compose(self) -> ComposeResult:
        yield self.input

    def _suggester(self) -> SuggestFromList | PathSuggester | None:
        if self.field.kind == "choice":
            return SuggestFromList(self.field.choices, case_sensitive=False)
        if self.field.kind == "path":
            return PathSuggester()
        return None

    @property
    def _box_width(self) -> int:
        return PATH_BOX_WIDTH if self.field.kind == "path" else BOX_WIDTH

    def _lines(self, width: int) -> tuple[list[str], list[str], list[str]]:
        """The label lines, the reading's lines beside the box, and the error lines, for ``width`` cells."""
        label = self.field.label_with_unit + (", list" if self.field.many else "")
        labels = textwrap.wrap(label, max(8, width - 2)) or [""]
        beside = max(4, width - INDENT - self._box_width - 1)
        note = "! not read" if self.error else self.note
        if self.input.cut:
            note = f"! pasted text cut at {self.input.max_length} characters; {note}"
        notes = (textwrap.wrap(printable(note), beside) or [""]) if self.notes_shown else [""]
        errors = textwrap.wrap("! " + printable(self.error), max(8, width - INDENT)) if self.error else []
        return labels, notes, errors

    def _alternative_lines(self, width: int) -> list[str]:
        return textwrap.wrap(printable(self.alternative), max(8, width - INDENT)) if self.alternative else []

    def _fit(self) -> None:
        """Put the box below the label and make the row as tall as what it shows (a layout pass only
        when either changes)."""
        width = self.size.width or DEFAULT_WIDTH
        labels, notes, errors = self._lines(width)
        labels = labels + self._alternative_lines(width)
        shape = (len(labels), len(labels) + len(notes) + len(errors))
        if shape != self._shape:
            self._shape = shape
            self.input.styles.margin = (shape[0], 0, 0, INDENT)
            self.styles.height = shape[1]

    def on_resize(self) -> None:
        self._fit()

    def render(self) -> Text:
        """Label (marked '>' in focus), the reading beside the box, the error below."""
        width = self.size.width or DEFAULT_WIDTH
        labels, notes, errors = self._lines(width)
        text = Text(no_wrap=True, overflow="crop")
        for index, line in enumerate(labels):
            marker = "> " if self._focused and index == 0 else "  "
            text.append(marker + line + "\n", style="bold")
        for line in self._alternative_lines(width):
            text.append(" " * INDENT + line + "\n", style="dim")
        column = " " * (INDENT + self._box_width + 1)
        for line in notes:
            text.append(column + line + "\n", style="dim" if not self.error else "")
        for line in errors:
            text.append(" " * INDENT + line + "\n", style="bold")
        text.rstrip()
        return text

    def on_descendant_focus(self) -> None:
        self._focused = True
        self.refresh()

    def on_descendant_blur(self) -> None:
        self._focused = False
        self.refresh()

    def show(self, note: str, error: str) -> None:
        """Show how the text was read, or what is wrong with it (marked with '!')."""
        if (note, error, self.input.cut) == (self.note, self.error, self._cut_shown):
            return
        self.note, self.error, self._cut_shown = note, error, self.input.cut
        self.set_class(bool(error), "-error")
        self._fit()
        self.refresh()

    def show_alternative(self, text: str) -> None:
        """Name the alternatives not shown under the label ('' for none)."""
        if text != self.alternative:
            self.alternative = text
            self._fit()
            self.refresh()

    def show_notes(self, shown: bool) -> None:
        """Show the readings beside the boxes (results view) or not (chart view, a narrower pane)."""
        if shown != self.notes_shown:
            self.notes_shown = shown
            self._fit()
            self.refresh()

    def set_text(self, text: str) -> None:
        """Put ``text`` in the box; the pane ignores it as an edit (the session holds it already)."""
        box = self.input
        text = printable(text)
        if box.value != text:
            box.value = text
            box.cursor_position = len(text)
