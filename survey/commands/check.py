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
import sys

from survey import advise, assess, domain, psychro, units
from survey import thresholds as th
from survey.commands.check_parse import (
    _accuracy_option,
    _option,
    _parse_mould_area,
    _parse_occupants,
    _parse_rh_accuracy,
    _parse_volume,
    _plausibility,
    _read_option,
    _SurfaceOption,
    _surfaces,
)
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


def register(subparsers: argparse._SubParsersAction) -> None:
    parser = subparsers.add_parser(
        "check", help="quick check of one room's air and surfaces", description=DESCRIPTION
    )
    parser.add_argument(
        "--air-temp", required=True, metavar="T", help="room air (dry-bulb) temperature"
    )
    parser.add_argument(
        "--rh",
        required=True,
        metavar="RH",
        help="room relative humidity, %% (relative to water, as hygrometers read)",
    )
    surfaces = parser.add_argument_group(
        "surfaces (each option may be repeated; the order typed is kept)"
    )
    surfaces.add_argument(
        "--surface-temp",
        action=_SurfaceOption,
        dest="surfaces",
        default=[],
        metavar="T",
        help="a wall, ceiling or floor surface temperature (which one not "
        "said: judged as part of the heated envelope)",
    )
    surfaces.add_argument(
        "--glazing-temp",
        action=_SurfaceOption,
        dest="surfaces",
        metavar="T",
        help="a window pane: condensation only",
    )
    surfaces.add_argument(
        "--frame-temp",
        action=_SurfaceOption,
        dest="surfaces",
        metavar="T",
        help="a window frame: condensation, and mould on frames and seals",
    )
    surfaces.add_argument(
        "--pipe-temp",
        action=_SurfaceOption,
        dest="surfaces",
        metavar="T",
        help="a cold pipe: condensation only",
    )
    surfaces.add_argument(
        "--surface",
        action=_SurfaceOption,
        dest="surfaces",
        metavar="ELEMENT:T[:LABEL]",
        help="any surface, e.g. external_wall:11.2:NE corner; ELEMENT is "
        "one of " + ", ".join(th.SURFACE_ELEMENTS),
    )
    parser.add_argument("--outdoor-temp", metavar="T", help="outdoor air temperature")
    parser.add_argument("--outdoor-rh", metavar="RH", help="outdoor relative humidity, %%")
    where = parser.add_mutually_exclusive_group()
    where.add_argument(
        "--altitude", metavar="Z", help="site altitude (standard atmosphere gives the pressure)"
    )
    where.add_argument("--pressure", metavar="P", help="measured barometric pressure")
    room = parser.add_argument_group("room (for the advice)")
    room.add_argument(
        "--use",
        type=str.lower,
        choices=th.ROOM_USES,
        metavar="USE",
        help="room use, which sets the temperature-factor limit: "
        + ", ".join(th.ROOM_USES)
        + " (default: not given, general limit)",
    )
    room.add_argument(
        "--room-volume",
        metavar="V",
        help="room volume (m³ for si, ft³ for ip), to size airflow and drying",
    )
    room.add_argument(
        "--occupants", metavar="N", help="people usually in the room, for the moisture load"
    )
    room.add_argument(
        "--target-rh",
        metavar="RH",
        help=f"room RH to aim for, %% (default "
        f"{th.value('room_rh_target_default_pct'):g}, lowered when the "
        f"coldest wall, ceiling or floor needs it)",
    )
    room.add_argument(
        "--mould-seen",
        action="store_true",
        help="visible mould in the room (for the mould caution)",
    )
    room.add_argument(
        "--mould-area",
        metavar="AREA",
        help="area of visible mould, m² for si, ft² for ip, or with m2 / ft2 "
        "(implies --mould-seen); sets the small / medium / large guidance",
    )
    use = parser.add_argument_group(
        "the room's use (for its moisture load; a bathroom, kitchen "
        "or utility room with none given gets its typical use)"
    )
    use.add_argument("--showers-per-day", metavar="N", help="showers taken a day")
    use.add_argument("--baths-per-day", metavar="N", help="baths taken a day")
    use.add_argument("--cooking-hours", metavar="H", help="hours of cooking a day")
    use.add_argument("--laundry-loads", metavar="N", help="wash loads dried indoors a day")
    water = parser.add_argument_group("water damage and combustion air")
    water.add_argument(
        "--water-category",
        type=int,
        choices=(1, 2, 3),
        metavar="1|2|3",
        help="category of the water that got in: 1 clean, 2 significantly "
        "contaminated, 3 grossly contaminated (sewage, flood)",
    )
    water.add_argument(
        "--water-standing-hours",
        metavar="H",
        help="how long the water has stood (clean water degrades to category "
        "2, and category 2 to 3)",
    )
    water.add_argument(
        "--water-loss-class",
        type=int,
        choices=(1, 2, 3, 4),
        metavar="1-4",
        help="class of water loss, 1 (least evaporation load) to 4 (bound "
        "water in dense materials); sets the drying load",
    )
    water.add_argument(
        "--wet-area-pct",
        metavar="PCT",
        help="share of the room's floor, wall and ceiling area that is wet, "
        "for the class of water loss",
    )
    water.add_argument(
        "--dense-materials-wet",
        action="store_true",
        help="hardwood, plaster, concrete or masonry holds water (class 4)",
    )
    water.add_argument(
        "--drying",
        action="store_true",
        help="drying equipment is running in the room (it is kept closed and dehumidified)",
    )
    water.add_argument(
        "--flued-appliance",
        type=str.lower,
        choices=("yes", "no"),
        metavar="yes|no",
        help="an open-flued boiler, water heater, stove or fire in the room or "
        "the building (not said: the combustion-air caution is shown "
        "wherever the advice closes the space up or extracts air)",
    )
    accuracy = parser.add_argument_group("instrument accuracy (± each)")
    accuracy.add_argument(
        "--air-temp-accuracy",
        metavar="K",
        help="air thermometer, K for si, °F for ip (default "
        f"{th.value('accuracy_air_temp_k'):g} K); also used outdoors",
    )
    accuracy.add_argument(
        "--rh-accuracy",
        metavar="RH",
        help=f"hygrometer, %%RH (default {th.value('accuracy_rh_pct'):g}); also used outdoors",
    )
    accuracy.add_argument(
        "--surface-temp-accuracy",
        metavar="K",
        help="surface thermometer, K for si, °F for ip (default "
        f"{th.value('accuracy_surface_temp_k'):g} K)",
    )
    accuracy.add_argument(
        "--outdoor-thermometer",
        type=str.lower,
        choices=("same", "separate"),
        default="same",
        metavar="same|separate",
        help="whether the room thermometer also read the outdoor air (the "
        "usual case, and the default: the two readings' errors are "
        "correlated in the temperature factor, GUM 5.2)",
    )
    parser.add_argument(
        "--units",
        type=str.lower,
        choices=units.UNIT_SYSTEMS,
        default="si",
        help="unit system for bare numbers and for the table (default si)",
    )
    parser.add_argument(
        "--json", action="store_true", help="print one JSON object with SI keys instead of a table"
    )
    parser.set_defaults(handler=run)


def gather(args: argparse.Namespace) -> QuickInput:
    """The options typed, parsed to SI and range-checked; an error names the option."""
    system = args.units
    warnings: list[str] = []
    air_temp = _read_option(
        "--air-temp", args.air_temp, "temperature", system, psychro.check_dry_bulb
    )
    rh = _option("--rh", args.rh, lambda t: units.parse_rh(t, "--rh"), psychro.check_rh)
    if args.pressure is not None:
        pressure = _read_option(
            "--pressure", args.pressure, "pressure", system, psychro.check_pressure
        )
    elif args.altitude is not None:
        pressure = _option(
            "--altitude",
            args.altitude,
            lambda t: psychro.pressure_from_altitude_m(units.parse_length(t, "--altitude", system)),
        )
    else:
        pressure = psychro.STANDARD_PRESSURE_PA
    surfaces = _surfaces(args.surfaces or [], system)
    outdoor = None
    if (args.outdoor_temp is None) != (args.outdoor_rh is None):
        given = "--outdoor-temp" if args.outdoor_rh is None else "--outdoor-rh"
        missing = "--outdoor-rh" if args.outdoor_rh is None else "--outdoor-temp"
        raise InputError(
            given,
            args.outdoor_temp if args.outdoor_rh is None else args.outdoor_rh,
            f"give {missing} as well: outdoor air needs both temperature and RH",
        )
    if args.outdoor_temp is not None:
        outdoor = assess.OutdoorInput(
            _read_option(
                "--outdoor-temp", args.outdoor_temp, "temperature", system, psychro.check_dry_bulb
            ),
            _option(
                "--outdoor-rh",
                args.outdoor_rh,
                lambda t: units.parse_rh(t, "--outdoor-rh"),
                psychro.check_rh,
            ),
        )
    for option, text, value in (
        ("--air-temp", args.air_temp, air_temp),
        ("--outdoor-temp", args.outdoor_temp, None if outdoor is None else outdoor.air_temp_c),
    ):
        if value is not None and (warning := _plausibility(option, text, value, system)):
            warnings.append(warning)
    volume = None if args.room_volume is None else _parse_volume(args.room_volume, system)
    occupants = (
        None if args.occupants is None else _option("--occupants", args.occupants, _parse_occupants)
    )
    target = None
    if args.target_rh is not None:
        target = _option("--target-rh", args.target_rh, lambda t: units.parse_rh(t, "--target-rh"))
        if not advise.TARGET_RH_MIN_PCT <= target <= advise.TARGET_RH_MAX_PCT:
            raise InputError(
                "--target-rh",
                args.target_rh,
                f"target RH must be between {advise.TARGET_RH_MIN_PCT:g} and "
                f"{advise.TARGET_RH_MAX_PCT:g} %",
            )
    mould_area = 0.0
    if args.mould_area is not None:
        mould_area = _option(
            "--mould-area", args.mould_area, lambda t: _parse_mould_area(t, system)
        )
    air_acc, air_given = _accuracy_option(
        "--air-temp-accuracy",
        args.air_temp_accuracy,
        lambda t: units.parse_temperature_difference(t, "--air-temp-accuracy", system),
        "accuracy_air_temp_k",
        domain.AIR_TEMP_ACCURACY_MIN_K,
        domain.AIR_TEMP_ACCURACY_MAX_K,
        "K",
    )
    rh_acc, rh_given = _accuracy_option(
        "--rh-accuracy",
        args.rh_accuracy,
        _parse_rh_accuracy,
        "accuracy_rh_pct",
        domain.RH_ACCURACY_MIN_PCT,
        domain.RH_ACCURACY_MAX_PCT,
        "%RH",
    )
    surf_acc, surf_given = _accuracy_option(
        "--surface-temp-accuracy",
        args.surface_temp_accuracy,
        lambda t: units.parse_temperature_difference(t, "--surface-temp-accuracy", system),
        "accuracy_surface_temp_k",
        domain.SURFACE_TEMP_ACCURACY_MIN_K,
        domain.SURFACE_TEMP_ACCURACY_MAX_K,
        "K",
    )

    def count(option: str, text: str | None, top: float) -> float | None:
        if text is None:
            return None
        value = _option(option, text, lambda t: units.parse_number(t, option))
        if not 0.0 <= value <= top:
            raise InputError(option, text, f"expected a number from 0 to {top:g}")
        return value

    return QuickInput(
        air_temp_c=air_temp,
        rh_pct=rh,
        pressure_pa=pressure,
        surfaces=tuple(surfaces),
        outdoor=outdoor,
        use=args.use,
        volume_m3=volume,
        occupants=occupants,
        target_rh_pct=target,
        mould_seen=bool(args.mould_seen or mould_area > 0.0),
        mould_area_m2=mould_area,
        accuracy=assess.Accuracy(
            air_acc, rh_acc, surf_acc, shared_thermometer=args.outdoor_thermometer == "same"
        ),
        showers_per_day=count("--showers-per-day", args.showers_per_day, 100.0),
        baths_per_day=count("--baths-per-day", args.baths_per_day, 100.0),
        cooking_hours_per_day=count("--cooking-hours", args.cooking_hours, 24.0),
        laundry_loads_per_day=count("--laundry-loads", args.laundry_loads, 50.0),
        water_category=args.water_category,
        water_standing_h=count("--water-standing-hours", args.water_standing_hours, 100_000.0),
        water_loss_class=args.water_loss_class,
        wet_area_pct=count("--wet-area-pct", args.wet_area_pct, 100.0),
        dense_materials_wet=args.dense_materials_wet,
        drying=args.drying,
        flued_appliance=None if args.flued_appliance is None else args.flued_appliance == "yes",
        accuracy_given=AccuracyGiven(air_given, rh_given, surf_given),
        warnings=tuple(warnings),
    )


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
        json.dump(check_layout.encode(result, display), sys.stdout, indent=2, ensure_ascii=False)
        sys.stdout.write("\n")
    else:
        check_layout.render(result, display)
    return 0
