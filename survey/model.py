"""The survey as plain typed records: site, instruments, rooms, visits, readings, logs.

Every record is a :class:`msgspec.Struct`. The same classes serve three purposes: loading a
survey file (``msgspec.json.decode(..., type=Survey)`` checks every type and range),
saving it, and generating the JSON Schema that ``survey schema`` prints. There is no second,
hand-written description of the format.

Conventions
-----------
* Numbers are SI floats with the unit in the field name: ``dry_bulb_c`` (°C), ``rh_pct``
  (percent, relative to liquid water as hygrometers report it), ``surface_temp_c``,
  ``pressure_pa``, ``altitude_m``, ``volume_m3``, ``floor_area_m2``, ``height_m``. A survey in
  IP units (``Site.unit_system == "ip"``) is only *displayed* in °F, ft …; the stored numbers
  are always SI.
* Derived numbers (dew point, humidity ratio, surface RH …) are never stored. They are
  computed from the readings each time, so a corrected reading cannot leave a stale dew point
  behind.
* Choices are lowercase snake-case strings (``"external_wall"``, ``"bedroom"``).
* Rooms and instruments carry a short ``id``; per-visit records refer to them by it.
* Reading ranges are the input domain of :mod:`survey.psychro` (air −50…+70 °C, RH 0.1…100 %,
  pressure 50–110 kPa, surfaces −60…+90 °C). Room sizes, occupants, instrument
  accuracies and mould areas take their bounds from :mod:`survey.domain`, the same bounds
  the assessment checks, so a file that loads can always be assessed. NaN and infinity never
  decode.

Checks that span records (unique ids, references to rooms and instruments that exist) are in
:func:`problems`; the store runs them on every load and save. A record built in memory (a
reading typed into a form) is checked with :func:`survey.store.check_record`, which words
its problems as the file errors are worded; a new survey is made by
:func:`survey.store.new_survey`. This module imports nothing of the store.

The records' docstrings and ``Meta`` descriptions are the descriptions ``survey schema``
prints: they are plain text, with no markup.
"""

from __future__ import annotations

import datetime as dt
from collections.abc import Iterator
from typing import Annotated, Literal, TypeVar

import msgspec
from msgspec import Meta, Struct, field

from survey import domain
from survey.psychro import (
    ALTITUDE_MAX_M,
    ALTITUDE_MIN_M,
    DRY_BULB_MAX_C,
    DRY_BULB_MIN_C,
    PRESSURE_MAX_PA,
    PRESSURE_MIN_PA,
    RH_MIN_PCT,
    SURFACE_TEMP_MAX_C,
    SURFACE_TEMP_MIN_C,
)

#: The schema version this program writes. Older versions are upgraded on load by the
#: migrations in :mod:`survey.store.migrations`; newer ones are refused.
SCHEMA_VERSION = 4

# --- choices -----------------------------------------------------------------------------

UnitSystem = Literal["si", "ip"]
Purpose = Literal[
    "damp_complaint",  # condensation, mould or damp reported by an occupant
    "drying_check",  # monitoring the drying of a building after a leak or flood
    "pre_purchase",  # condition survey before a purchase or lease
    "pre_coating",  # conditions before painting, coating or flooring work
    "routine",  # periodic or post-remedy inspection
    "other",
]
InstrumentKind = Literal[
    "thermo_hygrometer",
    "surface_thermometer",  # contact or infrared
    "moisture_meter",
    "data_logger",
    "combined_meter",  # one instrument measuring several of the above
    "other",
]
RoomUse = Literal[
    "bedroom",
    "bathroom",
    "kitchen",
    "living",
    "basement",
    "crawlspace",
    "loft",
    "office",
    "storage",
    "hallway",
    "utility",
    "other",
]
Element = Literal[
    "external_wall",
    "internal_wall",
    "ceiling",
    "floor",
    "window_frame",
    "glazing",
    "pipe",
    "other",
]
#: ``mc_pct``: timber moisture content, % of oven-dry mass (pin meter on wood);
#: ``wme_pct``: wood moisture equivalent, % (the reading a meter gives on a non-wood material,
#: as the moisture content wood would have in equilibrium with it);
#: ``relative``: the meter's own relative scale (comparative only; its range is the meter's).
MoistureScale = Literal["mc_pct", "wme_pct", "relative"]
MeterMethod = Literal["pin", "pinless"]
Odour = Literal["none", "musty", "earthy", "sewage", "chemical", "other"]
#: Water-damage category of the restoration standard of practice: 1 clean, 2 significant
#: contamination, 3 grossly contaminated.
WaterCategory = Literal[1, 2, 3]
EquipmentKind = Literal[
    "refrigerant_dehumidifier",
    "desiccant_dehumidifier",
    "air_mover",
    "heater",
    "extract_fan",
    "air_scrubber",
    "other",
]
#: The test conditions dehumidifier ratings are stated at, by inlet dry bulb and RH:
#: ``"26.7c_60"`` (80 °F, 60 % RH), ``"18.3c_60"`` (65 °F, 60 % RH), ``"22.8c_60"``
#: (73 °F, 60 % RH), ``"27c_60"`` and ``"30c_80"``. Their sources live with the thresholds.
RatingCondition = Literal["26.7c_60", "18.3c_60", "22.8c_60", "27c_60", "30c_80"]

# --- constrained scalars -----------------------------------------------------------------

Id = Annotated[
    str,
    Meta(
        pattern=r"^[A-Za-z0-9][A-Za-z0-9_.-]{0,39}$",
        description="Short identifier: letters, digits, '-', '_' or '.', up to 40 characters.",
    ),
]
Name = Annotated[str, Meta(min_length=1, max_length=200)]
Text = Annotated[str, Meta(max_length=200)]
Address = Annotated[str, Meta(max_length=1000)]
Notes = Annotated[str, Meta(max_length=20_000, description="Free notes.")]
#: A photo's file name relative to the survey file's folder: no absolute path (``/``, ``\\``
#: or a drive letter such as ``C:`` first), no ``..`` step out of the folder, no control
#: characters. Sub-folders (``photos/bed1-corner.jpg``) are fine.
PHOTO_NAME_PATTERN = (
    r"^(?![/\\])(?![A-Za-z]:)(?!(?:.*[/\\])?\.\.(?:[/\\]|$))"
    r"[^\x00-\x1f\x7f]+$"
)
FileName = Annotated[
    str,
    Meta(
        min_length=1,
        max_length=255,
        pattern=PHOTO_NAME_PATTERN,
        description="A photo's file name, relative to the survey file's folder (no absolute "
        "path, drive letter or '..').",
    ),
]

DryBulbC = Annotated[
    float, Meta(ge=DRY_BULB_MIN_C, le=DRY_BULB_MAX_C, description="Air (dry-bulb) temperature, °C.")
]
RhPct = Annotated[
    float,
    Meta(
        ge=RH_MIN_PCT,
        le=100.0,
        description="Relative humidity, %, relative to liquid water as hygrometers report it.",
    ),
]
SurfaceTempC = Annotated[
    float,
    Meta(ge=SURFACE_TEMP_MIN_C, le=SURFACE_TEMP_MAX_C, description="Surface temperature, °C."),
]
PressurePa = Annotated[
    float, Meta(ge=PRESSURE_MIN_PA, le=PRESSURE_MAX_PA, description="Barometric pressure, Pa.")
]
AltitudeM = Annotated[
    float, Meta(ge=ALTITUDE_MIN_M, le=ALTITUDE_MAX_M, description="Altitude above sea level, m.")
]
AirTempAccuracyK = Annotated[
    float, Meta(ge=domain.AIR_TEMP_ACCURACY_MIN_K, le=domain.AIR_TEMP_ACCURACY_MAX_K)
]
SurfaceTempAccuracyK = Annotated[
    float, Meta(ge=domain.SURFACE_TEMP_ACCURACY_MIN_K, le=domain.SURFACE_TEMP_ACCURACY_MAX_K)
]
RhAccuracyPct = Annotated[float, Meta(ge=domain.RH_ACCURACY_MIN_PCT, le=domain.RH_ACCURACY_MAX_PCT)]
Sha256 = Annotated[str, Meta(pattern=r"^[0-9a-f]{64}$")]

_RECORD = {"kw_only": True, "forbid_unknown_fields": True, "omit_defaults": True}


# --- records -----------------------------------------------------------------------------


class Site(Struct, **_RECORD):
    """Where the survey is, for whom, why, and how numbers are shown."""

    reference: Name  #: the job reference or short site name, e.g. "CS-0142 Flat 7"
    address: Address = ""
    client: Text = ""
    purpose: Purpose = "damp_complaint"
    inspector: Text = ""
    unit_system: UnitSystem = "si"
    #: Altitude of the site; used for the standard-atmosphere pressure when no
    #: barometric pressure was measured.
    altitude_m: AltitudeM | None = None
    #: Barometric pressure measured on site; overrides ``altitude_m``.
    pressure_pa: PressurePa | None = None
    construction: Text = ""  #: e.g. "1960s concrete frame, cavity brick infill"
    year_built: Annotated[int, Meta(ge=1000, le=2200)] | None = None
    #: An open-flued boiler, water heater, stove or fire anywhere in the building: true,
    #: false, or not said (null). A room may say for itself.
    flued_appliance: bool | None = None
    #: The design month the colder-month projection looks at: its mean outdoor temperature
    #: and RH, and the indoor temperature held in it (``None``: the room's as measured).
    #: With no design month the report projects to a stated default month of its own.
    design_outdoor_temp_c: Annotated[float, Meta(ge=-60.0, le=40.0)] | None = None
    design_outdoor_rh_pct: Annotated[float, Meta(ge=1.0, le=100.0)] | None = None
    design_indoor_temp_c: Annotated[float, Meta(ge=0.0, le=40.0)] | None = None
    notes: Notes = ""


class Instrument(Struct, **_RECORD):
    """A measuring instrument and its stated accuracies (used for uncertainty bands)."""

    id: Id
    kind: InstrumentKind
    name: Name  #: make and model as written on it, or a description
    serial: Text = ""
    calibrated_on: dt.date | None = None
    air_temp_accuracy_k: AirTempAccuracyK | None = None  #: ± K on air temperature
    rh_accuracy_pct: RhAccuracyPct | None = None  #: ± percentage points of RH
    surface_temp_accuracy_k: SurfaceTempAccuracyK | None = None  #: ± K on surface temperature
    #: ± on a moisture reading, in the units of the reading's scale.
    moisture_accuracy: Annotated[float, Meta(gt=0.0, le=100.0)] | None = None
    #: Emissivity set on an infrared surface thermometer.
    emissivity: Annotated[float, Meta(gt=0.0, le=1.0)] | None = None
    notes: Notes = ""


class Room(Struct, **_RECORD):
    """A room or space of the building, the same on every visit."""

    id: Id
    name: Name
    #: Storey: 0 ground, 1 first, −1 basement; None: not recorded.
    level: Annotated[int, Meta(ge=-10, le=200)] | None = None
    use: RoomUse = "other"
    volume_m3: (
        Annotated[float, Meta(ge=domain.ROOM_VOLUME_MIN_M3, le=domain.ROOM_VOLUME_MAX_M3)] | None
    ) = None
    floor_area_m2: (
        Annotated[float, Meta(ge=domain.FLOOR_AREA_MIN_M2, le=domain.FLOOR_AREA_MAX_M2)] | None
    ) = None
    height_m: (
        Annotated[float, Meta(ge=domain.ROOM_HEIGHT_MIN_M, le=domain.ROOM_HEIGHT_MAX_M)] | None
    ) = None
    #: People who usually use it; None: not recorded (the advice asks for it rather than
    #: reckon with no one).
    occupants: Annotated[int, Meta(ge=0, le=domain.OCCUPANTS_MAX)] | None = None
    #: True for an unaffected room used as the reference (dry standard, normal conditions).
    is_reference: bool = False
    #: The room's usual moisture-producing use, for the moisture load (not said: a wet
    #: room's typical use is assumed).
    showers_per_day: Annotated[float, Meta(ge=0.0, le=100.0)] | None = None
    baths_per_day: Annotated[float, Meta(ge=0.0, le=100.0)] | None = None
    cooking_hours_per_day: Annotated[float, Meta(ge=0.0, le=24.0)] | None = None
    laundry_loads_per_day: Annotated[float, Meta(ge=0.0, le=50.0)] | None = None
    #: An open-flued appliance in this room: true, false, or not said (the site's answer).
    flued_appliance: bool | None = None
    notes: Notes = ""

    def volume_estimate_m3(self) -> float | None:
        """The stated volume, else floor area × height, else ``None``."""
        if self.volume_m3 is not None:
            return self.volume_m3
        if self.floor_area_m2 is not None and self.height_m is not None:
            return self.floor_area_m2 * self.height_m
        return None


class AirReading(Struct, **_RECORD):
    """One spot reading of air temperature and relative humidity."""

    dry_bulb_c: DryBulbC
    rh_pct: RhPct
    taken_at: dt.datetime | None = None
    instrument: Id | None = None


class SurfaceReading(Struct, **_RECORD):
    """A surface temperature at a named spot, with what was seen there."""

    location: Name  #: e.g. "NE corner behind wardrobe, 0.2 m above skirting"
    element: Element
    surface_temp_c: SurfaceTempC
    material: Text = ""
    taken_at: dt.datetime | None = None
    instrument: Id | None = None
    condensation_seen: bool = False
    mould_visible: bool = False
    notes: Notes = ""


class MaterialReading(Struct, **_RECORD):
    """A moisture-meter reading of a material at a named spot."""

    location: Name
    material: Name  #: e.g. "gypsum plaster", "softwood skirting", "chipboard floor"
    value: Annotated[float, Meta(ge=0.0, le=1000.0)]
    scale: MoistureScale
    #: True when this is a dry-standard reading: the same material in an unaffected part of
    #: the building, the goal the affected readings are dried toward.
    dry_standard: bool = False
    method: MeterMethod | None = None
    taken_at: dt.datetime | None = None
    instrument: Id | None = None
    notes: Notes = ""


class Observations(Struct, **_RECORD):
    """What was seen or smelt in a room on a visit."""

    mould_visible: bool = False
    #: Visible total.
    mould_area_m2: Annotated[float, Meta(ge=0.0, le=domain.MOULD_AREA_MAX_M2)] | None = None
    staining: bool = False
    condensation_seen: bool = False
    odour: Odour | None = None  #: ``None``: not recorded
    water_category: WaterCategory | None = None
    #: How long the water had stood when seen, hours (category 1 and 2 degrade).
    water_standing_h: Annotated[float, Meta(ge=0.0, le=100_000.0)] | None = None
    #: The class of water loss, 1 (least evaporation load) to 4 (bound water in dense
    #: materials), when the surveyor set it.
    water_loss_class: Literal[1, 2, 3, 4] | None = None
    #: Share of the room's floor, wall and ceiling area that is wet, %.
    wet_area_pct: Annotated[float, Meta(ge=0.0, le=100.0)] | None = None
    #: Dense materials (hardwood, plaster, concrete, masonry) hold water.
    dense_materials_wet: bool = False
    notes: Notes = ""


class Equipment(Struct, **_RECORD):
    """Drying or ventilation equipment in a room on a visit."""

    kind: EquipmentKind
    label: Text = ""
    running: bool = True
    capacity_l_per_day: Annotated[float, Meta(gt=0.0, le=10_000.0)] | None = None  #: rated
    #: Water collected since the previous visit, litres.
    water_removed_l: Annotated[float, Meta(ge=0.0, le=100_000.0)] | None = None
    #: Air leaving a dehumidifier, for the humidity-ratio drop across it.
    outlet: AirReading | None = None
    #: Air entering it; ``None``: the room's air reading is taken as the inlet.
    inlet: AirReading | None = None
    #: Hours over which ``water_removed_l`` was collected; ``None``: since the previous
    #: visit's reading of the same unit (or since the visit before, if none).
    run_hours: Annotated[float, Meta(gt=0.0, le=10_000.0)] | None = None
    #: Electrical power drawn while running (W), or energy used over ``run_hours`` (kWh).
    power_w: Annotated[float, Meta(gt=0.0, le=100_000.0)] | None = None
    energy_kwh: Annotated[float, Meta(gt=0.0, le=1_000_000.0)] | None = None
    #: The rated energy factor, litres per kWh, at ``rating_condition``.
    rated_energy_factor_l_per_kwh: Annotated[float, Meta(gt=0.0, le=20.0)] | None = None
    #: The test condition the rating was stated at (a key of ``RatingCondition``);
    #: ``None``: not known.
    rating_condition: RatingCondition | None = None
    notes: Notes = ""

    def as_set_up(self) -> Equipment:
        """The unit as it was set up (kind, label, running, rating, notes), without what it
        was measured at on the visit: water collected, air in and out, hours, energy."""
        return msgspec.structs.replace(
            self, water_removed_l=None, outlet=None, inlet=None, run_hours=None, energy_kwh=None
        )


PointKind = Literal["surface", "material"]


class LeftOut(Struct, **_RECORD):
    """A point measured on an earlier visit and not read on this one, with the reason
    (the plaster there was stripped out; a wardrobe blocked it today)."""

    kind: PointKind
    location: Name  #: the point's location, as written when it was measured
    #: A material point's material (a material point is its location and material).
    material: Text = ""
    reason: Text = ""
    #: True: the point is gone for good and is not offered again. False (the default, the
    #: one that loses nothing): it could not be read this time and is offered again on the
    #: next visit.
    for_good: bool = False


class RoomVisit(Struct, **_RECORD):
    """Everything recorded in one room on one visit."""

    room: Id  #: ``Room.id``
    air: AirReading | None = None
    surfaces: list[SurfaceReading] = []
    materials: list[MaterialReading] = []
    observations: Observations = field(default_factory=Observations)
    equipment: list[Equipment] = []
    heating_on: bool | None = None
    windows_open: bool | None = None
    notes: Notes = ""
    photos: list[FileName] = []
    #: Points of an earlier visit not read on this one, and why.
    left_out: list[LeftOut] = []

    def entered(self) -> bool:
        """Whether anything was recorded here on the visit: False for a record holding only
        the equipment carried over from the visit before, unread (the room not yet entered)."""
        return not (
            self.air is None
            and not self.surfaces
            and not self.materials
            and not self.notes.strip()
            and not self.photos
            and not self.left_out
            and self.heating_on is None
            and self.windows_open is None
            and self.observations == Observations()
            and all(e == e.as_set_up() for e in self.equipment)
        )


_Timed = TypeVar("_Timed", bound=AirReading | SurfaceReading | MaterialReading | None)


class Visit(Struct, **_RECORD):
    """One visit to the site: when, the weather, the outdoor air, and the rooms seen."""

    started_at: dt.datetime
    label: Text = ""  #: e.g. "Day 2 drying check"
    inspector: Text = ""  #: when not the site's inspector
    weather: Text = ""
    outdoor: AirReading | None = None
    #: Barometric pressure measured on this visit; overrides the site's.
    pressure_pa: PressurePa | None = None
    rooms: list[RoomVisit] = []
    notes: Notes = ""
    photos: list[FileName] = []

    def readings_timed(self) -> int:
        """How many of the visit's readings carry the time they were taken."""
        return sum(1 for _ in _timed(self))

    def readings_moved(self, by: dt.timedelta) -> Visit:
        """The visit with every reading's time moved ``by`` (later; earlier when negative),
        its start as it is: for readings stamped before the start was put right."""

        def move(reading: _Timed) -> _Timed:
            if reading is None or reading.taken_at is None:
                return reading
            return msgspec.structs.replace(reading, taken_at=reading.taken_at + by)

        rooms = [
            msgspec.structs.replace(
                rv,
                air=move(rv.air),
                surfaces=[move(s) for s in rv.surfaces],
                materials=[move(m) for m in rv.materials],
                equipment=[
                    msgspec.structs.replace(e, outlet=move(e.outlet), inlet=move(e.inlet))
                    for e in rv.equipment
                ],
            )
            for rv in self.rooms
        ]
        return msgspec.structs.replace(self, outdoor=move(self.outdoor), rooms=rooms)

    def room_visit(self, room_id: str) -> RoomVisit | None:
        """This visit's record for ``room_id``, if the room was seen."""
        for room_visit in self.rooms:
            if room_visit.room == room_id:
                return room_visit
        return None


def _timed(visit: Visit) -> Iterator[AirReading | SurfaceReading | MaterialReading]:
    """The visit's readings that carry the time they were taken."""
    readings: list[AirReading | SurfaceReading | MaterialReading | None] = [visit.outdoor]
    for rv in visit.rooms:
        readings += [rv.air, *rv.surfaces, *rv.materials]
        readings += [r for e in rv.equipment for r in (e.outlet, e.inlet)]
    return (r for r in readings if r is not None and r.taken_at is not None)


class LogSample(Struct, array_like=True, forbid_unknown_fields=True):
    """One data-logger sample, stored compactly as a list: [time, dry_bulb_c, rh_pct]."""

    at: dt.datetime
    dry_bulb_c: DryBulbC
    rh_pct: RhPct


class LogSeries(Struct, **_RECORD):
    """Samples imported from a data logger's file, for a room, or outdoors when room is
    null."""

    room: Id | None  #: ``Room.id``; ``None`` for an outdoor logger
    source: Name  #: the imported file's name
    samples: list[LogSample]
    #: The location label of the surface the logger's probe sat on (a surface reading's
    #: ``location`` in the same room): then the samples are surface temperature and surface
    #: RH. ``None``: the logger measured the room's air (or the outdoor air).
    surface: Name | None = None
    instrument: Id | None = None
    source_sha256: Sha256 | None = None  #: of the imported file, to spot a repeated import
    imported_at: dt.datetime | None = None
    skipped_rows: Annotated[int, Meta(ge=0)] = 0  #: data rows of the file not imported
    notes: Notes = ""


class Survey(Struct, kw_only=True, forbid_unknown_fields=True):
    """One survey: one site, its instruments and rooms, the visits, and logger series.

    Every top-level field is always written (schema_version above all), so a file shows
    its sections even while they are empty.
    """

    schema_version: Annotated[int, Meta(ge=SCHEMA_VERSION, le=SCHEMA_VERSION)] = SCHEMA_VERSION
    site: Site
    instruments: list[Instrument] = []
    rooms: list[Room] = []
    visits: list[Visit] = []
    logs: list[LogSeries] = []
    created_at: dt.datetime | None = None

    def find_room(self, key: str) -> Room | None:
        """The room whose id is ``key``, else the one whose name matches it ignoring case."""
        for room in self.rooms:
            if room.id == key:
                return room
        folded = key.strip().casefold()
        for room in self.rooms:
            if room.name.strip().casefold() == folded:
                return room
        return None

    def room(self, room_id: str) -> Room:
        """The room with id ``room_id`` (``KeyError`` if there is none)."""
        for room in self.rooms:
            if room.id == room_id:
                return room
        raise KeyError(room_id)

    def instrument(self, instrument_id: str) -> Instrument:
        """The instrument with id ``instrument_id`` (``KeyError`` if there is none)."""
        for instrument in self.instruments:
            if instrument.id == instrument_id:
                return instrument
        raise KeyError(instrument_id)


# --- helpers -----------------------------------------------------------------------------


def pressure_pa_for(survey: Survey, visit: Visit | None = None) -> float:
    """The pressure to compute a visit's moist-air states with: the visit's measured
    pressure, else the site's, else the standard atmosphere at the site's altitude, else
    standard sea-level pressure."""
    from survey import psychro

    if visit is not None and visit.pressure_pa is not None:
        return visit.pressure_pa
    return psychro.site_pressure_pa(survey.site.altitude_m, survey.site.pressure_pa)


def point_key(point: SurfaceReading | MaterialReading | LeftOut) -> tuple[str, str, str]:
    """What makes readings on different visits the same point: its kind, its location and,
    for a material point, its material, compared as folded text (case, compatibility forms
    and runs of spaces aside: :func:`survey.safe_text.fold`). A point left out is keyed as
    the point it stands for."""
    from survey.safe_text import fold

    if isinstance(point, LeftOut):
        return point.kind, fold(point.location), fold(point.material)
    if isinstance(point, MaterialReading):
        return "material", fold(point.location), fold(point.material)
    return "surface", fold(point.location), ""


# The cross-record checks live in survey.model_checks (they use the records above).
from survey.model_checks import photo_name_problem as photo_name_problem  # noqa: E402
from survey.model_checks import problems as problems  # noqa: E402
