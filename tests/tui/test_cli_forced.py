"""`fieldmode forced` on the command line: text, JSON, SI and US input, bad input."""

from __future__ import annotations

import json
import math

import pytest

from fieldmode.tui.cli import main

FAN = ["forced", "--mass", "9.6 t", "--stiffness", "42 kN/mm", "--damping", "2 %", "--frequency", "740 rpm",
       "--unbalance", "0.35 kg m"]
NAMES = {"frequency_ratio", "amplification", "phase", "static_displacement", "amplitude", "velocity_amplitude",
         "acceleration_amplitude", "transmitted_force", "peak_amplification", "peak_frequency", "natural_frequency"}


def run(capsys: pytest.CaptureFixture[str], *argv: str) -> tuple[int, str, str]:
    code = main(list(argv))
    captured = capsys.readouterr()
    return code, captured.out, captured.err


def test_fan_as_text(capsys: pytest.CaptureFixture[str]) -> None:
    code, out, err = run(capsys, *FAN)
    assert code == 0 and err == ""
    assert "!! WARNING: operating within +/-20 % of resonance" in out
    assert "run-up" in out and "licensed" in out


def test_fan_as_json(capsys: pytest.CaptureFixture[str]) -> None:
    code, out, _ = run(capsys, *FAN, "--json")
    assert code == 0
    data = json.loads(out)
    assert set(data["results"]) >= NAMES
    assert data["results"]["phase"]["unit"] == "deg"
    assert data["results"]["amplitude"]["unit"] == "m"
    r = (740 / 60) / (math.sqrt(42e6 / 9600) / (2 * math.pi))
    # Source: Chopra, Dynamics of Structures, sec. 3.2: R_d = 1/sqrt((1-r^2)^2 + (2 zeta r)^2)
    assert data["results"]["amplification"]["value"] == pytest.approx(1 / math.hypot(1 - r**2, 0.04 * r))


def test_us_input_gives_the_same_json(capsys: pytest.CaptureFixture[str]) -> None:
    _, si, _ = run(capsys, *FAN, "--json")
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
def test_bad_input_exits_2_with_one_line(capsys: pytest.CaptureFixture[str], change: list[str]) -> None:
    code, out, err = run(capsys, *FAN, *change)
    assert code == 2 and out == ""
    assert len(err.strip().splitlines()) == 1 and "Traceback" not in err
