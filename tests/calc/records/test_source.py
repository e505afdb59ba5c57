"""Reading a record once, from a file, a pipe or standard input; refusing what cannot be a record."""

from __future__ import annotations

import hashlib
import os
import subprocess
import sys
import time
from pathlib import Path

import numpy as np
import pytest

from fieldmode.calc.records import read as reader
from fieldmode.calc.records.layout import RecordError
from fieldmode.calc.records.read import read_channels, read_record
from fieldmode.calc.records.source import read_source

FS = 200.0
TIME = np.arange(600) / FS
SIGNAL = np.exp(-1.5 * TIME) * np.sin(2 * np.pi * 6.8 * TIME)
CSV = "time [s],acc [m/s^2]\n" + "".join(f"{t:.5f},{x:.6f}\n" for t, x in zip(TIME, SIGNAL, strict=True))


def test_a_file_is_read_once_and_its_bytes_hashed(tmp_path: Path) -> None:
    path = tmp_path / "rec.csv"
    path.write_text(CSV)
    found = read_source(str(path), 1 << 20)
    # Oracle: hashlib.sha256 of the file's bytes
    assert found.sha256 == hashlib.sha256(path.read_bytes()).hexdigest() and found.size == path.stat().st_size
    record = read_record(path)
    assert record.source.sha256 == found.sha256
    np.testing.assert_allclose(record.signal, SIGNAL, atol=1e-6)


@pytest.mark.parametrize("how", ["-", "/dev/stdin", "process substitution"])
def test_a_piped_record_gives_the_answer_of_the_file(tmp_path: Path, how: str) -> None:
    path = tmp_path / "rec.csv"
    path.write_text(CSV * 1 if len(CSV) > 70_000 else CSV)
    script = Path(sys.executable).with_name("fieldmode")
    direct = subprocess.run([str(script), "decay", str(path), "--json"], capture_output=True, text=True, check=True)
    if how == "process substitution":
        command = f"'{script}' decay <(cat '{path}') --json"
    else:
        command = f"cat '{path}' | '{script}' decay {how} --json"
    piped = subprocess.run(["bash", "-c", command], capture_output=True, text=True, timeout=60)
    assert piped.returncode == 0, piped.stderr
    import json

    # Common practice (no source): the same bytes give the same answer whatever they came through
    assert json.loads(piped.stdout)["results"] == json.loads(direct.stdout)["results"]


def test_a_long_record_through_a_pipe_is_read_whole(tmp_path: Path) -> None:
    rows = np.arange(40_000) / 1000.0
    text = "t,a\n" + "".join(f"{t:.4f},{np.sin(2 * np.pi * 7.0 * t) * np.exp(-0.5 * t):.6f}\n" for t in rows)
    done = subprocess.run([sys.executable, "-c", "import sys; from fieldmode.calc.records.read import read_record; "
                           "r = read_record('-'); print(len(r.signal))"], input=text, capture_output=True,
                          text=True, timeout=60)
    assert done.stdout.strip() == "40000", done.stderr


def test_a_named_pipe_without_a_writer_does_not_hang(tmp_path: Path) -> None:
    fifo = tmp_path / "fifo"
    os.mkfifo(fifo)
    start = time.monotonic()
    with pytest.raises(RecordError, match="the file is empty"):
        read_record(fifo)
    assert time.monotonic() - start < 5


@pytest.mark.parametrize(("path", "message"), [("/dev/null", "is a device"), ("/dev/zero", "is a device")])
def test_devices_are_refused_before_reading(path: str, message: str) -> None:
    with pytest.raises(RecordError, match=message):
        read_record(path)


def test_a_terminal_as_standard_input_is_refused(monkeypatch: pytest.MonkeyPatch) -> None:
    class Terminal:
        def isatty(self) -> bool:
            return True

    monkeypatch.setattr(sys, "stdin", Terminal())
    with pytest.raises(RecordError, match="standard input is a terminal"):
        read_record("-")


def test_home_folder_is_expanded(tmp_path: Path, monkeypatch: pytest.MonkeyPatch) -> None:
    monkeypatch.setenv("HOME", str(tmp_path))
    (tmp_path / "rec.csv").write_text(CSV)
    assert len(read_record("~/rec.csv").signal) == len(SIGNAL)


def test_a_file_is_parsed_again_only_when_it_changes(tmp_path: Path) -> None:
    path = tmp_path / "rec.csv"
    path.write_text(CSV)
    first = read_record(path)
    assert read_record(path) is first  # the same file: kept, not read again
    path.write_text(CSV.replace("time [s]", "time [ms]"))
    os.utime(path, ns=(time.time_ns(), time.time_ns() + 1_000_000))
    again = read_record(path)
    assert again is not first and again.sample_rate == pytest.approx(FS * 1000)


def test_several_signal_columns_are_read_with_their_units(tmp_path: Path) -> None:
    path = tmp_path / "three.csv"
    rows = "".join(f"{t:.5f},{x:.6f},{2 * x:.6f},{3 * x:.6f}\n" for t, x in zip(TIME, SIGNAL, strict=True))
    path.write_text("time [s],x [mm/s],y [mm/s],z [in/s]\n" + rows)
    record = read_channels(path)
    assert record.channel_names == ("x [mm/s]", "y [mm/s]", "z [in/s]")
    assert record.kinds == ("velocity",) * 3 and record.signals.shape == (len(TIME), 3)
    # Source: NIST SP 811: 1 in = 0.0254 m exactly
    np.testing.assert_allclose(record.signals[:, 2], 3 * SIGNAL * 0.0254, atol=0.0254e-6)  # 6 decimals in the file
    np.testing.assert_allclose(record.signals[:, 0], SIGNAL * 1e-3, atol=1e-9)
    assert read_channels(path, signal_columns=["z"]).channel_names == ("z [in/s]",)


def test_memory_stays_near_the_samples(tmp_path: Path) -> None:
    rows = 200_000
    t = np.arange(rows) / 1000.0
    block = np.column_stack([t, np.sin(t), np.cos(t), np.sin(2 * t)])
    path = tmp_path / "big.csv"
    np.savetxt(path, block, delimiter=",", fmt="%.6f", header="time,x,y,z", comments="")
    import tracemalloc

    reader._kept.clear()
    tracemalloc.start()
    record = read_channels(path, signal_unit="m/s")
    peak = tracemalloc.get_traced_memory()[1]
    tracemalloc.stop()
    samples = record.signals.nbytes + record.time.nbytes
    # Common practice (no source): reading costs a few times the samples as float64, not tens of times
    assert peak < 3 * samples + 2 * path.stat().st_size


def test_a_record_keeps_the_size_and_digest_of_its_bytes_but_not_the_bytes(tmp_path: Path) -> None:
    path = tmp_path / "kept.csv"
    path.write_text(CSV)
    record = read_record(path)
    # Oracle: hashlib.sha256 of the file's bytes and the file system's size
    assert record.source.size == path.stat().st_size
    assert record.source.sha256 == hashlib.sha256(path.read_bytes()).hexdigest()
    # Common practice (no source): once parsed, a long record's text is not held beside its samples
    assert record.source.data == b""


def test_memory_peak_holds_the_text_and_the_table_but_no_copy_of_them(tmp_path: Path) -> None:
    rows = 200_000
    t = np.arange(rows) / 1000.0
    path = tmp_path / "long.csv"
    np.savetxt(path, np.column_stack([t, np.sin(t), np.cos(t), np.sin(2 * t)]), delimiter=",", fmt="%.6f",
               header="time,x,y,z", comments="")
    import tracemalloc

    reader._kept.clear()
    tracemalloc.start()
    read_channels(path, signal_unit="m/s")
    peak = tracemalloc.get_traced_memory()[1]
    tracemalloc.stop()
    table = rows * 4 * 8
    # Common practice (no source): the text, the table numpy parses (with its growth margin) and one column of
    # time steps; a copy of the table or of the signals beside the text would add another table's worth
    assert peak < path.stat().st_size + 1.6 * table
