"""Text from files and sessions never reaches the terminal raw."""

from __future__ import annotations

from pathlib import Path

import pytest

from fieldmode.tui.cli import main
from fieldmode.tui.printable import printable


def test_control_characters_become_visible_escapes() -> None:
    # Source: ECMA-48 (ISO/IEC 6429): C0 controls 0x00-0x1F, DEL 0x7F and C1 controls 0x80-0x9F
    assert printable("acc\x1b[2J\x07\x9b[31m") == "acc\\x1b[2J\\x07\\x9b[31m"
    assert printable("two\nlines") == "two\\x0alines" and printable("two\nlines", keep_newlines=True) == "two\nlines"
    assert printable("µm/s² ±") == "µm/s² ±"  # printable characters stay as they are


def test_a_hostile_header_is_escaped_on_stdout_and_stderr(tmp_path: Path, capsys: pytest.CaptureFixture[str]) -> None:
    rows = "".join(f"{i / 200:.4f},{(0.97 ** i) * ((-1) ** (i // 15)):.5f}\n" for i in range(2000))
    path = tmp_path / "evil.csv"
    path.write_text("time,acc\x1b[2J\x1b]0;owned\x1b\\\n" + rows)
    status = main(["decay", str(path)])
    out, err = capsys.readouterr()
    assert "\x1b" not in out and "\x07" not in out and "\x1b" not in err
    assert "\\x1b[2J" in out or "\\x1b[2J" in err
    assert status in (0, 2)
    status = main(["decay", str(path), "--signal-column", "nothere\x1b[2J"])
    out, err = capsys.readouterr()
    assert status == 2 and "\x1b" not in err and err.count("\n") == 1
