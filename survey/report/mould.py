"""The report's section on mould growth over the logged period: for every logger series of a
room, the index summary in words (:mod:`survey.words.mould_index`), then the limits it used.

The series are judged by :func:`survey.mould_series.judge_survey`: a logger on a surface as it
is, an air logger through the room's surface with the lowest measured temperature factor. Each
summary's :class:`~survey.report.markdown.Items` block carries the judged series in ``values``;
its index over time, for a chart, is ``judged.result.index.points(max_points)`` — typed
:class:`~survey.mould_index.IndexPoint` (time, index) values, each the highest of its stretch.
"""

from __future__ import annotations

from typing import TYPE_CHECKING

from survey import mould_series
from survey import thresholds as th
from survey.mould_series import LogIndex, LogNotJudged
from survey.report.markdown import Document, Heading, Items, Para, Photo
from survey.report.rooms import Context, limits_blocks
from survey.words import mould_index as mw
from survey.words import report as rw

if TYPE_CHECKING:
    from survey.report.build import ChartFile


def judged_series(ctx: Context) -> list[LogIndex | LogNotJudged]:
    """Every room logger series of the report's survey, judged."""
    return mould_series.judge_survey(ctx.survey)


def _chart(
    doc: Document, ctx: Context, one: LogIndex, room_name: str, stem: str, charts: list[ChartFile]
) -> None:
    """The series' index over time as a small SVG chart beside the report, linked."""
    from urllib.parse import quote

    from survey import chart
    from survey.report import svg

    points = one.result.index.points(400)
    if not points:
        return
    words_ = mw.CHART_WORDS
    data = chart.time_series_chart(
        words_["title"],
        [(words_["series"], [(p.at, p.value) for p in points])],
        unit="",
        y_label=words_["axis"],
        system=ctx.d.system,
        guides=[(words_["microscopic"], 1.0), (words_["visible"], 3.0)],
        y_low=0.0,
        y_high=6.0,
    )
    name = f"{stem}-mould-{len([c for c in charts if '-mould-' in c.name]) + 1}.svg"
    alt = mw.chart_alt(room_name, one.result)
    from survey.report.build import ChartFile

    charts.append(ChartFile(name, alt, svg.series_svg(data)))
    doc.add(Photo(alt, quote(name)))


def mould_section(
    doc: Document, ctx: Context, chart_stem: str = "", charts: list[ChartFile] | None = None
) -> None:
    """The section, when the survey holds any room logger series; nothing otherwise. With
    ``chart_stem``, each judged series' index is drawn as a chart file added to ``charts``."""
    judged = judged_series(ctx)
    if not judged:
        return
    doc.add(Heading(2, mw.HEADING), Para(mw.INTRO))
    keys: set[str] = set()
    for one in judged:
        room = one.room if isinstance(one, LogNotJudged) else one.source.room
        doc.add(Heading(3, mw.series_title(one, ctx.room_name(room))))
        doc.add(
            Items(
                tuple(("", line) for line in mw.summary_lines(one, ctx.d)),
                name="mould_index",
                room=room,
                values=(one,),
            )
        )
        if isinstance(one, LogIndex):
            if chart_stem and charts is not None:
                _chart(doc, ctx, one, ctx.room_name(room), chart_stem, charts)
            keys.update(one.result.threshold_keys)
            keys.update(one.result.ashrae160.threshold_keys)
    doc.add(Para(mw.LIMITS))
    limits = th.cited(keys)
    doc.add(
        *limits_blocks(limits, ctx.d, rw.LIMITS_INTRO, "mould_index_limits", "mould_index_legend")
    )
