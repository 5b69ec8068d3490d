"""The survey-file commands as a user runs them: new, validate, export, import-log, schema.

Derived values in the CSV export are checked against CoolProp ``HAPropsSI`` (an independent
psychrometric library; the package never imports it).
"""

from __future__ import annotations

import csv
import io
import json
import shutil
import subprocess
import sys
from pathlib import Path

import pytest
from CoolProp.HumidAirProp import HAPropsSI

from survey import store
from survey.cli import main

ROOT = Path(__file__).resolve().parents[1]
EXAMPLES = ROOT / "example_sites"
FLAT = EXAMPLES / "winter-flat-bedroom-mould.json"
BASEMENT = EXAMPLES / "basement-burst-pipe-drying.json"


def _run(*argv: str) -> subprocess.CompletedProcess:
    return subprocess.run([sys.executable, "-m", "survey", *argv], capture_output=True,
                          text=True, timeout=60, cwd=ROOT)


def _read_csv(path: Path) -> list[dict[str, str]]:
    return list(csv.DictReader(io.StringIO(path.read_text(encoding="utf-8-sig"))))


# --- new ---------------------------------------------------------------------------------

def test_new_creates_a_valid_empty_survey(tmp_path, capsys):
    """`survey new FILE --site …` writes a survey that validates, with no rooms yet."""
    path = tmp_path / "flat.json"
    assert main(["new", str(path), "--site", "CS-1 Flat 2", "--inspector", "A. Tester",
                 "--purpose", "pre_purchase", "--units", "ip", "--altitude", "400 ft"]) == 0
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


@pytest.mark.parametrize("args, field", [
    (["--purpose", "survey"], "--purpose"),
    (["--altitude", "9 km"], "--altitude"),
    (["--pressure", "20 kPa"], "--pressure"),
])
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
        "range; allowed: between -60 and 90 °C")


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
    assert float(bedroom["pressure_hpa"]) == pytest.approx(pressure / 100, abs=0.05)
    dew = HAPropsSI("D", "T", t + 273.15, "P", pressure, "R", rh / 100) - 273.15
    w = HAPropsSI("W", "T", t + 273.15, "P", pressure, "R", rh / 100)
    assert float(bedroom["dew_point_c"]) == pytest.approx(dew, abs=0.05)
    assert float(bedroom["humidity_ratio_g_per_kg"]) == pytest.approx(w * 1000, rel=0.007)
    corner = next(r for r in rows if r["kind"] == "surface" and "wardrobe" in r["location"])
    assert corner["element"] == "external_wall" and corner["mould_visible"] == "yes"
    ts = float(corner["surface_temp_c"])
    assert float(corner["margin_to_condensation_k"]) == pytest.approx(ts - dew, abs=0.06)
    vapour = float(bedroom["vapour_pressure_pa"])
    saturation_at_surface = HAPropsSI("P_w", "T", ts + 273.15, "P", pressure, "R", 1.0)
    # CoolProp's saturated vapour pressure in air includes the enhancement factor (about
    # 0.4 % at 1 atm) that the ideal-gas ASHRAE formulas leave out: hence 0.7 %.
    assert float(corner["surface_rh_pct"]) == pytest.approx(100 * vapour / saturation_at_surface,
                                                           rel=0.007)


def test_export_in_ip_units(tmp_path):
    """--units ip gives °F and grains per pound (7000 grains = 1 lb) columns."""
    out = tmp_path / "b.csv"
    assert main(["export", str(BASEMENT), "--csv", str(out), "--units", "ip"]) == 0
    rows = _read_csv(out)
    outdoor = rows[0]
    assert outdoor["kind"] == "outdoor_air"
    assert float(outdoor["dry_bulb_f"]) == pytest.approx(6.0 * 9 / 5 + 32)
    w = HAPropsSI("W", "T", 6.0 + 273.15, "P", 101325 * (1 - 2.25577e-5 * 62) ** 5.2559, "R", 0.88)
    assert float(outdoor["humidity_ratio_gr_per_lb"]) == pytest.approx(7000 * w, rel=0.007)
    outlets = [r for r in rows if r["kind"] == "dehumidifier_outlet"]
    assert len(outlets) == 3 and all(float(r["grain_depression_gr_per_lb"]) > 0 for r in outlets)


def test_export_to_standard_output(capsys):
    """--csv - writes the CSV to standard output."""
    assert main(["export", str(BASEMENT), "--csv", "-"]) == 0
    rows = list(csv.DictReader(io.StringIO(capsys.readouterr().out)))
    assert len(rows) == 3 * (1 + 3 + 6 + 7 + 1)  # per visit: outdoor, air, surfaces, materials, outlet


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

LOG = (
    '"Plot Title: Main bedroom"\r\n'
    '"#","Date Time, GMT+00:00","Temp, °F","RH, %"\r\n'
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
    assert main(["import-log", str(path), "--room", "Main bedroom", "--csv", str(log),
                 "--instrument", "th1"]) == 0
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
    assert main(["import-log", str(path), "--room", "bed1", "--csv", str(log)]) == 2
    assert "already imported" in capsys.readouterr().err
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
