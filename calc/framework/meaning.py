"""What a field or a result means: which physical quantity of which object.

A value moves between checks (shared fields, values sent with F8) only between fields and results of
the same meaning: a structure's natural frequency never becomes a machine's operating frequency, a
measured damping never becomes the damping a seismic code fixes, a floor beam's stiffness never
becomes a mount's.
"""

from __future__ import annotations

from dataclasses import dataclass

STRUCTURE = "structure"
"""The structure studied, as one mode or single mass: a floor, mezzanine, footbridge or beam."""
MACHINE = "machine"
"""A machine: its running speed, its mass on mounts, its out-of-balance."""
MOUNTS = "mounts"
"""The resilient mounts a machine stands on."""
BUILDING = "building"
"""The building in the seismic checks: its height, period, masses and storeys, damping and q."""
SEISMIC_ACTION = "seismic action"
"""The code's seismic action: ground type, spectrum type and shape, ground acceleration."""

DAMPING_RATIO = "damping ratio"
"""The quantity of a damping field: a bare number above 1 typed into it is read as a percentage."""

OBJECTS: dict[str, str] = {
    STRUCTURE: "the structure studied (one mode or single mass)",
    MACHINE: "the machine",
    MOUNTS: "the machine's mounts",
    BUILDING: "the building (seismic checks)",
    SEISMIC_ACTION: "the code's seismic action",
}


@dataclass(frozen=True)
class Meaning:
    """A physical quantity of an object, e.g. the natural frequency of the structure."""

    quantity: str
    of: str

    @property
    def key(self) -> str:
        """Stable text naming the meaning, as the session file stores it (e.g. 'structure: damping ratio')."""
        return f"{self.of}: {self.quantity}"

    def __str__(self) -> str:
        return f"{self.quantity} of {OBJECTS[self.of]}"
