"""Declarative checks: the one description that drives the command line and the app.

A check is declared once as a :class:`CheckSpec`: its fields (name, label, physical kind, demo
text, alternatives), the curves it makes (:class:`Series`) and a compute function that takes
:class:`~fieldmode.calc.framework.reading.Inputs` (every field read, in SI) and returns a
:class:`~fieldmode.calc.framework.result.Result`.

This module loads neither numpy nor pint, so the app can draw a check's fields before the
core is loaded; reading typed text is in :mod:`fieldmode.calc.framework.reading`.
"""

from __future__ import annotations

from collections.abc import Callable, Iterable, Mapping
from dataclasses import dataclass
from dataclasses import field as dataclass_field
from typing import TYPE_CHECKING

from fieldmode.calc.framework.kinds import KINDS, MAX_LIST_TEXT, MAX_PATH_TEXT, MAX_QUANTITY_TEXT
from fieldmode.calc.framework.meaning import Meaning
from fieldmode.calc.framework.result import CAUTION

if TYPE_CHECKING:
    from fieldmode.calc.framework.reading import Inputs
    from fieldmode.calc.framework.result import Result
    from fieldmode.calc.framework.units import InputError


@dataclass(frozen=True)
class Field:
    """One input of a check.

    ``kind`` is a key of :data:`fieldmode.calc.framework.kinds.KINDS`, or ``"choice"`` (one of ``choices``),
    ``"path"`` (a file) or ``"text"`` (free text the check reads itself, e.g. a column
    name). ``unit`` is the unit a bare number takes and is shown in the label. Fields
    sharing a ``group`` are alternatives: exactly one is given. ``many`` makes it a
    comma-separated list (numbers separated by blanks, '5 10 Hz', are items too).
    ``shared`` fields carry their value to other checks of a session that have a field
    of the same meaning. ``used_when`` names the choices that use the field (see
    :meth:`CheckSpec.unused`).
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
    meaning: Meaning | None = None
    """Which quantity of which object the field is; values move between checks only by meaning."""
    other_kinds: tuple[str, ...] = ()
    """Other physical kinds the field accepts (a peak amplitude as a length, velocity or acceleration);
    the text is read as the first of ``kind`` and these that fits it."""
    used_when: Mapping[str, tuple[str, ...]] = dataclass_field(default_factory=dict, hash=False)
    """The choices that use this field: choice field name -> the choices that use it ('' for the choice
    left empty), e.g. ``{"element": ("beam",)}``. The field is used when every choice named is one of
    its values; otherwise it is not read (the app hides it, the command line notes it as ignored)."""

    def chosen(self, text: str) -> str | None:
        """The choice ``text`` picks ('' when empty; a unique start is enough), None when it picks none."""
        wanted = text.strip().lower()
        if not wanted:
            return ""
        exact = [c for c in self.choices if c.lower() == wanted]
        starts = [c for c in self.choices if c.lower().startswith(wanted)]
        return (exact or starts)[0] if exact or len(starts) == 1 else None

    @property
    def option(self) -> str:
        """Command-line option, e.g. '--static-deflection'."""
        return "--" + self.name.replace("_", "-")

    @property
    def max_length(self) -> int:
        """Most characters the field takes: a quantity's text is short, a list or a path longer."""
        if self.kind == "path":
            return MAX_PATH_TEXT
        return MAX_LIST_TEXT if self.many or self.kind == "text" else MAX_QUANTITY_TEXT

    @property
    def label_with_unit(self) -> str:
        """Label with its unit, e.g. 'Stiffness (kN/mm)'."""
        unit = self.unit if self.unit is not None else (KINDS[self.kind].si if self.kind in KINDS else "")
        return f"{self.label} ({unit})" if unit else self.label


def either(words: Iterable[str]) -> str:
    """'a', 'a or b', 'a, b or c'."""
    listed = list(words)
    return " or ".join(filter(None, (", ".join(listed[:-1]), listed[-1] if listed else "")))


SIGNAL = "signal"
"""Series kind of a curve in the unit of the record a check read (acceleration, velocity, length,
or a plain number when the record's unit is unknown); the check names it when it computes."""


@dataclass(frozen=True)
class Series:
    """A curve a check makes: its name (the key in ``Result.series``), label and physical kind.

    Values are SI magnitudes of the kind (or of the record's signal, :data:`SIGNAL`); ``against``
    names the series it is a function of (None for an abscissa such as a time or period grid).
    Charts, JSON and CSV read curves by these names only.
    """

    name: str
    label: str
    kind: str
    against: str | None = None


@dataclass(frozen=True)
class CheckSpec:
    """A check: its identity, its fields, and the function that computes it."""

    id: str
    title: str
    summary: str
    fields: tuple[Field, ...]
    compute: Callable[[Inputs], Result]
    caution: str = CAUTION
    series: tuple[Series, ...] = ()
    """Every curve the check can make; a result holds some or all of them."""
    key_results: tuple[str, ...] = ()
    """Names of the results a table of many records shows, most telling first (those that fit 80
    columns); empty: the first results that fit."""

    def __post_init__(self) -> None:
        """Refuse a ``used_when`` that names no earlier choice field or no choice of it (a bug in the check)."""
        earlier: dict[str, Field] = {}
        for spec_field in self.fields:
            for name, values in spec_field.used_when.items():
                choice = earlier.get(name)
                if choice is None or choice.kind != "choice" or not values or any(
                        value and value not in choice.choices for value in values):
                    raise ValueError(f"check {self.id}: field {spec_field.name} is used when {name} is {values}, "
                                     "which is not an earlier choice field and its choices")
            earlier[spec_field.name] = spec_field

    def field(self, name: str) -> Field:
        return next(f for f in self.fields if f.name == name)

    @property
    def record_field(self) -> Field | None:
        """The positional file field a record check reads (a folder or several files run it per record)."""
        return next((f for f in self.fields if f.kind == "path" and f.positional), None)

    def unused(self, texts: Mapping[str, str]) -> dict[str, str]:
        """Fields the choices in ``texts`` do not use: field name -> why, e.g. 'used only when element is
        beam (here axial)'.

        A field is unused when a choice it names picks another value, or when that choice field is
        itself unused (a section's width, for springs). A choice that picks nothing readable leaves
        its fields in use: its own error is shown.
        """
        found: dict[str, str] = {}
        for spec_field in self.fields:
            for name, values in spec_field.used_when.items():
                if name in found:
                    found[spec_field.name] = found[name]
                    break
                choice = self.field(name)
                picked = choice.chosen(texts.get(name) or "")
                if picked is not None and picked not in values:
                    allowed = either(value or "not given" for value in values)
                    found[spec_field.name] = (f"used only when {choice.label.lower()} is {allowed} "
                                              f"(here {picked or 'not given'})")
                    break
        return found

    def demo_texts(self) -> dict[str, str]:
        return {f.name: f.default for f in self.fields}

    def curve(self, name: str) -> Series:
        """The declared curve ``name``; KeyError when the check declares no such curve."""
        for curve in self.series:
            if curve.name == name:
                return curve
        raise KeyError(f"{self.id} declares no series {name!r}")

    def series_kind(self, name: str) -> str:
        """Physical kind of the curve ``name``; KeyError when the check declares no such curve."""
        return self.curve(name).kind

    def read(self, texts: Mapping[str, str], system: str = "si") -> tuple[Inputs, dict[str, InputError]]:
        """Read every field; return what was read and the errors by field name.

        ``system`` ("si" or "us") is the unit system in use: a preset may depend on it (steel's E).
        """
        from fieldmode.calc.framework.reading import read_inputs  # loads pint: not needed to draw fields

        return read_inputs(self, texts, system)

    def evaluate(self, texts: Mapping[str, str], system: str = "si") -> Result:
        """Read the texts and compute; raise the first :class:`InputError` found."""
        inputs, errors = self.read(texts, system)
        if errors:
            raise next(iter(errors.values()))
        return self.compute(inputs)
