"""The README's screenshot, regenerated from the app itself (never drawn by hand)."""

from __future__ import annotations

import asyncio
from pathlib import Path

from helpers.pilot import settle

from fieldmode.calc.checks import SPECS
from fieldmode.tui.evaluation import evaluate

DOCS = Path(__file__).resolve().parents[2] / "docs"


def _busiest_check() -> str:
    """The first check whose demo raises a warning (it shows flags), else the first check."""
    for spec in SPECS:
        result = evaluate(spec, spec.demo_texts(), "si").result
        if result is not None and any(flag.level == "warning" for flag in result.flags):
            return spec.id
    return SPECS[0].id


def test_screenshots_for_the_readme(make_app):
    shown = _busiest_check()

    async def scenario():
        app = make_app()
        async with app.run_test(size=(80, 24)) as pilot:
            while app.current_view.spec.id != shown:
                await pilot.press("f3")
            await settle(app, pilot)
            DOCS.mkdir(exist_ok=True)
            app.save_screenshot("screenshot.svg", str(DOCS))
            await pilot.press("f6")
            await settle(app, pilot)
            app.save_screenshot("screenshot-chart.svg", str(DOCS))

    asyncio.run(scenario())
    results = (DOCS / "screenshot.svg").read_text()
    chart = (DOCS / "screenshot-chart.svg").read_text()
    title = next(spec.title for spec in SPECS if spec.id == shown)
    for svg in (results, chart):
        assert "<svg" in svg and "Caution:" in svg and title.replace(" ", "&#160;") in svg
    assert "chart&#160;1" in chart


def test_readme_lists_every_key_of_the_app():
    from fieldmode.tui.app import FieldmodeApp

    readme = (DOCS.parent / "README.md").read_text()
    assert "docs/screenshot.svg" in readme
    names = {"pagedown": "PageDown", "pageup": "PageUp", "ctrl+q": "Ctrl+Q", "ctrl+o": "Ctrl+O"}
    for binding in FieldmodeApp.BINDINGS:
        for key in binding.key.split(","):
            assert names.get(key, key.upper()) in readme, key
