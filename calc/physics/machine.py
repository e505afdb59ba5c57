"""Machine vibration: severity zones of a measured r.m.s. velocity, and rotor balance quality grades.

SI in and out: velocities in m/s (r.m.s. for severity), masses in kg, speeds in Hz (revolutions per
second; the angular speed is 2 pi f), unbalance in kg m, eccentricity in m, forces in N.

Severity zones (A newly commissioned, B unrestricted long-term running, C limited running until
remedied, D liable to cause damage) are bounded by the A/B, B/C and C/D velocities of a machine
class (ISO 10816-1:1995 Annex B) or group and foundation (ISO 10816-3:2009 Annex A). ISO 20816-1:2016
superseded ISO 10816-1 and no longer tabulates the classes. All boundaries here are from memory of
those standards, not confirmed against a copy. A velocity on a boundary belongs to the upper zone.

Balance quality (ISO 21940-11:2016, Table 1 grades confirmed in two reproductions): a grade G is
the product e_per Omega in mm/s, so the permissible residual specific unbalance is e_per = G / Omega
and the permissible residual unbalance U_per = m e_per (1000 G m / Omega in g mm with m in kg and
Omega in rad/s, or 9549 G m / n with n in r/min). The rotating force of an unbalance U at angular
speed Omega is U Omega^2.
"""

from __future__ import annotations

import math
from dataclasses import dataclass

MM_S = 1e-3
"""One mm/s in m/s."""


@dataclass(frozen=True)
class SeverityClass:
    """Zone boundaries (m/s r.m.s.) of one machine class or group, with its description and source."""

    key: str
    description: str
    ab: float
    bc: float
    cd: float
    source: str


_ISO_10816_1 = "ISO 10816-1:1995 Annex B (from memory; superseded by ISO 20816-1:2016)"
_ISO_10816_3 = "ISO 10816-3:2009 Annex A, Table A.1 (from memory)"

SEVERITY_CLASSES: dict[str, SeverityClass] = {c.key: c for c in (
    SeverityClass("class I", "small machines, up to about 15 kW", 0.71 * MM_S, 1.8 * MM_S, 4.5 * MM_S,
                  _ISO_10816_1),
    SeverityClass("class II", "medium machines, 15 to 75 kW, or up to 300 kW on special foundations",
                  1.12 * MM_S, 2.8 * MM_S, 7.1 * MM_S, _ISO_10816_1),
    SeverityClass("class III", "large machines on rigid, heavy foundations", 1.8 * MM_S, 4.5 * MM_S,
                  11.2 * MM_S, _ISO_10816_1),
    SeverityClass("class IV", "large machines on foundations soft in the direction measured", 2.8 * MM_S,
                  7.1 * MM_S, 18.0 * MM_S, _ISO_10816_1),
    SeverityClass("group 1 rigid", "large machines, 300 kW to 50 MW (electric: shaft height 315 mm or more), "
                  "rigid support", 2.3 * MM_S, 4.5 * MM_S, 7.1 * MM_S, _ISO_10816_3),
    SeverityClass("group 1 flexible", "large machines, 300 kW to 50 MW (electric: shaft height 315 mm or more), "
                  "flexible support", 3.5 * MM_S, 7.1 * MM_S, 11.0 * MM_S, _ISO_10816_3),
    SeverityClass("group 2 rigid", "medium machines, 15 kW to 300 kW (electric: shaft height 160 to 315 mm), "
                  "rigid support", 1.4 * MM_S, 2.8 * MM_S, 4.5 * MM_S, _ISO_10816_3),
    SeverityClass("group 2 flexible", "medium machines, 15 kW to 300 kW (electric: shaft height 160 to 315 mm), "
                  "flexible support", 2.3 * MM_S, 4.5 * MM_S, 7.1 * MM_S, _ISO_10816_3),
)}
"""Zone boundaries by machine class (ISO 10816-1) or group and support (ISO 10816-3)."""

ZONES = {
    "A": "as expected of a newly commissioned machine",
    "B": "acceptable for running without limit of time",
    "C": "not acceptable for long continuous running; run for a limited time until the cause is put right",
    "D": "severe enough to damage the machine",
}
"""What each severity zone means, in our words."""


@dataclass(frozen=True)
class Severity:
    """Zone of a measured r.m.s. velocity (m/s) for a machine class, and what it means."""

    zone: str
    meaning: str
    velocity: float
    machine: SeverityClass


def severity_class(key: str) -> SeverityClass:
    """The machine class or group with this key (see :data:`SEVERITY_CLASSES`)."""
    if key not in SEVERITY_CLASSES:
        raise ValueError(f"unknown machine class {key!r}: choose one of {', '.join(SEVERITY_CLASSES)}")
    return SEVERITY_CLASSES[key]


def severity_zone(velocity_rms: float, key: str) -> Severity:
    """Zone A to D of an r.m.s. vibration velocity (m/s) measured on a machine of class or group ``key``."""
    machine = severity_class(key)
    v = float(velocity_rms)
    if not math.isfinite(v) or v < 0:
        raise ValueError(f"the r.m.s. velocity must be a finite, non-negative number of m/s, not {velocity_rms!r}")
    zone = "A" if v < machine.ab else "B" if v < machine.bc else "C" if v < machine.cd else "D"
    return Severity(zone, ZONES[zone], v, machine)


BALANCE_GRADES = (4000.0, 1600.0, 630.0, 250.0, 100.0, 40.0, 16.0, 6.3, 2.5, 1.0, 0.4)
"""ISO 21940-11 balance quality grades: the number after G is e_per Omega in mm/s."""
BALANCE_SOURCE = "ISO 21940-11:2016 Table 1 (grades confirmed in two reproductions)"

TYPICAL_GRADES: tuple[tuple[str, float, str], ...] = (
    ("fans", 6.3, "ISO 21940-11:2016 Table 1 (confirmed in two reproductions)"),
    ("pumps", 6.3, "ISO 21940-11:2016 Table 1 (confirmed in two reproductions)"),
    ("electric motors, shaft height under 80 mm or rated speed up to 950 r/min", 6.3,
     "ISO 21940-11:2016 Table 1 (confirmed in two reproductions)"),
    ("electric motors, larger and faster than the above", 2.5,
     "ISO 21940-11:2016 Table 1 (confirmed in two reproductions)"),
    ("compressors", 2.5, "ISO 21940-11:2016 Table 1 (confirmed in two reproductions)"),
    ("gas and steam turbines, turbo-generators", 2.5, "ISO 21940-11:2016 Table 1 (confirmed in two reproductions)"),
    ("flywheels, centrifuge drums, rolls of paper machines, general machine-tool parts", 6.3,
     "ISO 21940-11:2016 Table 1 (from memory)"),
    ("machine-tool drives", 2.5, "ISO 21940-11:2016 Table 1 (from memory)"),
    ("spindles and armatures of precision grinders, gyroscopes", 0.4, "ISO 21940-11:2016 Table 1 (from memory)"),
    ("crushers, parts of agricultural machinery, drive shafts with special requirements", 16.0,
     "ISO 21940-11:2016 Table 1 (from memory)"),
    ("car wheels and rims, drive shafts", 40.0, "ISO 21940-11:2016 Table 1 (from memory)"),
)
"""Machine type, usual grade and source; the next grade up or down may be chosen to suit the case."""


def grade_velocity(grade: float) -> float:
    """e_per Omega (m/s) of the balance grade G ``grade`` (the number after G, e.g. 6.3 -> 0.0063 m/s)."""
    number = float(grade)
    for known in BALANCE_GRADES:
        if math.isclose(number, known, rel_tol=1e-9):
            return known * MM_S
    raise ValueError(f"G {grade!r} is not a balance quality grade; the grades are "
                     f"{', '.join(f'G {g:g}' for g in BALANCE_GRADES)}")


def _angular_speed(speed: float) -> float:
    """Angular speed (rad/s) of a rotational speed in Hz (revolutions per second)."""
    f = float(speed)
    if not math.isfinite(f) or f <= 0:
        raise ValueError(f"the rotational speed must be a positive number of Hz (rev/s), not {speed!r}")
    return 2 * math.pi * f


def permissible_eccentricity(grade: float, speed: float) -> float:
    """Permissible residual specific unbalance e_per (m, i.e. kg m per kg of rotor) of grade G at ``speed`` (Hz)."""
    return grade_velocity(grade) / _angular_speed(speed)


def permissible_unbalance(grade: float, rotor_mass: float, speed: float) -> float:
    """Permissible residual unbalance U_per = m e_per (kg m) of a rotor of ``rotor_mass`` (kg) at ``speed`` (Hz)."""
    m = float(rotor_mass)
    if not math.isfinite(m) or m <= 0:
        raise ValueError(f"the rotor mass must be a positive number of kg, not {rotor_mass!r}")
    return m * permissible_eccentricity(grade, speed)


def unbalance_force(unbalance: float, speed: float) -> float:
    """Amplitude (N) of the rotating force U Omega^2 of an unbalance ``unbalance`` (kg m) at ``speed`` (Hz)."""
    u = float(unbalance)
    if not math.isfinite(u) or u < 0:
        raise ValueError(f"the unbalance must be a finite, non-negative number of kg m, not {unbalance!r}")
    return u * _angular_speed(speed) ** 2
