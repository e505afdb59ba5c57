"""The registry of checks: one spec per check, in the order they are listed and shown."""

from __future__ import annotations

from calc.checks import decay, decrement, sdof
from calc.spec import CheckSpec

SPECS: tuple[CheckSpec, ...] = (
    sdof.SPEC,
    decay.SPEC,
    decrement.SPEC,
)
"""Every check, in display order. Add a new check's SPEC here."""

BY_ID: dict[str, CheckSpec] = {spec.id: spec for spec in SPECS}
