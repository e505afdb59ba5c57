"""The calc record: one check or the whole session as Markdown and JSON, written atomically.

Each record holds the date, the tool version, every input as typed and in SI, the
results with units, the flags, the methods with their published sources, and the caution.
"""

from __future__ import annotations

import json
import math
import time
from collections.abc import Sequence
from dataclasses import dataclass
from pathlib import Path
from typing import Any

from fieldmode.calc import __version__
from fieldmode.calc.framework.spec import CheckSpec
from fieldmode.tui.evaluation import Outcome
from fieldmode.tui.files import write_all_atomic
from fieldmode.tui.present import flag_text, si_text, typed_si_text, value_text


@dataclass(frozen=True)
class Entry:
    """One check in a record: its spec, its texts as typed, and what evaluating them gave."""

    spec: CheckSpec
    texts: dict[str, str]
    outcome: Outcome


def default_name(scope: str, when: time.struct_time | None = None) -> str:
    """Suggested file name in the current folder, e.g. 'fieldmode-sdof-2026-05-04.md'."""
    return f"fieldmode-{scope}-{time.strftime('%Y-%m-%d', when or time.localtime())}.md"


def record_paths(path: Path) -> tuple[Path, Path]:
    """The Markdown and JSON files written for ``path`` (same stem, .md and .json)."""
    stem = path.with_suffix("") if path.suffix.lower() in (".md", ".json") else path
    return stem.with_name(stem.name + ".md"), stem.with_name(stem.name + ".json")


def _cell(text: object) -> str:
    return str(text).replace("|", "\\|").replace("\n", " ")


def markdown(entries: Sequence[Entry], system: str, when: time.struct_time) -> str:
    """The record as Markdown."""
    cautions = list(dict.fromkeys(entry.spec.caution for entry in entries))
    lines = ["# fieldmode calc record", "",
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
    return lines + ["", f"Caution: {result.caution}", ""]


def _finite(data: Any) -> Any:
    """JSON-safe copy: NaN and infinities become null."""
    if isinstance(data, float):
        return data if math.isfinite(data) else None
    if isinstance(data, dict):
        return {key: _finite(value) for key, value in data.items()}
    if isinstance(data, list | tuple):
        return [_finite(value) for value in data]
    return data


def as_json(entries: Sequence[Entry], when: time.struct_time) -> dict[str, Any]:
    """The record as a JSON object: SI values (Result.to_dict), or the texts and errors if not computed."""
    checks: list[dict[str, Any]] = []
    for entry in entries:
        if entry.outcome.result is not None:
            checks.append({"title": entry.spec.title, **entry.outcome.result.to_dict()})
        else:
            checks.append({"check": entry.spec.id, "title": entry.spec.title,
                           "inputs": {name: {"text": text} for name, text in entry.texts.items() if text.strip()},
                           "errors": dict(entry.outcome.errors), "problem": entry.outcome.problem or None,
                           "caution": entry.spec.caution})
    return _finite({"record": "fieldmode calc record", "version": __version__,
                    "date": time.strftime("%Y-%m-%dT%H:%M:%S%z", when), "checks": checks})


def write_record(path: Path, entries: Sequence[Entry], system: str) -> tuple[Path, Path]:
    """Write the Markdown and JSON files for ``path``, both or neither; raise OSError naming the file that
    could not be written."""
    when = time.localtime()
    md_path, json_path = record_paths(path)
    record = json.dumps(as_json(entries, when), indent=1, allow_nan=False, ensure_ascii=False) + "\n"
    write_all_atomic({md_path: markdown(entries, system, when), json_path: record})
    return md_path, json_path
