"""Invented demo data shipped with the package: records the demo scenario opens on, and their generators."""

from __future__ import annotations

from importlib.resources import files
from pathlib import Path

HEEL_DROP = "heel_drop_demo.csv"
"""Demo decay record (calc/demo/heel_drop.py writes it)."""
GROUND_MOTION = "ground_motion_demo.csv"
"""Demo accelerogram (calc/demo/ground_motion.py writes it)."""


def demo_file(name: str) -> Path:
    """Absolute path of the shipped demo file ``name`` as installed."""
    return Path(str(files("fieldmode.calc.demo").joinpath("data", name)))
