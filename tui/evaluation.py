"""Evaluate one check from its texts: how each field was read, errors by field, and the result.

No Textual here: :func:`evaluate` runs in the app's compute worker, for the calc record and in
benchmarks. Importing this module loads the core (pint, numpy, the unit reader); the app imports
it in its compute worker, after its first frame.
"""

from __future__ import annotations

import os
from collections.abc import Mapping
from dataclasses import dataclass, field

from fieldmode.calc.demo import demo_path
from fieldmode.calc.framework.result import Result
from fieldmode.calc.framework.spec import CheckSpec, Field
from fieldmode.calc.framework.units import InputError
from fieldmode.calc.records.layout import RecordError
from fieldmode.tui.present import reading_text


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


def evaluate(spec: CheckSpec, texts: Mapping[str, str], system: str) -> Outcome:
    """Read every field of ``spec``, compute if all are good, and describe what happened."""
    outcome = Outcome(spec.id, system, texts=dict(texts))
    inputs, errors = spec.read(texts, system)
    for spec_field in spec.fields:
        if spec_field.name in errors:
            outcome.errors[spec_field.name] = _problem(spec_field, errors[spec_field.name])
        elif inputs.has(spec_field.name):
            reading = inputs.reading(spec_field.name)
            outcome.notes[spec_field.name] = (_file_note(reading) if spec_field.kind == "path" and
                                              isinstance(reading, str) else reading_text(reading, system))
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


def evaluate_guarded(spec: CheckSpec, texts: Mapping[str, str], system: str) -> Outcome:
    """:func:`evaluate`, with any fault of a check turned into a problem shown on screen.

    A check that raises something other than InputError has a bug; the app shows it
    (type and message, to report) instead of closing and losing the session.
    """
    try:
        return evaluate(spec, texts, system)
    except Exception as error:  # shown to the person, never hidden: see the docstring
        return Outcome(spec.id, system, texts=dict(texts),
                       problem=f"internal fault in {spec.id} ({type(error).__name__}: {error}); please report it")


def field_of_error(spec: CheckSpec, error: InputError) -> Field | None:
    """The field an InputError is about, from the label it names (list items: 'Label #3'); a record
    that cannot be read is about the field its ``about`` names (a column), else the path field."""
    for spec_field in spec.fields:
        if error.field == spec_field.label or error.field.startswith(spec_field.label + " #"):
            return spec_field
    if isinstance(error, RecordError):
        named = [spec_field for spec_field in spec.fields if spec_field.name == error.about]
        paths = [spec_field for spec_field in spec.fields if spec_field.kind == "path"]
        return named[0] if named else paths[0] if len(paths) == 1 else None
    return None


def _problem(spec_field: Field, error: InputError) -> str:
    """The error message without the field's label in front (the label is beside it)."""
    if isinstance(error, RecordError):
        return f"line {error.line}: {error.problem}" if error.line else error.problem
    message = str(error)
    prefix = spec_field.label + ": "
    return message[len(prefix):] if message.startswith(prefix) else message


def _file_note(path: str) -> str:
    """What a path field names: a file and its size, the shipped demo record, a folder, or nothing."""
    try:
        demo = demo_path(path)
    except LookupError:
        return "no such demo record"
    if demo is not None:
        return "shipped demo record"
    try:
        size = os.stat(os.path.expanduser(path)).st_size
    except OSError as error:
        return f"not found ({error.strerror})" if error.strerror else "not found"
    if os.path.isdir(os.path.expanduser(path)):
        return "a folder, not a file"
    return f"file, {_size_text(size)}"


def _size_text(size: int) -> str:
    """A file size for people: '812 bytes', '39.6 kB', '249.0 MB'."""
    for unit, scale in (("GB", 1e9), ("MB", 1e6), ("kB", 1e3)):
        if size >= scale:
            return f"{size / scale:.1f} {unit}"
    return f"{size} bytes"
