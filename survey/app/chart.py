"""The chart screen: the visit's room states and the outdoor air on a psychrometric chart.

Opened from the room list (``c``, binding id ``rooms_chart``). The points, curves, axes and
units are :func:`survey.chart.psychro_chart`'s, for the visit being walked; the plot is
textual-plotext's widget (plotext underneath), and a table under it names each point. This
module, and with it plotext, is imported only when the screen is first opened, so the
app's start-up never pays for it.

Room names are user text: the plot marks points only with their number ("1", "2", … and "out"
for outdoors), and the table shows the names as plain ``Text`` (never markup, control
characters visible). Colours come from the app's theme variables, so the chart reads in
the light and the dark themes alike, and each kind of point has its own marker too.

:class:`SeriesPlot` is the same widget for a :class:`survey.chart.TimeSeriesChart`, for
screens that show drying progress or the mould-growth index.
"""

from __future__ import annotations

import datetime as dt

from rich.text import Text
from textual.binding import Binding
from textual.color import Color
from textual.widgets import DataTable, Static
from textual_plotext import PlotextPlot

from survey import chart, evaluate
from survey.app import walk
from survey.app.fields import plain
from survey.safe_text import visible
from survey.words import charts as wc

#: The theme variable that colours each part of the chart.
COLOURS = {
    "saturation": "primary",
    "mould_limit": "warning",
    "frost": "secondary",
    "room": "success",
    "condensing": "error",
    "outdoor": "accent",
    "canvas": "surface",  # what textual-plotext's theme paints behind the plot
}
#: Room names longer than this are cut in the table (the line under it shows them whole).
NAME_WIDTH = 24
#: Markers: plotext's own names or one character each.
MARKERS = {"curve": "braille", "room": "●", "outdoor": "■", "surface": "◆"}
#: Each curve its own mark, so the curves differ by shape as well as by colour: saturation
#: drawn solid, the mould limit in dots, the frost curve in crosses (the legend shows each).
CURVE_MARKERS = {"saturation": "braille", "mould_limit": "•", "frost": "×"}


class PsychroPlot(PlotextPlot):
    """The plot widget of the chart screen: what the table leaves of the screen."""

    DEFAULT_CSS = "PsychroPlot { height: 1fr; min-height: 10; }"


class PointTable(DataTable):
    """One row per point of the chart: its mark, name and state."""

    DEFAULT_CSS = "PointTable { height: auto; max-height: 7; }"

    def __init__(self, **kwargs) -> None:
        super().__init__(cursor_type="row", zebra_stripes=True, **kwargs)


class ChartScreen(walk.WalkScreen):
    TITLE_TEXT = "Chart"
    PARENT = "rooms"
    BINDINGS = [Binding("escape,c", "back", "Back to rooms", id="chart_close")]
    DEFAULT_CSS = "ChartScreen #chart-detail { height: auto; max-height: 2; }"

    def __init__(self) -> None:
        super().__init__()
        self._points: tuple[chart.AirPoint, ...] = ()

    def compose(self):
        yield self.header()
        yield Static(id="chart-note", classes="hint")
        yield PsychroPlot(id="chart-plot")
        yield PointTable(id="chart-points")
        yield Static(id="chart-detail", classes="hint")
        yield from self.footer_widgets()

    def on_mount(self) -> None:
        self.query_one(PointTable).add_columns(*(Text(label) for label in (" ", *wc.CHART_COLUMNS)))
        self.app.theme_changed_signal.subscribe(self, lambda _theme: self.refresh_view())
        self.refresh_view()
        self.query_one(PointTable).focus()

    def action_back(self) -> None:
        self.app.pop_screen()

    # --- what is shown -------------------------------------------------------------------

    def chart_data(self) -> chart.PsychroChart | None:
        survey = self.editor.survey
        if not survey.visits:
            return None
        judged = evaluate.assess_visit(survey, self.editor.visit_index)
        data = chart.psychro_chart(judged, self.app.display_units.system)
        return data if data.points else None

    def refresh_view(self) -> None:
        data = self.chart_data()
        note = self.query_one("#chart-note", Static)
        plot = self.query_one(PsychroPlot)
        table = self.query_one(PointTable)
        table.clear()
        if data is None:
            note.update(Text(wc.CHART_EMPTY))
            plot.display = False
            self._points = ()
            self._show_detail(-1)
            return
        plot.display = True
        d = self.app.display_units
        note.update(Text(wc.chart_key(data.pressure_pa, d)))
        self._plot(plot, data)
        self._points = data.points
        for point in data.points:
            table.add_row(
                Text(point.mark, style="bold"),
                plain(walk.cut(point.name, NAME_WIDTH)),
                Text(d.temperature(point.dry_bulb_c)),
                Text(f"{point.rh_pct:.0f} %"),
                Text(d("humidity_ratio", point.humidity_ratio_kg_per_kg)),
                Text(d.temperature(point.condensation_point_c)),
                Text("" if point.coldest is None else d.temperature(point.coldest.surface_temp_c)),
            )
        self._show_detail(table.cursor_row)

    def on_data_table_row_highlighted(self, event: DataTable.RowHighlighted) -> None:
        self._show_detail(event.cursor_row)

    def _show_detail(self, row: int) -> None:
        """The highlighted point in full: its name, coldest surface and worst surface."""
        detail = self.query_one("#chart-detail", Static)
        if not 0 <= row < len(self._points):
            detail.update("")
            return
        point = self._points[row]
        d = self.app.display_units
        line = plain(point.name, "bold")
        coldest = (
            None if point.coldest is None else (point.coldest.label, point.coldest.surface_temp_c)
        )
        line.append(plain(wc.chart_point_detail(coldest, point.worst_words, d)))
        detail.update(line)

    def _colour(self, part: str) -> tuple[int, int, int]:
        variables = self.app.theme_variables
        return Color.parse(variables.get(COLOURS[part], variables["foreground"])).rgb

    def _plot(self, widget: PsychroPlot, data: chart.PsychroChart) -> None:
        plt = widget.plt
        plt.clear_figure()
        for line in data.lines:
            if line.key == "guide":
                continue
            plt.plot(
                [data.x(p.dry_bulb_c) for p in line.points],
                [data.y(p.humidity_ratio_kg_per_kg) for p in line.points],
                marker=CURVE_MARKERS.get(line.key, MARKERS["curve"]),
                color=self._colour(line.key),
                label=_short_label(line),
            )
        xa, ya = data.x_axis, data.y_axis
        # one character cell to the right, so the number stands beside its marker
        width = widget.size.width or self.app.size.width
        cell = (xa.high - xa.low) / max(width - 8, 20)
        for point in data.points:
            x, y = data.x(point.dry_bulb_c), data.y(point.humidity_ratio_kg_per_kg)
            if point.coldest is not None:
                part = "condensing" if point.coldest.condensing else "room"
                plt.scatter(
                    [data.x(point.coldest.surface_temp_c)],
                    [data.y(point.coldest.humidity_ratio_kg_per_kg)],
                    marker=MARKERS["surface"],
                    color=self._colour(part),
                )
            part = "outdoor" if point.outdoor else "condensing" if point.condensing else "room"
            plt.scatter(
                [x],
                [y],
                marker=MARKERS["outdoor" if point.outdoor else "room"],
                color=self._colour(part),
            )
            plt.text(
                point.mark,
                x + cell,
                y,
                color=self._colour(part),
                background=self._colour("canvas"),
                alignment="left",
            )
        plt.xlim(xa.low, xa.high)
        plt.ylim(ya.low, ya.high)
        plt.xticks(list(xa.ticks), [f"{t:g}" for t in xa.ticks])
        plt.yticks(list(ya.ticks), [f"{t:g}" for t in ya.ticks])
        plt.xlabel(f"{xa.label}, {xa.unit}")
        plt.ylabel(f"{ya.label}, {ya.unit}")
        widget.refresh()


def _short_label(line: chart.ChartLine) -> str:
    """A curve's name in the plot's small legend."""
    if line.key == "saturation":
        return "saturation"
    if line.key == "frost":
        return "frost (ice)"
    return f"{line.rh_pct:g} % RH"


class SeriesPlot(PlotextPlot):
    """A small plot of a :class:`survey.chart.TimeSeriesChart` (drying progress, the
    mould-growth index): each series a line in its own theme colour, the guides dashed.
    Give it a height in the screen's CSS; call :meth:`show` with the chart."""

    DEFAULT_CSS = "SeriesPlot { height: 12; }"
    #: The theme variable of each series in turn, and of the guides.
    SERIES_COLOURS = ("primary", "success", "accent", "secondary", "error")
    #: and marks, so that series differ by shape too (the legend shows each)
    SERIES_MARKERS = ("braille", "•", "×", "+", "○")
    GUIDE_COLOUR = "warning"

    def __init__(self, **kwargs) -> None:
        super().__init__(**kwargs)
        self._chart: chart.TimeSeriesChart | None = None

    def on_mount(self) -> None:
        super().on_mount()
        self.app.theme_changed_signal.subscribe(self, lambda _theme: self._draw())

    def show(self, data: chart.TimeSeriesChart) -> None:
        self._chart = data
        self._draw()

    def _colour(self, name: str) -> tuple[int, int, int]:
        variables = self.app.theme_variables
        return Color.parse(variables.get(name, variables["foreground"])).rgb

    def _draw(self) -> None:
        data = self._chart
        if data is None:
            return
        plt = self.plt
        plt.clear_figure()
        span_h = max((data.end - data.start).total_seconds() / 3600.0, 1e-9)

        def hours(at) -> float:
            return (at - data.start).total_seconds() / 3600.0

        for number, series in enumerate(data.series):
            if not series.values:
                continue
            plt.plot(
                [hours(at) for at in series.times],
                list(series.values),
                marker=self.SERIES_MARKERS[number % len(self.SERIES_MARKERS)],
                color=self._colour(self.SERIES_COLOURS[number % len(self.SERIES_COLOURS)]),
                label=visible(series.name),
            )
        for guide in data.guides:  # a dotted line of its own colour, named in the legend
            plt.plot(
                [0.0, span_h],
                [guide.value, guide.value],
                marker="dot",
                color=self._colour(self.GUIDE_COLOUR),
                label=visible(guide.name),
            )
        ticks = [span_h * i / 3 for i in range(4)] if span_h > 1e-6 else [0.0]
        form = "%d %b" if span_h >= 72 else "%d %b %H:%M"
        labels = [(data.start + dt.timedelta(hours=h)).strftime(form) for h in ticks]
        plt.xticks(ticks, labels)
        axis = data.y_axis
        plt.ylim(axis.low, axis.high)
        plt.yticks(list(axis.ticks), [f"{t:g}" for t in axis.ticks])
        plt.ylabel(f"{axis.label}, {axis.unit}" if axis.unit else axis.label)
        plt.title(visible(data.title))
        self.refresh()
