"""Check `isolate`: a machine on resilient mounts, or the mounts a target isolation needs."""

from __future__ import annotations

import math
from typing import TYPE_CHECKING

import numpy as np

from fieldmode.calc.framework.guard import overflow_guard
from fieldmode.calc.framework.meaning import MACHINE, MOUNTS, Meaning
from fieldmode.calc.framework.result import Flag, Reference, Result, Value, quantity
from fieldmode.calc.framework.spec import CheckSpec, Field, Series
from fieldmode.calc.physics import forced, isolate, sdof
from fieldmode.calc.physics.constants import STANDARD_GRAVITY

if TYPE_CHECKING:
    from fieldmode.calc.framework.reading import Inputs

FIELDS = (
    Field("frequency", "Operating frequency", "frequency", "740 rpm", "Hz", shared=True,
          help="Hz, or a speed in rpm", meaning=Meaning("operating frequency", MACHINE)),
    Field("mass", "Mass on the mounts", "mass", "9.6 t", "t", shared=True, help="a mass, or a weight read as W/g0",
          meaning=Meaning("mass", MACHINE)),
    Field("mounts", "Number of mounts", "count", "4", "", meaning=Meaning("number of mounts", MOUNTS)),
    Field("damping", "Mount damping ratio", "ratio", "2 %", "",
          help="steel springs about 0.5-1 %, rubber about 5 %", meaning=Meaning("damping ratio", MOUNTS)),
    Field("stiffness", "Mount stiffness, total", "stiffness", "", "kN/mm", required=False,
          help="all mounts together; give it, a target isolation, or both", meaning=Meaning("stiffness", MOUNTS)),
    Field("target_isolation", "Target isolation", "ratio", "90 %", "", required=False,
          help="fraction of the force kept from the support, e.g. 90 %", meaning=Meaning("target isolation", MOUNTS)),
)

REFERENCES = (
    Reference("Force transmissibility of a damped mass on mounts over a rigid support, "
              "T = sqrt(1+(2 zeta r)^2)/sqrt((1-r^2)^2+(2 zeta r)^2), T = 1 at r = sqrt(2)",
              "Chopra, Dynamics of Structures, sec. 3.5; Den Hartog, Mechanical Vibrations, ch. 2"),
    Reference("Required natural frequency solved from the damped T (a quadratic in r^2), not the undamped "
              "1/(r^2-1); peak T at r^2 = 2/(1+sqrt(1+8 zeta^2))",
              "Rao, Mechanical Vibrations, sec. 9.10; Clough & Penzien, Dynamics of Structures, ch. 3"),
)


@overflow_guard("frequency")
def compute(inputs: Inputs) -> Result:
    frequency = inputs.value("frequency", positive=True)
    mass = inputs.value("mass", positive=True)
    mounts = int(inputs.value("mounts", positive=True))
    zeta = inputs.value("damping", minimum=0.0)
    if zeta == 0:
        raise inputs.error("damping", "must be greater than zero: transmissibility at resonance is unbounded "
                                      "without damping; steel springs have about 0.5 %")
    if not inputs.has("stiffness") and not inputs.has("target_isolation"):
        raise inputs.error("stiffness", "give the mounts' total stiffness or a target isolation")
    values: dict[str, Value] = {}
    flags: list[Flag] = []
    required_stiffness = None
    if inputs.has("target_isolation"):
        target = _target(inputs)
        ratio = isolate.ratio_for_transmissibility(1.0 - target, zeta)
        required_frequency = frequency / ratio
        required_stiffness = isolate.stiffness_for_frequency(mass, required_frequency)
        values["required_natural_frequency"] = quantity("Required natural frequency (at most)", "frequency",
                                                        required_frequency)
        values["required_stiffness"] = quantity("Required stiffness, total (at most)", "stiffness",
                                                required_stiffness)
        undamped = frequency / isolate.undamped_ratio_for_transmissibility(1.0 - target)
        flags.append(Flag("info", f"solved with damping: the undamped formula would allow {undamped:.4g} Hz"))
    stiffness = inputs.value("stiffness", positive=True) if inputs.has("stiffness") else required_stiffness
    assert stiffness is not None
    natural_frequency = sdof.angular_frequency(stiffness, mass) / (2 * math.pi)
    r = frequency / natural_frequency
    transmitted = float(forced.transmissibility(r, zeta))
    peak_ratio = isolate.peak_transmissibility_ratio(zeta)
    values = {
        "natural_frequency": quantity("Natural frequency on the mounts", "frequency", natural_frequency),
        "frequency_ratio": quantity("Frequency ratio r = f/fn", "number", r),
        "transmissibility": quantity("Transmissibility T", "number", transmitted),
        "isolation": quantity("Isolation 1 - T", "ratio", 1.0 - transmitted),
        **values,
        "stiffness": quantity("Mount stiffness, total", "stiffness", stiffness),
        "stiffness_per_mount": quantity("Stiffness per mount", "stiffness", stiffness / mounts),
        "static_deflection": quantity("Static deflection under the weight", "length",
                                      mass * STANDARD_GRAVITY / stiffness),
        "peak_transmissibility": quantity("Peak T at start-up", "number", isolate.peak_transmissibility(zeta)),
        "peak_frequency": quantity("Frequency of the peak T", "frequency", peak_ratio * natural_frequency),
    }
    flags += _flags(inputs, r, transmitted, natural_frequency, zeta, required_stiffness, stiffness)
    grid = np.union1d(np.linspace(0.0, max(3.0, 1.25 * r), 601), [peak_ratio, isolate.AMPLIFYING_RATIO, r])
    series = {"frequency_ratio": grid, "transmissibility": forced.transmissibility(grid, zeta)}
    return inputs.result(values, series=series, flags=tuple(flags), references=REFERENCES)


def _target(inputs: Inputs) -> float:
    target = inputs.value("target_isolation")
    if not 0.0 < target < 1.0:
        raise inputs.error("target_isolation", "must be between 0 % and 100 %, both excluded")
    return target


def _flags(inputs: Inputs, r: float, transmitted: float, natural_frequency: float, zeta: float,
           required_stiffness: float | None, stiffness: float) -> list[Flag]:
    flags = []
    if r < isolate.AMPLIFYING_RATIO:
        flags.append(Flag("warning", f"frequency ratio {r:.3g} is below sqrt(2): the mounts amplify the force "
                                     f"(T = {transmitted:.3g})"))
    if abs(r - 1.0) <= forced.RESONANCE_BAND:
        flags.append(Flag("warning", "operating within +/-20 % of the mounted natural frequency"))
    if r > 1.0:
        flags.append(Flag("caution", f"start-up and run-down pass through {natural_frequency:.4g} Hz, where T "
                                     f"reaches {isolate.peak_transmissibility(zeta):.3g}"))
    if required_stiffness is not None and stiffness > required_stiffness * (1 + 1e-9):
        target = inputs.value("target_isolation")
        flags.append(Flag("warning", f"isolation {100 * (1 - transmitted):.3g} % is short of the target "
                                     f"{100 * target:.3g} %: the mounts must be softer"))
    flags.append(Flag("info", "assumes a rigid support: on a flexible floor keep the mounted frequency well "
                              "below the floor's own"))
    return flags


SPEC = CheckSpec(
    id="isolate",
    title="Machine isolation",
    summary="transmissibility of a machine on mounts, or the mounts a target isolation needs",
    fields=FIELDS,
    compute=compute,
    series=(
        Series("frequency_ratio", "Frequency ratio r = f/fn", "number"),
        Series("transmissibility", "Transmissibility T", "number", "frequency_ratio"),
    ),
)
