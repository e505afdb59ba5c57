"""`fieldmode decay FILE` and `fieldmode decrement` through the generated command line, and the decay charts."""

from __future__ import annotations

import json
import math
import subprocess
import sys
from pathlib import Path

import numpy as np
import pytest

from fieldmode.calc.checks import BY_ID
from fieldmode.calc.demo import HEEL_DROP, demo_file
from fieldmode.tui.charts import panels_of
from fieldmode.tui.cli import main


def run(capsys: pytest.CaptureFixture[str], *argv: str) -> tuple[int, str, str]:
    code = main(list(argv))
    captured = capsys.readouterr()
    return code, captured.out, captured.err


def test_decay_with_a_positional_file_prints_results(capsys: pytest.CaptureFixture[str]) -> None:
    code, out, err = run(capsys, "decay", str(demo_file(HEEL_DROP)))
    assert code == 0 and err == ""
    for label in ("Natural frequency", "Damping ratio (decay fit)", "95 % low", "Half-power damping ratio",
                  "Zero-crossing frequency", "Fit R^2"):
        assert label in out
    assert "licensed" in out


def test_decay_counts_are_whole_numbers(capsys: pytest.CaptureFixture[str]) -> None:
    """Peaks and samples are counts: shown without decimals."""
    code, out, _ = run(capsys, "decay", str(demo_file(HEEL_DROP)))
    assert code == 0
    for label in ("Peaks fitted", "Samples"):
        line = next(line for line in out.splitlines() if label in line)
        assert line.split()[-1].isdigit(), line


def test_decay_json_has_the_contract_names(capsys: pytest.CaptureFixture[str]) -> None:
    code, out, _ = run(capsys, "decay", str(demo_file(HEEL_DROP)), "--band", "5 9", "--signal-unit", "m/s^2", "--json")
    assert code == 0
    data = json.loads(out)
    results = data["results"]
    for name in ("natural_frequency", "damping_ratio", "damping_ratio_low", "damping_ratio_high", "log_decrement",
                 "cycles", "half_power_damping_ratio", "fit_r_squared", "zero_crossing_frequency"):
        assert isinstance(results[name]["value"], float), name
    assert results["natural_frequency"]["unit"] == "Hz"
    assert results["damping_ratio"]["unit"] == "1"
    assert data["inputs"]["band"]["text"] == "5 9"
    assert any("as asked" in flag["text"] for flag in data["flags"])


def write(tmp_path: Path, name: str, content: str | bytes) -> str:
    path = tmp_path / name
    if isinstance(content, bytes):
        path.write_bytes(content)
    else:
        path.write_text(content)
    return str(path)


@pytest.mark.parametrize(("content", "message"), [
    (None, "no such file"),
    ("t,a\n0,1\n0.01,2\n0.02,x\n0.03,1\n", "line 4: 'x' in column 'a' is not a number"),
    (b"\x00\x01\x02binary", "binary content"),
    ("".join(f"{i % 7}\n" for i in range(100)), "only one column and no sample rate"),
    ("t,a\n" + "".join(f"{i / 100},{x:.4f}\n" for i, x in enumerate(np.random.default_rng(1).normal(size=300))),
     "no free decay found|no decay after it|fewer than 3 cycles"),
], ids=["missing", "text-cell", "binary", "one-column", "no-decay"])
def test_bad_files_exit_2_with_one_line(capsys: pytest.CaptureFixture[str], tmp_path: Path,
                                        content: str | bytes | None, message: str) -> None:
    path = str(tmp_path / "missing.csv") if content is None else write(tmp_path, "rec.csv", content)
    code, out, err = run(capsys, "decay", path)
    assert code == 2 and out == ""
    assert err.count("\n") == 1 and "Traceback" not in err
    assert path in err
    assert any(part in err for part in message.split("|"))


def test_decay_without_a_file_is_a_usage_error(capsys: pytest.CaptureFixture[str]) -> None:
    code, _, err = run(capsys, "decay")
    assert code == 2 and "file" in err


def test_decrement_on_the_command_line(capsys: pytest.CaptureFixture[str]) -> None:
    code, out, _ = run(capsys, "decrement", "--first-peak", "0.32", "--later-peak", "0.146", "--cycles", "5",
                       "--json")
    assert code == 0
    data = json.loads(out)
    # From memory: Chopra, Dynamics of Structures, sec. 2.2: delta = (1/5) ln(0.32 / 0.146)
    assert data["results"]["log_decrement"]["value"] == pytest.approx(math.log(0.32 / 0.146) / 5, rel=1e-12)


def test_the_installed_command_runs_a_decay_file(tmp_path: Path) -> None:
    script = Path(sys.executable).parent / "fieldmode"
    done = subprocess.run([str(script), "decay", str(demo_file(HEEL_DROP)), "--json"], capture_output=True, text=True,
                          timeout=60, cwd=tmp_path)
    assert done.returncode == 0, done.stderr
    assert json.loads(done.stdout)["check"] == "decay"


def test_checks_lists_the_positional_file(capsys: pytest.CaptureFixture[str]) -> None:
    code, out, _ = run(capsys, "checks")
    assert code == 0
    assert "decay" in out and "    file " in out and "--band" in out and "decrement" in out


@pytest.mark.parametrize("system", ["si", "us"])
def test_decay_charts_draw_with_plotext(system: str) -> None:
    import plotext as plt

    result = BY_ID["decay"].evaluate(BY_ID["decay"].demo_texts())
    assert len(panels_of("decay")) == 2
    texts = []
    for draw in panels_of("decay"):
        plt.clf()
        plt.plotsize(49, 16)  # the chart pane at 80x24: plotext drops a title wider than the chart
        draw(plt, result, system)
        texts.append(plt.build())
    record, spectrum = texts
    assert "Record (" in record and "envelope" in record and "peaks x" in record
    assert "half-power" in spectrum and "6.6" in spectrum
    assert "(m/s^2)" in record or "(mm/s^2)" in record or "(g)" in record


def test_decay_charts_survive_a_result_without_series() -> None:
    import plotext as plt

    result = BY_ID["decrement"].evaluate(BY_ID["decrement"].demo_texts())
    for draw in panels_of("decay"):
        plt.clf()
        plt.plotsize(60, 18)
        draw(plt, result, "si")
        assert isinstance(plt.build(), str)
