"""Seismic part of the `storeys` check: EN 1998-1 spectrum per mode, modal peaks, SRSS and CQC.

The spectrum comes from :mod:`calc.seismic` (EN 1998-1 3.2.2.2 elastic and 3.2.2.5 design spectra), with
the ground fields, National Annex overrides and their reading shared with the `design-spectrum` check.
"""

from __future__ import annotations

from typing import TYPE_CHECKING

import numpy as np

from calc.checks import design_spectrum as code_spectrum
from calc.result import Flag, Reference, Value
from calc.spec import Field, Inputs, quantity, word

if TYPE_CHECKING:
    from calc.storeys import Modes

CLOSE_PERIODS = 0.9
"""Modes whose periods are within 10 % of each other are not independent (SRSS unsafe)."""

FIELDS = (
    *(Field(f.name, f.label, f.kind, f.default, f.unit, required=False, choices=f.choices, shared=True,
            help=f.help + ("; leave empty for modes only" if f.name == "design_ground_acceleration" else ""))
      for f in code_spectrum.GROUND_FIELDS),
    Field("behaviour_factor", "Behaviour factor q", "number", "", "", required=False,
          help="gives the design spectrum (EN 1998-1 3.2.2.5); displacements are multiplied by q (4.3.4)"),
    *code_spectrum.SHAPE_FIELDS,
)

REFERENCES = (
    Reference("Spectral acceleration per mode, recommended values of Table 3.2 / 3.3",
              "EN 1998-1:2004 3.2.2.2 (elastic, eta = sqrt(10/(5+xi)) >= 0.55) and 3.2.2.5 (design, beta = 0.2)"),
    Reference("Modal peaks u = Gamma phi Sa / omega^2 combined by SRSS and by CQC",
              "Der Kiureghian (1981) correlation coefficients; Chopra, Dynamics of Structures, ch. 13; "
              "EN 1998-1:2004 4.3.3.3.2"),
    Reference("Design displacements d_s = q d_e", "EN 1998-1:2004 4.3.4(1)"),
)


def modal_demand(inputs: Inputs, found: Modes, masses: np.ndarray, heights: np.ndarray | None,
                 zeta: float, flags: list[Flag]) -> dict[str, Value]:
    """Spectral accelerations per mode and the combined floor displacements, drifts and storey shears."""
    from calc import storeys

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


def spectral_accelerations(inputs: Inputs, periods: np.ndarray, zeta: float) -> tuple[np.ndarray, str, float]:
    """Spectral acceleration (m/s^2) at each period, a description of the spectrum, and the
    factor q applied to displacements (1 for the elastic spectrum)."""
    from calc import seismic

    if not inputs.has("ground_type"):
        raise inputs.error("ground_type", "give the ground type for the spectrum")
    shape, kind, note = code_spectrum.read_shape(inputs)
    ag, _ = code_spectrum.design_ground_acceleration(inputs)
    corners = f"S {shape.soil_factor:g}, TB {shape.tb:g} s, TC {shape.tc:g} s, TD {shape.td:g} s ({note})"
    if inputs.has("behaviour_factor"):
        q = inputs.value("behaviour_factor", minimum=1.0, maximum=10.0)
        return seismic.design_spectrum(periods, ag, shape, q), f"design Sd, q = {q:g}; {corners}", q
    eta = seismic.damping_correction(zeta)
    return seismic.elastic_spectrum(periods, ag, shape, eta), f"elastic Se, eta = {eta:.3g}; {corners}", 1.0


def _close_modes(periods: np.ndarray) -> list[Flag]:
    """A caution for neighbouring modes too close in period for SRSS."""
    close = [n for n in range(1, len(periods)) if periods[n] > CLOSE_PERIODS * periods[n - 1]]
    return [Flag("caution", f"modes {n} and {n + 1} are within 10 % in period: SRSS is unsafe, use CQC "
                            "(EN 1998-1:2004 4.3.3.3.2)") for n in close]
