"""The shipped demo construction-vibration record is the one its generator makes, and small enough to ship."""

from __future__ import annotations

import numpy as np

from fieldmode.calc.checks import BY_ID
from fieldmode.calc.demo import SHEET_PILING, demo_file, demo_path
from fieldmode.calc.demo.sheet_piling import demo_text


def test_demo_record_ships_and_is_reproducible() -> None:
    path = demo_file(SHEET_PILING)
    assert demo_path(BY_ID["ppv"].field("file").default) == path
    assert path.is_file() and path.stat().st_size <= 300_000
    shipped = path.read_text(encoding="utf-8")
    regenerated = demo_text()
    assert shipped.splitlines()[:4] == regenerated.splitlines()[:4]
    ours = np.loadtxt(path, delimiter=",", comments="#", skiprows=4)
    again = np.loadtxt(regenerated.splitlines()[4:], delimiter=",")
    # Common practice (no source): regenerated within one unit of the last printed digit
    np.testing.assert_allclose(ours, again, atol=0.015, rtol=0)
