"""The one unit registry, safe parsing of typed quantities, and display formatting.

Every value a person types goes through :func:`read` (or :func:`parse`). The parser
never evaluates the text: the number is read with ``float()`` and the unit text is
checked against a small grammar before pint sees it, so nested powers, huge
exponents and overlong text are refused instead of computed.
"""

from __future__ import annotations

import functools
import math
import re
import tokenize
from dataclasses import dataclass

import numpy as np
import pint

from fieldmode.calc.framework.kinds import KINDS, MAX_QUANTITY_TEXT, Kind
from fieldmode.calc.physics.constants import STANDARD_GRAVITY

ureg: pint.UnitRegistry
try:
    ureg = pint.UnitRegistry(cache_folder=":auto:")
except OSError:  # no writable cache folder: build the registry in memory
    ureg = pint.UnitRegistry()
Q_ = ureg.Quantity
Quantity = pint.Quantity

MAX_TEXT = MAX_QUANTITY_TEXT
"""Longest text accepted in one field (characters)."""

MAX_MAGNITUDE = 1e15
"""Largest magnitude accepted, in the typed unit; beyond it nothing physical is meant."""
MIN_MAGNITUDE = 1e-15
"""Smallest magnitude other than zero accepted, in the typed unit: below it a value is a slip
(and near 1e-308 it would underflow to zero and be computed as nothing)."""

_NUMBER = re.compile(r"^\s*([+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d{1,3})?)\s*(.*?)\s*$")
_UNIT_CHARS = re.compile(r"^[A-Za-z0-9_/*. %()^\-]*$")
_SUPERSCRIPTS = str.maketrans({"²": "^2", "³": "^3", "⁴": "^4", "·": "*", "×": "*", "µ": "u", "μ": "u"})
_UNIT_START = re.compile(r"^(?:1\s*/\s*)?[A-Za-z%(]")
_POWER = re.compile(r"(\*\*|\^)")
_ANGULAR = re.compile(r"\brad(ians?)?\b")
_MIL = re.compile(r"\bmils?\b")
"""The mil of machine amplitudes is 0.001 in (NIST SP 811, B.8); pint's own mil is an angle
(pi/32000 rad), so the word is rewritten as pint's thou before pint parses a unit."""
MIL_NOTE = "mil read as 0.001 in"
MIN_SI, MAX_SI = 1e-200, 1e200
"""Range of SI magnitudes (other than zero) the arithmetic can use without underflow or overflow."""
_MILLI_G = re.compile(r"\b(mg|milli-g|millig)\b")
"""Milli-g, 0.001 standard gravity, in an acceleration (pint alone would read mg as milligram)."""
MILLI_G_NOTE = "mg read as milli-g = 0.001 g, not milligram"
_DASHES = "\u2212\u2010\u2011\u2012\u2013\u2014\ufe63\uff0d"
"""Unicode minus signs and dashes that look like '-'."""
_SPACED_DIGITS = re.compile(r"\d[\s\u00a0\u2009\u202f\u2007\u2008']\d")
_ANGLES = ("radian", "revolution", "degree", "turn", "arcminute", "arcsecond", "gradian")

# Rotational speeds are cycles per time: pint's rpm is 2*pi rad/min, so they are
# rewritten before pint sees them (1450 rpm -> 24.17 Hz, not 151.8).
_CYCLIC_ALIASES = {
    "rpm": "1/min", "r/min": "1/min", "rev/min": "1/min", "cpm": "1/min",
    "cycles/min": "1/min", "cycle/min": "1/min", "c/min": "1/min",
    "rps": "1/s", "rev/s": "1/s", "r/s": "1/s", "cps": "1/s", "cycles/s": "1/s", "cycle/s": "1/s",
}
_COMMON_ALIASES = {"kips": "kip", "tonnes": "t", "tonne": "t", "sec": "s", "secs": "s", "hz": "Hz",
                   "khz": "kHz", "gal": "Gal", "KN": "kN", "Kn": "kN", "mm4": "mm^4", "cm4": "cm^4",
                   "in4": "in^4", "m4": "m^4", "plf": "lbf/ft", "klf": "kip/ft", "kgf": "kgf",
                   "Mpa": "MPa", "mpa": "MPa", "Gpa": "GPa", "gpa": "GPa", "kpa": "kPa",
                   "percent": "%", "pc": "%"}


class InputError(ValueError):
    """Text that cannot be read as the field asks; the message is fit to show a person."""

    def __init__(self, field: str, text: str, problem: str, example: str = "") -> None:
        shown = text if len(text) <= 40 else text[:37] + "..."
        message = f"{field}: {problem} (got {shown!r})"
        if example:
            message += f"; for example {example}"
        super().__init__(message)
        self.field = field
        self.text = text
        self.problem = problem


@dataclass(frozen=True)
class Reading:
    """A field's text read as a quantity of its kind, with what the reader assumed."""

    text: str
    quantity: pint.Quantity
    kind: str
    note: str = ""
    weight: str = ""
    """A weight typed where a mass is asked, in the unit typed ('26.00 kip'); '' for anything else."""

    @property
    def si(self) -> float:
        """Magnitude in the kind's SI unit."""
        return float(self.quantity.to(KINDS[self.kind].si).magnitude)


def read(text: str, kind: str, field: str = "", default_unit: str | None = None, *,
         bare_percent: bool = False) -> Reading:
    """Read ``text`` as a quantity of ``kind`` and say how it was read.

    A bare number takes ``default_unit`` (or the kind's SI unit). In a ratio field a bare
    number above 1 is flagged ("did you mean 5 %?"), or with ``bare_percent`` (damping
    fields) read as a percentage and said so. Raises :class:`InputError` for anything that
    is not a finite quantity of that kind.
    """
    spec = KINDS[kind]
    name = field or spec.label
    if not isinstance(text, str) or not text.strip():
        raise InputError(name, str(text or ""), "empty", spec.example)
    if len(text) > MAX_TEXT:
        raise InputError(name, text, f"longer than {MAX_TEXT} characters", spec.example)
    match = _NUMBER.match(text.translate(_SUPERSCRIPTS))
    if match is None:
        raise InputError(name, text, _unreadable(text, spec), spec.example)
    number_text, unit_text = match.groups()
    if unit_text[:1].isdigit() and not _UNIT_START.match(unit_text):  # '1 450 kg': digits grouped by a space
        raise InputError(name, text, _unreadable(text, spec), spec.example)
    magnitude = float(number_text)
    if not math.isfinite(magnitude) or not (magnitude == 0 or MIN_MAGNITUDE <= abs(magnitude) <= MAX_MAGNITUDE):
        raise InputError(name, text, f"number out of range (0, or {MIN_MAGNITUDE:g} to {MAX_MAGNITUDE:g} "
                         "in the unit typed)", spec.example)
    if not unit_text:
        unit_text = default_unit or spec.si
        plain = spec.ratio and not unit_text  # a ratio field whose bare number has no unit of its own
        if plain and bare_percent and magnitude > 1.0:
            return Reading(text, Q_(magnitude / 100.0, ""), kind, f"read as {magnitude:g} %")
        if plain and 1.0 < magnitude <= 100.0:
            return Reading(text, Q_(magnitude, ""), kind, f"did you mean {magnitude:g} %?")
    reading = _read_unit(text, name, magnitude, unit_text, spec)
    if spec.integer and not float(reading.quantity.to("").magnitude).is_integer():
        raise InputError(name, text, "expected a whole number", spec.example)
    return reading


def _shown(unit_text: str) -> str:
    """A unit text as an error message quotes it: at most 20 characters (the whole text is quoted after it)."""
    return unit_text if len(unit_text) <= 20 else unit_text[:17] + "..."


def _unreadable(text: str, spec: Kind) -> str:
    """Why ``text`` is not a number and a unit, with a hint for characters that only look right."""
    if any(dash in text for dash in _DASHES):
        return "a dash or Unicode minus is not a minus sign: type the ASCII '-'"
    if _SPACED_DIGITS.search(text):
        return "write the number without a space or separator between its digits (1450, not 1 450)"
    return f"expected a number and a unit of {spec.label}"


def read_any(text: str, kinds: tuple[str, ...], field: str = "", default_unit: str | None = None) -> Reading:
    """Read ``text`` as the first of ``kinds`` that fits it (a peak amplitude: a length, a velocity...).

    The reading's ``kind`` says which was read. When none fits, the error names every kind accepted.
    """
    errors = []
    for kind in kinds:
        try:
            return read(text, kind, field, default_unit)
        except InputError as error:
            errors.append(error)
    if len({error.problem for error in errors}) == 1:  # not about the kind: empty, out of range, unknown unit
        raise errors[0]
    labels = [KINDS[kind].label for kind in kinds]
    wanted = ", ".join(labels[:-1]) + " or " + labels[-1]
    raise InputError(field or labels[0], text, f"expected a {wanted}", example_of(kinds))


def example_of(kinds: tuple[str, ...]) -> str:
    """Example text for a field of these kinds: the kind's own example, or the first of each kind's."""
    if len(kinds) == 1:
        return KINDS[kinds[0]].example
    firsts = [match.group(0) for kind in kinds if (match := re.match(r"'[^']*'", KINDS[kind].example))]
    return ", ".join(firsts[:-1]) + " or " + firsts[-1]


def _read_unit(text: str, name: str, magnitude: float, unit_text: str, spec: Kind) -> Reading:
    """Attach ``unit_text`` to ``magnitude`` for a field of kind ``spec``."""
    if "," in unit_text:
        raise InputError(name, text, "a comma is ambiguous here: write 1450 or 1.45", spec.example)
    if unit_text.count("%") > 1:
        raise InputError(name, text, "write one % sign (5 % is 0.05)", spec.example)
    unit_text = _COMMON_ALIASES.get(unit_text, unit_text)
    note = ""
    if spec.name in ("frequency", "angular_frequency") and unit_text.lower() in _CYCLIC_ALIASES:
        unit_text = _CYCLIC_ALIASES[unit_text.lower()]
    if spec.name == "acceleration":
        if _MILLI_G.search(unit_text):
            note = MILLI_G_NOTE
        unit_text = re.sub(r"\b(g|G|gn)\b", "g0", _MILLI_G.sub("mg0", unit_text))
    units = _safe_units(text, name, unit_text, spec)
    if _has_angle(units) and spec.name not in ("angle", "frequency", "angular_frequency"):
        raise InputError(name, text, f"an angle is not a {spec.label}", spec.example)
    quantity = Q_(magnitude, units)
    angular = bool(_ANGULAR.search(unit_text))
    if spec.name == "frequency" and angular:
        quantity = Q_(magnitude / (2 * math.pi), "Hz") * _rad_free_factor(units)
        note = "read as angular frequency: f = omega / 2 pi"
    elif spec.name == "angular_frequency" and not angular and quantity.check("1/[time]"):
        quantity = Q_(2 * math.pi * quantity.to("Hz").magnitude, "rad/s")
        note = "read as cyclic frequency: omega = 2 pi f"
    if spec.name == "frequency" and not angular and _has_angle(units):
        raise InputError(name, text, "write a rotational speed as rpm, rev/s or Hz", spec.example)
    if quantity.check(spec.dimension):
        reading = Reading(text, quantity, spec.name, note or _pound_note(unit_text, spec) or _mil_note(unit_text))
    else:
        reading = _read_other_dimension(text, name, quantity, unit_text, spec)
    if magnitude != 0 and not MIN_SI <= abs(reading.si) <= MAX_SI:
        raise InputError(name, text, "number out of range once in SI units", spec.example)
    return reading


def _read_other_dimension(text: str, name: str, quantity: pint.Quantity, unit_text: str,
                          spec: Kind) -> Reading:
    """Accept a weight where a mass is asked, or lb meant as lbf; refuse the rest."""
    if spec.weight_of and quantity.check(spec.weight_of):
        mass = (quantity / Q_(STANDARD_GRAVITY, "m/s^2")).to(spec.si)
        as_mass = format_value(float(mass.magnitude), spec.name)
        return Reading(text, mass, spec.name, f"read as weight: m = W/g0 = {as_mass}",
                       weight=f"{format_number(float(quantity.magnitude))} {unit_text}")
    if re.search(r"\blb\b", unit_text):
        swapped = re.sub(r"\blb\b", "lbf", unit_text)
        units = _safe_units(text, name, swapped, spec)
        as_force = Q_(quantity.magnitude, units)
        if as_force.check(spec.dimension):
            return Reading(text, as_force, spec.name, "lb read as lbf (pound-force)")
    raise InputError(name, text, f"{_shown(unit_text)!r} is not a unit of {spec.label}", spec.example)


def _pound_note(unit_text: str, spec: Kind) -> str:
    """Say how ambiguous US mass units were read."""
    if spec.name.startswith("mass") and re.search(r"\blb\b", unit_text):
        return "lb read as pound-mass (write lbf for a weight)"
    if re.search(r"\btons?\b", unit_text):
        return "ton read as US short ton, 907.2 kg (write t for a tonne)"
    return ""


def _mil_note(unit_text: str) -> str:
    """Say that a mil was read as a length."""
    return MIL_NOTE if _MIL.search(unit_text) else ""


def _has_angle(units: pint.Unit) -> bool:
    return any(part in _ANGLES for part in units._units)


def _rad_free_factor(units: pint.Unit) -> pint.Quantity:
    """Scale of ``units`` with its angle removed, relative to 1/s (e.g. rad/min -> 1/60)."""
    plain = {k: v for k, v in units._units.items() if k != "radian"}
    factor = Q_(1, ureg.Unit(pint.util.UnitsContainer(plain)))
    return Q_(factor.to("1/s").magnitude, "")


def _safe_units(text: str, name: str, unit_text: str, spec: Kind) -> pint.Unit:
    """Parse a unit expression after refusing anything that could make pint work hard."""
    if not unit_text:
        return ureg.dimensionless
    if not _UNIT_CHARS.match(unit_text) or not _UNIT_START.match(unit_text):
        raise InputError(name, text, "unexpected characters in the unit", spec.example)
    if re.search(r"(\*\*|\^)\s*-?\d+\s*(\*\*|\^)", unit_text):
        raise InputError(name, text, "a power of a power is not a unit", spec.example)
    pieces = _POWER.split(unit_text)
    for index in range(2, len(pieces), 2):
        if not re.match(r"^-?[1-4](?![0-9])", pieces[index]):
            raise InputError(name, text, "only small whole powers (m^2 ... m^4) are allowed", spec.example)
    if len(pieces) > 9:
        raise InputError(name, text, "too many powers in the unit", spec.example)
    cleaned = _MIL.sub("thou", _POWER.sub("**", unit_text))
    try:
        return ureg.parse_units(cleaned)
    except (pint.errors.PintError, AttributeError, TypeError, ValueError, SyntaxError,
            KeyError, IndexError, ZeroDivisionError, AssertionError, tokenize.TokenError) as error:
        raise InputError(name, text, f"unknown unit {_shown(unit_text)!r}", spec.example) from error


def format_number(value: float, digits: int = 4) -> str:
    """Format ``value`` to ``digits`` significant figures, without exponent where readable."""
    if value == 0 or not math.isfinite(value):
        return f"{value:g}"
    exponent = math.floor(math.log10(abs(value)))
    if abs(round(value, digits - 1 - exponent)) >= 10.0 ** (exponent + 1):
        exponent += 1  # rounding carried into the next decade: 0.099999 -> 0.1000
    if -4 <= exponent < 6:
        decimals = max(0, digits - 1 - exponent)
        rounded = round(value, decimals)
        return f"{rounded:.{decimals}f}"
    return f"{value:.{digits - 1}e}"


@functools.lru_cache(maxsize=256)
def unit_factor(unit: str, kind: str) -> float:
    """Magnitude in ``unit`` of one SI unit of ``kind`` (e.g. 1000 for 'mm' of a length)."""
    return float(Q_(1.0, KINDS[kind].si).to(unit).magnitude)


def display_unit(si: float | np.ndarray, kind: str, system: str = "si") -> str:
    """The display unit of ``kind`` in ``system`` ("si" or "us") for an SI magnitude (or array).

    The first unit of the kind's list in which the largest finite value is at least 1.
    """
    choices = KINDS[kind].display[system]
    magnitudes = np.abs(np.ravel(np.asarray(si, dtype=float)))
    finite = magnitudes[np.isfinite(magnitudes)]
    magnitude = float(finite.max()) if finite.size else 0.0
    for unit in choices:
        if magnitude * unit_factor(unit, kind) >= 0.9999:
            return unit
    return choices[-1]


def unit_name(unit: str, kind: str) -> str:
    """How a display unit is written for people, e.g. 'g0' -> 'g', 'kN*s/m' -> 'kN s/m'."""
    return KINDS[kind].names.get(unit, unit)


def format_value(si: float | np.ndarray, kind: str, system: str = "si", digits: int = 4) -> str:
    """An SI magnitude of ``kind`` in the engineering unit of ``system``, e.g. '24.17 Hz'.

    An array is shown as a comma list in one unit chosen by its largest value, e.g.
    '0.51, 0.20, 0.14 s'; a two-dimensional array as rows separated by '; '.
    """
    unit = display_unit(si, kind, system)
    magnitude = np.asarray(si, dtype=float) * unit_factor(unit, kind)
    rows = magnitude if magnitude.ndim == 2 else [magnitude]

    def one(v: float) -> str:
        return f"{v:.0f}" if KINDS[kind].integer else format_number(v, digits)

    texts = (", ".join(one(float(v)) for v in np.ravel(row)) for row in rows)
    return "; ".join(f"{text} {unit_name(unit, kind)}".rstrip() for text in texts)


def convert(text: str, target: str | None = None) -> tuple[pint.Quantity, str]:
    """Convert typed text to ``target`` (or to SI), with the cyclic-frequency and g traps handled.

    Returns the converted quantity and a note of how the text was read.
    """
    kind = kind_of_text(text)
    reading = read(text, kind, "value")
    if target is None:
        return reading.quantity.to(KINDS[kind].si), reading.note
    target_kind = kind
    if kind in ("frequency", "angular_frequency"):
        target_kind = "angular_frequency" if _ANGULAR.search(target) else "frequency"
        reading = read(text, target_kind, "value")
        target = _CYCLIC_ALIASES.get(target.lower(), target) if target_kind == "frequency" else target
        if target in ("1/min",):
            return Q_(reading.quantity.to("1/min").magnitude, "1/min"), reading.note
    units = _safe_units(target, "target unit", target, KINDS[target_kind])
    if KINDS[target_kind].name == "mass" and Q_(1, units).check("[force]"):
        return (reading.quantity * Q_(STANDARD_GRAVITY, "m/s^2")).to(units), "mass shown as its weight"
    try:
        return reading.quantity.to(units), reading.note
    except pint.errors.DimensionalityError as error:
        raise InputError("target unit", target, f"cannot express {KINDS[kind].label} in {target}",
                         KINDS[kind].example) from error


def kind_of_text(text: str) -> str:
    """Guess the physical kind of free text such as '45 kip/in' (for the convert command)."""
    match = _NUMBER.match(text.translate(_SUPERSCRIPTS)) if len(text) <= MAX_TEXT else None
    if match is None:
        raise InputError("value", text, "expected a number and a unit", "'1450 rpm' or '45 kip/in'")
    unit_text = _COMMON_ALIASES.get(match.group(2), match.group(2))
    if unit_text.lower() in _CYCLIC_ALIASES:
        return "frequency"
    if re.search(r"\b(g|G|gn)\b", unit_text) or _MILLI_G.search(unit_text):
        return "acceleration"
    if _ANGULAR.search(unit_text) and "/" in unit_text:
        return "angular_frequency"
    probe = KINDS["ratio"]
    units = _safe_units(text, "value", unit_text or "1", probe)
    for kind in KINDS.values():
        if Q_(1, units).check(kind.dimension) and not kind.ratio:
            return kind.name
    if Q_(1, units).check(""):
        return "ratio"
    raise InputError("value", text, f"no conversion known for {_shown(unit_text)!r}", "'1450 rpm' or '45 kip/in'")
