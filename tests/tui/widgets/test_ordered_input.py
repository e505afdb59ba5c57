"""Keys that arrive together (over SSH they often do) are applied in the order typed, in dialogs too."""

from __future__ import annotations

import asyncio

import pytest
from helpers.pilot import settle
from textual import events

from fieldmode.tui.widgets.export_screen import ExportScreen

SIZE = (80, 24)


@pytest.mark.parametrize(("keys", "expected"), [
    (["home", "ctrl+k", "x", "y", "z"], "xyz"),          # once left the box empty
    (["end", "x", "y", "z"], "{name}xyz"),               # once replaced the name
    (["backspace", "x", "y", "z"], "xyz"),               # once lost the 'z'
    (["end", "backspace", "backspace", "backspace", "x"], "{stem}x"),
])
def test_a_burst_in_the_record_dialog_is_applied_in_order(make_app, keys, expected):
    # Common practice (no source): a text box applies keys in the order they were typed
    async def scenario():
        app = make_app()
        async with app.run_test(size=SIZE) as pilot:
            await settle(app, pilot)
            await pilot.press("f9")
            await pilot.pause()
            assert isinstance(app.screen, ExportScreen)
            box = app.screen.query_one("#record-path")
            name = box.value
            for key in keys:  # all posted before any is handled: a burst
                app.post_message(events.Key(key, key if len(key) == 1 else None))
            await pilot.pause(0.3)
            assert box.value == expected.format(name=name, stem=name[:-3])

    asyncio.run(scenario())
