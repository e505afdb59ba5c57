"""Shear-building modes and modal response-spectrum combination.

A shear building is a chain of storey masses (kg) joined by storey stiffnesses (N/m),
numbered from the ground up; storey 1 is the one on the base. All functions take and
return SI magnitudes (kg, N/m, rad/s, s, m, N, m/s^2).
"""

from __future__ import annotations

import math
from dataclasses import dataclass

import numpy as np

SOFT_STOREY_RATIO = 0.70
"""A storey stiffer than 70 % of the storey above passes the soft-storey screen."""
SOFT_STOREY_AVERAGE_RATIO = 0.80
"""... and stiffer than 80 % of the average of the three storeys above."""
ROOF_TOLERANCE = 1e-9
"""A mode whose roof motion is below this share of its largest motion counts as having none."""
MASS_PARTICIPATION_TARGET = 0.90
"""Effective modal mass the modes taken into account must reach (share of the total)."""


@dataclass(frozen=True)
class Modes:
    """Undamped modes of a shear building, ordered from the longest period.

    ``shapes[n, j]`` is mode n at floor j (bottom to top), normalised to 1 at the roof; a mode
    without roof motion (``roof_free[n]``, a mode confined below a very soft storey) is
    normalised to its largest value instead.
    ``participation[n]`` is Gamma_n = phi_n^T M 1 / phi_n^T M phi_n, ``effective_mass[n]`` is
    M_n* = (phi_n^T M 1)^2 / phi_n^T M phi_n in kg.
    """

    omega: np.ndarray
    shapes: np.ndarray
    participation: np.ndarray
    effective_mass: np.ndarray
    roof_free: np.ndarray

    @property
    def periods(self) -> np.ndarray:
        """Natural periods in s."""
        return 2.0 * math.pi / self.omega

    def effective_mass_ratio(self, total_mass: float) -> np.ndarray:
        """Effective modal mass of each mode as a share of ``total_mass``."""
        return self.effective_mass / total_mass


def stiffness_matrix(stiffnesses: np.ndarray) -> np.ndarray:
    """Tridiagonal stiffness matrix (N/m) of a fixed-base shear building."""
    k = np.asarray(stiffnesses, dtype=float)
    above = np.append(k[1:], 0.0)
    matrix = np.diag(k + above)
    matrix -= np.diag(k[1:], 1) + np.diag(k[1:], -1)
    return matrix


def modes(masses: np.ndarray, stiffnesses: np.ndarray) -> Modes:
    """Solve K phi = omega^2 M phi (scipy.linalg.eigh) for a fixed-base shear building."""
    from scipy.linalg import eigh

    m = np.asarray(masses, dtype=float)
    eigenvalues, vectors = eigh(stiffness_matrix(stiffnesses), np.diag(m))
    largest = vectors[np.argmax(np.abs(vectors), axis=0), np.arange(vectors.shape[1])]
    roof_free = np.abs(vectors[-1, :]) < ROOF_TOLERANCE * np.abs(largest)
    shapes = (vectors / np.where(roof_free, largest, vectors[-1, :])).T
    modal_mass = np.einsum("nj,j,nj->n", shapes, m, shapes)
    excitation = shapes @ m
    return Modes(omega=np.sqrt(eigenvalues), shapes=shapes, participation=excitation / modal_mass,
                 effective_mass=excitation**2 / modal_mass, roof_free=roof_free)


def modes_for_mass_share(ratios: np.ndarray, share: float = MASS_PARTICIPATION_TARGET) -> int:
    """Fewest leading modes whose effective mass ratios sum to at least ``share``."""
    cumulative = np.cumsum(ratios)
    reached = np.nonzero(cumulative >= share - 1e-12)[0]
    return int(reached[0]) + 1 if reached.size else len(ratios)


def rayleigh_coefficients(omega_i: float, omega_j: float, zeta: float) -> tuple[float, float]:
    """Rayleigh damping C = alpha M + beta K giving ratio ``zeta`` at two angular frequencies.

    Returns alpha (1/s) and beta (s).
    """
    alpha = 2.0 * zeta * omega_i * omega_j / (omega_i + omega_j)
    beta = 2.0 * zeta / (omega_i + omega_j)
    return alpha, beta


def rayleigh_damping_ratios(omega: np.ndarray, alpha: float, beta: float) -> np.ndarray:
    """Damping ratio of each mode under Rayleigh damping: alpha / (2 omega) + beta omega / 2."""
    return alpha / (2.0 * omega) + beta * omega / 2.0


def soft_storeys(stiffnesses: np.ndarray) -> list[tuple[int, str]]:
    """Storeys (1-based) that fail the soft-storey screen, with the reason in words."""
    k = np.asarray(stiffnesses, dtype=float)
    found = []
    for i in range(len(k) - 1):
        share = k[i] / k[i + 1]
        above = k[i + 1:i + 4]
        average_share = k[i] / above.mean()
        if share < SOFT_STOREY_RATIO:
            found.append((i + 1, f"{share:.0%} of the storey above"))
        elif len(above) == 3 and average_share < SOFT_STOREY_AVERAGE_RATIO:
            found.append((i + 1, f"{average_share:.0%} of the average of the three storeys above"))
    return found


def correlation_cqc(omega: np.ndarray, zeta: float | np.ndarray) -> np.ndarray:
    """Der Kiureghian (1981) CQC correlation coefficients rho_in between modes.

    rho = 8 sqrt(z_i z_n) (z_i + r z_n) r^1.5 / ((1 - r^2)^2 + 4 z_i z_n r (1 + r^2) + 4 (z_i^2 + z_n^2) r^2)
    with r = omega_n / omega_i; rho_ii = 1.
    """
    w = np.asarray(omega, dtype=float)
    z = np.broadcast_to(np.asarray(zeta, dtype=float), w.shape)
    r = w[None, :] / w[:, None]
    zi, zn = z[:, None], z[None, :]
    numerator = 8.0 * np.sqrt(zi * zn) * (zi + r * zn) * r**1.5
    denominator = (1.0 - r**2) ** 2 + 4.0 * zi * zn * r * (1.0 + r**2) + 4.0 * (zi**2 + zn**2) * r**2
    with np.errstate(invalid="ignore", divide="ignore"):
        rho = np.where(denominator > 0, numerator / np.where(denominator > 0, denominator, 1.0), 1.0)
    return rho


def combine_srss(peaks: np.ndarray) -> np.ndarray:
    """Square root of the sum of squares over modes (axis 0)."""
    return np.sqrt(np.sum(np.asarray(peaks) ** 2, axis=0))


def combine_cqc(peaks: np.ndarray, rho: np.ndarray) -> np.ndarray:
    """Complete quadratic combination over modes (axis 0) with correlations ``rho``."""
    r = np.asarray(peaks, dtype=float)
    return np.sqrt(np.maximum(np.einsum("i...,ij,j...->...", r, rho, r), 0.0))


@dataclass(frozen=True)
class ModalPeaks:
    """Peak modal responses, one row per mode: floor displacements (m), inter-storey drifts (m),
    storey shears (N), storey 1 at the base."""

    displacement: np.ndarray
    drift: np.ndarray
    shear: np.ndarray


def modal_peaks(found: Modes, masses: np.ndarray, pseudo_acceleration: np.ndarray) -> ModalPeaks:
    """Peak responses of each mode to spectral pseudo-accelerations A_n (m/s^2).

    u_n = Gamma_n phi_n A_n / omega_n^2; storey shear is the sum of the equivalent static
    forces f_n = Gamma_n M phi_n A_n at and above the storey.
    """
    m = np.asarray(masses, dtype=float)
    a = np.asarray(pseudo_acceleration, dtype=float)
    scale = (found.participation * a)[:, None] * found.shapes
    displacement = scale / (found.omega**2)[:, None]
    drift = np.diff(displacement, axis=1, prepend=0.0)
    forces = scale * m[None, :]
    shear = np.cumsum(forces[:, ::-1], axis=1)[:, ::-1]
    return ModalPeaks(displacement, drift, shear)
