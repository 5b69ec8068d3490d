"""The limits of the dehumidifier performance check (:mod:`survey.equipment`): the rating
test conditions a stated capacity refers to, the cold-air limits of refrigerant units, the
smallest humidity-ratio drop the readings can show, and the approximations the comparison
with a rating rests on.

The two older rating points already in :mod:`survey.thresholds.limits_room`
(``dehumidifier_rating_old_dry_bulb_c`` 26.7 °C, ``dehumidifier_rating_current_dry_bulb_c``
18.3 °C, both at ``dehumidifier_rating_rh_pct`` 60 %) are used for the conditions
``"26.7c_60"`` and ``"18.3c_60"``; the others are here, once.
"""

from __future__ import annotations

from survey.thresholds.record import Threshold

_DOE_X1 = (
    "US DOE test procedure for dehumidifiers, 10 CFR 430 Subpart B Appendix X1 (2015 final "
    "rule, secondary sources)"
)

EQUIPMENT_LIMITS: tuple[Threshold, ...] = (
    # --- rating test conditions -------------------------------------------------------------
    Threshold(
        "dehumidifier_rating_whole_home_dry_bulb_c",
        "Dehumidifier rating temperature, US whole-home units",
        22.8,
        "°C",
        _DOE_X1 + "; 73 °F for whole-home (ducted) units, from memory",
        "Whole-home units are rated at 73 °F (22.8 °C) dry bulb and 60 % RH entering air.",
        "M",
    ),
    Threshold(
        "dehumidifier_rating_en810_dry_bulb_c",
        "Dehumidifier rating temperature, European",
        27.0,
        "°C",
        "EN 810:1997, dehumidifiers with electrically driven compressors, rating test "
        "(from memory)",
        "European ratings: litres per 24 h at 27 °C and 60 % RH.",
        "M",
    ),
    Threshold(
        "dehumidifier_rating_wet_dry_bulb_c",
        "Dehumidifier extraction quoted at warm, wet air: temperature",
        30.0,
        "°C",
        "manufacturers' data sheets; no standard defining it was found",
        "Many data sheets quote the largest extraction at 30 °C and 80 % RH, far wetter "
        "than any rating test: a site figure is always well below it.",
        "common practice",
    ),
    Threshold(
        "dehumidifier_rating_wet_rh_pct",
        "Dehumidifier extraction quoted at warm, wet air: RH",
        80.0,
        "%",
        "manufacturers' data sheets; no standard defining it was found",
        "The RH of the 30 °C data-sheet condition.",
        "common practice",
    ),
    # --- cold air and refrigerant units ----------------------------------------------------------
    Threshold(
        "refrigerant_coil_frost_inlet_c",
        "Refrigerant dehumidifier, coil frosts below inlet",
        5.0,
        "°C",
        "dehumidifier trade practice; makers' operating ranges commonly start at 5 °C "
        "(from memory)",
        "Below about this inlet temperature the coil of a refrigerant unit runs below 0 °C "
        "and frosts; defrost cycles take much of the running time and removal collapses. "
        "A desiccant unit is the one that works here.",
        "common practice",
    ),
    # --- what the readings can show ----------------------------------------------------------
    Threshold(
        "dehumidifier_drop_resolution_g_per_kg",
        "Smallest humidity-ratio drop the readings show",
        0.3,
        "g/kg",
        "our choice from typical instrument accuracy: ±2 % RH and ±0.3 K at 20 °C make each "
        "reading's humidity ratio uncertain by about ±0.3 g/kg (ASHRAE ch. 1 eqn 20)",
        "A drop across the unit smaller than this cannot be told from no drop; an outlet "
        "this much wetter than the inlet is a reading fault or a unit not dehumidifying.",
        "choice",
    ),
    Threshold(
        "water_density_kg_per_l",
        "Collected water, mass to volume",
        1.0,
        "kg/L",
        "our choice; water is 0.9997 kg/L at 10 °C, 0.9982 at 20 °C and 0.9957 at 30 °C "
        "(IAPWS, from memory)",
        "Water weighed in kg or lb is taken as 1 kg per litre; the error is under 0.5 % "
        "at any temperature collected water has.",
        "choice",
    ),
    # --- what a room unit can give: beyond these the readings disagree -------------------------
    Threshold(
        "dehumidifier_removal_max_l_per_day",
        "Highest removal a room dehumidifier gives",
        1000.0,
        "L/day",
        "our choice, well above the largest portable restoration units, which are rated at "
        "roughly 70–150 L/day (from memory)",
        "A removal rate above this from one unit says the water or the hours were recorded "
        "wrongly: the rate, and what follows from it, is not shown.",
        "choice",
    ),
    Threshold(
        "dehumidifier_energy_factor_max_l_per_kwh",
        "Highest energy factor of a refrigerant dehumidifier",
        8.0,
        "L/kWh",
        "our choice: about twice the best rated units (rated energy factors of roughly "
        "1.5–4 L/kWh, from memory); condensing 1 L takes about 0.68 kWh (2450 kJ/kg), so "
        "8 L/kWh would need a cycle moving 5.4 kWh of latent heat per kWh drawn (computed)",
        "An energy factor above this says the water, the hours or the power or energy were "
        "recorded wrongly: it is not shown. A desiccant unit's is lower still.",
        "choice",
    ),
    Threshold(
        "dehumidifier_cop_max",
        "Highest COP of a dehumidifier's refrigeration cycle",
        8.0,
        "",
        "our choice: room units' cycles give COPs of about 2–4 (from memory); the Carnot "
        "limit between a 5 °C coil and a 40 °C condenser is 278.15 / 35 = 7.9 (computed)",
        "A COP above this says the water, the hours, the power or the air readings disagree: "
        "it is not shown.",
        "choice",
    ),
    Threshold(
        "dehumidifier_air_flow_max_m3_per_h",
        "Highest air flow through a room dehumidifier",
        3000.0,
        "m³/h",
        "our choice, about twice the largest portable restoration units (roughly 500–1500 "
        "m³/h, 300–900 cfm, from memory)",
        "An air flow implied above this means the water is far more than the drop across "
        "the unit allows (or the drop far too small for the water): the flow, the cooling "
        "and the COP are not shown.",
        "choice",
    ),
    # --- comparison with a rating --------------------------------------------------------------
    Threshold(
        "dehumidifier_nominal_coil_c",
        "Driest air a refrigerant unit works toward, dew point",
        0.0,
        "°C",
        "our approximation, no source: a refrigerant coil cannot dry air below a dew point "
        "of about 0 °C without frosting, so removal falls toward nothing as the entering "
        "air's dew point nears it",
        "A refrigerant unit's removal is taken as proportional to the entering air's "
        "humidity ratio above that of saturated air at this dew point, scaled from its "
        "rating condition to the site's; a desiccant unit's as proportional to the humidity "
        "ratio itself. A rough guide (within perhaps a third of a maker's performance table "
        "between the rating points): the maker's table is better where known.",
        "choice",
    ),
    Threshold(
        "dehumidifier_shortfall_fraction",
        "Removal below what the site air allows, under",
        0.7,
        "",
        "our choice",
        "A measured removal under this share of what the rating, scaled to the site air, "
        "leads one to expect is a shortfall worth checking (filter, coil, fan, drain, "
        "humidistat cycling the unit off).",
        "choice",
    ),
    Threshold(
        "dehumidifier_excess_fraction",
        "Removal above what the site air allows, over",
        1.5,
        "",
        "our choice",
        "A measured removal over this multiple of the scaled rating more often means the "
        "water or the hours were recorded wrongly than an unusually good unit.",
        "choice",
    ),
)
