"""A visit of a survey file, judged: the survey model turned into the assessment's inputs.

:mod:`survey.assess` and :mod:`survey.advise` take plain inputs and know nothing of files;
:mod:`survey.model` holds readings and knows nothing of judgement. This module joins them,
so the report, the app and the command line all judge a stored visit the same way:

* air, surface and material readings of each room visited, with the room's use, volume and
  occupants;
* what was seen: visible mould (on the room or on any surface, with its area when
  measured), condensation, odour, the water category, and whether drying equipment is
  running in the room (then readings above the dry standard mean "keep drying", not "find
  the source");
* the instruments' accuracies where the survey records them (the least accurate instrument
  used in a room counts for that room), the typical defaults of :mod:`survey.thresholds`
  where it does not — and which were used is reported;
* each material reading's dry standard: a reading of the same material on the same scale
  marked as a dry standard in the same room, else in a reference (unaffected) room on the
  same visit;
* the visit's outdoor reading and the pressure of :func:`survey.model.pressure_pa_for`.
"""

from __future__ import annotations

import datetime as dt
from collections.abc import Sequence
from dataclasses import dataclass
from typing import NamedTuple

import msgspec

from survey import advise, assess, model
from survey import thresholds as th


@dataclass(frozen=True)
class VisitAssessment:
    """One visit judged: the findings, the advice, and what the judgement rested on."""

    visit_index: int
    visit: model.Visit
    findings: assess.SiteFinding
    advice: advise.SiteAdvice
    room_ids: tuple[str, ...]  #: the survey room id of each finding, in order
    accuracy_entered: dict[str, bool]  #: which accuracies came from the survey's instruments


@dataclass(frozen=True)
class RoomAssessment:
    """One room of a visit judged, as :func:`assess_visit` judges it within the visit."""

    finding: assess.RoomFinding
    advice: advise.RoomAdvice
    cautions: tuple[advise.Caution, ...]  #: the cautions of a visit of this room alone


#: Equipment that, running in a room, means the room is being dried (the source dealt with).
DRYING_EQUIPMENT = frozenset(
    {"refrigerant_dehumidifier", "desiccant_dehumidifier", "air_mover", "heater"}
)


def drying_in_progress(room_visit: model.RoomVisit) -> bool:
    """Whether the room is being dried on this visit: drying equipment running in it."""
    return any(e.running and e.kind in DRYING_EQUIPMENT for e in room_visit.equipment)


_DEHUMIDIFIERS = frozenset({"refrigerant_dehumidifier", "desiccant_dehumidifier"})


def year_built(survey: model.Survey, visit: model.Visit) -> int | None:
    """The building's year as the cautions take it: a year after the visit's cannot be
    right (a mistyped 2090 for 1990), so it is taken as not known, and the cautions that go
    by the building's age are given as for a building of unknown age."""
    year = survey.site.year_built
    return None if year is not None and year > visit.started_at.year else year


def drying_equipment(
    survey: model.Survey, visit: model.Visit, room_visit: model.RoomVisit
) -> assess.DryingEquipment | None:
    """The running dehumidifiers and air movers of a room, with what they logged."""
    running = [e for e in room_visit.equipment if e.running]
    dehumidifiers = [e for e in running if e.kind in _DEHUMIDIFIERS]
    movers = [e for e in running if e.kind == "air_mover"]
    if not dehumidifiers and not movers:
        return None
    capacities = [e.capacity_l_per_day for e in dehumidifiers if e.capacity_l_per_day]
    removed = [e.water_removed_l for e in dehumidifiers if e.water_removed_l is not None]
    outlet = next((e.outlet for e in dehumidifiers if e.outlet is not None), None)
    # Each unit's water over its own run time (its run hours, else since its previous
    # reading): the units' rates add up; the hours given are those the total took at them.
    hours: float | None = None
    if removed:
        from survey.equipment import stored  # its readers load only where units log water

        rates: list[float] = []
        for e in dehumidifiers:
            if e.water_removed_l is None:
                continue
            run_h, _ = stored.run_duration(survey, visit, room_visit, e)
            if run_h is None:
                rates = []
                break
            rates.append(e.water_removed_l * 24.0 / run_h)
        # A rate no room unit gives means the water or the hours were recorded wrongly: no
        # load is taken from it (the dehumidifier check names the inconsistency).
        if any(r > th.value("dehumidifier_removal_max_l_per_day") for r in rates):
            rates = []
        if rates and sum(rates) > 0.0:
            hours = sum(removed) * 24.0 / sum(rates)
    return assess.DryingEquipment(
        dehumidifiers=len(dehumidifiers),
        air_movers=len(movers),
        capacity_l_per_day=sum(capacities) if capacities else None,
        water_removed_l=sum(removed) if removed else None,
        hours_since_previous=hours,
        outlet_temp_c=None if outlet is None else outlet.dry_bulb_c,
        outlet_rh_pct=None if outlet is None else outlet.rh_pct,
    )


def is_timber(material: str) -> bool:
    """Whether a material name describes timber (so the timber limits apply)."""
    return th.is_timber(material)


def _accuracy(
    survey: model.Survey,
    instrument_ids: list[str | None],
    entered: dict[str, bool],
    shared_thermometer: bool = True,
) -> assess.Accuracy:
    """The worst accuracy of each kind among the instruments used, defaults elsewhere."""
    default = assess.DEFAULT_ACCURACY
    found: dict[str, float | None] = {"air_temp_k": None, "rh_pct": None, "surface_temp_k": None}
    for instrument_id in instrument_ids:
        if instrument_id is None:
            continue
        try:
            instrument = survey.instrument(instrument_id)
        except KeyError:  # a file that validates names only instruments it has
            continue
        for key, value in (
            ("air_temp_k", instrument.air_temp_accuracy_k),
            ("rh_pct", instrument.rh_accuracy_pct),
            ("surface_temp_k", instrument.surface_temp_accuracy_k),
        ):
            if value is not None:
                previous = found[key]
                found[key] = value if previous is None else max(previous, value)
    for key, value in found.items():
        entered[key] = entered.get(key, True) and value is not None
    return assess.Accuracy(
        air_temp_k=default.air_temp_k if found["air_temp_k"] is None else found["air_temp_k"],
        rh_pct=default.rh_pct if found["rh_pct"] is None else found["rh_pct"],
        surface_temp_k=(
            default.surface_temp_k if found["surface_temp_k"] is None else found["surface_temp_k"]
        ),
        shared_thermometer=shared_thermometer,
    )


class DryStandard(NamedTuple):
    """A dry-standard reading a material is judged against: its value, the room it was read
    in, and the visit (index) it was read on when that is an earlier one (None: this one)."""

    value: float
    room_id: str
    visit_index: int | None = None


def _dry_standards(
    visit: model.Visit,
    room_visit: model.RoomVisit,
    rooms: dict[str, model.Room],
    references: list[model.RoomVisit] | None = None,
    earlier: Sequence[EarlierVisit] = (),
) -> dict[tuple[str, str], DryStandard]:
    """Dry-standard readings by (material, scale): this room's first, then the visit's
    reference rooms'; then, for a material not read so on this visit, the same on the
    ``earlier`` visits, latest first (an unaffected area read once is still the standard
    until it is read again)."""
    if references is None:
        references = _reference_visits(visit, rooms)
    standards: dict[tuple[str, str], DryStandard] = {}

    def take(sources: Sequence[model.RoomVisit], index: int | None) -> None:
        for source in sources:
            for reading in source.materials:
                if reading.dry_standard:
                    standards.setdefault(
                        (reading.material.strip().lower(), reading.scale),
                        DryStandard(reading.value, source.room, index),
                    )

    take((room_visit, *(rv for rv in references if rv is not room_visit)), None)
    wanted = {
        (m.material.strip().lower(), m.scale) for m in room_visit.materials if not m.dry_standard
    }
    for index, before, refs in earlier:
        if wanted <= standards.keys():
            break
        own = before.room_visit(room_visit.room)
        take((*((own,) if own is not None else ()), *(rv for rv in refs if rv is not own)), index)
    return standards


class EarlierVisit(NamedTuple):
    """A visit begun before the one judged: its index, the visit, its reference rooms'
    readings (found once, for all the rooms judged)."""

    visit_index: int
    visit: model.Visit
    references: list[model.RoomVisit]


def earlier_visits(
    survey: model.Survey, visit_index: int, rooms: dict[str, model.Room] | None = None
) -> list[EarlierVisit]:
    """The visits begun before visit ``visit_index`` (at the same time: those before it in
    the file), latest first. Where some visits give a time zone and others do not, start
    times are compared as the wall-clock times written (as drying progress reads them), so
    such a file still orders."""
    if rooms is None:
        rooms = {r.id: r for r in survey.rooms}
    visits = survey.visits
    return [
        EarlierVisit(i, visits[i], _reference_visits(visits[i], rooms))
        for i in earlier_visit_indexes(survey, visit_index)
    ]


def earlier_visit_indexes(survey: model.Survey, visit_index: int) -> list[int]:
    """The indexes of :func:`earlier_visits`, latest first, without their reference
    rooms: the order alone."""
    visits = survey.visits
    mixed = len({v.started_at.tzinfo is None for v in visits}) > 1

    def key(index: int) -> tuple[dt.datetime, int]:
        at = visits[index].started_at
        return (at.replace(tzinfo=None) if mixed else at), index

    mine = key(visit_index % len(visits))
    return sorted((i for i in range(len(visits)) if key(i) < mine), key=key, reverse=True)


def _reference_visits(visit: model.Visit, rooms: dict[str, model.Room]) -> list[model.RoomVisit]:
    """The visit's readings in reference rooms (unaffected rooms, the dry standard)."""
    return [rv for rv in visit.rooms if (r := rooms.get(rv.room)) is not None and r.is_reference]


def room_input(
    survey: model.Survey,
    visit: model.Visit,
    room_visit: model.RoomVisit,
    entered: dict[str, bool],
    rooms: dict[str, model.Room] | None = None,
    references: list[model.RoomVisit] | None = None,
    earlier: Sequence[EarlierVisit] | None = None,
) -> assess.RoomInput | None:
    """The assessment's input for one room on one visit; None when no air was measured.
    ``rooms`` (the survey's rooms by id), ``references`` (the visit's reference-room
    readings) and ``earlier`` (:func:`earlier_visits`) may be given when many rooms of one
    visit are judged, so each is found once; ``earlier`` must be given for a ``visit`` that
    is not one of the survey's own objects (a candidate copy)."""
    if room_visit.air is None:
        return None
    if rooms is None:
        rooms = {r.id: r for r in survey.rooms}
    room = rooms.get(room_visit.room)
    if earlier is None:
        index = next((i for i, v in enumerate(survey.visits) if v is visit), None)
        earlier = [] if index is None else earlier_visits(survey, index, rooms)
    standards = _dry_standards(visit, room_visit, rooms, references, earlier)

    def material(reading: model.MaterialReading) -> assess.MaterialInput:
        standard = standards.get((reading.material.strip().lower(), reading.scale))
        return assess.MaterialInput(
            label=reading.location,
            material=reading.material,
            value=reading.value,
            scale=reading.scale,
            dry_standard=None if standard is None else standard.value,
            timber=reading.scale == "mc_pct" and is_timber(reading.material),
            dry_standard_visit=None if standard is None else standard.visit_index,
        )

    materials = tuple(material(r) for r in room_visit.materials if not r.dry_standard)
    surfaces = tuple(
        assess.SurfaceInput(s.location, s.surface_temp_c, s.element) for s in room_visit.surfaces
    )
    seen = room_visit.observations
    mould_visible = seen.mould_visible or any(s.mould_visible for s in room_visit.surfaces)
    observations = assess.Observations(
        visible_mould_area_m2=(seen.mould_area_m2 or 0.0) if mould_visible else 0.0,
        visible_mould=mould_visible,
        water_category=seen.water_category,
        condensation_seen=seen.condensation_seen
        or any(s.condensation_seen for s in room_visit.surfaces),
        odour=seen.odour not in (None, "none"),
        drying_in_progress=drying_in_progress(room_visit),
        drying=drying_equipment(survey, visit, room_visit),
        water_standing_h=seen.water_standing_h,
        water_loss_class=seen.water_loss_class,
        wet_area_pct=seen.wet_area_pct,
        dense_materials_wet=seen.dense_materials_wet,
        flued_appliance=(
            room.flued_appliance
            if room is not None and room.flued_appliance is not None
            else survey.site.flued_appliance
        ),
    )
    activities = _activities(room)
    instruments = [room_visit.air.instrument, *(s.instrument for s in room_visit.surfaces)]
    return assess.RoomInput(
        name=room.name if room is not None else room_visit.room,
        use=room.use if room is not None else "other",
        air_temp_c=room_visit.air.dry_bulb_c,
        rh_pct=room_visit.air.rh_pct,
        surfaces=surfaces,
        volume_m3=room.volume_estimate_m3() if room is not None else None,
        occupants=room.occupants if room is not None else None,
        materials=materials,
        observations=observations,
        accuracy=_accuracy(survey, instruments, entered, _shared_thermometer(visit, room_visit)),
        activities=activities,
        laundry_loads_per_day=None if room is None else room.laundry_loads_per_day,
    )


def _activities(room: model.Room | None) -> tuple[assess.Activity, ...]:
    """The room's usual showers, baths and cooking, as hours a day of each activity."""
    if room is None:
        return ()
    found = []
    if room.showers_per_day is not None:
        found.append(
            assess.Activity("shower", room.showers_per_day * th.value("shower_minutes") / 60.0)
        )
    if room.baths_per_day is not None:
        found.append(assess.Activity("bath", room.baths_per_day * th.value("bath_minutes") / 60.0))
    if room.cooking_hours_per_day is not None:
        found.append(assess.Activity("cooking", room.cooking_hours_per_day))
    return tuple(found)


def _shared_thermometer(visit: model.Visit, room_visit: model.RoomVisit) -> bool:
    """Whether one thermometer read the room and the outdoor air: the same instrument, or
    either not said (the usual case on site, and the assumption then)."""
    if visit.outdoor is None:
        return True
    if room_visit.air is None:
        return True
    indoor, outdoor = room_visit.air.instrument, visit.outdoor.instrument
    return indoor is None or outdoor is None or indoor == outdoor


def assess_visit(
    survey: model.Survey, visit_index: int = -1, target_rh_pct: float | None = None
) -> VisitAssessment:
    """Judge one visit of ``survey`` (the last by default): findings and advice per room."""
    visit = survey.visits[visit_index]
    index = visit_index % len(survey.visits)
    entered: dict[str, bool] = {}
    rooms: list[assess.RoomInput] = []
    room_ids: list[str] = []
    rooms_by_id = {r.id: r for r in survey.rooms}
    references = _reference_visits(visit, rooms_by_id)
    earlier = earlier_visits(survey, index, rooms_by_id)
    for room_visit in visit.rooms:
        judged = room_input(survey, visit, room_visit, entered, rooms_by_id, references, earlier)
        if judged is not None:
            rooms.append(judged)
            room_ids.append(room_visit.room)
    outdoor = (
        None
        if visit.outdoor is None
        else assess.OutdoorInput(visit.outdoor.dry_bulb_c, visit.outdoor.rh_pct)
    )
    findings = assess.assess_site(
        rooms, outdoor, model.pressure_pa_for(survey, visit), year_built=year_built(survey, visit)
    )
    return VisitAssessment(
        visit_index=index,
        visit=visit,
        findings=findings,
        advice=advise.advise_site(findings, target_rh_pct),
        room_ids=tuple(room_ids),
        accuracy_entered={
            key: entered.get(key, False) for key in ("air_temp_k", "rh_pct", "surface_temp_k")
        },
    )


def assess_room(
    survey: model.Survey,
    visit_index: int,
    room_id: str,
    candidate: model.RoomVisit | None = None,
    target_rh_pct: float | None = None,
) -> RoomAssessment | None:
    """One room of a stored visit judged as :func:`assess_visit` judges it (``candidate``
    in place of its stored record, e.g. for a preview of a value being typed); ``None``
    when the room has no air reading on that visit.

    Only this room and the reference rooms (whose dry standards count for it) are judged,
    so a room of a large survey takes the time of a small one."""
    if not survey.visits:
        return None
    visit = survey.visits[visit_index]
    record = candidate if candidate is not None else visit.room_visit(room_id)
    if record is None:
        return None
    references = {r.id for r in survey.rooms if r.is_reference}
    visit = msgspec.structs.replace(
        visit,
        rooms=[rv for rv in visit.rooms if rv.room in references and rv.room != room_id] + [record],
    )
    rooms_by_id = {r.id: r for r in survey.rooms}
    judged = room_input(
        survey,
        visit,
        record,
        {},
        rooms_by_id,
        _reference_visits(visit, rooms_by_id),
        # by index: ``visit`` here is a copy, which is not one of the survey's visits
        earlier_visits(survey, visit_index, rooms_by_id),
    )
    if judged is None:
        return None
    outdoor = (
        None
        if visit.outdoor is None
        else assess.OutdoorInput(visit.outdoor.dry_bulb_c, visit.outdoor.rh_pct)
    )
    site = assess.assess_site(
        [judged],
        outdoor,
        model.pressure_pa_for(survey, visit),
        year_built=year_built(survey, visit),
    )
    advice = advise.advise_site(site, target_rh_pct)
    return RoomAssessment(site.rooms[0], advice.rooms[0], advice.cautions)
