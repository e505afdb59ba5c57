"""Time columns: the unit from the header, and uniform sampling."""

from __future__ import annotations

from pathlib import Path

import numpy as np
import pytest

from fieldmode.calc.records.layout import RecordError
from fieldmode.calc.records.read import read_record
from fieldmode.calc.records.sampling import is_time_name, seconds_per_unit

FS = 200.0
TIME = np.arange(600) / FS
SIGNAL = np.exp(-1.5 * TIME) * np.sin(2 * np.pi * 6.8 * TIME)


def _write(tmp_path: Path, header: str, scale: float) -> Path:
    path = tmp_path / "rec.csv"
    path.write_text(f"{header},acc [m/s^2]\n" + "".join(f"{t * scale:.10f},{x:.6f}\n"
                                                        for t, x in zip(TIME, SIGNAL, strict=True)))
    return path


@pytest.mark.parametrize(("header", "scale"), [
    ("time", 1.0), ("t [s]", 1.0), ("Time (sec)", 1.0), ("seconds", 1.0),
    ("time [ms]", 1e3), ("time [msec]", 1e3), ("Time (milliseconds)", 1e3), ("time_msec", 1e3), ("t_ms", 1e3),
    ("time [us]", 1e6), ("time [min]", 1 / 60), ("Time (minutes)", 1 / 60), ("zeit [s]", 1.0),
])
def test_every_common_spelling_of_a_time_unit_gives_the_same_sampling(tmp_path: Path, header: str,
                                                                      scale: float) -> None:
    # Source: SI Brochure: 1 ms = 1e-3 s, 1 us = 1e-6 s; 1 min = 60 s
    record = read_record(_write(tmp_path, header, scale))
    assert record.sample_rate == pytest.approx(FS, rel=1e-4)


@pytest.mark.parametrize("header", ["time [fortnight]", "t (days ago)", "time_ticks"])
def test_an_unknown_time_unit_is_refused_never_taken_as_seconds(tmp_path: Path, header: str) -> None:
    with pytest.raises(RecordError, match="unknown time unit"):
        read_record(_write(tmp_path, header, 1.0))


def test_time_names_and_units_are_told_apart() -> None:
    assert all(is_time_name(n) for n in ("time", "t", "Time (s)", "ms", "sec", "t_ms"))
    assert not any(is_time_name(n) for n in ("acc [g]", "ax", "vel_x", "z (mm/s)"))
    assert seconds_per_unit("time", "f") == (1.0, "time column 'time' read in s (no unit in its header)")
    assert seconds_per_unit("time [ms]", "f") == (1e-3, "time column 'time [ms]' read in ms")
