"""A stored visit judged through survey.evaluate, checked against CoolProp and the examples.

The example sites are invented scenarios; what is checked here is that the judgement of a
stored visit follows from its readings by outside formulas (CoolProp HAPropsSI for the moist
air), and that the survey vocabulary and the assessment's agree.
"""

from __future__ import annotations

import typing
from pathlib import Path

import pytest
from CoolProp.HumidAirProp import HAPropsSI

from survey import assess, evaluate, model, store
from survey import thresholds as th

EXAMPLES = Path(__file__).resolve().parents[1] / "example_sites"


def load(name: str) -> model.Survey:
    return store.load_survey(EXAMPLES / f"{name}.json")


def _kinds(advice) -> list[str]:
    return [action.kind.value for action in advice.actions]


def test_room_uses_and_moisture_scales_agree_between_model_and_assessment():
    """Every room use and moisture scale a survey file allows, the assessment knows."""
    assert set(typing.get_args(model.RoomUse)) == set(th.ROOM_USES)
    assert set(typing.get_args(model.MoistureScale)) == set(assess.MATERIAL_SCALES)


def test_winter_flat_bedroom_corner_is_above_the_mould_limit():
    """Bedroom at 17.5 °C / 72 % on a 12.6 °C corner: surface RH 98-99 % by CoolProp
    (room vapour pressure over saturation at the surface), above BS 5250's 80 %."""
    survey = load("winter-flat-bedroom-mould")
    judged = evaluate.assess_visit(survey, 0)
    bedroom = judged.findings.rooms[judged.room_ids.index("bed1")]
    corner = bedroom.surfaces[0]
    assert corner.label.startswith("NE corner")
    pressure = model.pressure_pa_for(survey, judged.visit)
    pw_room = HAPropsSI("P_w", "T", 17.5 + 273.15, "P", pressure, "R", 0.72)
    pw_sat_surface = HAPropsSI("P_w", "T", 12.6 + 273.15, "P", pressure, "R", 1.0)
    assert corner.surface_rh_pct == pytest.approx(100 * pw_room / pw_sat_surface, abs=0.6)
    assert corner.mould is assess.MouldState.ABOVE
    # Outdoors 2 °C / 85 % is drier in absolute terms than the room: ventilation is advised.
    advice = judged.advice.rooms[judged.room_ids.index("bed1")]
    assert "ventilate" in _kinds(advice)
    # Visible mould was recorded: its caution is shown, and the closing caution comes last.
    keys = [c.key for c in judged.advice.cautions]
    assert "visible_mould" in keys and keys[-1] == "closing"


def test_winter_flat_uses_the_survey_instrument_accuracies():
    """Accuracies come from the survey's instruments when it records them."""
    survey = load("winter-flat-bedroom-mould")
    judged = evaluate.assess_visit(survey, 0)
    thermo = survey.instrument(survey.visits[0].rooms[0].air.instrument)
    assert judged.findings.rooms[0].accuracy.rh_pct >= thermo.rh_accuracy_pct
    assert judged.accuracy_entered["rh_pct"] is True


def test_humid_summer_cottage_is_not_told_to_ventilate():
    """Outdoor air 22.5 °C / 82 % holds more water than the closed-up rooms (CoolProp), so
    no room is told to ventilate; the damp rooms are told to dehumidify."""
    survey = load("coastal-cottage-summer")
    judged = evaluate.assess_visit(survey, 0)
    pressure = model.pressure_pa_for(survey, judged.visit)
    w_out = HAPropsSI("W", "T", 22.5 + 273.15, "P", pressure, "R", 0.82)
    for room_id, finding, advice in zip(judged.room_ids, judged.findings.rooms,
                                        judged.advice.rooms):
        w_in = HAPropsSI("W", "T", finding.air.dry_bulb_c + 273.15, "P", pressure,
                         "R", finding.air.rh_pct / 100)
        assert w_out > w_in, room_id
        assert "ventilate" not in _kinds(advice), room_id
    living = judged.advice.rooms[judged.room_ids.index("living")]
    assert "dehumidify" in _kinds(living)
    # The crawl space brings the confined-space caution.
    assert "confined_space" in [c.key for c in judged.advice.cautions]


def test_basement_dry_standard_comes_from_the_reference_room_and_falls_toward_it():
    """Each wet reading is compared with the same material's dry-standard reading in the
    unaffected reference room, and its excess falls from visit to visit while drying."""
    survey = load("basement-burst-pipe-drying")
    reference_ids = {room.id for room in survey.rooms if room.is_reference}
    assert reference_ids
    excesses: dict[str, list[float]] = {}
    for index in range(len(survey.visits)):
        judged = evaluate.assess_visit(survey, index)
        family = judged.findings.rooms[judged.room_ids.index("family")]
        for material in family.materials:
            assert material.dry_standard is not None, material.label
            excesses.setdefault(material.label, []).append(material.excess_over_dry_standard)
    assert excesses
    for label, series in excesses.items():
        assert len(series) == len(survey.visits)
        assert series == sorted(series, reverse=True), label
        assert series[-1] < series[0], label


def test_dry_standard_found_in_the_same_room_first():
    """A dry-standard reading in the room itself wins over the reference room's."""
    survey = load("basement-burst-pipe-drying")
    visit = survey.visits[0]
    family = next(rv for rv in visit.rooms if rv.room == "family")
    wet = next(m for m in family.materials if not m.dry_standard)
    own = model.MaterialReading(location="own dry spot", material=wet.material,
                                value=wet.value / 3, scale=wet.scale, dry_standard=True)
    family.materials.append(own)
    entered: dict[str, bool] = {}
    judged = evaluate.room_input(survey, visit, family, entered)
    first = next(m for m in judged.materials if m.label == wet.location)
    assert first.dry_standard == pytest.approx(wet.value / 3)


def test_room_without_an_air_reading_is_left_out():
    """A room visited without an air reading is not judged (nothing to judge it by)."""
    survey = load("winter-flat-bedroom-mould")
    survey.visits[0].rooms[0].air = None
    judged = evaluate.assess_visit(survey, 0)
    assert "bed1" not in judged.room_ids
    assert len(judged.room_ids) == len(survey.visits[0].rooms) - 1


@pytest.mark.parametrize(("material", "timber"), [
    ("softwood skirting", True), ("Pine floorboards", True), ("chipboard floor", True),
    ("gypsum plaster", False), ("concrete screed", False), ("painted brick", False),
])
def test_timber_is_recognised_by_name(material, timber):
    """Timber limits apply to wood products only."""
    assert evaluate.is_timber(material) is timber
