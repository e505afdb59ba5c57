"""Helpers shared by the charts."""

from __future__ import annotations

import numpy as np

from fieldmode.tui.charts.common import downsample


def test_downsample_keeps_the_peak_and_the_ends() -> None:
    x = np.linspace(0.0, 3.0, 5001)
    y = 1.0 / np.hypot(1 - x**2, 0.02 * x)
    kept_x, kept_y = downsample(x, y, 120)
    assert len(kept_x) <= 122
    # Common practice (no source): min-max decimation keeps every extreme of the curve
    assert max(kept_y) == y.max()
    assert kept_x[0] == 0.0 and kept_x[-1] == 3.0
