"""The EN 1998-1 horizontal elastic and design response spectra.

All functions take and return SI magnitudes (m, s, m/s^2); damping is a ratio (0.05 for 5 %).
Spectrum functions are vectorised over arrays of periods.
"""

from __future__ import annotations

import math
from dataclasses import dataclass

import numpy as np

GROUND_TYPES = ("A", "B", "C", "D", "E")
SPECTRUM_TYPES = ("1", "2")

EN_TABLE_3_2 = {"A": (1.0, 0.15, 0.4, 2.0), "B": (1.2, 0.15, 0.5, 2.0), "C": (1.15, 0.20, 0.6, 2.0),
                "D": (1.35, 0.20, 0.8, 2.0), "E": (1.4, 0.15, 0.5, 2.0)}
"""EN 1998-1:2004 Table 3.2 (Type 1, recommended): S, TB, TC, TD (s)."""
EN_TABLE_3_3 = {"A": (1.0, 0.05, 0.25, 1.2), "B": (1.35, 0.05, 0.25, 1.2), "C": (1.5, 0.10, 0.25, 1.2),
                "D": (1.8, 0.10, 0.30, 1.2), "E": (1.6, 0.05, 0.25, 1.2)}
"""EN 1998-1:2004 Table 3.3 (Type 2, recommended): S, TB, TC, TD (s)."""

ETA_FLOOR = 0.55
"""EN 1998-1:2004 3.2.2.2(3): lower limit of the damping correction factor."""
BETA = 0.2
"""EN 1998-1:2004 3.2.2.5(4) NOTE: recommended lower bound factor of the design spectrum."""
SPECTRUM_END = 4.0
"""EN 1998-1:2004 3.2.2.2: the elastic spectrum formulas are given up to T = 4 s."""

BRANCHES = ("ascending", "constant acceleration", "constant velocity", "constant displacement")


@dataclass(frozen=True)
class SpectrumShape:
    """Soil factor S and corner periods TB, TC, TD (s) of an EN 1998-1 spectrum."""

    soil_factor: float
    tb: float
    tc: float
    td: float


def recommended_shape(spectrum_type: str, ground_type: str) -> SpectrumShape:
    """Recommended S, TB, TC, TD of EN 1998-1 Table 3.2 (type '1') or Table 3.3 (type '2')."""
    table = EN_TABLE_3_2 if spectrum_type == "1" else EN_TABLE_3_3
    return SpectrumShape(*table[ground_type])


def damping_correction(damping_ratio: float) -> float:
    """eta = sqrt(10 / (5 + xi)) >= 0.55 with xi in percent (EN 1998-1 3.2.2.2(3), eq. 3.6)."""
    return max(math.sqrt(10.0 / (5.0 + 100.0 * damping_ratio)), ETA_FLOOR)


def elastic_spectrum(period: np.ndarray | float, ag: float, shape: SpectrumShape,
                     eta: float = 1.0) -> np.ndarray:
    """Horizontal elastic spectral acceleration Se(T) in m/s^2 (EN 1998-1 3.2.2.2, eq. 3.2-3.5).

    ``ag`` is the design ground acceleration on type A ground (gamma_I agR) in m/s^2. Beyond
    4 s the last branch is extended.
    """
    t = np.asarray(period, dtype=float)
    s, tb, tc, td = shape.soil_factor, shape.tb, shape.tc, shape.td
    plateau = ag * s * eta * 2.5
    return np.select(
        [t < tb, t <= tc, t <= td],
        [ag * s * (1.0 + t / tb * (eta * 2.5 - 1.0)), np.full_like(t, plateau),
         plateau * tc / np.maximum(t, tc)],
        plateau * tc * td / np.maximum(t, td) ** 2,
    )


def design_spectrum(period: np.ndarray | float, ag: float, shape: SpectrumShape, q: float,
                    beta: float = BETA) -> np.ndarray:
    """Design spectral acceleration Sd(T) in m/s^2 for behaviour factor q (EN 1998-1 3.2.2.5, eq. 3.13-3.16)."""
    t = np.asarray(period, dtype=float)
    s, tb, tc, td = shape.soil_factor, shape.tb, shape.tc, shape.td
    plateau = ag * s * 2.5 / q
    floor = beta * ag
    return np.select(
        [t < tb, t <= tc, t <= td],
        [ag * s * (2.0 / 3.0 + t / tb * (2.5 / q - 2.0 / 3.0)), np.full_like(t, plateau),
         np.maximum(plateau * tc / np.maximum(t, tc), floor)],
        np.maximum(plateau * tc * td / np.maximum(t, td) ** 2, floor),
    )


def branch(period: float, shape: SpectrumShape) -> str:
    """Name of the spectrum branch that applies at ``period`` (s)."""
    if period < shape.tb:
        return BRANCHES[0]
    if period <= shape.tc:
        return BRANCHES[1]
    return BRANCHES[2] if period <= shape.td else BRANCHES[3]


def spectral_displacement(acceleration: np.ndarray | float, period: np.ndarray | float) -> np.ndarray:
    """Spectral displacement SDe = Se (T / 2 pi)^2 in m (EN 1998-1 3.2.2.4, eq. 3.7)."""
    return np.asarray(acceleration) * (np.asarray(period) / (2.0 * math.pi)) ** 2
