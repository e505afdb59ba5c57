"""Going to a check from the list (F4)."""

from __future__ import annotations

import asyncio

from helpers.pilot import screen_text, settle

from fieldmode.calc.checks import SPECS

SIZE = (80, 24)


def test_go_to_a_check_from_the_list(make_app):
    async def scenario():
        app = make_app()
        async with app.run_test(size=SIZE) as pilot:
            await pilot.press("f4")
            await pilot.pause()
            await pilot.press("end", "enter")
            await settle(app, pilot)
            assert app.current_view.spec.id == SPECS[-1].id

    asyncio.run(scenario())


def test_the_check_at_the_cursor_is_marked_in_ascii_without_colour(make_app):
    async def scenario():
        app = make_app(ascii_borders=True)
        async with app.run_test(size=SIZE) as pilot:
            await settle(app, pilot)
            await pilot.press("f4")
            await pilot.pause()
            lines = [line.strip(" |") for line in screen_text(app).splitlines()]
            assert f"> {SPECS[0].id:<16}{SPECS[0].title}" in lines
            await pilot.press("down")
            await pilot.pause()
            text = screen_text(app)
            lines = [line.strip(" |") for line in text.splitlines()]
            assert f"> {SPECS[1].id:<16}{SPECS[1].title}" in lines
            assert f"{SPECS[0].id:<16}{SPECS[0].title}" in lines  # no longer marked
            # no box drawing and no border of block characters (the scroll bar's blocks are the app's everywhere)
            assert not any("\u2500" <= char <= "\u257f" or char in "\u258a\u258e\u2594" for char in text), text

    asyncio.run(scenario())
