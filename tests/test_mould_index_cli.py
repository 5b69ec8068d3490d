"""``survey mould-index``, ``import-log --surface`` and the report's index section, on an
invented flat (tests/data/mould: a survey and three constructed logger files, written by a
formula for these tests: hourly from 3 Jan 2026 for 42 days).

The constructed surface logger: T = 12 + 1.5 sin(2π h/24) °C, RH = 88 − 6 sin(2π h/24) %,
14 points drier from day 15 to 22. Check values computed by hand: below 13.5 °C the critical
RH is at most 81.7 % (at 10.5 °C: −3.091 + 17.64 − 32.865 + 100), and the RH never falls
under 82 % outside the dry week, so every one of those steps favours growth: 15 days (360 h)
and, after the dry week (RH at most 80 %, under the critical RH), 479 h to the last sample.
The visit's temperature factor of the NE corner: (12 − 4) / (19 − 4) = 0.533.
"""

from __future__ import annotations

import json
import shutil
from pathlib import Path

import pytest
from CoolProp.CoolProp import PropsSI

from survey import mould_series, store
from survey.cli import main
from survey.commands.mould_index import CLASS_CHOICES
from survey.mould_index import CLASS_KEYS
from survey.report.build import ReportOptions, build
from survey.report.markdown import Items, render

DATA = Path(__file__).resolve().parent / "data" / "mould"
CORNER = "NE corner behind wardrobe"


def _main(capsys, *argv):
    try:
        status = main(list(argv))
    except SystemExit as exc:
        status = exc.code
    captured = capsys.readouterr()
    return status, captured.out, captured.err


@pytest.fixture
def flat(tmp_path):
    for name in ("flat.json", "surface-logger.csv", "room-air.csv", "outdoor.csv"):
        shutil.copy(DATA / name, tmp_path / name)
    return tmp_path


@pytest.fixture
def logged(flat, capsys):
    path = str(flat / "flat.json")
    for args, name in (
        (("--room", "bed1", "--surface", "ne corner  behind wardrobe"), "surface-logger.csv"),
        (("--room", "bed1"), "room-air.csv"),
        (("--outdoor",), "outdoor.csv"),
    ):
        assert main(["import-log", path, *args, "--csv", str(flat / name)]) == 0
    capsys.readouterr()
    return flat


# --- import-log --surface ----------------------------------------------------------------


def test_import_log_on_a_surface_keeps_the_recorded_label(flat, capsys):
    """--surface matches a surface reading's location ignoring case and spaces, stores it as
    recorded, and reads the file's surface-temperature column."""
    status, out, _ = _main(
        capsys,
        "import-log",
        str(flat / "flat.json"),
        "--room",
        "bed1",
        "--surface",
        "NE CORNER behind wardrobe",
        "--csv",
        str(flat / "surface-logger.csv"),
    )
    assert status == 0
    assert f"into Main bedroom (bed1), on the surface '{CORNER}'" in out
    assert "temperature 'Surface temp (°C)'" in out
    (series,) = store.load_survey(flat / "flat.json").logs
    assert series.surface == CORNER and len(series.samples) == 1008


@pytest.mark.parametrize(
    ("args", "said"),
    [
        (("--room", "bed1", "--surface", "ceiling"), "--surface ceiling: no surface reading"),
        (("--outdoor", "--surface", "ceiling"), "--surface ceiling: a logger outdoors"),
    ],
)
def test_import_log_refuses_a_surface_it_cannot_place(flat, capsys, args, said):
    """An unknown surface (its surfaces are listed) or a surface outdoors: exit 2, nothing
    written."""
    before = (flat / "flat.json").read_bytes()
    status, _, err = _main(
        capsys, "import-log", str(flat / "flat.json"), *args, "--csv", str(flat / "room-air.csv")
    )
    assert status == 2 and said in err and len(err.strip().splitlines()) == 1
    if "--room" in args:
        assert f"'{CORNER}'" in err
    assert (flat / "flat.json").read_bytes() == before


def test_a_surface_logger_and_an_air_logger_at_the_same_times_are_both_kept(logged):
    """Samples at the same times from the room's air and from its surface are not repeats."""
    survey = store.load_survey(logged / "flat.json")
    assert [(log.surface, len(log.samples)) for log in survey.logs] == [
        (CORNER, 1008),
        (None, 1008),
        (None, 1008),
    ]


# --- mould-index -------------------------------------------------------------------------


def _json(capsys, folder, *args):
    status, out, err = _main(capsys, "mould-index", str(folder / "flat.json"), *args, "--json")
    assert status == 0, err
    return json.loads(out)


def test_json_for_the_surface_logger(logged, capsys):
    """The surface logger as it is: class from 'paint' (painted gypsum plaster: the painted
    face is sensitive, mould_series.CLASS_RULES), the favourable hours worked out by
    hand (360 + 479 h), the index within its class's range, the chart points' highest value
    the maximum, and the 30-day criterion exceeded (the RH averages 82-88 %)."""
    (series,) = _json(capsys, logged, "--room", "Main bedroom")["series"]
    assert series["basis"] == "surface_logger" and series["surface"] == CORNER
    assert (series["sensitivity_class"], series["class_word"]) == ("sensitive", "paint")
    assert series["samples"] == 1008 and series["favourable_h"] == 839.0
    assert [p["favourable_h"] for p in series["favourable_periods"]] == [360.0, 479.0]
    assert 0.0 < series["index_max"] <= 5.3
    assert max(v for _, v in series["index_series"]) == series["index_max"]
    assert series["ashrae160"]["state"] == "exceeded"
    assert "mould_index_decline_slow_per_h" in series["threshold_keys"]


def test_json_for_the_air_logger_through_the_measured_factor(logged, capsys):
    """--surface with the room's air logger: the factor measured on visit 1, 8/15 = 0.5333
    (computed by hand), and the outdoor logger named."""
    payload = _json(capsys, logged, "--room", "bed1", "--surface", CORNER, "--series", "2")
    (series,) = payload["series"]
    assert series["basis"] == "air_and_factor"
    assert series["frsi"] == pytest.approx(8 / 15, abs=1e-4) and series["frsi_visit"] == 1
    assert series["outdoor_sources"] == ["outdoor.csv"]


def test_stated_class_changes_the_result(logged, capsys):
    """--class resistant gives a lower index than the material's sensitive class."""
    sensitive = _json(capsys, logged, "--room", "bed1")["series"][0]
    resistant = _json(capsys, logged, "--room", "bed1", "--class", "resistant")["series"][0]
    assert resistant["class_basis"] == "stated"
    assert resistant["index_max"] < sensitive["index_max"]


def test_surface_from_room_air_against_coolprop():
    """Room air 19 °C / 55 % over a surface at 12 °C (outdoor 4 °C, factor 8/15): surface RH =
    55 % × psat(19 °C) / psat(12 °C) = 86.2 %, the saturation pressures from CoolProp (water),
    within 0.05 % RH. At 65 % the air's dew point (12.3 °C) is above the surface: read as
    100 % and counted."""
    from survey.model import LogSample

    air = [
        LogSample(at=t, dry_bulb_c=19.0, rh_pct=rh)
        for t, rh in zip(_times(3), (55.0, 55.0, 65.0), strict=True)
    ]
    outdoor = [LogSample(at=t, dry_bulb_c=4.0, rh_pct=85.0) for t in _times(3)]
    surface, left_out = mould_series.air_to_surface(air, outdoor, 8 / 15)
    expected = (
        55.0
        * PropsSI("P", "T", 292.15, "Q", 0, "Water")
        / PropsSI("P", "T", 285.15, "Q", 0, "Water")
    )
    assert left_out == 0 and surface.temps_c == pytest.approx([12.0] * 3)
    assert surface.rhs_pct[0] == pytest.approx(expected, abs=0.05)
    assert surface.rhs_pct[2] == 100.0 and surface.capped == 1


def _times(n):
    import datetime as dt

    return [dt.datetime(2026, 1, 1) + dt.timedelta(hours=h) for h in range(n)]


def test_text_reads_as_a_surveyors_summary(logged, capsys):
    """The text names the series, the highest index in words, the days, the periods with
    dates, ASHRAE 160's result, the class, the assumption and the model's limits; IP units
    write the temperatures in °F."""
    status, out, _ = _main(
        capsys, "mould-index", str(logged / "flat.json"), "--room", "bed1", "--units", "ip"
    )
    assert status == 0
    assert out.startswith(f"Logger surface-logger.csv on the surface {CORNER} (Main bedroom)")
    for said in (
        "Highest mould-growth index 0.",
        "At index 1 or more for 0.0 days",
        "in 2 periods: 3 Jan 2026 00:00 to 18 Jan 2026 00:00 (360 h favourable",
        "ASHRAE Standard 160-2009's simpler criterion",
        "is not met",
        "Material class: sensitive",
        "The logger sat on the surface",
        "rising to 100 % as the surface nears 32 °F",
        "not a laboratory test",
    ):
        assert said in out, said
    _, air, _ = _main(
        capsys, "mould-index", str(logged / "flat.json"), "--room", "bed1", "--surface", CORNER,
        "--series", "room-air.csv",
    )  # fmt: skip
    assert "a steady state that ignores the wall's heat storage" in air


@pytest.mark.parametrize(
    ("args", "status", "said"),
    [
        (("--room", "attic"), 2, "survey: --room attic: no such room"),
        (("--room", "kit"), 2, "survey: --room kit: no logger series"),
        (("--room", "bed1", "--series", "9"), 2, "survey: --series 9: the room's logger"),
        (
            ("--room", "bed1", "--series", "room-air.csv"),
            2,
            "survey: --surface (not given): this logger",
        ),
        (
            ("--room", "bed1", "--surface", "loft hatch"),
            2,
            "survey: --surface loft hatch: no surface",
        ),
        (("--room", "bed1", "--class", "porous"), 2, "invalid choice: 'porous'"),
    ],
)
def test_bad_options_exit_2_with_one_line(logged, capsys, args, status, said):
    code, out, err = _main(capsys, "mould-index", str(logged / "flat.json"), *args)
    assert (code, out) == (status, "")
    assert said in err and len(err.strip().splitlines()) == 1


def test_a_missing_survey_exits_1(tmp_path, capsys):
    code, _, err = _main(capsys, "mould-index", str(tmp_path / "none.json"), "--room", "bed1")
    assert code == 1 and err.startswith("survey: ") and len(err.strip().splitlines()) == 1


def test_class_choices_are_the_cores():
    assert CLASS_CHOICES == CLASS_KEYS


# --- the report --------------------------------------------------------------------------


def test_report_has_an_index_summary_per_series(logged):
    """Each room series gets its summary; the air logger is judged through the room's surface
    with the lowest measured factor (the NE corner, 0.533, below the reveal's 0.633 and the
    skirting's 0.667, computed by hand); the blocks carry the typed results for a chart."""
    survey = store.load_survey(logged / "flat.json")
    doc = build(survey, ReportOptions(generated_at="2026-02-14"))
    text = render(doc)
    assert "## Mould growth over the logged period" in text
    assert f"### Logger surface-logger.csv on the surface {CORNER} (Main bedroom)" in text
    assert f"### Logger room-air.csv in the air of Main bedroom, for the surface {CORNER}" in text
    blocks = [b for b in doc.blocks if isinstance(b, Items) and b.name == "mould_index"]
    judged = [b.values[0] for b in blocks]
    assert [j.source.surface for j in judged] == [CORNER, CORNER]
    assert judged[1].source.frsi == pytest.approx(8 / 15)
    assert judged[0].result.index.points(50)


def test_report_says_why_an_air_logger_is_not_judged(flat, capsys):
    """Without an outdoor logger the room-air series cannot give a surface's conditions: the
    report says so instead of guessing."""
    assert main(["import-log", str(flat / "flat.json"), "--room", "bed1", "--csv",
                 str(flat / "room-air.csv")]) == 0  # fmt: skip
    text = render(build(store.load_survey(flat / "flat.json")))
    assert "Not judged: it measured the room's air; working out a surface's" in text


def test_report_without_logger_series_has_no_index_section():
    from survey.report.build import build as build_report

    survey = store.load_survey(DATA / "flat.json")
    assert "Mould growth over the logged period" not in render(build_report(survey))


# --- the words ---------------------------------------------------------------------------


def _judged(days, rh):
    import datetime as dt

    from survey import mould_index as mi

    n = days * 24 + 1
    times = [dt.datetime(2026, 1, 1) + dt.timedelta(hours=h) for h in range(n)]
    s = mi.SurfaceSeries.from_samples(times, [20.0] * n, [rh] * n)
    result = mi.analyse(s, mi.ClassChoice("very_sensitive", "stated"))
    source = mould_series.SeriesSource(0, "corner.csv", "bed1", CORNER, "", "external_wall")
    return mould_series.LogIndex(source, result)


def test_words_for_visible_growth_carry_the_caution():
    """60 days at 20 °C / 97 %: visible growth likely (index 3 after about 21 days, from the
    published regression), with the mould caution and the 30-day criterion failed."""
    from survey.words import SI
    from survey.words import mould_index as mw

    text = " ".join(mw.summary_lines(_judged(60, 97.0), SI))
    assert "visible mould growth is likely on this surface" in text
    assert mw.VISIBLE_CAUTION in text and "licensed professionals" in text
    assert "Material class: very sensitive (untreated sawn timber), as stated." in text
    assert "is not met: the running mean reached 97.0 %" in text


def test_words_for_a_short_log_say_the_criterion_needs_a_month():
    """Under 30 days ASHRAE 160's criterion cannot be formed; the mean is given for
    comparison only."""
    from survey.words import SI
    from survey.words import mould_index as mw

    text = " ".join(mw.summary_lines(_judged(10, 75.0), SI))
    assert "needs 30 days of log; this one spans 10.0 days" in text
    assert "Its mean surface RH was 75.0 % at 20.0 °C, below 80 %: for comparison only." in text
    assert "below index 1, the model expects no growth" in text
    assert mw.VISIBLE_CAUTION not in text


def test_a_series_out_of_order_is_sorted_and_mixed_offsets_are_not_judged(logged):
    """A hand-edited series out of time order gives the same result as in order; one whose
    times mix UTC offsets and none is not judged, with the reason (the report still builds)."""
    import datetime as dt

    import msgspec

    survey = store.load_survey(logged / "flat.json")
    log = survey.logs[0]
    shuffled = msgspec.structs.replace(log, samples=log.samples[::-1])
    reordered = msgspec.structs.replace(survey, logs=[shuffled])
    first = mould_series.judge_survey(survey)[0]
    again = mould_series.judge_survey(reordered)[0]
    assert again.result.index_max == first.result.index_max
    utc = dt.UTC
    mixed_samples = [
        log.samples[0],
        msgspec.structs.replace(log.samples[1], at=log.samples[1].at.replace(tzinfo=utc)),
    ]
    mixed = msgspec.structs.replace(
        survey, logs=[msgspec.structs.replace(log, samples=mixed_samples)]
    )
    (judged,) = mould_series.judge_survey(mixed)
    assert judged.reason == "times_mixed"
    assert "mix some with a UTC offset" in render(build(mixed))


def test_report_draws_each_judged_series_index_beside_it(logged, capsys):
    """`survey report` writes one index chart per judged series beside the Markdown, links
    it as an image, and each chart's line is the index the summary states (its highest point
    is the result's maximum; the data, not the pixels, are checked)."""
    import xml.etree.ElementTree as ET

    from survey import chart
    from survey.report import build_with_charts

    path = logged / "flat.json"
    status, out, _ = _main(capsys, "report", str(path))
    assert status == 0 and "flat-report-mould-1.svg" in out and "flat-report-mould-2.svg" in out
    text = (logged / "flat-report.md").read_text(encoding="utf-8")
    assert "](flat-report-mould-1.svg)" in text and "](flat-report-mould-2.svg)" in text
    for n in (1, 2):
        svg_text = (logged / f"flat-report-mould-{n}.svg").read_text(encoding="utf-8")
        root = ET.fromstring(svg_text)
        assert not any(el.tag.endswith("script") for el in root.iter())
        assert "growth under a microscope" in svg_text and "visible growth" in svg_text
    survey = store.load_survey(path)
    judged = [
        b.values[0]
        for b in build(survey, ReportOptions()).blocks
        if isinstance(b, Items) and b.name == "mould_index"
    ]
    points = judged[0].result.index.points(400)
    assert max(p.value for p in points) == pytest.approx(judged[0].result.index_max)
    data = chart.time_series_chart("t", [("index", [(p.at, p.value) for p in points])])
    assert data.series[0].values == tuple(p.value for p in points)
    _, charts = build_with_charts(survey, ReportOptions(chart_stem="x"))
    assert [c.name for c in charts if "-mould-" in c.name] == ["x-mould-1.svg", "x-mould-2.svg"]
