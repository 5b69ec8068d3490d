"""``survey check-dehumidifier``: a dehumidifier's performance from readings taken on site.

    survey check-dehumidifier --inlet-temp 24 --inlet-rh 70 --outlet-temp 33 --outlet-rh 30 \\
                              --water 1.2kg --hours 3 --power 250W \\
                              --rated-capacity 20L/day --rated-energy-factor 1.8 \\
                              --rating-condition 18.3c_60 --json

Removal rate, energy factor, grain depression, the airflow and coil cooling they imply, the
COP, and the unit against its rating scaled to the site air (:mod:`survey.equipment`).
Several ``--inlet-temp … --outlet-rh`` sets (each option repeated, in the same order) are a
series of readings over the run; ``--reading-at`` gives each one's hours into the run.

Start-up stays light: the parser imports nothing of the core; the handler loads the
equipment check and its words, never Rich (the text output is plain lines), and pint only
when a value is typed with its unit (:func:`survey.units.read`; bare numbers never touch it).
"""

from __future__ import annotations

import argparse
import json
import sys
from typing import Any

#: The rating conditions of the survey file (``model.RatingCondition``; a test holds them
#: equal), listed here so that building the parser imports nothing of the core.
RATING_KEYS = ("26.7c_60", "18.3c_60", "22.8c_60", "27c_60", "30c_80")

DESCRIPTION = (
    "How a dehumidifier on site performs: removal rate (L/day and US pints/day), energy "
    "factor, grain depression across it, the dry-air flow and coil cooling the water and "
    "the drop imply, its COP, and its rating scaled to the air it is working in. A bare "
    "temperature is read in the unit system chosen (°C for si, °F for ip), or give a unit "
    "(70F, 21 °C). Water takes L, mL, pt, gal, kg, g or lb (a bare number is L in si, US "
    "pints in ip); power W, kW or Btu/h; energy kWh or Wh; hours h, min or days; a rated "
    "capacity L/day or pints/day. Bare numbers never load the unit library, so they start "
    "fastest."
)


def register(subparsers: argparse._SubParsersAction) -> None:
    parser = subparsers.add_parser(
        "check-dehumidifier",
        help="a dehumidifier's removal, energy factor and COP from site readings",
        description=DESCRIPTION,
    )
    air = parser.add_argument_group(
        "air in and out (repeat all four, in order, for a series of readings)"
    )
    for option, what in (
        ("--inlet-temp", "air entering the unit, dry bulb"),
        ("--inlet-rh", "air entering the unit, RH %%"),
        ("--outlet-temp", "air leaving the unit, dry bulb"),
        ("--outlet-rh", "air leaving the unit, RH %%"),
    ):
        air.add_argument(option, action="append", required=True, metavar="V", help=what)
    air.add_argument(
        "--reading-at",
        action="append",
        metavar="H",
        help="hours into the run of each set of readings (all or none)",
    )
    parser.add_argument("--water", metavar="AMOUNT", help="water collected: 1.2kg, 11 L, 2.5pt")
    parser.add_argument("--hours", metavar="H", help="hours the water was collected over")
    used = parser.add_mutually_exclusive_group()
    used.add_argument("--power", metavar="P", help="power drawn while running: 540W, 0.54kW")
    used.add_argument("--energy", metavar="E", help="energy used over --hours: 12.9kWh")
    parser.add_argument(
        "--kind",
        choices=("refrigerant", "desiccant"),
        default="refrigerant",
        help="refrigerant (compressor) or desiccant unit (default refrigerant)",
    )
    rating = parser.add_argument_group("the unit's rating (from its label or data sheet)")
    rating.add_argument("--rated-capacity", metavar="C", help="20L/day or 42pints/day")
    rating.add_argument("--rated-energy-factor", metavar="EF", help="L/kWh, e.g. 1.8")
    rating.add_argument(
        "--rating-condition",
        metavar="KEY",
        help="the test condition of the rating: " + ", ".join(RATING_KEYS),
    )
    where = parser.add_mutually_exclusive_group()
    where.add_argument("--altitude", metavar="Z", help="site altitude (standard atmosphere)")
    where.add_argument("--pressure", metavar="P", help="measured barometric pressure")
    parser.add_argument(
        "--units",
        choices=("si", "ip"),
        default="si",
        help="unit system of bare numbers and of the output (default si)",
    )
    parser.add_argument("--json", action="store_true", help="print one JSON object with SI keys")
    parser.set_defaults(handler=run)


def _one(option: str, text: str, read: Any) -> Any:
    """Read one option; an error names the option and the text as typed."""
    from survey.errors import InputError

    try:
        return read(text)
    except InputError as exc:
        raise InputError(option, text, exc.allowed, read_as=exc.read_as) from None


def gather(args: argparse.Namespace) -> Any:
    """The options typed, read to SI and checked: a ``DehumidifierInput``."""
    from survey import equipment as eq
    from survey import psychro, units
    from survey.commands.check_parse import _option, _pressure, _read_option
    from survey.errors import InputError

    system = args.units
    names = ("--inlet-temp", "--inlet-rh", "--outlet-temp", "--outlet-rh")
    sets = (args.inlet_temp, args.inlet_rh, args.outlet_temp, args.outlet_rh)
    counts = [len(given) for given in sets]
    count = max(set(counts), key=lambda n: (counts.count(n), n == counts[0]))
    for option, given in zip(names, sets, strict=True):
        if len(given) != count:
            raise InputError(
                option,
                given[-1],
                f"given {len(given)} time(s) but the other air readings {count}: give "
                "--inlet-temp, --inlet-rh, --outlet-temp and --outlet-rh once each per set "
                "of readings",
            )
    at: list[float | None] = [None] * count
    if args.reading_at:
        if len(args.reading_at) != count:
            raise InputError(
                "--reading-at",
                args.reading_at[-1],
                f"give one time per set of readings ({count}) or none",
            )
        at = [
            _one("--reading-at", t, lambda t: eq.read_hours(t, "--reading-at", zero=True))
            for t in args.reading_at
        ]

    def rh(option: str, text: str) -> float:
        return _option(option, text, lambda t: units.parse_rh(t, option), psychro.check_rh)

    def temp(option: str, text: str) -> float:
        return _read_option(option, text, "temperature", system, psychro.check_dry_bulb)

    readings = tuple(
        eq.AirPair(
            temp("--inlet-temp", args.inlet_temp[n]),
            rh("--inlet-rh", args.inlet_rh[n]),
            temp("--outlet-temp", args.outlet_temp[n]),
            rh("--outlet-rh", args.outlet_rh[n]),
            at[n],
        )
        for n in range(count)
    )
    if len(readings) > 1 and at[0] is not None:
        for before, after, text in zip(at, at[1:], args.reading_at[1:], strict=False):
            if after is not None and before is not None and after <= before:
                raise InputError(
                    "--reading-at", text, "each time must be later than the one before"
                )
    pressure = _pressure(args, system)
    water, weighed = (None, False)
    if args.water is not None:
        water, weighed = eq.read_water(args.water, "--water", system)
    hours = None if args.hours is None else eq.read_hours(args.hours, "--hours")
    if hours is not None and args.reading_at:
        for time, text in zip(at, args.reading_at, strict=True):
            if time is not None and time > hours:
                raise InputError(
                    "--reading-at", text, f"must be within the run: at most --hours {args.hours}"
                )
    power = None if args.power is None else eq.read_power_w(args.power, "--power")
    energy = None if args.energy is None else eq.read_energy_kwh(args.energy, "--energy")
    capacity = (
        None
        if args.rated_capacity is None
        else eq.read_capacity(args.rated_capacity, "--rated-capacity", system)
    )
    ef = (
        None
        if args.rated_energy_factor is None
        else eq.read_energy_factor(args.rated_energy_factor, "--rated-energy-factor")
    )
    condition = args.rating_condition
    if condition is not None:
        condition = condition.strip().lower()
        eq.rating_point(condition, "--rating-condition")
    return eq.DehumidifierInput(
        readings=readings,
        kind=args.kind,
        water_l=water,
        water_weighed=weighed,
        duration_h=hours,
        power_w=power,
        energy_kwh=energy,
        pressure_pa=pressure,
        rated_capacity_l_per_day=capacity,
        rated_energy_factor_l_per_kwh=ef,
        rating_condition=condition,
    )


def _state(s: Any) -> dict[str, Any]:
    return {
        "dry_bulb_c": s.dry_bulb_c,
        "rh_pct": s.rh_pct,
        "dew_point_c": s.dew_point_c,
        "humidity_ratio_g_per_kg": s.humidity_ratio_g_per_kg,
        "grains_per_pound": s.grains_per_pound,
        "enthalpy_kj_per_kg": s.enthalpy_j_per_kg / 1000.0,
        "specific_volume_m3_per_kg": s.specific_volume_m3_per_kg,
    }


def encode(result: Any, d: Any) -> dict[str, Any]:
    """The result as a JSON-ready dict with SI keys; sentences in ``d``'s units."""
    from survey import thresholds as th
    from survey.equipment import US_PINT_L
    from survey.words import equipment as we

    r = result
    c = r.comparison
    rated: dict[str, Any] | None = None
    if c is not None:
        rated = {
            "rating_condition": None if c.condition is None else c.condition.key,
            "rating_condition_dry_bulb_c": None if c.condition is None else c.condition.dry_bulb_c,
            "rating_condition_rh_pct": None if c.condition is None else c.condition.rh_pct,
            "rating_condition_text": None
            if c.condition is None
            else we.rating_condition_text(c.condition, d),
            "rated_capacity_l_per_day": c.rated_capacity_l_per_day,
            "rated_capacity_pints_per_day": None
            if c.rated_capacity_l_per_day is None
            else c.rated_capacity_l_per_day / US_PINT_L,
            "rated_energy_factor_l_per_kwh": c.rated_energy_factor_l_per_kwh,
            "site_scale": c.site_scale,
            "expected_removal_l_per_day": c.expected_removal_l_per_day,
            "expected_energy_factor_l_per_kwh": c.expected_energy_factor_l_per_kwh,
            "removal_of_rated": c.removal_of_rated,
            "removal_of_expected": c.removal_of_expected,
            "energy_factor_of_rated": c.energy_factor_of_rated,
            "energy_factor_of_expected": c.energy_factor_of_expected,
            "caution": we.rating_caution(r, d),
        }
    return {
        "kind": r.given.kind,
        "removal_l_per_day": r.removal_l_per_day,
        "removal_pints_per_day": r.removal_pints_per_day,
        "energy_factor_l_per_kwh": r.energy_factor_l_per_kwh,
        "humidity_ratio_drop_g_per_kg": r.humidity_ratio_drop_g_per_kg,
        "grain_depression_gr_per_lb": r.grain_depression_gr_per_lb,
        "air_mass_flow_kg_per_s": r.air_mass_flow_kg_per_s,
        "air_volume_flow_m3_per_h": r.air_volume_flow_m3_per_h,
        "cooling_capacity_kw": r.cooling_capacity_kw,
        "latent_cooling_kw": None if r.latent_cooling_w is None else r.latent_cooling_w / 1000.0,
        "sensible_cooling_kw": None
        if r.sensible_cooling_w is None
        else r.sensible_cooling_w / 1000.0,
        "cop": r.cop,
        "water_l": r.given.water_l,
        "water_weighed": r.given.water_weighed,
        "hours": r.given.duration_h,
        "energy_kwh": r.energy_kwh,
        "mean_power_w": r.mean_power_w,
        "pressure_pa": r.given.pressure_pa,
        "inlet": _state(r.inlet),
        "outlet": _state(r.outlet),
        "coil": None if r.coil is None else _state(r.coil),
        "readings": len(r.states),
        "rated": rated,
        "findings": [
            {
                "kind": f.kind.value,
                "text": we.finding_text(f.kind, r, d),
                "limits": list(f.threshold_keys),
            }
            for f in r.findings
        ],
        "limits": [
            {"key": t.key, "value": t.value, "unit": t.unit, "source": t.source, "mark": t.mark}
            for t in th.cited(r.threshold_keys)
        ],
        "cooling_basis": we.COOLING_BASIS,
        "cautions": we.safety_lines(d),
    }


def render(result: Any, d: Any) -> None:
    """Plain lines: the measured figures, the rating, the findings, the caution, the limits."""
    from survey import thresholds as th
    from survey import words
    from survey.words import equipment as we

    r = result
    titles = we.CHECK_SECTIONS
    print(we.check_title(r))
    print(f"  {we.summary(r, d)}")
    sections = (
        ("measured", we.measured_lines(r, d)),
        ("rating", we.comparison_lines(r, d)),
        ("found", we.finding_lines(r, d)),
        ("note", [text] if (text := we.rating_caution(r, d)) else []),
        ("safety", we.safety_lines(d)),
    )
    for key, lines in sections:
        if lines:
            print(f"\n{titles[key]}:")
            for line in lines:
                print(f"- {line}")
    limits = th.cited(r.threshold_keys)
    if limits:
        print(f"\n{titles['limits']}:")
        for t in limits:
            print(f"- {words.client_citation(t, d)}")
        for line in words.legend(limits):
            print(f"  {line}")


def run(args: argparse.Namespace) -> int:
    from survey import equipment as eq
    from survey import words

    result = eq.check(gather(args))
    d = words.Display(args.units)
    if args.json:
        json.dump(encode(result, d), sys.stdout, indent=2, ensure_ascii=False)
        sys.stdout.write("\n")
    else:
        render(result, d)
    return 0
