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
from typing import Callable

from survey import advise, assess, domain, psychro, units
from survey import thresholds as th
from survey.errors import InputError
from survey.quick import AccuracyGiven, QuickInput, QuickResult, judge

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
    room.add_argument("--mould-area", metavar="AREA",
                      help="area of visible mould, m² for si, ft² for ip, or with m2 / ft2 "
                           "(implies --mould-seen); sets the small / medium / large guidance")
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


_FT2_PER_M2 = 1.0 / 0.3048 ** 2  # 1 ft = 0.3048 m exactly


def _parse_mould_area(text: str, system: units.UnitSystem = "si") -> float:
    """A visible-mould area in m² (a bare number is m² in si, ft² in ip; "m2", "ft2",
    "sq ft" may follow it), above 0 and up to the survey file's limit."""
    raw = str(text).strip()
    lowered = raw.lower()
    factor = 1.0 if system == "si" else 1.0 / _FT2_PER_M2
    for suffix, to_m2 in (("sq ft", 1.0 / _FT2_PER_M2), ("ft2", 1.0 / _FT2_PER_M2),
                          ("ft²", 1.0 / _FT2_PER_M2), ("m2", 1.0), ("m²", 1.0)):
        if lowered.endswith(suffix):
            raw, factor = raw[: -len(suffix)].strip(), to_m2
            break
    unit = "m²" if system == "si" else "ft²"
    allowed = (f"an area above 0 and up to {domain.MOULD_AREA_MAX_M2:g} m², e.g. 0.5 "
               f"(a bare number is {unit}; m2 or ft2 may follow it)")
    try:
        area = units.parse_number(raw, "--mould-area") * factor
    except InputError:
        raise InputError("--mould-area", text, allowed) from None
    if math.isnan(area) or not 0.0 < area <= domain.MOULD_AREA_MAX_M2:
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


def gather(args: argparse.Namespace) -> QuickInput:
    """The options typed, parsed to SI and range-checked; an error names the option."""
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
    outdoor = None
    if (args.outdoor_temp is None) != (args.outdoor_rh is None):
        given = "--outdoor-temp" if args.outdoor_rh is None else "--outdoor-rh"
        missing = "--outdoor-rh" if args.outdoor_rh is None else "--outdoor-temp"
        raise InputError(given, args.outdoor_temp if args.outdoor_rh is None else args.outdoor_rh,
                         f"give {missing} as well: outdoor air needs both temperature and RH")
    if args.outdoor_temp is not None:
        outdoor = assess.OutdoorInput(
            _option("--outdoor-temp", args.outdoor_temp,
                    lambda t: units.parse_temperature(t, "--outdoor-temp", system),
                    psychro.check_dry_bulb),
            _option("--outdoor-rh", args.outdoor_rh,
                    lambda t: units.parse_rh(t, "--outdoor-rh"), psychro.check_rh))
    for option, text, value in (("--air-temp", args.air_temp, air_temp),
                                ("--outdoor-temp", args.outdoor_temp,
                                 None if outdoor is None else outdoor.air_temp_c)):
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
    mould_area = 0.0
    if args.mould_area is not None:
        mould_area = _option("--mould-area", args.mould_area, lambda t: _parse_mould_area(t, system))
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
    return QuickInput(
        air_temp_c=air_temp, rh_pct=rh, pressure_pa=pressure, surfaces=tuple(surfaces),
        outdoor=outdoor, use=args.use, volume_m3=volume, occupants=occupants,
        target_rh_pct=target, mould_seen=bool(args.mould_seen or mould_area > 0.0),
        mould_area_m2=mould_area, accuracy=assess.Accuracy(air_acc, rh_acc, surf_acc),
        accuracy_given=AccuracyGiven(air_given, rh_given, surf_given),
        warnings=tuple(warnings))


def compute(args: argparse.Namespace) -> QuickResult:
    """The quick check of the options typed (:func:`survey.quick.judge`)."""
    return judge(gather(args))


def run(args: argparse.Namespace) -> int:
    from survey import words
    from survey.commands import check_layout
    from survey.safe_text import visible

    result = compute(args)
    display = words.Display(args.units)
    for warning in result.warnings:
        print(f"survey: warning: {visible(warning)}", file=sys.stderr)
    if args.json:
        json.dump(check_layout.encode(result, display), sys.stdout, indent=2,
                  ensure_ascii=False)
        sys.stdout.write("\n")
    else:
        check_layout.render(result, display)
    return 0
