"""The colder month in words: a surface in the design month, the lowest month it bears, the
design month and the excess it rests on, and which surfaces only look safe today.

Every sentence of the projection (:mod:`survey.season`) a person reads is made here; the
command line, the report and the app only lay them out. Numbers are written in a
:class:`Display`'s units; a surface's label (user text) has its control characters made
visible, never read as markup.
"""

from __future__ import annotations

from collections.abc import Iterable

from survey import psychro
from survey import thresholds as th
from survey.assess import FactorState, RoomFinding
from survey.safe_text import visible
from survey.season import (
    DesignMonth,
    DesignState,
    ExcessModel,
    InverseOutcome,
    LowestMonth,
    RoomProjection,
    RoomReason,
    SurfaceProjection,
)
from survey.words.display import Display
from survey.words.states import CANNOT_TELL, factor_not_judged_reason, humidity_class_text

#: The heading of the colder-month section (report) and block (command line).
HEADING = "The colder month"

#: What the section is, said once above it.
INTRO = (
    "Today's readings are a snapshot of one day. Two things they measure change little with "
    "the weather: each wall's temperature factor (how warm its inner surface stays against "
    "the inside-outside difference) and the room's moisture excess over the outdoor air. "
    "Carried to a colder month by the temperature-factor method of EN ISO 13788, they show "
    "what each surface would do then, judged by the same limits as today (mould at "
    "80 % surface RH as a monthly mean, condensation at 100 %), with the range the "
    "instruments' accuracy leaves. It is an estimate from one day's readings, not a "
    "measurement of that month: a logger over the winter settles it."
)

#: The table of surfaces in the design month: its title and columns (name, numbers on the right).
TABLE_TITLE = "Surfaces in the design month"
TABLE_COLUMNS = (
    ("Surface", False),
    ("Surface RH today", True),
    ("Surface temp. in the month", True),
    ("Surface RH in the month", True),
    ("In the month", False),
    ("Lowest month it bears", True),
)

STATE_WORDS = {
    DesignState.BELOW: "below the mould limit",
    DesignState.ABOVE: "above the mould limit",
    DesignState.CONDENSING: "condensing",
    DesignState.CANNOT_TELL: CANNOT_TELL,
    DesignState.NOT_MEASURABLE: "cannot be judged",
    DesignState.NOT_PROJECTED: "not projected",
    DesignState.NOT_MEANINGFUL: "not meaningful",
}

_NOT_PROJECTED = {
    FactorState.GROUND_CONTACT: "it is in contact with the ground, which sets its temperature, "
    "not the outdoor air",
    FactorState.DRYING_WET: "the room is being dried, and evaporation from wet materials "
    "keeps its surfaces cold",
    FactorState.NOT_APPLICABLE: "this room use has no temperature-factor limit, so its factor "
    "is not judged",
}
_NOT_FOR_ELEMENT = {
    "glazing": "the temperature factor is not used for glass",
    "window_frame": "the temperature factor is not used for window frames",
    "pipe": "the temperature factor is not used for pipes",
    "internal_wall": "an internal wall is not set by the outdoor air, so it has no "
    "temperature factor to carry over",
}


def _frost(p: SurfaceProjection) -> bool:
    return (p.design_surface_temp_c or 0.0) <= psychro.TRIPLE_POINT_C


def _condensing(p: SurfaceProjection) -> str:
    return ("frost" if _frost(p) else "water") + " would form on it through the month"


def _state_phrase(state: DesignState, p: SurfaceProjection) -> str:
    return _condensing(p) if state is DesignState.CONDENSING else STATE_WORDS[state]


def _round_shown(temp_c: float, d: Display) -> float:
    """``temp_c`` rounded to the whole degree of the display (°C, or °F in IP), in °C."""
    if d.ip:
        return (round(temp_c * 9.0 / 5.0 + 32.0) - 32.0) * 5.0 / 9.0
    return float(round(temp_c))


def _temp(temp_c: float, d: Display) -> str:
    """A temperature the user set or we chose: whole degrees when whole, else 0.1."""
    if abs(temp_c - _round_shown(temp_c, d)) < 0.05 * (5.0 / 9.0 if d.ip else 1.0):
        return d.temperature(temp_c, 0)
    return d.temperature(temp_c)


def not_projected_reason(
    p: SurfaceProjection, room: RoomProjection, finding: RoomFinding | None, d: Display
) -> str:
    """Why a surface was not carried to the design month: a sentence."""
    if room.reason is RoomReason.NO_OUTDOOR:
        return (
            "cannot be judged: there is no outdoor reading today, so neither the temperature "
            "factor nor the moisture excess was measured"
        )
    if p.state is DesignState.NOT_MEASURABLE:
        why = None if finding is None else factor_not_judged_reason(finding, d)
        return "cannot be judged: the temperature factor was not measurable today" + (
            f"; {why}" if why else ""
        )
    if room.reason is RoomReason.ROOM_SATURATED and p.state is DesignState.NOT_MEANINGFUL:
        return (
            "not meaningful: in the design month the room's air itself would saturate at "
            f"{d.temperature(room.indoor_temp_c)}"
        )
    if room.reason is RoomReason.INDOOR_NOT_WARMER:
        return (
            f"not projected: the design month ({_temp(room.month.outdoor_temp_c, d)} outside) "
            f"is as warm as the room ({d.temperature(room.indoor_temp_c)}) or warmer, so it is "
            "not a heated month"
        )
    if p.factor_state is FactorState.NOT_FOR_ELEMENT:
        why = _NOT_FOR_ELEMENT.get(p.element, "the temperature factor is not used for it")
    else:
        why = _NOT_PROJECTED.get(p.factor_state, "its temperature factor was not judged today")
    return "not projected: " + why


def design_rh_text(p: SurfaceProjection) -> str:
    """The projected surface RH with its range, for a table: '86 % (79–93)'."""
    rh, low, high = (
        p.design_surface_rh_pct,
        p.design_surface_rh_low_pct,
        p.design_surface_rh_high_pct,
    )
    if rh is None or low is None or high is None:
        return "–"
    if rh >= 100.0:
        return "100 % or more" + ("" if low >= 100.0 else f" ({low:.0f} % or more)")
    if high >= 100.0:
        return f"{rh:.0f} % ({low:.0f} % or more)"
    return f"{rh:.0f} % ({low:.0f}–{high:.0f})"


def state_text(
    p: SurfaceProjection, room: RoomProjection, finding: RoomFinding | None, d: Display
) -> str:
    """The design-month state in a few words, or why there is none."""
    if not p.projected:
        return not_projected_reason(p, room, finding, d)
    if p.state is DesignState.CANNOT_TELL:
        if p.possible == (DesignState.ABOVE, DesignState.CONDENSING):
            what = "frost" if _frost(p) else "water"
            return f"above the mould limit, and {what} may form on it ({CANNOT_TELL} which)"
        if p.possible == (DesignState.BELOW, DesignState.ABOVE):
            return f"{CANNOT_TELL}: below or above the mould limit"
        return f"{CANNOT_TELL}: anywhere from below the mould limit to condensing"
    return _state_phrase(p.state, p)


def _rh_phrase(p: SurfaceProjection) -> str:
    rh, low, high = (
        p.design_surface_rh_pct,
        p.design_surface_rh_low_pct,
        p.design_surface_rh_high_pct,
    )
    assert rh is not None and low is not None and high is not None
    if rh >= 100.0:
        if low >= 100.0:
            return "at saturation (100 % surface RH even at the low end of its range)"
        return f"at saturation (100 % surface RH; {low:.0f} % or more at this accuracy)"
    if high >= 100.0:
        return f"near {rh:.0f} % surface RH ({low:.0f} % up to saturation)"
    if f"{low:.0f}" == f"{high:.0f}":
        return f"near {rh:.0f} % surface RH"
    return f"near {rh:.0f} % surface RH ({low:.0f} to {high:.0f} %)"


def surface_sentence(
    p: SurfaceProjection,
    room: RoomProjection,
    d: Display,
    finding: RoomFinding | None = None,
    subject: str | None = None,
) -> str:
    """'In a month averaging 0 °C outside this surface would sit near 86 % surface RH (79 to
    93 %): above the mould limit.' — or why it cannot be said. ``subject`` names the surface
    (its label is used, made safe, when None is given and ``p`` has one)."""
    name = visible(p.label) if subject is None else subject
    if not p.projected:
        return f"{name}: {not_projected_reason(p, room, finding, d)}."
    month = room.month
    return (
        f"In a month averaging {_temp(month.outdoor_temp_c, d)} outside, {name} would sit "
        f"{_rh_phrase(p)}: {state_text(p, room, finding, d)}."
    )


def _end(outcome: tuple[InverseOutcome, float | None], m: LowestMonth, d: Display) -> str:
    kind, temp = outcome
    if kind is InverseOutcome.SOLVED and temp is not None:
        return d.temperature(temp)
    if kind is InverseOutcome.MEETS_THROUGHOUT:
        return f"{_temp(m.bracket_low_c, d)} or colder"
    return f"{d.temperature(m.bracket_high_c)} or warmer"


def _held(m: LowestMonth, room: RoomProjection, d: Display) -> str:
    excess = (
        "its moisture excess along its humidity class's line"
        if room.excess_model is ExcessModel.CLASS_LINE
        else "its moisture excess held as measured"
    )
    return (
        f"at {m.outdoor_rh_pct:.0f} % outdoor RH, with the room at "
        f"{d.temperature(m.indoor_temp_c)} and {excess}"
    )


def lowest_month_text(p: SurfaceProjection, d: Display) -> str:
    """The lowest month a surface bears, for a table: '0.3 °C', '−30 °C or colder'."""
    m = p.lowest_month
    if m is None or m.outcome is InverseOutcome.NO_BRACKET:
        return "–"
    if m.outcome is InverseOutcome.FAILS_AT_WARM_END:
        return f"none: above the limit at {d.temperature(m.bracket_high_c)}"
    return _end((m.outcome, m.outdoor_temp_c), m, d)


def lowest_month_sentence(p: SurfaceProjection, room: RoomProjection, d: Display) -> str | None:
    """The lowest outdoor monthly mean at which the surface still meets the mould limit, as a
    sentence with its range and the conditions held; None when it was not worked out."""
    m = p.lowest_month
    if m is None:
        return None
    if m.outcome is InverseOutcome.NO_BRACKET:
        return (
            f"The lowest month it bears is not worked out: at {d.temperature(m.indoor_temp_c)} "
            f"the room is too cool for any month between {_temp(m.bracket_low_c, d)} and "
            f"{d.difference(th.value('frsi_min_temperature_difference_k'), 0)} below it to count "
            "as a heated month."
        )
    low, high = _end(m.low_end, m, d), _end(m.high_end, m, d)
    held = _held(m, room, d)
    if m.outcome is InverseOutcome.SOLVED and m.outdoor_temp_c is not None:
        spread = f"; at this accuracy, somewhere from {low} to {high}" if low != high else ""
        return (
            f"It stays at or below the mould limit in months averaging down to "
            f"{d.temperature(m.outdoor_temp_c)} outside, {held}{spread}."
        )
    if m.outcome is InverseOutcome.MEETS_THROUGHOUT:
        maybe = (
            f"; at this accuracy it may pass the limit in months below {high}"
            if m.high_end[0] is InverseOutcome.SOLVED
            else ""
        )
        return (
            f"It stays at or below the mould limit in every month down to "
            f"{_temp(m.bracket_low_c, d)} outside, the coldest looked at, {held}{maybe}."
        )
    maybe = (
        f"; at this accuracy it may meet the limit down to {low}"
        if m.low_end[0] is InverseOutcome.SOLVED
        else ""
    )
    least = d.difference(th.value("frsi_min_temperature_difference_k"), 0)
    return (
        f"It is above the mould limit even in a month averaging "
        f"{d.temperature(m.bracket_high_c)} outside, the mildest heated month looked at "
        f"({least} below the room), {held}{maybe}."
    )


# --- the design month and the excess --------------------------------------------------------


def month_phrase(month: DesignMonth, d: Display) -> str:
    """'a month averaging 0 °C outside at 90 % RH'."""
    return (
        f"a month averaging {_temp(month.outdoor_temp_c, d)} outside at "
        f"{month.outdoor_rh_pct:.0f} % RH"
    )


def design_month_text(month: DesignMonth, d: Display, site_refused: bool = False) -> str:
    """Which design month is used and whose it is; our default is said to be our choice.
    ``site_refused``: the site gives a month that cannot be used (:func:`site_month_unusable`
    says so), so the default is not said to stand for a month not given."""
    if month.source == "default":
        text = (
            f"Design month: {month_phrase(month, d)}, our choice: a typical coldest-month mean "
            "for a temperate climate"
        )
        text += (
            "."
            if site_refused
            else ", used because no design month is given for this site (a local month's "
            "mean temperature and RH can be set on the site)."
        )
    else:
        whose = "the site's" if month.source == "site" else "the one given"
        text = f"Design month: {month_phrase(month, d)}, {whose}."
        defaults = [
            part
            for part, flag in (
                ("temperature", month.outdoor_temp_default),
                ("RH", month.outdoor_rh_default),
            )
            if flag
        ]
        if defaults:
            text += (
                f" Its outdoor {' and '.join(defaults)} is not given, so our default is used "
                "(our choice)."
            )
    if month.indoor_temp_c is None:
        return text + " Each room is held at its temperature as measured today."
    return text + f" Each room is held at {_temp(month.indoor_temp_c, d)}."


def excess_text(room: RoomProjection, d: Display) -> str | None:
    """How the room's moisture excess was carried to the design month; None without one."""
    if room.measured_excess_pa is None or room.design_vapour_pressure_excess_pa is None:
        return None
    today = (
        f"The room's vapour-pressure excess over the outdoor air, "
        f"{d('vapour_pressure', room.measured_excess_pa)} today"
    )
    if room.measured_outdoor_temp_c is not None:
        today += f" at {d.temperature(room.measured_outdoor_temp_c)} outside"
    if room.humidity_class is not None:
        today += f" ({humidity_class_text(room.humidity_class)})"
    month = (
        f"{d('vapour_pressure', room.design_vapour_pressure_excess_pa)} ± "
        f"{d('vapour_pressure', room.design_vapour_pressure_excess_uncertainty_pa or 0.0)} in "
        "the design month"
    )
    floored = (
        " (a room drier than outdoors is taken at no excess, the floor of class 1)"
        if room.design_vapour_pressure_excess_pa == 0.0 and room.measured_excess_pa < 0.0
        else ""
    )
    saturated = _saturated_text(room, d)
    if room.excess_model is ExcessModel.CLASS_LINE:
        return (
            f"{today}, is carried along the line of its humidity class (EN ISO 13788 Annex A: "
            f"constant at and below {d.temperature(th.value('humidity_class_flat_below_c'), 0)} "
            f"outside, falling to zero at "
            f"{d.temperature(th.value('humidity_class_zero_at_c'), 0)}): {month}{floored}."
            f"{saturated}"
        )
    why = ""
    if room.excess_model_fallback and room.measured_outdoor_temp_c is not None:
        zero = th.value("humidity_class_zero_at_c")
        if room.measured_outdoor_temp_c >= zero:
            why = (
                f" (at {_temp(zero, d)} outside or warmer the class lines have reached zero: "
                "there is no line to carry it along"
            )
        else:
            why = (
                f" (today's outdoor air was warmer than "
                f"{_temp(th.value('class_line_warmest_outdoor_c'), d)}, the warmest at which it "
                f"is carried along a class line: nearer {_temp(zero, d)} the line multiplies "
                "one mild day's excess many times over, more than that reading bears"
            )
        why += (
            "; in a colder month, with the windows shut, the excess may well be larger than "
            "this, and a reading on a colder day settles it)"
        )
    return f"{today}, is held as measured{why}: {month}{floored}.{saturated}"


def _saturated_text(room: RoomProjection, d: Display) -> str:
    """Said after the excess when the room's air itself would saturate in the month."""
    excess, saturation = room.design_vapour_pressure_excess_pa, room.design_vapour_pressure_pa
    if room.reason is not RoomReason.ROOM_SATURATED or excess is None or saturation is None:
        return ""
    total = room.design_outdoor_vapour_pressure_pa + excess
    return (
        f" With the month's outdoor vapour pressure, "
        f"{d('vapour_pressure', room.design_outdoor_vapour_pressure_pa)}, that is "
        f"{d('vapour_pressure', total)}: more than air at {d.temperature(room.indoor_temp_c)} "
        f"holds ({d('vapour_pressure', saturation)}). The room's air itself would saturate, "
        "which no room does for a month, so the projection is not meaningful for this room; "
        "check today's readings, and if they stand, the room's moisture sources."
    )


def _names(surfaces: Iterable[SurfaceProjection]) -> str:
    return "; ".join(visible(s.label) for s in surfaces)


def room_verdict_lines(room: RoomProjection) -> list[str]:
    """Which surfaces fail in the colder month, and which of them only look safe today."""
    lines = []
    failing = [s for s in room.failing if s.fails_in_month]
    maybe = [s for s in room.failing if s.may_fail_in_month]
    if failing:
        lines.append(f"Above the mould limit or condensing in the colder month: {_names(failing)}.")
    if maybe:
        lines.append(f"May pass the mould limit in the colder month: {_names(maybe)}.")
    if room.only_safe_today:
        lines.append(
            "Only look safe today (at or below the mould limit on the day; above it, or possibly "
            "above it, in the colder month): "
            f"{_names(room.only_safe_today)}."
        )
    projected = [s for s in room.surfaces if s.projected]
    if projected and not room.failing:
        lines.append("Every projected surface stays below the mould limit in the colder month.")
    if not projected:
        lines.append("No surface of this room could be projected.")
    return lines


#: A room none of whose surfaces could be carried to the month: the lead of its list.
NONE_PROJECTED = "No surface of this room could be carried to the month:"


def none_projected_items(
    room: RoomProjection, finding: RoomFinding | None, d: Display
) -> tuple[tuple[str, str], ...]:
    """Each surface of such a room with why it was not carried over, as list items (label,
    reason), in the order measured: a few lines rather than a table of dashes."""
    return tuple(
        (
            visible(p.label) + ":",
            not_projected_reason(p, room, finding, d).removeprefix("not projected: ") + ".",
        )
        for p in room.surfaces
    )


def panel_lines(room: RoomProjection, d: Display, site_problem: str | None = None) -> list[str]:
    """The app's room panel: the design month in brief (and, when the site's month was
    refused, ``site_problem`` says why in one line) and the worst surface, today's surface RH
    beside the projected one."""
    if not room.surfaces:
        return []
    month = room.month
    head = f"{HEADING} ({_temp(month.outdoor_temp_c, d)} outside, {month.outdoor_rh_pct:.0f} % RH"
    head += ", our default)" if month.is_default else ")"
    lines = [head]
    if site_problem is not None:
        lines.append(site_month_unusable(site_problem))
    worst = room.worst
    if worst is None:
        reasons = dict.fromkeys(
            not_projected_reason(s, room, None, d).removeprefix("not projected: ")
            for s in room.surfaces
        )
        return [*lines, "No surface projected: " + "; ".join(reasons) + "."]
    today = worst.today_surface_rh_pct
    # as the tables say it: never "100 %" for a surface short of saturation
    today_said = (
        "100 % or more"
        if today >= 100.0
        else f"{today:.1f} %"
        if today >= 99.5
        else f"{today:.0f} %"
    )
    line = (
        f"{visible(worst.label)}: {today_said} today, "
        f"{design_rh_text(worst)} in the month: {state_text(worst, room, None, d)}."
    )
    return [*lines, line]


# --- the report ------------------------------------------------------------------------------

#: The report's table of a room's surfaces in the design month.
REPORT_COLUMNS = (
    "Surface",
    "Surface RH today",
    "Surface temp. in the month",
    "Surface RH in the month",
    "In the month",
    "Lowest month it bears",
)
#: The subject of a surface's sentence where its label leads the line.
THIS_SURFACE = "this surface"
NO_SURFACES = "No surface was measured in this room."
SITE_VERDICT_LEAD = "Across the rooms:"
LIMITS_LEAD = "The limits and choices the colder month rests on:"


def site_month_unusable(problem: str) -> str:
    """The site's design month cannot be projected to: what is wrong, and what is used. The
    problem (an error's text, which may quote what was typed) has its control characters
    made visible."""
    return (
        f"The site's design month cannot be used ({visible(problem)}); our default month is "
        "used instead."
    )


def _by_room(rooms: Iterable[RoomProjection], pick: str) -> str:
    parts = []
    for room in rooms:
        chosen = [s for s in room.surfaces if getattr(s, pick)]
        if chosen:
            parts.append(f"{visible(room.name)} ({_names(chosen)})")
    return ", ".join(parts)


def site_verdict_lines(rooms: Iterable[RoomProjection]) -> list[str]:
    """Which surfaces of the site fail in the colder month, which may, and which of them
    only look safe today, room by room."""
    rooms = list(rooms)
    lines = []
    for pick, lead in (
        ("fails_in_month", "Above the mould limit or condensing in the colder month"),
        ("may_fail_in_month", "May pass the mould limit in the colder month"),
        ("only_safe_today", "Only look safe today"),
    ):
        found = _by_room(rooms, pick)
        if found:
            lines.append(f"{lead}: {found}.")
    if not lines and any(s.projected for room in rooms for s in room.surfaces):
        lines.append("Every projected surface stays below the mould limit in the colder month.")
    return lines


#: The site screen's group of design-month fields, and the line under its title.
SITE_GROUP = "Design month (for the colder month)"
SITE_GROUP_HINT = (
    "A local coldest month's mean outdoor temperature and RH: the report projects each "
    "measured wall to it. Left blank, our default month is used and the report says so."
)


def site_field_hints(d: Display) -> dict[str, str]:
    """What an empty design-month field of the site means, for the app's placeholders."""
    return {
        "outdoor_temp": "blank: our default, "
        + _temp(th.value("design_month_outdoor_temp_default_c"), d),
        "outdoor_rh": (
            f"blank: our default, {th.value('design_month_outdoor_rh_default_pct'):.0f} %"
        ),
        "indoor_temp": "blank: each room as measured",
    }
