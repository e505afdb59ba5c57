"""Construction vibration from measured velocity (or acceleration) records: peak particle velocity
(PPV) per axis, the frequency at the peak, the peak vector sum, and events in a long record.

Velocities in m/s, accelerations in m/s^2, times in s from ``start_time`` (the time of the first
sample), frequencies in Hz. Axes are given as a sequence of equally long arrays (one to three).

- PPV of an axis: the largest |v|, and the time of that sample.
- Frequency at the peak, two ways: from the half cycle that holds the peak (the zero crossings on
  either side, interpolated linearly: f = 1 / (2 x half-cycle time)); and from the spectrum of a
  window about the peak (mean removed, Hann window, zero-padded FFT, parabolic interpolation of the
  highest line at or above 1/window).
- Peak vector sum: the largest instantaneous sqrt(vx^2 + vy^2 + vz^2) and its time (worked out in
  blocks, so the memory used does not grow with the record).
- Events: stretches where any axis exceeds a threshold, split where the record stays below it for at
  least a quiet gap. Each event has the same per-axis results and vector sum, over its stretch plus
  half the quiet gap on each side.
"""

from __future__ import annotations

import math
from collections.abc import Sequence
from dataclasses import dataclass

import numpy as np

from fieldmode.calc.records import samples

HIGH_PASS_HZ = 1.0
"""Default corner (Hz) of the high-pass applied after integrating an acceleration."""
HIGH_PASS_ORDER = 4
"""Order of the Butterworth high-pass (run forward and backward, so the response is squared)."""
MIN_CORNER_PERIODS = 4.0
"""An acceleration record must last at least this many periods of the high-pass corner."""
SPECTRUM_WINDOW = 1.0
"""Default length (s) of the window about the peak whose spectrum gives the dominant frequency."""
ZERO_PADDING = 16
"""The window is zero-padded to at least this many times its length before the FFT."""
CROSSING_SEARCH = 2.0
"""Zero crossings are looked for within this time (s) on each side of the peak."""
BLOCK = 1 << 18
"""Samples per block when the vector sum is formed."""
MAX_EVENTS = 10_000
"""More events than this means the threshold sits in the noise; the search is refused."""


def velocity_from_acceleration(acceleration: np.ndarray, fs: float, high_pass: float = HIGH_PASS_HZ,
                               order: int = HIGH_PASS_ORDER) -> tuple[np.ndarray, str]:
    """Velocity (m/s) from an acceleration (m/s^2) sampled at ``fs`` (Hz), and a sentence saying how.

    The mean is removed, the acceleration is integrated by the trapezoidal rule, and a Butterworth
    high-pass of ``order`` at ``high_pass`` Hz is run forward and backward (zero phase) to remove the
    drift that integration builds from offsets and low-frequency noise.
    """
    from scipy.integrate import cumulative_trapezoid
    from scipy.signal import butter, sosfiltfilt

    rate = samples.sample_rate(fs)
    corner = samples.positive(high_pass, "high-pass corner frequency", "Hz")
    if corner >= rate / 2:
        raise ValueError(f"the high-pass corner {corner:g} Hz must be below the Nyquist frequency {rate / 2:g} Hz")
    if isinstance(order, bool) or int(order) != order or not 1 <= order <= 8:
        raise ValueError(f"the high-pass order must be a whole number from 1 to 8, not {order!r}")
    a = samples.signal(acceleration, "acceleration", min_samples=8)
    if a.size < MIN_CORNER_PERIODS * rate / corner:
        raise ValueError(f"the acceleration lasts {a.size / rate:.3g} s; a high-pass at {corner:g} Hz needs at "
                         f"least {MIN_CORNER_PERIODS / corner:.3g} s ({MIN_CORNER_PERIODS:g} periods of its corner)")
    velocity = cumulative_trapezoid(a - a.mean(), dx=1.0 / rate, initial=0.0)
    velocity -= velocity.mean()
    sos = butter(int(order), corner, btype="highpass", fs=rate, output="sos")
    padding = min(a.size - 1, math.ceil(rate / corner))
    velocity = sosfiltfilt(sos, velocity, padlen=padding)
    text = (f"velocity by trapezoidal integration of the acceleration (mean removed), then an order-{int(order)} "
            f"Butterworth high-pass at {corner:g} Hz run forward and backward (zero phase; amplitude halved at "
            f"{corner:g} Hz, {1 - 1 / (1 + 2.0 ** (-2 * int(order))):.1%} lower at {2 * corner:g} Hz)")
    return np.asarray(velocity), text


@dataclass(frozen=True)
class AxisPeak:
    """PPV of one axis (m/s), its time (s), and the frequency at the peak by two methods (Hz; None if not found)."""

    ppv: float
    time: float
    frequency_crossings: float | None
    frequency_spectrum: float | None


def crossing_frequency(velocity: np.ndarray, fs: float, index: int) -> float | None:
    """Frequency (Hz) of the half cycle that holds sample ``index``: 1 / (2 x the time between the
    zero crossings before and after it), crossings interpolated linearly; None if either side has no
    crossing within :data:`CROSSING_SEARCH` s."""
    rate = samples.sample_rate(fs)
    velocity = _at(velocity, index)
    reach = max(2, math.ceil(CROSSING_SEARCH * rate))
    lo = max(0, index - reach)
    part = velocity[lo:index + reach + 1] * (1.0 if velocity[index] >= 0 else -1.0)
    here = index - lo
    before = np.flatnonzero(part[:here] <= 0.0)
    after = np.flatnonzero(part[here + 1:] <= 0.0)
    if before.size == 0 or after.size == 0:
        return None
    j, k = int(before[-1]), here + 1 + int(after[0])
    t_before = j + part[j] / (part[j] - part[j + 1])
    t_after = (k - 1) + part[k - 1] / (part[k - 1] - part[k])
    return float(rate / (2.0 * (t_after - t_before)))


def spectral_frequency(velocity: np.ndarray, fs: float, index: int, window: float = SPECTRUM_WINDOW) -> float | None:
    """Dominant frequency (Hz) of a ``window``-long stretch (s) centred on sample ``index`` (cut at the
    record's ends): Hann window, zero-padded FFT, parabolic interpolation of the highest line at or
    above 1/length; None if the stretch holds fewer than 8 samples or no signal."""
    from scipy.fft import next_fast_len, rfft, rfftfreq

    rate = samples.sample_rate(fs)
    velocity = _at(velocity, index)
    half = max(4, round(samples.positive(window, "spectrum window", "s") * rate / 2))
    part = velocity[max(0, index - half):index + half]
    if part.size < 8:
        return None
    part = (part - part.mean()) * np.hanning(part.size)
    size = next_fast_len(max(ZERO_PADDING * part.size, 4096))
    magnitude = np.abs(rfft(part, size))
    frequency = rfftfreq(size, 1.0 / rate)
    first = int(np.searchsorted(frequency, rate / part.size))
    if first >= magnitude.size - 1 or not magnitude[first:].any():
        return None
    peak = first + int(np.argmax(magnitude[first:]))
    offset = 0.0
    if first < peak < magnitude.size - 1:
        left, centre, right = magnitude[peak - 1:peak + 2]
        bend = left - 2 * centre + right
        offset = 0.0 if bend == 0 else float(np.clip(0.5 * (left - right) / bend, -0.5, 0.5))
    return float((peak + offset) * rate / size)


def axis_peak(velocity: np.ndarray, fs: float, start_time: float = 0.0, window: float = SPECTRUM_WINDOW) -> AxisPeak:
    """PPV (m/s) of one velocity axis sampled at ``fs`` (Hz), its time (s) and the frequency at the peak (Hz)."""
    rate = samples.sample_rate(fs)
    v = samples.signal(velocity, "velocity")
    return _peak_in(v, rate, 0, v.size, float(start_time), window)


def peak_vector_sum(velocities: Sequence[np.ndarray], fs: float, start_time: float = 0.0) -> tuple[float, float]:
    """Largest instantaneous vector sum sqrt(sum of v_i^2) (m/s) of the axes, and its time (s)."""
    rate = samples.sample_rate(fs)
    axes = _axes(velocities)
    return _vector_sum_in(axes, rate, 0, axes[0].size, float(start_time))


@dataclass(frozen=True)
class Event:
    """One event: first and last time (s) an axis exceeded the threshold, each axis's peak, and the
    peak vector sum (m/s) with its time (s)."""

    start: float
    end: float
    axes: tuple[AxisPeak, ...]
    vector_sum: float
    vector_sum_time: float


def find_events(velocities: Sequence[np.ndarray], fs: float, threshold: float, quiet_gap: float,
                start_time: float = 0.0, window: float = SPECTRUM_WINDOW) -> list[Event]:
    """Events in a record of one to three velocity axes (m/s) sampled at ``fs`` (Hz).

    An event runs while any axis exceeds ``threshold`` (m/s, |v| > threshold), and ends once every axis
    has stayed at or below it for ``quiet_gap`` (s). Each event's peaks are looked for over its
    stretch plus half the quiet gap on either side (the stretches of two events never overlap).
    """
    rate = samples.sample_rate(fs)
    level = samples.positive(threshold, "event threshold", "m/s")
    gap = samples.positive(quiet_gap, "quiet gap", "s")
    axes = _axes(velocities)
    size = axes[0].size
    above = np.zeros(size + 2, dtype=bool)
    inside = above[1:-1]
    for v in axes:
        inside |= v > level
        inside |= v < -level
    change = np.flatnonzero(above[1:] != above[:-1])
    first, last = change[0::2], change[1::2] - 1
    if first.size == 0:
        return []
    split = np.flatnonzero((first[1:] - last[:-1]) >= gap * rate)
    starts, ends = first[np.r_[0, split + 1]], last[np.r_[split, last.size - 1]]
    if starts.size > MAX_EVENTS:
        raise ValueError(f"more than {MAX_EVENTS:,} events above {level:g} m/s: the threshold is in the noise; "
                         "raise it or lengthen the quiet gap")
    pad = int(gap * rate / 2)
    t0 = float(start_time)
    events = []
    for s, e in zip(starts.tolist(), ends.tolist(), strict=True):
        lo, hi = max(0, s - pad), min(size, e + pad + 1)
        peaks = tuple(_peak_in(v, rate, lo, hi, t0, window) for v in axes)
        total, when = _vector_sum_in(axes, rate, lo, hi, t0)
        events.append(Event(t0 + s / rate, t0 + e / rate, peaks, total, when))
    return events


def _peak_in(v: np.ndarray, rate: float, lo: int, hi: int, t0: float, window: float) -> AxisPeak:
    """The axis peak within samples lo..hi-1, frequencies from the whole record about it."""
    part = v[lo:hi]
    high, low = int(np.argmax(part)), int(np.argmin(part))
    index = lo + (high if part[high] >= -part[low] else low)
    return AxisPeak(float(abs(v[index])), t0 + index / rate, crossing_frequency(v, rate, index),
                    spectral_frequency(v, rate, index, window))


def _vector_sum_in(axes: list[np.ndarray], rate: float, lo: int, hi: int, t0: float) -> tuple[float, float]:
    """Largest vector sum (m/s) within samples lo..hi-1 and its time (s), formed block by block."""
    best, where = -1.0, lo
    for begin in range(lo, hi, BLOCK):
        stop = min(hi, begin + BLOCK)
        total = np.square(axes[0][begin:stop])
        for v in axes[1:]:
            total += np.square(v[begin:stop])
        k = int(np.argmax(total))
        if total[k] > best:
            best, where = float(total[k]), begin + k
    return math.sqrt(best), t0 + where / rate


def _at(velocity: np.ndarray, index: int) -> np.ndarray:
    """``velocity`` as a float array, refused unless ``index`` is one of its samples."""
    v = np.asarray(velocity, dtype=float)
    if v.ndim != 1 or not 0 <= index < v.size:
        raise ValueError(f"sample {index} is not in a record of {v.size} samples")
    return v


def _axes(velocities: Sequence[np.ndarray]) -> list[np.ndarray]:
    """One to three velocity axes of equal length, each checked."""
    if isinstance(velocities, np.ndarray) and velocities.ndim == 1:
        velocities = [velocities]
    axes = [samples.signal(v, f"velocity of axis {i + 1}", min_samples=2) for i, v in enumerate(velocities)]
    if not 1 <= len(axes) <= 3:
        raise ValueError(f"give one to three velocity axes, not {len(axes)}")
    if len({v.size for v in axes}) != 1:
        raise ValueError(f"the axes have different lengths ({', '.join(str(v.size) for v in axes)} samples)")
    return axes
