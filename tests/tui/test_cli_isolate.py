"""`fieldmode isolate` on the command line: text, JSON, SI and US input, bad input."""

from __future__ import annotations

import json
import math

import pytest

from fieldmode.tui.cli import main

FAN = ["isolate", "--frequency", "740 rpm", "--mass", "9.6 t", "--mounts", "4", "--damping", "2 %",
       "--target-isolation", "90 %"]
NAMES = {"frequency_ratio", "transmissibility", "isolation", "required_natural_frequency", "required_stiffness",
         "stiffness_per_mount", "static_deflection", "peak_transmissibility"}


def run(capsys: pytest.CaptureFixture[str], *argv: str) -> tuple[int, str, str]:
    code = main(list(argv))
    captured = capsys.readouterr()
    return code, captured.out, captured.err


def test_target_design_as_text(capsys: pytest.CaptureFixture[str]) -> None:
    code, out, err = run(capsys, *FAN)
    assert code == 0 and err == ""
    assert "Required stiffness" in out and "90.00 %" in out
    assert "licensed" in out


def test_target_design_as_json(capsys: pytest.CaptureFixture[str]) -> None:
    code, out, _ = run(capsys, *FAN, "--json")
    assert code == 0
    results = json.loads(out)["results"]
    assert set(results) >= NAMES
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
def test_bad_input_exits_2_with_one_line(capsys: pytest.CaptureFixture[str], change: list[str]) -> None:
    code, out, err = run(capsys, *FAN, *change)
    assert code == 2 and out == ""
    assert len(err.strip().splitlines()) == 1 and "Traceback" not in err
