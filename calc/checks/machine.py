"""Check `machine`: the severity zone of a measured r.m.s. velocity (ISO 10816 classes and groups), and the
permissible residual unbalance of a rotor balanced to a grade (ISO 21940-11).

The balance fields and their reading (:data:`GRADE_FIELDS`, :func:`grade_unbalance`) are shared with
`forced` and `isolate`, where a grade and a rotor mass are an alternative to an unbalance m e.
"""

from __future__ import annotations

import math
import re
from dataclasses import dataclass
from typing import TYPE_CHECKING

import numpy as np

from fieldmode.calc.framework.guard import overflow_guard
from fieldmode.calc.framework.meaning import MACHINE, Meaning
from fieldmode.calc.framework.result import Flag, Reference, Result, Value, quantity, word
from fieldmode.calc.framework.spec import CheckSpec, Field, Series
from fieldmode.calc.physics import machine

if TYPE_CHECKING:
    from fieldmode.calc.framework.reading import Inputs

UNBALANCE = Meaning("unbalance", MACHINE)
"""The machine's unbalance m e: what a grade and a rotor mass give, what `forced` and `isolate` take."""
_GRADES_HELP = ", ".join(f"G {g:g}" for g in machine.BALANCE_GRADES)


def grade_fields(group: str | None, required: bool, grade: str = "", rotor_mass: str = "") -> tuple[Field, Field]:
    """The balance grade (in a group of alternatives to an unbalance, or alone) and the rotor mass beside it,
    with their demo texts."""
    return (
        Field("grade", "Balance grade", "text", grade, group=group, required=required,
              help=f"ISO 21940-11 grade with the rotor mass, e.g. G 6.3 for fans and pumps: {_GRADES_HELP}",
              meaning=Meaning("balance grade", MACHINE)),
        Field("rotor_mass", "Rotor mass", "mass", rotor_mass, "kg", required=False,
              help="the balanced rotor alone, not the machine on its mounts", meaning=Meaning("rotor mass", MACHINE)),
    )


FIELDS = (
    Field("velocity", "Measured velocity, r.m.s.", "velocity", "3.1 mm/s", "mm/s", required=False,
          help="broadband r.m.s. on a bearing housing; r.m.s. only (a peak is not converted)"),
    Field("machine_class", "Machine class or group", "choice", "group 2 flexible",
          choices=tuple(machine.SEVERITY_CLASSES), required=False,
          help="class I-IV (ISO 10816-1) or group and support (ISO 10816-3)"),
    *grade_fields(None, False, "G 6.3", "380 kg"),
    Field("speed", "Operating frequency", "frequency", "740 rpm", "Hz", required=False, shared=True,
          help="the rotor's speed: Hz, or rpm", meaning=Meaning("operating frequency", MACHINE)),
)

_GRADE_TEXT = re.compile(r"^\s*(?:G\s*)?([0-9]*\.?[0-9]+)\s*(?:mm/s)?\s*$", re.IGNORECASE)


@dataclass(frozen=True)
class Balance:
    """What a grade and a rotor mass give at a speed (SI): G (mm/s number), U_per, e_per and the force."""

    grade: float
    rotor_mass: float
    unbalance: float
    eccentricity: float
    force: float


def read_grade(inputs: Inputs) -> float:
    """The number after G of the grade field, one of the ISO 21940-11 grades."""
    text = inputs.text("grade")
    match = _GRADE_TEXT.match(text)
    if match is None:
        raise inputs.error("grade", f"not a balance grade: write it as G 6.3 or 6.3 ({_GRADES_HELP})")
    number = float(match.group(1))
    for known in machine.BALANCE_GRADES:
        if math.isclose(number, known, rel_tol=1e-9):
            return known
    raise inputs.error("grade", f"G {number:g} is not an ISO 21940-11 grade: {_GRADES_HELP}")


def grade_unbalance(inputs: Inputs, speed: float, mass_field: str | None = None) -> Balance:
    """The permissible unbalance of the grade and rotor mass at ``speed`` (Hz).

    The rotor mass is required with a grade; with ``mass_field`` (the mass of which the rotor is part)
    a rotor heavier than that mass is refused.
    """
    grade = read_grade(inputs)
    if not inputs.has("rotor_mass"):
        raise inputs.error("rotor_mass", "give the rotor mass with a balance grade")
    rotor = inputs.value("rotor_mass", positive=True)
    if mass_field is not None and rotor > inputs.value(mass_field) * (1 + 1e-9):
        other = inputs.spec.field(mass_field).label.lower()
        raise inputs.error("rotor_mass", f"heavier than the {other}, of which the rotor is a part")
    unbalance = machine.permissible_unbalance(grade, rotor, speed)
    return Balance(grade, rotor, unbalance, machine.permissible_eccentricity(grade, speed),
                   machine.unbalance_force(unbalance, speed))


def balance_values(balance: Balance, meaning: Meaning | None = None, force: bool = True) -> dict[str, Value]:
    """The unbalance a grade gives, its specific unbalance (eccentricity) and (unless the check shows its
    force already) its force at speed."""
    values = {
        "grade_unbalance": quantity("Permissible unbalance", "unbalance", balance.unbalance, meaning=meaning),
        "grade_eccentricity": quantity("Permissible eccentricity", "length", balance.eccentricity),
    }
    if force:
        values["grade_force"] = quantity("Unbalance force at speed", "force", balance.force)
    return values


def balance_flag(balance: Balance, speed: float) -> Flag:
    """Which load was used: the permissible unbalance of the grade, with its figures."""
    return Flag("info", f"unbalance from G {balance.grade:g} and a rotor of {balance.rotor_mass:.4g} kg at "
                        f"{speed * 60:.4g} rpm: U = 9549 G m / n = {balance.unbalance * 1e6:.5g} g mm (ISO 21940-11), "
                        "the most a rotor balanced to that grade may keep")


BALANCE_REFERENCE = Reference("Permissible residual unbalance of a balance grade: e_per = G / Omega, "
                              "U_per = m e_per = 9549 G m / n (g mm, kg, r/min); force U Omega^2",
                              machine.BALANCE_SOURCE)


def rotor_mass_unused(inputs: Inputs) -> tuple[Flag, ...]:
    """A note when a rotor mass is given without a grade (it is then not used)."""
    if inputs.has("rotor_mass") and not inputs.has("grade"):
        return (Flag("info", "rotor mass given without a balance grade: not used"),)
    return ()


ZONE_NUMBER = {"A": 1, "B": 2, "C": 3, "D": 4}
GRID_POINTS = 241
"""Velocities on the zone chart, evenly spaced on a log scale."""


@overflow_guard("speed")
def compute(inputs: Inputs) -> Result:
    if not inputs.has("velocity") and not inputs.has("grade"):
        raise inputs.error("velocity", "give the measured r.m.s. velocity, a balance grade with the rotor mass "
                                       "and speed, or both")
    values: dict[str, Value] = {}
    flags: list[Flag] = []
    references: list[Reference] = []
    series: dict[str, np.ndarray] = {}
    if inputs.has("velocity"):
        severity = _severity(inputs)
        values.update(_severity_values(severity))
        flags += _severity_flags(severity)
        references.append(Reference("Zones A-D of broadband r.m.s. velocity by machine class or group "
                                    f"({severity.machine.key})", severity.machine.source))
        series = _zone_series(severity)
    if inputs.has("grade"):
        if not inputs.has("speed"):
            raise inputs.error("speed", "give the operating speed with a balance grade")
        speed = inputs.value("speed", positive=True)
        balance = grade_unbalance(inputs, speed)
        values.update(balance_values(balance, UNBALANCE))
        series.update(_grade_series(balance.grade, speed))
        flags.append(balance_flag(balance, speed))
        flags.append(Flag("info", "the next grade up or down may suit the case; the machine's own standard or "
                                  "the maker's tolerance govern"))
        references.append(BALANCE_REFERENCE)
    else:
        flags += rotor_mass_unused(inputs)
    return inputs.result(values, series=series, flags=tuple(flags), references=tuple(references))


def _severity(inputs: Inputs) -> machine.Severity:
    if not inputs.has("machine_class"):
        raise inputs.error("machine_class", "give the machine class or group with the measured velocity")
    velocity = inputs.value("velocity", positive=True)
    return machine.severity_zone(velocity, inputs.text("machine_class"))


def _severity_values(severity: machine.Severity) -> dict[str, Value]:
    bounds = severity.machine
    values = {
        "zone": word("Severity zone", severity.zone),
        "boundary_ab": quantity("Zone A/B boundary", "velocity", bounds.ab),
        "boundary_bc": quantity("Zone B/C boundary", "velocity", bounds.bc),
        "boundary_cd": quantity("Zone C/D boundary", "velocity", bounds.cd),
    }
    upper = _next_boundary(severity)
    if upper is None:
        values["margin"] = quantity("Over C/D boundary by", "velocity", severity.velocity - bounds.cd)
    else:
        zone, boundary = upper
        values["margin"] = quantity(f"Margin to zone {zone}", "velocity", boundary - severity.velocity)
        values["margin_ratio"] = quantity(f"Measured / {severity.zone}/{zone} edge", "number",
                                          severity.velocity / boundary)
    return values


def _next_boundary(severity: machine.Severity) -> tuple[str, float] | None:
    """The next zone up and the velocity where it starts, or None in zone D."""
    bounds = severity.machine
    return {"A": ("B", bounds.ab), "B": ("C", bounds.bc), "C": ("D", bounds.cd)}.get(severity.zone)


def _severity_flags(severity: machine.Severity) -> list[Flag]:
    flags = []
    if severity.zone in ("C", "D"):
        flags.append(Flag("warning", f"zone {severity.zone}: {severity.meaning}"))
    else:
        flags.append(Flag("info", f"zone {severity.zone}: {severity.meaning}"))
    flags.append(Flag("caution", f"the zone boundaries are not confirmed against a copy ({severity.machine.source}): "
                                 "check them against the standard and the machine's own acceptance values"))
    flags.append(Flag("info", "the velocity is read as broadband r.m.s. on the bearing housing; a peak reading is "
                              "not converted (for a pure sine r.m.s. = peak / sqrt(2))"))
    return flags


def _zone_series(severity: machine.Severity) -> dict[str, np.ndarray]:
    """Zone number (1 = A ... 4 = D) against r.m.s. velocity, stepping at each boundary."""
    bounds = severity.machine
    top = max(2.0 * bounds.cd, 1.5 * severity.velocity)
    bottom = min(bounds.ab / 4.0, severity.velocity / 1.5)
    edges = np.array([bounds.ab, bounds.bc, bounds.cd])
    grid = np.union1d(np.geomspace(bottom, top, GRID_POINTS), np.concatenate([edges, np.nextafter(edges, 0.0)]))
    zone = 1.0 + np.searchsorted(edges, grid, side="right")
    return {"velocity_grid": grid, "zone_number": zone.astype(float)}


def _grade_series(grade: float, speed: float) -> dict[str, np.ndarray]:
    """Permissible eccentricity e_per = G / Omega of the grade and of the grades either side of it, over
    speeds from a tenth of the operating speed to ten times it (Hz)."""
    grid = np.geomspace(speed / 10.0, speed * 10.0, 61)
    omega = 2 * np.pi * grid
    index = machine.BALANCE_GRADES.index(grade)
    series = {"speed_grid": grid, "grade_eccentricity": machine.grade_velocity(grade) / omega}
    neighbours = {"coarser_eccentricity": index - 1, "finer_eccentricity": index + 1}
    for name, other in neighbours.items():
        if 0 <= other < len(machine.BALANCE_GRADES):
            series[name] = machine.grade_velocity(machine.BALANCE_GRADES[other]) / omega
    return series


SPEC = CheckSpec(
    id="machine",
    title="Machine vibration and balance",
    summary="severity zone of a measured r.m.s. velocity; permissible unbalance of a balance grade",
    fields=FIELDS,
    compute=compute,
    series=(
        Series("velocity_grid", "Velocity, r.m.s.", "velocity"),
        Series("zone_number", "Zone (1 A, 2 B, 3 C, 4 D)", "number", "velocity_grid"),
        Series("speed_grid", "Speed", "frequency"),
        Series("grade_eccentricity", "Permissible eccentricity", "length", "speed_grid"),
        Series("coarser_eccentricity", "Eccentricity, next grade up", "length", "speed_grid"),
        Series("finer_eccentricity", "Eccentricity, next grade down", "length", "speed_grid"),
    ),
)
