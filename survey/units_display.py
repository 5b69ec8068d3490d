"""Numbers for display: a core SI value in the SI or IP unit people read (pint, lazily,
once per unit pair), its unit text and its usual decimals. Re-exported by
:mod:`survey.units`, whose reading half this module leaves alone."""

from __future__ import annotations

from functools import cache

from survey.units import UnitSystem, check_system, registry

# Display units per quantity: (SI unit, IP unit) as pint names, and the text shown.
# fmt: off
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
    "area": (("m**2", "m²"), ("ft**2", "ft²")),
    "airflow": (("m**3/h", "m³/h"), ("ft**3/min", "cfm")),
    "water_rate": (("L/day", "L/day"), ("pint/day", "pt/day")),
}
# The SI unit each quantity arrives in from the core.
_CORE_UNIT = {
    "temperature": "degC", "temperature_difference": "kelvin", "humidity_ratio": "kg/kg",
    "pressure": "Pa", "vapour_pressure": "Pa", "absolute_humidity": "g/m**3",
    "enthalpy": "J/kg", "specific_volume": "m**3/kg", "density": "kg/m**3", "length": "m",
    "volume": "m**3", "area": "m**2", "airflow": "m**3/h", "water_rate": "L/day",
}
DECIMALS = {
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
    ("area", "si"): 1, ("area", "ip"): 0,
    ("airflow", "si"): 0, ("airflow", "ip"): 0,
    ("water_rate", "si"): 1, ("water_rate", "ip"): 1,
}
# fmt: on


@cache
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
    check_system(system)
    target = _DISPLAY[quantity][0 if system == "si" else 1][0]
    factor, offset = _factor_offset(_CORE_UNIT[quantity], target)
    return factor * (value_si + _DATUM_SHIFT.get((quantity, system), 0.0)) + offset


def from_display(quantity: str, value: float, system: UnitSystem = "si") -> float:
    """The inverse of :func:`to_display`: a display-unit number back to the core's SI unit."""
    check_system(system)
    source = _DISPLAY[quantity][0 if system == "si" else 1][0]
    factor, offset = _factor_offset(source, _CORE_UNIT[quantity])
    return factor * value + offset - _DATUM_SHIFT.get((quantity, system), 0.0)


def unit_label(quantity: str, system: UnitSystem = "si") -> str:
    """The unit text shown beside ``quantity`` in ``system``, e.g. ``°C`` or ``gr/lb``."""
    return _DISPLAY[quantity][0 if system == "si" else 1][1]


def format_value(
    quantity: str,
    value_si: float | None,
    system: UnitSystem = "si",
    decimals: int | None = None,
    unit: bool = True,
) -> str:
    """Format a core SI value for display, e.g. ``format_value("temperature", 21, "ip")``
    gives ``'69.8 °F'``. ``None`` shows as an en dash."""
    if value_si is None:
        return "–"
    shown = to_display(quantity, value_si, system)
    places = DECIMALS[(quantity, system)] if decimals is None else decimals
    text = f"{shown:.{places}f}"
    if text.startswith("-") and float(text) == 0.0:
        text = text[1:]
    return f"{text} {unit_label(quantity, system)}" if unit else text
