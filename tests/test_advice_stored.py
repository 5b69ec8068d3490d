"""The practitioner's rules hold on a stored visit, not only on `survey check`: the file's
water, use and combustion-air fields reach the advice through evaluate."""

from __future__ import annotations

import copy
from pathlib import Path

import pytest

from survey import evaluate, store
from survey.advise import ActionKind

EXAMPLES = Path(__file__).parent.parent / "example_sites"


def _load(name: str):
    return store.load_survey(EXAMPLES / f"{name}.json")


def _room(judged, room_id):
    return judged.advice.rooms[judged.room_ids.index(room_id)]


def test_stored_category_2_water_left_standing_leads_with_removal():
    """Basement, day 1: category 2 water recorded as standing 72 h (over the 48 h of the
    restoration standard, from memory) is acted on as category 3: removal first."""
    survey = _load("basement-burst-pipe-drying")
    obs = survey.visits[0].room_visit("family").observations
    obs.water_category = 2
    obs.water_standing_h = 72.0
    advice = _room(evaluate.assess_visit(survey, 0), "family")
    assert advice.actions[0].kind is ActionKind.REMOVE_CONTAMINATED_MATERIALS
    assert advice.actions[0].numbers.degraded is True


def test_stored_flued_appliance_no_drops_the_combustion_air_caution():
    """The site saying there is no open-flued appliance removes the combustion-air caution;
    not said, it stands where the advice closes the space up."""
    survey = _load("basement-burst-pipe-drying")
    keys = [c.key for c in _room(evaluate.assess_visit(survey, 0), "family").cautions]
    assert "combustion_air" in keys
    survey.site.flued_appliance = False
    keys = [c.key for c in _room(evaluate.assess_visit(survey, 0), "family").cautions]
    assert "combustion_air" not in keys


def test_stored_showers_per_day_are_the_bathroom_load():
    """Three showers a day on the bathroom record: 3 × 2500 g/h × 10 min / 24 h = 52.08 g/h
    (shower rate via a building-science text quoting BS 5250; 10 min our choice), not the
    typical two."""
    survey = _load("winter-flat-bedroom-mould")
    bath = next(r for r in survey.rooms if r.use == "bathroom")
    bath.showers_per_day = 3.0
    moisture = _room(evaluate.assess_visit(survey, 0), bath.id).moisture
    assert moisture.typical_use_assumed is None
    assert moisture.activities_g_per_h == pytest.approx(3 * 2500 * 10 / 60 / 24, rel=1e-9)


def test_stored_wet_area_sets_the_class_of_water_loss():
    """A drying room recorded with 50 % of its surfaces wet is a class 3 loss (over 40 %,
    restoration standard of practice, from memory)."""
    survey = _load("basement-burst-pipe-drying")
    survey.visits[0].room_visit("family").observations.wet_area_pct = 50.0
    advice = _room(evaluate.assess_visit(survey, 0), "family")
    dehumidify = next(a for a in advice.actions if a.kind is ActionKind.DEHUMIDIFY)
    assert dehumidify.numbers.water_loss_class == 3


def test_separate_outdoor_thermometer_is_read_from_the_instruments():
    """An outdoor reading by another instrument than the room's is not correlated with it."""
    survey = copy.deepcopy(_load("winter-flat-bedroom-mould"))
    visit = survey.visits[0]
    room_visit = next(rv for rv in visit.rooms if rv.air is not None)
    assert evaluate._shared_thermometer(visit, room_visit) is True
    visit.outdoor.instrument = "other-thermometer"
    room_visit.air.instrument = survey.instruments[0].id
    assert evaluate._shared_thermometer(visit, room_visit) is False
