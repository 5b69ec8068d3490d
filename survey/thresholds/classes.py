"""The internal humidity classes of EN ISO 13788 against outdoor temperature."""

from __future__ import annotations

from survey.thresholds.table import value

# --- ISO 13788 humidity classes ----------------------------------------------------------------

#: Returned by :func:`humidity_class` for an excess above the class 5 limit.
BEYOND_CLASS_5 = 6

HUMIDITY_CLASS_KEYS: tuple[str, ...] = tuple(f"humidity_class_{n}_pa" for n in range(1, 6))


def humidity_class_limits_pa(outdoor_temp_c: float) -> tuple[float, ...] | None:
    """Upper vapour-pressure-excess limits (Pa) of classes 1-5 at ``outdoor_temp_c``.

    Constant at and below ``humidity_class_flat_below_c``, falling linearly to 0 at
    ``humidity_class_zero_at_c``; None at and above that temperature (no class judged).
    """
    flat = value("humidity_class_flat_below_c")
    zero = value("humidity_class_zero_at_c")
    if outdoor_temp_c >= zero:
        return None
    scale = 1.0 if outdoor_temp_c <= flat else (zero - outdoor_temp_c) / (zero - flat)
    return tuple(value(key) * scale for key in HUMIDITY_CLASS_KEYS)


def humidity_class(excess_pa: float, outdoor_temp_c: float) -> int | None:
    """ISO 13788 class (1-5) of a vapour-pressure excess; 6 means beyond class 5.

    A class runs from the previous class's limit (exclusive) up to its own (inclusive);
    an excess at or below the class 1 limit, negative included, is class 1. None when the
    outdoor temperature is at or above ``humidity_class_zero_at_c``.
    """
    limits = humidity_class_limits_pa(outdoor_temp_c)
    return None if limits is None else humidity_class_in(excess_pa, limits)


def humidity_class_in(excess_pa: float, limits: tuple[float, ...]) -> int:
    """The class of ``excess_pa`` among class limits already worked out for an outdoor
    temperature (:func:`humidity_class_limits_pa`); the rule of :func:`humidity_class`."""
    for number, limit in enumerate(limits, start=1):
        if excess_pa <= limit:
            return number
    return BEYOND_CLASS_5
