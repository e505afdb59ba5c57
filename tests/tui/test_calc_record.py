"""The calc record: names, atomic writing, every part, JSON without NaN."""

from __future__ import annotations

import json
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
