"""Checks shared by the measured-vibration analyses: a sampled signal is one-dimensional, finite and
long enough, and its sample rate is a positive number of Hz.

Every problem raises :class:`ValueError` with one line saying what is wrong and, for a bad sample,
which one.
"""

from __future__ import annotations

import math

import numpy as np


def sample_rate(fs: float) -> float:
    """The sample rate (Hz) as a float, refused unless positive and finite."""
    value = float(fs)
    if not math.isfinite(value) or value <= 0.0:
        raise ValueError(f"the sample rate must be a positive number of Hz, not {fs!r}")
    return value


def signal(x: np.ndarray, what: str = "signal", min_samples: int = 2) -> np.ndarray:
    """``x`` as a float array, refused unless one-dimensional, finite and at least ``min_samples`` long."""
    values = np.asarray(x, dtype=float)
    if values.ndim != 1:
        raise ValueError(f"the {what} must be a one-dimensional series of samples, not an array of shape "
                         f"{values.shape}")
    if values.size < min_samples:
        raise ValueError(f"the {what} has {values.size} samples; at least {min_samples} are needed")
    if not np.isfinite(values).all():
        first = int(np.flatnonzero(~np.isfinite(values))[0])
        raise ValueError(f"the {what} holds a NaN or infinite value (sample {first}); remove or fill it first")
    return values


def positive(value: float, what: str, unit: str) -> float:
    """``value`` as a float, refused unless positive and finite; ``what`` and ``unit`` name it in the message."""
    number = float(value)
    if not math.isfinite(number) or number <= 0.0:
        raise ValueError(f"the {what} must be a positive number of {unit}, not {value!r}")
    return number
