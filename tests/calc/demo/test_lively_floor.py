"""The shipped demo record of the lively office floor is the one its generator makes."""

from __future__ import annotations

import numpy as np

from fieldmode.calc.checks import BY_ID
from fieldmode.calc.demo import LIVELY_FLOOR, demo_file, demo_path
from fieldmode.calc.demo.lively_floor import demo_text

OCCUPANTS = BY_ID["occupants"]


def test_demo_record_ships_is_small_and_reproducible() -> None:
    path = demo_file(LIVELY_FLOOR)
    assert OCCUPANTS.field("file").default == "demo:lively_floor_demo.csv"
    assert demo_path(OCCUPANTS.field("file").default) == path
    assert path.stat().st_size <= 300_000
    shipped = path.read_text(encoding="utf-8")
    regenerated = demo_text()
    assert shipped.splitlines()[:4] == regenerated.splitlines()[:4]
    assert shipped.splitlines()[3] == "time [s],acceleration [mg]"
    assert "generated demo record" in shipped.splitlines()[0]
    ours = np.loadtxt(path, delimiter=",", skiprows=4)
    again = np.loadtxt(regenerated.splitlines()[4:], delimiter=",")
    # Common practice (no source): regenerated within one unit of the last printed digit
    np.testing.assert_allclose(ours, again, atol=1.5e-3, rtol=0)
