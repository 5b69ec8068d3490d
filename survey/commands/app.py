"""The app's commands: ``survey open FILE``, ``survey demo``, and ``survey`` alone (the start
screen). Textual is imported inside the handlers, so other commands never load it."""

from __future__ import annotations

import argparse
import sys


def register(subparsers: argparse._SubParsersAction) -> None:
    opened = subparsers.add_parser(
        "open",
        help="open a survey file in the walk-through app",
        description="Open a survey in the app. A survey another program has open is shown "
        "read-only, naming who holds it; a file that does not load is left as "
        "it is.",
    )
    opened.add_argument("file", metavar="FILE", help="the survey file (.json)")
    opened.set_defaults(handler=run_open)
    demo = subparsers.add_parser(
        "demo",
        help="open an invented example survey in the app",
        description="Copy an example site (an invented flat with mould) to your data folder "
        "and open it; the copy is kept between runs, the bundled file is never "
        "edited.",
    )
    demo.add_argument(
        "--fresh",
        action="store_true",
        help="start again from the bundled example (your demo copy is replaced)",
    )
    demo.set_defaults(handler=run_demo)


def _need_terminal() -> int | None:
    if not (sys.stdin.isatty() and sys.stdout.isatty()):
        print(
            "survey: the app needs a terminal; for scripts use `survey check` or the "
            "file commands (see survey --help)",
            file=sys.stderr,
        )
        return 2
    return None


def run_start(args: argparse.Namespace | None = None) -> int:
    from survey.app import make_app

    refused = _need_terminal()
    if refused is not None:
        return refused
    make_app().run()
    return 0


def run_open(args: argparse.Namespace) -> int:
    from pathlib import Path

    from survey import store
    from survey.app import make_app

    path = Path(args.file)
    store.load_survey(path)  # a file that fails to load: the store's message, exit 1
    refused = _need_terminal()
    if refused is not None:
        return refused
    make_app(path).run()
    return 0


def run_demo(args: argparse.Namespace) -> int:
    from survey.app import make_app

    refused = _need_terminal()
    if refused is not None:
        return refused
    make_app(demo=True, fresh_demo=args.fresh).run()
    return 0
