"""The app walked by keys alone: a new survey, the site, a visit with its outdoor reading,
two rooms with three surfaces and a material reading each, a second visit from the first;
then the saved file is loaded and its values and findings checked."""

from __future__ import annotations

import datetime as dt

import CoolProp.CoolProp as CP
import pytest
from textual import events

from survey import evaluate, store
from survey.app import make_app

FIXED_NOW = dt.datetime(2026, 12, 1, 9, 30)
SIZE = (100, 30)


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


async def type_text(pilot, text: str) -> None:
    """Type ``text`` as key events sent one after another at typing speed (the app reads
    them in order), then let the app catch up once."""
    for char in text:
        pilot.app.post_message(events.Key(KEY_NAMES.get(char, char), char))
    await pilot.pause()


async def settle(pilot, app) -> None:
    """Let screens switch and the save worker finish."""
    await pilot.pause()
    await app.workers.wait_for_complete()
    await pilot.pause()


async def press(pilot, *keys: str) -> None:
    """Press named keys one after another, then let the app catch up once."""
    for key in keys:
        pilot.app.post_message(events.Key(key, key if len(key) == 1 else None))
    await pilot.pause()


async def field(pilot, text: str) -> None:
    """Type into the focused field (its old text is selected on focus) and press Enter."""
    for char in text:
        pilot.app.post_message(events.Key(KEY_NAMES.get(char, char), char))
    await press(pilot, "enter")


async def add_surface(pilot, app, location: str, temp: str) -> None:
    await press(pilot, "a")
    await settle(pilot, app)
    await field(pilot, location)  # Location, Enter: to Element
    await press(pilot, "tab", "tab")  # keep "external wall", no material
    await press(pilot, "tab", "tab")  # past "condensation seen" and "mould seen"
    await field(pilot, temp)  # Temperature, Enter: saved
    await settle(pilot, app)


async def add_material(pilot, app, location: str, material: str, value: str) -> None:
    await press(pilot, "a")
    await settle(pilot, app)
    await field(pilot, location)
    await field(pilot, material)
    await press(pilot, "tab", "tab")  # keep the scale, not a dry standard
    await field(pilot, value)
    await settle(pilot, app)


async def add_room(pilot, app, name: str, surfaces, material) -> None:
    await press(pilot, "a")  # on the room list
    await settle(pilot, app)
    await field(pilot, name)  # the room opens, focus on the air temperature
    await settle(pilot, app)
    await field(pilot, "18")  # °C
    await field(pilot, "70 %")  # focus moves on to the surfaces table
    await settle(pilot, app)
    for location, temp in surfaces:
        await add_surface(pilot, app, location, temp)
    await press(pilot, "tab")  # to the material table
    await add_material(pilot, app, *material)


@pytest.mark.slow
async def test_complete_walk_by_keys(tmp_path, monkeypatch):
    """Every step by keys; the file on disk holds what was typed and judges as expected."""
    monkeypatch.chdir(tmp_path)
    path = tmp_path / "f3.json"
    app = make_app(data_dir=tmp_path / "data", clock=lambda: FIXED_NOW)
    async with app.run_test(size=SIZE) as pilot:
        await settle(pilot, app)
        await press(pilot, "n")  # start screen: new survey
        await settle(pilot, app)
        await field(pilot, "f3")  # the file: f3.json here
        await field(pilot, "Flat 3")
        await settle(pilot, app)
        assert type(app.screen).__name__ == "SiteScreen"
        await press(pilot, "enter")  # reference kept; to the address
        await field(pilot, "3 Row")
        await field(pilot, "Owner")
        await field(pilot, "Ann")
        await press(pilot, "tab", "tab")  # past purpose and units
        await field(pilot, "35")  # altitude, m
        await press(pilot, "enter", "enter", "enter")  # construction, year, notes: none
        await press(pilot, "a")  # instruments table: add
        await settle(pilot, app)
        await field(pilot, "th1")
        await press(pilot, "enter")  # the kind's list opened,
        await press(pilot, "enter")  # the thermo-hygrometer offered kept
        for text in ("M1", "0.3", "2", "", "2026-06-01"):
            await field(pilot, text)
        await settle(pilot, app)
        await press(pilot, "f3")  # the visit
        await settle(pilot, app)
        assert type(app.screen).__name__ == "VisitScreen"
        await field(pilot, "2026-12-01 09:30")
        await field(pilot, "Day 1")
        await press(pilot, "tab")  # inspector: the site's
        await field(pilot, "overcast")
        await press(pilot, "enter", "enter", "enter")  # pressure, notes, photos: none
        await field(pilot, "3")  # outdoor °C
        await field(pilot, "88")  # outdoor RH %
        await settle(pilot, app)
        await press(pilot, "f4")
        await settle(pilot, app)
        await add_room(
            pilot,
            app,
            "Bed [b]1",
            [("N corner", "8"), ("E wall", "17"), ("Ceiling", "16,5")],
            ("Sill", "softwood", "18"),
        )
        await press(pilot, "escape")  # back to the room list
        await settle(pilot, app)
        await add_room(
            pilot,
            app,
            "Kitchen",
            [("Reveal", "9.5"), ("W wall", "16"), ("Floor", "15")],
            ("Sink", "chipboard", "22"),
        )
        await press(pilot, "f5")
        await settle(pilot, app)
        assert type(app.screen).__name__ == "FindingsScreen"
        await press(pilot, "f3", "f7")  # a new visit from the first
        await settle(pilot, app)
        await press(pilot, "y")
        await settle(pilot, app)
        await press(pilot, "f4")
        await settle(pilot, app)
        await press(pilot, "ctrl+n")  # the next room that needs readings
        await settle(pilot, app)
        assert app.screen.room_id == "bed-b-1"
        await field(pilot, "19")
        await field(pilot, "60")
        await settle(pilot, app)
        await press(pilot, "e")  # the first point measured last time
        await settle(pilot, app)
        assert app.screen.title_text == "Read again the surface measured before"
        await field(pilot, "10")  # its temperature: saved
        await settle(pilot, app)
        assert app.status_text.startswith("Saved")
        await press(pilot, "e")  # the cursor moved on to the next point still to read
        await settle(pilot, app)
        await field(pilot, "16")
        await settle(pilot, app)
        await press(pilot, "ctrl+q")

    survey = store.load_survey(path)
    site = survey.site
    assert (site.reference, site.address, site.client, site.inspector) == (
        "Flat 3",
        "3 Row",
        "Owner",
        "Ann",
    )
    assert site.altitude_m == 35.0
    assert survey.instruments[0].rh_accuracy_pct == 2.0
    assert str(survey.instruments[0].calibrated_on) == "2026-06-01"
    assert [r.name for r in survey.rooms] == ["Bed [b]1", "Kitchen"]
    # A room added in the app has its occupants unrecorded, not none: nothing typed there.
    assert [r.occupants for r in survey.rooms] == [None, None]
    first, second = survey.visits
    assert first.started_at == dt.datetime(2026, 12, 1, 9, 30)
    assert (first.label, first.weather) == ("Day 1", "overcast")
    assert (first.outdoor.dry_bulb_c, first.outdoor.rh_pct) == (3.0, 88.0)
    bedroom, kitchen = first.rooms
    assert (bedroom.air.dry_bulb_c, bedroom.air.rh_pct) == (18.0, 70.0)
    assert bedroom.air.instrument == "th1"  # the site's thermo-hygrometer
    assert bedroom.air.taken_at == FIXED_NOW
    assert [(s.location, s.surface_temp_c) for s in bedroom.surfaces] == [
        ("N corner", 8.0),
        ("E wall", 17.0),
        ("Ceiling", 16.5),
    ]
    assert [(m.location, m.material, m.value) for m in bedroom.materials] == [
        ("Sill", "softwood", 18.0)
    ]
    assert len(kitchen.surfaces) == 3 and kitchen.materials[0].value == 22.0
    assert second.started_at == FIXED_NOW
    assert [(s.location, s.surface_temp_c) for s in second.rooms[0].surfaces] == [
        ("N corner", 10.0),
        ("E wall", 16.0),
    ]
    assert (second.rooms[0].air.dry_bulb_c, second.rooms[0].air.rh_pct) == (19.0, 60.0)

    judged = evaluate.assess_visit(survey, 0)
    assert judged.accuracy_entered["rh_pct"]  # its ±2 % RH, not the typical value
    room = judged.findings.rooms[0]
    # Dew point of 18 °C, 70 % RH at 101 325 Pa by CoolProp (independent reference).
    reference_c = CP.HAPropsSI("D", "T", 291.15, "R", 0.70, "P", 101325.0) - 273.15
    assert room.air.condensation_point_c == pytest.approx(reference_c, abs=0.1)
    # 8 °C is about 4.5 K below that dew point, far outside the instruments' band.
    assert room.surfaces[0].condensation.value == "condensing"
    assert judged.advice.rooms[0].actions  # something to do in a room that condenses
    # Unrecorded occupants are not reckoned as no one: the report says they were not recorded.
    from survey import report

    text = report.markdown_report(survey, report.ReportOptions(generated_at="fixed"))
    assert "usual occupants not recorded" in text
    assert "no occupants:" not in text and "no usual occupants" not in text
