"""Every limit the assessment and the advice use, once, as data, with its source.

Each limit is a :class:`Threshold` with a stable ``key``. Findings and actions carry the keys
they used; the report and the app turn a key into a citation with :func:`citation`. To add a
limit: add one ``Threshold(...)`` to ``_THRESHOLDS`` below (key in snake_case with the unit
last, e.g. ``..._pct``, ``..._k``, ``..._g_per_h``), write its source and mark, and use it
through :func:`value` — never repeat the number in code.

Marks say how sure the number is:

* ``"R"`` — read in the named source (or the named secondary source);
* ``"M"`` — from memory, not verified against the original;
* ``"C"`` — computed from the named formula;
* ``"common practice"`` — a trade rule of thumb with no single source;
* ``"choice"`` — our own pick of one value inside a range the named source gives (the note
  says which range and why this value).

This module imports nothing but the standard library and :mod:`survey.errors`.
"""

from __future__ import annotations

from collections.abc import Iterable
from dataclasses import dataclass
from typing import Literal

from survey.errors import InputError

Mark = Literal["R", "M", "C", "common practice", "choice"]

MARK_TEXT: dict[str, str] = {
    "R": "read in the source",
    "M": "from memory, not verified against the original",
    "C": "computed from the named formula",
    "common practice": "common practice, no single source",
    "choice": "our choice of a value inside the range the source gives",
}

#: The marks in words for a client's report: the same facts, in plain terms.


@dataclass(frozen=True, slots=True)
class Threshold:
    """One limit: its value and unit, where it comes from, and how sure we are of it."""

    key: str
    title: str  #: a short name for people, e.g. "Mould limit, surface RH"
    value: float
    unit: str
    source: str
    note: str
    mark: Mark

    @property
    def value_text(self) -> str:
        """The value with its unit, e.g. ``'80 %'``."""
        return f"{self.value:g} {self.unit}" if self.unit else f"{self.value:g}"

    def citation(self) -> str:
        """One line for a report's method section: value, source, mark and note."""
        return f"{self.value_text}: {self.source}; {MARK_TEXT[self.mark]}. {self.note}"


_BRE = "BRE Information Paper IP1/06 (UK guidance), critical temperature factor"
_ISO13788_CLASS = "EN ISO 13788, Annex A, internal humidity classes (vapour-pressure excess)"
_WOOD = "USDA FPL Wood Handbook"
_MOISTURE = (
    "moisture generation rates from a building-science text quoting the BS 5250 "
    "tables (the BS 5250 originals from memory)"
)
_EPA_MOULD = "US EPA, Mold Remediation in Schools and Commercial Buildings (area bands)"

_THRESHOLDS: tuple[Threshold, ...] = (
    # --- condensation and mould at surfaces -------------------------------------------------
    Threshold(
        "condensation_dew_point_margin_k",
        "Condensation at the dew point",
        0.0,
        "K",
        "definition of the dew point / frost point, ASHRAE Handbook Fundamentals 2017 ch. 1",
        "A surface at or below the dew point (frost point below 0 °C) gathers water or "
        "frost: surface RH 100 % or more.",
        "C",
    ),
    Threshold(
        "dew_point_margin_k",
        "Dew-point margin",
        3.0,
        "K",
        "ISO 8502-4 and coatings practice (secondary sources)",
        "Surface at least 3 K above the dew point; a coatings rule, used widely as a "
        "general safety margin against condensation (common practice).",
        "R",
    ),
    Threshold(
        "surface_rh_mould_limit_pct",
        "Mould limit, surface RH",
        80.0,
        "%",
        "BS 5250:2002 Annex D; EN ISO 13788 critical surface RH 0.8 (monthly mean, from memory)",
        "To avoid mould growth the RH at the surface should not exceed 80 % for several "
        "days. A spot reading is a snapshot, not a monthly mean.",
        "R",
    ),
    Threshold(
        "surface_rh_mould_watch_pct",
        "Approaching the mould limit, surface RH",
        70.0,
        "%",
        "trade practice; the lowest mould-germination isopleths lie near 70-80 % "
        "surface RH (from memory)",
        "Surface RH from 70 % up to the 80 % limit is shown as approaching the limit.",
        "common practice",
    ),
    # --- temperature factor fRsi = (Ts - Te) / (Ti - Te) ---------------------------------------
    Threshold(
        "frsi_dwelling",
        "Temperature factor limit, dwellings",
        0.75,
        "",
        _BRE,
        "Dwellings, residential buildings and schools. Also used for offices: our "
        "choice, on the safe side (whether IP1/06 lists offices at 0.75 or at 0.50 is "
        "not verified here).",
        "M",
    ),
    Threshold(
        "frsi_high_humidity",
        "Temperature factor limit, kitchens and similar",
        0.80,
        "",
        _BRE,
        "Sports halls, kitchens, canteens; buildings heated with unflued gas heaters.",
        "M",
    ),
    Threshold(
        "frsi_very_high_humidity",
        "Temperature factor limit, pools and laundries",
        0.90,
        "",
        _BRE,
        "Buildings with very high humidity: swimming pools, laundries, breweries.",
        "M",
    ),
    Threshold(
        "frsi_storage",
        "Temperature factor limit, storage",
        0.50,
        "",
        _BRE,
        "Storage buildings.",
        "M",
    ),
    Threshold(
        "frsi_general",
        "Temperature factor limit, general",
        0.70,
        "",
        "IEA Annex 14 (Condensation and Energy), fRsi >= 0.7",
        "General criterion, used for rooms whose use is not listed.",
        "M",
    ),
    Threshold(
        "frsi_min_temperature_difference_k",
        "Least inside-outside difference to judge the temperature factor",
        10.0,
        "K",
        "thermographic and surface-temperature survey practice (EN 13187 asks for a "
        "similar difference, from memory)",
        "Below this inside-outside difference a spot fRsi is dominated by reading "
        "error and by the building's thermal lag; the factor is not judged.",
        "common practice",
    ),
    # --- ISO 13788 humidity classes: limit at θe <= 0 °C, falling linearly to 0 at 20 °C -----
    Threshold(
        "humidity_class_1_pa",
        "Humidity class 1 limit",
        270.0,
        "Pa",
        _ISO13788_CLASS,
        "Upper limit of class 1 (unoccupied buildings, dry storage) at θe <= 0 °C.",
        "M",
    ),
    Threshold(
        "humidity_class_2_pa",
        "Humidity class 2 limit",
        540.0,
        "Pa",
        _ISO13788_CLASS,
        "Upper limit of class 2 (offices, dwellings with normal occupancy and "
        "ventilation) at θe <= 0 °C.",
        "M",
    ),
    Threshold(
        "humidity_class_3_pa",
        "Humidity class 3 limit",
        810.0,
        "Pa",
        _ISO13788_CLASS,
        "Upper limit of class 3 (buildings with unknown occupancy) at θe <= 0 °C.",
        "M",
    ),
    Threshold(
        "humidity_class_4_pa",
        "Humidity class 4 limit",
        1080.0,
        "Pa",
        _ISO13788_CLASS,
        "Upper limit of class 4 (sports halls, kitchens, canteens) at θe <= 0 °C.",
        "M",
    ),
    Threshold(
        "humidity_class_5_pa",
        "Humidity class 5 limit",
        1350.0,
        "Pa",
        _ISO13788_CLASS,
        "Upper limit of class 5 (laundries, breweries, swimming pools) at θe <= 0 °C.",
        "M",
    ),
    Threshold(
        "humidity_class_flat_below_c",
        "Humidity class limits constant below",
        0.0,
        "°C",
        _ISO13788_CLASS,
        "At and below this outdoor temperature the class limits are constant.",
        "M",
    ),
    Threshold(
        "humidity_class_zero_at_c",
        "Humidity class limits reach zero at",
        20.0,
        "°C",
        _ISO13788_CLASS,
        "The class limits fall linearly to 0 Pa here; at and above it no class is judged.",
        "M",
    ),
    Threshold(
        "humidity_class_high",
        "High humidity class for a dwelling room",
        4.0,
        "",
        _ISO13788_CLASS,
        "Class 4 or above in a dwelling room is more moisture than ISO 13788 expects "
        "of normal occupancy: look for a source.",
        "common practice",
    ),
    # --- timber -----------------------------------------------------------------------------
    Threshold(
        "timber_decay_mc_pct",
        "Timber decay moisture content",
        20.0,
        "% MC",
        f"{_WOOD}, ch. 14 (secondary source)",
        "Decay fungi need a wood moisture content of about 20 % or more.",
        "R",
    ),
    Threshold(
        "timber_mould_mc_pct",
        "Timber mould moisture content",
        16.0,
        "% MC",
        f"{_WOOD}; trade practice",
        "Mould can grow on timber from about 16-19 % MC; the lower end is used here.",
        "common practice",
    ),
    Threshold(
        "timber_decay_slow_below_c",
        "Timber decay slows below",
        10.0,
        "°C",
        f"{_WOOD}, ch. 14 (secondary source)",
        "Decay slows below this temperature.",
        "R",
    ),
    Threshold(
        "timber_decay_slow_above_c",
        "Timber decay slows above",
        35.0,
        "°C",
        f"{_WOOD}, ch. 14 (secondary source)",
        "Decay slows above this temperature.",
        "R",
    ),
    Threshold(
        "dry_standard_tolerance_fraction",
        "Allowance over the dry standard",
        0.10,
        "",
        "restoration trade practice (dry standard: a reading of the same material in "
        "an unaffected area)",
        "A reading within 10 % of the dry standard counts as at the dry standard, to "
        "allow for meter repeatability and natural variation.",
        "common practice",
    ),
    # --- room air targets ---------------------------------------------------------------------
    Threshold(
        "room_rh_floor_pct",
        "Lowest practical room RH",
        40.0,
        "%",
        "building and health practice",
        "Holding an occupied room below about 40 % RH is rarely practical and dries "
        "eyes and airways; below this the surface must be made warmer instead.",
        "common practice",
    ),
    Threshold(
        "room_rh_target_default_pct",
        "Usual room RH target",
        60.0,
        "%",
        "building and health practice (public-health guidance to keep indoor RH below "
        "60 %, from memory)",
        "Default target room RH when none is given and the surfaces allow it.",
        "common practice",
    ),
    Threshold(
        "drying_rh_target_low_pct",
        "Drying target, lower end",
        40.0,
        "%",
        "water-damage restoration practice",
        "While wet materials are being dried the drying area is held well below the "
        "60 % maintenance target, commonly 40-50 % RH, so the air keeps taking water "
        "out of the materials.",
        "common practice",
    ),
    Threshold(
        "drying_rh_target_pct",
        "Drying target, upper end",
        50.0,
        "%",
        "water-damage restoration practice",
        "Highest RH to hold in a drying area; a dehumidifier is sized against it.",
        "common practice",
    ),
    Threshold(
        "mould_growth_min_surface_temp_c",
        "Mould judged from surface temperature",
        5.0,
        "°C",
        "ASHRAE Standard 160-2009 (secondary source)",
        "The 80 % surface-RH criterion applies while the surface is between 5 and 40 °C; "
        "below, mould does not grow now.",
        "R",
    ),
    Threshold(
        "mould_growth_max_surface_temp_c",
        "Mould judged up to surface temperature",
        40.0,
        "°C",
        "ASHRAE Standard 160-2009 (secondary source)",
        "Upper end of the surface temperature range of the 80 % criterion.",
        "R",
    ),
    Threshold(
        "wet_room_reread_after_use_from_minutes",
        "Re-read a bathroom or kitchen after use, from",
        30.0,
        "min",
        "ventilation practice",
        "A high RH in a bathroom or kitchen is usually the normal peak after a shower or "
        "cooking; a reading 30-60 min after use shows whether the extract clears it.",
        "common practice",
    ),
    Threshold(
        "wet_room_reread_after_use_to_minutes",
        "Re-read a bathroom or kitchen after use, to",
        60.0,
        "min",
        "ventilation practice",
        "Upper end of the re-reading window after a shower or cooking.",
        "common practice",
    ),
    Threshold(
        "occupants_explain_fraction",
        "Occupants explain the excess from",
        0.7,
        "",
        "our choice",
        "When occupants and activities account for this share or more of the load the "
        "measured excess implies, a high humidity class reads as under-ventilation, not "
        "a hidden source.",
        "common practice",
    ),
    # --- ventilation ----------------------------------------------------------------------------
    Threshold(
        "ventilation_outdoor_drier_margin_g_per_kg",
        "Outdoor air drier by at least",
        1.0,
        "g/kg",
        "ventilation practice",
        "Ventilation dries a room when outdoor air holds at least this much less water "
        "(humidity ratio) than the room air now; it can hold a target only when outdoor "
        "air is this much drier than room air at the target, since closer than that the "
        "airflow needed grows without bound.",
        "common practice",
    ),
    Threshold(
        "ventilation_practical_max_ach",
        "Most practical ventilation rate",
        2.0,
        "1/h",
        "ventilation practice",
        "More outdoor air than about 2 air changes an hour is draughty and costly in "
        "heat; above it, dehumidification is advised as well.",
        "common practice",
    ),
    Threshold(
        "assumed_air_change_rate_per_h",
        "Assumed air change rate",
        0.5,
        "1/h",
        "usual design whole-dwelling ventilation rate (building regulations, from memory)",
        "Used to back-calculate the moisture load from the measured excess and to "
        "estimate infiltration when the real rate is unknown.",
        "common practice",
    ),
    # --- moisture generation ------------------------------------------------------------------
    Threshold(
        "moisture_person_asleep_g_per_h",
        "Moisture from a person asleep",
        40.0,
        "g/h",
        _MOISTURE,
        "Our choice: the lower end of the published 40-60 g/h sedentary range, for "
        "people asleep in bedrooms (the source gives no separate sleeping rate).",
        "choice",
    ),
    Threshold(
        "moisture_person_sedentary_g_per_h",
        "Moisture from a person sitting",
        50.0,
        "g/h",
        _MOISTURE,
        "Our choice: the middle of the published 40-60 g/h sedentary range.",
        "choice",
    ),
    Threshold(
        "moisture_person_active_g_per_h",
        "Moisture from an active person",
        90.0,
        "g/h",
        _MOISTURE,
        "Our choice: the middle of the published 60-120 g/h range for active people.",
        "choice",
    ),
    Threshold(
        "moisture_cooking_g_per_h",
        "Moisture from cooking",
        1000.0,
        "g/h",
        _MOISTURE,
        "Our choice: a middle value of the published 600-1500 g/h, per hour of cooking.",
        "choice",
    ),
    Threshold(
        "moisture_bath_g_per_h",
        "Moisture from a bath",
        700.0,
        "g/h",
        _MOISTURE,
        "A bath, per hour.",
        "R",
    ),
    Threshold(
        "moisture_shower_g_per_h",
        "Moisture from a shower",
        2500.0,
        "g/h",
        _MOISTURE,
        "A shower, per hour.",
        "R",
    ),
    # --- dehumidifiers --------------------------------------------------------------------------
    Threshold(
        "dehumidifier_rating_old_dry_bulb_c",
        "Dehumidifier rating temperature, older",
        26.7,
        "°C",
        "AHAM DH-1 rating point, 80 °F dry bulb, 60 % RH (secondary sources)",
        "Older ratings: litres per 24 h at this warm, humid condition.",
        "R",
    ),
    Threshold(
        "dehumidifier_rating_current_dry_bulb_c",
        "Dehumidifier rating temperature, current US",
        18.3,
        "°C",
        "current US portable dehumidifier test, 65 °F dry bulb, 60 % RH (secondary sources)",
        "Current US ratings: litres per 24 h at this cooler condition.",
        "R",
    ),
    Threshold(
        "dehumidifier_rating_rh_pct",
        "Dehumidifier rating RH",
        60.0,
        "%",
        "AHAM DH-1 and the current US test (secondary sources)",
        "RH at both rating points.",
        "R",
    ),
    Threshold(
        "refrigerant_dehumidifier_min_c",
        "Refrigerant dehumidifier, lowest room temperature",
        10.0,
        "°C",
        "dehumidifier trade practice",
        "Refrigerant units lose capacity in cool rooms and may frost their coil below "
        "about 5-10 °C; below this room temperature a desiccant unit is suggested.",
        "common practice",
    ),
    Threshold(
        "us_pint_l",
        "US pint",
        0.473176,
        "L",
        "US customary units: 1 US liquid pint = 0.473176 L",
        "Converts litres per day to US pints per day.",
        "R",
    ),
    # --- instrument accuracy defaults (typical manufacturer specifications) -------------------
    Threshold(
        "accuracy_air_temp_k",
        "Default air temperature accuracy",
        0.5,
        "K",
        "typical manufacturer specification, handheld thermo-hygrometer",
        "Default when no accuracy is entered; also used for outdoor air temperature.",
        "common practice",
    ),
    Threshold(
        "accuracy_rh_pct",
        "Default RH accuracy",
        3.0,
        "%RH",
        "typical manufacturer specification, capacitive RH sensor (±2-3 %RH in 10-90 %)",
        "Default when no accuracy is entered; also used for outdoor RH.",
        "common practice",
    ),
    Threshold(
        "accuracy_surface_temp_k",
        "Default surface temperature accuracy",
        1.0,
        "K",
        "typical manufacturer specification, "
        "infrared surface thermometer (±1 K or ±1 % of reading)",
        "Default when no accuracy is entered; emissivity errors come on top.",
        "common practice",
    ),
    Threshold(
        "coverage_factor",
        "Coverage factor",
        2.0,
        "",
        "JCGM 100:2008 (GUM), expanded uncertainty "
        "U = k·u with k = 2 for about 95 % coverage; a ± accuracy specification is read "
        "as a rectangular distribution, u = a/√3 (GUM 4.3.7, from memory)",
        "States within ±U of a limit are reported as not told apart.",
        "M",
    ),
    # --- safety -----------------------------------------------------------------------------------
    Threshold(
        "mould_area_small_m2",
        "Small mould area, up to",
        0.93,
        "m²",
        _EPA_MOULD,
        "Up to about 10 sq ft (0.93 m²): a small area, usually cleanable by a careful "
        "occupant with basic protection.",
        "M",
    ),
    Threshold(
        "mould_area_large_m2",
        "Large mould area, over",
        9.3,
        "m²",
        _EPA_MOULD,
        "Over about 100 sq ft (9.3 m²): a large area for trained or licensed "
        "remediators with containment.",
        "M",
    ),
    Threshold(
        "water_category_1_degrades_h",
        "Clean water left standing degrades within",
        48.0,
        "h",
        "restoration standard of practice, water-damage categories "
        "(secondary source); the time from memory",
        "Category 1 (clean) water left standing in a building, or soaking into its "
        "materials, becomes category 2; commonly taken to happen within about two "
        "days, sooner in warm rooms.",
        "M",
    ),
    Threshold(
        "water_category_2",
        "Water category 2",
        2.0,
        "",
        "restoration standard of practice, water-damage categories (secondary source)",
        "Category 2: significant contamination; protective equipment needed.",
        "R",
    ),
    Threshold(
        "water_category_3",
        "Water category 3",
        3.0,
        "",
        "restoration standard of practice, water-damage categories (secondary source)",
        "Category 3: grossly contaminated (sewage, flood water); protective equipment "
        "and licensed handling.",
        "R",
    ),
    Threshold(
        "asbestos_possible_before_year",
        "Asbestos possible in buildings before",
        2000.0,
        "year",
        "asbestos use ended in most countries by around 2000 (UK ban 1999, from memory)",
        "Buildings built or refurbished before this year may contain asbestos.",
        "common practice",
    ),
    Threshold(
        "lead_paint_possible_before_year",
        "Lead paint possible before",
        1978.0,
        "year",
        "US ban on lead paint for housing in 1978 (from memory); other countries "
        "restricted it earlier or later, from the 1920s to the 1990s (from memory)",
        "Paint applied before this year may contain lead; where the local ban came "
        "later, later paint may too: the local rule decides.",
        "M",
    ),
    # --- contaminated water and classes of water loss ---------------------------------------
    Threshold(
        "water_category_2_degrades_h",
        "Category 2 water left standing degrades within",
        48.0,
        "h",
        "restoration standard of practice, water-damage categories "
        "(secondary source); the time from memory",
        "Category 2 water left standing, or in warm conditions, is treated as category 3 "
        "after about two days.",
        "M",
    ),
    Threshold(
        "water_loss_class_2_from_pct",
        "Class 2 water loss from",
        5.0,
        "%",
        "restoration standard of practice, classes of water loss (from memory)",
        "Share of the room's floor, wall and ceiling area wet: below this, with "
        "low-porosity materials, class 1 (least evaporation load).",
        "M",
    ),
    Threshold(
        "water_loss_class_3_from_pct",
        "Class 3 water loss from",
        40.0,
        "%",
        "restoration standard of practice, classes of water loss (from memory)",
        "Share of the room's floor, wall and ceiling area wet: from this up, class 3 "
        "(the greatest evaporation load); class 4 is bound water in dense materials "
        "(hardwood, plaster, concrete, masonry) whatever the area.",
        "M",
    ),
    *(
        Threshold(
            f"drying_chart_class_{n}_ft3_per_pint",
            f"Drying chart factor, class {n}",
            factor,
            "ft³ per pint/day",
            "restoration standard of practice, dehumidifier sizing chart for "
            "low-grain refrigerant units (from memory)",
            f"A class {n} loss needs about one US pint a day of dehumidifier capacity for "
            f"every {factor:g} ft³ of the drying area; the estimate of the water leaving "
            "wet materials.",
            "M",
        )
        for n, factor in ((1, 100.0), (2, 50.0), (3, 40.0), (4, 50.0))
    ),
    Threshold(
        "water_loss_class_assumed",
        "Class of water loss assumed",
        2.0,
        "",
        "our choice",
        "While materials read above their dry standard and no class is given, a class 2 "
        "loss (part of the room wet) is assumed for the drying load, and said so.",
        "choice",
    ),
    # --- wet rooms: loads and code minimum extract rates ------------------------------------
    Threshold(
        "shower_minutes",
        "Length of a shower",
        10.0,
        "min",
        "our choice",
        "A shower taken as 10 minutes at the shower rate when showers per day are entered.",
        "choice",
    ),
    Threshold(
        "bath_minutes",
        "Length of a bath",
        30.0,
        "min",
        "our choice",
        "A bath taken as 30 minutes at the bath rate.",
        "choice",
    ),
    Threshold(
        "moisture_laundry_load_kg",
        "Water from a wash load dried indoors",
        1.5,
        "kg",
        "building-science texts (from memory)",
        "A spun wash load dried indoors releases about 1.5 kg of water into the room.",
        "M",
    ),
    Threshold(
        "typical_showers_per_day",
        "Showers a day assumed in a bathroom",
        2.0,
        "per day",
        "our choice",
        "A bathroom with no use entered is taken to have two showers a day, said as an assumption.",
        "choice",
    ),
    Threshold(
        "typical_cooking_hours_per_day",
        "Cooking assumed in a kitchen",
        1.5,
        "h per day",
        "our choice",
        "A kitchen with no use entered is taken to have 1.5 hours of cooking a day, said "
        "as an assumption.",
        "choice",
    ),
    Threshold(
        "typical_laundry_loads_per_day",
        "Wash loads assumed in a utility room",
        1.0,
        "per day",
        "our choice",
        "A utility room with no use entered is taken to dry one wash load a day indoors.",
        "choice",
    ),
    *(
        Threshold(key, title, value, unit, source, note, "M")
        for key, title, value, unit, source, note in (
            (
                "extract_bathroom_intermittent_l_per_s",
                "Bathroom extract, intermittent",
                15.0,
                "L/s",
                "England, Approved Document F (from memory)",
                "Intermittent extract from a bathroom; local codes set their own minimum.",
            ),
            (
                "extract_bathroom_continuous_l_per_s",
                "Bathroom extract, continuous",
                8.0,
                "L/s",
                "England, Approved Document F (from memory)",
                "Continuous extract from a bathroom.",
            ),
            (
                "extract_kitchen_intermittent_l_per_s",
                "Kitchen extract, intermittent",
                30.0,
                "L/s",
                "England, Approved Document F (from memory)",
                "Intermittent extract adjacent to a hob (60 L/s elsewhere in the kitchen).",
            ),
            (
                "extract_kitchen_continuous_l_per_s",
                "Kitchen extract, continuous",
                13.0,
                "L/s",
                "England, Approved Document F (from memory)",
                "Continuous extract from a kitchen.",
            ),
            (
                "extract_utility_intermittent_l_per_s",
                "Utility room extract, intermittent",
                30.0,
                "L/s",
                "England, Approved Document F (from memory)",
                "Intermittent extract from a utility room.",
            ),
            (
                "extract_utility_continuous_l_per_s",
                "Utility room extract, continuous",
                8.0,
                "L/s",
                "England, Approved Document F (from memory)",
                "Continuous extract from a utility room.",
            ),
            (
                "extract_bathroom_intermittent_cfm",
                "Bathroom exhaust, intermittent (US)",
                50.0,
                "cfm",
                "ASHRAE Standard 62.2, local exhaust (from memory)",
                "Intermittent bathroom exhaust.",
            ),
            (
                "extract_bathroom_continuous_cfm",
                "Bathroom exhaust, continuous (US)",
                20.0,
                "cfm",
                "ASHRAE Standard 62.2, local exhaust (from memory)",
                "Continuous bathroom exhaust.",
            ),
            (
                "extract_kitchen_intermittent_cfm",
                "Kitchen exhaust, intermittent (US)",
                100.0,
                "cfm",
                "ASHRAE Standard 62.2, local exhaust (from memory)",
                "Intermittent kitchen exhaust (a vented range hood).",
            ),
            (
                "extract_kitchen_continuous_ach",
                "Kitchen exhaust, continuous (US)",
                5.0,
                "1/h",
                "ASHRAE Standard 62.2, local exhaust (from memory)",
                "Continuous kitchen exhaust: five kitchen air changes an hour.",
            ),
        )
    ),
    # --- timber equation range ------------------------------------------------------------------
    Threshold(
        "timber_emc_equation_max_c",
        "Wood EMC equation, highest temperature",
        100.0,
        "°C",
        "USDA FPL Wood Handbook eqn 4-5, range of the fitted data (from memory)",
        "Outside 0-100 °C the equation is not used: the tool says so instead.",
        "M",
    ),
    Threshold(
        "timber_emc_equation_min_c",
        "Wood EMC equation, lowest temperature",
        0.0,
        "°C",
        "USDA FPL Wood Handbook eqn 4-5, range of the fitted data (from memory)",
        "Below this the equation is not used.",
        "M",
    ),
    Threshold(
        "timber_emc_equation_max_rh_pct",
        "Wood EMC equation, highest RH",
        98.0,
        "%",
        "USDA FPL Wood Handbook Table 4-2 runs to 98 % RH (from memory)",
        "Above this RH the equation is not used (wood near fibre saturation).",
        "M",
    ),
    Threshold(
        "propane_water_kg_per_kg",
        "Water vapour from burning propane",
        1.63,
        "kg/kg",
        "combustion stoichiometry C3H8 + 5 O2 -> 3 CO2 + 4 H2O: 4 × 18.015 / 44.097",
        "Burning 1 kg of propane releases about 1.6 kg of water vapour into the room.",
        "C",
    ),
)

_BY_KEY: dict[str, Threshold] = {t.key: t for t in _THRESHOLDS}
if len(_BY_KEY) != len(_THRESHOLDS):  # pragma: no cover - guards the table above
    raise RuntimeError("duplicate threshold key")


def get(key: str) -> Threshold:
    """The threshold with this key; ``KeyError`` names an unknown key."""
    try:
        return _BY_KEY[key]
    except KeyError:
        raise KeyError(f"unknown threshold key {key!r}") from None


def value(key: str) -> float:
    """The value of the threshold with this key, in its unit."""
    return get(key).value


def citation(key: str) -> str:
    """The citation text of the threshold with this key."""
    return get(key).citation()


def all_thresholds() -> tuple[Threshold, ...]:
    """Every threshold, in the order of the table."""
    return _THRESHOLDS


def cited(keys: Iterable[str]) -> list[Threshold]:
    """The thresholds behind ``keys``, each once, in table order (for a method section)."""
    wanted = set(keys)
    for key in wanted:
        get(key)
    return [t for t in _THRESHOLDS if t.key in wanted]


# --- room uses and their temperature-factor limits ---------------------------------------------

ROOM_USES: tuple[str, ...] = (
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
)


@dataclass(frozen=True, slots=True)
class RoomUse:
    """What a room use means for the judgement and the advice, each with its reason.

    This is the one table of room-use rules: the temperature-factor limit (``frsi_key``,
    None where fRsi does not apply), and whether the room is a wet room (its humidity peaks
    after showers or cooking are normal), in contact with the ground (the ground, not
    outdoor air, sets its floor and wall temperatures), a confined space (a safety caution
    applies), a ventilated space that follows outdoor air (a loft, a crawl space), usually
    closed up and unoccupied (no occupants given: taken as 0), and which per-person moisture
    rate applies. ``ours`` marks an fRsi mapping that is our own decision rather than a use
    the cited source lists; ``frsi_reason`` says so."""

    use: str
    frsi_key: str | None
    frsi_reason: str
    ours: bool = False
    wet_room: bool = False
    ground_contact: bool = False
    confined: bool = False
    ventilated_space: bool = False
    closed_up: bool = False
    occupant_rate_key: str = "moisture_person_sedentary_g_per_h"

    @property
    def key(self) -> str | None:
        """The temperature-factor threshold key (the name the older table used)."""
        return self.frsi_key

    @property
    def reason(self) -> str:
        return self.frsi_reason


_WET_ROOM = "humidity peaks after showers, baths or cooking are the normal use of the room"
_GROUND = "walls and floor in contact with the ground, which sets their temperature"
_CONFINED = "a confined or hard-to-reach space: entry cautions apply"
_VENTILATED = "a ventilated space outside the heated envelope that follows outdoor air"
_CLOSED_UP = "usually closed up and unoccupied: no occupants given is taken as none"

ROOM_USE_POLICY: dict[str, RoomUse] = {
    u.use: u
    for u in (
        RoomUse(
            "bedroom",
            "frsi_dwelling",
            "a dwelling room (BRE IP1/06: dwellings 0.75)",
            occupant_rate_key="moisture_person_asleep_g_per_h",
        ),
        RoomUse("living", "frsi_dwelling", "a dwelling room (BRE IP1/06: dwellings 0.75)"),
        RoomUse(
            "office",
            "frsi_dwelling",
            "judged like a dwelling room (0.75): our choice, on the safe side; whether BRE "
            "IP1/06 lists offices at 0.75 or lower is not verified",
            ours=True,
        ),
        RoomUse(
            "hallway",
            "frsi_dwelling",
            "circulation space inside a dwelling, judged as a dwelling room (0.75): our choice",
            ours=True,
        ),
        RoomUse(
            "kitchen",
            "frsi_high_humidity",
            "BRE IP1/06 lists kitchens at 0.80 for their moisture bursts",
            wet_room=True,
        ),
        RoomUse(
            "bathroom",
            "frsi_high_humidity",
            "not listed in BRE IP1/06; treated like a kitchen (0.80) for its short, high "
            "moisture bursts: our choice, on the safe side",
            ours=True,
            wet_room=True,
        ),
        RoomUse(
            "basement",
            "frsi_dwelling",
            "a heated, habitable basement is a dwelling space (0.75): our choice",
            ours=True,
            ground_contact=True,
            confined=True,
            closed_up=True,
        ),
        RoomUse("storage", "frsi_storage", "BRE IP1/06: storage buildings 0.50", closed_up=True),
        RoomUse(
            "utility",
            "frsi_high_humidity",
            "a utility room, with laundry and its moisture bursts: treated like a kitchen "
            "(0.80), our choice on the safe side",
            ours=True,
            wet_room=True,
        ),
        RoomUse(
            "crawlspace",
            None,
            "an unheated space outside the heated envelope: no temperature-factor limit",
            ground_contact=True,
            confined=True,
            ventilated_space=True,
            closed_up=True,
        ),
        RoomUse(
            "loft",
            None,
            "an unheated roof space outside the heated envelope: no temperature-factor "
            "limit (a converted loft room is a bedroom or living room)",
            confined=True,
            ventilated_space=True,
            closed_up=True,
        ),
        RoomUse("other", "frsi_general", "general limit 0.70 (IEA Annex 14)"),
    )
}

#: Why each flag of :class:`RoomUse` is set, for the method section.
ROOM_USE_FLAG_REASONS: dict[str, str] = {
    "wet_room": _WET_ROOM,
    "ground_contact": _GROUND,
    "confined": _CONFINED,
    "ventilated_space": _VENTILATED,
    "closed_up": _CLOSED_UP,
}


def room_use(use: str) -> RoomUse:
    """The policy of a room use (canonical name)."""
    return ROOM_USE_POLICY[use]


# Views of the table, by the names other modules and the tests read.
UseLimit = RoomUse
FRSI_LIMIT_BY_USE: dict[str, RoomUse] = ROOM_USE_POLICY
#: Room uses that are confined or hard-to-reach spaces (a safety caution applies).
CONFINED_USES: frozenset[str] = frozenset(u for u, p in ROOM_USE_POLICY.items() if p.confined)
#: Occupant moisture rate by room use (threshold keys).
OCCUPANT_RATE_BY_USE: dict[str, str] = {u: p.occupant_rate_key for u, p in ROOM_USE_POLICY.items()}

#: Words in a material name or a surface label that mark it as timber (the one list).
TIMBER_WORDS: tuple[str, ...] = (
    "timber",
    "wood",
    "softwood",
    "hardwood",
    "pine",
    "spruce",
    "oak",
    "joist",
    "skirting",
    "floorboard",
    "batten",
    "rafter",
    "purlin",
    "truss",
    "sarking",
    "stud",
    "plywood",
    "osb",
    "chipboard",
    "particleboard",
    "architrave",
    "sill",
    "lath",
    "beam",
)


#: Words that mark a material as porous: soaked by category 3 water it is removed, not dried
#: (restoration standard of practice, secondary source; the list is common practice).
POROUS_WORDS: tuple[str, ...] = (
    "plasterboard",
    "gypsum",
    "drywall",
    "carpet",
    "underlay",
    "insulation",
    "mineral wool",
    "fibreglass",
    "fiberglass",
    "ceiling tile",
    "mdf",
    "chipboard",
    "particleboard",
    "fabric",
    "upholstery",
    "cardboard",
    "paper",
    "felt",
)


def is_porous(text: str) -> bool:
    """Whether a material name describes a porous material (removed after category 3)."""
    lowered = str(text).lower()
    return any(word in lowered for word in POROUS_WORDS)


def is_timber(text: str) -> bool:
    """Whether a material name or surface label describes timber."""
    lowered = str(text).lower()
    return any(word in lowered for word in TIMBER_WORDS)


#: Activities whose moisture rate is known, per hour of activity (threshold keys).
ACTIVITY_RATE: dict[str, str] = {
    "cooking": "moisture_cooking_g_per_h",
    "bath": "moisture_bath_g_per_h",
    "shower": "moisture_shower_g_per_h",
    "active_person": "moisture_person_active_g_per_h",
}


# --- surface elements: what each kind of surface is judged by ----------------------------------

#: The kinds of measured surface (the same list as the survey file model's ``Element``).
SURFACE_ELEMENTS: tuple[str, ...] = (
    "external_wall",
    "internal_wall",
    "ceiling",
    "floor",
    "window_frame",
    "glazing",
    "pipe",
    "other",
)


@dataclass(frozen=True, slots=True)
class ElementPolicy:
    """How a kind of surface is judged, and why (our policy; the reasons say on what)."""

    element: str
    role: str  #: "envelope", "internal", "glazing" or "pipe"
    temperature_factor: bool  #: judged against the room use's fRsi limit
    sets_room_target: bool  #: can be the coldest surface that caps the room RH
    mould_judged: bool  #: a surface that mould grows on
    words: str  #: e.g. "external wall"
    reason: str


_ENVELOPE_REASON = (
    "part of the heated envelope: the temperature factor (EN ISO 13788, "
    "BRE IP1/06) is defined for it, and mould on it sets the room RH"
)
ELEMENT_POLICY: dict[str, ElementPolicy] = {
    p.element: p
    for p in (
        ElementPolicy(
            "external_wall", "envelope", True, True, True, "external wall", _ENVELOPE_REASON
        ),
        ElementPolicy("ceiling", "envelope", True, True, True, "ceiling", _ENVELOPE_REASON),
        ElementPolicy("floor", "envelope", True, True, True, "floor", _ENVELOPE_REASON),
        ElementPolicy(
            "other",
            "envelope",
            True,
            True,
            True,
            "surface",
            "not said what it is: judged as a wall, ceiling or floor of the heated "
            "envelope, on the safe side",
        ),
        ElementPolicy(
            "internal_wall",
            "internal",
            False,
            True,
            True,
            "internal wall",
            "inside the heated envelope: no temperature factor (the outdoor "
            "temperature does not drive it), but mould on it sets the room RH",
        ),
        ElementPolicy(
            "window_frame",
            "glazing",
            False,
            False,
            True,
            "window frame",
            "judged for condensation and for mould on frames and seals; windows are "
            "expected to run colder than walls, so they do not set the room RH",
        ),
        ElementPolicy(
            "glazing",
            "glazing",
            False,
            False,
            False,
            "glazing",
            "judged for condensation only: glass does not feed mould, and single "
            "glazing fogging in winter is expected, no reason to hold the room drier",
        ),
        ElementPolicy(
            "pipe",
            "pipe",
            False,
            False,
            False,
            "pipe",
            "judged for condensation only: a cold pipe that sweats needs lagging, not a drier room",
        ),
    )
}


def check_element(element: str, field: str = "surface element") -> ElementPolicy:
    """The policy for a surface element; :class:`InputError` lists the elements allowed."""
    policy = ELEMENT_POLICY.get(element)
    if policy is None:
        text = str(element).strip().lower().replace(" ", "_").replace("-", "_")
        policy = ELEMENT_POLICY.get(text)
        if policy is None:
            raise InputError(field, element, "expected one of " + ", ".join(SURFACE_ELEMENTS))
    return policy


def check_use(use: str, field: str = "room use") -> str:
    """The room use in canonical form; :class:`InputError` lists the uses allowed."""
    text = str(use).strip().lower()
    if text not in FRSI_LIMIT_BY_USE:
        raise InputError(field, use, "expected one of " + ", ".join(ROOM_USES))
    return text


def frsi_limit(use: str) -> Threshold | None:
    """The temperature-factor limit for a room use, or None where fRsi does not apply."""
    key = FRSI_LIMIT_BY_USE[check_use(use)].key
    return None if key is None else get(key)


# --- ISO 13788 humidity classes ----------------------------------------------------------------

#: Returned by :func:`humidity_class` for an excess above the class 5 limit.
BEYOND_CLASS_5 = 6

HUMIDITY_CLASS_KEYS: tuple[str, ...] = tuple(f"humidity_class_{n}_pa" for n in range(1, 6))


def humidity_class_limits_pa(outdoor_temp_c: float) -> tuple[float, ...] | None:
    """Upper vapour-pressure-excess limits (Pa) of classes 1-5 at ``outdoor_temp_c``.

    Constant at and below ``humidity_class_flat_below_c``, falling linearly to 0 at
    ``humidity_class_zero_at_c``; None at and above that temperature (no class judged).
    """
    flat = value("humidity_class_flat_below_c")
    zero = value("humidity_class_zero_at_c")
    if outdoor_temp_c >= zero:
        return None
    scale = 1.0 if outdoor_temp_c <= flat else (zero - outdoor_temp_c) / (zero - flat)
    return tuple(value(key) * scale for key in HUMIDITY_CLASS_KEYS)


def humidity_class(excess_pa: float, outdoor_temp_c: float) -> int | None:
    """ISO 13788 class (1-5) of a vapour-pressure excess; 6 means beyond class 5.

    A class runs from the previous class's limit (exclusive) up to its own (inclusive);
    an excess at or below the class 1 limit, negative included, is class 1. None when the
    outdoor temperature is at or above ``humidity_class_zero_at_c``.
    """
    limits = humidity_class_limits_pa(outdoor_temp_c)
    return None if limits is None else humidity_class_in(excess_pa, limits)


def humidity_class_in(excess_pa: float, limits: tuple[float, ...]) -> int:
    """The class of ``excess_pa`` among class limits already worked out for an outdoor
    temperature (:func:`humidity_class_limits_pa`); the rule of :func:`humidity_class`."""
    for number, limit in enumerate(limits, start=1):
        if excess_pa <= limit:
            return number
    return BEYOND_CLASS_5
