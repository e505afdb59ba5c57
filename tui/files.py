"""Atomic file writing shared by the session file and the calc record."""

from __future__ import annotations

import contextlib
import os
import tempfile
from pathlib import Path


def write_atomic(path: Path, text: str) -> None:
    """Write ``text`` to ``path`` so that it is either the old file or the whole new one.

    A temporary file in the same folder is written, flushed and fsynced, then renamed
    over ``path`` with :func:`os.replace`. Raises :class:`OSError` (nothing changed) if
    the folder cannot be written.
    """
    folder = path.parent
    handle, temporary = tempfile.mkstemp(prefix=f".{path.name}.", suffix=".tmp", dir=folder)
    try:
        with os.fdopen(handle, "w", encoding="utf-8") as stream:
            stream.write(text)
            stream.flush()
            os.fsync(stream.fileno())
        os.replace(temporary, path)
    except BaseException:
        with contextlib.suppress(OSError):
            os.unlink(temporary)
        raise
    with contextlib.suppress(OSError):
        directory = os.open(folder, os.O_RDONLY)
        try:
            os.fsync(directory)
        finally:
            os.close(directory)


def describe_os_error(error: OSError, path: Path) -> str:
    """One line saying what went wrong with ``path``, fit to show a person."""
    reason = error.strerror or type(error).__name__
    return f"cannot write {path}: {reason}"
