"""The first screen's results, computed by a helper process while the app loads Textual.

The app's start-up is budgeted (DESIGN.md section 7): Textual and the core (numpy, pint,
the checks) each take about as long to load as a bare Textual app takes to show a label,
and one process loads them one after the other. So :func:`start` forks, before either is
loaded, a helper process that loads the core while the app process loads Textual; the
helper sends back the outlines of every check (:class:`calc.fields.CheckOutline`), from
which the app builds its widgets, then the outcome of the check the app opens on, with
its result as text (:func:`tui.compute.as_shown`), and exits. The app shows that outcome
in its first frame and loads the core itself right after (its first computation, in a
worker thread).

Anything that goes wrong in the helper (no fork on this system, an error, no answer in
time) only means the app loads the core itself before its first frame, as without it.
"""

from __future__ import annotations

import os
import pickle
import select
import signal
from typing import TYPE_CHECKING

if TYPE_CHECKING:
    from calc.fields import CheckOutline
    from tui.compute import Outcome
    from tui.session import SessionData

WAIT = 15.0
"""Seconds the app waits for an answer of the helper before it loads the core itself."""


class Prestart:
    """A helper process computing the first screen, answering in two parts.

    :meth:`outlines` (every check's outline, as soon as the checks are loaded) and then
    :meth:`first` (the outcome of the check the app opens on): the app builds its widgets
    from the outlines while the helper computes that outcome.
    """

    def __init__(self, pid: int, pipe: int) -> None:
        self.pid = pid
        self._pipe: int | None = pipe
        self._buffer = b""

    def outlines(self) -> tuple[CheckOutline, ...] | None:
        """Every check's outline, or None if the helper has none (the app then loads the core)."""
        outlines = self._receive()
        if outlines is None:
            self.close()
        return outlines  # type: ignore[no-any-return]

    def first(self) -> Outcome | None:
        """The outcome, results as text, of the check the app opens on (None: compute it here)."""
        outcome = self._receive()
        self.close()
        return outcome  # type: ignore[no-any-return]

    def close(self) -> None:
        """Stop waiting for the helper and collect its exit status."""
        if self._pipe is not None:
            os.close(self._pipe)
            self._pipe = None
            os.waitpid(self.pid, 0)

    def _receive(self) -> object | None:
        """The next answer (a length-prefixed pickle), or None (no more answers, or none in time)."""
        if self._pipe is None:
            return None
        size = None
        while True:
            if size is None and len(self._buffer) >= 8:
                size = int.from_bytes(self._buffer[:8], "big")
            if size is not None and len(self._buffer) >= 8 + size:
                data, self._buffer = self._buffer[8:8 + size], self._buffer[8 + size:]
                try:
                    return pickle.loads(data)  # our own helper's bytes
                except (pickle.UnpicklingError, EOFError, ValueError, TypeError, AttributeError, ImportError):
                    return None
            if not select.select([self._pipe], [], [], WAIT)[0]:
                os.kill(self.pid, signal.SIGKILL)  # no answer in time
                return None
            chunk = os.read(self._pipe, 1 << 16)
            if not chunk:
                return None
            self._buffer += chunk


def start(data: SessionData | None) -> Prestart | None:
    """Fork the helper for the session ``data``; None where fork is not available.

    Called before Textual, the core or any thread is started (fork copies one thread).
    """
    if not hasattr(os, "fork"):
        return None
    read_end, write_end = os.pipe()
    try:
        pid = os.fork()
    except OSError:
        os.close(read_end)
        os.close(write_end)
        return None
    if pid == 0:  # the helper: never returns
        os.close(read_end)
        _helper(write_end, data)
    os.close(write_end)
    return Prestart(pid, read_end)


def _helper(pipe: int, data: SessionData | None) -> None:
    """Send the outlines, then the first outcome, to ``pipe``; exit (status 0 with or without answers)."""
    try:
        quiet = os.open(os.devnull, os.O_RDWR)  # the terminal belongs to the app
        for stream in (0, 1, 2):
            os.dup2(quiet, stream)
        from calc.checks import SPECS

        _send(pipe, tuple(spec.outline() for spec in SPECS))
        _send(pipe, first_outcome(data))
    finally:
        os._exit(0)  # never run the app's code, exit handlers or buffered output in the helper


def _send(pipe: int, answer: object) -> None:
    data = pickle.dumps(answer)
    remaining = memoryview(len(data).to_bytes(8, "big") + data)
    while remaining:
        remaining = remaining[os.write(pipe, remaining):]


def first_outcome(data: SessionData | None) -> Outcome | None:
    """The outcome, results as text, of the check the session opens on (None if it reads a file)."""
    from calc.checks import SPECS
    from tui.compute import as_shown, evaluate_guarded
    from tui.workspace import Workspace

    workspace = Workspace(SPECS, data)
    spec = workspace.by_id[workspace.current]
    if any(f.kind == "path" for f in spec.fields):  # reading a file may take a while: not here
        return None
    return as_shown(evaluate_guarded(spec, dict(workspace.texts[spec.id]), workspace.system))
