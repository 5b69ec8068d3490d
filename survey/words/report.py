"""The site report's own words: headings, labels, scope, method, safety, glossary, and the
sentences about readings that only the report prints.

Plain strings, no Markdown (the report package escapes and lays them out); numbers written
in a :class:`~survey.words.display.Display`'s units. Findings, actions and cautions are
the other words modules' (:func:`survey.words.action_reason`, :func:`~survey.words.
caution_text` …); this module adds what a report around them needs.
"""

from __future__ import annotations

import datetime as dt
from collections.abc import Sequence

from survey import model
from survey.assess import RoomFinding, SurfaceFinding
from survey.words.cautions import CAUTION_NAMES as CAUTION_NAMES
from survey.words.display import Display
from survey.words.report_end import (
    DEFERRAL as DEFERRAL,
)
from survey.words.report_end import (
    GENERAL_CAUTIONS as GENERAL_CAUTIONS,
)
from survey.words.report_end import (
    GENERAL_LEAD as GENERAL_LEAD,
)
from survey.words.report_end import (
    LIMITS_INTRO as LIMITS_INTRO,
)
from survey.words.report_end import (
    SAFETY_INTRO as SAFETY_INTRO,
)
from survey.words.report_end import (
    SAFETY_NONE as SAFETY_NONE,
)
from survey.words.report_end import (
    accuracy_method_text as accuracy_method_text,
)
from survey.words.report_end import (
    accuracy_used_text as accuracy_used_text,
)
from survey.words.report_end import (
    applies_to as applies_to,
)
from survey.words.report_end import (
    glossary as glossary,
)
from survey.words.report_end import (
    method_items as method_items,
)
from survey.words.report_end import (
    names_list as names_list,
)
from survey.words.report_room import (
    _SCALE_WORDS as _SCALE_WORDS,
)
from survey.words.report_room import (
    DRY_STANDARD_BASIS as DRY_STANDARD_BASIS,
)
from survey.words.report_room import (
    EQUIPMENT_WORDS as EQUIPMENT_WORDS,
)
from survey.words.report_room import (
    JUDGED_HEADER as JUDGED_HEADER,
)
from survey.words.report_room import (
    MATERIAL_HEADER as MATERIAL_HEADER,
)
from survey.words.report_room import (
    NO_ACTIONS as NO_ACTIONS,
)
from survey.words.report_room import (
    NO_SURFACES as NO_SURFACES,
)
from survey.words.report_room import (
    NOTES_LABELS as NOTES_LABELS,
)
from survey.words.report_room import (
    NOTHING_SEEN as NOTHING_SEEN,
)
from survey.words.report_room import (
    ODOUR_WORDS as ODOUR_WORDS,
)
from survey.words.report_room import (
    READING_LABELS as READING_LABELS,
)
from survey.words.report_room import (
    READINGS_HEADER as READINGS_HEADER,
)
from survey.words.report_room import (
    SURFACE_HEADER as SURFACE_HEADER,
)
from survey.words.report_room import (
    against_text as against_text,
)
from survey.words.report_room import (
    apart_text as apart_text,
)
from survey.words.report_room import (
    class_text as class_text,
)
from survey.words.report_room import (
    dry_standard_reading as dry_standard_reading,
)
from survey.words.report_room import (
    dry_standard_text as dry_standard_text,
)
from survey.words.report_room import (
    dry_standards_text as dry_standards_text,
)
from survey.words.report_room import (
    emc_text as emc_text,
)
from survey.words.report_room import (
    equipment_text as equipment_text,
)
from survey.words.report_room import (
    excess_text as excess_text,
)
from survey.words.report_room import (
    factor_cell as factor_cell,
)
from survey.words.report_room import (
    margin_cell as margin_cell,
)
from survey.words.report_room import (
    max_rh_text as max_rh_text,
)
from survey.words.report_room import (
    photo_caption as photo_caption,
)
from survey.words.report_room import (
    photo_missing as photo_missing,
)
from survey.words.report_room import (
    point_label as point_label,
)
from survey.words.report_room import (
    reading_text as reading_text,
)
from survey.words.report_room import (
    reference_room_name as reference_room_name,
)
from survey.words.report_room import (
    rh_text as rh_text,
)
from survey.words.report_room import (
    room_cautions_text as room_cautions_text,
)
from survey.words.report_room import (
    room_facts as room_facts,
)
from survey.words.report_room import (
    room_heading as room_heading,
)
from survey.words.report_room import (
    seen_lines as seen_lines,
)
from survey.words.report_room import (
    timber_text as timber_text,
)
from survey.words.report_room import (
    with_band as with_band,
)
from survey.words.states import point_words

HEADINGS = {
    "summary": "In short",
    "scope": "What was inspected",
    "instruments": "Instruments",
    "conditions": "Conditions on the day",
    "rooms": "Room by room",
    "readings": "Readings",
    "surfaces": "Surfaces",
    "materials": "Moisture in materials",
    "left_out": "Not read on this visit",
    "seen": "What was seen",
    "photos": "Photos",
    "actions": "What to do",
    "drying": "Drying progress",
    "safety": "Safety",
    "method": "How the findings were worked out",
    "limits": "Limits used",
    "glossary": "Terms used",
}

_MONTHS = (
    "January",
    "February",
    "March",
    "April",
    "May",
    "June",
    "July",
    "August",
    "September",
    "October",
    "November",
    "December",
)


def title(reference: str) -> str:
    return f"Condition report: {reference}"


def generated_line(generated_at: str, source_name: str) -> str:
    return f"Written {generated_at} by condition-survey from the survey file {source_name}."


def date_text(when: dt.date | dt.datetime) -> str:
    """'15 January 2025, 09:40' (or without the time for a date), the same in every locale."""
    day = f"{when.day} {_MONTHS[when.month - 1]} {when.year}"
    if isinstance(when, dt.datetime):
        return f"{day}, {when:%H:%M}"
    return day


def visit_heading(number: int, count: int, label: str, started_at: dt.datetime) -> str:
    what = f"Visit {number} of {count}" if count > 1 else "The visit"
    return (
        f"{what}: {label}, {date_text(started_at)}" if label else f"{what}: {date_text(started_at)}"
    )


# --- title block -----------------------------------------------------------------------------

PURPOSE_WORDS = {
    "damp_complaint": "damp, condensation or mould reported by the occupant",
    "drying_check": "checking the drying of the building after water damage",
    "pre_purchase": "condition survey before a purchase or lease",
    "pre_coating": "conditions before painting, coating or flooring work",
    "routine": "routine or follow-up inspection",
    "other": "other",
}

TITLE_LABELS = {
    "reference": "Site",
    "address": "Address",
    "client": "Client",
    "purpose": "Purpose",
    "visits": "Visits",
    "inspector": "Inspector",
    "construction": "Construction",
    "year_built": "Built",
    "units": "Units",
}


def units_text(d: Display) -> str:
    if d.ip:
        return "US customary (°F, inHg, ft, gr/lb); relative humidity in %"
    return "SI (°C, hPa, m, g/kg); relative humidity in %"


def visits_text(started: Sequence[dt.datetime], shown: Sequence[int]) -> str:
    """The visit dates, saying which this report covers when it is not all of them."""
    dates = "; ".join(date_text(s) for s in started)
    if len(shown) == len(started) or not started:
        return dates or "none recorded yet"
    numbers = ", ".join(str(n) for n in shown)
    return f"{dates} (this report covers visit {numbers})"


INSTRUMENT_HEADER = ("Instrument", "Kind", "Serial", "Accuracy", "Calibrated")
INSTRUMENT_KIND_WORDS = {
    "thermo_hygrometer": "thermo-hygrometer",
    "surface_thermometer": "surface thermometer",
    "moisture_meter": "moisture meter",
    "data_logger": "data logger",
    "combined_meter": "combined meter",
    "other": "other",
}


def instrument_accuracy_text(
    air_k: float | None,
    rh_pct: float | None,
    surface_k: float | None,
    moisture: float | None,
    d: Display,
) -> str:
    parts = []
    if air_k is not None:
        parts.append(f"air ±{d.difference(air_k)}")
    if rh_pct is not None:
        parts.append(f"RH ±{rh_pct:g} %")
    if surface_k is not None:
        parts.append(f"surface ±{d.difference(surface_k)}")
    if moisture is not None:
        parts.append(f"moisture ±{moisture:g} on the meter's scale")
    return ", ".join(parts) or "not stated"


def calibration_text(on: dt.date | None) -> str:
    return "not recorded" if on is None else date_text(on)


NO_INSTRUMENTS = (
    "No instruments are listed in the survey; the typical accuracies below were assumed."
)


# --- scope -----------------------------------------------------------------------------------


def rooms_entered_text(names: Sequence[str]) -> str:
    return (
        "Rooms entered and measured: " + ", ".join(names) + "."
        if names
        else "No room was measured on this visit."
    )


def rooms_not_measured_text(names: Sequence[str]) -> str:
    return "Entered but the air was not measured, so not judged: " + ", ".join(names) + "."


def rooms_not_entered_text(names: Sequence[str]) -> str:
    if not names:
        return "Every room listed in the survey was entered."
    return (
        "Rooms in the survey that were not entered, so nothing is said about them: "
        + ", ".join(names)
        + "."
    )


def _left_out_item(point: model.LeftOut) -> str:
    what = point_words(point.kind, point.material)
    why = f": {point.reason}" if point.reason else ""
    then = "gone for good" if point.for_good else "to read at the next visit"
    return f"{point.location} ({what}, {then}{why})"


def points_left_out_text(items: Sequence[tuple[str, model.LeftOut]]) -> str:
    """The points of an earlier visit not read on this one, each with its room and why."""
    said = "; ".join(f"{room}, {_left_out_item(point)}" for room, point in items)
    return f"Points measured before and not read on this visit: {said}."


def room_points_left_out_text(points: Sequence[model.LeftOut]) -> str:
    """A room's points measured before and not read on this visit, under their heading."""
    said = "; ".join(_left_out_item(point) for point in points)
    return f"Measured on an earlier visit: {said}."


NOT_COVERED = (
    "Not covered: hidden cavities, voids and the inside of walls, floors and roofs were not "
    "opened up; there was no destructive testing (no drilling, no lifting of floor coverings "
    "or linings); no samples were taken for mould, asbestos or lead; heating, ventilation, "
    "electrics, plumbing and drainage were not tested. Damp or mould in places that were "
    "not seen cannot be ruled out."
)
SPOT_READINGS = (
    "The readings are spot readings: they show the conditions at the time stated, not over "
    "a season. Humidity and surface temperatures change with the weather, the heating and "
    "the way the rooms are used."
)
NO_VISITS = "No visit has been recorded in this survey yet, so there are no findings."


# --- summary ---------------------------------------------------------------------------------


def summary_as_of(heading: str) -> str:
    """Which visit the summary describes, when the survey has several."""
    return f"As found on the last visit this report covers ({heading})."


SUMMARY_FINDINGS = "What was found"
SUMMARY_ACTIONS = "What matters most"
SUMMARY_NO_FINDINGS = "No measured surface is condensing, near the dew point or at the mould limit."
SUMMARY_NO_ACTIONS = "Nothing needs doing from these readings."
SUMMARY_MORE = "More in each room's section below."


def surface_summary(surface: SurfaceFinding, verdict: str, d: Display) -> str:
    return f"{surface.label} ({d.temperature(surface.surface_temp_c)}): {verdict}."


def more_surfaces_summary(count: int) -> str:
    return f"{count} more surface{'s' if count != 1 else ''} of concern in the room's section."


def mould_seen_summary(area_m2: float, d: Display) -> str:
    if area_m2 > 0.0:
        return f"Visible mould, about {d.area(area_m2)}."
    return "Visible mould (area not measured)."


def wet_materials_summary(count: int) -> str:
    return f"{count} material reading{'s' if count != 1 else ''} above the dry standard."


def rh_summary(finding: RoomFinding, limit_text: str) -> str:
    return (
        f"The room is at {finding.air.rh_pct:.0f} % RH; the highest it can be held at "
        f"without mould or condensation risk on its coldest wall, ceiling or floor is "
        f"{limit_text}."
    )


def action_summary(parts: Sequence[tuple[str, str]]) -> str:
    """The room's first actions, each with its headline number: 'Find the moisture source;
    then Ventilate, about 21 m³/h (0.8 air changes an hour).'"""
    said = [
        (title_text if i == 0 else title_text[:1].lower() + title_text[1:])
        + (f", {numbers}" if numbers else "")
        for i, (title_text, numbers) in enumerate(parts)
    ]
    return sentence("; then ".join(said))


# --- conditions ------------------------------------------------------------------------------

CONDITIONS_HEADER = (
    "Where",
    "Air temperature",
    "RH",
    "Dew or frost point",
    "Humidity ratio",
    "Vapour pressure",
)
OUTDOORS = "Outdoors"


def sentence(text: str) -> str:
    """``text`` ending with a full stop (unless it already ends a sentence)."""
    text = text.strip()
    return text if not text or text[-1] in ".!?" else text + "."


def lead_in(title_text: str) -> str:
    """A bold lead-in before a paragraph: an action's title, a term, a method's name."""
    return sentence(title_text)


def weather_text(weather: str) -> str:
    return sentence(f"Weather: {weather}") if weather.strip() else "Weather: not recorded."


def pressure_text(pressure_pa: float, basis: str, d: Display) -> str:
    words = {
        "visit": "measured on this visit",
        "site": "measured at the site",
        "altitude": "standard atmosphere at the site's altitude",
        "sea_level": "standard sea-level pressure (no altitude or pressure given)",
    }
    return f"Air pressure used: {d('pressure', pressure_pa)}, {words[basis]}."


def outdoor_missing_text() -> str:
    return (
        "No outdoor reading on this visit: whether outdoor air can dry the rooms, and the "
        "temperature factors, could not be judged."
    )


def logger_before_text(
    source: str,
    count: int,
    start: dt.datetime,
    end: dt.datetime,
    low_c: float,
    high_c: float,
    low_rh: float,
    high_rh: float,
    d: Display,
) -> str:
    return (
        f"Outdoor logger {source}, the days before: {count} readings from "
        f"{date_text(start)} to {date_text(end)}, {d.temperature(low_c)} to "
        f"{d.temperature(high_c)}, {low_rh:.0f} to {high_rh:.0f} % RH."
    )
