"""Keys typed in the burst that opens a dialog reach the dialog."""

from __future__ import annotations

import asyncio

from helpers.pilot import focus_field, settle
from textual import events

from fieldmode.calc.checks import SPECS
from fieldmode.calc.typical_values import STRUCTURE_DAMPING

SIZE = (80, 24)


def post_burst(app, keys: list[str]) -> None:
    """Queue every key at once, as a terminal delivers keys that arrive together over SSH."""
    for key in keys:
        app.post_message(events.Key(key, None))


async def wait_for_single_screen(app, pilot) -> None:
    for _ in range(200):
        await pilot.pause()
        if len(app.screen_stack) == 1:
            return
    raise AssertionError("the dialog stayed open")


def test_go_to_check_burst_picks_the_check(make_app):
    async def scenario():
        app = make_app()
        async with app.run_test(size=SIZE) as pilot:
            await settle(app, pilot)
            first = app.current_view.spec.id
            assert first == SPECS[0].id
            post_burst(app, ["f4", "down", "down", "enter"])
            await wait_for_single_screen(app, pilot)
            view = await settle(app, pilot)
            assert view.spec.id == SPECS[2].id  # two rows down from the check on screen
            assert app.focused is view.rows()[0].input

    asyncio.run(scenario())


def test_lookup_burst_fills_the_field(make_app):
    async def scenario():
        app = make_app()
        async with app.run_test(size=SIZE) as pilot:
            await settle(app, pilot)
            await focus_field(app, pilot, "damping")
            post_burst(app, ["f7", "down", "enter"])
            await wait_for_single_screen(app, pilot)
            view = await settle(app, pilot)
            expected = STRUCTURE_DAMPING.rows[1].fill  # sdof: the row below the first: Down, then Enter
            assert view.row("damping").input.value == expected
            assert app.focused is view.row("damping").input

    asyncio.run(scenario())
