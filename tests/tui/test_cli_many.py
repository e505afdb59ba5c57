"""Many records at once: `fieldmode CHECK FOLDER` and several record files (JSON lines, the table, bad files)."""

from __future__ import annotations

import io
import json
import os
import shutil
import signal
import subprocess
import sys
import time
from pathlib import Path

import numpy as np
import pytest
from helpers.free_decay import record

from fieldmode.calc.checks import SPECS
from fieldmode.tui.cli import main
from fieldmode.tui.many import Progress

DECAYS = {"b_bay.csv": (6.8, 0.025), "a_bay.csv": (4.5, 0.015), "c_bay.txt": (9.2, 0.04)}
"""Three heel-drop-like records (natural frequency Hz, damping ratio), written in this order, not by name."""


def run(capsys: pytest.CaptureFixture[str], *argv: str) -> tuple[int, str, str]:
    code = main(list(argv))
    captured = capsys.readouterr()
    return code, captured.out, captured.err


def write_decay(path: Path, frequency: float, zeta: float) -> None:
    time_s, signal_, _ = record(frequency=frequency, zeta=zeta, fs=200.0, duration=10.0, noise=0.002, seed=3)
    np.savetxt(path, np.column_stack([time_s, signal_]), fmt=("%.3f", "%.6f"), delimiter=",",
               header="time [s],acceleration [m/s^2]", comments="")


@pytest.fixture
def folder(tmp_path: Path) -> Path:
    """A folder of three decay records, a note that is not a record, a hidden file and a subfolder."""
    site = tmp_path / "site"
    site.mkdir()
    for name, (frequency, zeta) in DECAYS.items():
        write_decay(site / name, frequency, zeta)
    (site / "notes.md").write_text("walked the mezzanine\n")
    (site / ".hidden.csv").write_text("not read\n")
    (site / "older").mkdir()
    write_decay(site / "older" / "d_bay.csv", 5.0, 0.02)
    return site


def alone(capsys: pytest.CaptureFixture[str], *argv: str) -> dict:
    code, out, err = run(capsys, *argv, "--json")
    assert code == 0, err
    return json.loads(out)


def test_a_folder_gives_one_json_line_per_record_in_name_order_as_each_alone(
        capsys: pytest.CaptureFixture[str], folder: Path) -> None:
    code, out, err = run(capsys, "decay", str(folder), "--json")
    assert code == 0 and err == ""
    lines = [json.loads(line) for line in out.splitlines()]
    names = sorted(DECAYS)  # the folder's records by name; notes.md, .hidden.csv and older/ are not records
    assert [Path(line["file"]).name for line in lines] == names
    for line, name in zip(lines, names, strict=True):
        path = str(folder / name)
        # Oracle: the same file run alone (`fieldmode decay FILE --json`), plus its name
        assert line == {"file": path, **alone(capsys, "decay", path)}
        frequency, zeta = DECAYS[name]
        # Oracle: scipy.integrate.solve_ivp made the record (helpers.free_decay) with this frequency and damping
        assert line["results"]["natural_frequency"]["value"] == pytest.approx(frequency, rel=0.01)
        assert line["results"]["damping_ratio"]["value"] == pytest.approx(zeta, rel=0.05)


def test_files_keep_the_order_typed_and_other_options_apply_to_each(capsys: pytest.CaptureFixture[str],
                                                                     folder: Path) -> None:
    typed = [str(folder / "c_bay.txt"), str(folder / "a_bay.csv")]
    code, out, err = run(capsys, "decay", *typed, "--band", "2 12", "--json")
    assert code == 0 and err == ""
    lines = [json.loads(line) for line in out.splitlines()]
    assert [line["file"] for line in lines] == typed
    for line, path in zip(lines, typed, strict=True):
        assert line == {"file": path, **alone(capsys, "decay", path, "--band", "2 12")}


def test_a_bad_file_is_one_line_on_stderr_the_others_go_on_and_the_status_is_2(
        capsys: pytest.CaptureFixture[str], folder: Path) -> None:
    (folder / "b_broken.csv").write_text("t,a\n0,1\n0.01,2\n0.02,x\n0.03,1\n")
    code, out, err = run(capsys, "decay", str(folder), "--json")
    assert code == 2
    assert err.count("\n") == 1 and "Traceback" not in err
    assert "b_broken.csv" in err and "line 4" in err
    assert [Path(json.loads(line)["file"]).name for line in out.splitlines()] == sorted(DECAYS)


def test_a_missing_file_among_good_ones_is_named_on_its_line(capsys: pytest.CaptureFixture[str],
                                                              folder: Path) -> None:
    missing = str(folder / "nowhere.csv")
    code, out, err = run(capsys, "decay", str(folder / "a_bay.csv"), missing, "--json")
    assert code == 2 and err.count("\n") == 1 and missing in err and "no such file" in err
    assert len(out.splitlines()) == 1


def test_an_error_that_does_not_name_the_file_is_prefixed_by_it(capsys: pytest.CaptureFixture[str],
                                                                 folder: Path) -> None:
    code, out, err = run(capsys, "decay", str(folder), "--band", "12 2", "--json")
    assert code == 2 and out == ""
    lines = err.splitlines()
    assert len(lines) == len(DECAYS)
    for line, name in zip(lines, sorted(DECAYS), strict=True):
        assert line.startswith(f"fieldmode: {folder / name}: ") and "low edge first" in line


@pytest.mark.parametrize("content", [None, "notes.md"], ids=["empty", "no-record-suffix"])
def test_a_folder_without_records_is_status_2_and_one_line(capsys: pytest.CaptureFixture[str], tmp_path: Path,
                                                            content: str | None) -> None:
    empty = tmp_path / "empty"
    empty.mkdir()
    if content:
        (empty / content).write_text("1,2\n")
    code, out, err = run(capsys, "decay", str(empty))
    assert code == 2 and out == ""
    assert err.count("\n") == 1 and "no records in folder" in err and str(empty) in err and ".csv" in err


def test_csv_with_many_records_is_refused_before_any_is_run(capsys: pytest.CaptureFixture[str],
                                                             folder: Path, tmp_path: Path) -> None:
    target = tmp_path / "curves.csv"
    code, out, err = run(capsys, "decay", str(folder), "--csv", str(target))
    assert code == 2 and out == "" and err.count("\n") == 1 and "--csv" in err and "--json" in err
    assert not target.exists()


def test_standard_input_among_several_is_refused(capsys: pytest.CaptureFixture[str], folder: Path) -> None:
    code, out, err = run(capsys, "decay", "-", str(folder / "a_bay.csv"))
    assert code == 2 and out == "" and err.count("\n") == 1 and "standard input" in err


def test_one_file_in_a_list_of_one_is_the_single_record_output(capsys: pytest.CaptureFixture[str],
                                                               folder: Path) -> None:
    """One file is the command as before: one JSON object (no "file" key), --csv allowed."""
    path = str(folder / "a_bay.csv")
    data = alone(capsys, "decay", path)
    assert "file" not in data and data["check"] == "decay"
    code, out, _ = run(capsys, "decay", path, "--csv", "-")
    assert code == 0 and out.startswith("time [s],")


def test_the_table_fits_80_columns_and_lists_every_record_in_order(capsys: pytest.CaptureFixture[str],
                                                                    folder: Path) -> None:
    (folder / "b_broken.csv").write_text("t,a\n0,1\n0.01,2\n0.02,x\n0.03,1\n")
    code, out, err = run(capsys, "decay", str(folder))
    assert code == 2 and err.count("\n") == 1
    lines = out.splitlines()
    assert max(map(len, lines)) <= 80
    rows = [line.split() for line in lines if line.startswith("  ") and line.split()[0] in {*DECAYS, "b_broken.csv"}]
    assert [row[0] for row in rows] == ["a_bay.csv", "b_bay.csv", "b_broken.csv", "c_bay.txt"]
    assert rows[2][1:] == ["refused", "(see", "stderr)"]
    header = next(line for line in lines if line.lstrip().startswith("file"))
    assert header.split()[1:3] == ["natural_frequency", "damping_ratio"]
    for row in (rows[0], rows[1], rows[3]):
        frequency, zeta = DECAYS[row[0]]
        # Oracle: scipy.integrate.solve_ivp made the record; the table shows 4 significant figures in Hz and %
        assert float(row[1]) == pytest.approx(frequency, rel=0.01)
        assert float(row[2]) == pytest.approx(zeta * 100, rel=0.05)
    assert "4 records: 3 done, 1 refused." in out
    assert "licensed" in out  # the caution


def test_every_record_check_takes_a_folder_from_its_spec() -> None:
    """Nothing in tui/ names a check: any check with a positional file field gets the folder form."""
    record_checks = [spec.id for spec in SPECS if spec.record_field is not None]
    assert {"decay", "spectrum"} <= set(record_checks)


@pytest.mark.parametrize("spec", [spec for spec in SPECS if spec.key_results], ids=lambda spec: spec.id)
def test_key_results_are_results_the_check_gives(spec) -> None:  # noqa: ANN001
    result = spec.evaluate(spec.demo_texts())
    assert set(spec.key_results) <= set(result.values)


def test_the_folder_form_runs_for_the_spectrum_too(capsys: pytest.CaptureFixture[str], folder: Path) -> None:
    code, out, err = run(capsys, "spectrum", str(folder), "--json")
    assert code == 0, err
    lines = [json.loads(line) for line in out.splitlines()]
    assert [line["check"] for line in lines] == ["spectrum"] * len(DECAYS)
    assert lines[0] == {"file": str(folder / "a_bay.csv"), **alone(capsys, "spectrum", str(folder / "a_bay.csv"))}


class Terminal(io.StringIO):
    """A stderr that says it is a terminal."""

    def isatty(self) -> bool:
        return True


def test_progress_is_written_to_a_terminal_only(capsys: pytest.CaptureFixture[str], folder: Path,
                                                monkeypatch: pytest.MonkeyPatch) -> None:
    code, _, err = run(capsys, "decay", str(folder), "--json")
    assert code == 0 and err == ""  # captured output is not a terminal: no progress
    screen = Terminal()
    monkeypatch.setattr(sys, "stderr", screen)
    assert main(["decay", str(folder), "--json"]) == 0
    written = screen.getvalue()
    assert f"\r{len(DECAYS)}/{len(DECAYS)} records" in written
    assert written.endswith("\r")  # the progress line is wiped at the end
    assert Progress(io.StringIO(), 5).on is False


def test_ctrl_c_stops_every_worker_and_exits_130(tmp_path: Path) -> None:
    """Interrupted while records are running: status 130, no traceback, no worker left behind."""
    site = tmp_path / "many"
    site.mkdir()
    fs, frequency, zeta = 1000.0, 6.8, 0.025  # 100 s at 1 kHz: each record keeps a worker busy a while
    time_s = np.arange(100_000) / fs
    decay = np.exp(-zeta * 2 * np.pi * frequency * time_s) * np.sin(2 * np.pi * frequency * time_s)
    np.savetxt(site / "r00.csv", np.column_stack([time_s, decay]), fmt=("%.3f", "%.6f"), delimiter=",",
               header="time [s],acceleration [m/s^2]", comments="")
    for index in range(1, 40):
        shutil.copyfile(site / "r00.csv", site / f"r{index:02d}.csv")
    script = Path(sys.executable).parent / "fieldmode"
    # Ctrl+C as at a terminal: a test run started in the background (a CI job) inherits SIGINT ignored, and a
    # Python started with SIGINT ignored keeps ignoring it
    process = subprocess.Popen([str(script), "decay", str(site), "--json"], stdout=subprocess.PIPE,
                               stderr=subprocess.PIPE, text=True, start_new_session=True,
                               preexec_fn=lambda: signal.signal(signal.SIGINT, signal.SIG_DFL))
    assert process.stdout is not None
    first = process.stdout.readline()  # the first record is done: workers are busy with the next
    assert json.loads(first)["check"] == "decay"
    os.killpg(process.pid, signal.SIGINT)  # Ctrl+C reaches the whole foreground group
    _, err = process.communicate(timeout=60)
    assert process.returncode == 130
    assert "Traceback" not in err
    time.sleep(0.2)
    leftover = subprocess.run(["pgrep", "-g", str(process.pid)], capture_output=True, text=True)
    assert leftover.stdout.strip() == ""


def test_long_paths_from_two_folders_keep_their_ends_within_80_columns(capsys: pytest.CaptureFixture[str],
                                                                      folder: Path, tmp_path: Path) -> None:
    deep = tmp_path / ("a_folder_with_a_long_name_" * 3) / "second"
    deep.mkdir(parents=True)
    write_decay(deep / "heel_drop_at_the_far_end_of_the_mezzanine.csv", 6.8, 0.025)
    typed = [str(folder / "a_bay.csv"), str(deep / "heel_drop_at_the_far_end_of_the_mezzanine.csv"),
             str(deep / "missing_record_with_a_name_long_enough_to_need_cutting.csv")]
    code, out, err = run(capsys, "decay", *typed)
    assert code == 2 and err.count("\n") == 1
    lines = out.splitlines()
    assert max(map(len, lines)) <= 80
    assert any(line.lstrip().startswith("...") and "mezzanine.csv" in line for line in lines)
    assert any(line.lstrip().startswith("...") and line.endswith("cutting.csv  refused (see stderr)")
               for line in lines)


def test_a_fault_of_ours_in_one_record_gives_status_1_and_the_others_go_on(
        capsys: pytest.CaptureFixture[str], folder: Path, monkeypatch: pytest.MonkeyPatch) -> None:
    import dataclasses

    from fieldmode.calc import checks

    real = checks.load("decay")

    def faulty(inputs):  # noqa: ANN001, ANN202
        if inputs.text("file").endswith("b_bay.csv"):
            raise RuntimeError("a bug")
        return real.compute(inputs)

    monkeypatch.setattr(checks, "load", lambda check_id: dataclasses.replace(real, compute=faulty))
    code, out, err = run(capsys, "decay", str(folder), "--json")
    assert code == 1
    assert err.count("\n") == 1 and "internal fault" in err and "b_bay.csv" in err
    assert [Path(json.loads(line)["file"]).name for line in out.splitlines()] == ["a_bay.csv", "c_bay.txt"]


def test_records_may_follow_an_option(capsys: pytest.CaptureFixture[str], folder: Path) -> None:
    """argparse takes a positional list once: files after an option are still records, in the order typed."""
    first, second = str(folder / "a_bay.csv"), str(folder / "c_bay.txt")
    code, out, err = run(capsys, "decay", first, "--band", "2 12", second, "--json")
    assert code == 0, err
    assert out == run(capsys, "decay", first, second, "--band", "2 12", "--json")[1]


def test_an_unknown_option_among_records_is_still_refused(capsys: pytest.CaptureFixture[str], folder: Path) -> None:
    code, out, err = run(capsys, "decay", str(folder / "a_bay.csv"), "--bogus", "1", str(folder / "c_bay.txt"))
    assert code == 2 and out == "" and err.count("\n") == 1 and "--bogus" in err
