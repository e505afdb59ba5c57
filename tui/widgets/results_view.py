"""The results table and the flags list of a check."""

from __future__ import annotations

from rich.table import Table
from rich.text import Text
from textual.widgets import Static

from calc.result import LEVEL_MARKS, Flag, Result
from tui.compute import shown_value

LEVEL_WORDS = {"info": "note", "caution": "caution", "warning": "WARNING"}
"""Flag levels as words, shown beside their mark: meaning never rests on colour."""
LEVEL_STYLES = {"info": "", "caution": "bold", "warning": "bold reverse"}
LONG_VALUE = 24
"""A value longer than this (characters) folds in three fifths of the width; labels keep two fifths."""


class ResultsTable(Static):
    """Result values with their units, in the chosen unit system."""

    def show_result(self, result: Result, system: str) -> None:
        shown = [(value.label, shown_value(value, system)) for value in result.values.values()]
        # a long value (a list per storey, a sentence) folds in a fixed share, so labels stay readable
        folded = any(len(text) > LONG_VALUE for _, text in shown)
        table = Table(box=None, show_header=False, padding=(0, 1, 0, 0), expand=True)
        table.add_column("what", ratio=2 if folded else 1, overflow="ellipsis", no_wrap=True)
        table.add_column("value", ratio=3 if folded else None, overflow="fold", justify="right")
        for label, text in shown:
            table.add_row(Text(label), Text(text))
        self.update(table)

    def show_problem(self, problem: str) -> None:
        self.update(Text("No result. " + problem))


def flag_line(flag: Flag) -> Text:
    """A flag as one line: mark, level word, text."""
    line = Text(f"{LEVEL_MARKS[flag.level]:<2} {LEVEL_WORDS[flag.level]}: ", style=LEVEL_STYLES[flag.level])
    line.append(flag.text)
    return line


class FlagsList(Static):
    """The flags of the current result, each marked by a symbol and a word."""

    def show_flags(self, flags: tuple[Flag, ...]) -> None:
        self.display = bool(flags)
        self.update(Text("\n").join(flag_line(flag) for flag in flags))
