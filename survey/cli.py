"""The ``survey`` command: a thin dispatcher over the subcommands in ``survey.commands``.

Each subcommand module exposes ``register(subparsers)``, which adds its parser and sets
``handler`` to a function ``(args) -> int``. Modules keep heavy imports (pint, Rich, the
store) inside their handlers so that ``survey check --json`` starts fast.

Errors from the core arrive as ``InputError`` (exit status 2) or ``SurveyFileError``
(exit status 1) and are printed as one line on stderr, never as a traceback.
"""

from __future__ import annotations

import argparse
import importlib
import os
import re
import sys
from collections.abc import Sequence
from typing import NoReturn

from survey.errors import InputError, SurveyFileError

#: Subcommand modules, in the order their commands appear in ``survey --help``.
COMMAND_MODULES = (
    "survey.commands.check",
    "survey.commands.dehumidifier",
    "survey.commands.files",
    "survey.commands.report",
    "survey.commands.mould_index",
    "survey.commands.app",
)

EXIT_OK = 0
EXIT_FILE_ERROR = 1
EXIT_INPUT_ERROR = 2


class _Parser(argparse.ArgumentParser):
    """An argument parser whose errors are one line on stderr and exit status 2."""

    def error(self, message: str) -> NoReturn:
        self.exit(EXIT_INPUT_ERROR, f"{self.prog}: {message} (see {self.prog} --help)\n")


def build_parser() -> argparse.ArgumentParser:
    from survey import __version__

    parser = _Parser(
        prog="survey",
        description="Building condition survey: moist air, surface condensation and mould risk.",
    )
    parser.add_argument("--version", action="version", version=f"condition-survey {__version__}")
    subparsers = parser.add_subparsers(title="commands", metavar="COMMAND", parser_class=_Parser)
    for name in COMMAND_MODULES:
        importlib.import_module(name).register(subparsers)
    return parser


_NEGATIVE_VALUE = re.compile(r"^[-\u2212](\d|[.,]\d)")


def _value_options(parser: argparse.ArgumentParser) -> set[str]:
    """Every ``--option`` (of the parser and its subcommands) that takes a value."""
    found: set[str] = set()
    for action in parser._actions:
        if isinstance(action, argparse._SubParsersAction):
            for sub in action.choices.values():
                found |= _value_options(sub)
        elif action.nargs != 0 and action.option_strings:
            found.update(o for o in action.option_strings if o.startswith("--"))
    return found


def join_negative_values(argv: Sequence[str], value_options: set[str]) -> list[str]:
    """``--outdoor-temp -3C`` becomes ``--outdoor-temp=-3C``.

    argparse takes ``-3`` as a value but ``-3C``, ``-2,5`` or ``-23F`` for an unknown
    option; winter readings are exactly these, so they are joined to their option first."""
    joined: list[str] = []
    tokens = list(argv)
    index = 0
    while index < len(tokens):
        token = tokens[index]
        if (
            token in value_options
            and index + 1 < len(tokens)
            and _NEGATIVE_VALUE.match(tokens[index + 1])
        ):
            joined.append(f"{token}={tokens[index + 1]}")
            index += 2
            continue
        joined.append(token)
        index += 1
    return joined


def _subcommands(parser: argparse.ArgumentParser) -> dict[str, argparse.ArgumentParser]:
    for action in parser._actions:
        if isinstance(action, argparse._SubParsersAction):
            return dict(action.choices)
    return {}


def check_unknown_options(parser: argparse.ArgumentParser, tokens: Sequence[str]) -> None:
    """Refuse an option the chosen command does not have, suggesting the nearest one.

    argparse would first complain about a missing required option (``--air-tmp 21`` reads
    as "--air-temp is required"), which hides the typo."""
    import difflib

    commands = _subcommands(parser)
    command = next((t for t in tokens if t in commands), None)
    target = commands.get(command, parser)
    known = {o for action in target._actions for o in action.option_strings}
    for token in tokens:
        if token == "--":
            break
        if not token.startswith("--"):
            continue
        name = token.split("=", 1)[0]
        if name in known:
            continue
        nearest = difflib.get_close_matches(name, sorted(known), n=1, cutoff=0.6)
        hint = f"; did you mean {nearest[0]}?" if nearest else ""
        target.error(f"unknown option {name}{hint}")


def _safe(exc: Exception) -> str:
    """An error as one short line with every control character made visible."""
    from survey.safe_text import shorten

    return shorten(str(exc), 600)


def main(argv: Sequence[str] | None = None) -> int:
    parser = build_parser()
    tokens = sys.argv[1:] if argv is None else list(argv)
    if not tokens:  # `survey` alone opens the app's start screen
        from survey.commands.app import run_start

        return run_start()
    check_unknown_options(parser, tokens)
    args = parser.parse_args(join_negative_values(tokens, _value_options(parser)))
    handler = getattr(args, "handler", None)
    if handler is None:
        parser.print_help(sys.stderr)
        return EXIT_INPUT_ERROR
    try:
        return int(handler(args) or EXIT_OK)
    except InputError as exc:
        print(f"survey: {_safe(exc)}", file=sys.stderr)
        return EXIT_INPUT_ERROR
    except SurveyFileError as exc:
        print(f"survey: {_safe(exc)}", file=sys.stderr)
        return EXIT_FILE_ERROR
    except KeyboardInterrupt:
        print(
            "survey: interrupted. Survey files are saved whole or not at all, so each is "
            "as it was before or as last saved.",
            file=sys.stderr,
        )
        return 130
    except BrokenPipeError:
        # The reader went away (`survey check --json | head`): stop quietly. Point stdout at
        # devnull so the interpreter's final flush does not raise again.
        devnull = os.open(os.devnull, os.O_WRONLY)
        os.dup2(devnull, sys.stdout.fileno())
        return EXIT_OK


if __name__ == "__main__":  # pragma: no cover
    sys.exit(main())
