"""What to do about a room: ordered actions with numbers and reasons, and safety cautions.

Input is a :class:`~survey.assess.RoomFinding` (or a :class:`~survey.assess.SiteFinding`);
output is a :class:`RoomAdvice` (or :class:`SiteAdvice`) of :class:`Action` and
:class:`Caution` records. Numbers travel in ``Action.values`` with the SI unit in the key
(``airflow_m3_per_h``, ``removal_l_per_day`` …); every limit comes from
:mod:`survey.thresholds` and each action and caution carries the keys it used.

Formulas
--------
* Target humidity ratio W_t: room air at its temperature and the target RH.
* Ventilation (steady-state moisture balance, ASHRAE Handbook Fundamentals): the dry-air flow
  that carries a moisture generation G away is ṁ_da = G / (W_t − W_o); the volume flow is
  ṁ_da · v_o, v_o the specific volume of the supply (outdoor) air; air changes per hour =
  volume flow / room volume. Warming it costs ṁ_da (1.006 + 1.86 W_o)(t_i − t_o) kJ
  (ASHRAE ch. 1 eqn 30, enthalpy of moist air).
* Back-calculated generation: G = ṁ_da (W_i − W_o) with ṁ_da = n·V / v_o at an assumed air
  change rate n (threshold ``assumed_air_change_rate_per_h``).
* Dehumidification: a one-off pull-down of the room air, V / v_i · (W_i − W_t), plus the
  load per day, 24 h × (G + ṁ_inf (W_o − W_t)) with infiltration at the assumed rate; 1 kg
  of water taken as 1 L.

Text is written for the inspector's client. Numbers in text go through a ``Formatter``
``(quantity, si_value) -> str``; the default writes SI without touching pint, and a face may
pass ``lambda q, v: units.format_value(q, v, system)`` for IP text.
"""

from __future__ import annotations

import math
from dataclasses import dataclass, field
from enum import Enum
from typing import Callable, Mapping

from survey import psychro
from survey import thresholds as th
from survey.assess import (AirState, CondensationState, DryStandardState, FactorState,
                           MouldState, RoomFinding, SiteFinding, SurfaceFinding, TimberState,
                           air_state)
from survey.errors import InputError

Formatter = Callable[[str, float], str]

#: Decimals and units of the default SI text (the same as ``units.format_value`` in SI).
_SI_TEXT = {
    "temperature": (1, 1.0, "°C"),
    "temperature_difference": (1, 1.0, "K"),
    "humidity_ratio": (2, 1000.0, "g/kg"),
    "vapour_pressure": (0, 1.0, "Pa"),
    "airflow": (0, 1.0, "m³/h"),
    "water_rate": (1, 1.0, "L/day"),
    "volume": (1, 1.0, "m³"),
}


def si_text(quantity: str, value_si: float) -> str:
    """``value_si`` as SI text, e.g. ``si_text("temperature", 11.04)`` gives ``'11.0 °C'``."""
    places, factor, unit = _SI_TEXT[quantity]
    text = f"{value_si * factor:.{places}f}"
    if text.startswith("-") and float(text) == 0.0:
        text = text[1:]
    return f"{text} {unit}"


class ActionKind(Enum):
    VENTILATE = "ventilate"
    DEHUMIDIFY = "dehumidify"
    RAISE_SURFACE_TEMPERATURE = "raise_surface_temperature"
    FIND_SOURCE = "find_source"

    def __str__(self) -> str:
        return self.value


ACTION_TITLES = {
    ActionKind.VENTILATE: "Ventilate",
    ActionKind.DEHUMIDIFY: "Dehumidify",
    ActionKind.RAISE_SURFACE_TEMPERATURE: "Raise the surface temperature",
    ActionKind.FIND_SOURCE: "Find the moisture source",
}


@dataclass(frozen=True, slots=True)
class Action:
    """One thing to do, why, and its numbers (SI unit in each key)."""

    kind: ActionKind
    reason: str
    values: Mapping[str, float | int | str | bool | None]
    threshold_keys: tuple[str, ...]

    @property
    def title(self) -> str:
        return ACTION_TITLES[self.kind]

    def as_dict(self) -> dict:
        """JSON-ready: ``kind``, ``reason``, the numbers, ``threshold_keys``."""
        return {"kind": self.kind.value, "reason": self.reason, **self.values,
                "threshold_keys": list(self.threshold_keys)}


@dataclass(frozen=True, slots=True)
class Caution:
    """A safety note keyed to a finding."""

    key: str
    text: str
    threshold_keys: tuple[str, ...] = ()


@dataclass(frozen=True, slots=True)
class MoistureEstimate:
    """Moisture generated in the room, g/h, by each basis that could be worked out."""

    occupants_g_per_h: float | None
    activities_g_per_h: float | None
    back_calculated_g_per_h: float | None
    used_g_per_h: float | None
    basis: str
    threshold_keys: tuple[str, ...]


@dataclass(frozen=True, slots=True)
class RoomAdvice:
    room: str
    target_rh_pct: float
    target_basis: str
    moisture: MoistureEstimate
    actions: tuple[Action, ...]
    cautions: tuple[Caution, ...]

    @property
    def threshold_keys(self) -> tuple[str, ...]:
        keys = set(self.moisture.threshold_keys)
        for item in (*self.actions, *self.cautions):
            keys.update(item.threshold_keys)
        return tuple(sorted(keys))


@dataclass(frozen=True, slots=True)
class SiteAdvice:
    rooms: tuple[RoomAdvice, ...]
    cautions: tuple[Caution, ...] = field(default=())  #: every room's, once, closing last


CLOSING_CAUTION = Caution(
    "closing",
    "These findings come from spot readings at the stated instrument accuracies. Follow local "
    "building codes and regulations, and the advice of licensed professionals (electricians, "
    "gas engineers, mould, asbestos and structural specialists), before acting on them.",
)

TARGET_RH_MIN_PCT = 25.0
TARGET_RH_MAX_PCT = 80.0
_WATER_L_PER_KG = 1.0  # 1 kg of water taken as 1 L (0.2 % off at 20 °C)
_CP_DRY_AIR_KJ_PER_KG_K = 1.006  # ASHRAE Fundamentals 2017 ch. 1 eqn 30
_CP_VAPOUR_KJ_PER_KG_K = 1.86  # ASHRAE Fundamentals 2017 ch. 1 eqn 30
_M3_PER_H_PER_CFM = 0.028316846592 * 60.0  # 1 ft = 0.3048 m exactly, so 1 ft³/min = 1.699 m³/h


# --- moisture load -----------------------------------------------------------------------------

def moisture_generation(finding: RoomFinding) -> MoistureEstimate:
    """Moisture the room gains, g/h: from occupants and activities, and back-calculated from
    the measured excess at the assumed air change rate; the larger is used, so the sizing is
    not short."""
    room = finding.room
    keys: list[str] = []
    occupants = activities = back = None
    parts: list[str] = []
    if room.occupants == 0:
        occupants = 0.0
        parts.append("no occupants: 0 g/h")
    elif room.occupants is not None:
        rate_key = th.OCCUPANT_RATE_BY_USE[finding.use]
        rate = th.value(rate_key)
        occupants = room.occupants * rate
        keys.append(rate_key)
        kind = "asleep" if rate_key.endswith("asleep_g_per_h") else "sitting"
        parts.append(f"{room.occupants} {'person' if room.occupants == 1 else 'people'} "
                     f"{kind} at {rate:.0f} g/h each: {occupants:.0f} g/h")
    if room.activities:
        activities = 0.0
        for activity in room.activities:
            rate_key = th.ACTIVITY_RATE[activity.kind]
            activities += th.value(rate_key) * activity.hours_per_day / 24.0
            keys.append(rate_key)
        parts.append(f"activities averaged over the day: {activities:.0f} g/h")
    out = finding.outdoor
    air = finding.air
    if out is not None and room.volume_m3 is not None \
            and air.humidity_ratio_kg_per_kg > out.humidity_ratio_kg_per_kg:
        ach = th.value("assumed_air_change_rate_per_h")
        dry_air = ach * room.volume_m3 / out.specific_volume_m3_per_kg
        back = 1000.0 * dry_air * (air.humidity_ratio_kg_per_kg - out.humidity_ratio_kg_per_kg)
        keys.append("assumed_air_change_rate_per_h")
        parts.append(f"the measured excess over outdoor air at an assumed {ach:g} air "
                     f"changes an hour: {back:.0f} g/h")
    people = None if occupants is None and activities is None else \
        (occupants or 0.0) + (activities or 0.0)
    candidates = [g for g in (people, back) if g is not None]
    used = max(candidates) if candidates else None
    if used is None:
        basis = "not known (give the occupants, or the outdoor air and the room volume)"
    elif len(candidates) == 1:
        basis = "; ".join(parts)
    else:
        basis = "the larger of " + ", and ".join(parts)
    return MoistureEstimate(occupants, activities, back, used, basis, tuple(keys))


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


# --- the target --------------------------------------------------------------------------------

def _target(finding: RoomFinding, target_rh_pct: float | None, fmt: Formatter
            ) -> tuple[float, str, tuple[str, ...]]:
    """(target room RH %, why — a phrase starting with the target, threshold keys)."""
    keys: list[str] = []
    if target_rh_pct is None:
        design = th.value("room_rh_target_default_pct")
        keys.append("room_rh_target_default_pct")
        basis = f"{design:.0f} % RH, the usual target for a room."
    else:
        if not TARGET_RH_MIN_PCT <= target_rh_pct <= TARGET_RH_MAX_PCT:
            raise InputError("target RH", f"{target_rh_pct:g}",
                             f"must be between {TARGET_RH_MIN_PCT:g} and "
                             f"{TARGET_RH_MAX_PCT:g} %")
        design = target_rh_pct
        basis = f"{design:.0f} % RH, the target given."
    limit = finding.max_room_rh_pct
    if limit is None or limit >= design:
        return design, basis, tuple(keys)
    keys += ["surface_rh_mould_limit_pct", "dew_point_margin_k", "room_rh_floor_pct"]
    floor = th.value("room_rh_floor_pct")
    coldest = finding.coldest
    # A limit is shown and held in whole percent, rounded down so it stays on the safe side.
    whole = float(math.floor(limit))
    target = max(whole, min(floor, design))
    surface = f"the coldest surface ({coldest.label}, {fmt('temperature', coldest.surface_temp_c)})"
    if finding.max_room_rh_pct_mould <= finding.max_room_rh_pct_margin:
        passes = (f"goes over {th.value('surface_rh_mould_limit_pct'):.0f} % surface RH, "
                  f"the mould limit")
    else:
        passes = (f"comes within "
                  f"{fmt('temperature_difference', th.value('dew_point_margin_k'))} of the "
                  f"dew point")
    if target > whole:
        basis = (f"{target:.0f} % RH, the lowest it is practical to hold. Above {whole:.0f} %, "
                 f"{surface} {passes}, so it must also be made warmer.")
    else:
        basis = f"{target:.0f} % RH: above that, {surface} {passes}."
    return target, basis, tuple(keys)


# --- actions -----------------------------------------------------------------------------------

def _pct(x: float) -> str:
    return f"{x:.0f} %"


_USE_PHRASE = {"bedroom": "a bedroom", "bathroom": "a bathroom", "kitchen": "a kitchen",
               "living": "a living room", "basement": "a basement", "crawlspace": "a crawl space",
               "loft": "a loft", "office": "an office", "storage": "a store room", "hallway": "a hallway",
               "other": "a room of this kind"}


def _ventilate(finding: RoomFinding, target: float, target_air: AirState,
               moisture: MoistureEstimate, fmt: Formatter) -> tuple[Action, float | None]:
    out = finding.outdoor
    air = finding.air
    room = finding.room
    wt, wo = target_air.humidity_ratio_kg_per_kg, out.humidity_ratio_kg_per_kg
    keys = ["ventilation_outdoor_drier_margin_g_per_kg", *moisture.threshold_keys]
    values: dict = {"target_rh_pct": target, "target_humidity_ratio_g_per_kg": 1000 * wt,
                    "outdoor_humidity_ratio_g_per_kg": 1000 * wo,
                    "moisture_generation_g_per_h": moisture.used_g_per_h}
    text = (f"Outdoor air is drier: it holds {fmt('humidity_ratio', wo)} of water, against "
            f"{fmt('humidity_ratio', wt)} in room air at {_pct(target)}.")
    ach = None
    if moisture.used_g_per_h is None:
        text += (" The airflow cannot be sized without the moisture load: give the number of "
                 "occupants, or the room volume.")
    else:
        dry_air, flow = ventilation_airflow(moisture.used_g_per_h / 1000.0, wt, wo,
                                            out.specific_volume_m3_per_kg)
        values.update(dry_air_flow_kg_per_h=dry_air, airflow_m3_per_h=flow,
                      airflow_ft3_per_min=flow / _M3_PER_H_PER_CFM)
        text += f" About {fmt('airflow', flow)} of outdoor air"
        if room.volume_m3 is not None:
            ach = flow / room.volume_m3
            values["air_changes_per_h"] = ach
            text += (f" ({ach:.1f} air changes an hour in this "
                     f"{fmt('volume', room.volume_m3)} room)")
        text += (f" carries away {moisture.used_g_per_h:.0f} g/h of moisture and holds the "
                 f"room at {_pct(target)}. Moisture load: {moisture.basis}.")
        if air.dry_bulb_c > out.dry_bulb_c:
            heat_w = (dry_air / 3600.0 * (_CP_DRY_AIR_KJ_PER_KG_K + _CP_VAPOUR_KJ_PER_KG_K * wo)
                      * (air.dry_bulb_c - out.dry_bulb_c) * 1000.0)
            values["heat_to_warm_air_w"] = heat_w
            text += (f" Warming that air to {fmt('temperature', air.dry_bulb_c)} takes about "
                     f"{heat_w:.0f} W of heating.")
        text += (" Use trickle vents or a continuous extract fan; open windows fully for a "
                 "few minutes, often, rather than leaving one ajar.")
    return Action(ActionKind.VENTILATE, text, values, tuple(dict.fromkeys(keys))), ach


def _dehumidify(finding: RoomFinding, target: float, target_air: AirState,
                moisture: MoistureEstimate, fmt: Formatter, why: str,
                air_changes_per_h: float | None = None) -> Action:
    """Water to take out: a one-off pull-down of the room air plus the daily load, with
    outdoor air coming in at ``air_changes_per_h`` (default: the assumed rate)."""
    room = finding.room
    air = finding.air
    out = finding.outdoor
    wt = target_air.humidity_ratio_kg_per_kg
    keys = ["dehumidifier_rating_old_dry_bulb_c", "dehumidifier_rating_current_dry_bulb_c",
            "dehumidifier_rating_rh_pct", "refrigerant_dehumidifier_min_c", "us_pint_l",
            *moisture.threshold_keys]
    values: dict = {"target_rh_pct": target, "target_humidity_ratio_g_per_kg": 1000 * wt,
                    "room_temp_c": air.dry_bulb_c}
    generation = (moisture.used_g_per_h or 0.0) / 1000.0
    outdoor_air = 0.0
    gains = []
    if moisture.used_g_per_h is not None:
        gains.append(f"the room gains {moisture.used_g_per_h:.0f} g/h "
                     f"(moisture load: {moisture.basis})")
    if out is not None and room.volume_m3 is not None:
        if air_changes_per_h is None:
            air_changes_per_h = th.value("assumed_air_change_rate_per_h")
            keys.append("assumed_air_change_rate_per_h")
            how = "leaking in"
        else:
            how = "ventilating"
        dry_air = air_changes_per_h * room.volume_m3 / out.specific_volume_m3_per_kg
        outdoor_air = dry_air * (out.humidity_ratio_kg_per_kg - wt)
        values["outdoor_air_changes_per_h"] = air_changes_per_h
        verb = "brings" if outdoor_air > 0 else "carries away"
        gains.append(f"outdoor air {how} at about {air_changes_per_h:g} air changes an hour "
                     f"{verb} {abs(outdoor_air) * 1000:.0f} g/h")
    load_l_per_day = max(0.0, generation + outdoor_air) * 24.0 * _WATER_L_PER_KG
    values["load_l_per_day"] = load_l_per_day
    text = why
    removal = load_l_per_day
    if room.volume_m3 is not None:
        pull_down = (room.volume_m3 / air.specific_volume_m3_per_kg
                     * (air.humidity_ratio_kg_per_kg - wt) * _WATER_L_PER_KG)
        values["pull_down_l"] = pull_down
        removal += pull_down
        text += (f" Bringing the room air down to {_pct(target)} takes {pull_down:.2f} L out "
                 f"of it once.")
    if gains:
        text += (" To hold it there: " + "; ".join(gains)
                 + f"; {fmt('water_rate', load_l_per_day)} in all.")
    else:
        text += (" The moisture load to hold it there is not known: give the number of "
                 "occupants, or the outdoor air and the room volume.")
    pint = th.value("us_pint_l")
    values.update(removal_l_per_day=removal, removal_us_pints_per_day=removal / pint)
    text += (f" A dehumidifier should remove at least {fmt('water_rate', removal)} "
             f"({removal / pint:.1f} US pints/day) at this room's conditions on the first "
             f"day; drying wet materials adds much more.")
    old = th.value("dehumidifier_rating_old_dry_bulb_c")
    new = th.value("dehumidifier_rating_current_dry_bulb_c")
    rating_rh = th.value("dehumidifier_rating_rh_pct")
    text += (f" Capacities on labels are measured at {fmt('temperature', old)} and "
             f"{_pct(rating_rh)} RH (older ratings) or {fmt('temperature', new)} and "
             f"{_pct(rating_rh)} RH (current US test); in a room at "
             f"{fmt('temperature', air.dry_bulb_c)} and {_pct(target)} a unit removes less "
             f"than its label says, so choose one rated well above this.")
    cold = th.value("refrigerant_dehumidifier_min_c")
    desiccant = air.dry_bulb_c < cold
    values["suggest_desiccant"] = desiccant
    if desiccant:
        text += (f" Below {fmt('temperature', cold)} a refrigerant unit loses most of its "
                 f"capacity and can ice up: use a desiccant dehumidifier.")
    return Action(ActionKind.DEHUMIDIFY, text, values, tuple(dict.fromkeys(keys)))


def _raise_surface(finding: RoomFinding, surface: SurfaceFinding, design_rh: float,
                   fmt: Formatter) -> Action | None:
    air = finding.air
    floor = th.value("room_rh_floor_pct")
    mould_limit = th.value("surface_rh_mould_limit_pct")
    margin = th.value("dew_point_margin_k")
    max_rh = psychro.max_room_rh_pct(air.dry_bulb_c, surface.surface_temp_c, mould_limit)
    too_cold = max_rh < floor
    factor_under = surface.temperature_factor_state is FactorState.UNDER
    if not (too_cold or factor_under):
        return None
    keys = ["surface_rh_mould_limit_pct", "dew_point_margin_k", "room_rh_floor_pct"]
    design_air = air_state(air.dry_bulb_c, design_rh, air.pressure_pa)
    for_rh = max(psychro.surface_temp_for_rh_c(design_air, mould_limit),
                 design_air.condensation_point_c + margin)
    values: dict = {"surface": surface.label, "surface_temp_c": surface.surface_temp_c,
                    "max_room_rh_pct": max_rh, "surface_temp_for_target_rh_c": for_rh}
    target = for_rh
    reasons = []
    if too_cold:
        reasons.append(f"it stays at or below {_pct(mould_limit)} surface RH only while the "
                       f"room is below {_pct(max_rh)}, under the {_pct(floor)} that can be "
                       f"held in practice")
    if surface.temperature_factor is not None:
        f_limit = surface.temperature_factor_limit
        outdoor_c = finding.outdoor.dry_bulb_c
        for_factor = outdoor_c + f_limit * (air.dry_bulb_c - outdoor_c)
        values.update(temperature_factor=surface.temperature_factor,
                      temperature_factor_limit=f_limit,
                      surface_temp_for_factor_limit_c=for_factor)
        keys += [finding.frsi_limit_key, "frsi_min_temperature_difference_k"]
        if factor_under:
            reasons.append(f"its temperature factor is {surface.temperature_factor:.2f} "
                           f"(±{surface.temperature_factor_uncertainty:.2f}), under the "
                           f"{f_limit:.2f} limit for {_USE_PHRASE[finding.use]}, which today means at "
                           f"least {fmt('temperature', for_factor)}")
            target = max(target, for_factor)
    values["target_surface_temp_c"] = target
    text = (f"{surface.label} is too cold at {fmt('temperature', surface.surface_temp_c)}: "
            + "; ".join(reasons) + ". "
            f"Raise it to at least {fmt('temperature', target)} so the room can be kept at "
            f"{_pct(design_rh)} without mould risk: keep the room heated steadily, move "
            f"furniture off cold walls, and have the insulation, thermal bridge or cold "
            f"corner investigated.")
    if factor_under:
        text += (" The factor comes from one reading: confirm it on another cold day, or with "
                 "a thermal image, before building work.")
    return Action(ActionKind.RAISE_SURFACE_TEMPERATURE, text, values,
                  tuple(dict.fromkeys(k for k in keys if k)))


def _find_source(finding: RoomFinding, fmt: Formatter) -> tuple[Action | None, bool]:
    """The find-the-source action, and whether it comes first (liquid water suspected)."""
    room = finding.room
    obs = room.observations
    first: list[str] = []
    later: list[str] = []
    keys: list[str] = []
    values: dict = {}
    wet = [m for m in finding.materials if m.dry_standard_state is DryStandardState.ABOVE]
    if wet:
        keys.append("dry_standard_tolerance_fraction")
        first.append("material readings above the dry standard (" + ", ".join(
            f"{m.label} {m.value:g} against {m.dry_standard:g}" for m in wet) + ")")
        values["materials_above_dry_standard"] = len(wet)
    damp_timber = [m for m in finding.materials if m.wetter_than_air_explains]
    if damp_timber:
        keys += ["timber_mould_mc_pct", "timber_decay_mc_pct"]
        first.append("timber wetter than the room air can explain (" + ", ".join(
            f"{m.label} {m.value:g} % against {m.emc_pct:.1f} % in equilibrium with the air"
            for m in damp_timber) + ")")
    decaying = [m for m in finding.materials if m.timber_state is TimberState.DECAY_RANGE]
    if decaying:
        keys.append("timber_decay_mc_pct")
        limit = th.value("timber_decay_mc_pct")
        slowed = any(m.decay_slowed_by_temperature for m in decaying)
        first.append("timber at or above the " + f"{limit:.0f} % moisture content at which "
                     "decay fungi grow (" + ", ".join(f"{m.label} {m.value:g} %" for m in decaying)
                     + "): have it checked for rot"
                     + (" — decay is slow at today's temperature, not stopped" if slowed else ""))
    if obs.standing_water or obs.water_category is not None:
        first.append("water present in the room" if obs.water_category is None else
                     f"category {obs.water_category} water in the room")
    surfaces = finding.surfaces
    if obs.condensation_seen and not any(
            s.condensation is not CondensationState.CLEAR for s in surfaces):
        first.append("condensation was seen, but " + (
            "no surface was measured" if not surfaces else
            "the measured surfaces are clear of the dew point: it may come from moments "
            "of higher humidity (cooking, drying laundry) or from water getting in"))
    if obs.visible_mould_area_m2 > 0 and not any(
            s.mould is not MouldState.BELOW for s in surfaces):
        first.append("mould is visible, but " + (
            "no surface was measured" if not surfaces else
            "the measured surfaces are below the mould limit today: look for a leak, damp "
            "coming through the wall, or times of higher humidity"))
    if obs.odour:
        later.append("a musty smell, which can mean hidden mould behind linings, under "
                     "floors or in voids")
    if finding.humidity_class is not None:
        wet_room = finding.use in ("kitchen", "bathroom")
        high = th.value("humidity_class_high") + (1 if wet_room else 0)
        if finding.humidity_class >= high:
            keys += ["humidity_class_high", *th.HUMIDITY_CLASS_KEYS]
            values.update(vapour_pressure_excess_pa=finding.vapour_pressure_excess_pa,
                          humidity_class=finding.humidity_class)
            later.append(
                f"the room air holds {fmt('vapour_pressure', finding.vapour_pressure_excess_pa)}"
                f" more vapour pressure than outdoors, "
                f"{th.humidity_class_text(finding.humidity_class)} of EN ISO 13788 — more "
                f"than {_USE_PHRASE[finding.use]} should produce (look for laundry drying indoors, "
                f"unflued heaters, a blocked or missing extract, or a leak)")
    reasons = first + later
    if not reasons:
        return None, False
    text = ("Find and deal with the source of moisture before drying or decorating: "
            + "; ".join(reasons) + ".")
    return Action(ActionKind.FIND_SOURCE, text, values, tuple(dict.fromkeys(keys))), bool(first)


# --- cautions ----------------------------------------------------------------------------------

def _cautions(finding: RoomFinding, actions: tuple[Action, ...], year_built: int | None
              ) -> list[Caution]:
    room = finding.room
    obs = room.observations
    kinds = {a.kind for a in actions}
    out: list[Caution] = []
    area = obs.visible_mould_area_m2
    if area > 0:
        small = th.value("mould_area_small_m2")
        large = th.value("mould_area_large_m2")
        keys = ("mould_area_small_m2", "mould_area_large_m2")
        if area <= small:
            text = (f"Visible mould, about {area:.2g} m²: a small area. A careful adult can "
                    "clean it with detergent and water, wearing gloves, eye protection and a "
                    "disposable respirator (FFP2 / N95); wipe, do not dry-brush; bag the "
                    "waste. People with asthma, allergies or weak immune systems should not "
                    "do it. It returns unless the damp is cured.")
        elif area <= large:
            text = (f"Visible mould, about {area:.2g} m²: a medium area. Have it removed by "
                    "someone trained, with gloves, goggles and at least an FFP2 / N95 "
                    "respirator, the area sealed off with plastic sheeting and the waste "
                    "bagged; keep occupants, above all vulnerable people, out during the "
                    "work.")
        else:
            text = (f"Visible mould, about {area:.3g} m²: a large area. Call a licensed or "
                    "specialist mould remediation contractor: it needs full containment, "
                    "protective equipment and air filtration. Vulnerable occupants should "
                    "not stay in the area.")
        out.append(Caution("visible_mould", text, keys))
    category = obs.water_category
    if category == 3:
        out.append(Caution("water_category_3",
                           "Category 3 water (sewage, flood or other grossly contaminated "
                           "water): stay out without protective equipment (gloves, boots, eye "
                           "protection, respirator). It needs trained, licensed handling; "
                           "soaked porous materials are removed, not dried. Wash hands and "
                           "see a doctor about any illness after contact.",
                           ("water_category_3",)))
    elif category == 2:
        out.append(Caution("water_category_2",
                           "Category 2 water (significantly contaminated, e.g. from a washing "
                           "machine, dishwasher or toilet overflow without faeces): wear "
                           "gloves and eye protection, keep children and pets away, and "
                           "follow the restoration standard of practice for what can be "
                           "dried and what must be removed. Left standing it can become "
                           "category 3.", ("water_category_2",)))
    if (obs.electrics_near_water or obs.standing_water or category is not None
            or ActionKind.DEHUMIDIFY in kinds):
        out.append(Caution("electrics_near_water",
                           "Water and electricity: do not touch switches, sockets or "
                           "appliances that are wet or in standing water; have a qualified "
                           "electrician make wet circuits safe before work. Run "
                           "dehumidifiers and fans from a socket with residual-current "
                           "protection (RCD / GFCI), leads kept off wet floors."))
    if finding.use in th.CONFINED_USES:
        out.append(Caution("confined_space",
                           f"{finding.use.capitalize()}: a confined or hard-to-reach space. "
                           "Do not go in alone, tell someone where you are, and check "
                           "before entering for poor air (low oxygen, gas, sewer gas, "
                           "combustion fumes), unsafe floors or joists, sharp fixings, pests "
                           "and live wiring. Local rules may require confined-space entry "
                           "procedures."))
    drying = bool(kinds & {ActionKind.DEHUMIDIFY, ActionKind.RAISE_SURFACE_TEMPERATURE}) \
        or category is not None or obs.standing_water
    if drying:
        water = th.value("propane_water_kg_per_kg")
        out.append(Caution("combustion_heaters",
                           "Do not heat or dry with unflued gas or paraffin heaters: burning "
                           f"1 kg of propane releases about {water:.1f} kg of water vapour "
                           "into the room, and they give off carbon monoxide. Use electric "
                           "heat, and fit a carbon monoxide alarm where any fuel-burning "
                           "appliance runs.", ("propane_water_kg_per_kg",)))
    disturbing = bool(kinds & {ActionKind.RAISE_SURFACE_TEMPERATURE, ActionKind.FIND_SOURCE}) \
        or area > th.value("mould_area_small_m2") or category in (2, 3)
    if disturbing:
        asbestos = th.value("asbestos_possible_before_year")
        lead = th.value("lead_paint_possible_before_year")
        risks = []
        if year_built is None or year_built < asbestos:
            risks.append(f"asbestos (used in buildings up to about {asbestos:.0f})")
        if year_built is None or year_built < lead:
            risks.append(f"lead paint (common before {lead:.0f})")
        if risks:
            age = "of unknown age" if year_built is None else f"built in {year_built}"
            out.append(Caution(
                "asbestos_lead",
                f"Old materials: in a building {age}, have suspect materials checked for "
                + " and ".join(risks) + " before drilling, cutting, sanding, stripping or "
                "removing anything (linings, ceilings, floor tiles, pipe lagging, textured "
                "coatings, old paint). Do not disturb suspect material; use a licensed "
                "surveyor or contractor.",
                ("asbestos_possible_before_year", "lead_paint_possible_before_year")))
    out.append(CLOSING_CAUTION)
    return out


# --- the advice --------------------------------------------------------------------------------

def advise_room(finding: RoomFinding, target_rh_pct: float | None = None,
                year_built: int | None = None, fmt: Formatter = si_text) -> RoomAdvice:
    """Ordered actions and cautions for one room.

    Order: find the source first when liquid water is suspected; then ventilate or
    dehumidify (whichever can do the job comes first); then raise surface temperatures;
    a source suggested only by the humidity class or a smell comes last.
    """
    air = finding.air
    out = finding.outdoor
    target, basis, target_keys = _target(finding, target_rh_pct, fmt)
    design = (th.value("room_rh_target_default_pct") if target_rh_pct is None
              else target_rh_pct)
    target_air = air_state(air.dry_bulb_c, target, air.pressure_pa)
    moisture = moisture_generation(finding)
    actions: list[Action] = []

    source, source_first = _find_source(finding, fmt)
    if source is not None and source_first:
        actions.append(source)

    if air.rh_pct > target:
        margin = th.value("ventilation_outdoor_drier_margin_g_per_kg") / 1000.0
        outdoor_drier = (out is not None and out.humidity_ratio_kg_per_kg
                         <= target_air.humidity_ratio_kg_per_kg - margin)
        if outdoor_drier:
            ventilate, ach = _ventilate(finding, target, target_air, moisture, fmt)
            ventilate = Action(ventilate.kind, f"Bring the room from {_pct(air.rh_pct)} "
                               f"down to {basis} " + ventilate.reason,
                               ventilate.values,
                               tuple(dict.fromkeys(target_keys + ventilate.threshold_keys)))
            actions.append(ventilate)
            practical = th.value("ventilation_practical_max_ach")
            if ach is not None and ach > practical:
                why = (f"Ventilation alone needs {ach:.1f} air changes an hour, more than the "
                       f"about {practical:g} that is practical: ventilate at {practical:g} "
                       f"and let a dehumidifier do the rest.")
                dehumidify = _dehumidify(finding, target, target_air, moisture, fmt, why,
                                         air_changes_per_h=practical)
                actions.append(Action(dehumidify.kind, dehumidify.reason, dehumidify.values,
                                      dehumidify.threshold_keys
                                      + ("ventilation_practical_max_ach",)))
        else:
            if out is None:
                why = (f"Bring the room from {_pct(air.rh_pct)} down to {basis} "
                       f"The outdoor air was not measured: if it is drier than "
                       f"{fmt('humidity_ratio', target_air.humidity_ratio_kg_per_kg)}, "
                       f"ventilation works too.")
            else:
                why = (f"Bring the room from {_pct(air.rh_pct)} down to {basis} "
                       f"Outdoor air holds "
                       f"{fmt('humidity_ratio', out.humidity_ratio_kg_per_kg)} of water, not "
                       f"usefully less than the "
                       f"{fmt('humidity_ratio', target_air.humidity_ratio_kg_per_kg)} of room "
                       f"air at the target, so ventilating would not dry the room: keep "
                       f"windows and doors to outside closed while dehumidifying.")
            dehumidify = _dehumidify(finding, target, target_air, moisture, fmt, why)
            extra = () if out is None else ("ventilation_outdoor_drier_margin_g_per_kg",)
            actions.append(Action(dehumidify.kind, dehumidify.reason, dehumidify.values,
                                  tuple(dict.fromkeys(target_keys + dehumidify.threshold_keys
                                                      + extra))))

    for surface in sorted(finding.surfaces, key=lambda s: s.surface_temp_c):
        action = _raise_surface(finding, surface, design, fmt)
        if action is not None:
            actions.append(action)

    if source is not None and not source_first:
        actions.append(source)

    actions_t = tuple(actions)
    cautions = tuple(_cautions(finding, actions_t, year_built))
    return RoomAdvice(room=finding.name, target_rh_pct=target, target_basis=basis,
                      moisture=moisture, actions=actions_t, cautions=cautions)


def advise_site(site: SiteFinding, target_rh_pct: float | None = None,
                fmt: Formatter = si_text) -> SiteAdvice:
    """Advice for every room; the site's cautions are every room's, once, closing last."""
    rooms = tuple(advise_room(r, target_rh_pct, site.year_built, fmt) for r in site.rooms)
    seen: dict[str, Caution] = {}
    for advice in rooms:
        for caution in advice.cautions:
            if caution.key != "closing":
                seen.setdefault(caution.text, caution)
    return SiteAdvice(rooms=rooms, cautions=(*seen.values(), CLOSING_CAUTION))
