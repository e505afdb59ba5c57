"""`fieldmode member` on the command line: text, JSON, SI and US input, bad input."""

from __future__ import annotations

import json
import math

import pytest

from fieldmode.tui.cli import main

BEAM = ["member", "--element", "beam", "--length", "7.2 m", "--second-moment", "29000 cm^4", "--material", "steel",
        "--mass-per-length", "1.2 t/m"]


def run(capsys: pytest.CaptureFixture[str], *argv: str) -> tuple[int, str, str]:
    code = main(list(argv))
    captured = capsys.readouterr()
    return code, captured.out, captured.err


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
def test_bad_input_exits_2_with_one_line(capsys: pytest.CaptureFixture[str], change: list[str]) -> None:
    code, out, err = run(capsys, *BEAM, *change)
    assert code == 2 and out == ""
    assert len(err.strip().splitlines()) == 1 and "Traceback" not in err
