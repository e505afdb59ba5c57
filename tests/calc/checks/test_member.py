"""Check `member`: elements, sections, presets, sending and bad input."""

from __future__ import annotations

import math

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from fieldmode.calc.checks import BY_ID
from fieldmode.calc.checks.member import ELEMENTS
from fieldmode.calc.framework.meaning import STRUCTURE, Meaning
from fieldmode.calc.framework.units import STANDARD_GRAVITY, InputError
from fieldmode.calc.physics import member

SPEC = BY_ID["member"]


BEAM = {"element": "beam", "length": "7.2 m", "material": "steel", "second_moment": "29000 cm^4",
        "mass_per_length": "1.2 t/m"}


# Demo beam: steel, 7.2 m span, I = 29000 cm^4, 1.2 t/m.
E, I, L, M = 210e9, 29000e-8, 7.2, 1200.0  # noqa: E741 (I is the second moment of area)


BASE = {
    "beam": BEAM,
    "columns": {"element": "columns", "count": "4", "length": "3.6 m", "material": "steel",
                "second_moment": "8360 cm^4"},
    "axial": {"element": "axial", "length": "3 m", "material": "steel", "section": "rectangle",
              "width": "100 mm", "depth": "20 mm"},
    "springs": {"element": "springs", "springs": "40 kN/mm, 25 kN/mm", "arrangement": "parallel"},
}


TEXTS = st.one_of(st.text(max_size=30), st.sampled_from(
    ["", "0", "-1", "1e15 km", "1e-300 mm", "1e15 GPa", "1e-15 um", "1e15 km^4", "1e15 t/m", "3 %",
     "rectangle", "hollow", "cantilever", "fixed", "series", "2.5", "1e15", "1e15 MN/mm, 1e-15 N/km"]))


def test_columns_of_a_storey() -> None:
    # Source: Chopra, Dynamics of Structures, sec. 1.3: storey stiffness sum of 12 EI/L^3 (fixed-fixed columns)
    result = SPEC.evaluate({"element": "columns", "count": "4", "length": "3.6 m", "material": "steel",
                            "second_moment": "8360 cm^4"})
    assert result.values["stiffness"].si() == pytest.approx(4 * 12 * 210e9 * 8360e-8 / 3.6**3)
    assert result.values["end_conditions"].si() == "fixed-fixed"
    cantilever = SPEC.evaluate({"element": "columns", "count": "4", "length": "3.6 m", "material": "steel",
                                "second_moment": "8360 cm^4", "end_conditions": "cantilever"})
    # Source: Chopra, Dynamics of Structures, sec. 1.3: a cantilever column 3 EI/L^3
    assert cantilever.values["stiffness"].si() == pytest.approx(4 * 3 * 210e9 * 8360e-8 / 3.6**3)


def test_axial_stiffness() -> None:
    # Source: Gere & Goodno, Mechanics of Materials, sec. 2.2: k = EA/L
    result = SPEC.evaluate({"element": "axial", "length": "3 m", "modulus": "200 GPa", "area": "5380 mm^2"})
    assert result.values["stiffness"].si() == pytest.approx(200e9 * 5380e-6 / 3.0)


def test_axial_area_from_a_hollow_circle() -> None:
    result = SPEC.evaluate({"element": "axial", "length": "3 m", "material": "steel", "section": "hollow-circle",
                            "diameter": "168.3 mm", "wall": "8 mm"})
    # Source: area of an annulus pi (D^2 - d^2) / 4
    area = math.pi * (0.1683**2 - 0.1523**2) / 4
    assert result.values["stiffness"].si() == pytest.approx(210e9 * area / 3.0)


@pytest.mark.parametrize(("arrangement", "expected"), [
    ("series", 1 / (1 / 40e6 + 1 / 25e6 + 1 / 100e6)),  # Source: Chopra, Dynamics of Structures, sec. 1.3
    ("parallel", 40e6 + 25e6 + 100e6),  # Source: Chopra, Dynamics of Structures, sec. 1.3
])
def test_springs(arrangement: str, expected: float) -> None:
    result = SPEC.evaluate({"element": "springs", "springs": "40 kN/mm, 25 kN/mm, 100000 kN/m",
                            "arrangement": arrangement})
    assert result.values["stiffness"].si() == pytest.approx(expected)


def test_section_fields_give_handbook_hollow_section() -> None:
    result = SPEC.evaluate({"element": "beam", "length": "4 m", "material": "steel", "section": "hollow-circle",
                            "diameter": "168.3 mm", "wall": "8 mm"})
    # From memory: SCI P363 (steel building design: design data), CHS 168.3 x 8.0: I = 1297 cm^4
    assert result.values["second_moment"].si() == pytest.approx(1297e-8, rel=1e-3)
    timber = SPEC.evaluate({"element": "beam", "length": "4 m", "material": "timber", "section": "rectangle",
                            "width": "75 mm", "depth": "225 mm"})
    # Source: b d^3 / 12 for a solid rectangle
    assert timber.values["second_moment"].si() == pytest.approx(0.075 * 0.225**3 / 12)


@pytest.mark.parametrize(("material", "gpa"), [
    ("steel", 210.0),  # Source: EN 1993-1-1:2005 3.2.6(1), E = 210000 N/mm^2
    ("concrete", 33.0),  # From memory: EN 1992-1-1:2004 Table 3.1, C30/37 Ecm = 33 GPa
    ("timber", 11.0),  # From memory: EN 338:2016 Table 1, C24 E0,mean = 11 kN/mm^2
    ("aluminium", 70.0),  # From memory: EN 1999-1-1:2007 3.2.5, E = 70000 N/mm^2
])
def test_material_presets_and_their_source_are_shown(material: str, gpa: float) -> None:
    result = SPEC.evaluate({**BEAM, "material": material})
    assert result.values["modulus"].si() == pytest.approx(gpa * 1e9)
    assert any(f"{gpa:g} GPa" in flag.text and "EN " in flag.text for flag in result.flags)


def test_simply_supported_beam_frequency_closed_form() -> None:
    # Source: Clough & Penzien, Dynamics of Structures, ch. 18; Blevins Table 8-1: f1 = pi/(2 L^2) sqrt(EI/m)
    expected = math.pi / (2 * L**2) * math.sqrt(E * I / M)
    assert member.beam_frequency(E, I, L, M) == pytest.approx(expected)
    result = SPEC.evaluate(BEAM)
    assert result.values["natural_frequency"].si() == pytest.approx(expected)
    assert result.values["mass"].si() == pytest.approx(M * L)


def test_rule_of_thumb_within_two_percent_of_exact() -> None:
    result = SPEC.evaluate(BEAM)
    # Source: uniform load deflection of a simply supported beam, 5 w L^4 / (384 EI)
    delta = 5 * M * STANDARD_GRAVITY * L**4 / (384 * E * I)
    assert result.values["self_weight_deflection"].si() == pytest.approx(delta)
    exact = result.values["natural_frequency"].si()
    # From memory: SCI P354 / P076: f ~ 18 / sqrt(delta in mm), within 2 % of the exact beam frequency
    assert result.values["rule_of_thumb_frequency"].si() == pytest.approx(exact, rel=0.02)
    # From memory: SCI P076: 17.75 / sqrt(delta_mm) is exact for a simply supported uniform beam
    assert member.frequency_rule_of_thumb(delta, 17.75) == pytest.approx(exact, rel=1e-3)
    # Source: AISC Design Guide 11 eq. 3-3: f = 0.18 sqrt(g / delta)
    assert 0.18 * math.sqrt(STANDARD_GRAVITY / delta) == pytest.approx(exact, rel=0.02)


def test_equivalent_mass_gives_the_beam_frequency_on_sdof() -> None:
    result = SPEC.evaluate(BEAM)
    sdof = BY_ID["sdof"].evaluate({"mass": f"{result.values['equivalent_mass'].si()} kg",
                                   "stiffness": f"{result.values['stiffness'].si()} N/m"})
    # Common practice (no source): the equivalent mass on the midspan stiffness reproduces f1 (k / w1^2)
    assert sdof.values["natural_frequency"].si() == pytest.approx(result.values["natural_frequency"].si())
    # From memory: Biggs, Introduction to Structural Dynamics, Table 5.1: ~0.49 of the beam mass at midspan
    assert result.values["equivalent_mass"].si() == pytest.approx(48 / math.pi**4 * M * L)


def test_stiffness_means_the_structures_not_the_mounts() -> None:
    # Common practice (no source): a beam under a machine is the structure's stiffness, a spring mount is not
    meaning = SPEC.evaluate(SPEC.demo_texts()).values["stiffness"].meaning
    assert meaning == Meaning("stiffness", STRUCTURE)
    assert BY_ID["sdof"].field("stiffness").meaning == BY_ID["forced"].field("stiffness").meaning == meaning
    assert BY_ID["isolate"].field("stiffness").meaning != meaning


def test_si_and_us_inputs_give_the_same_si_result() -> None:
    si = SPEC.evaluate({**BEAM, "count": "3", "material": "", "modulus": "210 GPa"})
    # Source: NIST SP 811 (2008), B.9: 1 ft = 0.3048 m, 1 in = 0.0254 m, 1 lb = 0.45359237 kg, 1 lbf = 4.4482216152605 N
    us = SPEC.evaluate({"element": "beam", "count": "3", "length": f"{7.2 / 0.3048!r} ft",
                        "modulus": f"{210e9 * 0.0254**2 / 4448.2216152605!r} ksi",
                        "second_moment": f"{29000e-8 / 0.0254**4!r} in^4",
                        "mass_per_length": f"{1200 / 0.45359237 * 0.3048!r} lb/ft"})
    for name, value in si.values.items():
        expected = value.si()
        assert us.values[name].si() == (expected if isinstance(expected, str) else pytest.approx(expected, rel=1e-9))


@pytest.mark.parametrize(("texts", "field"), [
    ({**BEAM, "length": "0 m"}, "Length"),
    ({**BEAM, "length": "-7.2 m"}, "Length"),
    ({**BEAM, "length": "12 kg"}, "Length"),
    ({**BEAM, "count": "0"}, "Number of members"),
    ({**BEAM, "count": "2.5"}, "Number of members"),
    ({**BEAM, "second_moment": "29000 cm^2"}, "Second moment"),
    ({**BEAM, "modulus": "210 GPa"}, "Young's modulus"),
    ({**BEAM, "material": "", "modulus": "-210 GPa"}, "Young's modulus"),
    ({**BEAM, "material": "granite"}, "Material"),
    ({**BEAM, "end_conditions": "cantilever"}, "End conditions"),
    ({**BEAM, "element": "columns", "end_conditions": "simply"}, "End conditions"),
    ({**BEAM, "mass_per_length": "0 kg/m"}, "Mass per length"),
    ({**BEAM, "second_moment": "", "section": "rectangle", "width": "100 mm"}, "Depth"),
    ({**BEAM, "second_moment": "", "section": "hollow-circle", "diameter": "100 mm", "wall": "60 mm"}, "Wall"),
    ({**BEAM, "second_moment": ""}, "Second moment"),
    ({"element": "axial", "length": "3 m", "material": "steel"}, "Area"),
    ({"element": "springs", "arrangement": "series"}, "Spring stiffnesses"),
    ({"element": "springs", "springs": "40 kN/mm, 0 kN/mm"}, "Spring stiffnesses"),
    ({"element": "springs", "springs": "40 kN/mm, 3 t"}, "Spring stiffnesses"),
    ({"element": "truss"}, "Element"),
])
def test_bad_input_names_the_field(texts: dict[str, str], field: str) -> None:
    with pytest.raises(InputError) as caught:
        SPEC.evaluate(texts)
    assert str(caught.value).startswith(field)


@settings(max_examples=300, deadline=None)
@given(element=st.sampled_from(ELEMENTS), field=st.sampled_from([f.name for f in SPEC.fields]), text=TEXTS)
def test_any_text_in_any_field_raises_only_input_error(element: str, field: str, text: str) -> None:
    texts = {**BASE[element], field: text}
    try:
        result = SPEC.evaluate(texts)
    except InputError:
        return
    assert math.isfinite(result.values["stiffness"].si())
