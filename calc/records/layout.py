"""Finding the layout of a text record: encoding, separator, decimal mark, header and first data line.

Used by :mod:`fieldmode.calc.records.read`; only the first :data:`HEAD_BYTES` of the record are looked at.
"""

from __future__ import annotations

import itertools
import re
from dataclasses import dataclass

from fieldmode.calc.framework.units import InputError

HEAD_BYTES = 65536
"""Bytes looked at to find the layout."""
LONGEST_HEAD = 4 * 1024 * 1024
"""Bytes looked at, at most, when the header and comments fill the first :data:`HEAD_BYTES`."""
MAX_HEADER_LINES = 2000
"""Most lines of header and comments before the data."""
RUN_LINES = 3
"""The data start at the first run of this many numeric lines of one layout."""
COMMENT_MARKS = ("#", "%", "//")
"""A line starting with one of these (or the rest of a line after one) is a comment."""

_DELIMITERS: tuple[str | None, ...] = ("\t", ";", ",", None)
_NUMBER = re.compile(r"^[+-]?(?:(?:\d+(?:[.,]\d*)?|[.,]\d+)(?:[eE][+-]?\d+)?|nan|inf|infinity)$", re.IGNORECASE)
_CONTROL = re.compile(rb"[\x00-\x08\x0e-\x1a\x1c-\x1f\x7f]")


class RecordError(InputError):
    """A record file that cannot be read as a time series; names the file and the line.

    ``about`` names the field whose text the problem is about when it is not the file itself:
    'time_column', 'signal_column' or 'sample_rate' (the names of calc.records.columns).
    """

    def __init__(self, path: str, problem: str, line: int | None = None, about: str = "") -> None:
        where = f", line {line}" if line else ""
        ValueError.__init__(self, f"record file {path!r}{where}: {problem}")
        self.field = "record file"
        self.text = path
        self.problem = problem
        self.line = line
        self.about = about


@dataclass(frozen=True)
class Layout:
    """How the data of a record file are laid out."""

    shown: str
    encoding: str
    delimiter: str | None
    decimal_comma: bool
    quoted: bool
    comments: tuple[str, ...]
    first_line: int
    width: int
    names: tuple[str, ...]
    notes: tuple[str, ...]


def cells_of(line: str, delimiter: str | None, comments: tuple[str, ...] = COMMENT_MARKS) -> list[str]:
    """Cells of one line without comments, quotes and surrounding blanks; [] for a blank line."""
    for mark in comments:
        cut = line.find(mark)
        if cut >= 0:
            line = line[:cut]
    line = line.strip()
    if not line:
        return []
    if delimiter is not None:
        line = line.rstrip(delimiter)
    return [cell.strip().strip('"').strip() for cell in line.split(delimiter)]


def sniff(data: bytes, shown: str) -> Layout:
    """Check that ``data`` (a whole record, UTF-8 or Latin-1) is text of numbers and find its layout."""
    if not data[:HEAD_BYTES].strip():
        raise RecordError(shown, "the file is empty")
    size = HEAD_BYTES
    while True:  # a header or comment block longer than the head: look further, up to LONGEST_HEAD
        head = data[:size]
        text, encoding = _decode(head, len(data), shown)
        lines = text.splitlines()
        if len(data) > len(head) and lines:
            lines = lines[:-1]
        found = _data_start(lines)
        if found is not None or len(head) == len(data) or size >= LONGEST_HEAD:
            break
        size *= 4
    if found is None:
        raise RecordError(shown, _no_data(lines))
    start, delimiter, width = found
    header = [line for line in lines[:start] if cells_of(line, delimiter)]
    names = _names(header[-1] if header else "", delimiter, width)
    sample = [c for line in lines[start:start + 50] for c in cells_of(line, delimiter)]
    decimal_comma = delimiter != "," and any("," in cell for cell in sample)
    quoted = any('"' in line for line in lines[start:])
    comments = tuple(m for m in COMMENT_MARKS if any(line.lstrip().startswith(m) or f" {m}" in line
                                                     for line in lines)) or ("#",)
    notes = ["decimal commas read as points"] if decimal_comma else []
    if encoding != "utf-8-sig":
        notes.append("file is not UTF-8: read as Latin-1")
    return Layout(shown, encoding, delimiter, decimal_comma, quoted, comments, start + 1, width, names, tuple(notes))


def _decode(head: bytes, size: int, shown: str) -> tuple[str, str]:
    """Text of the head and the encoding to read the record with; binary content is refused."""
    control = _CONTROL.search(head)
    if control is not None:
        raise RecordError(shown, f"binary content at byte {control.start()}: not a text record "
                          "(export it as CSV or text)")
    complete = head if size <= len(head) else head[:head.rfind(b"\n") + 1] or head
    try:
        return complete.decode("utf-8-sig"), "utf-8-sig"
    except UnicodeDecodeError:
        return complete.decode("latin-1"), "latin-1"


def _layout_of(line: str) -> tuple[str | None, int] | None:
    """Separator and number of cells that make every cell of ``line`` a number, or None."""
    best: tuple[str | None, int] | None = None
    for delimiter in _DELIMITERS:
        cells = cells_of(line, delimiter)
        if cells and all(_NUMBER.match(cell) for cell in cells) and (best is None or len(cells) > best[1]):
            best = (delimiter, len(cells))
    return best


def _no_data(lines: list[str]) -> str:
    """Why no rows of numbers were found in ``lines``, the start of a record."""
    content = [line for line in lines if cells_of(line, None)]
    if len(lines) >= MAX_HEADER_LINES and not any(_layout_of(line) for line in lines[:MAX_HEADER_LINES]):
        return f"no rows of numbers in the first {MAX_HEADER_LINES} lines: remove header or comment lines"
    if not content:
        return "only comments or blank lines near the start: no rows of numbers"
    rows = [(index, found) for index, line in enumerate(lines[:MAX_HEADER_LINES]) if (found := _layout_of(line))]
    for (first, (one, _)), (second, (other, _)) in itertools.pairwise(rows):
        if one != other:
            return (f"line {first + 1} is separated by {_separator_name(one)} and line {second + 1} by "
                    f"{_separator_name(other)}: use one separator throughout")
    return "no rows of numbers found near the start of the file"


def _separator_name(delimiter: str | None) -> str:
    return "blanks" if delimiter is None else {"\t": "tabs"}.get(delimiter, repr(delimiter))


def _data_start(lines: list[str]) -> tuple[int, str | None, int] | None:
    """Index of the first data line, its separator and its number of cells (None: no data found)."""
    run: list[tuple[int, tuple[str | None, int]]] = []
    changed = False
    for index, line in enumerate(lines):
        if not cells_of(line, None):
            continue
        found = _layout_of(line)
        if found is None or (run and found != run[0][1]):
            changed = changed or (found is not None and bool(run))
            run = []
            if found is None and index >= MAX_HEADER_LINES:
                break
        if found is not None:
            run.append((index, found))
        if len(run) == RUN_LINES:
            break
    if not run or (len(run) < RUN_LINES and (changed or run[-1][0] != _last_content(lines))):
        return None
    start, (delimiter, width) = run[0]
    for index in range(start - 1, -1, -1):
        cells = cells_of(lines[index], delimiter)
        if not cells:
            continue
        if len(cells) != width or 2 * sum(bool(_NUMBER.match(c)) for c in cells) < width:
            break
        start = index  # a data row with a bad cell: the reader reports it with its line
    return start, delimiter, width


def _last_content(lines: list[str]) -> int:
    return max((i for i, line in enumerate(lines) if cells_of(line, None)), default=-1)


def _names(line: str, delimiter: str | None, width: int) -> tuple[str, ...]:
    """Column names from the last header line if it has one per column, else '1', '2', ..."""
    cells = cells_of(line, delimiter) if line else []
    if delimiter is None and len(cells) > width:  # blanks separate: 'Time (ms) acc [g]' is two names
        merged: list[str] = []
        for cell in cells:
            if merged and cell[:1] in "([":
                merged[-1] += " " + cell
            else:
                merged.append(cell)
        cells = merged
    if len(cells) == width and all(cells):
        return tuple(cells)
    return tuple(str(i + 1) for i in range(width))
