"""Limits as words: a threshold's citation for a client, and the legend of its marks."""

from __future__ import annotations

from survey import thresholds as th
from survey.words.display import Display

#: One short mark per kind of source, with its legend printed once.
MARK_SIGN = {"R": "", "M": "*", "C": "", "common practice": "†", "choice": "‡"}
MARK_LEGEND = {
    "*": "value not checked here against the original text of the source named",
    "†": "trade practice, no single published source",
    "‡": "a value we chose (inside the range the source gives, where there is one)",
}


def limit_value_text(t: th.Threshold, d: Display) -> str:
    """A limit's value in the display units (a 3 K margin is 5.4 °F in IP)."""
    if d.ip and t.unit == "K":
        return d.difference(t.value)
    if d.ip and t.unit == "°C":
        # A limit defined in whole °F (its °C value no round tenth: 80 °F = 26.666… °C) reads
        # in whole °F, as the sentences that name it (Display.nominal_temperature).
        fahrenheit = t.value * 1.8 + 32.0
        whole_f = abs(fahrenheit - round(fahrenheit)) < 1e-9
        tenth_c = abs(t.value * 10.0 - round(t.value * 10.0)) < 1e-9
        return d.nominal_temperature(t.value) if whole_f and not tenth_c else d.temperature(t.value)
    if t.unit == "Pa":
        return d("vapour_pressure", t.value)
    if t.unit == "m²":
        return d.area(t.value)
    if t.unit == "g/kg":
        return d("humidity_ratio", t.value / 1000.0)
    if t.unit == "year":
        return f"{t.value:.0f}"
    if t.unit == "" and 0.0 < t.value < 1.0 and t.key.endswith("_fraction"):
        return f"{t.value * 100:g} %"
    return t.value_text


def client_citation(t: th.Threshold, d: Display) -> str:
    """Title, value and source for a client, with a short mark (see :func:`legend`)."""
    source = (
        t.source.replace(" (from memory)", "")
        .replace("; from memory", "")
        .replace(", from memory", "")
        .replace("from memory", "not checked here")
    )
    return f"{t.title} {limit_value_text(t, d)}{MARK_SIGN[t.mark]}: {source}"


def legend(limits: list[th.Threshold]) -> list[str]:
    """The legend lines for the marks the listed limits use, once each."""
    used = {MARK_SIGN[t.mark] for t in limits} - {""}
    return [f"{sign} {text}" for sign, text in MARK_LEGEND.items() if sign in used]
