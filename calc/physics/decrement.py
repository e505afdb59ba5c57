"""Log decrement and damping ratio from two peak amplitudes read off a trace."""

from __future__ import annotations

import math

from fieldmode.calc.physics.sdof import damping_ratio_from_log_decrement


def decrement_from_peaks(first: float, later: float, cycles: float) -> tuple[float, float]:
    """Log decrement (1/n) ln(u_i / u_(i+n)) and damping ratio from two peak amplitudes n cycles apart."""
    if not (first > 0 and later > 0 and cycles > 0):
        raise ValueError("peak amplitudes and the number of cycles must be positive")
    decrement = math.log(first / later) / cycles
    return decrement, damping_ratio_from_log_decrement(decrement)
