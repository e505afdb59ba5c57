"""Results as the JSON contract gives them."""

from __future__ import annotations

import numpy as np

from fieldmode.calc.framework.result import Value


def test_json_gives_lists() -> None:
    value = Value("Periods", "time", np.array([0.569, 0.225]))
    assert value.si() == [0.569, 0.225]
