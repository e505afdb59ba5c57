"""Check `sdof`: single-mass properties and free response."""

from __future__ import annotations

import math
from typing import TYPE_CHECKING

import numpy as np

from fieldmode.calc.framework import plausible
from fieldmode.calc.framework.guard import overflow_guard
from fieldmode.calc.framework.meaning import STRUCTURE, Meaning
from fieldmode.calc.framework.result import Flag, Reference, Result, quantity, word
from fieldmode.calc.framework.spec import CheckSpec, Field, Series
from fieldmode.calc.physics import sdof

if TYPE_CHECKING:
    from fieldmode.calc.framework.reading import Inputs

FIELDS = (
    Field("mass", "Mass", "mass", "9.6 t", "t", shared=True,
          help="a mass, or a weight read as W/g0", meaning=Meaning("mass", STRUCTURE)),
    Field("stiffness", "Stiffness", "stiffness", "42 kN/mm", "kN/mm", group="stiffness",
          meaning=Meaning("stiffness", STRUCTURE)),
    Field("static_deflection", "Static deflection", "length", "", "mm", group="stiffness",
          help="deflection of the support under the weight", meaning=Meaning("static deflection", STRUCTURE)),
    Field("damping", "Damping ratio", "ratio", "2 %", "", group="damping", required=False, shared=True,
          meaning=Meaning("damping ratio", STRUCTURE)),
    Field("damping_coefficient", "Damping coefficient", "damping_coefficient", "", "kN*s/m",
          group="damping", required=False, meaning=Meaning("damping coefficient", STRUCTURE)),
    Field("initial_displacement", "Initial displacement", "length", "1 mm", "mm", required=False),
    Field("initial_velocity", "Initial velocity", "velocity", "", "mm/s", required=False),
)

REFERENCES = (
    Reference("Closed-form free vibration of a viscously damped single mass",
              "Chopra, Dynamics of Structures, ch. 2; Clough & Penzien, Dynamics of Structures, ch. 2"),
)


@overflow_guard("mass")
def compute(inputs: Inputs) -> Result:
    mass = inputs.value("mass", positive=True)
    if inputs.has("stiffness"):
        stiffness = inputs.value("stiffness", positive=True)
    else:
        stiffness = sdof.stiffness_from_static_deflection(mass, inputs.value("static_deflection", positive=True))
    omega_n = sdof.angular_frequency(stiffness, mass)
    c_cr = sdof.critical_damping(stiffness, mass)
    flags: list[Flag] = []
    if inputs.has("damping_coefficient"):
        zeta = inputs.value("damping_coefficient", minimum=0.0) / c_cr
    else:
        zeta = inputs.optional("damping", 0.0, minimum=0.0) or 0.0
        if not inputs.has("damping"):
            flags.append(Flag("info", "no damping given: treated as undamped"))
    values = {
        "natural_frequency": quantity("Natural frequency", "frequency", omega_n / (2 * math.pi),
                                      meaning=Meaning("natural frequency", STRUCTURE)),
        "angular_frequency": quantity("Angular frequency", "angular_frequency", omega_n),
        "natural_period": quantity("Natural period", "time", 2 * math.pi / omega_n,
                                   meaning=Meaning("natural period", STRUCTURE)),
        "stiffness": quantity("Stiffness", "stiffness", stiffness, meaning=Meaning("stiffness", STRUCTURE)),
        "static_deflection": quantity("Static deflection m g0/k", "length",
                                      mass * sdof.STANDARD_GRAVITY / stiffness,
    meaning=Meaning("static deflection", STRUCTURE)),
        "damping_ratio": quantity("Damping ratio", "ratio", zeta, meaning=Meaning("damping ratio", STRUCTURE)),
        "critical_damping": quantity("Critical damping", "damping_coefficient", c_cr),
        "damping_coefficient": quantity("Damping coefficient", "damping_coefficient", zeta * c_cr,
                                        meaning=Meaning("damping coefficient", STRUCTURE)),
        "regime": word("Regime", sdof.regime(zeta)),
    }
    if 0 < zeta < 1:
        decrement = sdof.log_decrement(zeta)
        values["damped_frequency"] = quantity("Damped frequency", "frequency",
                                              omega_n * math.sqrt(1 - zeta**2) / (2 * math.pi))
        values["log_decrement"] = quantity("Log decrement", "number", decrement)
        values["cycles_to_halve"] = quantity("Cycles to half amplitude", "number", math.log(2) / decrement)
    flags.extend(_flags(zeta))
    unit = "the stiffness unit" if inputs.has("stiffness") else "the deflection unit"
    note = plausible.static_deflection(mass * sdof.STANDARD_GRAVITY / stiffness, unit)
    flags.extend([note] if note else [])
    u0 = inputs.optional("initial_displacement", 0.0) or 0.0
    v0 = inputs.optional("initial_velocity", 0.0) or 0.0
    if u0 == 0 and v0 == 0:
        u0 = 1e-3
        flags.append(Flag("info", "no initial condition given: response shown for 1 mm initial displacement"))
    time = np.linspace(0.0, sdof.response_duration(omega_n, zeta), 801)
    series = {"time": time, "displacement": sdof.free_response(time, omega_n, zeta, u0, v0)}
    if 0 < zeta < 1:
        series["envelope"] = sdof.free_envelope(time, omega_n, zeta, u0, v0)
    return inputs.result(values, series=series, flags=tuple(flags), references=REFERENCES)


def _flags(zeta: float) -> list[Flag]:
    if zeta >= 1:
        return [Flag("caution", f"{sdof.regime(zeta)}: no oscillation; unusual for a structure")]
    if zeta > 0.2:
        return [Flag("caution", "damping above 20 %: unusual for a structure without added dampers")]
    return []


SPEC = CheckSpec(
    id="sdof",
    title="Single mass",
    summary="natural frequency, damping regime and free response of one mass on a spring",
    fields=FIELDS,
    compute=compute,
    series=(
        Series("time", "Time", "time"),
        Series("displacement", "Free response u", "length", "time"),
        Series("envelope", "Decay envelope", "length", "time"),
    ),
)
