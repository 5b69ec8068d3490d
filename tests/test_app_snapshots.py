"""Snapshots of the start screen, a room, the site findings and the help at 80×24 and
120×40 (fixed paths and clock, cursor blink off). Update with ``--snapshot-update`` after a
deliberate change of layout, and look at the pictures before committing them."""

from __future__ import annotations

import datetime as dt
import shutil
from pathlib import Path

import pytest
from textual.widgets import Input

from survey.app import make_app
from survey.app.main import DEMO_SOURCE

SIZES = [(80, 24), (120, 40)]


def _steady(app) -> None:
    for widget in app.screen.query(Input):
        widget.cursor_blink = False


async def _settled(pilot, app) -> None:
    """Until the screen has stopped changing: the saves done, the refreshes asked for after
    a layout (the room's lines under its tables scroll into sight then) run, and no
    animation left. Two pauses were not always enough on a loaded machine: the room's
    form was caught before its last layout, its scroll bar a row off."""
    await app.workers.wait_for_complete()
    for _ in range(4):
        await pilot.pause()
    await pilot.wait_for_scheduled_animations()
    await pilot.pause()


@pytest.fixture
def demo_app(tmp_path, monkeypatch):
    """The demo survey as ``survey.json`` in a temporary folder (shown by that name)."""
    monkeypatch.chdir(tmp_path)
    shutil.copyfile(DEMO_SOURCE, tmp_path / "survey.json")
    return lambda: make_app(  # the data folder by a relative name, shown the same every run
        "survey.json", data_dir=Path("data"), clock=lambda: dt.datetime(2026, 12, 1, 9, 30)
    )


@pytest.mark.parametrize("size", SIZES)
def test_start_screen(snap_compare, tmp_path, size):
    app = make_app(data_dir=tmp_path / "data")
    assert snap_compare(app, terminal_size=size)


@pytest.mark.parametrize("size", SIZES)
def test_room_screen(snap_compare, demo_app, size):
    app = demo_app()

    async def open_room(pilot):
        app.open_room(app.editor.survey.rooms[0].id)
        await _settled(pilot, app)
        _steady(app)

    assert snap_compare(app, terminal_size=size, run_before=open_room)


@pytest.mark.parametrize("size", SIZES)
def test_site_findings(snap_compare, demo_app, size):
    app = demo_app()

    async def findings(pilot):
        app.go("findings")
        await pilot.pause()
        await pilot.pause()

    assert snap_compare(app, terminal_size=size, run_before=findings)


@pytest.mark.parametrize("size", SIZES)
def test_help(snap_compare, demo_app, size):
    assert snap_compare(demo_app(), terminal_size=size, press=["f1", "_"])
