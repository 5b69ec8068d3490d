"""Drying progress in words: each material point against its goal, the rate and the days
left or that drying has stalled, the room air's trend, and a logger's days — for the report
and the app alike, numbers in a :class:`~survey.words.display.Display`'s units. A logger's
days are in :mod:`survey.words.drying_loggers`, a rate's decimals in
:mod:`survey.words.drying_rates`; their names are re-exported here.

Plain strings, no markup. The records are :mod:`survey.drying`'s.
"""

from __future__ import annotations

import datetime as dt
from collections.abc import Mapping

from survey import thresholds as th
from survey.advise.kinds import Caution
from survey.drying import (
    GoalEstimate,
    MaterialPoint,
    PointReading,
    RoomAir,
    RoomDrying,
    TrendState,
)
from survey.drying.trend import INTERVAL_CONFIDENCE_PCT
from survey.words.cautions import CAUTION_NAMES, caution_text
from survey.words.display import Display
from survey.words.drying_loggers import (
    AIR_RH_NOTE as AIR_RH_NOTE,
)
from survey.words.drying_loggers import (
    OUTDOORS as OUTDOORS,
)
from survey.words.drying_loggers import (
    day_text as day_text,
)
from survey.words.drying_loggers import (
    hours_text as hours_text,
)
from survey.words.drying_loggers import (
    is_room_air as is_room_air,
)
from survey.words.drying_loggers import (
    logger_day_line as logger_day_line,
)
from survey.words.drying_loggers import (
    logger_gaps_text as logger_gaps_text,
)
from survey.words.drying_loggers import (
    logger_header as logger_header,
)
from survey.words.drying_loggers import (
    logger_heading as logger_heading,
)
from survey.words.drying_loggers import (
    logger_trend_text as logger_trend_text,
)
from survey.words.drying_loggers import (
    ratio_range_text as ratio_range_text,
)
from survey.words.drying_loggers import (
    rh_kind as rh_kind,
)
from survey.words.drying_loggers import (
    rh_range_text as rh_range_text,
)
from survey.words.drying_loggers import (
    temperature_range_text as temperature_range_text,
)
from survey.words.drying_rates import _rate_and_band
from survey.words.drying_rates import air_rate_text as air_rate_text
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


def margin_text(margin_k: float | None, label: str | None, d: Display) -> str:
    """The worst surface's margin to the dew (or frost) point, and which surface it is."""
    if margin_k is None or label is None:
        return "no surface measured"
    if margin_k <= 0.0:
        return f"{label}: −{d.difference(-margin_k)} (condensing)"
    return f"{label}: {d.difference(margin_k)}"


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
