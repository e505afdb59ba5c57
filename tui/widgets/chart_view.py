"""The chart of a check: one panel at a time, drawn by the check's functions in tui.charts."""

from __future__ import annotations

from typing import Any

from rich.text import Text
from textual.app import ComposeResult
from textual.containers import Vertical
from textual.widgets import Static

from fieldmode.calc.framework.result import Result
from fieldmode.tui.charts import panels_of

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


def _safe_plot_class() -> type:
    """A PlotextPlot that shows a drawing fault as text instead of stopping the app (imported late)."""
    from textual_plotext import PlotextPlot

    class SafePlot(PlotextPlot):
        def render(self) -> Any:
            try:
                drawn = super().render()
            except Exception as error:  # a chart fault must show, not take the app down
                return Text(f"chart could not be drawn: {type(error).__name__}: {error}")
            if getattr(self.app, "ascii_borders", False) and isinstance(drawn, Text):
                drawn.plain = ascii_only(drawn.plain)
            return drawn

    return SafePlot


class ChartPane(Vertical):
    """Holds the plot widget, created the first time a chart is shown (plotext loads late)."""

    def __init__(self, check_id: str) -> None:
        super().__init__(classes="chart-pane")
        self.check_id = check_id
        self.panel = 0
        """Index of the panel shown, into the check's chart panels."""
        self._plot: Any = None
        self._message = Static("", classes="chart-message", markup=False)
        """Why there is no chart (kept, never looked up: it may be drawn before it is mounted)."""

    def compose(self) -> ComposeResult:
        yield self._message

    def draw(self, result: Result | None, system: str, computing: bool = False) -> None:
        """Draw the current panel for ``result`` (or say why there is none, or that it is being computed)."""
        message = self._message
        draws = panels_of(self.check_id)
        if not draws or result is None:
            message.update("no chart for this check" if not draws else
                           "computing..." if computing else "no chart: fix the inputs marked !")
            message.display = True
            if self._plot is not None:
                self._plot.display = False
            return
        if self._plot is None:
            self._plot = _safe_plot_class()()
            if self.is_mounted:
                self.mount(self._plot)
        elif not self._plot.is_mounted and self.is_mounted:
            self.mount(self._plot)
        self.border_title = f"chart {self.panel + 1}/{len(draws)}"
        plt = self._plot.plt
        plt.clear_figure()
        try:
            draws[self.panel % len(draws)](plt, result, system)
        except Exception as error:  # a chart fault must show, not take the app down
            message.update(f"chart could not be drawn: {type(error).__name__}: {error}")
            message.display = True
            self._plot.display = False
            return
        message.display = False
        self._plot.display = True
        self._plot.refresh()
