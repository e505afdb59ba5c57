"""Invented demo data shipped with the package: records the demo scenario opens on, and their generators.

A field names a shipped record by its short name, ``demo:heel_drop_demo.csv`` (:func:`demo_name`),
so the demo, the command line and the calc record never show where the package is installed.
"""

from __future__ import annotations

from importlib.resources import files
from pathlib import Path

HEEL_DROP = "heel_drop_demo.csv"
"""Demo decay record (calc/demo/heel_drop.py writes it)."""
GROUND_MOTION = "ground_motion_demo.csv"
"""Demo accelerogram (calc/demo/ground_motion.py writes it)."""
LIVELY_FLOOR = "lively_floor_demo.csv"
"""Demo acceleration record of a lively office floor (calc/demo/lively_floor.py writes it)."""
SHEET_PILING = "sheet_piling_demo.csv"
"""Demo construction-vibration record (calc/demo/sheet_piling.py writes it)."""
DEMO_FILES = (HEEL_DROP, GROUND_MOTION, LIVELY_FLOOR, SHEET_PILING)
"""Every shipped demo record."""
PREFIX = "demo:"
"""A path typed as ``demo:NAME`` is the shipped demo record NAME."""


def demo_file(name: str) -> Path:
    """Absolute path of the shipped demo file ``name`` as installed."""
    return Path(str(files("fieldmode.calc.demo").joinpath("data", name)))


def write_demo(name: str, text: str) -> int:
    """Write a generated demo record ``name`` into the package's data folder (a generator's ``main``)."""
    path = Path(__file__).resolve().parent / "data" / name
    path.parent.mkdir(exist_ok=True)
    path.write_text(text, encoding="utf-8")
    print(f"wrote {path}")
    return 0


def demo_name(name: str) -> str:
    """The short name a field shows for the shipped demo file ``name``, e.g. 'demo:heel_drop_demo.csv'."""
    return PREFIX + name


def demo_path(text: str) -> Path | None:
    """The shipped file a typed ``demo:NAME`` names; None for text that does not start with 'demo:'.

    Raises LookupError for 'demo:' followed by anything but a shipped record's name.
    """
    if not text.startswith(PREFIX):
        return None
    name = text[len(PREFIX):].strip()
    if name not in DEMO_FILES:
        shipped = ", ".join(demo_name(known) for known in DEMO_FILES)
        raise LookupError(f"no demo record {name!r}: the shipped ones are {shipped}")
    return demo_file(name)
