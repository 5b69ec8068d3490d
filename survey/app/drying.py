"""Drying progress: per room, each material point across the visits as a sparkline with its
readings, its goal, and whether the goal is met, the days to it, or that drying has stalled;
the room air's trend; a logger's last days. Worked out by :func:`survey.drying.
drying_progress` in a thread worker, worded by :mod:`survey.words.drying`.

Opened from the room list (``g``, binding id ``rooms_drying``); Escape goes back.
"""

from __future__ import annotations

from rich.text import Text
from textual.containers import Horizontal, VerticalScroll
from textual.message import Message
from textual.widgets import Label, Static

from survey import drying
from survey.app import walk
from survey.app.fields import plain
from survey.words import charts as wc
from survey.words import drying as dw

#: Columns a point's sparkline takes; each visit's reading gets an equal share of them.
SPARK_WIDTH = 15
#: A logger's last days listed (the report has them all).
LOGGER_DAYS_SHOWN = 7


class DryingReady(Message):
    """The drying progress was worked out (posted from the worker thread)."""

    def __init__(self, progress: drying.SiteDrying | None, problem: str = "") -> None:
        super().__init__()
        self.progress = progress
        self.problem = problem


#: The bars of a spark line, lowest first.
BARS = "▁▂▃▄▅▆▇█"


def spark_line(values: list[float], low: float | None = None, high: float | None = None) -> str:
    """The values as a line of bars :data:`SPARK_WIDTH` wide, each value an equal share of
    it, scaled from ``low`` to ``high`` (by default the values' own least and greatest).
    A point is scaled from its goal up, so a fall of 98 to 96 against a goal of 20 stays
    near the top, as it is, instead of filling the scale as if the point had dried."""
    if not values:
        return ""
    low = min(values) if low is None else min(low, *values)
    high = max(values) if high is None else max(high, *values)
    share = max(1, SPARK_WIDTH // len(values))
    top = len(BARS) - 1
    out = []
    for value in values:
        level = top // 2 if high <= low else round((value - low) / (high - low) * top)
        out.append(BARS[level] * share)
    return "".join(out)


class PointRow(Horizontal):
    """A material point: its name, a sparkline of its readings, readings and outcome."""

    DEFAULT_CSS = """
    PointRow { height: auto; }
    PointRow > .drying-name { width: 30; }
    PointRow > .drying-spark { width: 15; margin: 0 1; }
    PointRow > .drying-status { width: 1fr; }
    """


class DryingScreen(walk.WalkScreen):
    TITLE_TEXT = "Drying progress"
    PARENT = "rooms"

    DEFAULT_CSS = """
    DryingScreen .drying-room { margin-top: 1; text-style: bold; }
    DryingScreen .drying-said { color: $text-muted; padding-left: 2; }
    DryingScreen .drying-note { margin-top: 1; }
    """

    _air_note = False  #: the note on room-air loggers shown already (once a screen)

    def compose(self):
        yield self.header()
        with VerticalScroll(id="drying-scroll", can_focus=True):
            yield Static(Text("Working out the drying progress…"), id="drying-wait")
        yield from self.footer_widgets()

    def on_mount(self) -> None:
        self.query_one("#drying-scroll").focus()
        self.refresh_view()

    def action_back(self) -> None:
        self.app.pop_screen()  # back to the room list it was opened from, as it was

    def refresh_view(self) -> None:
        survey = self.editor.survey

        def work() -> None:
            try:
                progress = drying.drying_progress(survey)
            except Exception as exc:  # shown, never lost: the survey itself is untouched
                self.post_message(DryingReady(None, str(exc)))
                return
            self.post_message(DryingReady(progress))

        self.run_worker(work, thread=True, group="drying", exclusive=True, exit_on_error=False)

    def on_drying_ready(self, message: DryingReady) -> None:
        scroll = self.query_one("#drying-scroll", VerticalScroll)
        scroll.remove_children()
        if message.progress is None:
            scroll.mount(Static(Text(wc.drying_failed(message.problem))))
            return
        scroll.mount_all(self._widgets(message.progress))

    def _widgets(self, progress: drying.SiteDrying) -> list:
        d = self.app.display_units
        names = {r.id: r.name for r in self.editor.survey.rooms}
        out: list = []
        if not progress.rooms and not progress.outdoor_loggers:
            return [Static(Text(wc.DRYING_EMPTY))]
        self._air_note = False
        closing: list[bool | None] = []
        for room in progress.rooms:
            title = plain(room.name, "bold")
            if room.is_reference:
                title.append(wc.REFERENCE_MARK)
            out.append(Static(title, classes="drying-room"))
            out.append(Static(plain(dw.room_air_sentence(room, d)), classes="drying-said"))
            if room.air:
                toward = [
                    w
                    for a in room.air
                    for w in (
                        a.reference_humidity_ratio_kg_per_kg,
                        a.outdoor_humidity_ratio_kg_per_kg,
                    )
                    if w is not None
                ]
                out.append(
                    self._row(
                        Text("Room air humidity ratio"),
                        [a.humidity_ratio_kg_per_kg for a in room.air],
                        Text(
                            " → ".join(
                                d("humidity_ratio", a.humidity_ratio_kg_per_kg) for a in room.air
                            )
                        ),
                        low=min(toward, default=None),
                    )
                )
            if room.points:
                out.append(Static(Text(dw.room_goals_text(room)), classes="drying-said"))
            for point in room.points:
                values = [r.value for r in point.readings]
                status = Text(" → ".join(dw.reading_cell(r) for r in point.readings))
                if point.goal is not None:
                    status.append(f"  goal {dw.goal_cell(point)}")
                status.append(f"  {dw.point_status(point)}", "bold")
                row = self._row(plain(walk.cut(point.location, 29)), values, status, point.goal)
                out.append(row)
                said = dw.point_sentence(point, names, room.flued_appliance)
                out.append(Static(plain(said), classes="drying-said"))
            if any(dw.says_close_up(p, room.flued_appliance) for p in room.points):
                closing.append(room.flued_appliance)
            for summary in room.loggers:
                out += self._logger(summary, room.name)
        for summary in progress.outdoor_loggers:
            out.append(Static(Text(dw.OUTDOORS), classes="drying-room"))
            out += self._logger(summary, None)
        notes = []
        if any(p.estimate is not None for room in progress.rooms for p in room.points):
            notes.append(dw.STRAIGHT_LINE_NOTE)
        if closing:
            notes.append(dw.combustion_caution(True if True in closing else None, d))
        out += [Static(Text(n), classes="drying-note") for n in notes]
        return out

    def _row(
        self,
        name: Text,
        values: list[float],
        status: Text,
        low: float | None = None,
        high: float | None = None,
    ) -> PointRow:
        """A row: the name, the values as a spark line from ``low`` to ``high`` (see
        :func:`spark_line`), and the status in words beside it."""
        return PointRow(
            Label(name, classes="drying-name", markup=False),
            Static(Text(spark_line(values, low, high)), classes="drying-spark"),
            Static(status, classes="drying-status"),
        )

    def _logger(self, summary: drying.LoggerSummary, room_name: str | None) -> list:
        d = self.app.display_units
        heading = plain(dw.logger_heading(summary, room_name))
        out: list = [
            Static(heading, classes="drying-said"),
            self._row(
                Text("Daily mean RH"),
                [day.rh_pct.mean for day in summary.days],
                Text(f"{dw.logger_gaps_text(summary)} {dw.logger_trend_text(summary, d)}"),
                low=0.0,
                high=100.0,
            ),
        ]
        kind = dw.rh_kind(summary)
        out += [
            Static(Text(dw.logger_day_line(day, d, kind)), classes="drying-said")
            for day in summary.days[-LOGGER_DAYS_SHOWN:]
        ]
        if dw.is_room_air(summary) and not self._air_note:
            out.append(Static(Text(dw.AIR_RH_NOTE), classes="drying-note"))
            self._air_note = True
        return out
