"""Check `ppv-distance`: ground vibration predicted at a distance from piling or vibratory compaction
(BS 5228-2 Annex E), and the distance beyond which a chosen limit PPV is met."""

from __future__ import annotations

from collections.abc import Callable
from typing import TYPE_CHECKING

import numpy as np

from fieldmode.calc.framework.guard import overflow_guard
from fieldmode.calc.framework.result import Flag, Reference, Result, Value, quantity, word
from fieldmode.calc.framework.spec import CheckSpec, Field, Series
from fieldmode.calc.physics import ppv_predict
from fieldmode.calc.physics.ppv_predict import Range

if TYPE_CHECKING:
    from fieldmode.calc.framework.reading import Inputs

PERCUSSIVE = "percussive piling"
VIBRATORY = "vibratory piling"
COMPACTION = "vibratory compaction"
METHODS = (VIBRATORY, PERCUSSIVE, COMPACTION)
PHASES = {"steady running": "steady", "start-up and run-down": "transient"}
"""Roller phase as shown -> the phase of :mod:`ppv_predict`."""

VIBRATORY_METHODS = {"method": (VIBRATORY, COMPACTION)}
PERCUSSIVE_ONLY = {"method": (PERCUSSIVE,)}
COMPACTION_ONLY = {"method": (COMPACTION,)}
"""Which methods use a field (the app shows it only for them; the command line notes it as ignored)."""

PPV_CAUTION = ("Screening prediction, not a design: guideline values are screening references; building "
               "condition, local rules and a licensed engineer govern.")

FIELDS = (
    Field("method", "Method", "choice", VIBRATORY, choices=METHODS,
          help="the formula of BS 5228-2 Annex E; fields a method does not use are ignored"),
    Field("distance", "Distance from the source", "length", "12 m", "m", required=False,
          help="horizontal distance; for percussive piling the slope distance from the pile toe"),
    Field("limit", "Limit PPV", "velocity", "5 mm/s", "mm/s", required=False,
          help="gives the distance beyond which the predicted PPV is below it"),
    Field("probability", "Chance of exceedance", "ratio", "5 %", "", required=False, used_when=VIBRATORY_METHODS,
          help="50 %, 33.3 % or 5 %: the chance the predicted value is exceeded (vibratory methods)"),
    Field("energy", "Hammer energy per blow", "energy", "", "kJ", required=False, used_when=PERCUSSIVE_ONLY,
          help="percussive piling: rated energy of one blow"),
    Field("ground", "Ground at the pile toe", "choice", "", choices=tuple(ppv_predict.PERCUSSIVE_K),
          required=False, used_when=PERCUSSIVE_ONLY, help="percussive piling: sets the factor k_p"),
    Field("amplitude", "Drum amplitude, nominal", "length", "", "mm", required=False, used_when=COMPACTION_ONLY,
          help="vibratory compaction: the roller's nominal amplitude"),
    Field("drum_width", "Drum width", "length", "", "m", required=False, used_when=COMPACTION_ONLY,
          help="vibratory compaction"),
    Field("drums", "Vibrating drums", "count", "", "", required=False, used_when=COMPACTION_ONLY,
          help="vibratory compaction: 1 or 2 (default 1)"),
    Field("phase", "Roller phase", "choice", "", choices=tuple(PHASES), required=False, used_when=COMPACTION_ONLY,
          help="vibratory compaction: steady running (default) or start-up and run-down"),
)

FORMULAS = {
    VIBRATORY: "v = k_v / x^1.3 (mm/s, x in m)",
    PERCUSSIVE: "v = k_p sqrt(W) / r^1.3 (mm/s, W in J, r slope distance in m)",
    "steady": "v = k_s sqrt(n_d) (A / (x + L_d))^1.5 (mm/s, A in mm, x and L_d in m)",
    "transient": "v = k_t sqrt(n_d) A^1.5 / (x + L_d)^1.3 (mm/s, A in mm, x and L_d in m)",
}
GRID_POINTS = 121
"""Distances on the chart, evenly spaced on a log scale over the formula's range."""


@overflow_guard("distance")
def compute(inputs: Inputs) -> Result:
    method = inputs.text("method")
    if not inputs.has("distance") and not inputs.has("limit"):
        raise inputs.error("distance", "give a distance, a limit PPV, or both")
    predict, reach, valid, k, formula = _formula(inputs, method)
    values: dict[str, Value] = {}
    flags: list[Flag] = []
    ppv = None
    if inputs.has("distance"):
        distance = inputs.value("distance", positive=True)
        if valid.low <= distance <= valid.high:
            ppv = predict(distance)
            values["ppv"] = quantity("Predicted PPV", "velocity", ppv)
        else:
            values["ppv"] = word("Predicted PPV", "outside the range")
            flags.append(Flag("warning", f"no prediction at {distance:.4g} m: the formula was fitted from "
                                         f"{valid.low:g} to {valid.high:g} m ({valid.name}); it is not "
                                         "extrapolated"))
    limit = inputs.value("limit", positive=True) if inputs.has("limit") else None
    if limit is not None:
        try:
            values["limit_distance"] = quantity("Limit met beyond", "length", reach(limit))
        except ValueError as error:
            everywhere = predict(valid.low) <= limit
            values["limit_distance"] = word("Limit met beyond", "all of the range" if everywhere else "past the range")
            flags.append(Flag("info" if everywhere else "warning", f"limit PPV: {error}"))
        if ppv is not None:
            values["ratio"] = quantity("Predicted PPV / limit", "number", ppv / limit)
            if ppv > limit:
                flags.append(Flag("warning", f"the predicted PPV {ppv * 1e3:.3g} mm/s exceeds the limit "
                                             f"{limit * 1e3:.3g} mm/s at this distance"))
    values["factor"] = quantity("Scaling factor k", "number", k)
    values["range_low"] = quantity("Formula valid from", "length", valid.low)
    values["range_high"] = quantity("Formula valid to", "length", valid.high)
    flags += _notes(inputs, method)
    grid = np.geomspace(valid.low, valid.high, GRID_POINTS)
    series = {"distance": grid, "ppv": np.array([predict(x) for x in grid])}
    if limit is not None:
        series["limit"] = np.full(grid.shape, limit)
    references = (Reference(f"Empirical prediction of the resultant PPV, {method}: {formula}; k = {k:g}",
                            ppv_predict.SOURCE),)
    return inputs.result(values, series=series, flags=tuple(flags), references=references)


Predict = tuple[Callable[[float], float], Callable[[float], float], Range, float, str]


def _formula(inputs: Inputs, method: str) -> Predict:
    """The method's prediction and its inverse (SI), its distance range, factor k and formula text."""
    if method == PERCUSSIVE:
        energy = _checked(inputs, "energy", ppv_predict.PERCUSSIVE_ENERGY)
        ground = _needed_text(inputs, "ground")
        return (lambda x: ppv_predict.percussive_piling(energy, x, ground),
                lambda v: ppv_predict.percussive_piling_distance(v, energy, ground),
                ppv_predict.PERCUSSIVE_DISTANCE, ppv_predict.PERCUSSIVE_K[ground], FORMULAS[PERCUSSIVE])
    probability = _probability(inputs)
    if method == VIBRATORY:
        return (lambda x: ppv_predict.vibratory_piling(x, probability),
                lambda v: ppv_predict.vibratory_piling_distance(v, probability),
                ppv_predict.VIBRATORY_PILING_DISTANCE, ppv_predict.VIBRATORY_PILING_K[probability],
                FORMULAS[VIBRATORY])
    amplitude = _checked(inputs, "amplitude", ppv_predict.COMPACTION_AMPLITUDE)
    width = _checked(inputs, "drum_width", ppv_predict.COMPACTION_WIDTH)
    drums = int(inputs.value("drums", positive=True)) if inputs.has("drums") else 1
    if drums not in ppv_predict.COMPACTION_DRUMS:
        raise inputs.error("drums", "the formula covers rollers with 1 or 2 vibrating drums")
    phase = PHASES[inputs.text("phase")] if inputs.has("phase") else "steady"
    table = ppv_predict.COMPACTION_STEADY_K if phase == "steady" else ppv_predict.COMPACTION_TRANSIENT_K
    return (lambda x: ppv_predict.vibratory_compaction(x, amplitude, width, drums, probability, phase),
            lambda v: ppv_predict.vibratory_compaction_distance(v, amplitude, width, drums, probability, phase),
            ppv_predict.COMPACTION_DISTANCE, table[probability], FORMULAS[phase])


def _needed(inputs: Inputs, name: str) -> float:
    if not inputs.has(name):
        raise inputs.error(name, f"needed for {inputs.text('method')}")
    return inputs.value(name, positive=True)


def _needed_text(inputs: Inputs, name: str) -> str:
    if not inputs.has(name):
        raise inputs.error(name, f"needed for {inputs.text('method')}")
    return inputs.text(name)


def _checked(inputs: Inputs, name: str, valid: Range) -> float:
    """A field the formula takes, refused outside the range of the data behind it."""
    value = _needed(inputs, name)
    if not valid.low <= value <= valid.high:
        low, high = valid.low * valid.shown_scale, valid.high * valid.shown_scale
        raise inputs.error(name, f"outside the range of the formula, {low:g} to {high:g} {valid.unit}")
    return value


def _probability(inputs: Inputs) -> float:
    """The chance of exceedance as the key of the tables (0.5, 0.333 or 0.05; a third is 33.3 %)."""
    chance = _needed(inputs, "probability")
    for level in ppv_predict.PROBABILITIES:
        if abs(chance - level) < 1e-3:
            return level
    raise inputs.error("probability", "the published factors are for 50 %, 33.3 % or 5 %")


def _notes(inputs: Inputs, method: str) -> list[Flag]:
    flags = [Flag("caution", "the constants, exponents and ranges of BS 5228-2 Annex E Table E.1 are from "
                             "memory, not confirmed against a copy: check them before relying on the figures")]
    if method == PERCUSSIVE:
        flags.append(Flag("info", "percussive piling: the distance is the slope distance from the pile toe; "
                                  "no chance of exceedance is attached to this formula"))
    if method == COMPACTION:
        defaults = [text for name, text in (("drums", "1 drum"), ("phase", "steady running"))
                    if not inputs.has(name)]
        if defaults:
            flags.append(Flag("info", f"taken as {' and '.join(defaults)}"))
    flags.append(Flag("info", "a prediction for planning: the resultant PPV at the ground surface; the ground, the "
                              "plant and the structure can give other values: measure once work starts"))
    return flags


SPEC = CheckSpec(
    id="ppv-distance",
    title="Ground vibration by distance",
    summary="PPV predicted from piling or vibratory compaction at a distance, and where a limit is met",
    fields=FIELDS,
    compute=compute,
    caution=PPV_CAUTION,
    series=(
        Series("distance", "Distance", "length"),
        Series("ppv", "Predicted PPV", "velocity", "distance"),
        Series("limit", "Limit PPV", "velocity", "distance"),
    ),
)
