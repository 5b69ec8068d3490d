"""A stored survey visit's dehumidifiers judged: the inlet, duration and power of each unit
found from the file (:func:`judge_visit`)."""

from __future__ import annotations

import datetime as dt
from dataclasses import dataclass
from typing import Literal

from survey import model
from survey.equipment.performance import (
    RUN_HOURS_MAX_H,
    AirPair,
    DehumidifierInput,
    DehumidifierKind,
    DehumidifierResult,
    DurationSource,
    check,
)

# --- stored visits -----------------------------------------------------------------------

_KINDS: dict[str, DehumidifierKind] = {
    "refrigerant_dehumidifier": "refrigerant",
    "desiccant_dehumidifier": "desiccant",
}
Missing = Literal["outlet", "inlet"]


@dataclass(frozen=True, slots=True)
class StoredUnit:
    """One dehumidifier record of a stored visit, judged (``result`` None when a reading
    it needs is missing: ``missing`` says which)."""

    visit_index: int
    room_id: str
    equipment_index: int
    record: model.Equipment
    result: DehumidifierResult | None
    missing: tuple[Missing, ...] = ()

    @property
    def label(self) -> str:
        return self.record.label


def _reading_time(
    visit: model.Visit, room_visit: model.RoomVisit, e: model.Equipment
) -> dt.datetime:
    for reading in (e.outlet, e.inlet, room_visit.air):
        if reading is not None and reading.taken_at is not None:
            return reading.taken_at
    return visit.started_at


def _hours(
    later: dt.datetime, earlier: dt.datetime, source: DurationSource
) -> tuple[float | None, DurationSource | None]:
    """The hours between two readings as the run time, with where they came from; none
    where the earlier is not before the later ("not_after_previous") or too long before
    it to stand for a run ("too_long_since", past RUN_HOURS_MAX_H), or the two times
    cannot be compared (one with a time zone, one without)."""
    try:
        hours = (later - earlier).total_seconds() / 3600.0
    except TypeError:  # naive and aware times mixed
        return None, None
    if hours <= 0.0:
        return None, "not_after_previous"
    if hours > RUN_HOURS_MAX_H:
        return None, "too_long_since"
    return hours, source


def _same_unit(a: model.Equipment, b: model.Equipment) -> bool:
    return a.kind == b.kind and a.label.strip().casefold() == b.label.strip().casefold()


def run_duration(
    survey: model.Survey, visit: model.Visit, room_visit: model.RoomVisit, e: model.Equipment
) -> tuple[float | None, DurationSource | None]:
    """Run hours, else hours since the previous reading of the same unit (same room, same
    kind and label), else since the previous visit began."""
    if e.run_hours is not None:
        return e.run_hours, "run_hours"
    now = _reading_time(visit, room_visit, e)
    earlier = sorted(
        (v for v in survey.visits if v is not visit and _before(v, visit)),
        key=lambda v: v.started_at,
        reverse=True,
    )
    if not earlier:
        return None, None
    for v in earlier:
        before = v.room_visit(room_visit.room)
        if before is None:
            continue
        for other in before.equipment:
            if _same_unit(other, e):
                return _hours(now, _reading_time(v, before, other), "since_previous_reading")
    return _hours(now, earlier[0].started_at, "since_previous_visit")


def _before(a: model.Visit, b: model.Visit) -> bool:
    try:
        return a.started_at < b.started_at
    except TypeError:
        return False


def judge_record(
    survey: model.Survey,
    visit_index: int,
    room_visit: model.RoomVisit,
    equipment_index: int,
    record: model.Equipment | None = None,
) -> StoredUnit | None:
    """One equipment record of a room visit judged (``record`` overrides the stored one, for
    a dialog's preview); None for equipment that is not a dehumidifier."""
    visit = survey.visits[visit_index]
    e = record if record is not None else room_visit.equipment[equipment_index]
    kind = _KINDS.get(e.kind)
    if kind is None:
        return None
    inlet = e.inlet if e.inlet is not None else room_visit.air
    missing: list[Missing] = []
    if e.outlet is None:
        missing.append("outlet")
    if inlet is None:
        missing.append("inlet")
    if e.outlet is None or inlet is None:
        return StoredUnit(visit_index, room_visit.room, equipment_index, e, None, tuple(missing))
    hours, source = run_duration(survey, visit, room_visit, e)
    given = DehumidifierInput(
        readings=(AirPair(inlet.dry_bulb_c, inlet.rh_pct, e.outlet.dry_bulb_c, e.outlet.rh_pct),),
        kind=kind,
        water_l=e.water_removed_l,
        duration_h=hours,
        power_w=e.power_w,
        energy_kwh=e.energy_kwh,
        pressure_pa=model.pressure_pa_for(survey, visit),
        rated_capacity_l_per_day=e.capacity_l_per_day,
        rated_energy_factor_l_per_kwh=e.rated_energy_factor_l_per_kwh,
        rating_condition=e.rating_condition,
        label=e.label,
        running=e.running,
        inlet_is_room_air=e.inlet is None,
        duration_source=source,
    )
    return StoredUnit(visit_index, room_visit.room, equipment_index, e, check(given))


def judge_visit(survey: model.Survey, visit_index: int) -> tuple[StoredUnit, ...]:
    """Every dehumidifier record of a stored visit, room by room, in the file's order."""
    found: list[StoredUnit] = []
    for room_visit in survey.visits[visit_index].rooms:
        for n in range(len(room_visit.equipment)):
            unit = judge_record(survey, visit_index, room_visit, n)
            if unit is not None:
                found.append(unit)
    return tuple(found)
