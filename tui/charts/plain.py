"""Chart panels as plain ASCII text: for consoles without box or braille characters, and for the calc record."""

from __future__ import annotations

from typing import TYPE_CHECKING

if TYPE_CHECKING:
    from fieldmode.calc.framework.result import Result
    from fieldmode.tui.charts import DrawFunction

RECORD_SIZE = (76, 20)
"""Width and height (characters) of a chart in the calc record: it fits a page and an 80-column terminal."""

_BOX_TO_ASCII = str.maketrans({"─": "-", "━": "-", "│": "|", "┃": "|", "┌": "+", "┐": "+", "└": "+", "┘": "+",
                               "├": "+", "┤": "+", "┬": "+", "┴": "+", "┼": "+", "•": "*", "·": "."})


def ascii_only(text: str) -> str:
    """Chart text for consoles without box or braille characters: lines to - | +, dots to . or *."""
    text = text.translate(_BOX_TO_ASCII)
    if text.isascii():
        return text
    out = []
    for char in text:
        code = ord(char)
        if char.isascii():
            out.append(char)
        elif 0x2800 <= code <= 0x28FF:
            dots = (code - 0x2800).bit_count()
            out.append(" " if dots == 0 else "." if dots < 3 else "*")
        else:
            out.append("*")
    return "".join(out)


def panel_text(draw: DrawFunction, result: Result, system: str, size: tuple[int, int] = RECORD_SIZE) -> str:
    """One chart panel drawn by plotext as ASCII text without colour, lines without trailing blanks."""
    from textual_plotext import Plot  # a figure of its own: the app's charts are not touched

    plt = Plot()
    plt.plotsize(*size)
    plt.theme("clear")
    draw(plt, result, system)
    drawn = ascii_only(plt.uncolorize(plt.build()))
    return "\n".join(line.rstrip() for line in drawn.splitlines()).strip("\n")
