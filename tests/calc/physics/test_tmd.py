"""Tuned mass damper optima and the two-mass response."""

from __future__ import annotations

import math

import numpy as np
import pytest

from fieldmode.calc.physics import tmd

MASS_RATIOS = [0.005, 0.01, 0.02, 0.05, 0.1, 0.2, 0.5]


def _state_space(mu: float, tuning: float, zeta_d: float, zeta_p: float, excitation: str):  # noqa: ANN202
    """The two-mass system written independently as x' = A x + B u, outputs primary and stroke."""
    from scipy import signal

    k_d, c_d, c_p = mu * tuning**2, 2 * zeta_d * mu * tuning, 2 * zeta_p
    mass = np.diag([1.0, mu])
    stiffness = np.array([[1 + k_d, -k_d], [-k_d, k_d]])
    damping = np.array([[c_p + c_d, -c_d], [-c_d, c_d]])
    inverse = np.linalg.inv(mass)
    a = np.block([[np.zeros((2, 2)), np.eye(2)], [-inverse @ stiffness, -inverse @ damping]])
    load = np.array([[1.0], [mu if excitation == "ground" else 0.0]])
    b = np.vstack([np.zeros((2, 1)), inverse @ load])
    c = np.array([[1.0, 0, 0, 0], [-1.0, 1.0, 0, 0]])
    return signal.StateSpace(a, b, c, np.zeros((2, 1)))


@pytest.mark.parametrize("mu", MASS_RATIOS)
def test_den_hartog_closed_forms(mu: float) -> None:
    best = tmd.den_hartog(mu)
    # Source: Den Hartog, Mechanical Vibrations: optimum tuning f = 1/(1+mu)
    assert best.tuning == pytest.approx(1 / (1 + mu), rel=1e-14)
    # Source: Den Hartog, Mechanical Vibrations: c/(2 m_d omega_p) = sqrt(3 mu / (8 (1+mu)^3)); ours is on omega_d
    assert best.damping * best.tuning == pytest.approx(math.sqrt(3 * mu / (8 * (1 + mu) ** 3)), rel=1e-12)
    # Source: Den Hartog, Mechanical Vibrations: peak amplification sqrt(1 + 2/mu) at optimum tuning
    assert best.peak == pytest.approx(math.sqrt(1 + 2 / mu), rel=1e-14)


@pytest.mark.parametrize("mu", MASS_RATIOS)
def test_numerical_peak_matches_den_hartog_for_an_undamped_mode(mu: float) -> None:
    best = tmd.den_hartog(mu)
    peak, _ = tmd.peak(mu, best.tuning, best.damping, 0.0, "force")
    # Source: Den Hartog, Mechanical Vibrations: peak sqrt(1 + 2/mu); his damping rule is the fixed-point
    # approximation, so the true peak lies a little above
    assert math.sqrt(1 + 2 / mu) <= peak <= 1.01 * math.sqrt(1 + 2 / mu)


@pytest.mark.parametrize("mu", [0.01, 0.05, 0.2])
@pytest.mark.parametrize("zeta_d", [0.0, 0.02, 0.1, 0.4, 5.0])
def test_fixed_points_are_equal_height_whatever_the_damping(mu: float, zeta_d: float) -> None:
    best = tmd.den_hartog(mu)
    # Source: Den Hartog, Mechanical Vibrations: the fixed points of the optimally tuned damper lie at
    # r^2 = (1 -/+ sqrt(mu / (2 + mu))) / (1 + mu), and both stand at sqrt(1 + 2/mu)
    root = math.sqrt(mu / (2.0 + mu))
    ratios = np.sqrt(np.array([1.0 - root, 1.0 + root]) / (1.0 + mu))
    primary, _ = tmd.response(ratios, mu, best.tuning, zeta_d, 0.0, "force")
    np.testing.assert_allclose(np.abs(primary), math.sqrt(1 + 2 / mu), rtol=1e-9)


@pytest.mark.parametrize("mu", [0.01, 0.02, 0.05, 0.1, 0.2])
def test_warburton_ground_optimum(mu: float) -> None:
    best = tmd.warburton_ground(mu)
    # From memory: Warburton (1982), harmonic ground acceleration: f = sqrt(1 - mu/2)/(1 + mu),
    # zeta = sqrt(3 mu / (8 (1 + mu)(1 - mu/2))), peak (1 + mu) sqrt(2/mu)
    assert best.tuning == pytest.approx(math.sqrt(1 - mu / 2) / (1 + mu), rel=1e-14)
    assert best.damping == pytest.approx(math.sqrt(3 * mu / (8 * (1 + mu) * (1 - mu / 2))), rel=1e-14)
    peak, _ = tmd.peak(mu, best.tuning, best.damping, 0.0, "ground")
    assert best.peak <= peak <= 1.01 * best.peak


@pytest.mark.filterwarnings("ignore::scipy.signal.BadCoefficients")
@pytest.mark.parametrize("excitation", ["force", "ground"])
@pytest.mark.parametrize(("mu", "tuning", "zeta_d", "zeta_p"), [(0.02, 0.98, 0.086, 0.006), (0.1, 0.9, 0.18, 0.03),
                                                                 (0.3, 1.1, 0.05, 0.0)])
def test_frequency_response_against_state_space(excitation: str, mu: float, tuning: float, zeta_d: float,
                                                zeta_p: float) -> None:
    from scipy import signal

    ratios = np.linspace(0.3, 2.0, 57)
    primary, stroke = tmd.response(ratios, mu, tuning, zeta_d, zeta_p, excitation)
    # Oracle: scipy.signal.freqresp of a state-space model of the same two masses
    system = _state_space(mu, tuning, zeta_d, zeta_p, excitation)
    expected_primary = signal.freqresp(signal.ss2tf(system.A, system.B, system.C[:1], system.D[:1]), ratios)[1]
    expected_stroke = signal.freqresp(signal.ss2tf(system.A, system.B, system.C[1:], system.D[1:]), ratios)[1]
    np.testing.assert_allclose(primary, expected_primary, rtol=1e-8)
    np.testing.assert_allclose(stroke, expected_stroke, rtol=1e-8, atol=1e-12)


def test_without_damper_is_the_single_mass_amplification() -> None:
    ratios, zeta = np.linspace(0.1, 3, 300), 0.03
    primary, stroke = tmd.response(ratios, 0.0, 1.0, 0.0, zeta, "force")
    # Source: Chopra, Dynamics of Structures, ch. 3: R_d = 1 / sqrt((1 - r^2)^2 + (2 zeta r)^2)
    np.testing.assert_allclose(np.abs(primary), 1 / np.sqrt((1 - ratios**2) ** 2 + (2 * zeta * ratios) ** 2),
                               rtol=1e-12)
    assert not np.any(stroke)


@pytest.mark.parametrize("zeta", [0.005, 0.02, 0.1, 0.5])
def test_bare_peak_and_equivalent_damping(zeta: float) -> None:
    # Source: Chopra, Dynamics of Structures, ch. 3: resonant peak 1 / (2 zeta sqrt(1 - zeta^2))
    assert tmd.bare_peak(zeta) == pytest.approx(1 / (2 * zeta * math.sqrt(1 - zeta**2)), rel=1e-14)
    assert tmd.equivalent_damping(tmd.bare_peak(zeta)) == pytest.approx(zeta, rel=1e-9)
    ratios = np.linspace(0.5, 1.5, 200001)
    # Oracle: brute-force maximum of the closed-form amplification on a very fine grid
    brute = np.max(1 / np.sqrt((1 - ratios**2) ** 2 + (2 * zeta * ratios) ** 2))
    assert tmd.peak(0.0, 1.0, 0.0, zeta)[0] == pytest.approx(brute, rel=1e-6)


def test_mass_ratio_for_target_damping_on_an_undamped_mode() -> None:
    target = 0.05
    mu = tmd.mass_ratio_for_damping(target, 0.0, "force")
    # Source: Den Hartog peak sqrt(1 + 2/mu) equated to a single mass's peak 1/(2 zeta sqrt(1 - zeta^2))
    closed = 2 / ((1 / (2 * target * math.sqrt(1 - target**2))) ** 2 - 1)
    assert closed <= mu <= 1.03 * closed


def test_mass_ratio_for_damping_out_of_reach() -> None:
    with pytest.raises(ValueError, match="50 %"):
        tmd.mass_ratio_for_damping(0.4, 0.0, "force")


@pytest.mark.parametrize("mu", [0.01, 0.05])
def test_mistuning_raises_the_peak(mu: float) -> None:
    best = tmd.den_hartog(mu)
    for factor in (0.95, 1.05):
        # Source: Den Hartog, Mechanical Vibrations: off the optimum tuning one fixed point rises above sqrt(1+2/mu)
        assert tmd.peak(mu, best.tuning * factor, best.damping, 0.0)[0] > math.sqrt(1 + 2 / mu)
