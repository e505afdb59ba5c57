"""Check `footbridge`: a footbridge's predicted response to pedestrians and crowds, its limits, lock-in and the
damping it needs."""

from __future__ import annotations

import math
from dataclasses import dataclass
from typing import TYPE_CHECKING

import numpy as np

from fieldmode.calc.framework.guard import overflow_guard
from fieldmode.calc.framework.meaning import STRUCTURE, Meaning
from fieldmode.calc.framework.result import Flag, Reference, Result, Value, quantity, word
from fieldmode.calc.framework.spec import CheckSpec, Field, Series

if TYPE_CHECKING:
    from fieldmode.calc.framework.reading import Inputs

DAMPING_NEEDED = Meaning("damping ratio needed", STRUCTURE)
"""The structure's damping ratio that would meet a limit: `tmd` takes it as its target equivalent damping."""

FOOTBRIDGE_CAUTION = ("Screening predictions, not a design: the footbridge's real modal properties (measure them "
                      "with the `decay` check), the project's comfort criteria, local codes and a licensed engineer "
                      "govern.")

TRAFFIC = ("TC1", "TC2", "TC3", "TC4", "TC5")
COMFORT = ("maximum", "medium", "minimum")
"""Comfort classes sought, best first: CL1-CL3 of HiVoSS, maximum, mean and minimum of Setra."""
USES = ("normal", "exceptional crowd")
MAX_DENSITY = 5.0
"""Densest crowd accepted, pedestrians/m^2: denser crowds cannot walk (a choice of ours)."""
DENSITY_POINTS = 120
"""Points of the response against crowd density."""
HEADROOM = 4.0
"""The acceleration axis reaches this multiple of the limit (or 1.3 times the bridge's response, if higher)."""

FIELDS = (
    Field("frequency", "Vertical frequency", "frequency", "2.1 Hz", "Hz", shared=True,
          help="natural frequency of the first vertical mode", meaning=Meaning("natural frequency", STRUCTURE)),
    Field("lateral_frequency", "Lateral frequency", "frequency", "1.05 Hz", "Hz", required=False,
          help="natural frequency of the first lateral (horizontal) mode; empty: no lateral checks"),
    Field("modal_mass", "Modal mass", "mass", "18 t", "t", group="mass",
          help="of the modes, shape scaled to 1 at midspan; a weight reads as W/g0",
          meaning=Meaning("modal mass", STRUCTURE)),
    Field("mass_per_length", "Mass per length", "mass_per_length", "", "t/m", group="mass",
          help="of a simply supported span whose span is the deck length: modal mass m L / 2"),
    Field("damping", "Damping ratio", "ratio", "0.6 %", "", shared=True,
          help="the footbridge's damping: about 0.5 % steel, 0.6 % composite, 0.8 % concrete",
          meaning=Meaning("damping ratio", STRUCTURE)),
    Field("deck_width", "Deck width", "length", "2.5 m", "m", help="walkable width"),
    Field("deck_length", "Deck length", "length", "40 m", "m", help="walkable length (the span, simply supported)"),
    Field("traffic_class", "Traffic class", "choice", "TC2", choices=TRAFFIC, group="traffic",
          help="HiVoSS traffic classes: TC1 a group of 15, TC2 0.2, TC3 0.5, TC4 1.0, TC5 1.5 pedestrians/m^2"),
    Field("density", "Crowd density", "crowd_density", "", "1/m^2", group="traffic",
          help="pedestrians per m^2 of deck, instead of a traffic class"),
    Field("guide", "Guide", "choice", "HiVoSS", choices=("HiVoSS", "Setra"), required=False,
          help="load model and comfort classes: HiVoSS (default) or Setra 2006"),
    Field("use", "Use", "choice", USES[0], choices=USES, required=False,
          help="normal (default) or exceptional crowd: sets the EN 1990 lateral limit, 0.2 or 0.4 m/s^2"),
    Field("comfort", "Comfort class sought", "choice", "medium", choices=COMFORT, required=False,
          help="the class the damping needed aims at (default medium)"),
)


@dataclass(frozen=True)
class Bridge:
    """The inputs of one footbridge in SI."""

    frequency: float
    lateral: float | None
    modal_mass: float
    damping: float
    area: float
    length: float
    density: float
    guide: str
    exceptional: bool
    comfort: int
    """Index of the comfort class sought in the guide's classes, best first."""


@overflow_guard("modal_mass")
def compute(inputs: Inputs) -> Result:
    from fieldmode.calc.physics import footbridge as fb

    bridge = _read(inputs)
    flags: list[Flag] = []
    count = bridge.density * bridge.area
    values: dict[str, Value] = {
        "pedestrians": quantity("Pedestrians on the deck", "number", count),
        "density": quantity("Crowd density", "crowd_density", bridge.density),
    }
    needs: dict[str, list[tuple[str, float | None]]] = {"vertical": [], "lateral": []}
    values.update(_direction(bridge, "vertical", bridge.frequency, needs["vertical"], flags))
    if bridge.lateral is None:
        flags.append(Flag("info", "no lateral frequency given: lateral response and lock-in not checked"))
    else:
        values.update(_direction(bridge, "lateral", bridge.lateral, needs["lateral"], flags))
        values.update(_lock_in(bridge, bridge.lateral, count, needs["lateral"], flags))
    values.update({
        "frequency": quantity("Mode frequency, vertical", "frequency", bridge.frequency,
                              meaning=Meaning("natural frequency", STRUCTURE)),
        "modal_mass": quantity("Modal mass", "mass", bridge.modal_mass, meaning=Meaning("modal mass", STRUCTURE)),
        "damping": quantity("Damping ratio", "ratio", bridge.damping, meaning=Meaning("damping ratio", STRUCTURE)),
    })
    for direction, aims in needs.items():
        values.update(_damping_needed(bridge, direction, aims, flags))
    if "damping_needed" in values:
        flags.append(Flag("info", "F8 sends the vertical mode and the damping ratio needed to `tmd`, which sizes a "
                                  "damper giving it as equivalent damping"))
    if bridge.lateral is not None:
        flags.append(Flag("info", "the lateral mode is taken with the same modal mass and damping as the vertical"))
    references = (
        Reference("Stream of pedestrians as n' in step with the mode: 10.8 sqrt(zeta n) below 1 /m^2, 1.85 sqrt(n) "
                  "from it; force P psi n' (2 / pi) / (2 zeta M); comfort classes", fb.GUIDE_SOURCES[bridge.guide]),
        Reference("One pedestrian at resonance crossing a half-sine mode (build-up along the deck)",
                  "Chopra, Dynamics of Structures, ch. 3 (resonant amplitude); crossing envelope of the slowly "
                  "varying amplitude"),
        Reference("Recommended largest deck accelerations 0.7 m/s^2 vertical, 0.2 m/s^2 horizontal (0.4 m/s^2 "
                  "exceptional crowds)", fb.EN1990_SOURCE),
        Reference("Critical number of pedestrians for lateral lock-in N = 8 pi zeta f M / k", fb.LOCK_IN_SOURCE),
        Reference("Damper mass ratio for an equivalent damping (optimum tuning, harmonic force)",
                  "Den Hartog, Mechanical Vibrations; equivalent damping as in the `tmd` check"),
    )
    return inputs.result(values, series=_series(bridge), flags=tuple(flags), references=references)


def _read(inputs: Inputs) -> Bridge:
    from fieldmode.calc.physics import footbridge as fb

    frequency = inputs.value("frequency", positive=True)
    lateral = inputs.optional("lateral_frequency", positive=True)
    damping = inputs.value("damping", minimum=0.0)
    usual = ", ".join(f"{100 * zeta:g} % {name}" for name, zeta in fb.MATERIAL_DAMPING.items())
    if damping == 0.0 or damping >= 1.0:
        unbounded = " (a resonant response is unbounded without damping)" if damping == 0.0 else ""
        raise inputs.error("damping", f"must be above 0 and below 1{unbounded}; typical footbridges: {usual} "
                                      f"({fb.MATERIAL_DAMPING_SOURCE})")
    width = inputs.value("deck_width", positive=True)
    length = inputs.value("deck_length", positive=True)
    if inputs.has("mass_per_length"):
        modal_mass = fb.modal_mass_simply_supported(inputs.value("mass_per_length", positive=True), length)
    else:
        modal_mass = inputs.value("modal_mass", positive=True)
    if inputs.has("traffic_class"):
        density = fb.traffic_density(inputs.text("traffic_class"), width * length)
        if density > MAX_DENSITY:
            raise inputs.error("traffic_class", f"a group of 15 on {width * length:.3g} m^2 is denser than "
                                                f"{MAX_DENSITY:g} pedestrians/m^2: check the deck size")
    else:
        density = inputs.value("density", positive=True, maximum=MAX_DENSITY)
    guide = inputs.text("guide") if inputs.has("guide") else fb.HIVOSS
    exceptional = inputs.has("use") and inputs.text("use") == USES[1]
    comfort = COMFORT.index(inputs.text("comfort")) if inputs.has("comfort") else 1
    return Bridge(frequency, lateral, modal_mass, damping, width * length, length, density, guide, exceptional,
                  comfort)


def _direction(bridge: Bridge, direction: str, frequency: float, needs: list[tuple[str, float | None]],
               flags: list[Flag]) -> dict[str, Value]:
    """One pedestrian and the stream in one direction, the EN 1990 limit and the comfort class; adds to
    ``needs`` the damping that brings the stream into the class sought, when it is not in it."""
    from fieldmode.calc.physics import footbridge as fb
    from fieldmode.calc.physics import footfall

    single = fb.single_pedestrian_acceleration(frequency, bridge.damping, bridge.modal_mass, direction,
                                               span=bridge.length, guide=bridge.guide)
    stream = fb.stream_acceleration(frequency, bridge.damping, bridge.modal_mass, bridge.area, bridge.density,
                                    direction, bridge.guide)
    limit = fb.en1990_limit(direction, bridge.exceptional)
    met = fb.meets_en1990(stream.acceleration, direction, bridge.exceptional)
    name = direction.capitalize()
    values = {
        f"{direction}_single": quantity(f"{name}, one walker", "acceleration", single),
        f"{direction}_stream": quantity(f"{name}, stream", "acceleration", stream.acceleration),
        f"{direction}_reduction": quantity(f"{name} psi ({bridge.guide})", "number", stream.reduction),
        f"{direction}_limit": quantity(f"{name} EN 1990 limit", "acceleration", limit),
        f"{direction}_met": word(f"{name} EN 1990 verdict", "met" if met else "NOT MET"),
        f"{direction}_comfort": word(f"{name} comfort class",
                                     fb.comfort_class(stream.acceleration, direction, bridge.guide)),
    }
    needed, check = footfall.comfort_check_needed(frequency, direction, "footbridge")[:2]
    if not needed:
        flags.append(Flag("info", f"EN 1990 A2.4.3.2 asks a comfort check only for a {check}: "
                                  f"{frequency:.3g} Hz is above it"))
    if stream.reduction == 0.0:
        flags.append(Flag("info", f"{direction} {frequency:.3g} Hz is outside the {bridge.guide} ranges: "
                                  "walkers are not expected to excite it"))
    if not met:
        flags.append(Flag("warning", f"{direction} acceleration {stream.acceleration:.3g} m/s^2 exceeds the EN 1990 "
                                     f"recommended {limit:g} m/s^2"))
    sought = fb.COMFORT_CLASSES[bridge.guide][bridge.comfort]
    if stream.acceleration > sought.upper(direction):
        needs.append((f"{sought.name} comfort", fb.stream_damping_for_limit(
            sought.upper(direction), frequency, bridge.modal_mass, bridge.area, bridge.density, direction,
            bridge.guide)))
    return values


def _lock_in(bridge: Bridge, lateral: float, count: float, needs: list[tuple[str, float | None]],
             flags: list[Flag]) -> dict[str, Value]:
    """Critical number of pedestrians for lateral lock-in against the number on the deck; adds to ``needs``
    the damping that makes the crowd's number critical, when it exceeds it."""
    from fieldmode.calc.physics import footbridge as fb

    found = fb.lock_in(lateral, bridge.damping, bridge.modal_mass, bridge.area, bridge.density)
    if found.exceeded:
        flags.append(Flag("warning", f"{count:.3g} pedestrians exceed the {found.critical:.3g} that can start lateral "
                                     "lock-in"))
        needs.append(("no lock-in", fb.damping_for_lock_in(count, lateral, bridge.modal_mass)))
    return {"critical_pedestrians": quantity("Lock-in critical number", "number", found.critical),
            "lock_in": word("Lateral lock-in", "EXCEEDED" if found.exceeded else "not reached")}


def _damping_needed(bridge: Bridge, direction: str, aims: list[tuple[str, float | None]],
                    flags: list[Flag]) -> dict[str, Value]:
    """The damping that meets every aim of a direction, and the damper mass ratio that gives it."""
    from fieldmode.calc.physics import footbridge as fb
    from fieldmode.calc.physics import tmd

    if not aims:
        return {}
    out_of_reach = [aim for aim, damping in aims if damping is None]
    if out_of_reach:
        flags.append(Flag("caution", f"no {direction} damping ratio up to {fb.MAX_DAMPING:.0%} reaches "
                                     f"{' and '.join(out_of_reach)}"))
        return {}
    damping = max(d for _, d in aims if d is not None)
    aim = " and ".join(aim for aim, _ in aims)
    prefix = "" if direction == "vertical" else "lateral_"
    short = "vert" if direction == "vertical" else "lat"
    values = {f"{prefix}damping_needed": quantity(f"Damping needed ({short})", "ratio", damping,
                                                  meaning=DAMPING_NEEDED if direction == "vertical" else None)}
    flags.append(Flag("info", f"{direction} damping needed for {aim}: {damping:.3%}"))
    if damping > bridge.damping:
        try:
            ratio = fb.damper_mass_ratio(damping, bridge.damping)
        except ValueError as error:
            flags.append(Flag("caution", f"{direction} damper: {error}"))
        else:
            values[f"{prefix}damper_mass_ratio"] = quantity(f"Damper mass ratio ({short})", "ratio", ratio)
            if math.isclose(ratio, tmd.MIN_MASS_RATIO):
                flags.append(Flag("info", f"{direction}: the smallest damper considered ({ratio:.1%} of the modal "
                                          "mass) already gives the damping needed"))
    return values


def _series(bridge: Bridge) -> dict[str, np.ndarray]:
    """Stream accelerations against crowd density, up to TC5 or past the density given."""
    from fieldmode.calc.physics import footbridge as fb

    top = max(fb.TRAFFIC_CLASSES["TC5"][0], 1.2 * bridge.density)
    grid = np.unique(np.append(np.linspace(top / DENSITY_POINTS, top, DENSITY_POINTS),
                               [bridge.density, fb.DENSE_DENSITY]))
    series = {"density_grid": grid}
    for direction, frequency in (("vertical", bridge.frequency), ("lateral", bridge.lateral)):
        if frequency is not None:
            series[f"{direction}_by_density"] = np.array([
                fb.stream_acceleration(frequency, bridge.damping, bridge.modal_mass, bridge.area, float(d),
                                       direction, bridge.guide).acceleration for d in grid])
    return series


SPEC = CheckSpec(
    id="footbridge",
    title="Footbridge crowd response",
    summary="a footbridge's vertical and lateral response to pedestrians and crowds, EN 1990 limits, comfort "
            "class, lateral lock-in and the damping needed",
    fields=FIELDS,
    compute=compute,
    caution=FOOTBRIDGE_CAUTION,
    series=(
        Series("density_grid", "Crowd density", "crowd_density"),
        Series("vertical_by_density", "Vertical stream acceleration", "acceleration", "density_grid"),
        Series("lateral_by_density", "Lateral stream acceleration", "acceleration", "density_grid"),
    ),
)
