"""A logger series summed up per calendar day: mean, lowest and highest temperature, RH and
humidity ratio, the hours above the mould limit and above very humid air, and the trend of
the daily means (the rules are in :mod:`survey.drying`'s notes)."""

from __future__ import annotations

import bisect
import datetime as dt
import itertools
import math
import statistics
from collections.abc import Sequence
from dataclasses import dataclass

from survey import model, psychro
from survey import thresholds as th
from survey.drying.trend import Fit, recent_fit
from survey.errors import InputError


def _wall_clock(at: dt.datetime) -> dt.datetime:
    return at.replace(tzinfo=None)


@dataclass(frozen=True, slots=True)
class DayRange:
    """A day's mean, lowest and highest value."""

    mean: float
    low: float
    high: float


@dataclass(frozen=True, slots=True)
class LoggerDay:
    """One calendar day of a logger series."""

    day: dt.date
    samples: int
    hours_logged: float  #: hours the samples stand for (gaps counted, long gaps not)
    temp_c: DayRange
    rh_pct: DayRange
    humidity_ratio_kg_per_kg: DayRange | None  #: None if no sample could be worked out
    hours_above_mould_rh: float  #: RH above ``surface_rh_mould_limit_pct``
    hours_above_wet_rh: float  #: RH above ``logger_rh_wet_pct``


@dataclass(frozen=True, slots=True)
class LoggerSummary:
    """A logger series summed up per day, with the trend of its daily means."""

    log_index: int  #: its place in ``Survey.logs``
    source: str
    room_id: str | None  #: None: outdoors
    surface: str | None  #: a surface's location label, or None for air
    days: tuple[LoggerDay, ...]
    interval_h: float | None  #: the median gap between samples
    gap_limit_h: float | None  #: gaps longer than this are not counted
    gaps_left_out: int
    hours_left_out: float
    humidity_ratio_fit: Fit | None  #: over the daily means, kg/kg per day
    rh_fit: Fit | None  #: over the daily means, % per day


@dataclass
class _DayTotals:
    temps: list[float]
    rhs: list[float]
    ratios: list[float]
    hours: float = 0.0
    above_mould: float = 0.0
    above_wet: float = 0.0


def logger_days(
    samples: Sequence[model.LogSample], pressure_pa: float = psychro.STANDARD_PRESSURE_PA
) -> tuple[tuple[LoggerDay, ...], float | None, float | None, int, float]:
    """The series per calendar day, with the median gap (h), the longest gap counted (h),
    and how many gaps, and hours, were left out as too long (see the module notes).

    Times are worked in hours from the midnight before the first sample, so a million
    samples take seconds, not minutes."""
    if not samples:
        return (), None, None, 0, 0.0
    times = [s.at if s.at.tzinfo is None else _wall_clock(s.at) for s in samples]
    order = list(range(len(samples)))
    if any(a > b for a, b in itertools.pairwise(times)):
        order.sort(key=times.__getitem__)
    base = dt.datetime.combine(times[order[0]].date(), dt.time())
    hours = [(times[i] - base).total_seconds() / 3600.0 for i in order]
    temps = [samples[i].dry_bulb_c for i in order]
    rhs = [samples[i].rh_pct for i in order]
    mould = th.value("surface_rh_mould_limit_pct")
    wet = th.value("logger_rh_wet_pct")
    gaps = [b - a for a, b in itertools.pairwise(hours)]
    positive = [g for g in gaps if g > 0.0]
    interval = statistics.median(positive) if positive else None
    top = math.inf if interval is None else interval * th.value("logger_gap_max_intervals")
    limit = None if interval is None else top
    keys = [int(h // 24.0) for h in hours]
    ratio_of: dict[tuple[float, float], float | None] = {}
    pairs = list(zip(temps, rhs, strict=True))
    for pair in set(pairs):
        try:
            ratio_of[pair] = psychro.vapour_state(*pair, pressure_pa).humidity_ratio_kg_per_kg
        except InputError:  # too dry to work out (dew point below -100 °C)
            ratio_of[pair] = None
    ratios = [ratio_of[pair] for pair in pairs]
    # Each counted gap inside one day gives half to each of its two samples; a gap across
    # midnight is split at midnight below; a gap too long counts for neither.
    inside = [0.0 < g <= top + 1e-9 and keys[i] == keys[i + 1] for i, g in enumerate(gaps)]
    halves = [g / 2.0 if ok else 0.0 for g, ok in zip(gaps, inside, strict=True)]
    weights = [a + b for a, b in zip([0.0, *halves], [*halves, 0.0], strict=True)]
    totals: dict[int, _DayTotals] = {}
    begin = 0
    for k in sorted(set(keys)):
        end = bisect.bisect_left(keys, k + 1, begin)
        held = _DayTotals(
            temps[begin:end], rhs[begin:end], [r for r in ratios[begin:end] if r is not None]
        )
        w, rh = weights[begin:end], rhs[begin:end]
        held.hours = math.fsum(w)
        held.above_mould = math.fsum(x for x, r in zip(w, rh, strict=True) if r > mould)
        held.above_wet = math.fsum(x for x, r in zip(w, rh, strict=True) if r > wet)
        totals[k] = held
        begin = end
    left_out = sum(1 for g in gaps if g > top + 1e-9)
    out = math.fsum(g for g in gaps if g > top + 1e-9)  # hours left out

    def credit(start: float, end: float, rh: float) -> float:
        """Count the span at ``rh`` on its days (split at midnight); the hours that fall on a
        day with no sample of its own (samples days apart) are returned, not counted."""
        missed = 0.0
        while start < end:
            k = int(start // 24.0)
            stop = min(end, (k + 1) * 24.0)
            held = totals.get(k)
            if held is None:
                missed += stop - start
            else:
                span = stop - start
                held.hours += span
                if rh > mould:
                    held.above_mould += span
                if rh > wet:
                    held.above_wet += span
            start = stop
        return missed

    for i, gap in enumerate(gaps):
        if inside[i] or gap <= 0.0 or gap > top + 1e-9:
            continue
        a, b = hours[i], hours[i + 1]
        middle = a + gap / 2.0
        out += credit(a, middle, rhs[i]) + credit(middle, b, rhs[i + 1])
    first = base.date()
    days = tuple(
        LoggerDay(
            day=first + dt.timedelta(days=k),
            samples=len(t.temps),
            hours_logged=t.hours,
            temp_c=_range(t.temps),
            rh_pct=_range(t.rhs),
            humidity_ratio_kg_per_kg=_range(t.ratios) if t.ratios else None,
            hours_above_mould_rh=t.above_mould,
            hours_above_wet_rh=t.above_wet,
        )
        for k, t in sorted(totals.items())
    )
    return days, interval, limit, left_out, out


def _range(values: list[float]) -> DayRange:
    low, high = min(values), max(values)
    # the correctly rounded mean of equal values can round past them: keep it inside
    return DayRange(min(max(math.fsum(values) / len(values), low), high), low, high)


def summarise_log(index: int, log: model.LogSeries, pressure: float) -> LoggerSummary:
    """The series ``log`` (``Survey.logs[index]``) per day, at ``pressure`` (Pa)."""
    days, interval, limit, left_out, hours_out = logger_days(log.samples, pressure)
    first = days[0].day if days else dt.date.min
    ratios = [(d.day, d.humidity_ratio_kg_per_kg) for d in days if d.humidity_ratio_kg_per_kg]
    return LoggerSummary(
        log_index=index,
        source=log.source,
        room_id=log.room,
        surface=log.surface,
        days=days,
        interval_h=interval,
        gap_limit_h=limit,
        gaps_left_out=left_out,
        hours_left_out=hours_out,
        humidity_ratio_fit=recent_fit(
            [float((day - first).days) for day, _ in ratios], [r.mean for _, r in ratios]
        ),
        rh_fit=recent_fit(
            [float((d.day - first).days) for d in days], [d.rh_pct.mean for d in days]
        ),
    )
