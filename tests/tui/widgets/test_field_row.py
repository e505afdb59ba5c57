"""Field rows: labels with brackets, and a burst of keys applied in the order typed."""

from __future__ import annotations

import asyncio

from helpers.pilot import screen_text, settle, type_into

from fieldmode.tui.widgets.field_row import FieldRow

SIZE = (80, 24)


def test_field_labels_keep_square_brackets(make_app):
    async def scenario():
        app = make_app()
        async with app.run_test(size=SIZE) as pilot:
            await settle(app, pilot)
            row = app.current_view.query(FieldRow).first()
            await type_into(app, pilot, row.field.name, "[bold]x")
            assert "[bold]x" in screen_text(app)

    asyncio.run(scenario())


def test_a_burst_of_keys_is_applied_in_the_order_typed(make_app):
    """Over SSH keystrokes arrive together: Home and Backspace must not be overtaken by letters."""
    from textual import events

    async def scenario():
        app = make_app()
        async with app.run_test(size=SIZE) as pilot:
            await settle(app, pilot)
            burst = [("home", None), ("ctrl+k", None), *[(c, c) for c in "7.5 kg"], ("backspace", None),
                     ("backspace", None), ("t", "t"), ("tab", None), ("home", None), ("ctrl+k", None), ("3", "3")]
            for key, character in burst:
                app.post_message(events.Key(key if key != " " else "space", character))
            view = await settle(app, pilot)
            assert view.row("mass").input.value == "7.5 t"
            assert view.row("stiffness").input.value == "3"

    asyncio.run(scenario())
