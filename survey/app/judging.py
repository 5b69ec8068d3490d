"""Non-UI helpers the screens need around the core's judgement of a stored visit.

A room is judged by :func:`survey.evaluate.assess_room`, the way
:func:`survey.evaluate.assess_visit` judges the whole visit. The rest is the rank and the
symbol of a finding, and bookkeeping of the walk: which rooms still need readings, the
points measured on the previous visit, a new visit.
"""

from __future__ import annotations

import datetime as dt
from collections.abc import Hashable, Sequence

from survey import assess, evaluate, model
from survey.words import states as words_states


def room_visit(survey: model.Survey, visit_index: int, room_id: str) -> model.RoomVisit | None:
    if not survey.visits:
        return None
    return survey.visits[visit_index].room_visit(room_id)


# --- how bad a room is, as a rank ------------------------------------------------------------


def worst_rank(finding: assess.RoomFinding) -> int | None:
    """The room's worst rank over its surfaces and material readings; None where nothing in
    it was judged (no surface measured, no material reading judged): not "clear"."""
    ranks = [words_states.surface_rank(s) for s in finding.surfaces]
    ranks += [r for m in finding.materials if (r := words_states.material_rank(m)) is not None]
    return max(ranks, default=None)


#: A symbol per rank, so no state is shown by colour alone ("·" for nothing judged).
RANK_SYMBOLS = {None: "·", 0: "✓", 1: "~", 2: "!", 3: "‼"}
#: What the symbols of the tables mean (the room list and the help screen show it).
SYMBOL_LEGEND = "✓ clear  ~ near a limit  ! over a limit or unclear  ‼ condensing  ★ reference"


# --- the walk ----------------------------------------------------------------------------


def _visits_before(survey: model.Survey, visit_index: int) -> list[model.Visit]:
    """The visits begun before this one, earliest first (by start time, as the assessment
    and drying progress order them: :func:`survey.evaluate.earlier_visit_indexes`)."""
    if not survey.visits:
        return []
    return [survey.visits[i] for i in reversed(evaluate.earlier_visit_indexes(survey, visit_index))]


def previous_room_visit(
    survey: model.Survey, visit_index: int, room_id: str
) -> model.RoomVisit | None:
    """The same room on the latest visit begun before this one that it was entered on (a
    record holding only the equipment carried over is passed by, so a room not entered on
    one visit is offered the points of the one before)."""
    for visit in reversed(_visits_before(survey, visit_index)):
        found = visit.room_visit(room_id)
        if found is not None and found.entered():
            return found
    return None


Point = model.SurfaceReading | model.MaterialReading

#: What makes readings on different visits the same point (see :func:`survey.model.point_key`).
point_key = model.point_key


def _points(record: model.RoomVisit, kind: model.PointKind) -> Sequence[Point]:
    return record.surfaces if kind == "surface" else record.materials


def offered_points(
    survey: model.Survey, visit_index: int, room_id: str, kind: model.PointKind
) -> list[Point]:
    """The points of ``kind`` this visit is asked to read, each as last read: those read
    on the room's visits begun before this one (passing by records of a room not entered)
    and not left out for good since. The points read on the latest of them come first, in
    its order, then those still carried from earlier visits. A point left out for good is
    not offered again; measured anew, it carries on as the same point."""
    offered: list[Point] = []
    for visit in _visits_before(survey, visit_index):
        record = visit.room_visit(room_id)
        if record is None or not record.entered():
            continue
        read = list(_points(record, kind))
        keys = {point_key(p) for p in read}
        keys |= {point_key(x) for x in record.left_out if x.kind == kind and x.for_good}
        offered = read + [p for p in offered if point_key(p) not in keys]
    return offered


def left_point(offered: Sequence[Point], mark: model.LeftOut) -> Point:
    """The point a mark stands for, as last read (:func:`offered_points`); where no
    earlier reading of it is offered any more (it was deleted or renamed since, or the file
    came so), a blank point of the mark's location and material, to be read anew."""
    found = last_visits_point(offered, mark)
    if found is not None:
        return found
    if mark.kind == "surface":
        return model.SurfaceReading(location=mark.location, element="other", surface_temp_c=0.0)
    return model.MaterialReading(
        location=mark.location, material=mark.material, value=0.0, scale="wme_pct"
    )


def last_visits_point(offered: Sequence[Point], point: Point | model.LeftOut) -> Point | None:
    """The same point (:func:`point_key`) among the points offered to this visit
    (:func:`offered_points`): the value it had when last read."""
    key = point_key(point)
    return next((p for p in offered if point_key(p) == key), None)


def pending_points(
    survey: model.Survey, visit_index: int, room_id: str, kind: model.PointKind
) -> list[Point]:
    """Points of ``kind`` offered to this visit (:func:`offered_points`) neither read yet
    nor left out, in the order offered."""
    offered = offered_points(survey, visit_index, room_id, kind)
    if not offered:
        return []
    now = room_visit(survey, visit_index, room_id)
    done = set()
    if now is not None:
        done = {point_key(p) for p in _points(now, kind)}
        done |= {point_key(x) for x in now.left_out if x.kind == kind}
    return [p for p in offered if point_key(p) not in done]


def pending_surfaces(
    survey: model.Survey, visit_index: int, room_id: str
) -> list[model.SurfaceReading]:
    """Surfaces offered to this visit (:func:`offered_points`) neither read yet nor left
    out."""
    return pending_points(survey, visit_index, room_id, "surface")  # type: ignore[return-value]


def pending_materials(
    survey: model.Survey, visit_index: int, room_id: str
) -> list[model.MaterialReading]:
    """Material points offered to this visit neither read yet nor left out."""
    return pending_points(survey, visit_index, room_id, "material")  # type: ignore[return-value]


def without_left_out(
    record: model.RoomVisit, kind: model.PointKind, point: Point
) -> list[model.LeftOut]:
    """The record's points left out, less the one ``point`` now reads (a point read is
    no longer left out)."""
    key = point_key(point)
    return [x for x in record.left_out if not (x.kind == kind and point_key(x) == key)]


def walk_order(
    last: Sequence[Hashable],
    read: Sequence[Hashable],
    pending: Sequence[Hashable],
    left: Sequence[Hashable] = (),
):
    """The rows of a table of points as (kind, index): ``("read", n)`` for this visit's
    n-th reading, ``("pending", n)`` for the n-th point of last visit still to read,
    ``("left", n)`` for the n-th point left out this visit. The
    points of last visit keep last visit's order whether read yet or not (a point read moves
    nowhere, so the row under the cursor is the one the technician sees); this visit's new
    points follow in the order they were added. Each point is given by its key (a surface's
    location; a material point's location and material); ``pending`` is the part of ``last``
    not read yet, in its order. A key written twice last visit matches its readings in turn."""
    places: dict[Hashable, list[int]] = {}
    for n, key in enumerate(last):
        places.setdefault(key, []).append(n)
    taken: dict[Hashable, int] = {}  # how many of a key's places are taken so far
    rows = []

    def place(key: Hashable) -> int:
        free = places.get(key, [])
        count = taken.get(key, 0)
        taken[key] = count + 1
        return free[count] if count < len(free) else len(last)

    for n, key in enumerate(read):
        rows.append(((place(key), 0, n), ("read", n)))
    for n, key in enumerate(pending):
        rows.append(((place(key), 1, n), ("pending", n)))
    for n, key in enumerate(left):
        rows.append(((place(key), 2, n), ("left", n)))
    return [row for _, row in sorted(rows)]


def readings_missing(survey: model.Survey, visit_index: int, room_id: str) -> int:
    """How many readings this room still needs on this visit (air, and the points of the
    previous visit); 0 when it is done."""
    if not survey.visits:
        return 1
    record = room_visit(survey, visit_index, room_id)
    missing = 1 if record is None or record.air is None else 0
    return (
        missing
        + len(pending_surfaces(survey, visit_index, room_id))
        + len(pending_materials(survey, visit_index, room_id))
    )


def next_room_needing(survey: model.Survey, visit_index: int, after: str | None) -> str | None:
    """The next room after ``after`` (wrapping round) that still needs readings."""
    ids = [r.id for r in survey.rooms]
    if not ids:
        return None
    start = ids.index(after) + 1 if after in ids else 0
    for room_id in ids[start:] + ids[:start]:
        if room_id != after and readings_missing(survey, visit_index, room_id):
            return room_id
    return None


def new_visit(now: dt.datetime | None = None, after: model.Visit | None = None) -> model.Visit:
    """A new visit starting now. The rooms belong to the site and carry over; the surface
    locations and material points of the previous visit are offered as points to read. The
    equipment left in the rooms on visit ``after`` is carried over as it was set up (kind,
    label, running, its rating), without what it was measured at (water collected, air in
    and out, hours, energy): a drying job's units stay from one day to the next."""
    visit = model.Visit(started_at=(now or dt.datetime.now()).replace(second=0, microsecond=0))
    for record in after.rooms if after is not None else ():
        if record.equipment:
            kept = [unit.as_set_up() for unit in record.equipment]
            visit.rooms.append(model.RoomVisit(room=record.room, equipment=kept))
    return visit


def new_room_id(survey: model.Survey, name: str) -> str:
    """A short unused id made from a room name: 'bed-1', 'room-3'."""
    import re

    stem = re.sub(r"[^a-z0-9]+", "-", name.lower()).strip("-")[:20] or "room"
    taken = {r.id for r in survey.rooms}
    if stem not in taken and stem[0].isalnum():
        return stem
    n = 2
    while f"{stem}-{n}" in taken:
        n += 1
    return f"{stem}-{n}"
