"""Every check at 80x24: every label read in full, every line reached by its keys, the field in focus in view.

The checks are taken from calc.checks.SPECS, so a check added later is held to the same rules. A label is
"read in full" when no ellipsis stands where it was cut and all its words show, in order, within the few
lines it may fold onto, in the part of the screen that shows it (fields, results, flags, chart).
"""

from __future__ import annotations

import asyncio
import re

import pytest
from helpers.pilot import focus_field, go_to, screen_text, settle, type_into
from textual.geometry import Region
from textual.widget import Widget

from fieldmode.calc.checks import SPECS
from fieldmode.tui.app import FieldmodeApp
from fieldmode.tui.present import flag_text
from fieldmode.tui.widgets.check_view import CheckView

SIZE = (80, 24)
CUT = re.compile(r"[\w)](…|\.\.\.)")
"""An ellipsis right after a word: where rich or Textual cut a text too long for its cell."""
WORD = re.compile(r"[^\s\u2500-\u259f\u2800-\u28ff]+")
FOLDS = 3
"""Lines a label may fold onto (a flag's sentence may take more: see ``flag_folds``)."""


def words(text: str) -> list[str]:
    """Words of a text, box, block and braille characters (borders, scroll bars, plots) taken as blanks."""
    return WORD.findall(text)


def region_lines(app: FieldmodeApp, region: Region) -> list[str]:
    """The screen's lines inside ``region``."""
    lines = screen_text(app).splitlines()
    return [line.ljust(app.size[0])[region.x:region.right] for line in lines[region.y:region.bottom]]


def shows_in_full(lines: list[str], label: str, folds: int = FOLDS) -> bool:
    """True when every word of ``label`` shows in order, starting on some line and folding onto at most
    ``folds`` lines after it (words are matched whole: a cut word does not count)."""
    wanted = words(label)
    for start, line in enumerate(lines):
        if wanted[0] not in words(line):
            continue
        found = 0
        for text in lines[start:start + folds + 1]:
            cells = words(text)
            if found == 0:
                cells = cells[cells.index(wanted[0]):]
            for cell in cells:
                if found < len(wanted) and cell == wanted[found]:
                    found += 1
        if found == len(wanted):
            return True
    return False


def cuts(lines: list[str]) -> list[str]:
    return [line.strip() for line in lines if CUT.search(line)]


def flag_folds(text: str, width: int) -> int:
    return len(text) // max(1, width - 12) + 2


def visible(widget: Widget, box: Widget) -> bool:
    """True when the whole of ``widget`` is inside the visible part of the scroll area ``box``."""
    return box.content_region.contains_region(widget.region)


async def page_through(app: FieldmodeApp, pilot, box: Widget, key: str) -> list[list[str]]:
    """Press ``key`` until ``box`` has scrolled to its end; the lines of ``box`` after each press (first
    before any)."""
    pages = [region_lines(app, box.content_region)]
    for _ in range(40):
        if box.scroll_y >= box.max_scroll_y:
            break
        await pilot.press(key)
        await pilot.pause()
        pages.append(region_lines(app, box.content_region))
    assert box.scroll_y == box.max_scroll_y, f"{key} stopped at {box.scroll_y} of {box.max_scroll_y}"
    return pages


def in_pages(pages: list[list[str]], label: str, folds: int = FOLDS) -> bool:
    return any(shows_in_full(lines, label, folds) for lines in pages)


async def check_results_and_flags(app: FieldmodeApp, pilot, view: CheckView) -> None:
    """Every result label and flag reads in full, paging down to the last of each."""
    result = view.outcome.result
    assert result is not None, view.outcome
    pages = await page_through(app, pilot, view._results_box, "pagedown")
    for value in result.values.values():
        assert in_pages(pages, value.label), (view.spec.id, value.label, pages)
    last = list(result.values.values())[-1].label
    assert shows_in_full(pages[-1], last), (view.spec.id, "the last result is not reached", pages[-1])
    assert not [cut for lines in pages for cut in cuts(lines)], (view.spec.id, pages)
    if result.flags:
        box = view._flags_box
        pages = await page_through(app, pilot, box, "ctrl+pagedown")
        for flag in result.flags:
            text = flag_text(flag)
            assert in_pages(pages, text, flag_folds(text, box.size.width)), (view.spec.id, text, pages)
        assert not [cut for lines in pages for cut in cuts(lines)], (view.spec.id, pages)
        if box.max_scroll_y:
            assert "Ctrl+PgDn" in screen_text(app)  # the border says that more flags are below


async def check_fields(app: FieldmodeApp, pilot, view: CheckView) -> None:
    """Tab through every field shown: the row in focus is wholly on screen and its label reads in full."""
    view.focus_first()
    await pilot.pause()
    box = view._fields_box
    for row in [row for row in view.rows() if row.display]:  # the fields the choices use
        await settle(app, pilot)
        await pilot.pause()
        assert app.focused is row.input, (view.spec.id, row.field.name, app.focused)
        assert visible(row, box), (view.spec.id, row.field.name, row.region, box.content_region)
        lines = region_lines(app, row.region)
        label = row.field.label_with_unit + (", list" if row.field.many else "")
        assert shows_in_full(lines, label), (view.spec.id, label, lines)
        assert not cuts(lines), (view.spec.id, lines)
        await pilot.press("tab")
    view.focus_first()


async def check_charts(app: FieldmodeApp, pilot, view: CheckView) -> None:
    """Every chart panel: its title and axis labels read in full in the chart, flags and fields too."""
    from fieldmode.tui.charts import panels_of

    panels = len(panels_of(view.spec.id))
    if not panels:
        await pilot.press("f6")
        await settle(app, pilot)
        assert "no chart for this check" in screen_text(app)
    for number in range(1, panels + 1):
        await pilot.press("f6")
        await settle(app, pilot)
        await pilot.pause()
        assert view.view == number
        chart = view._chart
        assert chart is not None and chart.border_title == f"chart {number}/{len(panels_of(view.spec.id))}"
        lines = region_lines(app, chart.region)
        monitor = chart._plot.plt._active.monitor
        texts = [monitor.title, *monitor.xlabel, *monitor.ylabel]
        for text in filter(None, texts):
            assert shows_in_full(lines, text), (view.spec.id, number, text, lines)
        assert chart.border_title in "".join(lines)
        assert not cuts(region_lines(app, Region(0, 0, *SIZE))), (view.spec.id, number, screen_text(app))
        for row in view.rows():
            if not row.display or not visible(row, view._fields_box):
                continue  # out of view, or partly: Tab brings it in (check_fields)
            label = row.field.label_with_unit + (", list" if row.field.many else "")
            row_lines = region_lines(app, row.region)
            assert shows_in_full(row_lines, label), (view.spec.id, label, row_lines)
    await pilot.press("f6")
    await settle(app, pilot)
    assert view.view == 0


@pytest.mark.parametrize("spec", SPECS, ids=[spec.id for spec in SPECS])
def test_every_label_reads_in_full_and_every_line_is_reached_at_80x24(make_app, spec):
    async def scenario():
        app = make_app()
        async with app.run_test(size=SIZE) as pilot:
            view = await go_to(app, pilot, spec.id)
            await check_results_and_flags(app, pilot, view)
            await check_fields(app, pilot, view)
            await check_charts(app, pilot, view)

    asyncio.run(scenario())


def test_page_keys_move_the_results_of_decay_and_storeys_to_their_last_lines(make_app):
    # a text box in focus took PageDown itself (nothing to scroll in one line) and the key stopped there
    async def scenario():
        app = make_app()
        async with app.run_test(size=SIZE) as pilot:
            for check_id, last in (("decay", "Noise RMS in the band"), ("storeys", "Limit alpha")):
                view = await go_to(app, pilot, check_id)
                box = view._results_box
                assert box.max_scroll_y > 0 and box.scroll_y == 0
                assert last not in screen_text(app)
                for _ in range(10):
                    await pilot.press("pagedown")
                await pilot.pause()
                assert box.scroll_y == box.max_scroll_y
                assert last in screen_text(app)
                await pilot.press("pageup")
                await pilot.pause()
                assert box.scroll_y < box.max_scroll_y
                assert isinstance(app.focused, type(view.rows()[0].input))  # the keys never took the focus

    asyncio.run(scenario())


def test_the_field_typed_in_stays_on_screen_and_flags_keep_to_their_area(make_app):
    async def scenario():
        app = make_app()
        async with app.run_test(size=SIZE) as pilot:
            view = await go_to(app, pilot, "forced")
            fields, flags = view._fields_box, view._flags_box
            for name, text in (("unbalance", "0.5 kg m"), ("frequency", "600 rpm"), ("unbalance", "0.35 kg m")):
                view = await type_into(app, pilot, name, text)
                await pilot.pause()
                row = view.row(name)
                assert app.focused is row.input
                assert visible(row, fields), (name, row.region, fields.content_region)
                assert text in "".join(region_lines(app, row.region))
                assert flags.outer_size.height <= 8  # capped: 7 lines and its border
                assert fields.content_region.height >= 12  # 24 rows less bars, caution and flags
            view = await go_to(app, pilot, "floor")
            flags = view._flags_box
            assert flags.max_scroll_y > 0  # more flags than the area shows: they scroll, by their own keys
            await pilot.press("ctrl+pagedown")
            await pilot.pause()
            assert flags.scroll_y > 0 and view._results_box.scroll_y == 0
            assert app.focused is view.rows()[0].input  # scrolling the flags leaves the field in focus

    asyncio.run(scenario())


def test_a_shared_field_says_in_plain_words_where_its_value_comes_from(make_app):
    async def scenario():
        app = make_app()
        async with app.run_test(size=SIZE) as pilot:
            view = await settle(app, pilot)
            assert view.spec.id == "sdof" and app.focused is view.row("mass").input
            mass = "".join(region_lines(app, view.row("mass").region))
            assert "same as in forced; Ctrl+O for a value of its own here" in " ".join(mass.split())
            await focus_field(app, pilot, "stiffness")
            await pilot.pause()
            mass = " ".join("".join(region_lines(app, view.row("mass").region)).split())
            assert "same as in forced" in mass and "Ctrl+O" not in mass  # the key is named in focus only
            await focus_field(app, pilot, "mass")
            await pilot.press("ctrl+o")
            view = await settle(app, pilot)
            await pilot.pause()
            mass = " ".join("".join(region_lines(app, view.row("mass").region)).split())
            assert "its own value here; Ctrl+O for the same as in forced" in mass

    asyncio.run(scenario())


PUZZLES = ("(- inside)", "M u/(m e)", "closed form", "c/(2 m_d w_d)")
"""Label parts an engineer had to decode (issue 12): formulas and signs in place of words."""


@pytest.mark.parametrize("system", ["si", "us"])
def test_result_labels_are_short_plain_words(system):
    # Common practice (no source): the results column is about 41 cells at 80x24; a label of at most
    # 24 characters leaves room for a value with its unit on the same line
    from fieldmode.tui.evaluation import evaluate

    for spec in SPECS:
        result = evaluate(spec, spec.demo_texts(), system).result
        assert result is not None, spec.id
        for value in result.values.values():
            assert len(value.label) <= 24, (spec.id, value.label)
            assert not any(puzzle in value.label for puzzle in PUZZLES), (spec.id, value.label)
        for spec_field in spec.fields:
            label = spec_field.label_with_unit + (", list" if spec_field.many else "")
            assert len(label) <= 34, (spec.id, label)  # one line beside the fields' 37 cells
