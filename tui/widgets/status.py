"""The lines around the check: where you are (top), the caution and the keys (bottom)."""

from __future__ import annotations

from collections.abc import Sequence

from rich.text import Text
from textual.binding import Binding
from textual.widgets import Static


class Line(Static):
    """A line of text that is redrawn only when what it shows changes."""

    _shown = ""

    def show_line(self, text: Text, layout: bool = True) -> None:
        """Show ``text``; ``layout`` False when the line's height never changes (no layout pass)."""
        if text.markup != self._shown:
            self._shown = text.markup
            self.update(text, layout=layout)


class TopBar(Line):
    """Check position and title, unit system, what the right pane shows, save state."""

    def show_state(self, index: int, count: int, check_id: str, title: str, system: str, view: str,
                   saved: str) -> None:
        """``saved`` is '' when the session is saved, else what to say ('NOT SAVED', 'READ-ONLY')."""
        line = Text(f" {index + 1}/{count} ", style="reverse")
        line.append(f" {check_id}: {title}", style="bold")
        tail = f"units {system.upper()} | {view}" + (f" | {saved}" if saved else "")
        width = max(self.size.width, 80)
        line.append(" " * max(1, width - len(line) - len(tail) - 1))
        line.append(tail)
        self.show_line(line, layout=False)


class CautionLine(Line):
    """The caution of the check on screen, always visible."""

    def show_caution(self, caution: str) -> None:
        self.show_line(Text("Caution: " + caution, style="italic"))


class KeyBar(Line):
    """One line of keys and what they do, built from the app's bindings (those marked show)."""

    def show_keys(self, bindings: Sequence[Binding]) -> None:
        line = Text()
        for binding in bindings:
            if not binding.show:
                continue
            if line:
                line.append(" ")
            line.append(binding.key_display or binding.key.split(",")[0].upper(), style="reverse")
            line.append(" " + binding.description)
        self.show_line(line, layout=False)
