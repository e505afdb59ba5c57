"""Start the terminal app (`fieldmode` with no arguments).

Textual reads its settings from the environment when it is first imported, so the
defaults for work over SSH are set here before the app module (tui.field_app) loads.
"""

from __future__ import annotations

import os

QUIET_DEFAULTS = {"TEXTUAL_ANIMATIONS": "none", "TEXTUAL_FPS": "30"}
"""No animation and at most 30 redraws a second, unless the person set otherwise."""


def launch() -> int:
    """Open the app; return the exit status."""
    for name, value in QUIET_DEFAULTS.items():
        os.environ.setdefault(name, value)
    from tui.field_app import FieldApp

    result = FieldApp().run()
    return result if isinstance(result, int) else 0
