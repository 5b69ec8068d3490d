"""Drying progress in words: each material point against its goal, the rate and the days
left or that drying has stalled, the room air's trend, and a logger's days — for the report
and the app alike, numbers in a :class:`~survey.words.display.Display`'s units.

Plain strings, no markup. The records are :mod:`survey.drying`'s.
"""

from __future__ import annotations

import datetime as dt
from collections.abc import Callable, Mapping

from survey import thresholds as th
from survey.advise.kinds import Caution
from survey.drying import (
    Fit,
    GoalEstimate,
    LoggerDay,
    LoggerSummary,
    MaterialPoint,
    PointReading,
    RoomAir,
    RoomDrying,
    TrendState,
)
from survey.drying.trend import INTERVAL_CONFIDENCE_PCT
from survey.words.cautions import CAUTION_NAMES, caution_text
from survey.words.display import Display
from survey.words.report import date_text
from survey.words.report_room import reading_text
from survey.words.screens import LEFT_OUT_CELL as LEFT_OUT_CELL
from survey.words.states import standard_visit_said

# --- the report's section --------------------------------------------------------------------

DRYING_INTRO = (
    "Each room's readings on every visit, so the drying can be followed: the humidity "
    "ratio is the water the air holds (it does not change as the air warms or cools, so "
    "visits compare fairly), and each material point is followed toward its drying goal."
)
VISITS_HEADER = ("Visit", "Date", "Air", "RH", "Humidity ratio", "Worst surface margin")
WATER_COLLECTED = "Water collected"
NOT_MEASURED = "not measured"
AT_GOAL_MARK = "✓"
POINTS_HEADER = (
    "Point",
    "Latest",
    "Dry standard",
    "Goal",
    "Goal met",
    "Drying rate",
    "Time to goal",
)
LIMITS_LEAD = "Limits behind these tables:"
OUTDOORS = "Outdoors"


def basis_text() -> str:
    """How the tables were worked out, in one paragraph."""
    tolerance = th.value("dry_standard_tolerance_fraction") * 100
    window = th.value("drying_trend_readings")
    stalled = th.value("drying_stalled_daily_fraction") * 100
    errors = th.value("drying_steady_standard_errors")
    return (
        "Readings of one material point are matched across visits by location, material "
        "and scale, ignoring differences of case and spacing. A point's goal is its dry "
        "standard (the same material, on the same scale, in an unaffected part of the "
        f"room or in the reference room, the latest read up to that visit) plus "
        f"{tolerance:.0f} %; "
        f"{AT_GOAL_MARK} marks a reading at the goal. The drying rate is the straight "
        f"line best fitted to the point's last {window:.0f} readings at most; drying is "
        f"taken as stalled when the fall is no more than {stalled:g} % of the reading a day "
        "(or the latest reading did not fall), and as steady when the fall is at least "
        f"{errors:g} times the rate's standard error (a rate's ± is that standard error); "
        "a stalled or scattered trend gets no estimate. The days to the goal are at the "
        f"present rate, with the range of the rate's {INTERVAL_CONFIDENCE_PCT:.0f} % "
        "interval (Student's t on the fitted line): from two or three readings the figure "
        "is rough (two give no range at all), and where the slow end of that interval is no "
        "fall at all, the point could take much longer than any date we can give. "
        + STRAIGHT_LINE_NOTE
    )


#: Said once wherever days to a goal are shown (the report's basis, the app's screen).
STRAIGHT_LINE_NOTE = (
    "A straight line is optimistic: drying slows as materials near dry, so expect the last "
    "part to take longer than the line says."
)


def point_column(location: str, material: str, scale: str) -> str:
    """A table column for one material point."""
    return f"{location} ({material}, {SCALE_SHORT[scale]})"


SCALE_SHORT = {"mc_pct": "% MC", "wme_pct": "% WME", "relative": "relative scale"}
#: What one unit of each scale is called in a rate: "6.0 % MC a day", "24.6 points a day".
_RATE_UNIT = {"mc_pct": "% MC", "wme_pct": "% WME", "relative": "points"}


def reading_cell(reading: PointReading) -> str:
    """A reading in the visits table, marked when it is at the goal."""
    return f"{reading.value:g} {AT_GOAL_MARK}" if reading.at_goal else f"{reading.value:g}"


def _number(value: float) -> str:
    """A reading-scale number: one decimal, two below 0.1."""
    return f"{value:.2f}" if abs(value) < 0.1 else f"{value:.1f}"


def _se_places(render: Callable[[int], str], base: int) -> int | None:
    """The decimals that show a standard error to one significant figure (two when it
    begins with 1; common practice, no source), at least ``base``; ``None`` when it needs
    more than one decimal past ``base`` (then it is too small to matter beside the rate and
    is left out). ``render(places)`` writes it."""
    for places in range(base, base + 2):
        digits = render(places).replace(".", "").replace("-", "").lstrip("0")
        if digits and (digits[0] != "1" or len(digits) >= 2):
            return places
    return None


def _rate_and_band(rate: float, se: float | None, base: int) -> tuple[str, str]:
    """A plain rate and its " ± se" band (empty when there is no standard error or it is
    too small to show), the rate at the band's decimals."""
    places = None if se is None else _se_places(lambda k: f"{se:.{k}f}", base)
    if se is None or places is None:
        return f"{rate:.{base}f}", ""
    return f"{rate:.{places}f}", f" ± {se:.{places}f}"


def margin_text(margin_k: float | None, label: str | None, d: Display) -> str:
    """The worst surface's margin to the dew (or frost) point, and which surface it is."""
    if margin_k is None or label is None:
        return "no surface measured"
    if margin_k <= 0.0:
        return f"{label}: −{d.difference(-margin_k)} (condensing)"
    return f"{label}: {d.difference(margin_k)}"


def air_rate_text(fit: Fit | None, quantity: str, d: Display) -> str:
    """A fitted rate of the room air: "falling 1.66 ± 0.18 g/kg a day"."""
    if fit is None:
        return "one reading only"
    rate = fit.rate_per_day
    word = "falling" if rate < 0 else "rising"
    se = fit.rate_se_per_day
    if quantity == "rh":
        size, band = _rate_and_band(abs(rate), se, 1)
        return f"{word} {size}{band} % RH a day"
    base = 1 if d.ip else 2  # the display's own decimals for a humidity ratio
    places = (
        None
        if se is None
        else _se_places(lambda k: d("humidity_ratio", se, decimals=k, unit=False), base)
    )
    if se is None or places is None:
        return f"{word} {d('humidity_ratio', abs(rate))} a day"
    number, unit = d("humidity_ratio", abs(rate), decimals=places).split(" ", 1)
    band = d("humidity_ratio", se, decimals=places, unit=False)
    return f"{word} {number} ± {band} {unit} a day"


def room_air_sentence(room: RoomDrying, d: Display) -> str:
    """The room air over the visits, and the worst surface on the last one."""
    if not room.air:
        return "The room air was not measured on any visit, so its trend is not known."
    first, last = room.air[0], room.air[-1]
    if len(room.air) == 1:
        return (
            f"Room air on the one visit measured: {first.rh_pct:.0f} % RH, humidity ratio "
            f"{d('humidity_ratio', first.humidity_ratio_kg_per_kg)}. Worst surface margin to "
            f"the dew or frost point: "
            f"{margin_text(first.worst_margin_k, first.worst_margin_label, d)}."
        )
    span = last.day - first.day
    return _compared(
        last,
        d,
        (
            f"Room air over {span:.1f} days: humidity ratio "
            f"{d('humidity_ratio', first.humidity_ratio_kg_per_kg)} to "
            f"{d('humidity_ratio', last.humidity_ratio_kg_per_kg)} "
            f"({air_rate_text(room.humidity_ratio_fit, 'humidity_ratio', d)}), RH "
            f"{first.rh_pct:.0f} % to {last.rh_pct:.0f} % "
            f"({air_rate_text(room.rh_fit, 'rh', d)}). Worst surface margin to the dew or "
            f"frost point on the last visit: "
            f"{margin_text(last.worst_margin_k, last.worst_margin_label, d)}."
        ),
    )


def _compared(last: RoomAir, d: Display, text: str) -> str:
    """``text`` with the last visit's humidity ratio beside the reference room's and the
    outdoor air's, the levels the room dries toward."""
    parts = []
    if last.reference_humidity_ratio_kg_per_kg is not None:
        parts.append(
            f"{d('humidity_ratio', last.reference_humidity_ratio_kg_per_kg)} in the reference room"
        )
    if last.outdoor_humidity_ratio_kg_per_kg is not None:
        parts.append(f"{d('humidity_ratio', last.outdoor_humidity_ratio_kg_per_kg)} outdoors")
    if not parts:
        return text
    return (
        f"{text} On the last visit the air held "
        f"{d('humidity_ratio', last.humidity_ratio_kg_per_kg)}, against {' and '.join(parts)}."
    )


def dry_standard_cell(point: MaterialPoint, room_names: Mapping[str, str]) -> str:
    if point.dry_standard is None:
        return "none recorded"
    where = room_names.get(point.dry_standard_room or "", point.dry_standard_room or "")
    value = f"{point.dry_standard:g}"
    text = f"{value} in {where}" if where else value
    return text + standard_visit_said(point.dry_standard_visit)


def _standard_said(point: MaterialPoint, room_names: Mapping[str, str]) -> str:
    """The dry standard with its scale and the room it was read in, for a sentence."""
    if point.dry_standard is None:
        return "none recorded"
    value = (
        f"{point.dry_standard:g} on the same scale"
        if point.scale == "relative"
        else reading_text(point.dry_standard, point.scale)
    )
    room = point.dry_standard_room or ""
    said = f"{value} in {room_names.get(room, room)}" if room else value
    return said + standard_visit_said(point.dry_standard_visit)


def goal_cell(point: MaterialPoint) -> str:
    return "–" if point.goal is None else f"{_number(point.goal)} or less"


def met_cell(point: MaterialPoint) -> str:
    if point.gone:
        return LEFT_OUT_CELL
    if point.goal_met is None:
        return "no goal"
    return "yes" if point.goal_met else "not yet"


def rate_cell(point: MaterialPoint) -> str:
    """The fitted rate of a point: "−24.6 ± 0.5 points a day (3 readings)"."""
    fit = point.fit
    if fit is None:
        return "one reading"
    unit = _RATE_UNIT[point.scale]
    base = 2 if abs(fit.rate_per_day) < 0.1 else 1  # as _number
    size, band = _rate_and_band(abs(fit.rate_per_day), fit.rate_se_per_day, base)
    sign = "−" if fit.rate_per_day < 0 else "+"
    return f"{sign}{size}{band} {unit} a day ({fit.readings} readings)"


def days_text(days: float) -> str:
    """A time to the goal: hours under two days ("21 hours"), else days ("2.5 days")."""
    if days < 2.0:
        hours = days * 24.0
        return "under an hour" if hours < 1.0 else f"{hours:.0f} hours"
    if days < 10:
        return f"{days:.1f} days"
    return f"{days:.0f} days"


def _range_text(low: float, high: float) -> str:
    """A range of days: "17 to 28 hours", "1.5 to 2.3 days", "35 hours to 2.3 days"."""
    if high < 2.0:
        return f"{low * 24:.0f} to {high * 24:.0f} hours"
    if low >= 2.0:
        if high < 10:
            return f"{low:.1f} to {high:.1f} days"
        return f"{low:.0f} to {high:.0f} days"
    return f"{days_text(low)} to {days_text(high)}"


def _spread(estimate: GoalEstimate) -> str:
    """The estimate's range, or its open end, or "" with two readings."""
    if estimate.days_low is None:
        return ""
    if estimate.open_ended or estimate.days_high is None:
        return f"{days_text(estimate.days_low)} or more; could take much longer"
    return _range_text(estimate.days_low, estimate.days_high)


def _date(when: dt.datetime) -> str:
    return date_text(when.date())


def outlook_cell(point: MaterialPoint) -> str:
    """Days to the goal, or why there is no number."""
    if point.gone:
        return "left out for good"
    if point.goal_met:
        return "met"
    if point.trend is TrendState.STALLED:
        return "stalled"
    if point.trend is TrendState.UNCLEAR:
        return "no steady trend yet"
    if point.trend is TrendState.ONE_READING:
        return "needs a second reading"
    estimate = point.estimate
    if estimate is None:
        return "no goal"
    spread = _spread(estimate)
    text = f"about {days_text(estimate.days)}"
    if not spread:
        return f"{text} (rough: two readings, no range)"
    return f"{text} ({'rough: ' if estimate.rough else ''}{spread})"


def point_sentence(
    point: MaterialPoint, room_names: Mapping[str, str], flued: bool | None = None
) -> str:
    """Everything about one point in a sentence or three, as the app shows it; ``flued``
    is the room's open-flued appliance answer (true, false or not said), for
    :func:`trend_sentence`."""
    latest = point.latest
    value = reading_text(latest.value, point.scale)
    if point.gone:
        against = "" if point.goal is None else f" against a goal of {goal_cell(point)}"
        return f"Last read at {value}{against}." + _missed(point)
    if point.goal is None:
        goal = (
            f"{value}; no dry standard of {point.material} on this scale was read, so there "
            "is no goal: take a reading of the same material in an unaffected area."
        )
    elif point.goal_met:
        return (
            f"At the drying goal: {value} against {goal_cell(point)} (dry standard "
            f"{_standard_said(point, room_names)})."
        ) + _missed(point)
    else:
        goal = (
            f"Not yet at the goal: {value} against {goal_cell(point)} (dry standard "
            f"{_standard_said(point, room_names)})."
        )
    return f"{goal} {trend_sentence(point, flued)}{_missed(point)}"


def _missed(point: MaterialPoint) -> str:
    mark = point.left_since
    if mark is not None:
        why = f" ({mark.reason})" if mark.reason else ""
        if mark.for_good:
            return (
                f" Left out for good after this reading{why}: it is not read again, and it "
                "is not counted among the points still drying."
            )
        return f" Not read since{why}: read it again at the next visit."
    if point.visits_missed == 0:
        return ""
    if point.visits_missed == 1:
        return " Not read on the room's last visit: read it again at the next."
    return f" Not read on the room's last {point.visits_missed} visits: read it again at the next."


def says_close_up(point: MaterialPoint, flued: bool | None) -> bool:
    """Whether the point's words tell the reader to keep the area closed while an
    open-flued appliance may be there (``flued`` not false): then they point to the
    combustion-air caution, and the face shows that caution (:func:`combustion_caution`)."""
    return (
        point.trend is TrendState.STALLED
        and point.goal_met is not True
        and not point.gone
        and flued is not False
    )


def combustion_caution(flued: bool | None, d: Display) -> str:
    """The combustion-air caution's own words, for a face whose drying words pointed to it."""
    return caution_text(Caution("combustion_air", flued=flued), d)


def trend_sentence(point: MaterialPoint, flued: bool | None = None) -> str:
    """The trend of a point not yet at its goal: the rate and days left, or stalled. Where
    stalled drying is told to keep the area closed and an open-flued appliance may be there
    (``flued`` true or not said), the sentence points to the combustion-air caution."""
    fit = point.fit
    unit = _RATE_UNIT[point.scale]
    if point.trend is TrendState.ONE_READING or fit is None:
        return "One reading so far: the rate needs the next visit's."
    if point.trend is TrendState.STALLED:
        if fit.rate_per_day < 0 and (point.last_step_per_day or 0.0) >= 0.0:
            how = "no fall since the reading before"
        elif fit.rate_per_day < 0:
            how = (
                f"it fell only {_number(abs(fit.rate_per_day))} {unit} a day over the last "
                f"{fit.readings} readings"
            )
        else:
            how = (
                f"no fall over the last {fit.readings} readings "
                f"({'+' if fit.rate_per_day > 0 else ''}{_number(fit.rate_per_day)} {unit} a day)"
            )
        pointer = (
            f" (first see the caution on {CAUTION_NAMES['combustion_air']}: an open-flued "
            "appliance may draw its air from it)"
            if flued is not False
            else ""
        )
        return (
            f"Drying has stalled: {how}. Check that the equipment runs and the drying area "
            f"is kept closed{pointer}, move air over the wet surface, and look for water "
            "still getting in."
        )
    rate = f"falling {_number(abs(fit.rate_per_day))} {unit} a day"
    if point.trend is TrendState.UNCLEAR:
        return (
            f"The readings fall on average ({rate}) but scatter too much for a steady rate; "
            "the next readings will tell."
        )
    estimate = point.estimate
    if estimate is None:
        return f"Drying: {rate}."
    head = (
        f"Drying: {rate}; at that rate the goal is about {days_text(estimate.days)} away, "
        f"around {_date(estimate.by)}."
    )
    return f"{head} {_range_sentence(estimate)}"


def _range_sentence(estimate: GoalEstimate) -> str:
    """How sure the days to the goal are: rough, its range, or that it could take longer."""
    if estimate.days_low is None:
        return "A rough figure: two readings give no range yet."
    level = f"the rate's {INTERVAL_CONFIDENCE_PCT:.0f} % range"
    lead = (
        "A rough figure from three readings: "
        if estimate.rough
        else f"From {estimate.readings} readings, "
    )
    if estimate.open_ended or estimate.days_high is None:
        return (
            f"{lead}{level} gives {days_text(estimate.days_low)} at its fast end, and at its "
            "slow end no fall at all, so it could take much longer."
        )
    return f"{lead}{level} gives {_range_text(estimate.days_low, estimate.days_high)}."


def point_status(point: MaterialPoint) -> str:
    """A few words for a list: "met", "about 0.9 days", "stalled" …"""
    if point.goal_met is None and point.trend is not TrendState.STALLED:
        return "no goal (no dry standard)"
    return outlook_cell(point)


def room_goals_text(room: RoomDrying) -> str:
    """How many of a room's points are at their goal."""
    if not room.points:
        return "No material points are read in this room."
    gone = sum(p.gone for p in room.points)
    if gone:
        gone_said = f" ({gone} more left out for good)"
        if gone == len(room.points):
            return (
                f"No material point is still read here: the {gone} read before "
                f"{'was' if gone == 1 else 'were'} left out for good."
            )
    else:
        gone_said = ""
    if room.goals_set == 0:
        count = len(room.points) - gone
        return (
            f"{count} material point{'' if count == 1 else 's'}, "
            f"{'without' if count == 1 else 'none with'} a dry standard to set a goal"
            f"{gone_said}."
        )
    return (
        f"{room.goals_met} of {room.goals_set} material point"
        f"{'' if room.goals_set == 1 else 's'} at {'its' if room.goals_set == 1 else 'their'} "
        f"drying goal{gone_said}."
    )


# --- loggers ---------------------------------------------------------------------------------


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
