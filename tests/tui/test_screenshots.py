"""The README screenshots are drawn by the app itself (docs/screenshots.py, run by `make docs`)."""

from __future__ import annotations

import asyncio
import runpy
from pathlib import Path

from fieldmode.calc.checks import BY_ID

SCRIPT = Path(__file__).resolve().parents[2] / "docs" / "screenshots.py"


def test_screenshots_show_a_check_with_its_flags_chart_and_caution(tmp_path: Path) -> None:
    screenshots = runpy.run_path(str(SCRIPT))
    shown = screenshots["busiest_check"]()
    results, chart = asyncio.run(screenshots["capture"](tmp_path / "docs", tmp_path / "state"))
    title = BY_ID[shown].title.replace(" ", "&#160;")
    for svg in (results.read_text(), chart.read_text()):
        assert "<svg" in svg and "Caution:" in svg and title in svg
    assert "WARNING" in results.read_text()
    assert "chart&#160;1" in chart.read_text()
