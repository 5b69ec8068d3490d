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
from survey.commands.check_parse import (
    _accuracy_option,
    _design_excess,
    _design_month,
    _option,
    _parse_mould_area,
    _parse_rh_accuracy,
    _plausibility,
    _pressure,
    _read_option,
    _surfaces,
)
from survey.errors import InputError
from survey.quick import (
    AccuracyGiven,
    QuickInput,
    QuickResult,
    judge,
    read_occupants,
    read_room_volume,
)


def register(subparsers: argparse._SubParsersAction) -> None:
    from survey.commands.check_options import DESCRIPTION, add_arguments

    parser = subparsers.add_parser(
        "check", help="quick check of one room's air and surfaces", description=DESCRIPTION
    )
    add_arguments(parser)
    parser.set_defaults(handler=run)


def gather(args: argparse.Namespace) -> QuickInput:
    """The options typed, parsed to SI and range-checked; an error names the option."""
    system = args.units
    warnings: list[str] = []
    air_temp = _read_option(
        "--air-temp", args.air_temp, "temperature", system, psychro.check_dry_bulb
    )
    rh = _option("--rh", args.rh, lambda t: units.parse_rh(t, "--rh"), psychro.check_rh)
    pressure = _pressure(args, system)
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
    volume = (
        None
        if args.room_volume is None
        else read_room_volume(args.room_volume, "--room-volume", system)
    )
    occupants = None if args.occupants is None else read_occupants(args.occupants, "--occupants")
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
        design_month=_design_month(args, system),
        design_excess=_design_excess(args.design_excess),
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
