"""Typical values (F7) fill the field in focus."""

from __future__ import annotations

import asyncio
import math

import pytest
from helpers.pilot import focus_field, settle

from fieldmode.calc.typical_values import DAMPING
from fieldmode.tui.widgets.lookup_screen import LookupScreen

SIZE = (80, 24)


def test_damping_filled_from_the_lookup_table(make_app):
    async def scenario():
        app = make_app()
        async with app.run_test(size=SIZE) as pilot:
            await settle(app, pilot)
            await focus_field(app, pilot, "stiffness")
            await pilot.press("f7")
            await pilot.pause()
            assert not isinstance(app.screen, LookupScreen)
            assert "No table" in app.messages[-1]
            await focus_field(app, pilot, "damping")
            await pilot.press("f7")
            await pilot.pause()
            assert isinstance(app.screen, LookupScreen)
            target = next(i for i, row in enumerate(DAMPING.rows) if row.description == "steel buildings")
            await pilot.press(*["down"] * target, "enter")
            view = await settle(app, pilot)
            # Source: EN 1991-1-4 Annex F, Table F.2: steel buildings delta_s = 0.05 (from memory);
            # zeta = delta / sqrt(4 pi^2 + delta^2) (Chopra, Dynamics of Structures, sec. 2.2)
            zeta = 0.05 / math.sqrt(4 * math.pi**2 + 0.05**2)
            assert view.row("damping").input.value == f"{100 * zeta:.3g} %"
            assert app.focused is view.row("damping").input
            assert view.outcome.result.values["damping_ratio"].magnitude == pytest.approx(zeta, rel=1e-3)
            await pilot.press("f7")
            await pilot.press("escape")
            view = await settle(app, pilot)
            assert view.row("damping").input.value == f"{100 * zeta:.3g} %"

    asyncio.run(scenario())
