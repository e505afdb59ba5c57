"""Human response values on synthetic records with closed-form answers."""

from __future__ import annotations

import math

import numpy as np
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st
from hypothesis.extra.numpy import arrays

from fieldmode.calc.records import human_response as hr
from fieldmode.calc.records import weighting


def sine(amplitude: float, frequency: float, fs: float, duration: float) -> np.ndarray:
    return amplitude * np.sin(2 * np.pi * frequency * np.arange(int(round(duration * fs))) / fs)


def test_vdv_of_a_sine_has_its_closed_form() -> None:
    # Source: VDV = (int a^4 dt)^(1/4) (ISO 2631-1:1997 6.3.2, clause number from memory); the mean of sin^4
    # is 3/8, so a sine of amplitude A over T gives A (3T/8)^(1/4)
    amplitude, duration = 0.3, 20.0
    value = hr.vdv(sine(amplitude, 8.0, 1000.0, duration), 1000.0)
    assert value == pytest.approx(amplitude * (3 * duration / 8) ** 0.25, rel=1e-9)


def test_vdv_of_a_weighted_sine_through_assess() -> None:
    # Source: closed form A_w (3T/8)^(1/4) with A_w = A |Wb(f)| from the analog definition (BS 6841, from memory);
    # the filter's start-up adds a little in the first second
    amplitude, f, fs, duration = 0.1, 6.3, 500.0, 120.0
    exposure = hr.assess(sine(amplitude, f, fs, duration), fs, "Wb")
    weighted_amplitude = amplitude * float(weighting.magnitude("Wb", f))
    assert exposure.vdv == pytest.approx(weighted_amplitude * (3 * duration / 8) ** 0.25, rel=0.01)
    assert exposure.weighted_rms == pytest.approx(weighted_amplitude / math.sqrt(2), rel=0.01)
    assert exposure.duration == pytest.approx(duration)


def test_mtvv_of_a_steady_sine_equals_its_rms() -> None:
    # Source: running r.m.s. over 1 s (ISO 2631-1:1997 6.3.1, clause number from memory) of a steady sine
    # holding whole cycles is A/sqrt(2)
    fs = 1000.0
    value, _ = hr.mtvv(sine(0.2, 8.0, fs, 30.0), fs)
    assert value == pytest.approx(0.2 / math.sqrt(2), rel=1e-9)
    exposure = hr.assess(sine(0.2, 8.0, fs, 60.0), fs, "Wk")
    assert exposure.mtvv == pytest.approx(exposure.weighted_rms, rel=0.02)


def test_running_rms_against_a_moving_average() -> None:
    # Oracle: numpy.convolve of a^2 with a 1 s box, square root
    fs = 200.0
    a = np.random.default_rng(7).normal(size=1500)
    box = np.ones(200) / 200
    np.testing.assert_allclose(hr.running_rms(a, fs), np.sqrt(np.convolve(a**2, box, mode="valid")), rtol=1e-9)


def test_mtvv_finds_a_burst_and_its_time() -> None:
    # Source: running r.m.s. with linear integration over 1 s: a 1 s burst of 8 Hz, amplitude 1, in silence gives
    # 1/sqrt(2) for the window that holds it exactly, ending at the burst's last sample
    fs = 400.0
    a = np.zeros(int(10 * fs))
    a[int(4 * fs):int(5 * fs)] = sine(1.0, 8.0, fs, 1.0)
    value, at = hr.mtvv(a, fs)
    assert value == pytest.approx(1 / math.sqrt(2), rel=1e-9)
    assert at == pytest.approx(5.0 - 1 / fs, abs=1 / fs)


def test_crest_factor_of_a_sine_is_root_two() -> None:
    # Source: peak over r.m.s. of a sine is sqrt(2)
    assert hr.crest_factor(sine(1.0, 5.0, 1000.0, 4.0)) == pytest.approx(math.sqrt(2), rel=1e-6)


def test_vdv_of_repeated_events_and_of_a_continuous_vibration() -> None:
    # Source: BS 6472-1:2008, VDV of N like events (N VDV^4)^(1/4); 16 events of 0.1 give 16^(1/4) x 0.1 = 0.2
    assert hr.vdv_of_events(0.1, 16) == pytest.approx(0.2, rel=1e-12)
    # Source: BS 6472-1:2008, continuous vibration scaled by (T/T_m)^(1/4): 1 h of 0.1 over a 16 h day = 0.2,
    # over an 8 h night 0.1 x 8^(1/4) = 0.16818
    assert hr.vdv_for_period(0.1, 3600.0, "day") == pytest.approx(0.2, rel=1e-12)
    assert hr.vdv_for_period(0.1, 3600.0, "night") == pytest.approx(0.168179, rel=1e-5)
    # Source: fourth-power sum (sum VDV_i^4)^(1/4): 0.1 and 0.1 give 0.1 x 2^(1/4) = 0.118921
    assert hr.vdv_combined([0.1, 0.1]) == pytest.approx(0.118921, rel=1e-5)


def test_estimated_vdv_and_its_crest_factor_limit() -> None:
    # Source: BS 6472-1:2008, eVDV = 1.4 a_rms t^0.25: 1.4 x 0.01 x 3600^0.25 = 0.108444, valid below crest factor 6
    estimate = hr.estimated_vdv(0.01, 3600.0, 4.0)
    assert estimate.value == pytest.approx(0.108444, rel=1e-5)
    assert estimate.valid
    assert not hr.estimated_vdv(0.01, 3600.0, 6.0).valid
    assert "not valid" in hr.estimated_vdv(0.01, 3600.0, 9.0).note


@pytest.mark.parametrize(("value", "period", "label", "low", "high"), [
    (0.1, "day", "below the lowest range of the table", 0.0, 0.2),
    (0.3, "day", "low probability of adverse comment", 0.2, 0.4),
    (0.4, "day", "adverse comment possible", 0.4, 0.8),
    (1.2, "day", "adverse comment probable", 0.8, 1.6),
    (2.0, "day", "above the highest range of the table", 1.6, math.inf),
    (0.15, "night", "low probability of adverse comment", 0.1, 0.2),
    (0.25, "night", "adverse comment possible", 0.2, 0.4),
    (0.5, "night", "adverse comment probable", 0.4, 0.8),
])
def test_bs6472_vdv_ranges(value: float, period: str, label: str, low: float, high: float) -> None:
    # Source: BS 6472-1:2008 Table 1, residential: day 0.2-0.4 / 0.4-0.8 / 0.8-1.6, night 0.1-0.2 / 0.2-0.4 /
    # 0.4-0.8 m/s^1.75 (confirmed in two summaries); a value on an edge is put in the higher range
    band = hr.vdv_band(value, period)
    assert (band.label, band.low, band.high) == (label, low, high)


def test_third_octave_bands_follow_iec_61260() -> None:
    # Source: IEC 61260-1:2014, base-10 bands: exact centre 1000 x 10^(n/10) Hz, edges centre x 10^(+-1/20);
    # nominal centres 1, 1.25, 1.6, 2, 2.5, 3.15, 4, 5, 6.3, 8 Hz in each decade (nominal values from memory)
    nominal, centre, lower, upper = hr.third_octave_bands(0.8, 12.5)
    assert nominal.tolist() == [0.8, 1.0, 1.25, 1.6, 2.0, 2.5, 3.15, 4.0, 5.0, 6.3, 8.0, 10.0, 12.5]
    np.testing.assert_allclose(centre, 1000 * 10 ** (np.arange(-31, -18) / 10), rtol=1e-12)
    np.testing.assert_allclose(upper / lower, 10**0.1, rtol=1e-12)
    np.testing.assert_allclose(np.sqrt(upper * lower), centre, rtol=1e-12)


def test_band_spectrum_puts_a_sine_in_its_band() -> None:
    # Source: Parseval's theorem: a sine of amplitude A holding whole cycles has r.m.s. A/sqrt(2), all in its band
    fs, duration = 500.0, 40.0
    a = sine(0.04, 6.3, fs, duration) + sine(0.01, 31.5, fs, duration)
    spectrum = hr.band_spectrum(a, fs, 1.0, 80.0)
    by_band = dict(zip(spectrum.nominal.tolist(), spectrum.rms, strict=True))
    assert by_band[6.3] == pytest.approx(0.04 / math.sqrt(2), rel=0.01)
    assert by_band[31.5] == pytest.approx(0.01 / math.sqrt(2), rel=0.01)
    others = [v for k, v in by_band.items() if k not in (6.3, 31.5)]
    assert max(others) < 0.003 * 0.04


def test_weighted_band_spectrum_and_its_total() -> None:
    # Source: |W(f)| of the analog Wk definition (ISO 2631-1:1997 Annex A) applied to the sine's band
    # Oracle: numpy.var of white noise equals the quadrature sum of all spectral lines (Parseval)
    fs = 512.0
    a = sine(0.04, 10**0.8, fs, 40.0)
    spectrum = hr.band_spectrum(a, fs, 1.0, 80.0, weighting="Wk")
    assert spectrum.rms.max() == pytest.approx(0.04 / math.sqrt(2) * float(weighting.magnitude("Wk", 10**0.8)),
                                               rel=0.01)
    noise = np.random.default_rng(3).normal(size=int(64 * fs))
    bands = hr.band_spectrum(noise, fs, 0.25, 160.0)
    inside = np.var(noise) * (bands.upper[-1] - bands.lower[0]) / (fs / 2)
    assert float(np.sum(bands.rms**2)) == pytest.approx(inside, rel=0.05)


def test_response_factor_against_the_base_curves() -> None:
    # From memory: ISO 10137:2007 Annex C base curves: vertical 5e-3 m/s^2 r.m.s. at 4-8 Hz, so 0.02 m/s^2
    # r.m.s. in the 5 Hz band is R = 4; horizontal 3.57e-3 at 1-2 Hz, so 7.14e-3 in the 1.6 Hz band is R = 2
    fs, duration = 400.0, 60.0
    vertical = hr.response_factor(sine(0.02 * math.sqrt(2), 10**0.7, fs, duration), fs, "vertical")
    assert vertical.value == pytest.approx(4.0, rel=0.01)
    assert vertical.nominal == 5.0
    horizontal = hr.response_factor(sine(7.14e-3 * math.sqrt(2), 10**0.2, fs, duration), fs, "horizontal")
    assert horizontal.value == pytest.approx(2.0, rel=0.01)
    assert horizontal.nominal == 1.6


@pytest.mark.parametrize(("call", "message"), [
    (lambda: hr.assess(np.r_[np.zeros(999), np.nan], 1000.0, "Wk"), "NaN or infinite value \\(sample 999\\)"),
    (lambda: hr.assess(np.zeros(500), 1000.0, "Wk"), "lasts 0.5 s; the MTVV needs at least 1 s"),
    (lambda: hr.assess(np.zeros(2000), 150.0, "Wb"), "too low for Wb"),
    (lambda: hr.running_rms(np.zeros(10), 100.0), "shorter than the running r.m.s. integration time"),
    (lambda: hr.band_spectrum(np.zeros(2000), 1000.0, 1.0, 80.0), "1 Hz band needs at least"),
    (lambda: hr.band_spectrum(np.zeros(20000), 100.0, 1.0, 80.0), "above the Nyquist frequency"),
    (lambda: hr.vdv_band(0.3, "evening"), "'day' \\(16 h\\) or 'night' \\(8 h\\)"),
    (lambda: hr.vdv_band(float("nan"), "day"), "finite, non-negative"),
    (lambda: hr.vdv_of_events(0.1, 0), "whole number of at least 1"),
    (lambda: hr.vdv(np.ones(10), 0.0), "sample rate must be a positive"),
    (lambda: hr.crest_factor(np.zeros(10)), "zero throughout"),
    (lambda: hr.response_factor(np.zeros(40000), 400.0, "vertical", 0.5, 80.0), "base curves run from 1 to 80 Hz"),
    (lambda: hr.response_factor(np.zeros(40000), 400.0, "diagonal"), "direction must be one of"),
])
def test_bad_input_is_refused_with_a_clear_message(call, message: str) -> None:  # noqa: ANN001
    with pytest.raises(ValueError, match=message):
        call()


@settings(max_examples=40, deadline=None)
@given(arrays(np.float64, st.integers(min_value=4, max_value=400), elements=st.floats(-50, 50)),
       st.integers(min_value=2, max_value=398))
def test_vdv_of_a_record_is_the_fourth_power_sum_of_its_parts(values: np.ndarray, cut: int) -> None:
    # Source: VDV = (int a^4 dt)^(1/4) (ISO 2631-1:1997 6.3.2, clause number from memory): the integral adds
    # over consecutive parts
    cut = min(cut, values.size - 2)
    whole = hr.vdv(values, 100.0)
    parts = hr.vdv_combined([hr.vdv(values[:cut], 100.0), hr.vdv(values[cut:], 100.0)])
    assert parts == pytest.approx(whole, rel=1e-9, abs=1e-300)
