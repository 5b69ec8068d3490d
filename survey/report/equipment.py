"""The report's dehumidifier block of a room: each unit's measured removal rate, energy
factor and COP beside its rating, the findings, and the caution that a rating is not a site
figure — laid out from :func:`survey.equipment.judge_record` and
:mod:`survey.words.equipment`."""

from __future__ import annotations

from collections.abc import Iterable
from typing import TYPE_CHECKING, Any

from survey import equipment as eq
from survey.report.markdown import Cell, Heading, Items, Para, Table
from survey.words import equipment as we

if TYPE_CHECKING:  # rooms imports this module
    from survey.report.rooms import Context


def _units(ctx: Context, visit_index: int, room_id: str) -> list[eq.StoredUnit]:
    room_visit = ctx.room_visits(visit_index).get(room_id)
    if room_visit is None:
        return []
    found = []
    for n in range(len(room_visit.equipment)):
        unit = eq.judge_record(ctx.survey, visit_index, room_visit, n)
        if unit is not None:
            found.append(unit)
    return found


def _row(unit: eq.StoredUnit, ctx: Context) -> tuple[Cell, ...]:
    d = ctx.d
    name = Cell(we.unit_name(unit.label))
    r = unit.result
    if r is None:
        return (name, *[Cell("–")] * (len(we.REPORT_HEADER) - 2), Cell(we.NOT_CHECKED))
    c = r.comparison
    return (
        name,
        Cell(we.rate_text(r.removal_l_per_day, d), r.removal_l_per_day, "removal_l_per_day"),
        Cell(
            we.energy_factor_text(r.energy_factor_l_per_kwh),
            r.energy_factor_l_per_kwh,
            "energy_factor_l_per_kwh",
        ),
        Cell(we.cop_text(r.cop), r.cop, "cop"),
        Cell(
            we.rated_text(r, d),
            None if c is None else c.rated_capacity_l_per_day,
            "comparison.rated_capacity_l_per_day",
        ),
        Cell(
            we.expected_text(r, d),
            None if c is None else c.expected_removal_l_per_day,
            "comparison.expected_removal_l_per_day",
        ),
        Cell(we.found_text(r)),
    )


def blocks(ctx: Context, visit_index: int, room_id: str, heading_level: int) -> list[Any]:
    """The room's dehumidifier heading, table and sentences on visit ``visit_index`` (none
    when the room has no dehumidifier)."""
    units = _units(ctx, visit_index, room_id)
    if not units:
        return []
    d = ctx.d
    visit = visit_index + 1
    out: list[Any] = [
        Heading(heading_level, we.REPORT_HEADING),
        Table(
            we.REPORT_HEADER,
            tuple(_row(u, ctx) for u in units),
            frozenset({1, 2, 3}),
            name="dehumidifiers",
            room=room_id,
            visit=visit,
        ),
    ]
    for unit in units:
        if unit.result is None:
            out.append(Para(we.missing_text(unit)))
            continue
        if len(units) > 1:
            out.append(Para("", strong=we.unit_name(unit.label) + ":"))
        out.append(
            Items(
                tuple(("", line) for line in we.unit_lines(unit.result, d)),
                name="dehumidifier",
                room=room_id,
                visit=visit,
                values=(unit.result,),
            )
        )
    out.append(Para(we.COOLING_BASIS))
    return out


def threshold_keys(ctx: Context, visits: Iterable[int]) -> set[str]:
    """The limits the dehumidifier blocks of these visits cite, for the method section."""
    keys: set[str] = set()
    for index in visits:
        for unit in eq.judge_visit(ctx.survey, index):
            if unit.result is not None:
                keys.update(unit.result.threshold_keys)
    return keys
