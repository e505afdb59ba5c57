"""Many records at once: `fieldmode CHECK FOLDER` or several record files, one run per record.

Any check whose spec has a record field (:attr:`CheckSpec.record_field`, a positional file) takes
a folder or several files there. Each record is computed on its own, in parallel on the machine's
cores, with the other options the same for all. Output is in the order of the arguments (a
folder's records sorted by name), whatever order the runs finish in: one JSON object per line
with ``--json`` (what ``--json`` prints for that file alone, with ``"file"`` first), else one
table. A record that fails is one line on stderr and the others go on; the exit status is then 2
(1 if any run met a fault of ours). Progress is written to stderr only when it is a terminal.
"""

from __future__ import annotations

import gc
import json
import os
import signal
import sys
import textwrap
from collections.abc import Iterator, Mapping, Sequence
from dataclasses import dataclass, field
from typing import TYPE_CHECKING, TextIO

from fieldmode.calc.records.source import STDIN
from fieldmode.tui.cli import EXIT_FAULT, EXIT_INPUT, EXIT_OK, failure
from fieldmode.tui.printable import printable

if TYPE_CHECKING:
    from fieldmode.calc.framework.result import Value
    from fieldmode.calc.framework.spec import CheckSpec

RECORD_SUFFIXES = (".csv", ".txt", ".tsv", ".dat")
"""Files in a folder taken as records (any case); files named on the command line are taken whatever
their name."""
WIDTH = 80
"""Columns the table keeps to."""
FILE_COLUMN_LEAST = 20
"""The file column keeps at least this many cells when result columns are chosen."""


class ManyError(ValueError):
    """A folder or list of records that cannot be run (no records, standard input among several, --csv)."""


@dataclass(frozen=True)
class Outcome:
    """One record's run: its JSON line, or the values for the table, or the line saying why it failed."""

    path: str
    status: int = EXIT_OK
    json_line: str = ""
    values: dict[str, Value] = field(default_factory=dict)
    worst_flag: str | None = None
    """The most serious flag level of the result ('warning', 'caution', 'info'), None without flags."""
    failure: str = ""


def is_many(typed: Sequence[str]) -> bool:
    """True when the record arguments are several, or a folder."""
    return len(typed) > 1 or any(os.path.isdir(os.path.expanduser(path)) for path in typed)


def record_paths(typed: Sequence[str]) -> list[str]:
    """The records to run, in order: each file as typed, each folder's records sorted by name.

    A folder is not searched below its own level; hidden files and files of other suffixes are
    left out. Raises :class:`ManyError` for standard input among several or a folder without records.
    """
    if STDIN in typed:
        raise ManyError("standard input ('-') is read as the only record, not with others")
    paths: list[str] = []
    for path in typed:
        folder = os.path.expanduser(path)
        if not os.path.isdir(folder):
            paths.append(path)
            continue
        try:
            names = sorted(entry.name for entry in os.scandir(folder) if _is_record(entry))
        except OSError as error:
            raise ManyError(f"folder {path!r} cannot be read ({error.strerror or error})") from error
        if not names:
            raise ManyError(f"no records in folder {path!r} (files ending {', '.join(RECORD_SUFFIXES)})")
        paths += [os.path.join(path, name) for name in names]
    return paths


def _is_record(entry: os.DirEntry[str]) -> bool:
    return (not entry.name.startswith(".") and entry.name.lower().endswith(RECORD_SUFFIXES)
            and entry.is_file())


def run_many(spec: CheckSpec, typed: Sequence[str], texts: Mapping[str, str], *, json_lines: bool,
             csv: str | None, system: str) -> int:
    """Run ``spec`` on every record the arguments ``typed`` name; print; return the exit status."""
    if csv is not None:
        raise ManyError("--csv writes the curves of one record: give one file, or use --json "
                        "(each line carries its curves)")
    record = spec.record_field
    assert record is not None, f"{spec.id} has no record field"
    paths = record_paths(typed)
    jobs = [{**texts, record.name: path} for path in paths]
    names = () if json_lines else spec.key_results
    gc.enable()  # paused while the command line loaded; a long run makes garbage to collect
    progress = Progress(sys.stderr, len(jobs))
    outcomes: list[Outcome] = []
    try:
        for outcome in _outcomes(spec.id, jobs, record.name, system, json_lines, names, progress):
            outcomes.append(outcome)
            if outcome.failure:
                progress.clear()
                print(outcome.failure, file=sys.stderr, flush=True)
            if json_lines and outcome.json_line:
                progress.clear()
                print(outcome.json_line, flush=True)
    except KeyboardInterrupt:
        progress.stop()  # the count stays on its line: how far the run got
        raise
    finally:
        progress.clear()
    if not json_lines:
        print("\n".join(summary_lines(spec, outcomes, system)))
    statuses = {outcome.status for outcome in outcomes}
    return EXIT_FAULT if EXIT_FAULT in statuses else EXIT_INPUT if EXIT_INPUT in statuses else EXIT_OK


def _outcomes(check_id: str, jobs: list[dict[str, str]], record: str, system: str, json_lines: bool,
              names: tuple[str, ...], progress: Progress) -> Iterator[Outcome]:
    """Each job's outcome in the order of ``jobs``, as soon as it and every one before it are done.

    The first record runs in this process: it loads what the check needs (the unit reader, scipy),
    which the worker processes then inherit instead of each loading it again. The others run on
    the machine's cores, in order of submission.
    """
    yield run_one(check_id, jobs[0], record, system, json_lines, names)
    progress.show(1)
    rest = jobs[1:]
    workers = min(os.cpu_count() or 1, len(rest))
    if workers <= 1:
        for done, job in enumerate(rest, 2):
            yield run_one(check_id, job, record, system, json_lines, names)
            progress.show(done)
        return
    import multiprocessing  # loaded only for several records
    from concurrent.futures import FIRST_COMPLETED, ProcessPoolExecutor, wait

    # Forked workers inherit what the first record loaded (where fork exists, as on Linux).
    forked = multiprocessing.get_context("fork") if "fork" in multiprocessing.get_all_start_methods() else None
    executor = ProcessPoolExecutor(max_workers=workers, mp_context=forked, initializer=_start_worker)
    try:
        futures = [executor.submit(run_one, check_id, job, record, system, json_lines, names) for job in rest]
        pending = set(futures)
        given = 0
        while given < len(futures):
            _, pending = wait(pending, return_when=FIRST_COMPLETED)
            progress.show(1 + len(futures) - len(pending))
            while given < len(futures) and futures[given].done():
                yield futures[given].result()
                given += 1
    except BaseException:  # Ctrl+C or a closed pipe: stop the workers now, not after their records
        for process in list(getattr(executor, "_processes", {}).values()):
            process.terminate()
        executor.shutdown(wait=True, cancel_futures=True)
        raise
    executor.shutdown(wait=True)


def _start_worker() -> None:
    """In each worker: Ctrl+C is the parent's to handle (it stops the workers)."""
    signal.signal(signal.SIGINT, signal.SIG_IGN)


def run_one(check_id: str, texts: Mapping[str, str], record: str, system: str, json_lines: bool,
            names: tuple[str, ...]) -> Outcome:
    """Compute one record (in a worker process); never raises for a bad record or a fault."""
    from fieldmode.calc.checks import load

    path = texts[record]
    try:
        result = load(check_id).evaluate(texts, system)
        if json_lines:
            return Outcome(path, json_line=json.dumps({"file": path, **result.to_dict()}, allow_nan=False))
    except Exception as error:  # one line per record, as `fieldmode CHECK FILE` would print it
        line, status = failure(error)
        if path not in line:  # 'fieldmode: PATH: message', so every line says which record it is about
            program, _, message = line.partition(": ")
            line = f"{program}: {printable(path)}: {message}"
        return Outcome(path, status=status, failure=line)
    levels = [flag.level for flag in result.flags]
    worst = next((level for level in ("warning", "caution", "info") if level in levels), None)
    shown = {name: value for name, value in result.values.items() if not names or name in names}
    return Outcome(path, values=shown, worst_flag=worst)


def summary_lines(spec: CheckSpec, outcomes: Sequence[Outcome], system: str) -> list[str]:
    """The table of many records: the file, the check's key results that fit 80 columns, the worst flag;
    then a legend, the count and the caution, all within 80 columns."""
    from fieldmode.tui.present import LEVEL_MARKS, LEVEL_WORDS

    folder = _common_folder([outcome.path for outcome in outcomes])
    shown = {o.path: printable(os.path.basename(o.path) if folder else o.path) for o in outcomes}
    done = [outcome for outcome in outcomes if not outcome.failure]
    flags: Column = ("flags", "", [LEVEL_MARKS[o.worst_flag] if o.worst_flag else "" for o in done])
    columns = [*_fitting(_columns(spec, done, system)), flags]
    widths = [_width(column) for column in columns]
    room = WIDTH - 2 - sum(2 + width for width in widths)
    file_width = max(len("file"), min(room, max(map(len, shown.values()))))
    rows = iter(zip(*(cells for _, _, cells in columns), strict=True))
    table = [_row("file", [name for name, _, _ in columns], file_width, widths),
             _row("", [unit for _, unit, _ in columns], file_width, widths)]
    for outcome in outcomes:
        if outcome.failure:
            width = min(file_width, WIDTH - 4 - len(REFUSED))
            table.append(f"  {_shortened(shown[outcome.path], width).ljust(width)}  {REFUSED}")
        else:
            table.append(_row(_shortened(shown[outcome.path], file_width), list(next(rows)), file_width, widths))
    legend = ", ".join(f"{LEVEL_MARKS[level]} {LEVEL_WORDS[level]}" for level in ("warning", "caution", "info"))
    refused = len(outcomes) - len(done)
    prose = [f"flags: the most serious of a record's flags ({legend}); run the record alone to read them.",
             f"{len(outcomes)} records: {len(done)} done" + (f", {refused} refused" if refused else "") + ".",
             f"Caution: {spec.caution}"]
    where = f" in {printable(folder)}" if folder else ""
    return (textwrap.wrap(f"{spec.title} ({spec.id}): {len(outcomes)} records{where}", WIDTH) + [""] + table + [""]
            + [line for text in prose for line in textwrap.wrap(text, WIDTH)])


def _common_folder(paths: Sequence[str]) -> str:
    """The folder every path is in, as typed ('' when they differ or have none): the table shows names."""
    folders = {os.path.dirname(path) for path in paths}
    return folders.pop() if len(folders) == 1 else ""


REFUSED = "refused (see stderr)"
"""The table's row for a record that failed; the reason is its line on stderr."""


Column = tuple[str, str, list[str]]
"""A table column: its header (the result's name), its unit, and one cell per record done."""


def _columns(spec: CheckSpec, done: Sequence[Outcome], system: str) -> list[Column]:
    """Every result column the records give, in the order of the key results (or of the results)."""
    import numpy as np

    from fieldmode.tui.present import column_text, value_text

    names = list(spec.key_results) or list(dict.fromkeys(name for o in done for name in o.values))
    columns = []
    for name in names:
        found = [o.values.get(name) for o in done]
        present = [value for value in found if value is not None]
        if not present:
            continue
        kind = present[0].kind
        if all(value.number() is not None and value.kind == kind for value in present):
            numbers = np.array([np.nan if value is None else value.number() for value in found], dtype=float)
            unit, texts = column_text(numbers[np.isfinite(numbers)], kind, system)
            cells = iter(texts)
            columns.append((name, unit, [next(cells) if np.isfinite(n) else "-" for n in numbers]))
        else:
            columns.append((name, "", ["-" if value is None else value_text(value, system, most=2)
                                       for value in found]))
    return columns


def _fitting(columns: list[Column]) -> list[Column]:
    """The leading columns that leave the file column at least its least width within 80 columns."""
    room = WIDTH - 2 - FILE_COLUMN_LEAST - (2 + len("flags"))
    kept = []
    for column in columns:
        room -= 2 + _width(column)
        if room < 0:
            break
        kept.append(column)
    return kept


def _width(column: Column) -> int:
    name, unit, cells = column
    return max(len(name), len(unit), *map(len, cells), 1)


def _row(first: str, cells: list[str], file_width: int, widths: list[int]) -> str:
    """One line of the table: the file left-aligned, the other cells right-aligned."""
    rest = "  ".join(cell.rjust(width) for cell, width in zip(cells, widths, strict=True))
    return f"  {first.ljust(file_width)}  {rest}".rstrip()


def _shortened(text: str, width: int) -> str:
    """``text`` in at most ``width`` cells, keeping its end (the file name): '...ay_03.csv'."""
    return text if len(text) <= width else "..." + text[len(text) - width + 3:]


class Progress:
    """'7/20 records' on one line of a terminal, rewritten as records finish; nothing elsewhere."""

    def __init__(self, stream: TextIO, total: int) -> None:
        self.stream, self.total = stream, total
        self.shown = False
        self.on = total > 1 and stream.isatty()

    def show(self, done: int) -> None:
        if self.on:
            self.stream.write(f"\r{done}/{self.total} records")
            self.stream.flush()
            self.shown = True

    def stop(self) -> None:
        """End the count's line where it is (interrupted: the count says how far the run got)."""
        if self.shown:
            self.stream.write("\n")
            self.stream.flush()
            self.shown = False

    def clear(self) -> None:
        if self.shown:
            self.stream.write("\r" + " " * len(f"{self.total}/{self.total} records") + "\r")
            self.stream.flush()
            self.shown = False
