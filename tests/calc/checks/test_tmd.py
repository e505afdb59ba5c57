"""Check `tmd`: damper sizing, stroke, excitations and bad input."""

from __future__ import annotations

import math

import numpy as np
import pytest

from fieldmode.calc.checks import BY_ID
from fieldmode.calc.framework.units import InputError

SPEC = BY_ID["tmd"]


def evaluate(**texts: str):  # noqa: ANN201
    given_texts = SPEC.demo_texts()
    given_texts.update(texts)
    return SPEC.evaluate({k: v for k, v in given_texts.items() if v})


def test_demo_footbridge_damper_sizing() -> None:
    result = evaluate()
    mu, f, m = 0.02, 2.1, 18e3
    values = {name: value.si() for name, value in result.values.items()}
    assert values["tmd_mass"] == pytest.approx(mu * m)
    # Source: Den Hartog, Mechanical Vibrations: f_d = f / (1 + mu), c = 2 m_d omega_p sqrt(3 mu / (8 (1+mu)^3))
    assert values["tmd_frequency"] == pytest.approx(f / (1 + mu))
    assert values["tmd_stiffness"] == pytest.approx(mu * m * (2 * math.pi * f / (1 + mu)) ** 2)
    assert values["tmd_damping_coefficient"] == pytest.approx(
        2 * mu * m * 2 * math.pi * f * math.sqrt(3 * mu / (8 * (1 + mu) ** 3)))
    assert values["tmd_damping_ratio"] == pytest.approx(math.sqrt(3 * mu / (8 * (1 + mu))))
    # Source: Chopra, Dynamics of Structures, ch. 3: without the damper the peak is 1 / (2 zeta sqrt(1 - zeta^2))
    assert values["peak_amplification_without"] == pytest.approx(1 / (2 * 0.006 * math.sqrt(1 - 0.006**2)))
    # Source: Den Hartog: sqrt(1 + 2/mu) for an undamped mode; the mode's own 0.6 % damping only lowers it
    assert values["peak_amplification"] < math.sqrt(1 + 2 / mu)
    assert values["peak_amplification_mistuned_low"] > values["peak_amplification"]
    assert values["peak_amplification_mistuned_high"] > values["peak_amplification"]
    series = result.series
    assert len(series["frequency_ratio"]) == len(series["amplification"]) == len(series["amplification_without"])


@pytest.mark.filterwarnings("ignore::scipy.signal.BadCoefficients")
def test_stroke_for_a_force_against_state_space() -> None:
    from scipy import signal

    result = evaluate(damping="0 %", force="0.5 kN")
    mu, f, m, force = 0.02, 2.1, 18e3, 500.0
    omega = 2 * math.pi * f
    tuning, zeta_d = 1 / (1 + mu), math.sqrt(3 * mu / (8 * (1 + mu)))
    k_d, c_d = mu * m * (tuning * omega) ** 2, 2 * zeta_d * mu * m * tuning * omega
    a = np.array([[0, 0, 1, 0], [0, 0, 0, 1],
                  [-(m * omega**2 + k_d) / m, k_d / m, -c_d / m, c_d / m],
                  [k_d / (mu * m), -k_d / (mu * m), c_d / (mu * m), -c_d / (mu * m)]])
    b = np.array([[0], [0], [1 / m], [0]])
    # Oracle: scipy.signal.freqresp of the damper's relative motion, in physical units, on a fine grid
    w = omega * np.linspace(0.7, 1.3, 60001)
    _, stroke = signal.freqresp(signal.StateSpace(a, b, np.array([[-1.0, 1.0, 0, 0]]), np.zeros((1, 1))), w)
    _, primary = signal.freqresp(signal.StateSpace(a, b, np.array([[1.0, 0, 0, 0]]), np.zeros((1, 1))), w)
    assert result.values["stroke"].si() == pytest.approx(force * np.abs(stroke).max(), rel=1e-5)
    assert result.values["peak_displacement"].si() == pytest.approx(force * np.abs(primary).max(), rel=1e-5)
    assert any("unbounded" in flag.text for flag in result.flags)


def test_ground_excitation_uses_warburton() -> None:
    result = evaluate(excitation="ground", ground_acceleration="0.05 m/s^2")
    mu = 0.02
    # From memory: Warburton (1982): f = sqrt(1 - mu/2) / (1 + mu)
    assert result.values["tuning_ratio"].si() == pytest.approx(math.sqrt(1 - mu / 2) / (1 + mu))
    assert "Warburton" in result.references[0].source
    assert result.values["stroke"].si() > 0


def test_target_damping_solves_for_the_mass_ratio() -> None:
    result = evaluate(mass_ratio="", target_damping="4 %", damping="0 %")
    mu = result.values["mass_ratio"].si()
    # Source: Den Hartog peak sqrt(1 + 2/mu) equal to a single mass's 1/(2 zeta sqrt(1 - zeta^2)) at zeta = 4 %
    closed = 2 / ((1 / (2 * 0.04 * math.sqrt(1 - 0.04**2))) ** 2 - 1)
    assert closed <= mu <= 1.03 * closed
    assert result.values["equivalent_damping"].si() == pytest.approx(0.04, rel=1e-4)


@pytest.mark.parametrize(("texts", "field", "words"), [
    ({"mass_ratio": "0"}, "Mass ratio", "at least 0.1000 %"),
    ({"mass_ratio": "0 %"}, "Mass ratio", "at least"),
    ({"mass_ratio": "-2 %"}, "Mass ratio", "at least"),
    ({"mass_ratio": "60 %"}, "Mass ratio", "at most 50.00 %"),
    ({"mass_ratio": ""}, "Mass ratio", "give mass ratio or target equivalent damping"),
    ({"target_damping": "5 %"}, "Target equivalent damping", "give only one"),
    ({"mass_ratio": "", "target_damping": "0.5 %"}, "Target equivalent damping", "above the mode's own damping"),
    ({"mass_ratio": "", "target_damping": "40 %"}, "Target equivalent damping", "50 %"),
    ({"frequency": "0 Hz"}, "Mode frequency", "greater than zero"),
    ({"frequency": "-2 Hz"}, "Mode frequency", "greater than zero"),
    ({"frequency": "2 kg"}, "Mode frequency", "not a unit of frequency"),
    ({"modal_mass": "0 t"}, "Modal mass", "greater than zero"),
    ({"modal_mass": ""}, "Modal mass", "required"),
    ({"damping": "80 %"}, "Mode damping ratio", "at most"),
    ({"excitation": "wind"}, "Excitation", "not one of the choices"),
    ({"force": "-1 kN"}, "Force amplitude", "greater than zero"),
    ({"force": "0 kN"}, "Force amplitude", "greater than zero"),
])
def test_bad_inputs_name_the_field(texts: dict[str, str], field: str, words: str) -> None:
    given_texts = SPEC.demo_texts()
    given_texts.update(texts)
    with pytest.raises(InputError) as caught:
        SPEC.evaluate(given_texts)
    assert str(caught.value).startswith(field)
    assert words in str(caught.value)


def test_load_of_the_other_excitation_is_ignored_with_a_note() -> None:
    result = evaluate(ground_acceleration="0.1 m/s^2")
    assert "stroke" not in result.values
    assert any("ignored" in flag.text for flag in result.flags)
