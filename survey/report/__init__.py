"""The site report: a survey's visits judged and laid out as Markdown, and as HTML.

:func:`markdown_report` gives the GitHub-flavoured Markdown of a survey, :func:`html_report`
the same report as one self-contained HTML page; :func:`build` the report as typed blocks
(what the app previews and what the tests read). The rooms of the package:

* :mod:`survey.report.build` — what the report says, in which order;
* :mod:`survey.report.rooms` — each room's section and the drying-progress tables;
* :mod:`survey.report.markdown` — the blocks, the one escaping helper, the Markdown;
* :mod:`survey.report.html` — the HTML page from that Markdown;
* :mod:`survey.report.svg` — the charts as SVG (imported only when a report has charts).

Visits are judged by :func:`survey.evaluate.assess_visit`; every sentence comes from
:mod:`survey.words`.
"""

from __future__ import annotations

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
