"""Base curves of perception and the response factor."""

from __future__ import annotations

import math

import numpy as np
import pytest

from fieldmode.calc.physics import base_curves


@pytest.mark.parametrize(("frequency", "vertical"), [(1.0, 1e-2), (2.0, 1e-2 / math.sqrt(2)), (4.0, 5e-3),
                                                    (6.3, 5e-3), (8.0, 5e-3), (16.0, 1e-2), (80.0, 5e-2)])
def test_vertical_base_curve_at_its_corners(frequency: float, vertical: float) -> None:
    # From memory: BS 6472:1992 / ISO 10137:2007 Annex C z-axis base curve: 1e-2 f^-0.5 (1-4 Hz),
    # 5e-3 (4-8 Hz), 6.25e-4 f (8-80 Hz), m/s^2 r.m.s.
    assert float(base_curves.base_acceleration(frequency, "vertical")) == pytest.approx(vertical, rel=1e-9)


@pytest.mark.parametrize(("frequency", "horizontal"), [(1.0, 3.57e-3), (2.0, 3.57e-3), (4.0, 7.14e-3),
                                                      (80.0, 0.1428)])
def test_horizontal_base_curve_at_its_corners(frequency: float, horizontal: float) -> None:
    # From memory: BS 6472:1992 x/y-axis base curve: 3.57e-3 (1-2 Hz), 1.785e-3 f (2-80 Hz), m/s^2 r.m.s.
    assert float(base_curves.base_acceleration(frequency, "horizontal")) == pytest.approx(horizontal, rel=1e-9)


def test_vertical_curve_is_a_constant_velocity_above_8_hz() -> None:
    # Common practice (no source): above 8 Hz the vertical base curve is a constant r.m.s. velocity of
    # about 0.1 mm/s, which is why high-frequency floors are judged by velocity
    frequency = np.array([8.0, 20.0, 50.0, 80.0])
    velocity = base_curves.base_acceleration(frequency, "vertical") / (2 * math.pi * frequency)
    np.testing.assert_allclose(velocity, 6.25e-4 / (2 * math.pi), rtol=1e-12)
    assert velocity[0] == pytest.approx(1e-4, rel=0.01)


def test_response_factor_is_acceleration_over_base() -> None:
    # Source: definition of the response factor R = a / a_base (ISO 10137 Annex C, from memory)
    assert float(base_curves.response_factor(0.02, 6.0, "vertical")) == pytest.approx(4.0)
    assert base_curves.weighted_response_factor(0.02, "vertical") == pytest.approx(4.0)
    assert base_curves.weighted_response_factor(3.57e-3 * 2, "horizontal") == pytest.approx(2.0)


def test_unknown_direction_is_refused() -> None:
    with pytest.raises(ValueError, match="direction"):
        base_curves.base_acceleration(5.0, "sideways")
