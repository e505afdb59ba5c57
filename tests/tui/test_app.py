"""The app by keys alone: units, borders, sending, shared fields, the session kept through quits and faults."""

from __future__ import annotations

import asyncio
import math
import os
import signal
import subprocess
import sys
import time

import pytest
from helpers.pilot import focus_field, go_to, keys_for, note_of, screen_text, settle, type_into
from helpers.specs import TWIN
from textual import events

from fieldmode.calc.checks import sdof
from fieldmode.tui.app import ascii_terminal
from fieldmode.tui.present import field_text, value_text
from fieldmode.tui.session import parse_session
from fieldmode.tui.session_lock import SessionLock
from fieldmode.tui.widgets.owner_screen import OwnerScreen
from fieldmode.tui.widgets.quit_screen import QuitScreen
from fieldmode.tui.widgets.send_screen import SendScreen

SIZE = (80, 24)








def test_units_key_switches_results_between_si_and_us(make_app):
    async def scenario():
        app = make_app()
        async with app.run_test(size=SIZE) as pilot:
            await settle(app, pilot)
            assert "kN/mm" in screen_text(app) and "units SI" in screen_text(app)
            await pilot.press("f5")
            view = await settle(app, pilot)
            shown = screen_text(app)
            assert "units US" in shown and "kip/in" in shown and "lb" in shown
            # Source: NIST SP 811 B.8: 1 lbf = 4.4482216152605 N, 1 in = 0.0254 m
            kip_per_in = 42e6 * 0.0254 / 4448.2216152605
            assert value_text(view.outcome.result.values["stiffness"], "us") == f"{kip_per_in:.1f} kip/in"
            await pilot.press("f5")
            await settle(app, pilot)
            assert "units SI" in screen_text(app)

    asyncio.run(scenario())


def test_ascii_borders_draw_no_box_characters(make_app):
    async def scenario():
        app = make_app(ascii_borders=True)
        async with app.run_test(size=SIZE) as pilot:
            await settle(app, pilot)
            for key in ("f6", "f1"):
                await pilot.press(key)
                await pilot.pause()
                drawn = screen_text(app)
                assert not any("\u2500" <= char <= "\u257f" for char in drawn), drawn

    asyncio.run(scenario())


def test_stiffness_sent_to_another_check_replaces_its_alternative(make_app):
    async def scenario():
        app = make_app(specs=(sdof.SPEC, TWIN))
        async with app.run_test(size=SIZE) as pilot:
            await settle(app, pilot)
            await type_into(app, pilot, "stiffness", "")
            await type_into(app, pilot, "static_deflection", "2 mm")
            await go_to(app, pilot, "sdof-b")
            await type_into(app, pilot, "stiffness", "12.5 kN/mm")
            await pilot.press("f8")
            await pilot.pause()
            assert isinstance(app.screen, SendScreen)
            assert "(empties static deflection)" in screen_text(app)
            await pilot.press("enter")
            await pilot.pause()
            assert "Stiffness = 12.5 kN/mm to sdof" in app.messages[-1]
            await pilot.press("f2")
            view = await settle(app, pilot)
            assert view.row("stiffness").input.value == "12.5 kN/mm"
            assert view.row("static_deflection").input.value == ""
            assert view.row("stiffness").display and not view.row("static_deflection").display  # the row shows it
            assert view.outcome.errors == {}
            # Source: Chopra, Dynamics of Structures, eq. 2.1.4: f_n = (1 / 2 pi) sqrt(k / m)
            expected = math.sqrt(12.5e6 / 9600) / (2 * math.pi)
            assert view.outcome.result.values["natural_frequency"].magnitude == pytest.approx(expected)

    asyncio.run(scenario())


def test_after_a_decay_f8_sends_only_what_means_the_same(make_app):
    async def scenario():
        app = make_app()
        async with app.run_test(size=SIZE) as pilot:
            view = await go_to(app, pilot, "decay")
            result = view.outcome.result
            before = {check: dict(texts) for check, texts in app.workspace.texts.items()}
            await pilot.press("f8")
            await pilot.pause()
            dialog = app.screen
            assert isinstance(dialog, SendScreen)
            shown = screen_text(app)
            assert "damping ratio of the building" in shown  # said, not sent
            damping = next(i for i, t in enumerate(dialog.targets) if t.label == "Damping ratio")
            for _ in range(damping):
                await pilot.press("down")
            await pilot.press("space")  # untick the structure's damping into sdof and forced
            assert "[ ] sdof, forced: Damping ratio" in screen_text(app)
            await pilot.press("enter")
            await pilot.pause()
            texts = app.workspace.texts
            frequency = field_text(result.number("natural_frequency"), "frequency", "si")
            assert texts["tmd"]["frequency"] == texts["footfall"]["frequency"] == frequency
            assert texts["tmd"]["damping"] == field_text(result.number("damping_ratio"), "ratio", "si")
            assert texts["sdof"]["damping"] == before["sdof"]["damping"]  # unticked: unchanged
            for check, name in (("forced", "frequency"), ("isolate", "frequency"), ("isolate", "damping"),
                                ("design-spectrum", "damping"), ("spectrum", "damping"), ("storeys", "damping")):
                assert texts[check][name] == before[check][name], (check, name)
            target = await go_to(app, pilot, "tmd")
            assert target.outcome.result.inputs["frequency"].value == pytest.approx(
                result.number("natural_frequency"), rel=1e-5)

    asyncio.run(scenario())


def test_from_member_f8_does_not_offer_the_mounts(make_app):
    async def scenario():
        app = make_app()
        async with app.run_test(size=SIZE) as pilot:
            await go_to(app, pilot, "member")
            await pilot.press("f8")
            await pilot.pause()
            assert isinstance(app.screen, SendScreen)
            reached = {check for target in app.screen.targets for check in target.checks}
            assert "isolate" not in reached and {"sdof", "forced"} <= reached
            await pilot.press("escape")
            await pilot.pause()
            assert app.messages[-1] == "Nothing sent."

    asyncio.run(scenario())


def test_shared_mass_follows_until_a_check_has_its_own(make_app):
    async def scenario():
        app = make_app(specs=(sdof.SPEC, TWIN))
        async with app.run_test(size=SIZE) as pilot:
            await settle(app, pilot)
            await type_into(app, pilot, "mass", "11 t")
            assert "same as in sdof-b" in note_of(app.current_view, "mass")
            view = await go_to(app, pilot, "sdof-b")
            assert view.row("mass").input.value == "11 t"
            await focus_field(app, pilot, "mass")
            await pilot.press("ctrl+o")
            await type_into(app, pilot, "mass", "4 t")
            assert "its own value here" in note_of(app.current_view, "mass")
            await pilot.press("f2")
            await type_into(app, pilot, "mass", "12 t")
            view = await go_to(app, pilot, "sdof-b")
            assert view.row("mass").input.value == "4 t"
            assert view.row("damping").input.value == "2 %"
            await type_into(app, pilot, "damping", "3 %")
            await pilot.press("f2")
            view = await settle(app, pilot)
            assert view.row("damping").input.value == "3 %"

    asyncio.run(scenario())


def test_session_restored_after_quit(make_app, state):
    async def first():
        app = make_app(specs=(sdof.SPEC, TWIN))
        async with app.run_test(size=SIZE) as pilot:
            await settle(app, pilot)
            await go_to(app, pilot, "sdof-b")
            await type_into(app, pilot, "stiffness", "7.25 kN/mm")
            await pilot.press("f5")
            await settle(app, pilot)
            await pilot.press("f10")
        assert app.return_value == 0

    async def second():
        app = make_app(specs=(sdof.SPEC, TWIN))
        async with app.run_test(size=SIZE) as pilot:
            view = await settle(app, pilot)
            assert view.spec.id == "sdof-b"
            assert view.row("stiffness").input.value == "7.25 kN/mm"
            assert app.workspace.system == "us"
            assert "kip/in" in screen_text(app)

    asyncio.run(first())
    saved = parse_session((state / "session.json").read_text())
    assert saved.texts["sdof-b"]["stiffness"] == "7.25 kN/mm" and saved.current == "sdof-b"
    asyncio.run(second())


@pytest.mark.parametrize("signum", [signal.SIGHUP, signal.SIGTERM], ids=["SIGHUP", "SIGTERM"])
def test_hangup_or_terminate_saves_and_exits_cleanly(make_app, state, signum):
    async def scenario():
        app = make_app()
        async with app.run_test(size=SIZE) as pilot:
            await settle(app, pilot)
            await pilot.press("home", "ctrl+k", "5", "space", "t")
            os.kill(os.getpid(), signum)
            for _ in range(100):
                if not app.is_running:
                    break
                await asyncio.sleep(0.01)
        return app

    app = asyncio.run(scenario())
    assert app.return_value == 0
    assert parse_session((state / "session.json").read_text()).shared["structure: mass"] == "5 t"


@pytest.mark.parametrize("content", [b"{not json", b'{"format": "other"}', b"\xff\xfe\x00binary",
                                     b'{"format": "fieldmode-session", "checks": {"sdof": {"mass": 3}}}'],
                         ids=["broken", "foreign", "binary", "wrong-types"])
def test_corrupt_session_is_moved_aside_and_the_demo_opens(make_app, state, content):
    state.mkdir()
    (state / "session.json").write_bytes(content)

    async def scenario():
        app = make_app()
        async with app.run_test(size=SIZE, notifications=True) as pilot:
            view = await settle(app, pilot)
            assert app.workspace.texts["sdof"] == sdof.SPEC.demo_texts()
            assert view.outcome.result is not None
            assert any("could not be read" in message and "moved to" in message for message in app.messages)
            assert "could not be read" in " ".join(screen_text(app).split())

    asyncio.run(scenario())
    aside = list(state.glob("session.json.unreadable-*"))
    assert len(aside) == 1 and aside[0].read_bytes() == content


def test_session_that_is_a_folder_is_moved_aside(make_app, state):
    (state / "session.json").mkdir(parents=True)

    async def scenario():
        app = make_app()
        async with app.run_test(size=SIZE) as pilot:
            await settle(app, pilot)
            assert any("could not be read" in message for message in app.messages)

    asyncio.run(scenario())
    assert list(state.glob("session.json.unreadable-*"))[0].is_dir()


@pytest.mark.parametrize("kind", ["blocked-by-a-file", "chmod-555"])
def test_read_only_state_folder_warns_and_the_app_still_works(make_app, tmp_path, kind):
    if kind == "chmod-555":
        if os.geteuid() == 0:
            pytest.skip("root ignores permissions")
        folder = tmp_path / "locked"
        folder.mkdir()
        folder.chmod(0o555)
    else:
        blocker = tmp_path / "blocker"
        blocker.write_text("a file where the state folder should be")
        folder = blocker / "fieldmode"

    async def scenario():
        app = make_app(state_folder=folder)
        async with app.run_test(size=SIZE) as pilot:
            await settle(app, pilot)
            assert any("will not be saved" in message for message in app.messages)
            view = await type_into(app, pilot, "mass", "20 t")
            assert view.outcome.result is not None
            assert "NOT SAVED" in screen_text(app)
            assert any(message.startswith("Session not saved: cannot write") for message in app.messages)
            # Common practice (no source): quitting never throws away inputs without asking
            await pilot.press("f10")
            await pilot.pause()
            assert isinstance(app.screen, QuitScreen) and app.is_running
            await pilot.press("escape")  # stay
            await pilot.pause()
            assert app.is_running and not isinstance(app.screen, QuitScreen)
            await pilot.press("f10")
            await pilot.pause()
            await pilot.press("home", "ctrl+k", *keys_for(str(tmp_path / "kept.json")), "enter")
            await pilot.pause()
        kept = parse_session((tmp_path / "kept.json").read_text())
        assert kept.shared["structure: mass"] == "20 t"
        assert app.return_code == 0

    asyncio.run(scenario())
    if kind == "chmod-555":
        folder.chmod(0o755)


def test_a_second_window_on_one_session_asks_and_never_overwrites_the_first(make_app, state, tmp_path):
    with subprocess.Popen([sys.executable, "-c", "import time; time.sleep(60)"]) as first:
        try:
            holder = SessionLock(state)
            holder.pid = first.pid
            holder.take()

            async def read_only():
                app = make_app()
                async with app.run_test(size=SIZE) as pilot:
                    await pilot.pause()
                    assert isinstance(app.screen, OwnerScreen) and str(first.pid) in screen_text(app)
                    await pilot.press("r")
                    await settle(app, pilot)
                    await type_into(app, pilot, "mass", "33 t")
                    assert "READ-ONLY" in screen_text(app)
                    assert not (state / "session.json").exists()  # the first window's session is untouched
                    await pilot.press("f10")
                    await pilot.pause()
                    assert isinstance(app.screen, QuitScreen)  # typed here, not saved: asked
                    await pilot.press("f10")  # quit without saving, deliberately
                    await pilot.pause()
                assert not (state / "session.json").exists()

            async def take_over():
                app = make_app()
                async with app.run_test(size=SIZE) as pilot:
                    await pilot.pause()
                    await pilot.press("t")
                    await settle(app, pilot)
                    await type_into(app, pilot, "mass", "34 t")
                    await app.workers.wait_for_complete()
                    assert not holder.held()  # the first window stops saving
                    await pilot.press("f10")
                    await pilot.pause()
                assert parse_session((state / "session.json").read_text()).shared["structure: mass"] == "34 t"

            asyncio.run(read_only())
            asyncio.run(take_over())
        finally:
            first.kill()


def test_a_fault_in_the_app_saves_the_session_and_exits_with_status_1(make_app, state):
    async def scenario():
        app = make_app()

        def broken() -> None:
            raise RuntimeError("a bug")

        app.action_keys = broken  # F1 now raises, as a bug in an action would
        async with app.run_test(size=SIZE) as pilot:
            await settle(app, pilot)
            await type_into(app, pilot, "mass", "13 t")
            await pilot.press("f1")
            await pilot.pause()
        return app

    app = asyncio.run(scenario())
    assert app.return_code == 1  # Common practice (no source): a fault ends with a non-zero status
    saved = parse_session((state / "session.json").read_text())
    assert saved.shared["structure: mass"] == "13 t"
    reports = list(state.glob("fault-*.txt"))
    assert reports and "RuntimeError: a bug" in reports[0].read_text()


@pytest.mark.parametrize(("environ", "ascii_drawn"), [
    ({"TERM": "xterm-256color", "LANG": "en_GB.UTF-8"}, False),
    ({"TERM": "xterm-256color", "LANG": "C.utf8"}, False),
    ({"TERM": "linux", "LANG": "en_GB.UTF-8"}, True),
    ({"TERM": "dumb", "LANG": "en_GB.UTF-8"}, True),
    ({"TERM": "xterm", "LANG": "C"}, True),
    ({"TERM": "xterm", "LC_ALL": "POSIX", "LANG": "en_GB.UTF-8"}, True),
    ({"TERM": "xterm", "LANG": "en_GB.UTF-8", "FIELDMODE_ASCII": "1"}, True),
])
def test_ascii_drawing_where_the_terminal_needs_it(environ, ascii_drawn):
    # Common practice (no source): consoles without UTF-8 or box characters get plain ASCII
    assert ascii_terminal(environ) is ascii_drawn


def test_a_narrow_terminal_keeps_room_for_the_results(make_app):
    async def scenario():
        app = make_app()
        async with app.run_test(size=(40, 12)) as pilot:
            view = await settle(app, pilot)
            assert view.query_one(".results-box").size.width >= 15
            assert "10.53 Hz" in screen_text(app)

    asyncio.run(scenario())


def test_a_burst_of_every_key_with_a_slow_computation_leaves_the_app_running(make_app, monkeypatch):
    from fieldmode.tui import evaluation

    original = evaluation.evaluate_guarded

    def slow(*args, **kwargs):  # a busy machine: every computation takes a while
        time.sleep(0.15)
        return original(*args, **kwargs)

    monkeypatch.setattr(evaluation, "evaluate_guarded", slow)
    keys = ["f6", "f6", "f1", "escape", "f6", "f3", "f6", "f1", "f4", "escape", "f7", "escape", "f8", "escape",
            "f9", "escape", "f2", "f6", "pagedown", "pageup", "f5", "f6", "f1", "f1", "f3", "f3", "f6", "escape"]

    async def scenario():
        app = make_app()
        async with app.run_test(size=SIZE) as pilot:
            await pilot.pause()
            for key in keys:  # all at once, as keys arrive together over a slow link
                app.post_message(events.Key(key, None))
            for _ in range(100):
                await pilot.pause(0.05)
            await app.workers.wait_for_complete()
            await pilot.pause()
            assert app.is_running and app.return_code is None
            while len(app.screen_stack) > 1:
                await pilot.press("escape")
            view = await settle(app, pilot)
            assert view.outcome is not None
        assert app.return_code in (0, None)

    asyncio.run(scenario())


def test_every_line_of_a_send_can_be_unticked_at_once(make_app):
    async def scenario():
        app = make_app()
        async with app.run_test(size=SIZE) as pilot:
            await go_to(app, pilot, "decay")
            before = {check: dict(texts) for check, texts in app.workspace.texts.items()}
            await pilot.press("f8")
            await pilot.pause()
            await pilot.press("n")
            assert "[x]" not in screen_text(app)
            await pilot.press("down", "space", "enter")  # only the second line
            await pilot.pause()
            sent = app.screen_stack[0] and [c for c, t in app.workspace.texts.items() if t != before[c]]
            assert len(app.messages) and app.messages[-1].startswith("Sent ") and app.messages[-1].count(" = ") == 1
            assert sent

    asyncio.run(scenario())
