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
#: Area of visible mould, m².
MOULD_AREA_MAX_M2 = 100_000.0
#: Hours a day a moisture-producing activity goes on.
ACTIVITY_HOURS_MAX = 24.0
