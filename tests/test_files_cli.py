"""The survey-file commands as a user runs them: new, validate, export, import-log, schema.

Derived values in the CSV export are checked against CoolProp ``HAPropsSI`` (an independent
psychrometric library; the package never imports it).
"""

from __future__ import annotations

import csv
import io
import json
import os
import shutil
import socket
import subprocess
import sys
from pathlib import Path

import msgspec
import pytest
from CoolProp.HumidAirProp import HAPropsSI

from survey import store
from survey.cli import main

ROOT = Path(__file__).resolve().parents[1]
EXAMPLES = ROOT / "example_sites"
FLAT = EXAMPLES / "winter-flat-bedroom-mould.json"
BASEMENT = EXAMPLES / "basement-burst-pipe-drying.json"


def _run(*argv: str) -> subprocess.CompletedProcess:
    return subprocess.run(
        [sys.executable, "-m", "survey", *argv],
        capture_output=True,
        text=True,
        timeout=60,
        cwd=ROOT,
    )


def _read_csv(path: Path) -> list[dict[str, str]]:
    return list(csv.DictReader(io.StringIO(path.read_bytes().decode("utf-8-sig"), newline="")))


# --- new ---------------------------------------------------------------------------------


def test_new_creates_a_valid_empty_survey(tmp_path, capsys):
    """`survey new FILE --site …` writes a survey that validates, with no rooms yet."""
    path = tmp_path / "flat.json"
    assert (
        main(
            [
                "new",
                str(path),
                "--site",
                "CS-1 Flat 2",
                "--inspector",
                "A. Tester",
                "--purpose",
                "pre_purchase",
                "--units",
                "ip",
                "--altitude",
                "400 ft",
            ]
        )
        == 0
    )
    assert "Created" in capsys.readouterr().out
    survey = store.load_survey(path)
    assert survey.site.reference == "CS-1 Flat 2" and survey.site.purpose == "pre_purchase"
    assert survey.site.unit_system == "ip"
    assert survey.site.altitude_m == pytest.approx(121.92)  # 400 ft × 0.3048 m/ft (exact)
    assert survey.rooms == [] and survey.visits == []


def test_new_never_overwrites(tmp_path, capsys):
    """`survey new` on an existing file exits 1 and leaves the file alone."""
    path = tmp_path / "flat.json"
    path.write_text("precious")
    assert main(["new", str(path), "--site", "x"]) == 1
    assert "already exists" in capsys.readouterr().err
    assert path.read_text() == "precious"


@pytest.mark.parametrize(
    ("args", "field"),
    [
        (["--purpose", "survey"], "--purpose"),
        (["--altitude", "9 km"], "--altitude"),
        (["--pressure", "20 kPa"], "--pressure"),
    ],
)
def test_new_rejects_bad_options_naming_them(tmp_path, capsys, args, field):
    """A bad option value exits 2 with the option's name and creates no file."""
    path = tmp_path / "flat.json"
    assert main(["new", str(path), "--site", "x", *args]) == 2
    assert capsys.readouterr().err.startswith(f"survey: {field} ")
    assert not path.exists()


# --- validate ----------------------------------------------------------------------------


def test_validate_accepts_the_example_sites(capsys):
    """`survey validate` on the three examples prints one ok line each and exits 0."""
    files = sorted(str(p) for p in EXAMPLES.glob("*.json"))
    assert main(["validate", *files]) == 0
    lines = capsys.readouterr().out.splitlines()
    assert len(lines) == 3 and all(": ok (" in line for line in lines)
    assert "3 visits" in next(line for line in lines if "basement" in line)


def test_validate_bad_file_exits_1_without_a_traceback(tmp_path):
    """A bad file gives exit status 1 and one line naming path, place and problem."""
    doc = json.loads(FLAT.read_text())
    doc["visits"][0]["rooms"][3]["surfaces"][0]["surface_temp_c"] = 120
    path = tmp_path / "bad.json"
    path.write_text(json.dumps(doc))
    result = _run("validate", str(path))
    assert result.returncode == 1
    assert "Traceback" not in result.stderr
    assert result.stderr.strip() == (
        f"survey: {path} at visits[0].rooms[3].surfaces[0].surface_temp_c: 120 is out of "
        "range; allowed: between -60 and 90 °C"
    )


def test_validate_reports_every_file(tmp_path, capsys):
    """With one bad and one good file, both are reported and the status is 1."""
    bad = tmp_path / "bad.json"
    bad.write_bytes(b"\x00" * 100)
    assert main(["validate", str(bad), str(FLAT)]) == 1
    captured = capsys.readouterr()
    assert "zero bytes" in captured.err and ": ok (" in captured.out


def test_validate_mentions_an_old_schema_and_a_lock(tmp_path, capsys):
    """validate says when a file will be upgraded and when someone has it open."""
    old = tmp_path / "old.json"
    shutil.copy(ROOT / "tests" / "data" / "schema0-prerelease.json", old)
    with store.open_for_editing(old):
        assert main(["validate", str(old)]) == 0
    out = capsys.readouterr().out
    assert "schema 0, upgraded in memory" in out and "open for editing by" in out


# --- export ------------------------------------------------------------------------------


def test_export_writes_one_row_per_reading_with_derived_values(tmp_path, capsys):
    """The CSV has a row per reading; dew point and humidity ratio agree with CoolProp and
    surface RH and margin follow from them."""
    out = tmp_path / "flat.csv"
    assert main(["export", str(FLAT), "--csv", str(out)]) == 0
    assert "Wrote 23 rows" in capsys.readouterr().out
    rows = _read_csv(out)
    kinds = [row["kind"] for row in rows]
    assert kinds.count("outdoor_air") == 1 and kinds.count("room_air") == 5
    assert kinds.count("surface") == 14 and kinds.count("material") == 3
    survey = store.load_survey(FLAT)
    pressure = 101325 * (1 - 2.25577e-5 * survey.site.altitude_m) ** 5.2559  # ASHRAE ch. 1 eqn 3
    bedroom = next(r for r in rows if r["kind"] == "room_air" and r["room_id"] == "bed1")
    t, rh = float(bedroom["dry_bulb_c"]), float(bedroom["rh_pct"])
    assert float(bedroom["pressure_pa"]) == pytest.approx(pressure, abs=1)  # written to 1 Pa
    dew = HAPropsSI("D", "T", t + 273.15, "P", pressure, "R", rh / 100) - 273.15
    w = HAPropsSI("W", "T", t + 273.15, "P", pressure, "R", rh / 100)
    assert float(bedroom["dew_point_c"]) == pytest.approx(dew, abs=0.05)
    assert float(bedroom["humidity_ratio_g_per_kg"]) == pytest.approx(w * 1000, rel=0.007)
    corner = next(r for r in rows if r["kind"] == "surface" and "wardrobe" in r["location"])
    assert corner["element"] == "external_wall" and corner["mould_visible"] == "yes"
    ts = float(corner["surface_temp_c"])
    assert float(corner["dew_point_margin_k"]) == pytest.approx(ts - dew, abs=0.06)
    vapour = float(bedroom["vapour_pressure_pa"])
    saturation_at_surface = HAPropsSI("P_w", "T", ts + 273.15, "P", pressure, "R", 1.0)
    # CoolProp's saturated vapour pressure in air includes the enhancement factor (about
    # 0.4 % at 1 atm) that the ideal-gas ASHRAE formulas leave out: hence 0.7 %.
    assert float(corner["surface_rh_pct"]) == pytest.approx(
        100 * vapour / saturation_at_surface, rel=0.007
    )


def test_export_in_ip_units(tmp_path):
    """--units ip gives °F and grains per pound (7000 grains = 1 lb) columns."""
    out = tmp_path / "b.csv"
    assert main(["export", str(BASEMENT), "--csv", str(out), "--units", "ip"]) == 0
    rows = _read_csv(out)
    outdoor = rows[0]
    assert outdoor["kind"] == "outdoor_air"
    assert float(outdoor["dry_bulb_f"]) == pytest.approx(6.0 * 9 / 5 + 32)
    w = HAPropsSI("W", "T", 6.0 + 273.15, "P", 101325 * (1 - 2.25577e-5 * 62) ** 5.2559, "R", 0.88)
    assert float(outdoor["grains_per_pound"]) == pytest.approx(7000 * w, rel=0.007)
    outlets = [r for r in rows if r["kind"] == "dehumidifier_outlet"]
    assert len(outlets) == 3 and all(float(r["grain_depression_gr_per_lb"]) > 0 for r in outlets)


def test_export_to_standard_output(capsys):
    """--csv - writes the CSV to standard output."""
    assert main(["export", str(BASEMENT), "--csv", "-"]) == 0
    rows = list(csv.DictReader(io.StringIO(capsys.readouterr().out)))
    assert len(rows) == 3 * (
        1 + 3 + 6 + 7 + 1
    )  # per visit: outdoor, air, surfaces, materials, outlet


def test_export_refuses_to_overwrite_the_survey(tmp_path, capsys):
    """Giving the survey file itself as the CSV is refused with exit 2; the survey is intact."""
    path = tmp_path / "s.json"
    shutil.copy(FLAT, path)
    assert main(["export", str(path), "--csv", str(path)]) == 2
    assert "survey file" in capsys.readouterr().err
    assert path.read_bytes() == FLAT.read_bytes()


def test_export_of_a_damaged_survey_exits_1(tmp_path, capsys):
    """Exporting a file that does not load is a file error, status 1."""
    path = tmp_path / "s.json"
    path.write_text("{")
    assert main(["export", str(path), "--csv", str(tmp_path / "o.csv")]) == 1
    assert "truncated" in capsys.readouterr().err
    assert not (tmp_path / "o.csv").exists()


# --- import-log --------------------------------------------------------------------------

# An invented °F layout: a title line, a row-number column, US dates with AM/PM.
LOG = (
    '"Unit 7 - main bedroom"\r\n'
    '"No.","Sample time, local","Air temp, °F","Rel. humidity, %"\r\n'
    "1,01/15/25 10:00:00 AM,63.5,72.0\r\n"
    "2,01/15/25 10:30:00 AM,63.9,71.0\r\n"
    "3,01/15/25 11:00:00 AM,Err,70.0\r\n"
    "4,01/15/25 11:30:00 AM,64.4,101.5\r\n"
    "5,01/15/25 12:00:00 PM,64.8,69.5\r\n"
)


@pytest.fixture
def flat_and_log(tmp_path) -> tuple[Path, Path]:
    path = tmp_path / "flat.json"
    shutil.copy(FLAT, path)
    log = tmp_path / "bedroom-logger.csv"
    log.write_bytes(LOG.encode("cp1252"))
    return path, log


def test_import_log_adds_samples_and_lists_skipped_rows(flat_and_log, capsys):
    """import-log adds the good rows to the room, converts °F, and lists each skipped row."""
    path, log = flat_and_log
    assert (
        main(
            [
                "import-log",
                str(path),
                "--room",
                "Main bedroom",
                "--csv",
                str(log),
                "--instrument",
                "th1",
            ]
        )
        == 0
    )
    out = capsys.readouterr().out
    assert "Imported 3 samples from bedroom-logger.csv into Main bedroom (bed1)" in out
    assert "every 30 min" in out and "°F, converted to °C" in out
    assert "line 5: temperature 'Err' is not a number" in out
    assert "line 6: RH 101.5 % is outside" in out
    survey = store.load_survey(path)
    (series,) = survey.logs
    assert series.room == "bed1" and series.instrument == "th1" and series.skipped_rows == 2
    assert series.samples[0].dry_bulb_c == pytest.approx((63.5 - 32) * 5 / 9, abs=1e-4)
    assert store.load_survey(store.backup_path(path)).logs == []
    assert not store.lock_path(path).exists()


def test_import_log_refuses_the_same_file_twice(flat_and_log, capsys):
    """Importing the same logger file again is refused (exit 2) and changes nothing."""
    path, log = flat_and_log
    assert main(["import-log", str(path), "--room", "bed1", "--csv", str(log)]) == 0
    before = path.read_bytes()
    capsys.readouterr()
    assert main(["import-log", str(path), "--room", "bed1", "--csv", str(log)]) == 2
    err = capsys.readouterr().err
    assert (
        "already imported into Main bedroom (bed1) (3 samples, 2025-01-15 10:00 to 12:00, "
        "from bedroom-logger.csv" in err
    )
    assert err.rstrip().endswith("nothing was changed") and "logs[" not in err
    assert path.read_bytes() == before


def test_import_log_unknown_room_lists_the_rooms(flat_and_log, capsys):
    """An unknown --room exits 2 and lists the survey's rooms; the survey is unchanged."""
    path, log = flat_and_log
    assert main(["import-log", str(path), "--room", "attic", "--csv", str(log)]) == 2
    err = capsys.readouterr().err
    assert "--room attic" in err and "bed1 (Main bedroom)" in err
    assert path.read_bytes() == FLAT.read_bytes()


def test_import_log_dry_run_changes_nothing(flat_and_log, capsys):
    """--dry-run reports what would be imported and leaves the survey as it was."""
    path, log = flat_and_log
    assert main(["import-log", str(path), "--outdoor", "--csv", str(log), "--dry-run"]) == 0
    assert "Would import 3 samples" in capsys.readouterr().out
    assert path.read_bytes() == FLAT.read_bytes()
    assert not store.backup_path(path).exists()


def test_import_log_into_a_survey_open_elsewhere_is_refused(flat_and_log, capsys):
    """When the survey is open for editing, import-log exits 1 naming the holder."""
    path, log = flat_and_log
    with store.open_for_editing(path):
        assert main(["import-log", str(path), "--room", "bed1", "--csv", str(log)]) == 1
    assert "open for editing by" in capsys.readouterr().err
    assert path.read_bytes() == FLAT.read_bytes()


def test_imported_log_is_exported(flat_and_log, capsys, tmp_path):
    """Logger samples appear in the export with derived values, unless --no-logs."""
    path, log = flat_and_log
    main(["import-log", str(path), "--room", "bed1", "--csv", str(log)])
    out = tmp_path / "o.csv"
    main(["export", str(path), "--csv", str(out)])
    rows = [r for r in _read_csv(out) if r["kind"] == "logger"]
    assert len(rows) == 3 and all(r["dew_point_c"] for r in rows)
    main(["export", str(path), "--csv", str(out), "--no-logs"])
    assert not [r for r in _read_csv(out) if r["kind"] == "logger"]


def test_import_log_missing_csv_is_a_file_error(tmp_path, capsys):
    """A logger file that does not exist gives exit status 1."""
    path = tmp_path / "flat.json"
    shutil.copy(FLAT, path)
    assert main(["import-log", str(path), "--room", "bed1", "--csv", str(tmp_path / "no.csv")]) == 1
    assert "no such file" in capsys.readouterr().err


# --- schema and help ---------------------------------------------------------------------


def test_schema_prints_the_generated_json_schema(capsys):
    """`survey schema` prints the JSON Schema generated from the model."""
    assert main(["schema"]) == 0
    schema = json.loads(capsys.readouterr().out)
    assert schema == json.loads(json.dumps(store.survey_schema()))
    assert "SurfaceReading" in schema["$defs"]


def test_help_lists_the_file_commands():
    """`survey --help` lists new, validate, export, import-log and schema."""
    result = _run("--help")
    assert result.returncode == 0
    for command in ("new", "validate", "export", "import-log", "schema"):
        assert command in result.stdout


def test_import_log_of_a_later_export_adds_only_the_new_samples(flat_and_log, capsys, tmp_path):
    """A later export of the same logger repeats the earlier samples: only new times are
    added and the summary says how many were left out; with nothing new, nothing changes."""
    path, log = flat_and_log
    assert main(["import-log", str(path), "--room", "bed1", "--csv", str(log)]) == 0
    later = tmp_path / "bedroom-logger-later.csv"
    later.write_bytes((LOG + "6,01/15/25 12:30:00 PM,65.1,69.0\r\n").encode("cp1252"))
    capsys.readouterr()
    assert main(["import-log", str(path), "--room", "bed1", "--csv", str(later)]) == 0
    out = capsys.readouterr().out
    assert (
        "Imported 1 sample from bedroom-logger-later.csv into Main bedroom (bed1) at "
        "2025-01-15 12:30" in out
    )
    assert (
        "Left out 3 samples already in the survey for Main bedroom (bed1), from "
        "bedroom-logger.csv" in out
    )
    _first, second = store.load_survey(path).logs
    assert [s.at.hour * 60 + s.at.minute for s in second.samples] == [12 * 60 + 30]
    before = path.read_bytes()
    again = tmp_path / "bedroom-logger-copy.csv"
    again.write_bytes(later.read_bytes() + b"\r\n")
    assert main(["import-log", str(path), "--room", "bed1", "--csv", str(again)]) == 0
    out = capsys.readouterr().out
    assert out.startswith("Nothing to import: all 4 samples of bedroom-logger-copy.csv")
    assert "the survey was not changed" in out
    assert path.read_bytes() == before


def test_import_log_summary_names_where_the_unit_came_from(flat_and_log, capsys, tmp_path):
    """The summary says 'unit from the header' or 'as given by --temp-unit', and warns when
    --temp-unit overrides a header's °F."""
    path, _log = flat_and_log
    log = tmp_path / "c.csv"
    log.write_text("Time,Temp (°F),RH (%)\n2025-01-15 10:00,18.5,70\n", encoding="utf-8")
    assert (
        main(
            [
                "import-log",
                str(path),
                "--room",
                "bed1",
                "--csv",
                str(log),
                "--dry-run",
                "--temp-unit",
                "c",
            ]
        )
        == 0
    )
    out = capsys.readouterr().out
    assert "(°C, unit as given by --temp-unit)" in out and "the stated" not in out
    assert "The header says °F; °C was stated: the temperatures are read as °C." in out
    assert main(["import-log", str(path), "--room", "bed1", "--csv", str(log), "--dry-run"]) == 0
    assert "(°F, converted to °C, unit from the header)" in capsys.readouterr().out


def test_import_log_help_for_temp_unit_is_consistent():
    """The --temp-unit help says when it is needed and that it wins over the header."""
    result = _run("import-log", "--help")
    text = " ".join(result.stdout.split())
    assert "needed when the header does not say; when it does, this wins" in text
    assert "does not say (overrides it)" not in text


def test_import_log_into_a_locked_survey_says_what_can_be_done(flat_and_log, capsys):
    """The locked message says that validate and export work meanwhile, and no read-only
    option that does not exist."""
    path, log = flat_and_log
    with store.open_for_editing(path):
        assert main(["import-log", str(path), "--room", "bed1", "--csv", str(log)]) == 1
    err = capsys.readouterr().err
    assert "survey validate and survey export only read the survey and work meanwhile" in err
    assert "read-only" not in err


def test_import_log_reports_a_bad_survey_before_the_csv(tmp_path, capsys):
    """A survey file that is not a survey is reported first, before the logger CSV's own
    problems (here: no header)."""
    survey = tmp_path / "notsurvey.json"
    survey.write_text('{"a": 1}')
    log = tmp_path / "bad.csv"
    log.write_text("garbage\n")
    assert main(["import-log", str(survey), "--room", "x", "--csv", str(log)]) == 1
    err = capsys.readouterr().err
    assert "this is not a condition-survey file" in err and "--csv" not in err


def test_validate_says_a_lock_is_stale(tmp_path, capsys):
    """A lock left by a process that is gone is reported as stale, not as 'open for editing'."""
    path = tmp_path / "flat.json"
    shutil.copy(FLAT, path)
    gone = subprocess.Popen([sys.executable, "-c", "pass"])
    gone.wait()
    info = store.LockInfo(
        pid=gone.pid,
        host=socket.gethostname(),
        user="avery",
        started_at="2025-01-15T09:30:00",
        token="t",
    )
    store.lock_path(path).write_bytes(msgspec.json.encode(info))
    assert main(["validate", str(path)]) == 0
    out = capsys.readouterr().out
    assert "a stale lock from avery" in out and "its process is gone" in out
    assert "open for editing" not in out


def test_validate_of_a_logger_csv_points_to_import_log(tmp_path, capsys):
    """A logger CSV given to validate: not valid JSON, and a pointer to import-log."""
    log = tmp_path / "logger.csv"
    log.write_text("Time,Temperature (°C),RH (%)\n2025-01-15 10:00,18.5,70\n", encoding="utf-8")
    assert main(["validate", str(log)]) == 1
    err = capsys.readouterr().err
    assert "not valid JSON" in err and "survey import-log SURVEY.json --room NAME --csv" in err


def test_validate_of_other_json_is_one_plain_sentence(tmp_path, capsys):
    """A JSON file that is no survey is named so in one sentence, without a document path."""
    path = tmp_path / "other.json"
    path.write_text('{"name": "something else"}')
    assert main(["validate", str(path)]) == 1
    assert capsys.readouterr().err.strip() == (
        f"survey: {path}: this is not a condition-survey file (it has no schema_version)"
    )


def test_export_neutralises_spreadsheet_formulas(tmp_path):
    """Text cells starting with = + - @ (or a tab or CR) get a leading apostrophe so that a
    spreadsheet shows them as text; numbers, negative ones too, are left alone."""
    survey = store.load_survey(FLAT)
    surfaces = [surface for room in survey.visits[0].rooms for surface in room.surfaces]
    texts = [
        '=HYPERLINK("http://example.invalid","x")',
        "+1+cmd|' /C calc'!A0",
        "-2+3",
        "@SUM(A1)",
        "\tleading tab",
        "\rleading CR",
        "plain text",
        "-5",
    ]
    for surface, text in zip(surfaces, texts, strict=False):
        surface.location = text
    survey.visits[0].outdoor.dry_bulb_c = -3.5
    path = tmp_path / "s.json"
    store.save_survey(survey, path)
    out = tmp_path / "o.csv"
    assert main(["export", str(path), "--csv", str(out)]) == 0
    rows = _read_csv(out)
    cells = [r["location"] for r in rows if r["kind"] == "surface"][: len(texts)]
    assert cells == ["'" + t for t in texts[:6]] + ["plain text", "-5"]
    outdoor = rows[0]
    assert outdoor["dry_bulb_c"] == "-3.50" and outdoor["dew_point_c"].startswith("-")


def test_export_writes_through_a_crash_safe_writer(tmp_path, capsys):
    """The CSV's temporary file is not the old predictable name: a symlink planted there
    is left alone and its target unchanged."""
    victim = tmp_path / "victim.txt"
    victim.write_text("keep me")
    out = tmp_path / "o.csv"
    (tmp_path / f".{out.name}.{os.getpid()}.tmp").symlink_to(victim)
    assert main(["export", str(FLAT), "--csv", str(out)]) == 0
    assert victim.read_text() == "keep me" and _read_csv(out)


def test_export_of_a_survey_without_readings_says_why(tmp_path, capsys):
    """An empty survey exports the header row only, and the message says why."""
    path = tmp_path / "new.json"
    assert main(["new", str(path), "--site", "Demo"]) == 0
    out = tmp_path / "o.csv"
    capsys.readouterr()
    assert main(["export", str(path), "--csv", str(out)]) == 0
    message = capsys.readouterr().out
    assert "Wrote 0 rows" in message
    assert "the survey has no visits or logger readings yet" in message
    assert len(out.read_text(encoding="utf-8-sig").splitlines()) == 1


# --- help, option names, and text from people and files ----------------------------------

FILE_COMMANDS = ("new", "validate", "export", "import-log", "schema")


@pytest.mark.parametrize("command", FILE_COMMANDS)
def test_every_option_and_argument_of_the_file_commands_has_help(command):
    """Each option and positional argument of the file commands carries a help text."""
    from survey.cli import _subcommands, build_parser

    parser = _subcommands(build_parser())[command]
    missing = [
        action.dest
        for action in parser._actions
        if action.dest != "help" and not (action.help or "").strip()
    ]
    assert missing == []


def test_a_logger_header_without_a_unit_is_reported_under_temp_unit(flat_and_log, capsys, tmp_path):
    """The core's "temperature unit" error reaches the user as --temp-unit, exit 2."""
    path, _log = flat_and_log
    log = tmp_path / "plain.csv"
    log.write_text("time,temp,rh\n2025-01-15 10:00,18.5,70\n", encoding="utf-8")
    assert main(["import-log", str(path), "--room", "bed1", "--csv", str(log)]) == 2
    err = capsys.readouterr().err
    assert err.startswith(
        "survey: --temp-unit (not given): the temperature column 'temp' does not say its unit"
    )


def test_a_logger_file_without_a_header_is_reported_under_csv(flat_and_log, capsys, tmp_path):
    """The core's "logger file" error reaches the user as --csv, exit 2."""
    path, _log = flat_and_log
    log = tmp_path / "junk.csv"
    log.write_text("a,b,c\n1,2,3\n", encoding="utf-8")
    assert main(["import-log", str(path), "--room", "bed1", "--csv", str(log)]) == 2
    assert capsys.readouterr().err.startswith("survey: --csv 'a,b,c': no header row")


def test_ambiguous_dates_are_reported_under_date_order(flat_and_log, capsys, tmp_path):
    """The core's "date order" error reaches the user as --date-order, exit 2."""
    path, _log = flat_and_log
    log = tmp_path / "dates.csv"
    log.write_text("Time,Temp (C),RH\n03/02/2025 10:00,17.5,82\n", encoding="utf-8")
    assert main(["import-log", str(path), "--room", "bed1", "--csv", str(log)]) == 2
    assert capsys.readouterr().err.startswith("survey: --date-order (not given): dates such as")


def _no_raw_control(text: str) -> bool:
    """True when ``text`` has no control or format character other than newline and tab."""
    import unicodedata

    return not any(unicodedata.category(c) in ("Cc", "Cf") and c not in "\n\t" for c in text)


def test_import_log_output_shows_room_names_and_file_text_escaped(tmp_path, capsys):
    """ESC sequences in a room name, a file name and the file's text are printed visibly."""
    survey = store.load_survey(FLAT)
    survey.rooms[0].name = "Bed\x1b]0;owned\x07room"
    path = tmp_path / "s.json"
    store.save_survey(survey, path)
    log = tmp_path / "odd\x1b[2Jname.csv"
    log.write_text(
        "Time,Temp \x1b[31m(°C),RH (%)\n2025-01-15 10:00,18.5,70\n2025-01-15 10:30,\x1b[5mhot,70\n",
        encoding="utf-8",
    )
    assert main(["import-log", str(path), "--room", "bed1", "--csv", str(log)]) == 0
    out = capsys.readouterr().out
    assert _no_raw_control(out)
    assert "Bed\\x1b]0;owned\\x07room (bed1)" in out and "odd\\x1b[2Jname.csv" in out


def test_an_unknown_room_with_escapes_is_reported_escaped(flat_and_log, capsys):
    """An unknown --room holding ESC and a bidi override is quoted visibly in the error."""
    path, log = flat_and_log
    assert main(["import-log", str(path), "--room", "att\x1b[1mic\u202e", "--csv", str(log)]) == 2
    err = capsys.readouterr().err
    assert _no_raw_control(err) and "att\\x1b[1mic\\u202e" in err


def test_validate_shows_an_unknown_key_and_the_file_name_escaped(tmp_path, capsys):
    """An unknown key and a file name holding ESC sequences are reported visibly."""
    doc = json.loads(FLAT.read_text())
    doc["site"]["\x1b[31mcolour"] = 1
    path = tmp_path / "bad\x1b[0m.json"
    path.write_text(json.dumps(doc))
    assert main(["validate", str(path)]) == 1
    err = capsys.readouterr().err
    assert _no_raw_control(err) and "bad\\x1b[0m.json" in err


def test_validate_ok_line_shows_the_file_name_escaped(tmp_path, capsys):
    """A good survey whose file name holds a CR is listed with the CR visible."""
    path = tmp_path / "flat\r.json"
    shutil.copy(FLAT, path)
    assert main(["validate", str(path)]) == 0
    out = capsys.readouterr().out
    assert _no_raw_control(out) and "flat\\x0d.json: ok (" in out


def test_new_prints_the_site_and_file_name_escaped(tmp_path, capsys):
    """`survey new` with ESC in the site and the file name prints both visibly."""
    path = tmp_path / "n\x1b[2J.json"
    assert main(["new", str(path), "--site", "Site \x1b[31mred"]) == 0
    out = capsys.readouterr().out
    assert _no_raw_control(out) and "n\\x1b[2J.json" in out and "Site \\x1b[31mred" in out


def _survey_with_odd_room(tmp_path: Path) -> Path:
    survey = store.load_survey(FLAT)
    survey.rooms[0].name = "Bed\x1b[31m\x00room"
    path = tmp_path / "s.json"
    store.save_survey(survey, path)
    return path


def test_export_to_a_terminal_escapes_control_characters(tmp_path, capsys, monkeypatch):
    """`export --csv -` on a terminal writes an ESC in a room name as \\x1b."""
    path = _survey_with_odd_room(tmp_path)
    monkeypatch.setattr(sys.stdout, "isatty", lambda: True)
    assert main(["export", str(path), "--csv", "-"]) == 0
    out = capsys.readouterr().out
    assert _no_raw_control(out.replace("\r\n", "\n")) and "Bed\\x1b[31m\\x00room" in out


def test_export_to_a_pipe_keeps_the_text_but_no_nul(tmp_path):
    """`export --csv -` into a pipe keeps the ESC as data but never writes a NUL byte."""
    path = _survey_with_odd_room(tmp_path)
    result = subprocess.run(
        [sys.executable, "-m", "survey", "export", str(path), "--csv", "-"],
        capture_output=True,
        timeout=60,
        cwd=ROOT,
        check=False,
    )
    assert result.returncode == 0 and b"\x00" not in result.stdout
    assert b"Bed\x1b[31m\\x00room" in result.stdout


def test_export_file_has_no_nul_bytes(tmp_path):
    """A CSV file written from a survey with a NUL in a name holds no NUL byte."""
    path = _survey_with_odd_room(tmp_path)
    out = tmp_path / "o.csv"
    assert main(["export", str(path), "--csv", str(out)]) == 0
    assert b"\x00" not in out.read_bytes()


def test_export_message_shows_the_csv_name_escaped(tmp_path, capsys):
    """The "Wrote … to NAME" line shows a control character in the CSV's name visibly."""
    out = tmp_path / "o\x1b[2J.csv"
    assert main(["export", str(FLAT), "--csv", str(out)]) == 0
    message = capsys.readouterr().out
    assert _no_raw_control(message) and "o\\x1b[2J.csv" in message


def test_a_huge_option_value_gives_a_short_error_line(flat_and_log, capsys):
    """A 100 000-character --room is quoted shortened: the error stays one short line."""
    path, log = flat_and_log
    assert main(["import-log", str(path), "--room", "x" * 100_000, "--csv", str(log)]) == 2
    err = capsys.readouterr().err
    assert len(err) < 700 and err.count("\n") == 1 and "…" in err
