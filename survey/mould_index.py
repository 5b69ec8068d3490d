"""The mould-growth index of a surface over a logged period, and the 30-day criterion beside it.

The model
---------
The index M (0 none … 1 growth under a microscope … 3 visible … 6 heavy) of Hukka and
Viitanen (1999), with the material sensitivity classes and decline factors of Ojanen,
Viitanen et al. (2010), integrated over a logger series at its own time step. Each sample's
surface temperature T (°C) and RH (%) hold until the next sample. Conditions favour growth
while 0 < T < 50 °C and RH ≥ RH_crit(T), with

    RH_crit = max(−0.00267 T³ + 0.160 T² − 3.13 T + 100, RH_min)   for T ≤ 20 °C
    RH_crit = RH_min                                                for T > 20 °C

(RH_min 80 % for the very sensitive and sensitive classes, 85 % for the others). Then

    dM/dt = k1 · k2 / (7 · exp(−0.68 ln T − 13.9 ln RH + 66.02))   per day
    k2 = max(1 − exp(2.3 (M − M_max)), 0),   M_max = A + B x − C x²,
    x = (RH_crit − RH) / (RH_crit − 100)

with k1 and A, B, C by class (:data:`CLASSES`); the wood-species and surface-quality terms
of the 1999 equation are 0 (pine, resawn surface), as in the class-based revision. Otherwise
the index declines by the class's decline factor times 0.00133 an hour for the first 6 h of
the dry period, not at all until 24 h, and 0.000667 an hour after; a favourable time restarts
that clock. The decline is integrated exactly over each step, the growth by one explicit step,
and a step that takes the index across 1 switches k1 where it crosses. The index starts at 0
at the first sample (a clean surface) and never rises above M_max.

Every coefficient was read in two independent public implementations of the model that cite
the papers (see :mod:`survey.thresholds.limits_mould`); where they differ, the choice made here
is said beside the constant. A third implementation has the linear term of the critical-RH
polynomial as +3.13, which takes the curve above 100 %: a typo, not followed.

Limits of the model (the words say them to the client): it was fitted to pine and spruce
sapwood in laboratory tests and extended to other materials by class; the class here is chosen
from words in the surface's material or label; a logger gap holds the index; mould already on
the surface at the start is not known to it. It is a guide to the risk, not a laboratory test.

The published model is not monotone in RH in general: a wetter series whose brief favourable
moments add no growth (the index already at M_max) restarts the fast decline each time, while a
drier one stays in the 6-24 h pause, and can end lower. With the same favourable and dry times a
drier series never gives a higher index (the tests hold both facts).

ASHRAE Standard 160-2009's 30-day criterion is worked out on the same series
(:mod:`survey.mould_ashrae160`); the class of a surface is chosen in :mod:`survey.mould_series`.
The integration itself, with the growth equation's constants, is :mod:`survey.mould_integrate`
(its names are re-exported here: ``integrate``, ``Integration``, ``GROWTH_*``, ``K2_SLOPE``,
``RH_CRIT_POLY``, ``DAYS_PER_WEEK``).
"""

from __future__ import annotations

import datetime as dt
import math
from array import array
from bisect import bisect_left, bisect_right
from dataclasses import dataclass, field
from enum import Enum
from operator import sub
from typing import NamedTuple

from survey import thresholds as th
from survey.mould_ashrae160 import Ashrae160Result, ashrae160
from survey.mould_integrate import (
    DAYS_PER_WEEK,
    GROWTH_CONSTANT,
    GROWTH_LN_RH,
    GROWTH_LN_T,
    K2_SLOPE,
    RH_CRIT_POLY,
    Integration,
    integrate,
)

__all__ = [
    "CLASSES",
    "CLASS_KEYS",
    "DAYS_PER_WEEK",
    "DEFAULT_CLASS",
    "GROWTH_CONSTANT",
    "GROWTH_LN_RH",
    "GROWTH_LN_T",
    "K2_SLOPE",
    "RH_CRIT_POLY",
    "ClassChoice",
    "FavourablePeriod",
    "IndexPoint",
    "IndexSeries",
    "IndexState",
    "Integration",
    "MouldIndexResult",
    "SensitivityClass",
    "SurfaceSeries",
    "analyse",
    "growth_rate_per_day",
    "integrate",
    "rh_crit_pct",
]

_HOUR = dt.timedelta(hours=1)

# --- sensitivity classes -----------------------------------------------------------------


@dataclass(frozen=True, slots=True)
class SensitivityClass:
    """One material sensitivity class: its growth factors, index ceiling and decline."""

    key: str
    k1_below_1: float  #: growth-rate factor while the index is below 1
    k1_from_1: float  #: from index 1 on
    a: float  #: M_max = a + b·x − c·x²
    b: float
    c: float
    rh_min_key: str  #: threshold key of the class's lowest critical RH
    #: Decline factor C_mat on the dry-period rates.
    decline_factor: float

    @property
    def index_max(self) -> float:
        """The highest index the class can reach (M_max at 100 % RH)."""
        return self.a + self.b - self.c

    @property
    def rh_min_pct(self) -> float:
        return th.value(self.rh_min_key)


_SENSITIVE = "mould_index_rh_crit_sensitive_pct"
_RESISTANT = "mould_index_rh_crit_resistant_pct"

#: k1, A, B, C and RH_min: Ojanen, Viitanen et al. 2010, read in two public implementations
#: (mark R, secondary sources). Decline factors 1, 0.5, 0.25, 0.1 (significant, relatively low,
#: almost no, no decline): read in one implementation (R, secondary source); pairing each
#: with the class of the same rank is our choice (the papers let the two be chosen apart).
_C = SensitivityClass
# fmt: off
CLASSES: dict[str, SensitivityClass] = {
    "very_sensitive":   _C("very_sensitive",   1.0,   2.0,   1.0, 7.0, 2.0, _SENSITIVE, 1.0),
    "sensitive":        _C("sensitive",        0.578, 0.386, 0.3, 6.0, 1.0, _SENSITIVE, 0.5),
    "medium_resistant": _C("medium_resistant", 0.072, 0.097, 0.0, 5.0, 1.5, _RESISTANT, 0.25),
    "resistant":        _C("resistant",        0.033, 0.014, 0.0, 3.0, 1.0, _RESISTANT, 0.1),
}
# fmt: on
CLASS_KEYS: tuple[str, ...] = tuple(CLASSES)
#: With no word to go by: painted plaster, plasterboard and papered walls, the usual
#: indoor finishes, are "sensitive" (their paint, paper and dust feed mould); our choice.
DEFAULT_CLASS = "sensitive"


@dataclass(frozen=True, slots=True)
class ClassChoice:
    """The class used and why: ``basis`` is "stated", "material", "label", "element" or
    "default"; ``word`` is the word that decided it ('' for stated and default)."""

    key: str
    basis: str
    word: str = ""


def rh_crit_pct(temp_c: float, cls: SensitivityClass) -> float:
    """The critical RH (%) at ``temp_c`` for ``cls``: the polynomial up to 20 °C, never below
    the class's lowest value, that value above."""
    rh_min = cls.rh_min_pct
    if temp_c > th.value("mould_index_rh_crit_curve_to_c"):
        return rh_min
    c3, c2, c1, c0 = RH_CRIT_POLY
    return max(((c3 * temp_c + c2) * temp_c + c1) * temp_c + c0, rh_min)


def growth_rate_per_day(temp_c: float, rh_pct: float, index: float, cls: SensitivityClass) -> float:
    """dM/dt (index units a day) under favourable conditions, at index ``index``."""
    rh_crit = rh_crit_pct(temp_c, cls)
    x = (rh_crit - rh_pct) / (rh_crit - 100.0) if rh_crit < 100.0 else 1.0
    m_max = cls.a + cls.b * x - cls.c * x * x
    k1 = cls.k1_below_1 if index < 1.0 else cls.k1_from_1
    k2 = max(1.0 - math.exp(K2_SLOPE * (index - m_max)), 0.0)
    ln_weeks = GROWTH_LN_T * math.log(temp_c) + GROWTH_LN_RH * math.log(rh_pct) + GROWTH_CONSTANT
    return k1 * k2 / (DAYS_PER_WEEK * math.exp(ln_weeks))


# --- the series --------------------------------------------------------------------------


@dataclass(frozen=True, slots=True)
class SurfaceSeries:
    """A surface's temperature and RH over time, ready for the index.

    ``hours`` since ``times[0]``; ``basis`` "surface_logger" (a logger on the surface) or
    "air_and_factor" (worked out from the room air, the outdoor air and the temperature factor);
    ``capped``: samples whose worked-out surface RH passed 100 % (water forming), read as 100;
    ``steps``: the hours from each sample to the next, worked out once here."""

    times: list[dt.datetime]
    hours: list[float]
    temps_c: list[float]
    rhs_pct: list[float]
    basis: str = "surface_logger"
    capped: int = 0
    steps: list[float] = field(default_factory=list)
    longest_step: float = -1.0  #: worked out here

    def __post_init__(self) -> None:
        if not self.steps and len(self.hours) > 1:
            object.__setattr__(self, "steps", list(map(sub, self.hours[1:], self.hours)))
        if self.longest_step < 0.0:
            object.__setattr__(self, "longest_step", max(self.steps, default=0.0))

    @classmethod
    def from_samples(
        cls,
        times: list[dt.datetime],
        temps_c: list[float],
        rhs_pct: list[float],
        basis: str = "surface_logger",
        capped: int = 0,
    ) -> SurfaceSeries:
        """A series from parallel lists; ``hours`` are worked out from ``times``."""
        start = times[0] if times else dt.datetime(2000, 1, 1)
        hours = [(t - start) / _HOUR for t in times]
        return cls(times, hours, temps_c, rhs_pct, basis, capped)


class IndexPoint(NamedTuple):
    at: dt.datetime
    value: float  #: the index


@dataclass(frozen=True, slots=True)
class IndexSeries:
    """The index over time as breakpoints (``hours`` since ``start``, rising), straight lines
    between them: every sample where conditions were near or inside the favourable range, and
    the corners of each dry stretch (whose decline is straight lines), so a year of dry
    10-minute samples takes a few points and is still exact at every time."""

    start: dt.datetime
    hours: array[float]
    index: array[float]

    def at(self, hours: float) -> float:
        """The index ``hours`` after ``start`` (held before the first and after the last)."""
        h, m = self.hours, self.index
        j = bisect_right(h, hours)
        if j == 0:
            return m[0]
        if j >= len(h):
            return m[-1]
        h0, h1 = h[j - 1], h[j]
        return m[j] if h1 == h0 else m[j - 1] + (m[j] - m[j - 1]) * (hours - h0) / (h1 - h0)

    def highest(self, from_h: float, to_h: float) -> float:
        """The highest index between two times (hours after ``start``)."""
        first = bisect_left(self.hours, from_h)
        last = bisect_right(self.hours, to_h)
        inside = self.index[first:last]
        return max(self.at(from_h), self.at(to_h), *inside)

    def points(self, max_points: int = 400) -> tuple[IndexPoint, ...]:
        """At most ``max_points`` points, each the highest index of its stretch of samples
        (so no peak is lost), at the time of that highest value."""
        n = len(self.index)
        if n == 0:
            return ()
        size = max(1, -(-n // max(1, max_points)))
        out = []
        for first in range(0, n, size):
            chunk = self.index[first : first + size]
            top = max(chunk)
            where = first + chunk.index(top)
            out.append(IndexPoint(self.start + dt.timedelta(hours=self.hours[where]), top))
        return tuple(out)


class IndexState(Enum):
    """The highest index of the period, in our words' terms."""

    NO_GROWTH = "no_growth"  #: below 1
    MICROSCOPIC = "microscopic"  #: 1 to below 3
    VISIBLE = "visible"  #: 3 or more


@dataclass(frozen=True, slots=True)
class FavourablePeriod:
    """Favourable times (joined across dry breaks shorter than a day): when, how many hours
    of it were favourable, and the highest index reached up to its end."""

    start: dt.datetime
    end: dt.datetime
    favourable_h: float
    index_max: float


@dataclass(frozen=True, slots=True)
class MouldIndexResult:
    """The index over a surface series, and ASHRAE 160's criterion on the same series."""

    sensitivity: SensitivityClass
    choice: ClassChoice
    basis: str
    start: dt.datetime
    end: dt.datetime
    samples: int
    logged_days: float  #: covered time, gaps left out
    gaps: int
    gap_h: float
    index: IndexSeries
    index_max: float
    index_max_at: dt.datetime
    index_final: float
    state: IndexState
    days_above_1: float
    days_above_3: float
    first_above_1_at: dt.datetime | None
    first_above_3_at: dt.datetime | None
    favourable_h: float
    periods: tuple[FavourablePeriod, ...]
    rising_at_end: bool  #: the last step was favourable and the index still below M_max
    capped: int
    ashrae160: Ashrae160Result
    threshold_keys: tuple[str, ...]


def _periods(
    series: SurfaceSeries, runs: list[int], index: IndexSeries
) -> tuple[FavourablePeriod, ...]:
    hours, times = series.hours, series.times
    join = th.value("mould_index_period_join_h")
    merged: list[list[float]] = []  # [first sample, last sample, favourable hours]
    for k in range(0, len(runs), 2):
        first, last = runs[k], runs[k + 1]
        length = hours[last] - hours[first]
        if merged and hours[first] - hours[int(merged[-1][1])] < join:
            merged[-1][1] = last
            merged[-1][2] += length
        else:
            merged.append([first, last, length])
    return tuple(
        FavourablePeriod(
            times[int(f)], times[int(la)], h, index.highest(hours[int(f)], hours[int(la)])
        )
        for f, la, h in merged
    )


def analyse(series: SurfaceSeries, choice: ClassChoice) -> MouldIndexResult:
    """The index and its summary over ``series`` for the class of ``choice``, and ASHRAE
    160's 30-day criterion on the same series. ``series`` must hold at least one sample."""
    cls = CLASSES[choice.key]
    done = integrate(series, cls)
    top = done.top
    times = series.times
    index = IndexSeries(times[0], array("d", done.points_h), array("d", done.points_m))
    state = (
        IndexState.VISIBLE
        if top >= th.value("mould_index_visible")
        else IndexState.MICROSCOPIC
        if top >= th.value("mould_index_microscopic")
        else IndexState.NO_GROWTH
    )
    span_h = series.hours[-1] - series.hours[0]
    keys = (
        "mould_index_microscopic",
        "mould_index_visible",
        cls.rh_min_key,
        "mould_index_rh_crit_curve_to_c",
        "mould_index_growth_min_temp_c",
        "mould_index_growth_max_temp_c",
        "mould_index_decline_fast_per_h",
        "mould_index_decline_fast_h",
        "mould_index_decline_pause_to_h",
        "mould_index_decline_slow_per_h",
        "mould_index_gap_h",
        "mould_index_period_join_h",
    )
    return MouldIndexResult(
        sensitivity=cls,
        choice=choice,
        basis=series.basis,
        start=series.times[0],
        end=series.times[-1],
        samples=len(times),
        logged_days=(span_h - done.gap_h) / 24.0,
        gaps=done.gaps,
        gap_h=done.gap_h,
        index=index,
        index_max=top,
        index_max_at=times[done.top_sample],
        index_final=done.points_m[-1],
        state=state,
        days_above_1=done.above_1_h / 24.0,
        days_above_3=done.above_3_h / 24.0,
        first_above_1_at=None if done.first_1_sample is None else times[done.first_1_sample],
        first_above_3_at=None if done.first_3_sample is None else times[done.first_3_sample],
        favourable_h=done.favourable_h,
        periods=_periods(series, done.runs, index),
        rising_at_end=done.grew,
        capped=series.capped,
        ashrae160=ashrae160(series),
        threshold_keys=keys,
    )
