"""Check `period`: both codes side by side, feet, the height limit and hostile text."""

from __future__ import annotations

import contextlib

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from fieldmode.calc.checks import BY_ID
from fieldmode.calc.framework.meaning import BUILDING, Meaning
from fieldmode.calc.framework.result import SEISMIC_CAUTION
from fieldmode.calc.framework.units import InputError

PERIOD = BY_ID["period"]


def si(result, name: str) -> float:  # type: ignore[no-untyped-def]
    return float(result.values[name].si())


TEXT = st.one_of(st.text(max_size=80), st.sampled_from(["", "0", "-1", "nan", "inf", "1e308", "1e400 m", "5",
                                                        "9**9**9", "0.2 g", "3 %", "A", "2", "1,2,3"]))


def test_period_both_codes_side_by_side() -> None:
    result = PERIOD.evaluate({"height": "11.5 m", "system": "steel-moment-frame"})
    # Source: EN 1998-1:2004 4.3.3.2.2(3): 0.085 x 11.5^0.75
    assert si(result, "period") == pytest.approx(0.085 * 11.5**0.75)
    # Source: ASCE 7-16 12.8.2.1, Table 12.8-2: 0.028 x (11.5 / 0.3048 ft)^0.8
    assert si(result, "period_asce") == pytest.approx(0.028 * (11.5 / 0.3048) ** 0.8, rel=2e-3)
    assert result.caution == SEISMIC_CAUTION
    assert result.values["period"].meaning == Meaning("fundamental period", BUILDING)


def test_period_in_feet_and_height_limit() -> None:
    result = PERIOD.evaluate({"height": "150 ft", "system": "other"})
    # Source: EN 1998-1:2004 4.3.3.2.2(3): Ct 0.050, H in m; formula for H <= 40 m
    assert si(result, "period") == pytest.approx(0.05 * (150 * 0.3048) ** 0.75)
    assert any("40 m" in flag.text and flag.level == "caution" for flag in result.flags)


@settings(max_examples=60, deadline=None)
@given(field=st.sampled_from([f.name for f in PERIOD.fields]), text=TEXT)
def test_period_any_text(field: str, text: str) -> None:
    with contextlib.suppress(InputError):
        PERIOD.evaluate({**PERIOD.demo_texts(), field: text})
