"""The performance check of one dehumidifier: inputs, results, the rating comparison and
the findings (the formulas are in :mod:`survey.equipment`'s notes)."""

from __future__ import annotations

import enum
import itertools
from collections.abc import Sequence
from dataclasses import dataclass
from typing import Literal

from survey import psychro
from survey import thresholds as th
from survey.errors import InputError
from survey.psychro import MoistAir

#: 1 US liquid pint in litres, exactly (231 in³ / 8, 1 in = 2.54 cm; NIST).
US_PINT_L = 0.473176473
#: 1 US gallon in litres, exactly (231 in³).
US_GALLON_L = 3.785411784
#: 1 pound in kilograms, exactly (international avoirdupois pound).
POUND_KG = 0.45359237

# The bounds of the survey file (model.Equipment), for typed values.
WATER_MAX_L = 100_000.0
RUN_HOURS_MAX_H = 10_000.0
POWER_MAX_W = 100_000.0
ENERGY_MAX_KWH = 1_000_000.0
ENERGY_FACTOR_MAX_L_PER_KWH = 20.0
CAPACITY_MAX_L_PER_DAY = 10_000.0

DehumidifierKind = Literal["refrigerant", "desiccant"]
#: Where the hours came from. With no run hours given and none to take: "too_long_since",
#: the unit's previous reading (or the previous visit) is too long ago to stand for a run;
#: "not_after_previous", it is not before this reading.
DurationSource = Literal[
    "given",
    "run_hours",
    "since_previous_reading",
    "since_previous_visit",
    "too_long_since",
    "not_after_previous",
]


# --- rating conditions -------------------------------------------------------------------


@dataclass(frozen=True, slots=True)
class RatingPoint:
    """A rating test condition: entering air dry bulb and RH, and the limits naming them."""

    key: str  #: a ``model.RatingCondition`` key
    dry_bulb_key: str
    rh_key: str

    @property
    def dry_bulb_c(self) -> float:
        return th.value(self.dry_bulb_key)

    @property
    def rh_pct(self) -> float:
        return th.value(self.rh_key)

    @property
    def threshold_keys(self) -> tuple[str, str]:
        return (self.dry_bulb_key, self.rh_key)


#: Every ``model.RatingCondition`` key with the thresholds that hold its numbers and source.
RATING_CONDITIONS: dict[str, RatingPoint] = {
    p.key: p
    for p in (
        RatingPoint("26.7c_60", "dehumidifier_rating_old_dry_bulb_c", "dehumidifier_rating_rh_pct"),
        RatingPoint(
            "18.3c_60", "dehumidifier_rating_current_dry_bulb_c", "dehumidifier_rating_rh_pct"
        ),
        RatingPoint(
            "22.8c_60", "dehumidifier_rating_whole_home_dry_bulb_c", "dehumidifier_rating_rh_pct"
        ),
        RatingPoint("27c_60", "dehumidifier_rating_en810_dry_bulb_c", "dehumidifier_rating_rh_pct"),
        RatingPoint(
            "30c_80", "dehumidifier_rating_wet_dry_bulb_c", "dehumidifier_rating_wet_rh_pct"
        ),
    )
}


def rating_point(key: str, field: str = "rating condition") -> RatingPoint:
    """The rating condition with this key (InputError naming the keys for another)."""
    try:
        return RATING_CONDITIONS[key]
    except KeyError:
        raise InputError(field, key, "one of " + ", ".join(RATING_CONDITIONS)) from None


# --- inputs ------------------------------------------------------------------------------


@dataclass(frozen=True, slots=True)
class AirPair:
    """Air entering and leaving the unit at one moment (``at_h``: hours into the run)."""

    inlet_temp_c: float
    inlet_rh_pct: float
    outlet_temp_c: float
    outlet_rh_pct: float
    at_h: float | None = None


@dataclass(frozen=True, slots=True)
class DehumidifierInput:
    """What was measured on a unit. SI floats; ``None`` where not measured."""

    readings: tuple[AirPair, ...]
    kind: DehumidifierKind = "refrigerant"
    water_l: float | None = None
    water_weighed: bool = False  #: the water was weighed (kg or lb), converted at 1 kg/L
    duration_h: float | None = None
    power_w: float | None = None
    energy_kwh: float | None = None  #: used over ``duration_h``; wins over ``power_w``
    pressure_pa: float = psychro.STANDARD_PRESSURE_PA
    rated_capacity_l_per_day: float | None = None
    rated_energy_factor_l_per_kwh: float | None = None
    rating_condition: str | None = None  #: a key of :data:`RATING_CONDITIONS`
    label: str = ""
    running: bool = True
    inlet_is_room_air: bool = False  #: the inlet is the room's air reading
    duration_source: DurationSource | None = "given"


# --- results -----------------------------------------------------------------------------


class FindingKind(enum.Enum):
    """What the check found; its words are :mod:`survey.words.equipment`'s."""

    NOT_RUNNING = "not_running"
    #: a derived figure beyond what any room unit can give (its limits' keys name which);
    #: that figure, and those that follow from it, are left out
    INCONSISTENT = "readings_inconsistent"
    COIL_FROST = "coil_frost"  #: refrigerant unit, inlet below the coil-frost limit
    TOO_COLD = "too_cold_for_refrigerant"  #: refrigerant unit, inlet below its lowest room temp
    OUTLET_WETTER = "outlet_wetter"  #: W rises across the unit beyond the readings' resolution
    NO_DROP = "no_drop"  #: W drop within the readings' resolution
    OUTLET_NOT_WARMER = "outlet_not_warmer"  #: outlet dry bulb at or below the inlet's
    NO_WATER = "no_water"
    NOTHING_COLLECTED = "nothing_collected"  #: no water, though the air leaves drier
    NO_DURATION = "no_duration"  #: water given, but over no known time
    NO_POWER = "no_power"
    NO_RATING_CONDITION = "no_rating_condition"  #: a rating without its test condition
    BELOW_EXPECTED = "below_expected"
    ABOVE_EXPECTED = "above_expected"


@dataclass(frozen=True, slots=True)
class Finding:
    kind: FindingKind
    threshold_keys: tuple[str, ...] = ()


@dataclass(frozen=True, slots=True)
class RatingComparison:
    """Measured against rated, with the rating scaled to the site air (our approximation)."""

    condition: RatingPoint | None
    rated_capacity_l_per_day: float | None
    rated_energy_factor_l_per_kwh: float | None
    rating_air: MoistAir | None  #: the rating condition's air at standard pressure
    site_scale: float | None  #: expected share of the rating at the site air
    expected_removal_l_per_day: float | None
    expected_energy_factor_l_per_kwh: float | None
    removal_of_rated: float | None  #: measured / rated
    removal_of_expected: float | None  #: measured / expected at the site air
    energy_factor_of_rated: float | None
    energy_factor_of_expected: float | None
    threshold_keys: tuple[str, ...]


@dataclass(frozen=True, slots=True)
class DehumidifierResult:
    """The check of one unit: states, rates, flows, the rating comparison and findings."""

    given: DehumidifierInput
    inlet: MoistAir  #: the air entering (of several readings: mean dry bulb and W)
    outlet: MoistAir  #: the air leaving (likewise)
    states: tuple[tuple[MoistAir, MoistAir], ...]  #: each reading's inlet and outlet
    humidity_ratio_drop_kg_per_kg: float  #: time mean of W_in − W_out
    drop_integral_kg_per_kg_h: float | None  #: ∫ΔW dt over the run, (kg/kg)·h
    coil: MoistAir | None  #: saturated at W_out (refrigerant units)
    water_kg: float | None
    removal_l_per_day: float | None
    energy_kwh: float | None
    mean_power_w: float | None
    energy_factor_l_per_kwh: float | None
    air_mass_flow_kg_per_s: float | None
    air_volume_flow_m3_per_h: float | None  #: at the inlet's specific volume
    cooling_capacity_w: float | None
    sensible_cooling_w: float | None
    latent_cooling_w: float | None
    cop: float | None
    comparison: RatingComparison | None
    findings: tuple[Finding, ...]

    @property
    def humidity_ratio_drop_g_per_kg(self) -> float:
        return 1000.0 * self.humidity_ratio_drop_kg_per_kg

    @property
    def grain_depression_gr_per_lb(self) -> float:
        return psychro.GRAINS_PER_POUND_PER_KG_PER_KG * self.humidity_ratio_drop_kg_per_kg

    @property
    def removal_pints_per_day(self) -> float | None:
        return None if self.removal_l_per_day is None else self.removal_l_per_day / US_PINT_L

    @property
    def cooling_capacity_kw(self) -> float | None:
        return None if self.cooling_capacity_w is None else self.cooling_capacity_w / 1000.0

    @property
    def kinds(self) -> tuple[FindingKind, ...]:
        return tuple(f.kind for f in self.findings)

    @property
    def threshold_keys(self) -> tuple[str, ...]:
        keys: list[str] = []
        for f in self.findings:
            keys.extend(f.threshold_keys)
        if self.comparison is not None:
            keys.extend(self.comparison.threshold_keys)
        if self.given.water_weighed:
            keys.append("water_density_kg_per_l")
        return tuple(dict.fromkeys(keys))


# --- the check ---------------------------------------------------------------------------


def _positive(value: float | None, field: str, top: float, unit: str) -> None:
    if value is not None and not (psychro.in_range(value, 0.0, top) and value > 0.0):
        raise InputError(field, value, f"must be above 0 and at most {top:g} {unit}")


def _check(given: DehumidifierInput) -> None:
    if not given.readings:
        raise InputError("readings", "none", "at least one inlet and outlet reading is needed")
    for pair in given.readings:
        psychro.check_dry_bulb(pair.inlet_temp_c, "inlet temperature")
        psychro.check_rh(pair.inlet_rh_pct, "inlet RH")
        psychro.check_dry_bulb(pair.outlet_temp_c, "outlet temperature")
        psychro.check_rh(pair.outlet_rh_pct, "outlet RH")
    times = [p.at_h for p in given.readings if p.at_h is not None]
    if len(given.readings) > 1 and times:
        if len(times) != len(given.readings):
            raise InputError("reading times", "some missing", "give every reading a time or none")
        if any(b <= a for a, b in itertools.pairwise(times)):
            raise InputError("reading times", times, "must increase from one reading to the next")
    if given.duration_h is not None and times and max(times) > given.duration_h:
        raise InputError(
            "reading times", max(times), f"must be within the run of {given.duration_h:g} h"
        )
    if given.water_l is not None and not psychro.in_range(given.water_l, 0.0, WATER_MAX_L):
        raise InputError("water", given.water_l, f"must be from 0 to {WATER_MAX_L:g} L")
    _positive(given.duration_h, "hours", RUN_HOURS_MAX_H, "h")
    _positive(given.power_w, "power", POWER_MAX_W, "W")
    _positive(given.energy_kwh, "energy", ENERGY_MAX_KWH, "kWh")
    _positive(given.rated_capacity_l_per_day, "rated capacity", CAPACITY_MAX_L_PER_DAY, "L/day")
    _positive(
        given.rated_energy_factor_l_per_kwh,
        "rated energy factor",
        ENERGY_FACTOR_MAX_L_PER_KWH,
        "L/kWh",
    )
    if given.rating_condition is not None:
        rating_point(given.rating_condition)
    psychro.check_pressure(given.pressure_pa)


def _time_mean(values: Sequence[float], times: Sequence[float | None]) -> float:
    """Time mean of a series: trapezoids between the reading times, else a plain mean. The
    drop, and the inlet's and outlet's dry bulb and W, are all meant this one way, so the
    mean states differ by exactly the mean drop."""
    if len(values) == 1 or any(t is None for t in times):
        return sum(values) / len(values)
    at = [float(t) for t in times if t is not None]
    area = sum((at[i + 1] - at[i]) * (values[i] + values[i + 1]) / 2 for i in range(len(at) - 1))
    return area / (at[-1] - at[0])


def _mean_state(
    states: Sequence[MoistAir], times: Sequence[float | None], pressure_pa: float
) -> MoistAir:
    """The state of the time-mean dry bulb and humidity ratio (:func:`_time_mean`)."""
    if len(states) == 1:
        return states[0]
    temp = _time_mean([s.dry_bulb_c for s in states], times)
    w = _time_mean([s.humidity_ratio_kg_per_kg for s in states], times)
    return psychro.state_from_humidity_ratio(temp, w, pressure_pa)


def _plausible(value: float | None, key: str, beyond: list[str]) -> float | None:
    """``value``, or None (its limit's key added to ``beyond``) when it exceeds the highest
    figure a room dehumidifier can give: such a figure says the readings disagree."""
    if value is not None and value > th.value(key):
        beyond.append(key)
        return None
    return value


def _ratio(a: float | None, b: float | None) -> float | None:
    return None if a is None or not b else a / b


def site_scale(kind: DehumidifierKind, inlet: MoistAir, rating_air: MoistAir) -> float:
    """Expected share of a rating at this inlet air (our approximation; module notes)."""
    if kind == "desiccant":
        return inlet.humidity_ratio_kg_per_kg / rating_air.humidity_ratio_kg_per_kg
    coil_c = th.value("dehumidifier_nominal_coil_c")
    floor_site = psychro.state_from_dew_point(coil_c, coil_c, inlet.pressure_pa)
    floor_rating = psychro.state_from_dew_point(coil_c, coil_c, rating_air.pressure_pa)
    above = inlet.humidity_ratio_kg_per_kg - floor_site.humidity_ratio_kg_per_kg
    span = rating_air.humidity_ratio_kg_per_kg - floor_rating.humidity_ratio_kg_per_kg
    return max(0.0, above) / span


def _compare(
    given: DehumidifierInput,
    inlet: MoistAir,
    removal: float | None,
    energy_factor: float | None,
) -> RatingComparison | None:
    capacity, ef = given.rated_capacity_l_per_day, given.rated_energy_factor_l_per_kwh
    if capacity is None and ef is None:
        return None
    keys: list[str] = []
    point = air = scale = None
    if given.rating_condition is not None:
        point = rating_point(given.rating_condition)
        air = psychro.state_from_rh(point.dry_bulb_c, point.rh_pct)
        scale = site_scale(given.kind, inlet, air)
        keys += [*point.threshold_keys, "dehumidifier_nominal_coil_c"]
    expected = None if scale is None or capacity is None else scale * capacity
    expected_ef = None if scale is None or ef is None else scale * ef
    return RatingComparison(
        condition=point,
        rated_capacity_l_per_day=capacity,
        rated_energy_factor_l_per_kwh=ef,
        rating_air=air,
        site_scale=scale,
        expected_removal_l_per_day=expected,
        expected_energy_factor_l_per_kwh=expected_ef,
        removal_of_rated=_ratio(removal, capacity),
        removal_of_expected=_ratio(removal, expected),
        energy_factor_of_rated=_ratio(energy_factor, ef),
        energy_factor_of_expected=_ratio(energy_factor, expected_ef),
        threshold_keys=tuple(keys),
    )


def _findings(
    given: DehumidifierInput,
    inlet: MoistAir,
    outlet: MoistAir,
    drop: float,
    energy: float | None,
    comparison: RatingComparison | None,
    beyond: tuple[str, ...],
) -> tuple[Finding, ...]:
    found: list[Finding] = []
    if not given.running:
        found.append(Finding(FindingKind.NOT_RUNNING))
    if beyond:
        found.append(Finding(FindingKind.INCONSISTENT, beyond))
    if given.kind == "refrigerant":
        if inlet.dry_bulb_c < th.value("refrigerant_coil_frost_inlet_c"):
            found.append(Finding(FindingKind.COIL_FROST, ("refrigerant_coil_frost_inlet_c",)))
        elif inlet.dry_bulb_c < th.value("refrigerant_dehumidifier_min_c"):
            found.append(Finding(FindingKind.TOO_COLD, ("refrigerant_dehumidifier_min_c",)))
    resolution = th.value("dehumidifier_drop_resolution_g_per_kg") / 1000.0
    drop_keys = ("dehumidifier_drop_resolution_g_per_kg",)
    if drop < -resolution:
        found.append(Finding(FindingKind.OUTLET_WETTER, drop_keys))
    elif drop < resolution:
        found.append(Finding(FindingKind.NO_DROP, drop_keys))
    if outlet.dry_bulb_c <= inlet.dry_bulb_c:
        found.append(Finding(FindingKind.OUTLET_NOT_WARMER))
    if given.water_l is None:
        found.append(Finding(FindingKind.NO_WATER))
    elif given.water_l == 0.0 and drop >= resolution:
        found.append(Finding(FindingKind.NOTHING_COLLECTED, drop_keys))
    elif given.duration_h is None:
        found.append(Finding(FindingKind.NO_DURATION))
    if energy is None and given.power_w is None:
        found.append(Finding(FindingKind.NO_POWER))
    if comparison is not None:
        if comparison.condition is None:
            found.append(Finding(FindingKind.NO_RATING_CONDITION))
        share = comparison.removal_of_expected
        if share is not None and share < th.value("dehumidifier_shortfall_fraction"):
            found.append(Finding(FindingKind.BELOW_EXPECTED, ("dehumidifier_shortfall_fraction",)))
        elif share is not None and share > th.value("dehumidifier_excess_fraction"):
            found.append(Finding(FindingKind.ABOVE_EXPECTED, ("dehumidifier_excess_fraction",)))
    return tuple(found)


def check(given: DehumidifierInput) -> DehumidifierResult:
    """The performance check of one unit (module notes for every formula)."""
    _check(given)
    p = given.pressure_pa
    states = tuple(
        (
            psychro.state_from_rh(r.inlet_temp_c, r.inlet_rh_pct, p),
            psychro.state_from_rh(r.outlet_temp_c, r.outlet_rh_pct, p),
        )
        for r in given.readings
    )
    times = [r.at_h for r in given.readings]
    inlet = _mean_state([s[0] for s in states], times, p)
    outlet = _mean_state([s[1] for s in states], times, p)
    drop = _time_mean(
        [i.humidity_ratio_kg_per_kg - o.humidity_ratio_kg_per_kg for i, o in states], times
    )
    hours = given.duration_h
    water_kg = None if given.water_l is None else given.water_l * th.value("water_density_kg_per_l")
    removal = None if given.water_l is None or hours is None else given.water_l * 24.0 / hours
    energy = given.energy_kwh
    if energy is None and given.power_w is not None and hours is not None:
        energy = given.power_w * hours / 1000.0
    power = given.power_w
    if given.energy_kwh is not None and hours is not None:
        power = given.energy_kwh * 1000.0 / hours
    ef = None if given.water_l is None or not energy else given.water_l / energy
    integral = None if hours is None else drop * hours
    resolution = th.value("dehumidifier_drop_resolution_g_per_kg") / 1000.0
    flow = volume = None
    if water_kg and integral is not None and drop >= resolution:
        flow = water_kg / (integral * 3600.0)
        volume = flow * inlet.specific_volume_m3_per_kg * 3600.0
    beyond: list[str] = []
    removal = _plausible(removal, "dehumidifier_removal_max_l_per_day", beyond)
    ef = _plausible(ef, "dehumidifier_energy_factor_max_l_per_kwh", beyond)
    volume = _plausible(volume, "dehumidifier_air_flow_max_m3_per_h", beyond)
    if volume is None:
        flow = None
    coil = total = sensible = latent = cop = None
    if given.kind == "refrigerant" and drop >= resolution:
        w_out = outlet.humidity_ratio_kg_per_kg
        coil_c = min(outlet.dew_point_c, inlet.dry_bulb_c)
        coil = psychro.state_from_humidity_ratio(coil_c, w_out, p)
        dried = psychro.state_from_humidity_ratio(inlet.dry_bulb_c, w_out, p)
        if flow is not None:
            condensate = drop * psychro.liquid_water_enthalpy_j_per_kg(coil_c)
            total = flow * (inlet.enthalpy_j_per_kg - coil.enthalpy_j_per_kg - condensate)
            latent = flow * (inlet.enthalpy_j_per_kg - dried.enthalpy_j_per_kg - condensate)
            sensible = flow * (dried.enthalpy_j_per_kg - coil.enthalpy_j_per_kg)
            cop = _plausible(None if not power else total / power, "dehumidifier_cop_max", beyond)
    comparison = _compare(given, inlet, removal, ef)
    return DehumidifierResult(
        given=given,
        inlet=inlet,
        outlet=outlet,
        states=states,
        humidity_ratio_drop_kg_per_kg=drop,
        drop_integral_kg_per_kg_h=integral,
        coil=coil,
        water_kg=water_kg,
        removal_l_per_day=removal,
        energy_kwh=energy,
        mean_power_w=power,
        energy_factor_l_per_kwh=ef,
        air_mass_flow_kg_per_s=flow,
        air_volume_flow_m3_per_h=volume,
        cooling_capacity_w=total,
        sensible_cooling_w=sensible,
        latent_cooling_w=latent,
        cop=cop,
        comparison=comparison,
        findings=_findings(given, inlet, outlet, drop, energy, comparison, tuple(beyond)),
    )
