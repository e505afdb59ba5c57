"""Check `ppv`: PPV, vector sum and frequency of synthetic records with known answers, guideline values at
their band edges through the check, events, integration of an acceleration, and bad input."""

from __future__ import annotations

import json
import math
from pathlib import Path

import numpy as np
import pytest

from fieldmode.calc.checks import BY_ID
from fieldmode.calc.demo.sheet_piling import SheetPiling
from fieldmode.calc.framework.result import Result
from fieldmode.calc.framework.units import InputError
from fieldmode.tui.cli import main

PPV = BY_ID["ppv"]
FS = 1000.0


def si(result: Result, name: str) -> float:
    return float(result.values[name].si())


def write_record(tmp_path: Path, columns: dict[str, np.ndarray], fs: float = FS, name: str = "rec.csv") -> str:
    """A CSV record with a time column and the given columns (headers as given, values as given)."""
    size = len(next(iter(columns.values())))
    table = np.column_stack([np.arange(size) / fs, *columns.values()])
    path = tmp_path / name
    header = ",".join(["time [s]", *columns])
    np.savetxt(path, table, delimiter=",", header=header, comments="", fmt="%.9g")
    return str(path)


def burst(duration: float, amplitude: float, frequency: float, start: float, cycles: int,
          fs: float = FS) -> np.ndarray:
    """Whole cycles of a sine from ``start`` (s), zero elsewhere."""
    t = np.arange(int(round(duration * fs))) / fs
    inside = (t >= start) & (t < start + cycles / frequency)
    return np.where(inside, amplitude * np.sin(2 * np.pi * frequency * (t - start)), 0.0)


def evaluate(path: str, **texts: str) -> Result:
    return PPV.evaluate({**PPV.demo_texts(), "file": path, "threshold": "", "quiet_gap": "", **texts})


def test_ppv_time_and_frequency_of_a_sine_burst(tmp_path: Path) -> None:
    # Source: closed form: a burst A sin(2 pi f (t - t0)) peaks at A a quarter period after t0, and each half
    # cycle lasts 1 / (2 f)
    path = write_record(tmp_path, {"x [mm/s]": burst(5.0, 3.2, 25.0, 1.0, 20)})
    result = evaluate(path)
    assert si(result, "ppv_1") == pytest.approx(3.2e-3, rel=1e-6)
    assert si(result, "time_1") == pytest.approx(1.0 + 0.25 / 25.0, abs=0.1 / FS)
    assert si(result, "frequency_crossings_1") == pytest.approx(25.0, rel=2e-3)
    assert si(result, "frequency_spectrum_1") == pytest.approx(25.0, rel=1e-2)
    assert result.values["ppv_1"].label == "x: PPV"


def test_vector_sum_of_three_axes(tmp_path: Path) -> None:
    # Source: closed form: vx = A sin wt, vy = A cos wt, vz = B sin wt give |v|^2 = A^2 + B^2 sin^2 wt, largest
    # sqrt(A^2 + B^2) where sin wt = +-1; each axis's PPV is its amplitude
    t = np.arange(int(4 * FS)) / FS
    w = 2 * np.pi * 10.0
    a, b = 2.0, 1.5
    path = write_record(tmp_path, {"long [mm/s]": a * np.sin(w * t), "trans [mm/s]": a * np.cos(w * t),
                                   "vert [mm/s]": b * np.sin(w * t)})
    result = evaluate(path)
    assert si(result, "vector_sum") == pytest.approx(math.hypot(a, b) * 1e-3, rel=1e-6)
    assert si(result, "ppv_1") == pytest.approx(a * 1e-3, rel=1e-6)
    assert si(result, "ppv_3") == pytest.approx(b * 1e-3, rel=1e-6)
    assert math.sin(w * si(result, "vector_sum_time")) ** 2 == pytest.approx(1.0, abs=1e-5)
    assert [result.values[f"ppv_{n}"].label for n in (1, 2, 3)] == ["long: PPV", "trans: PPV", "vert: PPV"]


def test_named_axes_are_the_only_ones_read(tmp_path: Path) -> None:
    # Common practice (no source): the columns named are the axes, in the order named
    columns = {f"{name} [mm/s]": burst(3.0, amplitude, 25.0, 1.0, 5)
               for name, amplitude in zip("xyz", (1, 2, 4), strict=True)}
    path = write_record(tmp_path, columns)
    result = evaluate(path, axes="z, 3")  # column 3 of the file (time, x, y, z) is y
    assert si(result, "ppv_1") == pytest.approx(4e-3, rel=1e-6)
    assert si(result, "ppv_2") == pytest.approx(2e-3, rel=1e-6)
    assert "ppv_3" not in result.values


# Source: DIN 4150-3:1999 Table 1, line 2 (dwellings), foundation: 5 mm/s at 1-10 Hz, 5-15 mm/s at 10-50 Hz,
# 15-20 mm/s at 50-100 Hz, linear within a band (confirmed in two reproductions)
# Source: DIN 4150-3:1999 Table 1, uppermost floor horizontal, line 2: 15 mm/s at any frequency (confirmed)
# Source: BS 7385-2:1993 Table 1, line 2: 15 mm/s at 4 Hz, 20 mm/s at 15 Hz, 50 mm/s at 40 Hz and above
# (confirmed in a summary); line 1: 50 mm/s at 4 Hz and above (from memory)
# From memory: DIN 4150-3:1999 Table 3, long-term, uppermost floor horizontal, line 2: 5 mm/s
BAND_EDGES = [
    ("din-foundation-2", 5.0, 5.0), ("din-foundation-2", 10.0, 5.0), ("din-foundation-2", 30.0, 10.0),
    ("din-foundation-2", 50.0, 15.0), ("din-foundation-2", 100.0, 20.0), ("din-foundation-1", 50.0, 40.0),
    ("din-foundation-3", 10.0, 3.0), ("din-foundation-3", 100.0, 10.0), ("din-top-floor-2", 25.0, 15.0),
    ("din-top-floor-3", 5.0, 8.0), ("din-long-term-2", 40.0, 5.0), ("bs7385-line-2", 4.0, 15.0),
    ("din-foundation-2", 1.0, 5.0),
    ("bs7385-line-2", 15.0, 20.0), ("bs7385-line-2", 40.0, 50.0), ("bs7385-line-2", 80.0, 50.0),
    ("bs7385-line-1", 8.0, 50.0),
]


@pytest.mark.parametrize(("guideline", "frequency", "value"), BAND_EDGES)
def test_guideline_values_at_band_edges(tmp_path: Path, guideline: str, frequency: float, value: float) -> None:
    path = write_record(tmp_path, {"v [mm/s]": burst(4.0 + 40 / frequency, 1.0, frequency, 1.0, 40)})
    result = evaluate(path, guideline=guideline)
    # the frequency found is within 0.3 % of the sine's, and the value changes by at most 0.3 % with it
    assert si(result, "limit") == pytest.approx(value * 1e-3, rel=3e-3)
    assert si(result, "ratio") == pytest.approx(si(result, "ppv_1") / si(result, "limit"), rel=1e-12)
    assert result.values["verdict"].si() == "met"


def test_below_4_hz_bs7385_line_2_is_a_displacement_and_line_1_has_no_value(tmp_path: Path) -> None:
    # From memory: BS 7385-2:1993 Table 1, line 2 below 4 Hz: 0.6 mm zero to peak, i.e. PPV 2 pi f x 0.6 mm
    path = write_record(tmp_path, {"v [mm/s]": burst(12.0, 2.0, 2.5, 1.0, 20)})
    result = evaluate(path, guideline="bs7385-line-2")
    f = si(result, "governing_frequency")
    assert f == pytest.approx(2.5, rel=5e-3)
    assert si(result, "limit") == pytest.approx(2 * math.pi * f * 0.6e-3, rel=1e-9)
    # From memory: BS 7385-2:1993 Table 1, line 1 starts at 4 Hz
    line_1 = evaluate(path, guideline="bs7385-line-1")
    assert "limit" not in line_1.values
    assert "no guideline value" in str(line_1.values["verdict"].si())
    assert "event_ratio" not in line_1.series
    assert any(flag.level == "caution" and "below 4 Hz" in flag.text for flag in line_1.flags)


def test_exceedance_is_a_warning_and_bs7385_says_continuous_vibration_may_need_lower_values(tmp_path: Path) -> None:
    # Source: DIN 4150-3:1999 Table 1, line 2 foundation at 25 Hz: 2.5 + 0.25 x 25 = 8.75 mm/s (confirmed)
    path = write_record(tmp_path, {"v [mm/s]": burst(4.0, 10.5, 25.0, 1.0, 20)})
    result = evaluate(path, guideline="din-foundation-2")
    assert result.values["verdict"].si() == "NOT met"
    assert si(result, "ratio") == pytest.approx(10.5 / 8.75, rel=3e-3)
    assert any(flag.level == "warning" and "exceeds" in flag.text for flag in result.flags)
    # Source: BS 7385-2:1993 Table 1 is for transient vibration; continuous vibration may need lower values
    bs = evaluate(path, guideline="bs7385-line-2")
    assert any(flag.level == "caution" and "continuous" in flag.text for flag in bs.flags)
    assert not any("continuous" in flag.text for flag in result.flags)


@pytest.mark.parametrize(("amplitude", "level"), [(0.1, None), (0.2, 0.14), (0.5, 0.3), (1.2, 1.0), (12.0, 10.0)])
def test_bs5228_people_gives_the_level_reached(tmp_path: Path, amplitude: float, level: float | None) -> None:
    # From memory: BS 5228-2:2009+A1:2014 Annex B Table B.1: 0.14, 0.3, 1.0 and 10 mm/s
    path = write_record(tmp_path, {"v [mm/s]": burst(3.0, amplitude, 25.0, 1.0, 10)})
    result = evaluate(path, guideline="bs5228-people")
    if level is None:
        assert "human_level" not in result.values
    else:
        assert si(result, "human_level") == pytest.approx(level * 1e-3)
    assert "ratio" not in result.values and "guideline_limit" not in result.series
    assert "human_response" in result.values


def test_events_split_by_the_quiet_gap(tmp_path: Path) -> None:
    # Common practice (no source): two bursts 4 s apart are two events with a 2 s gap and one with a 5 s gap;
    # each event's PPV is its burst's amplitude
    v = burst(12.0, 2.0, 25.0, 1.0, 50) + burst(12.0, 5.0, 50.0, 7.0, 60)
    path = write_record(tmp_path, {"v [mm/s]": v})
    result = evaluate(path, threshold="0.5 mm/s", quiet_gap="2 s")
    assert si(result, "events") == 2
    np.testing.assert_allclose(result.series["event_ppv"], [2e-3, 5e-3], rtol=1e-6)
    np.testing.assert_allclose(result.series["event_start"], [1.0, 7.0], atol=0.01)
    np.testing.assert_allclose(result.series["event_frequency"], [25.0, 50.0], rtol=5e-3)
    assert si(result, "event_2") == pytest.approx(5e-3, rel=1e-6)
    # each event has every axis's results: its peak a quarter period after the burst starts
    np.testing.assert_allclose(result.series["event_ppv_1"], [2e-3, 5e-3], rtol=1e-6)
    np.testing.assert_allclose(result.series["event_time_1"], [1.0 + 0.25 / 25.0, 7.0 + 0.25 / 50.0], atol=0.1 / FS)
    np.testing.assert_allclose(result.series["event_crossings_1"], [25.0, 50.0], rtol=5e-3)
    assert result.values["event_2"].label == "Event 2 at 7 s PPV"
    assert si(evaluate(path, threshold="0.5 mm/s", quiet_gap="5 s"), "events") == 1
    assert si(evaluate(path), "events") == 1


def test_acceleration_integrated_with_the_high_pass_stated(tmp_path: Path) -> None:
    # Source: closed form: v = A sin(w t) sin^2(pi t / L) on 0..L (a smooth burst) has the acceleration
    # a = A w cos(w t) s^2 + A sin(w t) (pi / L) sin(2 pi t / L); a 1 Hz order-4 high-pass run both ways passes
    # its 20 Hz content unchanged (1 - 1/(1 + (1/20)^8)); trapezoidal integration at 50 samples per cycle is
    # within (w dt)^2 / 12 = 0.13 %
    t = np.arange(int(10 * FS)) / FS
    w, length, amplitude = 2 * np.pi * 20.0, 6.0, 4e-3
    local = np.clip(t - 2.0, 0.0, length)
    envelope = np.sin(np.pi * local / length) ** 2
    slope = (np.pi / length) * np.sin(2 * np.pi * local / length)
    velocity = amplitude * np.sin(w * t) * envelope
    acceleration = amplitude * (w * np.cos(w * t) * envelope + np.sin(w * t) * slope)
    path = write_record(tmp_path, {"acc [m/s^2]": acceleration})
    result = evaluate(path, high_pass="1 Hz", guideline="din-foundation-2")
    assert si(result, "ppv_1") == pytest.approx(np.max(np.abs(velocity)), rel=3e-3)
    assert any("integrated" in flag.text and "1 Hz" in flag.text for flag in result.flags)


def test_in_per_second_given_for_a_column_without_unit(tmp_path: Path) -> None:
    # Source: 1 in = 25.4 mm exactly (international inch)
    path = write_record(tmp_path, {"v": burst(3.0, 0.2, 25.0, 1.0, 10)})
    result = evaluate(path, signal_unit="in/s")
    assert si(result, "ppv_1") == pytest.approx(0.2 * 0.0254, rel=1e-9)


def test_no_unit_anywhere_is_refused_on_the_signal_unit(tmp_path: Path) -> None:
    # Common practice (no source): a PPV needs a velocity; amplitudes of unknown unit cannot be assessed
    path = write_record(tmp_path, {"v": burst(3.0, 0.2, 20.0, 1.0, 10)})
    with pytest.raises(InputError) as caught:
        evaluate(path)
    assert caught.value.field == "Signal unit" and "no unit" in caught.value.problem


def test_a_displacement_record_is_refused(tmp_path: Path) -> None:
    # Common practice (no source): the guidelines are in velocity; a displacement is not differentiated here
    path = write_record(tmp_path, {"d [mm]": burst(3.0, 0.2, 20.0, 1.0, 10)})
    with pytest.raises(InputError, match="displacement"):
        evaluate(path)


def test_a_velocity_record_with_a_high_pass_is_refused(tmp_path: Path) -> None:
    # Common practice (no source): the high-pass belongs to integration; a velocity record has nothing to integrate
    path = write_record(tmp_path, {"v [mm/s]": burst(3.0, 0.2, 20.0, 1.0, 10)})
    with pytest.raises(InputError) as caught:
        evaluate(path, high_pass="1 Hz")
    assert caught.value.field == "High-pass corner"


@pytest.mark.parametrize("axes", ["x, x", "x, y, z, x", "x,,y"])
def test_bad_axis_lists_are_refused(tmp_path: Path, axes: str) -> None:
    # Common practice (no source): one to three distinct columns make a triaxial record
    path = write_record(tmp_path, {"x [mm/s]": np.zeros(100), "y [mm/s]": np.zeros(100), "z [mm/s]": np.zeros(100)})
    with pytest.raises(InputError) as caught:
        evaluate(path, axes=axes)
    assert caught.value.field == "Axis columns"


def run(capsys: pytest.CaptureFixture[str], *argv: str) -> tuple[int, str, str]:
    code = main(list(argv))
    captured = capsys.readouterr()
    return code, captured.out, captured.err


def test_command_line_refuses_bad_input_in_one_line(tmp_path: Path, capsys: pytest.CaptureFixture[str]) -> None:
    # Common practice (no source): bad input exits 2 with one line on stderr naming what to fix
    velocity = write_record(tmp_path, {"x [mm/s]": burst(3.0, 1.0, 20.0, 1.0, 10)}, name="vel.csv")
    bare = write_record(tmp_path, {"x": burst(3.0, 1.0, 20.0, 1.0, 10)}, name="bare.csv")
    acceleration = write_record(tmp_path, {"x [g]": burst(6.0, 0.01, 20.0, 1.0, 10, fs=FS)}, name="acc.csv")
    cases = [
        ((bare, "--guideline", "din-foundation-2"), "Signal unit"),
        ((velocity, "--guideline", "din-foundation-2", "--axes", "north"), "no signal column named 'north'"),
        ((acceleration, "--guideline", "bs7385-line-2"), "High-pass"),
    ]
    for argv, said in cases:
        code, out, err = run(capsys, "ppv", *argv)
        assert code == 2, argv
        assert out == "" and len(err.strip().splitlines()) == 1 and said in err, err
    # the third names both fields: the guideline chosen and the high-pass that would integrate the record
    code, _, err = run(capsys, "ppv", acceleration, "--guideline", "bs7385-line-2")
    assert "bs7385-line-2" in err and "acceleration" in err
    code, out, _ = run(capsys, "ppv", acceleration, "--guideline", "bs7385-line-2", "--high-pass", "1", "--json")
    assert code == 0 and "integrated" in out


def test_json_has_every_event_and_the_caution(capsys: pytest.CaptureFixture[str]) -> None:
    # Common practice (no source): every event leaves in the JSON, with the caution the issue asks for
    code, out, _ = run(capsys, "ppv", "demo:sheet_piling_demo.csv", "--guideline", "din-foundation-2",
                       "--threshold", "0.5 mm/s", "--quiet-gap", "3 s", "--json")
    data = json.loads(out)
    assert code == 0
    assert len(data["series"]["event_start"]["values"]) == data["results"]["events"]["value"] == 3
    assert data["series"]["event_ppv"]["unit"] == "m/s"
    assert "local authority" in data["caution"] and "licensed engineer" in data["caution"]


def test_demo_record_gives_back_its_invented_drives() -> None:
    # Oracle: the generator's invented parameters: two drives and a knock, each above 0.5 mm/s and 3 s apart;
    # the largest motion is on z (the largest share) while the hammer passes the ground's resonance
    result = PPV.evaluate(PPV.demo_texts())
    truth = SheetPiling()
    assert si(result, "events") == 3
    assert result.values["governing_axis"].si() == "z"
    assert 0.8 * truth.ground_frequency < si(result, "frequency_crossings_3") < 1.25 * truth.ground_frequency
    starts = result.series["event_start"]
    np.testing.assert_allclose(starts[:2], [d.start for d in truth.drives], atol=1.0)
    assert starts[2] == pytest.approx(truth.knock_time, abs=0.1)


def test_a_lower_spectral_frequency_is_said_with_the_ratio_it_would_give(tmp_path: Path) -> None:
    # Source: closed form: a 5 Hz sine with a downward 40 Hz half cycle of 3x its amplitude centred on its crest at
    # t = 2.05 s: the sum dips below zero for (pi - 2 asin(1/3)) / (2 pi 40 Hz) = 9.8 ms (a half cycle of about
    # 51 Hz) and peaks there, while a 1 s window about the peak is mostly the 5 Hz sine
    t = np.arange(int(4 * FS)) / FS
    start = 2.05 - 1 / 160.0
    pulse = np.where((t >= start) & (t < start + 1 / 80.0), -3.0 * np.sin(2 * np.pi * 40.0 * (t - start)), 0.0)
    path = write_record(tmp_path, {"v [mm/s]": np.sin(2 * np.pi * 5.0 * t) + pulse})
    result = evaluate(path, guideline="din-foundation-2")
    assert si(result, "frequency_crossings_1") == pytest.approx(51.0, rel=0.05)
    assert si(result, "frequency_spectrum_1") == pytest.approx(5.0, rel=0.05)
    # Source: DIN 4150-3:1999 Table 1 line 2: 5 mm/s at 5 Hz (confirmed in two reproductions)
    ppv = si(result, "ppv_1")
    said = [flag.text for flag in result.flags if flag.level == "caution" and "spectrum about the peak" in flag.text]
    assert said and f"{ppv / 5e-3:.3g}" in said[0]
