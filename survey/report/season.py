"""The report's "colder month" section of a visit: every room's surfaces carried to the site's
design month (or our default, said to be our choice) by :mod:`survey.season`, laid out from
the typed projection; every sentence from :mod:`survey.words.season`."""

from __future__ import annotations

from typing import Any

from survey import evaluate, season, words
from survey import thresholds as th
from survey.report.markdown import Cell, Document, Heading, Items, Para, Table
from survey.report.rooms import Context, limits_blocks
from survey.words import season as ws


def _month(ctx: Context) -> tuple[season.DesignMonth, str | None]:
    """The site's design month, or our default with the reason the site's cannot be used."""
    month, refused = season.usable_site_month(ctx.survey.site)
    return month, None if refused is None else ws.site_month_unusable(str(refused))


def _surfaces(
    room: season.RoomProjection,
    finding: Any,
    room_id: str,
    visit: int,
    d: words.Display,
) -> list[Any]:
    rows = []
    for today, p in zip(finding.surfaces, room.surfaces, strict=True):
        m = p.lowest_month
        rows.append(
            (
                Cell(p.label),
                Cell(words.surface_rh_text(today), p.today_surface_rh_pct, "today_surface_rh_pct"),
                Cell(
                    d.temperature(p.design_surface_temp_c),
                    p.design_surface_temp_c,
                    "design_surface_temp_c",
                ),
                Cell(ws.design_rh_text(p), p.design_surface_rh_pct, "design_surface_rh_pct"),
                Cell(ws.state_text(p, room, finding, d)),
                Cell(
                    ws.lowest_month_text(p, d),
                    None if m is None else m.outdoor_temp_c,
                    "lowest_month.outdoor_temp_c",
                ),
            )
        )
    blocks: list[Any] = [
        Table(
            ws.REPORT_COLUMNS,
            tuple(rows),
            frozenset({1, 2, 3, 5}),
            name="colder_month",
            room=room_id,
            visit=visit,
        )
    ]
    said = []
    for p in room.surfaces:
        if p.projected:
            text = ws.surface_sentence(p, room, d, finding, ws.THIS_SURFACE)
            lowest = ws.lowest_month_sentence(p, room, d)
            said.append((p.label + ":", text + (" " + lowest if lowest else "")))
    if said:
        blocks.append(Items(tuple(said), name="colder_month_surfaces", room=room_id, visit=visit))
    blocks.append(
        Para(
            " ".join(ws.room_verdict_lines(room)),
            name="colder_month_verdict",
            room=room_id,
            visit=visit,
            values=room.surfaces,
        )
    )
    return blocks


def season_section(doc: Document, ctx: Context, va: evaluate.VisitAssessment) -> None:
    """The colder month from this visit's readings, room by room (a subsection of the
    visit)."""
    d = ctx.d
    month, unusable = _month(ctx)
    visit = va.visit_index + 1
    rooms = season.project_site(va.findings, month)
    doc.add(Heading(3, ws.HEADING), Para(ws.INTRO))
    if unusable:
        doc.add(Para(unusable))
    doc.add(
        Para(
            ws.design_month_text(month, d, site_refused=unusable is not None),
            name="design_month",
            visit=visit,
        )
    )
    for position, room in enumerate(rooms):
        finding = va.findings.rooms[position]
        room_id = va.room_ids[position]
        doc.add(Heading(4, room.name))
        if not room.surfaces:
            doc.add(Para(ws.NO_SURFACES))
            continue
        if room.reason is season.RoomReason.NO_OUTDOOR:
            doc.add(Para(ws.not_projected_reason(room.surfaces[0], room, finding, d) + "."))
            continue
        excess = ws.excess_text(room, d)
        if not any(p.projected for p in room.surfaces):
            if excess and room.reason is season.RoomReason.ROOM_SATURATED:
                doc.add(Para(excess))  # why: the room's own air, and what to check
            doc.add(
                Para(
                    ws.NONE_PROJECTED,
                    name="colder_month_verdict",
                    room=room_id,
                    visit=visit,
                    values=room.surfaces,
                ),
                Items(
                    ws.none_projected_items(room, finding, d),
                    name="colder_month_surfaces",
                    room=room_id,
                    visit=visit,
                ),
            )
            continue
        if excess:
            doc.add(Para(excess))
        doc.add(*_surfaces(room, finding, room_id, visit, d))
    summary = ws.site_verdict_lines(rooms)
    if summary:
        doc.add(Para("", strong=ws.SITE_VERDICT_LEAD), *(Para(line) for line in summary))
    if any(p.projected for room in rooms for p in room.surfaces):  # else no limit was used
        keys = {key for room in rooms for key in room.threshold_keys}
        doc.add(*limits_blocks(th.cited(keys), d, ws.LIMITS_LEAD, "colder_month_limits"))
