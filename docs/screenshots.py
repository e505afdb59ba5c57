"""Draw the README screenshots from the app itself, at 80x24 on the demo scenario.

    make docs          # writes docs/screenshot.svg and docs/screenshot-chart.svg

The check shown is the first whose demo raises a warning, so the screenshot shows flags.
"""

from __future__ import annotations

import asyncio
import contextlib
import sys
import tempfile
from pathlib import Path

from textual.worker import WorkerCancelled

from fieldmode.calc.checks import SPECS
from fieldmode.tui.app import FieldmodeApp
from fieldmode.tui.evaluation import evaluate

NAMES = ("screenshot.svg", "screenshot-chart.svg")
"""The results view, then the first chart panel."""


def busiest_check() -> str:
    """The first check whose demo raises a warning, else the first check."""
    for spec in SPECS:
        result = evaluate(spec, spec.demo_texts(), "si").result
        if result is not None and any(flag.level == "warning" for flag in result.flags):
            return spec.id
    return SPECS[0].id


async def _caught_up(app: FieldmodeApp) -> None:
    """Wait until the check on screen shows the outcome of its current texts."""
    for _ in range(500):
        with contextlib.suppress(WorkerCancelled):
            await app.workers.wait_for_complete()
        if app.current_view.up_to_date:
            return
        await asyncio.sleep(0.02)
    raise TimeoutError("the app never showed its results")


async def capture(folder: Path, state_folder: Path) -> list[Path]:
    """Write the screenshots into ``folder``; the session lives in ``state_folder`` (a demo session)."""
    folder.mkdir(parents=True, exist_ok=True)
    shown = busiest_check()
    app = FieldmodeApp(state_folder=state_folder, ascii_borders=False)
    async with app.run_test(size=(80, 24)) as pilot:
        while app.current_view.spec.id != shown:
            await pilot.press("f3")
        for name, key in zip(NAMES, (None, "f6"), strict=True):
            if key:
                await pilot.press(key)
            await _caught_up(app)
            await pilot.pause()
            app.save_screenshot(name, str(folder))
    return [folder / name for name in NAMES]


def main(argv: list[str]) -> int:
    folder = Path(argv[0]) if argv else Path(__file__).resolve().parent
    with tempfile.TemporaryDirectory() as state:
        for path in asyncio.run(capture(folder, Path(state))):
            print(f"wrote {path}")
    return 0


if __name__ == "__main__":
    sys.exit(main(sys.argv[1:]))
