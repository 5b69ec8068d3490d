"""The room's details beyond use, volume and occupants: storey, floor area and height, the
moisture it makes (showers, baths, cooking, laundry), an open-flued appliance, and on this
visit whether the heating was on and the windows open.

The room screen yields these fields and routes their changes; the details of the room are
kept in :class:`survey.model.Room`, those of the visit in :class:`survey.model.RoomVisit`.
"""

from __future__ import annotations

from survey import domain, model
from survey.app import walk
from survey.app.fields import Choice, Field
from survey.words import screens

#: Select ids whose value is a yes / no / not recorded flag: id -> (record, field, label).
FLAG_SELECTS = {
    "room-flued": ("room", "flued_appliance", "Flued appliance"),
    "visit-heating": ("visit", "heating_on", "Heating on"),
    "visit-windows": ("visit", "windows_open", "Windows open"),
}

#: Moisture sources per day: (field, label, placeholder).
_PER_DAY = (
    ("showers_per_day", "Showers/day", "not said: usual for the use"),
    ("baths_per_day", "Baths/day", "e.g. 1"),
    ("cooking_hours_per_day", "Cooking h/day", "e.g. 1.5"),
    ("laundry_loads_per_day", "Laundry loads/day", "loads dried indoors, e.g. 1"),
)


def _per_day(commit, warn_above: float):
    """Commit a moisture source a day, with a warning (not a refusal) above ``warn_above``."""

    def run(value: float | None) -> str:
        said = commit(value)  # raises InputError for a value the record refuses
        return screens.per_day_warning(value, warn_above) or said

    return run


def _shown(value: float | None) -> str:
    return "" if value is None else f"{value:g}"


def room_fields(screen, room: model.Room, system: str, ro: bool):
    """The room's own details (kept across visits)."""
    yield Field(
        "Storey",
        "" if room.level is None else str(room.level),
        walk.optional(walk.whole("Storey")),
        screen._set_room("level", "Storey"),
        id="room-level",
        placeholder="not given: 0 ground, 1 first, -1 basement",
        disabled=ro,
    )
    yield Field(
        "Floor area m²" if system == "si" else "Floor area ft²",
        walk.shown("area", room.floor_area_m2, system),
        walk.optional(walk.area("Floor area", system)),
        screen._set_room("floor_area_m2", "Floor area"),
        id="room-floor-area",
        placeholder="not given",
        disabled=ro,
    )
    yield Field(
        "Height m" if system == "si" else "Height ft",
        walk.shown("length", room.height_m, system),
        walk.optional(walk.length("Room height", system)),
        screen._set_room("height_m", "Room height"),
        id="room-height",
        placeholder="not given",
        disabled=ro,
    )
    for name, label, hint in _PER_DAY:
        yield Field(
            label,
            _shown(getattr(room, name)),
            walk.optional(walk.number(label)),
            _per_day(screen._set_room(name, label), domain.PER_DAY_WARN[name]),
            id=f"room-{name.replace('_', '-')}",
            placeholder=hint,
            disabled=ro,
        )
    yield _flag("room-flued", room.flued_appliance, ro)


def visit_fields(record: model.RoomVisit | None, ro: bool):
    """What this visit found of the heating and the windows."""
    yield _flag("visit-heating", record.heating_on if record else None, ro)
    yield _flag("visit-windows", record.windows_open if record else None, ro)


def _flag(select_id: str, value: bool | None, ro: bool):
    label = FLAG_SELECTS[select_id][2]
    return walk.labelled(
        label,
        Choice(
            walk.YES_NO,
            value=walk.yes_no_choice(value),
            allow_blank=False,
            compact=True,
            id=select_id,
            disabled=ro,
        ),
    )


def flag_changed(screen, select_id: str, choice: object) -> None:
    """Commit a yes / no / not recorded choice, when it changed."""
    where, name, label = FLAG_SELECTS[select_id]
    value = walk.yes_no_value(choice)
    if where == "room":
        if getattr(screen.room, name) != value:
            screen._set_room(name, label)(value)
        return
    record = screen.record()
    if (getattr(record, name) if record else None) != value:
        screen._set_record(name, label)(value)
