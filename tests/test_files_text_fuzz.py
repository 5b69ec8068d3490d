"""Random text through the survey's text fields and a logger file, into the file commands.

Whatever a name, label, location or logger header holds (control characters, ESC
sequences, bidi overrides, NUL, markup brackets), `validate`, `import-log` and
`export --csv -` on a terminal print no control character other than newline and tab and
raise nothing; a CSV written for a file or a pipe holds no NUL byte and no text cell that a
spreadsheet would run.
"""

from __future__ import annotations

import csv
import io
import sys
import unicodedata
from pathlib import Path

import pytest
from hypothesis import HealthCheck, given, settings
from hypothesis import strategies as st

from survey import export, store
from survey.cli import main

FLAT = Path(__file__).resolve().parents[1] / "example_sites" / "winter-flat-bedroom-mould.json"

_SETTINGS = settings(
    max_examples=40,
    deadline=None,
    suppress_health_check=[HealthCheck.function_scoped_fixture, HealthCheck.too_slow],
)

#: Text as hostile files carry it: control characters, ESC sequences, bidi overrides,
#: markup brackets, spreadsheet formula starts, full-width forms, any other character.
_TEXT = st.lists(
    st.one_of(
        st.sampled_from(
            [
                "\x1b",
                "\x07",
                "\x00",
                "\x08",
                "\r",
                "\n",
                "\t",
                "\u202e",
                "\u2066",
                "\u200b",
                "[",
                "]",
                "[/bold]",
                "[link=x]",
                "=",
                "+",
                "-",
                "@",
                "\uff1d",
                "\uff20",
                " ",
                ",",
                '"',
                "\x9b",
                "\x1b[2J",
            ]
        ),
        st.characters(exclude_categories=("Cs",)),
    ),  # a file cannot hold a lone surrogate
    min_size=1,
    max_size=15,
).map("".join)


def _no_raw_control(text: str) -> bool:
    return not any(
        unicodedata.category(c) in ("Cc", "Cf", "Cs", "Zl", "Zp") and c not in "\n\t" for c in text
    )


def _odd_survey(tmp_path: Path, texts: list[str]) -> Path:
    survey = store.load_survey(FLAT)
    room_visit = survey.visits[0].rooms[0]
    survey.rooms[0].name = texts[0]
    survey.visits[0].label = texts[1]
    room_visit.surfaces[0].location = texts[2]
    room_visit.surfaces[0].material = texts[3]
    room_visit.materials[0].location = texts[4]
    path = tmp_path / "odd.json"
    store.save_survey(survey, path)
    return path


@_SETTINGS
@given(texts=st.lists(_TEXT, min_size=5, max_size=5))
def test_export_to_a_terminal_prints_no_control_character(
    tmp_path_factory, texts, capsys, monkeypatch
):
    """`export --csv -` on a terminal: only newline and tab (and CR LF line ends) remain."""
    path = _odd_survey(tmp_path_factory.mktemp("t"), texts)
    monkeypatch.setattr(sys.stdout, "isatty", lambda: True)
    assert main(["export", str(path), "--csv", "-"]) == 0
    captured = capsys.readouterr()
    assert _no_raw_control(captured.out.replace("\r\n", "\n")) and _no_raw_control(captured.err)


_FORMULA = tuple("=+-@\uff1d\uff0b\uff0d\uff20")


@_SETTINGS
@given(texts=st.lists(_TEXT, min_size=5, max_size=5))
def test_exported_text_cells_never_start_a_formula_or_hold_a_nul(texts):
    """No text cell of the CSV starts a live formula, and no NUL is written."""
    survey = store.load_survey(FLAT)
    survey.rooms[0].name = texts[0]
    survey.visits[0].label = texts[1]
    survey.visits[0].rooms[0].surfaces[0].location = texts[2]
    out = io.StringIO()
    export.write_csv(survey, out)
    assert "\x00" not in out.getvalue()
    for row in csv.DictReader(io.StringIO(out.getvalue(), newline="")):
        for column in ("room_name", "visit_label", "location"):
            cell = row[column]
            if cell.lstrip().startswith(_FORMULA) or cell.startswith(("\t", "\r")):
                assert cell.startswith("'") or export._PLAIN_NUMBER.fullmatch(cell), cell


@_SETTINGS
@given(texts=st.lists(_TEXT, min_size=5, max_size=5))
def test_validate_prints_no_control_character(tmp_path_factory, texts, capsys):
    """`validate` of a survey full of odd text prints its ok line with nothing raw."""
    path = _odd_survey(tmp_path_factory.mktemp("v"), texts)
    assert main(["validate", str(path)]) == 0
    captured = capsys.readouterr()
    assert _no_raw_control(captured.out) and _no_raw_control(captured.err)


@_SETTINGS
@given(name=_TEXT, header=_TEXT, cell=_TEXT)
def test_import_log_prints_no_control_character(tmp_path_factory, name, header, cell, capsys):
    """import-log with odd names, headers and cells prints nothing raw, import or refusal."""
    folder = tmp_path_factory.mktemp("i")
    path = _odd_survey(folder, [name, "v", "l", "m", "x"])
    log = folder / "unit.csv"
    text = (
        f"Time,Temperature {header.replace(',', ' ')} (°C),RH (%)\n"
        f"2025-01-15 10:00,18.5,70\n2025-01-15 10:30,{cell.replace(',', ' ')},70\n"
    )
    log.write_text(text, encoding="utf-8", errors="replace")
    status = main(["import-log", str(path), "--room", "bed1", "--csv", str(log), "--dry-run"])
    captured = capsys.readouterr()
    assert status in (0, 1, 2)
    assert _no_raw_control(captured.out) and _no_raw_control(captured.err)


@pytest.mark.parametrize("text", ["[/bold]", "[link=http://example.invalid]x[/link]"])
def test_markup_in_a_room_name_is_printed_as_it_is(tmp_path, capsys, text):
    """Rich-style markup in a room name is printed literally by import-log."""
    path = tmp_path / "s.json"
    survey = store.load_survey(FLAT)
    survey.rooms[0].name = text
    store.save_survey(survey, path)
    log = tmp_path / "unit.csv"
    log.write_text("Time,Temperature (°C),RH (%)\n2025-01-15 10:00,18.5,70\n", encoding="utf-8")
    assert main(["import-log", str(path), "--room", "bed1", "--csv", str(log)]) == 0
    assert f"into {text} (bed1)" in capsys.readouterr().out
