"""The days to a drying goal as a 95 % Student-t range, the rate's standard error in words,
the straight-line caveat, room-air logger hours, and the combustion-air pointer of stalled
drying.

Check values: Student's t quantiles from the t density integrated numerically here
(f(t) = Γ((ν+1)/2) / (√(νπ) Γ(ν/2)) · (1 + t²/ν)^−(ν+1)/2, any statistics text) and the
closed forms for one degree of freedom (the Cauchy quantile tan(π(p − ½))) and two
(t = (2p − 1) √(2 / (4p(1 − p)))); least-squares arithmetic by hand in each docstring.
"""

from __future__ import annotations

import dataclasses
import math

import pytest
from test_drying import _LOG, T0, _basement, _only_point, _room, _survey

from survey import drying, model, report, words
from survey.drying import TrendState
from survey.drying.trend import T_975, Fit, t_975
from survey.report.markdown import Para, Table
from survey.words import drying as dw

SI = words.Display("si")


def _t_cdf(t: float, dof: int, steps: int = 4000) -> float:
    """P(T ≤ t) for Student's t with ``dof`` degrees of freedom, by Simpson's rule on the
    density from 0 to t (plus the half below 0)."""
    c = math.gamma((dof + 1) / 2) / (math.sqrt(dof * math.pi) * math.gamma(dof / 2))
    h = t / steps
    total = 0.0
    for i in range(steps + 1):
        x = i * h
        weight = 1 if i in (0, steps) else (4 if i % 2 else 2)
        total += weight * c * (1 + x * x / dof) ** (-(dof + 1) / 2)
    return 0.5 + total * h / 3


def test_t_table_is_the_975_quantile():
    """Every row of the table puts 97.5 % of Student's t below it, to the table's three
    decimals (a change of 0.001 in t moves the probability by under 6e-5 at these points,
    so 5e-5 holds each value to about its last digit)."""
    for dof, t in T_975:
        assert _t_cdf(t, dof) == pytest.approx(0.975, abs=5e-5), dof


def test_t_closed_forms_for_one_and_two_degrees_of_freedom():
    """ν = 1: tan(0.475π) = 12.7062; ν = 2: 0.95 · √(2 / 0.0975) = 4.3027."""
    assert t_975(1) == pytest.approx(math.tan(0.475 * math.pi), abs=5e-4)
    assert t_975(2) == pytest.approx(0.95 * math.sqrt(2 / (4 * 0.975 * 0.025)), abs=5e-4)


def test_t_between_rows_takes_the_wider_row():
    """35 degrees of freedom take the row of 30 (2.042, wider than 40's 2.021); past 120,
    120's 1.980; none is refused."""
    assert t_975(35) == 2.042
    assert t_975(40) == 2.021
    assert t_975(500) == 1.980
    with pytest.raises(ValueError, match="at least one degree of freedom"):
        t_975(0)


def test_slow_end_with_no_fall_gives_no_date():
    """60, 48, 40 on days 0-2, goal 22 (dry standard 20 + 10 %). x̄ = 1, ȳ = 49.333;
    b = (−1 × 10.667 + 1 × −9.333) / 2 = −10 a day; a = 59.333; residuals 0.667, −1.333,
    0.667; SSR = 2.6667; s_b = √(2.6667 / 1 / 2) = 1.1547. Steady (10 ≥ 2 × 1.1547), but
    t(1) × s_b = 12.706 × 1.1547 = 14.672 > 10: the slow end is no fall. Days 18 / 10 = 1.8
    (43 hours); fast end 18 / 24.672 = 0.7296 days (17.5 hours, shown as 18)."""
    point = _only_point(_survey([60.0, 48.0, 40.0], [0, 1, 2]))
    assert point.fit is not None
    assert point.fit.rate_per_day == pytest.approx(-10.0)
    assert point.fit.rate_se_per_day == pytest.approx(1.1547, abs=1e-4)
    assert point.trend is TrendState.FALLING
    estimate = point.estimate
    assert estimate is not None
    assert estimate.days == pytest.approx(1.8)
    assert estimate.days_low == pytest.approx(0.7296, abs=1e-4)
    assert estimate.days_high is None and estimate.open_ended and estimate.rough
    assert dw.outlook_cell(point) == (
        "about 43 hours (rough: 18 hours or more; could take much longer)"
    )
    text = dw.trend_sentence(point)
    assert "A rough figure from three readings" in text
    assert "so it could take much longer" in text


def test_range_holds_the_estimate_and_widens_with_fewer_readings():
    """The same slope and scatter from fewer readings gives a wider range: the 95 % range
    of 60, 51, 45, 36 (four readings, t = 4.303) is narrower than ± one standard error
    times 12.706 would be, and holds the estimate."""
    fit = Fit(4, -7.8, 0.424264, 0.0, 3.0)
    four = drying.estimate_to_goal(fit, 36.0, 22.0, T0)
    three = drying.estimate_to_goal(Fit(3, -7.8, 0.424264, 0.0, 2.0), 36.0, 22.0, T0)
    assert four.days_low is not None and four.days_high is not None
    assert three.days_low is not None and three.days_high is not None
    assert four.days_low < four.days < four.days_high
    assert three.days_low < four.days_low and three.days_high > four.days_high


# --- the rate's standard error in words -----------------------------------------------------


@pytest.mark.parametrize(
    ("rate", "se", "expected"),
    [
        (-18.6, 4.8, "falling 18.6 ± 4.8 % RH a day"),  # one significant figure at 0.1
        (-1.0, 0.03, "falling 1.00 ± 0.03 % RH a day"),  # 0.0 would hide it: one more place
        (-1.2, 0.14, "falling 1.20 ± 0.14 % RH a day"),  # a leading 1 keeps two figures
        (-1.003, 0.008, "falling 1.0 % RH a day"),  # too small to matter: left out
        (-2.0, None, "falling 2.0 % RH a day"),  # two readings: no standard error
    ],
)
def test_rh_rate_shows_its_standard_error_at_a_useful_precision(rate, se, expected):
    """Never "± 0.0": the standard error to one significant figure (two if it begins with
    a 1; common practice, no source), the rate to the same place, or no band at all."""
    assert dw.air_rate_text(Fit(3, rate, se, 0.0, 2.0), "rh", SI) == expected


def test_basement_reference_room_rh_rate_has_no_zero_band():
    """The office's RH 50, 49, 48 % lies almost on a line (standard error under 0.01 % a
    day): the sentence says "falling 1.0 % RH a day", not "1.0 ± 0.0"."""
    room = _room(drying.drying_progress(_basement()), "office")
    assert room.rh_fit is not None and room.rh_fit.rate_se_per_day is not None
    assert room.rh_fit.rate_se_per_day < 0.01
    text = dw.room_air_sentence(room, SI)
    assert "± 0.0 " not in text and "falling 1.0 % RH a day" in text


def test_point_rate_cell_keeps_a_small_standard_error():
    """A rate of 6 a day with a standard error of 0.04: "−6.00 ± 0.04", not "± 0.0"."""
    point = _only_point(_survey([60.0, 40.0], [0, 1]))
    point = dataclasses.replace(point, fit=Fit(3, -6.0, 0.04, 0.0, 2.0))
    assert dw.rate_cell(point) == "−6.00 ± 0.04 points a day (3 readings)"


# --- said once -----------------------------------------------------------------------------


def test_straight_line_caveat_is_said_once_in_the_report():
    """The basement report gives days to the goal for four points: that a straight line is
    optimistic is said once (in the basis paragraph), not in every point's sentence."""
    text = report.render(report.build(_basement(), report.ReportOptions(generated_at="fixed")))
    assert text.count("A straight line is optimistic") == 1
    assert "allow longer" not in text


# --- logger hours of room air ---------------------------------------------------------------


def _logged_survey() -> model.Survey:
    survey = _survey([60.0, 51.0], [0, 1])
    samples = [model.LogSample(at=a, dry_bulb_c=t, rh_pct=rh) for a, t, rh in _LOG]
    survey.logs.append(model.LogSeries(room="wet", source="air-1.csv", samples=samples))
    survey.logs.append(model.LogSeries(room="wet", source="air-2.csv", samples=samples[:4]))
    survey.logs.append(
        model.LogSeries(room="wet", source="probe.csv", samples=samples, surface="Wall")
    )
    return survey


def test_room_air_logger_hours_are_labelled_air_rh_with_one_note():
    """Two room-air loggers and one on a surface: the air loggers' hours columns say "air
    RH", the surface logger's "surface RH", and the note that air under 80 % does not clear
    the surfaces is given once."""
    doc = report.build(_logged_survey(), report.ReportOptions(generated_at="fixed"))
    tables = [b for b in doc.blocks if isinstance(b, Table) and b.name == "logger_days"]
    headers = [t.header[6:] for t in tables]
    assert headers.count(("Hours above 80 % air RH", "Hours above 90 % air RH")) == 2
    assert headers.count(("Hours above 80 % surface RH", "Hours above 90 % surface RH")) == 1
    notes = [b for b in doc.blocks if isinstance(b, Para) and b.name == "drying_air_rh_note"]
    assert len(notes) == 1
    assert "air under 80 % does not clear the surfaces" in dw.AIR_RH_NOTE


def test_logger_day_line_names_whose_rh():
    """The app's logger line says whose RH the hours are: 1.5 h above 80 % and 0.8 h above
    90 % of the air (test_logger_days_by_hand)."""
    summary = _room(drying.drying_progress(_logged_survey()), "wet").loggers[0]
    line = dw.logger_day_line(summary.days[0], SI, dw.rh_kind(summary))
    assert "1.5 h above 80 % and 0.8 h above 90 % air RH" in line


# --- stalled drying and the combustion-air caution ---------------------------------------------


def _stalled(flued: bool | None) -> model.Survey:
    survey = _survey([40.0, 39.9, 39.9], [0, 1, 2])  # stalled (test_flat_series_has_stalled)
    survey.site.flued_appliance = flued
    return survey


@pytest.mark.parametrize("flued", [None, True])
def test_stalled_drying_points_to_the_combustion_air_caution(flued):
    """Stalled drying says to keep the area closed: where an open-flued appliance may be
    there (not said, or said yes), its words point to the combustion-air caution, and the
    drying section shows that caution's own words once (the advice of this visit need not
    raise it: KEEP_DRYING does not close a space up)."""
    survey = _stalled(flued)
    room = _room(drying.drying_progress(survey), "wet")
    assert room.flued_appliance is flued
    (point,) = room.points
    said = dw.point_sentence(point, {}, room.flued_appliance)
    assert "kept closed (first see the caution on combustion air of flued appliances" in said
    doc = report.build(survey, report.ReportOptions(generated_at="fixed"))
    shown = [b for b in doc.blocks if isinstance(b, Para) and b.name == "drying_combustion_air"]
    assert len(shown) == 1
    assert dw.combustion_caution(flued, SI) in report.render(doc)


def test_stalled_drying_without_a_flued_appliance_has_no_pointer():
    """With no open-flued appliance recorded, the stalled words have no pointer and the
    drying section adds no caution."""
    survey = _stalled(False)
    room = _room(drying.drying_progress(survey), "wet")
    (point,) = room.points
    said = dw.point_sentence(point, {}, room.flued_appliance)
    assert "kept closed, move air" in said and "combustion" not in said
    doc = report.build(survey, report.ReportOptions(generated_at="fixed"))
    assert not any(isinstance(b, Para) and b.name == "drying_combustion_air" for b in doc.blocks)


def test_stalled_pointer_appears_in_the_app_words_by_default():
    """A face that does not know the answer gets the safe side: the pointer."""
    point = _only_point(_stalled(None))
    assert "combustion air of flued appliances" in dw.trend_sentence(point)


async def test_app_drying_screen_shows_the_combustion_air_caution_for_stalled_drying(tmp_path):
    """The app's drying screen, for the stalled series with no answer on flued appliances:
    the point's words point to the combustion-air caution, and the screen shows the caution
    once; the room-air logger's note is there once too."""
    import datetime as dt

    from textual.widgets import Static

    from survey import store
    from survey.app import make_app
    from survey.app.drying import DryingScreen

    survey = _stalled(None)
    samples = [model.LogSample(at=a, dry_bulb_c=t, rh_pct=rh) for a, t, rh in _LOG]
    survey.logs.append(model.LogSeries(room="wet", source="air.csv", samples=samples))
    path = tmp_path / "stalled.json"
    path.write_bytes(store.dumps_survey(survey))
    app = make_app(path, data_dir=tmp_path / "data", clock=lambda: dt.datetime(2025, 3, 4, 12))
    async with app.run_test(size=(120, 40)) as pilot:
        await pilot.pause()
        await pilot.press("f4")
        await pilot.pause()
        await pilot.press("g")
        await pilot.pause()
        await app.workers.wait_for_complete()
        await pilot.pause()
        assert isinstance(app.screen, DryingScreen)
        texts = [str(w.render()) for w in app.screen.query(Static)]
        assert any("first see the caution on combustion air" in t for t in texts)
        assert texts.count(dw.combustion_caution(None, SI)) == 1
        assert texts.count(dw.AIR_RH_NOTE) == 1
