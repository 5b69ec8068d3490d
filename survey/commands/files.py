"""Survey-file commands: ``new``, ``validate``, ``export``, ``import-log`` and ``schema``.

    survey new flat9.json --site "CS-25-004 Flat 9" --address "Flat 9, 1 Example Row, Sampletown"
    survey validate flat9.json
    survey export flat9.json --csv flat9-readings.csv
    survey import-log flat9.json --room "Main bedroom" --csv bedroom-logger.csv
    survey schema > survey.schema.json

The store, pint and psychrolib are imported inside the handlers, so that registering these
commands costs nothing when another command runs.
"""

from __future__ import annotations

import argparse
import os
import re
import sys
from pathlib import Path
from typing import TYPE_CHECKING, Any, Iterator

from survey.errors import InputError, SurveyFileError

if TYPE_CHECKING:
    from survey.model import AirReading, Survey


def register(subparsers: argparse._SubParsersAction) -> None:
    new = subparsers.add_parser(
        "new", help="create a new, empty survey file",
        description="Create a survey file for one site. It will not overwrite an existing file.")
    new.add_argument("file", metavar="FILE", help="the survey file to create (.json)")
    new.add_argument("--site", required=True, metavar="TEXT",
                     help="site reference or short name, e.g. a job number and address")
    new.add_argument("--address", default="", metavar="TEXT")
    new.add_argument("--client", default="", metavar="TEXT")
    new.add_argument("--inspector", default="", metavar="TEXT")
    new.add_argument("--purpose", default="damp_complaint", metavar="PURPOSE",
                     help="damp_complaint (default), drying_check, pre_purchase, pre_coating, "
                          "routine or other")
    new.add_argument("--units", choices=("si", "ip"), default="si",
                     help="unit system for display (numbers are stored in SI either way)")
    where = new.add_mutually_exclusive_group()
    where.add_argument("--altitude", metavar="Z", help="site altitude, e.g. 120 or 400 ft")
    where.add_argument("--pressure", metavar="P", help="measured barometric pressure")
    new.set_defaults(handler=run_new)

    validate = subparsers.add_parser(
        "validate", help="check survey files; exit status 1 if any is bad",
        description="Load each survey file and report whether it is valid. Prints one line "
                    "per file; problems name the place in the file and what is wrong.")
    validate.add_argument("files", nargs="+", metavar="FILE")
    validate.set_defaults(handler=run_validate)

    export = subparsers.add_parser(
        "export", help="write every reading with derived values to a CSV file",
        description="One row per reading (outdoor air, room air, surfaces, materials, "
                    "dehumidifier outlets, logger samples) with dew point, humidity ratio, "
                    "surface RH and the margin to condensation, for spreadsheets.")
    export.add_argument("file", metavar="FILE")
    export.add_argument("--csv", required=True, metavar="OUT", help="CSV file to write, or - "
                                                                    "for standard output")
    export.add_argument("--units", choices=("si", "ip"), default=None,
                        help="units of the columns (default: the survey's unit system)")
    export.add_argument("--no-logs", action="store_true", help="leave out logger samples")
    export.set_defaults(handler=run_export)

    log = subparsers.add_parser(
        "import-log", help="add a data logger's CSV (time, temperature, RH) to a survey",
        description="Read a logger's CSV export and add its samples to the survey for one room "
                    "(or outdoors). Common header spellings, separators, decimal commas and "
                    "°C/°F are recognised; rows that cannot be used are listed with the reason.")
    log.add_argument("file", metavar="FILE", help="the survey file")
    target = log.add_mutually_exclusive_group(required=True)
    target.add_argument("--room", metavar="NAME", help="room id or name the logger was in")
    target.add_argument("--outdoor", action="store_true", help="the logger was outdoors")
    log.add_argument("--csv", required=True, metavar="LOG", help="the logger's CSV file")
    log.add_argument("--instrument", metavar="ID", help="id of the logger in the survey's "
                                                        "instruments")
    log.add_argument("--temp-unit", choices=("c", "f"), default=None,
                     help="temperature unit of the file's readings: needed when the header "
                          "does not say; when it does, this wins and the summary says so")
    log.add_argument("--date-order", choices=("dmy", "mdy", "ymd"), default=None,
                     help="order of day, month and year when the dates leave it open")
    log.add_argument("--dry-run", action="store_true",
                     help="read and report, but do not change the survey")
    log.set_defaults(handler=run_import_log)

    schema = subparsers.add_parser(
        "schema", help="print the JSON Schema of survey files",
        description="Print the JSON Schema of the survey file format, generated from the model.")
    schema.set_defaults(handler=run_schema)


# --- new ---------------------------------------------------------------------------------

_SITE_OPTIONS = {"reference": "--site", "address": "--address", "client": "--client",
                 "inspector": "--inspector", "purpose": "--purpose", "altitude_m": "--altitude",
                 "pressure_pa": "--pressure", "unit_system": "--units"}


def run_new(args: argparse.Namespace) -> int:
    from survey import model, psychro, store, units

    fields: dict[str, Any] = {"address": args.address, "client": args.client,
                              "inspector": args.inspector, "purpose": args.purpose,
                              "unit_system": args.units}
    try:
        if args.altitude is not None:
            fields["altitude_m"] = round(
                units.parse_length(args.altitude, "--altitude", args.units), 2)
            psychro.pressure_from_altitude_m(fields["altitude_m"])
        if args.pressure is not None:
            fields["pressure_pa"] = units.parse_pressure(args.pressure, "--pressure", args.units)
            psychro.check_pressure(fields["pressure_pa"])
    except InputError as exc:
        option = "--altitude" if args.altitude is not None else "--pressure"
        raise InputError(option, getattr(args, option[2:]), exc.allowed) from None
    try:
        survey = model.new_survey(args.site, **fields)
    except InputError as exc:
        name = exc.field.split(".")[-1]
        raise InputError(_SITE_OPTIONS.get(name, exc.field), exc.value, exc.allowed) from None
    path = Path(args.file)
    if path.exists():
        raise SurveyFileError(path, "", "already exists; choose another name (new never "
                                        "overwrites a file)")
    store.save_survey(survey, path, exclusive=True)
    print(f"Created {path} for site {survey.site.reference!r}.")
    return 0


# --- validate ----------------------------------------------------------------------------

def _count_readings(survey: "Survey") -> dict[str, int]:
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


def _plural(n: int, word: str) -> str:
    return f"{n} {word}{'' if n == 1 else 's'}"


def run_validate(args: argparse.Namespace) -> int:
    from survey import store
    from survey.model import SCHEMA_VERSION

    status = 0
    for name in args.files:
        path = Path(name)
        try:
            survey = store.load_survey(path)
        except SurveyFileError as exc:
            text_problem = any(words in exc.problem for words in (
                "not valid JSON", "UTF-16", "not UTF-8"))
            hint = _csv_hint(path) if text_problem else ""
            print(f"survey: {exc}{hint}", file=sys.stderr)
            status = 1
            continue
        counts = _count_readings(survey)
        version = store.read_schema_version(path)
        upgraded = (f"; schema {version}, upgraded in memory: the next save writes "
                    f"version {SCHEMA_VERSION}" if version != SCHEMA_VERSION else "")
        locked = _lock_note(store, path)
        print(f"{path}: ok ({_plural(len(survey.rooms), 'room')}, "
              f"{_plural(len(survey.visits), 'visit')}, "
              f"{_plural(counts['air'], 'air reading')}, "
              f"{_plural(counts['surface'], 'surface reading')}, "
              f"{_plural(counts['material'], 'material reading')}, "
              f"{_plural(counts['logger'], 'logger sample')}{upgraded}{locked})")
    return status


def _lock_note(store: Any, path: Path) -> str:
    """What validate says about a lock on the survey ('' when there is none)."""
    holder = store.read_lock(path)
    if holder is None:
        return ""
    name = store.lock_path(path).name
    if holder.pid <= 0:
        return f"; a damaged lock file {name} remains (the next edit replaces it)"
    if store.lock_is_stale(holder):
        return (f"; a stale lock from {holder.describe()} remains, left by a process that is "
                "gone (the next edit takes it over)")
    import socket

    if holder.host and holder.host != socket.gethostname():
        return (f"; open for editing by {holder.describe()}, another computer (cannot be "
                "checked from here)")
    return f"; open for editing by {holder.describe()}"


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
            first and first[0] not in "{[" and any(sep in first for sep in ",;\t")):
        return ""
    return (f". This looks like a CSV file (a data logger's export?), not a survey; a logger's "
            f"CSV is added to a survey with: survey import-log SURVEY.json --room NAME "
            f"--csv {path}")


# --- export ------------------------------------------------------------------------------

def _columns(system: str) -> dict[str, str]:
    """CSV column names by role, in file order; the unit is in each name."""
    t = "c" if system == "si" else "f"
    si = system == "si"
    return {
        "visit": "visit", "visit_label": "visit_label", "visit_started_at": "visit_started_at",
        "room_id": "room_id", "room_name": "room_name", "room_use": "room_use",
        "reference_room": "reference_room", "kind": "kind", "location": "location",
        "element": "element", "material": "material", "taken_at": "taken_at",
        "instrument": "instrument",
        "dry_bulb": f"dry_bulb_{t}", "rh_pct": "rh_pct",
        "pressure": "pressure_hpa" if si else "pressure_inhg",
        "dew_point": f"dew_point_{t}", "frost_point": f"frost_point_{t}",
        "humidity_ratio": "humidity_ratio_g_per_kg" if si else "humidity_ratio_gr_per_lb",
        "vapour_pressure": "vapour_pressure_pa" if si else "vapour_pressure_inhg",
        "absolute_humidity": "absolute_humidity_g_per_m3" if si else "absolute_humidity_gr_per_ft3",
        "surface_temp": f"surface_temp_{t}", "surface_rh_pct": "surface_rh_pct",
        "margin": "margin_to_condensation_k" if si else "margin_to_condensation_f",
        "moisture_value": "moisture_value", "moisture_scale": "moisture_scale",
        "moisture_method": "moisture_method", "dry_standard": "dry_standard",
        "condensation_seen": "condensation_seen", "mould_visible": "mould_visible",
        "drop": "humidity_ratio_drop_g_per_kg" if si else "grain_depression_gr_per_lb",
    }


#: Decimal places of derived values in the CSV, per quantity and unit system.
_PLACES = {
    ("temperature", "si"): 2, ("temperature", "ip"): 2,
    ("temperature_difference", "si"): 2, ("temperature_difference", "ip"): 2,
    ("humidity_ratio", "si"): 3, ("humidity_ratio", "ip"): 2,
    ("pressure", "si"): 1, ("pressure", "ip"): 3,
    ("vapour_pressure", "si"): 0, ("vapour_pressure", "ip"): 4,
    ("absolute_humidity", "si"): 2, ("absolute_humidity", "ip"): 3,
}


class _Exporter:
    """Builds the CSV rows of a survey in one unit system."""

    def __init__(self, survey: "Survey", system: str) -> None:
        from survey import psychro, units

        self.survey = survey
        self.system = system
        self.psychro = psychro
        self.units = units
        self.columns = _columns(system)

    def value(self, quantity: str, value_si: float | None, *, derived: bool = True) -> str:
        if value_si is None:
            return ""
        shown = self.units.to_display(quantity, value_si, self.system)
        if not derived and self.system == "si" and quantity != "pressure":
            return repr(float(value_si))
        places = _PLACES[(quantity, self.system)]
        text = f"{shown:.{places}f}"
        return text[1:] if text.startswith("-") and float(text) == 0.0 else text

    def air_cells(self, reading: "AirReading", pressure_pa: float) -> tuple[dict[str, str], Any]:
        state = self.psychro.state_from_rh(reading.dry_bulb_c, reading.rh_pct, pressure_pa)
        cells = {
            "dry_bulb": self.value("temperature", reading.dry_bulb_c, derived=False),
            "rh_pct": repr(float(reading.rh_pct)),
            "pressure": self.value("pressure", pressure_pa),
            "dew_point": self.value("temperature", state.dew_point_c),
            "frost_point": self.value("temperature", state.frost_point_c),
            "humidity_ratio": self.value("humidity_ratio", state.humidity_ratio_kg_per_kg),
            "vapour_pressure": self.value("vapour_pressure", state.vapour_pressure_pa),
            "absolute_humidity": self.value("absolute_humidity", state.absolute_humidity_g_per_m3),
            "taken_at": _time(getattr(reading, "taken_at", None)),
            "instrument": getattr(reading, "instrument", None) or "",
        }
        return cells, state

    def rows(self, include_logs: bool = True) -> Iterator[dict[str, str]]:
        from survey.model import pressure_pa_for

        survey = self.survey
        rooms = {room.id: room for room in survey.rooms}
        for number, visit in enumerate(survey.visits, 1):
            pressure = pressure_pa_for(survey, visit)
            base = {"visit": str(number), "visit_label": visit.label,
                    "visit_started_at": _time(visit.started_at)}
            if visit.outdoor is not None:
                cells, _ = self.air_cells(visit.outdoor, pressure)
                yield {**base, "kind": "outdoor_air", "location": "outdoors", **cells}
            for room_visit in visit.rooms:
                room = rooms[room_visit.room]
                here = {**base, "room_id": room.id, "room_name": room.name, "room_use": room.use,
                        "reference_room": _flag(room.is_reference)}
                state = None
                if room_visit.air is not None:
                    cells, state = self.air_cells(room_visit.air, pressure)
                    yield {**here, "kind": "room_air", **cells}
                for surface in room_visit.surfaces:
                    row = {**here, "kind": "surface", "location": surface.location,
                           "element": surface.element, "material": surface.material,
                           "taken_at": _time(surface.taken_at),
                           "instrument": surface.instrument or "",
                           "surface_temp": self.value("temperature", surface.surface_temp_c,
                                                      derived=False),
                           "condensation_seen": _flag(surface.condensation_seen),
                           "mould_visible": _flag(surface.mould_visible)}
                    if state is not None:
                        margin = surface.surface_temp_c - state.condensation_point_c
                        row["surface_rh_pct"] = (
                            f"{self.psychro.surface_rh_pct(state, surface.surface_temp_c):.1f}")
                        row["margin"] = self.value("temperature_difference", margin)
                    yield row
                for material in room_visit.materials:
                    yield {**here, "kind": "material", "location": material.location,
                           "material": material.material, "taken_at": _time(material.taken_at),
                           "instrument": material.instrument or "",
                           "moisture_value": repr(float(material.value)),
                           "moisture_scale": material.scale,
                           "moisture_method": material.method or "",
                           "dry_standard": _flag(material.dry_standard)}
                for equipment in room_visit.equipment:
                    if equipment.outlet is None:
                        continue
                    cells, outlet = self.air_cells(equipment.outlet, pressure)
                    row = {**here, "kind": "dehumidifier_outlet",
                           "location": equipment.label or equipment.kind, **cells}
                    if state is not None:
                        drop = state.humidity_ratio_kg_per_kg - outlet.humidity_ratio_kg_per_kg
                        row["drop"] = self.value("humidity_ratio", drop)
                    yield row
        if include_logs:
            pressure = pressure_pa_for(survey)
            for log in survey.logs:
                room = rooms.get(log.room) if log.room is not None else None
                here = {"room_id": room.id if room else "", "room_name": room.name if room else "",
                        "room_use": room.use if room else "",
                        "reference_room": _flag(room.is_reference) if room else "",
                        "kind": "logger" if room else "outdoor_logger", "location": log.source,
                        "instrument": log.instrument or ""}
                for sample in log.samples:
                    cells, _ = self.air_cells(sample, pressure)  # type: ignore[arg-type]
                    cells["taken_at"] = _time(sample.at)
                    yield {**here, **cells}


def _time(value: Any) -> str:
    return "" if value is None else value.isoformat(sep=" ")


def _flag(value: bool) -> str:
    return "yes" if value else "no"


#: A cell starting with one of these is taken by spreadsheet programs as a formula (or, for
#: tab and CR, may be shifted into one): OWASP, "CSV Injection".
_FORMULA_STARTS = ("=", "+", "-", "@", "\t", "\r")
_PLAIN_NUMBER = re.compile(r"[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?")


def spreadsheet_safe(cell: str) -> str:
    """``cell`` as text a spreadsheet will not run: a text cell starting with = + - @, a tab
    or a CR gets a leading apostrophe; numbers (``-0.25``) are left as they are."""
    if cell.startswith(_FORMULA_STARTS) and not _PLAIN_NUMBER.fullmatch(cell):
        return "'" + cell
    return cell


def export_csv(survey: "Survey", out: Any, system: str | None = None,
               include_logs: bool = True) -> int:
    """Write the survey's readings as CSV to the text stream ``out``; return the row count.

    Text typed into the survey (locations, labels, names) is made spreadsheet-safe (see
    :func:`spreadsheet_safe`), so that a CSV sent by e-mail cannot carry a live formula."""
    import csv

    exporter = _Exporter(survey, system or survey.site.unit_system)
    names = exporter.columns
    writer = csv.DictWriter(out, fieldnames=list(names.values()), lineterminator="\r\n",
                            restval="")
    writer.writeheader()
    count = 0
    for row in exporter.rows(include_logs):
        writer.writerow({names.get(key, key): spreadsheet_safe(value)
                         for key, value in row.items()})
        count += 1
    return count


def _same_file(a: Path, b: Path) -> bool:
    try:
        return a.resolve() == b.resolve() or (b.exists() and os.path.samefile(a, b))
    except OSError:
        return False


def run_export(args: argparse.Namespace) -> int:
    import io

    from survey import store

    path = Path(args.file)
    survey = store.load_survey(path)
    system = args.units or survey.site.unit_system
    if args.csv == "-":
        count = export_csv(survey, sys.stdout, system, not args.no_logs)
        print(f"{_plural(count, 'row')}{_empty_hint(survey, count, args.no_logs)}",
              file=sys.stderr)
        return 0
    out = Path(args.csv)
    if (_same_file(path, out) or _same_file(store.backup_path(path), out)
            or _same_file(store.lock_path(path), out)):
        raise InputError("--csv", args.csv, "that is the survey file (or its backup); choose "
                                            "another name for the CSV")
    buffer = io.StringIO()
    count = export_csv(survey, buffer, system, not args.no_logs)
    # UTF-8 with a byte-order mark, so that spreadsheet programs read names correctly.
    store.write_file_atomically(out, buffer.getvalue().encode("utf-8-sig"))
    print(f"Wrote {_plural(count, 'row')} to {out} ({'SI' if system == 'si' else 'IP'} "
          f"units){_empty_hint(survey, count, args.no_logs)}.")
    return 0


def _empty_hint(survey: "Survey", count: int, no_logs: bool) -> str:
    """Why an export has no rows, when it has none."""
    if count:
        return ""
    has_logs = any(log.samples for log in survey.logs)
    if not survey.visits and not has_logs:
        return ("; only the header row: the survey has no visits or logger readings yet "
                "(record a visit, or add a logger's CSV with survey import-log)")
    if has_logs and no_logs:
        return ("; only the header row: the survey's visits hold no readings, and --no-logs "
                "left out the logger samples")
    return "; only the header row: the survey's visits hold no readings yet"


# --- import-log --------------------------------------------------------------------------

def _describe_step(step: Any) -> str:
    if step is None:
        return ""
    seconds = int(step.total_seconds())
    if seconds % 3600 == 0:
        return f", every {seconds // 3600} h"
    if seconds % 60 == 0:
        return f", every {seconds // 60} min"
    return f", every {seconds} s"


def _span(samples: list[Any]) -> str:
    first, last = samples[0].at, samples[-1].at
    if first == last:
        return f"at {first:%Y-%m-%d %H:%M}"
    if first.date() == last.date():
        return f"{first:%Y-%m-%d %H:%M} to {last:%H:%M}"
    return f"{first:%Y-%m-%d %H:%M} to {last:%Y-%m-%d %H:%M}"


def _where_log(survey: "Survey", room_id: str | None) -> str:
    if room_id is None:
        return "outdoors"
    room = next((r for r in survey.rooms if r.id == room_id), None)
    return f"{room.name} ({room.id})" if room is not None else room_id


_UNIT_FROM = {"header": "unit from the header", "units row": "unit from the units row",
              "stated": "unit as given by --temp-unit"}


def _open_for_import(path: str) -> Any:
    """The survey's editing session, with what the command line can do while it is locked."""
    from survey import store

    try:
        return store.open_for_editing(path)
    except store.SurveyLocked as exc:
        if exc.holder is None or store.lock_is_stale(exc.holder):
            raise
        raise store.SurveyLocked(
            exc.path, exc.holder,
            exc.problem.replace("Reading the survey works meanwhile",
                                "survey validate and survey export only read the survey "
                                "and work meanwhile; import-log --dry-run shows what would "
                                "be imported")) from None


def run_import_log(args: argparse.Namespace) -> int:
    import datetime as dt

    import msgspec

    from survey import logimport, store
    from survey.model import LogSeries

    log_path = Path(args.csv)
    # The survey first: a survey file that does not load is the first thing to hear about.
    session = None if args.dry_run else _open_for_import(args.file)
    try:
        survey = session.survey if session is not None else store.load_survey(args.file)
        if args.outdoor:
            room_id = None
        else:
            room = survey.find_room(args.room)
            if room is None:
                known = ", ".join(f"{r.id} ({r.name})" for r in survey.rooms) or "none yet"
                raise InputError("--room", args.room,
                                 f"no such room in {args.file}; rooms: {known}")
            room_id = room.id
        where = _where_log(survey, room_id)
        if args.instrument is not None:
            ids = [i.id for i in survey.instruments]
            if args.instrument not in ids:
                raise InputError("--instrument", args.instrument,
                                 f"no such instrument in {args.file}; instruments: "
                                 f"{', '.join(ids) or 'none yet'}")
        result = logimport.read_logger_csv(store.read_input_file(log_path, "logger file"),
                                           temp_unit=args.temp_unit,
                                           date_order=args.date_order)
        for log in survey.logs:
            if log.source_sha256 == result.sha256:
                imported = (f", imported {log.imported_at:%Y-%m-%d %H:%M}"
                            if log.imported_at else "")
                span = f", {_span(log.samples)}" if log.samples else ""
                raise InputError(
                    "--csv", args.csv,
                    f"this logger file was already imported into {_where_log(survey, log.room)} "
                    f"({_plural(len(log.samples), 'sample')}{span}, from {log.source}"
                    f"{imported}); nothing was changed")
        # A later export of the same logger repeats the earlier samples: keep only new times.
        known: set[Any] = set()
        overlapping: list[str] = []
        for log in survey.logs:
            if log.room != room_id or (args.instrument and log.instrument
                                       and log.instrument != args.instrument):
                continue
            times = {sample.at for sample in log.samples}
            if any(sample.at in times for sample in result.samples):
                overlapping.append(log.source)
                known |= times
        samples = [sample for sample in result.samples if sample.at not in known]
        repeated = len(result.samples) - len(samples)
        sources = ", ".join(dict.fromkeys(overlapping))
        if not samples:
            print(f"Nothing to import: all {_plural(repeated, 'sample')} of {log_path.name} "
                  f"({_span(result.samples)}) are already in the survey for {where}, from "
                  f"{sources}; the survey was not changed.")
            if not args.instrument:
                print("  If this is a second logger in the same room, give each logger's "
                      "series an --instrument id to keep them apart.")
            return 0
        notes = [f"Times as written in the file (time column "
                 f"{' + '.join(result.time_columns)!r})."]
        notes += result.notes
        if repeated:
            notes.append(f"{_plural(repeated, 'sample')} of the file already in the survey "
                         f"(from {sources}) left out.")
        series = LogSeries(
            room=room_id, source=log_path.name[:200] or "logger.csv", samples=samples,
            instrument=args.instrument, source_sha256=result.sha256,
            imported_at=dt.datetime.now().replace(microsecond=0),
            skipped_rows=len(result.skipped) + repeated,
            notes=" ".join(notes)[:20_000])
        if session is not None:
            updated = msgspec.structs.replace(survey, logs=[*survey.logs, series])
            session.save(updated)
    finally:
        if session is not None:
            session.close()

    unit = "°F, converted to °C" if result.temperature_unit == "f" else "°C"
    verb = "Would import" if args.dry_run else "Imported"
    span = _span(samples)
    print(f"{verb} {_plural(len(samples), 'sample')} from {log_path.name} into {where}"
          f"{' ' if span.startswith('at ') else ': '}{span}{_describe_step(result.interval)}.")
    print(f"  Columns: time {' + '.join(map(repr, result.time_columns))}, temperature "
          f"{result.temperature_column!r} ({unit}, {_UNIT_FROM[result.unit_source]}), RH "
          f"{result.rh_column!r}; header on line {result.header_line}.")
    for note in result.notes:
        print(f"  {note}")
    if repeated:
        print(f"  Left out {_plural(repeated, 'sample')} already in the survey for {where}, "
              f"from {sources}.")
    if result.reordered:
        print("  The rows were not in time order; the samples have been sorted.")
    if result.skipped:
        print(f"  Skipped {_plural(len(result.skipped), 'row')}:")
        for row in result.skipped[:20]:
            print(f"    line {row.line}: {row.reason}")
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
