"""The one result type every check returns, and the cautions it carries.

Values are SI magnitudes with their physical kind: no unit objects, so a result is cheap to
build, to copy between threads and to turn into JSON. Display in engineering units is the
presenter's job (fieldmode.tui.present).
"""

from __future__ import annotations

import math
from collections.abc import Mapping
from dataclasses import dataclass, field
from typing import Any, Literal

import numpy as np

from fieldmode.calc.framework.kinds import KINDS
from fieldmode.calc.framework.meaning import Meaning

CAUTION = ("Screening estimates, not a design: check against local codes and licensed "
           "engineering practice.")
SEISMIC_CAUTION = ("Seismic screening only, not a design: the design code, a site-specific "
                   "hazard study and a licensed engineer govern.")
MEASURED_CAUTION = ("Guideline values are screening references: the building's condition, local rules and a "
                    "licensed engineer govern, and vibration that people complain of is judged by the local "
                    "authority's procedure.")
"""The caution of the checks that judge a measured vibration record against guideline values."""

Level = Literal["info", "caution", "warning"]


@dataclass(frozen=True)
class Flag:
    """Something the engineer should notice about a result."""

    level: Level
    text: str


@dataclass(frozen=True)
class Reference:
    """A method used and the published source it comes from."""

    method: str
    source: str


@dataclass(frozen=True)
class TypedInput:
    """One input as typed and as read: the SI value and unit (None for choices, paths and lists)."""

    text: str
    value: float | None
    unit: str | None
    note: str = ""


@dataclass(frozen=True)
class InputFile:
    """A file a check read: the path as the person typed it, its size and the SHA-256 of its content."""

    path: str
    size: int
    """Bytes."""
    sha256: str
    """Hex digest."""

    def to_dict(self) -> dict[str, Any]:
        return {"path": self.path, "bytes": self.size, "sha256": self.sha256}


Magnitude = float | np.ndarray | str
"""An SI magnitude (a number or an array), or a word such as a damping regime."""


@dataclass(frozen=True)
class Value:
    """One result: a label, its physical kind, and its SI magnitude (or a word)."""

    label: str
    kind: str
    magnitude: Magnitude
    meaning: Meaning | None = None
    """Which quantity of which object the value is (a value can be sent to fields of the same meaning)."""

    @property
    def is_word(self) -> bool:
        return isinstance(self.magnitude, str)

    def si(self) -> Any:
        """The magnitude for JSON: a float, a list (arrays), or the word itself."""
        if isinstance(self.magnitude, np.ndarray):
            return self.magnitude.tolist()
        return self.magnitude if isinstance(self.magnitude, str) else float(self.magnitude)

    def number(self) -> float | None:
        """A finite scalar magnitude, or None for a word, an array or a non-finite number."""
        if isinstance(self.magnitude, str | np.ndarray):
            return None
        magnitude = float(self.magnitude)
        return magnitude if math.isfinite(magnitude) else None


def quantity(label: str, kind: str, si_value: float | np.ndarray, meaning: Meaning | None = None) -> Value:
    """A result value from an SI magnitude, e.g. ``quantity('Natural frequency', 'frequency', 4.1)``."""
    return Value(label, kind, si_value if isinstance(si_value, np.ndarray) else float(si_value), meaning)


def word(label: str, text: str) -> Value:
    """A result that is a word, such as the damping regime."""
    return Value(label, "number", text)


def si_unit(kind: str) -> str:
    """The SI unit of ``kind`` as JSON writes it ('1' for ratios and plain numbers)."""
    return KINDS[kind].si or "1"


def finite_list(values: np.ndarray) -> list[float | None]:
    """A curve's values as a list of floats, each non-finite point (NaN, inf) as None."""
    array = np.ravel(np.asarray(values, dtype=float))
    listed: list[float | None] = array.tolist()
    if not np.all(np.isfinite(array)):
        listed = [value if math.isfinite(value) else None for value in array.tolist()]
    return listed


@dataclass(frozen=True)
class Result:
    """Everything a check found: inputs, files read, values, curves (SI arrays), flags and sources."""

    check: str
    inputs: Mapping[str, TypedInput]
    values: Mapping[str, Value]
    series: Mapping[str, np.ndarray] = field(default_factory=dict)
    flags: tuple[Flag, ...] = ()
    references: tuple[Reference, ...] = ()
    caution: str = CAUTION
    series_kinds: Mapping[str, str] = field(default_factory=dict)
    """Series name -> physical kind of its values."""
    files: tuple[InputFile, ...] = ()
    """Every file the check read."""
    table: tuple[str, ...] = ()
    """Series to show as a table of numbers, abscissa first (e.g. a spectrum at periods the user listed)."""

    def number(self, name: str) -> float | None:
        """A finite scalar result by name, or None when absent, a word, an array or not finite."""
        value = self.values.get(name)
        return None if value is None else value.number()

    def series_unit(self, name: str) -> str:
        """The SI unit of the curve ``name`` as JSON and CSV write it ('1' for ratios and plain numbers)."""
        return si_unit(self.series_kinds[name])

    def to_dict(self) -> dict[str, Any]:
        """The JSON contract: SI values, units pint can parse, strings with unit null; ``files`` when it read any.

        ``series`` holds every curve as computed (SI values, a non-finite point as null).
        """
        return {
            "check": self.check,
            "inputs": {name: {"text": typed.text, "value": typed.value, "unit": typed.unit}
                       for name, typed in self.inputs.items()},
            "results": {name: {"value": value.si(), "unit": None if value.is_word else si_unit(value.kind)}
                        for name, value in self.values.items()},
            "series": {name: {"values": finite_list(values), "unit": self.series_unit(name)}
                       for name, values in self.series.items()},
            "flags": [{"level": flag.level, "text": flag.text} for flag in self.flags],
            "references": [{"method": ref.method, "source": ref.source} for ref in self.references],
            "caution": self.caution,
            **({"files": [file.to_dict() for file in self.files]} if self.files else {}),
        }
