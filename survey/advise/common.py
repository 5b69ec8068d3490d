"""Small helpers the advice rules share."""

from __future__ import annotations

import math
from collections.abc import Iterable

from survey.assess import (
    DryingEquipment,
    RoomFinding,
)


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
