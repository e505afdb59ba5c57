"""The command-line contract of DESIGN.md section 5: text, JSON, exit codes."""

from __future__ import annotations

import json
import subprocess
import sys

import pint
import pytest

from fieldmode.calc.checks import SPECS
from fieldmode.tui.cli import main


def run(capsys: pytest.CaptureFixture[str], *argv: str) -> tuple[int, str, str]:
    code = main(list(argv))
    captured = capsys.readouterr()
    return code, captured.out, captured.err


def test_sdof_text_output_has_results_and_caution(capsys: pytest.CaptureFixture[str]) -> None:
    code, out, _ = run(capsys, "sdof", "--mass", "9.6 t", "--stiffness", "42 kN/mm", "--damping", "2 %")
    assert code == 0
    assert "Natural frequency" in out and "10.53 Hz" in out
    assert "licensed" in out


def test_sdof_json_contract(capsys: pytest.CaptureFixture[str]) -> None:
    code, out, _ = run(capsys, "sdof", "--mass", "50 kip", "--stiffness", "45 kip/in", "--json")
    assert code == 0
    data = json.loads(out)
    assert set(data) == {"check", "inputs", "results", "flags", "references", "caution"}
    assert data["inputs"]["mass"]["text"] == "50 kip"
    assert data["results"]["regime"] == {"value": "undamped", "unit": None}
    registry = pint.UnitRegistry()
    for name, entry in data["results"].items():
        if entry["unit"] is not None:
            registry.parse_units(entry["unit"])  # every unit is one pint can read back
            assert isinstance(entry["value"], (float, list)), name
    assert any("read as weight" in flag["text"] for flag in data["flags"])


def test_units_us_changes_text_output_only(capsys: pytest.CaptureFixture[str]) -> None:
    _, out, _ = run(capsys, "sdof", "--mass", "9.6 t", "--stiffness", "42 kN/mm", "--units", "us")
    assert "kip/in" in out


@pytest.mark.parametrize("argv", [
    ["sdof", "--mass", "12 kg", "--stiffness", "12 kg"],
    ["sdof", "--mass", "", "--stiffness", "8 kN/mm"],
    ["sdof", "--mass", "nan t", "--stiffness", "8 kN/mm"],
    ["sdof", "--mass", "1e999 t", "--stiffness", "8 kN/mm"],
    ["sdof", "--mass", "9**9**9 t", "--stiffness", "8 kN/mm"],
    ["sdof", "--mass", "x" * 10_000, "--stiffness", "8 kN/mm"],
    ["sdof", "--mass", "9.6 t", "--stiffness", "8 kN/mm", "--static-deflection", "2 mm"],
    ["sdof", "--bogus", "1"],
    ["nosuchcheck"],
    ["convert", "12 blorbs"],
])
def test_bad_input_exits_2_with_one_line(capsys: pytest.CaptureFixture[str], argv: list[str]) -> None:
    code, out, err = run(capsys, *argv)
    assert code == 2
    assert out == ""
    assert len(err.strip().splitlines()) == 1
    assert "Traceback" not in err


def test_convert(capsys: pytest.CaptureFixture[str]) -> None:
    code, out, _ = run(capsys, "convert", "1450 rpm", "Hz")
    assert code == 0 and "24.17 Hz" in out  # Common practice (no source): 1450 / 60 = 24.17


def test_checks_lists_every_check_and_option(capsys: pytest.CaptureFixture[str]) -> None:
    code, out, _ = run(capsys, "checks")
    assert code == 0
    for spec in SPECS:
        assert spec.id in out
        for field in spec.fields:
            assert (field.name if field.positional else field.option) in out


@pytest.mark.parametrize("spec", SPECS, ids=lambda spec: spec.id)
def test_every_check_answers_its_demo_as_json(capsys: pytest.CaptureFixture[str], spec) -> None:  # noqa: ANN001
    argv = [spec.id]
    for field in spec.fields:
        if field.default:
            argv += [field.default] if field.positional else [field.option, field.default]
    code, out, _ = run(capsys, *argv, "--json")
    assert code == 0
    assert json.loads(out)["check"] == spec.id


def test_console_script_exit_status_in_a_real_process() -> None:
    done = subprocess.run([sys.executable, "-m", "fieldmode.tui.cli", "sdof", "--mass", "12 kg", "--stiffness", "12 kg"],
                          capture_output=True, text=True, check=False)
    assert done.returncode == 2
    assert done.stderr.count("\n") == 1 and "Traceback" not in done.stderr


def test_calc_never_imports_the_ui(tmp_path) -> None:
    code = ("import sys\n"
            "from fieldmode.calc.checks import SPECS\n"
            "[s.evaluate(s.demo_texts()) for s in SPECS]\n"
            "bad = [m for m in sys.modules if m.split('.')[0] in ('textual', 'plotext', 'textual_plotext')\n"
            "       or m.startswith('fieldmode.tui')]\n"
            "print(bad)")
    done = subprocess.run([sys.executable, "-c", code], capture_output=True, text=True, check=True, cwd=tmp_path)
    assert done.stdout.strip() == "[]"
