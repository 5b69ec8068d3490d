"""The input domain of the program: what range a reading or a room description may take.

These are plausibility bounds, not judgement thresholds (those live, with their sources, in
:mod:`survey.thresholds`). Every layer that checks input — the survey file model, the
assessment and the faces — reads its bounds from here, so a file that validates can always
be assessed. The psychrometric core's own domain (dry bulb, RH, pressure, surface
temperature, altitude) is in :mod:`survey.psychro`.
"""

from __future__ import annotations

#: Room volume, m³: a cupboard to a large hall.
ROOM_VOLUME_MIN_M3 = 1.0
ROOM_VOLUME_MAX_M3 = 100_000.0
#: Floor area (m²) and ceiling height (m) from which a volume may be worked out.
FLOOR_AREA_MIN_M2 = 1.0
FLOOR_AREA_MAX_M2 = 20_000.0
ROOM_HEIGHT_MIN_M = 1.0
ROOM_HEIGHT_MAX_M = 50.0
#: People who usually use a room.
OCCUPANTS_MAX = 500
#: Instrument accuracies (±): above these a reading says too little to judge anything by.
AIR_TEMP_ACCURACY_MAX_K = 5.0
RH_ACCURACY_MAX_PCT = 20.0
SURFACE_TEMP_ACCURACY_MAX_K = 10.0
#: ... and below these an accuracy claims more than any instrument can give. No reading is
#: exact: an accuracy of 0 would remove every "cannot tell" band and present a limit inside
#: the real uncertainty as certain, so 0 is refused (survey files refuse it too). The minimums
#: only need to lie below every real specification: a calibrated reference thermometer is
#: good to about ±0.01 K and electronic hygrometers to about ±1 %RH at best (both from
#: memory); a chilled-mirror meter of ±0.1 K in dew point gives ±0.3 to ±0.6 %RH between 50
#: and 95 %RH at 20 °C (computed: d ln pws/dt = 0.062 /K there, ASHRAE ch. 1 eqn 6).
AIR_TEMP_ACCURACY_MIN_K = 0.01
RH_ACCURACY_MIN_PCT = 0.1
SURFACE_TEMP_ACCURACY_MIN_K = 0.01
#: Area of visible mould, m².
MOULD_AREA_MAX_M2 = 100_000.0
#: Hours a day a moisture-producing activity goes on.
ACTIVITY_HOURS_MAX = 24.0

# --- warnings, not refusals ---------------------------------------------------------------
#: A surface temperature outside these is taken, with a warning to check it: no lining, wall
#: or floor inside a building is hotter than about 40 °C unless it is a heater, a hot pipe,
#: a lamp or in strong sun, and one colder than -25 °C is more likely an infrared reading
#: off a shiny (low-emissivity) surface than the surface itself (common practice, no source).
SURFACE_TEMP_WARN_HIGH_C = 40.0
SURFACE_TEMP_WARN_LOW_C = -25.0
#: A room's moisture-producing use a day above which the value is taken with a warning (a
#: typing slip, or a shared or commercial room): showers, baths, cooking hours and loads of
#: laundry dried indoors (common practice, no source).
PER_DAY_WARN = {
    "showers_per_day": 10.0,
    "baths_per_day": 6.0,
    "cooking_hours_per_day": 8.0,
    "laundry_loads_per_day": 5.0,
}
