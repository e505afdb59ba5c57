"""One session, one writer: the lock naming the app that saves a session."""

from __future__ import annotations

import json
import os
import subprocess
import sys
from pathlib import Path

from fieldmode.tui.session import SessionData, SessionStore
from fieldmode.tui.session_lock import SessionLock


def _other(folder: Path, pid: int) -> SessionLock:
    lock = SessionLock(folder)
    lock.pid = pid
    return lock


def test_a_free_session_is_claimed_and_released(tmp_path: Path) -> None:
    lock = SessionLock(tmp_path)
    assert lock.claim() is None and lock.held()
    assert json.loads(lock.path.read_text())["pid"] == os.getpid()
    lock.release()
    assert not lock.path.exists()


def test_a_live_holder_is_named_and_keeps_the_session(tmp_path: Path) -> None:
    with subprocess.Popen([sys.executable, "-c", "import time; time.sleep(30)"]) as sleeper:
        try:
            _other(tmp_path, sleeper.pid).take()
            mine = SessionLock(tmp_path)
            assert mine.claim() == sleeper.pid and not mine.held()
            store = SessionStore(tmp_path)
            # Common practice (no source): two writers of one file overwrite each other; the second does not write
            assert "another fieldmode window" in store.save(SessionData({}))
            assert not (tmp_path / "session.json").exists()
            mine.take()  # taken over deliberately: now this process saves, the other does not
            assert mine.held() and not _other(tmp_path, sleeper.pid).held()
            assert store.save(SessionData({})) == ""
        finally:
            sleeper.kill()


def test_the_lock_of_a_process_that_is_gone_is_stale(tmp_path: Path) -> None:
    done = subprocess.run([sys.executable, "-c", "import os; print(os.getpid())"], capture_output=True, text=True)
    _other(tmp_path, int(done.stdout)).take()  # that process has ended
    mine = SessionLock(tmp_path)
    assert mine.claim() is None and mine.held()


def test_a_damaged_lock_is_no_lock(tmp_path: Path) -> None:
    (tmp_path / "session.lock").write_text("{not json")
    assert SessionLock(tmp_path).claim() is None
