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


class ResultsTable(Static):
    """Result values with their units, in the chosen unit system."""

    def show_result(self, result: Result, system: str) -> None:
        table = Table(box=None, show_header=False, padding=(0, 1, 0, 0), expand=True)
        table.add_column("what", ratio=1, overflow="ellipsis", no_wrap=True)
        table.add_column("value", overflow="fold", justify="right")
        for value in result.values.values():
            table.add_row(Text(value.label), Text(shown_value(value, system)))
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
