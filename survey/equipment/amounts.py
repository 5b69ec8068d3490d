"""Amounts as people type them for a dehumidifier check (``1.2kg``, ``250W``, ``20L/day``,
``42 pt/day``) read to SI numbers, without pint: a few fixed unit tables."""

from __future__ import annotations

from survey import thresholds as th
from survey import units
from survey.equipment.performance import (
    CAPACITY_MAX_L_PER_DAY,
    ENERGY_FACTOR_MAX_L_PER_KWH,
    ENERGY_MAX_KWH,
    POUND_KG,
    POWER_MAX_W,
    RUN_HOURS_MAX_H,
    US_GALLON_L,
    US_PINT_L,
    WATER_MAX_L,
)
from survey.errors import InputError

# --- typed amounts -----------------------------------------------------------------------

# Unit texts (lower case, spaces removed) -> factor to the SI unit, per amount.
# fmt: off
_WATER = {"l": 1.0, "litre": 1.0, "litres": 1.0, "liter": 1.0, "liters": 1.0, "ml": 0.001,
          "pt": US_PINT_L, "pint": US_PINT_L, "pints": US_PINT_L, "gal": US_GALLON_L,
          "gallon": US_GALLON_L, "gallons": US_GALLON_L}
_WATER_MASS = {"kg": 1.0, "g": 0.001, "lb": POUND_KG, "lbs": POUND_KG}
_POWER = {"w": 1.0, "kw": 1000.0}
_ENERGY = {"kwh": 1.0, "wh": 0.001}
_HOURS = {"h": 1.0, "hr": 1.0, "hrs": 1.0, "hours": 1.0, "hour": 1.0, "min": 1.0 / 60.0}
_CAPACITY = {f"{v}/{d}": f for v, f in (("l", 1.0), ("pt", US_PINT_L), ("pint", US_PINT_L),
             ("pints", US_PINT_L)) for d in ("day", "d", "24h")}
_ENERGY_FACTOR = {"l/kwh": 1.0}
# fmt: on


def _split_unit(text: object, table: dict[str, float]) -> tuple[str, str | None]:
    """The number's text and the unit of ``table`` that ends ``text`` (None: no unit)."""
    raw = str(text).strip()
    squeezed = raw.lower().replace(" ", "")
    for unit in sorted(table, key=len, reverse=True):
        if squeezed.endswith(unit) and len(squeezed) > len(unit):
            head = squeezed[: -len(unit)]
            if head[-1:].isdigit() or head[-1:] == ".":
                return head, unit
    return raw, None


def _amount(
    text: object,
    field: str,
    table: dict[str, float],
    bare: float,
    top: float,
    allowed: str,
    zero: bool = False,
) -> tuple[float, str | None]:
    number, unit = _split_unit(text, table)
    try:
        value = units.parse_number(number, field) * (bare if unit is None else table[unit])
    except InputError:
        raise InputError(field, text, allowed) from None
    low_ok = value >= 0.0 if zero else value > 0.0
    if not low_ok or value > top:
        raise InputError(field, text, allowed)
    return value, unit


def read_water(text: object, field: str, system: units.UnitSystem = "si") -> tuple[float, bool]:
    """Water collected, litres, and whether it was weighed: ``11 L``, ``1.2kg``, ``2.5 pt``,
    ``0.5 gal``, ``2.6 lb``; a bare number is litres (SI) or US pints (IP)."""
    table = {**_WATER, **_WATER_MASS}
    bare = 1.0 if system == "si" else US_PINT_L
    allowed = (
        f"water from 0 to {WATER_MAX_L:g} L, as a volume (L, mL, pt, gal) or a mass "
        f"(kg, g, lb, taken at 1 kg/L); a bare number is {'L' if system == 'si' else 'US pints'}"
    )
    value, unit = _amount(text, field, table, bare, WATER_MAX_L, allowed, zero=True)
    if unit in _WATER_MASS:
        return value / th.value("water_density_kg_per_l"), True
    return value, False


def read_power_w(text: object, field: str) -> float:
    """Power draw, W: ``540``, ``540W``, ``0.54 kW``."""
    allowed = f"power above 0 and up to {POWER_MAX_W:g} W: 540, 540W or 0.54kW"
    return _amount(text, field, _POWER, 1.0, POWER_MAX_W, allowed)[0]


def read_energy_kwh(text: object, field: str) -> float:
    """Energy used, kWh: ``12.9``, ``12.9 kWh``, ``750 Wh``."""
    allowed = f"energy above 0 and up to {ENERGY_MAX_KWH:g} kWh: 12.9, 12.9kWh or 750Wh"
    return _amount(text, field, _ENERGY, 1.0, ENERGY_MAX_KWH, allowed)[0]


def read_hours(text: object, field: str, zero: bool = False) -> float:
    """A run time, hours: ``3``, ``3 h``, ``180 min`` (``zero``: 0 allowed, for the time of
    a reading into the run)."""
    low = "from 0" if zero else "above 0"
    allowed = f"hours {low} and up to {RUN_HOURS_MAX_H:g}: 3, 3h or 180min"
    return _amount(text, field, _HOURS, 1.0, RUN_HOURS_MAX_H, allowed, zero)[0]


def read_capacity(text: object, field: str, system: units.UnitSystem = "si") -> float:
    """A rated capacity, L/day: ``20L/day``, ``42 pints/day``, ``42pt/day``; a bare number is
    L/day (SI) or US pints/day (IP)."""
    bare = 1.0 if system == "si" else US_PINT_L
    allowed = (
        f"a capacity above 0 and up to {CAPACITY_MAX_L_PER_DAY:g} L/day: 20L/day or "
        f"42pints/day; a bare number is {'L/day' if system == 'si' else 'US pints/day'}"
    )
    return _amount(text, field, _CAPACITY, bare, CAPACITY_MAX_L_PER_DAY, allowed)[0]


def read_energy_factor(text: object, field: str) -> float:
    """A rated energy factor, L/kWh: ``1.8`` or ``1.8 L/kWh``."""
    allowed = f"an energy factor above 0 and up to {ENERGY_FACTOR_MAX_L_PER_KWH:g} L/kWh: 1.8"
    return _amount(text, field, _ENERGY_FACTOR, 1.0, ENERGY_FACTOR_MAX_L_PER_KWH, allowed)[0]
