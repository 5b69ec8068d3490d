"""The file model's input domain is the assessment's: a survey that loads can be assessed.

The bounds themselves are plausibility limits of this program (:mod:`survey.domain`), not
published values; what is checked here is that the survey file model refuses what the
assessment would refuse, and accepts everything up to the same edges.
"""

from __future__ import annotations

import datetime as dt

import pytest
from hypothesis import HealthCheck, given, settings
from test_store import surveys

from survey import domain, evaluate, model, store
from survey.errors import InputError


def _room(**fields) -> model.Room:
    return model.Room(id="r1", name="Room", **fields)


def _instrument(**fields) -> model.Instrument:
    return model.Instrument(id="th", kind="thermo_hygrometer", name="TH", **fields)


@pytest.mark.parametrize(
    ("record", "field", "words"),
    [
        (_room(volume_m3=0.001), "volume_m3", "between 1 and 100000 m³"),
        (_room(volume_m3=250_000.0), "volume_m3", "between 1 and 100000 m³"),
        (_room(floor_area_m2=0.5), "floor_area_m2", "between 1 and 20000 m²"),
        (_room(height_m=60.0), "height_m", "between 1 and 50 m"),
        (_room(occupants=900), "occupants", "between 0 and 500"),
        (_instrument(air_temp_accuracy_k=8.0), "air_temp_accuracy_k", "between 0.01 and 5 K"),
        (_instrument(rh_accuracy_pct=25.0), "rh_accuracy_pct", "between 0.1 and 20 %"),
        (
            _instrument(surface_temp_accuracy_k=11.0),
            "surface_temp_accuracy_k",
            "between 0.01 and 10 K",
        ),
        (
            model.Observations(mould_visible=True, mould_area_m2=2e5),
            "mould_area_m2",
            "between 0 and 100000 m²",
        ),
    ],
)
def test_values_the_assessment_refuses_do_not_validate(record, field, words):
    """A room of 0.001 m³, 900 occupants or an 8 K air accuracy is refused by the model
    with the domain's bounds, as the assessment would refuse it."""
    with pytest.raises(InputError) as err:
        store.check_record(record)
    assert err.value.field == field
    assert words in err.value.allowed


def test_model_bounds_are_the_domain_bounds():
    """The generated schema carries survey.domain's numbers (one home for each bound)."""
    defs = store.survey_schema()["$defs"]

    def bounds(record: str, name: str) -> tuple[float, float]:
        prop = defs[record]["properties"][name]
        option = next(o for o in prop.get("anyOf", [prop]) if o.get("type") != "null")
        return option.get("minimum", option.get("exclusiveMinimum")), option["maximum"]

    assert bounds("Room", "volume_m3") == (domain.ROOM_VOLUME_MIN_M3, domain.ROOM_VOLUME_MAX_M3)
    assert bounds("Room", "floor_area_m2") == (domain.FLOOR_AREA_MIN_M2, domain.FLOOR_AREA_MAX_M2)
    assert bounds("Room", "height_m") == (domain.ROOM_HEIGHT_MIN_M, domain.ROOM_HEIGHT_MAX_M)
    assert bounds("Room", "occupants") == (0, domain.OCCUPANTS_MAX)
    assert bounds("Instrument", "air_temp_accuracy_k")[1] == domain.AIR_TEMP_ACCURACY_MAX_K
    assert bounds("Instrument", "rh_accuracy_pct")[1] == domain.RH_ACCURACY_MAX_PCT
    assert bounds("Instrument", "surface_temp_accuracy_k")[1] == domain.SURFACE_TEMP_ACCURACY_MAX_K
    assert bounds("Observations", "mould_area_m2")[1] == domain.MOULD_AREA_MAX_M2


def test_volume_from_area_and_height_must_be_in_the_domain():
    """20000 m² × 50 m passes each field's bound but gives 1 000 000 m³: refused, naming both."""
    survey = model.Survey(
        site=model.Site(reference="x"), rooms=[_room(floor_area_m2=20_000.0, height_m=50.0)]
    )
    ((where, problem),) = model.problems(survey)
    assert where == "rooms[0].height_m"
    assert "20000 m² × height 50 m gives 1e+06 m³" in problem
    assert "between 1 and 100000 m³" in problem
    assert (
        model.problems(
            model.Survey(
                site=model.Site(reference="x"), rooms=[_room(floor_area_m2=2000.0, height_m=50.0)]
            )
        )
        == []
    )


def _edge_survey() -> model.Survey:
    """Every domain bound at its edge, in one visit the assessment must accept."""
    instrument = _instrument(
        air_temp_accuracy_k=domain.AIR_TEMP_ACCURACY_MAX_K,
        rh_accuracy_pct=domain.RH_ACCURACY_MAX_PCT,
        surface_temp_accuracy_k=domain.SURFACE_TEMP_ACCURACY_MAX_K,
    )
    rooms = [
        model.Room(id="small", name="Cupboard", volume_m3=domain.ROOM_VOLUME_MIN_M3),
        model.Room(
            id="hall",
            name="Hall",
            volume_m3=domain.ROOM_VOLUME_MAX_M3,
            occupants=domain.OCCUPANTS_MAX,
        ),
        model.Room(
            id="low",
            name="Low",
            floor_area_m2=domain.FLOOR_AREA_MIN_M2,
            height_m=domain.ROOM_HEIGHT_MIN_M,
        ),
    ]
    seen = [
        model.RoomVisit(
            room=r.id,
            air=model.AirReading(dry_bulb_c=20.0, rh_pct=60.0, instrument="th"),
            surfaces=[
                model.SurfaceReading(
                    location="wall", element="external_wall", surface_temp_c=14.0, instrument="th"
                )
            ],
            observations=model.Observations(
                mould_visible=True, mould_area_m2=domain.MOULD_AREA_MAX_M2
            ),
        )
        for r in rooms
    ]
    visit = model.Visit(
        started_at=dt.datetime(2025, 1, 15, 9),
        outdoor=model.AirReading(dry_bulb_c=3.0, rh_pct=85.0),
        rooms=seen,
    )
    return model.Survey(
        site=model.Site(reference="edges"), instruments=[instrument], rooms=rooms, visits=[visit]
    )


def test_survey_at_every_domain_edge_validates_and_is_assessed(tmp_path):
    """A survey with every bound at its edge saves, loads and is assessed without error."""
    path = tmp_path / "edges.json"
    store.save_survey(_edge_survey(), path)
    survey = store.load_survey(path)
    judged = evaluate.assess_visit(survey, 0)
    assert len(judged.findings.rooms) == 3


@settings(max_examples=40, deadline=None, suppress_health_check=[HealthCheck.too_slow])
@given(surveys())
def test_any_survey_that_validates_can_be_assessed(survey):
    """Every visit of any survey the file model accepts is assessed without InputError."""
    store.check_record(survey)
    for index in range(len(survey.visits)):
        evaluate.assess_visit(survey, index)
