"""storeys, tmd and footfall on the command line (text, JSON, exit 2) and their charts drawn by real plotext."""

from __future__ import annotations

import json
import re

import plotext
import pytest

from fieldmode.calc.checks import BY_ID
from fieldmode.tui.charts import panels_of
from fieldmode.tui.cli import main

DEMO = {
    "storeys": ["--masses", "310 t, 300 t, 240 t", "--stiffnesses", "180, 160, 120 kN/mm",
                "--heights", "4.5, 3.5, 3.5 m", "--damping", "5 %"],
    "tmd": ["--frequency", "2.1 Hz", "--modal-mass", "18 t", "--damping", "0.6 %", "--mass-ratio", "2 %",
            "--excitation", "force", "--force", "0.3 kN"],
    "footfall": ["--frequency", "2.1 Hz", "--lateral-frequency", "1.05 Hz", "--structure", "footbridge"],
}


def run(capsys: pytest.CaptureFixture[str], *argv: str) -> tuple[int, str, str]:
    code = main(list(argv))
    captured = capsys.readouterr()
    return code, captured.out, captured.err


def test_storeys_text_shows_values_per_storey(capsys: pytest.CaptureFixture[str]) -> None:
    code, out, _ = run(capsys, "storeys", *DEMO["storeys"])
    assert code == 0
    assert re.search(r"Periods\s+[\d.]+, [\d.]+, [\d.]+ m?s", out)
    assert re.search(r"Effective mass\s+[\d.]+, [\d.]+, [\d.]+ %", out)
    shapes = [line for line in out.splitlines() if line.rstrip().endswith("1.000")]
    assert len(shapes) == 3  # one row per mode, each ending at the roof's 1.000


def test_storeys_json_gives_lists(capsys: pytest.CaptureFixture[str]) -> None:
    code, out, _ = run(capsys, "storeys", *DEMO["storeys"], "--json")
    assert code == 0
    results = json.loads(out)["results"]
    assert len(results["periods"]["value"]) == 3 and results["periods"]["unit"] == "s"
    assert len(results["mode_shapes"]["value"]) == 3 and len(results["mode_shapes"]["value"][0]) == 3
    assert isinstance(results["period"]["value"], float)


@pytest.mark.parametrize("check", ["tmd", "footfall"])
def test_text_and_json(capsys: pytest.CaptureFixture[str], check: str) -> None:
    code, out, _ = run(capsys, check, *DEMO[check])
    assert code == 0 and "licensed" in out
    code, out, _ = run(capsys, check, *DEMO[check], "--json")
    assert code == 0 and json.loads(out)["check"] == check


@pytest.mark.parametrize("argv", [
    ["storeys", "--masses", "310 t, 300 t", "--stiffnesses", "180, 160, 120 kN/mm", "--damping", "5 %"],
    ["storeys", "--masses", "", "--stiffnesses", "180 kN/mm", "--damping", "5 %"],
    ["storeys", "--masses", "310 t, 0 t", "--stiffnesses", "180, 160 kN/mm", "--damping", "5 %"],
    ["tmd", "--frequency", "2.1 Hz", "--modal-mass", "18 t", "--damping", "0.6 %", "--mass-ratio", "0"],
    ["tmd", "--frequency", "2.1 Hz", "--modal-mass", "18 t", "--damping", "0.6 %", "--mass-ratio", "70 %"],
    ["footfall", "--frequency", "-2 Hz"],
])
def test_bad_input_exits_2(capsys: pytest.CaptureFixture[str], argv: list[str]) -> None:
    code, out, err = run(capsys, *argv)
    assert code == 2 and out == ""
    assert len(err.strip().splitlines()) == 1 and "Traceback" not in err


@pytest.mark.parametrize("check", ["storeys", "tmd", "footfall"])
@pytest.mark.parametrize("system", ["si", "us"])
def test_charts_build_at_80x24(check: str, system: str) -> None:
    spec = BY_ID[check]
    result = spec.evaluate(spec.demo_texts())
    assert panels_of(check)
    for draw in panels_of(check):
        plotext.clf()
        plotext.plotsize(70, 18)
        draw(plotext, result, system)
        canvas = re.sub(r"\x1b\[[0-9;]*m", "", plotext.build())
        assert len(canvas.splitlines()) == 18
        assert max(len(line) for line in canvas.splitlines()) <= 70


def test_chart_markers_tell_curves_apart_without_colour() -> None:
    spec = BY_ID["storeys"]
    result = spec.evaluate(spec.demo_texts())
    plotext.clf()
    plotext.plotsize(70, 18)
    panels_of("storeys")[0](plotext, result, "si")
    canvas = re.sub(r"\x1b\[[0-9;]*m", "", plotext.build())
    body = "\n".join(canvas.splitlines()[1:-2])
    assert all(marker in body for marker in "ox+")


def test_footfall_chart_without_lateral_frequencies() -> None:
    spec = BY_ID["footfall"]
    result = spec.evaluate({"frequency": "7.5 Hz", "structure": "floor"})
    for draw in panels_of("footfall"):
        plotext.clf()
        plotext.plotsize(70, 18)
        draw(plotext, result, "si")
        assert plotext.build()


@pytest.mark.parametrize(("size", "rows"), [((70, 18), "WRJSH"), ((47, 11), "WRJSH")])
def test_footfall_rows_stay_visible_in_a_small_panel(size: tuple[int, int], rows: str) -> None:
    spec = BY_ID["footfall"]
    result = spec.evaluate(spec.demo_texts())
    plotext.clf()
    plotext.plotsize(*size)
    panels_of("footfall")[0](plotext, result, "si")
    canvas = re.sub(r"\x1b\[[0-9;]*m", "", plotext.build())
    labels = {line.split("┤")[0].strip() for line in canvas.splitlines() if "┤" in line}
    assert set(rows) <= labels
