"""Shared phrases of the action words: percentages, limits, the target and the moisture load."""

from __future__ import annotations

from survey import thresholds as th
from survey.advise.kinds import (
    MoistureEstimate,
    Target,
    TargetWhy,
)
from survey.words.display import Display
from survey.words.states import USE_PHRASE


def _pct(x: float | None) -> str:
    return "–" if x is None else f"{x:.0f} %"


def _limit_phrase(use: str, limit: float) -> str:
    """'the 0.75 limit for a bedroom', or 'the general 0.70 limit' for an unknown use."""
    phrase = USE_PHRASE[use]
    return (
        f"the general {limit:.2f} limit"
        if phrase is None
        else f"the {limit:.2f} limit for {phrase}"
    )


# --- target and moisture load --------------------------------------------------------------


def target_basis(target: Target, d: Display) -> str:
    """Why the room is aimed at its target RH: a phrase starting with the target."""
    if target.why is TargetWhy.DRYING:
        low = th.value("drying_rh_target_low_pct")
        return (
            f"{target.rh_pct:.0f} % RH, the top of the {low:.0f}-{target.rh_pct:.0f} % RH "
            f"drying target (common practice) while materials dry, not the "
            f"{th.value('room_rh_target_default_pct'):.0f} % target for everyday use."
        )
    if not target.lowered_by_surface:
        if target.why is TargetWhy.GIVEN:
            return f"{target.rh_pct:.0f} % RH, the target given."
        return f"{target.rh_pct:.0f} % RH, the usual target for a room."
    surface = (
        f"the coldest wall, ceiling or floor ({target.coldest_label}, "
        f"{d.temperature(target.coldest_temp_c)})"
    )
    if target.binding == "mould":
        passes = (
            f"goes over {th.value('surface_rh_mould_limit_pct'):.0f} % surface RH, the mould limit"
        )
    else:
        point = "frost point" if target.frost_point else "dew point"
        passes = f"comes within {d.difference(th.value('dew_point_margin_k'))} of the {point}"
    if target.why is TargetWhy.GIVEN and target.rh_pct < target.design_rh_pct:
        passes += (
            f" (so the {target.design_rh_pct:.0f} % given was lowered to {target.rh_pct:.0f} %)"
        )
    whole = target.surface_limit_whole_pct
    if target.at_practical_floor:
        return (
            f"{target.rh_pct:.0f} % RH, the lowest it is practical to hold. Above "
            f"{whole:.0f} %, {surface} {passes}, so it must also be made warmer."
        )
    return f"{target.rh_pct:.0f} % RH: above that, {surface} {passes}."


_MISSING_WORDS = {
    "occupants": "the number of occupants",
    "outdoor_air": "the outdoor air",
    "room_volume": "the room volume",
}


def moisture_missing(moisture: MoistureEstimate) -> str:
    """What to give so the load can be worked out."""
    if moisture.outdoor_as_wet:
        return (
            "give the number of occupants: the load cannot be worked out from the measured "
            "excess while outdoor air holds as much water as the room air or more"
        )
    others = [_MISSING_WORDS[m] for m in moisture.missing if m != "occupants"]
    return "give the number of occupants, or " + " and ".join(others)


def moisture_basis(moisture: MoistureEstimate, use: str, d: Display) -> str:
    """How the moisture load was worked out, with each basis's number."""
    people = []
    if moisture.occupants_assumed_zero:
        people.append(
            f"occupants not given, taken as 0 for {USE_PHRASE[use]} that is closed "
            f"up: {d.moisture_rate(0.0)}"
        )
    elif moisture.occupants == 0:
        people.append(f"no occupants: {d.moisture_rate(0.0)}")
    elif moisture.occupant_rate_key is not None:
        rate = th.value(moisture.occupant_rate_key)
        kind = "asleep" if moisture.occupant_rate_key.endswith("asleep_g_per_h") else "sitting"
        n = moisture.occupants
        people.append(
            f"{n} {'person' if n == 1 else 'people'} {kind} at "
            f"{d.moisture_rate(rate)}{' each' if n != 1 else ''}: "
            f"{d.moisture_rate(moisture.occupants_g_per_h)}"
        )
    if moisture.typical_use_assumed is not None:
        amount = moisture.typical_use_amount
        what = {
            "shower": f"{amount:g} showers a day",
            "cooking": f"{amount:g} h of cooking a day",
            "laundry": f"{amount:g} wash load{'s' if amount != 1 else ''} dried indoors a day",
        }[moisture.typical_use_assumed]
        people.append(
            "no daily use entered (showers, cooking, laundry), so "
            f"{USE_PHRASE[use]}'s typical {what} is assumed: "
            f"{d.moisture_rate(moisture.activities_g_per_h)} over the day"
        )
    elif moisture.activities_g_per_h is not None:
        people.append(
            f"activities averaged over the day: {d.moisture_rate(moisture.activities_g_per_h)}"
        )
    back = None
    if moisture.back_calculated_g_per_h is not None:
        back = (
            f"the measured excess over outdoor air at an assumed "
            f"{moisture.assumed_air_change_rate_per_h:g} air changes an hour: "
            f"{d.moisture_rate(moisture.back_calculated_g_per_h)}"
        )
    if moisture.used_g_per_h is None:
        return f"not known ({moisture_missing(moisture)})"
    if len(people) > 1:
        total = (moisture.occupants_g_per_h or 0.0) + (moisture.activities_g_per_h or 0.0)
        people_text = f"{d.moisture_rate(total)} from the room's use (" + "; ".join(people) + ")"
    else:
        people_text = people[0] if people else ""
    if people and back is not None:
        return f"the larger of {people_text}, and {back}"
    return people_text or back or ""
