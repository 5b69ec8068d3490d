"""Per-surface and per-room findings against published limits, formulas and CoolProp."""

from __future__ import annotations

import math

import pytest
from CoolProp.HumidAirProp import HAPropsSI

from survey import assess, psychro
from survey import thresholds as th
from survey.assess import (
    Accuracy,
    CondensationState,
    FactorState,
    MaterialInput,
    MouldState,
    OutdoorInput,
    RoomInput,
    SurfaceInput,
    TimberState,
)
from survey.errors import InputError

P = 101_325.0
EXACT = Accuracy(0.0, 0.0, 0.0)  # no instrument error: states are decided by the value alone


def coolprop_pw(temp_c: float, rh_pct: float, pressure: float = P) -> float:
    """Water vapour partial pressure, Pa, from CoolProp's real-gas moist air."""
    return HAPropsSI("P_w", "T", temp_c + 273.15, "P", pressure, "R", rh_pct / 100.0)


def one_surface(air_c, rh, ts, use="other", outdoor=None, accuracy=EXACT):
    room = RoomInput("Room", use, air_c, rh, (SurfaceInput("S", ts),))
    return assess.assess_room(room, outdoor, P, accuracy)


# --- the light state agrees with psychro ------------------------------------------------------


@pytest.mark.parametrize(
    ("air_c", "rh"),
    [
        (21.0, 65.0),
        (18.0, 72.0),
        (35.0, 90.0),
        (5.0, 40.0),
        (0.5, 95.0),
        (-5.0, 80.0),
        (-20.0, 60.0),
        (-20.0, 90.0),  # frost points; -20/90 is supersaturated over ice
        (-45.0, 30.0),
    ],
)
def test_air_state_matches_psychro(air_c, rh):
    """The assessment's light state equals psychro.state_from_rh on both sides of 0 °C."""
    light = assess.air_state(air_c, rh, P)
    full = psychro.state_from_rh(air_c, rh, P)
    assert light.condensation_point_c == pytest.approx(full.condensation_point_c, abs=1e-9)
    assert light.vapour_pressure_pa == pytest.approx(full.vapour_pressure_pa, rel=1e-12)
    assert light.humidity_ratio_kg_per_kg == pytest.approx(full.humidity_ratio_kg_per_kg, rel=1e-12)
    assert light.specific_volume_m3_per_kg == pytest.approx(
        full.specific_volume_m3_per_kg, rel=1e-12
    )


@pytest.mark.parametrize("temp_c", [-40.0, -5.0, -0.5, 0.0, 0.5, 12.0, 25.0, 60.0])
def test_saturation_slope_matches_a_numerical_difference(temp_c):
    """d ln p_ws/dt used for the sensitivities equals a central difference of psychro's
    saturation pressure on the same side of the triple point (ASHRAE ch. 1 eqn 5 & 6)."""
    h = 1e-4
    side = -1.0 if temp_c <= psychro.TRIPLE_POINT_C else 1.0
    t0 = temp_c + side * 2 * h  # stay on one phase
    numeric = (
        math.log(psychro.sat_vapour_pressure_pa(t0 + h))
        - math.log(psychro.sat_vapour_pressure_pa(t0 - h))
    ) / (2 * h)
    assert psychro.dln_sat_vapour_pressure_per_k(t0) == pytest.approx(numeric, rel=1e-5)
    if temp_c > psychro.TRIPLE_POINT_C:  # over water both slopes are eqn 6's
        assert psychro.dln_sat_vapour_pressure_water_per_k(t0) == pytest.approx(numeric, rel=1e-5)


@pytest.mark.parametrize("temp_c", [-45.0, -20.0, -5.0, -0.5])
def test_supercooled_water_slope_matches_a_numerical_difference(temp_c):
    """The slope of the supercooled-water continuation equals its central difference."""
    h = 1e-4
    numeric = (
        math.log(psychro.sat_vapour_pressure_water_pa(temp_c + h))
        - math.log(psychro.sat_vapour_pressure_water_pa(temp_c - h))
    ) / (2 * h)
    assert psychro.dln_sat_vapour_pressure_water_per_k(temp_c) == pytest.approx(numeric, rel=1e-5)


# --- surface RH: worked cases -----------------------------------------------------------------


def test_surface_rh_worked_case_from_ashrae_table_3():
    """25 °C / 50 % air on a 5 °C surface: RH_s = RH · p_ws(25)/p_ws(5) = 50 × 3169.7 / 872.6
    = 181.6 % (p_w = RH·p_ws(t_i), RH_s = p_w / p_ws(t_s); p_ws from ASHRAE Fundamentals
    2017 ch. 1 Table 3 [R], each to 3e-4)."""
    surface = one_surface(25.0, 50.0, 5.0).surfaces[0]
    assert surface.surface_rh_pct == pytest.approx(50.0 * 3169.7 / 872.6, rel=7e-4)
    assert surface.condensation is CondensationState.CONDENSING
    assert surface.mould is MouldState.ABOVE


def test_surface_rh_at_the_magnus_dew_point_is_100():
    """20 °C / 60 % has its dew point at 12.0 °C by the Alduchov-Eskridge Magnus formula
    (es = 6.1094 exp(17.625 t/(243.04 + t)) hPa, deviation < 0.38 % [R, secondary]), so a
    12.0 °C surface sits at 100 % surface RH, within 0.8 %."""

    def es(t):
        return 6.1094 * math.exp(17.625 * t / (243.04 + t))

    magnus = 60.0 * es(20.0) / es(12.0)
    assert magnus == pytest.approx(100.0, abs=0.01)
    surface = one_surface(20.0, 60.0, 12.0).surfaces[0]
    assert surface.surface_rh_pct == pytest.approx(magnus, rel=0.008)


def test_surface_rh_against_coolprop():
    """Surface RH = p_w(room) / p_ws(surface), both from CoolProp, within 0.3 %."""
    for air_c, rh, ts in [(21.0, 65.0, 12.5), (18.0, 72.0, 15.5), (24.0, 55.0, 17.0)]:
        expected = 100.0 * coolprop_pw(air_c, rh) / coolprop_pw(ts, 100.0)
        got = one_surface(air_c, rh, ts).surfaces[0].surface_rh_pct
        assert got == pytest.approx(expected, rel=0.003)


# --- the limits -------------------------------------------------------------------------------


def test_mould_limit_is_80_percent_surface_rh():
    """BS 5250:2002 Annex D / EN ISO 13788: 80 % surface RH is the limit [R]; exactly at it is
    not above it; 70 % starts 'approaching' (common practice, no source)."""
    air = psychro.state_from_rh(20.0, 60.0)
    at_80 = psychro.surface_temp_for_rh_c(air, 80.0)
    at_70 = psychro.surface_temp_for_rh_c(air, 70.0)
    assert one_surface(20.0, 60.0, at_80 + 0.01).surfaces[0].mould is MouldState.APPROACHING
    assert one_surface(20.0, 60.0, at_80 - 0.01).surfaces[0].mould is MouldState.ABOVE
    assert one_surface(20.0, 60.0, at_70 + 0.01).surfaces[0].mould is MouldState.BELOW
    assert one_surface(20.0, 60.0, at_70 - 0.01).surfaces[0].mould is MouldState.APPROACHING


def test_three_kelvin_margin_rule():
    """20 °C / 50 %: dew point 9.27 °C (CoolProp). Within 3 K of it is 'near' (ISO 8502-4,
    coatings practice [R, secondary]); at or below it, condensing."""
    dew = HAPropsSI("D", "T", 293.15, "P", P, "R", 0.5) - 273.15
    assert dew == pytest.approx(9.274, abs=0.01)

    def state(ts):
        return one_surface(20.0, 50.0, ts).surfaces[0]

    assert state(dew + 3.05).condensation is CondensationState.CLEAR
    assert state(dew + 2.95).condensation is CondensationState.NEAR
    assert state(dew + 0.05).condensation is CondensationState.NEAR
    assert state(dew - 0.05).condensation is CondensationState.CONDENSING
    assert state(dew + 2.95).dew_point_margin_k == pytest.approx(2.95, abs=0.02)


def _wmo_frost_point_c(air_c: float, rh_pct: float) -> float:
    """Frost point from the WMO Guide No. 8 (2008) Annex 4.B Magnus formulas [R, secondary
    sources]: RH relative to water, e_w = 6.112 exp(17.62 t/(243.12 + t)) hPa; the frost
    point solves e_i = 6.112 exp(22.46 t/(272.62 + t)) hPa = RH · e_w."""
    pw = rh_pct / 100.0 * 6.112 * math.exp(17.62 * air_c / (243.12 + air_c))
    x = math.log(pw / 6.112)
    return 272.62 * x / (22.46 - x)


@pytest.mark.parametrize(("air_c", "rh"), [(-5.0, 80.0), (2.0, 60.0), (-10.0, 90.0)])
def test_frost_point_decides_below_zero(air_c, rh):
    """Below 0 °C the condensation point is the frost point of the WMO ice formula (within
    0.1 K of it; the Magnus fit and ASHRAE's Hyland-Wexler differ by a few hundredths): a
    surface 0.2 K below it gathers frost, one 0.2 K above it does not."""
    frost = _wmo_frost_point_c(air_c, rh)
    finding = one_surface(air_c, rh, frost)
    assert finding.air.condensation_point_c == pytest.approx(frost, abs=0.1)
    below = one_surface(air_c, rh, frost - 0.2).surfaces[0]
    assert below.condensing and below.frost
    assert below.condensation is CondensationState.CONDENSING
    assert not one_surface(air_c, rh, frost + 0.2).surfaces[0].condensing


def test_water_above_zero_is_not_frost():
    """A surface above 0 °C below the dew point gathers water, not frost: 20 °C / 60 % has
    its dew point at 12.0 °C (Alduchov-Eskridge Magnus [R, secondary])."""
    s = one_surface(20.0, 60.0, 11.0).surfaces[0]
    assert s.condensing and not s.frost and not s.below_freezing


def test_temperature_factor_definition():
    """fRsi = (θsi − θe)/(θi − θe) (EN ISO 13788 [M]): 14 °C at 20 °C inside, 0 °C out is 0.70;
    a one-dimensional wall with U = 0.3 W/m²K has fRsi = 1 − 0.25 × 0.3 = 0.925 (Rsi = 0.25
    m²K/W [M]), so its surface sits at 18.5 °C."""
    out = OutdoorInput(0.0, 80.0)
    f = one_surface(20.0, 50.0, 14.0, "bedroom", out).surfaces[0]
    assert f.temperature_factor == pytest.approx(0.70)
    assert f.temperature_factor_limit == 0.75  # BRE IP1/06, dwellings [M]
    assert f.temperature_factor_state is FactorState.UNDER
    wall = one_surface(20.0, 50.0, 20.0 - 0.25 * 0.3 * 20.0, "bedroom", out).surfaces[0]
    assert wall.temperature_factor == pytest.approx(1 - 0.25 * 0.3)
    assert wall.temperature_factor_state is FactorState.MEETS


def test_temperature_factor_needs_ten_kelvin():
    """Below a 10 K inside-outside difference the factor is not judged (common practice, no
    source); an unheated loft has no limit at all."""
    small = one_surface(20.0, 50.0, 15.0, "bedroom", OutdoorInput(11.0, 80.0)).surfaces[0]
    assert small.temperature_factor is None
    assert small.temperature_factor_state is FactorState.NOT_JUDGED
    enough = one_surface(20.0, 50.0, 15.0, "bedroom", OutdoorInput(10.0, 80.0)).surfaces[0]
    assert enough.temperature_factor == pytest.approx(0.5)
    loft = one_surface(5.0, 70.0, 2.0, "loft", OutdoorInput(-10.0, 80.0)).surfaces[0]
    assert loft.temperature_factor_state is FactorState.NOT_APPLICABLE


def test_no_outdoor_reading_means_no_factor_and_no_class():
    """Without outdoor air the factor is not judged and no humidity class is given."""
    finding = one_surface(20.0, 50.0, 15.0, "bedroom")
    assert finding.surfaces[0].temperature_factor_state is FactorState.NOT_JUDGED
    assert finding.humidity_class is None and finding.vapour_pressure_excess_pa is None


# --- room findings ------------------------------------------------------------------------------


def test_humidity_class_of_a_worked_case():
    """20 °C / 60 % inside, 0 °C / 80 % outside: Δp = 914 Pa (CoolProp 918 Pa, which includes
    the enhancement factor; within 1 %), class 4 of ISO 13788 (810 < Δp <= 1080 at θe <= 0 °C,
    from memory)."""
    finding = one_surface(20.0, 60.0, 15.0, "bedroom", OutdoorInput(0.0, 80.0))
    expected = coolprop_pw(20.0, 60.0) - coolprop_pw(0.0, 80.0)
    assert finding.vapour_pressure_excess_pa == pytest.approx(expected, rel=0.01)
    assert finding.humidity_class == 4
    assert finding.humidity_class_possible == (4,)


def test_humidity_class_band_can_span_two_classes():
    """Near a class limit the instruments cannot settle the class: both are listed."""
    # 0 °C outside at 80 %: the class 3/4 limit of 810 Pa is reached at about 54.5 % inside.
    finding = assess.assess_room(
        RoomInput("R", "bedroom", 20.0, 54.5, (SurfaceInput("S", 15.0),)),
        OutdoorInput(0.0, 80.0),
        P,
        Accuracy(),
    )
    assert (
        abs(finding.vapour_pressure_excess_pa - 810.0)
        < finding.vapour_pressure_excess_uncertainty_pa
    )
    assert finding.humidity_class_possible == (3, 4)


def test_highest_room_rh_for_the_coldest_surface():
    """At 20 °C a 12 °C surface stays at 80 % up to RH = 80 × p_ws(12)/p_ws(20) = 48.0 %
    (CoolProp saturation pressures); 3 K above the dew point up to 100 × p_ws(9)/p_ws(20).
    Both equal psychro.max_room_rh_pct, and the room at that RH puts the surface at 80 %."""
    finding = assess.assess_room(
        RoomInput(
            "R", "bedroom", 20.0, 65.0, (SurfaceInput("warm", 16.0), SurfaceInput("cold", 12.0))
        ),
        None,
        P,
        EXACT,
    )
    assert finding.coldest.label == "cold"
    expected = 80.0 * coolprop_pw(12.0, 100.0) / coolprop_pw(20.0, 100.0)
    assert finding.max_room_rh_pct_mould == pytest.approx(expected, rel=0.003)
    assert finding.max_room_rh_pct_mould == pytest.approx(
        psychro.max_room_rh_pct(20.0, 12.0, 80.0), rel=1e-9
    )
    assert finding.max_room_rh_pct_margin == pytest.approx(
        psychro.max_room_rh_pct(20.0, 9.0), rel=1e-9
    )
    assert finding.max_room_rh_pct == min(
        finding.max_room_rh_pct_mould, finding.max_room_rh_pct_margin
    )
    at_limit = psychro.state_from_rh(20.0, finding.max_room_rh_pct_mould)
    assert psychro.surface_rh_pct(at_limit, 12.0) == pytest.approx(80.0, rel=1e-9)


@pytest.mark.parametrize(("rh", "expected"), [(30, 6.2), (50, 9.2), (70, 13.1), (90, 20.5)])
def test_timber_emc_wood_handbook_table_4_2(rh, expected):
    """Wood Handbook eqn 4-5 reproduces Table 4-2 at 70 °F (21.1 °C) to 0.05 % MC (the table
    values from memory)."""
    assert assess.timber_emc_pct(21.1, rh) == pytest.approx(expected, abs=0.05)


def test_materials_against_dry_standard_and_timber_limits():
    """Above the dry standard by more than 10 % (common practice) is 'above'; timber from
    16 % MC is in the mould range (common practice), from 20 % in the decay range (Wood
    Handbook ch. 14 [R, secondary]); wetter than the room's EMC explains is flagged."""
    materials = (
        MaterialInput("skirting", "softwood", 24.0, "mc_pct", 12.0, timber=True),
        MaterialInput("joist", "softwood", 17.0, "mc_pct", None, timber=True),
        MaterialInput("plaster", "gypsum", 105.0, "relative", 100.0),
        MaterialInput("screed", "sand-cement", 150.0, "relative", 100.0),
    )
    room = RoomInput("R", "living", 20.0, 50.0, materials=materials)
    found = {m.label: m for m in assess.assess_room(room).materials}
    assert found["skirting"].dry_standard_state is assess.DryStandardState.ABOVE
    assert found["skirting"].timber_state is TimberState.DECAY_RANGE
    assert found["skirting"].excess_over_dry_standard == 12.0
    # Decay slows below 10 °C and above 35 °C (Wood Handbook ch. 14 [R, secondary]).
    assert found["skirting"].decay_slowed_by_temperature is False
    cold = assess.assess_room(RoomInput("C", "crawlspace", 6.0, 90.0, materials=materials[:1]))
    assert cold.materials[0].decay_slowed_by_temperature is True
    assert found["joist"].timber_state is TimberState.MOULD_RANGE
    assert found["joist"].dry_standard_state is assess.DryStandardState.NO_REFERENCE
    # 20 °C / 50 %: EMC about 9 % (eqn 4-5), so 17 % is more than the air explains.
    assert found["joist"].emc_pct == pytest.approx(9.2, abs=0.3)
    assert found["joist"].wetter_than_air_explains
    assert found["plaster"].dry_standard_state is assess.DryStandardState.AT
    assert found["plaster"].timber_state is None
    assert found["screed"].dry_standard_state is assess.DryStandardState.ABOVE


# --- uncertainty -----------------------------------------------------------------------------


def test_exact_instruments_leave_no_band():
    """Zero accuracy gives zero uncertainty and decided states."""
    s = one_surface(18.0, 72.0, 15.5, "bedroom", OutdoorInput(3.0, 88.0), EXACT).surfaces[0]
    assert s.margin_uncertainty_k == 0.0
    assert s.surface_rh_low_pct == s.surface_rh_pct == s.surface_rh_high_pct
    assert s.condensation is CondensationState.NEAR
    assert s.mould is MouldState.ABOVE


def test_a_limit_inside_the_band_cannot_be_told_apart():
    """18 °C / 72 % on a 15.5 °C surface is 2.6 K above the dew point; with ±0.5 K, ±3 % and
    ±1 K instruments the band (±1.5 K) spans the 3 K margin and the 80 % limit."""
    s = one_surface(18.0, 72.0, 15.5, "bedroom", OutdoorInput(3.0, 88.0), Accuracy()).surfaces[0]
    assert s.dew_point_margin_k == pytest.approx(2.62, abs=0.02)
    assert s.margin_uncertainty_k > 0.62
    assert s.condensation is CondensationState.CANNOT_TELL
    assert s.condensation_possible == (CondensationState.CLEAR, CondensationState.NEAR)
    assert s.mould is MouldState.CANNOT_TELL
    assert s.mould_possible == (MouldState.APPROACHING, MouldState.ABOVE)


def test_better_instruments_settle_the_state():
    """The same surface with ±0.1 K / ±1 % / ±0.1 K instruments is plainly near the dew point."""
    s = one_surface(18.0, 72.0, 15.5, accuracy=Accuracy(0.1, 1.0, 0.1)).surfaces[0]
    assert s.condensation is CondensationState.NEAR


def test_default_accuracies_are_the_typical_specifications():
    """Defaults come from the thresholds table (typical manufacturer specifications, common
    practice): air ±0.5 K, RH ±3 %, surface ±1 K."""
    acc = Accuracy()
    assert (acc.air_temp_k, acc.rh_pct, acc.surface_temp_k) == (0.5, 3.0, 1.0)
    assert acc.air_temp_k == th.value("accuracy_air_temp_k")


@pytest.mark.parametrize(
    "bad",
    [{"air_temp_k": -0.1}, {"rh_pct": 25.0}, {"surface_temp_k": float("nan")}, {"rh_pct": True}],
)
def test_bad_accuracy_is_refused(bad):
    """An accuracy outside 0..limit raises InputError naming the instrument."""
    with pytest.raises(InputError, match="accuracy"):
        Accuracy(**bad)


# --- bad input ---------------------------------------------------------------------------------


@pytest.mark.parametrize(
    ("change", "field"),
    [
        ({"use": "garage"}, "room 'R' use"),
        ({"volume_m3": 0.2}, "room 'R' volume"),
        ({"occupants": 2.5}, "room 'R' occupants"),
        ({"rh_pct": 120.0}, "room 'R' relative humidity"),
        ({"air_temp_c": 99.0}, "room 'R' air temperature"),
        ({"surfaces": (SurfaceInput("north wall", 200.0),)}, "surface temperature of north wall"),
        ({"activities": (assess.Activity("sauna", 1.0),)}, "room 'R' activity"),
        ({"observations": assess.Observations(water_category=4)}, "room 'R' water category"),
    ],
)
def test_bad_room_input_names_the_field(change, field):
    """Bad readings raise InputError whose field names the room and the reading."""
    base = {"name": "R", "use": "bedroom", "air_temp_c": 20.0, "rh_pct": 50.0}
    with pytest.raises(InputError) as caught:
        assess.assess_room(RoomInput(**{**base, **change}))
    assert caught.value.field == field


def test_bad_material_reading_is_refused():
    """A reading on an unknown scale, or out of range, names the material."""
    with pytest.raises(InputError, match="material plaster scale"):
        assess.assess_room(
            RoomInput(
                "R",
                "living",
                20.0,
                50.0,
                materials=(MaterialInput("plaster", "gypsum", 10.0, "ohms"),),
            )
        )
    with pytest.raises(InputError, match="material joist reading"):
        assess.assess_room(
            RoomInput("R", "living", 20.0, 50.0, materials=(MaterialInput("joist", "pine", -1.0),))
        )


def test_site_shares_outdoor_air_and_collects_keys():
    """assess_site judges every room against one outdoor state and lists every key used."""
    rooms = [
        RoomInput("A", "bedroom", 18.0, 70.0, (SurfaceInput("a", 12.0),)),
        RoomInput("B", "kitchen", 21.0, 65.0, (SurfaceInput("b", 14.0),)),
    ]
    site = assess.assess_site(rooms, OutdoorInput(2.0, 85.0), P, Accuracy(), year_built=1930)
    assert [r.name for r in site.rooms] == ["A", "B"]
    assert site.rooms[0].outdoor is site.rooms[1].outdoor is site.outdoor
    assert site.rooms[1].surfaces[0].temperature_factor_limit == 0.80
    assert {
        "frsi_dwelling",
        "frsi_high_humidity",
        "humidity_class_3_pa",
        "surface_rh_mould_limit_pct",
    } <= set(site.threshold_keys)
    for key in site.threshold_keys:
        th.get(key)
    with pytest.raises(InputError, match="year built"):
        assess.assess_site(rooms, year_built=19)


# --- what each kind of surface is judged by -----------------------------------------------------


WINTER_OUTDOOR = OutdoorInput(2.0, 85.0)


def winter_room(*surfaces, outdoor=WINTER_OUTDOOR, accuracy=EXACT):
    room = RoomInput("R", "bedroom", 18.0, 65.0, tuple(surfaces))
    return assess.assess_room(room, outdoor, P, accuracy)


def test_glazing_and_pipes_do_not_set_the_room_rh():
    """A 4 °C pane and an 8 °C pipe are colder than the 12 °C wall, but the coldest surface
    behind the highest safe room RH is the wall: 80 × p_ws(12)/p_ws(18) (CoolProp) = 54.4 %
    (BS 5250 Annex D limit [R]). The pane is reported apart, with the room RH at which it
    stays dry: 100 × p_ws(4)/p_ws(18) = 39.4 % (CoolProp)."""
    finding = winter_room(
        SurfaceInput("pane", 4.0, "glazing"),
        SurfaceInput("wall", 12.0, "external_wall"),
        SurfaceInput("pipe", 8.0, "pipe"),
    )
    assert finding.coldest.label == "wall"
    expected = 80.0 * coolprop_pw(12.0, 100.0) / coolprop_pw(18.0, 100.0)
    assert finding.max_room_rh_pct_mould == pytest.approx(expected, rel=0.003)
    assert finding.coldest_glazing_or_pipe.label == "pane"
    dry = 100.0 * coolprop_pw(4.0, 100.0) / coolprop_pw(18.0, 100.0)
    assert finding.max_room_rh_pct_dry_glazing_or_pipe == pytest.approx(dry, rel=0.003)
    alone = winter_room(SurfaceInput("wall", 12.0, "external_wall"))
    assert finding.max_room_rh_pct == alone.max_room_rh_pct


def test_temperature_factor_only_for_the_envelope():
    """fRsi (EN ISO 13788 [M]) is judged on external walls, ceilings, floors and surfaces
    not said; glazing, frames, pipes and internal walls get no factor and no limit."""
    elements = (
        "external_wall",
        "ceiling",
        "floor",
        "other",
        "internal_wall",
        "glazing",
        "window_frame",
        "pipe",
    )
    finding = winter_room(*(SurfaceInput(e, 10.0, e) for e in elements))
    by = {s.label: s for s in finding.surfaces}
    for element in ("external_wall", "ceiling", "floor", "other"):
        assert by[element].temperature_factor == pytest.approx((10 - 2) / (18 - 2)), element
        assert by[element].temperature_factor_state is FactorState.UNDER
    for element in ("internal_wall", "glazing", "window_frame", "pipe"):
        assert by[element].temperature_factor is None
        assert by[element].temperature_factor_limit is None
        assert by[element].temperature_factor_state is FactorState.NOT_FOR_ELEMENT
    # Glass and pipes are not judged for mould; frames (seals, timber) and walls are.
    assert by["glazing"].mould is MouldState.NOT_JUDGED
    assert by["pipe"].mould is MouldState.NOT_JUDGED
    assert by["window_frame"].mould is MouldState.ABOVE
    assert by["internal_wall"].mould is MouldState.ABOVE
    # Every surface is judged for condensation: 18 °C / 65 % has its dew point at 11.3 °C
    # (CoolProp), so 10 °C condenses whatever it is.
    dew = HAPropsSI("D", "T", 291.15, "P", P, "R", 0.65) - 273.15
    assert dew == pytest.approx(11.3, abs=0.1)
    assert all(s.condensation is CondensationState.CONDENSING for s in finding.surfaces)


def test_an_internal_wall_can_set_the_room_rh():
    """An internal wall is inside the envelope: no factor, but mould on it sets the room RH."""
    finding = winter_room(
        SurfaceInput("party", 13.0, "internal_wall"), SurfaceInput("pane", 5.0, "glazing")
    )
    assert finding.coldest.label == "party"


def test_only_glazing_measured_leaves_no_room_limit():
    """With only a pane measured there is no wall to set the room RH."""
    finding = winter_room(SurfaceInput("pane", 5.0, "glazing"))
    assert finding.coldest is None and finding.max_room_rh_pct is None
    assert finding.coldest_glazing_or_pipe.label == "pane"


def test_unknown_element_is_refused():
    """An element outside the list is refused, naming the surface."""
    with pytest.raises(InputError) as caught:
        winter_room(SurfaceInput("skylight", 5.0, "roof_light"))
    assert caught.value.field == "element of surface skylight"
    assert "glazing" in caught.value.allowed


def test_why_the_factor_cannot_be_judged():
    """No outdoor reading, or an inside-outside difference under 10 K (common practice, no
    source), each gives its reason in words."""
    from survey import words

    def reason(room):
        return words.factor_not_judged_reason(room, words.SI)

    assert reason(winter_room(SurfaceInput("w", 12.0), outdoor=None)) == "no outdoor reading"
    small = winter_room(SurfaceInput("w", 12.0), outdoor=OutdoorInput(12.0, 80.0))
    # 18 − 12 = 6 K inside-outside, under the 10 K needed
    assert reason(small) == "the inside-outside difference is 6.0 K, under the 10 K needed"
    assert reason(winter_room(SurfaceInput("w", 12.0))) is None


@pytest.mark.parametrize(
    ("rh", "outdoor"),
    [(54.5, (0.0, 80.0)), (72.0, (3.0, 88.0)), (45.0, (8.0, 70.0)), (90.0, (-5.0, 95.0))],
)
def test_room_class_is_the_thresholds_rule(rh, outdoor):
    """The room's class is thresholds.humidity_class of its excess (ISO 13788 limits [M]):
    one rule, used by both."""
    finding = assess.assess_room(
        RoomInput("R", "bedroom", 20.0, rh), OutdoorInput(*outdoor), P, Accuracy()
    )
    assert finding.humidity_class == th.humidity_class(
        finding.vapour_pressure_excess_pa, outdoor[0]
    )
    low = th.humidity_class(
        finding.vapour_pressure_excess_pa - finding.vapour_pressure_excess_uncertainty_pa,
        outdoor[0],
    )
    assert finding.humidity_class_possible[0] == low


def test_visible_mould_flag_without_an_area():
    """Mould seen but not measured still counts as mould seen."""
    assert assess.Observations(visible_mould=True).mould_seen
    assert assess.Observations(visible_mould_area_m2=0.5).mould_seen
    assert not assess.Observations().mould_seen


def test_room_bounds_come_from_the_domain():
    """Volume, occupants and accuracies are checked against survey.domain's bounds, and a
    material reading the survey file model allows (up to 1000 on any scale) is assessed."""
    from survey import domain

    with pytest.raises(InputError, match=f"{domain.ROOM_VOLUME_MAX_M3:g}"):
        assess.assess_room(
            RoomInput("R", "living", 20.0, 50.0, volume_m3=domain.ROOM_VOLUME_MAX_M3 * 1.01)
        )
    with pytest.raises(InputError, match=f"{domain.OCCUPANTS_MAX}"):
        assess.assess_room(RoomInput("R", "living", 20.0, 50.0, occupants=domain.OCCUPANTS_MAX + 1))
    with pytest.raises(InputError):
        Accuracy(rh_pct=domain.RH_ACCURACY_MAX_PCT + 0.1)
    Accuracy(
        domain.AIR_TEMP_ACCURACY_MAX_K,
        domain.RH_ACCURACY_MAX_PCT,
        domain.SURFACE_TEMP_ACCURACY_MAX_K,
    )
    wet = MaterialInput("sole plate", "softwood", 240.0, "mc_pct", 12.0, timber=True)
    found = assess.assess_room(RoomInput("R", "living", 20.0, 50.0, materials=(wet,)))
    assert found.materials[0].timber_state is TimberState.DECAY_RANGE


def test_a_surface_warmer_than_the_air_neither_gets_a_factor_nor_sets_the_safe_rh():
    """A wall beside a radiator at 30 °C in 20 °C air (heated): its temperature factor
    would be (30 − 5)/(20 − 5) = 1.67, which says nothing of the fabric's heat loss, so it
    is not judged; with a cold corner at 12 °C beside it, the corner sets the highest safe
    RH: 80 % × p_ws(12 °C)/p_ws(20 °C) = 80 × 1402.6/2338.8 = 48.0 % (psychrolib
    saturation pressures, Hyland-Wexler); with the heated wall alone no surface sets it."""
    outdoor = OutdoorInput(5.0, 80.0)
    heated = SurfaceInput("Behind the radiator", 30.0, "external_wall")
    corner = SurfaceInput("NE corner", 12.0, "external_wall")
    both = assess.assess_room(RoomInput("R", "bedroom", 20.0, 50.0, (heated, corner)), outdoor, P)
    warm, cold = both.surfaces
    assert warm.temperature_factor is None
    assert warm.temperature_factor_state is assess.FactorState.WARMER_THAN_AIR
    assert cold.temperature_factor == pytest.approx((12.0 - 5.0) / (20.0 - 5.0))
    assert both.coldest.label == "NE corner"
    assert both.max_room_rh_pct == pytest.approx(48.0, abs=0.05)
    alone = assess.assess_room(RoomInput("R", "bedroom", 20.0, 50.0, (heated,)), outdoor, P)
    assert alone.coldest is None and alone.max_room_rh_pct is None
    from survey.words.states import no_limit_reason

    assert "warmer than the room air" in no_limit_reason(alone)
