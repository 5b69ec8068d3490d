"""Safety cautions keyed to the findings and the advice: which apply, never their words.

Each :class:`~survey.advise.kinds.Caution` has a key (``visible_mould``, ``water_category_3``,
``electrics_near_water``, ``confined_space``, ``combustion_heaters``, ``asbestos_lead``,
``closing`` …) and the numbers its words need; :mod:`survey.words` writes them. The closing
deferral to local codes and licensed professionals ends every list.
"""

from __future__ import annotations

from typing import Any

from survey import thresholds as th
from survey.advise.kinds import Action, ActionKind, Caution, DehumidifyWhy, RoomAdvice
from survey.assess import MouldState, RoomFinding

CLOSING = Caution("closing")
_MOULD_AREA_KEYS = ("mould_area_small_m2", "mould_area_large_m2")


def cautions_for(
    finding: RoomFinding, actions: tuple[Action[Any], ...], year_built: int | None
) -> tuple[Caution, ...]:
    """The cautions for one room, in a fixed order, closing last."""
    obs = finding.room.observations
    kinds = {a.kind for a in actions}
    out: list[Caution] = []
    area = obs.visible_mould_area_m2
    if obs.mould_seen:
        out.append(Caution("visible_mould", _MOULD_AREA_KEYS, area_m2=area))
    elif any(surface.mould is MouldState.ABOVE for surface in finding.surfaces):
        out.append(Caution("mould_if_visible", _MOULD_AREA_KEYS))
    from survey.advise.sources import effective_water_category

    category, _ = effective_water_category(obs)
    if category == 3:
        out.append(Caution("water_category_3", ("water_category_3",)))
    elif category == 2:
        out.append(Caution("water_category_2", ("water_category_2",)))
    elif category == 1:
        out.append(Caution("water_category_1", ("water_category_1_degrades_h", "water_category_2")))
    if (
        obs.electrics_near_water
        or obs.standing_water
        or category is not None
        or kinds & {ActionKind.DEHUMIDIFY, ActionKind.KEEP_DRYING}
    ):
        out.append(Caution("electrics_near_water"))
    if th.room_use(finding.use).confined:
        out.append(Caution("confined_space", use=finding.use))
    drying = (
        bool(
            kinds
            & {ActionKind.DEHUMIDIFY, ActionKind.RAISE_SURFACE_TEMPERATURE, ActionKind.KEEP_DRYING}
        )
        or category is not None
        or obs.standing_water
        or obs.drying_in_progress
    )
    if drying:
        out.append(Caution("combustion_heaters", ("propane_water_kg_per_kg",)))
    disturbing = (
        bool(
            kinds
            & {
                ActionKind.RAISE_SURFACE_TEMPERATURE,
                ActionKind.FIND_SOURCE,
                ActionKind.INSULATE_PIPE,
                ActionKind.REDUCE_GLAZING_CONDENSATION,
            }
        )
        or area > th.value("mould_area_small_m2")
        or (obs.mould_seen and area <= 0.0)
        or category in (2, 3)
    )
    if disturbing:
        risks = []
        if year_built is None or year_built < th.value("asbestos_possible_before_year"):
            risks.append("asbestos")
        if year_built is None or year_built < th.value("lead_paint_possible_before_year"):
            risks.append("lead_paint")
        if risks:
            out.append(
                Caution(
                    "asbestos_lead",
                    ("asbestos_possible_before_year", "lead_paint_possible_before_year"),
                    year_built=year_built,
                    risks=tuple(risks),
                )
            )
    if obs.flued_appliance is not False and (_closes_up(actions) or _extracts(actions)):
        out.append(Caution("combustion_air", flued=obs.flued_appliance))
    out.append(CLOSING)
    return tuple(out)


_CLOSING_WHY = frozenset(
    {
        DehumidifyWhy.OUTDOOR_WETTER,
        DehumidifyWhy.OUTDOOR_ABOUT_SAME,
        DehumidifyWhy.OUTDOOR_DEW_POINT_ABOVE_SURFACE,
        DehumidifyWhy.DRYING_AIR_MOVERS_ONLY,
        DehumidifyWhy.DRYING_ABOVE_TARGET,
        DehumidifyWhy.DRYING_WITHIN_TARGET,
    }
)


def _closes_up(actions: tuple[Action[Any], ...]) -> bool:
    """Whether the advice closes a space up: windows and vents shut while dehumidifying or
    drying, a ventilated space sealed, contaminated water contained."""
    for a in actions:
        if a.kind is ActionKind.DEHUMIDIFY and a.numbers.why in _CLOSING_WHY:
            return True
        if a.kind in (ActionKind.DRY_VENTILATED_SPACE, ActionKind.REMOVE_CONTAMINATED_MATERIALS):
            return True
    return False


def _extracts(actions: tuple[Action[Any], ...]) -> bool:
    """Whether the advice adds extract ventilation (a fan pulling air out of the room)."""
    return any(
        a.kind in (ActionKind.VENTILATE, ActionKind.EXTRACT_AT_SOURCE)
        or (a.kind is ActionKind.REPEAT_READINGS and a.numbers.wet_room_peak)
        for a in actions
    )


def site_cautions(rooms: tuple[RoomAdvice, ...]) -> tuple[Caution, ...]:
    """Every room's cautions, each once (the closing one left for the caller)."""
    seen: dict[Caution, None] = {}
    for advice in rooms:
        for caution in advice.cautions:
            if caution.key != "closing":
                seen.setdefault(caution, None)
    return tuple(seen)
