"""Parsing what a person types, and formatting numbers for display, in SI or IP units.

The core computes in SI floats (°C, %, Pa, m, kg/kg). This module is the edge where text
becomes those floats and floats become text again.

* A bare number (``21``, ``21.5``, ``21,5``) is read in the survey's unit system: °C or °F
  for temperatures, metres or feet for lengths, hPa or inHg for pressure. Bare numbers never
  touch pint, so the quick paths (``survey check --json``) start fast.
* A number with a unit (``21 °C``, ``21C``, ``70F``, ``294.15 K``, ``1013 hPa``,
  ``29.92 inHg``, ``1150 ft``) is converted with the one shared pint registry, created
  lazily on first use.
* Every failure raises :class:`~survey.errors.InputError` naming the field, the text and
  what is accepted.

Relative humidity is a percentage (``65``, ``65 %``, ``65%``), the same in both systems.
"""

from __future__ import annotations

import math
import re
from functools import lru_cache
from typing import Literal

from survey.errors import InputError

UnitSystem = Literal["si", "ip"]
UNIT_SYSTEMS: tuple[UnitSystem, ...] = ("si", "ip")

_NUMBER = re.compile(
    r"^\s*(?P<num>[+\-\u2212]?(?:\d+(?:[.,]\d*)?|[.,]\d+)(?:[eE][+\-]?\d+)?)\s*(?P<unit>.*?)\s*$"
)

# The unit texts accepted for each kind of quantity, as typed (lower-cased, spaces as typed)
# and the pint name each stands for. Only these reach pint: pint's own expression parser
# would accept (or choke on) arbitrary arithmetic. "C" is the coulomb to pint and "F" the
# farad, hence the table. A bare degree sign follows the unit system (see parse_temperature).
_TEMPERATURE_ALIASES = {
    "c": "degC", "°c": "degC", "ºc": "degC", "degc": "degC", "deg c": "degC", "° c": "degC",
    "℃": "degC", "celsius": "degC", "degree_celsius": "degC",
    "f": "degF", "°f": "degF", "ºf": "degF", "degf": "degF", "deg f": "degF", "° f": "degF",
    "℉": "degF", "fahrenheit": "degF", "degree_fahrenheit": "degF",
    "k": "kelvin", "kelvin": "kelvin",
}
_DIFFERENCE_ALIASES = {
    "k": "kelvin", "kelvin": "kelvin", "c": "kelvin", "°c": "kelvin", "degc": "kelvin",
    "℃": "kelvin", "f": "delta_degF", "°f": "delta_degF", "degf": "delta_degF",
    "℉": "delta_degF", "r": "delta_degF",
}
_PRESSURE_ALIASES = {"hpa": "hPa", "kpa": "kPa", "pa": "Pa", "mbar": "mbar", "mb": "mbar",
                     "inhg": "inHg", "in hg": "inHg", "psi": "psi", "bar": "bar",
                     "mmhg": "mmHg"}
_LENGTH_ALIASES = {"m": "m", "ft": "ft", "feet": "ft", "foot": "ft", "'": "ft", "km": "km"}
_VOLUME_ALIASES = {"m3": "m**3", "m^3": "m**3", "m³": "m**3", "cu m": "m**3",
                   "ft3": "ft**3", "ft^3": "ft**3", "ft³": "ft**3", "cu ft": "ft**3",
                   "cuft": "ft**3", "l": "L", "litre": "L", "liter": "L", "litres": "L",
                   "liters": "L"}
_DEGREE_SIGNS = ("°", "º", "deg")

_ACCEPTED = {
    "temperature": "a number in °C (SI) or °F (IP), or with a unit: 21, 21.5, 21,5, 21 °C, 21C, 70F, 294.15 K",
    "temperature difference": "a number of kelvin (SI) or °F (IP), or with a unit: 0.5, 0.5 K, 1F",
    "relative humidity": "a percentage: 65, 65 %, 65%",
    "pressure": "a number in hPa (SI) or inHg (IP), or with a unit: 1013 hPa, 101.3 kPa, 29.92 inHg",
    "length": "a number in m (SI) or ft (IP), or with a unit: 350 m, 1150 ft",
    "volume": "a number in m³ (SI) or ft³ (IP), or with a unit: 30, 30 m3, 1060 ft3",
    "number": "a number such as 3, 2.5 or 2,5",
}


@lru_cache(maxsize=1)
def registry():
    """The one pint registry of the program, created on first use (it costs ~0.1 s)."""
    import pint

    ureg = pint.UnitRegistry(autoconvert_offset_to_baseunit=True)
    ureg.formatter.default_format = "~P"
    return ureg


def _split(text: object, field: str, kind: str) -> tuple[float, str]:
    if isinstance(text, (int, float)) and not isinstance(text, bool):
        value, unit = float(text), ""
    else:
        match = _NUMBER.match(str(text))
        if match is None:
            raise InputError(field, repr(str(text)) if str(text).strip() == "" else text,
                             f"expected {_ACCEPTED[kind]}")
        number = match["num"].replace(",", ".").replace("\u2212", "-")
        try:
            value = float(number)
        except ValueError:
            raise InputError(field, text, f"expected {_ACCEPTED[kind]}") from None
        unit = match["unit"]
        if unit and (unit[0].isdigit() or unit[0] in ".,"):
            raise InputError(field, text, "the number was not understood (write 1013.25 or "
                                          f"1013,25, without thousands separators); expected "
                                          f"{_ACCEPTED[kind]}")
    if not math.isfinite(value):
        raise InputError(field, text, f"expected a finite number: {_ACCEPTED[kind]}")
    return value, unit


def _convert(value: float, unit: str, target: str, field: str, text: object, kind: str,
             aliases: dict[str, str]) -> float:
    """Convert ``value`` in ``unit`` (as typed) to ``target`` with pint.

    Only unit texts listed in ``aliases`` are accepted, so nothing a person types is ever
    evaluated as a pint expression."""
    name = aliases.get(" ".join(unit.lower().split()))
    if name is None:
        raise InputError(field, text, f"unit {unit!r} is not a {kind} unit; "
                                      f"expected {_ACCEPTED[kind]}")
    try:
        converted = float(registry().Quantity(value, name).to(target).magnitude)
    except Exception:  # pint or arithmetic failure: report, never a traceback
        raise InputError(field, text, f"could not convert to {target}; "
                                      f"expected {_ACCEPTED[kind]}") from None
    if not math.isfinite(converted):
        raise InputError(field, text, f"expected a finite number: {_ACCEPTED[kind]}")
    return converted


def _check_system(system: str) -> None:
    if system not in UNIT_SYSTEMS:
        raise InputError("unit system", system, "expected si or ip")


def parse_temperature(text: object, field: str = "temperature", system: UnitSystem = "si") -> float:
    """A temperature in °C from ``21``, ``21,5``, ``21 °C``, ``21C``, ``70F``, ``294.15 K``."""
    _check_system(system)
    value, unit = _split(text, field, "temperature")
    if not unit or unit.strip() in _DEGREE_SIGNS:  # "21" or "21°": the survey's system
        return value if system == "si" else (value - 32.0) / 1.8
    return _convert(value, unit, "degC", field, text, "temperature", _TEMPERATURE_ALIASES)


def parse_temperature_difference(text: object, field: str = "temperature difference",
                                 system: UnitSystem = "si") -> float:
    """A temperature difference (an instrument accuracy, a margin) in kelvin."""
    _check_system(system)
    value, unit = _split(text, field, "temperature difference")
    if not unit or unit.strip() in _DEGREE_SIGNS:
        return value if system == "si" else value / 1.8
    return _convert(value, unit, "kelvin", field, text, "temperature difference",
                    _DIFFERENCE_ALIASES)


def parse_rh(text: object, field: str = "relative humidity") -> float:
    """Relative humidity in percent from ``65``, ``65 %`` or ``65%``.

    The range is checked by the psychrometric core, which knows the whole domain.
    """
    value, unit = _split(text, field, "relative humidity")
    if unit.strip().lower() not in ("", "%", "percent", "pct", "% rh", "%rh", "rh"):
        raise InputError(field, text, f"expected {_ACCEPTED['relative humidity']}")
    if 0.0 < value < 1.0 and not unit:
        # 0.65 is far more often a fraction typed by mistake than a real 0.65 % reading.
        raise InputError(field, text, "looks like a fraction: give RH in percent "
                                      f"({value:g} as a fraction is {value * 100:g}); "
                                      "write '0.65 %' if you really mean below 1 %")
    return value


def parse_pressure(text: object, field: str = "pressure", system: UnitSystem = "si") -> float:
    """Pressure in Pa from ``1013 hPa``, ``101.3 kPa``, ``29.92 inHg`` or a bare number."""
    _check_system(system)
    value, unit = _split(text, field, "pressure")
    if not unit:
        return value * 100.0 if system == "si" else value * 3386.389
    return _convert(value, unit, "Pa", field, text, "pressure", _PRESSURE_ALIASES)


def parse_length(text: object, field: str = "length", system: UnitSystem = "si") -> float:
    """Length in metres from ``350 m``, ``1150 ft`` or a bare number."""
    _check_system(system)
    value, unit = _split(text, field, "length")
    if not unit:
        return value if system == "si" else value * 0.3048
    return _convert(value, unit, "m", field, text, "length", _LENGTH_ALIASES)


def parse_volume(text: object, field: str = "volume", system: UnitSystem = "si") -> float:
    """Volume in m³ from ``30``, ``30 m3``, ``1060 ft3`` or a bare number."""
    _check_system(system)
    value, unit = _split(text, field, "volume")
    if not unit:
        return value if system == "si" else value * 0.3048 ** 3
    return _convert(value, unit, "m**3", field, text, "volume", _VOLUME_ALIASES)


def parse_number(text: object, field: str = "number") -> float:
    """A plain number (``3``, ``2.5``, ``2,5``) with no unit."""
    value, unit = _split(text, field, "number")
    if unit:
        raise InputError(field, text, f"expected {_ACCEPTED['number']} with no unit")
    return value


# --- formatting --------------------------------------------------------------------------

# Display units per quantity: (SI unit, IP unit) as pint names, and the text shown.
_DISPLAY = {
    "temperature": (("degC", "°C"), ("degF", "°F")),
    "temperature_difference": (("kelvin", "K"), ("delta_degF", "°F")),
    "humidity_ratio": (("g/kg", "g/kg"), ("grain/lb", "gr/lb")),
    "pressure": (("hPa", "hPa"), ("inHg", "inHg")),
    "vapour_pressure": (("Pa", "Pa"), ("inHg", "inHg")),
    "absolute_humidity": (("g/m**3", "g/m³"), ("grain/ft**3", "gr/ft³")),
    "enthalpy": (("kJ/kg", "kJ/kg"), ("Btu/lb", "Btu/lb")),
    "specific_volume": (("m**3/kg", "m³/kg"), ("ft**3/lb", "ft³/lb")),
    "density": (("kg/m**3", "kg/m³"), ("lb/ft**3", "lb/ft³")),
    "length": (("m", "m"), ("ft", "ft")),
    "volume": (("m**3", "m³"), ("ft**3", "ft³")),
    "airflow": (("m**3/h", "m³/h"), ("ft**3/min", "cfm")),
    "water_rate": (("L/day", "L/day"), ("pint/day", "pt/day")),
}
# The SI unit each quantity arrives in from the core.
_CORE_UNIT = {
    "temperature": "degC", "temperature_difference": "kelvin", "humidity_ratio": "kg/kg",
    "pressure": "Pa", "vapour_pressure": "Pa", "absolute_humidity": "g/m**3",
    "enthalpy": "J/kg", "specific_volume": "m**3/kg", "density": "kg/m**3", "length": "m",
    "volume": "m**3", "airflow": "m**3/h", "water_rate": "L/day",
}
_DECIMALS = {
    ("temperature", "si"): 1, ("temperature", "ip"): 1,
    ("temperature_difference", "si"): 1, ("temperature_difference", "ip"): 1,
    ("humidity_ratio", "si"): 2, ("humidity_ratio", "ip"): 1,
    ("pressure", "si"): 1, ("pressure", "ip"): 2,
    ("vapour_pressure", "si"): 0, ("vapour_pressure", "ip"): 3,
    ("absolute_humidity", "si"): 2, ("absolute_humidity", "ip"): 2,
    ("enthalpy", "si"): 1, ("enthalpy", "ip"): 1,
    ("specific_volume", "si"): 3, ("specific_volume", "ip"): 2,
    ("density", "si"): 3, ("density", "ip"): 4,
    ("length", "si"): 0, ("length", "ip"): 0,
    ("volume", "si"): 1, ("volume", "ip"): 0,
    ("airflow", "si"): 0, ("airflow", "ip"): 0,
    ("water_rate", "si"): 1, ("water_rate", "ip"): 1,
}


@lru_cache(maxsize=None)
def _factor_offset(source: str, target: str) -> tuple[float, float]:
    """``target = factor * source + offset``, worked out once by pint per unit pair."""
    ureg = registry()
    zero = ureg.Quantity(0.0, source).to(target).magnitude
    one = ureg.Quantity(1.0, source).to(target).magnitude
    return float(one - zero), float(zero)


# Datum shifts, in the core's SI unit, added before converting for display. Enthalpy: the
# SI convention (ASHRAE Fundamentals 2017 ch. 1 eqn 30) counts from dry air at 0 °C, the IP
# one (IP eqn 30, h = 0.240 t + W (1061 + 0.444 t)) from dry air at 0 °F, so IP enthalpy is
# higher by cp_da · 17.78 K = 1.006 kJ/(kg·K) · 32/1.8 K.
_DATUM_SHIFT = {("enthalpy", "ip"): 1006.0 * 32.0 / 1.8}


def to_display(quantity: str, value_si: float, system: UnitSystem = "si") -> float:
    """``value_si`` (in the core's SI unit for ``quantity``) in the display unit of ``system``."""
    _check_system(system)
    target = _DISPLAY[quantity][0 if system == "si" else 1][0]
    factor, offset = _factor_offset(_CORE_UNIT[quantity], target)
    return factor * (value_si + _DATUM_SHIFT.get((quantity, system), 0.0)) + offset


def from_display(quantity: str, value: float, system: UnitSystem = "si") -> float:
    """The inverse of :func:`to_display`: a display-unit number back to the core's SI unit."""
    _check_system(system)
    source = _DISPLAY[quantity][0 if system == "si" else 1][0]
    factor, offset = _factor_offset(source, _CORE_UNIT[quantity])
    return factor * value + offset - _DATUM_SHIFT.get((quantity, system), 0.0)


def unit_label(quantity: str, system: UnitSystem = "si") -> str:
    """The unit text shown beside ``quantity`` in ``system``, e.g. ``°C`` or ``gr/lb``."""
    return _DISPLAY[quantity][0 if system == "si" else 1][1]


def format_value(quantity: str, value_si: float | None, system: UnitSystem = "si",
                 decimals: int | None = None, unit: bool = True) -> str:
    """Format a core SI value for display, e.g. ``format_value("temperature", 21, "ip")``
    gives ``'69.8 °F'``. ``None`` shows as an en dash."""
    if value_si is None:
        return "–"
    shown = to_display(quantity, value_si, system)
    places = _DECIMALS[(quantity, system)] if decimals is None else decimals
    text = f"{shown:.{places}f}"
    if text.startswith("-") and float(text) == 0.0:
        text = text[1:]
    return f"{text} {unit_label(quantity, system)}" if unit else text
