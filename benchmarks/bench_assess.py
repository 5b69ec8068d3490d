"""Full assessment, with uncertainty, of 10 000 surfaces against bare psychrolib calls.

The survey is 2 500 rooms of 4 measured surfaces each, with outdoor air, so every surface
gets condensation, mould and temperature-factor judgements with their uncertainty bands, and
every room a humidity class, a coldest surface and its highest safe RH with its band.

Two baselines, both plain psychrolib calls in a loop, timed interleaved with ours:

* "calls needed": the psychrolib calls the same results need — per room the saturation
  pressure, dew point, humidity ratio and specific volume, d ln p_ws/dt at the air
  temperature and at the dew point (the sensitivities of the uncertainty), the saturation
  pressure 3 K below the coldest surface and its derivative; per surface the saturation
  pressure and its derivative; the outdoor state once. This is the goal line.
* "values only": the bare numbers without any uncertainty — per room saturation pressure,
  dew point and humidity ratio, per surface the saturation pressure, surface RH and margin.
  The stricter comparison, shown for transparency.

A third line runs one surface per room, where per-room work weighs most; a fourth makes one
surface of every room a window pane, so the per-element policy (glazing judged apart from the
room RH target) is on the measured path.
"""

from __future__ import annotations

import psychrolib
from common import Result, interleaved_best

from survey import assess

PRESSURE_PA = 101_325.0
SURFACES = 10_000
_dln = psychrolib.dLnPws_


def _rooms(per_room: int, glazing: bool = False) -> list[assess.RoomInput]:
    rooms = []
    for n in range(SURFACES // per_room):
        air_c = 16.0 + (n % 9) * 0.7
        rh = 45.0 + (n % 13) * 3.1
        surfaces = tuple(
            assess.SurfaceInput(
                f"s{k}",
                air_c - 1.0 - ((n + k) % 11) * 0.9,
                "glazing" if glazing and k == 0 else "other",
            )
            for k in range(per_room)
        )
        rooms.append(assess.RoomInput(f"room {n}", "bedroom", air_c, rh, surfaces))
    return rooms


def _values_only(rooms: list[assess.RoomInput], outdoor: assess.OutdoorInput) -> list[float]:
    out = []
    pws_o = psychrolib.GetSatVapPres(outdoor.air_temp_c)
    out.append(psychrolib.GetHumRatioFromVapPres(outdoor.rh_pct / 100.0 * pws_o, PRESSURE_PA))
    for room in rooms:
        pw = room.rh_pct / 100.0 * psychrolib.GetSatVapPres(room.air_temp_c)
        dew = psychrolib.GetTDewPointFromVapPres(room.air_temp_c, pw)
        out.append(psychrolib.GetHumRatioFromVapPres(pw, PRESSURE_PA))
        for surface in room.surfaces:
            ts = surface.surface_temp_c
            out.append(100.0 * pw / psychrolib.GetSatVapPres(ts))
            out.append(ts - dew)
    return out


def _calls_needed(rooms: list[assess.RoomInput], outdoor: assess.OutdoorInput) -> list[float]:
    out = []
    t_o = outdoor.air_temp_c
    pw_o = outdoor.rh_pct / 100.0 * psychrolib.GetSatVapPres(t_o)
    w_o = psychrolib.GetHumRatioFromVapPres(pw_o, PRESSURE_PA)
    out += [w_o, psychrolib.GetMoistAirVolume(t_o, w_o, PRESSURE_PA), _dln(t_o)]
    for room in rooms:
        t = room.air_temp_c
        pw = room.rh_pct / 100.0 * psychrolib.GetSatVapPres(t)
        dew = psychrolib.GetTDewPointFromVapPres(t, pw)
        w = psychrolib.GetHumRatioFromVapPres(pw, PRESSURE_PA)
        out += [w, psychrolib.GetMoistAirVolume(t, w, PRESSURE_PA), _dln(t), _dln(dew)]
        coldest = min(s.surface_temp_c for s in room.surfaces)
        out += [psychrolib.GetSatVapPres(coldest - 3.0), _dln(coldest)]
        for surface in room.surfaces:
            ts = surface.surface_temp_c
            out += [100.0 * pw / psychrolib.GetSatVapPres(ts), _dln(ts), ts - dew]
    return out


def _case(name: str, per_room: int, baseline, goal: float | None, glazing: bool = False) -> Result:
    rooms = _rooms(per_room, glazing)
    outdoor = assess.OutdoorInput(2.0, 85.0)
    accuracy = assess.Accuracy()

    def ours():
        return assess.assess_site(rooms, outdoor, PRESSURE_PA, accuracy)

    ours_s, base_s = interleaved_best(ours, lambda: baseline(rooms, outdoor), repeat=7)
    return Result(name, ours_s * 1000.0, "ms", ours_s / base_s, goal)


def run() -> list[Result]:
    return [
        _case(
            "assess 10000 surfaces (4 per room) with uncertainty, vs psychrolib calls needed",
            4,
            _calls_needed,
            3.0,
        ),
        _case(
            "assess 10000 surfaces (4 per room) with uncertainty, vs values only",
            4,
            _values_only,
            None,
        ),
        _case(
            "assess 10000 surfaces (1 per room) with uncertainty, vs psychrolib calls needed",
            1,
            _calls_needed,
            None,
        ),
        _case(
            "assess 10000 surfaces (4 per room, one a window pane) with uncertainty, vs "
            "psychrolib calls needed",
            4,
            _calls_needed,
            None,
            glazing=True,
        ),
    ]
