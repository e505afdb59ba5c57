"""Check `tmd`: tuned mass damper sizing for one mode, with the two-mass response."""

from __future__ import annotations

import math
from typing import TYPE_CHECKING

import numpy as np

from fieldmode.calc.framework.guard import overflow_guard
from fieldmode.calc.framework.meaning import STRUCTURE, Meaning
from fieldmode.calc.framework.result import Flag, Reference, Result, quantity
from fieldmode.calc.framework.spec import CheckSpec, Field, Series

if TYPE_CHECKING:
    from fieldmode.calc.framework.reading import Inputs
    from fieldmode.calc.physics.tmd import Optimum

EXCITATIONS = ("force", "ground")

MISTUNING = 0.05
"""Damper frequency error shown either side of the optimum (5 %)."""

CHART_POINTS = 120
"""Points per chart curve (about twice the plot width); an even count never lands on r = 1."""

FIELDS = (
    Field("frequency", "Mode frequency", "frequency", "2.1 Hz", "Hz", shared=True,
          help="natural frequency of the mode to be damped", meaning=Meaning("natural frequency", STRUCTURE)),
    Field("modal_mass", "Modal mass", "mass", "18 t", "t", help="a mass, or a weight read as W/g0",
          meaning=Meaning("modal mass", STRUCTURE)),
    Field("damping", "Mode damping ratio", "ratio", "0.6 %", "", shared=True,
          help="the structure's own damping in this mode", meaning=Meaning("damping ratio", STRUCTURE)),
    Field("mass_ratio", "Mass ratio", "ratio", "2 %", "", group="size",
          help="damper mass / modal mass, 0.1 % to 50 %"),
    Field("target_damping", "Target equivalent damping", "ratio", "", "", group="size",
          help="damping of a single mass with the same resonant peak; solves for the mass ratio",
          meaning=Meaning("damping ratio needed", STRUCTURE)),
    Field("excitation", "Excitation", "choice", "force", choices=EXCITATIONS, required=False,
          help="force (default): harmonic force on the structure (Den Hartog); ground: harmonic ground acceleration "
               "(Warburton)"),
    Field("force", "Force amplitude", "force", "", "kN", required=False, used_when={"excitation": ("force", "")},
          help="harmonic force for the displacement and damper stroke (excitation force)"),
    Field("ground_acceleration", "Ground acceleration amplitude", "acceleration", "", "m/s^2",
          required=False, used_when={"excitation": ("ground",)},
          help="for the displacement and damper stroke (excitation ground)"),
)

REFERENCES = {
    "force": Reference("Optimum tuning and damping of a damper on an undamped primary under a harmonic force",
                       "Den Hartog, Mechanical Vibrations (fixed-point method)"),
    "ground": Reference("Optimum tuning and damping for harmonic ground acceleration (primary displacement)",
                        "Warburton, Earthquake Engineering and Structural Dynamics 10 (1982)"),
}
RESPONSE_REFERENCE = Reference("Peaks from the two-mass frequency response (complex linear solve on a fine "
                               "frequency grid, refined by zooming into each peak)",
                               "Den Hartog, Mechanical Vibrations; Clough & Penzien, Dynamics of Structures")


@overflow_guard("modal_mass")
def compute(inputs: Inputs) -> Result:
    from fieldmode.calc.physics import tmd

    frequency = inputs.value("frequency", positive=True)
    modal_mass = inputs.value("modal_mass", positive=True)
    zeta_p = inputs.value("damping", minimum=0.0, maximum=0.5)
    excitation = inputs.text("excitation") if inputs.has("excitation") else "force"
    flags: list[Flag] = []
    if inputs.has("mass_ratio"):
        mu = inputs.value("mass_ratio", minimum=tmd.MIN_MASS_RATIO, maximum=tmd.MAX_MASS_RATIO)
    else:
        mu = _solve_mass_ratio(inputs, zeta_p, excitation)
        if mu == tmd.MIN_MASS_RATIO:
            flags.append(Flag("info", f"the smallest mass ratio considered ({mu:.1%}) already reaches the target"))
    best = tmd.optimum(mu, excitation)
    omega_p = 2 * math.pi * frequency
    mass, omega_d = mu * modal_mass, best.tuning * omega_p
    peak, peak_ratio = tmd.peak(mu, best.tuning, best.damping, zeta_p, excitation)
    stroke, _ = tmd.peak(mu, best.tuning, best.damping, zeta_p, excitation, which="stroke")
    bare = tmd.bare_peak(zeta_p)
    low = tmd.peak(mu, best.tuning * (1 - MISTUNING), best.damping, zeta_p, excitation)[0]
    high = tmd.peak(mu, best.tuning * (1 + MISTUNING), best.damping, zeta_p, excitation)[0]
    values = {
        "mass_ratio": quantity("Mass ratio", "ratio", mu),
        "tmd_mass": quantity("Damper mass", "mass", mass),
        "tuning_ratio": quantity("Tuning ratio f_d / f", "number", best.tuning),
        "tmd_frequency": quantity("Damper frequency", "frequency", omega_d / (2 * math.pi)),
        "tmd_stiffness": quantity("Damper stiffness", "stiffness", mass * omega_d**2),
        "tmd_damping_ratio": quantity("Damper damping ratio c/(2 m_d w_d)", "ratio", best.damping),
        "tmd_damping_coefficient": quantity("Damper damping coefficient", "damping_coefficient",
                                            2 * best.damping * mass * omega_d),
        "peak_amplification": quantity("Peak amplification, with damper", "number", peak),
        "peak_frequency": quantity("Frequency of that peak", "frequency", peak_ratio * frequency),
        "peak_amplification_closed_form": quantity("Peak, closed form (undamped mode)", "number", best.peak),
        "equivalent_damping": quantity("Equivalent damping (same peak)", "ratio", tmd.equivalent_damping(peak)),
        "stroke_ratio": quantity("Damper stroke / static displacement", "number", stroke),
        "peak_amplification_mistuned_low": quantity(f"Peak, damper tuned {MISTUNING:.0%} low", "number", low),
        "peak_amplification_mistuned_high": quantity(f"Peak, damper tuned {MISTUNING:.0%} high", "number", high),
    }
    if math.isfinite(bare):
        values["peak_amplification_without"] = quantity("Peak amplification, without damper", "number", bare)
        values["peak_reduction"] = quantity("Peak reduction", "ratio", 1 - peak / bare)
    else:
        flags.append(Flag("info", "undamped mode: without a damper the resonant response is unbounded"))
    static = _static_displacement(inputs, excitation, modal_mass, omega_p)
    if static is not None:
        values["peak_displacement"] = quantity("Peak displacement of the structure", "length", peak * static)
        values["stroke"] = quantity("Damper stroke (relative motion)", "length", stroke * static)
    flags.extend(_flags(mu, zeta_p, peak, low, high))
    return inputs.result(values, series=_series(mu, best, zeta_p, excitation), flags=tuple(flags),
                         references=(REFERENCES[excitation], RESPONSE_REFERENCE))


def _solve_mass_ratio(inputs: Inputs, zeta_p: float, excitation: str) -> float:
    from fieldmode.calc.physics import tmd

    target = inputs.value("target_damping", positive=True, maximum=0.5)
    if target <= zeta_p:
        raise inputs.error("target_damping", "must be above the mode's own damping")
    try:
        return tmd.mass_ratio_for_damping(target, zeta_p, excitation)
    except ValueError as error:
        raise inputs.error("target_damping", str(error)) from error


def _static_displacement(inputs: Inputs, excitation: str, modal_mass: float, omega_p: float) -> float | None:
    """Static displacement (m) of the structure under the given load amplitude, if one was given (the
    other excitation's amplitude is not read: :attr:`Field.used_when`)."""
    stiffness = modal_mass * omega_p**2
    wanted = "force" if excitation == "force" else "ground_acceleration"
    if not inputs.has(wanted):
        return None
    amplitude = inputs.value(wanted, positive=True)
    return amplitude / stiffness if excitation == "force" else modal_mass * amplitude / stiffness


def _flags(mu: float, zeta_p: float, peak: float, low: float, high: float) -> list[Flag]:
    flags = []
    if zeta_p > 0:
        flags.append(Flag("info", "optimum formulas assume an undamped mode; the peaks shown include "
                                  f"the mode's {zeta_p:.2%} damping"))
    worst = max(low, high)
    if worst > 1.2 * peak:
        flags.append(Flag("caution", f"{MISTUNING:.0%} mistuning raises the peak by {worst / peak - 1:.0%}: "
                                     "provide tuning adjustment and verify the frequency on site"))
    if mu > 0.1:
        flags.append(Flag("caution", f"mass ratio {mu:.0%} is large for an added damper: check the "
                                     "structure carries it"))
    return flags


def _series(mu: float, best: Optimum, zeta_p: float, excitation: str) -> dict[str, np.ndarray]:
    """Response curves for the chart: with the damper, without, and mistuned either side."""
    from fieldmode.calc.physics import tmd

    spread = max(0.3, 3 * math.sqrt(mu))
    ratio = 1 + spread * np.linspace(-1.0, 1.0, CHART_POINTS)
    if 0 < zeta_p < math.sqrt(0.5):
        ratio = np.sort(np.append(ratio, math.sqrt(1 - 2 * zeta_p**2)))  # the bare mode's resonant peak
    ratio = ratio[ratio >= 0.05]
    with_damper = np.abs(tmd.response(ratio, mu, best.tuning, best.damping, zeta_p, excitation)[0])
    without = np.abs(tmd.response(ratio, 0.0, 1.0, 0.0, zeta_p, excitation)[0])
    low = np.abs(tmd.response(ratio, mu, best.tuning * (1 - MISTUNING), best.damping, zeta_p, excitation)[0])
    high = np.abs(tmd.response(ratio, mu, best.tuning * (1 + MISTUNING), best.damping, zeta_p, excitation)[0])
    return {"frequency_ratio": ratio, "amplification": with_damper, "amplification_without": without,
            "amplification_mistuned_low": low, "amplification_mistuned_high": high}


SPEC = CheckSpec(
    id="tmd",
    title="Tuned mass damper",
    summary="damper mass, frequency, stiffness and damping for one mode, with and without the damper",
    fields=FIELDS,
    compute=compute,
    series=(
        Series("frequency_ratio", "Forcing / mode frequency", "number"),
        Series("amplification", "Amplification with the damper", "number", "frequency_ratio"),
        Series("amplification_without", "Amplification without the damper", "number", "frequency_ratio"),
        Series("amplification_mistuned_low", f"With the damper tuned {MISTUNING:.0%} low", "number",
               "frequency_ratio"),
        Series("amplification_mistuned_high", f"With the damper tuned {MISTUNING:.0%} high", "number",
               "frequency_ratio"),
    ),
)
