"""The integration of the mould-growth index over a surface series (the model and its
records are :mod:`survey.mould_index`, which re-exports these names).

The growth equation's constants live here, beside the loop that uses them. Steps whose RH is
below the class's lowest critical RH are dry whatever the temperature: they are found at C
speed and each dry stretch is worked out in closed form (its decline is straight lines in
time); only the other steps are stepped through one by one (see :func:`integrate`).
"""

from __future__ import annotations

import math
from bisect import bisect_left
from itertools import compress, count, repeat
from operator import and_, le, ne, sub
from typing import TYPE_CHECKING, NamedTuple

from survey import thresholds as th

if TYPE_CHECKING:
    from survey.mould_index import SensitivityClass, SurfaceSeries

_BELOW_100 = math.nextafter(100.0, 0.0)

# Growth equation (Hukka & Viitanen 1999 after Viitanen 1997; three public implementations
# agree, R secondary): ln(weeks to index 1) = −0.68 ln T − 13.9 ln RH + 66.02; 7 days a week.
GROWTH_LN_T = -0.68
GROWTH_LN_RH = -13.9
GROWTH_CONSTANT = 66.02
DAYS_PER_WEEK = 7.0
#: k2 = 1 − exp(K2_SLOPE (M − M_max)) (two implementations, R secondary).
K2_SLOPE = 2.3
#: RH_crit polynomial coefficients for T ≤ 20 °C, % (two implementations, R secondary).
RH_CRIT_POLY = (-0.00267, 0.160, -3.13, 100.0)


# --- integration -------------------------------------------------------------------------


class Integration(NamedTuple):
    """What :func:`integrate` works out: the index as breakpoints and the tallies."""

    points_h: list[float]  #: hours since the first sample of each breakpoint
    points_m: list[float]  #: the index there (straight lines between breakpoints)
    runs: list[int]  #: favourable runs as sample indexes [start, end, start, end, …]
    favourable_h: float
    above_1_h: float
    above_3_h: float
    gaps: int
    gap_h: float
    grew: bool  #: the last step was favourable and the index below M_max
    top: float
    top_sample: int
    first_1_sample: int | None
    first_3_sample: int | None


def _decline(
    m: float, clock: float | None, span: float, rates: tuple[float, float, float, float]
) -> tuple[list[tuple[float, float]], float | None]:
    """A dry stretch of ``span`` hours from index ``m`` with the dry clock at ``clock`` (None:
    past the pause); ``rates`` are (fast rate, slow rate, fast hours, pause-to hours). Returns
    the (hours into the stretch, index) breakpoints where the slope changes, ending at
    ``span``, never below 0, and the clock after it."""
    fast, slow, fast_h, pause_h = rates
    points: list[tuple[float, float]] = []
    done = 0.0
    phases = []
    if clock is not None:
        if clock < fast_h:
            phases.append((fast_h - clock, fast))
        if clock < pause_h:
            phases.append((pause_h - max(clock, fast_h), 0.0))
    phases.append((math.inf, slow))
    for length, rate in phases:
        take = min(length, span - done)
        if take <= 0.0:
            break
        if rate and m - rate * take <= 0.0:
            points.append((done + m / rate, 0.0))
            m = 0.0
            break
        m -= rate * take
        done += take
        points.append((done, m))
    if not points or points[-1][0] < span:
        points.append((span, m))
    after = None if clock is None or clock + span > pause_h else clock + span
    return points, after


def _time_at_or_above(hours: list[float], index: list[float], level: float) -> float:
    """Hours the index spends at or above ``level`` along its breakpoints (straight lines
    between them). Whole segments are summed at C speed; only crossings are worked out."""
    at = list(map(le, repeat(level), index))
    spans = map(sub, hours[1:], hours)
    total: float = sum(compress(spans, map(and_, at[1:], at)))
    for j in compress(count(), map(ne, at[1:], at)):
        m0, m1 = index[j], index[j + 1]
        above = (m0 - level) / (m0 - m1) if m0 >= level else (m1 - level) / (m1 - m0)
        total += (hours[j + 1] - hours[j]) * above
    return total


def integrate(series: SurfaceSeries, cls: SensitivityClass) -> Integration:
    """The index over ``series`` for ``cls``.

    Steps whose RH is below the class's lowest critical RH are dry whatever the temperature:
    they are found at C speed (a byte mask searched with ``bytearray.find``) and each dry
    stretch is worked out in closed form (its decline is straight lines in time). Only the
    other steps are stepped through one by one. The index is kept as breakpoints: every
    sample of those steps, and the corners of each dry stretch.
    """
    hours, temps, rhs, steps = series.hours, series.temps_c, series.rhs_pct, series.steps
    n = len(hours)
    if n < 2:
        return Integration([0.0], [0.0], [], 0.0, 0.0, 0.0, 0, 0.0, False, 0.0, 0, None, None)
    exp = math.exp
    k1a, k1b, a, b, c = cls.k1_below_1, cls.k1_from_1, cls.a, cls.b, cls.c
    rh_min = cls.rh_min_pct
    c3, c2, c1, c0 = RH_CRIT_POLY
    curve_to = th.value("mould_index_rh_crit_curve_to_c")
    t_low = th.value("mould_index_growth_min_temp_c")
    t_high = th.value("mould_index_growth_max_temp_c")
    gap = th.value("mould_index_gap_h")
    fast_h = th.value("mould_index_decline_fast_h")
    pause_h = th.value("mould_index_decline_pause_to_h")
    fast = th.value("mould_index_decline_fast_per_h") * cls.decline_factor
    slow = th.value("mould_index_decline_slow_per_h") * cls.decline_factor
    rates = (fast, slow, fast_h, pause_h)
    # dM/dt per hour = exp(-66.02) / (7 · 24) · T^0.68 · RH^13.9 · k1 · k2
    scale = exp(-GROWTH_CONSTANT) / (DAYS_PER_WEEK * 24.0)
    p_t, p_rh = -GROWTH_LN_T, -GROWTH_LN_RH
    slope = K2_SLOPE
    last = n - 1
    # 0: dry whatever the temperature; 1: to be stepped through; 2: a gap (index held)
    mask = bytearray(map(le, repeat(rh_min), rhs[:last]))  # (a bound method maps slower)

    gaps, gap_h = 0, 0.0
    if series.longest_step > gap:
        for i, step in enumerate(steps):
            if step > gap:
                mask[i] = 2
                gaps += 1
                gap_h += step
    others = ((b"\x01", b"\x02"), (b"\x00", b"\x02"), (b"\x00", b"\x01"))
    flip = (b"\x01", b"\x00")
    points_h = [0.0]
    points_m = [0.0]
    add_h, add_m = points_h.append, points_m.append
    m = 0.0
    m_max = 0.0
    clock: float | None = None  # hours into a dry period while under the pause; None after
    runs: list[int] = []
    was_fav = False
    gap_above_1 = gap_above_3 = 0.0

    # Once per distinct reading (a logger writes few distinct values): by temperature the
    # critical RH (infinite where the index cannot grow) and the growth factor scale·T^0.68;
    # by RH, RH^13.9.
    def by_temperature(t: float) -> tuple[float, float, float, float, float, float]:
        """(RH_crit, q0, q1, q2, growth factor at k1 below 1, from 1): M_max = q0 + (q1 +
        q2·RH)·RH, the class's a + b x − c x² with x = u + v·RH expanded once per temperature."""
        if not t_low < t < t_high:
            return math.inf, 0.0, 0.0, 0.0, 0.0, 0.0
        crit = rh_min
        if t <= curve_to:
            # never quite 100 % (the polynomial is 100 at 0 °C), so v below stays finite
            crit = min(max(((c3 * t + c2) * t + c1) * t + c0, rh_min), _BELOW_100)
        v = -1.0 / (crit - 100.0)
        u = -crit * v
        growth = scale * t**p_t
        return (
            crit, a + (b - c * u) * u, (b - 2.0 * c * u) * v, -c * v * v, growth * k1a,
            growth * k1b,
        )  # fmt: skip

    t_values: dict[float, tuple[float, float, float, float, float, float]] = {}
    rh_powers: dict[float, float] = {}
    pos = 0
    while pos < last:
        kind = mask[pos]
        if gaps:
            one, two = (mask.find(k, pos) for k in others[kind])
            end = min(one if one >= 0 else last, two if two >= 0 else last)
        else:  # no gap: the stretch ends where the other kind begins
            end = mask.find(flip[kind], pos)
            if end < 0:
                end = last
        if kind != 1:
            if was_fav:
                runs.append(pos)
                was_fav = False
                clock = 0.0
            if kind == 2 or not m:
                if kind == 2:
                    gap_above_1 += (hours[end] - hours[pos]) * (m >= 1.0)
                    gap_above_3 += (hours[end] - hours[pos]) * (m >= 3.0)
                add_h(hours[end])
                add_m(m)
            else:
                corners, clock = _decline(m, clock, hours[end] - hours[pos], rates)
                base_h = hours[pos]
                for h, value in corners:
                    add_h(base_h + h)
                    add_m(value)
                m = corners[-1][1]
            pos = end
            continue
        first_point = len(points_m)
        t_prev = math.nan  # never equal: the first sample looks its temperature up
        for step, t, rh in zip(steps[pos:end], temps[pos:end], rhs[pos:end], strict=True):
            if t != t_prev:  # a logger's temperature often holds from one sample to the next
                t_prev = t
                try:  # (a subscript is quicker than .get; a new value is rare)
                    crit, q0, q1, q2, rate_a, rate_b = t_values[t]
                except KeyError:
                    crit, q0, q1, q2, rate_a, rate_b = t_values[t] = by_temperature(t)
            if rh < crit:
                if was_fav:
                    runs.append(pos + len(points_m) - first_point)
                    was_fav = False
                    clock = 0.0
                if m:
                    if clock is None:
                        m -= slow * step
                    else:
                        start = clock
                        clock += step
                        if clock <= fast_h:
                            m -= fast * step
                        else:
                            m -= fast * (fast_h - min(start, fast_h))
                            if clock > pause_h:
                                m -= slow * (clock - max(start, pause_h))
                                clock = None
                    if m <= 0.0:
                        m = 0.0
                add_m(m)
                continue
            if not was_fav:
                runs.append(pos + len(points_m) - first_point)
                was_fav = True
            m_max = q0 + (q1 + q2 * rh) * rh
            if m < m_max:
                try:
                    power = rh_powers[rh]
                except KeyError:
                    power = rh_powers[rh] = rh**p_rh
                power *= step
                k2 = 1.0 - exp(slope * (m - m_max))
                if m >= 1.0:
                    m += rate_b * power * k2
                else:
                    rise = rate_a * power * k2
                    if m + rise > 1.0 and m_max > 1.0:
                        # k1 changes where the index crosses 1: the rest of the step at k1b
                        left = 1.0 - (1.0 - m) / rise
                        m = 1.0 + left * rate_b * power * (1.0 - exp(slope * (1.0 - m_max)))
                    else:
                        m += rise
                if m > m_max:
                    m = m_max
            add_m(m)
        points_h.extend(hours[pos + 1 : end + 1])
        pos = end
    if was_fav:
        runs.append(last)
    pm, ph = points_m, points_h
    top = max(pm)
    top_sample = bisect_left(hours, ph[pm.index(top)])
    # below a level the index never reached, nothing is to be found
    firsts = [
        next(compress(count(), map(le, repeat(v), pm)), None) if top >= v else None
        for v in (1.0, 3.0)
    ]
    first_1, first_3 = (None if f is None else bisect_left(hours, ph[f]) for f in firsts)
    fav_h = sum(hours[runs[k + 1]] - hours[runs[k]] for k in range(0, len(runs), 2))
    above_1 = _time_at_or_above(ph, pm, 1.0) - gap_above_1 if top >= 1.0 else 0.0
    above_3 = _time_at_or_above(ph, pm, 3.0) - gap_above_3 if top >= 3.0 else 0.0
    return Integration(
        points_h,
        points_m,
        runs,
        fav_h,
        above_1,
        above_3,
        gaps,
        gap_h,
        was_fav and m < m_max,
        top,
        top_sample,
        first_1,
        first_3,
    )
