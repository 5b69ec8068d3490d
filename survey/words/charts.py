"""The charts' words: the psychrometric chart's axis and curve labels, and what the app's
chart and drying screens say around them."""

from __future__ import annotations

from survey.words.display import Display

#: The psychrometric chart's labels (curves formatted with their RH).
CHART_LABELS = {
    "dry_bulb": "Dry bulb",
    "humidity_ratio": "Humidity ratio",
    "saturation": "Saturation (100 % RH): dew forms",
    "frost": "Saturation over ice: frost forms",
    "mould_limit": "{rh:g} % RH: mould limit at a surface",
    "guide": "{rh:g} % RH",
    "outdoors": "Outdoors",
    "no_surface": "no surface measured",
}
CHART_EMPTY = "No air reading on this visit yet: nothing to chart."
CHART_COLUMNS = ("air", "dry bulb", "RH", "humidity ratio", "dew/frost pt", "coldest")
DRYING_EMPTY = "No room has been read yet."
REFERENCE_MARK = " ★ reference room"


def chart_key(pressure_pa: float, d: Display) -> str:
    """The app chart's key line: what each marker is, and the pressure the chart is at."""
    return f"● room  ■ outdoors  ◆ coldest surface, on the curve · at {d('pressure', pressure_pa)}"


def chart_point_detail(coldest: tuple[str, float] | None, worst_words: str, d: Display) -> str:
    """``: coldest surface NE corner 12.6 °C; worst: water forming`` (after the point's
    name); ``coldest`` is the coldest surface's label and temperature."""
    out = ""
    if coldest is not None:
        out += f": coldest surface {coldest[0]} {d.temperature(coldest[1])}"
    if worst_words:
        out += f"; worst: {worst_words}"
    return out


def drying_failed(problem: str) -> str:
    return f"Drying progress could not be worked out: {problem}"
