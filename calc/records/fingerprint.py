"""What identifies the content of a record file: its size and SHA-256, and a check that it did not change.

The calc record names every file a check read with these, so the file can be matched later.
"""

from __future__ import annotations

import hashlib
import os
from dataclasses import dataclass
from pathlib import Path

from fieldmode.calc.records.layout import RecordError


@dataclass(frozen=True)
class Fingerprint:
    """A file's content at the time it was read."""

    size: int
    """Bytes."""
    sha256: str
    """SHA-256 of the content, as hex."""
    modified: int
    """Modification time (ns) when it was read."""


def fingerprint(path: Path, shown: str) -> Fingerprint:
    """Size and SHA-256 of the content of ``path`` (``shown`` as the person typed it, for errors)."""
    try:
        with open(path, "rb") as handle:
            modified = os.fstat(handle.fileno()).st_mtime_ns
            digest = hashlib.file_digest(handle, "sha256")
            return Fingerprint(handle.tell(), digest.hexdigest(), modified)
    except OSError as error:
        raise RecordError(shown, f"cannot be read ({error.strerror or error})") from error


def check_unchanged(path: Path, shown: str, before: Fingerprint) -> None:
    """Refuse a file written to since ``before`` was taken: its digest would not be of the data read."""
    try:
        now = os.stat(path)
    except OSError as error:
        raise RecordError(shown, f"cannot be read ({error.strerror or error})") from error
    if now.st_size != before.size or now.st_mtime_ns != before.modified:
        raise RecordError(shown, "changed while it was read (is a logger still writing it?): read it again "
                          "once it is complete")
