"""The registry of checks: one spec per check, in the order they are listed and shown.

Each check lives in ``calc/checks/<id with underscores>.py`` and defines ``SPEC``.
``SPECS`` and ``BY_ID`` import every check on first use; :func:`load` imports one,
which keeps a single command-line check quick to start.
"""

from __future__ import annotations

import importlib
from typing import TYPE_CHECKING

if TYPE_CHECKING:
    from calc.spec import CheckSpec

    SPECS: tuple[CheckSpec, ...]
    BY_ID: dict[str, CheckSpec]

CHECK_IDS: tuple[str, ...] = (
    "sdof", "member", "forced", "isolate", "decay", "decrement", "period", "design-spectrum", "spectrum",
    "storeys", "tmd", "footfall",
)
"""Every check id, in display order. Add a new check's id here."""


def load(check_id: str) -> CheckSpec:
    """The spec of one check, importing only its module."""
    if check_id not in CHECK_IDS:
        raise KeyError(check_id)
    spec: CheckSpec = importlib.import_module(f"calc.checks.{check_id.replace('-', '_')}").SPEC
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
