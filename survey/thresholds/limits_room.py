"""The limits of room air, ventilation, moisture loads, dehumidifiers, instruments, safety,
water damage and wet rooms (the surface and material limits are in
:mod:`survey.thresholds.table`)."""

from __future__ import annotations

from survey.thresholds.record import Threshold
from survey.thresholds.sources import _EPA_MOULD, _MOISTURE

ROOM_AND_SITE_LIMITS: tuple[Threshold, ...] = (
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
        (80.0 - 32.0) / 1.8,  # 80 °F exactly (26.666… °C), so it reads 80 °F in IP
        "°C",
        "AHAM DH-1 rating point, 80 °F dry bulb, 60 % RH (secondary sources)",
        "Older ratings: litres per 24 h at this warm, humid condition.",
        "R",
    ),
    Threshold(
        "dehumidifier_rating_current_dry_bulb_c",
        "Dehumidifier rating temperature, current US",
        (65.0 - 32.0) / 1.8,  # 65 °F exactly (18.333… °C), so it reads 65 °F in IP
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
        "Significantly contaminated water, category",
        2.0,
        "",
        "restoration standard of practice, water-damage categories (secondary source)",
        "Category 2: significant contamination; protective equipment needed.",
        "R",
    ),
    Threshold(
        "water_category_3",
        "Grossly contaminated water (sewage, flood water), category",
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
