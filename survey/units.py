"""Parsing what a person types, and formatting numbers for display, in SI or IP units.

The core computes in SI floats (°C, %, Pa, m, kg/kg). This module is the edge where text
becomes those floats and floats become text again.

* A bare number (``21``, ``21.5``, ``21,5``, ``.5``) is read in the survey's unit system: °C
  or °F for temperatures, metres or feet for lengths, hPa or inHg for pressure. Bare numbers
  never touch pint, so the quick paths (``survey check --json``) start fast.
* A number with a unit (``21 °C``, ``21C``, ``70F``, ``294.15 K``, ``1013 hPa``,
  ``29.92 inHg``, ``1150 ft``) is converted with the one shared pint registry, created
  lazily on first use.
* Every failure raises :class:`~survey.errors.InputError` naming the field, the text and
  what is accepted.

Relative humidity is a percentage (``65``, ``65 %``, ``65%``), the same in both systems.
A dehumidifier check's amounts (water as a volume or a mass, power, energy, run time, water
rate, energy factor; their unit texts in :mod:`survey.unit_amounts`) are read the same way;
:func:`read_any` takes whichever of several quantities the typed unit belongs to.

Numbers as people type them, and only those
-------------------------------------------
A number is ASCII digits with an optional sign (``-``, ``+`` or ``−``), one decimal point or
decimal comma, and an optional exponent (``1.2e3``, as spreadsheets write it). Refused, each
with a message saying what was read: digits of other scripts or full-width digits (``２１``),
a decimal comma with nothing before it (``,5``: a comma first is a list or a cut-off number
far more often than a decimal; ``.5`` *is* accepted, because it is how numbers below one are
commonly written in IP practice and on instrument data sheets, and a point never separates
items in a list), numbers too small to compute with (``1e-400`` would be read as 0) or too
large (``1e309``), ``nan`` and ``inf``, line breaks and other control characters inside the
text, hexadecimal (``0x15``), underscores (``1_000``) and thousands separators
(``1,013.25``), and texts longer than :data:`TEXT_MAX_CHARS`. Surrounding whitespace is
ignored, and a space, no-break space or thin space may separate the number from its unit.

What a value was read as
------------------------
A unit or the IP system changes the number: ``30 ft3`` is 0.85 m³, ``21 K`` is −252.15 °C.
When such a value then fails a range check written in SI, the message should say what the
text was read as. :func:`read` returns a :class:`Reading` (the text, the SI value and
:attr:`Reading.read_as`); a face checks it with :meth:`Reading.checked` (any
``check(value, field)`` that raises InputError, such as :func:`survey.psychro.check_dry_bulb`)
or raises :meth:`Reading.error` for its own bound::

    reading = units.read("volume", "30 ft3", "--room-volume", "si")
    if not low <= reading.value <= high:
        raise reading.error("room volume must be between 1 and 100000 m³")
    # InputError: --room-volume 30 ft3 (read as 0.85 m³): room volume must be between ...

The ``parse_*`` functions are ``read(...).value`` for one quantity each.
"""

from __future__ import annotations

import math
import re
import sys
import unicodedata
from collections.abc import Callable
from dataclasses import dataclass
from functools import lru_cache
from typing import TYPE_CHECKING, Literal, get_args

from survey import unit_amounts
from survey.errors import InputError
from survey.safe_text import shorten

if TYPE_CHECKING:
    import pint

UnitSystem = Literal["si", "ip"]
UNIT_SYSTEMS: tuple[UnitSystem, ...] = ("si", "ip")

#: The quantities :func:`read` knows. RH and a plain number are never converted.
ReadQuantity = Literal[
    "temperature",
    "temperature_difference",
    "relative_humidity",
    "pressure",
    "length",
    "volume",
    "area",
    "water_volume",
    "water_mass",
    "power",
    "energy",
    "duration",
    "water_rate",
    "energy_factor",
    "number",
]

#: A typed value longer than this is refused unread: no number with its unit comes close.
TEXT_MAX_CHARS = 100

# ASCII digits only ([0-9], not \d, which matches every script's digits and float() reads
# them). A decimal comma needs digits on both sides; a decimal point may lead (".5") or end
# ("21.").
_NUMBER = re.compile(
    r"(?P<num>[+\-\u2212]?(?:[0-9]+(?:\.[0-9]*|,[0-9]+)?|\.[0-9]+)(?:[eE][+\-]?[0-9]+)?)"
    r"(?P<gap>\s*)(?P<unit>.*)",
    re.DOTALL,
)
_LEADING_COMMA = re.compile(r"[+\-\u2212]?,[0-9]")
_RADIX_PREFIX = re.compile(r"[xXbBoO][0-9a-fA-F_]+")
# fmt: off
_NON_NUMBERS = frozenset({"nan", "inf", "infinity", "+nan", "-nan", "+inf", "-inf",
                          "+infinity", "-infinity", "\u2212inf", "\u2212infinity", "∞",
                          "-∞", "+∞", "\u2212∞"})
# fmt: on
#: Control, format, surrogate and line/paragraph-separator characters: never inside a number.
_CONTROL_CATEGORIES = frozenset({"Cc", "Cf", "Cs", "Zl", "Zp"})
_WRITE_LIKE = "write a number as 1013.25 or 1013,25"

# The unit texts accepted for each kind of quantity, as typed (lower-cased, spaces as typed)
# and the pint name each stands for. Only these reach pint: pint's own expression parser
# would accept (or choke on) arbitrary arithmetic. "C" is the coulomb to pint and "F" the
# farad, hence the table. A bare degree sign follows the unit system (see parse_temperature).
# fmt: off
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
_AREA_ALIASES = {"m2": "m**2", "m^2": "m**2", "m²": "m**2", "sq m": "m**2", "sqm": "m**2",
                 "ft2": "ft**2", "ft^2": "ft**2", "ft²": "ft**2", "sq ft": "ft**2",
                 "sqft": "ft**2", "cm2": "cm**2", "cm²": "cm**2"}
# fmt: on
_RH_UNITS = frozenset({"", "%", "percent", "pct", "% rh", "%rh", "rh"})
_DEGREE_SIGNS = ("°", "º", "deg")

_ACCEPTED: dict[ReadQuantity, str] = {
    "temperature": "a number in °C (SI) or °F (IP), or with a unit: 21, 21.5, 21,5, 21 °C, "
    "21C, 70F, 294.15 K",
    "temperature_difference": "a number of kelvin (SI) or °F (IP), or with a unit: 0.5, 0.5 K, 1F",
    "relative_humidity": "a percentage: 65, 65 %, 65%",
    "pressure": "a number in hPa (SI) or inHg (IP), or with a unit: 1013 hPa, 101.3 kPa, "
    "29.92 inHg",
    "length": "a number in m (SI) or ft (IP), or with a unit: 350 m, 1150 ft",
    "volume": "a number in m³ (SI) or ft³ (IP), or with a unit: 30, 30 m3, 1060 ft3",
    "area": "a number in m² (SI) or ft² (IP), or with a unit: 0.6, 0.6 m2, 6 sq ft",
    "number": "a number such as 3, 2.5 or 2,5",
}
_KIND_WORDS: dict[ReadQuantity, str] = {
    "temperature": "temperature",
    "temperature_difference": "temperature difference",
    "relative_humidity": "relative humidity",
    "pressure": "pressure",
    "length": "length",
    "volume": "volume",
    "area": "area",
    "number": "number",
}
# What a value is said to be "read as", in the unit the range limits are written in:
# (unit text, factor from the core's SI unit).
# fmt: off
_READ_AS_UNIT: dict[ReadQuantity, tuple[str, float]] = {
    "temperature": ("°C", 1.0), "temperature_difference": ("K", 1.0),
    "relative_humidity": ("%", 1.0), "pressure": ("hPa", 0.01), "length": ("m", 1.0),
    "volume": ("m³", 1.0), "area": ("m²", 1.0), "number": ("", 1.0),
}
# fmt: on


@lru_cache(maxsize=1)
def registry() -> pint.UnitRegistry[float]:
    """The one pint registry of the program, created on first use (it costs ~0.1 s)."""
    import pint

    ureg: pint.UnitRegistry[float] = pint.UnitRegistry(autoconvert_offset_to_baseunit=True)
    ureg.formatter.default_format = "~P"
    return ureg


# --- reading a number --------------------------------------------------------------------


@dataclass(frozen=True, slots=True)
class Reading:
    """A value as typed and as read.

    ``text`` is what was typed (or the number given), ``value`` the value in the core's SI
    unit for ``quantity`` (°C, K, %, Pa, m, m³), ``typed_number`` the number as written
    before any unit or unit-system conversion."""

    quantity: ReadQuantity
    field: str
    text: object
    value: float
    typed_number: float

    @property
    def read_as(self) -> str:
        """``""`` when the typed number is already the value in the unit the limits are
        written in (°C, K, %, hPa, m, m³); otherwise that value with its unit, as in
        ``"0.85 m³"`` for ``30 ft3`` or ``"−252.15 °C"`` for ``21 K``."""
        unit, factor = _READ_AS_UNIT[self.quantity]
        shown = self.value * factor
        if math.isclose(shown, self.typed_number, rel_tol=1e-9, abs_tol=1e-12):
            return ""
        return f"{_plain_number(shown)} {unit}".rstrip()

    def error(self, allowed: str) -> InputError:
        """An InputError for this text that says what it was read as."""
        return InputError(self.field, self.text, allowed, read_as=self.read_as)

    def checked(self, check: Callable[[float, str], object]) -> float:
        """``value`` after ``check(value, field)``; a failure of the check is reported for
        the typed text with what it was read as (see :meth:`error`)."""
        try:
            check(self.value, self.field)
        except InputError as exc:
            raise self.error(exc.allowed) from None
        return self.value


def _plain_number(value: float) -> str:
    """A number for a "read as" remark: two decimals (three significant figures below one),
    no trailing zeros, a true minus sign."""
    if value == 0.0:
        return "0"
    if abs(value) >= 1e6 or abs(value) < 1e-3:
        text = f"{value:.3g}"
    elif abs(value) >= 1.0:
        text = f"{value:.2f}".rstrip("0").rstrip(".")
    else:
        text = f"{value:.3g}"
    return text.replace("-", "\u2212")


def _refuse(field: str, text: object, kind: ReadQuantity, problem: str) -> InputError:
    return InputError(field, text, f"{problem}; expected {_ACCEPTED[kind]}")


def _odd_number(raw: str, body: str, match: re.Match[str] | None) -> str:
    """Why ``body`` (``raw`` stripped) is not a number as people type it, or ``""``."""
    whole = f"'{shorten(body)}'"
    if len(raw) > TEXT_MAX_CHARS:
        return f"{len(raw)} characters is too long for a number"
    if any(unicodedata.category(char) in _CONTROL_CATEGORIES and char != "\t" for char in body):
        return f"{whole} has a line break or a control character in it; type it on one line"
    if any(unicodedata.category(char) == "Nd" and not "0" <= char <= "9" for char in body):
        return f"{whole} has digits other than 0-9 (full-width or another script's)"
    if body.lower() in _NON_NUMBERS:
        return f"{whole} is not a number to compute with"
    if match is None:
        if _LEADING_COMMA.match(body):
            return f"{whole} starts with a decimal comma; write a digit before it, e.g. 0,5"
        return ""
    number, gap, unit = match["num"], match["gap"], match["unit"].strip()
    not_understood = f"the number was not understood: {whole}"
    if not unit:
        return ""
    if not gap and number.lstrip("+-\u2212") == "0" and _RADIX_PREFIX.fullmatch(unit):
        return f"{not_understood} is not a decimal number (hexadecimal, binary, octal)"
    if "_" in unit and (unit[0] == "_" or unit[0].isdigit()):
        return f"{not_understood} has an underscore in it; {_WRITE_LIKE}"
    if unit[0].isdigit() or unit[0] in ".,_":
        return f"{not_understood} has a thousands separator or a space inside; {_WRITE_LIKE}"
    return ""


def _split(text: object, field: str, kind: ReadQuantity) -> tuple[float, str]:
    """The number (as typed, before any conversion) and the unit text after it."""
    if isinstance(text, (int, float)) and not isinstance(text, bool):
        try:
            value = float(text)
        except OverflowError:  # an int beyond the float range
            raise _refuse(field, text, kind, "too large to compute with") from None
        if not math.isfinite(value):
            raise _refuse(field, text, kind, f"{value} is not a number to compute with")
        return value, ""
    raw = str(text)
    body = raw.strip()
    if not body:
        raise InputError(field, repr(raw), f"expected {_ACCEPTED[kind]}")
    match = _NUMBER.fullmatch(body) if len(raw) <= TEXT_MAX_CHARS else None
    if problem := _odd_number(raw, body, match):
        raise _refuse(field, text, kind, problem)
    if match is None:
        raise InputError(field, text, f"expected {_ACCEPTED[kind]}")
    number = match["num"]
    value = float(number.replace(",", ".").replace("\u2212", "-"))
    if not math.isfinite(value):
        raise _refuse(field, text, kind, f"{number} is too large to compute with")
    mantissa = re.split("[eE]", number)[0]
    if abs(value) < sys.float_info.min and mantissa.strip("+-\u2212.,0"):
        raise _refuse(field, text, kind, f"{number} is too small to compute with (read as 0)")
    return value, match["unit"].strip()


def _convert(
    value: float,
    unit: str,
    target: str,
    field: str,
    text: object,
    kind: ReadQuantity,
    aliases: dict[str, str],
) -> float:
    """Convert ``value`` in ``unit`` (as typed) to ``target`` with pint.

    Only unit texts listed in ``aliases`` are accepted, so nothing a person types is ever
    evaluated as a pint expression."""
    name = aliases.get(" ".join(unit.lower().split()))
    if name is None:
        raise InputError(
            field,
            text,
            f"unit {shorten(unit, 40)!r} is not a "
            f"{_KIND_WORDS[kind]} unit; expected {_ACCEPTED[kind]}",
        )
    try:
        converted = float(registry().Quantity(value, name).to(target).magnitude)
    except Exception:  # pint or arithmetic failure: report, never a traceback
        raise InputError(
            field, text, f"could not convert to {target}; expected {_ACCEPTED[kind]}"
        ) from None
    return converted


def check_system(system: str) -> None:
    """An InputError for a unit system other than si or ip."""
    if system not in UNIT_SYSTEMS:
        raise InputError("unit system", system, "expected si or ip")


def _is_degree_sign(unit: str) -> bool:
    """A bare degree sign ("21°", "21 deg") follows the survey's unit system."""
    return unit in _DEGREE_SIGNS


def _temperature(number: float, unit: str, field: str, text: object, system: str) -> float:
    if not unit or _is_degree_sign(unit):  # "21" or "21°": the survey's system
        return number if system == "si" else (number - 32.0) / 1.8
    return _convert(number, unit, "degC", field, text, "temperature", _TEMPERATURE_ALIASES)


def _temperature_difference(
    number: float, unit: str, field: str, text: object, system: str
) -> float:
    if not unit or _is_degree_sign(unit):
        return number if system == "si" else number / 1.8
    return _convert(
        number, unit, "kelvin", field, text, "temperature_difference", _DIFFERENCE_ALIASES
    )


def _relative_humidity(number: float, unit: str, field: str, text: object, system: str) -> float:
    if unit.lower() not in _RH_UNITS:
        raise InputError(field, text, f"expected {_ACCEPTED['relative_humidity']}")
    if 0.0 < number < 1.0 and not unit:
        # 0.65 is far more often a fraction typed by mistake than a real 0.65 % reading.
        raise InputError(
            field,
            text,
            "looks like a fraction: give RH in percent "
            f"({number:g} as a fraction is {number * 100:g}); "
            "write '0.65 %' if you really mean below 1 %",
        )
    return number


def _pressure(number: float, unit: str, field: str, text: object, system: str) -> float:
    if not unit:
        return number * 100.0 if system == "si" else number * 3386.389
    return _convert(number, unit, "Pa", field, text, "pressure", _PRESSURE_ALIASES)


def _length(number: float, unit: str, field: str, text: object, system: str) -> float:
    if not unit:
        return number if system == "si" else number * 0.3048
    return _convert(number, unit, "m", field, text, "length", _LENGTH_ALIASES)


def _volume(number: float, unit: str, field: str, text: object, system: str) -> float:
    if not unit:
        return number if system == "si" else number * 0.3048**3
    return _convert(number, unit, "m**3", field, text, "volume", _VOLUME_ALIASES)


def _area(number: float, unit: str, field: str, text: object, system: str) -> float:
    if not unit:
        return number if system == "si" else number * 0.3048**2
    return _convert(number, unit, "m**2", field, text, "area", _AREA_ALIASES)


#: The dehumidifier check's amounts (:mod:`survey.unit_amounts`): a number times a unit.
_SCALED: dict[ReadQuantity, unit_amounts.Amount] = {
    q: unit_amounts.AMOUNTS[q] for q in get_args(ReadQuantity) if q in unit_amounts.AMOUNTS
}
_ACCEPTED.update({q: amount.accepted for q, amount in _SCALED.items()})
_KIND_WORDS.update({q: amount.kind_words for q, amount in _SCALED.items()})
_READ_AS_UNIT.update({q: (amount.read_as, 1.0) for q, amount in _SCALED.items()})


def _scaled(quantity: ReadQuantity) -> Callable[[float, str, str, object, str], float]:
    """The reader of a :data:`_SCALED` quantity; a unit may be typed with or without
    spaces (``20 L / day``)."""
    target, si, ip, aliases = _SCALED[quantity][:4]

    def reader(number: float, unit: str, field: str, text: object, system: str) -> float:
        if not unit:
            return number * (si if system == "si" else ip)
        squeezed = "".join(unit.split())
        typed = squeezed if squeezed.lower() in aliases else unit
        return _convert(number, typed, target, field, text, quantity, aliases)

    return reader


def _plain(number: float, unit: str, field: str, text: object, system: str) -> float:
    if unit:
        raise InputError(field, text, f"expected {_ACCEPTED['number']} with no unit")
    return number


_READERS: dict[ReadQuantity, Callable[[float, str, str, object, str], float]] = {
    "temperature": _temperature,
    "temperature_difference": _temperature_difference,
    "relative_humidity": _relative_humidity,
    "pressure": _pressure,
    "length": _length,
    "volume": _volume,
    "area": _area,
    **{quantity: _scaled(quantity) for quantity in _SCALED},
    "number": _plain,
}


def read(quantity: ReadQuantity, text: object, field: str, system: UnitSystem = "si") -> Reading:
    """Read ``text`` as ``quantity`` (a bare number in ``system``'s unit): a :class:`Reading`
    with the value in the core's SI unit (°C, K, %, Pa, m, m³, m²; L, kg, W, kWh, h, L/day
    and L/kWh for a dehumidifier's amounts) and what it was read as.

    Raises InputError naming ``field``, the text and what is accepted; ranges are not
    checked here (see :meth:`Reading.checked`)."""
    check_system(system)
    number, unit = _split(text, field, quantity)
    value = _READERS[quantity](number, unit, field, text, system)
    if not math.isfinite(value):
        raise _refuse(field, text, quantity, "too large to compute with")
    return Reading(quantity, field, text, value, number)


def read_any(
    quantities: tuple[ReadQuantity, ...], text: object, field: str, system: UnitSystem = "si"
) -> Reading:
    """Read ``text`` as the first of ``quantities`` whose units hold the unit typed (a bare
    number: the first); its :attr:`Reading.quantity` says which. ``1.2 kg`` and ``11 L``
    are both water collected, ``540 W`` and ``12.9 kWh`` what a unit used."""
    check_system(system)
    _, unit = _split(text, field, quantities[0])
    if unit:
        typed = {" ".join(unit.lower().split()), "".join(unit.lower().split())}
        for quantity in quantities:
            if quantity in _SCALED and typed & set(_SCALED[quantity].aliases):
                return read(quantity, text, field, system)
        words = " or ".join(_KIND_WORDS[q] for q in quantities)
        accepted = "; or ".join(_ACCEPTED[q] for q in quantities)
        raise InputError(
            field, text, f"unit {shorten(unit, 40)!r} is not a {words} unit; expected {accepted}"
        )
    return read(quantities[0], text, field, system)


def parse_temperature(text: object, field: str = "temperature", system: UnitSystem = "si") -> float:
    """A temperature in °C from ``21``, ``21,5``, ``21 °C``, ``21C``, ``70F``, ``294.15 K``."""
    return read("temperature", text, field, system).value


def parse_temperature_difference(
    text: object, field: str = "temperature difference", system: UnitSystem = "si"
) -> float:
    """A temperature difference (an instrument accuracy, a margin) in kelvin."""
    return read("temperature_difference", text, field, system).value


def parse_rh(text: object, field: str = "relative humidity") -> float:
    """Relative humidity in percent from ``65``, ``65 %`` or ``65%``.

    The range is checked by the psychrometric core, which knows the whole domain.
    """
    return read("relative_humidity", text, field).value


def parse_pressure(text: object, field: str = "pressure", system: UnitSystem = "si") -> float:
    """Pressure in Pa from ``1013 hPa``, ``101.3 kPa``, ``29.92 inHg`` or a bare number."""
    return read("pressure", text, field, system).value


def parse_length(text: object, field: str = "length", system: UnitSystem = "si") -> float:
    """Length in metres from ``350 m``, ``1150 ft`` or a bare number."""
    return read("length", text, field, system).value


def parse_volume(text: object, field: str = "volume", system: UnitSystem = "si") -> float:
    """Volume in m³ from ``30``, ``30 m3``, ``1060 ft3`` or a bare number."""
    return read("volume", text, field, system).value


#: Three dimensions of a room, as an example in each unit system (metres, feet).
DIMENSIONS_EXAMPLE = {"si": "4.2 x 3.1 x 2.4", "ip": "14 x 10 x 8"}


def with_dimensions(exc: InputError, system: UnitSystem = "si") -> InputError:
    """A volume's refusal that says the dimensions are taken too (where they are)."""
    return InputError(
        exc.field,
        exc.value,
        f"{exc.allowed}, or three dimensions: {DIMENSIONS_EXAMPLE[system]}",
        read_as=exc.read_as,
    )


def parse_volume_or_dimensions(
    text: object, field: str = "volume", system: UnitSystem = "si"
) -> float:
    """A volume (``30``, ``30 m3``) or three lengths multiplied out (``4.2 x 3.1 x 2.4``,
    ``×`` too, each with or without its unit), in m³."""
    raw = str(text)
    parts = raw.lower().replace("×", "x").split("x")
    if len(parts) == 1:
        try:
            return parse_volume(raw, field, system)
        except InputError as exc:
            raise with_dimensions(exc, system) from None
    example = DIMENSIONS_EXAMPLE[system]
    if len(parts) != 3 or not all(p.strip() for p in parts):
        volume = "30, 30 m3" if system == "si" else "1060, 1060 ft3"
        raise InputError(field, text, f"a volume ({volume}) or three dimensions: {example}")
    sides = [parse_length(p, field, system) for p in parts]
    if not all(side > 0.0 for side in sides):  # two negative sides would multiply out
        raise InputError(field, text, f"three dimensions, each above 0: {example}")
    return sides[0] * sides[1] * sides[2]


def parse_number(text: object, field: str = "number") -> float:
    """A plain number (``3``, ``2.5``, ``2,5``) with no unit."""
    return read("number", text, field).value


# --- formatting: survey.units_display, re-exported here ---------------------------------

from survey.units_display import format_value as format_value  # noqa: E402
from survey.units_display import from_display as from_display  # noqa: E402
from survey.units_display import to_display as to_display  # noqa: E402
from survey.units_display import unit_label as unit_label  # noqa: E402
