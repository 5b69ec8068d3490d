"""The arithmetic of the colder month (:mod:`survey.season`): one surface carried to a month,
its uncertainty, and the search for the lowest month it bears.

Readings in (:class:`Readings`: today's surface, room and outdoor temperatures, vapour
pressures and the instruments' standard uncertainties), plain floats out (:class:`Point`).
Saturation pressures and their slopes are :mod:`survey.psychro`'s; the class lines are
:func:`survey.thresholds.humidity_class_limits_pa`.

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

The room's vapour pressure pi,d = pe,d + Δp,d is held at saturation over water at θi,d
(:func:`room_vapour_pressure`): air holds no more, and an excess carried past it is no
longer a room that exists. Held there, pi,d moves only with a measured room temperature
(∂pi,d/∂ti = psat,w(ti)·Li); the projection flags it (:attr:`Point.room_saturated`).

The terms add in quadrature, except that when one thermometer read the room and the outdoor
air (``Accuracy.shared_thermometer``) the ti and te errors are one error (GUM 5.2, r = 1) and
their sensitivities add before squaring. So the uncertainty of fRsi and of the excess, and
their correlation through the thermometer, both reach the range. The band of the surface RH
is φsi·exp(±k·u(ln φsi)), as the assessment's; a test checks its coverage by Monte Carlo.
The design month itself is taken as exact: it is a stated condition, not a reading.

The lowest month a surface bears
--------------------------------
:func:`lowest_month` solves, for a projected surface, the lowest outdoor monthly mean θe at
which the surface still meets the mould limit, at the design month's outdoor RH and indoor
temperature and with the excess along the room's class line (or held, as chosen).
φsi(θe) is not monotone over every temperature (with a small excess a colder month can be
drier at the surface; the class lines' knee at 0 °C is often its peak; as θe nears θi the
surface RH tends to the outdoor RH itself), so the solve keeps to a bracket: from
``design_month_search_lowest_c`` (−30 °C) up to the warm end θi,d −
``frsi_min_temperature_difference_k`` (the heated months, where the temperature factor sets
the surface; at most ``humidity_class_zero_at_c``). It scans the bracket downward from the
warm end in steps of :data:`SEARCH_STEP_K` (and at the knees of the class lines), and narrows
the first step in which the surface passes the limit to :data:`SEARCH_TOLERANCE_K`
(:func:`refine`, Brent's method, which like bisection needs only the change of sign at the
ends of that step). The answer is "the lowest
month down to which every month from the warm end meets the limit". The same search on the
ends of the RH band gives the range of the answer.
"""

from __future__ import annotations

import itertools
import math
import sys
from collections.abc import Callable
from enum import Enum
from functools import cache, lru_cache
from typing import NamedTuple

from survey import psychro
from survey import thresholds as th


class ExcessModel(Enum):
    """How the room's vapour-pressure excess is carried to the design month."""

    CLASS_LINE = "class_line"  #: along the shape of the EN ISO 13788 humidity-class lines
    MEASURED = "measured"  #: held as measured


class InverseOutcome(Enum):
    """What the search for the lowest month a surface bears found."""

    SOLVED = "solved"  #: the temperature where the surface reaches the mould limit
    MEETS_THROUGHOUT = "meets_throughout"  #: meets it down to the cold end of the bracket
    FAILS_AT_WARM_END = "fails_at_warm_end"  #: above it already at the warm end
    NO_BRACKET = "no_bracket"  #: the room is too cool for any heated month to be looked at


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


@cache
def _class_line_knees() -> tuple[float, float]:
    """The class lines' knees (°C): full value at and below the first, zero at the second."""
    return th.value("humidity_class_flat_below_c"), th.value("humidity_class_zero_at_c")


def line_scale(outdoor_temp_c: float) -> float:
    """The EN ISO 13788 class lines' scale at an outdoor temperature: 1 at and below 0 °C,
    0 at and above 20 °C (the lines of :func:`survey.thresholds.humidity_class_limits_pa`,
    whose shape a test holds this to)."""
    flat, zero = _class_line_knees()
    if outdoor_temp_c >= zero:
        return 0.0
    if outdoor_temp_c <= flat:
        return 1.0
    return (zero - outdoor_temp_c) / (zero - flat)


def line_slope(outdoor_temp_c: float) -> float:
    """d s/dθe of :func:`line_scale`: the lines are piecewise linear (at a knee, the mean of
    the two sides, as a central difference gives)."""
    flat, zero = _class_line_knees()
    inside = -1.0 / (zero - flat)
    if flat < outdoor_temp_c < zero:
        return inside
    if outdoor_temp_c in (flat, zero):
        return inside / 2.0
    return 0.0


class Readings(NamedTuple):
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


class Point(NamedTuple):
    surface_temp_c: float
    u_surface_temp: float
    rh_pct: float
    u_ln_rh: float
    excess_pa: float
    #: The room's vapour pressure (outdoor plus excess) reached saturation at the indoor
    #: temperature and was held there (:func:`room_vapour_pressure`).
    room_saturated: bool = False


#: The readings a sensitivity is taken to, in the order of the tuples below.
READINGS = ("ts", "ti", "te", "rhi", "rhe")

#: Saturation over water, remembered: a search asks it again and again at the room's
#: temperature and at the scan's whole kelvins (a pure function; the cache only saves time).
_psat_water = lru_cache(maxsize=4096)(psychro.sat_vapour_pressure_water_pa)
_NONE = (0.0, 0.0, 0.0, 0.0, 0.0)
_EPS = sys.float_info.epsilon

Sensitivities = tuple[float, float, float, float, float]


def combined(r: Readings, sens: Sensitivities) -> float:
    """Standard uncertainty from the sensitivities to each reading, in the order of
    :data:`READINGS` (see the module notes)."""
    s_ts, s_ti, s_te, s_rhi, s_rhe = sens
    total = (s_ts * r.u_ts) ** 2 + (s_rhi * r.u_rh) ** 2 + (s_rhe * r.u_rh) ** 2
    if r.shared:
        total += ((s_ti + s_te) * r.u_t) ** 2
    else:
        total += (s_ti * r.u_t) ** 2 + (s_te * r.u_t) ** 2
    return math.sqrt(total)


def excess_in_month(
    r: Readings, te_d: float, excess_model: ExcessModel
) -> tuple[float, Sensitivities]:
    """The room's vapour-pressure excess in a month of mean ``te_d``, and its sensitivity to
    each reading (all 0 where a negative excess is floored at 0)."""
    today = r.p_i - r.p_e
    if excess_model is ExcessModel.CLASS_LINE:
        s_today = line_scale(r.te)
        ratio = line_scale(te_d) / s_today
        dratio_dte = -ratio * line_slope(r.te) / s_today
    else:
        ratio, dratio_dte = 1.0, 0.0
    excess = ratio * today
    if excess < 0.0:
        return 0.0, _NONE
    return excess, (
        0.0,
        ratio * r.p_i * r.l_i,
        -ratio * r.p_e * r.l_e + today * dratio_dte,
        ratio * r.pws_i,
        -ratio * r.pws_e,
    )


def room_vapour_pressure(
    outdoor_pa: float, excess_pa: float, indoor_c: float
) -> tuple[float, bool]:
    """The room's vapour pressure in the month, outdoor plus excess, held at saturation over
    water at the indoor temperature (air cannot hold more; RH relative to water, as
    measured), and whether it was held there."""
    saturation = _psat_water(indoor_c)
    p_room = outdoor_pa + excess_pa
    return (saturation, True) if p_room >= saturation else (p_room, False)


def evaluate(
    r: Readings,
    te_d: float,
    rh_e_d: float,
    ti_given: float | None,
    excess_model: ExcessModel,
) -> Point:
    """The projection of one surface to a month of mean ``te_d`` and ``rh_e_d`` (see the
    module notes for the formulas and the sensitivities)."""
    measured_ti = ti_given is None
    ti_d = r.ti if ti_given is None else ti_given
    delta = r.ti - r.te
    d = ti_d - te_d
    f = (r.ts - r.te) / delta
    theta = te_d + f * d
    excess, dex = excess_in_month(r, te_d, excess_model)
    p_room, saturated = room_vapour_pressure(rh_e_d / 100.0 * _psat_water(te_d), excess, ti_d)
    if saturated:  # held at psat,water(θi,d): it moves only with a measured room temperature
        dex = (0.0, r.pws_i * r.l_i if measured_ti else 0.0, 0.0, 0.0, 0.0)
    rh = 100.0 * p_room / psychro.sat_vapour_pressure_pa(theta)
    l_s = psychro.dln_sat_vapour_pressure_per_k(theta)
    dth = (
        d / delta,
        -f * d / delta + (f if measured_ti else 0.0),
        (f - 1.0) * d / delta,
        0.0,
        0.0,
    )
    dln = (
        dex[0] / p_room - l_s * dth[0],
        dex[1] / p_room - l_s * dth[1],
        dex[2] / p_room - l_s * dth[2],
        dex[3] / p_room,
        dex[4] / p_room,
    )
    return Point(theta, combined(r, dth), rh, combined(r, dln), excess, saturated)


#: Step of the downward scan in the search for the lowest month, K.
SEARCH_STEP_K = 1.0
#: The answer is within this of the true crossing, K (:func:`refine` keeps to a quarter of
#: it: it stops with the ends that hold the crossing half this apart, and answers their middle).
SEARCH_TOLERANCE_K = 1e-4


def scan_points(low_c: float, high_c: float) -> list[float]:
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


def refine(
    excess_of: Callable[[float], float],
    meets: float,
    fails: float,
    at_meets: float,
    at_fails: float,
) -> float:
    """The temperature between ``meets`` (``excess_of`` ≤ 0 there) and ``fails`` (> 0) where
    ``excess_of`` changes sign, to :data:`SEARCH_TOLERANCE_K`.

    Brent's method (R. P. Brent, *Algorithms for Minimization without Derivatives*, 1973,
    ch. 4): inverse quadratic interpolation or the secant while they close in fast, a
    bisection step whenever they would not. Like bisection it keeps a change of sign between
    its two ends, so it cannot leave the step, and it stops when they are within the
    tolerance; on a smooth stretch it takes a third to a half of bisection's tries, at a
    kink (the room's saturation) not many more. The answer is the middle of the last ends,
    as bisection's was. "Meets" (≤ 0) and "fails" (> 0) are the two signs throughout."""
    a, fa, b, fb = meets, at_meets, fails, at_fails
    c, fc = a, fa
    d = e = b - a
    tol = 0.5 * SEARCH_TOLERANCE_K
    while True:
        if (fb > 0.0) == (fc > 0.0):  # keep c on the other side of the change from b
            c, fc = a, fa
            d = e = b - a
        if abs(fc) < abs(fb):
            a, b, c = b, c, b
            fa, fb, fc = fb, fc, fb
        step_tol = 2.0 * _EPS * abs(b) + 0.5 * tol
        m = 0.5 * (c - b)
        if abs(m) <= step_tol:
            return b + m
        if abs(e) >= step_tol and abs(fa) > abs(fb):
            s = fb / fa
            if a == c:  # the secant
                p, q = 2.0 * m * s, 1.0 - s
            else:  # inverse quadratic interpolation
                q, r = fa / fc, fb / fc
                p = s * (2.0 * m * q * (q - r) - (b - a) * (r - 1.0))
                q = (q - 1.0) * (r - 1.0) * (s - 1.0)
            if p > 0.0:
                q = -q
            else:
                p = -p
            if 2.0 * p < min(3.0 * m * q - abs(step_tol * q), abs(e * q)):
                e, d = d, p / q
            else:
                d = e = m
        else:
            d = e = m
        a, fa = b, fb
        b += d if abs(d) > step_tol else math.copysign(step_tol, m)
        fb = excess_of(b)


def lowest_meeting(
    excess_of: Callable[[float], float],
    low_c: float,
    high_c: float,
    points: list[float] | None = None,
) -> tuple[InverseOutcome, float | None]:
    """The lowest temperature in [low_c, high_c], going down from ``high_c``, before
    ``excess_of`` (surface RH minus the limit) first turns positive (see the module notes);
    ``points`` is :func:`scan_points` of the bracket, where the caller has it already."""
    if points is None:
        points = scan_points(low_c, high_c)
    at_warm = excess_of(points[0])
    if at_warm > 0.0:
        return InverseOutcome.FAILS_AT_WARM_END, None
    for warm, cold in itertools.pairwise(points):
        at_cold = excess_of(cold)
        if at_cold > 0.0:
            return InverseOutcome.SOLVED, refine(excess_of, warm, cold, at_warm, at_cold)
        at_warm = at_cold
    return InverseOutcome.MEETS_THROUGHOUT, None


def lowest_month(
    r: Readings,
    outdoor_rh_pct: float,
    indoor_given_c: float | None,
    excess_model: ExcessModel,
) -> LowestMonth:
    """The lowest outdoor monthly mean at which the surface of ``r`` still meets the mould
    limit, at ``outdoor_rh_pct`` and the room held at ``indoor_given_c`` (None: as measured),
    with the range from the ends of its surface-RH band (see the module notes)."""
    ti_d = r.ti if indoor_given_c is None else indoor_given_c
    mould = th.value("surface_rh_mould_limit_pct")
    low_c = th.value("design_month_search_lowest_c")
    high_c = min(
        ti_d - th.value("frsi_min_temperature_difference_k"), th.value("humidity_class_zero_at_c")
    )
    rh_e, given = outdoor_rh_pct, indoor_given_c
    if high_c <= low_c:
        none = (InverseOutcome.NO_BRACKET, None)
        return LowestMonth(*none, none, none, low_c, high_c, rh_e, ti_d)

    seen: dict[float, Point] = {}  # the scan's points serve all three searches

    def variant(side: int) -> Callable[[float], float]:
        spread = side * r.k

        def excess_of(t: float) -> float:
            point = seen.get(t)
            if point is None:
                point = seen[t] = evaluate(r, t, rh_e, given, excess_model)
            return point.rh_pct * math.exp(spread * point.u_ln_rh) - mould

        return excess_of

    points = scan_points(low_c, high_c)
    outcome, central = lowest_meeting(variant(0), low_c, high_c, points)
    return LowestMonth(
        outcome,
        central,
        lowest_meeting(variant(-1), low_c, high_c, points),
        lowest_meeting(variant(+1), low_c, high_c, points),
        low_c,
        high_c,
        rh_e,
        ti_d,
    )
