"""The shipped demo accelerogram is the one the documented generator makes."""

from __future__ import annotations

from pathlib import Path

import numpy as np

from calc import groundmotion


def test_shipped_file_regenerates() -> None:
    shipped = Path(groundmotion.demo_path()).read_text(encoding="utf-8").splitlines()
    fresh = groundmotion.demo_text().splitlines()
    assert shipped[:5] == fresh[:5]
    assert len(shipped) == len(fresh) == 5 + 4001
    old = np.loadtxt(shipped[5:], delimiter=",")
    new = np.loadtxt(fresh[5:], delimiter=",")
    np.testing.assert_allclose(old, new, rtol=0, atol=2e-6)


def test_demo_motion_is_invented_and_described() -> None:
    time, acc = groundmotion.synthetic_motion()
    assert np.abs(acc).max() == groundmotion.PEAK_G
    assert time[1] - time[0] == groundmotion.MotionParameters().time_step
    header = groundmotion.demo_text().splitlines()[0]
    assert "synthetic" in header and "not a recorded earthquake" in header
