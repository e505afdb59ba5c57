"""A check's inputs as data: :class:`Field`, and :class:`CheckOutline` (a check without its compute).

Nothing here loads numpy or pint: the app builds its first screen from outlines made in
a helper process (tui/prestart.py) while it loads Textual, and loads the core after.
"""

from __future__ import annotations

from collections.abc import Mapping
from dataclasses import dataclass, field

from calc.kinds import KINDS


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
class CheckOutline:
    """What a check is without its compute function: identity, fields, caution, what it sends.

    Made by :meth:`calc.spec.CheckSpec.outline`; has the same data attributes and the same
    ``field`` and ``demo_texts`` methods.
    """

    id: str
    title: str
    summary: str
    fields: tuple[Field, ...]
    caution: str
    sends: Mapping[str, str] = field(default_factory=dict)

    def field(self, name: str) -> Field:
        return next(f for f in self.fields if f.name == name)

    def demo_texts(self) -> dict[str, str]:
        return {f.name: f.default for f in self.fields}
