"""The session in memory: every check's texts, shared fields, and values sent between checks.

Shared fields (``Field.shared``, e.g. mass and damping): typing into a shared field
also changes the same-named shared field of every other check that showed the same
text before the keystroke, unless one of the two has been given its own value
(``toggle_own``, ctrl+o in the app). A check whose text differs (say a footbridge's
modal mass beside a fan's mass) is never changed.
"""

from __future__ import annotations

from collections.abc import Iterable, Sequence
from dataclasses import dataclass
from typing import TYPE_CHECKING

from fieldmode.tui.session import SessionData

if TYPE_CHECKING:
    from fieldmode.calc.framework.result import Result
    from fieldmode.calc.framework.spec import CheckSpec


@dataclass(frozen=True)
class Sent:
    """One value sent from a check's result into another check's field."""

    check: str
    field: str
    text: str


class Workspace:
    """Texts of every check of a session, with the sharing and sending rules."""

    def __init__(self, specs: Sequence[CheckSpec], data: SessionData | None = None) -> None:
        self.specs = tuple(specs)
        self.by_id = {spec.id: spec for spec in self.specs}
        self.texts: dict[str, dict[str, str]] = {spec.id: spec.demo_texts() for spec in self.specs}
        self.system = "si"
        self.current = self.specs[0].id
        self.own: dict[str, set[str]] = {spec.id: set() for spec in self.specs}
        """Check id -> shared fields that keep their own value there."""
        if data is not None:
            self._restore(data)

    def _restore(self, data: SessionData) -> None:
        for check_id, saved in data.texts.items():
            if check_id in self.texts:
                known = self.texts[check_id]
                known.update({name: text for name, text in saved.items() if name in known})
        for check_id, names in data.own.items():
            if check_id in self.own:
                self.own[check_id] = {name for name in names if name in self.texts[check_id]}
        self.system = data.system if data.system in ("si", "us") else "si"
        if data.current in self.by_id:
            self.current = data.current

    def snapshot(self) -> SessionData:
        """A copy of the session to save."""
        return SessionData({check: dict(fields) for check, fields in self.texts.items()}, self.system,
                           self.current, {check: sorted(names) for check, names in self.own.items() if names})

    def set_text(self, check_id: str, name: str, text: str) -> list[tuple[str, str]]:
        """Set one field's text; return the other (check, field) pairs changed by sharing."""
        before = self.texts[check_id].get(name, "")
        self.texts[check_id][name] = text
        spec_field = next((f for f in self.by_id[check_id].fields if f.name == name), None)
        if spec_field is None or not spec_field.shared or before == text or name in self.own[check_id]:
            return []
        changed = []
        for other, field_name in self.followers(check_id, name, before):
            self.texts[other][field_name] = text
            changed.append((other, field_name))
        return changed

    def followers(self, check_id: str, name: str, text: str) -> list[tuple[str, str]]:
        """Other checks whose shared field shows ``text`` and follows the session."""
        return [(other, field_name) for other, field_name in self.shared_partners(check_id, name)
                if field_name not in self.own[other] and self.texts[other].get(field_name, "") == text]

    def toggle_own(self, check_id: str, name: str) -> bool:
        """Give a shared field its own value in this check, or share it again; True if now own."""
        if name in self.own[check_id]:
            self.own[check_id].discard(name)
            return False
        self.own[check_id].add(name)
        return True

    def shared_partners(self, check_id: str, name: str) -> Iterable[tuple[str, str]]:
        """Other checks with a shared field of this name."""
        for spec in self.specs:
            if spec.id != check_id and any(f.name == name and f.shared for f in spec.fields):
                yield spec.id, name

    def linked_count(self, check_id: str, name: str) -> int:
        """How many other checks change with this shared field (0 when it has its own value)."""
        if name in self.own[check_id]:
            return 0
        return len(self.followers(check_id, name, self.texts[check_id].get(name, "")))

    def send(self, check_id: str, result: Result) -> list[Sent]:
        """Put the check's sendable results into every other check having the target field.

        A target field that is one of a group of alternatives replaces them: the other
        fields of its group are emptied in that check.
        """
        from fieldmode.tui.present import field_text  # loaded with the result sent

        spec = self.by_id[check_id]
        sent: list[Sent] = []
        for value_name, field_name in spec.sends.items():
            value = result.values.get(value_name)
            number = value.number() if value is not None else None
            if value is None or number is None:
                continue
            text = field_text(number, value.kind, self.system)
            for other in self.specs:
                target = next((f for f in other.fields if f.name == field_name), None)
                if other.id == check_id or target is None:
                    continue
                self.texts[other.id][field_name] = text
                if target.group:
                    for sibling in other.fields:
                        if sibling.group == target.group and sibling.name != field_name:
                            self.texts[other.id][sibling.name] = ""
                sent.append(Sent(other.id, field_name, text))
        return sent
