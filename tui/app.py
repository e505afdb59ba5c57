"""The terminal app: one pane per check spec, keyboard only, autosaved, with calc records.

Nothing here is specific to a check: every pane is generated from the check specs. The first
frame shows the fields of the check on screen; its results are computed in a worker right
after, which is when the core (pint, the unit reader) is loaded.
"""

from __future__ import annotations

import asyncio
import gc
import os
import re
import signal
import time
from collections.abc import Callable, Mapping, Sequence
from pathlib import Path
from typing import TYPE_CHECKING

from rich.text import Text
from textual import work
from textual.app import App, ComposeResult
from textual.binding import Binding
from textual.widgets import ContentSwitcher

from fieldmode.calc.checks import SPECS
from fieldmode.tui.printable import printable
from fieldmode.tui.session import SessionStore, state_dir
from fieldmode.tui.widgets.check_view import ALTERNATIVE_KEY, CheckView
from fieldmode.tui.widgets.status import CautionLine, KeyBar, TopBar
from fieldmode.tui.workspace import Workspace

if TYPE_CHECKING:
    from fieldmode.calc.framework.spec import CheckSpec
    from fieldmode.calc.typical_values import Row
    from fieldmode.tui.workspace import Target

# Dialogs, typical-value tables and the calc record writer are imported when first used: the
# first frame waits for nothing it does not show.

MAIN_ONLY = {"scroll_results", "own", "alternative", "previous_check", "next_check", "go", "units", "view", "lookup",
             "send", "record"}
"""Actions that act on the check on screen, so not while a dialog is open."""


class FieldmodeApp(App[int]):
    """Every check of the session, one at a time, with fields, results, flags and charts."""

    CSS_PATH = Path(__file__).with_name("app.tcss")
    TITLE = "fieldmode"
    ENABLE_COMMAND_PALETTE = False
    BINDINGS = [
        Binding("f1", "keys", "keys", id="keys", tooltip="list every key"),
        Binding("f2", "previous_check", "check", key_display="F2/F3", id="check.previous",
                tooltip="previous check"),
        Binding("f3", "next_check", "next check", show=False, id="check.next", tooltip="next check"),
        Binding("f4", "go", "go", id="check.go", tooltip="go to a check picked from the list"),
        Binding("f5", "units", "units", id="units", tooltip="show results in SI or US customary units"),
        Binding("f6", "view", "view", id="view", tooltip="show the results, then each chart panel in turn"),
        Binding("f7", "lookup", "table", id="lookup",
                tooltip="typical values for the field in focus, with sources; Enter fills the field"),
        Binding("f8", "send", "send", id="send",
                tooltip="send this check's results (such as a stiffness) into the same fields of other checks"),
        Binding("f9", "record", "record", id="record",
                tooltip="write a calc record (Markdown and JSON) of this check or of the whole session"),
        Binding("ctrl+o", "own", "own value", show=False, id="field.own",
                tooltip="a shared field (mass, damping) in focus: keep its own value in this check, or share it again"),
        Binding(ALTERNATIVE_KEY, "alternative", "alternative", show=False, id="field.alternative",
                tooltip="a field with an alternative in focus (stiffness or static deflection): show the other one "
                        "instead; what is typed in either is kept, the one shown is used"),
        Binding("pagedown", "scroll_results(1)", "results down", show=False, id="results.down",
                tooltip="scroll the results (the fields, in chart view) down a page"),
        Binding("pageup", "scroll_results(-1)", "results up", show=False, id="results.up",
                tooltip="scroll the results (the fields, in chart view) up a page"),
        Binding("f10,ctrl+q", "quit_saved", "quit", key_display="F10", id="quit", priority=True,
                tooltip="save the session and quit"),
    ]

    def __init__(self, state_folder: Path | None = None, ascii_borders: bool | None = None,
                 on_first_frame: Callable[[FieldmodeApp], None] | None = None,
                 on_first_results: Callable[[FieldmodeApp], None] | None = None,
                 specs: Sequence[CheckSpec] | None = None) -> None:
        """``on_first_frame`` is called once the fields are drawn, ``on_first_results`` once the
        first results are on screen (the start-up benchmark times both)."""
        super().__init__()
        self._on_first_frame = on_first_frame
        self._on_first_results = on_first_results
        self._first_results_shown = False
        self.specs = tuple(specs if specs is not None else SPECS)
        self.store = SessionStore(state_folder if state_folder is not None else state_dir())
        self._holder = self.store.owner.claim()
        """Process id of another app that saves this session (this one is read-only until asked), or None."""
        self.store.read_only = self._holder is not None
        loaded = self.store.load()
        self.startup_messages = loaded.messages + self.store.probe()
        self.workspace = Workspace(self.specs, loaded.data)
        self.views: dict[str, CheckView] = {}
        self.messages: list[str] = []
        """Every notice shown to the person, in order (tests read it)."""
        self.ascii_borders = ascii_terminal(os.environ) if ascii_borders is None else ascii_borders
        """Draw borders and charts with ASCII characters (consoles that show box or braille characters badly)."""
        self.set_class(self.ascii_borders, "-ascii")  # before mounting: no second styling pass
        self._save_sequence = 0
        self._save_problem = ""
        self._unsaved = False
        """True when something changed since the session was last written."""
        self._top = TopBar("", id="top")
        self._caution = CautionLine("", id="caution")
        self._keys = KeyBar("", id="keys")
        """The lines around the check (kept: never looked up, so never missed while mounting)."""
        self._switcher: ContentSwitcher | None = None

    def compose(self) -> ComposeResult:
        yield self._top
        current = self._new_view(self.workspace.current, compute_on_mount=False)
        self._switcher = ContentSwitcher(current, initial=current.id, id="checks")
        yield self._switcher
        yield self._caution
        yield self._keys

    def _new_view(self, check_id: str, compute_on_mount: bool = True) -> CheckView:
        view = CheckView(self.workspace.by_id[check_id], self.workspace, compute_on_mount)
        self.views[check_id] = view
        return view

    def on_mount(self) -> None:
        self._keys.show_keys([b for b in self.BINDINGS if isinstance(b, Binding)])
        self.current_view.focus_first()
        self._show_state()
        for message in self.startup_messages:
            self.say(message, warning=True, timeout=20)
        loop = asyncio.get_running_loop()
        for signum in (signal.SIGHUP, signal.SIGTERM):
            loop.add_signal_handler(signum, self._on_signal)
        self.call_after_refresh(self._first_frame)
        if self._holder is not None:
            from fieldmode.tui.widgets.owner_screen import OwnerScreen

            self.push_screen(OwnerScreen(self._holder, str(self.store.folder)), self._owner_chosen)

    def _owner_chosen(self, choice: str | None) -> None:
        """Another app saves this session: read-only, take over, or quit (widgets/owner_screen.py)."""
        from fieldmode.tui.widgets.owner_screen import READ_ONLY, TAKE_OVER

        if choice == TAKE_OVER:
            self.store.owner.take()
            self.store.read_only = False
            self.say(f"This window saves the session now; process {self._holder} stops saving it.")
            self.save_soon()
        elif choice == READ_ONLY:
            self.say("Read-only: nothing typed here is saved. F9 writes a calc record.", warning=True, timeout=15)
        else:
            self.exit(0)
            return
        self._show_state()

    def _first_frame(self) -> None:
        """The fields are on screen: now load the core and compute, in the pane's worker."""
        if self._on_first_frame is not None:
            self._on_first_frame(self)
        self.current_view.request_compute()

    def on_unmount(self) -> None:
        loop = asyncio.get_running_loop()
        for signum in (signal.SIGHUP, signal.SIGTERM):
            loop.remove_signal_handler(signum)
        self.store.owner.release()

    def _handle_exception(self, error: Exception) -> None:
        """A fault in the app (a bug): save the session, keep the details in a file, leave with status 1
        and one line that says so with the version (Textual would print a long traceback)."""
        import traceback

        from fieldmode.calc import __version__

        self.store.save(self.workspace.snapshot())
        report = self.store.folder / f"fault-{time.strftime('%Y%m%d-%H%M%S')}.txt"
        try:
            report.write_text("".join(traceback.format_exception(error)), encoding="utf-8")
            where = f"; details in {report}"
        except OSError:
            where = ""
        self.exit(1, return_code=1, message=Text(f"fieldmode {__version__}: internal fault ({type(error).__name__}: "
                                                 f"{error}); your inputs were saved{where}; please report it"))

    def _on_signal(self) -> None:
        """The link dropped or the process is asked to stop: save now, then leave cleanly."""
        self.store.save(self.workspace.snapshot())
        self.exit(0)

    @property
    def current_view(self) -> CheckView:
        return self.views[self.workspace.current]

    def say(self, text: str, warning: bool = False, timeout: float = 6) -> None:
        """Tell the person something (a notice in the corner) and keep it in :attr:`messages`."""
        text = printable(text, keep_newlines=True)
        self.messages.append(text)
        self.notify(text, title="warning" if warning else "done", severity="warning" if warning else "information",
                    timeout=timeout, markup=False)

    def check_action(self, action: str, parameters: tuple[object, ...]) -> bool | None:
        return not (action in MAIN_ONLY and len(self.screen_stack) > 1)

    def _show_state(self) -> None:
        view = self.current_view
        index = next(i for i, spec in enumerate(self.specs) if spec.id == view.spec.id)
        shown = "results" if not view.view else f"chart {view.view}"
        saved = "READ-ONLY" if self.store.read_only else "NOT SAVED" if self._save_problem else ""
        self._top.show_state(index, len(self.specs), view.spec.id, view.spec.title,
                                          self.workspace.system, shown, saved)
        self._caution.show_caution(view.spec.caution)

    # Changes and saving

    def on_check_view_edited(self, event: CheckView.Edited) -> None:
        for check_id, _ in event.shared:
            if check_id in self.views:
                self.views[check_id].stale = True
        self.save_soon()

    def on_check_view_computed(self, event: CheckView.Computed) -> None:
        if event.check_id == self.workspace.current:
            self._show_state()
            if not self._first_results_shown:
                self._first_results_shown = True
                if not gc.isenabled():  # paused while loading (cli.pause_garbage_collection)
                    gc.freeze()
                    gc.enable()
                if self._on_first_results is not None:
                    self.call_after_refresh(self._on_first_results, self)

    def save_soon(self) -> None:
        """Save the session in the background (after every change)."""
        self._unsaved = True
        self._save_sequence += 1
        self._save(self.workspace.snapshot(), self._save_sequence)

    @work(thread=True, group="save")
    def _save(self, snapshot: object, sequence: int) -> None:
        problem = self.store.save(snapshot, sequence)  # type: ignore[arg-type]
        self.call_from_thread(self._saved, problem)

    def _saved(self, problem: str) -> None:
        if not problem and self._save_sequence == self.store.written:
            self._unsaved = False
        if problem and problem != self._save_problem:
            self.say(problem + ". Export a calc record (F9) to keep your inputs.", warning=True, timeout=15)
        changed = bool(problem) != bool(self._save_problem)
        self._save_problem = problem
        if changed:
            self._show_state()

    # Moving between checks

    async def show_check(self, check_id: str) -> None:
        """Put a check on screen (building its pane the first time) and focus its first field."""
        switcher = self._switcher
        assert switcher is not None  # made in compose, before any check can be shown
        view = self.views.get(check_id)
        if view is None:
            view = self._new_view(check_id)
            await switcher.mount(view)
        elif view.stale:
            view.sync()
        switcher.current = view.id
        self.workspace.current = check_id
        view.focus_first()
        self._show_state()
        self.save_soon()

    async def _step(self, offset: int) -> None:
        ids = [spec.id for spec in self.specs]
        await self.show_check(ids[(ids.index(self.workspace.current) + offset) % len(ids)])

    async def action_previous_check(self) -> None:
        await self._step(-1)

    async def action_next_check(self) -> None:
        await self._step(1)

    def action_go(self) -> None:
        from fieldmode.tui.widgets.check_list_screen import CheckListScreen

        async def picked(check_id: str | None) -> None:
            if check_id:
                await self.show_check(check_id)

        self.push_screen(CheckListScreen(self.specs, self.workspace.current), picked)

    # Units, view, keys

    def action_units(self) -> None:
        self.workspace.system = "us" if self.workspace.system == "si" else "si"
        for view in self.views.values():
            view.stale = True
        self.current_view.request_compute()
        self._show_state()
        self.save_soon()

    async def action_view(self) -> None:
        await self.current_view.cycle_view()
        self._show_state()

    def action_scroll_results(self, pages: int) -> None:
        self.current_view.scroll_results(pages)

    def action_keys(self) -> None:
        from fieldmode.tui.widgets.help_screen import HelpScreen, key_rows

        if not isinstance(self.screen, HelpScreen):
            self.push_screen(HelpScreen(key_rows([b for b in self.BINDINGS if isinstance(b, Binding)])))

    def action_quit_saved(self) -> None:
        """Save and quit; when the session cannot be saved and something changed, ask first."""
        from fieldmode.tui.widgets.quit_screen import QuitScreen

        if isinstance(self.screen, QuitScreen):  # F10 again in the question: quit without saving
            self.exit(0)
            return
        snapshot = self.workspace.snapshot()
        problem = self.store.save(snapshot)
        if not problem or not self._unsaved:
            self.exit(0)
            return
        suggested = f"~/fieldmode-session-{time.strftime('%Y-%m-%d-%H%M')}.json"
        self.push_screen(QuitScreen(problem, suggested, lambda path: self._save_elsewhere(path, snapshot.to_json())),
                         lambda quit_now: self.exit(0) if quit_now else None)

    def _save_elsewhere(self, path: Path, text: str) -> str:
        """Write the session to ``path`` (it can be copied to the state folder later); '' or the problem."""
        from fieldmode.tui.files import describe_os_error, write_atomic

        try:
            write_atomic(path, text)
        except OSError as error:
            return describe_os_error(error, path)
        self.say(f"Session written to {path}")
        return ""

    # Lookups, sending, records

    def action_lookup(self) -> None:
        from fieldmode.calc.typical_values import choices_table, table_for
        from fieldmode.tui.widgets.lookup_screen import LookupScreen

        view = self.current_view
        row = view.focused_row()
        if row is None:
            self.say("Move to a field first (Tab), then F7.")
            return
        spec_field = row.field
        table = table_for(spec_field, view.spec.id)
        if table is None and spec_field.choices:
            table = choices_table(spec_field.label, spec_field.choices)
        if table is None:
            self.say(f"No table of typical values for {spec_field.label}.")
            return

        def fill(picked: Row | None) -> None:
            row.input.focus()
            if picked is not None:
                view.type_text(spec_field.name, picked.fill)
                self.say(f"{spec_field.label} = {picked.fill}: {picked.description} ({picked.source})")

        self.push_screen(LookupScreen(table, spec_field.label), fill)

    def action_own(self) -> None:
        view = self.current_view
        row = view.focused_row()
        if row is None or self.workspace.meaning_key(view.spec.id, row.field.name) is None:
            self.say("Ctrl+O works in a field shared with other checks (such as mass or damping).")
            return
        own = self.workspace.toggle_own(view.spec.id, row.field.name)
        if own:
            self.say(f"{row.field.label}: a value of its own in {view.spec.id}")
        else:
            text = self.workspace.texts[view.spec.id][row.field.name]
            self.say(f"{row.field.label}: shared again, {text} as in "
                     f"{', '.join(c for c, _ in self.workspace.sharing(view.spec.id, row.field.name))}")
        view.sync()
        self.save_soon()

    def action_alternative(self) -> None:
        shown = self.current_view.switch_alternative()
        if shown is None:
            self.say("Ctrl+T works in a field that has an alternative (such as stiffness or static deflection).")
            return
        self.say(f"{shown} is used now; the other alternative keeps its text.")
        self.save_soon()

    def action_send(self) -> None:
        from fieldmode.tui.evaluation import evaluate_guarded
        from fieldmode.tui.widgets.send_screen import SendScreen

        view = self.current_view
        spec = view.spec
        texts = self.workspace.used_texts(spec.id)
        outcome = view.outcome
        if (outcome is None or outcome.result is None or outcome.texts != texts
                or outcome.system != self.workspace.system):
            outcome = evaluate_guarded(spec, texts, self.workspace.system)
        if outcome.result is None:
            self.say("Nothing sent: fix the inputs marked ! first.", warning=True)
            return
        targets = self.workspace.send_targets(spec.id, outcome.result)
        if not targets:
            self.say(f"No other check has a field that means the same as a result of {spec.id}.")
            return
        notes = self.workspace.not_offered(spec.id, outcome.result)
        self.push_screen(SendScreen(spec.id, targets, notes), self._send)

    def _send(self, targets: list[Target] | None) -> None:
        applied = self.workspace.apply(targets or [])
        if not applied:
            self.say("Nothing sent.")
            return
        for target in applied:
            for check in target.checks:
                if check in self.views:
                    self.views[check].stale = True
        self.say("Sent " + "; ".join(f"{target.label} = {target.text} to {', '.join(target.checks)}"
                                     for target in applied))
        self.save_soon()

    def action_record(self) -> None:
        from fieldmode.tui.calc_record import default_name
        from fieldmode.tui.widgets.export_screen import ExportScreen

        names = {"check": default_name(self.workspace.current), "session": default_name("session")}
        self.push_screen(ExportScreen(names, self.write_record, self.workspace.project, self.keep_project),
                         self._recorded)

    def keep_project(self, name: str, text: str) -> None:
        """Keep a project field of the calc record in the session (typed once, saved with it)."""
        if self.workspace.project.get(name) == text:
            return
        self.workspace.project[name] = text
        self.save_soon()

    def _recorded(self, message: str | None) -> None:
        if message:
            self.say(message)

    def write_record(self, path: Path, scope: str) -> str:
        """Write the calc record of the current check or the session; '' or the problem."""
        from fieldmode.tui.calc_record import Entry, write_record
        from fieldmode.tui.evaluation import evaluate_guarded
        from fieldmode.tui.files import describe_os_error

        specs = self.specs if scope == "session" else (self.workspace.by_id[self.workspace.current],)
        system = self.workspace.system
        used = {spec.id: self.workspace.used_texts(spec.id) for spec in specs}
        entries = [Entry(spec, used[spec.id], evaluate_guarded(spec, used[spec.id], system)) for spec in specs]
        try:
            write_record(path, entries, system, self.workspace.project)
        except OSError as error:
            return describe_os_error(error, path) + "; nothing was lost, try another path"
        return ""


ASCII_TERMINALS = ("linux", "dumb", "vt100", "vt102", "vt220", "ansi")
"""Values of TERM whose consoles draw box and braille characters badly."""


def ascii_terminal(environ: Mapping[str, str]) -> bool:
    """True when the terminal should get ASCII drawing: asked for (FIELDMODE_ASCII=1), a console in
    :data:`ASCII_TERMINALS`, or a locale that is not UTF-8 (LANG=C, for one)."""
    if environ.get("FIELDMODE_ASCII") == "1" or environ.get("TERM", "") in ASCII_TERMINALS:
        return True
    locale = environ.get("LC_ALL") or environ.get("LC_CTYPE") or environ.get("LANG") or ""
    return re.search(r"utf-?8", locale, re.IGNORECASE) is None


def run_app(state_folder: Path | None = None, **options: object) -> int:
    """Open the app on the saved session (or the demo); return the exit status.

    ``options`` are those of :class:`FieldmodeApp`, plus ``headless`` and ``size`` for ``App.run``.
    """
    headless = bool(options.pop("headless", False))
    size = options.pop("size", None)
    app = FieldmodeApp(state_folder, **options)  # type: ignore[arg-type]
    status = app.run(headless=headless, size=size)  # type: ignore[arg-type]
    return status if isinstance(status, int) else 0
