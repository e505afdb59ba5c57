"""The results table and the flags list of a check."""

from __future__ import annotations

from rich.table import Table
from rich.text import Text
from textual.app import RenderResult
from textual.geometry import Size
from textual.widgets import Static

from fieldmode.calc.framework.result import Flag
from fieldmode.tui.printable import printable

LEVEL_STYLES = {"info": "", "caution": "bold", "warning": "bold reverse"}
LONG_VALUE = 24
"""A value longer than this (characters) folds in three fifths of the width; labels keep two fifths."""


class ResultsTable(Static):
    """Result values with their units, in the chosen unit system.

    The table is laid out by rich once for each width it is shown at and kept as lines
    of text: measuring and drawing a rich Table again on every layout and redraw was a
    good part of the app's first frame and of each keystroke.
    """

    _lines: tuple[object, int, Text] | None = None

    def _table_lines(self, width: int) -> Text | None:
        """The table shown, as lines of ``width`` cells (None when it shows a message instead)."""
        table = self.content
        if not isinstance(table, Table) or width <= 0:
            return None
        if self._lines is None or self._lines[0] is not table or self._lines[1] != width:
            console = self.app.console
            rows = console.render_lines(table, console.options.update_width(width), pad=False)
            lines = (Text.assemble(*((segment.text, segment.style or "") for segment in row)) for row in rows)
            text = Text("\n").join(lines)
            self._lines = (table, width, text)
        return self._lines[2]

    def get_content_height(self, container: Size, viewport: Size, width: int) -> int:
        lines = self._table_lines(width)
        return super().get_content_height(container, viewport, width) if lines is None else len(lines.split())

    def render(self) -> RenderResult:
        lines = self._table_lines(self.content_region.width)
        return super().render() if lines is None else lines

    def show_rows(self, rows: list[tuple[str, str]]) -> None:
        """Show (label, value with its unit) rows."""
        # a long value (a list per storey, a sentence) folds in a fixed share, so labels stay readable
        folded = any(len(text) > LONG_VALUE for _, text in rows)
        table = Table(box=None, show_header=False, padding=(0, 1, 0, 0), expand=True)
        table.add_column("what", ratio=2 if folded else 1, overflow="fold")  # a long label takes two lines
        table.add_column("value", ratio=3 if folded else None, overflow="fold", justify="right")
        for label, text in rows:
            table.add_row(Text(label), Text(text))
        self.update(table)

    def show_problem(self, problem: str) -> None:
        """Say why there are no results (or that they are being computed)."""
        self.update(Text(problem if problem.endswith("...") else "No result. " + problem))


def flag_line(flag: Flag) -> Text:
    """A flag as one line: mark and level word (styled by level), then the text."""
    from fieldmode.tui.present import flag_heading  # loaded with the first result

    line = Text(flag_heading(flag.level) + ": ", style=LEVEL_STYLES[flag.level])
    line.append(printable(flag.text))
    return line


class FlagsList(Static):
    """The flags of the current result, each marked by a symbol and a word."""

    def show_flags(self, flags: tuple[Flag, ...]) -> None:
        """Show the flags of a result, one per line."""
        self.display = bool(flags)
        self.update(Text("\n").join(flag_line(flag) for flag in flags))

