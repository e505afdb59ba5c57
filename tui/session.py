"""The session file: every check's inputs as typed, the unit system and the current check.

Stored as JSON at ``$XDG_STATE_HOME/fieldmode/session.json`` (default
``~/.local/state/fieldmode/session.json``), written atomically. A file that cannot be
read or understood is moved aside with a timestamp and the demo opens instead.
"""

from __future__ import annotations

import json
import os
import tempfile
import threading
import time
from collections.abc import Mapping
from dataclasses import dataclass, field
from pathlib import Path
from typing import Any

from fieldmode.tui.files import describe_os_error, write_atomic
from fieldmode.tui.session_lock import SessionLock

FORMAT = "fieldmode-session"
VERSION = 2
"""Version 2 keeps each shared value once ("shared", by meaning) and the project fields; version 1
files (every text per check) are read too."""
PROJECT_FIELDS = ("project", "job", "engineer", "note")
"""What the calc record says about the work, typed once per session."""
MAX_SESSION_BYTES = 2_000_000
"""A session file larger than this is not read (it cannot be one we wrote)."""
MAX_TEXT = 4096
"""Longest text of one field in a session file (a field takes no more)."""


def state_dir(environ: Mapping[str, str] | None = None) -> Path:
    """The folder of the session file, from XDG_STATE_HOME or ~/.local/state."""
    env = os.environ if environ is None else environ
    base = env.get("XDG_STATE_HOME") or ""
    root = Path(base) if base and Path(base).is_absolute() else Path.home() / ".local" / "state"
    return root / "fieldmode"


@dataclass
class SessionData:
    """What the session file holds."""

    texts: dict[str, dict[str, str]]
    """Check id -> field name -> text as typed."""
    system: str = "si"
    """Unit system of the results: 'si' or 'us'."""
    current: str = ""
    """Id of the check on screen."""
    own: dict[str, list[str]] = field(default_factory=dict)
    """Check id -> shared fields given their own value there."""
    shared: dict[str, str] = field(default_factory=dict)
    """Meaning key -> the one text of a shared value (empty in a version 1 file)."""
    project: dict[str, str] = field(default_factory=dict)
    """Project, job, engineer, note."""
    alternatives: dict[str, dict[str, str]] = field(default_factory=dict)
    """Check id -> group of alternatives -> the field shown and used (stiffness or static deflection)."""

    def to_json(self) -> str:
        return json.dumps({"format": FORMAT, "version": VERSION,
                           "saved": time.strftime("%Y-%m-%dT%H:%M:%S%z"), "system": self.system,
                           "current": self.current, "checks": self.texts, "shared": self.shared,
                           "own": self.own, "project": self.project, "alternatives": self.alternatives},
                          indent=1, ensure_ascii=False)


class SessionFormatError(ValueError):
    """The file is JSON but not a fieldmode session."""


def parse_session(text: str) -> SessionData:
    """Read session JSON; raise ValueError (JSONDecodeError or SessionFormatError) if it is not one."""
    data: Any = json.loads(text)
    if not isinstance(data, dict) or data.get("format") != FORMAT:
        raise SessionFormatError("not a fieldmode session file")
    checks = data.get("checks")
    if not isinstance(checks, dict) or not all(
            isinstance(fields, dict) and all(_short_text(k) and _short_text(v) for k, v in fields.items())
            for fields in checks.values()):
        raise SessionFormatError("the checks in the session file are not texts a field can hold")
    system = str(data["system"]) if data.get("system") in ("si", "us") else "si"
    current = data["current"] if isinstance(data.get("current"), str) else ""
    own = data.get("own", {})
    if not isinstance(own, dict) or not all(isinstance(v, list) and all(isinstance(n, str) for n in v)
                                            for v in own.values()):
        raise SessionFormatError("the own-value list in the session file is not names")
    shared, project = data.get("shared", {}), data.get("project", {})
    for name, table in (("shared values", shared), ("project fields", project)):
        if not isinstance(table, dict) or not all(_short_text(k) and _short_text(v) for k, v in table.items()):
            raise SessionFormatError(f"the {name} in the session file are not texts")
    alternatives = data.get("alternatives", {})
    if not isinstance(alternatives, dict) or not all(
            isinstance(groups, dict) and all(_short_text(k) and _short_text(v) for k, v in groups.items())
            for groups in alternatives.values()):
        raise SessionFormatError("the alternatives in the session file are not names")
    return SessionData({str(k): dict(v) for k, v in checks.items()}, system, current,
                       {str(k): list(v) for k, v in own.items()}, dict(shared),
                       {k: v for k, v in project.items() if k in PROJECT_FIELDS},
                       {str(k): dict(v) for k, v in alternatives.items()})


def _short_text(value: object) -> bool:
    return isinstance(value, str) and len(value) <= MAX_TEXT


@dataclass
class LoadOutcome:
    """A loaded session (or None for the demo) and what the person should be told."""

    data: SessionData | None
    messages: list[str] = field(default_factory=list)


class SessionStore:
    """Reads and writes the session file in one folder; safe to call from threads."""

    def __init__(self, folder: Path) -> None:
        self.folder = folder
        self.path = folder / "session.json"
        self.owner = SessionLock(folder)
        """Which app process saves this session (one writer per session)."""
        self.read_only = False
        """True when another app saves this session and this one only shows it."""
        self._lock = threading.Lock()
        self.written = -1
        """Sequence number of the last snapshot written (or skipped as older)."""
        self.last_error: str = ""
        """The last write problem, or '' after a good save."""

    def load(self) -> LoadOutcome:
        """Read the session; move a bad file aside and say so."""
        try:
            if not self.path.exists():
                return LoadOutcome(None)
            if self.path.stat().st_size > MAX_SESSION_BYTES:
                raise SessionFormatError("the file is too large to be a session")
            return LoadOutcome(parse_session(self.path.read_text(encoding="utf-8")))
        except RecursionError:  # nested deeper than the JSON reader goes: not a file we wrote
            return LoadOutcome(None, [self._move_aside("nested too deep to be a session")])
        except (OSError, ValueError) as error:
            reason = error.strerror if isinstance(error, OSError) and error.strerror else str(error)
            return LoadOutcome(None, [self._move_aside(reason)])

    def _move_aside(self, reason: str) -> str:
        stamp = time.strftime("%Y%m%d-%H%M%S")
        aside = self.path.with_name(f"session.json.unreadable-{stamp}")
        try:
            os.replace(self.path, aside)
        except OSError as error:
            return (f"The saved session could not be read ({reason}) nor moved aside "
                    f"({error.strerror}); the demo is open and will not overwrite it unless you type.")
        return f"The saved session could not be read ({reason}); it was moved to {aside}. The demo is open."

    def probe(self) -> list[str]:
        """Say so at start if the session folder cannot be written."""
        try:
            self.folder.mkdir(parents=True, exist_ok=True)
            with tempfile.TemporaryFile(dir=self.folder):
                pass
        except OSError as error:
            reason = error.strerror or type(error).__name__  # the folder, not the probe's temporary name
            return [f"Your inputs will not be saved: cannot write in {self.folder} ({reason}). "
                    "Export a calc record (F9) to keep them."]
        return []

    def save(self, data: SessionData, sequence: int | None = None) -> str:
        """Write the session atomically; return '' or a one-line problem (nothing raised).

        With ``sequence``, a snapshot older than one already written is skipped, so
        saves from several threads never put an older session over a newer one.
        """
        if self.read_only:
            return "Session not saved: opened read-only, another fieldmode window saves it"
        if not self.owner.held():
            return "Session not saved: another fieldmode window took this session over"
        text = data.to_json()
        with self._lock:
            if sequence is not None:
                if sequence < self.written:
                    return self.last_error
                self.written = sequence
            try:
                self.folder.mkdir(parents=True, exist_ok=True)
                write_atomic(self.path, text)
            except OSError as error:
                self.last_error = "Session not saved: " + describe_os_error(error, self.path)
                return self.last_error
            self.last_error = ""
            return ""
