"""Check `spectrum`: against the core, the overlay, grids, bad files and hostile text."""

from __future__ import annotations

import contextlib
import math
from pathlib import Path

import numpy as np
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from fieldmode.calc.checks import BY_ID
from fieldmode.calc.demo import GROUND_MOTION, demo_file, demo_path
from fieldmode.calc.framework.result import SEISMIC_CAUTION
from fieldmode.calc.framework.units import InputError
from fieldmode.calc.physics import spectrum as core
from fieldmode.calc.records import accelerogram

G0 = 9.80665  # Source: NIST SP 811 (2008), standard gravity


SPECTRUM = BY_ID["spectrum"]


def si(result, name: str) -> float:  # type: ignore[no-untyped-def]
    return float(result.values[name].si())


def write_record(path: Path, acc_g: np.ndarray, dt: float, header: str = "t,acc") -> Path:
    lines = [header] + [f"{i * dt:.4f},{a:.7f}" for i, a in enumerate(acc_g)]
    path.write_text("\n".join(lines) + "\n", encoding="utf-8")
    return path


TEXT = st.one_of(st.text(max_size=80), st.sampled_from(["", "0", "-1", "nan", "inf", "1e308", "1e400 m", "5",
                                                        "9**9**9", "0.2 g", "3 %", "A", "2", "1,2,3"]))


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
    assert SPECTRUM.field("file").default == "demo:ground_motion_demo.csv"
    assert demo_path(SPECTRUM.field("file").default) == demo_file(GROUND_MOTION)
    assert demo_file(GROUND_MOTION).is_file()
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


def test_default_grid_is_200_log_spaced_periods_from_20_ms_to_10_s() -> None:
    texts = {**SPECTRUM.demo_texts(), "shortest_period": "", "longest_period": "", "period_count": ""}
    periods = SPECTRUM.evaluate(texts).series["period"]
    # Common practice (no source): the documented default grid, 200 log-spaced periods 0.02-10 s
    np.testing.assert_allclose(periods, np.geomspace(0.02, 10.0, 200), rtol=1e-12)


def test_spectrum_names_the_file_it_read(tmp_path: Path) -> None:
    import hashlib

    path = write_record(tmp_path / "motion.csv", 0.05 * np.sin(np.arange(600) / 9.0), 0.01)
    result = SPECTRUM.evaluate({"file": str(path), "signal_unit": "g"})
    content = path.read_bytes()
    # Oracle: hashlib.sha256 and len() of the file's bytes
    assert result.to_dict()["files"] == [{"path": str(path), "bytes": len(content),
                                          "sha256": hashlib.sha256(content).hexdigest()}]
