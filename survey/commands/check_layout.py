"""``survey check``'s two layouts of a :class:`~survey.quick.QuickResult`: the JSON encoding
(SI keys, read by other tools) and the Rich tables. Every sentence comes from
:mod:`survey.words`; user text (surface labels) is shown as plain text, made safe for the
terminal."""

from __future__ import annotations

from typing import Any

from survey import psychro, words
from survey import thresholds as th
from survey.quick import QuickResult
from survey.safe_text import visible

_MAX_RH_BASIS = (
    "the coldest wall, ceiling or floor (any surface not said to be glazing, a "
    "window frame or a pipe); glazing, window frames and pipes are judged apart "
    "and never set the room RH"
)


def _state(state: psychro.MoistAir) -> dict[str, Any]:
    return {
        "dry_bulb_c": state.dry_bulb_c,
        "rh_pct": state.rh_pct,
        "pressure_pa": state.pressure_pa,
        "dew_point_c": state.dew_point_c,
        "frost_point_c": state.frost_point_c,
        "humidity_ratio_g_per_kg": state.humidity_ratio_g_per_kg,
        "grains_per_pound": state.grains_per_pound,
        "vapour_pressure_pa": state.vapour_pressure_pa,
        "enthalpy_kj_per_kg": state.enthalpy_j_per_kg / 1000.0,
        "wet_bulb_c": state.wet_bulb_c,
        "absolute_humidity_g_per_m3": state.absolute_humidity_g_per_m3,
        "specific_volume_m3_per_kg": state.specific_volume_m3_per_kg,
        "density_kg_per_m3": state.density_kg_per_m3,
    }


def _surface(s) -> dict[str, Any]:
    return {
        "label": s.label,
        "element": s.element,
        "judged_as": s.policy.role,
        "surface_temp_c": s.surface_temp_c,
        "surface_rh_pct": s.surface_rh_pct,
        "surface_rh_range_pct": [s.surface_rh_low_pct, s.surface_rh_high_pct],
        "dew_point_margin_k": s.dew_point_margin_k,
        "margin_uncertainty_k": s.margin_uncertainty_k,
        "condensing": s.condensing,
        "frost": s.frost,
        "condensation": s.condensation.value,
        "condensation_possible": [x.value for x in s.condensation_possible],
        "mould": s.mould.value,
        "mould_possible": [x.value for x in s.mould_possible],
        "temperature_factor": s.temperature_factor,
        "temperature_factor_uncertainty": s.temperature_factor_uncertainty,
        "temperature_factor_limit": s.temperature_factor_limit,
        "temperature_factor_state": s.temperature_factor_state.value,
        "temperature_factor_possible": [x.value for x in s.temperature_factor_possible],
        "threshold_keys": list(s.threshold_keys),
    }


def encode(result: QuickResult, d: words.Display) -> dict[str, Any]:
    """The result as a JSON-ready dict with SI keys (sentences in ``d``'s units)."""
    f, advice, given = result.finding, result.advice, result.input
    out = _state(result.room)
    out["surfaces"] = [_surface(s) for s in f.surfaces]
    if result.colder_month is not None:
        _add_colder_month(out, result, d)
    out["outdoor"] = None if result.outdoor is None else _state(result.outdoor)
    limit = th.frsi_limit(result.use)
    coldest, apart = f.coldest, f.coldest_glazing_or_pipe
    acc = given.accuracy
    out.update(
        {
            "room_use": result.use,
            "room_use_given": result.use_given,
            "temperature_factor_limit": None if limit is None else limit.value,
            "temperature_factor_limit_basis": th.room_use(result.use).frsi_reason,
            "temperature_factor_not_judged_reason": words.factor_not_judged_reason(f, d),
            "accuracy": {
                "air_temp_k": acc.air_temp_k,
                "rh_pct": acc.rh_pct,
                "surface_temp_k": acc.surface_temp_k,
                "shared_thermometer": acc.shared_thermometer,
                "given": {
                    "air_temp_k": given.accuracy_given.air_temp_k,
                    "rh_pct": given.accuracy_given.rh_pct,
                    "surface_temp_k": given.accuracy_given.surface_temp_k,
                },
                "meaning": "± bounds read as rectangular distributions; bands are expanded "
                f"uncertainties with coverage factor {th.value('coverage_factor'):g} "
                "(about 95 %)",
            },
            "condensation_point_c": f.air.condensation_point_c,
            "condensation_point_is_frost_point": result.room.frost_point_c is not None,
            "condensation_point_uncertainty_k": f.condensation_point_uncertainty_k,
            "coldest_surface": None if coldest is None else coldest.label,
            "coldest_surface_element": None if coldest is None else coldest.element,
            "coldest_surface_temp_c": None if coldest is None else coldest.surface_temp_c,
            "max_room_rh_basis": _MAX_RH_BASIS,
            "max_room_rh_pct_for_coldest_surface": f.max_room_rh_pct,
            "max_room_rh_range_pct": (
                None
                if f.max_room_rh_low_pct is None
                else [f.max_room_rh_low_pct, f.max_room_rh_high_pct]
            ),
            "max_room_rh_pct_mould_limit": f.max_room_rh_pct_mould,
            "max_room_rh_pct_condensation_margin": f.max_room_rh_pct_margin,
            "coldest_glazing_or_pipe": None if apart is None else apart.label,
            "coldest_glazing_or_pipe_element": None if apart is None else apart.element,
            "max_room_rh_pct_dry_glazing_or_pipe": f.max_room_rh_pct_dry_glazing_or_pipe,
            "vapour_pressure_excess_pa": f.vapour_pressure_excess_pa,
            "vapour_pressure_excess_uncertainty_pa": f.vapour_pressure_excess_uncertainty_pa,
            "humidity_class": f.humidity_class,
            "humidity_class_possible": list(f.humidity_class_possible),
            "humidity_class_text": (
                None if f.outdoor is None else words.humidity_class_text(f.humidity_class)
            ),
            "humidity_class_possible_text": (
                None
                if f.humidity_class is None
                else words.humidity_class_range_text(f.humidity_class_possible)
            ),
            "timber_emc_pct": f.timber_emc_pct,
            "room_volume_m3": given.volume_m3,
            "occupants": given.occupants,
            "target_rh_pct": advice.target_rh_pct,
            "target_basis": words.target_basis(advice.target, d),
            "moisture_generation_g_per_h": advice.moisture.used_g_per_h,
            "moisture_generation_basis": words.moisture_basis(advice.moisture, f.use, d),
            "actions": [
                {
                    "kind": a.kind.value,
                    "title": words.action_title(a),
                    "reason": words.action_reason(a, f, advice, d),
                    **a.numbers_dict(),
                    "threshold_keys": list(a.threshold_keys),
                }
                for a in advice.actions
            ],
            "cautions": [words.caution_text(c, d) for c in result.cautions],
            "caution_keys": [c.key for c in result.cautions],
            "warnings": list(result.warnings),
            "thresholds": [
                {
                    "key": t.key,
                    "value": t.value,
                    "unit": t.unit,
                    "mark": t.mark,
                    "citation": t.citation(),
                }
                for t in result.limits
            ],
        }
    )
    return out


def _add_colder_month(out: dict[str, Any], result: QuickResult, d: words.Display) -> None:
    """The projection's keys, only when a design month was given (``--design-outdoor-*``)."""
    from survey.words import season as ws

    room = result.colder_month
    assert room is not None
    for surface, p in zip(out["surfaces"], room.surfaces, strict=True):
        m = p.lowest_month
        surface.update(
            {
                "design_surface_temp_c": p.design_surface_temp_c,
                "design_surface_temp_uncertainty_k": p.design_surface_temp_uncertainty_k,
                "design_surface_rh_pct": p.design_surface_rh_pct,
                "design_surface_rh_range_pct": (
                    None
                    if p.design_surface_rh_pct is None
                    else [p.design_surface_rh_low_pct, p.design_surface_rh_high_pct]
                ),
                "design_condition": p.state.value,
                "design_condition_possible": [x.value for x in p.possible],
                "design_only_safe_today": p.only_safe_today,
                "design_lowest_outdoor_temp_outcome": None if m is None else m.outcome.value,
                "design_lowest_outdoor_temp_c": None if m is None else m.outdoor_temp_c,
                # the same search on the ends of the surface-RH band: cold end, warm end
                "design_lowest_outdoor_temp_range_c": (
                    None if m is None else [m.low_end[1], m.high_end[1]]
                ),
                "design_lowest_outdoor_temp_range_outcomes": (
                    None if m is None else [m.low_end[0].value, m.high_end[0].value]
                ),
                "design_text": ws.surface_sentence(p, room, d, result.finding),
                "design_lowest_outdoor_temp_text": ws.lowest_month_sentence(p, room, d),
            }
        )
    month = room.month
    out.update(
        {
            "design_month": {
                "outdoor_temp_c": month.outdoor_temp_c,
                "outdoor_rh_pct": month.outdoor_rh_pct,
                "indoor_temp_c": room.indoor_temp_c,
                "indoor_as_measured": room.indoor_measured,
                "excess_model": room.excess_model.value,
                "excess_model_fallback": room.excess_model_fallback,
                "not_projected_reason": None if room.reason is None else room.reason.value,
                "search_range_c": (
                    None
                    if room.worst is None or room.worst.lowest_month is None
                    else [
                        room.worst.lowest_month.bracket_low_c,
                        room.worst.lowest_month.bracket_high_c,
                    ]
                ),
            },
            "design_outdoor_vapour_pressure_pa": room.design_outdoor_vapour_pressure_pa,
            "design_vapour_pressure_excess_pa": room.design_vapour_pressure_excess_pa,
            "design_vapour_pressure_excess_uncertainty_pa": (
                room.design_vapour_pressure_excess_uncertainty_pa
            ),
            "design_vapour_pressure_pa": room.design_vapour_pressure_pa,
            "design_month_text": ws.design_month_text(month, d),
            "design_excess_text": ws.excess_text(room, d),
            "design_verdict_lines": ws.room_verdict_lines(room),
        }
    )


# --- the table -------------------------------------------------------------------------------

#: What the words say to give, in this face's option names.
HINTS = {"use": "--use", "outdoor": "give --outdoor-temp and --outdoor-rh"}

_SHOWN_LIMITS = {
    "dew_point_margin_k",
    "surface_rh_mould_limit_pct",
    "frsi_dwelling",
    "frsi_high_humidity",
    "frsi_storage",
    "frsi_general",
    "frsi_min_temperature_difference_k",
    "room_rh_floor_pct",
    "coverage_factor",
}


def _air_rows(d: words.Display):
    rows = [
        ("Air temperature", lambda s: d.temperature(s.dry_bulb_c)),
        ("Relative humidity", lambda s: f"{s.rh_pct:.1f} %"),
        ("Pressure", lambda s: d("pressure", s.pressure_pa)),
        ("Dew point", lambda s: d.temperature(s.dew_point_c)),
        ("Frost point", lambda s: d("temperature", s.frost_point_c)),
        ("Humidity ratio", lambda s: d("humidity_ratio", s.humidity_ratio_kg_per_kg)),
        ("Vapour pressure", lambda s: d("vapour_pressure", s.vapour_pressure_pa)),
        ("Wet bulb", lambda s: d.temperature(s.wet_bulb_c)),
        ("Absolute humidity", lambda s: d("absolute_humidity", s.absolute_humidity_g_per_m3)),
        ("Enthalpy", lambda s: d("enthalpy", s.enthalpy_j_per_kg)),
        ("Specific volume", lambda s: d("specific_volume", s.specific_volume_m3_per_kg)),
        ("Density", lambda s: d("density", s.density_kg_per_m3)),
    ]
    if not d.ip:  # in IP the humidity ratio row is already in grains per pound
        rows.insert(6, ("Grains per pound", lambda s: f"{s.grains_per_pound:.1f} gr/lb"))
    return rows


def render(result: QuickResult, d: words.Display) -> None:
    """Print the result as Rich tables and plain text (never markup) in ``d``'s units."""
    from rich.console import Console
    from rich.padding import Padding
    from rich.table import Table
    from rich.text import Text

    def para(text: str, indent: int, style: str = "") -> Padding:
        return Padding(Text(visible(text, keep_newlines=True), style=style), (0, 0, 0, indent))

    def heading(text: str) -> None:
        console.print(Text(text, style="bold underline"))

    f, advice = result.finding, result.advice
    console = Console(highlight=False, emoji=False)
    heading("Summary")
    for line in words.quick_summary_lines(result, d, HINTS):
        console.print(para(line, 2))
    console.print()
    states = {"Room": result.room}
    if result.outdoor is not None:
        states["Outdoor"] = result.outdoor
    table = Table(title="Moist air", title_justify="left")
    table.add_column("Quantity")
    for name in states:
        table.add_column(name, justify="right")
    for label, show in _air_rows(d):
        table.add_row(label, *(show(state) for state in states.values()))
    console.print(table)

    console.print(Text(words.quick_accuracy_line(result, d)))
    if f.surfaces:
        readings = Table(title="Surfaces: readings", title_justify="left")
        for name, right in (
            ("Surface", False),
            ("Kind", False),
            ("Temp.", True),
            ("Surface RH", True),
            ("Margin to dew/frost point", True),
            ("Temperature factor", True),
        ):
            readings.add_column(name, justify="right" if right else "left")
        judged = Table(title="Surfaces: risk", title_justify="left")
        for name in ("Surface", "Condensation", "Mould growth", "Temperature factor"):
            judged.add_column(name)
        for s in f.surfaces:
            label = Text(visible(s.label))
            margin = (
                d("temperature_difference", s.dew_point_margin_k, unit=False)
                + " ± "
                + d.difference(s.margin_uncertainty_k)
            )
            factor = "–"
            if s.temperature_factor is not None:
                factor = (
                    f"{s.temperature_factor:.2f} ± {s.temperature_factor_uncertainty:.2f} "
                    f"(limit {s.temperature_factor_limit:.2f})"
                )
            elif s.temperature_factor_state.value == "not_for_element":
                factor = "not used"
            readings.add_row(
                label,
                words.ELEMENT_WORDS[s.element],
                d.temperature(s.surface_temp_c),
                words.surface_rh_text(s),
                margin,
                factor,
            )
            judged.add_row(
                label, words.condensation_text(s), words.mould_text(s), words.factor_text(s, f, d)
            )
        console.print(readings)
        console.print(judged)
        if any(
            "cannot_tell" in (s.condensation.value, s.mould.value, s.temperature_factor_state.value)
            for s in f.surfaces
        ):
            console.print(Text(words.CANNOT_TELL_EXPLAINED))
    console.print()
    heading("Room")
    for line in words.quick_room_lines(result, d, HINTS):
        console.print(para(line, 2))
    if result.colder_month is not None:
        _render_colder_month(console, result, d, heading, para)
    console.print()
    heading("What to do")
    if not advice.actions:
        console.print(para(words.quick_nothing_to_do(result), 2))
    for number, action in enumerate(advice.actions, start=1):
        console.print(para(f"{number}. {words.action_title(action)}", 2, "bold"))
        console.print(para(words.action_reason(action, f, advice, d), 5))
    console.print()
    heading("Safety")
    for caution in result.cautions:
        console.print(para(f"• {words.caution_text(caution, d)}", 2))
    console.print()
    heading("Limits used")
    shown = set(_SHOWN_LIMITS)
    if result.colder_month is not None:
        shown.update(result.colder_month.threshold_keys)
    if f.humidity_class in (1, 2, 3, 4, 5):
        shown.add(f"humidity_class_{f.humidity_class}_pa")
    listed = [t for t in result.limits if t.key in shown]
    for t in listed:
        console.print(para(f"• {words.client_citation(t, d)}", 2))
    for line in words.legend(listed):
        console.print(para(line, 2))
    console.print(
        para(
            "Every limit behind these findings, with its source, is listed under "
            '"thresholds" in --json output.',
            2,
        )
    )


def _render_colder_month(console, result: QuickResult, d: words.Display, heading, para) -> None:
    """The projected month: a table of surfaces, then the sentences (all from words)."""
    from rich.table import Table
    from rich.text import Text

    from survey.words import season as ws

    room = result.colder_month
    assert room is not None
    console.print()
    heading(ws.HEADING)
    console.print(para(ws.design_month_text(room.month, d), 2))
    excess = ws.excess_text(room, d)
    if excess:
        console.print(para(excess, 2))
    table = Table(title=ws.TABLE_TITLE, title_justify="left")
    for name, right in ws.TABLE_COLUMNS:
        table.add_column(name, justify="right" if right else "left")
    for today, p in zip(result.finding.surfaces, room.surfaces, strict=True):
        table.add_row(
            Text(visible(p.label)),
            words.surface_rh_text(today),
            d.temperature(p.design_surface_temp_c),
            ws.design_rh_text(p),
            ws.state_text(p, room, result.finding, d),
            ws.lowest_month_text(p, d),
        )
    console.print(table)
    for p in room.surfaces:
        if p.projected:
            console.print(para(ws.surface_sentence(p, room, d, result.finding), 2))
            lowest = ws.lowest_month_sentence(p, room, d)
            if lowest:
                console.print(para(lowest, 4))
    for line in ws.room_verdict_lines(room):
        console.print(para(line, 2, "bold"))
