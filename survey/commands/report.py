"""``survey report``: write a survey's site report as Markdown, or as one HTML page.

    survey report flat9.json                      # flat9-report.md beside the survey
    survey report flat9.json --html               # flat9-report.html
    survey report flat9.json -o out/flat9.md --units ip --visit all

The report is written whole or not at all (the store's atomic writer); the survey itself,
its backup and its lock are never written over. A Markdown report links one psychrometric
chart per visit shown, written beside it as ``REPORT-chart-N.svg`` (atomically too); an HTML
report carries its charts inside the page.
"""

from __future__ import annotations

import argparse
from pathlib import Path

from survey.errors import InputError


def register(subparsers: argparse._SubParsersAction) -> None:
    report = subparsers.add_parser(
        "report",
        help="write the site report of a survey (Markdown, or HTML with --html)",
        description="Write the site report of a survey for the client: a summary, the scope, "
        "the conditions, each room's readings, findings and actions, drying "
        "progress over several visits, safety, the method and its sources. "
        "GitHub-flavoured Markdown by default; --html writes one self-contained "
        "page a browser prints to PDF.",
    )
    report.add_argument("file", metavar="FILE", help="the survey file (.json)")
    report.add_argument(
        "-o",
        "--output",
        metavar="REPORT",
        help="the report file to write (default: beside the survey, "
        "NAME-report.md, or NAME-report.html with --html); an existing "
        "report is replaced",
    )
    report.add_argument(
        "--units",
        choices=("si", "ip"),
        default=None,
        help="units of the report (default: the survey's unit system)",
    )
    report.add_argument(
        "--visit",
        metavar="N|all",
        default="last",
        help="which visit to report: its number (1 is the first), or all "
        "(default: the last visit; drying progress always shows every "
        "visit)",
    )
    report.add_argument(
        "--html", action="store_true", help="write one HTML page instead of Markdown"
    )
    report.set_defaults(handler=run_report)


def parse_visit(text: str) -> int | str:
    """``--visit``'s value: a visit number, ``"all"`` or ``"last"``."""
    shown = text.strip().lower()
    if shown in ("all", "last"):
        return shown
    try:
        number = int(shown)
    except ValueError:
        raise InputError("--visit", text, "a visit number (1 is the first) or all") from None
    return number


def default_output(survey_path: Path, html: bool) -> Path:
    """``NAME-report.md`` (or ``.html``) beside the survey file."""
    return survey_path.with_name(f"{survey_path.stem}-report.{'html' if html else 'md'}")


def _same_file(a: Path, b: Path) -> bool:
    import os

    try:
        return a.resolve() == b.resolve() or (b.exists() and os.path.samefile(a, b))
    except OSError:
        return False


def check_output(survey_path: Path, out: Path, shown: str) -> None:
    """Refuse to write a report over the survey, its backup or its lock, or as a .json."""
    from survey import store

    for protected in (survey_path, store.backup_path(survey_path), store.lock_path(survey_path)):
        if _same_file(protected, out):
            raise InputError(
                "--output",
                shown,
                "that is the survey file (or its backup or "
                "lock); choose another name for the report",
            )
    if out.suffix.lower() == ".json":
        raise InputError(
            "--output",
            shown,
            "a report is Markdown (.md) or HTML (.html), not .json; choose another name",
        )


def run_report(args: argparse.Namespace) -> int:
    import datetime as dt

    from survey import report, store
    from survey.safe_text import visible

    path = Path(args.file)
    visit = parse_visit(args.visit)
    out = Path(args.output) if args.output else default_output(path, args.html)
    check_output(path, out, args.output or str(out))
    survey = store.load_survey(path)
    options = report.ReportOptions(
        visit=visit,
        units=args.units,
        generated_at=dt.datetime.now(dt.UTC).strftime("%Y-%m-%d %H:%M UTC"),
        source_name=path.name,
        survey_dir=path.parent,
    )
    try:
        written = report.write_report(
            survey, options, out, args.html, lambda target: check_output(path, target, str(target))
        )
    except InputError as exc:
        if exc.field == "visit":
            raise exc.with_field("--visit") from None
        raise
    print(
        f"Wrote the report of {visible(path.name)} to {visible(out)}"
        f" ({'HTML' if args.html else 'Markdown'})."
    )
    if len(written) > 1:
        names = ", ".join(visible(p.name) for p in written[:-1])
        print(f"Charts beside it: {names}.")
    return 0
