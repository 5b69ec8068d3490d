"""The limits of the colder-month projection (EN ISO 13788 temperature-factor method): the
default design month, the warmest day on which the room's excess is carried along a class
line, and the search range of the lowest month a surface bears. The mould and
condensation limits it judges by are the surface records of :mod:`survey.thresholds.table`
(``surface_rh_mould_limit_pct``, ``condensation_dew_point_margin_k``), and the humidity-class
lines are :mod:`survey.thresholds.classes`'."""

from __future__ import annotations

from survey.thresholds.record import Threshold

_DEFAULT_MONTH = (
    "our choice of a typical coldest-month mean for a temperate climate (monthly means "
    "of the coldest month in north-west and central Europe lie roughly between -3 and "
    "+6 °C, from memory)"
)

SEASON_LIMITS: tuple[Threshold, ...] = (
    Threshold(
        "design_month_outdoor_temp_default_c",
        "Default design month, outdoor mean temperature",
        0.0,
        "°C",
        _DEFAULT_MONTH,
        "Used when neither the survey's site nor the user gives a design month. 0 °C is also "
        "where the EN ISO 13788 humidity-class lines reach their full value, so it is the "
        "mildest month that meets a room's whole moisture excess.",
        "choice",
    ),
    Threshold(
        "design_month_outdoor_rh_default_pct",
        "Default design month, outdoor mean RH",
        90.0,
        "%",
        "our choice; winter monthly mean RH in temperate maritime climates is commonly "
        "85-90 % (from memory)",
        "The upper end of that range, on the safe side: a wetter month gives a higher "
        "projected surface RH.",
        "choice",
    ),
    Threshold(
        "design_month_search_lowest_c",
        "Coldest month looked at for the lowest month a surface bears",
        -30.0,
        "°C",
        "our choice; colder than the coldest monthly means of temperate and most "
        "continental inhabited climates (from memory)",
        "The cold end of the range searched for the lowest outdoor monthly mean at which a "
        "surface still meets the mould limit; a surface that meets it down to here is said "
        "to meet it in every month looked at.",
        "choice",
    ),
    Threshold(
        "class_line_warmest_outdoor_c",
        "Warmest outdoor air today at which the room's excess is carried along a class line",
        10.0,
        "°C",
        "our choice; no published source sets it (EN ISO 13788 Annex A draws the class lines "
        "for monthly means, not for one day's reading); outdoor daily means at which heating "
        "is commonly switched on lie roughly between 10 and 15 °C (from memory)",
        "Along a class line the excess measured today is multiplied by s(design month)/"
        "s(today), and s falls to zero at 20 °C: at 10 °C the line's scale is 0.5, so the "
        "excess is at most doubled (and its range with it); at 15 °C it would be multiplied "
        "by 4, at 19 °C by 20, room air wetter than saturation. On a milder day the room is "
        "often unheated and aired by open windows, and its excess says little of how it is "
        "run in the heating season. Above this temperature the excess is held as measured "
        "and the words say it may understate a colder month's, where windows stay shut; a "
        "reading on a colder day settles it. 10 °C is the cooler end of the heating-on range, "
        "so the line is used only on a day of the heating season.",
        "choice",
    ),
)
