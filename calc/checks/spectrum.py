"""Check `spectrum`: response spectrum of an accelerogram, with the EN 1998-1 spectrum overlaid."""

from __future__ import annotations

from typing import TYPE_CHECKING

import numpy as np

from fieldmode.calc.checks.design_spectrum import GROUND_FIELDS, design_ground_acceleration, read_shape, shape_flag
from fieldmode.calc.demo import GROUND_MOTION, demo_name
from fieldmode.calc.framework.guard import overflow_guard
from fieldmode.calc.framework.meaning import BUILDING, Meaning
from fieldmode.calc.framework.result import SEISMIC_CAUTION, Flag, InputFile, Reference, Result, Value, quantity
from fieldmode.calc.framework.spec import CheckSpec, Field, Series
from fieldmode.calc.physics import design_spectrum
from fieldmode.calc.physics.spectrum import DEFAULT_GRID, period_grid
from fieldmode.calc.records import accelerogram
from fieldmode.calc.records.columns import RECORD_COLUMN_FIELDS, record_from_fields

MAX_PERIOD = 20.0
"""Longest period accepted (s)."""
MIN_STEP, MAX_STEP = 1e-5, 1.0
"""Time steps accepted for an accelerogram (s)."""
MAX_ACCELERATION = 1e4
"""Largest ground acceleration accepted (m/s^2); more means a wrong unit."""
NO_MOTION = 1e-9
"""A record whose baseline-corrected peak is below this fraction of its raw peak holds no ground motion."""
if TYPE_CHECKING:
    from fieldmode.calc.framework.reading import Inputs
    from fieldmode.calc.physics.spectrum import Spectrum

MIN_PERIOD = 0.001
"""Shortest period accepted (s)."""
MAX_COUNT = 500
"""Most periods in a grid."""
SIGNAL_UNITS = ("g", "m/s^2", "cm/s^2")
TABLE = ("period", "sd", "sv", "psv", "psa", "total_acceleration", "design_psa")
"""Curves shown as a table when the periods are typed as a list (the overlay when it is given)."""

FIELDS = (
    Field("file", "Accelerogram file", "path", demo_name(GROUND_MOTION), positional=True,
          help="CSV or text: a time column and a ground acceleration column, or the signal and --sample-rate"),
    Field("signal_unit", "Signal unit", "choice", "g", choices=SIGNAL_UNITS, required=False,
          help="unit of the acceleration column; default from its header"),
    *RECORD_COLUMN_FIELDS,
    Field("damping", "Damping ratio", "ratio", "5 %", "", required=False, help="default 5 %",
          meaning=Meaning("damping ratio", BUILDING)),
    Field("period", "Period to mark", "time", "0.53 s", "s", required=False, shared=True,
          help="results and time history at this period", meaning=Meaning("fundamental period", BUILDING)),
    Field("periods", "Periods", "time", "", "s", many=True, required=False,
          help="a list instead of the log-spaced grid"),
    Field("shortest_period", "Shortest period", "time", "0.02 s", "s", required=False),
    Field("longest_period", "Longest period", "time", "10 s", "s", required=False),
    Field("period_count", "Number of periods", "count", "200", required=False),
    *(Field(f.name, f.label, f.kind, f.default, f.unit, required=False, choices=f.choices, shared=True,
            help="EN 1998-1 elastic spectrum overlaid when the ground acceleration is given", meaning=f.meaning)
      for f in GROUND_FIELDS),
)

REFERENCES = (
    Reference("Exact recurrence for ground acceleration linear between samples (Nigam-Jennings), "
              "steps <= T/20 by linear resampling, peaks refined by cubic Hermite interpolation",
              "Nigam & Jennings (1969); Chopra, Dynamics of Structures, sec. 5.2, Table 5.2.1"),
    Reference("Baseline: least-squares c1 t + c2 t^2 fitted to the velocity, its derivative removed from the "
              "acceleration; all values from the corrected record, ground at rest after the last sample",
              "Common practice (no source)"),
)


@overflow_guard("file")
def compute(inputs: Inputs) -> Result:
    from fieldmode.calc.physics import spectrum as core  # imported here: every other command starts faster

    time, acc, dt, notes, file = _record(inputs)
    zeta = inputs.optional("damping", 0.05, minimum=0.0, maximum=0.9)
    assert zeta is not None
    periods = _periods(inputs)
    marked = inputs.optional("period", None, minimum=MIN_PERIOD, maximum=MAX_PERIOD)
    corrected = accelerogram.baseline_corrected(acc, dt)
    if np.max(np.abs(corrected)) <= NO_MOTION * np.max(np.abs(acc), initial=0.0) or not np.any(corrected):
        raise inputs.error("file", "no ground motion: the record is constant (or zero) once its baseline is "
                                   "removed; check the signal column")
    try:
        spectrum = core.response_spectrum(corrected, dt, periods, zeta)
        single = core.response_spectrum(corrected, dt, np.array([marked]), zeta) if marked else None
    except core.WorkLimitError as error:
        name = "periods" if inputs.has("periods") else "shortest_period"
        raise inputs.error(name, f"too fine for this record ({error}): use longer periods or fewer") from error
    pga, pgv, pgd = accelerogram.ground_peaks(corrected, dt)
    peak = int(np.argmax(spectrum.psa))
    values: dict[str, Value] = {
        "pga": quantity("Peak ground acceleration", "acceleration", pga),
        "pgv": quantity("Peak ground velocity", "velocity", pgv),
        "pgd": quantity("Peak ground displacement", "length", pgd),
        "peak_psa": quantity("Largest psa on the grid", "acceleration", float(spectrum.psa[peak])),
        "peak_psa_period": quantity("at period", "time", float(periods[peak])),
        "duration": quantity("Record duration", "time", float(time[-1] - time[0])),
        "time_step": quantity("Time step", "time", dt),
    }
    series = {"period": periods, "sd": spectrum.sd, "sv": spectrum.sv, "psv": spectrum.psv,
              "psa": spectrum.psa, "total_acceleration": spectrum.total_acceleration,
              "time": time, "ground_acceleration": corrected}
    references: tuple[Reference, ...] = REFERENCES
    if single is not None and marked is not None:
        values.update(_marked(single))
        history = core.response_history(corrected, dt, marked, zeta)
        series.update({"response_displacement": history.displacement, "response_velocity": history.velocity,
                       "response_total_acceleration": history.total_acceleration})
    if inputs.has("design_ground_acceleration"):
        if not inputs.has("ground_type"):
            raise inputs.error("ground_type", "give the ground type for the EN 1998-1 overlay")
        shape, spectrum_type, _ = read_shape(inputs)
        ag, _ = design_ground_acceleration(inputs)
        eta = design_spectrum.damping_correction(zeta)
        series["design_psa"] = design_spectrum.elastic_spectrum(periods, ag, shape, eta)
        if marked is not None:
            design = float(design_spectrum.elastic_spectrum(marked, ag, shape, eta))
            values["design_spectral_acceleration"] = quantity("EN 1998-1 Se(T)", "acceleration", design)
        overlay = shape_flag(inputs, shape, spectrum_type)
        notes.append(Flag("info", f"overlay {overlay.text}"))
        references += (Reference("Horizontal elastic response spectrum", "EN 1998-1:2004 3.2.2.2, eq. 3.2-3.6"),)
    flags = notes + _flags(spectrum, dt, time[-1] - time[0], acc, corrected, pga)
    table = tuple(name for name in TABLE if name in series) if inputs.has("periods") else ()
    return inputs.result(values, series=series, flags=tuple(flags), references=references, files=(file,),
                         table=table)


def _marked(single: Spectrum) -> dict[str, Value]:
    return {
        "sd": quantity("sd (relative displ.)", "length", float(single.sd[0])),
        "sv": quantity("sv (relative velocity)", "velocity", float(single.sv[0])),
        "psv": quantity("psv (omega sd)", "velocity", float(single.psv[0])),
        "psa": quantity("psa (omega^2 sd)", "acceleration", float(single.psa[0])),
        "total_acceleration": quantity("Total acceleration", "acceleration",
                                       float(single.total_acceleration[0])),
    }


def _periods(inputs: Inputs) -> np.ndarray:
    """The period grid (s): a typed list, or log-spaced from the grid fields (defaults 0.02-10 s, 200)."""
    grid_fields = ("shortest_period", "longest_period", "period_count")
    if inputs.has("periods"):
        given = next((name for name in grid_fields if inputs.has(name)), None)
        if given:
            raise inputs.error(given, "give either a list of periods or the grid, not both")
        values = inputs.array("periods", positive=True)
        if values.max() > MAX_PERIOD or values.min() < MIN_PERIOD:
            raise inputs.error("periods", f"periods from {MIN_PERIOD:g} s to {MAX_PERIOD:g} s")
        return np.unique(values)
    shortest = inputs.optional("shortest_period", DEFAULT_GRID[0], minimum=MIN_PERIOD, maximum=MAX_PERIOD)
    longest = inputs.optional("longest_period", DEFAULT_GRID[1], positive=True, maximum=MAX_PERIOD)
    count = inputs.optional("period_count", DEFAULT_GRID[2], minimum=2, maximum=MAX_COUNT)
    assert shortest is not None and longest is not None and count is not None
    if longest <= shortest:
        raise inputs.error("longest_period" if inputs.has("longest_period") else "shortest_period",
                           "the longest period must exceed the shortest")
    return period_grid(shortest, longest, int(count))


def _record(inputs: Inputs) -> tuple[np.ndarray, np.ndarray, float, list[Flag], InputFile]:
    """Time (s), ground acceleration (m/s^2), time step (s), reading notes, and the file read."""
    record = record_from_fields(inputs)
    path = inputs.text("file")
    if record.kind != "acceleration":
        found = f"is a {record.kind}" if record.kind else "has no unit in its header"
        raise inputs.error("signal_unit", f"signal column {record.channel_name!r} {found}: give the "
                                          "acceleration unit")
    dt = 1.0 / record.sample_rate
    if not MIN_STEP <= dt <= MAX_STEP:
        raise inputs.error("file", f"time step {dt:.3g} s: an accelerogram needs {MIN_STEP:g} s to {MAX_STEP:g} s")
    if np.max(np.abs(record.signal)) > MAX_ACCELERATION:
        raise inputs.error("file", f"accelerations above {MAX_ACCELERATION:g} m/s^2: check the signal unit")
    notes = [Flag("info", note) for note in record.notes]
    return record.time, record.signal, dt, notes, InputFile(path, record.source.size, record.source.sha256)


def _flags(spectrum: Spectrum, dt: float, duration: float, acc: np.ndarray, corrected: np.ndarray,
           pga: float) -> list[Flag]:
    flags = []
    fine = spectrum.substeps > 1
    if np.any(fine):
        flags.append(Flag("info", f"periods up to {spectrum.period[fine].max():.3g} s analysed with up to "
                                  f"{spectrum.substeps.max()} sub-steps per record step (step <= T/20)"))
    if spectrum.period.max() > duration / 2.0:
        flags.append(Flag("caution", f"periods above {duration / 2:.3g} s exceed half the record length: "
                                     "few cycles behind those values"))
    if spectrum.period.min() < 2.0 * dt:
        flags.append(Flag("info", f"periods below 2 dt = {2 * dt:.3g} s respond to the record as sampled "
                                  "(linear between samples)"))
    drift = float(np.max(np.abs(acc - corrected)))
    if drift > 0.01 * pga:
        flags.append(Flag("caution", f"baseline removed: up to {drift / pga:.1%} of the peak acceleration"))
    return flags


SPEC = CheckSpec(
    id="spectrum",
    title="Response spectrum",
    summary="response spectrum of an accelerogram (sd, sv, psv, psa, total acceleration) with pga, pgv, pgd",
    fields=FIELDS,
    compute=compute,
    key_results=("pga", "pgv", "pgd", "peak_psa", "peak_psa_period"),
    caution=SEISMIC_CAUTION,
    series=(
        Series("period", "Period", "time"),
        Series("sd", "sd, peak relative displacement", "length", "period"),
        Series("sv", "sv, peak relative velocity", "velocity", "period"),
        Series("psv", "psv, pseudo-velocity", "velocity", "period"),
        Series("psa", "psa, pseudo-acceleration", "acceleration", "period"),
        Series("total_acceleration", "Peak total acceleration", "acceleration", "period"),
        Series("design_psa", "EN 1998-1 Se(T)", "acceleration", "period"),
        Series("time", "Time", "time"),
        Series("ground_acceleration", "Ground acceleration (baseline-corrected)", "acceleration", "time"),
        Series("response_displacement", "Relative displacement at the marked period", "length", "time"),
        Series("response_velocity", "Relative velocity at the marked period", "velocity", "time"),
        Series("response_total_acceleration", "Total acceleration at the marked period", "acceleration", "time"),
    ),
)
