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

FIELDS = (
    Field("first_peak", "First peak amplitude", "number", "0.32", "", help="any unit, the same for both peaks"),
    Field("later_peak", "Later peak amplitude", "number", "0.146", "", help="the peak n cycles later, same side"),
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
        "log_decrement": quantity("Log decrement (per cycle)", "number", decrement),
        "damping_ratio": quantity("Damping ratio", "ratio", zeta, meaning=Meaning("damping ratio", STRUCTURE)),
        "damping_ratio_small_damping": quantity("Damping ratio, delta / 2 pi form", "ratio", decrement / (2 * math.pi)),
        "amplitude_ratio": quantity("Amplitude ratio u_i / u_(i+n)", "number", first / later),
        "cycles_to_halve": quantity("Cycles to halve amplitude", "number", math.log(2) / decrement),
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


SPEC = CheckSpec(
    id="decrement",
    title="Decrement from two peaks",
    summary="log decrement and damping ratio from two peak amplitudes n cycles apart",
    fields=FIELDS,
    compute=compute,
)
