"""The report's closing parts in words: safety, method, glossary (drying progress is
:mod:`survey.words.drying`'s)."""

from __future__ import annotations

from collections.abc import Iterable, Sequence

from survey import thresholds as th
from survey.words.cautions import CAUTION_NAMES as CAUTION_NAMES
from survey.words.display import Display

# --- safety ----------------------------------------------------------------------------------

SAFETY_INTRO = "These cautions follow from what was found:"
SAFETY_NONE = "No caution follows from what was found."
GENERAL_LEAD = "In any damp or mould work"
GENERAL_CAUTIONS = (
    (
        "Mould, sewage or flood water, and soaked materials can harm health: people with asthma, "
        "allergies or weak immune systems, babies and older people should keep away from the work."
    ),
    (
        "Water and electricity: keep clear of wet sockets, switches and appliances until an "
        "electrician has made them safe."
    ),
    (
        f"Buildings built before about {th.value('asbestos_possible_before_year'):.0f} may hold "
        f"asbestos, and paint from before {th.value('lead_paint_possible_before_year'):.0f} lead: "
        "do not drill, sand, strip or remove old materials until they have been checked."
    ),
    "Crawl spaces, lofts and flooded basements can be confined spaces: do not go in alone.",
    (
        "Do not dry or heat with unflued gas or paraffin heaters: they add water vapour and "
        "carbon monoxide."
    ),
)
DEFERRAL = (
    "This report informs; it does not replace local building codes and regulations, "
    "public-health guidance or the advice of a licensed professional."
)


def applies_to(text: str, rooms: Sequence[str]) -> str:
    return f"{text} (Applies to: {', '.join(rooms)}.)" if rooms else text


# --- method ----------------------------------------------------------------------------------


def method_items(d: Display) -> tuple[tuple[str, str], ...]:
    """The method, item by item (name, text); temperatures in ``d``'s units."""
    zero = d.temperature(0.0, 0)
    return (
        (
            "Moist air",
            (
                "Dew point, frost point, humidity ratio and vapour pressure are worked "
                "out from each air temperature and relative humidity with psychrolib, which "
                "follows "
                "ASHRAE Handbook Fundamentals (2017) ch. 1, at the air pressure stated for the "
                "visit."
            ),
        ),
        (
            f"Humidity below {zero}",
            (
                "Hygrometers report relative humidity relative to liquid water "
                "at every temperature (the meteorological convention), and so does this report. "
                "Below "
                f"{zero} the condensation point is the frost point, and a surface below {zero} is "
                "judged "
                "against ice, because frost is what forms there."
            ),
        ),
        (
            "Surface RH",
            (
                "The relative humidity the room air has where it touches a surface: the "
                "room air's vapour pressure divided by the saturation vapour pressure at the "
                "surface "
                "temperature. 100 % or more means water (or frost) is forming."
            ),
        ),
        (
            "Temperature factor",
            (
                "fRsi = (surface − outdoor) / (indoor − outdoor), from EN ISO "
                "13788 and BRE IP1/06; judged only for walls, ceilings and floors of heated "
                "rooms, and "
                "only when inside and outside differ by enough for one reading to mean something."
            ),
        ),
        (
            "Humidity class",
            (
                "The room air's vapour pressure above outdoors, against the classes "
                "of EN ISO 13788 Annex A; the classes are defined for monthly means, so one "
                "reading is "
                "a guide."
            ),
        ),
        (
            "Timber",
            (
                "The moisture content timber settles at in the room air, from the USDA FPL "
                "Wood Handbook eqn 4-5."
            ),
        ),
        (
            "Uncertainty",
            (
                "Each instrument's ± accuracy is read as a rectangular distribution "
                "(standard uncertainty a/√3); the effects are combined to first order following "
                "the "
                "GUM (JCGM 100:2008), and every ± and range shown is an expanded uncertainty with "
                "coverage factor 2 (about 95 %). Where a limit lies inside that range the report "
                "says "
                "the state is unclear at this accuracy rather than guess."
            ),
        ),
        (
            "Spot readings",
            (
                "A reading is a snapshot of one moment, not a season: the limits of "
                "mould growth and humidity classes are defined for averages over days or months. "
                "Repeated readings or a data logger over a week or two say more."
            ),
        ),
    )


def accuracy_method_text(
    entered: dict[str, bool], air_k: float, rh_pct: float, surface_k: float, d: Display
) -> str:
    from_survey = [
        name
        for key, name in (
            ("air_temp_k", "air temperature"),
            ("rh_pct", "RH"),
            ("surface_temp_k", "surface temperature"),
        )
        if entered.get(key)
    ]
    assumed = [
        name
        for key, name in (
            ("air_temp_k", "air temperature"),
            ("rh_pct", "RH"),
            ("surface_temp_k", "surface temperature"),
        )
        if not entered.get(key)
    ]
    text = (
        f"Accuracies used (the least accurate instrument counts in each room): "
        f"{accuracy_used_text(air_k, rh_pct, surface_k, d)}."
    )
    if from_survey:
        text += " From the survey's instruments: " + ", ".join(from_survey) + "."
    if assumed:
        text += (
            " Typical specifications assumed, since none is recorded: " + ", ".join(assumed) + "."
        )
    return text


LIMITS_INTRO = "Every limit behind the findings, with its source:"

# --- glossary --------------------------------------------------------------------------------


def glossary(d: Display) -> tuple[tuple[str, str], ...]:
    """The trade terms the report uses, with short plain meanings."""
    zero = d.temperature(0.0, 0)
    return (
        (
            "Relative humidity (RH)",
            (
                "how much water vapour the air holds, as a percentage of the "
                "most it could hold at its temperature."
            ),
        ),
        (
            "Dew point",
            (
                "the temperature at which the air's water vapour starts to condense into "
                f"water; below {zero} the frost point, where frost forms."
            ),
        ),
        (
            "Surface RH",
            (
                "the relative humidity of the air right at a surface; mould can grow when "
                f"it stays above about {th.value('surface_rh_mould_limit_pct'):.0f} % for days."
            ),
        ),
        (
            "Margin to dew/frost point",
            (
                "how far a surface is above the temperature at which water "
                "or frost would form on it."
            ),
        ),
        (
            "Humidity ratio",
            (
                "the mass of water vapour in each kilogram of dry air (g/kg, or grains "
                "per pound); it does not change when air warms or cools, so it compares rooms and "
                "visits fairly."
            ),
        ),
        (
            "Vapour pressure",
            (
                "the part of the air pressure due to water vapour; more indoors than "
                "outdoors means moisture is being added inside."
            ),
        ),
        (
            "Temperature factor (fRsi)",
            (
                "how warm a surface stays compared with the inside and "
                "outside air: 1 is as warm as the room, 0 as cold as outdoors."
            ),
        ),
        (
            "Humidity class",
            (
                "a band of indoor moisture production, from dry storage (class 1) to "
                "laundries and pools (class 5)."
            ),
        ),
        (
            "Dry standard",
            (
                "a moisture reading of the same material in an unaffected area: the "
                "goal a wet material is dried to."
            ),
        ),
        (
            "Moisture content (MC)",
            (
                "the water in timber as a percentage of its dry weight; decay "
                f"fungi need about {th.value('timber_decay_mc_pct'):.0f} % or more, mould grows "
                "from "
                f"about {th.value('timber_mould_mc_pct'):.0f} %."
            ),
        ),
        (
            "Air changes an hour",
            ("how many times an hour the room's volume of air is replaced by outdoor air."),
        ),
        (
            "Expanded uncertainty",
            (
                "the range, about 95 % sure, within which the true value lies, "
                "given the instruments' accuracy."
            ),
        ),
    )


def accuracy_used_text(air_k: float, rh_pct: float, surface_k: float, d: Display) -> str:
    return f"air ±{d.difference(air_k)}, RH ±{rh_pct:g} %, surface ±{d.difference(surface_k)}"


def names_list(names: Iterable[str]) -> str:
    return ", ".join(names)
