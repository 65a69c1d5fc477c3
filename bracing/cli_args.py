"""The `bracing` command's argument handling: exit codes, bad input, every command's help
ending with the exit codes, values that must be given, and outputs refused before anything is
computed (design.md §8a)."""

from __future__ import annotations

import argparse
import sys

from bracing import scenario

EXIT_FAILS = 1
EXIT_BAD_INPUT = 2
EXIT_CODES = """exit codes (every command):
  0  every wall passes and no finding is a danger
  1  a wall fails a check or a finding is a danger (diff: see `bracing diff --help`;
     verify: a published value is not reproduced)
  2  bad input, or a file that cannot be read or written"""
DIFF_EXIT_CODES = """exit codes:
  0  the new file passes (as `bracing check` would) and no wall got worse as below
  1  the new file fails a check or has a danger finding, or a wall standing in both files
     got worse: its governing utilization rose and is now above 1.0, or its working-limit
     gust fell below the stand-down gust it had in the old file (a crew still reading the old
     stand-down gust would work in wind the revised wall cannot take); a foundation wall
     got worse the same way, or a day's planned fill is now above the height it allows
  2  bad input, or a file that cannot be read"""


class BadInput(Exception):
    """Input that cannot be used; the message names where it came from."""


def internal_error() -> int:
    """Say that the program failed (not the input), with the traceback in a log file in the
    system's temporary folder for the report; exit 2, never a traceback on the screen."""
    import tempfile
    import traceback

    try:
        fd, log = tempfile.mkstemp(prefix="bracing-internal-error-", suffix=".log")
        with open(fd, "w", encoding="utf-8") as handle:
            traceback.print_exc(file=handle)
        where = f"the details are in {log}"
    except OSError as exc:
        where = f"the details could not be written to a log ({exc.strerror})"
    print(f"bracing: internal error, please report it ({where}); no result was given",
          file=sys.stderr)
    return EXIT_BAD_INPUT


def given(convert=str):
    """An argparse type: the flag's value through `convert`, an empty value refused (an empty
    `--brace-capacity=` must never leave a brace unrated)."""
    def read(text: str):
        if not text.strip():
            raise argparse.ArgumentTypeError("empty value: give one (or leave the flag out)")
        return convert(text)
    read.__name__ = getattr(convert, "__name__", "value")  # argparse names it in its messages
    return read


def every_action(parser: argparse.ArgumentParser):
    """The arguments of `parser` and of its commands."""
    for action in parser._actions:
        yield action
        if isinstance(action, argparse._SubParsersAction):
            for command in dict.fromkeys(action.choices.values()):
                yield from every_action(command)


def flags_given(parser: argparse.ArgumentParser, args: argparse.Namespace) -> None:
    """Refuse a flag left without its value: Python 3.11's argparse reads `--kzt=--` as an empty
    list instead of refusing it."""
    for action in every_action(parser):
        if action.nargs is None and isinstance(getattr(args, action.dest, None), list):
            parser.error(f"argument {'/'.join(action.option_strings) or action.dest}: "
                         "expected one value")


def check_output(args: argparse.Namespace) -> None:
    """Refuse `-o` onto the site file, its forecast or a backup of one, a folder, a device or
    pipe, or into a folder that does not exist, before anything is computed."""
    output = getattr(args, "output", None)
    if output is None:
        return
    site = getattr(args, "site", None)
    try:
        scenario.check_output(output, scenario.inputs_of(site) if site else [])
    except OSError as exc:
        raise BadInput(f"-o {output}: {exc.strerror or exc}") from None


class Parser(argparse.ArgumentParser):
    """Every command's help ends with the exit codes (design.md §8a)."""

    def __init__(self, *args, **kwargs):
        kwargs.setdefault("epilog", EXIT_CODES)
        kwargs.setdefault("formatter_class", argparse.RawDescriptionHelpFormatter)
        super().__init__(*args, **kwargs)


def output_options(p: argparse.ArgumentParser) -> None:
    p.add_argument("--json", action="store_true", help="print one JSON object")
    p.add_argument("--units", choices=["us", "si"],
                   help="text output units (default: the site's [site] units, else us); "
                        "--json stays US with its documented keys")
