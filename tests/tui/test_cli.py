"""The command line: text, JSON, exit status, every check's options, bad input and bad files."""

from __future__ import annotations

import json
import math
import re
import subprocess
import sys
from pathlib import Path

import numpy as np
import pint
import pytest

from fieldmode.calc.checks import CHECK_IDS, SPECS
from fieldmode.calc.demo import GROUND_MOTION, HEEL_DROP, demo_file
from fieldmode.calc.framework.kinds import KINDS
from fieldmode.tui.cli import main


def run(capsys: pytest.CaptureFixture[str], *argv: str) -> tuple[int, str, str]:
    code = main(list(argv))
    captured = capsys.readouterr()
    return code, captured.out, captured.err


def write(tmp_path: Path, name: str, content: str | bytes) -> str:
    path = tmp_path / name
    if isinstance(content, bytes):
        path.write_bytes(content)
    else:
        path.write_text(content)
    return str(path)


FORCED_FAN = ["forced", "--mass", "9.6 t", "--stiffness", "42 kN/mm", "--damping", "2 %", "--frequency", "740 rpm",
       "--unbalance", "0.35 kg m"]


FORCED_NAMES = {"frequency_ratio", "amplification", "phase", "static_displacement", "amplitude", "velocity_amplitude",
         "acceleration_amplitude", "transmitted_force", "peak_amplification", "peak_frequency", "natural_frequency"}


ISOLATE_FAN = ["isolate", "--frequency", "740 rpm", "--mass", "9.6 t", "--mounts", "4", "--damping", "2 %",
       "--target-isolation", "90 %"]


ISOLATE_NAMES = {"frequency_ratio", "transmissibility", "isolation", "required_natural_frequency", "required_stiffness",
         "stiffness_per_mount", "static_deflection", "peak_transmissibility"}


BEAM = ["member", "--element", "beam", "--length", "7.2 m", "--second-moment", "29000 cm^4", "--material", "steel",
        "--mass-per-length", "1.2 t/m"]


G0 = 9.80665  # Source: NIST SP 811 (2008), standard gravity


DYNAMICS_DEMO = {
    "storeys": ["--masses", "310 t, 300 t, 240 t", "--stiffnesses", "180, 160, 120 kN/mm",
                "--heights", "4.5, 3.5, 3.5 m", "--damping", "5 %"],
    "tmd": ["--frequency", "2.1 Hz", "--modal-mass", "18 t", "--damping", "0.6 %", "--mass-ratio", "2 %",
            "--excitation", "force", "--force", "0.3 kN"],
    "footfall": ["--frequency", "2.1 Hz", "--lateral-frequency", "1.05 Hz", "--structure", "footbridge"],
}


def test_sdof_text_output_has_results_and_caution(capsys: pytest.CaptureFixture[str]) -> None:
    code, out, _ = run(capsys, "sdof", "--mass", "9.6 t", "--stiffness", "42 kN/mm", "--damping", "2 %")
    assert code == 0
    assert "Natural frequency" in out and "10.53 Hz" in out
    assert "licensed" in out


def test_sdof_json_contract(capsys: pytest.CaptureFixture[str]) -> None:
    code, out, _ = run(capsys, "sdof", "--mass", "50 kip", "--stiffness", "45 kip/in", "--json")
    assert code == 0
    data = json.loads(out)
    assert set(data) == {"check", "inputs", "results", "series", "flags", "references", "caution"}
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


def test_convert_mils(capsys: pytest.CaptureFixture[str]) -> None:
    code, out, _ = run(capsys, "convert", "5 mil", "mm")
    # From memory: NIST SP 811 (2008), B.8: mil (0.001 in) = 2.54E-05 m, so 5 mil = 0.127 mm
    assert code == 0 and out.strip() == "5 mil = 0.1270 mm  (mil read as 0.001 in)"
    code, out, _ = run(capsys, "convert", "0.127 mm", "mil")
    assert code == 0 and out.strip() == "0.127 mm = 5.000 mil"


def test_the_units_option_picks_the_steel_preset(capsys: pytest.CaptureFixture[str]) -> None:
    beam = ["member", "--element", "beam", "--length", "7.2 m", "--second-moment", "29000 cm^4", "--material", "steel"]
    moduli = {}
    for system in ("si", "us"):
        code, out, _ = run(capsys, *beam, "--units", system, "--json")
        assert code == 0
        moduli[system] = json.loads(out)["results"]["modulus"]
    # Source: EN 1993-1-1:2005 3.2.6(1), E = 210 GPa; the JSON stays SI whatever the units
    assert moduli["si"] == {"value": pytest.approx(210e9), "unit": "Pa"}
    # From memory: AISC 360, E = 29,000 ksi; Source: NIST SP 811 (2008), B.9 for lbf and in
    assert moduli["us"] == {"value": pytest.approx(29e6 * 4.4482216152605 / 0.0254**2), "unit": "Pa"}


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
    command = [sys.executable, "-m", "fieldmode.tui.cli", "sdof", "--mass", "12 kg", "--stiffness", "12 kg"]
    done = subprocess.run(command, capture_output=True, text=True, check=False)
    assert done.returncode == 2
    assert done.stderr.count("\n") == 1 and "Traceback" not in done.stderr


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


def test_fan_as_text(capsys: pytest.CaptureFixture[str]) -> None:
    code, out, err = run(capsys, *FORCED_FAN)
    assert code == 0 and err == ""
    assert "!! WARNING: operating within +/-20 % of resonance" in out
    assert "run-up" in out and "licensed" in out


def test_fan_as_json(capsys: pytest.CaptureFixture[str]) -> None:
    code, out, _ = run(capsys, *FORCED_FAN, "--json")
    assert code == 0
    data = json.loads(out)
    assert set(data["results"]) >= FORCED_NAMES
    assert data["results"]["phase"]["unit"] == "deg"
    assert data["results"]["amplitude"]["unit"] == "m"
    r = (740 / 60) / (math.sqrt(42e6 / 9600) / (2 * math.pi))
    # Source: Chopra, Dynamics of Structures, sec. 3.2: R_d = 1/sqrt((1-r^2)^2 + (2 zeta r)^2)
    assert data["results"]["amplification"]["value"] == pytest.approx(1 / math.hypot(1 - r**2, 0.04 * r))


def test_us_input_gives_the_same_json(capsys: pytest.CaptureFixture[str]) -> None:
    _, si, _ = run(capsys, *FORCED_FAN, "--json")
    # Source: NIST SP 811 (2008), B.9: 1 lbf = 4.4482216152605 N, 1 in = 0.0254 m, 1 lb = 0.45359237 kg
    code, us, _ = run(capsys, "forced", "--mass", f"{9600 * 9.80665 / 4448.2216152605!r} kip",
                      "--stiffness", f"{42e6 * 0.0254 / 4448.2216152605!r} kip/in", "--damping", "0.02",
                      "--frequency", f"{740 / 60!r} Hz", "--unbalance", f"{0.35 / (0.45359237 * 0.0254)!r} lb in",
                      "--json")
    assert code == 0
    for name, entry in json.loads(si)["results"].items():
        assert json.loads(us)["results"][name]["value"] == pytest.approx(entry["value"], rel=1e-9)


def test_force_amplitude_in_us_text(capsys: pytest.CaptureFixture[str]) -> None:
    code, out, _ = run(capsys, "forced", "--mass", "21000 lb", "--stiffness", "240 kip/in", "--damping", "2 %",
                       "--frequency", "5 Hz", "--force", "500 lbf", "--units", "us")
    assert code == 0 and "lbf" in out and " in" in out


@pytest.mark.parametrize("change", [
    ["--mass", "0 t"],
    ["--stiffness", "0 kN/mm"],
    ["--damping", "-2 %"],
    ["--frequency", "740 m"],
    ["--force", "2 kN"],
    ["--unbalance", "lots"],
])
def test_bad_input_exits_2_with_one_line_forced(capsys: pytest.CaptureFixture[str], change: list[str]) -> None:
    code, out, err = run(capsys, *FORCED_FAN, *change)
    assert code == 2 and out == ""
    assert len(err.strip().splitlines()) == 1 and "Traceback" not in err


def test_target_design_as_text(capsys: pytest.CaptureFixture[str]) -> None:
    code, out, err = run(capsys, *ISOLATE_FAN)
    assert code == 0 and err == ""
    assert "Required stiffness" in out and "90.00 %" in out
    assert "licensed" in out


def test_target_design_as_json(capsys: pytest.CaptureFixture[str]) -> None:
    code, out, _ = run(capsys, *ISOLATE_FAN, "--json")
    assert code == 0
    results = json.loads(out)["results"]
    assert set(results) >= ISOLATE_NAMES
    assert results["isolation"] == {"value": pytest.approx(0.9), "unit": "1"}
    assert results["stiffness_per_mount"]["value"] == pytest.approx(results["required_stiffness"]["value"] / 4)


def test_given_mounts_in_us_units(capsys: pytest.CaptureFixture[str]) -> None:
    code, out, _ = run(capsys, "isolate", "--frequency", "740 rpm", "--mass", "21164 lb", "--mounts", "4",
                       "--damping", "5 %", "--stiffness", "30 kip/in", "--json")
    assert code == 0
    results = json.loads(out)["results"]
    # Source: NIST SP 811 (2008), B.9 (1 lb = 0.45359237 kg, 1 kip/in = 175126.8 N/m); Chopra eq. 3.5.3
    r = (740 / 60) / (math.sqrt(30 * 4448.2216152605 / 0.0254 / (21164 * 0.45359237)) / (2 * math.pi))
    assert results["frequency_ratio"]["value"] == pytest.approx(r)
    assert results["transmissibility"]["value"] == pytest.approx(math.hypot(1, 0.1 * r) / math.hypot(1 - r**2, 0.1 * r))
    assert "required_stiffness" not in results


def test_amplifying_mounts_are_flagged_in_text(capsys: pytest.CaptureFixture[str]) -> None:
    code, out, _ = run(capsys, "isolate", "--frequency", "740 rpm", "--mass", "9.6 t", "--mounts", "4",
                       "--damping", "2 %", "--stiffness", "42 kN/mm", "--units", "us")
    assert code == 0
    assert "sqrt(2)" in out and "amplify" in out and "kip/in" in out


@pytest.mark.parametrize("change", [
    ["--mounts", "0"],
    ["--mounts", "2.5"],
    ["--target-isolation", "0 %"],
    ["--target-isolation", "100 %"],
    ["--damping", "-1 %"],
    ["--mass", "0 kg"],
    ["--frequency", "9.6 t"],
])
def test_bad_input_exits_2_with_one_line_isolate(capsys: pytest.CaptureFixture[str], change: list[str]) -> None:
    code, out, err = run(capsys, *ISOLATE_FAN, *change)
    assert code == 2 and out == ""
    assert len(err.strip().splitlines()) == 1 and "Traceback" not in err


def test_beam_as_text(capsys: pytest.CaptureFixture[str]) -> None:
    code, out, err = run(capsys, *BEAM)
    assert code == 0 and err == ""
    # Source: 48 EI/L^3 = 48 x 210e9 x 2.9e-4 / 7.2^3 = 7.832e6 N/m; f1 = pi/(2 L^2) sqrt(EI/m) = 6.826 Hz
    assert "7.832 kN/mm" in out
    assert "6.826 Hz" in out
    assert "210" in out and "EN 1993-1-1" in out
    assert "licensed" in out


def test_columns_as_json_in_us_units(capsys: pytest.CaptureFixture[str]) -> None:
    code, out, _ = run(capsys, "member", "--element", "columns", "--count", "4", "--length", "12 ft",
                       "--modulus", "29000 ksi", "--second-moment", "200 in^4", "--end-conditions", "cantilever",
                       "--json")
    assert code == 0
    data = json.loads(out)
    # Source: NIST SP 811 B.9 (1 ft = 0.3048 m, 1 in = 0.0254 m, 1 ksi = 6.894757e6 Pa); k = 4 x 3 EI/L^3
    expected = 4 * 3 * 29000 * 6.894757293168e6 * 200 * 0.0254**4 / (12 * 0.3048) ** 3
    assert data["results"]["stiffness"] == {"value": pytest.approx(expected), "unit": "N/m"}
    assert data["results"]["end_conditions"]["value"] == "cantilever"


def test_springs_in_series(capsys: pytest.CaptureFixture[str]) -> None:
    code, out, _ = run(capsys, "member", "--element", "springs", "--springs", "42 kN/mm, 5.2 kN/mm",
                       "--arrangement", "series", "--json")
    assert code == 0
    # Source: Chopra, Dynamics of Structures, sec. 1.3: springs in series
    assert math.isclose(json.loads(out)["results"]["stiffness"]["value"], 1 / (1 / 42e6 + 1 / 5.2e6))


def test_us_text_output(capsys: pytest.CaptureFixture[str]) -> None:
    code, out, _ = run(capsys, *BEAM, "--units", "us")
    assert code == 0 and "kip/in" in out


@pytest.mark.parametrize("change", [
    ["--length", "0 m"],
    ["--length", "7.2 kg"],
    ["--count", "2.5"],
    ["--element", "truss"],
    ["--end-conditions", "cantilever"],
    ["--modulus", "210 GPa"],
])
def test_bad_input_exits_2_with_one_line_member(capsys: pytest.CaptureFixture[str], change: list[str]) -> None:
    code, out, err = run(capsys, *BEAM, *change)
    assert code == 2 and out == ""
    assert len(err.strip().splitlines()) == 1 and "Traceback" not in err


def test_design_spectrum_text(capsys: pytest.CaptureFixture[str]) -> None:
    status, out, _ = run(capsys, "design-spectrum", "--ground-type", "C", "--spectrum-type", "1",
                         "--design-ground-acceleration", "0.16 g", "--damping", "5 %", "--importance", "1.0",
                         "--period", "0.53 s", "--mass", "850 t")
    assert status == 0
    # Source: EN 1998-1:2004 3.2.2.2, eq. 3.3, Table 3.2: 0.16 g x 1.15 x 2.5 = 4.511 m/s^2
    assert "4.511 m/s^2" in out
    assert "constant acceleration" in out
    assert "Seismic screening only" in out


def test_design_spectrum_json(capsys: pytest.CaptureFixture[str]) -> None:
    status, out, _ = run(capsys, "design-spectrum", "--ground-type", "A", "--design-ground-acceleration",
                         "2.5 m/s^2", "--period", "3 s", "--behaviour-factor", "4", "--json")
    data = json.loads(out)
    assert status == 0 and data["check"] == "design-spectrum"
    # Source: EN 1998-1:2004 3.2.2.2, eq. 3.5, Table 3.2 ground A: ag S 2.5 TC TD / T^2
    assert data["results"]["spectral_acceleration"]["value"] == pytest.approx(2.5 * 2.5 * 0.4 * 2.0 / 9)
    assert data["results"]["spectral_acceleration"]["unit"] == "m/s^2"
    assert data["results"]["spectral_displacement"]["unit"] == "m"
    assert data["results"]["branch"]["unit"] is None
    # Source: EN 1998-1:2004 3.2.2.5, eq. 3.16 lower bound beta ag
    assert data["results"]["design_spectral_acceleration"]["value"] == pytest.approx(0.2 * 2.5)
    assert "base_shear" not in data["results"]
    assert data["caution"].startswith("Seismic screening only")


def test_period_json(capsys: pytest.CaptureFixture[str]) -> None:
    status, out, _ = run(capsys, "period", "--height", "11.5 m", "--system", "concrete", "--json")
    data = json.loads(out)
    # Source: EN 1998-1:2004 4.3.3.2.2(3), Ct 0.075 for concrete moment frames
    assert status == 0 and data["results"]["period"]["value"] == pytest.approx(0.075 * 11.5**0.75)


def test_spectrum_demo_file(capsys: pytest.CaptureFixture[str]) -> None:
    status, out, _ = run(capsys, "spectrum", str(demo_file(GROUND_MOTION)), "--signal-unit", "g", "--period", "0.53 s",
                         "--json")
    data = json.loads(out)
    assert status == 0
    assert data["results"]["pga"]["value"] == pytest.approx(0.18 * G0, rel=0.01)
    assert {"pgv", "pgd", "sd", "sv", "psv", "psa", "total_acceleration"} <= set(data["results"])
    assert data["results"]["peak_psa"]["value"] > data["results"]["pga"]["value"]


@pytest.mark.parametrize("argv", [
    ("design-spectrum", "--ground-type", "Z", "--design-ground-acceleration", "0.1 g", "--period", "1"),
    ("design-spectrum", "--ground-type", "C", "--design-ground-acceleration", "0.1 kg", "--period", "1"),
    ("design-spectrum", "--ground-type", "C", "--period", "1"),
    ("period", "--height", "-3 m", "--system", "other"),
    ("spectrum", "/nonexistent/record.csv", "--signal-unit", "g"),
    ("spectrum", "--signal-unit", "g"),
])
def test_bad_input_exits_2(capsys: pytest.CaptureFixture[str], argv: tuple[str, ...]) -> None:
    status, out, err = run(capsys, *argv)
    assert status == 2
    assert err.count("\n") == 1 and "Traceback" not in err
    assert out == ""


def test_whole_process_exit_status(tmp_path: Path) -> None:
    script = Path(sys.executable).parent / "fieldmode"
    bad = subprocess.run([str(script), "spectrum", str(tmp_path / "none.csv"), "--signal-unit", "g"],
                         capture_output=True, text=True, check=False)
    assert bad.returncode == 2 and "Traceback" not in bad.stderr
    good = subprocess.run([str(script), "period", "--height", "20 m", "--system", "other"],
                          capture_output=True, text=True, check=False)
    assert good.returncode == 0 and "EN 1998-1" in good.stdout


def test_storeys_text_shows_values_per_storey(capsys: pytest.CaptureFixture[str]) -> None:
    code, out, _ = run(capsys, "storeys", *DYNAMICS_DEMO["storeys"])
    assert code == 0
    assert re.search(r"Periods\s+[\d.]+, [\d.]+, [\d.]+ m?s", out)
    assert re.search(r"Effective mass\s+[\d.]+, [\d.]+, [\d.]+ %", out)
    shapes = [line for line in out.splitlines() if line.rstrip().endswith("1.000")]
    assert len(shapes) == 3  # one row per mode, each ending at the roof's 1.000


def test_storeys_json_gives_lists(capsys: pytest.CaptureFixture[str]) -> None:
    code, out, _ = run(capsys, "storeys", *DYNAMICS_DEMO["storeys"], "--json")
    assert code == 0
    results = json.loads(out)["results"]
    assert len(results["periods"]["value"]) == 3 and results["periods"]["unit"] == "s"
    assert len(results["mode_shapes"]["value"]) == 3 and len(results["mode_shapes"]["value"][0]) == 3
    assert isinstance(results["period"]["value"], float)


@pytest.mark.parametrize("check", ["tmd", "footfall"])
def test_text_and_json(capsys: pytest.CaptureFixture[str], check: str) -> None:
    code, out, _ = run(capsys, check, *DYNAMICS_DEMO[check])
    assert code == 0 and "licensed" in out
    code, out, _ = run(capsys, check, *DYNAMICS_DEMO[check], "--json")
    assert code == 0 and json.loads(out)["check"] == check


@pytest.mark.parametrize("argv", [
    ["storeys", "--masses", "310 t, 300 t", "--stiffnesses", "180, 160, 120 kN/mm", "--damping", "5 %"],
    ["storeys", "--masses", "", "--stiffnesses", "180 kN/mm", "--damping", "5 %"],
    ["storeys", "--masses", "310 t, 0 t", "--stiffnesses", "180, 160 kN/mm", "--damping", "5 %"],
    ["tmd", "--frequency", "2.1 Hz", "--modal-mass", "18 t", "--damping", "0.6 %", "--mass-ratio", "0"],
    ["tmd", "--frequency", "2.1 Hz", "--modal-mass", "18 t", "--damping", "0.6 %", "--mass-ratio", "70 %"],
    ["footfall", "--frequency", "-2 Hz"],
])
def test_bad_input_exits_2_storeys_tmd_footfall(capsys: pytest.CaptureFixture[str], argv: list[str]) -> None:
    code, out, err = run(capsys, *argv)
    assert code == 2 and out == ""
    assert len(err.strip().splitlines()) == 1 and "Traceback" not in err


@pytest.mark.parametrize(("check", "name"), [("decay", HEEL_DROP), ("spectrum", GROUND_MOTION)])
def test_json_names_the_file_read_by_its_demo_name_with_its_sha256(capsys: pytest.CaptureFixture[str],
                                                                   check: str, name: str) -> None:
    import hashlib

    code, out, err = run(capsys, check, f"demo:{name}", "--json")
    assert code == 0 and err == ""
    content = demo_file(name).read_bytes()
    # Oracle: hashlib.sha256 of the shipped file
    assert json.loads(out)["files"] == [{"path": f"demo:{name}", "bytes": len(content),
                                         "sha256": hashlib.sha256(content).hexdigest()}]
    assert str(demo_file(name).parent) not in out


def test_an_unknown_demo_name_is_one_line_and_status_2(capsys: pytest.CaptureFixture[str]) -> None:
    code, out, err = run(capsys, "decay", "demo:floor.csv")
    assert code == 2 and out == ""
    assert err.count("\n") == 1 and "no demo record 'floor.csv'" in err and "demo:heel_drop_demo.csv" in err


def demo_argv(spec) -> list[str]:  # noqa: ANN001
    """A check's command line with every demo text given."""
    argv = [spec.id]
    for field in spec.fields:
        if field.default:
            argv += [field.default] if field.positional else [field.option, field.default]
    return argv


@pytest.mark.parametrize("command", [[], *([check_id] for check_id in CHECK_IDS)],
                         ids=lambda command: " ".join(command) or "fieldmode")
def test_help_of_fieldmode_and_of_every_check(capsys: pytest.CaptureFixture[str], command: list[str]) -> None:
    """argparse %-formats help: a '5 %' in a field's help must not turn --help into an internal fault."""
    code, out, err = run(capsys, *command, "--help")
    assert code == 0, err
    assert out.startswith("usage: fieldmode") and err == ""
    if command:
        assert "--csv FILE" in out and "--overwrite" in out
        for field in load_spec(command[0]).fields:
            assert (field.name if field.positional else field.option) in out


def load_spec(check_id: str):  # noqa: ANN201
    return next(spec for spec in SPECS if spec.id == check_id)


def test_no_field_takes_an_option_every_check_has() -> None:
    """The options the command line adds to every check (--json, --csv, ...) are not field names."""
    generic = {"--json", "--csv", "--overwrite", "--units", "--help", "--version"}
    for spec in SPECS:
        assert not generic & {field.option for field in spec.fields}, spec.id


def test_percent_signs_reach_the_help_as_typed(capsys: pytest.CaptureFixture[str]) -> None:
    code, out, _ = run(capsys, "isolate", "--help")
    assert code == 0
    assert "rubber about 5 %" in " ".join(out.split()) and "%%" not in out


@pytest.mark.parametrize("spec", SPECS, ids=lambda spec: spec.id)
def test_every_check_gives_its_curves_in_json(capsys: pytest.CaptureFixture[str], spec) -> None:  # noqa: ANN001
    code, out, _ = run(capsys, *demo_argv(spec), "--json")
    assert code == 0
    series = json.loads(out)["series"]
    result = spec.evaluate({field.name: field.default for field in spec.fields if field.default})
    assert list(series) == list(result.series)
    registry = pint.UnitRegistry()
    for name, curve in series.items():
        assert set(curve) == {"values", "unit"}
        assert len(curve["values"]) == len(result.series[name]), name
        assert curve["values"] == pytest.approx(result.series[name].tolist(), rel=1e-15), name
        kind = KINDS[result.series_kinds[name]]
        assert curve["unit"] == (kind.si or "1"), name
        quantity = registry.Quantity(1.0, curve["unit"])  # every unit is one pint can read back
        assert quantity.check(kind.dimension) if kind.dimension else quantity.dimensionless, name


def test_json_curves_are_si_whatever_the_units(capsys: pytest.CaptureFixture[str]) -> None:
    _, si, _ = run(capsys, "sdof", "--mass", "9.6 t", "--stiffness", "42 kN/mm", "--json")
    _, us, _ = run(capsys, "sdof", "--mass", "9.6 t", "--stiffness", "42 kN/mm", "--json", "--units", "us")
    assert json.loads(si)["series"] == json.loads(us)["series"]
    assert json.loads(si)["series"]["displacement"]["unit"] == "m"
    assert json.loads(si)["series"]["displacement"]["values"][0] == pytest.approx(0.001)  # 1 mm start


SPECTRUM_AT = ["spectrum", str(demo_file(GROUND_MOTION)), "--signal-unit", "g", "--periods", "0.2, 0.5, 1 s"]


def table_rows(out: str) -> list[list[str]]:
    lines = out.splitlines()
    start = lines.index("Curves by period") + 1
    return [line.split() for line in lines[start:lines.index("", start)]]


def test_periods_typed_as_a_list_give_a_table_after_the_results(capsys: pytest.CaptureFixture[str]) -> None:
    code, out, _ = run(capsys, *SPECTRUM_AT)
    assert code == 0
    assert out.index("Results") < out.index("Curves by period") < out.index("Method")
    rows = table_rows(out)
    assert rows[0] == ["period", "sd", "sv", "psv", "psa", "total_acceleration"]
    assert rows[1] == ["s", "mm", "mm/s", "mm/s", "m/s^2", "m/s^2"]
    assert [row[0] for row in rows[2:]] == ["0.2000", "0.5000", "1.000"]
    _, json_out, _ = run(capsys, *SPECTRUM_AT, "--json")
    series = json.loads(json_out)["series"]
    assert [float(row[4]) for row in rows[2:]] == pytest.approx(series["psa"]["values"], rel=5e-4)


def test_the_table_follows_the_units_and_carries_the_overlay(capsys: pytest.CaptureFixture[str]) -> None:
    code, out, _ = run(capsys, *SPECTRUM_AT, "--ground-type", "C", "--design-ground-acceleration", "0.16 g",
                       "--units", "us")
    assert code == 0
    rows = table_rows(out)
    assert rows[0][-1] == "design_psa"
    assert rows[1] == ["s", "in", "in/s", "in/s", "g", "g", "g"]


def test_a_period_grid_gives_no_table(capsys: pytest.CaptureFixture[str]) -> None:
    code, out, _ = run(capsys, "spectrum", str(demo_file(GROUND_MOTION)), "--signal-unit", "g")
    assert code == 0 and "Curves by" not in out


@pytest.mark.parametrize("argv", [
    ["sdof", "--mass", "10 t", "--mass", "12 t", "--stiffness", "42 kN/mm"],
    ["sdof", "--mass=10 t", "--stiffness", "42 kN/mm", "--mass", "12 t"],
    ["sdof", "--mass", "10 t", "--stiffness", "42 kN/mm", "--ma", "12 t"],  # an abbreviation argparse accepts
    ["sdof", "--mass", "10 t", "--stiffness", "42 kN/mm", "--mass", "10 t"],  # the same text twice: still refused
    ["sdof", "--mass", "10 t", "--stiffness", "42 kN/mm", "--units", "si", "--units", "us"],
], ids=["twice", "equals-then-space", "abbreviated", "same-text", "units"])
def test_a_repeated_option_is_refused_naming_it(capsys: pytest.CaptureFixture[str], argv: list[str]) -> None:
    """`--mass 10t --mass 12t` kept the last silently: a wrong answer that looks right. Refused, in one line."""
    code, out, err = run(capsys, *argv)
    repeated = "--units" if "--units" in argv else "--mass"
    assert code == 2 and out == ""
    assert err.count("\n") == 1 and "Traceback" not in err
    assert f"{repeated} given more than once" in err


def test_a_repeated_option_with_underscores_names_the_dashed_option(capsys: pytest.CaptureFixture[str]) -> None:
    code, out, err = run(capsys, "sdof", "--mass", "9.6 t", "--static-deflection", "2 mm",
                         "--static-def", "3 mm")
    assert code == 2 and out == "" and err.count("\n") == 1
    assert "--static-deflection given more than once" in err


def test_a_field_the_chosen_element_does_not_use_is_computed_without_it_and_noted(
        capsys: pytest.CaptureFixture[str]) -> None:
    columns = ["member", "--element", "columns", "--count", "4", "--length", "3.6 m", "--material", "steel",
               "--second-moment", "8360 cm^4"]
    code, plain, _ = run(capsys, *columns, "--json")
    code_given, given, err = run(capsys, *columns, "--mass-per-length", "1.2 t/m", "--springs", "5 kN/mm", "--json")
    assert code == code_given == 0 and err == ""
    before, after = json.loads(plain), json.loads(given)
    # Source: Chopra, Dynamics of Structures, sec. 1.3: four fixed-fixed columns k = 4 x 12 EI / h^3
    assert after["results"]["stiffness"]["value"] == pytest.approx(4 * 12 * 210e9 * 8360e-8 / 3.6**3)
    assert after["results"] == before["results"] and after["inputs"] == before["inputs"]
    notes = [flag for flag in after["flags"] if flag not in before["flags"]]
    assert notes == [
        {"level": "caution", "text": "Spring stiffnesses ignored: used only when element is springs (here columns)"},
        {"level": "caution", "text": "Mass per length ignored: used only when element is beam (here columns)"}]
    code, text, _ = run(capsys, *columns, "--mass-per-length", "1.2 t/m")
    assert code == 0 and "!  caution: Mass per length ignored: used only when element is beam" in text


def test_help_says_which_choice_uses_a_field(capsys: pytest.CaptureFixture[str]) -> None:
    code, out, _ = run(capsys, "member", "--help")
    assert code == 0
    assert "(used when --element is beam)" in " ".join(out.split())
