"""The decision rules: what to do about a room, in order, with numbers.

When ventilation helps
----------------------
Outdoor air dries a room when it holds less water than the room air *now*, by the margin
``ventilation_outdoor_drier_margin_g_per_kg``. It can *hold* the target only when it is that
much drier than room air at the target, and only within the practical air change rate; when
it cannot, ventilation is still advised as far as it helps, and a dehumidifier (and, where a
surface needs it, a warmer surface) does the rest. The advice never says to keep windows
closed while outdoor air is drier than the room air.

A room being dried (drying equipment running) is kept closed and dehumidified, never
ventilated; a ventilated loft or crawl space follows outdoor air, so the moisture reaching it
is cut instead.
"""

from __future__ import annotations

import math
from collections.abc import Iterable
from typing import Any

import msgspec

from survey import psychro
from survey import thresholds as th
from survey.advise import loads
from survey.advise.cautions import cautions_for
from survey.advise.kinds import (
    Action,
    ActionKind,
    ColdSurfaceNumbers,
    DehumidifyNumbers,
    DehumidifyWhy,
    FindSourceNumbers,
    Forming,
    KeepDryingNumbers,
    MaterialPoint,
    MoistureEstimate,
    OutdoorMode,
    RaiseSurfaceNumbers,
    RemoveContaminatedNumbers,
    RepeatReadingsNumbers,
    RoomAdvice,
    SiteAdvice,
    SourceReason,
    Target,
    TargetWhy,
    TimberPoint,
    TimberSurface,
    VentilatedSpaceNumbers,
    VentilateNumbers,
)
from survey.assess import (
    AirState,
    CondensationState,
    DryingEquipment,
    DryStandardState,
    FactorState,
    MaterialFinding,
    MouldState,
    Observations,
    RoomFinding,
    SiteFinding,
    SurfaceFinding,
    TimberState,
    air_state,
)
from survey.errors import InputError

TARGET_RH_MIN_PCT = 25.0
TARGET_RH_MAX_PCT = 80.0


def _keys(*groups: Iterable[str | None]) -> tuple[str, ...]:
    """Threshold keys, in order, once each, without empties."""
    return tuple(dict.fromkeys(k for group in groups for k in group if k))


def rh_limit_shown(limit_pct: float) -> int:
    """A highest-safe room RH as it is shown and held: whole percent, rounded down so it
    stays on the safe side. Every face uses this, so a headline and the text below agree."""
    return math.floor(limit_pct + 1e-9)


def _drying(finding: RoomFinding) -> DryingEquipment | None:
    """The room's running drying equipment (dehumidifiers, air movers), or None."""
    obs = finding.room.observations
    return obs.drying if obs.drying_in_progress else None


# --- the target --------------------------------------------------------------------------------


def room_target(finding: RoomFinding, target_rh_pct: float | None) -> Target:
    """The room RH to aim for: the drying target, the default or the one given, lowered to
    what the coldest wall, ceiling or floor can bear (never below the practical floor)."""
    if target_rh_pct is None and _drying(finding) is not None:
        design = th.value("drying_rh_target_pct")
        return Target(
            rh_pct=design,
            why=TargetWhy.DRYING,
            design_rh_pct=design,
            threshold_keys=("drying_rh_target_low_pct", "drying_rh_target_pct"),
        )
    keys: list[str] = []
    if target_rh_pct is None:
        design, why = th.value("room_rh_target_default_pct"), TargetWhy.DEFAULT
        keys.append("room_rh_target_default_pct")
    else:
        if not TARGET_RH_MIN_PCT <= target_rh_pct <= TARGET_RH_MAX_PCT:
            raise InputError(
                "target RH",
                f"{target_rh_pct:g}",
                f"must be between {TARGET_RH_MIN_PCT:g} and {TARGET_RH_MAX_PCT:g} %",
            )
        design, why = target_rh_pct, TargetWhy.GIVEN
    limit = finding.max_room_rh_pct
    if limit is None or limit >= design:
        return Target(rh_pct=design, why=why, design_rh_pct=design, threshold_keys=tuple(keys))
    keys += ["surface_rh_mould_limit_pct", "dew_point_margin_k", "room_rh_floor_pct"]
    floor = th.value("room_rh_floor_pct")
    whole = float(rh_limit_shown(limit))
    target = max(whole, min(floor, design))
    coldest = finding.coldest
    assert coldest is not None  # a limit means a coldest surface
    assert finding.max_room_rh_pct_mould is not None and finding.max_room_rh_pct_margin is not None
    mould_binds = finding.max_room_rh_pct_mould <= finding.max_room_rh_pct_margin
    return Target(
        rh_pct=target,
        why=why,
        design_rh_pct=design,
        lowered_by_surface=True,
        surface_limit_whole_pct=whole,
        at_practical_floor=target > whole,
        binding="mould" if mould_binds else "margin",
        coldest_label=coldest.label,
        coldest_temp_c=coldest.surface_temp_c,
        frost_point=finding.air.condensation_point_c <= psychro.TRIPLE_POINT_C,
        threshold_keys=tuple(keys),
    )


# --- ventilation and dehumidification --------------------------------------------------------


def _ventilate(
    finding: RoomFinding, target: Target, target_air: AirState, moisture: MoistureEstimate
) -> Action[Any]:
    """Ventilation sized to hold the target (outdoor air usefully drier than room air at
    the target)."""
    out, air, room = finding.outdoor, finding.air, finding.room
    assert out is not None  # ventilation is only weighed against measured outdoor air
    wt, wo = target_air.humidity_ratio_kg_per_kg, out.humidity_ratio_kg_per_kg
    flows: dict[str, Any] = {}
    extra_keys: tuple[str, ...] = ()
    if moisture.used_g_per_h is not None:
        # The fan moves room air: the volume flow is at the room air's specific volume.
        dry_air, flow = loads.ventilation_airflow(
            moisture.used_g_per_h / 1000.0, wt, wo, air.specific_volume_m3_per_kg
        )
        sized = flow
        minimum = loads.extract_minimum(finding.use, room.volume_m3)
        if minimum is not None:
            flows["sized_airflow_m3_per_h"] = sized
            flows["code_minimum_m3_per_h"] = minimum[0]
            extra_keys = minimum[1]
            if minimum[0] > flow:
                flow = minimum[0]
                dry_air = flow / air.specific_volume_m3_per_kg
        flows.update(
            dry_air_flow_kg_per_h=dry_air,
            airflow_m3_per_h=flow,
            airflow_ft3_per_min=flow / loads.M3_PER_H_PER_CFM,
        )
        if room.volume_m3 is not None:
            flows["air_changes_per_h"] = flow / room.volume_m3
        if air.dry_bulb_c > out.dry_bulb_c:
            flows["heat_to_warm_air_w"] = loads.heat_to_warm_w(
                dry_air, wo, air.dry_bulb_c, out.dry_bulb_c
            )
    numbers = VentilateNumbers(
        target_rh_pct=target.rh_pct,
        target_humidity_ratio_g_per_kg=1000.0 * wt,
        room_humidity_ratio_g_per_kg=air.humidity_ratio_g_per_kg,
        outdoor_humidity_ratio_g_per_kg=out.humidity_ratio_g_per_kg,
        moisture_generation_g_per_h=moisture.used_g_per_h,
        target_reachable_by_ventilation=True,
        outdoor_mode=OutdoorMode.HOLDS_TARGET,
        room_volume_m3=room.volume_m3,
        use=finding.use,
        **flows,
    )
    keys = _keys(
        target.threshold_keys,
        ["ventilation_outdoor_drier_margin_g_per_kg"],
        moisture.threshold_keys,
        extra_keys,
    )
    return Action(ActionKind.VENTILATE, numbers, keys)


def _ventilate_partly(
    finding: RoomFinding, target: Target, target_air: AirState, moisture: MoistureEstimate
) -> Action[Any]:
    """Outdoor air is drier than the room now but not usefully drier than room air at the
    target: ventilate as far as it helps (a dehumidifier does the rest)."""
    out, air, room = finding.outdoor, finding.air, finding.room
    assert out is not None  # ventilation is only weighed against measured outdoor air
    wt, wo = target_air.humidity_ratio_kg_per_kg, out.humidity_ratio_kg_per_kg
    cap = th.value("ventilation_practical_max_ach")
    warmed, _ = loads.rh_at(air, wo)
    flows: dict[str, Any] = {}
    saturates = False
    extra_keys: tuple[str, ...] = ()
    if wo < wt and room.volume_m3 is not None:
        flow = cap * room.volume_m3
        minimum = loads.extract_minimum(finding.use, room.volume_m3)
        if minimum is not None:
            flows["code_minimum_m3_per_h"] = minimum[0]
            extra_keys = minimum[1]
            flow = max(flow, minimum[0])
        dry_air = flow / air.specific_volume_m3_per_kg
        flows.update(
            {
                "airflow_m3_per_h": flow,
                "air_changes_per_h": flow / room.volume_m3,
                "airflow_ft3_per_min": flow / loads.M3_PER_H_PER_CFM,
                "dry_air_flow_kg_per_h": dry_air,
            }
        )
        if moisture.used_g_per_h is not None:
            settles, saturates = loads.rh_at(air, wo + moisture.used_g_per_h / 1000.0 / dry_air)
            flows["rh_at_practical_ventilation_pct"] = settles
    numbers = VentilateNumbers(
        target_rh_pct=target.rh_pct,
        target_humidity_ratio_g_per_kg=1000.0 * wt,
        room_humidity_ratio_g_per_kg=air.humidity_ratio_g_per_kg,
        outdoor_humidity_ratio_g_per_kg=out.humidity_ratio_g_per_kg,
        moisture_generation_g_per_h=moisture.used_g_per_h,
        target_reachable_by_ventilation=False,
        outdoor_mode=(
            OutdoorMode.NO_DRIER_THAN_TARGET if wo >= wt else OutdoorMode.DRIER_NOT_ENOUGH
        ),
        room_volume_m3=room.volume_m3,
        outdoor_air_rh_at_room_temp_pct=warmed,
        saturates=saturates,
        practical_max_ach=cap,
        use=finding.use,
        **flows,
    )
    keys = _keys(
        target.threshold_keys,
        ["ventilation_outdoor_drier_margin_g_per_kg", "ventilation_practical_max_ach"],
        moisture.threshold_keys,
        extra_keys,
    )
    return Action(ActionKind.VENTILATE, numbers, keys)


def _dehumidify(
    finding: RoomFinding,
    target: Target,
    target_air: AirState,
    moisture: MoistureEstimate,
    why: DehumidifyWhy,
    air_changes_per_h: float | None = None,
    extra_keys: tuple[str, ...] = (),
    drying: DryingEquipment | None = None,
    **more: Any,
) -> Action[Any]:
    """Water to take out per day to hold the target, with outdoor air coming in at
    ``air_changes_per_h`` (default: the assumed rate); the one-off pull-down of the room air
    is stated apart, in litres."""
    room, air, out = finding.room, finding.air, finding.outdoor
    wt = target_air.humidity_ratio_kg_per_kg
    keys = [
        *extra_keys,
        "dehumidifier_rating_old_dry_bulb_c",
        "dehumidifier_rating_current_dry_bulb_c",
        "dehumidifier_rating_rh_pct",
        "refrigerant_dehumidifier_min_c",
        "us_pint_l",
        *moisture.threshold_keys,
    ]
    fields: dict[str, Any] = {}
    generation = moisture.used_g_per_h
    outdoor_g_per_h = None
    if out is not None and room.volume_m3 is not None:
        how = "ventilating"
        if air_changes_per_h is None:
            air_changes_per_h = th.value("assumed_air_change_rate_per_h")
            keys.append("assumed_air_change_rate_per_h")
            how = "leaking_in"
        # air changes are room volumes an hour: dry air at the room air's specific volume,
        # the same flow the ventilate action counts
        dry_air = air_changes_per_h * room.volume_m3 / air.specific_volume_m3_per_kg
        outdoor_g_per_h = 1000.0 * dry_air * (out.humidity_ratio_kg_per_kg - wt)
        fields.update(
            outdoor_air_changes_per_h=air_changes_per_h,
            outdoor_air_l_per_day=outdoor_g_per_h * 24.0 / 1000.0 * loads.WATER_L_PER_KG,
            outdoor_gain_g_per_h=outdoor_g_per_h,
            outdoor_air_how=how,
        )
    if room.volume_m3 is not None and air.humidity_ratio_kg_per_kg > wt:
        fields["pull_down_l"] = loads.pull_down_l(room.volume_m3, air, wt)
    logged = None if drying is None else drying.removed_l_per_day
    materials = _materials_load(finding)
    if materials is not None:
        fields.update(
            materials_load_l_per_day=materials[0],
            water_loss_class=materials[1],
            water_loss_class_assumed=materials[2],
        )
        keys += materials[3]
    load: float | None
    if logged is not None and drying is not None:
        load = logged
        fields.update(
            logged_removal_l_per_day=logged,
            water_removed_l=drying.water_removed_l,
            hours_since_previous=drying.hours_since_previous,
        )
    elif generation is None:
        load = None if materials is None else materials[0]
    else:
        load = (
            max(0.0, generation + (outdoor_g_per_h or 0.0)) * 24.0 / 1000.0 * loads.WATER_L_PER_KG
        ) + (0.0 if materials is None else materials[0])
    pint = th.value("us_pint_l")
    numbers = DehumidifyNumbers(
        target_rh_pct=target.rh_pct,
        target_humidity_ratio_g_per_kg=1000.0 * wt,
        room_temp_c=air.dry_bulb_c,
        suggest_desiccant=air.dry_bulb_c < th.value("refrigerant_dehumidifier_min_c"),
        load_l_per_day=load,
        removal_l_per_day=load,
        removal_us_pints_per_day=None if load is None else load / pint,
        why=why,
        generation_g_per_h=generation,
        rated_capacity_l_per_day=None if drying is None else drying.capacity_l_per_day,
        **fields,
        **more,
    )
    return Action(ActionKind.DEHUMIDIFY, numbers, _keys(keys))


def _materials_load(finding: RoomFinding) -> tuple[float, int, bool, tuple[str, ...]] | None:
    """(L/day leaving wet materials, class, assumed, keys) for a room being dried whose
    volume is known, when its class of water loss is given or worked out, or its materials
    read above the dry standard (a class is then assumed); else None."""
    obs = finding.room.observations
    if not obs.drying_in_progress or finding.room.volume_m3 is None:
        return None
    loss_class, assumed, keys = loads.water_loss_class(obs)
    if loss_class is None:
        if not any(m.dry_standard_state is DryStandardState.ABOVE for m in finding.materials):
            return None  # nothing says materials are wet
        loss_class, assumed = int(th.value("water_loss_class_assumed")), True
        keys = ("water_loss_class_assumed",)
    return (
        loads.materials_load_l_per_day(finding.room.volume_m3, loss_class),
        loss_class,
        assumed,
        (*keys, f"drying_chart_class_{loss_class}_ft3_per_pint"),
    )


def _moisture_actions(
    finding: RoomFinding, target: Target, target_air: AirState, moisture: MoistureEstimate
) -> list[Action[Any]]:
    """Ventilate, dehumidify, or both, for a room above its target (see the module notes)."""
    air, out = finding.air, finding.outdoor
    margin_key = "ventilation_outdoor_drier_margin_g_per_kg"
    margin = th.value(margin_key) / 1000.0
    cap = th.value("ventilation_practical_max_ach")
    w_room = air.humidity_ratio_kg_per_kg
    w_target = target_air.humidity_ratio_kg_per_kg
    if out is None:
        return [
            _dehumidify(
                finding,
                target,
                target_air,
                moisture,
                DehumidifyWhy.OUTDOOR_NOT_MEASURED,
                extra_keys=target.threshold_keys,
            )
        ]
    w_out = out.humidity_ratio_kg_per_kg
    coldest = finding.coldest
    if (
        coldest is not None
        and w_out <= w_room - margin
        and out.condensation_point_c > coldest.surface_temp_c
    ):
        # Airing can only bring the room's dew point down to outdoor air's, still above the
        # coldest surface: keep windows closed and dehumidify below it.
        return [
            _dehumidify(
                finding,
                target,
                target_air,
                moisture,
                DehumidifyWhy.OUTDOOR_DEW_POINT_ABOVE_SURFACE,
                extra_keys=(*target.threshold_keys, margin_key),
            )
        ]
    if w_out > w_room - margin:
        why = DehumidifyWhy.OUTDOOR_WETTER if w_out >= w_room else DehumidifyWhy.OUTDOOR_ABOUT_SAME
        return [
            _dehumidify(
                finding,
                target,
                target_air,
                moisture,
                why,
                extra_keys=(*target.threshold_keys, margin_key),
            )
        ]
    if w_out <= w_target - margin:
        ventilate = _ventilate(finding, target, target_air, moisture)
        actions = [ventilate]
        n = ventilate.numbers
        # Over what is practical by the moisture balance itself: the practical rate, or the
        # code-minimum extract where that is higher (it is asked for anyway).
        ach = (
            None
            if n.air_changes_per_h is None
            else (n.sized_airflow_m3_per_h or n.airflow_m3_per_h) / finding.room.volume_m3
        )
        if n.code_minimum_m3_per_h is not None and finding.room.volume_m3 is not None:
            cap = max(cap, n.code_minimum_m3_per_h / finding.room.volume_m3)
        if ach is not None and ach > cap:
            actions.append(
                _dehumidify(
                    finding,
                    target,
                    target_air,
                    moisture,
                    DehumidifyWhy.VENTILATION_OVER_PRACTICAL,
                    air_changes_per_h=cap,
                    extra_keys=("ventilation_practical_max_ach",),
                    ventilation_air_changes_needed_per_h=ach,
                    practical_max_ach=cap,
                )
            )
        return actions
    ventilate = _ventilate_partly(finding, target, target_air, moisture)
    dehumidify_ach = ventilate.numbers.air_changes_per_h
    return [
        ventilate,
        _dehumidify(
            finding,
            target,
            target_air,
            moisture,
            DehumidifyWhy.VENTILATION_CANNOT_HOLD,
            air_changes_per_h=dehumidify_ach,
            extra_keys=("ventilation_practical_max_ach",),
        ),
    ]


def _grain_depression(finding: RoomFinding, drying: DryingEquipment) -> dict[str, float]:
    """The humidity-ratio drop across the dehumidifier (inlet: room air), g/kg and gr/lb."""
    if drying.outlet_temp_c is None or drying.outlet_rh_pct is None:
        return {}
    air = finding.air
    outlet = air_state(drying.outlet_temp_c, drying.outlet_rh_pct, air.pressure_pa)
    drop = air.humidity_ratio_kg_per_kg - outlet.humidity_ratio_kg_per_kg
    return {
        "grain_depression_g_per_kg": 1000.0 * drop,
        "grain_depression_gr_per_lb": loads.gr_per_lb(drop),
        "outlet_humidity_ratio_g_per_kg": outlet.humidity_ratio_g_per_kg,
    }


def _drying_actions(
    finding: RoomFinding,
    drying: DryingEquipment,
    target: Target,
    target_air: AirState,
    moisture: MoistureEstimate,
) -> list[Action[Any]]:
    """A room being dried: keep the drying area closed and dehumidify, never ventilate."""
    if drying.dehumidifiers == 0:
        why = DehumidifyWhy.DRYING_AIR_MOVERS_ONLY
    elif finding.air.rh_pct > target.rh_pct:
        why = DehumidifyWhy.DRYING_ABOVE_TARGET
    else:
        why = DehumidifyWhy.DRYING_WITHIN_TARGET
    return [
        _dehumidify(
            finding,
            target,
            target_air,
            moisture,
            why,
            extra_keys=target.threshold_keys,
            drying=drying,
            drying_in_progress=True,
            air_movers_without_dehumidifier=drying.dehumidifiers == 0,
            **_grain_depression(finding, drying),
        )
    ]


def _ventilated_space(finding: RoomFinding) -> Action[Any]:
    """A loft or crawl space that follows outdoor air: cut the moisture coming in, check
    its ventilation, measure the timber; a dehumidifier only if the space is sealed."""
    timber = []
    for surface in finding.surfaces:
        if not th.is_timber(surface.label):
            continue
        if surface.mould not in (
            MouldState.ABOVE,
            MouldState.CANNOT_TELL,
            MouldState.APPROACHING,
        ) and surface.surface_rh_pct < th.value("surface_rh_mould_limit_pct"):
            continue
        rh_s = min(100.0, surface.surface_rh_pct)
        emc = loads.timber_emc(surface.surface_temp_c, rh_s)  # None outside the equation
        timber.append(
            TimberSurface(
                surface=surface.label,
                surface_temp_c=surface.surface_temp_c,
                surface_rh_pct=rh_s,
                emc_pct=emc,
            )
        )
    weather: dict[str, Any] = {}
    out, air = finding.outdoor, finding.air
    if out is not None:
        wetter = out.humidity_ratio_kg_per_kg > air.humidity_ratio_kg_per_kg
        coldest = min((s.surface_temp_c for s in finding.surfaces), default=None)
        above = coldest is not None and out.condensation_point_c > coldest
        weather = {
            "outdoor_wetter_than_space": wetter,
            "outdoor_dew_point_above_coldest_surface": above if coldest is not None else None,
            "keep_vents_closed": wetter or above,
            "outdoor_dew_point_c": out.condensation_point_c,
            "coldest_surface_temp_c": coldest,
        }
    numbers = VentilatedSpaceNumbers(
        room_rh_pct=finding.air.rh_pct,
        dehumidify_only_if_sealed=True,
        loft=finding.use == "loft",
        timber_surfaces=tuple(timber) or None,
        **weather,
    )
    return Action(
        ActionKind.DRY_VENTILATED_SPACE,
        numbers,
        ("timber_decay_mc_pct", "timber_decay_slow_below_c"),
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
    factor_under = surface.temperature_factor_state is FactorState.UNDER
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


# --- sources, drying and repeat readings ----------------------------------------------------------


def _material_points(wet: Iterable[MaterialFinding]) -> tuple[MaterialPoint, ...]:
    tolerance = th.value("dry_standard_tolerance_fraction")
    return tuple(
        MaterialPoint(
            label=m.label,
            material=m.material,
            scale=m.scale,
            value=m.value,
            dry_standard=m.dry_standard,
            dry_at_or_below=m.dry_standard * (1.0 + tolerance),
        )
        for m in wet
        if m.dry_standard is not None
    )


def _class_high(finding: RoomFinding) -> tuple[bool, bool]:
    """(the whole humidity-class band is high, the band only reaches into high)."""
    if finding.humidity_class is None:
        return False, False
    high = int(th.value("humidity_class_high")) + (1 if th.room_use(finding.use).wet_room else 0)
    possible: tuple[int, ...] = finding.humidity_class_possible or (
        () if finding.humidity_class is None else (finding.humidity_class,)
    )
    if max(possible) < high:
        return False, False
    return min(possible) >= high, min(possible) < high


def _sources(
    finding: RoomFinding, occupants_explain: bool
) -> tuple[Action[Any] | None, Action[Any] | None, Action[Any] | None]:
    """(find the source, keep drying, repeat the readings): what the materials, observations
    and humidity class call for."""
    obs = finding.room.observations
    drying = obs.drying_in_progress
    reasons: list[SourceReason] = []
    later: list[SourceReason] = []
    keys: list[str] = []
    drying_keys: list[str] = []
    wet = [m for m in finding.materials if m.dry_standard_state is DryStandardState.ABOVE]
    damp = [m for m in finding.materials if m.wetter_than_air_explains]
    decaying = [m for m in finding.materials if m.timber_state is TimberState.DECAY_RANGE]
    damp_points = tuple(
        TimberPoint(label=m.label, value_pct=m.value, emc_pct=m.emc_pct) for m in damp
    )
    decay_points = tuple(TimberPoint(label=m.label, value_pct=m.value) for m in decaying)
    slowed = any(m.decay_slowed_by_temperature for m in decaying)
    if wet and not drying:
        keys.append("dry_standard_tolerance_fraction")
        reasons.append(SourceReason.WET_MATERIALS)
    if damp and not drying:
        keys += ["timber_mould_mc_pct", "timber_decay_mc_pct"]
        reasons.append(SourceReason.DAMP_TIMBER)
    if decaying:
        if drying:
            drying_keys.append("timber_decay_mc_pct")
        else:
            keys.append("timber_decay_mc_pct")
            reasons.append(SourceReason.TIMBER_DECAY)
    if (obs.standing_water or obs.water_category is not None) and not drying:
        reasons.append(SourceReason.WATER_PRESENT)
    surfaces = finding.surfaces
    if obs.condensation_seen and not any(
        s.condensation is not CondensationState.CLEAR for s in surfaces
    ):
        reasons.append(
            SourceReason.CONDENSATION_SEEN_SURFACES_CLEAR
            if surfaces
            else SourceReason.CONDENSATION_SEEN_NOT_MEASURED
        )
    judged = [s for s in surfaces if s.mould is not MouldState.NOT_JUDGED]
    if obs.mould_seen and not any(s.mould is not MouldState.BELOW for s in judged):
        reasons.append(
            SourceReason.MOULD_SEEN_SURFACES_BELOW
            if judged
            else SourceReason.MOULD_SEEN_NOT_MEASURED
        )
    first = bool(reasons)
    if obs.odour:
        later.append(SourceReason.MUSTY_SMELL)
    # While a room is being dried its air is humid from the drying itself: the humidity
    # class says nothing about a hidden source then.
    possible: tuple[int, ...] = finding.humidity_class_possible or (
        () if finding.humidity_class is None else (finding.humidity_class,)
    )
    high, maybe = (False, False) if drying or occupants_explain else _class_high(finding)
    wet_room_peak = th.room_use(finding.use).wet_room and (high or maybe)
    if wet_room_peak:
        high = maybe = False  # a shower or cooking peak: extract and re-read after use
    class_keys = ["humidity_class_high", *th.HUMIDITY_CLASS_KEYS, "coverage_factor"]
    if high:
        keys += class_keys
        later.append(SourceReason.HIGH_HUMIDITY_CLASS)

    find_source = None
    if reasons or later:
        numbers = FindSourceNumbers(
            reasons=(*reasons, *later),
            first=first,
            wet=_material_points(wet),
            damp_timber=damp_points,
            decaying=decay_points,
            decay_slowed=slowed,
            water_category=obs.water_category,
            use=finding.use,
            materials_above_dry_standard=len(wet) if wet and not drying else None,
            vapour_pressure_excess_pa=finding.vapour_pressure_excess_pa if high else None,
            humidity_class=finding.humidity_class if high else None,
            humidity_class_possible=possible if high else None,
        )
        find_source = Action(ActionKind.FIND_SOURCE, numbers, _keys(keys))

    keep_drying = None
    if drying and (wet or decaying or damp):
        if damp:
            drying_keys.append("timber_mould_mc_pct")
        drying_numbers = KeepDryingNumbers(
            materials_above_dry_standard=len(wet),
            materials=_material_points(wet),
            damp_timber=damp_points,
            decaying=decay_points,
            decay_slowed=slowed,
        )
        keep_drying = Action(
            ActionKind.KEEP_DRYING,
            drying_numbers,
            _keys(["dry_standard_tolerance_fraction"], drying_keys),
        )

    repeat = None
    if wet_room_peak:
        repeat_numbers = RepeatReadingsNumbers(
            vapour_pressure_excess_pa=finding.vapour_pressure_excess_pa,
            humidity_class=finding.humidity_class,
            wet_room_peak=True,
            use=finding.use,
            reread_after_use_minutes=(
                th.value("wet_room_reread_after_use_from_minutes"),
                th.value("wet_room_reread_after_use_to_minutes"),
            ),
        )
        repeat = Action(
            ActionKind.REPEAT_READINGS,
            repeat_numbers,
            _keys(
                ["wet_room_reread_after_use_from_minutes", "wet_room_reread_after_use_to_minutes"],
                th.HUMIDITY_CLASS_KEYS,
            ),
        )
    elif maybe:
        repeat_numbers = RepeatReadingsNumbers(
            vapour_pressure_excess_pa=finding.vapour_pressure_excess_pa,
            humidity_class=finding.humidity_class,
            wet_room_peak=False,
            use=finding.use,
            vapour_pressure_excess_uncertainty_pa=finding.vapour_pressure_excess_uncertainty_pa,
            humidity_class_possible=tuple(possible),
        )
        repeat = Action(ActionKind.REPEAT_READINGS, repeat_numbers, _keys(class_keys))
    return (find_source if find_source is not None else None), keep_drying, repeat


# --- contaminated water ------------------------------------------------------------------------


def effective_water_category(obs: Observations) -> tuple[int | None, bool]:
    """(the water category to act on, whether standing water raised it): category 1 left
    standing degrades to 2, and 2 to 3 (restoration standard of practice; the times are
    threshold records)."""
    category = obs.water_category
    hours = obs.water_standing_h
    if category is None or hours is None:
        return category, False
    if category == 1 and hours >= th.value("water_category_1_degrades_h"):
        category = 2
        if hours >= th.value("water_category_1_degrades_h") + th.value(
            "water_category_2_degrades_h"
        ):
            category = 3
    elif category == 2 and hours >= th.value("water_category_2_degrades_h"):
        category = 3
    return category, category != obs.water_category


def _contaminated(finding: RoomFinding) -> Action[Any] | None:
    """Category 3 water (or water that has stood long enough to become it): remove the
    porous materials it reached before any drying, contain, no air movement."""
    obs = finding.room.observations
    category, degraded = effective_water_category(obs)
    if category != 3:
        return None
    drying = obs.drying
    numbers = RemoveContaminatedNumbers(
        water_category=obs.water_category or category,
        effective_category=category,
        degraded=degraded,
        water_standing_h=obs.water_standing_h,
        porous_materials=tuple(
            dict.fromkeys(m.label for m in finding.materials if th.is_porous(m.material))
        ),
        stop_air_movers=bool(drying is not None and drying.air_movers),
    )
    keys = ["water_category_3"]
    if degraded:
        keys += ["water_category_1_degrades_h", "water_category_2_degrades_h"]
    return Action(ActionKind.REMOVE_CONTAMINATED_MATERIALS, numbers, tuple(keys))


def _after_removal(action: Action[Any]) -> Action[Any]:
    """A drying action where contaminated material is removed first: for what remains."""
    if action.kind is not ActionKind.DEHUMIDIFY:
        return action
    return Action(
        action.kind,
        msgspec.structs.replace(action.numbers, after_removal=True),
        action.threshold_keys,
    )


# --- the advice --------------------------------------------------------------------------------


def advise_room(
    finding: RoomFinding, target_rh_pct: float | None = None, year_built: int | None = None
) -> RoomAdvice:
    """Ordered actions and cautions for one room.

    Order: find the source first when liquid water is suspected and no drying is under way;
    keep drying while it is; then ventilate or dehumidify (whichever can do the job comes
    first); then raise the temperature of walls, ceilings and floors (coldest first); then
    windows and pipes; a source suggested only by the humidity class or a smell comes
    after, and a humidity class the instruments cannot settle last.
    """
    air = finding.air
    target = room_target(finding, target_rh_pct)
    design = th.value("room_rh_target_default_pct") if target_rh_pct is None else target_rh_pct
    target_air = air_state(air.dry_bulb_c, target.rh_pct, air.pressure_pa)
    moisture = loads.moisture_generation(finding)
    actions: list[Action[Any]] = []

    share = loads.occupants_share(moisture)
    # In a bathroom or kitchen a high class is first read as a use peak.
    occupants_explain = (
        share is not None
        and share >= th.value("occupants_explain_fraction")
        and not th.room_use(finding.use).wet_room
        and finding.humidity_class is not None
        and max(finding.humidity_class_possible or (finding.humidity_class,))
        >= int(th.value("humidity_class_high"))
    )
    find_source, keep_drying, repeat = _sources(finding, occupants_explain)
    removal = _contaminated(finding)
    if removal is not None:
        actions.append(removal)
    if find_source is not None and find_source.numbers.first:
        actions.append(find_source)
    if keep_drying is not None:
        actions.append(keep_drying)

    drying = _drying(finding)
    ventilated_space = th.room_use(finding.use).ventilated_space and drying is None
    if ventilated_space:
        if air.rh_pct > target.rh_pct or any(
            s.mould in (MouldState.ABOVE, MouldState.CANNOT_TELL) for s in finding.surfaces
        ):
            actions.append(_ventilated_space(finding))
    elif drying is not None:
        actions += _drying_actions(finding, drying, target, target_air, moisture)
    elif air.rh_pct > target.rh_pct:
        moisture_actions = _moisture_actions(finding, target, target_air, moisture)
        if target.at_practical_floor:
            # No practical room RH keeps the coldest surface under the mould limit: a
            # dehumidifier cannot cure it; the surface must be made warmer (led with below).
            moisture_actions = [a for a in moisture_actions if a.kind is not ActionKind.DEHUMIDIFY]
        actions += moisture_actions
    if removal is not None:
        actions = [_after_removal(a) for a in actions]

    by_temperature = sorted(finding.surfaces, key=lambda s: s.surface_temp_c)
    lead = len(actions) - sum(
        1 for a in actions if a.kind in (ActionKind.VENTILATE, ActionKind.DEHUMIDIFY)
    )
    for surface in by_temperature:
        if surface.policy.sets_room_target and not ventilated_space:
            action = _raise_surface(finding, surface, design)
            if action is None:
                continue
            if action.numbers.dehumidifier_cannot_cure and target.at_practical_floor:
                actions.insert(lead, action)  # the cure that can work leads
                lead += 1
            else:
                actions.append(action)
    for surface in by_temperature:
        role = surface.policy.role
        action = (
            _glazing(finding, surface, target.rh_pct, target_air)
            if role == "glazing"
            else _pipe(finding, surface, target.rh_pct, target_air)
            if role == "pipe"
            else None
        )
        if action is not None:
            actions.append(action)

    if occupants_explain:
        for i, a in enumerate(actions):
            if a.kind in (ActionKind.VENTILATE, ActionKind.DEHUMIDIFY):
                actions[i] = Action(
                    a.kind,
                    msgspec.structs.replace(a.numbers, occupants_share_of_load=share),
                    (*a.threshold_keys, "occupants_explain_fraction"),
                )
                break
    if find_source is not None and not find_source.numbers.first:
        actions.append(find_source)
    if repeat is not None:
        actions.append(repeat)

    actions_t = tuple(actions)
    return RoomAdvice(
        room=finding.name,
        target=target,
        moisture=moisture,
        actions=actions_t,
        cautions=cautions_for(finding, actions_t, year_built),
    )


def advise_site(site: SiteFinding, target_rh_pct: float | None = None) -> SiteAdvice:
    """Advice for every room; the site's cautions are every room's, once, closing last."""
    from survey.advise.cautions import CLOSING, site_cautions

    rooms = tuple(advise_room(r, target_rh_pct, site.year_built) for r in site.rooms)
    return SiteAdvice(rooms=rooms, cautions=(*site_cautions(rooms), CLOSING))
