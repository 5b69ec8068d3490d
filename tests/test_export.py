"""The CSV export core (survey.export): columns, fixed decimals, spreadsheet and terminal
safety, NUL bytes, streaming, and the atomic file write.

Psychrometric check values come from CoolProp ``HAPropsSI`` (an independent library; the
package never imports it) or from ``survey check --json`` for the same readings, so a
column and the JSON key of the same name hold the same quantity.
"""

from __future__ import annotations

import csv
import datetime as dt
import io
import json
import os
import re
import stat
from pathlib import Path

import msgspec
import pytest
from CoolProp.HumidAirProp import HAPropsSI

from survey import export, model, store
from survey.cli import main
from survey.errors import SurveyFileError

ROOT = Path(__file__).resolve().parents[1]
FLAT = ROOT / "example_sites" / "winter-flat-bedroom-mould.json"
BASEMENT = ROOT / "example_sites" / "basement-burst-pipe-drying.json"
EXAMPLES = sorted((ROOT / "example_sites").glob("*.json"))


def _rows(survey: model.Survey, system: str | None = None, **options) -> list[dict[str, str]]:
    out = io.StringIO()
    export.write_csv(survey, out, system, **options)
    return list(csv.DictReader(io.StringIO(out.getvalue(), newline="")))


def _with_logs(survey: model.Survey, *series: model.LogSeries) -> model.Survey:
    return msgspec.structs.replace(survey, logs=[*survey.logs, *series])


def _samples(*readings: tuple[float, float]) -> list[model.LogSample]:
    start = dt.datetime(2025, 1, 15, 10, 0)
    return [
        model.LogSample(at=start + dt.timedelta(minutes=10 * n), dry_bulb_c=t, rh_pct=rh)
        for n, (t, rh) in enumerate(readings)
    ]


# --- columns -----------------------------------------------------------------------------


def test_air_columns_hold_what_check_json_holds_under_the_same_key(capsys):
    """The bedroom's air row and check's JSON for the same air agree on every shared key."""
    survey = store.load_survey(FLAT)
    bedroom = next(r for r in _rows(survey) if r["kind"] == "room_air" and r["room_id"] == "bed1")
    pressure = model.pressure_pa_for(survey, survey.visits[0])
    assert (
        main(
            [
                "check",
                "--air-temp",
                bedroom["dry_bulb_c"],
                "--rh",
                bedroom["rh_pct"],
                "--pressure",
                f"{pressure} Pa",
                "--json",
            ]
        )
        == 0
    )
    result = json.loads(capsys.readouterr().out)
    shared = [
        "dry_bulb_c",
        "rh_pct",
        "pressure_pa",
        "dew_point_c",
        "humidity_ratio_g_per_kg",
        "vapour_pressure_pa",
        "absolute_humidity_g_per_m3",
    ]
    for key in shared:
        places = len(bedroom[key].partition(".")[2])
        assert float(bedroom[key]) == pytest.approx(result[key], abs=0.51 * 10**-places), key


def test_surface_columns_hold_what_check_json_holds_under_the_same_key(capsys):
    """A surface row's values are what check's JSON gives that surface under the same keys."""
    survey = store.load_survey(FLAT)
    rows = _rows(survey)
    air = next(r for r in rows if r["kind"] == "room_air" and r["room_id"] == "bed1")
    corner = next(r for r in rows if r["kind"] == "surface" and "wardrobe" in r["location"])
    pressure = model.pressure_pa_for(survey, survey.visits[0])
    assert (
        main(
            [
                "check",
                "--air-temp",
                air["dry_bulb_c"],
                "--rh",
                air["rh_pct"],
                "--pressure",
                f"{pressure} Pa",
                "--surface-temp",
                corner["surface_temp_c"],
                "--json",
            ]
        )
        == 0
    )
    (surface,) = json.loads(capsys.readouterr().out)["surfaces"]
    for key in ("surface_temp_c", "surface_rh_pct", "dew_point_margin_k"):
        places = len(corner[key].partition(".")[2])
        assert float(corner[key]) == pytest.approx(surface[key], abs=0.51 * 10**-places), key


def test_ip_columns_use_check_json_s_name_for_grains_per_pound():
    """In IP units the humidity ratio is the column grains_per_pound (check's JSON key)."""
    survey = store.load_survey(BASEMENT)
    outdoor = _rows(survey, "ip")[0]
    pressure = model.pressure_pa_for(survey, survey.visits[0])
    w = HAPropsSI("W", "T", 6.0 + 273.15, "P", pressure, "R", 0.88)  # the file's 6 °C, 88 %
    assert float(outdoor["grains_per_pound"]) == pytest.approx(7000 * w, rel=0.007)


def test_header_is_the_column_names_of_the_unit_system():
    """The first line is column_names(system), in SI and IP."""
    survey = store.load_survey(FLAT)
    for system in ("si", "ip"):
        out = io.StringIO()
        export.write_csv(survey, out, system)
        assert out.getvalue().split("\r\n", 1)[0].split(",") == export.column_names(system)


# --- fixed decimals ----------------------------------------------------------------------

_DECIMALS_BY_COLUMN = {
    "dry_bulb_c": 2,
    "rh_pct": 1,
    "pressure_pa": 0,
    "dew_point_c": 2,
    "frost_point_c": 2,
    "humidity_ratio_g_per_kg": 2,
    "vapour_pressure_pa": 0,
    "absolute_humidity_g_per_m3": 2,
    "surface_temp_c": 2,
    "surface_rh_pct": 1,
    "dew_point_margin_k": 2,
    "moisture_value": 1,
    "humidity_ratio_drop_g_per_kg": 2,
}


@pytest.mark.parametrize("path", EXAMPLES, ids=lambda p: p.stem)
def test_every_number_has_its_column_s_fixed_decimals(path):
    """Every number of the example exports has its quantity's fixed decimals, no float noise."""
    for row in _rows(store.load_survey(path), "si"):
        for column, places in _DECIMALS_BY_COLUMN.items():
            if row[column]:
                pattern = r"-?\d+" + (rf"\.\d{{{places}}}" if places else "")
                assert re.fullmatch(pattern, row[column]), (column, row[column])


def test_a_reading_typed_as_15_8_is_written_15_80():
    """The basement's 15.8 °C pipe reading (the example file's number) is written 15.80."""
    rows = _rows(store.load_survey(BASEMENT), "si")
    assert "15.80" in [r["surface_temp_c"] for r in rows if r["visit"] == "2"]


def test_negative_zero_is_written_without_its_sign():
    """A value that rounds to zero is written 0.00, never -0.00."""
    numbers = export._Numbers("si")
    assert numbers.format("temperature", -0.001) == "0.00"
    assert numbers.format("temperature", -0.006) == "-0.01"


# --- spreadsheet safety and NUL ----------------------------------------------------------


@pytest.mark.parametrize(
    "cell",
    [
        "=1+1",
        "+1+1",
        "-2+3",
        "@SUM(A1)",
        " =1+1",
        "\n=1+1",
        "\r\n@x",
        "\t=1",
        "\u3000=1",
        "\uff1d1+1",
        "\uff0b1",
        "\uff0d1",
        "\uff20SUM(A1)",
        "  \uff1dx",
    ],
)
def test_text_that_a_spreadsheet_would_run_gets_an_apostrophe(cell):
    """A formula start, also after white space or in full-width form, gets an apostrophe."""
    assert export.spreadsheet_safe(cell) == "'" + cell


@pytest.mark.parametrize("cell", ["plain text", "-5", "+0.25", "1e3", "", "a=b", "x-1"])
def test_plain_text_and_numbers_are_left_alone(cell):
    """Text not starting a formula, and a cell that is a plain number, are unchanged."""
    assert export.spreadsheet_safe(cell) == cell


def test_negative_numbers_the_export_formats_are_never_neutralised():
    """A −3.5 °C outdoor reading is written -3.50 in its column, with no apostrophe."""
    survey = store.load_survey(FLAT)
    survey.visits[0].outdoor.dry_bulb_c = -3.5
    outdoor = _rows(survey)[0]
    assert outdoor["dry_bulb_c"] == "-3.50" and outdoor["dew_point_c"].startswith("-")


def test_no_nul_byte_is_ever_written():
    """A NUL in a room name and a location is written as the visible escape \\x00."""
    survey = store.load_survey(FLAT)
    survey.rooms[0].name = "Bed\x00room"
    survey.visits[0].rooms[0].surfaces[0].location = "\x00=1"
    out = io.StringIO()
    export.write_csv(survey, out)
    assert "\x00" not in out.getvalue()
    rows = list(csv.DictReader(io.StringIO(out.getvalue(), newline="")))
    assert rows[1]["room_name"] == "Bed\\x00room"


def test_a_lone_surrogate_is_written_as_an_escape():
    """A lone surrogate in a survey made in memory is written as \\udc80, not an error."""
    survey = store.load_survey(FLAT)
    survey.rooms[0].name = "Bed\udc80room"
    out = io.StringIO()
    export.write_csv(survey, out)
    out.getvalue().encode("utf-8")
    assert "Bed\\udc80room" in out.getvalue()


def test_control_characters_are_kept_exact_for_a_file():
    """Without for_terminal an ESC in a name is data and is written as it is."""
    survey = store.load_survey(FLAT)
    survey.rooms[0].name = "Bed\x1b[31mroom"
    rows = _rows(survey)
    assert rows[1]["room_name"] == "Bed\x1b[31mroom"


def test_control_characters_are_made_visible_for_a_terminal():
    """With for_terminal an ESC, a CR and a bidi override in names are written as escapes."""
    survey = store.load_survey(FLAT)
    survey.rooms[0].name = "Bed\x1b[31mroom\r\u202e"
    out = io.StringIO()
    export.write_csv(survey, out, for_terminal=True)
    text = out.getvalue()
    assert "\x1b" not in text and "\u202e" not in text and "\r\n" in text
    assert "Bed\\x1b[31mroom\\x0d\\u202e" in text


# --- logger rows -------------------------------------------------------------------------


def test_logger_rows_agree_with_coolprop():
    """A logger sample's dew point and humidity ratio are CoolProp's for the same air."""
    survey = _with_logs(
        store.load_survey(FLAT),
        model.LogSeries(room="bed1", source="unit.csv", samples=_samples((20.0, 50.0))),
    )
    (row,) = [r for r in _rows(survey) if r["kind"] == "logger"]
    pressure = model.pressure_pa_for(survey)
    dew = HAPropsSI("D", "T", 293.15, "P", pressure, "R", 0.5) - 273.15
    w = HAPropsSI("W", "T", 293.15, "P", pressure, "R", 0.5)
    assert float(row["dew_point_c"]) == pytest.approx(dew, abs=0.05)
    assert float(row["humidity_ratio_g_per_kg"]) == pytest.approx(1000 * w, rel=0.007)
    assert row["frost_point_c"] == "" and row["taken_at"] == "2025-01-15 10:00:00"


def test_repeated_logger_readings_give_the_same_cells_as_a_room_reading():
    """Logged and spot readings of the same air get the same cells, also below 0 °C."""
    survey = store.load_survey(FLAT)
    readings = [(17.5, 72.0), (-5.0, 80.0), (17.5, 72.0), (-5.0, 80.0)]
    survey = _with_logs(
        survey, model.LogSeries(room=None, source="garden.csv", samples=_samples(*readings))
    )
    survey.visits[0].outdoor.dry_bulb_c, survey.visits[0].outdoor.rh_pct = -5.0, 80.0
    survey.visits[0].pressure_pa = None
    rows = _rows(survey)
    air = [
        "dry_bulb_c",
        "rh_pct",
        "pressure_pa",
        "dew_point_c",
        "frost_point_c",
        "humidity_ratio_g_per_kg",
        "vapour_pressure_pa",
        "absolute_humidity_g_per_m3",
    ]
    bedroom = next(r for r in rows if r["kind"] == "room_air" and r["room_id"] == "bed1")
    logged = [r for r in rows if r["kind"] == "outdoor_logger"]
    assert [logged[0][k] for k in air] == [logged[2][k] for k in air]
    assert [logged[1][k] for k in air] == [rows[0][k] for k in air]
    assert logged[1]["frost_point_c"] and logged[0]["dew_point_c"] == bedroom["dew_point_c"]


def test_a_long_series_is_written_in_bounded_blocks():
    """20 000 samples reach the stream in many bounded writes, never as one whole text."""
    samples = _samples(*[(18.0 + (n % 50) / 10, 60.0 + (n % 30) / 10) for n in range(20_000)])
    survey = _with_logs(
        store.load_survey(FLAT), model.LogSeries(room="bed1", source="unit.csv", samples=samples)
    )
    writes: list[int] = []

    class Recorder(io.StringIO):
        def write(self, text: str) -> int:
            writes.append(len(text))
            return len(text)

    assert export.write_csv(survey, Recorder()) == 23 + 20_000  # the example's 23 readings
    assert len(writes) >= 5 and max(writes) < 1_000_000


# --- the file ----------------------------------------------------------------------------


def test_save_csv_writes_utf8_with_a_byte_order_mark(tmp_path):
    """The file starts with the UTF-8 byte-order mark and holds the header and rows."""
    out = tmp_path / "o.csv"
    assert export.save_csv(store.load_survey(FLAT), out) == 23  # the example's readings
    data = out.read_bytes()
    assert data.startswith(b"\xef\xbb\xbfvisit,") and data.count(b"\r\n") == 24


def test_save_csv_refuses_a_read_only_file_and_leaves_it(tmp_path):
    """A read-only CSV is not replaced; it is unchanged and no temporary file is left."""
    out = tmp_path / "o.csv"
    out.write_text("keep")
    out.chmod(0o444)
    with pytest.raises(SurveyFileError, match="read-only"):
        export.save_csv(store.load_survey(FLAT), out)
    assert out.read_text() == "keep" and os.listdir(tmp_path) == ["o.csv"]


def test_save_csv_keeps_the_permissions_of_the_file_it_replaces(tmp_path):
    """Replacing a CSV with mode 0640 gives a new file with mode 0640."""
    out = tmp_path / "o.csv"
    out.write_text("old")
    out.chmod(0o640)
    export.save_csv(store.load_survey(FLAT), out)
    assert stat.S_IMODE(out.stat().st_mode) == 0o640 and out.read_bytes() != b"old"


def test_a_failed_save_leaves_the_old_file_and_no_temporary_file(tmp_path, monkeypatch):
    """When the rename fails the old CSV is as it was and the temporary file is removed."""
    out = tmp_path / "o.csv"
    out.write_text("old")

    def fail(*args):
        raise OSError(28, "No space left on device")

    monkeypatch.setattr(export.os, "replace", fail)
    with pytest.raises(SurveyFileError, match="the disk is full"):
        export.save_csv(store.load_survey(FLAT), out)
    assert out.read_text() == "old" and os.listdir(tmp_path) == ["o.csv"]


def test_text_with_separators_quotes_and_line_breaks_reads_back_the_same():
    """A name with a comma, quotes and a line break reads back unchanged (RFC 4180)."""
    survey = store.load_survey(FLAT)
    survey.rooms[0].name = 'Bed, "main"\r\nroom'
    survey = _with_logs(
        survey, model.LogSeries(room="bed1", source='a,"b".csv', samples=_samples((18.0, 60.0)))
    )
    rows = _rows(survey)
    assert rows[1]["room_name"] == 'Bed, "main"\r\nroom'
    assert [r["location"] for r in rows if r["kind"] == "logger"] == ['a,"b".csv']
