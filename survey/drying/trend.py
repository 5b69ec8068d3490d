"""The drying rate: a least-squares line through a point's recent readings, whether the
trend is falling, stalled or unclear, and the days to the goal at that rate (the rules are
in :mod:`survey.drying`'s notes)."""

from __future__ import annotations

import datetime as dt
import math
from collections.abc import Sequence
from dataclasses import dataclass
from enum import Enum

from survey import thresholds as th


class TrendState(Enum):
    """How a series of readings is moving."""

    FALLING = "falling"  #: a steady fall: a rate, and days to the goal
    STALLED = "stalled"  #: flat or rising: no number
    UNCLEAR = "unclear"  #: falling on average, but scattered: no number
    ONE_READING = "one_reading"  #: nothing to fit yet


@dataclass(frozen=True, slots=True)
class Fit:
    """A least-squares straight line through (day, value) pairs."""

    readings: int  #: how many readings the line was fitted to
    rate_per_day: float  #: the slope, in the reading's own unit per day (negative: falling)
    #: The slope's standard error (same unit); ``None`` with two readings (no residual).
    rate_se_per_day: float | None
    first_day: float  #: day of the first reading used
    last_day: float  #: day of the last reading used


def fit_line(days: Sequence[float], values: Sequence[float]) -> Fit | None:
    """The least-squares line through the points; ``None`` with fewer than two distinct days.

    slope b = Sxy / Sxx, with Sxx = Σ(x − x̄)², Sxy = Σ(x − x̄)(y − ȳ); standard error
    s_b = √(Σ residual² / (n − 2) / Sxx) for n ≥ 3 (any first course in regression)."""
    n = len(days)
    if n != len(values) or n < 2:
        return None
    mean_x = math.fsum(days) / n
    mean_y = math.fsum(values) / n
    sxx = math.fsum((x - mean_x) ** 2 for x in days)
    if sxx <= 0.0 or max(days) - min(days) < 1e-9:
        return None
    sxy = math.fsum((x - mean_x) * (y - mean_y) for x, y in zip(days, values, strict=True))
    slope = sxy / sxx
    se = None
    if n >= 3:
        intercept = mean_y - slope * mean_x
        ssr = math.fsum(
            (y - (intercept + slope * x)) ** 2 for x, y in zip(days, values, strict=True)
        )
        se = math.sqrt(max(ssr, 0.0) / (n - 2) / sxx)
    return Fit(n, slope, se, min(days), max(days))


def recent_fit(days: Sequence[float], values: Sequence[float]) -> Fit | None:
    """:func:`fit_line` over the most recent ``drying_trend_readings`` readings."""
    keep = int(th.value("drying_trend_readings"))
    return fit_line(days[-keep:], values[-keep:])


def trend_of(fit: Fit | None, latest: float, last_step_per_day: float | None) -> TrendState:
    """Falling, stalled or unclear (module notes), for readings whose latest is ``latest``
    and whose last step changed by ``last_step_per_day``."""
    if fit is None:
        return TrendState.ONE_READING
    least = th.value("drying_stalled_daily_fraction") * abs(latest)
    if -fit.rate_per_day <= least:
        return TrendState.STALLED
    if last_step_per_day is not None and -last_step_per_day <= least:
        return TrendState.STALLED
    errors = th.value("drying_steady_standard_errors")
    if fit.rate_se_per_day is not None and -fit.rate_per_day < errors * fit.rate_se_per_day:
        return TrendState.UNCLEAR
    return TrendState.FALLING


@dataclass(frozen=True, slots=True)
class GoalEstimate:
    """Days from the latest reading until the goal, at the fitted rate."""

    days: float
    days_low: float | None  #: at the rate plus one standard error (faster)
    days_high: float | None  #: at the rate minus one standard error (slower)
    by: dt.datetime  #: the latest reading's time plus ``days``


def estimate_to_goal(fit: Fit, latest: float, goal: float, at: dt.datetime) -> GoalEstimate:
    """Days until ``latest`` falls to ``goal`` at the fitted (falling) rate, with the range
    of rate ± one standard error."""
    fall = -fit.rate_per_day
    if fall <= 0.0:
        raise ValueError("the fit does not fall")
    excess = max(latest - goal, 0.0)
    low = high = None
    se = fit.rate_se_per_day
    if se is not None:
        low = excess / (fall + se)
        high = excess / (fall - se) if fall > se else None
    days = excess / fall
    return GoalEstimate(days, low, high, at + dt.timedelta(days=days))
