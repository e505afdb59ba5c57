"""Check `member`: stiffness (and, for beams, mass and first frequency) from the structure."""

from __future__ import annotations

from typing import TYPE_CHECKING

from fieldmode.calc.framework import plausible
from fieldmode.calc.framework.guard import overflow_guard
from fieldmode.calc.framework.meaning import STRUCTURE, Meaning
from fieldmode.calc.framework.result import Flag, Reference, Result, Value, quantity, word
from fieldmode.calc.framework.spec import CheckSpec, Field
from fieldmode.calc.physics import member

if TYPE_CHECKING:
    from fieldmode.calc.framework.reading import Inputs

ELEMENTS = ("beam", "columns", "axial", "springs")
SECTIONS = ("rectangle", "solid-circle", "hollow-circle")
END_CONDITIONS = ("simply-supported", "fixed-fixed", "fixed-pinned", "cantilever")
DEFAULT_ENDS = {"beam": "simply-supported", "columns": "fixed-fixed"}
BENDING = {"element": ("beam", "columns")}
"""Elements that bend (end conditions, second moment of area)."""
SOLID = {"element": ("beam", "columns", "axial")}
"""Elements made of a material and a section (every element but springs)."""

_MATERIAL_HELP = ", ".join(f"{m.name} " + " (SI) or ".join(e.written for e in m.moduli.values()) +
                           (" (US)" if len(m.moduli) > 1 else "") for m in member.MATERIALS.values())

FIELDS = (
    Field("element", "Element", "choice", "beam", choices=ELEMENTS,
          help="beam: load at midspan; columns: sway of a storey; axial: EA/L; springs: combine stiffnesses"),
    Field("end_conditions", "End conditions", "choice", "", required=False, choices=END_CONDITIONS, used_when=BENDING,
          help="beam: simply-supported 48, fixed-fixed 192, fixed-pinned 768/7 EI/L^3 (default simply-supported); "
               "columns: fixed-fixed 12, fixed-pinned or cantilever 3 EI/L^3 (default fixed-fixed)"),
    Field("count", "Number of members", "count", "1", "", required=False, used_when=SOLID,
          help="equal members acting together (columns of a storey, beams sharing the load)"),
    Field("length", "Length or span", "length", "7.2 m", "m", required=False, used_when=SOLID),
    Field("material", "Material", "choice", "steel", group="modulus", required=False, used_when=SOLID,
          choices=tuple(member.MATERIALS), help=f"sets E: {_MATERIAL_HELP}"),
    Field("modulus", "Young's modulus E", "modulus", "", "GPa", group="modulus", required=False, used_when=SOLID),
    Field("second_moment", "Second moment of area I", "second_moment", "29000 cm^4", "cm^4", group="section",
          required=False, used_when=BENDING, help="of one member, about its bending axis"),
    Field("section", "Section shape", "choice", "", group="section", required=False, choices=SECTIONS,
          used_when=SOLID, help="I (and A) from dimensions: rectangle width x depth; circle diameter (and wall)"),
    Field("width", "Width b", "length", "", "mm", required=False, used_when={"section": ("rectangle",)}),
    Field("depth", "Depth d (bending direction)", "length", "", "mm", required=False,
          used_when={"section": ("rectangle",)}),
    Field("diameter", "Outside diameter D", "length", "", "mm", required=False,
          used_when={"section": ("solid-circle", "hollow-circle")}),
    Field("wall", "Wall thickness t", "length", "", "mm", required=False, used_when={"section": ("hollow-circle",)}),
    Field("area", "Area A", "area", "", "mm^2", required=False, used_when={"element": ("axial",)},
          help="axial only (or give the section)"),
    Field("springs", "Spring stiffnesses", "stiffness", "", "kN/mm", required=False, many=True,
          used_when={"element": ("springs",)}, help="comma-separated, e.g. '40 kN/mm, 25 kN/mm'"),
    Field("arrangement", "Arrangement", "choice", "", required=False, choices=("series", "parallel"),
          used_when={"element": ("springs",)}, help="how the springs combine (default series)"),
    Field("mass_per_length", "Mass per length", "mass_per_length", "1.2 t/m", "kg/m", required=False,
          used_when={"element": ("beam",)},
          help="beams: gives the first natural frequency; a weight per length is read as w/g0"),
)

REFERENCES = {
    "beam": Reference("Midspan stiffness of a beam under a point load (48, 192, 768/7 EI/L^3)",
                      "beam deflection tables, e.g. AISC Steel Construction Manual Table 3-23; Roark's Formulas "
                      "for Stress and Strain, Table 8.1"),
    "columns": Reference("Storey stiffness of columns with a rigid top (12 EI/L^3 fixed-fixed, 3 EI/L^3 pinned top "
                         "or cantilever)", "Chopra, Dynamics of Structures, sec. 1.3"),
    "axial": Reference("Axial stiffness EA/L", "any mechanics of materials text, e.g. Gere & Goodno"),
    "springs": Reference("Springs in series 1/k = sum 1/k_i, in parallel k = sum k_i",
                         "Chopra, Dynamics of Structures, sec. 1.3"),
    "frequency": Reference("First natural frequency of a uniform beam f1 = (beta L)^2/(2 pi L^2) sqrt(EI/m); "
                           "(beta L)^2 = pi^2 simply supported",
                           "Blevins, Formulas for Natural Frequency and Mode Shape, Table 8-1; Clough & Penzien, "
                           "Dynamics of Structures, ch. 18"),
    "rule": Reference("Self-weight rule of thumb f ~ 18/sqrt(delta in mm); 17.75 exact for a simply supported beam",
                      "SCI P354, Design of floors for vibration; AISC Design Guide 11 (f = 0.18 sqrt(g/delta))"),
}


@overflow_guard("length")
def compute(inputs: Inputs) -> Result:
    element = inputs.text("element")
    if element == "springs":
        return _springs(inputs)
    count = int(inputs.optional("count", 1.0, positive=True) or 1)
    length = _need(inputs, "length", element)
    modulus, preset = _modulus(inputs, element)
    if element == "axial":
        area = _area(inputs)
        per_member = member.axial_stiffness(modulus, area, length)
        formula = "EA/L"
    else:
        ends = _end_conditions(inputs, element)
        second_moment = _second_moment(inputs)
        if element == "beam":
            per_member = member.beam_stiffness(modulus, second_moment, length, ends)
            formula = member.BEAM_SUPPORTS[ends].formula
        else:
            per_member = member.column_stiffness(modulus, second_moment, length, ends)
            formula = member.COLUMN_SUPPORTS[ends].formula
    stiffness = count * per_member
    values: dict[str, Value] = {
        "stiffness": quantity("Stiffness", "stiffness", stiffness, meaning=Meaning("stiffness", STRUCTURE)),
        "stiffness_per_member": quantity("Stiffness of one member", "stiffness", per_member),
        "formula": word("Formula", f"k = {count} x {formula}" if count > 1 else f"k = {formula}"),
        "modulus": quantity("Young's modulus E", "modulus", modulus),
        "modulus_source": word("E from", preset.source if preset else "typed"),
    }
    references = [REFERENCES[element]]
    if element == "axial":
        values["area"] = quantity("Area A", "area", area)
    else:
        values["second_moment"] = quantity("Second moment of area I", "second_moment", second_moment)
        values["end_conditions"] = word("End conditions", ends)
    note = plausible.modulus(modulus) if preset is None else Flag("info", _preset_text(inputs, preset))
    flags = [note] if note else []
    if element == "beam" and inputs.has("mass_per_length"):
        values.update(_beam_dynamics(inputs, modulus, second_moment, length, ends, count, stiffness))
        references += [REFERENCES["frequency"], REFERENCES["rule"]]
    return inputs.result(values, flags=tuple(flags), references=tuple(references))


def _beam_dynamics(inputs: Inputs, modulus: float, second_moment: float, span: float, ends: str,
                   count: int, stiffness: float) -> dict[str, Value]:
    """Mass, first frequency, self-weight deflection and the rule-of-thumb cross-check of a beam."""
    mass_per_length = inputs.value("mass_per_length", positive=True)
    frequency = member.beam_frequency(modulus, second_moment, span, mass_per_length, ends)
    deflection = member.self_weight_deflection(modulus, second_moment, span, mass_per_length, ends)
    return {
        "natural_frequency": quantity("First natural frequency", "frequency", frequency,
                                      meaning=Meaning("natural frequency", STRUCTURE)),
        "mass": quantity("Mass of the beams (m L)", "mass", count * mass_per_length * span),
        "equivalent_mass": quantity("Equivalent mass at midspan (k/w1^2)", "mass",
                                    member.equivalent_mass(stiffness, frequency)),
        "self_weight_deflection": quantity("Deflection under m g0", "length", deflection),
        "rule_of_thumb_frequency": quantity("18/sqrt(delta mm) cross-check", "frequency",
                                            member.frequency_rule_of_thumb(deflection)),
    }


def _springs(inputs: Inputs) -> Result:
    if not inputs.has("springs"):
        raise inputs.error("springs", "required for springs: give one stiffness or more")
    stiffnesses = [float(k) for k in inputs.array("springs", positive=True)]
    arrangement = inputs.text("arrangement") if inputs.has("arrangement") else "series"
    combine = member.springs_in_series if arrangement == "series" else member.springs_in_parallel
    stiffness = combine(stiffnesses)
    values = {
        "stiffness": quantity("Stiffness", "stiffness", stiffness, meaning=Meaning("stiffness", STRUCTURE)),
        "formula": word("Formula", "1/k = sum 1/k_i" if arrangement == "series" else "k = sum k_i"),
        "arrangement": word("Arrangement", f"{len(stiffnesses)} springs in {arrangement}"),
    }
    return inputs.result(values, references=(REFERENCES["springs"],))


def _need(inputs: Inputs, name: str, element: str) -> float:
    if not inputs.has(name):
        raise inputs.error(name, f"required for {element}")
    return inputs.value(name, positive=True)


def _modulus(inputs: Inputs, element: str) -> tuple[float, member.Modulus | None]:
    """E in Pa, and the preset used (None when E was typed).

    Steel's preset follows the unit system in use: 210 GPa in SI, 29,000 ksi in US customary.
    """
    if inputs.has("modulus"):
        return inputs.value("modulus", positive=True), None
    if not inputs.has("material"):
        raise inputs.error("material", f"give the material or Young's modulus E for {element}")
    preset = member.MATERIALS[inputs.text("material")].modulus(inputs.system)
    return preset.value, preset


def _preset_text(inputs: Inputs, preset: member.Modulus) -> str:
    """Which preset E was used, in which unit system, and its source."""
    material = member.MATERIALS[inputs.text("material")]
    if len(material.moduli) == 1:
        return f"E = {preset.written}: {preset.source}"
    system = "US customary" if inputs.system == "us" else "SI"
    return f"E = {preset.written}, the {system} preset: {preset.source}"


def _end_conditions(inputs: Inputs, element: str) -> str:
    ends = inputs.text("end_conditions") if inputs.has("end_conditions") else DEFAULT_ENDS[element]
    table = member.BEAM_SUPPORTS if element == "beam" else member.COLUMN_SUPPORTS
    if ends not in table:
        raise inputs.error("end_conditions", f"does not apply to {element}; use {' | '.join(table)}")
    return ends


def _second_moment(inputs: Inputs) -> float:
    if inputs.has("second_moment"):
        return inputs.value("second_moment", positive=True)
    if not inputs.has("section"):
        raise inputs.error("second_moment", "give the second moment of area or the section shape and dimensions")
    return _section(inputs)[0]


def _area(inputs: Inputs) -> float:
    if inputs.has("area") and inputs.has("section"):
        raise inputs.error("area", "give the area or the section shape, not both")
    if inputs.has("area"):
        return inputs.value("area", positive=True)
    if not inputs.has("section"):
        raise inputs.error("area", "required for axial (or give the section shape and dimensions)")
    return _section(inputs)[1]


def _section(inputs: Inputs) -> tuple[float, float]:
    """Second moment (m^4) and area (m^2) of the section shape from its dimensions."""
    shape = inputs.text("section")
    if shape == "rectangle":
        width = _need(inputs, "width", "a rectangle")
        depth = _need(inputs, "depth", "a rectangle")
        return member.rectangle_second_moment(width, depth), member.rectangle_area(width, depth)
    diameter = _need(inputs, "diameter", f"a {shape}")
    wall = None
    if shape == "hollow-circle":
        wall = _need(inputs, "wall", "a hollow circle")
        if 2 * wall > diameter:
            raise inputs.error("wall", "must be at most half the outside diameter")
    return member.circle_second_moment(diameter, wall), member.circle_area(diameter, wall)


SPEC = CheckSpec(
    id="member",
    title="Member stiffness",
    summary="stiffness of beams, columns, bars and springs; beam mass and first frequency",
    fields=FIELDS,
    compute=compute,
)
