"""README.md keeps up with the program."""

from __future__ import annotations

from pathlib import Path

DOCS = Path(__file__).resolve().parents[1] / "docs"


def test_readme_lists_every_key_of_the_app():
    from fieldmode.tui.app import FieldmodeApp

    readme = (DOCS.parent / "README.md").read_text()
    assert "docs/screenshot.svg" in readme
    names = {"pagedown": "PageDown", "pageup": "PageUp", "ctrl+q": "Ctrl+Q", "ctrl+o": "Ctrl+O"}
    for binding in FieldmodeApp.BINDINGS:
        for key in binding.key.split(","):
            assert names.get(key, key.upper()) in readme, key
