"""Check `storeys`: shear-building periods, mode shapes, effective masses, Rayleigh damping and
modal response-spectrum combination (SRSS and CQC).

The seismic part takes the EN 1998-1 spectrum (3.2.2.2 elastic and 3.2.2.5 design) with the ground
fields, National Annex overrides and their reading of the `design-spectrum` check.
"""

from __future__ import annotations

from typing import TYPE_CHECKING

import numpy as np

from fieldmode.calc.checks.design_spectrum import GROUND_FIELDS, SHAPE_FIELDS, design_ground_acceleration, read_shape
from fieldmode.calc.framework import plausible
from fieldmode.calc.framework.guard import overflow_guard
from fieldmode.calc.framework.meaning import BUILDING, Meaning
from fieldmode.calc.framework.result import SEISMIC_CAUTION, Flag, Reference, Result, Value, quantity, word
from fieldmode.calc.framework.spec import CheckSpec, Field, Series

if TYPE_CHECKING:
    from fieldmode.calc.framework.reading import Inputs
    from fieldmode.calc.physics.storeys import Modes

MAX_SPREAD = 1e6
"""Largest ratio between the largest and smallest storey mass, or stiffness, accepted (beyond it the
chain is ill-conditioned)."""
DEFAULT_DAMPING = 0.05
"""Damping ratio of every mode when none is given (the usual 5 % of design spectra)."""
CHART_MODES = 3
"""Mode shapes kept as chart series."""

CLOSE_PERIODS = 0.9
"""Modes whose periods are within 10 % of each other are not independent (SRSS unsafe)."""

DRIFT_LIMITS = {"brittle": 0.005, "ductile": 0.0075, "separated-or-none": 0.010}
"""Damage limitation alpha in d_r nu <= alpha h by the building's non-structural elements: brittle materials
attached to the structure, ductile elements, or elements fixed so as not to interfere with structural
deformations (or none). EN 1998-1:2004 4.4.3.2(1), eq. 4.31-4.33 (from memory)."""
REDUCTION_FACTORS = {"I": 0.5, "II": 0.5, "III": 0.4, "IV": 0.4}
"""Recommended reduction factor nu by importance class, for the more frequent seismic action of damage
limitation. EN 1998-1:2004 4.4.3.2(2) (from memory); a National Annex may set other values."""
DEFAULT_NON_STRUCTURAL = "brittle"
"""Non-structural elements assumed when none are chosen (the strictest limit)."""
DEFAULT_IMPORTANCE_CLASS = "II"
"""Importance class assumed when none is chosen (ordinary buildings, EN 1998-1 Table 4.3)."""

SEISMIC_FIELDS = (
    *(Field(f.name, f.label, f.kind, f.default, f.unit, required=False, choices=f.choices, shared=True,
            help=f.help + ("; leave empty for modes only" if f.name == "design_ground_acceleration" else ""),
            meaning=f.meaning)
      for f in GROUND_FIELDS),
    Field("behaviour_factor", "Behaviour factor q", "number", "", "", required=False,
          help="gives the design spectrum (EN 1998-1 3.2.2.5); displacements are multiplied by q (4.3.4)",
    meaning=Meaning("behaviour factor q", BUILDING)),
    *SHAPE_FIELDS,
    Field("non_structural", "Non-structural elements", "choice", DEFAULT_NON_STRUCTURAL,
          choices=tuple(DRIFT_LIMITS), required=False,
          help="damage limitation, EN 1998-1 4.4.3.2: brittle (alpha 0.005), ductile (0.0075), separated-or-none "
               f"(0.010, fixed so as not to interfere with the structure, or none); default {DEFAULT_NON_STRUCTURAL}"),
    Field("importance_class", "Importance class", "choice", DEFAULT_IMPORTANCE_CLASS, choices=tuple(REDUCTION_FACTORS),
          required=False, help="EN 1998-1 Table 4.3; gives the reduction factor nu of damage limitation "
                               f"(0.5 for I and II, 0.4 for III and IV); default {DEFAULT_IMPORTANCE_CLASS}",
          meaning=Meaning("importance class", BUILDING)),
    Field("reduction_factor", "Reduction factor nu", "number", "", "", required=False,
          help="a National Annex value of nu (EN 1998-1 4.4.3.2(2)); default from the importance class"),
)

SEISMIC_REFERENCES = (
    Reference("Spectral acceleration per mode, recommended values of Table 3.2 / 3.3",
              "EN 1998-1:2004 3.2.2.2 (elastic, eta = sqrt(10/(5+xi)) >= 0.55) and 3.2.2.5 (design, beta = 0.2)"),
    Reference("Modal peaks u = Gamma phi Sa / omega^2 combined by SRSS and by CQC",
              "Der Kiureghian (1981) correlation coefficients; Chopra, Dynamics of Structures, ch. 13; "
              "EN 1998-1:2004 4.3.3.3.2"),
    Reference("Design displacements d_s = q d_e", "EN 1998-1:2004 4.3.4(1)"),
)
DAMAGE_REFERENCE = Reference(
    "Damage limitation d_r nu <= alpha h per storey, d_r the CQC design interstorey drift; alpha 0.005 brittle, "
    "0.0075 ductile, 0.010 separated or no non-structural elements; nu 0.5 (importance I, II), 0.4 (III, IV)",
    "EN 1998-1:2004 4.4.3.2, eq. 4.31-4.33; nu recommended in 4.4.3.2(2) (from memory)")

FIELDS = (
    Field("masses", "Storey masses", "mass", "310 t, 300 t, 240 t", "t", many=True,
          help="bottom to top; masses or weights (read as W/g0)", meaning=Meaning("storey masses", BUILDING)),
    Field("stiffnesses", "Storey stiffnesses", "stiffness", "180 kN/mm, 160 kN/mm, 120 kN/mm", "kN/mm", many=True,
          help="lateral stiffness of each storey, bottom to top", meaning=Meaning("storey stiffnesses", BUILDING)),
    Field("heights", "Storey heights", "length", "4.5 m, 3.5 m, 3.5 m", "m", many=True, required=False,
          help="bottom to top; gives drift ratios and the chart's height axis",
    meaning=Meaning("storey heights", BUILDING)),
    Field("damping", "Damping ratio", "ratio", "5 %", "", required=False,
          help="of every mode, for Rayleigh damping and CQC (default 5 %)", meaning=Meaning("damping ratio", BUILDING)),
    Field("rayleigh_modes", "Rayleigh modes", "count", "1, 2", "", many=True, required=False,
          help="the two modes given the damping ratio exactly"),
    *SEISMIC_FIELDS,
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
    from fieldmode.calc.physics import storeys

    masses, stiffnesses = _chain(inputs)
    zeta = inputs.optional("damping", DEFAULT_DAMPING, minimum=0.0, maximum=0.5) or 0.0
    found = storeys.modes(masses, stiffnesses)
    total = float(masses.sum())
    ratios = found.effective_mass_ratio(total)
    periods = found.periods
    needed = storeys.modes_for_mass_share(ratios)
    values: dict[str, Value] = {
        "period": quantity("Fundamental period", "time", periods[0], meaning=Meaning("fundamental period", BUILDING)),
        "periods": quantity("Periods", "time", periods),
        "frequencies": quantity("Frequencies", "frequency", found.omega / (2 * np.pi)),
        "mode_shapes": quantity("Mode shapes (roof = 1)", "number", found.shapes),
        "participation": quantity("Participation", "number", found.participation),
        "effective_mass_ratio": quantity("Effective mass", "ratio", ratios),
        "cumulative_mass_ratio": quantity("Cumulative mass", "ratio", np.cumsum(ratios)),
        "total_mass": quantity("Total mass", "mass", total, meaning=Meaning("total mass", BUILDING)),
        "modes_for_90_percent": quantity("Modes for 90 % mass", "count", float(needed)),
    }
    flags = [Flag("warning", f"soft storey {storey}: stiffness {reason}")
             for storey, reason in storeys.soft_storeys(stiffnesses)]
    notes = (plausible.storey_period(float(periods[0]), len(masses)),
             plausible.storey_heights(list(inputs.array("heights"))) if inputs.has("heights") else None)
    flags.extend(note for note in notes if note)
    flags.append(Flag("info", f"{needed} of {len(masses)} modes reach 90 % of the mass"))
    flags.extend(Flag("info", f"mode {n + 1} has no roof motion: its shape is scaled to its largest value")
                 for n in np.nonzero(found.roof_free)[0])
    values.update(_rayleigh(inputs, found.omega, zeta, flags))
    references: tuple[Reference, ...] = REFERENCES
    if inputs.has("design_ground_acceleration"):
        heights = inputs.array("heights") if inputs.has("heights") else None
        values.update(modal_demand(inputs, found, masses, heights, zeta, flags))
        references += SEISMIC_REFERENCES
        if heights is not None:
            values.update(damage_limitation(inputs, np.asarray(values["drift_cqc"].magnitude), heights, flags))
            references += (DAMAGE_REFERENCE,)
        else:
            flags.append(Flag("info", "damage limitation (EN 1998-1 4.4.3.2) needs the storey heights: give them"))
    return inputs.result(values, series=_series(inputs, found), flags=tuple(flags), references=references)


def modal_demand(inputs: Inputs, found: Modes, masses: np.ndarray, heights: np.ndarray | None,
                 zeta: float, flags: list[Flag]) -> dict[str, Value]:
    """Spectral accelerations per mode and the combined floor displacements, drifts and storey shears."""
    from fieldmode.calc.physics import storeys

    accelerations, described, q = spectral_accelerations(inputs, found.periods, zeta)
    peaks = storeys.modal_peaks(found, masses, accelerations)
    rho = storeys.correlation_cqc(found.omega, zeta)
    values: dict[str, Value] = {
        "spectrum_used": word("Spectrum", described),
        "spectral_acceleration": quantity("Sa per mode", "acceleration", accelerations),
    }
    for name, label, kind, modal, scale in (
            ("displacement", "displacement", "length", peaks.displacement, q),
            ("drift", "drift", "length", peaks.drift, q),
            ("shear", "storey shear", "force", peaks.shear, 1.0)):
        for method, combined in (("srss", storeys.combine_srss(modal)), ("cqc", storeys.combine_cqc(modal, rho))):
            values[f"{name}_{method}"] = quantity(f"{method.upper()} {label}", kind, scale * combined)
    values["base_shear_srss"] = quantity("SRSS base shear", "force", values["shear_srss"].si()[0])
    values["base_shear_cqc"] = quantity("CQC base shear", "force", values["shear_cqc"].si()[0])
    if heights is not None:
        values["drift_ratio_cqc"] = quantity("CQC drift ratio", "ratio", np.array(values["drift_cqc"].si()) / heights)
    flags.extend(_close_modes(found.periods))
    if q != 1.0:
        flags.append(Flag("info", f"displacements and drifts are q = {q:g} times the design-spectrum values"))
    return values


def damage_limitation(inputs: Inputs, drifts: np.ndarray, heights: np.ndarray,
                      flags: list[Flag]) -> dict[str, Value]:
    """EN 1998-1 4.4.3.2: d_r nu / h per storey against alpha, with d_r the design drifts (m) and h (m)."""
    non_structural = inputs.text("non_structural") if inputs.has("non_structural") else DEFAULT_NON_STRUCTURAL
    alpha = DRIFT_LIMITS[non_structural]
    nu, nu_source = _reduction_factor(inputs)
    ratios = drifts * nu / heights
    largest = int(np.argmax(ratios))
    over = [n for n in range(len(ratios)) if ratios[n] > alpha]
    if over:
        named = ", ".join(f"storey {n + 1} ({100 * ratios[n]:.3g} %)" for n in over)
        flags.append(Flag("warning", f"damage limitation exceeded: d_r nu / h above alpha = {100 * alpha:.3g} % "
                                     f"({non_structural} non-structural elements) in {named} (EN 1998-1 4.4.3.2)"))
    else:
        flags.append(Flag("info", f"damage limitation met: largest d_r nu / h {100 * ratios[largest]:.3g} % "
                                  f"(storey {largest + 1}) <= alpha = {100 * alpha:.3g} % ({non_structural} "
                                  "non-structural elements, EN 1998-1 4.4.3.2)"))
    flags.append(Flag("info", f"nu = {nu:g}: {nu_source}"))
    return {
        "damage_drift_ratio": quantity("Damage drift d_r nu/h", "ratio", ratios),
        "damage_largest_ratio": quantity("Largest d_r nu / h", "ratio", float(ratios[largest])),
        "damage_limit": quantity(f"Limit alpha ({non_structural})", "ratio", alpha),
        "reduction_factor": quantity("Reduction factor nu", "number", nu),
    }


def _reduction_factor(inputs: Inputs) -> tuple[float, str]:
    """nu of damage limitation and where it comes from: typed, or recommended for the importance class."""
    if inputs.has("reduction_factor"):
        return inputs.value("reduction_factor", positive=True, maximum=1.0), "typed (National Annex value)"
    importance = inputs.text("importance_class") if inputs.has("importance_class") else DEFAULT_IMPORTANCE_CLASS
    return REDUCTION_FACTORS[importance], (f"recommended for importance class {importance}, EN 1998-1 "
                                           "4.4.3.2(2) (from memory)")


def spectral_accelerations(inputs: Inputs, periods: np.ndarray, zeta: float) -> tuple[np.ndarray, str, float]:
    """Spectral acceleration (m/s^2) at each period, a description of the spectrum, and the
    factor q applied to displacements (1 for the elastic spectrum)."""
    from fieldmode.calc.physics import design_spectrum

    if not inputs.has("ground_type"):
        raise inputs.error("ground_type", "give the ground type for the spectrum")
    shape, spectrum_type, note = read_shape(inputs)
    ag, _ = design_ground_acceleration(inputs)
    corners = f"S {shape.soil_factor:g}, TB {shape.tb:g} s, TC {shape.tc:g} s, TD {shape.td:g} s ({note})"
    if inputs.has("behaviour_factor"):
        q = inputs.value("behaviour_factor", minimum=1.0, maximum=10.0)
        return design_spectrum.design_spectrum(periods, ag, shape, q), f"design Sd, q = {q:g}; {corners}", q
    eta = design_spectrum.damping_correction(zeta)
    return design_spectrum.elastic_spectrum(periods, ag, shape, eta), f"elastic Se, eta = {eta:.3g}; {corners}", 1.0


def _close_modes(periods: np.ndarray) -> list[Flag]:
    """A caution for neighbouring modes too close in period for SRSS."""
    close = [n for n in range(1, len(periods)) if periods[n] > CLOSE_PERIODS * periods[n - 1]]
    return [Flag("caution", f"modes {n} and {n + 1} are within 10 % in period: SRSS is unsafe, use CQC "
                            "(EN 1998-1:2004 4.3.3.3.2)") for n in close]


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
    from fieldmode.calc.physics import storeys

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
    series = {"storey": np.arange(count + 1, dtype=float)}
    if inputs.has("heights"):
        series["height"] = np.concatenate([[0.0], np.cumsum(inputs.array("heights"))])
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
    series=(
        Series("storey", "Floor (0 = base)", "number"),
        Series("height", "Height above the base", "length", "storey"),
        *(Series(f"mode_{n}", f"Mode {n} shape (roof = 1)", "number", "storey") for n in range(1, CHART_MODES + 1)),
    ),
)
