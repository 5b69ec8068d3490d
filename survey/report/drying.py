"""The report's drying progress: per room, a table of the visits with the air and each
material point, a table of the points against their dry standard and goal with the rate and
the days to the goal (or that drying has stalled), and each logger's days.

Numbers come from :func:`survey.drying.drying_progress` (which reads the visits the report
has judged already, through the shared :class:`~survey.report.rooms.Context`); sentences
from :mod:`survey.words.drying`.
"""

from __future__ import annotations

from typing import Any

from survey import drying, model
from survey import thresholds as th
from survey.report.markdown import Cell, Document, Heading, Items, Para, Table
from survey.report.rooms import Context, limits_blocks
from survey.words import drying as dw
from survey.words import report as rw


def wanted(survey: model.Survey) -> bool:
    """Whether the report has drying progress to show: several visits, or a logger."""
    return len(survey.visits) > 1 or any(log.samples for log in survey.logs)


def _visits_table(ctx: Context, room: drying.RoomDrying) -> Table:
    d, survey = ctx.d, ctx.survey
    points = room.points
    collected = any(a.water_removed_l is not None for a in room.air)
    header = (
        dw.VISITS_HEADER
        + tuple(dw.point_column(p.location, p.material, p.scale) for p in points)
        + ((dw.WATER_COLLECTED,) if collected else ())
    )
    air = {a.visit_index: a for a in room.air}
    by_visit = [{r.visit_index: r for r in p.readings} for p in points]
    left_on = [{i for i, _ in p.left_out} for p in points]
    rows = []
    for index in room.visits_seen:
        visit = survey.visits[index]
        cells = [Cell(str(index + 1)), Cell(rw.date_text(visit.started_at))]
        state = air.get(index)
        if state is None:
            cells += [Cell(dw.NOT_MEASURED)] * 4
        else:
            cells += [
                Cell(d.temperature(state.dry_bulb_c), state.dry_bulb_c, "air.dry_bulb_c"),
                Cell(rw.rh_text(state.rh_pct), state.rh_pct, "air.rh_pct"),
                Cell(
                    d("humidity_ratio", state.humidity_ratio_kg_per_kg),
                    state.humidity_ratio_kg_per_kg,
                    "air.humidity_ratio_kg_per_kg",
                ),
                Cell(
                    dw.margin_text(state.worst_margin_k, state.worst_margin_label, d),
                    state.worst_margin_k,
                    "dew_point_margin_k",
                ),
            ]
        for readings, left in zip(by_visit, left_on, strict=True):
            reading = readings.get(index)
            cells.append(
                Cell(dw.LEFT_OUT_CELL if index in left else "–")
                if reading is None
                else Cell(dw.reading_cell(reading), reading.value, "value")
            )
        if collected:
            removed = None if state is None else state.water_removed_l
            cells.append(
                Cell("–")
                if removed is None
                else Cell(d.litres(removed), removed, "water_removed_l")
            )
        rows.append(tuple(cells))
    right = frozenset(range(2, len(header)))
    return Table(header, tuple(rows), right, name="drying", room=room.room_id)


def _points_table(room: drying.RoomDrying, names: dict[str, str]) -> Table:
    rows = tuple(
        (
            Cell(dw.point_column(p.location, p.material, p.scale)),
            Cell(dw.reading_cell(p.latest), p.latest.value, "value"),
            Cell(dw.dry_standard_cell(p, names), p.dry_standard, "dry_standard"),
            Cell(dw.goal_cell(p), p.goal, "goal"),
            Cell(dw.met_cell(p)),
            Cell(
                dw.rate_cell(p),
                None if p.fit is None else p.fit.rate_per_day,
                "fit.rate_per_day",
            ),
            Cell(
                dw.outlook_cell(p),
                None if p.estimate is None else p.estimate.days,
                "estimate.days",
            ),
        )
        for p in room.points
    )
    return Table(
        dw.POINTS_HEADER,
        rows,
        frozenset({1, 3, 5, 6}),
        name="drying_points",
        room=room.room_id,
    )


def _logger_blocks(
    ctx: Context, summary: drying.LoggerSummary, room_name: str | None, level: int
) -> list[Any]:
    d = ctx.d
    rows = tuple(
        (
            Cell(dw.day_text(day.day)),
            Cell(str(day.samples), float(day.samples), "samples"),
            Cell(dw.hours_text(day.hours_logged), day.hours_logged, "hours_logged"),
            Cell(dw.temperature_range_text(day, d), day.temp_c.mean, "temp_c.mean"),
            Cell(dw.rh_range_text(day), day.rh_pct.mean, "rh_pct.mean"),
            Cell(
                dw.ratio_range_text(day, d),
                None if day.humidity_ratio_kg_per_kg is None else day.humidity_ratio_kg_per_kg.mean,
                "humidity_ratio_kg_per_kg.mean",
            ),
            Cell(
                dw.hours_text(day.hours_above_mould_rh),
                day.hours_above_mould_rh,
                "hours_above_mould_rh",
            ),
            Cell(
                dw.hours_text(day.hours_above_wet_rh), day.hours_above_wet_rh, "hours_above_wet_rh"
            ),
        )
        for day in summary.days
    )
    return [
        Heading(level, dw.logger_heading(summary, room_name)),
        Para(f"{dw.logger_gaps_text(summary)} {dw.logger_trend_text(summary, d)}"),
        Table(
            dw.logger_header(d, summary),
            rows,
            frozenset(range(1, 8)),
            name="logger_days",
            room=summary.room_id or "",
        ),
    ]


def drying_section(doc: Document, ctx: Context) -> None:
    """Drying progress: every room seen on a visit or logged, then outdoor loggers, then the
    limits these tables rest on."""
    progress = drying.drying_progress(ctx.survey, ctx.assessment)
    names = {r.id: r.name for r in ctx.survey.rooms}
    air_note = False  # the note on room-air loggers, said once
    closing: list[bool | None] = []  # flued answers of rooms told to keep the area closed
    doc.add(Heading(2, rw.HEADINGS["drying"]), Para(dw.DRYING_INTRO))
    if any(room.points for room in progress.rooms):
        doc.add(Para(dw.basis_text()))
    for room in progress.rooms:
        doc.add(
            Heading(3, rw.room_heading(room.name, room.is_reference)),
            Para(dw.room_air_sentence(room, ctx.d), name="drying_air", room=room.room_id),
        )
        if room.visits_seen:
            doc.add(_visits_table(ctx, room))
        if room.points:
            doc.add(
                Para(dw.room_goals_text(room), name="drying_goals", room=room.room_id),
                _points_table(room, names),
                Items(
                    tuple(
                        (p.location + ":", dw.point_sentence(p, names, room.flued_appliance))
                        for p in room.points
                    ),
                    name="drying_points_said",
                    room=room.room_id,
                    values=room.points,
                ),
            )
        if any(dw.says_close_up(p, room.flued_appliance) for p in room.points):
            closing.append(room.flued_appliance)
        for summary in room.loggers:
            doc.add(*_logger_blocks(ctx, summary, room.name, 4))
            if dw.is_room_air(summary) and not air_note:
                doc.add(Para(dw.AIR_RH_NOTE, name="drying_air_rh_note"))
                air_note = True
    if closing:
        flued = True if True in closing else None
        doc.add(Para(dw.combustion_caution(flued, ctx.d), name="drying_combustion_air"))
    if progress.outdoor_loggers:
        doc.add(Heading(3, dw.OUTDOORS))
        for summary in progress.outdoor_loggers:
            doc.add(*_logger_blocks(ctx, summary, None, 4))
    limits = th.cited(progress.threshold_keys)
    doc.add(*limits_blocks(limits, ctx.d, dw.LIMITS_LEAD, "drying_limits", "drying_legend"))
