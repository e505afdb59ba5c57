"""The `storeys` check: demo results, units, flags and every bad input."""

from __future__ import annotations

import math

import numpy as np
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from fieldmode.calc.checks import BY_ID
from fieldmode.calc.framework.units import InputError

SPEC = BY_ID["storeys"]


def evaluate(**texts: str):  # noqa: ANN201
    given_texts = SPEC.demo_texts()
    given_texts.update(texts)
    return SPEC.evaluate({k: v for k, v in given_texts.items() if v})


def test_demo_two_storey_textbook_case_through_the_check() -> None:
    result = evaluate(masses="200 t, 100 t", stiffnesses="40 kN/mm, 20 kN/mm", heights="", rayleigh_modes="")
    m, k = 100e3, 20e6
    # From memory: Chopra, Dynamics of Structures, ch. 10: omega = sqrt(k/2m), sqrt(2k/m)
    expected = [2 * math.pi / math.sqrt(k / (2 * m)), 2 * math.pi / math.sqrt(2 * k / m)]
    np.testing.assert_allclose(result.values["periods"].si(), expected, rtol=1e-10)
    assert result.values["period"].si() == pytest.approx(expected[0])
    np.testing.assert_allclose(result.values["mode_shapes"].si(), [[0.5, 1.0], [-1.0, 1.0]], atol=1e-12)
    # Source: Chopra, ch. 13: effective masses sum to the total, so the last cumulative ratio is 1
    assert result.values["cumulative_mass_ratio"].si()[-1] == pytest.approx(1.0)
    assert "storey" in result.series and "mode_2" in result.series


def test_weights_and_us_units_give_the_same_modes() -> None:
    si = evaluate(masses="310 t, 300 t, 240 t", stiffnesses="180, 160, 120 kN/mm")
    # Source: NIST SP 811: 1 kip = 4448.2216152605 N, 1 in = 0.0254 m; g0 = 9.80665 m/s^2
    weights = ", ".join(f"{m * 9.80665 / 4448.2216152605:.10g} kip" for m in (310e3, 300e3, 240e3))
    stiff = ", ".join(f"{k * 0.0254 / 4448.2216152605:.10g} kip/in" for k in (180e6, 160e6, 120e6))
    us = evaluate(masses=weights, stiffnesses=stiff)
    np.testing.assert_allclose(us.values["periods"].si(), si.values["periods"].si(), rtol=1e-8)
    assert any("read as weight" in flag.text for flag in us.flags)


def test_rayleigh_modes_choice() -> None:
    result = evaluate(rayleigh_modes="1, 3", damping="5 %")
    ratios = result.values["rayleigh_damping"].si()
    # From memory: Chopra, ch. 11: Rayleigh damping equals the chosen ratio at both chosen modes
    assert ratios[0] == pytest.approx(0.05) and ratios[2] == pytest.approx(0.05)
    assert ratios[1] < 0.05


def test_soft_storey_is_flagged_and_one_storey_skips_rayleigh() -> None:
    soft = evaluate(masses="300 t, 300 t, 300 t", stiffnesses="100, 160, 160 kN/mm")
    # From memory: ASCE 7-16 Table 12.3-2 type 1a: 100/160 = 62 % < 70 %
    assert any(f.level == "warning" and "soft storey 1" in f.text for f in soft.flags)
    single = evaluate(masses="300 t", stiffnesses="100 kN/mm", heights="4 m", rayleigh_modes="")
    assert "rayleigh_alpha" not in single.values
    assert single.values["effective_mass_ratio"].si() == pytest.approx([1.0])


def test_mass_flag_counts_modes() -> None:
    result = evaluate()
    needed = int(result.values["modes_for_90_percent"].si())
    cumulative = result.values["cumulative_mass_ratio"].si()
    # Source: EN 1998-1:2004 4.3.3.3.1(3) (from memory): the first modes reaching 90 % of the mass
    assert cumulative[needed - 1] >= 0.9 and (needed == 1 or cumulative[needed - 2] < 0.9)


@pytest.mark.parametrize(("texts", "field", "words"), [
    ({"masses": ""}, "Storey masses", "required"),
    ({"masses": " , "}, "Storey masses", "empty item"),
    ({"masses": "310 t,, 240 t"}, "Storey masses", "empty item"),
    ({"masses": "310 t, 300 t"}, "Storey stiffnesses", "3 stiffnesses for 2 masses"),
    ({"stiffnesses": "180 kN/mm"}, "Storey stiffnesses", "1 stiffnesses for 3 masses"),
    ({"masses": "310 t, 0 t, 240 t"}, "Storey masses", "greater than zero"),
    ({"masses": "310 t, -300 t, 240 t"}, "Storey masses", "greater than zero"),
    ({"stiffnesses": "180, 0, 120 kN/mm"}, "Storey stiffnesses", "greater than zero"),
    ({"stiffnesses": "180, -160, 120 kN/mm"}, "Storey stiffnesses", "greater than zero"),
    ({"stiffnesses": "180, 160, 120 kg"}, "Storey stiffnesses #1", "not a unit of stiffness"),
    ({"stiffnesses": "1e12, 1, 1 kN/mm"}, "Storey stiffnesses", "differ more than"),
    ({"heights": "4 m, 3 m"}, "Storey heights", "2 heights for 3 storeys"),
    ({"heights": "4 m, 0 m, 3 m"}, "Storey heights", "greater than zero"),
    ({"rayleigh_modes": "1"}, "Rayleigh modes", "two different"),
    ({"rayleigh_modes": "2, 2"}, "Rayleigh modes", "two different"),
    ({"rayleigh_modes": "1, 4"}, "Rayleigh modes", "only 3 modes"),
    ({"rayleigh_modes": "0, 2"}, "Rayleigh modes", "greater than zero"),
    ({"rayleigh_modes": "1.5, 2"}, "Rayleigh modes #1", "whole number"),
    ({"damping": "60 %"}, "Damping ratio", "at most"),
    ({"damping": "-1 %"}, "Damping ratio", "at least"),
])
def test_bad_inputs_name_the_field(texts: dict[str, str], field: str, words: str) -> None:
    with pytest.raises(InputError) as caught:
        given_texts = SPEC.demo_texts()
        given_texts.update(texts)
        SPEC.evaluate(given_texts)
    assert str(caught.value).startswith(field)
    assert words in str(caught.value)


ITEM = st.one_of(st.floats(allow_nan=True, allow_infinity=True).map(lambda v: f"{v} t"),
                 st.sampled_from(["0", "-3 t", "1e-300 t", "5 kN", "x", "", "1e15 t", "2 kN/mm"]),
                 st.text(max_size=8))


@settings(max_examples=120, deadline=None)
@given(masses=st.lists(ITEM, max_size=6), stiffnesses=st.lists(ITEM, max_size=6), heights=st.lists(ITEM, max_size=6))
def test_any_lists_only_raise_input_error(masses: list[str], stiffnesses: list[str], heights: list[str]) -> None:
    try:
        result = SPEC.evaluate({"masses": ", ".join(masses), "stiffnesses": ", ".join(stiffnesses),
                                "heights": ", ".join(heights), "damping": "5 %"})
    except InputError:
        return
    assert np.all(np.isfinite(result.values["periods"].si()))
