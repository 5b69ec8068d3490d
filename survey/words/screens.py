"""The short lines the app's live panels and lists show: a moist-air state, the highest safe
room RH, a surface's state in a line, and what a panel says before there is anything to
judge. The app lays these out; it writes no sentence of its own."""

from __future__ import annotations

import datetime as dt

from survey import assess, domain, model, psychro
from survey.safe_text import visible
from survey.words.display import Display
from survey.words.states import (
    material_rank,
    material_state_brief,
    no_limit_reason,
    point_words,
    rh_limit_text,
    short_verdict,
    surface_rank,
    surface_rh_text,
    worst_surface,
)

NO_OUTDOOR_READING = (
    "Outdoor air: give its temperature and RH to see its dew point and moisture content."
)
NO_ROOM_READING = (
    "Give the room's air temperature and RH to see its dew point, the highest safe RH and "
    "what to do."
)
NO_AIR_FOR_SURFACE = "Give the room's air reading first to judge this surface."
NO_AIR_THIS_VISIT = "no air reading on this visit"
NO_SURFACE_MEASURED = "No surface measured yet."
NOTHING_TO_DO = "Nothing to do from these readings."
HEADINGS = {
    "room_air": "Room air",
    "outdoor_air": "Outdoor air",
    "actions": "What to do",
    "cautions": "Cautions",
}


def condensation_point_line(
    state: psychro.MoistAir, d: Display, uncertainty_k: float | None = None
) -> str:
    """``Dew point 8.6 °C ± 0.6 K`` (frost point below 0 °C)."""
    name = "Frost" if state.frost_point_c is not None else "Dew"
    line = f"{name} point {d.temperature(state.condensation_point_c)}"
    return line if uncertainty_k is None else f"{line} ± {d.difference(uncertainty_k)}"


def air_state_lines(
    state: psychro.MoistAir,
    d: Display,
    uncertainty_k: float | None = None,
    pressure_pa: float | None = None,
) -> list[str]:
    """A moist-air state in a few lines: temperature and RH, its dew or frost point (with
    its uncertainty when given), humidity ratio, vapour pressure, and the pressure used."""
    lines = [
        f"{d.temperature(state.dry_bulb_c)}, {state.rh_pct:.0f} % RH",
        condensation_point_line(state, d, uncertainty_k),
        f"Humidity ratio {d('humidity_ratio', state.humidity_ratio_kg_per_kg)}",
        f"Vapour pressure {d('vapour_pressure', state.vapour_pressure_pa)}",
    ]
    if pressure_pa is not None:
        lines.append(f"Pressure used {d('pressure', pressure_pa)}")
    return lines


def safe_rh_line(finding: assess.RoomFinding) -> str | None:
    """``Highest safe room RH: 62 % (57 to 67 % at this accuracy)``, or None."""
    limit = rh_limit_text(finding)
    return None if limit is None else f"Highest safe room RH: {limit}"


def safe_rh_set_by(finding: assess.RoomFinding) -> str:
    """``Highest safe room RH: 62 % (…), set by NE corner``, or why there is none."""
    limit = rh_limit_text(finding)
    if limit is None or finding.coldest is None:
        return no_safe_rh_line(finding)
    return f"Highest safe room RH: {limit}, set by {visible(finding.coldest.label)}"


def no_safe_rh_line(finding: assess.RoomFinding) -> str:
    """Why there is no highest safe room RH, as a panel line."""
    if not finding.surfaces:
        return NO_SURFACE_MEASURED
    reason = no_limit_reason(finding)
    return f"{reason[0].upper()}{reason[1:]}: no highest safe room RH."


def safe_rh_against_room(finding: assess.RoomFinding) -> str | None:
    """The highest safe room RH beside the room's own, or None."""
    limit = rh_limit_text(finding)
    if limit is None:
        return None
    return f"Highest safe room RH {limit}; the room is at {finding.air.rh_pct:.0f} %."


def surface_line(surface: assess.SurfaceFinding, d: Display) -> str:
    """``Surface RH 91 % (86–96); margin 0.4 K ± 0.7 K`` and its verdict on a second line."""
    return (
        f"Surface RH {surface_rh_text(surface)}; margin "
        f"{d.difference(surface.dew_point_margin_k)} ± "
        f"{d.difference(surface.margin_uncertainty_k)}\n{short_verdict(surface, d)}"
    )


def surface_detail(surface: assess.SurfaceFinding, d: Display) -> str:
    """A surface in full for the line under a table whose cells are brief: ``12.6 °C,
    surface RH 99 % (91 % or more), margin 0.2 K ± 1.2 K: water may be forming; above the
    mould limit``."""
    return (
        f"{d.temperature(surface.surface_temp_c)}, surface RH {surface_rh_text(surface)}, "
        f"margin {d.difference(surface.dew_point_margin_k)} ± "
        f"{d.difference(surface.margin_uncertainty_k)}: {short_verdict(surface, d)}"
    )


def quick_surface_line(surface: assess.SurfaceFinding, d: Display) -> str:
    """``Surface 12.0 °C: surface RH 82 % (77–87); verdict``."""
    return (
        f"Surface {d.temperature(surface.surface_temp_c)}: surface RH "
        f"{surface_rh_text(surface)}; {short_verdict(surface, d)}"
    )


def surface_rh_cell(surface: assess.SurfaceFinding) -> str:
    """Surface RH for a narrow table cell, its band in brief: ``87 % (80–94)``,
    ``96 % (≥88)``, ``≥100 %`` (what forms is the state's cell, beside it)."""
    rh = surface.surface_rh_pct
    low, high = surface.surface_rh_low_pct, surface.surface_rh_high_pct
    if rh >= 100.0:
        return "≥100 %"
    if rh >= 99.5:  # not "100 %" beside "≥100 %" for a surface that is not there yet
        return f"{rh:.1f} %"
    if f"{low:.0f}" == f"{min(high, 100.0):.0f}" == f"{rh:.0f}":
        return f"{rh:.0f} %"
    if high >= 100.0:
        return f"{rh:.0f} % (≥{low:.0f})"
    return f"{rh:.0f} % ({low:.0f}–{high:.0f})"


def surface_state_words(surface: assess.SurfaceFinding, d: Display) -> str:
    """A surface's state in a few words, for a table cell: what forms, else mould."""
    parts = short_verdict(surface, d).split("; ")
    if surface.condensation is assess.CondensationState.CLEAR and len(parts) > 1:
        return parts[1]
    return parts[0]


def worst_state_words(finding: assess.RoomFinding, d: Display) -> str:
    """The room's worst finding in a few words: its worst surface's state (see
    :func:`surface_state_words`), or its wettest material reading's where that ranks
    higher (so the words agree with the room's symbol, which counts both)."""
    worst = worst_surface(finding.surfaces)
    ranked = [(r, m) for m in finding.materials if (r := material_rank(m)) is not None]
    wettest = max(ranked, key=lambda pair: pair[0], default=None)
    if wettest is not None and (worst is None or wettest[0] > surface_rank(worst)):
        count = sum(1 for r, _ in ranked if r == wettest[0])
        m = wettest[1]
        said = f"{point_words('material', visible(m.material))} {material_state_brief(m)}"
        return said if count == 1 else f"{said} (and {count - 1} more)"
    return "no surface measured" if worst is None else surface_state_words(worst, d)


# --- points of an earlier visit left out -------------------------------------------------

#: What became of a point not read on this visit, as the app offers it: (words, for good).
LEFT_OUT_CHOICES = (
    ("gone for good: removed or replaced, not read again", True),
    ("not read this visit: offered again next visit", False),
)


def left_out_brief(point: model.LeftOut) -> str:
    """A point left out, in a table cell: what became of it (the reason is in the line
    under the table)."""
    return "gone for good" if point.for_good else "again next visit"


def left_out_detail(point: model.LeftOut) -> str:
    """A point left out, in full: why, and whether it is offered again."""
    why = point.reason or "no reason given"
    then = "gone for good, not offered again" if point.for_good else "offered again next visit"
    return f"left out ({why}); {then}"


LEAVE_OUT_NOTE = (
    "The point stays in the record as left out, with its reason, and the report lists it. "
    "To read it after all, press Enter on it; d puts it back to read."
)


# --- the room's tables of points -----------------------------------------------------------

TO_READ_CELL = "to read"
READ_BEFORE_CELL = "read before"
LEFT_OUT_CELL = "left out"  #: a point not read on a visit, for a reason recorded
NO_AIR_CELL = "no air reading"
NO_AIR_DETAIL = "no air reading yet"
DRY_STANDARD_CELL = "dry standard"
DRY_STANDARD_DETAIL = "the dry standard for this material"
NOT_JUDGED_DETAIL = "not judged yet (the room's air reading is needed)"


def to_read_detail(last: str) -> str:
    """A point offered to this visit and not read yet, with its value when last read."""
    return f"to read this visit; last read {last}"


def leave_out_title(kind: model.PointKind, location: str, material: str) -> str:
    return f"Leave out the {point_words(kind, material)} at {location}"


LEAVE_OUT_WHAT = "What became of it"
LEAVE_OUT_WHY = "Why (e.g. plaster stripped out, behind a wardrobe today)"


def left_out_status(location: str) -> str:
    return f"Left out {location} — d on it puts it back to read."


def back_to_read_status(location: str) -> str:
    return f"{location} is to read again — u leaves it out again."


def left_again_status(location: str) -> str:
    return f"Left out {location} again."


def read_since_status(location: str) -> str:
    return f"{location} was read since, so it is not left out again."


def read_again_since_status(location: str) -> str:
    return f"{location} was read again since; the reading deleted is not put back."


def read_again_title(kind: model.PointKind) -> str:
    return f"Read again the {'surface' if kind == 'surface' else 'point'} measured before"


# --- warnings on values taken ----------------------------------------------------------------


def surface_temp_warning(value_c: float, air_c: float | None, d: Display) -> str:
    """A possible but unlikely surface temperature, said so ("" for a likely one)."""
    if air_c is not None and value_c > air_c + 5.0:
        return (
            f"warmer than the room air ({d.temperature(air_c)}) by more than "
            f"{d.difference(5.0)}: a heater, a hot pipe or sun on the wall?"
        )
    if value_c > domain.SURFACE_TEMP_WARN_HIGH_C:
        return (
            f"above {d.temperature(domain.SURFACE_TEMP_WARN_HIGH_C)}: a heater, a hot pipe, "
            "a lamp or sun on it? Check the reading"
        )
    if value_c < domain.SURFACE_TEMP_WARN_LOW_C:
        return (
            f"below {d.temperature(domain.SURFACE_TEMP_WARN_LOW_C)}: an infrared reading off a "
            "shiny surface reads wrong; check it, or tape the spot and read the tape"
        )
    return ""


def per_day_warning(value: float | None, warn_above: float) -> str:
    """A moisture source a day past its usual range, said so ("" within it)."""
    if value is None or value <= warn_above:
        return ""
    return f"Saved; more than {warn_above:g} a day is unusual: a slip, or a shared room?"


CHECK_BEFORE_SAVING = (
    "Check the value above before saving: Enter again saves it as it is, Escape leaves "
    "without saving."
)


# --- a visit's start moved -------------------------------------------------------------------


def span_text(by: dt.timedelta) -> str:
    """A length of time in days, hours and minutes: "1 day 2 h", "10 min"."""
    minutes = round(abs(by.total_seconds()) / 60)
    days, rest = divmod(minutes, 24 * 60)
    hours, minutes = divmod(rest, 60)
    parts = [f"{days} day{'s' if days != 1 else ''}"] if days else []
    parts += [f"{hours} h"] if hours else []
    parts += [f"{minutes} min"] if minutes or not parts else []
    return " ".join(parts)


def move_readings_question(count: int, by: dt.timedelta) -> str:
    """Whether a visit's readings move with its start (the readings were typed in later,
    or the start was mistyped), or keep the times they carry."""
    way = "later" if by > dt.timedelta(0) else "earlier"
    return (
        f"The visit now begins {span_text(by)} {way}. Move the times of its {count} "
        f"reading{'s' if count != 1 else ''} by the same? y: they were taken then too "
        "(drying rates use these times); n: keep the times they carry."
    )


def readings_moved_status(count: int, by: dt.timedelta) -> str:
    way = "later" if by > dt.timedelta(0) else "earlier"
    return f"Moved the times of {count} reading{'s' if count != 1 else ''} {span_text(by)} {way}."


def readings_not_moved_status(problem: str) -> str:
    return f"The readings' times were not moved: {problem}."


def as_sentence(phrase: str) -> str:
    """A warning phrase (as a field shows it after "saved; ") as a sentence of its own."""
    return phrase[:1].upper() + phrase[1:] + "."


def untimed_reading_warning(hours: float, started_at: dt.datetime) -> str:
    """A reading saved without the clock's time, the clock being ``hours`` from the visit's
    start (after it, or before it when negative)."""
    size = abs(hours)
    when = f"{size / 24:,.0f} days" if size > 48 else f"{size:.0f} h"
    way = "after this visit began" if hours > 0 else "before this visit begins"
    return (
        f"no time kept: the clock is {when} {way} ({started_at:%Y-%m-%d %H:%M}), so "
        "it counts as taken at the visit's start; if this is a later visit, F3 then F7 "
        "starts one"
    )
