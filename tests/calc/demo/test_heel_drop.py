"""The shipped demo decay record is the one its generator makes."""

from __future__ import annotations

import numpy as np

from fieldmode.calc.checks import BY_ID
from fieldmode.calc.demo import HEEL_DROP, demo_file, demo_path
from fieldmode.calc.demo.heel_drop import demo_text

DECAY = BY_ID["decay"]


def test_demo_record_ships_and_is_reproducible() -> None:
    path = demo_file(HEEL_DROP)
    assert path.is_absolute() and path.is_file()
    assert DECAY.field("file").default == "demo:heel_drop_demo.csv"
    assert demo_path(DECAY.field("file").default) == path
    shipped = path.read_text(encoding="utf-8")
    regenerated = demo_text()
    assert shipped.splitlines()[:4] == regenerated.splitlines()[:4]
    ours = np.loadtxt(path, delimiter=",", comments="#", skiprows=4)
    again = np.loadtxt(regenerated.splitlines()[4:], delimiter=",")
    # Common practice (no source): regenerated within one unit of the last printed digit
    np.testing.assert_allclose(ours, again, atol=1.5e-5, rtol=0)
    assert 1000 <= len(ours) <= 5000
