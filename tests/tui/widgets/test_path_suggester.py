"""File path completion in path fields."""

from __future__ import annotations

from fieldmode.tui.widgets.path_suggester import suggest_path


def test_path_completion(tmp_path, monkeypatch):
    (tmp_path / "decay-01.csv").write_text("t,a\n")
    (tmp_path / "data").mkdir()
    monkeypatch.chdir(tmp_path)
    assert suggest_path("dec") == "decay-01.csv"
    assert suggest_path("da") == "data/"
    assert suggest_path(str(tmp_path) + "/dec") == str(tmp_path / "decay-01.csv")
    assert suggest_path("zzz") is None and suggest_path("") is None
