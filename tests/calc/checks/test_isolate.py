"""Check `isolate`: the demo against the ODE solver, flags, series, units and bad input."""

from __future__ import annotations

import math

import numpy as np
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st
from scipy.integrate import solve_ivp
from scipy.optimize import brentq

from fieldmode.calc.checks import BY_ID
from fieldmode.calc.framework.units import STANDARD_GRAVITY, InputError
from fieldmode.calc.physics import forced

SPEC = BY_ID["isolate"]


# Demo fan EF-3: 9.6 t at 740 rpm on 4 mounts, 2 % damping, 90 % isolation wanted.
FAN = {"frequency": "740 rpm", "mass": "9.6 t", "mounts": "4", "damping": "2 %", "target_isolation": "90 %"}


def _support_force_ratio(mass: float, stiffness: float, zeta: float, frequency: float) -> float:
    """Amplitude of k u + c u' over the applied force amplitude, in the steady state."""
    omega = 2 * math.pi * frequency
    damping = 2 * zeta * math.sqrt(stiffness * mass)

    def motion(t: float, state: np.ndarray) -> list[float]:
        u, v = state
        return [v, (math.sin(omega * t) - damping * v - stiffness * u) / mass]

    settle = 30.0 / (zeta * math.sqrt(stiffness / mass))
    window = np.linspace(settle, settle + 5 * 2 * math.pi / omega, 2001)
    # Oracle: scipy.integrate.solve_ivp (DOP853) on m u'' + c u' + k u = sin(w t)
    solution = solve_ivp(motion, (0.0, window[-1]), [0.0, 0.0], t_eval=window, method="DOP853",
                         rtol=1e-10, atol=1e-14 / stiffness)
    u, v = solution.y
    return float(np.max(np.abs(stiffness * u + damping * v)))


TEXTS = st.one_of(st.text(max_size=30), st.sampled_from(
    ["", "0", "-1", "1e15 t", "1e-300 kg", "1e15 MN/mm", "1e-15 N/km", "1e15 kHz", "1e-15 rpm", "1e15",
     "99.9999999999 %", "1e-12 %", "0.5", "2.5", "1e15 %", "3 %"]))


def test_demo_fan_design_against_the_ode_solver() -> None:
    result = SPEC.evaluate(FAN)
    values = {name: value.si() for name, value in result.values.items()}
    f = 740 / 60
    ratio = brentq(lambda r: forced.transmissibility(r, 0.02) - 0.1, math.sqrt(2), 100, xtol=1e-14)
    # Oracle: scipy.optimize.brentq for the frequency ratio giving T = 0.1 at 2 % damping
    assert values["required_natural_frequency"] == pytest.approx(f / ratio, rel=1e-9)
    # Common practice (no source): k = m (2 pi fn)^2, shared equally by the mounts
    assert values["required_stiffness"] == pytest.approx(9600 * (2 * math.pi * f / ratio) ** 2, rel=1e-9)
    assert values["stiffness_per_mount"] == pytest.approx(values["required_stiffness"] / 4)
    assert values["isolation"] == pytest.approx(0.9, rel=1e-9)
    transmitted = _support_force_ratio(9600.0, values["stiffness"], 0.02, f)
    assert values["transmissibility"] == pytest.approx(transmitted, rel=1e-4)
    # Common practice (no source): trade rule fn = 15.76 / sqrt(static deflection in mm) for a mass on a spring
    assert values["natural_frequency"] == pytest.approx(15.76 / math.sqrt(values["static_deflection"] * 1000),
                                                        rel=1e-3)
    assert values["static_deflection"] == pytest.approx(9600 * STANDARD_GRAVITY / values["stiffness"])


def test_given_mounts_too_stiff_for_the_target() -> None:
    result = SPEC.evaluate({**FAN, "stiffness": "20 kN/mm"})
    values = {name: value.si() for name, value in result.values.items()}
    # Source: Chopra, Dynamics of Structures, eq. 3.5.3 with r = f / sqrt(k/m)/2pi
    r = (740 / 60) / (math.sqrt(20e6 / 9600) / (2 * math.pi))
    assert values["frequency_ratio"] == pytest.approx(r)
    expected = math.sqrt(1 + (0.04 * r) ** 2) / math.sqrt((1 - r**2) ** 2 + (0.04 * r) ** 2)
    assert values["transmissibility"] == pytest.approx(expected)
    assert values["stiffness_per_mount"] == pytest.approx(5e6)
    assert "required_stiffness" in values
    assert any(flag.level == "warning" and "short of the target" in flag.text for flag in result.flags)


def test_below_root_two_the_mounts_amplify_instead_of_isolating() -> None:
    result = SPEC.evaluate({**FAN, "target_isolation": "", "stiffness": "42 kN/mm"})
    # Source: Chopra, Dynamics of Structures, eq. 3.5.3 with r = f / sqrt(k/m)/2pi
    r = (740 / 60) / (math.sqrt(42e6 / 9600) / (2 * math.pi))
    expected = math.sqrt(1 + (0.04 * r) ** 2) / math.sqrt((1 - r**2) ** 2 + (0.04 * r) ** 2)
    assert expected > 1.0
    assert result.values["amplification"].si() == pytest.approx(expected)
    assert "isolation" not in result.values  # no negative isolation
    assert any(flag.level == "warning" and f"Amplification by the mounts {expected:.3g} times" in flag.text
               and "sqrt(2)" in flag.text for flag in result.flags)
    assert "required_stiffness" not in result.values


def test_isolation_carries_the_caution() -> None:
    result = SPEC.evaluate(FAN)
    assert "licensed" in result.caution
    assert any("rigid support" in flag.text for flag in result.flags)
    assert any("damped" in ref.method for ref in result.references)


def test_series_cover_root_two_and_the_operating_point() -> None:
    result = SPEC.evaluate(FAN)
    ratio = result.series["frequency_ratio"]
    assert math.sqrt(2) in ratio and result.values["frequency_ratio"].si() in ratio
    assert set(result.series) == {"frequency_ratio", "transmissibility"}


def test_si_and_us_inputs_give_the_same_si_result() -> None:
    si = SPEC.evaluate({**FAN, "stiffness": "5 kN/mm"})
    # Source: NIST SP 811 (2008), B.9: 1 lbf = 4.4482216152605 N, 1 in = 0.0254 m; g0 = 9.80665 m/s^2
    us = SPEC.evaluate({"frequency": f"{740 / 60!r} Hz", "mass": f"{9600 * 9.80665 / 4448.2216152605!r} kip",
                        "mounts": "4", "damping": "0.02", "target_isolation": "0.9",
                        "stiffness": f"{5e6 * 0.0254 / 4.4482216152605!r} lbf/in"})
    for name, value in si.values.items():
        assert us.values[name].si() == pytest.approx(value.si(), rel=1e-9)


def _undamped_transmissibility(mass: float, stiffness: float, frequency: float) -> float:
    """|support force / applied force| of a mass on a spring without damping, at ``frequency`` (Hz)."""
    from scipy.signal import freqresp

    # Oracle: scipy.signal.freqresp of k / (m s^2 + k), the support force k u over the force on the mass
    _, response = freqresp(([stiffness], [mass, 0.0, stiffness]), w=[2 * math.pi * frequency])
    return float(abs(response[0]))


@pytest.mark.parametrize("damping", ["0", "0 %", ""])
@pytest.mark.parametrize("stiffness", ["5 kN/mm", "42 kN/mm", "200 kN/mm"])
def test_no_damping_uses_the_undamped_transmissibility(damping: str, stiffness: str) -> None:
    result = SPEC.evaluate({**FAN, "target_isolation": "", "stiffness": stiffness, "damping": damping})
    k = result.values["stiffness"].si()
    expected = _undamped_transmissibility(9600.0, k, 740 / 60)
    assert result.values["transmissibility"].si() == pytest.approx(expected, rel=1e-9)
    r = result.values["frequency_ratio"].si()
    # Source: Chopra, Dynamics of Structures, sec. 3.5: T = 1 / |1 - r^2| without damping
    assert result.values["transmissibility"].si() == pytest.approx(1 / abs(1 - r**2), rel=1e-12)
    assert result.values["peak_transmissibility"].si() == "unbounded"
    assert result.values["peak_frequency"].si() == pytest.approx(result.values["natural_frequency"].si())
    assert any(flag.level == "caution" and "unbounded" in flag.text and "0.5 %" in flag.text
               for flag in result.flags)
    assert ("no damping given" in " ".join(flag.text for flag in result.flags)) == (damping == "")
    if expected <= 1:
        assert result.values["isolation"].si() == pytest.approx(1 - expected, rel=1e-9)
    else:
        assert result.values["amplification"].si() == pytest.approx(expected, rel=1e-9)
    assert all(np.all(np.isfinite(curve)) for curve in result.series.values())
    assert np.max(result.series["transmissibility"]) <= max(1000.0, expected)


def test_running_exactly_at_resonance_without_damping_is_refused() -> None:
    # Source: Chopra, Dynamics of Structures, sec. 3.5: T = 1/|1 - r^2| has no bound at r = 1
    texts = {"frequency": "10 Hz", "mass": "1 kg", "mounts": "1", "damping": "0",
             "stiffness": f"{(2 * math.pi * 10) ** 2!r} N/m"}
    with pytest.raises(InputError) as caught:
        SPEC.evaluate(texts)
    assert str(caught.value).startswith("Mount damping ratio: ") and "unbounded" in str(caught.value)
    assert SPEC.evaluate({**texts, "damping": "0.5 %"}).values["transmissibility"].si() == pytest.approx(
        math.sqrt(1 + 0.01**2) / 0.01)  # Source: Chopra eq. 3.5.3 at r = 1


def test_required_frequency_without_damping() -> None:
    result = SPEC.evaluate({**FAN, "damping": "0"})
    f = 740 / 60
    # Source: Chopra, Dynamics of Structures, sec. 3.5: undamped T = 1/(r^2 - 1) = 0.1 at r = sqrt(11)
    assert result.values["required_natural_frequency"].si() == pytest.approx(f / math.sqrt(11), rel=1e-12)
    k = result.values["required_stiffness"].si()
    assert _undamped_transmissibility(9600.0, k, f) == pytest.approx(0.1, rel=1e-9)
    assert result.values["isolation"].si() == pytest.approx(0.9, rel=1e-9)
    assert not any("solved with damping" in flag.text for flag in result.flags)


def test_load_per_mount() -> None:
    result = SPEC.evaluate(FAN)
    # Common practice (no source): the weight m g0 shared equally by the mounts; g0 = 9.80665 m/s^2 (3rd CGPM)
    assert result.values["load_per_mount"].si() == pytest.approx(9600 * 9.80665 / 4, rel=1e-12)
    assert result.values["load_per_mount"].kind == "force"


def test_bare_damping_is_a_percentage() -> None:
    bare = SPEC.evaluate({**FAN, "damping": "5"})
    typed = SPEC.evaluate({**FAN, "damping": "5 %"})
    # Common practice (no source): damping ratios are quoted in per cent
    assert bare.values["required_stiffness"].si() == pytest.approx(typed.values["required_stiffness"].si())
    assert any(flag.text == "Mount damping ratio: read as 5 %" for flag in bare.flags)


@pytest.mark.parametrize(("change", "flagged"), [
    ({"target_isolation": "", "stiffness": "0.9 kN/mm"}, "check the stiffness unit"),  # 105 mm
    ({"target_isolation": "", "stiffness": "1 kN/mm"}, ""),  # 94 mm
    ({"frequency": "300 rpm", "target_isolation": "95 %"}, "mounts this soft"),
    ({"frequency": "740"}, "check the unit"),  # 740 Hz: a speed typed without rpm
    ({"frequency": "100 Hz"}, ""),
])
def test_implausible_inputs_get_a_note(change: dict[str, str], flagged: str) -> None:
    result = SPEC.evaluate({**FAN, **change})
    deflection = 9600 * STANDARD_GRAVITY / result.values["stiffness"].si()
    # Common practice (no source): more than 100 mm under its own weight, or above 100 Hz (6000 rpm), is most
    # often a slip of unit
    notes = [flag.text for flag in result.flags if flag.level == "caution" and "check" in flag.text]
    if flagged:
        assert any(flagged in note for note in notes), notes
    else:
        assert deflection <= 0.1 and not notes


@pytest.mark.parametrize(("change", "field"), [
    ({"mass": "0 t"}, "Mass"),
    ({"mass": "-9.6 t"}, "Mass"),
    ({"mounts": "0"}, "Number of mounts"),
    ({"mounts": "2.5"}, "Number of mounts"),
    ({"mounts": "-4"}, "Number of mounts"),
    ({"damping": "-2 %"}, "Mount damping"),
    ({"target_isolation": "0 %"}, "Target isolation"),
    ({"target_isolation": "100 %"}, "Target isolation"),
    ({"target_isolation": "120 %"}, "Target isolation"),
    ({"target_isolation": "3 kN"}, "Target isolation"),
    ({"target_isolation": "", "stiffness": "0 kN/mm"}, "Mount stiffness"),
    ({"target_isolation": ""}, "Mount stiffness"),
    ({"stiffness": "9.6 t"}, "Mount stiffness"),
    ({"frequency": "0 rpm"}, "Operating frequency"),
    ({"frequency": "12 kg"}, "Operating frequency"),
])
def test_bad_input_names_the_field(change: dict[str, str], field: str) -> None:
    with pytest.raises(InputError) as caught:
        SPEC.evaluate({**FAN, **change})
    assert str(caught.value).startswith(field)


@settings(max_examples=300, deadline=None)
@given(design=st.sampled_from(["target", "stiffness", "both"]), field=st.sampled_from([f.name for f in SPEC.fields]),
       text=TEXTS)
def test_any_text_in_any_field_raises_only_input_error(design: str, field: str, text: str) -> None:
    texts = dict(FAN)
    if design != "target":
        texts["stiffness"] = "5 kN/mm"
    if design == "stiffness":
        texts["target_isolation"] = ""
    texts[field] = text
    try:
        result = SPEC.evaluate(texts)
    except InputError:
        return
    assert all(v.is_word or math.isfinite(v.si()) for v in result.values.values())
    assert all(np.all(np.isfinite(s)) for s in result.series.values())
