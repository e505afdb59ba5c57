"""Pilot tests: every check pane, driven by keys alone at 80x24."""

from __future__ import annotations

import asyncio
import math

import pytest
from helpers.pilot import flags_text, focus_field, note_of, screen_text, settle, type_into

from fieldmode.calc.checks import SPECS
from fieldmode.calc.typical_values import DAMPING
from fieldmode.tui.present import value_text
from fieldmode.tui.widgets.field_row import FieldRow
from fieldmode.tui.widgets.lookup_screen import LookupScreen

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
def test_bad_text_in_any_field_shows_inline_and_the_app_carries_on(make_app, spec):
    async def scenario():
        app = make_app()
        async with app.run_test(size=SIZE) as pilot:
            while app.current_view.spec.id != spec.id:
                await pilot.press("f3")
            await settle(app, pilot)
            for spec_field in spec.fields:
                view = await type_into(app, pilot, spec_field.name, "x!")
                outcome = view.outcome
                assert spec_field.name in outcome.errors or outcome.problem, (spec_field.name, outcome)
                assert outcome.result is None
                assert "No result" in screen_text(app)
                view.type_text(spec_field.name, spec_field.default)  # put the demo text back, as a paste would
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
            assert "did you mean 30 %?" in note_of(view, "damping")
            levels = {flag.level for flag in view.outcome.result.flags}
            assert "caution" in levels
            assert "!  caution: " in flags_text(view)  # a mark and a word, never colour alone
            assert "caution: " in screen_text(app)

    asyncio.run(scenario())


def test_units_key_switches_results_between_si_and_us(make_app):
    async def scenario():
        app = make_app()
        async with app.run_test(size=SIZE) as pilot:
            await settle(app, pilot)
            assert "kN/mm" in screen_text(app) and "units SI" in screen_text(app)
            await pilot.press("f5")
            view = await settle(app, pilot)
            shown = screen_text(app)
            assert "units US" in shown and "kip/in" in shown and "lb" in shown
            # Source: NIST SP 811 B.8: 1 lbf = 4.4482216152605 N, 1 in = 0.0254 m
            kip_per_in = 42e6 * 0.0254 / 4448.2216152605
            assert value_text(view.outcome.result.values["stiffness"], "us") == f"{kip_per_in:.1f} kip/in"
            await pilot.press("f5")
            await settle(app, pilot)
            assert "units SI" in screen_text(app)

    asyncio.run(scenario())


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


def test_ascii_borders_draw_no_box_characters(make_app):
    async def scenario():
        app = make_app(ascii_borders=True)
        async with app.run_test(size=SIZE) as pilot:
            await settle(app, pilot)
            for key in ("f6", "f1"):
                await pilot.press(key)
                await pilot.pause()
                drawn = screen_text(app)
                assert not any("\u2500" <= char <= "\u257f" for char in drawn), drawn

    asyncio.run(scenario())


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
