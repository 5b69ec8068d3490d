"""Drying progress over visits (survey.drying), its words and its report tables.

Check values are hand arithmetic written in each test's docstring (least squares from any
regression text: b = Sxy / Sxx, s_b = √(SSR / (n − 2) / Sxx)), the example site's own
readings, and psychrolib's GetHumRatioFromRelHum (ASHRAE Handbook Fundamentals 2017 ch. 1
eqn 20) for a logger's humidity ratio. The 10 % allowance over the dry standard and the
drying limits are common practice, no source (see survey/thresholds/limits_drying.py).
"""

from __future__ import annotations

import copy
import datetime as dt
import math
from pathlib import Path

import msgspec
import psychrolib
import pytest
from hypothesis import given
from hypothesis import strategies as st
from markdown_it import MarkdownIt

from survey import drying, model, report, store, words
from survey import thresholds as th
from survey.assess import DryStandardState
from survey.drying import TrendState
from survey.report.markdown import Items, Table
from survey.words import drying as dw

psychrolib.SetUnitSystem(psychrolib.SI)

ROOT = Path(__file__).resolve().parents[1]
BASEMENT = ROOT / "example_sites" / "basement-burst-pipe-drying.json"
T0 = dt.datetime(2025, 3, 1, 9, 0)


def _basement() -> model.Survey:
    return store.load_survey(BASEMENT)


def _room(progress: drying.SiteDrying, room_id: str) -> drying.RoomDrying:
    return next(r for r in progress.rooms if r.room_id == room_id)


def _point(room: drying.RoomDrying, location: str) -> drying.MaterialPoint:
    return next(p for p in room.points if p.location == location)


# --- the basement example ------------------------------------------------------------------


def test_basement_goals_are_the_reference_dry_standards_plus_ten_percent():
    """Basement example, three visits. The office is the reference room; its dry standards
    on the last visit: plasterboard 22, softwood skirting 11.5 % MC, screed 44 (relative).
    Goals = dry standard × 1.10 (the 10 % allowance, common practice): 24.2, 12.65, 48.4.
    Latest readings: family party wall 46 > 24.2, skirting 16 > 12.65, screed 72 > 48.4, store
    wall 41 > 24.2: no goal is met. Every reading on every visit is above its goal too (the
    lowest, 41, against 24.2)."""
    progress = drying.drying_progress(_basement())
    family, store_room = _room(progress, "family"), _room(progress, "store")
    expected = {
        (family, "Party wall, 0.1 m above floor"): (22.0, 24.2, [95.0, 71.0, 46.0]),
        (family, "Skirting, party wall"): (11.5, 12.65, [28.0, 21.5, 16.0]),
        (family, "Screed, centre of room"): (44.0, 48.4, [98.0, 86.0, 72.0]),
        (store_room, "Wall behind shelving, 0.1 m above floor"): (22.0, 24.2, [92.0, 64.0, 41.0]),
    }
    for (room, location), (standard, goal, values) in expected.items():
        point = _point(room, location)
        assert point.dry_standard == standard
        assert point.dry_standard_room == "office"
        assert point.goal == pytest.approx(goal)
        assert point.goal_met is False
        assert [r.value for r in point.readings] == values
        assert all(r.state is DryStandardState.ABOVE and not r.at_goal for r in point.readings)
    assert len(family.points) == 3 and len(store_room.points) == 1
    office = _room(progress, "office")
    assert office.is_reference and office.points == ()  # dry standards are not points to dry


def test_basement_party_wall_rate_and_days_by_hand():
    """Family room party wall, read at 10:09 on 3 Feb, 10:24 on 4 Feb, 09:59 on 5 Feb; days
    from the first visit's start (3 Feb 10:00): x = 0.00625, 1.016667, 1.999306; y = 95, 71,
    46. x̄ = 1.007407, ȳ = 70.6667; dx = −1.001157, 0.009259, 0.991898; dy = 24.3333,
    0.3333, −24.6667. Sxx = 1.986263, Sxy = −48.82523, b = −24.5815 a day. Fitted line:
    a = ȳ − b x̄ = 95.4302; residuals −0.2766, 0.5609, −0.2844; SSR = 0.4720;
    s_b = √(0.4720 / 1 / 1.986263) = 0.4875. Days to the goal 24.2 from 46:
    21.8 / 24.5815 = 0.8869. The 95 % range, one degree of freedom, t = 12.706 (any t table;
    tan(0.475π), the Cauchy quantile): half-width 12.706 × 0.4875 = 6.1942; 21.8 / 30.7757 =
    0.7084 to 21.8 / 18.3873 = 1.1856; three readings: rough."""
    point = _point(
        _room(drying.drying_progress(_basement()), "family"), "Party wall, 0.1 m above floor"
    )
    assert point.fit is not None and point.fit.readings == 3
    assert point.fit.rate_per_day == pytest.approx(-24.5815, abs=5e-4)
    assert point.fit.rate_se_per_day == pytest.approx(0.4875, abs=2e-4)
    assert point.trend is TrendState.FALLING
    assert point.estimate is not None
    assert point.estimate.days == pytest.approx(0.8869, abs=5e-4)
    assert point.estimate.days_low == pytest.approx(0.7084, abs=2e-4)
    assert point.estimate.days_high == pytest.approx(1.1856, abs=5e-4)
    assert point.estimate.rough and not point.estimate.open_ended
    assert point.estimate.by.date() == dt.date(2025, 2, 6)  # 5 Feb 09:59 + 0.887 d
    # 0.7084 × 24 = 17.0 h, 1.1856 × 24 = 28.5 h, shown to the hour
    assert dw.outlook_cell(point) == "about 21 hours (rough: 17 to 28 hours)"


def test_basement_room_air_and_worst_margin_follow_the_assessment():
    """The room air per visit is the assessment's (RH as read, humidity ratio from
    psychrolib); the store's worst surface is its repaired pipe joint, below the dew point on
    the first two visits (9.5 and 10.2 °C against air at 16.8 °C / 84 % and 19.5 °C / 60 %:
    dew points about 14.1 and 11.5 °C, psychrolib) and above it on the third."""
    survey = _basement()
    progress = drying.drying_progress(survey)
    store_room = _room(progress, "store")
    assert [a.rh_pct for a in store_room.air] == [84.0, 60.0, 50.0]
    assert [a.worst_margin_label for a in store_room.air] == ["Repaired pipe joint"] * 3
    margins = [a.worst_margin_k for a in store_room.air]
    assert margins[0] < 0 and margins[1] < 0 and margins[2] > 0
    pressure = model.pressure_pa_for(survey)
    for air, (t, rh) in zip(
        store_room.air, [(16.8, 84.0), (19.5, 60.0), (20.2, 50.0)], strict=True
    ):
        assert air.humidity_ratio_kg_per_kg == pytest.approx(
            psychrolib.GetHumRatioFromRelHum(t, rh / 100.0, pressure), rel=1e-6
        )
        dew = psychrolib.GetTDewPointFromRelHum(t, rh / 100.0)
        assert air.worst_margin_k == pytest.approx(
            {16.8: 9.5, 19.5: 10.2, 20.2: 10.0}[t] - dew, abs=0.01
        )
    assert store_room.humidity_ratio_fit is not None
    assert store_room.humidity_ratio_fit.rate_per_day < 0  # the air is drying


def _with_fourth_visit(values: dict[str, float]) -> model.Survey:
    """The basement with a fourth visit a day after the third (6 February 09:50), a copy of
    it with the family room's material readings set by material and every reading's own
    time cleared (so each counts at the visit's start)."""
    survey = _basement()
    fourth = copy.deepcopy(survey.visits[-1])
    fourth = msgspec.structs.replace(
        fourth, started_at=fourth.started_at + dt.timedelta(days=1), outdoor=None
    )
    for room_visit in fourth.rooms:
        if room_visit.air is not None:
            room_visit.air = msgspec.structs.replace(room_visit.air, taken_at=None)
        room_visit.materials = [
            msgspec.structs.replace(
                m,
                taken_at=None,
                value=values.get(m.material, m.value) if room_visit.room == "family" else m.value,
            )
            for m in room_visit.materials
        ]
    survey.visits.append(fourth)
    return survey


def test_a_fourth_visit_meets_some_goals_exactly_at_the_edge():
    """A fourth visit with the party wall at 24 (≤ 24.2: met), the skirting at 12.7
    (> 12.65: not met, by 0.05) and the screed at 48.4 (= 48.4: met, the limit itself counts
    as at the dry standard, as in the assessment)."""
    survey = _with_fourth_visit(
        {"plasterboard": 24.0, "softwood skirting": 12.7, "sand-cement screed": 48.4}
    )
    room = _room(drying.drying_progress(survey), "family")
    met = {p.material: p.goal_met for p in room.points}
    assert met == {"plasterboard": True, "softwood skirting": False, "sand-cement screed": True}
    assert room.goals_met == 2 and room.goals_set == 3
    assert dw.room_goals_text(room) == "2 of 3 material points at their drying goal."
    for p in room.points:
        if p.goal_met:
            assert p.estimate is None and dw.outlook_cell(p) == "met"


def test_basement_skirting_that_stops_falling_has_stalled():
    """A fourth visit with the skirting at 16.1 % MC after 28, 21.5, 16: the fit over the
    four readings still falls (about (−1.5 × 8.6 − 0.5 × 2.1 + 0.5 × −3.4 + 1.5 × −3.3) / 5
    = −4.1 % MC a day with the visits a day apart), but the last step rose by 0.1 in 0.993
    days (5 Feb 10:00 to 6 Feb 09:50): drying has stalled, no days to the goal, and the
    report's points table says so. The screed, 72 then 60, still falls steadily."""
    survey = _with_fourth_visit({"softwood skirting": 16.1, "sand-cement screed": 60.0})
    room = _room(drying.drying_progress(survey), "family")
    skirting = _point(room, "Skirting, party wall")
    assert skirting.fit is not None and skirting.fit.rate_per_day == pytest.approx(-4.1, abs=0.1)
    assert skirting.last_step_per_day == pytest.approx(0.1 / (1430 / 1440), abs=1e-6)
    assert skirting.trend is TrendState.STALLED and skirting.estimate is None
    assert skirting.goal_met is False
    assert "Drying has stalled: no fall since the reading before" in dw.point_sentence(
        skirting, {"office": "Basement office (unaffected)"}
    )
    screed = _point(room, "Screed, centre of room")
    assert screed.trend is TrendState.FALLING and screed.estimate is not None
    doc = report.build(survey, report.ReportOptions(generated_at="fixed"))
    table = next(
        b
        for b in doc.blocks
        if isinstance(b, Table) and b.name == "drying_points" and b.room == "family"
    )
    outlook = {row[0].text: row[6].text for row in table.rows}
    assert outlook["Skirting, party wall (softwood skirting, % MC)"] == "stalled"


def test_each_visit_is_judged_once():
    """drying_progress asks the judge for each visit exactly once."""
    survey = _basement()
    asked: list[int] = []

    def judge(index: int):
        asked.append(index)
        from survey import evaluate

        return evaluate.assess_visit(survey, index)

    drying.drying_progress(survey, judge)
    assert sorted(asked) == [0, 1, 2]


# --- constructed series --------------------------------------------------------------------


def _survey(values: list[float], days: list[float], **reading) -> model.Survey:
    """A wet room read at one point on each day given, and a reference room whose dry
    standard for the material is 20 (relative scale)."""
    rooms = [
        model.Room(id="wet", name="Wet room"),
        model.Room(id="ref", name="Reference room", is_reference=True),
    ]
    visits = []
    for value, day in zip(values, days, strict=True):
        at = T0 + dt.timedelta(days=day)
        wet = model.RoomVisit(
            room="wet",
            air=model.AirReading(dry_bulb_c=20.0, rh_pct=55.0),
            materials=[
                model.MaterialReading(
                    location=reading.get("location", "Wall, 0.1 m"),
                    material=reading.get("material", "plasterboard"),
                    value=value,
                    scale=reading.get("scale", "relative"),
                )
            ],
        )
        ref = model.RoomVisit(
            room="ref",
            air=model.AirReading(dry_bulb_c=20.0, rh_pct=50.0),
            materials=[
                model.MaterialReading(
                    location="Wall",
                    material="Plasterboard",
                    value=20.0,
                    scale="relative",
                    dry_standard=True,
                )
            ],
        )
        visits.append(model.Visit(started_at=at, rooms=[wet, ref]))
    return model.Survey(site=model.Site(reference="Test"), rooms=rooms, visits=visits)


def _only_point(survey: model.Survey) -> drying.MaterialPoint:
    (point,) = _room(drying.drying_progress(survey), "wet").points
    return point


def test_steady_series_rate_and_days_by_hand():
    """Readings 60, 51, 45, 36 on days 0-3, dry standard 20 so goal 22. x̄ = 1.5, ȳ = 48;
    dx = −1.5, −0.5, 0.5, 1.5; dy = 12, 3, −3, −12; Sxx = 5, Sxy = −39, b = −7.8 a day.
    a = 59.7; fitted 59.7, 51.9, 44.1, 36.3; residuals 0.3, −0.9, 0.9, −0.3; SSR = 1.8;
    s_b = √(1.8 / 2 / 5) = 0.424264. Days from 36 to 22: 14 / 7.8 = 1.794872; by day
    3 + 1.794872. The 95 % range, two degrees of freedom, t = 4.303 (any t table; the
    closed form 0.95 · √(2 / (4 · 0.975 · 0.025)) = 4.3027): half-width 1.825608;
    14 / 9.625608 = 1.454454 to 14 / 5.974392 = 2.343335; four readings: not rough."""
    point = _only_point(_survey([60.0, 51.0, 45.0, 36.0], [0, 1, 2, 3]))
    assert point.goal == pytest.approx(22.0)
    assert point.fit is not None
    assert point.fit.rate_per_day == pytest.approx(-7.8, abs=1e-9)
    assert point.fit.rate_se_per_day == pytest.approx(0.424264, abs=1e-6)
    assert point.trend is TrendState.FALLING
    assert point.estimate is not None
    assert point.estimate.days == pytest.approx(1.794872, abs=1e-6)
    assert point.estimate.days_low == pytest.approx(1.454454, abs=1e-6)
    assert point.estimate.days_high == pytest.approx(2.343335, abs=1e-6)
    assert not point.estimate.rough and not point.estimate.open_ended
    assert point.estimate.by == T0 + dt.timedelta(days=3 + 14 / 7.8)


def test_only_the_recent_readings_set_the_rate():
    """An early fast fall (90 on day −1) before the same four readings is left out of the
    fit: the rate stays −7.8 a day over the last four (drying_trend_readings = 4)."""
    assert th.value("drying_trend_readings") == 4.0
    point = _only_point(_survey([90.0, 60.0, 51.0, 45.0, 36.0], [-1, 0, 1, 2, 3]))
    assert point.fit is not None and point.fit.readings == 4
    assert point.fit.rate_per_day == pytest.approx(-7.8, abs=1e-9)


def test_flat_series_has_stalled_and_gives_no_number():
    """40, 39.9, 39.9 on days 0-2: b = (−1 × 0.0667 + 1 × −0.0333) / 2 = −0.05 a day, less
    than 1 % of 39.9 (0.399) a day: stalled, no days to the goal, and the words say so."""
    point = _only_point(_survey([40.0, 39.9, 39.9], [0, 1, 2]))
    assert point.fit is not None
    assert point.fit.rate_per_day == pytest.approx(-0.05, abs=1e-9)
    assert point.trend is TrendState.STALLED
    assert point.estimate is None
    assert dw.outlook_cell(point) == "stalled"
    assert "Drying has stalled" in dw.point_sentence(point, {"ref": "Reference room"})


def test_rising_series_has_stalled():
    """30, 31, 33 on days 0-2: rising 1.5 a day: stalled."""
    point = _only_point(_survey([30.0, 31.0, 33.0], [0, 1, 2]))
    assert point.fit is not None and point.fit.rate_per_day == pytest.approx(1.5)
    assert point.trend is TrendState.STALLED and point.estimate is None
    assert "no fall over the last 3 readings" in dw.trend_sentence(point)


def test_no_fall_since_the_reading_before_has_stalled():
    """60, 45, 46 on days 0-2: the fit falls (b = (−1 × 9.667 + 1 × −4.667) / 2 = −7 a day)
    but the last reading rose by 1: drying has stalled since the visit before."""
    point = _only_point(_survey([60.0, 45.0, 46.0], [0, 1, 2]))
    assert point.fit is not None and point.fit.rate_per_day == pytest.approx(-7.0)
    assert point.last_step_per_day == pytest.approx(1.0)
    assert point.trend is TrendState.STALLED and point.estimate is None
    assert "no fall since the reading before" in dw.trend_sentence(point)


def test_scattered_fall_is_unclear():
    """50, 30, 31, 29 on days 0-3: b = (−1.5 × 15 − 0.5 × −5 + 0.5 × −4 + 1.5 × −6) / 5
    = −6.2 a day; a = 35 + 9.3 = 44.3; residuals 5.7, −8.1, −0.9, 3.3; SSR = 109.8;
    s_b = √(109.8 / 2 / 5) = 3.3136; 6.2 < 2 × 3.3136: no steady trend, no number."""
    point = _only_point(_survey([50.0, 30.0, 31.0, 29.0], [0, 1, 2, 3]))
    assert point.fit is not None
    assert point.fit.rate_per_day == pytest.approx(-6.2)
    assert point.fit.rate_se_per_day == pytest.approx(3.3136, abs=1e-4)
    assert point.trend is TrendState.UNCLEAR and point.estimate is None
    assert dw.outlook_cell(point) == "no steady trend yet"


def test_two_readings_give_days_without_a_range():
    """60 then 40 a day later: −20 a day, 18 / 20 = 0.9 days to 22, no standard error."""
    point = _only_point(_survey([60.0, 40.0], [0, 1]))
    assert point.fit is not None and point.fit.rate_se_per_day is None
    assert point.estimate is not None and point.estimate.days == pytest.approx(0.9)
    assert point.estimate.days_low is None and point.estimate.days_high is None
    assert dw.outlook_cell(point) == "about 22 hours (rough: two readings, no range)"  # 21.6 h
    assert "A rough figure: two readings give no range yet." in dw.trend_sentence(point)


def test_no_dry_standard_no_goal():
    """A material with no dry standard anywhere has no goal; the words ask for one."""
    point = _only_point(_survey([60.0, 40.0], [0, 1], material="oak board", scale="wme_pct"))
    assert point.goal is None and point.goal_met is None and point.estimate is None
    assert point.trend is TrendState.FALLING
    assert "no dry standard" in dw.point_sentence(point, {})


def test_room_without_air_still_gets_its_dry_standard():
    """A visit with no air reading is not judged; the dry standard is found the same way
    (the reference room's 20), and 21 ≤ 22 meets the goal."""
    survey = _survey([60.0, 21.0], [0, 1])
    survey.visits[1].rooms[0].air = None
    point = _only_point(survey)
    assert point.readings[-1].dry_standard == 20.0
    assert point.goal_met is True


def test_points_match_ignoring_case_spacing_and_width():
    """'Wall, 0.1 m' / ' wall,  0.1 M ' / 'ＷＡＬＬ, 0.1 m' (full-width letters, NFKC) are one
    point; the same place on another scale or of another material is another point."""
    survey = _survey([60.0, 50.0, 40.0], [0, 1, 2])
    rooms = [v.rooms[0] for v in survey.visits]
    rooms[1].materials[0].location = " wall,  0.1 M "
    rooms[2].materials[0].location = "ＷＡＬＬ, 0.1 m"
    (point,) = _room(drying.drying_progress(survey), "wet").points
    assert [r.value for r in point.readings] == [60.0, 50.0, 40.0]
    assert point.location == "ＷＡＬＬ, 0.1 m"  # as written last
    rooms[2].materials[0].scale = "wme_pct"
    rooms[1].materials[0].material = "plaster skim"
    points = _room(drying.drying_progress(survey), "wet").points
    assert sorted(len(p.readings) for p in points) == [1, 1, 1]
    assert drying.point_key(" Wall,\t0.1  m", "PLASTERBOARD", "relative") == (
        "wall, 0.1 m",
        "plasterboard",
        "relative",
    )


# --- logger days ---------------------------------------------------------------------------

_LOG = [  # (time, °C, % RH)
    (dt.datetime(2025, 3, 1, 22, 0), 20.0, 85.0),
    (dt.datetime(2025, 3, 1, 22, 30), 21.0, 95.0),
    (dt.datetime(2025, 3, 1, 23, 0), 19.0, 70.0),
    (dt.datetime(2025, 3, 1, 23, 30), 20.0, 82.0),
    (dt.datetime(2025, 3, 2, 0, 0), 18.0, 91.0),
    (dt.datetime(2025, 3, 2, 0, 30), 18.0, 50.0),
    (dt.datetime(2025, 3, 2, 6, 0), 17.0, 60.0),
    (dt.datetime(2025, 3, 2, 6, 30), 19.0, 60.0),
]


def test_logger_days_by_hand():
    """Samples every 30 minutes (median gap 0.5 h; gaps up to 3 × 0.5 = 1.5 h count), then a
    5.5 h gap (00:30-06:00), left out. Each gap is split at its midpoint, each half at its
    own sample's RH, split again at midnight:
    1 March: 22:00-22:15 at 85, 22:15-22:45 at 95, 22:45-23:15 at 70, 23:15-23:45 at 82,
    23:45-24:00 at 91 → logged 2.0 h; above 80 %: 0.25 + 0.5 + 0.5 + 0.25 = 1.5 h; above
    90 %: 0.5 + 0.25 = 0.75 h. 2 March: 00:00-00:15 at 91, 00:15-00:30 at 50, 06:00-06:15
    and 06:15-06:30 at 60 → logged 1.0 h; above 80 and 90 %: 0.25 h each.
    Means of the day's samples: 1 March RH (85 + 95 + 70 + 82) / 4 = 83 (70 to 95), 20 °C
    (19 to 21); 2 March RH (91 + 50 + 60 + 60) / 4 = 65.25 (50 to 91), 18 °C (17 to 19).
    Humidity ratio per sample from psychrolib GetHumRatioFromRelHum at 101 325 Pa."""
    samples = [model.LogSample(at=a, dry_bulb_c=t, rh_pct=rh) for a, t, rh in _LOG]
    days, interval, limit, left_out, hours_out = drying.logger_days(samples, 101_325.0)
    assert interval == pytest.approx(0.5) and limit == pytest.approx(1.5)
    assert left_out == 1 and hours_out == pytest.approx(5.5)
    first, second = days
    assert first.day == dt.date(2025, 3, 1) and second.day == dt.date(2025, 3, 2)
    assert (first.samples, second.samples) == (4, 4)
    assert first.hours_logged == pytest.approx(2.0)
    assert first.hours_above_mould_rh == pytest.approx(1.5)
    assert first.hours_above_wet_rh == pytest.approx(0.75)
    assert second.hours_logged == pytest.approx(1.0)
    assert second.hours_above_mould_rh == pytest.approx(0.25)
    assert second.hours_above_wet_rh == pytest.approx(0.25)
    assert (first.rh_pct.mean, first.rh_pct.low, first.rh_pct.high) == (83.0, 70.0, 95.0)
    assert (second.rh_pct.mean, second.rh_pct.low, second.rh_pct.high) == (65.25, 50.0, 91.0)
    assert (first.temp_c.mean, first.temp_c.low, first.temp_c.high) == (20.0, 19.0, 21.0)
    assert (second.temp_c.mean, second.temp_c.low, second.temp_c.high) == (18.0, 17.0, 19.0)
    for day in days:
        expected = [
            psychrolib.GetHumRatioFromRelHum(t, rh / 100.0, 101_325.0)
            for a, t, rh in _LOG
            if a.date() == day.day
        ]
        assert day.humidity_ratio_kg_per_kg is not None
        assert day.humidity_ratio_kg_per_kg.mean == pytest.approx(
            sum(expected) / len(expected), rel=1e-6
        )
        assert day.humidity_ratio_kg_per_kg.low == pytest.approx(min(expected), rel=1e-6)
        assert day.humidity_ratio_kg_per_kg.high == pytest.approx(max(expected), rel=1e-6)


def test_logger_series_of_a_room_feeds_its_drying_and_the_report():
    """A room logger in the survey: its days in the room's drying, the logger limits cited,
    and a logger table in the report whose Markdown parses with every row whole."""
    survey = _survey([60.0, 51.0], [0, 1])
    samples = [model.LogSample(at=a, dry_bulb_c=t, rh_pct=rh) for a, t, rh in _LOG]
    survey.logs.append(model.LogSeries(room="wet", source="wet-logger.csv", samples=samples))
    survey.logs.append(model.LogSeries(room=None, source="garden.csv", samples=samples[:3]))
    progress = drying.drying_progress(survey)
    (summary,) = _room(progress, "wet").loggers
    assert [d.hours_above_wet_rh for d in summary.days] == pytest.approx([0.75, 0.25])
    assert len(progress.outdoor_loggers) == 1
    assert {"logger_gap_max_intervals", "logger_rh_wet_pct"} <= set(progress.threshold_keys)
    doc = report.build(survey, report.ReportOptions(generated_at="fixed"))
    tables = [b for b in doc.blocks if isinstance(b, Table) and b.name == "logger_days"]
    assert len(tables) == 2
    assert [c.value for c in tables[0].rows[0]][6:] == pytest.approx([1.5, 0.75])
    tokens = MarkdownIt("commonmark", {"html": False}).enable("table").parse(report.render(doc))
    assert sum(t.type == "table_open" for t in tokens) == sum(
        isinstance(b, Table) for b in doc.blocks
    )


# --- report --------------------------------------------------------------------------------


def test_basement_report_tables_hold_the_drying_values():
    """The report's drying tables show drying's typed values: each point's latest reading,
    goal and days to the goal, and each visit's reading in its column."""
    survey = _basement()
    progress = drying.drying_progress(survey)
    doc = report.build(survey, report.ReportOptions(generated_at="fixed", visit="all"))
    for room in progress.rooms:
        visits = next(
            b
            for b in doc.blocks
            if isinstance(b, Table) and b.name == "drying" and b.room == room.room_id
        )
        assert len(visits.rows) == len(room.visits_seen)
        if not room.points:
            continue
        table = next(
            b
            for b in doc.blocks
            if isinstance(b, Table) and b.name == "drying_points" and b.room == room.room_id
        )
        for row, point in zip(table.rows, room.points, strict=True):
            assert row[1].value == point.latest.value
            assert row[3].value == point.goal
            assert row[6].value == (None if point.estimate is None else point.estimate.days)
        for column, point in enumerate(room.points, start=len(dw.VISITS_HEADER)):
            assert [r[column].value for r in visits.rows] == [x.value for x in point.readings]
        said = next(
            b
            for b in doc.blocks
            if isinstance(b, Items) and b.name == "drying_points_said" and b.room == room.room_id
        )
        assert said.values == room.points
    limits = next(b for b in doc.blocks if isinstance(b, Items) and b.name == "drying_limits")
    assert {t.key for t in limits.values} == set(progress.threshold_keys)


# --- words in SI and IP --------------------------------------------------------------------


def test_room_air_words_in_si_and_ip():
    """The room air sentence writes humidity ratio in g/kg (SI) and grains per pound (IP,
    7000 gr/lb per kg/kg): the family room from 10.31 g/kg = 72.2 gr/lb."""
    room = _room(drying.drying_progress(_basement()), "family")
    si = dw.room_air_sentence(room, words.Display("si"))
    ip = dw.room_air_sentence(room, words.Display("ip"))
    assert "10.31 g/kg" in si and "g/kg a day" in si
    assert "72.2 gr/lb" in ip and "gr/lb a day" in ip
    assert "Screed, centre of room: 8.4 K" in si
    assert "Screed, centre of room: 15.1 °F" in ip  # 8.37 K × 1.8


def test_days_to_goal_words_give_the_range_and_date():
    """The steady series' sentence: 7.8 a day, about 1.79 days = 43 hours, around 6 March
    2025 (day 3 is 4 March 09:00; plus 1.79 days is 6 March, about 04:00); the 95 % range
    1.454 to 2.343 days (test_steady_series_rate_and_days_by_hand) = 35 hours to 2.3 days
    (hours below two days)."""
    point = _only_point(_survey([60.0, 51.0, 45.0, 36.0], [0, 1, 2, 3]))
    text = dw.trend_sentence(point)
    assert "falling 7.8 points a day" in text
    assert "about 43 hours away, around 6 March 2025." in text
    assert "From 4 readings, the rate's 95 % range gives 35 hours to 2.3 days." in text
    assert dw.outlook_cell(point) == "about 43 hours (35 hours to 2.3 days)"
    assert dw.rate_cell(point) == "−7.8 ± 0.4 points a day (4 readings)"


def test_logger_day_line_in_si_and_ip():
    """A logger day in words: 20 °C = 68 °F; the hours above 80 and 90 %."""
    samples = [model.LogSample(at=a, dry_bulb_c=t, rh_pct=rh) for a, t, rh in _LOG]
    first = drying.logger_days(samples)[0][0]
    si = dw.logger_day_line(first, words.Display("si"))
    ip = dw.logger_day_line(first, words.Display("ip"))
    assert si.startswith("1 March 2025: 20.0 °C (19.0 °C to 21.0 °C), 83 % (70 to 95 %)")
    assert "1.5 h above 80 % and 0.8 h above 90 % RH (2.0 h logged, 4 samples)" in si
    assert ip.startswith("1 March 2025: 68.0 °F (66.2 °F to 69.8 °F)")
    assert "gr/lb" in ip


# --- properties ----------------------------------------------------------------------------

_finite = st.floats(-50.0, 50.0, allow_nan=False, allow_infinity=False)


@given(
    intercept=st.floats(0.0, 100.0),
    slope=st.floats(-20.0, 20.0),
    days=st.lists(st.integers(0, 200), min_size=3, max_size=8, unique=True),
)
def test_fit_recovers_an_exact_line(intercept, slope, days):
    """Points on a straight line give back its slope, with a standard error of about 0."""
    x = sorted(d / 4.0 for d in days)
    fit = drying.fit_line(x, [intercept + slope * v for v in x])
    assert fit is not None
    assert fit.rate_per_day == pytest.approx(slope, abs=1e-6)
    assert fit.rate_se_per_day is not None and fit.rate_se_per_day < 1e-6


@given(
    values=st.lists(st.floats(0.0, 100.0), min_size=2, max_size=6),
    goal=st.floats(0.0, 50.0),
)
def test_estimate_range_holds_the_estimate(values, goal):
    """Where a steady fall gives days to the goal, low ≤ days ≤ high, all ≥ 0, and the
    words give a number only then."""
    days = [float(i) for i in range(len(values))]
    fit = drying.recent_fit(days, values)
    step = values[-1] - values[-2]
    trend = drying.trend_of(fit, values[-1], step)
    if trend is not TrendState.FALLING:
        return
    assert fit is not None
    estimate = drying.estimate_to_goal(fit, values[-1], goal, T0)
    assert estimate.days >= 0.0
    if estimate.days_low is not None and estimate.days_high is not None:
        assert 0.0 <= estimate.days_low <= estimate.days <= estimate.days_high


@given(
    text=st.text(alphabet=st.characters(codec="latin-1"), max_size=30),
    spaces=st.lists(st.sampled_from([" ", "  ", "\t", "\n"]), min_size=2, max_size=2),
)
def test_matching_ignores_case_and_surrounding_space(text, spaces):
    """A label and its upper-cased form with white space around it are one point."""
    assert drying.fold(text) == drying.fold(spaces[0] + text.upper() + spaces[1])


@given(text=st.text(max_size=30))
def test_matching_form_is_stable(text):
    """Folding a folded label changes nothing (the form is closed)."""
    assert drying.fold(drying.fold(text)) == drying.fold(text)


@given(
    minutes=st.lists(st.integers(0, 6 * 24 * 60), min_size=1, max_size=60),
    rhs=st.lists(st.floats(1.0, 100.0), min_size=60, max_size=60),
    temps=st.lists(_finite, min_size=60, max_size=60),
)
def test_logger_hours_add_up(minutes, rhs, temps):
    """Hours logged plus hours left out equal the series' span; per day the hours above
    90 % are within those above 80 %, within those logged; low ≤ mean ≤ high."""
    start = dt.datetime(2025, 1, 1)
    samples = [
        model.LogSample(at=start + dt.timedelta(minutes=m), dry_bulb_c=t, rh_pct=rh)
        for m, t, rh in zip(sorted(minutes), temps, rhs, strict=False)
    ]
    days, _, _, _, hours_out = drying.logger_days(samples)
    span = (max(minutes) - min(minutes)) / 60.0
    assert math.fsum(d.hours_logged for d in days) + hours_out == pytest.approx(span, abs=1e-6)
    assert sum(d.samples for d in days) == len(samples)
    for d in days:
        assert d.hours_above_wet_rh <= d.hours_above_mould_rh + 1e-9
        assert d.hours_above_mould_rh <= d.hours_logged + 1e-9
        assert d.hours_logged <= 24.0 + 1e-9
        for r in (d.temp_c, d.rh_pct):
            assert r.low <= r.mean <= r.high


# --- the app -------------------------------------------------------------------------------


async def test_app_drying_screen_from_the_room_list(tmp_path):
    """On the room list, g opens the drying screen: a sparkline for each room's air and each
    material point of the basement (3 rooms with air, 4 points), each point with its
    readings, goal and days to the goal, and the straight-line caveat once; Escape goes back
    to the room list."""
    import shutil

    from textual.widgets import Static

    from survey.app import make_app
    from survey.app.drying import DryingScreen, PointRow
    from survey.app.rooms import RoomListScreen

    path = tmp_path / "basement.json"
    shutil.copyfile(BASEMENT, path)
    app = make_app(path, data_dir=tmp_path / "data", clock=lambda: dt.datetime(2025, 2, 5, 12))
    async with app.run_test(size=(120, 40)) as pilot:
        await pilot.pause()
        assert isinstance(app.screen, RoomListScreen)
        await pilot.press("g")
        await pilot.pause()
        await app.workers.wait_for_complete()
        await pilot.pause()
        assert isinstance(app.screen, DryingScreen)
        assert len(app.screen.query(".drying-spark")) == 3 + 4
        statuses = [
            str(row.query_one(".drying-status", Static).render())
            for row in app.screen.query(PointRow)
        ]
        party = next(s for s in statuses if s.startswith("95 → 71 → 46"))
        assert "goal 24.2 or less" in party and "about 21 hours" in party  # 0.887 d × 24
        # that a straight line is optimistic is said once on the screen, not per point
        texts = [str(w.render()) for w in app.screen.query(Static)]
        assert sum("A straight line is optimistic" in t for t in texts) == 1
        assert not any("allow longer" in t for t in texts)
        await pilot.press("escape")
        await pilot.pause()
        assert isinstance(app.screen, RoomListScreen)


def test_a_spark_line_is_scaled_from_the_goal_so_a_small_fall_looks_small():
    """98 then 96 against a goal of 20 stays at the top bars; 98 then 20 falls to the
    bottom. Without a goal the line spans its own values; one value alone, or equal values,
    sit mid-scale. Each value takes an equal share of the width."""
    from survey.app.drying import BARS, SPARK_WIDTH, spark_line

    share = SPARK_WIDTH // 2
    assert spark_line([98.0, 96.0], low=20.0) == BARS[-1] * share + BARS[-1] * share
    assert spark_line([98.0, 20.0], low=20.0) == BARS[-1] * share + BARS[0] * share
    assert spark_line([98.0, 96.0]) == BARS[-1] * share + BARS[0] * share
    assert spark_line([50.0, 50.0]) == BARS[3] * share * 2
    assert spark_line([]) == ""
    assert len(spark_line([1.0, 2.0, 3.0])) == SPARK_WIDTH


def test_point_not_read_on_the_last_visit_says_so():
    """A point read on visits 1 and 2 but not 3 counts one missed visit, and the words ask
    for it to be read again."""
    survey = _survey([60.0, 50.0, 40.0], [0, 1, 2])
    survey.visits[2].rooms[0].materials = []
    point = _only_point(survey)
    assert point.visits_missed == 1 and len(point.readings) == 2
    assert "Not read on the room's last visit" in dw.point_sentence(point, {})


def test_room_air_is_set_beside_the_reference_room_and_outdoors():
    """The family room's last visit: 7.00 g/kg against the office (reference) 6.59 g/kg
    and outdoors 4.56 g/kg (4 °C / 90 % at 62 m, psychrolib GetHumRatioFromRelHum)."""
    survey = _basement()
    room = _room(drying.drying_progress(survey), "family")
    last = room.air[-1]
    pressure = model.pressure_pa_for(survey)
    assert last.reference_humidity_ratio_kg_per_kg == pytest.approx(
        psychrolib.GetHumRatioFromRelHum(19.0, 0.48, pressure), rel=1e-6
    )
    assert last.outdoor_humidity_ratio_kg_per_kg == pytest.approx(
        psychrolib.GetHumRatioFromRelHum(4.0, 0.90, pressure), rel=1e-6
    )
    text = dw.room_air_sentence(room, words.Display("si"))
    assert "7.00 g/kg, against 6.59 g/kg in the reference room and 4.56 g/kg outdoors" in text
    office = _room(drying.drying_progress(survey), "office")
    assert office.air[-1].reference_humidity_ratio_kg_per_kg is None


def test_hostile_point_labels_stay_text_in_the_report():
    """A point's location and material with table pipes, a link, HTML and a heading mark
    add no cell, link or HTML to the report's drying tables (the report escapes them)."""
    survey = _survey(
        [60.0, 50.0, 40.0],
        [0, 1, 2],
        location="# wall | [x](http://e.invalid) <b>",
        material="board |*",
    )
    survey.rooms[0].name = "Wet | [room](x)"
    doc = report.build(survey, report.ReportOptions(generated_at="fixed"))
    tokens = MarkdownIt("commonmark", {"html": False}).enable("table").parse(report.render(doc))
    assert not any(t.type in ("link_open", "html_inline", "html_block") for t in tokens)
    inline = [c for t in tokens if t.type == "inline" for c in (t.children or [])]
    assert not any(c.type in ("link_open", "html_inline") for c in inline)
    tables = [b for b in doc.blocks if isinstance(b, Table)]
    rows = []
    for token in tokens:
        if token.type == "tr_open":
            rows.append(0)
        elif token.type in ("th_open", "td_open"):
            rows[-1] += 1
    assert rows == [len(t.header) for t in tables for _ in range(len(t.rows) + 1)]


def test_drying_limits_are_in_the_table_marked_as_practice():
    """The drying limits are looked up through the one table and marked common practice
    (no published source was found for them): 4 readings, 1 % a day, 2 standard errors,
    3 usual intervals, 90 % RH. The goal's allowance is the assessment's own 10 %."""
    from survey.thresholds.limits_drying import DRYING_LIMITS

    expected = {
        "drying_trend_readings": 4.0,
        "drying_stalled_daily_fraction": 0.01,
        "drying_steady_standard_errors": 2.0,
        "logger_gap_max_intervals": 3.0,
        "logger_rh_wet_pct": 90.0,
    }
    assert {t.key: t.value for t in DRYING_LIMITS} == expected
    for t in DRYING_LIMITS:
        assert th.get(t.key) is t and t.mark == "common practice"
    assert th.value("dry_standard_tolerance_fraction") == 0.10
    assert drying.goal_for(22.0) == pytest.approx(24.2)


def test_a_dry_standard_not_read_again_stands_from_the_visit_it_was_read_on():
    """The reference room's dry standard (20, relative) is read on the first visit only; the
    later visits judge the wet wall against it (goal 20 × 1.1 = 22, the allowance of
    ``dry_standard_tolerance_fraction``), say which visit it was read on, and a standard
    read again on a later visit takes over from then on (here 25, goal 27.5)."""
    survey = _survey([60.0, 30.0, 21.0, 26.0], [0, 2, 4, 6])
    for visit in survey.visits[1:]:
        visit.rooms[1].materials = []  # the reference wall not read again
    point = _only_point(survey)
    assert [r.dry_standard for r in point.readings] == [20.0, 20.0, 20.0, 20.0]
    assert [r.state for r in point.readings][1:] == [
        DryStandardState.ABOVE,
        DryStandardState.AT,
        DryStandardState.ABOVE,
    ]
    assert point.goal == pytest.approx(22.0) and point.dry_standard_visit == 0
    names = {"ref": "Reference room"}
    assert dw.dry_standard_cell(point, names) == "20 in Reference room, read on visit 1"

    from survey import evaluate

    judged = evaluate.assess_visit(survey, 2).findings.rooms[0].materials[0]
    assert judged.dry_standard == 20.0 and judged.dry_standard_visit == 0
    assert words.report_room.dry_standard_text(judged).endswith(", read on visit 1")

    survey.visits[3].rooms[1].materials = copy.deepcopy(survey.visits[0].rooms[1].materials)
    survey.visits[3].rooms[1].materials[0].value = 25.0
    point = _only_point(survey)
    assert point.readings[-1].dry_standard == 25.0 and point.dry_standard_visit is None
    assert point.goal == pytest.approx(27.5) and point.goal_met is True
    assert dw.dry_standard_cell(point, names) == "25 in Reference room"


def test_the_latest_reading_by_time_taken_names_the_point_and_its_standard():
    """A point's readings are ordered by when each was taken, and the latest one gives the
    point its name, its standard and where that was read, even where the visits' start
    times order them otherwise: visit 2 started a day after visit 1, but visit 1's wall was
    read (taken_at) two days after that. Visit 1 judged it against the reference room's 20,
    visit 2 against 25 read again on visit 2. The latest reading is visit 1's, so the goal is
    22 (20 × 1.1) and its name is as written then. (The point's name and standard were once
    taken from the last visit by start time while its latest reading was by time taken.)"""
    survey = _survey([40.0, 30.0], [0, 1])
    first, second = survey.visits
    first.rooms[0].materials[0].taken_at = T0 + dt.timedelta(days=3)
    first.rooms[0].materials[0].location = "WALL, 0.1 m"
    second.rooms[1].materials[0].value = 25.0
    point = _only_point(survey)
    assert [r.visit_index for r in point.readings] == [1, 0]
    assert [r.dry_standard for r in point.readings] == [25.0, 20.0]
    assert point.goal == pytest.approx(22.0) and point.goal_met is False
    assert point.location == "WALL, 0.1 m"
    assert point.dry_standard_room == "ref" and point.dry_standard_visit is None


def test_this_visits_dry_standard_comes_before_an_earlier_visits():
    """The room's own dry-standard reading on this visit is taken over the reference room's
    from an earlier visit; with neither on this visit, the earlier visit's own-room reading
    comes before its reference room's (the same order as within a visit)."""
    from survey import evaluate

    survey = _survey([60.0, 40.0], [0, 1])
    first, second = survey.visits
    own = model.MaterialReading(
        location="Wall, unaffected end",
        material="plasterboard",
        value=18.0,
        scale="relative",
        dry_standard=True,
    )
    second.rooms[1].materials = []
    second.rooms[0].materials.append(copy.deepcopy(own))
    judged = evaluate.assess_visit(survey, 1).findings.rooms[0].materials[0]
    assert (judged.dry_standard, judged.dry_standard_visit) == (18.0, None)

    second.rooms[0].materials.pop()
    first.rooms[0].materials.append(copy.deepcopy(own))
    judged = evaluate.assess_visit(survey, 1).findings.rooms[0].materials[0]
    assert (judged.dry_standard, judged.dry_standard_visit) == (18.0, 0)


def test_visits_with_and_without_a_time_zone_still_find_an_earlier_dry_standard():
    """The first visit's start written with a time zone, the second's without (a file the
    store accepts): the visits order by the wall-clock times written, and the second visit
    is judged against the first visit's dry standard (20, goal 22) rather than failing."""
    from survey import evaluate

    survey = _survey([60.0, 21.0], [0, 1])
    first, second = survey.visits
    first.started_at = first.started_at.replace(tzinfo=dt.UTC)
    second.rooms[1].materials = []
    judged = evaluate.assess_visit(survey, 1).findings.rooms[0].materials[0]
    assert (judged.dry_standard, judged.dry_standard_visit) == (20.0, 0)
    point = _only_point(survey)
    assert point.goal == pytest.approx(22.0) and point.goal_met is True


def test_two_visits_begun_at_the_same_time_order_as_in_the_file():
    """Two visits with the same start: the one later in the file sees the earlier one's
    dry standard, not the other way round."""
    from survey import evaluate

    survey = _survey([60.0, 21.0], [0, 0])
    first, second = survey.visits
    second.rooms[1].materials = []
    assert [(e.visit_index, e.visit) for e in evaluate.earlier_visits(survey, 1)] == [(0, first)]
    assert evaluate.earlier_visits(survey, 0) == []


def test_the_live_judgement_of_a_room_never_takes_its_own_visit_as_an_earlier_one():
    """The room judged as it is being edited (a candidate record, as the app's panel does):
    with the room's own dry-standard reading (18) taken out of the candidate, its material
    is judged against the first visit's reference reading (20, read on visit 1), not against
    the 18 still stored for this same visit."""
    from survey import evaluate

    survey = _survey([60.0, 40.0], [0, 1])
    second = survey.visits[1]
    second.rooms[1].materials = []
    own = model.MaterialReading(
        location="Wall, unaffected end",
        material="plasterboard",
        value=18.0,
        scale="relative",
        dry_standard=True,
    )
    second.rooms[0].materials.append(own)
    candidate = msgspec.structs.replace(second.rooms[0], materials=second.rooms[0].materials[:1])
    judged = evaluate.assess_room(survey, 1, "wet", candidate)
    material = judged.finding.materials[0]
    assert (material.dry_standard, material.dry_standard_visit) == (20.0, 0)


def test_one_point_is_said_in_the_singular():
    """ "1 material points" read badly: one point is one."""
    survey = _survey([60.0, 30.0], [0, 2])
    room = _room(drying.drying_progress(survey), "wet")
    assert dw.room_goals_text(room) == "0 of 1 material point at its drying goal."
    for visit in survey.visits:
        visit.rooms[1].materials = []  # no dry standard: no goal
    room = _room(drying.drying_progress(survey), "wet")
    assert dw.room_goals_text(room) == ("1 material point, without a dry standard to set a goal.")
    assert "Time to goal" in dw.POINTS_HEADER  # the estimate can be hours as well as days


def test_equipment_carried_to_a_new_visit_does_not_count_as_a_visit_missed():
    """A new visit begun with the rooms' units carried over, nothing read yet: no point has
    missed a visit (the room was not entered), and a record is entered once anything is
    read there."""
    from survey.app import judging

    survey = _basement()
    before = drying.drying_progress(survey)
    survey.visits.append(judging.new_visit(dt.datetime(2025, 2, 8, 9, 30), survey.visits[-1]))
    after = drying.drying_progress(survey)
    assert [[p.visits_missed for p in r.points] for r in after.rooms] == [
        [p.visits_missed for p in r.points] for r in before.rooms
    ]
    record = survey.visits[-1].room_visit("family")
    assert record.equipment and not record.entered()
    record.air = model.AirReading(dry_bulb_c=20.0, rh_pct=55.0)
    assert record.entered()
    assert all(p.visits_missed == 1 for p in _room(drying.drying_progress(survey), "family").points)
