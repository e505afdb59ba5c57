"""Check `sdof`: the demo, alternatives, unit invariance and bad input."""

from __future__ import annotations

import math

import numpy as np
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from fieldmode.calc.checks import BY_ID
from fieldmode.calc.framework.units import InputError
from fieldmode.calc.physics import sdof

SPEC = BY_ID["sdof"]


TEXTS = st.one_of(st.text(max_size=30), st.sampled_from(["0", "-1 t", "1e300 t", "nan", "5", "3 %", "1 mm"]))


def test_static_deflection_rule() -> None:
    # Common practice (no source): trade rule f = 15.76 / sqrt(delta in mm) for a single mass on a spring
    result = SPEC.evaluate({"mass": "5 t", "static_deflection": "4 mm", "damping": "0"})
    frequency = result.values["natural_frequency"].si()
    assert frequency == pytest.approx(15.76 / math.sqrt(4.0), rel=1e-3)


def test_demo_fan_deck_properties() -> None:
    # Common practice (no source): f = sqrt(k/m) / 2 pi, T = 1/f, c_cr = 2 sqrt(k m)
    result = SPEC.evaluate({"mass": "9.6 t", "stiffness": "42 kN/mm", "damping": "2 %"})
    k, m = 42e6, 9600.0
    assert result.values["natural_frequency"].si() == pytest.approx(math.sqrt(k / m) / (2 * math.pi))
    assert result.values["natural_period"].si() == pytest.approx(2 * math.pi / math.sqrt(k / m))
    assert result.values["critical_damping"].si() == pytest.approx(2 * math.sqrt(k * m))
    assert result.values["damped_frequency"].si() == pytest.approx(
        math.sqrt(k / m) * math.sqrt(1 - 0.02**2) / (2 * math.pi))
    assert result.values["cycles_to_halve"].si() == pytest.approx(math.log(2) / sdof.log_decrement(0.02))
    assert result.values["regime"].si() == "underdamped"


def test_damping_coefficient_alternative() -> None:
    k, m = 42e6, 9600.0
    c = 0.05 * 2 * math.sqrt(k * m)
    result = SPEC.evaluate({"mass": "9.6 t", "stiffness": "42 kN/mm", "damping_coefficient": f"{c} N*s/m"})
    assert result.values["damping_ratio"].si() == pytest.approx(0.05)


def test_si_and_us_inputs_give_the_same_si_result() -> None:
    si = SPEC.evaluate({"mass": "10 t", "stiffness": "20 kN/mm", "damping": "3 %"})
    # Source: NIST SP 811 (2008), B.9: 1 lb = 0.45359237 kg, 1 lbf = 4.4482216152605 N, 1 in = 0.0254 m
    us = SPEC.evaluate({"mass": f"{10000 / 0.45359237} lb", "stiffness": f"{20e6 * 0.0254 / 4448.2216152605} kip/in",
                        "damping": "0.03"})
    for name, value in si.values.items():
        expected = value.si()
        assert us.values[name].si() == (expected if isinstance(expected, str) else pytest.approx(expected, rel=1e-9))


@pytest.mark.parametrize(("texts", "field"), [
    ({"mass": "0 t", "stiffness": "42 kN/mm"}, "Mass"),
    ({"mass": "-3 t", "stiffness": "42 kN/mm"}, "Mass"),
    ({"mass": "9.6 t", "stiffness": "0 kN/mm"}, "Stiffness"),
    ({"mass": "9.6 t"}, "Stiffness"),
    ({"mass": "9.6 t", "stiffness": "42 kN/mm", "static_deflection": "2 mm"}, "Static deflection"),
    ({"mass": "9.6 t", "stiffness": "42 kN/mm", "damping": "-2 %"}, "Damping ratio"),
    ({"mass": "9.6 t", "stiffness": "12 kg"}, "Stiffness"),
    ({"stiffness": "42 kN/mm"}, "Mass"),
])
def test_bad_input_names_the_field(texts: dict[str, str], field: str) -> None:
    with pytest.raises(InputError) as caught:
        SPEC.evaluate(texts)
    assert str(caught.value).startswith(field)


def test_bare_damping_number_above_one_is_a_percentage() -> None:
    result = SPEC.evaluate({"mass": "9.6 t", "stiffness": "42 kN/mm", "damping": "5"})
    # Common practice (no source): damping is quoted in per cent; a ratio of 5 (500 %) is never meant
    assert result.values["damping_ratio"].si() == pytest.approx(0.05)
    assert any(flag.text == "Damping ratio: read as 5 %" and flag.level == "info" for flag in result.flags)
    assert result.values["regime"].si() == "underdamped"


@settings(max_examples=200, deadline=None)
@given(mass=TEXTS, stiffness=TEXTS, damping=TEXTS, u0=TEXTS)
def test_any_input_raises_only_input_error(mass: str, stiffness: str, damping: str, u0: str) -> None:
    try:
        result = SPEC.evaluate({"mass": mass, "stiffness": stiffness, "damping": damping,
                                "initial_displacement": u0})
    except InputError:
        return
    assert np.all(np.isfinite(result.series["displacement"]))


@pytest.mark.parametrize(("texts", "note"), [
    ({"stiffness": "0.9 kN/mm"}, "check the stiffness unit"),  # 9.6 t g0 / 0.9 kN/mm = 104.6 mm
    ({"stiffness": "1 kN/mm"}, ""),  # 94.1 mm
    ({"stiffness": "", "static_deflection": "120 mm"}, "check the deflection unit"),
    ({"stiffness": "", "static_deflection": "100 mm"}, ""),
])
def test_a_static_deflection_over_100_mm_gets_a_note(texts: dict[str, str], note: str) -> None:
    result = SPEC.evaluate({**SPEC.demo_texts(), **texts})
    # Common practice (no source): over 100 mm under its own weight (below 1.58 Hz) is most often a stiffness
    # typed in N/mm for kN/mm
    deflection = result.values["static_deflection"].si()
    notes = [flag.text for flag in result.flags if "static deflection" in flag.text]
    assert (deflection > 0.1) == bool(note)
    assert notes == ([f"static deflection {deflection * 1000:.4g} mm under the mass's own weight is over 100 mm: "
                      f"check {note[6:]}"] if note else [])
