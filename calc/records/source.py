"""Where a record's bytes come from: a file, a pipe or standard input, read once.

A record is read whole into memory exactly once and every later step (finding the layout,
parsing, reporting a bad line) works on those bytes, so a pipe or a process substitution gives
the same answer as the file. What cannot be a record is refused before anything blocks: a folder,
a terminal or other device, a socket, standard input from a terminal. A named pipe is opened
without waiting for a writer: with nobody writing it reads as empty.
"""

from __future__ import annotations

import hashlib
import os
import stat
import sys
from dataclasses import dataclass, replace

from fieldmode.calc.demo import demo_path
from fieldmode.calc.records.layout import RecordError

STDIN = "-"
"""The path that means standard input."""


@dataclass(frozen=True)
class Source:
    """The bytes of a record as read, and where they came from (as typed)."""

    shown: str
    data: bytes
    sha256: str
    identity: tuple[int, int, int, int] | None
    """(device, inode, size, modification time in ns) of a regular file; None for a pipe or standard input."""
    size: int = -1
    """Bytes read (the length of ``data`` unless given)."""

    def __post_init__(self) -> None:
        if self.size < 0:
            object.__setattr__(self, "size", len(self.data))

    def released(self) -> Source:
        """The same source without its bytes (size and SHA-256 kept), once they have been parsed."""
        return replace(self, data=b"")


def resolve(typed: str) -> str:
    """The file system path of a typed record path: '~' expanded, a 'demo:' name to the shipped file."""
    try:
        demo = demo_path(typed)
    except LookupError as error:
        raise RecordError(typed, str(error)) from error
    return os.path.expanduser(typed) if demo is None else str(demo)


def file_identity(typed: str) -> tuple[int, int, int, int] | None:
    """Identity of a regular file (device, inode, size, mtime ns), or None for anything else or nothing."""
    if typed == STDIN:
        return None
    try:
        found = os.stat(resolve(typed))
    except (OSError, RecordError):
        return None
    if not stat.S_ISREG(found.st_mode):
        return None
    return found.st_dev, found.st_ino, found.st_size, found.st_mtime_ns


def read_source(typed: str, max_bytes: int) -> Source:
    """Read a record's bytes once; refuse, in one line naming it, what cannot be a record."""
    if typed == STDIN:
        if sys.stdin is None or sys.stdin.isatty():
            raise RecordError(typed, "standard input is a terminal: pipe a record in, e.g. cat rec.csv | ...")
        data = _read_limited(sys.stdin.buffer.fileno(), typed, max_bytes)
        return Source(typed, data, hashlib.sha256(data).hexdigest(), None)
    path = resolve(typed)
    try:
        found = os.stat(path)
    except FileNotFoundError as error:
        raise RecordError(typed, "no such file") from error
    except OSError as error:
        raise RecordError(typed, f"cannot be read ({error.strerror or error})") from error
    mode = found.st_mode
    if stat.S_ISDIR(mode):
        raise RecordError(typed, "is a folder, not a file")
    if stat.S_ISCHR(mode) or stat.S_ISBLK(mode):
        raise RecordError(typed, "is a device (a terminal or a disk), not a record file")
    if stat.S_ISSOCK(mode):
        raise RecordError(typed, "is a socket, not a record file")
    if stat.S_ISREG(mode) and found.st_size > max_bytes:
        raise RecordError(typed, f"{found.st_size / 2**20:.0f} MiB is larger than the {max_bytes / 2**20:.0f} MiB "
                          "limit; shorten the record")
    flags = os.O_RDONLY | (0 if stat.S_ISREG(mode) else os.O_NONBLOCK)  # a pipe: never wait for a writer
    try:
        handle = os.open(path, flags)
    except PermissionError as error:
        raise RecordError(typed, "cannot be read (permission denied)") from error
    except OSError as error:
        raise RecordError(typed, f"cannot be read ({error.strerror or error})") from error
    try:
        if stat.S_ISREG(mode):
            with os.fdopen(handle, "rb", closefd=False) as stream:
                data = stream.read(min(found.st_size, max_bytes) + 1)  # one buffer of the file's size
            if len(data) > max_bytes:
                raise RecordError(typed, f"more than the {max_bytes / 2**20:.0f} MiB limit; shorten the record")
        else:
            os.set_blocking(handle, True)  # a writer that is there is waited for; none means the end
            data = _read_limited(handle, typed, max_bytes)
    except OSError as error:
        raise RecordError(typed, f"cannot be read ({error.strerror or error})") from error
    finally:
        os.close(handle)
    identity = (found.st_dev, found.st_ino, found.st_size, found.st_mtime_ns) if stat.S_ISREG(mode) else None
    return Source(typed, data, hashlib.sha256(data).hexdigest(), identity)


def _read_limited(handle: int, typed: str, max_bytes: int) -> bytes:
    """Everything readable from ``handle``, refusing more than ``max_bytes``."""
    chunks: list[bytes] = []
    total = 0
    while True:
        try:
            chunk = os.read(handle, 1 << 20)
        except OSError as error:
            raise RecordError(typed, f"cannot be read ({error.strerror or error})") from error
        if not chunk:
            return b"".join(chunks)
        total += len(chunk)
        if total > max_bytes:
            raise RecordError(typed, f"more than the {max_bytes / 2**20:.0f} MiB limit; shorten the record")
        chunks.append(chunk)
