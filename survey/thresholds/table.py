"""Every limit, once, with its source; looked up by key."""

from __future__ import annotations

from collections.abc import Iterable

from survey.thresholds.limits_drying import DRYING_LIMITS
from survey.thresholds.limits_equipment import EQUIPMENT_LIMITS
from survey.thresholds.limits_mould import MOULD_INDEX_LIMITS
from survey.thresholds.limits_room import ROOM_AND_SITE_LIMITS
from survey.thresholds.limits_season import SEASON_LIMITS
from survey.thresholds.record import Threshold
from survey.thresholds.sources import _BRE, _ISO13788_CLASS, _WOOD

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
    *ROOM_AND_SITE_LIMITS,
    *SEASON_LIMITS,
    *DRYING_LIMITS,
    *EQUIPMENT_LIMITS,
    *MOULD_INDEX_LIMITS,
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
