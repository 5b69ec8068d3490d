"""The app's dehumidifier check, driven by keys on the basement example: the equipment
dialog leads to the performance check, its results show as they are typed, and the saved
record holds the readings and is judged in the equipment table."""

from __future__ import annotations

import datetime as dt
import shutil
from pathlib import Path

import pytest
from textual.widgets import DataTable, Input, Static

from survey import store
from survey.app import make_app
from survey.app.equipment import CheckDialog, read_air, read_power_or_energy
from survey.errors import InputError

ROOT = Path(__file__).resolve().parents[1]
BASEMENT = ROOT / "example_sites" / "basement-burst-pipe-drying.json"
SIZE = (120, 40)


async def _settle(pilot, app) -> None:
    await pilot.pause()
    await app.workers.wait_for_complete()
    await pilot.pause()


async def _add_in_family_room(pilot, app) -> None:
    """The family room's equipment table, and its add dialog opened."""
    await _settle(pilot, app)
    app.open_room("family")
    await _settle(pilot, app)
    app.screen.query_one("#equipment").focus()
    await pilot.press("a")
    await _settle(pilot, app)


def _type(app, text: str) -> None:
    """Replace the focused input's text."""
    field = app.focused
    assert isinstance(field, Input)
    field.value = text


@pytest.mark.slow
async def test_a_new_dehumidifier_is_checked_and_saved(tmp_path):
    """Add a unit (kind as offered, 'D2', 20 L/day, 1.2 kg), then its check: inlet 24 °C /
    70 %, outlet 33 / 30, 3 h, 250 W, EF 1.8 at 18.3c_60. The preview says 9.6 L/day (the
    worked case of test_equipment), the file holds every reading, and the table row shows
    the results."""
    path = tmp_path / "basement.json"
    shutil.copyfile(BASEMENT, path)
    # the clock an hour into the last visit (2025-02-05 09:50), so the reading is timed
    clock = lambda: dt.datetime(2025, 2, 5, 10, 50)  # noqa: E731
    app = make_app(path, data_dir=tmp_path / "data", clock=clock)
    async with app.run_test(size=SIZE) as pilot:
        await _add_in_family_room(pilot, app)
        for text in (None, "D2", None, "20", "1.2kg"):
            if text is None:  # a drop-down (kind, running): Enter opens it, Enter keeps it
                await pilot.press("enter")
            else:
                _type(app, text)
            await pilot.press("enter")
        await _settle(pilot, app)
        dialog = app.screen
        assert isinstance(dialog, CheckDialog)
        for text in ("24, 70", "33 30", "3", "250W", "1.8", "18.3c_60"):
            _type(app, text)
            await pilot.pause()
            if text != "18.3c_60":
                await pilot.press("enter")
        await pilot.pause()
        preview = str(dialog.query_one("#check-preview", Static).render())
        assert "9.6 L/day (20.3 US pints/day)" in preview and "COP 2.4" in preview
        await pilot.press("enter")
        await _settle(pilot, app)
        assert not isinstance(app.screen, CheckDialog)
        table = app.screen.query_one("#equipment", DataTable)
        last = table.get_row_at(table.row_count - 1)
        assert "9.6 L/day" in str(last[-1]) and "EF 1.60 L/kWh" in str(last[-1])
    saved = store.load_survey(path).visits[-1].room_visit("family").equipment[-1]
    assert (saved.label, saved.capacity_l_per_day, saved.water_removed_l) == ("D2", 20.0, 1.2)
    assert (saved.inlet.dry_bulb_c, saved.inlet.rh_pct) == (24.0, 70.0)
    assert (saved.outlet.dry_bulb_c, saved.outlet.rh_pct) == (33.0, 30.0)
    assert saved.outlet.taken_at == dt.datetime(2025, 2, 5, 10, 50)
    assert saved.outlet.instrument == "th3"
    assert (saved.run_hours, saved.power_w, saved.energy_kwh) == (3.0, 250.0, None)
    assert (saved.rated_energy_factor_l_per_kwh, saved.rating_condition) == (1.8, "18.3c_60")


@pytest.mark.slow
async def test_a_bad_reading_is_not_saved_and_escape_keeps_the_record(tmp_path):
    """A bad rating condition is refused with a message naming the field; Escape closes the
    check and the stored unit keeps its readings."""
    path = tmp_path / "basement.json"
    shutil.copyfile(BASEMENT, path)
    before = store.load_survey(path).visits[-1].room_visit("family").equipment[0]
    app = make_app(path, data_dir=tmp_path / "data")
    async with app.run_test(size=SIZE) as pilot:
        await _settle(pilot, app)
        app.open_room("family")
        await _settle(pilot, app)
        app.screen.query_one("#equipment").focus()
        await pilot.press("enter")
        await _settle(pilot, app)
        # all as stored: kind (a drop-down: opened, kept), label, running (the same), capacity,
        # water removed
        for _ in range(2 + 1 + 2 + 1 + 1):
            await pilot.press("enter")
        await _settle(pilot, app)
        dialog = app.screen
        assert isinstance(dialog, CheckDialog)
        # The stored unit's readings are offered; the inlet is blank (the room's air).
        values = [i.value for i in dialog.query(Input)]
        assert values == ["", "27.5, 24", "23.5", "750W", "2.8", "26.7c_60"]
        preview = str(dialog.query_one("#check-preview", Static).render())
        assert "11.2 L/day" in preview and "It removes 66 %" in preview
        for _ in range(5):
            await pilot.press("enter")
        _type(app, "80F")
        await pilot.press("enter")
        await pilot.pause()
        message = str(dialog.query_one("#prompt-message", Static).render())
        assert "Rating condition" in message and "80f" in message.lower()
        await pilot.press("escape")
        await _settle(pilot, app)
    after = store.load_survey(path).visits[-1].room_visit("family").equipment[0]
    assert after == before


def test_air_and_power_texts():
    """'24, 70', '75F 70%' and '24 °C 70 %' read as a temperature and an RH; W/kW are a
    power, kWh/Wh an energy."""
    assert read_air("24, 70", "Air in", "si") == (24.0, 70.0)
    assert read_air("24 °C 70 %", "Air in", "si") == (24.0, 70.0)
    temp, rh = read_air("75.2 70", "Air in", "ip")
    assert temp == pytest.approx(24.0) and rh == 70.0
    with pytest.raises(InputError, match="Air in"):
        read_air("24", "Air in", "si")
    with pytest.raises(InputError):
        read_air("24, 120", "Air in", "si")
    assert read_power_or_energy("540W", "P") == (540.0, None)
    assert read_power_or_energy("0.54 kW", "P") == (540.0, None)
    assert read_power_or_energy("12.9kWh", "P") == (None, 12.9)
    assert read_power_or_energy("750 Wh", "P") == (None, pytest.approx(0.75))


def test_the_table_row_of_inconsistent_readings_prints_no_absurd_number():
    """99999 L over 0.01 h (239997600 L/day, 99999 × 24 / 0.01) in the equipment table's
    row: the findings say the readings are inconsistent and no such figure is shown."""
    from types import SimpleNamespace

    import msgspec

    from survey.app.equipment import row
    from survey.words import SI

    survey = store.load_survey(BASEMENT)
    room_visit = survey.visits[1].room_visit("family")
    e = msgspec.structs.replace(room_visit.equipment[0], water_removed_l=99999.0, run_hours=0.01)
    room_visit = msgspec.structs.replace(room_visit, equipment=[e])
    screen = SimpleNamespace(
        record=lambda: room_visit,
        editor=SimpleNamespace(survey=survey, visit_index=1),
        app=SimpleNamespace(display_units=SI),
    )
    cell = str(row(e, screen, 0)[-1])
    assert "the readings are inconsistent" in cell
    for absurd in ("239997600", "507205775", "EF ", "COP "):
        assert absurd not in cell


async def test_kind_and_running_are_chosen_from_lists_in_words(tmp_path):
    """The equipment dialog offers the kinds in words and whether the unit runs as yes or
    no, each a drop-down: an air mover that is not running, chosen by arrows and Enter, is
    saved with its stored kind and shown in words in the table (no dehumidifier check)."""
    from survey.app.fields import Choice

    path = tmp_path / "basement.json"
    shutil.copyfile(BASEMENT, path)
    app = make_app(path, data_dir=tmp_path / "data")
    async with app.run_test(size=SIZE) as pilot:
        await _add_in_family_room(pilot, app)
        kind = app.screen.query_one("#prompt-0", Choice)
        assert app.focused is kind
        shown = [str(prompt) for prompt, _ in kind._options]
        assert shown[:3] == ["refrigerant dehumidifier", "desiccant dehumidifier", "air mover"]
        await pilot.press("enter", "down", "down", "enter")
        await pilot.pause()
        _type(app, "AM 1")
        await pilot.press("enter")
        await pilot.pause()
        assert app.focused is app.screen.query_one("#prompt-2", Choice)
        await pilot.press("enter", "down", "enter")
        await pilot.pause()
        await pilot.press("enter", "enter")  # no rated capacity, no water removed
        await _settle(pilot, app)
        assert not isinstance(app.screen, CheckDialog)
        table = app.screen.query_one("#equipment", DataTable)
        assert [str(c) for c in table.get_row_at(table.row_count - 1)][:3] == [
            "air mover",
            "AM 1",
            "no",
        ]
    saved = store.load_survey(path).visits[-1].room_visit("family").equipment[-1]
    assert (saved.kind, saved.label, saved.running) == ("air_mover", "AM 1", False)


def test_a_new_visit_keeps_the_equipment_set_up_without_its_readings():
    """The basement's last visit has a dehumidifier and air movers running in the family
    room: a new visit starts with them there, as set up (kind, label, running, rating), and
    without what they were measured at; the room still needs its readings."""
    import datetime as dt

    from survey.app import judging

    survey = store.load_survey(BASEMENT)
    last = survey.visits[-1]
    before = last.room_visit("family").equipment
    assert before and any(e.water_removed_l is not None for e in before)
    visit = judging.new_visit(dt.datetime(2025, 2, 8, 9, 30), last)
    survey.visits.append(visit)
    kept = visit.room_visit("family").equipment
    assert [(e.kind, e.label, e.running, e.capacity_l_per_day) for e in kept] == [
        (e.kind, e.label, e.running, e.capacity_l_per_day) for e in before
    ]
    for unit in kept:
        assert (unit.water_removed_l, unit.outlet, unit.inlet, unit.run_hours) == (
            None,
            None,
            None,
            None,
        )
        assert unit.energy_kwh is None
    assert visit.room_visit("family").air is None
    index = len(survey.visits) - 1
    assert judging.readings_missing(survey, index, "family") >= 1
    assert judging.new_visit(dt.datetime(2025, 2, 8), None).rooms == []


def test_a_room_holding_only_carried_equipment_was_not_entered():
    """A new visit begun and nothing read yet: the report does not say the family room was
    "entered but the air was not measured" because its units were carried over; it is
    among the rooms not entered. Once a reading is taken there, it was entered."""
    import datetime as dt

    from survey import model, report
    from survey.app import judging

    survey = store.load_survey(BASEMENT)
    survey.visits.append(judging.new_visit(dt.datetime(2025, 2, 8, 9, 30), survey.visits[-1]))
    options = report.ReportOptions(generated_at="fixed")
    lead = "were not entered, so nothing is said about them: "

    def not_entered() -> str:
        text = report.markdown_report(survey, options)
        assert "Entered but the air was not measured" not in text
        return text[text.index(lead) + len(lead) :].split(".")[0]

    assert "Basement family room" in not_entered()
    family = survey.visits[-1].room_visit("family")
    family.air = model.AirReading(dry_bulb_c=20.0, rh_pct=55.0)
    assert "Basement family room" not in not_entered()


def test_a_visit_the_room_was_not_entered_on_passes_its_points_on():
    """Visit 4 begun (the family room's units carried over) and the room not entered, then
    visit 5: the room's points to read are visit 3's, as they were before equipment was
    carried (the carried record has no points of its own to offer)."""
    import datetime as dt

    from survey.app import judging

    survey = store.load_survey(BASEMENT)
    third = survey.visits[-1].room_visit("family")
    for day in (8, 9):
        survey.visits.append(judging.new_visit(dt.datetime(2025, 2, day, 9, 30), survey.visits[-1]))
    fifth = len(survey.visits) - 1
    assert judging.previous_room_visit(survey, fifth, "family") is third
    assert [s.location for s in judging.pending_surfaces(survey, fifth, "family")] == [
        s.location for s in third.surfaces
    ]
    assert survey.visits[fifth].room_visit("family").equipment  # still carried
