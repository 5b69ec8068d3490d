"""The dehumidifiers of a stored visit judged (survey.equipment.judge_visit) on the basement
example, and the words said of them in SI and IP."""

from __future__ import annotations

import datetime as dt
from pathlib import Path

import msgspec
import psychrolib
import pytest

from survey import equipment as eq
from survey import model, store
from survey.equipment import FindingKind
from survey.words import IP, SI
from survey.words import equipment as we

psychrolib.SetUnitSystem(psychrolib.SI)
BASEMENT = Path(__file__).resolve().parents[1] / "example_sites/basement-burst-pipe-drying.json"


@pytest.fixture(scope="module")
def basement() -> model.Survey:
    return store.load_survey(BASEMENT)


def _unit(survey: model.Survey, visit: int) -> eq.StoredUnit:
    units = eq.judge_visit(survey, visit)
    assert len(units) == 1  # D1 only: the air movers are not dehumidifiers
    return units[0]


def test_day_1_has_no_water_or_power(basement):
    """Day 1: the unit was just set up: outlet read, no water or power yet."""
    unit = _unit(basement, 0)
    assert unit.label == "Dehumidifier D1" and unit.room_id == "family"
    r = unit.result
    assert {FindingKind.NO_WATER, FindingKind.NO_POWER} <= set(r.kinds)
    assert r.removal_l_per_day is None and r.cop is None
    assert r.given.inlet_is_room_air


def test_day_2_against_the_readings_by_hand(basement):
    """Day 2: 18 L over run_hours 24 h at 750 W: 18 L/day, 750 × 24 / 1000 = 18.0 kWh, EF
    18 / 18.0 = 1.000 L/kWh; inlet = the room air 20.5 °C / 55 %, outlet 27.5 °C / 28 %,
    at the standard atmosphere of the site's 62 m (psychrolib, ASHRAE ch. 1 eqn 3)."""
    r = _unit(basement, 1).result
    pressure = psychrolib.GetStandardAtmPressure(62.0)
    assert r.given.pressure_pa == pytest.approx(pressure)
    assert r.given.duration_source == "run_hours" and r.given.duration_h == 24.0
    assert r.removal_l_per_day == pytest.approx(18.0)
    assert r.energy_kwh == pytest.approx(18.0)
    assert r.energy_factor_l_per_kwh == pytest.approx(18 / 18.0)
    w_in = psychrolib.GetHumRatioFromRelHum(20.5, 0.55, pressure)
    w_out = psychrolib.GetHumRatioFromRelHum(27.5, 0.28, pressure)
    assert r.humidity_ratio_drop_kg_per_kg == pytest.approx(w_in - w_out, rel=1e-9)
    assert r.air_mass_flow_kg_per_s == pytest.approx(18.0 / ((w_in - w_out) * 24 * 3600))
    c = r.comparison
    assert c.condition.key == "26.7c_60" and c.rated_capacity_l_per_day == 50.0
    assert c.removal_of_rated == pytest.approx(18.0 / 50.0)
    assert r.cop is not None and 1.0 < r.cop < 6.0  # a refrigeration cycle's range


def test_day_3_uses_its_run_hours(basement):
    """Day 3: 11 L over 23.5 h: 11 × 24 / 23.5 = 11.23 L/day."""
    r = _unit(basement, 2).result
    assert r.removal_l_per_day == pytest.approx(11 * 24 / 23.5)
    assert r.energy_kwh == pytest.approx(0.75 * 23.5)


def _day3(survey: model.Survey, **changes) -> model.Survey:
    """The survey with day 3's dehumidifier record changed."""
    visits = list(survey.visits)
    rooms = list(visits[2].rooms)
    family = next(i for i, rv in enumerate(rooms) if rv.room == "family")
    items = list(rooms[family].equipment)
    items[0] = msgspec.structs.replace(items[0], **changes)
    rooms[family] = msgspec.structs.replace(rooms[family], equipment=items)
    visits[2] = msgspec.structs.replace(visits[2], rooms=rooms)
    return msgspec.structs.replace(survey, visits=visits)


def test_without_run_hours_the_time_since_the_last_reading_of_the_same_unit(basement):
    """No run_hours on day 3: the time from day 2's outlet reading of D1 (2025-02-04 10:27)
    to day 3's (2025-02-05 10:02) is 23 h 35 min = 23.583 h."""
    r = eq.judge_visit(_day3(basement, run_hours=None), 2)[0].result
    assert r.given.duration_source == "since_previous_reading"
    assert r.given.duration_h == pytest.approx(23 + 35 / 60)
    assert r.removal_l_per_day == pytest.approx(11 * 24 / (23 + 35 / 60))


def test_a_unit_not_seen_before_counts_from_the_previous_visit(basement):
    """A label not on day 2 (a new unit): from day 2's start (10:15) to day 3's outlet
    reading (10:02 next day) = 23 h 47 min."""
    r = eq.judge_visit(_day3(basement, run_hours=None, label="Dehumidifier D2"), 2)[0].result
    assert r.given.duration_source == "since_previous_visit"
    assert r.given.duration_h == pytest.approx(23 + 47 / 60)


def test_a_measured_inlet_and_metered_energy_are_used(basement):
    """An inlet reading replaces the room air; energy_kwh replaces power × hours."""
    inlet = model.AirReading(dry_bulb_c=22.0, rh_pct=50.0)
    r = eq.judge_visit(_day3(basement, inlet=inlet, energy_kwh=11.0), 2)[0].result
    assert not r.given.inlet_is_room_air
    assert r.inlet.dry_bulb_c == 22.0 and r.inlet.rh_pct == 50.0
    assert r.energy_kwh == 11.0
    assert r.mean_power_w == pytest.approx(11.0 * 1000 / 23.5)


def test_a_unit_without_an_outlet_reading_cannot_be_checked(basement):
    """No outlet: no result, and the words say what is missing."""
    unit = eq.judge_visit(_day3(basement, outlet=None), 2)[0]
    assert unit.result is None and unit.missing == ("outlet",)
    assert "outlet reading" in we.missing_text(unit)


def test_a_preview_record_is_judged_in_place(basement):
    """judge_record with a candidate record (a dialog's preview) judges that record."""
    room_visit = basement.visits[1].room_visit("family")
    candidate = msgspec.structs.replace(room_visit.equipment[0], water_removed_l=24.0)
    unit = eq.judge_record(basement, 1, room_visit, 0, candidate)
    assert unit.result.removal_l_per_day == pytest.approx(24.0)
    assert eq.judge_record(basement, 1, room_visit, 1) is None  # an air mover


def test_naive_and_aware_times_do_not_crash(basement):
    """A time-zone-aware reading against naive ones gives no duration, not an error."""
    aware = model.AirReading(
        dry_bulb_c=27.5, rh_pct=24.0, taken_at=dt.datetime(2025, 2, 5, 10, 2, tzinfo=dt.UTC)
    )
    r = eq.judge_visit(_day3(basement, run_hours=None, outlet=aware), 2)[0].result
    assert r.given.duration_h is None and FindingKind.NO_DURATION in r.kinds


# --- words -----------------------------------------------------------------------------------


@pytest.mark.parametrize("d", [SI, IP])
def test_every_sentence_is_said_in_both_unit_systems(basement, d):
    """Measured, rated, found and the caution all come out, in the display's units."""
    r = _unit(basement, 1).result
    lines = we.unit_lines(r, d)
    text = " ".join(lines)
    assert "energy factor of 1.00 L/kWh" in text
    assert "COP of" in text and "AHAM DH-1" in text
    if d.ip:
        assert "°F" in text and "gr/lb" in text and "US pints/day (18.0 L/day)" in text
        assert "80 °F" in text  # the rating condition in whole °F
    else:
        assert "18.0 L/day (38.0 US pints/day)" in text and "g/kg" in text
    assert we.rating_caution(r, d) in lines
    assert "L/day" in we.summary(r, d)


@pytest.mark.parametrize("kind", list(FindingKind))
def test_every_finding_has_words(kind):
    """Every finding kind is a sentence (given a result that carries what it speaks of)."""
    given = eq.DehumidifierInput(
        readings=(eq.AirPair(24.0, 70.0, 33.0, 30.0),),
        water_l=1.2,
        duration_h=3.0,
        power_w=250.0,
        rated_capacity_l_per_day=20.0,
        rating_condition="18.3c_60",
    )
    r = eq.check(given)
    for d in (SI, IP):
        assert we.finding_text(kind, r, d).endswith(".")


def test_a_desiccant_unit_says_why_it_has_no_cop():
    """A desiccant unit: no coil cooling or COP, and a sentence says so."""
    r = eq.check(
        eq.DehumidifierInput(
            readings=(eq.AirPair(24.0, 70.0, 33.0, 30.0),),
            kind="desiccant",
            water_l=1.2,
            duration_h=3.0,
            power_w=250.0,
        )
    )
    assert r.cop is None and r.cooling_capacity_w is None and r.coil is None
    assert any("no refrigeration cycle" in line for line in we.measured_lines(r, SI))


def test_a_label_with_control_characters_is_shown_safely():
    """A label is user text: control characters are made visible."""
    assert "\x1b" not in we.unit_name("D1\x1b[2J")


def _day3_readings_moved(survey: model.Survey, by: dt.timedelta, start_too: bool = True):
    """Day 3 with its readings' times (and, ``start_too``, its start) moved ``by``."""
    visits = list(survey.visits)
    rooms = []
    for rv in visits[2].rooms:
        items = [
            msgspec.structs.replace(
                e,
                outlet=None
                if e.outlet is None
                else msgspec.structs.replace(e.outlet, taken_at=e.outlet.taken_at + by),
            )
            for e in rv.equipment
        ]
        air = rv.air
        if air is not None and air.taken_at is not None:
            air = msgspec.structs.replace(air, taken_at=air.taken_at + by)
        rooms.append(msgspec.structs.replace(rv, equipment=items, air=air))
    start = visits[2].started_at + (by if start_too else dt.timedelta(0))
    visits[2] = msgspec.structs.replace(visits[2], started_at=start, rooms=rooms)
    return msgspec.structs.replace(survey, visits=visits)


@pytest.mark.parametrize(
    ("label", "by", "start_too", "source", "words"),
    [
        # 670 days on: 16 000-odd hours since day 2, past RUN_HOURS_MAX_H (10 000 h)
        ("Dehumidifier D1", dt.timedelta(days=670), True, "too_long_since", "too long ago"),
        # a unit not seen before counts from the previous visit's start: the same
        ("Dehumidifier D2", dt.timedelta(days=670), True, "too_long_since", "too long ago"),
        # the reading timed a day and a half back, before day 2's reading of the unit
        ("Dehumidifier D1", dt.timedelta(hours=-36), False, "not_after_previous", "not before"),
    ],
)
def test_hours_that_cannot_stand_for_the_run_give_none_and_say_why(
    basement, label, by, start_too, source, words
):
    """With no run hours, the hours since the unit's previous reading (or the previous
    visit) stand for the run only when they are more than 0 and at most RUN_HOURS_MAX_H;
    otherwise there are none, and the finding says why, rather than that the time was not
    recorded."""
    from survey.words.equipment import finding_text

    survey = _day3_readings_moved(_day3(basement, run_hours=None, label=label), by, start_too)
    r = eq.judge_visit(survey, 2)[0].result
    assert r.given.duration_h is None and r.given.duration_source == source
    assert r.removal_l_per_day is None
    assert FindingKind.NO_DURATION in [f.kind for f in r.findings]
    said = finding_text(FindingKind.NO_DURATION, r, SI)
    assert words in said and "give the run hours" in said
