"""Response spectrum of an accelerogram: exact for ground acceleration linear between samples.

The single mass u'' + 2 zeta omega u' + omega^2 u = -ag(t) is advanced by the Nigam-Jennings
recurrence (Chopra, Dynamics of Structures, Table 5.2.1), i.e. the first-order-hold
discretisation x[k+1] = A x[k] + g0 ag[k] + g1 ag[k+1], whose coefficients are taken from the
matrix exponential of the augmented system (no cancellation at small omega dt).

Speed: the recurrence is regrouped in blocks of ``BLOCK`` steps. The states at the block starts
follow from the same regrouping applied to the block-to-block recurrence; every response value
inside the blocks is then a fixed linear map of the block's inputs and its start state, evaluated
for many periods at once as one matrix product (BLAS). No Python loop runs per time step.

Peaks: with at least ``STEPS_PER_PERIOD`` steps per period (sub-stepping: the record is
resampled linearly onto dt/m, m whole, which keeps the same piecewise-linear input), the largest
and smallest samples are refined by cubic Hermite interpolation of the exact values and slopes.
After the last sample the ground is at rest (reached linearly over one step); the free vibration
that follows is included exactly.

Units: acceleration m/s^2, time s, displacement m, velocity m/s; damping as a ratio.
"""

from __future__ import annotations

import math
from collections.abc import Iterator
from dataclasses import dataclass

import numpy as np

STEPS_PER_PERIOD = 20
"""Sub-stepping criterion: the step used is at most T / 20 (sampling error of a peak <= 1.2 % before
Hermite refinement, about 0.003 % after it)."""
BLOCK = 16
"""Steps per block of the block recurrence."""
CHUNK_VALUES = 1_000_000
"""Response values computed per matrix product (bounds memory to a few MB)."""
SCAN_BLOCK = 32
"""Largest group of block starts when solving the block-to-block recurrence."""
SCAN_DIRECT = 12
"""Block starts solved by a direct loop at the top level of that recurrence."""
TAYLOR_TERMS = 24
"""Terms of the Taylor series of the step's matrix exponential."""
PERIODS_PER_PRODUCT = 4
"""Periods evaluated together in one matrix product."""
MAX_WORK = 1e8
"""Largest number of period-steps (sum over periods of analysed steps) accepted."""
DEFAULT_GRID = (0.02, 10.0, 200)
"""Default period grid: shortest (s), longest (s), number of log-spaced periods."""


class WorkLimitError(ValueError):
    """The period grid and record together need more work than :data:`MAX_WORK`."""


@dataclass(frozen=True)
class Spectrum:
    """Peak responses per period (arrays over ``period``, SI)."""

    period: np.ndarray
    sd: np.ndarray
    """Peak relative displacement (m)."""
    sv: np.ndarray
    """Peak relative velocity (m/s)."""
    total_acceleration: np.ndarray
    """Peak absolute (total) acceleration (m/s^2)."""
    substeps: np.ndarray
    """Sub-steps per record step used for each period."""

    @property
    def psv(self) -> np.ndarray:
        """Pseudo-velocity omega sd (m/s)."""
        return 2.0 * math.pi / self.period * self.sd

    @property
    def psa(self) -> np.ndarray:
        """Pseudo-acceleration omega^2 sd (m/s^2)."""
        return (2.0 * math.pi / self.period) ** 2 * self.sd


@dataclass(frozen=True)
class History:
    """Response of one period at the record's samples: time (s), u (m), u' (m/s), total acceleration (m/s^2)."""

    time: np.ndarray
    displacement: np.ndarray
    velocity: np.ndarray
    total_acceleration: np.ndarray


def period_grid(shortest: float = DEFAULT_GRID[0], longest: float = DEFAULT_GRID[1],
                count: int = DEFAULT_GRID[2]) -> np.ndarray:
    """``count`` log-spaced periods from ``shortest`` to ``longest`` (s)."""
    return np.geomspace(shortest, longest, count)


def substeps(period: np.ndarray, dt: float) -> np.ndarray:
    """Sub-steps m per record step so that dt / m <= T / STEPS_PER_PERIOD."""
    return np.maximum(1, np.ceil(STEPS_PER_PERIOD * dt / np.asarray(period) - 1e-9)).astype(int)


def work(period: np.ndarray, dt: float, samples: int) -> float:
    """Period-steps the analysis of ``samples`` record steps on ``period`` takes."""
    return float(np.sum(substeps(period, dt))) * samples


def foh_coefficients(omega: np.ndarray, zeta: float, h: float) -> tuple[np.ndarray, np.ndarray, np.ndarray]:
    """Exact recurrence x[k+1] = A x[k] + g0 ag[k] + g1 ag[k+1] for x = (u, u'), step ``h`` (s).

    Returns A (P, 2, 2), g0 (P, 2), g1 (P, 2) for the angular frequencies ``omega`` (rad/s), from
    the exponential of the augmented matrix [[F h, G h, 0], [0, 0, 1], [0, 0, 0]] (as a
    first-order-hold discretisation), with u scaled by omega so that every entry is at most
    max(omega h, h, 1); its Taylor series then converges to round-off in ``TAYLOR_TERMS`` terms
    for omega h <= 2 pi / STEPS_PER_PERIOD.
    """
    count = len(omega)
    scaled = np.zeros((count, 4, 4))
    scaled[:, 0, 1] = omega * h
    scaled[:, 1, 0] = -omega * h
    scaled[:, 1, 1] = -2.0 * zeta * omega * h
    scaled[:, 1, 2] = -h
    scaled[:, 2, 3] = 1.0
    exponential = np.broadcast_to(np.eye(4), scaled.shape).copy()
    term = exponential.copy()
    for n in range(1, TAYLOR_TERMS + 1):
        term = term @ scaled / n
        exponential += term
    unscale = np.stack([1.0 / omega, np.ones(count)], axis=1)
    a = exponential[:, :2, :2] * unscale[:, :, None] / unscale[:, None, :]
    hold, ramp = exponential[:, :2, 2] * unscale, exponential[:, :2, 3] * unscale
    return a, hold - ramp, ramp


class _Group:
    """Periods sharing one analysis step h = dt/m: block maps, inputs and block start states."""

    def __init__(self, acc: np.ndarray, h: float, omega: np.ndarray, zeta: float) -> None:
        size = BLOCK
        self.h, self.omega, self.zeta = h, omega, zeta
        self.blocks = max(1, -(-(len(acc) - 1) // size))
        self.acc = np.zeros(self.blocks * size + 1)
        self.acc[: len(acc)] = acc
        a, g0, g1 = foh_coefficients(omega, zeta, h)
        count = len(omega)
        powers = _powers(a, size)
        h0 = np.concatenate([np.zeros((count, 1, 2, 1)), powers[:, :size] @ g0[:, None, :, None]], axis=1)[..., 0]
        h1 = (powers @ g1[:, None, :, None])[..., 0]
        m = np.arange(size + 1)[:, None]
        i = np.arange(size + 1)[None, :]
        lag = m - i
        forced = (np.where(lag >= 1, 1.0, 0.0)[None, :, :, None] * h0[:, np.clip(lag, 0, size)]
                  + np.where((lag >= 0) & (i >= 1), 1.0, 0.0)[None, :, :, None] * h1[:, np.clip(lag, 0, size)])
        self.forced = forced
        """(P, m, i, 2): state at step m of a block from the block's input sample i."""
        self.powers = powers
        self.outputs = np.zeros((count, 3, 2))
        self.outputs[:, 0, 0] = 1.0
        self.outputs[:, 1, 1] = 1.0
        self.outputs[:, 2, 0] = -omega**2
        self.outputs[:, 2, 1] = -2.0 * zeta * omega
        self.inputs = np.lib.stride_tricks.sliding_window_view(self.acc, size + 1)[::size].T.copy()
        self._maps: dict[type, tuple[np.ndarray, np.ndarray]] = {}
        ends = forced[:, size].transpose(0, 2, 1).reshape(2 * count, size + 1) @ self.inputs
        states = _scan(powers[:, size], np.ascontiguousarray(ends.reshape(count, 2, -1).transpose(0, 2, 1)))
        self.starts = states[:, :-1]

    starts: np.ndarray
    """(P, blocks, 2): state at the start of each block."""

    def responses(self, periods: slice, blocks: slice, dtype: type = np.float64) -> np.ndarray:
        """u, u', total acceleration (c, 3, BLOCK, b) for a slice of periods and blocks, in ``dtype``.

        One matrix product: rows are (period, output, step in block); columns the block's inputs
        followed by each period's start state (block-diagonal, so periods share the inputs).
        """
        size = BLOCK
        forced, free = self.maps(dtype)
        count = len(forced[periods])
        weights: np.ndarray = np.zeros((count, 3, size, size + 1 + 2 * count), dtype)
        weights[..., : size + 1] = forced[periods]
        right: np.ndarray = np.empty((size + 1 + 2 * count, len(range(self.blocks)[blocks])), dtype)
        right[: size + 1] = self.inputs[:, blocks]
        for p, row in enumerate(range(len(self.omega))[periods]):
            weights[p, ..., size + 1 + 2 * p: size + 3 + 2 * p] = free[row]
            right[size + 1 + 2 * p: size + 3 + 2 * p] = self.starts[row, blocks].T
        return (weights.reshape(count * 3 * size, -1) @ right).reshape(count, 3, size, -1)

    def maps(self, dtype: type) -> tuple[np.ndarray, np.ndarray]:
        """Output maps (P, 3, BLOCK, BLOCK + 1) from a block's inputs and (P, 3, BLOCK, 2) from its start state."""
        if dtype not in self._maps:
            size = BLOCK
            forced = np.einsum("pos,pmis->pomi", self.outputs, self.forced[:, :size])
            free = np.einsum("pos,pmst->pomt", self.outputs, self.powers[:, :size])
            self._maps[dtype] = (forced.astype(dtype), free.astype(dtype))
        return self._maps[dtype]

    def states_at(self, step: np.ndarray) -> np.ndarray:
        """State (u, u') at analysis steps ``step`` (P, n) -> (P, n, 2)."""
        size = BLOCK
        block = np.minimum(step // size, self.blocks - 1)
        inside = step - block * size
        rows = np.arange(len(self.omega))[:, None]
        start = self.starts[rows, block]
        state = (self.powers[rows, inside] @ start[..., None])[..., 0]
        window = self.acc[block[..., None] * size + np.arange(size + 1)]
        return state + np.einsum("pnis,pni->pns", self.forced[rows, inside], window)

    def chunks(self) -> Iterator[tuple[slice, slice]]:
        """Slices of periods and blocks whose responses fit in :data:`CHUNK_VALUES`."""
        per_block = 3 * BLOCK
        periods = max(1, min(PERIODS_PER_PRODUCT, CHUNK_VALUES // (per_block * self.blocks)))
        blocks = max(1, CHUNK_VALUES // (per_block * periods))
        for first in range(0, len(self.omega), periods):
            for start in range(0, self.blocks, blocks):
                yield slice(first, first + periods), slice(start, start + blocks)


def _scan(transition: np.ndarray, drive: np.ndarray) -> np.ndarray:
    """States s[0..n] of s[j+1] = M s[j] + f[j], s[0] = 0, per period: M (P, 2, 2), f (P, n, 2) -> (P, n + 1, 2).

    The same regrouping as the time steps: drives are taken in groups of about sqrt(n) (at most
    ``SCAN_BLOCK``), the states at the group starts come from this function one level up, the
    states inside from one matrix product per period. A Python loop runs only on the top level,
    over at most ``SCAN_DIRECT`` drives.
    """
    count, n, _ = drive.shape
    if n <= SCAN_DIRECT:
        states = np.zeros((count, n + 1, 2))
        for j in range(n):
            states[:, j + 1] = (transition @ states[:, j, :, None])[..., 0] + drive[:, j]
        return states
    size = min(SCAN_BLOCK, math.ceil(math.sqrt(n)))
    groups = -(-n // size)
    grouped = np.empty((count, groups, 2 * size + 2))
    if groups * size == n:
        grouped[:, :, : 2 * size] = drive.reshape(count, groups, 2 * size)
    else:
        padded = np.zeros((count, groups * size, 2))
        padded[:, :n] = drive
        grouped[:, :, : 2 * size] = padded.reshape(count, groups, 2 * size)
    powers = _powers(transition, size)
    shifted = np.concatenate([np.zeros((count, size - 1, 2, 2)), powers[:, :size]], axis=1)
    toeplitz = np.lib.stride_tricks.sliding_window_view(shifted, size, axis=1)[..., ::-1]
    weights = np.empty((count, 2 * size + 2, 2 * size))
    weights[:, : 2 * size] = toeplitz.transpose(0, 4, 3, 1, 2).reshape(count, 2 * size, 2 * size)
    weights[:, 2 * size:] = powers[:, 1:].transpose(0, 3, 1, 2).reshape(count, 2, 2 * size)
    ends = grouped[:, :, : 2 * size] @ weights[:, : 2 * size, 2 * size - 2:]
    grouped[:, :, 2 * size:] = _scan(powers[:, size], ends)[:, :-1]
    states = np.zeros((count, groups * size + 1, 2))
    states[:, 1:] = (grouped @ weights).reshape(count, groups * size, 2)
    return states[:, : n + 1]


def _powers(transition: np.ndarray, size: int) -> np.ndarray:
    """M^0 .. M^size per period: (P, 2, 2) -> (P, size + 1, 2, 2)."""
    powers = np.empty((len(transition), size + 1, 2, 2))
    powers[:, 0] = np.eye(2)
    for n in range(1, size + 1):
        powers[:, n] = transition @ powers[:, n - 1]
    return powers


def _extremes(group: _Group) -> np.ndarray:
    """Analysis steps of the largest and smallest value of each output: (P, 3, 2).

    The search runs in single precision (twice the speed); the peaks are then evaluated in double
    precision at the steps found, so a choice between samples equal to 1e-7 is all it can change.
    """
    count = len(group.omega)
    best = np.full((count, 3, 2), -np.inf)
    where = np.zeros((count, 3, 2), dtype=np.int64)
    for periods, blocks in group.chunks():
        values = group.responses(periods, blocks, np.float32)
        flat = values.reshape(values.shape[0], 3, -1)
        width = values.shape[-1]
        for side, (pick, sign) in enumerate(((np.argmax, 1.0), (np.argmin, -1.0))):
            index = pick(flat, axis=2)
            value = sign * np.take_along_axis(flat, index[..., None], axis=2)[..., 0]
            inside, block = np.divmod(index, width)
            step = (block + blocks.start) * BLOCK + inside
            better = value > best[periods, :, side]
            best[periods, :, side] = np.where(better, value, best[periods, :, side])
            where[periods, :, side] = np.where(better, step, where[periods, :, side])
    return where


def _outputs_and_slopes(group: _Group, step: np.ndarray) -> tuple[np.ndarray, np.ndarray]:
    """Values and time derivatives of u, u', total acceleration at analysis steps (P, n) -> (P, n, 3)."""
    state = group.states_at(step)
    omega = group.omega[:, None]
    c = 2.0 * group.zeta * omega
    u, v = state[..., 0], state[..., 1]
    total = -omega**2 * u - c * v
    relative = total - group.acc[step]
    values = np.stack([u, v, total], axis=-1)
    slopes = np.stack([v, relative, -omega**2 * v - c * relative], axis=-1)
    return values, slopes


def _hermite_peak(y0: np.ndarray, d0: np.ndarray, y1: np.ndarray, d1: np.ndarray, h: float) -> np.ndarray:
    """Largest |y| of the cubic Hermite interpolant on [0, h] through (y0, d0), (y1, d1)."""
    b, c3 = d0 * h, d1 * h
    c = -3.0 * y0 - 2.0 * b + 3.0 * y1 - c3
    d = 2.0 * y0 + b - 2.0 * y1 + c3
    peak = np.maximum(np.abs(y0), np.abs(y1))
    qa, qb, qc = 3.0 * d, 2.0 * c, b
    disc = np.maximum(qb**2 - 4.0 * qa * qc, 0.0)
    root = np.sqrt(disc)
    with np.errstate(divide="ignore", invalid="ignore"):
        q = -0.5 * (qb + np.copysign(root, qb))
        candidates = [q / qa, qc / q, -qc / qb]
    for s in candidates:
        s = np.where(np.isfinite(s) & (s > 0.0) & (s < 1.0), s, 0.0)
        peak = np.maximum(peak, np.abs(y0 + s * (b + s * (c + s * d))))
    return peak


def _free_peak(y0: np.ndarray, d0: np.ndarray, omega: np.ndarray, zeta: float) -> np.ndarray:
    """Largest |y(t)|, t >= 0, of the damped free vibration starting at y0 with slope d0 (exact)."""
    sigma = zeta * omega
    omega_d = omega * math.sqrt(1.0 - zeta**2)
    alpha, beta = y0, (d0 + sigma * y0) / omega_d
    turn = np.mod(np.arctan2(beta * omega_d - sigma * alpha, alpha * omega_d + sigma * beta), math.pi)
    t = turn / omega_d
    at_turn = np.exp(-sigma * t) * (alpha * np.cos(turn) + beta * np.sin(turn))
    return np.maximum(np.abs(y0), np.abs(at_turn))


def _group_peaks(group: _Group) -> np.ndarray:
    """Peak |u|, |u'|, |total acceleration| over the record and the free vibration after it: (P, 3)."""
    where = _extremes(group).reshape(len(group.omega), 6)
    last = group.blocks * BLOCK
    steps = np.concatenate([np.clip(where - 1, 0, last), where, np.clip(where + 1, 0, last)], axis=1)
    values, slopes = _outputs_and_slopes(group, steps)
    count = len(group.omega)
    own = np.diagonal(values.reshape(count, 3, 3, 2, 3), axis1=2, axis2=4)
    slope = np.diagonal(slopes.reshape(count, 3, 3, 2, 3), axis1=2, axis2=4)
    left = _hermite_peak(own[:, 0], slope[:, 0], own[:, 1], slope[:, 1], group.h)
    left = np.where(where.reshape(count, 3, 2).transpose(0, 2, 1) > 0, left, np.abs(own[:, 1]))
    right = _hermite_peak(own[:, 1], slope[:, 1], own[:, 2], slope[:, 2], group.h)
    inside = np.maximum(left, right).max(axis=1)
    final_values, final_slopes = _outputs_and_slopes(group, np.full((len(group.omega), 1), last))
    tail = _free_peak(final_values[:, 0], final_slopes[:, 0], group.omega[:, None], group.zeta)
    return np.maximum(inside, tail)


def _resampled(acc: np.ndarray, m: int) -> np.ndarray:
    """The record followed by one zero sample, resampled linearly onto dt/m (same piecewise-linear input)."""
    extended = np.append(acc, 0.0)
    if m == 1:
        return extended
    fraction = np.arange(m) / m
    fine = (extended[:-1, None] + np.diff(extended)[:, None] * fraction).ravel()
    return np.append(fine, 0.0)


def response_spectrum(acc: np.ndarray, dt: float, period: np.ndarray, zeta: float) -> Spectrum:
    """Peak responses of single masses with ``period`` (s) and damping ``zeta`` to ground acceleration ``acc``.

    ``acc`` (m/s^2) is sampled every ``dt`` (s), the mass is at rest before the first sample.
    Raises :class:`WorkLimitError` if the analysis would take more than :data:`MAX_WORK` steps.
    """
    acc = np.asarray(acc, dtype=float)
    period = np.asarray(period, dtype=float)
    if work(period, dt, len(acc)) > MAX_WORK:
        raise WorkLimitError(f"{work(period, dt, len(acc)):.3g} period-steps exceed {MAX_WORK:.3g}")
    steps = substeps(period, dt)
    peaks = np.empty((len(period), 3))
    for m in np.unique(steps):
        chosen = steps == m
        group = _Group(_resampled(acc, int(m)), dt / m, 2.0 * math.pi / period[chosen], zeta)
        peaks[chosen] = _group_peaks(group)
    return Spectrum(period, peaks[:, 0], peaks[:, 1], peaks[:, 2], steps)


def response_history(acc: np.ndarray, dt: float, period: float, zeta: float) -> History:
    """Response of one single mass at the record's sample times (exact at the samples)."""
    acc = np.asarray(acc, dtype=float)
    m = int(substeps(np.array([period]), dt)[0])
    group = _Group(_resampled(acc, m), dt / m, np.array([2.0 * math.pi / period]), zeta)
    values = group.responses(slice(0, 1), slice(0, group.blocks))[0]
    ordered = values.transpose(0, 2, 1).reshape(3, -1)[:, : (len(acc) - 1) * m + 1 : m]
    return History(np.arange(len(acc)) * dt, ordered[0], ordered[1], ordered[2])
