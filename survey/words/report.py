"""The site report's own words: headings, labels, scope, method, safety, glossary, and the
sentences about readings that only the report prints.

Plain strings, no Markdown (the report package escapes and lays them out); numbers written
in a :class:`~survey.words.display.Display`'s units. Findings, actions and cautions are
the other words modules' (:func:`survey.words.action_reason`, :func:`~survey.words.
caution_text` …); this module adds what a report around them needs.
"""

from __future__ import annotations

import datetime as dt
from typing import Iterable, Sequence

from survey import psychro
from survey import thresholds as th
from survey.assess import FactorState, MaterialFinding, RoomFinding, SurfaceFinding
from survey.words.display import Display, round_down_rh
from survey.words.states import (
    DRY_STANDARD_WORDS,
    TIMBER_WORDS,
    USE_PHRASE,
    humidity_class_range_text,
    humidity_class_text,
)

HEADINGS = {
    "summary": "In short",
    "scope": "What was inspected",
    "instruments": "Instruments",
    "conditions": "Conditions on the day",
    "rooms": "Room by room",
    "readings": "Readings",
    "surfaces": "Surfaces",
    "materials": "Moisture in materials",
    "seen": "What was seen",
    "photos": "Photos",
    "actions": "What to do",
    "drying": "Drying progress",
    "safety": "Safety",
    "method": "How the findings were worked out",
    "limits": "Limits used",
    "glossary": "Terms used",
}

_MONTHS = ("January", "February", "March", "April", "May", "June", "July", "August",
           "September", "October", "November", "December")


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
    return f"{what}: {label}, {date_text(started_at)}" if label else \
        f"{what}: {date_text(started_at)}"


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
    "reference": "Site", "address": "Address", "client": "Client", "purpose": "Purpose",
    "visits": "Visits", "inspector": "Inspector", "construction": "Construction",
    "year_built": "Built", "units": "Units",
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
    "thermo_hygrometer": "thermo-hygrometer", "surface_thermometer": "surface thermometer",
    "moisture_meter": "moisture meter", "data_logger": "data logger",
    "combined_meter": "combined meter", "other": "other",
}


def instrument_accuracy_text(air_k: float | None, rh_pct: float | None,
                             surface_k: float | None, moisture: float | None,
                             d: Display) -> str:
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


NO_INSTRUMENTS = ("No instruments are listed in the survey; the typical accuracies below "
                  "were assumed.")


# --- scope -----------------------------------------------------------------------------------

def rooms_entered_text(names: Sequence[str]) -> str:
    return ("Rooms entered and measured: " + ", ".join(names) + "." if names
            else "No room was measured on this visit.")


def rooms_not_measured_text(names: Sequence[str]) -> str:
    return ("Entered but the air was not measured, so not judged: " + ", ".join(names) + ".")


def rooms_not_entered_text(names: Sequence[str]) -> str:
    if not names:
        return "Every room listed in the survey was entered."
    return ("Rooms in the survey that were not entered, so nothing is said about them: "
            + ", ".join(names) + ".")


NOT_COVERED = (
    "Not covered: hidden cavities, voids and the inside of walls, floors and roofs were not "
    "opened up; there was no destructive testing (no drilling, no lifting of floor coverings "
    "or linings); no samples were taken for mould, asbestos or lead; heating, ventilation, "
    "electrics, plumbing and drainage were not tested. Damp or mould in places that were "
    "not seen cannot be ruled out.")
SPOT_READINGS = (
    "The readings are spot readings: they show the conditions at the time stated, not over "
    "a season. Humidity and surface temperatures change with the weather, the heating and "
    "the way the rooms are used.")
NO_VISITS = "No visit has been recorded in this survey yet, so there are no findings."


# --- summary ---------------------------------------------------------------------------------

def summary_as_of(heading: str) -> str:
    """Which visit the summary describes, when the survey has several."""
    return f"As found on the last visit this report covers ({heading})."


SUMMARY_FINDINGS = "What was found"
SUMMARY_ACTIONS = "What matters most"
SUMMARY_NO_FINDINGS = ("No measured surface is condensing, near the dew point or at the "
                       "mould limit.")
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
    return (f"The room is at {finding.air.rh_pct:.0f} % RH; the highest it can be held at "
            f"without mould or condensation risk on its coldest wall, ceiling or floor is "
            f"{limit_text}.")


def action_summary(parts: Sequence[tuple[str, str]]) -> str:
    """The room's first actions, each with its headline number: 'Find the moisture source;
    then Ventilate, about 21 m³/h (0.8 air changes an hour).'"""
    said = [(title_text if i == 0 else title_text[:1].lower() + title_text[1:])
            + (f", {numbers}" if numbers else "") for i, (title_text, numbers) in enumerate(parts)]
    return sentence("; then ".join(said))


# --- conditions ------------------------------------------------------------------------------

CONDITIONS_HEADER = ("Where", "Air temperature", "RH", "Dew or frost point", "Humidity ratio",
                     "Vapour pressure")
OUTDOORS = "Outdoors"


def reference_room_name(name: str) -> str:
    return f"{name} (reference room)"


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
    words = {"visit": "measured on this visit", "site": "measured at the site",
             "altitude": "standard atmosphere at the site's altitude",
             "sea_level": "standard sea-level pressure (no altitude or pressure given)"}
    return f"Air pressure used: {d('pressure', pressure_pa)}, {words[basis]}."


def outdoor_missing_text() -> str:
    return ("No outdoor reading on this visit: whether outdoor air can dry the rooms, and the "
            "temperature factors, could not be judged.")


def logger_before_text(source: str, count: int, start: dt.datetime, end: dt.datetime,
                       low_c: float, high_c: float, low_rh: float, high_rh: float,
                       d: Display) -> str:
    return (f"Outdoor logger {source}, the days before: {count} readings from "
            f"{date_text(start)} to {date_text(end)}, {d.temperature(low_c)} to "
            f"{d.temperature(high_c)}, {low_rh:.0f} to {high_rh:.0f} % RH.")


# --- a room ----------------------------------------------------------------------------------

def room_heading(name: str, reference: bool) -> str:
    return reference_room_name(name) if reference else name


def room_facts(use: str, level: int, volume_m3: float | None, occupants: int,
               d: Display) -> str:
    phrase = USE_PHRASE.get(use) or "a room of unstated use"
    parts = [f"Used as {phrase}", f"level {level}"]
    parts.append("volume not given" if volume_m3 is None else f"volume {d('volume', volume_m3)}")
    parts.append("no usual occupants" if occupants == 0
                 else f"{occupants} usual occupant{'s' if occupants != 1 else ''}")
    return "; ".join(parts) + "."


READINGS_HEADER = ("Reading", "Value")
READING_LABELS = {
    "air_temp": "Air temperature", "rh": "Relative humidity",
    "dew_point": "Dew point", "frost_point": "Frost point",
    "humidity_ratio": "Humidity ratio", "excess": "Vapour pressure against outdoors",
    "class": "Humidity class (EN ISO 13788)", "max_rh": "Highest safe room RH",
    "apart": "Glazing, frames and pipes", "emc": "Timber in this air settles at",
    "accuracy": "Instrument accuracy used",
}


def rh_text(rh_pct: float) -> str:
    """A measured relative humidity: '72.0 %'."""
    return f"{rh_pct:.1f} %"


def point_label(point_c: float) -> str:
    """'Frost point' for a condensation point below 0 °C, else 'Dew point'."""
    return "frost_point" if point_c < psychro.TRIPLE_POINT_C else "dew_point"


def with_band(value: str, band: str) -> str:
    return f"{value} ± {band}"


def excess_text(excess_pa: float, band_pa: float, d: Display) -> str:
    """'840 Pa more than outdoors (± 60 Pa)', or 'less than' when the room air is drier."""
    more = "more" if excess_pa >= 0.0 else "less"
    return (f"{d('vapour_pressure', abs(excess_pa))} {more} than outdoors "
            f"(± {d('vapour_pressure', band_pa)})")


def class_text(finding: RoomFinding) -> str:
    if finding.outdoor is None:
        return "not judged (no outdoor reading)"
    number = finding.humidity_class
    text = humidity_class_text(number)
    if number is None:
        return text
    if len(finding.humidity_class_possible) > 1:
        text += f" ({humidity_class_range_text(finding.humidity_class_possible)} at this accuracy)"
    return text


def max_rh_text(limit_text: str, coldest: str, temp: str) -> str:
    return f"{limit_text}, set by {coldest} at {temp}"


def apart_text(label: str, dry_pct: float) -> str:
    if dry_pct >= 100.0:
        return f"the coldest, {label}, stays clear of condensation at any room RH"
    return (f"the coldest, {label}, stays clear of condensation while the room is below "
            f"{round_down_rh(dry_pct)} % RH")


def emc_text(emc_pct: float) -> str:
    return f"about {emc_pct:.1f} % moisture content (Wood Handbook eqn 4-5)"


def accuracy_used_text(air_k: float, rh_pct: float, surface_k: float, d: Display) -> str:
    return (f"air ±{d.difference(air_k)}, RH ±{rh_pct:g} %, surface "
            f"±{d.difference(surface_k)}")


SURFACE_HEADER = ("Surface", "Kind", "Material", "Temperature", "Surface RH",
                  "Margin to dew/frost point", "Temperature factor")
JUDGED_HEADER = ("Surface", "Condensation", "Mould growth", "Temperature factor")
NO_SURFACES = "No surface was measured in this room."


def factor_cell(surface: SurfaceFinding) -> str:
    if surface.temperature_factor is None:
        return ("not used" if surface.temperature_factor_state is FactorState.NOT_FOR_ELEMENT
                else "–")
    return (f"{surface.temperature_factor:.2f} ± {surface.temperature_factor_uncertainty:.2f} "
            f"(limit {surface.temperature_factor_limit:.2f})")


def margin_cell(surface: SurfaceFinding, d: Display) -> str:
    return (d("temperature_difference", surface.margin_k, unit=False) + " ± "
            + d.difference(surface.margin_uncertainty_k))


MATERIAL_HEADER = ("Location", "Material", "Reading", "Dry standard", "Against the dry standard",
                   "Timber")
_SCALE_WORDS = {"mc_pct": "% MC", "wme_pct": "% WME", "relative": "(meter's relative scale)"}


def reading_text(value: float, scale: str) -> str:
    return f"{value:g} {_SCALE_WORDS[scale]}"


def dry_standard_text(m: MaterialFinding) -> str:
    return "–" if m.dry_standard is None else reading_text(m.dry_standard, m.scale)


def against_text(m: MaterialFinding) -> str:
    return DRY_STANDARD_WORDS[m.dry_standard_state]


def timber_text(m: MaterialFinding) -> str:
    if m.timber_state is None:
        return "–"
    text = TIMBER_WORDS[m.timber_state]
    if m.emc_pct is not None:
        text += f"; the room air alone would give about {m.emc_pct:.1f} %"
    if m.wetter_than_air_explains:
        text += ": wetter than the air explains"
    if m.decay_slowed_by_temperature:
        text += "; decay is slow at today's temperature, not stopped"
    return text


def dry_standard_reading(location: str, material: str, value: float, scale: str) -> str:
    return f"{location} ({material}) {reading_text(value, scale)}"


def dry_standards_text(readings: Sequence[str]) -> str:
    return "Dry-standard readings taken here: " + "; ".join(readings) + "."


DRY_STANDARD_BASIS = ("The dry standard is a reading of the same material, on the same "
                      f"scale, in an unaffected part of the same room or of a reference room; "
                      f"a reading within {th.value('dry_standard_tolerance_fraction') * 100:.0f} "
                      "% of it counts as dry.")

# What was seen
ODOUR_WORDS = {"none": "no odour", "musty": "a musty smell", "earthy": "an earthy smell",
               "sewage": "a sewage smell", "chemical": "a chemical smell",
               "other": "an unusual smell"}
EQUIPMENT_WORDS = {
    "refrigerant_dehumidifier": "refrigerant dehumidifier",
    "desiccant_dehumidifier": "desiccant dehumidifier", "air_mover": "air mover",
    "heater": "heater", "extract_fan": "extract fan", "air_scrubber": "air scrubber",
    "other": "equipment",
}


def seen_lines(mould: bool, area_m2: float | None, staining: bool, condensation: bool,
               odour: str | None, water_category: int | None, heating_on: bool | None,
               windows_open: bool | None, d: Display) -> list[str]:
    lines = []
    if mould:
        lines.append("Visible mould" + (f", about {d.area(area_m2)} in all." if area_m2
                                        else ", area not measured."))
    if staining:
        lines.append("Staining.")
    if condensation:
        lines.append("Condensation seen.")
    if odour is not None:
        lines.append(ODOUR_WORDS[odour].capitalize() + ".")
    if water_category is not None:
        lines.append(f"Category {water_category} water.")
    if heating_on is not None:
        lines.append("Heating on." if heating_on else "Heating off.")
    if windows_open is not None:
        lines.append("Windows open." if windows_open else "Windows closed.")
    return lines


def equipment_text(kind: str, label: str, running: bool, capacity_l_per_day: float | None,
                   water_removed_l: float | None, d: Display) -> str:
    text = EQUIPMENT_WORDS[kind] + (f": {label}" if label else "")
    text += ", running" if running else ", not running"
    if capacity_l_per_day is not None:
        text += f", rated {d.water(capacity_l_per_day)}"
    if water_removed_l is not None:
        text += f", {water_removed_l:g} L collected since the previous visit"
    return text[:1].upper() + text[1:] + "."


NOTES_LABELS = {"site": "About the site", "room": "About the room",
                "visit": "On this visit", "seen": "Seen"}
NOTHING_SEEN = "Nothing was recorded as seen."


def photo_caption(room: str, name: str) -> str:
    return f"{room}: {name}"


def photo_missing(name: str) -> str:
    return f"Photo {name} is listed in the survey but was not found beside the survey file."


NO_ACTIONS = "Nothing needs doing in this room from these readings."


def room_cautions_text(names: Sequence[str]) -> str:
    return ("Safety for this room (see Safety below): " + "; ".join(names) + ".")



#: A short name for each caution, for the room's pointer to the Safety section.
CAUTION_NAMES = {
    "visible_mould": "visible mould", "mould_if_visible": "mould if seen",
    "water_category_3": "category 3 water", "water_category_2": "category 2 water",
    "water_category_1": "category 1 water", "electrics_near_water": "electrics near water",
    "confined_space": "confined space", "combustion_heaters": "combustion heaters",
    "asbestos_lead": "old materials (asbestos, lead)",
}

# --- drying progress -------------------------------------------------------------------------

DRYING_INTRO = ("Each room's readings on every visit, so the drying can be followed: the "
                "humidity ratio is the water the air holds, and falling material readings "
                "mean the materials are drying.")
DRYING_HEADER = ("Visit", "Date", "Air", "RH", "Humidity ratio")
WATER_COLLECTED = "Water collected"
NOT_MEASURED = "not measured"


_SCALE_SHORT = {"mc_pct": "% MC", "wme_pct": "% WME", "relative": "relative scale"}


def drying_column(location: str, material: str, scale: str) -> str:
    return f"{location} ({material}, {_SCALE_SHORT[scale]})"


def drying_cell(value: float) -> str:
    return f"{value:g}"


# --- safety ----------------------------------------------------------------------------------

SAFETY_INTRO = "These cautions follow from what was found:"
SAFETY_NONE = "No caution follows from what was found."
GENERAL_LEAD = "In any damp or mould work"
GENERAL_CAUTIONS = (
    "Mould, sewage or flood water, and soaked materials can harm health: people with asthma, "
    "allergies or weak immune systems, babies and older people should keep away from the work.",
    "Water and electricity: keep clear of wet sockets, switches and appliances until an "
    "electrician has made them safe.",
    f"Buildings built before about {th.value('asbestos_possible_before_year'):.0f} may hold "
    f"asbestos, and paint from before {th.value('lead_paint_possible_before_year'):.0f} lead: "
    "do not drill, sand, strip or remove old materials until they have been checked.",
    "Crawl spaces, lofts and flooded basements can be confined spaces: do not go in alone.",
    "Do not dry or heat with unflued gas or paraffin heaters: they add water vapour and "
    "carbon monoxide.",
)
DEFERRAL = ("This report informs; it does not replace local building codes and regulations, "
            "public-health guidance or the advice of a licensed professional.")


def applies_to(text: str, rooms: Sequence[str]) -> str:
    return f"{text} (Applies to: {', '.join(rooms)}.)" if rooms else text


# --- method ----------------------------------------------------------------------------------

def method_items(d: Display) -> tuple[tuple[str, str], ...]:
    """The method, item by item (name, text); temperatures in ``d``'s units."""
    zero = d.temperature(0.0, 0)
    return (
        ("Moist air", "Dew point, frost point, humidity ratio and vapour pressure are worked "
         "out from each air temperature and relative humidity with psychrolib, which follows "
         "ASHRAE Handbook Fundamentals (2017) ch. 1, at the air pressure stated for the visit."),
        (f"Humidity below {zero}", "Hygrometers report relative humidity relative to liquid water "
         "at every temperature (the meteorological convention), and so does this report. Below "
         f"{zero} the condensation point is the frost point, and a surface below {zero} is judged "
         "against ice, because frost is what forms there."),
        ("Surface RH", "The relative humidity the room air has where it touches a surface: the "
         "room air's vapour pressure divided by the saturation vapour pressure at the surface "
         "temperature. 100 % or more means water (or frost) is forming."),
        ("Temperature factor", "fRsi = (surface − outdoor) / (indoor − outdoor), from EN ISO "
         "13788 and BRE IP1/06; judged only for walls, ceilings and floors of heated rooms, and "
         "only when inside and outside differ by enough for one reading to mean something."),
        ("Humidity class", "The room air's vapour pressure above outdoors, against the classes "
         "of EN ISO 13788 Annex A; the classes are defined for monthly means, so one reading is "
         "a guide."),
        ("Timber", "The moisture content timber settles at in the room air, from the USDA FPL "
         "Wood Handbook eqn 4-5."),
        ("Uncertainty", "Each instrument's ± accuracy is read as a rectangular distribution "
         "(standard uncertainty a/√3); the effects are combined to first order following the "
         "GUM (JCGM 100:2008), and every ± and range shown is an expanded uncertainty with "
         "coverage factor 2 (about 95 %). Where a limit lies inside that range the report says "
         "the state is unclear at this accuracy rather than guess."),
        ("Spot readings", "A reading is a snapshot of one moment, not a season: the limits of "
         "mould growth and humidity classes are defined for averages over days or months. "
         "Repeated readings or a data logger over a week or two say more."),
    )


def accuracy_method_text(entered: dict[str, bool], air_k: float, rh_pct: float,
                         surface_k: float, d: Display) -> str:
    from_survey = [name for key, name in (("air_temp_k", "air temperature"), ("rh_pct", "RH"),
                                          ("surface_temp_k", "surface temperature"))
                   if entered.get(key)]
    assumed = [name for key, name in (("air_temp_k", "air temperature"), ("rh_pct", "RH"),
                                      ("surface_temp_k", "surface temperature"))
               if not entered.get(key)]
    text = (f"Accuracies used (the least accurate instrument counts in each room): "
            f"{accuracy_used_text(air_k, rh_pct, surface_k, d)}.")
    if from_survey:
        text += " From the survey's instruments: " + ", ".join(from_survey) + "."
    if assumed:
        text += (" Typical specifications assumed, since none is recorded: "
                 + ", ".join(assumed) + ".")
    return text


LIMITS_INTRO = "Every limit behind the findings, with its source:"

# --- glossary --------------------------------------------------------------------------------

def glossary(d: Display) -> tuple[tuple[str, str], ...]:
    """The trade terms the report uses, with short plain meanings."""
    zero = d.temperature(0.0, 0)
    return (
        ("Relative humidity (RH)", "how much water vapour the air holds, as a percentage of the "
         "most it could hold at its temperature."),
        ("Dew point", "the temperature at which the air's water vapour starts to condense into "
         f"water; below {zero} the frost point, where frost forms."),
        ("Surface RH", "the relative humidity of the air right at a surface; mould can grow when "
         f"it stays above about {th.value('surface_rh_mould_limit_pct'):.0f} % for days."),
        ("Margin to dew/frost point", "how far a surface is above the temperature at which water "
         "or frost would form on it."),
        ("Humidity ratio", "the mass of water vapour in each kilogram of dry air (g/kg, or grains "
         "per pound); it does not change when air warms or cools, so it compares rooms and "
         "visits fairly."),
        ("Vapour pressure", "the part of the air pressure due to water vapour; more indoors than "
         "outdoors means moisture is being added inside."),
        ("Temperature factor (fRsi)", "how warm a surface stays compared with the inside and "
         "outside air: 1 is as warm as the room, 0 as cold as outdoors."),
        ("Humidity class", "a band of indoor moisture production, from dry storage (class 1) to "
         "laundries and pools (class 5)."),
        ("Dry standard", "a moisture reading of the same material in an unaffected area: the "
         "goal a wet material is dried to."),
        ("Moisture content (MC)", "the water in timber as a percentage of its dry weight; decay "
         f"fungi need about {th.value('timber_decay_mc_pct'):.0f} % or more, mould grows from "
         f"about {th.value('timber_mould_mc_pct'):.0f} %."),
        ("Air changes an hour", "how many times an hour the room's volume of air is replaced by "
         "outdoor air."),
        ("Expanded uncertainty", "the range, about 95 % sure, within which the true value lies, "
         "given the instruments' accuracy."),
    )


def names_list(names: Iterable[str]) -> str:
    return ", ".join(names)
