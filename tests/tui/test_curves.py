"""Curves as CSV (`--csv FILE|-`): columns, units, order, lengths, and where the file may go."""

from __future__ import annotations

import csv
import io
import json
from pathlib import Path

import numpy as np
import pytest

from fieldmode.calc.checks import SPECS
from fieldmode.calc.demo import GROUND_MOTION, demo_file
from fieldmode.calc.framework.reading import Inputs
from fieldmode.calc.framework.result import Result
from fieldmode.calc.framework.spec import CheckSpec, Series
from fieldmode.tui.cli import main
from fieldmode.tui.curves import column_order, csv_text

SDOF = ["sdof", "--mass", "9.6 t", "--stiffness", "42 kN/mm", "--damping", "2 %"]
SPRINGS = ["member", "--element", "springs", "--springs", "42 kN/mm, 5.2 kN/mm", "--arrangement", "series"]
SPECTRUM = ["spectrum", str(demo_file(GROUND_MOTION)), "--signal-unit", "g", "--period", "0.53 s"]


def run(capsys: pytest.CaptureFixture[str], *argv: str) -> tuple[int, str, str]:
    code = main(list(argv))
    captured = capsys.readouterr()
    return code, captured.out, captured.err


def demo_argv(spec: CheckSpec) -> list[str]:
    argv = [spec.id]
    for field in spec.fields:
        if field.default:
            argv += [field.default] if field.positional else [field.option, field.default]
    return argv


def parse(text: str) -> tuple[list[str], list[str], list[list[str]]]:
    """Names, units and the columns of a CSV text (cells as written)."""
    header, *rows = list(csv.reader(io.StringIO(text)))
    names = [cell.split(" [")[0] for cell in header]
    units = [cell.split(" [")[1].rstrip("]") for cell in header]
    return names, units, [list(column) for column in zip(*rows, strict=True)] if rows else []


def _toy(inputs: Inputs) -> Result:
    return inputs.result({}, series={"y": np.array([1.0, np.nan, np.inf]), "x": np.array([0.0, 1.0, 2.0]),
                                     "t": np.array([0.5]), "u": np.array([-2.25])})


TOY = CheckSpec("toy", "Toy", "curves declared out of order, of two lengths, with points not finite", (), _toy,
                series=(Series("y", "Y", "length", "x"), Series("t", "T", "time"), Series("x", "X", "time"),
                        Series("u", "U", "velocity", "t"), Series("never", "Never made", "length", "x")))


def test_each_abscissa_comes_before_its_curves_and_short_columns_are_padded() -> None:
    result = TOY.evaluate({})
    assert column_order(TOY, result) == ["t", "u", "x", "y"]
    assert csv_text(TOY, result) == "t [s],u [m/s],x [s],y [m]\n0.5,-2.25,0,1\n,,1,\n,,2,\n"
    assert result.to_dict()["series"]["y"] == {"values": [1.0, None, None], "unit": "m"}
    json.dumps(result.to_dict(), allow_nan=False)  # a point that is not finite is null, never NaN


@pytest.mark.parametrize("spec", SPECS, ids=lambda spec: spec.id)
def test_every_check_writes_its_curves_as_columns(capsys: pytest.CaptureFixture[str], spec: CheckSpec) -> None:
    code, out, err = run(capsys, *demo_argv(spec), "--csv", "-")
    assert code == 0
    _, json_out, _ = run(capsys, *demo_argv(spec), "--json")
    curves = json.loads(json_out)["series"]
    if not curves:
        assert out == "" and "makes no curves" in err and err.count("\n") == 1
        return
    assert err == ""
    names, units, columns = parse(out)
    assert sorted(names) == sorted(curves)
    assert units == [curves[name]["unit"] for name in names]
    declared = {curve.name: curve.against for curve in spec.series}
    for index, name in enumerate(names):
        if declared[name] is not None:
            assert declared[name] in names[:index], f"{name} comes before its abscissa {declared[name]}"
    assert len(columns[0]) == max(len(curve["values"]) for curve in curves.values())
    for name, column in zip(names, columns, strict=True):
        values = curves[name]["values"]
        assert column[len(values):] == [""] * (len(column) - len(values)), name
        assert [float(cell) for cell in column[:len(values)]] == values, name  # SI, every digit kept


def test_a_period_grid_beside_a_time_history(capsys: pytest.CaptureFixture[str]) -> None:
    code, out, _ = run(capsys, *SPECTRUM, "--csv", "-")
    assert code == 0
    names, units, columns = parse(out)
    assert names[:6] == ["period", "sd", "sv", "psv", "psa", "total_acceleration"]
    assert names[6:8] == ["time", "ground_acceleration"] and "response_displacement" in names
    assert units[:2] == ["s", "m"] and units[names.index("psa")] == "m/s^2"
    assert sum(cell != "" for cell in columns[0]) == 200  # the default grid
    assert all(cell != "" for cell in columns[names.index("time")])  # the longest curve fills every row


def test_a_file_is_written_beside_the_text(capsys: pytest.CaptureFixture[str], tmp_path: Path) -> None:
    target = tmp_path / "sdof.csv"
    code, out, err = run(capsys, *SDOF, "--csv", str(target))
    assert code == 0 and err == "" and "Natural frequency" in out
    assert target.read_text().startswith("time [s],displacement [m],envelope [m]\n0,0.001,")
    assert [path.name for path in tmp_path.iterdir()] == ["sdof.csv"]  # no temporary file left


def test_json_on_stdout_and_csv_to_the_file(capsys: pytest.CaptureFixture[str], tmp_path: Path) -> None:
    target = tmp_path / "sdof.csv"
    code, out, _ = run(capsys, *SDOF, "--csv", str(target), "--json")
    assert code == 0
    names, _, columns = parse(target.read_text())
    assert [float(cell) for cell in columns[1]] == json.loads(out)["series"]["displacement"]["values"]


def test_an_existing_file_is_kept_without_overwrite(capsys: pytest.CaptureFixture[str], tmp_path: Path) -> None:
    target = tmp_path / "kept.csv"
    target.write_text("minutes of the site meeting\n")
    code, out, err = run(capsys, *SDOF, "--csv", str(target))
    assert code == 2 and out == ""
    assert err.count("\n") == 1 and str(target) in err and "--overwrite" in err
    assert target.read_text() == "minutes of the site meeting\n"
    code, _, _ = run(capsys, *SDOF, "--csv", str(target), "--overwrite")
    assert code == 0 and target.read_text().startswith("time [s],")


@pytest.mark.parametrize("where", ["missing-folder/out.csv", "folder", "notes.txt/out.csv"])
def test_a_path_that_cannot_be_written_is_named(capsys: pytest.CaptureFixture[str], tmp_path: Path,
                                                where: str) -> None:
    (tmp_path / "folder").mkdir()
    (tmp_path / "notes.txt").write_text("a file, not a folder\n")
    target = str(tmp_path / where)
    code, out, err = run(capsys, *SDOF, "--csv", target, "--overwrite")
    assert code == 2 and out == ""
    assert err.count("\n") == 1 and target in err and "Traceback" not in err


@pytest.mark.parametrize(("extra", "message"), [
    (["--csv", "-", "--json"], "standard output"),
    (["--csv", ""], "file name"),
])
def test_usage_that_is_refused(capsys: pytest.CaptureFixture[str], extra: list[str], message: str) -> None:
    code, out, err = run(capsys, *SDOF, *extra)
    assert code == 2 and out == ""
    assert err.count("\n") == 1 and message in err


def test_a_check_without_curves_writes_nothing_and_says_so(capsys: pytest.CaptureFixture[str],
                                                           tmp_path: Path) -> None:
    target = tmp_path / "springs.csv"
    code, out, err = run(capsys, *SPRINGS, "--csv", str(target))
    assert code == 0 and "Stiffness" in out
    assert err == f"fieldmode: member makes no curves: nothing written to {target}\n"
    assert not target.exists()


def test_bad_input_writes_no_file(capsys: pytest.CaptureFixture[str], tmp_path: Path) -> None:
    target = tmp_path / "sdof.csv"
    code, out, err = run(capsys, "sdof", "--mass", "12 kg", "--stiffness", "12 kg", "--csv", str(target))
    assert code == 2 and out == "" and err.count("\n") == 1
    assert not target.exists()
