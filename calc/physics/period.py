"""Approximate fundamental period of a building: EN 1998-1 4.3.3.2.2(3) and ASCE 7-16 12.8.2.1.

Heights in m, periods in s.
"""

from __future__ import annotations

SYSTEMS = ("steel-moment-frame", "concrete-moment-frame", "steel-eccentric-braced", "other")
EN_CT = {"steel-moment-frame": 0.085, "concrete-moment-frame": 0.075,
         "steel-eccentric-braced": 0.075, "other": 0.050}
"""EN 1998-1:2004 4.3.3.2.2(3): Ct for T1 = Ct H^(3/4), H in m."""
EN_HEIGHT_LIMIT = 40.0
"""EN 1998-1:2004 4.3.3.2.2(3): the period formula is for buildings up to 40 m high."""
ASCE_CT = {"steel-moment-frame": (0.0724, 0.8), "concrete-moment-frame": (0.0466, 0.9),
           "steel-eccentric-braced": (0.0731, 0.75), "other": (0.0488, 0.75)}
"""ASCE 7-16 Table 12.8-2, SI column: (Ct, x) for Ta = Ct hn^x, hn in m."""


def en1998(height: float, system: str) -> float:
    """Approximate fundamental period T1 = Ct H^(3/4) in s (EN 1998-1 4.3.3.2.2(3)); H in m."""
    return EN_CT[system] * height**0.75


def asce7(height: float, system: str) -> float:
    """Approximate fundamental period Ta = Ct hn^x in s (ASCE 7-16 12.8.2.1, eq. 12.8-7, SI); hn in m."""
    ct, exponent = ASCE_CT[system]
    return ct * height**exponent
