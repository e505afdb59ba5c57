"""Human response to building vibration from an acceleration record: weighted r.m.s., running r.m.s.
and MTVV, crest factor, vibration dose value (VDV), BS 6472-1 VDV ranges, one-third-octave band
spectra and the response factor against the ISO 10137 base curves.

Accelerations in m/s^2, times in s, frequencies in Hz, VDV in m/s^1.75. Functions named for a
weighted quantity take the frequency-weighted acceleration a_w (see :mod:`.weighting`);
:func:`assess` weights a raw record itself.

- r.m.s.: a_w,rms = (1/T int a_w^2 dt)^(1/2) over the whole record.
- running r.m.s. (linear integration over tau = 1 s) and its maximum, the MTVV (ISO 2631-1:1997 6.3.1).
- crest factor: largest |a_w| over a_w,rms (ISO 2631-1:1997 6.2.1).
- VDV = (int a_w^4 dt)^(1/4) (ISO 2631-1:1997 6.3.2; BS 6472-1:2008).
- VDV of a day or night of N like events: (N VDV_event^4)^(1/4); of a continuous vibration measured
  over T_m, scaled to a period T: VDV_m (T/T_m)^(1/4) (BS 6472-1:2008).
- estimated VDV, 1.4 a_w,rms t^0.25: only for crest factors below 6 (BS 6472-1:2008).

The ISO 2631-1 clause numbers above are from memory; the definitions themselves are standard.
"""

from __future__ import annotations

import math
from collections.abc import Sequence
from dataclasses import dataclass

import numpy as np

from fieldmode.calc.physics import base_curves
from fieldmode.calc.records import samples
from fieldmode.calc.records import weighting as weighting_mod

INTEGRATION_TIME = 1.0
"""Running r.m.s. integration time tau for the MTVV (s)."""
ESTIMATE_FACTOR = 1.4
"""Factor of the estimated VDV, 1.4 a_rms t^0.25."""
ESTIMATE_CREST_LIMIT = 6.0
"""The estimated VDV holds only for crest factors below this."""
PERIODS = {"day": 16 * 3600.0, "night": 8 * 3600.0}
"""BS 6472-1 assessment periods (s): 16 h day (07:00-23:00), 8 h night (23:00-07:00)."""

VDV_RANGES: dict[str, tuple[float, float, float, float]] = {"day": (0.2, 0.4, 0.8, 1.6), "night": (0.1, 0.2, 0.4, 0.8)}
"""BS 6472-1:2008 Table 1, residential buildings: edges of the three ranges of VDV (m/s^1.75)."""
VDV_LABELS = ("below the lowest range of the table", "low probability of adverse comment",
              "adverse comment possible", "adverse comment probable", "above the highest range of the table")
VDV_SOURCE = "BS 6472-1:2008 Table 1, residential buildings (confirmed in two summaries)"

NOMINAL_DECADE = (1.0, 1.25, 1.6, 2.0, 2.5, 3.15, 4.0, 5.0, 6.3, 8.0)
"""IEC 61260 nominal one-third-octave centre frequencies within a decade."""
MIN_BAND_LINES = 3
"""Fewest spectral lines a one-third-octave band must hold."""


def weighted_rms(weighted: np.ndarray) -> float:
    """r.m.s. of a weighted acceleration over the whole record (m/s^2)."""
    a = samples.signal(weighted, "weighted acceleration")
    return float(np.sqrt(np.mean(np.square(a))))


def running_rms(weighted: np.ndarray, fs: float, integration_time: float = INTEGRATION_TIME) -> np.ndarray:
    """Running r.m.s. (m/s^2) with linear integration over ``integration_time`` (s).

    Element i is the r.m.s. over the window that ends at sample i + n - 1 (n samples per window), so
    the result has len(weighted) - n + 1 values, one for every full window.
    """
    rate = samples.sample_rate(fs)
    tau = samples.positive(integration_time, "integration time", "s")
    a = samples.signal(weighted, "weighted acceleration")
    n = max(1, round(tau * rate))
    if n > a.size:
        raise ValueError(f"the record lasts {a.size / rate:.3g} s, shorter than the running r.m.s. "
                         f"integration time of {tau:g} s")
    total = np.empty(a.size + 1)
    total[0] = 0.0
    np.square(a, out=total[1:])
    np.cumsum(total, out=total)
    window = total[n:] - total[:-n]
    del total
    np.maximum(window, 0.0, out=window)
    window /= n
    return np.sqrt(window, out=window)


def mtvv(weighted: np.ndarray, fs: float, integration_time: float = INTEGRATION_TIME) -> tuple[float, float]:
    """Maximum transient vibration value (m/s^2) and the time (s from the first sample) at the end of its window."""
    values = running_rms(weighted, fs, integration_time)
    index = int(np.argmax(values))
    n = len(weighted) - len(values) + 1
    return float(values[index]), (index + n - 1) / float(fs)


def crest_factor(weighted: np.ndarray) -> float:
    """Largest |a_w| over the r.m.s. of a weighted acceleration (dimensionless)."""
    a = samples.signal(weighted, "weighted acceleration")
    level = float(np.sqrt(np.mean(np.square(a))))
    if level == 0.0:
        raise ValueError("the weighted acceleration is zero throughout: no crest factor")
    return float(max(a.max(), -a.min())) / level


def vdv(weighted: np.ndarray, fs: float) -> float:
    """Vibration dose value (m/s^1.75) of a weighted acceleration (m/s^2) sampled at ``fs`` (Hz)."""
    rate = samples.sample_rate(fs)
    a = samples.signal(weighted, "weighted acceleration")
    fourth = np.square(a)
    np.square(fourth, out=fourth)
    return float((np.sum(fourth) / rate) ** 0.25)


def vdv_of_events(vdv_event: float, events: int) -> float:
    """VDV (m/s^1.75) of ``events`` like events of VDV ``vdv_event`` each: (N VDV^4)^(1/4)."""
    if isinstance(events, bool) or int(events) != events or events < 1:
        raise ValueError(f"the number of events must be a whole number of at least 1, not {events!r}")
    return (int(events) * _vdv_value(vdv_event) ** 4) ** 0.25


def vdv_combined(vdvs: np.ndarray | list[float]) -> float:
    """VDV (m/s^1.75) of several exposures together: (sum VDV_i^4)^(1/4)."""
    values = np.asarray(vdvs, dtype=float)
    if values.size == 0 or not np.isfinite(values).all() or (values < 0).any():
        raise ValueError("give one or more finite, non-negative VDVs (m/s^1.75)")
    return float(np.sum(values**4) ** 0.25)


def vdv_for_period(vdv_measured: float, measured_duration: float, period: str) -> float:
    """VDV (m/s^1.75) over a 'day' (16 h) or 'night' (8 h) of a continuous vibration whose VDV over
    ``measured_duration`` (s) is ``vdv_measured``: VDV_m (T/T_m)^(1/4)."""
    duration = samples.positive(measured_duration, "measured duration", "s")
    return _vdv_value(vdv_measured) * (_period_seconds(period) / duration) ** 0.25


@dataclass(frozen=True)
class EstimatedVdv:
    """Estimated VDV (m/s^1.75) and whether the crest factor lets it be used."""

    value: float
    crest_factor: float
    valid: bool
    note: str


def estimated_vdv(weighted_rms_value: float, duration: float, crest: float) -> EstimatedVdv:
    """Estimated VDV 1.4 a_w,rms t^0.25 from a weighted r.m.s. (m/s^2) over ``duration`` (s).

    ``valid`` is False when the crest factor ``crest`` is 6 or more, where the estimate understates
    the VDV and the VDV must be measured.
    """
    level = float(weighted_rms_value)
    if not math.isfinite(level) or level < 0:
        raise ValueError(f"the weighted r.m.s. must be a finite, non-negative m/s^2, not {weighted_rms_value!r}")
    seconds = samples.positive(duration, "duration", "s")
    factor = samples.positive(crest, "crest factor", "(dimensionless)")
    valid = factor < ESTIMATE_CREST_LIMIT
    note = (f"crest factor {factor:.2f} below {ESTIMATE_CREST_LIMIT:g}: the estimate may be used" if valid else
            f"crest factor {factor:.2f} is {ESTIMATE_CREST_LIMIT:g} or more: the estimate is not valid; "
            "use the measured VDV")
    return EstimatedVdv(ESTIMATE_FACTOR * level * seconds**0.25, factor, valid, note)


@dataclass(frozen=True)
class VdvBand:
    """Where a VDV lies among the BS 6472-1 ranges for a period; ``low``/``high`` in m/s^1.75."""

    period: str
    low: float
    high: float
    label: str
    source: str


def vdv_band(value: float, period: str) -> VdvBand:
    """The BS 6472-1:2008 Table 1 range (residential) that a VDV (m/s^1.75) falls in, for 'day' or 'night'.

    A VDV on an edge belongs to the higher range.
    """
    _period_seconds(period)
    edges = (0.0, *VDV_RANGES[period], math.inf)
    index = int(np.searchsorted(edges, _vdv_value(value), side="right")) - 1
    return VdvBand(period, edges[index], edges[index + 1], VDV_LABELS[index], VDV_SOURCE)


@dataclass(frozen=True)
class Exposure:
    """Human-response values of one acceleration record (m/s^2, s, m/s^1.75)."""

    weighting: str
    weighted_rms: float
    peak: float
    crest_factor: float
    mtvv: float
    mtvv_time: float
    vdv: float
    duration: float


def assess(acceleration: np.ndarray, fs: float, weighting: str) -> Exposure:
    """Weight an acceleration record (m/s^2, sampled at ``fs`` Hz) and return its human-response values."""
    rate = samples.sample_rate(fs)
    a = samples.signal(acceleration, "acceleration")
    if a.size < INTEGRATION_TIME * rate:
        raise ValueError(f"the record lasts {a.size / rate:.3g} s; the MTVV needs at least {INTEGRATION_TIME:g} s")
    name = weighting_mod.weighting(weighting).name
    aw = weighting_mod.apply(a, rate, name)
    level = weighted_rms(aw)
    peak = float(max(aw.max(), -aw.min()))
    top, at = mtvv(aw, rate)
    return Exposure(name, level, peak, peak / level if level > 0 else math.nan, top, at, vdv(aw, rate),
                    a.size / rate)


@dataclass(frozen=True)
class BandSpectrum:
    """One-third-octave band r.m.s. values (m/s^2) with nominal and exact centres and band edges (Hz)."""

    nominal: np.ndarray
    centre: np.ndarray
    lower: np.ndarray
    upper: np.ndarray
    rms: np.ndarray
    weighting: str | None


def third_octave_bands(f_low: float, f_high: float) -> tuple[np.ndarray, np.ndarray, np.ndarray, np.ndarray]:
    """Nominal centres, exact centres, lower and upper edges (Hz) of the base-10 one-third-octave bands
    from nominal centre ``f_low`` to ``f_high`` (IEC 61260: centre 1000 x 10^(n/10) Hz, edges x 10^(+-1/20))."""
    low = samples.positive(f_low, "lowest band centre", "Hz")
    high = samples.positive(f_high, "highest band centre", "Hz")
    first, last = round(10 * math.log10(low)), round(10 * math.log10(high))
    if last < first:
        raise ValueError(f"the highest band centre {high:g} Hz is below the lowest {low:g} Hz")
    n = np.arange(first, last + 1)
    nominal = np.array([NOMINAL_DECADE[k % 10] * 10.0 ** (k // 10) for k in n])
    centre = 10.0 ** (n / 10.0)
    return nominal, centre, centre * 10 ** -0.05, centre * 10 ** 0.05


def band_spectrum(acceleration: np.ndarray, fs: float, f_low: float = 1.0, f_high: float = 80.0,
                  weighting: str | None = None) -> BandSpectrum:
    """One-third-octave band r.m.s. accelerations (m/s^2) of a record, unweighted or with ``weighting``
    (:func:`band_spectra`)."""
    return band_spectra(acceleration, fs, f_low, f_high, (weighting,))[0]


def band_spectra(acceleration: np.ndarray, fs: float, f_low: float, f_high: float,
                 weightings: Sequence[str | None]) -> list[BandSpectrum]:
    """One-third-octave band r.m.s. accelerations (m/s^2) of a record, one spectrum per entry of
    ``weightings`` (None: unweighted), all from one FFT: the power of the spectral lines (whole-record
    FFT, Parseval) is summed inside each band's edges (lower edge included).

    With a weighting each line is multiplied by the analog |W(f)| first, so the bands add up (in
    quadrature) to the weighted r.m.s. of the content between the outer edges. The record is not
    windowed, so its energy is kept exactly; a steady sine that does not complete whole cycles in the
    record leaks a little into the neighbouring bands (about -25 dB for a 40 s record at 6 Hz).
    """
    from scipy.fft import rfft

    rate = samples.sample_rate(fs)
    a = samples.signal(acceleration, "acceleration")
    nominal, centre, lower, upper = third_octave_bands(f_low, f_high)
    if upper[-1] >= rate / 2:
        raise ValueError(f"the band at {nominal[-1]:g} Hz reaches {upper[-1]:.4g} Hz, above the Nyquist frequency "
                         f"{rate / 2:g} Hz of a {rate:g} Hz record")
    duration = a.size / rate
    needed = MIN_BAND_LINES / (upper[0] - lower[0])
    if duration < needed:
        raise ValueError(f"the record lasts {duration:.3g} s; the {nominal[0]:g} Hz band needs at least {needed:.3g} s "
                         f"({MIN_BAND_LINES} spectral lines)")
    step = rate / a.size
    first, last = math.ceil(lower[0] / step), math.ceil(upper[-1] / step)
    lines = rfft(a - a.mean(), overwrite_x=True)[first:last]
    power = (np.square(lines.real) + np.square(lines.imag)) * (2.0 / a.size**2)
    del lines
    frequency = np.arange(first, last) * step
    start, stop = np.searchsorted(frequency, lower), np.searchsorted(frequency, upper)
    spectra = []
    for weighting in weightings:
        name = None
        weighted = power
        if weighting is not None:
            name = weighting_mod.weighting(weighting).name
            weighting_mod.check_rate(name, rate)
            weighted = power * np.square(weighting_mod.magnitude(name, frequency))
        cumulative = np.concatenate([[0.0], np.cumsum(weighted)])
        rms = np.sqrt(np.maximum(cumulative[stop] - cumulative[start], 0.0))
        spectra.append(BandSpectrum(nominal, centre, lower, upper, rms, name))
    return spectra


@dataclass(frozen=True)
class ResponseFactor:
    """Largest one-third-octave response factor against a base curve, and the band where it occurs (Hz)."""

    value: float
    nominal: float
    direction: str
    factors: np.ndarray
    """Response factor of every band."""


def response_factor(acceleration: np.ndarray, fs: float, direction: str, f_low: float = 1.0,
                    f_high: float = 80.0) -> ResponseFactor:
    """Response factor of an acceleration record (m/s^2): each one-third-octave band r.m.s. (unweighted)
    over the ISO 10137 base curve at the band's exact centre, and the largest of them.

    ``direction`` is 'vertical' or 'horizontal'; the bands must lie within the base curves' 1 to 80 Hz.
    """
    if direction not in base_curves.DIRECTIONS:
        raise ValueError(f"direction must be one of {', '.join(base_curves.DIRECTIONS)}, not {direction!r}")
    if f_low < base_curves.LOWEST_HZ or f_high > base_curves.HIGHEST_HZ:
        raise ValueError(f"the base curves run from {base_curves.LOWEST_HZ:g} to {base_curves.HIGHEST_HZ:g} Hz; "
                         f"bands from {f_low:g} to {f_high:g} Hz were asked for")
    spectrum = band_spectrum(acceleration, fs, f_low, f_high)
    factors = base_curves.response_factor(spectrum.rms, spectrum.centre, direction)
    index = int(np.argmax(factors))
    return ResponseFactor(float(factors[index]), float(spectrum.nominal[index]), direction, factors)


def _period_seconds(period: str) -> float:
    """Length (s) of the BS 6472-1 period 'day' or 'night'."""
    if period not in PERIODS:
        raise ValueError(f"the period must be 'day' (16 h) or 'night' (8 h), not {period!r}")
    return PERIODS[period]


def _vdv_value(value: float) -> float:
    """A VDV (m/s^1.75) as a float, refused unless finite and not negative."""
    number = float(value)
    if not math.isfinite(number) or number < 0:
        raise ValueError(f"a VDV must be a finite, non-negative number of m/s^1.75, not {value!r}")
    return number
