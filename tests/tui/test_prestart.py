"""The start-up helper (tui/prestart.py): the app opens on the same results with or without it.

Each scenario runs in a fresh interpreter, as `fieldmode` starts: the helper is forked
before Textual or any thread exists, which a test process full of threads is not.
"""

from __future__ import annotations

import json
import subprocess
import sys
from pathlib import Path

import pytest

ROOT = Path(__file__).resolve().parents[2]

pytestmark = pytest.mark.skipif(not hasattr(__import__("os"), "fork"), reason="the helper needs fork")

START = """
import json, sys, tempfile, time
from pathlib import Path
sys.path.insert(0, {root!r})
import tui.cli
from tui import prestart
from tui.app import launch
from tui.compute import shown_of
{patch}
seen = {{}}

def first_frame(app):
    view = app.current_view
    seen["first"] = [view.outcome.result is None, view.outcome.shown is not None, sorted(view.outcome.notes.items())]
    seen["first_rows"] = shown_of(view.outcome).rows
    seen["core_loaded_at_first_frame"] = "numpy" in sys.modules
    started = time.monotonic()

    def later():
        if view.outcome.result is None and time.monotonic() - started < 30:
            app.set_timer(0.05, later)
            return
        seen["later"] = [view.outcome.result is None, sorted(view.outcome.notes.items())]
        seen["later_rows"] = shown_of(view.outcome).rows
        app.exit()

    later()

with tempfile.TemporaryDirectory() as folder:
    launch(Path(folder), on_first_frame=first_frame, headless=True, size=(80, 24))
print(json.dumps(seen))
"""


def _start(patch: str = "") -> dict:
    script = START.format(root=str(ROOT), patch=patch)
    done = subprocess.run([sys.executable, "-c", script], capture_output=True, text=True, timeout=120, cwd=ROOT)
    assert done.returncode == 0, done.stderr
    return json.loads(done.stdout.strip().splitlines()[-1])


def test_the_first_frame_shows_the_helpers_results_then_the_apps_own_alike():
    seen = _start()
    result_is_none, came_as_text, notes = seen["first"]
    assert result_is_none and came_as_text and notes
    assert not seen["core_loaded_at_first_frame"]
    assert seen["later"] == [False, notes]  # computed again in the app, once the core is loaded
    assert seen["later_rows"] == seen["first_rows"] and seen["first_rows"]


def test_without_an_answer_from_the_helper_the_app_computes_the_first_results_itself():
    patch = "prestart._send = lambda pipe, answer: None  # the helper answers nothing"
    seen = _start(patch)
    assert seen["first"][0] is False  # a result object: computed in the app before its first frame
    assert seen["core_loaded_at_first_frame"]
    assert seen["first_rows"] and seen["later_rows"] == seen["first_rows"]


def test_a_helper_that_fails_after_the_outlines_leaves_the_first_results_to_the_app():
    patch = "prestart.first_outcome = lambda data: 1 / 0"
    seen = _start(patch)
    assert seen["first"][0] is False
    assert seen["first_rows"] and seen["later_rows"] == seen["first_rows"]


def test_the_helper_sends_every_checks_outline_and_the_session_checks_outcome(tmp_path):
    script = f"""
import json, sys
sys.path.insert(0, {str(ROOT)!r})
from tui import prestart
from tui.session import SessionData
data = SessionData({{"forced": {{"mass": "12 t"}}}}, "us", "forced")
helper = prestart.start(data)
outlines, first = helper.outlines(), helper.first()
from calc.checks import SPECS
from tui.compute import as_shown, evaluate_guarded
from tui.workspace import Workspace
workspace = Workspace(SPECS, data)
here = as_shown(evaluate_guarded(workspace.by_id["forced"], workspace.texts["forced"], "us"))
print(json.dumps([outlines == tuple(spec.outline() for spec in SPECS), first == here, first.check, first.system,
                  first.texts["mass"]]))
"""
    done = subprocess.run([sys.executable, "-c", script], capture_output=True, text=True, timeout=120, cwd=tmp_path)
    assert done.returncode == 0, done.stderr
    assert json.loads(done.stdout) == [True, True, "forced", "us", "12 t"]
