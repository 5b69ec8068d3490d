"""Actions, their targets and moisture loads as sentences for the inspector's client.

Every function takes the typed result (:mod:`survey.advise`), the finding it came from where
the sentence quotes a reading, and a :class:`~survey.words.display.Display`.
"""

from __future__ import annotations

from typing import Any

from survey import thresholds as th
from survey.advise.kinds import (
    Action,
    ActionKind,
    ColdSurfaceNumbers,
    DehumidifyNumbers,
    DehumidifyWhy,
    FindSourceNumbers,
    Forming,
    KeepDryingNumbers,
    MaterialPoint,
    MoistureEstimate,
    OutdoorMode,
    RaiseSurfaceNumbers,
    RemoveContaminatedNumbers,
    RepeatReadingsNumbers,
    RoomAdvice,
    SourceReason,
    Target,
    TargetWhy,
    VentilatedSpaceNumbers,
    VentilateNumbers,
)
from survey.assess import RoomFinding
from survey.safe_text import visible
from survey.words.display import Display, round_down_rh
from survey.words.states import USE_PHRASE, humidity_class_range_text, humidity_class_text

TITLES = {
    ActionKind.VENTILATE: "Ventilate",
    ActionKind.DEHUMIDIFY: "Dehumidify",
    ActionKind.RAISE_SURFACE_TEMPERATURE: "Raise the surface temperature",
    ActionKind.FIND_SOURCE: "Find the moisture source",
    ActionKind.KEEP_DRYING: "Keep drying to the dry standard",
    ActionKind.REDUCE_GLAZING_CONDENSATION: "Deal with condensation on the window",
    ActionKind.INSULATE_PIPE: "Insulate the cold pipe",
    ActionKind.REPEAT_READINGS: "Repeat the readings",
    ActionKind.DRY_VENTILATED_SPACE: "Cut the moisture reaching the space",
    ActionKind.REMOVE_CONTAMINATED_MATERIALS: "Remove contaminated materials before drying",
}


def _pct(x: float | None) -> str:
    return "–" if x is None else f"{x:.0f} %"


def action_title(action: Action[Any]) -> str:
    """The kind's title; an action about one surface names it (two surfaces, two titles)."""
    base = TITLES[action.kind]
    return f"{base}: {action.surface}" if action.surface else base


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
            f"{d.moisture_rate(rate)} each: "
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
            f"no use entered, so {USE_PHRASE[use]}'s typical {what} is assumed: "
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


# --- ventilation and dehumidification ------------------------------------------------------


def _bring(finding: RoomFinding, advice: RoomAdvice, d: Display) -> str:
    return (
        f"Bring the room from {_pct(finding.air.rh_pct)} down to {target_basis(advice.target, d)} "
    )


def _hr(d: Display, g_per_kg: float) -> str:
    return d("humidity_ratio", g_per_kg / 1000.0)


def _rest(advice: RoomAdvice, dehumidifier: str, warmer: str) -> str:
    """Who does the rest of the drying: the dehumidifier beside this action, or, where none
    is advised (no practical RH can save the coldest surface), warming the surface."""
    if any(a.kind is ActionKind.DEHUMIDIFY for a in advice.actions):
        return dehumidifier
    return warmer


def _ventilate(n: VentilateNumbers, finding: RoomFinding, advice: RoomAdvice, d: Display) -> str:
    air = finding.air
    moisture = advice.moisture
    wo, wr, wt = (
        n.outdoor_humidity_ratio_g_per_kg,
        n.room_humidity_ratio_g_per_kg,
        n.target_humidity_ratio_g_per_kg,
    )
    target = _pct(n.target_rh_pct)
    text = _bring(finding, advice, d)
    if n.outdoor_mode is OutdoorMode.HOLDS_TARGET:
        text += (
            f"Outdoor air is drier than the room air: it holds {_hr(d, wo)} of water, "
            f"against {_hr(d, wr)} in the room now and {_hr(d, wt)} in room air at "
            f"{target}."
        )
        if n.airflow_m3_per_h is None:
            return text + (
                " The airflow cannot be sized without the moisture load: "
                f"{moisture_missing(moisture)}."
            )
        text += f" At least {d.at_least('airflow', n.airflow_m3_per_h)} of outdoor air"
        if n.air_changes_per_h is not None:
            text += (
                f" ({n.air_changes_per_h:.1f} air changes an hour in this "
                f"{d('volume', n.room_volume_m3)} room)"
            )
        text += (
            f" carries away {d.moisture_rate(n.moisture_generation_g_per_h)} of moisture "
            f"and holds the room at {target}. Moisture load: "
            f"{moisture_basis(moisture, finding.use, d)}."
        )
        text += _code_minimum(n, d)
        if n.heat_to_warm_air_w is not None:
            text += (
                f" Warming that air to {d.temperature(air.dry_bulb_c)} takes about "
                f"{d.heat(n.heat_to_warm_air_w)} of heating."
            )
        return text + (
            " Use trickle vents or a continuous extract fan; open windows fully "
            "for a few minutes, often, rather than leaving one ajar."
        )
    warmed = _pct(n.outdoor_air_rh_at_room_temp_pct)
    text += (
        f"Outdoor air is drier than the room air: it holds {_hr(d, wo)} of water against "
        f"{_hr(d, wr)} in the room now, so airing the room brings it down. Ventilation "
        f"alone cannot hold {target}: room air at {target} holds {_hr(d, wt)}, "
    )
    if n.outdoor_mode is OutdoorMode.NO_DRIER_THAN_TARGET:
        text += (
            f"no more than outdoor air, which warmed to {d.temperature(air.dry_bulb_c)} is "
            f"itself at {warmed}."
        )
        return text + (
            f" Air the room out (windows wide open for a few minutes, several times "
            f"a day) while it is above about {warmed}; from there on, keep to "
            f"background ventilation (trickle vents, extract fans) "
            + _rest(
                advice,
                f"while a dehumidifier takes it down to {target}.",
                "and make the cold surface warmer, as below: no practical room RH keeps it dry.",
            )
        )
    margin = th.value("ventilation_outdoor_drier_margin_g_per_kg") / 1000.0
    text += (
        f"less than {d('humidity_ratio', margin)} more than outdoor air, so the airflow "
        f"needed would grow out of proportion (outdoor air warmed to "
        f"{d.temperature(air.dry_bulb_c)} is at {warmed})."
    )
    if n.airflow_m3_per_h is None:
        return text + (
            " Ventilate steadily (trickle vents, a continuous extract fan) "
            + _rest(
                advice,
                "and let a dehumidifier do the rest",
                "and make the cold surface warmer, as below",
            )
            + "; give the room volume to size the airflow."
        )
    text += (
        f" Ventilate at about {n.air_changes_per_h:.1f} air changes an hour "
        f"({d.at_least('airflow', n.airflow_m3_per_h)}), the most that is practical"
        if n.code_minimum_m3_per_h is None or n.airflow_m3_per_h > n.code_minimum_m3_per_h
        else f" Ventilate at least at the code minimum below "
        f"({d.at_least('airflow', n.airflow_m3_per_h)})"
    )
    if n.rh_at_practical_ventilation_pct is not None:
        load = d.moisture_rate(n.moisture_generation_g_per_h)
        if n.saturates:
            text += (
                f": {load} of moisture is more than that air can carry at "
                f"{d.temperature(air.dry_bulb_c)} — the room would saturate and water "
                f"would condense; a load this large calls for the source to be found "
                f"and cut"
            )
        else:
            text += (
                f": against {load} of moisture the room would settle near "
                f"{_pct(n.rh_at_practical_ventilation_pct)}"
            )
    text += _code_minimum(n, d)
    if n.saturates:
        return text + (
            "; no dehumidifier of a practical size keeps up with it either. Until "
            "the source is found, use trickle vents or a continuous extract fan, and "
            "open windows fully for a few minutes, often."
        )
    return (
        text
        + _rest(
            advice,
            "; a dehumidifier does the rest.",
            "; warming the cold surface, as below, does the rest: no practical "
            "room RH keeps it dry.",
        )
        + (
            " Use trickle vents or a continuous extract fan, and open windows fully for a few "
            "minutes, often."
        )
    )


_DRYING_CLOSED = (
    "Keep the drying area closed and dehumidify: keep windows, trickle vents and "
    "doors to outside shut and the area closed off from the rest of the "
    "building, so the dehumidifier takes water out of the materials rather "
    "than out of outdoor air."
)


#: Why-s that do not quote the outdoor air.
_NO_OUTDOOR_NEEDED = frozenset(
    {
        DehumidifyWhy.OUTDOOR_NOT_MEASURED,
        DehumidifyWhy.VENTILATION_OVER_PRACTICAL,
        DehumidifyWhy.VENTILATION_CANNOT_HOLD,
        DehumidifyWhy.DRYING_AIR_MOVERS_ONLY,
        DehumidifyWhy.DRYING_ABOVE_TARGET,
        DehumidifyWhy.DRYING_WITHIN_TARGET,
    }
)


def _dehumidify_why(
    n: DehumidifyNumbers, finding: RoomFinding, advice: RoomAdvice, d: Display
) -> str:
    air, out = finding.air, finding.outdoor
    basis = target_basis(advice.target, d)
    w_room = air.humidity_ratio_kg_per_kg
    if n.why is DehumidifyWhy.OUTDOOR_NOT_MEASURED:
        return _bring(finding, advice, d) + (
            f"The outdoor air was not measured: if it holds less water than the "
            f"{d('humidity_ratio', w_room)} of the room air now, airing the room helps too."
        )
    assert out is not None or n.why in _NO_OUTDOOR_NEEDED
    if n.why is DehumidifyWhy.OUTDOOR_WETTER and out is not None:
        return _bring(finding, advice, d) + (
            f"Outdoor air is wetter than the room air: it holds "
            f"{d('humidity_ratio', out.humidity_ratio_kg_per_kg)} of water against "
            f"{d('humidity_ratio', w_room)} in the room, so ventilating would add moisture. "
            f"Keep windows and doors to outside closed while dehumidifying."
        )
    if n.why is DehumidifyWhy.OUTDOOR_ABOUT_SAME and out is not None:
        return _bring(finding, advice, d) + (
            f"Outdoor air is about as wet as the room air: "
            f"{d('humidity_ratio', out.humidity_ratio_kg_per_kg)} of water against "
            f"{d('humidity_ratio', w_room)} in the room, so airing would do little; a "
            f"dehumidifier does the work."
        )
    coldest = finding.coldest
    if (
        n.why is DehumidifyWhy.OUTDOOR_DEW_POINT_ABOVE_SURFACE
        and out is not None
        and coldest is not None
    ):
        return _bring(finding, advice, d) + (
            f"Outdoor air is drier than the room air, but its dew point "
            f"({d.temperature(out.condensation_point_c)}) is above the coldest wall, ceiling "
            f"or floor ({visible(coldest.label)}, {d.temperature(coldest.surface_temp_c)}): "
            f"airing can bring the room's dew point down only to outdoor air's, so that "
            f"surface would stay wet. Keep windows and doors to outside closed and dehumidify "
            f"the room below it."
        )
    if n.why is DehumidifyWhy.VENTILATION_OVER_PRACTICAL:
        cap = n.practical_max_ach
        return (
            f"Ventilation alone needs {n.ventilation_air_changes_needed_per_h:.1f} air "
            f"changes an hour, more than the about {cap:g} that is practical: ventilate "
            f"at {cap:g} and let a dehumidifier do the rest."
        )
    if n.why is DehumidifyWhy.VENTILATION_CANNOT_HOLD:
        return (
            f"Ventilation cannot hold the room at {_pct(n.target_rh_pct)} by itself: a "
            f"dehumidifier takes it the rest of the way."
        )
    if n.why is DehumidifyWhy.DRYING_AIR_MOVERS_ONLY:
        return (
            f"Air movers are running here without a dehumidifier: on their own they "
            f"evaporate water from the materials into the air and raise the room RH (now "
            f"{_pct(air.rh_pct)}). Join this room to the dehumidified area (open it to "
            f"that area and close both off from outside) or give it its own dehumidifier. "
            + _DRYING_CLOSED
            + f" Hold it at {basis}"
        )
    if n.why is DehumidifyWhy.DRYING_ABOVE_TARGET:
        return f"{_DRYING_CLOSED} Bring the room from {_pct(air.rh_pct)} down to {basis}"
    low = th.value("drying_rh_target_low_pct")
    return (
        f"{_DRYING_CLOSED} The room is at {_pct(air.rh_pct)}, within the drying target of "
        f"{low:.0f}-{n.target_rh_pct:.0f} % RH: keep it there until materials reach the "
        f"dry standard."
    )


def _grain_depression(n: DehumidifyNumbers, finding: RoomFinding) -> str:
    if n.grain_depression_g_per_kg is None:
        return ""
    w_in = finding.air.humidity_ratio_g_per_kg
    w_out = n.outlet_humidity_ratio_g_per_kg or 0.0
    g_in, g_out = 7.0 * w_in, 7.0 * w_out
    text = (
        f" Grain depression (room air in, minus air out of the dehumidifier): "
        f"{w_in:.2f} − {w_out:.2f} = {n.grain_depression_g_per_kg:.2f} g/kg "
        f"({g_in:.0f} − {g_out:.0f} = {n.grain_depression_gr_per_lb:.0f} gr/lb)."
    )
    if n.grain_depression_g_per_kg <= 0.0:
        text += (
            " The outlet air is no drier than the room air: the unit is not removing "
            "water; check it is running, its coil is not iced and its drain is clear."
        )
    return text


def _dehumidify(n: DehumidifyNumbers, finding: RoomFinding, advice: RoomAdvice, d: Display) -> str:
    air = finding.air
    moisture = advice.moisture
    target = _pct(n.target_rh_pct)
    text = _dehumidify_why(n, finding, advice, d) + _grain_depression(n, finding)
    gains = []
    if n.generation_g_per_h is not None:
        gains.append(
            f"the room gains {d.moisture_rate(n.generation_g_per_h)} (moisture load: "
            f"{moisture_basis(moisture, finding.use, d)})"
        )
    if n.outdoor_gain_g_per_h is not None:
        how = "leaking in" if n.outdoor_air_how == "leaking_in" else "ventilating"
        verb = "brings" if n.outdoor_gain_g_per_h > 0 else "carries away"
        gains.append(
            f"outdoor air {how} at about {n.outdoor_air_changes_per_h:g} air changes "
            f"an hour {verb} {d.moisture_rate(abs(n.outdoor_gain_g_per_h))}"
        )
    if n.after_removal:
        text += (
            " This is for what remains once the contaminated porous materials are out "
            "and the area is cleaned: no drying before then."
        )
    if n.pull_down_l is not None:
        text += (
            f" Taking the room air itself down to {target} means removing about "
            f"{d.litres(n.pull_down_l)} once; wet materials hold far more."
        )
    if n.materials_load_l_per_day is not None:
        assumed = (
            " (no class was recorded: a class 2 loss, part of the room wet, is assumed)"
            if n.water_loss_class_assumed
            else ""
        )
        text += (
            f" The wet materials give off about {d.water(n.materials_load_l_per_day)}: "
            f"the drying chart's figure for a class {n.water_loss_class} water loss in "
            f"this room's volume{assumed}."
        )
    if n.logged_removal_l_per_day is not None:
        text += (
            f" The dehumidifier logged {n.water_removed_l:g} L in the "
            f"{n.hours_since_previous:.0f} h since the previous visit, about "
            f"{d.water(n.logged_removal_l_per_day)}: while materials dry, that measured "
            f"figure is the load, and the unit should keep up with it at this room's "
            f"conditions. Falling amounts from visit to visit mean the materials are "
            f"drying."
        )
    elif n.generation_g_per_h is None and n.load_l_per_day is not None:
        text += (
            f" Remove at least {d.water_at_least(n.load_l_per_day)} (the wet "
            f"materials; give the number of occupants for the room's own load)."
        )
    elif n.generation_g_per_h is None:
        text += (
            f" The moisture load to hold it there is not known "
            f"({moisture_missing(moisture)}), so no dehumidifier size can be given"
        )
        if n.outdoor_gain_g_per_h is not None and n.outdoor_gain_g_per_h > 0:
            text += (
                f"; outdoor air leaking in alone brings "
                f"{d.water(n.outdoor_gain_g_per_h * 24.0 / 1000.0)}"
            )
        text += "."
    elif n.load_l_per_day is not None and n.load_l_per_day > 0.0:
        if n.materials_load_l_per_day is not None:
            gains.append(f"the wet materials {d.water(n.materials_load_l_per_day)}")
        text += (
            " To hold it there: " + "; ".join(gains) + f"; "
            f"{d.water_at_least(n.load_l_per_day)} in all, the least a "
            f"dehumidifier should remove at this room's conditions."
            + (
                ""
                if n.materials_load_l_per_day is not None
                else " Drying wet materials adds much more."
            )
        )
    else:
        text += (
            " To hold it there: " + "; ".join(gains) + ". Outdoor air carries away more "
            "than the room produces, so once the room is down there is no daily load to "
            "hold against: the dehumidifier is for bringing it down, and for damper days."
        )
    old = th.value("dehumidifier_rating_old_dry_bulb_c")
    new = th.value("dehumidifier_rating_current_dry_bulb_c")
    rating_rh = th.value("dehumidifier_rating_rh_pct")
    unit = (
        "a unit"
        if n.rated_capacity_l_per_day is None
        else f"the unit here, rated {d.water(n.rated_capacity_l_per_day)},"
    )
    text += (
        f" Label capacities are measured at a rating point: {d.nominal_temperature(old)} "
        f"and {_pct(rating_rh)} RH for older ratings (AHAM DH-1), "
        f"{d.nominal_temperature(new)} and {_pct(rating_rh)} RH for the current US test. "
        f"Against the older point {unit} removes much less in a room at "
        f"{d.temperature(air.dry_bulb_c)}"
    )
    if abs(air.dry_bulb_c - new) <= 2.0:
        text += (
            f"; this room is near the current rating point, so a current rating is close "
            f"at {_pct(rating_rh)} RH, but less as the room dries toward {target}"
        )
    elif air.dry_bulb_c < new:
        text += ", and less than even a current rating says, being cooler than its test point"
    text += ". Check which rating a label uses, and choose a unit rated well above the load."
    if n.suggest_desiccant:
        cold = th.value("refrigerant_dehumidifier_min_c")
        text += (
            f" Below {d.temperature(cold)} a refrigerant unit loses most of its capacity "
            f"and can ice up: use a desiccant dehumidifier."
        )
    return text


def _occupants_note(n: VentilateNumbers | DehumidifyNumbers, advice: RoomAdvice, d: Display) -> str:
    if n.occupants_share_of_load is None:
        return ""
    moisture = advice.moisture
    return (
        f" The humidity class is high, but the occupants' own moisture "
        f"({d.moisture_rate(moisture.occupants_g_per_h or 0.0)}"
        + (" with activities" if moisture.activities_g_per_h else "")
        + f") accounts for {min(n.occupants_share_of_load, 9.99) * 100:.0f} % of the "
        f"{d.moisture_rate(moisture.back_calculated_g_per_h)} the measured excess implies "
        f"at the assumed air change rate: the room is under-ventilated for the people in "
        f"it rather than hiding a source."
    )


# --- the ventilated space ------------------------------------------------------------------


def _ventilated_space(n: VentilatedSpaceNumbers, d: Display) -> str:
    decay = th.value("timber_decay_mc_pct")
    slow = th.value("timber_decay_slow_below_c")
    if n.loft:
        text = (
            f"The loft is at {_pct(n.room_rh_pct)} RH. A ventilated loft follows outdoor "
            "air: dry it by cutting the moisture coming up from the rooms below: seal gaps "
            "around the hatch (fit a draught seal), ceiling lights, pipes and cables, and "
            "make sure no extract fan, tumble-drier or soil vent discharges into the loft "
            "(duct them to outside). Check the eaves and ridge ventilation is open and "
            "not blocked by insulation."
        )
    else:
        text = (
            f"The crawl space is at {_pct(n.room_rh_pct)} RH. A ventilated crawl space "
            "follows outdoor air: dry it by cutting the moisture coming in: lay a ground "
            "vapour barrier (polyethylene sheet, lapped and taped, held down), fix leaks "
            "and drainage that bring water in, and check the air bricks or vents are open "
            "and clear."
        )
    if n.keep_vents_closed:
        why = []
        if n.outdoor_wetter_than_space:
            why.append("outdoor air holds more water than the space")
        if n.outdoor_dew_point_above_coldest_surface:
            why.append(
                f"its dew point ({d.temperature(n.outdoor_dew_point_c)}) is above the "
                f"space's coldest measured surface ({d.temperature(n.coldest_surface_temp_c)})"
            )
        text += (
            " Today " + " and ".join(why) + ": air let in through the vents would add "
            "water and condense on cold surfaces, so do not open more vents now. Either "
            "keep the vents closed while outdoor air is this humid and dry the closed "
            "space with a dehumidifier, or have it sealed and conditioned (vents closed "
            "for good, a ground vapour barrier, and dehumidified or conditioned air), "
            "designed by someone who can check the combustion air of any appliance in "
            "or above the space."
        )
    text += (
        " A dehumidifier helps only if the space is sealed (closed off from outdoor air): "
        "in a space open to outdoor air it would spend its effort on the outdoor air "
        "streaming through. Measure the timber with a pin moisture meter (wood scale): "
        f"decay fungi need about {decay:.0f} % moisture content or more."
    )
    for t in n.timber_surfaces or ():
        name = t.surface[:1].upper() + t.surface[1:]
        if t.emc_pct is None:
            text += (
                f" {name} at {d.temperature(t.surface_temp_c)} and "
                f"{_pct(t.surface_rh_pct)} surface RH is too wet for the Wood Handbook "
                f"equation (used up to "
                f"{th.value('timber_emc_equation_max_rh_pct'):g} % RH): its moisture is "
                f"not estimated; it may well be in the decay range, so measure it."
            )
            continue
        sentence = (
            f" {name} at {d.temperature(t.surface_temp_c)} and "
            f"{_pct(t.surface_rh_pct)} surface RH would settle at about "
            f"{t.emc_pct:.1f} % moisture content (Wood Handbook eqn 4-5 at the "
            f"surface)"
        )
        if t.emc_pct >= decay:
            sentence += f": in the decay range (above about {decay:.0f} %)"
        else:
            sentence += f": below the {decay:.0f} % decay range, but check it with the meter"
        if t.surface_temp_c < slow:
            sentence += (
                f"; below {d.temperature(slow)} decay is slower, not stopped, and "
                "speeds up when it warms"
            )
        text += sentence + "."
    return text


# --- surfaces --------------------------------------------------------------------------------

_REMEDY = {
    "internal_wall": (
        "keep the room heated steadily and furniture off it. An internal wall "
        "this cold usually backs onto an unheated space or a chimney, or hides "
        "a leak or a cold bridge: find out which before treating it."
    ),
    "floor": (
        "keep the room heated steadily, keep rugs and stored things off the coldest "
        "part, and have the floor insulation, the slab edge or a thermal bridge "
        "investigated."
    ),
    "ceiling": (
        "keep the room heated steadily, and have the insulation above it (gaps in "
        "the loft insulation, a cold eaves corner) or a thermal bridge investigated."
    ),
    "other": (
        "keep the room heated steadily, keep furniture and stored things off cold "
        "walls, and have the insulation, thermal bridge or cold corner investigated."
    ),
}


def _raise_surface(n: RaiseSurfaceNumbers, d: Display) -> str:
    mould_limit = th.value("surface_rh_mould_limit_pct")
    floor = th.value("room_rh_floor_pct")
    reasons = []
    if n.too_cold:
        reasons.append(
            f"it stays at or below {_pct(mould_limit)} surface RH only while the room "
            f"is below {_pct(n.max_room_rh_pct)}, under the {_pct(floor)} that can "
            f"be held in practice"
        )
    if n.factor_under:
        reasons.append(
            f"its temperature factor is {n.temperature_factor:.2f} "
            f"(±{n.temperature_factor_uncertainty:.2f}), under "
            f"{_limit_phrase(n.use, n.temperature_factor_limit or 0.0)}, which today "
            f"means "
            f"a surface of at least "
            f"{d.minimum_temperature(n.surface_temp_for_factor_limit_c)} (the factor "
            f"limit)"
        )
    if n.drying_wet:
        reasons.append(
            "it is wet and below the dew point now: water forms on it, and "
            "evaporation from the wet material keeps it cold while it dries"
        )
    design = _pct(n.design_rh_pct)
    text = (
        f"{visible(n.surface)} is too cold at {d.temperature(n.surface_temp_c)}: "
        + "; ".join(reasons)
        + ". "
        f"Raise it to at least {d.minimum_temperature(n.target_surface_temp_c)} "
        + (
            f"(the factor limit; {d.minimum_temperature(n.surface_temp_for_target_rh_c)} "
            f"would do for {design} room RH alone) "
            if n.target_surface_temp_c > n.surface_temp_for_target_rh_c
            else ""
        )
        + f"so the room can be kept at {design} without mould risk: "
    )
    if n.ground_contact:
        text += (
            "keep the space heated steadily and the air dry, and keep stored things off "
            "the coldest part. This surface is in contact with the ground, which sets "
            "its temperature: its temperature factor is not judged against outdoor air."
        )
    else:
        text += _REMEDY.get(n.element, _REMEDY["other"])
    if n.dehumidifier_cannot_cure:
        text += (
            f" A dehumidifier cannot cure this: even at {_pct(floor)}, the lowest RH it "
            f"is practical to hold, the surface would stay above the mould limit."
        )
    if n.drying_wet:
        text += (
            " While it dries, keep the room warm and the drying going; judge the surface "
            "again once the material reads dry."
        )
    if n.factor_under:
        text += (
            " The factor comes from one reading: confirm it on another cold day, or with "
            "a thermal image, before building work."
        )
    return text


def _code_minimum(n: VentilateNumbers, d: Display) -> str:
    """The usual code minimum extract for a wet room, named as a minimum local codes set."""
    if n.code_minimum_m3_per_h is None:
        return ""

    def rate(key: str) -> str:
        t = th.get(key)
        return f"{t.value:g} {t.unit}"

    use = n.use
    intermittent = [rate(f"extract_{use}_intermittent_l_per_s")]
    continuous = [rate(f"extract_{use}_continuous_l_per_s")]
    if use == "bathroom":
        intermittent.append(rate("extract_bathroom_intermittent_cfm"))
        continuous.append(rate("extract_bathroom_continuous_cfm"))
    elif use == "kitchen":
        intermittent.append(rate("extract_kitchen_intermittent_cfm"))
        continuous.append("5 kitchen air changes an hour")
    held = (
        " The moisture balance alone asks for "
        f"{d('airflow', n.sized_airflow_m3_per_h)}: the fan is held to the minimum."
        if n.sized_airflow_m3_per_h is not None
        and n.sized_airflow_m3_per_h < n.code_minimum_m3_per_h
        else ""
    )
    return (
        f" Extract from {USE_PHRASE[use]} is commonly required at no less than "
        f"{' or '.join(intermittent)} when switched on after use, or {' or '.join(continuous)} "
        f"running continuously (England's Approved Document F, and ASHRAE 62.2 in the US; "
        f"from memory): these are minimums, and the local code sets its own. Continuous "
        f"extract here should be at least {d.at_least('airflow', n.code_minimum_m3_per_h)}." + held
    )


def _remove_contaminated(n: RemoveContaminatedNumbers, d: Display) -> str:
    degraded = ""
    if n.degraded:
        degraded = (
            f" The water was recorded as category {n.water_category}, but it has stood "
            f"for about {n.water_standing_h:g} h: long enough to be treated as "
            f"category {n.effective_category}."
        )
    porous = ""
    if n.porous_materials:
        porous = (
            " Porous materials read here ("
            + ", ".join(visible(m) for m in n.porous_materials)
            + ") are among them."
        )
    movers = (
        " Stop the air movers now: air blown across contaminated material spreads it "
        "through the building."
        if n.stop_air_movers
        else ""
    )
    return (
        f"Category {n.effective_category} water (grossly contaminated: sewage, flood or "
        f"long-standing water) reached this room.{degraded} Porous materials it soaked — "
        "plasterboard, carpet and underlay, insulation, fibreboard, soft furnishings — are "
        "removed and bagged, not dried." + porous + " Before work: contain the area (sheeting, "
        "the doors to the rest of the building closed), and wear protective equipment "
        "(gloves, boots, eye protection and a respirator); no air movement across "
        "contaminated material until it is removed and the area cleaned. This is work for "
        "trained, licensed contractors." + movers + " Dry only what remains once that is "
        "done."
    )


def _point(n: ColdSurfaceNumbers) -> tuple[str, str]:
    """(the room air's condensation point by its name, what forms on this surface): the
    point is a frost point when it lies below 0 °C; what forms on a surface below 0 °C is
    frost."""
    point = "frost point" if n.condensation_point_c <= 0.01 else "dew point"
    return point, ("frost" if n.frost else "water")


def _forming(n: ColdSurfaceNumbers) -> str:
    point, what = _point(n)
    if n.forming is Forming.NOW:
        return f"{what} forms on it"
    return (
        f"{what} may form on it (at this instrument accuracy the reading cannot be told "
        f"apart from the {point})"
    )


def _stays_dry(n: ColdSurfaceNumbers, d: Display) -> str:
    dry = round_down_rh(n.max_room_rh_pct_dry)
    what = "free of frost" if n.frost else "dry"
    text = f"It stays {what} only while the room is below {dry} %"
    if dry >= n.target_rh_pct:
        return text + f", so once the room is down to {_pct(n.target_rh_pct)} it stays {what}."
    return (
        text + f"; at {_pct(n.target_rh_pct)} it would need to be at least "
        f"{d.minimum_temperature(n.surface_temp_to_stay_dry_c)}."
    )


def _glazing(n: ColdSurfaceNumbers, d: Display) -> str:
    point, _ = _point(n)
    glass = n.element == "glazing"
    vents = "" if n.drying else "keep trickle vents open, "
    text = (
        f"{n.surface} ({'glass' if glass else 'window frame'}) is at "
        f"{d.temperature(n.surface_temp_c)}"
    )
    if n.forming is not Forming.NO:
        text += (
            f", against a {point} of {d.temperature(n.condensation_point_c)}: "
            f"{_forming(n)}. {_stays_dry(n, d)} "
        )
        if glass:
            text += (
                "On single glazing some condensation is expected in cold weather: it is "
                "no reason to hold the room drier than is practical; consider secondary or "
                "double glazing, which keeps the inner pane warmer. On double glazing a "
                "pane this cold suggests a failed or poor unit (misting between the panes "
                "means a failed seal): have it checked or replaced. Wipe the glass and "
                f"sill dry each morning, {vents}and keep curtains or blinds clear of the "
                "glass at night."
            )
        else:
            text += (
                "Window frames, metal ones above all, run colder than the walls around "
                "them, and some condensation on them in cold weather is expected: it is "
                "no reason to hold the room drier than is practical. Wipe frames and sills "
                f"dry, {vents}and consider secondary glazing or frames with a thermal "
                "break."
            )
    else:
        text += "."
    if n.mouldy:
        text += (
            " Its surface RH is above the mould limit: check frames and seals for mould, "
            "clean any off with detergent and water (gloves and an FFP2 / N95 "
            "respirator), and check the sill and reveal for rot and damp."
        )
    else:
        text += " Check frames, seals and the sill for mould and rot where water runs down."
    return text


def _pipe(n: ColdSurfaceNumbers, d: Display) -> str:
    point, _ = _point(n)
    return (
        f"{n.surface} is at {d.temperature(n.surface_temp_c)}, against a {point} of "
        f"{d.temperature(n.condensation_point_c)}: {_forming(n)}, and it can drip onto "
        f"floors, joists and linings. Lag it with closed-cell pipe insulation, joints and "
        f"ends taped so that room air cannot reach the cold pipe underneath (open, fibrous "
        f"lagging on a cold pipe gets wet), and check below it for wet timber or plaster. "
        f"{_stays_dry(n, d)}"
    )


# --- sources, drying and repeat readings ---------------------------------------------------


def _materials(points: tuple[MaterialPoint, ...]) -> str:
    return ", ".join(
        f"{m.label} {m.value:g} against {m.dry_standard:g} (dry once at or below "
        f"{m.dry_at_or_below:.3g})"
        for m in points
    )


def _source_reason(reason: SourceReason, n: FindSourceNumbers, d: Display) -> str:
    if reason is SourceReason.WET_MATERIALS:
        return (
            "material readings above the dry standard ("
            + _materials(n.wet)
            + "); once the source is dealt with, dry them until the readings reach the dry "
            "standard"
        )
    if reason is SourceReason.DAMP_TIMBER:
        return (
            "timber wetter than the room air can explain ("
            + ", ".join(
                f"{t.label} {t.value_pct:g} % against {t.emc_pct:.1f} % in equilibrium with the air"
                for t in n.damp_timber
            )
            + ")"
        )
    if reason is SourceReason.TIMBER_DECAY:
        return (
            f"timber at or above the {th.value('timber_decay_mc_pct'):.0f} % moisture "
            "content at which decay fungi grow ("
            + ", ".join(f"{t.label} {t.value_pct:g} %" for t in n.decaying)
            + "): have it checked for rot"
            + (" — decay is slow at today's temperature, not stopped" if n.decay_slowed else "")
        )
    if reason is SourceReason.WATER_PRESENT:
        return (
            "water present in the room"
            if n.water_category is None
            else f"category {n.water_category} water in the room"
        )
    if reason is SourceReason.CONDENSATION_SEEN_NOT_MEASURED:
        return "condensation was seen, but no surface was measured"
    if reason is SourceReason.CONDENSATION_SEEN_SURFACES_CLEAR:
        return (
            "condensation was seen, but the measured surfaces are clear of the dew point: "
            "it may come from moments of higher humidity (cooking, drying laundry) or from "
            "water getting in"
        )
    if reason is SourceReason.MOULD_SEEN_NOT_MEASURED:
        return "mould is visible, but no wall, ceiling, floor or frame was measured"
    if reason is SourceReason.MOULD_SEEN_SURFACES_BELOW:
        return (
            "mould is visible, but the measured surfaces are below the mould limit today: "
            "look for a leak, damp coming through the wall, or times of higher humidity"
        )
    if reason is SourceReason.MUSTY_SMELL:
        return "a musty smell, which can mean hidden mould behind linings, under floors or in voids"
    phrase = USE_PHRASE[n.use]
    expected = (
        f"more than {phrase} should produce"
        if phrase is not None
        else "more than ordinary occupied rooms produce"
    )
    return (
        f"the room air holds {d('vapour_pressure', n.vapour_pressure_excess_pa)} more "
        f"vapour pressure than outdoors, "
        f"{humidity_class_range_text(n.humidity_class_possible or ())} of EN ISO 13788 — "
        f"{expected} (look for laundry drying indoors, unflued heaters, a blocked or missing "
        f"extract, or a leak)"
    )


def _find_source(n: FindSourceNumbers, d: Display) -> str:
    return (
        "Find and deal with the source of moisture before drying or decorating: "
        + "; ".join(_source_reason(r, n, d) for r in n.reasons)
        + "."
    )


def _keep_drying(n: KeepDryingNumbers) -> str:
    tolerance = th.value("dry_standard_tolerance_fraction")
    parts = []
    if n.materials:
        parts.append(
            "these readings are still above the dry standard (the same material in an "
            f"unaffected area, allowing {tolerance * 100:.0f} %): " + _materials(n.materials)
        )
    if n.damp_timber:
        parts.append(
            "timber is still wetter than the room air explains ("
            + ", ".join(
                f"{t.label} {t.value_pct:g} % against {t.emc_pct:.1f} %" for t in n.damp_timber
            )
            + ")"
        )
    if n.decaying:
        parts.append(
            f"timber at or above the {th.value('timber_decay_mc_pct'):.0f} % moisture "
            "content at which decay fungi grow ("
            + ", ".join(f"{t.label} {t.value_pct:g} %" for t in n.decaying)
            + "): have it checked for rot"
            + (" — decay is slow at today's temperature, not stopped" if n.decay_slowed else "")
        )
    return (
        "Continue drying until readings reach the dry standard: "
        + "; ".join(parts)
        + ". Keep the drying equipment running, take readings at the same spots on each "
        "visit, and do not close up, refit or decorate until every reading is there. If "
        "readings stop falling from one visit to the next, look for water still getting "
        "in."
    )


def _repeat(n: RepeatReadingsNumbers, d: Display) -> str:
    excess = d("vapour_pressure", n.vapour_pressure_excess_pa)
    if n.wet_room_peak:
        low, high = n.reread_after_use_minutes or (0.0, 0.0)
        what = "a shower or bath" if n.use == "bathroom" else "cooking"
        return (
            f"The room air holds {excess} more vapour pressure than outdoors, "
            f"{humidity_class_text(n.humidity_class)} of EN ISO 13788, but in "
            f"{USE_PHRASE[n.use]} a high reading is usually the normal peak after {what}, "
            f"not a hidden source. Have an extract fan that clears it: sized to the local "
            f"code's minimum extract rate (UK Approved Document F and ASHRAE 62.2 set "
            f"minimum extract rates; from memory, check local code), with an overrun timer "
            f"or a humidistat so it keeps running after use, and the door kept shut "
            f"meanwhile. Take a re-reading {low:.0f}-{high:.0f} min after use; if the room "
            f"is still this humid then, look for a blocked or missing extract, laundry "
            f"drying or a leak."
        )
    high_class = int(th.value("humidity_class_high")) + (1 if th.room_use(n.use).wet_room else 0)
    phrase = USE_PHRASE[n.use]
    expected = (
        f"more than {phrase} should produce"
        if phrase is not None
        else "more than ordinary occupied rooms produce"
    )
    band = d("vapour_pressure", n.vapour_pressure_excess_uncertainty_pa)
    return (
        f"The humidity class may be high: the room air holds {excess} (± {band}) more "
        f"vapour pressure than outdoors, "
        f"{humidity_class_range_text(n.humidity_class_possible or ())} "
        f"of EN ISO 13788 at this instrument accuracy, and class {high_class} or above "
        f"would be {expected}. One spot reading cannot settle it: repeat the readings on "
        f"other days, or log the room for a week or two, before looking for a hidden "
        f"source."
    )


def action_reason(action: Action[Any], finding: RoomFinding, advice: RoomAdvice, d: Display) -> str:
    """Why and how, in sentences, with the action's numbers in ``d``'s units."""
    n = action.numbers
    kind = action.kind
    if kind is ActionKind.VENTILATE:
        return _ventilate(n, finding, advice, d) + _occupants_note(n, advice, d)
    if kind is ActionKind.DEHUMIDIFY:
        return _dehumidify(n, finding, advice, d) + _occupants_note(n, advice, d)
    if kind is ActionKind.RAISE_SURFACE_TEMPERATURE:
        return _raise_surface(n, d)
    if kind is ActionKind.REDUCE_GLAZING_CONDENSATION:
        return _glazing(n, d)
    if kind is ActionKind.INSULATE_PIPE:
        return _pipe(n, d)
    if kind is ActionKind.FIND_SOURCE:
        return _find_source(n, d)
    if kind is ActionKind.KEEP_DRYING:
        return _keep_drying(n)
    if kind is ActionKind.REMOVE_CONTAMINATED_MATERIALS:
        return _remove_contaminated(n, d)
    if kind is ActionKind.REPEAT_READINGS:
        return _repeat(n, d)
    return _ventilated_space(n, d)


def action_numbers(action: Action[Any], d: Display) -> str:
    """The action's headline number, for a summary line ('' when it has none)."""
    n = action.numbers
    kind = action.kind
    if kind is ActionKind.VENTILATE and n.airflow_m3_per_h is not None:
        text = f"at least {d.at_least('airflow', n.airflow_m3_per_h)}"
        if n.air_changes_per_h is not None:
            text += f" ({n.air_changes_per_h:.1f} air changes an hour)"
        return text
    if kind is ActionKind.DEHUMIDIFY and n.removal_l_per_day:
        return f"at least {d.at_least('water_rate', n.removal_l_per_day)}"
    if kind is ActionKind.RAISE_SURFACE_TEMPERATURE:
        return f"to at least {d.minimum_temperature(n.target_surface_temp_c)}"
    if kind is ActionKind.KEEP_DRYING:
        count = n.materials_above_dry_standard
        return f"{count} reading{'s' if count != 1 else ''} above the dry standard"
    return ""
