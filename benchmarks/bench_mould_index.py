"""Mould-growth index speed over a year of 10-minute samples (52 560 steps).

1. ``survey.mould_index.integrate`` over a year of invented surface readings (a cold corner:
   seasonal and daily swings; the RH reaches the class's lowest critical RH, 80 %, on a quarter
   of the steps and favours growth on a fifth, 1662 h of 8760; values to 0.1 as a logger
   writes them) against a bare Python loop over the same samples doing one ``math.exp`` each.
   Goal: ours ≤ 5× the bare loop. The series (hours and steps from the times) is built once
   beforehand, as a survey's logger series is; the integration is what is timed.
2. ``survey.mould_index.analyse`` (the index, its summary, the favourable periods and
   ASHRAE 160's 30-day running means) on the same series, against the same bare loop; no goal.
"""

from __future__ import annotations

import datetime as dt
import math

from common import Result, interleaved_best

STEPS = 52_560  # 365 days of 10-minute samples


def _series():
    from survey.mould_index import SurfaceSeries

    start = dt.datetime(2025, 10, 1)
    times = [start + dt.timedelta(minutes=10 * i) for i in range(STEPS)]
    temps, rhs = [], []
    for i in range(STEPS):
        day = i / 144.0
        season = math.cos(2.0 * math.pi * (day - 100.0) / 365.0)  # coldest around January
        daily = math.sin(2.0 * math.pi * day)
        temps.append(round(14.0 - 4.0 * season + 1.5 * daily, 1))
        rhs.append(round(min(99.0, 74.0 + 9.0 * season - 5.0 * daily + 3.0 * math.sin(day)), 1))
    return SurfaceSeries.from_samples(times, temps, rhs)


def _bare(values):
    exp = math.exp
    for x in values:
        exp(x)


def run() -> list[Result]:
    from survey import mould_index as mi

    series = _series()
    cls = mi.CLASSES["sensitive"]
    choice = mi.ClassChoice("sensitive", "stated")
    values = [t / 40.0 for t in series.temps_c]
    ours, bare = interleaved_best(
        lambda: mi.integrate(series, cls), lambda: _bare(values), repeat=21
    )
    full, bare_full = interleaved_best(
        lambda: mi.analyse(series, choice), lambda: _bare(values), repeat=5
    )
    return [
        Result("mould index, a year of 10-min steps", STEPS / ours, "steps/s", ours / bare, 5.0),
        Result("mould index + ASHRAE 160 + summary", STEPS / full, "steps/s", full / bare_full),
    ]
