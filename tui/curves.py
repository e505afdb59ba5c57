"""A check's curves as CSV, for `--csv FILE|-` on the command line.

One header line of names with their SI units (``period [s],psa [m/s^2]``), then one row per
point, SI values. Columns follow the check's declared series: each abscissa (a ``Series`` with
``against=None``), then the curves drawn against it. Curves of different lengths (a period grid
beside a time history) leave the shorter columns' cells empty; so does a point that is not a
finite number (JSON writes it as null). The curves are the result's series as computed, thinned
for display where a check does so.
"""

from __future__ import annotations

import csv
import io
import math
import sys
from itertools import zip_longest
from pathlib import Path
from typing import TYPE_CHECKING

from fieldmode.tui.files import describe_os_error, write_atomic
from fieldmode.tui.printable import printable

if TYPE_CHECKING:
    from fieldmode.calc.framework.result import Result
    from fieldmode.calc.framework.spec import CheckSpec

STDOUT = "-"
"""The target that means standard output."""


class CurvesError(ValueError):
    """The curves cannot or may not be written where asked; the message is one line fit to show a person."""


def check_target(target: str, *, overwrite: bool, json: bool) -> None:
    """Refuse, before anything is computed, a target the curves cannot or may not go to."""
    if not target.strip():
        raise CurvesError("--csv needs a file name, or - for standard output")
    if target == STDOUT:
        if json:
            raise CurvesError("--csv - and --json both write to standard output: give --csv a file name")
        return
    path = Path(target)
    if path.is_dir():
        raise CurvesError(f"{target} is a folder: give --csv a file name")
    if not overwrite and (path.exists() or path.is_symlink()):
        raise CurvesError(f"{target} exists: add --overwrite to replace it")


def column_order(spec: CheckSpec, result: Result) -> list[str]:
    """The result's curves in the spec's order, each abscissa followed by the curves drawn against it."""
    made = [curve for curve in spec.series if curve.name in result.series]

    def with_curves(name: str) -> list[str]:
        return [name] + [later for curve in made if curve.against == name for later in with_curves(curve.name)]

    return [name for curve in made if curve.against not in result.series for name in with_curves(curve.name)]


def _cell(value: float) -> str:
    """An SI value in full precision (the shortest text that reads back to the same float, whole numbers
    without '.0'); '' if not finite."""
    if not math.isfinite(value):
        return ""
    return str(int(value)) if value.is_integer() and abs(value) < 1e15 else repr(value)


def csv_text(spec: CheckSpec, result: Result) -> str:
    """The result's curves as CSV text ('' when it made none)."""
    names = column_order(spec, result)
    if not names:
        return ""
    stream = io.StringIO()
    writer = csv.writer(stream, lineterminator="\n")
    writer.writerow(f"{name} [{result.series_unit(name)}]" for name in names)
    columns = ([_cell(value) for value in result.series[name].ravel().tolist()] for name in names)
    writer.writerows(zip_longest(*columns, fillvalue=""))
    return stream.getvalue()


def write_curves(spec: CheckSpec, result: Result, target: str) -> None:
    """Write the result's curves to ``target`` (a path, atomically, or '-' for standard output).

    A result without curves writes nothing and says so in one line on stderr. Raises
    :class:`CurvesError` when the file cannot be written.
    """
    text = csv_text(spec, result)
    if not text:
        where = "" if target == STDOUT else f" to {target}"
        print(printable(f"fieldmode: {spec.id} makes no curves: nothing written{where}"), file=sys.stderr)
        return
    if target == STDOUT:
        sys.stdout.write(text)
        return
    path = Path(target)
    try:
        write_atomic(path, text)
    except OSError as error:
        raise CurvesError(describe_os_error(error, path)) from error
