"""One session, one writer: a lock file naming the app process that saves the session.

``session.lock`` beside the session file holds the process id and host of the app that saves it.
A second app on the same state folder finds it and asks its person to open read-only or to take
over; a lock whose process is gone (the app was killed) is stale and taken without asking. An app
whose lock was taken over stops saving and says so, so neither window silently overwrites the other.
"""

from __future__ import annotations

import contextlib
import json
import os
import socket
from pathlib import Path

from fieldmode.tui.files import write_atomic


class SessionLock:
    """The lock of one state folder, seen from this process."""

    def __init__(self, folder: Path) -> None:
        self.path = folder / "session.lock"
        self.pid = os.getpid()
        self.host = socket.gethostname()

    def holder(self) -> int | None:
        """Process id of another live app holding the lock, or None (free, stale, or ours)."""
        pid, host = self._read()
        if pid is None or pid == self.pid or host != self.host:
            return None if pid is None or pid == self.pid else pid
        try:
            os.kill(pid, 0)
        except ProcessLookupError:
            return None  # the app that held it is gone: stale
        except PermissionError:
            return pid  # alive, another person's process
        return pid

    def claim(self) -> int | None:
        """Take the lock unless another live app holds it; return that app's process id, or None when ours."""
        other = self.holder()
        if other is None:
            self.take()
        return other

    def take(self) -> None:
        """Make this process the session's writer (the other app, if any, stops saving)."""
        with contextlib.suppress(OSError):  # an unwritable folder is reported by the session store
            self.path.parent.mkdir(parents=True, exist_ok=True)
            write_atomic(self.path, json.dumps({"pid": self.pid, "host": self.host}))

    def held(self) -> bool:
        """True when this process is the session's writer (or nobody can be: the folder has no lock)."""
        pid, _ = self._read()
        return pid is None or pid == self.pid

    def release(self) -> None:
        """Give the lock up, if it is ours."""
        if self._read()[0] == self.pid:
            with contextlib.suppress(OSError):
                self.path.unlink()

    def _read(self) -> tuple[int | None, str]:
        try:
            data = json.loads(self.path.read_text(encoding="utf-8"))
            return int(data["pid"]), str(data.get("host", ""))
        except (OSError, ValueError, KeyError, TypeError):
            return None, ""
