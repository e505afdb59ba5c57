"""Tables of typical values, with their published sources, that can fill a field.

Pure data: each :class:`Table` lists rows of a description, the text that fills the
field, a note (the range or the raw tabulated value) and the source. Values that could
not be checked against a copy of the publication carry "(from memory)" in their source.
:func:`table_for` picks the table for a field from its name and physical kind.
"""

from __future__ import annotations

import math
from dataclasses import dataclass

from fieldmode.calc.physics.machine import TYPICAL_GRADES


@dataclass(frozen=True)
class Row:
    """One line of a table: what it is, the text it puts in the field, a note, the source."""

    description: str
    fill: str
    note: str
    source: str


@dataclass(frozen=True)
class Table:
    """A short table of typical values for one kind of field."""

    id: str
    title: str
    rows: tuple[Row, ...]
    fills: str
    """What a picked row puts in the field, said in a few words."""


def ratio_from_log_decrement(decrement: float) -> float:
    """Damping ratio from a logarithmic decrement: zeta = delta / sqrt(4 pi^2 + delta^2)."""
    return decrement / math.sqrt(4.0 * math.pi**2 + decrement**2)


_NEWMARK_HALL = "Newmark & Hall, as tabulated in Chopra, Dynamics of Structures, Table 11.2.1 (from memory)"
_WORKING = "working stress (<= 1/2 yield)"
_YIELD = "near yield"

# (stress level, construction, lowest %, highest %)
NEWMARK_HALL_DAMPING: tuple[tuple[str, str, float, float], ...] = (
    (_WORKING, "welded steel, prestressed or well-reinforced concrete (slight cracking)", 2, 3),
    (_WORKING, "reinforced concrete with considerable cracking", 3, 5),
    (_WORKING, "bolted or riveted steel; timber with nailed or bolted joints", 5, 7),
    (_YIELD, "welded steel, prestressed concrete (prestress not fully lost)", 5, 7),
    (_YIELD, "prestressed concrete with no prestress left", 7, 10),
    (_YIELD, "reinforced concrete", 7, 10),
    (_YIELD, "bolted or riveted steel; timber with bolted joints", 10, 15),
    (_YIELD, "timber with nailed joints", 15, 20),
)
"""Recommended damping ratios (%) by stress level and construction type."""

_EN_F2 = "EN 1991-1-4:2005 Annex F, Table F.2 (from memory)"

EN1991_LOG_DECREMENTS: tuple[tuple[str, float], ...] = (
    ("reinforced concrete buildings", 0.10),
    ("steel buildings", 0.05),
    ("mixed structures, concrete + steel", 0.08),
    ("reinforced concrete towers and chimneys", 0.03),
    ("unlined welded steel stacks, no external insulation", 0.012),
    ("steel bridges and lattice towers, welded", 0.02),
    ("steel bridges and lattice towers, high-resistance bolts", 0.03),
    ("steel bridges and lattice towers, ordinary bolts", 0.05),
    ("composite bridges", 0.04),
    ("prestressed concrete bridges without cracks", 0.04),
    ("concrete bridges with cracks", 0.10),
    ("timber bridges (0.06 to 0.12)", 0.06),
    ("aluminium alloy bridges", 0.02),
    ("parallel cables", 0.006),
    ("spiral cables", 0.020),
)
"""Structural damping as a logarithmic decrement delta_s, by structure type."""


def _damping_rows() -> tuple[Row, ...]:
    rows = [Row(f"{level}: {construction}", f"{low:g} %", f"{low:g} to {high:g} %", _NEWMARK_HALL)
            for level, construction, low, high in NEWMARK_HALL_DAMPING]
    for structure, decrement in EN1991_LOG_DECREMENTS:
        percent = 100.0 * ratio_from_log_decrement(decrement)
        rows.append(Row(structure, f"{percent:.3g} %", f"log decrement {decrement:g}", _EN_F2))
    return tuple(rows)


DAMPING = Table("damping", "Damping ratio by construction", _damping_rows(),
                "the lowest ratio; log decrements as zeta = delta / sqrt(4 pi^2 + delta^2)")

# (material, modulus in GPa, source)
YOUNGS_MODULI: tuple[tuple[str, float, str], ...] = (
    ("structural steel", 210, "EN 1993-1-1:2005 3.2.6(1)"),
    ("aluminium alloys", 70, "EN 1999-1-1:2007 3.2.5"),
    ("concrete C25/30, Ecm", 31, "EN 1992-1-1:2004 Table 3.1"),
    ("concrete C30/37, Ecm", 33, "EN 1992-1-1:2004 Table 3.1"),
    ("concrete C40/50, Ecm", 35, "EN 1992-1-1:2004 Table 3.1"),
    ("softwood C24, E0,mean", 11, "EN 338:2016 Table 1"),
)
"""Young's modulus of common materials, GPa."""

MODULUS = Table("modulus", "Young's modulus of common materials",
                tuple(Row(name, f"{value:g} GPa", "mean / nominal", source) for name, value, source in YOUNGS_MODULI),
                "the tabulated modulus")

# (activity, lowest Hz, highest Hz, source)
ACTIVITY_BANDS: tuple[tuple[str, float, float, str], ...] = (
    ("walking, pacing rate", 1.7, 2.4, "Eurocode serviceability guidance for footbridges"),
    ("walking, first-harmonic band", 1.5, 2.5, "Eurocode serviceability guidance for footbridges"),
    ("running", 2.0, 3.5, "Bachmann & Ammann, Vibrations in Structures (from memory)"),
    ("jumping", 1.8, 3.4, "Bachmann & Ammann, Vibrations in Structures (from memory)"),
    ("footbridge vertical, maximum risk", 1.7, 2.1, "Setra footbridge guide, 2006 (from memory)"),
    ("footbridge lateral, maximum risk", 0.5, 1.1, "Setra footbridge guide, 2006 (from memory)"),
    ("footbridge vertical, critical range", 1.25, 2.3, "HiVoSS footbridge design guide (from memory)"),
    ("footbridge lateral, critical range", 0.5, 1.2, "HiVoSS footbridge design guide (from memory)"),
    ("comfort check needed below, vertical", 5.0, 5.0, "EN 1990 Annex A2, A2.4.3.2 (from memory)"),
    ("comfort check needed below, lateral", 2.5, 2.5, "EN 1990 Annex A2, A2.4.3.2 (from memory)"),
)
"""Frequency bands of human activity and footbridge risk ranges, Hz."""


def _band_rows() -> tuple[Row, ...]:
    rows = []
    for activity, low, high, source in ACTIVITY_BANDS:
        centre = (low + high) / 2.0
        note = f"{low:g} Hz" if low == high else f"{low:g} to {high:g} Hz"
        rows.append(Row(activity, f"{centre:.3g} Hz", note, source))
    return tuple(rows)


FREQUENCY_BANDS = Table("activity", "Walking, running and jumping frequencies", _band_rows(),
                        "the centre of the band")



BALANCE_GRADES = Table("balance", "Balance quality grades by machine type",
                       tuple(Row(machine, f"G {grade:g}", f"e Omega {grade:g} mm/s", source)
                             for machine, grade, source in TYPICAL_GRADES),
                       "the usual grade of that machine type (the next grade up or down may suit)")


def table_for(name: str, kind: str) -> Table | None:
    """The table that can fill a field of this name and kind, or None."""
    if name == "grade" and kind == "text":
        return BALANCE_GRADES
    if kind == "ratio" and "damping" in name:
        return DAMPING
    if kind == "modulus":
        return MODULUS
    if kind == "frequency":
        return FREQUENCY_BANDS
    return None


def choices_table(label: str, choices: tuple[str, ...]) -> Table:
    """A table listing the choices of a choice field, so one can be picked like a typical value."""
    return Table("choices", f"Choices for {label}", tuple(Row(c, c, "", "the check's choices") for c in choices),
                 "the choice")
