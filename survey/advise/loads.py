"""Moisture loads and sizing: the physics behind the advice, numbers only.

Formulas
--------
* Target humidity ratio W_t: room air at its temperature and the target RH.
* Ventilation (steady-state moisture balance, ASHRAE Handbook Fundamentals): the dry-air flow
  that carries a moisture generation G away is ṁ_da = G / (W_t − W_o); the volume flow is
  ṁ_da · v_o, v_o the specific volume of the supply (outdoor) air; air changes per hour =
  volume flow / room volume. Warming it costs ṁ_da (1.006 + 1.86 W_o)(t_i − t_o) kJ
  (ASHRAE ch. 1 eqn 30, enthalpy of moist air). At a given flow the room settles at
  W = W_o + G / ṁ_da.
* Back-calculated generation: G = ṁ_da (W_i − W_o) with ṁ_da = n·V / v_o at an assumed air
  change rate n (threshold ``assumed_air_change_rate_per_h``).
* Dehumidification: the load per day, 24 h × (G + ṁ_out (W_o − W_t)), with outdoor air
  coming in at the assumed rate (or at the ventilation rate advised beside it); 1 kg of
  water taken as 1 L. Taking the room air itself down to the target, V / v_i · (W_i − W_t),
  is a one-off amount in litres (``pull_down_l``), never added to a per-day figure.
"""

from __future__ import annotations

from survey import psychro
from survey import thresholds as th
from survey.advise.kinds import MoistureEstimate
from survey.assess import AirState, RoomFinding
from survey.errors import InputError

WATER_L_PER_KG = 1.0  # 1 kg of water taken as 1 L (0.2 % off at 20 °C)
CP_DRY_AIR_KJ_PER_KG_K = 1.006  # ASHRAE Fundamentals 2017 ch. 1 eqn 30
CP_VAPOUR_KJ_PER_KG_K = 1.86  # ASHRAE Fundamentals 2017 ch. 1 eqn 30
M3_PER_H_PER_CFM = 0.028316846592 * 60.0  # 1 ft = 0.3048 m exactly: 1 ft³/min = 1.699 m³/h

#: Uses whose air is usually closed up and unoccupied (no occupants given: taken as 0).
CLOSED_UP_USES = frozenset({"basement", "crawlspace", "loft", "storage"})


def gr_per_lb(w_kg_per_kg: float) -> float:
    """Grains of water per pound of dry air: 7000 × W (7000 grains = 1 lb)."""
    return 7000.0 * w_kg_per_kg


def _missing_for_load(finding: RoomFinding) -> tuple[tuple[str, ...], bool]:
    """What to give so the moisture load can be worked out (only what was not given), and
    whether the measured excess is no use because outdoor air is as wet as the room."""
    missing = ["occupants"]
    if finding.outdoor is None:
        missing.append("outdoor_air")
    if finding.room.volume_m3 is None:
        missing.append("room_volume")
    return tuple(missing), len(missing) == 1


def moisture_generation(finding: RoomFinding) -> MoistureEstimate:
    """Moisture the room gains, g/h: from occupants and activities, and back-calculated from
    the measured excess at the assumed air change rate; the larger is used, so the sizing is
    not short."""
    room = finding.room
    keys: list[str] = []
    occupants = activities = back = None
    rate_key = None
    assumed_zero = False
    if room.occupants == 0:
        occupants = 0.0
    elif room.occupants is None and finding.use in CLOSED_UP_USES and not room.activities:
        occupants = 0.0
        assumed_zero = True
    elif room.occupants is not None:
        rate_key = th.OCCUPANT_RATE_BY_USE[finding.use]
        occupants = room.occupants * th.value(rate_key)
        keys.append(rate_key)
    if room.activities:
        activities = 0.0
        for activity in room.activities:
            activity_key = th.ACTIVITY_RATE[activity.kind]
            activities += th.value(activity_key) * activity.hours_per_day / 24.0
            keys.append(activity_key)
    out = finding.outdoor
    air = finding.air
    ach = None
    if out is not None and room.volume_m3 is not None \
            and air.humidity_ratio_kg_per_kg > out.humidity_ratio_kg_per_kg:
        ach = th.value("assumed_air_change_rate_per_h")
        dry_air = ach * room.volume_m3 / out.specific_volume_m3_per_kg
        back = 1000.0 * dry_air * (air.humidity_ratio_kg_per_kg - out.humidity_ratio_kg_per_kg)
        keys.append("assumed_air_change_rate_per_h")
    people = None if occupants is None and activities is None else \
        (occupants or 0.0) + (activities or 0.0)
    candidates = [g for g in (people, back) if g is not None]
    used = max(candidates) if candidates else None
    missing: tuple[str, ...] = ()
    outdoor_as_wet = False
    if used is None:
        missing, outdoor_as_wet = _missing_for_load(finding)
    return MoistureEstimate(
        occupants_g_per_h=occupants, activities_g_per_h=activities,
        back_calculated_g_per_h=back, used_g_per_h=used, threshold_keys=tuple(keys),
        occupants=room.occupants, occupant_rate_key=rate_key,
        occupants_assumed_zero=assumed_zero, assumed_air_change_rate_per_h=ach,
        missing=missing, outdoor_as_wet=outdoor_as_wet)


def occupants_share(moisture: MoistureEstimate) -> float | None:
    """Share of the back-calculated load that occupants and activities explain."""
    if moisture.occupants_g_per_h is None and moisture.activities_g_per_h is None:
        return None
    people = (moisture.occupants_g_per_h or 0.0) + (moisture.activities_g_per_h or 0.0)
    back = moisture.back_calculated_g_per_h
    if not back:
        return None
    return people / back


def ventilation_airflow(generation_kg_per_h: float, target_w_kg_per_kg: float,
                        outdoor_w_kg_per_kg: float, supply_volume_m3_per_kg: float
                        ) -> tuple[float, float]:
    """(dry-air flow kg/h, volume flow m³/h) that holds ``target_w`` against the generation:
    ṁ_da = G / (W_t − W_o), volume flow = ṁ_da · v of the supply air."""
    difference = target_w_kg_per_kg - outdoor_w_kg_per_kg
    if difference <= 0.0:
        raise InputError("outdoor humidity ratio", f"{outdoor_w_kg_per_kg * 1000:.2f} g/kg",
                         "must be below the target humidity ratio for ventilation to dry")
    dry_air = generation_kg_per_h / difference
    return dry_air, dry_air * supply_volume_m3_per_kg


def rh_at(air: AirState, humidity_ratio_kg_per_kg: float) -> tuple[float, bool]:
    """(RH %, saturated) of air at the room's temperature holding ``humidity_ratio``: a
    ratio at or beyond saturation gives (100, True) — the air cannot carry that water, it
    condenses — never an error."""
    saturated = psychro.state_from_rh(air.dry_bulb_c, 100.0, air.pressure_pa)
    if humidity_ratio_kg_per_kg >= saturated.humidity_ratio_kg_per_kg:
        return 100.0, True
    state = psychro.state_from_humidity_ratio(air.dry_bulb_c, humidity_ratio_kg_per_kg,
                                              air.pressure_pa)
    return state.rh_pct, False


def heat_to_warm_w(dry_air_kg_per_h: float, outdoor_w: float, room_c: float,
                   outdoor_c: float) -> float:
    """Heating that warms the ventilation air from outdoors to the room, W (eqn 30)."""
    return (dry_air_kg_per_h / 3600.0 * (CP_DRY_AIR_KJ_PER_KG_K + CP_VAPOUR_KJ_PER_KG_K
                                         * outdoor_w) * (room_c - outdoor_c) * 1000.0)


def pull_down_l(volume_m3: float, air: AirState, target_w: float) -> float:
    """Water in litres taken out once to bring the room air itself down to ``target_w``."""
    return (volume_m3 / air.specific_volume_m3_per_kg
            * (air.humidity_ratio_kg_per_kg - target_w) * WATER_L_PER_KG)


def timber_emc(temp_c: float, rh_pct: float) -> float | None:
    """Wood Handbook eqn 4-5 EMC at a surface, or None outside its range."""
    from survey.assess import timber_emc_pct

    try:
        return timber_emc_pct(temp_c, rh_pct)
    except InputError:
        return None
