"""The display units a sentence is written in: SI or IP, chosen once, never guessed.

``Display("si")`` formats without touching pint (the fast ``survey check --json`` path);
``Display("ip")`` converts through :func:`survey.units.format_value`.
"""

from __future__ import annotations

import math
from dataclasses import dataclass

from survey import thresholds as th
from survey.advise.common import rh_limit_shown

#: SI text per quantity: (decimals, factor from the core's SI unit, unit shown). The same
#: as :func:`survey.units.format_value` in SI (a test holds them equal).
SI_TEXT = {
    "temperature": (1, 1.0, "°C"),
    "temperature_difference": (1, 1.0, "K"),
    "humidity_ratio": (2, 1000.0, "g/kg"),
    "pressure": (1, 0.01, "hPa"),
    "vapour_pressure": (0, 1.0, "Pa"),
    "absolute_humidity": (2, 1.0, "g/m³"),
    "enthalpy": (1, 0.001, "kJ/kg"),
    "specific_volume": (3, 1.0, "m³/kg"),
    "density": (3, 1.0, "kg/m³"),
    "length": (0, 1.0, "m"),
    "airflow": (0, 1.0, "m³/h"),
    "water_rate": (1, 1.0, "L/day"),
    "volume": (1, 1.0, "m³"),
    "area": (2, 1.0, "m²"),
}

_G_PER_LB = 453.59237  # 1 lb = 0.45359237 kg exactly
_BTU_H_PER_W = 3.412142  # 1 W = 3.412142 Btu/h (International Table Btu)
_FT2_PER_M2 = 1.0 / 0.3048**2  # 1 ft = 0.3048 m exactly


def _si(quantity: str, value_si: float, decimals: int | None = None, unit: bool = True) -> str:
    places, factor, label = SI_TEXT[quantity]
    if decimals is not None:
        places = decimals
    text = f"{value_si * factor:.{places}f}"
    if text.startswith("-") and float(text) == 0.0:
        text = text[1:]
    return f"{text} {label}" if unit else text


@dataclass(frozen=True, slots=True)
class Display:
    """How numbers are written: ``system`` is ``"si"`` or ``"ip"``."""

    system: str = "si"

    def __post_init__(self) -> None:
        if self.system not in ("si", "ip"):
            raise ValueError(f"unit system {self.system!r}: expected 'si' or 'ip'")

    @property
    def ip(self) -> bool:
        return self.system == "ip"

    def __call__(
        self, quantity: str, value_si: float | None, decimals: int | None = None, unit: bool = True
    ) -> str:
        """``value_si`` (in the core's SI unit) as text in this system: ``'11.0 °C'``."""
        if value_si is None:
            return "–"
        if quantity == "area":
            return self.area(value_si)
        if not self.ip:
            return _si(quantity, value_si, decimals, unit)
        from survey import units

        return units.format_value(quantity, value_si, "ip", decimals, unit)

    def temperature(self, value_c: float | None, decimals: int | None = None) -> str:
        if value_c is None:
            return "–"
        return self("temperature", value_c, decimals)

    def difference(self, value_k: float | None, decimals: int | None = None) -> str:
        if value_k is None:
            return "–"
        return self("temperature_difference", value_k, decimals)

    def area(self, value_m2: float | None) -> str:
        """An area: '0.5 m²' or '5.4 sq ft' (US practice reads mould areas in ft²)."""
        if value_m2 is None:
            return "–"
        value, unit = (value_m2 * _FT2_PER_M2, "sq ft") if self.ip else (value_m2, "m²")
        return f"{_plain(value)} {unit}"

    def moisture_rate(self, g_per_h: float | None) -> str:
        """A moisture rate: '65 g/h' in SI; '1003 gr/h (0.14 lb/h)' in IP."""
        if g_per_h is None:
            return "–"
        if self.ip:
            return f"{g_per_h * 7000.0 / _G_PER_LB:.0f} gr/h ({g_per_h / _G_PER_LB:.2f} lb/h)"
        return f"{g_per_h:.0f} g/h"

    def heat(self, watts: float | None) -> str:
        """A heating rate: '64 W' in SI, '218 Btu/h' in IP."""
        if watts is None:
            return "–"
        return f"{watts * _BTU_H_PER_W:.0f} Btu/h" if self.ip else f"{watts:.0f} W"

    def water(self, litres_per_day: float | None) -> str:
        """A water rate with the other unit beside it: '2.1 L/day (4.4 US pints/day)' or
        '4.4 pt/day (2.1 L/day)'."""
        if litres_per_day is None:
            return "–"
        text = self("water_rate", litres_per_day)
        if not self.ip:
            return f"{text} ({litres_per_day / th.value('us_pint_l'):.1f} US pints/day)"
        return f"{text} ({_si('water_rate', litres_per_day)})"

    def water_at_least(self, litres_per_day: float | None) -> str:
        """A least water rate, rounded up, with the other unit beside it."""
        if litres_per_day is None:
            return "–"
        text = self.at_least("water_rate", litres_per_day)
        if not self.ip:
            pints = litres_per_day / th.value("us_pint_l")
            return f"{text} ({math.ceil(pints * 10 - 1e-9) / 10:.1f} US pints/day)"
        return f"{text} ({math.ceil(litres_per_day * 10 - 1e-9) / 10:.1f} L/day)"

    def litres(self, litres: float | None) -> str:
        """A one-off amount of water: '0.52 L (1.10 US pints)'."""
        if litres is None:
            return "–"
        return f"{litres:.2f} L ({litres / th.value('us_pint_l'):.2f} US pints)"

    def nominal_temperature(self, temp_c: float | None) -> str:
        """A temperature defined in whole degrees Fahrenheit (a test condition): whole °F in
        IP text, so 80 °F reads as 80 °F and not as a conversion back from 26.7 °C."""
        if temp_c is None:
            return "–"
        return self.temperature(temp_c, 0) if self.ip else self.temperature(temp_c)

    def at_least(self, quantity: str, value_si: float) -> str:
        """A minimum (an airflow, a dehumidifier capacity) rounded UP at the shown
        precision, so the figure shown is never below the one worked out."""
        import math

        if self.ip:
            from survey import units, units_display

            shown = units.to_display(quantity, value_si, "ip")
            places = units_display.DECIMALS[(quantity, "ip")]
            up = math.ceil(shown * 10**places - 1e-9) / 10**places
            return self(quantity, units.from_display(quantity, up, "ip") + 1e-12)
        places, factor, _ = SI_TEXT[quantity]
        up = math.ceil(value_si * factor * 10**places - 1e-9) / 10**places
        return self(quantity, up / factor + 1e-12)

    def minimum_temperature(self, value_c: float | None) -> str:
        """A minimum temperature, rounded up to the shown 0.1 degree so a shown minimum is
        never below the true one."""
        if value_c is None:
            return "–"
        return self.temperature(round_up_temperature_c(value_c, self.ip))


def _plain(value: float) -> str:
    """Two significant figures below 10, three below 100, whole numbers above, never an
    exponent."""
    if value < 10.0:
        text = f"{value:.2g}"
        return text if "e" not in text else f"{value:.2f}"
    if value < 100.0:
        return f"{value:.3g}"
    return f"{value:,.0f}"


def round_up_temperature_c(value_c: float, ip: bool = False) -> float:
    """A minimum temperature rounded UP to the shown 0.1 degree (°C, or °F when ``ip``),
    returned in °C, so a shown minimum is never below the true one: 14.25 → 14.3 °C."""
    import math

    if ip:
        shown_f = math.ceil((value_c * 9.0 / 5.0 + 32.0) * 10.0 - 1e-6) / 10.0
        return (shown_f - 32.0) * 5.0 / 9.0
    return math.ceil(value_c * 10.0 - 1e-6) / 10.0


#: A highest-safe RH as shown: whole percent, rounded down (the safe side) — the advice's own
#: rounding, so the words and the target the advice holds agree.
round_down_rh = rh_limit_shown


SI = Display("si")
IP = Display("ip")
