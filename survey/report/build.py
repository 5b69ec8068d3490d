"""The site report assembled: title block, summary, scope, each visit's conditions and rooms,
drying progress, safety, method and glossary — as :mod:`survey.report.markdown` blocks.

Stored visits are judged by :func:`survey.evaluate.assess_visit`; every sentence comes from
:mod:`survey.words` (the report's own from :mod:`survey.words.report`). Nothing here
computes physics or builds a sentence; it chooses what to show and in which order.
"""

from __future__ import annotations

import datetime as dt
from dataclasses import dataclass
from pathlib import Path
from typing import Any

from survey import evaluate, model, words
from survey import thresholds as th
from survey.advise import Caution
from survey.assess import CondensationState, DryStandardState, FactorState, MouldState
from survey.errors import InputError
from survey.report import drying as report_drying
from survey.report import equipment as equipment_report
from survey.report.markdown import Cell, Document, Heading, Items, Para, Photo, Table
from survey.report.mould import mould_section
from survey.report.rooms import Context, limits_blocks, photo_blocks, room_section
from survey.report.season import season_section
from survey.words import report as rw

#: How far back an outdoor logger's samples count as "the days before" a visit.
DAYS_BEFORE = dt.timedelta(hours=72)
#: At most this many surfaces of one room in the summary.
SURFACES_IN_SUMMARY = 2


@dataclass(frozen=True, slots=True)
class ReportOptions:
    """What to report and how.

    ``visit`` is a visit number (1 is the first), ``"last"`` (the default) or ``"all"``;
    ``units`` is ``"si"``, ``"ip"`` or ``None`` for the survey's own; ``generated_at`` is
    printed as given (the command passes the time now; tests fix it); photos are looked for
    in ``survey_dir`` and linked relative to ``report_dir``."""

    visit: int | str = "last"
    units: str | None = None
    generated_at: str = ""
    source_name: str = "survey.json"
    survey_dir: Path = Path(".")
    report_dir: Path = Path(".")
    #: The stem of the chart files beside the report ("" for no charts): ``flat-report``
    #: links ``flat-report-chart-1.svg`` for visit 1 (see :func:`chart_name`).
    chart_stem: str = ""


#: The heading over a visit's psychrometric chart.
CHART_HEADING = "Psychrometric chart"


@dataclass(frozen=True, slots=True)
class ChartFile:
    """A chart the report links: its file name beside the report, its alt text, its SVG."""

    name: str
    alt: str
    svg: str


def chart_name(stem: str, visit_number: int) -> str:
    """The file name of a visit's chart beside the report: ``STEM-chart-N.svg``."""
    return f"{stem}-chart-{visit_number}.svg"


def selected_visits(survey: model.Survey, visit: int | str) -> list[int]:
    """The visit indexes a report covers; ``InputError`` for a number that is not a visit."""
    count = len(survey.visits)
    if visit == "all":
        return list(range(count))
    if visit == "last":
        return [count - 1] if count else []
    if isinstance(visit, bool) or not isinstance(visit, int) or not 1 <= visit <= count:
        allowed = (
            f"a visit number from 1 to {count}, or all" if count else "the survey has no visits yet"
        )
        raise InputError("visit", visit, allowed)
    return [visit - 1]


def build(
    survey: model.Survey,
    options: ReportOptions | None = None,
    assessments: dict[int, evaluate.VisitAssessment] | None = None,
) -> Document:
    """The report of ``survey`` as a :class:`~survey.report.markdown.Document`.

    ``assessments`` may hold visits already judged (by visit index), e.g. by a face that
    shows them too; the others are judged here by :func:`survey.evaluate.assess_visit`."""
    return build_with_charts(survey, options, assessments)[0]


def build_with_charts(
    survey: model.Survey,
    options: ReportOptions | None = None,
    assessments: dict[int, evaluate.VisitAssessment] | None = None,
) -> tuple[Document, tuple[ChartFile, ...]]:
    """The report, and the chart files it links (none unless ``options.chart_stem``): one
    psychrometric chart per visit shown, placed after that visit's conditions."""
    options = options or ReportOptions()
    charts: list[ChartFile] = []
    d = words.Display(options.units or survey.site.unit_system)
    shown = selected_visits(survey, options.visit)
    ctx = Context(
        survey,
        d,
        options.survey_dir,
        options.report_dir,
        len(survey.visits),
        dict(assessments or {}),
    )
    doc = Document(rw.title(survey.site.reference))
    doc.add(
        Heading(1, doc.title), Para(rw.generated_line(options.generated_at, options.source_name))
    )
    _title_block(doc, ctx, shown)
    _summary(doc, ctx, shown)
    _scope(doc, ctx, shown)
    for index in shown:
        _visit(doc, ctx, index, options.chart_stem, charts)
    if report_drying.wanted(survey):
        report_drying.drying_section(doc, ctx)
    mould_section(doc, ctx, options.chart_stem, charts)
    _safety(doc, ctx, shown)
    _method(doc, ctx, shown)
    doc.add(
        Heading(2, rw.HEADINGS["glossary"]),
        Items(tuple((term + ":", text) for term, text in rw.glossary(d))),
    )
    return doc, tuple(charts)


def _title_block(doc: Document, ctx: Context, shown: list[int]) -> None:
    site = ctx.survey.site
    labels = rw.TITLE_LABELS
    inspectors = [site.inspector] + [ctx.survey.visits[i].inspector for i in shown]
    items = [
        (labels["reference"], site.reference),
        (labels["address"], site.address),
        (labels["client"], site.client),
        (labels["purpose"], rw.PURPOSE_WORDS[site.purpose]),
        (
            labels["visits"],
            rw.visits_text([v.started_at for v in ctx.survey.visits], [i + 1 for i in shown]),
        ),
        (labels["inspector"], rw.names_list(dict.fromkeys(n for n in inspectors if n.strip()))),
        (labels["construction"], site.construction),
        (labels["year_built"], "" if site.year_built is None else str(site.year_built)),
        (labels["units"], rw.units_text(ctx.d)),
    ]
    doc.add(
        Items(
            tuple((f"{label}:", value) for label, value in items if value.strip()),
            name="title_block",
        )
    )


# --- summary ---------------------------------------------------------------------------------


def _concern(surface: Any) -> int:
    """How much a surface matters for the summary: water or frost forming (or possibly),
    mould limit passed (or possibly), the temperature factor under its limit; 0 for a
    surface only near a limit."""
    rank = 0
    condensation, mould = surface.condensation, surface.mould
    if condensation is CondensationState.CONDENSING:
        rank += 3
    elif (
        condensation is CondensationState.CANNOT_TELL
        and CondensationState.CONDENSING in surface.condensation_possible
    ):
        rank += 2
    if mould is MouldState.ABOVE:
        rank += 3
    elif mould is MouldState.CANNOT_TELL and MouldState.ABOVE in surface.mould_possible:
        rank += 2
    if surface.temperature_factor_state is FactorState.UNDER:
        rank += 2
    return rank


def _summary(doc: Document, ctx: Context, shown: list[int]) -> None:
    """Per room, the worst findings in plain words; then each room's first actions with
    their numbers."""
    doc.add(Heading(2, rw.HEADINGS["summary"]))
    if not shown:
        doc.add(Para(rw.NO_VISITS))
        return
    va = ctx.assessment(shown[-1])
    d = ctx.d
    if len(ctx.survey.visits) > 1:
        visit = ctx.survey.visits[shown[-1]]
        doc.add(
            Para(
                rw.summary_as_of(
                    rw.visit_heading(
                        shown[-1] + 1, len(ctx.survey.visits), visit.label, visit.started_at
                    )
                )
            )
        )
    found: list[tuple[str, str]] = []
    for f in va.findings.rooms:
        worst = sorted(
            (s for s in f.surfaces if _concern(s)), key=lambda s: (-_concern(s), s.surface_temp_c)
        )
        lines = [
            rw.surface_summary(s, words.short_verdict(s, d), d) for s in worst[:SURFACES_IN_SUMMARY]
        ]
        if len(worst) > SURFACES_IN_SUMMARY:
            lines.append(rw.more_surfaces_summary(len(worst) - SURFACES_IN_SUMMARY))
        obs = f.room.observations
        if obs.mould_seen:
            lines.insert(0, rw.mould_seen_summary(obs.visible_mould_area_m2, d))
        wet = sum(m.dry_standard_state is DryStandardState.ABOVE for m in f.materials)
        if wet:
            lines.append(rw.wet_materials_summary(wet))
        limit = words.rh_limit_text(f)
        if limit is not None and f.max_room_rh_pct is not None and f.air.rh_pct > f.max_room_rh_pct:
            lines.append(rw.rh_summary(f, limit))
        if lines:
            found.append((rw.lead_in(f.name), " ".join(lines)))
    doc.add(Heading(3, rw.SUMMARY_FINDINGS))
    doc.add(Items(tuple(found), name="summary_findings") if found else Para(rw.SUMMARY_NO_FINDINGS))
    todo: list[tuple[str, str]] = []
    said = []
    for f, advice in zip(va.findings.rooms, va.advice.rooms, strict=False):
        if not advice.actions:
            continue
        first = [advice.actions[0]]
        numbered = next((a for a in advice.actions if words.action_numbers(a, d)), None)
        if numbered is not None and numbered is not first[0]:
            first.append(numbered)
        said += first
        todo.append(
            (
                rw.lead_in(f.name),
                rw.action_summary(
                    [(words.action_title(a), words.action_numbers(a, d)) for a in first]
                ),
            )
        )
    doc.add(Heading(3, rw.SUMMARY_ACTIONS))
    if not todo:
        doc.add(Para(rw.SUMMARY_NO_ACTIONS))
        return
    doc.add(Items(tuple(todo), name="summary_actions", values=tuple(said)), Para(rw.SUMMARY_MORE))


# --- scope and instruments -------------------------------------------------------------------


def _scope(doc: Document, ctx: Context, shown: list[int]) -> None:
    survey = ctx.survey
    doc.add(Heading(2, rw.HEADINGS["scope"]))
    for index in shown:
        visit = survey.visits[index]
        va = ctx.assessment(index)
        measured = [ctx.room_name(r) for r in va.room_ids]
        visited = {room: rv for room, rv in ctx.room_visits(index).items() if rv.entered()}
        unmeasured = [
            ctx.room_name(rv.room)
            for rv in visit.rooms
            if rv.room in visited and ctx.position(index, rv.room) is None
        ]
        lines = [rw.rooms_entered_text(measured)]
        if unmeasured:
            lines.append(rw.rooms_not_measured_text(unmeasured))
        lines.append(
            rw.rooms_not_entered_text([r.name for r in survey.rooms if r.id not in visited])
        )
        left = [(ctx.room_name(rv.room), x) for rv in visited.values() for x in rv.left_out]
        if left:
            lines.append(rw.points_left_out_text(left))
        lead = (
            (rw.visit_heading(index + 1, len(survey.visits), visit.label, visit.started_at) + ":")
            if len(shown) > 1
            else ""
        )
        doc.add(Para(" ".join(lines), strong=lead))
    doc.add(Para(rw.NOT_COVERED), Para(rw.SPOT_READINGS))
    if survey.site.notes.strip():
        doc.add(Para(survey.site.notes, strong=rw.NOTES_LABELS["site"] + ":", note=True))
    doc.add(Heading(3, rw.HEADINGS["instruments"]))
    if not survey.instruments:
        doc.add(Para(rw.NO_INSTRUMENTS))
        return
    rows = tuple(
        (
            Cell(i.name),
            Cell(rw.INSTRUMENT_KIND_WORDS[i.kind]),
            Cell(i.serial),
            Cell(
                rw.instrument_accuracy_text(
                    i.air_temp_accuracy_k,
                    i.rh_accuracy_pct,
                    i.surface_temp_accuracy_k,
                    i.moisture_accuracy,
                    ctx.d,
                )
            ),
            Cell(rw.calibration_text(i.calibrated_on)),
        )
        for i in survey.instruments
    )
    doc.add(Table(rw.INSTRUMENT_HEADER, rows, name="instruments"))


# --- a visit ---------------------------------------------------------------------------------


def _pressure_basis(survey: model.Survey, visit: model.Visit) -> str:
    if visit.pressure_pa is not None:
        return "visit"
    if survey.site.pressure_pa is not None:
        return "site"
    return "altitude" if survey.site.altitude_m is not None else "sea_level"


def _logger_before(ctx: Context, visit: model.Visit) -> list[str]:
    lines = []
    for log in ctx.survey.logs:
        if log.room is not None:
            continue
        try:
            samples = [
                s for s in log.samples if visit.started_at - DAYS_BEFORE <= s.at <= visit.started_at
            ]
        except TypeError:  # naive and aware times mixed
            continue
        if samples:
            temps = [s.dry_bulb_c for s in samples]
            rhs = [s.rh_pct for s in samples]
            lines.append(
                rw.logger_before_text(
                    log.source,
                    len(samples),
                    samples[0].at,
                    samples[-1].at,
                    min(temps),
                    max(temps),
                    min(rhs),
                    max(rhs),
                    ctx.d,
                )
            )
    return lines


def _air_row(name: str, state: Any, d: words.Display) -> tuple[Cell, ...]:
    point = state.condensation_point_c
    return (
        Cell(name),
        Cell(d.temperature(state.dry_bulb_c), state.dry_bulb_c, "dry_bulb_c"),
        Cell(rw.rh_text(state.rh_pct), state.rh_pct, "rh_pct"),
        Cell(d.temperature(point), point, "condensation_point_c"),
        Cell(
            d("humidity_ratio", state.humidity_ratio_kg_per_kg),
            state.humidity_ratio_kg_per_kg,
            "humidity_ratio_kg_per_kg",
        ),
        Cell(
            d("vapour_pressure", state.vapour_pressure_pa),
            state.vapour_pressure_pa,
            "vapour_pressure_pa",
        ),
    )


def _chart(doc: Document, ctx: Context, index: int, stem: str, charts: list[ChartFile]) -> None:
    """The visit's psychrometric chart: an SVG file beside the report, linked as an image."""
    from urllib.parse import quote

    from survey import chart
    from survey.report import svg

    survey = ctx.survey
    visit = survey.visits[index]
    va = ctx.assessment(index)
    if not va.findings.rooms and va.findings.outdoor is None:
        return
    data = chart.psychro_chart(va, ctx.d.system)
    title = rw.visit_heading(index + 1, len(survey.visits), visit.label, visit.started_at)
    name = chart_name(stem, index + 1)
    alt = svg.psychro_alt(data, title)
    charts.append(ChartFile(name, alt, svg.psychro_svg(data, title)))
    doc.add(Heading(3, CHART_HEADING), Photo(alt, quote(name)))


def _visit(
    doc: Document,
    ctx: Context,
    index: int,
    chart_stem: str = "",
    charts: list[ChartFile] | None = None,
) -> None:
    survey, d = ctx.survey, ctx.d
    visit = survey.visits[index]
    va = ctx.assessment(index)
    doc.add(
        Heading(2, rw.visit_heading(index + 1, len(survey.visits), visit.label, visit.started_at))
    )
    doc.add(Heading(3, rw.HEADINGS["conditions"]))
    lines = [
        rw.weather_text(visit.weather),
        rw.pressure_text(va.findings.pressure_pa, _pressure_basis(survey, visit), d),
    ]
    doc.add(Para(" ".join(lines)))
    for line in _logger_before(ctx, visit):
        doc.add(Para(line))
    rows = []
    if va.findings.outdoor is not None:
        rows.append(_air_row(rw.OUTDOORS, va.findings.outdoor, d))
    else:
        doc.add(Para(rw.outdoor_missing_text()))
    for position, room_id in enumerate(va.room_ids):
        room = ctx.rooms.get(room_id)
        if room is not None and room.is_reference:
            f = va.findings.rooms[position]
            rows.append(_air_row(rw.reference_room_name(f.name), f.air, d))
    if rows:
        doc.add(
            Table(
                rw.CONDITIONS_HEADER,
                tuple(rows),
                frozenset(range(1, 6)),
                name="conditions",
                visit=index + 1,
            )
        )
    if chart_stem and charts is not None:
        _chart(doc, ctx, index, chart_stem, charts)
    if visit.inspector.strip() and visit.inspector != survey.site.inspector:
        doc.add(Para(visit.inspector, strong=rw.TITLE_LABELS["inspector"] + ":"))
    if visit.notes.strip():
        doc.add(Para(visit.notes, strong=rw.NOTES_LABELS["visit"] + ":", note=True))
    if visit.photos:
        doc.add(
            *photo_blocks(
                ctx,
                rw.visit_heading(index + 1, len(survey.visits), visit.label, visit.started_at),
                list(visit.photos),
            )
        )
    for position in range(len(va.room_ids)):
        room_section(doc, ctx, va, position, 3)
    season_section(doc, ctx, va)


# --- safety, method --------------------------------------------------------------------------


def _safety(doc: Document, ctx: Context, shown: list[int]) -> None:
    d = ctx.d
    several = len(shown) > 1
    where: dict[Caution, list[str]] = {}
    for index in shown:
        va = ctx.assessment(index)
        for advice in va.advice.rooms:
            for caution in advice.cautions:
                if caution.key == "closing":
                    continue
                place = f"{advice.room} (visit {index + 1})" if several else advice.room
                where.setdefault(caution, [])
                if place not in where[caution]:
                    where[caution].append(place)
    doc.add(Heading(2, rw.HEADINGS["safety"]))
    if where:
        doc.add(
            Para(rw.SAFETY_INTRO),
            Items(
                tuple(
                    ("", rw.applies_to(words.caution_text(c, d), rooms))
                    for c, rooms in where.items()
                ),
                name="cautions",
                values=tuple(where),
            ),
        )
    else:
        doc.add(Para(rw.SAFETY_NONE))
    doc.add(
        Para("", strong=rw.GENERAL_LEAD + ":"),
        Items(tuple(("", text) for text in rw.GENERAL_CAUTIONS), name="general_cautions"),
        Para(words.CLOSING_TEXT),
        Para(rw.DEFERRAL),
    )


def _method(doc: Document, ctx: Context, shown: list[int]) -> None:
    d = ctx.d
    doc.add(
        Heading(2, rw.HEADINGS["method"]),
        Items(tuple((rw.lead_in(name), text) for name, text in rw.method_items(d))),
    )
    keys: set[str] = set()
    entered: dict[str, bool] = {}
    worst = {"air_temp_k": 0.0, "rh_pct": 0.0, "surface_temp_k": 0.0}
    for index in shown:
        va = ctx.assessment(index)
        keys.update(va.findings.threshold_keys)
        for f, advice in zip(va.findings.rooms, va.advice.rooms, strict=False):
            keys.update(f.threshold_keys)
            keys.update(advice.threshold_keys)
            for s in f.surfaces:
                keys.update(s.threshold_keys)
            for m in f.materials:
                keys.update(m.threshold_keys)
            for name in worst:
                worst[name] = max(worst[name], getattr(f.accuracy, name))
        for key, value in va.accuracy_entered.items():
            entered[key] = entered.get(key, True) and value
    keys.update(equipment_report.threshold_keys(ctx, shown))
    if shown:
        doc.add(
            Para(
                rw.accuracy_method_text(
                    entered, worst["air_temp_k"], worst["rh_pct"], worst["surface_temp_k"], d
                )
            )
        )
    limits = th.cited(keys)
    if limits:
        doc.add(
            Heading(3, rw.HEADINGS["limits"]),
            *limits_blocks(limits, d, rw.LIMITS_INTRO, "limits", "legend"),
        )
