"""The colder month: today's measured temperature factors and moisture excess projected to a
design outdoor month, by the temperature-factor method of EN ISO 13788.

A spot reading on a mild day says little about January. What it does measure are two things
that change slowly with the weather: each surface's temperature factor
fRsi = (θs − θe)/(θi − θe), a property of the wall and its thermal bridges, and the room's
vapour-pressure excess Δp = pi − pe, a property of its moisture load and ventilation. Carried
to a design month (mean outdoor temperature θe,d and RH φe,d, indoor temperature θi,d):

* surface temperature   θsi = θe,d + fRsi · (θi,d − θe,d)
* outdoor vapour pressure pe,d = φe,d · psat,water(θe,d)   (RH relative to water, as measured)
* room vapour pressure  pi,d = pe,d + Δp,d
* surface RH            φsi = pi,d / psat(θsi)   (over ice below 0.01 °C, as the assessment)

and judged by the assessment's own limits: the mould limit ``surface_rh_mould_limit_pct``
(80 %, which EN ISO 13788 applies to the monthly mean) and condensation at 100 % surface RH
(``condensation_dew_point_margin_k``, the surface at the dew or frost point). The 5-40 °C
surface range the assessment uses for a spot reading (ASHRAE 160) is not applied to a month:
EN ISO 13788's monthly criterion has none, and a surface that cold for a month is judged
for condensation all the same.

Only a surface whose temperature factor was judged today is projected: the assessment judges
it where the inside-outside difference reached ``frsi_min_temperature_difference_k`` and the
element and room use call for it (:mod:`survey.assess`), and that rule is reused, not
repeated. Others are ``NOT_MEASURABLE`` (the factor could not be measured today) or
``NOT_PROJECTED`` (glass, frames, pipes, ground-contact elements, wet materials drying).

The excess in the design month
------------------------------
:class:`ExcessModel` says which:

* ``CLASS_LINE`` (the default): the measured excess is carried along the shape of the
  EN ISO 13788 Annex A humidity-class lines — constant at and below 0 °C outdoors, falling
  linearly to zero at 20 °C (``humidity_class_flat_below_c``, ``humidity_class_zero_at_c``,
  read through :func:`survey.thresholds.humidity_class_limits_pa`). So
  Δp,d = Δp · s(θe,d)/s(θe) with s the line's scale; the room stays at the same place
  within its class. The factor s(θe,d)/s(θe) grows without bound as today's outdoor air
  nears 20 °C (×4 at 15 °C, ×20 at 19 °C), so the line is used only on a day no warmer than
  ``class_line_warmest_outdoor_c`` (10 °C: at most ×2); on a warmer day the excess is held
  as measured and the words say it may understate a colder month's
  (``excess_model_fallback``).
* ``MEASURED``: Δp,d = Δp.

Whichever it is, the room's vapour pressure pe,d + Δp,d is held at saturation over water at
θi,d: an excess that would carry the room's air past saturation is no room that exists, so
its surfaces are ``NOT_MEANINGFUL`` (the room's ``reason`` is ``ROOM_SATURATED``), never a
surface RH of 200 %.

A negative excess (a room drier than outdoors, which a heated room in winter does not stay
without drying equipment) is projected as no excess: the floor of class 1.

The indoor temperature is the design month's when it gives one, else the room's as measured.

The arithmetic, its uncertainty (first-order GUM, with the correlation through a shared
thermometer) and the search for the lowest month each surface bears are
:mod:`survey.season_math`'s.
"""

from __future__ import annotations

import math
from dataclasses import dataclass
from enum import Enum
from typing import TYPE_CHECKING, NamedTuple

from survey import psychro
from survey import thresholds as th
from survey.assess import (
    CondensationState,
    FactorState,
    MouldState,
    RoomFinding,
    SiteFinding,
    SurfaceFinding,
)
from survey.assess.records import RankedState
from survey.errors import InputError
from survey.season_math import (
    SEARCH_STEP_K,
    SEARCH_TOLERANCE_K,
    ExcessModel,
    InverseOutcome,
    LowestMonth,
    Point,
    Readings,
    combined,
    evaluate,
    excess_in_month,
    lowest_month,
    room_vapour_pressure,
)

if TYPE_CHECKING:  # the model (msgspec) stays off the quick check's import path
    from survey import model

_SQRT3 = math.sqrt(3.0)

__all__ = [
    "DEFAULT_MONTH_KEYS",
    "PROJECTION_KEYS",
    "SEARCH_STEP_K",
    "SEARCH_TOLERANCE_K",
    "DesignMonth",
    "DesignState",
    "ExcessModel",
    "InverseOutcome",
    "LowestMonth",
    "RoomProjection",
    "RoomReason",
    "SurfaceProjection",
    "default_design_month",
    "project_room",
    "project_site",
    "site_design_month",
    "usable_site_month",
]

# --- states ------------------------------------------------------------------------------------


class DesignState(RankedState):
    """A surface in the design month. ``rank`` is higher for worse; None where not judged."""

    BELOW = ("below_limit", 0)
    ABOVE = ("above_limit", 1)
    CONDENSING = ("condensing", 2)
    CANNOT_TELL = ("cannot_tell", None)
    NOT_MEASURABLE = ("not_measurable", None)
    NOT_PROJECTED = ("not_projected", None)
    #: The room's air itself would saturate in the month: no surface RH is projected.
    NOT_MEANINGFUL = ("not_meaningful", None)


_ORDER = (DesignState.BELOW, DesignState.ABOVE, DesignState.CONDENSING)
_FAILING = frozenset({DesignState.ABOVE, DesignState.CONDENSING})


class RoomReason(Enum):
    """Why no surface of a room could be projected (None on :class:`RoomProjection` when the
    room could be)."""

    NO_OUTDOOR = "no_outdoor"  #: no outdoor reading today: no factor, no excess
    INDOOR_NOT_WARMER = "indoor_not_warmer"  #: the design month is as warm as the room
    #: The room's air itself would saturate in the design month: outdoor vapour pressure plus
    #: the excess carried there is at least saturation at the indoor temperature.
    ROOM_SATURATED = "room_saturated"


# --- the design month --------------------------------------------------------------------------

#: The keys of the default design month's records.
DEFAULT_MONTH_KEYS = ("design_month_outdoor_temp_default_c", "design_month_outdoor_rh_default_pct")

#: The keys every projection rests on.
PROJECTION_KEYS = (
    "surface_rh_mould_limit_pct",
    "condensation_dew_point_margin_k",
    "frsi_min_temperature_difference_k",
    "humidity_class_flat_below_c",
    "humidity_class_zero_at_c",
    "coverage_factor",
    "design_month_search_lowest_c",
)


@dataclass(frozen=True, slots=True)
class DesignMonth:
    """The month projected to: mean outdoor temperature and RH (relative to water), and the
    indoor temperature held in it (None: each room's as measured). ``source`` is ``"given"``
    (a face's options), ``"site"`` (the survey's site) or ``"default"``; the two ``*_default``
    flags say which part is our default (:data:`DEFAULT_MONTH_KEYS`)."""

    outdoor_temp_c: float
    outdoor_rh_pct: float
    indoor_temp_c: float | None = None
    source: str = "given"
    outdoor_temp_default: bool = False
    outdoor_rh_default: bool = False

    def __post_init__(self) -> None:
        psychro.check_dry_bulb(self.outdoor_temp_c, "design outdoor temperature")
        psychro.check_rh(self.outdoor_rh_pct, "design outdoor RH")
        if self.indoor_temp_c is not None:
            psychro.check_dry_bulb(self.indoor_temp_c, "design indoor temperature")
            if self.indoor_temp_c <= self.outdoor_temp_c:
                raise InputError(
                    "design indoor temperature",
                    f"{self.indoor_temp_c:g} °C",
                    "must be above the design outdoor temperature "
                    f"({self.outdoor_temp_c:g} °C): the projection is for a heated month",
                )
        if self.source not in ("given", "site", "default"):
            raise ValueError(f"design month source {self.source!r}")

    @property
    def is_default(self) -> bool:
        """Any part of the month is our default rather than given."""
        return self.outdoor_temp_default or self.outdoor_rh_default

    @property
    def threshold_keys(self) -> tuple[str, ...]:
        keys = []
        if self.outdoor_temp_default:
            keys.append(DEFAULT_MONTH_KEYS[0])
        if self.outdoor_rh_default:
            keys.append(DEFAULT_MONTH_KEYS[1])
        return tuple(keys)


def default_design_month() -> DesignMonth:
    """Our default month (``design_month_outdoor_*_default_*``), the rooms as measured."""
    return DesignMonth(
        th.value(DEFAULT_MONTH_KEYS[0]),
        th.value(DEFAULT_MONTH_KEYS[1]),
        None,
        "default",
        outdoor_temp_default=True,
        outdoor_rh_default=True,
    )


def site_design_month(site: model.Site) -> DesignMonth:
    """The site's design month; a part it does not give is our default (and flagged so).
    ``InputError`` when what it gives cannot be projected to (outside the psychrometric
    domain, or an indoor temperature not above the outdoor)."""
    temp, rh = site.design_outdoor_temp_c, site.design_outdoor_rh_pct
    if temp is None and rh is None and site.design_indoor_temp_c is None:
        return default_design_month()
    return DesignMonth(
        th.value(DEFAULT_MONTH_KEYS[0]) if temp is None else temp,
        th.value(DEFAULT_MONTH_KEYS[1]) if rh is None else rh,
        site.design_indoor_temp_c,
        "site",
        outdoor_temp_default=temp is None,
        outdoor_rh_default=rh is None,
    )


def usable_site_month(site: model.Site) -> tuple[DesignMonth, InputError | None]:
    """The site's design month, or our default and the error that refused the site's. A site
    loaded from a file has none to refuse (the store checks it, ``model.problems``); one being
    edited in memory may."""
    try:
        return site_design_month(site), None
    except InputError as exc:
        return default_design_month(), exc


# --- results -----------------------------------------------------------------------------------


class SurfaceProjection(NamedTuple):
    """One surface in the design month, beside today's reading."""

    label: str
    element: str
    state: DesignState
    possible: tuple[DesignState, ...]
    factor_state: FactorState  #: today's; why a surface is not projected
    temperature_factor: float | None
    temperature_factor_uncertainty: float | None  #: expanded (k), from the assessment
    design_surface_temp_c: float | None
    design_surface_temp_uncertainty_k: float | None  #: expanded
    design_surface_rh_pct: float | None
    design_surface_rh_low_pct: float | None
    design_surface_rh_high_pct: float | None
    today_surface_rh_pct: float
    today_mould: MouldState  #: today's state (with its band)
    today_condensation: CondensationState
    lowest_month: LowestMonth | None

    @property
    def projected(self) -> bool:
        return self.design_surface_rh_pct is not None

    @property
    def fails_in_month(self) -> bool:
        """Above the mould limit, or condensing, in the design month, across its whole band
        (a band from above the mould limit to condensing fails either way)."""
        return self.projected and all(p in _FAILING for p in self.possible)

    @property
    def may_fail_in_month(self) -> bool:
        """The band reaches above the mould limit, though its lower end is below it."""
        return (
            self.state is DesignState.CANNOT_TELL
            and not self.fails_in_month
            and any(p in _FAILING for p in self.possible)
        )

    @property
    def safe_today(self) -> bool:
        """Today's reading itself is at or below the mould limit (and so clear of
        condensation): the surface looks safe on the day."""
        return self.today_surface_rh_pct <= th.value("surface_rh_mould_limit_pct")

    @property
    def only_safe_today(self) -> bool:
        """Looks safe today, but fails (or may fail) in the design month."""
        return self.safe_today and (self.fails_in_month or self.may_fail_in_month)


class RoomProjection(NamedTuple):
    """A room's surfaces in the design month, and what the projection rested on."""

    name: str
    use: str
    month: DesignMonth
    reason: RoomReason | None  #: None: the room was projected
    indoor_temp_c: float  #: used in the design month
    indoor_measured: bool  #: the room's as measured (the month gives none)
    excess_model: ExcessModel  #: the one used
    #: Class line asked, but today's outdoor air was warmer than
    #: ``class_line_warmest_outdoor_c``: held as measured.
    excess_model_fallback: bool
    measured_outdoor_temp_c: float | None
    measured_excess_pa: float | None
    measured_excess_uncertainty_pa: float | None  #: expanded, the assessment's
    humidity_class: int | None  #: today's (the assessment's)
    design_outdoor_vapour_pressure_pa: float
    design_vapour_pressure_excess_pa: float | None
    design_vapour_pressure_excess_uncertainty_pa: float | None  #: expanded
    #: The room's in the design month, held at saturation at the indoor temperature (so
    #: below outdoor plus excess when ``reason`` is ``ROOM_SATURATED``).
    design_vapour_pressure_pa: float | None
    surfaces: tuple[SurfaceProjection, ...]
    threshold_keys: tuple[str, ...]

    @property
    def worst(self) -> SurfaceProjection | None:
        """The projected surface of the highest design-month surface RH."""
        projected = [s for s in self.surfaces if s.projected]
        return max(projected, key=_design_rh) if projected else None

    @property
    def failing(self) -> tuple[SurfaceProjection, ...]:
        """Surfaces above the mould limit or condensing in the design month, or possibly."""
        return tuple(s for s in self.surfaces if s.fails_in_month or s.may_fail_in_month)

    @property
    def only_safe_today(self) -> tuple[SurfaceProjection, ...]:
        return tuple(s for s in self.surfaces if s.only_safe_today)


def _design_rh(s: SurfaceProjection) -> float:
    return s.design_surface_rh_pct or 0.0


# --- the projection ----------------------------------------------------------------------------


def _band(point: Point, k: float) -> tuple[float, float]:
    spread = math.exp(k * point.u_ln_rh)
    return point.rh_pct / spread, point.rh_pct * spread


def _state(low: float, high: float, mould: float) -> tuple[DesignState, tuple[DesignState, ...]]:
    def one(rh: float) -> int:
        return 2 if rh >= 100.0 else 1 if rh > mould else 0

    a, b = one(low), one(high)
    if a == b:
        return _ORDER[a], (_ORDER[a],)
    return DesignState.CANNOT_TELL, _ORDER[a : b + 1]


def _not_projected(s: SurfaceFinding, state: DesignState) -> SurfaceProjection:
    return SurfaceProjection(
        s.label,
        s.element,
        state,
        (state,),
        s.temperature_factor_state,
        s.temperature_factor,
        s.temperature_factor_uncertainty,
        None,
        None,
        None,
        None,
        None,
        s.surface_rh_pct,
        s.mould,
        s.condensation,
        None,
    )


def project_room(
    finding: RoomFinding,
    month: DesignMonth,
    excess_model: ExcessModel = ExcessModel.CLASS_LINE,
    with_lowest: bool = True,
) -> RoomProjection:
    """Every surface of a judged room carried to ``month`` (see the module notes);
    ``with_lowest=False`` skips the search for the lowest month each surface bears."""
    air, outdoor = finding.air, finding.outdoor
    ti_d = air.dry_bulb_c if month.indoor_temp_c is None else month.indoor_temp_c
    pe_d = month.outdoor_rh_pct / 100.0 * psychro.sat_vapour_pressure_water_pa(month.outdoor_temp_c)
    keys = (*PROJECTION_KEYS, *month.threshold_keys)
    if excess_model is ExcessModel.CLASS_LINE:  # the warmest day the class line is used on
        keys = (*keys, "class_line_warmest_outdoor_c")
    used = excess_model
    fallback = False
    if (
        outdoor is not None
        and used is ExcessModel.CLASS_LINE
        and outdoor.dry_bulb_c > th.value("class_line_warmest_outdoor_c")
    ):
        used, fallback = ExcessModel.MEASURED, True
    reason = None
    if outdoor is None:
        reason = RoomReason.NO_OUTDOOR
    elif ti_d <= month.outdoor_temp_c:
        reason = RoomReason.INDOOR_NOT_WARMER

    surfaces: list[SurfaceProjection] = []
    design_excess = design_excess_u = design_p = None
    if outdoor is not None:
        acc = finding.accuracy
        readings = Readings(
            0.0,
            air.dry_bulb_c,
            outdoor.dry_bulb_c,
            air.vapour_pressure_pa,
            outdoor.vapour_pressure_pa,
            air.sat_pressure_water_pa,
            outdoor.sat_pressure_water_pa,
            air.dln_sat_pressure_water_per_k,
            outdoor.dln_sat_pressure_water_per_k,
            acc.surface_temp_k / _SQRT3,
            acc.air_temp_k / _SQRT3,
            acc.rh_pct / _SQRT3 / 100.0,
            acc.shared_thermometer,
            th.value("coverage_factor"),
        )
        design_excess, sens = excess_in_month(readings, month.outdoor_temp_c, used)
        design_excess_u = readings.k * combined(readings, sens)
        design_p, saturated = room_vapour_pressure(pe_d, design_excess, ti_d)
        if saturated and reason is None:
            reason = RoomReason.ROOM_SATURATED
    mould = th.value("surface_rh_mould_limit_pct")
    for s in finding.surfaces:
        if s.temperature_factor is None:
            state = (
                DesignState.NOT_MEASURABLE
                if s.temperature_factor_state is FactorState.NOT_JUDGED
                else DesignState.NOT_PROJECTED
            )
            surfaces.append(_not_projected(s, state))
            continue
        if reason is not None:
            surfaces.append(
                _not_projected(
                    s,
                    DesignState.NOT_MEANINGFUL
                    if reason is RoomReason.ROOM_SATURATED
                    else DesignState.NOT_PROJECTED,
                )
            )
            continue
        r = readings._replace(ts=s.surface_temp_c)
        point = evaluate(r, month.outdoor_temp_c, month.outdoor_rh_pct, month.indoor_temp_c, used)
        low, high = _band(point, r.k)
        state, possible = _state(low, high, mould)
        surfaces.append(
            SurfaceProjection(
                s.label,
                s.element,
                state,
                possible,
                s.temperature_factor_state,
                s.temperature_factor,
                s.temperature_factor_uncertainty,
                point.surface_temp_c,
                r.k * point.u_surface_temp,
                point.rh_pct,
                low,
                high,
                s.surface_rh_pct,
                s.mould,
                s.condensation,
                lowest_month(r, month.outdoor_rh_pct, month.indoor_temp_c, used)
                if with_lowest
                else None,
            )
        )
    return RoomProjection(
        finding.name,
        finding.use,
        month,
        reason,
        ti_d,
        month.indoor_temp_c is None,
        used,
        fallback,
        None if outdoor is None else outdoor.dry_bulb_c,
        finding.vapour_pressure_excess_pa,
        finding.vapour_pressure_excess_uncertainty_pa,
        finding.humidity_class,
        pe_d,
        design_excess,
        design_excess_u,
        design_p,
        tuple(surfaces),
        keys,
    )


def project_site(
    site: SiteFinding,
    month: DesignMonth,
    excess_model: ExcessModel = ExcessModel.CLASS_LINE,
    with_lowest: bool = True,
) -> tuple[RoomProjection, ...]:
    """Every room of a judged visit carried to ``month``."""
    return tuple(project_room(f, month, excess_model, with_lowest) for f in site.rooms)
