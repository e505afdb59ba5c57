"""Key-only helpers for pilot tests: move with Tab, type key by key, wait for results."""

from __future__ import annotations

import contextlib
import io

from rich.console import Console
from textual.pilot import Pilot
from textual.widgets import Input
from textual.worker import WorkerCancelled

from fieldmode.tui.app import FieldmodeApp
from fieldmode.tui.widgets.check_view import CheckView


async def settle(app: FieldmodeApp, pilot: Pilot) -> CheckView:
    """Wait until the check on screen shows the outcome of its current texts; return its pane."""
    for _ in range(200):
        with contextlib.suppress(WorkerCancelled):  # a newer keystroke replaced that computation
            await app.workers.wait_for_complete()
        await pilot.pause()
        if app.current_view.up_to_date:
            return app.current_view
        await pilot.pause(0.02)
    raise AssertionError("the check never caught up with its inputs")


async def focus_field(app: FieldmodeApp, pilot: Pilot, name: str) -> Input:
    """Move to a field with Tab alone (and Ctrl+T, for an alternative not shown); return its text box."""
    view = app.current_view
    target = view.row(name).input
    alternatives = app.workspace.alternatives(view.spec.id, name)
    shown = next((view.row(other).input for other in alternatives if view.row(other).display), target)
    for _ in range(len(view.spec.fields) + 2):
        if app.focused is shown:
            for _ in alternatives:
                if app.focused is target:
                    return target
                await pilot.press("ctrl+t")
        if app.focused is target:
            return target
        await pilot.press("tab")
    raise AssertionError(f"Tab never reached {name}")


async def jump_to(app: FieldmodeApp, pilot: Pilot, name: str) -> Input:
    """Put the focus on a field's row at once (Ctrl+T for an alternative not shown): for tests whose subject
    is what is typed, not how Tab moves (tests/tui/test_layout.py tabs through every field)."""
    view = app.current_view
    alternatives = app.workspace.alternatives(view.spec.id, name)
    shown = next((view.row(other).input for other in alternatives if view.row(other).display), None)
    (shown or view.row(name).input).focus()
    await pilot.pause()
    return await focus_field(app, pilot, name)


async def type_into(app: FieldmodeApp, pilot: Pilot, name: str, text: str) -> CheckView:
    """Clear a field and type ``text`` key by key; wait for the results."""
    await focus_field(app, pilot, name)
    await pilot.press("home", "ctrl+k", *keys_for(text))
    return await settle(app, pilot)


async def reveal(app: FieldmodeApp, pilot: Pilot, name: str) -> dict[str, str]:
    """Type into the choices a field depends on the first choice that uses it (by keys, as a person
    would); return the texts of the choice fields changed, as they were before."""
    view = app.current_view
    changed: dict[str, str] = {}
    for choice, values in view.spec.field(name).used_when.items():
        changed |= await reveal(app, pilot, choice)
        if choice not in app.workspace.hidden(view.spec.id) and view.row(choice).input.value in values:
            continue
        changed.setdefault(choice, view.row(choice).input.value)
        await type_into(app, pilot, choice, next((value for value in values if value), ""))
    return changed


def keys_for(text: str) -> list[str]:
    names = {" ": "space", "/": "slash", ".": "full_stop", ",": "comma", "%": "percent_sign", "-": "minus",
             "*": "asterisk", "^": "circumflex_accent", "'": "apostrophe", "_": "underscore", "#": "number_sign",
             "(": "left_parenthesis", ")": "right_parenthesis", "+": "plus", "?": "question_mark"}
    return [names.get(char, char) for char in text]


def screen_text(app: FieldmodeApp) -> str:
    """What the terminal shows, as plain text."""
    width, height = app.size
    console = Console(width=width, height=height, file=io.StringIO(), force_terminal=True, color_system=None,
                      record=True, legacy_windows=False)
    console.print(app.screen._compositor.render_update(full=True, screen_stack=app._background_screens))
    return console.export_text()


def note_of(view: CheckView, name: str) -> str:
    """The reading shown beside a field, then its error line and whether it is shared, as plain text."""
    row = view.row(name)
    return " ".join(part for part in (row.note if not row.error else "! not read",
                                       "! " + row.error if row.error else "", row.sharing[0]) if part)


def flags_text(view: CheckView) -> str:
    """The flags list of a pane as plain text."""
    return str(view.query_one(".flags").content)


async def go_to(app: FieldmodeApp, pilot: Pilot, check_id: str) -> CheckView:
    """Step through the checks with F3 until ``check_id`` is on screen; wait for its results."""
    for _ in app.specs:
        if app.current_view.spec.id == check_id:
            return await settle(app, pilot)
        await pilot.press("f3")
    raise AssertionError(f"F3 never reached {check_id}")
