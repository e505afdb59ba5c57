"""A record file's size and SHA-256, and a file written to while it was read."""

from __future__ import annotations

import hashlib
import os
from pathlib import Path

import pytest

from fieldmode.calc.records.fingerprint import check_unchanged, fingerprint
from fieldmode.calc.records.layout import RecordError


def test_fingerprint_is_size_and_sha256(tmp_path: Path) -> None:
    path = tmp_path / "rec.csv"
    content = b"t,a\n" + b"".join(b"%d,%d\n" % (i, i * i) for i in range(5000))
    path.write_bytes(content)
    found = fingerprint(path, "rec.csv")
    # Oracle: hashlib.sha256 of the bytes written
    assert found.sha256 == hashlib.sha256(content).hexdigest()
    assert found.size == len(content)
    check_unchanged(path, "rec.csv", found)


def test_a_file_appended_to_or_rewritten_is_refused(tmp_path: Path) -> None:
    path = tmp_path / "logger.csv"
    path.write_bytes(b"t,a\n0,1\n")
    found = fingerprint(path, "logger.csv")
    with path.open("ab") as handle:
        handle.write(b"1,2\n")
    with pytest.raises(RecordError, match="changed while it was read"):
        check_unchanged(path, "logger.csv", found)
    path.write_bytes(b"t,a\n0,9\n")  # the same size, written again a second later
    os.utime(path, ns=(found.modified + 10**9, found.modified + 10**9))
    assert path.stat().st_size == found.size
    with pytest.raises(RecordError, match="changed while it was read"):
        check_unchanged(path, "logger.csv", found)


def test_a_file_gone_is_said(tmp_path: Path) -> None:
    path = tmp_path / "gone.csv"
    path.write_bytes(b"t,a\n")
    found = fingerprint(path, "gone.csv")
    path.unlink()
    with pytest.raises(RecordError, match="cannot be read"):
        check_unchanged(path, "gone.csv", found)
    with pytest.raises(RecordError, match="cannot be read"):
        fingerprint(path, "gone.csv")
