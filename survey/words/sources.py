"""Moisture sources, drying to the dry standard, repeat readings, contaminated water in words."""

from __future__ import annotations

from survey import thresholds as th
from survey.advise.kinds import (
    FindSourceNumbers,
    KeepDryingNumbers,
    MaterialPoint,
    RemoveContaminatedNumbers,
    RepeatReadingsNumbers,
    SourceReason,
)
from survey.safe_text import visible
from survey.words.display import Display
from survey.words.states import (
    USE_PHRASE,
    humidity_class_range_text,
    humidity_class_text,
    standard_visit_said,
)


def _remove_contaminated(n: RemoveContaminatedNumbers, d: Display) -> str:
    degraded = ""
    if n.degraded:
        degraded = (
            f" The water was recorded as category {n.water_category}, but it has stood "
            f"for about {n.water_standing_h:g} h: long enough to be treated as "
            f"category {n.effective_category}."
        )
    porous = ""
    if n.porous_materials:
        porous = (
            " Porous materials read here ("
            + ", ".join(visible(m) for m in n.porous_materials)
            + ") are among them."
        )
    movers = (
        " Stop the air movers now: air blown across contaminated material spreads it "
        "through the building."
        if n.stop_air_movers
        else ""
    )
    return (
        f"Category {n.effective_category} water (grossly contaminated: sewage, flood or "
        f"long-standing water) reached this room.{degraded} Porous materials it soaked — "
        "plasterboard, carpet and underlay, insulation, fibreboard, soft furnishings — are "
        "removed and bagged, not dried." + porous + " Before work: contain the area (sheeting, "
        "the doors to the rest of the building closed), and wear protective equipment "
        "(gloves, boots, eye protection and a respirator); no air movement across "
        "contaminated material until it is removed and the area cleaned. This is work for "
        "trained, licensed contractors." + movers + " Dry only what remains once that is "
        "done."
    )


# --- sources, drying and repeat readings ---------------------------------------------------


def _materials(points: tuple[MaterialPoint, ...]) -> str:
    return ", ".join(
        f"{m.label} {m.value:g} against {m.dry_standard:g}"
        + standard_visit_said(m.dry_standard_visit)
        + f" (dry once at or below {m.dry_at_or_below:.3g})"
        for m in points
    )


def _source_reason(reason: SourceReason, n: FindSourceNumbers, d: Display) -> str:
    if reason is SourceReason.WET_MATERIALS:
        return (
            "material readings above the dry standard ("
            + _materials(n.wet)
            + "); once the source is dealt with, dry them until the readings reach the dry "
            "standard"
        )
    if reason is SourceReason.DAMP_TIMBER:
        return (
            "timber wetter than the room air can explain ("
            + ", ".join(
                f"{t.label} {t.value_pct:g} % against {t.emc_pct:.1f} % in equilibrium with the air"
                for t in n.damp_timber
            )
            + ")"
        )
    if reason is SourceReason.TIMBER_DECAY:
        return (
            f"timber at or above the {th.value('timber_decay_mc_pct'):.0f} % moisture "
            "content at which decay fungi grow ("
            + ", ".join(f"{t.label} {t.value_pct:g} %" for t in n.decaying)
            + "): have it checked for rot"
            + (" — decay is slow at today's temperature, not stopped" if n.decay_slowed else "")
        )
    if reason is SourceReason.WATER_PRESENT:
        return (
            "water present in the room"
            if n.water_category is None
            else f"category {n.water_category} water in the room"
        )
    if reason is SourceReason.CONDENSATION_SEEN_NOT_MEASURED:
        return "condensation was seen, but no surface was measured"
    if reason is SourceReason.CONDENSATION_SEEN_SURFACES_CLEAR:
        return (
            "condensation was seen, but the measured surfaces are clear of the dew point: "
            "it may come from moments of higher humidity (cooking, drying laundry) or from "
            "water getting in"
        )
    if reason is SourceReason.MOULD_SEEN_NOT_MEASURED:
        return "mould is visible, but no wall, ceiling, floor or frame was measured"
    if reason is SourceReason.MOULD_SEEN_SURFACES_BELOW:
        return (
            "mould is visible, but the measured surfaces are below the mould limit today: "
            "look for a leak, damp coming through the wall, or times of higher humidity"
        )
    if reason is SourceReason.MUSTY_SMELL:
        return "a musty smell, which can mean hidden mould behind linings, under floors or in voids"
    phrase = USE_PHRASE[n.use]
    expected = (
        f"more than {phrase} should produce"
        if phrase is not None
        else "more than ordinary occupied rooms produce"
    )
    return (
        f"the room air holds {d('vapour_pressure', n.vapour_pressure_excess_pa)} more "
        f"vapour pressure than outdoors, "
        f"{humidity_class_range_text(n.humidity_class_possible or ())} of EN ISO 13788 — "
        f"{expected} (look for laundry drying indoors, unflued heaters, a blocked or missing "
        f"extract, or a leak)"
    )


def _find_source(n: FindSourceNumbers, d: Display) -> str:
    return (
        "Find and deal with the source of moisture before drying or decorating: "
        + "; ".join(_source_reason(r, n, d) for r in n.reasons)
        + "."
    )


def _keep_drying(n: KeepDryingNumbers) -> str:
    tolerance = th.value("dry_standard_tolerance_fraction")
    parts = []
    if n.materials:
        parts.append(
            "these readings are still above the dry standard (the same material in an "
            f"unaffected area, allowing {tolerance * 100:.0f} %): " + _materials(n.materials)
        )
    if n.damp_timber:
        parts.append(
            "timber is still wetter than the room air explains ("
            + ", ".join(
                f"{t.label} {t.value_pct:g} % against {t.emc_pct:.1f} %" for t in n.damp_timber
            )
            + ")"
        )
    if n.decaying:
        parts.append(
            f"timber at or above the {th.value('timber_decay_mc_pct'):.0f} % moisture "
            "content at which decay fungi grow ("
            + ", ".join(f"{t.label} {t.value_pct:g} %" for t in n.decaying)
            + "): have it checked for rot"
            + (" — decay is slow at today's temperature, not stopped" if n.decay_slowed else "")
        )
    return (
        "Continue drying until readings reach the dry standard: "
        + "; ".join(parts)
        + ". Keep the drying equipment running, take readings at the same spots on each "
        "visit, and do not close up, refit or decorate until every reading is there. If "
        "readings stop falling from one visit to the next, look for water still getting "
        "in."
    )


def _repeat(n: RepeatReadingsNumbers, d: Display) -> str:
    excess = d("vapour_pressure", n.vapour_pressure_excess_pa)
    if n.wet_room_peak:
        low, high = n.reread_after_use_minutes or (0.0, 0.0)
        what = "a shower or bath" if n.use == "bathroom" else "cooking"
        return (
            f"The room air holds {excess} more vapour pressure than outdoors, "
            f"{humidity_class_text(n.humidity_class)} of EN ISO 13788, but in "
            f"{USE_PHRASE[n.use]} a high reading is usually the normal peak after {what}, "
            f"not a hidden source. Have an extract fan that clears it: sized to the local "
            f"code's minimum extract rate (UK Approved Document F and ASHRAE 62.2 set "
            f"minimum extract rates; from memory, check local code), with an overrun timer "
            f"or a humidistat so it keeps running after use, and the door kept shut "
            f"meanwhile. Take a re-reading {low:.0f}-{high:.0f} min after use; if the room "
            f"is still this humid then, look for a blocked or missing extract, laundry "
            f"drying or a leak."
        )
    high_class = int(th.value("humidity_class_high")) + (1 if th.room_use(n.use).wet_room else 0)
    phrase = USE_PHRASE[n.use]
    expected = (
        f"more than {phrase} should produce"
        if phrase is not None
        else "more than ordinary occupied rooms produce"
    )
    band = d("vapour_pressure", n.vapour_pressure_excess_uncertainty_pa)
    return (
        f"The humidity class may be high: the room air holds {excess} (± {band}) more "
        f"vapour pressure than outdoors, "
        f"{humidity_class_range_text(n.humidity_class_possible or ())} "
        f"of EN ISO 13788 at this instrument accuracy, and class {high_class} or above "
        f"would be {expected}. One spot reading cannot settle it: repeat the readings on "
        f"other days, or log the room for a week or two, before looking for a hidden "
        f"source."
    )
