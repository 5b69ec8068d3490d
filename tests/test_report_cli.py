"""`survey report` as a user runs it, and the report and `survey export --csv` agreeing on
every number they both show."""

from __future__ import annotations

import csv
import io
import re
import shutil
from pathlib import Path

import pytest

from survey import evaluate, report, store
from survey.cli import main
from survey.report.markdown import Table

ROOT = Path(__file__).resolve().parents[1]
EXAMPLES = sorted((ROOT / "example_sites").glob("*.json"))
FLAT = ROOT / "example_sites" / "winter-flat-bedroom-mould.json"


@pytest.fixture
def flat(tmp_path):
    path = tmp_path / "flat.json"
    shutil.copy(FLAT, path)
    return path


def test_report_written_beside_the_survey(flat, capsys):
    """With no -o the report is NAME-report.md beside the survey; the survey is untouched."""
    before = flat.read_bytes()
    assert main(["report", str(flat)]) == 0
    out = flat.with_name("flat-report.md")
    assert out.read_text(encoding="utf-8").startswith("# Condition report: ")
    assert flat.read_bytes() == before
    assert "flat-report.md" in capsys.readouterr().out


def test_html_report_is_one_page_without_scripts(flat):
    """--html writes NAME-report.html: one page, styles inline, no script, nothing fetched."""
    assert main(["report", str(flat), "--html"]) == 0
    page = flat.with_name("flat-report.html").read_text(encoding="utf-8")
    assert page.startswith("<!DOCTYPE html>") and "<style>" in page
    assert "<script" not in page and "<link" not in page and "http" not in page
    assert "<table>" in page and "<h2>" in page


def test_existing_report_is_replaced(flat, tmp_path):
    """-o names the report; an existing report there is replaced whole."""
    out = tmp_path / "out.md"
    out.write_text("old")
    assert main(["report", str(flat), "-o", str(out), "--units", "ip", "--visit", "1"]) == 0
    text = out.read_text(encoding="utf-8")
    assert text.startswith("# Condition report: ") and "°F" in text


@pytest.mark.parametrize("target", ["flat.json", "flat.json.bak", "other.json"])
def test_report_never_written_over_the_survey(flat, capsys, target):
    """The survey, its backup and any .json are refused as the report's name: exit 2, one
    line, nothing written."""
    store.save_survey(store.load_survey(flat), flat)  # makes flat.json.bak
    files = {p.name: p.read_bytes() for p in flat.parent.iterdir()}
    assert main(["report", str(flat), "-o", str(flat.parent / target)]) == 2
    err = capsys.readouterr().err
    assert err.count("\n") == 1 and "--output" in err
    assert {p.name: p.read_bytes() for p in flat.parent.iterdir()} == files


@pytest.mark.parametrize(
    ("value", "allowed"), [("2", "1 to 1"), ("0", "1 to 1"), ("first", "visit number")]
)
def test_bad_visit_is_refused(flat, capsys, value, allowed):
    """--visit names a visit of the survey or all; anything else: exit 2, one line."""
    assert main(["report", str(flat), "--visit", value]) == 2
    err = capsys.readouterr().err
    assert err.startswith("survey: --visit") and allowed in err and err.count("\n") == 1
    assert not flat.with_name("flat-report.md").exists()


def test_missing_or_damaged_survey_is_a_file_error(tmp_path, capsys):
    """A survey that does not load: exit 1, one line, no report written."""
    assert main(["report", str(tmp_path / "none.json")]) == 1
    bad = tmp_path / "bad.json"
    bad.write_text("{")
    assert main(["report", str(bad)]) == 1
    assert not list(tmp_path.glob("*-report.*"))


def test_photos_linked_relative_to_the_report(flat, tmp_path):
    """A photo beside the survey is linked by its path relative to the report's folder; a
    missing one is listed, and the report is written all the same."""
    (tmp_path / "flat9-bed1-corner.jpg").write_bytes(b"jpeg")
    out_dir = tmp_path / "reports"
    out_dir.mkdir()
    assert main(["report", str(flat), "-o", str(out_dir / "r.md")]) == 0
    text = (out_dir / "r.md").read_text(encoding="utf-8")
    assert "](../flat9-bed1-corner.jpg)" in text
    assert "flat9-bed1-window.jpg is listed in the survey but was not found" in text


# --- the report and the CSV export agree ----------------------------------------------------


def _csv(path: Path, tmp_path: Path) -> tuple[list[str], list[dict[str, str]]]:
    out = tmp_path / f"{path.stem}.csv"
    assert main(["export", str(path), "--csv", str(out), "--units", "si", "--no-logs"]) == 0
    reader = csv.DictReader(io.StringIO(out.read_bytes().decode("utf-8-sig"), newline=""))
    rows = list(reader)
    return list(reader.fieldnames or ()), rows


def _column(header: list[str], pattern: str) -> str:
    """The one CSV column whose whole name matches ``pattern`` (names carry their unit, and
    may be renamed: the pattern allows the spellings that mean the same quantity)."""
    found = [name for name in header if re.fullmatch(pattern, name)]
    assert len(found) == 1, (pattern, header)
    return found[0]


def _agree(csv_text: str, value: float, scale: float = 1.0) -> None:
    """The CSV number equals ``value × scale`` to the CSV's own precision."""
    places = len(csv_text.split(".")[1]) if "." in csv_text else 0
    assert abs(float(csv_text) - value * scale) <= 0.5 * 10**-places + 1e-9, (csv_text, value)


@pytest.mark.parametrize("path", EXAMPLES, ids=lambda p: p.stem)
def test_export_and_report_agree_on_every_number(path, tmp_path):
    """Every air and surface number of the report (read from its typed cells) equals the CSV
    export's value for the same reading, to the CSV's precision."""
    header, rows = _csv(path, tmp_path)
    col = {
        "kind": _column(header, r"kind|row_kind|reading_kind"),
        "visit": _column(header, r"visit(_number)?"),
        "room": _column(header, r"room(_id)?"),
        "location": _column(header, r"location"),
        "dry_bulb": _column(header, r"(air_)?(dry_bulb|air_temp)_c"),
        "rh": _column(header, r"(air_)?rh_pct"),
        "dew": _column(header, r"dew_point_c"),
        "frost": _column(header, r"frost_point_c"),
        "ratio": _column(header, r"humidity_ratio_g_per_kg"),
        "surface": _column(header, r"surface_temp_c"),
        "surface_rh": _column(header, r"surface_rh_pct"),
        "margin": _column(header, r"(dew_point_|condensation_)?margin(_to_condensation)?_k"),
    }
    survey = store.load_survey(path)
    doc = report.build(survey, report.ReportOptions(visit="all", generated_at="fixed"))
    compared = 0
    for index in range(len(survey.visits)):
        va = evaluate.assess_visit(survey, index)
        number = str(index + 1)
        for room_id in va.room_ids:
            tables = {
                b.name: b
                for b in doc.blocks
                if isinstance(b, Table) and b.room == room_id and b.visit == index + 1
            }
            air = next(
                r
                for r in rows
                if r[col["kind"]] == "room_air"
                and r[col["visit"]] == number
                and r[col["room"]] == room_id
            )
            cells = {c.key: c.value for _, c in tables["readings"].rows if c.key}
            _agree(air[col["dry_bulb"]], cells["air.dry_bulb_c"])
            _agree(air[col["rh"]], cells["air.rh_pct"])
            _agree(air[col["ratio"]], cells["air.humidity_ratio_kg_per_kg"], 1000.0)
            point = cells["air.condensation_point_c"]
            _agree(air[col["frost"]] or air[col["dew"]] if point < 0.01 else air[col["dew"]], point)
            surfaces = [
                r
                for r in rows
                if r[col["kind"]] == "surface"
                and r[col["visit"]] == number
                and r[col["room"]] == room_id
            ]
            table = tables.get("surfaces")
            assert len(surfaces) == (len(table.rows) if table else 0)
            for csv_row, cells_row in zip(surfaces, table.rows if table else (), strict=False):
                assert csv_row[col["location"]] == cells_row[0].text
                shown = {c.key: c.value for c in cells_row if c.key}
                _agree(csv_row[col["surface"]], shown["surface_temp_c"])
                _agree(csv_row[col["surface_rh"]], shown["surface_rh_pct"])
                _agree(csv_row[col["margin"]], shown["dew_point_margin_k"])
                compared += 1
    assert compared > 0
