"""Moist-air states, surface humidity and pressure: SI floats in and out, psychrolib underneath.

Every formula here is psychrolib's implementation of ASHRAE Handbook - Fundamentals (2017)
ch. 1 (cited per function), with one deliberate addition, explained below.

Units: temperatures in °C, relative humidity in percent (0-100), pressure in Pa, humidity
ratio in kg water per kg dry air, enthalpy in J per kg dry air (datum: dry air and liquid
water at 0 °C), volume in m³ per kg dry air.

Relative humidity below 0 °C
----------------------------
Hygrometers, by the meteorological convention (WMO Guide No. 8, Annex 4.B), report relative
humidity with respect to *liquid water* at every temperature. psychrolib's saturation pressure
switches to ice below the triple point (0.01 °C). This module therefore:

* reads an entered RH as relative to liquid water at all temperatures, so the vapour pressure
  is ``pw = RH · pws_water(t)``; above 0.01 °C this is exactly psychrolib's value. Below it,
  the water saturation pressure is ASHRAE ch. 1 eqn 6 (Hyland–Wexler over liquid water)
  continued into the supercooled range; psychrolib does not expose that branch, so its
  coefficients are repeated in :func:`sat_vapour_pressure_water_pa` (a documented departure);
* reports ``dew_point_c`` over liquid water (the meteorological dew point) and, when the air's
  condensation point lies below 0.01 °C, also ``frost_point_c`` over ice;
* computes *surface* RH against the phase that would form on the surface: liquid water above
  the triple point, ice below it (psychrolib's ``GetSatVapPres``). So a surface RH of 100 % or
  more means condensation above 0 °C and frost below, and it happens exactly when the surface
  is at or below :func:`condensation_point_c` — the dew point, or the frost point below 0 °C.

Input domain: dry bulb −50…+70 °C, RH above 0 and at most 100 % (below 0.1 % refused as too
dry for the equations), pressure 50–110 kPa, surface temperature −60…+90 °C, dew point not
above the dry bulb. Anything else raises :class:`~survey.errors.InputError`.

Air that is supersaturated over ice (high RH, over water, below 0 °C) has a frost point above
its own temperature: it rimes anything at air temperature. That frost point is reported as
computed, not clamped to the air temperature.
"""

from __future__ import annotations

import math
from typing import NamedTuple, TypeGuard

import psychrolib

from survey.errors import InputError

# psychrolib keeps one global unit system: set here once and never changed.
psychrolib.SetUnitSystem(psychrolib.SI)

DRY_BULB_MIN_C = -50.0
DRY_BULB_MAX_C = 70.0
SURFACE_TEMP_MIN_C = -60.0
SURFACE_TEMP_MAX_C = 90.0
#: Below this the dew point at −50 °C falls under −100 °C, the floor of psychrolib's solver.
RH_MIN_PCT = 0.1
PRESSURE_MIN_PA = 50_000.0
PRESSURE_MAX_PA = 110_000.0
ALTITUDE_MIN_M = -500.0
ALTITUDE_MAX_M = 5_000.0
#: Standard sea-level pressure, Pa (ASHRAE Fundamentals 2017 ch. 1, Table 1).
STANDARD_PRESSURE_PA = 101_325.0
#: Triple point of water, °C; psychrolib switches between ice and water here.
TRIPLE_POINT_C = psychrolib.TRIPLE_POINT_WATER_SI
#: 7000 grains make one pound, so grains per pound = 7000 × W (kg/kg).
GRAINS_PER_POUND_PER_KG_PER_KG = 7000.0


class MoistAir(NamedTuple):
    """One moist-air state. Every field is an SI float; see the module notes for conventions."""

    dry_bulb_c: float
    rh_pct: float  #: relative to liquid water, as hygrometers report it
    pressure_pa: float
    dew_point_c: float  #: over liquid water (meteorological dew point)
    frost_point_c: float | None  #: over ice, when the condensation point is below 0.01 °C
    humidity_ratio_kg_per_kg: float
    vapour_pressure_pa: float
    enthalpy_j_per_kg: float
    wet_bulb_c: float
    absolute_humidity_g_per_m3: float
    specific_volume_m3_per_kg: float
    density_kg_per_m3: float

    @property
    def grains_per_pound(self) -> float:
        return self.humidity_ratio_kg_per_kg * GRAINS_PER_POUND_PER_KG_PER_KG

    @property
    def humidity_ratio_g_per_kg(self) -> float:
        return self.humidity_ratio_kg_per_kg * 1000.0

    @property
    def condensation_point_c(self) -> float:
        """Where a cooled surface first wets (dew point) or frosts (frost point).

        Above the air temperature only for air supersaturated over ice."""
        return self.dew_point_c if self.frost_point_c is None else self.frost_point_c


# --- range guards ------------------------------------------------------------------------


def _is_number(value: object) -> TypeGuard[int | float]:
    return isinstance(value, (int, float)) and not isinstance(value, bool)


def in_range(value: object, low: float, high: float) -> bool:
    """Whether ``value`` is a finite real number (not a bool) within [low, high]."""
    return _is_number(value) and math.isfinite(value) and low <= value <= high


def _f(temp_c: float) -> str:
    return f"{temp_c * 1.8 + 32.0:.0f}"


def _temp_range(low_c: float, high_c: float) -> str:
    return f"between {low_c:g} and {high_c:g} °C ({_f(low_c)} and {_f(high_c)} °F)"


def _shown(value: object, unit: str = "") -> str:
    if not _is_number(value):
        return repr(value)
    return f"{value:g} {unit}".rstrip()


def check_dry_bulb(dry_bulb_c: float, field: str = "dry bulb") -> None:
    if not in_range(dry_bulb_c, DRY_BULB_MIN_C, DRY_BULB_MAX_C):
        raise InputError(
            field,
            _shown(dry_bulb_c, "°C"),
            f"air temperature must be {_temp_range(DRY_BULB_MIN_C, DRY_BULB_MAX_C)}",
        )


def check_rh(rh_pct: float, field: str = "relative humidity") -> None:
    if not (_is_number(rh_pct) and math.isfinite(rh_pct) and 0.0 < rh_pct <= 100.0):
        raise InputError(
            field, _shown(rh_pct), "relative humidity must be above 0 and at most 100 %"
        )
    if rh_pct < RH_MIN_PCT:
        raise InputError(
            field,
            _shown(rh_pct),
            f"relative humidity below {RH_MIN_PCT:g} % is too dry for the "
            "psychrometric equations used here (dew point below −100 °C)",
        )


def check_pressure(pressure_pa: float, field: str = "pressure") -> None:
    if not in_range(pressure_pa, PRESSURE_MIN_PA, PRESSURE_MAX_PA):
        shown = _shown(pressure_pa / 100.0 if _is_number(pressure_pa) else pressure_pa, "hPa")
        raise InputError(
            field,
            shown,
            f"pressure must be between {PRESSURE_MIN_PA / 100:g} and "
            f"{PRESSURE_MAX_PA / 100:g} hPa ({PRESSURE_MIN_PA / 3386.389:.2f} and "
            f"{PRESSURE_MAX_PA / 3386.389:.2f} inHg)",
        )


def check_surface_temp(surface_temp_c: float, field: str = "surface temperature") -> None:
    if not in_range(surface_temp_c, SURFACE_TEMP_MIN_C, SURFACE_TEMP_MAX_C):
        raise InputError(
            field,
            _shown(surface_temp_c, "°C"),
            f"surface temperature must be {_temp_range(SURFACE_TEMP_MIN_C, SURFACE_TEMP_MAX_C)}",
        )


def _check_temperature(value: float, field: str, low_c: float, high_c: float) -> None:
    if not in_range(value, low_c, high_c):
        raise InputError(
            field, _shown(value, "°C"), f"{field} must be {_temp_range(low_c, high_c)}"
        )


# --- saturation --------------------------------------------------------------------------


def sat_vapour_pressure_pa(temp_c: float) -> float:
    """Saturation pressure over the phase that forms at ``temp_c``: ice below the triple
    point, liquid water above (psychrolib ``GetSatVapPres``, ASHRAE ch. 1 eqn 5 & 6)."""
    return psychrolib.GetSatVapPres(temp_c)


# ASHRAE Fundamentals 2017 ch. 1 eqn 6 (Hyland & Wexler 1983, over liquid water), Pa and K.
_C8, _C9, _C10 = -5.8002206e03, 1.3914993, -4.8640239e-02
_C11, _C12, _C13 = 4.1764768e-05, -1.4452093e-08, 6.5459673


def _ln_pws_water(t_k: float) -> float:
    return (
        _C8 / t_k
        + _C9
        + _C10 * t_k
        + _C11 * t_k * t_k
        + _C12 * t_k * t_k * t_k
        + _C13 * math.log(t_k)
    )


def sat_vapour_pressure_water_pa(temp_c: float) -> float:
    """Saturation pressure over liquid water, supercooled below 0 °C.

    Above the triple point this is psychrolib ``GetSatVapPres``. Below it, ASHRAE ch. 1
    eqn 6 continued into the supercooled range (psychrolib has no such branch); the
    difference from the Magnus formula of Alduchov & Eskridge (1996) over water is under
    0.5 % down to −40 °C, which a test checks. Below −40 °C the continuation is less certain
    (about 2 % high at −50 °C against Murphy & Koop 2005, from memory): a dew point over
    water there carries a few tenths of a kelvin more uncertainty. The frost point, which
    decides frost on surfaces, uses ice saturation and is not affected.
    """
    if temp_c > TRIPLE_POINT_C:
        return psychrolib.GetSatVapPres(temp_c)
    return math.exp(_ln_pws_water(temp_c + 273.15))


def _dew_point_water_below_triple_c(vapour_pressure_pa: float, guess_c: float) -> float:
    """Temperature at which supercooled liquid water saturates at ``vapour_pressure_pa``
    (below the triple-point pressure): Newton–Raphson on ln pws of eqn 6, the method
    psychrolib uses for its own inverse."""
    target = math.log(vapour_pressure_pa)
    t_k = min(guess_c, 0.0) + 273.15
    for _ in range(50):
        step = (_ln_pws_water(t_k) - target) / dln_sat_vapour_pressure_water_per_k(t_k - 273.15)
        t_k -= step
        if abs(step) < 1e-6:
            break
    return t_k - 273.15


_TRIPLE_POINT_PRESSURE_PA = psychrolib.GetSatVapPres(TRIPLE_POINT_C)
#: psychrolib's dew-point solver works down to -100 °C; below this the air is too dry for it.
_LOWEST_VAPOUR_PRESSURE_PA = psychrolib.GetSatVapPres(-100.0) * 1.0001


# --- states ------------------------------------------------------------------------------


def _state(
    dry_bulb_c: float, rh_pct: float, vapour_pressure_pa: float, pressure_pa: float
) -> MoistAir:
    dry_bulb_c, pressure_pa = float(dry_bulb_c), float(pressure_pa)
    if vapour_pressure_pa < _LOWEST_VAPOUR_PRESSURE_PA:
        raise InputError(
            "relative humidity",
            _shown(rh_pct),
            "too dry to compute: the dew point would be below −100 °C",
        )
    humidity_ratio = psychrolib.GetHumRatioFromVapPres(vapour_pressure_pa, pressure_pa)
    if vapour_pressure_pa >= _TRIPLE_POINT_PRESSURE_PA:
        dew_point = psychrolib.GetTDewPointFromVapPres(dry_bulb_c, vapour_pressure_pa)
        frost_point = None
    else:
        # psychrolib's inverse runs over ice below the triple point: that is the frost point.
        # Its first guess and upper clamp is the "dry bulb" passed; the triple point is used
        # so that air supersaturated over ice (above ~82 % RH at -20 °C) gets its true frost
        # point, which then lies above the air temperature: such air rimes anything at
        # air temperature.
        frost_point = psychrolib.GetTDewPointFromVapPres(TRIPLE_POINT_C, vapour_pressure_pa)
        dew_point = min(
            _dew_point_water_below_triple_c(vapour_pressure_pa, frost_point), dry_bulb_c
        )
    volume = psychrolib.GetMoistAirVolume(dry_bulb_c, humidity_ratio, pressure_pa)
    return MoistAir(
        dry_bulb_c=dry_bulb_c,
        rh_pct=rh_pct,
        pressure_pa=pressure_pa,
        dew_point_c=dew_point,
        frost_point_c=frost_point,
        humidity_ratio_kg_per_kg=humidity_ratio,
        vapour_pressure_pa=vapour_pressure_pa,
        enthalpy_j_per_kg=psychrolib.GetMoistAirEnthalpy(dry_bulb_c, humidity_ratio),
        wet_bulb_c=psychrolib.GetTWetBulbFromHumRatio(dry_bulb_c, humidity_ratio, pressure_pa),
        absolute_humidity_g_per_m3=1000.0 * humidity_ratio / volume,
        specific_volume_m3_per_kg=volume,
        # ASHRAE ch. 1 eqn 11: density of moist air = (1 + W) / v.
        density_kg_per_m3=(1.0 + humidity_ratio) / volume,
    )


def state_from_rh(
    dry_bulb_c: float, rh_pct: float, pressure_pa: float = STANDARD_PRESSURE_PA
) -> MoistAir:
    """Moist air from dry bulb (°C), RH (%, relative to liquid water) and pressure (Pa)."""
    check_dry_bulb(dry_bulb_c)
    check_rh(rh_pct)
    check_pressure(pressure_pa)
    rh_pct = float(rh_pct)
    vapour_pressure = rh_pct / 100.0 * sat_vapour_pressure_water_pa(dry_bulb_c)
    return _state(dry_bulb_c, rh_pct, vapour_pressure, pressure_pa)


def state_from_dew_point(
    dry_bulb_c: float, dew_point_c: float, pressure_pa: float = STANDARD_PRESSURE_PA
) -> MoistAir:
    """Moist air from dry bulb and dew point (°C, over liquid water) and pressure (Pa)."""
    check_dry_bulb(dry_bulb_c)
    check_pressure(pressure_pa)
    _check_temperature(dew_point_c, "dew point", DRY_BULB_MIN_C - 30.0, DRY_BULB_MAX_C)
    if dew_point_c > dry_bulb_c:
        raise InputError(
            "dew point",
            f"{dew_point_c:g} °C",
            f"dew point must not be above the air temperature ({dry_bulb_c:g} °C)",
        )
    vapour_pressure = sat_vapour_pressure_water_pa(dew_point_c)
    rh = 100.0 * vapour_pressure / sat_vapour_pressure_water_pa(dry_bulb_c)
    return _state(dry_bulb_c, min(rh, 100.0), vapour_pressure, pressure_pa)


def state_from_wet_bulb(
    dry_bulb_c: float, wet_bulb_c: float, pressure_pa: float = STANDARD_PRESSURE_PA
) -> MoistAir:
    """Moist air from dry bulb and psychrometric wet bulb (°C) and pressure (Pa)
    (psychrolib ``GetHumRatioFromTWetBulb``, ASHRAE ch. 1 eqn 33 & 35)."""
    check_dry_bulb(dry_bulb_c)
    check_pressure(pressure_pa)
    _check_temperature(wet_bulb_c, "wet bulb", DRY_BULB_MIN_C - 30.0, DRY_BULB_MAX_C)
    if wet_bulb_c > dry_bulb_c:
        raise InputError(
            "wet bulb",
            f"{wet_bulb_c:g} °C",
            f"wet bulb must not be above the air temperature ({dry_bulb_c:g} °C)",
        )
    humidity_ratio = psychrolib.GetHumRatioFromTWetBulb(dry_bulb_c, wet_bulb_c, pressure_pa)
    if humidity_ratio <= 1e-7:
        raise InputError(
            "wet bulb",
            f"{wet_bulb_c:g} °C",
            f"too low for an air temperature of {dry_bulb_c:g} °C "
            "(it would mean air with no water vapour)",
        )
    vapour_pressure = psychrolib.GetVapPresFromHumRatio(humidity_ratio, pressure_pa)
    rh = 100.0 * vapour_pressure / sat_vapour_pressure_water_pa(dry_bulb_c)
    return _state(dry_bulb_c, min(rh, 100.0), vapour_pressure, pressure_pa)


def state_from_humidity_ratio(
    dry_bulb_c: float, humidity_ratio_kg_per_kg: float, pressure_pa: float = STANDARD_PRESSURE_PA
) -> MoistAir:
    """Moist air from dry bulb, humidity ratio (kg/kg) and pressure; RH capped at 100 %.

    Used for air that is heated, cooled or mixed at constant moisture content."""
    check_dry_bulb(dry_bulb_c)
    check_pressure(pressure_pa)
    if not in_range(humidity_ratio_kg_per_kg, 1e-7, 1.0):
        raise InputError(
            "humidity ratio",
            _shown(humidity_ratio_kg_per_kg, "kg/kg"),
            "humidity ratio must be between 1e-07 and 1 kg/kg",
        )
    vapour_pressure = psychrolib.GetVapPresFromHumRatio(humidity_ratio_kg_per_kg, pressure_pa)
    saturation = sat_vapour_pressure_water_pa(dry_bulb_c)
    vapour_pressure = min(vapour_pressure, saturation)
    return _state(dry_bulb_c, 100.0 * vapour_pressure / saturation, vapour_pressure, pressure_pa)


# --- light state and slopes, for assessing many surfaces ---------------------------------


class VapourState(NamedTuple):
    """The parts of a moist-air state that surface and room judgements need, without the
    wet bulb (an iterative solve): the same numbers :func:`state_from_rh` gives, plus the
    slope of the water saturation pressure at the dry bulb, for uncertainty propagation."""

    dry_bulb_c: float
    rh_pct: float
    pressure_pa: float
    vapour_pressure_pa: float
    condensation_point_c: float  #: dew point, or frost point below 0.01 °C
    humidity_ratio_kg_per_kg: float
    specific_volume_m3_per_kg: float
    sat_pressure_water_pa: float  #: pws over liquid water at the dry bulb
    dln_sat_pressure_water_per_k: float  #: d ln pws,water / dt at the dry bulb, 1/K

    @property
    def humidity_ratio_g_per_kg(self) -> float:
        return 1000.0 * self.humidity_ratio_kg_per_kg


def vapour_state(
    dry_bulb_c: float, rh_pct: float, pressure_pa: float = STANDARD_PRESSURE_PA
) -> VapourState:
    """A :class:`VapourState` from dry bulb (°C), RH (%, relative to water) and pressure (Pa),
    with the conventions and domain of :func:`state_from_rh`."""
    check_dry_bulb(dry_bulb_c)
    check_rh(rh_pct)
    check_pressure(pressure_pa)
    saturation = sat_vapour_pressure_water_pa(dry_bulb_c)
    vapour_pressure = rh_pct / 100.0 * saturation
    if vapour_pressure < _LOWEST_VAPOUR_PRESSURE_PA:
        raise InputError(
            "relative humidity",
            _shown(rh_pct),
            "too dry to compute: the dew point would be below −100 °C",
        )
    if vapour_pressure >= _TRIPLE_POINT_PRESSURE_PA:
        point = psychrolib.GetTDewPointFromVapPres(dry_bulb_c, vapour_pressure)
    else:  # frost point, unclamped (see _state)
        point = psychrolib.GetTDewPointFromVapPres(TRIPLE_POINT_C, vapour_pressure)
    humidity_ratio = psychrolib.GetHumRatioFromVapPres(vapour_pressure, pressure_pa)
    volume = psychrolib.GetMoistAirVolume(dry_bulb_c, humidity_ratio, pressure_pa)
    return VapourState(
        float(dry_bulb_c),
        float(rh_pct),
        float(pressure_pa),
        vapour_pressure,
        point,
        humidity_ratio,
        volume,
        saturation,
        dln_sat_vapour_pressure_water_per_k(dry_bulb_c),
    )


def dln_sat_vapour_pressure_water_per_k(temp_c: float) -> float:
    """d ln pws / dt (1/K) over liquid water, supercooled below 0 °C: ASHRAE ch. 1 eqn 6
    differentiated (the branch :func:`sat_vapour_pressure_water_pa` uses)."""
    t_k = temp_c + 273.15
    return -_C8 / (t_k * t_k) + _C10 + 2 * _C11 * t_k + 3 * _C12 * t_k * t_k + _C13 / t_k


def dln_sat_vapour_pressure_per_k(temp_c: float) -> float:
    """d ln pws / dt (1/K) over the phase that forms at ``temp_c`` (ice at and below the
    triple point, water above): ASHRAE ch. 1 eqn 5 & 6 differentiated, as psychrolib's own
    dew-point solver uses it (psychrolib ``dLnPws_``, an internal helper of the pinned
    release; a test holds it to a numerical difference of :func:`sat_vapour_pressure_pa`)."""
    return psychrolib.dLnPws_(temp_c)


# --- surfaces ----------------------------------------------------------------------------


def condensation_point_c(state: MoistAir) -> float:
    """Dew point, or frost point when it lies below 0.01 °C: the surface temperature at
    which water or frost starts to form from this air."""
    return state.condensation_point_c


def surface_rh_pct(state: MoistAir, surface_temp_c: float) -> float:
    """RH of the room air cooled (or warmed) at constant humidity ratio to ``surface_temp_c``.

    Relative to ice below the triple point, to water above (see the module notes), so
    100 % or more means condensation or frost. Not capped: 130 % says how far past
    saturation the air next to the surface would be.
    """
    check_surface_temp(surface_temp_c)
    return 100.0 * state.vapour_pressure_pa / sat_vapour_pressure_pa(surface_temp_c)


def max_room_rh_pct(
    dry_bulb_c: float, surface_temp_c: float, surface_rh_limit_pct: float = 100.0
) -> float:
    """Highest room RH (%, relative to water) at which a surface at ``surface_temp_c`` stays
    at or below ``surface_rh_limit_pct``; 100 when any room RH keeps it there.

    The vapour pressure is the same at the surface and in the room, so
    ``RH_room = limit · pws(Ts) / pws_water(t_room)``. Pressure cancels out.
    """
    check_dry_bulb(dry_bulb_c, "room air temperature")
    check_surface_temp(surface_temp_c)
    if not 0.0 < surface_rh_limit_pct <= 100.0:
        raise InputError(
            "surface RH limit", surface_rh_limit_pct, "must be above 0 and at most 100 %"
        )
    ratio = sat_vapour_pressure_pa(surface_temp_c) / sat_vapour_pressure_water_pa(dry_bulb_c)
    return min(100.0, surface_rh_limit_pct * ratio)


def surface_temp_for_rh_c(state: MoistAir, surface_rh_limit_pct: float) -> float:
    """Lowest surface temperature at which this air stays at or below the given surface RH
    (the inverse of :func:`surface_rh_pct`).

    Raises InputError when the answer would lie outside the surface-temperature domain."""
    if not (_is_number(surface_rh_limit_pct) and 0.0 < surface_rh_limit_pct <= 100.0):
        raise InputError(
            "surface RH limit", _shown(surface_rh_limit_pct), "must be above 0 and at most 100 %"
        )
    needed = state.vapour_pressure_pa / (surface_rh_limit_pct / 100.0)
    if not (
        sat_vapour_pressure_pa(SURFACE_TEMP_MIN_C)
        <= needed
        <= sat_vapour_pressure_pa(SURFACE_TEMP_MAX_C)
    ):
        raise InputError(
            "surface RH limit",
            _shown(surface_rh_limit_pct),
            "no surface temperature "
            + _temp_range(SURFACE_TEMP_MIN_C, SURFACE_TEMP_MAX_C)
            + " keeps this air at or below that surface RH",
        )
    # psychrolib clamps its answer to the "dry bulb" passed: give it the domain's top.
    return psychrolib.GetTDewPointFromVapPres(SURFACE_TEMP_MAX_C, needed)


# --- pressure ----------------------------------------------------------------------------


def pressure_from_altitude_m(altitude_m: float) -> float:
    """Standard-atmosphere pressure (Pa) at ``altitude_m`` (psychrolib
    ``GetStandardAtmPressure``, ASHRAE ch. 1 eqn 3)."""
    if not in_range(altitude_m, ALTITUDE_MIN_M, ALTITUDE_MAX_M):
        raise InputError(
            "altitude",
            _shown(altitude_m, "m"),
            f"altitude must be between {ALTITUDE_MIN_M:g} and {ALTITUDE_MAX_M:g} m "
            f"({ALTITUDE_MIN_M / 0.3048:.0f} and {ALTITUDE_MAX_M / 0.3048:.0f} ft)",
        )
    return psychrolib.GetStandardAtmPressure(altitude_m)


def site_pressure_pa(altitude_m: float | None = None, pressure_pa: float | None = None) -> float:
    """The pressure to compute with: a measured pressure if given, else the standard
    atmosphere at ``altitude_m``, else standard sea-level pressure."""
    if pressure_pa is not None:
        check_pressure(pressure_pa)
        return pressure_pa
    if altitude_m is not None:
        return pressure_from_altitude_m(altitude_m)
    return STANDARD_PRESSURE_PA


# --- liquid water ------------------------------------------------------------------------

#: Specific heat of liquid water, J/(kg·K), for its enthalpy (ASHRAE ch. 1: hw ≈ 4.186 t
#: kJ/kg, from memory; IAPWS gives 4.18–4.19 kJ/(kg·K) from 0 to 40 °C).
LIQUID_WATER_CP_J_PER_KG_K = 4186.0


def liquid_water_enthalpy_j_per_kg(temp_c: float) -> float:
    """Enthalpy of liquid water at ``temp_c`` (J/kg), on this module's datum (liquid water at
    0 °C): ``hw = 4.186 t`` kJ/kg, the ASHRAE ch. 1 approximation used in the
    cooling-and-dehumidifying balance (a constant specific heat; within 0.5 % of IAPWS from
    1 to 40 °C). psychrolib has no liquid-water enthalpy."""
    return LIQUID_WATER_CP_J_PER_KG_K * temp_c
