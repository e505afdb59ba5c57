"""Declarative check specs: the one description that drives the command line and the app.

A check is declared once as a :class:`CheckSpec`: its fields (name, label, physical
kind, demo text, alternatives) and a compute function that takes :class:`Inputs`
(every field read and in SI) and returns a :class:`~calc.result.Result`.
"""

from __future__ import annotations

import math
import re
from collections.abc import Callable, Mapping
from dataclasses import dataclass, field

import numpy as np

from calc.kinds import KINDS
from calc.result import CAUTION, Flag, InputRecord, Reference, Result, Value
from calc.units import InputError, Reading, read, si_quantity

MAX_LIST_TEXT = 2000
"""Longest text accepted in a list field (characters)."""
MAX_LIST_ITEMS = 200
"""Most items accepted in a list field."""
_BARE_NUMBER = re.compile(r"^[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?$")


@dataclass(frozen=True)
class Field:
    """One input of a check.

    ``kind`` is a key of :data:`calc.kinds.KINDS`, or ``"choice"`` (one of ``choices``),
    ``"path"`` (a file) or ``"text"`` (free text the check reads itself, e.g. a column
    name). ``unit`` is the unit a bare number takes and is shown in the label. Fields
    sharing a ``group`` are alternatives: exactly one is given. ``many`` makes it a
    comma-separated list (numbers separated by blanks, '5 10 Hz', are items too).
    ``shared`` fields carry their value to other checks of a session that have a field
    of the same name.
    """

    name: str
    label: str
    kind: str
    default: str = ""
    unit: str | None = None
    required: bool = True
    group: str | None = None
    choices: tuple[str, ...] = ()
    many: bool = False
    shared: bool = False
    positional: bool = False
    help: str = ""

    @property
    def option(self) -> str:
        """Command-line option, e.g. '--static-deflection'."""
        return "--" + self.name.replace("_", "-")

    @property
    def shown_label(self) -> str:
        """Label with its unit, e.g. 'Stiffness (kN/mm)'."""
        unit = self.unit if self.unit is not None else (KINDS[self.kind].si if self.kind in KINDS else "")
        return f"{self.label} ({unit})" if unit else self.label


@dataclass(frozen=True)
class CheckSpec:
    """A check: its identity, its fields, and the function that computes it."""

    id: str
    title: str
    summary: str
    fields: tuple[Field, ...]
    compute: Callable[[Inputs], Result]
    caution: str = CAUTION
    sends: Mapping[str, str] = field(default_factory=dict)
    """Result name -> field name it can fill in other checks (e.g. 'stiffness' -> 'stiffness')."""

    def field(self, name: str) -> Field:
        return next(f for f in self.fields if f.name == name)

    def demo_texts(self) -> dict[str, str]:
        return {f.name: f.default for f in self.fields}

    def read(self, texts: Mapping[str, str]) -> tuple[Inputs, dict[str, InputError]]:
        """Read every field; return what was read and the errors by field name."""
        readings: dict[str, Reading | tuple[Reading, ...] | str] = {}
        errors: dict[str, InputError] = {}
        for spec_field in self.fields:
            text = (texts.get(spec_field.name) or "").strip()
            if not text:
                continue
            try:
                readings[spec_field.name] = read_field(spec_field, text)
            except InputError as error:
                errors[spec_field.name] = error
        self._check_groups(readings, errors)
        return Inputs(self, readings, dict(texts)), errors

    def evaluate(self, texts: Mapping[str, str]) -> Result:
        """Read the texts and compute; raise the first :class:`InputError` found."""
        inputs, errors = self.read(texts)
        if errors:
            raise next(iter(errors.values()))
        return self.compute(inputs)

    def _check_groups(self, readings: Mapping[str, object], errors: dict[str, InputError]) -> None:
        groups: dict[str, list[Field]] = {}
        for spec_field in self.fields:
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
        return "'decay.csv'"
    if spec_field.kind == "text":
        return ""
    return KINDS[spec_field.kind].example


def read_field(spec_field: Field, text: str) -> Reading | tuple[Reading, ...] | str:
    """Read one field's text: a choice, a path, a list or a single quantity."""
    if spec_field.kind == "choice":
        return _read_choice(spec_field, text)
    if spec_field.kind == "path":
        if len(text) > 4096 or "\0" in text:
            raise InputError(spec_field.label, text, "not a usable path", "'decay.csv'")
        return text
    if spec_field.kind == "text":
        if len(text) > MAX_LIST_TEXT or not text.isprintable():
            raise InputError(spec_field.label, text, "not usable text")
        return text
    if spec_field.many:
        return _read_list(spec_field, text)
    return read(text, spec_field.kind, spec_field.label, spec_field.unit)


def _read_choice(spec_field: Field, text: str) -> str:
    wanted = text.strip().lower()
    exact = [c for c in spec_field.choices if c.lower() == wanted]
    starts = [c for c in spec_field.choices if c.lower().startswith(wanted)]
    if exact or len(starts) == 1:
        return (exact or starts)[0]
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
    return tuple(read(item, spec_field.kind, f"{label} #{i + 1}", last_unit)
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
                 texts: Mapping[str, str]) -> None:
        self.spec = spec
        self._readings = dict(readings)
        self._texts = dict(texts)

    def has(self, name: str) -> bool:
        return name in self._readings

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
            raise InputError(spec_field.label, text, f"must be at least {minimum:g} (SI)", _example(spec_field))
        if maximum is not None and magnitude > maximum:
            raise InputError(spec_field.label, text, f"must be at most {maximum:g} (SI)", _example(spec_field))

    def records(self) -> dict[str, InputRecord]:
        """Inputs as typed and as read, for the result and the calc record."""
        records: dict[str, InputRecord] = {}
        for name, reading in self._readings.items():
            kind = self.spec.field(name).kind
            if isinstance(reading, Reading):
                records[name] = InputRecord(reading.text, reading.si, KINDS[kind].si or "1", reading.note)
            elif isinstance(reading, tuple):
                records[name] = InputRecord(self._texts.get(name, ""), None, KINDS[kind].si or "1",
                                            "; ".join(r.note for r in reading if r.note))
            else:
                records[name] = InputRecord(reading, None, None)
        return records

    def notes(self) -> tuple[Flag, ...]:
        """Flags for how inputs were read: a suspicious bare ratio is a caution, the rest info."""
        flags = []
        for name, record in self.records().items():
            if record.note:
                level = "caution" if record.note.startswith("did you mean") else "info"
                flags.append(Flag(level, f"{self.spec.field(name).label}: {record.note}"))  # type: ignore[arg-type]
        return tuple(flags)

    def result(self, values: Mapping[str, Value], *, series: Mapping[str, np.ndarray] | None = None,
               flags: tuple[Flag, ...] = (), references: tuple[Reference, ...] = ()) -> Result:
        """Build this check's :class:`Result`, adding input notes to the flags."""
        return Result(self.spec.id, self.records(), dict(values), dict(series or {}),
                      self.notes() + tuple(flags), references, self.spec.caution)


def quantity(label: str, kind: str, si_value: float | np.ndarray) -> Value:
    """A result value from an SI magnitude, e.g. ``quantity('Natural frequency', 'frequency', 4.1)``."""
    return Value(label, kind, si_quantity(si_value, kind))


def word(label: str, text: str) -> Value:
    """A result that is a word, such as the damping regime."""
    return Value(label, "number", text)
