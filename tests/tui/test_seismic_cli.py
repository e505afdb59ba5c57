"""The earthquake checks on the command line: text, JSON and exit status."""

from __future__ import annotations

import json
import subprocess
import sys
from pathlib import Path

import pytest

from fieldmode.calc.demo import GROUND_MOTION, demo_file
from fieldmode.tui.cli import main

G0 = 9.80665  # Source: NIST SP 811 (2008), standard gravity


def run(capsys: pytest.CaptureFixture[str], *argv: str) -> tuple[int, str, str]:
    try:
        status = main(list(argv))
    except SystemExit as stop:  # argparse usage errors leave through SystemExit
        status = int(stop.code or 0)
    out, err = capsys.readouterr()
    return status, out, err


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
    status, out, _ = run(capsys, "spectrum", str(demo_file(GROUND_MOTION)), "--signal-unit", "g", "--period", "0.53 s", "--json")
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
