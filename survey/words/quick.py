"""The quick check's own sentences: the summary above its tables, the room's lines, the
accuracy line. A face passes ``hints``, what to tell a user to give in its own terms (an
option name on the command line, a field in the app)."""

from __future__ import annotations

from collections.abc import Mapping

from survey import thresholds as th
from survey.quick import QuickResult
from survey.safe_text import visible
from survey.words.actions import action_numbers, action_title
from survey.words.display import Display, round_down_rh
from survey.words.states import (
    HUMIDITY_CLASS_EXAMPLES,
    factor_not_judged_reason,
    humidity_class_range_text,
    humidity_class_text,
    no_limit_reason,
    rh_limit_text,
    short_verdict,
    timber_emc_text,
    worst_first,
)

_HINTS = {"use": "the room's use", "outdoor": "give the outdoor air"}


def quick_summary_lines(
    result: QuickResult, d: Display, hints: Mapping[str, str] = _HINTS
) -> list[str]:
    """The short summary above the tables: a verdict per surface (worst first, at most
    four), the highest safe room RH, and the first action."""
    f, advice = result.finding, result.advice
    rh_now = f"{result.room.rh_pct:.0f} %"
    lines = []
    surfaces = worst_first(f.surfaces)
    for s in surfaces[:4]:
        lines.append(
            f"{visible(s.label)}, {d.temperature(s.surface_temp_c)}: {short_verdict(s, d)}."
        )
    if len(surfaces) > 4:
        lines.append(f"… and {len(surfaces) - 4} more surfaces, in the tables below.")
    limit = rh_limit_text(f)
    if limit is not None and f.coldest is not None:
        lines.append(
            f"Highest safe room RH: {limit}, set by {visible(f.coldest.label)}, the "
            f"coldest wall, ceiling or floor; the room is at {rh_now}."
        )
    elif not f.surfaces:
        lines.append(f"No surface measured; the room is at {rh_now} RH.")
    else:
        reason = no_limit_reason(f)
        lines.append(
            f"{reason[0].upper()}{reason[1:]}, so no highest safe room RH; the room is at "
            f"{rh_now} RH."
        )
    if advice.actions:
        first = advice.actions[0]
        numbers = action_numbers(first, d)
        more = len(advice.actions) - 1
        lines.append(
            f"First: {visible(action_title(first))}"
            + (f", {numbers}" if numbers else "")
            + (f' (then {more} more under "What to do").' if more else ".")
        )
    elif any(
        s.temperature_factor_state.value == "cannot_tell"
        and s.temperature_factor is not None
        and s.temperature_factor_limit is not None
        and s.temperature_factor < s.temperature_factor_limit
        for s in f.surfaces
    ):
        lines.append(
            "No action is certain from these readings: the temperature factor is "
            "just under its limit but within the instruments' accuracy; confirm it "
            "on a colder day or with more accurate instruments."
        )
    else:
        lines.append("Nothing to do from these readings.")
    return lines


def quick_room_lines(
    result: QuickResult, d: Display, hints: Mapping[str, str] = _HINTS
) -> list[str]:
    """The room's use, dew point, highest safe RH, humidity class and timber EMC."""
    f = result.finding
    use = result.use
    limit = th.frsi_limit(use)
    lines = []
    if not result.use_given:
        lines.append(
            f"Use: not given ({hints['use']}); the general temperature-factor limit "
            f"{th.value('frsi_general'):.2f} applies (IEA Annex 14)."
        )
    elif limit is None:
        lines.append(f"Use: {use}; no temperature-factor limit — {th.room_use(use).frsi_reason}.")
    else:
        lines.append(
            f"Use: {use}; temperature-factor limit {limit.value:.2f} — "
            f"{th.room_use(use).frsi_reason}."
        )
    reason = factor_not_judged_reason(f, d)
    if reason and any(s.temperature_factor_state.value == "not_judged" for s in f.surfaces):
        where = (
            ""
            if result.outdoor is None
            else f" (inside {d.temperature(result.room.dry_bulb_c)}, outside "
            f"{d.temperature(result.outdoor.dry_bulb_c)})"
        )
        hint = f" ({hints['outdoor']})" if result.outdoor is None else ""
        lines.append(f"Temperature factor: cannot be judged today — {reason}{hint}{where}.")
    point = d.temperature(f.air.condensation_point_c)
    point_u = d.difference(f.condensation_point_uncertainty_k)
    frost = result.room.frost_point_c is not None
    if frost:
        lines.append(
            f"Condensation point (frost point) {point} ± {point_u}: surfaces below "
            f"0 °C gather frost; the dew point over water is "
            f"{d.temperature(result.room.dew_point_c)}."
        )
    else:
        lines.append(f"Dew point {point} ± {point_u}.")
    rh_text = rh_limit_text(f)
    if rh_text is not None:
        assert f.coldest is not None and f.max_room_rh_pct is not None  # a limit has both
        coldest = f"{visible(f.coldest.label)}, {d.temperature(f.coldest.surface_temp_c)}"
        line = (
            f"Highest room RH the coldest wall, ceiling or floor ({coldest}) can bear: {rh_text}."
        )
        if f.max_room_rh_pct < 100.0:
            mould = th.value("surface_rh_mould_limit_pct")
            margin = d.difference(th.value("dew_point_margin_k"))
            line += (
                f" Up to {round_down_rh(f.max_room_rh_pct_mould or 0.0)} % it stays at or "
                f"below {mould:.0f} % surface RH (mould limit), up to "
                f"{round_down_rh(f.max_room_rh_pct_margin or 0.0)} % at least {margin} "
                f"above the {'frost' if frost else 'dew'} point."
            )
        lines.append(line + f" The room is at {result.room.rh_pct:.0f} % now.")
    apart = f.coldest_glazing_or_pipe
    if apart is not None:
        dry = f.max_room_rh_pct_dry_glazing_or_pipe or 0.0
        stays = (
            "stays clear of condensation at any room RH"
            if dry >= 100.0
            else f"stays clear of condensation while the room is below {round_down_rh(dry)} % RH"
        )
        lines.append(
            f"Glazing, window frames and pipes are judged apart and do not set the "
            f"room's RH: the coldest, {visible(apart.label)}, {stays}."
        )
    if result.outdoor is None:
        lines.append(f"Humidity class: not judged ({hints['outdoor']}).")
    elif f.humidity_class is None:
        lines.append(
            "Humidity class: not judged (outdoor air at or above "
            f"{d.temperature(th.value('humidity_class_zero_at_c'))})."
        )
    else:
        possible = f.humidity_class_possible
        spread = (
            ""
            if len(possible) <= 1
            else f"; {humidity_class_range_text(possible)} at this accuracy"
        )
        number = f.humidity_class
        example = HUMIDITY_CLASS_EXAMPLES[number]
        like = example if number == th.BEYOND_CLASS_5 else f"as in {example}"
        lines.append(
            f"Humidity class (EN ISO 13788): {humidity_class_text(number)}, {like} — the "
            f"room air's vapour pressure is {d('vapour_pressure', f.vapour_pressure_excess_pa)} "
            f"(± {d('vapour_pressure', f.vapour_pressure_excess_uncertainty_pa)}) above "
            f"outdoors{spread}. Classes are defined for monthly means; a spot reading is a "
            f"guide."
        )
    lines.append(timber_emc_text(f, d))
    return lines


def quick_accuracy_line(result: QuickResult, d: Display) -> str:
    """Which instrument accuracies were used, and what the bands mean."""
    given = result.input.accuracy_given
    acc = result.input.accuracy
    note = (
        "typical specifications, none entered"
        if not given.any
        else "as entered"
        if given.all
        else "typical specifications where none was entered"
    )
    thermometer = ""
    if result.outdoor is not None:
        thermometer = (
            " For the temperature factor, one thermometer read the room and the "
            "outdoor air (its errors taken as correlated)."
            if acc.shared_thermometer
            else " For the temperature factor, separate thermometers read the room "
            "and the outdoor air."
        )
    return (
        f"Instrument accuracy: air ±{d.difference(acc.air_temp_k)}, RH "
        f"±{acc.rh_pct:g} %, surface ±{d.difference(acc.surface_temp_k)} "
        f"({note}). Ranges and ± are expanded uncertainties (about 95 % "
        f"coverage).{thermometer}"
    )


def quick_nothing_to_do(result: QuickResult) -> str:
    """Why nothing is to be done."""
    surfaces_note = (
        "no measured surface calls for work"
        if result.finding.surfaces
        else "no surface was measured"
    )
    return (
        "Nothing from these readings: the room is at or below its target "
        f"of {result.advice.target_rh_pct:.0f} % RH and {surfaces_note}."
    )
