"""The unit reader: conversion factors, the unit traps, refusals, and display in engineering units."""

from __future__ import annotations

import math
import time

import numpy as np
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from fieldmode.calc.framework.kinds import KINDS
from fieldmode.calc.framework.units import (
    InputError,
    convert,
    format_number,
    format_value,
    kind_of_text,
    read,
    read_any,
)

# Source: NIST SP 811 (2008), Appendix B.8 and B.9 (exact or defining values)
NIST_FACTORS = [
    ("1 in", "length", 0.0254),
    ("1 ft", "length", 0.3048),
    ("1 lb", "mass", 0.45359237),
    ("1 kip/in", "stiffness", 4448.2216152605 / 0.0254),
    ("1 lbf/in", "stiffness", 4.4482216152605 / 0.0254),
    ("1 psi", "modulus", 6894.757293168),
    ("1 ksi", "modulus", 6894757.293168),
    ("1 lbf*s/in", "damping_coefficient", 4.4482216152605 / 0.0254),
    ("1 in^4", "second_moment", 0.0254**4),
    ("1 g", "acceleration", 9.80665),  # Source: 3rd CGPM (1901), standard gravity
]


@pytest.mark.parametrize(("text", "kind", "si"), NIST_FACTORS)
def test_conversion_factors_match_nist(text: str, kind: str, si: float) -> None:
    assert read(text, kind).si == pytest.approx(si, rel=1e-12)


# Common practice (no source): rotational speed is revolutions per minute; 1 rev/min = 1/60 Hz.
@pytest.mark.parametrize(("text", "hz"), [
    ("1450 rpm", 1450 / 60), ("1450 RPM", 1450 / 60), ("1450 r/min", 1450 / 60), ("600 cpm", 10.0),
    ("24 rev/s", 24.0), ("24 rps", 24.0), ("24.17 Hz", 24.17), ("24.17", 24.17), ("1.2 kHz", 1200.0),
])
def test_rotational_speed_is_cycles_per_time(text: str, hz: float) -> None:
    assert read(text, "frequency").si == pytest.approx(hz, rel=1e-12)


def test_1450_rpm_is_24_17_hz_not_151_8() -> None:
    # Common practice (no source): 1450 rpm / 60 = 24.17 Hz; pint's own rpm would give 2 pi times that.
    assert format_value(read("1450 rpm", "frequency").si, "frequency") == "24.17 Hz"


def test_angular_and_cyclic_frequency_convert_with_two_pi() -> None:
    # Common practice (no source): omega = 2 pi f.
    assert read("100 rad/s", "frequency").si == pytest.approx(100 / (2 * math.pi))
    assert "angular" in read("100 rad/s", "frequency").note
    assert read("1 Hz", "angular_frequency").si == pytest.approx(2 * math.pi)
    assert read("60 rpm", "angular_frequency").si == pytest.approx(2 * math.pi)


def test_g_is_standard_gravity_in_acceleration_fields() -> None:
    # Source: NIST SP 811 (2008), standard acceleration of gravity g_n = 9.80665 m/s^2.
    assert read("0.25 g", "acceleration").si == pytest.approx(2.4516625)
    assert read("0.25 G", "acceleration").si == pytest.approx(2.4516625)


def test_g_is_gram_in_an_unbalance_field() -> None:
    # Common practice (no source): balance quality is quoted in g mm (gram millimetres).
    assert read("120 g*mm", "unbalance").si == pytest.approx(120e-6)


@pytest.mark.parametrize(("text", "kg"), [
    ("117.7 kN", 117700 / 9.80665), ("50 kip", 50 * 4448.2216152605 / 9.80665),
    ("5000 lbf", 5000 * 4.4482216152605 / 9.80665),
])
def test_weight_in_a_mass_field_is_read_as_w_over_g0(text: str, kg: float) -> None:
    # Source: NIST SP 811 (2008), Appendix B.9; m = W / g_n.
    reading = read(text, "mass")
    assert reading.si == pytest.approx(kg, rel=1e-12)
    assert reading.note.startswith("read as weight")


def test_lb_is_pound_mass_and_says_so() -> None:
    reading = read("26500 lb", "mass")
    assert reading.si == pytest.approx(26500 * 0.45359237)  # Source: NIST SP 811 (2008), B.9
    assert "pound-mass" in reading.note


def test_ton_is_short_ton_and_says_so() -> None:
    reading = read("2 ton", "mass")
    assert reading.si == pytest.approx(2 * 907.18474)  # Source: NIST SP 811 (2008), B.9 ton (short)
    assert "short ton" in reading.note
    assert read("2 t", "mass").si == 2000.0


def test_lb_in_a_stiffness_unit_is_read_as_lbf() -> None:
    reading = read("300 lb/in", "stiffness")
    assert reading.si == pytest.approx(300 * 4.4482216152605 / 0.0254)  # Source: NIST SP 811 (2008), B.9
    assert "lbf" in reading.note


@pytest.mark.parametrize(("text", "ratio", "flagged"), [
    ("3 %", 0.03, False), ("0.03", 0.03, False), ("3", 3.0, True), ("100", 100.0, True), ("1", 1.0, False),
])
def test_ratios_accept_percent_and_fractions_and_flag_suspicious_bare_numbers(
        text: str, ratio: float, flagged: bool) -> None:
    reading = read(text, "ratio", "Damping ratio")
    assert reading.si == pytest.approx(ratio)
    assert ("did you mean" in reading.note) is flagged


@pytest.mark.parametrize(("text", "ratio", "note"), [
    ("5", 0.05, "read as 5 %"), ("0.5", 0.5, ""), ("30", 0.30, "read as 30 %"),
    ("150", 1.5, "read as 150 %"), ("1", 1.0, ""), ("0.05", 0.05, ""), ("5 %", 0.05, ""),
])
def test_a_damping_field_reads_a_bare_number_above_one_as_a_percentage(text: str, ratio: float, note: str) -> None:
    reading = read(text, "ratio", "Damping ratio", "", bare_percent=True)
    # Common practice (no source): damping is quoted in per cent, 5 means 5 %
    assert reading.si == pytest.approx(ratio)
    assert reading.note == note


# From memory: NIST SP 811 (2008), B.8: mil (0.001 in) = 2.54E-05 m; 1 in = 0.0254 m exactly (B.9, confirmed)
@pytest.mark.parametrize(("text", "kind", "si"), [
    ("5 mil", "length", 5 * 2.54e-5),
    ("5 mils", "length", 5 * 2.54e-5),
    ("2 mil/s", "velocity", 2 * 2.54e-5),
    ("1000 mil", "length", 0.0254),
])
def test_mil_is_a_thousandth_of_an_inch(text: str, kind: str, si: float) -> None:
    reading = read(text, kind, "Amplitude")
    assert reading.si == pytest.approx(si, rel=1e-12)
    assert reading.note == "mil read as 0.001 in"


def test_pint_angular_mil_never_reaches_a_field() -> None:
    # pint's own mil is pi/32000 rad; ours is a length everywhere, so an angle field refuses it
    with pytest.raises(InputError, match="not a unit of angle"):
        read("5 mil", "angle", "Phase")
    assert read("4 mm", "length", "Amplitude").note == ""  # 'mm' and 'mi' are untouched
    assert read("1 mi", "length", "Distance").si == pytest.approx(1609.344)  # Source: NIST SP 811, B.9
    assert kind_of_text("5 mil") == "length"


def test_convert_mils() -> None:
    quantity, note = convert("5 mil", "mm")
    # From memory: NIST SP 811 (2008), B.8: mil = 2.54E-05 m
    assert quantity.magnitude == pytest.approx(0.127, rel=1e-12)
    assert note == "mil read as 0.001 in"
    assert convert("0.127 mm", "mil")[0].magnitude == pytest.approx(5.0, rel=1e-12)


PEAK_KINDS = ("number", "length", "velocity", "acceleration")


@pytest.mark.parametrize(("text", "kind", "si"), [
    ("0.32", "number", 0.32), ("2.5 mm", "length", 0.0025), ("3 mm/s", "velocity", 0.003),
    ("0.02 g", "acceleration", 0.02 * 9.80665),  # Source: 3rd CGPM (1901), standard gravity
])
def test_read_any_takes_the_first_kind_that_fits(text: str, kind: str, si: float) -> None:
    reading = read_any(text, PEAK_KINDS, "Peak")
    assert reading.kind == kind and reading.si == pytest.approx(si)


@pytest.mark.parametrize(("text", "words"), [
    ("5 kN", "expected a number, length, velocity or acceleration"),
    ("5 blorbs", "unknown unit"),
    ("", "empty"),
])
def test_read_any_names_every_kind_when_none_fits(text: str, words: str) -> None:
    with pytest.raises(InputError) as caught:
        read_any(text, PEAK_KINDS, "Peak")
    assert str(caught.value).startswith("Peak: ") and words in str(caught.value)


def test_bare_number_takes_the_field_unit() -> None:
    assert read("42", "stiffness", "Stiffness", "kN/mm").si == pytest.approx(42e6)
    assert read("9.6", "mass", "Mass", "t").si == pytest.approx(9600)


# Both sides of each dimension check: the right kind is accepted, a wrong kind refused.
@pytest.mark.parametrize(("kind", "good", "bad"), [
    ("stiffness", ["8 kN/mm", "45 kip/in"], ["12 kg", "3 Hz", "8 kN"]),
    ("mass", ["12 t", "26500 lb", "117.7 kN"], ["8 kN/mm", "3 m"]),
    ("frequency", ["24 Hz", "1450 rpm"], ["3 s", "2 m"]),
    ("acceleration", ["0.3 g", "2.5 m/s^2"], ["3 m/s", "2 kg"]),
    ("ratio", ["3 %", "0.05"], ["3 m", "2 Hz"]),
    ("modulus", ["210 GPa", "29000 ksi"], ["210 kN"]),
])
def test_dimension_checks_accept_and_refuse(kind: str, good: list[str], bad: list[str]) -> None:
    for text in good:
        read(text, kind)
    for text in bad:
        with pytest.raises(InputError):
            read(text, kind)


@pytest.mark.parametrize("text", [
    "", "   ", "abc", "9**9**9 m", "1 m**9**9", "1 m^4^4", "1e400 m", "nan m", "inf m", "1e16 m",
    "x" * 10_000, "1,5 m", "2 m; import os", "__import__('os')", "1 m**44", "1 ➗ m", "1 \x00 m",
])
def test_hostile_text_is_refused_quickly(text: str) -> None:
    start = time.perf_counter()
    with pytest.raises(InputError):
        read(text, "length", "Span")
    assert time.perf_counter() - start < 1.0  # a guard against a hang, not a performance goal


def test_error_message_names_field_echoes_text_and_gives_example() -> None:
    with pytest.raises(InputError) as caught:
        read("12 kg", "stiffness", "Stiffness")
    message = str(caught.value)
    assert message.startswith("Stiffness:")
    assert "'12 kg'" in message
    assert "kN/mm" in message


def test_input_error_is_a_value_error() -> None:
    assert issubclass(InputError, ValueError)


def test_whole_numbers_for_counts() -> None:
    assert read("4", "count").si == 4
    with pytest.raises(InputError):
        read("2.5", "count")


@pytest.mark.parametrize(("value", "text"), [
    (24.1666, "24.17"), (1450.0, "1450"), (0.004, "0.004000"), (123456.0, "123456"), (1.5e-7, "1.500e-07"),
    (-3.14159, "-3.142"), (0.0, "0"),
    (0.09999999, "0.1000"), (9.99999, "10.00"), (999999.9, "1.000e+06"),
])
def test_four_significant_figures(value: float, text: str) -> None:
    assert format_number(value) == text


def test_us_customary_display() -> None:
    assert format_value(read("45 kip/in", "stiffness").si, "stiffness", "us") == "45.00 kip/in"
    assert format_value(read("0.25 g", "acceleration").si, "acceleration", "us") == "0.2500 g"


def test_convert_command_core() -> None:
    quantity, _ = convert("1450 rpm", "Hz")
    assert quantity.magnitude == pytest.approx(24.1667, rel=1e-4)
    quantity, _ = convert("45 kip/in")
    assert quantity.magnitude == pytest.approx(45 * 4448.2216152605 / 0.0254)  # Source: NIST SP 811, B.9


@settings(max_examples=300, deadline=None)
@given(text=st.text(max_size=80), kind=st.sampled_from(sorted(KINDS)))
def test_any_text_raises_only_input_error(text: str, kind: str) -> None:
    try:
        reading = read(text, kind, "Field")
    except InputError:
        return
    assert math.isfinite(reading.si)


@settings(max_examples=200, deadline=None)
@given(number=st.floats(min_value=-1e12, max_value=1e12, allow_nan=False),
       unit=st.sampled_from(["m", "mm", "kN/mm", "kip/in", "t", "lb", "Hz", "rpm", "g", "%", "", "m^2", "s"]),
       kind=st.sampled_from(sorted(KINDS)))
def test_numbers_with_units_raise_only_input_error(number: float, unit: str, kind: str) -> None:
    try:
        reading = read(f"{number!r} {unit}", kind, "Field")
    except InputError:
        return
    assert math.isfinite(reading.si)


def test_one_unit_for_the_whole_list_chosen_by_the_largest_value() -> None:
    # Common practice (no source): one unit per list, 4 significant figures each
    assert format_value(np.array([0.0191, 0.0359, 0.0474]), "length") == "19.10, 35.90, 47.40 mm"
    assert format_value(np.array([0.5, 1.5]), "time") == "0.5000, 1.500 s"


def test_rows_of_a_two_dimensional_array() -> None:
    shown = format_value(np.array([[0.4, 1.0], [-1.0, 1.0]]), "number")
    assert shown.split("; ") == ["0.4000, 1.000", "-1.000, 1.000"]


def test_whole_numbers_and_scalars() -> None:
    assert format_value(np.array([2.0, 3.0]), "count") == "2, 3"
    assert format_value(24.17, "frequency") == "24.17 Hz"


# Refusals of what cannot be meant (each failed before its fix).

@pytest.mark.parametrize("text", ["5 %%", "5 % %", "5 %%%"])
def test_percent_of_percent_is_refused(text: str) -> None:
    with pytest.raises(InputError, match="one % sign"):
        read(text, "ratio", "Damping ratio")


@pytest.mark.parametrize("text", ["30 deg", "1 turn", "0.5 rad", "2 revolution", "10 degree"])
def test_angles_are_not_ratios(text: str) -> None:
    with pytest.raises(InputError, match="an angle is not a ratio"):
        read(text, "ratio", "Damping ratio")


def test_an_angle_field_still_reads_degrees() -> None:
    # Source: 180 deg = pi rad (SI Brochure, 9th ed., Table 8)
    assert read("30 deg", "angle").quantity.to("rad").magnitude == pytest.approx(math.pi / 6)


@pytest.mark.parametrize(("text", "kind"), [("1e-320 N/m", "stiffness"), ("1e-300 kg", "mass"),
                                            ("1e-20 mm", "length"), ("-1e-310", "ratio")])
def test_values_that_underflow_are_refused_not_read_as_zero(text: str, kind: str) -> None:
    # Common practice (no source): nothing on site is 1e-15 of a unit; such text is a slip, never a value
    with pytest.raises(InputError, match="out of range"):
        read(text, kind, "Stiffness")


def test_zero_is_still_zero() -> None:
    assert read("0 %", "ratio").si == 0.0 and read("0", "ratio").si == 0.0


@pytest.mark.parametrize("text", ["10 tons", "10 ton", "3 tons/m"])
def test_tons_are_read_as_short_tons_and_say_so(text: str) -> None:
    kind = "mass_per_length" if "/" in text else "mass"
    reading = read(text, kind)
    assert "short ton" in reading.note
    # Source: NIST SP 811 (2008), B.9: ton (short, 2000 lb) = 907.18474 kg
    assert reading.si == pytest.approx(float(text.split()[0]) * 907.18474)


@pytest.mark.parametrize(("text", "hint"), [("\u22125 %", "ASCII '-'"), ("\u20135", "ASCII '-'"),
                                            ("1\u2009450 kg", "without a space"), ("1\u00a0450 kg", "without a space"),
                                            ("2\u202f000 kg", "without a space")])
def test_unicode_minus_and_spaces_inside_numbers_get_a_hint(text: str, hint: str) -> None:
    kind = "ratio" if "%" in text or text.endswith("5") else "mass"
    with pytest.raises(InputError, match=hint):
        read(text, kind, "Field")


@pytest.mark.parametrize(("text", "factor"), [("3 mg", 3e-3), ("25 milli-g", 25e-3)])
def test_mg_in_an_acceleration_field_is_milli_g(text: str, factor: float) -> None:
    reading = read(text, "acceleration")
    # Source: CGPM 1901, standard acceleration of gravity g_n = 9.80665 m/s^2 (exact)
    assert reading.si == pytest.approx(factor * 9.80665)
    assert "milli-g" in reading.note


def test_convert_reads_mg_as_milli_g_like_the_fields() -> None:
    quantity, note = convert("2 mg", "m/s^2")
    assert quantity.magnitude == pytest.approx(2e-3 * 9.80665)  # Source: CGPM 1901, g_n exact
    assert "milli-g" in note


def test_a_long_unknown_unit_is_quoted_short_in_the_message() -> None:
    """A paste of 60 characters once filled six lines of the pane with one error."""
    with pytest.raises(InputError) as caught:
        read("9.6 t" + "9" * 55, "mass", "Mass")
    assert "unknown unit 't9999999999999999...'" in str(caught.value)
    assert len(str(caught.value)) < 160  # the typed text itself is quoted up to 40 characters
