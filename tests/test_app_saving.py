"""Saving from the app: a failure is shown and nothing is lost, then saving recovers; a
survey locked by another process opens read-only with the holder named; a file that fails to
load is left untouched; reopening returns to the room last edited."""

from __future__ import annotations

import os
import shutil
import subprocess
import sys

from textual import events

from survey import store
from survey.app import make_app
from survey.app.main import DEMO_SOURCE

SIZE = (120, 40)


#: Key names of the punctuation typed here (letters and digits are their own names).
KEY_NAMES = {
    " ": "space",
    "-": "minus",
    ".": "full_stop",
    ",": "comma",
    "[": "left_square_bracket",
    "]": "right_square_bracket",
    ":": "colon",
    "/": "slash",
    "%": "percent_sign",
}


def send_keys(app, text: str) -> None:
    """Send ``text`` as key events one after another, at typing speed (read in order)."""
    for char in text:
        app.post_message(events.Key(KEY_NAMES.get(char, char), char))


async def settle(pilot, app) -> None:
    await pilot.pause()
    await app.workers.wait_for_complete()
    await pilot.pause()


async def rename_first_room(pilot, app, name: str) -> None:
    app.open_room(app.editor.survey.rooms[0].id)
    await settle(pilot, app)
    app.screen.query_one("#room-name-input").focus()
    send_keys(app, name)
    await pilot.press("enter")
    await settle(pilot, app)


async def test_a_failed_save_is_shown_kept_and_retried(tmp_path):
    """A read-only file refuses the save (root included): the status line says NOT SAVED,
    the change stays in the app, and once writable again Ctrl+S saves it."""
    path = tmp_path / "survey.json"
    shutil.copyfile(DEMO_SOURCE, path)
    before = path.read_bytes()
    app = make_app(path, data_dir=tmp_path / "data")
    async with app.run_test(size=SIZE) as pilot:
        await settle(pilot, app)
        os.chmod(path, 0o444)
        await rename_first_room(pilot, app, "Attic")
        assert app.status_text.startswith("NOT SAVED")
        assert "read-only" in app.status_text
        assert str(app.screen.query_one(".status-bar").render()).startswith("NOT SAVED")
        assert path.read_bytes() == before
        assert app.editor.survey.rooms[0].name == "Attic"  # kept in the app
        os.chmod(path, 0o644)
        await pilot.press("ctrl+s")
        await settle(pilot, app)
        assert app.status_text.startswith("Saved")
    assert store.load_survey(path).rooms[0].name == "Attic"


async def test_a_failed_save_in_a_read_only_folder(tmp_path):
    """The same in a read-only folder (skipped as root, whom folder modes do not stop)."""
    if os.geteuid() == 0:
        import pytest

        pytest.skip("root writes into read-only folders")
    folder = tmp_path / "jobs"
    folder.mkdir()
    path = folder / "survey.json"
    shutil.copyfile(DEMO_SOURCE, path)
    app = make_app(path, data_dir=tmp_path / "data")
    async with app.run_test(size=SIZE) as pilot:
        await settle(pilot, app)
        os.chmod(folder, 0o555)
        try:
            await rename_first_room(pilot, app, "Attic")
            assert app.status_text.startswith("NOT SAVED")
        finally:
            os.chmod(folder, 0o755)
        await pilot.press("ctrl+s")
        await settle(pilot, app)
        assert app.status_text.startswith("Saved")
    assert store.load_survey(path).rooms[0].name == "Attic"


async def test_a_locked_survey_opens_read_only(tmp_path):
    """Another live process holds the lock: the app opens the survey read-only, names the
    holder, refuses edits and leaves the file and the lock as they were."""
    path = tmp_path / "survey.json"
    shutil.copyfile(DEMO_SOURCE, path)
    before = path.read_bytes()
    holder = subprocess.Popen(
        [
            sys.executable,
            "-c",
            (
                "import sys, time; from survey import store; "
                "s = store.open_for_editing(sys.argv[1]); "
                "print('ready', flush=True); time.sleep(60)"
            ),
            str(path),
        ],
        stdout=subprocess.PIPE,
        text=True,
    )
    try:
        assert holder.stdout.readline().strip() == "ready"
        lock_before = store.lock_path(path).read_bytes()
        app = make_app(path, data_dir=tmp_path / "data")
        async with app.run_test(size=SIZE) as pilot:
            await settle(pilot, app)
            assert app.editor.read_only
            assert f"process {holder.pid}" in app.status_text
            assert "[read-only]" in str(app.screen.query_one(".screen-title").render())
            app.open_room(app.editor.survey.rooms[0].id)
            await settle(pilot, app)
            assert app.screen.query_one("#room-name-input").disabled
            app.screen.query_one("#surfaces").focus()
            await pilot.press("d")  # delete: refused
            await settle(pilot, app)
            assert "read-only" in app.status_text
            assert len(app.editor.survey.visits[0].rooms[0].surfaces) == 6
        assert path.read_bytes() == before
        assert store.lock_path(path).read_bytes() == lock_before
    finally:
        holder.kill()
        holder.wait()


async def test_a_damaged_file_is_not_opened_and_left_untouched(tmp_path):
    """A file that fails to load: the store's message on the start screen, file unchanged."""
    path = tmp_path / "survey.json"
    path.write_bytes(b'{"schema_version": 1, "site": {"reference": ')
    app = make_app(path, data_dir=tmp_path / "data")
    async with app.run_test(size=SIZE) as pilot:
        await settle(pilot, app)
        assert app.editor is None
        assert app.status_text.startswith("Not opened")
        assert type(app.screen).__name__ == "StartScreen"
    assert path.read_bytes() == b'{"schema_version": 1, "site": {"reference": '
    assert not store.lock_path(path).exists()


async def test_reopening_returns_to_the_room_last_edited(tmp_path):
    """Quit in the second room; the next start opens that room, with the change saved."""
    path = tmp_path / "survey.json"
    shutil.copyfile(DEMO_SOURCE, path)
    data = tmp_path / "data"
    app = make_app(path, data_dir=data)
    async with app.run_test(size=SIZE) as pilot:
        await settle(pilot, app)
        app.open_room(app.editor.survey.rooms[1].id)
        await settle(pilot, app)
        app.screen.query_one("#room-occupants-input").focus()
        await pilot.press("3", "enter")
        await settle(pilot, app)
        await pilot.press("ctrl+q")
    assert not store.lock_path(path).exists()
    again = make_app(path, data_dir=data)
    async with again.run_test(size=SIZE) as pilot:
        await settle(pilot, again)
        assert type(again.screen).__name__ == "RoomScreen"
        assert again.screen.room_id == again.editor.survey.rooms[1].id
        assert again.editor.survey.rooms[1].occupants == 3


async def test_the_demo_copies_the_example_and_never_edits_it(tmp_path):
    """`survey demo` edits a copy in the data folder; the bundled file stays as it is, and
    the bundled file is the example site of the repository."""
    from pathlib import Path

    bundled = DEMO_SOURCE.read_bytes()
    example = Path(__file__).parents[1] / "example_sites" / "winter-flat-bedroom-mould.json"
    assert bundled == example.read_bytes()
    app = make_app(demo=True, data_dir=tmp_path / "data")
    async with app.run_test(size=SIZE) as pilot:
        await settle(pilot, app)
        await rename_first_room(pilot, app, "Attic")
        assert app.editor.path.is_relative_to(tmp_path / "data")
    assert DEMO_SOURCE.read_bytes() == bundled
    assert (
        store.load_survey(tmp_path / "data" / "demo" / "demo-flat-9.json").rooms[0].name == "Attic"
    )


async def test_equipment_added_by_keys_is_saved_and_judged(tmp_path):
    """A running dehumidifier added on the room screen is saved, and the room is then judged
    as being dried (evaluate's rule: drying equipment running)."""
    from survey import evaluate

    path = tmp_path / "survey.json"
    shutil.copyfile(DEMO_SOURCE, path)
    app = make_app(path, data_dir=tmp_path / "data")
    async with app.run_test(size=SIZE) as pilot:
        await settle(pilot, app)
        app.open_room(app.editor.survey.rooms[0].id)
        await settle(pilot, app)
        app.screen.query_one("#equipment").focus()
        await pilot.press("a")
        await settle(pilot, app)
        for text in (None, "Dehu 1", None, "20", "3"):  # kind and "running" as offered
            if text is None:  # a drop-down: Enter opens it, Enter keeps the choice shown
                await pilot.press("enter")
                await pilot.pause()
            else:
                send_keys(app, text)
            await pilot.press("enter")
        await settle(pilot, app)
    room = store.load_survey(path).visits[0].rooms[0]
    assert [
        (e.kind, e.label, e.running, e.capacity_l_per_day, e.water_removed_l)
        for e in room.equipment
    ] == [("refrigerant_dehumidifier", "Dehu 1", True, 20.0, 3.0)]
    assert evaluate.drying_in_progress(room)


async def test_a_locked_survey_without_visits_is_shown_not_started(tmp_path):
    """Read-only, a survey with no visit gets none: F3 says so and shows the rooms."""
    from survey import model

    path = tmp_path / "empty.json"
    survey = store.new_survey("Empty site")
    survey.rooms.append(model.Room(id="hall", name="Hall"))
    store.save_survey(survey, path)
    before = path.read_bytes()
    holder = subprocess.Popen(
        [
            sys.executable,
            "-c",
            (
                "import sys, time; from survey import store; "
                "s = store.open_for_editing(sys.argv[1]); "
                "print('ready', flush=True); time.sleep(60)"
            ),
            str(path),
        ],
        stdout=subprocess.PIPE,
        text=True,
    )
    try:
        assert holder.stdout.readline().strip() == "ready"
        app = make_app(path, data_dir=tmp_path / "data")
        async with app.run_test(size=SIZE) as pilot:
            await settle(pilot, app)
            await pilot.press("f3")
            await settle(pilot, app)
            assert type(app.screen).__name__ == "RoomListScreen"
            assert "no visit" in app.status_text
            await pilot.press("enter")  # open the room: refused, no crash
            await settle(pilot, app)
            assert type(app.screen).__name__ == "RoomListScreen"
        assert path.read_bytes() == before
    finally:
        holder.kill()
        holder.wait()


async def test_text_typed_then_quit_is_saved(tmp_path):
    """A value typed but not yet committed with Enter is committed and saved on Ctrl+Q."""
    path = tmp_path / "survey.json"
    shutil.copyfile(DEMO_SOURCE, path)
    app = make_app(path, data_dir=tmp_path / "data")
    async with app.run_test(size=SIZE) as pilot:
        await settle(pilot, app)
        app.open_room(app.editor.survey.rooms[0].id)
        await settle(pilot, app)
        app.screen.query_one("#room-occupants-input").focus()
        await pilot.pause()
        send_keys(app, "4")
        await pilot.pause()
        await pilot.press("ctrl+q")
    assert store.load_survey(path).rooms[0].occupants == 4


async def test_the_open_survey_opened_again_stays_editable_under_its_lock(tmp_path):
    """Back on the start screen, the demo opened again (d), and the file picked again from
    the recent list: each time the survey opens editable, not read-only against this app's
    own lock, and the lock file stays, naming this process, so no other program can take
    the file for editing while it is open here. Starting the demo afresh does the same."""
    data = tmp_path / "data"
    app = make_app(demo=True, data_dir=data)
    async with app.run_test(size=SIZE) as pilot:
        await settle(pilot, app)
        path = app.editor.path
        for again in ("d", "recent", "fresh"):
            app.show_start()
            await settle(pilot, app)
            assert type(app.screen).__name__ == "StartScreen"
            if again == "d":
                await pilot.press("d")
            elif again == "recent":
                app.open_survey(path)
            else:
                app.open_demo(fresh=True)
            await settle(pilot, app)
            assert app.editor is not None and not app.editor.read_only, again
            holder = store.read_lock(path)
            assert holder is not None and holder.pid == os.getpid(), again
        await rename_first_room(pilot, app, "Attic")
    assert store.load_survey(path).rooms[0].name == "Attic"
    assert not store.lock_path(path).exists()


def _without_air(tmp_path, outdoor: bool = True):
    """The demo with no air reading in its first room (and, ``outdoor`` False, none
    outdoors): the file's path and the room's id."""
    import json

    data = json.loads(DEMO_SOURCE.read_text(encoding="utf-8"))
    data["visits"][0]["rooms"][0].pop("air", None)
    if not outdoor:
        data["visits"][0].pop("outdoor", None)
    path = tmp_path / "no-air.json"
    path.write_text(json.dumps(data), encoding="utf-8")
    return path, data["visits"][0]["rooms"][0]["room"]


async def _half_a_reading(pilot, app, room_id: str) -> None:
    """The room opened and 20 °C committed with no RH: half a reading, not saved."""
    await settle(pilot, app)
    app.open_room(room_id)
    await settle(pilot, app)
    app.screen.query_one("#room-temp-input").focus()
    send_keys(app, "20")
    await pilot.press("enter")
    await settle(pilot, app)


async def test_quitting_with_half_an_air_reading_asks_first(tmp_path):
    """A room with no air reading: 20 °C typed and committed with no RH is kept on screen
    but cannot be saved. Ctrl+Q then asks; n stays (the 20 °C still there); Ctrl+Q twice
    quits, and the file holds no air reading for the room (nothing half-saved)."""
    import json

    from survey.app.air import AirPair
    from survey.app.dialogs import ConfirmDialog

    path, room_id = _without_air(tmp_path)
    app = make_app(path, data_dir=tmp_path / "data")
    async with app.run_test(size=SIZE) as pilot:
        await _half_a_reading(pilot, app, room_id)
        assert app.screen.query_one(AirPair).unsaved_half() is not None
        await pilot.press("ctrl+q")
        await settle(pilot, app)
        assert isinstance(app.screen, ConfirmDialog)
        assert "air temperature of 20 °C with no RH" in app.screen.question
        await pilot.press("n")
        await settle(pilot, app)
        assert app.is_running and app.screen.query_one(AirPair).temp_c == 20.0
        await pilot.press("ctrl+q")
        await settle(pilot, app)
        await pilot.press(
            "ctrl+q"
        )  # asked again: a second Ctrl+Q is the answer, not a second question
        await settle(pilot, app)
        assert app.editor is None  # quit: the survey closed, its lock let go
        assert not store.lock_path(path).exists()
    saved = json.loads(path.read_text(encoding="utf-8"))
    assert saved["visits"][0]["rooms"][0].get("air") is None


async def test_leaving_a_screen_with_half_an_air_reading_asks_first(tmp_path):
    """Escape, a screen key or a new visit left half an air reading behind without a word
    (only quitting asked). Now each asks as quitting does: n stays with the half on screen;
    y lets it go, the screen is left, and coming back shows the field empty again. The
    outdoor reading on the visit screen is asked about the same way."""

    from survey.app.air import AirPair
    from survey.app.dialogs import ConfirmDialog

    path, room_id = _without_air(tmp_path, outdoor=False)
    before = path.read_bytes()
    app = make_app(path, data_dir=tmp_path / "data")
    async with app.run_test(size=SIZE) as pilot:
        await _half_a_reading(pilot, app, room_id)
        for key in ("escape", "f5", "f7"):
            await pilot.press(key)
            await settle(pilot, app)
            assert isinstance(app.screen, ConfirmDialog), key
            assert "air temperature of 20 °C with no RH" in app.screen.question
            assert "Leave it unsaved?" in app.screen.question
            await pilot.press("n")
            await settle(pilot, app)
            assert type(app.screen).__name__ == "RoomScreen"
            assert app.screen.query_one(AirPair).temp_c == 20.0
        await pilot.press("escape")
        await settle(pilot, app)
        await pilot.press("y")
        await settle(pilot, app)
        assert type(app.screen).__name__ == "RoomListScreen"
        app.open_room(room_id)
        await settle(pilot, app)
        pair = app.screen.query_one(AirPair)
        assert pair.temp_c is None and pair.unsaved_half() is None
        assert app.screen.query_one("#room-temp-input").value == ""

        await pilot.press("f3")
        await settle(pilot, app)
        app.screen.query_one("#outdoor-rh-input").focus()
        send_keys(app, "80")
        await pilot.press("enter")
        await settle(pilot, app)
        await pilot.press("f4")
        await settle(pilot, app)
        assert isinstance(app.screen, ConfirmDialog)
        assert "an RH of 80 % with no air temperature" in app.screen.question
        await pilot.press("y")
        await settle(pilot, app)
        assert type(app.screen).__name__ == "RoomListScreen"
    assert path.read_bytes() == before  # nothing half-saved


async def test_half_an_air_reading_is_asked_about_under_help_and_typed_text_first(tmp_path):
    """With the help screen over the room, a screen key still asks about the half reading
    under it; a second screen key while the question shows does not leave past it. An RH
    typed but not committed is committed before the question, so the reading is whole and
    saved, and nothing is asked."""

    from survey.app.air import AirPair
    from survey.app.dialogs import ConfirmDialog

    path, room_id = _without_air(tmp_path)
    app = make_app(path, data_dir=tmp_path / "data")
    async with app.run_test(size=SIZE) as pilot:
        await _half_a_reading(pilot, app, room_id)
        await pilot.press("f1")
        await settle(pilot, app)
        assert type(app.screen).__name__ == "HelpScreen"
        await pilot.press("f4")
        await settle(pilot, app)
        assert isinstance(app.screen, ConfirmDialog)
        await pilot.press("f5")  # asked already: the question stays, nothing is left
        await settle(pilot, app)
        assert isinstance(app.screen, ConfirmDialog)
        await pilot.press("n")
        await settle(pilot, app)
        await pilot.press("escape")  # out of help
        await settle(pilot, app)
        assert type(app.screen).__name__ == "RoomScreen"
        assert app.screen.query_one(AirPair).temp_c == 20.0

        rh = app.screen.query_one("#room-rh-input")
        rh.focus()
        await pilot.pause()
        rh.value = "60"  # typed, not committed
        await pilot.press("f4")
        await settle(pilot, app)
        assert type(app.screen).__name__ == "RoomListScreen"
    air = store.load_survey(path).visits[0].rooms[0].air
    assert (air.dry_bulb_c, air.rh_pct) == (20.0, 60.0)


async def test_an_air_reading_emptied_is_deleted_only_when_confirmed_and_u_puts_it_back(tmp_path):
    """The demo's main bedroom holds 17.5 °C, 72 %. The temperature emptied and committed
    asks; n keeps the reading (the field shows it again, the file unchanged). Asked again,
    y deletes it (the file holds no air reading for the room, the panel says so); u from
    the surfaces table puts it back, in the file and in both fields."""
    import json

    from survey.app.dialogs import ConfirmDialog

    path = tmp_path / "demo.json"
    shutil.copyfile(DEMO_SOURCE, path)
    before = path.read_bytes()
    room_id = json.loads(before)["visits"][0]["rooms"][0]["room"]
    app = make_app(path, data_dir=tmp_path / "data")

    def stored_air():
        return json.loads(path.read_text(encoding="utf-8"))["visits"][0]["rooms"][0].get("air")

    async with app.run_test(size=SIZE) as pilot:
        await settle(pilot, app)
        app.open_room(room_id)
        await settle(pilot, app)
        box = app.screen.query_one("#room-temp-input")
        assert box.value == "17.5"
        box.focus()
        box.value = ""
        await pilot.press("enter")
        await settle(pilot, app)
        assert isinstance(app.screen, ConfirmDialog)
        assert "17.5 °C, 72 %" in app.screen.question
        await pilot.press("n")
        await settle(pilot, app)
        assert app.screen.query_one("#room-temp-input").value == "17.5"
        assert path.read_bytes() == before

        box = app.screen.query_one("#room-temp-input")
        box.focus()
        box.value = ""
        await pilot.press("enter")
        await settle(pilot, app)
        await pilot.press("y")
        await settle(pilot, app)
        assert stored_air() is None
        assert app.screen.query_one("#room-rh-input").value == ""
        # the undo hint stays beside the save that followed, not replaced by it
        assert app.status_text.startswith("Deleted the air reading — u puts it back. Saved ")

        app.screen.query_one("#surfaces").focus()
        await pilot.press("u")
        await settle(pilot, app)
        air = stored_air()
        assert (air["dry_bulb_c"], air["rh_pct"]) == (17.5, 72.0)
        assert app.screen.query_one("#room-temp-input").value == "17.5"
        assert app.screen.query_one("#room-rh-input").value == "72"
