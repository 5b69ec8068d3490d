"""The dehumidifier performance check (survey.equipment): a worked case by hand, every state
against psychrolib (and CoolProp where installed), litres and US pints, the rating
comparison, the findings, and the typed amounts."""

from __future__ import annotations

import dataclasses
import typing

import msgspec
import psychrolib
import pytest

from survey import equipment as eq
from survey import model, psychro, store
from survey import thresholds as th
from survey.equipment import AirPair, DehumidifierInput, FindingKind
from survey.errors import InputError

psychrolib.SetUnitSystem(psychrolib.SI)

P = 101_325.0


def _given(**changes) -> DehumidifierInput:
    """The issue's example: 24 °C / 70 % in, 33 °C / 30 % out, 1.2 L in 3 h at 250 W."""
    base = DehumidifierInput(
        readings=(AirPair(24.0, 70.0, 33.0, 30.0),),
        water_l=1.2,
        duration_h=3.0,
        power_w=250.0,
    )
    return dataclasses.replace(base, **changes)


# --- the worked case -------------------------------------------------------------------------


def test_worked_case_by_hand():
    """24 °C / 70 % in, 33 °C / 30 % out, 1.2 L in 3 h at 250 W, 101 325 Pa, worked by hand
    from ASHRAE Fundamentals 2017 ch. 1 (eqn 6 saturation, eqn 20 W, eqn 30 h):

    pws(24 °C) = 2985.1 Pa; pw = 0.70 × 2985.1 = 2089.6 Pa;
    W_in = 0.621945 × 2089.6 / (101325 − 2089.6) = 0.013096 kg/kg.
    pws(33 °C) = 5034.3 Pa; pw = 0.30 × 5034.3 = 1510.3 Pa;
    W_out = 0.621945 × 1510.3 / (101325 − 1510.3) = 0.0094107 kg/kg.
    ΔW = 0.013096 − 0.0094107 = 0.0036855 kg/kg = 3.6855 g/kg; × 7000 = 25.80 gr/lb.
    Removal = 1.2 L × 24 / 3 h = 9.6 L/day = 9.6 / 0.473176473 = 20.288 US pints/day.
    Energy = 250 W × 3 h = 0.75 kWh; EF = 1.2 / 0.75 = 1.60 L/kWh.
    ṁ_da = 1.2 kg / (0.0036855 × 3 × 3600 s) = 0.030148 kg/s.
    Coil state: saturated at W_out, i.e. at the outlet's dew point (pw 1510.3 Pa) 13.127 °C.
    h_in   = 1.006 × 24 + 0.013096 × (2501 + 1.86 × 24)         = 24.144 + 33.338 = 57.482 kJ/kg
    h_coil = 1.006 × 13.127 + 0.0094107 × (2501 + 1.86 × 13.127) = 13.206 + 23.766 = 36.972
    h(24 °C, W_out) = 24.144 + 0.0094107 × 2545.64              = 48.100
    Condensate leaving as liquid at the coil (ASHRAE ch. 1, cooling and dehumidifying; hw ≈
    4.186 t kJ/kg, from memory): ΔW × hw = 0.0036855 × 4.186 × 13.127 = 0.0036855 × 54.950
    = 0.2025 kJ/kg.
    Q = 0.030148 × (57.482 − 36.972 − 0.2025) = 0.030148 × 20.3075 = 0.6122 kW; latent
    0.030148 × (57.482 − 48.100 − 0.2025) = 0.2767 kW; sensible 0.030148 × (48.100 − 36.972)
    = 0.3355 kW. COP = 612.2 / 250 = 2.449.
    """
    r = eq.check(_given())
    assert r.inlet.humidity_ratio_kg_per_kg == pytest.approx(0.013096, rel=1e-4)
    assert r.outlet.humidity_ratio_kg_per_kg == pytest.approx(0.0094107, rel=1e-4)
    assert r.humidity_ratio_drop_g_per_kg == pytest.approx(3.6855, rel=1e-3)
    assert r.grain_depression_gr_per_lb == pytest.approx(25.80, rel=1e-3)
    assert r.removal_l_per_day == pytest.approx(9.6)
    assert r.removal_pints_per_day == pytest.approx(20.288, rel=1e-4)
    assert r.energy_kwh == pytest.approx(0.75)
    assert r.energy_factor_l_per_kwh == pytest.approx(1.60)
    assert r.air_mass_flow_kg_per_s == pytest.approx(0.030148, rel=1e-3)
    assert r.coil is not None and r.coil.dry_bulb_c == pytest.approx(13.127, abs=2e-3)
    assert r.cooling_capacity_kw == pytest.approx(0.6122, rel=1e-3)
    assert r.latent_cooling_w == pytest.approx(276.7, rel=1e-3)
    assert r.sensible_cooling_w == pytest.approx(335.5, rel=1e-3)
    assert r.latent_cooling_w + r.sensible_cooling_w == pytest.approx(r.cooling_capacity_w)
    assert r.cop == pytest.approx(2.449, rel=1e-3)
    # Volume flow = ṁ × v_in, v from ASHRAE ch. 1 eqn 26 via psychrolib: 0.85952 m³/kg.
    v = psychrolib.GetMoistAirVolume(24.0, r.inlet.humidity_ratio_kg_per_kg, P)
    assert r.air_volume_flow_m3_per_h == pytest.approx(0.030148 * v * 3600.0, rel=1e-3)


def test_latent_cooling_is_the_water_times_its_heat_of_condensation():
    """Cross-check of the latent part: 1.2 kg in 3 h is 0.1111 g/s, taken in as vapour at
    the inlet (2501 + 1.86 t kJ/kg, ASHRAE eqn 30) and leaving as liquid at the coil
    (4.186 t_coil, ASHRAE ch. 1, from memory): 0.1111 × (2545.64 − 54.95) = 276.7 W
    (formula in the test)."""
    r = eq.check(_given())
    coil_c = r.coil.dry_bulb_c
    per_kg = (2501.0 + 1.86 * 24.0 - 4.186 * coil_c) * 1000
    assert r.latent_cooling_w == pytest.approx(1.2 / (3 * 3600) * per_kg, rel=1e-9)


def test_the_condensate_term_is_about_one_percent():
    """The condensate's enthalpy, ΔW · hw(T_coil), is counted: on the worked case it is
    0.2025 of 20.51 kJ/kg, 0.99 % of the coil's enthalpy difference (hand arithmetic in
    test_worked_case_by_hand), so Q_total = ṁ (Δh − ΔW hw)."""
    r = eq.check(_given())
    dh = r.inlet.enthalpy_j_per_kg - r.coil.enthalpy_j_per_kg
    condensate = r.humidity_ratio_drop_kg_per_kg * 4186.0 * r.coil.dry_bulb_c
    assert condensate / dh == pytest.approx(0.0099, abs=5e-4)
    assert r.cooling_capacity_w == pytest.approx(r.air_mass_flow_kg_per_s * (dh - condensate))


def test_liquid_water_enthalpy_against_coolprop():
    """hw = 4.186 t kJ/kg (ASHRAE ch. 1, from memory) within 0.5 % of IAPWS-95 liquid water
    (CoolProp PropsSI, datum the liquid at the triple point) from 1 to 40 °C."""
    props = pytest.importorskip("CoolProp.CoolProp").PropsSI
    datum = props("H", "T", 273.16, "P", P, "Water")
    for t in (1.0, 5.0, 13.127, 20.0, 40.0):
        iapws = props("H", "T", 273.15 + t, "P", P, "Water") - datum
        assert psychro.liquid_water_enthalpy_j_per_kg(t) == pytest.approx(iapws, rel=5e-3)


@pytest.mark.parametrize("pressure_pa", [P, psychrolib.GetStandardAtmPressure(1500.0)])
def test_every_state_agrees_with_psychrolib(pressure_pa):
    """Inlet, outlet and coil states equal psychrolib's own humidity ratio, enthalpy and dew
    point (ASHRAE ch. 1), at sea level and at 1500 m (standard atmosphere, eqn 3)."""
    r = eq.check(_given(pressure_pa=pressure_pa))
    for state, (t, rh) in ((r.inlet, (24.0, 70.0)), (r.outlet, (33.0, 30.0))):
        w = psychrolib.GetHumRatioFromRelHum(t, rh / 100.0, pressure_pa)
        assert state.humidity_ratio_kg_per_kg == pytest.approx(w, rel=1e-9)
        assert state.enthalpy_j_per_kg == pytest.approx(
            psychrolib.GetMoistAirEnthalpy(t, w), rel=1e-9
        )
        assert state.dew_point_c == pytest.approx(
            psychrolib.GetTDewPointFromRelHum(t, rh / 100.0), abs=1e-6
        )
    w_out = r.outlet.humidity_ratio_kg_per_kg
    coil_c = psychrolib.GetTDewPointFromHumRatio(33.0, w_out, pressure_pa)
    assert r.coil.dry_bulb_c == pytest.approx(coil_c, abs=1e-6)
    assert r.coil.enthalpy_j_per_kg == pytest.approx(
        psychrolib.GetMoistAirEnthalpy(coil_c, w_out), rel=1e-9
    )
    assert r.coil.rh_pct == pytest.approx(100.0, abs=1e-6)


def test_states_agree_with_coolprop():
    """CoolProp's HAPropsSI (real-gas moist air, an independent reference): humidity ratios
    within 0.6 % and dew points within 0.05 K (the agreement check-values.md states), and
    the coil's enthalpy difference within 1.5 % (the enhancement factor moves W by ~0.5 %)."""
    coolprop = pytest.importorskip("CoolProp.HumidAirProp")
    props = coolprop.HAPropsSI
    r = eq.check(_given())
    for state, (t, rh) in ((r.inlet, (24.0, 70.0)), (r.outlet, (33.0, 30.0))):
        k = t + 273.15
        w = props("W", "T", k, "P", P, "R", rh / 100.0)
        assert state.humidity_ratio_kg_per_kg == pytest.approx(w, rel=6e-3)
        assert state.dew_point_c == pytest.approx(
            props("D", "T", k, "P", P, "R", rh / 100.0) - 273.15, abs=0.05
        )
    h_in = props("H", "T", 297.15, "P", P, "R", 0.70)
    w_out = props("W", "T", 306.15, "P", P, "R", 0.30)
    h_coil = props("H", "T", r.coil.dry_bulb_c + 273.15, "P", P, "W", w_out)
    ours = r.inlet.enthalpy_j_per_kg - r.coil.enthalpy_j_per_kg
    assert ours == pytest.approx(h_in - h_coil, rel=0.015)


# --- litres and pints ------------------------------------------------------------------------


def test_us_pint_is_exact():
    """1 US gallon = 231 in³ and 1 in = 2.54 cm exactly, a pint is an eighth of a gallon:
    0.473176473 L (NIST Handbook 44 Appendix C / SP 811)."""
    pint_l, gallon_l = eq.US_PINT_L, eq.US_GALLON_L
    assert pint_l == pytest.approx(231 * 2.54**3 / 1000 / 8, rel=1e-15)
    assert pint_l == 0.473176473
    assert gallon_l == pytest.approx(8 * pint_l, rel=1e-15)
    # The existing display rounding (us_pint_l, 0.473176 L) agrees to 1e-6.
    assert th.value("us_pint_l") == pytest.approx(eq.US_PINT_L, rel=1e-6)


@pytest.mark.parametrize(("l_per_day", "pints"), [(9.6, 20.2884), (50.0, 105.669), (1.0, 2.11338)])
def test_l_per_day_to_pints_per_day(l_per_day, pints):
    """L/day ÷ 0.473176473 = US pints/day (values computed by hand: 50 / 0.473176473 =
    105.669); and a rated capacity in pints/day reads back to the same litres."""
    r = eq.check(_given(water_l=l_per_day, duration_h=24.0))
    assert r.removal_pints_per_day == pytest.approx(pints, rel=1e-5)
    assert eq.read_capacity(f"{pints} pints/day", "c") == pytest.approx(l_per_day, rel=1e-5)
    assert eq.read_capacity(f"{pints}", "c", "ip") == pytest.approx(l_per_day, rel=1e-5)


# --- series, energy ------------------------------------------------------------------------


def test_a_series_is_integrated_by_trapezoids():
    """Drops of ΔW1, ΔW2, ΔW3 at 0, 1 and 3 h: the time mean is
    (1 × (ΔW1 + ΔW2)/2 + 2 × (ΔW2 + ΔW3)/2) / 3 (trapezoid rule, formula in the test), and
    the dry-air flow is water ÷ (mean × hours)."""
    pairs = (
        AirPair(24.0, 70.0, 33.0, 30.0, 0.0),
        AirPair(24.0, 65.0, 32.0, 30.0, 1.0),
        AirPair(23.0, 60.0, 31.0, 30.0, 3.0),
    )
    r = eq.check(_given(readings=pairs))
    drops = [
        psychrolib.GetHumRatioFromRelHum(p.inlet_temp_c, p.inlet_rh_pct / 100, P)
        - psychrolib.GetHumRatioFromRelHum(p.outlet_temp_c, p.outlet_rh_pct / 100, P)
        for p in pairs
    ]
    mean = (1 * (drops[0] + drops[1]) / 2 + 2 * (drops[1] + drops[2]) / 2) / 3
    assert r.humidity_ratio_drop_kg_per_kg == pytest.approx(mean, rel=1e-9)
    assert r.air_mass_flow_kg_per_s == pytest.approx(1.2 / (mean * 3 * 3600), rel=1e-9)
    untimed = eq.check(_given(readings=tuple(dataclasses.replace(p, at_h=None) for p in pairs)))
    assert untimed.humidity_ratio_drop_kg_per_kg == pytest.approx(sum(drops) / 3, rel=1e-9)


def test_a_series_mean_state_is_weighted_like_the_drop():
    """Readings at 0, 0.2 and 3 h: the mean inlet and outlet dry bulb and W are trapezoid
    time means, the same weights as the drop (trapezoid rule, formula in the test; each W
    from psychrolib), so W_in − W_out of the mean states is the drop. A plain mean would
    give the first two readings two thirds of the weight."""
    pairs = (
        AirPair(26.0, 80.0, 34.0, 30.0, 0.0),
        AirPair(25.0, 75.0, 33.0, 30.0, 0.2),
        AirPair(20.0, 55.0, 26.0, 40.0, 3.0),
    )
    r = eq.check(_given(readings=pairs))

    def trapezoid(values):
        return (0.2 * (values[0] + values[1]) / 2 + 2.8 * (values[1] + values[2]) / 2) / 3

    def w(t, rh):
        return psychrolib.GetHumRatioFromRelHum(t, rh / 100, P)

    w_in = trapezoid([w(p.inlet_temp_c, p.inlet_rh_pct) for p in pairs])
    w_out = trapezoid([w(p.outlet_temp_c, p.outlet_rh_pct) for p in pairs])
    assert r.inlet.humidity_ratio_kg_per_kg == pytest.approx(w_in, rel=1e-9)
    assert r.outlet.humidity_ratio_kg_per_kg == pytest.approx(w_out, rel=1e-9)
    assert r.inlet.dry_bulb_c == pytest.approx(trapezoid([26.0, 25.0, 20.0]), rel=1e-12)
    assert r.outlet.dry_bulb_c == pytest.approx(trapezoid([34.0, 33.0, 26.0]), rel=1e-12)
    assert r.humidity_ratio_drop_kg_per_kg == pytest.approx(w_in - w_out, rel=1e-9)
    assert r.coil.humidity_ratio_kg_per_kg == pytest.approx(w_out, rel=1e-9)


def test_a_reading_after_the_run_is_refused():
    """A reading 4 h into a 3 h run cannot be: InputError naming the reading times."""
    pairs = (AirPair(24, 70, 33, 30, 0.0), AirPair(24, 70, 33, 30, 4.0))
    with pytest.raises(InputError) as caught:
        eq.check(_given(readings=pairs))
    assert caught.value.field == "reading times"
    eq.check(_given(readings=(AirPair(24, 70, 33, 30, 0.0), AirPair(24, 70, 33, 30, 3.0))))


def test_series_times_must_all_be_given_and_increase():
    """Some readings timed and others not, or times that go back, are refused."""
    with pytest.raises(InputError, match="every reading a time"):
        eq.check(_given(readings=(AirPair(24, 70, 33, 30, 0.0), AirPair(24, 70, 33, 30))))
    with pytest.raises(InputError, match="increase"):
        eq.check(_given(readings=(AirPair(24, 70, 33, 30, 2.0), AirPair(24, 70, 33, 30, 1.0))))


def test_energy_gives_the_mean_power():
    """0.9 kWh over 3 h is 300 W on average (E / t); EF = 1.2 / 0.9; a metered energy wins
    over a stated power."""
    r = eq.check(_given(power_w=250.0, energy_kwh=0.9))
    assert r.energy_kwh == 0.9
    assert r.mean_power_w == pytest.approx(300.0)
    assert r.energy_factor_l_per_kwh == pytest.approx(1.2 / 0.9)
    assert r.cop == pytest.approx(r.cooling_capacity_w / 300.0)


# --- the rating ------------------------------------------------------------------------------


def test_rating_conditions_cover_the_file_model_and_cite_their_sources():
    """Every model.RatingCondition key has its condition, each dry bulb and RH a threshold
    with a source and a mark. 80 °F = 26.7 °C (AHAM DH-1), 65 °F = 18.3 °C (DOE Appendix
    X1, portable), 73 °F = 22.8 °C (Appendix X1, whole-home, from memory), 27 °C / 60 %
    (EN 810, from memory), 30 °C / 80 % (data sheets, common practice)."""
    assert set(eq.RATING_CONDITIONS) == set(typing.get_args(model.RatingCondition))
    expected = {
        "26.7c_60": ((80 - 32) / 1.8, 60.0),
        "18.3c_60": ((65 - 32) / 1.8, 60.0),
        "22.8c_60": ((73 - 32) / 1.8, 60.0),
        "27c_60": (27.0, 60.0),
        "30c_80": (30.0, 80.0),
    }
    for key, (temp, rh) in expected.items():
        point = eq.RATING_CONDITIONS[key]
        assert point.dry_bulb_c == pytest.approx(temp, abs=0.05)
        assert point.rh_pct == rh
        for tk in point.threshold_keys:
            t = th.get(tk)
            assert t.source and t.mark in th.MARK_TEXT
    assert th.get("dehumidifier_rating_whole_home_dry_bulb_c").mark == "M"
    assert th.get("dehumidifier_rating_en810_dry_bulb_c").mark == "M"


def test_a_unit_at_its_rating_condition_is_expected_to_give_its_rating():
    """At the rating condition itself the scaling is 1 for both kinds (our approximation:
    s = (W − W_0)/(W_r − W_0) refrigerant, W/W_r desiccant)."""
    for kind in ("refrigerant", "desiccant"):
        r = eq.check(
            _given(
                readings=(AirPair((80 - 32) / 1.8, 60.0, 33.0, 30.0),),  # 80 °F, the point
                kind=kind,
                rated_capacity_l_per_day=9.6,
                rated_energy_factor_l_per_kwh=1.6,
                rating_condition="26.7c_60",
            )
        )
        c = r.comparison
        assert c.site_scale == pytest.approx(1.0, rel=1e-9)
        assert c.expected_removal_l_per_day == pytest.approx(9.6)
        assert c.removal_of_expected == pytest.approx(1.0)
        assert c.energy_factor_of_expected == pytest.approx(1.0)


def test_site_scaling_by_hand():
    """24 °C / 70 % against 65 °F = (65 − 32)/1.8 = 18.333 °C / 60 %: W = 0.013096 and
    0.0078616 kg/kg (psychrolib); saturated air at 0 °C holds W_0 = 0.621945 × 611.21 /
    (101325 − 611.21) = 0.0037745 (pws over water at 0 °C, ASHRAE eqn 6). Refrigerant:
    s = (0.013096 − 0.0037745) / (0.0078616 − 0.0037745) = 2.2808; desiccant:
    s = 0.013096 / 0.0078616 = 1.6659."""
    common = {"rated_capacity_l_per_day": 20.0, "rating_condition": "18.3c_60"}
    refrigerant = eq.check(_given(**common)).comparison
    # the rating air, psychrolib
    w_rating = psychrolib.GetHumRatioFromRelHum((65 - 32) / 1.8, 0.60, P)
    assert refrigerant.rating_air.humidity_ratio_kg_per_kg == pytest.approx(w_rating, rel=1e-9)
    assert w_rating == pytest.approx(0.0078616, rel=1e-4)
    assert refrigerant.site_scale == pytest.approx(2.2808, rel=1e-4)
    assert refrigerant.expected_removal_l_per_day == pytest.approx(45.62, rel=1e-3)
    assert refrigerant.removal_of_rated == pytest.approx(9.6 / 20.0)
    desiccant = eq.check(_given(kind="desiccant", **common)).comparison
    assert desiccant.site_scale == pytest.approx(1.6659, rel=1e-4)


def test_comparison_keys_are_cited():
    """A comparison cites its rating condition's thresholds and the scaling's."""
    r = eq.check(_given(rated_capacity_l_per_day=20.0, rating_condition="27c_60"))
    assert {
        "dehumidifier_rating_en810_dry_bulb_c",
        "dehumidifier_rating_rh_pct",
        "dehumidifier_nominal_coil_c",
    } <= set(r.threshold_keys)
    th.cited(r.threshold_keys)  # every key is a known threshold


# --- findings --------------------------------------------------------------------------------


def _kinds(**changes) -> tuple[FindingKind, ...]:
    return eq.check(_given(**changes)).kinds


def test_a_clean_run_has_no_findings():
    """The issue's example with no rating: nothing to say."""
    assert _kinds() == ()


def test_refrigerant_unit_in_cold_air():
    """Inlet 8 °C is below the 10 °C lowest room temperature (common practice); 3 °C below
    the 5 °C coil-frost limit (common practice); a desiccant unit is not flagged."""
    cold = (AirPair(8.0, 85.0, 12.0, 60.0),)
    assert FindingKind.TOO_COLD in _kinds(readings=cold)
    frost = (AirPair(3.0, 90.0, 7.0, 60.0),)
    found = _kinds(readings=frost)
    assert FindingKind.COIL_FROST in found and FindingKind.TOO_COLD not in found
    assert th.value("refrigerant_coil_frost_inlet_c") < th.value("refrigerant_dehumidifier_min_c")
    desiccant = _kinds(readings=frost, kind="desiccant")
    assert FindingKind.COIL_FROST not in desiccant and FindingKind.TOO_COLD not in desiccant


def test_outlet_wetter_than_inlet():
    """Outlet 30 °C / 80 % holds far more water than 24 °C / 70 %: a reading fault or a
    unit not dehumidifying; no airflow or cooling is inferred from a negative drop."""
    r = eq.check(_given(readings=(AirPair(24.0, 70.0, 30.0, 80.0),)))
    assert FindingKind.OUTLET_WETTER in r.kinds
    assert r.humidity_ratio_drop_kg_per_kg < 0
    assert r.air_mass_flow_kg_per_s is None and r.cooling_capacity_w is None and r.cop is None


def test_no_measurable_drop():
    """A drop under the 0.3 g/kg resolution (our choice from instrument accuracy) is no
    drop: the same air in and out (24 °C / 70 %, 24.2 °C / 69.3 %)."""
    r = eq.check(_given(readings=(AirPair(24.0, 70.0, 24.2, 69.3),)))
    assert abs(r.humidity_ratio_drop_g_per_kg) < th.value("dehumidifier_drop_resolution_g_per_kg")
    assert FindingKind.NO_DROP in r.kinds and FindingKind.OUTLET_WETTER not in r.kinds
    assert r.air_mass_flow_kg_per_s is None


def test_outlet_no_warmer_than_inlet():
    """A working unit warms the air (its power ends up as heat in it): an outlet at or below
    the inlet temperature is flagged (energy balance)."""
    assert FindingKind.OUTLET_NOT_WARMER in _kinds(readings=(AirPair(24.0, 70.0, 22.0, 60.0),))


def test_missing_water_hours_and_power():
    """No water: no removal, EF, airflow or cooling; water without hours: no rate; no power
    or energy: no EF or COP. Each is a finding."""
    r = eq.check(_given(water_l=None))
    assert FindingKind.NO_WATER in r.kinds
    assert r.removal_l_per_day is None and r.energy_factor_l_per_kwh is None
    assert r.air_mass_flow_kg_per_s is None and r.cooling_capacity_w is None
    r = eq.check(_given(duration_h=None))
    assert FindingKind.NO_DURATION in r.kinds and r.removal_l_per_day is None
    r = eq.check(_given(power_w=None))
    assert FindingKind.NO_POWER in r.kinds
    assert r.energy_factor_l_per_kwh is None and r.cop is None
    assert r.cooling_capacity_w is not None  # the coil load needs no power


def test_nothing_collected_though_the_air_is_dried():
    """Zero water with a real drop: the water goes elsewhere; no airflow is inferred."""
    r = eq.check(_given(water_l=0.0))
    assert FindingKind.NOTHING_COLLECTED in r.kinds
    assert r.removal_l_per_day == 0.0 and r.air_mass_flow_kg_per_s is None


def test_removal_below_or_above_what_the_site_air_allows():
    """Against 45.8 L/day expected (test_site_scaling_by_hand), 9.6 L/day is 21 % (< 70 %,
    our choice): below; 120 L/day is 2.6× (> 1.5×, our choice): above; 40 L/day neither."""
    rated = {"rated_capacity_l_per_day": 20.0, "rating_condition": "18.3c_60"}
    assert FindingKind.BELOW_EXPECTED in _kinds(**rated)
    assert FindingKind.ABOVE_EXPECTED in _kinds(water_l=15.0, **rated)  # 120 L/day
    middle = _kinds(water_l=5.0, **rated)  # 40 L/day, 87 %
    assert FindingKind.BELOW_EXPECTED not in middle and FindingKind.ABOVE_EXPECTED not in middle


def test_a_rating_without_its_condition():
    """A rating with no test condition is compared as is, not scaled, and flagged."""
    r = eq.check(_given(rated_capacity_l_per_day=20.0))
    assert FindingKind.NO_RATING_CONDITION in r.kinds
    assert r.comparison.site_scale is None and r.comparison.removal_of_rated == pytest.approx(0.48)


def test_implausible_figures_are_inconsistent_readings():
    """1000 L in 0.01 h at 1 W: removal 1000 × 24 / 0.01 = 2.4e6 L/day (> 1000 L/day), EF
    1000 / 1e-5 kWh = 1e8 L/kWh (> 8), dry-air flow 1000 / (0.0036855 × 36 s) = 7537 kg/s,
    about 2.3e7 m³/h (> 3000 m³/h); limits our choice (limits_equipment). None of them is
    given, nor the cooling and COP that follow from the flow; one finding cites the limits."""
    r = eq.check(_given(water_l=1000.0, duration_h=0.01, power_w=1.0))
    assert FindingKind.INCONSISTENT in r.kinds
    assert r.removal_l_per_day is None and r.removal_pints_per_day is None
    assert r.energy_factor_l_per_kwh is None
    assert r.air_mass_flow_kg_per_s is None and r.air_volume_flow_m3_per_h is None
    assert r.cooling_capacity_w is None and r.cop is None
    (finding,) = [f for f in r.findings if f.kind is FindingKind.INCONSISTENT]
    assert set(finding.threshold_keys) == {
        "dehumidifier_removal_max_l_per_day",
        "dehumidifier_energy_factor_max_l_per_kwh",
        "dehumidifier_air_flow_max_m3_per_h",
    }
    assert set(finding.threshold_keys) <= set(r.threshold_keys)
    assert r.humidity_ratio_drop_g_per_kg == pytest.approx(3.6855, rel=1e-3)  # readings kept


def test_a_cop_beyond_the_limit_alone_is_left_out():
    """The worked case at 60 W: COP = 612.2 / 60 = 10.2 (> 8, our choice; the flow, 0.0301
    kg/s ≈ 93 m³/h, and EF 1.2 / 0.18 = 6.7 L/kWh stay within theirs): only the COP goes."""
    r = eq.check(_given(power_w=60.0))
    assert r.cop is None and r.cooling_capacity_w == pytest.approx(612.2, rel=1e-3)
    assert r.energy_factor_l_per_kwh == pytest.approx(1.2 / 0.18)
    (finding,) = [f for f in r.findings if f.kind is FindingKind.INCONSISTENT]
    assert finding.threshold_keys == ("dehumidifier_cop_max",)


def test_plausibility_limits_have_sources_and_marks():
    """Each plausibility limit is one threshold record with a source and an honest mark
    (our choice: no source gives these bounds)."""
    for key, value in (
        ("dehumidifier_removal_max_l_per_day", 1000.0),
        ("dehumidifier_energy_factor_max_l_per_kwh", 8.0),
        ("dehumidifier_cop_max", 8.0),
        ("dehumidifier_air_flow_max_m3_per_h", 3000.0),
    ):
        t = th.get(key)
        assert t.value == value and t.source and t.mark == "choice"
    # The COP bound sits at the Carnot COP of a 5 °C coil and a 40 °C condenser (computed).
    assert th.value("dehumidifier_cop_max") == pytest.approx(278.15 / 35.0, abs=0.1)


@pytest.mark.parametrize(
    ("changes", "field"),
    [
        ({"readings": ()}, "readings"),
        ({"readings": (AirPair(24.0, 120.0, 33.0, 30.0),)}, "inlet RH"),
        ({"readings": (AirPair(24.0, 70.0, 90.0, 30.0),)}, "outlet temperature"),
        ({"water_l": -1.0}, "water"),
        ({"duration_h": 0.0}, "hours"),
        ({"power_w": -5.0}, "power"),
        ({"rating_condition": "80f_60"}, "rating condition"),
        ({"pressure_pa": 10.0}, "pressure"),
    ],
)
def test_bad_inputs_are_refused_naming_the_field(changes, field):
    """Every input out of its domain raises InputError naming it."""
    with pytest.raises(InputError) as caught:
        eq.check(_given(**changes))
    assert caught.value.field == field


# --- typed amounts ---------------------------------------------------------------------------


@pytest.mark.parametrize(
    ("text", "system", "litres", "weighed"),
    [
        ("1.2", "si", 1.2, False),
        ("1.2 L", "ip", 1.2, False),
        ("1200 mL", "si", 1.2, False),
        ("1.2kg", "si", 1.2, True),  # at 1 kg/L (our choice)
        ("1,2 kg", "si", 1.2, True),
        ("2.5", "ip", 2.5 * 0.473176473, False),  # a bare IP number is US pints
        ("2.5 pt", "si", 2.5 * 0.473176473, False),
        ("0.5 gal", "si", 0.5 * 3.785411784, False),
        ("2.6 lb", "si", 2.6 * 0.45359237, True),  # 1 lb = 0.45359237 kg exactly
        ("0", "si", 0.0, False),
    ],
)
def test_water_amounts(text, system, litres, weighed):
    """Water as a volume or a mass, SI or IP (exact unit definitions beside each)."""
    value, was_weighed = eq.read_water(text, "--water", system)
    assert value == pytest.approx(litres, rel=1e-12, abs=1e-12) and was_weighed is weighed


def test_other_amounts():
    """Power W/kW, energy kWh/Wh, hours h/min, capacity L/day or pints/day, EF L/kWh."""
    assert eq.read_power_w("0.54kW", "p") == pytest.approx(540.0)
    assert eq.read_power_w("540 W", "p") == 540.0
    assert eq.read_energy_kwh("750Wh", "e") == pytest.approx(0.75)
    assert eq.read_hours("180 min", "h") == pytest.approx(3.0)
    assert eq.read_hours("3h", "h") == 3.0
    assert eq.read_capacity("20L/day", "c") == 20.0
    assert eq.read_energy_factor("1.8 L/kWh", "f") == 1.8


def test_amounts_are_read_by_the_units_module():
    """The amounts take every unit survey.units.read knows (pint converts): 1000 Btu/h =
    293.07 W (IT Btu, NIST SP 811), 2 days = 48 h, '20 L / day' with spaces, 0.5 gal =
    1.8927 L (NIST); a value beyond the file's bound says what it was read as."""
    assert eq.read_power_w("1000 Btu/h", "p") == pytest.approx(293.07107, rel=1e-6)
    assert eq.read_power_or_energy("1000 Btu/h", "p") == (pytest.approx(293.07107), None)
    assert eq.read_power_or_energy("750 Wh", "p") == (None, pytest.approx(0.75))
    assert eq.read_hours("2 days", "h") == pytest.approx(48.0)
    assert eq.read_capacity("20 L / day", "c") == 20.0
    with pytest.raises(InputError) as caught:
        eq.read_hours("1000 days", "--hours")  # 24 000 h, beyond the file's 10 000 h
    assert caught.value.read_as == "24000 h"


@pytest.mark.parametrize(
    ("read", "text"),
    [
        (eq.read_water, "-1"),
        (eq.read_water, "1.2 x"),
        (eq.read_water, "kg"),
        (eq.read_power_w, "250V"),
        (eq.read_power_w, "0"),
        (eq.read_hours, "nan"),
        (eq.read_capacity, "20 gal/day"),
        (eq.read_energy_factor, "25"),
    ],
)
def test_bad_amounts_name_the_field_and_what_is_allowed(read, text):
    """A wrong unit, a negative or zero amount, nan or beyond the file's bounds is refused."""
    with pytest.raises(InputError) as caught:
        read(text, "--option")
    assert caught.value.field == "--option" and caught.value.value == text
    assert caught.value.allowed


def test_amount_bounds_are_the_file_models():
    """The typed amounts' upper bounds are the survey file's: a record at each bound is
    accepted, one beyond is refused (store.check_record)."""
    at = model.Equipment(
        kind="refrigerant_dehumidifier",
        water_removed_l=eq.WATER_MAX_L,
        run_hours=eq.RUN_HOURS_MAX_H,
        power_w=eq.POWER_MAX_W,
        energy_kwh=eq.ENERGY_MAX_KWH,
        rated_energy_factor_l_per_kwh=eq.ENERGY_FACTOR_MAX_L_PER_KWH,
        capacity_l_per_day=eq.CAPACITY_MAX_L_PER_DAY,
    )
    store.check_record(at)
    for name in (
        "water_removed_l",
        "run_hours",
        "power_w",
        "energy_kwh",
        "rated_energy_factor_l_per_kwh",
        "capacity_l_per_day",
    ):
        beyond = msgspec.structs.replace(at, **{name: getattr(at, name) * 1.01})
        with pytest.raises(InputError):
            store.check_record(beyond)


def test_psychro_grains_constant():
    """Grains per pound = 7000 × W (7000 grains = 1 lb)."""
    assert psychro.GRAINS_PER_POUND_PER_KG_PER_KG == 7000.0
