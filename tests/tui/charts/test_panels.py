"""Every chart panel of every check: drawn from its demo in SI and US units, within the pane, reading only
the series its check declares."""

from __future__ import annotations

import pytest
from helpers.charts import SIZE, draw_panels, plot_area, watched

from fieldmode.calc.checks import SPECS
from fieldmode.tui.charts import panels_of
from fieldmode.tui.charts.common import OPERATING_MARKER

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
