"""A check's pane: every check opens on its demo, readings and errors beside the fields, flags."""

from __future__ import annotations

import asyncio
import math

import pytest
from helpers.pilot import flags_text, jump_to, note_of, reveal, screen_text, settle, type_into

from fieldmode.calc.checks import SPECS

SIZE = (80, 24)


G0 = 9.80665  # Source: NIST SP 811 (2008), standard gravity


def test_every_check_opens_on_the_demo_with_results_flags_and_caution(make_app):
    async def scenario():
        app = make_app()
        async with app.run_test(size=SIZE) as pilot:
            seen = []
            for index, spec in enumerate(SPECS):
                view = await settle(app, pilot)
                assert view.spec.id == spec.id
                seen.append(spec.id)
                outcome = view.outcome
                assert outcome.errors == {} and outcome.problem == "", (spec.id, outcome.errors, outcome.problem)
                assert outcome.result is not None
                shown = screen_text(app)
                assert f"{index + 1}/{len(SPECS)}" in shown and spec.title in shown
                first = next(iter(outcome.result.values.values()))
                assert first.label[:12] in shown
                assert "Caution: " + spec.caution.split(":")[0] in shown
                for flag in outcome.result.flags[:4]:  # flags are on screen without scrolling
                    assert flag.text[:12] in shown
                assert app.focused is view.rows()[0].input
                await pilot.press("f3")
            await settle(app, pilot)
            assert app.current_view.spec.id == SPECS[0].id
            assert seen == [spec.id for spec in SPECS]

    asyncio.run(scenario())


@pytest.mark.parametrize("spec", SPECS, ids=[spec.id for spec in SPECS])
def test_bad_text_in_any_field_shows_inline_and_the_app_carries_on(make_app, spec, monkeypatch):
    # the subject is what each field says of bad text; the 150 ms typing window (tested on its own) only waits here
    monkeypatch.setattr("fieldmode.tui.widgets.check_view.THROTTLE", 0.01)

    async def scenario():
        app = make_app()
        async with app.run_test(size=SIZE) as pilot:
            while app.current_view.spec.id != spec.id:
                await pilot.press("f3")
            await settle(app, pilot)
            shown = dict(app.workspace.shown[spec.id])
            for spec_field in spec.fields:
                choices = await reveal(app, pilot, spec_field.name)  # a field the demo's choices do not use
                await jump_to(app, pilot, spec_field.name)
                view = await type_into(app, pilot, spec_field.name, "x!")
                outcome = view.outcome
                assert spec_field.name in outcome.errors or outcome.problem, (spec_field.name, outcome)
                assert outcome.result is None
                assert "No result" in screen_text(app)
                view.type_text(spec_field.name, spec_field.default)  # put the demo text back, as a paste would
                for choice, text in choices.items():
                    view.type_text(choice, text)
                for name in shown.values():  # the demo's alternatives again (Ctrl+T)
                    await jump_to(app, pilot, name)
                view = await settle(app, pilot)
                assert view.outcome.result is not None, (spec_field.name, view.outcome.errors)

    asyncio.run(scenario())


def test_single_mass_typed_as_a_weight_against_the_closed_form(make_app):
    # Source: Chopra, Dynamics of Structures, eq. 2.1.4: f_n = (1 / 2 pi) sqrt(k / m); m = W / g0
    async def scenario():
        app = make_app()
        async with app.run_test(size=SIZE) as pilot:
            await settle(app, pilot)
            await type_into(app, pilot, "mass", "117.7 kN")
            view = await type_into(app, pilot, "stiffness", "8 kN/mm")
            expected = math.sqrt(8e6 / (117.7e3 / G0)) / (2 * math.pi)
            assert "read as weight" in note_of(view, "mass")
            assert f"{expected:.3f}"[:4] in screen_text(app)
            value = view.outcome.result.values["natural_frequency"].magnitude
            assert value == pytest.approx(expected, rel=1e-9)

    asyncio.run(scenario())


def test_bad_and_suspicious_values_are_flagged_beside_the_field_and_in_flags(make_app):
    async def scenario():
        app = make_app()
        async with app.run_test(size=SIZE) as pilot:
            await settle(app, pilot)
            view = await type_into(app, pilot, "mass", "-3 t")
            assert "greater than zero" in view.outcome.errors["mass"]
            assert "! must be greater than zero" in note_of(view, "mass")
            assert "! must be greater" in screen_text(app)
            view = await type_into(app, pilot, "mass", "12 kg/m")
            assert "not a unit of mass" in view.outcome.errors["mass"]
            await type_into(app, pilot, "mass", "9.6 t")
            view = await type_into(app, pilot, "damping", "30")
            assert "read as 30 %" in note_of(view, "damping")  # a damping field reads a bare 30 as 30 %
            levels = {flag.level for flag in view.outcome.result.flags}
            assert "caution" in levels
            assert "!  caution: " in flags_text(view)  # a mark and a word, never colour alone
            assert "caution: " in screen_text(app)

    asyncio.run(scenario())
