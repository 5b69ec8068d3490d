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
  within its class. When today's outdoor air was at or above 20 °C there is no line to carry
  it along and the excess is held as measured (``excess_model_fallback``).
* ``MEASURED``: Δp,d = Δp.

A negative excess (a room drier than outdoors, which a heated room in winter does not stay
without drying equipment) is projected as no excess: the floor of class 1.

The indoor temperature is the design month's when it gives one, else the room's as measured.

Uncertainty
-----------
First-order propagation (GUM, as :mod:`survey.assess`) from the readings the projection rests
on, with the accuracies the assessment already carries (:class:`survey.assess.Accuracy`, ±a
read as rectangular, u = a/√3, coverage factor ``coverage_factor``): the surface temperature
ts, the room and outdoor air temperatures ti and te, and the room and outdoor RH. With
Δ = ti − te, D = θi,d − θe,d, f = (ts − te)/Δ, r = s(θe,d)/s(te) (1 when held as measured),
p = RH·psat,water(t) and L(t) = d ln psat/dt:

* ∂θsi/∂ts = D/Δ,  ∂θsi/∂ti = −f·D/Δ (+ f when θi,d is the measured ti),  ∂θsi/∂te = (f − 1)·D/Δ
* ∂Δp,d/∂ti = r·pi·Li,  ∂Δp,d/∂te = −r·pe·Le + Δp·∂r/∂te,  ∂Δp,d/∂RHi = r·psat,w(ti),
  ∂Δp,d/∂RHe = −r·psat,w(te)  (zero when the excess is floored at 0)
* ∂ ln φsi/∂x = (∂Δp,d/∂x)/pi,d − L(θsi)·∂θsi/∂x

The terms add in quadrature, except that when one thermometer read the room and the outdoor
air (``Accuracy.shared_thermometer``) the ti and te errors are one error (GUM 5.2, r = 1) and
their sensitivities add before squaring. So the uncertainty of fRsi and of the excess, and
their correlation through the thermometer, both reach the range. The band of the surface RH
is φsi·exp(±k·u(ln φsi)), as the assessment's; a test checks its coverage by Monte Carlo.
The design month itself is taken as exact: it is a stated condition, not a reading.

The lowest month a surface bears
--------------------------------
:func:`project_room` also solves, for each projected surface, the lowest outdoor monthly mean
θe at which the surface still meets the mould limit, at the design month's outdoor RH and
indoor temperature and with the excess along the room's class line (or held, as chosen).
φsi(θe) is not monotone over every temperature (with a small excess a colder month can be
drier at the surface; as θe nears θi the surface RH tends to the outdoor RH itself), so the
solve keeps to a bracket: from ``design_month_search_lowest_c`` (−30 °C) up to the warmer
end θi,d − ``frsi_min_temperature_difference_k`` (the heated months, where the temperature
factor sets the surface; at most ``humidity_class_zero_at_c``). It scans the bracket downward
from the warm end in steps of 1 K and bisects the first step in which the surface passes the
limit, to 0.0001 K; bisection needs only the change of sign at the ends of that step. The
same is done for the ends of the RH band, which gives the range of the answer.
"""

from __future__ import annotations

import itertools
import math
from collections.abc import Callable
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
from survey.errors import InputError

if TYPE_CHECKING:  # the model (msgspec) stays off the quick check's import path
    from survey import model

_SQRT3 = math.sqrt(3.0)

# --- states ------------------------------------------------------------------------------------


class DesignState(Enum):
    """A surface in the design month. ``rank`` is higher for worse; None where not judged."""

    rank: int | None

    BELOW = ("below_limit", 0)
    ABOVE = ("above_limit", 1)
    CONDENSING = ("condensing", 2)
    CANNOT_TELL = ("cannot_tell", None)
    NOT_MEASURABLE = ("not_measurable", None)
    NOT_PROJECTED = ("not_projected", None)

    def __new__(cls, value: str, rank: int | None) -> DesignState:
        member = object.__new__(cls)
        member._value_ = value
        member.rank = rank
        return member

    def __str__(self) -> str:
        return str(self.value)


_ORDER = (DesignState.BELOW, DesignState.ABOVE, DesignState.CONDENSING)
_FAILING = frozenset({DesignState.ABOVE, DesignState.CONDENSING})


class ExcessModel(Enum):
    """How the room's vapour-pressure excess is carried to the design month."""

    CLASS_LINE = "class_line"  #: along the shape of the EN ISO 13788 humidity-class lines
    MEASURED = "measured"  #: held as measured


class RoomReason(Enum):
    """Why no surface of a room could be projected (None on :class:`RoomProjection` when the
    room could be)."""

    NO_OUTDOOR = "no_outdoor"  #: no outdoor reading today: no factor, no excess
    INDOOR_NOT_WARMER = "indoor_not_warmer"  #: the design month is as warm as the room


class InverseOutcome(Enum):
    """What the search for the lowest month a surface bears found."""

    SOLVED = "solved"  #: the temperature where the surface reaches the mould limit
    MEETS_THROUGHOUT = "meets_throughout"  #: meets it down to the cold end of the bracket
    FAILS_AT_WARM_END = "fails_at_warm_end"  #: above it already at the warm end
    NO_BRACKET = "no_bracket"  #: the room is too cool for any heated month to be looked at


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


# --- results -----------------------------------------------------------------------------------


class LowestMonth(NamedTuple):
    """The lowest outdoor monthly mean at which a surface still meets the mould limit."""

    outcome: InverseOutcome
    outdoor_temp_c: float | None  #: solved (SOLVED only)
    #: The same search for the lower end of the surface-RH band (the answer's cold end)
    low_end: tuple[InverseOutcome, float | None]
    #: and for the upper end (the answer's warm end)
    high_end: tuple[InverseOutcome, float | None]
    bracket_low_c: float  #: the search range, coldest
    bracket_high_c: float  #: and warmest
    outdoor_rh_pct: float  #: held at the design month's
    indoor_temp_c: float  #: held at the design month's (or the room's as measured)


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
    excess_model_fallback: bool  #: class line asked, but today's outdoor air was too warm
    measured_outdoor_temp_c: float | None
    measured_excess_pa: float | None
    measured_excess_uncertainty_pa: float | None  #: expanded, the assessment's
    humidity_class: int | None  #: today's (the assessment's)
    design_outdoor_vapour_pressure_pa: float
    design_vapour_pressure_excess_pa: float | None
    design_vapour_pressure_excess_uncertainty_pa: float | None  #: expanded
    design_vapour_pressure_pa: float | None  #: the room's in the design month
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


def _line_scale(outdoor_temp_c: float) -> float:
    """The EN ISO 13788 class lines' scale at an outdoor temperature: 1 at and below 0 °C,
    0 at and above 20 °C (the lines of :func:`survey.thresholds.humidity_class_limits_pa`)."""
    limits = th.humidity_class_limits_pa(outdoor_temp_c)
    return 0.0 if limits is None else limits[0] / th.value(th.HUMIDITY_CLASS_KEYS[0])


def _line_slope(outdoor_temp_c: float) -> float:
    """d s/dθe of :func:`_line_scale` (a central difference; the lines are piecewise linear)."""
    h = 1e-3
    return (_line_scale(outdoor_temp_c + h) - _line_scale(outdoor_temp_c - h)) / (2.0 * h)


class _Readings(NamedTuple):
    """What one surface's projection rests on: today's readings and their uncertainties."""

    ts: float
    ti: float
    te: float
    p_i: float  #: room vapour pressure today
    p_e: float  #: outdoor vapour pressure today
    pws_i: float  #: saturation over water at ti
    pws_e: float
    l_i: float  #: d ln psat,water/dt at ti
    l_e: float
    u_ts: float
    u_t: float
    u_rh: float  #: as a fraction
    shared: bool
    k: float


class _Point(NamedTuple):
    surface_temp_c: float
    u_surface_temp: float
    rh_pct: float
    u_ln_rh: float
    excess_pa: float


_READINGS = ("ts", "ti", "te", "rhi", "rhe")


def _combined(r: _Readings, sens: dict[str, float]) -> float:
    """Standard uncertainty from the sensitivities to each reading (see the module notes)."""
    total = (sens["ts"] * r.u_ts) ** 2 + (sens["rhi"] * r.u_rh) ** 2 + (sens["rhe"] * r.u_rh) ** 2
    if r.shared:
        total += ((sens["ti"] + sens["te"]) * r.u_t) ** 2
    else:
        total += (sens["ti"] * r.u_t) ** 2 + (sens["te"] * r.u_t) ** 2
    return math.sqrt(total)


def _excess(r: _Readings, te_d: float, excess_model: ExcessModel) -> tuple[float, dict[str, float]]:
    """The room's vapour-pressure excess in a month of mean ``te_d``, and its sensitivity to
    each reading (all 0 where a negative excess is floored at 0)."""
    today = r.p_i - r.p_e
    if excess_model is ExcessModel.CLASS_LINE:
        s_today = _line_scale(r.te)
        ratio = _line_scale(te_d) / s_today
        dratio_dte = -ratio * _line_slope(r.te) / s_today
    else:
        ratio, dratio_dte = 1.0, 0.0
    excess = ratio * today
    if excess < 0.0:
        return 0.0, dict.fromkeys(_READINGS, 0.0)
    return excess, {
        "ts": 0.0,
        "ti": ratio * r.p_i * r.l_i,
        "te": -ratio * r.p_e * r.l_e + today * dratio_dte,
        "rhi": ratio * r.pws_i,
        "rhe": -ratio * r.pws_e,
    }


def _evaluate(
    r: _Readings,
    te_d: float,
    rh_e_d: float,
    ti_given: float | None,
    excess_model: ExcessModel,
) -> _Point:
    """The projection of one surface to a month of mean ``te_d`` and ``rh_e_d`` (see the
    module notes for the formulas and the sensitivities)."""
    ti_d = r.ti if ti_given is None else ti_given
    delta = r.ti - r.te
    d = ti_d - te_d
    f = (r.ts - r.te) / delta
    theta = te_d + f * d
    excess, dex = _excess(r, te_d, excess_model)
    p_room = rh_e_d / 100.0 * psychro.sat_vapour_pressure_water_pa(te_d) + excess
    rh = 100.0 * p_room / psychro.sat_vapour_pressure_pa(theta)
    l_s = psychro.dln_sat_vapour_pressure_per_k(theta)
    dth = {
        "ts": d / delta,
        "ti": -f * d / delta + (f if ti_given is None else 0.0),
        "te": (f - 1.0) * d / delta,
        "rhi": 0.0,
        "rhe": 0.0,
    }
    dln = {x: dex[x] / p_room - l_s * dth[x] for x in _READINGS}
    return _Point(theta, _combined(r, dth), rh, _combined(r, dln), excess)


def _band(point: _Point, k: float) -> tuple[float, float]:
    spread = math.exp(k * point.u_ln_rh)
    return point.rh_pct / spread, point.rh_pct * spread


def _state(low: float, high: float, mould: float) -> tuple[DesignState, tuple[DesignState, ...]]:
    def one(rh: float) -> int:
        return 2 if rh >= 100.0 else 1 if rh > mould else 0

    a, b = one(low), one(high)
    if a == b:
        return _ORDER[a], (_ORDER[a],)
    return DesignState.CANNOT_TELL, _ORDER[a : b + 1]


#: Step of the downward scan in the search for the lowest month, K.
SEARCH_STEP_K = 0.5
#: The bisection stops when the step is this small, K.
SEARCH_TOLERANCE_K = 1e-4


def _scan_points(low_c: float, high_c: float) -> list[float]:
    """The temperatures of the downward scan, warm end first: every step, and the knees of
    the class lines (where the surface RH has a corner, often its peak) inside the bracket."""
    points = {high_c, low_c}
    n = 1
    while high_c - n * SEARCH_STEP_K > low_c:
        points.add(high_c - n * SEARCH_STEP_K)
        n += 1
    for knee in (th.value("humidity_class_flat_below_c"), th.value("humidity_class_zero_at_c")):
        if low_c < knee < high_c:
            points.add(knee)
    return sorted(points, reverse=True)


def _lowest_meeting(
    excess_of: Callable[[float], float], low_c: float, high_c: float
) -> tuple[InverseOutcome, float | None]:
    """The lowest temperature in [low_c, high_c], going down from ``high_c``, before
    ``excess_of`` (surface RH minus the limit) first turns positive (see the module notes)."""
    points = _scan_points(low_c, high_c)
    if excess_of(points[0]) > 0.0:
        return InverseOutcome.FAILS_AT_WARM_END, None
    for warm, cold in itertools.pairwise(points):
        if excess_of(cold) > 0.0:
            meets, fails = warm, cold
            while meets - fails > SEARCH_TOLERANCE_K:
                middle = 0.5 * (meets + fails)
                if excess_of(middle) > 0.0:
                    fails = middle
                else:
                    meets = middle
            return InverseOutcome.SOLVED, 0.5 * (meets + fails)
    return InverseOutcome.MEETS_THROUGHOUT, None


def _lowest_month(
    r: _Readings, month: DesignMonth, ti_d: float, excess_model: ExcessModel
) -> LowestMonth:
    mould = th.value("surface_rh_mould_limit_pct")
    low_c = th.value("design_month_search_lowest_c")
    high_c = min(
        ti_d - th.value("frsi_min_temperature_difference_k"), th.value("humidity_class_zero_at_c")
    )
    rh_e, given = month.outdoor_rh_pct, month.indoor_temp_c
    if high_c <= low_c:
        none = (InverseOutcome.NO_BRACKET, None)
        return LowestMonth(*none, none, none, low_c, high_c, rh_e, ti_d)

    def variant(side: int) -> Callable[[float], float]:
        def excess_of(t: float) -> float:
            point = _evaluate(r, t, rh_e, given, excess_model)
            return point.rh_pct * math.exp(side * r.k * point.u_ln_rh) - mould

        return excess_of

    outcome, central = _lowest_meeting(variant(0), low_c, high_c)
    return LowestMonth(
        outcome,
        central,
        _lowest_meeting(variant(-1), low_c, high_c),
        _lowest_meeting(variant(+1), low_c, high_c),
        low_c,
        high_c,
        rh_e,
        ti_d,
    )


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
    lowest_month: bool = True,
) -> RoomProjection:
    """Every surface of a judged room carried to ``month`` (see the module notes);
    ``lowest_month=False`` skips the search for the lowest month each surface bears."""
    air, outdoor = finding.air, finding.outdoor
    ti_d = air.dry_bulb_c if month.indoor_temp_c is None else month.indoor_temp_c
    pe_d = month.outdoor_rh_pct / 100.0 * psychro.sat_vapour_pressure_water_pa(month.outdoor_temp_c)
    keys = (*PROJECTION_KEYS, *month.threshold_keys)
    used = excess_model
    fallback = False
    if (
        outdoor is not None
        and used is ExcessModel.CLASS_LINE
        and _line_scale(outdoor.dry_bulb_c) <= 0
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
        readings = _Readings(
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
        design_excess, sens = _excess(readings, month.outdoor_temp_c, used)
        design_excess_u = readings.k * _combined(readings, sens)
        design_p = pe_d + design_excess
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
            surfaces.append(_not_projected(s, DesignState.NOT_PROJECTED))
            continue
        r = readings._replace(ts=s.surface_temp_c)
        point = _evaluate(r, month.outdoor_temp_c, month.outdoor_rh_pct, month.indoor_temp_c, used)
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
                _lowest_month(r, month, ti_d, used) if lowest_month else None,
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
    lowest_month: bool = True,
) -> tuple[RoomProjection, ...]:
    """Every room of a judged visit carried to ``month``."""
    return tuple(project_room(f, month, excess_model, lowest_month) for f in site.rooms)
