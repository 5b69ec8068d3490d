"""The report preview: the site report of the open survey as the client will read it, and
writing it beside the survey (Markdown or HTML) in a worker.

The report is the core's (:mod:`survey.report`): this screen only shows its Markdown and
writes the file through the store's atomic writer. The survey is copied before the report is
built in a worker, so edits made meanwhile cannot tear it.
"""

from __future__ import annotations

import datetime as dt
from pathlib import Path

import msgspec
from rich.text import Text
from textual import on, work
from textual.binding import Binding
from textual.containers import Horizontal, VerticalScroll
from textual.widgets import Select, Static

from survey import model
from survey.app import walk
from survey.app.fields import Choice, plain
from survey.errors import InputError, SurveyFileError

UNIT_CHOICES = [("SI units", "si"), ("IP units", "ip")]


class ReportScreen(walk.WalkScreen):
    TITLE_TEXT = "Report"
    #: The Markdown shown (what a write would put in the file, but for its time line).
    source = ""
    PARENT = "findings"
    BINDINGS = [
        Binding("w", "write('md')", "Write Markdown", id="report_write_md"),
        Binding("h", "write('html')", "Write HTML", id="report_write_html"),
    ]

    def compose(self):
        editor = self.editor
        visits = [("Last visit", "last"), ("All visits", "all")] + [
            (Text(f"Visit {n + 1}: {v.started_at:%Y-%m-%d} ") + plain(walk.cut(v.label, 24)), n + 1)
            for n, v in enumerate(editor.survey.visits)
        ]
        yield self.header()
        with Horizontal(classes="report-options"):
            yield Choice(visits, value="last", allow_blank=False, compact=True, id="report-visit")
            yield Choice(
                UNIT_CHOICES,
                value=editor.unit_system,
                allow_blank=False,
                compact=True,
                id="report-units",
            )
        yield Static(Text("Building the report…"), id="report-progress")
        with VerticalScroll(id="report-scroll", can_focus=True):
            yield Static(id="report-text")
        yield from self.footer_widgets()

    def on_mount(self) -> None:
        self.refresh_view()
        self.query_one("#report-scroll").focus()

    def refresh_view(self) -> None:
        self._build_preview(*self._request())

    def _options(self, out: Path | None = None):
        from survey import report

        path = self.editor.path
        return report.ReportOptions(
            visit=self.query_one("#report-visit", Select).value,
            units=self.query_one("#report-units", Select).value,
            generated_at=self.app.clock().strftime("%Y-%m-%d %H:%M"),
            source_name=path.name,
            survey_dir=path.parent,
            report_dir=(out or path).parent,
        )

    def _request(self) -> tuple[model.Survey, object]:
        """A copy of the survey as it is now, and the report options chosen."""
        copy = msgspec.json.decode(msgspec.json.encode(self.editor.survey), type=model.Survey)
        return copy, self._options()

    @on(Select.Changed)
    def _option_changed(self) -> None:
        if self.is_mounted:
            self.refresh_view()

    @work(thread=True, exclusive=True, group="report-preview", exit_on_error=False)
    def _build_preview(self, survey: model.Survey, options) -> None:
        from survey import report

        try:
            text = report.markdown_report(survey, options)
        except InputError as exc:
            self.app.call_from_thread(self._show_problem, str(exc))
            return
        self.app.call_from_thread(self._show, text)

    def _show(self, text: str) -> None:
        self.query_one("#report-progress", Static).update(
            Text(
                "Preview of the report as it will be written "
                "(w: Markdown with its charts, h: HTML)."
            )
        )
        from rich.markdown import Markdown

        self.source = text
        # Rich draws the Markdown (tables included) in one renderable: a report of a few
        # hundred kB shows in a fraction of a second, where a widget per block would take
        # seconds. User text in it was escaped by the report and Rich reads no markup in it.
        self.query_one("#report-text", Static).update(Markdown(text, hyperlinks=False))

    def _show_problem(self, problem: str) -> None:
        self.query_one("#report-progress", Static).update(Text(problem))

    def action_write(self, kind: str) -> None:
        from survey.commands.report import default_output

        html = kind == "html"
        out = default_output(self.editor.path, html)
        survey, _ = self._request()
        self._write(survey, self._options(out), out, html)
        self.app.show_status(f"Writing the report to {out.name}…")

    @work(thread=True, group="report-write", exit_on_error=False)
    def _write(self, survey: model.Survey, options, out: Path, html: bool) -> None:
        from survey import report

        try:
            written = report.write_report(survey, options, out, html)
        except (InputError, SurveyFileError, OSError) as exc:
            problem = str(exc)
            self.app.call_from_thread(
                self.app.show_status, f"Report NOT written: {problem}", "error"
            )
            return
        at = dt.datetime.now().strftime("%H:%M:%S")
        charts = len(written) - 1
        beside = (
            f", with {charts} chart file{'s' if charts > 1 else ''} beside it" if charts else ""
        )
        self.app.call_from_thread(
            self.app.show_status, f"Report written {at} to {out}{beside}.", "saved"
        )
