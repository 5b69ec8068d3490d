"""Findings per surface, room and site: condensation, mould, temperature factor, humidity
class, materials — each with the uncertainty the instruments leave.

Plain inputs in (:class:`RoomInput`, :class:`SurfaceInput`, :class:`MaterialReading`, …, SI
floats with the unit in the name), typed findings out (:class:`SurfaceFinding`,
:class:`RoomFinding`, :class:`SiteFinding`). The survey file model is adapted to these inputs
elsewhere; this module knows nothing of files or faces.

Moist air
---------
The psychrometrics are :mod:`survey.psychro`'s (RH relative to liquid water at all
temperatures; condensation point = dew point, or frost point below 0.01 °C; surface RH over
the phase that forms). For speed the assessment uses psychro's light
:class:`~survey.psychro.VapourState` (vapour pressure, condensation point, humidity ratio,
specific volume and the saturation slope) and skips the wet bulb, an iterative solve the
assessment never needs. :meth:`RoomFinding.moist_air` gives
the full :class:`~survey.psychro.MoistAir` when a face wants it.

What each surface is judged by
------------------------------
A surface's ``element`` decides it (:data:`survey.thresholds.ELEMENT_POLICY`, our policy):
the temperature factor only for the heated envelope (external walls, ceilings, floors, and
surfaces whose kind is not said); the room's highest safe RH (``coldest``,
``max_room_rh_pct*``) only from walls, ceilings and floors, internal walls included; glazing,
window frames and pipes are judged for condensation (frames also for mould) and reported
apart (``coldest_glazing_or_pipe``), since a cold pane or pipe calls for its own remedy, not
for a drier room.

Uncertainty
-----------
Each instrument has a ± accuracy (:class:`Accuracy`). Following the GUM (JCGM 100:2008), a ±a
specification is read as a rectangular distribution with standard uncertainty u = a/√3; the
readings are independent; sensitivities are first-order partial derivatives; the expanded
uncertainty is U = k·u_c with the coverage factor k = 2 (threshold ``coverage_factor``, about
95 % coverage). First order rather than worst-case corners: the corners would treat every
instrument as off by its full accuracy at once, which the specifications do not claim, and
the Monte Carlo check shows the first-order bands hold 96-97 % of the draws. The partial
derivatives, with L(t) = d ln p_ws/dt (ASHRAE ch. 1 eqn 5 & 6 differentiated, over the phase
that forms at t; over supercooled water a 0.01 K difference of psychro's continuation):

* vapour pressure p_w = RH·p_ws,water(t_i):  u²(ln p_w) = (u_RH/RH)² + (L_w(t_i)·u_ti)²
* condensation point t_c (p_ws(t_c) = p_w): u(t_c) = u(ln p_w) / L(t_c)
* surface RH = p_w / p_ws(t_s): u²(ln RH_s) = u²(ln p_w) + (L(t_s)·u_ts)²; the band is
  RH_s·exp(±U), slightly asymmetric, as the exponential is
* margin t_s − t_c: u² = u²(t_c) + u_ts²
* fRsi = (t_s − t_e)/(t_i − t_e): ∂/∂t_s = 1/Δ, ∂/∂t_i = −f/Δ, ∂/∂t_e = (f − 1)/Δ, Δ = t_i − t_e.
  When one thermometer reads both the room and the outdoor air (``Accuracy.shared_thermometer``,
  the usual case on site and the default), their errors are fully correlated (GUM 5.2,
  r = 1): u²(f) = (u_ts² + (∂/∂t_i + ∂/∂t_e)² u_ti²)/… = (u_ts² + u_ti²)/Δ²; with separate
  instruments the terms add in quadrature, u²(f) = (u_ts² + f² u_ti² + (1 − f)² u_ti²)/Δ².
* vapour-pressure excess p_w,i − p_w,e: the four readings' terms added in quadrature (the
  outdoor instrument is taken to have the room instrument's accuracy).

When a limit lies inside value ± U, the state is ``CANNOT_TELL`` ("cannot be told apart at
this instrument accuracy") and ``*_possible`` lists the states the band spans. A Monte Carlo
test (GUM Supplement 1 style, seeded) checks u and the coverage of ±U.
"""

from __future__ import annotations

import math
from collections.abc import Iterable
from dataclasses import dataclass
from enum import Enum
from functools import lru_cache
from typing import Any, NamedTuple

from survey import domain, psychro
from survey import thresholds as th
from survey.errors import InputError
from survey.psychro import in_range as _number_in  # one range guard for the core

_SQRT3 = math.sqrt(3.0)


# --- ordered state names ---------------------------------------------------------------------


class _State(Enum):
    """A state name with a rank (higher is worse; None for 'cannot tell'). Its words for
    people are :mod:`survey.words`'."""

    rank: int | None

    def __new__(cls, value: str, rank: int | None) -> _State:
        member = object.__new__(cls)
        member._value_ = value
        member.rank = rank
        return member

    def __str__(self) -> str:
        return str(self.value)


class CondensationState(_State):
    CLEAR = ("clear", 0)
    NEAR = ("near_dew_point", 1)
    CONDENSING = ("condensing", 2)
    CANNOT_TELL = ("cannot_tell", None)


class MouldState(_State):
    BELOW = ("below_limit", 0)
    APPROACHING = ("approaching_limit", 1)
    ABOVE = ("above_limit", 2)
    CANNOT_TELL = ("cannot_tell", None)
    NOT_JUDGED = ("not_judged", None)
    TOO_COLD = ("too_cold_now", None)
    TOO_HOT = ("too_hot_now", None)


class FactorState(_State):
    MEETS = ("meets_limit", 0)
    UNDER = ("under_limit", 1)
    CANNOT_TELL = ("cannot_tell", None)
    NOT_JUDGED = ("not_judged", None)
    NOT_APPLICABLE = ("not_applicable", None)
    NOT_FOR_ELEMENT = ("not_for_element", None)
    GROUND_CONTACT = ("ground_contact", None)
    DRYING_WET = ("drying_wet", None)


class DryStandardState(_State):
    AT = ("at_dry_standard", 0)
    ABOVE = ("above_dry_standard", 1)
    NO_REFERENCE = ("no_reference", None)


class TimberState(_State):
    DRY = ("below_mould_range", 0)
    MOULD_RANGE = ("mould_range", 1)
    DECAY_RANGE = ("decay_range", 2)


_CONDENSATION_ORDER = (
    CondensationState.CLEAR,
    CondensationState.NEAR,
    CondensationState.CONDENSING,
)
_MOULD_ORDER = (MouldState.BELOW, MouldState.APPROACHING, MouldState.ABOVE)
_FACTOR_ORDER = (FactorState.MEETS, FactorState.UNDER)


# --- inputs ------------------------------------------------------------------------------------

_ACCURACY_MAX = {
    "air_temp_k": domain.AIR_TEMP_ACCURACY_MAX_K,
    "rh_pct": domain.RH_ACCURACY_MAX_PCT,
    "surface_temp_k": domain.SURFACE_TEMP_ACCURACY_MAX_K,
}
_ACCURACY_FIELD = {
    "air_temp_k": "air temperature accuracy",
    "rh_pct": "RH accuracy",
    "surface_temp_k": "surface temperature accuracy",
}


@dataclass(frozen=True, slots=True)
class Accuracy:
    """± accuracy of each instrument (read as a rectangular bound, see the module notes)."""

    air_temp_k: float = th.value("accuracy_air_temp_k")
    rh_pct: float = th.value("accuracy_rh_pct")
    surface_temp_k: float = th.value("accuracy_surface_temp_k")
    #: One thermometer read both the room and the outdoor air (the usual case on site): the
    #: two readings' errors are taken as fully correlated in the temperature factor (GUM 5.2).
    shared_thermometer: bool = True

    def __post_init__(self) -> None:
        for name, top in _ACCURACY_MAX.items():
            got = getattr(self, name)
            unit = "%RH" if name == "rh_pct" else "K"
            if (
                not isinstance(got, (int, float))
                or isinstance(got, bool)
                or not math.isfinite(got)
                or not 0.0 <= got <= top
            ):
                raise InputError(
                    _ACCURACY_FIELD[name], got, f"must be between 0 and {top:g} {unit}"
                )


DEFAULT_ACCURACY = Accuracy()


@dataclass(frozen=True, slots=True)
class SurfaceInput:
    """One measured surface: a label, its temperature, and what it is — one of
    :data:`survey.thresholds.SURFACE_ELEMENTS`; ``"other"`` (not said) is judged as a wall,
    ceiling or floor. What each element is judged by is
    :data:`survey.thresholds.ELEMENT_POLICY`."""

    label: str
    surface_temp_c: float
    element: str = "other"


#: Scales of a material moisture reading.
MATERIAL_SCALES = ("mc_pct", "wme_pct", "relative")
#: Highest material reading on any scale: the survey file model's bound, so that every
#: reading a file may hold can be assessed.
_MATERIAL_READING_MAX = 1000.0


@dataclass(frozen=True, slots=True)
class MaterialReading:
    """A moisture-meter reading: ``mc_pct`` is moisture content in % by weight (timber,
    pin meter on the wood scale), ``relative`` the meter's own comparative scale. The dry
    standard is the reading of the same material in an unaffected area, same scale."""

    label: str
    material: str
    value: float
    scale: str = "mc_pct"
    dry_standard: float | None = None
    timber: bool = False


@dataclass(frozen=True, slots=True)
class Activity:
    """A moisture-producing activity in the room (``thresholds.ACTIVITY_RATE`` kinds)."""

    kind: str
    hours_per_day: float


@dataclass(frozen=True, slots=True)
class Observations:
    """What the surveyor saw, heard or smelt in the room."""

    visible_mould_area_m2: float = 0.0  #: 0: none seen, or seen but not measured
    water_category: int | None = None  #: 1 clean, 2 significant, 3 gross contamination
    condensation_seen: bool = False
    standing_water: bool = False
    odour: bool = False
    electrics_near_water: bool = False
    visible_mould: bool = False  #: mould seen (its area may not have been measured)
    drying_in_progress: bool = False  #: drying equipment at work: the source is dealt with
    drying: DryingEquipment | None = None  #: what the drying equipment is and logged
    water_standing_h: float | None = None  #: how long the water has stood, hours
    water_loss_class: int | None = None  #: 1-4 when given (the trade's evaporation classes)
    wet_area_pct: float | None = None  #: share of the floor, wall and ceiling area wet
    dense_materials_wet: bool = False  #: hardwood, plaster, concrete or masonry holds water
    #: An open-flued boiler, water heater, stove or fire in the room or the building:
    #: True, False, or None when not said.
    flued_appliance: bool | None = None

    @property
    def mould_seen(self) -> bool:
        """Mould was seen: flagged, or an area recorded."""
        return self.visible_mould or self.visible_mould_area_m2 > 0.0


@dataclass(frozen=True, slots=True)
class DryingEquipment:
    """Drying equipment running in a room, and what it logged."""

    dehumidifiers: int = 0
    air_movers: int = 0
    capacity_l_per_day: float | None = None  #: rated, summed over the dehumidifiers
    water_removed_l: float | None = None  #: collected since the previous visit
    hours_since_previous: float | None = None
    outlet_temp_c: float | None = None  #: air leaving a dehumidifier
    outlet_rh_pct: float | None = None

    @property
    def removed_l_per_day(self) -> float | None:
        """Logged water removed per day, when both the amount and the time are known."""
        if self.water_removed_l is None or not self.hours_since_previous:
            return None
        return self.water_removed_l * 24.0 / self.hours_since_previous


@dataclass(frozen=True, slots=True)
class RoomInput:
    """One room's readings. ``use`` is one of :data:`survey.thresholds.ROOM_USES`."""

    name: str
    use: str
    air_temp_c: float
    rh_pct: float
    surfaces: tuple[SurfaceInput, ...] = ()
    volume_m3: float | None = None
    occupants: int | None = None
    activities: tuple[Activity, ...] = ()
    materials: tuple[MaterialReading, ...] = ()
    observations: Observations = Observations()
    accuracy: Accuracy | None = None  #: None: the site's accuracy
    laundry_loads_per_day: float | None = None  #: wash loads dried indoors in the room


@dataclass(frozen=True, slots=True)
class OutdoorInput:
    """Outdoor air at the time of the readings."""

    air_temp_c: float
    rh_pct: float


# --- light air state ---------------------------------------------------------------------------

#: The light moist-air state of :mod:`survey.psychro` (no wet bulb; see the module notes).
AirState = psychro.VapourState


def air_state(
    dry_bulb_c: float,
    rh_pct: float,
    pressure_pa: float = psychro.STANDARD_PRESSURE_PA,
    field: str = "",
) -> AirState:
    """The light state of air at ``dry_bulb_c`` and ``rh_pct`` (relative to water), with
    errors named for ``field`` (e.g. "outdoor")."""
    try:
        psychro.check_dry_bulb(dry_bulb_c, "air temperature")
        psychro.check_rh(rh_pct, "relative humidity")
    except InputError as exc:
        raise exc.with_field(f"{field} {exc.field}" if field else exc.field) from None
    return psychro.vapour_state(dry_bulb_c, rh_pct, pressure_pa)


#: d ln p_ws / dt (1/K) over the phase that forms at t.
_dln_pws = psychro.dln_sat_vapour_pressure_per_k


# --- timber ------------------------------------------------------------------------------------


def timber_emc_pct(temp_c: float, rh_pct: float) -> float:
    """Equilibrium moisture content of wood (% MC) at ``temp_c`` and ``rh_pct``.

    USDA FPL Wood Handbook eqn 4-5 (after Simpson 1973, 1998), h = RH as a fraction,
    T in °C:  M = (1800/W)[Kh/(1 − Kh) + (K1Kh + 2K1K2K²h²)/(1 + K1Kh + K1K2K²h²)],
    W = 349 + 1.29T + 0.0135T², K = 0.805 + 0.000736T − 0.00000273T²,
    K1 = 6.27 − 0.00938T − 0.000303T², K2 = 1.91 + 0.0407T − 0.000293T².
    """
    psychro.check_dry_bulb(temp_c, "air temperature")
    psychro.check_rh(rh_pct, "relative humidity")
    if not emc_in_range(temp_c, rh_pct):
        raise InputError(
            "timber equilibrium moisture content",
            f"{temp_c:g} °C, {rh_pct:g} %",
            "the Wood Handbook equation is used only from "
            f"{th.value('timber_emc_equation_min_c'):g} to "
            f"{th.value('timber_emc_equation_max_c'):g} °C and up to "
            f"{th.value('timber_emc_equation_max_rh_pct'):g} % RH",
        )
    return _emc(temp_c, rh_pct)


def emc_in_range(temp_c: float, rh_pct: float) -> bool:
    """Whether the Wood Handbook equation is used at this temperature and RH (its range)."""
    return th.value("timber_emc_equation_min_c") <= temp_c <= th.value(
        "timber_emc_equation_max_c"
    ) and rh_pct <= th.value("timber_emc_equation_max_rh_pct")


def emc_or_none(temp_c: float, rh_pct: float) -> float | None:
    """Wood Handbook eqn 4-5 EMC, or None outside the equation's range."""
    return _emc(temp_c, rh_pct) if emc_in_range(temp_c, rh_pct) else None


def _emc(temp_c: float, rh_pct: float) -> float:
    t = temp_c
    h = rh_pct / 100.0
    w = 349.0 + 1.29 * t + 0.0135 * t * t
    k = 0.805 + 0.000736 * t - 0.00000273 * t * t
    k1 = 6.27 - 0.00938 * t - 0.000303 * t * t
    k2 = 1.91 + 0.0407 * t - 0.000293 * t * t
    kh = k * h
    return (1800.0 / w) * (
        kh / (1.0 - kh) + (k1 * kh + 2.0 * k1 * k2 * kh * kh) / (1.0 + k1 * kh + k1 * k2 * kh * kh)
    )


# --- findings ----------------------------------------------------------------------------------
# Typed, immutable records (NamedTuples: an assessment of thousands of surfaces builds them
# several times faster than frozen dataclasses).


class SurfaceFinding(NamedTuple):
    """Condensation, mould and temperature-factor judgement of one surface."""

    label: str
    element: str
    surface_temp_c: float
    surface_rh_pct: float
    surface_rh_low_pct: float  #: lower end of the ±U band
    surface_rh_high_pct: float  #: upper end of the ±U band
    condensation_point_c: float
    margin_k: float  #: surface temperature minus the condensation point
    margin_uncertainty_k: float  #: expanded uncertainty U of the margin (k = 2)
    condensation: CondensationState
    condensation_possible: tuple[CondensationState, ...]
    mould: MouldState
    mould_possible: tuple[MouldState, ...]
    temperature_factor: float | None
    temperature_factor_uncertainty: float | None  #: expanded, k = 2
    temperature_factor_limit: float | None
    temperature_factor_state: FactorState
    temperature_factor_possible: tuple[FactorState, ...]
    threshold_keys: tuple[str, ...]

    @property
    def condensing(self) -> bool:
        """Water or frost forms at the reading itself (surface RH 100 % or more)."""
        return self.surface_rh_pct >= 100.0

    @property
    def frost(self) -> bool:
        """Frost, not water, forms at the reading: condensing on a surface below 0 °C."""
        return self.surface_rh_pct >= 100.0 and self.surface_temp_c <= psychro.TRIPLE_POINT_C

    @property
    def below_freezing(self) -> bool:
        """The surface is below 0 °C: what forms on it is frost."""
        return self.surface_temp_c <= psychro.TRIPLE_POINT_C

    @property
    def policy(self) -> th.ElementPolicy:
        """How this kind of surface is judged (:data:`survey.thresholds.ELEMENT_POLICY`)."""
        return th.ELEMENT_POLICY[self.element]


class MaterialFinding(NamedTuple):
    """A material reading against its dry standard and, for timber, the timber limits."""

    label: str
    material: str
    value: float
    scale: str
    dry_standard: float | None
    dry_standard_state: DryStandardState
    excess_over_dry_standard: float | None  #: value − dry standard, in the reading's scale
    timber_state: TimberState | None
    emc_pct: float | None  #: timber EMC at the room's air (Wood Handbook eqn 4-5)
    wetter_than_air_explains: bool  #: timber in the mould range while the air's EMC is not
    decay_slowed_by_temperature: bool  #: decay-range timber in air below 10 or above 35 °C
    threshold_keys: tuple[str, ...]


class RoomFinding(NamedTuple):
    """Everything judged about one room."""

    room: RoomInput
    use: str  #: the room use in canonical form
    air: AirState
    outdoor: AirState | None
    accuracy: Accuracy
    condensation_point_uncertainty_k: float  #: expanded, k = 2
    surfaces: tuple[SurfaceFinding, ...]
    #: The coldest surface that can set the room RH: a wall, ceiling or floor (the element
    #: policy's ``sets_room_target``); glazing, window frames and pipes never are.
    coldest: SurfaceFinding | None
    max_room_rh_pct_mould: float | None  #: coldest surface stays at or below 80 %
    max_room_rh_pct_margin: float | None  #: coldest surface stays 3 K above the dew point
    max_room_rh_low_pct: float | None  #: lower end of the ±U band of the binding limit
    max_room_rh_high_pct: float | None
    #: The coldest glazing, window frame or pipe, judged apart from the room RH target.
    coldest_glazing_or_pipe: SurfaceFinding | None
    #: Highest room RH at which that surface stays clear of condensation (surface RH < 100 %).
    max_room_rh_pct_dry_glazing_or_pipe: float | None
    vapour_pressure_excess_pa: float | None
    vapour_pressure_excess_uncertainty_pa: float | None  #: expanded, k = 2
    humidity_class: int | None  #: 1-5, 6 beyond class 5, None not judged
    humidity_class_possible: tuple[int, ...]
    materials: tuple[MaterialFinding, ...]
    frsi_limit_key: str | None
    threshold_keys: tuple[str, ...]

    @property
    def name(self) -> str:
        return self.room.name

    @property
    def timber_emc_pct(self) -> float | None:
        """Moisture content timber settles at in this room's air (Wood Handbook eqn 4-5);
        None outside the equation's range."""
        return emc_or_none(self.air.dry_bulb_c, self.air.rh_pct)

    @property
    def max_room_rh_pct(self) -> float | None:
        """Highest room RH at which the coldest surface stays below both the mould limit
        and the condensation margin."""
        if self.max_room_rh_pct_mould is None:
            return None
        return min(self.max_room_rh_pct_mould, self.max_room_rh_pct_margin or 100.0)

    def moist_air(self) -> psychro.MoistAir:
        """The room air as a full :class:`~survey.psychro.MoistAir` (computed on demand)."""
        return psychro.state_from_rh(self.air.dry_bulb_c, self.air.rh_pct, self.air.pressure_pa)


class SiteFinding(NamedTuple):
    """The rooms of one visit, with the outdoor air and pressure they share."""

    rooms: tuple[RoomFinding, ...]
    outdoor: AirState | None
    pressure_pa: float
    accuracy: Accuracy
    year_built: int | None
    threshold_keys: tuple[str, ...]


# --- limits, read once per assessment ---------------------------------------------------------


class _Limits(NamedTuple):
    frsi: dict[str, th.Threshold | None]  #: temperature-factor limit by room use
    k: float
    margin: float
    mould: float
    watch: float
    frsi_min_dt: float
    class_limits: tuple[float, ...] | None  #: at the outdoor temperature of this assessment


def _limits(outdoor: AirState | None) -> _Limits:
    return _Limits(
        frsi={use: th.frsi_limit(use) for use in th.ROOM_USES},
        k=th.value("coverage_factor"),
        margin=th.value("dew_point_margin_k"),
        mould=th.value("surface_rh_mould_limit_pct"),
        watch=th.value("surface_rh_mould_watch_pct"),
        frsi_min_dt=th.value("frsi_min_temperature_difference_k"),
        class_limits=None if outdoor is None else th.humidity_class_limits_pa(outdoor.dry_bulb_c),
    )


_SURFACE_KEYS = (
    "condensation_dew_point_margin_k",
    "dew_point_margin_k",
    "surface_rh_mould_limit_pct",
    "surface_rh_mould_watch_pct",
    "coverage_factor",
)


# --- surfaces ----------------------------------------------------------------------------------


class _RoomContext(NamedTuple):
    """Per-room numbers every surface of the room shares (plain floats, for speed)."""

    air: AirState
    vapour_pressure_pa: float
    condensation_point_c: float
    u_ln_pw_sq: float  #: u²(ln p_w) from the room's RH and air temperature
    u_tc: float  #: standard uncertainty of the condensation point, K
    u_ts: float  #: standard uncertainty of a surface temperature, K
    u_ti: float  #: standard uncertainty of the air temperatures, K
    shared_thermometer: bool  #: room and outdoor air read by one thermometer (correlated)
    k: float
    big_u_margin: float  #: expanded uncertainty of every margin in the room, K
    margin_limit: float
    mould_limit: float
    mould_watch: float
    limits: _Limits
    outdoor_temp_c: float | None
    delta_t: float | None  #: t_i − t_e when the factor is judged, else None
    factor_limit: float | None
    factor_state_if_not_judged: FactorState
    keys: tuple[str, ...]  #: threshold keys every surface of this room uses


def _context(
    air: AirState, outdoor: AirState | None, accuracy: Accuracy, use: str, limits: _Limits
) -> _RoomContext:
    u_rh = accuracy.rh_pct / _SQRT3
    u_ti = accuracy.air_temp_k / _SQRT3
    u_ts = accuracy.surface_temp_k / _SQRT3
    u_ln_pw_sq = (u_rh / air.rh_pct) ** 2 + (air.dln_sat_pressure_water_per_k * u_ti) ** 2
    u_tc = math.sqrt(u_ln_pw_sq) / _dln_pws(air.condensation_point_c)
    limit = limits.frsi[use]
    delta_t = None
    keys: tuple[str, ...]
    if limit is None:
        keys = _SURFACE_KEYS
        not_judged = FactorState.NOT_APPLICABLE
    else:
        keys = (*_SURFACE_KEYS, limit.key, "frsi_min_temperature_difference_k")
        not_judged = FactorState.NOT_JUDGED
        if outdoor is not None:
            d = air.dry_bulb_c - outdoor.dry_bulb_c
            if d >= limits.frsi_min_dt:
                delta_t = d
    return _RoomContext(
        air,
        air.vapour_pressure_pa,
        air.condensation_point_c,
        u_ln_pw_sq,
        u_tc,
        u_ts,
        u_ti,
        accuracy.shared_thermometer,
        limits.k,
        limits.k * math.sqrt(u_tc * u_tc + u_ts * u_ts),
        limits.margin,
        limits.mould,
        limits.watch,
        limits,
        None if outdoor is None else outdoor.dry_bulb_c,
        delta_t,
        None if limit is None else limit.value,
        not_judged,
        keys,
    )


_CLEAR, _NEAR, _CONDENSING = _CONDENSATION_ORDER
_BELOW, _APPROACHING, _ABOVE = _MOULD_ORDER
_MEETS, _UNDER = _FACTOR_ORDER


def _spans(order: tuple[Any, ...], cannot_tell: _State) -> dict[Any, Any]:
    """(best, worst) -> (state, possible states), precomputed for every pair."""
    table = {}
    for low, best in enumerate(order):
        for high, worst in enumerate(order):
            if low == high:
                table[best, worst] = (best, (best,))
            elif low < high:
                table[best, worst] = (cannot_tell, order[low : high + 1])
    return table


_CONDENSATION_SPAN = _spans(_CONDENSATION_ORDER, CondensationState.CANNOT_TELL)
_MOULD_SPAN = _spans(_MOULD_ORDER, MouldState.CANNOT_TELL)
_FACTOR_SPAN = _spans(_FACTOR_ORDER, FactorState.CANNOT_TELL)
_ONE_FACTOR = {s: (s,) for s in FactorState}
_NOT_FOR_ELEMENT = FactorState.NOT_FOR_ELEMENT
_NO_MOULD = MouldState.NOT_JUDGED
_NO_MOULD_POSSIBLE = (MouldState.NOT_JUDGED,)
_pws = psychro.sat_vapour_pressure_pa
_POLICY = th.ELEMENT_POLICY
_SETS_TARGET = frozenset(e for e, p in _POLICY.items() if p.sets_room_target)


def _surface(ctx: _RoomContext, surface: SurfaceInput) -> SurfaceFinding:
    ts = surface.surface_temp_c
    if ts.__class__ is not float or not (
        psychro.SURFACE_TEMP_MIN_C <= ts <= psychro.SURFACE_TEMP_MAX_C
    ):
        psychro.check_surface_temp(ts, f"surface temperature of {surface.label}")
        ts = float(ts)
    policy = _POLICY.get(surface.element)
    if policy is None:
        policy = th.check_element(surface.element, f"element of surface {surface.label}")
    u_ts = ctx.u_ts

    # surface RH and its band, in log space: u²(ln RH_s) = u²(ln p_w) + (L(t_s) u_ts)²
    rh_s = 100.0 * ctx.vapour_pressure_pa / _pws(ts)
    spread = math.exp(ctx.k * math.sqrt(ctx.u_ln_pw_sq + (_dln_pws(ts) * u_ts) ** 2))
    rh_low = rh_s / spread
    rh_high = rh_s * spread
    if policy.mould_judged:
        watch, limit = ctx.mould_watch, ctx.mould_limit
        mould, mould_possible = _MOULD_SPAN[
            _ABOVE if rh_low > limit else _APPROACHING if rh_low >= watch else _BELOW,
            _ABOVE if rh_high > limit else _APPROACHING if rh_high >= watch else _BELOW,
        ]
    else:
        mould, mould_possible = _NO_MOULD, _NO_MOULD_POSSIBLE

    # margin to the condensation point and its band
    margin = ts - ctx.condensation_point_c
    big_u = ctx.big_u_margin
    hi, lo = margin + big_u, margin - big_u
    limit = ctx.margin_limit
    condensation, condensation_possible = _CONDENSATION_SPAN[
        _CONDENSING if hi <= 0.0 else _NEAR if hi < limit else _CLEAR,
        _CONDENSING if lo <= 0.0 else _NEAR if lo < limit else _CLEAR,
    ]

    # temperature factor fRsi = (ts − te)/(ti − te) and its band
    d = ctx.delta_t
    if not policy.temperature_factor:
        factor = factor_u = None
        factor_state = _NOT_FOR_ELEMENT
        factor_possible = _ONE_FACTOR[factor_state]
    elif d is None:
        factor = factor_u = None
        factor_state = ctx.factor_state_if_not_judged
        factor_possible = _ONE_FACTOR[factor_state]
    else:
        assert ctx.outdoor_temp_c is not None and ctx.factor_limit is not None
        factor = (ts - ctx.outdoor_temp_c) / d
        u_ti = ctx.u_ti  # the outdoor thermometer is taken to be as good as the room's
        if ctx.shared_thermometer:
            # one thermometer, r = 1 (GUM 5.2): (∂f/∂t_i + ∂f/∂t_e) = −1/Δ
            factor_u = ctx.k * math.sqrt(u_ts * u_ts + u_ti * u_ti) / d
        else:
            factor_u = (
                ctx.k
                * math.sqrt(u_ts * u_ts + (factor * u_ti) ** 2 + ((1.0 - factor) * u_ti) ** 2)
                / d
            )
        limit = ctx.factor_limit
        factor_state, factor_possible = _FACTOR_SPAN[
            _MEETS if factor + factor_u >= limit else _UNDER,
            _MEETS if factor - factor_u >= limit else _UNDER,
        ]
    return SurfaceFinding(
        surface.label,
        policy.element,
        ts,
        rh_s,
        rh_low,
        rh_high,
        ctx.condensation_point_c,
        margin,
        big_u,
        condensation,
        condensation_possible,
        mould,
        mould_possible,
        factor,
        factor_u,
        ctx.factor_limit if policy.temperature_factor else None,
        factor_state,
        factor_possible,
        ctx.keys,
    )


def assess_surface(
    surface: SurfaceInput,
    air: AirState,
    outdoor: AirState | None = None,
    use: str = "other",
    accuracy: Accuracy = DEFAULT_ACCURACY,
) -> SurfaceFinding:
    """Judge one surface against the room air ``air`` (from :func:`air_state`)."""
    return _surface(_context(air, outdoor, accuracy, th.check_use(use), _limits(outdoor)), surface)


# --- materials ---------------------------------------------------------------------------------


def _material(
    reading: MaterialReading, emc_pct: float | None, air_c: float, where: str
) -> MaterialFinding:
    field = f"{where}material {reading.label}"
    if reading.scale not in MATERIAL_SCALES:
        raise InputError(
            f"{field} scale",
            reading.scale,
            "expected mc_pct (timber moisture content, %), wme_pct (wood moisture "
            "equivalent, %) or relative (the meter's own scale)",
        )
    top = _MATERIAL_READING_MAX
    for name, number in (("reading", reading.value), ("dry standard", reading.dry_standard)):
        if number is None and name == "dry standard":
            continue
        if (
            not isinstance(number, (int, float))
            or isinstance(number, bool)
            or not math.isfinite(number)
            or not 0.0 <= number <= top
        ):
            raise InputError(f"{field} {name}", number, f"must be between 0 and {top:g}")
    keys: list[str] = []
    if reading.dry_standard is None:
        dry_state = DryStandardState.NO_REFERENCE
        excess = None
    else:
        keys.append("dry_standard_tolerance_fraction")
        excess = reading.value - reading.dry_standard
        allowed = reading.dry_standard * (1.0 + th.value("dry_standard_tolerance_fraction"))
        dry_state = DryStandardState.AT if reading.value <= allowed else DryStandardState.ABOVE
    timber_state = None
    emc = None
    wetter = slowed = False
    if reading.timber and reading.scale == "mc_pct":
        keys += ["timber_mould_mc_pct", "timber_decay_mc_pct"]
        emc = emc_pct
        mould_mc = th.value("timber_mould_mc_pct")
        if reading.value >= th.value("timber_decay_mc_pct"):
            timber_state = TimberState.DECAY_RANGE
        elif reading.value >= mould_mc:
            timber_state = TimberState.MOULD_RANGE
        else:
            timber_state = TimberState.DRY
        wetter = timber_state is not TimberState.DRY and emc_pct is not None and emc_pct < mould_mc
        if timber_state is TimberState.DECAY_RANGE:
            keys += ["timber_decay_slow_below_c", "timber_decay_slow_above_c"]
            slowed = not (
                th.value("timber_decay_slow_below_c")
                <= air_c
                <= th.value("timber_decay_slow_above_c")
            )
    return MaterialFinding(
        label=reading.label,
        material=reading.material,
        value=reading.value,
        scale=reading.scale,
        dry_standard=reading.dry_standard,
        dry_standard_state=dry_state,
        excess_over_dry_standard=excess,
        timber_state=timber_state,
        emc_pct=emc,
        wetter_than_air_explains=wetter,
        decay_slowed_by_temperature=slowed,
        threshold_keys=tuple(keys),
    )


# --- rooms and site ----------------------------------------------------------------------------


def _check_room(room: RoomInput) -> str:
    """The room's canonical use, after checking what the psychrometric core does not."""
    try:
        use = th.check_use(room.use)
    except InputError as exc:
        raise exc.with_field(f"room {room.name!r} use") from None
    obs = room.observations
    v_low, v_high = domain.ROOM_VOLUME_MIN_M3, domain.ROOM_VOLUME_MAX_M3
    people = domain.OCCUPANTS_MAX
    area_high = domain.MOULD_AREA_MAX_M2
    area = obs.visible_mould_area_m2
    if (
        (room.volume_m3 is None or _number_in(room.volume_m3, v_low, v_high))
        and (
            room.occupants is None
            or (room.occupants.__class__ is int and 0 <= room.occupants <= people)
        )
        and not room.activities
        and obs.water_category in (None, 1, 2, 3)
        and (
            (area.__class__ is float and 0.0 <= area <= area_high)
            or _number_in(area, 0.0, area_high)
        )
    ):
        return use
    where = f"room {room.name!r}"
    if room.volume_m3 is not None and not _number_in(room.volume_m3, v_low, v_high):
        raise InputError(
            f"{where} volume", room.volume_m3, f"must be between {v_low:g} and {v_high:g} m³"
        )
    n = room.occupants
    if n is not None and (n.__class__ is not int or not 0 <= n <= people):
        raise InputError(f"{where} occupants", n, f"must be a whole number from 0 to {people}")
    hours = domain.ACTIVITY_HOURS_MAX
    for activity in room.activities:
        if activity.kind not in th.ACTIVITY_RATE:
            raise InputError(
                f"{where} activity", activity.kind, "expected one of " + ", ".join(th.ACTIVITY_RATE)
            )
        if not _number_in(activity.hours_per_day, 0.0, hours):
            raise InputError(
                f"{where} {activity.kind} hours per day",
                activity.hours_per_day,
                f"must be between 0 and {hours:g}",
            )
    if obs.water_category not in (None, 1, 2, 3):
        raise InputError(f"{where} water category", obs.water_category, "expected 1, 2 or 3")
    if not _number_in(obs.visible_mould_area_m2, 0.0, area_high):
        raise InputError(
            f"{where} visible mould area",
            obs.visible_mould_area_m2,
            f"must be between 0 and {area_high:g} m²",
        )
    return use


def _humidity_class(
    air: AirState, outdoor: AirState, accuracy: Accuracy, k: float, limits: tuple[float, ...] | None
) -> tuple[float, float, int | None, tuple[int, ...]]:
    """Vapour-pressure excess, its expanded uncertainty, the class and the classes its band
    spans (see :func:`survey.thresholds.humidity_class` for the class rule)."""
    excess = air.vapour_pressure_pa - outdoor.vapour_pressure_pa
    u_rh = accuracy.rh_pct / _SQRT3 / 100.0
    u_t = accuracy.air_temp_k / _SQRT3
    terms = 0.0
    for state in (air, outdoor):
        terms += (state.sat_pressure_water_pa * u_rh) ** 2
        terms += (state.vapour_pressure_pa * state.dln_sat_pressure_water_per_k * u_t) ** 2
    big_u = k * math.sqrt(terms)
    if limits is None:
        return excess, big_u, None, ()
    low = th.humidity_class_in(excess - big_u, limits)
    high = th.humidity_class_in(excess + big_u, limits)
    return (excess, big_u, th.humidity_class_in(excess, limits), tuple(range(low, high + 1)))


_CLASS_KEYS = (*th.HUMIDITY_CLASS_KEYS, "humidity_class_flat_below_c", "humidity_class_zero_at_c")


@lru_cache(maxsize=64)
def _with_class_keys(keys: tuple[str, ...]) -> tuple[str, ...]:
    return keys + _CLASS_KEYS


def _assess_room(
    room: RoomInput,
    outdoor: AirState | None,
    pressure_pa: float,
    site_accuracy: Accuracy,
    limits: _Limits,
) -> RoomFinding:
    use = _check_room(room)
    accuracy = room.accuracy or site_accuracy
    try:
        air = air_state(room.air_temp_c, room.rh_pct, pressure_pa)
    except InputError as exc:
        raise exc.with_field(f"room {room.name!r} {exc.field}") from None
    ctx = _context(air, outdoor, accuracy, use, limits)
    surfaces = tuple([_surface(ctx, s) for s in room.surfaces])
    surfaces = _not_judged_by_use(room, use, surfaces)
    keys = ctx.keys if outdoor is None else _with_class_keys(ctx.keys)

    coldest = other = None
    rh_mould = rh_margin = rh_low = rh_high = rh_dry_other = None
    setting: tuple[SurfaceFinding, ...] = surfaces
    if surfaces and not {s.element for s in surfaces} <= _SETS_TARGET:
        setting = tuple(s for s in surfaces if s.element in _SETS_TARGET)
        others = [s for s in surfaces if s.element not in _SETS_TARGET]
        other = min(others, key=_surface_temp)
        # Clear of condensation while the surface RH stays below 100 %: the same relation
        # as below with the limit at 100 %.
        rh_dry_other = min(100.0, air.rh_pct * 100.0 / other.surface_rh_pct)
    if setting:
        coldest = min(setting, key=_surface_temp)
        ts = coldest.surface_temp_c
        # psychro.max_room_rh_pct's relation, RH_max = limit · p_ws(t_s) / p_ws,water(t_i)
        # (the vapour pressure is the same at the surface and in the room; pressure cancels).
        # With the surface RH at hand that is RH_room · limit / RH_surface; a test holds both
        # equal to psychro's.
        rh_mould = min(100.0, air.rh_pct * limits.mould / coldest.surface_rh_pct)
        margin_ts = ts - limits.margin
        rh_margin = (
            min(
                100.0, 100.0 * psychro.sat_vapour_pressure_pa(margin_ts) / air.sat_pressure_water_pa
            )
            if margin_ts >= psychro.SURFACE_TEMP_MIN_C
            else 0.0
        )
        # ln RH_max = ln(limit) + ln p_ws(t_s) − ln p_ws,water(t_i): the band of the binding
        # limit from the surface and air thermometers.
        binding_ts, binding = (ts, rh_mould) if rh_mould <= rh_margin else (margin_ts, rh_margin)
        if 0.0 < binding < 100.0:
            l_s = _dln_pws(binding_ts)
            spread = math.exp(
                limits.k
                * math.sqrt(
                    (l_s * ctx.u_ts) ** 2 + (air.dln_sat_pressure_water_per_k * ctx.u_ti) ** 2
                )
            )
            rh_low = binding / spread
            rh_high = min(100.0, binding * spread)
        else:
            rh_low = rh_high = binding

    excess = excess_u = number = None
    possible: tuple[int, ...] = ()
    if outdoor is not None:
        excess, excess_u, number, possible = _humidity_class(
            air, outdoor, accuracy, limits.k, limits.class_limits
        )

    materials: tuple[MaterialFinding, ...] = ()
    if room.materials:
        emc = emc_or_none(air.dry_bulb_c, air.rh_pct)
        materials = tuple(
            _material(m, emc, air.dry_bulb_c, f"room {room.name!r} ") for m in room.materials
        )
        extra = {key for m in materials for key in m.threshold_keys}
        keys = keys + tuple(sorted(extra - set(keys)))
    return RoomFinding(
        room,
        use,
        air,
        outdoor,
        accuracy,
        limits.k * ctx.u_tc,
        surfaces,
        coldest,
        rh_mould,
        rh_margin,
        rh_low,
        rh_high,
        other,
        rh_dry_other,
        excess,
        excess_u,
        number,
        possible,
        materials,
        th.FRSI_LIMIT_BY_USE[use].key,
        keys,
    )


#: Uses where the ground, not outdoor air, sets floor and wall temperatures.
GROUND_USES = frozenset(u for u, p in th.ROOM_USE_POLICY.items() if p.ground_contact)
_GROUND_ELEMENTS = frozenset({"floor", "external_wall", "internal_wall"})
_FACTOR_JUDGED = frozenset(
    {FactorState.MEETS, FactorState.UNDER, FactorState.CANNOT_TELL, FactorState.NOT_JUDGED}
)


def _wet_and_drying(room: RoomInput) -> bool:
    """Drying under way with materials above their dry standard (or timber decay range)."""
    if not room.observations.drying_in_progress:
        return False
    tolerance = th.value("dry_standard_tolerance_fraction")
    return any(
        m.dry_standard is not None and m.value > m.dry_standard * (1.0 + tolerance)
        for m in room.materials
    )


def _not_judged_by_use(
    room: RoomInput, use: str, surfaces: tuple[SurfaceFinding, ...]
) -> tuple[SurfaceFinding, ...]:
    """The temperature factor set aside where outdoor air does not set the surface
    temperature (ground contact) or evaporation cools it (wet materials drying); mould not
    judged outside the 5-40 °C surface range of the 80 % criterion."""
    wet = _wet_and_drying(room)
    low = th.value("mould_growth_min_surface_temp_c")
    high = th.value("mould_growth_max_surface_temp_c")
    out = []
    for s in surfaces:
        state = None
        if s.temperature_factor_state in _FACTOR_JUDGED:
            if wet:
                state = FactorState.DRYING_WET
            elif use in GROUND_USES and s.element in _GROUND_ELEMENTS:
                state = FactorState.GROUND_CONTACT
        if state is not None:
            s = s._replace(
                temperature_factor=None,
                temperature_factor_uncertainty=None,
                temperature_factor_state=state,
                temperature_factor_possible=(state,),
            )
        if s.mould is not MouldState.NOT_JUDGED:
            mould = (
                MouldState.TOO_COLD
                if s.surface_temp_c < low
                else MouldState.TOO_HOT
                if s.surface_temp_c > high
                else None
            )
            if mould is not None:
                s = s._replace(mould=mould, mould_possible=(mould,))
        out.append(s)
    return tuple(out)


def _surface_temp(finding: SurfaceFinding) -> float:
    return finding.surface_temp_c


def outdoor_state(
    outdoor: OutdoorInput, pressure_pa: float = psychro.STANDARD_PRESSURE_PA
) -> AirState:
    """The light state of the outdoor air."""
    return air_state(outdoor.air_temp_c, outdoor.rh_pct, pressure_pa, "outdoor")


def assess_room(
    room: RoomInput,
    outdoor: OutdoorInput | None = None,
    pressure_pa: float = psychro.STANDARD_PRESSURE_PA,
    accuracy: Accuracy = DEFAULT_ACCURACY,
) -> RoomFinding:
    """Judge one room's air, surfaces and materials. ``accuracy`` is used when the room
    carries none of its own."""
    out = None if outdoor is None else outdoor_state(outdoor, pressure_pa)
    return _assess_room(room, out, pressure_pa, accuracy, _limits(out))


def assess_site(
    rooms: Iterable[RoomInput],
    outdoor: OutdoorInput | None = None,
    pressure_pa: float = psychro.STANDARD_PRESSURE_PA,
    accuracy: Accuracy = DEFAULT_ACCURACY,
    year_built: int | None = None,
) -> SiteFinding:
    """Judge every room of a visit against the same outdoor air and pressure."""
    psychro.check_pressure(pressure_pa)
    if year_built is not None and (
        not isinstance(year_built, int)
        or isinstance(year_built, bool)
        or not 1000 <= year_built <= 2200
    ):
        raise InputError("year built", year_built, "expected a year such as 1935")
    out = None if outdoor is None else outdoor_state(outdoor, pressure_pa)
    limits = _limits(out)
    findings = tuple([_assess_room(r, out, pressure_pa, accuracy, limits) for r in rooms])
    keys: set[str] = {"coverage_factor"}
    for f in findings:
        keys.update(f.threshold_keys)
    return SiteFinding(
        findings, out, pressure_pa, accuracy, year_built, tuple(t.key for t in th.cited(keys))
    )
