"""Findings per surface, room and site: condensation, mould, temperature factor, humidity
class, materials — each with the uncertainty the instruments leave.

Plain inputs in (:class:`RoomInput`, :class:`SurfaceInput`, :class:`MaterialInput`, …, SI
floats with the unit in the name), typed findings out (:class:`SurfaceFinding`,
:class:`RoomFinding`, :class:`SiteFinding`). The survey file model is adapted to these inputs
elsewhere; this module knows nothing of files or faces.

Moist air
---------
The psychrometrics are :mod:`survey.psychro`'s (RH relative to liquid water at all
temperatures; condensation point = dew point, or frost point below 0.01 °C; surface RH over
the phase that forms). For speed the assessment uses psychro's light
:class:`~survey.psychro.VapourState` (vapour pressure, condensation point, humidity ratio,
specific volume and the saturation slope) and skips the wet bulb, an iterative solve the
assessment never needs. :meth:`RoomFinding.moist_air` gives
the full :class:`~survey.psychro.MoistAir` when a face wants it.

What each surface is judged by
------------------------------
A surface's ``element`` decides it (:data:`survey.thresholds.ELEMENT_POLICY`, our policy):
the temperature factor only for the heated envelope (external walls, ceilings, floors, and
surfaces whose kind is not said); the room's highest safe RH (``coldest``,
``max_room_rh_pct*``) only from walls, ceilings and floors, internal walls included; glazing,
window frames and pipes are judged for condensation (frames also for mould) and reported
apart (``coldest_glazing_or_pipe``), since a cold pane or pipe calls for its own remedy, not
for a drier room.

Uncertainty
-----------
Each instrument has a ± accuracy (:class:`Accuracy`). Following the GUM (JCGM 100:2008), a ±a
specification is read as a rectangular distribution with standard uncertainty u = a/√3; the
readings are independent; sensitivities are first-order partial derivatives; the expanded
uncertainty is U = k·u_c with the coverage factor k = 2 (threshold ``coverage_factor``, about
95 % coverage). First order rather than worst-case corners: the corners would treat every
instrument as off by its full accuracy at once, which the specifications do not claim, and
the Monte Carlo check shows the first-order bands hold 96-97 % of the draws. The partial
derivatives, with L(t) = d ln p_ws/dt (ASHRAE ch. 1 eqn 5 & 6 differentiated, over the phase
that forms at t; over supercooled water a 0.01 K difference of psychro's continuation):

* vapour pressure p_w = RH·p_ws,water(t_i):  u²(ln p_w) = (u_RH/RH)² + (L_w(t_i)·u_ti)²
* condensation point t_c (p_ws(t_c) = p_w): u(t_c) = u(ln p_w) / L(t_c)
* surface RH = p_w / p_ws(t_s): u²(ln RH_s) = u²(ln p_w) + (L(t_s)·u_ts)²; the band is
  RH_s·exp(±U), slightly asymmetric, as the exponential is
* margin t_s − t_c: u² = u²(t_c) + u_ts²
* fRsi = (t_s − t_e)/(t_i − t_e): ∂/∂t_s = 1/Δ, ∂/∂t_i = −f/Δ, ∂/∂t_e = (f − 1)/Δ, Δ = t_i − t_e.
  When one thermometer reads both the room and the outdoor air (``Accuracy.shared_thermometer``,
  the usual case on site and the default), their errors are fully correlated (GUM 5.2,
  r = 1): u²(f) = (u_ts² + (∂/∂t_i + ∂/∂t_e)² u_ti²)/… = (u_ts² + u_ti²)/Δ²; with separate
  instruments the terms add in quadrature, u²(f) = (u_ts² + f² u_ti² + (1 − f)² u_ti²)/Δ².
* vapour-pressure excess p_w,i − p_w,e: the four readings' terms added in quadrature (the
  outdoor instrument is taken to have the room instrument's accuracy).

When a limit lies inside value ± U, the state is ``CANNOT_TELL`` ("cannot be told apart at
this instrument accuracy") and ``*_possible`` lists the states the band spans. A Monte Carlo
test (GUM Supplement 1 style, seeded) checks u and the coverage of ±U.
"""

from __future__ import annotations

from survey.assess.records import (
    DEFAULT_ACCURACY,
    MATERIAL_SCALES,
    Accuracy,
    Activity,
    AirState,
    CondensationState,
    DryingEquipment,
    DryStandardState,
    FactorState,
    MaterialFinding,
    MaterialInput,
    MouldState,
    Observations,
    OutdoorInput,
    RoomFinding,
    RoomInput,
    SiteFinding,
    SurfaceFinding,
    SurfaceInput,
    TimberState,
    air_state,
    emc_in_range,
    emc_or_none,
    timber_emc_pct,
)
from survey.assess.rooms import (
    GROUND_USES,
    assess_room,
    assess_site,
    outdoor_state,
)
from survey.assess.surfaces import (
    assess_surface,
)

__all__ = [
    "DEFAULT_ACCURACY",
    "GROUND_USES",
    "MATERIAL_SCALES",
    "Accuracy",
    "Activity",
    "AirState",
    "CondensationState",
    "DryStandardState",
    "DryingEquipment",
    "FactorState",
    "MaterialFinding",
    "MaterialInput",
    "MouldState",
    "Observations",
    "OutdoorInput",
    "RoomFinding",
    "RoomInput",
    "SiteFinding",
    "SurfaceFinding",
    "SurfaceInput",
    "TimberState",
    "air_state",
    "assess_room",
    "assess_site",
    "assess_surface",
    "emc_in_range",
    "emc_or_none",
    "outdoor_state",
    "timber_emc_pct",
]
