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
import sys
from typing import NoReturn, Sequence

from survey.errors import InputError, SurveyFileError

#: Subcommand modules, in the order their commands appear in ``survey --help``.
COMMAND_MODULES = (
    "survey.commands.check",
    "survey.commands.files",
)

EXIT_OK = 0
EXIT_FILE_ERROR = 1
EXIT_INPUT_ERROR = 2


class _Parser(argparse.ArgumentParser):
    """An argument parser whose errors are one line on stderr and exit status 2."""

    def error(self, message: str) -> NoReturn:  # noqa: D401 - argparse's API
        self.exit(EXIT_INPUT_ERROR, f"{self.prog}: {message} (see {self.prog} --help)\n")


def build_parser() -> argparse.ArgumentParser:
    from survey import __version__

    parser = _Parser(
        prog="survey",
        description="Building condition survey: moist air, surface condensation and mould risk.",
    )
    parser.add_argument("--version", action="version", version=f"condition-survey {__version__}")
    subparsers = parser.add_subparsers(
        title="commands", metavar="COMMAND", parser_class=_Parser
    )
    for name in COMMAND_MODULES:
        try:
            module = importlib.import_module(name)
        except ModuleNotFoundError as exc:  # a face module not present in this build
            if exc.name != name:
                raise
            continue
        module.register(subparsers)
    return parser


def main(argv: Sequence[str] | None = None) -> int:
    parser = build_parser()
    args = parser.parse_args(argv)
    handler = getattr(args, "handler", None)
    if handler is None:
        parser.print_help(sys.stderr)
        return EXIT_INPUT_ERROR
    try:
        return int(handler(args) or EXIT_OK)
    except InputError as exc:
        print(f"survey: {exc}", file=sys.stderr)
        return EXIT_INPUT_ERROR
    except SurveyFileError as exc:
        print(f"survey: {exc}", file=sys.stderr)
        return EXIT_FILE_ERROR
    except KeyboardInterrupt:
        return 130


if __name__ == "__main__":  # pragma: no cover
    sys.exit(main())
