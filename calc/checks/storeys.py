"""Check `storeys`: shear-building periods, mode shapes, effective masses, Rayleigh damping and
modal response-spectrum combination (SRSS and CQC)."""

from __future__ import annotations

from typing import TYPE_CHECKING

import numpy as np

from calc.checks import storeys_demand as demand
from calc.checks.guard import overflow_guard
from calc.result import SEISMIC_CAUTION, Flag, Reference, Result, Value
from calc.spec import CheckSpec, Field, Inputs, quantity

if TYPE_CHECKING:
    from calc.storeys import Modes

MAX_SPREAD = 1e6
"""Largest ratio between the largest and smallest storey mass, or stiffness, accepted (beyond it the
chain is ill-conditioned)."""
DEFAULT_DAMPING = 0.05
"""Damping ratio of every mode when none is given (the usual 5 % of design spectra)."""
CHART_MODES = 3
"""Mode shapes kept as chart series."""

FIELDS = (
    Field("masses", "Storey masses", "mass", "310 t, 300 t, 240 t", "t", many=True,
          help="bottom to top; masses or weights (read as W/g0)"),
    Field("stiffnesses", "Storey stiffnesses", "stiffness", "180 kN/mm, 160 kN/mm, 120 kN/mm", "kN/mm", many=True,
          help="lateral stiffness of each storey, bottom to top"),
    Field("heights", "Storey heights", "length", "4.5 m, 3.5 m, 3.5 m", "m", many=True, required=False,
          help="bottom to top; gives drift ratios and the chart's height axis"),
    Field("damping", "Damping ratio", "ratio", "5 %", "", required=False,
          help="of every mode, for Rayleigh damping and CQC (default 5 %)"),
    Field("rayleigh_modes", "Rayleigh modes", "count", "1, 2", "", many=True, required=False,
          help="the two modes given the damping ratio exactly"),
    *demand.FIELDS,
)

REFERENCES = (
    Reference("Generalised eigenproblem K phi = omega^2 M phi of a fixed-base shear building "
              "(scipy.linalg.eigh); participation and effective modal mass",
              "Chopra, Dynamics of Structures, ch. 10 and 13"),
    Reference("Rayleigh damping C = alpha M + beta K fixed at two modes", "Chopra, Dynamics of Structures, ch. 11"),
    Reference("Modes for 90 % mass", "EN 1998-1:2004 4.3.3.3.1(3) (from memory)"),
    Reference("Soft storey: stiffness below 70 % of the storey above or 80 % of the average of the three above",
              "ASCE 7-16 Table 12.3-2, type 1a (from memory)"),
)


@overflow_guard("masses")
def compute(inputs: Inputs) -> Result:
    from calc import storeys

    masses, stiffnesses = _chain(inputs)
    zeta = inputs.optional("damping", DEFAULT_DAMPING, minimum=0.0, maximum=0.5) or 0.0
    found = storeys.modes(masses, stiffnesses)
    total = float(masses.sum())
    ratios = found.effective_mass_ratio(total)
    periods = found.periods
    needed = storeys.modes_for_mass_share(ratios)
    values: dict[str, Value] = {
        "period": quantity("Fundamental period", "time", periods[0]),
        "periods": quantity("Periods", "time", periods),
        "frequencies": quantity("Frequencies", "frequency", found.omega / (2 * np.pi)),
        "mode_shapes": quantity("Mode shapes (per mode, roof = 1)", "number", found.shapes),
        "participation": quantity("Participation", "number", found.participation),
        "effective_mass_ratio": quantity("Effective mass", "ratio", ratios),
        "cumulative_mass_ratio": quantity("Cumulative mass", "ratio", np.cumsum(ratios)),
        "total_mass": quantity("Total mass", "mass", total),
        "modes_for_90_percent": quantity("Modes for 90 % mass", "count", float(needed)),
    }
    flags = [Flag("warning", f"soft storey {storey}: stiffness {reason}")
             for storey, reason in storeys.soft_storeys(stiffnesses)]
    flags.append(Flag("info", f"{needed} of {len(masses)} modes reach 90 % of the mass"))
    flags.extend(Flag("info", f"mode {n + 1} has no roof motion: its shape is scaled to its largest value")
                 for n in np.nonzero(found.roof_free)[0])
    values.update(_rayleigh(inputs, found.omega, zeta, flags))
    references: tuple[Reference, ...] = REFERENCES
    if inputs.has("design_ground_acceleration"):
        heights = inputs.array("heights") if inputs.has("heights") else None
        values.update(demand.modal_demand(inputs, found, masses, heights, zeta, flags))
        references += demand.REFERENCES
    return inputs.result(values, series=_series(inputs, found), flags=tuple(flags), references=references)


def _chain(inputs: Inputs) -> tuple[np.ndarray, np.ndarray]:
    """Storey masses (kg) and stiffnesses (N/m), checked for length and spread."""
    masses = inputs.array("masses", positive=True)
    stiffnesses = inputs.array("stiffnesses", positive=True)
    if len(stiffnesses) != len(masses):
        raise inputs.error("stiffnesses", f"{len(stiffnesses)} stiffnesses for {len(masses)} masses: "
                                          "give one per storey")
    for name, array in (("masses", masses), ("stiffnesses", stiffnesses)):
        if array.max() / array.min() > MAX_SPREAD:
            raise inputs.error(name, f"largest and smallest differ more than {MAX_SPREAD:.0e} times")
    if inputs.has("heights"):
        heights = inputs.array("heights", positive=True)
        if len(heights) != len(masses):
            raise inputs.error("heights", f"{len(heights)} heights for {len(masses)} storeys: give one per storey")
    return masses, stiffnesses


def _rayleigh(inputs: Inputs, omega: np.ndarray, zeta: float, flags: list[Flag]) -> dict[str, Value]:
    """Rayleigh coefficients for the two chosen modes, and the damping ratio they give every mode."""
    from calc import storeys

    if len(omega) < 2:
        flags.append(Flag("info", "one storey: Rayleigh damping needs two modes"))
        return {}
    chosen = [1, 2]
    if inputs.has("rayleigh_modes"):
        chosen = [int(i) for i in inputs.array("rayleigh_modes", positive=True)]
        if len(chosen) != 2 or chosen[0] == chosen[1]:
            raise inputs.error("rayleigh_modes", "give two different mode numbers, e.g. '1, 3'")
        if max(chosen) > len(omega):
            raise inputs.error("rayleigh_modes", f"there are only {len(omega)} modes")
    alpha, beta = storeys.rayleigh_coefficients(omega[chosen[0] - 1], omega[chosen[1] - 1], zeta)
    return {
        "rayleigh_alpha": quantity(f"Rayleigh alpha ({chosen[0]}, {chosen[1]})", "angular_frequency", alpha),
        "rayleigh_beta": quantity(f"Rayleigh beta ({chosen[0]}, {chosen[1]})", "time", beta),
        "rayleigh_damping": quantity("Rayleigh damping", "ratio",
                                     storeys.rayleigh_damping_ratios(omega, alpha, beta)),
    }


def _series(inputs: Inputs, found: Modes) -> dict[str, np.ndarray]:
    """Floor levels from the base up and the first mode shapes, each with 0 at the base."""
    count = found.shapes.shape[1]
    if inputs.has("heights"):
        series = {"height": np.concatenate([[0.0], np.cumsum(inputs.array("heights"))])}
    else:
        series = {"storey": np.arange(count + 1, dtype=float)}
    for n, shape in enumerate(found.shapes[:CHART_MODES], start=1):
        series[f"mode_{n}"] = np.concatenate([[0.0], shape])
    return series


SPEC = CheckSpec(
    id="storeys",
    title="Storey modes",
    summary="periods, mode shapes, effective masses and modal seismic demand of a shear building",
    fields=FIELDS,
    compute=compute,
    caution=SEISMIC_CAUTION,
    sends={"period": "period"},
)
