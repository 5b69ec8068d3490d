"""The charts: their data lies where the core puts every state (checked against psychrolib
directly and CoolProp as outside references), the IP axes convert exactly, the SVG is
well-formed XML with no script, no event attribute and no link, hostile room names show
literally, the report links its charts (and the HTML carries them inline), and the app's
chart screen opens at 80×24 and names the rooms."""

from __future__ import annotations

import base64
import datetime as dt
import re
import shutil
import subprocess
import sys
import xml.etree.ElementTree as ET
from pathlib import Path

import CoolProp.CoolProp as CP
import msgspec
import psychrolib
import pytest

from survey import chart, evaluate, psychro, report, store
from survey import thresholds as th
from survey.cli import main
from survey.report import svg

ROOT = Path(__file__).resolve().parents[1]
FLAT = ROOT / "example_sites" / "winter-flat-bedroom-mould.json"
BASEMENT = ROOT / "example_sites" / "basement-burst-pipe-drying.json"
SVG_NS = "{http://www.w3.org/2000/svg}"

#: Room names a person might type that are markup somewhere (HTML/XML, Rich, Markdown) or
#: control characters.
HOSTILE = (
    "<script>alert(1)</script>",
    "A & B <b>",
    '"x" onload="alert(1)"',
    "]]> [b]bold[/b] *stars*",
    "red\x1b[31m",
)


def _chart(path: Path = FLAT, visit: int = -1, system: str = "si") -> chart.PsychroChart:
    return chart.psychro_chart(evaluate.assess_visit(store.load_survey(path), visit), system)


def _hostile_survey():
    survey = store.load_survey(FLAT)
    rooms = [
        msgspec.structs.replace(room, name=HOSTILE[i % len(HOSTILE)])
        for i, room in enumerate(survey.rooms)
    ]
    return msgspec.structs.replace(survey, rooms=rooms)


# --- the curves --------------------------------------------------------------------------


def test_saturation_curve_is_psychro_and_psychrolib_saturation():
    """Every saturation point is psychro's 100 % RH state at that dry bulb and the chart's
    pressure; above the triple point also psychrolib's GetSatHumRatio (ASHRAE ch. 1
    eqn 23), to 1e-12 relative."""
    c = _chart()
    line = c.line("saturation")
    assert line.rh_pct == 100.0 and len(line.points) > 20
    for t, w in line.points:
        assert w == pytest.approx(
            psychro.state_from_rh(t, 100.0, c.pressure_pa).humidity_ratio_kg_per_kg, rel=1e-12
        )
        if t > psychro.TRIPLE_POINT_C:
            assert w == pytest.approx(psychrolib.GetSatHumRatio(t, c.pressure_pa), rel=1e-12)


def test_saturation_curve_agrees_with_coolprop():
    """CoolProp's real-gas moist air (HAPropsSI, an independent reference) gives the same
    saturation humidity ratio within 0.6 % from −5 to 25 °C (the spread the ideal-gas
    ASHRAE formulas show against it; check-values.md)."""
    c = _chart()
    for t, w in c.line("saturation").points:
        if t > psychro.TRIPLE_POINT_C:
            ref = CP.HAPropsSI("W", "T", t + 273.15, "P", c.pressure_pa, "R", 1.0)
            assert w == pytest.approx(ref, rel=0.006)


def test_mould_limit_line_is_80_percent_rh():
    """The mould-limit line is the threshold's 80 % (BS 5250:2002 Annex D [R]) and each of
    its points psychro's 80 % RH state; above 0 °C psychrolib's GetHumRatioFromRelHum."""
    c = _chart()
    line = c.line("mould_limit")
    assert line.rh_pct == th.value("surface_rh_mould_limit_pct") == 80.0
    for t, w in line.points:
        assert w == pytest.approx(
            psychro.state_from_rh(t, 80.0, c.pressure_pa).humidity_ratio_kg_per_kg, rel=1e-12
        )
        if t > psychro.TRIPLE_POINT_C:
            assert w == pytest.approx(
                psychrolib.GetHumRatioFromRelHum(t, 0.8, c.pressure_pa), rel=1e-12
            )
    saturation = dict(c.line("saturation").points)
    assert all(w < saturation[t] for t, w in line.points)


def test_frost_curve_is_psychrolib_saturation_over_ice():
    """Below the triple point the frost curve is psychrolib's GetSatHumRatio, which uses
    saturation over ice there (ASHRAE ch. 1 eqn 5), and lies under the curve over water."""
    c = _chart()  # the flat's outdoor air at 2 °C takes the range below 0 °C
    frost = c.line("frost")
    water = dict(c.line("saturation").points)
    assert frost.points and all(t <= psychro.TRIPLE_POINT_C for t, _ in frost.points)
    for t, w in frost.points:
        assert w == pytest.approx(psychrolib.GetSatHumRatio(t, c.pressure_pa), rel=1e-9)
        if t < -0.5:
            assert w < water[t]


def test_no_frost_curve_when_the_range_stays_above_freezing():
    """The basement's first visit (outdoors 6 °C) charts from 0 °C: no frost curve."""
    c = _chart(BASEMENT, 0)
    assert c.dry_bulb_low_c >= 0.0
    assert all(line.key != "frost" for line in c.lines)


def test_range_covers_every_point_with_margin():
    """Every air state and coldest surface lies at least 3 K inside the dry-bulb range, whose
    ends are whole multiples of 5 °C; the top of the humidity-ratio axis is the saturation
    curve's highest point."""
    for path in (FLAT, BASEMENT):
        c = _chart(path)
        temps = [p.dry_bulb_c for p in c.points] + [
            p.coldest.surface_temp_c for p in c.rooms if p.coldest is not None
        ]
        assert c.dry_bulb_low_c <= min(temps) - chart.MARGIN_K
        assert c.dry_bulb_high_c >= max(temps) + chart.MARGIN_K
        assert c.dry_bulb_low_c % 5 == 0 and c.dry_bulb_high_c % 5 == 0
        assert c.line("saturation").points[-1].dry_bulb_c == c.dry_bulb_high_c
        assert c.y_axis.high == pytest.approx(c.y(c.line("saturation").points[-1][1]))


# --- the points --------------------------------------------------------------------------


def test_each_room_lies_where_the_assessment_puts_it():
    """Each room's point is its assessed air: dry bulb, RH and humidity ratio equal the
    assessment's; the dew point is psychrolib's GetTDewPointFromRelHum (all these rooms
    are above 0 °C); name and order follow the assessment."""
    va = evaluate.assess_visit(store.load_survey(FLAT))
    c = chart.psychro_chart(va)
    assert [p.name for p in c.rooms] == [f.name for f in va.findings.rooms]
    assert [p.mark for p in c.rooms] == [str(i + 1) for i in range(len(c.rooms))]
    for point, f in zip(c.rooms, va.findings.rooms, strict=True):
        assert point.dry_bulb_c == f.air.dry_bulb_c and point.rh_pct == f.air.rh_pct
        assert point.humidity_ratio_kg_per_kg == pytest.approx(
            f.air.humidity_ratio_kg_per_kg, rel=1e-12
        )
        assert point.humidity_ratio_kg_per_kg == pytest.approx(
            psychrolib.GetHumRatioFromRelHum(f.air.dry_bulb_c, f.air.rh_pct / 100, c.pressure_pa),
            rel=1e-12,
        )
        assert point.dew_point_c == pytest.approx(
            psychrolib.GetTDewPointFromRelHum(f.air.dry_bulb_c, f.air.rh_pct / 100), abs=1e-6
        )
        assert point.condensation_point_c == pytest.approx(f.air.condensation_point_c, abs=1e-9)
        assert not point.outdoor and point.worst_words


def test_outdoor_point_is_the_visits_outdoor_reading():
    """The outdoor point is the visit's outdoor reading (flat: 2 °C, 85 %), humidity ratio
    from psychrolib; listed first among the points, marked O."""
    c = _chart()
    out = c.outdoor
    assert out is not None and out.outdoor and out.mark == "out" and c.points[0] is out
    assert (out.dry_bulb_c, out.rh_pct) == (2.0, 85.0)
    assert out.humidity_ratio_kg_per_kg == pytest.approx(
        psychrolib.GetHumRatioFromRelHum(2.0, 0.85, c.pressure_pa), rel=1e-12
    )


def test_coldest_surface_sits_on_the_saturation_curve():
    """Each room's coldest surface is its lowest surface temperature, placed at psychrolib's
    saturation humidity ratio there; a surface the assessment finds condensing lies under
    the room's own humidity ratio (the room air reaches saturation above it), a dry one
    above."""
    va = evaluate.assess_visit(store.load_survey(FLAT))
    c = chart.psychro_chart(va)
    seen_wet = seen_dry = False
    for point, f in zip(c.rooms, va.findings.rooms, strict=True):
        coldest = min(f.surfaces, key=lambda s: s.surface_temp_c)
        assert point.coldest is not None
        assert point.coldest.surface_temp_c == coldest.surface_temp_c
        assert point.coldest.humidity_ratio_kg_per_kg == pytest.approx(
            psychrolib.GetSatHumRatio(coldest.surface_temp_c, c.pressure_pa), rel=1e-12
        )
        if point.coldest.condensing:
            seen_wet = True
            assert point.coldest.humidity_ratio_kg_per_kg < point.humidity_ratio_kg_per_kg
            assert point.condensing
        elif coldest.surface_rh_pct < 100.0:
            seen_dry = True
            assert point.coldest.humidity_ratio_kg_per_kg > point.humidity_ratio_kg_per_kg
    assert seen_wet and seen_dry  # the flat has both: streaming glass, a dry kitchen reveal


def test_worst_words_name_the_wet_surface_first():
    """A room with water forming on a surface says so first (words.short_verdict of that
    surface), whatever else is near a limit."""
    c = _chart()
    for point in c.rooms:
        if point.condensing:
            assert point.worst_words.startswith(("water forming", "frost forming"))


# --- units -------------------------------------------------------------------------------


def test_ip_axes_convert_exactly():
    """IP: x in °F (°F = 1.8 °C + 32, exact by definition) and y in grains per pound
    (1 lb = 7000 grains exactly: 1 gr = 64.79891 mg, 1 lb = 0.45359237 kg)."""
    si, ip = _chart(system="si"), _chart(system="ip")
    assert (ip.x_axis.unit, ip.y_axis.unit) == ("°F", "gr/lb")
    assert (si.x_axis.unit, si.y_axis.unit) == ("°C", "g/kg")
    assert ip.y(0.01) == pytest.approx(70.0, rel=1e-12)
    assert ip.y(1.0) == pytest.approx(0.45359237 / 64.79891e-6, rel=1e-12)
    assert ip.x(20.0) == pytest.approx(68.0, abs=1e-9) and ip.x(-40.0) == pytest.approx(-40.0)
    assert si.y(0.01) == pytest.approx(10.0, rel=1e-12) and si.x(20.0) == 20.0
    for point in ip.points:  # the same SI states, shown in IP
        assert ip.y(point.humidity_ratio_kg_per_kg) == pytest.approx(
            7000.0 * point.humidity_ratio_kg_per_kg, rel=1e-12
        )
    assert ip.x_axis.low % 10 == pytest.approx(0.0, abs=1e-6)  # range ends on 10 °F
    assert all(ip.x_axis.low <= t <= ip.x_axis.high for t in ip.x_axis.ticks)


def test_nice_ticks():
    """Ticks are 1, 2 or 5 × 10ⁿ apart, inside the range (hand-checked cases)."""
    assert chart.nice_ticks(-5.0, 25.0, 6) == (-5.0, 0.0, 5.0, 10.0, 15.0, 20.0, 25.0)
    assert chart.nice_ticks(0.0, 20.17, 6) == (0.0, 5.0, 10.0, 15.0, 20.0)
    assert chart.nice_ticks(30.0, 80.0, 6) == (30.0, 40.0, 50.0, 60.0, 70.0, 80.0)


# --- the time-series chart ---------------------------------------------------------------


T0 = dt.datetime(2025, 2, 3, 10, 0)


def _series() -> chart.TimeSeriesChart:
    return chart.time_series_chart(
        "Humidity ratio",
        [
            ("Family <room>", [(T0 + dt.timedelta(days=2), 0.0071), (T0, 0.0102)]),
            ("Outdoors", [(T0, 0.0051)]),
        ],
        quantity="humidity_ratio",
        y_label="Humidity ratio",
        guides=[("Goal & limit", 0.007)],
        system="ip",
    )


def test_time_series_converts_sorts_and_covers():
    """Values and guides are converted by the chart (kg/kg × 7000 = gr/lb), points sorted by
    time, the time span is the series', and the y axis covers every value and guide."""
    c = _series()
    assert c.unit == "gr/lb" and c.y_label == "Humidity ratio"
    family = c.series[0]
    assert family.times == (T0, T0 + dt.timedelta(days=2))
    assert family.values == pytest.approx((71.4, 49.7), rel=1e-12)
    assert c.guides[0].value == pytest.approx(49.0, rel=1e-12)
    assert (c.start, c.end) == (T0, T0 + dt.timedelta(days=2))
    values = [v for s in c.series for v in s.values] + [c.guides[0].value]
    assert c.y_axis.low <= min(values) and c.y_axis.high >= max(values)
    assert c.x_fraction(T0 + dt.timedelta(days=1)) == pytest.approx(0.5)


def test_time_series_without_quantity_keeps_values():
    """Without a quantity values stay as given (an index 0-6, an RH) with the unit named;
    fixed axis ends are kept; no point at all is refused."""
    c = chart.time_series_chart(
        "Index", [("Wall", [(T0, 1.5), (T0 + dt.timedelta(hours=6), 2.0)])], y_low=0, y_high=6
    )
    assert c.series[0].values == (1.5, 2.0) and c.unit == ""
    assert (c.y_axis.low, c.y_axis.high) == (0, 6)
    with pytest.raises(ValueError, match="at least one point"):
        chart.time_series_chart("Empty", [("none", [])])


# --- the SVG -----------------------------------------------------------------------------


def _check_svg(text: str) -> ET.Element:
    """Well-formed XML whose root is an SVG; no script element, no on* attribute, no link
    or reference of any kind (href, xlink:href, url(...) or a URL)."""
    root = ET.fromstring(text)
    assert root.tag == SVG_NS + "svg"
    for element in root.iter():
        assert element.tag.rsplit("}", 1)[-1].lower() not in ("script", "foreignobject", "a")
        for name, value in element.attrib.items():
            local = name.rsplit("}", 1)[-1].lower()
            assert not local.startswith("on"), name
            assert local != "href", name
            assert "url(" not in value and "://" not in value.replace(SVG_NS[1:-1], "")
    assert "<script" not in text.lower()
    return root


def _texts(root: ET.Element) -> str:
    return "\n".join("".join(e.itertext()) for e in root.iter(SVG_NS + "text"))


@pytest.mark.parametrize("system", ["si", "ip"])
def test_psychro_svg_is_safe_xml_with_hostile_names(system):
    """The chart of rooms named like markup parses as XML, holds no script, event attribute
    or link, and shows each name literally (control characters as visible escapes)."""
    survey = _hostile_survey()
    c = chart.psychro_chart(evaluate.assess_visit(survey), system)
    root = _check_svg(svg.psychro_svg(c, "Visit <1> & 'all'"))
    shown = _texts(root)
    for name in HOSTILE[:4]:
        assert name in shown
    assert "red\\x1b[31m" in shown and "\x1b" not in shown
    assert "Visit <1> & 'all'" in "".join(root.find(SVG_NS + "title").itertext())
    unit = "°F" if system == "ip" else "°C"
    assert f"Dry bulb, {unit}" in shown


def test_psychro_svg_draws_every_point():
    """One labelled mark per point (its mark text in the plot) and one legend entry per
    point naming it."""
    c = _chart(BASEMENT)
    root = _check_svg(svg.psychro_svg(c, "Visit 3"))
    points = root.find(f"{SVG_NS}g[@class='points']")
    labels = [e.text for e in points.iter(SVG_NS + "text")]
    for p in c.points:
        assert p.mark in labels
        assert p.name in _texts(root)
    assert len(points.findall(SVG_NS + "circle")) == len(c.rooms)


def test_series_svg_is_safe_xml():
    """The time-series SVG parses, has no script or link, and shows its names literally."""
    root = _check_svg(svg.series_svg(_series()))
    assert "Family <room>" in _texts(root) and "Goal & limit" in _texts(root)
    assert len(root.findall(f".//{SVG_NS}g[@class='series']/{SVG_NS}path")) == 2


# --- the report --------------------------------------------------------------------------


@pytest.fixture
def basement(tmp_path):
    path = tmp_path / "basement.json"
    shutil.copy(BASEMENT, path)
    return path


def test_report_links_a_chart_per_visit(basement, capsys):
    """`survey report --visit all` writes REPORT-chart-N.svg beside the Markdown for each
    visit and links each as an image with alt text; each file is a safe SVG."""
    assert main(["report", str(basement), "--visit", "all"]) == 0
    text = basement.with_name("basement-report.md").read_text(encoding="utf-8")
    links = re.findall(r"!\[([^\]]+)\]\((basement-report-chart-\d\.svg)\)", text)
    assert [link for _, link in links] == [f"basement-report-chart-{n}.svg" for n in (1, 2, 3)]
    for alt, link in links:
        assert alt.startswith("Psychrometric chart")
        _check_svg((basement.parent / link).read_text(encoding="utf-8"))
    assert "basement-report-chart-3.svg" in capsys.readouterr().out


def test_report_names_its_chart_after_the_report(basement, tmp_path):
    """With -o the chart takes the report's name, beside it."""
    out = tmp_path / "out" / "site.md"
    out.parent.mkdir()
    assert main(["report", str(basement), "-o", str(out)]) == 0
    assert "](site-chart-3.svg)" in out.read_text(encoding="utf-8")
    assert (out.parent / "site-chart-3.svg").is_file()


def test_html_report_carries_its_chart_inline(basement):
    """--html writes no chart file: the page holds the chart's SVG as a data: URI, the same
    SVG the Markdown report links, and still no script."""
    assert main(["report", str(basement), "--html"]) == 0
    page = basement.with_name("basement-report.html").read_text(encoding="utf-8")
    assert not list(basement.parent.glob("*.svg"))
    found = re.findall(
        r'<img src="data:image/svg\+xml;base64,([A-Za-z0-9+/=]+)" alt="([^"]+)"', page
    )
    assert len(found) == 1 and found[0][1].startswith("Psychrometric chart")
    inline = base64.b64decode(found[0][0]).decode("utf-8")
    _check_svg(inline)
    options = report.ReportOptions(chart_stem="basement-report", source_name="basement.json")
    survey = store.load_survey(basement)
    _, charts = report.build_with_charts(survey, options)
    assert inline == charts[0].svg
    assert "<script" not in page


def test_no_charts_without_a_chart_stem():
    """The report built without a chart stem (the library default) links no chart."""
    doc, charts = report.build_with_charts(store.load_survey(FLAT), report.ReportOptions())
    assert charts == () and ".svg" not in report.render(doc)


# --- start-up ----------------------------------------------------------------------------


def test_app_start_up_does_not_load_plotext():
    """The app's modules up to the room list load neither plotext nor the chart screen."""
    code = (
        "import survey.app.main, survey.app.rooms, survey.app.help, sys\n"
        "print(any(m.startswith(('plotext', 'textual_plotext', 'survey.app.chart'))"
        " for m in sys.modules))"
    )
    out = subprocess.run([sys.executable, "-c", code], capture_output=True, text=True, check=True)
    assert out.stdout.strip() == "False"


def test_writing_markdown_alone_does_not_load_the_svg_writer():
    """A report built without charts never imports the SVG module."""
    code = (
        "import sys\n"
        "from survey import report, store\n"
        f"report.markdown_report(store.load_survey({str(FLAT)!r}))\n"
        "print('survey.report.svg' in sys.modules)"
    )
    out = subprocess.run([sys.executable, "-c", code], capture_output=True, text=True, check=True)
    assert out.stdout.strip() == "False"


# --- the app -----------------------------------------------------------------------------


async def test_chart_screen_opens_and_names_the_rooms(tmp_path, monkeypatch):
    """On the room list, c opens the chart screen at 80×24: the plot is drawn and the table
    names the outdoor air and every room literally (markup-like names too); the light
    theme redraws it; c goes back to the room list."""
    from textual.widgets import DataTable, Static

    from survey.app import make_app
    from survey.app.chart import ChartScreen, PsychroPlot
    from survey.app.walk import cut
    from survey.safe_text import visible

    monkeypatch.chdir(tmp_path)
    path = tmp_path / "flat.json"
    survey = _hostile_survey()
    path.write_bytes(store.dumps_survey(survey))
    app = make_app(path, data_dir=tmp_path / "data", clock=lambda: dt.datetime(2026, 12, 1, 9))
    async with app.run_test(size=(80, 24)) as pilot:
        await pilot.pause()
        assert type(app.screen).__name__ == "RoomListScreen"
        await pilot.press("c")
        await pilot.pause()
        assert isinstance(app.screen, ChartScreen)
        table = app.screen.query_one(DataTable)
        names = [str(table.get_row_at(i)[1]) for i in range(table.row_count)]
        assert names[0] == "Outdoors"
        assert names[1:] == [visible(cut(r.name, 24)) for r in survey.rooms]
        detail = app.screen.query_one("#chart-detail", Static)
        await pilot.press("down")  # the first room: its whole name and worst surface below
        await pilot.pause()
        shown = str(detail.render())
        assert shown.startswith(survey.rooms[0].name) and "worst: water forming" in shown
        plot = app.screen.query_one(PsychroPlot)
        assert plot.size.height >= 8 and plot.size.width >= 60
        rendered = str(plot.render())
        assert "saturation" in rendered and "80 % RH" in rendered
        app.theme = "textual-light"
        await pilot.pause()
        assert "saturation" in str(plot.render())
        await pilot.press("c")
        await pilot.pause()
        assert type(app.screen).__name__ == "RoomListScreen"


# --- visits with little to chart ---------------------------------------------------------


def _bare_visit_survey(outdoor: bool):
    """The flat with its visit's air readings taken away (surfaces and outdoor kept or not)."""
    survey = store.load_survey(FLAT)
    visit = survey.visits[0]
    rooms = [msgspec.structs.replace(rv, air=None) for rv in visit.rooms]
    visit = msgspec.structs.replace(visit, rooms=rooms, outdoor=visit.outdoor if outdoor else None)
    return msgspec.structs.replace(survey, visits=[visit])


def test_visit_with_nothing_measured_gets_no_chart():
    """No air reading indoors or out: the report links no chart and writes none."""
    options = report.ReportOptions(chart_stem="r")
    doc, charts = report.build_with_charts(_bare_visit_survey(False), options)
    assert charts == () and ".svg" not in report.render(doc)


def test_visit_with_only_the_outdoor_air_charts_it():
    """Only the outdoor air read: the chart holds that one point, no room."""
    va = evaluate.assess_visit(_bare_visit_survey(True))
    c = chart.psychro_chart(va)
    assert c.rooms == () and c.points == (c.outdoor,)
    _check_svg(svg.psychro_svg(c, "Outdoor only"))


def test_chart_pressure_is_the_assessments():
    """The curves are drawn at the visit's pressure as the assessment uses it (the flat's
    altitude gives less than sea-level pressure), so points and curves agree."""
    va = evaluate.assess_visit(store.load_survey(FLAT))
    c = chart.psychro_chart(va)
    assert c.pressure_pa == va.findings.pressure_pa < psychro.STANDARD_PRESSURE_PA


async def test_chart_screen_without_air_readings_says_so(tmp_path, monkeypatch):
    """A visit with no air reading: the chart screen says there is nothing to chart."""
    from textual.widgets import Static

    from survey.app import make_app

    monkeypatch.chdir(tmp_path)
    path = tmp_path / "bare.json"
    path.write_bytes(store.dumps_survey(_bare_visit_survey(False)))
    app = make_app(path, data_dir=tmp_path / "data")
    async with app.run_test(size=(80, 24)) as pilot:
        await pilot.pause()
        await pilot.press("c")
        await pilot.pause()
        note = app.screen.query_one("#chart-note", Static)
        assert "nothing to chart" in str(note.render())


async def test_series_plot_draws_a_time_series():
    """The app's SeriesPlot shows a time-series chart: its title and each series' name
    (control characters made visible), in the light theme too."""
    from textual.app import App

    from survey.app.chart import SeriesPlot

    data = chart.time_series_chart(
        "Drying\x1b[2J",
        [
            ("Screed [b]x", [(T0, 98.0), (T0 + dt.timedelta(days=1), 80.0)]),
            ("Wall", [(T0, 92.0), (T0 + dt.timedelta(days=2), 60.0)]),
        ],
        unit="WME %",
        guides=[("Dry standard", 44.0)],
    )

    class Host(App):
        def compose(self):
            yield SeriesPlot()

    app = Host()
    async with app.run_test(size=(80, 24)) as pilot:
        plot = app.query_one(SeriesPlot)
        plot.show(data)
        await pilot.pause()
        shown = str(plot.render())
        assert "Drying\\x1b[2J" in shown and "\x1b[2J" not in shown
        assert "Screed [b]x" in shown and "Wall" in shown
        app.theme = "textual-light"
        await pilot.pause()
        assert "Wall" in str(plot.render())


def test_chart_of_a_report_name_with_spaces(basement, tmp_path):
    """A report called "site (1) #2" links its chart percent-encoded (so the Markdown link
    holds), writes the file under its plain name, and the HTML of that name still carries
    the chart inline."""
    out = tmp_path / "site (1) #2.md"
    assert main(["report", str(basement), "-o", str(out)]) == 0
    assert "](site%20%281%29%20%232-chart-3.svg)" in out.read_text(encoding="utf-8")
    assert (tmp_path / "site (1) #2-chart-3.svg").is_file()
    page = tmp_path / "site (1) #2.html"
    assert main(["report", str(basement), "--html", "-o", str(page)]) == 0
    assert page.read_text(encoding="utf-8").count('src="data:image/svg+xml;base64,') == 1
