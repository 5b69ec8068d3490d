"""Findings as words: surface states (frost below 0 °C), surface RH, verdicts, humidity
classes, why a temperature factor is not judged, room uses.

The state enums of :mod:`survey.assess` carry a ``value`` and a ``rank``; their words live
here. A short phrase is what a table shows; :data:`CANNOT_TELL_EXPLAINED` is the long form,
shown once below a table.
"""

from __future__ import annotations

from collections.abc import Iterable, Mapping
from typing import Any

from survey import psychro
from survey import thresholds as th
from survey.assess import (
    CondensationState,
    DryStandardState,
    FactorState,
    MaterialFinding,
    MouldState,
    RoomFinding,
    SurfaceFinding,
    TimberState,
)
from survey.words.display import Display, round_down_rh

#: A room use as a noun phrase ("a bedroom"); None for a use not said.
USE_PHRASE = {
    "bedroom": "a bedroom",
    "bathroom": "a bathroom",
    "kitchen": "a kitchen",
    "living": "a living room",
    "basement": "a basement room",
    "crawlspace": "a crawl space",
    "loft": "a loft",
    "office": "an office",
    "storage": "a store room",
    "hallway": "a hallway",
    "utility": "a utility room",
    "other": None,
}

#: The short phrase for a state the instruments cannot settle.
CANNOT_TELL = "unclear at this accuracy"
#: Its long form, for the explanation under a table.
CANNOT_TELL_EXPLAINED = (
    f"\"{CANNOT_TELL.capitalize()}\": the reading's range (± the instruments' accuracy) "
    "reaches across a limit, so either state could be true. A more accurate instrument, or "
    "readings repeated over several days, would settle it."
)

CONDENSATION_WORDS = {
    CondensationState.CLEAR: "clear of the dew point",
    CondensationState.NEAR: "close to the dew point",
    CondensationState.CONDENSING: "condensing now",
    CondensationState.CANNOT_TELL: CANNOT_TELL,
}
FROST_WORDS = {
    CondensationState.CLEAR: "clear of the frost point",
    CondensationState.NEAR: "close to the frost point",
    CondensationState.CONDENSING: "frost forming now",
    CondensationState.CANNOT_TELL: CANNOT_TELL,
}
MOULD_WORDS = {
    MouldState.BELOW: "below the mould limit",
    MouldState.APPROACHING: "approaching the mould limit",
    MouldState.ABOVE: "above the mould limit",
    MouldState.CANNOT_TELL: CANNOT_TELL,
    MouldState.NOT_JUDGED: "not judged for mould (glass or pipe)",
    MouldState.TOO_COLD: "too cold for mould growth now; watch for melt-water and mould when "
    "it warms",
    MouldState.TOO_HOT: "too hot for the mould criterion (above 40 °C)",
}
FACTOR_WORDS = {
    FactorState.MEETS: "meets the limit",
    FactorState.UNDER: "under the limit",
    FactorState.CANNOT_TELL: CANNOT_TELL,
    FactorState.NOT_JUDGED: "cannot be judged today",
    FactorState.NOT_APPLICABLE: "no limit for this room use",
    FactorState.NOT_FOR_ELEMENT: "not used for this kind of surface",
    FactorState.GROUND_CONTACT: "ground-contact element: temperature factor not judged "
    "against outdoor air",
    FactorState.DRYING_WET: "not judged while wet materials dry (evaporation cools the surface)",
    FactorState.WARMER_THAN_AIR: "not judged: warmer than the room air (heated, sunlit or "
    "beside a heat source)",
}
DRY_STANDARD_WORDS = {
    DryStandardState.AT: "at the dry standard",
    DryStandardState.ABOVE: "above the dry standard",
    DryStandardState.NO_REFERENCE: "no dry standard given",
}


def standard_visit_said(visit_index: int | None) -> str:
    """``", read on visit 2"`` for a dry standard read on an earlier visit than the reading
    judged against it (``visit_index`` as the finding carries it); "" for this visit's."""
    return "" if visit_index is None else f", read on visit {visit_index + 1}"


TIMBER_WORDS = {
    TimberState.DRY: "below the mould range for timber",
    TimberState.MOULD_RANGE: "in the mould range for timber",
    TimberState.DECAY_RANGE: "in the decay range for timber",
}

#: A material reading's state in brief, as a narrow table cell shows it (the long forms
#: above are for a sentence).
DRY_STANDARD_BRIEF = {
    DryStandardState.AT: "at standard",
    DryStandardState.ABOVE: "above standard",
    DryStandardState.NO_REFERENCE: "no standard",
}
TIMBER_BRIEF = {
    TimberState.DRY: "under mould range",
    TimberState.MOULD_RANGE: "mould range",
    TimberState.DECAY_RANGE: "decay range",
}


def material_state_words(m: MaterialFinding) -> str:
    """``"above the dry standard of 20, read on visit 1; in the decay range for timber"``
    (the standard in the reading's own scale)."""
    text = DRY_STANDARD_WORDS[m.dry_standard_state]
    if m.dry_standard is not None:
        text += f" of {m.dry_standard:g}" + standard_visit_said(m.dry_standard_visit)
    return text if m.timber_state is None else f"{text}; {TIMBER_WORDS[m.timber_state]}"


def material_state_brief(m: MaterialFinding) -> str:
    """``"above standard (visit 1's); decay range"``: :func:`material_state_words` in brief."""
    text = DRY_STANDARD_BRIEF[m.dry_standard_state]
    if m.dry_standard_visit is not None:
        text += f" (visit {m.dry_standard_visit + 1}'s)"
    return text if m.timber_state is None else f"{text}; {TIMBER_BRIEF[m.timber_state]}"


def material_rank(m: MaterialFinding) -> int | None:
    """How wet a material reading is, for its symbol on the scale of :func:`surface_rank`:
    2 above its dry standard or timber in the mould or decay range, 0 at its standard (or
    timber below the mould range with no standard); None where nothing judges it (no dry
    standard, not timber)."""
    timber = m.timber_state
    if m.dry_standard_state is DryStandardState.ABOVE or timber in (
        TimberState.MOULD_RANGE,
        TimberState.DECAY_RANGE,
    ):
        return 2
    if m.dry_standard_state is DryStandardState.AT or timber is TimberState.DRY:
        return 0
    return None


#: The kind of surface, as a table shows it.
ELEMENT_WORDS = {
    e: ("unspecified" if e == "other" else p.words) for e, p in th.ELEMENT_POLICY.items()
}


def _below_freezing(surface: SurfaceFinding) -> bool:
    return surface.surface_temp_c <= psychro.TRIPLE_POINT_C


def _with_span(words: Mapping[Any, str], state: Any, possible: Iterable[Any]) -> str:
    """A state in words; one the band cannot settle names the states it spans."""
    if state.value != "cannot_tell":
        return words[state]
    return f"{CANNOT_TELL}: " + " or ".join(words[p] for p in possible)


def _frost_point(surface: SurfaceFinding) -> bool:
    """The room air's condensation point is a frost point (below 0 °C)."""
    return surface.condensation_point_c <= psychro.TRIPLE_POINT_C


def condensation_text(surface: SurfaceFinding) -> str:
    """'clear of the dew point', 'frost forming now', 'unclear at this accuracy: …': the
    point named as the air's (a frost point below 0 °C), what forms as the surface's."""
    words = dict(FROST_WORDS if _frost_point(surface) else CONDENSATION_WORDS)
    words[CondensationState.CONDENSING] = (
        "frost forming now" if _below_freezing(surface) else "condensing now"
    )
    return _with_span(words, surface.condensation, surface.condensation_possible)


def mould_text(surface: SurfaceFinding) -> str:
    return _with_span(MOULD_WORDS, surface.mould, surface.mould_possible)


def factor_text(surface: SurfaceFinding, finding: RoomFinding, d: Display) -> str:
    text = _with_span(
        FACTOR_WORDS, surface.temperature_factor_state, surface.temperature_factor_possible
    )
    reason = factor_not_judged_reason(finding, d)
    if surface.temperature_factor_state is FactorState.NOT_JUDGED and reason:
        text += ": " + reason
    return text


def factor_not_judged_reason(finding: RoomFinding, d: Display) -> str | None:
    """Why the temperature factor cannot be judged today; None when it can be (or when the
    room use has no limit)."""
    if th.room_use(finding.use).frsi_key is None:
        return None
    least = th.value("frsi_min_temperature_difference_k")
    if finding.outdoor is None:
        return "no outdoor reading"
    difference = finding.air.dry_bulb_c - finding.outdoor.dry_bulb_c
    if difference <= 0.0:
        return (
            f"outdoors is as warm as inside or warmer ({d.difference(-difference)} warmer); "
            f"the factor needs the inside at least {d.difference(least, 0)} warmer"
        )
    if difference < least:
        return (
            f"the inside-outside difference is {d.difference(difference)}, under the "
            f"{d.difference(least, 0)} needed"
        )
    return None


def surface_rh_text(surface: SurfaceFinding) -> str:
    """Surface RH for a client: 100 % or more says what forms; a band only when it is one."""
    rh = surface.surface_rh_pct
    low, high = surface.surface_rh_low_pct, surface.surface_rh_high_pct
    if rh >= 100.0:
        what = "frost" if _below_freezing(surface) else "water"
        if surface.condensation is CondensationState.CONDENSING:
            return f"100 % or more ({what} forming)"
        # at the reading water forms, but not at the band's low end: say so, as the state does
        return f"100 % or more ({low:.0f} % or more at this accuracy: {what} may be forming)"
    if f"{low:.0f}" == f"{min(high, 100.0):.0f}" == f"{rh:.0f}":
        return f"{rh:.0f} %"
    if high >= 100.0:
        return f"{rh:.0f} % ({low:.0f} % or more)"
    return f"{rh:.0f} % ({low:.0f}–{high:.0f})"


def short_verdict(surface: SurfaceFinding, d: Display) -> str:
    """A few words per surface for a summary: what forms, mould, the factor."""
    what = "frost" if _below_freezing(surface) else "water"
    point = "frost point" if _frost_point(surface) else "dew point"
    margin = d.difference(th.value("dew_point_margin_k"))
    parts = []
    condensation, possible = surface.condensation, surface.condensation_possible
    if condensation is CondensationState.CONDENSING:
        parts.append(f"{what} forming")
    elif condensation is CondensationState.NEAR:
        parts.append(f"within {margin} of the {point}")
    elif condensation is CondensationState.CANNOT_TELL:
        parts.append(
            f"{what} may be forming"
            if CondensationState.CONDENSING in possible
            else f"may be within {margin} of the {point}"
        )
    else:
        parts.append(f"clear of the {point}")
    mould, mould_possible = surface.mould, surface.mould_possible
    if mould is MouldState.CANNOT_TELL:
        parts.append(
            "may be above the mould limit"
            if MouldState.ABOVE in mould_possible
            else "may be approaching the mould limit"
        )
    elif mould is not MouldState.NOT_JUDGED:
        parts.append(MOULD_WORDS[mould])
    state = surface.temperature_factor_state
    if state is FactorState.UNDER:
        parts.append("temperature factor under the limit")
    elif state is FactorState.CANNOT_TELL:
        factor, limit = surface.temperature_factor, surface.temperature_factor_limit
        if factor is not None and limit is not None and factor >= limit:
            parts.append(
                f"temperature factor {factor:.2f}, meets the {limit:.2f} limit "
                f"(only the edge of its accuracy band reaches below: no action needed)"
            )
        else:
            parts.append("temperature factor may be under the limit")
    return "; ".join(parts)


def surface_rank(s: SurfaceFinding) -> int:
    """How bad a surface is, for its symbol: 0 clear, 1 near a limit, 2 over the mould limit
    or not settled, 3 condensing."""
    if s.condensation.rank is None:
        condensation = 2
    else:
        condensation = s.condensation.rank + (1 if s.condensation.rank == 2 else 0)
    mould = s.mould.rank if s.mould.rank is not None else 1 if s.mould.value == "cannot_tell" else 0
    return max(condensation, mould)


_SEVERITY = {
    CondensationState.CONDENSING: 3,
    CondensationState.CANNOT_TELL: 2,
    CondensationState.NEAR: 1,
    CondensationState.CLEAR: 0,
}
_MOULD_SEVERITY = {MouldState.ABOVE: 3, MouldState.CANNOT_TELL: 2, MouldState.APPROACHING: 1}


def worst_first(surfaces: Iterable[SurfaceFinding]) -> list[SurfaceFinding]:
    """Surfaces ordered worst first: by :func:`surface_rank` (condensing first), then by
    condensation and mould together, then the coldest. The first is the surface a room's
    worst finding speaks of, in every face."""
    return sorted(
        surfaces,
        key=lambda s: (
            -surface_rank(s),
            -_SEVERITY[s.condensation] - _MOULD_SEVERITY.get(s.mould, 0),
            s.surface_temp_c,
        ),
    )


def worst_surface(surfaces: Iterable[SurfaceFinding]) -> SurfaceFinding | None:
    """The first of :func:`worst_first`; None with no surface."""
    ordered = worst_first(surfaces)
    return ordered[0] if ordered else None


def no_limit_reason(finding: RoomFinding) -> str:
    """Why a room has no highest safe RH (when :func:`rh_limit_text` gives None)."""
    if not finding.surfaces:
        return "no surface measured"
    setting = [s for s in finding.surfaces if th.ELEMENT_POLICY[s.element].sets_room_target]
    if setting and all(s.surface_temp_c > finding.air.dry_bulb_c for s in setting):
        return (
            "every wall, ceiling or floor measured was warmer than the room air (heated, "
            "sunlit or beside a heat source) and cannot show how cold the fabric gets"
        )
    return "no wall, ceiling or floor measured"


def rh_limit_text(finding: RoomFinding) -> str | None:
    """'38 % (35 to 41 % at this accuracy)'; None when no surface sets it (see
    :func:`no_limit_reason`). Only surfaces at or below the air temperature set it, so it is
    always under 100 %."""
    top = finding.max_room_rh_pct
    if top is None:
        return None
    shown = round_down_rh(top)
    low, high = (
        round_down_rh(finding.max_room_rh_low_pct or top),
        round_down_rh(finding.max_room_rh_high_pct or top),
    )
    if low == high == shown:
        return f"{shown} %"
    return f"{shown} % ({low} to {high} % at this accuracy)"


# --- humidity classes ------------------------------------------------------------------------

#: Words for the class above class 5.
ABOVE_CLASS_5_TEXT = "above class 5"
#: What EN ISO 13788 Annex A gives as typical of each class (from memory).
HUMIDITY_CLASS_EXAMPLES: dict[int, str] = {
    1: "unoccupied buildings, dry storage",
    2: "offices, dwellings with normal occupancy and ventilation",
    3: "buildings with unknown occupancy",
    4: "sports halls, kitchens, canteens",
    5: "laundries, breweries, swimming pools",
    th.BEYOND_CLASS_5: "more than laundries and swimming pools produce",
}


def humidity_class_text(number: int | None) -> str:
    """Words for a class number from :func:`survey.thresholds.humidity_class`."""
    if number is None:
        return "not judged (outdoor air too warm)"
    if number == th.BEYOND_CLASS_5:
        return ABOVE_CLASS_5_TEXT
    return f"class {number}"


def humidity_class_range_text(possible: Iterable[int]) -> str:
    """Words for the classes a band spans: ``'class 3'``, ``'class 3 or 4'``, ``'class 2
    to 4'``, ``'class 5 or above class 5'``, ``'class 3 to 5 or above class 5'``."""
    numbers = sorted(set(possible))
    if not numbers:
        return "not judged"
    above = numbers[-1] == th.BEYOND_CLASS_5
    plain = [n for n in numbers if n != th.BEYOND_CLASS_5]
    if not plain:
        return ABOVE_CLASS_5_TEXT
    if len(plain) == 1:
        text = f"class {plain[0]}"
    elif len(plain) == 2:
        text = f"class {plain[0]}, {plain[1]}" if above else f"class {plain[0]} or {plain[1]}"
    else:
        text = f"class {plain[0]} to {plain[-1]}"
    return f"{text} or {ABOVE_CLASS_5_TEXT}" if above else text


def timber_emc_text(finding: RoomFinding, d: Display) -> str:
    """What moisture content timber settles at in the room air, or why it is not said."""
    if finding.timber_emc_pct is None:
        return (
            f"Timber moisture in this air is not estimated: the Wood Handbook equation "
            f"(eqn 4-5) is used only from "
            f"{d.temperature(th.value('timber_emc_equation_min_c'), 0)} to "
            f"{d.temperature(th.value('timber_emc_equation_max_c'), 0)} and up to "
            f"{th.value('timber_emc_equation_max_rh_pct'):g} % RH; measure the timber "
            f"with a pin meter instead."
        )
    return (
        f"Timber in this air settles at about {finding.timber_emc_pct:.1f} % moisture "
        f"content (Wood Handbook eqn 4-5)."
    )


def point_words(kind: str, material: str) -> str:
    """A point named by its kind: "surface", or "plasterboard reading"."""
    return "surface" if kind == "surface" else f"{material} reading"
