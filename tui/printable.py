"""Text from files, sessions and people made safe to show on a terminal.

A record's header, a cell, a file name or a session text can hold terminal control sequences
(escape, bell, carriage return, the C1 controls); written raw they garble or wipe the screen.
:func:`printable` writes each such character as a visible escape ('\\x1b') instead.
"""

from __future__ import annotations

import re

_CONTROL = re.compile(r"[\x00-\x08\x0b-\x1f\x7f-\x9f]")
_CONTROL_OR_NEWLINE = re.compile(r"[\x00-\x1f\x7f-\x9f]")


def printable(text: str, keep_newlines: bool = False) -> str:
    """``text`` with every control character (and, unless kept, line breaks) shown as an escape."""
    pattern = _CONTROL if keep_newlines else _CONTROL_OR_NEWLINE
    return pattern.sub(lambda match: f"\\x{ord(match.group()):02x}", text)
