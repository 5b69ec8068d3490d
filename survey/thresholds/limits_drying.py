"""The limits of drying progress over visits and of logger day summaries.

The drying goal itself is the dry standard plus the allowance of
``dry_standard_tolerance_fraction`` (in :mod:`survey.thresholds.table`), the same allowance
the assessment uses to call one reading "at the dry standard", so a room's material table
and the drying tables can never disagree. The time above the mould limit in a logger's day
uses ``surface_rh_mould_limit_pct``. What is here is new with the drying trends.
"""

from __future__ import annotations

from survey.thresholds.record import Threshold

_DRYING_PRACTICE = "restoration drying practice (readings at the same points on every visit)"

DRYING_LIMITS: tuple[Threshold, ...] = (
    Threshold(
        "drying_trend_readings",
        "Readings the drying rate is fitted over",
        4.0,
        "readings",
        _DRYING_PRACTICE,
        "The drying rate is the least-squares slope over a point's most recent readings, "
        "at most this many: materials dry fast at first and slower as they near dry, so "
        "the recent readings are the ones that say how long is left.",
        "common practice",
    ),
    Threshold(
        "drying_stalled_daily_fraction",
        "Slowest fall a day, of the reading, that counts as drying",
        0.01,
        "",
        _DRYING_PRACTICE,
        "A reading falling by less than 1 % of its latest value a day (or rising) is taken "
        "as not drying: at that rate it would take over a week to fall by the 10 % "
        "allowance over the dry standard, so the drying set-up needs looking at.",
        "common practice",
    ),
    Threshold(
        "drying_steady_standard_errors",
        "Fall needed, in standard errors of the rate",
        2.0,
        "",
        "statistical convention (a slope twice its standard error)",
        "A fall counts as a steady trend when the fitted rate is at least twice its own "
        "standard error; with three or four readings this is a loose test, so the days "
        "to the goal are given as a range.",
        "common practice",
    ),
    Threshold(
        "logger_gap_max_intervals",
        "Longest logger gap counted, in usual intervals",
        3.0,
        "",
        "data-logging practice",
        "A gap between two samples counts toward the hours of a day only when it is at "
        "most this many times the logger's usual interval (the median gap of the series); "
        "a longer gap (logger stopped, read out or moved) counts for neither sample.",
        "common practice",
    ),
    Threshold(
        "logger_rh_wet_pct",
        "Very humid air, RH",
        90.0,
        "%",
        "mould-growth and drying practice",
        "Above about 90 % RH mould grows fast and surfaces a little cooler than the air "
        "reach the dew point; the hours a day above it are counted beside those above "
        "the 80 % mould limit.",
        "common practice",
    ),
)
