"""The psychrometric core against published tables, CoolProp and Magnus-type formulas.

Sources (see each test):
- ASHRAE Handbook - Fundamentals (2017) ch. 1, Table 2 (saturation humidity ratio) and
  Table 3 (saturation vapour pressure), as used by psychrolib's own test-suite.
- Standard atmosphere, ASHRAE ch. 1 eqn 3 and Table 1 (values as in psychrolib's tests).
- CoolProp ``HAPropsSI`` (real-gas moist air, Herrmann et al. 2009) as an independent library.
- Alduchov & Eskridge (1996) and WMO Guide No. 8 (2008) Annex 4.B Magnus-type formulas.
"""

from __future__ import annotations

import math

import pytest
from CoolProp.HumidAirProp import HAPropsSI
from hypothesis import assume, given, settings
from hypothesis import strategies as st

from survey import psychro
from survey.errors import InputError

# ASHRAE Fundamentals 2017 ch. 1 Table 3, saturation pressure in Pa (over ice below 0 °C).
TABLE_3_SAT_PRESSURE_PA = [
    (-20.0, 103.24),
    (-5.0, 401.74),
    (5.0, 872.6),
    (25.0, 3169.7),
    (50.0, 12351.3),
]
# ASHRAE Fundamentals 2017 ch. 1 Table 2, saturation humidity ratio at 101 325 Pa (over ice
# below 0 °C). The table includes the enhancement factor, so the ideal-gas formula runs
# 0.4-0.5 % low; psychrolib's own tests accept 0.5-1 %.
TABLE_2_SAT_HUMIDITY_RATIO = [
    (-20.0, 0.0006373),
    (-5.0, 0.0024863),
    (5.0, 0.005425),
    (25.0, 0.020173),
    (50.0, 0.086863),
]
# Standard atmosphere, ASHRAE ch. 1 eqn 3 / Table 1, as in psychrolib's tests (±1 Pa).
STANDARD_ATMOSPHERE_PA = [
    (-500.0, 107478.0),
    (0.0, 101325.0),
    (500.0, 95461.0),
    (1000.0, 89875.0),
    (4000.0, 61640.0),
]


@pytest.mark.parametrize(("temp_c", "expected_pa"), TABLE_3_SAT_PRESSURE_PA)
def test_saturation_pressure_matches_ashrae_table_3(temp_c, expected_pa):
    """Saturation pressure over the forming phase agrees with Table 3 within 300 ppm."""
    assert psychro.sat_vapour_pressure_pa(temp_c) == pytest.approx(expected_pa, rel=3e-4)


@pytest.mark.parametrize(("temp_c", "expected"), TABLE_2_SAT_HUMIDITY_RATIO)
def test_saturation_humidity_ratio_matches_ashrae_table_2(temp_c, expected):
    """Air saturated over the forming phase has Table 2's humidity ratio within 1 %
    (ideal gas, no enhancement factor: Table 2 runs 0.4-0.5 % higher)."""
    # Saturation over ice below 0 °C is an RH below 100 % relative to water.
    rh = min(
        100.0,
        100.0
        * psychro.sat_vapour_pressure_pa(temp_c)
        / psychro.sat_vapour_pressure_water_pa(temp_c),
    )
    state = psychro.state_from_rh(temp_c, rh, 101_325.0)
    assert state.humidity_ratio_kg_per_kg == pytest.approx(expected, rel=0.01)
    assert state.humidity_ratio_kg_per_kg < expected  # the known sign of the departure


@pytest.mark.parametrize(("altitude_m", "expected_pa"), STANDARD_ATMOSPHERE_PA)
def test_pressure_from_altitude_matches_standard_atmosphere(altitude_m, expected_pa):
    """Standard-atmosphere pressure within 1 Pa of ASHRAE ch. 1 Table 1."""
    assert psychro.pressure_from_altitude_m(altitude_m) == pytest.approx(expected_pa, abs=1.0)


def test_measured_pressure_wins_over_altitude():
    """A measured pressure is used as given; altitude only when no pressure is measured."""
    assert psychro.site_pressure_pa(altitude_m=1000.0, pressure_pa=99_000.0) == 99_000.0
    assert psychro.site_pressure_pa(altitude_m=1000.0) == pytest.approx(89_875.0, abs=1.0)
    assert psychro.site_pressure_pa() == 101_325.0


def _coolprop_grid():
    for temp_c in range(-20, 51, 5):
        for rh_pct in (10, 25, 40, 55, 70, 85, 95):
            # Below 0 °C, a high RH over water is supersaturated over ice (it would frost at
            # once); CoolProp accepts no RH above 100 % over ice, so such points are left out.
            if rh_pct / 100.0 * psychro.sat_vapour_pressure_water_pa(
                temp_c
            ) < psychro.sat_vapour_pressure_pa(temp_c):
                yield float(temp_c), float(rh_pct)


@pytest.mark.parametrize(("temp_c", "rh_pct"), list(_coolprop_grid()))
def test_state_agrees_with_coolprop(temp_c, rh_pct):
    """Dew/frost point within 0.05 K and humidity ratio within 0.7 % of CoolProp HAPropsSI
    (real-gas moist air; its RH and 'D' are relative to ice below 0 °C, so the water-based
    RH we take is converted first and compared with our condensation point)."""
    pressure = 101_325.0
    state = psychro.state_from_rh(temp_c, rh_pct, pressure)
    rh_coolprop = (
        rh_pct
        / 100.0
        * psychro.sat_vapour_pressure_water_pa(temp_c)
        / psychro.sat_vapour_pressure_pa(temp_c)
    )
    t_k = temp_c + 273.15
    dew_coolprop = HAPropsSI("D", "T", t_k, "P", pressure, "R", rh_coolprop) - 273.15
    w_coolprop = HAPropsSI("W", "T", t_k, "P", pressure, "R", rh_coolprop)
    assert state.condensation_point_c == pytest.approx(dew_coolprop, abs=0.05)
    assert state.humidity_ratio_kg_per_kg == pytest.approx(w_coolprop, rel=0.007)


def test_done_when_case_25c_80pct_matches_psychrolib_and_coolprop():
    """25 °C / 80 %: dew point equals psychrolib's and is within 0.05 K of CoolProp."""
    import psychrolib

    state = psychro.state_from_rh(25.0, 80.0)
    assert state.dew_point_c == pytest.approx(
        psychrolib.GetTDewPointFromRelHum(25.0, 0.8), abs=1e-6
    )
    coolprop = HAPropsSI("D", "T", 298.15, "P", 101325.0, "R", 0.8) - 273.15
    assert state.dew_point_c == pytest.approx(coolprop, abs=0.05)
    # 21.31 °C: CoolProp value rounded, computed for this check.
    assert state.dew_point_c == pytest.approx(21.31, abs=0.01)


def _magnus_water_hpa(temp_c):
    # Alduchov & Eskridge (1996), over water; stated deviation < 0.38 % from -40 to +50 °C.
    return 6.1094 * math.exp(17.625 * temp_c / (243.04 + temp_c))


def _wmo_ice_hpa(temp_c):
    # WMO Guide No. 8 (2008) Annex 4.B, over ice.
    return 6.112 * math.exp(22.46 * temp_c / (272.62 + temp_c))


@pytest.mark.parametrize(
    "temp_c", [-40.0, -30.0, -20.0, -10.0, -5.0, 0.0, 5.0, 15.0, 25.0, 35.0, 50.0]
)
def test_water_saturation_agrees_with_magnus(temp_c):
    """Saturation over (supercooled) water within 0.5 % of Alduchov & Eskridge's Magnus form."""
    ours_hpa = psychro.sat_vapour_pressure_water_pa(temp_c) / 100.0
    assert ours_hpa == pytest.approx(_magnus_water_hpa(temp_c), rel=0.005)


@pytest.mark.parametrize("temp_c", [-40.0, -25.0, -10.0, -1.0])
def test_ice_saturation_agrees_with_wmo_magnus(temp_c):
    """Saturation over ice below 0 °C within 0.1 % of the WMO Magnus formula over ice."""
    ours_hpa = psychro.sat_vapour_pressure_pa(temp_c) / 100.0
    assert ours_hpa == pytest.approx(_wmo_ice_hpa(temp_c), rel=0.001)


def test_rh_below_zero_is_relative_to_water():
    """At −5 °C, 80 % RH means 0.8 × pws over supercooled water (WMO convention), not ice."""
    state = psychro.state_from_rh(-5.0, 80.0)
    # Supercooled water at -5 °C: 6.1094·exp(17.625·-5/238.04) hPa = 421.5 Pa
    # (Alduchov & Eskridge 1996, computed); over ice it would be 401.74 Pa (Table 3).
    assert state.vapour_pressure_pa == pytest.approx(0.8 * 421.5, rel=0.005)
    assert state.frost_point_c is not None
    # Below 0 °C the frost point lies above the dew point over water.
    assert state.frost_point_c > state.dew_point_c
    assert state.condensation_point_c == state.frost_point_c


def test_zero_celsius_80pct_dew_and_frost_points_about_0_4_k_apart():
    """At 0 °C / 80 %, frost point and water dew point differ by about 0.4 K (computed from
    the Magnus-type formulas of WMO Guide No. 8, Annex 4.B)."""
    state = psychro.state_from_rh(0.0, 80.0)
    assert state.frost_point_c - state.dew_point_c == pytest.approx(0.35, abs=0.1)


def test_no_frost_point_above_freezing():
    """Air whose dew point is above 0 °C has no frost point."""
    state = psychro.state_from_rh(5.0, 90.0)
    assert state.frost_point_c is None
    assert state.condensation_point_c == state.dew_point_c


def test_conventions_join_at_the_triple_point():
    """The water saturation pressure is continuous across 0.01 °C, where our supercooled
    branch hands over to psychrolib (both are ASHRAE ch. 1 eqn 6)."""
    t = psychro.TRIPLE_POINT_C
    below = psychro.sat_vapour_pressure_water_pa(t - 1e-6)
    above = psychro.sat_vapour_pressure_water_pa(t + 1e-6)
    assert below == pytest.approx(above, rel=1e-6)
    # 611.657 Pa at the triple point (IAPWS; ASHRAE eqn 6 gives 611.65 within its accuracy).
    assert above == pytest.approx(611.657, rel=1e-4)


@pytest.mark.parametrize(("temp_c", "rh_pct"), [(-5.0, 100.0), (-10.0, 95.0), (-20.0, 90.0)])
def test_air_supersaturated_over_ice_has_a_frost_point_above_air_temperature(temp_c, rh_pct):
    """High RH (over water) below 0 °C is supersaturated over ice: the frost point lies above
    the air temperature, and agrees with CoolProp's (given the vapour pressure) within 0.06 K
    (CoolProp includes the enhancement factor, about 0.5 % in pressure, 0.05 K here)."""
    state = psychro.state_from_rh(temp_c, rh_pct)
    assert state.frost_point_c > temp_c
    coolprop = (
        HAPropsSI("D", "T", temp_c + 273.15, "P", 101325.0, "P_w", state.vapour_pressure_pa)
        - 273.15
    )
    assert state.frost_point_c == pytest.approx(coolprop, abs=0.06)
    # A surface at air temperature frosts: surface RH over ice above 100 %.
    assert psychro.surface_rh_pct(state, temp_c) > 100.0


def test_extremely_dry_air_is_refused_with_a_message():
    """RH below 0.1 % is refused as InputError (psychrolib cannot solve the dew point)."""
    with pytest.raises(InputError) as info:
        psychro.state_from_rh(-50.0, 0.01)
    assert "too dry" in info.value.allowed
    assert psychro.state_from_rh(-50.0, 0.1).dew_point_c < -90.0


def test_surface_below_zero_is_judged_against_ice():
    """A surface below 0 °C frosts at the frost point: surface RH (over ice) is 100 % there."""
    state = psychro.state_from_rh(20.0, 20.0)  # condensation point below 0 °C
    assert state.frost_point_c is not None and state.frost_point_c < 0.0
    assert psychro.surface_rh_pct(state, state.frost_point_c) == pytest.approx(100.0, abs=0.01)


def test_from_dew_point_and_from_wet_bulb_round_trip():
    """Entering the dew point or the wet bulb of a state gives the same state back."""
    state = psychro.state_from_rh(23.0, 55.0, 98_000.0)
    by_dew = psychro.state_from_dew_point(23.0, state.dew_point_c, 98_000.0)
    by_wet = psychro.state_from_wet_bulb(23.0, state.wet_bulb_c, 98_000.0)
    assert by_dew.rh_pct == pytest.approx(55.0, abs=1e-3)
    assert by_wet.rh_pct == pytest.approx(55.0, abs=0.01)
    assert by_wet.humidity_ratio_kg_per_kg == pytest.approx(
        state.humidity_ratio_kg_per_kg, rel=1e-4
    )


def test_state_values_agree_with_coolprop_enthalpy_volume_wet_bulb():
    """Enthalpy change within 0.5 kJ/kg, specific volume within 0.3 % and wet bulb within
    0.1 K of CoolProp at 30 °C / 60 % (CoolProp's enthalpy datum differs from ASHRAE's, so
    enthalpy is compared as the difference between two states)."""
    p = 101_325.0
    a = psychro.state_from_rh(30.0, 60.0, p)
    b = psychro.state_from_rh(20.0, 40.0, p)
    h = lambda t, r: HAPropsSI("H", "T", t + 273.15, "P", p, "R", r)  # noqa: E731
    dh_coolprop = h(30.0, 0.6) - h(20.0, 0.4)
    assert a.enthalpy_j_per_kg - b.enthalpy_j_per_kg == pytest.approx(dh_coolprop, abs=500.0)
    v_coolprop = HAPropsSI("V", "T", 303.15, "P", p, "R", 0.6)
    assert a.specific_volume_m3_per_kg == pytest.approx(v_coolprop, rel=0.003)
    wb_coolprop = HAPropsSI("B", "T", 303.15, "P", p, "R", 0.6) - 273.15
    assert a.wet_bulb_c == pytest.approx(wb_coolprop, abs=0.1)
    # Absolute humidity = W / v, g/m³.
    assert a.absolute_humidity_g_per_m3 == pytest.approx(
        1000 * a.humidity_ratio_kg_per_kg / a.specific_volume_m3_per_kg
    )


def test_max_room_rh_for_a_cold_surface():
    """Highest room RH keeping a 12.5 °C surface under 80 % when the room is 21 °C:
    0.8 × pws(12.5)/pws(21) = 0.8 × 1449.4/2487.9 = 46.6 % (psychrolib pws, computed;
    Magnus (Alduchov & Eskridge) gives 46.6 % too)."""
    rh = psychro.max_room_rh_pct(21.0, 12.5, 80.0)
    magnus = 80.0 * _magnus_water_hpa(12.5) / _magnus_water_hpa(21.0)
    assert rh == pytest.approx(magnus, abs=0.2)
    assert rh == pytest.approx(46.6, abs=0.1)
    state = psychro.state_from_rh(21.0, rh)
    assert psychro.surface_rh_pct(state, 12.5) == pytest.approx(80.0, abs=1e-6)


def test_max_room_rh_is_capped_at_100_for_a_warm_surface():
    """A surface warmer than the room bears any room RH."""
    assert psychro.max_room_rh_pct(20.0, 25.0, 80.0) == 100.0


def test_surface_temp_for_rh_inverts_surface_rh():
    """The surface temperature found for 80 % gives 80 % back."""
    state = psychro.state_from_rh(20.0, 60.0)
    ts = psychro.surface_temp_for_rh_c(state, 80.0)
    assert psychro.surface_rh_pct(state, ts) == pytest.approx(80.0, rel=1e-4)


def test_surface_temp_for_rh_refuses_answers_outside_the_domain():
    """No surface temperature in the domain keeps very humid air under 1 % surface RH."""
    state = psychro.state_from_rh(60.0, 90.0)
    with pytest.raises(InputError):
        psychro.surface_temp_for_rh_c(state, 1.0)
    # 60 °C / 90 % with a 50 % limit: 74.5 °C, above the 70 °C air-temperature cap but in
    # the surface domain (computed: pws(Ts) = 0.9 · pws(60) / 0.5).
    ts = psychro.surface_temp_for_rh_c(state, 50.0)
    assert ts > 70.0
    assert psychro.surface_rh_pct(state, ts) == pytest.approx(50.0, rel=1e-4)


@pytest.mark.parametrize(
    ("call", "field"),
    [
        (lambda: psychro.state_from_rh(21.0, 120.0), "relative humidity"),
        (lambda: psychro.state_from_rh(21.0, 0.0), "relative humidity"),
        (lambda: psychro.state_from_rh(21.0, -3.0), "relative humidity"),
        (lambda: psychro.state_from_rh(21.0, 0.05), "relative humidity"),
        (lambda: psychro.state_from_rh(21.0, float("inf")), "relative humidity"),
        (lambda: psychro.state_from_rh(21.0, 50.0, 1e308), "pressure"),
        (lambda: psychro.state_from_rh(75.0, 50.0), "dry bulb"),
        (lambda: psychro.state_from_rh(-51.0, 50.0), "dry bulb"),
        (lambda: psychro.state_from_rh(21.0, 50.0, 40_000.0), "pressure"),
        (lambda: psychro.state_from_rh(21.0, 50.0, 120_000.0), "pressure"),
        (lambda: psychro.state_from_rh(float("nan"), 50.0), "dry bulb"),
        (lambda: psychro.state_from_dew_point(20.0, 22.0), "dew point"),
        (lambda: psychro.state_from_wet_bulb(20.0, 22.0), "wet bulb"),
        (lambda: psychro.state_from_wet_bulb(40.0, -20.0), "wet bulb"),
        (lambda: psychro.pressure_from_altitude_m(9000.0), "altitude"),
        (
            lambda: psychro.surface_rh_pct(psychro.state_from_rh(20, 50), 150.0),
            "surface temperature",
        ),
    ],
)
def test_out_of_domain_raises_input_error(call, field):
    """Values outside the documented domain raise InputError naming the field."""
    with pytest.raises(InputError) as info:
        call()
    assert info.value.field == field
    assert info.value.allowed


# --- properties --------------------------------------------------------------------------

temps = st.floats(min_value=-50.0, max_value=70.0, allow_nan=False)
rhs = st.floats(min_value=0.5, max_value=100.0, allow_nan=False)
pressures = st.floats(min_value=50_000.0, max_value=110_000.0, allow_nan=False)


@settings(max_examples=200, deadline=None)
@given(temps, rhs, pressures)
def test_dew_point_never_above_dry_bulb(temp_c, rh_pct, pressure_pa):
    """The dew point never exceeds the dry bulb; the frost point does so only for air that
    is supersaturated over ice (RH over water above pws_ice / pws_water)."""
    state = psychro.state_from_rh(temp_c, rh_pct, pressure_pa)
    assert state.dew_point_c <= temp_c + 1e-9
    supersaturated_over_ice = state.vapour_pressure_pa > psychro.sat_vapour_pressure_pa(temp_c) * (
        1 + 1e-9
    )
    assert (state.condensation_point_c > temp_c + 1e-3) <= supersaturated_over_ice


@settings(max_examples=200, deadline=None)
@given(temps, rhs, rhs, pressures)
def test_humidity_ratio_rises_with_rh(temp_c, rh_a, rh_b, pressure_pa):
    """At fixed temperature and pressure, more RH means a higher humidity ratio."""
    assume(abs(rh_a - rh_b) > 1e-6)
    low, high = sorted((rh_a, rh_b))
    w_low = psychro.state_from_rh(temp_c, low, pressure_pa).humidity_ratio_kg_per_kg
    w_high = psychro.state_from_rh(temp_c, high, pressure_pa).humidity_ratio_kg_per_kg
    assert w_high > w_low


@settings(max_examples=300, deadline=None)
@given(temps, rhs, st.floats(min_value=-60.0, max_value=90.0, allow_nan=False))
def test_surface_rh_reaches_100_exactly_at_the_condensation_point(temp_c, rh_pct, surface_c):
    """Surface RH ≥ 100 % exactly when the surface is at or below the dew/frost point
    (outside a 0.01 K band: the dew point is found by Newton iteration to 0.001 K)."""
    state = psychro.state_from_rh(temp_c, rh_pct)
    point = state.condensation_point_c
    assume(abs(surface_c - point) > 0.01)
    assert (psychro.surface_rh_pct(state, surface_c) >= 100.0) == (surface_c <= point)
