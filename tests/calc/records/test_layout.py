"""Finding a record's layout: encodings, long headers, and clear words for what is not a record."""

from __future__ import annotations

from pathlib import Path

import numpy as np
import pytest

from fieldmode.calc.framework.units import STANDARD_GRAVITY
from fieldmode.calc.records.layout import RecordError
from fieldmode.calc.records.read import read_record

FS = 200.0
TIME = np.arange(600) / FS
SIGNAL = np.exp(-1.5 * TIME) * np.sin(2 * np.pi * 6.8 * TIME)
ROWS = [f"{t:.5f},{x:.6f}" for t, x in zip(TIME, SIGNAL, strict=True)]


def _check(record) -> None:  # noqa: ANN001
    np.testing.assert_allclose(record.signal, SIGNAL, atol=1e-6)
    assert record.sample_rate == pytest.approx(FS, rel=1e-6)


def test_utf16_with_its_byte_order_mark_is_read(tmp_path: Path) -> None:
    path = tmp_path / "rec.csv"
    path.write_bytes(("time,acc\n" + "\n".join(ROWS) + "\n").encode("utf-16"))
    record = read_record(path)
    _check(record)
    assert "file is UTF-16: read as text" in record.notes


@pytest.mark.parametrize("header", ["".join(f"# comment {i}\n" for i in range(300)), "# " + "x" * 70_000 + "\n"])
def test_long_headers_and_comment_lines_do_not_hide_the_data(tmp_path: Path, header: str) -> None:
    path = tmp_path / "rec.csv"
    path.write_text(header + "time,acc\n" + "\n".join(ROWS) + "\n")
    _check(read_record(path))


@pytest.mark.parametrize(("text", "message"), [
    ("time,acc\n" + "\n".join(ROWS[:300]) + "\n" + "\n".join(r.replace(",", ";") for r in ROWS[300:]) + "\n",
     r"line 302: .* separated by semicolons, the lines before it by commas: use one separator"),
    ("# only\n# comments\n\n", "only comments or blank lines"),
    ("".join(f"header {i}\n" for i in range(2500)) + "\n".join(ROWS), "no rows of numbers in the first 2000 lines"),
])
def test_what_is_not_a_record_is_said_plainly(tmp_path: Path, text: str, message: str) -> None:
    path = tmp_path / "rec.csv"
    path.write_text(text)
    with pytest.raises(RecordError, match=message):
        read_record(path)


@pytest.mark.parametrize("header", ["acc [mg]", "acc (milli-g)"])
def test_milli_g_in_a_header_is_a_thousandth_of_standard_gravity(tmp_path: Path, header: str) -> None:
    path = tmp_path / "rec.csv"
    path.write_text(f"time,{header}\n" + "\n".join(ROWS) + "\n")
    record = read_record(path)
    # Source: NIST SP 811: standard gravity 9.80665 m/s^2; milli = 1e-3
    np.testing.assert_allclose(record.signal, SIGNAL * 1e-3 * STANDARD_GRAVITY, atol=1e-8)
    assert record.kind == "acceleration" and any("milli-g" in note for note in record.notes)
    given = read_record(tmp_path / "rec.csv", signal_unit="mg")
    np.testing.assert_allclose(given.signal, record.signal)


def test_lines_with_different_separators_are_said_not_read_as_one_sample(tmp_path: Path) -> None:
    """Alternating ';' and ',' rows once gave 'only 1 samples'."""
    rows = "".join(f"{i / 100:.2f}{';' if i % 2 == 0 else ','}{i % 5}\n" for i in range(200))
    path = tmp_path / "mixed.csv"
    path.write_text("t,a\n" + rows)
    with pytest.raises(RecordError, match="line 2 is separated by ';' and line 3 by ',': use one separator"):
        read_record(path)
