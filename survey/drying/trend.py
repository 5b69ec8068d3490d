"""The drying rate: a least-squares line through a point's recent readings, whether the
trend is falling, stalled or unclear, and the days to the goal at that rate with the range
of the rate's 95 % Student-t interval (the rules are in :mod:`survey.drying`'s notes)."""

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


#: The two-sided 95 % points of Student's t distribution (its 0.975 quantile) by degrees of
#: freedom, as printed in any statistics handbook's t table (from memory; each value checked
#: in the tests by integrating the t density numerically). Degrees of freedom between two
#: rows, or past the last, take the row of fewer (its larger t: the wider, safer range).
T_975: tuple[tuple[int, float], ...] = (
    (1, 12.706), (2, 4.303), (3, 3.182), (4, 2.776), (5, 2.571), (6, 2.447), (7, 2.365),
    (8, 2.306), (9, 2.262), (10, 2.228), (11, 2.201), (12, 2.179), (13, 2.160), (14, 2.145),
    (15, 2.131), (16, 2.120), (17, 2.110), (18, 2.101), (19, 2.093), (20, 2.086),
    (21, 2.080), (22, 2.074), (23, 2.069), (24, 2.064), (25, 2.060), (26, 2.056),
    (27, 2.052), (28, 2.048), (29, 2.045), (30, 2.042), (40, 2.021), (60, 2.000),
    (120, 1.980),
)  # fmt: skip
#: The confidence of the range of days to the goal.
INTERVAL_CONFIDENCE_PCT = 95.0
#: Fits to this many readings or fewer give a rough estimate (one degree of freedom or none).
ROUGH_READINGS = 3


def t_975(degrees_of_freedom: int) -> float:
    """Student's t at the two-sided 95 % level for ``degrees_of_freedom`` (≥ 1), from
    :data:`T_975`: the row of the largest tabulated degrees of freedom not above it."""
    if degrees_of_freedom < 1:
        raise ValueError("Student's t needs at least one degree of freedom")
    return next(t for dof, t in reversed(T_975) if dof <= degrees_of_freedom)


@dataclass(frozen=True, slots=True)
class GoalEstimate:
    """Days from the latest reading until the goal, at the fitted rate, with the range the
    95 % Student-t interval on the rate gives."""

    days: float
    #: At the fast end of the rate's 95 % interval; ``None`` with two readings (no interval).
    days_low: float | None
    #: At the slow end; ``None`` with two readings, or when that end does not fall at all.
    days_high: float | None
    by: dt.datetime  #: the latest reading's time plus ``days``
    readings: int = 0  #: readings the rate was fitted to
    #: The slow end of the rate's interval is no fall at all: no finite date can be given.
    open_ended: bool = False

    @property
    def rough(self) -> bool:
        """Fitted to two or three readings: one degree of freedom or none."""
        return self.readings <= ROUGH_READINGS


def estimate_to_goal(fit: Fit, latest: float, goal: float, at: dt.datetime) -> GoalEstimate:
    """Days until ``latest`` falls to ``goal`` at the fitted (falling) rate, with the range
    of the rate's 95 % interval, rate ± t·s_b with t of Student's distribution at n − 2
    degrees of freedom (any first course in regression). Where the slow end of that
    interval does not fall, there is no upper end (``open_ended``)."""
    fall = -fit.rate_per_day
    if fall <= 0.0:
        raise ValueError("the fit does not fall")
    excess = max(latest - goal, 0.0)
    low = high = None
    open_ended = False
    se = fit.rate_se_per_day
    if se is not None:
        half = t_975(fit.readings - 2) * se
        low = excess / (fall + half)
        if fall > half:
            high = excess / (fall - half)
        else:
            open_ended = True
    days = excess / fall
    return GoalEstimate(days, low, high, at + dt.timedelta(days=days), fit.readings, open_ended)
