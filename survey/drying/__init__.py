"""Drying progress across a site's visits: each room's air, each material point against its
dry standard and drying goal, the drying rate, the days left at that rate, and logger days.

Every visit is judged once, by :func:`survey.evaluate.assess_visit` (or a face's cached
judgement, passed as ``judge``); the numbers here are read from its typed findings: the room
air's RH and humidity ratio, each surface's margin to the dew (or frost) point, and each
material reading's dry standard and state. Nothing is stored; it is all worked out from the
readings each time.

Points. A material point is one spot read on several visits. Readings are matched by
location, material and scale: the location and material are compared in the Unicode
compatibility caseless form (:func:`fold`: case and compatibility forms such as full-width
letters ignored), with every run of white space made one space and the ends trimmed, so
``"Party wall, 0.1 m above floor"`` and ``"party wall, 0.1 m  above floor "`` are one point.
Nothing else is forgiven (a changed word or comma is another point, rather than a guess).
A reading on another scale is another point (MC % and a relative scale cannot be trended
together). Dry-standard readings (``dry_standard``) are not points to dry: they are the goal.

Dry standard and goal. Each reading's dry standard is the one the assessment used
(:mod:`survey.evaluate`: a dry-standard reading of the same material and scale in the same
room, else in a reference room on the same visit). A point's goal is its latest dry
standard plus the ``dry_standard_tolerance_fraction`` allowance, the same rule by which the
assessment calls a reading "at the dry standard"; the goal is met when the latest reading is
at or below it. A point with no dry standard has no goal (its trend is still given).

Rate. The drying rate is the ordinary least-squares slope of reading against time in days
over the point's most recent readings (at most ``drying_trend_readings``: materials dry
fast at first and slower as they near dry, so the recent part is what says how long is
left), with the slope's standard error when there are three readings or more. The trend is

* stalled when the fitted fall is at most ``drying_stalled_daily_fraction`` of the
  latest reading a day (flat or rising), or when the latest reading did not fall below the
  one before by that much a day;
* unclear when it falls on average but by less than ``drying_steady_standard_errors``
  standard errors (the readings scatter too much for a rate);
* falling (steady) otherwise: then the days to the goal are the latest reading's excess
  over the goal divided by the fall per day, with the range given by the rate's 95 %
  interval, rate ± t·s_b with Student's t at n − 2 degrees of freedom
  (:data:`survey.drying.trend.T_975`): none with two readings only, marked rough with two
  or three, and open at its slow end when that end is no fall at all. A stalled or unclear
  trend gets no number. A straight line is optimistic: drying slows as materials near dry.

Loggers. Each :class:`~survey.model.LogSeries` is summed up per calendar day (of the times
as written): the mean (of the day's samples), minimum and maximum of temperature, RH and
humidity ratio (:func:`survey.psychro.vapour_state` at the site's pressure), and the hours
above the mould limit (``surface_rh_mould_limit_pct``, 80 %) and above
``logger_rh_wet_pct`` (90 %). Hours are weighted by time: the gap between two samples is
split at its midpoint, each half counting at its own sample's RH (and split again at
midnight); a gap longer than ``logger_gap_max_intervals`` times the series' median gap is not
counted for either sample, and is counted as left out (as are hours that would fall on a day
with no sample of its own, for samples days apart). The daily means feed the same rate fit
as the visits' readings.

The package: this module (points, rooms, the site), :mod:`survey.drying.trend` (the rate
fit, the trend, the days to the goal) and :mod:`survey.drying.logger` (logger days).
"""

from __future__ import annotations

import dataclasses
import datetime as dt
import math
from collections.abc import Callable
from dataclasses import dataclass

from survey import evaluate, model
from survey import thresholds as th
from survey.assess import DryStandardState, MaterialFinding, RoomFinding
from survey.drying.logger import (
    DayRange,
    LoggerDay,
    LoggerSummary,
    logger_days,
    summarise_log,
)
from survey.drying.trend import (
    Fit,
    GoalEstimate,
    TrendState,
    estimate_to_goal,
    fit_line,
    recent_fit,
    trend_of,
)
from survey.logtime import between
from survey.safe_text import fold

__all__ = [
    "DayRange",
    "Fit",
    "GoalEstimate",
    "LoggerDay",
    "LoggerSummary",
    "MaterialPoint",
    "PointKey",
    "PointReading",
    "RoomAir",
    "RoomDrying",
    "SiteDrying",
    "TrendState",
    "days_between",
    "drying_progress",
    "estimate_to_goal",
    "fit_line",
    "fold",
    "goal_for",
    "logger_days",
    "point_key",
    "recent_fit",
    "trend_of",
]

PointKey = tuple[str, str, str]

_DAY_S = 86_400.0


def point_key(location: str, material: str, scale: str) -> PointKey:
    """The key two readings of one material point share (see the module notes)."""
    return (fold(location), fold(material), scale)


def days_between(start: dt.datetime, end: dt.datetime) -> float:
    """Days from ``start`` to ``end`` (:func:`survey.logtime.between`: a pair with and
    without a time zone is read as the wall-clock times written)."""
    return between(start, end).total_seconds() / _DAY_S


# --- records ----------------------------------------------------------------------------------


@dataclass(frozen=True, slots=True)
class PointReading:
    """One reading of a material point."""

    visit_index: int
    at: dt.datetime
    day: float  #: days since the site's first visit
    value: float
    dry_standard: float | None
    state: DryStandardState  #: the assessment's (or its rule, for a room not judged)

    @property
    def at_goal(self) -> bool:
        return self.state is DryStandardState.AT


@dataclass(frozen=True, slots=True)
class MaterialPoint:
    """One material point across the visits: readings, dry standard, goal, rate, days left."""

    key: PointKey
    location: str  #: as written on the latest reading
    material: str
    scale: str
    readings: tuple[PointReading, ...]  #: in time order
    dry_standard: float | None  #: the latest reading's
    dry_standard_room: str | None  #: the room id it was read in
    #: the visit (index) it was read on when an earlier one than the latest reading's
    dry_standard_visit: int | None
    goal: float | None  #: the dry standard plus its allowance
    goal_met: bool | None  #: the latest reading at or below the goal; None: no goal
    fit: Fit | None
    last_step_per_day: float | None  #: change from the reading before to the latest, a day
    trend: TrendState
    estimate: GoalEstimate | None  #: only for a steady fall toward a goal not yet met
    #: Visits to the room since the point was last read (0: read on the room's last visit).
    visits_missed: int = 0
    #: The visits (indexes) the point was left out on, with the reason recorded.
    left_out: tuple[tuple[int, model.LeftOut], ...] = ()
    #: The latest mark when the point was left out after its last reading (gone for good,
    #: or to read again); None when it was read last time it was seen.
    left_since: model.LeftOut | None = None

    @property
    def latest(self) -> PointReading:
        return self.readings[-1]

    @property
    def gone(self) -> bool:
        """Left out for good after its last reading: it is not dried any further."""
        mark = self.left_since
        return mark is not None and mark.for_good


@dataclass(frozen=True, slots=True)
class RoomAir:
    """A room's air and its worst surface on one visit."""

    visit_index: int
    at: dt.datetime
    day: float
    dry_bulb_c: float
    rh_pct: float
    humidity_ratio_kg_per_kg: float
    worst_margin_k: float | None  #: the least margin to the dew (or frost) point
    worst_margin_label: str | None  #: the surface it belongs to
    water_removed_l: float | None  #: water the room's equipment logged on this visit
    #: The reference rooms' air on the same visit (their mean; None for a reference room
    #: itself or with none measured), and the outdoor air's: what the room dries toward.
    reference_humidity_ratio_kg_per_kg: float | None = None
    outdoor_humidity_ratio_kg_per_kg: float | None = None


@dataclass(frozen=True, slots=True)
class RoomDrying:
    """A room's drying over the visits."""

    room_id: str
    name: str
    is_reference: bool
    air: tuple[RoomAir, ...]  #: visits with an air reading, in time order
    visits_seen: tuple[int, ...]  #: visit indexes where the room was entered, in time order
    humidity_ratio_fit: Fit | None  #: kg/kg per day, over the recent visits
    rh_fit: Fit | None  #: % per day
    points: tuple[MaterialPoint, ...]
    loggers: tuple[LoggerSummary, ...]
    #: An open-flued appliance in the room or the building: true, false or not said (the
    #: room's answer, else the site's, as the assessment takes it).
    flued_appliance: bool | None = None

    @property
    def goals_met(self) -> int:
        """Points at their goal, of those still there (not left out for good)."""
        return sum(p.goal_met is True for p in self.points if not p.gone)

    @property
    def goals_set(self) -> int:
        """Points with a goal, of those still there (not left out for good)."""
        return sum(p.goal_met is not None for p in self.points if not p.gone)


@dataclass(frozen=True, slots=True)
class SiteDrying:
    """Every room's drying, the outdoor loggers, and the limits used."""

    rooms: tuple[RoomDrying, ...]
    outdoor_loggers: tuple[LoggerSummary, ...]
    visit_order: tuple[int, ...]  #: visit indexes in time order
    threshold_keys: tuple[str, ...]


# --- building it ------------------------------------------------------------------------------

#: Returns the judged visit of an index (a face's cache, or evaluate.assess_visit).
Judge = Callable[[int], evaluate.VisitAssessment]

_DRYING_KEYS = (
    "dry_standard_tolerance_fraction",
    "drying_trend_readings",
    "drying_stalled_daily_fraction",
    "drying_steady_standard_errors",
)
_LOGGER_KEYS = ("logger_gap_max_intervals", "surface_rh_mould_limit_pct", "logger_rh_wet_pct")


def goal_for(dry_standard: float) -> float:
    """The drying goal: the dry standard plus the allowance that still counts as dry."""
    return dry_standard * (1.0 + th.value("dry_standard_tolerance_fraction"))


def _visit_order(survey: model.Survey) -> list[int]:
    origin = survey.visits[0].started_at if survey.visits else None
    if origin is None:
        return []
    return sorted(
        range(len(survey.visits)), key=lambda i: days_between(origin, survey.visits[i].started_at)
    )


@dataclass(frozen=True, slots=True)
class _Held:
    """One reading of a point with what it was judged against: where its dry standard was
    read (room and visit). The point's latest reading, by the time it was taken, gives the
    point's name and standard, so the two can never come from different readings."""

    point: PointReading
    reading: model.MaterialReading
    standard_room: str | None
    standard_visit: int | None


def _room_points(
    survey: model.Survey,
    order: list[int],
    room_id: str,
    findings: dict[tuple[int, str], tuple[MaterialFinding, ...]],
    rooms: dict[str, model.Room],
    origin: dt.datetime,
    earlier: dict[int, list[evaluate.EarlierVisit]],
) -> tuple[MaterialPoint, ...]:
    series: dict[PointKey, list[_Held]] = {}
    for index in order:
        visit = survey.visits[index]
        room_visit = visit.room_visit(room_id)
        if room_visit is None:
            continue
        judged = findings.get((index, room_id))
        # the same lookup the assessment makes: this room, the visit's reference rooms, then
        # the earlier visits' (where the room was judged, its finding's value is taken)
        standards = evaluate._dry_standards(visit, room_visit, rooms, earlier=earlier[index])
        readings = [m for m in room_visit.materials if not m.dry_standard]
        for position, reading in enumerate(readings):
            source = standards.get((reading.material.strip().lower(), reading.scale))
            if judged is not None and position < len(judged):
                finding = judged[position]
                standard, state = finding.dry_standard, finding.dry_standard_state
            else:
                standard = None if source is None else source.value
                state = (
                    DryStandardState.NO_REFERENCE
                    if standard is None
                    else DryStandardState.AT
                    if reading.value <= goal_for(standard)
                    else DryStandardState.ABOVE
                )
            at = reading.taken_at or visit.started_at
            point = PointReading(
                index, at, days_between(origin, at), reading.value, standard, state
            )
            key = point_key(reading.location, reading.material, reading.scale)
            room = None if standard is None or source is None else source.room_id
            standard_visit = None if standard is None or source is None else source.visit_index
            series.setdefault(key, []).append(_Held(point, reading, room, standard_visit))
    seen = [i for i in order if (rv := survey.visits[i].room_visit(room_id)) and rv.entered()]
    marks: dict[tuple[str, str], list[tuple[int, model.LeftOut]]] = {}
    for index in seen:
        record = survey.visits[index].room_visit(room_id)
        for mark in record.left_out if record else ():
            if mark.kind == "material":
                marks.setdefault((fold(mark.location), fold(mark.material)), []).append(
                    (index, mark)
                )
    out: list[MaterialPoint] = []
    for key, held in series.items():
        made = _point(key, held)
        last = max(seen.index(r.visit_index) for r in made.readings)
        left = tuple(marks.get(key[:2], []))
        after = [m for i, m in left if seen.index(i) > last]
        since = after[-1] if after else None
        gone = since is not None and since.for_good
        out.append(
            dataclasses.replace(
                made,
                visits_missed=len(seen) - 1 - last,
                left_out=left,
                left_since=since,
                # a point gone is not dried any further: no days to a goal for it
                estimate=None if gone else made.estimate,
            )
        )
    return tuple(out)


def _point(key: PointKey, series: list[_Held]) -> MaterialPoint:
    held = sorted(series, key=lambda h: h.point.day)  # stable: visit order breaks ties
    readings = [h.point for h in held]
    latest = readings[-1]
    last = held[-1]
    days = [r.day for r in readings]
    values = [r.value for r in readings]
    fit = recent_fit(days, values)
    step = None
    if len(readings) >= 2 and readings[-1].day - readings[-2].day > 1e-9:
        step = (readings[-1].value - readings[-2].value) / (readings[-1].day - readings[-2].day)
    goal = None if latest.dry_standard is None else goal_for(latest.dry_standard)
    met = None if goal is None else latest.at_goal
    trend = trend_of(fit, latest.value, step)
    estimate = None
    if fit is not None and goal is not None and not met and trend is TrendState.FALLING:
        estimate = estimate_to_goal(fit, latest.value, goal, latest.at)
    return MaterialPoint(
        key=key,
        location=last.reading.location,
        material=last.reading.material,
        scale=last.reading.scale,
        readings=tuple(readings),
        dry_standard=latest.dry_standard,
        dry_standard_room=last.standard_room if goal is not None else None,
        dry_standard_visit=last.standard_visit if goal is not None else None,
        goal=goal,
        goal_met=met,
        fit=fit,
        last_step_per_day=step,
        trend=trend,
        estimate=estimate,
    )


def _room_air(
    index: int,
    visit: model.Visit,
    room_visit: model.RoomVisit,
    finding: RoomFinding,
    origin: dt.datetime,
) -> RoomAir:
    worst = min(finding.surfaces, key=lambda s: s.dew_point_margin_k, default=None)
    removed = [e.water_removed_l for e in room_visit.equipment if e.water_removed_l is not None]
    air = room_visit.air
    at = (air.taken_at if air is not None else None) or visit.started_at
    return RoomAir(
        visit_index=index,
        at=at,
        day=days_between(origin, at),
        dry_bulb_c=finding.air.dry_bulb_c,
        rh_pct=finding.air.rh_pct,
        humidity_ratio_kg_per_kg=finding.air.humidity_ratio_kg_per_kg,
        worst_margin_k=None if worst is None else worst.dew_point_margin_k,
        worst_margin_label=None if worst is None else worst.label,
        water_removed_l=math.fsum(removed) if removed else None,
    )


def drying_progress(survey: model.Survey, judge: Judge | None = None) -> SiteDrying:
    """The drying of every room of ``survey`` over its visits, and its logger days.

    ``judge(index)`` returns the judged visit (default :func:`survey.evaluate.assess_visit`);
    a face that has judged the visits already passes its own, so each is judged once."""
    if judge is None:

        def judge(index: int) -> evaluate.VisitAssessment:
            return evaluate.assess_visit(survey, index)

    order = _visit_order(survey)
    origin = survey.visits[order[0]].started_at if order else None
    rooms_by_id = {r.id: r for r in survey.rooms}
    #: each visit's earlier visits, found once for all the rooms
    earlier = {i: evaluate.earlier_visits(survey, i, rooms_by_id) for i in order}
    findings: dict[tuple[int, str], tuple[MaterialFinding, ...]] = {}
    air: dict[str, list[RoomAir]] = {}
    for index in order:
        va = judge(index)
        visit = survey.visits[index]
        judged = list(zip(va.findings.rooms, va.room_ids, strict=True))
        references = [
            f.air.humidity_ratio_kg_per_kg
            for f, room_id in judged
            if (r := rooms_by_id.get(room_id)) is not None and r.is_reference
        ]
        reference = math.fsum(references) / len(references) if references else None
        outdoor = va.findings.outdoor
        for finding, room_id in judged:
            findings[(index, room_id)] = finding.materials
            room_visit = visit.room_visit(room_id)
            if room_visit is not None and origin is not None:
                state = _room_air(index, visit, room_visit, finding, origin)
                is_reference = (r := rooms_by_id.get(room_id)) is not None and r.is_reference
                state = dataclasses.replace(
                    state,
                    reference_humidity_ratio_kg_per_kg=None if is_reference else reference,
                    outdoor_humidity_ratio_kg_per_kg=(
                        None if outdoor is None else outdoor.humidity_ratio_kg_per_kg
                    ),
                )
                air.setdefault(room_id, []).append(state)
    pressure = model.pressure_pa_for(survey)
    loggers = [summarise_log(i, log, pressure) for i, log in enumerate(survey.logs)]
    out = []
    for room in survey.rooms:
        seen = tuple(
            i for i in order if (rv := survey.visits[i].room_visit(room.id)) and rv.entered()
        )
        room_loggers = tuple(s for s in loggers if s.room_id == room.id)
        if not seen and not room_loggers:
            continue
        room_air = tuple(sorted(air.get(room.id, []), key=lambda a: a.day))
        days = [a.day for a in room_air]
        out.append(
            RoomDrying(
                room_id=room.id,
                name=room.name,
                is_reference=room.is_reference,
                air=room_air,
                visits_seen=seen,
                humidity_ratio_fit=recent_fit(days, [a.humidity_ratio_kg_per_kg for a in room_air]),
                rh_fit=recent_fit(days, [a.rh_pct for a in room_air]),
                points=(
                    ()
                    if origin is None
                    else _room_points(
                        survey, order, room.id, findings, rooms_by_id, origin, earlier
                    )
                ),
                loggers=room_loggers,
                flued_appliance=(
                    room.flued_appliance
                    if room.flued_appliance is not None
                    else survey.site.flued_appliance
                ),
            )
        )
    keys = (_DRYING_KEYS if order else ()) + (_LOGGER_KEYS if loggers else ())
    return SiteDrying(
        rooms=tuple(out),
        outdoor_loggers=tuple(s for s in loggers if s.room_id is None),
        visit_order=tuple(order),
        threshold_keys=keys,
    )
