"""Stiffness and mass of structural members: columns, beams, bars, springs, sections.

All functions take and return SI magnitudes (m, m^2, m^4, Pa, N/m, kg/m, Hz).
"""

from __future__ import annotations

import math
from collections.abc import Sequence
from dataclasses import dataclass

from fieldmode.calc.physics.constants import STANDARD_GRAVITY

KSI = 1000 * 4.4482216152605 / 0.0254**2
"""One ksi in Pa (1 lbf = 4.4482216152605 N, 1 in = 0.0254 m: NIST SP 811 (2008), B.9)."""


@dataclass(frozen=True)
class Modulus:
    """A preset Young's modulus E (Pa), as its source writes it, and the source."""

    value: float
    written: str
    source: str


@dataclass(frozen=True)
class Material:
    """A material preset: Young's modulus per unit system ("si", "us") with where each comes from; a
    material with one value has only "si", used in both systems."""

    name: str
    moduli: dict[str, Modulus]

    def modulus(self, system: str) -> Modulus:
        """The preset of the unit system in use (the SI one where the system has none of its own)."""
        return self.moduli.get(system, self.moduli["si"])


MATERIALS: dict[str, Material] = {m.name: m for m in (
    Material("steel", {"si": Modulus(210e9, "210 GPa", "structural steel, EN 1993-1-1:2005 3.2.6(1)"),
                       "us": Modulus(29_000 * KSI, "29,000 ksi", "structural steel, AISC 360, Specification "
                                                                "for Structural Steel Buildings (from memory)")}),
    Material("concrete", {"si": Modulus(33e9, "33 GPa", "concrete C30/37, Ecm, EN 1992-1-1:2004 Table 3.1")}),
    Material("timber", {"si": Modulus(11e9, "11 GPa", "softwood C24, E0,mean, EN 338:2016 Table 1")}),
    Material("aluminium", {"si": Modulus(70e9, "70 GPa", "aluminium alloys, EN 1999-1-1:2007 3.2.5(1)")}),
)}
"""Young's modulus presets (Pa) with their published source; steel follows the unit system in use."""


@dataclass(frozen=True)
class Support:
    """End conditions of a member and the handbook coefficients that go with them.

    ``stiffness`` is c in k = c EI/L^3 (at the top of a column, or at midspan of a
    beam); ``frequency`` is (beta L)^2 of the first bending mode (beams only);
    ``deflection`` is c in the largest deflection w L^4 / (c EI) under a uniform load.
    """

    name: str
    formula: str
    stiffness: float
    frequency: float | None = None
    deflection: float | None = None


COLUMN_SUPPORTS: dict[str, Support] = {s.name: s for s in (
    Support("fixed-fixed", "12 EI/L^3 (both ends fixed against rotation, top sways)", 12.0),
    Support("fixed-pinned", "3 EI/L^3 (fixed base, pinned top, top sways)", 3.0),
    Support("cantilever", "3 EI/L^3 (fixed base, free top)", 3.0),
)}
"""Lateral stiffness of one column under a load at its top."""

_PROPPED_PEAK = (15.0 - math.sqrt(33.0)) / 16.0
"""Where a propped cantilever under uniform load deflects most, as a fraction of the span from the fixed end."""

BEAM_SUPPORTS: dict[str, Support] = {s.name: s for s in (
    Support("simply-supported", "48 EI/L^3 at midspan", 48.0, math.pi**2, 384.0 / 5.0),
    Support("fixed-fixed", "192 EI/L^3 at midspan", 192.0, 4.730040745**2, 384.0),
    Support("fixed-pinned", "768/7 EI/L^3 at midspan", 768.0 / 7.0, 3.926602313**2,
            48.0 / (_PROPPED_PEAK**2 * (3.0 - 5.0 * _PROPPED_PEAK + 2.0 * _PROPPED_PEAK**2))),
)}
"""Midspan stiffness, first-mode frequency coefficient and uniform-load deflection of one beam."""


def column_stiffness(modulus: float, second_moment: float, length: float, support: str, count: int = 1) -> float:
    """Lateral stiffness (N/m) of ``count`` equal columns of height ``length`` sharing one storey."""
    return count * COLUMN_SUPPORTS[support].stiffness * modulus * second_moment / length**3


def beam_stiffness(modulus: float, second_moment: float, span: float, support: str, count: int = 1) -> float:
    """Stiffness (N/m) under a point load at midspan of ``count`` equal beams acting together."""
    return count * BEAM_SUPPORTS[support].stiffness * modulus * second_moment / span**3


def axial_stiffness(modulus: float, area: float, length: float, count: int = 1) -> float:
    """Axial stiffness EA/L (N/m) of ``count`` equal bars side by side."""
    return count * modulus * area / length


def springs_in_series(stiffnesses: Sequence[float]) -> float:
    """Stiffness (N/m) of springs one after another: 1/k = sum(1/k_i)."""
    return 1.0 / sum(1.0 / k for k in stiffnesses)


def springs_in_parallel(stiffnesses: Sequence[float]) -> float:
    """Stiffness (N/m) of springs side by side: k = sum(k_i)."""
    return float(sum(stiffnesses))


def rectangle_second_moment(width: float, depth: float) -> float:
    """I = b d^3 / 12 (m^4) of a solid rectangle bending about the axis across its depth."""
    return width * depth**3 / 12.0


def rectangle_area(width: float, depth: float) -> float:
    """Area b d (m^2) of a solid rectangle."""
    return width * depth


def circle_second_moment(diameter: float, wall: float | None = None) -> float:
    """I = pi (D^4 - d^4) / 64 (m^4) of a solid (no ``wall``) or hollow circle."""
    inner = 0.0 if wall is None else diameter - 2.0 * wall
    return math.pi * (diameter**4 - inner**4) / 64.0


def circle_area(diameter: float, wall: float | None = None) -> float:
    """Area pi (D^2 - d^2) / 4 (m^2) of a solid (no ``wall``) or hollow circle."""
    inner = 0.0 if wall is None else diameter - 2.0 * wall
    return math.pi * (diameter**2 - inner**2) / 4.0


def beam_frequency(modulus: float, second_moment: float, span: float, mass_per_length: float,
                   support: str = "simply-supported") -> float:
    """First natural frequency (Hz) of a uniform beam: f1 = (beta L)^2 / (2 pi L^2) sqrt(EI/m).

    For a simply supported beam (beta L)^2 = pi^2, so f1 = (pi / (2 L^2)) sqrt(EI/m).
    """
    coefficient = BEAM_SUPPORTS[support].frequency
    assert coefficient is not None
    return coefficient / (2.0 * math.pi * span**2) * math.sqrt(modulus * second_moment / mass_per_length)


def self_weight_deflection(modulus: float, second_moment: float, span: float, mass_per_length: float,
                           support: str = "simply-supported") -> float:
    """Largest deflection (m) of a uniform beam under its own weight m g0 per length."""
    coefficient = BEAM_SUPPORTS[support].deflection
    assert coefficient is not None
    return mass_per_length * STANDARD_GRAVITY * span**4 / (coefficient * modulus * second_moment)


def frequency_rule_of_thumb(deflection: float, coefficient: float = 18.0) -> float:
    """Floor rule of thumb f ~ 18 / sqrt(delta in mm) (Hz) from the self-weight deflection ``deflection`` (m).

    ``coefficient`` 17.75 is exact for a simply supported uniform beam.
    """
    return coefficient / math.sqrt(deflection * 1000.0)


def equivalent_mass(stiffness: float, frequency: float) -> float:
    """Mass (kg) that on ``stiffness`` (N/m) oscillates at ``frequency`` (Hz): k / (2 pi f)^2."""
    return stiffness / (2.0 * math.pi * frequency) ** 2
