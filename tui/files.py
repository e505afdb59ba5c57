"""Writing files so that they are either as they were or wholly new: the session, calc records, curves.

Each file is written to a temporary file in the same folder, flushed and synced, then renamed over
the old one. A set of files (a calc record's Markdown and JSON) is written all or none: every
temporary file first, then the renames, undone if one fails. A file that replaces another keeps
its permissions; a new one gets those the person's umask gives.
"""

from __future__ import annotations

import contextlib
import os
import shutil
import stat
import tempfile
from collections.abc import Mapping
from pathlib import Path


def _umask() -> int:
    """The process's file creation mask (read once: setting it to read it is not thread-safe)."""
    mask = os.umask(0o022)
    os.umask(mask)
    return mask


UMASK = _umask()


def write_atomic(path: Path, text: str) -> None:
    """Write ``text`` to ``path`` so that it is either the old file or the whole new one.

    Raises :class:`OSError` (with the file name, nothing changed) if it cannot be written.
    """
    write_all_atomic({path: text})


def write_all_atomic(files: Mapping[Path, str]) -> None:
    """Write every file or none; raise :class:`OSError` naming the file that failed (nothing changed)."""
    temporaries: dict[Path, str] = {}
    try:
        for path, text in files.items():
            temporaries[path] = _temporary(path, text)
        _replace_all(temporaries)
    finally:
        for temporary in temporaries.values():
            with contextlib.suppress(OSError):
                os.unlink(temporary)
    for folder in {path.parent for path in files}:
        _sync_folder(folder)


def _temporary(path: Path, text: str) -> str:
    """A synced temporary file beside ``path`` holding ``text``, with the permissions ``path`` will have."""
    try:
        handle, temporary = tempfile.mkstemp(prefix=f".{path.name}.", suffix=".tmp", dir=path.parent)
    except OSError as error:
        raise _named(error, path) from error
    try:
        with os.fdopen(handle, "w", encoding="utf-8") as stream:
            stream.write(text)
            stream.flush()
            os.fsync(stream.fileno())
        os.chmod(temporary, _mode_for(path))
    except OSError as error:
        with contextlib.suppress(OSError):
            os.unlink(temporary)
        raise _named(error, path) from error
    return temporary


def _mode_for(path: Path) -> int:
    """Permissions of the file ``path`` replaces, or those a new file gets from the umask."""
    try:
        return stat.S_IMODE(os.stat(path).st_mode)
    except OSError:
        return 0o666 & ~UMASK


def _replace_all(temporaries: Mapping[Path, str]) -> None:
    """Rename each temporary over its file; if one rename fails, put the files already replaced back."""
    kept: dict[Path, str] = {}  # the old files, kept by a second name until every rename is done
    done: list[Path] = []
    try:
        for path in temporaries:
            if path.exists():
                old = f"{temporaries[path]}.old"
                try:
                    os.link(path, old)
                except OSError:  # a file system without hard links
                    shutil.copy2(path, old)
                kept[path] = old
        for path, temporary in temporaries.items():
            try:
                os.replace(temporary, path)
            except OSError as error:
                raise _named(error, path) from error
            done.append(path)
    except OSError:
        for path in done:
            with contextlib.suppress(OSError):
                if path in kept:
                    os.replace(kept.pop(path), path)
                else:
                    os.unlink(path)
        raise
    finally:
        for old in kept.values():
            with contextlib.suppress(OSError):
                os.unlink(old)


def _named(error: OSError, path: Path) -> OSError:
    """``error`` naming ``path`` (the file the person asked for, not a temporary one)."""
    return OSError(error.errno, error.strerror or str(error), str(path))


def _sync_folder(folder: Path) -> None:
    with contextlib.suppress(OSError):
        directory = os.open(folder, os.O_RDONLY)
        try:
            os.fsync(directory)
        finally:
            os.close(directory)


def describe_os_error(error: OSError, path: Path) -> str:
    """One line saying what went wrong with ``path`` (or the file the error names), fit to show a person."""
    reason = error.strerror or type(error).__name__
    return f"cannot write {error.filename or path}: {reason}"
