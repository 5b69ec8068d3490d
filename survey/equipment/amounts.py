"""Amounts as people type them for a dehumidifier check (``1.2kg``, ``250W``, ``20L/day``,
``42 pt/day``) read to SI numbers by :func:`survey.units.read` (pint converts a typed unit;
a bare number is read in the survey's unit system and never touches pint), and checked
against the survey file's bounds."""

from __future__ import annotations

from survey import thresholds as th
from survey import units
from survey.equipment.performance import (
    CAPACITY_MAX_L_PER_DAY,
    ENERGY_FACTOR_MAX_L_PER_KWH,
    ENERGY_MAX_KWH,
    POWER_MAX_W,
    RUN_HOURS_MAX_H,
    WATER_MAX_L,
)
from survey.errors import InputError


def _amount(
    quantities: tuple[units.ReadQuantity, ...],
    text: object,
    field: str,
    system: units.UnitSystem,
    top: float,
    allowed: str,
    zero: bool = False,
) -> units.Reading:
    """``text`` read as one of ``quantities`` and within (0, top] (``zero``: [0, top]);
    every failure says what is allowed, and what a converted value was read as."""
    try:
        reading = units.read_any(quantities, text, field, system)
    except InputError:
        raise InputError(field, text, allowed) from None
    value = reading.value
    if reading.quantity == "water_mass":
        value /= th.value("water_density_kg_per_l")
    if not (value >= 0.0 if zero else value > 0.0) or value > top:
        raise reading.error(allowed)
    return reading


def read_water(text: object, field: str, system: units.UnitSystem = "si") -> tuple[float, bool]:
    """Water collected, litres, and whether it was weighed: ``11 L``, ``1.2kg``, ``2.5 pt``,
    ``0.5 gal``, ``2.6 lb``; a bare number is litres (SI) or US pints (IP)."""
    allowed = (
        f"water from 0 to {WATER_MAX_L:g} L, as a volume (L, mL, pt, gal) or a mass "
        f"(kg, g, lb, taken at 1 kg/L); a bare number is {'L' if system == 'si' else 'US pints'}"
    )
    reading = _amount(
        ("water_volume", "water_mass"), text, field, system, WATER_MAX_L, allowed, zero=True
    )
    if reading.quantity == "water_mass":
        return reading.value / th.value("water_density_kg_per_l"), True
    return reading.value, False


def read_power_w(text: object, field: str) -> float:
    """Power draw, W: ``540``, ``540W``, ``0.54 kW``."""
    allowed = f"power above 0 and up to {POWER_MAX_W:g} W: 540, 540W or 0.54kW"
    return _amount(("power",), text, field, "si", POWER_MAX_W, allowed).value


def read_energy_kwh(text: object, field: str) -> float:
    """Energy used, kWh: ``12.9``, ``12.9 kWh``, ``750 Wh``."""
    allowed = f"energy above 0 and up to {ENERGY_MAX_KWH:g} kWh: 12.9, 12.9kWh or 750Wh"
    return _amount(("energy",), text, field, "si", ENERGY_MAX_KWH, allowed).value


def read_power_or_energy(text: object, field: str) -> tuple[float | None, float | None]:
    """What a unit used: a power (``540W``, ``0.54 kW``, a bare number of watts) or an
    energy (``12.9kWh``, ``750 Wh``), as ``(power_w, None)`` or ``(None, energy_kwh)``."""
    allowed = (
        f"a power above 0 and up to {POWER_MAX_W:g} W (540W, 0.54kW; a bare number is W) or "
        f"an energy above 0 and up to {ENERGY_MAX_KWH:g} kWh (12.9kWh, 750Wh)"
    )
    try:
        reading = units.read_any(("power", "energy"), text, field)
    except InputError:
        raise InputError(field, text, allowed) from None
    if reading.quantity == "energy":
        return None, _amount(("energy",), text, field, "si", ENERGY_MAX_KWH, allowed).value
    return _amount(("power",), text, field, "si", POWER_MAX_W, allowed).value, None


def read_hours(text: object, field: str, zero: bool = False) -> float:
    """A run time, hours: ``3``, ``3 h``, ``180 min`` (``zero``: 0 allowed, for the time of
    a reading into the run)."""
    low = "from 0" if zero else "above 0"
    allowed = f"hours {low} and up to {RUN_HOURS_MAX_H:g}: 3, 3h or 180min"
    return _amount(("duration",), text, field, "si", RUN_HOURS_MAX_H, allowed, zero).value


def read_capacity(text: object, field: str, system: units.UnitSystem = "si") -> float:
    """A rated capacity, L/day: ``20L/day``, ``42 pints/day``, ``42pt/day``; a bare number is
    L/day (SI) or US pints/day (IP)."""
    allowed = (
        f"a capacity above 0 and up to {CAPACITY_MAX_L_PER_DAY:g} L/day: 20L/day or "
        f"42pints/day; a bare number is {'L/day' if system == 'si' else 'US pints/day'}"
    )
    return _amount(("water_rate",), text, field, system, CAPACITY_MAX_L_PER_DAY, allowed).value


def read_energy_factor(text: object, field: str) -> float:
    """A rated energy factor, L/kWh: ``1.8`` or ``1.8 L/kWh``."""
    allowed = f"an energy factor above 0 and up to {ENERGY_FACTOR_MAX_L_PER_KWH:g} L/kWh: 1.8"
    return _amount(
        ("energy_factor",), text, field, "si", ENERGY_FACTOR_MAX_L_PER_KWH, allowed
    ).value
