"""Parsing ``survey check``'s option texts into SI values, each error naming the option."""

from __future__ import annotations

import argparse
import math
from collections.abc import Callable
from typing import TYPE_CHECKING

from survey import assess, domain, psychro, units
from survey import thresholds as th
from survey.errors import InputError

if TYPE_CHECKING:
    from survey import season

#: A bare SI air temperature above this is more likely °F typed without --units ip: a
#: warning (not an error) says how it was read. A plausibility cue of this face only.
PLAUSIBLE_SI_AIR_TEMP_MAX_C = 40.0

#: The surface options: option -> (element, label of an unnamed surface).
_SURFACE_OPTIONS = {
    "--surface-temp": ("other", "Surface"),
    "--glazing-temp": ("glazing", "Glazing"),
    "--frame-temp": ("window_frame", "Window frame"),
    "--pipe-temp": ("pipe", "Pipe"),
    "--surface": (None, None),
}


class _SurfaceOption(argparse.Action):
    """Collects every surface option, in the order typed, as (option, text)."""

    def __call__(self, parser, namespace, values, option_string=None):
        found = list(getattr(namespace, self.dest, None) or [])
        found.append((option_string, values))
        setattr(namespace, self.dest, found)


def _option(
    option: str,
    text: str,
    parse: Callable[[str], float],
    check: Callable[[float, str], None] | None = None,
) -> float:
    """Parse and range-check one option; any error names the option and the text as typed."""
    try:
        value = parse(text)
        if check is not None:
            check(value, option)
    except InputError as exc:
        raise InputError(option, text, exc.allowed) from None
    return value


def _is_bare_number(text: str) -> bool:
    """A number with no unit (a lone degree sign follows the unit system, so counts)."""
    try:
        units.parse_number(str(text).strip().rstrip("°º").strip())
    except InputError:
        return False
    return True


def _plausibility(option: str, text: str, value_c: float, system: str) -> str | None:
    """A warning line when a bare SI air temperature is more likely meant in °F."""
    if system == "si" and value_c > PLAUSIBLE_SI_AIR_TEMP_MAX_C and _is_bare_number(text):
        return (
            f"{option} {text}: read as {value_c:g} °C; for °F use --units ip or "
            f"{str(text).strip()}F"
        )
    return None


def _pressure(args: argparse.Namespace, system: units.UnitSystem) -> float:
    """``--pressure``, else the standard atmosphere at ``--altitude``, else at sea level."""
    if args.pressure is not None:
        return _read_option("--pressure", args.pressure, "pressure", system, psychro.check_pressure)
    if args.altitude is not None:
        return _option(
            "--altitude",
            args.altitude,
            lambda t: psychro.pressure_from_altitude_m(units.parse_length(t, "--altitude", system)),
        )
    return psychro.STANDARD_PRESSURE_PA


def _read_option(
    option: str,
    text: str,
    quantity: units.ReadQuantity,
    system: units.UnitSystem,
    check: Callable[[float, str], object] | None = None,
) -> float:
    """Read and range-check one option; an error names the option, the text as typed and,
    where a unit was converted, what it was read as (``30 ft3`` read as 0.85 m³)."""
    reading = units.read(quantity, text, option, system)
    return reading.value if check is None else reading.checked(check)


def _parse_mould_area(text: str, system: units.UnitSystem = "si") -> float:
    """A visible-mould area in m² (a bare number is m² in si, ft² in ip; "m2", "ft2",
    "sq ft" may follow it), above 0 and up to the survey file's limit."""
    unit = "m²" if system == "si" else "ft²"
    allowed = (
        f"an area above 0 and up to {domain.MOULD_AREA_MAX_M2:g} m², e.g. 0.5 "
        f"(a bare number is {unit}; m2 or ft2 may follow it)"
    )
    try:
        area = units.read("area", text, "--mould-area", system).value
    except InputError:
        raise InputError("--mould-area", text, allowed) from None
    if math.isnan(area) or not 0.0 < area <= domain.MOULD_AREA_MAX_M2:
        raise InputError("--mould-area", text, allowed)
    return area


def _parse_rh_accuracy(text: str) -> float:
    """A hygrometer's ± accuracy in %RH: ``2``, ``2 %``, ``0.8 %RH``. Unlike an RH reading,
    a value below 1 is an accuracy, not a fraction."""
    raw = str(text).strip()
    for suffix in ("%rh", "% rh", "%"):
        if raw.lower().endswith(suffix):
            raw = raw[: -len(suffix)].strip()
            break
    return units.parse_number(raw, "--rh-accuracy")


def _accuracy_option(
    option: str,
    text: str | None,
    parse: Callable[[str], float],
    default_key: str,
    least: float,
    top: float,
    unit: str,
) -> tuple[float, bool]:
    """An instrument accuracy: above 0 (no instrument is exact; the file model holds the same
    bound) and up to ``top``."""
    if text is None:
        return th.value(default_key), False
    value = _option(option, text, parse)
    if not least <= value <= top:
        raise InputError(
            option,
            text,
            f"accuracy must be between {least:g} and {top:g} {unit} (no instrument reads exactly)",
        )
    return value, True


def _surfaces(specs: list[tuple[str, str]], system: units.UnitSystem) -> list[assess.SurfaceInput]:
    """The surfaces typed, in order, each with its element and a label."""
    counts: dict[str, int] = {}
    found = []

    def temperature(option: str, text: str) -> float:
        return _read_option(option, text, "temperature", system, psychro.check_surface_temp)

    for option, text in specs:
        element, prefix = _SURFACE_OPTIONS[option]
        label = ""
        if element is None:
            parts = str(text).split(":", 2)
            if len(parts) < 2 or not parts[1].strip():
                raise InputError(
                    option,
                    text,
                    "expected ELEMENT:TEMPERATURE or "
                    "ELEMENT:TEMPERATURE:LABEL, e.g. "
                    "external_wall:11.2:NE corner",
                )
            try:
                policy = th.check_element(parts[0].strip(), option)
            except InputError as exc:
                raise InputError(option, text, "element " + exc.allowed) from None
            element = policy.element
            prefix = policy.words.capitalize()
            try:
                temp = temperature(option, parts[1].strip())
            except InputError as exc:
                raise InputError(option, text, exc.allowed) from None
            label = parts[2].strip() if len(parts) == 3 else ""
        else:
            temp = temperature(option, text)
        if not label:
            counts[prefix] = counts.get(prefix, 0) + 1
            label = f"{prefix} {counts[prefix]}"
        found.append(assess.SurfaceInput(label, temp, element))
    return found


_DESIGN_FIELDS = {
    "design outdoor temperature": "--design-outdoor-temp",
    "design outdoor RH": "--design-outdoor-rh",
    "design indoor temperature": "--design-indoor-temp",
}


def _design_month(args: argparse.Namespace, system: units.UnitSystem) -> season.DesignMonth | None:
    """The design month typed (``--design-outdoor-temp`` with ``--design-outdoor-rh``, and
    ``--design-indoor-temp`` if given), or None when none was; an error names the option."""
    temp, rh, indoor = args.design_outdoor_temp, args.design_outdoor_rh, args.design_indoor_temp
    if temp is None and rh is None:
        if indoor is not None:
            raise InputError(
                "--design-indoor-temp",
                indoor,
                "give --design-outdoor-temp and --design-outdoor-rh as well: it is the room "
                "temperature of that design month",
            )
        return None
    if (temp is None) != (rh is None):
        given, text = ("--design-outdoor-temp", temp) if rh is None else ("--design-outdoor-rh", rh)
        missing = "--design-outdoor-rh" if rh is None else "--design-outdoor-temp"
        raise InputError(
            given, text, f"give {missing} as well: a design month needs its temperature and RH"
        )
    outdoor_c = _read_option(
        "--design-outdoor-temp", temp, "temperature", system, psychro.check_dry_bulb
    )
    rh_pct = _option(
        "--design-outdoor-rh",
        rh,
        lambda t: units.parse_rh(t, "--design-outdoor-rh"),
        psychro.check_rh,
    )
    indoor_c = None
    if indoor is not None:
        indoor_c = _read_option(
            "--design-indoor-temp", indoor, "temperature", system, psychro.check_dry_bulb
        )
    try:
        from survey import season

        return season.DesignMonth(outdoor_c, rh_pct, indoor_c, "given")
    except InputError as exc:
        option = _DESIGN_FIELDS.get(exc.field, exc.field)
        text = {"--design-indoor-temp": indoor}.get(option, exc.value)
        raise InputError(option, text, exc.allowed) from None


def _design_excess(text: str) -> season.ExcessModel | None:
    """The excess model asked for; None (the class line) when not said."""
    if text != "measured":
        return None
    from survey import season

    return season.ExcessModel.MEASURED
