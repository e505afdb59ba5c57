"""Fields follow choices at 80x24: a check shows the fields its choices use, alternatives take one row."""

from __future__ import annotations

import asyncio
import math

import pytest
from helpers.pilot import focus_field, go_to, screen_text, settle, type_into
from helpers.specs import SUPPORTED

from fieldmode.calc.checks import member, sdof
from fieldmode.tui.present import field_text
from fieldmode.tui.session import parse_session
from fieldmode.tui.widgets.send_screen import SendScreen

SIZE = (80, 24)
G0 = 9.80665  # Source: NIST SP 811 (2008), standard gravity
# The demo beam: steel E = 210 GPa (EN 1993-1-1 3.2.6), span 7.2 m, I = 29000 cm^4, 1.2 t/m.
E, I, L, M = 210e9, 29000e-8, 7.2, 1200.0  # noqa: E741 (I is the second moment of area)
BEAM_ROWS = ["element", "end_conditions", "count", "length", "material", "second_moment", "mass_per_length"]
"""What a simply supported beam under a point load needs (48 EI/L^3; f1 from m): element, ends, members,
span, E (from the material, or typed), I (or a section), mass per length."""


def shown_rows(view) -> list[str]:  # noqa: ANN001
    return [row.field.name for row in view.rows() if row.display]


def test_a_beam_shows_only_its_fields_and_six_tabs_reach_mass_per_length(make_app):
    async def scenario():
        app = make_app()
        async with app.run_test(size=SIZE) as pilot:
            view = await go_to(app, pilot, "member")
            assert shown_rows(view) == BEAM_ROWS
            shown = screen_text(app)
            for label in ("Width b", "Depth d", "Outside diameter", "Wall thickness", "Area A", "Spring stiffnesses",
                          "Arrangement"):
                assert label not in shown, label
            assert "Mass per length (kg/m)" in shown  # on screen without scrolling
            assert "or Young's modulus E: Ctrl+T" in shown and "or Section shape: Ctrl+T" in shown
            assert app.focused is view.row("element").input
            tabs = 0
            while app.focused is not view.row("mass_per_length").input:
                await pilot.press("tab")
                tabs += 1
                assert tabs < len(member.FIELDS)
            assert tabs == 6  # end conditions, members, length, material, I, mass per length (was 15)

    asyncio.run(scenario())


def test_switching_the_element_keeps_every_text_and_computes_with_the_fields_shown(make_app):
    async def scenario():
        app = make_app()
        async with app.run_test(size=SIZE) as pilot:
            await go_to(app, pilot, "member")
            view = await type_into(app, pilot, "element", "axial")
            assert shown_rows(view) == ["element", "count", "length", "material", "section", "area"]
            assert "Mass per length" not in screen_text(app)
            view = await type_into(app, pilot, "area", "5000 mm^2")
            # Source: Gere & Goodno, Mechanics of Materials: axial stiffness EA/L
            assert view.outcome.result.number("stiffness") == pytest.approx(E * 5000e-6 / L)
            assert "ignored" not in " ".join(flag.text for flag in view.outcome.result.flags)  # hidden: not noted
            view = await type_into(app, pilot, "element", "beam")
            assert shown_rows(view) == BEAM_ROWS
            assert view.row("mass_per_length").input.value == "1.2 t/m"  # typed for the beam, kept
            assert app.workspace.texts["member"]["area"] == "5000 mm^2"  # typed for the bar, kept
            result = view.outcome.result
            # Source: Roark's Formulas for Stress and Strain, Table 8.1: midspan point load k = 48 EI / L^3
            assert result.number("stiffness") == pytest.approx(48 * E * I / L**3)
            # Source: Blevins, Formulas for Natural Frequency and Mode Shape, Table 8-1: simply supported
            # f1 = (pi / (2 L^2)) sqrt(E I / m)
            assert result.number("natural_frequency") == pytest.approx(math.pi / (2 * L**2) * math.sqrt(E * I / M))
            view = await type_into(app, pilot, "element", "springs")
            assert shown_rows(view) == ["element", "springs", "arrangement"]
            with pytest.raises(AssertionError, match="Tab never reached"):
                await focus_field(app, pilot, "length")  # a hidden row takes no focus

    asyncio.run(scenario())


def test_the_alternative_key_shows_the_other_field_and_the_one_shown_is_used(make_app, state):
    async def first():
        app = make_app()
        async with app.run_test(size=SIZE) as pilot:
            view = await settle(app, pilot)
            assert "static_deflection" not in shown_rows(view)
            assert "or Static deflection: Ctrl+T" in screen_text(app)
            await focus_field(app, pilot, "stiffness")
            await pilot.press("ctrl+t")
            assert app.focused is view.row("static_deflection").input
            assert "stiffness" not in shown_rows(view) and "static_deflection" in shown_rows(view)
            view = await type_into(app, pilot, "static_deflection", "2 mm")
            assert "or Stiffness (42 kN/mm): Ctrl+T" in screen_text(app)  # the other exists, its text kept
            # Source: Chopra, Dynamics of Structures, eq. 2.1.4 with k = m g0 / delta: f_n = sqrt(g0/delta) / 2 pi
            assert view.outcome.result.number("natural_frequency") == pytest.approx(
                math.sqrt(G0 / 0.002) / (2 * math.pi))
            assert view.outcome.errors == {}  # both texts are kept; only the one shown is read
            await pilot.press("ctrl+t")
            view = await settle(app, pilot)
            assert app.focused is view.row("stiffness").input
            # Source: Chopra, Dynamics of Structures, eq. 2.1.4: f_n = sqrt(k / m) / 2 pi
            assert view.outcome.result.number("natural_frequency") == pytest.approx(
                math.sqrt(42e6 / 9600) / (2 * math.pi))
            await pilot.press("ctrl+t")
            await settle(app, pilot)
            await pilot.press("f10")

    async def second():
        app = make_app()
        async with app.run_test(size=SIZE) as pilot:
            view = await settle(app, pilot)
            assert "static_deflection" in shown_rows(view) and "stiffness" not in shown_rows(view)
            assert view.outcome.result.number("natural_frequency") == pytest.approx(
                math.sqrt(G0 / 0.002) / (2 * math.pi))
            await focus_field(app, pilot, "mass")
            await pilot.press("ctrl+t")  # no alternative: said, nothing changes
            assert "Ctrl+T works in a field that has an alternative" in app.messages[-1]

    asyncio.run(first())
    saved = parse_session((state / "session.json").read_text())
    assert saved.alternatives["sdof"]["stiffness"] == "static_deflection"
    assert saved.texts["sdof"]["stiffness"] == "42 kN/mm" and saved.texts["sdof"]["static_deflection"] == "2 mm"
    asyncio.run(second())


def test_f8_never_sends_to_a_field_the_target_s_choice_does_not_use(make_app):
    async def scenario():
        app = make_app(specs=(member.SPEC, sdof.SPEC, SUPPORTED))
        async with app.run_test(size=SIZE) as pilot:
            await settle(app, pilot)
            await pilot.press("f8")
            await pilot.pause()
            assert isinstance(app.screen, SendScreen)
            assert [target.checks for target in app.screen.targets] == [["sdof"]]  # sdof-s rests on a rigid support
            await pilot.press("escape")
            await go_to(app, pilot, "sdof-s")
            view = await type_into(app, pilot, "support", "springs")
            assert "stiffness" in shown_rows(view)
            await go_to(app, pilot, "member")
            await pilot.press("f8")
            await pilot.pause()
            assert [target.checks for target in app.screen.targets] == [["sdof"], ["sdof-s"]]
            await pilot.press("enter")
            await pilot.pause()
            # Source: Roark's Formulas for Stress and Strain, Table 8.1: k = 48 E I / L^3
            assert app.workspace.texts["sdof-s"]["stiffness"] == field_text(48 * E * I / L**3, "stiffness", "si")

    asyncio.run(scenario())


def test_the_calc_record_holds_the_fields_in_use_only(make_app, tmp_path):
    async def scenario():
        app = make_app()
        async with app.run_test(size=SIZE) as pilot:
            await go_to(app, pilot, "member")
            await type_into(app, pilot, "element", "axial")
            await type_into(app, pilot, "area", "5000 mm^2")
            assert app.write_record(tmp_path / "bar.md", "check") == ""
            record = (tmp_path / "bar.md").read_text()
            assert "| Area A (mm^2) | 5000 mm^2 |" in record
            assert "Mass per length" not in record and "Second moment" not in record  # kept in the session only
            assert app.workspace.texts["member"]["mass_per_length"] == "1.2 t/m"

    asyncio.run(scenario())
