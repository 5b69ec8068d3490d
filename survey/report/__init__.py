"""The site report: a survey's visits judged and laid out as Markdown, and as HTML.

:func:`markdown_report` gives the GitHub-flavoured Markdown of a survey, :func:`html_report`
the same report as one self-contained HTML page; :func:`build` the report as typed blocks
(what the app previews and what the tests read). The rooms of the package:

* :mod:`survey.report.build` — what the report says, in which order;
* :mod:`survey.report.rooms` — each room's section;
* :mod:`survey.report.drying` — drying progress across visits and logger days;
* :mod:`survey.report.markdown` — the blocks, the one escaping helper, the Markdown;
* :mod:`survey.report.html` — the HTML page from that Markdown.

Visits are judged by :func:`survey.evaluate.assess_visit`; every sentence comes from
:mod:`survey.words`.
"""

from __future__ import annotations

from survey import model
from survey.report.build import ReportOptions, build, selected_visits
from survey.report.markdown import Document, escape, render

__all__ = [
    "Document",
    "ReportOptions",
    "build",
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
    """The report of ``survey`` as one HTML page (rendered from the same Markdown)."""
    from survey.report.html import to_html

    doc = build(survey, options)
    return to_html(render(doc), doc.title)
