"""Moving through forms and lists by keys: a drop-down list behaves as the text fields do (a
choice made by Enter is saved and moves on; Escape closes the list and stays), and back from
a room the room list is where it was, on the room just left."""

from __future__ import annotations

import json
import shutil
from pathlib import Path

from survey.app import make_app
from survey.app.fields import Choice

EXAMPLE = Path(__file__).resolve().parents[1] / "example_sites" / "winter-flat-bedroom-mould.json"


async def test_a_choice_made_by_enter_is_saved_and_moves_on(tmp_path):
    path = tmp_path / EXAMPLE.name
    shutil.copyfile(EXAMPLE, path)
    app = make_app(path, data_dir=tmp_path / "data")
    async with app.run_test(size=(100, 30)) as pilot:
        await pilot.pause()
        room_id = app.editor.survey.rooms[0].id
        app.open_room(room_id)
        await pilot.pause()
        use = app.screen.query_one("#room-use", Choice)
        assert use.value == "bedroom"
        use.focus()
        await pilot.pause()

        await pilot.press("enter")  # opens the list
        await pilot.pause()
        assert use.expanded
        await pilot.press("escape")  # closes it: nothing chosen, the focus stays
        await pilot.pause()
        assert not use.expanded and app.focused is use and use.value == "bedroom"

        await pilot.press("enter", "down", "enter")
        await pilot.pause()
        await pilot.pause()
        assert not use.expanded
        assert app.focused is not use and app.focused.id == "room-volume-input"
        chosen = use.value
        assert chosen != "bedroom"
        await app.workers.wait_for_complete()  # saved in a worker: read the file after it
        saved = json.loads(path.read_text(encoding="utf-8"))
        assert next(r for r in saved["rooms"] if r["id"] == room_id)["use"] == chosen

        await pilot.press("enter")  # from the next field on, not back into the list
        await pilot.pause()
        assert not use.expanded


async def test_back_from_a_room_the_list_is_on_that_room(tmp_path):
    """Enter on the third room, then Escape: the room list is the same screen, its cursor on
    the third room; Ctrl+N to the next room to read, then Escape: on that room."""
    from survey.app.tables import RoomTable

    path = tmp_path / EXAMPLE.name
    shutil.copyfile(EXAMPLE, path)
    app = make_app(path, data_dir=tmp_path / "data")
    async with app.run_test(size=(100, 30)) as pilot:
        await pilot.pause()
        rooms_screen = app.screen
        assert type(rooms_screen).__name__ == "RoomListScreen"
        await pilot.press("down", "down", "enter")
        await pilot.pause()
        assert app.screen.room_id == app.editor.survey.rooms[2].id
        app.screen.query_one("#surfaces").focus()
        await pilot.press("escape")
        await pilot.pause()
        assert app.screen is rooms_screen
        assert rooms_screen.query_one(RoomTable).cursor_row == 2

        await pilot.press("enter")
        await pilot.pause()
        app.open_room(app.editor.survey.rooms[4].id)  # as Ctrl+N to the fifth does
        await pilot.pause()
        app.screen.query_one("#surfaces").focus()
        await pilot.press("escape")
        await pilot.pause()
        assert rooms_screen.query_one(RoomTable).cursor_row == 4


async def test_a_room_renamed_to_another_rooms_name_is_refused_and_kept(tmp_path):
    """r on the first room, typed as the second room's name in other letters' case: refused
    with the same "Not saved —" message as every field, the dialog stays, the name is kept."""
    from textual.widgets import Input, Static

    from survey import store

    path = tmp_path / EXAMPLE.name
    shutil.copyfile(EXAMPLE, path)
    before = path.read_bytes()
    app = make_app(path, data_dir=tmp_path / "data")
    async with app.run_test(size=(100, 30)) as pilot:
        await pilot.pause()
        first, second = app.editor.survey.rooms[:2]
        await pilot.press("r")
        await pilot.pause()
        box = app.screen.query_one("#prompt-0", Input)
        box.value = second.name.upper()
        await pilot.press("enter")
        await pilot.pause()
        message = str(app.screen.query_one("#prompt-message", Static).render())
        assert message.startswith("Not saved — room name ")
        assert message.endswith("another room has this name")
        assert app.editor.survey.rooms[0].name == first.name
    assert path.read_bytes() == before
    assert store.load_survey(path).rooms[0].name == first.name


async def test_a_visit_chosen_is_the_visit_edited(tmp_path):
    """On a survey of three visits, the visit screen shows the last; visit 1 chosen from
    the list, its label edited: visit 1's label changes in the file and visit 3's does not
    (the screen is built again on the visit chosen, not kept on the one shown before)."""
    import json

    from textual.widgets import Input

    source = EXAMPLE.parent / "basement-burst-pipe-drying.json"
    path = tmp_path / source.name
    shutil.copyfile(source, path)
    labels_before = [v["label"] for v in json.loads(path.read_text(encoding="utf-8"))["visits"]]
    assert len(labels_before) == 3
    app = make_app(path, data_dir=tmp_path / "data")
    async with app.run_test(size=(100, 30)) as pilot:
        await pilot.pause()
        app.editor.visit_index = 2
        app.go("visit")
        await pilot.pause()
        choice = app.screen.query_one("#visit-choice", Choice)
        choice.focus()
        await pilot.pause()
        await pilot.press("enter", "home", "enter")  # open the list, the first visit
        await pilot.pause()
        await pilot.pause()
        assert app.editor.visit_index == 0
        box = app.screen.query_one("#visit-label-input", Input)
        assert box.value == labels_before[0]
        box.focus()
        box.value = "Day 1, edited"
        await pilot.press("enter")
        await pilot.pause()
        await app.workers.wait_for_complete()
    labels = [v["label"] for v in json.loads(path.read_text(encoding="utf-8"))["visits"]]
    assert labels == ["Day 1, edited", *labels_before[1:]]
