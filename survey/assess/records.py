"""The assessment's records: ordered states, inputs, the light air state, timber EMC, findings."""

from __future__ import annotations

import math
from enum import Enum
from typing import NamedTuple

import msgspec

from survey import domain, psychro
from survey import thresholds as th
from survey.errors import InputError

# --- ordered state names ---------------------------------------------------------------------


class RankedState(Enum):
    """A state name with a rank (higher is worse; None for 'cannot tell'). Its words for
    people are :mod:`survey.words`'."""

    rank: int | None

    def __new__(cls, value: str, rank: int | None) -> RankedState:
        member = object.__new__(cls)
        member._value_ = value
        member.rank = rank
        return member

    def __str__(self) -> str:
        return str(self.value)


class CondensationState(RankedState):
    CLEAR = ("clear", 0)
    NEAR = ("near_dew_point", 1)
    CONDENSING = ("condensing", 2)
    CANNOT_TELL = ("cannot_tell", None)


class MouldState(RankedState):
    BELOW = ("below_limit", 0)
    APPROACHING = ("approaching_limit", 1)
    ABOVE = ("above_limit", 2)
    CANNOT_TELL = ("cannot_tell", None)
    NOT_JUDGED = ("not_judged", None)
    TOO_COLD = ("too_cold_now", None)
    TOO_HOT = ("too_hot_now", None)


class FactorState(RankedState):
    MEETS = ("meets_limit", 0)
    UNDER = ("under_limit", 1)
    CANNOT_TELL = ("cannot_tell", None)
    NOT_JUDGED = ("not_judged", None)
    NOT_APPLICABLE = ("not_applicable", None)
    NOT_FOR_ELEMENT = ("not_for_element", None)
    GROUND_CONTACT = ("ground_contact", None)
    DRYING_WET = ("drying_wet", None)
    #: Warmer than the room air: heated, sunlit or beside a heat source, so its
    #: temperature does not show the fabric's heat loss.
    WARMER_THAN_AIR = ("warmer_than_air", None)


class DryStandardState(RankedState):
    AT = ("at_dry_standard", 0)
    ABOVE = ("above_dry_standard", 1)
    NO_REFERENCE = ("no_reference", None)


class TimberState(RankedState):
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


class Accuracy(msgspec.Struct, frozen=True):
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


class SurfaceInput(msgspec.Struct, frozen=True):
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


class MaterialInput(msgspec.Struct, frozen=True):
    """A moisture-meter reading: ``mc_pct`` is moisture content in % by weight (timber,
    pin meter on the wood scale), ``relative`` the meter's own comparative scale. The dry
    standard is the reading of the same material in an unaffected area, same scale."""

    label: str
    material: str
    value: float
    scale: str = "mc_pct"
    dry_standard: float | None = None
    timber: bool = False
    #: The visit (its index) the dry standard was read on, when not the reading's own: an
    #: unaffected area read on an earlier visit and not read again since.
    dry_standard_visit: int | None = None


class Activity(msgspec.Struct, frozen=True):
    """A moisture-producing activity in the room (``thresholds.ACTIVITY_RATE`` kinds)."""

    kind: str
    hours_per_day: float


class Observations(msgspec.Struct, frozen=True):
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


class DryingEquipment(msgspec.Struct, frozen=True):
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


class RoomInput(msgspec.Struct, frozen=True):
    """One room's readings. ``use`` is one of :data:`survey.thresholds.ROOM_USES`."""

    name: str
    use: str
    air_temp_c: float
    rh_pct: float
    surfaces: tuple[SurfaceInput, ...] = ()
    volume_m3: float | None = None
    occupants: int | None = None
    activities: tuple[Activity, ...] = ()
    materials: tuple[MaterialInput, ...] = ()
    observations: Observations = msgspec.field(default_factory=Observations)
    accuracy: Accuracy | None = None  #: None: the site's accuracy
    laundry_loads_per_day: float | None = None  #: wash loads dried indoors in the room


class OutdoorInput(msgspec.Struct, frozen=True):
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
    dew_point_margin_k: float  #: surface temperature minus the condensation point
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
    #: The visit (index) the dry standard was read on when it is an earlier one's; None: this
    #: visit's (or none).
    dry_standard_visit: int | None = None


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
