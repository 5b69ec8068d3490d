"""The words for surfaces: frost and water on glazing, frames and pipes, the actions' titles,
walls, ceilings and floors, in SI or IP (see ``test_words.py``).
"""

from __future__ import annotations

import math

import pytest
from advice_cases import (
    action,
    advice_for,
    bedroom_two_cold_walls,
    coolprop,
    every_reason,
    reason_of,
    winter_bedroom,
    wmo_frost_point_c,
)

from survey import thresholds as th
from survey import words
from survey.advise import ActionKind
from survey.assess import (
    OutdoorInput,
    RoomInput,
    SurfaceInput,
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
    room = bedroom_two_cold_walls()
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


def test_a_surface_raised_for_the_usual_target_says_what_the_room_must_stay_under_until_then():
    """The winter bedroom's north wall at 11.0 °C in 18 °C air bears less than the usual
    60 % room RH: the action to warm it says the room is to be kept at or under what it
    bears until then (the number the ventilation target uses), so 60 % and that number do
    not read as two targets for one room."""
    finding, advice = advice_for(winter_bedroom(), OutdoorInput(3.0, 88.0))
    raise_it = action(advice, ActionKind.RAISE_SURFACE_TEMPERATURE)
    n = raise_it.numbers
    assert n.max_room_rh_pct < n.design_rh_pct == 60.0
    text = words.action_reason(raise_it, finding, advice, words.SI)
    if n.too_cold:
        assert "until then" not in text  # its reason says the room RH it bears already
    else:
        bears = words.round_down_rh(n.max_room_rh_pct)
        assert f"kept at 60 % without mould risk (until then, at no more than {bears} %)" in text
