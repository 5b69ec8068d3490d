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
  (ASHRAE ch. 1 eqn 30, enthalpy of moist air). At a given flow the room settles at
  W = W_o + G / ṁ_da.
* Back-calculated generation: G = ṁ_da (W_i − W_o) with ṁ_da = n·V / v_o at an assumed air
  change rate n (threshold ``assumed_air_change_rate_per_h``).
* Dehumidification: the load per day, 24 h × (G + ṁ_out (W_o − W_t)), with outdoor air
  coming in at the assumed rate (or at the ventilation rate advised beside it); 1 kg of
  water taken as 1 L. Taking the room air itself down to the target, V / v_i · (W_i − W_t),
  is a one-off amount in litres (``pull_down_l``), never added to a per-day figure.

When ventilation helps
----------------------
Outdoor air dries a room when it holds less water than the room air *now*, by the margin
``ventilation_outdoor_drier_margin_g_per_kg``. It can *hold* the target only when it is that
much drier than room air at the target, and only within the practical air change rate; when
it cannot, ventilation is still advised as far as it helps, and a dehumidifier (and, where a
surface needs it, a warmer surface) does the rest. The advice never says to keep windows
closed while outdoor air is drier than the room air.

Text is written for the inspector's client. Numbers in text go through a ``Formatter``
called ``fmt(quantity, si_value)`` or ``fmt(quantity, si_value, decimals)``; the default
writes SI without touching pint, and a face may pass
``lambda q, v, d=None: units.format_value(q, v, system, d)`` for IP text.
"""

from __future__ import annotations

import math
from dataclasses import dataclass, field
from enum import Enum
from typing import Callable, Mapping, NamedTuple

from survey import psychro
from survey import thresholds as th
from survey.assess import (AirState, CondensationState, DryStandardState, FactorState,
                           MouldState, RoomFinding, SiteFinding, SurfaceFinding, TimberState,
                           air_state)
from survey.errors import InputError

Formatter = Callable[..., str]

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


def si_text(quantity: str, value_si: float, decimals: int | None = None) -> str:
    """``value_si`` as SI text, e.g. ``si_text("temperature", 11.04)`` gives ``'11.0 °C'``."""
    places, factor, unit = _SI_TEXT[quantity]
    if decimals is not None:
        places = decimals
    text = f"{value_si * factor:.{places}f}"
    if text.startswith("-") and float(text) == 0.0:
        text = text[1:]
    return f"{text} {unit}"


class ActionKind(Enum):
    VENTILATE = "ventilate"
    DEHUMIDIFY = "dehumidify"
    RAISE_SURFACE_TEMPERATURE = "raise_surface_temperature"
    FIND_SOURCE = "find_source"
    KEEP_DRYING = "keep_drying"
    REDUCE_GLAZING_CONDENSATION = "reduce_glazing_condensation"
    INSULATE_PIPE = "insulate_pipe"
    REPEAT_READINGS = "repeat_readings"
    DRY_VENTILATED_SPACE = "dry_ventilated_space"

    def __str__(self) -> str:
        return self.value


ACTION_TITLES = {
    ActionKind.VENTILATE: "Ventilate",
    ActionKind.DEHUMIDIFY: "Dehumidify",
    ActionKind.RAISE_SURFACE_TEMPERATURE: "Raise the surface temperature",
    ActionKind.FIND_SOURCE: "Find the moisture source",
    ActionKind.KEEP_DRYING: "Keep drying to the dry standard",
    ActionKind.REDUCE_GLAZING_CONDENSATION: "Deal with condensation on the window",
    ActionKind.INSULATE_PIPE: "Lag the pipe",
    ActionKind.REPEAT_READINGS: "Repeat the readings",
    ActionKind.DRY_VENTILATED_SPACE: "Cut the moisture reaching the space",
}


@dataclass(frozen=True, slots=True)
class Action:
    """One thing to do, why, and its numbers (SI unit in each key)."""

    kind: ActionKind
    reason: str
    values: Mapping[str, object]
    threshold_keys: tuple[str, ...]

    @property
    def title(self) -> str:
        """The kind's title; an action about one surface names it (two surfaces, two
        titles)."""
        surface = self.values.get("surface")
        base = ACTION_TITLES[self.kind]
        return f"{base}: {surface}" if surface else base

    def as_dict(self) -> dict:
        """JSON-ready: ``kind``, ``title``, ``reason``, the numbers, ``threshold_keys``."""
        return {"kind": self.kind.value, "title": self.title, "reason": self.reason,
                **self.values, "threshold_keys": list(self.threshold_keys)}


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
    missing: str = ""  #: what to give so the load can be worked out ("" when known)


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


# --- small words -------------------------------------------------------------------------------

_G_PER_LB = 453.59237  # 1 lb = 0.45359237 kg exactly
_BTU_H_PER_W = 3.412142  # 1 W = 3.412142 Btu/h (International Table Btu)


def _is_ip(fmt: Formatter) -> bool:
    """Whether the face writes IP units (temperatures in °F)."""
    return fmt("temperature", 0.0).endswith("°F")


def _rate(fmt: Formatter, g_per_h: float) -> str:
    """A moisture rate: '65 g/h' in SI text; '1003 gr/h (0.14 lb/h)' in IP text."""
    if _is_ip(fmt):
        return (f"{g_per_h * 7000.0 / _G_PER_LB:.0f} gr/h "
                f"({g_per_h / _G_PER_LB:.2f} lb/h)")
    return f"{g_per_h:.0f} g/h"


def _heat(fmt: Formatter, watts: float) -> str:
    """A heating rate: '64 W' in SI text, '218 Btu/h' in IP text."""
    return f"{watts * _BTU_H_PER_W:.0f} Btu/h" if _is_ip(fmt) else f"{watts:.0f} W"


def round_up_temperature_c(value_c: float, ip: bool = False) -> float:
    """A minimum temperature rounded UP to the shown 0.1 degree (°C, or °F when ``ip``),
    returned in °C, so a shown minimum is never below the true one: 14.25 → 14.3 °C."""
    if ip:
        shown_f = math.ceil((value_c * 9.0 / 5.0 + 32.0) * 10.0 - 1e-6) / 10.0
        return (shown_f - 32.0) * 5.0 / 9.0
    return math.ceil(value_c * 10.0 - 1e-6) / 10.0


def _min_temp(fmt: Formatter, value_c: float) -> str:
    """A minimum surface temperature as text, rounded up."""
    return fmt("temperature", round_up_temperature_c(value_c, _is_ip(fmt)))


def _pct(x: float) -> str:
    return f"{x:.0f} %"


def _water(fmt: Formatter, litres_per_day: float) -> str:
    """A water rate in the face's unit with the other beside it: '2.1 L/day (4.4 US
    pints/day)' or '4.4 pt/day (2.1 L/day)'."""
    text = fmt("water_rate", litres_per_day)
    if text.endswith("L/day"):
        return f"{text} ({litres_per_day / th.value('us_pint_l'):.1f} US pints/day)"
    return f"{text} ({si_text('water_rate', litres_per_day)})"


def _nominal_temperature(fmt: Formatter, temp_c: float) -> str:
    """A temperature defined in whole degrees Fahrenheit (a test condition): whole °F in IP
    text, so 80 °F reads as 80 °F and not as a conversion back from 26.7 °C."""
    text = fmt("temperature", temp_c)
    return fmt("temperature", temp_c, 0) if text.endswith("°F") else text


_USE_PHRASE = {"bedroom": "a bedroom", "bathroom": "a bathroom", "kitchen": "a kitchen",
               "living": "a living room", "basement": "a basement", "crawlspace": "a crawl space",
               "loft": "a loft", "office": "an office", "storage": "a store room",
               "hallway": "a hallway", "other": None}


def _limit_phrase(finding: RoomFinding, limit: float) -> str:
    """'the 0.75 limit for a bedroom', or 'the general 0.70 limit' when the use is not
    known."""
    phrase = _USE_PHRASE[finding.use]
    return f"the general {limit:.2f} limit" if phrase is None else \
        f"the {limit:.2f} limit for {phrase}"


def _condensation_words(surface: SurfaceFinding) -> tuple[str, str]:
    """('dew point' or 'frost point', 'water' or 'frost') for what forms on the surface."""
    if surface.below_freezing:
        return "frost point", "frost"
    return "dew point", "water"


def _drying(finding: RoomFinding):
    """The room's running drying equipment (dehumidifiers, air movers), or None."""
    obs = finding.room.observations
    return obs.drying if obs.drying_in_progress else None


def _gr_per_lb(w_kg_per_kg: float) -> float:
    """Grains of water per pound of dry air: 7000 × W (7000 grains = 1 lb)."""
    return 7000.0 * w_kg_per_kg


#: Uses whose air is usually closed up and unoccupied (no occupants given: taken as 0).
_CLOSED_UP_USES = frozenset({"basement", "crawlspace", "loft", "storage"})


# --- moisture load -----------------------------------------------------------------------------

def _missing_for_load(finding: RoomFinding) -> str:
    """What to give so the moisture load can be worked out: only what was not given."""
    room = finding.room
    out = finding.outdoor
    people = "the number of occupants"
    missing = [name for name, absent in (("the outdoor air", out is None),
                                         ("the room volume", room.volume_m3 is None)) if absent]
    if missing:
        return f"give {people}, or " + " and ".join(missing)
    return (f"give {people}: the load cannot be worked out from the measured excess while "
            f"outdoor air holds as much water as the room air or more")


def moisture_generation(finding: RoomFinding, fmt: Formatter = None) -> MoistureEstimate:
    """Moisture the room gains, g/h: from occupants and activities, and back-calculated from
    the measured excess at the assumed air change rate; the larger is used, so the sizing is
    not short."""
    fmt = fmt or si_text
    room = finding.room
    keys: list[str] = []
    occupants = activities = back = None
    parts: list[str] = []
    if room.occupants == 0:
        occupants = 0.0
        parts.append(f"no occupants: {_rate(fmt, 0.0)}")
    elif room.occupants is None and finding.use in _CLOSED_UP_USES and not room.activities:
        occupants = 0.0
        parts.append(f"occupants not given, taken as 0 for {_USE_PHRASE[finding.use]} "
                     f"that is closed up: {_rate(fmt, 0.0)}")
    elif room.occupants is not None:
        rate_key = th.OCCUPANT_RATE_BY_USE[finding.use]
        rate = th.value(rate_key)
        occupants = room.occupants * rate
        keys.append(rate_key)
        kind = "asleep" if rate_key.endswith("asleep_g_per_h") else "sitting"
        parts.append(f"{room.occupants} {'person' if room.occupants == 1 else 'people'} "
                     f"{kind} at {_rate(fmt, rate)} each: {_rate(fmt, occupants)}")
    if room.activities:
        activities = 0.0
        for activity in room.activities:
            rate_key = th.ACTIVITY_RATE[activity.kind]
            activities += th.value(rate_key) * activity.hours_per_day / 24.0
            keys.append(rate_key)
        parts.append(f"activities averaged over the day: {_rate(fmt, activities)}")
    out = finding.outdoor
    air = finding.air
    if out is not None and room.volume_m3 is not None \
            and air.humidity_ratio_kg_per_kg > out.humidity_ratio_kg_per_kg:
        ach = th.value("assumed_air_change_rate_per_h")
        dry_air = ach * room.volume_m3 / out.specific_volume_m3_per_kg
        back = 1000.0 * dry_air * (air.humidity_ratio_kg_per_kg - out.humidity_ratio_kg_per_kg)
        keys.append("assumed_air_change_rate_per_h")
        parts.append(f"the measured excess over outdoor air at an assumed {ach:g} air "
                     f"changes an hour: {_rate(fmt, back)}")
    people = None if occupants is None and activities is None else \
        (occupants or 0.0) + (activities or 0.0)
    candidates = [g for g in (people, back) if g is not None]
    used = max(candidates) if candidates else None
    missing = ""
    if used is None:
        missing = _missing_for_load(finding)
        basis = f"not known ({missing})"
    elif len(candidates) == 1:
        basis = "; ".join(parts)
    else:
        basis = "the larger of " + ", and ".join(parts)
    return MoistureEstimate(occupants, activities, back, used, basis, tuple(keys), missing)


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


def _rh_at(air: AirState, humidity_ratio_kg_per_kg: float) -> float:
    """RH (%) of air at the room's temperature holding ``humidity_ratio`` (capped at 100)."""
    return psychro.state_from_humidity_ratio(air.dry_bulb_c, humidity_ratio_kg_per_kg,
                                             air.pressure_pa).rh_pct


# --- the target --------------------------------------------------------------------------------

def rh_limit_shown(limit_pct: float) -> int:
    """A highest-safe room RH as it is shown and held: whole percent, rounded down so it
    stays on the safe side. Every face uses this, so a headline and the text below agree."""
    return int(math.floor(limit_pct + 1e-9))


def _target(finding: RoomFinding, target_rh_pct: float | None, fmt: Formatter
            ) -> tuple[float, str, tuple[str, ...]]:
    """(target room RH %, why — a phrase starting with the target, threshold keys)."""
    keys: list[str] = []
    if target_rh_pct is None and _drying(finding) is not None:
        low, design = th.value("drying_rh_target_low_pct"), th.value("drying_rh_target_pct")
        keys += ["drying_rh_target_low_pct", "drying_rh_target_pct"]
        basis = (f"{design:.0f} % RH, the top of the {low:.0f}-{design:.0f} % RH drying "
                 f"target (common practice) while materials dry, not the "
                 f"{th.value('room_rh_target_default_pct'):.0f} % target for everyday use.")
        return design, basis, tuple(keys)
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
    whole = float(rh_limit_shown(limit))
    target = max(whole, min(floor, design))
    surface = (f"the coldest wall, ceiling or floor ({coldest.label}, "
               f"{fmt('temperature', coldest.surface_temp_c)})")
    if finding.max_room_rh_pct_mould <= finding.max_room_rh_pct_margin:
        passes = (f"goes over {th.value('surface_rh_mould_limit_pct'):.0f} % surface RH, "
                  f"the mould limit")
    else:
        point = "frost point" if finding.air.condensation_point_c <= psychro.TRIPLE_POINT_C \
            else "dew point"
        passes = (f"comes within "
                  f"{fmt('temperature_difference', th.value('dew_point_margin_k'))} of the "
                  f"{point}")
    if target_rh_pct is not None and target < design:
        passes += f" (so the {design:.0f} % given was lowered to {target:.0f} %)"
    if target > whole:
        basis = (f"{target:.0f} % RH, the lowest it is practical to hold. Above {whole:.0f} %, "
                 f"{surface} {passes}, so it must also be made warmer.")
    else:
        basis = f"{target:.0f} % RH: above that, {surface} {passes}."
    return target, basis, tuple(keys)


# --- ventilation and dehumidification --------------------------------------------------------

def _humidity_values(finding: RoomFinding, target: float, target_air: AirState,
                     moisture: MoistureEstimate) -> dict:
    values: dict = {"target_rh_pct": target,
                    "target_humidity_ratio_g_per_kg": target_air.humidity_ratio_g_per_kg,
                    "room_humidity_ratio_g_per_kg": finding.air.humidity_ratio_g_per_kg}
    if finding.outdoor is not None:
        values["outdoor_humidity_ratio_g_per_kg"] = finding.outdoor.humidity_ratio_g_per_kg
    values["moisture_generation_g_per_h"] = moisture.used_g_per_h
    return values


def _ventilate(finding: RoomFinding, target: float, target_air: AirState,
               moisture: MoistureEstimate, fmt: Formatter) -> tuple[Action, float | None]:
    """Ventilation sized to hold the target (outdoor air usefully drier than room air at
    the target)."""
    out = finding.outdoor
    air = finding.air
    room = finding.room
    wt, wo = target_air.humidity_ratio_kg_per_kg, out.humidity_ratio_kg_per_kg
    keys = ["ventilation_outdoor_drier_margin_g_per_kg", *moisture.threshold_keys]
    values = _humidity_values(finding, target, target_air, moisture)
    values["target_reachable_by_ventilation"] = True
    text = (f"Outdoor air is drier than the room air: it holds {fmt('humidity_ratio', wo)} of "
            f"water, against {fmt('humidity_ratio', air.humidity_ratio_kg_per_kg)} in the room "
            f"now and {fmt('humidity_ratio', wt)} in room air at {_pct(target)}.")
    ach = None
    if moisture.used_g_per_h is None:
        text += (" The airflow cannot be sized without the moisture load: "
                 f"{moisture.missing}.")
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
        text += (f" carries away {_rate(fmt, moisture.used_g_per_h)} of moisture and holds the "
                 f"room at {_pct(target)}. Moisture load: {moisture.basis}.")
        if air.dry_bulb_c > out.dry_bulb_c:
            heat_w = (dry_air / 3600.0 * (_CP_DRY_AIR_KJ_PER_KG_K + _CP_VAPOUR_KJ_PER_KG_K * wo)
                      * (air.dry_bulb_c - out.dry_bulb_c) * 1000.0)
            values["heat_to_warm_air_w"] = heat_w
            text += (f" Warming that air to {fmt('temperature', air.dry_bulb_c)} takes about "
                     f"{_heat(fmt, heat_w)} of heating.")
        text += (" Use trickle vents or a continuous extract fan; open windows fully for a "
                 "few minutes, often, rather than leaving one ajar.")
    return Action(ActionKind.VENTILATE, text, values, tuple(dict.fromkeys(keys))), ach


def _ventilate_partly(finding: RoomFinding, target: float, target_air: AirState,
                      moisture: MoistureEstimate, fmt: Formatter
                      ) -> tuple[Action, float | None]:
    """Outdoor air is drier than the room now but not usefully drier than room air at the
    target: ventilate as far as it helps; returns the air change rate a dehumidifier
    beside it should be sized with (None: the assumed background rate)."""
    out = finding.outdoor
    air = finding.air
    room = finding.room
    wt, wo = target_air.humidity_ratio_kg_per_kg, out.humidity_ratio_kg_per_kg
    cap = th.value("ventilation_practical_max_ach")
    margin = th.value("ventilation_outdoor_drier_margin_g_per_kg") / 1000.0
    keys = ["ventilation_outdoor_drier_margin_g_per_kg", "ventilation_practical_max_ach",
            *moisture.threshold_keys]
    warmed = _rh_at(air, wo)
    values = _humidity_values(finding, target, target_air, moisture)
    values.update(target_reachable_by_ventilation=False,
                  outdoor_air_rh_at_room_temp_pct=warmed)
    text = (f"Outdoor air is drier than the room air: it holds {fmt('humidity_ratio', wo)} of "
            f"water against {fmt('humidity_ratio', air.humidity_ratio_kg_per_kg)} in the room "
            f"now, so airing the room brings it down. Ventilation alone cannot hold "
            f"{_pct(target)}: room air at {_pct(target)} holds {fmt('humidity_ratio', wt)}, ")
    if wo >= wt:
        text += (f"no more than outdoor air, which warmed to "
                 f"{fmt('temperature', air.dry_bulb_c)} is itself at {_pct(warmed)}.")
    else:
        text += (f"less than {fmt('humidity_ratio', margin)} more than outdoor air, so the "
                 f"airflow needed would grow out of proportion (outdoor air warmed to "
                 f"{fmt('temperature', air.dry_bulb_c)} is at {_pct(warmed)}).")
    dehumidify_ach = None
    if wo < wt and room.volume_m3 is not None:
        flow = cap * room.volume_m3
        dry_air = flow / out.specific_volume_m3_per_kg
        values.update(airflow_m3_per_h=flow, air_changes_per_h=cap,
                      airflow_ft3_per_min=flow / _M3_PER_H_PER_CFM, dry_air_flow_kg_per_h=dry_air)
        text += (f" Ventilate at about {cap:g} air changes an hour ({fmt('airflow', flow)}), "
                 f"the most that is practical")
        if moisture.used_g_per_h is not None:
            settles = _rh_at(air, wo + moisture.used_g_per_h / 1000.0 / dry_air)
            values["rh_at_practical_ventilation_pct"] = settles
            text += (f": against {_rate(fmt, moisture.used_g_per_h)} of moisture the room would "
                     f"settle near {_pct(settles)}")
        text += ("; a dehumidifier does the rest. Use trickle vents or a continuous extract "
                 "fan, and open windows fully for a few minutes, often.")
        dehumidify_ach = cap
    elif wo < wt:
        text += (" Ventilate steadily (trickle vents, a continuous extract fan) and let a "
                 "dehumidifier do the rest; give the room volume to size the airflow.")
    else:
        text += (f" Air the room out (windows wide open for a few minutes, several times a "
                 f"day) while it is above about {_pct(warmed)}; from there on, keep to "
                 f"background ventilation (trickle vents, extract fans) while a dehumidifier "
                 f"takes it down to {_pct(target)}.")
    return (Action(ActionKind.VENTILATE, text, values, tuple(dict.fromkeys(keys))),
            dehumidify_ach)


def _dehumidify(finding: RoomFinding, target: float, target_air: AirState,
                moisture: MoistureEstimate, fmt: Formatter, why: str,
                air_changes_per_h: float | None = None,
                extra_keys: tuple[str, ...] = (), drying=None) -> Action:
    """Water to take out per day to hold the target, with outdoor air coming in at
    ``air_changes_per_h`` (default: the assumed rate); the one-off pull-down of the room air
    is stated apart, in litres."""
    room = finding.room
    air = finding.air
    out = finding.outdoor
    wt = target_air.humidity_ratio_kg_per_kg
    keys = [*extra_keys, "dehumidifier_rating_old_dry_bulb_c",
            "dehumidifier_rating_current_dry_bulb_c", "dehumidifier_rating_rh_pct",
            "refrigerant_dehumidifier_min_c", "us_pint_l", *moisture.threshold_keys]
    values: dict = {"target_rh_pct": target, "target_humidity_ratio_g_per_kg": 1000 * wt,
                    "room_temp_c": air.dry_bulb_c}
    pint = th.value("us_pint_l")
    generation = moisture.used_g_per_h
    outdoor_g_per_h = None
    gains = []
    if generation is not None:
        gains.append(f"the room gains {_rate(fmt, generation)} (moisture load: {moisture.basis})")
    if out is not None and room.volume_m3 is not None:
        if air_changes_per_h is None:
            air_changes_per_h = th.value("assumed_air_change_rate_per_h")
            keys.append("assumed_air_change_rate_per_h")
            how = "leaking in"
        else:
            how = "ventilating"
        dry_air = air_changes_per_h * room.volume_m3 / out.specific_volume_m3_per_kg
        outdoor_g_per_h = 1000.0 * dry_air * (out.humidity_ratio_kg_per_kg - wt)
        values["outdoor_air_changes_per_h"] = air_changes_per_h
        values["outdoor_air_l_per_day"] = outdoor_g_per_h * 24.0 / 1000.0 * _WATER_L_PER_KG
        verb = "brings" if outdoor_g_per_h > 0 else "carries away"
        gains.append(f"outdoor air {how} at about {air_changes_per_h:g} air changes an hour "
                     f"{verb} {_rate(fmt, abs(outdoor_g_per_h))}")
    text = why
    logged = None if drying is None else drying.removed_l_per_day
    if room.volume_m3 is not None and air.humidity_ratio_kg_per_kg > wt:
        pull_down = (room.volume_m3 / air.specific_volume_m3_per_kg
                     * (air.humidity_ratio_kg_per_kg - wt) * _WATER_L_PER_KG)
        values["pull_down_l"] = pull_down
        text += (f" Taking the room air itself down to {_pct(target)} means removing about "
                 f"{pull_down:.2f} L ({pull_down / pint:.2f} US pints) once; wet materials "
                 f"hold far more.")
    if logged is not None:
        load = None  # the logged figure below is the load
    elif generation is None:
        load = None
        text += (f" The moisture load to hold it there is not known ({moisture.missing}), so "
                 f"no dehumidifier size can be given")
        if outdoor_g_per_h is not None and outdoor_g_per_h > 0:
            text += (f"; outdoor air leaking in alone brings "
                     f"{_water(fmt, outdoor_g_per_h * 24.0 / 1000.0)}")
        text += "."
    else:
        load = max(0.0, generation + (outdoor_g_per_h or 0.0)) * 24.0 / 1000.0 * _WATER_L_PER_KG
        if load > 0.0:
            text += (" To hold it there: " + "; ".join(gains) + f"; {_water(fmt, load)} in "
                     f"all, the least a dehumidifier should remove at this room's conditions. "
                     f"Drying wet materials adds much more.")
        else:
            text += (" To hold it there: " + "; ".join(gains) + ". Outdoor air carries away "
                     "more than the room produces, so once the room is down there is no daily "
                     "load to hold against: the dehumidifier is for bringing it down, and for "
                     "damper days.")
    if logged is not None:
        values["logged_removal_l_per_day"] = logged
        text += (f" The dehumidifier logged {drying.water_removed_l:g} L in the "
                 f"{drying.hours_since_previous:.0f} h since the previous visit, about "
                 f"{_water(fmt, logged)}: while materials dry, that measured figure is the "
                 f"load, and the unit should keep up with it at this room's conditions. "
                 f"Falling amounts from visit to visit mean the materials are drying.")
        load = logged
    values.update(load_l_per_day=load, removal_l_per_day=load,
                  removal_us_pints_per_day=None if load is None else load / pint)
    old = th.value("dehumidifier_rating_old_dry_bulb_c")
    new = th.value("dehumidifier_rating_current_dry_bulb_c")
    rating_rh = th.value("dehumidifier_rating_rh_pct")
    rated = None if drying is None else drying.capacity_l_per_day
    unit = (f"the unit here, rated {_water(fmt, rated)}," if rated is not None
            else "a unit")
    text += (f" Label capacities are measured at a rating point: "
             f"{_nominal_temperature(fmt, old)} and {_pct(rating_rh)} RH for older ratings "
             f"(AHAM DH-1), {_nominal_temperature(fmt, new)} and {_pct(rating_rh)} RH for the "
             f"current US test. Against the older point {unit} removes much less in a room at "
             f"{fmt('temperature', air.dry_bulb_c)}")
    if abs(air.dry_bulb_c - new) <= 2.0:
        text += (f"; this room is near the current rating point, so a current rating is "
                 f"close at {_pct(rating_rh)} RH, but less as the room dries toward "
                 f"{_pct(target)}")
    elif air.dry_bulb_c < new:
        text += ", and less than even a current rating says, being cooler than its test point"
    text += ". Check which rating a label uses, and choose a unit rated well above the load."
    cold = th.value("refrigerant_dehumidifier_min_c")
    desiccant = air.dry_bulb_c < cold
    values["suggest_desiccant"] = desiccant
    if desiccant:
        text += (f" Below {fmt('temperature', cold)} a refrigerant unit loses most of its "
                 f"capacity and can ice up: use a desiccant dehumidifier.")
    return Action(ActionKind.DEHUMIDIFY, text, values, tuple(dict.fromkeys(keys)))


def _moisture_actions(finding: RoomFinding, target: float, basis: str,
                      target_keys: tuple[str, ...], target_air: AirState,
                      moisture: MoistureEstimate, fmt: Formatter) -> list[Action]:
    """Ventilate, dehumidify, or both, for a room above its target (see the module notes)."""
    air = finding.air
    out = finding.outdoor
    bring = f"Bring the room from {_pct(air.rh_pct)} down to {basis} "
    margin_key = "ventilation_outdoor_drier_margin_g_per_kg"
    margin = th.value(margin_key) / 1000.0
    cap = th.value("ventilation_practical_max_ach")
    w_room = air.humidity_ratio_kg_per_kg
    w_target = target_air.humidity_ratio_kg_per_kg
    if out is None:
        why = bring + (f"The outdoor air was not measured: if it holds less water than the "
                       f"{fmt('humidity_ratio', w_room)} of the room air now, airing the room "
                       f"helps too.")
        return [_dehumidify(finding, target, target_air, moisture, fmt, why,
                            extra_keys=target_keys)]
    w_out = out.humidity_ratio_kg_per_kg
    if w_out > w_room - margin:
        if w_out >= w_room:
            words = (f"Outdoor air is wetter than the room air: it holds "
                     f"{fmt('humidity_ratio', w_out)} of water against "
                     f"{fmt('humidity_ratio', w_room)} in the room, so ventilating would add "
                     f"moisture. Keep windows and doors to outside closed while dehumidifying.")
        else:
            words = (f"Outdoor air is about as wet as the room air: "
                     f"{fmt('humidity_ratio', w_out)} of water against "
                     f"{fmt('humidity_ratio', w_room)} in the room, so airing would do little; "
                     f"a dehumidifier does the work.")
        return [_dehumidify(finding, target, target_air, moisture, fmt, bring + words,
                            extra_keys=(*target_keys, margin_key))]
    if w_out <= w_target - margin:
        ventilate, ach = _ventilate(finding, target, target_air, moisture, fmt)
        actions = [Action(ventilate.kind, bring + ventilate.reason, ventilate.values,
                          tuple(dict.fromkeys(target_keys + ventilate.threshold_keys)))]
        if ach is not None and ach > cap:
            why = (f"Ventilation alone needs {ach:.1f} air changes an hour, more than the "
                   f"about {cap:g} that is practical: ventilate at {cap:g} and let a "
                   f"dehumidifier do the rest.")
            actions.append(_dehumidify(finding, target, target_air, moisture, fmt, why,
                                       air_changes_per_h=cap,
                                       extra_keys=("ventilation_practical_max_ach",)))
        return actions
    ventilate, dehumidify_ach = _ventilate_partly(finding, target, target_air, moisture, fmt)
    why = (f"Ventilation cannot hold the room at {_pct(target)} by itself: a dehumidifier "
           f"takes it the rest of the way.")
    return [Action(ventilate.kind, bring + ventilate.reason, ventilate.values,
                   tuple(dict.fromkeys(target_keys + ventilate.threshold_keys))),
            _dehumidify(finding, target, target_air, moisture, fmt, why,
                        air_changes_per_h=dehumidify_ach,
                        extra_keys=("ventilation_practical_max_ach",))]


def _grain_depression_text(finding: RoomFinding, drying, fmt: Formatter
                           ) -> tuple[str, dict]:
    """The humidity-ratio drop across the dehumidifier (inlet: room air), g/kg and gr/lb."""
    if drying.outlet_temp_c is None or drying.outlet_rh_pct is None:
        return "", {}
    air = finding.air
    outlet = air_state(drying.outlet_temp_c, drying.outlet_rh_pct, air.pressure_pa)
    w_in, w_out = air.humidity_ratio_kg_per_kg, outlet.humidity_ratio_kg_per_kg
    drop = w_in - w_out
    values = {"grain_depression_g_per_kg": 1000.0 * drop,
              "grain_depression_gr_per_lb": _gr_per_lb(drop),
              "outlet_humidity_ratio_g_per_kg": 1000.0 * w_out}
    text = (f" Grain depression (room air in, minus air out of the dehumidifier): "
            f"{1000.0 * w_in:.2f} − {1000.0 * w_out:.2f} = {1000.0 * drop:.2f} g/kg "
            f"({_gr_per_lb(w_in):.0f} − {_gr_per_lb(w_out):.0f} = {_gr_per_lb(drop):.0f} "
            f"gr/lb).")
    if drop <= 0.0:
        text += (" The outlet air is no drier than the room air: the unit is not removing "
                 "water; check it is running, its coil is not iced and its drain is clear.")
    return text, values


def _drying_actions(finding: RoomFinding, drying, target: float, basis: str,
                    target_keys: tuple[str, ...], target_air: AirState,
                    moisture: MoistureEstimate, fmt: Formatter) -> list[Action]:
    """A room being dried: keep the drying area closed and dehumidify, never ventilate."""
    air = finding.air
    low = th.value("drying_rh_target_low_pct")
    closed = ("Keep the drying area closed and dehumidify: keep windows, trickle vents and "
              "doors to outside shut and the area closed off from the rest of the building, "
              "so the dehumidifier takes water out of the materials rather than out of "
              "outdoor air.")
    if drying.dehumidifiers == 0:
        why = (f"Air movers are running here without a dehumidifier: on their own they "
               f"evaporate water from the materials into the air and raise the room RH (now "
               f"{_pct(air.rh_pct)}). Join this room to the dehumidified area (open it to that "
               f"area and close both off from outside) or give it its own dehumidifier. "
               + closed + f" Hold it at {basis}")
    elif air.rh_pct > target:
        why = f"{closed} Bring the room from {_pct(air.rh_pct)} down to {basis}"
    else:
        why = (f"{closed} The room is at {_pct(air.rh_pct)}, within the drying target of "
               f"{low:.0f}-{target:.0f} % RH: keep it there until materials reach the dry "
               f"standard.")
    grains, grain_values = _grain_depression_text(finding, drying, fmt)
    action = _dehumidify(finding, target, target_air, moisture, fmt, why + grains,
                         extra_keys=target_keys, drying=drying)
    values = {**action.values, **grain_values, "drying_in_progress": True,
              "air_movers_without_dehumidifier": drying.dehumidifiers == 0}
    return [Action(ActionKind.DEHUMIDIFY, action.reason, values, action.threshold_keys)]


_VENTILATED_SPACES = frozenset({"loft", "crawlspace"})
_TIMBER_LABEL_WORDS = ("timber", "wood", "rafter", "joist", "purlin", "batten", "truss",
                       "sarking", "board", "plywood", "osb", "sill plate", "beam")


def _ventilated_space(finding: RoomFinding, fmt: Formatter) -> Action:
    """A loft or crawl space that follows outdoor air: cut the moisture coming in, check
    its ventilation, measure the timber; a dehumidifier only if the space is sealed."""
    air = finding.air
    loft = finding.use == "loft"
    keys = ["timber_decay_mc_pct", "timber_decay_slow_below_c"]
    decay = th.value("timber_decay_mc_pct")
    slow = th.value("timber_decay_slow_below_c")
    if loft:
        text = (f"The loft is at {_pct(air.rh_pct)} RH. A ventilated loft follows outdoor air: "
                "dry it by cutting the moisture coming up from the rooms below: seal gaps "
                "around the hatch (fit a draught seal), ceiling lights, pipes and cables, and "
                "make sure no extract fan, tumble-drier or soil vent discharges into the loft "
                "(duct them to outside). Check the eaves and ridge ventilation is open and "
                "not blocked by insulation.")
    else:
        text = (f"The crawl space is at {_pct(air.rh_pct)} RH. A ventilated crawl space "
                "follows outdoor air: dry it by cutting the moisture coming in: lay a ground "
                "vapour barrier (polyethylene sheet, lapped and taped, held down), fix leaks "
                "and drainage that bring water in, and check the air bricks or vents are open "
                "and clear.")
    text += (" A dehumidifier helps only if the space is sealed (closed off from outdoor "
             "air); in a ventilated space it dries the weather. Measure the timber with a pin "
             "moisture meter (wood scale): decay fungi need about "
             f"{decay:.0f} % moisture content or more.")
    values: dict = {"room_rh_pct": air.rh_pct, "dehumidify_only_if_sealed": True}
    timber = []
    for surface in finding.surfaces:
        label = surface.label.lower()
        if not any(word in label for word in _TIMBER_LABEL_WORDS):
            continue
        if surface.mould not in (MouldState.ABOVE, MouldState.CANNOT_TELL,
                                 MouldState.APPROACHING) \
                and surface.surface_rh_pct < th.value("surface_rh_mould_limit_pct"):
            continue
        rh_s = min(100.0, surface.surface_rh_pct)
        emc = _timber_emc(surface.surface_temp_c, rh_s)
        if emc is None:
            continue
        timber.append({"surface": surface.label, "surface_temp_c": surface.surface_temp_c,
                       "surface_rh_pct": rh_s, "emc_pct": emc})
        name = surface.label[:1].upper() + surface.label[1:]
        sentence = (f" {name} at {fmt('temperature', surface.surface_temp_c)} and "
                    f"{_pct(rh_s)} surface RH would settle at about {emc:.1f} % moisture "
                    f"content (Wood Handbook eqn 4-5 at the surface)")
        if emc >= decay:
            sentence += f": in the decay range (above about {decay:.0f} %)"
        else:
            sentence += f": below the {decay:.0f} % decay range, but check it with the meter"
        if surface.surface_temp_c < slow:
            sentence += (f"; below {fmt('temperature', slow)} decay is slower, not stopped, "
                         "and speeds up when it warms")
        text += sentence + "."
    if timber:
        values["timber_surfaces"] = timber
    return Action(ActionKind.DRY_VENTILATED_SPACE, text, values, tuple(keys))


def _timber_emc(temp_c: float, rh_pct: float) -> float | None:
    """Wood Handbook eqn 4-5 EMC at a surface, or None outside its range."""
    from survey.assess import timber_emc_pct
    try:
        return timber_emc_pct(temp_c, rh_pct)
    except InputError:
        return None


# --- surfaces ------------------------------------------------------------------------------------

def _raise_surface(finding: RoomFinding, surface: SurfaceFinding, design_rh: float,
                   fmt: Formatter) -> Action | None:
    """A wall, ceiling or floor too cold for the room to be held at a practical RH, or with
    its temperature factor under the limit."""
    air = finding.air
    floor = th.value("room_rh_floor_pct")
    mould_limit = th.value("surface_rh_mould_limit_pct")
    margin = th.value("dew_point_margin_k")
    max_rh = psychro.max_room_rh_pct(air.dry_bulb_c, surface.surface_temp_c, mould_limit)
    too_cold = max_rh < floor
    factor_under = surface.temperature_factor_state is FactorState.UNDER
    if surface.temperature_factor_state is FactorState.DRYING_WET:
        return None  # evaporation cools a drying surface: dry it before judging it
    if not (too_cold or factor_under):
        return None
    keys = ["surface_rh_mould_limit_pct", "dew_point_margin_k", "room_rh_floor_pct"]
    design_air = air_state(air.dry_bulb_c, design_rh, air.pressure_pa)
    for_rh = max(psychro.surface_temp_for_rh_c(design_air, mould_limit),
                 design_air.condensation_point_c + margin)
    values: dict = {"surface": surface.label, "element": surface.element,
                    "surface_temp_c": surface.surface_temp_c,
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
                           f"(±{surface.temperature_factor_uncertainty:.2f}), under "
                           f"{_limit_phrase(finding, f_limit)}, which today means a surface "
                           f"of at least {_min_temp(fmt, for_factor)} (the factor limit)")
            target = max(target, for_factor)
    values["target_surface_temp_c"] = target
    text = (f"{surface.label} is too cold at {fmt('temperature', surface.surface_temp_c)}: "
            + "; ".join(reasons) + ". "
            f"Raise it to at least {_min_temp(fmt, target)} "
            + (f"(the factor limit; {_min_temp(fmt, for_rh)} would do for "
               f"{_pct(design_rh)} room RH alone) " if target > for_rh else "")
            + f"so the room can be kept at {_pct(design_rh)} without mould risk: ")
    ground = surface.temperature_factor_state is FactorState.GROUND_CONTACT
    if ground:
        text += ("keep the space heated steadily and the air dry, and keep stored things off "
                 "the coldest part. This surface is in contact with the ground, which sets "
                 "its temperature: its temperature factor is not judged against outdoor air.")
    else:
        text += _REMEDY.get(surface.element, _REMEDY["other"])
    if factor_under:
        text += (" The factor comes from one reading: confirm it on another cold day, or with "
                 "a thermal image, before building work.")
    return Action(ActionKind.RAISE_SURFACE_TEMPERATURE, text, values,
                  tuple(dict.fromkeys(k for k in keys if k)))


_REMEDY = {
    "internal_wall": ("keep the room heated steadily and furniture off it. An internal wall "
                      "this cold usually backs onto an unheated space or a chimney, or hides "
                      "a leak or a cold bridge: find out which before treating it."),
    "floor": ("keep the room heated steadily, keep rugs and stored things off the coldest "
              "part, and have the floor insulation, the slab edge or a thermal bridge "
              "investigated."),
    "ceiling": ("keep the room heated steadily, and have the insulation above it (gaps in "
                "the loft insulation, a cold eaves corner) or a thermal bridge investigated."),
    "other": ("keep the room heated steadily, keep furniture and stored things off cold "
              "walls, and have the insulation, thermal bridge or cold corner investigated."),
}


def _forming(surface: SurfaceFinding) -> str | None:
    """'water forms on it' (or frost) at the reading, 'may form' when the band reaches the
    condensation point, else None."""
    point, what = _condensation_words(surface)
    if surface.condensation is CondensationState.CONDENSING:
        return f"{what} forms on it"
    if CondensationState.CONDENSING in surface.condensation_possible:
        return (f"{what} may form on it (at this instrument accuracy the reading cannot be "
                f"told apart from the {point})")
    return None


def _cold_surface_values(finding: RoomFinding, surface: SurfaceFinding, target_air: AirState
                         ) -> dict:
    return {"surface": surface.label, "element": surface.element,
            "surface_temp_c": surface.surface_temp_c,
            "condensation_point_c": surface.condensation_point_c,
            "frost": surface.below_freezing,
            "max_room_rh_pct_dry": min(100.0, finding.air.rh_pct * 100.0
                                       / surface.surface_rh_pct),
            "surface_temp_to_stay_dry_c": target_air.condensation_point_c}


def _stays_dry(values: dict, target: float, fmt: Formatter) -> str:
    """'It stays dry only while the room is below 46 %; at 58 % it would need to be at least
    9.2 °C.' — or, when the target already keeps it dry, says so."""
    dry = values["max_room_rh_pct_dry"]
    text = f"It stays dry only while the room is below {rh_limit_shown(dry)} %"
    if rh_limit_shown(dry) >= target:
        return text + f", so once the room is down to {_pct(target)} it stays dry."
    return (text + f"; at {_pct(target)} it would need to be at least "
            f"{_min_temp(fmt, values['surface_temp_to_stay_dry_c'])}.")


def _glazing(finding: RoomFinding, surface: SurfaceFinding, target: float,
             target_air: AirState, fmt: Formatter) -> Action | None:
    """Glass or a window frame at or near the condensation point, or a frame above the
    mould limit: a window remedy, not a drier room."""
    forming = _forming(surface)
    mouldy = MouldState.ABOVE in surface.mould_possible
    if forming is None and not mouldy:
        return None
    point, _ = _condensation_words(surface)
    values = _cold_surface_values(finding, surface, target_air)
    glass = surface.element == "glazing"
    text = (f"{surface.label} ({'glass' if glass else 'window frame'}) is at "
            f"{fmt('temperature', surface.surface_temp_c)}")
    if forming is not None:
        text += (f", against a {point} of {fmt('temperature', surface.condensation_point_c)}: "
                 f"{forming}. {_stays_dry(values, target, fmt)} ")
        if glass:
            text += ("On single glazing some condensation is expected in cold weather: it is "
                     "no reason to hold the room drier than is practical; consider secondary or "
                     "double glazing, which keeps the inner pane warmer. On double glazing a "
                     "pane this cold suggests a failed or poor unit (misting between the panes "
                     "means a failed seal): have it checked or replaced. Wipe the "
                     "glass and sill dry each morning, "
                     + ("" if _drying(finding) else "keep trickle vents open, ")
                     + "and keep curtains or blinds clear of the glass at night.")
        else:
            text += ("Window frames, metal ones above all, run colder than the walls around "
                     "them, and some condensation on them in cold weather is expected: it is "
                     "no reason to hold the room drier than is practical. Wipe frames and sills "
                     "dry, " + ("" if _drying(finding) else "keep trickle vents open, ") + "and consider secondary glazing or frames "
                     "with a thermal break.")
    else:
        text += "."
    if mouldy:
        text += (" Its surface RH is above the mould limit: check frames and seals for mould, "
                 "clean any off with detergent and water (gloves and an FFP2 / N95 "
                 "respirator), and check the sill and reveal for rot and damp.")
    else:
        text += " Check frames, seals and the sill for mould and rot where water runs down."
    keys = ("condensation_dew_point_margin_k", "surface_rh_mould_limit_pct")
    return Action(ActionKind.REDUCE_GLAZING_CONDENSATION, text, values, keys)


def _pipe(finding: RoomFinding, surface: SurfaceFinding, target: float,
          target_air: AirState, fmt: Formatter) -> Action | None:
    """A cold pipe at or near the condensation point: lag it."""
    forming = _forming(surface)
    if forming is None:
        return None
    point, _ = _condensation_words(surface)
    values = _cold_surface_values(finding, surface, target_air)
    text = (f"{surface.label} is at {fmt('temperature', surface.surface_temp_c)}, against a "
            f"{point} of {fmt('temperature', surface.condensation_point_c)}: {forming}, and "
            f"it can drip onto floors, joists and linings. Lag it with closed-cell pipe "
            f"insulation, joints and ends taped so that room air cannot reach the cold pipe "
            f"underneath (open, fibrous lagging on a cold pipe gets wet), and check below it "
            f"for wet timber or plaster. {_stays_dry(values, target, fmt)}")
    return Action(ActionKind.INSULATE_PIPE, text, values, ("condensation_dew_point_margin_k",))


# --- sources, drying and repeat readings ----------------------------------------------------------

class _SourceFindings(NamedTuple):
    find_source: Action | None
    find_source_first: bool  #: liquid water suspected: before any drying
    keep_drying: Action | None
    repeat_readings: Action | None


def _wet_materials_text(wet) -> str:
    tolerance = th.value("dry_standard_tolerance_fraction")
    return ", ".join(f"{m.label} {m.value:g} against {m.dry_standard:g} (dry once at or below "
                     f"{m.dry_standard * (1.0 + tolerance):.3g})" for m in wet)


def _class_reason(finding: RoomFinding, fmt: Formatter) -> tuple[str | None, str | None]:
    """(a find-the-source reason, a repeat-the-readings reason) from the humidity class;
    the first when the whole band is high, the second when the band reaches across."""
    if finding.humidity_class is None:
        return None, None
    wet_room = finding.use in ("kitchen", "bathroom")
    high = int(th.value("humidity_class_high")) + (1 if wet_room else 0)
    possible = finding.humidity_class_possible or (finding.humidity_class,)
    if max(possible) < high:
        return None, None
    phrase = _USE_PHRASE[finding.use]
    expected = (f"more than {phrase} should produce" if phrase is not None
                else "more than ordinary occupied rooms produce")
    excess = fmt("vapour_pressure", finding.vapour_pressure_excess_pa)
    if min(possible) >= high:
        return (f"the room air holds {excess} more vapour pressure than outdoors, "
                f"{th.humidity_class_range_text(possible)} of EN ISO 13788 — {expected} (look "
                f"for laundry drying indoors, unflued heaters, a blocked or missing extract, "
                f"or a leak)"), None
    band = fmt("vapour_pressure", finding.vapour_pressure_excess_uncertainty_pa)
    return None, (f"The humidity class may be high: the room air holds {excess} (± {band}) "
                  f"more vapour pressure than outdoors, "
                  f"{th.humidity_class_range_text(possible)} of EN ISO 13788 at this "
                  f"instrument accuracy, and class {high} or above would be {expected}. One "
                  f"spot reading cannot settle it: repeat the readings on other days, or log "
                  f"the room for a week or two, before looking for a hidden source.")


_WET_ROOMS = frozenset({"bathroom", "kitchen"})


def _wet_room_text(finding: RoomFinding, fmt: Formatter) -> str:
    """A bathroom or kitchen with a high humidity class: a use peak; extract and re-read."""
    low = th.value("wet_room_reread_after_use_min")
    high = th.value("wet_room_reread_after_use_max_min")
    what = "a shower or bath" if finding.use == "bathroom" else "cooking"
    excess = fmt("vapour_pressure", finding.vapour_pressure_excess_pa)
    return (f"The room air holds {excess} more vapour pressure than outdoors, "
            f"{th.humidity_class_text(finding.humidity_class)} of EN ISO 13788, but in "
            f"{_USE_PHRASE[finding.use]} a high reading is usually the normal peak after "
            f"{what}, not a hidden source. Have an extract fan that clears it: sized to the "
            f"local code's minimum extract rate (UK Approved Document F and ASHRAE 62.2 set "
            f"minimum extract rates; from memory, check local code), with an overrun timer or "
            f"a humidistat so it keeps running after use, and the door kept shut meanwhile. "
            f"Take a re-reading {low:.0f}-{high:.0f} min after use; if the room is still this "
            f"humid then, look for a blocked or missing extract, laundry drying or a leak.")


def _occupants_share(moisture: MoistureEstimate) -> float | None:
    """Share of the back-calculated load that occupants and activities explain."""
    people = None if moisture.occupants_g_per_h is None and moisture.activities_g_per_h is None \
        else (moisture.occupants_g_per_h or 0.0) + (moisture.activities_g_per_h or 0.0)
    back = moisture.back_calculated_g_per_h
    if people is None or not back:
        return None
    return people / back


def _sources(finding: RoomFinding, fmt: Formatter,
             occupants_explain: bool = False) -> _SourceFindings:
    """Find the source, keep drying, and repeat the readings: what the materials,
    observations and humidity class call for."""
    room = finding.room
    obs = room.observations
    drying = obs.drying_in_progress
    first: list[str] = []
    later: list[str] = []
    drying_notes: list[str] = []
    keys: list[str] = []
    drying_keys: list[str] = []
    values: dict = {}
    wet = [m for m in finding.materials if m.dry_standard_state is DryStandardState.ABOVE]
    if wet and not drying:
        keys.append("dry_standard_tolerance_fraction")
        first.append("material readings above the dry standard (" + _wet_materials_text(wet)
                     + "); once the source is dealt with, dry them until the readings reach "
                       "the dry standard")
        values["materials_above_dry_standard"] = len(wet)
    damp_timber = [m for m in finding.materials if m.wetter_than_air_explains]
    if damp_timber and not drying:
        keys += ["timber_mould_mc_pct", "timber_decay_mc_pct"]
        first.append("timber wetter than the room air can explain (" + ", ".join(
            f"{m.label} {m.value:g} % against {m.emc_pct:.1f} % in equilibrium with the air"
            for m in damp_timber) + ")")
    decaying = [m for m in finding.materials if m.timber_state is TimberState.DECAY_RANGE]
    if decaying:
        limit = th.value("timber_decay_mc_pct")
        slowed = any(m.decay_slowed_by_temperature for m in decaying)
        note = ("timber at or above the " + f"{limit:.0f} % moisture content at which "
                "decay fungi grow (" + ", ".join(f"{m.label} {m.value:g} %" for m in decaying)
                + "): have it checked for rot"
                + (" — decay is slow at today's temperature, not stopped" if slowed else ""))
        (drying_notes if drying else first).append(note)
        (drying_keys if drying else keys).append("timber_decay_mc_pct")
    if (obs.standing_water or obs.water_category is not None) and not drying:
        first.append("water present in the room" if obs.water_category is None else
                     f"category {obs.water_category} water in the room")
    surfaces = finding.surfaces
    if obs.condensation_seen and not any(
            s.condensation is not CondensationState.CLEAR for s in surfaces):
        first.append("condensation was seen, but " + (
            "no surface was measured" if not surfaces else
            "the measured surfaces are clear of the dew point: it may come from moments "
            "of higher humidity (cooking, drying laundry) or from water getting in"))
    judged = [s for s in surfaces if s.mould is not MouldState.NOT_JUDGED]
    if obs.mould_seen and not any(s.mould is not MouldState.BELOW for s in judged):
        first.append("mould is visible, but " + (
            "no wall, ceiling, floor or frame was measured" if not judged else
            "the measured surfaces are below the mould limit today: look for a leak, damp "
            "coming through the wall, or times of higher humidity"))
    if obs.odour:
        later.append("a musty smell, which can mean hidden mould behind linings, under "
                     "floors or in voids")
    # While a room is being dried its air is humid from the drying itself: the humidity
    # class says nothing about a hidden source then.
    high_class, maybe_high = (None, None) if drying or occupants_explain \
        else _class_reason(finding, fmt)
    wet_room_peak = None
    if finding.use in _WET_ROOMS and (high_class is not None or maybe_high is not None):
        # A shower or cooking peak, not a hidden source: extract and re-read after use.
        wet_room_peak = _wet_room_text(finding, fmt)
        high_class = maybe_high = None
    if high_class is not None or maybe_high is not None:
        keys_class = ["humidity_class_high", *th.HUMIDITY_CLASS_KEYS, "coverage_factor"]
    if high_class is not None:
        keys += keys_class
        values.update(vapour_pressure_excess_pa=finding.vapour_pressure_excess_pa,
                      humidity_class=finding.humidity_class)
        later.append(high_class)

    find_source = None
    reasons = first + later
    if reasons:
        text = ("Find and deal with the source of moisture before drying or decorating: "
                + "; ".join(reasons) + ".")
        find_source = Action(ActionKind.FIND_SOURCE, text, values, tuple(dict.fromkeys(keys)))

    keep_drying = None
    if drying and (wet or decaying or damp_timber):
        drying_keys.insert(0, "dry_standard_tolerance_fraction")
        tolerance = th.value("dry_standard_tolerance_fraction")
        parts = []
        if wet:
            parts.append("these readings are still above the dry standard (the same material "
                         "in an unaffected area, allowing "
                         f"{tolerance * 100:.0f} %): " + _wet_materials_text(wet))
        if damp_timber:
            drying_keys.append("timber_mould_mc_pct")
            parts.append("timber is still wetter than the room air explains (" + ", ".join(
                f"{m.label} {m.value:g} % against {m.emc_pct:.1f} %" for m in damp_timber)
                + ")")
        parts += drying_notes
        text = ("Continue drying until readings reach the dry standard: " + "; ".join(parts)
                + ". Keep the drying equipment running, take readings at the same spots on "
                  "each visit, and do not close up, refit or decorate until every reading is "
                  "there. If readings stop falling from one visit to the next, look for water "
                  "still getting in.")
        drying_values = {
            "materials_above_dry_standard": len(wet),
            "materials": [{"label": m.label, "material": m.material, "scale": m.scale,
                           "value": m.value, "dry_standard": m.dry_standard,
                           "dry_at_or_below": m.dry_standard * (1.0 + tolerance)}
                          for m in wet]}
        keep_drying = Action(ActionKind.KEEP_DRYING, text, drying_values,
                             tuple(dict.fromkeys(drying_keys)))

    repeat = None
    if wet_room_peak is not None:
        repeat = Action(ActionKind.REPEAT_READINGS, wet_room_peak,
                        {"vapour_pressure_excess_pa": finding.vapour_pressure_excess_pa,
                         "humidity_class": finding.humidity_class,
                         "reread_after_use_min": [
                             th.value("wet_room_reread_after_use_min"),
                             th.value("wet_room_reread_after_use_max_min")]},
                        ("wet_room_reread_after_use_min", "wet_room_reread_after_use_max_min",
                         *th.HUMIDITY_CLASS_KEYS))
    elif maybe_high is not None:
        repeat = Action(ActionKind.REPEAT_READINGS, maybe_high,
                        {"vapour_pressure_excess_pa": finding.vapour_pressure_excess_pa,
                         "vapour_pressure_excess_uncertainty_pa":
                             finding.vapour_pressure_excess_uncertainty_pa,
                         "humidity_class": finding.humidity_class,
                         "humidity_class_possible": list(finding.humidity_class_possible)},
                        tuple(dict.fromkeys(keys_class)))
    return _SourceFindings(find_source, bool(first), keep_drying, repeat)


# --- cautions ----------------------------------------------------------------------------------

_MEDIUM_MOULD_GUIDANCE = (
    "have it removed by someone trained, with gloves, goggles and at least an FFP2 / N95 "
    "respirator, the area sealed off with plastic sheeting and the waste bagged; keep "
    "occupants, above all vulnerable people, out during the work. A large area needs a "
    "licensed or specialist mould remediation contractor.")


def _mould_caution(area: float) -> Caution:
    small = th.value("mould_area_small_m2")
    large = th.value("mould_area_large_m2")
    keys = ("mould_area_small_m2", "mould_area_large_m2")
    medium = ("have it removed by someone trained, with gloves, goggles and at least an "
              "FFP2 / N95 respirator, the area sealed off with plastic sheeting and the waste "
              "bagged; keep occupants, above all vulnerable people, out during the work.")
    if area <= 0.0:
        text = (f"Visible mould, area not measured: measure it (up to about {small:.2g} m² is "
                f"a small area, over about {large:.2g} m² a large one that needs a licensed "
                f"or specialist mould remediation contractor). Until it is measured, treat it "
                f"as a medium area: " + medium)
    elif area <= small:
        text = (f"Visible mould, about {area:.2g} m²: a small area. A careful adult can "
                "clean it with detergent and water, wearing gloves, eye protection and a "
                "disposable respirator (FFP2 / N95); wipe, do not dry-brush; bag the "
                "waste. People with asthma, allergies or weak immune systems should not "
                "do it. It returns unless the damp is cured.")
    elif area <= large:
        text = (f"Visible mould, about {area:.2g} m²: a medium area. "
                + medium[0].upper() + medium[1:])
    else:
        text = (f"Visible mould, about {area:.3g} m²: a large area. Call a licensed or "
                "specialist mould remediation contractor: it needs full containment, "
                "protective equipment and air filtration. Vulnerable occupants should "
                "not stay in the area.")
    return Caution("visible_mould", text, keys)


def _cautions(finding: RoomFinding, actions: tuple[Action, ...], year_built: int | None
              ) -> list[Caution]:
    room = finding.room
    obs = room.observations
    kinds = {a.kind for a in actions}
    out: list[Caution] = []
    area = obs.visible_mould_area_m2
    if obs.mould_seen:
        out.append(_mould_caution(area))
    elif any(surface.mould is MouldState.ABOVE for surface in finding.surfaces):
        out.append(Caution("mould_if_visible",
                           "A surface is above the mould limit: if mould is visible, measure "
                           "its area, and until then " + _MEDIUM_MOULD_GUIDANCE,
                           ("mould_area_small_m2", "mould_area_large_m2")))
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
    elif category == 1:
        hours = th.value("water_category_1_degrades_h")
        out.append(Caution("water_category_1",
                           "Category 1 water (clean, e.g. from a burst supply pipe): dry it "
                           "promptly. Left standing, or soaked into building materials, it "
                           f"degrades to category 2 (commonly within about {hours:.0f} hours, "
                           "sooner in a warm room), and then needs the category 2 precautions: "
                           "gloves and eye protection, and some soaked materials removed "
                           "rather than dried.",
                           ("water_category_1_degrades_h", "water_category_2")))
    if (obs.electrics_near_water or obs.standing_water or category is not None
            or kinds & {ActionKind.DEHUMIDIFY, ActionKind.KEEP_DRYING}):
        out.append(Caution("electrics_near_water",
                           "Water and electricity: do not touch switches, sockets or "
                           "appliances that are wet or in standing water; have a qualified "
                           "electrician make wet circuits safe before work. Run "
                           "dehumidifiers and fans from a socket with residual-current "
                           "protection (RCD / GFCI), leads kept off wet floors."))
    if finding.use == "basement":
        out.append(Caution("confined_space",
                           "Basement: if the basement is unheated, poorly ventilated or "
                           "flooded, treat it as a confined space. Do not go in alone, tell "
                           "someone where you are, and check before entering for poor air (low "
                           "oxygen, gas, sewer gas, combustion fumes), unsafe floors, and live "
                           "wiring near water. Local rules may require confined-space entry "
                           "procedures."))
    elif finding.use in th.CONFINED_USES:
        phrase = {"crawlspace": "Crawl space", "loft": "Loft"}.get(finding.use,
                                                                  finding.use.capitalize())
        out.append(Caution("confined_space",
                           f"{phrase}: a confined or hard-to-reach space. "
                           "Do not go in alone, tell someone where you are, and check "
                           "before entering for poor air (low oxygen, gas, sewer gas, "
                           "combustion fumes), unsafe floors or joists, sharp fixings, pests "
                           "and live wiring. Local rules may require confined-space entry "
                           "procedures."))
    drying = bool(kinds & {ActionKind.DEHUMIDIFY, ActionKind.RAISE_SURFACE_TEMPERATURE,
                           ActionKind.KEEP_DRYING}) \
        or category is not None or obs.standing_water or obs.drying_in_progress
    if drying:
        water = th.value("propane_water_kg_per_kg")
        out.append(Caution("combustion_heaters",
                           "Do not heat or dry with unflued gas or paraffin heaters: burning "
                           f"1 kg of propane releases about {water:.1f} kg of water vapour "
                           "into the room, and they give off carbon monoxide. Use electric "
                           "heat, and fit a carbon monoxide alarm where any fuel-burning "
                           "appliance runs.", ("propane_water_kg_per_kg",)))
    disturbing = bool(kinds & {ActionKind.RAISE_SURFACE_TEMPERATURE, ActionKind.FIND_SOURCE,
                               ActionKind.INSULATE_PIPE,
                               ActionKind.REDUCE_GLAZING_CONDENSATION}) \
        or area > th.value("mould_area_small_m2") or (obs.mould_seen and area <= 0.0) \
        or category in (2, 3)
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
                "coatings, old paint, window putty). Do not disturb suspect material; use a "
                "licensed surveyor or contractor.",
                ("asbestos_possible_before_year", "lead_paint_possible_before_year")))
    out.append(CLOSING_CAUTION)
    return out


# --- the advice --------------------------------------------------------------------------------

def advise_room(finding: RoomFinding, target_rh_pct: float | None = None,
                year_built: int | None = None, fmt: Formatter = si_text) -> RoomAdvice:
    """Ordered actions and cautions for one room.

    Order: find the source first when liquid water is suspected and no drying is under way;
    keep drying while it is; then ventilate or dehumidify (whichever can do the job comes
    first); then raise the temperature of walls, ceilings and floors (coldest first); then
    windows and pipes; a source suggested only by the humidity class or a smell comes
    after, and a humidity class the instruments cannot settle last.
    """
    air = finding.air
    target, basis, target_keys = _target(finding, target_rh_pct, fmt)
    design = (th.value("room_rh_target_default_pct") if target_rh_pct is None
              else target_rh_pct)
    target_air = air_state(air.dry_bulb_c, target, air.pressure_pa)
    moisture = moisture_generation(finding, fmt)
    actions: list[Action] = []

    share = _occupants_share(moisture)
    explain = th.value("occupants_explain_fraction")
    # In a bathroom or kitchen a high class is first read as a use peak (see _wet_room_text).
    occupants_explain = (share is not None and share >= explain
                         and finding.use not in _WET_ROOMS
                         and finding.humidity_class is not None
                         and max(finding.humidity_class_possible or (finding.humidity_class,))
                         >= int(th.value("humidity_class_high")))
    sources = _sources(finding, fmt, occupants_explain)
    if sources.find_source is not None and sources.find_source_first:
        actions.append(sources.find_source)
    if sources.keep_drying is not None:
        actions.append(sources.keep_drying)

    drying = _drying(finding)
    ventilated_space = finding.use in _VENTILATED_SPACES and drying is None
    if ventilated_space:
        if air.rh_pct > target or any(
                s.mould in (MouldState.ABOVE, MouldState.CANNOT_TELL) for s in finding.surfaces):
            actions.append(_ventilated_space(finding, fmt))
    elif drying is not None:
        actions += _drying_actions(finding, drying, target, basis, target_keys, target_air,
                                   moisture, fmt)
    elif air.rh_pct > target:
        actions += _moisture_actions(finding, target, basis, target_keys, target_air,
                                     moisture, fmt)

    by_temperature = sorted(finding.surfaces, key=lambda s: s.surface_temp_c)
    for surface in by_temperature:
        if surface.policy.sets_room_target and not ventilated_space:
            action = _raise_surface(finding, surface, design, fmt)
            if action is not None:
                actions.append(action)
    for surface in by_temperature:
        role = surface.policy.role
        action = (_glazing(finding, surface, target, target_air, fmt) if role == "glazing"
                  else _pipe(finding, surface, target, target_air, fmt) if role == "pipe"
                  else None)
        if action is not None:
            actions.append(action)

    if occupants_explain:
        note = (f" The humidity class is high, but the occupants' own moisture "
                f"({_rate(fmt, moisture.occupants_g_per_h or 0.0)}"
                + (" with activities" if moisture.activities_g_per_h else "")
                + f") accounts for {min(share, 9.99) * 100:.0f} % of the "
                f"{_rate(fmt, moisture.back_calculated_g_per_h)} the measured excess implies "
                f"at the assumed air change rate: the room is under-ventilated for the people "
                f"in it rather than hiding a source.")
        for i, a in enumerate(actions):
            if a.kind in (ActionKind.VENTILATE, ActionKind.DEHUMIDIFY):
                actions[i] = Action(a.kind, a.reason + note,
                                    {**a.values, "occupants_share_of_load": share},
                                    (*a.threshold_keys, "occupants_explain_fraction"))
                break
    if sources.find_source is not None and not sources.find_source_first:
        actions.append(sources.find_source)
    if sources.repeat_readings is not None:
        actions.append(sources.repeat_readings)

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
