"""``survey check``'s two layouts of a :class:`~survey.quick.QuickResult`: the JSON encoding
(SI keys, read by other tools) and the Rich tables. Every sentence comes from
:mod:`survey.words`; user text (surface labels) is shown as plain text, made safe for the
terminal."""

from __future__ import annotations

from typing import Any

from survey import psychro, words
from survey import thresholds as th
from survey.quick import QuickResult
from survey.safe_text import visible

_MAX_RH_BASIS = (
    "the coldest wall, ceiling or floor (any surface not said to be glazing, a "
    "window frame or a pipe); glazing, window frames and pipes are judged apart "
    "and never set the room RH"
)


def _state(state: psychro.MoistAir) -> dict[str, Any]:
    return {
        "dry_bulb_c": state.dry_bulb_c,
        "rh_pct": state.rh_pct,
        "pressure_pa": state.pressure_pa,
        "dew_point_c": state.dew_point_c,
        "frost_point_c": state.frost_point_c,
        "humidity_ratio_g_per_kg": state.humidity_ratio_g_per_kg,
        "grains_per_pound": state.grains_per_pound,
        "vapour_pressure_pa": state.vapour_pressure_pa,
        "enthalpy_kj_per_kg": state.enthalpy_j_per_kg / 1000.0,
        "wet_bulb_c": state.wet_bulb_c,
        "absolute_humidity_g_per_m3": state.absolute_humidity_g_per_m3,
        "specific_volume_m3_per_kg": state.specific_volume_m3_per_kg,
        "density_kg_per_m3": state.density_kg_per_m3,
    }


def _surface(s) -> dict[str, Any]:
    return {
        "label": s.label,
        "element": s.element,
        "judged_as": s.policy.role,
        "surface_temp_c": s.surface_temp_c,
        "surface_rh_pct": s.surface_rh_pct,
        "surface_rh_range_pct": [s.surface_rh_low_pct, s.surface_rh_high_pct],
        "dew_point_margin_k": s.margin_k,
        "margin_uncertainty_k": s.margin_uncertainty_k,
        "condensing": s.condensing,
        "frost": s.frost,
        "condensation": s.condensation.value,
        "condensation_possible": [x.value for x in s.condensation_possible],
        "mould": s.mould.value,
        "mould_possible": [x.value for x in s.mould_possible],
        "temperature_factor": s.temperature_factor,
        "temperature_factor_uncertainty": s.temperature_factor_uncertainty,
        "temperature_factor_limit": s.temperature_factor_limit,
        "temperature_factor_state": s.temperature_factor_state.value,
        "temperature_factor_possible": [x.value for x in s.temperature_factor_possible],
        "threshold_keys": list(s.threshold_keys),
    }


def encode(result: QuickResult, d: words.Display) -> dict[str, Any]:
    """The result as a JSON-ready dict with SI keys (sentences in ``d``'s units)."""
    f, advice, given = result.finding, result.advice, result.input
    out = _state(result.room)
    out["surfaces"] = [_surface(s) for s in f.surfaces]
    out["outdoor"] = None if result.outdoor is None else _state(result.outdoor)
    limit = th.frsi_limit(result.use)
    coldest, apart = f.coldest, f.coldest_glazing_or_pipe
    acc = given.accuracy
    out.update(
        {
            "room_use": result.use,
            "room_use_given": result.use_given,
            "temperature_factor_limit": None if limit is None else limit.value,
            "temperature_factor_limit_basis": th.room_use(result.use).frsi_reason,
            "temperature_factor_not_judged_reason": words.factor_not_judged_reason(f, d),
            "accuracy": {
                "air_temp_k": acc.air_temp_k,
                "rh_pct": acc.rh_pct,
                "surface_temp_k": acc.surface_temp_k,
                "shared_thermometer": acc.shared_thermometer,
                "given": {
                    "air_temp_k": given.accuracy_given.air_temp_k,
                    "rh_pct": given.accuracy_given.rh_pct,
                    "surface_temp_k": given.accuracy_given.surface_temp_k,
                },
                "meaning": "± bounds read as rectangular distributions; bands are expanded "
                f"uncertainties with coverage factor {th.value('coverage_factor'):g} "
                "(about 95 %)",
            },
            "condensation_point_c": f.air.condensation_point_c,
            "condensation_point_is_frost_point": result.room.frost_point_c is not None,
            "condensation_point_uncertainty_k": f.condensation_point_uncertainty_k,
            "coldest_surface": None if coldest is None else coldest.label,
            "coldest_surface_element": None if coldest is None else coldest.element,
            "coldest_surface_temp_c": None if coldest is None else coldest.surface_temp_c,
            "max_room_rh_basis": _MAX_RH_BASIS,
            "max_room_rh_pct_for_coldest_surface": f.max_room_rh_pct,
            "max_room_rh_range_pct": (
                None
                if f.max_room_rh_low_pct is None
                else [f.max_room_rh_low_pct, f.max_room_rh_high_pct]
            ),
            "max_room_rh_pct_mould_limit": f.max_room_rh_pct_mould,
            "max_room_rh_pct_condensation_margin": f.max_room_rh_pct_margin,
            "coldest_glazing_or_pipe": None if apart is None else apart.label,
            "coldest_glazing_or_pipe_element": None if apart is None else apart.element,
            "max_room_rh_pct_dry_glazing_or_pipe": f.max_room_rh_pct_dry_glazing_or_pipe,
            "vapour_pressure_excess_pa": f.vapour_pressure_excess_pa,
            "vapour_pressure_excess_uncertainty_pa": f.vapour_pressure_excess_uncertainty_pa,
            "humidity_class": f.humidity_class,
            "humidity_class_possible": list(f.humidity_class_possible),
            "humidity_class_text": (
                None if f.outdoor is None else words.humidity_class_text(f.humidity_class)
            ),
            "humidity_class_possible_text": (
                None
                if f.humidity_class is None
                else words.humidity_class_range_text(f.humidity_class_possible)
            ),
            "timber_emc_pct": f.timber_emc_pct,
            "room_volume_m3": given.volume_m3,
            "occupants": given.occupants,
            "target_rh_pct": advice.target_rh_pct,
            "target_basis": words.target_basis(advice.target, d),
            "moisture_generation_g_per_h": advice.moisture.used_g_per_h,
            "moisture_generation_basis": words.moisture_basis(advice.moisture, f.use, d),
            "actions": [
                {
                    "kind": a.kind.value,
                    "title": words.action_title(a),
                    "reason": words.action_reason(a, f, advice, d),
                    **a.numbers_dict(),
                    "threshold_keys": list(a.threshold_keys),
                }
                for a in advice.actions
            ],
            "cautions": [words.caution_text(c, d) for c in result.cautions],
            "caution_keys": [c.key for c in result.cautions],
            "warnings": list(result.warnings),
            "thresholds": [
                {
                    "key": t.key,
                    "value": t.value,
                    "unit": t.unit,
                    "mark": t.mark,
                    "citation": t.citation(),
                }
                for t in result.limits
            ],
        }
    )
    return out


# --- the table -------------------------------------------------------------------------------

_SHOWN_LIMITS = {
    "dew_point_margin_k",
    "surface_rh_mould_limit_pct",
    "frsi_dwelling",
    "frsi_high_humidity",
    "frsi_storage",
    "frsi_general",
    "frsi_min_temperature_difference_k",
    "room_rh_floor_pct",
    "coverage_factor",
}


def summary_lines(result: QuickResult, d: words.Display) -> list[str]:
    """The short summary above the tables: a verdict per surface (worst first, at most
    four), the highest safe room RH, and the first action."""
    f, advice = result.finding, result.advice
    rh_now = f"{result.room.rh_pct:.0f} %"
    lines = []
    surfaces = words.worst_first(f.surfaces)
    for s in surfaces[:4]:
        lines.append(
            f"{visible(s.label)}, {d.temperature(s.surface_temp_c)}: {words.short_verdict(s, d)}."
        )
    if len(surfaces) > 4:
        lines.append(f"… and {len(surfaces) - 4} more surfaces, in the tables below.")
    limit = words.rh_limit_text(f)
    if limit is not None:
        lines.append(
            f"Highest safe room RH: {limit}, set by {visible(f.coldest.label)}, the "
            f"coldest wall, ceiling or floor; the room is at {rh_now}."
        )
    elif not f.surfaces:
        lines.append(f"No surface measured; the room is at {rh_now} RH.")
    else:
        lines.append(
            f"No wall, ceiling or floor measured, so no highest safe room RH; the "
            f"room is at {rh_now} RH."
        )
    if advice.actions:
        first = advice.actions[0]
        numbers = words.action_numbers(first, d)
        more = len(advice.actions) - 1
        lines.append(
            f"First: {visible(words.action_title(first))}"
            + (f", {numbers}" if numbers else "")
            + (f' (then {more} more under "What to do").' if more else ".")
        )
    elif any(
        s.temperature_factor_state.value == "cannot_tell"
        and s.temperature_factor is not None
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


def room_lines(result: QuickResult, d: words.Display) -> list[str]:
    """The room's use, dew point, highest safe RH, humidity class and timber EMC."""
    f = result.finding
    use = result.use
    limit = th.frsi_limit(use)
    lines = []
    if not result.use_given:
        lines.append(
            f"Use: not given (--use); the general temperature-factor limit "
            f"{limit.value:.2f} applies (IEA Annex 14)."
        )
    elif limit is None:
        lines.append(f"Use: {use}; no temperature-factor limit — {th.room_use(use).frsi_reason}.")
    else:
        lines.append(
            f"Use: {use}; temperature-factor limit {limit.value:.2f} — "
            f"{th.room_use(use).frsi_reason}."
        )
    reason = words.factor_not_judged_reason(f, d)
    if reason and any(s.temperature_factor_state.value == "not_judged" for s in f.surfaces):
        where = (
            ""
            if result.outdoor is None
            else f" (inside {d.temperature(result.room.dry_bulb_c)}, outside "
            f"{d.temperature(result.outdoor.dry_bulb_c)})"
        )
        hint = " (give --outdoor-temp and --outdoor-rh)" if result.outdoor is None else ""
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
    rh_text = words.rh_limit_text(f)
    if rh_text is not None:
        coldest = f"{visible(f.coldest.label)}, {d.temperature(f.coldest.surface_temp_c)}"
        line = (
            f"Highest room RH the coldest wall, ceiling or floor ({coldest}) can bear: {rh_text}."
        )
        if f.max_room_rh_pct < 100.0:
            mould = th.value("surface_rh_mould_limit_pct")
            margin = d.difference(th.value("dew_point_margin_k"))
            line += (
                f" Up to {words.round_down_rh(f.max_room_rh_pct_mould)} % it stays at or "
                f"below {mould:.0f} % surface RH (mould limit), up to "
                f"{words.round_down_rh(f.max_room_rh_pct_margin)} % at least {margin} "
                f"above the {'frost' if frost else 'dew'} point."
            )
        lines.append(line + f" The room is at {result.room.rh_pct:.0f} % now.")
    apart = f.coldest_glazing_or_pipe
    if apart is not None:
        dry = f.max_room_rh_pct_dry_glazing_or_pipe
        stays = (
            "stays clear of condensation at any room RH"
            if dry >= 100.0
            else f"stays clear of condensation while the room is below "
            f"{words.round_down_rh(dry)} % RH"
        )
        lines.append(
            f"Glazing, window frames and pipes are judged apart and do not set the "
            f"room's RH: the coldest, {visible(apart.label)}, {stays}."
        )
    if result.outdoor is None:
        lines.append("Humidity class: not judged (give --outdoor-temp and --outdoor-rh).")
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
            else f"; {words.humidity_class_range_text(possible)} at this accuracy"
        )
        number = f.humidity_class
        example = words.HUMIDITY_CLASS_EXAMPLES[number]
        like = example if number == th.BEYOND_CLASS_5 else f"as in {example}"
        lines.append(
            f"Humidity class (EN ISO 13788): {words.humidity_class_text(number)}, {like} — the "
            f"room air's vapour pressure is {d('vapour_pressure', f.vapour_pressure_excess_pa)} "
            f"(± {d('vapour_pressure', f.vapour_pressure_excess_uncertainty_pa)}) above "
            f"outdoors{spread}. Classes are defined for monthly means; a spot reading is a "
            f"guide."
        )
    lines.append(words.timber_emc_text(f, d))
    return lines


def _air_rows(d: words.Display):
    rows = [
        ("Air temperature", lambda s: d.temperature(s.dry_bulb_c)),
        ("Relative humidity", lambda s: f"{s.rh_pct:.1f} %"),
        ("Pressure", lambda s: d("pressure", s.pressure_pa)),
        ("Dew point", lambda s: d.temperature(s.dew_point_c)),
        ("Frost point", lambda s: d("temperature", s.frost_point_c)),
        ("Humidity ratio", lambda s: d("humidity_ratio", s.humidity_ratio_kg_per_kg)),
        ("Vapour pressure", lambda s: d("vapour_pressure", s.vapour_pressure_pa)),
        ("Wet bulb", lambda s: d.temperature(s.wet_bulb_c)),
        ("Absolute humidity", lambda s: d("absolute_humidity", s.absolute_humidity_g_per_m3)),
        ("Enthalpy", lambda s: d("enthalpy", s.enthalpy_j_per_kg)),
        ("Specific volume", lambda s: d("specific_volume", s.specific_volume_m3_per_kg)),
        ("Density", lambda s: d("density", s.density_kg_per_m3)),
    ]
    if not d.ip:  # in IP the humidity ratio row is already in grains per pound
        rows.insert(6, ("Grains per pound", lambda s: f"{s.grains_per_pound:.1f} gr/lb"))
    return rows


def render(result: QuickResult, d: words.Display) -> None:
    """Print the result as Rich tables and plain text (never markup) in ``d``'s units."""
    from rich.console import Console
    from rich.padding import Padding
    from rich.table import Table
    from rich.text import Text

    def para(text: str, indent: int, style: str = "") -> Padding:
        return Padding(Text(visible(text, keep_newlines=True), style=style), (0, 0, 0, indent))

    def heading(text: str) -> None:
        console.print(Text(text, style="bold underline"))

    f, advice = result.finding, result.advice
    console = Console(highlight=False, emoji=False)
    heading("Summary")
    for line in summary_lines(result, d):
        console.print(para(line, 2))
    console.print()
    states = {"Room": result.room}
    if result.outdoor is not None:
        states["Outdoor"] = result.outdoor
    table = Table(title="Moist air", title_justify="left")
    table.add_column("Quantity")
    for name in states:
        table.add_column(name, justify="right")
    for label, show in _air_rows(d):
        table.add_row(label, *(show(state) for state in states.values()))
    console.print(table)

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
    console.print(
        Text(
            f"Instrument accuracy: air ±{d.difference(acc.air_temp_k)}, RH "
            f"±{acc.rh_pct:g} %, surface ±{d.difference(acc.surface_temp_k)} "
            f"({note}). Ranges and ± are expanded uncertainties (about 95 % "
            f"coverage).{thermometer}"
        )
    )
    if f.surfaces:
        readings = Table(title="Surfaces: readings", title_justify="left")
        for name, right in (
            ("Surface", False),
            ("Kind", False),
            ("Temp.", True),
            ("Surface RH", True),
            ("Margin to dew/frost point", True),
            ("Temperature factor", True),
        ):
            readings.add_column(name, justify="right" if right else "left")
        judged = Table(title="Surfaces: risk", title_justify="left")
        for name in ("Surface", "Condensation", "Mould growth", "Temperature factor"):
            judged.add_column(name)
        for s in f.surfaces:
            label = Text(visible(s.label))
            margin = (
                d("temperature_difference", s.margin_k, unit=False)
                + " ± "
                + d.difference(s.margin_uncertainty_k)
            )
            factor = "–"
            if s.temperature_factor is not None:
                factor = (
                    f"{s.temperature_factor:.2f} ± {s.temperature_factor_uncertainty:.2f} "
                    f"(limit {s.temperature_factor_limit:.2f})"
                )
            elif s.temperature_factor_state.value == "not_for_element":
                factor = "not used"
            readings.add_row(
                label,
                words.ELEMENT_WORDS[s.element],
                d.temperature(s.surface_temp_c),
                words.surface_rh_text(s),
                margin,
                factor,
            )
            judged.add_row(
                label, words.condensation_text(s), words.mould_text(s), words.factor_text(s, f, d)
            )
        console.print(readings)
        console.print(judged)
        if any(
            "cannot_tell" in (s.condensation.value, s.mould.value, s.temperature_factor_state.value)
            for s in f.surfaces
        ):
            console.print(Text(words.CANNOT_TELL_EXPLAINED))
    console.print()
    heading("Room")
    for line in room_lines(result, d):
        console.print(para(line, 2))
    console.print()
    heading("What to do")
    if not advice.actions:
        surfaces_note = (
            "no measured surface calls for work" if f.surfaces else "no surface was measured"
        )
        console.print(
            para(
                "Nothing from these readings: the room is at or below its target "
                f"of {advice.target_rh_pct:.0f} % RH and {surfaces_note}.",
                2,
            )
        )
    for number, action in enumerate(advice.actions, start=1):
        console.print(para(f"{number}. {words.action_title(action)}", 2, "bold"))
        console.print(para(words.action_reason(action, f, advice, d), 5))
    console.print()
    heading("Safety")
    for caution in result.cautions:
        console.print(para(f"• {words.caution_text(caution, d)}", 2))
    console.print()
    heading("Limits used")
    shown = set(_SHOWN_LIMITS)
    if f.humidity_class in (1, 2, 3, 4, 5):
        shown.add(f"humidity_class_{f.humidity_class}_pa")
    listed = [t for t in result.limits if t.key in shown]
    for t in listed:
        console.print(para(f"• {words.client_citation(t, d)}", 2))
    for line in words.legend(listed):
        console.print(para(line, 2))
    console.print(
        para(
            "Every limit behind these findings, with its source, is listed under "
            '"thresholds" in --json output.',
            2,
        )
    )
