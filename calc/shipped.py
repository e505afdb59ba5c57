"""Files shipped with the package (the demo records in calc/data)."""

from __future__ import annotations

from importlib.resources import files
from pathlib import Path


def shipped_file(name: str) -> Path:
    """Absolute path of ``calc/data/<name>`` as installed."""
    return Path(str(files("calc").joinpath("data", name)))
