"""Check `footfall`: a floor's or footbridge's frequencies against walking, running and jumping bands."""

from __future__ import annotations

from typing import TYPE_CHECKING

import numpy as np

from fieldmode.calc.framework.guard import overflow_guard
from fieldmode.calc.framework.meaning import STRUCTURE, Meaning
from fieldmode.calc.framework.result import Flag, Reference, Result, Value, quantity, word
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
    Field("higher_frequencies", "Higher vertical modes", "frequency", "", "Hz", many=True, required=False,
          help="further vertical (or torsional) natural frequencies, a list"),
    Field("lateral_frequency", "Lateral frequencies", "frequency", "1.05 Hz", "Hz", many=True, required=False,
          help="lateral (horizontal) or torsional natural frequencies"),
    Field("structure", "Structure", "choice", "footbridge", choices=STRUCTURES, required=False,
          help="footbridge (default) adds the footbridge guides' risk ranges and the EN 1990 limits"),
)


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
        footfall.BACHMANN: "Pacing rates of walking, running and jumping; harmonic h covers h times the range",
        footfall.SETRA: "Footbridge risk ranges of the natural frequency",
        footfall.HIVOSS: "Footbridge critical frequency ranges",
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
    """Band membership, margins and the comfort-check verdict for one direction."""
    from fieldmode.calc.physics import footfall

    described, verdicts = [], []
    margins = np.array([footfall.forcing_margin(float(f), bands) for f in frequencies])
    for frequency, margin in zip(frequencies, margins, strict=True):
        f = float(frequency)
        inside = footfall.bands_containing(f, bands)
        described.append(f"{f:.3g} Hz: " + (", ".join(b.shown() for b in inside) + " Hz" if inside else "none"))
        needed, rule, source = footfall.comfort_check_needed(f, direction, structure)
        sources.add(source)
        verdicts.append(f"{f:.3g} Hz {'needed' if needed else 'not needed'}")
        flags.extend(_frequency_flags(direction, f, inside, margin, needed, rule))
    prefix = "" if direction == "vertical" else "lateral_"
    return {
        f"{prefix}bands": word(f"{direction.capitalize()} bands", " | ".join(described)),
        f"{prefix}margin": quantity(f"{direction.capitalize()}: out of band by", "frequency",
                                    margins),
        f"{prefix}comfort_check": word(f"{direction.capitalize()} comfort check", ", ".join(verdicts)),
    }


def _frequency_flags(direction: str, frequency: float, inside: tuple[Band, ...], margin: float, needed: bool,
                     rule: str) -> list[Flag]:
    flags = []
    if inside:
        level = "warning" if any(b.severe for b in inside) else "caution"
        names = ", ".join(b.name for b in inside)
        flags.append(Flag(level, f"{direction} {frequency:.3g} Hz is inside {names}"))  # type: ignore[arg-type]
    elif margin < NEAR * frequency:
        flags.append(Flag("caution", f"{direction} {frequency:.3g} Hz is within {margin:.2g} Hz of a forcing band"))
    if needed:
        flags.append(Flag("caution", f"comfort check needed, {direction} {frequency:.3g} Hz: {rule}"))
    return flags


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
