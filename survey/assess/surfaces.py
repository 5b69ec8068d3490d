"""Each surface judged against the room air, with the instruments' uncertainty; materials."""

from __future__ import annotations

import math
from typing import Any, NamedTuple

from survey import psychro
from survey import thresholds as th
from survey.assess.records import (
    _CONDENSATION_ORDER,
    _FACTOR_ORDER,
    _MATERIAL_READING_MAX,
    _MOULD_ORDER,
    DEFAULT_ACCURACY,
    MATERIAL_SCALES,
    Accuracy,
    AirState,
    CondensationState,
    DryStandardState,
    FactorState,
    MaterialFinding,
    MaterialInput,
    MouldState,
    RankedState,
    SurfaceFinding,
    SurfaceInput,
    TimberState,
    _dln_pws,
)
from survey.errors import InputError

_SQRT3 = math.sqrt(3.0)

# --- limits, read once per assessment ---------------------------------------------------------


class _Limits(NamedTuple):
    frsi: dict[str, th.Threshold | None]  #: temperature-factor limit by room use
    k: float
    margin: float
    mould: float
    watch: float
    frsi_min_dt: float
    class_limits: tuple[float, ...] | None  #: at the outdoor temperature of this assessment


def _limits(outdoor: AirState | None) -> _Limits:
    return _Limits(
        frsi={use: th.frsi_limit(use) for use in th.ROOM_USES},
        k=th.value("coverage_factor"),
        margin=th.value("dew_point_margin_k"),
        mould=th.value("surface_rh_mould_limit_pct"),
        watch=th.value("surface_rh_mould_watch_pct"),
        frsi_min_dt=th.value("frsi_min_temperature_difference_k"),
        class_limits=None if outdoor is None else th.humidity_class_limits_pa(outdoor.dry_bulb_c),
    )


_SURFACE_KEYS = (
    "condensation_dew_point_margin_k",
    "dew_point_margin_k",
    "surface_rh_mould_limit_pct",
    "surface_rh_mould_watch_pct",
    "coverage_factor",
)


# --- surfaces ----------------------------------------------------------------------------------


class _RoomContext(NamedTuple):
    """Per-room numbers every surface of the room shares (plain floats, for speed)."""

    air: AirState
    vapour_pressure_pa: float
    condensation_point_c: float
    u_ln_pw_sq: float  #: u²(ln p_w) from the room's RH and air temperature
    u_tc: float  #: standard uncertainty of the condensation point, K
    u_ts: float  #: standard uncertainty of a surface temperature, K
    u_ti: float  #: standard uncertainty of the air temperatures, K
    shared_thermometer: bool  #: room and outdoor air read by one thermometer (correlated)
    k: float
    big_u_margin: float  #: expanded uncertainty of every margin in the room, K
    margin_limit: float
    mould_limit: float
    mould_watch: float
    limits: _Limits
    outdoor_temp_c: float | None
    delta_t: float | None  #: t_i − t_e when the factor is judged, else None
    factor_limit: float | None
    factor_state_if_not_judged: FactorState
    keys: tuple[str, ...]  #: threshold keys every surface of this room uses


def _context(
    air: AirState, outdoor: AirState | None, accuracy: Accuracy, use: str, limits: _Limits
) -> _RoomContext:
    u_rh = accuracy.rh_pct / _SQRT3
    u_ti = accuracy.air_temp_k / _SQRT3
    u_ts = accuracy.surface_temp_k / _SQRT3
    u_ln_pw_sq = (u_rh / air.rh_pct) ** 2 + (air.dln_sat_pressure_water_per_k * u_ti) ** 2
    u_tc = math.sqrt(u_ln_pw_sq) / _dln_pws(air.condensation_point_c)
    limit = limits.frsi[use]
    delta_t = None
    keys: tuple[str, ...]
    if limit is None:
        keys = _SURFACE_KEYS
        not_judged = FactorState.NOT_APPLICABLE
    else:
        keys = (*_SURFACE_KEYS, limit.key, "frsi_min_temperature_difference_k")
        not_judged = FactorState.NOT_JUDGED
        if outdoor is not None:
            d = air.dry_bulb_c - outdoor.dry_bulb_c
            if d >= limits.frsi_min_dt:
                delta_t = d
    return _RoomContext(
        air,
        air.vapour_pressure_pa,
        air.condensation_point_c,
        u_ln_pw_sq,
        u_tc,
        u_ts,
        u_ti,
        accuracy.shared_thermometer,
        limits.k,
        limits.k * math.sqrt(u_tc * u_tc + u_ts * u_ts),
        limits.margin,
        limits.mould,
        limits.watch,
        limits,
        None if outdoor is None else outdoor.dry_bulb_c,
        delta_t,
        None if limit is None else limit.value,
        not_judged,
        keys,
    )


_CLEAR, _NEAR, _CONDENSING = _CONDENSATION_ORDER
_BELOW, _APPROACHING, _ABOVE = _MOULD_ORDER
_MEETS, _UNDER = _FACTOR_ORDER


def _spans(order: tuple[Any, ...], cannot_tell: RankedState) -> dict[Any, Any]:
    """(best, worst) -> (state, possible states), precomputed for every pair."""
    table = {}
    for low, best in enumerate(order):
        for high, worst in enumerate(order):
            if low == high:
                table[best, worst] = (best, (best,))
            elif low < high:
                table[best, worst] = (cannot_tell, order[low : high + 1])
    return table


_CONDENSATION_SPAN = _spans(_CONDENSATION_ORDER, CondensationState.CANNOT_TELL)
_MOULD_SPAN = _spans(_MOULD_ORDER, MouldState.CANNOT_TELL)
_FACTOR_SPAN = _spans(_FACTOR_ORDER, FactorState.CANNOT_TELL)
_ONE_FACTOR = {s: (s,) for s in FactorState}
_NOT_FOR_ELEMENT = FactorState.NOT_FOR_ELEMENT
_NO_MOULD = MouldState.NOT_JUDGED
_NO_MOULD_POSSIBLE = (MouldState.NOT_JUDGED,)
_pws = psychro.sat_vapour_pressure_pa
_POLICY = th.ELEMENT_POLICY
_SETS_TARGET = frozenset(e for e, p in _POLICY.items() if p.sets_room_target)


def _surface(ctx: _RoomContext, surface: SurfaceInput) -> SurfaceFinding:
    ts = surface.surface_temp_c
    if ts.__class__ is not float or not (
        psychro.SURFACE_TEMP_MIN_C <= ts <= psychro.SURFACE_TEMP_MAX_C
    ):
        psychro.check_surface_temp(ts, f"surface temperature of {surface.label}")
        ts = float(ts)
    policy = _POLICY.get(surface.element)
    if policy is None:
        policy = th.check_element(surface.element, f"element of surface {surface.label}")
    u_ts = ctx.u_ts

    # surface RH and its band, in log space: u²(ln RH_s) = u²(ln p_w) + (L(t_s) u_ts)²
    rh_s = 100.0 * ctx.vapour_pressure_pa / _pws(ts)
    spread = math.exp(ctx.k * math.sqrt(ctx.u_ln_pw_sq + (_dln_pws(ts) * u_ts) ** 2))
    rh_low = rh_s / spread
    rh_high = rh_s * spread
    if policy.mould_judged:
        watch, limit = ctx.mould_watch, ctx.mould_limit
        mould, mould_possible = _MOULD_SPAN[
            _ABOVE if rh_low > limit else _APPROACHING if rh_low >= watch else _BELOW,
            _ABOVE if rh_high > limit else _APPROACHING if rh_high >= watch else _BELOW,
        ]
    else:
        mould, mould_possible = _NO_MOULD, _NO_MOULD_POSSIBLE

    # margin to the condensation point and its band
    margin = ts - ctx.condensation_point_c
    big_u = ctx.big_u_margin
    hi, lo = margin + big_u, margin - big_u
    limit = ctx.margin_limit
    condensation, condensation_possible = _CONDENSATION_SPAN[
        _CONDENSING if hi <= 0.0 else _NEAR if hi < limit else _CLEAR,
        _CONDENSING if lo <= 0.0 else _NEAR if lo < limit else _CLEAR,
    ]

    # temperature factor fRsi = (ts − te)/(ti − te) and its band
    d = ctx.delta_t
    if not policy.temperature_factor:
        factor = factor_u = None
        factor_state = _NOT_FOR_ELEMENT
        factor_possible = _ONE_FACTOR[factor_state]
    elif d is None:
        factor = factor_u = None
        factor_state = ctx.factor_state_if_not_judged
        factor_possible = _ONE_FACTOR[factor_state]
    else:
        assert ctx.outdoor_temp_c is not None and ctx.factor_limit is not None
        factor = (ts - ctx.outdoor_temp_c) / d
        u_ti = ctx.u_ti  # the outdoor thermometer is taken to be as good as the room's
        if ctx.shared_thermometer:
            # one thermometer, r = 1 (GUM 5.2): (∂f/∂t_i + ∂f/∂t_e) = −1/Δ
            factor_u = ctx.k * math.sqrt(u_ts * u_ts + u_ti * u_ti) / d
        else:
            factor_u = (
                ctx.k
                * math.sqrt(u_ts * u_ts + (factor * u_ti) ** 2 + ((1.0 - factor) * u_ti) ** 2)
                / d
            )
        limit = ctx.factor_limit
        factor_state, factor_possible = _FACTOR_SPAN[
            _MEETS if factor + factor_u >= limit else _UNDER,
            _MEETS if factor - factor_u >= limit else _UNDER,
        ]
    return SurfaceFinding(
        surface.label,
        policy.element,
        ts,
        rh_s,
        rh_low,
        rh_high,
        ctx.condensation_point_c,
        margin,
        big_u,
        condensation,
        condensation_possible,
        mould,
        mould_possible,
        factor,
        factor_u,
        ctx.factor_limit if policy.temperature_factor else None,
        factor_state,
        factor_possible,
        ctx.keys,
    )


def assess_surface(
    surface: SurfaceInput,
    air: AirState,
    outdoor: AirState | None = None,
    use: str = "other",
    accuracy: Accuracy = DEFAULT_ACCURACY,
) -> SurfaceFinding:
    """Judge one surface against the room air ``air`` (from :func:`air_state`)."""
    return _surface(_context(air, outdoor, accuracy, th.check_use(use), _limits(outdoor)), surface)


# --- materials ---------------------------------------------------------------------------------


def _material(
    reading: MaterialInput, emc_pct: float | None, air_c: float, where: str
) -> MaterialFinding:
    field = f"{where}material {reading.label}"
    if reading.scale not in MATERIAL_SCALES:
        raise InputError(
            f"{field} scale",
            reading.scale,
            "expected mc_pct (timber moisture content, %), wme_pct (wood moisture "
            "equivalent, %) or relative (the meter's own scale)",
        )
    top = _MATERIAL_READING_MAX
    for name, number in (("reading", reading.value), ("dry standard", reading.dry_standard)):
        if number is None and name == "dry standard":
            continue
        if (
            not isinstance(number, (int, float))
            or isinstance(number, bool)
            or not math.isfinite(number)
            or not 0.0 <= number <= top
        ):
            raise InputError(f"{field} {name}", number, f"must be between 0 and {top:g}")
    keys: list[str] = []
    if reading.dry_standard is None:
        dry_state = DryStandardState.NO_REFERENCE
        excess = None
    else:
        keys.append("dry_standard_tolerance_fraction")
        excess = reading.value - reading.dry_standard
        allowed = reading.dry_standard * (1.0 + th.value("dry_standard_tolerance_fraction"))
        dry_state = DryStandardState.AT if reading.value <= allowed else DryStandardState.ABOVE
    timber_state = None
    emc = None
    wetter = slowed = False
    if reading.timber and reading.scale == "mc_pct":
        keys += ["timber_mould_mc_pct", "timber_decay_mc_pct"]
        emc = emc_pct
        mould_mc = th.value("timber_mould_mc_pct")
        if reading.value >= th.value("timber_decay_mc_pct"):
            timber_state = TimberState.DECAY_RANGE
        elif reading.value >= mould_mc:
            timber_state = TimberState.MOULD_RANGE
        else:
            timber_state = TimberState.DRY
        wetter = timber_state is not TimberState.DRY and emc_pct is not None and emc_pct < mould_mc
        if timber_state is TimberState.DECAY_RANGE:
            keys += ["timber_decay_slow_below_c", "timber_decay_slow_above_c"]
            slowed = not (
                th.value("timber_decay_slow_below_c")
                <= air_c
                <= th.value("timber_decay_slow_above_c")
            )
    return MaterialFinding(
        label=reading.label,
        material=reading.material,
        value=reading.value,
        scale=reading.scale,
        dry_standard=reading.dry_standard,
        dry_standard_state=dry_state,
        excess_over_dry_standard=excess,
        timber_state=timber_state,
        emc_pct=emc,
        wetter_than_air_explains=wetter,
        decay_slowed_by_temperature=slowed,
        threshold_keys=tuple(keys),
        dry_standard_visit=None if reading.dry_standard is None else reading.dry_standard_visit,
    )
