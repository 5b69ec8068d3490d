"""The checks across a survey's records that the types alone cannot make: ids that exist,
a volume that floor area and height give, photo names inside the survey's folder, a design
month the colder-month projection can use. :func:`problems` lists them; both names are
re-exported by :mod:`survey.model`."""

from __future__ import annotations

import re
from collections.abc import Iterator

from survey import domain, thresholds
from survey.model import Room, RoomVisit, Site, Survey, point_key
from survey.psychro import DRY_BULB_MIN_C
from survey.safe_text import count_cut, shorten


def _id_list(ids: Iterator[str]) -> str:
    """The ids for a message: a few, then how many more ("a, b and 998 more")."""
    shown = list(ids)
    return count_cut(shown) if shown else "(none defined)"


def _quoted(text: str) -> str:
    return f"'{shorten(text, 40)}'"


def _volume_problem(room: Room) -> str:
    """Why floor area × height gives no usable volume ('' when it does or is not used)."""
    if room.volume_m3 is not None or room.floor_area_m2 is None or room.height_m is None:
        return ""
    volume = room.floor_area_m2 * room.height_m
    if domain.ROOM_VOLUME_MIN_M3 <= volume <= domain.ROOM_VOLUME_MAX_M3:
        return ""
    return (
        f"floor area {room.floor_area_m2:g} m² × height {room.height_m:g} m gives "
        f"{volume:g} m³; a room's volume must be between {domain.ROOM_VOLUME_MIN_M3:g} "
        f"and {domain.ROOM_VOLUME_MAX_M3:g} m³"
    )


def photo_name_problem(name: str) -> str:
    """Why ``name`` is not allowed as a photo's file name ('' when it is)."""
    if re.search(r"[\x00-\x1f\x7f]", name):
        return "contains control characters"
    if name[:1] in ("/", "\\") or re.match(r"[A-Za-z]:", name):
        return (
            "is an absolute path; give the photo's name relative to the survey file's "
            "folder (e.g. 'photos/bed1-corner.jpg')"
        )
    if ".." in re.split(r"[/\\]", name):
        return (
            "steps out of the survey file's folder with '..'; keep photos in that folder "
            "or a sub-folder of it"
        )
    return ""


def _design_month_problem(site: Site) -> tuple[str, str] | None:
    """A design month the colder-month projection (``survey.season.DesignMonth``) refuses: an
    outdoor mean below the psychrometric range (the field allows −60 °C), or an indoor
    temperature no warmer than the outdoor mean (our default's where the site gives none)."""
    outdoor, indoor = site.design_outdoor_temp_c, site.design_indoor_temp_c
    if outdoor is not None and outdoor < DRY_BULB_MIN_C:
        problem = f"the colder-month projection takes air from {DRY_BULB_MIN_C:g} °C"
        return "site.design_outdoor_temp_c", f"{outdoor:g} °C is too cold: {problem}"
    ours = outdoor is None
    outdoor = thresholds.value("design_month_outdoor_temp_default_c") if ours else outdoor
    if indoor is None or outdoor is None or indoor > outdoor:
        return None
    month = f"{'our default, ' * ours}{outdoor:g} °C"
    problem = f"the colder month is a heated month: it must be above the outdoor mean ({month})"
    return "site.design_indoor_temp_c", f"{indoor:g} °C: {problem}"


def _left_out_problems(at: str, record: RoomVisit) -> list[tuple[str, str]]:
    """A point left out names a material exactly when it is a material point, is left out
    once, and is not also read in the same record."""
    found = []
    read = {point_key(p) for p in record.surfaces} | {point_key(p) for p in record.materials}
    marked: set[tuple[str, str, str]] = set()
    for n, mark in enumerate(record.left_out):
        where = f"{at}.left_out[{n}]"
        key = point_key(mark)
        if (mark.kind == "material") != bool(mark.material.strip()):
            found.append(
                (
                    f"{where}.material",
                    "a material point left out names its material; a surface names none",
                )
            )
        elif key in read:
            found.append((where, f"{_quoted(mark.location)} is read on this visit and left out"))
        elif key in marked:
            found.append((where, f"{_quoted(mark.location)} is left out twice"))
        marked.add(key)
    return found


def problems(survey: Survey) -> list[tuple[str, str]]:
    """Checks across records, as ``(where, problem)`` pairs; empty when all is well.

    Ids must be unique; every room and instrument a reading names must exist; a room
    appears at most once per visit; a mould area needs visible mould; a volume worked out
    from floor area × height must lie in the room-volume domain; the site's design month
    must be one the colder-month projection can use (:func:`_design_month_problem`); a
    point left out is left out once, not read too (:func:`_left_out_problems`).
    """
    found: list[tuple[str, str]] = []
    design = _design_month_problem(survey.site)
    if design is not None:
        found.append(design)
    room_ids: set[str] = set()
    for i, room in enumerate(survey.rooms):
        if room.id in room_ids:
            found.append((f"rooms[{i}].id", f"room id {_quoted(room.id)} is used twice"))
        room_ids.add(room.id)
        problem = _volume_problem(room)
        if problem:
            found.append((f"rooms[{i}].height_m", problem))
    instrument_ids: set[str] = set()
    for i, instrument in enumerate(survey.instruments):
        if instrument.id in instrument_ids:
            found.append(
                (f"instruments[{i}].id", f"instrument id {_quoted(instrument.id)} is used twice")
            )
        instrument_ids.add(instrument.id)

    def instrument_ref(where: str, instrument_id: str | None) -> None:
        if instrument_id is not None and instrument_id not in instrument_ids:
            found.append(
                (
                    where,
                    (
                        f"no instrument with id {_quoted(instrument_id)}; instruments "
                        f"are: {_id_list(i.id for i in survey.instruments)}"
                    ),
                )
            )

    def room_ref(where: str, room_id: str) -> None:
        if room_id not in room_ids:
            found.append(
                (
                    where,
                    (
                        f"no room with id {_quoted(room_id)}; rooms are: "
                        f"{_id_list(r.id for r in survey.rooms)}"
                    ),
                )
            )

    for v, visit in enumerate(survey.visits):
        at = f"visits[{v}]"
        if visit.outdoor is not None:
            instrument_ref(f"{at}.outdoor.instrument", visit.outdoor.instrument)
        seen: set[str] = set()
        for r, room_visit in enumerate(visit.rooms):
            rat = f"{at}.rooms[{r}]"
            room_ref(f"{rat}.room", room_visit.room)
            if room_visit.room in seen:
                found.append(
                    (f"{rat}.room", f"room {_quoted(room_visit.room)} appears twice in this visit")
                )
            seen.add(room_visit.room)
            if room_visit.air is not None:
                instrument_ref(f"{rat}.air.instrument", room_visit.air.instrument)
            for s, surface in enumerate(room_visit.surfaces):
                instrument_ref(f"{rat}.surfaces[{s}].instrument", surface.instrument)
            for m, material in enumerate(room_visit.materials):
                instrument_ref(f"{rat}.materials[{m}].instrument", material.instrument)
            for e, equipment in enumerate(room_visit.equipment):
                if equipment.outlet is not None:
                    instrument_ref(
                        f"{rat}.equipment[{e}].outlet.instrument", equipment.outlet.instrument
                    )
            found += _left_out_problems(rat, room_visit)
            obs = room_visit.observations
            if obs.mould_area_m2 and not obs.mould_visible:
                found.append(
                    (
                        f"{rat}.observations.mould_area_m2",
                        "a mould area is given but mould_visible is false",
                    )
                )
    for g, log in enumerate(survey.logs):
        if log.room is not None:
            room_ref(f"logs[{g}].room", log.room)
        instrument_ref(f"logs[{g}].instrument", log.instrument)
    return found
