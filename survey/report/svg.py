"""The report's charts as SVG: a visit's psychrometric chart and the small time-series charts.

Written with the standard library's :mod:`xml.etree.ElementTree` (no plotting package: the
numbers that chose it are in DEVELOPERS.md). ElementTree builds a tree and serialises it,
so every text and attribute is escaped by the serialiser: a room called ``<script>`` or
``A & B`` is written as character data and shows literally. Control characters, which XML
1.0 cannot hold at all, are first made visible (:func:`survey.safe_text.visible`). The
document has no script, no event attribute, no link and no reference to anything outside
itself: fonts are generic families, styles are presentation attributes.

The chart records come from :mod:`survey.chart` in display units already; this module only
maps them to the page. Imported when a report is written, never at start-up.
"""

from __future__ import annotations

import datetime as dt
import xml.etree.ElementTree as ET
from collections.abc import Callable, Sequence
from dataclasses import dataclass

from survey import words
from survey.chart import Axis, PsychroChart, TimeSeriesChart
from survey.safe_text import visible

SVG_NS = "http://www.w3.org/2000/svg"
FONT = "Helvetica, Arial, sans-serif"
#: The palette: ink, grid, and one colour per kind of line (each also has its own dash, so
#: nothing is told by colour alone).
INK = "#1d2430"
MUTED = "#5b6573"
GRID = "#e3e6ea"
FRAME = "#9aa3ae"
SATURATION = "#1f4e8c"
MOULD = "#c05a00"
FROST = "#5aa0d8"
GUIDE = "#b8c0c9"
ROOM = "#0f7d6b"
CONDENSING = "#b3261e"
OUTDOOR = "#6a4c93"
SERIES_COLOURS = ("#1f4e8c", "#0f7d6b", "#c05a00", "#6a4c93", "#b3261e", "#3b7a1e")
#: A time-series chart's guides (a limit, a goal): ink-grey, dash-dot.
GUIDE_STYLE = {"stroke": MUTED, "stroke_width": "1.3", "stroke_dasharray": "10 3 2 3"}
SERIES_DASHES = ("", "6 3", "2 3", "8 3 2 3", "4 4", "1 2")
#: Longest room name drawn in a legend line before it is cut with an ellipsis.
NAME_CHARS = 48


def _text(value: object, limit: int | None = None) -> str:
    shown = visible(value)
    if limit is not None and len(shown) > limit:
        shown = shown[: limit - 1] + "…"
    return shown


def _n(value: float) -> str:
    text = f"{value:.2f}".rstrip("0").rstrip(".")
    return "0" if text in ("-0", "") else text


class _Canvas:
    """An SVG document being built: a root element and helpers for its few shapes."""

    def __init__(self, width: float, height: float, title: str, description: str) -> None:
        self.root = ET.Element(
            "svg",
            {
                "xmlns": SVG_NS,
                "width": _n(width),
                "height": _n(height),
                "viewBox": f"0 0 {_n(width)} {_n(height)}",
                "font-family": FONT,
                "font-size": "12",
                "fill": INK,
                "role": "img",
            },
        )
        ET.SubElement(self.root, "title").text = _text(title)
        ET.SubElement(self.root, "desc").text = _text(description)
        self.background = ET.SubElement(
            self.root,
            "rect",
            {"x": "0", "y": "0", "width": _n(width), "height": _n(height), "fill": "#ffffff"},
        )

    def size(self, width: float, height: float) -> None:
        """Set the page size once the content's extent is known."""
        self.root.set("width", _n(width))
        self.root.set("height", _n(height))
        self.root.set("viewBox", f"0 0 {_n(width)} {_n(height)}")
        self.background.set("height", _n(height))

    def group(self, name: str, parent: ET.Element | None = None) -> ET.Element:
        return ET.SubElement(self.root if parent is None else parent, "g", {"class": name})

    @staticmethod
    def line(parent: ET.Element, x1: float, y1: float, x2: float, y2: float, **style: str) -> None:
        attrs = {"x1": _n(x1), "y1": _n(y1), "x2": _n(x2), "y2": _n(y2)}
        ET.SubElement(parent, "line", attrs | _style(style))

    @staticmethod
    def path(parent: ET.Element, points: Sequence[tuple[float, float]], **style: str) -> None:
        if not points:
            return
        d = "M" + " L".join(f"{_n(x)} {_n(y)}" for x, y in points)
        ET.SubElement(parent, "path", {"d": d, "fill": "none"} | _style(style))

    @staticmethod
    def text(
        parent: ET.Element,
        x: float,
        y: float,
        content: object,
        limit: int | None = None,
        **style: str,
    ) -> None:
        element = ET.SubElement(parent, "text", {"x": _n(x), "y": _n(y)} | _style(style))
        element.text = _text(content, limit)

    def serialise(self) -> str:
        ET.indent(self.root, space=" ")
        return ET.tostring(self.root, encoding="unicode", xml_declaration=False) + "\n"


def _style(style: dict[str, str]) -> dict[str, str]:
    """Keyword styles as SVG presentation attributes: ``stroke_width`` → ``stroke-width``."""
    return {key.replace("_", "-"): value for key, value in style.items()}


#: Where a point's name starts in the key, after its mark ("1" … "9", "out"), px.
KEY_INDENT = 30


def _marker(parent: ET.Element, shape: str, x: float, y: float, size: float, **style: str) -> None:
    s = size
    if shape == "circle":
        ET.SubElement(parent, "circle", {"cx": _n(x), "cy": _n(y), "r": _n(s)} | _style(style))
        return
    corners = {
        "square": [(x - s, y - s), (x + s, y - s), (x + s, y + s), (x - s, y + s)],
        "diamond": [(x, y - s * 1.3), (x + s * 1.3, y), (x, y + s * 1.3), (x - s * 1.3, y)],
        "triangle": [(x, y - s * 1.3), (x + s * 1.2, y + s), (x - s * 1.2, y + s)],
    }[shape]
    ET.SubElement(
        parent,
        "polygon",
        {"points": " ".join(f"{_n(a)},{_n(b)}" for a, b in corners)} | _style(style),
    )


class _Frame:
    """The plot area on the page and the mapping of axis values into it."""

    def __init__(self, left: float, top: float, width: float, height: float) -> None:
        self.left, self.top, self.width, self.height = left, top, width, height

    def px(self, axis: Axis, value: float) -> float:
        return self.left + axis.fraction(value) * self.width

    def py(self, axis: Axis, value: float) -> float:
        return self.top + (1.0 - axis.fraction(value)) * self.height

    @property
    def bottom(self) -> float:
        return self.top + self.height

    @property
    def right(self) -> float:
        return self.left + self.width


def _axes(
    canvas: _Canvas,
    frame: _Frame,
    x_ticks: Sequence[tuple[float, str]],
    y_axis: Axis,
    x_title: str,
    edge_anchors: bool = False,
) -> None:
    """Grid, tick labels, frame and axis titles; with ``edge_anchors`` the tick labels at
    either end are aligned inwards (long date labels stay on the page)."""
    grid = canvas.group("grid")
    for x, label in x_ticks:
        canvas.line(grid, x, frame.top, x, frame.bottom, stroke=GRID, stroke_width="1")
        anchor = "middle"
        if edge_anchors and x <= frame.left + 1:
            anchor = "start"
        elif edge_anchors and x >= frame.right - 1:
            anchor = "end"
        canvas.text(grid, x, frame.bottom + 16, label, text_anchor=anchor, fill=MUTED)
    for value in y_axis.ticks:
        y = frame.py(y_axis, value)
        canvas.line(grid, frame.left, y, frame.right, y, stroke=GRID, stroke_width="1")
        canvas.text(grid, frame.left - 6, y + 4, _n(value), text_anchor="end", fill=MUTED)
    ET.SubElement(
        grid,
        "rect",
        {
            "x": _n(frame.left),
            "y": _n(frame.top),
            "width": _n(frame.width),
            "height": _n(frame.height),
            "fill": "none",
            "stroke": FRAME,
            "stroke-width": "1",
        },
    )
    canvas.text(
        grid, frame.left + frame.width / 2, frame.bottom + 34, x_title, text_anchor="middle"
    )
    title = f"{y_axis.label}, {y_axis.unit}" if y_axis.unit else y_axis.label
    cx, cy = frame.left - 44, frame.top + frame.height / 2
    canvas.text(
        grid,
        cx,
        cy,
        title,
        text_anchor="middle",
        transform=f"rotate(-90 {_n(cx)} {_n(cy)})",
    )


# --- the psychrometric chart -----------------------------------------------------------------


def _point_lines(chart: PsychroChart, d: words.Display, index: int) -> tuple[str, str]:
    """A point's legend entry after its name: its state, then its coldest surface and the
    worst surface's verdict ("" when there is neither)."""
    point = chart.points[index]
    state = (
        f"{d.temperature(point.dry_bulb_c)}, {point.rh_pct:.0f} % RH, "
        f"{d('humidity_ratio', point.humidity_ratio_kg_per_kg)}, "
        f"dew point {d.temperature(point.dew_point_c)}"
    )
    details = []
    if point.coldest is not None:
        details.append(
            f"coldest surface {_text(point.coldest.label, 40)} "
            f"{d.temperature(point.coldest.surface_temp_c)}"
        )
    if point.worst_words:
        details.append(f"worst: {point.worst_words}")
    return state, "; ".join(details)


@dataclass(frozen=True)
class _Sample:
    """A legend sample: a stretch of line in ``style``, or a mark of ``shape``."""

    style: dict[str, str] | None = None
    shape: str = ""
    colour: str = INK

    def draw(self, parent: ET.Element, x: float, y: float) -> None:
        if self.style is not None:
            _Canvas.line(parent, x, y - 4, x + 26, y - 4, **self.style)
        else:
            _marker(parent, self.shape, x + 13, y - 4, 4.5, fill=self.colour, stroke="#ffffff")


def _flow(
    canvas: _Canvas,
    parent: ET.Element,
    items: Sequence[tuple[_Sample, str]],
    left: float,
    right: float,
    top: float,
) -> float:
    """Legend items (a sample, then its label) placed left to right, wrapping at
    ``right``; returns the baseline after the last row."""
    x, y = left, top
    for sample, label in items:
        needed = 34 + 6.3 * len(label)
        if x > left and x + needed > right:
            x, y = left, y + 18
        sample.draw(parent, x, y)
        canvas.text(parent, x + 32, y, label)
        x += needed + 18
    return y + 18


def _free_spot(placed: list[tuple[float, float]], x: float, y: float) -> tuple[float, float]:
    """A place for a point's label at or above (x, y) that no earlier label takes (labels
    of points close together step upwards); the place is then taken."""
    while any(abs(x - px) < 11 and abs(y - py) < 11 for px, py in placed):
        y -= 11
    placed.append((x, y))
    return x, y


def psychro_alt(chart: PsychroChart, title: str) -> str:
    """The report's alt text (and caption) for the chart: what it shows, in one line."""
    rooms = len(chart.rooms)
    what = f"{rooms} room{'s' if rooms != 1 else ''}" + (
        " and the outdoor air" if chart.outdoor is not None else ""
    )
    return (
        f"Psychrometric chart, {visible(title)}: {what} against the saturation curve and the "
        f"{chart.line('mould_limit').rh_pct:g} % RH line"
    )


def psychro_description(chart: PsychroChart, title: str) -> str:
    """The SVG's own description: the alt text, then where each point lies."""
    d = words.Display(chart.system)
    places = [
        f"{visible(p.name)} {d.temperature(p.dry_bulb_c)} and {p.rh_pct:.0f} % RH, "
        f"{d('humidity_ratio', p.humidity_ratio_kg_per_kg)}"
        for p in chart.points
    ]
    return (
        f"{psychro_alt(chart, title)}, humidity ratio against dry bulb at "
        f"{d('pressure', chart.pressure_pa)}. " + "; ".join(places) + "."
    )


def psychro_svg(chart: PsychroChart, title: str) -> str:
    """The chart as an SVG document (text), titled ``title`` (user text allowed)."""
    d = words.Display(chart.system)
    width, plot_h = 760.0, 330.0
    frame = _Frame(72.0, 46.0, 600.0, plot_h)
    legend_top = frame.bottom + 58
    rows = len(chart.points)
    height = legend_top + 18 * 4 + 34 * rows
    pressure = d("pressure", chart.pressure_pa)
    canvas = _Canvas(width, height, title, psychro_description(chart, title))
    canvas.text(canvas.root, frame.left, 22, title, 90, font_size="15", font_weight="bold")
    canvas.text(canvas.root, frame.left, 38, f"Psychrometric chart at {pressure}", fill=MUTED)
    xa, ya = chart.x_axis, chart.y_axis
    ticks = [(frame.px(xa, t), _n(t)) for t in xa.ticks]
    _axes(canvas, frame, ticks, ya, f"{xa.label}, {xa.unit}")

    def at(dry_bulb_c: float, w: float) -> tuple[float, float]:
        return frame.px(xa, chart.x(dry_bulb_c)), frame.py(ya, chart.y(w))

    curves = canvas.group("curves")
    styles: dict[str, dict[str, str]] = {
        "guide": {"stroke": GUIDE, "stroke_width": "1"},
        "frost": {"stroke": FROST, "stroke_width": "1.5", "stroke_dasharray": "2 3"},
        "mould_limit": {"stroke": MOULD, "stroke_width": "1.8", "stroke_dasharray": "7 4"},
        "saturation": {"stroke": SATURATION, "stroke_width": "2.2"},
    }
    for key in ("guide", "frost", "mould_limit", "saturation"):
        for line in chart.lines:
            if line.key != key:
                continue
            points = [at(p.dry_bulb_c, p.humidity_ratio_kg_per_kg) for p in line.points]
            canvas.path(curves, points, **styles[key])
            if key == "guide" and points:
                x, y = points[-1]
                canvas.text(curves, x + 4, y + 4, f"{line.rh_pct:g} %", fill=MUTED, font_size="10")
    marks = canvas.group("points")
    placed: list[tuple[float, float]] = []
    for point in chart.points:
        x, y = at(point.dry_bulb_c, point.humidity_ratio_kg_per_kg)
        if point.coldest is not None:
            dew_x, _ = at(point.dew_point_c, point.humidity_ratio_kg_per_kg)
            sx, sy = at(point.coldest.surface_temp_c, point.coldest.humidity_ratio_kg_per_kg)
            canvas.line(
                marks, x, y, dew_x, y, stroke=MUTED, stroke_width="1", stroke_dasharray="3 3"
            )
            colour = CONDENSING if point.coldest.condensing else ROOM
            _marker(
                marks,
                "diamond",
                sx,
                sy,
                4.0,
                fill=colour if point.coldest.condensing else "#ffffff",
                stroke=colour,
                stroke_width="1.5",
            )
            lx, ly = _free_spot(placed, sx - 6, sy - 6)
            canvas.text(marks, lx, ly, point.mark, text_anchor="end", font_size="10", fill=colour)
        if point.outdoor:
            _marker(marks, "square", x, y, 4.5, fill=OUTDOOR, stroke="#ffffff", stroke_width="1")
            colour = OUTDOOR
        else:
            colour = CONDENSING if point.condensing else ROOM
            _marker(marks, "circle", x, y, 5.0, fill=colour, stroke="#ffffff", stroke_width="1")
        lx, ly = _free_spot(placed, x + 7, y - 6)
        canvas.text(marks, lx, ly, point.mark, font_weight="bold", fill=colour)
    bottom = _psychro_legend(canvas, chart, d, frame.left, legend_top)
    canvas.size(width, bottom)
    return canvas.serialise()


def _psychro_legend(
    canvas: _Canvas, chart: PsychroChart, d: words.Display, left: float, top: float
) -> float:
    """The key to the lines and marks, then one entry per point; returns the last baseline."""
    legend = canvas.group("legend")
    styles = {
        "saturation": {"stroke": SATURATION, "stroke_width": "2.2"},
        "mould_limit": {"stroke": MOULD, "stroke_width": "1.8", "stroke_dasharray": "7 4"},
        "frost": {"stroke": FROST, "stroke_width": "1.5", "stroke_dasharray": "2 3"},
    }
    items: list[tuple[_Sample, str]] = [
        (_Sample(style=styles[line.key]), line.label) for line in chart.lines if line.key in styles
    ]
    items += [
        (_Sample(shape="circle", colour=ROOM), "room air"),
        (_Sample(shape="circle", colour=CONDENSING), "room air: water or frost on a surface"),
        (_Sample(shape="square", colour=OUTDOOR), "outdoor air"),
        (_Sample(shape="diamond", colour=CONDENSING), "coldest surface (hollow: dry)"),
    ]
    right = left + 680
    y = _flow(canvas, legend, items, left, right, top)
    canvas.text(
        legend,
        left,
        y,
        "Dotted from a room's point: its air cooled at constant moisture, meeting the curve "
        "at its dew point.",
        fill=MUTED,
        font_size="11",
    )
    y += 22
    for index, point in enumerate(chart.points):
        colour = OUTDOOR if point.outdoor else CONDENSING if point.condensing else ROOM
        canvas.text(legend, left, y, point.mark, font_weight="bold", fill=colour)
        state, details = _point_lines(chart, d, index)
        entry = ET.SubElement(legend, "text", {"x": _n(left + KEY_INDENT), "y": _n(y)})
        name = ET.SubElement(entry, "tspan", {"font-weight": "bold"})
        name.text = _text(point.name, NAME_CHARS)
        name.tail = " — " + state
        if details:
            canvas.text(legend, left + KEY_INDENT, y + 15, details, 108, fill=MUTED, font_size="11")
        y += 34 if details else 20
    return y


# --- time series -----------------------------------------------------------------------------


def _time_ticks(chart: TimeSeriesChart, count: int = 5) -> list[tuple[dt.datetime, str]]:
    span = (chart.end - chart.start).total_seconds()
    if span <= 0:
        return [(chart.start, chart.start.strftime("%d %b %H:%M"))]
    form = "%d %b" if span >= 3 * 86400 else "%d %b %H:%M"
    step = span / (count - 1)
    return [
        (at, at.strftime(form))
        for at in (chart.start + dt.timedelta(seconds=step * i) for i in range(count))
    ]


def series_svg(chart: TimeSeriesChart, describe: Callable[[float], str] | None = None) -> str:
    """A small time-series chart as an SVG document (text); ``describe`` writes a value for
    the description read by screen readers (default: the number and the chart's unit)."""
    width = 640.0
    frame = _Frame(64.0, 34.0, 540.0, 170.0)
    rows = len(chart.series) + len(chart.guides)
    height = frame.bottom + 52 + 18 * rows
    describe = describe or (lambda v: f"{_n(v)} {chart.unit}".strip())
    ranges = [
        f"{s.name}: {describe(min(s.values))} to {describe(max(s.values))}"
        for s in chart.series
        if s.values
    ]
    canvas = _Canvas(width, height, chart.title, "; ".join(ranges) or chart.title)
    canvas.text(canvas.root, frame.left, 20, chart.title, 80, font_size="14", font_weight="bold")
    ticks = [
        (frame.left + chart.x_fraction(at) * frame.width, label) for at, label in _time_ticks(chart)
    ]
    _axes(canvas, frame, ticks, chart.y_axis, "", edge_anchors=True)
    plot = canvas.group("series")
    for guide in chart.guides:
        y = frame.py(chart.y_axis, guide.value)
        canvas.line(plot, frame.left, y, frame.right, y, **GUIDE_STYLE)
    for number, series in enumerate(chart.series):
        colour = SERIES_COLOURS[number % len(SERIES_COLOURS)]
        dash = SERIES_DASHES[number % len(SERIES_DASHES)]
        points = [
            (frame.left + chart.x_fraction(at) * frame.width, frame.py(chart.y_axis, v))
            for at, v in zip(series.times, series.values, strict=True)
        ]
        style = {"stroke": colour, "stroke_width": "1.8"}
        if dash:
            style["stroke_dasharray"] = dash
        canvas.path(plot, points, **style)
        for x, y in points if len(points) <= 60 else ():
            _marker(plot, "circle", x, y, 2.6, fill=colour)
    legend = canvas.group("legend")
    y = frame.bottom + 52
    for number, series in enumerate(chart.series):
        colour = SERIES_COLOURS[number % len(SERIES_COLOURS)]
        style = {"stroke": colour, "stroke_width": "1.8"}
        dash = SERIES_DASHES[number % len(SERIES_DASHES)]
        if dash:
            style["stroke_dasharray"] = dash
        canvas.line(legend, frame.left, y - 4, frame.left + 26, y - 4, **style)
        canvas.text(legend, frame.left + 32, y, series.name, NAME_CHARS * 2)
        y += 18
    for guide in chart.guides:
        canvas.line(legend, frame.left, y - 4, frame.left + 26, y - 4, **GUIDE_STYLE)
        canvas.text(legend, frame.left + 32, y, f"{guide.name}: {describe(guide.value)}", 100)
        y += 18
    return canvas.serialise()
