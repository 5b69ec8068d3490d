"""Moisture loads and sizing: the physics behind the advice, numbers only.

Formulas
--------
* Target humidity ratio W_t: room air at its temperature and the target RH.
* Ventilation (steady-state moisture balance, ASHRAE Handbook Fundamentals): the dry-air flow
  that carries a moisture generation G away is ṁ_da = G / (W_t − W_o); the volume flow is
  ṁ_da · v_i, v_i the specific volume of the room air the fan moves; air changes per hour =
  volume flow / room volume (room volumes of room air, so ṁ_da = n·V / v_i). Warming it
  costs ṁ_da (1.006 + 1.86 W_o)(t_i − t_o) kJ
  (ASHRAE ch. 1 eqn 30, enthalpy of moist air). At a given flow the room settles at
  W = W_o + G / ṁ_da.
* Back-calculated generation: G = ṁ_da (W_i − W_o) with ṁ_da = n·V / v_i at an assumed air
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
from survey.assess import AirState, Observations, RoomFinding
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
    laundry = None
    if room.laundry_loads_per_day:
        laundry = room.laundry_loads_per_day * th.value("moisture_laundry_load_kg") * 1000.0 / 24.0
        activities = (activities or 0.0) + laundry
        keys.append("moisture_laundry_load_kg")
    typical = typical_amount = None
    if activities is None and th.room_use(finding.use).wet_room and room.occupants != 0:
        typical, typical_amount, typical_g_per_h, typical_keys = _typical_wet_room_load(finding.use)
        activities = typical_g_per_h
        keys += typical_keys
    out = finding.outdoor
    air = finding.air
    ach = None
    if (
        out is not None
        and room.volume_m3 is not None
        and air.humidity_ratio_kg_per_kg > out.humidity_ratio_kg_per_kg
    ):
        ach = th.value("assumed_air_change_rate_per_h")
        dry_air = ach * room.volume_m3 / air.specific_volume_m3_per_kg
        back = 1000.0 * dry_air * (air.humidity_ratio_kg_per_kg - out.humidity_ratio_kg_per_kg)
        keys.append("assumed_air_change_rate_per_h")
    people = (
        None
        if occupants is None and activities is None
        else (occupants or 0.0) + (activities or 0.0)
    )
    candidates = [g for g in (people, back) if g is not None]
    used = max(candidates) if candidates else None
    missing: tuple[str, ...] = ()
    outdoor_as_wet = False
    if used is None:
        missing, outdoor_as_wet = _missing_for_load(finding)
    return MoistureEstimate(
        occupants_g_per_h=occupants,
        activities_g_per_h=activities,
        back_calculated_g_per_h=back,
        used_g_per_h=used,
        threshold_keys=tuple(keys),
        occupants=room.occupants,
        occupant_rate_key=rate_key,
        occupants_assumed_zero=assumed_zero,
        assumed_air_change_rate_per_h=ach,
        missing=missing,
        outdoor_as_wet=outdoor_as_wet,
        typical_use_assumed=typical,
        typical_use_amount=typical_amount,
        laundry_g_per_h=laundry,
    )


def _typical_wet_room_load(use: str) -> tuple[str, float, float, list[str]]:
    """(what, how much a day, g/h averaged over the day, keys) a wet room with no use
    entered is taken to have: showers in a bathroom, cooking in a kitchen, wash loads dried
    in a utility room."""
    if use == "bathroom":
        n = th.value("typical_showers_per_day")
        g_per_h = n * th.value("moisture_shower_g_per_h") * th.value("shower_minutes") / 60.0
        return (
            "shower",
            n,
            g_per_h / 24.0,
            ["typical_showers_per_day", "moisture_shower_g_per_h", "shower_minutes"],
        )
    if use == "kitchen":
        hours = th.value("typical_cooking_hours_per_day")
        return (
            "cooking",
            hours,
            hours * th.value("moisture_cooking_g_per_h") / 24.0,
            ["typical_cooking_hours_per_day", "moisture_cooking_g_per_h"],
        )
    loads = th.value("typical_laundry_loads_per_day")
    return (
        "laundry",
        loads,
        loads * th.value("moisture_laundry_load_kg") * 1000.0 / 24.0,
        ["typical_laundry_loads_per_day", "moisture_laundry_load_kg"],
    )


_L_PER_S_TO_M3_PER_H = 3.6  # 1 L/s = 3.6 m³/h


def extract_while_in_use(use: str) -> tuple[float, tuple[str, ...]] | None:
    """The usual code minimum extract while a wet room is in use (switched on with the
    activity and run on after it), m³/h: the higher of England's Approved Document F and
    ASHRAE 62.2 (both from memory; local codes rule), with the keys used; None for a room
    with no extract minimum."""
    if use not in ("bathroom", "kitchen", "utility"):
        return None
    candidates = [
        (
            th.value(f"extract_{use}_intermittent_l_per_s") * _L_PER_S_TO_M3_PER_H,
            f"extract_{use}_intermittent_l_per_s",
        )
    ]
    if use in ("bathroom", "kitchen"):
        key = f"extract_{use}_intermittent_cfm"
        candidates.append((th.value(key) * M3_PER_H_PER_CFM, key))
    return max(value for value, _ in candidates), tuple(key for _, key in candidates)


def extract_minimum(use: str, volume_m3: float | None) -> tuple[float, tuple[str, ...]] | None:
    """The usual code minimum continuous extract for a wet room, m³/h: the higher of the
    figures compared (England's Approved Document F, ASHRAE 62.2; both from memory, local
    codes rule), with the keys used; None for a room with no extract minimum."""
    if use not in ("bathroom", "kitchen", "utility"):
        return None
    candidates = [
        (
            th.value(f"extract_{use}_continuous_l_per_s") * _L_PER_S_TO_M3_PER_H,
            f"extract_{use}_continuous_l_per_s",
        )
    ]
    if use == "bathroom":
        candidates.append(
            (
                th.value("extract_bathroom_continuous_cfm") * M3_PER_H_PER_CFM,
                "extract_bathroom_continuous_cfm",
            )
        )
    elif use == "kitchen" and volume_m3 is not None:
        candidates.append(
            (
                th.value("extract_kitchen_continuous_ach") * volume_m3,
                "extract_kitchen_continuous_ach",
            )
        )
    keys = tuple(key for _, key in candidates)
    intermittent = (
        f"extract_{use}_intermittent_l_per_s",
        *(
            ("extract_bathroom_intermittent_cfm",)
            if use == "bathroom"
            else ("extract_kitchen_intermittent_cfm",)
            if use == "kitchen"
            else ()
        ),
    )
    return max(value for value, _ in candidates), keys + intermittent


def water_loss_class(obs: Observations) -> tuple[int | None, bool, tuple[str, ...]]:
    """(class 1-4 of the water loss, whether it was assumed, keys): given, or from the wet
    share of the room's surfaces and whether dense materials hold water (restoration
    standard of practice, from memory); None when nothing says."""
    if obs.water_loss_class is not None:
        return obs.water_loss_class, False, ()
    keys = ("water_loss_class_2_from_pct", "water_loss_class_3_from_pct")
    if obs.dense_materials_wet:
        return 4, False, keys
    if obs.wet_area_pct is None:
        return None, False, ()
    if obs.wet_area_pct < th.value("water_loss_class_2_from_pct"):
        return 1, False, keys
    if obs.wet_area_pct < th.value("water_loss_class_3_from_pct"):
        return 2, False, keys
    return 3, False, keys


_FT3_PER_M3 = 1.0 / 0.028316846592  # 1 ft = 0.3048 m exactly


def materials_load_l_per_day(volume_m3: float, loss_class: int) -> float:
    """Water leaving wet materials, L/day: the drying chart's capacity for the class, one US
    pint a day per so many ft³ of drying area (restoration standard of practice, from
    memory)."""
    factor = th.value(f"drying_chart_class_{loss_class}_ft3_per_pint")
    return volume_m3 * _FT3_PER_M3 / factor * th.value("us_pint_l")


def occupants_share(moisture: MoistureEstimate) -> float | None:
    """Share of the back-calculated load that occupants and activities explain."""
    if moisture.occupants_g_per_h is None and moisture.activities_g_per_h is None:
        return None
    people = (moisture.occupants_g_per_h or 0.0) + (moisture.activities_g_per_h or 0.0)
    back = moisture.back_calculated_g_per_h
    if not back:
        return None
    return people / back


def ventilation_airflow(
    generation_kg_per_h: float,
    target_w_kg_per_kg: float,
    outdoor_w_kg_per_kg: float,
    supply_volume_m3_per_kg: float,
) -> tuple[float, float]:
    """(dry-air flow kg/h, volume flow m³/h) that holds ``target_w`` against the generation:
    ṁ_da = G / (W_t − W_o), volume flow = ṁ_da · v of the supply air."""
    difference = target_w_kg_per_kg - outdoor_w_kg_per_kg
    if difference <= 0.0:
        raise InputError(
            "outdoor humidity ratio",
            f"{outdoor_w_kg_per_kg * 1000:.2f} g/kg",
            "must be below the target humidity ratio for ventilation to dry",
        )
    dry_air = generation_kg_per_h / difference
    return dry_air, dry_air * supply_volume_m3_per_kg


def rh_at(air: AirState, humidity_ratio_kg_per_kg: float) -> tuple[float, bool]:
    """(RH %, saturated) of air at the room's temperature holding ``humidity_ratio``: a
    ratio at or beyond saturation gives (100, True) — the air cannot carry that water, it
    condenses — never an error."""
    saturated = psychro.state_from_rh(air.dry_bulb_c, 100.0, air.pressure_pa)
    if humidity_ratio_kg_per_kg >= saturated.humidity_ratio_kg_per_kg:
        return 100.0, True
    state = psychro.state_from_humidity_ratio(
        air.dry_bulb_c, humidity_ratio_kg_per_kg, air.pressure_pa
    )
    return state.rh_pct, False


def heat_to_warm_w(
    dry_air_kg_per_h: float, outdoor_w: float, room_c: float, outdoor_c: float
) -> float:
    """Heating that warms the ventilation air from outdoors to the room, W (eqn 30)."""
    return (
        dry_air_kg_per_h
        / 3600.0
        * (CP_DRY_AIR_KJ_PER_KG_K + CP_VAPOUR_KJ_PER_KG_K * outdoor_w)
        * (room_c - outdoor_c)
        * 1000.0
    )


def pull_down_l(volume_m3: float, air: AirState, target_w: float) -> float:
    """Water in litres taken out once to bring the room air itself down to ``target_w``."""
    return (
        volume_m3
        / air.specific_volume_m3_per_kg
        * (air.humidity_ratio_kg_per_kg - target_w)
        * WATER_L_PER_KG
    )


def timber_emc(temp_c: float, rh_pct: float) -> float | None:
    """Wood Handbook eqn 4-5 EMC at a surface, or None outside its range."""
    from survey.assess import timber_emc_pct

    try:
        return timber_emc_pct(temp_c, rh_pct)
    except InputError:
        return None
