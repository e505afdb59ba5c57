"""Check `isolate`: a machine on resilient mounts, or the mounts a target isolation needs."""

from __future__ import annotations

import math
from typing import TYPE_CHECKING

import numpy as np

from fieldmode.calc.checks.machine import (
    BALANCE_REFERENCE,
    balance_flag,
    balance_values,
    grade_fields,
    grade_unbalance,
    rotor_mass_unused,
)
from fieldmode.calc.framework import plausible
from fieldmode.calc.framework.guard import overflow_guard
from fieldmode.calc.framework.meaning import MACHINE, MOUNTS, Meaning
from fieldmode.calc.framework.result import Flag, Reference, Result, Value, quantity, word
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
    Field("damping", "Mount damping ratio", "ratio", "2 %", "", required=False,
          help="steel springs about 0.5-1 %, rubber about 5 %; 0 or empty: undamped",
          meaning=Meaning("damping ratio", MOUNTS)),
    Field("stiffness", "Mount stiffness, total", "stiffness", "", "kN/mm", required=False,
          help="all mounts together; give it, a target isolation, or both", meaning=Meaning("stiffness", MOUNTS)),
    Field("target_isolation", "Target isolation", "ratio", "90 %", "", required=False,
          help="fraction of the force kept from the support, e.g. 90 %", meaning=Meaning("target isolation", MOUNTS)),
    Field("force", "Force amplitude", "force", "", "kN", group="load", required=False,
          help="optional: the machine's harmonic force, to give the force into the support",
          meaning=Meaning("force amplitude", MACHINE)),
    Field("unbalance", "Unbalance m e", "unbalance", "", "kg*m", group="load", required=False,
          help="optional: rotating mass x eccentricity; force = m e w^2", meaning=Meaning("unbalance", MACHINE)),
    *grade_fields("load", False),
)

REFERENCES = (
    Reference("Force transmissibility of a damped mass on mounts over a rigid support, "
              "T = sqrt(1+(2 zeta r)^2)/sqrt((1-r^2)^2+(2 zeta r)^2), T = 1 at r = sqrt(2)",
              "Chopra, Dynamics of Structures, sec. 3.5; Den Hartog, Mechanical Vibrations, ch. 2"),
    Reference("Required natural frequency solved from the damped T (a quadratic in r^2), not the undamped "
              "1/(r^2-1); peak T at r^2 = 2/(1+sqrt(1+8 zeta^2))",
              "Rao, Mechanical Vibrations, sec. 9.10; Clough & Penzien, Dynamics of Structures, ch. 3"),
)
UNDAMPED_REFERENCE = Reference("Without damping T = 1/|1 - r^2| (the limit of the damped T), unbounded at r = 1",
                               "Chopra, Dynamics of Structures, sec. 3.5")

CHART_LIMIT = 1000.0
"""Largest T drawn on the chart of an undamped mount (the log axis would otherwise reach infinity)."""


@overflow_guard("frequency")
def compute(inputs: Inputs) -> Result:
    frequency = inputs.value("frequency", positive=True)
    mass = inputs.value("mass", positive=True)
    mounts = int(inputs.value("mounts", positive=True))
    zeta = inputs.optional("damping", 0.0, minimum=0.0) or 0.0
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
        values["required_natural_frequency"] = quantity("Required frequency, max", "frequency",
                                                        required_frequency)
        values["required_stiffness"] = quantity("Required stiffness, max", "stiffness",
                                                required_stiffness)
        if zeta > 0:
            undamped = frequency / isolate.undamped_ratio_for_transmissibility(1.0 - target)
            flags.append(Flag("info", f"solved with damping: the undamped formula would allow {undamped:.4g} Hz"))
    stiffness = inputs.value("stiffness", positive=True) if inputs.has("stiffness") else required_stiffness
    assert stiffness is not None
    natural_frequency = sdof.angular_frequency(stiffness, mass) / (2 * math.pi)
    r = frequency / natural_frequency
    transmitted = float(forced.transmissibility(r, zeta))
    if not math.isfinite(transmitted):
        raise inputs.error("damping", "no damping and the machine runs at the mounted natural frequency: the "
                                      "force through the mounts is unbounded; give the damping")
    weight = mass * STANDARD_GRAVITY
    values = {
        "natural_frequency": quantity("Frequency on the mounts", "frequency", natural_frequency),
        "frequency_ratio": quantity("Frequency ratio r = f/fn", "number", r),
        "transmissibility": quantity("Transmissibility T", "number", transmitted),
        **_isolation_or_amplification(transmitted),
        **values,
        "stiffness": quantity("Mount stiffness, total", "stiffness", stiffness),
        "stiffness_per_mount": quantity("Stiffness per mount", "stiffness", stiffness / mounts),
        "load_per_mount": quantity("Load per mount", "force", weight / mounts),
        "static_deflection": quantity("Static deflection", "length", weight / stiffness),
        **_start_up_peak(zeta, natural_frequency),
    }
    values.update(_load(inputs, frequency, transmitted, mounts, flags))
    flags += _flags(inputs, r, transmitted, natural_frequency, zeta, required_stiffness, stiffness)
    flags += _plausibility(inputs, frequency, weight / stiffness)
    series = {"frequency_ratio": (grid := _grid(r, zeta)), "transmissibility": forced.transmissibility(grid, zeta)}
    references = (REFERENCES + ((UNDAMPED_REFERENCE,) if zeta == 0 else ())
                  + ((BALANCE_REFERENCE,) if inputs.has("grade") else ()))
    return inputs.result(values, series=series, flags=tuple(flags), references=references)


def _load(inputs: Inputs, frequency: float, transmitted: float, mounts: int, flags: list[Flag]) -> dict[str, Value]:
    """The machine's force (given, from m e, or from a balance grade) and what of it reaches the support."""
    values: dict[str, Value] = {}
    force: float | None = None
    if inputs.has("grade"):
        balance = grade_unbalance(inputs, frequency, "mass")
        force = balance.force
        values.update(balance_values(balance, force=False))
        flags.append(balance_flag(balance, frequency))
    elif inputs.has("unbalance"):
        force = forced.unbalance_force(inputs.value("unbalance", positive=True), frequency)
    elif inputs.has("force"):
        force = inputs.value("force", positive=True)
    flags.extend(rotor_mass_unused(inputs))
    if force is None:
        return values
    return {"force_amplitude": quantity("Force amplitude", "force", force), **values,
            "transmitted_force": quantity("Force into the support", "force", transmitted * force),
            "transmitted_per_mount": quantity("Force per mount", "force", transmitted * force / mounts)}


def _isolation_or_amplification(transmitted: float) -> dict[str, Value]:
    """Isolation 1 - T while the mounts isolate (T <= 1); above, how many times they amplify."""
    if transmitted <= 1.0:
        return {"isolation": quantity("Isolation 1 - T", "ratio", 1.0 - transmitted)}
    return {"amplification": quantity("Amplification by the mounts (times)", "number", transmitted)}


def _start_up_peak(zeta: float, natural_frequency: float) -> dict[str, Value]:
    """The largest T passed at start-up and run-down, and where; unbounded without damping."""
    peak_ratio = isolate.peak_transmissibility_ratio(zeta)
    peak: Value = (word("Peak T at start-up", "unbounded") if zeta == 0 else
                   quantity("Peak T at start-up", "number", isolate.peak_transmissibility(zeta)))
    return {"peak_transmissibility": peak,
            "peak_frequency": quantity("Frequency of the peak T", "frequency", peak_ratio * natural_frequency)}


def _grid(r: float, zeta: float) -> np.ndarray:
    """Frequency ratios of the chart: up to 3 or past the operating point, with the peak, sqrt(2) and r.

    Without damping T = 1/|1 - r^2| has no bound at r = 1: points where T exceeds CHART_LIMIT are left
    out (the operating point is kept), so the curve stays finite.
    """
    grid = np.union1d(np.linspace(0.0, max(3.0, 1.25 * r), 601),
                      [isolate.peak_transmissibility_ratio(zeta), isolate.AMPLIFYING_RATIO, r])
    if zeta > 0:
        return grid
    with np.errstate(divide="ignore"):
        kept = (forced.transmissibility(grid, 0.0) <= CHART_LIMIT) | (grid == r)
    return grid[kept]


def _target(inputs: Inputs) -> float:
    target = inputs.value("target_isolation")
    if not 0.0 < target < 1.0:
        raise inputs.error("target_isolation", "must be between 0 % and 100 %, both excluded")
    return target


def _flags(inputs: Inputs, r: float, transmitted: float, natural_frequency: float, zeta: float,
           required_stiffness: float | None, stiffness: float) -> list[Flag]:
    flags = []
    if transmitted > 1.0:
        flags.append(Flag("warning", f"Amplification by the mounts {transmitted:.3g} times: the frequency ratio "
                                     f"{r:.3g} is below sqrt(2), so the mounts amplify the force instead of "
                                     "isolating it"))
    if abs(r - 1.0) <= forced.RESONANCE_BAND:
        flags.append(Flag("warning", "operating within +/-20 % of the mounted natural frequency"))
    if zeta == 0:
        if not inputs.has("damping"):
            flags.append(Flag("info", "no damping given: treated as undamped, T = 1/|1 - r^2|"))
        flags.append(Flag("caution", f"without damping the peak T at {natural_frequency:.4g} Hz is unbounded "
                                     "(passed at start-up and run-down above that speed); real mounts have some "
                                     "damping (steel springs about 0.5 %): give it for a finite peak"))
    elif r > 1.0:
        flags.append(Flag("caution", f"start-up and run-down pass through {natural_frequency:.4g} Hz, where T "
                                     f"reaches {isolate.peak_transmissibility(zeta):.3g}"))
    if required_stiffness is not None and stiffness > required_stiffness * (1 + 1e-9):
        target = inputs.value("target_isolation")
        flags.append(Flag("warning", f"isolation {100 * (1 - transmitted):.3g} % is short of the target "
                                     f"{100 * target:.3g} %: the mounts must be softer"))
    flags.append(Flag("info", "assumes a rigid support: on a flexible floor keep the mounted frequency well "
                              "below the floor's own"))
    return flags


def _plausibility(inputs: Inputs, frequency: float, deflection: float) -> list[Flag]:
    """Notes for a deflection or speed that is most often a slip of unit."""
    check = ("the stiffness unit" if inputs.has("stiffness") else
             "the target and the speed: mounts this soft are seldom stable")
    notes = (plausible.static_deflection(deflection, check), plausible.operating_frequency(frequency))
    return [note for note in notes if note is not None]


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
