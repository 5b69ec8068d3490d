"""Advice a practitioner can be held to: contaminated water, combustion air, vented spaces
against the weather, wet rooms at their loads and code minimums, the cure that fits, a
shared thermometer, and the timber equation's range. Assertions are on typed decisions and
numbers; each check value names its source."""

from __future__ import annotations

import math

import pytest
from CoolProp.HumidAirProp import HAPropsSI

from survey import assess, quick, words
from survey import thresholds as th
from survey.advise import ActionKind, DehumidifyWhy
from survey.assess import (
    Accuracy,
    DryingEquipment,
    MaterialInput,
    Observations,
    OutdoorInput,
    RoomInput,
    SurfaceInput,
)

P = 101_325.0
FT3_PER_M3 = 1.0 / 0.3048**3  # 1 ft = 0.3048 m exactly
US_PINT_L = 0.473176  # US customary units [R]


def judge(**given) -> quick.QuickResult:
    return quick.judge(quick.QuickInput(**given))


def kinds(result) -> list[str]:
    return [a.kind.value for a in result.advice.actions]


def action(result, kind: ActionKind):
    (found,) = [a for a in result.advice.actions if a.kind is kind]
    return found


def dew_point_c(temp_c: float, rh_pct: float) -> float:
    """Dew point by CoolProp (independent reference)."""
    return HAPropsSI("D", "T", temp_c + 273.15, "P", P, "R", rh_pct / 100.0) - 273.15


def basement(**more):
    base = {
        "air_temp_c": 20.0,
        "rh_pct": 80.0,
        "surfaces": (assess.SurfaceInput("wall", 17.0),),
        "outdoor": assess.OutdoorInput(15.0, 70.0),
        "use": "basement",
        "volume_m3": 40.0,
    }
    base.update(more)
    return judge(**base)


# --- 1. contaminated water -----------------------------------------------------------------


def test_category_3_removes_porous_materials_first():
    """Category 3 water (restoration standard of practice [R, secondary]): removal of porous
    materials leads, before any drying, and the dehumidifier is for what remains."""
    result = basement(water_category=3, drying=True)
    assert kinds(result)[0] == "remove_contaminated_materials"
    removal = result.advice.actions[0].numbers
    assert removal.effective_category == 3 and removal.degraded is False
    dehumidify = action(result, ActionKind.DEHUMIDIFY)
    assert dehumidify.numbers.after_removal is True
    assert "water_category_3" in [c.key for c in result.cautions]


def test_category_2_left_standing_is_treated_as_category_3():
    """Category 2 water standing 72 h, past the 48 h (restoration standard, time from
    memory), is acted on as category 3; at 24 h it is not."""
    assert th.value("water_category_2_degrades_h") == 48.0
    late = basement(water_category=2, water_standing_h=72.0)
    assert kinds(late)[0] == "remove_contaminated_materials"
    assert late.advice.actions[0].numbers.degraded is True
    early = basement(water_category=2, water_standing_h=24.0)
    assert "remove_contaminated_materials" not in kinds(early)
    assert "water_category_2" in [c.key for c in early.cautions]


def test_category_1_left_two_days_becomes_category_2_not_3():
    """Clean water standing 50 h (over the 48 h [M]) gets the category 2 caution, no
    removal."""
    result = basement(water_category=1, water_standing_h=50.0)
    keys = [c.key for c in result.cautions]
    assert "water_category_2" in keys and "water_category_1" not in keys
    assert "remove_contaminated_materials" not in kinds(result)


def test_air_movers_are_stopped_and_porous_readings_named():
    """No air movement over unremoved contaminated material: running air movers are to be
    stopped; plasterboard and carpet readings are listed as porous, timber is not."""
    room = RoomInput(
        "Cellar",
        "basement",
        20.0,
        80.0,
        volume_m3=40.0,
        materials=(
            MaterialInput("wall low", "gypsum plasterboard", 40.0, "wme_pct", 20.0),
            MaterialInput("floor", "carpet and underlay", 30.0, "wme_pct", 15.0),
            MaterialInput("skirting", "pine skirting", 25.0, "mc_pct", 12.0, True),
        ),
        observations=Observations(
            water_category=3,
            drying_in_progress=True,
            drying=DryingEquipment(dehumidifiers=1, air_movers=3),
        ),
    )
    finding = assess.assess_room(room, OutdoorInput(15.0, 70.0), P)
    from survey import advise

    advice = advise.advise_room(finding)
    removal = advice.actions[0]
    assert removal.kind is ActionKind.REMOVE_CONTAMINATED_MATERIALS
    assert removal.numbers.stop_air_movers is True
    assert removal.numbers.porous_materials == ("wall low", "floor")


@pytest.mark.parametrize(
    ("wet_pct", "dense", "expected"),
    [(3.0, False, 1), (20.0, False, 2), (55.0, False, 3), (3.0, True, 4)],
)
def test_class_of_water_loss_from_area_and_materials(wet_pct, dense, expected):
    """Classes of water loss (restoration standard of practice, from memory): under 5 % of
    the room's surfaces wet class 1, 5-40 % class 2, over 40 % class 3, bound water in
    dense materials class 4."""
    result = basement(drying=True, wet_area_pct=wet_pct, dense_materials_wet=dense)
    assert action(result, ActionKind.DEHUMIDIFY).numbers.water_loss_class == expected


def test_drying_load_includes_the_wet_materials():
    """A 40 m³ room drying a class 2 loss: 40 m³ = 1412.6 ft³; the drying chart's 50 ft³
    per pint/day (from memory) gives 28.25 pints/day × 0.473176 L = 13.37 L/day from the
    materials (hand arithmetic); the removal is the larger of that and the air's own load
    (the measured excess already is the water leaving the materials), never 0."""
    result = basement(drying=True, wet_area_pct=20.0)
    n = action(result, ActionKind.DEHUMIDIFY).numbers
    assert n.materials_load_l_per_day == pytest.approx(
        40.0 * FT3_PER_M3 / 50.0 * US_PINT_L, rel=1e-6
    )
    assert n.materials_load_l_per_day == pytest.approx(13.37, abs=0.01)
    assert n.removal_l_per_day >= n.materials_load_l_per_day > 0.0


# --- 2. combustion air ----------------------------------------------------------------------


def test_closing_up_carries_the_combustion_air_caution():
    """Outdoor air wetter than the room (humid summer, CoolProp W): dehumidify with windows
    closed, and the combustion-air caution unless no flued appliance is said."""
    assert HAPropsSI("W", "T", 301.15, "P", P, "R", 0.75) > HAPropsSI(
        "W", "T", 295.15, "P", P, "R", 0.75
    )
    given = {
        "air_temp_c": 22.0,
        "rh_pct": 75.0,
        "outdoor": assess.OutdoorInput(28.0, 75.0),
        "use": "basement",
        "volume_m3": 60.0,
        "occupants": 0,
    }
    result = judge(**given)
    assert action(result, ActionKind.DEHUMIDIFY).numbers.why is DehumidifyWhy.OUTDOOR_WETTER
    (caution,) = [c for c in result.cautions if c.key == "combustion_air"]
    assert caution.flued is None
    said_yes = judge(**given, flued_appliance=True)
    assert [c.flued for c in said_yes.cautions if c.key == "combustion_air"] == [True]
    said_no = judge(**given, flued_appliance=False)
    assert "combustion_air" not in [c.key for c in said_no.cautions]


def test_extract_ventilation_carries_the_combustion_air_caution():
    """A ventilate action (extract fan) carries the caution too; a dry room needs none."""
    result = judge(
        air_temp_c=18.0,
        rh_pct=72.0,
        outdoor=assess.OutdoorInput(3.0, 88.0),
        use="bedroom",
        volume_m3=30.0,
        occupants=2,
    )
    assert "ventilate" in kinds(result)
    assert "combustion_air" in [c.key for c in result.cautions]
    dry = judge(air_temp_c=20.0, rh_pct=45.0, outdoor=assess.OutdoorInput(5.0, 80.0))
    assert kinds(dry) == [] and "combustion_air" not in [c.key for c in dry.cautions]


def test_caution_keys_are_listed_beside_the_cautions(check):
    """--json lists caution_keys in the order of cautions, one for one."""
    import json

    _, out, _ = check(
        "--air-temp",
        "22",
        "--rh",
        "75",
        "--outdoor-temp",
        "28",
        "--outdoor-rh",
        "75",
        "--use",
        "basement",
        "--room-volume",
        "60",
        "--json",
    )
    data = json.loads(out)
    assert len(data["caution_keys"]) == len(data["cautions"])
    assert data["caution_keys"][-1] == "closing" and "combustion_air" in data["caution_keys"]


# --- 3. vented spaces and windows against the weather ---------------------------------------


def test_crawl_space_vents_stay_closed_when_outdoor_air_is_wetter():
    """Crawl space at 18 °C / 85 % under 27 °C / 70 % outdoor air: outdoor W 15.6 g/kg >
    space W 10.9 g/kg (CoolProp), and its dew point 21.0 °C is above the 17 °C joist: keep
    the vents closed (seal and condition or dehumidify), not "open the vents"."""
    w_out = HAPropsSI("W", "T", 300.15, "P", P, "R", 0.70)
    w_in = HAPropsSI("W", "T", 291.15, "P", P, "R", 0.85)
    assert w_out > w_in and dew_point_c(27.0, 70.0) > 17.0
    result = judge(
        air_temp_c=18.0,
        rh_pct=85.0,
        surfaces=(assess.SurfaceInput("joist", 17.0),),
        outdoor=assess.OutdoorInput(27.0, 70.0),
        use="crawlspace",
    )
    n = action(result, ActionKind.DRY_VENTILATED_SPACE).numbers
    assert n.outdoor_wetter_than_space is True
    assert n.outdoor_dew_point_above_coldest_surface is True
    assert n.keep_vents_closed is True
    assert n.outdoor_dew_point_c == pytest.approx(dew_point_c(27.0, 70.0), abs=0.05)


def test_crawl_space_in_dry_weather_keeps_its_vents():
    """Dry cold outdoor air (5 °C / 80 %, dew point 1.9 °C by CoolProp, below the 8 °C
    joist): the vents may stay open."""
    assert dew_point_c(5.0, 80.0) < 8.0
    result = judge(
        air_temp_c=9.0,
        rh_pct=90.0,
        surfaces=(assess.SurfaceInput("joist", 8.0),),
        outdoor=assess.OutdoorInput(5.0, 80.0),
        use="crawlspace",
    )
    assert action(result, ActionKind.DRY_VENTILATED_SPACE).numbers.keep_vents_closed is False


def test_windows_stay_shut_when_outdoor_dew_point_is_above_the_coldest_wall():
    """Room 24 °C / 80 % with a 14 °C wall, outdoor 22 °C / 75 % (W 12.4 < 15.1 g/kg, but
    dew point 17.4 °C > 14 °C, CoolProp): airing cannot bring the dew point under the wall,
    so dehumidify with windows closed, and no ventilate action."""
    assert (
        HAPropsSI("W", "T", 295.15, "P", P, "R", 0.75)
        < HAPropsSI("W", "T", 297.15, "P", P, "R", 0.80) - 0.001
    )
    assert dew_point_c(22.0, 75.0) > 14.0
    result = judge(
        air_temp_c=24.0,
        rh_pct=80.0,
        surfaces=(assess.SurfaceInput("wall", 14.0),),
        outdoor=assess.OutdoorInput(22.0, 75.0),
        use="living",
        volume_m3=40.0,
        occupants=2,
    )
    assert "ventilate" not in kinds(result)
    assert (
        action(result, ActionKind.DEHUMIDIFY).numbers.why
        is DehumidifyWhy.OUTDOOR_DEW_POINT_ABOVE_SURFACE
    )


# --- 4. wet rooms at their loads, code minimum extract --------------------------------------


def bathroom(**more):
    base = {
        "air_temp_c": 21.0,
        "rh_pct": 75.0,
        "surfaces": (assess.SurfaceInput("wall", 17.0),),
        "outdoor": assess.OutdoorInput(5.0, 80.0),
        "use": "bathroom",
        "volume_m3": 12.0,
        "occupants": 0,
    }
    base.update(more)
    return judge(**base)


def test_bathroom_without_use_gets_typical_showers_said_as_assumption():
    """No showers entered: 2 a day (our choice) × 2500 g/h (shower rate, BS 5250 via a
    building-science text) × 10 min (our choice) over 24 h = 34.72 g/h (hand arithmetic)."""
    moisture = bathroom(occupants=None).advice.moisture
    assert moisture.typical_use_assumed == "shower"
    assert moisture.activities_g_per_h == pytest.approx(2 * 2500 * 10 / 60 / 24, rel=1e-9)


def test_an_unoccupied_bathroom_gets_no_typical_showers():
    """A bathroom said to have no occupants (a closed-up let) is not given showers."""
    moisture = bathroom(occupants=0).advice.moisture
    assert moisture.typical_use_assumed is None


def test_zero_showers_entered_is_not_the_typical_use():
    """Showers entered as 0 a day are 0, not "none entered"."""
    moisture = bathroom(occupants=None, showers_per_day=0.0).advice.moisture
    assert moisture.typical_use_assumed is None and moisture.activities_g_per_h == 0.0


def test_showers_entered_are_used():
    """Three showers a day: 3 × 2500 × 10/60 / 24 = 52.08 g/h, no assumption."""
    moisture = bathroom(showers_per_day=3.0).advice.moisture
    assert moisture.typical_use_assumed is None
    assert moisture.activities_g_per_h == pytest.approx(52.083, abs=0.001)


def test_bathroom_extract_never_below_the_code_minimum():
    """The sized flow is held to at least the usual continuous minimum: the higher of 8 L/s
    = 28.8 m³/h (Approved Document F, from memory) and 20 cfm = 33.98 m³/h (ASHRAE 62.2,
    from memory; 1 cfm = 1.699 m³/h)."""
    vent = action(bathroom(), ActionKind.VENTILATE).numbers
    minimum = max(8.0 * 3.6, 20.0 * 0.3048**3 * 60.0)
    assert minimum == pytest.approx(33.98, abs=0.01)
    assert vent.code_minimum_m3_per_h == pytest.approx(minimum, rel=1e-9)
    assert vent.airflow_m3_per_h >= minimum - 1e-9
    assert vent.sized_airflow_m3_per_h < minimum


def test_kitchen_minimum_is_five_air_changes_when_larger():
    """A 40 m³ kitchen: 5 kitchen air changes an hour = 200 m³/h (ASHRAE 62.2 continuous,
    from memory) is above 13 L/s = 46.8 m³/h (Approved Document F)."""
    result = judge(
        air_temp_c=21.0,
        rh_pct=75.0,
        outdoor=assess.OutdoorInput(5.0, 80.0),
        use="kitchen",
        volume_m3=40.0,
        occupants=1,
    )
    vent = action(result, ActionKind.VENTILATE).numbers
    assert vent.code_minimum_m3_per_h == pytest.approx(200.0)
    assert vent.airflow_m3_per_h >= 200.0


# --- 5. the cure that fits ------------------------------------------------------------------


def test_no_dehumidifier_for_a_room_already_below_the_practical_floor():
    """A room at 38 % RH, under the 40 % practical floor (common practice), gets no
    dehumidifier even with a cold wall; the wall is to be warmed."""
    result = judge(
        air_temp_c=20.0,
        rh_pct=38.0,
        surfaces=(assess.SurfaceInput("wall", 4.0),),
        outdoor=assess.OutdoorInput(0.0, 80.0),
        use="bedroom",
        volume_m3=30.0,
        occupants=2,
    )
    assert "dehumidify" not in kinds(result)
    assert "raise_surface_temperature" in kinds(result)


def test_wet_surface_below_the_dew_point_in_a_drying_room_still_gets_its_action():
    """Drying room at 20 °C / 70 % (dew point 14.4 °C, CoolProp) with a wet wall at 12 °C:
    the temperature factor is not judged while it dries, but the wall gets its action."""
    assert dew_point_c(20.0, 70.0) > 12.0
    room = RoomInput(
        "Hall",
        "hallway",
        20.0,
        70.0,
        (SurfaceInput("wet wall", 12.0),),
        volume_m3=30.0,
        materials=(MaterialInput("wall", "plaster", 40.0, "wme_pct", 15.0),),
        observations=Observations(drying_in_progress=True, drying=DryingEquipment(dehumidifiers=1)),
    )
    from survey import advise

    finding = assess.assess_room(room, OutdoorInput(5.0, 80.0), P)
    raised = [
        a
        for a in advise.advise_room(finding).actions
        if a.kind is ActionKind.RAISE_SURFACE_TEMPERATURE
    ]
    assert len(raised) == 1 and raised[0].numbers.drying_wet is True


def test_minimums_shown_are_rounded_up():
    """A least airflow or capacity is shown rounded up (the safe side): 33.01 m³/h reads 34,
    2.01 L/day reads 2.1."""
    assert words.SI.at_least("airflow", 33.01) == "34 m³/h"
    assert words.SI.at_least("water_rate", 2.01) == "2.1 L/day"
    assert words.SI.at_least("airflow", 33.0) == "33 m³/h"


# --- 6. one thermometer indoors and out ----------------------------------------------------


def test_shared_thermometer_factor_uncertainty_is_the_correlated_one():
    """21 °C in, 1 °C out, surface 15 °C, ±0.5 K air and ±1 K surface: with one thermometer
    (r = 1, GUM 5.2) U = 2 √((1/√3)² + (0.5/√3)²) / 20 = 0.0645; with two, the quadrature
    U = 2 √((1/√3)² + (0.7·0.5/√3)² + (0.3·0.5/√3)²)/20 = 0.0612 (hand arithmetic)."""

    def factor_u(shared):
        acc = Accuracy(0.5, 3.0, 1.0, shared_thermometer=shared)
        room = RoomInput("R", "bedroom", 21.0, 50.0, (SurfaceInput("w", 15.0),))
        return (
            assess.assess_room(room, OutdoorInput(1.0, 80.0), P, acc)
            .surfaces[0]
            .temperature_factor_uncertainty
        )

    u_s, u_a = 1.0 / math.sqrt(3), 0.5 / math.sqrt(3)
    assert factor_u(True) == pytest.approx(2 * math.hypot(u_s, u_a) / 20, rel=1e-9)
    f = 0.7
    assert factor_u(False) == pytest.approx(
        2 * math.sqrt(u_s**2 + (f * u_a) ** 2 + ((1 - f) * u_a) ** 2) / 20, rel=1e-9
    )
    assert factor_u(True) == pytest.approx(0.0645, abs=0.0001)


def test_check_says_which_thermometer_was_assumed(check, monkeypatch):
    """The table says whether the outdoor reading was taken as the room thermometer's."""
    monkeypatch.setenv("COLUMNS", "300")
    args = [
        "--air-temp",
        "21",
        "--rh",
        "50",
        "--surface-temp",
        "15",
        "--outdoor-temp",
        "1",
        "--outdoor-rh",
        "80",
    ]
    _, out, _ = check(*args)
    assert "one thermometer read the room and the outdoor air" in " ".join(out.split())
    _, out, _ = check(*args, "--outdoor-thermometer", "separate")
    assert "separate thermometers" in " ".join(out.split())


# --- 7. region-neutral facts and the timber equation's range -------------------------------


@pytest.mark.parametrize(("temp_c", "rh_pct"), [(-5.0, 80.0), (20.0, 99.0)])
def test_timber_equation_outside_its_range_gives_no_number(temp_c, rh_pct):
    """Wood Handbook eqn 4-5 is used only at 0-100 °C and up to 98 % RH (fitted range, from
    memory): outside it no EMC is given, and the words say why."""
    result = judge(air_temp_c=temp_c, rh_pct=rh_pct)
    assert result.finding.timber_emc_pct is None
    assert "not estimated" in words.timber_emc_text(result.finding, words.SI)


def test_lead_paint_year_is_given_as_a_range_of_countries():
    """The lead-paint caution names the US year and says other countries differ."""
    from survey.advise import Caution

    text = words.caution_text(Caution("asbestos_lead", risks=("lead_paint",)), words.SI)
    assert "1978 in the US" in text and "differs by country" in text


def test_factor_under_at_the_reading_on_a_mouldy_surface_gets_its_action():
    """17.5 °C / 72 % with a 12.6 °C corner, outdoor 2 °C: fRsi = (12.6 − 2)/(17.5 − 2) = 0.68
    (hand arithmetic), under the 0.75 limit (BRE IP1/06, from memory) but within its ±0.08
    band, on a surface whose band reaches 80 % surface RH: the warmer-surface action is given,
    marked to be confirmed."""
    result = judge(
        air_temp_c=17.5,
        rh_pct=72.0,
        surfaces=(assess.SurfaceInput("corner", 12.6, "external_wall"),),
        outdoor=assess.OutdoorInput(2.0, 85.0),
        use="bedroom",
        volume_m3=30.0,
        occupants=2,
    )
    raised = action(result, ActionKind.RAISE_SURFACE_TEMPERATURE).numbers
    assert raised.temperature_factor == pytest.approx((12.6 - 2.0) / (17.5 - 2.0))
    assert raised.factor_unclear is True and raised.factor_under is True


# --- a wet room in weather that ventilation cannot use --------------------------------------


def _humid_day(use: str, **more) -> quick.QuickResult:
    """A room at 20 °C, 75 % (10.96 g/kg by psychrolib) on a muggy day, 18 °C and 95 %
    outdoors (12.27 g/kg): outdoor air is wetter, so general ventilation would add water."""
    return judge(
        air_temp_c=20.0,
        rh_pct=75.0,
        surfaces=(assess.SurfaceInput("wall", 14.0),),
        outdoor=assess.OutdoorInput(18.0, 95.0),
        use=use,
        volume_m3=12.0,
        **more,
    )


def test_a_wet_room_still_extracts_at_the_source_when_outdoor_air_is_wetter():
    """A bathroom dehumidifies with the windows shut, and still runs its extract while it is
    in use: the higher of 15 L/s = 54 m³/h (Approved Document F, from memory) and 50 cfm =
    84.95 m³/h (ASHRAE 62.2, from memory; 1 cfm = 1.699 m³/h) while in use, or continuous
    at the higher of 8 L/s = 28.8 m³/h and 20 cfm = 33.98 m³/h."""
    result = _humid_day("bathroom")
    assert kinds(result) == ["dehumidify", "extract_at_source"]
    assert action(result, ActionKind.DEHUMIDIFY).numbers.why is DehumidifyWhy.OUTDOOR_WETTER
    n = action(result, ActionKind.EXTRACT_AT_SOURCE).numbers
    assert n.intermittent_m3_per_h == pytest.approx(50.0 * 0.3048**3 * 60.0, rel=1e-9)
    assert n.intermittent_m3_per_h == pytest.approx(84.95, abs=0.01)
    assert n.intermittent_ft3_per_min == pytest.approx(50.0, rel=1e-9)
    assert n.code_minimum_m3_per_h == pytest.approx(33.98, abs=0.01)
    assert n.outdoor_humidity_ratio_g_per_kg > n.room_humidity_ratio_g_per_kg
    assert "combustion_air" in [c.key for c in result.cautions]  # a fan pulls air out
    text = words.action_reason(
        action(result, ActionKind.EXTRACT_AT_SOURCE), result.finding, result.advice, words.SI
    )
    assert "at least 85 m³/h during showers and baths" in text
    assert "local code sets its own" in text


def test_a_kitchen_extracts_at_the_source_and_a_bedroom_does_not():
    """The kitchen's figure while cooking: the higher of 30 L/s = 108 m³/h (Approved
    Document F, from memory) and 100 cfm = 169.9 m³/h (ASHRAE 62.2, from memory); a bedroom
    has no extract minimum, so it only dehumidifies."""
    kitchen = action(_humid_day("kitchen"), ActionKind.EXTRACT_AT_SOURCE).numbers
    assert kitchen.intermittent_m3_per_h == pytest.approx(100.0 * 0.3048**3 * 60.0, rel=1e-9)
    assert kinds(_humid_day("bedroom", occupants=2)) == ["dehumidify"]


def test_a_wet_room_with_no_outdoor_reading_extracts_too():
    """Without the outdoor air the dehumidifier leads and the extract follows."""
    result = judge(
        air_temp_c=20.0,
        rh_pct=75.0,
        surfaces=(assess.SurfaceInput("wall", 14.0),),
        use="bathroom",
        volume_m3=12.0,
    )
    assert kinds(result) == ["dehumidify", "extract_at_source"]
    n = action(result, ActionKind.EXTRACT_AT_SOURCE).numbers
    assert n.outdoor_humidity_ratio_g_per_kg is None
