"""A dehumidifier running on site, judged from readings a technician can take.

Inputs (:class:`DehumidifierInput`): the air entering and leaving the unit (one pair of dry
bulb and RH readings, or a series of pairs over the run), the water it collected over a
duration, and its power draw or the energy it used; optionally its rating (capacity in L per
24 h and energy factor in L/kWh) and the test condition the rating was stated at.

Results (:class:`DehumidifierResult`), every moist-air state from :mod:`survey.psychro`
(psychrolib, ASHRAE Handbook Fundamentals 2017 ch. 1):

* removal rate ``R = V · 24 / t`` L/day (V litres over t hours), and in US pints per day
  (1 US pint = 0.473176473 L exactly: a US gallon is 231 in³ = 3.785411784 L, and a pint an
  eighth of it; NIST);
* energy factor ``EF = V / E`` L/kWh, E the energy used (given, or power × hours);
* humidity-ratio drop across the unit ``ΔW = W_in − W_out`` (g/kg, and grains per pound,
  7000 × ΔW in kg/kg: the trade's grain depression). With a series of readings it is the
  time mean of ΔW (trapezoids between the reading times; a plain mean when no times are
  given), taken as holding over the whole run; the mean inlet and outlet states are the
  time means of their dry bulb and W by the same trapezoids, so they differ by that drop;
* dry-air mass flow through the unit implied by the water and the drop:
  ``ṁ_da = m_w / ∫ΔW dt`` kg/s (m_w the collected water's mass), and the volume flow
  ``ṁ_da · v_in`` at the inlet's specific volume (ASHRAE ch. 1 eqn 26);
* cooling capacity of a refrigerant unit's coil. The air is taken as cooled from the inlet
  state to saturation at the outlet's humidity ratio (the "coil state": dry bulb = the
  outlet's dew point, W = W_out), then reheated to the outlet temperature by the condenser.
  With h from psychrolib's ``GetMoistAirEnthalpy`` (ASHRAE ch. 1 eqn 30) and the water
  condensed on the coil leaving as liquid at the coil temperature, carrying
  ``ΔW · h_f(T_coil)`` (ASHRAE ch. 1, the cooling-and-dehumidifying balance; ``h_f ≈
  4.186 t`` kJ/kg, :func:`survey.psychro.liquid_water_enthalpy_j_per_kg`)::

      Q_total    = ṁ_da · [(h(T_in, W_in) − h(T_coil, W_out)) − ΔW · h_f(T_coil)]
      Q_latent   = ṁ_da · [(h(T_in, W_in) − h(T_in, W_out)) − ΔW · h_f(T_coil)]
      Q_sensible = ṁ_da · (h(T_in, W_out) − h(T_coil, W_out))   (Q_total = sum of both)

  The condensate's term is about 1 % of Q_total (0.20 of 20.5 kJ/kg with a 13 °C coil) and
  counts in the latent part. A desiccant unit has no refrigeration cycle: no cooling
  capacity, no COP;
* coefficient of performance of the refrigeration cycle ``COP = Q_total / P`` (P the mean
  electrical power; the fan's share is counted in P, so this is the unit's COP, a little
  below the compressor's own).

The rating comparison (:class:`RatingComparison`) names the rating's test condition with
its source (:data:`RATING_CONDITIONS`, thresholds of :mod:`survey.thresholds`) and scales
the rating to the site air by our approximation (threshold ``dehumidifier_nominal_coil_c``):
a refrigerant unit removes water in proportion to the inlet humidity ratio above that of
saturated air at 0 °C (the driest air its coil can work toward without frosting),
``s = (W_in − W_0) / (W_rating − W_0)``; a
desiccant unit in proportion to the humidity ratio itself, ``s = W_in / W_rating``. The
expected removal is ``s × rated`` and the expected energy factor ``s × rated EF`` (power
draw taken as unchanged). Rating conditions are at standard sea-level pressure.

Findings (:class:`FindingKind`): a refrigerant unit in air too cold for it (coil frosting),
an outlet wetter than the inlet, no measurable drop, an outlet no warmer than the inlet,
water with no duration, no water, no power, no rating condition, removal well below or
above what the site air allows.

Modules: :mod:`~survey.equipment.performance` (the check), :mod:`~survey.equipment.stored`
(stored visits), :mod:`~survey.equipment.amounts` (typed amounts, read by
:func:`survey.units.read` and checked against the file's bounds).

A stored visit is judged by :func:`judge_visit` (the inlet is the unit's inlet reading or
the room's air; the duration its run hours, else the time since the previous reading of
the same unit, matched by label in the same room; power from its power or energy).
The ``read_*`` helpers turn typed amounts (``1.2kg``, ``250W``, ``20L/day``, ``42 pt/day``)
into SI numbers for the faces, through :func:`survey.units.read` (pint only for a typed
unit).
"""

from survey.equipment.amounts import (
    read_capacity,
    read_energy_factor,
    read_energy_kwh,
    read_hours,
    read_power_or_energy,
    read_power_w,
    read_water,
)
from survey.equipment.performance import (
    CAPACITY_MAX_L_PER_DAY,
    ENERGY_FACTOR_MAX_L_PER_KWH,
    ENERGY_MAX_KWH,
    POUND_KG,
    POWER_MAX_W,
    RATING_CONDITIONS,
    RUN_HOURS_MAX_H,
    US_GALLON_L,
    US_PINT_L,
    WATER_MAX_L,
    AirPair,
    DehumidifierInput,
    DehumidifierKind,
    DehumidifierResult,
    DurationSource,
    Finding,
    FindingKind,
    RatingComparison,
    RatingPoint,
    check,
    rating_point,
    site_scale,
)
from survey.equipment.stored import StoredUnit, judge_record, judge_visit

__all__ = [
    "CAPACITY_MAX_L_PER_DAY",
    "ENERGY_FACTOR_MAX_L_PER_KWH",
    "ENERGY_MAX_KWH",
    "POUND_KG",
    "POWER_MAX_W",
    "RATING_CONDITIONS",
    "RUN_HOURS_MAX_H",
    "US_GALLON_L",
    "US_PINT_L",
    "WATER_MAX_L",
    "AirPair",
    "DehumidifierInput",
    "DehumidifierKind",
    "DehumidifierResult",
    "DurationSource",
    "Finding",
    "FindingKind",
    "RatingComparison",
    "RatingPoint",
    "StoredUnit",
    "check",
    "judge_record",
    "judge_visit",
    "rating_point",
    "read_capacity",
    "read_energy_factor",
    "read_energy_kwh",
    "read_hours",
    "read_power_or_energy",
    "read_power_w",
    "read_water",
    "site_scale",
]
