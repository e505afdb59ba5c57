"""Tables of typical values against the published sources."""

from __future__ import annotations

import math

import pytest

from fieldmode.calc.framework.kinds import KINDS
from fieldmode.calc.framework.units import read
from fieldmode.calc.typical_values import (
    ACTIVITY_BANDS,
    DAMPING,
    EN1991_LOG_DECREMENTS,
    FREQUENCY_BANDS,
    MODULUS,
    NEWMARK_HALL_DAMPING,
    YOUNGS_MODULI,
    choices_table,
    ratio_from_log_decrement,
    table_for,
)


@pytest.mark.parametrize(("material", "gpa"), [
    ("structural steel", 210),  # Source: EN 1993-1-1:2005 3.2.6(1), E = 210 000 N/mm^2
    ("aluminium alloys", 70),  # Source: EN 1999-1-1:2007 3.2.5, E = 70 000 N/mm^2
    ("concrete C25/30, Ecm", 31),  # Source: EN 1992-1-1:2004 Table 3.1, Ecm = 31 GPa
    ("concrete C30/37, Ecm", 33),  # Source: EN 1992-1-1:2004 Table 3.1, Ecm = 33 GPa
    ("concrete C40/50, Ecm", 35),  # Source: EN 1992-1-1:2004 Table 3.1, Ecm = 35 GPa
    ("softwood C24, E0,mean", 11),  # Source: EN 338:2016 Table 1, C24 E0,mean = 11.0 kN/mm^2
])
def test_youngs_moduli_match_the_standards(material, gpa):
    row = next(row for row in MODULUS.rows if row.description == material)
    assert read(row.fill, "modulus").si == pytest.approx(gpa * 1e9)
    assert dict((m, v) for m, v, _ in YOUNGS_MODULI)[material] == gpa


@pytest.mark.parametrize(("construction", "low", "high"), [
    # From memory: Chopra, Dynamics of Structures, Table 11.2.1 (Newmark & Hall recommended damping, %)
    ("welded steel, prestressed or well-reinforced concrete (slight cracking)", 2, 3),
    ("reinforced concrete with considerable cracking", 3, 5),
    ("bolted or riveted steel; timber with nailed or bolted joints", 5, 7),
    ("prestressed concrete with no prestress left", 7, 10),
    ("bolted or riveted steel; timber with bolted joints", 10, 15),
    ("timber with nailed joints", 15, 20),
])
def test_newmark_hall_damping_ranges(construction, low, high):
    entry = next(e for e in NEWMARK_HALL_DAMPING if e[1] == construction)
    assert entry[2:] == (low, high)
    row = next(row for row in DAMPING.rows if row.description.endswith(construction))
    assert read(row.fill, "ratio").si == pytest.approx(low / 100)
    assert "from memory" in row.source


@pytest.mark.parametrize(("structure", "decrement"), [
    # From memory: EN 1991-1-4:2005 Annex F, Table F.2 (structural logarithmic decrement delta_s)
    ("reinforced concrete buildings", 0.10),
    ("steel buildings", 0.05),
    ("mixed structures, concrete + steel", 0.08),
    ("steel bridges and lattice towers, welded", 0.02),
    ("parallel cables", 0.006),
])
def test_en1991_log_decrements_and_their_ratios(structure, decrement):
    assert dict(EN1991_LOG_DECREMENTS)[structure] == decrement
    row = next(row for row in DAMPING.rows if row.description == structure)
    # Source: Chopra, Dynamics of Structures, sec. 2.2: zeta = delta / sqrt(4 pi^2 + delta^2)
    assert read(row.fill, "ratio").si == pytest.approx(decrement / math.sqrt(4 * math.pi**2 + decrement**2), rel=5e-3)
    assert row.note == f"log decrement {decrement:g}"


def test_log_decrement_conversion_is_the_exact_relation():
    # Source: Chopra, Dynamics of Structures, sec. 2.2: delta = 2 pi zeta / sqrt(1 - zeta^2)
    for zeta in (0.005, 0.02, 0.1, 0.4):
        decrement = 2 * math.pi * zeta / math.sqrt(1 - zeta**2)
        assert ratio_from_log_decrement(decrement) == pytest.approx(zeta, rel=1e-12)


def test_walking_band_as_published():
    # Source: Eurocode serviceability teaching material (confirmed in one copy): pacing rate 1.7-2.4 Hz,
    # first-harmonic band 1.5-2.5 Hz
    bands = {activity: (low, high) for activity, low, high, _ in ACTIVITY_BANDS}
    assert bands["walking, pacing rate"] == (1.7, 2.4)
    assert bands["walking, first-harmonic band"] == (1.5, 2.5)
    # From memory: Setra footbridge guide (2006) maximum-risk ranges
    assert bands["footbridge vertical, maximum risk"] == (1.7, 2.1)
    assert bands["footbridge lateral, maximum risk"] == (0.5, 1.1)
    walking = next(row for row in FREQUENCY_BANDS.rows if row.description == "walking, pacing rate")
    assert read(walking.fill, "frequency").si == pytest.approx(2.05)


def test_every_row_fills_a_value_its_field_accepts_and_names_a_source():
    kinds = {"damping": "ratio", "modulus": "modulus", "activity": "frequency"}
    for table_id, table in {t.id: t for t in (DAMPING, MODULUS, FREQUENCY_BANDS)}.items():
        for row in table.rows:
            assert row.source
            assert read(row.fill, kinds[table_id]).si > 0


def test_table_for_a_field_by_name_and_kind():
    assert table_for("damping", "ratio") is DAMPING
    assert table_for("mount_damping", "ratio") is DAMPING
    assert table_for("target_isolation", "ratio") is None
    assert table_for("modulus", "modulus") is MODULUS
    assert table_for("operating_frequency", "frequency") is FREQUENCY_BANDS
    assert table_for("stiffness", "stiffness") is None
    assert all(kind in KINDS for kind in ("ratio", "modulus", "frequency"))
    picks = choices_table("Element", ("beam", "columns"))
    assert [row.fill for row in picks.rows] == ["beam", "columns"]


def test_balance_grades_by_machine_type():
    from fieldmode.calc.typical_values import BALANCE_GRADES

    assert table_for("grade", "text") is BALANCE_GRADES
    grades = {row.description: row.fill for row in BALANCE_GRADES.rows}
    # Source: ISO 21940-11:2016 Table 1 (confirmed in two reproductions): fans and pumps G 6.3, compressors and
    # turbines G 2.5
    assert grades["fans"] == grades["pumps"] == "G 6.3"
    assert grades["compressors"] == "G 2.5"
    assert all(row.source.startswith("ISO 21940-11") for row in BALANCE_GRADES.rows)
