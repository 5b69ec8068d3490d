"""The colder month (EN ISO 13788 temperature-factor method): the class lines, a projection
worked by hand, its range, the lowest month a surface bears, the command line and the
winter-flat example.

Saturation pressures in the hand arithmetic are psychrolib's (ASHRAE Handbook Fundamentals
2017 ch. 1 eqn 5 & 6), called here directly, not through the package.
"""

from __future__ import annotations

import json
import math
import random
from pathlib import Path

import psychrolib
import pytest

from survey import assess, evaluate, season, season_math, store, words
from survey import thresholds as th
from survey.errors import InputError
from survey.season import DesignMonth, DesignState, ExcessModel, InverseOutcome, RoomReason
from survey.words import season as ws

psychrolib.SetUnitSystem(psychrolib.SI)
_psat = psychrolib.GetSatVapPres

ROOT = Path(__file__).resolve().parents[1]
FLAT = ROOT / "example_sites" / "winter-flat-bedroom-mould.json"


def _room(ti=20.0, rhi=60.0, te=5.0, rhe=80.0, surfaces=(("Corner", 15.5, "external_wall"),),
          accuracy=assess.DEFAULT_ACCURACY, use="bedroom"):  # fmt: skip
    room = assess.RoomInput("Room", use, ti, rhi, tuple(assess.SurfaceInput(*s) for s in surfaces))
    outdoor = None if te is None else assess.OutdoorInput(te, rhe)
    return assess.assess_room(room, outdoor, accuracy=accuracy)


# --- the ISO 13788 class lines ------------------------------------------------------------------


@pytest.mark.parametrize(
    ("outdoor_c", "scale"),
    [(-10.0, 1.0), (0.0, 1.0), (5.0, 0.75), (10.0, 0.5), (15.0, 0.25)],
)
def test_class_lines_at_their_published_points(outdoor_c, scale):
    """EN ISO 13788 Annex A (Fig. A.1 / Table A.1), internal humidity classes by
    vapour-pressure excess: 270, 540, 810, 1080 and 1350 Pa for classes 1-5 at an outdoor
    monthly mean at or below 0 °C, falling linearly to 0 Pa at 20 °C [M: from memory, not
    checked against the original here; the same figures are in
    shared/design/check-values.md, also marked M]. Between the knees the line is linear, so
    at 10 °C each class is half its value."""
    published = (270.0, 540.0, 810.0, 1080.0, 1350.0)
    limits = th.humidity_class_limits_pa(outdoor_c)
    assert limits == pytest.approx(tuple(p * scale for p in published), abs=1e-9)
    assert season_math.line_scale(outdoor_c) == pytest.approx(scale, abs=1e-12)


def test_class_lines_end_at_20_c():
    """At and above 20 °C outdoors the lines have reached 0: no class, no excess carried."""
    assert th.humidity_class_limits_pa(20.0) is None
    assert season_math.line_scale(20.0) == 0.0 and season_math.line_scale(25.0) == 0.0


def test_class_limits_agree_with_their_humidity_by_volume_form():
    """EN ISO 13788 gives the classes also as a humidity-by-volume excess Δv of 2, 4, 6, 8 and
    10 g/m³ [M]. The ideal-gas law p = ρ·R_v·T, with R_v = R/M_w = 8.314 462 618 J/(mol·K)
    (CODATA 2018, exact) / 0.018 015 28 kg/mol = 461.52 J/(kg·K) [C], turns Δv into Δp at a
    20 °C room (293.15 K): 270.6, 541.1, 811.7, 1082.2 and 1352.8 Pa — the Pa values above to
    0.3 %, a check that the two recalled forms are one table."""
    r_v = 8.314462618 / 0.01801528
    for n, key in enumerate(th.HUMIDITY_CLASS_KEYS, start=1):
        from_dv = 0.002 * n * r_v * 293.15
        assert th.value(key) == pytest.approx(from_dv, rel=3e-3)


# --- a projection by hand -------------------------------------------------------------------------


def test_projection_worked_by_hand():
    """A bedroom at 20 °C / 60 %, outdoors 5 °C / 80 %, an external-wall corner at 15.5 °C;
    the design month 2 °C / 90 % outside, the room as measured. By hand (saturation from
    psychrolib, over water above 0.01 °C):

    fRsi = (15.5 − 5)/(20 − 5) = 0.700
    pi = 0.60 × psat(20 °C) = 0.60 × 2338.80 = 1403.28 Pa
    pe = 0.80 × psat(5 °C)  = 0.80 × 872.49  =  697.99 Pa;  Δp = 705.29 Pa
    (class 4 at 5 °C outside: 0.75 × 810 = 607.5 < 705.29 ≤ 0.75 × 1080 = 810 Pa)
    along the class line: s(5 °C) = (20 − 5)/20 = 0.75, s(2 °C) = 0.90,
        Δp,d = 705.29 × 0.90/0.75 = 846.35 Pa
    pe,d = 0.90 × psat(2 °C) = 0.90 × 705.95 = 635.36 Pa;  pi,d = 1481.71 Pa
    θsi = 2 + 0.700 × (20 − 2) = 14.60 °C;  psat(14.6 °C) = 1662.01 Pa
    φsi = 1481.71 / 1662.01 = 89.15 %: above the 80 % mould limit.
    Today the corner reads 1403.28 / psat(15.5 °C) = 1403.28 / 1761.15 = 79.68 %: it looks
    safe on the day.
    """
    f = (15.5 - 5.0) / (20.0 - 5.0)
    p_i, p_e = 0.60 * _psat(20.0), 0.80 * _psat(5.0)
    excess_d = (p_i - p_e) * 0.90 / 0.75
    p_room_d = 0.90 * _psat(2.0) + excess_d
    theta = 2.0 + f * (20.0 - 2.0)
    assert (round(f, 3), round(p_i, 2), round(p_e, 2)) == (0.7, 1403.28, 697.99)
    assert (round(excess_d, 2), round(theta, 2)) == (846.35, 14.6)

    projection = season.project_room(_room(), DesignMonth(2.0, 90.0))
    corner = projection.surfaces[0]
    assert corner.temperature_factor == pytest.approx(f, rel=1e-12)
    assert projection.design_vapour_pressure_excess_pa == pytest.approx(excess_d, rel=1e-9)
    assert projection.design_vapour_pressure_pa == pytest.approx(p_room_d, rel=1e-9)
    assert corner.design_surface_temp_c == pytest.approx(theta, abs=1e-9)
    assert corner.design_surface_rh_pct == pytest.approx(100 * p_room_d / _psat(theta), rel=1e-9)
    assert corner.design_surface_rh_pct == pytest.approx(89.15, abs=0.005)
    assert corner.today_surface_rh_pct == pytest.approx(79.68, abs=0.005)
    assert corner.safe_today and corner.only_safe_today
    assert projection.humidity_class == 4
    assert projection.excess_model is ExcessModel.CLASS_LINE and projection.indoor_measured


def test_excess_held_as_measured_and_a_design_indoor_temperature():
    """Held as measured, Δp,d = Δp = 705.29 Pa; with the room held at 21 °C,
    θsi = 2 + 0.7 × (21 − 2) = 15.30 °C (hand arithmetic as above)."""
    projection = season.project_room(
        _room(), DesignMonth(2.0, 90.0, indoor_temp_c=21.0), ExcessModel.MEASURED
    )
    corner = projection.surfaces[0]
    excess = 0.60 * _psat(20.0) - 0.80 * _psat(5.0)
    assert projection.design_vapour_pressure_excess_pa == pytest.approx(excess, rel=1e-9)
    assert corner.design_surface_temp_c == pytest.approx(15.3, abs=1e-9)
    expected = 100 * (0.90 * _psat(2.0) + excess) / _psat(15.3)
    assert corner.design_surface_rh_pct == pytest.approx(expected, rel=1e-9)
    assert not projection.indoor_measured and projection.indoor_temp_c == 21.0


def test_a_frozen_surface_is_judged_against_ice():
    """A surface projected below 0 °C is judged over ice (psychrolib's saturation below the
    triple point): a poor corner (fRsi 0.2) in a −10 °C month sits at −10 + 0.2 × 30 =
    −4 °C, and the room's air, 1403 Pa of vapour, condenses there as frost."""
    room = _room(ti=20.0, te=5.0, surfaces=(("Bridge", 8.0, "external_wall"),))
    projection = season.project_room(room, DesignMonth(-10.0, 90.0))
    bridge = projection.surfaces[0]
    assert bridge.design_surface_temp_c == pytest.approx(-4.0, abs=1e-9)
    assert bridge.design_surface_rh_pct == pytest.approx(
        100 * projection.design_vapour_pressure_pa / _psat(-4.0), rel=1e-9
    )
    assert bridge.state is DesignState.CONDENSING and bridge.fails_in_month
    assert "frost would form on it" in ws.state_text(bridge, projection, room, words.SI)


# --- the range ------------------------------------------------------------------------------------


def test_range_from_the_surface_thermometer_alone():
    """With only the surface thermometer uncertain (±1 K, u = 1/√3 K, GUM 4.3.7), the range is
    φ·exp(±2·L(θsi)·(D/Δ)·u) with D/Δ = 18/15 and L = d ln psat/dt at 14.6 °C (a central
    difference of psychrolib's psat): the first-order formula, worked here by hand."""
    accuracy = assess.Accuracy(air_temp_k=0.0, rh_pct=0.0, surface_temp_k=1.0)
    projection = season.project_room(_room(accuracy=accuracy), DesignMonth(2.0, 90.0))
    corner = projection.surfaces[0]
    slope = (math.log(_psat(14.601)) - math.log(_psat(14.599))) / 0.002
    u = slope * (18.0 / 15.0) / math.sqrt(3.0)
    rh = corner.design_surface_rh_pct
    assert corner.design_surface_rh_low_pct == pytest.approx(rh * math.exp(-2 * u), rel=1e-5)
    assert corner.design_surface_rh_high_pct == pytest.approx(rh * math.exp(2 * u), rel=1e-5)
    # θsi moves by (D/Δ)·δts: U(θsi) = 2 × 1.2 / √3 K
    assert corner.design_surface_temp_uncertainty_k == pytest.approx(2.4 / math.sqrt(3), rel=1e-9)
    assert projection.design_vapour_pressure_excess_uncertainty_pa == 0.0


def _by_hand(ts, ti, te, rhi, rhe, te_d=2.0, rhe_d=90.0):
    """The projection's surface RH from raw readings, the module's formulas written again."""
    f = (ts - te) / (ti - te)
    excess = (rhi / 100 * _psat(ti) - rhe / 100 * _psat(te)) * ((20 - te_d) / 20) / ((20 - te) / 20)
    theta = te_d + f * (ti - te_d)
    return 100 * (rhe_d / 100 * _psat(te_d) + max(excess, 0.0)) / _psat(theta)


@pytest.mark.parametrize("shared", [True, False])
def test_range_covers_a_monte_carlo_of_the_readings(shared):
    """GUM Supplement 1 style (seeded): the readings drawn from their rectangular
    accuracies (air ±0.5 K, RH ±3 %, surface ±1 K; one thermometer for room and outdoors, or
    two), each projected by the formulas: about 95 % of the draws fall inside the range (the
    first-order band, coverage factor 2), and the spread of ln φ matches u to 10 %."""
    accuracy = assess.Accuracy(shared_thermometer=shared)
    projection = season.project_room(_room(accuracy=accuracy), DesignMonth(2.0, 90.0))
    corner = projection.surfaces[0]
    rng = random.Random(13788)
    inside, logs = 0, []
    draws = 20000
    for _ in range(draws):
        e_room = rng.uniform(-0.5, 0.5)
        e_out = e_room if shared else rng.uniform(-0.5, 0.5)
        rh = _by_hand(
            15.5 + rng.uniform(-1.0, 1.0),
            20.0 + e_room,
            5.0 + e_out,
            60.0 + rng.uniform(-3.0, 3.0),
            80.0 + rng.uniform(-3.0, 3.0),
        )
        inside += corner.design_surface_rh_low_pct <= rh <= corner.design_surface_rh_high_pct
        logs.append(math.log(rh))
    assert 0.93 <= inside / draws <= 0.985
    mean = sum(logs) / draws
    spread = math.sqrt(sum((x - mean) ** 2 for x in logs) / (draws - 1))
    u = math.log(corner.design_surface_rh_high_pct / corner.design_surface_rh_pct) / 2.0
    assert spread == pytest.approx(u, rel=0.10)


@pytest.mark.parametrize("shared", [True, False])
def test_range_carries_the_thermometer_correlation(shared):
    """Only the air thermometer uncertain (±0.5 K): read by one thermometer, the room and
    outdoor errors are one error (GUM 5.2) and move fRsi and the excess together; read by
    two, they are independent. The Monte Carlo spread of ln φ (seeded, 20 000 draws) matches
    the range's u to 5 % in each case, and the two cases differ by more than that."""
    accuracy = assess.Accuracy(
        air_temp_k=0.5, rh_pct=0.0, surface_temp_k=0.0, shared_thermometer=shared
    )
    corner = season.project_room(_room(accuracy=accuracy), DesignMonth(2.0, 90.0)).surfaces[0]
    u = math.log(corner.design_surface_rh_high_pct / corner.design_surface_rh_pct) / 2.0
    rng = random.Random(5)
    logs = []
    for _ in range(20000):
        e_room = rng.uniform(-0.5, 0.5)
        e_out = e_room if shared else rng.uniform(-0.5, 0.5)
        logs.append(math.log(_by_hand(15.5, 20.0 + e_room, 5.0 + e_out, 60.0, 80.0)))
    mean = sum(logs) / len(logs)
    spread = math.sqrt(sum((x - mean) ** 2 for x in logs) / (len(logs) - 1))
    assert spread == pytest.approx(u, rel=0.05)
    other = assess.Accuracy(
        air_temp_k=0.5, rh_pct=0.0, surface_temp_k=0.0, shared_thermometer=not shared
    )
    twin = season.project_room(_room(accuracy=other), DesignMonth(2.0, 90.0)).surfaces[0]
    u_other = math.log(twin.design_surface_rh_high_pct / twin.design_surface_rh_pct) / 2.0
    assert abs(u_other - u) > 0.1 * u


def test_state_follows_the_range():
    """A range across the mould limit is unclear, naming the states it spans; one wholly
    above it fails; the central value alone does not decide."""
    projection = season.project_room(_room(), DesignMonth(2.0, 90.0))
    corner = projection.surfaces[0]
    assert corner.design_surface_rh_low_pct < 80.0 < corner.design_surface_rh_pct
    assert corner.design_surface_rh_high_pct > 100.0
    assert corner.state is DesignState.CANNOT_TELL
    assert corner.possible == (DesignState.BELOW, DesignState.ABOVE, DesignState.CONDENSING)
    assert corner.may_fail_in_month and not corner.fails_in_month
    exact = assess.Accuracy(air_temp_k=0.0, rh_pct=0.0, surface_temp_k=0.0)
    settled = season.project_room(_room(accuracy=exact), DesignMonth(2.0, 90.0)).surfaces[0]
    assert settled.state is DesignState.ABOVE and settled.possible == (DesignState.ABOVE,)
    assert settled.fails_in_month


# --- the lowest month a surface bears -----------------------------------------------------------


def _solved_room(**more):
    # fRsi 0.8 in a 20 °C room: the corner meets the limit at the warm end of the search
    return _room(surfaces=(("Corner", 17.0, "external_wall"),), **more)


def test_lowest_month_gives_exactly_the_limit():
    """Projected to the solved month (its RH and the room held as in the search), the
    surface sits at the 80 % mould limit; 0.1 K warmer it meets it, 0.1 K colder it does not."""
    month = DesignMonth(2.0, 90.0)
    lowest = season.project_room(_solved_room(), month).surfaces[0].lowest_month
    assert lowest.outcome is InverseOutcome.SOLVED
    t = lowest.outdoor_temp_c
    limit = th.value("surface_rh_mould_limit_pct")

    def at(temp):
        return season.project_room(_solved_room(), DesignMonth(temp, 90.0)).surfaces[0]

    assert at(t).design_surface_rh_pct == pytest.approx(limit, abs=1e-3)
    assert at(t + 0.1).design_surface_rh_pct < limit < at(t - 0.1).design_surface_rh_pct
    # the range: the same search on the band's ends
    for (outcome, temp), side in ((lowest.low_end, "low"), (lowest.high_end, "high")):
        if outcome is InverseOutcome.SOLVED:
            assert getattr(at(temp), f"design_surface_rh_{side}_pct") == pytest.approx(
                limit, abs=1e-3
            )


def test_lowest_month_bracket_is_stated():
    """The search runs from −30 °C (our choice) to the room's temperature less the 10 K the
    temperature factor needs (20 − 10 = 10 °C here), at the month's RH and the room as held."""
    lowest = season.project_room(_solved_room(), DesignMonth(2.0, 90.0)).surfaces[0].lowest_month
    assert (lowest.bracket_low_c, lowest.bracket_high_c) == (-30.0, 10.0)
    assert (lowest.outdoor_rh_pct, lowest.indoor_temp_c) == (90.0, 20.0)
    text = ws.lowest_month_sentence(
        season.project_room(_solved_room(), DesignMonth(2.0, 90.0)).surfaces[0],
        season.project_room(_solved_room(), DesignMonth(2.0, 90.0)),
        words.SI,
    )
    assert "down to" in text and "90 % outdoor RH" in text and "20.0 °C" in text


def test_lowest_month_at_the_ends_of_the_bracket():
    """A good wall (fRsi 0.9) in a dry room meets the limit in every month looked at; a cold
    corner (fRsi 0.3) is over it already at the warm end."""
    good = _room(rhi=45.0, surfaces=(("Wall", 18.5, "external_wall"),))
    cold = _room(surfaces=(("Corner", 9.5, "external_wall"),))
    month = DesignMonth(0.0, 90.0)
    good_m = season.project_room(good, month).surfaces[0].lowest_month
    cold_m = season.project_room(cold, month).surfaces[0].lowest_month
    assert good_m.outcome is InverseOutcome.MEETS_THROUGHOUT
    assert cold_m.outcome is InverseOutcome.FAILS_AT_WARM_END
    assert "every month down to -30 °C" in ws.lowest_month_sentence(
        season.project_room(good, month).surfaces[0], season.project_room(good, month), words.SI
    )


def test_a_room_too_cool_for_a_heated_month_has_no_bracket():
    """Held at −22 °C, the warm end of the search (−22 − 10 = −32 °C) lies below its cold end
    (−30 °C): no month is looked at, and the words say why. The room is dry enough for air at
    −22 °C to hold its excess in that month (0.35 × 872.49 − 0.80 × 335.15 = 37.3 Pa, plus
    0.90 × 19.05 = 17.1 Pa outdoors, is 54.4 Pa, below psat,water(−22 °C) = 105.6 Pa;
    psychrolib's saturation pressures), so the month itself is still projected."""
    room = _room(ti=5.0, rhi=35.0, te=-8.0, surfaces=(("Wall", 0.0, "external_wall"),))
    projection = season.project_room(room, DesignMonth(-40.0, 90.0, indoor_temp_c=-22.0))
    wall = projection.surfaces[0]
    assert wall.lowest_month.outcome is InverseOutcome.NO_BRACKET
    assert ws.lowest_month_text(wall, words.SI) == "–"
    assert "too cool" in ws.lowest_month_sentence(wall, projection, words.SI)


# --- what is not projected ---------------------------------------------------------------------


def test_not_measurable_when_the_difference_was_too_small():
    """Inside only 6 K warmer than outdoors (under the 10 K the assessment needs): the factor
    was not measurable, and the words say so, with the reason."""
    room = _room(ti=20.0, te=14.0)
    projection = season.project_room(room, DesignMonth(0.0, 90.0))
    surface = projection.surfaces[0]
    assert surface.state is DesignState.NOT_MEASURABLE and not surface.projected
    text = ws.surface_sentence(surface, projection, words.SI, room, "this corner")
    assert text.startswith(
        "this corner: cannot be judged: the temperature factor was not measurable today"
    )
    assert "under the 10 K needed" in text


def test_glass_pipes_and_internal_walls_are_not_projected():
    """The temperature factor is judged only for the heated envelope (ELEMENT_POLICY): glass,
    pipes and internal walls are not carried to the month."""
    room = _room(
        surfaces=(("Pane", 8.0, "glazing"), ("Pipe", 9.0, "pipe"), ("Party", 18.0, "internal_wall"))
    )
    projection = season.project_room(room, DesignMonth(0.0, 90.0))
    assert {s.state for s in projection.surfaces} == {DesignState.NOT_PROJECTED}
    assert projection.worst is None


def test_no_outdoor_reading_and_a_month_as_warm_as_the_room():
    """No outdoor reading: nothing measured to carry. A design month as warm as the room: not
    a heated month."""
    none = season.project_room(_room(te=None), DesignMonth(0.0, 90.0))
    assert none.reason is RoomReason.NO_OUTDOOR and none.design_vapour_pressure_excess_pa is None
    warm = season.project_room(_room(), DesignMonth(21.0, 60.0))
    assert warm.reason is RoomReason.INDOOR_NOT_WARMER
    assert warm.surfaces[0].state is DesignState.NOT_PROJECTED


def test_warm_day_falls_back_to_the_measured_excess_and_floors_a_negative_one():
    """Outdoors at 20 °C or above the class line has reached 0: the excess is held as
    measured (said so); a room drier than outdoors is taken at no excess."""
    room = assess.assess_room(
        assess.RoomInput("Cellar", "other", 32.0, 40.0, ()), assess.OutdoorInput(21.0, 90.0)
    )
    projection = season.project_room(room, DesignMonth(0.0, 90.0))
    assert projection.excess_model is ExcessModel.MEASURED and projection.excess_model_fallback
    assert room.vapour_pressure_excess_pa < 0.0
    assert projection.design_vapour_pressure_excess_pa == 0.0
    assert "floor of class 1" in ws.excess_text(projection, words.SI)


# --- the design month --------------------------------------------------------------------------


def test_default_month_is_our_marked_choice():
    """With none given, the month is 0 °C / 90 % RH, both records marked "choice", and the
    words say it is our choice."""
    month = season.default_design_month()
    assert (month.outdoor_temp_c, month.outdoor_rh_pct, month.indoor_temp_c) == (0.0, 90.0, None)
    for key in season.DEFAULT_MONTH_KEYS:
        assert th.get(key).mark == "choice"
    assert month.threshold_keys == season.DEFAULT_MONTH_KEYS
    assert "our choice" in ws.design_month_text(month, words.SI)
    assert th.get("design_month_search_lowest_c").mark == "choice"


def test_site_month_and_its_missing_parts():
    """The site's month is used as given; a part it leaves out is our default, flagged."""
    import msgspec

    site = store.load_survey(FLAT).site
    assert season.site_design_month(site).source == "default"
    partial = msgspec.structs.replace(site, design_outdoor_temp_c=-4.0)
    month = season.site_design_month(partial)
    assert (month.source, month.outdoor_temp_c, month.outdoor_rh_pct) == ("site", -4.0, 90.0)
    assert month.outdoor_rh_default and not month.outdoor_temp_default
    assert "our default is used" in ws.design_month_text(month, words.SI)
    bad = msgspec.structs.replace(site, design_outdoor_temp_c=10.0, design_indoor_temp_c=8.0)
    with pytest.raises(InputError, match="above the design outdoor temperature"):
        season.site_design_month(bad)


@pytest.mark.parametrize(
    ("args", "field"),
    [
        ((-55.0, 90.0), "design outdoor temperature"),
        ((0.0, 0.0), "design outdoor RH"),
        ((0.0, 101.0), "design outdoor RH"),
        ((5.0, 90.0, 5.0), "design indoor temperature"),
    ],
)
def test_a_month_that_cannot_be_projected_to_is_refused(args, field):
    """Outside the psychrometric domain, or an indoor no warmer than outdoors: InputError
    naming the field."""
    with pytest.raises(InputError) as info:
        DesignMonth(*args)
    assert info.value.field == field


# --- words --------------------------------------------------------------------------------------


def _fake(rh, low, high, state, temp=12.0):
    return season.SurfaceProjection(
        "NE corner", "external_wall", state, (state,), assess.FactorState.UNDER, 0.6, 0.05,
        temp, 0.5, rh, low, high, 70.0, assess.MouldState.BELOW,
        assess.CondensationState.CLEAR, None,
    )  # fmt: skip


def test_sentence_reads_as_a_surveyor_would_say_it():
    """The issue's own example, in SI and IP."""
    room = season.project_room(_room(), DesignMonth(0.0, 90.0))
    p = _fake(86.0, 79.0, 93.0, DesignState.ABOVE)
    assert ws.surface_sentence(p, room, words.SI, subject="this corner") == (
        "In a month averaging 0 °C outside, this corner would sit near 86 % surface RH "
        "(79 to 93 %): above the mould limit."
    )
    assert ws.surface_sentence(p, room, words.IP, subject="this corner").startswith(
        "In a month averaging 32 °F outside, this corner"
    )


def test_a_label_is_text_not_a_command():
    """A surface label with an escape sequence is shown with it made visible."""
    room = season.project_room(_room(), DesignMonth(0.0, 90.0))
    p = _fake(86.0, 79.0, 93.0, DesignState.ABOVE)._replace(label="evil\x1b[2J")
    assert "\x1b" not in ws.surface_sentence(p, room, words.SI)
    assert "\x1b" not in " ".join(ws.room_verdict_lines(room._replace(surfaces=(p,))))


# --- survey check --------------------------------------------------------------------------------

_BEDROOM = (
    "--air-temp", "20", "--rh", "60", "--surface", "external_wall:15.5:Corner",
    "--glazing-temp", "8", "--outdoor-temp", "5", "--outdoor-rh", "80", "--use", "bedroom",
)  # fmt: skip
_MONTH = ("--design-outdoor-temp", "2", "--design-outdoor-rh", "90")


def test_check_json_gives_the_design_month_keys(check):
    """--json adds per surface design_surface_temp_c, design_surface_rh_pct (with its range)
    and design_condition, and for the room design_vapour_pressure_excess_pa — the core's
    values (the hand-worked case above)."""
    status, out, err = check(*_BEDROOM, *_MONTH, "--json")
    assert status == 0, err
    data = json.loads(out)
    expected = season.project_room(_room(), DesignMonth(2.0, 90.0))
    corner, pane = data["surfaces"]
    assert corner["design_surface_temp_c"] == pytest.approx(14.6, abs=1e-9)
    assert corner["design_surface_rh_pct"] == pytest.approx(89.15, abs=0.005)
    band = expected.surfaces[0]
    assert corner["design_surface_rh_range_pct"] == pytest.approx(
        [band.design_surface_rh_low_pct, band.design_surface_rh_high_pct]
    )
    assert corner["design_condition"] == "cannot_tell"
    assert corner["design_only_safe_today"] is True
    assert pane["design_condition"] == "not_projected" and pane["design_surface_rh_pct"] is None
    assert data["design_vapour_pressure_excess_pa"] == pytest.approx(846.35, abs=0.005)
    assert data["design_month"]["excess_model"] == "class_line"
    assert data["design_month"]["indoor_as_measured"] is True
    assert "design_month_outdoor_temp_default_c" not in {t["key"] for t in data["thresholds"]}
    lowest = expected.surfaces[0].lowest_month
    assert corner["design_lowest_outdoor_temp_outcome"] == lowest.outcome.value
    assert corner["design_lowest_outdoor_temp_range_outcomes"] == [
        lowest.low_end[0].value,
        lowest.high_end[0].value,
    ]
    assert corner["design_lowest_outdoor_temp_range_c"] == [lowest.low_end[1], lowest.high_end[1]]
    assert data["design_month"]["search_range_c"] == [-30.0, 10.0]


def test_check_without_the_options_has_no_design_keys(check):
    """Without a design month nothing about it is printed (the golden records hold the rest)."""
    status, out, _ = check(*_BEDROOM, "--json")
    data = json.loads(out)
    assert status == 0 and not any(k.startswith("design_") for k in data)
    assert not any(k.startswith("design_") for s in data["surfaces"] for k in s)
    status, text, _ = check(*_BEDROOM)
    assert ws.HEADING not in text


def test_check_table_shows_the_colder_month(check):
    """The table layout prints the section: the month, the excess and each surface."""
    status, out, _ = check(*_BEDROOM, *_MONTH, "--design-indoor-temp", "21")
    assert status == 0
    flat = " ".join(out.split())
    assert ws.HEADING in out
    assert "a month averaging 2 °C outside at 90 % RH, the one given" in flat
    assert "Each room is held at 21 °C." in flat


def test_check_design_options_in_ip_and_held_excess(check):
    """--units ip reads the month in °F (35.6 °F = 2 °C); --design-excess measured holds it."""
    status, out, _ = check(
        "--units", "ip", "--air-temp", "68", "--rh", "60", "--surface",
        "external_wall:59.9:Corner", "--outdoor-temp", "41", "--outdoor-rh", "80",
        "--design-outdoor-temp", "35.6", "--design-outdoor-rh", "90",
        "--design-excess", "measured", "--json",
    )  # fmt: skip
    assert status == 0
    data = json.loads(out)
    assert data["design_month"]["outdoor_temp_c"] == pytest.approx(2.0, abs=1e-9)
    assert data["design_month"]["excess_model"] == "measured"
    excess = 0.60 * _psat(20.0) - 0.80 * _psat(5.0)
    assert data["design_vapour_pressure_excess_pa"] == pytest.approx(excess, rel=1e-6)


@pytest.mark.parametrize(
    ("extra", "message"),
    [
        (("--design-outdoor-temp", "0"), "--design-outdoor-temp 0: give --design-outdoor-rh"),
        (("--design-outdoor-rh", "90"), "--design-outdoor-rh 90: give --design-outdoor-temp"),
        (("--design-indoor-temp", "20"), "--design-indoor-temp 20: give --design-outdoor-temp"),
        ((*_MONTH[:2], "--design-outdoor-rh", "120"), "--design-outdoor-rh 120: relative"),
        (("--design-outdoor-temp", "-70", "--design-outdoor-rh", "90"), "--design-outdoor-temp"),
        (("--design-outdoor-temp", "cold", "--design-outdoor-rh", "90"), "--design-outdoor-temp"),
        ((*_MONTH, "--design-indoor-temp", "1"), "--design-indoor-temp 1: must be above"),
        ((*_MONTH, "--design-excess", "guess"), "--design-excess"),
    ],
)
def test_check_bad_design_input_is_status_2(check, extra, message):
    """Bad input is one line naming the option and the value, exit status 2, nothing else."""
    status, out, err = check(*_BEDROOM, *extra)
    assert status == 2 and out == ""
    assert message in err


# --- the winter flat -----------------------------------------------------------------------------


def test_winter_flat_which_fail_and_which_only_look_safe_today():
    """The example flat in our default month (0 °C / 90 %): the bedroom's corner, wall and
    ceiling, the small bedroom's wall, the kitchen reveal and the bathroom ceiling are over
    the mould limit in the colder month (as they are today); the living room's two walls
    read under the limit today but may pass it in the colder month: they only look safe
    today. The numbers are the core's; the central value of one is checked by the formulas."""
    survey = store.load_survey(FLAT)
    va = evaluate.assess_visit(survey)
    rooms = season.project_site(va.findings, season.site_design_month(survey.site))
    failing = {(r.name, s.label) for r in rooms for s in r.surfaces if s.fails_in_month}
    only_today = {(r.name, s.label) for r in rooms for s in r.surfaces if s.only_safe_today}
    assert failing == {
        ("Main bedroom", "NE corner behind wardrobe, 0.3 m above skirting"),
        ("Main bedroom", "North wall above bed head"),
        ("Main bedroom", "Ceiling at the external-wall junction (edge beam)"),
        ("Small bedroom", "External wall below window"),
        ("Kitchen", "Window reveal, left"),
        ("Bathroom", "Ceiling above bath"),
    }
    assert only_today == {
        ("Living room", "External wall behind sofa"),
        ("Living room", "External wall, open area"),
    }
    # the sofa wall by the formulas: room 19.5 °C / 58 %, outdoors 2 °C / 85 %, wall 15.2 °C
    # (psychrolib's psat at 0 °C is over ice, 0.01 % below water's: inside the tolerance)
    sofa = next(s for s in rooms[2].surfaces if s.label == "External wall behind sofa")
    assert sofa.design_surface_rh_pct == pytest.approx(
        _by_hand(15.2, 19.5, 2.0, 58.0, 85.0, te_d=0.0), rel=2e-4
    )


def test_winter_flat_report_section(tmp_path):
    """The report's colder-month section: its table cells are the projection's typed values,
    its verdict names the failing and only-safe-today surfaces, and the default month is said
    to be our choice, with its records cited."""
    from survey import report
    from survey.report.markdown import Heading, Para, Table

    survey = store.load_survey(FLAT)
    doc = report.build(survey, report.ReportOptions(generated_at="fixed"))
    assert Heading(3, ws.HEADING) in doc.blocks
    va = evaluate.assess_visit(survey)
    position = va.room_ids.index("living")
    expected = season.project_room(va.findings.rooms[position], season.default_design_month())
    table = next(
        b
        for b in doc.blocks
        if isinstance(b, Table) and b.name == "colder_month" and b.room == "living"
    )
    for row, p in zip(table.rows, expected.surfaces, strict=True):
        assert row[0].text == p.label
        assert row[3].value == p.design_surface_rh_pct
        assert row[2].value == p.design_surface_temp_c
    verdict = next(
        b for b in doc.blocks if isinstance(b, Para) and b.name == "colder_month_verdict"
        and b.room == "living"
    )  # fmt: skip
    assert "Only look safe today" in verdict.text and "External wall behind sofa" in verdict.text
    text = report.render(doc)
    assert "our choice: a typical coldest-month mean for a temperate climate" in text
    assert "Default design month, outdoor mean temperature 0 °C‡" in text


def test_a_room_with_nothing_to_project_gets_a_list_not_a_table():
    """The basement being dried: its wet floors and walls are not projected (evaporation
    keeps them cold) nor is an internal wall or a pipe. Each such room says so and lists
    every surface with its reason, instead of a table of dashes."""
    from survey import report
    from survey.report.markdown import Items, Para, Table

    survey = store.load_survey(FLAT.parent / "basement-burst-pipe-drying.json")
    doc = report.build(survey, report.ReportOptions(generated_at="fixed"))
    va = evaluate.assess_visit(survey)
    rooms = season.project_site(va.findings, season.default_design_month())
    assert rooms and not any(p.projected for room in rooms for p in room.surfaces)
    assert not any(isinstance(b, Table) and b.name == "colder_month" for b in doc.blocks)
    leads = {
        b.room: b.text
        for b in doc.blocks
        if isinstance(b, Para) and b.name == "colder_month_verdict"
    }
    lists = {
        b.room: b.items
        for b in doc.blocks
        if isinstance(b, Items) and b.name == "colder_month_surfaces"
    }
    assert set(leads) == set(lists) == set(va.room_ids)
    for room_id, room in zip(va.room_ids, rooms, strict=True):
        assert leads[room_id] == ws.NONE_PROJECTED
        assert [label for label, _ in lists[room_id]] == [p.label + ":" for p in room.surfaces]
    assert lists[va.room_ids[0]][0][1] == (
        "the room is being dried, and evaporation from wet materials keeps its surfaces cold."
    )
    text = report.render(doc)  # no limits listed for a projection nothing was put through
    assert ws.LIMITS_LEAD not in text


def test_a_saturated_room_keeps_its_warning_when_nothing_is_projected():
    """A room so humid that its own air would saturate in the design month (14 °C at 97 %
    here): the reason and what to check stay in the report, before the list of surfaces."""
    from survey import report
    from survey.report.markdown import Para

    survey = store.load_survey(FLAT)
    air = survey.visits[0].rooms[0].air
    air.dry_bulb_c, air.rh_pct = 14.0, 97.0
    va = evaluate.assess_visit(survey)
    room = season.project_room(va.findings.rooms[0], season.default_design_month())
    assert room.reason is season.RoomReason.ROOM_SATURATED
    doc = report.build(survey, report.ReportOptions(generated_at="fixed"))
    texts = [b.text for b in doc.blocks if isinstance(b, Para)]
    assert ws.excess_text(room, words.SI) in texts


def test_report_uses_the_site_month():
    """A site with its own month is projected to it, and the report says it is the site's."""
    import msgspec

    from survey import report

    survey = store.load_survey(FLAT)
    site = msgspec.structs.replace(
        survey.site, design_outdoor_temp_c=-2.0, design_outdoor_rh_pct=88.0
    )
    text = report.markdown_report(
        msgspec.structs.replace(survey, site=site), report.ReportOptions(generated_at="fixed")
    )
    assert "a month averaging -2 °C outside at 88 % RH, the site's" in text
    assert "Default design month" not in text


# --- the app's panel ---------------------------------------------------------------------------


def test_panel_shows_the_projected_surface_rh_beside_todays():
    """The room panel's colder-month lines: the worst surface's RH today and in the month."""
    from survey import evaluate
    from survey.app.panel import panel_text

    survey = store.load_survey(FLAT)
    judged = evaluate.assess_room(survey, 0, "bed1")
    month = season.default_design_month()
    text = panel_text(judged, words.SI, month).plain
    projection = season.project_room(judged.finding, month, with_lowest=False)
    for line in ws.panel_lines(projection, words.SI):
        assert line in text
    assert "99 % today, 100 % or more" in text
    assert ws.HEADING not in panel_text(judged, words.SI).plain


@pytest.mark.slow
async def test_site_screen_edits_the_design_month(tmp_path):
    """The site screen saves a design month typed in its fields, refuses one the projection
    cannot use (indoor no warmer than outdoor) with a message naming the field, and the
    room's panel then projects to the site's month."""
    import shutil

    from test_app_inputs import goto, message_of, type_into

    from survey.app import make_app
    from survey.app.main import DEMO_SOURCE
    from survey.app.panel import LivePanel

    path = tmp_path / "survey.json"
    shutil.copyfile(DEMO_SOURCE, path)
    app = make_app(path, data_dir=tmp_path / "data")
    async with app.run_test(size=(120, 40)) as pilot:
        await goto(pilot, app, "site")
        await type_into(pilot, app, "site-design-outdoor-temp-c", "25")
        await type_into(pilot, app, "site-design-outdoor-rh-pct", "92")
        await type_into(pilot, app, "site-design-indoor-temp-c", "20")
        message = message_of(app, "site-design-indoor-temp-c")
        assert message.startswith("Not saved") and "above the design outdoor" in message
        assert store.load_survey(path).site.design_indoor_temp_c is None
        await type_into(pilot, app, "site-design-outdoor-temp-c", "-3")
        await type_into(pilot, app, "site-design-indoor-temp-c", "-5")
        assert message_of(app, "site-design-indoor-temp-c").startswith("Not saved")
        await type_into(pilot, app, "site-design-indoor-temp-c", "19")
        assert message_of(app, "site-design-indoor-temp-c") == ""
        await goto(pilot, app, "room")
        panel = str(app.screen.query_one(LivePanel).render())
        assert "The colder month (-3 °C outside, 92 % RH)" in panel
    site = store.load_survey(path).site
    assert (site.design_outdoor_temp_c, site.design_outdoor_rh_pct) == (-3.0, 92.0)
    assert site.design_indoor_temp_c == 19.0


def test_panel_says_a_surface_past_saturation_today_as_the_tables_do():
    """A wall corner at 11 °C in a 20 °C, 60 % room (dew point 12.0 °C, CoolProp) is past
    saturation today (its surface RH about 107 %): the panel's colder-month line says
    "100 % or more today", as the tables say it, not the ratio itself."""
    from CoolProp.HumidAirProp import HAPropsSI

    dew = HAPropsSI("D", "T", 293.15, "R", 0.60, "P", 101325.0) - 273.15
    assert dew == pytest.approx(12.0, abs=0.05)
    finding = _room(surfaces=(("Corner", 11.0, "external_wall"),))
    assert finding.surfaces[0].surface_rh_pct > 100.0
    projection = season.project_room(finding, DesignMonth(0.0, 90.0), with_lowest=False)
    (line,) = ws.panel_lines(projection, words.SI)[1:]
    assert line.startswith("Corner: 100 % or more today, ")
