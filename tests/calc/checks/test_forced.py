"""Check `forced`: steady state against the ODE solver, flags, series, units and bad input."""

from __future__ import annotations

import math

import numpy as np
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st
from scipy.integrate import solve_ivp
from scipy.optimize import minimize_scalar

from fieldmode.calc.checks import BY_ID
from fieldmode.calc.framework.units import InputError
from fieldmode.calc.physics import forced

SPEC = BY_ID["forced"]


# Demo fan EF-3 on the mezzanine deck.
FAN = {"mass": "9.6 t", "stiffness": "42 kN/mm", "damping": "2 %", "frequency": "740 rpm",
       "unbalance": "0.35 kg m"}


def _steady_state(mass: float, stiffness: float, zeta: float, force: float, frequency: float) -> dict[str, float]:
    """Amplitudes of u, u', u'' and of the support force k u + c u' once the transients have died."""
    omega = 2 * math.pi * frequency
    omega_n = math.sqrt(stiffness / mass)
    damping = 2 * zeta * math.sqrt(stiffness * mass)

    def motion(t: float, state: np.ndarray) -> list[float]:
        u, v = state
        return [v, (force * math.sin(omega * t) - damping * v - stiffness * u) / mass]

    settle = 30.0 / (zeta * omega_n)  # e^-30: the free part is gone
    period = 2 * math.pi / omega
    window = np.linspace(settle, settle + 5 * period, 2001)
    # Oracle: scipy.integrate.solve_ivp (DOP853, tight tolerances) on m u'' + c u' + k u = F0 sin(w t)
    solution = solve_ivp(motion, (0.0, window[-1]), [0.0, 0.0], t_eval=window, method="DOP853",
                         rtol=1e-10, atol=1e-12 * force / stiffness)
    u, v = solution.y
    basis = np.column_stack([np.sin(omega * window), np.cos(omega * window)])
    (a, b), *_ = np.linalg.lstsq(basis, u, rcond=None)
    acceleration = (force * np.sin(omega * window) - damping * v - stiffness * u) / mass
    return {
        "amplitude": math.hypot(a, b),
        "phase": math.degrees(math.atan2(-b, a)),  # u = A sin(w t - phase)
        "velocity_amplitude": float(np.max(np.abs(v))),
        "acceleration_amplitude": float(np.max(np.abs(acceleration))),
        "transmitted_force": float(np.max(np.abs(stiffness * u + damping * v))),
    }


TEXTS = st.one_of(st.text(max_size=30), st.sampled_from(
    ["", "0", "-1", "1e15 t", "1e-300 kg", "1e15 MN/mm", "1e-15 N/km", "1e15 kHz", "1e-15 rpm", "1e15",
     "3 %", "70.7 %", "0.7071", "1e15 kg m", "1e-15 g mm", "1e15 MN", "5 kN"]))


@pytest.mark.parametrize(("change", "zeta", "frequency"), [
    ({}, 0.02, 740 / 60),
    ({"unbalance": "", "force": "5 kN", "frequency": "6 Hz"}, 0.02, 6.0),
    ({"unbalance": "", "force": "5 kN", "frequency": "10.4 Hz", "damping": "5 %"}, 0.05, 10.4),
    ({"frequency": "1800 rpm"}, 0.02, 30.0),
])
def test_steady_state_matches_the_ode_solver(change: dict[str, str], zeta: float, frequency: float) -> None:
    result = SPEC.evaluate({**FAN, **change})
    values = {name: value.si() for name, value in result.values.items()}
    oracle = _steady_state(9600.0, 42e6, zeta, values["force_amplitude"], frequency)
    assert values["amplitude"] == pytest.approx(oracle["amplitude"], rel=1e-6)
    assert values["phase"] == pytest.approx(oracle["phase"], abs=1e-4)
    assert values["velocity_amplitude"] == pytest.approx(oracle["velocity_amplitude"], rel=1e-4)
    assert values["acceleration_amplitude"] == pytest.approx(oracle["acceleration_amplitude"], rel=1e-4)
    assert values["transmitted_force"] == pytest.approx(oracle["transmitted_force"], rel=1e-4)


def test_unbalance_force_is_m_e_omega_squared() -> None:
    result = SPEC.evaluate(FAN)
    # Source: Den Hartog, Mechanical Vibrations, ch. 2 (rotating unbalance force m e w^2); 740 rpm = 740/60 Hz
    assert result.values["force_amplitude"].si() == pytest.approx(0.35 * (2 * math.pi * 740 / 60) ** 2)
    assert result.values["static_displacement"].si() == pytest.approx(
        0.35 * (2 * math.pi * 740 / 60) ** 2 / 42e6)


@pytest.mark.parametrize("zeta", [0.02, 0.1, 0.4])
def test_unbalance_peak(zeta: float) -> None:
    # From memory: Den Hartog, Mechanical Vibrations, sec. 2.x: M u/(m e) = r^2 R_d peaks at r = 1/sqrt(1-2 zeta^2)
    # Oracle: scipy.optimize.minimize_scalar (bounded) on -r^2 R_d
    found = minimize_scalar(lambda r: -(r**2) * forced.amplification(r, zeta), bounds=(0.5, 3.0),
                            method="bounded", options={"xatol": 1e-12})
    assert forced.unbalance_peak_ratio(zeta) == pytest.approx(found.x, abs=1e-5)
    assert forced.peak_amplification(zeta) == pytest.approx(-found.fun, rel=1e-9)
    result = SPEC.evaluate({**FAN, "damping": f"{zeta}"})
    assert result.values["peak_amplitude"].si() == pytest.approx(-found.fun * 0.35 / 9600, rel=1e-9)
    assert result.values["peak_frequency"].si() == pytest.approx(
        found.x * result.values["natural_frequency"].si(), rel=1e-5)


def test_heavy_damping_has_no_peak() -> None:
    # Source: Chopra, Dynamics of Structures, sec. 3.2.5: no resonant peak when zeta >= 1/sqrt(2)
    result = SPEC.evaluate({**FAN, "damping": "80 %", "unbalance": "", "force": "1 kN"})
    assert result.values["peak_amplification"].si() == 1.0
    assert result.values["peak_frequency"].si() == 0.0
    unbalanced = SPEC.evaluate({**FAN, "damping": "80 %"})
    assert "peak_frequency" not in unbalanced.values
    assert any("no resonance peak" in flag.text for flag in unbalanced.flags)


def test_demo_fan_is_flagged_near_and_above_resonance() -> None:
    result = SPEC.evaluate(FAN)
    # Common practice (no source): r = 740 rpm / (sqrt(k/m)/2pi) = 12.33 / 10.53 = 1.17, inside 0.8-1.2
    assert result.values["frequency_ratio"].si() == pytest.approx((740 / 60) / (math.sqrt(42e6 / 9600) / (2 * math.pi)))
    levels = {flag.level: flag.text for flag in result.flags}
    assert "20 %" in levels["warning"]
    assert "run-up" in levels["caution"]
    assert any("m e w^2" in flag.text for flag in result.flags)


def test_below_resonance_has_no_resonance_flags() -> None:
    result = SPEC.evaluate({**FAN, "frequency": "5 Hz"})
    assert not [flag for flag in result.flags if flag.level in ("warning", "caution")]


def test_series_cover_the_operating_point_and_beyond() -> None:
    result = SPEC.evaluate({**FAN, "frequency": "3000 rpm"})
    ratio = result.series["frequency_ratio"]
    assert ratio[0] == 0.0 and ratio[-1] >= max(3.0, result.values["frequency_ratio"].si())
    assert set(result.series) == {"frequency_ratio", "amplification", "phase"}
    assert np.all(np.diff(ratio) > 0)


def test_si_and_us_inputs_give_the_same_si_result() -> None:
    si = SPEC.evaluate(FAN)
    # Source: NIST SP 811 (2008), B.9: 1 lb = 0.45359237 kg, 1 lbf = 4.4482216152605 N, 1 in = 0.0254 m
    us = SPEC.evaluate({"mass": f"{9600 / 0.45359237!r} lb", "stiffness": f"{42e6 * 0.0254 / 4448.2216152605!r} kip/in",
                        "damping": "0.02", "frequency": f"{740 / 60!r} Hz",
                        "unbalance": f"{0.35 / (0.45359237 * 0.0254)!r} lb in"})
    for name, value in si.values.items():
        assert us.values[name].si() == pytest.approx(value.si(), rel=1e-9)


@pytest.mark.parametrize(("change", "field"), [
    ({"mass": "0 t"}, "Mass"),
    ({"mass": "-9.6 t"}, "Mass"),
    ({"stiffness": "0 kN/mm"}, "Stiffness"),
    ({"stiffness": "9.6 t"}, "Stiffness"),
    ({"damping": "-2 %"}, "Damping ratio"),
    ({"damping": "0"}, "Damping ratio"),
    ({"frequency": "0 rpm"}, "Operating frequency"),
    ({"frequency": "3 m"}, "Operating frequency"),
    ({"unbalance": "0 kg m"}, "Unbalance"),
    ({"unbalance": "0.35 kg"}, "Unbalance"),
    ({"force": "2 kN"}, "Unbalance m e: give only one"),
    ({"unbalance": ""}, "Force amplitude"),
    ({"mass": ""}, "Mass"),
])
def test_bad_input_names_the_field(change: dict[str, str], field: str) -> None:
    with pytest.raises(InputError) as caught:
        SPEC.evaluate({**FAN, **change})
    assert str(caught.value).startswith(field)


@settings(max_examples=300, deadline=None)
@given(load=st.sampled_from(["force", "unbalance"]), field=st.sampled_from([f.name for f in SPEC.fields]),
       text=TEXTS)
def test_any_text_in_any_field_raises_only_input_error(load: str, field: str, text: str) -> None:
    texts = {**FAN, "unbalance": "", "force": "5 kN"} if load == "force" else dict(FAN)
    texts[field] = text
    try:
        result = SPEC.evaluate(texts)
    except InputError:
        return
    assert all(math.isfinite(v.si()) for v in result.values.values())
    assert all(np.all(np.isfinite(s)) for s in result.series.values())


@pytest.mark.parametrize(("change", "note"), [
    ({"stiffness": "0.8 kN/mm"}, "check the stiffness unit"),  # 117.7 mm under 9.6 t
    ({"frequency": "740"}, "740 Hz is 44400 rpm"),  # a speed typed without its unit
    ({"frequency": "100 Hz"}, ""),
    ({}, ""),
])
def test_implausible_inputs_get_a_note(change: dict[str, str], note: str) -> None:
    result = SPEC.evaluate({**FAN, **change})
    # Common practice (no source): over 100 mm under its own weight, or above 100 Hz (6000 rpm), is most often a
    # slip of unit
    notes = [flag.text for flag in result.flags if flag.level == "caution" and "check" in flag.text]
    assert [n for n in notes if note in n] if note else not notes
