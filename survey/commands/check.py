"""``survey check``: the quick on-site check of one room's air and its surfaces.

    survey check --air-temp 18 --rh 72 --surface-temp 11 --surface-temp 15.5 \\
                 --glazing-temp 6 --pipe-temp 9 \\
                 --outdoor-temp 3 --outdoor-rh 88 --room-volume 30 --occupants 2 \\
                 --use bedroom --units si --json

Besides the moist-air state it judges every surface (condensation, mould growth,
temperature factor, each with the band the instrument accuracy leaves), the room's humidity
class and the highest room RH its coldest wall, ceiling or floor can bear, and lists actions
with numbers and safety cautions (:mod:`survey.assess`, :mod:`survey.advise`). What a
surface is (wall, glazing, pipe …) decides what it is judged by
(:data:`survey.thresholds.ELEMENT_POLICY`): glazing, window frames and pipes never set the
room's RH target.

The JSON path imports neither Rich nor pint unless a value carries a unit suffix, so it
starts fast.
"""

from __future__ import annotations

import argparse
import json
import math
import sys
from typing import Any, Callable

from survey import advise, assess, domain, psychro, units
from survey import thresholds as th
from survey.errors import InputError

DESCRIPTION = (
    "Dew point, surface condensation, mould risk and what to do, for one room. A bare number "
    "is read in the chosen unit system (°C/hPa/m/m³ for si, °F/inHg/ft/ft³ for ip); a unit "
    "may be typed with any value: 70F, 21 °C, 1002hPa, 1150 ft, 30 m3. Say what each measured "
    "surface is: --surface-temp is a wall, ceiling or floor (not said which); --glazing-temp, "
    "--frame-temp and --pipe-temp are judged for condensation only and never set the room's "
    "RH target; --surface ELEMENT:TEMP[:LABEL] names any element. Instrument accuracies "
    "default to typical specifications (air "
    f"±{th.value('accuracy_air_temp_k'):g} K, RH ±{th.value('accuracy_rh_pct'):g} %, surface "
    f"±{th.value('accuracy_surface_temp_k'):g} K); the output says which were used."
)

VOLUME_MIN_M3 = domain.ROOM_VOLUME_MIN_M3
VOLUME_MAX_M3 = domain.ROOM_VOLUME_MAX_M3
OCCUPANTS_MAX = domain.OCCUPANTS_MAX
#: A bare SI air temperature above this is more likely °F typed without --units ip: a
#: warning (not an error) says how it was read. A plausibility cue of this face only.
PLAUSIBLE_SI_AIR_TEMP_MAX_C = 40.0

#: The surface options: option -> (element, label of an unnamed surface).
_SURFACE_OPTIONS = {
    "--surface-temp": ("other", "Surface"),
    "--glazing-temp": ("glazing", "Glazing"),
    "--frame-temp": ("window_frame", "Window frame"),
    "--pipe-temp": ("pipe", "Pipe"),
    "--surface": (None, None),
}


class _SurfaceOption(argparse.Action):
    """Collects every surface option, in the order typed, as (option, text)."""

    def __call__(self, parser, namespace, values, option_string=None):
        found = list(getattr(namespace, self.dest, None) or [])
        found.append((option_string, values))
        setattr(namespace, self.dest, found)


def register(subparsers: argparse._SubParsersAction) -> None:
    parser = subparsers.add_parser(
        "check", help="quick check of one room's air and surfaces", description=DESCRIPTION
    )
    parser.add_argument("--air-temp", required=True, metavar="T",
                        help="room air (dry-bulb) temperature")
    parser.add_argument("--rh", required=True, metavar="RH",
                        help="room relative humidity, %% (relative to water, as hygrometers read)")
    surfaces = parser.add_argument_group(
        "surfaces (each option may be repeated; the order typed is kept)")
    surfaces.add_argument("--surface-temp", action=_SurfaceOption, dest="surfaces", default=[],
                          metavar="T",
                          help="a wall, ceiling or floor surface temperature (which one not "
                               "said: judged as part of the heated envelope)")
    surfaces.add_argument("--glazing-temp", action=_SurfaceOption, dest="surfaces",
                          metavar="T", help="a window pane: condensation only")
    surfaces.add_argument("--frame-temp", action=_SurfaceOption, dest="surfaces", metavar="T",
                          help="a window frame: condensation, and mould on frames and seals")
    surfaces.add_argument("--pipe-temp", action=_SurfaceOption, dest="surfaces", metavar="T",
                          help="a cold pipe: condensation only")
    surfaces.add_argument("--surface", action=_SurfaceOption, dest="surfaces",
                          metavar="ELEMENT:T[:LABEL]",
                          help="any surface, e.g. external_wall:11.2:NE corner; ELEMENT is "
                               "one of " + ", ".join(th.SURFACE_ELEMENTS))
    parser.add_argument("--outdoor-temp", metavar="T", help="outdoor air temperature")
    parser.add_argument("--outdoor-rh", metavar="RH", help="outdoor relative humidity, %%")
    where = parser.add_mutually_exclusive_group()
    where.add_argument("--altitude", metavar="Z",
                       help="site altitude (standard atmosphere gives the pressure)")
    where.add_argument("--pressure", metavar="P", help="measured barometric pressure")
    room = parser.add_argument_group("room (for the advice)")
    room.add_argument("--use", type=str.lower, choices=th.ROOM_USES, metavar="USE",
                      help="room use, which sets the temperature-factor limit: "
                           + ", ".join(th.ROOM_USES) + " (default: not given, general limit)")
    room.add_argument("--room-volume", metavar="V",
                      help="room volume (m³ for si, ft³ for ip), to size airflow and drying")
    room.add_argument("--occupants", metavar="N",
                      help="people usually in the room, for the moisture load")
    room.add_argument("--target-rh", metavar="RH",
                      help=f"room RH to aim for, %% (default "
                           f"{th.value('room_rh_target_default_pct'):g}, lowered when the "
                           f"coldest wall, ceiling or floor needs it)")
    room.add_argument("--mould-seen", action="store_true",
                      help="visible mould in the room (for the mould caution)")
    room.add_argument("--mould-area", metavar="M2",
                      help="area of visible mould, m² (implies --mould-seen); sets the "
                           "small / medium / large guidance")
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
    parser.add_argument("--units", type=str.lower, choices=units.UNIT_SYSTEMS, default="si",
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


def _is_bare_number(text: str) -> bool:
    """A number with no unit (a lone degree sign follows the unit system, so counts)."""
    try:
        units.parse_number(str(text).strip().rstrip("°º").strip())
    except InputError:
        return False
    return True


def _plausibility(option: str, text: str, value_c: float, system: str) -> str | None:
    """A warning line when a bare SI air temperature is more likely meant in °F."""
    if system == "si" and value_c > PLAUSIBLE_SI_AIR_TEMP_MAX_C and _is_bare_number(text):
        return (f"{option} {text}: read as {value_c:g} °C; for °F use --units ip or "
                f"{str(text).strip()}F")
    return None


def _parse_volume(text: str, system: units.UnitSystem) -> float:
    """A room volume in m³ from ``30``, ``30 m3``, ``1060 ft3``; pint only for a suffix."""
    volume = units.parse_volume(text, "--room-volume", system)
    if not VOLUME_MIN_M3 <= volume <= VOLUME_MAX_M3:
        raise InputError("--room-volume", text,
                         f"room volume must be between {VOLUME_MIN_M3:g} and "
                         f"{VOLUME_MAX_M3:g} m³")
    return volume


def _parse_mould_area(text: str) -> float:
    """A visible-mould area in m², above 0 and up to the survey file's limit."""
    allowed = (f"an area in m² above 0 and up to {domain.MOULD_AREA_MAX_M2:g}, "
               f"e.g. 0.5 (numbers only, m²)")
    try:
        area = units.parse_number(text, "--mould-area")
    except InputError:
        raise InputError("--mould-area", text, allowed) from None
    if not (0.0 < area <= domain.MOULD_AREA_MAX_M2) or math.isnan(area):
        raise InputError("--mould-area", text, allowed)
    return area


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


def _surfaces(specs: list[tuple[str, str]], system: units.UnitSystem
              ) -> list[assess.SurfaceInput]:
    """The surfaces typed, in order, each with its element and a label."""
    counts: dict[str, int] = {}
    found = []

    def temperature(option: str, text: str) -> float:
        return _option(option, text, lambda t: units.parse_temperature(t, option, system),
                       psychro.check_surface_temp)

    for option, text in specs:
        element, prefix = _SURFACE_OPTIONS[option]
        label = ""
        if element is None:
            parts = str(text).split(":", 2)
            if len(parts) < 2 or not parts[1].strip():
                raise InputError(option, text, "expected ELEMENT:TEMPERATURE or "
                                               "ELEMENT:TEMPERATURE:LABEL, e.g. "
                                               "external_wall:11.2:NE corner")
            try:
                policy = th.check_element(parts[0].strip(), option)
            except InputError as exc:
                raise InputError(option, text, "element " + exc.allowed) from None
            element = policy.element
            prefix = policy.words.capitalize()
            try:
                temp = temperature(option, parts[1].strip())
            except InputError as exc:
                raise InputError(option, text, exc.allowed) from None
            label = parts[2].strip() if len(parts) == 3 else ""
        else:
            temp = temperature(option, text)
        if not label:
            counts[prefix] = counts.get(prefix, 0) + 1
            label = f"{prefix} {counts[prefix]}"
        found.append(assess.SurfaceInput(label, temp, element))
    return found


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


_MAX_RH_BASIS = ("the coldest wall, ceiling or floor (any surface not said to be glazing, a "
                 "window frame or a pipe); glazing, window frames and pipes are judged apart "
                 "and never set the room RH")


def compute(args: argparse.Namespace) -> dict[str, Any]:
    """Everything ``survey check`` reports, as a JSON-ready dict with SI keys."""
    system = args.units
    warnings: list[str] = []
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
    surfaces = _surfaces(args.surfaces or [], system)
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
    for option, text, value in (("--air-temp", args.air_temp, air_temp),
                                ("--outdoor-temp", args.outdoor_temp,
                                 None if outdoor_input is None else outdoor_input.air_temp_c)):
        if value is not None and (warning := _plausibility(option, text, value, system)):
            warnings.append(warning)

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
    mould_area = 0.0
    if args.mould_area is not None:
        mould_area = _option("--mould-area", args.mould_area, _parse_mould_area)
    mould_seen = bool(args.mould_seen or mould_area > 0.0)
    air_acc, air_given = _accuracy_option(
        "--air-temp-accuracy", args.air_temp_accuracy,
        lambda t: units.parse_temperature_difference(t, "--air-temp-accuracy", system),
        "accuracy_air_temp_k", domain.AIR_TEMP_ACCURACY_MAX_K, "K")
    rh_acc, rh_given = _accuracy_option(
        "--rh-accuracy", args.rh_accuracy, lambda t: units.parse_rh(t, "--rh-accuracy"),
        "accuracy_rh_pct", domain.RH_ACCURACY_MAX_PCT, "%RH")
    surf_acc, surf_given = _accuracy_option(
        "--surface-temp-accuracy", args.surface_temp_accuracy,
        lambda t: units.parse_temperature_difference(t, "--surface-temp-accuracy", system),
        "accuracy_surface_temp_k", domain.SURFACE_TEMP_ACCURACY_MAX_K, "K")
    accuracy = assess.Accuracy(air_acc, rh_acc, surf_acc)

    room = psychro.state_from_rh(air_temp, rh, pressure)
    room_input = assess.RoomInput(
        name="Room", use=use, air_temp_c=air_temp, rh_pct=rh, surfaces=tuple(surfaces),
        volume_m3=volume, occupants=occupants,
        observations=assess.Observations(visible_mould_area_m2=mould_area,
                                         visible_mould=mould_seen))
    site = assess.assess_site([room_input], outdoor_input, pressure, accuracy)
    finding = site.rooms[0]
    fmt = advise.si_text if system == "si" else (
        lambda quantity, value, decimals=None: units.format_value(quantity, value, system,
                                                                  decimals))
    advice = advise.advise_site(site, target, fmt=fmt)
    room_advice = advice.rooms[0]

    result = _state_dict(room)
    result["surfaces"] = [_surface_dict(s) for s in finding.surfaces]
    result["outdoor"] = None if outdoor is None else _state_dict(outdoor)
    limit = th.frsi_limit(use)
    coldest = finding.coldest
    apart = finding.coldest_glazing_or_pipe
    result.update({
        "room_use": use,
        "room_use_given": args.use is not None,
        "temperature_factor_limit": None if limit is None else limit.value,
        "temperature_factor_limit_basis": th.FRSI_LIMIT_BY_USE[use].reason,
        "temperature_factor_not_judged_reason": finding.temperature_factor_not_judged_reason,
        "accuracy": {
            "air_temp_k": air_acc, "rh_pct": rh_acc, "surface_temp_k": surf_acc,
            "given": {"air_temp_k": air_given, "rh_pct": rh_given,
                      "surface_temp_k": surf_given},
            "meaning": "± bounds read as rectangular distributions; bands are expanded "
                       f"uncertainties with coverage factor {th.value('coverage_factor'):g} "
                       "(about 95 %)",
        },
        "condensation_point_c": finding.air.condensation_point_c,
        "condensation_point_is_frost_point": room.frost_point_c is not None,
        "condensation_point_uncertainty_k": finding.condensation_point_uncertainty_k,
        "coldest_surface": None if coldest is None else coldest.label,
        "coldest_surface_element": None if coldest is None else coldest.element,
        "coldest_surface_temp_c": None if coldest is None else coldest.surface_temp_c,
        "max_room_rh_basis": _MAX_RH_BASIS,
        "max_room_rh_pct_for_coldest_surface": finding.max_room_rh_pct,
        "max_room_rh_range_pct": (None if finding.max_room_rh_low_pct is None else
                                  [finding.max_room_rh_low_pct, finding.max_room_rh_high_pct]),
        "max_room_rh_pct_mould_limit": finding.max_room_rh_pct_mould,
        "max_room_rh_pct_condensation_margin": finding.max_room_rh_pct_margin,
        "coldest_glazing_or_pipe": None if apart is None else apart.label,
        "coldest_glazing_or_pipe_element": None if apart is None else apart.element,
        "max_room_rh_pct_dry_glazing_or_pipe": finding.max_room_rh_pct_dry_glazing_or_pipe,
        "vapour_pressure_excess_pa": finding.vapour_pressure_excess_pa,
        "vapour_pressure_excess_uncertainty_pa": finding.vapour_pressure_excess_uncertainty_pa,
        "humidity_class": finding.humidity_class,
        "humidity_class_possible": list(finding.humidity_class_possible),
        "humidity_class_text": (None if finding.outdoor is None
                                else th.humidity_class_text(finding.humidity_class)),
        "humidity_class_possible_text": (
            None if finding.humidity_class is None
            else th.humidity_class_range_text(finding.humidity_class_possible)),
        "timber_emc_pct": finding.timber_emc_pct,
        "room_volume_m3": volume,
        "occupants": occupants,
        "target_rh_pct": room_advice.target_rh_pct,
        "target_basis": room_advice.target_basis,
        "moisture_generation_g_per_h": room_advice.moisture.used_g_per_h,
        "moisture_generation_basis": room_advice.moisture.basis,
        "actions": [a.as_dict() for a in room_advice.actions],
        "cautions": [c.text for c in advice.cautions],
        "warnings": warnings,
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
    for warning in result["warnings"]:
        print(f"survey: warning: {warning}", file=sys.stderr)
    if args.json:
        json.dump(result, sys.stdout, indent=2, ensure_ascii=False)
        sys.stdout.write("\n")
    else:
        render(result, args.units)
    return 0


# --- words for the table -------------------------------------------------------------------------

_CONDENSATION_WORDS = {s.value: s.words for s in assess.CondensationState}
_FROST_WORDS = {"clear": "clear of the frost point", "near_dew_point": "close to the frost point",
                "condensing": "frost forming now"}
_MOULD_WORDS = {s.value: s.words for s in assess.MouldState}
_FACTOR_WORDS = {s.value: s.words for s in assess.FactorState}
_CANNOT_TELL = assess.CondensationState.CANNOT_TELL.words
#: The kind of surface in the readings table.
_ELEMENT_WORDS = {e: ("not said" if e == "other" else p.words)
                  for e, p in th.ELEMENT_POLICY.items()}


def _below_freezing(surface: dict[str, Any]) -> bool:
    return surface["surface_temp_c"] <= psychro.TRIPLE_POINT_C


def _state_words(words: dict[str, str], state: str, possible: list[str]) -> str:
    """A state in words; a state the band cannot settle names the states it spans."""
    if state != "cannot_tell":
        return words[state]
    return f"{_CANNOT_TELL}: " + " or ".join(words[p] for p in possible)


def _condensation_text(surface: dict[str, Any]) -> str:
    words = _FROST_WORDS if _below_freezing(surface) else _CONDENSATION_WORDS
    return _state_words(words, surface["condensation"], surface["condensation_possible"])


def _factor_text(surface: dict[str, Any], result: dict[str, Any],
                 system: units.UnitSystem) -> str:
    state = surface["temperature_factor_state"]
    text = _state_words(_FACTOR_WORDS, state, surface["temperature_factor_possible"])
    if state == "not_judged" and result["temperature_factor_not_judged_reason"]:
        text += ": " + _not_judged_reason(result, system)
    return text


def _not_judged_reason(result: dict[str, Any], system: units.UnitSystem) -> str:
    """Why the temperature factor cannot be judged today, in the table's words."""
    if result["outdoor"] is None:
        return "no outdoor reading (give --outdoor-temp and --outdoor-rh)"
    least = th.value("frsi_min_temperature_difference_k")
    return ("the inside-outside difference is under the "
            f"{units.format_value('temperature_difference', least, system, 0)} needed")


def _surface_rh_text(surface: dict[str, Any]) -> str:
    """Surface RH for a client: over 100 % says what forms; a band only when it is one."""
    rh = surface["surface_rh_pct"]
    low, high = surface["surface_rh_range_pct"]
    if rh >= 100.0:
        return "over 100 % (" + ("frost" if _below_freezing(surface) else "water") + " forming)"
    shown_low, shown_high = f"{low:.0f}", ("over 100" if high >= 100.0 else f"{high:.0f}")
    if shown_low == shown_high == f"{rh:.0f}":
        return f"{rh:.0f} %"
    return f"{rh:.0f} % ({shown_low}–{shown_high})"


def _short_verdict(surface: dict[str, Any], system: units.UnitSystem) -> str:
    """A few words per surface for the summary: what forms, mould, the factor."""
    frost = _below_freezing(surface)
    what = "frost" if frost else "water"
    point = "frost point" if frost else "dew point"
    margin = units.format_value("temperature_difference", th.value("dew_point_margin_k"),
                                system)
    parts = []
    condensation, possible = surface["condensation"], surface["condensation_possible"]
    if condensation == "condensing":
        parts.append(f"{what} forming")
    elif condensation == "near_dew_point":
        parts.append(f"within {margin} of the {point}")
    elif condensation == "cannot_tell":
        parts.append(f"{what} may be forming" if "condensing" in possible
                     else f"may be within {margin} of the {point}")
    else:
        parts.append(f"clear of the {point}")
    mould, possible = surface["mould"], surface["mould_possible"]
    if mould == "cannot_tell":
        parts.append("may be above the mould limit" if "above_limit" in possible
                     else "may be approaching the mould limit")
    elif mould != "not_judged":
        parts.append(_MOULD_WORDS[mould])
    if surface["temperature_factor_state"] == "under_limit":
        parts.append("temperature factor under the limit")
    elif surface["temperature_factor_state"] == "cannot_tell":
        factor, limit = surface["temperature_factor"], surface["temperature_factor_limit"]
        if factor is not None and limit is not None and factor >= limit:
            parts.append(f"temperature factor {factor:.2f}, meets the {limit:.2f} limit "
                         f"(only the edge of its accuracy band reaches below: no action needed)")
        else:
            parts.append("temperature factor may be under the limit")
    return "; ".join(parts)


_SEVERITY = {"condensing": 3, "cannot_tell": 2, "near_dew_point": 1, "clear": 0}


def _worst_first(surfaces: list[dict[str, Any]]) -> list[dict[str, Any]]:
    def rank(s):
        mould = {"above_limit": 3, "cannot_tell": 2, "approaching_limit": 1}.get(s["mould"], 0)
        return (-_SEVERITY[s["condensation"]] - mould, s["surface_temp_c"])
    return sorted(surfaces, key=rank)


def _rh_limit_text(result: dict[str, Any]) -> str | None:
    """'38 % (35 to 41 % at this accuracy)', or 'any RH' for a surface that bears it."""
    top = result["max_room_rh_pct_for_coldest_surface"]
    if top is None:
        return None
    shown = advise.rh_limit_shown(top)
    if top >= 100.0:
        return "any room RH (it stays below the limits even at 100 %)"
    low, high = result["max_room_rh_range_pct"]
    low_shown, high_shown = advise.rh_limit_shown(low), advise.rh_limit_shown(high)
    if low_shown == high_shown == shown:
        return f"{shown} %"
    return f"{shown} % ({low_shown} to {high_shown} % at this accuracy)"


def _action_numbers(action: dict[str, Any], system: units.UnitSystem) -> str:
    fmt = units.format_value
    kind = action["kind"]
    if kind == "ventilate" and action.get("airflow_m3_per_h") is not None:
        text = f"about {fmt('airflow', action['airflow_m3_per_h'], system)}"
        if action.get("air_changes_per_h") is not None:
            text += f" ({action['air_changes_per_h']:.1f} air changes an hour)"
        return text
    if kind == "dehumidify" and action.get("removal_l_per_day"):
        return f"at least {fmt('water_rate', action['removal_l_per_day'], system)}"
    if kind == "raise_surface_temperature":
        least = advise.round_up_temperature_c(action["target_surface_temp_c"], system == "ip")
        return f"to at least {fmt('temperature', least, system)}"
    if kind == "keep_drying":
        count = action["materials_above_dry_standard"]
        return f"{count} reading{'s' if count != 1 else ''} above the dry standard"
    return ""


def summary_lines(result: dict[str, Any], system: units.UnitSystem) -> list[str]:
    """The short summary at the top of the table: a verdict per surface (worst first, at
    most four), the highest safe room RH, and the first action."""
    fmt = units.format_value
    lines = []
    surfaces = _worst_first(result["surfaces"])
    for s in surfaces[:4]:
        lines.append(f"{s['label']}, {fmt('temperature', s['surface_temp_c'], system)}: "
                     f"{_short_verdict(s, system)}.")
    if len(surfaces) > 4:
        lines.append(f"… and {len(surfaces) - 4} more surfaces, in the tables below.")
    limit = _rh_limit_text(result)
    if limit is not None:
        lines.append(f"Highest safe room RH: {limit}, set by {result['coldest_surface']}, the "
                     f"coldest wall, ceiling or floor; the room is at {result['rh_pct']:.0f} %.")
    elif not result["surfaces"]:
        lines.append(f"No surface measured; the room is at {result['rh_pct']:.0f} % RH.")
    else:
        lines.append(f"No wall, ceiling or floor measured, so no highest safe room RH; the "
                     f"room is at {result['rh_pct']:.0f} % RH.")
    if result["actions"]:
        first = result["actions"][0]
        numbers = _action_numbers(first, system)
        more = len(result["actions"]) - 1
        lines.append(f"First: {first['title']}" + (f", {numbers}" if numbers else "")
                     + (f" (then {more} more under \"What to do\")." if more else "."))
    elif any(sf["temperature_factor_state"] == "cannot_tell"
             and sf["temperature_factor"] is not None
             and sf["temperature_factor"] < sf["temperature_factor_limit"]
             for sf in result["surfaces"]):
        lines.append("No action is certain from these readings: the temperature factor is "
                     "just under its limit but within the instruments' accuracy; confirm it "
                     "on a colder day or with more accurate instruments.")
    else:
        lines.append("Nothing to do from these readings.")
    return lines


def _limit_value_text(t: th.Threshold, system: units.UnitSystem) -> str | None:
    """A limit's value in the table's units (a 3 K margin is 5.4 °F in IP)."""
    if system == "si":
        return None
    if t.unit == "K":
        return units.format_value("temperature_difference", t.value, system)
    if t.unit == "°C":
        return units.format_value("temperature", t.value, system)
    return None


def render(result: dict[str, Any], system: units.UnitSystem) -> None:
    """Print the result as Rich tables and text in the chosen unit system."""
    from rich.console import Console
    from rich.padding import Padding
    from rich.table import Table
    from rich.text import Text

    def para(text: str, indent: int, style: str = "") -> Padding:
        return Padding(Text(text, style=style), (0, 0, 0, indent))

    fmt = units.format_value
    console = Console()
    console.print(Text("Summary", style="bold underline"))
    for line in summary_lines(result, system):
        console.print(para(line, 2))
    console.print()

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
        readings.add_column("Kind")
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
            margin = (fmt("temperature_difference", s["dew_point_margin_k"], system, unit=False)
                      + " ± " + fmt("temperature_difference", s["margin_uncertainty_k"], system))
            factor = "–"
            if s["temperature_factor"] is not None:
                factor = (f"{s['temperature_factor']:.2f} ± "
                          f"{s['temperature_factor_uncertainty']:.2f} "
                          f"(limit {s['temperature_factor_limit']:.2f})")
            elif s["temperature_factor_state"] == "not_for_element":
                factor = "not used"
            readings.add_row(s["label"], _ELEMENT_WORDS[s["element"]],
                             fmt("temperature", s["surface_temp_c"], system),
                             _surface_rh_text(s), margin, factor)
            judged.add_row(
                s["label"], _condensation_text(s),
                _state_words(_MOULD_WORDS, s["mould"], s["mould_possible"]),
                _factor_text(s, result, system),
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
        console.print(para(f"{number}. {action['title']}", 2, "bold"))
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
            limit = th.get(t["key"])
            console.print(para(f"• {limit.client_citation(_limit_value_text(limit, system))}",
                               2))
    console.print(para("Every limit behind these findings, with its source, is listed under "
                       "\"thresholds\" in --json output.", 2))


_SHOWN_LIMITS = {"dew_point_margin_k", "surface_rh_mould_limit_pct", "frsi_dwelling",
                 "frsi_high_humidity", "frsi_storage", "frsi_general",
                 "frsi_min_temperature_difference_k", "room_rh_floor_pct",
                 "coverage_factor"}


def _room_lines(result: dict[str, Any], system: units.UnitSystem) -> list[str]:
    fmt = units.format_value
    lines = []
    limit = result["temperature_factor_limit"]
    use = result["room_use"]
    if not result["room_use_given"]:
        lines.append(f"Use: not given (--use); the general temperature-factor limit "
                     f"{limit:.2f} applies (IEA Annex 14).")
    elif limit is None:
        lines.append(f"Use: {use}; no temperature-factor limit — "
                     f"{result['temperature_factor_limit_basis']}.")
    else:
        lines.append(f"Use: {use}; temperature-factor limit {limit:.2f} — "
                     f"{result['temperature_factor_limit_basis']}.")
    if result["temperature_factor_not_judged_reason"] and any(
            s["temperature_factor_state"] == "not_judged" for s in result["surfaces"]):
        lines.append(f"Temperature factor: cannot be judged today — "
                     f"{_not_judged_reason(result, system)}"
                     + ("" if result["outdoor"] is None else
                        f" (inside {fmt('temperature', result['dry_bulb_c'], system)}, outside "
                        f"{fmt('temperature', result['outdoor']['dry_bulb_c'], system)})")
                     + ".")
    point_u = fmt("temperature_difference", result["condensation_point_uncertainty_k"], system)
    point = fmt("temperature", result["condensation_point_c"], system)
    if result["condensation_point_is_frost_point"]:
        lines.append(f"Condensation point (frost point) {point} ± {point_u}: surfaces below "
                     f"0 °C gather frost; the dew point over water is "
                     f"{fmt('temperature', result['dew_point_c'], system)}.")
    else:
        lines.append(f"Dew point {point} ± {point_u}.")
    rh_text = _rh_limit_text(result)
    if rh_text is not None:
        mould = th.value("surface_rh_mould_limit_pct")
        margin = fmt("temperature_difference", th.value("dew_point_margin_k"), system)
        coldest = (f"{result['coldest_surface']}, "
                   f"{fmt('temperature', result['coldest_surface_temp_c'], system)}")
        line = (f"Highest room RH the coldest wall, ceiling or floor ({coldest}) can bear: "
                f"{rh_text}.")
        if result["max_room_rh_pct_for_coldest_surface"] < 100.0:
            line += (
                f" Up to {advise.rh_limit_shown(result['max_room_rh_pct_mould_limit'])} % it "
                f"stays at or below {mould:.0f} % surface RH (mould limit), up to "
                f"{advise.rh_limit_shown(result['max_room_rh_pct_condensation_margin'])} % at "
                f"least {margin} above the "
                f"{'frost' if result['condensation_point_is_frost_point'] else 'dew'} point.")
        lines.append(line + f" The room is at {result['rh_pct']:.0f} % now.")
    if result["coldest_glazing_or_pipe"] is not None:
        dry = result["max_room_rh_pct_dry_glazing_or_pipe"]
        label = result["coldest_glazing_or_pipe"]
        stays = ("stays clear of condensation at any room RH" if dry >= 100.0 else
                 f"stays clear of condensation while the room is below "
                 f"{advise.rh_limit_shown(dry)} % RH")
        lines.append(f"Glazing, window frames and pipes are judged apart and do not set the "
                     f"room's RH: the coldest, {label}, {stays}.")
    if result["outdoor"] is None:
        lines.append("Humidity class: not judged (give --outdoor-temp and --outdoor-rh).")
    elif result["humidity_class"] is None:
        lines.append("Humidity class: not judged (outdoor air at or above "
                     f"{fmt('temperature', th.value('humidity_class_zero_at_c'), system)}).")
    else:
        possible = result["humidity_class_possible"]
        spread = ("" if len(possible) <= 1 else
                  f"; {result['humidity_class_possible_text']} at this accuracy")
        number = result["humidity_class"]
        example = th.HUMIDITY_CLASS_EXAMPLES[number]
        like = example if number == th.BEYOND_CLASS_5 else f"as in {example}"
        excess = fmt("vapour_pressure", result["vapour_pressure_excess_pa"], system)
        band = fmt("vapour_pressure", result["vapour_pressure_excess_uncertainty_pa"], system)
        lines.append(
            f"Humidity class (EN ISO 13788): {result['humidity_class_text']}, {like} — the "
            f"room air's vapour pressure is {excess} (± {band}) above outdoors{spread}. "
            f"Classes are defined for monthly means; a spot reading is a guide.")
    lines.append(f"Timber in this air settles at about {result['timber_emc_pct']:.1f} % moisture "
                 f"content (Wood Handbook eqn 4-5).")
    return lines
