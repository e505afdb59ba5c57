"""The shipped demo accelerogram is the one its generator makes."""

from __future__ import annotations

import numpy as np

from fieldmode.calc.demo import GROUND_MOTION, demo_file, ground_motion


def test_shipped_file_regenerates() -> None:
    shipped = demo_file(GROUND_MOTION).read_text(encoding="utf-8").splitlines()
    fresh = ground_motion.demo_text().splitlines()
    assert shipped[:5] == fresh[:5]
    assert len(shipped) == len(fresh) == 5 + 4001
    old = np.loadtxt(shipped[5:], delimiter=",")
    new = np.loadtxt(fresh[5:], delimiter=",")
    np.testing.assert_allclose(old, new, rtol=0, atol=2e-6)


def test_demo_motion_is_invented_and_described() -> None:
    time, acc = ground_motion.synthetic_motion()
    assert np.abs(acc).max() == ground_motion.PEAK_G
    assert time[1] - time[0] == ground_motion.MotionParameters().time_step
    header = ground_motion.demo_text().splitlines()[0]
    assert "synthetic" in header and "not a recorded earthquake" in header
