"""ASHRAE Standard 160-2009's mould criterion on a surface series: the 30-day running mean
surface RH must stay below 80 % while the 30-day running mean surface temperature is between
5 and 40 °C (read in Glass et al., ASTM STP 1599, 2017: the limits' records say so). It is
worked out beside the mould-growth index of :mod:`survey.mould_index`, so the two can be
compared; ASHRAE 160-2016 replaced this criterion by an index model."""

from __future__ import annotations

import datetime as dt
from dataclasses import dataclass
from enum import Enum
from itertools import accumulate
from operator import mul
from typing import TYPE_CHECKING

from survey import thresholds as th

if TYPE_CHECKING:
    from survey.mould_index import SurfaceSeries


class Ashrae160State(Enum):
    MET = "met"
    EXCEEDED = "exceeded"
    TOO_SHORT = "too_short"  #: under 30 days logged
    OUT_OF_RANGE = "out_of_range"  #: the 30-day mean temperature never between 5 and 40 °C


@dataclass(frozen=True, slots=True)
class Ashrae160Result:
    state: Ashrae160State
    days_exceeded: float
    first_exceeded_at: dt.datetime | None
    highest_mean_rh_pct: float | None  #: highest 30-day mean where the criterion applies
    highest_at: dt.datetime | None
    whole_mean_rh_pct: float  #: time-weighted mean over the whole series
    whole_mean_temp_c: float
    threshold_keys: tuple[str, ...]


def ashrae160(series: SurfaceSeries) -> Ashrae160Result:
    """ASHRAE 160-2009's criterion: at each sample from 30 days in, the time-weighted means of
    surface RH and temperature over the covered time of the 30 days before it (each sample's
    values held until the next; gaps left out). It is exceeded where the mean RH is 80 % or
    more while the mean temperature is from 5 to 40 °C; the time until the next sample counts
    towards the days exceeded."""
    hours, temps, rhs = series.hours, series.temps_c, series.rhs_pct
    n = len(hours)
    gap = th.value("mould_index_gap_h")
    window = th.value("ashrae160_running_mean_days") * 24.0
    limit = th.value("ashrae160_surface_rh_limit_pct")
    t_low = th.value("mould_growth_min_surface_temp_c")
    t_high = th.value("mould_growth_max_surface_temp_c")
    keys = (
        "ashrae160_running_mean_days",
        "ashrae160_surface_rh_limit_pct",
        "mould_growth_min_surface_temp_c",
        "mould_growth_max_surface_temp_c",
    )
    steps = series.steps
    if steps and max(steps) > gap:
        steps = [s if s <= gap else 0.0 for s in steps]
    cover = [0.0, *accumulate(steps)]
    rh_sum = [0.0, *accumulate(map(mul, rhs, steps))]
    t_sum = [0.0, *accumulate(map(mul, temps, steps))]
    covered = cover[-1]
    whole_rh = rh_sum[-1] / covered if covered else (rhs[0] if rhs else 0.0)
    whole_t = t_sum[-1] / covered if covered else (temps[0] if temps else 0.0)
    if n < 2 or hours[-1] - hours[0] < window:
        return Ashrae160Result(
            Ashrae160State.TOO_SHORT, 0.0, None, None, None, whole_rh, whole_t, keys
        )
    p = 0
    exceeded_h = 0.0
    first: int | None = None
    best: float | None = None
    best_at = 0
    applies = False
    start_hour = hours[0]
    for j in range(n):
        end = hours[j]
        if end - start_hour < window:
            continue
        begin = end - window
        while hours[p + 1] <= begin:
            p += 1
        part = begin - hours[p]
        held = steps[p] if p < n - 1 else 0.0
        into = part if held else 0.0  # covered time of interval p before the window begins
        c_before = cover[p] + into
        span = cover[j] - c_before
        if span <= 0.0:
            continue
        mean_rh = (rh_sum[j] - rh_sum[p] - rhs[p] * into) / span
        mean_t = (t_sum[j] - t_sum[p] - temps[p] * into) / span
        if not t_low <= mean_t <= t_high:
            continue
        applies = True
        if best is None or mean_rh > best:
            best, best_at = mean_rh, j
        if mean_rh >= limit:
            if first is None:
                first = j
            exceeded_h += steps[j] if j < n - 1 else 0.0
    if not applies:
        state = Ashrae160State.OUT_OF_RANGE
    else:
        state = Ashrae160State.EXCEEDED if first is not None else Ashrae160State.MET
    return Ashrae160Result(
        state,
        exceeded_h / 24.0,
        None if first is None else series.times[first],
        best,
        None if best is None else series.times[best_at],
        whole_rh,
        whole_t,
        keys,
    )
