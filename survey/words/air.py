"""The room's air in words: ventilation, dehumidification, drying (the ventilated spaces,
lofts and crawl spaces, are :mod:`survey.words.ventilated`)."""

from __future__ import annotations

from survey import thresholds as th
from survey.advise.kinds import (
    ActionKind,
    DehumidifyNumbers,
    DehumidifyWhy,
    ExtractNumbers,
    OutdoorMode,
    RoomAdvice,
    VentilateNumbers,
)
from survey.assess import RoomFinding
from survey.safe_text import visible
from survey.words.basis import _pct, moisture_basis, moisture_missing, target_basis
from survey.words.display import Display
from survey.words.states import USE_PHRASE

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
        if n.airflow_m3_per_h < 0.5:
            return text + (
                " The room's own moisture load is nil ("
                f"{moisture_basis(moisture, finding.use, d)}), so once it is down no steady "
                "airflow is needed to hold it there: air it out (windows wide open for a few "
                "minutes, several times a day) to bring it down, then keep the usual background "
                "ventilation (trickle vents, extract fans)."
            )
        balance = n.sized_airflow_m3_per_h or n.airflow_m3_per_h
        text += f" About {d.at_least('airflow', balance)} of outdoor air"
        if n.room_volume_m3:
            text += (
                f" ({balance / n.room_volume_m3:.1f} air changes an hour in this "
                f"{d('volume', n.room_volume_m3)} room)"
            )
        text += (
            f" carries away {d.moisture_rate(n.moisture_generation_g_per_h)} of moisture "
            f"and holds the room at {target}. Moisture load: "
            f"{moisture_basis(moisture, finding.use, d)}."
        )
        if moisture.back_calculated_g_per_h is not None and (
            moisture.used_g_per_h == moisture.back_calculated_g_per_h
        ):
            text += (
                f" That load is worked out from the room's measured excess at an assumed "
                f"{moisture.assumed_air_change_rate_per_h:g} air changes an hour: if the room "
                f"gets more air than that now, it needs proportionally more."
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


#: What makes the water in each wet room, for the extract sentence.
_WET_ACTIVITY = {
    "bathroom": "showers and baths",
    "kitchen": "cooking",
    "utility": "washing and drying clothes",
}
_OUTDOOR_NOW = {
    OutdoorMode.WETTER: "Outdoor air is wetter than the room air now",
    OutdoorMode.ABOUT_SAME: "Outdoor air is about as wet as the room air now",
    OutdoorMode.HOLDS_TARGET: "Outdoor air is drier, but its dew point is above the coldest "
    "surface",
    OutdoorMode.NOT_MEASURED: "The outdoor air was not measured",
}


def _extract(n: ExtractNumbers, d: Display) -> str:
    activity = _WET_ACTIVITY.get(n.use, "the room's use")
    outdoor = (
        ""
        if n.outdoor_humidity_ratio_g_per_kg is None
        else f" ({_hr(d, n.outdoor_humidity_ratio_g_per_kg)} against "
        f"{_hr(d, n.room_humidity_ratio_g_per_kg)})"
    )
    return (
        f"{_OUTDOOR_NOW[n.outdoor_mode]}{outdoor}, so airing the room does not dry it. The "
        f"water of {activity} is made in bursts, though, and air drawn out while it is made "
        f"holds far more water than any outdoor air: extract it at the source. Run an "
        f"extract fan of at least {d.at_least('airflow', n.intermittent_m3_per_h)} during "
        f"{activity} and for 15 to 20 minutes after (switched with the light, or by a "
        f"humidistat), with the door to the rest of the home shut, or one running "
        f"continuously at no less than {d.at_least('airflow', n.code_minimum_m3_per_h)}; "
        f"check that the fan runs and moves air (a tissue held to the grille is drawn to "
        f"it). These are the usual code minimums (England's Approved Document F, and ASHRAE "
        f"62.2 in the US; from memory); the local code sets its own. Between uses keep "
        f"windows shut so the dehumidifier works on the room's own air."
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
        f"({g_in:.1f} − {g_out:.1f} = {n.grain_depression_gr_per_lb:.1f} gr/lb)."
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
    if n.generation_g_per_h == 0.0:
        gains.append(
            f"the room itself adds no moisture ({moisture_basis(moisture, finding.use, d)})"
        )
    elif n.generation_g_per_h is not None:
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
            f" For a class {n.water_loss_class} water loss in this room's volume the drying "
            f"chart calls for about {d.water(n.materials_load_l_per_day)} of dehumidifier "
            f"capacity{assumed}."
        )
    if n.logged_removal_l_per_day is not None:
        text += (
            f" The dehumidifier collected {n.water_removed_l:g} L in "
            f"{n.hours_since_previous:.0f} h of running, about "
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
        total = (
            f"{d.water_at_least(n.load_l_per_day)}, the larger of that and the drying chart's "
            f"figure"
            if n.materials_load_l_per_day is not None
            else f"{d.water_at_least(n.load_l_per_day)} in all"
        )
        text += (
            " To hold it there: " + "; ".join(gains) + f"; "
            f"{total}, the least a dehumidifier should remove at this room's conditions."
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
            f"at {_pct(rating_rh)} RH"
            + (
                f", but less as the room dries toward {target}"
                if n.target_rh_pct < rating_rh
                else ""
            )
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
        + (
            "it. That speaks of the air only: the search for a moisture source asked for "
            "here rests on other signs."
            if any(a.kind is ActionKind.FIND_SOURCE for a in advice.actions)
            else "it rather than hiding a source."
        )
    )


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
