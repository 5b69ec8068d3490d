"""Moisture sources, drying to the dry standard, repeat readings, contaminated water."""

from __future__ import annotations

from collections.abc import Iterable
from typing import Any

import msgspec

from survey import thresholds as th
from survey.advise.common import _keys
from survey.advise.kinds import (
    Action,
    ActionKind,
    FindSourceNumbers,
    KeepDryingNumbers,
    MaterialPoint,
    RemoveContaminatedNumbers,
    RepeatReadingsNumbers,
    SourceReason,
    TimberPoint,
)
from survey.assess import (
    CondensationState,
    DryStandardState,
    MaterialFinding,
    MouldState,
    Observations,
    RoomFinding,
    TimberState,
)

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
            dry_standard_visit=m.dry_standard_visit,
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
