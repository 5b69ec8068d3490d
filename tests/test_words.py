"""The words: the display, ventilation and dehumidification, moisture loads and targets as
sentences, in SI or IP (surfaces in ``test_words_surfaces.py``; sources, drying and cautions
in ``test_words_cautions.py``; material readings in ``test_words_materials.py``).

The decisions and numbers behind these sentences are tested in ``test_advise.py``; here the
sentences are checked to say those decisions, in the right units, with the numbers shown as
the display writes them.
"""

from __future__ import annotations

import re

import pytest
from advice_cases import (
    BTU_H_PER_W,
    FT,
    G_PER_LB,
    GRAINS_PER_LB,
    US_PINT_L,
    P,
    action,
    advice_for,
    coolprop,
    every_reason,
    reason_of,
    summer_basement,
    up,
    winter_bedroom,
)
from CoolProp.HumidAirProp import HAPropsSI

from survey import units, words
from survey.advise import ActionKind, DehumidifyWhy
from survey.assess import (
    OutdoorInput,
    RoomInput,
    SurfaceInput,
)
from survey.words.display import SI_TEXT

# --- the display ------------------------------------------------------------------------------

_VALUES = {
    "temperature": 11.04,
    "temperature_difference": -1.88,
    "humidity_ratio": 0.0041217,
    "pressure": 101_325.0,
    "vapour_pressure": 819.2,
    "absolute_humidity": 8.625,
    "enthalpy": 45_123.0,
    "specific_volume": 0.84321,
    "density": 1.20412,
    "length": 123.4,
    "airflow": 32.2,
    "water_rate": 7.04,
    "volume": 30.0,
}


@pytest.mark.parametrize("quantity", sorted(set(SI_TEXT) - {"area"}))
def test_si_text_is_units_format_value(quantity):
    """SI text from the display equals units.format_value for each quantity.

    SI text from the words' display is the same as units.format_value in SI for every
    quantity (area, which units does not format, is the display's own), with its default
    decimals, with decimals given, and without the unit."""
    value = _VALUES[quantity]
    assert words.SI(quantity, value) == units.format_value(quantity, value, "si")
    assert words.SI(quantity, value, 0) == units.format_value(quantity, value, "si", 0)
    assert words.SI(quantity, value, unit=False) == units.format_value(
        quantity, value, "si", unit=False
    )


def test_si_text_has_no_negative_zero():
    """A value that rounds to zero is written 0.0, never -0.0, as units.format_value does."""
    assert (
        words.SI("temperature", -0.04) == units.format_value("temperature", -0.04, "si") == "0.0 °C"
    )


def test_display_refuses_an_unknown_unit_system():
    """Only 'si' and 'ip' are display systems; anything else is refused, not guessed."""
    with pytest.raises(ValueError, match="'metric'"):
        words.Display("metric")


def test_area_is_in_square_feet_in_ip():
    """Mould areas are in m² in SI and in sq ft in IP.

    Mould areas: m² in SI, sq ft in IP (US practice): 0.93 m² = 10.0 sq ft and 9.3 m² =
    100.1 sq ft, since 1 ft = 0.3048 m exactly (hand arithmetic)."""
    assert pytest.approx(10.01, abs=0.005) == 0.93 / FT**2
    assert words.SI.area(0.93) == "0.93 m²"
    assert words.IP.area(0.93) == "10 sq ft"
    assert words.IP.area(9.3) == "100 sq ft"


@pytest.mark.parametrize(
    ("value", "ip", "shown"),
    [(14.25, False, 14.3), (14.21, False, 14.3), (14.3, False, 14.3), (-0.04, False, 0.0)],
)
def test_minimum_temperatures_round_up(value, ip, shown):
    """A shown minimum is never below the true one (worked by hand)."""
    assert words.round_up_temperature_c(value, ip) == pytest.approx(shown)


def test_minimum_temperature_rounds_up_in_fahrenheit():
    """14.25 °C = 57.65 °F exactly (× 9/5 + 32): shown as 57.7 °F."""
    c = words.round_up_temperature_c(14.25, ip=True)
    assert c * 9 / 5 + 32 == pytest.approx(57.7)
    assert words.IP.minimum_temperature(14.25) == "57.7 °F"


# --- ventilation and dehumidification ---------------------------------------------------------


def test_ventilate_text_gives_the_airflow_in_m3_per_h_and_air_changes():
    """The SI ventilate text gives the airflow in m³/h and air changes an hour.

    The SI ventilate text gives the airflow in m³/h, rounded up (the safe side), and the air changes
    an hour of the 30 m³ room, as the action's numbers say."""
    finding, advice = advice_for(winter_bedroom(), OutdoorInput(3.0, 88.0))
    vent = action(advice, ActionKind.VENTILATE)
    text = words.action_reason(vent, finding, advice, words.SI)
    n = vent.numbers
    assert (
        f"About {up(n.airflow_m3_per_h):.0f} m³/h of outdoor air "
        f"({n.air_changes_per_h:.1f} air changes an hour in this 30.0 m³ room)"
    ) in text


def test_ip_ventilate_text_gives_the_airflow_in_cfm():
    """The IP ventilate text gives the airflow in cfm.

    IP text gives the airflow in ft³/min, rounded up: m³/h / 60 / 0.3048³ (1 ft =
    0.3048 m)."""
    finding, advice = advice_for(winter_bedroom(), OutdoorInput(3.0, 88.0))
    vent = action(advice, ActionKind.VENTILATE)
    text = words.action_reason(vent, finding, advice, words.IP)
    cfm = vent.numbers.airflow_m3_per_h / 60.0 / FT**3
    assert f"About {up(cfm):.0f} cfm of outdoor air" in text
    assert "m³/h" not in text


def test_ip_text_gives_moisture_in_grains_and_heat_in_btu():
    """IP text gives moisture in gr/h and lb/h and heat in Btu/h.

    IP text: moisture rates in gr/h and lb/h (7000 gr = 1 lb = 453.59237 g), heating in
    Btu/h (1 W = 3.412142 Btu/h, from the IT Btu), never g/h or W."""
    finding, advice = advice_for(winter_bedroom(), OutdoorInput(3.0, 88.0))
    vent = action(advice, ActionKind.VENTILATE).numbers
    text = every_reason(finding, advice, words.IP)
    g = vent.moisture_generation_g_per_h
    assert (
        f"carries away {g * GRAINS_PER_LB / G_PER_LB:.0f} gr/h ({g / G_PER_LB:.2f} lb/h) "
        f"of moisture"
    ) in text
    assert f"takes about {vent.heat_to_warm_air_w * BTU_H_PER_W:.0f} Btu/h of heating" in text
    assert not re.search(r"\d g/h", text) and not re.search(r"\d W\b", text)


def test_dehumidifier_size_shows_us_pints_beside_litres():
    """The dehumidifier size is shown once, in L/day with US pints beside it.

    The daily total and the least removal are one figure, written once: the text's L/day
    is removal_l_per_day rounded up at its shown decimal, with US pints = L / 0.473176 [R]
    beside it, rounded up too."""
    finding, advice = advice_for(summer_basement(), OutdoorInput(28.0, 75.0))
    dehum = action(advice, ActionKind.DEHUMIDIFY)
    text = words.action_reason(dehum, finding, advice, words.SI)
    shown = re.findall(r"([0-9.]+) L/day \(([0-9.]+) US pints/day\)", text)
    assert len(shown) == 1
    litres, pints = map(float, shown[0])
    assert litres == up(dehum.numbers.removal_l_per_day, 1)
    assert pints == up(dehum.numbers.removal_l_per_day / US_PINT_L, 1)
    assert (
        f"{litres:.1f} L/day ({pints:.1f} US pints/day) in all, the least a dehumidifier "
        f"should remove"
    ) in text


def test_ip_dehumidifier_size_is_in_pints_first():
    """The IP dehumidifier size is in pints a day, litres beside it.

    IP text gives the least daily removal in US pints a day, litres beside it, both
    rounded up (1 US pint = 0.473176 L [R])."""
    finding, advice = advice_for(summer_basement(), OutdoorInput(28.0, 75.0))
    dehum = action(advice, ActionKind.DEHUMIDIFY)
    text = words.action_reason(dehum, finding, advice, words.IP)
    litres = dehum.numbers.removal_l_per_day
    assert f"{up(litres / US_PINT_L, 1):.1f} pt/day ({up(litres, 1):.1f} L/day) in all" in text


def test_rating_points_are_named_in_si():
    """SI text names the two dehumidifier rating points.

    SI text names both rating points at 60 % RH: 26.7 °C (AHAM DH-1) and 18.3 °C (the
    current US test), 80 °F and 65 °F by (F − 32) × 5/9 [R, secondary]."""
    text = reason_of(summer_basement(), OutdoorInput(28.0, 75.0), ActionKind.DEHUMIDIFY)
    assert (
        "Label capacities are measured at a rating point: 26.7 °C and 60 % RH for older "
        "ratings (AHAM DH-1), 18.3 °C and 60 % RH for the current US test."
    ) in text


def test_ip_text_names_the_rating_points_in_whole_fahrenheit():
    """IP text names the rating points in whole °F: 80 °F and 65 °F.

    The rating points are 80 °F (AHAM DH-1) and 65 °F (current US test) [R, secondary]:
    IP text shows them so, not 80.1 / 64.9 from the rounded Celsius values."""
    text = reason_of(summer_basement(), OutdoorInput(28.0, 75.0), ActionKind.DEHUMIDIFY, words.IP)
    assert (
        "Label capacities are measured at a rating point: 80 °F and 60 % RH for older "
        "ratings (AHAM DH-1), 65 °F and 60 % RH for the current US test."
    ) in text
    assert "80.1" not in text and "64.9" not in text


@pytest.mark.parametrize(
    ("room", "outdoor", "desiccant"),
    [
        (
            RoomInput("Cellar", "basement", 8.0, 90.0, volume_m3=40.0, occupants=0),
            OutdoorInput(9.0, 95.0),
            True,
        ),
        (summer_basement(), OutdoorInput(28.0, 75.0), False),
    ],
)
def test_desiccant_sentence_only_for_a_cool_room(room, outdoor, desiccant):
    """Only a cool room's dehumidify text advises a desiccant unit.

    Below 10 °C (common practice, no source) the text ends by advising a desiccant unit;
    a warmer room's text does not mention one."""
    text = reason_of(room, outdoor, ActionKind.DEHUMIDIFY)
    assert (
        text.endswith(
            "Below 10.0 °C a refrigerant unit loses most of its capacity and can "
            "ice up: use a desiccant dehumidifier."
        )
        is desiccant
    )
    assert ("desiccant" in text) is desiccant


def test_outdoor_air_not_measured_is_said():
    """The dehumidify text says when the outdoor air was not measured.

    Without an outdoor reading the dehumidify text says so, and that airing helps if
    outdoor air holds less water than the room air now."""
    finding, advice = advice_for(winter_bedroom(), None)
    text = words.action_reason(action(advice, ActionKind.DEHUMIDIFY), finding, advice, words.SI)
    w = finding.air.humidity_ratio_g_per_kg
    assert (
        f"The outdoor air was not measured: if it holds less water than the {w:.2f} g/kg "
        f"of the room air now, airing the room helps too."
    ) in text


_WINDOWS_CLOSED = "Keep windows and doors to outside closed while dehumidifying."


def coolprop_rh_for_w(temp_c: float, w: float) -> float:
    """Outdoor RH (%) that gives humidity ratio ``w`` at ``temp_c`` (CoolProp)."""
    return 100.0 * HAPropsSI("R", "T", temp_c + 273.15, "P", P, "W", w)


@pytest.mark.parametrize(
    ("outdoor_c", "offset_g_per_kg"), [(18.0, -1.15), (18.0, -0.85), (22.0, +0.5)]
)
def test_windows_are_said_to_stay_closed_only_when_outdoor_air_is_wetter(
    outdoor_c, offset_g_per_kg
):
    """The text keeps windows closed only when outdoor air is wetter.

    With no wall measured, the sentence keeping windows closed appears exactly when the
    dehumidifier was chosen because outdoor air is wetter than the room air (W from CoolProp,
    1 g/kg margin, common practice); no other sentence says 'closed'."""
    room = RoomInput("Living", "living", 20.0, 75.0, volume_m3=40.0, occupants=2)
    w_o = coolprop("W", 20.0, 75.0) + offset_g_per_kg / 1000.0
    finding, advice = advice_for(room, OutdoorInput(outdoor_c, coolprop_rh_for_w(outdoor_c, w_o)))
    wetter = action(advice, ActionKind.DEHUMIDIFY).numbers.why is DehumidifyWhy.OUTDOOR_WETTER
    text = every_reason(finding, advice)
    assert (_WINDOWS_CLOSED in text) is wetter
    assert len(re.findall(r"\bclosed\b", text)) == (1 if wetter else 0)


def test_outdoor_dew_point_above_the_wall_is_said_to_keep_windows_closed():
    """Outdoor air with its dew point above the coldest wall is said to keep windows closed.

    Room 15 °C / 75 %, outdoor 15 °C / 60 % (dew point 7.3 °C, CoolProp), wall 5 °C: the
    text names both temperatures and keeps windows closed while dehumidifying."""
    room = RoomInput(
        "R", "bedroom", 15.0, 75.0, (SurfaceInput("wall", 5.0),), volume_m3=30.0, occupants=1
    )
    finding, advice = advice_for(room, OutdoorInput(15.0, 60.0))
    text = words.action_reason(action(advice, ActionKind.DEHUMIDIFY), finding, advice, words.SI)
    dew = coolprop("D", 15.0, 60.0) - 273.15
    assert (
        f"Outdoor air is drier than the room air, but its dew point ({dew:.1f} °C) is "
        f"above the coldest wall, ceiling or floor (wall, 5.0 °C)"
    ) in text
    assert "Keep windows and doors to outside closed and dehumidify the room below it." in text


def test_partial_ventilation_names_a_dehumidifier_only_when_one_is_advised():
    """Partial ventilation hands the rest to a dehumidifier only when one is advised.

    A bedroom whose 5 °C wall no practical RH can keep under the mould limit (80 %
    surface RH below 38 % room RH, CoolProp, under the 40 % floor, common practice) gets no
    dehumidifier: the ventilate text must not hand the rest to one."""
    room = RoomInput(
        "Bedroom",
        "bedroom",
        16.0,
        75.0,
        (
            SurfaceInput("Surface 1", 9.5),
            SurfaceInput("Surface 2", 12.0),
            SurfaceInput("Surface 3", 5.0),
        ),
        volume_m3=30.0,
        occupants=2,
    )
    finding, advice = advice_for(room, OutdoorInput(2.0, 90.0))
    assert ActionKind.DEHUMIDIFY not in [a.kind for a in advice.actions]
    text = words.action_reason(action(advice, ActionKind.VENTILATE), finding, advice, words.SI)
    assert "dehumidifier does the rest" not in text


def test_about_as_wet_outdoor_air_is_said():
    """Outdoor air within the margin is said to be about as wet as the room air.

    Outdoor air within the 1 g/kg margin (common practice) of the room air is said to be
    about as wet, with both humidity ratios (W from CoolProp)."""
    room = RoomInput("Living", "living", 20.0, 75.0, volume_m3=40.0, occupants=2)
    w_o = coolprop("W", 20.0, 75.0) - 0.85 / 1000.0
    finding, advice = advice_for(room, OutdoorInput(18.0, coolprop_rh_for_w(18.0, w_o)))
    text = words.action_reason(action(advice, ActionKind.DEHUMIDIFY), finding, advice, words.SI)
    assert (
        f"Outdoor air is about as wet as the room air: "
        f"{finding.outdoor.humidity_ratio_g_per_kg:.2f} g/kg of water against "
        f"{finding.air.humidity_ratio_g_per_kg:.2f} g/kg in the room"
    ) in text


def test_unknown_load_asks_only_for_the_occupants():
    """With outdoor air as wet, the text asks only for the occupants and gives no size.

    A humid-summer room with the volume given but no occupants and outdoor air wetter
    (CoolProp): the text asks for the occupants and says why, gives no size, and does not ask
    for the room volume."""
    room = RoomInput(
        "Living room", "living", 22.0, 75.0, (SurfaceInput("slab", 17.0),), volume_m3=60.0
    )
    finding, advice = advice_for(room, OutdoorInput(28.0, 75.0))
    dehum = action(advice, ActionKind.DEHUMIDIFY)
    text = words.action_reason(dehum, finding, advice, words.SI)
    assert (
        "The moisture load to hold it there is not known (give the number of occupants: "
        "the load cannot be worked out from the measured excess while outdoor air holds "
        "as much water as the room air or more), so no dehumidifier size can be given"
    ) in text
    assert "room volume" not in text and " in all" not in text
    assert words.action_numbers(dehum, words.SI) == ""


@pytest.mark.parametrize(
    ("volume", "asked"),
    [
        (None, "give the number of occupants, or the outdoor air and the room volume"),
        (30.0, "give the number of occupants, or the outdoor air)"),
    ],
)
def test_missing_inputs_are_asked_for_only_when_missing(volume, asked):
    """The text asks only for the inputs that were not given.

    Without occupants the text asks for the outdoor air and the room volume, leaving out
    the volume when it was given."""
    room = RoomInput("R", "living", 20.0, 75.0, volume_m3=volume)
    assert asked in reason_of(room, None, ActionKind.DEHUMIDIFY)


def test_closed_up_basement_says_occupants_taken_as_0_and_the_leak_rate():
    """A closed-up basement's text says 0 occupants were assumed and the leak rate.

    A closed-up basement with no occupant count: the text says 0 occupants were assumed
    and that outdoor air leaks in at the assumed 0.5 air changes an hour (common practice)."""
    room = RoomInput(
        "Basement", "basement", 22.0, 75.0, (SurfaceInput("slab", 17.0),), volume_m3=60.0
    )
    text = reason_of(room, OutdoorInput(28.0, 75.0), ActionKind.DEHUMIDIFY)
    assert "occupants not given, taken as 0 for a basement room that is closed up: 0 g/h" in text
    assert "outdoor air leaking in at about 0.5 air changes an hour brings" in text


def test_occupants_explaining_the_excess_say_under_ventilated():
    """Occupants who explain the excess are said to mean an under-ventilated room.

    When occupants explain the excess (82 % here, over the 70 % line, our choice), the
    moisture action says the room is under-ventilated rather than hiding a source."""
    finding, advice = advice_for(winter_bedroom(), OutdoorInput(3.0, 88.0))
    vent = action(advice, ActionKind.VENTILATE)
    text = words.action_reason(vent, finding, advice, words.SI)
    share = vent.numbers.occupants_share_of_load
    assert (
        f"the occupants' own moisture (80 g/h) accounts for {share * 100:.0f} % of the "
        f"{advice.moisture.back_calculated_g_per_h:.0f} g/h the measured excess implies at "
        f"the assumed air change rate: the room is under-ventilated for the people in it "
        f"rather than hiding a source."
    ) in text


def test_occupants_explaining_the_air_do_not_contradict_a_search_for_a_source():
    """The same bedroom with a wet plaster reading (30 against a dry standard of 12): the
    advice asks for the moisture source to be found, so the air's note no longer says the
    room is "rather than hiding a source" (the report said both of one room)."""
    import msgspec
    from advice_cases import MaterialInput

    room = msgspec.structs.replace(
        winter_bedroom(), materials=(MaterialInput("corner", "plaster", 30.0, "relative", 12.0),)
    )
    finding, advice = advice_for(room, OutdoorInput(3.0, 88.0))
    assert any(a.kind is ActionKind.FIND_SOURCE for a in advice.actions)
    text = words.action_reason(action(advice, ActionKind.VENTILATE), finding, advice, words.SI)
    assert "rather than hiding a source" not in text
    assert (
        "the room is under-ventilated for the people in it. That speaks of the air only: the "
        "search for a moisture source asked for here rests on other signs."
    ) in text


# --- targets ---------------------------------------------------------------------------------


def test_target_basis_names_the_coldest_wall():
    """The target's basis names the coldest wall and the mould limit.

    The target's basis names the coldest wall and the mould limit (80 % surface RH, BS 5250
    Annex D [R]) that set it."""
    _, advice = advice_for(winter_bedroom(), OutdoorInput(3.0, 88.0))
    assert words.target_basis(advice.target, words.SI) == (
        "50 % RH: above that, the coldest wall, ceiling or floor (north wall, 11.0 °C) goes "
        "over 80 % surface RH, the mould limit."
    )


def test_target_basis_says_frost_point_below_0_c():
    """The target's basis says 'frost point' when the air's is below 0 °C.

    Air at 2 °C / 80 % has its condensation point below 0 °C (the frost point, −1.0 °C by
    the WMO Guide No. 8 formulas [R, secondary]): a wall at −3 °C held 3 K (ISO 8502-4
    practice [R, secondary]) clear of it is said to come within 3 K of the frost point."""
    room = RoomInput("Porch", "hallway", 2.0, 80.0, (SurfaceInput("wall", -3.0),))
    _, advice = advice_for(room, None)
    assert advice.target.frost_point is True
    assert words.target_basis(advice.target, words.SI).endswith(
        "the coldest wall, ceiling or floor (wall, -3.0 °C) comes within 3.0 K of the frost point."
    )


def test_a_storey_is_said_without_ordinals():
    """A "first floor" is the ground floor in some countries and the one above it in
    others, so the report counts storeys from the ground (common practice, no source)."""
    from survey.words.report_room import storey_words

    assert storey_words(None) == "storey not recorded"
    assert storey_words(0) == "on the ground storey"
    assert storey_words(1) == "1 storey above ground"
    assert storey_words(4) == "4 storeys above ground"
    assert storey_words(-1) == "1 storey below ground"


def test_unlikely_values_are_said_and_likely_ones_are_not():
    """The warnings on values taken: a surface above 40 °C or below -25 °C
    (domain.SURFACE_TEMP_WARN_*, common practice, no source), one more than 5 K warmer than
    the room air; a daily use past its usual range (domain.PER_DAY_WARN)."""
    from survey import domain
    from survey.words.screens import per_day_warning, surface_temp_warning

    assert surface_temp_warning(20.0, 21.0, words.SI) == ""
    assert surface_temp_warning(27.0, 21.0, words.SI).startswith("warmer than the room air")
    assert surface_temp_warning(45.0, None, words.SI).startswith("above 40.0 °C")
    assert surface_temp_warning(-30.0, None, words.SI).startswith("below -25.0 °C")
    assert "tape the spot" in surface_temp_warning(-30.0, -10.0, words.SI)
    assert surface_temp_warning(-20.0, None, words.SI) == ""
    assert surface_temp_warning(45.0, None, words.IP).startswith("above 104.0 °F")
    for name, limit in domain.PER_DAY_WARN.items():
        assert per_day_warning(limit, limit) == "", name
        assert per_day_warning(limit + 1, limit).startswith(f"Saved; more than {limit:g} a day")
    assert per_day_warning(None, 10.0) == ""
