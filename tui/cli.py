"""The `fieldmode` command line, generated from the check specs.

Exit status: 0 done; 2 bad input, an unreadable file, or a curves file that cannot or
may not be written (one line on stderr); 1 an unexpected fault (a bug, reported with the
version); 130 interrupted.
"""

from __future__ import annotations

import argparse
import gc
import json
import os
import sys
from collections.abc import Sequence
from typing import TYPE_CHECKING, NoReturn

from fieldmode.calc import __version__
from fieldmode.tui.printable import printable

if TYPE_CHECKING:
    from fieldmode.calc.framework.result import Result
    from fieldmode.calc.framework.spec import CheckSpec

# The core (numpy, pint, the checks) is imported where it is used: `fieldmode` with no
# arguments opens the app, which draws its first frame before it loads the unit reader.

EXIT_OK, EXIT_FAULT, EXIT_INPUT = 0, 1, 2


class _Parser(argparse.ArgumentParser):
    """An argument parser whose usage errors are one clear line and exit status 2."""

    def error(self, message: str) -> NoReturn:
        self.exit(EXIT_INPUT, f"{self.prog}: {message} (see {self.prog} --help)\n")


_GIVEN = "_options_given"
"""Attribute of the parsed namespace holding the destinations of the options given so far."""


class _Once(argparse.Action):
    """Store an option's value, refusing the option a second time, however it is spelled.

    argparse keeps the last of a repeated option, so `--mass 10t --mass 12t` would compute with
    12 t and say nothing. Abbreviations (`--ma`) and `--mass=10t` reach the same action, so each
    is caught; the message names the option as `--help` lists it.
    """

    def __call__(self, parser: argparse.ArgumentParser, namespace: argparse.Namespace,
                 values: object, option_string: str | None = None) -> None:
        given = namespace.__dict__.setdefault(_GIVEN, set())
        if self.dest in given:
            parser.error(f"{self.option_strings[0]} given more than once: give it once")
        given.add(self.dest)
        setattr(namespace, self.dest, values)


def build_parser(only: str | None = None) -> argparse.ArgumentParser:
    """The command line: `checks`, `convert`, and one subcommand per check spec.

    With ``only`` (a check id) just that check's subcommand is built, so running one
    check imports only its own module.
    """
    from fieldmode.calc.checks import CHECK_IDS, load
    from fieldmode.calc.framework.result import CAUTION

    parser = _Parser(prog="fieldmode", description="Structural-dynamics checks for site work. " + CAUTION,
                     epilog="exit status: 0 done, 2 bad input or file (one line on stderr), 1 a fault (a bug)")
    parser.add_argument("--version", action="version", version=f"fieldmode {__version__}")
    commands = parser.add_subparsers(dest="command", parser_class=_Parser)
    commands.add_parser("checks", help="list the checks and their inputs")
    conversion = commands.add_parser("convert", help="unit-safe conversion, e.g. convert '1450 rpm' Hz")
    conversion.add_argument("text", help="a value with its unit, quoted")
    conversion.add_argument("unit", nargs="?", help="target unit (default: SI)")
    for check_id in (only,) if only else CHECK_IDS:
        _add_check(commands, load(check_id))
    return parser


def _add_check(commands: argparse._SubParsersAction, spec: CheckSpec) -> None:  # type: ignore[type-arg]
    from fieldmode.calc.framework.spec import either

    sub = commands.add_parser(spec.id, help=_help(spec.summary),
                              description=_help(f"{spec.title}: {spec.summary}. {spec.caution}"))
    for spec_field in spec.fields:
        text = spec_field.label_with_unit
        if spec_field.choices:
            text += ": " + " | ".join(spec_field.choices)
        if spec_field.help:
            text += f"; {spec_field.help}"
        if spec_field.group:
            text += f" (alternative: one of the '{spec_field.group}' options)"
        for name, values in spec_field.used_when.items():
            text += f" (used when {spec.field(name).option} is {either(v or 'not given' for v in values)})"
        if spec_field is spec.record_field:
            text += "; a folder or several files run each record (in a folder: files ending .csv .txt .tsv .dat)"
            sub.add_argument(spec_field.name, nargs="+" if spec_field.required else "*", help=_help(text))
        elif spec_field.positional:
            sub.add_argument(spec_field.name, help=_help(text))
        else:
            sub.add_argument(spec_field.option, dest=spec_field.name, metavar="VALUE", action=_Once, help=_help(text))
    sub.add_argument("--json", action="store_true", help="print one JSON object (SI values, curves included)")
    sub.add_argument("--csv", metavar="FILE", action=_Once,
                     help="write the curves as CSV columns (SI) to FILE, or - for standard output instead of the text")
    sub.add_argument("--overwrite", action="store_true", help="with --csv: replace an existing FILE")
    sub.add_argument("--units", choices=("si", "us"), default="si", action=_Once, help="units of the text output")


def _help(text: str) -> str:
    """Text handed to argparse, which %-formats help: a literal '%' ('5 %') is written '%%'."""
    return text.replace("%", "%%")


def run(argv: Sequence[str]) -> int:
    """Run the command line on ``argv``; return the exit status."""
    if not argv:
        from fieldmode.tui.app import run_app  # the app's imports are kept off the command line's start-up

        return run_app()
    from fieldmode.calc.checks import CHECK_IDS, load

    parser = build_parser(argv[0] if argv[0] in CHECK_IDS else None)
    args, extra = parser.parse_known_args(argv)
    if extra:  # record files after an option ('decay a.csv --band "5 10" b.csv') are records too
        record = load(args.command).record_field if args.command in CHECK_IDS else None
        if record is None or any(text.startswith("-") and text != "-" for text in extra):
            parser.error(f"unrecognized arguments: {' '.join(extra)}")
        getattr(args, record.name).extend(extra)
    if args.command == "checks":
        print(list_checks())
        return EXIT_OK
    if args.command == "convert":
        return _convert(args.text, args.unit)
    spec = load(args.command)
    texts = {f.name: getattr(args, f.name) for f in spec.fields if getattr(args, f.name) is not None}
    record = spec.record_field
    if record is not None and texts.get(record.name):
        from fieldmode.tui.many import is_many, run_many

        if is_many(texts[record.name]):
            others = {name: text for name, text in texts.items() if name != record.name}
            return run_many(spec, texts[record.name], others, json_lines=args.json, csv=args.csv, system=args.units)
        texts[record.name] = texts[record.name][0]
    elif record is not None:
        texts.pop(record.name, None)  # an optional record field given no file
    if args.csv is not None:
        from fieldmode.tui.curves import STDOUT, check_target, write_curves

        check_target(args.csv, overwrite=args.overwrite, json=args.json)
    result = spec.evaluate(texts, args.units)
    if args.csv is not None:
        write_curves(spec, result, args.csv)
        if args.csv == STDOUT:
            return EXIT_OK
    if args.json:
        print(json.dumps(result.to_dict(), allow_nan=False))
    else:
        print(render_text(spec, result, args.units))
    return EXIT_OK


def _convert(text: str, unit: str | None) -> int:
    from fieldmode.calc.framework.units import convert, format_number

    quantity, note = convert(text, unit)
    shown = "" if str(quantity.units) == "dimensionless" else f" {quantity.units:~P}"
    if unit:  # the unit asked for, as typed: 'mil' stays mil, 'rpm' stays rpm
        shown = f" {unit.strip()}"
    print(f"{text} = {format_number(float(quantity.magnitude))}{shown}" + (f"  ({note})" if note else ""))
    return EXIT_OK


def list_checks() -> str:
    """Every check with its inputs, for `fieldmode checks`."""
    from fieldmode.calc.checks import SPECS

    lines = []
    width = max(len(f.option) for spec in SPECS for f in spec.fields) + 2
    for spec in SPECS:
        lines.append(f"{spec.id:<16}{spec.title}: {spec.summary}")
        for spec_field in spec.fields:
            where = spec_field.name if spec_field.positional else spec_field.option
            demo = f"  e.g. {spec_field.default!r}" if spec_field.default else ""
            lines.append(f"    {where:<{width}}{spec_field.label_with_unit}{demo}")
    return "\n".join(lines)


def render_text(spec: CheckSpec, result: Result, system: str = "si") -> str:
    """A check's result as plain text for the terminal."""
    from fieldmode.tui.present import flag_text, table_lines, value_lines

    lines = [f"{spec.title} ({spec.id})", "", "Inputs"]
    for name, typed in result.inputs.items():
        note = f"   [{printable(typed.note)}]" if typed.note else ""
        lines.append(f"  {spec.field(name).label:<30}{printable(typed.text)}{note}")
    lines += ["", "Results"]
    width = max((len(value.label) for value in result.values.values()), default=0) + 2
    for value in result.values.values():
        rows = value_lines(value, system)
        lines.append(f"  {value.label:<{width}}{rows[0]}")
        lines += [f"  {'':<{width}}{row}" for row in rows[1:]]
    if result.table:
        lines += ["", f"Curves by {spec.curve(result.table[0]).label.lower()}"]
        lines += [f"  {row}" for row in table_lines(result, system)]
    if result.flags:
        lines += ["", "Flags"] + [f"  {flag_text(flag)}" for flag in result.flags]
    lines += ["", "Method"] + [f"  {ref.method}: {ref.source}" for ref in result.references]
    lines += ["", f"Caution: {result.caution}"]
    return "\n".join(lines)


def pause_garbage_collection() -> None:
    """Stop the cyclic garbage collector while the program loads.

    Loading the core and Textual builds objects that live as long as the program; collecting
    garbage among them costs more than it frees. A command runs for a fraction of a second and
    never needs it; the app freezes what start-up built and collects again once its first
    results are on screen (``FieldmodeApp``).
    """
    gc.disable()


def main(argv: Sequence[str] | None = None) -> int:
    """Console entry point: run and turn failures into the exit-status contract."""
    if argv is None:
        pause_garbage_collection()
    try:
        return run(sys.argv[1:] if argv is None else argv)
    except SystemExit as done:  # argparse: --help, --version, or a usage error already reported
        return done.code if isinstance(done.code, int) else EXIT_INPUT
    except BrokenPipeError:  # output piped into a pager or `head` that closed early
        sys.stdout = open(os.devnull, "w")  # noqa: SIM115 (keeps the interpreter's final flush quiet)
        return EXIT_OK
    except KeyboardInterrupt:
        return 130
    except Exception as error:  # reported by kind in _failed; an unexpected one is a bug, said so
        return _failed(error)


def _failed(error: Exception) -> int:
    """Report a failure on one line of stderr; return its exit status."""
    line, status = failure(error)
    print(line, file=sys.stderr)
    return status


def failure(error: Exception) -> tuple[str, int]:
    """The one line that reports ``error`` and the exit status it gives (2 bad input or file, 1 a bug)."""
    from fieldmode.calc.framework.units import InputError
    from fieldmode.tui.curves import CurvesError
    from fieldmode.tui.many import ManyError

    if isinstance(error, InputError | CurvesError | ManyError):
        return f"fieldmode: {printable(str(error))}", EXIT_INPUT
    if isinstance(error, OSError):
        return printable(f"fieldmode: {error.strerror or error}: {error.filename or ''}".rstrip(": ")), EXIT_INPUT
    return (printable(f"fieldmode {__version__}: internal fault ({type(error).__name__}: {error}); "
                      "please report it with the command you ran"), EXIT_FAULT)


if __name__ == "__main__":
    sys.exit(main())
