"""Spectral helpers for decay records: dominant frequency, other modes, noise floor,
half-power band and zero-crossing frequency.

Pure functions on uniformly sampled arrays; frequencies in Hz, sample rate ``fs`` in Hz,
amplitudes in the signal's own unit.
"""

from __future__ import annotations

import math
from dataclasses import dataclass

import numpy as np

OTHER_MODE_RATIO = 0.02
"""A spectral peak above this fraction of the dominant peak (amplitude) counts as another mode..."""
NOISE_PEAK_FACTOR = 5.0
"""...if it also stands this many times above the noise's RMS level in one spectral line."""
CLOSE_MODE_RATIO = 0.10
"""A peak this strong within :data:`CLOSE_SPAN` of the dominant one is a close mode (beating)."""
CLOSE_SPAN = 1.3
"""Modes within a factor of this of the dominant frequency are 'close'."""
NOISE_SAMPLES = 2**16
"""Samples after the impact used for the noise floor."""


@dataclass(frozen=True)
class Overview:
    """What the windowed spectrum of the record after the impact shows."""

    frequency: float
    other_modes: tuple[float, ...]
    close_modes: tuple[float, ...]
    noise_density: float
    """One-sided noise power density of the record (signal unit^2 / Hz), from the median level."""


def _parabolic(values: np.ndarray, index: int) -> float:
    """Offset (in bins, -0.5..0.5) of the vertex of a parabola through three neighbouring values."""
    if index <= 0 or index >= len(values) - 1:
        return 0.0
    left, centre, right = values[index - 1], values[index], values[index + 1]
    denominator = left - 2 * centre + right
    return 0.0 if denominator == 0 else float(np.clip(0.5 * (left - right) / denominator, -0.5, 0.5))


def overview(x: np.ndarray, fs: float, f_min: float, f_max: float) -> Overview:
    """Dominant frequency in [f_min, f_max], other modes and the noise floor of ``x`` (starting at the
    impact, offset removed).

    The window is the falling half of a Hann window: full weight at the impact, none at the end,
    so a short heavily damped decay is not weighted away and a cut-off record does not leak.
    The dominant frequency is the highest local maximum, interpolated between bins.
    """
    from scipy.signal import find_peaks

    window = np.cos(0.5 * np.pi * np.arange(len(x)) / len(x)) ** 2
    amplitude = np.abs(np.fft.rfft(x * window))
    df = fs / len(x)
    low, high = max(1, math.ceil(f_min / df)), min(len(amplitude) - 2, int(f_max / df))
    if high - low < 3:
        raise ValueError("the frequency range holds fewer than 3 spectral lines")
    maxima, _ = find_peaks(amplitude[low - 1:high + 2])
    if maxima.size == 0:
        raise ValueError("no spectral peak in the frequency range")
    index = low - 1 + int(maxima[np.argmax(amplitude[low - 1 + maxima])])
    with np.errstate(divide="ignore"):
        log_amplitude = np.log(np.maximum(amplitude[index - 1:index + 2], 1e-300))
    frequency = (index + _parabolic(log_amplitude, 1)) * df
    noise_density = _noise_density(x, fs, f_min)
    bin_rms = math.sqrt(noise_density * 0.5 * fs * float(np.sum(window**2)))
    level = max(OTHER_MODE_RATIO * amplitude[index], NOISE_PEAK_FACTOR * bin_rms)
    peaks, _ = find_peaks(amplitude[low:], height=level, prominence=level)
    others, close = [], []
    for peak in low + peaks:
        f = float((peak + _parabolic(np.log(np.maximum(amplitude[peak - 1:peak + 2], 1e-300)), 1)) * df)
        if abs(f - frequency) <= 3 * df:
            continue
        if frequency / CLOSE_SPAN < f < frequency * CLOSE_SPAN:
            if amplitude[peak] >= CLOSE_MODE_RATIO * amplitude[index]:
                close.append(f)
        else:
            others.append(f)
    order = np.argsort([-amplitude[int(round(f / df))] for f in others])
    return Overview(float(frequency), tuple(others[i] for i in order), tuple(close), noise_density)


@dataclass(frozen=True)
class HalfPower:
    """The free-decay spectral line: its peak and half-power points (Hz)."""

    frequency: float
    low: float | None
    high: float | None

    @property
    def damping_ratio(self) -> float | None:
        """zeta from the half-power points of a free-decay spectrum.

        |X(f)|^2 of exp(-sigma t) cos(omega_d t) is a Lorentzian whose half-power points lie at
        omega_d -+ sigma, so sigma = pi (f2 - f1), omega_d = pi (f1 + f2), zeta = sigma / omega_n.
        """
        if self.low is None or self.high is None:
            return None
        sigma = math.pi * (self.high - self.low)
        omega_d = math.pi * (self.high + self.low)
        return sigma / math.hypot(omega_d, sigma)


def half_power(x: np.ndarray, fs: float, centre: float, half_width: float, noise_density: float = 0.0,
               points: int = 4096) -> HalfPower:
    """Peak and half-power frequencies of ``x`` (rectangular window) near ``centre`` (Hz).

    The DFT is evaluated on a fine grid over ``centre`` +- ``half_width`` (zoom FFT), so the
    result does not depend on the record length's bin spacing. The expected power of white noise of
    one-sided density ``noise_density`` (unit^2/Hz) is taken off first, so noise does not widen the band.
    """
    from scipy.signal import zoom_fft

    low_edge = max(centre - half_width, 1e-6)
    high_edge = min(centre + half_width, 0.5 * fs)
    grid = np.linspace(low_edge, high_edge, points)
    power = np.abs(zoom_fft(x - x.mean(), [low_edge, high_edge], m=points, fs=fs, endpoint=True)) ** 2
    power = power - noise_density * 0.5 * fs * len(x)
    index = int(np.argmax(power))
    step = grid[1] - grid[0]
    peak_frequency = float(grid[index] + _parabolic(power, index) * step)
    level = power[index] / 2.0
    below_left = np.flatnonzero(power[:index] < level)
    below_right = np.flatnonzero(power[index:] < level)
    f1 = f2 = None
    if below_left.size:
        i = int(below_left[-1])
        f1 = float(np.interp(level, power[i:i + 2], grid[i:i + 2]))
    if below_right.size:
        i = index + int(below_right[0])
        f2 = float(np.interp(level, power[i - 1:i + 1][::-1], grid[i - 1:i + 1][::-1]))
    return HalfPower(peak_frequency, f1, f2)


def _noise_density(x: np.ndarray, fs: float, f_min: float) -> float:
    """One-sided noise power density (unit^2/Hz): median over frequency of a median-averaged Welch
    spectrum (Hann segments leak little, so the decay's own line affects only a few lines)."""
    from scipy.signal import welch

    part = x[:NOISE_SAMPLES]
    frequency, density = welch(part, fs, nperseg=min(len(part), 256), detrend=False, average="median")
    usable = density[frequency >= f_min]
    return float(np.median(usable if usable.size else density))


def zero_crossing_frequency(x: np.ndarray, fs: float, hysteresis: float = 0.0) -> float | None:
    """Frequency (Hz) from the zero crossings of ``x``, linearly interpolated; None if fewer than 3.

    A crossing counts only once the signal has gone beyond +-``hysteresis`` on the other side, so
    noise near zero adds no crossings; the crossing used is the last sign change before that.
    """
    beyond = np.flatnonzero(np.abs(x) > hysteresis)
    if beyond.size < 2:
        return None
    side = x[beyond] > 0
    switch = np.flatnonzero(side[1:] != side[:-1])
    if switch.size < 3:
        return None
    times = []
    for before, after in zip(beyond[switch], beyond[switch + 1], strict=True):
        part = x[before:after + 1]
        changes = np.flatnonzero(np.signbit(part[:-1]) != np.signbit(part[1:]))
        i = before + int(changes[-1])
        times.append(i + x[i] / (x[i] - x[i + 1]))
    return float((len(times) - 1) / (2.0 * (times[-1] - times[0]) / fs))


def amplitude_spectrum(x: np.ndarray, fs: float, f_max: float, points: int = 240) -> tuple[np.ndarray, np.ndarray]:
    """Amplitude spectrum of ``x`` (rectangular window, zero-padded) from 0 to ``f_max`` Hz, for a chart.

    Reduced to about ``points`` values by keeping the largest of each frequency bucket. Amplitudes
    are scaled so a steady sine of amplitude A would show A.
    """
    from scipy.fft import next_fast_len

    size = next_fast_len(max(8 * len(x), 4096))
    amplitude = np.abs(np.fft.rfft(x - x.mean(), size)) * 2.0 / len(x)
    frequency = np.fft.rfftfreq(size, 1.0 / fs)
    keep = frequency <= f_max
    frequency, amplitude = frequency[keep], amplitude[keep]
    bucket = max(1, len(frequency) // points)
    usable = len(frequency) // bucket * bucket
    blocks = amplitude[:usable].reshape(-1, bucket)
    picks = np.arange(0, usable, bucket) + np.argmax(blocks, axis=1)
    return frequency[picks], amplitude[picks]
