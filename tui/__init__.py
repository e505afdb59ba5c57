"""Everything a person touches: the command line, the terminal app, charts and session files.

Textual reads its settings from the environment when it is first imported, and every module of
the app imports this package first: the defaults for work over SSH are set here (no animation,
at most 30 redraws a second), unless the person set otherwise.
"""

import os

for _name, _value in {"TEXTUAL_ANIMATIONS": "none", "TEXTUAL_FPS": "30"}.items():
    os.environ.setdefault(_name, _value)
