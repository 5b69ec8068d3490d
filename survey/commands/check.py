"""``survey check``: the quick on-site check of one room's air and its surfaces.

    survey check --air-temp 21 --rh 65 --surface-temp 12.5 --surface-temp 16 \\
                 --outdoor-temp 4 --outdoor-rh 85 --altitude 350 --units si --json

The JSON path imports neither Rich nor pint unless a value carries a unit suffix, so it
starts fast (benchmarked in ``benchmarks/bench_psychro.py``).
"""

from __future__ import annotations

import argparse
import json
import sys
from typing import Any, Callable

from survey import psychro, units
from survey.errors import InputError

DESCRIPTION = (
    "Dew point, humidity ratio and surface condensation for one room. A bare number is read "
    "in the chosen unit system (°C/hPa/m for si, °F/inHg/ft for ip); a unit may be typed with "
    "any value: 70F, 21 °C, 1002hPa, 1150 ft."
)


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
    outdoor = None
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

    room = psychro.state_from_rh(air_temp, rh, pressure)
    condensation_point = room.condensation_point_c
    result = _state_dict(room)
    result["surfaces"] = [
        {
            "surface_temp_c": ts,
            "surface_rh_pct": (surface_rh := psychro.surface_rh_pct(room, ts)),
            "dew_point_margin_k": ts - condensation_point,
            "condensing": surface_rh >= 100.0,
        }
        for ts in surface_temps
    ]
    result["outdoor"] = None if outdoor is None else _state_dict(outdoor)
    return result


def run(args: argparse.Namespace) -> int:
    result = compute(args)
    if args.json:
        json.dump(result, sys.stdout, indent=2)
        sys.stdout.write("\n")
    else:
        render(result, args.units)
    return 0


def render(result: dict[str, Any], system: units.UnitSystem) -> None:
    """Print the result as Rich tables in the chosen unit system."""
    from rich.console import Console
    from rich.table import Table

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
        ("Grains per pound", lambda s: f"{s['grains_per_pound']:.1f} gr/lb"),
        ("Vapour pressure", lambda s: fmt("vapour_pressure", s["vapour_pressure_pa"], system)),
        ("Wet bulb", lambda s: fmt("temperature", s["wet_bulb_c"], system)),
        ("Absolute humidity", lambda s: fmt("absolute_humidity",
                                            s["absolute_humidity_g_per_m3"], system)),
        ("Enthalpy (0 °C datum)", lambda s: fmt("enthalpy", s["enthalpy_kj_per_kg"] * 1000,
                                                system)),
        ("Specific volume", lambda s: fmt("specific_volume", s["specific_volume_m3_per_kg"],
                                          system)),
        ("Density", lambda s: fmt("density", s["density_kg_per_m3"], system)),
    ]
    for label, show in rows:
        table.add_row(label, *(show(state) for state in states.values()))
    console = Console()
    console.print(table)
    if result["surfaces"]:
        surfaces = Table(title="Surfaces", title_justify="left")
        surfaces.add_column("#", justify="right")
        surfaces.add_column("Surface temp.", justify="right")
        surfaces.add_column("Surface RH", justify="right")
        surfaces.add_column("Margin to dew/frost point", justify="right")
        surfaces.add_column("Condensing")
        for number, surface in enumerate(result["surfaces"], start=1):
            surfaces.add_row(
                str(number),
                fmt("temperature", surface["surface_temp_c"], system),
                f"{surface['surface_rh_pct']:.0f} %",
                fmt("temperature_difference", surface["dew_point_margin_k"], system),
                "YES - water or frost forms" if surface["condensing"] else "no",
            )
        console.print(surfaces)
