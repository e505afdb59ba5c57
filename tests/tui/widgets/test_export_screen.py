"""Writing a calc record (F9): one check, the session, asking before replacing, unwritable paths."""

from __future__ import annotations

import asyncio
import json
import math

import pytest
from helpers.pilot import go_to, keys_for, note_of, screen_text, settle, type_into
from helpers.specs import TWIN

from fieldmode.calc.checks import sdof
from fieldmode.tui.widgets.confirm_screen import ConfirmScreen
from fieldmode.tui.widgets.export_screen import ExportScreen

SIZE = (80, 24)


async def _export(app, pilot, path_text, session=False):
    await pilot.press("f9")
    await pilot.pause()
    assert isinstance(app.screen, ExportScreen)
    if session:
        await pilot.press("tab", "down", "enter")  # Enter picks the choice and moves on to the file name
    await pilot.press("home", "ctrl+k", *keys_for(path_text))
    await pilot.press("enter")
    await app.workers.wait_for_complete()
    await pilot.pause()






def test_record_of_one_check_written_and_read_back(make_app, tmp_path):
    async def scenario():
        app = make_app()
        async with app.run_test(size=SIZE) as pilot:
            view = await settle(app, pilot)
            await pilot.press("f9")
            await pilot.pause()
            default = app.screen.query_one("#record-path").value
            assert default.startswith("fieldmode-sdof-") and default.endswith(".md")
            await pilot.press("escape")
            await _export(app, pilot, "site-fan")
            assert len(app.screen_stack) == 1
            assert "Calc record written" in app.messages[-1]
            return view.outcome.result

    result = asyncio.run(scenario())
    work = tmp_path / "work"
    markdown = (work / "site-fan.md").read_text()
    record = json.loads((work / "site-fan.json").read_text())
    assert "fieldmode 0.1.0" in markdown and f"Caution: {sdof.SPEC.caution}" in markdown
    assert "| Mass (t) | 9.6 t | 9600 kg |" in markdown
    assert "Natural frequency" in markdown and "Chopra" in markdown
    assert record["version"] == "0.1.0" and len(record["checks"]) == 1
    check = record["checks"][0]
    assert check["caution"] == sdof.SPEC.caution
    assert check["inputs"]["mass"] == {"text": "9.6 t", "value": 9600.0, "unit": "kg"}
    # Source: Chopra, Dynamics of Structures, eq. 2.1.4: f_n = (1 / 2 pi) sqrt(k / m)
    assert check["results"]["natural_frequency"]["value"] == pytest.approx(math.sqrt(42e6 / 9600) / (2 * math.pi))
    assert check["results"]["natural_frequency"]["unit"] == "Hz"
    assert {k: v for k, v in check.items() if k != "title"} == result.to_dict() | {"check": "sdof"}


def test_record_of_the_whole_session_has_every_check(make_app, tmp_path):
    async def scenario():
        app = make_app(specs=(sdof.SPEC, TWIN))
        async with app.run_test(size=SIZE) as pilot:
            await settle(app, pilot)
            await go_to(app, pilot, "sdof-b")
            await type_into(app, pilot, "mass", "oops")
            await _export(app, pilot, "all.md", session=True)
            assert "Calc record written" in app.messages[-1]

    asyncio.run(scenario())
    record = json.loads((tmp_path / "work" / "all.json").read_text())
    assert [check["check"] for check in record["checks"]] == ["sdof", "sdof-b"]
    assert "mass" in record["checks"][1]["errors"]
    markdown = (tmp_path / "work" / "all.md").read_text()
    assert "## Second mass (sdof-b)" in markdown and "### Not computed" in markdown


def test_record_never_replaces_a_file_without_asking(make_app, tmp_path):
    existing = tmp_path / "work" / "minutes.md"
    existing.write_text("keep me")

    async def scenario():
        app = make_app()
        async with app.run_test(size=SIZE) as pilot:
            await settle(app, pilot)
            await _export(app, pilot, "minutes.md")
            assert isinstance(app.screen, ConfirmScreen)
            assert "minutes.md already exists" in screen_text(app)
            await pilot.press("n")
            await pilot.pause()
            assert isinstance(app.screen, ExportScreen)
            assert existing.read_text() == "keep me"
            await pilot.press("enter")
            await pilot.pause()
            await pilot.press("y")
            await pilot.pause()
            assert len(app.screen_stack) == 1

    asyncio.run(scenario())
    assert existing.read_text().startswith("# fieldmode calc record")


def test_record_to_an_unwritable_path_says_so_and_keeps_everything(make_app, tmp_path):
    async def scenario():
        app = make_app()
        async with app.run_test(size=SIZE) as pilot:
            await settle(app, pilot)
            await type_into(app, pilot, "mass", "8.8 t")
            await _export(app, pilot, "no-such-folder/rec.md")
            assert isinstance(app.screen, ExportScreen)
            problem = str(app.screen.query_one("#record-problem").content)
            assert "cannot write no-such-folder/rec" in problem and "No such file or directory" in problem
            assert app.screen.query_one("#record-path").value == "no-such-folder/rec.md"
            await pilot.press("escape")
            await pilot.pause()
            assert app.workspace.texts["sdof"]["mass"] == "8.8 t"
            assert app.current_view.row("mass").input.value == "8.8 t"

    asyncio.run(scenario())
    assert not (tmp_path / "work" / "no-such-folder").exists()


PROJECT = {"project": "Lowmoor mezzanine", "job": "J-104", "engineer": "A. Nother", "note": "bay 2, heel drops"}


async def _type_project(app, pilot):
    """From the file name (where F9 puts the focus), Shift+Tab to the project boxes and type each one."""
    await pilot.press("f9")
    await pilot.pause()
    assert app.focused is app.screen.query_one("#record-path")
    await pilot.press(*["shift+tab"] * 4)
    for text in PROJECT.values():
        await pilot.press("home", "ctrl+k", *keys_for(text), "tab")
    assert app.focused is app.screen.query_one("#record-path")
    await pilot.press("escape")
    await pilot.pause()


def test_project_fields_typed_once_head_every_record_and_survive_a_restart(make_app, tmp_path, state):
    async def first():
        app = make_app()
        async with app.run_test(size=SIZE) as pilot:
            await settle(app, pilot)
            await _type_project(app, pilot)
            assert app.workspace.project == PROJECT  # kept although the dialog was cancelled
            await _export(app, pilot, "first")
            await _export(app, pilot, "second")
            await pilot.press("f10")

    async def after_restart():
        app = make_app()
        async with app.run_test(size=SIZE) as pilot:
            await settle(app, pilot)
            await pilot.press("f9")
            await pilot.pause()
            shown = {name: app.screen.query_one(f"#project-{name}").value for name in PROJECT}
            assert shown == PROJECT
            await pilot.press("escape")
            await _export(app, pilot, "third")

    asyncio.run(first())
    asyncio.run(after_restart())
    saved = json.loads((state / "session.json").read_text())
    assert saved["project"] == PROJECT
    for name in ("second", "third"):
        markdown = (tmp_path / "work" / f"{name}.md").read_text()
        assert markdown.startswith("# fieldmode calc record\n\n- Project: Lowmoor mezzanine\n- Job number: J-104\n"
                                   "- Engineer: A. Nother\n- Note: bay 2, heel drops\n- Date: ")
        assert json.loads((tmp_path / "work" / f"{name}.json").read_text())["project"] == PROJECT


def test_project_boxes_are_marked_in_focus_without_colour(make_app):
    async def scenario():
        app = make_app(ascii_borders=True)
        async with app.run_test(size=SIZE) as pilot:
            await settle(app, pilot)
            await pilot.press("f9")
            await pilot.pause()
            text = screen_text(app)
            assert "> File (.md):" in text and "  Project:" in text and "(*) this check" in text
            await pilot.press("shift+tab", "shift+tab")
            await pilot.pause()
            text = screen_text(app)
            assert "> Engineer:" in text and "  File (.md):" in text
            await pilot.press("tab", "tab", "tab", "down")
            await pilot.pause()
            text = screen_text(app)
            assert "  (*) this check" in text and "> ( ) whole session" in text  # cursor and choice differ
            await pilot.press("enter")
            await pilot.pause()
            text = screen_text(app)
            assert "( ) this check" in text and "  (*) whole session" in text and "> File (.md):" in text
            dialog = text.splitlines()[1:15]
            assert all(line.isascii() for line in dialog), dialog  # no box, block or radio-dot characters

    asyncio.run(scenario())


def test_record_of_a_decay_names_the_file_as_typed_with_its_sha256(make_app, tmp_path):
    import hashlib

    from fieldmode.calc.demo import HEEL_DROP, demo_file

    folder = tmp_path / "work" / "bay 2"
    folder.mkdir()
    (folder / "drop.csv").write_bytes(demo_file(HEEL_DROP).read_bytes())
    content = (folder / "drop.csv").read_bytes()

    async def scenario():
        app = make_app()
        async with app.run_test(size=SIZE) as pilot:
            await settle(app, pilot)
            await go_to(app, pilot, "decay")
            await type_into(app, pilot, "file", "bay 2/drop.csv")
            await _export(app, pilot, "decay-bay2")
            assert "Calc record written" in app.messages[-1]

    asyncio.run(scenario())
    # Oracle: hashlib.sha256 of the file's bytes
    sha256 = hashlib.sha256(content).hexdigest()
    markdown = (tmp_path / "work" / "decay-bay2.md").read_text()
    assert f"| bay 2/drop.csv | {len(content)} | {sha256} |" in markdown
    record = json.loads((tmp_path / "work" / "decay-bay2.json").read_text())
    assert record["checks"][0]["files"] == [{"path": "bay 2/drop.csv", "bytes": len(content), "sha256": sha256}]


def test_record_of_the_demo_decay_says_the_short_name_not_the_install_path(make_app, tmp_path):
    from fieldmode.calc.demo import HEEL_DROP, demo_file

    async def scenario():
        app = make_app()
        async with app.run_test(size=SIZE) as pilot:
            view = await settle(app, pilot)
            view = await go_to(app, pilot, "decay")
            assert "shipped demo record" in note_of(view, "file")
            await _export(app, pilot, "demo-decay")

    asyncio.run(scenario())
    markdown = (tmp_path / "work" / "demo-decay.md").read_text()
    assert "| demo:heel_drop_demo.csv |" in markdown
    assert str(demo_file(HEEL_DROP).parent) not in markdown
    assert str(demo_file(HEEL_DROP).parent) not in (tmp_path / "work" / "demo-decay.json").read_text()


@pytest.mark.parametrize("name", [".", "..", "/", "~", "~/", "rec/", "./.."])
def test_names_that_are_folders_are_refused_in_the_dialog(make_app, tmp_path, monkeypatch, name):
    """'..' once wrote '...md' and '~' wrote '$HOME.md' one folder up: a record needs a file name."""
    home = tmp_path / "home" / "someone"
    home.mkdir(parents=True)
    monkeypatch.setenv("HOME", str(home))
    (tmp_path / "work" / "rec").mkdir(parents=True, exist_ok=True)

    async def scenario():
        app = make_app()
        async with app.run_test(size=SIZE) as pilot:
            await settle(app, pilot)
            await _export(app, pilot, name)
            assert isinstance(app.screen, ExportScreen)
            problem = str(app.screen.query_one("#record-problem").content)
            assert "is a folder: give a file name" in problem
            assert app.screen.query_one("#record-path").value == name

    asyncio.run(scenario())
    written = [path for path in tmp_path.rglob("*.md")] + [path for path in tmp_path.rglob("*.json")
                                                            if "state" not in path.parts]
    assert written == []


def test_enter_on_the_scope_picks_it_and_moves_on_to_the_file_name(make_app, tmp_path):
    async def scenario():
        app = make_app()
        async with app.run_test(size=SIZE) as pilot:
            await settle(app, pilot)
            await pilot.press("f9")
            await pilot.pause()
            await pilot.press("tab", "down", "enter")
            await pilot.pause()
            assert app.screen.focused is not None and app.screen.focused.id == "record-path"
            assert app.screen.scope == "session"
            await pilot.press("home", "ctrl+k", *keys_for(str(tmp_path / "walk")))
            await pilot.press("enter")
            await app.workers.wait_for_complete()
            await pilot.pause()
            assert not isinstance(app.screen, ExportScreen)
            record = json.loads((tmp_path / "walk.json").read_text())
            assert len(record["checks"]) > 1  # the whole session, not one check

    asyncio.run(scenario())


def test_a_typed_file_name_survives_changing_the_scope_both_ways(make_app, tmp_path):
    async def scenario():
        app = make_app()
        async with app.run_test(size=SIZE) as pilot:
            await settle(app, pilot)
            await pilot.press("f9")
            await pilot.pause()
            await pilot.press("home", "ctrl+k", *keys_for("site-walk"))
            await pilot.press("tab", "down", "enter", "tab", "up", "enter")
            await pilot.pause()
            assert app.screen.scope == "check"
            assert app.screen.query_one("#record-path").value == "site-walk"

    asyncio.run(scenario())
