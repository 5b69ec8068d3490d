"""The colder month at its edges: a mild day (the class line's factor held in check), room air
that would saturate in the month (not projected, said so), and a site's design month the
projection cannot use (refused by the store, said once in the report and the panel).

Saturation pressures in the hand arithmetic are psychrolib's (ASHRAE Handbook Fundamentals
2017 ch. 1 eqn 5 & 6), called here directly, not through the package; the class lines are
EN ISO 13788 Annex A's (tests/test_season.py, marked from memory there).
"""

from __future__ import annotations

import json
from pathlib import Path

import psychrolib
import pytest

from survey import assess, evaluate, season, season_math, store, words
from survey import thresholds as th
from survey.errors import InputError
from survey.season import DesignMonth, DesignState, ExcessModel, RoomReason
from survey.words import season as ws

psychrolib.SetUnitSystem(psychrolib.SI)
_psat = psychrolib.GetSatVapPres

ROOT = Path(__file__).resolve().parents[1]
FLAT = ROOT / "example_sites" / "winter-flat-bedroom-mould.json"


def _room(ti, rhi, te, rhe, surfaces=(("Corner", 15.5, "external_wall"),)):
    room = assess.RoomInput(
        "Room", "bedroom", ti, rhi, tuple(assess.SurfaceInput(*x) for x in surfaces)
    )
    return assess.assess_room(room, assess.OutdoorInput(te, rhe), accuracy=assess.DEFAULT_ACCURACY)


# --- a mild day and room air that would saturate --------------------------------------------------


def test_a_mild_day_holds_the_excess_as_measured():
    """Today 15 °C outside: along the class line the excess would be multiplied by
    s(0 °C)/s(15 °C) = 1/0.25 = 4 (EN ISO 13788 Annex A lines, as above), 824 Pa becoming
    3296 Pa and the room's air 114 % RH. Above ``class_line_warmest_outdoor_c`` (10 °C, our
    choice) it is held as measured. By hand (psychrolib's saturation over water):
    pi = 0.60 × psat(26 °C) = 0.60 × 3363.13 = 2017.88 Pa, pe = 0.70 × psat(15 °C) =
    0.70 × 1705.45 = 1193.82 Pa, Δp = 824.07 Pa; pe,d = 0.90 × psat(0 °C) = 0.90 × 611.15 =
    550.04 Pa (psychrolib's ice branch at 0 °C; over water 0.01 % more), pi,d = 1374.10 Pa
    (room RH 1374.10/3363.13 = 40.9 %); fRsi = (21 − 15)/(26 − 15) = 0.545,
    θsi = 0 + 0.545 × 26 = 14.18 °C, φsi = 1374.10/psat(14.18 °C) = 1374.10/1617.63 = 84.9 %."""
    assert th.get("class_line_warmest_outdoor_c").mark == "choice"
    room = _room(ti=26.0, rhi=60.0, te=15.0, rhe=70.0, surfaces=(("Wall", 21.0, "external_wall"),))
    projection = season.project_room(room, DesignMonth(0.0, 90.0))
    excess = 0.60 * _psat(26.0) - 0.70 * _psat(15.0)
    assert round(excess, 2) == 824.07
    assert projection.excess_model is ExcessModel.MEASURED and projection.excess_model_fallback
    assert projection.reason is None
    assert projection.design_vapour_pressure_excess_pa == pytest.approx(excess, rel=1e-9)
    p_room = 0.90 * _psat(0.0) + excess
    assert projection.design_vapour_pressure_pa == pytest.approx(p_room, rel=1e-4)
    assert 100 * p_room / _psat(26.0) == pytest.approx(40.9, abs=0.05)
    wall = projection.surfaces[0]
    theta = 26.0 * 6.0 / 11.0
    assert wall.design_surface_temp_c == pytest.approx(theta, abs=1e-9)
    assert wall.design_surface_rh_pct == pytest.approx(100 * p_room / _psat(theta), rel=1e-4)
    assert wall.design_surface_rh_pct == pytest.approx(84.9, abs=0.05)
    text = ws.excess_text(projection, words.SI)
    assert "is held as measured (today's outdoor air was warmer than 10 °C" in text
    assert "may well be larger" in text


@pytest.mark.parametrize(("te", "carried"), [(10.0, True), (10.5, False)])
def test_the_class_line_is_used_up_to_its_warmest_day(te, carried):
    """At 10 °C outside today the excess is still carried (s(0 °C)/s(10 °C) = 1/0.5 = 2, the
    class lines above); at 10.5 °C it is held as measured."""
    room = _room(ti=22.0, rhi=50.0, te=te, rhe=80.0)
    projection = season.project_room(room, DesignMonth(0.0, 90.0))
    excess = room.vapour_pressure_excess_pa
    assert projection.excess_model_fallback is not carried
    expected = 2.0 * excess if carried else excess
    assert projection.design_vapour_pressure_excess_pa == pytest.approx(expected, rel=1e-9)


def test_room_air_that_would_saturate_is_not_meaningful():
    """Today 20 °C / 70 % in the room, 10 °C / 70 % outside: Δp = 0.70 × (2338.80 − 1228.00) =
    777.57 Pa, carried along the class line to a 0 °C month ×2 = 1555.13 Pa; with
    pe,d = 0.90 × 611.15 = 550.04 Pa that is 2105.2 Pa, more than air at the 12 °C the month
    holds the room at can take (psat,water(12 °C) = 1402.59 Pa; psychrolib's saturation
    pressures). The room's vapour pressure is held at saturation, and no surface RH is
    projected (at θsi = 0 + 0.5 × 12 = 6 °C it would read 2105.2/935.25 = 225 % without the
    hold)."""
    room = _room(ti=20.0, rhi=70.0, te=10.0, rhe=70.0, surfaces=(("Wall", 15.0, "external_wall"),))
    projection = season.project_room(room, DesignMonth(0.0, 90.0, indoor_temp_c=12.0))
    excess = 0.70 * (_psat(20.0) - _psat(10.0))
    assert round(excess, 2) == 777.57
    assert projection.design_vapour_pressure_excess_pa == pytest.approx(2 * excess, rel=1e-9)
    assert projection.design_vapour_pressure_pa == pytest.approx(_psat(12.0), rel=1e-9)
    assert projection.reason is RoomReason.ROOM_SATURATED
    wall = projection.surfaces[0]
    assert wall.state is DesignState.NOT_MEANINGFUL and not wall.projected
    assert wall.design_surface_rh_pct is None and not wall.fails_in_month
    text = ws.excess_text(projection, words.SI)
    assert "The room's air itself would saturate" in text and "not meaningful" in text
    assert "1403 Pa" in text and "2105 Pa" in text
    assert ws.surface_sentence(wall, projection, words.SI) == (
        "Wall: not meaningful: in the design month the room's air itself would saturate at 12.0 °C."
    )


def test_evaluate_holds_the_room_at_saturation():
    """The per-surface arithmetic holds the room's vapour pressure at psat,water(θi,d) too
    (the search for the lowest month goes through it): φsi = psat(12)/psat(θsi), with
    θsi = 0 + 0.5 × 12 = 6 °C for fRsi = (15 − 10)/(20 − 10) = 0.5 (the room above)."""
    room = _room(ti=20.0, rhi=70.0, te=10.0, rhe=70.0, surfaces=(("Wall", 15.0, "external_wall"),))
    air, outdoor = room.air, room.outdoor
    r = season_math.Readings(
        15.0, 20.0, 10.0, air.vapour_pressure_pa, outdoor.vapour_pressure_pa,
        air.sat_pressure_water_pa, outdoor.sat_pressure_water_pa,
        air.dln_sat_pressure_water_per_k, outdoor.dln_sat_pressure_water_per_k,
        0.3, 0.3, 0.01, True, 2.0,
    )  # fmt: skip
    point = season_math.evaluate(r, 0.0, 90.0, 12.0, ExcessModel.CLASS_LINE)
    assert point.room_saturated
    assert point.surface_temp_c == pytest.approx(6.0, abs=1e-9)
    assert point.rh_pct == pytest.approx(100 * _psat(12.0) / _psat(6.0), rel=1e-9)
    drier = season_math.evaluate(r, 0.0, 90.0, 19.0, ExcessModel.CLASS_LINE)
    assert not drier.room_saturated


def test_check_mild_day_keeps_the_room_below_saturation(check):
    """The command line on the mild day above: the excess held as measured (824 Pa, not
    3296 Pa), the surface near 85 %, said so in words."""
    status, out, err = check(
        "--air-temp", "26", "--rh", "60", "--surface-temp", "21", "--outdoor-temp", "15",
        "--outdoor-rh", "70", "--design-outdoor-temp", "0", "--design-outdoor-rh", "90", "--json",
    )  # fmt: skip
    assert status == 0, err
    data = json.loads(out)
    excess = 0.60 * _psat(26.0) - 0.70 * _psat(15.0)
    assert data["design_vapour_pressure_excess_pa"] == pytest.approx(excess, rel=1e-4)
    assert data["design_month"]["excess_model"] == "measured"
    assert data["design_month"]["excess_model_fallback"] is True
    assert data["surfaces"][0]["design_surface_rh_pct"] == pytest.approx(84.9, abs=0.05)
    assert "held as measured" in data["design_excess_text"]


# --- a site's month the projection cannot use ---------------------------------------------------


def _flat_with(**site_fields):
    doc = json.loads(FLAT.read_text())
    doc["site"].update(site_fields)
    return json.dumps(doc).encode()


@pytest.mark.parametrize(
    ("site_fields", "where", "problem"),
    [
        # indoor no warmer than outdoor: DesignMonth refuses it (test above)
        ({"design_indoor_temp_c": 10.0, "design_outdoor_temp_c": 25.0},
         "site.design_indoor_temp_c", "must be above the outdoor mean (25 °C)"),
        # no outdoor given: our default, 0 °C (test_default_month_is_our_marked_choice)
        ({"design_indoor_temp_c": 0.0}, "site.design_indoor_temp_c",
         "must be above the outdoor mean (our default, 0 °C)"),
        # the field allows −60 °C; psychro.DRY_BULB_MIN_C is −50 °C
        ({"design_outdoor_temp_c": -55.0}, "site.design_outdoor_temp_c",
         "takes air from -50 °C"),
    ],
)  # fmt: skip
def test_a_site_month_the_projection_cannot_use_does_not_load(site_fields, where, problem):
    """The store's cross-record check refuses what the projection would refuse, at the
    field, so `survey validate` flags it and a save never writes it."""
    import msgspec

    from survey.errors import SurveyFileError

    with pytest.raises(SurveyFileError) as info:
        store.loads_survey(_flat_with(**site_fields))
    assert info.value.where == where and problem in info.value.problem
    site = store.load_survey(FLAT).site
    with pytest.raises(InputError):
        season.site_design_month(msgspec.structs.replace(site, **site_fields))


@pytest.mark.parametrize(
    "site_fields",
    [
        {"design_outdoor_temp_c": -50.0},  # the cold end of psychro's range, still taken
        {"design_indoor_temp_c": 0.5},  # above our default 0 °C
        {"design_indoor_temp_c": 20.0, "design_outdoor_temp_c": 19.5},
    ],
)
def test_a_site_month_at_the_edges_loads(site_fields):
    """Just inside what the projection takes: the file loads and the month is the site's."""
    survey = store.loads_survey(_flat_with(**site_fields))
    assert season.site_design_month(survey.site).source == "site"


def test_validate_flags_a_month_that_cannot_be_used(tmp_path, capsys):
    """`survey validate` exits 1 on the reviewer's site: design indoor 10 °C, outdoor 25 °C."""
    from survey.cli import main

    path = tmp_path / "warm-month.json"
    path.write_bytes(_flat_with(design_indoor_temp_c=10.0, design_outdoor_temp_c=25.0))
    assert main(["validate", str(path)]) == 1
    err = capsys.readouterr().err
    assert "site.design_indoor_temp_c: 10 °C: the colder month is a heated month" in err


def _refused_site():
    import msgspec

    survey = store.load_survey(FLAT)
    site = msgspec.structs.replace(
        survey.site, design_indoor_temp_c=10.0, design_outdoor_temp_c=25.0
    )
    return msgspec.structs.replace(survey, site=site)


def test_report_of_a_refused_site_month_does_not_contradict_itself():
    """A site edited in memory to a month that cannot be used (a file with it no longer
    loads): the report says the site's month is refused and our default used, and does not
    then say no month was given."""
    from survey import report

    text = report.markdown_report(_refused_site(), report.ReportOptions(generated_at="fixed"))
    assert "The site's design month cannot be used (design indoor temperature 10 °C" in text
    assert "no design month is given" not in text
    assert "Design month: a month averaging 0 °C outside at 90 % RH, our choice" in text
    default = ws.design_month_text(season.default_design_month(), words.SI)
    assert "no design month is given for this site" in default


def test_panel_says_why_the_site_month_is_not_used():
    """The panel projects to our default and says in one line why the site's is not used."""
    from survey.app.panel import panel_text

    survey = _refused_site()
    month, refused = season.usable_site_month(survey.site)
    assert month == season.default_design_month() and isinstance(refused, InputError)
    judged = evaluate.assess_room(survey, 0, "bed1")
    text = panel_text(judged, words.SI, month, str(refused)).plain
    line = ws.site_month_unusable(str(refused))
    assert line in text.splitlines()
    assert "above the design outdoor temperature (25 °C)" in line
    assert season.usable_site_month(store.load_survey(FLAT).site)[1] is None


def test_check_help_reads_the_class_lines_from_their_records(monkeypatch):
    """The --design-excess help gives the class lines' knees and the warmest day the line is
    used on from their threshold records (moved here to 2, 18 and 8 °C, values of no source,
    only to see the help follow the records)."""
    import argparse
    import dataclasses

    from survey.commands import check_options
    from survey.thresholds import table

    for key, moved in (
        ("humidity_class_flat_below_c", 2.0),
        ("humidity_class_zero_at_c", 18.0),
        ("class_line_warmest_outdoor_c", 8.0),
    ):
        monkeypatch.setitem(table._BY_KEY, key, dataclasses.replace(th.get(key), value=moved))
    parser = argparse.ArgumentParser()
    check_options.add_arguments(parser)
    action = next(a for a in parser._actions if "--design-excess" in a.option_strings)
    text = " ".join(action.help.split())
    assert "constant at and below 2 °C outside, zero at 18 °C" in text
    assert "at most 8 °C" in text


@pytest.mark.parametrize("te", [-20.0, 0.0, 0.5, 5.0, 10.0, 19.9, 20.0, 25.0])
def test_the_class_line_scale_is_the_class_lines_own_shape(te):
    """line_scale is the ratio of a class limit at te to its value at 0 °C (EN ISO 13788
    Annex A lines, as thresholds.humidity_class_limits_pa draws them), and line_slope its
    derivative (central difference over ±1 mK)."""
    from survey import season_math
    from survey import thresholds as th

    limits = th.humidity_class_limits_pa(te)
    expected = 0.0 if limits is None else limits[2] / th.value("humidity_class_3_pa")
    assert season_math.line_scale(te) == pytest.approx(expected, abs=1e-12)
    h = 1e-3
    numeric = (season_math.line_scale(te + h) - season_math.line_scale(te - h)) / (2 * h)
    assert season_math.line_slope(te) == pytest.approx(numeric, abs=1e-9)
