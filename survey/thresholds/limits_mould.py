"""The limits of the mould-growth index over a logged period, and of the 30-day criterion it
is compared with (the model's per-class coefficients are documented constants in
:mod:`survey.mould_index`).

Sources, and how far each was read:

* Hukka, A. and Viitanen, H. (1999), "A mathematical model of mould growth on wooden
  material", Wood Science and Technology 33, 475-485 — the growth equation, the critical-RH
  curve and the decline in dry periods;
* Ojanen, T., Viitanen, H. et al. (2010), "Mold growth modeling of building structures using
  sensitivity classes of materials", Thermal Performance of the Exterior Envelopes of Whole
  Buildings XI — the sensitivity classes, their lowest critical RH and decline factors.

The papers themselves were not at hand. Every number below was read in two independent
public implementations of the model that cite these papers (a Finnish research group's
Python code, 2011-2016, and a Danish research project's Python code), which agree on each
value, and the index scale in a third (an R package's documentation): hence mark ``R`` with
"secondary sources". ASHRAE Standard 160-2009's criterion was read in the abstract of a paper
on its revision (Glass et al., ASTM STP 1599, 2017).
"""

from __future__ import annotations

from survey.thresholds.record import Threshold

_HV1999 = (
    "Hukka & Viitanen 1999, Wood Sci. Technol. 33 (two public implementations, secondary sources)"
)
_OJANEN2010 = (
    "Ojanen, Viitanen et al. 2010, sensitivity classes of materials (two public "
    "implementations, secondary sources)"
)
_ASHRAE160 = "ASHRAE Standard 160-2009, as quoted by Glass et al., ASTM STP 1599 (2017)"

MOULD_INDEX_LIMITS: tuple[Threshold, ...] = (
    Threshold(
        "mould_index_microscopic",
        "Mould index, growth under a microscope",
        1.0,
        "",
        "mould index scale of Hukka & Viitanen 1999 (read in an R package's documentation)",
        "Index 1: small amounts of growth on the surface, seen under a microscope. The "
        "surveyor's eye does not see it yet.",
        "R",
    ),
    Threshold(
        "mould_index_visible",
        "Mould index, visible growth",
        3.0,
        "",
        "mould index scale of Hukka & Viitanen 1999 (read in an R package's documentation)",
        "Index 3: growth seen by eye, under 10 % of the surface. ASHRAE 160-2016 replaced "
        "its 80 % criterion by this index model (its limit of index 3 from memory).",
        "R",
    ),
    Threshold(
        "mould_index_rh_crit_sensitive_pct",
        "Lowest critical RH, very sensitive and sensitive materials",
        80.0,
        "%",
        _OJANEN2010,
        "The critical RH of the index model: the polynomial of Hukka & Viitanen falls from "
        "100 % at 0 °C to this value near 20 °C, and stays at it above.",
        "R",
    ),
    Threshold(
        "mould_index_rh_crit_resistant_pct",
        "Lowest critical RH, medium-resistant and resistant materials",
        85.0,
        "%",
        _OJANEN2010,
        "For the two resistant classes the critical RH never falls below this value.",
        "R",
    ),
    Threshold(
        "mould_index_rh_crit_curve_to_c",
        "Critical-RH curve applies up to",
        20.0,
        "°C",
        _HV1999,
        "Below this surface temperature the critical RH follows the polynomial "
        "−0.00267 T³ + 0.160 T² − 3.13 T + 100 (%); above it, the class's lowest value.",
        "R",
    ),
    Threshold(
        "mould_index_growth_min_temp_c",
        "Index grows from surface temperature",
        0.0,
        "°C",
        _HV1999,
        "At or below 0 °C the index does not grow; the time counts as a dry period.",
        "R",
    ),
    Threshold(
        "mould_index_growth_max_temp_c",
        "Index grows up to surface temperature",
        50.0,
        "°C",
        "Hukka & Viitanen 1999 favourable range 0-50 °C (one of the two implementations "
        "applies it; the other has no upper end)",
        "At or above 50 °C the index does not grow; the time counts as a dry period.",
        "R",
    ),
    Threshold(
        "mould_index_decline_fast_per_h",
        "Index decline, first hours of a dry period",
        0.00133,
        "1/h",
        _HV1999,
        "Index units an hour (0.032 a day) for the first hours after conditions stop "
        "favouring growth, times the material's decline factor.",
        "R",
    ),
    Threshold(
        "mould_index_decline_fast_h",
        "Fast decline lasts",
        6.0,
        "h",
        _HV1999,
        "The first decline rate applies for this long after the end of a favourable time.",
        "R",
    ),
    Threshold(
        "mould_index_decline_pause_to_h",
        "No decline until",
        24.0,
        "h",
        _HV1999,
        "From the end of the fast decline to this time into a dry period the index is held.",
        "R",
    ),
    Threshold(
        "mould_index_decline_slow_per_h",
        "Index decline, long dry periods",
        0.000667,
        "1/h",
        _HV1999,
        "Index units an hour (0.016 a day) from a day into a dry period on, times the "
        "material's decline factor.",
        "R",
    ),
    Threshold(
        "mould_index_gap_h",
        "A logger gap from",
        6.0,
        "h",
        "our choice: the model's shortest time lag (6 h)",
        "A step between two samples longer than this is a gap: the conditions in it are "
        "unknown, so the index is held through it and the gap is reported.",
        "choice",
    ),
    Threshold(
        "mould_index_period_join_h",
        "Favourable times joined across breaks up to",
        24.0,
        "h",
        "our choice: the model holds the index for the first day of a dry period",
        "Favourable times separated by a shorter dry break are reported as one period, "
        "with the hours that were favourable inside it.",
        "choice",
    ),
    Threshold(
        "ashrae160_running_mean_days",
        "Running mean over",
        30.0,
        "days",
        _ASHRAE160,
        "The surface RH and temperature are averaged over the 30 days before each moment.",
        "R",
    ),
    Threshold(
        "ashrae160_surface_rh_limit_pct",
        "30-day mean surface RH under",
        80.0,
        "%",
        _ASHRAE160,
        "The 30-day running mean surface RH must stay below 80 % while the 30-day mean "
        "surface temperature is between 5 and 40 °C.",
        "R",
    ),
)
