"""The registry of checks: one spec per check, in the order they are listed and shown.

Each check lives in ``calc/checks/<module>.py`` (its id with underscores, :func:`module_name`)
and defines ``SPEC``; its chart panels live in ``tui/charts/<module>.py`` under the same name.
``SPECS`` and ``BY_ID`` import every check on first use; :func:`load` imports one, which keeps
a single command-line check quick to start.
"""

from __future__ import annotations

import importlib
from typing import TYPE_CHECKING

if TYPE_CHECKING:
    from fieldmode.calc.framework.spec import CheckSpec

    SPECS: tuple[CheckSpec, ...]
    BY_ID: dict[str, CheckSpec]

CHECK_IDS: tuple[str, ...] = (
    "sdof", "member", "forced", "isolate", "decay", "decrement", "period", "design-spectrum", "spectrum",
    "ppv", "ppv-distance", "occupants", "machine",
    "storeys", "tmd", "footfall", "floor", "footbridge",
)
"""Every check id, in display order. Add a new check's id here."""


def module_name(check_id: str) -> str:
    """The module name of a check (and of its chart panels): its id with underscores."""
    if check_id not in CHECK_IDS:
        raise KeyError(check_id)
    return check_id.replace("-", "_")


def load(check_id: str) -> CheckSpec:
    """The spec of one check, importing only its module."""
    spec: CheckSpec = importlib.import_module(f"fieldmode.calc.checks.{module_name(check_id)}").SPEC
    return spec


def __getattr__(name: str) -> object:
    """``SPECS`` (every spec, in order) and ``BY_ID`` (id -> spec), built on first use."""
    if name == "SPECS":
        specs = tuple(load(check_id) for check_id in CHECK_IDS)
        globals()["SPECS"] = specs
        return specs
    if name == "BY_ID":
        by_id = {check_id: load(check_id) for check_id in CHECK_IDS}
        globals()["BY_ID"] = by_id
        return by_id
    raise AttributeError(name)
