"""``survey check``: the quick on-site check of one room's air and its surfaces.

    survey check --air-temp 18 --rh 72 --surface-temp 11 --surface-temp 15.5 \\
                 --outdoor-temp 3 --outdoor-rh 88 --room-volume 30 --occupants 2 \\
                 --use bedroom --units si --json

Besides the moist-air state it judges every surface (condensation, mould growth,
temperature factor, each with the band the instrument accuracy leaves), the room's humidity
class and the highest room RH its coldest surface can bear, and lists actions with numbers
and safety cautions (:mod:`survey.assess`, :mod:`survey.advise`).

The JSON path imports neither Rich nor pint unless a value carries a unit suffix, so it
starts fast.
"""

from __future__ import annotations

import argparse
import json
import math
import sys
from typing import Any, Callable

from survey import advise, assess, psychro, units
from survey import thresholds as th
from survey.errors import InputError

DESCRIPTION = (
    "Dew point, surface condensation, mould risk and what to do, for one room. A bare number "
    "is read in the chosen unit system (°C/hPa/m/m³ for si, °F/inHg/ft/ft³ for ip); a unit "
    "may be typed with any value: 70F, 21 °C, 1002hPa, 1150 ft, 30 m3. Instrument accuracies "
    "default to typical specifications (air ±0.5 K, RH ±3 %, surface ±1 K); the output says "
    "which were used."
)

VOLUME_MIN_M3 = 1.0
VOLUME_MAX_M3 = 100_000.0
OCCUPANTS_MAX = 500


def register(subparsers: argparse._SubParsersAction) -> None:
    parser = subparsers.add_parser(
        "check", help="quick check of one room's air and surfaces", description=DESCRIPTION
    )
    parser.add_argument("--air-temp", required=True, metavar="T",
                        help="room air (dry-bulb) temperature")
    parser.add_argument("--rh", required=True, metavar="RH",
                        help="room relative humidity, %% (relative to water, as hygrometers read)")
    parser.add_argument("--surface-temp", action="append", default=[], metavar="T",
                        help="a measured surface temperature; repeat for each surface")
    parser.add_argument("--outdoor-temp", metavar="T", help="outdoor air temperature")
    parser.add_argument("--outdoor-rh", metavar="RH", help="outdoor relative humidity, %%")
    where = parser.add_mutually_exclusive_group()
    where.add_argument("--altitude", metavar="Z",
                       help="site altitude (standard atmosphere gives the pressure)")
    where.add_argument("--pressure", metavar="P", help="measured barometric pressure")
    room = parser.add_argument_group("room (for the advice)")
    room.add_argument("--use", type=str.lower, choices=th.ROOM_USES, metavar="USE",
                      help="room use, which sets the temperature-factor limit: "
                           + ", ".join(th.ROOM_USES) + " (default other)")
    room.add_argument("--room-volume", metavar="V",
                      help="room volume (m³ for si, ft³ for ip), to size airflow and drying")
    room.add_argument("--occupants", metavar="N",
                      help="people usually in the room, for the moisture load")
    room.add_argument("--target-rh", metavar="RH",
                      help=f"room RH to aim for, %% (default "
                           f"{th.value('room_rh_target_default_pct'):g}, lowered when the "
                           f"coldest surface needs it)")
    accuracy = parser.add_argument_group("instrument accuracy (± each)")
    accuracy.add_argument("--air-temp-accuracy", metavar="K",
                          help="air thermometer, K for si, °F for ip (default "
                               f"{th.value('accuracy_air_temp_k'):g} K); also used outdoors")
    accuracy.add_argument("--rh-accuracy", metavar="RH",
                          help=f"hygrometer, %%RH (default {th.value('accuracy_rh_pct'):g}); "
                               "also used outdoors")
    accuracy.add_argument("--surface-temp-accuracy", metavar="K",
                          help="surface thermometer, K for si, °F for ip (default "
                               f"{th.value('accuracy_surface_temp_k'):g} K)")
    parser.add_argument("--units", choices=units.UNIT_SYSTEMS, default="si",
                        help="unit system for bare numbers and for the table (default si)")
    parser.add_argument("--json", action="store_true",
                        help="print one JSON object with SI keys instead of a table")
    parser.set_defaults(handler=run)


def _option(option: str, text: str, parse: Callable[[str], float],
            check: Callable[[float, str], None] | None = None) -> float:
    """Parse and range-check one option; any error names the option and the text as typed."""
    try:
        value = parse(text)
        if check is not None:
            check(value, option)
    except InputError as exc:
        raise InputError(option, text, exc.allowed) from None
    return value


def _parse_volume(text: str, system: units.UnitSystem) -> float:
    """A room volume in m³ from ``30``, ``30 m3``, ``1060 ft3``; pint only for a suffix."""
    volume = units.parse_volume(text, "--room-volume", system)
    if not VOLUME_MIN_M3 <= volume <= VOLUME_MAX_M3:
        raise InputError("--room-volume", text,
                         f"room volume must be between {VOLUME_MIN_M3:g} and "
                         f"{VOLUME_MAX_M3:g} m³")
    return volume


def _parse_occupants(text: str) -> int:
    allowed = f"expected a whole number of people from 0 to {OCCUPANTS_MAX}"
    try:
        number = units.parse_number(text, "--occupants")
    except InputError:
        raise InputError("--occupants", text, allowed) from None
    if number != math.floor(number) or not 0 <= number <= OCCUPANTS_MAX:
        raise InputError("--occupants", text, allowed)
    return int(number)


def _accuracy_option(option: str, text: str | None, parse: Callable[[str], float],
                     default_key: str, top: float, unit: str) -> tuple[float, bool]:
    if text is None:
        return th.value(default_key), False
    value = _option(option, text, parse)
    if not 0.0 <= value <= top:
        raise InputError(option, text, f"accuracy must be between 0 and {top:g} {unit}")
    return value, True


def _state_dict(state: psychro.MoistAir) -> dict[str, Any]:
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


def _surface_dict(s: assess.SurfaceFinding) -> dict[str, Any]:
    return {
        "label": s.label,
        "surface_temp_c": s.surface_temp_c,
        "surface_rh_pct": s.surface_rh_pct,
        "surface_rh_range_pct": [s.surface_rh_low_pct, s.surface_rh_high_pct],
        "dew_point_margin_k": s.margin_k,
        "margin_uncertainty_k": s.margin_uncertainty_k,
        "condensing": s.condensing,
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


def compute(args: argparse.Namespace) -> dict[str, Any]:
    """Everything ``survey check`` reports, as a JSON-ready dict with SI keys."""
    system = args.units
    air_temp = _option("--air-temp", args.air_temp,
                       lambda t: units.parse_temperature(t, "--air-temp", system),
                       psychro.check_dry_bulb)
    rh = _option("--rh", args.rh, lambda t: units.parse_rh(t, "--rh"), psychro.check_rh)
    if args.pressure is not None:
        pressure = _option("--pressure", args.pressure,
                           lambda t: units.parse_pressure(t, "--pressure", system),
                           psychro.check_pressure)
    elif args.altitude is not None:
        pressure = _option("--altitude", args.altitude,
                           lambda t: psychro.pressure_from_altitude_m(
                               units.parse_length(t, "--altitude", system)))
    else:
        pressure = psychro.STANDARD_PRESSURE_PA
    surface_temps = [
        _option("--surface-temp", text,
                lambda t: units.parse_temperature(t, "--surface-temp", system),
                psychro.check_surface_temp)
        for text in args.surface_temp
    ]
    outdoor = outdoor_input = None
    if (args.outdoor_temp is None) != (args.outdoor_rh is None):
        given = "--outdoor-temp" if args.outdoor_rh is None else "--outdoor-rh"
        missing = "--outdoor-rh" if args.outdoor_rh is None else "--outdoor-temp"
        raise InputError(given, args.outdoor_temp if args.outdoor_rh is None else args.outdoor_rh,
                         f"give {missing} as well: outdoor air needs both temperature and RH")
    if args.outdoor_temp is not None:
        outdoor_temp = _option("--outdoor-temp", args.outdoor_temp,
                               lambda t: units.parse_temperature(t, "--outdoor-temp", system),
                               psychro.check_dry_bulb)
        outdoor_rh = _option("--outdoor-rh", args.outdoor_rh,
                             lambda t: units.parse_rh(t, "--outdoor-rh"), psychro.check_rh)
        outdoor = psychro.state_from_rh(outdoor_temp, outdoor_rh, pressure)
        outdoor_input = assess.OutdoorInput(outdoor_temp, outdoor_rh)

    volume = None if args.room_volume is None else _parse_volume(args.room_volume, system)
    occupants = None if args.occupants is None else _option(
        "--occupants", args.occupants, _parse_occupants)
    target = None
    if args.target_rh is not None:
        target = _option("--target-rh", args.target_rh, lambda t: units.parse_rh(t, "--target-rh"))
        if not advise.TARGET_RH_MIN_PCT <= target <= advise.TARGET_RH_MAX_PCT:
            raise InputError("--target-rh", args.target_rh,
                             f"target RH must be between {advise.TARGET_RH_MIN_PCT:g} and "
                             f"{advise.TARGET_RH_MAX_PCT:g} %")
    use = args.use or "other"
    air_acc, air_given = _accuracy_option(
        "--air-temp-accuracy", args.air_temp_accuracy,
        lambda t: units.parse_temperature_difference(t, "--air-temp-accuracy", system),
        "accuracy_air_temp_k", 5.0, "K")
    rh_acc, rh_given = _accuracy_option(
        "--rh-accuracy", args.rh_accuracy, lambda t: units.parse_rh(t, "--rh-accuracy"),
        "accuracy_rh_pct", 20.0, "%RH")
    surf_acc, surf_given = _accuracy_option(
        "--surface-temp-accuracy", args.surface_temp_accuracy,
        lambda t: units.parse_temperature_difference(t, "--surface-temp-accuracy", system),
        "accuracy_surface_temp_k", 10.0, "K")
    accuracy = assess.Accuracy(air_acc, rh_acc, surf_acc)

    room = psychro.state_from_rh(air_temp, rh, pressure)
    room_input = assess.RoomInput(
        name="Room", use=use, air_temp_c=air_temp, rh_pct=rh,
        surfaces=tuple(assess.SurfaceInput(f"Surface {n}", ts)
                       for n, ts in enumerate(surface_temps, start=1)),
        volume_m3=volume, occupants=occupants)
    site = assess.assess_site([room_input], outdoor_input, pressure, accuracy)
    finding = site.rooms[0]
    fmt = advise.si_text if system == "si" else (
        lambda quantity, value: units.format_value(quantity, value, system))
    advice = advise.advise_site(site, target, fmt=fmt)
    room_advice = advice.rooms[0]

    result = _state_dict(room)
    result["surfaces"] = [_surface_dict(s) for s in finding.surfaces]
    result["outdoor"] = None if outdoor is None else _state_dict(outdoor)
    limit = th.frsi_limit(use)
    result.update({
        "room_use": use,
        "room_use_given": args.use is not None,
        "temperature_factor_limit": None if limit is None else limit.value,
        "temperature_factor_limit_basis": th.FRSI_LIMIT_BY_USE[use].reason,
        "accuracy": {
            "air_temp_k": air_acc, "rh_pct": rh_acc, "surface_temp_k": surf_acc,
            "given": {"air_temp_k": air_given, "rh_pct": rh_given,
                      "surface_temp_k": surf_given},
            "meaning": "± bounds read as rectangular distributions; bands are expanded "
                       f"uncertainties with coverage factor {th.value('coverage_factor'):g} "
                       "(about 95 %)",
        },
        "condensation_point_c": finding.air.condensation_point_c,
        "condensation_point_uncertainty_k": finding.condensation_point_uncertainty_k,
        "coldest_surface": None if finding.coldest is None else finding.coldest.label,
        "max_room_rh_pct_for_coldest_surface": finding.max_room_rh_pct,
        "max_room_rh_range_pct": (None if finding.max_room_rh_low_pct is None else
                                  [finding.max_room_rh_low_pct, finding.max_room_rh_high_pct]),
        "max_room_rh_pct_mould_limit": finding.max_room_rh_pct_mould,
        "max_room_rh_pct_condensation_margin": finding.max_room_rh_pct_margin,
        "vapour_pressure_excess_pa": finding.vapour_pressure_excess_pa,
        "vapour_pressure_excess_uncertainty_pa": finding.vapour_pressure_excess_uncertainty_pa,
        "humidity_class": finding.humidity_class,
        "humidity_class_possible": list(finding.humidity_class_possible),
        "humidity_class_text": (None if finding.outdoor is None
                                else th.humidity_class_text(finding.humidity_class)),
        "timber_emc_pct": finding.timber_emc_pct,
        "room_volume_m3": volume,
        "occupants": occupants,
        "target_rh_pct": room_advice.target_rh_pct,
        "target_basis": room_advice.target_basis,
        "moisture_generation_g_per_h": room_advice.moisture.used_g_per_h,
        "moisture_generation_basis": room_advice.moisture.basis,
        "actions": [a.as_dict() for a in room_advice.actions],
        "cautions": [c.text for c in advice.cautions],
    })
    keys = set(finding.threshold_keys) | set(room_advice.threshold_keys)
    result["thresholds"] = [
        {"key": t.key, "value": t.value, "unit": t.unit, "mark": t.mark,
         "citation": t.citation()}
        for t in th.cited(keys)
    ]
    return result


def run(args: argparse.Namespace) -> int:
    result = compute(args)
    if args.json:
        json.dump(result, sys.stdout, indent=2, ensure_ascii=False)
        sys.stdout.write("\n")
    else:
        render(result, args.units)
    return 0


# --- the table ---------------------------------------------------------------------------------

_CONDENSATION_WORDS = {s.value: s.words for s in assess.CondensationState}
_MOULD_WORDS = {s.value: s.words for s in assess.MouldState}
_FACTOR_WORDS = {s.value: s.words for s in assess.FactorState}
_CANNOT_TELL = assess.CondensationState.CANNOT_TELL.words


def _state_words(words: dict[str, str], state: str, possible: list[str]) -> str:
    """A state in words; a state the band cannot settle names the states it spans."""
    if state != "cannot_tell":
        return words[state]
    return f"{_CANNOT_TELL}: " + " or ".join(words[p] for p in possible)


def render(result: dict[str, Any], system: units.UnitSystem) -> None:
    """Print the result as Rich tables and text in the chosen unit system."""
    from rich.console import Console
    from rich.padding import Padding
    from rich.table import Table
    from rich.text import Text

    def para(text: str, indent: int, style: str = "") -> Padding:
        return Padding(Text(text, style=style), (0, 0, 0, indent))

    fmt = units.format_value
    states = {"Room": result}
    if result["outdoor"] is not None:
        states["Outdoor"] = result["outdoor"]
    table = Table(title="Moist air", title_justify="left")
    table.add_column("Quantity")
    for name in states:
        table.add_column(name, justify="right")
    rows = [
        ("Air temperature", lambda s: fmt("temperature", s["dry_bulb_c"], system)),
        ("Relative humidity", lambda s: f"{s['rh_pct']:.1f} %"),
        ("Pressure", lambda s: fmt("pressure", s["pressure_pa"], system)),
        ("Dew point", lambda s: fmt("temperature", s["dew_point_c"], system)),
        ("Frost point", lambda s: fmt("temperature", s["frost_point_c"], system)),
        ("Humidity ratio", lambda s: fmt("humidity_ratio", s["humidity_ratio_g_per_kg"] / 1000,
                                         system)),
        ("Vapour pressure", lambda s: fmt("vapour_pressure", s["vapour_pressure_pa"], system)),
        ("Wet bulb", lambda s: fmt("temperature", s["wet_bulb_c"], system)),
        ("Absolute humidity", lambda s: fmt("absolute_humidity",
                                            s["absolute_humidity_g_per_m3"], system)),
        ("Enthalpy", lambda s: fmt("enthalpy", s["enthalpy_kj_per_kg"] * 1000, system)),
        ("Specific volume", lambda s: fmt("specific_volume", s["specific_volume_m3_per_kg"],
                                          system)),
        ("Density", lambda s: fmt("density", s["density_kg_per_m3"], system)),
    ]
    if system == "si":  # in IP the humidity ratio row is already in grains per pound
        rows.insert(6, ("Grains per pound", lambda s: f"{s['grains_per_pound']:.1f} gr/lb"))
    for label, show in rows:
        table.add_row(label, *(show(state) for state in states.values()))
    console = Console()
    console.print(table)

    acc = result["accuracy"]
    default_note = ("typical specifications, none entered" if not any(acc["given"].values())
                    else "as entered" if all(acc["given"].values())
                    else "typical specifications where none was entered")
    air_acc = fmt("temperature_difference", acc["air_temp_k"], system)
    surface_acc = fmt("temperature_difference", acc["surface_temp_k"], system)
    accuracy_line = (f"Instrument accuracy: air ±{air_acc}, RH ±{acc['rh_pct']:g} %, surface "
                     f"±{surface_acc} "
                     f"({default_note}). Ranges and ± are expanded uncertainties "
                     f"(about 95 % coverage).")
    if result["surfaces"]:
        readings = Table(title="Surfaces: readings", title_justify="left")
        readings.add_column("Surface")
        readings.add_column("Temp.", justify="right")
        readings.add_column("Surface RH", justify="right")
        readings.add_column("Margin to dew/frost point", justify="right")
        readings.add_column("Temperature factor", justify="right")
        judged = Table(title="Surfaces: risk", title_justify="left")
        judged.add_column("Surface")
        judged.add_column("Condensation")
        judged.add_column("Mould growth")
        judged.add_column("Temperature factor")
        for s in result["surfaces"]:
            low, high = s["surface_rh_range_pct"]
            margin = (fmt("temperature_difference", s["dew_point_margin_k"], system, unit=False)
                      + " ± " + fmt("temperature_difference", s["margin_uncertainty_k"], system))
            factor = "–"
            if s["temperature_factor"] is not None:
                factor = (f"{s['temperature_factor']:.2f} ± "
                          f"{s['temperature_factor_uncertainty']:.2f} "
                          f"(limit {s['temperature_factor_limit']:.2f})")
            readings.add_row(s["label"], fmt("temperature", s["surface_temp_c"], system),
                             f"{s['surface_rh_pct']:.0f} % ({low:.0f}–{high:.0f})", margin,
                             factor)
            judged.add_row(
                s["label"],
                _state_words(_CONDENSATION_WORDS, s["condensation"], s["condensation_possible"]),
                _state_words(_MOULD_WORDS, s["mould"], s["mould_possible"]),
                _state_words(_FACTOR_WORDS, s["temperature_factor_state"],
                             s["temperature_factor_possible"]),
            )
        console.print(Text(accuracy_line))
        console.print(readings)
        console.print(judged)
        if any("cannot_tell" in (s["condensation"], s["mould"], s["temperature_factor_state"])
               for s in result["surfaces"]):
            console.print(Text(
                f"\"{_CANNOT_TELL.capitalize()}\": the reading's range (± the instruments' "
                "accuracy) reaches across a limit, so either state could be true. A more "
                "accurate instrument, or readings repeated over several days, would settle it."))
        console.print()
    else:
        console.print(Text(accuracy_line))
        console.print()

    console.print(Text("Room", style="bold underline"))
    for line in _room_lines(result, system):
        console.print(para(line, 2))
    console.print()
    console.print(Text("What to do", style="bold underline"))
    if not result["actions"]:
        surfaces_note = ("no measured surface calls for work" if result["surfaces"]
                         else "no surface was measured")
        console.print(para("Nothing from these readings: the room is at or below its target "
                           f"of {result['target_rh_pct']:.0f} % RH and {surfaces_note}.", 2))
    for number, action in enumerate(result["actions"], start=1):
        title = advise.ACTION_TITLES[advise.ActionKind(action["kind"])]
        console.print(para(f"{number}. {title}", 2, "bold"))
        console.print(para(action["reason"], 5))
    console.print()
    console.print(Text("Safety", style="bold underline"))
    for caution in result["cautions"]:
        console.print(para(f"• {caution}", 2))
    console.print()
    console.print(Text("Limits used", style="bold underline"))
    shown = set(_SHOWN_LIMITS)
    if result["humidity_class"] in (1, 2, 3, 4, 5):
        shown.add(f"humidity_class_{result['humidity_class']}_pa")
    for t in result["thresholds"]:
        if t["key"] in shown:
            console.print(para(f"• {th.get(t['key']).short_citation()}", 2))
    console.print(para("Every limit behind these findings, with its source, is listed under "
                       "\"thresholds\" in --json output.", 2))


_SHOWN_LIMITS = {"dew_point_margin_k", "surface_rh_mould_limit_pct", "frsi_dwelling",
                 "frsi_high_humidity", "frsi_storage", "frsi_general",
                 "frsi_min_temperature_difference_k", "room_rh_floor_pct",
                 "coverage_factor"}


def _room_lines(result: dict[str, Any], system: units.UnitSystem) -> list[str]:
    fmt = units.format_value
    lines = []
    use = result["room_use"] + ("" if result["room_use_given"] else " (no --use given)")
    limit = result["temperature_factor_limit"]
    lines.append(f"Use: {use}; temperature-factor limit "
                 + ("none" if limit is None else f"{limit:.2f}")
                 + f" — {result['temperature_factor_limit_basis']}.")
    dew_u = fmt("temperature_difference", result["condensation_point_uncertainty_k"], system)
    lines.append(f"Dew point {fmt('temperature', result['condensation_point_c'], system)} ± "
                 f"{dew_u}"
                 + (" (frost point: surfaces below 0 °C gather frost)"
                    if result["frost_point_c"] is not None else "") + ".")
    if result["coldest_surface"] is not None:
        low, high = result["max_room_rh_range_pct"]
        mould = th.value("surface_rh_mould_limit_pct")
        margin = fmt("temperature_difference", th.value("dew_point_margin_k"), system)
        lines.append(
            f"Highest room RH the coldest surface ({result['coldest_surface']}) can bear: "
            f"{math.floor(result['max_room_rh_pct_for_coldest_surface']):.0f} % "
            f"({math.floor(low):.0f} to {math.floor(high):.0f} % at this accuracy). Up to "
            f"{math.floor(result['max_room_rh_pct_mould_limit']):.0f} % it stays at or below "
            f"{mould:.0f} % surface RH (mould limit), up to "
            f"{math.floor(result['max_room_rh_pct_condensation_margin']):.0f} % at least "
            f"{margin} above the dew point. The room is at {result['rh_pct']:.0f} % now.")
    if result["outdoor"] is None:
        lines.append("Humidity class: not judged (give --outdoor-temp and --outdoor-rh).")
    elif result["humidity_class"] is None:
        lines.append("Humidity class: not judged (outdoor air at or above 20 °C).")
    else:
        possible = result["humidity_class_possible"]
        spread = ("" if len(possible) == 1 else
                  f"; class {possible[0]} to {possible[-1]} at this accuracy")
        lines.append(
            f"Humidity class (EN ISO 13788): {result['humidity_class_text']}, as in "
            f"{th.HUMIDITY_CLASS_EXAMPLES[result['humidity_class']]} — the room air's "
            f"vapour pressure is {result['vapour_pressure_excess_pa']:.0f} ± "
            f"{result['vapour_pressure_excess_uncertainty_pa']:.0f} Pa above outdoors{spread}. "
            f"Classes are defined for monthly means; a spot reading is a guide.")
    lines.append(f"Timber in this air settles at about {result['timber_emc_pct']:.1f} % moisture "
                 f"content (Wood Handbook eqn 4-5).")
    return lines
