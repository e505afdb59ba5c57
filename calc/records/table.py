"""The numbers of a record's columns, parsed from its bytes by numpy's C reader; a bad line named.

Only when the fast reader fails, or a value is not finite, are the lines scanned one by one to
find and name the first bad one.
"""

from __future__ import annotations

import io
import warnings
from collections.abc import Iterator

import numpy as np

from fieldmode.calc.records.layout import Layout, RecordError, cells_of


def load_columns(data: bytes, layout: Layout, used: list[int], max_rows: int) -> np.ndarray:
    """The ``used`` columns (0-based, in that order) as a (rows, len(used)) float array.

    Raises RecordError naming the first bad line, or when there are more than ``max_rows`` rows.
    """
    order = sorted(set(used))
    if data.count(b"\n") - layout.first_line > max_rows:  # counted in C; loadtxt's max_rows would allocate them
        raise RecordError(layout.shown, f"more than {max_rows:,} samples; shorten the record")
    if layout.decimal_comma:
        data = data.replace(b",", b".")
    if layout.quoted:
        data = data.replace(b'"', b"")
    stream = io.TextIOWrapper(io.BytesIO(data), encoding=layout.encoding, newline=None)
    comments = layout.comments[0] if len(layout.comments) == 1 else layout.comments
    try:
        with warnings.catch_warnings():
            warnings.filterwarnings("ignore", message="Input line", category=UserWarning)  # blank lines
            table = np.loadtxt(stream, delimiter=layout.delimiter, skiprows=layout.first_line - 1,
                               usecols=order, comments=comments, ndmin=2, quotechar=None, dtype=float)
    except (ValueError, IndexError) as error:
        raise first_bad_line(data, layout, used) or RecordError(layout.shown, f"unreadable data ({error})") from error
    if len(table) > max_rows:
        raise RecordError(layout.shown, f"more than {max_rows:,} samples; shorten the record")
    if used != order:
        table = table[:, [order.index(i) for i in used]]  # a copy: only when the columns were asked out of order
    if not np.isfinite(table).all():
        raise first_bad_line(data, layout, used) or RecordError(layout.shown, "a value is not a finite number")
    return table


def data_lines(data: bytes, layout: Layout) -> Iterator[tuple[int, list[str]]]:
    """(line number, cells) of every data line, read slowly: only used to locate problems."""
    text = data.decode(layout.encoding, errors="replace")
    for number, line in enumerate(text.splitlines(), start=1):
        if number < layout.first_line:
            continue
        cells = cells_of(line, layout.delimiter, layout.comments)
        if cells:
            yield number, cells


def first_bad_line(data: bytes, layout: Layout, used: list[int]) -> RecordError | None:
    """The first line whose used cells are missing, not numbers, NaN or infinite."""
    for number, cells in data_lines(data, layout):
        for index in used:
            name = layout.names[index]
            if index >= len(cells) or not cells[index]:
                return RecordError(layout.shown, f"no value in column {name!r} "
                                   f"({len(cells)} cells; fill or remove the row)", number)
            text = cells[index].replace(",", ".") if layout.decimal_comma else cells[index]
            try:
                value = float(text)
            except ValueError:
                hint = _separator_hint(cells[index], layout)
                return RecordError(layout.shown, f"{cells[index][:20]!r} in column {name!r} is not a number{hint}",
                                   number)
            if not np.isfinite(value):
                return RecordError(layout.shown, f"{cells[index]!r} in column {name!r}: a NaN or "
                                   "infinite row; remove or fill it", number)
    return None


def line_of_row(data: bytes, layout: Layout, row: int) -> int:
    """File line number of data row ``row`` (0-based)."""
    for index, (number, _) in enumerate(data_lines(data, layout)):
        if index == row:
            return number
    return 0


def _separator_hint(cell: str, layout: Layout) -> str:
    """A hint when a cell holds another separator than the rest of the file."""
    others = [mark for mark in (";", ",", "\t") if mark in cell and mark != layout.delimiter]
    if not others:
        return ""
    found = {";": "semicolons", ",": "commas", "\t": "tabs"}[others[0]]
    used = {";": "semicolons", ",": "commas", "\t": "tabs", None: "blanks"}[layout.delimiter]
    return f" (this line is separated by {found}, the lines before it by {used}: use one separator)"
