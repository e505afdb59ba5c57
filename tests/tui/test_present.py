"""The presenter's table of curves: one engineering unit per column, 4 significant figures, aligned."""

from __future__ import annotations

import numpy as np
import pytest

from fieldmode.calc.framework.reading import Inputs
from fieldmode.calc.framework.result import Result
from fieldmode.calc.framework.spec import CheckSpec, Series
from fieldmode.tui.present import table_columns, table_lines


def _spectrum_like(inputs: Inputs) -> Result:
    return inputs.result({}, series={"period": np.array([0.2, 0.5, 1.0]), "sd": np.array([0.0072, 0.023, 0.0486]),
                                     "psa": np.array([7.102, 3.625, 1.917]), "count": np.array([1.0, 2.0, 3.0])},
                         table=("period", "sd", "psa"))


SPEC = CheckSpec("table", "Table", "a spectrum-like table", (), _spectrum_like,
                 series=(Series("period", "Period", "time"), Series("sd", "sd", "length", "period"),
                         Series("psa", "psa", "acceleration", "period"), Series("count", "n", "count", "period")))


def test_each_column_in_one_unit_of_the_system() -> None:
    result = SPEC.evaluate({})
    assert table_columns(result, "si") == [("period", "s", ["0.2000", "0.5000", "1.000"]),
                                           ("sd", "mm", ["7.200", "23.00", "48.60"]),
                                           ("psa", "m/s^2", ["7.102", "3.625", "1.917"])]
    us = dict((name, (unit, cells)) for name, unit, cells in table_columns(result, "us"))
    assert us["sd"] == ("in", ["0.2835", "0.9055", "1.913"])  # Source: NIST SP 811 (2008), 1 in = 0.0254 m
    assert us["psa"][0] == "g"


def test_lines_are_aligned_names_units_then_rows() -> None:
    lines = table_lines(SPEC.evaluate({}), "si")
    assert lines == ["period     sd    psa",
                     "     s     mm  m/s^2",
                     "0.2000  7.200  7.102",
                     "0.5000  23.00  3.625",
                     " 1.000  48.60  1.917"]


def test_no_table_no_lines() -> None:
    def plain(inputs: Inputs) -> Result:
        return inputs.result({}, series={"period": np.array([0.2])})

    spec = CheckSpec("plain", "Plain", "no table", (), plain, series=(Series("period", "Period", "time"),))
    assert table_lines(spec.evaluate({}), "si") == []


def _tables(table: tuple[str, ...]) -> CheckSpec:
    def compute(inputs: Inputs) -> Result:
        return inputs.result({}, series={"period": np.array([0.2, 0.5]), "sd": np.array([0.01, 0.02]),
                                         "count": np.array([1.0, 2.0]), "short": np.array([1.0])}, table=table)

    return CheckSpec("t", "T", "tables", (), compute, series=(
        Series("period", "Period", "time"), Series("sd", "sd", "length", "period"),
        Series("count", "n", "count", "period"), Series("short", "s", "number", "period"),
        Series("missing", "m", "number", "period")))


@pytest.mark.parametrize("table", [
    ("sd", "period"),       # the abscissa is not first
    ("period", "missing"),  # a curve not made
    ("period", "short"),    # a curve of another length
])
def test_a_table_must_be_an_abscissa_and_its_curves(table: tuple[str, ...]) -> None:
    with pytest.raises(ValueError, match="table"):
        _tables(table).evaluate({})


def test_counts_are_tabled_without_decimals() -> None:
    result = _tables(("period", "count", "sd")).evaluate({})
    assert result.table == ("period", "count", "sd")
    assert table_columns(result, "si")[1] == ("count", "", ["1", "2"])
