"""Reading records: layouts, columns, units, sampling, and bad files named by line."""

from __future__ import annotations

import os
from pathlib import Path

import numpy as np
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from fieldmode.calc.framework.units import STANDARD_GRAVITY, InputError
from fieldmode.calc.records import read
from fieldmode.calc.records.read import Record, RecordError, read_record

FS = 200.0


TIME = np.arange(400) / FS


SIGNAL = np.exp(-1.5 * TIME) * np.sin(2 * np.pi * 6.8 * TIME)


def write(tmp_path: Path, text: str | bytes, name: str = "rec.csv") -> Path:
    path = tmp_path / name
    if isinstance(text, bytes):
        path.write_bytes(text)
    else:
        path.write_text(text, encoding="utf-8", newline="")
    return path


def rows(separator: str = ",", decimal: str = ".", time: np.ndarray = TIME, signal: np.ndarray = SIGNAL,
         end: str = "\n") -> str:
    lines = [f"{t:.5f}{separator}{x:.6f}".replace(".", decimal) if decimal != "." else f"{t:.5f}{separator}{x:.6f}"
             for t, x in zip(time, signal, strict=True)]
    return "".join(line + end for line in lines)


def check_record(record: Record, scale: float = 1.0) -> None:
    # Common practice (no source): the values written with 6 decimals come back to that precision
    assert record.sample_rate == pytest.approx(FS, rel=1e-9)
    assert len(record.signal) == len(SIGNAL)
    np.testing.assert_allclose(record.signal, SIGNAL * scale, atol=6e-7 * abs(scale))
    np.testing.assert_allclose(record.time, TIME, atol=1e-9)


def with_bad_row(bad: str, good_rows: int = 3) -> str:
    """A header, ``good_rows`` good rows, the bad row (line good_rows + 2), then good rows later in time."""
    return "t,a\n" + rows(time=TIME[:good_rows], signal=SIGNAL[:good_rows]) + bad + "\n" + rows(time=TIME + 1.0)


BAD_FILES = [
    (with_bad_row("0.015,abc"), 5, "'abc' in column 'a' is not a number"),
    (with_bad_row("0.0,abc", good_rows=0), 2, "'abc' in column 'a' is not a number"),
    (with_bad_row("0.005,x1", good_rows=1), 3, "'x1' in column 'a' is not a number"),
    (with_bad_row("0.015,nan"), 5, "NaN or infinite row"),
    (with_bad_row("0.015,inf"), 5, "NaN or infinite row"),
    (with_bad_row("0.015,"), 5, "no value in column 'a'"),
    (with_bad_row("0.015"), 5, "no value in column 'a'"),
    (with_bad_row("0.01,0.2"), 5, "duplicate time"),
    (with_bad_row("0.005,0.2"), 5, "time goes back"),
    (with_bad_row("0.2,1,5", good_rows=40).replace("0.2,1,5", "0.2,1 5"), 42, "'1 5' in column 'a' is not a number"),
    ("t,a\n" + rows(time=np.concatenate([TIME[:100], TIME[100:] + 0.5])), 102, "sampling too uneven"),
]


@pytest.mark.parametrize("text", [
    "# heel drop, bay 2\n# logger 7\ntime,acc\n" + rows(),
    "time;acc\n" + rows(";", ","),
    "time\tacc\n" + rows("\t"),
    "time acc\n" + rows(" "),
    rows(),
    rows("   "),
    rows(";", ","),
    rows(" ", ","),
    "\ufefftime,acc\r\n" + rows(end="\r\n"),
    '"time","acc"\n' + "".join(f'"{t:.5f}","{x:.6f}"\n' for t, x in zip(TIME, SIGNAL, strict=True)),
    "% exported\n\n" + rows().replace("\n", "\n\n", 5),
    "Messung: Zeit; Beschleunigung\nZeit;Beschl\n" + rows(";", ","),
], ids=["comments+header", "semicolon+decimal-comma", "tab", "spaces", "bare", "wide-spaces", "bare-semicolon",
        "spaces+decimal-comma", "bom+crlf", "quoted", "percent-comment+blank-lines", "two-header-lines"])
def test_layouts_read_the_same_numbers(tmp_path: Path, text: str) -> None:
    check_record(read_record(write(tmp_path, text)))


def test_latin1_header_is_read_with_a_note(tmp_path: Path) -> None:
    path = write(tmp_path, ("t,Beschl. (\xb5m)\n" + rows()).encode("latin-1"))
    record = read_record(path)
    check_record(record, 1e-6)
    assert any("Latin-1" in note for note in record.notes)


def test_columns_by_name_and_number_and_time_in_ms(tmp_path: Path) -> None:
    lines = ["t [ms],ax,ay [g]"] + [f"{1000 * t:.3f},{-x:.6f},{x:.6f}" for t, x in zip(TIME, SIGNAL, strict=True)]
    path = write(tmp_path, "\n".join(lines) + "\n")
    by_name = read_record(path, signal_column="ay")
    # Source: NIST SP 811 (2008), standard gravity 9.80665 m/s^2 exactly
    check_record(by_name, STANDARD_GRAVITY)
    assert by_name.kind == "acceleration" and by_name.channel_name == "ay [g]"
    assert any("time column" in note and "read in ms" in note for note in by_name.notes)
    by_number = read_record(path, signal_column=2, signal_unit="mm/s")
    check_record(by_number, -1e-3)
    assert by_number.kind == "velocity"
    assert read_record(path, time_column="1", signal_column="3", signal_unit="mm").kind == "length"
    assert read_record(path).channel_name == "ax"


def test_sample_rate_replaces_the_time_column(tmp_path: Path) -> None:
    path = write(tmp_path, "".join(f"{x:.6f}\n" for x in SIGNAL))
    record = read_record(path, sample_rate=FS, signal_unit="m/s^2")
    check_record(record)
    assert record.columns == ("1",)


def test_mildly_uneven_sampling_is_resampled_with_a_note(tmp_path: Path) -> None:
    rng = np.random.default_rng(3)
    time = np.cumsum(rng.uniform(0.7, 1.3, 2000)) / 1000.0
    signal = np.sin(2 * np.pi * 5.0 * time)
    record = read_record(write(tmp_path, rows(time=time, signal=signal)))
    assert any("resampled" in note for note in record.notes)
    steps = np.diff(record.time)
    assert np.allclose(steps, steps[0])
    # Oracle: the sine itself at the new instants; linear interpolation of a 5 Hz sine sampled at ~1 kHz errs
    # by at most (2 pi f dt)^2 / 8 ~ 1e-3 of the amplitude
    np.testing.assert_allclose(record.signal, np.sin(2 * np.pi * 5.0 * record.time), atol=2e-3)


def test_a_million_samples_are_read(tmp_path: Path) -> None:
    count = 1_000_000
    time = np.arange(count) / 1000.0
    path = tmp_path / "long.csv"
    np.savetxt(path, np.column_stack([time, np.sin(time)]), fmt="%.4f", delimiter=",", header="t,x", comments="")
    record = read_record(path)
    assert len(record.signal) == count
    assert record.sample_rate == pytest.approx(1000.0)


@pytest.mark.parametrize(("text", "line", "message"), BAD_FILES,
                         ids=["text-cell", "first-row", "second-row", "nan-row", "inf-row", "empty-cell",
                              "short-row", "duplicate-time", "time-back", "late-text-cell", "gap"])
def test_bad_rows_are_named_with_their_line(tmp_path: Path, text: str, line: int, message: str) -> None:
    path = write(tmp_path, text)
    with pytest.raises(RecordError) as caught:
        read_record(path)
    assert caught.value.line == line
    assert f"line {line}: " in str(caught.value)
    assert message in str(caught.value)
    assert str(path) in str(caught.value)


@pytest.mark.parametrize(("content", "message"), [
    (b"", "the file is empty"),
    (b"\n\n  \n", "the file is empty"),
    (b"\x89PNG\r\n\x1a\n\x00\x00\x00\rIHDR", "binary content at byte"),
    (b"t,a\n0,1\x00\n", "binary content at byte"),
    (b"time,acc\nno numbers here\n", "no rows of numbers"),
    ("t,a\n" + rows(time=TIME[:10], signal=SIGNAL[:10]), "only 10 samples"),
    ("".join(f"{x:.6f}\n" for x in SIGNAL), "only one column and no sample rate"),
], ids=["empty", "blank", "png", "nul-byte", "no-numbers", "too-few", "one-column"])
def test_unusable_files_say_why(tmp_path: Path, content: str | bytes, message: str) -> None:
    with pytest.raises(RecordError, match=message):
        read_record(write(tmp_path, content))


def test_missing_folder_and_unreadable_paths(tmp_path: Path) -> None:
    with pytest.raises(RecordError, match="no such file"):
        read_record(tmp_path / "missing.csv")
    with pytest.raises(RecordError, match="is a folder"):
        read_record(tmp_path)
    path = write(tmp_path, "t,a\n" + rows())
    path.chmod(0)
    try:
        if os.access(path, os.R_OK):
            pytest.skip("running with rights that read any file (root)")
        with pytest.raises(RecordError, match="permission denied"):
            read_record(path)
    finally:
        path.chmod(0o644)


def test_size_and_sample_limits_are_stated(tmp_path: Path, monkeypatch: pytest.MonkeyPatch) -> None:
    path = write(tmp_path, "t,a\n" + rows())
    monkeypatch.setattr(read, "MAX_FILE_BYTES", 1024 * 1024 // 512)
    with pytest.raises(RecordError, match="larger than the 0 MiB limit|larger than"):
        read_record(path)
    monkeypatch.setattr(read, "MAX_FILE_BYTES", 2**30)
    monkeypatch.setattr(read, "MAX_SAMPLES", 100)
    with pytest.raises(RecordError, match="more than 100 samples"):
        read_record(path)


def test_column_choices_are_checked(tmp_path: Path) -> None:
    path = write(tmp_path, "time,acc\n" + rows())
    with pytest.raises(RecordError, match=r"no signal column named 'vel' \(columns: time, acc\)"):
        read_record(path, signal_column="vel")
    with pytest.raises(RecordError, match="there is no time column 5: the file has 2 columns"):
        read_record(path, time_column=5)
    with pytest.raises(RecordError, match="the time and the signal are both column 1"):
        read_record(path, signal_column=1)
    # Common practice (no source): a sample rate typed beside a time column must agree with it
    with pytest.raises(RecordError, match="100 Hz, disagrees with the time column's 200 Hz"):
        read_record(path, time_column=1, sample_rate=100.0)
    assert read_record(path, sample_rate=200.5).sample_rate == pytest.approx(FS)
    with pytest.raises(InputError, match="signal unit"):
        read_record(path, signal_unit="kN")
    with pytest.raises(InputError, match="sample rate"):
        read_record(path, sample_rate=-5.0)


def test_time_in_the_wrong_unit_is_refused(tmp_path: Path) -> None:
    with pytest.raises(RecordError, match="outside"):
        text = "".join(f"{t * 1e-9:.4e},{x}\n" for t, x in zip(TIME, SIGNAL, strict=True))
        read_record(write(tmp_path, "t,a\n" + text))


@settings(max_examples=150, deadline=None)
@given(content=st.one_of(st.binary(max_size=300), st.text(max_size=300),
                         st.lists(st.tuples(st.floats(allow_nan=True, allow_infinity=True), st.floats()),
                                  max_size=60).map(lambda pairs: "".join(f"{a},{b}\n" for a, b in pairs))))
def test_any_file_content_gives_a_record_or_a_record_error(tmp_path_factory: pytest.TempPathFactory,
                                                           content: bytes | str) -> None:
    path = tmp_path_factory.mktemp("fuzz") / "rec.csv"
    if isinstance(content, bytes):
        path.write_bytes(content)
    else:
        path.write_text(content, encoding="utf-8")
    try:
        record = read_record(path)
    except InputError:
        return
    assert np.all(np.isfinite(record.signal)) and record.sample_rate > 0


def test_size_and_sha256_are_those_of_the_file(tmp_path: Path) -> None:
    import hashlib

    path = write(tmp_path, "# bay 2\ntime,acc\n" + rows())
    record = read_record(path)
    content = path.read_bytes()
    # Oracle: hashlib.sha256 and len() of the bytes on disk
    assert record.source.sha256 == hashlib.sha256(content).hexdigest()
    assert record.source.size == len(content)


def test_demo_names_read_the_shipped_records() -> None:
    import hashlib

    from fieldmode.calc.demo import GROUND_MOTION, HEEL_DROP, demo_file

    for name in (HEEL_DROP, GROUND_MOTION):
        record = read_record(f"demo:{name}", signal_unit="g")
        # Oracle: hashlib.sha256 of the installed file the short name stands for
        assert record.source.sha256 == hashlib.sha256(demo_file(name).read_bytes()).hexdigest()


@pytest.mark.parametrize("text", ["demo:nothing.csv", "demo:../demo/data/heel_drop_demo.csv", "demo:"])
def test_unknown_demo_names_are_refused_by_name(text: str) -> None:
    with pytest.raises(RecordError, match="no demo record") as caught:
        read_record(text)
    assert "demo:heel_drop_demo.csv" in str(caught.value)


def test_a_local_file_named_like_a_demo_is_read_with_a_folder(tmp_path: Path, monkeypatch: pytest.MonkeyPatch) -> None:
    monkeypatch.chdir(tmp_path)
    write(tmp_path, rows(), "demo:mine.csv")
    check_record(read_record("./demo:mine.csv"))
