"""The declarative check: which fields a check's choices use (Field.used_when, CheckSpec.unused)."""

from __future__ import annotations

import dataclasses

import pytest

from fieldmode.calc.checks import BY_ID
from fieldmode.calc.framework.spec import CheckSpec, Field, either

MEMBER = BY_ID["member"]
TMD = BY_ID["tmd"]

# What each element needs, from its formula (Common practice (no source) for the list itself):
# beam 48 EI/L^3 and f1 from m (Roark Table 8.1, Blevins Table 8-1), columns 12 EI/L^3 (Chopra sec. 1.3),
# axial EA/L (Gere & Goodno), springs 1/k = sum 1/k_i (Chopra sec. 1.3).
USED = {
    "beam": {"element", "end_conditions", "count", "length", "material", "modulus", "second_moment", "section",
             "mass_per_length"},
    "columns": {"element", "end_conditions", "count", "length", "material", "modulus", "second_moment", "section"},
    "axial": {"element", "count", "length", "material", "modulus", "section", "area"},
    "springs": {"element", "springs", "arrangement"},
}


@pytest.mark.parametrize("element", USED)
def test_each_element_uses_only_the_fields_its_formula_needs(element: str) -> None:
    names = {f.name for f in MEMBER.fields}
    unused = MEMBER.unused({"element": element})
    assert names - set(unused) == USED[element]


@pytest.mark.parametrize(("section", "dimensions"), [("rectangle", {"width", "depth"}),
                                                      ("solid-circle", {"diameter"}),
                                                      ("hollow-circle", {"diameter", "wall"})])
def test_a_section_shape_uses_only_its_dimensions(section: str, dimensions: set[str]) -> None:
    # Common practice (no source): b x d for a rectangle, D for a circle, D and t for a tube
    every = {"width", "depth", "diameter", "wall"}
    unused = MEMBER.unused({"element": "beam", "section": section})
    assert every - set(unused) == dimensions
    assert every <= set(MEMBER.unused({"element": "springs", "section": section}))  # springs have no section


def test_the_reason_names_the_choice_and_what_it_is() -> None:
    unused = MEMBER.unused({"element": "axial"})
    assert unused["mass_per_length"] == "used only when element is beam (here axial)"
    assert unused["width"] == "used only when section shape is rectangle (here not given)"
    assert MEMBER.unused({"element": "springs"})["width"] == (
        "used only when element is beam, columns or axial (here springs)")


def test_an_empty_choice_counts_as_its_default_where_the_check_says_so() -> None:
    assert set(TMD.unused({"excitation": ""})) == {"ground_acceleration"}  # force is the default excitation
    assert set(TMD.unused({"excitation": "ground"})) == {"force"}
    assert set(TMD.unused({"excitation": "g"})) == {"force"}  # a unique start picks the choice, as reading does


def test_a_choice_that_picks_nothing_keeps_every_field() -> None:
    # its own error is shown; nothing is hidden behind it (the dimensions follow the section shape, not given)
    assert set(MEMBER.unused({"element": "girder", "section": "rectangle"})) == {"diameter", "wall"}


def test_a_used_when_naming_no_earlier_choice_is_refused() -> None:
    choice = Field("mode", "Mode", "choice", "a", choices=("a", "b"))
    other = Field("x", "X", "length", used_when={"mode": ("a",)})
    CheckSpec("t", "T", "t", (choice, other), compute=lambda inputs: None)  # type: ignore[arg-type,return-value]
    for fields in ((other, choice), (choice, dataclasses.replace(other, used_when={"mode": ("c",)})),
                   (choice, dataclasses.replace(other, used_when={"x": ("a",)}))):
        with pytest.raises(ValueError, match="not an earlier choice field"):
            CheckSpec("t", "T", "t", fields, compute=lambda inputs: None)  # type: ignore[arg-type,return-value]


def test_either_lists_words_as_a_sentence_does() -> None:
    assert [either(words) for words in ([], ["a"], ["a", "b"], ["a", "b", "c"])] == ["", "a", "a or b", "a, b or c"]


def test_a_field_the_choice_does_not_use_is_not_read_and_is_noted() -> None:
    texts = {"element": "columns", "length": "3.6 m", "material": "steel", "second_moment": "8360 cm^4",
             "mass_per_length": "not a mass", "springs": "1 kN/mm"}
    inputs, errors = MEMBER.read(texts)
    assert errors == {}  # bad text in a field columns do not use is not read
    assert not inputs.has("mass_per_length") and set(inputs.ignored) == {"mass_per_length", "springs"}
    result = MEMBER.compute(inputs)
    notes = [flag for flag in result.flags if "ignored" in flag.text]
    assert [flag.level for flag in notes] == ["caution", "caution"]
    assert "Mass per length ignored: used only when element is beam (here columns)" in [f.text for f in notes]
    # Source: Chopra, Dynamics of Structures, sec. 1.3: a fixed-fixed column k = 12 EI / h^3
    assert result.number("stiffness") == pytest.approx(12 * 210e9 * 8360e-8 / 3.6**3)


def test_a_field_hidden_by_the_choice_is_neither_required_nor_an_alternative() -> None:
    texts = {"element": "axial", "length": "3 m", "material": "steel", "section": "rectangle", "width": "100 mm",
             "depth": "20 mm", "second_moment": "8360 cm^4"}
    inputs, errors = MEMBER.read(texts)
    assert errors == {}  # I beside a section would be 'give only one of'; an axial bar does not use I
    # Source: Gere & Goodno, Mechanics of Materials: axial stiffness EA/L, A = b d
    assert MEMBER.compute(inputs).number("stiffness") == pytest.approx(210e9 * 0.1 * 0.02 / 3)
