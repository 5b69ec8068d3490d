"""A room and a site judged: the coldest surface, the highest safe RH, the humidity class."""

from __future__ import annotations

import math
from collections.abc import Iterable
from functools import lru_cache

from survey import domain, psychro
from survey import thresholds as th
from survey.assess.records import (
    DEFAULT_ACCURACY,
    Accuracy,
    AirState,
    FactorState,
    MaterialFinding,
    MouldState,
    OutdoorInput,
    RoomFinding,
    RoomInput,
    SiteFinding,
    SurfaceFinding,
    _dln_pws,
    air_state,
    emc_or_none,
)
from survey.assess.surfaces import (
    _SETS_TARGET,
    _context,
    _Limits,
    _limits,
    _material,
    _surface,
)
from survey.errors import InputError
from survey.psychro import in_range as _number_in  # one range guard for the core

_SQRT3 = math.sqrt(3.0)

# --- rooms and site ----------------------------------------------------------------------------


def _check_room(room: RoomInput) -> str:
    """The room's canonical use, after checking what the psychrometric core does not."""
    try:
        use = th.check_use(room.use)
    except InputError as exc:
        raise exc.with_field(f"room {room.name!r} use") from None
    obs = room.observations
    v_low, v_high = domain.ROOM_VOLUME_MIN_M3, domain.ROOM_VOLUME_MAX_M3
    people = domain.OCCUPANTS_MAX
    area_high = domain.MOULD_AREA_MAX_M2
    area = obs.visible_mould_area_m2
    if (
        (room.volume_m3 is None or _number_in(room.volume_m3, v_low, v_high))
        and (
            room.occupants is None
            or (room.occupants.__class__ is int and 0 <= room.occupants <= people)
        )
        and not room.activities
        and obs.water_category in (None, 1, 2, 3)
        and (
            (area.__class__ is float and 0.0 <= area <= area_high)
            or _number_in(area, 0.0, area_high)
        )
    ):
        return use
    where = f"room {room.name!r}"
    if room.volume_m3 is not None and not _number_in(room.volume_m3, v_low, v_high):
        raise InputError(
            f"{where} volume", room.volume_m3, f"must be between {v_low:g} and {v_high:g} m³"
        )
    n = room.occupants
    if n is not None and (n.__class__ is not int or not 0 <= n <= people):
        raise InputError(f"{where} occupants", n, f"must be a whole number from 0 to {people}")
    hours = domain.ACTIVITY_HOURS_MAX
    for activity in room.activities:
        if activity.kind not in th.ACTIVITY_RATE:
            raise InputError(
                f"{where} activity", activity.kind, "expected one of " + ", ".join(th.ACTIVITY_RATE)
            )
        if not _number_in(activity.hours_per_day, 0.0, hours):
            raise InputError(
                f"{where} {activity.kind} hours per day",
                activity.hours_per_day,
                f"must be between 0 and {hours:g}",
            )
    if obs.water_category not in (None, 1, 2, 3):
        raise InputError(f"{where} water category", obs.water_category, "expected 1, 2 or 3")
    if not _number_in(obs.visible_mould_area_m2, 0.0, area_high):
        raise InputError(
            f"{where} visible mould area",
            obs.visible_mould_area_m2,
            f"must be between 0 and {area_high:g} m²",
        )
    return use


def _humidity_class(
    air: AirState, outdoor: AirState, accuracy: Accuracy, k: float, limits: tuple[float, ...] | None
) -> tuple[float, float, int | None, tuple[int, ...]]:
    """Vapour-pressure excess, its expanded uncertainty, the class and the classes its band
    spans (see :func:`survey.thresholds.humidity_class` for the class rule)."""
    excess = air.vapour_pressure_pa - outdoor.vapour_pressure_pa
    u_rh = accuracy.rh_pct / _SQRT3 / 100.0
    u_t = accuracy.air_temp_k / _SQRT3
    terms = 0.0
    for state in (air, outdoor):
        terms += (state.sat_pressure_water_pa * u_rh) ** 2
        terms += (state.vapour_pressure_pa * state.dln_sat_pressure_water_per_k * u_t) ** 2
    big_u = k * math.sqrt(terms)
    if limits is None:
        return excess, big_u, None, ()
    low = th.humidity_class_in(excess - big_u, limits)
    high = th.humidity_class_in(excess + big_u, limits)
    return (excess, big_u, th.humidity_class_in(excess, limits), tuple(range(low, high + 1)))


_CLASS_KEYS = (*th.HUMIDITY_CLASS_KEYS, "humidity_class_flat_below_c", "humidity_class_zero_at_c")


@lru_cache(maxsize=64)
def _with_class_keys(keys: tuple[str, ...]) -> tuple[str, ...]:
    return keys + _CLASS_KEYS


def _assess_room(
    room: RoomInput,
    outdoor: AirState | None,
    pressure_pa: float,
    site_accuracy: Accuracy,
    limits: _Limits,
) -> RoomFinding:
    use = _check_room(room)
    accuracy = room.accuracy or site_accuracy
    try:
        air = air_state(room.air_temp_c, room.rh_pct, pressure_pa)
    except InputError as exc:
        raise exc.with_field(f"room {room.name!r} {exc.field}") from None
    ctx = _context(air, outdoor, accuracy, use, limits)
    surfaces = tuple([_surface(ctx, s) for s in room.surfaces])
    surfaces = _not_judged_by_use(room, use, surfaces)
    keys = ctx.keys if outdoor is None else _with_class_keys(ctx.keys)

    coldest = other = None
    rh_mould = rh_margin = rh_low = rh_high = rh_dry_other = None
    setting: tuple[SurfaceFinding, ...] = surfaces
    if surfaces and not {s.element for s in surfaces} <= _SETS_TARGET:
        setting = tuple(s for s in surfaces if s.element in _SETS_TARGET)
        others = [s for s in surfaces if s.element not in _SETS_TARGET]
        other = min(others, key=_surface_temp)
        # Clear of condensation while the surface RH stays below 100 %: the same relation
        # as below with the limit at 100 %.
        rh_dry_other = min(100.0, air.rh_pct * 100.0 / other.surface_rh_pct)
    # A surface warmer than the room air is heated, sunlit or beside a heat source: it
    # cannot show how cold the fabric gets, so it does not set the highest safe room RH.
    setting = tuple(s for s in setting if s.surface_temp_c <= air.dry_bulb_c)
    if setting:
        coldest = min(setting, key=_surface_temp)
        ts = coldest.surface_temp_c
        # psychro.max_room_rh_pct's relation, RH_max = limit · p_ws(t_s) / p_ws,water(t_i)
        # (the vapour pressure is the same at the surface and in the room; pressure cancels).
        # With the surface RH at hand that is RH_room · limit / RH_surface; a test holds both
        # equal to psychro's.
        rh_mould = min(100.0, air.rh_pct * limits.mould / coldest.surface_rh_pct)
        margin_ts = ts - limits.margin
        rh_margin = (
            min(
                100.0, 100.0 * psychro.sat_vapour_pressure_pa(margin_ts) / air.sat_pressure_water_pa
            )
            if margin_ts >= psychro.SURFACE_TEMP_MIN_C
            else 0.0
        )
        # ln RH_max = ln(limit) + ln p_ws(t_s) − ln p_ws,water(t_i): the band of the binding
        # limit from the surface and air thermometers.
        binding_ts, binding = (ts, rh_mould) if rh_mould <= rh_margin else (margin_ts, rh_margin)
        if 0.0 < binding < 100.0:
            l_s = _dln_pws(binding_ts)
            spread = math.exp(
                limits.k
                * math.sqrt(
                    (l_s * ctx.u_ts) ** 2 + (air.dln_sat_pressure_water_per_k * ctx.u_ti) ** 2
                )
            )
            rh_low = binding / spread
            rh_high = min(100.0, binding * spread)
        else:
            rh_low = rh_high = binding

    excess = excess_u = number = None
    possible: tuple[int, ...] = ()
    if outdoor is not None:
        excess, excess_u, number, possible = _humidity_class(
            air, outdoor, accuracy, limits.k, limits.class_limits
        )

    materials: tuple[MaterialFinding, ...] = ()
    if room.materials:
        emc = emc_or_none(air.dry_bulb_c, air.rh_pct)
        materials = tuple(
            _material(m, emc, air.dry_bulb_c, f"room {room.name!r} ") for m in room.materials
        )
        extra = {key for m in materials for key in m.threshold_keys}
        keys = keys + tuple(sorted(extra - set(keys)))
    return RoomFinding(
        room,
        use,
        air,
        outdoor,
        accuracy,
        limits.k * ctx.u_tc,
        surfaces,
        coldest,
        rh_mould,
        rh_margin,
        rh_low,
        rh_high,
        other,
        rh_dry_other,
        excess,
        excess_u,
        number,
        possible,
        materials,
        th.FRSI_LIMIT_BY_USE[use].key,
        keys,
    )


#: Uses where the ground, not outdoor air, sets floor and wall temperatures.
GROUND_USES = frozenset(u for u, p in th.ROOM_USE_POLICY.items() if p.ground_contact)
_GROUND_ELEMENTS = frozenset({"floor", "external_wall", "internal_wall"})
_FACTOR_JUDGED = frozenset(
    {FactorState.MEETS, FactorState.UNDER, FactorState.CANNOT_TELL, FactorState.NOT_JUDGED}
)


def _wet_and_drying(room: RoomInput) -> bool:
    """Drying under way with materials above their dry standard (or timber decay range)."""
    if not room.observations.drying_in_progress:
        return False
    tolerance = th.value("dry_standard_tolerance_fraction")
    return any(
        m.dry_standard is not None and m.value > m.dry_standard * (1.0 + tolerance)
        for m in room.materials
    )


def _not_judged_by_use(
    room: RoomInput, use: str, surfaces: tuple[SurfaceFinding, ...]
) -> tuple[SurfaceFinding, ...]:
    """The temperature factor set aside where outdoor air does not set the surface
    temperature (ground contact) or evaporation cools it (wet materials drying); mould not
    judged outside the 5-40 °C surface range of the 80 % criterion."""
    wet = _wet_and_drying(room)
    low = th.value("mould_growth_min_surface_temp_c")
    high = th.value("mould_growth_max_surface_temp_c")
    out = []
    for s in surfaces:
        state = None
        if s.temperature_factor_state in _FACTOR_JUDGED:
            if s.surface_temp_c > room.air_temp_c:
                state = FactorState.WARMER_THAN_AIR
            elif wet:
                state = FactorState.DRYING_WET
            elif use in GROUND_USES and s.element in _GROUND_ELEMENTS:
                state = FactorState.GROUND_CONTACT
        if state is not None:
            s = s._replace(
                temperature_factor=None,
                temperature_factor_uncertainty=None,
                temperature_factor_state=state,
                temperature_factor_possible=(state,),
            )
        if s.mould is not MouldState.NOT_JUDGED:
            mould = (
                MouldState.TOO_COLD
                if s.surface_temp_c < low
                else MouldState.TOO_HOT
                if s.surface_temp_c > high
                else None
            )
            if mould is not None:
                s = s._replace(mould=mould, mould_possible=(mould,))
        out.append(s)
    return tuple(out)


def _surface_temp(finding: SurfaceFinding) -> float:
    return finding.surface_temp_c


def outdoor_state(
    outdoor: OutdoorInput, pressure_pa: float = psychro.STANDARD_PRESSURE_PA
) -> AirState:
    """The light state of the outdoor air."""
    return air_state(outdoor.air_temp_c, outdoor.rh_pct, pressure_pa, "outdoor")


def assess_room(
    room: RoomInput,
    outdoor: OutdoorInput | None = None,
    pressure_pa: float = psychro.STANDARD_PRESSURE_PA,
    accuracy: Accuracy = DEFAULT_ACCURACY,
) -> RoomFinding:
    """Judge one room's air, surfaces and materials. ``accuracy`` is used when the room
    carries none of its own."""
    out = None if outdoor is None else outdoor_state(outdoor, pressure_pa)
    return _assess_room(room, out, pressure_pa, accuracy, _limits(out))


def assess_site(
    rooms: Iterable[RoomInput],
    outdoor: OutdoorInput | None = None,
    pressure_pa: float = psychro.STANDARD_PRESSURE_PA,
    accuracy: Accuracy = DEFAULT_ACCURACY,
    year_built: int | None = None,
) -> SiteFinding:
    """Judge every room of a visit against the same outdoor air and pressure."""
    psychro.check_pressure(pressure_pa)
    if year_built is not None and (
        not isinstance(year_built, int)
        or isinstance(year_built, bool)
        or not 1000 <= year_built <= 2200
    ):
        raise InputError("year built", year_built, "expected a year such as 1935")
    out = None if outdoor is None else outdoor_state(outdoor, pressure_pa)
    limits = _limits(out)
    findings = tuple([_assess_room(r, out, pressure_pa, accuracy, limits) for r in rooms])
    keys: set[str] = {"coverage_factor"}
    for f in findings:
        keys.update(f.threshold_keys)
    return SiteFinding(
        findings, out, pressure_pa, accuracy, year_built, tuple(t.key for t in th.cited(keys))
    )
