"""A dehumidifier's performance check in words: what was measured, how it compares with
its rating, what was found, and the caution that a rating is not a site figure.

Every sentence the app, ``survey check-dehumidifier`` and the report show of a
:class:`survey.equipment.DehumidifierResult` comes from here, in a :class:`Display`'s units.
"""

from __future__ import annotations

from survey import equipment as eq
from survey import thresholds as th
from survey.advise import Caution
from survey.equipment import DehumidifierResult, FindingKind, RatingPoint, StoredUnit
from survey.safe_text import visible
from survey.words.basis import _pct
from survey.words.cautions import CLOSING_TEXT, caution_text
from survey.words.display import Display
from survey.words.limits import limit_value_text

_LB_PER_MIN_PER_KG_PER_S = 60.0 / eq.POUND_KG

#: Which rating each test condition is, in a phrase.
RATING_NAMES = {
    "26.7c_60": "the older US rating (AHAM DH-1)",
    "18.3c_60": "the current US rating (DOE test procedure, Appendix X1)",
    "22.8c_60": "the US whole-home rating (DOE test procedure, Appendix X1)",
    "27c_60": "the European rating (EN 810)",
    "30c_80": "a maker's data-sheet figure at warm, wet air (no standard defines it)",
}
_US_RATINGS = frozenset({"26.7c_60", "18.3c_60", "22.8c_60"})

#: How the cooling capacity and the COP are worked out, for a method section or help.
COOLING_BASIS = (
    "Cooling capacity: the dry-air flow the water and the humidity-ratio drop imply "
    "(water collected ÷ the drop × the hours), times the enthalpy of the air going in less "
    "that of air saturated at the outlet's humidity ratio (the coil state, at the outlet's "
    "dew point); latent is the part from the water taken out, sensible the cooling to the "
    "coil, less the enthalpy the condensed water carries away as liquid at the coil "
    "temperature (about 1 % of it). Enthalpies by ASHRAE Fundamentals 2017 ch. 1 eqn 30 "
    "(psychrolib). COP: that cooling over the unit's mean electrical power, fan included."
)


def unit_name(label: str) -> str:
    """The unit as named in a sentence: its label, or 'The dehumidifier'."""
    return visible(label.strip()) if label.strip() else "The dehumidifier"


def _hr(d: Display, kg_per_kg: float) -> str:
    return d("humidity_ratio", kg_per_kg)


def _drop(d: Display, kg_per_kg: float) -> str:
    """A humidity-ratio drop with the other unit beside it: g/kg and gr/lb both."""
    g_per_kg = f"{kg_per_kg * 1000.0:.2f} g/kg"
    grains = f"{kg_per_kg * 7000.0:.1f} gr/lb"
    return f"{grains} ({g_per_kg})" if d.ip else f"{g_per_kg} ({grains})"


def _amount(d: Display, litres: float, note: str = "") -> str:
    """A quantity of water: '18.0 L (38.0 US pints)' or '38.0 US pints (18.0 L)'; ``note``
    goes inside the brackets."""
    pints = litres / eq.US_PINT_L
    if d.ip:
        return f"{pints:.1f} US pints ({litres:.1f} L{note})"
    return f"{litres:.1f} L ({pints:.1f} US pints{note})"


def _rate(d: Display, litres_per_day: float) -> str:
    pints = litres_per_day / eq.US_PINT_L
    litres = f"{litres_per_day:.1f} L/day"
    return (
        f"{pints:.1f} US pints/day ({litres})" if d.ip else f"{litres} ({pints:.1f} US pints/day)"
    )


def _mass_flow(d: Display, kg_per_s: float) -> str:
    if d.ip:
        return f"{kg_per_s * _LB_PER_MIN_PER_KG_PER_S:.1f} lb/min"
    return f"{kg_per_s:.3f} kg/s"


def _cooling(d: Display, watts: float) -> str:
    return d.heat(watts) if d.ip else f"{watts / 1000.0:.2f} kW"


def _air(d: Display, temp_c: float, rh_pct: float, w: float) -> str:
    return f"{d.temperature(temp_c)} at {_pct(rh_pct)} RH ({_hr(d, w)})"


def rating_condition_text(point: RatingPoint, d: Display) -> str:
    """'80 °F (26.7 °C) and 60 % RH, the older US rating (AHAM DH-1)'."""
    temp = (
        d.nominal_temperature(point.dry_bulb_c)
        if point.key in _US_RATINGS
        else d.temperature(point.dry_bulb_c)
    )
    return f"{temp} and {_pct(point.rh_pct)} RH, {RATING_NAMES[point.key]}"


def measured_lines(r: DehumidifierResult, d: Display) -> list[str]:
    """What was measured and worked out, one sentence each."""
    g = r.given
    inlet_note = (
        " (the room's air reading, taken as the air going in)" if g.inlet_is_room_air else ""
    )
    timed = all(p.at_h is not None for p in g.readings)
    mean = "time mean" if timed else "mean"
    several = f" ({mean} of {len(r.states)} readings)" if len(r.states) > 1 else ""
    i, o = r.inlet, r.outlet
    first = (
        f"Air in{several}: {_air(d, i.dry_bulb_c, i.rh_pct, i.humidity_ratio_kg_per_kg)}"
        f"{inlet_note}; air out: "
        f"{_air(d, o.dry_bulb_c, o.rh_pct, o.humidity_ratio_kg_per_kg)}. "
        + _change_text(d, r.humidity_ratio_drop_kg_per_kg)
    )
    lines = [first]
    if g.water_l is not None:
        weighed = (
            f"; weighed, at {limit_value_text(th.get('water_density_kg_per_l'), d)}"
            if g.water_weighed
            else ""
        )
        text = f"Water collected: {_amount(d, g.water_l, weighed)}"
        if g.duration_h is not None:
            text += f" in {_small(g.duration_h, 1)} h{_duration_basis(g.duration_source)}"
            if r.removal_l_per_day is not None:
                text += f": {_rate(d, r.removal_l_per_day)}"
        lines.append(text + ".")
    if r.energy_kwh is not None and r.mean_power_w is not None:
        text = f"Energy used: {_small(r.energy_kwh, 2)} kWh ({r.mean_power_w:.0f} W on average)"
        if r.energy_factor_l_per_kwh is not None:
            text += f": an energy factor of {r.energy_factor_l_per_kwh:.2f} L/kWh"
        lines.append(text + ".")
    elif g.power_w is not None:
        lines.append(f"Power draw: {g.power_w:.0f} W.")
    if r.air_mass_flow_kg_per_s is not None and r.air_volume_flow_m3_per_h is not None:
        lines.append(
            f"The water and the drop imply {_mass_flow(d, r.air_mass_flow_kg_per_s)} of dry "
            f"air through the unit, about {d('airflow', r.air_volume_flow_m3_per_h)} of the "
            f"air going in."
        )
    if r.cooling_capacity_w is not None and r.coil is not None:
        text = (
            f"Its coil cools that air to saturation at {d.temperature(r.coil.dry_bulb_c)} "
            f"(the outlet's dew point): {_cooling(d, r.cooling_capacity_w)} of cooling, "
            f"{_cooling(d, r.latent_cooling_w or 0.0)} latent and "
            f"{_cooling(d, r.sensible_cooling_w or 0.0)} sensible"
        )
        if r.cop is not None and r.mean_power_w is not None:
            text += f"; a COP of {r.cop:.1f} on the {r.mean_power_w:.0f} W it draws"
        lines.append(text + ".")
    if g.kind == "desiccant":
        lines.append(
            "A desiccant unit has no refrigeration cycle: no coil cooling or COP is worked "
            "out for it; its energy factor is the figure to compare."
        )
    return lines


def _change_text(d: Display, drop: float) -> str:
    """The humidity ratio's change across the unit: a fall is the grain depression."""
    if drop < 0.0:
        return f"The humidity ratio rises by {_drop(d, -drop)} across the unit."
    return f"The humidity ratio falls by {_drop(d, drop)} across the unit (the grain depression)."


def _small(value: float, places: int) -> str:
    """A number to ``places`` decimals, or to two significant figures when that would show
    it as 0 (0.01 h, 0.00001 kWh)."""
    text = f"{value:.{places}f}"
    return f"{value:.2g}" if value and float(text) == 0.0 else text


def _duration_basis(source: str | None) -> str:
    return {
        "since_previous_reading": " (since its reading on the previous visit)",
        "since_previous_visit": " (since the previous visit began)",
    }.get(source or "", "")


def comparison_lines(r: DehumidifierResult, d: Display) -> list[str]:
    """Measured against the rating and against the rating scaled to the site air."""
    c = r.comparison
    if c is None:
        return []
    lines = []
    at = (
        "at an unrecorded test condition"
        if c.condition is None
        else f"at {rating_condition_text(c.condition, d)}"
    )
    if c.rated_capacity_l_per_day is not None:
        text = f"Rated {_rate(d, c.rated_capacity_l_per_day)} {at}"
        if c.removal_of_rated is not None:
            text += f"; measured {_pct(100 * c.removal_of_rated)} of it"
        lines.append(text + ".")
    if c.rated_energy_factor_l_per_kwh is not None:
        text = f"Rated energy factor {c.rated_energy_factor_l_per_kwh:.2f} L/kWh"
        if c.energy_factor_of_rated is not None:
            text += f"; measured {_pct(100 * c.energy_factor_of_rated)} of it"
        lines.append(text + ".")
    if c.site_scale is not None and c.rating_air is not None:
        expected = []
        if c.expected_removal_l_per_day is not None:
            expected.append(f"about {_rate(d, c.expected_removal_l_per_day)}")
        if c.expected_energy_factor_l_per_kwh is not None:
            expected.append(f"an energy factor near {c.expected_energy_factor_l_per_kwh:.2f} L/kWh")
        measured = []
        if c.removal_of_expected is not None:
            measured.append(f"{_pct(100 * c.removal_of_expected)} of that removal")
        if c.energy_factor_of_expected is not None:
            measured.append(f"{_pct(100 * c.energy_factor_of_expected)} of that energy factor")
        text = (
            f"At this air a unit of this rating can be expected to give "
            f"{_pct(100 * c.site_scale)} of it: " + " and ".join(expected)
        )
        if measured:
            text += "; it gives " + " and ".join(measured)
        lines.append(text + ".")
    return lines


def rating_caution(r: DehumidifierResult, d: Display) -> str:
    """Why a site figure differs from the rating, and roughly by how much here."""
    c = r.comparison
    if c is None:
        return ""
    if c.condition is None or c.rating_air is None or c.site_scale is None:
        return (
            "A rating is the water removed in 24 h at its test condition, and the same unit "
            "is rated higher at the older, warmer US point than at the current one: read the "
            "condition on the label before comparing."
        )
    air = c.rating_air
    basis = (
        f"by the humidity ratio above that of air at a "
        f"{d.temperature(th.value('dehumidifier_nominal_coil_c'), 0)} dew point"
        if r.given.kind == "refrigerant"
        else "by the humidity ratio"
    )
    return (
        f"A rating is the water removed in 24 h at its test condition, here "
        f"{rating_condition_text(c.condition, d)}: air at {_hr(d, air.humidity_ratio_kg_per_kg)} "
        f"with a dew point of {d.temperature(air.dew_point_c)}. The air going in here holds "
        f"{_hr(d, r.inlet.humidity_ratio_kg_per_kg)} (dew point "
        f"{d.temperature(r.inlet.dew_point_c)}), so the unit can remove about "
        f"{_pct(100 * c.site_scale)} of its rating, by our rough scaling {basis}; "
        + (
            "in cooler, drier air a shortfall against the label is expected and not a fault "
            "by itself."
            if c.site_scale < 1.0
            else "air wetter than the test's lets a unit remove more than its label says."
        )
        + " The maker's performance table, where there is one, is better than this scaling."
    )


def finding_text(kind: FindingKind, r: DehumidifierResult, d: Display) -> str:
    """One finding as a sentence."""
    temp = d.temperature(r.inlet.dry_bulb_c)
    c = r.comparison
    if kind is FindingKind.NOT_RUNNING:
        return (
            "The unit was recorded as not running: readings across it say nothing of how "
            "it performs."
        )
    if kind is FindingKind.INCONSISTENT:
        return _inconsistent_text(r, d)
    if kind is FindingKind.COIL_FROST:
        limit = d.temperature(th.value("refrigerant_coil_frost_inlet_c"))
        return (
            f"The air going in is at {temp}, below {limit}: a refrigerant unit's coil frosts "
            f"here and removal collapses while it defrosts. Use a desiccant dehumidifier, or "
            f"warm the space first."
        )
    if kind is FindingKind.TOO_COLD:
        limit = d.temperature(th.value("refrigerant_dehumidifier_min_c"))
        return (
            f"The air going in is at {temp}, below {limit}: a refrigerant unit loses much of "
            f"its capacity in air this cool and may ice up; a desiccant unit, or warming the "
            f"space, does better."
        )
    if kind is FindingKind.OUTLET_WETTER:
        return (
            f"The air leaving holds more water than the air going in "
            f"({_hr(d, r.outlet.humidity_ratio_kg_per_kg)} against "
            f"{_hr(d, r.inlet.humidity_ratio_kg_per_kg)}). A dehumidifier cannot add water: "
            f"the readings are wrong (probes swapped, the outlet read outside the airstream, a "
            f"hygrometer not yet settled) or the unit is giving water back (a full tank or "
            f"blocked drain, a defrost cycle). Read both again in the airstream after a few "
            f"minutes."
        )
    if kind is FindingKind.NO_DROP:
        res = d("humidity_ratio", th.value("dehumidifier_drop_resolution_g_per_kg") / 1000.0)
        return (
            f"The humidity ratio does not measurably fall across the unit (less than {res}): "
            f"it is not removing water now. Check that the compressor runs and it is not only "
            f"fanning (humidistat satisfied, defrost, full tank), and that the coil is clean "
            f"and not iced."
        )
    if kind is FindingKind.OUTLET_NOT_WARMER:
        return (
            f"The air leaving ({d.temperature(r.outlet.dry_bulb_c)}) is no warmer than the "
            f"air going in ({temp}). A working dehumidifier always warms the air it dries, so "
            f"the probes may be swapped, or the compressor (or a desiccant unit's heater) is "
            f"off."
        )
    if kind is FindingKind.NO_WATER:
        return (
            "No water collected was recorded: the removal rate, energy factor, airflow and "
            "cooling capacity need it (the tank emptied and measured, over a known time)."
        )
    if kind is FindingKind.NOTHING_COLLECTED:
        return (
            "No water was collected, though the air leaves the unit drier: the water is "
            "going elsewhere (a drain hose, an overflow) or the tank was emptied in between. "
            "Find where it goes before reading a removal rate from the tank."
        )
    if kind is FindingKind.NO_DURATION:
        why = {
            "too_long_since": "too long ago to stand for them",
            "not_after_previous": "not before this one, so the time between says nothing",
        }.get(r.given.duration_source or "")
        if why is not None:
            return (
                "The water was recorded without the hours it was collected over, and the "
                f"unit's previous reading (or the previous visit) is {why}: give the run "
                "hours to get a removal rate."
            )
        return (
            "The water was recorded without the time it was collected over: give the run "
            "hours to get a removal rate."
        )
    if kind is FindingKind.NO_POWER:
        return (
            "No power draw or energy used was recorded: the energy factor and COP need it "
            "(a plug-in energy meter gives both)."
        )
    if kind is FindingKind.NO_RATING_CONDITION:
        return (
            "The rating's test condition is not recorded, so the rating cannot be scaled to "
            "this air; the label or data sheet names it."
        )
    share = None if c is None else c.removal_of_expected
    if kind is FindingKind.BELOW_EXPECTED and share is not None:
        limit = _pct(100 * th.value("dehumidifier_shortfall_fraction"))
        return (
            f"It removes {_pct(100 * share)} of what its rating, scaled to this air, leads one "
            f"to expect (under {limit}): check the filter, the coil, the fan and the drain, "
            f"and whether a humidistat switches it off part of the time."
        )
    if kind is FindingKind.ABOVE_EXPECTED and share is not None:
        return (
            f"It removes {share:.1f} times what its rating, scaled to this air, leads one to "
            f"expect: check the water measured and the hours it was collected over before "
            f"relying on the figures."
        )
    return ""


#: What each plausibility limit bounds, as a phrase before its value.
_BEYOND = {
    "dehumidifier_removal_max_l_per_day": "a removal rate above",
    "dehumidifier_energy_factor_max_l_per_kwh": "an energy factor above",
    "dehumidifier_air_flow_max_m3_per_h": "an air flow through the unit above",
    "dehumidifier_cop_max": "a COP above",
}


def _limit_shown(key: str, d: Display) -> str:
    value = th.value(key)
    if key == "dehumidifier_removal_max_l_per_day":
        return _rate(d, value)
    if key == "dehumidifier_air_flow_max_m3_per_h":
        return d("airflow", value)
    if key == "dehumidifier_energy_factor_max_l_per_kwh":
        return f"{value:g} L/kWh"
    return f"{value:g}"


def _listed(parts: list[str]) -> str:
    """'a', 'a and b', 'a, b and c'."""
    return parts[0] if len(parts) == 1 else ", ".join(parts[:-1]) + " and " + parts[-1]


def _inconsistent_text(r: DehumidifierResult, d: Display) -> str:
    """The readings are inconsistent: which figures would pass what a room unit can give."""
    found = (f.threshold_keys for f in r.findings if f.kind is FindingKind.INCONSISTENT)
    keys = next(found, tuple(_BEYOND))
    parts = [f"{_BEYOND[k]} {_limit_shown(k, d)}" for k in keys if k in _BEYOND]
    return (
        "The readings are inconsistent: together they give "
        + _listed(parts)
        + ", more than a room dehumidifier can do, so "
        + ("that figure is" if len(parts) == 1 else "those figures are")
        + " left out. Check the water collected, the hours it was collected over, the power "
        "or energy, and the air readings in and out of the unit."
    )


def finding_lines(r: DehumidifierResult, d: Display) -> list[str]:
    return [text for f in r.findings if (text := finding_text(f.kind, r, d))]


def summary(r: DehumidifierResult, d: Display) -> str:
    """One short line: removal, energy factor, COP, and the share of the rating."""
    parts = []
    if r.removal_l_per_day is not None:
        parts.append(_rate(d, r.removal_l_per_day))
    if r.energy_factor_l_per_kwh is not None:
        parts.append(f"EF {r.energy_factor_l_per_kwh:.2f} L/kWh")
    if r.cop is not None:
        parts.append(f"COP {r.cop:.1f}")
    c = r.comparison
    if c is not None and c.removal_of_rated is not None:
        parts.append(f"{_pct(100 * c.removal_of_rated)} of rated")
    if c is not None and c.removal_of_expected is not None:
        parts.append(f"{_pct(100 * c.removal_of_expected)} of expected here")
    if not parts:
        drop = r.humidity_ratio_drop_kg_per_kg
        parts.append(f"rise {_drop(d, -drop)}" if drop < 0.0 else f"drop {_drop(d, drop)}")
    return ", ".join(parts)


def missing_text(unit: StoredUnit) -> str:
    """Why a stored unit could not be checked."""
    needs = {
        "outlet": "the air leaving it (an outlet reading)",
        "inlet": "the air going in (an inlet reading, or the room's air reading)",
    }
    wanted = " and ".join(needs[m] for m in unit.missing)
    return f"{unit_name(unit.label)} cannot be checked without {wanted}."


def safety_lines(d: Display) -> list[str]:
    """The cautions of a dehumidifier at work on a wet site, and the closing deferral."""
    return [caution_text(Caution("electrics_near_water"), d), CLOSING_TEXT]


def unit_lines(r: DehumidifierResult, d: Display) -> list[str]:
    """Everything said of one unit: measured, rated, found, and the rating caution."""
    caution = rating_caution(r, d)
    return [
        *measured_lines(r, d),
        *comparison_lines(r, d),
        *finding_lines(r, d),
        *([caution] if caution else []),
    ]


# --- the command's and the app's frame --------------------------------------------------------


def check_title(r: DehumidifierResult) -> str:
    """The heading of one unit's check: 'Dehumidifier check (refrigerant unit)'."""
    return f"Dehumidifier check ({r.given.kind} unit)"


#: The sections of a check as the command prints them, in order.
CHECK_SECTIONS = {
    "measured": "Measured",
    "rating": "Against its rating",
    "found": "Found",
    "note": "Note",
    "safety": "Safety",
    "limits": "Limits used",
}
#: The app's check dialog when the unit cannot be judged yet.
NO_AIR_YET = "Give the room's air reading, or the air going in."
#: The equipment dialog's note: a dehumidifier's check follows it.
CHECK_FOLLOWS = (
    "For a dehumidifier, its performance check (air in and out, hours, power, rating) follows."
)


def not_yet_text(problem: object) -> str:
    """The check dialog's preview while a field is not yet readable."""
    return f"Not yet: {problem}"


# --- the report's table ----------------------------------------------------------------------

REPORT_HEADING = "Dehumidifier performance"
REPORT_HEADER = (
    "Unit",
    "Removal",
    "Energy factor",
    "COP",
    "Rated",
    "Expected at this air",
    "Found",
)
NOT_CHECKED = "not checked: a reading is missing"
#: Each finding in a few words, for a table cell.
FINDING_SHORT = {
    FindingKind.NOT_RUNNING: "not running",
    FindingKind.INCONSISTENT: "the readings are inconsistent",
    FindingKind.COIL_FROST: "coil frosts: too cold",
    FindingKind.TOO_COLD: "cold for a refrigerant unit",
    FindingKind.OUTLET_WETTER: "outlet wetter than inlet",
    FindingKind.NO_DROP: "no measurable drop",
    FindingKind.OUTLET_NOT_WARMER: "outlet not warmer",
    FindingKind.NO_WATER: "no water recorded",
    FindingKind.NOTHING_COLLECTED: "no water collected",
    FindingKind.NO_DURATION: "no hours for the water",
    FindingKind.NO_POWER: "no power recorded",
    FindingKind.NO_RATING_CONDITION: "rating condition unknown",
    FindingKind.BELOW_EXPECTED: "below what the air allows",
    FindingKind.ABOVE_EXPECTED: "above what the air allows: check records",
}


def rate_text(litres_per_day: float | None, d: Display) -> str:
    """A removal rate in both units, or '–'."""
    return "–" if litres_per_day is None else _rate(d, litres_per_day)


def energy_factor_text(l_per_kwh: float | None) -> str:
    return "–" if l_per_kwh is None else f"{l_per_kwh:.2f} L/kWh"


def cop_text(cop: float | None) -> str:
    return "–" if cop is None else f"{cop:.1f}"


def rated_text(r: DehumidifierResult, d: Display) -> str:
    """'50.0 L/day, 2.10 L/kWh at 80 °F, 60 % RH' (what the label says)."""
    c = r.comparison
    if c is None:
        return "not recorded"
    parts = []
    if c.rated_capacity_l_per_day is not None:
        parts.append(_rate(d, c.rated_capacity_l_per_day))
    if c.rated_energy_factor_l_per_kwh is not None:
        parts.append(f"{c.rated_energy_factor_l_per_kwh:.2f} L/kWh")
    if c.condition is None:
        return ", ".join(parts) + ", condition not recorded"
    point = c.condition
    temp = (
        d.nominal_temperature(point.dry_bulb_c)
        if point.key in _US_RATINGS
        else d.temperature(point.dry_bulb_c)
    )
    return ", ".join(parts) + f" at {temp}, {_pct(point.rh_pct)} RH"


def expected_text(r: DehumidifierResult, d: Display) -> str:
    """The rating scaled to this air, and the share of it reached: '24.0 L/day (75 %)'."""
    c = r.comparison
    if c is None or c.expected_removal_l_per_day is None:
        return "–"
    text = _rate(d, c.expected_removal_l_per_day)
    if c.removal_of_expected is not None:
        text += f", {_pct(100 * c.removal_of_expected)} reached"
    return text


def found_text(r: DehumidifierResult) -> str:
    """The findings in a few words each, or 'nothing to note'."""
    return "; ".join(FINDING_SHORT[f.kind] for f in r.findings) or "nothing to note"


def rating_condition_prompt() -> str:
    """The app's short prompt for a rating condition key (test °C and % RH, e.g.
    ``26.7c_60``); the keys are listed by the message a wrong one gets."""
    first = next(iter(eq.RATING_CONDITIONS))
    return f"Rating (°C_%RH, e.g. {first})"
