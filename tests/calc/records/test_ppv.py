"""PPV, frequency at the peak, vector sum, events and integration on synthetic records with known answers."""

from __future__ import annotations

import math

import numpy as np
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from fieldmode.calc.records import ppv

FS = 1000.0


def times(duration: float, fs: float = FS) -> np.ndarray:
    return np.arange(int(round(duration * fs))) / fs


def burst(t: np.ndarray, amplitude: float, frequency: float, start: float, cycles: int) -> np.ndarray:
    """Whole cycles of a sine starting at ``start`` (s), zero elsewhere."""
    inside = (t >= start) & (t < start + cycles / frequency)
    return np.where(inside, amplitude * np.sin(2 * np.pi * frequency * (t - start)), 0.0)


def test_ppv_and_frequency_of_a_sine_burst() -> None:
    # Source: closed form: a burst of amplitude A peaks at A, a quarter period after each upward zero crossing
    t = times(6.0)
    v = burst(t, 0.004, 12.5, 2.0, 10)
    peak = ppv.axis_peak(v, FS)
    assert peak.ppv == pytest.approx(0.004, rel=1e-9)
    assert peak.time == pytest.approx(2.0 + 0.25 / 12.5, abs=1 / FS)
    assert peak.frequency_crossings == pytest.approx(12.5, rel=1e-3)
    assert peak.frequency_spectrum == pytest.approx(12.5, rel=0.02)


def test_negative_peak_is_found_with_its_half_cycle() -> None:
    # Source: closed form: a downward half sine -A sin(2 pi f t), 0 <= t <= 1/(2f), peaks at -A a quarter
    # period in, and its half cycle is 1/(2f) long
    t = times(4.0)
    v = np.where((t >= 1.0) & (t <= 1.0 + 1 / 50.0), -0.01 * np.sin(2 * np.pi * 25.0 * (t - 1.0)), 0.0)
    peak = ppv.axis_peak(v, FS, start_time=100.0)
    assert peak.ppv == pytest.approx(0.01, rel=1e-9)
    assert peak.time == pytest.approx(100.0 + 1.0 + 0.25 / 25.0, abs=1e-9)
    assert peak.frequency_crossings == pytest.approx(25.0, rel=1e-3)


def test_decaying_pulse_peak_and_frequency() -> None:
    # Source: closed form for exp(-sigma t) sin(wd t): the largest value is at t* = atan(wd/sigma)/wd, and its
    # zero crossings are exactly pi/wd apart, so the half-cycle method gives fd
    fd, zeta = 8.0, 0.05
    wd = 2 * math.pi * fd
    sigma = zeta * wd / math.sqrt(1 - zeta**2)
    t = times(5.0)
    v = np.where(t >= 1.0, 0.02 * np.exp(-sigma * (t - 1.0)) * np.sin(wd * (t - 1.0)), 0.0)
    peak = ppv.axis_peak(v, FS)
    t_star = math.atan(wd / sigma) / wd
    assert peak.ppv == pytest.approx(0.02 * math.exp(-sigma * t_star) * math.sin(wd * t_star), rel=2e-4)
    assert peak.time == pytest.approx(1.0 + t_star, abs=1 / FS)
    assert peak.frequency_crossings == pytest.approx(fd, rel=1e-4)
    assert peak.frequency_spectrum == pytest.approx(fd, rel=0.03)


def test_spectral_frequency_between_fft_lines() -> None:
    # Source: closed form: a steady sine of 17.3 Hz; zero padding and interpolation resolve between the 1 Hz lines
    t = times(3.0)
    v = 0.001 * np.sin(2 * np.pi * 17.3 * t + 0.4)
    index = int(np.argmax(np.abs(v[1000:2000]))) + 1000
    assert ppv.spectral_frequency(v, FS, index) == pytest.approx(17.3, rel=2e-3)


def test_peak_vector_sum_of_in_phase_and_quadrature_axes() -> None:
    # Source: closed form: in-phase sines of amplitudes a, b, c give sqrt(a^2 + b^2 + c^2); a sine and a cosine
    # of equal amplitude A give a constant vector sum A
    t = times(2.0)
    s = np.sin(2 * np.pi * 10.0 * t)
    total, when = ppv.peak_vector_sum([0.003 * s, 0.004 * s, 0.012 * s], FS)
    assert total == pytest.approx(0.013, rel=1e-9)
    assert abs(s[int(round(when * FS))]) == pytest.approx(1.0, abs=1e-9)
    circle, _ = ppv.peak_vector_sum([0.005 * s, 0.005 * np.cos(2 * np.pi * 10.0 * t)], FS)
    assert circle == pytest.approx(0.005, rel=1e-12)


def test_vector_sum_across_block_boundaries() -> None:
    # Common practice (no source): the vector sum is formed block by block; a spike just past a block edge is found
    size = ppv.BLOCK + 10
    axes = [np.zeros(size), np.zeros(size), np.zeros(size)]
    axes[1][ppv.BLOCK + 3] = 3e-3
    axes[2][ppv.BLOCK + 3] = -4e-3
    total, when = ppv.peak_vector_sum(axes, FS, start_time=5.0)
    assert (total, when) == (pytest.approx(5e-3), pytest.approx(5.0 + (ppv.BLOCK + 3) / FS))


def test_events_in_a_record_with_known_bursts() -> None:
    # Source: constructed record: bursts at 10 s (x, 20 Hz), 40 s (z, 8 Hz) and 40.5 s (y, 15 Hz, within the
    # quiet gap of the one before, so one event), 80 s (y, 25 Hz), in noise far below the threshold
    t = times(100.0)
    noise = np.random.default_rng(11).normal(scale=1e-5, size=(3, t.size))
    x = noise[0] + burst(t, 3e-3, 20.0, 10.0, 10)
    y = noise[1] + burst(t, 1.5e-3, 15.0, 40.5, 6) + burst(t, 6e-3, 25.0, 80.0, 12)
    z = noise[2] + burst(t, 4e-3, 8.0, 40.0, 3)
    events = ppv.find_events([x, y, z], FS, threshold=5e-4, quiet_gap=2.0)
    assert len(events) == 3
    first, second, third = events
    assert first.start == pytest.approx(10.0, abs=0.01)
    assert first.end == pytest.approx(10.5, abs=0.01)
    assert first.axes[0].ppv == pytest.approx(3e-3, rel=0.02)
    assert first.axes[0].frequency_crossings == pytest.approx(20.0, rel=0.02)
    assert first.axes[0].frequency_spectrum == pytest.approx(20.0, rel=0.05)
    assert second.start == pytest.approx(40.0, abs=0.01)
    assert second.end == pytest.approx(40.9, abs=0.01)
    assert second.axes[2].ppv == pytest.approx(4e-3, rel=0.02)
    assert second.axes[1].ppv == pytest.approx(1.5e-3, rel=0.05)
    assert second.axes[2].frequency_crossings == pytest.approx(8.0, rel=0.02)
    assert third.axes[1].ppv == pytest.approx(6e-3, rel=0.02)
    assert ((third.axes[1].time - 80.0) * 25.0) % 1.0 == pytest.approx(0.25, abs=0.03)  # on a crest
    assert third.vector_sum == pytest.approx(6e-3, rel=0.02)
    assert third.vector_sum >= max(a.ppv for a in third.axes)


def test_a_shorter_quiet_gap_splits_the_merged_event() -> None:
    # Source: constructed record: two bursts 0.5 s apart (after the first ends) are one event with a 2 s gap
    # and two with a 0.2 s gap
    t = times(10.0)
    v = burst(t, 2e-3, 20.0, 2.0, 10) + burst(t, 2e-3, 20.0, 3.0, 10)
    assert len(ppv.find_events([v], FS, 1e-3, 2.0)) == 1
    assert [round(e.start, 2) for e in ppv.find_events([v], FS, 1e-3, 0.2)] == [2.0, 3.0]


def test_no_event_below_the_threshold() -> None:
    # Common practice (no source): a record that never exceeds the threshold has no event
    assert ppv.find_events([np.full(5000, 1e-4)], FS, 5e-4, 1.0) == []


def test_integration_against_the_trapezoidal_rule() -> None:
    # Oracle: scipy.integrate.cumulative_trapezoid of the same acceleration (mean removed); the high-pass at
    # 1 Hz leaves 5 Hz and 23 Hz content unchanged away from the ends
    from scipy.integrate import cumulative_trapezoid

    t = times(20.0)
    a = 0.3 * np.sin(2 * np.pi * 5.0 * t) + 0.8 * np.cos(2 * np.pi * 23.0 * t) + 0.05
    velocity, text = ppv.velocity_from_acceleration(a, FS)
    oracle = cumulative_trapezoid(a - a.mean(), dx=1 / FS, initial=0.0)
    oracle -= oracle.mean()
    middle = slice(int(3 * FS), int(17 * FS))
    np.testing.assert_allclose(velocity[middle], oracle[middle], atol=0.005 * np.abs(oracle).max())
    # Source: closed form: the integral of 0.3 sin(2 pi 5 t) peaks at 0.3 / (2 pi 5)
    assert ppv.axis_peak(velocity[middle], FS).ppv == pytest.approx(0.3 / (10 * math.pi) + 0.8 / (46 * math.pi),
                                                                     rel=0.02)
    assert "high-pass at 1 Hz" in text and "zero phase" in text


@pytest.mark.parametrize(("call", "message"), [
    (lambda: ppv.axis_peak(np.r_[0.0, np.nan, 1.0], FS), "NaN or infinite value \\(sample 1\\)"),
    (lambda: ppv.axis_peak(np.zeros(1), FS), "at least 2 are needed"),
    (lambda: ppv.velocity_from_acceleration(np.zeros(1000), FS), "lasts 1 s; a high-pass at 1 Hz needs at least 4 s"),
    (lambda: ppv.velocity_from_acceleration(np.zeros(10000), 100.0, high_pass=60.0), "below the Nyquist frequency"),
    (lambda: ppv.velocity_from_acceleration(np.zeros(10000), FS, order=0), "order must be a whole number"),
    (lambda: ppv.find_events([np.zeros(100)], FS, 0.0, 1.0), "event threshold must be a positive"),
    (lambda: ppv.find_events([np.zeros(100)], FS, 1e-3, -1.0), "quiet gap must be a positive"),
    (lambda: ppv.find_events([np.zeros(100), np.zeros(99)], FS, 1e-3, 1.0), "different lengths"),
    (lambda: ppv.peak_vector_sum([np.zeros(9)] * 4, FS), "one to three velocity axes"),
    (lambda: ppv.axis_peak(np.zeros(100), -5.0), "sample rate must be a positive"),
    (lambda: ppv.crossing_frequency(np.zeros(100), FS, 100), "sample 100 is not in a record of 100 samples"),
])
def test_bad_input_is_refused_with_a_clear_message(call, message: str) -> None:  # noqa: ANN001
    with pytest.raises(ValueError, match=message):
        call()


@settings(max_examples=40, deadline=None)
@given(scale=st.floats(min_value=1e-4, max_value=1e3), shift=st.integers(min_value=0, max_value=2000),
       seed=st.integers(min_value=0, max_value=2**31 - 1))
def test_ppv_scales_with_the_signal_and_moves_with_it(scale: float, shift: int, seed: int) -> None:
    # Common practice (no source): PPV is a peak of |v|, so it scales with the signal and its time moves with a delay
    v = np.random.default_rng(seed).normal(scale=1e-3, size=3000)
    base = ppv.axis_peak(v, FS)
    moved = ppv.axis_peak(np.r_[np.zeros(shift), scale * v], FS)
    assert moved.ppv == pytest.approx(scale * base.ppv, rel=1e-12)
    assert moved.time == pytest.approx(base.time + shift / FS, abs=1e-9)


@settings(max_examples=40, deadline=None)
@given(seed=st.integers(min_value=0, max_value=2**31 - 1))
def test_vector_sum_lies_between_the_largest_axis_and_the_root_sum_square(seed: int) -> None:
    # Common practice (no source): max_i PPV_i <= peak vector sum <= sqrt(sum_i PPV_i^2) for any record
    axes = list(np.random.default_rng(seed).normal(size=(3, 500)))
    peaks = [ppv.axis_peak(v, FS).ppv for v in axes]
    total, _ = ppv.peak_vector_sum(axes, FS)
    assert max(peaks) <= total * (1 + 1e-12)
    assert total <= math.sqrt(sum(p * p for p in peaks)) * (1 + 1e-12)
