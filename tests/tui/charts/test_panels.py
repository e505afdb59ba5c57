"""Every chart panel of every check: drawn from its demo in SI and US units, within the pane, reading only
the series its check declares; and readable at 80x24: a title, axis labels with units, round tick values.

Panels come from `tui.charts.panels_of`, so a new check's chart is held to the same rules. Readability is
checked at 49x16, about the chart pane at 80x24 (plotext drops a title wider than that)."""

from __future__ import annotations

import math
import re

import numpy as np
import plotext
import pytest
from helpers.charts import SIZE, draw_panels, plot_area, watched

from fieldmode.calc.checks import SPECS
from fieldmode.tui.charts import panels_of
from fieldmode.tui.charts.common import OPERATING_MARKER, ReadableAxes, linear_ticks, log_ticks
from fieldmode.tui.charts.sdof import CYCLES_SHOWN

CHARTED = [spec for spec in SPECS if panels_of(spec.id)]
VARIANTS = [
    ("sdof", {"damping": "150 %"}),
    ("sdof", {"damping": ""}),
    ("forced", {"unbalance": "", "force": "2 kN", "frequency": "4 Hz"}),
    ("forced", {"frequency": "6000 rpm"}),
    ("isolate", {"target_isolation": "", "stiffness": "42 kN/mm"}),
    ("storeys", {"heights": "", "design_ground_acceleration": ""}),
    ("spectrum", {"period": "", "design_ground_acceleration": "", "period_count": "30"}),
    ("design-spectrum", {"behaviour_factor": "", "mass": ""}),
    ("footfall", {"lateral_frequency": "", "structure": "floor"}),
    ("tmd", {"excitation": "ground", "mass_ratio": "5 %"}),
    ("floor", {"frequency": "12 Hz", "damping": "0 %", "effective_weight": "", "pacing_low": "2 Hz",
               "pacing_high": "2 Hz"}),
    ("footbridge", {"lateral_frequency": "", "traffic_class": "TC5"}),
]


def test_a_check_with_curves_has_a_chart_and_one_without_has_none() -> None:
    # Common practice (no source): a curve is drawn where a curve says more than a number
    for spec in SPECS:
        assert bool(panels_of(spec.id)) == bool(spec.series), spec.id


@pytest.mark.parametrize("system", ["si", "us"])
@pytest.mark.parametrize("spec", CHARTED, ids=[spec.id for spec in CHARTED])
def test_every_panel_draws_its_demo_within_the_pane_and_reads_only_declared_series(spec, system) -> None:
    result, series = watched(spec.evaluate(spec.demo_texts()))
    pictures = draw_panels(spec.id, system=system, result=result)
    assert len(pictures) == len(panels_of(spec.id))
    for picture in pictures:
        lines = picture.splitlines()
        assert len(lines) == SIZE[1] and max(len(line) for line in lines) <= SIZE[0]
    declared = {curve.name for curve in spec.series}
    assert series.asked and series.asked <= declared, series.asked - declared


@pytest.mark.parametrize(("check", "change"), VARIANTS)
@pytest.mark.parametrize("system", ["si", "us"])
def test_panels_draw_without_optional_inputs_and_read_only_declared_series(check, change, system) -> None:
    spec = next(s for s in SPECS if s.id == check)
    result, series = watched(spec.evaluate({**spec.demo_texts(), **change}))
    assert all(draw_panels(check, system=system, result=result))
    assert series.asked <= {curve.name for curve in spec.series}


@pytest.mark.parametrize(("check", "change"), [(check, {}) for check in ("sdof", "forced", "isolate")]
                         + [v for v in VARIANTS if v[0] in ("sdof", "forced", "isolate")])
@pytest.mark.parametrize("system", ["si", "us"])
def test_every_panel_marks_the_operating_point_without_colour(check: str, change: dict[str, str], system: str) -> None:
    # Common practice (no source): the operating point is a letter, readable on any terminal
    for picture in draw_panels(check, change, system):
        assert any(OPERATING_MARKER in row for row in plot_area(picture))


@pytest.mark.parametrize("check", ["period", "design-spectrum", "spectrum"])
@pytest.mark.parametrize("system", ["si", "us"])
def test_the_chosen_period_is_marked_without_colour(check: str, system: str) -> None:
    first = draw_panels(check, system=system)[0]
    assert any(OPERATING_MARKER in row for row in plot_area(first))


PANE = (49, 16)
"""About the chart pane at 80x24."""
CASES = [(spec.id, {}) for spec in CHARTED] + VARIANTS
UNIT = re.compile(r"\(([^()]+)\)$")
NUMBER = re.compile(r"^-?\d+(\.\d+)?(e[-+]\d+)?$")


def _drawn(check: str, change: dict[str, str], system: str) -> list[tuple[ReadableAxes, str]]:
    """Each panel drawn on plotext through the axes recorder, with its picture."""
    spec = next(s for s in SPECS if s.id == check)
    result = spec.evaluate({**spec.demo_texts(), **change})
    drawn = []
    for draw in panels_of(check):
        plotext.clf()
        plotext.plotsize(*PANE)
        plotext.theme("clear")
        axes = ReadableAxes(plotext)
        draw.__wrapped__(axes, result, system)  # type: ignore[attr-defined]
        axes.finish()
        drawn.append((axes, plotext.uncolorize(plotext.build())))
    return drawn


def _is_round_sequence(values: list[float], degrees: bool = False) -> bool:
    """1-2-5 steps of a log axis, or equal steps of 1, 2, 2.5 or 5 times a power of ten, each a multiple of it
    (on an angle axis also 15, 30, 45 or 90 degrees)."""
    if all(v > 0 and f"{v:e}"[0] in "125" and float(f"{v:e}"[1:].split("e")[0] or 0) == 0 for v in values):
        return True
    if len(values) < 2:
        return True
    steps = np.diff(sorted(values))
    step = float(steps[0])
    if step <= 0 or not np.allclose(steps, step, rtol=1e-6):
        return False
    mantissa = step / 10 ** math.floor(math.log10(step))
    angle = degrees and any(math.isclose(step, s) for s in (15.0, 30.0, 45.0, 90.0))
    return ((angle or any(math.isclose(mantissa, m) for m in (1.0, 2.0, 2.5, 5.0)))
            and all(math.isclose(v / step, round(v / step), abs_tol=1e-6) for v in values))


def _tick_texts(picture: str) -> tuple[list[str], list[str]]:
    """The y tick labels (left of the frame) and x tick labels (under it) as drawn."""
    lines = picture.splitlines()
    bottom = next(i for i, line in enumerate(lines) if "└" in line)
    y = []
    for line in lines[:bottom]:
        frame = min((line.index(c) for c in "┤├│┌" if c in line), default=None)
        if frame is not None:
            y.append(line[:frame].strip())
    x = lines[bottom + 1].split()
    return [t for t in y if t], x


@pytest.mark.parametrize("system", ["si", "us"])
@pytest.mark.parametrize(("check", "change"), CASES, ids=[f"{c}-{i}" for i, (c, _) in enumerate(CASES)])
def test_every_panel_has_a_title_axis_labels_with_units_and_round_ticks(check, change, system) -> None:
    for axes, picture in _drawn(check, change, system):
        # Common practice (no source): a chart says what it shows and in which units
        assert axes.titles and axes.titles[-1].strip(), picture
        assert axes.titles[-1] in picture, f"title dropped (wider than the pane): {axes.titles[-1]!r}"
        for axis in ("x", "y"):
            label = axes.labels.get(axis, "")
            assert label.strip(), (axis, axes.titles)
            if axes.ticks.get(axis, []) is not None:  # a numeric axis (words on a row axis need no unit)
                assert UNIT.search(label), f"{axis} label without a unit: {label!r}"
            assert label in picture
        # Common practice (no source): ticks at round values (not 25.01, 10.34, 4.28)
        for axis in ("x", "y"):
            ticks = axes.ticks.get(axis, [])
            if ticks:
                assert _is_round_sequence(ticks, axes.labels[axis].endswith("(deg)")), (axis, ticks)
        y_texts, x_texts = _tick_texts(picture)
        for axis, texts in (("y", y_texts), ("x", x_texts)):
            numbers = [float(t) for t in texts if NUMBER.match(t)]
            assert _is_round_sequence(numbers, axes.labels[axis].endswith("(deg)")), (texts, picture)


@pytest.mark.parametrize("damping", ["5 %", "", "2 %", "0.5 %"])
def test_free_response_spans_a_readable_number_of_cycles(damping) -> None:
    spec = next(s for s in SPECS if s.id == "sdof")
    result = spec.evaluate({**spec.demo_texts(), "damping": damping})
    ((axes, picture),) = _drawn("sdof", {"damping": damping}, "si")
    frequency = result.number("damped_frequency") or result.number("natural_frequency")
    span = axes.span("x")
    assert span is not None and frequency
    cycles = (span[1] - span[0]) * frequency
    # Common practice (no source): a cycle needs about 8 columns to read as a wave; the pane is about 49 wide
    assert 3 <= cycles <= CYCLES_SHOWN + 0.01
    plot_columns = len(picture.splitlines()[1].strip()) - 2
    assert plot_columns / cycles >= 7


def test_tick_helpers_give_round_values() -> None:
    # Common practice (no source): 1-2-2.5-5 steps on linear axes, 1-2-5 on log axes
    assert linear_ticks(0.0, 2.27) == [0.0, 0.5, 1.0, 1.5, 2.0]
    assert linear_ticks(-328.0, 335.4) == [-300.0, -200.0, -100.0, 0.0, 100.0, 200.0, 300.0]
    assert linear_ticks(0.0, 0.0123) == [0.0, 0.002, 0.004, 0.006, 0.008, 0.01, 0.012]
    assert linear_ticks(0.0, 0.0123, most=5) == [0.0, 0.0025, 0.005, 0.0075, 0.01]
    assert log_ticks(0.12, 25.01) == [0.2, 0.5, 1.0, 2.0, 5.0, 10.0, 20.0]
    assert log_ticks(0.06, 25.0) == [0.1, 0.2, 0.5, 1.0, 2.0, 5.0, 10.0, 20.0]
    assert log_ticks(0.001, 1000.0) == [0.001, 0.01, 0.1, 1.0, 10.0, 100.0, 1000.0]
    assert log_ticks(0.01, 1e6) == [0.01, 1.0, 100.0, 10000.0, 1e6]
    assert linear_ticks(1.0, 1.0) == [] and log_ticks(-1.0, 10.0) == []
