"""Start the terminal app (`fieldmode` with no arguments).

Textual reads its settings from the environment when it is first imported, so the
defaults for work over SSH are set here before the app module (tui.field_app) loads.

Start-up time is budgeted (DESIGN.md section 7). The results of the first screen are
computed by a helper process while this one loads Textual (tui/prestart.py). Until the
first results are on screen the program only builds objects that live as long as it does
(modules, the widgets), so the cyclic garbage collector, which would walk them again and
again, is paused until then; they are then frozen out of its way (gc.freeze), which also
keeps later collections, and the exit, short.
"""

from __future__ import annotations

import gc
import os
from collections.abc import Callable
from pathlib import Path
from typing import TYPE_CHECKING

if TYPE_CHECKING:
    from tui.field_app import FieldApp

QUIET_DEFAULTS = {"TEXTUAL_ANIMATIONS": "none", "TEXTUAL_FPS": "30"}
"""No animation and at most 30 redraws a second, unless the person set otherwise."""
LEAN_DEFAULTS = {"OPENBLAS_NUM_THREADS": "1"}
"""One BLAS thread: the app's arrays are small, and starting a thread pool when numpy loads
costs start-up time (about a tenth of numpy's import here). A value set by the person is kept."""


def launch(state_folder: Path | None = None, on_first_frame: Callable[[FieldApp], None] | None = None,
           headless: bool = False, size: tuple[int, int] | None = None) -> int:
    """Open the app; return the exit status.

    ``on_first_frame`` is called once the first results are on screen (the start-up
    benchmark quits there); ``headless`` and ``size`` are passed to ``App.run``.
    """
    for name, value in {**QUIET_DEFAULTS, **LEAN_DEFAULTS}.items():
        os.environ.setdefault(name, value)
    collecting = gc.isenabled()
    gc.disable()

    def first_frame(app: FieldApp) -> None:
        if collecting:
            gc.freeze()
            gc.enable()
        if on_first_frame is not None:
            on_first_frame(app)

    try:
        from tui import prestart
        from tui.session import SessionStore, state_dir

        folder = state_folder if state_folder is not None else state_dir()
        loaded = SessionStore(folder).load()
        helper = prestart.start(loaded.data)  # loads the core and computes the first results meanwhile
        from tui.field_app import FieldApp

        specs = helper.outlines() if helper is not None else None
        first = helper.first if helper is not None and specs is not None else None
        app = FieldApp(specs, folder, on_first_frame=first_frame, loaded=loaded, first=first)
        try:
            result = app.run(headless=headless, size=size)
        finally:
            if helper is not None:
                helper.close()
    finally:
        if collecting:
            gc.enable()
    return result if isinstance(result, int) else 0
