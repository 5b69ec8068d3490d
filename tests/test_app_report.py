"""The report preview in the app: the core's report shown, and written beside the survey
(Markdown or HTML) in a worker, byte for byte what ``survey report`` would write with the
same options."""

from __future__ import annotations

import datetime as dt
import shutil
from pathlib import Path

import pytest
from textual.widgets import Select, Static

from survey import report, store
from survey.app import make_app
from survey.app.report_view import ReportScreen

FIXED_NOW = dt.datetime(2026, 12, 1, 9, 30)
EXAMPLES = Path(__file__).resolve().parents[1] / "example_sites"


def _copy(tmp_path: Path, name: str = "winter-flat-bedroom-mould") -> Path:
    path = tmp_path / f"{name}.json"
    shutil.copyfile(EXAMPLES / f"{name}.json", path)
    return path


def _options(path: Path, **changes) -> report.ReportOptions:
    values = {
        "generated_at": FIXED_NOW.strftime("%Y-%m-%d %H:%M"),
        "source_name": path.name,
        "survey_dir": path.parent,
        "report_dir": path.parent,
    }
    values.update(changes)
    return report.ReportOptions(**values)


async def _open_report(pilot, app) -> ReportScreen:
    await pilot.press("f8")
    await pilot.pause()
    await app.workers.wait_for_complete()
    await pilot.pause()
    assert isinstance(app.screen, ReportScreen)
    return app.screen


@pytest.mark.parametrize("kind", ["md", "html"])
async def test_the_report_is_written_as_the_command_writes_it(tmp_path, kind):
    path = _copy(tmp_path)
    app = make_app(path, data_dir=tmp_path / "data", clock=lambda: FIXED_NOW)
    async with app.run_test(size=(100, 30)) as pilot:
        await _open_report(pilot, app)
        await pilot.press("w" if kind == "md" else "h")
        await app.workers.wait_for_complete()
        await pilot.pause()
        out = tmp_path / f"winter-flat-bedroom-mould-report.{kind}"
        assert "Report written" in app.status_text and out.name in app.status_text
    survey = store.load_survey(path)
    options = _options(path, chart_stem=out.stem)
    if kind == "md":
        doc, charts = report.build_with_charts(survey, options)
        assert out.read_text(encoding="utf-8") == report.render(doc)
        assert charts and all(
            (tmp_path / c.name).read_text(encoding="utf-8") == c.svg for c in charts
        )
    else:
        assert out.read_text(encoding="utf-8") == report.html_report(survey, options)


async def test_the_preview_shows_the_report_and_follows_the_options(tmp_path):
    path = _copy(tmp_path, "basement-burst-pipe-drying")
    app = make_app(path, data_dir=tmp_path / "data", clock=lambda: FIXED_NOW)
    async with app.run_test(size=(100, 30)) as pilot:
        screen = await _open_report(pilot, app)
        shown = screen.source
        survey = store.load_survey(path)
        assert shown == report.markdown_report(survey, _options(path))
        screen.query_one("#report-units", Select).value = "ip"
        await pilot.pause()
        await app.workers.wait_for_complete()
        await pilot.pause()
        shown = screen.source
        assert shown == report.markdown_report(survey, _options(path, units="ip"))
        assert "°F" in shown


async def test_hostile_room_names_show_literally_in_the_preview(tmp_path):
    path = _copy(tmp_path)
    survey = store.load_survey(path)
    survey.rooms[0].name = "[b]Loft[/b] | *x* <script>"
    store.save_survey(survey, path)
    app = make_app(path, data_dir=tmp_path / "data", clock=lambda: FIXED_NOW)
    async with app.run_test(size=(100, 30)) as pilot:
        screen = await _open_report(pilot, app)
        source = screen.source
        assert source == report.markdown_report(survey, _options(path))
        await pilot.pause()
        shown = "\n".join(
            "".join(segment.text for segment in line)
            for line in screen.query_one("#report-text", Static).render_lines(
                screen.query_one("#report-text", Static).region.reset_offset
            )
        )
        assert "[b]Loft[/b]" in shown and "<script>" in shown


async def test_a_report_that_cannot_be_written_says_so_and_keeps_the_survey(tmp_path):
    path = _copy(tmp_path)
    before = path.read_bytes()
    (tmp_path / "winter-flat-bedroom-mould-report.md").mkdir()  # a folder in the way
    app = make_app(path, data_dir=tmp_path / "data", clock=lambda: FIXED_NOW)
    async with app.run_test(size=(100, 30)) as pilot:
        await _open_report(pilot, app)
        await pilot.press("w")
        await app.workers.wait_for_complete()
        await pilot.pause()
        assert "Report NOT written" in app.status_text
    assert path.read_bytes() == before


async def test_a_keys_file_remaps_by_binding_id_and_names_what_it_skips(tmp_path):
    """keys.json in the data folder moves the report from F8 to F9; an unknown id and a
    key that is not a key name are named in the status line and change nothing."""
    path = _copy(tmp_path)
    data = tmp_path / "data"
    data.mkdir()
    (data / "keys.json").write_text(
        '{"go_report": "f9", "no_such_binding": "x", "go_site": "\\u0007"}', encoding="utf-8"
    )
    app = make_app(path, data_dir=data, clock=lambda: FIXED_NOW)
    async with app.run_test(size=(100, 30)) as pilot:
        await pilot.pause()
        assert "no binding has the id no_such_binding" in app.status_text
        assert "go_site: the key must be a key name" in app.status_text
        await pilot.press("f8")
        await pilot.pause()
        assert not isinstance(app.screen, ReportScreen)
        await pilot.press("f9")
        await pilot.pause()
        await app.workers.wait_for_complete()
        assert isinstance(app.screen, ReportScreen)
        await pilot.press("f2")  # go_site keeps its own key
        await pilot.pause()
        assert type(app.screen).__name__ == "SiteScreen"


@pytest.mark.parametrize(
    ("text", "problem"),
    [("[1, 2]", "must hold an object"), ("{", "is not JSON"), (b"\xff\xfe", "could not be read")],
)
def test_a_keys_file_that_cannot_be_used_leaves_the_usual_keys(tmp_path, text, problem):
    from survey.app import keymap

    path = tmp_path / "keys.json"
    if isinstance(text, bytes):
        path.write_bytes(text)
    else:
        path.write_text(text, encoding="utf-8")
    found, problems = keymap.load(tmp_path)
    assert found == {} and len(problems) == 1 and problem in problems[0]
