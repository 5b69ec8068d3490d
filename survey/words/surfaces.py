"""Cold surfaces in words: walls to be made warmer, panes and frames, pipes."""

from __future__ import annotations

from survey import thresholds as th
from survey.advise.kinds import (
    ColdSurfaceNumbers,
    Forming,
    RaiseSurfaceNumbers,
)
from survey.safe_text import visible
from survey.words.basis import _limit_phrase, _pct
from survey.words.display import Display, round_down_rh

# --- surfaces --------------------------------------------------------------------------------

_REMEDY = {
    "internal_wall": (
        "keep the room heated steadily and furniture off it. An internal wall "
        "this cold usually backs onto an unheated space or a chimney, or hides "
        "a leak or a cold bridge: find out which before treating it."
    ),
    "floor": (
        "keep the room heated steadily, keep rugs and stored things off the coldest "
        "part, and have the floor insulation, the slab edge or a thermal bridge "
        "investigated."
    ),
    "ceiling": (
        "keep the room heated steadily, and have the insulation above it (gaps in "
        "the loft insulation, a cold eaves corner) or a thermal bridge investigated."
    ),
    "other": (
        "keep the room heated steadily, keep furniture and stored things off cold "
        "walls, and have the insulation, thermal bridge or cold corner investigated."
    ),
}


def _raise_surface(n: RaiseSurfaceNumbers, d: Display) -> str:
    mould_limit = th.value("surface_rh_mould_limit_pct")
    floor = th.value("room_rh_floor_pct")
    reasons = []
    if n.too_cold:
        reasons.append(
            f"it stays at or below {_pct(mould_limit)} surface RH only while the room "
            f"is below {_pct(n.max_room_rh_pct)}, under the {_pct(floor)} that can "
            f"be held in practice"
        )
    if n.factor_under:
        reasons.append(
            f"its temperature factor is {n.temperature_factor:.2f} "
            f"(±{n.temperature_factor_uncertainty:.2f}), under "
            f"{_limit_phrase(n.use, n.temperature_factor_limit or 0.0)}"
            + (
                " at the reading, though within the instruments' accuracy of it"
                if n.factor_unclear
                else ""
            )
            + ", which today means a surface of at least "
            f"{d.minimum_temperature(n.surface_temp_for_factor_limit_c)}"
        )
    if n.drying_wet:
        reasons.append(
            "it is wet and below the dew point now: water forms on it, and "
            "evaporation from the wet material keeps it cold while it dries"
        )
    design = _pct(n.design_rh_pct)
    text = (
        f"{visible(n.surface)} is too cold at {d.temperature(n.surface_temp_c)}: "
        + "; ".join(reasons)
        + ". "
        f"Raise it to at least {d.minimum_temperature(n.target_surface_temp_c)} "
        + (
            f"(the factor limit; {d.minimum_temperature(n.surface_temp_for_target_rh_c)} "
            f"would do for {design} room RH alone) "
            if n.target_surface_temp_c > n.surface_temp_for_target_rh_c
            else ""
        )
        + f"so the room can be kept at {design} without mould risk"
        + (
            f" (until then, at no more than {round_down_rh(n.max_room_rh_pct)} %): "
            if n.max_room_rh_pct < n.design_rh_pct and not n.too_cold
            else ": "
        )
    )
    if n.ground_contact:
        text += (
            "keep the space heated steadily and the air dry, and keep stored things off "
            "the coldest part. This surface is in contact with the ground, which sets "
            "its temperature: its temperature factor is not judged against outdoor air."
        )
    else:
        text += _REMEDY.get(n.element, _REMEDY["other"])
    if n.dehumidifier_cannot_cure:
        text += (
            f" A dehumidifier cannot cure this: even at {_pct(floor)}, the lowest RH it "
            f"is practical to hold, the surface would stay above the mould limit."
        )
    if n.drying_wet:
        text += (
            " While it dries, keep the room warm and the drying going; judge the surface "
            "again once the material reads dry."
        )
    if n.factor_under:
        text += (
            " The factor comes from one reading: confirm it on another cold day, or with "
            "a thermal image, before building work."
        )
    return text


def _point(n: ColdSurfaceNumbers) -> tuple[str, str]:
    """(the room air's condensation point by its name, what forms on this surface): the
    point is a frost point when it lies below 0 °C; what forms on a surface below 0 °C is
    frost."""
    point = "frost point" if n.condensation_point_c <= 0.01 else "dew point"
    return point, ("frost" if n.frost else "water")


def _forming(n: ColdSurfaceNumbers) -> str:
    point, what = _point(n)
    if n.forming is Forming.NOW:
        return f"{what} forms on it"
    return (
        f"{what} may form on it (at this instrument accuracy the reading cannot be told "
        f"apart from the {point})"
    )


def _stays_dry(n: ColdSurfaceNumbers, d: Display) -> str:
    dry = round_down_rh(n.max_room_rh_pct_dry)
    what = "free of frost" if n.frost else "dry"
    text = f"It stays {what} only while the room is below {dry} %"
    room = n.room_rh_pct
    if room is not None and room <= n.target_rh_pct and room < n.max_room_rh_pct_dry:
        # the room is there already: a lower target would not be "once the room is down"
        if n.forming is Forming.NO:
            return text + f", and the room is below that now, at {_pct(room)}."
        return (
            text + f"; the room is at {_pct(room)} now, too close to that to rely on at this "
            "instrument accuracy."
        )
    if dry >= n.target_rh_pct:
        return text + f", so once the room is down to {_pct(n.target_rh_pct)} it stays {what}."
    return (
        text + f"; at {_pct(n.target_rh_pct)} it would need to be at least "
        f"{d.minimum_temperature(n.surface_temp_to_stay_dry_c)}."
    )


def _glazing(n: ColdSurfaceNumbers, d: Display) -> str:
    point, _ = _point(n)
    glass = n.element == "glazing"
    vents = "" if n.drying else "keep trickle vents open, "
    text = (
        f"{n.surface} ({'glass' if glass else 'window frame'}) is at "
        f"{d.temperature(n.surface_temp_c)}"
    )
    if n.forming is not Forming.NO:
        text += (
            f", against a {point} of {d.temperature(n.condensation_point_c)}: "
            f"{_forming(n)}. {_stays_dry(n, d)} "
        )
        if glass:
            text += (
                "On single glazing some condensation is expected in cold weather: it is "
                "no reason to hold the room drier than is practical; consider secondary or "
                "double glazing, which keeps the inner pane warmer. On double glazing a "
                "pane this cold suggests a failed or poor unit (misting between the panes "
                "means a failed seal): have it checked or replaced. Wipe the glass and "
                f"sill dry each morning, {vents}and keep curtains or blinds clear of the "
                "glass at night."
            )
        else:
            text += (
                "Window frames, metal ones above all, run colder than the walls around "
                "them, and some condensation on them in cold weather is expected: it is "
                "no reason to hold the room drier than is practical. Wipe frames and sills "
                f"dry, {vents}and consider secondary glazing or frames with a thermal "
                "break."
            )
    else:
        text += "."
    if n.mouldy:
        text += (
            " Its surface RH is above the mould limit: check frames and seals for mould, "
            "clean any off with detergent and water (gloves and an FFP2 / N95 "
            "respirator), and check the sill and reveal for rot and damp."
        )
    else:
        text += " Check frames, seals and the sill for mould and rot where water runs down."
    return text


def _pipe(n: ColdSurfaceNumbers, d: Display) -> str:
    point, _ = _point(n)
    return (
        f"{n.surface} is at {d.temperature(n.surface_temp_c)}, against a {point} of "
        f"{d.temperature(n.condensation_point_c)}: {_forming(n)}, and it can drip onto "
        f"floors, joists and linings. Lag it with closed-cell pipe insulation, joints and "
        f"ends taped so that room air cannot reach the cold pipe underneath (open, fibrous "
        f"lagging on a cold pipe gets wet), and check below it for wet timber or plaster. "
        f"{_stays_dry(n, d)}"
    )
