"""The session file: atomic writes, restore, and what happens to a bad file."""

from __future__ import annotations

import errno
import json
import os
from pathlib import Path

import pytest

from fieldmode.tui.files import write_atomic
from fieldmode.tui.session import SessionData, SessionStore, parse_session, state_dir


def test_state_dir_follows_xdg_state_home(tmp_path):
    assert state_dir({"XDG_STATE_HOME": str(tmp_path)}) == tmp_path / "fieldmode"
    assert state_dir({}).parts[-3:] == (".local", "state", "fieldmode")
    assert state_dir({"XDG_STATE_HOME": "relative/path"}).parts[-3:] == (".local", "state", "fieldmode")


def test_save_then_load_round_trip(tmp_path):
    store = SessionStore(tmp_path / "state")
    data = SessionData({"sdof": {"mass": "9.6 t", "damping": ""}}, "us", "sdof", {"sdof": ["damping"]},
                       alternatives={"sdof": {"stiffness": "static_deflection"}})
    assert store.save(data) == ""
    loaded = store.load()
    assert loaded.messages == [] and loaded.data == data
    raw = json.loads(store.path.read_text())
    assert raw["format"] == "fieldmode-session" and raw["version"] == 2
    assert [p.name for p in store.folder.iterdir()] == ["session.json"]  # no temporary file left


def test_older_snapshot_never_replaces_a_newer_one(tmp_path):
    store = SessionStore(tmp_path)
    assert store.save(SessionData({"sdof": {"mass": "2 t"}}), sequence=2) == ""
    store.save(SessionData({"sdof": {"mass": "1 t"}}), sequence=1)
    assert store.load().data.texts["sdof"]["mass"] == "2 t"


def test_atomic_write_leaves_the_old_file_when_it_fails(tmp_path, monkeypatch):
    target = tmp_path / "session.json"
    target.write_text("old")

    def broken_replace(source, destination):
        raise OSError(28, "No space left on device")

    monkeypatch.setattr(os, "replace", broken_replace)
    with pytest.raises(OSError):
        write_atomic(target, "new")
    assert target.read_text() == "old"
    assert [p.name for p in tmp_path.iterdir()] == ["session.json"]


@pytest.mark.parametrize("text", ["", "[]", "{", '{"format": "fieldmode-session", "checks": []}',
                                  '{"format": "fieldmode-session", "checks": {"a": {"b": 1}}}',
                                  '{"format": "fieldmode-session", "checks": {}, "own": {"a": "b"}}',
                                  '{"format": "fieldmode-session", "checks": {}, "alternatives": {"a": ["b"]}}',
                                  '{"format": "fieldmode-session", "checks": {}, "alternatives": {"a": {"b": 1}}}'])
def test_parse_refuses_what_is_not_a_session(text):
    with pytest.raises(ValueError):
        parse_session(text)


def test_an_unwritable_folder_is_named_not_the_probe_file(tmp_path, monkeypatch):
    folder = tmp_path / "fieldmode"
    folder.mkdir()

    def refuse(dir):  # a read-only file system refuses the probe's temporary file, naming it
        raise OSError(errno.EROFS, "Read-only file system", str(Path(dir) / "tmpk4xelf83"))

    monkeypatch.setattr("fieldmode.tui.session.tempfile.TemporaryFile", refuse)
    message = SessionStore(folder).probe()[0]
    assert f"cannot write in {folder}" in message and "Read-only file system" in message
    assert "tmpk4xelf83" not in message


def test_unknown_system_falls_back_to_si():
    data = parse_session('{"format": "fieldmode-session", "checks": {}, "system": "imperial", "current": 3}')
    assert data.system == "si" and data.current == ""


def test_unwritable_folder_is_reported_not_raised(tmp_path):
    blocker = tmp_path / "file"
    blocker.write_text("x")
    store = SessionStore(blocker / "fieldmode")
    assert "will not be saved" in store.probe()[0]
    problem = store.save(SessionData({}))
    assert problem.startswith("Session not saved: cannot write") and "Not a directory" in problem


@pytest.mark.parametrize("content", [
    "[" * 100_000 + "]" * 100_000,
    '{"format": "fieldmode-session", "checks": {"sdof": {"mass": "' + "9" * 100_000 + '"}}}',
    '{"format": "fieldmode-session", "checks": {}, "shared": {"structure: mass": ["9.6 t"]}}',
    '{"format": "fieldmode-session", "checks": {}, "project": {"project": {"deep": "x"}}}',
])
def test_a_session_of_any_damaged_shape_is_moved_aside(tmp_path, content):
    # Common practice (no source): a damaged settings file must never stop the program from opening
    store = SessionStore(tmp_path)
    (tmp_path / "session.json").write_text(content)
    loaded = store.load()
    assert loaded.data is None and "moved to" in loaded.messages[0]
    assert not (tmp_path / "session.json").exists()
    assert any(path.name.startswith("session.json.unreadable-") for path in tmp_path.iterdir())


def test_a_record_of_two_files_is_written_whole_or_not_at_all(tmp_path, monkeypatch):
    from fieldmode.tui.files import write_all_atomic

    md, js = tmp_path / "r.md", tmp_path / "r.json"
    md.write_text("old md")
    js.write_text("old json")
    real_replace = os.replace

    def failing(source, target):
        if str(target).endswith(".json"):
            raise OSError(28, "No space left on device")
        return real_replace(source, target)

    monkeypatch.setattr(os, "replace", failing)
    with pytest.raises(OSError) as caught:
        write_all_atomic({md: "new md", js: "new json"})
    monkeypatch.setattr(os, "replace", real_replace)
    # Common practice (no source): a record of several files is all new or all old, never half of each
    assert md.read_text() == "old md" and js.read_text() == "old json"
    assert caught.value.filename == str(js)
    assert sorted(p.name for p in tmp_path.iterdir()) == ["r.json", "r.md"]


def test_a_replaced_file_keeps_its_permissions_and_a_new_one_follows_the_umask(tmp_path):
    from fieldmode.tui.files import UMASK

    kept = tmp_path / "kept.md"
    kept.write_text("old")
    kept.chmod(0o640)
    write_atomic(kept, "new")
    assert (kept.stat().st_mode & 0o777) == 0o640 and kept.read_text() == "new"
    fresh = tmp_path / "fresh.md"
    write_atomic(fresh, "new")
    assert (fresh.stat().st_mode & 0o777) == 0o666 & ~UMASK
