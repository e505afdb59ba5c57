"""The calc record: one check or the whole session as Markdown and JSON, written atomically.

Each record holds the project, job number, engineer and note, the date, the tool version, every
input as typed and in SI, every file read (as typed, bytes, SHA-256), the results with units, the
flags, the methods with their published sources, every curve (a thinned table in Markdown, in full
in JSON), each chart as drawn (ASCII), and the caution.
"""

from __future__ import annotations

import json
import math
import os
import time
from collections.abc import Mapping, Sequence
from dataclasses import dataclass
from pathlib import Path
from typing import Any

from fieldmode.calc import __version__
from fieldmode.calc.framework.result import Result
from fieldmode.calc.framework.spec import CheckSpec
from fieldmode.tui.evaluation import Outcome
from fieldmode.tui.files import write_all_atomic
from fieldmode.tui.present import flag_text, si_text, typed_si_text, value_text
from fieldmode.tui.record_curves import curves_markdown
from fieldmode.tui.session import PROJECT_FIELDS

PROJECT_LABELS = {"project": "Project", "job": "Job number", "engineer": "Engineer", "note": "Note"}
"""How each project field (fieldmode.tui.session.PROJECT_FIELDS) is named in the dialog and the record."""
MAX_PROJECT_TEXT = 200
"""Longest text of a project field (characters)."""


@dataclass(frozen=True)
class Entry:
    """One check in a record: its spec, its texts as typed, and what evaluating them gave."""

    spec: CheckSpec
    texts: dict[str, str]
    outcome: Outcome


def default_name(scope: str, when: time.struct_time | None = None) -> str:
    """Suggested file name in the current folder, e.g. 'fieldmode-sdof-2026-05-04.md'."""
    return f"fieldmode-{scope}-{time.strftime('%Y-%m-%d', when or time.localtime())}.md"


def record_target(text: str) -> Path:
    """The path a typed record name stands for ('~' expanded); ValueError for a name that is a folder
    ('.', '..', '/', '~', 'notes/'), which would otherwise write '..md' or '$HOME.md' one folder up."""
    expanded = os.path.expanduser(text.strip())
    path = Path(expanded)
    if expanded.endswith(("/", os.sep)) or path.name in ("", ".", "..") or path.is_dir():
        raise ValueError(f"{text.strip()} is a folder: give a file name, e.g. {Path(expanded, 'record')}")
    return path


def record_paths(path: Path) -> tuple[Path, Path]:
    """The Markdown and JSON files written for ``path`` (same stem, .md and .json)."""
    stem = path.with_suffix("") if path.suffix.lower() in (".md", ".json") else path
    return stem.with_name(stem.name + ".md"), stem.with_name(stem.name + ".json")


def _cell(text: object) -> str:
    return str(text).replace("|", "\\|").replace("\n", " ")


def _project(project: Mapping[str, str] | None) -> dict[str, str]:
    """The four project fields, each a one-line text ('' when not given)."""
    given = project or {}
    return {name: " ".join(given.get(name, "").split()) for name in PROJECT_FIELDS}


def markdown(entries: Sequence[Entry], system: str, when: time.struct_time,
             project: Mapping[str, str] | None = None) -> str:
    """The record as Markdown."""
    cautions = list(dict.fromkeys(entry.spec.caution for entry in entries))
    lines = ["# fieldmode calc record", "",
             *(f"- {PROJECT_LABELS[name]}: {text or '(not given)'}" for name, text in _project(project).items()),
             f"- Date: {time.strftime('%Y-%m-%d %H:%M %z', when)}",
             f"- Tool: fieldmode {__version__}",
             f"- Results shown in: {'SI' if system == 'si' else 'US customary'} (JSON file: SI)",
             *(f"- Caution: {caution}" for caution in cautions), ""]
    for entry in entries:
        lines += _check_markdown(entry)
    return "\n".join(lines).rstrip() + "\n"


def _check_markdown(entry: Entry) -> list[str]:
    spec, outcome, result = entry.spec, entry.outcome, entry.outcome.result
    lines = [f"## {spec.title} ({spec.id})", "", spec.summary, "", "### Inputs", "",
             "| Input | As typed | SI | Read as |", "| --- | --- | --- | --- |"]
    inputs = result.inputs if result is not None else {}
    for spec_field in spec.fields:
        typed = entry.texts.get(spec_field.name, "")
        if not typed.strip():
            continue
        read = inputs.get(spec_field.name)
        si = typed_si_text(read.value, read.unit) if read is not None else ""
        read_as = outcome.errors.get(spec_field.name) or outcome.notes.get(spec_field.name, "")
        lines.append(f"| {_cell(spec_field.label_with_unit)} | {_cell(typed)} | {_cell(si)} | {_cell(read_as)} |")
    lines.append("")
    if result is not None and result.files:
        lines += ["### Files read", "", "| File (as typed) | Bytes | SHA-256 |", "| --- | --- | --- |",
                  *(f"| {_cell(file.path)} | {file.size} | {file.sha256} |" for file in result.files), ""]
    if result is None:
        problems = [f"- {spec.field(name).label}: {text}" for name, text in outcome.errors.items()]
        return lines + ["### Not computed", "", *problems, *([f"- {outcome.problem}"] if outcome.problem else []), ""]
    lines += ["### Results", "", "| Result | Value | SI |", "| --- | --- | --- |"]
    for value in result.values.values():
        lines.append(f"| {_cell(value.label)} | {_cell(value_text(value, outcome.system))} | {_cell(si_text(value))} |")
    lines += ["", "### Flags", ""]
    lines += [f"- {flag_text(flag)}" for flag in result.flags] or ["- none"]
    lines += ["", "### Method and sources", ""]
    lines += [f"- {ref.method}: {ref.source}" for ref in result.references] or ["- none stated"]
    lines.append("")
    curves = curves_markdown(spec, result, outcome.system)
    if curves:
        lines += ["### Curves", "", *curves]
    lines += _charts(spec.id, result, outcome.system)
    return lines + [f"Caution: {result.caution}", ""]


def _charts(check_id: str, result: Result, system: str) -> list[str]:
    """Each chart panel as drawn, ASCII in a fenced block ([] for a check without a chart)."""
    from fieldmode.tui.charts import panels_of
    from fieldmode.tui.charts.plain import panel_text

    draws = panels_of(check_id)
    lines = ["### Charts", ""] if draws else []
    for number, draw in enumerate(draws, start=1):
        try:
            drawn = panel_text(draw, result, system)
        except Exception as error:  # written into the record, as the app shows it: never hidden
            drawn = f"chart could not be drawn: {type(error).__name__}: {error}"
        lines += [f"Chart {number} of {len(draws)}:", "", "```text", drawn, "```", ""]
    return lines


def _finite(data: Any) -> Any:
    """JSON-safe copy: NaN and infinities become null."""
    if isinstance(data, float):
        return data if math.isfinite(data) else None
    if isinstance(data, dict):
        return {key: _finite(value) for key, value in data.items()}
    if isinstance(data, list | tuple):
        return [_finite(value) for value in data]
    return data


def as_json(entries: Sequence[Entry], when: time.struct_time,
            project: Mapping[str, str] | None = None) -> dict[str, Any]:
    """The record as a JSON object: the project fields; per check its values and curves in SI, exactly as
    ``--json`` gives them (Result.to_dict), or the texts and errors if not computed."""
    checks: list[dict[str, Any]] = []
    for entry in entries:
        result = entry.outcome.result
        if result is not None:
            checks.append({"title": entry.spec.title, **result.to_dict()})
        else:
            checks.append({"check": entry.spec.id, "title": entry.spec.title,
                           "inputs": {name: {"text": text} for name, text in entry.texts.items() if text.strip()},
                           "errors": dict(entry.outcome.errors), "problem": entry.outcome.problem or None,
                           "caution": entry.spec.caution})
    return _finite({"record": "fieldmode calc record", "version": __version__,
                    "date": time.strftime("%Y-%m-%dT%H:%M:%S%z", when), "project": _project(project),
                    "checks": checks})


def write_record(path: Path, entries: Sequence[Entry], system: str,
                 project: Mapping[str, str] | None = None) -> tuple[Path, Path]:
    """Write the Markdown and JSON files for ``path``, both or neither; raise OSError naming the file that
    could not be written."""
    when = time.localtime()
    md_path, json_path = record_paths(path)
    record = json.dumps(as_json(entries, when, project), indent=1, allow_nan=False, ensure_ascii=False) + "\n"
    write_all_atomic({md_path: markdown(entries, system, when, project), json_path: record})
    return md_path, json_path
