"""Evaluate one check from its texts into what the app shows: notes, errors, result.

No Textual here: :func:`evaluate` runs in a worker thread and in benchmarks. The core
(numpy, pint, the checks) is imported by the functions that use it, so that importing
this module (for :class:`Outcome`) stays cheap before the first frame.
"""

from __future__ import annotations

import os
from collections.abc import Mapping
from dataclasses import dataclass, field
from typing import TYPE_CHECKING

from calc.fields import CheckOutline, Field
from calc.kinds import KINDS

if TYPE_CHECKING:
    from calc.result import Result, Value
    from calc.spec import CheckSpec
    from calc.units import InputError, Reading

MAX_LIST_SHOWN = 4
"""List fields show at most this many read values beside them."""


@dataclass
class Outcome:
    """What one evaluation of a check found."""

    check: str
    system: str
    notes: dict[str, str] = field(default_factory=dict)
    """Field name -> how its text was read, e.g. '= 24.17 Hz'."""
    errors: dict[str, str] = field(default_factory=dict)
    """Field name -> what is wrong with its text."""
    texts: dict[str, str] = field(default_factory=dict)
    """The texts evaluated."""
    problem: str = ""
    """A fault not tied to one field (shown in place of the results)."""
    result: Result | None = None
    shown: Shown | None = None
    """The result as text only, when it was computed in another process (``result`` is None then)."""


@dataclass
class Shown:
    """A result as the results pane shows it, in plain data (it crosses from one process to another)."""

    rows: list[tuple[str, str]]
    """(label, value with its unit) per result value."""
    flags: list[tuple[str, str, str]]
    """(mark, level, text) per flag."""


def shown_of(outcome: Outcome) -> Shown | None:
    """The outcome's result as text (None when it has no result)."""
    result = outcome.result
    if result is None:
        return outcome.shown
    from calc.result import LEVEL_MARKS

    return Shown([(value.label, shown_value(value, outcome.system)) for value in result.values.values()],
                 [(LEVEL_MARKS[flag.level], flag.level, flag.text) for flag in result.flags])


def as_shown(outcome: Outcome) -> Outcome:
    """A copy of ``outcome`` with its result as text only (:class:`Shown`), to send to another process."""
    return Outcome(outcome.check, outcome.system, dict(outcome.notes), dict(outcome.errors), dict(outcome.texts),
                   outcome.problem, None, shown_of(outcome))


def full_spec(spec: CheckSpec | CheckOutline) -> CheckSpec:
    """The check's spec with its compute function, for a spec or an outline (this imports the core)."""
    if not isinstance(spec, CheckOutline):
        return spec
    from calc.checks import BY_ID

    return BY_ID[spec.id]


def evaluate(spec: CheckSpec | CheckOutline, texts: Mapping[str, str], system: str) -> Outcome:
    """Read every field of ``spec``, compute if all are good, and describe what happened."""
    from calc.spec import read_field
    from calc.units import InputError

    spec = full_spec(spec)
    outcome = Outcome(spec.id, system, texts=dict(texts))
    inputs, errors = spec.read(texts)
    for spec_field in spec.fields:
        if spec_field.name in errors:
            outcome.errors[spec_field.name] = _problem(spec_field, errors[spec_field.name])
        elif inputs.has(spec_field.name):
            text = (texts.get(spec_field.name) or "").strip()
            outcome.notes[spec_field.name] = interpretation(spec_field, read_field(spec_field, text), system)
    if errors:
        return outcome
    try:
        outcome.result = spec.compute(inputs)
    except InputError as error:
        owner = field_of_error(spec, error)
        if owner is None:
            outcome.problem = str(error)
        else:
            outcome.errors[owner.name] = _problem(owner, error)
    except (ArithmeticError, ValueError, OSError) as error:
        outcome.problem = f"could not compute ({type(error).__name__}: {error})"
    return outcome


def evaluate_guarded(spec: CheckSpec | CheckOutline, texts: Mapping[str, str], system: str) -> Outcome:
    """:func:`evaluate`, with any fault of a check turned into a problem shown on screen.

    A check that raises something other than InputError has a bug; the app shows it
    (type and message, to report) instead of closing and losing the session.
    """
    try:
        return evaluate(spec, texts, system)
    except Exception as error:  # shown to the person, never hidden: see the docstring
        return Outcome(spec.id, system, texts=dict(texts),
                       problem=f"internal fault in {spec.id} ({type(error).__name__}: {error}); please report it")


def field_of_error(spec: CheckSpec | CheckOutline, error: InputError) -> Field | None:
    """The field an InputError is about, from the label it names (list items: 'Label #3')."""
    for spec_field in spec.fields:
        if error.field == spec_field.label or error.field.startswith(spec_field.label + " #"):
            return spec_field
    return None


def _problem(spec_field: Field, error: InputError) -> str:
    """The error message without the field's label in front (the label is beside it)."""
    message = str(error)
    prefix = spec_field.label + ": "
    return message[len(prefix):] if message.startswith(prefix) else message


def interpretation(spec_field: Field, reading: Reading | tuple[Reading, ...] | str, system: str) -> str:
    """How a field's text was read, e.g. '= 24.17 Hz' or 'read as weight: m = W/g0 = 12 t'."""
    from calc.units import Reading, format_quantity

    if isinstance(reading, Reading):
        if KINDS[reading.kind].integer:
            return f"= {reading.si:.0f}"
        shown = "= " + format_quantity(reading.quantity, reading.kind, system)
        if reading.note and "=" in reading.note:
            return reading.note
        return f"{shown}; {reading.note}" if reading.note else shown
    if isinstance(reading, tuple):
        items = [format_quantity(r.quantity, r.kind, system) for r in reading]
        if len(items) > MAX_LIST_SHOWN:
            return f"{len(items)} values: {items[0]} ... {items[-1]}"
        return "= " + ", ".join(items)
    if spec_field.kind == "path":
        return _file_note(reading)
    return f"= {reading}"


def _file_note(path: str) -> str:
    try:
        size = os.stat(os.path.expanduser(path)).st_size
    except OSError as error:
        return f"not found ({error.strerror})" if error.strerror else "not found"
    if os.path.isdir(os.path.expanduser(path)):
        return "a folder, not a file"
    return f"file, {size / 1024:.1f} kB"


def shown_value(value: Value, system: str) -> str:
    """A result value as text in ``system``; arrays as a short list."""
    import numpy as np

    from calc.units import format_quantity

    if isinstance(value.quantity, str):
        return value.quantity
    magnitude = value.quantity.magnitude
    if isinstance(magnitude, np.ndarray) and magnitude.ndim > 1:
        return "table " + " x ".join(str(n) for n in magnitude.shape)
    if isinstance(magnitude, np.ndarray) and magnitude.ndim == 1:
        more = f" ... ({magnitude.size})" if magnitude.size > 6 else ""
        return format_quantity(value.quantity[:6], value.kind, system) + more  # one unit for the list
    return value.shown(system)
