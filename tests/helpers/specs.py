"""Check specs made for tests from the registered ones."""

from __future__ import annotations

import dataclasses

from fieldmode.calc.checks import sdof
from fieldmode.calc.framework.spec import Field

TWIN = dataclasses.replace(sdof.SPEC, id="sdof-b", title="Second mass")
"""A second single-mass check: the same fields, so sharing and sending between two checks can be tested."""

SUPPORTED = dataclasses.replace(
    sdof.SPEC, id="sdof-s", title="Mass on a chosen support",
    fields=(Field("support", "Support", "choice", "rigid", choices=("rigid", "springs")),
            *(dataclasses.replace(f, used_when={"support": ("springs",)}) if f.group == "stiffness" else f
              for f in sdof.SPEC.fields)))
"""A single mass whose support choice decides whether its stiffness is used: a field a choice hides."""
