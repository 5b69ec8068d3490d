"""The rows of the room screen's surface and material tables, in the order of the walk.

A table lists this visit's readings, the points offered to it and not read yet ("to read"),
and the points left out, each point where it stood on the visit before
(:func:`survey.app.judging.walk_order`). Each row is brief; its line in full goes under the
table. Row keys say what a row is: ``s``/``m`` and the reading's place in this visit's
record, ``p``/``q`` and the place among the points still to read, ``x``/``y`` and the place
in the record's points left out. The words come from :mod:`survey.words`.
"""

from __future__ import annotations

from rich.text import Text

from survey import assess, model, words
from survey.app import judging, walk
from survey.app.fields import plain
from survey.words import screens
from survey.words.report_room import reading_text

#: A location's width in the tables (the whole label is in its dialog and the live panel);
#: short enough that at 80 columns the surface RH is in sight beside it.
LOCATION_CELL = 20
#: The material table's (a symbol comes first; the row's words in full are under the table).
MATERIAL_LOCATION_CELL = 18
#: The symbol of a row not judged: a point to read or left out, a reading with no air.
NOT_JUDGED = "·"
LEFT_OUT_SYMBOL = "–"

#: One row: its cells, its key, and its line in full under the table.
Row = tuple[tuple[Text, ...], str, Text]


def detail(location: str, what: str, said: str) -> Text:
    """A row in full for the line under its table: the location and the material or
    element as typed (shown as text), then what it was judged to be."""
    text = plain(f"{location} ({what}): ")
    text.append(said)
    return text


def _order(kind: model.PointKind, offered, read, pending, left) -> list[tuple[str, int]]:
    key = judging.point_key
    return judging.walk_order(
        [key(p) for p in offered],
        [key(p) for p in read],
        [key(p) for p in pending],
        [key(x) for _, x in left],
    )


def _left(record: model.RoomVisit | None, kind: model.PointKind):
    return [(n, x) for n, x in enumerate(record.left_out if record else ()) if x.kind == kind]


def surface_rows(
    survey: model.Survey,
    visit_index: int,
    room_id: str,
    judged: assess.RoomFinding | None,
    d: words.Display,
) -> list[Row]:
    record = judging.room_visit(survey, visit_index, room_id)
    offered = judging.offered_points(survey, visit_index, room_id, "surface")
    pending = judging.pending_surfaces(survey, visit_index, room_id)
    read = list(record.surfaces if record else ())
    left = _left(record, "surface")
    last_temp = {judging.point_key(s): s.surface_temp_c for s in offered}
    findings = judged.surfaces if judged else ()

    def element(s: model.SurfaceReading | None) -> str:
        return "" if s is None else words.ELEMENT_WORDS.get(s.element, s.element)

    rows: list[Row] = []
    for kind, n in _order("surface", offered, read, pending, left):
        if kind == "read":
            s = read[n]
            f = findings[n] if n < len(findings) else None
            last = last_temp.get(judging.point_key(s))
            cells = (
                Text(NOT_JUDGED if f is None else judging.RANK_SYMBOLS[words.surface_rank(f)]),
                plain(walk.cut(s.location, LOCATION_CELL)),
                Text(d.temperature(s.surface_temp_c)),
                Text("–" if f is None else screens.surface_rh_cell(f)),
                Text(screens.NO_AIR_CELL if f is None else screens.surface_state_words(f, d)),
                Text(
                    "–"
                    if f is None
                    else (
                        f"{d.difference(f.dew_point_margin_k)} ± "
                        f"{d.difference(f.margin_uncertainty_k)}"
                    )
                ),
                Text(element(s)),
                Text("" if last is None else d.temperature(last)),
            )
            said = screens.NO_AIR_DETAIL if f is None else screens.surface_detail(f, d)
            rows.append((cells, f"s{n}", detail(s.location, element(s), said)))
        elif kind == "left":
            at, mark = left[n]
            was = judging.last_visits_point(offered, mark)
            assert was is None or isinstance(was, model.SurfaceReading)
            cells = (
                Text(LEFT_OUT_SYMBOL),
                plain(walk.cut(mark.location, LOCATION_CELL)),
                Text(screens.LEFT_OUT_CELL),
                Text(""),
                plain(walk.cut(screens.left_out_brief(mark), 30)),
                Text(""),
                Text(element(was)),
                Text("" if was is None else d.temperature(was.surface_temp_c)),
            )
            said = screens.left_out_detail(mark)
            rows.append((cells, f"x{at}", detail(mark.location, element(was), said)))
        else:
            s = pending[n]
            cells = (
                Text(NOT_JUDGED),
                plain(walk.cut(s.location, LOCATION_CELL)),
                Text(screens.TO_READ_CELL),
                Text(""),
                Text(screens.READ_BEFORE_CELL),
                Text(""),
                Text(element(s)),
                Text(d.temperature(s.surface_temp_c)),
            )
            said = screens.to_read_detail(d.temperature(s.surface_temp_c))
            rows.append((cells, f"p{n}", detail(s.location, element(s), said)))
    return rows


def material_rows(
    survey: model.Survey,
    visit_index: int,
    room_id: str,
    judged: assess.RoomFinding | None,
) -> list[Row]:
    record = judging.room_visit(survey, visit_index, room_id)
    offered = judging.offered_points(survey, visit_index, room_id, "material")
    pending = judging.pending_materials(survey, visit_index, room_id)
    read = list(record.materials if record else ())
    left = _left(record, "material")
    states = iter(judged.materials if judged else ())
    judged_as = [None if m.dry_standard else next(states, None) for m in read]
    last_value = {judging.point_key(m): m.value for m in offered}

    rows: list[Row] = []
    for kind, n in _order("material", offered, read, pending, left):
        if kind == "read":
            m, f = read[n], judged_as[n]
            rank = None if f is None else words.material_rank(f)
            last = last_value.get(judging.point_key(m))
            cells = (
                Text(judging.RANK_SYMBOLS[rank]),
                plain(walk.cut(m.location, MATERIAL_LOCATION_CELL)),
                Text(f"{m.value:g} {m.scale.replace('_pct', ' %')}"),
                Text(
                    screens.DRY_STANDARD_CELL
                    if m.dry_standard
                    else "–"
                    if f is None
                    else words.material_state_brief(f)
                ),
                plain(walk.cut(m.material, 20)),
                Text("" if last is None else f"{last:g}"),
            )
            said = (
                screens.DRY_STANDARD_DETAIL
                if m.dry_standard
                else screens.NOT_JUDGED_DETAIL
                if f is None
                else words.material_state_words(f)
            )
            rows.append((cells, f"m{n}", detail(m.location, m.material, said)))
        elif kind == "left":
            at, mark = left[n]
            was = judging.last_visits_point(offered, mark)
            assert was is None or isinstance(was, model.MaterialReading)
            cells = (
                Text(LEFT_OUT_SYMBOL),
                plain(walk.cut(mark.location, MATERIAL_LOCATION_CELL)),
                Text(screens.LEFT_OUT_CELL),
                plain(walk.cut(screens.left_out_brief(mark), 24)),
                plain(walk.cut(mark.material, 20)),
                Text("" if was is None else f"{was.value:g}"),
            )
            said = screens.left_out_detail(mark)
            rows.append((cells, f"y{at}", detail(mark.location, mark.material, said)))
        else:
            m = pending[n]
            cells = (
                Text(NOT_JUDGED),
                plain(walk.cut(m.location, MATERIAL_LOCATION_CELL)),
                Text(screens.TO_READ_CELL),
                Text(screens.READ_BEFORE_CELL),
                plain(walk.cut(m.material, 20)),
                Text(f"{m.value:g}"),
            )
            said = screens.to_read_detail(reading_text(m.value, m.scale))
            rows.append((cells, f"q{n}", detail(m.location, m.material, said)))
    return rows
