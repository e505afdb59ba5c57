"""The registry of checks: one spec per check, in the order they are listed and shown."""

from __future__ import annotations

from calc.checks import (
    decay,
    decrement,
    design_spectrum,
    footfall,
    forced,
    isolate,
    member,
    period,
    sdof,
    spectrum,
    storeys,
    tmd,
)
from calc.spec import CheckSpec

SPECS: tuple[CheckSpec, ...] = (
    sdof.SPEC,
    member.SPEC,
    forced.SPEC,
    isolate.SPEC,
    decay.SPEC,
    decrement.SPEC,
    period.SPEC,
    design_spectrum.SPEC,
    spectrum.SPEC,
    storeys.SPEC,
    tmd.SPEC,
    footfall.SPEC,
)
"""Every check, in display order. Add a new check's SPEC here."""

BY_ID: dict[str, CheckSpec] = {spec.id: spec for spec in SPECS}
