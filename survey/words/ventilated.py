"""A ventilated space (a loft, a crawl space) in words: it follows outdoor air, so the cure
is to cut the moisture reaching it from below and keep its timbers out of the decay range."""

from __future__ import annotations

from survey import thresholds as th
from survey.advise.kinds import VentilatedSpaceNumbers
from survey.words.basis import _pct
from survey.words.display import Display


def _ventilated_space(n: VentilatedSpaceNumbers, d: Display) -> str:
    decay = th.value("timber_decay_mc_pct")
    slow = th.value("timber_decay_slow_below_c")
    if n.loft:
        text = (
            f"The loft is at {_pct(n.room_rh_pct)} RH. A ventilated loft follows outdoor "
            "air: dry it by cutting the moisture coming up from the rooms below: seal gaps "
            "around the hatch (fit a draught seal), ceiling lights, pipes and cables, and "
            "make sure no extract fan, tumble-drier or soil vent discharges into the loft "
            "(duct them to outside). Check the eaves and ridge ventilation is open and "
            "not blocked by insulation."
        )
    else:
        text = (
            f"The crawl space is at {_pct(n.room_rh_pct)} RH. A ventilated crawl space "
            "follows outdoor air: dry it by cutting the moisture coming in: lay a ground "
            "vapour barrier (polyethylene sheet, lapped and taped, held down), fix leaks "
            "and drainage that bring water in, and check the air bricks or vents are open "
            "and clear."
        )
    if n.keep_vents_closed:
        why = []
        point = (
            "frost point"
            if n.outdoor_dew_point_c is not None and n.outdoor_dew_point_c <= 0.01
            else "dew point"
        )
        if n.outdoor_wetter_than_space:
            why.append("outdoor air holds more water than the space")
        if n.outdoor_dew_point_above_coldest_surface:
            why.append(
                f"outdoor air's {point} ({d.temperature(n.outdoor_dew_point_c)}) is above the "
                f"space's coldest measured surface ({d.temperature(n.coldest_surface_temp_c)})"
            )
        sealed = (
            "vents closed for good and the ceiling below sealed"
            if n.loft
            else "vents closed for good, a ground vapour barrier"
        )
        dry_with = (
            "a desiccant dehumidifier (a refrigerant one ices up in air this cold)"
            if n.room_temp_c is not None
            and n.room_temp_c < th.value("refrigerant_dehumidifier_min_c")
            else "a dehumidifier"
        )
        text += (
            " Today " + " and ".join(why) + ": air let in through the vents would add "
            "water and condense on cold surfaces, so do not open more vents now. Either "
            f"keep the vents closed while outdoor air is this humid and dry the closed "
            f"space with {dry_with}, or have it sealed and conditioned ({sealed}, and "
            "dehumidified or conditioned air), designed by someone who can check the "
            "combustion air of any appliance in or above the space."
        )
    text += (
        " A dehumidifier helps only if the space is sealed (closed off from outdoor air): "
        "in a space open to outdoor air it would spend its effort on the outdoor air "
        "streaming through. Measure the timber with a pin moisture meter (wood scale): "
        f"decay fungi need about {decay:.0f} % moisture content or more."
    )
    for t in n.timber_surfaces or ():
        name = t.surface[:1].upper() + t.surface[1:]
        if t.emc_pct is None:
            text += (
                f" {name} at {d.temperature(t.surface_temp_c)} and "
                f"{_pct(t.surface_rh_pct)} surface RH is too wet for the Wood Handbook "
                f"equation (used up to "
                f"{th.value('timber_emc_equation_max_rh_pct'):g} % RH): its moisture is "
                f"not estimated; it may well be in the decay range, so measure it."
            )
            continue
        sentence = (
            f" {name} at {d.temperature(t.surface_temp_c)} and "
            f"{_pct(t.surface_rh_pct)} surface RH would settle at about "
            f"{t.emc_pct:.1f} % moisture content (Wood Handbook eqn 4-5 at the "
            f"surface)"
        )
        if t.emc_pct >= decay:
            sentence += f": in the decay range (above about {decay:.0f} %)"
        else:
            sentence += f": below the {decay:.0f} % decay range, but check it with the meter"
        if t.surface_temp_c < slow:
            sentence += (
                f"; below {d.temperature(slow)} decay is slower, not stopped, and "
                "speeds up when it warms"
            )
        text += sentence + "."
    return text
