"""The report's words for one room: its facts, readings, surfaces, materials, what was seen."""

from __future__ import annotations

from collections.abc import Sequence

from survey import psychro
from survey import thresholds as th
from survey.assess import FactorState, MaterialFinding, RoomFinding, SurfaceFinding
from survey.words.cautions import CAUTION_NAMES as CAUTION_NAMES
from survey.words.display import Display, round_down_rh
from survey.words.states import (
    DRY_STANDARD_WORDS,
    TIMBER_WORDS,
    USE_PHRASE,
    humidity_class_range_text,
    humidity_class_text,
    standard_visit_said,
)

# --- a room ----------------------------------------------------------------------------------


def reference_room_name(name: str) -> str:
    return f"{name} (reference room)"


def room_heading(name: str, reference: bool) -> str:
    return reference_room_name(name) if reference else name


def storey_words(level: int | None) -> str:
    """Where a room is, said without ordinals (a "first floor" is the ground floor in
    some countries and the one above it in others)."""
    if level is None:
        return "storey not recorded"
    if level == 0:
        return "on the ground storey"
    count = abs(level)
    return f"{count} storey{'s' if count != 1 else ''} {'above' if level > 0 else 'below'} ground"


def room_facts(
    use: str, level: int | None, volume_m3: float | None, occupants: int | None, d: Display
) -> str:
    phrase = USE_PHRASE.get(use) or "a room of unstated use"
    parts = [f"Used as {phrase}", storey_words(level)]
    parts.append("volume not given" if volume_m3 is None else f"volume {d('volume', volume_m3)}")
    if occupants is None:
        parts.append("usual occupants not recorded")
    elif occupants == 0:
        parts.append("no usual occupants")
    else:
        parts.append(f"{occupants} usual occupant{'s' if occupants != 1 else ''}")
    return "; ".join(parts) + "."


READINGS_HEADER = ("Reading", "Value")
READING_LABELS = {
    "air_temp": "Air temperature",
    "rh": "Relative humidity",
    "dew_point": "Dew point",
    "frost_point": "Frost point",
    "humidity_ratio": "Humidity ratio",
    "excess": "Vapour pressure against outdoors",
    "class": "Humidity class (EN ISO 13788)",
    "max_rh": "Highest safe room RH",
    "apart": "Glazing, frames and pipes",
    "emc": "Timber in this air settles at",
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
    return (
        f"{d('vapour_pressure', abs(excess_pa))} {more} than outdoors "
        f"(± {d('vapour_pressure', band_pa)})"
    )


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
    return (
        f"the coldest, {label}, stays clear of condensation while the room is below "
        f"{round_down_rh(dry_pct)} % RH"
    )


def emc_text(emc_pct: float | None) -> str:
    if emc_pct is None:
        return "not estimated: outside the range of the Wood Handbook equation (eqn 4-5)"
    return f"about {emc_pct:.1f} % moisture content (Wood Handbook eqn 4-5)"


SURFACE_HEADER = (
    "Surface",
    "Kind",
    "Material",
    "Temperature",
    "Surface RH",
    "Margin to dew/frost point",
    "Temperature factor",
)
JUDGED_HEADER = ("Surface", "Condensation", "Mould growth", "Temperature factor")
NO_SURFACES = "No surface was measured in this room."


def factor_cell(surface: SurfaceFinding) -> str:
    if surface.temperature_factor is None:
        return (
            "not used" if surface.temperature_factor_state is FactorState.NOT_FOR_ELEMENT else "–"
        )
    return (
        f"{surface.temperature_factor:.2f} ± {surface.temperature_factor_uncertainty:.2f} "
        f"(limit {surface.temperature_factor_limit:.2f})"
    )


def margin_cell(surface: SurfaceFinding, d: Display) -> str:
    return (
        d("temperature_difference", surface.dew_point_margin_k, unit=False)
        + " ± "
        + d.difference(surface.margin_uncertainty_k)
    )


MATERIAL_HEADER = (
    "Location",
    "Material",
    "Reading",
    "Dry standard",
    "Against the dry standard",
    "Timber",
)
_SCALE_WORDS = {"mc_pct": "% MC", "wme_pct": "% WME", "relative": "(meter's relative scale)"}


def reading_text(value: float, scale: str) -> str:
    return f"{value:g} {_SCALE_WORDS[scale]}"


def dry_standard_text(m: MaterialFinding) -> str:
    """The dry standard; one read on an earlier visit (not read again since) says which."""
    if m.dry_standard is None:
        return "–"
    return reading_text(m.dry_standard, m.scale) + standard_visit_said(m.dry_standard_visit)


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


DRY_STANDARD_BASIS = (
    "The dry standard is a reading of the same material, on the same "
    f"scale, in an unaffected part of the same room or of a reference room (one "
    "read on an earlier visit and not read again since stands, and says which visit); "
    f"a reading within {th.value('dry_standard_tolerance_fraction') * 100:.0f} "
    "% of it counts as dry."
)

# What was seen
ODOUR_WORDS = {
    "none": "no odour",
    "musty": "a musty smell",
    "earthy": "an earthy smell",
    "sewage": "a sewage smell",
    "chemical": "a chemical smell",
    "other": "an unusual smell",
}
EQUIPMENT_WORDS = {
    "refrigerant_dehumidifier": "refrigerant dehumidifier",
    "desiccant_dehumidifier": "desiccant dehumidifier",
    "air_mover": "air mover",
    "heater": "heater",
    "extract_fan": "extract fan",
    "air_scrubber": "air scrubber",
    "other": "equipment",
}


def seen_lines(
    mould: bool,
    area_m2: float | None,
    staining: bool,
    condensation: bool,
    odour: str | None,
    water_category: int | None,
    heating_on: bool | None,
    windows_open: bool | None,
    d: Display,
) -> list[str]:
    lines = []
    if mould:
        lines.append(
            "Visible mould"
            + (f", about {d.area(area_m2)} in all." if area_m2 else ", area not measured.")
        )
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


def equipment_text(
    kind: str,
    label: str,
    running: bool,
    capacity_l_per_day: float | None,
    water_removed_l: float | None,
    d: Display,
    run_hours: float | None = None,
) -> str:
    text = EQUIPMENT_WORDS[kind] + (f": {label}" if label else "")
    text += ", running" if running else ", not running"
    if capacity_l_per_day is not None:
        text += f", rated {d.water(capacity_l_per_day)}"
    if water_removed_l is not None:
        text += f", {water_removed_l:g} L collected " + (
            "since the previous visit" if run_hours is None else f"in {run_hours:g} h of running"
        )
    return text[:1].upper() + text[1:] + "."


NOTES_LABELS = {
    "site": "About the site",
    "room": "About the room",
    "visit": "On this visit",
    "seen": "Seen",
}
NOTHING_SEEN = "Nothing was recorded as seen."


def photo_caption(room: str, name: str) -> str:
    return f"{room}: {name}"


def photo_missing(name: str) -> str:
    return f"Photo {name} is listed in the survey but was not found beside the survey file."


NO_ACTIONS = "Nothing needs doing in this room from these readings."


def room_cautions_text(names: Sequence[str]) -> str:
    return "Safety for this room (see Safety below): " + "; ".join(names) + "."


#: A short name for each caution, for the room's pointer to the Safety section.
