"""The decision rules: what to do about a room, in order, with numbers.

The rules live in :mod:`survey.advise.air` (target, ventilation, dehumidification, drying,
ventilated spaces), :mod:`survey.advise.surfaces` (cold walls, panes, pipes) and
:mod:`survey.advise.sources` (sources, drying to the dry standard, repeat readings,
contaminated water); this module puts them in order.
"""

from __future__ import annotations

from typing import Any

import msgspec

from survey import thresholds as th
from survey.advise import loads
from survey.advise.air import (
    TARGET_RH_MAX_PCT,
    TARGET_RH_MIN_PCT,
    _drying_actions,
    _moisture_actions,
    _ventilated_space,
    room_target,
)
from survey.advise.cautions import cautions_for
from survey.advise.common import _drying, rh_limit_shown
from survey.advise.kinds import (
    Action,
    ActionKind,
    RoomAdvice,
    SiteAdvice,
)
from survey.advise.sources import _after_removal, _contaminated, _sources, effective_water_category
from survey.advise.surfaces import _glazing, _pipe, _raise_surface
from survey.assess import (
    MouldState,
    RoomFinding,
    SiteFinding,
    air_state,
)

__all__ = [
    "TARGET_RH_MAX_PCT",
    "TARGET_RH_MIN_PCT",
    "advise_room",
    "advise_site",
    "effective_water_category",
    "rh_limit_shown",
    "room_target",
]


# --- the advice --------------------------------------------------------------------------------


#: The actions on the room's air, which the cure of a cold surface may lead.
_AIR_KINDS = frozenset((ActionKind.VENTILATE, ActionKind.DEHUMIDIFY, ActionKind.EXTRACT_AT_SOURCE))


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
    lead = len(actions) - sum(1 for a in actions if a.kind in _AIR_KINDS)
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
