"""Reading a check's typed texts: every field read by the unit reader, and :class:`Inputs`.

A compute function gets :class:`Inputs`: the fields read and in SI, with bounds checks that
raise an :class:`~fieldmode.calc.framework.units.InputError` naming the field.
"""

from __future__ import annotations

import math
import re
from collections.abc import Mapping

import numpy as np

from fieldmode.calc.framework.kinds import KINDS, MAX_LIST_TEXT, MAX_PATH_TEXT
from fieldmode.calc.framework.meaning import DAMPING_RATIO
from fieldmode.calc.framework.result import Flag, InputFile, Reference, Result, TypedInput, Value
from fieldmode.calc.framework.spec import SIGNAL, CheckSpec, Field
from fieldmode.calc.framework.units import InputError, Reading, example_of, format_value, read, read_any

MAX_LIST_ITEMS = 200
"""Most items accepted in a list field."""
_BARE_NUMBER = re.compile(r"^[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?$")
SYSTEMS = ("si", "us")
"""Unit systems: SI and US customary."""


def read_inputs(spec: CheckSpec, texts: Mapping[str, str],
                system: str = "si") -> tuple[Inputs, dict[str, InputError]]:
    """Read every field of ``spec``; return what was read and the errors by field name.

    ``system`` is the unit system in use ("si" or "us"), kept in :attr:`Inputs.system`.
    """
    if system not in SYSTEMS:
        raise ValueError(f"unit system {system!r} is not one of {SYSTEMS}")
    readings: dict[str, Reading | tuple[Reading, ...] | str] = {}
    errors: dict[str, InputError] = {}
    unused = spec.unused(texts)
    ignored: dict[str, str] = {}
    for spec_field in spec.fields:
        text = (texts.get(spec_field.name) or "").strip()
        if not text:
            continue
        if spec_field.name in unused:
            ignored[spec_field.name] = unused[spec_field.name]
            continue
        try:
            readings[spec_field.name] = read_field(spec_field, text)
        except InputError as error:
            errors[spec_field.name] = error
    _check_groups(spec, readings, errors, unused)
    return Inputs(spec, readings, dict(texts), system, ignored), errors


def _check_groups(spec: CheckSpec, readings: Mapping[str, object], errors: dict[str, InputError],
                  unused: Mapping[str, str]) -> None:
    """Errors for required fields left empty and for groups of alternatives given twice or not at all;
    fields the choices leave unused are neither required nor alternatives."""
    groups: dict[str, list[Field]] = {}
    for spec_field in spec.fields:
        if spec_field.name in unused:
            continue
        if spec_field.group:
            groups.setdefault(spec_field.group, []).append(spec_field)
        elif spec_field.required and spec_field.name not in readings and spec_field.name not in errors:
            errors[spec_field.name] = InputError(spec_field.label, "", "required", _example(spec_field))
    for members in groups.values():
        given = [f for f in members if f.name in readings or f.name in errors]
        names = " or ".join(f.label.lower() for f in members)
        if not given and any(f.required for f in members):
            errors[members[0].name] = InputError(members[0].label, "", f"give {names}",
                                                 _example(members[0]))
        elif len(given) > 1:
            errors[given[-1].name] = InputError(given[-1].label, "", f"give only one of {names}")




def _example(spec_field: Field) -> str:
    if spec_field.kind == "choice":
        return " | ".join(spec_field.choices)
    if spec_field.kind == "path":
        return f"{spec_field.default!r}" if spec_field.default else "'record.csv'"
    if spec_field.kind == "text":
        return ""
    return example_of((spec_field.kind, *spec_field.other_kinds))


def read_field(spec_field: Field, text: str) -> Reading | tuple[Reading, ...] | str:
    """Read one field's text: a choice, a path, a list or a single quantity."""
    if spec_field.kind == "choice":
        return _read_choice(spec_field, text)
    if spec_field.kind == "path":
        if len(text) > MAX_PATH_TEXT or "\0" in text:
            raise InputError(spec_field.label, text, "not a usable path", _example(spec_field))
        return text
    if spec_field.kind == "text":
        if len(text) > MAX_LIST_TEXT or not text.isprintable():
            raise InputError(spec_field.label, text, "not usable text")
        return text
    if spec_field.many:
        return _read_list(spec_field, text)
    return _read_quantity(spec_field, text, spec_field.label, spec_field.unit)


def _read_quantity(spec_field: Field, text: str, label: str, unit: str | None) -> Reading:
    """One quantity of the field's kind (or of one of its other kinds); a damping field reads a bare
    number above 1 as a percentage."""
    if spec_field.other_kinds:
        return read_any(text, (spec_field.kind, *spec_field.other_kinds), label, unit)
    damping = spec_field.meaning is not None and spec_field.meaning.quantity == DAMPING_RATIO
    return read(text, spec_field.kind, label, unit, bare_percent=damping)


def _read_choice(spec_field: Field, text: str) -> str:
    picked = spec_field.chosen(text)
    if picked:
        return picked
    raise InputError(spec_field.label, text, "not one of the choices", " | ".join(spec_field.choices))


def _read_list(spec_field: Field, text: str) -> tuple[Reading, ...]:
    """Read 'a unit, b unit, c unit'; bare items take the unit of the last item that has one."""
    if len(text) > MAX_LIST_TEXT:
        raise InputError(spec_field.label, text, f"longer than {MAX_LIST_TEXT} characters")
    items = [part for item in re.split(r"[,;]", text) for part in _split_bare_numbers(item.strip())]
    if len(items) > MAX_LIST_ITEMS:
        raise InputError(spec_field.label, text, f"more than {MAX_LIST_ITEMS} values")
    if any(not item for item in items):
        raise InputError(spec_field.label, text, "empty item in the list",
                         "'220 t, 210 t, 180 t'")
    units = [re.sub(r"^[+-]?[\d.]+(?:[eE][+-]?\d+)?\s*", "", item) for item in items]
    last_unit = next((u for u in reversed(units) if u), None) or spec_field.unit
    label = spec_field.label
    return tuple(_read_quantity(spec_field, item, f"{label} #{i + 1}", last_unit)
                 for i, item in enumerate(items))


def _split_bare_numbers(item: str) -> list[str]:
    """'5 10 Hz' -> ['5', '10 Hz']: numbers separated by blanks are items too; others stay whole."""
    words = item.split()
    numbers = [bool(_BARE_NUMBER.match(word)) for word in words]
    if len(words) < 2 or not all(numbers[:-1]) or sum(numbers) < 2:
        return [item]
    if not numbers[-1]:
        return words[:-2] + [f"{words[-2]} {words[-1]}"]
    return words


class Inputs:
    """The fields of one check, read and in SI, handed to its compute function."""

    def __init__(self, spec: CheckSpec, readings: Mapping[str, Reading | tuple[Reading, ...] | str],
                 texts: Mapping[str, str], system: str = "si", ignored: Mapping[str, str] | None = None) -> None:
        self.spec = spec
        self.system = system
        """The unit system in use, "si" or "us" (values are SI whatever it is)."""
        self.ignored = dict(ignored or {})
        """Fields given a text that the choices do not use: name -> why (:meth:`CheckSpec.unused`)."""
        self._readings = dict(readings)
        self._texts = dict(texts)

    def has(self, name: str) -> bool:
        return name in self._readings

    def reading(self, name: str) -> Reading | tuple[Reading, ...] | str:
        """How field ``name`` was read: a quantity, a list of them, or a choice or path as text."""
        return self._readings[name]

    def value(self, name: str, *, positive: bool = False, minimum: float | None = None,
              maximum: float | None = None) -> float:
        """SI magnitude of a single-quantity field, checked against the bounds given."""
        reading = self._readings[name]
        assert isinstance(reading, Reading), name
        magnitude = reading.si
        self._bound(name, reading.text, magnitude, positive, minimum, maximum)
        return magnitude

    def optional(self, name: str, default: float | None = None, **bounds: float | bool | None) -> float | None:
        """Like :meth:`value`, or ``default`` when the field is empty."""
        return self.value(name, **bounds) if self.has(name) else default  # type: ignore[arg-type]

    def array(self, name: str, *, positive: bool = False) -> np.ndarray:
        """SI magnitudes of a list field."""
        readings = self._readings[name]
        assert isinstance(readings, tuple), name
        values = np.array([r.si for r in readings], dtype=float)
        for reading, magnitude in zip(readings, values, strict=True):
            self._bound(name, reading.text, float(magnitude), positive, None, None)
        return values

    def text(self, name: str) -> str:
        """A choice or path field as read."""
        reading = self._readings[name]
        assert isinstance(reading, str), name
        return reading

    def optional_text(self, name: str) -> str | None:
        """A choice, path or text field as read, or None when it is empty."""
        return self.text(name) if self.has(name) else None

    def error(self, name: str, problem: str) -> InputError:
        """An :class:`InputError` about field ``name`` as typed."""
        spec_field = self.spec.field(name)
        return InputError(spec_field.label, self._texts.get(name, ""), problem, _example(spec_field))

    def _bound(self, name: str, text: str, magnitude: float, positive: bool,
               minimum: float | None, maximum: float | None) -> None:
        spec_field = self.spec.field(name)
        if not math.isfinite(magnitude):
            raise InputError(spec_field.label, text, "not a finite number", _example(spec_field))
        if positive and magnitude <= 0:
            raise InputError(spec_field.label, text, "must be greater than zero", _example(spec_field))
        if minimum is not None and magnitude < minimum:
            raise InputError(spec_field.label, text, f"must be at least {self._limit(name, minimum)}",
                             _example(spec_field))
        if maximum is not None and magnitude > maximum:
            raise InputError(spec_field.label, text, f"must be at most {self._limit(name, maximum)}",
                             _example(spec_field))

    def _limit(self, name: str, si: float) -> str:
        """A bound of field ``name`` in the units of the system in use, e.g. '0.5000 Hz' or '500'."""
        kind = self._readings[name]
        kind_name = kind.kind if isinstance(kind, Reading) else self.spec.field(name).kind
        return format_value(si, kind_name, self.system) if kind_name in KINDS else f"{si:g}"

    def typed(self) -> dict[str, TypedInput]:
        """Inputs as typed and as read, for the result and the calc record."""
        typed: dict[str, TypedInput] = {}
        for name, reading in self._readings.items():
            kind = self.spec.field(name).kind
            if isinstance(reading, Reading):
                typed[name] = TypedInput(reading.text, reading.si, KINDS[reading.kind].si or "1", reading.note)
            elif isinstance(reading, tuple):
                typed[name] = TypedInput(self._texts.get(name, ""), None, KINDS[kind].si or "1",
                                         "; ".join(r.note for r in reading if r.note))
            else:
                typed[name] = TypedInput(reading, None, None)
        return typed

    def notes(self) -> tuple[Flag, ...]:
        """Flags for how inputs were read: a suspicious bare ratio is a caution, the rest info; a field
        given that the choices do not use is a caution (it was ignored)."""
        flags = []
        for name, typed in self.typed().items():
            if typed.note:
                level = "caution" if typed.note.startswith("did you mean") else "info"
                flags.append(Flag(level, f"{self.spec.field(name).label}: {typed.note}"))  # type: ignore[arg-type]
        flags += [Flag("caution", f"{self.spec.field(name).label} ignored: {why}")
                  for name, why in self.ignored.items()]
        return tuple(flags)

    def result(self, values: Mapping[str, Value], *, series: Mapping[str, np.ndarray] | None = None,
               flags: tuple[Flag, ...] = (), references: tuple[Reference, ...] = (),
               signal_kind: str | None = None, files: tuple[InputFile, ...] = (),
               table: tuple[str, ...] = ()) -> Result:
        """Build this check's :class:`Result`, adding input notes to the flags.

        ``files`` names every file the check read (the calc record and ``--json`` list them).

        ``signal_kind`` is the physical kind of the record's signal, for curves declared as
        :data:`~fieldmode.calc.framework.spec.SIGNAL`. ``table`` names curves to show as a table of
        numbers: an abscissa, then curves drawn against it (a check gives it when the user typed the
        abscissa as a list). Raises KeyError for a curve the spec does not declare and ValueError for
        a table that is not one abscissa and its curves (bugs in the check).
        """
        made = dict(series or {})
        kinds: dict[str, str] = {}
        for name in made:
            kind = self.spec.series_kind(name)  # KeyError: a curve the check does not declare
            if kind == SIGNAL:
                if signal_kind is None:
                    raise ValueError(f"check {self.spec.id}: series {name} needs the record's signal kind")
                kind = signal_kind
            kinds[name] = kind
        self._check_table(table, made)
        return Result(self.spec.id, self.typed(), dict(values), made, self.notes() + tuple(flags), references,
                      self.spec.caution, kinds, files, table)

    def _check_table(self, table: tuple[str, ...], made: Mapping[str, np.ndarray]) -> None:
        """ValueError unless ``table`` is empty or an abscissa then curves against it, all made, of one length."""
        if not table:
            return
        abscissa, *curves = table
        if (any(name not in made for name in table) or self.spec.curve(abscissa).against is not None
                or any(self.spec.curve(name).against != abscissa for name in curves)
                or len({np.shape(made[name]) for name in table}) > 1):
            raise ValueError(f"check {self.spec.id}: table {table} is not an abscissa and its curves, all made")
