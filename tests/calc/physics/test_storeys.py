"""Shear-building modes, participation, Rayleigh damping and modal combination."""

from __future__ import annotations

import math

import numpy as np
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from fieldmode.calc.physics import storeys


@pytest.mark.parametrize("count", [1, 2, 3, 5, 12])
def test_uniform_chain_matches_closed_form(count: int) -> None:
    m, k = 2.4e5, 1.5e8
    found = storeys.modes(np.full(count, m), np.full(count, k))
    n = np.arange(1, count + 1)
    # Source: uniform fixed-base shear building, omega_n = 2 sqrt(k/m) sin((2n-1) pi / (2(2N+1)))
    expected = 2 * math.sqrt(k / m) * np.sin((2 * n - 1) * math.pi / (2 * (2 * count + 1)))
    np.testing.assert_allclose(found.omega, expected, rtol=1e-10)


def test_two_storey_textbook_example() -> None:
    m, k = 1.0e5, 2.0e7
    found = storeys.modes(np.array([2 * m, m]), np.array([2 * k, k]))
    # From memory: Chopra, Dynamics of Structures, ch. 10, two-storey frame m1 = 2m, m2 = m, k1 = 2k, k2 = k
    np.testing.assert_allclose(found.omega, [math.sqrt(k / (2 * m)), math.sqrt(2 * k / m)], rtol=1e-12)
    np.testing.assert_allclose(found.shapes, [[0.5, 1.0], [-1.0, 1.0]], atol=1e-12)


def test_shapes_agree_with_a_general_eigensolver() -> None:
    from scipy.linalg import eig

    masses = np.array([310e3, 300e3, 240e3, 180e3])
    stiffnesses = np.array([180e6, 160e6, 120e6, 90e6])
    found = storeys.modes(masses, stiffnesses)
    # Oracle: scipy.linalg.eig on the unsymmetric M^-1 K
    values, vectors = eig(np.diag(1 / masses) @ storeys.stiffness_matrix(stiffnesses))
    order = np.argsort(values.real)
    np.testing.assert_allclose(found.omega, np.sqrt(values.real[order]), rtol=1e-10)
    np.testing.assert_allclose(found.shapes, (vectors[:, order] / vectors[-1, order]).T.real, atol=1e-9)


def test_stiffness_matrix_of_two_storeys() -> None:
    # Source: shear-building stiffness matrix [[k1 + k2, -k2], [-k2, k2]] (Chopra, Dynamics of Structures, ch. 9)
    np.testing.assert_array_equal(storeys.stiffness_matrix(np.array([3.0, 2.0])), [[5.0, -2.0], [-2.0, 2.0]])


@settings(max_examples=60, deadline=None)
@given(st.lists(st.tuples(st.floats(1e3, 1e7), st.floats(1e6, 1e10)), min_size=1, max_size=25))
def test_effective_masses_sum_to_the_total(chain: list[tuple[float, float]]) -> None:
    masses = np.array([m for m, _ in chain])
    stiffnesses = np.array([k for _, k in chain])
    found = storeys.modes(masses, stiffnesses)
    # Source: Chopra, Dynamics of Structures, ch. 13: the effective modal masses sum to the total mass
    assert found.effective_mass.sum() == pytest.approx(masses.sum(), rel=1e-9)
    # Source: Chopra, ch. 13: sum of Gamma_n phi_n is 1 at every floor
    np.testing.assert_allclose(found.participation @ found.shapes, np.ones(len(chain)), rtol=1e-7)


def test_two_storey_participation_by_hand() -> None:
    m, k = 1.0e5, 2.0e7
    found = storeys.modes(np.array([2 * m, m]), np.array([2 * k, k]))
    # Source: hand calculation, Gamma = phi^T M 1 / phi^T M phi with the textbook shapes [1/2, 1], [-1, 1]
    np.testing.assert_allclose(found.participation, [(2 * m * 0.5 + m) / (2 * m * 0.25 + m),
                                                     (-2 * m + m) / (2 * m + m)], rtol=1e-12)
    np.testing.assert_allclose(found.effective_mass, [(2 * m) ** 2 / (1.5 * m), m**2 / (3 * m)], rtol=1e-12)


def test_modes_for_mass_share() -> None:
    # Source: EN 1998-1:2004 4.3.3.3.1(3): modes until 90 % of the mass (from memory)
    assert storeys.modes_for_mass_share(np.array([0.80, 0.09, 0.11])) == 3
    assert storeys.modes_for_mass_share(np.array([0.80, 0.10, 0.10])) == 2
    assert storeys.modes_for_mass_share(np.array([0.95, 0.05])) == 1


def test_rayleigh_damping_gives_the_ratio_at_both_modes() -> None:
    w1, w2, zeta = 11.0, 28.0, 0.05
    alpha, beta = storeys.rayleigh_coefficients(w1, w2, zeta)
    # From memory: Chopra, Dynamics of Structures, ch. 11: zeta_n = alpha/(2 w_n) + beta w_n/2, solved at two modes
    expected = np.linalg.solve([[1 / (2 * w1), w1 / 2], [1 / (2 * w2), w2 / 2]], [zeta, zeta])
    np.testing.assert_allclose([alpha, beta], expected, rtol=1e-12)
    ratios = storeys.rayleigh_damping_ratios(np.array([w1, 20.0, w2, 40.0]), alpha, beta)
    assert ratios[1] < zeta < ratios[3]  # From memory: Chopra, ch. 11: below zeta between the modes, above outside


@pytest.mark.parametrize(("stiffnesses", "soft"), [
    ([100.0, 160.0, 160.0], [1]),           # 62 % of the storey above
    ([120.0, 160.0], []),                   # 75 %: passes
    ([125.0, 150.0, 160.0, 170.0], [1]),    # 83 % of above, 78 % of the average of three above
    ([130.0, 160.0, 160.0, 160.0], []),     # 81 % of above and of the average
    ([200.0, 100.0, 150.0], [2]),           # 67 % of the storey above, at storey 2
])
def test_soft_storey_screen(stiffnesses: list[float], soft: list[int]) -> None:
    # From memory: ASCE 7-16 Table 12.3-2 type 1a: below 70 % of the storey above or 80 % of the average of three
    assert [storey for storey, _ in storeys.soft_storeys(np.array(stiffnesses))] == soft


def test_cqc_correlation_formula() -> None:
    zeta, r = 0.05, 2.0
    rho = storeys.correlation_cqc(np.array([10.0, 10.0 * r]), zeta)
    # Source: Der Kiureghian (1981), equal damping: 8 z^2 (1 + r) r^1.5 / ((1 - r^2)^2 + 4 z^2 r (1 + r)^2)
    expected = 8 * zeta**2 * (1 + r) * r**1.5 / ((1 - r**2) ** 2 + 4 * zeta**2 * r * (1 + r) ** 2)
    np.testing.assert_allclose(rho, [[1.0, expected], [expected, 1.0]], rtol=1e-12)
    # Source: Der Kiureghian (1981): modes of equal frequency are fully correlated
    assert storeys.correlation_cqc(np.array([7.0, 7.0]), zeta)[0, 1] == pytest.approx(1.0)


def test_two_storey_srss_and_cqc_by_hand() -> None:
    m, k, zeta, sa = 1.0e5, 2.0e7, 0.05, 2.0
    masses = np.array([2 * m, m])
    found = storeys.modes(masses, np.array([2 * k, k]))
    peaks = storeys.modal_peaks(found, masses, np.array([sa, sa]))
    # Source: hand calculation from the textbook modes (Chopra ch. 10, from memory):
    # Gamma = 4/3 and -1/3, omega^2 = k/2m and 2k/m, u = Gamma phi A / omega^2
    roof = np.array([4 / 3 * 1.0 * sa * 2 * m / k, -1 / 3 * 1.0 * sa * m / (2 * k)])
    first = np.array([4 / 3 * 0.5 * sa * 2 * m / k, -1 / 3 * -1.0 * sa * m / (2 * k)])
    base = np.array([4 / 3 * 2 * m * sa, -1 / 3 * -m * sa])  # Gamma_n (phi_n^T M 1) A = M_n* A
    np.testing.assert_allclose(peaks.displacement, np.column_stack([first, roof]), rtol=1e-12)
    np.testing.assert_allclose(peaks.drift[:, 1], roof - first, rtol=1e-12)
    np.testing.assert_allclose(peaks.shear[:, 0], base, rtol=1e-12)
    np.testing.assert_allclose(peaks.shear[:, 1], [4 / 3 * m * sa, -1 / 3 * m * sa], rtol=1e-12)
    r = 2.0
    rho = 8 * zeta**2 * (1 + r) * r**1.5 / ((1 - r**2) ** 2 + 4 * zeta**2 * r * (1 + r) ** 2)
    assert storeys.combine_srss(peaks.displacement)[1] == pytest.approx(math.hypot(*roof), rel=1e-12)
    cqc = storeys.combine_cqc(peaks.displacement, storeys.correlation_cqc(found.omega, zeta))
    assert cqc[1] == pytest.approx(math.sqrt(roof[0] ** 2 + roof[1] ** 2 + 2 * rho * roof[0] * roof[1]), rel=1e-12)
    assert storeys.combine_srss(peaks.shear)[0] == pytest.approx(math.hypot(*base), rel=1e-12)


def test_storey_shear_equals_stiffness_times_drift() -> None:
    masses, stiffnesses = np.array([310e3, 300e3, 240e3]), np.array([180e6, 160e6, 120e6])
    found = storeys.modes(masses, stiffnesses)
    peaks = storeys.modal_peaks(found, masses, np.array([3.0, 2.0, 1.5]))
    # Source: shear building statics, V_j = k_j (u_j - u_{j-1}) (Chopra, Dynamics of Structures, ch. 9)
    np.testing.assert_allclose(peaks.shear, peaks.drift * stiffnesses[None, :], rtol=1e-9)
