"""Hostile field texts and record files against the command line's contract.

Whatever is typed or read, the command line ends with status 0 (an answer) or 2 (one line on stderr
saying what is wrong); never 1 (a fault), never a traceback, never a hang. A record file written
differently but holding the same numbers gives the same answer as the clean file.
"""

from __future__ import annotations

import contextlib
import json
import signal
from collections.abc import Iterator
from pathlib import Path

import numpy as np
import pytest
from hypothesis import HealthCheck, given, settings
from hypothesis import strategies as st

from fieldmode.calc.checks import SPECS
from fieldmode.tui.cli import main

CASE_SECONDS = 20
"""A case that takes longer than this is a hang."""
HOSTILE_TEXT = st.one_of(
    st.text(max_size=80),
    st.sampled_from(["", " ", "0", "-0", "-1", "nan", "inf", "-inf", "1e308", "1e400 m", "1e-320 kN/mm", "9**9**9",
                     "2^2^2 m", "5 %%", "30 deg", "1 turn", "−5 t", "5\u2009t", "5 tons", "12 kg kg", "((1)",
                     "\x1b[2J5 t", "5 t\x00", "٣ t", "１２ t", "1,450 rpm", "A/", "1/0 Hz", "e5", ".5.", "5e", "0x10"]),
    st.builds(lambda number, unit: f"{number} {unit}", st.floats(allow_nan=True, allow_infinity=True),
              st.sampled_from(["t", "kN/mm", "Hz", "rpm", "%", "g", "m/s^2", "mm", "s", "kip/in", "lb", "mil"])),
)


@contextlib.contextmanager
def bounded(seconds: int = CASE_SECONDS) -> Iterator[None]:
    """Fail a case that runs longer than ``seconds`` (a hang) instead of waiting for it."""
    def expired(signum: int, frame: object) -> None:
        raise TimeoutError(f"no answer within {seconds} s")

    previous = signal.signal(signal.SIGALRM, expired)
    signal.alarm(seconds)
    try:
        yield
    finally:
        signal.alarm(0)
        signal.signal(signal.SIGALRM, previous)


def run(capsys: pytest.CaptureFixture[str], *argv: str) -> tuple[int, str, str]:
    with bounded():
        status = main(list(argv))
    out, err = capsys.readouterr()
    return status, out, err


def assert_contract(status: int, err: str) -> None:
    # Common practice (no source): the documented exit statuses (DEVELOPERS.md, the command line)
    assert status in (0, 2), err
    assert "Traceback" not in err and "internal fault" not in err
    if status == 2:
        assert err.count("\n") == 1, err


FIELDS = [(spec, field) for spec in SPECS for field in spec.fields if field.kind != "path"]


@settings(max_examples=300, deadline=None, suppress_health_check=[HealthCheck.function_scoped_fixture])
@given(pair=st.sampled_from(FIELDS), text=HOSTILE_TEXT)
def test_any_text_in_any_field_answers_or_refuses_in_one_line(capsys, pair, text) -> None:
    spec, field = pair
    argv = [spec.id]
    for other in spec.fields:
        if other.positional and other.default:
            argv.append(other.default)
    status, _, err = run(capsys, *argv, field.option, text, "--json")
    assert_contract(status, err)


FS = 200.0
TIME = np.arange(1600) / FS
SIGNAL = np.exp(-2 * np.pi * 6.8 * 0.025 * TIME) * np.cos(2 * np.pi * 6.8 * np.sqrt(1 - 0.025**2) * TIME)
ROWS = [(f"{t:.4f}", f"{x:.6f}") for t, x in zip(TIME, SIGNAL, strict=True)]


def _write(path: Path, header: str, separator: str, decimal: str, end: str, comments: str, encoding: str) -> None:
    lines = [header.replace(",", separator)] if header else []
    lines += [separator.join(cell.replace(".", decimal) for cell in row) for row in ROWS]
    path.write_bytes((comments + end.join(lines) + end).encode(encoding))


LAYOUTS = st.builds(
    dict,
    header=st.sampled_from(["", "time,acc", "t [s],a [m/s^2]", "Time (ms),x"]),
    separator=st.sampled_from([",", ";", "\t", " ", "  "]),
    decimal=st.sampled_from([".", ","]),
    end=st.sampled_from(["\n", "\r\n"]),
    comments=st.sampled_from(["", "# logger 4\n# site: invented\n", "% exported\n\n", "// note\n"]),
    encoding=st.sampled_from(["utf-8", "utf-8-sig", "utf-16", "latin-1"]),
)


@settings(max_examples=40, deadline=None, suppress_health_check=[HealthCheck.function_scoped_fixture])
@given(layout=LAYOUTS)
def test_the_same_numbers_written_another_way_give_the_same_answer(tmp_path_factory, capsys, layout) -> None:
    if layout["separator"] == "," and layout["decimal"] == ",":
        layout = {**layout, "separator": ";"}  # a comma cannot be both
    path = tmp_path_factory.mktemp("layout") / "rec.csv"
    _write(path, **layout)
    status, out, err = run(capsys, "decay", str(path), "--json")
    assert status == 0, err
    results = json.loads(out)["results"]
    scale = 1e3 if "(ms)" in layout["header"] else 1.0  # the same numbers read as milliseconds
    # Oracle: the record is exp(-zeta w t) cos(w_d t): 6.8 Hz at 2.5 % (time read in ms: 1000 times the frequency)
    assert results["natural_frequency"]["value"] == pytest.approx(6.8 * scale, rel=0.01)
    assert results["damping_ratio"]["value"] == pytest.approx(0.025, rel=0.05)


DAMAGE = st.sampled_from([
    lambda b: b[: len(b) // 2],
    lambda b: b.replace(b"\n", b"\n\n", 7),
    lambda b: b[:500] + b"\x00\x01\x02" + b[500:],
    lambda b: b[:800] + b"nan,nan\n" + b[800:],
    lambda b: b[:800] + b"1.0000,abc\n" + b[800:],
    lambda b: b[:900] + b"0.0005,1.0\n" + b[900:],
    lambda b: b.replace(b",", b";", 50),
    lambda b: b"\xff\xfe" + b,
    lambda b: b"\n" * 3000 + b,
    lambda b: b.replace(b"\n", b"\r"),
    lambda b: b[:2000] + b"\x1b[2J" * 20 + b[2000:],
    lambda b: b"",
    lambda b: b"time,acc\n" + b"1,2\n" * 3,
])


@settings(max_examples=60, deadline=None, suppress_health_check=[HealthCheck.function_scoped_fixture])
@given(damage=DAMAGE, check=st.sampled_from(["decay", "spectrum", "occupants"]))
def test_a_damaged_record_is_answered_or_refused_in_one_line(tmp_path_factory, capsys, damage, check) -> None:
    path = tmp_path_factory.mktemp("damaged") / "rec.csv"
    _write(path, "time,acc [m/s^2]", ",", ".", "\n", "", "utf-8")
    path.write_bytes(damage(path.read_bytes()))
    status, _, err = run(capsys, check, str(path), "--json")
    assert_contract(status, err)
