"""The real program in an 80x24 pseudo-terminal: type, lose the line (SIGHUP), come back."""

from __future__ import annotations

import json
import os
import signal
import sys
import time
from pathlib import Path

import pexpect
import pyte
import pytest

pytestmark = pytest.mark.e2e

FIELDMODE = Path(sys.executable).parent / "fieldmode"
HOME, CLEAR_TO_END = "\x1b[H", "\x0b"  # xterm Home; ctrl+k clears to the end of the field


class Terminal:
    """A pexpect child drawn on a pyte screen."""

    def __init__(self, state: Path, extra_env: dict[str, str] | None = None) -> None:
        env = {k: v for k, v in os.environ.items() if not k.startswith(("TEXTUAL", "NO_COLOR"))}
        env = {k: v for k, v in env.items() if k not in ("LC_ALL", "LC_CTYPE")}
        env.update({"XDG_STATE_HOME": str(state), "TERM": "xterm-256color", "LANG": "C.UTF-8", "COLUMNS": "80",
                    "LINES": "24"})
        env.update(extra_env or {})
        self.screen = pyte.Screen(80, 24)
        self.stream = pyte.ByteStream(self.screen)
        self.child = pexpect.spawn(str(FIELDMODE), env=env, dimensions=(24, 80), cwd=str(state.parent))

    def text(self) -> str:
        return "\n".join(self.screen.display)

    def pump(self, wait: float = 0.05) -> None:
        try:
            while True:
                self.stream.feed(self.child.read_nonblocking(65536, timeout=wait))
                wait = 0.01
        except (pexpect.TIMEOUT, pexpect.EOF):
            pass

    def wait_for(self, wanted: str, timeout: float = 20.0) -> str:
        deadline = time.monotonic() + timeout
        while time.monotonic() < deadline:
            self.pump()
            if wanted in self.text():
                return self.text()
            if not self.child.isalive():
                self.pump()
                break
        raise AssertionError(f"{wanted!r} never appeared; screen was:\n{self.text()}")

    def keys(self, *parts: str) -> None:
        """Send each part as its own write, as a person's keystrokes arrive."""
        for part in parts:
            self.child.send(part)
            self.pump(0.05)

    def finish(self, timeout: float = 10.0) -> int:
        deadline = time.monotonic() + timeout
        while self.child.isalive() and time.monotonic() < deadline:
            self.pump()
        self.pump()
        self.child.close()
        return self.child.exitstatus if self.child.exitstatus is not None else -(self.child.signalstatus or 0)


@pytest.fixture
def state(tmp_path: Path) -> Path:
    folder = tmp_path / "state"
    folder.mkdir()
    return folder


@pytest.mark.skipif(not FIELDMODE.exists(), reason="the console script is not installed")
def test_typed_value_survives_a_hangup_and_comes_back(state):
    first = Terminal(state)
    first.wait_for("Natural frequency")
    assert "Caution: " in first.text() and "F10 quit" in first.text()
    first.keys(HOME, CLEAR_TO_END + "7.5 kg" + "\x7f\x7f" + "t")  # a burst, as over a slow link
    first.wait_for("= 7.500 t")
    first.child.kill(signal.SIGHUP)
    status = first.finish()
    assert "Traceback" not in first.text()
    assert status == 0
    saved = json.loads((state / "fieldmode" / "session.json").read_text())
    assert saved["shared"]["structure: mass"] == "7.5 t"  # the structure's mass, kept once for sdof and forced

    second = Terminal(state)
    shown = second.wait_for("= 7.500 t")
    assert "7.5 t" in shown and "Traceback" not in shown
    second.keys("\x1b[21~")  # F10 quits
    assert second.finish() == 0
    assert "Traceback" not in second.text()


@pytest.mark.skipif(not FIELDMODE.exists(), reason="the console script is not installed")
def test_bad_input_on_a_plain_console_without_colour(state):
    term = Terminal(state, {"NO_COLOR": "1", "TERM": "linux"})
    term.wait_for("Natural frequency")
    term.keys(HOME, CLEAR_TO_END, *"12 parsecs")
    shown = term.wait_for("! ")
    assert "No result" in shown and "Traceback" not in shown
    term.keys("\x1b[21~")
    assert term.finish() == 0


@pytest.mark.skipif(not FIELDMODE.exists(), reason="the console script is not installed")
def test_two_windows_on_one_session_never_overwrite_each_other(tmp_path: Path) -> None:
    state = tmp_path / "state"
    first = Terminal(state)
    try:
        first.wait_for("Natural frequency")
        second = Terminal(state)
        try:
            second.wait_for("open in another fieldmode window")
            second.keys("t")  # take over: the first window stops saving
            second.wait_for("Natural frequency")
            first.keys(HOME, CLEAR_TO_END, "3", "1", " ", "t")
            first.wait_for("NOT SAVED")
            second.keys(HOME, CLEAR_TO_END, "2", "2", " ", "t")
            time.sleep(1.0)
            second.keys("\x1b[21~")  # F10: save and quit
            second.child.expect(pexpect.EOF, timeout=20)
        finally:
            second.child.terminate(force=True)
        saved = json.loads((state / "fieldmode" / "session.json").read_text())
        assert saved["shared"]["structure: mass"] == "22 t"  # the window that took over, not the other
    finally:
        first.child.terminate(force=True)
