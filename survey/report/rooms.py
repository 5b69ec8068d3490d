"""The report's room sections, laid out from a judged visit (drying progress across visits is
:mod:`survey.report.drying`'s).

Numbers come from the typed findings of :func:`survey.evaluate.assess_visit` and are written
by :mod:`survey.words`; every table cell that shows a number keeps the SI value it shows and
the name of the finding's field it came from (:class:`~survey.report.markdown.Cell`).
"""

from __future__ import annotations

from dataclasses import dataclass, field
from pathlib import Path
from typing import Any
from urllib.parse import quote

from survey import evaluate, model, words
from survey import thresholds as th
from survey.advise import RoomAdvice
from survey.assess import CondensationState, FactorState, MouldState, RoomFinding
from survey.report import equipment as equipment_report
from survey.report.markdown import Cell, Document, Heading, Items, Para, Photo, Table
from survey.words import report as rw

_UNCLEAR_C = CondensationState.CANNOT_TELL
_UNCLEAR_M = MouldState.CANNOT_TELL
_UNCLEAR_F = FactorState.CANNOT_TELL


@dataclass
class Context:
    """What every section needs: the survey, the units, where photos and the report are."""

    survey: model.Survey
    d: words.Display
    survey_dir: Path
    report_dir: Path
    visit_count: int
    assessments: dict[int, evaluate.VisitAssessment] = field(default_factory=dict)
    rooms: dict[str, model.Room] = field(default_factory=dict)  #: by id
    _room_visits: dict[int, dict[str, model.RoomVisit]] = field(default_factory=dict)
    _positions: dict[int, dict[str, int]] = field(default_factory=dict)

    def __post_init__(self) -> None:
        self.rooms = {room.id: room for room in self.survey.rooms}

    def assessment(self, index: int) -> evaluate.VisitAssessment:
        if index not in self.assessments:
            self.assessments[index] = evaluate.assess_visit(self.survey, index)
        return self.assessments[index]

    def room_visits(self, index: int) -> dict[str, model.RoomVisit]:
        """The rooms seen on visit ``index``, by room id."""
        if index not in self._room_visits:
            self._room_visits[index] = {rv.room: rv for rv in self.survey.visits[index].rooms}
        return self._room_visits[index]

    def position(self, index: int, room_id: str) -> int | None:
        """Where the room's finding is in visit ``index``'s assessment (None: not judged)."""
        if index not in self._positions:
            self._positions[index] = {r: i for i, r in enumerate(self.assessment(index).room_ids)}
        return self._positions[index].get(room_id)

    def room_name(self, room_id: str) -> str:
        room = self.rooms.get(room_id)
        return room.name if room is not None else room_id


def _readings(ctx: Context, f: RoomFinding, room_id: str, visit: int) -> Table:
    d = ctx.d
    label = rw.READING_LABELS
    point = f.air.condensation_point_c
    rows = [
        (
            label["air_temp"],
            Cell(d.temperature(f.air.dry_bulb_c), f.air.dry_bulb_c, "air.dry_bulb_c"),
        ),
        (label["rh"], Cell(rw.rh_text(f.air.rh_pct), f.air.rh_pct, "air.rh_pct")),
        (
            label[rw.point_label(point)],
            Cell(
                rw.with_band(
                    d.temperature(point), d.difference(f.condensation_point_uncertainty_k)
                ),
                point,
                "air.condensation_point_c",
            ),
        ),
        (
            label["humidity_ratio"],
            Cell(
                d("humidity_ratio", f.air.humidity_ratio_kg_per_kg),
                f.air.humidity_ratio_kg_per_kg,
                "air.humidity_ratio_kg_per_kg",
            ),
        ),
    ]
    if f.vapour_pressure_excess_pa is not None:
        rows.append(
            (
                label["excess"],
                Cell(
                    rw.excess_text(
                        f.vapour_pressure_excess_pa,
                        f.vapour_pressure_excess_uncertainty_pa or 0.0,
                        d,
                    ),
                    f.vapour_pressure_excess_pa,
                    "vapour_pressure_excess_pa",
                ),
            )
        )
    rows.append((label["class"], Cell(rw.class_text(f))))
    limit = words.rh_limit_text(f)
    if limit is not None and f.coldest is not None:
        rows.append(
            (
                label["max_rh"],
                Cell(
                    rw.max_rh_text(limit, f.coldest.label, d.temperature(f.coldest.surface_temp_c)),
                    f.max_room_rh_pct,
                    "max_room_rh_pct",
                ),
            )
        )
    apart = f.coldest_glazing_or_pipe
    if apart is not None and f.max_room_rh_pct_dry_glazing_or_pipe is not None:
        rows.append(
            (
                label["apart"],
                Cell(
                    rw.apart_text(apart.label, f.max_room_rh_pct_dry_glazing_or_pipe),
                    f.max_room_rh_pct_dry_glazing_or_pipe,
                    "max_room_rh_pct_dry_glazing_or_pipe",
                ),
            )
        )
    rows.append(
        (label["emc"], Cell(rw.emc_text(f.timber_emc_pct), f.timber_emc_pct, "timber_emc_pct"))
    )
    a = f.accuracy
    rows.append(
        (
            label["accuracy"],
            Cell(rw.accuracy_used_text(a.air_temp_k, a.rh_pct, a.surface_temp_k, d)),
        )
    )
    return Table(
        rw.READINGS_HEADER,
        tuple((Cell(name), cell) for name, cell in rows),
        name="readings",
        room=room_id,
        visit=visit,
    )


def _surfaces(
    ctx: Context, f: RoomFinding, room_visit: model.RoomVisit, room_id: str, visit: int
) -> list[Any]:
    d = ctx.d
    if not f.surfaces:
        return [Para(rw.NO_SURFACES)]
    readings, judged = [], []
    for s, reading in zip(f.surfaces, room_visit.surfaces, strict=False):
        readings.append(
            (
                Cell(s.label),
                Cell(words.ELEMENT_WORDS[s.element]),
                Cell(reading.material),
                Cell(d.temperature(s.surface_temp_c), s.surface_temp_c, "surface_temp_c"),
                Cell(words.surface_rh_text(s), s.surface_rh_pct, "surface_rh_pct"),
                Cell(rw.margin_cell(s, d), s.dew_point_margin_k, "dew_point_margin_k"),
                Cell(rw.factor_cell(s), s.temperature_factor, "temperature_factor"),
            )
        )
        judged.append(
            (
                Cell(s.label),
                Cell(words.condensation_text(s)),
                Cell(words.mould_text(s)),
                Cell(words.factor_text(s, f, d)),
            )
        )
    blocks: list[Any] = [
        Table(
            rw.SURFACE_HEADER,
            tuple(readings),
            frozenset({3, 4, 5, 6}),
            name="surfaces",
            room=room_id,
            visit=visit,
        ),
        Table(rw.JUDGED_HEADER, tuple(judged), name="surfaces_judged", room=room_id, visit=visit),
    ]
    if any(
        s.condensation is _UNCLEAR_C
        or s.mould is _UNCLEAR_M
        or s.temperature_factor_state is _UNCLEAR_F
        for s in f.surfaces
    ):
        blocks.append(Para(words.CANNOT_TELL_EXPLAINED))
    for reading in room_visit.surfaces:
        if reading.notes.strip():
            blocks.append(Para(reading.notes, strong=reading.location + ":", note=True))
    return blocks


def _materials(f: RoomFinding, room_visit: model.RoomVisit, room_id: str, visit: int) -> list[Any]:
    standards = [
        rw.dry_standard_reading(m.location, m.material, m.value, m.scale)
        for m in room_visit.materials
        if m.dry_standard
    ]
    notes = [
        Para(m.notes, strong=m.location + ":", note=True)
        for m in room_visit.materials
        if m.notes.strip()
    ]
    if not f.materials:
        return [Para(rw.dry_standards_text(standards)), *notes] if standards else notes
    rows = tuple(
        (
            Cell(m.label),
            Cell(m.material),
            Cell(rw.reading_text(m.value, m.scale), m.value, "value"),
            Cell(rw.dry_standard_text(m), m.dry_standard, "dry_standard"),
            Cell(rw.against_text(m)),
            Cell(rw.timber_text(m), m.emc_pct, "emc_pct"),
        )
        for m in f.materials
    )
    blocks: list[Any] = [
        Table(
            rw.MATERIAL_HEADER, rows, frozenset({2, 3}), name="materials", room=room_id, visit=visit
        )
    ]
    if standards:
        blocks.append(Para(rw.dry_standards_text(standards)))
    return [*blocks, Para(rw.DRY_STANDARD_BASIS), *notes]


def _seen(ctx: Context, room: model.Room | None, room_visit: model.RoomVisit) -> list[Any]:
    obs = room_visit.observations
    mould = obs.mould_visible or any(s.mould_visible for s in room_visit.surfaces)
    condensation = obs.condensation_seen or any(s.condensation_seen for s in room_visit.surfaces)
    lines = rw.seen_lines(
        mould,
        obs.mould_area_m2,
        obs.staining,
        condensation,
        obs.odour,
        obs.water_category,
        room_visit.heating_on,
        room_visit.windows_open,
        ctx.d,
    )
    blocks: list[Any] = []
    if lines:
        blocks.append(Para(" ".join(lines)))
    equipment = [
        (
            "",
            rw.equipment_text(
                e.kind,
                e.label,
                e.running,
                e.capacity_l_per_day,
                e.water_removed_l,
                ctx.d,
                e.run_hours,
            ),
        )
        for e in room_visit.equipment
    ]
    if equipment:
        blocks.append(Items(tuple(equipment)))
    for e in room_visit.equipment:
        if e.notes.strip():
            blocks.append(
                Para(e.notes, strong=(e.label or rw.EQUIPMENT_WORDS[e.kind]) + ":", note=True)
            )
    for key, text in (
        ("room", room.notes if room is not None else ""),
        ("visit", room_visit.notes),
        ("seen", obs.notes),
    ):
        if text.strip():
            blocks.append(Para(text, strong=rw.NOTES_LABELS[key] + ":", note=True))
    return blocks or [Para(rw.NOTHING_SEEN)]


def limits_blocks(
    limits: list[th.Threshold], d: words.Display, lead: str, name: str, legend_name: str = ""
) -> list[Any]:
    """The limits a section rests on, for a client: ``lead``, each limit's citation (the
    ``name``d list carries the typed records) and the legend of their marks."""
    if not limits:
        return []
    blocks: list[Any] = [
        Para(lead),
        Items(
            tuple(("", words.client_citation(t, d)) for t in limits),
            name=name,
            values=tuple(limits),
        ),
    ]
    legend = words.legend(limits)
    if legend:
        blocks.append(Items(tuple(("", line) for line in legend), name=legend_name))
    return blocks


def photo_blocks(ctx: Context, owner: str, names: list[str]) -> list[Any]:
    """Each photo as an image linked by relative path, or a line saying it is missing."""
    blocks: list[Any] = []
    for name in names:
        relative = name.replace("\\", "/")
        path = ctx.survey_dir / relative
        if not path.is_file():
            blocks.append(Para(rw.photo_missing(name)))
            continue
        try:
            link = Path(_relpath(path, ctx.report_dir)).as_posix()
        except ValueError:  # another drive
            link = path.resolve().as_posix()
        blocks.append(Photo(rw.photo_caption(owner, name), quote(link, safe="/")))
    return blocks


def _relpath(path: Path, start: Path) -> str:
    import os

    return os.path.relpath(path.resolve(), start.resolve())


def _actions(
    ctx: Context, f: RoomFinding, advice: RoomAdvice, room_id: str, visit: int
) -> list[Any]:
    if not advice.actions:
        return [Para(rw.NO_ACTIONS)]
    items = tuple(
        (rw.lead_in(words.action_title(a)), words.action_reason(a, f, advice, ctx.d))
        for a in advice.actions
    )
    return [
        Items(
            items, numbered=True, name="actions", room=room_id, visit=visit, values=advice.actions
        )
    ]


def room_section(
    doc: Document, ctx: Context, va: evaluate.VisitAssessment, position: int, heading_level: int
) -> None:
    """One room of one visit: facts, readings, surfaces, materials, seen, photos, actions."""
    f = va.findings.rooms[position]
    advice = va.advice.rooms[position]
    room_id = va.room_ids[position]
    visit = va.visit_index + 1
    room_visit = ctx.room_visits(va.visit_index)[room_id]
    room = ctx.rooms.get(room_id)
    d = ctx.d
    sub = heading_level + 1
    doc.add(Heading(heading_level, rw.room_heading(f.name, bool(room and room.is_reference))))
    if room is not None:
        doc.add(
            Para(rw.room_facts(room.use, room.level, room.volume_estimate_m3(), room.occupants, d))
        )
    doc.add(Heading(sub, rw.HEADINGS["readings"]), _readings(ctx, f, room_id, visit))
    doc.add(Heading(sub, rw.HEADINGS["surfaces"]), *_surfaces(ctx, f, room_visit, room_id, visit))
    if room_visit.materials:
        doc.add(Heading(sub, rw.HEADINGS["materials"]), *_materials(f, room_visit, room_id, visit))
    if room_visit.left_out:
        doc.add(
            Heading(sub, rw.HEADINGS["left_out"]),
            Para(rw.room_points_left_out_text(room_visit.left_out)),
        )
    doc.add(Heading(sub, rw.HEADINGS["seen"]), *_seen(ctx, room, room_visit))
    doc.add(*equipment_report.blocks(ctx, va.visit_index, room_id, sub))
    if room_visit.photos:
        doc.add(
            Heading(sub, rw.HEADINGS["photos"]), *photo_blocks(ctx, f.name, list(room_visit.photos))
        )
    doc.add(Heading(sub, rw.HEADINGS["actions"]), *_actions(ctx, f, advice, room_id, visit))
    cautions = [rw.CAUTION_NAMES[c.key] for c in advice.cautions if c.key != "closing"]
    if cautions:
        doc.add(
            Para(
                rw.room_cautions_text(cautions),
                name="room_cautions",
                room=room_id,
                visit=visit,
                values=tuple(c for c in advice.cautions if c.key != "closing"),
            )
        )
