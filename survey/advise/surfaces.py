"""Cold surfaces: walls, ceilings and floors to be made warmer, panes and frames, pipes."""

from __future__ import annotations

from typing import Any

from survey import psychro
from survey import thresholds as th
from survey.advise.common import _drying, _keys
from survey.advise.kinds import (
    Action,
    ActionKind,
    ColdSurfaceNumbers,
    Forming,
    RaiseSurfaceNumbers,
)
from survey.assess import (
    AirState,
    CondensationState,
    FactorState,
    MouldState,
    RoomFinding,
    SurfaceFinding,
    air_state,
)

# --- surfaces ------------------------------------------------------------------------------------


def _raise_surface(
    finding: RoomFinding, surface: SurfaceFinding, design_rh: float
) -> Action[Any] | None:
    """A wall, ceiling or floor too cold for the room to be held at a practical RH, or with
    its temperature factor under the limit."""
    air = finding.air
    floor = th.value("room_rh_floor_pct")
    mould_limit = th.value("surface_rh_mould_limit_pct")
    margin = th.value("dew_point_margin_k")
    drying_wet = surface.temperature_factor_state is FactorState.DRYING_WET
    if drying_wet and surface.condensation is not CondensationState.CONDENSING:
        return None  # evaporation cools a drying surface: dry it before judging it
    max_rh = psychro.max_room_rh_pct(air.dry_bulb_c, surface.surface_temp_c, mould_limit)
    too_cold = max_rh < floor
    # Under the limit at the reading, though inside the instruments' accuracy of it, on a
    # surface whose band reaches the mould limit: treated as under (to be confirmed).
    factor_unclear = (
        surface.temperature_factor_state is FactorState.CANNOT_TELL
        and surface.temperature_factor is not None
        and surface.temperature_factor_limit is not None
        and surface.temperature_factor < surface.temperature_factor_limit
        and MouldState.ABOVE in surface.mould_possible
    )
    factor_under = surface.temperature_factor_state is FactorState.UNDER or factor_unclear
    if not (too_cold or factor_under or drying_wet):
        return None
    keys = ["surface_rh_mould_limit_pct", "dew_point_margin_k", "room_rh_floor_pct"]
    design_air = air_state(air.dry_bulb_c, design_rh, air.pressure_pa)
    for_rh = max(
        psychro.surface_temp_for_rh_c(design_air, mould_limit),  # type: ignore[arg-type]
        design_air.condensation_point_c + margin,
    )
    target = for_rh
    factor: dict[str, Any] = {}
    if surface.temperature_factor is not None:
        f_limit = surface.temperature_factor_limit
        assert finding.outdoor is not None and f_limit is not None  # a factor needs both
        outdoor_c = finding.outdoor.dry_bulb_c
        for_factor = outdoor_c + f_limit * (air.dry_bulb_c - outdoor_c)
        factor = {
            "temperature_factor": surface.temperature_factor,
            "temperature_factor_uncertainty": surface.temperature_factor_uncertainty,
            "temperature_factor_limit": f_limit,
            "surface_temp_for_factor_limit_c": for_factor,
        }
        keys += [finding.frsi_limit_key or "", "frsi_min_temperature_difference_k"]
        if factor_under:
            target = max(target, for_factor)
    numbers = RaiseSurfaceNumbers(
        surface=surface.label,
        element=surface.element,
        surface_temp_c=surface.surface_temp_c,
        max_room_rh_pct=max_rh,
        surface_temp_for_target_rh_c=for_rh,
        target_surface_temp_c=target,
        design_rh_pct=design_rh,
        too_cold=too_cold,
        factor_under=factor_under,
        factor_unclear=factor_unclear,
        ground_contact=surface.temperature_factor_state is FactorState.GROUND_CONTACT,
        dehumidifier_cannot_cure=too_cold,
        drying_wet=drying_wet,
        use=finding.use,
        **factor,
    )
    return Action(ActionKind.RAISE_SURFACE_TEMPERATURE, numbers, _keys(keys))


def _forming(surface: SurfaceFinding) -> Forming:
    if surface.condensation is CondensationState.CONDENSING:
        return Forming.NOW
    if CondensationState.CONDENSING in surface.condensation_possible:
        return Forming.MAYBE
    return Forming.NO


def _cold_surface(
    finding: RoomFinding,
    surface: SurfaceFinding,
    target: float,
    target_air: AirState,
    forming: Forming,
    mouldy: bool = False,
) -> ColdSurfaceNumbers:
    return ColdSurfaceNumbers(
        surface=surface.label,
        element=surface.element,
        surface_temp_c=surface.surface_temp_c,
        condensation_point_c=surface.condensation_point_c,
        frost=surface.below_freezing,
        max_room_rh_pct_dry=min(100.0, finding.air.rh_pct * 100.0 / surface.surface_rh_pct),
        surface_temp_to_stay_dry_c=target_air.condensation_point_c,
        target_rh_pct=target,
        forming=forming,
        mouldy=mouldy,
        drying=_drying(finding) is not None,
        room_rh_pct=finding.air.rh_pct,
    )


def _glazing(
    finding: RoomFinding, surface: SurfaceFinding, target: float, target_air: AirState
) -> Action[Any] | None:
    """Glass or a window frame at or near the condensation point, or a frame above the
    mould limit: a window remedy, not a drier room."""
    forming = _forming(surface)
    mouldy = MouldState.ABOVE in surface.mould_possible
    if forming is Forming.NO and not mouldy:
        return None
    numbers = _cold_surface(finding, surface, target, target_air, forming, mouldy)
    return Action(
        ActionKind.REDUCE_GLAZING_CONDENSATION,
        numbers,
        ("condensation_dew_point_margin_k", "surface_rh_mould_limit_pct"),
    )


def _pipe(
    finding: RoomFinding, surface: SurfaceFinding, target: float, target_air: AirState
) -> Action[Any] | None:
    """A cold pipe at or near the condensation point: insulate it."""
    forming = _forming(surface)
    if forming is Forming.NO:
        return None
    numbers = _cold_surface(finding, surface, target, target_air, forming)
    return Action(ActionKind.INSULATE_PIPE, numbers, ("condensation_dew_point_margin_k",))
