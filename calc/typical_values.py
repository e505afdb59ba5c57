"""Tables of typical values, with their published sources, that can fill a field (the F7 key).

Each :class:`Table` lists rows of a description, the text that fills the field, a note (the range or
the raw tabulated value) and the source; values that could not be checked against a copy of the
publication carry "(from memory)" in their source. :func:`table_for` picks the table from what the
field means (its :class:`~fieldmode.calc.framework.meaning.Meaning`) and the check it is in: a floor's
damping is offered floor values, a machine's operating frequency motor speeds, a building's damping in
the seismic checks the Newmark & Hall ranges. Values the checks also use (the walking band, the
footbridge and floor damping) come from the physics modules, so F7 and the checks quote the same numbers.
"""

from __future__ import annotations

from dataclasses import dataclass
from typing import TYPE_CHECKING

from fieldmode.calc.framework.meaning import BUILDING, DAMPING_RATIO, MACHINE, MOUNTS, STRUCTURE
from fieldmode.calc.physics import floor_walking, footbridge, footfall
from fieldmode.calc.physics.machine import TYPICAL_GRADES
from fieldmode.calc.physics.sdof import damping_ratio_from_log_decrement

if TYPE_CHECKING:
    from fieldmode.calc.framework.spec import Field

FROM_MEMORY = "(from memory)"


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
    notes: tuple[str, ...] = ()
    """What the source says beside its table (factors, which values are indicative)."""


def _percent(ratio: float) -> str:
    return f"{100.0 * ratio:.3g} %"


# Floors ---------------------------------------------------------------------------------------------

_ALLEN_MURRAY = f"{floor_walking.ALLEN_MURRAY} (confirmed in a secondary table)"
_SCI_P354_DAMPING = f"SCI P354, Design of Floors for Vibration, damping by fit-out {FROM_MEMORY}"

SCI_P354_FLOOR_DAMPING: tuple[tuple[str, float], ...] = (
    ("bare, little furniture", 0.011),
    ("fitted out and furnished, in use", 0.03),
    ("finishes, partitions across the mode", 0.045),
)
"""Floor damping ratios by fit-out, SCI P354 (from memory)."""


FLOOR_WORDS = {"bare": "bare: few ceilings or ducts", "fitted out": "fitted out: offices, homes, churches",
               "full-height partitions": "full-height partitions", "mall": "shopping malls"}
"""Short descriptions of the Allen & Murray floor classes of :data:`floor_walking.FLOOR_DAMPING` for the table."""


def _floor_rows() -> tuple[Row, ...]:
    rows = [Row(f"floor, {FLOOR_WORDS.get(name, what)}", _percent(ratio), f"{100 * ratio:g} %, Allen & Murray",
                f"{_ALLEN_MURRAY}: {what}")
            for name, (ratio, what) in floor_walking.FLOOR_DAMPING.items() if name != "footbridge"]
    rows += [Row(f"floor, {what}", _percent(ratio), f"{100 * ratio:g} %, SCI P354", _SCI_P354_DAMPING)
             for what, ratio in SCI_P354_FLOOR_DAMPING]
    return tuple(sorted(rows, key=lambda row: float(row.fill.split()[0])))


FLOOR_DAMPING = Table("floor-damping", "Damping ratio of floors, bare to fitted out", _floor_rows(),
                      "the tabulated ratio")

# Footbridges ----------------------------------------------------------------------------------------

_ISO_10137 = f"{footbridge.MATERIAL_DAMPING_SOURCE} (confirmed in a secondary table)"
_GUIDES = f"Setra 2006 and HiVoSS footbridge guides, damping by deck {FROM_MEMORY}"
_DG11_BRIDGE = "AISC Design Guide 11 (2nd ed.) ch. 4, pedestrian bridges (confirmed in an extract)"

FOOTBRIDGE_GUIDE_DAMPING: tuple[tuple[str, float, float], ...] = (
    ("steel", 0.002, 0.004),
    ("steel-concrete composite", 0.003, 0.006),
    ("prestressed concrete", 0.005, 0.010),
    ("reinforced concrete", 0.008, 0.013),
    ("timber", 0.015, 0.030),
)
"""Footbridge damping ratio by deck construction, minimum and mean (footbridge guides, from memory)."""


def _footbridge_rows() -> tuple[Row, ...]:
    rows = [Row(f"footbridge, {deck}, service loads", _percent(ratio), f"{100 * ratio:g} %", _ISO_10137)
            for deck, ratio in footbridge.MATERIAL_DAMPING.items()]
    rows += [Row(f"footbridge deck, {deck}: minimum", _percent(low), f"min {100 * low:g}, mean {100 * mean:g} %",
                 _GUIDES) for deck, low, mean in FOOTBRIDGE_GUIDE_DAMPING]
    bare = floor_walking.FLOOR_DAMPING["footbridge"][0]
    rows.append(Row("pedestrian bridge, bare framing", _percent(bare), f"{100 * bare:g} %", _DG11_BRIDGE))
    return tuple(rows)


FOOTBRIDGE_DAMPING = Table("footbridge-damping", "Damping ratio of footbridges by construction", _footbridge_rows(),
                           "the tabulated ratio (the minimum where a range is given)",
                           ("Comfort checks take the lower values: less damping, more response.",))

# Mounts ---------------------------------------------------------------------------------------------

_MOUNTS = f"Vibration isolation practice, e.g. Harris' Shock and Vibration Handbook {FROM_MEMORY}"

MOUNT_DAMPING: tuple[tuple[str, float, float], ...] = (
    ("steel springs, no damper", 0.005, 0.01),
    ("steel springs with viscous dampers", 0.02, 0.10),
    ("natural rubber mounts", 0.02, 0.05),
    ("neoprene (chloroprene) mounts", 0.05, 0.08),
    ("cork or fibreglass pads", 0.05, 0.10),
)
"""Damping ratio of resilient mounts, lowest and highest (from memory)."""

MOUNTS_TABLE = Table("mount-damping", "Damping ratio of isolation mounts",
                     tuple(Row(kind, _percent(low), f"{100 * low:g} to {100 * high:g} %", _MOUNTS)
                           for kind, low, high in MOUNT_DAMPING),
                     "the lowest ratio (the larger peak at run-up)",
                     ("Elastomer damping varies with temperature, frequency and amplitude: ask the maker.",))

# Buildings: seismic ---------------------------------------------------------------------------------

_NEWMARK_HALL = f"Newmark & Hall, as tabulated in Chopra, Dynamics of Structures, Table 11.2.1 {FROM_MEMORY}"
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

EN1998_REFERENCE_DAMPING = 0.05
"""The damping of EN 1998-1's elastic spectrum: eta = sqrt(10 / (5 + xi)) is 1 at xi = 5 %."""
_EN1998 = "EN 1998-1:2004 3.2.2.2, eta = 1 at 5 % (confirmed)"


def _newmark_hall_rows() -> list[Row]:
    return [Row(f"{level}: {construction}", f"{low:g} %", f"{low:g} to {high:g} %", _NEWMARK_HALL)
            for level, construction, low, high in NEWMARK_HALL_DAMPING]


SEISMIC_DAMPING = Table(
    "seismic-damping", "Damping ratio of buildings, seismic (Newmark & Hall)",
    (Row("EN 1998-1 elastic spectrum, reference", _percent(EN1998_REFERENCE_DAMPING), "5 %, eta = 1", _EN1998),
     *_newmark_hall_rows()),
    "the lowest ratio of the range",
    ("Near yield applies to the design earthquake; working stress to smaller ones.",))

# Structures: wind (EN 1991-1-4 Table F.2) -----------------------------------------------------------

_EN_F2 = "EN 1991-1-4:2005 Annex F, Table F.2 (confirmed in a copy)"
_EN_F2_MEMORY = f"EN 1991-1-4:2005 Annex F, Table F.2 {FROM_MEMORY}"
CABLE_STAYED_FACTOR = 0.75
"""EN 1991-1-4 Table F.2 note: for cable-stayed bridges the bridge values are multiplied by 0.75."""

# (structure, lowest log decrement, highest (the same when one value), source, bridge)
EN1991_LOG_DECREMENTS: tuple[tuple[str, float, float, str, bool], ...] = (
    ("reinforced concrete buildings", 0.10, 0.10, _EN_F2, False),
    ("steel buildings", 0.05, 0.05, _EN_F2, False),
    ("mixed structures, concrete + steel", 0.08, 0.08, _EN_F2, False),
    ("reinforced concrete towers and chimneys", 0.03, 0.03, _EN_F2, False),
    ("unlined welded steel stacks, no external insulation", 0.012, 0.012, _EN_F2, False),
    ("unlined welded steel stacks, external insulation", 0.020, 0.020, _EN_F2, False),
    ("steel stack, one liner, insulated, h/b < 18", 0.020, 0.020, _EN_F2_MEMORY, False),
    ("steel stack, one liner, insulated, 20 <= h/b < 24", 0.040, 0.040, _EN_F2_MEMORY, False),
    ("steel stack, one liner, insulated, h/b >= 26", 0.014, 0.014, _EN_F2_MEMORY, False),
    ("steel stack, 2+ liners, insulated, h/b < 18", 0.020, 0.020, _EN_F2_MEMORY, False),
    ("steel stack, 2+ liners, insulated, 20 <= h/b < 24", 0.040, 0.040, _EN_F2_MEMORY, False),
    ("steel stack, 2+ liners, insulated, h/b >= 26", 0.025, 0.025, _EN_F2_MEMORY, False),
    ("steel stack with internal brick liner", 0.070, 0.070, _EN_F2_MEMORY, False),
    ("steel stack with internal gunite", 0.030, 0.030, _EN_F2_MEMORY, False),
    ("coupled stacks without liner", 0.015, 0.015, _EN_F2_MEMORY, False),
    ("guyed steel stack without liner", 0.04, 0.04, _EN_F2_MEMORY, False),
    ("steel bridges and lattice towers, welded", 0.02, 0.02, _EN_F2, True),
    ("steel bridges and lattice towers, high-resistance bolts", 0.03, 0.03, _EN_F2, True),
    ("steel bridges and lattice towers, ordinary bolts", 0.05, 0.05, _EN_F2, True),
    ("composite bridges", 0.04, 0.04, _EN_F2, True),
    ("prestressed concrete bridges without cracks", 0.04, 0.04, _EN_F2, True),
    ("concrete bridges with cracks", 0.10, 0.10, _EN_F2, True),
    ("timber bridges (indicative)", 0.06, 0.12, _EN_F2, True),
    ("aluminium alloy bridges", 0.02, 0.02, _EN_F2, True),
    ("glass or fibre reinforced plastic bridges (indicative)", 0.04, 0.08, _EN_F2, True),
    ("cables, parallel", 0.006, 0.006, _EN_F2, False),
    ("cables, spiral", 0.020, 0.020, _EN_F2, False),
)
"""Structural damping as a logarithmic decrement delta_s, by structure type (a range where the table gives one)."""

WIND_NOTES = (
    "Timber and plastic values are indicative (Table F.2 note).",
    f"Cable-stayed bridges: multiply the bridge values by {CABLE_STAYED_FACTOR:g} (Table F.2 note).",
    "Filled as zeta = delta / sqrt(4 pi^2 + delta^2), the lowest where a range is given.",
)


def _wind_rows() -> list[Row]:
    rows = []
    for structure, low, high, source, bridge in EN1991_LOG_DECREMENTS:
        note = f"log dec. {low:g}" if low == high else f"log dec. {low:g}-{high:g}"
        if bridge:
            note += f", x{CABLE_STAYED_FACTOR:g} cable-stayed"
        rows.append(Row(structure, _percent(damping_ratio_from_log_decrement(low)), note, source))
    return rows


WIND_DAMPING = Table("wind-damping", "Structural damping for wind, EN 1991-1-4 Table F.2", tuple(_wind_rows()),
                     "the ratio of the log decrement", WIND_NOTES)


def _structure_rows() -> tuple[Row, ...]:
    return (*FLOOR_DAMPING.rows, *FOOTBRIDGE_DAMPING.rows,
            *(Row(f"wind: {row.description}", row.fill, row.note, row.source) for row in WIND_DAMPING.rows),
            *(Row(f"seismic, {row.description}", row.fill, row.note, row.source) for row in _newmark_hall_rows()))


STRUCTURE_DAMPING = Table("structure-damping", "Damping ratio: floors, footbridges, wind, seismic", _structure_rows(),
                          "the tabulated ratio (the lowest of a range)",
                          ("Floors and footbridges first: far below the seismic values at the end.", *WIND_NOTES[:2]))

# Moduli ---------------------------------------------------------------------------------------------

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

# Machines -------------------------------------------------------------------------------------------

SUPPLY_FREQUENCIES = (50.0, 60.0)
"""Mains frequencies, Hz."""
POLES = (2, 4, 6, 8, 10, 12)
"""Pole counts of common induction motors."""
USUAL_SLIP = 0.03
"""Slip of an induction motor at full load, as a fraction of its synchronous speed: about 1-5 % (3 % taken;
large motors slip less)."""
_SYNCHRONOUS = "Synchronous speed 120 f / p, electrical machine theory (Common practice); slip 1-5 % " + FROM_MEMORY


def synchronous_speed(supply: float, poles: int) -> float:
    """Synchronous speed (r/min) of a motor with ``poles`` poles on a supply of ``supply`` Hz: 120 f / p."""
    return 120.0 * supply / poles


def _motor_rows() -> tuple[Row, ...]:
    rows = []
    for supply in SUPPLY_FREQUENCIES:
        for poles in POLES:
            synchronous = synchronous_speed(supply, poles)
            running = 5.0 * round(synchronous * (1.0 - USUAL_SLIP) / 5.0)
            rows.append(Row(f"{poles}-pole motor, {supply:g} Hz supply", f"{running:.0f} rpm",
                            f"sync {synchronous:.0f} rpm", _SYNCHRONOUS))
    return tuple(rows)


MOTOR_SPEEDS = Table("motor-speeds", "Motor speeds, 50 and 60 Hz supply", _motor_rows(),
                     f"the speed at full load ({100 * USUAL_SLIP:g} % slip, to 5 rpm)",
                     ("Induction motors run 1-5 % below synchronous speed, synchronous motors at it;",
                      "on a frequency converter, at the speed set."))

# Walking and footbridge frequencies ----------------------------------------------------------------

_FIRST_BANDS = tuple(b for b in footfall.BANDS if b.level == "warning")


def _band_rows() -> tuple[Row, ...]:
    rows = []
    for band in _FIRST_BANDS:
        centre = (band.low + band.high) / 2.0
        described = band.name if band.direction in band.name else f"{band.name}, {band.direction}"
        rows.append(Row(described, f"{centre:.3g} Hz", f"{band.low:g} to {band.high:g} Hz", band.source))
    rows.append(Row("footbridge, vertical: comfort check below", f"{footfall.FOOTBRIDGE_VERTICAL_LIMIT:g} Hz",
                    f"{footfall.FOOTBRIDGE_VERTICAL_LIMIT:g} Hz", footfall.EN1990))
    rows.append(Row("footbridge, lateral: comfort check below", f"{footfall.FOOTBRIDGE_LATERAL_LIMIT:g} Hz",
                    f"{footfall.FOOTBRIDGE_LATERAL_LIMIT:g} Hz", footfall.EN1990))
    for guide, limit, source in footfall.LOW_FREQUENCY_LIMITS:
        rows.append(Row(f"floor: low-frequency limit, {guide}", f"{limit:g} Hz", f"{limit:g} Hz", source))
    return tuple(rows)


FREQUENCY_BANDS = Table("activity", "Walking, running, jumping; footbridge ranges", _band_rows(),
                        "the centre of the band",
                        ("Harmonic h of an activity covers h times its range (footfall lists them).",))


def _pacing(edge: int) -> Table:
    low, high = footfall.WALKING
    rate = footfall.WALKING[edge]
    word = ("slowest", "fastest")[edge]
    return Table(f"pacing-{word}", "Walking pacing rate",
                 (Row("walking, pacing rate", f"{rate:g} Hz", f"{low:g} to {high:g} Hz", footfall.WALKING_SOURCE),),
                 f"the {word} rate of the band")


BALANCE_GRADES = Table("balance", "Balance quality grades by machine type",
                       tuple(Row(machine, f"G {grade:g}", f"e Omega {grade:g} mm/s", source)
                             for machine, grade, source in TYPICAL_GRADES),
                       "the usual grade of that machine type (the next grade up or down may suit)")

PACING_SLOWEST = _pacing(0)
PACING_FASTEST = _pacing(1)

STRUCTURE_CHECKS: dict[str, Table] = {"floor": FLOOR_DAMPING, "footbridge": FOOTBRIDGE_DAMPING}
"""Checks whose structure is known: their damping field gets that structure's table."""
PACING_FIELDS: dict[str, Table] = {"pacing_low": PACING_SLOWEST, "pacing_high": PACING_FASTEST}
BAND_CHECKS = ("footfall", "footbridge")
"""Checks whose frequency fields without a meaning (higher and lateral frequencies) are a structure's."""
STRUCTURE_FREQUENCY_FIELDS = ("higher_frequencies", "lateral_frequency")


def table_for(field: Field, check_id: str) -> Table | None:
    """The table that can fill ``field`` of check ``check_id``, chosen by what the field means, or None."""
    meaning = field.meaning
    if field.name == "grade" and field.kind == "text":
        return BALANCE_GRADES
    if field.kind == "ratio" and meaning is not None and meaning.quantity == DAMPING_RATIO:
        if meaning.of == MOUNTS:
            return MOUNTS_TABLE
        if meaning.of == BUILDING:
            return SEISMIC_DAMPING
        if meaning.of == STRUCTURE:
            return STRUCTURE_CHECKS.get(check_id, STRUCTURE_DAMPING)
        return None
    if field.kind == "modulus":
        return MODULUS
    if field.kind == "frequency":
        if meaning is not None and meaning.of == MACHINE:
            return MOTOR_SPEEDS
        if meaning is not None and meaning.of == STRUCTURE:
            return FREQUENCY_BANDS
        if check_id in BAND_CHECKS and field.name in STRUCTURE_FREQUENCY_FIELDS:
            return FREQUENCY_BANDS
        if check_id == "floor":
            return PACING_FIELDS.get(field.name)
    return None


def choices_table(label: str, choices: tuple[str, ...]) -> Table:
    """A table listing the choices of a choice field, so one can be picked like a typical value."""
    return Table("choices", f"Choices for {label}", tuple(Row(c, c, "", "the check's choices") for c in choices),
                 "the choice")
