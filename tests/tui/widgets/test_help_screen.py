"""The key list (F1)."""

from __future__ import annotations

import asyncio

from helpers.pilot import screen_text

SIZE = (80, 24)


def test_help_lists_every_key_with_an_id(make_app):
    async def scenario():
        app = make_app()
        async with app.run_test(size=SIZE) as pilot:
            await pilot.press("f1")
            await pilot.pause()
            rows = app.screen._rows
            shown = " ".join(screen_text(app).split())
            assert "F7 typical values for the field in focus, with sources;" in shown
            for binding in app.BINDINGS:
                assert binding.id and binding.description
                assert any(row[0].startswith(binding.key.split(",")[0].upper()) for row in rows), binding.key
            assert any(row[0].startswith("Tab") for row in rows)
            ids = [binding.id for binding in app.BINDINGS]
            assert len(ids) == len(set(ids))
            await pilot.press("escape")
            await pilot.pause()
            assert len(app.screen_stack) == 1

    asyncio.run(scenario())
