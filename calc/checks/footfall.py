"""Check `footfall`: a floor's or footbridge's frequencies against walking, running and jumping bands."""

from __future__ import annotations

from typing import TYPE_CHECKING

import numpy as np

from fieldmode.calc.framework.guard import overflow_guard
from fieldmode.calc.framework.meaning import STRUCTURE, Meaning
from fieldmode.calc.framework.result import Flag, Reference, Result, Value, word
from fieldmode.calc.framework.spec import CheckSpec, Field, Series

if TYPE_CHECKING:
    from fieldmode.calc.framework.reading import Inputs
    from fieldmode.calc.physics.footfall import Band

STRUCTURES = ("footbridge", "floor")

NEAR = 0.10
"""A frequency within 10 % of a forcing band's edge is reported as near it."""

FIELDS = (
    Field("frequency", "Vertical frequency", "frequency", "2.1 Hz", "Hz", shared=True,
          help="the first vertical natural frequency", meaning=Meaning("natural frequency", STRUCTURE)),
    Field("higher_frequencies", "Higher vertical frequencies", "frequency", "", "Hz", many=True, required=False,
          help="further vertical (or torsional) natural frequencies, a list"),
    Field("lateral_frequency", "Lateral frequencies", "frequency", "1.05 Hz", "Hz", many=True, required=False,
          help="lateral (horizontal) or torsional natural frequencies"),
    Field("structure", "Structure", "choice", "footbridge", choices=STRUCTURES, required=False,
          help="footbridge (default) adds the footbridge guides' risk ranges and the EN 1990 limits"),
)


SOURCE_NAMES: dict[str, str] = {}
"""Short names of the sources in result labels, filled on first use from the physics module."""


def _source_names() -> dict[str, str]:
    from fieldmode.calc.physics import footfall

    if not SOURCE_NAMES:
        SOURCE_NAMES.update({footfall.WALKING_SOURCE: "walking", footfall.BACHMANN: "run/jump",
                             footfall.SETRA: "Setra", footfall.HIVOSS: "HiVoSS"})
    return SOURCE_NAMES


@overflow_guard("frequency")
def compute(inputs: Inputs) -> Result:
    from fieldmode.calc.physics import footfall

    structure = inputs.text("structure") if inputs.has("structure") else "footbridge"
    values: dict[str, Value] = {}
    flags: list[Flag] = []
    series: dict[str, np.ndarray] = {}
    sources: set[str] = set()
    for direction, frequencies in _frequencies(inputs):
        bands = footfall.bands_for(direction, structure)
        sources.update(b.source for b in bands)
        values.update(_direction_values(direction, frequencies, bands, structure, flags, sources))
        series["frequencies" if direction == "vertical" else "lateral_frequencies"] = frequencies
        rows = footfall.chart_rows(bands)
        for key, column in rows.items():
            series[key] = np.concatenate([series[key], column]) if key in series else column
    methods = {
        footfall.WALKING_SOURCE: "Walking pacing rate; harmonic h covers h times the range, lateral half the rate",
        footfall.BACHMANN: "Rates of running and jumping; harmonic h covers h times the range",
        footfall.SETRA: "Footbridge risk ranges of the natural frequency",
        footfall.HIVOSS: "Footbridge critical frequency ranges",
        footfall.SCI_P354: "Low-frequency floor limit 10 Hz (resonant check below, transient above)",
        footfall.AISC_DG11: "Low-frequency floor limit 9 Hz (walking criterion up to it)",
    }
    references = tuple(Reference(methods.get(source, "Comfort-check limit"), source) for source in sorted(sources))
    return inputs.result(values, series=series, flags=tuple(flags), references=references)


def _frequencies(inputs: Inputs) -> list[tuple[str, np.ndarray]]:
    """The vertical frequencies (first, then the higher ones) and the lateral ones given, in Hz."""
    vertical = np.array([inputs.value("frequency", positive=True)])
    if inputs.has("higher_frequencies"):
        vertical = np.concatenate([vertical, inputs.array("higher_frequencies", positive=True)])
    found = [("vertical", vertical)]
    if inputs.has("lateral_frequency"):
        found.append(("lateral", inputs.array("lateral_frequency", positive=True)))
    return found


def _direction_values(direction: str, frequencies: np.ndarray, bands: tuple[Band, ...], structure: str,
                      flags: list[Flag], sources: set[str]) -> dict[str, Value]:
    """Band membership (one range per activity or guide), margins per source and the comfort-check verdict
    for one direction."""
    from fieldmode.calc.physics import footfall

    described, verdicts = [], []
    for frequency in frequencies:
        f = float(frequency)
        inside = footfall.verdicts(f, bands)
        described.append(f"{f:.3g} Hz: " + (", ".join(b.shown() for b in inside) + " Hz" if inside else "none"))
        verdict, notes = _comfort(f, direction, structure, sources)
        verdicts.append(f"{f:.3g} Hz: {verdict}")
        flags.extend(_frequency_flags(direction, f, inside, bands))
        flags.extend(notes)
    prefix = "" if direction == "vertical" else "lateral_"
    names = _source_names()
    values = {f"{prefix}bands": word(f"{direction.capitalize()} bands", " | ".join(described))}
    for source in footfall.sources_of(bands):
        margins = [footfall.source_margin(float(f), bands, source) for f in frequencies]
        label = f"{names[source]} margin" if direction == "vertical" else f"Lateral {names[source]}"
        values[f"{prefix}margin_{_key(names[source])}"] = word(label[0].upper() + label[1:],
                                                               _margin_text(frequencies, margins))
    values[f"{prefix}comfort_check"] = word(f"{direction.capitalize()} comfort", " | ".join(verdicts))
    return values


def _margin_text(frequencies: np.ndarray, margins: list[float]) -> str:
    """Margins in words: 'clear by 1.4 Hz' outside a source's ranges, '0.3 Hz to clear' inside them."""
    said = [f"clear by {m:.3g} Hz" if m > 0 else f"{-m:.3g} Hz to clear" for m in margins]
    if len(said) == 1:
        return said[0]
    return " | ".join(f"{float(f):.3g} Hz: {text}" for f, text in zip(frequencies, said, strict=True))


def _key(name: str) -> str:
    return name.lower().replace("/", "_")


def _comfort(frequency: float, direction: str, structure: str, sources: set[str]) -> tuple[str, list[Flag]]:
    """The comfort-check verdict for one frequency in a few words, with the notes that explain it."""
    from fieldmode.calc.physics import footfall

    if structure == "floor" and direction == "vertical":
        return _floor_comfort(frequency, sources)
    needed, rule, source = footfall.comfort_check_needed(frequency, direction, structure)
    sources.add(source)
    if structure == "footbridge":
        limit = footfall.FOOTBRIDGE_VERTICAL_LIMIT if direction == "vertical" else footfall.FOOTBRIDGE_LATERAL_LIMIT
        if needed:
            return (f"needed (below {limit:g} Hz, EN 1990 A2)",
                    [Flag("caution", f"comfort check needed, {direction} {frequency:.3g} Hz: {rule} (EN 1990 A2)")])
        return f"not needed ({limit:g} Hz or above, EN 1990 A2)", []
    if needed:
        return "needed (in a lateral band)", [Flag("caution", f"comfort check needed, lateral {frequency:.3g} Hz: "
                                                             f"{rule}")]
    return "not needed (clear of lateral bands)", []


def _floor_comfort(frequency: float, sources: set[str]) -> tuple[str, list[Flag]]:
    """A floor's vertical verdict: resonant check below the guide's low-frequency limit, transient above."""
    from fieldmode.calc.physics import footfall

    below = [(guide, limit) for guide, limit, _ in footfall.LOW_FREQUENCY_LIMITS
             if footfall.low_frequency_floor(frequency, limit)]
    sources.update(source for _, _, source in footfall.LOW_FREQUENCY_LIMITS)
    limits = ", ".join(f"{limit:g} Hz {guide}" for guide, limit, _ in footfall.LOW_FREQUENCY_LIMITS)
    if len(below) == len(footfall.LOW_FREQUENCY_LIMITS):
        return ("needed: resonant check", [Flag("caution", f"comfort check needed, floor {frequency:.3g} Hz: below the "
                                                         f"low-frequency limit ({limits}), walking harmonics can "
                                                         f"build up resonance")])
    if below:
        guides = ", ".join(guide for guide, _ in below)
        return (f"resonant by {guides}, else transient",
                [Flag("caution", f"floor {frequency:.3g} Hz: low-frequency (resonant check) by {guides}, "
                                 f"high-frequency (transient footfall-impulse check) by the other ({limits})")])
    return ("transient check (high-frequency)",
            [Flag("info", f"floor {frequency:.3g} Hz is above the low-frequency limit ({limits}): walking "
                          f"harmonics cannot build up resonance, but a transient (footfall impulse) check still "
                          f"applies (check floor)")])


def _frequency_flags(direction: str, frequency: float, inside: tuple[Band, ...], bands: tuple[Band, ...]) -> list[Flag]:
    """A warning for each maximum-risk range or first-harmonic band the frequency is in, a caution or note for
    the other ranges it is in, and a caution when it is near (within 10 %) a band of a source it is clear of."""
    from fieldmode.calc.physics import footfall

    flags = []
    for level in footfall.LEVELS:
        named = [b for b in inside if b.level == level]
        if named:
            names = ", ".join(f"{b.shown()} Hz" for b in named)
            flags.append(Flag(level, f"{direction} {frequency:.3g} Hz is inside {names}"))  # type: ignore[arg-type]
    held = {b.source for b in inside}
    for source in footfall.sources_of(bands):
        own = tuple(b for b in bands if b.source == source and b.level != "info")
        if source in held or not own:
            continue
        margin = footfall.forcing_margin(frequency, own)
        if 0 < margin < NEAR * frequency:
            near = footfall.nearest_band(frequency, own)
            flags.append(Flag("caution", f"{direction} {frequency:.3g} Hz is {margin:.2g} Hz from {near.shown()} Hz"
                                         f"{_why(near)}"))
    return flags


def _why(band: Band) -> str:
    """Why being near a band matters, for the activities that need saying."""
    if band.name.startswith("jumping"):
        return ": rhythmic jumping (gym, dance, concert) could excite it; walking cannot"
    if band.name.startswith("running"):
        return ": runners could excite it"
    return ""


SPEC = CheckSpec(
    id="footfall",
    title="Walking bands",
    summary="floor or footbridge frequencies against walking, running and jumping forcing bands",
    fields=FIELDS,
    compute=compute,
    series=(
        Series("frequencies", "Vertical frequencies", "frequency"),
        Series("lateral_frequencies", "Lateral frequencies", "frequency"),
        Series("band_index", "Forcing band (row of the band table)", "number"),
        Series("band_low", "Band low edge", "frequency", "band_index"),
        Series("band_high", "Band high edge", "frequency", "band_index"),
    ),
)
