"""Points of an earlier visit left out of a later one: a plasterboard point whose board was
stripped out is gone for good; a skirting point behind boxes today is read again next time.

The survey is the basement drying example with a fourth visit added, on which the family
room's plasterboard point is left out for good and its skirting point left out for the day.
The checks are of bookkeeping (which points are offered, counted and said), not of physics,
so no outside value is needed beyond the example's own readings."""

from __future__ import annotations

import datetime as dt
from pathlib import Path

import msgspec
from markdown_it import MarkdownIt

from survey import drying, model, report, store
from survey.app import judging
from survey.words import drying as dw

BASEMENT = Path(__file__).resolve().parents[1] / "example_sites" / "basement-burst-pipe-drying.json"
BOARD = ("Party wall, 0.1 m above floor", "plasterboard")
SKIRTING = ("Skirting, party wall", "softwood skirting")
SCREED = ("Screed, centre of room", "sand-cement screed")


def _with_fourth_visit() -> model.Survey:
    """The example, and a fourth visit a day after its third: in the family room the
    screed is read (60), the plasterboard point left out for good, the skirting for the
    day; the other rooms as on the third visit."""
    survey = store.load_survey(BASEMENT)
    third = survey.visits[2]
    family = third.room_visit("family")
    assert family is not None
    screed = next(m for m in family.materials if (m.location, m.material) == SCREED)
    fourth_family = msgspec.structs.replace(
        family,
        surfaces=[],
        materials=[msgspec.structs.replace(screed, value=60.0, taken_at=None)],
        left_out=[
            model.LeftOut(
                kind="material",
                location=BOARD[0],
                material=BOARD[1],
                reason="board stripped to 600 mm",
                for_good=True,
            ),
            model.LeftOut(
                kind="material",
                location=SKIRTING[0],
                material=SKIRTING[1],
                reason="behind stacked boxes",
                for_good=False,
            ),
            model.LeftOut(kind="surface", location="Party wall, 0.3 m above floor", for_good=True),
        ],
    )
    fourth = msgspec.structs.replace(
        third,
        started_at=third.started_at + dt.timedelta(days=1),
        rooms=[fourth_family if r.room == "family" else r for r in third.rooms],
    )
    survey.visits.append(fourth)
    return survey


def _keys(points) -> list[tuple[str, str]]:
    """Each point as (location, material), "" for a surface's material."""
    return [
        (p.location, p.material if isinstance(p, model.MaterialReading) else "") for p in points
    ]


def test_a_point_left_out_is_not_to_read_and_the_room_is_done():
    """On the fourth visit nothing in the family room is still to read: the screed was
    read, and the two material points and one surface were left out."""
    survey = _with_fourth_visit()
    assert judging.pending_materials(survey, 3, "family") == []
    pending = judging.pending_surfaces(survey, 3, "family")
    assert [s.location for s in pending] == [
        "Screed, centre of room",
        "Front wall (below ground), 0.3 m above floor",
    ]
    # the air is read; the two surfaces not read nor left out are what is missing
    assert judging.readings_missing(survey, 3, "family") == 2


def test_the_next_visit_offers_a_point_left_for_the_day_and_not_one_gone_for_good():
    """A fifth visit is offered the screed (read on the fourth) and the skirting (left out
    for the day), as last read: the skirting at 16 from the third visit. The plasterboard
    point, gone for good, is not offered; nor the surface left out for good. The two
    surfaces the fourth visit neither read nor left out are still offered."""
    survey = _with_fourth_visit()
    survey.visits.append(model.Visit(started_at=survey.visits[3].started_at + dt.timedelta(1)))
    offered = judging.offered_points(survey, 4, "family", "material")
    assert _keys(offered) == [SCREED, SKIRTING]
    assert [m.value for m in offered] == [60.0, 16.0]
    surfaces = judging.offered_points(survey, 4, "family", "surface")
    assert _keys(surfaces) == [
        ("Screed, centre of room", ""),
        ("Front wall (below ground), 0.3 m above floor", ""),
    ]
    assert judging.pending_materials(survey, 4, "family") == offered


def test_reading_a_point_takes_its_mark_away():
    """A point left out and then read after all is no longer left out."""
    survey = _with_fourth_visit()
    record = survey.visits[3].room_visit("family")
    assert record is not None
    board = model.MaterialReading(location=BOARD[0], material=BOARD[1], value=30.0, scale="wme_pct")
    kept = judging.without_left_out(record, "material", board)
    assert [(x.location, x.material) for x in kept] == [
        SKIRTING,
        ("Party wall, 0.3 m above floor", ""),
    ]
    # a surface at the same location is a different point
    wall = model.SurfaceReading(location=BOARD[0], element="internal_wall", surface_temp_c=15)
    assert len(judging.without_left_out(record, "material", wall)) == 3


def test_a_point_left_out_records_nothing_else_but_the_room_was_entered():
    """A record holding only a point left out was entered: the technician was there and
    decided about the point."""
    record = model.RoomVisit(
        room="family", left_out=[model.LeftOut(kind="surface", location="Door reveal")]
    )
    assert record.entered()


def test_drying_leaves_a_point_gone_for_good_out_of_the_count_and_says_so():
    """The family room's drying on four visits: the plasterboard point, gone for good, is
    not counted among the points with a goal; its outlook cell says it was left out, and
    its sentence says it is not read again. The skirting, left for the day, is asked for
    at the next visit. The visits table shows "left out" where each was left out."""
    survey = _with_fourth_visit()
    progress = drying.drying_progress(survey)
    family = next(r for r in progress.rooms if r.room_id == "family")
    points = {(p.location, p.material): p for p in family.points}
    board, skirting = points[BOARD], points[SKIRTING]
    assert board.gone and board.left_since is not None
    assert board.left_out == ((3, board.left_since),)
    assert not skirting.gone and skirting.left_since is not None
    assert family.goals_set == sum(p.goal_met is not None for p in family.points) - 1
    assert dw.outlook_cell(board) == "left out for good"
    names = {r.id: r.name for r in survey.rooms}
    said = dw.point_sentence(board, names)
    assert "Left out for good after this reading (board stripped to 600 mm)" in said
    assert "read it again" not in said
    assert dw.point_sentence(skirting, names).endswith(
        "Not read since (behind stacked boxes): read it again at the next visit."
    )
    # before the fourth visit, nothing of this
    before = drying.drying_progress(store.load_survey(BASEMENT))
    family_before = next(r for r in before.rooms if r.room_id == "family")
    assert all(p.left_since is None and not p.left_out for p in family_before.points)
    assert family_before.goals_set == family.goals_set + 1


def _tables(text: str) -> list[list[list[str]]]:
    """Every table of the Markdown as rows of cell texts (header first)."""
    tokens = MarkdownIt("gfm-like").parse(text)
    tables, rows, row = [], [], None
    for token in tokens:
        if token.type == "table_open":
            rows = []
        elif token.type == "tr_open":
            row = []
        elif token.type == "inline" and row is not None:
            row.append(token.content)
        elif token.type == "tr_close":
            rows.append(row)
            row = None
        elif token.type == "table_close":
            tables.append(rows)
    return tables


def test_the_report_lists_the_points_left_out_with_their_reasons():
    """The scope of the fourth visit names each point left out, its room and reason, and
    whether it is gone; the family room's drying table says "left out" on that visit."""
    survey = _with_fourth_visit()
    text = report.markdown_report(
        survey, report.ReportOptions(visit="all", generated_at="2026-01-01 09:00")
    )
    assert (
        "Points measured before and not read on this visit: Basement family room, Party "
        "wall, 0.1 m above floor (plasterboard reading, gone for good: board stripped to "
        "600 mm); Basement family room, Skirting, party wall (softwood skirting reading, to "
        "read at the next visit: behind stacked boxes); Basement family room, Party wall, "
        "0.3 m above floor (surface, gone for good)."
    ) in " ".join(text.split())
    # and in the room's own section, on the visit it was left out
    assert (
        "#### Not read on this visit Measured on an earlier visit: Party wall, 0.1 m above "
        "floor (plasterboard reading, gone for good: board stripped to 600 mm);"
    ) in " ".join(text.split())
    drying_tables = [t for t in _tables(text) if t[0][:2] == list(dw.VISITS_HEADER[:2])]
    family = drying_tables[0]
    board_column = next(
        n for n, h in enumerate(family[0]) if h.startswith("Party wall, 0.1 m above floor")
    )
    assert family[4][0] == "4" and family[4][board_column] == dw.LEFT_OUT_CELL


def test_the_points_offered_follow_the_visits_in_time_not_in_the_file():
    """With the fourth visit written first in the file (it still began a day after the
    third), a fifth visit is offered the same points, as drying progress orders them."""
    survey = _with_fourth_visit()
    survey.visits.insert(0, survey.visits.pop())
    fifth = model.Visit(started_at=survey.visits[0].started_at + dt.timedelta(days=1))
    survey.visits.append(fifth)
    assert _keys(judging.offered_points(survey, 4, "family", "material")) == [SCREED, SKIRTING]
    # and the visit written first, which began last, is offered the third visit's points
    assert len(judging.offered_points(survey, 0, "family", "material")) == 3


def test_a_mark_matches_its_point_as_drying_does_case_and_spaces_aside():
    """A reading typed as "skirting,  party wall " reads the point left out as "Skirting,
    party wall": the mark goes, as drying progress takes them for one point."""
    survey = _with_fourth_visit()
    record = survey.visits[3].room_visit("family")
    typed = model.MaterialReading(
        location="skirting,  party wall ", material="Softwood Skirting", value=15, scale="wme_pct"
    )
    assert SKIRTING not in [
        (x.location, x.material) for x in judging.without_left_out(record, "material", typed)
    ]


def test_a_mark_whose_earlier_reading_is_gone_gives_a_blank_point_to_read():
    """A mark whose point no earlier visit holds (its reading deleted since, or a file
    written so) stands for a blank point of its location and material."""
    mark = model.LeftOut(kind="material", location="Hearth", material="brick")
    point = judging.left_point([], mark)
    assert isinstance(point, model.MaterialReading)
    assert (point.location, point.material) == ("Hearth", "brick")
    wall = judging.left_point([], model.LeftOut(kind="surface", location="Gable"))
    assert isinstance(wall, model.SurfaceReading) and wall.location == "Gable"


def test_a_file_with_a_point_both_read_and_left_out_is_refused_by_name():
    """A record may not read a point and leave it out, nor leave it out twice, and a
    material point left out names its material."""
    survey = _with_fourth_visit()
    record = survey.visits[3].room_visit("family")
    assert model.problems(survey) == []
    record.left_out.append(model.LeftOut(kind="material", location=SCREED[0], material=SCREED[1]))
    record.left_out.append(model.LeftOut(kind="material", location=BOARD[0], material=BOARD[1]))
    record.left_out.append(model.LeftOut(kind="material", location="Hearth"))
    found = dict(model.problems(survey))
    base = "visits[3].rooms[0].left_out"
    assert "is read on this visit and left out" in found[f"{base}[3]"]
    assert "is left out twice" in found[f"{base}[4]"]
    assert "names its material" in found[f"{base}[5].material"]


def test_a_point_gone_for_good_gets_no_days_to_a_goal():
    """The plasterboard point, gone for good after reading 46 against its goal of 24.2:
    no estimate of days, no trend sentence; the room's count says one more is gone."""
    survey = _with_fourth_visit()
    family = next(r for r in drying.drying_progress(survey).rooms if r.room_id == "family")
    board = next(p for p in family.points if (p.location, p.material) == BOARD)
    assert board.estimate is None
    said = dw.point_sentence(board, {r.id: r.name for r in survey.rooms})
    assert said.startswith("Last read at 46 (meter's relative scale) against a goal of 24.2")
    assert "Drying:" not in said and "hours away" not in said
    assert dw.met_cell(board) == dw.LEFT_OUT_CELL
    assert dw.room_goals_text(family).endswith("(1 more left out for good).")


def test_a_reading_typed_far_from_its_visit_gets_no_time_and_counts_at_the_start():
    """A reading saved with the clock 665 days after the visit began (written up long
    after, or a start mistyped) gets no time, so drying progress counts it at the visit's
    start, and the warning says so; within LATE_READING_H of the start it takes the
    clock's time; a clock before the start by more than that gets none either."""
    from survey.app import walk

    start = dt.datetime(2025, 2, 6, 9, 30)
    visit = model.Visit(started_at=start)
    reading = model.AirReading(dry_bulb_c=20.0, rh_pct=50.0)
    late, said = walk.stamped(reading, start + dt.timedelta(days=665), visit)
    assert late.taken_at is None
    assert said.startswith("no time kept: the clock is 665 days after this visit")
    near, said = walk.stamped(reading, start + dt.timedelta(hours=1), visit)
    assert near.taken_at == start + dt.timedelta(hours=1) and said == ""
    early, said = walk.stamped(reading, start - dt.timedelta(days=2), visit)
    assert early.taken_at is None and "before this visit begins" in said
