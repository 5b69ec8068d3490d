"""The mould-growth index over a logged period in words, as a surveyor would write it: the
highest index and what it means, the days above index 1 and 3, when conditions favoured
growth, ASHRAE 160's simpler criterion beside it, the assumption behind the surface's
conditions and the model's limits. Temperatures in the display's units (SI or IP)."""

from __future__ import annotations

import datetime as dt

from survey import thresholds as th
from survey.mould_ashrae160 import Ashrae160State
from survey.mould_index import IndexState, MouldIndexResult
from survey.mould_series import LogIndex, LogNotJudged
from survey.safe_text import visible
from survey.words.display import Display

HEADING = "Mould growth over the logged period"
INTRO = (
    "Where a data logger was left in a room or on a surface, its readings are run through a "
    "published mould-growth model: an index from 0 (no growth) through 1 (growth only a "
    "microscope shows) and 3 (growth seen by eye) to 6 (heavy growth), worked out hour by "
    "hour from the surface's temperature and humidity, rising while they favour mould and "
    "falling slowly in dry spells."
)
LIMITS = (
    "The index model (Hukka and Viitanen 1999, with the material classes of Ojanen, Viitanen "
    "and co-workers) was fitted to pine and spruce sapwood in laboratory tests and is extended "
    "to other materials by class. It is a guide to the risk over the logged weeks, not a "
    "laboratory test of this surface: where mould is suspected, a sample or tape lift examined "
    "by a laboratory settles it."
)
VISIBLE_CAUTION = (
    "Treat this spot as mouldy until it is looked at: check behind furniture and linings "
    "there, and follow the mould cautions (protective equipment; larger areas cleaned by "
    "licensed professionals, as local codes require)."
)
CLEAN_START = (
    "The index starts at 0 at the first sample: the model does not know of mould already on "
    "the surface, which would make the real state worse than shown."
)

#: The index levels in our words (the scale of Hukka & Viitanen 1999).
INDEX_MEANING = (
    "no growth",
    "small amounts of growth, seen only under a microscope",
    "several small colonies, seen only under a microscope",
    "growth seen by eye, on less than a tenth of the surface",
    "growth seen by eye on a tenth to a half of the surface",
    "growth over more than half of the surface",
    "heavy growth over almost all of the surface",
)
CLASS_WORDS = {
    "very_sensitive": "very sensitive (untreated sawn timber)",
    "sensitive": "sensitive (planed wood, wood-based boards, paper, painted or papered finishes)",
    "medium_resistant": "medium resistant (concrete, masonry, cement render, mineral wool, "
    "plastics)",
    "resistant": "resistant (glass, metal)",
}
NOT_JUDGED = {
    "no_factor": "it measured the room's air, and no surface of the room had a temperature "
    "factor that could be measured on a visit (that needs enough difference between inside and "
    "outside), so the surface's conditions cannot be worked out from it",
    "no_outdoor": "it measured the room's air; working out a surface's temperature from it "
    "needs an outdoor logger series, and none was imported",
    "outdoor_gap": "it measured the room's air, and the outdoor logger does not cover its period",
    "too_few": "it holds fewer than two samples",
    "times_mixed": "its times (or the outdoor logger's) mix some with a UTC offset and some "
    "without, so they cannot be put in order",
}


#: The index chart's wording: its title, axis label, the series and the two guide lines.
CHART_WORDS = {
    "title": "Mould-growth index over the logged period",
    "axis": "Mould-growth index",
    "series": "index",
    "microscopic": "growth under a microscope",
    "visible": "visible growth",
}


def chart_alt(room_name: str, result: MouldIndexResult) -> str:
    """The chart's alt text: what it shows and its highest value."""
    return (
        f"Mould-growth index over the logged period in {visible(room_name)}, from 0 to 6; "
        f"its highest was {result.index_max:.1f} ({index_meaning(result.index_max)})."
    )


def when(at: dt.datetime) -> str:
    """A time for a summary: '3 Jan 2026 10:00'."""
    return f"{at.day} {at:%b %Y %H:%M}"


def _days(days: float) -> str:
    return f"{days:.1f} day{'' if round(days, 1) == 1.0 else 's'}"


def _hours(hours: float) -> str:
    return f"{hours:.0f} h"


def index_meaning(index: float) -> str:
    """What an index value means, by the whole level it has reached."""
    return INDEX_MEANING[max(0, min(6, int(index + 1e-9)))]


def series_title(judged: LogIndex | LogNotJudged, room_name: str) -> str:
    """'Logger bed1.csv on NE corner (Main bedroom)' or '… in the air of Main bedroom'."""
    if isinstance(judged, LogNotJudged):
        return f"Logger {judged.source} in {room_name}"
    source = judged.source
    if judged.result.basis == "surface_logger":
        return f"Logger {source.source} on the surface {source.surface} ({room_name})"
    return f"Logger {source.source} in the air of {room_name}, for the surface {source.surface}"


def not_judged_text(judged: LogNotJudged) -> str:
    return f"Not judged: {NOT_JUDGED[judged.reason]}."


def verdict(result: MouldIndexResult) -> str:
    """The highest index, what it means, and where it ended."""
    top = result.index_max
    lead = f"Highest mould-growth index {top:.1f} (on {when(result.index_max_at)})"
    if result.state is IndexState.VISIBLE:
        said = f"{lead}: visible mould growth is likely on this surface ({index_meaning(top)})."
    elif result.state is IndexState.MICROSCOPIC:
        said = (
            f"{lead}: growth has likely begun but is still microscopic "
            f"({index_meaning(top)}); the model does not expect it to be visible yet."
        )
    else:
        said = f"{lead}: below index 1, the model expects no growth over the logged period."
    if result.rising_at_end:
        end = f" At the end of the log it was {result.index_final:.1f} and still rising."
    elif result.index_final < top - 0.05:
        end = f" At the end of the log it had fallen to {result.index_final:.1f} in a dry spell."
    else:
        end = f" At the end of the log it was {result.index_final:.1f}."
    return said + end


def days_text(result: MouldIndexResult) -> str:
    one = th.value("mould_index_microscopic")
    three = th.value("mould_index_visible")
    first_1 = f" (first on {when(result.first_above_1_at)})" if result.first_above_1_at else ""
    first_3 = f" (first on {when(result.first_above_3_at)})" if result.first_above_3_at else ""
    return (
        f"At index {one:g} or more for {_days(result.days_above_1)}{first_1}; at index "
        f"{three:g} or more for {_days(result.days_above_3)}{first_3}, of "
        f"{_days(result.logged_days)} logged."
    )


def _critical_range(result: MouldIndexResult, d: Display) -> str:
    freezing = d.temperature(th.value("mould_index_growth_min_temp_c"), 0)
    return (
        f"{result.sensitivity.rh_min_pct:g} % on a warm surface, rising to 100 % as the "
        f"surface nears {freezing}"
    )


def periods_text(result: MouldIndexResult, d: Display, shown: int = 5) -> str:
    """When conditions favoured growth: the periods with dates, at most ``shown`` of them."""
    if not result.periods:
        return (
            "Conditions never favoured growth: the surface RH stayed below the model's "
            f"critical RH for this material ({_critical_range(result, d)})."
        )
    count = len(result.periods)
    parts = [
        f"{when(p.start)} to {when(p.end)} ({_hours(p.favourable_h)} favourable, index up to "
        f"{p.index_max:.1f})"
        for p in result.periods[:shown]
    ]
    more = f"; and {count - shown} more" if count > shown else ""
    several = "one period" if count == 1 else f"{count} periods"
    return (
        f"Conditions favoured growth for {_hours(result.favourable_h)} of "
        f"{_hours(result.logged_days * 24)} logged, in {several}: {'; '.join(parts)}{more}. "
        f"Favourable means a surface RH at or above the critical RH ({_critical_range(result, d)})"
        " with the surface above freezing."
    )


def ashrae_text(result: MouldIndexResult, d: Display) -> str:
    """ASHRAE 160-2009's criterion on the same series, and how it compares with the index."""
    a = result.ashrae160
    limit = th.value("ashrae160_surface_rh_limit_pct")
    window = th.value("ashrae160_running_mean_days")
    low = d.temperature(th.value("mould_growth_min_surface_temp_c"), 0)
    high = d.temperature(th.value("mould_growth_max_surface_temp_c"), 0)
    name = "ASHRAE Standard 160-2009's simpler criterion"
    rule = (
        f"a {window:g}-day running mean surface RH below {limit:g} % while the surface "
        f"averages {low} to {high}"
    )
    if a.state is Ashrae160State.TOO_SHORT:
        side = "at or above" if a.whole_mean_rh_pct >= limit else "below"
        return (
            f"{name} ({rule}) needs {window:g} days of log; this one spans "
            f"{_days(result.logged_days)}. Its mean surface RH was {a.whole_mean_rh_pct:.1f} % "
            f"at {d.temperature(a.whole_mean_temp_c)}, {side} {limit:g} %: for comparison only."
        )
    if a.state is Ashrae160State.OUT_OF_RANGE:
        return f"{name} ({rule}) does not apply: the mean surface temperature stayed outside it."
    highest = f"{a.highest_mean_rh_pct or 0.0:.1f} %"
    if a.state is Ashrae160State.MET:
        said = f"{name} ({rule}) is met: the running mean reached at most {highest}."
    else:
        first = f", first on {when(a.first_exceeded_at)}" if a.first_exceeded_at else ""
        said = (
            f"{name} ({rule}) is not met: the running mean reached {highest} and was at "
            f"{limit:g} % or more for {_days(a.days_exceeded)}{first}."
        )
    grows = result.state is not IndexState.NO_GROWTH
    if grows and a.state is Ashrae160State.MET:
        said += (
            " The index sees growth the monthly mean misses: favourable spells shorter than a "
            "month count in the model."
        )
    elif not grows and a.state is Ashrae160State.EXCEEDED:
        said += (
            " The monthly mean fails while the index stays below 1: the simple criterion is "
            "the stricter, and ASHRAE 160-2016 replaced it by an index model of this kind."
        )
    return said


def class_text(result: MouldIndexResult, material: str) -> str:
    choice = result.choice
    name = CLASS_WORDS[choice.key]
    if choice.basis == "stated":
        return f"Material class: {name}, as stated."
    if choice.basis in ("material", "label"):
        what = "material" if choice.basis == "material" else "surface's label"
        return f"Material class: {name}, from the word '{choice.word}' in the {what}."
    if choice.basis == "element":
        return f"Material class: {name}, for {choice.word}."
    recorded = (
        f"the material '{material}' says nothing the classes know"
        if material
        else ("no material was recorded")
    )
    return (
        f"Material class: {name}, the default ({recorded}; painted plaster, plasterboard and "
        "papered walls, the usual indoor finishes, are in this class)."
    )


def basis_text(judged: LogIndex, d: Display) -> str:
    """Where the surface's conditions came from, with the assumption said."""
    result, source = judged.result, judged.source
    if result.basis == "surface_logger":
        return "The logger sat on the surface: its readings are the surface temperature and RH."
    factor = source.frsi or 0.0
    outdoors = ", ".join(source.outdoor_sources) or "the outdoor logger"
    said = (
        "The surface's conditions are worked out from the room logger, the outdoor logger "
        f"({outdoors}) and the surface's temperature factor {factor:.2f} measured on visit "
        f"{source.frsi_visit}: at every sample the surface is taken at outdoor + {factor:.2f} × "
        f"(room − outdoor) temperature, a steady state that ignores the wall's heat storage, "
        f"sun and heating cycles, and its RH from the room air's water vapour at that "
        "temperature."
    )
    lines = [said]
    if source.left_out:
        lines.append(
            f"{source.left_out} room samples were left out: no outdoor reading near their time."
        )
    if result.capped:
        lines.append(
            f"At {result.capped} samples water would form on the surface (surface RH read as "
            "100 %)."
        )
    return " ".join(lines)


def gaps_text(result: MouldIndexResult) -> str:
    if not result.gaps:
        return ""
    gap = th.value("mould_index_gap_h")
    return (
        f"The log has {result.gaps} gap{'' if result.gaps == 1 else 's'} longer than "
        f"{gap:g} h ({_hours(result.gap_h)} in all): the index is held through them."
    )


def summary_lines(judged: LogIndex | LogNotJudged, d: Display) -> list[str]:
    """Every sentence of one series' summary, in reading order (the title apart)."""
    if isinstance(judged, LogNotJudged):
        return [not_judged_text(judged)]
    result = judged.result
    lines = [
        f"{when(result.start)} to {when(result.end)}, {result.samples} samples.",
        verdict(result),
        VISIBLE_CAUTION if result.state is IndexState.VISIBLE else "",
        days_text(result),
        periods_text(result, d),
        ashrae_text(result, d),
        class_text(result, judged.source.material),
        basis_text(judged, d),
        gaps_text(result),
        CLEAN_START,
    ]
    return [line for line in lines if line]
