"""Frequency weightings: analog magnitudes against the standards, the digital filter against the analog one."""

from __future__ import annotations

import math

import numpy as np
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from fieldmode.calc.records import weighting


def definition(f: np.ndarray, f1: float, f2: float, f3: float | None, f4: float | None, q4: float | None,
               f5: float | None, q5: float | None, f6: float | None, q6: float | None, gain: float) -> np.ndarray:
    """|W(f)| written out from the sections of the standards (complex arithmetic, no scipy)."""
    s = 2j * np.pi * np.asarray(f, dtype=float)
    w1, w2 = 2 * np.pi * f1, 2 * np.pi * f2
    q = 1 / math.sqrt(2)
    h = s**2 / (s**2 + s * w1 / q + w1**2) * w2**2 / (s**2 + s * w2 / q + w2**2)
    if f4 is not None:
        w4 = 2 * np.pi * f4
        top = 1 + s / (2 * np.pi * f3) if f3 is not None else 1
        h = h * top / (1 + s / (q4 * w4) + s**2 / w4**2)
    if f5 is not None:
        w5, w6 = 2 * np.pi * f5, 2 * np.pi * f6
        h = h * (s**2 + s * w5 / q5 + w5**2) / (s**2 + s * w6 / q6 + w6**2)
    return gain * np.abs(h)


PARAMETERS = {
    # Source: ISO 2631-1:1997 Annex A, Table A.2, Wk (confirmed in a national standard's annex)
    "Wk": (0.4, 100.0, 12.5, 12.5, 0.63, 2.37, 0.91, 3.35, 0.91, 1.0),
    # From memory: ISO 2631-1:1997 Annex A, Table A.2, Wd
    "Wd": (0.4, 100.0, 2.0, 2.0, 0.63, None, None, None, None, 1.0),
    # From memory: BS 6841:1987, Wb
    "Wb": (0.4, 100.0, 16.0, 16.0, 0.55, 2.5, 0.9, 4.0, 0.95, 1.024),
    # From memory: ISO 2631-2:2003, Wm
    "Wm": (10 ** -0.1, 100.0, 5.684, 5.684, 0.5, None, None, None, None, 1.0),
}
THIRD_OCTAVES = 10 ** (np.arange(-6, 21) / 10)


@pytest.mark.parametrize(("exponent", "expected"), [(0, 0.482), (3, 0.531), (6, 0.965), (9, 1.037), (12, 0.774)])
def test_wk_check_values_at_exact_third_octave_frequencies(exponent: int, expected: float) -> None:
    # Source: ISO 2631-1:1997 Annex A, Wk definition (parameters confirmed); check values evaluated from it
    # at 10^(n/10) Hz, to three decimals
    assert float(weighting.magnitude("Wk", 10 ** (exponent / 10))) == pytest.approx(expected, abs=6e-4)


@pytest.mark.parametrize(("frequency", "factor"), [
    (0.5, 0.418), (1.0, 0.482), (1.6, 0.494), (2.5, 0.631), (4.0, 0.967), (6.3, 1.054), (8.0, 1.036),
    (12.5, 0.902), (16.0, 0.768), (31.5, 0.405), (63.0, 0.186), (100.0, 0.0887)])
def test_wk_against_tabulated_factors(frequency: float, factor: float) -> None:
    # From memory: ISO 2631-1:1997 Table 3, Wk factors at nominal one-third-octave frequencies
    assert float(weighting.magnitude("Wk", frequency)) == pytest.approx(factor, rel=0.01)


@pytest.mark.parametrize(("frequency", "factor"), [
    (0.5, 0.853), (1.0, 1.011), (2.0, 0.890), (4.0, 0.512), (8.0, 0.253), (16.0, 0.125), (31.5, 0.0632),
    (63.0, 0.0295)])
def test_wd_against_tabulated_factors(frequency: float, factor: float) -> None:
    # From memory: ISO 2631-1:1997 Table 3, Wd factors at nominal one-third-octave frequencies
    assert float(weighting.magnitude("Wd", frequency)) == pytest.approx(factor, rel=0.01)


@pytest.mark.parametrize("name", list(PARAMETERS))
def test_magnitude_follows_the_filter_definition(name: str) -> None:
    # Source: the sections of ISO 2631-1:1997 Annex A (Wk, Wd), BS 6841 (Wb), ISO 2631-2:2003 (Wm), evaluated
    # directly with complex arithmetic (parameters as commented in PARAMETERS)
    expected = definition(THIRD_OCTAVES, *PARAMETERS[name])
    np.testing.assert_allclose(weighting.magnitude(name, THIRD_OCTAVES), expected, rtol=1e-10)


def test_upward_step_tends_to_one_at_high_frequency_and_to_the_corner_ratio_at_low() -> None:
    # Source: ISO 2631-1:1997 Annex A, upward step (s^2 + s w5/Q5 + w5^2)/(s^2 + s w6/Q6 + w6^2)
    from scipy.signal import freqs_zpk

    zeros, poles, gain, _ = weighting.sections("Wk")[-1]
    _, h = freqs_zpk(zeros, poles, gain, worN=2 * np.pi * np.array([1e-4, 1e5]))
    assert abs(h[0]) == pytest.approx((2.37 / 3.35) ** 2, rel=1e-6)
    assert abs(h[1]) == pytest.approx(1.0, rel=1e-6)


def test_wm_is_proportional_to_velocity_above_its_transition() -> None:
    # From memory: ISO 2631-2:2003, Wm falls as 1/f (constant velocity) above about 6 Hz: with Q4 = 0.5 and
    # f3 = f4 the transition is the first-order low-pass 1/(1 + s/w3) at 5.684 Hz; the band-limiting low-pass
    # at 100 Hz is a second-order Butterworth, |H| = 1/sqrt(1 + (f/f2)^4)
    f = np.array([20.0, 40.0])
    ratio = weighting.magnitude("Wm", f) / (5.684 / f)
    np.testing.assert_allclose(ratio, 1 / np.sqrt(1 + (5.684 / f) ** 2) / np.sqrt(1 + (f / 100.0) ** 4), rtol=1e-3)


@pytest.mark.parametrize("name", list(PARAMETERS))
@pytest.mark.parametrize("fs", [256.0, 500.0, 1000.0, 2048.0])
@pytest.mark.parametrize("frequency", [1.0, 5.0, 16.0, 50.0, 80.0])
def test_weighted_rms_of_a_sine_through_the_digital_filter(name: str, fs: float, frequency: float) -> None:
    # Source: r.m.s. of a steady sine is A/sqrt(2); weighted by |W(f)| of the analog definition
    amplitude = 0.05
    t = np.arange(int(24 * fs)) / fs
    weighted = weighting.apply(amplitude * np.sin(2 * np.pi * frequency * t), fs, name)
    steady = weighted[int(8 * fs):]
    expected = amplitude / math.sqrt(2) * float(weighting.magnitude(name, frequency))
    assert float(np.sqrt(np.mean(steady**2))) == pytest.approx(expected, rel=0.01)


def test_digital_sections_match_the_analog_weighting_well_below_nyquist() -> None:
    # Oracle: scipy.signal.sosfreqz of the digital sections against scipy.signal.freqs_zpk of the analog ones
    from scipy.signal import freqs_zpk, sosfreqz

    fs = 8000.0
    f = THIRD_OCTAVES
    _, digital = sosfreqz(weighting.digital_sos("Wb", fs), worN=f, fs=fs)
    zeros, poles, gain = weighting.analog_zpk("Wb")
    _, analog = freqs_zpk(zeros, poles, gain, worN=2 * np.pi * f)
    np.testing.assert_allclose(np.abs(digital), np.abs(analog), rtol=2e-3)


def test_an_offset_gives_no_weighted_output() -> None:
    # Common practice (no source): the band-limiting high-pass blocks a constant, and the filter starts in the
    # steady state of the first sample, so a gravity offset adds nothing
    fs = 500.0
    weighted = weighting.apply(np.full(int(20 * fs), 9.81), fs, "Wk")
    assert np.abs(weighted).max() < 1e-3 * 9.81


def test_delay_matches_the_phase_of_the_weighting() -> None:
    # Oracle: scipy.signal.freqs_zpk phase of the analog weighting; the causal digital filter keeps it
    from scipy.signal import freqs_zpk

    fs, f = 1000.0, 8.0
    t = np.arange(int(20 * fs)) / fs
    weighted = weighting.apply(np.sin(2 * np.pi * f * t), fs, "Wd")
    zeros, poles, gain = weighting.analog_zpk("Wd")
    _, h = freqs_zpk(zeros, poles, gain, worN=[2 * np.pi * f])
    expected = np.abs(h[0]) * np.sin(2 * np.pi * f * t + np.angle(h[0]))
    np.testing.assert_allclose(weighted[int(10 * fs):], expected[int(10 * fs):], atol=5e-3 * np.abs(h[0]))


def test_a_sample_rate_too_low_for_the_band_is_refused() -> None:
    # Source: ISO 2631-1:1997 Annex A, band limit f2 = 100 Hz: a record needs its Nyquist frequency above it
    with pytest.raises(ValueError, match="too low for Wk.*f2 = 100 Hz.*Nyquist"):
        weighting.apply(np.zeros(1000), 200.0, "Wk")
    assert weighting.min_sample_rate("Wk") > 2 * 100.0


@pytest.mark.parametrize("bad", [[0.0, float("nan"), 1.0], [1.0, float("inf"), 0.0]])
def test_non_finite_samples_are_refused(bad: list[float]) -> None:
    with pytest.raises(ValueError, match="NaN or infinite value \\(sample 1\\)"):
        weighting.apply(np.array(bad * 200), 1000.0, "Wb")


def test_unknown_weighting_and_bad_rates_are_refused() -> None:
    with pytest.raises(ValueError, match="unknown weighting 'Wz'"):
        weighting.magnitude("Wz", 5.0)
    with pytest.raises(ValueError, match="sample rate must be a positive"):
        weighting.apply(np.zeros(100), float("nan"), "Wk")
    with pytest.raises(ValueError, match="finite and not negative"):
        weighting.magnitude("Wk", -1.0)


@settings(max_examples=30, deadline=None)
@given(scale=st.floats(min_value=-1e3, max_value=1e3).filter(lambda v: abs(v) > 1e-6),
       seed=st.integers(min_value=0, max_value=2**31 - 1))
def test_weighting_is_linear(scale: float, seed: int) -> None:
    # Common practice (no source): a frequency weighting is a linear filter
    fs = 512.0
    x = np.random.default_rng(seed).normal(size=1024)
    expected = scale * weighting.apply(x, fs, "Wk")
    np.testing.assert_allclose(weighting.apply(scale * x, fs, "Wk"), expected, atol=1e-9 * np.abs(expected).max())


def test_block_by_block_filtering_equals_the_whole_record_at_once() -> None:
    # Oracle: scipy.signal.resample_poly of the whole record, scipy.signal.sosfilt from the first sample's steady
    # state (scipy.signal.sosfilt_zi), every factor-th sample kept
    from scipy.signal import resample_poly, sosfilt, sosfilt_zi

    fs = 500.0
    x = np.random.default_rng(5).normal(size=2 * weighting.BLOCK + 777) + 0.3
    factor = weighting.oversampling(fs)
    sos = weighting.digital_sos("Wm", fs * factor)
    dense = resample_poly(x, factor, 1, padtype="edge")
    expected, _ = sosfilt(sos, dense, zi=sosfilt_zi(sos) * x[0])
    np.testing.assert_allclose(weighting.apply(x, fs, "Wm"), expected[::factor], rtol=1e-9, atol=1e-12)
