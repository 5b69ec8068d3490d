"""The unit texts of a dehumidifier check's amounts, for :func:`survey.units.read`: water
collected (a volume or a mass), power, energy, run time, a water rate and an energy factor.

Each is a number times a unit: the core's unit (a pint name), a bare number's factor to it
in SI and in IP (exact definitions: 1 US pint = 0.473176473 L, 1 lb = 0.45359237 kg; NIST),
the unit texts accepted (lower case, as typed) with the pint name each stands for, and the
words of an error message. Only these texts reach pint, as with every quantity
:mod:`survey.units` reads. Plain data: this module imports nothing.
"""

from __future__ import annotations

from typing import NamedTuple


class Amount(NamedTuple):
    target: str  #: the core's unit, a pint name
    bare_si: float  #: a bare number's factor to ``target`` in SI
    bare_ip: float  #: and in IP
    aliases: dict[str, str]  #: unit text as typed (lower case) -> pint name
    accepted: str  #: what is accepted, for an error message
    kind_words: str  #: the quantity in words ("not a power unit")
    read_as: str  #: the unit a converted value is said to be read as


_US_PINT_L = 0.473176473
_POUND_KG = 0.45359237

# fmt: off
AMOUNTS: dict[str, Amount] = {
    "water_volume": Amount(
        "L", 1.0, _US_PINT_L,
        {"l": "L", "litre": "L", "litres": "L", "liter": "L", "liters": "L", "ml": "mL",
         "pt": "pint", "pint": "pint", "pints": "pint", "gal": "gallon", "gallon": "gallon",
         "gallons": "gallon"},
        "a number in L (SI) or US pints (IP), or with a unit: 11 L, 1200 mL, 2.5 pt, 0.5 gal",
        "volume of water", "L"),
    "water_mass": Amount(
        "kg", 1.0, _POUND_KG,
        {"kg": "kg", "g": "g", "lb": "lb", "lbs": "lb", "pound": "lb", "pounds": "lb"},
        "a number in kg (SI) or lb (IP), or with a unit: 1.2 kg, 2.6 lb",
        "mass of water", "kg"),
    "power": Amount(
        "W", 1.0, 1.0,
        {"w": "W", "watt": "W", "watts": "W", "kw": "kW", "btu/h": "Btu/hour",
         "btu/hr": "Btu/hour"},
        "a number of watts, or with a unit: 540, 540 W, 0.54 kW, 1840 Btu/h",
        "power", "W"),
    "energy": Amount(
        "kWh", 1.0, 1.0, {"kwh": "kWh", "wh": "Wh"},
        "a number of kWh, or with a unit: 12.9, 12.9 kWh, 750 Wh",
        "energy", "kWh"),
    "duration": Amount(
        "hour", 1.0, 1.0,
        {"h": "hour", "hr": "hour", "hrs": "hour", "hour": "hour", "hours": "hour",
         "min": "minute", "mins": "minute", "minute": "minute", "minutes": "minute",
         "d": "day", "day": "day", "days": "day"},
        "a number of hours, or with a unit: 3, 3 h, 180 min, 2 days",
        "time", "h"),
    "water_rate": Amount(
        "L/day", 1.0, _US_PINT_L,
        {f"{volume}/{per}": f"{name}/day"
         for volume, name in (("l", "L"), ("pt", "pint"), ("pint", "pint"), ("pints", "pint"))
         for per in ("day", "d", "24h")},
        "a number in L/day (SI) or US pints/day (IP), or with a unit: 20 L/day, 42 pints/day",
        "water rate", "L/day"),
    "energy_factor": Amount(
        "L/kWh", 1.0, 1.0, {"l/kwh": "L/kWh"},
        "a number of L/kWh, or with its unit: 1.8, 1.8 L/kWh",
        "energy factor", "L/kWh"),
}
# fmt: on
