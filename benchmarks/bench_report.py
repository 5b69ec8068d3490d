"""The site report of a synthetic 1 000-room, 10 000-surface survey, against bare psychrolib
calls for the same moist-air states, timed interleaved in the same run.

Ours: the whole report as Markdown text — the visit judged through
:func:`survey.evaluate.assess_visit` (findings with uncertainty, advice, cautions), every
sentence written by :mod:`survey.words`, every user string escaped, the tables laid out.
Baseline: the psychrolib calls the same numbers need with no uncertainty, no judgement and
no text — per room saturation pressure, dew point and humidity ratio, per surface the
saturation pressure (surface RH) and the margin; the outdoor state once. The goal is 3×.
A second line adds the HTML rendering of the same Markdown (markdown-it-py).
"""

from __future__ import annotations

import datetime as dt

import psychrolib
from common import Result, interleaved_best

from survey import evaluate, model, report

ROOMS = 1_000
SURFACES_PER_ROOM = 10
PRESSURE_PA = 101_325.0
_ELEMENTS = (
    "external_wall",
    "external_wall",
    "ceiling",
    "floor",
    "internal_wall",
    "external_wall",
    "glazing",
    "window_frame",
    "ceiling",
    "pipe",
)


def _survey() -> model.Survey:
    rooms, visits = [], []
    for n in range(ROOMS):
        air_c = 16.0 + (n % 9) * 0.7
        rooms.append(
            model.Room(
                id=f"r{n}",
                name=f"Room {n} | north <side>",
                use="bedroom",
                volume_m3=30.0,
                occupants=2,
            )
        )
        surfaces = [
            model.SurfaceReading(
                location=f"Surface {k} *corner*",
                element=_ELEMENTS[k],
                surface_temp_c=air_c - 1.0 - ((n + k) % 11) * 0.9,
                material="painted plaster",
            )
            for k in range(SURFACES_PER_ROOM)
        ]
        visits.append(
            model.RoomVisit(
                room=f"r{n}",
                air=model.AirReading(dry_bulb_c=air_c, rh_pct=45.0 + (n % 13) * 3.1),
                surfaces=surfaces,
            )
        )
    visit = model.Visit(
        started_at=dt.datetime(2025, 1, 15, 9, 0),
        label="Benchmark",
        outdoor=model.AirReading(dry_bulb_c=2.0, rh_pct=85.0),
        rooms=visits,
    )
    return model.Survey(
        site=model.Site(reference="Benchmark site", year_built=1990), rooms=rooms, visits=[visit]
    )


def _baseline(survey: model.Survey) -> list[float]:
    out = []
    visit = survey.visits[0]
    pw_o = visit.outdoor.rh_pct / 100.0 * psychrolib.GetSatVapPres(visit.outdoor.dry_bulb_c)
    out.append(psychrolib.GetHumRatioFromVapPres(pw_o, PRESSURE_PA))
    for room_visit in visit.rooms:
        t = room_visit.air.dry_bulb_c
        pw = room_visit.air.rh_pct / 100.0 * psychrolib.GetSatVapPres(t)
        dew = psychrolib.GetTDewPointFromVapPres(t, pw)
        out.append(psychrolib.GetHumRatioFromVapPres(pw, PRESSURE_PA))
        for surface in room_visit.surfaces:
            ts = surface.surface_temp_c
            out.append(100.0 * pw / psychrolib.GetSatVapPres(ts))
            out.append(ts - dew)
    return out


def run() -> list[Result]:
    survey = _survey()
    options = report.ReportOptions(generated_at="benchmark")
    markdown = report.markdown_report(survey, options)  # warm caches and imports once
    report.html_report(survey, options)
    assert markdown.count("\n| Surface ") >= ROOMS

    def ours():
        return report.markdown_report(survey, options)

    def ours_html():
        return report.html_report(survey, options)

    judged = {0: evaluate.assess_visit(survey, 0)}

    def layout_only():
        return report.render(report.build(survey, options, judged))

    def judge_only():
        return evaluate.assess_visit(survey, 0)

    def base():
        return _baseline(survey)

    md_s, base_s = interleaved_best(ours, base, repeat=2)
    html_s, base2_s = interleaved_best(ours_html, base, repeat=1)
    judge_s, base3_s = interleaved_best(judge_only, base, repeat=1)
    layout_s, base4_s = interleaved_best(layout_only, base, repeat=3)
    return [
        Result(
            "report 1000 rooms / 10000 surfaces as Markdown, vs psychrolib calls for the "
            "same states",
            md_s * 1000.0,
            "ms",
            md_s / base_s,
            3.0,
        ),
        Result(
            "report 1000 rooms / 10000 surfaces as HTML, vs psychrolib calls for the same states",
            html_s * 1000.0,
            "ms",
            html_s / base2_s,
            None,
        ),
        Result(
            "  of which: the visit judged (evaluate.assess_visit), vs the same calls",
            judge_s * 1000.0,
            "ms",
            judge_s / base3_s,
            None,
        ),
        Result(
            "  of which: layout and words of the judged visit, vs the same calls",
            layout_s * 1000.0,
            "ms",
            layout_s / base4_s,
            None,
        ),
    ]
