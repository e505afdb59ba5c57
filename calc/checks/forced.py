"""Check `forced`: steady response of a single mass to a harmonic force or a rotating unbalance."""

from __future__ import annotations

import math
from typing import TYPE_CHECKING

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
from fieldmode.calc.framework.meaning import MACHINE, STRUCTURE, Meaning
from fieldmode.calc.framework.result import Flag, Reference, Result, quantity
from fieldmode.calc.framework.spec import CheckSpec, Field, Series
from fieldmode.calc.physics import forced, sdof

if TYPE_CHECKING:
    from fieldmode.calc.framework.reading import Inputs

FIELDS = (
    Field("mass", "Mass", "mass", "9.6 t", "t", shared=True, help="a mass, or a weight read as W/g0",
          meaning=Meaning("mass", STRUCTURE)),
    Field("stiffness", "Stiffness", "stiffness", "42 kN/mm", "kN/mm", help="of the support under the mass",
          meaning=Meaning("stiffness", STRUCTURE)),
    Field("damping", "Damping ratio", "ratio", "2 %", "", shared=True, meaning=Meaning("damping ratio", STRUCTURE)),
    Field("frequency", "Operating frequency", "frequency", "740 rpm", "Hz", shared=True,
          help="Hz, or a speed in rpm", meaning=Meaning("operating frequency", MACHINE)),
    Field("force", "Force amplitude", "force", "", "kN", group="load", meaning=Meaning("force amplitude", MACHINE)),
    Field("unbalance", "Unbalance m e", "unbalance", "0.35 kg m", "kg*m", group="load",
          help="rotating mass x eccentricity; force = m e w^2", meaning=Meaning("unbalance", MACHINE)),
    *grade_fields("load", True),
)

REFERENCES = (
    Reference("Steady-state response to a harmonic force: R_d = 1/sqrt((1-r^2)^2 + (2 zeta r)^2), "
              "phase atan2(2 zeta r, 1-r^2), peak 1/(2 zeta sqrt(1-zeta^2)) at r = sqrt(1-2 zeta^2)",
              "Chopra, Dynamics of Structures, sec. 3.2; Clough & Penzien, Dynamics of Structures, ch. 3"),
    Reference("Force transmitted to the support through spring and damper, T = sqrt(1+(2 zeta r)^2) R_d",
              "Chopra, Dynamics of Structures, sec. 3.5; Den Hartog, Mechanical Vibrations, ch. 2"),
)

UNBALANCE_REFERENCE = Reference(
    "Rotating unbalance: force m e w^2 grows with speed; amplitude M u/(m e) = r^2 R_d, peaking at "
    "r = 1/sqrt(1-2 zeta^2)", "Den Hartog, Mechanical Vibrations, ch. 2; Chopra, Dynamics of Structures, sec. 3.7")


@overflow_guard("frequency")
def compute(inputs: Inputs) -> Result:
    mass = inputs.value("mass", positive=True)
    stiffness = inputs.value("stiffness", positive=True)
    zeta = _damping(inputs)
    frequency = inputs.value("frequency", positive=True)
    natural_frequency = sdof.angular_frequency(stiffness, mass) / (2 * math.pi)
    r = frequency / natural_frequency
    balance = grade_unbalance(inputs, frequency, "mass") if inputs.has("grade") else None
    unbalance = balance is not None or inputs.has("unbalance")
    me = (balance.unbalance if balance is not None else
          inputs.value("unbalance", positive=True) if unbalance else 0.0)
    force = forced.unbalance_force(me, frequency) if unbalance else inputs.value("force", positive=True)
    omega = 2 * math.pi * frequency
    static = force / stiffness
    gain = float(forced.amplification(r, zeta))
    amplitude = gain * static
    peak_gain = forced.peak_amplification(zeta)
    if unbalance:
        peak_ratio = forced.unbalance_peak_ratio(zeta)
        # M u / (m e) peaks at peak_gain, or without a peak tends to 1 at high speed
        peak_amplitude = me / mass * (peak_gain if forced.has_peak(zeta) else 1.0)
    else:
        peak_ratio = forced.peak_ratio(zeta)
        peak_amplitude = static * peak_gain
    values = {
        "natural_frequency": quantity("Natural frequency", "frequency", natural_frequency,
                                      meaning=Meaning("natural frequency", STRUCTURE)),
        "frequency_ratio": quantity("Frequency ratio r = f/fn", "number", r),
        "amplification": quantity("Dynamic amplification R_d", "number", gain),
        "phase": quantity("Phase lag", "angle", float(forced.phase(r, zeta))),
        "force_amplitude": quantity("Force amplitude", "force", force),
        "static_displacement": quantity("Static displacement F/k", "length", static),
        "amplitude": quantity("Displacement amplitude", "length", amplitude),
        "velocity_amplitude": quantity("Velocity amplitude", "velocity", omega * amplitude),
        "acceleration_amplitude": quantity("Acceleration amplitude", "acceleration", omega**2 * amplitude),
        "transmitted_force": quantity("Force into the support", "force",
                                      force * float(forced.transmissibility(r, zeta))),
        "peak_amplification": quantity("Peak amplification", "number", peak_gain),
        "peak_amplitude": quantity("Peak amplitude on run-up" if unbalance else "Peak amplitude", "length",
                                   peak_amplitude),
    }
    if math.isfinite(peak_ratio):
        values["peak_frequency"] = quantity("Peak frequency", "frequency", peak_ratio * natural_frequency)
    if unbalance:
        values["unbalance_amplification"] = quantity("Unbalance response M u/(m e) = r^2 R_d", "number", r**2 * gain)
    if balance is not None:
        values.update(balance_values(balance, force=False))
    grid = forced.ratio_grid(r, zeta)
    series = {"frequency_ratio": grid, "amplification": forced.amplification(grid, zeta),
              "phase": forced.phase(grid, zeta)}
    references = (REFERENCES + ((UNBALANCE_REFERENCE,) if unbalance else ())
                  + ((BALANCE_REFERENCE,) if balance is not None else ()))
    notes = (plausible.static_deflection(mass * sdof.STANDARD_GRAVITY / stiffness, "the stiffness unit"),
             plausible.operating_frequency(frequency))
    flags = _flags(r, zeta, natural_frequency, unbalance) + tuple(note for note in notes if note)
    flags += (balance_flag(balance, frequency),) if balance is not None else rotor_mass_unused(inputs)
    return inputs.result(values, series=series, flags=flags, references=references)


def _damping(inputs: Inputs) -> float:
    zeta = inputs.value("damping", minimum=0.0)
    if zeta == 0:
        raise inputs.error("damping", "must be greater than zero: the response at resonance is unbounded "
                                      "without damping")
    return zeta


def _flags(r: float, zeta: float, natural_frequency: float, unbalance: bool) -> tuple[Flag, ...]:
    flags = []
    if abs(r - 1.0) <= forced.RESONANCE_BAND:
        flags.append(Flag("warning", f"operating within +/-20 % of resonance (r = {r:.3g}): "
                                     "retune the support or the speed"))
    if r > 1.0:
        flags.append(Flag("caution", f"operating above resonance: run-up and run-down pass through "
                                     f"{natural_frequency:.4g} Hz, amplification up to "
                                     f"{forced.peak_amplification(zeta):.3g}"))
    if unbalance:
        flags.append(Flag("info", "unbalance: force m e w^2 taken at the operating speed; amplification shown "
                                  "is R_d for that force; the run-up amplitude peaks at r = 1/sqrt(1-2 zeta^2)"))
    if not forced.has_peak(zeta):
        flags.append(Flag("info", "damping of 70.7 % or more: no resonance peak"))
    return tuple(flags)


SPEC = CheckSpec(
    id="forced",
    title="Harmonic load",
    summary="steady response to a harmonic force or rotating unbalance; distance from resonance",
    fields=FIELDS,
    compute=compute,
    series=(
        Series("frequency_ratio", "Frequency ratio r = f/fn", "number"),
        Series("amplification", "Dynamic amplification R_d", "number", "frequency_ratio"),
        Series("phase", "Phase lag", "angle", "frequency_ratio"),
    ),
)
