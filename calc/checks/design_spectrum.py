"""Check `design-spectrum`: EN 1998-1 horizontal elastic (and design) spectrum at a period."""

from __future__ import annotations

from typing import TYPE_CHECKING

import numpy as np

from fieldmode.calc.framework.guard import overflow_guard
from fieldmode.calc.framework.meaning import BUILDING, SEISMIC_ACTION, Meaning
from fieldmode.calc.framework.result import SEISMIC_CAUTION, Flag, Reference, Result, Value, quantity, word
from fieldmode.calc.framework.spec import CheckSpec, Field, Series
from fieldmode.calc.physics import design_spectrum
from fieldmode.calc.physics.constants import STANDARD_GRAVITY

if TYPE_CHECKING:
    from fieldmode.calc.framework.reading import Inputs

MAX_PERIOD = 10.0
"""Longest period accepted (s)."""

GROUND_FIELDS = (
    Field("ground_type", "Ground type", "choice", "C", choices=design_spectrum.GROUND_TYPES, shared=True,
          help="EN 1998-1 Table 3.1", meaning=Meaning("ground type", SEISMIC_ACTION)),
    Field("spectrum_type", "Spectrum type", "choice", "1", choices=design_spectrum.SPECTRUM_TYPES,
          required=False, shared=True, help="1 for larger earthquakes (Ms > 5.5), 2 for smaller; default 1",
    meaning=Meaning("spectrum type", SEISMIC_ACTION)),
    Field("design_ground_acceleration", "Ground acceleration agR", "acceleration", "0.16 g", "g",
          shared=True, help="design ground acceleration on type A ground; ag = importance x agR",
    meaning=Meaning("reference ground acceleration agR", SEISMIC_ACTION)),
    Field("importance", "Importance factor", "number", "1.0", "", required=False, shared=True,
          help="gamma_I (EN 1998-1 4.2.5); default 1.0", meaning=Meaning("importance factor", BUILDING)),
)
SHAPE_FIELDS = (
    Field("soil_factor", "Soil factor S", "number", "", "", required=False,
          help="National Annex value; default from Table 3.2 / 3.3", meaning=Meaning("soil factor S", SEISMIC_ACTION)),
    Field("corner_period_tb", "Corner period TB", "time", "", "s", required=False,
          help="start of the constant-acceleration plateau", meaning=Meaning("corner period TB", SEISMIC_ACTION)),
    Field("corner_period_tc", "Corner period TC", "time", "", "s", required=False,
          help="end of the constant-acceleration plateau", meaning=Meaning("corner period TC", SEISMIC_ACTION)),
    Field("corner_period_td", "Corner period TD", "time", "", "s", required=False,
          help="start of the constant-displacement range", meaning=Meaning("corner period TD", SEISMIC_ACTION)),
)
FIELDS = (
    *GROUND_FIELDS,
    Field("damping", "Damping ratio", "ratio", "5 %", "", required=False, help="default 5 %",
          meaning=Meaning("damping ratio", BUILDING)),
    Field("period", "Period", "time", "0.53 s", "s", shared=True, meaning=Meaning("fundamental period", BUILDING)),
    Field("behaviour_factor", "Behaviour factor q", "number", "4", "", required=False,
          help="gives the design spectrum of EN 1998-1 3.2.2.5", meaning=Meaning("behaviour factor q", BUILDING)),
    Field("mass", "Mass (base shear)", "mass", "850 t", "t", required=False,
          help="total mass above the base; a weight is read as W/g0", meaning=Meaning("total mass", BUILDING)),
    *SHAPE_FIELDS,
)

REFERENCES = (
    Reference("Horizontal elastic response spectrum", "EN 1998-1:2004 3.2.2.2, eq. 3.2-3.6, Tables 3.2 and 3.3"),
    Reference("Elastic displacement spectrum SDe = Se (T/2pi)^2", "EN 1998-1:2004 3.2.2.4, eq. 3.7"),
)
DESIGN_REFERENCE = Reference("Design spectrum for elastic analysis, lower bound beta = 0.2",
                             "EN 1998-1:2004 3.2.2.5, eq. 3.13-3.16")


def read_shape(inputs: Inputs) -> tuple[design_spectrum.SpectrumShape, str, str]:
    """Spectrum shape from ground and spectrum type with any overrides; also the type and the set used
    ('Table 3.2', 'Table 3.3' or 'user S, TC', ...)."""
    ground = inputs.text("ground_type")
    spectrum_type = inputs.text("spectrum_type") if inputs.has("spectrum_type") else "1"
    base = design_spectrum.recommended_shape(spectrum_type, ground)
    given = {name: inputs.value(name, positive=True, maximum=20.0) for name in
             ("soil_factor", "corner_period_tb", "corner_period_tc", "corner_period_td")
             if inputs.has(name)}
    shape = design_spectrum.SpectrumShape(given.get("soil_factor", base.soil_factor),
                                  given.get("corner_period_tb", base.tb),
                                  given.get("corner_period_tc", base.tc),
                                  given.get("corner_period_td", base.td))
    if not shape.tb < shape.tc < shape.td:
        last = next((n for n in ("corner_period_td", "corner_period_tc", "corner_period_tb") if n in given),
                    "corner_period_tb")
        raise inputs.error(last, f"corner periods must rise: TB {shape.tb:g} s < TC {shape.tc:g} s < "
                                 f"TD {shape.td:g} s")
    table = "Table 3.2" if spectrum_type == "1" else "Table 3.3"
    note = table
    if given:
        names = {"soil_factor": "S", "corner_period_tb": "TB", "corner_period_tc": "TC", "corner_period_td": "TD"}
        note = f"user {', '.join(names[n] for n in given)}"
    return shape, spectrum_type, note


def shape_flag(inputs: Inputs, shape: design_spectrum.SpectrumShape, spectrum_type: str) -> Flag:
    """Say which S, TB, TC, TD are used and where they come from."""
    table = "Table 3.2 (Type 1)" if spectrum_type == "1" else "Table 3.3 (Type 2)"
    values = f"S {shape.soil_factor:g}, TB {shape.tb:g} s, TC {shape.tc:g} s, TD {shape.td:g} s"
    given = any(inputs.has(n) for n in ("soil_factor", "corner_period_tb", "corner_period_tc", "corner_period_td"))
    source = "user values where given, else EN 1998-1 " if given else "EN 1998-1 "
    return Flag("info", f"{values}: {source}{table} recommended, ground {inputs.text('ground_type')}")


def design_ground_acceleration(inputs: Inputs) -> tuple[float, float]:
    """Design ground acceleration ag = gamma_I agR (m/s^2) and gamma_I."""
    agr = inputs.value("design_ground_acceleration", positive=True, maximum=3.0 * STANDARD_GRAVITY)
    importance = inputs.optional("importance", 1.0, positive=True, maximum=3.0) or 1.0
    return importance * agr, importance


@overflow_guard("design_ground_acceleration")
def compute(inputs: Inputs) -> Result:
    shape, spectrum_type, note = read_shape(inputs)
    ag, importance = design_ground_acceleration(inputs)
    zeta = inputs.optional("damping", 0.05, minimum=0.0, maximum=1.0)
    assert zeta is not None
    period = inputs.value("period", minimum=0.0, maximum=MAX_PERIOD)
    eta = design_spectrum.damping_correction(zeta)
    se = float(design_spectrum.elastic_spectrum(period, ag, shape, eta))
    values: dict[str, Value] = {
        "spectral_acceleration": quantity("Se(T), elastic", "acceleration", se),
        "spectral_displacement": quantity("SDe(T), elastic", "length",
                                          float(design_spectrum.spectral_displacement(se, period))),
        "branch": word("Branch", design_spectrum.branch(period, shape)),
        "design_ground_acceleration": quantity("ag = gamma_I agR", "acceleration", ag),
        "eta": quantity("Damping correction eta", "number", eta),
        "soil_factor": quantity("S", "number", shape.soil_factor),
        "corner_period_tb": quantity("TB", "time", shape.tb),
        "corner_period_tc": quantity("TC", "time", shape.tc),
        "corner_period_td": quantity("TD", "time", shape.td),
        "parameter_set": word("S, TB, TC, TD from", note),
    }
    flags = [shape_flag(inputs, shape, spectrum_type)] + _flags(inputs, period, zeta, eta, importance, shape)
    references: tuple[Reference, ...] = REFERENCES
    end = max(design_spectrum.SPECTRUM_END, 1.25 * period)
    grid = np.unique(np.concatenate([np.linspace(0.0, end, 241), [shape.tb, shape.tc, shape.td, period]]))
    series = {"period": grid, "spectral_acceleration": design_spectrum.elastic_spectrum(grid, ag, shape, eta)}
    sd = None
    if inputs.has("behaviour_factor"):
        q = inputs.value("behaviour_factor", minimum=1.0, maximum=10.0)
        sd = float(design_spectrum.design_spectrum(period, ag, shape, q))
        values["design_spectral_acceleration"] = quantity("Sd(T), design (q)", "acceleration", sd)
        series["design_spectral_acceleration"] = design_spectrum.design_spectrum(grid, ag, shape, q)
        references += (DESIGN_REFERENCE,)
        if zeta != 0.05:
            flags.append(Flag("info", "Sd(T) has no damping correction: q allows for it (3.2.2.5(3))"))
    if inputs.has("mass"):
        mass = inputs.value("mass", positive=True)
        values["base_shear"] = quantity("Elastic shear m Se(T)", "force", mass * se)
        if sd is not None:
            values["design_base_shear"] = quantity("Design shear m Sd(T)", "force", mass * sd)
    return inputs.result(values, series=series, flags=tuple(flags), references=references)


def _flags(inputs: Inputs, period: float, zeta: float, eta: float, importance: float,
           shape: design_spectrum.SpectrumShape) -> list[Flag]:
    flags = []
    if not inputs.has("spectrum_type"):
        flags.append(Flag("info", "spectrum type not given: Type 1"))
    if not inputs.has("importance"):
        flags.append(Flag("info", "importance factor not given: 1.0 (ordinary buildings)"))
    if period > design_spectrum.SPECTRUM_END:
        flags.append(Flag("caution", "period beyond 4 s: 3.2.2.2 ends at 4 s (Annex A gives the displacement "
                                     "spectrum); the last branch is extended"))
    if eta == design_spectrum.ETA_FLOOR and zeta > 0:
        flags.append(Flag("info", f"eta held at its lower limit {design_spectrum.ETA_FLOOR} (3.2.2.2(3))"))
    if importance > 1.4:
        flags.append(Flag("caution", "importance factor above 1.4: unusual (EN 1998-1 4.2.5 recommends 0.8-1.4)"))
    if inputs.has("mass") and inputs.has("behaviour_factor") and period <= 2.0 * shape.tc:
        flags.append(Flag("info", "T <= 2 TC: with more than two storeys lambda = 0.85 applies to the design "
                                  "base shear (4.3.3.2.2(1)); not applied here"))
    return flags


SPEC = CheckSpec(
    id="design-spectrum",
    title="Design spectrum",
    summary="EN 1998-1 elastic and design spectral acceleration at a period, with base shear",
    fields=FIELDS,
    compute=compute,
    caution=SEISMIC_CAUTION,
    series=(
        Series("period", "Period", "time"),
        Series("spectral_acceleration", "Se(T), elastic", "acceleration", "period"),
        Series("design_spectral_acceleration", "Sd(T), design", "acceleration", "period"),
    ),
)
