"""Actions, their targets and moisture loads as sentences for the inspector's client.

Every function takes the typed result (:mod:`survey.advise`), the finding it came from where
the sentence quotes a reading, and a :class:`~survey.words.display.Display`.
"""

from __future__ import annotations

from typing import Any

from survey.advise.kinds import (
    Action,
    ActionKind,
    RoomAdvice,
)
from survey.assess import RoomFinding
from survey.words.air import (
    _dehumidify,
    _extract,
    _occupants_note,
    _ventilate,
)
from survey.words.basis import moisture_basis, moisture_missing, target_basis
from survey.words.display import Display
from survey.words.sources import _find_source, _keep_drying, _remove_contaminated, _repeat
from survey.words.surfaces import _glazing, _pipe, _raise_surface
from survey.words.ventilated import _ventilated_space

__all__ = [
    "TITLES",
    "action_numbers",
    "action_reason",
    "action_title",
    "moisture_basis",
    "moisture_missing",
    "target_basis",
]


TITLES = {
    ActionKind.VENTILATE: "Ventilate",
    ActionKind.EXTRACT_AT_SOURCE: "Extract the moisture where it is made",
    ActionKind.DEHUMIDIFY: "Dehumidify",
    ActionKind.RAISE_SURFACE_TEMPERATURE: "Raise the surface temperature",
    ActionKind.FIND_SOURCE: "Find the moisture source",
    ActionKind.KEEP_DRYING: "Keep drying to the dry standard",
    ActionKind.REDUCE_GLAZING_CONDENSATION: "Deal with condensation on the window",
    ActionKind.INSULATE_PIPE: "Insulate the cold pipe",
    ActionKind.REPEAT_READINGS: "Repeat the readings",
    ActionKind.DRY_VENTILATED_SPACE: "Cut the moisture reaching the space",
    ActionKind.REMOVE_CONTAMINATED_MATERIALS: "Remove contaminated materials before drying",
}


def action_title(action: Action[Any]) -> str:
    """The kind's title; an action about one surface names it (two surfaces, two titles)."""
    base = TITLES[action.kind]
    return f"{base}: {action.surface}" if action.surface else base


def action_reason(action: Action[Any], finding: RoomFinding, advice: RoomAdvice, d: Display) -> str:
    """Why and how, in sentences, with the action's numbers in ``d``'s units."""
    n = action.numbers
    kind = action.kind
    if kind is ActionKind.VENTILATE:
        return _ventilate(n, finding, advice, d) + _occupants_note(n, advice, d)
    if kind is ActionKind.DEHUMIDIFY:
        return _dehumidify(n, finding, advice, d) + _occupants_note(n, advice, d)
    if kind is ActionKind.RAISE_SURFACE_TEMPERATURE:
        return _raise_surface(n, d)
    if kind is ActionKind.REDUCE_GLAZING_CONDENSATION:
        return _glazing(n, d)
    if kind is ActionKind.INSULATE_PIPE:
        return _pipe(n, d)
    if kind is ActionKind.FIND_SOURCE:
        return _find_source(n, d)
    if kind is ActionKind.KEEP_DRYING:
        return _keep_drying(n)
    if kind is ActionKind.REMOVE_CONTAMINATED_MATERIALS:
        return _remove_contaminated(n, d)
    if kind is ActionKind.REPEAT_READINGS:
        return _repeat(n, d)
    if kind is ActionKind.EXTRACT_AT_SOURCE:
        return _extract(n, d)
    return _ventilated_space(n, d)


def action_numbers(action: Action[Any], d: Display) -> str:
    """The action's headline number, for a summary line ('' when it has none)."""
    n = action.numbers
    kind = action.kind
    if (
        kind is ActionKind.VENTILATE
        and n.airflow_m3_per_h is not None
        and n.airflow_m3_per_h >= 0.5
    ):
        text = f"at least {d.at_least('airflow', n.airflow_m3_per_h)}"
        if n.air_changes_per_h is not None:
            text += f" ({n.air_changes_per_h:.1f} air changes an hour)"
        return text
    if kind is ActionKind.EXTRACT_AT_SOURCE:
        return f"at least {d.at_least('airflow', n.intermittent_m3_per_h)} while in use"
    if kind is ActionKind.DEHUMIDIFY and n.removal_l_per_day:
        return f"at least {d.at_least('water_rate', n.removal_l_per_day)}"
    if kind is ActionKind.RAISE_SURFACE_TEMPERATURE:
        return f"to at least {d.minimum_temperature(n.target_surface_temp_c)}"
    if kind is ActionKind.KEEP_DRYING:
        count = n.materials_above_dry_standard
        return f"{count} reading{'s' if count != 1 else ''} above the dry standard"
    return ""
