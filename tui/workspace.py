"""The session in memory: every check's texts, the values checks share, and values sent between them.

**Shared values.** Fields of the same meaning (``Field.meaning``, e.g. the structure's damping ratio)
that are marked ``shared`` hold one value in the session: typing into one changes it in every check
that shows it, unless a check keeps a value of its own there (``toggle_own``, Ctrl+O in the app).
Fields of different meanings are never linked: the machine's mass on its mounts and the structure's
mass are two values.

**Sending.** ``send_targets`` lists, for each result of a check that has a meaning, the fields of
other checks with the same meaning, with their current text and the text they would get; the person
ticks the lines to apply (``apply``). Fields of the same quantity but another object (a measured
damping beside the damping a seismic code fixes) are never offered; ``not_offered`` says which they
are, so the person can type a value there deliberately. A field the target's choices leave unused
(``Field.used_when``) is never offered.

**Fields in use.** A check's choices decide which fields it uses (``CheckSpec.unused``: a beam has no
spring stiffnesses), and of each group of alternatives (a stiffness or a static deflection) one is shown
and used (``shown``, kept in the session). ``hidden`` names the rest: they keep their texts, and
``used_texts`` leaves them out of what is computed, sent from and recorded.
"""

from __future__ import annotations

from collections.abc import Iterable, Sequence
from dataclasses import dataclass, field
from typing import TYPE_CHECKING

from fieldmode.tui.session import PROJECT_FIELDS, SessionData

if TYPE_CHECKING:
    from fieldmode.calc.framework.meaning import Meaning
    from fieldmode.calc.framework.result import Result, Value
    from fieldmode.calc.framework.spec import CheckSpec, Field


@dataclass
class Target:
    """One place a sent value can go: a shared value (all the checks showing it) or one check's field."""

    meaning: Meaning
    value: Value
    """The result sent."""
    text: str
    """The text the field(s) would get."""
    fields: list[tuple[str, str]]
    """(check id, field name) of every field that changes."""
    label: str
    """The fields' label."""
    current: str
    """The text the field(s) show now."""
    clears: list[tuple[str, str]] = field(default_factory=list)
    """(check id, field name) of alternatives emptied with it (a stiffness sent replaces a static deflection)."""
    ticked: bool = True

    @property
    def checks(self) -> list[str]:
        return list(dict.fromkeys(check for check, _ in self.fields))


class Workspace:
    """Texts of every check of a session, with the sharing and sending rules."""

    def __init__(self, specs: Sequence[CheckSpec], data: SessionData | None = None) -> None:
        self.specs = tuple(specs)
        self.by_id = {spec.id: spec for spec in self.specs}
        self.texts: dict[str, dict[str, str]] = {spec.id: spec.demo_texts() for spec in self.specs}
        """Check id -> field name -> text as shown (shared values filled in)."""
        self.system = "si"
        self.current = self.specs[0].id
        self.own: dict[str, set[str]] = {spec.id: set() for spec in self.specs}
        """Check id -> shared fields that keep a value of their own there."""
        self.shared: dict[str, str] = {}
        """Meaning key -> the one text of a shared value."""
        self.project: dict[str, str] = dict.fromkeys(PROJECT_FIELDS, "")
        """Project, job, engineer and note for the calc record, typed once per session."""
        self.groups = self._find_groups()
        """Meaning key -> (check id, field name) of every shared field of that meaning, in display order."""
        self.shown: dict[str, dict[str, str]] = {spec.id: {} for spec in self.specs}
        """Check id -> group of alternatives -> the field shown and used there."""
        self._restore(data or SessionData({}))
        for spec in self.specs:
            self.hidden(spec.id)  # settles which alternative each group shows

    # Reading and saving

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
        self.project.update({k: v for k, v in data.project.items() if k in self.project})
        for check_id, shown in data.alternatives.items():
            if check_id in self.by_id:
                groups = _alternatives(self.by_id[check_id])
                self.shown[check_id] = {group: name for group, name in shown.items() if name in groups.get(group, ())}
        for key, members in self.groups.items():
            self._settle(key, members, data.shared.get(key))

    def _find_groups(self) -> dict[str, list[tuple[str, str]]]:
        """Meaning key -> (check id, field name) of every shared field of that meaning (two or more)."""
        groups: dict[str, list[tuple[str, str]]] = {}
        for spec in self.specs:
            for spec_field in spec.fields:
                if spec_field.shared and spec_field.meaning is not None:
                    groups.setdefault(spec_field.meaning.key, []).append((spec.id, spec_field.name))
        return {key: members for key, members in groups.items() if len(members) > 1}

    def _settle(self, key: str, members: list[tuple[str, str]], saved: str | None) -> None:
        """Give a shared meaning its one value; a check whose text differs keeps it as its own.

        The value is the saved one, else (an older session, or the demo) the text of the check on
        screen if it shows the field, else of the first check that does: nothing typed is lost.
        """
        following = [(check, name) for check, name in members if name not in self.own[check]]
        if saved is None:
            first = next((m for m in following if m[0] == self.current), following[0] if following else None)
            if first is None:
                return
            saved = self.texts[first[0]][first[1]]
            for check, name in following:
                if self.texts[check][name] != saved:
                    self.own[check].add(name)
        self.shared[key] = saved
        for check, name in members:
            if name not in self.own[check]:
                self.texts[check][name] = saved

    def snapshot(self) -> SessionData:
        """The session to save: each shared value once, every other text (and own values) per check."""
        linked = {(check, name) for members in self.groups.values() for check, name in members
                  if name not in self.own[check]}
        texts = {check: {name: text for name, text in fields.items() if (check, name) not in linked}
                 for check, fields in self.texts.items()}
        return SessionData(texts, self.system, self.current,
                           {check: sorted(names) for check, names in self.own.items() if names},
                           dict(self.shared), dict(self.project),
                           {check: dict(groups) for check, groups in self.shown.items() if groups})

    # Fields in use

    def hidden(self, check_id: str) -> set[str]:
        """Fields of a check not shown: those its choices do not use, and alternatives not shown.

        A group whose shown field is not known yet shows its first field in use that has a text,
        else its first field in use, and keeps that (a text shared in later must not switch it).
        """
        spec = self.by_id[check_id]
        texts = self.texts[check_id]
        unused = spec.unused(texts)
        others: set[str] = set()
        for group, members in _alternatives(spec).items():
            usable = [name for name in members if name not in unused]
            if not usable:
                continue
            shown = self.shown[check_id].get(group)
            if shown not in usable:
                shown = next((name for name in usable if texts.get(name, "").strip()), usable[0])
                if group not in self.shown[check_id]:
                    self.shown[check_id][group] = shown
            others.update(name for name in usable if name != shown)
        blanked = {name: "" if name in others else text for name, text in texts.items()}
        return others | set(spec.unused(blanked))

    def used_texts(self, check_id: str) -> dict[str, str]:
        """The check's texts with the hidden fields left empty: what is computed, sent from and recorded."""
        hidden = self.hidden(check_id)
        return {name: "" if name in hidden else text for name, text in self.texts[check_id].items()}

    def alternatives(self, check_id: str, name: str) -> list[str]:
        """The fields of ``name``'s group of alternatives that the check's choices use, in order."""
        spec = self.by_id[check_id]
        group = spec.field(name).group
        if group is None:
            return []
        unused = spec.unused(self.texts[check_id])
        return [member for member in _alternatives(spec).get(group, []) if member not in unused]

    def switch_alternative(self, check_id: str, name: str) -> str | None:
        """Show the next alternative of field ``name``'s group (texts are kept); return it, or None when
        the field has no alternative in use."""
        usable = self.alternatives(check_id, name)
        if len(usable) < 2 or name not in usable:
            return None
        following = usable[(usable.index(name) + 1) % len(usable)]
        self.shown[check_id][self.by_id[check_id].field(name).group or ""] = following
        return following

    # Typing and sharing

    def meaning_key(self, check_id: str, name: str) -> str | None:
        """The key of the shared value field ``name`` of ``check_id`` shows, or None."""
        spec_field = self._field(check_id, name)
        if spec_field is None or not spec_field.shared or spec_field.meaning is None:
            return None
        key = spec_field.meaning.key
        return key if key in self.shared else None

    def set_text(self, check_id: str, name: str, text: str) -> list[tuple[str, str]]:
        """Set one field's text; return the other (check, field) pairs that changed with it."""
        self.texts[check_id][name] = text
        key = self.meaning_key(check_id, name)
        if key is None or name in self.own[check_id] or self.shared[key] == text:
            return []
        self.shared[key] = text
        changed = []
        for other, field_name in self.sharing(check_id, name):
            if self.texts[other][field_name] != text:
                self.texts[other][field_name] = text
                changed.append((other, field_name))
        return changed

    def sharing(self, check_id: str, name: str) -> list[tuple[str, str]]:
        """The other (check, field) pairs showing the same shared value as this field (none if it is own)."""
        key = self.meaning_key(check_id, name)
        if key is None or name in self.own[check_id]:
            return []
        return [(check, field_name) for check, field_name in self.groups[key]
                if check != check_id and field_name not in self.own[check]]

    def partners(self, check_id: str, name: str) -> list[str]:
        """Other checks having a shared field of the same meaning (whether they follow it or not)."""
        key = self.meaning_key(check_id, name)
        return [] if key is None else [check for check, _ in self.groups[key] if check != check_id]

    def toggle_own(self, check_id: str, name: str) -> bool:
        """Give a shared field a value of its own in this check, or share it again; True if now own.

        Shared again, the field takes the session's shared value.
        """
        key = self.meaning_key(check_id, name)
        if key is None:
            return False
        if name in self.own[check_id]:
            self.own[check_id].discard(name)
            self.texts[check_id][name] = self.shared[key]
            return False
        self.own[check_id].add(name)
        return True

    # Sending

    def send_targets(self, check_id: str, result: Result) -> list[Target]:
        """Where each result with a meaning can go: fields of the same meaning in other checks.

        A check's alternatives (a stiffness or a static deflection) take one value: the first of the
        group that a result fills, in the check's field order; a target already showing the value
        is left out.
        """
        from fieldmode.tui.present import field_text  # loaded with the result sent

        candidates = [(check, index, spec_field, value)
                      for value in result.values.values() if value.meaning is not None and value.number() is not None
                      for check, index, spec_field in self._fields_meaning(value.meaning, check_id)]
        order = {spec.id: position for position, spec in enumerate(self.specs)}
        targets: list[Target] = []
        taken: set[tuple[str, str]] = set()
        for check, _, spec_field, value in sorted(candidates, key=lambda c: (order[c[0]], c[1])):
            key = self.meaning_key(check, spec_field.name)
            shared_key = key if key is not None and spec_field.name not in self.own[check] else None
            fields = ([(c, n) for c, n in self.groups[shared_key] if n not in self.own[c]] if shared_key
                      else [(check, spec_field.name)])
            fields = [(c, n) for c, n in fields if n not in self.by_id[c].unused(self.texts[c])]
            if not fields:
                continue
            slots = {(c, self.by_id[c].field(n).group or n) for c, n in fields}
            if slots & taken:
                continue
            taken |= slots
            number = value.number()
            assert number is not None and value.meaning is not None
            text = field_text(number, value.kind, self.system)
            current = self.texts[check][spec_field.name]
            if current == text:
                continue
            clears = [(c, sibling.name) for c, n in fields for sibling in self.by_id[c].fields
                      if spec_field.group and sibling.group == spec_field.group and sibling.name != n]
            targets.append(Target(value.meaning, value, text, fields, spec_field.label, current, clears))
        return targets

    def not_offered(self, check_id: str, result: Result) -> list[str]:
        """Fields of the same quantity as a sent result but of another object, said plainly."""
        sent = {value.meaning for value in result.values.values()
                if value.meaning is not None and value.number() is not None}
        others: dict[Meaning, list[str]] = {}
        for spec in self.specs:
            for spec_field in spec.fields:
                other = spec_field.meaning
                if spec.id != check_id and other is not None and other not in sent and any(
                        other.quantity == meaning.quantity for meaning in sent):
                    others.setdefault(other, []).append(spec.id)
        return [f"not sent: the {meaning} ({', '.join(dict.fromkeys(checks))}); type it there yourself if you "
                "mean this value" for meaning, checks in others.items()]

    def apply(self, targets: Iterable[Target]) -> list[Target]:
        """Put the ticked targets' texts into their fields; return those applied."""
        applied = []
        for target in targets:
            if not target.ticked:
                continue
            for check, name in target.fields:
                self.texts[check][name] = target.text
                group = self.by_id[check].field(name).group
                if group is not None:
                    self.shown[check][group] = name  # the row shows the value sent
                key = self.meaning_key(check, name)
                if key is not None and name not in self.own[check]:
                    self.shared[key] = target.text
            for check, name in target.clears:
                self.texts[check][name] = ""
            applied.append(target)
        return applied

    def _fields_meaning(self, meaning: Meaning, except_check: str) -> Iterable[tuple[str, int, Field]]:
        """(check id, position in the check, field) of every field of ``meaning`` outside ``except_check``."""
        for spec in self.specs:
            if spec.id == except_check:
                continue
            for index, spec_field in enumerate(spec.fields):
                if spec_field.meaning == meaning:
                    yield spec.id, index, spec_field

    def _field(self, check_id: str, name: str) -> Field | None:
        return next((f for f in self.by_id[check_id].fields if f.name == name), None)


def _alternatives(spec: CheckSpec) -> dict[str, list[str]]:
    """Group -> names of its fields, in the check's order (groups of two or more)."""
    groups: dict[str, list[str]] = {}
    for spec_field in spec.fields:
        if spec_field.group:
            groups.setdefault(spec_field.group, []).append(spec_field.name)
    return {group: names for group, names in groups.items() if len(names) > 1}
