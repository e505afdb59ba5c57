"""Frequency weightings of acceleration for human response: Wb, Wk, Wd and Wm.

Each weighting is the product of analog sections, as the standards define it (s = j 2 pi f):

- band-limiting high-pass  s^2 / (s^2 + s w1/Q1 + w1^2)            (f1, Q1 = 1/sqrt 2)
- band-limiting low-pass   w2^2 / (s^2 + s w2/Q2 + w2^2)           (f2, Q2 = 1/sqrt 2)
- acceleration-velocity transition  (1 + s/w3) / (1 + s/(Q4 w4) + s^2/w4^2)   (f3, f4, Q4)
- upward step  (s^2 + s w5/Q5 + w5^2) / (s^2 + s w6/Q6 + w6^2)     (f5, Q5, f6, Q6; tends to 1 at high f)
- a constant gain K.

:func:`magnitude` evaluates |W(f)| from these analog sections. :func:`apply` filters a sampled
acceleration (m/s^2) with the digital equivalent: each section goes through the bilinear transform
prewarped at its own corner frequency (so each corner is exact), and the product runs as second-order
sections, causally (a weighting has phase, which changes peaks, MTVV and VDV), starting in the
steady state of the first sample so an offset in the record adds no start-up transient.

The bilinear transform squeezes the whole analog frequency axis below the Nyquist frequency, so at
the usual record rates (256 to 1000 Hz) the digital response falls short of the analog one near the
band limit f2 (by about 13 % at 100 Hz with 512 Hz sampling). A record sampled below
:data:`FILTER_RATE` is therefore resampled up by an integer factor (``scipy.signal.resample_poly``,
ends continued with the end values), filtered there and taken back at its own rate, block by block so
the memory used stays near one copy of the record; the weighted r.m.s. of a sine then matches
A/sqrt(2) |W(f)| within 1 % up to f2. A record whose Nyquist frequency is below
:data:`NYQUIST_MARGIN` x f2 does not hold the weighting's band and is refused.

Parameters: Wk and Wd from ISO 2631-1:1997 Annex A (Wk confirmed; Wd from memory), Wb from
BS 6841:1987 (from memory), Wm from ISO 2631-2:2003 (from memory).
"""

from __future__ import annotations

import math
from dataclasses import dataclass

import numpy as np

from fieldmode.calc.records import samples

Q_BAND = 1.0 / math.sqrt(2.0)
"""Quality factor of the band-limiting high-pass and low-pass sections."""
NYQUIST_MARGIN = 1.25
"""The Nyquist frequency must be at least this multiple of the upper band limit f2, so the weighting's
whole band lies inside the record's band with room for the low-pass section's roll-off."""
FILTER_RATE = 2000.0
"""Records sampled slower than this (Hz) are resampled up by an integer factor before filtering, where
the bilinear transform is within 1 % of the analog weighting up to 100 Hz."""


@dataclass(frozen=True)
class Weighting:
    """Analog definition of a frequency weighting; frequencies in Hz.

    ``f3`` None means no transition zero (a pure second-order low-pass at f4); ``f4`` None means no
    transition section at all; ``f5`` None means no upward step.
    """

    name: str
    f1: float
    f2: float
    f3: float | None
    f4: float | None
    q4: float | None
    f5: float | None
    q5: float | None
    f6: float | None
    q6: float | None
    gain: float
    use: str
    source: str


WEIGHTINGS: dict[str, Weighting] = {
    "Wk": Weighting("Wk", 0.4, 100.0, 12.5, 12.5, 0.63, 2.37, 0.91, 3.35, 0.91, 1.0,
                    "vertical (z) whole-body vibration, seated or standing",
                    "ISO 2631-1:1997 Annex A, Table A.2 (parameters confirmed in a national annex)"),
    "Wd": Weighting("Wd", 0.4, 100.0, 2.0, 2.0, 0.63, None, None, None, None, 1.0,
                    "horizontal (x, y) whole-body vibration",
                    "ISO 2631-1:1997 Annex A, Table A.2 (from memory)"),
    "Wb": Weighting("Wb", 0.4, 100.0, 16.0, 16.0, 0.55, 2.5, 0.9, 4.0, 0.95, 1.024,
                    "vertical vibration of people in buildings (BS 6472-1)",
                    "BS 6841:1987 weighting Wb (from memory)"),
    "Wm": Weighting("Wm", 10 ** -0.1, 100.0, 5.684, 5.684, 0.5, None, None, None, None, 1.0,
                    "vibration of people in buildings, any direction",
                    "ISO 2631-2:2003 weighting Wm (from memory)"),
}
"""The weightings by name."""


def weighting(name: str | Weighting) -> Weighting:
    """The weighting called ``name`` ('Wb', 'Wk', 'Wd' or 'Wm'); a :class:`Weighting` is returned as is."""
    if isinstance(name, Weighting):
        return name
    for key, value in WEIGHTINGS.items():
        if key.lower() == str(name).strip().lower():
            return value
    raise ValueError(f"unknown weighting {name!r}: choose one of {', '.join(WEIGHTINGS)}")


Section = tuple[np.ndarray, np.ndarray, float, float]
"""Analog zeros and poles (rad/s), gain, and the frequency (Hz) at which its bilinear transform is prewarped."""


def _quadratic_roots(omega: float, q: float) -> np.ndarray:
    """Roots of s^2 + s omega/q + omega^2 (rad/s)."""
    return np.roots([1.0, omega / q, omega * omega]).astype(complex)


def sections(name: str | Weighting) -> list[Section]:
    """The analog sections of a weighting, each as (zeros, poles, gain, prewarp frequency in Hz)."""
    w = weighting(name)
    w1, w2 = 2 * math.pi * w.f1, 2 * math.pi * w.f2
    none = np.array([], dtype=complex)
    parts: list[Section] = [
        (np.zeros(2, dtype=complex), _quadratic_roots(w1, Q_BAND), 1.0, w.f1),
        (none, _quadratic_roots(w2, Q_BAND), w2 * w2, w.f2),
    ]
    if w.f4 is not None and w.q4 is not None:
        w4 = 2 * math.pi * w.f4
        poles = _quadratic_roots(w4, w.q4)
        if w.f3 is None:
            parts.append((none, poles, w4 * w4, w.f4))
        else:
            w3 = 2 * math.pi * w.f3
            parts.append((np.array([-w3], dtype=complex), poles, w4 * w4 / w3, w.f4))
    if w.f5 is not None and w.q5 is not None and w.f6 is not None and w.q6 is not None:
        w5, w6 = 2 * math.pi * w.f5, 2 * math.pi * w.f6
        parts.append((_quadratic_roots(w5, w.q5), _quadratic_roots(w6, w.q6), 1.0, math.sqrt(w.f5 * w.f6)))
    return parts


def analog_zpk(name: str | Weighting) -> tuple[np.ndarray, np.ndarray, float]:
    """Zeros and poles (rad/s) and gain of the whole analog weighting, K included."""
    parts = sections(name)
    zeros = np.concatenate([part[0] for part in parts])
    poles = np.concatenate([part[1] for part in parts])
    gain = weighting(name).gain * math.prod(part[2] for part in parts)
    return zeros, poles, gain


def magnitude(name: str | Weighting, frequency: np.ndarray | float) -> np.ndarray:
    """|W(f)| of the analog weighting at ``frequency`` (Hz), dimensionless."""
    from scipy.signal import freqs_zpk

    f = np.asarray(frequency, dtype=float)
    if not np.isfinite(f).all() or (f < 0).any():
        raise ValueError("frequencies must be finite and not negative (Hz)")
    zeros, poles, gain = analog_zpk(name)
    _, response = freqs_zpk(zeros, poles, gain, worN=2 * math.pi * np.atleast_1d(f).ravel())
    return np.abs(response).reshape(f.shape)


def min_sample_rate(name: str | Weighting) -> float:
    """Lowest sample rate (Hz) accepted for a weighting: 2 x NYQUIST_MARGIN x its upper band limit f2."""
    return 2.0 * NYQUIST_MARGIN * weighting(name).f2


def check_rate(name: str | Weighting, fs: float) -> float:
    """The sample rate ``fs`` (Hz), refused when its Nyquist frequency does not cover the weighting's band."""
    w = weighting(name)
    rate = samples.sample_rate(fs)
    lowest = min_sample_rate(w)
    if rate < lowest:
        raise ValueError(f"a sample rate of {rate:g} Hz is too low for {w.name}: its band reaches f2 = {w.f2:g} Hz, "
                         f"and the Nyquist frequency (half the sample rate) must be at least "
                         f"{NYQUIST_MARGIN:g} x f2, so {lowest:g} Hz or more is needed")
    return rate


def oversampling(fs: float) -> int:
    """Integer factor by which a record sampled at ``fs`` (Hz) is resampled up before filtering."""
    return max(1, math.ceil(FILTER_RATE / samples.sample_rate(fs) - 1e-9))


def digital_sos(name: str | Weighting, fs: float) -> np.ndarray:
    """Second-order sections of the weighting at sample rate ``fs`` (Hz), for ``scipy.signal.sosfilt``.

    Each analog section goes through the bilinear transform prewarped at its own corner, so the
    digital response equals the analog one exactly there; elsewhere it is close only well below the
    Nyquist frequency (see the module notes).
    """
    from scipy.signal import bilinear_zpk, zpk2sos

    w = weighting(name)
    rate = check_rate(w, fs)
    zeros, poles, gain = [], [], w.gain
    for z, p, k, corner in sections(w):
        omega = 2 * math.pi * corner
        warped_rate = omega / (2.0 * math.tan(omega / (2.0 * rate)))
        zd, pd, kd = bilinear_zpk(z, p, k, warped_rate)
        zeros.append(zd)
        poles.append(pd)
        gain *= kd
    return zpk2sos(np.concatenate(zeros), np.concatenate(poles), gain)


def apply(acceleration: np.ndarray, fs: float, name: str | Weighting) -> np.ndarray:
    """Frequency-weighted acceleration (m/s^2) of a sampled acceleration (m/s^2) at ``fs`` (Hz).

    Causal filtering (as a weighting meter does) that starts in the steady state of the first sample;
    records sampled below :data:`FILTER_RATE` are filtered at an integer multiple of their rate.
    """
    from scipy.signal import sosfilt, sosfilt_zi

    rate = check_rate(name, fs)
    x = samples.signal(acceleration, "acceleration", min_samples=2)
    factor = oversampling(rate)
    sos = digital_sos(name, rate * factor)
    start = sosfilt_zi(sos) * x[0]
    if factor == 1:
        weighted, _ = sosfilt(sos, x, zi=start)
        return np.asarray(weighted)
    return _oversampled(x, factor, sos, start)


BLOCK = 1 << 16
"""Record samples resampled and filtered at a time, so memory does not grow with the oversampling factor."""
MARGIN = 64
"""Record samples added on each side of a block before resampling (the resampling filter reaches 10)."""


def _oversampled(x: np.ndarray, factor: int, sos: np.ndarray, state: np.ndarray) -> np.ndarray:
    """Resample ``x`` up by ``factor``, filter with ``sos`` from ``state`` and keep every factor-th sample,
    block by block; interior block edges are resampled with a margin and trimmed, so the result equals
    that of the whole record at once."""
    from scipy.signal import resample_poly, sosfilt

    size = x.size
    weighted = np.empty(size)
    for begin in range(0, size, BLOCK):
        stop = min(size, begin + BLOCK)
        lo, hi = max(0, begin - MARGIN), min(size, stop + MARGIN)
        dense = resample_poly(x[lo:hi], factor, 1, padtype="edge")[(begin - lo) * factor:(stop - lo) * factor]
        filtered, state = sosfilt(sos, dense, zi=state)
        weighted[begin:stop] = filtered[::factor]
    return weighted
