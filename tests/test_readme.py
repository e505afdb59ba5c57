"""README.md keeps up with the program: its keys, its code fences, and every `$ fieldmode` example it shows."""

from __future__ import annotations

import re
import shlex
from dataclasses import dataclass
from pathlib import Path

import pytest

from fieldmode.tui.cli import main

ROOT = Path(__file__).resolve().parents[1]
DOCS = ROOT / "docs"
README = ROOT / "README.md"
FENCE = re.compile(r"^\s*```")


@dataclass(frozen=True)
class Example:
    """One `$ fieldmode` line of a README code block and the output lines shown under it."""

    line: int
    argv: tuple[str, ...]
    shown: tuple[str, ...]


def code_blocks(text: str) -> list[tuple[int, list[str]]]:
    """The README's fenced code blocks as (line number of the first line, lines); fences must pair up."""
    blocks: list[tuple[int, list[str]]] = []
    current: list[str] | None = None
    start = 0
    for number, line in enumerate(text.splitlines(), 1):
        if FENCE.match(line):
            if current is None:
                current, start = [], number + 1
            else:
                blocks.append((start, current))
                current = None
        elif current is not None:
            current.append(line)
    assert current is None, f"README.md: the code block opened before line {start} is never closed"
    return blocks


def examples(text: str) -> list[Example]:
    """Every `$ fieldmode` line (a trailing backslash continues it) with the lines shown under it."""
    found: list[Example] = []
    for start, lines in code_blocks(text):
        index = 0
        while index < len(lines):
            if not lines[index].startswith("$ fieldmode"):
                index += 1
                continue
            first, command = start + index, lines[index][2:]
            while command.endswith("\\"):
                index += 1
                command = command[:-1] + " " + lines[index].strip()
            index += 1
            shown = []
            while index < len(lines) and not lines[index].startswith("$"):
                if lines[index].strip() and lines[index].strip() != "...":
                    shown.append(lines[index].strip())
                index += 1
            found.append(Example(first, tuple(shlex.split(command)[1:]), tuple(shown)))
    return found


EXAMPLES = examples(README.read_text(encoding="utf-8"))


def test_readme_lists_every_key_of_the_app():
    from fieldmode.tui.app import FieldmodeApp

    readme = README.read_text()
    assert "docs/screenshot.svg" in readme
    names = {"pagedown": "PageDown", "pageup": "PageUp", "ctrl+q": "Ctrl+Q", "ctrl+o": "Ctrl+O", "ctrl+t": "Ctrl+T"}
    for binding in FieldmodeApp.BINDINGS:
        for key in binding.key.split(","):
            assert names.get(key, key.upper()) in readme, key


def test_readme_has_examples_of_every_check_and_of_csv():
    from fieldmode.calc.checks import CHECK_IDS

    commands = [" ".join(example.argv) for example in EXAMPLES]
    for check_id in CHECK_IDS:
        assert any(command.startswith(check_id + " ") for command in commands), check_id
    assert any("--csv -" in command for command in commands)
    assert any(command.startswith("spectrum ") and "--periods" in command and "--json" not in command
               for command in commands)


@pytest.mark.parametrize("example", EXAMPLES, ids=lambda example: f"line{example.line}")
def test_readme_example_runs_and_prints_what_it_shows(example: Example, capsys: pytest.CaptureFixture[str],
                                                      monkeypatch: pytest.MonkeyPatch) -> None:
    monkeypatch.chdir(ROOT)
    status = main(list(example.argv))
    captured = capsys.readouterr()
    assert status == 0, f"README.md line {example.line}: exit {status}: {captured.err}"
    output = iter(line.strip() for line in (captured.out + captured.err).splitlines())
    for shown in example.shown:
        assert any(line == shown for line in output), (
            f"README.md line {example.line}: {shown!r} is not in the output (in this order):\n{captured.out}")
