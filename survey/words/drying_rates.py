"""A fitted drying rate in words, to the decimals its standard error shows: a material
point's and the room air's (the words of drying progress, :mod:`survey.words.drying`)."""

from __future__ import annotations

from collections.abc import Callable

from survey.drying import Fit
from survey.words.display import Display


def _se_places(render: Callable[[int], str], base: int) -> int | None:
    """The decimals that show a standard error to one significant figure (two when it
    begins with 1; common practice, no source), at least ``base``; ``None`` when it needs
    more than one decimal past ``base`` (then it is too small to matter beside the rate and
    is left out). ``render(places)`` writes it."""
    for places in range(base, base + 2):
        digits = render(places).replace(".", "").replace("-", "").lstrip("0")
        if digits and (digits[0] != "1" or len(digits) >= 2):
            return places
    return None


def _rate_and_band(rate: float, se: float | None, base: int) -> tuple[str, str]:
    """A plain rate and its " ± se" band (empty when there is no standard error or it is
    too small to show), the rate at the band's decimals."""
    places = None if se is None else _se_places(lambda k: f"{se:.{k}f}", base)
    if se is None or places is None:
        return f"{rate:.{base}f}", ""
    return f"{rate:.{places}f}", f" ± {se:.{places}f}"


def air_rate_text(fit: Fit | None, quantity: str, d: Display) -> str:
    """A fitted rate of the room air: "falling 1.66 ± 0.18 g/kg a day"."""
    if fit is None:
        return "one reading only"
    rate = fit.rate_per_day
    word = "falling" if rate < 0 else "rising"
    se = fit.rate_se_per_day
    if quantity == "rh":
        size, band = _rate_and_band(abs(rate), se, 1)
        return f"{word} {size}{band} % RH a day"
    base = 1 if d.ip else 2  # the display's own decimals for a humidity ratio
    places = (
        None
        if se is None
        else _se_places(lambda k: d("humidity_ratio", se, decimals=k, unit=False), base)
    )
    if se is None or places is None:
        return f"{word} {d('humidity_ratio', abs(rate))} a day"
    number, unit = d("humidity_ratio", abs(rate), decimals=places).split(" ", 1)
    band = d("humidity_ratio", se, decimals=places, unit=False)
    return f"{word} {number} ± {band} {unit} a day"
