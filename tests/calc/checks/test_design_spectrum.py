"""Check `design-spectrum`: the demo, overrides, units and bad input."""

from __future__ import annotations

import contextlib
import math

import pytest
from hypothesis import HealthCheck, given, settings
from hypothesis import strategies as st

from fieldmode.calc.checks import BY_ID
from fieldmode.calc.framework.result import SEISMIC_CAUTION
from fieldmode.calc.framework.units import InputError

G0 = 9.80665  # Source: NIST SP 811 (2008), standard gravity


DESIGN = BY_ID["design-spectrum"]


def si(result, name: str) -> float:  # type: ignore[no-untyped-def]
    return float(result.values[name].si())


TEXT = st.one_of(st.text(max_size=80), st.sampled_from(["", "0", "-1", "nan", "inf", "1e308", "1e400 m", "5",
                                                        "9**9**9", "0.2 g", "3 %", "A", "2", "1,2,3"]))


def test_design_spectrum_demo() -> None:
    result = DESIGN.evaluate(DESIGN.demo_texts())
    ag = 0.16 * G0
    # Source: EN 1998-1:2004 3.2.2.2, eq. 3.3, Table 3.2 ground C: plateau ag S eta 2.5 (TB <= 0.53 s <= TC)
    se = ag * 1.15 * 2.5
    assert si(result, "spectral_acceleration") == pytest.approx(se)
    assert result.values["branch"].magnitude == "constant acceleration"
    # Source: EN 1998-1:2004 3.2.2.4, eq. 3.7
    assert si(result, "spectral_displacement") == pytest.approx(se * (0.53 / (2 * math.pi)) ** 2)
    # Source: EN 1998-1:2004 3.2.2.5, eq. 3.14 with q = 4
    assert si(result, "design_spectral_acceleration") == pytest.approx(ag * 1.15 * 2.5 / 4)
    assert si(result, "base_shear") == pytest.approx(850e3 * se)
    assert result.values["parameter_set"].magnitude == "Table 3.2"
    assert any("S 1.15, TB 0.2 s, TC 0.6 s, TD 2 s" in flag.text for flag in result.flags)
    assert result.caution == SEISMIC_CAUTION
    assert set(result.series) >= {"period", "spectral_acceleration", "design_spectral_acceleration"}


def test_design_spectrum_overrides_and_units() -> None:
    texts = {"ground_type": "B", "spectrum_type": "2", "design_ground_acceleration": "2.0 m/s^2",
             "importance": "1.2", "damping": "10 %", "period": "0.8 s", "soil_factor": "1.3",
             "corner_period_tc": "0.3 s"}
    result = DESIGN.evaluate(texts)
    eta = math.sqrt(10 / 15)  # Source: EN 1998-1:2004 3.2.2.2(3), eq. 3.6
    # Source: EN 1998-1:2004 3.2.2.2, eq. 3.4; Table 3.3 ground B TD 1.2 s; ag = gamma_I agR (3.2.1(3))
    assert si(result, "spectral_acceleration") == pytest.approx(2.4 * 1.3 * eta * 2.5 * 0.3 / 0.8)
    assert result.values["branch"].magnitude == "constant velocity"
    assert result.values["parameter_set"].magnitude == "user S, TC"


@pytest.mark.parametrize(("texts", "field"), [
    ({"ground_type": "F"}, "Ground type"),
    ({"design_ground_acceleration": "0.16 kg"}, "Ground acceleration agR"),
    ({"design_ground_acceleration": "-0.1 g"}, "Ground acceleration agR"),
    ({"period": "-1 s"}, "Period"),
    ({"period": "12 s"}, "Period"),
    ({"damping": "150 %"}, "Damping ratio"),
    ({"behaviour_factor": "0.5"}, "Behaviour factor q"),
    ({"corner_period_tc": "0.1 s"}, "Corner period TC"),
    ({"corner_period_td": "0.5 s"}, "Corner period TD"),
    ({"mass": "0 t"}, "Mass (base shear)"),
])
def test_design_spectrum_bad_input(texts: dict[str, str], field: str) -> None:
    with pytest.raises(InputError) as error:
        DESIGN.evaluate({**DESIGN.demo_texts(), **texts})
    assert error.value.field == field


@settings(max_examples=60, deadline=None, suppress_health_check=[HealthCheck.function_scoped_fixture])
@given(field=st.sampled_from([f.name for f in DESIGN.fields]), text=TEXT)
def test_design_spectrum_any_text(field: str, text: str) -> None:
    with contextlib.suppress(InputError):
        DESIGN.evaluate({**DESIGN.demo_texts(), field: text})
