"""Check `occupants`: sines with closed-form answers through the whole check, the BS 6472-1 ranges, the
response factor by use, the demo floor and bad records."""

from __future__ import annotations

import math
from pathlib import Path

import numpy as np
import pytest
from scipy.signal import freqs

from fieldmode.calc.checks import BY_ID
from fieldmode.calc.framework.result import Result
from fieldmode.tui.cli import main

OCCUPANTS = BY_ID["occupants"]
DAY, NIGHT = 16 * 3600.0, 8 * 3600.0
# Source: BS 6472-1:2008, assessment periods 16 h day (07:00-23:00) and 8 h night


def analog_magnitude(frequency: float, f1: float, f2: float, f3: float, f4: float, q4: float,
                     step: tuple[float, float, float, float] | None, gain: float) -> float:
    """|W(f)| of a weighting from the standard's analog sections: band-limiting high-pass and low-pass
    (Q = 1/sqrt 2), acceleration-velocity transition, upward step, gain."""
    w = [2 * math.pi * f for f in (f1, f2, f3, f4)]
    q1 = 1 / math.sqrt(2)
    sections = [([1, 0, 0], [1, w[0] / q1, w[0] ** 2]),
                ([w[1] ** 2], [1, w[1] / q1, w[1] ** 2]),
                ([1 / w[2], 1], [1 / w[3] ** 2, 1 / (q4 * w[3]), 1])]
    if step is not None:
        f5, q5, f6, q6 = step
        w5, w6 = 2 * math.pi * f5, 2 * math.pi * f6
        sections.append(([1, w5 / q5, w5**2], [1, w6 / q6, w6**2]))
    magnitude = gain
    for numerator, denominator in sections:
        _, response = freqs(numerator, denominator, worN=[2 * math.pi * frequency])
        magnitude *= abs(response[0])
    return magnitude


def wb(frequency: float) -> float:
    # Oracle: scipy.signal.freqs of the analog sections; From memory: BS 6841:1987 Wb parameters
    # f1 0.4, f2 100, f3 = f4 = 16 Hz, Q4 0.55, f5 2.5 Hz, Q5 0.9, f6 4 Hz, Q6 0.95, gain 1.024
    return analog_magnitude(frequency, 0.4, 100.0, 16.0, 16.0, 0.55, (2.5, 0.9, 4.0, 0.95), 1.024)


def wd(frequency: float) -> float:
    # Oracle: scipy.signal.freqs of the analog sections; From memory: ISO 2631-1:1997 Table A.2 Wd
    # f1 0.4, f2 100, f3 = f4 = 2 Hz, Q4 0.63, no upward step
    return analog_magnitude(frequency, 0.4, 100.0, 2.0, 2.0, 0.63, None, 1.0)


def sine_file(tmp_path: Path, amplitude: float, frequency: float, duration: float = 40.0, fs: float = 500.0,
              header: str = "time [s],acc [m/s^2]") -> str:
    """A CSV record of a steady sine (whole cycles), amplitude in m/s^2."""
    t = np.arange(int(round(duration * fs))) / fs
    a = amplitude * np.sin(2 * math.pi * frequency * t)
    path = tmp_path / "sine.csv"
    np.savetxt(path, np.column_stack([t, a]), delimiter=",", fmt="%.9g", header=header, comments="")
    return str(path)


def run(path: str, **texts: str) -> Result:
    return OCCUPANTS.evaluate({**OCCUPANTS.demo_texts(), "file": path, **texts})


def si(result: Result, name: str) -> float:
    return float(result.values[name].si())


def test_a_sine_through_the_check_gives_the_closed_forms(tmp_path: Path) -> None:
    amplitude, f, duration = 0.05, 6.3, 40.0
    result = run(sine_file(tmp_path, amplitude, f, duration))
    weighted_amplitude = amplitude * wb(f)
    # Source: the r.m.s. of a sine is A/sqrt(2); a weighting multiplies a sine by |W(f)|. The causal filter's
    # start-up in the first second stays within 1 %
    assert si(result, "weighted_rms") == pytest.approx(weighted_amplitude / math.sqrt(2), rel=0.01)
    # Source: VDV = (int a_w^4 dt)^(1/4), and the mean of sin^4 is 3/8: A_w (3T/8)^(1/4)
    assert si(result, "vdv_record") == pytest.approx(weighted_amplitude * (3 * duration / 8) ** 0.25, rel=0.01)
    # Source: the running r.m.s. over 1 s of a steady sine of whole cycles is its r.m.s., so the MTVV is too
    assert si(result, "mtvv") == pytest.approx(weighted_amplitude / math.sqrt(2), rel=0.02)
    # Source: peak over r.m.s. of a sine is sqrt(2); the causal weighting's start-up from rest (as a meter's) adds
    # an overshoot in the first cycles, 2.4 % here, never less
    assert math.sqrt(2) * 0.999 <= si(result, "crest_factor") <= math.sqrt(2) * 1.03
    assert result.values["weighting"].si() == "Wb"
    assert si(result, "duration") == pytest.approx(duration)


def test_the_vdv_for_a_period_is_scaled_as_bs_6472_1_says(tmp_path: Path) -> None:
    amplitude, f, duration = 0.05, 8.0, 40.0
    path = sine_file(tmp_path, amplitude, f, duration)
    continuous = run(path)
    vdv = si(continuous, "vdv_record")
    # Source: BS 6472-1:2008, a continuous vibration measured over T_m: VDV (T/T_m)^(1/4)
    assert si(continuous, "vdv_period") == pytest.approx(vdv * (DAY / duration) ** 0.25, rel=1e-9)
    # Source: BS 6472-1:2008, estimated VDV 1.4 a_rms t^0.25 over the period
    assert si(continuous, "estimated_vdv") == pytest.approx(1.4 * si(continuous, "weighted_rms") * DAY**0.25,
                                                            rel=1e-9)
    night = run(path, period="night", events="12")
    # Source: BS 6472-1:2008, N like events: (N VDV^4)^(1/4); the estimate over N times the record
    assert si(night, "vdv_period") == pytest.approx(12**0.25 * vdv, rel=1e-9)
    assert si(night, "estimated_vdv") == pytest.approx(1.4 * si(night, "weighted_rms") * (12 * duration) ** 0.25,
                                                       rel=1e-9)
    assert night.values["vdv_period"].label == "VDV, 8 h night"
    texts = " ".join(flag.text for flag in night.flags)
    assert "12 events" in texts and "(T" not in texts


@pytest.mark.parametrize(("target", "period", "range_text", "comment"), [
    # Source: BS 6472-1:2008 Table 1, residential, 16 h day: 0.2-0.4 low probability of adverse comment,
    # 0.4-0.8 adverse comment possible, 0.8-1.6 adverse comment probable (m/s^1.75)
    (0.19, "day", "below 0.2", "below the lowest range"), (0.21, "day", "0.2-0.4", "low probability"),
    (0.39, "day", "0.2-0.4", "low probability"), (0.41, "day", "0.4-0.8", "possible"),
    (0.79, "day", "0.4-0.8", "possible"), (0.81, "day", "0.8-1.6", "probable"),
    (1.65, "day", "above 1.6", "above the highest range"),
    # Source: BS 6472-1:2008 Table 1, residential, 8 h night 0.1-0.2 / 0.2-0.4 / 0.4-0.8 m/s^1.75
    (0.095, "night", "below 0.1", "below the lowest range"), (0.105, "night", "0.1-0.2", "low probability"),
    (0.195, "night", "0.1-0.2", "low probability"), (0.205, "night", "0.2-0.4", "possible"),
    (0.41, "night", "0.4-0.8", "probable"), (0.83, "night", "above 0.8", "above the highest range"),
])
def test_the_bs_6472_1_range_edges(tmp_path: Path, target: float, period: str, range_text: str,
                                   comment: str) -> None:
    f, duration = 8.0, 20.0
    seconds = DAY if period == "day" else NIGHT
    # Source: closed form of a continuous sine: VDV_period = A_w (3 T_m / 8)^(1/4) (T/T_m)^(1/4) = A_w (3 T/8)^(1/4);
    # the targets sit 2.5 % or more from an edge, beyond the filter's 1 %
    amplitude = target / (3 * seconds / 8) ** 0.25 / wb(f)
    result = run(sine_file(tmp_path, amplitude, f, duration), period=period)
    assert si(result, "vdv_period") == pytest.approx(target, rel=0.01)
    assert result.values["vdv_range"].si() == f"{range_text} m/s^1.75"
    assert result.values["adverse_comment"].si() == comment


def test_the_response_factor_of_a_sine_against_the_base_curve(tmp_path: Path) -> None:
    amplitude = 0.04
    result = run(sine_file(tmp_path, amplitude, 10**0.8), use="office")
    # From memory: ISO 10137 Annex C vertical base curve 5e-3 m/s^2 r.m.s. from 4 to 8 Hz; a sine at the exact
    # 6.3 Hz band centre puts all its r.m.s. A/sqrt(2) in that band
    assert si(result, "response_factor") == pytest.approx(amplitude / math.sqrt(2) / 5e-3, rel=0.01)
    assert si(result, "response_band") == 6.3
    # From memory: ISO 10137 Annex C / BS 6472:1992 multiplying factor 4 for offices
    assert si(result, "use_factor") == 4.0
    assert result.values["response_verdict"].si() == "NOT MET"
    # From memory: the weighted r.m.s. is compared with the flat base value; Wb is near 1 at 6.3 Hz
    assert si(result, "response_factor_mtvv") == pytest.approx(amplitude * wb(10**0.8) / math.sqrt(2) / 5e-3,
                                                               rel=0.02)
    band = int(np.argmin(np.abs(result.series["band_frequency"] - 10**0.8)))
    assert result.series["base_curve_limit"][band] == pytest.approx(4 * 5e-3)
    assert result.series["band_rms"][band] == pytest.approx(amplitude / math.sqrt(2), rel=0.01)
    assert result.series["band_rms_weighted"][band] == pytest.approx(amplitude * wb(10**0.8) / math.sqrt(2),
                                                                     rel=0.01)


@pytest.mark.parametrize(("use", "period", "factor"), [
    # From memory: ISO 10137 Annex C / BS 6472:1992, continuous vibration: critical 1, residential 2 by day and
    # 1.4 by night, office 4, workshop 8
    ("critical", "day", 1.0), ("residential", "day", 2.0), ("residential", "night", 1.4), ("office", "night", 4.0),
    ("workshop", "day", 8.0),
])
def test_the_factor_for_the_use_and_the_verdict(tmp_path: Path, use: str, period: str, factor: float) -> None:
    response = 1.5  # a 6.3 Hz sine whose band response factor is 1.5
    amplitude = response * 5e-3 * math.sqrt(2)
    result = run(sine_file(tmp_path, amplitude, 10**0.8), use=use, period=period)
    assert si(result, "use_factor") == factor
    governing = max(si(result, "response_factor"), si(result, "response_factor_mtvv"))
    assert result.values["response_verdict"].si() == ("met" if governing <= factor else "NOT MET")
    assert result.values["use_factor"].label == f"Factor for {use}"


def test_horizontal_takes_wd_and_its_base_curve(tmp_path: Path) -> None:
    amplitude, f = 0.02, 10**0.3  # the 2 Hz band's exact centre
    result = run(sine_file(tmp_path, amplitude, f), direction="horizontal")
    assert result.values["weighting"].si() == "Wd"
    assert si(result, "weighted_rms") == pytest.approx(amplitude * wd(f) / math.sqrt(2), rel=0.01)
    # From memory: ISO 10137 Annex C horizontal base curve 3.57e-3 m/s^2 r.m.s. from 1 to 2 Hz, 1.785e-3 f above
    assert si(result, "response_factor") == pytest.approx(amplitude / math.sqrt(2) / (1.785e-3 * f), rel=0.01)
    assert any("Wd: the BS 6472-1 weighting for horizontal" in flag.text for flag in result.flags)


def test_a_weighting_chosen_for_the_other_direction_is_flagged(tmp_path: Path) -> None:
    result = run(sine_file(tmp_path, 0.02, 8.0), weighting="Wd")
    assert result.values["weighting"].si() == "Wd"
    assert any(flag.level == "caution" and "Wd is not a weighting for vertical" in flag.text for flag in result.flags)
    assert "response_factor_mtvv" not in result.values


def test_a_large_crest_factor_says_the_estimate_is_not_valid(tmp_path: Path) -> None:
    fs, duration = 500.0, 30.0
    t = np.arange(int(duration * fs)) / fs
    # One short burst of 8 Hz in a quiet record: crest factor far above 6
    a = np.where((t > 10) & (t < 10.25), 0.5 * np.sin(2 * math.pi * 8 * t), 0.0) + 1e-4 * np.sin(2 * math.pi * 30 * t)
    path = tmp_path / "burst.csv"
    np.savetxt(path, np.column_stack([t, a]), delimiter=",", fmt="%.9g", header="t [s],a [m/s^2]", comments="")
    result = run(str(path))
    # Source: BS 6472-1:2008, the estimated VDV holds only for crest factors below 6
    assert si(result, "crest_factor") >= 6
    assert any(flag.level == "caution" and "estimated VDV is not valid" in flag.text for flag in result.flags)


def test_the_demo_floor_is_lively_for_an_office() -> None:
    result = OCCUPANTS.evaluate(OCCUPANTS.demo_texts())
    # Oracle: the generator's invented floor mode at 5.3 Hz falls in the 5 Hz band (4.47-5.62 Hz, IEC 61260)
    assert si(result, "response_band") == 5.0
    assert result.values["response_verdict"].si() == "NOT MET"
    assert si(result, "mtvv_time") > 0
    assert len(result.series["running_rms"]) <= 1000
    # Common practice (no source): the worst second is kept when the running r.m.s. is thinned
    assert float(np.max(result.series["running_rms"])) == si(result, "mtvv")
    assert result.caution.startswith("Guideline values are screening references")
    assert "local authority" in result.caution


def cli(capsys: pytest.CaptureFixture[str], *argv: str) -> tuple[int, str, str]:
    code = main(["occupants", *argv])
    captured = capsys.readouterr()
    return code, captured.out, captured.err


@pytest.mark.parametrize(("header", "extra", "message"), [
    ("time [s],acc", (), "has no unit in its header: give the acceleration unit"),
    ("time [s],vel [mm/s]", (), "is a velocity: give the acceleration unit"),
    ("time [s],acc", ("--signal-unit", "mm/s"), "is a velocity"),
])
def test_a_record_that_is_not_an_acceleration_exits_2_in_one_line(tmp_path: Path, capsys: pytest.CaptureFixture[str],
                                                                  header: str, extra: tuple[str, ...],
                                                                  message: str) -> None:
    path = sine_file(tmp_path, 0.05, 8.0, duration=20.0, header=header)
    code, out, err = cli(capsys, path, *extra)
    assert code == 2 and out == ""
    assert len(err.strip().splitlines()) == 1 and message in err and "Traceback" not in err


def test_without_a_unit_in_the_header_a_unit_given_is_used(tmp_path: Path, capsys: pytest.CaptureFixture[str]) -> None:
    path = sine_file(tmp_path, 5.0, 8.0, duration=20.0, header="time [s],acc")
    code, out, _ = cli(capsys, path, "--signal-unit", "mg", "--json")
    assert code == 0
    import json

    # Source: 1 mg = 9.80665e-3 m/s^2; Oracle: the analog Wb at 8 Hz
    rms = json.loads(out)["results"]["weighted_rms"]["value"]
    assert rms == pytest.approx(5.0 * 9.80665e-3 * wb(8.0) / math.sqrt(2), rel=0.01)


@pytest.mark.parametrize(("fs", "duration", "message"), [
    (200.0, 20.0, "too low for Wb"),
    (500.0, 0.5, "the MTVV needs|shorter than the running r.m.s."),
    (500.0, 2.5, "too short for the one-third-octave band"),
])
def test_records_too_coarse_or_short_exit_2_in_one_line(tmp_path: Path, capsys: pytest.CaptureFixture[str],
                                                        fs: float, duration: float, message: str) -> None:
    import re

    code, out, err = cli(capsys, sine_file(tmp_path, 0.05, 8.0, duration=duration, fs=fs))
    assert code == 2 and out == ""
    assert len(err.strip().splitlines()) == 1 and re.search(message, err)


def test_a_silent_record_is_refused(tmp_path: Path, capsys: pytest.CaptureFixture[str]) -> None:
    code, _, err = cli(capsys, sine_file(tmp_path, 0.0, 8.0, duration=20.0))
    assert code == 2 and "zero throughout" in err and len(err.strip().splitlines()) == 1


def test_a_short_record_starts_its_bands_where_it_resolves_them(tmp_path: Path) -> None:
    result = run(sine_file(tmp_path, 0.02, 6.25, duration=8.0))  # whole cycles: no leakage out of the 6.3 Hz band
    # Source: IEC 61260 band edges centre x 10^(+-1/20): a band needs 3 spectral lines of 1/8 Hz, so a centre of
    # at least 3 / (8 x 0.2308) = 1.63 Hz; the next base-10 centre is 10^(3/10) = 2 Hz
    assert result.series["band_frequency"][0] == pytest.approx(10**0.3)
    assert any("bands from 2 Hz" in flag.text for flag in result.flags)
    assert si(result, "response_factor") == pytest.approx(0.02 / math.sqrt(2) / 5e-3, rel=0.01)
