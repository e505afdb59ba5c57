"""A check's screen pane, generated from its spec: fields, results, flags and chart."""

from __future__ import annotations

from dataclasses import dataclass

from textual import work
from textual.app import ComposeResult
from textual.containers import Horizontal, Vertical, VerticalScroll
from textual.message import Message
from textual.timer import Timer
from textual.widgets import Input
from textual.worker import get_current_worker

from calc.spec import CheckSpec
from tui.compute import Outcome, evaluate_guarded
from tui.widgets.chart_view import ChartPane
from tui.widgets.field_row import FieldRow
from tui.widgets.results_view import FlagsList, ResultsTable
from tui.workspace import Workspace

THROTTLE = 0.15
"""Seconds: a keystroke after a quiet spell computes at once; further ones within this wait for its end."""


class CheckView(Vertical):
    """Every field of one check on the left, results (or chart) on the right, flags below both."""

    @dataclass
    class Edited(Message):
        """The person changed a field; ``shared`` lists other (check, field) pairs changed with it."""

        check_id: str
        shared: list[tuple[str, str]]

    @dataclass
    class Computed(Message):
        """A new outcome is on screen."""

        check_id: str

    def __init__(self, spec: CheckSpec, workspace: Workspace) -> None:
        super().__init__(id=f"check-{spec.id}", classes="check-view")
        self.spec = spec
        self.workspace = workspace
        self.outcome: Outcome | None = None
        """The last evaluation shown."""
        self.view = 0
        """0 shows the results table; n >= 1 shows chart panel n."""
        self.stale = False
        """True when inputs or units changed while this check was not on screen."""
        self._timer: Timer | None = None
        self._pending = False

    @property
    def up_to_date(self) -> bool:
        """True when the outcome on screen is that of the texts and unit system as they are now."""
        return (not self._pending and self.outcome is not None
                and self.outcome.texts == self.workspace.texts[self.spec.id]
                and self.outcome.system == self.workspace.system)

    def compose(self) -> ComposeResult:
        texts = self.workspace.texts[self.spec.id]
        with Horizontal(classes="panes"):
            with VerticalScroll(classes="fields") as fields:
                fields.can_focus = False
                for spec_field in self.spec.fields:
                    yield FieldRow(self.spec.id, spec_field, texts.get(spec_field.name, ""), self._edited)
            with Vertical(classes="right"):
                with VerticalScroll(classes="results-box") as box:
                    box.can_focus = False
                    yield ResultsTable("", classes="results")
                yield ChartPane(self.spec.id)
        yield FlagsList("", classes="flags")

    def on_mount(self) -> None:
        self.query_one(ChartPane).display = False
        if any(f.kind == "path" for f in self.spec.fields):
            self.request_compute()  # reading a file may take a while: never before the first frame
        else:  # a few milliseconds: the first frame shows results, without a second layout pass
            self.apply(evaluate_guarded(self.spec, dict(self.workspace.texts[self.spec.id]), self.workspace.system))

    def rows(self) -> list[FieldRow]:
        return list(self.query(FieldRow))

    def row(self, name: str) -> FieldRow:
        return next(row for row in self.query(FieldRow) if row.field.name == name)

    def focused_row(self) -> FieldRow | None:
        focused = self.app.focused
        return next((row for row in self.query(FieldRow) if focused is row.input), None)

    def focus_first(self) -> None:
        self.rows()[0].input.focus()

    def on_input_changed(self, event: Input.Changed) -> None:
        event.stop()  # handled as it happened, in _edited

    def _edited(self, name: str, text: str) -> None:
        """A field's text changed: save it in the session, share it, compute."""
        if text == self.workspace.texts[self.spec.id].get(name, ""):
            return  # the box was filled from the session, not typed
        shared = self.workspace.set_text(self.spec.id, name, text)
        self.post_message(self.Edited(self.spec.id, shared))
        self.request_compute()

    def type_text(self, name: str, text: str) -> None:
        """Put ``text`` in a field as if typed (it is saved, shared and computed)."""
        self.row(name).input.value = text

    def sync(self) -> None:
        """Show the workspace's texts (after sharing, sending or a restore) and compute."""
        texts = self.workspace.texts[self.spec.id]
        for row in self.rows():
            row.set_text(texts.get(row.field.name, ""))
        self.request_compute()

    def request_compute(self) -> None:
        """Compute now if quiet, else once at the end of the current throttle window."""
        self.stale = False
        if self._timer is None:
            self._compute(dict(self.workspace.texts[self.spec.id]), self.workspace.system)
            self._timer = self.set_timer(THROTTLE, self._window_closed)
        else:
            self._pending = True

    def _window_closed(self) -> None:
        self._timer = None
        if self._pending:
            self._pending = False
            self.request_compute()

    @work(thread=True, exclusive=True, group="compute")
    def _compute(self, texts: dict[str, str], system: str) -> None:
        outcome = evaluate_guarded(self.spec, texts, system)
        if not get_current_worker().is_cancelled:
            self.app.call_from_thread(self.apply, outcome)

    def apply(self, outcome: Outcome) -> None:
        """Show an outcome: readings and errors beside the fields, results, flags, chart."""
        self.outcome = outcome
        for row in self.rows():
            name = row.field.name
            row.show(self._note(name, outcome), outcome.errors.get(name, ""))
        table = self.query_one(ResultsTable)
        flags = self.query_one(FlagsList)
        if outcome.result is not None:
            table.show_result(outcome.result, outcome.system)
            flags.show_flags(outcome.result.flags)
        else:
            bad = [self.spec.field(name).label for name in outcome.errors]
            table.show_problem(outcome.problem or "Fix the field marked ! : " + ", ".join(bad))
            flags.show_flags(())
        if self.view:
            self.query_one(ChartPane).draw(outcome.result, outcome.system)
        self.post_message(self.Computed(self.spec.id))

    def _note(self, name: str, outcome: Outcome) -> str:
        note = outcome.notes.get(name, "")
        spec_field = self.spec.field(name)
        if not note and not self.workspace.texts[self.spec.id].get(name, "").strip():
            others = [f.label for f in self.spec.fields
                      if f.group and f.group == spec_field.group and f is not spec_field]
            note = ("or " + " / ".join(others)) if others else ("optional" if not spec_field.required else "")
        if spec_field.shared and note and any(self.workspace.shared_partners(self.spec.id, name)):
            if name in self.workspace.own[self.spec.id]:
                note += " (own value; ^O shares)"
            else:
                linked = self.workspace.linked_count(self.spec.id, name)
                note += f" (shared with {linked}; ^O own)" if linked else " (^O own)"
        return note

    def scroll_results(self, pages: int) -> None:
        """Scroll the results (or the fields, in chart view) by whole pages."""
        box = self.query_one(".fields" if self.view else ".results-box", VerticalScroll)
        box.scroll_to(y=box.scroll_y + pages * max(1, box.size.height - 1), animate=False)

    def cycle_view(self) -> str:
        """Results -> chart panel 1 -> ... -> results; return what is shown now."""
        pane = self.query_one(ChartPane)
        panels = max(pane.panel_count, 1)
        self.view = (self.view + 1) % (panels + 1)
        self.set_class(bool(self.view), "-chart")
        self.query_one(".results-box").display = not self.view
        pane.display = bool(self.view)
        if not self.view:
            return "results"
        pane.panel = self.view - 1
        pane.draw(self.outcome.result if self.outcome else None, self.workspace.system)
        return f"chart {self.view}/{panels}"
