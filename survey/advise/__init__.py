"""What to do about a room: ordered actions with numbers, and safety cautions.

Input is a :class:`~survey.assess.RoomFinding` (or a :class:`~survey.assess.SiteFinding`);
output is a :class:`RoomAdvice` (or :class:`SiteAdvice`) of typed :class:`Action` and
:class:`Caution` records — decisions and numbers, never sentences (those are
:mod:`survey.words`'). The package's rooms:

* :mod:`survey.advise.kinds` — the typed results: action kinds, each kind's numbers;
* :mod:`survey.advise.loads` — moisture loads and sizing physics;
* :mod:`survey.advise.rules` — the decision rules and their order;
* :mod:`survey.advise.cautions` — which safety cautions apply.

Every limit comes from :mod:`survey.thresholds`; each action and caution carries the keys it
used.
"""

from survey.advise.cautions import CLOSING
from survey.advise.kinds import (
    Action,
    ActionKind,
    Caution,
    ColdSurfaceNumbers,
    DehumidifyNumbers,
    DehumidifyWhy,
    ExtractNumbers,
    FindSourceNumbers,
    Forming,
    KeepDryingNumbers,
    MaterialPoint,
    MoistureEstimate,
    OutdoorMode,
    RaiseSurfaceNumbers,
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
from survey.advise.loads import moisture_generation, occupants_share, ventilation_airflow
from survey.advise.rules import (
    TARGET_RH_MAX_PCT,
    TARGET_RH_MIN_PCT,
    advise_room,
    advise_site,
    rh_limit_shown,
    room_target,
)

__all__ = [
    "CLOSING",
    "TARGET_RH_MAX_PCT",
    "TARGET_RH_MIN_PCT",
    "Action",
    "ActionKind",
    "Caution",
    "ColdSurfaceNumbers",
    "DehumidifyNumbers",
    "DehumidifyWhy",
    "ExtractNumbers",
    "FindSourceNumbers",
    "Forming",
    "KeepDryingNumbers",
    "MaterialPoint",
    "MoistureEstimate",
    "OutdoorMode",
    "RaiseSurfaceNumbers",
    "RepeatReadingsNumbers",
    "RoomAdvice",
    "SiteAdvice",
    "SourceReason",
    "Target",
    "TargetWhy",
    "TimberPoint",
    "TimberSurface",
    "VentilateNumbers",
    "VentilatedSpaceNumbers",
    "advise_room",
    "advise_site",
    "moisture_generation",
    "occupants_share",
    "rh_limit_shown",
    "room_target",
    "ventilation_airflow",
]
