"""The survey model: records, range checks, cross-record checks, and the example sites.

The example sites are checked for physical consistency against CoolProp ``HAPropsSI``
(real-gas moist air, an independent reference; the package never imports it): a surface
marked as wet must be at or below the dew point of its room's air within the instruments'
stated accuracy, and a surface well below the dew point must be marked wet.
"""

from __future__ import annotations

import datetime as dt
import itertools
import json
from pathlib import Path

import msgspec
import pytest
from CoolProp.HumidAirProp import HAPropsSI

from survey import model, psychro, store
from survey.errors import InputError

EXAMPLES = Path(__file__).resolve().parents[1] / "example_sites"
EXAMPLE_FILES = sorted(EXAMPLES.glob("*.json"))


def _example(name: str) -> model.Survey:
    return store.load_survey(EXAMPLES / f"{name}.json")


def _dew_point_coolprop_c(dry_bulb_c: float, rh_pct: float, pressure_pa: float) -> float:
    return HAPropsSI("D", "T", dry_bulb_c + 273.15, "P", pressure_pa, "R", rh_pct / 100) - 273.15


def _humidity_ratio_coolprop(dry_bulb_c: float, rh_pct: float, pressure_pa: float) -> float:
    return HAPropsSI("W", "T", dry_bulb_c + 273.15, "P", pressure_pa, "R", rh_pct / 100)


# --- records -----------------------------------------------------------------------------


def test_new_survey_is_valid_and_empty():
    """new_survey gives a survey that passes every check and has no rooms or visits."""
    survey = store.new_survey("CS-1 Test", address="1 Nowhere Lane", unit_system="ip")
    store.check_record(survey)
    assert survey.schema_version == model.SCHEMA_VERSION
    assert survey.rooms == [] and survey.visits == [] and survey.logs == []
    assert survey.site.unit_system == "ip"


def test_new_survey_rejects_an_empty_reference():
    """A site needs a reference: an empty one is an InputError naming the field."""
    with pytest.raises(InputError) as err:
        store.new_survey("")
    assert err.value.field == "site.reference"


@pytest.mark.parametrize(
    ("record", "field", "words"),
    [
        (model.AirReading(dry_bulb_c=71.0, rh_pct=50.0), "dry_bulb_c", "between -50 and 70 °C"),
        (model.AirReading(dry_bulb_c=20.0, rh_pct=0.0), "rh_pct", "between 0.1 and 100 %"),
        (model.AirReading(dry_bulb_c=20.0, rh_pct=0.05), "rh_pct", "between 0.1 and 100 %"),
        (model.AirReading(dry_bulb_c=20.0, rh_pct=100.5), "rh_pct", "between 0.1 and 100 %"),
        (model.AirReading(dry_bulb_c=float("nan"), rh_pct=50.0), "dry_bulb_c", "expected a number"),
        (model.AirReading(dry_bulb_c=float("inf"), rh_pct=50.0), "dry_bulb_c", "expected a number"),
        (
            model.SurfaceReading(location="x", element="glazing", surface_temp_c=-61.0),
            "surface_temp_c",
            "between -60 and 90 °C",
        ),
        (
            model.SurfaceReading(location="x", element="window", surface_temp_c=5.0),
            "element",
            "choose one of",
        ),
        (model.Room(id="a b", name="Bedroom"), "id", "not a valid id"),
        (
            model.Room(id="b1", name="Bedroom", volume_m3=-2.0),
            "volume_m3",
            "between 1 and 100000 m³",
        ),
        (
            model.MaterialReading(location="x", material="plaster", value=-1, scale="wme_pct"),
            "value",
            "between 0 and 1000",
        ),
        (
            model.Site(reference="x", pressure_pa=120_000.0),
            "pressure_pa",
            "between 50000 and 110000 Pa",
        ),
    ],
)
def test_check_record_names_field_and_allowed_range(record, field, words):
    """check_record rejects an out-of-domain value with the field and what is allowed."""
    with pytest.raises(InputError) as err:
        store.check_record(record)
    assert err.value.field == field
    assert words in err.value.allowed


def test_reading_ranges_are_the_psychro_input_domain():
    """The model's reading limits are the psychrometric core's (one home for each limit)."""
    schema = store.survey_schema()["$defs"]
    air = schema["AirReading"]["properties"]
    assert air["dry_bulb_c"]["minimum"] == psychro.DRY_BULB_MIN_C
    assert air["dry_bulb_c"]["maximum"] == psychro.DRY_BULB_MAX_C
    assert air["rh_pct"]["minimum"] == psychro.RH_MIN_PCT and air["rh_pct"]["maximum"] == 100
    surface = schema["SurfaceReading"]["properties"]["surface_temp_c"]
    assert (surface["minimum"], surface["maximum"]) == (
        psychro.SURFACE_TEMP_MIN_C,
        psychro.SURFACE_TEMP_MAX_C,
    )


def test_every_struct_forbids_unknown_fields():
    """Every object in the schema refuses unknown keys, so a misspelt field is reported."""
    defs = store.survey_schema()["$defs"]
    objects = {name: d for name, d in defs.items() if d.get("type") == "object"}
    assert {"Survey", "Site", "Room", "Visit", "RoomVisit", "AirReading"} <= set(objects)
    assert all(d.get("additionalProperties") is False for d in objects.values())


def test_volume_estimate_uses_area_times_height():
    """A room's volume is the stated one, else floor area times height, else unknown."""
    assert (
        model.Room(
            id="a", name="A", volume_m3=30.0, floor_area_m2=1, height_m=1
        ).volume_estimate_m3()
        == 30.0
    )
    assert model.Room(
        id="a", name="A", floor_area_m2=12.5, height_m=2.4
    ).volume_estimate_m3() == pytest.approx(30.0)
    assert model.Room(id="a", name="A", floor_area_m2=12.5).volume_estimate_m3() is None


def test_find_room_by_id_or_name_ignoring_case():
    """find_room matches the id exactly or the name ignoring case and spaces."""
    survey = model.Survey(
        site=model.Site(reference="x"), rooms=[model.Room(id="bed1", name="Main Bedroom")]
    )
    assert survey.find_room("bed1").id == "bed1"
    assert survey.find_room(" main bedroom ").id == "bed1"
    assert survey.find_room("loft") is None


def _survey_with(**parts) -> model.Survey:
    base = {
        "site": model.Site(reference="x"),
        "instruments": [model.Instrument(id="th", kind="thermo_hygrometer", name="TH")],
        "rooms": [model.Room(id="bed1", name="Bedroom")],
    }
    base.update(parts)
    return model.Survey(**base)


def _visit(*room_visits: model.RoomVisit) -> model.Visit:
    return model.Visit(started_at=dt.datetime(2025, 1, 1, 9), rooms=list(room_visits))


@pytest.mark.parametrize(
    ("survey", "where", "words"),
    [
        (
            _survey_with(rooms=[model.Room(id="a", name="A"), model.Room(id="a", name="B")]),
            "rooms[1].id",
            "used twice",
        ),
        (
            _survey_with(instruments=[model.Instrument(id="t", kind="other", name="T")] * 2),
            "instruments[1].id",
            "used twice",
        ),
        (
            _survey_with(visits=[_visit(model.RoomVisit(room="loft"))]),
            "visits[0].rooms[0].room",
            "no room with id 'loft'; rooms are: bed1",
        ),
        (
            _survey_with(
                visits=[_visit(model.RoomVisit(room="bed1"), model.RoomVisit(room="bed1"))]
            ),
            "visits[0].rooms[1].room",
            "appears twice",
        ),
        (
            _survey_with(
                visits=[
                    _visit(
                        model.RoomVisit(
                            room="bed1",
                            air=model.AirReading(dry_bulb_c=20, rh_pct=50, instrument="zz"),
                        )
                    )
                ]
            ),
            "visits[0].rooms[0].air.instrument",
            "no instrument with id 'zz'",
        ),
        (
            _survey_with(
                visits=[
                    _visit(
                        model.RoomVisit(
                            room="bed1", observations=model.Observations(mould_area_m2=0.5)
                        )
                    )
                ]
            ),
            "visits[0].rooms[0].observations.mould_area_m2",
            "mould_visible is false",
        ),
        (
            _survey_with(logs=[model.LogSeries(room="attic", source="a.csv", samples=[])]),
            "logs[0].room",
            "no room with id 'attic'",
        ),
    ],
)
def test_problems_finds_broken_references(survey, where, words):
    """problems() reports duplicate ids and references to rooms or instruments that do not exist."""
    found = model.problems(survey)
    assert found, "expected a problem"
    assert found[0][0] == where
    assert words in found[0][1]


def test_problems_is_empty_for_a_consistent_survey():
    """A survey whose references all resolve has no problems."""
    survey = _survey_with(
        visits=[
            _visit(
                model.RoomVisit(
                    room="bed1", air=model.AirReading(dry_bulb_c=20, rh_pct=50, instrument="th")
                )
            )
        ]
    )
    assert model.problems(survey) == []


def test_pressure_for_a_visit_prefers_the_measured_value():
    """Visit pressure beats site pressure, which beats altitude, which beats standard pressure."""
    site = model.Site(reference="x", altitude_m=1000.0)
    survey = model.Survey(site=site)
    visit = model.Visit(started_at=dt.datetime(2025, 1, 1), pressure_pa=90_500.0)
    assert model.pressure_pa_for(survey, visit) == 90_500.0
    # ASHRAE Fundamentals 2017 ch. 1 eqn 3 at 1000 m: 89 875 Pa (psychrolib's tests, ±1 Pa).
    assert model.pressure_pa_for(survey) == pytest.approx(89_875, abs=1)
    survey = model.Survey(site=model.Site(reference="x", altitude_m=1000.0, pressure_pa=91_000.0))
    assert model.pressure_pa_for(survey) == 91_000.0
    assert model.pressure_pa_for(model.Survey(site=model.Site(reference="x"))) == 101_325.0


# --- the example sites ------------------------------------------------------------------


def test_there_are_three_example_sites():
    """example_sites holds the three scenarios: winter flat, coastal cottage, drying basement."""
    assert [p.stem for p in EXAMPLE_FILES] == [
        "basement-burst-pipe-drying",
        "coastal-cottage-summer",
        "winter-flat-bedroom-mould",
    ]


@pytest.mark.parametrize("path", EXAMPLE_FILES, ids=lambda p: p.stem)
def test_example_site_loads_and_is_complete(path):
    """Each example loads and has what assessment and reports need on every visit."""
    survey = store.load_survey(path)
    assert "invented" in survey.site.notes
    assert survey.instruments and all(
        i.air_temp_accuracy_k
        or i.rh_accuracy_pct
        or i.surface_temp_accuracy_k
        or i.moisture_accuracy
        for i in survey.instruments
    )
    assert all(room.volume_estimate_m3() for room in survey.rooms)
    for visit in survey.visits:
        assert visit.outdoor is not None and visit.weather
        for room_visit in visit.rooms:
            assert room_visit.air is not None
            assert room_visit.surfaces and all(s.element for s in room_visit.surfaces)


@pytest.mark.parametrize("path", EXAMPLE_FILES, ids=lambda p: p.stem)
def test_example_site_is_saved_in_canonical_form(path):
    """Each example file is byte-for-byte what save_survey writes, so saving it changes nothing."""
    survey = store.load_survey(path)
    assert store.dumps_survey(survey) == path.read_bytes()


@pytest.mark.parametrize("path", EXAMPLE_FILES, ids=lambda p: p.stem)
def test_example_wet_surfaces_agree_with_the_dew_point(path):
    """A surface marked wet is at or below the CoolProp dew point (within accuracy) and a
    surface more than the accuracy below the dew point is marked wet."""
    survey = store.load_survey(path)
    checked = 0
    for visit in survey.visits:
        pressure = model.pressure_pa_for(survey, visit)
        for room_visit in visit.rooms:
            air = room_visit.air
            dew = _dew_point_coolprop_c(air.dry_bulb_c, air.rh_pct, pressure)
            for surface in room_visit.surfaces:
                accuracy = survey.instrument(surface.instrument).surface_temp_accuracy_k or 1.0
                margin = surface.surface_temp_c - dew
                if surface.condensation_seen:
                    assert margin <= accuracy, (surface.location, margin)
                if margin < -accuracy:
                    assert surface.condensation_seen, (surface.location, margin)
                checked += 1
    assert checked >= 10


def test_winter_flat_outdoor_air_is_colder_and_drier():
    """Winter flat: outdoors is colder and carries less moisture than the mouldy bedroom, and
    the corner behind the wardrobe is above the 80 % surface RH of BS 5250:2002 Annex D."""
    survey = _example("winter-flat-bedroom-mould")
    visit = survey.visits[0]
    pressure = model.pressure_pa_for(survey, visit)
    bedroom = visit.room_visit("bed1")
    out = visit.outdoor
    assert out.dry_bulb_c < bedroom.air.dry_bulb_c - 10
    assert _humidity_ratio_coolprop(
        out.dry_bulb_c, out.rh_pct, pressure
    ) < _humidity_ratio_coolprop(bedroom.air.dry_bulb_c, bedroom.air.rh_pct, pressure)
    corner = bedroom.surfaces[0]
    assert corner.mould_visible and corner.element == "external_wall"
    state = psychro.state_from_rh(bedroom.air.dry_bulb_c, bedroom.air.rh_pct, pressure)
    assert psychro.surface_rh_pct(state, corner.surface_temp_c) > 80.0
    glazing = [s for s in bedroom.surfaces if s.element == "glazing"]
    assert glazing and all(s.condensation_seen for s in glazing)
    assert bedroom.observations.mould_visible and bedroom.observations.mould_area_m2 > 0
    assert survey.room("bed1").occupants == 2


def test_coastal_cottage_outdoor_air_is_wetter_than_inside():
    """Coastal cottage: the outdoor air's humidity ratio (CoolProp) exceeds every room's, and
    there is a musty odour and timber above 20 % moisture content."""
    survey = _example("coastal-cottage-summer")
    visit = survey.visits[0]
    pressure = model.pressure_pa_for(survey, visit)
    w_out = _humidity_ratio_coolprop(visit.outdoor.dry_bulb_c, visit.outdoor.rh_pct, pressure)
    for room_visit in visit.rooms:
        air = room_visit.air
        assert _humidity_ratio_coolprop(air.dry_bulb_c, air.rh_pct, pressure) < w_out
    assert any(rv.observations.odour == "musty" for rv in visit.rooms)
    timber = [m for rv in visit.rooms for m in rv.materials if m.scale == "mc_pct"]
    # Decay fungi need about 20 % MC or more (Wood Handbook ch. 14, secondary source).
    assert any(m.value >= 20 for m in timber if not m.dry_standard)
    assert any(m.dry_standard for m in timber)


def test_basement_drying_readings_fall_toward_the_dry_standard():
    """Basement: category 1 water, a reference room, a dehumidifier on every visit, and each
    affected material reading falls visit by visit while staying above its dry standard."""
    survey = _example("basement-burst-pipe-drying")
    assert survey.site.purpose == "drying_check" and len(survey.visits) == 3
    days = [v.started_at.date() for v in survey.visits]
    assert [(b - a).days for a, b in itertools.pairwise(days)] == [1, 1]
    reference = [room for room in survey.rooms if room.is_reference]
    assert len(reference) == 1
    series: dict[tuple[str, str], list[float]] = {}
    for visit in survey.visits:
        family = visit.room_visit("family")
        assert family.observations.water_category == 1
        assert any(e.kind.endswith("dehumidifier") and e.running for e in family.equipment)
        for room_visit in visit.rooms:
            for m in room_visit.materials:
                if not m.dry_standard:
                    series.setdefault((room_visit.room, m.location), []).append(m.value)
    standards = {
        m.material: m.value
        for m in survey.visits[-1].room_visit(reference[0].id).materials
        if m.dry_standard
    }
    assert len(series) >= 3
    last = survey.visits[-1]
    for (room_id, location), values in series.items():
        assert len(values) == 3 and values[0] > values[1] > values[2], (location, values)
        material = next(
            m.material for m in last.room_visit(room_id).materials if m.location == location
        )
        assert values[-1] > standards[material]


def test_basement_dehumidifier_outlet_is_drier_than_its_inlet():
    """The dehumidifier's outlet air holds less moisture than the room air (CoolProp W)."""
    survey = _example("basement-burst-pipe-drying")
    for visit in survey.visits:
        family = visit.room_visit("family")
        pressure = model.pressure_pa_for(survey, visit)
        unit = next(e for e in family.equipment if e.outlet is not None)
        w_in = _humidity_ratio_coolprop(family.air.dry_bulb_c, family.air.rh_pct, pressure)
        w_out = _humidity_ratio_coolprop(unit.outlet.dry_bulb_c, unit.outlet.rh_pct, pressure)
        assert 0.0005 < w_in - w_out < 0.005
        assert unit.outlet.dry_bulb_c > family.air.dry_bulb_c  # refrigerant units warm the air


def test_schema_is_json_and_names_the_version():
    """survey_schema() is plain JSON with a title and the Survey definition at its root."""
    schema = store.survey_schema()
    text = json.dumps(schema)
    assert json.loads(text) == schema
    assert schema["$ref"] == "#/$defs/Survey"
    version = schema["$defs"]["Survey"]["properties"]["schema_version"]
    assert version["minimum"] == version["maximum"] == model.SCHEMA_VERSION


def test_log_sample_is_stored_as_a_three_item_list():
    """Logger samples are compact [time, dry_bulb_c, rh_pct] lists in the file."""
    sample = model.LogSample(at=dt.datetime(2025, 1, 1, 12), dry_bulb_c=18.5, rh_pct=61.0)
    assert msgspec.json.decode(msgspec.json.encode(sample)) == ["2025-01-01T12:00:00", 18.5, 61.0]


@pytest.mark.parametrize(
    ("name", "words"),
    [
        ("/home/avery/photos/corner.jpg", "is an absolute path"),
        ("\\\\server\\share\\corner.jpg", "is an absolute path"),
        ("C:\\Photos\\corner.jpg", "is an absolute path"),
        ("../corner.jpg", "steps out of the survey file's folder"),
        ("photos/../../corner.jpg", "steps out of the survey file's folder"),
        ("photos\\..\\..\\corner.jpg", "steps out of the survey file's folder"),
        ("..", "steps out of the survey file's folder"),
        ("corner\x07.jpg", "control characters"),
    ],
)
def test_photo_names_must_stay_inside_the_survey_folder(name, words):
    """A photo's file name is relative to the survey's folder: absolute paths, drive letters
    and '..' are refused with a message saying why."""
    with pytest.raises(InputError) as err:
        store.check_record(model.RoomVisit(room="bed1", photos=[name]))
    assert err.value.field == "photos[0]"
    assert words in err.value.allowed
    assert model.photo_name_problem(name)


@pytest.mark.parametrize(
    "name",
    ["corner.jpg", "photos/bed1 corner.jpg", "a..b.jpg", "visit 1\\IMG_0042.JPG", "~corner.jpg"],
)
def test_relative_photo_names_are_accepted(name):
    """Names inside the survey's folder or a sub-folder are fine."""
    store.check_record(model.RoomVisit(room="bed1", photos=[name]))
    assert model.photo_name_problem(name) == ""


@pytest.mark.parametrize("path", EXAMPLE_FILES, ids=lambda p: p.stem)
def test_example_people_and_places_are_plainly_invented(path):
    """Every name, address, client and inspector of an example is a plain placeholder
    ("Example", "Sample", "Demo"), never a real-looking place, firm or person."""
    site = store.load_survey(path).site
    for text in (site.reference, site.address, site.client, site.inspector):
        assert any(word in text for word in ("Example", "Sample", "Demo", "example")), text


def test_a_visit_moved_moves_every_timed_reading_and_only_those():
    """Moved back a day, every reading of a visit that carries a time moves by the same
    (outdoor air, room air, a surface, a material point, a unit's outlet and inlet), and
    the visit's start stays as it is;
    a reading with no time keeps none (it is read as taken at the start). Log samples are
    the logger's own times and belong to no visit."""
    at = dt.datetime(2025, 2, 6, 9, 30)
    air = model.AirReading(dry_bulb_c=20.0, rh_pct=50.0, taken_at=at)
    visit = model.Visit(
        started_at=at,
        outdoor=air,
        rooms=[
            model.RoomVisit(
                room="r",
                air=air,
                surfaces=[
                    model.SurfaceReading(
                        location="a", element="floor", surface_temp_c=15.0, taken_at=at
                    ),
                    model.SurfaceReading(location="b", element="floor", surface_temp_c=15.0),
                ],
                materials=[
                    model.MaterialReading(
                        location="c", material="screed", value=80, scale="relative", taken_at=at
                    )
                ],
                equipment=[
                    model.Equipment(
                        kind="refrigerant_dehumidifier", label="D1", outlet=air, inlet=air
                    )
                ],
            )
        ],
    )
    assert visit.readings_timed() == 6
    day = dt.timedelta(days=1)
    moved = visit.readings_moved(-day)
    rv = moved.rooms[0]
    assert moved.started_at == at
    times = [
        moved.outdoor.taken_at,
        rv.air.taken_at,
        rv.surfaces[0].taken_at,
        rv.materials[0].taken_at,
        rv.equipment[0].outlet.taken_at,
        rv.equipment[0].inlet.taken_at,
    ]
    assert times == [at - day] * 6
    assert rv.surfaces[1].taken_at is None
    assert visit.rooms[0].air.taken_at == at  # the visit moved is a new one
    assert visit.readings_moved(dt.timedelta(0)) == visit
