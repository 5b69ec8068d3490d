"""User text in the report is text: hostile strings in every text field of a survey leave
the report's structure intact, appear literally, and never become tags in the HTML."""

from __future__ import annotations

import html
import json
from pathlib import Path

import pytest
from markdown_it import MarkdownIt

from survey import report, store
from survey.report.markdown import escape, escape_lines
from survey.safe_text import visible

ROOT = Path(__file__).resolve().parents[1]
FLAT = ROOT / "example_sites" / "winter-flat-bedroom-mould.json"
BASEMENT = ROOT / "example_sites" / "basement-burst-pipe-drying.json"

#: Markdown and HTML that must never take effect, each with a tag so each field is found.
HOSTILE = [
    "| pipe | in | cells |",
    "`code` and ``more``",
    "*star* **strong** _under_ __twice__",
    "# a heading",
    "<script>alert(1)</script>",
    "[a link](https://example.invalid)",
    "![an image](x.png)",
    "\\ back\\slash \\*",
    "&amp; &lt;b&gt; entity",
    "1. a list",
    "- a bullet",
    "+ plus",
    "$x^2$ maths",
    "~~strike~~",
    "<b>bold</b> <img src=x>",
    "--- rule",
    "=== underline",
    "> a quote",
    "<https://example.invalid>",
    "ESC \x1b[31m red \x07 bell",
    "bidi \u202e reversed",
]
#: Fields that may hold several lines (notes); every other field is one line.
MULTILINE = "first line\n# second line\n\n- third | line <i>x</i>"


def _hostile_survey(tmp_path: Path, plain: bool = False):
    """The basement survey (three visits, equipment, reference room) with every text field
    replaced by a different hostile string (or, ``plain``, by plain words), a point left
    out in each room of the last visit, and one photo file present."""
    doc = json.loads(BASEMENT.read_text(encoding="utf-8"))
    counter = iter(range(10_000))
    shown: list[str] = []

    def one(text: str = "") -> str:
        value = (
            "plain words" if plain else HOSTILE[next(counter) % len(HOSTILE)]
        ) + f" #{len(shown)}"
        shown.append(value)
        return value

    def notes() -> str:
        value = "first\nsecond\n\nthird" if plain else MULTILINE
        shown.append(value)
        return value

    site = doc["site"]
    for key in ("reference", "address", "client", "inspector", "construction"):
        site[key] = one()
    site["notes"] = notes()
    for instrument in doc["instruments"]:
        instrument["name"], instrument["serial"] = one(), one()
    for room in doc["rooms"]:
        room["name"], room["notes"] = one(), notes()
    photo_names = []
    for visit in doc["visits"]:
        visit["label"], visit["weather"], visit["inspector"] = one(), one(), one()
        visit["notes"] = notes()
        for room_visit in visit["rooms"]:
            room_visit["notes"] = notes()
            room_visit.setdefault("observations", {})["notes"] = notes()
            for surface in room_visit.get("surfaces", []):
                surface["location"], surface["material"] = one(), one()
                surface["notes"] = notes()
            for material in room_visit.get("materials", []):
                material["location"] = one()
                material["notes"] = notes()
            for equipment in room_visit.get("equipment", []):
                equipment["label"], equipment["notes"] = one(), notes()
            name = (
                f"photos/p{len(photo_names)}.jpg"
                if plain
                else f"photos/[x](y) <b>{len(photo_names)} *p*|q.jpg"
            )
            room_visit["photos"] = [name]
            photo_names.append(name)
    # On the last visit each room's first material point of the visit before is left out
    # for good, with a reason (its reading there dropped): the mark reaches the scope, the
    # room's section and the drying progress.
    before = {rv["room"]: rv for rv in doc["visits"][-2]["rooms"]}
    for room_visit in doc["visits"][-1]["rooms"]:
        earlier = before.get(room_visit["room"], {}).get("materials", [])
        if not earlier or not room_visit.get("materials"):
            continue
        shown.remove(room_visit["materials"].pop(0)["location"])  # no longer in the report
        room_visit["left_out"] = [
            {
                "kind": "material",
                "location": earlier[0]["location"],
                "material": earlier[0]["material"],
                "reason": one(),
                "for_good": True,
            }
        ]
    survey_path = tmp_path / "hostile.json"
    survey = store.loads_survey(json.dumps(doc).encode())
    store.save_survey(survey, survey_path)
    (tmp_path / "photos").mkdir()
    (tmp_path / photo_names[0].replace("\\", "/")).write_bytes(b"\xff\xd8 not a real jpeg")
    return survey_path, shown, photo_names


def _text_of(tokens) -> str:
    """Every piece of text the Markdown shows, lines of a paragraph joined by newlines."""
    out = []
    for token in tokens:
        for child in token.children or ():
            if child.type in ("text", "code_inline"):
                out.append(child.content)
            elif child.type in ("softbreak", "hardbreak"):
                out.append("\n")
            elif child.type == "image":
                out.append(child.content)
        out.append("\n")
    return "".join(out)


@pytest.fixture(scope="module")
def hostile(tmp_path_factory):
    tmp_path = tmp_path_factory.mktemp("hostile")
    path, shown, photos = _hostile_survey(tmp_path)
    survey = store.load_survey(path)
    options = report.ReportOptions(
        visit="all",
        generated_at="fixed",
        source_name=path.name,
        survey_dir=tmp_path,
        report_dir=tmp_path,
    )
    return (
        survey,
        shown,
        photos,
        report.markdown_report(survey, options),
        report.html_report(survey, options),
    )


@pytest.fixture(scope="module")
def hostile_plain(tmp_path_factory):
    tmp_path = tmp_path_factory.mktemp("plain")
    path, _, _ = _hostile_survey(tmp_path, plain=True)
    options = report.ReportOptions(
        visit="all",
        generated_at="fixed",
        source_name=path.name,
        survey_dir=tmp_path,
        report_dir=tmp_path,
    )
    return report.markdown_report(store.load_survey(path), options)


def test_hostile_text_leaves_the_structure_intact(hostile, hostile_plain):
    """No user string adds a heading, a list, a quote, a table cell, a link, code, emphasis
    or raw HTML: the hostile report has the same blocks as a report of plain names."""
    markdown = hostile[3]
    tokens = MarkdownIt("commonmark", {"html": False}).enable("table").parse(markdown)
    kinds = {t.type for t in tokens} | {c.type for t in tokens for c in t.children or ()}
    assert not kinds & {
        "html_block",
        "html_inline",
        "link_open",
        "code_inline",
        "code_block",
        "fence",
        "blockquote_open",
        "hr",
        "s_open",
        "lheading",
    }
    images = [c for t in tokens for c in t.children or () if c.type == "image"]
    assert len(images) == 1  # the one photo that exists; the others are listed as missing
    assert images[0].attrs["src"].startswith("photos/")
    plain_tokens = MarkdownIt("commonmark", {"html": False}).enable("table").parse(hostile_plain)
    assert [t.type for t in tokens] == [t.type for t in plain_tokens]

    def marks(stream):
        return [
            c.type
            for t in stream
            for c in t.children or ()
            if c.type in ("strong_open", "em_open", "image", "hardbreak")
        ]

    assert marks(tokens) == marks(plain_tokens)


def test_hostile_text_appears_literally(hostile):
    """Every hostile string shows as written (control characters as visible escapes), in
    the Markdown's text and in the HTML's."""
    _, shown, photos, markdown, page = hostile
    tokens = MarkdownIt("commonmark", {"html": False}).enable("table").parse(markdown)
    text = _text_of(tokens)
    page_text = html.unescape(page)
    for value in shown:
        for line in visible(value, keep_newlines=True).split("\n"):
            if line.strip():
                assert line.strip() in text, line
                assert line.strip() in page_text, line
    for name in photos:
        assert name in text


def test_hostile_text_never_becomes_a_tag_in_the_html(hostile):
    """The HTML page has only the tags the report itself writes: no script, no user tag,
    no link, one image (the photo found), no style or script fetched from anywhere."""
    _, _, _, _, page = hostile
    lowered = page.lower()
    assert "<script" not in lowered and "<b>" not in lowered and "<i>" not in lowered
    assert "<a " not in lowered and lowered.count("<img") == 1
    assert "http" not in lowered.split("</style>")[0]  # nothing fetched by the head
    assert "\x1b" not in page and "\x07" not in page and "\u202e" not in page


@pytest.mark.parametrize("text", [*HOSTILE, "", "   ", "-3.2 °C", "12. not a list", "a\nb"])
def test_escape_gives_the_text_back(text):
    """One escaped string renders to exactly its visible text, inside a paragraph and inside
    a table cell."""
    parser = MarkdownIt("commonmark", {"html": False}).enable("table")
    shown = visible(text).strip()
    paragraph = parser.parseInline(escape(text))[0].children if shown else []
    assert "".join(c.content for c in paragraph) == shown
    table = parser.parse(f"| a |\n| --- |\n| {escape(text) or '–'} |\n")
    cells = [t for t in table if t.type == "inline"]
    assert len(cells) == 2 and "".join(c.content for c in cells[1].children) == (shown or "–")


def test_negative_numbers_and_plain_words_are_not_escaped():
    """A reader in a pager sees '-3.2 °C' and 'Bedroom (north)' without backslashes."""
    assert escape("-3.2 °C") == "-3.2 °C"
    assert escape("Bedroom (north), 2 walls!") == "Bedroom (north), 2 walls!"


def test_note_lines_keep_their_breaks():
    """A multi-line note keeps its lines (hard breaks) and its paragraphs."""
    lines = escape_lines("one\n# two\n\n- three")
    assert lines == ["one\\", "\\# two", "", "\\- three"]
    assert escape_lines("one\r\ntwo") == ["one\\", "two"]  # Windows line ends
    assert escape_lines("a\rb") == ["a\\\\x0db"]  # a lone CR is a control character, shown
