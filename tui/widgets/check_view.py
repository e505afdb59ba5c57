"""A check's screen pane, generated from its spec: fields, results, flags and chart."""

from __future__ import annotations

from dataclasses import dataclass
from typing import TYPE_CHECKING

from textual import work
from textual.app import ComposeResult
from textual.containers import Horizontal, Vertical, VerticalScroll
from textual.message import Message
from textual.timer import Timer
from textual.widgets import Input
from textual.worker import get_current_worker

from fieldmode.tui.widgets.field_row import FieldRow
from fieldmode.tui.widgets.results_view import FlagsList, ResultsTable
from fieldmode.tui.workspace import Workspace

if TYPE_CHECKING:
    from fieldmode.calc.framework.spec import CheckSpec
    from fieldmode.tui.evaluation import Outcome
    from fieldmode.tui.widgets.chart_view import ChartPane

# Charts (plotext) load when a chart is first shown, and the unit reader and presenter (pint)
# when the pane first computes, in its worker: the first frame shows the fields without them.

THROTTLE = 0.15
"""Seconds: a keystroke after a quiet spell computes at once; further ones within this wait for its end."""
MOST_ITEMS = 6
"""A list result shows at most this many values in the results table (all in the calc record)."""
ALTERNATIVE_KEY = "ctrl+t"
"""The key that shows a field's next alternative (the app binds it)."""


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

    def __init__(self, spec: CheckSpec, workspace: Workspace, compute_on_mount: bool = True) -> None:
        """``compute_on_mount`` False: the app asks for the first computation (after its first frame)."""
        super().__init__(id=f"check-{spec.id}", classes="check-view")
        self._compute_on_mount = compute_on_mount
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
        self._rows: dict[str, FieldRow] = {}
        self._table = ResultsTable("", classes="results")
        self._flags = FlagsList("", classes="flags")
        self._fields_box = VerticalScroll(classes="fields", can_focus=False)
        self._results_box = VerticalScroll(classes="results-box", can_focus=False)
        self._right = Vertical(classes="right")
        """The pane's parts, kept: never looked up, so never missed while a burst of keys outruns mounting."""
        self._chart: ChartPane | None = None
        """Made the first time a chart is shown."""

    @property
    def up_to_date(self) -> bool:
        """True when the outcome on screen is that of the texts and unit system as they are now."""
        return (not self._pending and self.outcome is not None
                and self.outcome.texts == self.workspace.used_texts(self.spec.id)
                and self.outcome.system == self.workspace.system)

    def compose(self) -> ComposeResult:
        texts = self.workspace.texts[self.spec.id]
        self._rows = {spec_field.name: FieldRow(self.spec.id, spec_field, texts.get(spec_field.name, ""), self._edited)
                      for spec_field in self.spec.fields}
        with Horizontal(classes="panes"):
            with self._fields_box:
                yield from self._rows.values()
            with self._right, self._results_box:
                yield self._table
        yield self._flags
        self._arrange()

    def on_mount(self) -> None:
        self._table.show_problem("computing...")
        if self._compute_on_mount:
            self.request_compute()

    def rows(self) -> list[FieldRow]:
        return list(self._rows.values())

    def row(self, name: str) -> FieldRow:
        return self._rows[name]

    def focused_row(self) -> FieldRow | None:
        focused = self.app.focused
        return next((row for row in self._rows.values() if focused is row.input), None)

    def focus_first(self) -> None:
        next(row for row in self.rows() if row.display).input.focus()

    def _arrange(self) -> None:
        """Show the rows of the fields in use (hidden rows keep their texts and take no focus); name each
        shown alternative's others under its label."""
        hidden = self.workspace.hidden(self.spec.id)
        texts = self.workspace.texts[self.spec.id]
        key = "Ctrl+" + ALTERNATIVE_KEY.split("+")[1].upper()
        for name, row in self._rows.items():
            if row.display != (name not in hidden):
                row.display = name not in hidden
            others = [self.spec.field(other) for other in self.workspace.alternatives(self.spec.id, name)
                      if other != name]
            words = [f.label + (f" ({texts[f.name].strip()})" if texts.get(f.name, "").strip() else "")
                     for f in others]
            row.show_alternative(f"or {' / '.join(words)}: {key}" if words and row.display else "")
        focused = self.focused_row()
        if focused is not None and not focused.display:
            self._shown_row(focused.field.name).input.focus()

    def _shown_row(self, name: str) -> FieldRow:
        """The row shown for field ``name``: its own, the shown alternative of its group, or the first shown."""
        row = self._rows[name]
        if row.display:
            return row
        group = self.spec.field(name).group
        shown = [other for other in self.rows() if other.display]
        return next((other for other in shown if group and other.field.group == group), shown[0])

    def switch_alternative(self) -> str | None:
        """Show the next alternative of the field in focus and move to it; its label, or None if it has none."""
        row = self.focused_row()
        following = self.workspace.switch_alternative(self.spec.id, row.field.name) if row else None
        if following is None:
            return None
        self._arrange()
        self._rows[following].input.focus()
        self.request_compute()
        return self.spec.field(following).label

    def on_input_changed(self, event: Input.Changed) -> None:
        event.stop()  # handled as it happened, in _edited

    def _edited(self, name: str, text: str) -> None:
        """A field's text changed: save it in the session, share it, compute."""
        if text == self.workspace.texts[self.spec.id].get(name, ""):
            return  # the box was filled from the session, not typed
        shared = self.workspace.set_text(self.spec.id, name, text)
        self._arrange()
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
        self._arrange()
        self.request_compute()

    def request_compute(self) -> None:
        """Compute now if quiet, else once at the end of the current throttle window."""
        self.stale = False
        if self._timer is None:
            self._compute(self.workspace.used_texts(self.spec.id), self.workspace.system)
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
        from fieldmode.tui.evaluation import evaluate_guarded  # the core: loaded here, after the first frame

        outcome = evaluate_guarded(self.spec, texts, system)
        if not get_current_worker().is_cancelled:
            self.app.call_from_thread(self.apply, outcome)

    def apply(self, outcome: Outcome) -> None:
        """Show an outcome: readings and errors beside the fields, results, flags, chart."""
        self._show(outcome)
        if self.view and self._chart is not None:
            self._chart.draw(outcome.result, outcome.system)
        self.post_message(self.Computed(self.spec.id))

    def _show(self, outcome: Outcome) -> None:
        from fieldmode.tui.present import value_lines  # loaded by the compute worker already

        self.outcome = outcome
        errors = {self._shown_row(name).field.name: error for name, error in outcome.errors.items()}
        for name, row in self._rows.items():
            row.show(self._note(name, outcome), errors.get(name, ""))
        result = outcome.result
        if result is not None:
            self._table.show_rows([(value.label, "\n".join(value_lines(value, outcome.system, MOST_ITEMS)))
                                   for value in result.values.values()])
            self._flags.show_flags(result.flags)
        else:
            bad = [self.spec.field(name).label for name in errors]
            self._table.show_problem(outcome.problem or "Fix the field marked ! : " + ", ".join(bad))
            self._flags.show_flags(())

    def _note(self, name: str, outcome: Outcome) -> str:
        note = outcome.notes.get(name, "")
        spec_field = self.spec.field(name)
        if not note and not self.workspace.texts[self.spec.id].get(name, "").strip():
            # a field with alternatives in use is not optional: they are named under its label
            alone = len(self.workspace.alternatives(self.spec.id, name)) < 2
            note = "optional" if not spec_field.required and alone else ""
        partners = self.workspace.partners(self.spec.id, name)
        if partners and name in self.workspace.own[self.spec.id]:
            note += f"; its own value here (Ctrl+O: the same as in {', '.join(partners)})"
        elif partners:
            following = [check for check, _ in self.workspace.sharing(self.spec.id, name)]
            same = f"same as in {', '.join(following)}" if following else "shared"
            note += f"; {same} (Ctrl+O: a value of its own here)"
        return note.lstrip("; ")

    def scroll_results(self, pages: int) -> None:
        """Scroll the results (or the fields, in chart view) by whole pages."""
        box = self._fields_box if self.view else self._results_box
        box.scroll_to(y=box.scroll_y + pages * max(1, box.size.height - 1), animate=False)

    async def cycle_view(self) -> str:
        """Results -> chart panel 1 -> ... -> results; return what is shown now."""
        from fieldmode.tui.charts import panels_of
        from fieldmode.tui.widgets.chart_view import ChartPane

        panels = max(len(panels_of(self.spec.id)), 1)
        self.view = (self.view + 1) % (panels + 1)
        if self.view and self._chart is None:
            self._chart = ChartPane(self.spec.id)
            await self._right.mount(self._chart)
        self.set_class(bool(self.view), "-chart")
        for row in self._rows.values():
            row.show_notes(not self.view)
        self._results_box.display = not self.view
        if self._chart is not None:
            self._chart.display = bool(self.view)
        if not self.view or self._chart is None:
            return "results"
        self._chart.panel = self.view - 1
        outcome = self.outcome
        self._chart.draw(outcome.result if outcome else None, self.workspace.system, computing=outcome is None)
        return f"chart {self.view}/{panels}"
