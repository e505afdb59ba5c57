"""Chart panels per check, drawn with plotext inside the app.

A check's panels live in ``tui/charts/<module>.py``, the module named as the check's own
(:func:`fieldmode.calc.checks.module_name`), as ``PANELS``: a tuple of draw functions, each
drawing one panel from a Result onto a plotext-like object ``plt`` (the ``plt`` of a
textual-plotext ``PlotextPlot``). A draw function never computes physics: it plots the
check's declared series and marks values of its results. A check without a module here has
no chart.

:func:`panels_of` hands out each draw function wrapped by :func:`common.readable`, which gives every axis
the panel did not tick itself round tick values (1-2-2.5-5 steps; 1-2-5 on log axes).
"""

from __future__ import annotations

import importlib
from collections.abc import Callable
from typing import Any

from fieldmode.calc.checks import module_name
from fieldmode.calc.framework.result import Result

DrawFunction = Callable[[Any, Result, str], None]
"""draw(plt, result, system) where system is 'si' or 'us'."""


def panels_of(check_id: str) -> tuple[DrawFunction, ...]:
    """The chart panels of a check, in the order they are shown (none when it has no chart)."""
    name = f"fieldmode.tui.charts.{module_name(check_id)}"
    try:
        module = importlib.import_module(name)
    except ModuleNotFoundError as missing:
        if missing.name != name:
            raise
        return ()
    from fieldmode.tui.charts.common import readable

    panels: tuple[DrawFunction, ...] = tuple(readable(draw) for draw in module.PANELS)
    return panels
