"""Array-valued results shown as comma lists (text output) and as lists (JSON)."""

from __future__ import annotations

import numpy as np

from fieldmode.calc.framework.result import Value
from fieldmode.calc.framework.units import format_value


def test_one_unit_for_the_whole_list_chosen_by_the_largest_value() -> None:
    # Common practice (no source): one unit per list, 4 significant figures each
    assert format_value(np.array([0.0191, 0.0359, 0.0474]), "length") == "19.10, 35.90, 47.40 mm"
    assert format_value(np.array([0.5, 1.5]), "time") == "0.5000, 1.500 s"


def test_rows_of_a_two_dimensional_array() -> None:
    shown = format_value(np.array([[0.4, 1.0], [-1.0, 1.0]]), "number")
    assert shown.split("; ") == ["0.4000, 1.000", "-1.000, 1.000"]


def test_whole_numbers_and_scalars() -> None:
    assert format_value(np.array([2.0, 3.0]), "count") == "2, 3"
    assert format_value(24.17, "frequency") == "24.17 Hz"


def test_json_gives_lists() -> None:
    value = Value("Periods", "time", np.array([0.569, 0.225]))
    assert value.si() == [0.569, 0.225]
