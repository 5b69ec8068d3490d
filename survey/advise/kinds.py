"""The typed results of the advice: action kinds, each kind's numbers, cautions.

An :class:`Action` is a decision with numbers, never a sentence: ``kind`` says what to do,
``numbers`` is the kind's own record (:class:`VentilateNumbers`, :class:`DehumidifyNumbers` …)
with the SI unit in every float's name, and ``threshold_keys`` names the limits it used. The
words for people come from :mod:`survey.words`. ``as_dict`` gives the JSON encoding (the
keys ``survey check --json`` prints).
"""

from __future__ import annotations

from collections.abc import Iterator
from enum import Enum
from typing import Any, ClassVar, Generic, TypeVar

import msgspec


class ActionKind(Enum):
    VENTILATE = "ventilate"
    DEHUMIDIFY = "dehumidify"
    RAISE_SURFACE_TEMPERATURE = "raise_surface_temperature"
    FIND_SOURCE = "find_source"
    KEEP_DRYING = "keep_drying"
    REDUCE_GLAZING_CONDENSATION = "reduce_glazing_condensation"
    INSULATE_PIPE = "insulate_pipe"
    REPEAT_READINGS = "repeat_readings"
    DRY_VENTILATED_SPACE = "dry_ventilated_space"
    REMOVE_CONTAMINATED_MATERIALS = "remove_contaminated_materials"
    EXTRACT_AT_SOURCE = "extract_at_source"

    def __str__(self) -> str:
        return self.value


#: Fields whose ``None`` is encoded (a number that could not be worked out); every other
#: optional field is left out of the JSON when it is ``None`` (it does not apply).
_KEEP_NONE = frozenset(
    {
        "moisture_generation_g_per_h",
        "load_l_per_day",
        "removal_l_per_day",
        "removal_us_pints_per_day",
        "humidity_class",
        "vapour_pressure_excess_pa",
    }
)
#: A numbers record lists in ``__words__`` the fields only the words read (the decision is
#: carried by the kind and the numbers already); they are not encoded. Records are msgspec
#: Structs: typed, frozen, and made at import in microseconds.


def _encode(value: Any) -> Any:
    if isinstance(value, Enum):
        return value.value
    if isinstance(value, msgspec.Struct):
        return {k: _encode(v) for k, v in _fields(value)}
    if isinstance(value, tuple):
        return [_encode(v) for v in value]
    return value


def _fields(record: Any) -> Iterator[tuple[str, Any]]:
    words_only: frozenset[str] = getattr(record, "__words__", frozenset())
    for name in record.__struct_fields__:
        if name in words_only:
            continue
        value = getattr(record, name)
        if value is None and name not in _KEEP_NONE:
            continue
        yield name, value


class OutdoorMode(Enum):
    """How outdoor air relates to the room, for ventilation and dehumidification."""

    NOT_MEASURED = "not_measured"
    WETTER = "wetter"  #: outdoor air holds more water than the room air
    ABOUT_SAME = "about_same"  #: within the drier-margin of the room air
    HOLDS_TARGET = "holds_target"  #: drier than room air at the target by the margin
    DRIER_NOT_ENOUGH = "drier_not_enough"  #: drier than the room now, not than the target
    NO_DRIER_THAN_TARGET = "no_drier_than_target"  #: drier now, but not below the target


class DehumidifyWhy(Enum):
    """What led to a dehumidifier."""

    OUTDOOR_NOT_MEASURED = "outdoor_not_measured"
    OUTDOOR_WETTER = "outdoor_wetter"
    OUTDOOR_ABOUT_SAME = "outdoor_about_same"
    #: outdoor air's dew point is above the coldest surface: airing cannot dry it
    OUTDOOR_DEW_POINT_ABOVE_SURFACE = "outdoor_dew_point_above_surface"
    VENTILATION_OVER_PRACTICAL = "ventilation_over_practical"
    VENTILATION_CANNOT_HOLD = "ventilation_cannot_hold"
    DRYING_AIR_MOVERS_ONLY = "drying_air_movers_only"
    DRYING_ABOVE_TARGET = "drying_above_target"
    DRYING_WITHIN_TARGET = "drying_within_target"


class VentilateNumbers(msgspec.Struct, frozen=True, kw_only=True):
    __words__: ClassVar[frozenset[str]] = frozenset(
        ("outdoor_mode", "room_volume_m3", "saturates", "practical_max_ach", "use")
    )
    target_rh_pct: float
    target_humidity_ratio_g_per_kg: float
    room_humidity_ratio_g_per_kg: float
    outdoor_humidity_ratio_g_per_kg: float
    moisture_generation_g_per_h: float | None
    target_reachable_by_ventilation: bool
    outdoor_mode: OutdoorMode
    room_volume_m3: float | None = None
    dry_air_flow_kg_per_h: float | None = None
    airflow_m3_per_h: float | None = None
    airflow_ft3_per_min: float | None = None
    air_changes_per_h: float | None = None
    heat_to_warm_air_w: float | None = None
    outdoor_air_rh_at_room_temp_pct: float | None = None
    rh_at_practical_ventilation_pct: float | None = None
    #: the load is more than air at the practical rate can carry: it would saturate
    saturates: bool = False
    practical_max_ach: float | None = None
    occupants_share_of_load: float | None = None
    #: the airflow the moisture balance asks for, before the code minimum was applied
    sized_airflow_m3_per_h: float | None = None
    #: the usual code minimum continuous extract for the room use (the higher of those
    #: compared), never undercut by ``airflow_m3_per_h``
    code_minimum_m3_per_h: float | None = None
    use: str = "other"


class DehumidifyNumbers(msgspec.Struct, frozen=True, kw_only=True):
    __words__: ClassVar[frozenset[str]] = frozenset(
        (
            "why",
            "outdoor_gain_g_per_h",
            "outdoor_air_how",
            "generation_g_per_h",
            "water_removed_l",
            "hours_since_previous",
            "rated_capacity_l_per_day",
            "ventilation_air_changes_needed_per_h",
            "practical_max_ach",
            "water_loss_class_assumed",
        )
    )
    target_rh_pct: float
    target_humidity_ratio_g_per_kg: float
    room_temp_c: float
    suggest_desiccant: bool
    load_l_per_day: float | None
    removal_l_per_day: float | None
    removal_us_pints_per_day: float | None
    why: DehumidifyWhy
    outdoor_air_changes_per_h: float | None = None
    outdoor_air_l_per_day: float | None = None
    outdoor_gain_g_per_h: float | None = None  #: signed: negative when outdoor air dries
    outdoor_air_how: str | None = None  #: "leaking_in" or "ventilating"
    generation_g_per_h: float | None = None
    pull_down_l: float | None = None
    logged_removal_l_per_day: float | None = None
    water_removed_l: float | None = None
    hours_since_previous: float | None = None
    rated_capacity_l_per_day: float | None = None
    ventilation_air_changes_needed_per_h: float | None = None
    practical_max_ach: float | None = None
    grain_depression_g_per_kg: float | None = None
    grain_depression_gr_per_lb: float | None = None
    outlet_humidity_ratio_g_per_kg: float | None = None
    drying_in_progress: bool | None = None
    air_movers_without_dehumidifier: bool | None = None
    occupants_share_of_load: float | None = None
    #: water leaving wet materials, L/day, from the class of water loss and the room volume
    materials_load_l_per_day: float | None = None
    water_loss_class: int | None = None
    water_loss_class_assumed: bool = False
    #: contaminated water: drying is only for what remains after removal
    after_removal: bool | None = None


class ExtractNumbers(msgspec.Struct, frozen=True, kw_only=True):
    """A wet room whose outdoor air is no help to general ventilation: extract the vapour
    while it is made, when the air leaving holds far more water than outdoor air."""

    __words__: ClassVar[frozenset[str]] = frozenset(("use", "outdoor_mode"))
    use: str
    outdoor_mode: OutdoorMode  #: WETTER, ABOUT_SAME, NOT_MEASURED or HOLDS_TARGET (dew point)
    room_humidity_ratio_g_per_kg: float
    outdoor_humidity_ratio_g_per_kg: float | None
    #: the usual code minimum while in use (intermittent) and running continuously
    intermittent_m3_per_h: float
    intermittent_ft3_per_min: float
    code_minimum_m3_per_h: float


class RaiseSurfaceNumbers(msgspec.Struct, frozen=True, kw_only=True):
    __words__: ClassVar[frozenset[str]] = frozenset(
        (
            "design_rh_pct",
            "too_cold",
            "factor_under",
            "ground_contact",
            "temperature_factor_uncertainty",
            "use",
        )
    )
    surface: str
    element: str
    surface_temp_c: float
    max_room_rh_pct: float
    surface_temp_for_target_rh_c: float
    target_surface_temp_c: float
    design_rh_pct: float
    too_cold: bool
    factor_under: bool
    ground_contact: bool
    #: no practical room RH keeps this surface under the mould limit: a dehumidifier
    #: cannot cure it, the surface must be warmer
    dehumidifier_cannot_cure: bool = False
    #: the factor is under its limit at the reading but within the instruments' accuracy
    #: of it, on a surface at or past the mould limit: to be confirmed
    factor_unclear: bool = False
    #: a wet surface of a room being dried, below the dew point now
    drying_wet: bool = False
    temperature_factor: float | None = None
    temperature_factor_uncertainty: float | None = None
    temperature_factor_limit: float | None = None
    surface_temp_for_factor_limit_c: float | None = None
    use: str = "other"


class Forming(Enum):
    """Whether water or frost forms on a cold pane, frame or pipe at the reading."""

    NOW = "now"
    MAYBE = "maybe"  #: the band reaches the condensation point
    NO = "no"


class ColdSurfaceNumbers(msgspec.Struct, frozen=True, kw_only=True):
    """A pane, frame or pipe at or near its condensation point."""

    __words__: ClassVar[frozenset[str]] = frozenset(
        ("target_rh_pct", "forming", "mouldy", "drying", "room_rh_pct")
    )
    surface: str
    element: str
    surface_temp_c: float
    condensation_point_c: float
    frost: bool
    max_room_rh_pct_dry: float
    surface_temp_to_stay_dry_c: float
    target_rh_pct: float
    forming: Forming
    mouldy: bool = False
    drying: bool = False
    room_rh_pct: float | None = None  #: the room's RH now


class MaterialPoint(msgspec.Struct, frozen=True, kw_only=True):
    """A material reading above its dry standard, and the reading at which it is dry."""

    label: str
    material: str
    scale: str
    value: float
    dry_standard: float
    dry_at_or_below: float
    #: The visit (index) the dry standard was read on, when an earlier one than this reading's.
    dry_standard_visit: int | None = None


class TimberPoint(msgspec.Struct, frozen=True, kw_only=True):
    """A timber moisture reading and what the room air alone would give it."""

    label: str
    value_pct: float  #: the meter reading, % moisture content
    emc_pct: float | None = None  #: in equilibrium with the room air


class SourceReason(Enum):
    """What points to a moisture source."""

    WET_MATERIALS = "wet_materials"
    DAMP_TIMBER = "damp_timber"
    TIMBER_DECAY = "timber_decay"
    WATER_PRESENT = "water_present"
    CONDENSATION_SEEN_NOT_MEASURED = "condensation_seen_not_measured"
    CONDENSATION_SEEN_SURFACES_CLEAR = "condensation_seen_surfaces_clear"
    MOULD_SEEN_NOT_MEASURED = "mould_seen_not_measured"
    MOULD_SEEN_SURFACES_BELOW = "mould_seen_surfaces_below"
    MUSTY_SMELL = "musty_smell"
    HIGH_HUMIDITY_CLASS = "high_humidity_class"


class FindSourceNumbers(msgspec.Struct, frozen=True, kw_only=True):
    __words__: ClassVar[frozenset[str]] = frozenset(
        (
            "reasons",
            "first",
            "wet",
            "damp_timber",
            "decaying",
            "decay_slowed",
            "water_category",
            "use",
            "humidity_class_possible",
        )
    )
    reasons: tuple[SourceReason, ...]
    first: bool  #: liquid water suspected: before any drying
    wet: tuple[MaterialPoint, ...] = ()
    damp_timber: tuple[TimberPoint, ...] = ()
    decaying: tuple[TimberPoint, ...] = ()
    decay_slowed: bool = False
    water_category: int | None = None
    use: str = "other"
    materials_above_dry_standard: int | None = None
    vapour_pressure_excess_pa: float | None = None
    humidity_class: int | None = None
    humidity_class_possible: tuple[int, ...] | None = None


class KeepDryingNumbers(msgspec.Struct, frozen=True, kw_only=True):
    __words__: ClassVar[frozenset[str]] = frozenset(("damp_timber", "decaying", "decay_slowed"))
    materials_above_dry_standard: int
    materials: tuple[MaterialPoint, ...]
    damp_timber: tuple[TimberPoint, ...] = ()
    decaying: tuple[TimberPoint, ...] = ()
    decay_slowed: bool = False


class RepeatReadingsNumbers(msgspec.Struct, frozen=True, kw_only=True):
    __words__: ClassVar[frozenset[str]] = frozenset(("wet_room_peak", "use"))
    vapour_pressure_excess_pa: float | None
    humidity_class: int | None
    wet_room_peak: bool
    use: str = "other"
    vapour_pressure_excess_uncertainty_pa: float | None = None
    humidity_class_possible: tuple[int, ...] | None = None
    reread_after_use_minutes: tuple[float, float] | None = None


class TimberSurface(msgspec.Struct, frozen=True, kw_only=True):
    """A surface read as timber in a ventilated space, and the moisture it would settle at
    (None where the Wood Handbook equation is not used: above 98 % RH, outside 0-100 °C)."""

    surface: str
    surface_temp_c: float
    surface_rh_pct: float
    emc_pct: float | None


class VentilatedSpaceNumbers(msgspec.Struct, frozen=True, kw_only=True):
    __words__: ClassVar[frozenset[str]] = frozenset(("loft", "room_temp_c"))
    room_rh_pct: float
    dehumidify_only_if_sealed: bool
    loft: bool
    timber_surfaces: tuple[TimberSurface, ...] | None = None
    #: outdoor air holds more water than the space
    outdoor_wetter_than_space: bool | None = None
    #: outdoor air's dew point is above the space's coldest measured surface
    outdoor_dew_point_above_coldest_surface: bool | None = None
    #: so the vents stay closed while outdoor air is like this
    keep_vents_closed: bool = False
    outdoor_dew_point_c: float | None = None
    coldest_surface_temp_c: float | None = None
    room_temp_c: float | None = None


class RemoveContaminatedNumbers(msgspec.Struct, frozen=True, kw_only=True):
    """Category 3 water (or category 2 left standing long enough to degrade)."""

    water_category: int
    effective_category: int
    degraded: bool  #: the category was raised by the time the water stood
    water_standing_h: float | None = None
    #: porous materials read in the room (removed, not dried)
    porous_materials: tuple[str, ...] = ()
    #: air movers are running: they spread contamination until removal is done
    stop_air_movers: bool = False


ActionNumbers = (
    RemoveContaminatedNumbers
    | VentilateNumbers
    | DehumidifyNumbers
    | RaiseSurfaceNumbers
    | ColdSurfaceNumbers
    | FindSourceNumbers
    | KeepDryingNumbers
    | RepeatReadingsNumbers
    | VentilatedSpaceNumbers
    | ExtractNumbers
)
#: The numbers record of one action kind.
N = TypeVar(
    "N",
    RemoveContaminatedNumbers,
    VentilateNumbers,
    DehumidifyNumbers,
    RaiseSurfaceNumbers,
    ColdSurfaceNumbers,
    FindSourceNumbers,
    KeepDryingNumbers,
    RepeatReadingsNumbers,
    VentilatedSpaceNumbers,
    ExtractNumbers,
    ActionNumbers,
)


class Action(msgspec.Struct, Generic[N], frozen=True):
    """One thing to do and its numbers; ``surface`` names the surface it is about.
    ``Action[VentilateNumbers]`` is a ventilate action; a list of any is ``Action[Any]``."""

    kind: ActionKind
    numbers: N
    threshold_keys: tuple[str, ...]

    @property
    def surface(self) -> str | None:
        return getattr(self.numbers, "surface", None)

    def as_dict(self) -> dict[str, Any]:
        """JSON-ready without words: ``kind``, the numbers, ``threshold_keys``."""
        return {
            "kind": self.kind.value,
            **self.numbers_dict(),
            "threshold_keys": list(self.threshold_keys),
        }

    def numbers_dict(self) -> dict[str, Any]:
        """The numbers as JSON-ready values (SI unit in each key)."""
        out = {name: _encode(value) for name, value in _fields(self.numbers)}
        if self.kind is ActionKind.FIND_SOURCE and out.get("humidity_class") is None:
            out.pop("humidity_class", None)
            out.pop("vapour_pressure_excess_pa", None)
        return out


class Caution(msgspec.Struct, frozen=True):
    """A safety caution: its key says which; the numbers it needs ride along."""

    key: str
    threshold_keys: tuple[str, ...] = ()
    area_m2: float | None = None  #: visible mould
    use: str | None = None  #: confined spaces
    year_built: int | None = None  #: old materials
    risks: tuple[str, ...] = ()  #: old materials: "asbestos", "lead_paint"
    flued: bool | None = None  #: combustion air: an open-flued appliance said to be there


class MoistureEstimate(msgspec.Struct, frozen=True, kw_only=True):
    """Moisture generated in the room, g/h, by each basis that could be worked out."""

    occupants_g_per_h: float | None
    activities_g_per_h: float | None
    back_calculated_g_per_h: float | None
    used_g_per_h: float | None
    threshold_keys: tuple[str, ...]
    occupants: int | None = None
    occupant_rate_key: str | None = None  #: the per-person rate used
    occupants_assumed_zero: bool = False  #: a closed-up space with no occupants given
    assumed_air_change_rate_per_h: float | None = None
    #: what to give so the load can be worked out (empty when known)
    missing: tuple[str, ...] = ()
    outdoor_as_wet: bool = False  #: why the measured excess cannot give the load
    #: a wet room with no use entered: its use's typical load was assumed ("shower",
    #: "cooking", "laundry"), with the amount
    typical_use_assumed: str | None = None
    typical_use_amount: float | None = None
    laundry_g_per_h: float | None = None


class TargetWhy(Enum):
    DRYING = "drying"  #: the drying target while materials dry
    DEFAULT = "default"
    GIVEN = "given"


class Target(msgspec.Struct, frozen=True, kw_only=True):
    """The room RH the advice aims for, and why."""

    rh_pct: float
    why: TargetWhy
    design_rh_pct: float  #: before the coldest surface lowered it
    lowered_by_surface: bool = False
    surface_limit_whole_pct: float | None = None  #: the coldest surface's limit, shown
    at_practical_floor: bool = False  #: held at the floor; the surface must be warmer too
    binding: str | None = None  #: "mould" or "margin"
    coldest_label: str | None = None
    coldest_temp_c: float | None = None
    frost_point: bool = False
    threshold_keys: tuple[str, ...] = ()


class RoomAdvice(msgspec.Struct, frozen=True, kw_only=True):
    room: str
    target: Target
    moisture: MoistureEstimate
    actions: tuple[Action[Any], ...]
    cautions: tuple[Caution, ...]

    @property
    def target_rh_pct(self) -> float:
        return self.target.rh_pct

    @property
    def threshold_keys(self) -> tuple[str, ...]:
        keys = set(self.moisture.threshold_keys)
        for action in self.actions:
            keys.update(action.threshold_keys)
        for caution in self.cautions:
            keys.update(caution.threshold_keys)
        return tuple(sorted(keys))


class SiteAdvice(msgspec.Struct, frozen=True, kw_only=True):
    rooms: tuple[RoomAdvice, ...]
    cautions: tuple[Caution, ...] = ()  #: every room's, once, closing last
