"""The site report: its structure parsed back with markdown-it-py, its numbers read as the
typed values of the assessment, its cautions, and one golden report.

The golden file is rewritten only for a deliberate change of the report
(``SURVEY_GOLDEN_WRITE=1 python -m pytest tests/test_report.py``).
"""

from __future__ import annotations

import itertools
import os
from pathlib import Path

import pytest
from markdown_it import MarkdownIt

from survey import evaluate, report, store, words
from survey import thresholds as th
from survey.report.markdown import Items, Table
from survey.words import report as rw

ROOT = Path(__file__).resolve().parents[1]
EXAMPLES = sorted((ROOT / "example_sites").glob("*.json"))
FLAT = ROOT / "example_sites" / "winter-flat-bedroom-mould.json"
BASEMENT = ROOT / "example_sites" / "basement-burst-pipe-drying.json"
GOLDEN = ROOT / "tests" / "data" / "report"
WRITE = os.environ.get("SURVEY_GOLDEN_WRITE") == "1"
FIXED_TIME = "2025-01-16 08:00 UTC"  # a fixed generated-at line, so the bytes are the same


def _options(path: Path, **more) -> report.ReportOptions:
    return report.ReportOptions(
        generated_at=FIXED_TIME,
        source_name=path.name,
        survey_dir=path.parent,
        report_dir=path.parent,
        **more,
    )


def _parser() -> MarkdownIt:
    return MarkdownIt("commonmark", {"html": False}).enable("table")


def _headings(tokens) -> list[tuple[int, str]]:
    out = []
    for i, token in enumerate(tokens):
        if token.type == "heading_open":
            out.append((int(token.tag[1]), tokens[i + 1].content))
    return out


def _tables(tokens) -> list[list[int]]:
    """Cells per row of every table: [header cells, body row cells, ...]."""
    tables, rows, cells = [], None, 0
    for token in tokens:
        if token.type == "table_open":
            rows = []
        elif token.type == "tr_open":
            cells = 0
        elif token.type in ("th_open", "td_open"):
            cells += 1
        elif token.type == "tr_close":
            rows.append(cells)
        elif token.type == "table_close":
            tables.append(rows)
    return tables


# --- structure ---------------------------------------------------------------------------


@pytest.mark.parametrize("path", EXAMPLES, ids=lambda p: p.stem)
@pytest.mark.parametrize("visit", ["last", "all"])
def test_example_report_headings_in_order_and_tables_whole(path, visit):
    """Each example's report parses to the designed order of sections, and every table row
    has as many cells as its header, in the Markdown and in the blocks."""
    survey = store.load_survey(path)
    doc = report.build(survey, _options(path, visit=visit))
    tokens = _parser().parse(report.render(doc))
    headings = _headings(tokens)
    assert headings[0] == (1, rw.title(survey.site.reference))
    top = [text for level, text in headings if level == 2]
    h = rw.HEADINGS
    visits = report.selected_visits(survey, visit)
    expected = [h["summary"], h["scope"]]
    expected += [
        rw.visit_heading(
            i + 1, len(survey.visits), survey.visits[i].label, survey.visits[i].started_at
        )
        for i in visits
    ]
    if len(survey.visits) > 1:
        expected.append(h["drying"])
    expected += [h["safety"], h["method"], h["glossary"]]
    assert top == expected
    levels = [level for level, _ in headings]
    assert all(b - a <= 1 for a, b in itertools.pairwise(levels))  # no level skipped
    tables = _tables(tokens)
    blocks = [b for b in doc.blocks if isinstance(b, Table)]
    assert len(tables) == len(blocks) > 0
    for rows, block in zip(tables, blocks, strict=False):
        assert rows == [len(block.header)] * (len(block.rows) + 1)


def test_report_bytes_are_deterministic():
    """The same survey and options give the same bytes."""
    survey = store.load_survey(BASEMENT)
    first = report.markdown_report(survey, _options(BASEMENT, visit="all"))
    assert first == report.markdown_report(
        store.load_survey(BASEMENT), _options(BASEMENT, visit="all")
    )
    assert FIXED_TIME in first


def test_golden_report():
    """The flat's report is byte for byte the recorded one."""
    text = report.markdown_report(store.load_survey(FLAT), _options(FLAT))
    golden = GOLDEN / "winter-flat-bedroom-mould.md"
    if WRITE:
        golden.parent.mkdir(parents=True, exist_ok=True)
        golden.write_text(text, encoding="utf-8")
    assert text == golden.read_text(encoding="utf-8")


# --- numbers are the assessment's -----------------------------------------------------------


def _field(record, key: str):
    for part in key.split("."):
        record = getattr(record, part)
    return record


def _room_blocks(doc, room_id):
    return [b for b in doc.blocks if getattr(b, "room", None) == room_id]


def test_every_number_of_a_room_is_the_assessments():
    """Every number shown for the main bedroom is the typed value of its finding, surface,
    material reading or action — compared as floats, not as text."""
    survey = store.load_survey(FLAT)
    va = evaluate.assess_visit(survey, 0)
    position = va.room_ids.index("bed1")
    finding, advice = va.findings.rooms[position], va.advice.rooms[position]
    blocks = _room_blocks(report.build(survey, _options(FLAT)), "bed1")
    by_name = {b.name: b for b in blocks}
    readings = by_name["readings"]
    keyed = [cell for _, cell in readings.rows if cell.key]
    assert {c.key for c in keyed} >= {
        "air.dry_bulb_c",
        "air.rh_pct",
        "air.condensation_point_c",
        "air.humidity_ratio_kg_per_kg",
        "max_room_rh_pct",
        "vapour_pressure_excess_pa",
        "timber_emc_pct",
    }
    for cell in keyed:
        assert cell.value == _field(finding, cell.key)
    surfaces = by_name["surfaces"]
    assert len(surfaces.rows) == len(finding.surfaces)
    for row, surface in zip(surfaces.rows, finding.surfaces, strict=False):
        assert row[0].text == surface.label
        keys = {c.key for c in row if c.key}
        assert keys == {
            "surface_temp_c",
            "surface_rh_pct",
            "dew_point_margin_k",
            "temperature_factor",
        }
        for cell in row:
            if cell.key:
                assert cell.value == getattr(surface, cell.key)
        assert row[3].text == words.SI.temperature(surface.surface_temp_c)
    materials = by_name["materials"]
    assert len(materials.rows) == len(finding.materials)
    for row, material in zip(materials.rows, finding.materials, strict=False):
        for cell in row:
            if cell.key:
                assert cell.value == getattr(material, cell.key)
    assert by_name["actions"].values == advice.actions


# --- cautions ------------------------------------------------------------------------------


@pytest.mark.parametrize("path", EXAMPLES, ids=lambda p: p.stem)
def test_a_caution_appears_exactly_when_its_finding_does(path):
    """Each room points to exactly the cautions its findings raise (visible mould when mould
    was seen, a confined space for a confined use, the water category seen …), and the
    safety section says every raised caution and no other."""
    survey = store.load_survey(path)
    for index in range(len(survey.visits)):
        va = evaluate.assess_visit(survey, index)
        doc = report.build(survey, _options(path, visit=index + 1))
        text = report.render(doc)
        raised = set()
        for room_id, f, advice in zip(
            va.room_ids, va.findings.rooms, va.advice.rooms, strict=False
        ):
            pointer = [b for b in _room_blocks(doc, room_id) if b.name == "room_cautions"]
            keys = {c.key for c in (pointer[0].values if pointer else ())}
            obs = f.room.observations
            assert ("visible_mould" in keys) == obs.mould_seen
            assert ("mould_if_visible" in keys) == (
                not obs.mould_seen and any(s.mould.value == "above_limit" for s in f.surfaces)
            )
            assert ("confined_space" in keys) == th.room_use(f.use).confined
            for category in (1, 2, 3):
                assert (f"water_category_{category}" in keys) == (obs.water_category == category)
            assert keys == {c.key for c in advice.cautions} - {"closing"}
            raised |= set(pointer[0].values if pointer else ())
        safety = next(b for b in doc.blocks if isinstance(b, Items) and b.name == "cautions")
        assert set(safety.values) == raised
        for caution in raised:
            assert report.escape(words.caution_text(caution, words.SI)) in text


@pytest.mark.parametrize("path", EXAMPLES, ids=lambda p: p.stem)
def test_safety_and_deferral_in_every_report(path, tmp_path):
    """The safety section, the general cautions and the deferral to local codes and licensed
    professionals are in every report — with findings, with none, and with no visit."""
    import msgspec

    survey = store.load_survey(path)
    bare = msgspec.structs.replace(survey, visits=[])
    for case in (survey, bare, _calm_survey()):
        text = report.markdown_report(case, _options(path))
        tokens = _parser().parse(text)
        assert (2, rw.HEADINGS["safety"]) in _headings(tokens)
        assert report.escape(words.CLOSING_TEXT) in text
        assert report.escape(rw.DEFERRAL) in text
        for general in rw.GENERAL_CAUTIONS:
            assert report.escape(general) in text


def _calm_survey():
    """One dry, warm room with a warm wall: nothing found, nothing to do."""
    import json

    doc = {
        "schema_version": 2,
        "site": {"reference": "Calm", "year_built": 2010},
        "rooms": [{"id": "r", "name": "Study", "use": "office", "volume_m3": 30.0}],
        "visits": [
            {
                "started_at": "2025-03-01T10:00:00",
                "outdoor": {"dry_bulb_c": 8.0, "rh_pct": 70.0},
                "rooms": [
                    {
                        "room": "r",
                        "air": {"dry_bulb_c": 21.0, "rh_pct": 40.0},
                        "surfaces": [
                            {"location": "Wall", "element": "internal_wall", "surface_temp_c": 20.0}
                        ],
                    }
                ],
            }
        ],
    }
    return store.loads_survey(json.dumps(doc).encode())


def test_a_calm_survey_has_no_findings_or_actions():
    """Nothing found and nothing to do is said in words, and no caution is raised."""
    text = report.markdown_report(_calm_survey(), _options(FLAT))
    assert report.escape(rw.SUMMARY_NO_FINDINGS) in text
    assert report.escape(rw.SUMMARY_NO_ACTIONS) in text
    assert report.escape(rw.SAFETY_NONE) in text


def test_no_visits_says_so():
    """A survey with no visits still gives a report, saying there are no findings."""
    import msgspec

    survey = msgspec.structs.replace(store.load_survey(FLAT), visits=[])
    text = report.markdown_report(survey, _options(FLAT))
    assert report.escape(rw.NO_VISITS) in text


def test_visit_out_of_range_is_an_input_error():
    """A visit number that is not in the survey names the visits there are."""
    from survey.errors import InputError

    with pytest.raises(InputError) as info:
        report.build(store.load_survey(FLAT), _options(FLAT, visit=2))
    assert info.value.field == "visit" and "1 to 1" in info.value.allowed


def test_report_loads_neither_textual_nor_rich():
    """The report is core: building an SI report and its HTML loads no textual, Rich or
    pint (markdown-it-py is its one library)."""
    import subprocess
    import sys

    code = (
        "import sys\nfrom survey import report, store\n"
        f"s = store.load_survey({str(FLAT)!r})\n"
        "report.html_report(s, report.ReportOptions(units='si'))\n"
        "print('\\n'.join(sys.modules))"
    )
    result = subprocess.run(
        [sys.executable, "-c", code], capture_output=True, text=True, timeout=60, cwd=ROOT
    )
    assert result.returncode == 0, result.stderr
    loaded = set(result.stdout.split())
    assert "markdown_it" in loaded
    assert not any(name.split(".")[0] in ("textual", "rich", "pint") for name in loaded)


def test_outdoor_logger_of_the_days_before_is_in_the_conditions():
    """An outdoor logger's samples from the three days before a visit are summed up under
    the visit's conditions (count, span, temperature and RH range); later samples are not."""
    import datetime as dt

    import msgspec

    from survey import model

    survey = store.load_survey(FLAT)
    start = survey.visits[0].started_at
    samples = [
        model.LogSample(at=start - dt.timedelta(hours=h), dry_bulb_c=t, rh_pct=rh)
        for h, t, rh in ((48, -1.5, 93.0), (24, 0.5, 88.0), (1, 1.8, 86.0))
    ]
    samples.append(model.LogSample(at=start + dt.timedelta(hours=2), dry_bulb_c=9.0, rh_pct=50.0))
    log = model.LogSeries(room=None, source="garden.csv", samples=samples)
    text = report.markdown_report(msgspec.structs.replace(survey, logs=[log]), _options(FLAT))
    expected = rw.logger_before_text(
        "garden.csv", 3, samples[0].at, samples[2].at, -1.5, 1.8, 86.0, 93.0, words.SI
    )
    assert report.escape(expected) in text
    assert "-1.5 °C to 1.8 °C, 86 to 93 % RH" in expected  # the logged extremes, as logged
