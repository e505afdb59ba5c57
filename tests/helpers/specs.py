"""Check specs made for tests from the registered ones."""

from __future__ import annotations

import dataclasses

from fieldmode.calc.checks import sdof

TWIN = dataclasses.replace(sdof.SPEC, id="sdof-b", title="Second mass")
"""A second single-mass check: the same fields, so sharing and sending between two checks can be tested."""
