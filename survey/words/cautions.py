"""Safety cautions as sentences, by key (:mod:`survey.advise.cautions` decides which)."""

from __future__ import annotations

from survey import thresholds as th
from survey.advise.kinds import Caution
from survey.words.display import Display

_MEDIUM = (
    "have it removed by someone trained, with gloves, goggles and at least an FFP2 / "
    "N95 respirator, the area sealed off with plastic sheeting and the waste bagged; "
    "keep occupants, above all vulnerable people, out during the work."
)
_LARGE_NEEDS = "A large area needs a licensed or specialist mould remediation contractor."

CLOSING_TEXT = (
    "These findings come from spot readings at the stated instrument accuracies. Follow local "
    "building codes and regulations, and the advice of licensed professionals (electricians, "
    "gas engineers, mould, asbestos and structural specialists), before acting on them."
)

_FIXED = {
    "water_category_3": (
        "Category 3 water (sewage, flood or other grossly contaminated water): stay out "
        "without protective equipment (gloves, boots, eye protection, respirator). It needs "
        "trained, licensed handling; soaked porous materials are removed, not dried. Wash "
        "hands and see a doctor about any illness after contact."
    ),
    "water_category_2": (
        "Category 2 water (significantly contaminated, e.g. from a washing machine, "
        "dishwasher or toilet overflow without faeces): wear gloves and eye protection, keep "
        "children and pets away, and follow the restoration standard of practice for what "
        "can be dried and what must be removed. Left standing it can become category 3."
    ),
    "electrics_near_water": (
        "Water and electricity: do not touch switches, sockets or appliances that are wet or "
        "in standing water; have a qualified electrician make wet circuits safe before work. "
        "Run dehumidifiers and fans from a socket with residual-current protection (RCD / "
        "GFCI), leads kept off wet floors."
    ),
    "closing": CLOSING_TEXT,
}


def _mould(area: float, d: Display) -> str:
    small = th.value("mould_area_small_m2")
    large = th.value("mould_area_large_m2")
    if area <= 0.0:
        return (
            f"Visible mould, area not measured: measure it (up to about {d.area(small)} is "
            f"a small area, over about {d.area(large)} a large one that needs a licensed "
            f"or specialist mould remediation contractor). Until it is measured, treat it "
            f"as a medium area: " + _MEDIUM
        )
    if area <= small:
        return (
            f"Visible mould, about {d.area(area)}: a small area. A careful adult can clean "
            "it with detergent and water, wearing gloves, eye protection and a disposable "
            "respirator (FFP2 / N95); wipe, do not dry-brush; bag the waste. People with "
            "asthma, allergies or weak immune systems should not do it. It returns unless "
            "the damp is cured."
        )
    if area <= large:
        return (
            f"Visible mould, about {d.area(area)}: a medium area. "
            + _MEDIUM[0].upper()
            + _MEDIUM[1:]
        )
    return (
        f"Visible mould, about {d.area(area)}: a large area. Call a licensed or specialist "
        "mould remediation contractor: it needs full containment, protective equipment and "
        "air filtration. Vulnerable occupants should not stay in the area."
    )


#: A caution's short name, for a list of the cautions that apply to a room.
CAUTION_NAMES = {
    "visible_mould": "visible mould",
    "mould_if_visible": "mould if seen",
    "water_category_3": "category 3 water",
    "water_category_2": "category 2 water",
    "water_category_1": "category 1 water",
    "electrics_near_water": "electrics near water",
    "confined_space": "confined space",
    "combustion_heaters": "combustion heaters",
    "asbestos_lead": "old materials (asbestos, lead)",
    "combustion_air": "combustion air of flued appliances",
    "closing": "local codes and licensed professionals",
}


#: Whose rule the small / medium / large mould areas are.
_AREA_BANDS = (
    " (The area bands follow US EPA mould remediation guidance; local rules and health "
    "guidance may set others.)"
)


def caution_text(caution: Caution, d: Display) -> str:
    """The caution as a sentence or two."""
    key = caution.key
    if key in _FIXED:
        return _FIXED[key]
    if key == "visible_mould":
        return _mould(caution.area_m2 or 0.0, d) + _AREA_BANDS
    if key == "mould_if_visible":
        return (
            "A surface is above the mould limit: if mould is visible, measure its area; until "
            "it is measured, treat it as a medium area and " + _MEDIUM + " " + _LARGE_NEEDS
        )
    if key == "water_category_1":
        hours = th.value("water_category_1_degrades_h")
        return (
            "Category 1 water (clean, e.g. from a burst supply pipe): dry it promptly. Left "
            "standing, or soaked into building materials, it degrades to category 2 "
            f"(commonly within about {hours:.0f} hours, sooner in a warm room), and then "
            "needs the category 2 precautions: gloves and eye protection, and some soaked "
            "materials removed rather than dried."
        )
    if key == "confined_space":
        if caution.use == "basement":
            return (
                "Basement: if the basement is unheated, poorly ventilated or flooded, "
                "treat it as a confined space. Do not go in alone, tell someone where you "
                "are, and check before entering for poor air (low oxygen, gas, sewer gas, "
                "combustion fumes), unsafe floors, and live wiring near water. Local rules "
                "may require confined-space entry procedures."
            )
        phrase = {"crawlspace": "Crawl space", "loft": "Loft"}.get(
            caution.use or "", (caution.use or "space").capitalize()
        )
        return (
            f"{phrase}: a confined or hard-to-reach space. Do not go in alone, tell "
            "someone where you are, and check before entering for poor air (low oxygen, "
            "gas, sewer gas, combustion fumes), unsafe floors or joists, sharp fixings, "
            "pests and live wiring. Local rules may require confined-space entry "
            "procedures."
        )
    if key == "combustion_heaters":
        water = th.value("propane_water_kg_per_kg")
        return (
            "Do not heat or dry with unflued gas or paraffin heaters: burning 1 kg of "
            f"propane releases about {water:.1f} kg of water vapour into the room, and they "
            "give off carbon monoxide. Use electric heat, and fit a carbon monoxide alarm "
            "where any fuel-burning appliance runs."
        )
    if key == "asbestos_lead":
        asbestos = th.value("asbestos_possible_before_year")
        lead = th.value("lead_paint_possible_before_year")
        risks = []
        if "asbestos" in caution.risks:
            risks.append(f"asbestos (used in buildings up to about {asbestos:.0f})")
        if "lead_paint" in caution.risks:
            risks.append(
                f"lead paint (common before {lead:.0f} in the US; the year differs "
                "by country, from the 1920s to the 1990s)"
            )
        age = "of unknown age" if caution.year_built is None else f"built in {caution.year_built}"
        return (
            f"Old materials: in a building {age}, have suspect materials checked for "
            + " and ".join(risks)
            + " before drilling, cutting, sanding, stripping or "
            "removing anything (linings, ceilings, floor tiles, pipe lagging, textured "
            "coatings, old paint, window putty). Do not disturb suspect material; use a "
            "licensed surveyor or contractor."
        )
    if key == "combustion_air":
        which = (
            "there is an open-flued appliance here"
            if caution.flued
            else "if there is an open-flued appliance here or in the building"
        )
        return (
            f"Combustion air: {which} (a boiler, water heater, stove or open fire that "
            "draws its air from the room), closing the space up or running an extract fan "
            "can pull flue gases back into the room. Have its combustion air and flue "
            "checked by a registered gas or fuel engineer before the advice here is "
            "followed, and fit a carbon monoxide alarm."
        )
    raise KeyError(f"no words for caution {key!r}")
