"""The one result type every check returns, and the cautions it carries."""

from __future__ import annotations

from collections.abc import Mapping
from dataclasses import dataclass, field
from typing import Any, Literal

import numpy as np
import pint

from calc.kinds import KINDS
from calc.units import format_quantity

CAUTION = ("Screening estimates, not a design: check against local codes and licensed "
           "engineering practice.")
SEISMIC_CAUTION = ("Seismic screening only, not a design: the design code, a site-specific "
                   "hazard study and a licensed engineer govern.")

Level = Literal["info", "caution", "warning"]
LEVEL_MARKS: dict[str, str] = {"info": "i", "caution": "!", "warning": "!!"}
"""A symbol per flag level, so meaning never rests on colour alone."""


@dataclass(frozen=True)
class Flag:
    """Something the engineer should notice about a result."""

    level: Level
    text: str

    def shown(self) -> str:
        return f"{LEVEL_MARKS[self.level]} {self.text}"


@dataclass(frozen=True)
class Reference:
    """A method used and the published source it comes from."""

    method: str
    source: str


@dataclass(frozen=True)
class InputRecord:
    """One input as typed and as read (SI value and unit)."""

    text: str
    value: float | None
    unit: str | None
    note: str = ""


@dataclass(frozen=True)
class Value:
    """One result: a label, its physical kind, and a quantity (or a word such as a regime)."""

    label: str
    kind: str
    quantity: pint.Quantity | str

    def shown(self, system: str = "si") -> str:
        if isinstance(self.quantity, str):
            return self.quantity
        return format_quantity(self.quantity, self.kind, system)

    def si(self) -> Any:
        """Magnitude in SI (float or list), or the word itself."""
        if isinstance(self.quantity, str):
            return self.quantity
        magnitude = self.quantity.to(KINDS[self.kind].si).magnitude
        return magnitude.tolist() if isinstance(magnitude, np.ndarray) else float(magnitude)


@dataclass(frozen=True)
class Result:
    """Everything a check found: inputs, values, chart series, flags and sources."""

    check: str
    inputs: Mapping[str, InputRecord]
    values: Mapping[str, Value]
    series: Mapping[str, np.ndarray] = field(default_factory=dict)
    flags: tuple[Flag, ...] = ()
    references: tuple[Reference, ...] = ()
    caution: str = CAUTION

    def to_dict(self) -> dict[str, Any]:
        """The JSON contract: SI values, units pint can parse, strings with unit null."""
        return {
            "check": self.check,
            "inputs": {name: {"text": rec.text, "value": rec.value, "unit": rec.unit}
                       for name, rec in self.inputs.items()},
            "results": {name: {"value": value.si(), "unit": _json_unit(value)}
                        for name, value in self.values.items()},
            "flags": [{"level": flag.level, "text": flag.text} for flag in self.flags],
            "references": [{"method": ref.method, "source": ref.source} for ref in self.references],
            "caution": self.caution,
        }


def _json_unit(value: Value) -> str | None:
    if isinstance(value.quantity, str):
        return None
    return KINDS[value.kind].si or "1"
