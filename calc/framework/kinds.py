"""Physical kinds of fields and results: dimension, SI unit, display units, example text."""

from __future__ import annotations

from dataclasses import dataclass, field


@dataclass(frozen=True)
class Kind:
    """A physical kind a field or result can have.

    ``display`` lists units per system from largest to smallest; a value is shown in
    the first unit in which it is at least 1. ``weight_of`` is the dimension of a
    weight accepted in place of this kind (read as W/g0).
    """

    name: str
    label: str
    dimension: str
    si: str
    display: dict[str, tuple[str, ...]]
    example: str
    ratio: bool = False
    integer: bool = False
    weight_of: str | None = None
    names: dict[str, str] = field(default_factory=dict)


MAX_QUANTITY_TEXT = 60
"""Longest text accepted in a field of one quantity (characters)."""
MAX_LIST_TEXT = 2000
"""Longest text accepted in a list field or a free-text field (characters)."""
MAX_PATH_TEXT = 4096
"""Longest file path accepted (characters)."""

FORCE = "[mass]*[length]/[time]**2"
PRESSURE = "[mass]/[length]/[time]**2"

_UNIT_NAMES = {
    "m/s^2": "m/s^2", "mm/s^2": "mm/s^2", "g0": "g", "N*s/m": "N s/m", "kN*s/m": "kN s/m",
    "lbf*s/in": "lbf s/in", "kip*s/in": "kip s/in", "kg*m": "kg m", "kg*mm": "kg mm",
    "lb*in": "lb in", "oz*in": "oz in", "g*mm": "g mm", "ft*lbf": "ft lbf", "kip*ft": "kip ft", "%": "%", "": "",
    "um": "µm", "t/m": "t/m", "m/s^1.75": "m/s^1.75",
}


def _kind(name: str, label: str, dimension: str, si: str, si_units: tuple[str, ...],
          us_units: tuple[str, ...], example: str, **extra: object) -> Kind:
    return Kind(name, label, dimension, si, {"si": si_units, "us": us_units}, example,
                names=_UNIT_NAMES, **extra)  # type: ignore[arg-type]


KINDS: dict[str, Kind] = {k.name: k for k in (
    _kind("frequency", "frequency", "1/[time]", "Hz", ("Hz",), ("Hz",), "'24.2 Hz' or '1450 rpm'"),
    _kind("angular_frequency", "angular frequency", "1/[time]", "rad/s", ("rad/s",), ("rad/s",),
          "'152 rad/s'"),
    _kind("time", "time", "[time]", "s", ("s",), ("s",), "'0.5 s' or '200 ms'"),
    _kind("mass", "mass", "[mass]", "kg", ("t", "kg"), ("lb",), "'12 t', '26500 lb' or a weight '117.7 kN'",
          weight_of=FORCE),
    _kind("force", "force", FORCE, "N", ("MN", "kN", "N"), ("kip", "lbf"), "'2.5 kN' or '560 lbf'"),
    _kind("stiffness", "stiffness", f"{FORCE}/[length]", "N/m", ("kN/mm", "N/mm"), ("kip/in", "lbf/in"),
          "'8 kN/mm' or '45 kip/in'"),
    _kind("length", "length", "[length]", "m", ("m", "mm", "um"), ("ft", "in"), "'4.2 m' or '3 mm'"),
    _kind("velocity", "velocity", "[length]/[time]", "m/s", ("m/s", "mm/s"), ("in/s",),
          "'0.05 m/s' or '5 mm/s'"),
    _kind("acceleration", "acceleration", "[length]/[time]^2", "m/s^2", ("m/s^2", "mm/s^2"), ("g0",),
          "'0.25 g' or '2.45 m/s^2'"),
    _kind("vibration_dose", "vibration dose value", "[length]/[time]^1.75", "m/s^1.75", ("m/s^1.75",),
          ("m/s^1.75",), "'0.4 m/s^1.75'"),
    _kind("damping_coefficient", "damping coefficient", f"{FORCE}*[time]/[length]", "N*s/m",
          ("kN*s/m", "N*s/m"), ("kip*s/in", "lbf*s/in"), "'35 kN s/m'"),
    _kind("ratio", "ratio", "", "", ("%",), ("%",), "'3 %' or '0.03'", ratio=True),
    _kind("number", "number", "", "", ("",), ("",), "'1.5'"),
    _kind("count", "count", "", "", ("",), ("",), "'4'", integer=True),
    _kind("angle", "angle", "", "deg", ("deg",), ("deg",), "'30 deg'"),
    _kind("modulus", "modulus", PRESSURE, "Pa", ("GPa", "MPa"), ("ksi",), "'210 GPa' or '29000 ksi'"),
    _kind("second_moment", "second moment of area", "[length]^4", "m^4", ("m^4", "cm^4", "mm^4"), ("in^4",),
          "'8360 cm^4' or '200 in^4'"),
    _kind("area", "area", "[length]^2", "m^2", ("m^2", "mm^2"), ("ft^2", "in^2"), "'5380 mm^2'"),
    _kind("mass_per_length", "mass per length", "[mass]/[length]", "kg/m", ("t/m", "kg/m"), ("lb/ft",),
          "'450 kg/m' or a weight '4.4 kN/m'", weight_of=f"{FORCE}/[length]"),
    _kind("mass_per_area", "mass per area", "[mass]/[length]^2", "kg/m^2", ("kg/m^2",), ("lb/ft^2",),
          "'350 kg/m^2' or a weight '3.5 kPa'", weight_of=PRESSURE),
    _kind("crowd_density", "crowd density (pedestrians per area)", "1/[length]^2", "1/m^2", ("1/m^2",),
          ("1/ft^2",), "'0.5' (pedestrians per m^2) or '0.05 1/ft^2'"),
    _kind("energy", "energy", f"{FORCE}*[length]", "J", ("MJ", "kJ", "J"), ("kip*ft", "ft*lbf"),
          "'30 kJ' or '22000 ft lbf'"),
    _kind("unbalance", "unbalance (mass x eccentricity)", "[mass]*[length]", "kg*m", ("kg*m", "kg*mm", "g*mm"),
          ("lb*in", "oz*in"), "'0.5 kg m' or '120 g mm'"),
)}
