"""Check `floor`: a floor's predicted response to people walking, its limit, and what would meet it."""

from __future__ import annotations

from dataclasses import dataclass
from typing import TYPE_CHECKING, Any

import numpy as np

from fieldmode.calc.framework.guard import overflow_guard
from fieldmode.calc.framework.meaning import STRUCTURE, Meaning
from fieldmode.calc.framework.result import Flag, Reference, Result, Value, quantity, word
from fieldmode.calc.framework.spec import CheckSpec, Field, Series
from fieldmode.calc.physics.constants import STANDARD_GRAVITY

if TYPE_CHECKING:
    from fieldmode.calc.framework.reading import Inputs

GUIDES = ("SCI P354", "AISC DG11")
"""The guide whose low/high-frequency cut-off and walking load model are used (names of floor_walking.GUIDES)."""

PACING_RANGE = (1.0, 3.0)
"""Pacing rates accepted (Hz): the walking load models were fitted to walking, not running (our choice)."""

DAMPING_NEEDED = Meaning("damping ratio needed", STRUCTURE)
"""The structure's damping ratio that would meet a limit: `tmd` takes it as its target equivalent damping."""

FLOOR_CAUTION = ("Screening predictions, not a design: the floor's real modal properties (measure them with the "
                 "`decay` check), the project's vibration criteria, local codes and a licensed engineer govern.")

PACE_POINTS = 41
"""Points of the response against pacing rate."""
FREQUENCY_POINTS = 120
"""Points of the response against floor frequency (about twice the plot width)."""


@dataclass(frozen=True)
class Occupancy:
    """What a floor is used for: its AISC Design Guide 11 limit (a key of floor_walking.DG11_LIMITS, None
    where the guide gives none), its use on the ISO 10137 base curve (a key of
    base_curves.MULTIPLYING_FACTORS, day value) and where that mapping comes from."""

    dg11: str | None
    iso_use: str
    source: str


OCCUPANCIES: dict[str, Occupancy] = {
    "office": Occupancy("office", "office", "ISO 10137 Annex C / BS 6472 Table 5 office (from memory)"),
    "residence": Occupancy("residence", "residential",
                           "ISO 10137 Annex C / BS 6472 Table 5 residential by day, lower value (from memory)"),
    "mall": Occupancy("mall", "office", "no ISO 10137 use fits: the office factor, a choice of ours"),
    "dining": Occupancy("dining", "office", "no ISO 10137 use fits: the office factor, a choice of ours"),
    "workshop": Occupancy(None, "workshop", "ISO 10137 Annex C / BS 6472 Table 5 workshop (from memory)"),
    "critical": Occupancy(None, "critical", "ISO 10137 Annex C / BS 6472 Table 5 critical working areas "
                                            "(from memory)"),
}
"""Occupancy -> Design Guide 11 limit and ISO 10137 multiplying factor. Design Guide 11 has no walking limit for
workshops or critical areas (sensitive equipment has its own velocity criteria there)."""

FREQUENCY_RANGE = (0.1, 1000.0)
"""Floor frequencies read at all (Hz); within them each method says where it applies (the base curves of
perception end at 1 and 80 Hz)."""
MODAL_MASS_RANGE = (100.0, 1e8)
"""Modal masses accepted (kg)."""
WALKER_RANGE = (100.0, 2000.0)
"""Walker weights accepted (N)."""
PATH_RANGE = (0.5, 1000.0)
"""Walking path lengths accepted (m)."""

FIELDS = (
    Field("frequency", "Vertical frequency", "frequency", "5.4 Hz", "Hz", shared=True,
          help="natural frequency of the floor's first vertical mode", meaning=Meaning("natural frequency", STRUCTURE)),
    Field("modal_mass", "Modal mass", "mass", "27 t", "t",
          help="modal mass of that mode, shape scaled to 1 where people walk and feel it; a weight reads as W/g0",
          meaning=Meaning("modal mass", STRUCTURE)),
    Field("effective_weight", "Effective weight (DG11)", "force", "280 kN", "kN", required=False,
          help="effective panel weight W of AISC Design Guide 11; empty: that criterion is not computed"),
    Field("damping", "Damping ratio", "ratio", "3 %", "", shared=True,
          help="the floor's damping in this mode: about 2 % bare, 3 % fitted out, 5 % with full-height partitions",
          meaning=Meaning("damping ratio", STRUCTURE)),
    Field("occupancy", "Occupancy", "choice", "office", choices=tuple(OCCUPANCIES), required=False,
          help="sets the Design Guide 11 limit and the ISO 10137 multiplying factor (default office)"),
    Field("walker_weight", "Walker's weight", "force", "0.7 kN", "kN", required=False,
          help="weight of the person walking (default 0.7 kN)"),
    Field("pacing_low", "Slowest pacing rate", "frequency", "1.7 Hz", "Hz", required=False,
          help="slowest walking pace considered (default 1.7 Hz)"),
    Field("pacing_high", "Fastest pacing rate", "frequency", "2.4 Hz", "Hz", required=False,
          help="fastest walking pace considered (default 2.4 Hz); footfall impulses use it"),
    Field("path_length", "Walking path length", "length", "", "m", required=False,
          help="length a walker covers across the span; limits the resonant build-up (empty: steady state)"),
    Field("guide", "Cut-off guide", "choice", GUIDES[0], choices=GUIDES, required=False,
          help="low/high-frequency cut-off and walking load model: SCI P354 (10 Hz, default) or AISC DG11 (9 Hz)"),
)


@dataclass(frozen=True)
class Floor:
    """The inputs of one floor in SI, and the options the physics functions take."""

    frequency: float
    modal_mass: float
    damping: float
    occupancy: str
    options: dict[str, Any]
    """Keyword options shared by the resonant and transient physics (walker's weight, guide...)."""
    band: tuple[float, float]
    path_length: float | None

    @property
    def guide(self) -> str:
        return str(self.options["guide"])


@overflow_guard("modal_mass")
def compute(inputs: Inputs) -> Result:
    from fieldmode.calc.physics import floor_walking as fw

    floor = _read(inputs)
    flags: list[Flag] = []
    values: dict[str, Value] = {}
    references: list[Reference] = []
    cutoff = fw.CUTOFF_HZ[floor.guide]
    resonant = floor.frequency < cutoff
    _check_damping(inputs, floor, resonant)
    limit = _response_limit(floor, flags)
    values.update(_response(inputs, floor, resonant, limit, flags, references))
    needs: list[dict[str, float | None]] = []
    if values["response_met"].magnitude != "met":
        needs.append(_response_needs(floor, resonant, limit))
    dg11 = _dg11(inputs, floor, flags, references)
    values.update(dg11[0])
    if dg11[1] is not None:
        needs.append(dg11[1])
    values.update(_mode_values(floor))
    if needs:
        values.update(_needs(needs, floor, flags))
    else:
        flags.append(Flag("info", "every limit computed is met"))
    references.append(Reference(f"Low/high-frequency floor cut-off, {cutoff:g} Hz ({floor.guide})",
                                "AISC Design Guide 11, 2nd ed., 4.1 (9 Hz); SCI P354 (10 Hz)"))
    return inputs.result(values, series=_series(floor, limit), flags=tuple(flags), references=tuple(references))


def _read(inputs: Inputs) -> Floor:
    from fieldmode.calc.physics import floor_impulse as fi
    from fieldmode.calc.physics import floor_walking as fw
    from fieldmode.calc.physics import footfall

    frequency = inputs.value("frequency", minimum=FREQUENCY_RANGE[0], maximum=FREQUENCY_RANGE[1])
    if frequency > fi.HIGHEST_HZ:
        raise inputs.error("frequency", f"above {fi.HIGHEST_HZ:g} Hz, where the base curves of perception end")
    modal_mass = inputs.value("modal_mass", minimum=MODAL_MASS_RANGE[0], maximum=MODAL_MASS_RANGE[1])
    damping = inputs.value("damping", minimum=0.0)
    if damping >= 1.0:
        raise inputs.error("damping", "must be below 1 (100 %); typical floors: " + fw.typical_damping_text())
    weight = inputs.optional("walker_weight", fw.PERSON_WEIGHT, minimum=WALKER_RANGE[0], maximum=WALKER_RANGE[1])
    low = inputs.optional("pacing_low", footfall.WALKING[0], minimum=PACING_RANGE[0], maximum=PACING_RANGE[1])
    high = inputs.optional("pacing_high", footfall.WALKING[1], minimum=PACING_RANGE[0], maximum=PACING_RANGE[1])
    assert low is not None and high is not None and weight is not None
    if high < low:
        raise inputs.error("pacing_high", f"must be at least the slowest pacing rate ({low:g} Hz)")
    path = inputs.optional("path_length", minimum=PATH_RANGE[0], maximum=PATH_RANGE[1])
    guide = fw.AISC_DG11 if inputs.has("guide") and inputs.text("guide") == "AISC DG11" else fw.SCI_P354
    occupancy = inputs.text("occupancy") if inputs.has("occupancy") else "office"
    return Floor(frequency, modal_mass, damping, occupancy, {"weight": weight, "guide": guide}, (low, high), path)


def _check_damping(inputs: Inputs, floor: Floor, resonant: bool) -> None:
    """Refuse zero damping where a resonant response (or the DG11 criterion) would be unbounded."""
    from fieldmode.calc.physics import floor_walking as fw

    unbounded = resonant or (inputs.has("effective_weight") and floor.frequency <= fw.CUTOFF_HZ[fw.AISC_DG11])
    try:
        fw.check_damping(floor.damping, resonant=unbounded)
    except ValueError as error:
        raise inputs.error("damping", str(error)) from error


def _response_limit(floor: Floor, flags: list[Flag]) -> float:
    """The occupancy's multiplying factor on the vertical base curve: the response factor limit."""
    from fieldmode.calc.physics import base_curves

    use = OCCUPANCIES[floor.occupancy]
    day, night = base_curves.MULTIPLYING_FACTORS[use.iso_use]
    if night != day:
        flags.append(Flag("info", f"{floor.occupancy}: response factor limit {day:g} by day ({night:g} at night)"))
    return day


def _resonant_options(floor: Floor) -> dict[str, Any]:
    return {**floor.options, "band": floor.band, "path_length": floor.path_length}


def _transient_options(floor: Floor) -> dict[str, Any]:
    return {**floor.options, "pacing_rate": floor.band[1]}


def _response(inputs: Inputs, floor: Floor, resonant: bool, limit: float, flags: list[Flag],
              references: list[Reference]) -> dict[str, Value]:
    """Resonant response below the cut-off, transient footfall response from it, against the limit."""
    from fieldmode.calc.physics import floor_impulse as fi
    from fieldmode.calc.physics import floor_walking as fw

    omega = 2.0 * np.pi * floor.frequency
    values: dict[str, Value] = {}
    if resonant:
        walking = fw.resonant_response(floor.frequency, floor.damping, floor.modal_mass, **_resonant_options(floor))
        values["method"] = word("Method", f"resonant, harmonic {walking.harmonic}")
        values["pacing_rate"] = quantity("Driving pacing rate", "frequency", walking.pacing_rate)
        if floor.path_length is not None:
            values["buildup"] = quantity("Build-up along the path", "ratio", walking.buildup)
        peak, rms, factor = walking.peak, walking.rms, walking.response_factor
        references.append(Reference("Resonant response to the walking harmonic nearest the floor frequency, "
                                    "steady amplitude alpha Q / (2 zeta M), build-up 1 - exp(-2 pi zeta N)",
                                    f"{fw.DLF_SOURCES[floor.guide]}; {fw.P354_SOURCE}"))
        other = _refusal("transient footfall-impulse method", lambda: fi.transient_response(
            floor.frequency, floor.damping, floor.modal_mass, **_transient_options(floor)))
    else:
        footfall = fi.transient_response(floor.frequency, floor.damping, floor.modal_mass, **_transient_options(floor))
        values["method"] = word("Method", "footfall impulse")
        values["pacing_rate"] = quantity("Footfall pacing rate", "frequency", floor.band[1])
        values["peak_velocity"] = quantity("Peak velocity", "velocity", footfall.peak_velocity)
        values["rms_velocity"] = quantity(f"R.m.s. velocity over {fi.WINDOW:g} s", "velocity", footfall.rms_velocity)
        peak, rms, factor = omega * footfall.peak_velocity, omega * footfall.rms_velocity, footfall.response_factor
        references.append(Reference("Effective footfall impulse c Q fp^1.43 / fn^1.3 on the mode, r.m.s. velocity of "
                                    "the free decay over 1 s against the base curve",
                                    fi.IMPULSE_SOURCES[floor.guide]))
        other = _refusal("resonant walking method", lambda: fw.resonant_response(
            floor.frequency, floor.damping, floor.modal_mass, **_resonant_options(floor)))
    if other:
        flags.append(Flag("info", other))
    met = factor <= limit
    use = OCCUPANCIES[floor.occupancy]
    values.update({
        "peak_acceleration": quantity("Peak acceleration", "acceleration", peak),
        "rms_acceleration": quantity("R.m.s. acceleration", "acceleration", rms),
        "response_factor": quantity("Response factor", "number", factor),
        "response_limit": quantity("Response factor limit", "number", limit),
        "response_met": word("Response factor verdict", "met" if met else "NOT MET"),
    })
    if not met:
        flags.append(Flag("warning", f"response factor {factor:.3g} exceeds the {floor.occupancy} limit {limit:g}"))
    references.append(Reference("Response factor: r.m.s. acceleration over the ISO 10137 vertical base curve; "
                                f"limit by occupancy ({use.source})", _base_source()))
    return values


def _base_source() -> str:
    from fieldmode.calc.physics import base_curves

    return base_curves.SOURCE


def _refusal(name: str, method: Any) -> str:
    """Why the method ``name`` does not apply to this floor (its own words, naming the one that does), or ''."""
    try:
        method()
    except ValueError as error:
        return f"{name} not used: {error}"
    return ""


def _response_needs(floor: Floor, resonant: bool, limit: float) -> dict[str, float | None]:
    """Damping, modal mass and lowest frequency that bring the response factor to the limit."""
    from fieldmode.calc.physics import floor_impulse as fi
    from fieldmode.calc.physics import floor_walking as fw

    options, transient = _resonant_options(floor), _transient_options(floor)
    if resonant:
        damping = fw.resonant_damping_for_limit(limit, floor.frequency, floor.modal_mass, **options)
        mass = fw.resonant_mass_for_limit(limit, floor.frequency, floor.damping, **options)
        frequency = fw.resonant_frequency_for_limit(limit, floor.damping, floor.modal_mass, **options)
    else:
        damping = fi.transient_damping_for_limit(limit, floor.frequency, floor.modal_mass, **transient)
        mass = fi.transient_mass_for_limit(limit, floor.frequency, floor.damping, **transient)
        frequency = None
    if frequency is None:
        frequency = fi.transient_frequency_for_limit(limit, floor.damping, floor.modal_mass, **transient)
    return {"damping": damping, "modal_mass": mass, "frequency": frequency}


def _dg11(inputs: Inputs, floor: Floor, flags: list[Flag],
          references: list[Reference]) -> tuple[dict[str, Value], dict[str, float | None] | None]:
    """The AISC Design Guide 11 walking criterion, its limit, and what would meet it (None when met)."""
    from fieldmode.calc.physics import floor_walking as fw

    if not inputs.has("effective_weight"):
        flags.append(Flag("info", "AISC Design Guide 11 criterion not computed: give the effective weight W"))
        return {}, None
    weight = inputs.value("effective_weight", positive=True)
    if floor.frequency > fw.CUTOFF_HZ[fw.AISC_DG11]:
        flags.append(Flag("info", _refusal("AISC Design Guide 11 criterion",
                                           lambda: fw.dg11_acceleration(floor.frequency, floor.damping, weight))))
        return {}, None
    acceleration = fw.dg11_acceleration(floor.frequency, floor.damping, weight)
    references.append(Reference("Walking criterion a_p = g P0 exp(-0.35 fn) / (beta W), P0 = 0.29 kN",
                                f"{fw.DG11_SOURCE}; limits: {fw.DG11_LIMITS_SOURCE}"))
    if floor.options["weight"] != fw.PERSON_WEIGHT:
        flags.append(Flag("info", "the Design Guide 11 criterion keeps its own constant force P0 = 0.29 kN: the "
                                  "walker's weight is used by the other method"))
    values = {"dg11_acceleration": quantity("DG11 peak acceleration", "acceleration", acceleration)}
    key = OCCUPANCIES[floor.occupancy].dg11
    if key is None:
        flags.append(Flag("info", f"Design Guide 11 gives no walking limit for {floor.occupancy}: judged by the "
                                  "response factor only"))
        return values, None
    limit = fw.dg11_limit(key)
    met = acceleration <= limit
    values["dg11_limit"] = quantity("DG11 limit", "acceleration", limit)
    values["dg11_met"] = word("DG11 verdict", "met" if met else "NOT MET")
    if met:
        return values, None
    flags.append(Flag("warning", f"DG11 peak acceleration {acceleration / STANDARD_GRAVITY:.2%} g exceeds the "
                                 f"{floor.occupancy} limit {limit / STANDARD_GRAVITY:.2%} g"))
    frequency = fw.dg11_frequency_for_limit(floor.damping, weight, limit)
    return values, {"damping": fw.dg11_damping_for_limit(floor.frequency, weight, limit),
                    "effective_weight": fw.dg11_weight_for_limit(floor.frequency, floor.damping, limit),
                    "frequency": fw.CUTOFF_HZ[fw.AISC_DG11] if frequency is None else frequency}


def _mode_values(floor: Floor) -> dict[str, Value]:
    """The mode as read, with the structure's meanings, so F8 can send it (to `tmd`)."""
    return {
        "frequency": quantity("Mode frequency", "frequency", floor.frequency,
                              meaning=Meaning("natural frequency", STRUCTURE)),
        "modal_mass": quantity("Modal mass", "mass", floor.modal_mass, meaning=Meaning("modal mass", STRUCTURE)),
        "damping": quantity("Damping ratio", "ratio", floor.damping, meaning=Meaning("damping ratio", STRUCTURE)),
    }


def _needs(needs: list[dict[str, float | None]], floor: Floor, flags: list[Flag]) -> dict[str, Value]:
    """What would meet every limit not met: the largest damping, the masses, the lowest frequency."""
    from fieldmode.calc.physics import floor_walking as fw

    values: dict[str, Value] = {}
    dampings = [need["damping"] for need in needs]
    if any(damping is None for damping in dampings):
        flags.append(Flag("caution", f"no damping ratio up to {fw.MAX_DAMPING:.0%} meets the limits"))
    else:
        damping = max(d for d in dampings if d is not None)
        values["damping_needed"] = quantity("Damping ratio needed", "ratio", damping, meaning=DAMPING_NEEDED)
        flags.append(Flag("info", f"F8 sends the mode and the damping ratio needed ({damping:.2%}) to `tmd`, which "
                                  "sizes a damper giving it as equivalent damping"))
    for key, label, kind in (("modal_mass", "Modal mass needed", "mass"),
                             ("effective_weight", "DG11 weight needed", "force")):
        found = [need[key] for need in needs if need.get(key) is not None]
        if found:
            values[f"{key}_needed"] = quantity(label, kind, max(v for v in found if v is not None))
    frequencies = [need["frequency"] for need in needs]
    if any(frequency is None for frequency in frequencies):
        flags.append(Flag("caution", "no floor frequency up to 80 Hz meets the limits with this mass and damping"))
    else:
        lowest = max(f for f in frequencies if f is not None)
        values["frequency_needed"] = quantity("Lowest frequency needed", "frequency", lowest)
    return values


def _series(floor: Floor, limit: float) -> dict[str, np.ndarray]:
    """Response factor against pacing rate, and against floor frequency (same mass and damping)."""
    from fieldmode.calc.physics import floor_impulse as fi
    from fieldmode.calc.physics import floor_walking as fw

    cutoff = fw.CUTOFF_HZ[floor.guide]
    pace = np.linspace(floor.band[0], floor.band[1], PACE_POINTS)
    if floor.frequency < cutoff:
        by_pace = np.array([fw.resonant_response(floor.frequency, floor.damping, floor.modal_mass,
                                                 **{**_resonant_options(floor), "band": (p, p)}).response_factor
                            for p in pace])
    else:
        by_pace = np.array([fi.transient_response(floor.frequency, floor.damping, floor.modal_mass,
                                                  **{**floor.options, "pacing_rate": p}).response_factor
                            for p in pace])
    top = min(fi.HIGHEST_HZ, max(2.0 * cutoff, 1.5 * floor.frequency))
    grid = np.unique(np.append(np.linspace(fw.LOWEST_FLOOR_HZ, top, FREQUENCY_POINTS), floor.frequency))
    low = grid[grid < cutoff] if floor.damping > 0 else grid[:0]
    high = grid[grid >= cutoff]
    by_frequency = np.concatenate([
        fw.resonant_response_factors(low, floor.damping, floor.modal_mass, **_resonant_options(floor))
        if low.size else low,
        [fi.transient_response(float(f), floor.damping, floor.modal_mass, **_transient_options(floor)).response_factor
         for f in high]])
    return {"pacing_rate_grid": pace, "response_by_pace": by_pace,
            "frequency_grid": np.concatenate([low, high]), "response_by_frequency": by_frequency}


SPEC = CheckSpec(
    id="floor",
    title="Floor walking response",
    summary="a floor's response to walking (AISC DG11, resonant, footfall impulse) against its limit, and what "
            "would meet it",
    fields=FIELDS,
    compute=compute,
    caution=FLOOR_CAUTION,
    series=(
        Series("pacing_rate_grid", "Pacing rate", "frequency"),
        Series("response_by_pace", "Response factor at that pacing rate", "number", "pacing_rate_grid"),
        Series("frequency_grid", "Floor frequency", "frequency"),
        Series("response_by_frequency", "Response factor of a floor of that frequency", "number",
               "frequency_grid"),
    ),
)
