"""The quick check: one room's readings judged, with no survey file.

:class:`QuickInput` is what a face gathered (already parsed to SI floats); :func:`judge`
returns a :class:`QuickResult` — the air and outdoor states, the room finding, the advice,
which instrument accuracies were given and the limits used. ``survey check`` lays it out as
a table or encodes it as JSON; the app's quick-check screen shows the same result.
"""

from __future__ import annotations

from typing import TYPE_CHECKING

import msgspec

from survey import advise, assess, domain, psychro, units
from survey import thresholds as th
from survey.errors import InputError

if TYPE_CHECKING:
    from survey import season


def read_room_volume(
    text: str, field: str = "room volume", system: units.UnitSystem = "si"
) -> float:
    """A room volume in m³ from ``30``, ``30 m3``, ``1060 ft3``, or dimensions multiplied
    out (``4.2 x 3.1 x 2.4``), within the survey file's range; the message names ``field``,
    the text as typed and, where a unit was converted, what it was read as."""
    low, high = domain.ROOM_VOLUME_MIN_M3, domain.ROOM_VOLUME_MAX_M3
    allowed = f"room volume must be between {low:g} and {high:g} m³"
    if "x" in text.lower() or "×" in text:
        value = units.parse_volume_or_dimensions(text, field, system)
        if not low <= value <= high:
            raise InputError(field, text, f"{allowed} (read as {value:.3g} m³)")
        return value
    try:
        reading = units.read("volume", text, field, system)
    except InputError as exc:  # a room's volume may also be given by its dimensions
        raise units.with_dimensions(exc, system) from None
    if not low <= reading.value <= high:
        raise reading.error(allowed)
    return reading.value


def read_occupants(text: str, field: str = "occupants") -> int:
    """The usual number of people in the room: a whole number within the survey file's
    range."""
    allowed = f"expected a whole number of people from 0 to {domain.OCCUPANTS_MAX}"
    try:
        number = units.parse_number(text, field)
    except InputError:
        raise InputError(field, text, allowed) from None
    if number != int(number) or not 0 <= number <= domain.OCCUPANTS_MAX:
        raise InputError(field, text, allowed)
    return int(number)


class AccuracyGiven(msgspec.Struct, frozen=True):
    """Which instrument accuracies were entered (the rest are typical specifications)."""

    air_temp_k: bool = False
    rh_pct: bool = False
    surface_temp_k: bool = False

    @property
    def any(self) -> bool:
        return self.air_temp_k or self.rh_pct or self.surface_temp_k

    @property
    def all(self) -> bool:
        return self.air_temp_k and self.rh_pct and self.surface_temp_k


class QuickInput(msgspec.Struct, frozen=True, kw_only=True):
    """One room's readings in SI, as a face gathered them."""

    air_temp_c: float
    rh_pct: float
    pressure_pa: float = psychro.STANDARD_PRESSURE_PA
    surfaces: tuple[assess.SurfaceInput, ...] = ()
    outdoor: assess.OutdoorInput | None = None
    use: str | None = None  #: None: not given (the general limits apply)
    volume_m3: float | None = None
    occupants: int | None = None
    target_rh_pct: float | None = None
    mould_seen: bool = False
    mould_area_m2: float = 0.0
    accuracy: assess.Accuracy = assess.DEFAULT_ACCURACY
    accuracy_given: AccuracyGiven = AccuracyGiven()
    showers_per_day: float | None = None
    baths_per_day: float | None = None
    cooking_hours_per_day: float | None = None
    laundry_loads_per_day: float | None = None
    water_category: int | None = None
    water_standing_h: float | None = None
    water_loss_class: int | None = None
    wet_area_pct: float | None = None
    dense_materials_wet: bool = False
    drying: bool = False  #: drying equipment running (a dehumidifier at least)
    flued_appliance: bool | None = None
    #: The month to project the surfaces to (:mod:`survey.season`); None: no projection.
    design_month: season.DesignMonth | None = None
    #: How the excess is carried to the design month; None: along its class line.
    design_excess: season.ExcessModel | None = None
    warnings: tuple[str, ...] = ()


class QuickResult(msgspec.Struct, frozen=True):
    """Everything the quick check found."""

    input: QuickInput
    room: psychro.MoistAir
    outdoor: psychro.MoistAir | None
    finding: assess.RoomFinding
    advice: advise.RoomAdvice
    cautions: tuple[advise.Caution, ...]
    limits: tuple[th.Threshold, ...] = ()
    #: The surfaces in the design month, when one was given.
    colder_month: season.RoomProjection | None = None

    @property
    def use(self) -> str:
        return self.finding.use

    @property
    def use_given(self) -> bool:
        return self.input.use is not None

    @property
    def warnings(self) -> tuple[str, ...]:
        return self.input.warnings


def judge(given: QuickInput) -> QuickResult:
    """Judge one room: states, per-surface risk, the room finding, actions and cautions."""
    use = given.use or "other"
    room = psychro.state_from_rh(given.air_temp_c, given.rh_pct, given.pressure_pa)
    outdoor = (
        None
        if given.outdoor is None
        else psychro.state_from_rh(
            given.outdoor.air_temp_c, given.outdoor.rh_pct, given.pressure_pa
        )
    )
    activities = []
    if given.showers_per_day is not None:
        activities.append(
            assess.Activity("shower", given.showers_per_day * th.value("shower_minutes") / 60.0)
        )
    if given.baths_per_day is not None:
        activities.append(
            assess.Activity("bath", given.baths_per_day * th.value("bath_minutes") / 60.0)
        )
    if given.cooking_hours_per_day is not None:
        activities.append(assess.Activity("cooking", given.cooking_hours_per_day))
    observations = assess.Observations(
        visible_mould_area_m2=given.mould_area_m2,
        visible_mould=given.mould_seen,
        water_category=given.water_category,
        standing_water=given.water_category is not None,
        water_standing_h=given.water_standing_h,
        water_loss_class=given.water_loss_class,
        wet_area_pct=given.wet_area_pct,
        dense_materials_wet=given.dense_materials_wet,
        drying_in_progress=given.drying,
        drying=assess.DryingEquipment(dehumidifiers=1) if given.drying else None,
        flued_appliance=given.flued_appliance,
    )
    room_input = assess.RoomInput(
        name="Room",
        use=use,
        air_temp_c=given.air_temp_c,
        rh_pct=given.rh_pct,
        surfaces=given.surfaces,
        volume_m3=given.volume_m3,
        occupants=given.occupants,
        activities=tuple(activities),
        laundry_loads_per_day=given.laundry_loads_per_day,
        observations=observations,
    )
    site = assess.assess_site([room_input], given.outdoor, given.pressure_pa, given.accuracy)
    advice = advise.advise_site(site, given.target_rh_pct)
    finding = site.rooms[0]
    room_advice = advice.rooms[0]
    keys = set(finding.threshold_keys) | set(room_advice.threshold_keys)
    projection = None
    if given.design_month is not None:
        from survey import season  # only when a design month is asked for

        projection = season.project_room(
            finding, given.design_month, given.design_excess or season.ExcessModel.CLASS_LINE
        )
        keys |= set(projection.threshold_keys)
    return QuickResult(
        input=given,
        room=room,
        outdoor=outdoor,
        finding=finding,
        advice=room_advice,
        cautions=advice.cautions,
        limits=tuple(th.cited(keys)),
        colder_month=projection,
    )
