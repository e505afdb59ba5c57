"""The calc record: names, atomic writing, every part, JSON without NaN."""

from __future__ import annotations

import hashlib
import json
import re
import time

import pytest

from fieldmode.calc.checks import sdof
from fieldmode.tui.calc_record import Entry, as_json, default_name, markdown, record_paths, write_record
from fieldmode.tui.evaluation import evaluate


def test_record_paths_and_names():
    assert [p.name for p in record_paths(__import__("pathlib").Path("a/b.md"))] == ["b.md", "b.json"]
    assert [p.name for p in record_paths(__import__("pathlib").Path("minutes"))] == ["minutes.md", "minutes.json"]
    assert default_name("sdof", time.strptime("2026-05-04", "%Y-%m-%d")) == "fieldmode-sdof-2026-05-04.md"


def test_record_written_atomically_with_every_part(tmp_path):
    texts = sdof.SPEC.demo_texts()
    entries = [Entry(sdof.SPEC, texts, evaluate(sdof.SPEC, texts, "us"))]
    md_path, json_path = write_record(tmp_path / "rec.md", entries, "us")
    text = md_path.read_text()
    for part in ("- Date: ", "- Tool: fieldmode", "### Inputs", "### Results", "### Flags",
                 "### Method and sources", "Caution: " + sdof.SPEC.caution, "kip/in", "| Stiffness (kN/mm) | 42 kN/mm"):
        assert part in text
    data = json.loads(json_path.read_text())
    assert data["checks"][0]["results"]["stiffness"] == {"value": pytest.approx(42e6), "unit": "N/m"}


def test_record_json_has_no_nan():
    texts = sdof.SPEC.demo_texts()
    outcome = evaluate(sdof.SPEC, texts, "si")
    data = as_json([Entry(sdof.SPEC, texts, outcome)], time.localtime())
    json.dumps(data, allow_nan=False)
    assert markdown([Entry(sdof.SPEC, texts, outcome)], "si", time.localtime()).startswith("# fieldmode calc record")


def _fenced(text: str) -> list[str]:
    """The contents of every ```text block."""
    return re.findall(r"^```text\n(.*?)\n```$", text, flags=re.MULTILINE | re.DOTALL)


@pytest.mark.parametrize("system", ["si", "us"])
def test_decay_record_has_file_digest_curves_and_ascii_charts(tmp_path, system):
    from fieldmode.calc.checks import decay
    from fieldmode.calc.demo import HEEL_DROP, demo_file
    from fieldmode.tui.charts import panels_of
    from fieldmode.tui.charts.plain import RECORD_SIZE
    from fieldmode.tui.record_curves import MAX_ROWS

    texts = decay.SPEC.demo_texts()
    outcome = evaluate(decay.SPEC, texts, system)
    project = {"project": "Lowmoor mezzanine", "job": "J-104", "engineer": "A. Nother", "note": ""}
    md_path, json_path = write_record(tmp_path / "decay.md", [Entry(decay.SPEC, texts, outcome)], system, project)
    text = md_path.read_text()
    content = demo_file(HEEL_DROP).read_bytes()
    # Oracle: hashlib.sha256 of the shipped file the short name stands for
    assert f"| demo:heel_drop_demo.csv | {len(content)} | {hashlib.sha256(content).hexdigest()} |" in text
    assert "- Project: Lowmoor mezzanine\n- Job number: J-104\n- Engineer: A. Nother\n- Note: (not given)\n" in text
    curves = text[text.index("### Curves"):text.index("### Charts")]
    rows = [line for line in curves.splitlines() if line.startswith("| ") and not line.startswith("| ---")]
    assert rows and curves.count("#### ") == 5
    for table in curves.split("#### ")[1:]:
        body = [line for line in table.splitlines() if line.startswith("| ")][2:]
        assert 1 <= len(body) <= MAX_ROWS
    charts = _fenced(text)
    assert len(charts) == len(panels_of("decay"))
    for chart in charts:
        lines = chart.splitlines()
        assert chart.isascii() and len(lines) <= RECORD_SIZE[1] and max(map(len, lines)) <= RECORD_SIZE[0]
    assert text.index("### Curves") < text.index("### Charts") < text.rindex("Caution: " + decay.SPEC.caution)
    data = json.loads(json_path.read_text())
    assert data["project"] == project
    series = data["checks"][0]["series"]
    result = outcome.result
    assert set(series) == set(result.series)
    for name, values in result.series.items():
        assert series[name]["values"] == pytest.approx(values.tolist())  # every point, SI
    assert series["signal"]["unit"] == "m/s^2"


def test_check_without_curves_or_files_has_no_such_sections():
    from fieldmode.calc.checks import member

    texts = member.SPEC.demo_texts()
    entries = [Entry(member.SPEC, texts, evaluate(member.SPEC, texts, "si"))]
    text = markdown(entries, "si", time.localtime())
    assert "### Curves" not in text and "### Charts" not in text and "### Files read" not in text
    assert "- Project: (not given)" in text
    assert as_json(entries, time.localtime())["checks"][0]["series"] == {}


def test_a_chart_that_fails_is_said_in_the_record(monkeypatch):
    from fieldmode.tui import calc_record

    def broken(plt, result, system):
        raise ValueError("no such axis")

    monkeypatch.setattr("fieldmode.tui.charts.panels_of", lambda check_id: (broken,))
    texts = sdof.SPEC.demo_texts()
    lines = calc_record._charts("sdof", evaluate(sdof.SPEC, texts, "si").result, "si")
    assert "chart could not be drawn: ValueError: no such axis" in lines
