"""Base curves of human perception of building vibration, and the response factor against them.

The base curves of ISO 10137:2007 Annex C and BS 6472:1992 (after ISO 2631-2:1989): r.m.s.
acceleration in m/s^2 against frequency in Hz, 1 to 80 Hz. A response factor R is the
acceleration divided by the base curve; a use (office, residence by day or night, workshop)
tolerates R up to its multiplying factor. Values are from memory of those standards: they were
not checked against a copy.
"""

from __future__ import annotations

import numpy as np

LOWEST_HZ, HIGHEST_HZ = 1.0, 80.0
"""Frequency range of the base curves (Hz)."""
VERTICAL_FLAT = 5e-3
"""Vertical (z-axis) base acceleration, m/s^2 r.m.s., from 4 to 8 Hz; also the base of a
frequency-weighted (Wb or Wg) vertical acceleration (from memory)."""
HORIZONTAL_FLAT = 3.57e-3
"""Horizontal (x, y) base acceleration, m/s^2 r.m.s., from 1 to 2 Hz; also the base of a
Wd-weighted horizontal acceleration (from memory)."""
SOURCE = "ISO 10137:2007 Annex C; BS 6472:1992 base curves and Table 5 (from memory)"

MULTIPLYING_FACTORS: dict[str, tuple[float, float]] = {
    "critical": (1.0, 1.0),
    "residential": (2.0, 1.4),
    "office": (4.0, 4.0),
    "workshop": (8.0, 8.0),
}
"""Use -> (day, night) multiplying factor on the base curve for continuous vibration; residences
by day range 2 to 4 in the standards, the lower value is given (from memory)."""

DIRECTIONS = ("vertical", "horizontal")


def base_acceleration(frequency: np.ndarray | float, direction: str) -> np.ndarray:
    """Base-curve r.m.s. acceleration (m/s^2) at ``frequency`` (Hz), 'vertical' or 'horizontal'.

    Vertical: 1e-2 f^-0.5 from 1 to 4 Hz, 5e-3 from 4 to 8 Hz, 6.25e-4 f from 8 to 80 Hz.
    Horizontal: 3.57e-3 from 1 to 2 Hz, 1.785e-3 f from 2 to 80 Hz. Outside 1 to 80 Hz the
    end values hold.
    """
    f = np.clip(np.asarray(frequency, dtype=float), LOWEST_HZ, HIGHEST_HZ)
    if direction == "vertical":
        return np.where(f < 4.0, 1e-2 / np.sqrt(f), np.where(f <= 8.0, VERTICAL_FLAT, VERTICAL_FLAT * f / 8.0))
    if direction == "horizontal":
        return np.where(f <= 2.0, HORIZONTAL_FLAT, HORIZONTAL_FLAT * f / 2.0)
    raise ValueError(f"direction must be one of {DIRECTIONS}, not {direction!r}")


def response_factor(acceleration_rms: np.ndarray | float, frequency: np.ndarray | float,
                    direction: str) -> np.ndarray:
    """Response factor R of an r.m.s. acceleration (m/s^2) at ``frequency`` (Hz): a / base curve."""
    return np.asarray(acceleration_rms, dtype=float) / base_acceleration(frequency, direction)


def weighted_response_factor(weighted_rms: float, direction: str) -> float:
    """Response factor of a frequency-weighted r.m.s. acceleration (m/s^2): a_w / flat base value."""
    return weighted_rms / (VERTICAL_FLAT if direction == "vertical" else HORIZONTAL_FLAT)
