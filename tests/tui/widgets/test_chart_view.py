"""The chart view (F6) cycles through the panels and back."""

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


def _expected_words(draw, result, system: str) -> list[str]:  # noqa: ANN001
    """The title and axis labels a panel sets, found by drawing it once on a figure of its own."""
    from textual_plotext import Plot

    from fieldmode.tui.charts.common import ReadableAxes

    axes = ReadableAxes(Plot())
    draw.__wrapped__(axes, result, system)
    return [axes.titles[-1], axes.labels["x"], axes.labels["y"]]


def test_every_panel_shows_its_title_and_axis_labels_at_80x24(make_app):
    # Common practice (no source): a chart says what it shows and in which units; plotext drops a title wider
    # than the pane, so each title must fit the chart pane at 80x24
    from fieldmode.tui.charts import panels_of

    async def scenario():
        app = make_app()
        async with app.run_test(size=SIZE) as pilot:
            for _ in SPECS:
                view = await settle(app, pilot)
                draws = panels_of(view.spec.id)
                for draw in draws:
                    await pilot.press("f6")
                    await settle(app, pilot)
                    shown = screen_text(app)
                    for words in _expected_words(draw, view.outcome.result, app.workspace.system):
                        assert words in shown, (view.spec.id, words, shown)
                if draws:
                    await pilot.press("f6")
                    await pilot.pause()
                await pilot.press("f3")

    asyncio.run(scenario())
