"""Survey-file commands: ``new``, ``validate``, ``export``, ``import-log`` and ``schema``.

    survey new flat9.json --site "CS-25-004 Flat 9" --address "Flat 9, 1 Example Row, Sampletown"
    survey validate flat9.json
    survey export flat9.json --csv flat9-readings.csv
    survey import-log flat9.json --room "Main bedroom" --csv bedroom-logger.csv
    survey schema > survey.schema.json

This module is the face only: argparse, the option names and printing. The CSV is made by
:mod:`survey.export`, a logger's file is read by :mod:`survey.logimport` and merged into the
survey by :mod:`survey.logseries`; their errors name quantities, which are re-labelled here
with the options' names. Everything printed that a person or a file supplied (names, labels,
file names, headers, skipped-row texts, error details) goes through
:mod:`survey.safe_text`, so it never drives the terminal; nothing here is printed as markup.

The store, pint and psychrolib are imported inside the handlers, so that registering these
commands costs nothing when another command runs.
"""

from __future__ import annotations

import argparse
import functools
import os
import sys
from collections.abc import Callable
from pathlib import Path
from typing import TYPE_CHECKING, Any

from survey.errors import InputError, SurveyFileError
from survey.safe_text import shorten, visible

if TYPE_CHECKING:
    from survey.model import Survey


def register(subparsers: argparse._SubParsersAction) -> None:
    new = subparsers.add_parser(
        "new",
        help="create a new, empty survey file",
        description="Create a survey file for one site, with no rooms or visits yet. It will "
        "not overwrite an existing file.",
    )
    new.add_argument("file", metavar="FILE", help="the survey file to create (.json)")
    new.add_argument(
        "--site",
        required=True,
        metavar="TEXT",
        help="site reference or short name, e.g. a job number and address",
    )
    new.add_argument(
        "--address", default="", metavar="TEXT", help="the site's postal address (default: empty)"
    )
    new.add_argument(
        "--client",
        default="",
        metavar="TEXT",
        help="who the survey is for, e.g. the owner, tenant or landlord (default: empty)",
    )
    new.add_argument(
        "--inspector",
        default="",
        metavar="TEXT",
        help="who carries out the survey (default: empty)",
    )
    new.add_argument(
        "--purpose",
        default="damp_complaint",
        metavar="PURPOSE",
        help="damp_complaint (default), drying_check, pre_purchase, pre_coating, routine or other",
    )
    new.add_argument(
        "--units",
        choices=("si", "ip"),
        default="si",
        help="unit system for display: si (°C, hPa, m; the default) or ip "
        "(°F, inHg, ft); numbers are stored in SI either way",
    )
    where = new.add_mutually_exclusive_group()
    where.add_argument(
        "--altitude",
        metavar="Z",
        help="site altitude, for the standard-atmosphere pressure, e.g. 120 "
        "(m, or ft with --units ip) or 400 ft",
    )
    where.add_argument(
        "--pressure",
        metavar="P",
        help="measured barometric pressure, e.g. 1002 (hPa, or inHg with "
        "--units ip) or 29.6 inHg; without it or --altitude, sea level",
    )
    new.add_argument(
        "--no-open",
        action="store_true",
        help="only create the file; without this, the app opens on it when run in a terminal",
    )
    new.set_defaults(handler=run_new)

    validate = subparsers.add_parser(
        "validate",
        help="check survey files; exit status 1 if any is bad",
        description="Load each survey file and report whether it is valid. Prints one line "
        "per file; problems name the place in the file and what is wrong.",
    )
    validate.add_argument(
        "files", nargs="+", metavar="FILE", help="one or more survey files (.json) to check"
    )
    validate.set_defaults(handler=run_validate)

    export = subparsers.add_parser(
        "export",
        help="write every reading with derived values to a CSV file",
        description="One row per reading (outdoor air, room air, surfaces, materials, "
        "dehumidifier outlets, logger samples) with dew and frost point, "
        "humidity ratio, surface RH and the margin to the dew point, for "
        "spreadsheets. Columns are named like the keys of survey check --json.",
    )
    export.add_argument("file", metavar="FILE", help="the survey file to export")
    export.add_argument(
        "--csv",
        required=True,
        metavar="OUT",
        help="CSV file to write (replaced whole, UTF-8 with a byte-order "
        "mark), or - for standard output",
    )
    export.add_argument(
        "--units",
        choices=("si", "ip"),
        default=None,
        help="units of the columns: si (°C, Pa, g/kg) or ip (°F, inHg, gr/lb); "
        "default: the survey's unit system",
    )
    export.add_argument("--no-logs", action="store_true", help="leave out logger samples")
    export.set_defaults(handler=run_export)

    log = subparsers.add_parser(
        "import-log",
        help="add a data logger's CSV (time, temperature, RH) to a survey",
        description="Read a logger's CSV export and add its samples to the survey for one room "
        "(or outdoors). The time, temperature and RH columns are found from what "
        "the header says, with or without title lines above it; comma, "
        "semicolon or tab separators, decimal commas, several date layouts and "
        "°C/°F are recognised; rows that cannot be used are listed with the reason.",
    )
    log.add_argument("file", metavar="FILE", help="the survey file")
    target = log.add_mutually_exclusive_group(required=True)
    target.add_argument("--room", metavar="NAME", help="room id or name the logger was in")
    target.add_argument("--outdoor", action="store_true", help="the logger was outdoors")
    log.add_argument("--csv", required=True, metavar="LOG", help="the logger's CSV file")
    log.add_argument(
        "--instrument", metavar="ID", help="id of the logger in the survey's instruments"
    )
    log.add_argument(
        "--surface",
        metavar="LABEL",
        help="the logger's probe sat on this surface (a surface reading's location in the "
        "room): its readings are the surface temperature and RH",
    )
    log.add_argument(
        "--temp-unit",
        choices=("c", "f"),
        default=None,
        help="temperature unit of the file's readings: needed when the header "
        "does not say; when it does, this wins and the summary says so",
    )
    log.add_argument(
        "--date-order",
        choices=("dmy", "mdy", "ymd"),
        default=None,
        help="order of day, month and year when the dates leave it open",
    )
    log.add_argument(
        "--dry-run", action="store_true", help="read and report, but do not change the survey"
    )
    log.set_defaults(handler=run_import_log)

    schema = subparsers.add_parser(
        "schema",
        help="print the JSON Schema of survey files",
        description="Print the JSON Schema of the survey file format, generated from the model.",
    )
    schema.set_defaults(handler=run_schema)


def _safe_errors(handler: Callable[[argparse.Namespace], int]) -> Callable[..., int]:
    """Errors leave the handler with every value and path made visible and shortened, so
    that a message quoting a name or a file never sends control characters to the terminal
    and stays one short line."""

    @functools.wraps(handler)
    def run(args: argparse.Namespace) -> int:
        try:
            return handler(args)
        except InputError as exc:
            raise InputError(
                visible(exc.field), shorten(exc.value, 120), shorten(exc.allowed, 400)
            ) from None
        except SurveyFileError as exc:
            raise SurveyFileError(
                shorten(exc.path, 200), shorten(exc.where, 120), shorten(exc.problem, 400)
            ) from None

    return run


def _plural(n: int, word: str) -> str:
    return f"{n} {word}{'' if n == 1 else 's'}"


# --- new ---------------------------------------------------------------------------------

_SITE_OPTIONS = {
    "reference": "--site",
    "address": "--address",
    "client": "--client",
    "inspector": "--inspector",
    "purpose": "--purpose",
    "altitude_m": "--altitude",
    "pressure_pa": "--pressure",
    "unit_system": "--units",
}


@_safe_errors
def run_new(args: argparse.Namespace) -> int:
    from survey import psychro, store, units

    fields: dict[str, Any] = {
        "address": args.address,
        "client": args.client,
        "inspector": args.inspector,
        "purpose": args.purpose,
        "unit_system": args.units,
    }
    try:
        if args.altitude is not None:
            fields["altitude_m"] = round(
                units.parse_length(args.altitude, "altitude", args.units), 2
            )
            psychro.pressure_from_altitude_m(fields["altitude_m"])
        if args.pressure is not None:
            fields["pressure_pa"] = units.parse_pressure(args.pressure, "pressure", args.units)
            psychro.check_pressure(fields["pressure_pa"])
    except InputError as exc:
        option = "--altitude" if args.altitude is not None else "--pressure"
        raise InputError(option, getattr(args, option[2:]), exc.allowed) from None
    try:
        survey = store.new_survey(args.site, **fields)
    except InputError as exc:
        name = exc.field.split(".")[-1]
        raise exc.with_field(_SITE_OPTIONS.get(name, exc.field)) from None
    path = Path(args.file)
    if path.exists():
        raise SurveyFileError(
            path, "", "already exists; choose another name (new never overwrites a file)"
        )
    store.save_survey(survey, path, exclusive=True)
    print(f"Created {visible(path)} for site '{shorten(survey.site.reference)}'.")
    if not args.no_open and sys.stdin.isatty() and sys.stdout.isatty():
        from survey.app import make_app

        make_app(path).run()
    return 0


# --- validate ----------------------------------------------------------------------------


def _count_readings(survey: Survey) -> dict[str, int]:
    counts = {"air": 0, "surface": 0, "material": 0, "logger": 0}
    for visit in survey.visits:
        counts["air"] += visit.outdoor is not None
        for room_visit in visit.rooms:
            counts["air"] += room_visit.air is not None
            counts["air"] += sum(e.outlet is not None for e in room_visit.equipment)
            counts["surface"] += len(room_visit.surfaces)
            counts["material"] += len(room_visit.materials)
    counts["logger"] = sum(len(log.samples) for log in survey.logs)
    return counts


@_safe_errors
def run_validate(args: argparse.Namespace) -> int:
    from survey import store
    from survey.model import SCHEMA_VERSION

    status = 0
    for name in args.files:
        path = Path(name)
        try:
            survey = store.load_survey(path)
        except SurveyFileError as exc:
            text_problem = any(
                words in exc.problem for words in ("not valid JSON", "UTF-16", "not UTF-8")
            )
            hint = _csv_hint(path) if text_problem else ""
            print(f"survey: {_error_line(exc)}{hint}", file=sys.stderr)
            status = 1
            continue
        counts = _count_readings(survey)
        version = store.read_schema_version(path)
        upgraded = (
            f"; schema {version}, upgraded in memory: the next save writes version {SCHEMA_VERSION}"
            if version != SCHEMA_VERSION
            else ""
        )
        holder = store.read_lock(path)
        locked = (
            ""
            if holder is None
            else f"; {visible(store.describe_lock(holder, store.lock_path(path).name))}"
        )
        print(
            f"{visible(path)}: ok ({_plural(len(survey.rooms), 'room')}, "
            f"{_plural(len(survey.visits), 'visit')}, "
            f"{_plural(counts['air'], 'air reading')}, "
            f"{_plural(counts['surface'], 'surface reading')}, "
            f"{_plural(counts['material'], 'material reading')}, "
            f"{_plural(counts['logger'], 'logger sample')}{upgraded}{locked})"
        )
    return status


def _error_line(exc: SurveyFileError) -> str:
    """A file error as one short line with nothing in it that could drive a terminal."""
    location = f" at {shorten(exc.where, 120)}" if exc.where else ""
    return f"{shorten(exc.path, 200)}{location}: {shorten(exc.problem, 400)}"


def _csv_hint(path: Path) -> str:
    """A pointer to import-log when a file that is not JSON looks like a logger's CSV."""
    try:
        with open(path, "rb") as handle:
            head = handle.read(4096)
    except OSError:
        return ""
    if head.startswith((b"\xff\xfe", b"\xfe\xff")):
        text = head.decode("utf-16", errors="replace")
    else:
        text = head.decode("utf-8", errors="replace")
    first = next((line for line in text.splitlines() if line.strip()), "").strip()
    if path.suffix.lower() not in (".csv", ".tsv", ".txt") and not (
        first and first[0] not in "{[" and any(sep in first for sep in ",;\t")
    ):
        return ""
    return (
        f". This looks like a CSV file (a data logger's export?), not a survey; a logger's "
        f"CSV is added to a survey with: survey import-log SURVEY.json --room NAME "
        f"--csv {shorten(path, 200)}"
    )


# --- export ------------------------------------------------------------------------------


def _same_file(a: Path, b: Path) -> bool:
    try:
        return a.resolve() == b.resolve() or (b.exists() and os.path.samefile(a, b))
    except OSError:
        return False


@_safe_errors
def run_export(args: argparse.Namespace) -> int:
    from survey import export, store

    path = Path(args.file)
    survey = store.load_survey(path)
    system = args.units or survey.site.unit_system
    if args.csv == "-":
        # On a terminal the CSV is for reading: control characters in the survey's text are
        # shown as escapes. Into a pipe or a file it is data, kept exact (but never a NUL).
        count = export.write_csv(
            survey, sys.stdout, system, not args.no_logs, for_terminal=sys.stdout.isatty()
        )
        sys.stdout.flush()
        print(f"{_plural(count, 'row')}{_empty_hint(survey, count, args.no_logs)}", file=sys.stderr)
        return 0
    out = Path(args.csv)
    if (
        _same_file(path, out)
        or _same_file(store.backup_path(path), out)
        or _same_file(store.lock_path(path), out)
    ):
        raise InputError(
            "--csv",
            args.csv,
            "that is the survey file (or its backup); choose another name for the CSV",
        )
    count = export.save_csv(survey, out, system, not args.no_logs)
    print(
        f"Wrote {_plural(count, 'row')} to {visible(out)} "
        f"({'SI' if system == 'si' else 'IP'} units){_empty_hint(survey, count, args.no_logs)}."
    )
    return 0


def _empty_hint(survey: Survey, count: int, no_logs: bool) -> str:
    """Why an export has no rows, when it has none."""
    if count:
        return ""
    has_logs = any(log.samples for log in survey.logs)
    if not survey.visits and not has_logs:
        return (
            "; only the header row: the survey has no visits or logger readings yet "
            "(record a visit, or add a logger's CSV with survey import-log)"
        )
    if has_logs and no_logs:
        return (
            "; only the header row: the survey's visits hold no readings, and --no-logs "
            "left out the logger samples"
        )
    return "; only the header row: the survey's visits hold no readings yet"


# --- import-log --------------------------------------------------------------------------

#: The quantities the core's errors name, and the option of this command for each.
_IMPORT_OPTIONS = {
    "logger file": "--csv",
    "temperature unit": "--temp-unit",
    "date order": "--date-order",
    "room": "--room",
    "instrument": "--instrument",
    "surface": "--surface",
}


def _describe_step(step: Any) -> str:
    if step is None:
        return ""
    seconds = int(step.total_seconds())
    if seconds % 3600 == 0:
        return f", every {seconds // 3600} h"
    if seconds % 60 == 0:
        return f", every {seconds // 60} min"
    return f", every {seconds} s"


_UNIT_FROM = {
    "header": "unit from the header",
    "units row": "unit from the units row",
    "stated": "unit as given by --temp-unit",
}


def _open_for_import(path: str) -> Any:
    """The survey's editing session, with what the command line can do while it is locked."""
    from survey import store

    try:
        return store.open_for_editing(path)
    except store.SurveyLocked as exc:
        if exc.holder is None or store.lock_is_stale(exc.holder):
            raise
        raise store.SurveyLocked(
            exc.path,
            exc.holder,
            exc.problem.replace(
                "Reading the survey works meanwhile",
                "survey validate and survey export only read the survey "
                "and work meanwhile; import-log --dry-run shows what would "
                "be imported",
            ),
        ) from None


@_safe_errors
def run_import_log(args: argparse.Namespace) -> int:
    try:
        return _import_log(args)
    except InputError as exc:
        option = _IMPORT_OPTIONS.get(exc.field)
        if option is None:
            raise
        relabelled = exc.with_field(option)
        if option == "--csv" and exc.value == Path(args.csv).name:
            relabelled = InputError(option, args.csv, exc.allowed)
        raise relabelled from None


def _import_surface(survey: Survey, room_id: str | None, label: str | None) -> str | None:
    """The recorded surface label ``--surface`` names (None without it)."""
    if label is None:
        return None
    if room_id is None:
        raise InputError("surface", label, "a logger outdoors sat on no surface of a room")
    from survey.mould_series import resolve_surface

    return resolve_surface(survey, room_id, label)


def _import_log(args: argparse.Namespace) -> int:
    from survey import logimport, logseries, store

    log_path = Path(args.csv)
    # The survey first: a survey file that does not load is the first thing to hear about.
    session = None if args.dry_run else _open_for_import(args.file)
    try:
        survey = session.survey if session is not None else store.load_survey(args.file)
        room_id = logseries.room_id_for(survey, None if args.outdoor else args.room)
        logseries.check_instrument(survey, args.instrument)
        surface = _import_surface(survey, room_id, args.surface)
        result = logimport.read_logger_csv(
            store.read_input_file(log_path, "logger file"),
            temp_unit=args.temp_unit,
            date_order=args.date_order,
            surface=surface is not None,
        )
        plan = logseries.plan_import(
            survey,
            result,
            room=room_id,
            source=log_path.name,
            instrument=args.instrument,
            surface=surface,
        )
        where = visible(logseries.where(survey, room_id))
        sources = visible(", ".join(plan.overlapping_sources))
        name = visible(log_path.name)
        if plan.series is None:
            print(
                f"Nothing to import: all {_plural(plan.repeated, 'sample')} of {name} "
                f"({logseries.span(result.samples)}) are already in the survey for {where}, "
                f"from {sources}; the survey was not changed."
            )
            if not args.instrument:
                print(
                    "  If this is a second logger in the same room, give each logger's "
                    "series an --instrument id to keep them apart."
                )
            return 0
        if session is not None:
            import msgspec

            session.save(msgspec.structs.replace(survey, logs=[*survey.logs, plan.series]))
    finally:
        if session is not None:
            session.close()

    samples = plan.samples
    unit = "°F, converted to °C" if result.temperature_unit == "f" else "°C"
    verb = "Would import" if args.dry_run else "Imported"
    span = logseries.span(samples)
    if surface is not None:
        where = f"{where}, on the surface {visible(repr(surface))}"
    print(
        f"{verb} {_plural(len(samples), 'sample')} from {name} into {where}"
        f"{' ' if span.startswith('at ') else ': '}{span}{_describe_step(result.interval)}."
    )
    print(
        f"  Columns: time {visible(' + '.join(map(repr, result.time_columns)))}, "
        f"temperature {visible(repr(result.temperature_column))} ({unit}, "
        f"{_UNIT_FROM[result.unit_source]}), RH {visible(repr(result.rh_column))}; header "
        f"on line {result.header_line}."
    )
    for note in result.notes:
        print(f"  {visible(note)}")
    if plan.repeated:
        print(
            f"  Left out {_plural(plan.repeated, 'sample')} already in the survey for "
            f"{where}, from {sources}."
        )
    if result.reordered:
        print("  The rows were not in time order; the samples have been sorted.")
    if result.skipped:
        print(f"  Skipped {_plural(len(result.skipped), 'row')}:")
        for row in result.skipped[:20]:
            print(f"    line {row.line}: {shorten(row.reason, 200)}")
        if len(result.skipped) > 20:
            print(f"    ... and {len(result.skipped) - 20} more")
    else:
        print("  No rows skipped.")
    if args.dry_run:
        print("  Dry run: the survey was not changed.")
    return 0


# --- schema ------------------------------------------------------------------------------


def run_schema(args: argparse.Namespace) -> int:
    import json

    from survey import store

    print(json.dumps(store.survey_schema(), indent=2, ensure_ascii=False))
    return 0
