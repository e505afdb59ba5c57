"""Notes for inputs that can be right but seldom are: most often a slip of unit.

Each threshold is a constant here with the reason for it; a check adds the note (a caution) to its
flags. The thresholds are choices of ours from common practice, set so that ordinary site values
(and the demo) are not flagged; a note never stops a check.
"""

from __future__ import annotations

from fieldmode.calc.framework.result import Flag

STATIC_DEFLECTION_LIMIT = 0.100
"""Static deflection (m) under the mass's own weight above which a note is given: 100 mm is a natural
frequency of 1.58 Hz (15.76/sqrt(100)) for a mass on a spring. Floors, plinths and machine mounts are
stiffer (steel springs under machines deflect about 25-50 mm); more is most often a stiffness typed in
N/mm where kN/mm was meant (1000 times softer)."""

OPERATING_FREQUENCY_LIMIT = 100.0
"""Operating frequency (Hz) above which a note is given: 6000 rpm, above the speeds of the fans, pumps,
motors and compressors usually checked on floors and mounts (up to 3600 rpm); more is most often a speed
in rpm typed into a field whose bare number is Hz."""

PERIOD_PER_STOREY = 0.1
"""Fundamental period per storey (s) of the rule of thumb T = 0.1 N (ASCE 7-16 eq. 12.8-8 for moment
frames, from memory)."""
PERIOD_FACTOR = 5.0
"""A fundamental period more than this many times 0.1 N, or less than 0.1 N over it, gets a note: a storey
stiffness in N/mm for kN/mm, or a mass in kg for t, moves the period 31.6 times."""

MODULUS_RANGE = (1e9, 250e9)
"""Young's modulus (Pa) outside which a typed E gets a note: structural steel, the stiffest common
structural material, is about 200-210 GPa; timber along the grain and concrete are 7-45 GPa. Outside
1-250 GPa is most often a unit slip (210 typed as MPa)."""

STOREY_HEIGHT_RANGE = (2.0, 10.0)
"""Storey height (m) outside which a note is given: storeys are usually 2.5-6 m, tall ground storeys up
to about 10 m; a height in feet or millimetres read as metres falls outside."""


def static_deflection(deflection: float, typed: str) -> Flag | None:
    """A note when the deflection (m) under the mass's own weight is over 100 mm.

    ``typed`` names what to check: 'the stiffness unit', 'the deflection unit' or a sentence.
    """
    if deflection <= STATIC_DEFLECTION_LIMIT:
        return None
    return Flag("caution", f"static deflection {deflection * 1000:.4g} mm under the mass's own weight is over "
                           f"{STATIC_DEFLECTION_LIMIT * 1000:.0f} mm: check {typed}")


def operating_frequency(frequency: float) -> Flag | None:
    """A note when the operating frequency (Hz) is over 100 Hz (6000 rpm)."""
    if frequency <= OPERATING_FREQUENCY_LIMIT:
        return None
    return Flag("caution", f"operating frequency {frequency:.4g} Hz is {60 * frequency:.5g} rpm, over "
                           f"{OPERATING_FREQUENCY_LIMIT:.0f} Hz: check the unit (a speed in rpm needs 'rpm')")


def storey_period(period: float, storeys: int) -> Flag | None:
    """A note when the fundamental period (s) is far from 0.1 s per storey."""
    rule = PERIOD_PER_STOREY * storeys
    if rule / PERIOD_FACTOR <= period <= PERIOD_FACTOR * rule:
        return None
    side = f"more than {PERIOD_FACTOR:g} times" if period > rule else f"less than 1/{PERIOD_FACTOR:g} of"
    return Flag("caution", f"fundamental period {period:.4g} s is {side} the rule of thumb 0.1 N = {rule:.2g} s "
                           f"({storeys} storeys; ASCE 7-16 eq. 12.8-8, from memory): check the stiffness and mass "
                           "units")


def modulus(value: float) -> Flag | None:
    """A note when a typed Young's modulus (Pa) is outside 1-250 GPa."""
    low, high = MODULUS_RANGE
    if low <= value <= high:
        return None
    return Flag("caution", f"E = {value / 1e9:.4g} GPa is outside {low / 1e9:g}-{high / 1e9:g} GPa "
                           "(steel is about 200-210 GPa): check the unit")


def storey_heights(heights: list[float]) -> Flag | None:
    """A note naming the storeys whose height (m) is outside 2-10 m."""
    low, high = STOREY_HEIGHT_RANGE
    odd = [n for n, height in enumerate(heights, start=1) if not low <= height <= high]
    if not odd:
        return None
    names = ", ".join(str(n) for n in odd)
    storeys = "storey" if len(odd) == 1 else "storeys"
    return Flag("caution", f"storey height outside {low:g}-{high:g} m in {storeys} {names}: check the height unit")
