"""Check `decrement`: log decrement and damping ratio from two peak amplitudes read off a trace."""

from __future__ import annotations

import math
from typing import TYPE_CHECKING

from fieldmode.calc.framework.guard import overflow_guard
from fieldmode.calc.framework.meaning import STRUCTURE, Meaning
from fieldmode.calc.framework.result import Flag, Reference, Result, quantity
from fieldmode.calc.framework.spec import CheckSpec, Field

if TYPE_CHECKING:
    from fieldmode.calc.framework.reading import Inputs

PEAK_KINDS = ("length", "velocity", "acceleration")
"""Physical kinds a peak amplitude may have besides a plain number (a reading off a trace)."""

FIELDS = (
    Field("first_peak", "First peak amplitude", "number", "0.32", "", other_kinds=PEAK_KINDS,
          help="a plain number, or a displacement, velocity or acceleration (mm, mil, mm/s, g); the same kind for "
               "both peaks"),
    Field("later_peak", "Later peak amplitude", "number", "0.146", "", other_kinds=PEAK_KINDS,
          help="the peak n cycles later, same side, in the same kind of unit"),
    Field("cycles", "Cycles between them", "number", "5", "", help="n, counted from the first peak"),
)

REFERENCES = (
    Reference("Logarithmic decrement delta = (1/n) ln(u_i / u_(i+n)); zeta = delta / sqrt(4 pi^2 + delta^2)",
              "Chopra, Dynamics of Structures, sec. 2.2"),
)


@overflow_guard("first_peak")
def compute(inputs: Inputs) -> Result:
    first = inputs.value("first_peak", positive=True)
    later = inputs.value("later_peak", positive=True)
    _same_kind(inputs)
    cycles = inputs.value("cycles", minimum=0.5, maximum=10_000)
    if later >= first:
        raise inputs.error("later_peak", "must be smaller than the first peak for a decaying trace")
    if first / later > 1e12:
        raise inputs.error("later_peak", "is more than 1e12 times smaller than the first peak")
    from fieldmode.calc.physics.decrement import (
        decrement_from_peaks,  # here, not at the top: other commands start faster
    )

    decrement, zeta = decrement_from_peaks(first, later, cycles)
    values = {
        "log_decrement": quantity("Log decrement per cycle", "number", decrement),
        "damping_ratio": quantity("Damping ratio", "ratio", zeta, meaning=Meaning("damping ratio", STRUCTURE)),
        "damping_ratio_small_damping": quantity("Damping ratio, delta/2pi", "ratio", decrement / (2 * math.pi)),
        "amplitude_ratio": quantity("Ratio of the two peaks", "number", first / later),
        "cycles_to_halve": quantity("Cycles to half amplitude", "number", math.log(2) / decrement),
    }
    flags: list[Flag] = []
    if not float(cycles).is_integer():
        flags.append(Flag("info", "a fractional number of cycles: the peaks must be on the same side "
                                  "for whole cycles, opposite sides for half cycles"))
    if zeta > 0.2:
        flags.append(Flag("caution", "damping above 20 %: unusual for a structure without added dampers"))
    if cycles < 3:
        flags.append(Flag("caution", "fewer than 3 cycles between the peaks: reading errors weigh heavily"))
    return inputs.result(values, flags=tuple(flags), references=REFERENCES)


def _same_kind(inputs: Inputs) -> None:
    """Refuse peaks of different kinds (a length and a velocity): their ratio means nothing."""
    kinds = [_kind_of(inputs, name) for name in ("first_peak", "later_peak")]
    if kinds[0] != kinds[1]:
        raise inputs.error("later_peak", f"is {kinds[1]} but the first peak is {kinds[0]}: give both peaks in "
                                         "the same kind of unit")


def _kind_of(inputs: Inputs, name: str) -> str:
    """What a peak was read as, for a message: 'a length', 'a plain number'."""
    kind = getattr(inputs.reading(name), "kind", "number")
    return "a plain number" if kind == "number" else f"a{'n' if kind[0] in 'aeiou' else ''} {kind}"


SPEC = CheckSpec(
    id="decrement",
    title="Decrement from two peaks",
    summary="log decrement and damping ratio from two peak amplitudes n cycles apart",
    fields=FIELDS,
    compute=compute,
)
