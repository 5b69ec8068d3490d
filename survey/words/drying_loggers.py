"""A data logger's days in words, for the drying progress of the report and the app: its
heading, the day lines (temperature, RH and humidity ratio ranges), its gaps and trend.

Plain strings, no markup. The records are :mod:`survey.drying`'s.
"""

from __future__ import annotations

import datetime as dt

from survey import thresholds as th
from survey.drying import LoggerDay, LoggerSummary
from survey.words.display import Display
from survey.words.drying_rates import air_rate_text
from survey.words.report import date_text

OUTDOORS = "Outdoors"


def logger_heading(summary: LoggerSummary, room_name: str | None) -> str:
    where = (
        OUTDOORS.lower()
        if summary.room_id is None
        else (
            f"{room_name}, on the surface {summary.surface}"
            if summary.surface
            else f"{room_name}, room air"
        )
    )
    return f"Logger {summary.source} ({where})"


def rh_kind(summary: LoggerSummary) -> str:
    """Whose RH a logger's hours count: a surface's, or the air's (room or outdoor)."""
    return "surface RH" if summary.surface else "air RH"


def is_room_air(summary: LoggerSummary) -> bool:
    """A logger in a room's air (not on a surface, not outdoors)."""
    return summary.room_id is not None and not summary.surface


#: Said once beside the loggers in a room's air: their hours above 80 % apply the surface
#: mould limit to the air.
AIR_RH_NOTE = (
    "A logger in the room air counts the hours the air's RH is above the 80 % mould limit, "
    "which is a limit for surfaces: air under 80 % does not clear the surfaces, because a "
    "surface colder than the air has a higher RH than the air (the colder, the higher)."
)


def logger_header(d: Display, summary: LoggerSummary | None = None) -> tuple[str, ...]:
    """The logger days table's header; the hours columns say whose RH (``summary``'s)."""
    mould = th.value("surface_rh_mould_limit_pct")
    wet = th.value("logger_rh_wet_pct")
    kind = "RH" if summary is None else rh_kind(summary)
    return (
        "Day",
        "Samples",
        "Hours logged",
        "Temperature, mean (low to high)",
        "RH, mean (low to high)",
        "Humidity ratio, mean (low to high)",
        f"Hours above {mould:.0f} % {kind}",
        f"Hours above {wet:.0f} % {kind}",
    )


def day_text(day: dt.date) -> str:
    return date_text(day)


def temperature_range_text(day: LoggerDay, d: Display) -> str:
    t = day.temp_c
    return f"{d.temperature(t.mean)} ({d.temperature(t.low)} to {d.temperature(t.high)})"


def rh_range_text(day: LoggerDay) -> str:
    r = day.rh_pct
    return f"{r.mean:.0f} % ({r.low:.0f} to {r.high:.0f} %)"


def ratio_range_text(day: LoggerDay, d: Display) -> str:
    w = day.humidity_ratio_kg_per_kg
    if w is None:
        return "–"
    return (
        f"{d('humidity_ratio', w.mean)} ({d('humidity_ratio', w.low, unit=False)} to "
        f"{d('humidity_ratio', w.high)})"
    )


def hours_text(hours: float) -> str:
    return f"{hours:.1f}"


def logger_day_line(day: LoggerDay, d: Display, kind: str = "RH") -> str:
    """One logger day in a line, as the app lists them; ``kind`` says whose RH the hours
    count (:func:`rh_kind`)."""
    mould = th.value("surface_rh_mould_limit_pct")
    wet = th.value("logger_rh_wet_pct")
    return (
        f"{day_text(day.day)}: {temperature_range_text(day, d)}, {rh_range_text(day)}, "
        f"{ratio_range_text(day, d)}; {hours_text(day.hours_above_mould_rh)} h above "
        f"{mould:.0f} % and {hours_text(day.hours_above_wet_rh)} h above {wet:.0f} % {kind} "
        f"({hours_text(day.hours_logged)} h logged, {day.samples} samples)."
    )


def logger_gaps_text(summary: LoggerSummary) -> str:
    """The series' usual interval and the gaps left out of the hours."""
    if summary.interval_h is None or summary.gap_limit_h is None:
        return "Too few samples for hours to be counted."
    usual = _duration(summary.interval_h)
    limit = _duration(summary.gap_limit_h)
    text = f"Samples every {usual} as a rule; gaps longer than {limit} are not counted"
    if summary.gaps_left_out:
        plural = "s" if summary.gaps_left_out != 1 else ""
        text += (
            f" ({summary.gaps_left_out} gap{plural}, {hours_text(summary.hours_left_out)} h, "
            "left out)"
        )
    return text + "."


def _duration(hours: float) -> str:
    if hours < 1.0:
        return f"{hours * 60:.0f} minutes"
    return f"{hours:g} hours" if hours == int(hours) else f"{hours:.1f} hours"


def logger_trend_text(summary: LoggerSummary, d: Display) -> str:
    """The daily means' trend."""
    if summary.humidity_ratio_fit is None:
        return "One day logged: no trend yet."
    return (
        f"Daily mean humidity ratio {air_rate_text(summary.humidity_ratio_fit, 'ratio', d)}, "
        f"daily mean RH {air_rate_text(summary.rh_fit, 'rh', d)} (over the last "
        f"{summary.humidity_ratio_fit.readings} days)."
    )
