"""Natural frequency and damping ratio from a recorded free decay (heel drop, tap, pull and release).

Method (arrays in, numbers out; time in s, frequency in Hz, amplitudes in the signal's unit):

1. Remove the offset and a linear drift (least squares over the record, then a line fitted to
   the one-period moving mean after the impact).
2. The impact or release is the largest sample. The dominant frequency comes from the Hann-windowed
   spectrum after it, interpolated between bins; other spectral peaks are other modes.
3. A zero-phase band-pass (Butterworth, second-order sections, run forward and back) around the
   dominant mode is applied when asked, when another mode is present or when broadband noise is
   high. The decay starts at the first peak one period after the impact (plus the filter's settling
   time) and ends where two successive peaks fall below the noise threshold.
4. ln(peak amplitude) against time is fitted by least squares (both signs of peaks): slope -sigma
   with a 95 % interval (Student's t); log decrement delta = sigma T_d; zeta = delta / sqrt(4 pi^2
   + delta^2).
5. Cross-checks: half-power bandwidth of the decay's own spectrum, frequency from zero crossings,
   damping over windows of amplitude, and flags for beating, clipping, few cycles and resolution.
"""

from __future__ import annotations

import math
from dataclasses import dataclass, field

import numpy as np

from fieldmode.calc.framework.result import Flag
from fieldmode.calc.records import fourier
from fieldmode.calc.records.envelope import (
    EnvelopeFit,
    Peaks,
    damping_by_halves,
    damping_from_sigma,
    fit_envelope,
    pick_peaks,
)

MIN_SAMPLES = 64
"""Fewest samples analysed."""
MIN_PEAKS = 4
"""Fewest peaks (two cycles, counting both signs) for a damping fit."""
FEW_CYCLES = 3.0
"""Fewer cycles than this in the fit are flagged."""
NOISE_FACTOR = 6.0
"""Peaks below this many noise standard deviations end the decay."""
END_FRACTION = 0.02
"""Peaks below this fraction of the first peak end the decay (clean records)."""
NOISY = 0.005
"""Noise RMS above this fraction of the impact amplitude calls for the band-pass filter."""
BAND_FACTOR = 1.5
"""The automatic band-pass runs at least from f/1.5 to 1.5 f, kept clear of other modes."""
FILTER_ORDER = 2
"""Butterworth band-pass order (run forward and back, so the response is squared)."""
FREQUENCY_MARGIN = 0.02
"""Spectral and zero-crossing frequencies differing by more than this fraction are flagged."""
HALF_POWER_MARGIN = 0.25
"""Half-power and decay-fit damping differing by more than this fraction are flagged."""
AMPLITUDE_MARGIN = 0.30
"""Damping at large and small amplitude differing by more than this fraction is noted."""
HALF_POWER_SPAN = math.log(1000.0)
"""The half-power spectrum runs from the decay start until the fitted envelope is down to 1/1000."""
COARSE_SAMPLES = 2**18
"""Samples after the impact that are analysed (262 s at 1 kHz)."""
ROUGH_SAMPLES = 2**16
"""Samples after the impact used for the first, unfiltered damping estimate."""


class DecayError(ValueError):
    """The record holds no usable free decay; the message says why."""


@dataclass(frozen=True)
class Decay:
    """What the analysis of a free decay found (Hz, s, signal unit).

    The analysis runs on the signal divided by its largest excursion, so any scale of units works;
    amplitudes here and in ``series`` are in the signal's unit again. ``fit.intercept`` is of the scaled signal.
    """

    natural_frequency: float
    damped_frequency: float
    spectral_frequency: float
    zero_crossing_frequency: float | None
    damping_ratio: float
    damping_ratio_low: float
    damping_ratio_high: float
    log_decrement: float
    cycles: float
    fit: EnvelopeFit
    half_power: fourier.HalfPower
    decay_start: float
    decay_end: float
    initial_amplitude: float
    noise_rms: float
    band: tuple[float, float] | None
    halves: tuple[EnvelopeFit, EnvelopeFit] | None
    """Envelope fits over the larger and the smaller half of the peaks (None under 8 peaks)."""
    flags: tuple[Flag, ...]
    series: dict[str, np.ndarray] = field(default_factory=dict)


def analyse(time: np.ndarray, signal: np.ndarray, fs: float, band: tuple[float, float] | None = None) -> Decay:
    """Analyse a uniformly sampled free-decay record; ``band`` (Hz) forces the band-pass range."""
    x = np.asarray(signal, dtype=float)
    t0 = float(time[0])
    if not (math.isfinite(fs) and fs > 0) or not np.all(np.isfinite(x)):
        raise DecayError("the sample rate and every sample must be finite numbers")
    if len(x) < MIN_SAMPLES:
        raise DecayError(f"only {len(x)} samples; at least {MIN_SAMPLES} are needed")
    if band is not None and not 0 < band[0] < band[1] < 0.5 * fs:
        raise DecayError(f"band {band[0]:g}-{band[1]:g} Hz must lie between 0 and half the sample rate "
                         f"({0.5 * fs:g} Hz), low edge first")
    level = _detrend(x)
    impact = int(np.argmax(np.abs(level)))
    scale = abs(float(level[impact]))
    if scale == 0 or not math.isfinite(scale):
        raise DecayError("the signal is flat: no decay")
    begin = max(0, impact - COARSE_SAMPLES // 4)  # only the impact and what follows it are analysed
    part = slice(begin, impact + COARSE_SAMPLES)
    raw, time, x = x[part], np.asarray(time)[part], level[part] / scale
    impact -= begin
    t0 = float(time[0])
    look = _overview(x[impact:impact + COARSE_SAMPLES], fs, band)
    period = 1.0 / look.frequency
    x = _remove_drift(x, fs, impact + int(period * fs), period)
    flags: list[Flag] = []
    noise = math.sqrt(look.noise_density * 0.5 * fs)
    rough = _decay_peaks(x, fs, look.frequency, impact + int(period * fs), impact + ROUGH_SAMPLES, noise, t0)
    guess = _rough_damping(rough, look.frequency)
    chosen = _choose_band(band, look, abs(x[impact]), noise, guess, fs, flags)
    processed, first, last = x, impact + int(period * fs), len(x)
    if chosen is not None:
        processed = _band_pass(x, fs, chosen)
        first += int(1.5 * fs / (chosen[1] - chosen[0]))
        last -= int(fs / chosen[0])
        noise = math.sqrt(look.noise_density * (chosen[1] - chosen[0]))
    peaks = _decay_peaks(processed, fs, look.frequency, first, last, noise, t0)
    if len(peaks) < MIN_PEAKS:
        raise DecayError(f"no free decay found: {len(peaks)} peaks stand above the noise after the "
                         f"impact at {t0 + impact / fs:.4g} s")
    fit = fit_envelope(peaks.time, peaks.amplitude)
    start, end = float(peaks.time[0]), float(peaks.time[-1])
    i_start, i_end = int(round((start - t0) * fs)), int(round((end - t0) * fs))
    span = min(len(x), i_start + max(int(HALF_POWER_SPAN / max(fit.sigma, 1e-9) * fs), i_end - i_start + 2))
    line_width = max(abs(fit.sigma) / math.pi, fs / (span - i_start))
    line = fourier.half_power(x[i_start:span], fs, look.frequency, 6.0 * line_width, look.noise_density)
    crossing = fourier.zero_crossing_frequency(processed[i_start:i_end + 1], fs, 3.0 * noise)
    damped = crossing if crossing is not None else line.frequency
    decrement, zeta = damping_from_sigma(fit.sigma, damped)
    zeta_low = max(0.0, damping_from_sigma(fit.sigma_low, damped)[1])
    zeta_high = damping_from_sigma(fit.sigma_high, damped)[1]
    cycles = (end - start) * damped
    natural = damped / math.sqrt(1.0 - zeta**2) if 0 <= zeta < 1 else damped
    halves = damping_by_halves(peaks)
    flags += _flags(look, fit, line, zeta, crossing, cycles, halves, peaks, noise)
    flags += _record_flags(raw, line, fit, (last - i_start) / fs)
    series = _series(time, x, processed, impact, i_end, peaks, fit, line, look, fs)
    for name in ("signal", "peak_amplitude", "envelope", "amplitude_spectrum"):
        series[name] = series[name] * scale
    return Decay(natural, damped, line.frequency, crossing, zeta, zeta_low, zeta_high, decrement, cycles, fit,
                 line, start, end, float(abs(peaks.amplitude[0])) * scale, noise * scale, chosen, halves,
                 tuple(flags), series)


def _overview(after: np.ndarray, fs: float, band: tuple[float, float] | None) -> fourier.Overview:
    """The first look at the spectrum after the impact (dominant frequency, other modes, noise)."""
    if len(after) < MIN_SAMPLES:
        raise DecayError("the largest peak is at the very end of the record: no decay after it")
    f_min = max(3.0 * fs / len(after), band[0] if band else 0.0)
    f_max = min(0.45 * fs, band[1] if band else 0.45 * fs)
    try:
        return fourier.overview(after, fs, f_min, f_max)
    except ValueError as error:
        raise DecayError(f"no dominant frequency after the peak: {error}") from error


def _decay_peaks(x: np.ndarray, fs: float, frequency: float, first: int, last: int, noise: float,
                 t0: float) -> Peaks:
    """Peaks of ``x[first:last]`` that belong to the decay (before it sinks into the noise)."""
    if last - first < 3 * fs / frequency:
        raise DecayError("fewer than 3 cycles of record after the impact peak")
    peaks = pick_peaks(x[first:min(last, first + COARSE_SAMPLES)], fs, frequency, t0 + first / fs)
    return _within_decay(peaks, noise)


def _rough_damping(peaks: Peaks, frequency: float) -> float:
    """A first damping estimate from the unfiltered peaks (to size the band-pass); 2 % if none."""
    if len(peaks) < MIN_PEAKS:
        return 0.02
    return damping_from_sigma(fit_envelope(peaks.time, peaks.amplitude).sigma, frequency)[1]


def _detrend(x: np.ndarray) -> np.ndarray:
    """Remove the least-squares line (offset and linear drift) over the whole record."""
    count = len(x)
    index = np.arange(count, dtype=float)
    mean_index, mean_x = (count - 1) / 2.0, float(x.mean())
    spread = count * (count**2 - 1) / 12.0  # sum of (i - mean_index)^2
    slope = (float(np.dot(index, x)) - count * mean_index * mean_x) / spread
    index *= slope
    index += mean_x - slope * mean_index
    return x - index


def _line(at: np.ndarray, y: np.ndarray) -> tuple[float, float]:
    """Slope and intercept of the least-squares line through (at, y)."""
    at_mean, y_mean = float(at.mean()), float(y.mean())
    centred = at - at_mean
    slope = float(np.dot(centred, y - y_mean) / np.dot(centred, centred))
    return slope, y_mean - slope * at_mean


def _remove_drift(x: np.ndarray, fs: float, start: int, period: float) -> np.ndarray:
    """Subtract a line fitted to the one-period moving mean after ``start`` (what the oscillation leaves)."""
    width = max(1, int(round(period * fs)))
    part = x[start:]
    if len(part) < 3 * width:
        return x
    cumulative = np.concatenate([[0.0], np.cumsum(part)])
    mean = (cumulative[width:] - cumulative[:-width]) / width
    centres = start + np.arange(len(mean)) + (width - 1) / 2.0
    slope, intercept = _line(centres, mean)
    return x - (intercept + slope * np.arange(len(x)))


def _choose_band(band: tuple[float, float] | None, look: fourier.Overview, impact: float, noise: float,
                 guess: float, fs: float, flags: list[Flag]) -> tuple[float, float] | None:
    """The band-pass range (Hz) to use, or None; says why in ``flags``.

    The automatic range is f/k to k f with k = 1 + 5 zeta (first estimate), kept within 1.5-2.5 so
    heavy damping is not filtered away, and cut at the geometric mean with any other mode.
    """
    if band is not None:
        flags.append(Flag("info", f"band-pass {band[0]:.3g}-{band[1]:.3g} Hz as asked"))
        return band
    f = look.frequency
    factor = min(max(1.0 + 5.0 * guess, BAND_FACTOR), 2.5)
    low, high = f / factor, min(f * factor, 0.45 * fs)
    for other in look.other_modes:
        if other > f:
            high = min(high, math.sqrt(f * other))
        else:
            low = max(low, math.sqrt(f * other))
    if not 0 < low < 0.99 * high < 0.5 * fs:
        return None
    if look.other_modes:
        listed = ", ".join(f"{m:.3g}" for m in sorted(look.other_modes)[:3])
        flags.append(Flag("info", f"other mode(s) near {listed} Hz: band-pass {low:.3g}-{high:.3g} Hz applied"))
        return low, high
    if noise > NOISY * impact:
        flags.append(Flag("info", f"broadband noise ({noise / impact:.1%} of the peak): band-pass "
                                  f"{low:.3g}-{high:.3g} Hz applied"))
        return low, high
    return None


def _band_pass(x: np.ndarray, fs: float, band: tuple[float, float]) -> np.ndarray:
    """Zero-phase Butterworth band-pass (second-order sections, forward and back)."""
    from scipy.signal import butter, sosfiltfilt

    sos = butter(FILTER_ORDER, band, btype="bandpass", fs=fs, output="sos")
    if len(x) <= 3 * (2 * len(sos) + 1):
        raise DecayError("the record is too short to filter")
    return np.asarray(sosfiltfilt(sos, x))


def _within_decay(peaks: Peaks, noise: float) -> Peaks:
    """The peaks before two successive ones fall below the noise threshold or 2 % of the first."""
    if len(peaks) == 0:
        return peaks
    size = np.abs(peaks.amplitude)
    threshold = max(NOISE_FACTOR * noise, END_FRACTION * size[0])
    low = size < threshold
    both = np.flatnonzero(low[:-1] & low[1:])
    end = int(both[0]) if both.size else len(size) - int(low[-1])
    return peaks.take(end)


def _flags(look: fourier.Overview, fit: EnvelopeFit, line: fourier.HalfPower, zeta: float,
           crossing: float | None, cycles: float, halves: tuple[EnvelopeFit, EnvelopeFit] | None, peaks: Peaks,
           noise: float) -> list[Flag]:
    """Cross-checks between methods and warnings about the decay itself."""
    flags: list[Flag] = []
    f = line.frequency
    if crossing is not None and abs(crossing - f) > FREQUENCY_MARGIN * f:
        flags.append(Flag("caution", f"frequency from the spectrum {f:.4g} Hz and from zero crossings "
                                     f"{crossing:.4g} Hz differ by more than {FREQUENCY_MARGIN:.0%}"))
    hp = line.damping_ratio
    if hp is None:
        flags.append(Flag("caution", "half-power points not found: no half-power cross-check"))
    elif abs(hp - zeta) > HALF_POWER_MARGIN * abs(zeta):
        flags.append(Flag("caution", f"half-power damping {hp:.2%} and decay-fit damping {zeta:.2%} "
                                     f"differ by more than {HALF_POWER_MARGIN:.0%}"))
    if cycles < FEW_CYCLES:
        flags.append(Flag("caution", f"only {cycles:.1f} cycles above the noise: damping uncertain"))
    if fit.sigma_low <= 0:
        flags.append(Flag("warning", "no clear decay: the 95 % interval of the damping includes zero; "
                                     "is this a free decay?"))
    rising = _envelope_rises(peaks, noise)
    if look.close_modes or (rising and fit.r_squared < 0.95):
        near = f" (peaks near {', '.join(f'{m:.3g}' for m in look.close_modes)} Hz)" if look.close_modes else ""
        flags.append(Flag("warning", f"beating: two close modes{near}; the envelope is not one exponential"))
    elif fit.r_squared < 0.9:
        flags.append(Flag("caution", f"the envelope fits one exponential poorly (R^2 = {fit.r_squared:.2f})"))
    if halves is not None:
        (large, small), f = halves, line.frequency
        apart = large.sigma_low > small.sigma_high or large.sigma_high < small.sigma_low
        z_large, z_small = damping_from_sigma(large.sigma, f)[1], damping_from_sigma(small.sigma, f)[1]
        if apart and abs(z_large - z_small) > AMPLITUDE_MARGIN * max(abs(z_small), 1e-12):
            flags.append(Flag("info", f"damping depends on amplitude: {z_large:.2%} over the larger half of "
                                      f"the peaks, {z_small:.2%} over the smaller half"))
    return flags


def _envelope_rises(peaks: Peaks, noise: float) -> bool:
    """True if a peak clearly above the noise exceeds the same-sign peak one cycle earlier by 10 %."""
    size = np.abs(peaks.amplitude)
    if len(size) < 3:
        return False
    clear = size[:-2] > 4 * NOISE_FACTOR * noise
    return bool(np.any(clear & (size[2:] > 1.1 * size[:-2])))


def _record_flags(signal: np.ndarray, line: fourier.HalfPower, fit: EnvelopeFit, usable: float) -> list[Flag]:
    """Clipping of the raw signal and whether the record resolves the half-power band."""
    flags: list[Flag] = []
    for extreme, word in ((np.max(signal), "maximum"), (np.min(signal), "minimum")):
        at = signal == extreme
        runs = np.flatnonzero(at[:-2] & at[1:-1] & at[2:])
        if runs.size:
            flags.append(Flag("warning", f"possible clipping: {int(at.sum())} samples sit at the {word} value"))
    width = (line.high - line.low) if line.low is not None and line.high is not None else fit.sigma / math.pi
    if width > 0 and 1.0 / usable > width:
        flags.append(Flag("caution", f"record too short for the frequency resolution: 1/T = {1 / usable:.3g} Hz "
                                     f"is wider than the half-power band {width:.3g} Hz"))
    return flags


def _series(time: np.ndarray, x: np.ndarray, processed: np.ndarray, impact: int, i_end: int, peaks: Peaks,
            fit: EnvelopeFit, line: fourier.HalfPower, look: fourier.Overview, fs: float) -> dict[str, np.ndarray]:
    """Chart series: the processed record around the decay, peaks, envelope and spectrum."""
    lead = int(0.1 * (i_end - impact)) + 1
    begin, stop = max(0, impact - lead), min(len(x), i_end + 3 * lead)
    shown_time, shown = _min_max(time[begin:stop], processed[begin:stop], 160)
    envelope_time = np.linspace(peaks.time[0], peaks.time[-1], 60)
    f_max = min(0.5 * fs, max([2.5 * look.frequency] + [1.25 * m for m in look.other_modes]))
    frequency, amplitude = fourier.amplitude_spectrum(x[impact:stop], fs, f_max)
    edges = np.array([e for e in (line.low, line.high) if e is not None])
    return {"time": shown_time, "signal": shown, "peak_time": peaks.time, "peak_amplitude": peaks.amplitude,
            "envelope_time": envelope_time, "envelope": fit.envelope(envelope_time),
            "frequency": frequency, "amplitude_spectrum": amplitude, "half_power_frequency": edges}


def _min_max(time: np.ndarray, x: np.ndarray, buckets: int) -> tuple[np.ndarray, np.ndarray]:
    """Reduce a long trace to the minimum and maximum of each of ``buckets`` slices (keeps the envelope)."""
    size = len(x) // buckets
    if size < 2:
        return time, x
    usable = size * buckets
    blocks = x[:usable].reshape(buckets, size)
    low, high = np.argmin(blocks, axis=1), np.argmax(blocks, axis=1)
    base = np.arange(buckets) * size
    index = np.sort(np.concatenate([base + low, base + high]))
    return time[index], x[index]
