"""The chart view (F6) cycles through the panels and back.

That every panel shows its title and axis labels in full at 80x24 is checked for every check by
tests/tui/test_layout.py (check_charts)."""

from __future__ import annotations

import asyncio

from helpers.pilot import screen_text, settle

from fieldmode.calc.checks import SPECS

SIZE = (80, 24)


def test_chart_key_cycles_panels_and_back_to_results(make_app):
    async def scenario():
        app = make_app()
        async with app.run_test(size=SIZE) as pilot:
            for _ in SPECS:
                view = await settle(app, pilot)
                from fieldmode.tui.charts import panels_of

                panels = len(panels_of(view.spec.id)) or 1
                for panel in range(panels):
                    await pilot.press("f6")
                    await settle(app, pilot)
                    assert f"chart {panel + 1}" in screen_text(app)
                    assert "could not be drawn" not in screen_text(app)
                await pilot.press("f6")
                await pilot.pause()
                assert "| results" in screen_text(app)
                await pilot.press("f3")

    asyncio.run(scenario())
