"""Going to a check from the list (F4)."""

from __future__ import annotations

import asyncio

from helpers.pilot import settle

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
