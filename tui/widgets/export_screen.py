"""Ask where to write the calc record, of what (this check or the whole session), and for which project."""

from __future__ import annotations

from collections.abc import Callable, Mapping
from pathlib import Path

from rich.text import Text
from textual import events
from textual.app import ComposeResult
from textual.binding import Binding
from textual.containers import Horizontal, Vertical
from textual.content import Content
from textual.widgets import Input, RadioButton, RadioSet, Static

from fieldmode.tui.calc_record import MAX_PROJECT_TEXT, PROJECT_LABELS, record_paths, record_target
from fieldmode.tui.widgets.confirm_screen import ConfirmScreen
from fieldmode.tui.widgets.dialog import Dialog
from fieldmode.tui.widgets.ordered_input import OrderedInput

Writer = Callable[[Path, str], str]
"""write(path, scope) -> '' when written, else a one-line problem; scope is 'check' or 'session'."""
Keeper = Callable[[str, str], None]
"""keep(name, text): a project field was changed (the session keeps it)."""

PATH_LABEL = "File (.md)"


class ExportScreen(Dialog[str | None]):
    """Project fields, path box and scope choice; Enter writes (asking before replacing), Escape cancels.

    The project fields (project, job number, engineer, note) are handed to ``keep`` as they are
    typed, so the session keeps them even when the record is cancelled. The file name has the
    focus when the dialog opens; Tab and Shift+Tab move through every box. Dismisses with a line
    saying what was written, or None when cancelled. A failed write keeps the dialog open with the
    problem shown and the path as typed.
    """

    BINDINGS = [Binding("escape", "dismiss", "cancel", id="record.cancel")]

    def __init__(self, names: dict[str, str], write: Writer, project: Mapping[str, str] | None = None,
                 keep: Keeper | None = None) -> None:
        super().__init__()
        self.names = names
        """Scope -> default file name."""
        self.write = write
        self.project = dict(project or {})
        self.keep = keep
        self.scope = "check"

    def compose(self) -> ComposeResult:
        with Vertical(classes="dialog record"):
            yield Static(Text("Calc record, Markdown and JSON: Enter writes, Escape cancels, Tab moves",
                              style="bold"))
            for name, label in PROJECT_LABELS.items():
                with Horizontal(classes="record-row"):
                    yield Static(_label(label, False), classes="record-label", id=f"label-{name}")
                    yield OrderedInput(self.project.get(name, ""), id=f"project-{name}", compact=True,
                                max_length=MAX_PROJECT_TEXT, select_on_focus=False)
            yield Static(Text("  (typed once: the session keeps them for every record)"), classes="dialog-note")
            with Horizontal(classes="record-row"):
                yield Static(_label(PATH_LABEL, False), classes="record-label", id="label-path")
                yield OrderedInput(self.names["check"], id="record-path", compact=True)
            yield Static(Text("  a .json file with every value in SI is written beside it"), classes="dialog-note")
            with ScopeSet(id="record-scope", compact=True):
                yield ScopeButton("this check", value=True, id="scope-check")
                yield ScopeButton("whole session", id="scope-session")
            yield Static("", id="record-problem", markup=False)

    def on_mount(self) -> None:
        self.query_one("#record-path", Input).focus()

    def on_descendant_focus(self, event: events.DescendantFocus) -> None:
        self._mark(event.widget.id)

    def on_descendant_blur(self) -> None:
        self._mark(None)

    def _mark(self, focused: str | None) -> None:
        """'>' before the label of the box in focus, so the focus shows without colour."""
        for name, label in (*PROJECT_LABELS.items(), ("path", PATH_LABEL)):
            box = "record-path" if name == "path" else f"project-{name}"
            self.query_one(f"#label-{name}", Static).update(_label(label, focused == box))

    def on_input_changed(self, event: Input.Changed) -> None:
        name = (event.input.id or "").removeprefix("project-")
        if name in PROJECT_LABELS and self.keep is not None:
            self.keep(name, event.value)

    def on_radio_set_changed(self, event: RadioSet.Changed) -> None:
        new_scope = "session" if event.pressed.id == "scope-session" else "check"
        box = self.query_one("#record-path", Input)
        if box.value == self.names[self.scope]:
            box.value = self.names[new_scope]
        self.scope = new_scope

    def on_input_submitted(self, event: Input.Submitted) -> None:
        event.stop()
        text = self.query_one("#record-path", Input).value.strip()
        if not text:
            self._problem("give a file name")
            return
        try:
            path = record_target(text)
        except ValueError as error:
            self._problem(str(error))
            return
        existing = [p for p in record_paths(path) if p.exists()]
        if existing:
            names = " and ".join(str(p) for p in existing)
            verb = "exist" if len(existing) > 1 else "exists"
            self.app.push_screen(ConfirmScreen(f"{names} already {verb}. Replace?"),
                                 lambda yes: self._write(path) if yes else self._problem("not written: file kept"))
        else:
            self._write(path)

    def _write(self, path: Path) -> None:
        problem = self.write(path, self.scope)
        if problem:
            self._problem(problem)
        else:
            md_path, json_path = record_paths(path)
            self.dismiss(f"Calc record written: {md_path} and {json_path.name}")

    def _problem(self, text: str) -> None:
        self.query_one("#record-problem", Static).update(Text("! " + text))


def _label(label: str, focused: bool) -> Text:
    return Text(("> " if focused else "  ") + label + ":", style="bold" if focused else "")


class ScopeSet(RadioSet):
    """The scope choice: arrows move the cursor, Space picks, Enter picks and moves on to the file name,
    so a second Enter writes the record."""

    BINDINGS = [Binding("enter", "pick_and_move_on", "pick and go to the file name", show=False)]

    def action_pick_and_move_on(self) -> None:
        self.action_toggle_button()
        self.screen.query_one("#record-path", Input).focus()


class ScopeButton(RadioButton):
    """A choice drawn '(*) this check' or '( ) whole session', with '>' at the cursor: no colour needed."""

    def render(self) -> Content:
        cursor = self.has_class("-selected") and isinstance(self.parent, RadioSet) and self.parent.has_focus
        return Content(f"{'>' if cursor else ' '} {'(*)' if self.value else '( )'} {self.label}")
