"""The words: actions, targets, moisture loads and cautions as sentences, in SI or IP.

The decisions and numbers behind these sentences are tested in ``test_advise.py``; here the
sentences are checked to say those decisions, in the right units, with the numbers shown as
the display writes them.
"""

from __future__ import annotations

import inspect
import math
import re

import pytest
from advice_cases import (
    P,
    action,
    advice_for,
    coolprop,
    drying_room,
    plain,
    wet_skirting_hall,
    winter_bedroom,
    wmo_frost_point_c,
)
from CoolProp.HumidAirProp import HAPropsSI

from survey import advise, assess, psychro, units, words
from survey import thresholds as th
from survey.advise import ActionKind, Caution, DehumidifyWhy
from survey.advise import cautions as caution_rules
from survey.assess import (
    Activity,
    Observations,
    OutdoorInput,
    RoomInput,
    SurfaceInput,
)
from survey.words.display import SI_TEXT

US_PINT_L = 0.473176  # 1 US liquid pint [R]
G_PER_LB = 453.59237  # 1 lb = 0.45359237 kg exactly [R]
GRAINS_PER_LB = 7000.0  # 7000 grains = 1 lb [R]
BTU_H_PER_W = 3600.0 / 1055.05585262  # 1 IT Btu = 1055.05585262 J (from memory): 3.412142 [C]
FT = 0.3048  # 1 ft = 0.3048 m exactly [R]


def reason_of(room, outdoor, kind: ActionKind, display=words.SI) -> str:
    """The reason of the room's one action of ``kind``, in ``display``'s units."""
    finding, advice = advice_for(room, outdoor)
    return words.action_reason(action(advice, kind), finding, advice, display)


def every_reason(finding, advice, display=words.SI) -> str:
    return " ".join(words.action_reason(a, finding, advice, display) for a in advice.actions)


def caution_texts(room, outdoor=None, year=None, display=words.SI) -> dict[str, str]:
    _, advice = advice_for(room, outdoor, year=year)
    return {c.key: words.caution_text(c, display) for c in advice.cautions}


def summer_basement(occupants=0):
    return RoomInput(
        "Basement",
        "basement",
        22.0,
        75.0,
        (SurfaceInput("slab", 17.0),),
        volume_m3=60.0,
        occupants=occupants,
    )


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


def up(value: float, places: int = 0) -> float:
    """``value`` rounded up at ``places`` decimals: a least figure is never shown below the
    one worked out."""
    return math.ceil(value * 10**places - 1e-9) / 10**places


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
    assert "occupants not given, taken as 0 for a basement that is closed up: 0 g/h" in text
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


# --- glazing, frames, pipes --------------------------------------------------------------------


def wmo_rh_free_of_frost_pct(surface_c: float, air_c: float) -> float:
    """Room RH (over water) at which a surface at ``surface_c`` below 0 °C is at the frost
    point: 100 e_i(surface) / e_w(air), WMO Guide No. 8 formulas [R, secondary]."""
    e_i = 6.112 * math.exp(22.46 * surface_c / (272.62 + surface_c))
    e_w = 6.112 * math.exp(17.62 * air_c / (243.12 + air_c))
    return 100.0 * e_i / e_w


def porch(surface: SurfaceInput):
    return RoomInput("Porch", "hallway", 2.0, 80.0, (surface,))


@pytest.mark.parametrize(
    ("surface", "kind", "opening"),
    [
        (
            SurfaceInput("pane", -6.0, "glazing"),
            ActionKind.REDUCE_GLAZING_CONDENSATION,
            "pane (glass) is at -6.0 °C, against a frost point of -1.0 °C: frost forms on it.",
        ),
        (
            SurfaceInput("cold main", -5.0, "pipe"),
            ActionKind.INSULATE_PIPE,
            "cold main is at -5.0 °C, against a frost point of -1.0 °C: frost forms on it,",
        ),
    ],
)
def test_frost_on_panes_and_pipes_below_0_c_is_called_frost(surface, kind, opening):
    """Panes and pipes below 0 °C under a frost point are said to gather frost.

    A pane at −6 °C and a pipe at −5 °C in 2 °C / 80 % air, whose frost point is −1.0 °C
    (WMO Guide No. 8 formulas): the text names the frost point, says frost forms, and gives
    the room RH below which the surface stays free of frost, 100 e_i(t_s)/e_w(2) rounded
    down: 52 % for the pane, 56 % for the pipe (WMO formulas)."""
    assert wmo_frost_point_c(2.0, 80.0) == pytest.approx(-0.96, abs=0.01)
    text = reason_of(porch(surface), None, kind)
    assert text.startswith(opening)
    free = math.floor(wmo_rh_free_of_frost_pct(surface.surface_temp_c, 2.0))
    assert f"It stays free of frost only while the room is below {free} %" in text
    assert "dew point" not in text and "water forms" not in text


@pytest.mark.parametrize(
    ("surface", "kind"),
    [
        (SurfaceInput("pane", -6.0, "glazing"), ActionKind.REDUCE_GLAZING_CONDENSATION),
        (SurfaceInput("cold main", -5.0, "pipe"), ActionKind.INSULATE_PIPE),
    ],
)
def test_surface_below_0_c_in_air_with_a_dew_point_names_the_dew_point(surface, kind):
    """A surface below 0 °C in air with a dew point above 0 °C names the dew point.

    Air at 20 °C / 50 % holds about 1169 Pa of vapour (CoolProp), above the 611.657 Pa of
    the triple point (IAPWS, from memory): its condensation point is a dew point,
    9.3 °C (CoolProp), and there is no frost point above 0 °C. A pane or pipe below 0 °C in
    it gathers frost, against that dew point."""
    assert coolprop("P_w", 20.0, 50.0) > 611.657
    dew = coolprop("D", 20.0, 50.0) - 273.15
    room = RoomInput("Bedroom", "bedroom", 20.0, 50.0, (surface,))
    finding, advice = advice_for(room, None)
    act = action(advice, kind)
    assert act.numbers.condensation_point_c == pytest.approx(dew, abs=0.05)
    text = words.action_reason(act, finding, advice, words.SI)
    assert f"against a dew point of {dew:.1f} °C: frost forms on it" in text
    assert "frost point" not in text


def test_water_on_a_cold_pipe_above_0_c_and_closed_cell_insulation():
    """Water forms on a cold pipe above 0 °C; it is lagged with closed-cell insulation.

    A pipe at 9 °C under the 12.9 °C dew point of 18 °C / 72 % air (CoolProp): water forms
    on it, and it is to be lagged with closed-cell insulation (common practice)."""
    room = RoomInput(
        "Bedroom",
        "bedroom",
        18.0,
        72.0,
        (SurfaceInput("cold main", 9.0, "pipe"),),
        volume_m3=30.0,
        occupants=2,
    )
    dew = coolprop("D", 18.0, 72.0) - 273.15
    text = reason_of(room, OutdoorInput(3.0, 88.0), ActionKind.INSULATE_PIPE)
    assert text.startswith(
        f"cold main is at 9.0 °C, against a dew point of {dew:.1f} °C: water forms on it"
    )
    assert "Lag it with closed-cell pipe insulation" in text
    assert "frost" not in text


def test_a_pipe_near_the_dew_point_in_a_room_already_at_its_target_says_so():
    """A pipe at 10.0 °C in air of 20.2 °C / 50 %, whose dew point is 9.5 °C (CoolProp): at
    ±1 K the pipe cannot be told apart from the dew point. It stays dry only below about
    52 % room RH (50 × 100 / its 96 % surface RH), and the room is at 50 % already, so
    the words do not say "once the room is down to" a target it has reached; they say the
    room is at 50 % now, too close to the limit to rely on."""
    room = RoomInput(
        "Store",
        "bedroom",
        20.2,
        50.0,
        (SurfaceInput("repaired joint", 10.0, "pipe"),),
        volume_m3=17.0,
        occupants=0,
    )
    dew = coolprop("D", 20.2, 50.0) - 273.15
    assert dew == pytest.approx(9.5, abs=0.05)
    text = reason_of(room, OutdoorInput(3.0, 88.0), ActionKind.INSULATE_PIPE)
    assert "water may form on it" in text
    assert "the room is at 50 % now, too close to that to rely on" in text
    assert "once the room is down to" not in text


def bedroom_with_bay_window():
    walls = winter_bedroom()
    return RoomInput(
        walls.name,
        walls.use,
        walls.air_temp_c,
        walls.rh_pct,
        (*walls.surfaces, SurfaceInput("bay window", 4.0, "glazing")),
        volume_m3=30.0,
        occupants=2,
    )


def test_glazing_advice_covers_single_and_double_glazing():
    """The glazing text covers single and double glazing.

    The glazing type is not known: the advice words both cases (common practice), and
    that a cold single pane is no reason to hold the room drier."""
    text = reason_of(
        bedroom_with_bay_window(), OutdoorInput(3.0, 88.0), ActionKind.REDUCE_GLAZING_CONDENSATION
    )
    assert (
        "On single glazing some condensation is expected in cold weather: it is no reason "
        "to hold the room drier than is practical; consider secondary or double glazing, "
        "which keeps the inner pane warmer."
    ) in text
    assert (
        "On double glazing a pane this cold suggests a failed or poor unit (misting "
        "between the panes means a failed seal): have it checked or replaced."
    ) in text
    assert "Wipe the glass and sill dry each morning, keep trickle vents open" in text


def test_glazing_gets_a_window_remedy_not_a_wall_remedy():
    """The glazing text gives a window remedy, not a wall remedy.

    The pane's text gives water forming against the room's dew point (12.9 °C, CoolProp)
    and no wall remedy (furniture, insulation)."""
    finding, advice = advice_for(bedroom_with_bay_window(), OutdoorInput(3.0, 88.0))
    glazing = action(advice, ActionKind.REDUCE_GLAZING_CONDENSATION)
    text = words.action_reason(glazing, finding, advice, words.SI)
    dew = coolprop("D", 18.0, 72.0) - 273.15
    assert text.startswith(
        f"bay window (glass) is at 4.0 °C, against a dew point of {dew:.1f} °C: water forms on it."
    )
    assert "furniture" not in text and "insulation" not in text


# --- titles ----------------------------------------------------------------------------------


def test_every_action_kind_has_a_title():
    """Each action kind has its own title."""
    assert set(words.TITLES) == set(ActionKind)
    assert len(set(words.TITLES.values())) == len(ActionKind)


def test_two_raised_surfaces_have_two_titles():
    """Each raise-the-surface title names its surface, so two never read alike."""
    room = RoomInput(
        "Bedroom",
        "bedroom",
        16.0,
        75.0,
        (
            SurfaceInput("north wall", 9.5, "external_wall"),
            SurfaceInput("corner", 5.0, "external_wall"),
        ),
        volume_m3=30.0,
        occupants=2,
    )
    _, advice = advice_for(room, OutdoorInput(2.0, 90.0))
    titles = [
        words.action_title(a)
        for a in advice.actions
        if a.kind is ActionKind.RAISE_SURFACE_TEMPERATURE
    ]
    assert titles == [
        "Raise the surface temperature: corner",
        "Raise the surface temperature: north wall",
    ]


def test_window_and_pipe_titles_name_their_surface():
    """The window and pipe titles name the surface; the pipe's says to insulate it."""
    _, advice = advice_for(bedroom_with_bay_window(), OutdoorInput(3.0, 88.0))
    glazing = action(advice, ActionKind.REDUCE_GLAZING_CONDENSATION)
    assert words.action_title(glazing) == "Deal with condensation on the window: bay window"
    room = RoomInput(
        "Bedroom",
        "bedroom",
        18.0,
        72.0,
        (SurfaceInput("cold main", 9.0, "pipe"),),
        volume_m3=30.0,
        occupants=2,
    )
    _, advice = advice_for(room, OutdoorInput(3.0, 88.0))
    pipe = action(advice, ActionKind.INSULATE_PIPE)
    assert words.action_title(pipe) == "Insulate the cold pipe: cold main"
    assert words.action_title(action(advice, ActionKind.VENTILATE)) == "Ventilate"


# --- walls, ceilings, floors -------------------------------------------------------------------


def test_internal_wall_gets_words_for_a_partition():
    """An internal wall's remedy is worded for a partition, not insulation.

    An internal wall too cold for the 40 % floor (common practice) is raised with words
    for a partition (unheated space behind, leak), not "insulation" of the envelope."""
    room = RoomInput(
        "Bedroom", "bedroom", 20.0, 65.0, (SurfaceInput("party wall", 6.0, "internal_wall"),)
    )
    text = reason_of(room, OutdoorInput(0.0, 80.0), ActionKind.RAISE_SURFACE_TEMPERATURE)
    assert (
        "An internal wall this cold usually backs onto an unheated space or a chimney, or "
        "hides a leak or a cold bridge: find out which before treating it."
    ) in text
    assert "insulation" not in text


def test_ground_contact_floor_gets_no_insulation_remedy():
    """A ground-contact slab's remedy names the ground, not insulation.

    A ground-contact slab too cold for the 40 % floor (common practice) is told to be kept
    heated and dry, with the ground named as what sets its temperature; no insulation or
    thermal-bridge investigation is given."""
    room = RoomInput(
        "Basement", "basement", 20.0, 65.0, (SurfaceInput("slab", 6.0, "floor"),), volume_m3=40.0
    )
    text = reason_of(room, OutdoorInput(2.0, 80.0), ActionKind.RAISE_SURFACE_TEMPERATURE)
    assert (
        "This surface is in contact with the ground, which sets its temperature: its "
        "temperature factor is not judged against outdoor air."
    ) in text
    assert "insulation" not in text and "investigated" not in text


def test_every_room_use_reads_as_words():
    """Each room use has a phrase; the use not said has none.

    Each room use has a phrase for the advice text ('an office'); the use not said has
    none."""
    assert set(words.USE_PHRASE) == set(th.ROOM_USES)
    assert words.USE_PHRASE["office"] == "an office"
    assert words.USE_PHRASE["other"] is None


@pytest.mark.parametrize(
    ("use", "limit_words"),
    [
        ("other", "under the general 0.70 limit,"),
        ("office", "under the 0.75 limit for an office,"),
    ],
)
def test_factor_limit_is_named_by_room_use(use, limit_words):
    """The temperature-factor limit is named for the room use, or as the general one.

    The factor limit is named for the use ('the 0.75 limit for an office', BRE IP1/06
    [M]); a room whose use is not said gets neutral words ('the general 0.70 limit', IEA
    Annex 14 [M]), never 'a other' or 'a room of this kind'."""
    room = RoomInput(
        "Study", use, 18.0, 72.0, (SurfaceInput("wall", 11.0),), volume_m3=30.0, occupants=2
    )
    finding, advice = advice_for(room, OutdoorInput(3.0, 88.0))
    text = every_reason(finding, advice)
    assert limit_words in text
    assert "a other" not in text and "of this kind" not in text


def test_ip_raise_surface_text_is_in_fahrenheit():
    """The IP raise-surface text is in °F, the minimum rounded up.

    IP text writes the wall and the temperature it must reach in °F, the minimum rounded
    up: 11 °C = 51.8 °F and 3 + 0.75 × 15 = 14.25 °C = 57.65 °F → 57.7 °F (× 9/5 + 32)."""
    text = reason_of(
        winter_bedroom(), OutdoorInput(3.0, 88.0), ActionKind.RAISE_SURFACE_TEMPERATURE, words.IP
    )
    assert text.startswith("north wall is too cold at 51.8 °F:")
    assert "Raise it to at least 57.7 °F" in text
    assert "°C" not in text


# --- sources, drying, humidity class -----------------------------------------------------------


def test_find_source_names_the_wet_reading_and_the_rot_risk():
    """The source text names the wet reading, its goal and the rot risk.

    The source text names the reading against its dry standard with the goal (11 × 1.1 =
    12.1, common practice) and asks for a rot check above 20 % MC (Wood Handbook ch. 14 [R,
    secondary])."""
    text = reason_of(wet_skirting_hall(), OutdoorInput(4.0, 85.0), ActionKind.FIND_SOURCE)
    assert text.startswith(
        "Find and deal with the source of moisture before drying or "
        "decorating: material readings above the dry standard (skirting "
        "28 against 11 (dry once at or below 12.1)); once the source is "
        "dealt with, dry them until the readings reach the dry standard;"
    )
    assert (
        "timber at or above the 20 % moisture content at which decay fungi grow "
        "(skirting 28 %): have it checked for rot"
    ) in text


def test_condensation_seen_but_not_explained_is_said():
    """Condensation seen on clear surfaces is said, with where else it may come from."""
    room = RoomInput(
        "Bedroom",
        "bedroom",
        21.0,
        45.0,
        (SurfaceInput("wall", 19.0),),
        observations=Observations(condensation_seen=True),
    )
    assert reason_of(room, None, ActionKind.FIND_SOURCE) == (
        "Find and deal with the source of moisture before drying or decorating: condensation "
        "was seen, but the measured surfaces are clear of the dew point: it may come from "
        "moments of higher humidity (cooking, drying laundry) or from water getting in."
    )


def test_drying_under_way_says_keep_drying():
    """While drying runs the text says to continue to the dry standard.

    While drying runs the text says to continue to the dry standard, with each reading's
    goal (10 % allowance, common practice: 22 → 24.2, 11.5 → 12.65, shown to 3 figures)."""
    text = reason_of(drying_room(), OutdoorInput(4.0, 85.0), ActionKind.KEEP_DRYING)
    assert text.startswith(
        "Continue drying until readings reach the dry standard: these "
        "readings are still above the dry standard (the same material in "
        "an unaffected area, allowing 10 %): party wall 46 against 22 (dry "
        "once at or below 24.2), skirting 16 against 11.5 (dry once at or "
        "below 12.7)"
    )


def test_use_not_given_never_says_a_room_of_this_kind():
    """The class reason for a room of unknown use uses neutral words."""
    room = RoomInput("R", "other", 20.0, 75.0, volume_m3=30.0, occupants=1)
    text = reason_of(room, OutdoorInput(0.0, 80.0), ActionKind.FIND_SOURCE)
    assert "of EN ISO 13788 — more than ordinary occupied rooms produce" in text
    assert "of this kind" not in text


def test_uncertain_humidity_class_says_it_may_be_high():
    """A class the accuracy cannot settle is said to be possibly high.

    A class band spanning 3 and 4 (ISO 13788 limits, from memory) in a bedroom, where 4 is
    high (common practice): the text says the class may be high and asks for repeat
    readings."""
    room = RoomInput("Bedroom", "bedroom", 20.0, 54.5, volume_m3=30.0, occupants=None)
    text = reason_of(room, OutdoorInput(0.0, 80.0), ActionKind.REPEAT_READINGS)
    assert text.startswith("The humidity class may be high:")
    assert (
        "class 3 or 4 of EN ISO 13788 at this instrument accuracy, and class 4 or above "
        "would be more than a bedroom should produce"
    ) in text


def test_bathroom_peak_defers_the_extract_rate_to_the_local_code():
    """A bathroom peak's extract is sized to the local code's minimum.

    A bathroom peak gets an extract fan sized to the local code's minimum (Approved
    Document F and ASHRAE 62.2, from memory), run on by a timer or humidistat, and a
    re-reading 30-60 min after use (common practice)."""
    room = RoomInput(
        "Bathroom", "bathroom", 20.0, 90.0, (SurfaceInput("wall", 16.0),), volume_m3=10.0
    )
    text = reason_of(room, OutdoorInput(0.0, 80.0), ActionKind.REPEAT_READINGS)
    assert (
        "sized to the local code's minimum extract rate (UK Approved Document F and ASHRAE "
        "62.2 set minimum extract rates; from memory, check local code), with an overrun "
        "timer or a humidistat"
    ) in text
    assert "Take a re-reading 30-60 min after use" in text


def test_loft_text_cuts_moisture_from_below():
    """The loft text cuts moisture from below and gives the rafter's EMC.

    Loft: cut moisture from below (hatch, extract fans), check eaves and ridge, a
    dehumidifier only if sealed, a pin meter (common practice, no source), and the rafter's
    EMC in the decay range (20 %, Wood Handbook ch. 14, secondary), decay slowed below
    10 °C."""
    room = RoomInput("Loft", "loft", 3.0, 92.0, (SurfaceInput("rafter", 2.5, "ceiling"),))
    finding, advice = advice_for(room, OutdoorInput(2.0, 90.0))
    act = action(advice, ActionKind.DRY_VENTILATED_SPACE)
    text = words.action_reason(act, finding, advice, words.SI)
    assert text.startswith(
        "The loft is at 92 % RH. A ventilated loft follows outdoor air: dry "
        "it by cutting the moisture coming up from the rooms below:"
    )
    for phrase in (
        "seal gaps around the hatch",
        "no extract fan, tumble-drier or soil vent discharges into the loft",
        "Check the eaves and ridge ventilation",
        "A dehumidifier helps only if the space is sealed",
        "Measure the timber with a pin moisture meter",
    ):
        assert phrase in text
    (rafter,) = act.numbers.timber_surfaces
    assert (
        f"Rafter at 2.5 °C and {rafter.surface_rh_pct:.0f} % surface RH would settle at "
        f"about {rafter.emc_pct:.1f} % "
        f"moisture content (Wood Handbook eqn 4-5 at the surface): in the decay range "
        f"(above about 20 %); below 10.0 °C decay is slower, not stopped"
    ) in text


def test_crawlspace_text_gives_a_ground_vapour_barrier():
    """Crawl space: a ground vapour barrier and open air bricks (common practice)."""
    room = RoomInput("Crawl", "crawlspace", 12.0, 88.0, (SurfaceInput("joist", 11.0, "floor"),))
    text = reason_of(room, OutdoorInput(10.0, 85.0), ActionKind.DRY_VENTILATED_SPACE)
    assert text.startswith(
        "The crawl space is at 88 % RH. A ventilated crawl space follows "
        "outdoor air: dry it by cutting the moisture coming in: lay a ground "
        "vapour barrier"
    )
    assert "check the air bricks or vents are open and clear" in text


def test_too_cold_for_mould_state_words():
    """A surface below 5 °C reads as too cold for mould growth now.

    A surface outside the 5-40 °C range of the mould criterion (ASHRAE Standard 160,
    secondary) reads as too cold for mould growth now."""
    room = RoomInput("Loft", "loft", 4.0, 90.0, (SurfaceInput("rafter", 2.0, "ceiling"),))
    finding = assess.assess_room(room, OutdoorInput(1.0, 90.0), P)
    assert words.mould_text(finding.surfaces[0]) == (
        "too cold for mould growth now; watch for melt-water and mould when it warms"
    )


# --- cautions ----------------------------------------------------------------------------------


def test_closing_caution_defers_to_local_codes_and_licensed_professionals():
    """The closing caution defers to local codes and licensed professionals, SI and IP."""
    for display in (words.SI, words.IP):
        text = words.caution_text(advise.CLOSING, display)
        assert text == words.CLOSING_TEXT
    assert (
        "Follow local building codes and regulations, and the advice of licensed "
        "professionals (electricians, gas engineers, mould, asbestos and structural "
        "specialists), before acting on them."
    ) in words.CLOSING_TEXT


def test_site_cautions_read_once_each():
    """The site's cautions read as different sentences: none is said twice."""
    site = assess.assess_site(
        [
            winter_bedroom(),
            RoomInput("Loft", "loft", 5.0, 80.0),
            RoomInput("Loft 2", "loft", 5.0, 80.0),
        ],
        OutdoorInput(3.0, 88.0),
        P,
    )
    texts = [words.caution_text(c, words.SI) for c in advise.advise_site(site).cautions]
    assert len(texts) == len(set(texts))
    assert texts[-1] == words.CLOSING_TEXT


#: Every caution key the advice's caution rules can give, read from their source.
_CAUTION_KEYS = sorted(set(re.findall(r'Caution\("(\w+)"', inspect.getsource(caution_rules))))


def test_caution_keys_are_found():
    """The caution keys are read from the caution rules (ten or more, closing among them)."""
    assert len(_CAUTION_KEYS) >= 10 and "closing" in _CAUTION_KEYS


@pytest.mark.parametrize("key", _CAUTION_KEYS)
def test_every_caution_key_has_words(key):
    """Every caution the advice can give has words in SI and IP."""
    caution = Caution(key, use="loft", risks=("asbestos",))
    for display in (words.SI, words.IP):
        assert words.caution_text(caution, display).strip()


@pytest.mark.parametrize(("area", "word"), [(0.5, "small"), (3.0, "medium"), (12.0, "large")])
def test_visible_mould_caution_by_area(area, word):
    """Each mould area band gets its own words; only the large one calls a firm.

    Mould areas up to 10 sq ft, to 100 sq ft and above (US EPA bands, from memory) get
    their own protection and containment advice; only the large band calls a licensed
    firm."""
    text = caution_texts(plain(visible_mould_area_m2=area))["visible_mould"]
    assert text.startswith(f"Visible mould, about {area:.2g} m²: a {word} area.")
    assert ("licensed" in text) is (word == "large")


def test_visible_mould_area_in_square_feet_in_ip():
    """IP text reads a mould area in sq ft: 3 m² = 32.3 sq ft (1 ft = 0.3048 m)."""
    text = caution_texts(plain(visible_mould_area_m2=3.0), display=words.IP)["visible_mould"]
    assert text.startswith(f"Visible mould, about {3.0 / FT**2:.3g} sq ft: a medium area.")


@pytest.mark.parametrize(
    ("display", "unit", "per_m2"), [(words.SI, "m²", 1.0), (words.IP, "sq ft", 1.0 / FT**2)]
)
def test_large_mould_area_is_written_in_plain_digits(display, unit, per_m2):
    """A large mould area is written in plain digits, not exponent notation.

    A large mould area (125 m², valid up to 100 000 m²) is written in plain digits, not in
    exponent notation, within the 2 figures shown: 125 m² = 1345.5 sq ft (1 ft = 0.3048 m)."""
    text = caution_texts(plain(visible_mould_area_m2=125.0), display=display)["visible_mould"]
    shown = re.match(rf"Visible mould, about ([0-9,.]+) {unit}: a large area\.", text)
    assert shown is not None, text
    assert float(shown.group(1).replace(",", "")) == pytest.approx(125.0 * per_m2, rel=0.05)


def test_visible_mould_without_an_area_is_treated_as_medium():
    """Mould seen but not measured is to be measured, and treated as medium meanwhile.

    Mould seen but not measured: measure it (bands 0.93 m² and 9.3 m², US EPA, from
    memory), and until then treat it as a medium area with an FFP2 / N95 respirator."""
    text = caution_texts(plain(visible_mould=True))["visible_mould"]
    assert text.startswith(
        "Visible mould, area not measured: measure it (up to about 0.93 m² "
        "is a small area, over about 9.3 m² a large one"
    )
    assert "Until it is measured, treat it as a medium area: have it removed" in text
    assert "at least an FFP2 / N95 respirator" in text


def test_contaminated_water_cautions():
    """Category 3 water needs licensed handling; electrics need RCD protection.

    Category 3 water needs licensed handling; electrics near water name residual-current
    protection (restoration standard of practice; common practice)."""
    texts = caution_texts(plain(water_category=3))
    assert "It needs trained, licensed handling" in texts["water_category_3"]
    assert "residual-current protection (RCD / GFCI)" in texts["electrics_near_water"]


def test_category_1_water_caution():
    """Category 1 water is said to degrade to category 2 in about 48 hours.

    Clean water left standing degrades to category 2 (restoration standard of practice
    [R, secondary]; about 48 h from memory)."""
    text = caution_texts(drying_room(), OutdoorInput(4.0, 85.0))["water_category_1"]
    assert "it degrades to category 2 (commonly within about 48 hours" in text


@pytest.mark.parametrize(
    ("use", "opening"),
    [
        (
            "basement",
            (
                "Basement: if the basement is unheated, poorly ventilated or flooded, "
                "treat it as a confined space."
            ),
        ),
        ("crawlspace", "Crawl space: a confined or hard-to-reach space."),
        ("loft", "Loft: a confined or hard-to-reach space."),
    ],
)
def test_confined_space_caution_conditional_only_for_basements(use, opening):
    """The confined-space words are conditional only for basements.

    Crawl spaces and lofts: always confined; a basement only if unheated, poorly
    ventilated or flooded (common practice, no source). Never go in alone."""
    text = caution_texts(RoomInput("Space", use, 15.0, 70.0, ()), OutdoorInput(5.0, 80.0))[
        "confined_space"
    ]
    assert text.startswith(opening)
    assert "Do not go in alone" in text


def test_combustion_heater_caution_gives_water_and_carbon_monoxide():
    """The unflued-heater caution gives propane's water vapour and carbon monoxide.

    The unflued-heater caution gives about 1.6 kg of water per kg of propane
    (4 × 18.015 / 44.097 = 1.63, stoichiometry [C]) and carbon monoxide."""
    text = caution_texts(winter_bedroom(), OutdoorInput(3.0, 88.0))["combustion_heaters"]
    assert (
        "burning 1 kg of propane releases about 1.6 kg of water vapour into the room, and "
        "they give off carbon monoxide"
    ) in text


def test_asbestos_and_lead_by_building_age():
    """The old-materials words name asbestos and lead paint by building age.

    A building of unknown age: asbestos (to about 2000, common practice) and lead paint
    (before 1978 in the US, from memory, other years elsewhere); one built in 1990: asbestos
    only."""
    room, out = winter_bedroom(), OutdoorInput(3.0, 88.0)
    unknown = caution_texts(room, out)["asbestos_lead"]
    assert unknown.startswith(
        "Old materials: in a building of unknown age, have suspect "
        "materials checked for asbestos (used in buildings up to about "
        "2000) and lead paint (common before 1978 in the US; the year "
        "differs by country, from the 1920s to the 1990s) before "
        "drilling"
    )
    nineties = caution_texts(room, out, year=1990)["asbestos_lead"]
    assert nineties.startswith(
        "Old materials: in a building built in 1990, have suspect "
        "materials checked for asbestos (used in buildings up to about "
        "2000) before drilling"
    )
    assert "lead paint" not in nineties


def test_moisture_basis_lists_each_source_in_si():
    """The moisture basis lists the room's use, occupants and activities in SI.

    The moisture basis gives the room's use, 150 + 26 = 176 g/h, with occupants and
    activities: 3 sitting at 50 g/h and a 15-minute shower at 2500 g/h over 24 h = 26 g/h
    (BS 5250 figures via a building-science text [R])."""
    room = RoomInput(
        "Bath", "bathroom", 21.0, 70.0, occupants=3, activities=(Activity("shower", 0.25),)
    )
    estimate = advise.moisture_generation(assess.assess_room(room))
    assert words.moisture_basis(estimate, "bathroom", words.SI) == (
        f"176 g/h from the room's use (3 people sitting at 50 g/h each: 150 g/h; activities "
        f"averaged over the day: {2500 * 0.25 / 24:.0f} g/h)"
    )


def test_the_app_panels_name_frost_below_zero_and_follow_the_units():
    """A state whose condensation point is below 0 °C is given its frost point; the same
    state in IP is written in °F and grains per pound."""
    from survey.words import screens

    cold = psychro.state_from_rh(2.0, 60.0)  # dew point about −4.6 °C: frost point shown
    si = screens.air_state_lines(cold, words.SI, pressure_pa=101_325.0)
    assert si[1].startswith("Frost point ") and si[0] == "2.0 °C, 60 % RH"
    assert si[-1] == "Pressure used 1013.2 hPa"
    ip = screens.air_state_lines(psychro.state_from_rh(21.0, 50.0), words.IP, 0.5)
    assert ip[0].startswith("69.8 °F") and ip[1].startswith("Dew point ")
    assert ip[1].endswith("± 0.9 °F") and "gr/lb" in ip[2]


def test_one_worst_surface_for_every_face():
    """A pane with water forming on it outranks a wall only near the dew point but above the
    mould limit: the room's worst finding names the pane in the words, the app's room list
    and the chart alike (one ordering, :func:`words.worst_first`)."""
    from survey import chart
    from survey.app import judging
    from survey.evaluate import VisitAssessment
    from survey.words import screens

    room = assess.RoomInput(
        "R",
        "bedroom",
        20.0,
        65.0,
        (
            assess.SurfaceInput("wall", 15.0, "external_wall"),  # surface RH ~89 %, margin 1.8 K
            assess.SurfaceInput("pane", 9.0, "glazing"),  # below the 13.2 °C dew point
        ),
    )
    site = assess.assess_site([room], None, 101_325.0)
    finding = site.rooms[0]
    wall, pane = finding.surfaces
    assert pane.condensation is assess.CondensationState.CONDENSING
    assert wall.mould is assess.MouldState.ABOVE
    assert words.worst_first(finding.surfaces)[0] is pane
    assert words.worst_surface(finding.surfaces) is pane
    assert judging.worst_rank(finding) == 3
    assert screens.worst_state_words(finding, words.SI).startswith("water forming")
    judged = VisitAssessment(0, None, site, advise.advise_site(site), ("r",), {})
    (point,) = chart.psychro_chart(judged).points
    assert point.worst_words.startswith("water forming")


def test_the_narrow_surface_rh_cell_keeps_the_band_and_leaves_what_forms_to_the_state():
    """Room air 17.5 °C and 72 % (dew point 12.4 °C, CoolProp): a pane at 6.0 °C is past
    saturation ("≥100 %", the state cell says water forms), a wall at 13.1 °C near 96 % with
    a band reaching 100 % ("≥…"), an internal wall at 20.0 °C near 62 % (surface RH at
    constant humidity ratio from CoolProp). The band itself is the assessment's (checked
    against a Monte Carlo in tests/test_assess_uncertainty.py); here only its brief form is
    checked, against the report's longer text."""
    from survey.words import screens

    dew = HAPropsSI("D", "T", 290.65, "R", 0.72, "P", 101325.0) - 273.15
    assert dew == pytest.approx(12.4, abs=0.05)
    room = assess.RoomInput(
        "Room",
        "bedroom",
        17.5,
        72.0,
        (
            assess.SurfaceInput("Pane", 6.0, "glazing"),
            assess.SurfaceInput("Wall", 13.1, "external_wall"),
            assess.SurfaceInput("Inner", 20.0, "internal_wall"),
        ),
    )
    pane, wall, inner = assess.assess_room(room, None, accuracy=assess.DEFAULT_ACCURACY).surfaces
    assert screens.surface_rh_cell(pane) == "≥100 %"
    assert "water forming" in screens.surface_state_words(pane, words.SI)
    assert wall.surface_rh_high_pct >= 100.0 > inner.surface_rh_high_pct
    ratio = HAPropsSI("W", "T", 290.65, "R", 0.72, "P", 101325.0)
    for s, kelvin, near in ((wall, 286.25, 96), (inner, 293.15, 62)):
        expected = 100 * HAPropsSI("R", "T", kelvin, "W", ratio, "P", 101325.0)
        assert s.surface_rh_pct == pytest.approx(expected, abs=0.3)
        assert round(expected) == near
    for s in (wall, inner):
        cell = screens.surface_rh_cell(s)
        assert cell.startswith(f"{s.surface_rh_pct:.0f} % (")
        if s.surface_rh_high_pct >= 100.0:
            assert cell.endswith(f"(≥{s.surface_rh_low_pct:.0f})")
        else:
            band = f"({s.surface_rh_low_pct:.0f}–{s.surface_rh_high_pct:.0f})"
            assert cell.endswith(band) and band in words.surface_rh_text(s)
        assert len(cell) <= 13
