"""Bad input typed into the app's fields: each shows a message under its field naming what
was typed and what is allowed, the last good value stays, and the file on disk is unchanged.
Also: a warning (not a refusal) for an implausible but possible value, and user text shown as
text, never as markup."""

from __future__ import annotations

import datetime as dt
import shutil
from pathlib import Path

import pytest
from textual import events

from survey import store
from survey.app import make_app
from survey.app.main import DEMO_SOURCE

SIZE = (120, 40)

#: (screen, field id, text typed, a word the message must contain)
BAD_INPUTS = [
    ("room", "room-temp", "abc", "abc"),  # letters
    ("room", "room-temp", "1e309", "1e309"),  # overflows to infinity
    ("room", "room-temp", "nan", "nan"),  # not a number
    ("room", "room-temp", "99", "99"),  # above the 70 °C domain
    ("room", "room-temp", "21 kg", "21 kg"),  # wrong unit
    ("room", "room-temp", "-51", "-51"),  # below the −50 °C domain
    ("room", "room-rh", "0.5", "fraction"),  # a fraction, not percent
    ("room", "room-rh", "101", "101"),  # above 100 %
    ("room", "room-rh", "65 K", "65 K"),  # wrong unit
    ("room", "room-rh", "-5", "-5"),  # negative
    ("room", "room-rh", "1e309", "1e309"),
    ("room", "room-volume", "4.2 x 3.1", "4.2 x 3.1"),  # two dimensions of three
    ("room", "room-volume", "4 x 3 x abc", "abc"),
    ("room", "room-volume", "0.01", "0.01"),  # below the room-volume domain
    ("room", "room-occupants", "2.5", "2.5"),  # not a whole number
    ("room", "room-occupants", "-1", "-1"),
    ("room", "room-occupants", "many", "many"),
    ("room", "room-name", "", "empty"),
    ("room", "room-photos", "/etc/passwd", "absolute"),  # outside the survey's folder
    ("room", "room-photos", "../up.jpg", ".."),
    ("room", "seen-area", "-1", "-1"),  # a negative mould area
    ("visit", "visit-started", "yesterday", "yesterday"),
    ("visit", "outdoor-temp", "inf", "inf"),
    ("visit", "outdoor-temp", "", "needed"),  # empty (a room's emptied air asks instead)
    ("visit", "outdoor-rh", "nan", "nan"),
    ("visit", "visit-pressure", "12 kg", "12 kg"),  # wrong unit
    ("visit", "visit-pressure", "5 hPa", "5 hPa"),  # below the pressure domain
    ("visit", "visit-photos", "../x.jpg", ".."),
    ("room", "room-level", "1.5", "1.5"),  # a storey is a whole number
    ("room", "room-floor-area", "3 m3", "3 m3"),  # a volume, not an area
    ("room", "room-height", "-2", "-2"),
    ("room", "room-showers-per-day", "lots", "lots"),
    ("site", "site-reference", "", "empty"),
    ("site", "site-year", "2090", "2090"),  # after this year (1990 mistyped)
]


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


async def type_into(pilot, app, field_id: str, text: str) -> None:
    """Focus a field (its text is selected), type over it and press Enter."""
    app.screen.query_one(f"#{field_id}-input").focus()
    await pilot.pause()
    for key in ("end", "shift+home", "backspace"):  # the old text goes
        app.post_message(events.Key(key, None))
    await pilot.pause()  # bindings act as the key bubbles: let them finish first
    send_keys(app, text)
    app.post_message(events.Key("enter", None))
    await pilot.pause()
    await app.workers.wait_for_complete()


def message_of(app, field_id: str) -> str:
    message = app.screen.query_one(f"#{field_id} .field-message")
    return str(message.render()) if message.display else ""


def _demo_app(tmp_path):
    """A copy of the demo survey and the app opened on it (the data folder in tmp_path)."""
    path = tmp_path / "survey.json"
    shutil.copyfile(DEMO_SOURCE, path)
    return path, make_app(path, data_dir=tmp_path / "data")


def _demo_without_room_air(tmp_path) -> Path:
    """A copy of the demo survey with its first room's air reading removed."""
    path = tmp_path / "survey.json"
    shutil.copyfile(DEMO_SOURCE, path)
    survey = store.load_survey(path)
    survey.visits[0].rooms[0].air = None
    store.save_survey(survey, path)
    return path


async def _type_first_surface_temp(pilot, app, *keys: str) -> None:
    """On the first room, its first surface's dialog opened and ``keys`` typed over its
    temperature, then Enter."""
    await goto(pilot, app, "room")
    app.screen.query_one("#surfaces").focus()
    await pilot.press("e")
    await pilot.pause()
    await pilot.press("ctrl+a", "ctrl+k", *keys, "enter")
    await pilot.pause()


async def goto(pilot, app, screen: str) -> None:
    if screen == "room":
        app.open_room(app.editor.survey.rooms[0].id)
    else:
        app.go(screen)
    await pilot.pause()
    await pilot.pause()


@pytest.mark.slow
async def test_bad_inputs_show_a_message_and_change_nothing(tmp_path):
    """At least 20 bad values, each refused with its message; the file stays byte for byte."""
    path = tmp_path / "survey.json"
    shutil.copyfile(DEMO_SOURCE, path)
    before = path.read_bytes()
    app = make_app(path, data_dir=tmp_path / "data")
    async with app.run_test(size=SIZE) as pilot:
        await pilot.pause()
        shown_screen = ""
        for screen, field_id, text, word in BAD_INPUTS:
            if screen != shown_screen:
                await goto(pilot, app, screen)
                shown_screen = screen
            await type_into(pilot, app, field_id, text)
            message = message_of(app, field_id)
            assert message.startswith("Not saved"), (field_id, text, message)
            assert word in message, (field_id, text, message)
            assert message.endswith(("is kept.", "Nothing is saved here yet.")), message
            assert path.read_bytes() == before, (field_id, text)
        # Pasted text with a line break is refused whole (not cut to its first line).
        await goto(pilot, app, "room")
        app.screen.query_one("#room-temp-input").focus()
        app.screen.query_one("#room-temp-input").post_message(events.Paste("6\n5"))
        await pilot.pause()
        assert "Not pasted: the text has 2 lines" in message_of(app, "room-temp")
        assert app.screen.query_one("#room-temp-input").value == "17.5"
        await type_into(pilot, app, "room-temp", "abc")
        assert message_of(app, "room-temp").endswith("The last good value, 17.5, is kept.")
        await type_into(pilot, app, "room-temp", "17.5")
        await pilot.press("enter")
        await pilot.pause()
        await app.workers.wait_for_complete()
        assert path.read_bytes() == before
        assert app.editor.survey.visits[0].rooms[0].air.dry_bulb_c == 17.5  # last good
    assert len(BAD_INPUTS) >= 20


async def test_a_bad_surface_temperature_is_not_saved(tmp_path):
    """The surface dialog refuses −70 °C (under the −60 °C surface domain); nothing saved."""
    path = tmp_path / "survey.json"
    shutil.copyfile(DEMO_SOURCE, path)
    before = path.read_bytes()
    app = make_app(path, data_dir=tmp_path / "data")
    async with app.run_test(size=SIZE) as pilot:
        await _type_first_surface_temp(pilot, app, "minus", "7", "0")
        assert type(app.screen).__name__ == "SurfaceDialog"
        assert "-70" in message_of(app, "surface-temp")
        await pilot.press("escape")
        await pilot.pause()
        await app.workers.wait_for_complete()
    assert path.read_bytes() == before


async def test_implausible_rh_is_saved_with_a_warning(tmp_path):
    """RH 99 % is possible: saved, with a warning under the field; so is a new reading taken
    long after the visit began (the demo visit began on 2025-01-15 09:40; the app's clock
    here is 2026-12-01 09:30; the room's reading is removed first, so this one is new)."""
    path = _demo_without_room_air(tmp_path)
    app = make_app(path, data_dir=tmp_path / "data", clock=lambda: dt.datetime(2026, 12, 1, 9, 30))
    async with app.run_test(size=SIZE) as pilot:
        await goto(pilot, app, "room")
        await type_into(pilot, app, "room-temp", "17.5")
        await type_into(pilot, app, "room-rh", "99")
        assert "close to saturation" in message_of(app, "room-rh")
        assert "days after this visit began" in message_of(app, "room-rh")
    assert store.load_survey(path).visits[0].rooms[0].air.rh_pct == 99.0


async def test_room_names_are_text_not_markup(tmp_path):
    """A room called '[b]Loft[/b]' or '[/bold]' is shown literally and breaks nothing."""
    path, app = _demo_app(tmp_path)
    async with app.run_test(size=SIZE) as pilot:
        await goto(pilot, app, "room")
        await type_into(pilot, app, "room-name", "[b]Loft[/b]")
        await goto(pilot, app, "rooms")
        table = app.screen.query_one("#rooms")
        assert table.get_row_at(0)[1].plain == "[b]Loft[/b]"
        await goto(pilot, app, "room")
        await type_into(pilot, app, "room-name", "[/bold]")
        assert "[/bold]" in str(app.screen.query_one(".screen-title").render())
    assert store.load_survey(path).rooms[0].name == "[/bold]"


async def test_control_characters_from_a_file_are_made_visible(tmp_path):
    """A room name with a bell character from a file shows as '\\x07', never raw."""
    path = tmp_path / "survey.json"
    survey = store.load_survey(DEMO_SOURCE)
    survey.rooms[0].name = "Bed\x07room"
    store.save_survey(survey, path)
    app = make_app(path, data_dir=tmp_path / "data")
    async with app.run_test(size=SIZE) as pilot:
        await pilot.pause()
        cell = app.screen.query_one("#rooms").get_row_at(0)[1].plain
        assert cell == "Bed\\x07room"


async def test_the_room_and_visit_details_are_saved_in_si(tmp_path):
    """Storey, floor area (typed in ft², stored in m²), height, showers a day, heating on,
    the visit's pressure, notes and photos: each committed value is in the saved file."""
    path, app = _demo_app(tmp_path)
    async with app.run_test(size=SIZE) as pilot:
        await goto(pilot, app, "room")
        await type_into(pilot, app, "room-level", "3")
        await type_into(pilot, app, "room-floor-area", "100 sq ft")
        await type_into(pilot, app, "room-height", "2.4")
        await type_into(pilot, app, "room-showers-per-day", "2")
        await type_into(pilot, app, "seen-area", "6 ft2")
        app.screen.query_one("#visit-heating").value = "no"
        await pilot.pause()
        await app.workers.wait_for_complete()
        await goto(pilot, app, "visit")
        await type_into(pilot, app, "visit-pressure", "29.5 inHg")
        await type_into(pilot, app, "visit-notes", "Windy; [b]not[/b] bold")
        await type_into(pilot, app, "visit-photos", "a.jpg, b.jpg")
    saved = store.load_survey(path)
    room, visit = saved.rooms[0], saved.visits[0]
    assert room.level == 3
    assert room.floor_area_m2 == pytest.approx(100 * 0.3048**2)  # exact foot
    assert room.height_m == 2.4 and room.showers_per_day == 2.0
    record = visit.room_visit(room.id)
    assert record.heating_on is False
    assert record.observations.mould_area_m2 == pytest.approx(6 * 0.3048**2)
    assert visit.pressure_pa == pytest.approx(29.5 * 3386.389)  # NIST SP 811 inHg (32 °F)
    assert visit.notes == "Windy; [b]not[/b] bold" and visit.photos == ["a.jpg", "b.jpg"]


async def test_correcting_an_old_reading_keeps_its_time(tmp_path):
    """Correcting day 1's room RH on the basement's day 3 keeps the reading's time and
    instrument (it is a correction, not a reading taken today), so the drying trend keeps
    its order; a reading not there before is stamped with the time it is typed."""
    path = tmp_path / "b.json"
    examples = Path(__file__).resolve().parents[1] / "example_sites"
    shutil.copyfile(examples / "basement-burst-pipe-drying.json", path)
    before = store.load_survey(path)
    app = make_app(path, data_dir=tmp_path / "data", clock=lambda: dt.datetime(2026, 12, 2, 9))
    async with app.run_test(size=SIZE) as pilot:
        await pilot.pause()
        app.editor.visit_index = 0
        app.open_room("family")
        await pilot.pause()
        await pilot.pause()
        await type_into(pilot, app, "room-rh", "81")
        app.editor.visit_index = 2
        app.go("visit")
        await pilot.pause()
        await pilot.pause()
    after = store.load_survey(path)
    old, new = before.visits[0].rooms[0].air, after.visits[0].rooms[0].air
    assert new.rh_pct == 81.0
    assert (new.taken_at, new.instrument) == (old.taken_at, old.instrument)


async def test_the_live_panel_never_shows_a_refused_value(tmp_path):
    """RH typed as '70F' is refused (a temperature unit on an RH): the live panel goes back
    to the stored reading (72 % in the demo's main bedroom), never the 70 % typed on the
    way."""
    _path, app = _demo_app(tmp_path)
    async with app.run_test(size=SIZE) as pilot:
        await goto(pilot, app, "room")
        await type_into(pilot, app, "room-rh", "70F")
        await pilot.pause()
        assert message_of(app, "room-rh").startswith("Not saved")
        panel = str(app.screen.query_one("#live").render())
        assert "72 % RH" in panel and "70 % RH" not in panel


async def test_enter_moves_past_a_tick_box_and_space_ticks_it(tmp_path):
    """In the surface dialog Enter walks on from "condensation seen" without ticking it,
    as it does from every field; Space ticks it."""
    from textual.widgets import Checkbox

    _path, app = _demo_app(tmp_path)
    async with app.run_test(size=SIZE) as pilot:
        await goto(pilot, app, "room")
        app.screen.query_one("#surfaces").focus()
        await pilot.press("a")
        await pilot.pause()
        box = app.screen.query_one("#surface-condensation", Checkbox)
        box.focus()
        await pilot.pause()
        await pilot.press("enter")
        await pilot.pause()
        assert box.value is False and app.focused is not box
        box.focus()
        await pilot.press("space")
        await pilot.pause()
        assert box.value is True


async def test_a_refused_value_is_named_as_it_was_typed(tmp_path):
    """An RH of 101 and an air temperature of 99 °C are outside the core's domain; the
    message names them as typed ("101", "99"), not as the floats they were read as."""
    _path, app = _demo_app(tmp_path)
    async with app.run_test(size=SIZE) as pilot:
        await goto(pilot, app, "room")
        await type_into(pilot, app, "room-rh", "101")
        message = message_of(app, "room-rh")
        assert "relative humidity 101:" in message and "101.0" not in message
        await type_into(pilot, app, "room-temp", "99")
        message = message_of(app, "room-temp")
        assert "air temperature 99:" in message and "99.0" not in message


async def test_a_long_field_not_being_typed_in_shows_the_start_of_its_text(tmp_path):
    """A field's text longer than its box showed its end ("…nels, single-glazed timber
    windows") until it was typed in; now a field without the focus shows its start, on
    the screen's first showing and after the focus leaves it."""
    from textual.widgets import Input

    _path, app = _demo_app(tmp_path)
    async with app.run_test(size=(80, 24)) as pilot:
        await goto(pilot, app, "site")
        box = app.screen.query_one("#site-construction-input", Input)
        assert len(box.value) > box.size.width and box.cursor_position == 0
        box.focus()
        await pilot.pause()
        assert box.cursor_position == len(box.value)  # typing in it: the whole text selected
        await pilot.press("tab")
        await pilot.pause()
        assert box.cursor_position == 0


async def test_an_empty_volume_says_what_it_stands_for(tmp_path):
    """The demo's main bedroom has no volume typed but a floor area (11.6 m²) and a height
    (2.4 m): the empty field says the 27.8 m³ the advice uses comes from them (its example
    "30 or 4.2 x 3.1 x 2.4" read like a value), and follows the area when it changes."""
    from textual.widgets import Input

    path = tmp_path / "survey.json"
    shutil.copyfile(DEMO_SOURCE, path)
    room = store.load_survey(path).rooms[0]
    assert room.volume_m3 is None and (room.floor_area_m2, room.height_m) == (11.6, 2.4)
    app = make_app(path, data_dir=tmp_path / "data")
    async with app.run_test(size=SIZE) as pilot:
        await goto(pilot, app, "room")
        box = app.screen.query_one("#room-volume-input", Input)
        assert box.value == "" and box.placeholder == "area × height: 27.8 m³"
        await type_into(pilot, app, "room-floor-area", "10")
        assert box.placeholder == "area × height: 24.0 m³"
        await type_into(pilot, app, "room-height", "")
        assert box.placeholder == "not given; e.g. 30, or 4.2 x 3.1 x 2.4"


async def test_a_volume_far_from_area_times_height_is_saved_with_a_warning(tmp_path):
    """Dimensions in feet typed into an SI survey (14 x 10 x 8 read as metres: 1120 m³) for
    the main bedroom of 11.6 m² × 2.4 m (27.8 m³): saved, as typed, but with a warning
    naming both volumes (the advice's litres a day scale with it); a volume near area ×
    height gets none."""
    path, app = _demo_app(tmp_path)
    async with app.run_test(size=SIZE) as pilot:
        await goto(pilot, app, "room")
        await type_into(pilot, app, "room-volume", "14 x 10 x 8")
        message = message_of(app, "room-volume")
        assert "Saved as 1120.0 m³" in message and "(27.8 m³)" in message
        await type_into(pilot, app, "room-volume", "4.2 x 2.8 x 2.4")
        assert message_of(app, "room-volume") == ""
    assert store.load_survey(path).rooms[0].volume_m3 == pytest.approx(4.2 * 2.8 * 2.4)


async def test_an_instrument_added_has_the_cursor(tmp_path):
    """The demo lists three instruments; one added by keys (id, the kind's list opened and
    kept, a name, the rest blank) is saved and the cursor is on it, so the next Enter edits
    the new one, not the one above it."""
    from textual.widgets import DataTable

    path, app = _demo_app(tmp_path)
    async with app.run_test(size=SIZE) as pilot:
        await goto(pilot, app, "site")
        table = app.screen.query_one("#instruments", DataTable)
        table.focus()
        await pilot.pause()
        await pilot.press("a")
        await pilot.pause()
        for step in ("th9", None, "Spare meter", "", "", "", ""):
            if step is None:  # the kind: a drop-down, Enter opens it and Enter keeps it
                await pilot.press("enter")
                await pilot.pause()
            else:
                app.focused.value = step
            await pilot.press("enter")
            await pilot.pause()
        await app.workers.wait_for_complete()
        await pilot.pause()
        assert table.row_count == 4 and table.cursor_row == 3
    assert [i.id for i in store.load_survey(path).instruments][-1] == "th9"


async def test_an_unlikely_surface_or_daily_use_is_taken_after_a_warning(tmp_path):
    """A surface at 50 °C (a hot pipe? above domain.SURFACE_TEMP_WARN_HIGH_C, common
    practice) in a room with no air reading yet: the first Enter keeps the dialog open and
    says why; the second saves it as typed. The surface dialog once closed at once and
    took its warning with it. Twenty showers a day in a bedroom are saved with a warning
    under the field (above domain.PER_DAY_WARN)."""
    from survey import domain

    assert domain.SURFACE_TEMP_WARN_HIGH_C < 50.0 and domain.PER_DAY_WARN["showers_per_day"] < 20
    path = _demo_without_room_air(tmp_path)
    app = make_app(path, data_dir=tmp_path / "data")
    async with app.run_test(size=SIZE) as pilot:
        await _type_first_surface_temp(pilot, app, "5", "0")
        assert type(app.screen).__name__ == "SurfaceDialog"
        said = str(app.screen.query_one("#dialog-message").render())
        assert said.startswith("Check the value above before saving: Enter again saves it")
        assert message_of(app, "surface-temp").startswith("above 40.0 °C: a heater, a hot pipe")
        await pilot.press("enter")
        await pilot.pause()
        await app.workers.wait_for_complete()
        assert type(app.screen).__name__ == "RoomScreen"
        await type_into(pilot, app, "room-showers-per-day", "20")
        assert message_of(app, "room-showers-per-day") == (
            "Saved; more than 10 a day is unusual: a slip, or a shared room?"
        )
    saved = store.load_survey(path)
    assert saved.visits[0].rooms[0].surfaces[0].surface_temp_c == 50.0
    assert saved.rooms[0].showers_per_day == 20.0


async def test_moving_a_visits_start_offers_to_move_its_readings_with_it(tmp_path):
    """The demo's visit began 2025-01-15 09:40; typed as 2025-01-14 09:40, the app asks
    whether the readings' times move by the same day (they drive drying rates): y moves
    every reading's time, and the visit drop-down shows the new start. Moved back with n,
    the readings keep the times they carry."""
    path, app = _demo_app(tmp_path)
    before = store.load_survey(path).visits[0]
    count = before.readings_timed()
    assert count > 0
    async with app.run_test(size=SIZE) as pilot:
        await goto(pilot, app, "visit")
        await type_into(pilot, app, "visit-started", "2025-01-14 09:40")
        await pilot.pause()
        assert type(app.screen).__name__ == "ConfirmDialog"
        assert "1 day earlier" in app.screen.question
        await pilot.press("y")
        await app.workers.wait_for_complete()
        await pilot.pause()
        assert app.status_text.startswith(f"Moved the times of {count} readings 1 day earlier")
        shown = str(app.screen.query_one("#visit-choice SelectCurrent #label").render())
        assert "2025-01-14 09:40" in shown
        await type_into(pilot, app, "visit-started", "2025-01-15 09:40")
        await pilot.pause()
        await pilot.press("n")
        await app.workers.wait_for_complete()
        await pilot.pause()
    moved = store.load_survey(path).visits[0]
    # every timed reading a day back, the start back where it was
    expected = before.readings_moved(-dt.timedelta(days=1))
    assert moved == expected and moved != before


async def test_a_start_typed_and_left_asks_first_and_a_time_zone_is_no_crash(tmp_path):
    """A new start typed with a time zone over the demo's (which has none) and left by F4
    without Enter: it is committed, the question is asked (by the wall clocks: 1 day
    earlier) and the walk stays until it is answered."""
    path, app = _demo_app(tmp_path)
    async with app.run_test(size=SIZE) as pilot:
        await goto(pilot, app, "visit")
        app.screen.query_one("#visit-started-input").focus()
        await pilot.pause()
        app.screen.query_one("#visit-started-input").value = "2025-01-14 09:40+01:00"
        await pilot.press("f4")
        await pilot.pause()
        assert type(app.screen).__name__ == "ConfirmDialog"
        assert "1 day earlier" in app.screen.question
        await pilot.press("n")
        await pilot.pause()
        assert type(app.screen).__name__ == "VisitScreen"
        await app.workers.wait_for_complete()
    started = store.load_survey(path).visits[0].started_at
    assert started.utcoffset() == dt.timedelta(hours=1)
