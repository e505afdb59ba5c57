"""Chart functions per check, drawn with plotext inside the app.

Each check id maps to a tuple of draw functions; each draws one chart panel from a
Result onto a plotext-like object ``plt`` (the ``plt`` of a textual-plotext
``PlotextPlot``). A draw function never computes physics: it plots ``result.series``
and marks values from ``result.values``.
"""

from __future__ import annotations

from collections.abc import Callable
from typing import Any

from calc.result import Result
from tui.charts import decay, design_spectrum, footfall, forced, isolate, period, sdof, spectrum, storeys, tmd

DrawFunction = Callable[[Any, Result, str], None]
"""draw(plt, result, system) where system is 'si' or 'us'."""

CHARTS: dict[str, tuple[DrawFunction, ...]] = {
    "sdof": (sdof.draw_free_response,),
    "forced": (forced.draw_amplification, forced.draw_phase),
    "isolate": (isolate.draw_transmissibility,),
    "decay": (decay.draw_record, decay.draw_spectrum),
    "period": (period.draw_period,),
    "design-spectrum": (design_spectrum.draw_spectrum,),
    "spectrum": (spectrum.draw_psa, spectrum.draw_history, spectrum.draw_record),
    "storeys": (storeys.draw_mode_shapes,),
    "tmd": (tmd.draw_response, tmd.draw_mistuning),
    "footfall": (footfall.draw_vertical, footfall.draw_lateral),
}
"""Check id -> its chart panels, in the order they are shown."""
