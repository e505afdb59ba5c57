"""Completion of file paths typed in a field, from the file system."""

from __future__ import annotations

import os

from textual.suggester import Suggester

MAX_ENTRIES = 500
"""Entries of one folder looked at for a completion, at most."""


class PathSuggester(Suggester):
    """Suggests the first file or folder whose name starts with what was typed."""

    def __init__(self) -> None:
        super().__init__(use_cache=False, case_sensitive=True)

    async def get_suggestion(self, value: str) -> str | None:
        return suggest_path(value)


def suggest_path(value: str) -> str | None:
    """The completed path for ``value`` (a folder gets a trailing separator), or None."""
    if not value or "\0" in value or len(value) > 4096:
        return None
    folder, prefix = os.path.split(value)
    listing = os.path.expanduser(folder) if folder else "."
    try:
        with os.scandir(listing) as entries:
            names = []
            for index, entry in enumerate(entries):
                if index >= MAX_ENTRIES:
                    break
                if entry.name.startswith(prefix) and (prefix.startswith(".") or not entry.name.startswith(".")):
                    names.append((entry.name, entry.is_dir()))
    except OSError:
        return None
    if not names:
        return None
    name, is_dir = min(names)
    completed = os.path.join(folder, name) if folder else name
    return completed + os.sep if is_dir else completed
