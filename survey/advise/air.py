"""The room's air: the target RH, ventilation, dehumidification, drying, ventilated spaces.

When ventilation helps
----------------------
Outdoor air dries a room when it holds less water than the room air *now*, by the margin
``ventilation_outdoor_drier_margin_g_per_kg``. It can *hold* the target only when it is that
much drier than room air at the target, and only within the practical air change rate (or the
code-minimum extract where that is higher); when it cannot, ventilation is still advised as
far as it helps, and a dehumidifier (and, where a surface needs it, a warmer surface) does the
rest. Windows are kept closed while outdoor air is drier than the room air in one case only:
when its dew point is above the coldest wall, ceiling or floor, since airing can bring the
room's dew point down only to outdoor air's and that surface would stay wet.

A room being dried (drying equipment running) is kept closed and dehumidified, never
ventilated; a ventilated loft or crawl space follows outdoor air, so the moisture reaching it
is cut instead, and its vents stay closed while outdoor air is wetter than the space or its
dew point is above the space's coldest surface.
"""

from __future__ import annotations

from typing import Any

from survey import psychro
from survey import thresholds as th
from survey.advise import loads
from survey.advise.common import _drying, _keys, rh_limit_shown
from survey.advise.kinds import (
    Action,
    ActionKind,
    DehumidifyNumbers,
    DehumidifyWhy,
    ExtractNumbers,
    MoistureEstimate,
    OutdoorMode,
    Target,
    TargetWhy,
    TimberSurface,
    VentilatedSpaceNumbers,
    VentilateNumbers,
)
from survey.assess import (
    AirState,
    DryingEquipment,
    DryStandardState,
    MouldState,
    RoomFinding,
    air_state,
)
from survey.errors import InputError

TARGET_RH_MIN_PCT = 25.0
TARGET_RH_MAX_PCT = 80.0


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


def _humidity_fields(
    target: Target, wt: float, air: AirState, out: AirState, moisture: MoistureEstimate
) -> dict[str, Any]:
    """The humidity ratios and load every ventilate action states."""
    return {
        "target_rh_pct": target.rh_pct,
        "target_humidity_ratio_g_per_kg": 1000.0 * wt,
        "room_humidity_ratio_g_per_kg": air.humidity_ratio_g_per_kg,
        "outdoor_humidity_ratio_g_per_kg": out.humidity_ratio_g_per_kg,
        "moisture_generation_g_per_h": moisture.used_g_per_h,
    }


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
        **_humidity_fields(target, wt, air, out, moisture),
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
        **_humidity_fields(target, wt, air, out, moisture),
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
        )
        # In a room being dried the measured excess already is the water leaving the
        # materials; the drying chart's figure is the capacity a class of loss calls for.
        # The larger of the two is the least to remove, never their sum.
        if materials is not None:
            load = max(load, materials[0])
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


def _extract_at_source(finding: RoomFinding, mode: OutdoorMode) -> Action[Any] | None:
    """For a wet room whose outdoor air is no help to general ventilation now: extract while
    the room is in use, when the air leaving is far wetter than outdoor air; None for a
    room with no extract minimum."""
    in_use = loads.extract_while_in_use(finding.use)
    continuous = loads.extract_minimum(finding.use, finding.room.volume_m3)
    if in_use is None or continuous is None:
        return None
    out = finding.outdoor
    numbers = ExtractNumbers(
        use=finding.use,
        outdoor_mode=mode,
        room_humidity_ratio_g_per_kg=finding.air.humidity_ratio_g_per_kg,
        outdoor_humidity_ratio_g_per_kg=None if out is None else out.humidity_ratio_g_per_kg,
        intermittent_m3_per_h=in_use[0],
        intermittent_ft3_per_min=in_use[0] / loads.M3_PER_H_PER_CFM,
        code_minimum_m3_per_h=continuous[0],
    )
    return Action(ActionKind.EXTRACT_AT_SOURCE, numbers, _keys(in_use[1], continuous[1]))


def _dehumidify_closed(
    finding: RoomFinding,
    target: Target,
    target_air: AirState,
    moisture: MoistureEstimate,
    why: DehumidifyWhy,
    mode: OutdoorMode,
    keys: tuple[str, ...],
) -> list[Action[Any]]:
    """Outdoor air is no help now: dehumidify with the room closed, and in a wet room
    extract at the source while it is in use."""
    actions = [_dehumidify(finding, target, target_air, moisture, why, extra_keys=keys)]
    extract = _extract_at_source(finding, mode)
    return actions if extract is None else [*actions, extract]


def _moisture_actions(
    finding: RoomFinding, target: Target, target_air: AirState, moisture: MoistureEstimate
) -> list[Action[Any]]:
    """Ventilate, dehumidify, or both, for a room above its target (see the module notes).
    Where outdoor air is no help now, a wet room still extracts at the source."""
    air, out = finding.air, finding.outdoor
    margin_key = "ventilation_outdoor_drier_margin_g_per_kg"
    margin = th.value(margin_key) / 1000.0
    cap = th.value("ventilation_practical_max_ach")
    w_room = air.humidity_ratio_kg_per_kg
    w_target = target_air.humidity_ratio_kg_per_kg
    if out is None:
        return _dehumidify_closed(
            finding,
            target,
            target_air,
            moisture,
            DehumidifyWhy.OUTDOOR_NOT_MEASURED,
            OutdoorMode.NOT_MEASURED,
            target.threshold_keys,
        )
    w_out = out.humidity_ratio_kg_per_kg
    coldest = finding.coldest
    if (
        coldest is not None
        and w_out <= w_room - margin
        and out.condensation_point_c > coldest.surface_temp_c
    ):
        # Airing can only bring the room's dew point down to outdoor air's, still above the
        # coldest surface: keep windows closed and dehumidify below it.
        return _dehumidify_closed(
            finding,
            target,
            target_air,
            moisture,
            DehumidifyWhy.OUTDOOR_DEW_POINT_ABOVE_SURFACE,
            OutdoorMode.HOLDS_TARGET,
            (*target.threshold_keys, margin_key),
        )
    if w_out > w_room - margin:
        wetter = w_out >= w_room
        why = DehumidifyWhy.OUTDOOR_WETTER if wetter else DehumidifyWhy.OUTDOOR_ABOUT_SAME
        return _dehumidify_closed(
            finding,
            target,
            target_air,
            moisture,
            why,
            OutdoorMode.WETTER if wetter else OutdoorMode.ABOUT_SAME,
            (*target.threshold_keys, margin_key),
        )
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
        # the structure's surfaces, not glass or pipes (judged apart)
        coldest = min(
            (s.surface_temp_c for s in finding.surfaces if s.policy.sets_room_target),
            default=None,
        )
        above = coldest is not None and out.condensation_point_c > coldest
        drier = out.humidity_ratio_kg_per_kg < air.humidity_ratio_kg_per_kg
        weather = {
            "outdoor_wetter_than_space": wetter,
            "outdoor_dew_point_above_coldest_surface": above if coldest is not None else None,
            # Outdoor air clearly drier than the space still dries it, even where a cold
            # surface sits below its dew point: the vents stay open then.
            "keep_vents_closed": wetter or (above and not drier),
            "outdoor_dew_point_c": out.condensation_point_c,
            "coldest_surface_temp_c": coldest,
        }
    numbers = VentilatedSpaceNumbers(
        room_rh_pct=finding.air.rh_pct,
        dehumidify_only_if_sealed=True,
        loft=finding.use == "loft",
        room_temp_c=finding.air.dry_bulb_c,
        timber_surfaces=tuple(timber) or None,
        **weather,
    )
    return Action(
        ActionKind.DRY_VENTILATED_SPACE,
        numbers,
        ("timber_decay_mc_pct", "timber_decay_slow_below_c"),
    )
