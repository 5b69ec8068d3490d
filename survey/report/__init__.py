"""The site report: a survey's visits judged and laid out as Markdown, and as HTML.

:func:`markdown_report` gives the GitHub-flavoured Markdown of a survey, :func:`html_report`
the same report as one self-contained HTML page; :func:`build` the report as typed blocks
(what the app previews and what the tests read). The rooms of the package:

* :mod:`survey.report.build` — what the report says, in which order;
* :mod:`survey.report.rooms` — each room's section;
* :mod:`survey.report.drying` — drying progress across visits and logger days;
* :mod:`survey.report.markdown` — the blocks, the one escaping helper, the Markdown;
* :mod:`survey.report.html` — the HTML page from that Markdown;
* :mod:`survey.report.svg` — the charts as SVG (imported only when a report has charts).

Visits are judged by :func:`survey.evaluate.assess_visit`; every sentence comes from
:mod:`survey.words`.
"""

from __future__ import annotations

import dataclasses
from collections.abc import Callable
from pathlib import Path

from survey import model
from survey.report.build import (
    ChartFile,
    ReportOptions,
    build,
    build_with_charts,
    chart_name,
    selected_visits,
)
from survey.report.markdown import Document, escape, render

__all__ = [
    "ChartFile",
    "Document",
    "ReportOptions",
    "build",
    "build_with_charts",
    "chart_name",
    "escape",
    "html_report",
    "markdown_report",
    "render",
    "selected_visits",
    "write_report",
]


def markdown_report(survey: model.Survey, options: ReportOptions | None = None) -> str:
    """The report of ``survey`` as Markdown text."""
    return render(build(survey, options))


def html_report(survey: model.Survey, options: ReportOptions | None = None) -> str:
    """The report of ``survey`` as one HTML page (rendered from the same Markdown), its
    charts (with ``options.chart_stem``) carried inline."""
    from urllib.parse import quote

    from survey.report.html import to_html

    doc, charts = build_with_charts(survey, options)
    return to_html(render(doc), doc.title, {quote(c.name): c.svg for c in charts})


def write_report(
    survey: model.Survey,
    options: ReportOptions,
    out: Path,
    html: bool = False,
    refuse: Callable[[Path], None] | None = None,
) -> tuple[Path, ...]:
    """Write the report to ``out`` (Markdown, or one HTML page with ``html``) and, for
    Markdown, its charts beside it (``OUT-STEM-chart-N.svg``); each file whole or not at all,
    through the store's atomic writer. ``refuse(path)`` is called for every file before
    anything is written and may raise to keep a file (the survey, say) from being written
    over. Returns the files written, the report last."""
    from survey import store

    options = dataclasses.replace(options, chart_stem=out.stem, report_dir=out.parent)
    charts: tuple[ChartFile, ...] = ()
    if html:  # the charts travel inside the page
        text = html_report(survey, options)
    else:
        doc, charts = build_with_charts(survey, options)
        text = render(doc)
    targets = [out.with_name(c.name) for c in charts]
    for target in (*targets, out):
        if refuse is not None:
            refuse(target)
    for target, chart in zip(targets, charts, strict=True):
        store.write_file_atomically(target, chart.svg.encode("utf-8"))
    store.write_file_atomically(out, text.encode("utf-8"))
    return (*targets, out)
