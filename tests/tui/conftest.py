"""An app factory that keeps the session in a temporary folder, and key-only helpers."""

from __future__ import annotations

from collections.abc import Callable
from pathlib import Path

import pytest

from fieldmode.tui.app import FieldmodeApp


@pytest.fixture
def state(tmp_path: Path) -> Path:
    return tmp_path / "state"


@pytest.fixture
def make_app(state: Path, tmp_path: Path, monkeypatch: pytest.MonkeyPatch) -> Callable[..., FieldmodeApp]:
    """FieldmodeApp with its session folder in tmp and the current folder in tmp (records go there)."""
    work = tmp_path / "work"
    work.mkdir()
    monkeypatch.chdir(work)

    def factory(**kwargs: object) -> FieldmodeApp:
        kwargs.setdefault("state_folder", state)
        kwargs.setdefault("ascii_borders", False)
        return FieldmodeApp(**kwargs)  # type: ignore[arg-type]

    return factory
