"""The `period`, `design-spectrum` and `spectrum` checks: results, flags, bad input, any text."""

from __future__ import annotations

import contextlib
import math
from pathlib import Path

import numpy as np
import pytest
from hypothesis import HealthCheck, given, settings
from hypothesis import strategies as st

from fieldmode.calc.checks import BY_ID
from fieldmode.calc.framework.result import SEISMIC_CAUTION
from fieldmode.calc.framework.units import InputError
from fieldmode.calc.physics import spectrum as core
from fieldmode.calc.records import accelerogram

G0 = 9.80665  # Source: NIST SP 811 (2008), standard gravity

PERIOD = BY_ID["period"]
DESIGN = BY_ID["design-spectrum"]
SPECTRUM = BY_ID["spectrum"]


def si(result, name: str) -> float:  # type: ignore[no-untyped-def]
    return float(result.values[name].si())


def test_period_both_codes_side_by_side() -> None:
    result = PERIOD.evaluate({"height": "11.5 m", "system": "steel-moment-frame"})
    # Source: EN 1998-1:2004 4.3.3.2.2(3): 0.085 x 11.5^0.75
    assert si(result, "period") == pytest.approx(0.085 * 11.5**0.75)
    # Source: ASCE 7-16 12.8.2.1, Table 12.8-2: 0.028 x (11.5 / 0.3048 ft)^0.8
    assert si(result, "period_asce") == pytest.approx(0.028 * (11.5 / 0.3048) ** 0.8, rel=2e-3)
    assert result.caution == SEISMIC_CAUTION
    assert PERIOD.sends == {"period": "period"}


def test_period_in_feet_and_height_limit() -> None:
    result = PERIOD.evaluate({"height": "150 ft", "system": "other"})
    # Source: EN 1998-1:2004 4.3.3.2.2(3): Ct 0.050, H in m; formula for H <= 40 m
    assert si(result, "period") == pytest.approx(0.05 * (150 * 0.3048) ** 0.75)
    assert any("40 m" in flag.text and flag.level == "caution" for flag in result.flags)


def test_design_spectrum_demo() -> None:
    result = DESIGN.evaluate(DESIGN.demo_texts())
    ag = 0.16 * G0
    # Source: EN 1998-1:2004 3.2.2.2, eq. 3.3, Table 3.2 ground C: plateau ag S eta 2.5 (TB <= 0.53 s <= TC)
    se = ag * 1.15 * 2.5
    assert si(result, "spectral_acceleration") == pytest.approx(se)
    assert result.values["branch"].magnitude == "constant acceleration"
    # Source: EN 1998-1:2004 3.2.2.4, eq. 3.7
    assert si(result, "spectral_displacement") == pytest.approx(se * (0.53 / (2 * math.pi)) ** 2)
    # Source: EN 1998-1:2004 3.2.2.5, eq. 3.14 with q = 4
    assert si(result, "design_spectral_acceleration") == pytest.approx(ag * 1.15 * 2.5 / 4)
    assert si(result, "base_shear") == pytest.approx(850e3 * se)
    assert result.values["parameter_set"].magnitude == "Table 3.2"
    assert any("S 1.15, TB 0.2 s, TC 0.6 s, TD 2 s" in flag.text for flag in result.flags)
    assert result.caution == SEISMIC_CAUTION
    assert set(result.series) >= {"period", "spectral_acceleration", "design_spectral_acceleration"}


def test_design_spectrum_overrides_and_units() -> None:
    texts = {"ground_type": "B", "spectrum_type": "2", "design_ground_acceleration": "2.0 m/s^2",
             "importance": "1.2", "damping": "10 %", "period": "0.8 s", "soil_factor": "1.3",
             "corner_period_tc": "0.3 s"}
    result = DESIGN.evaluate(texts)
    eta = math.sqrt(10 / 15)  # Source: EN 1998-1:2004 3.2.2.2(3), eq. 3.6
    # Source: EN 1998-1:2004 3.2.2.2, eq. 3.4; Table 3.3 ground B TD 1.2 s; ag = gamma_I agR (3.2.1(3))
    assert si(result, "spectral_acceleration") == pytest.approx(2.4 * 1.3 * eta * 2.5 * 0.3 / 0.8)
    assert result.values["branch"].magnitude == "constant velocity"
    assert result.values["parameter_set"].magnitude == "user S, TC"


@pytest.mark.parametrize(("texts", "field"), [
    ({"ground_type": "F"}, "Ground type"),
    ({"design_ground_acceleration": "0.16 kg"}, "Ground acceleration agR"),
    ({"design_ground_acceleration": "-0.1 g"}, "Ground acceleration agR"),
    ({"period": "-1 s"}, "Period"),
    ({"period": "12 s"}, "Period"),
    ({"damping": "150 %"}, "Damping ratio"),
    ({"behaviour_factor": "0.5"}, "Behaviour factor q"),
    ({"corner_period_tc": "0.1 s"}, "Corner period TC"),
    ({"corner_period_td": "0.5 s"}, "Corner period TD"),
    ({"mass": "0 t"}, "Mass (base shear)"),
])
def test_design_spectrum_bad_input(texts: dict[str, str], field: str) -> None:
    with pytest.raises(InputError) as error:
        DESIGN.evaluate({**DESIGN.demo_texts(), **texts})
    assert error.value.field == field


def write_record(path: Path, acc_g: np.ndarray, dt: float, header: str = "t,acc") -> Path:
    lines = [header] + [f"{i * dt:.4f},{a:.7f}" for i, a in enumerate(acc_g)]
    path.write_text("\n".join(lines) + "\n", encoding="utf-8")
    return path


def test_spectrum_check_matches_core(tmp_path: Path) -> None:
    dt = 0.01
    rng = np.random.default_rng(2)
    acc_g = 0.1 * rng.standard_normal(800)
    path = write_record(tmp_path / "motion.csv", acc_g, dt)
    result = SPECTRUM.evaluate({"file": str(path), "signal_unit": "g", "period": "0.5 s", "damping": "3 %"})
    corrected = accelerogram.baseline_corrected(np.round(acc_g, 7) * G0, dt)
    single = core.response_spectrum(corrected, dt, np.array([0.5]), 0.03)
    assert si(result, "psa") == pytest.approx(float(single.psa[0]), rel=1e-9)
    assert si(result, "pga") == pytest.approx(np.abs(corrected).max(), rel=1e-9)
    assert len(result.series["period"]) == 200
    assert set(result.series) >= {"period", "sd", "sv", "psv", "psa", "total_acceleration",
                                  "response_displacement"}
    # Source: definition of pseudo-spectral values: psa = omega^2 sd, psv = omega sd
    omega = 2 * math.pi / 0.5
    assert si(result, "psa") == pytest.approx(omega**2 * si(result, "sd"))
    assert si(result, "psv") == pytest.approx(omega * si(result, "sd"))
    assert result.caution == SEISMIC_CAUTION
    assert "design_psa" not in result.series


def test_spectrum_demo_with_overlay() -> None:
    result = SPECTRUM.evaluate(SPECTRUM.demo_texts())
    assert Path(SPECTRUM.field("file").default).is_file()
    assert si(result, "pga") == pytest.approx(0.18 * G0, rel=0.01)
    # Source: EN 1998-1:2004 3.2.2.2, eq. 3.3, Table 3.2 ground C at 0.53 s
    assert si(result, "design_spectral_acceleration") == pytest.approx(0.16 * G0 * 1.15 * 2.5)
    assert "design_psa" in result.series
    assert any("sub-steps" in flag.text for flag in result.flags)


def test_spectrum_period_list_and_grid(tmp_path: Path) -> None:
    path = write_record(tmp_path / "m.csv", 0.05 * np.sin(np.arange(500) * 0.3), 0.02)
    listed = SPECTRUM.evaluate({"file": str(path), "signal_unit": "m/s^2", "periods": "1, 0.2, 0.5 s"})
    assert listed.series["period"].tolist() == [0.2, 0.5, 1.0]
    grid = SPECTRUM.evaluate({"file": str(path), "signal_unit": "g", "shortest_period": "0.1 s",
                              "longest_period": "2 s", "period_count": "15"})
    assert len(grid.series["period"]) == 15


@pytest.mark.parametrize(("texts", "field"), [
    ({"periods": "0.5 s", "period_count": "20"}, "Number of periods"),
    ({"shortest_period": "2 s", "longest_period": "1 s"}, "Longest period"),
    ({"periods": "0.0001 s, 0.2 s"}, "Periods"),
    ({"period": "0 s"}, "Period to mark"),
    ({"damping": "95 %"}, "Damping ratio"),
    ({"signal_unit": "furlongs"}, "Signal unit"),
    ({"design_ground_acceleration": "0.2 g", "ground_type": ""}, "Ground type"),
    ({"period_count": "1"}, "Number of periods"),
])
def test_spectrum_bad_input(tmp_path: Path, texts: dict[str, str], field: str) -> None:
    path = write_record(tmp_path / "m.csv", 0.05 * np.sin(np.arange(500) * 0.3), 0.02)
    with pytest.raises(InputError) as error:
        SPECTRUM.evaluate({"file": str(path), "signal_unit": "g", **texts})
    assert error.value.field == field


@pytest.mark.parametrize("content", [b"", b"\x00\x01\x02binary", b"t,a\n0,1\n1,2\n", b"t,a\nx,y\n"])
def test_spectrum_bad_files(tmp_path: Path, content: bytes) -> None:
    path = tmp_path / "bad.csv"
    path.write_bytes(content)
    with pytest.raises(InputError):
        SPECTRUM.evaluate({"file": str(path), "signal_unit": "g"})


def test_spectrum_work_limit(tmp_path: Path) -> None:
    path = write_record(tmp_path / "long.csv", 0.05 * np.sin(np.arange(20_000) * 0.3), 0.02)
    with pytest.raises(InputError) as error:
        SPECTRUM.evaluate({"file": str(path), "signal_unit": "g", "shortest_period": "0.001 s",
                           "period_count": "500"})
    assert error.value.field == "Shortest period"


def test_spectrum_missing_file(tmp_path: Path) -> None:
    with pytest.raises(InputError):
        SPECTRUM.evaluate({"file": str(tmp_path / "nowhere.csv"), "signal_unit": "g"})


TEXT = st.one_of(st.text(max_size=80), st.sampled_from(["", "0", "-1", "nan", "inf", "1e308", "1e400 m", "5",
                                                        "9**9**9", "0.2 g", "3 %", "A", "2", "1,2,3"]))


@settings(max_examples=60, deadline=None, suppress_health_check=[HealthCheck.function_scoped_fixture])
@given(field=st.sampled_from([f.name for f in DESIGN.fields]), text=TEXT)
def test_design_spectrum_any_text(field: str, text: str) -> None:
    with contextlib.suppress(InputError):
        DESIGN.evaluate({**DESIGN.demo_texts(), field: text})


@settings(max_examples=60, deadline=None)
@given(field=st.sampled_from([f.name for f in PERIOD.fields]), text=TEXT)
def test_period_any_text(field: str, text: str) -> None:
    with contextlib.suppress(InputError):
        PERIOD.evaluate({**PERIOD.demo_texts(), field: text})


@settings(max_examples=60, deadline=None)
@given(field=st.sampled_from([f.name for f in SPECTRUM.fields if f.name != "file"]), text=TEXT)
def test_spectrum_any_text(field: str, text: str) -> None:
    texts = {**SPECTRUM.demo_texts(), "shortest_period": "0.2 s", "period_count": "20", field: text}
    with contextlib.suppress(InputError):
        SPECTRUM.evaluate(texts)


def test_spectrum_signal_unit_from_header_or_asked(tmp_path: Path) -> None:
    demo = SPECTRUM.evaluate({"file": SPECTRUM.field("file").default, "period_count": "20"})
    # the demo file's header says "[g]": read as g without --signal-unit
    assert si(demo, "pga") == pytest.approx(0.18 * G0, rel=0.01)
    bare = write_record(tmp_path / "bare.csv", 0.05 * np.sin(np.arange(500) * 0.3), 0.02)
    with pytest.raises(InputError) as error:
        SPECTRUM.evaluate({"file": str(bare), "period_count": "20"})
    assert error.value.field == "Signal unit"
    velocity = write_record(tmp_path / "v.csv", 0.05 * np.sin(np.arange(500) * 0.3), 0.02, "t,v [mm/s]")
    with pytest.raises(InputError):
        SPECTRUM.evaluate({"file": str(velocity), "period_count": "20"})


def test_default_grid_matches_the_core() -> None:
    from fieldmode.calc.checks.spectrum import DEFAULT_GRID

    assert DEFAULT_GRID == core.DEFAULT_GRID
