"""The live panel of a room: dew point, humidity ratio, vapour pressure, the highest safe
room RH, the room's actions and cautions — every sentence from :mod:`survey.words`."""

from __future__ import annotations

from rich.text import Text
from textual.widgets import Static

from survey import season, words
from survey.app.fields import plain
from survey.app.judging import RoomJudgement
from survey.errors import InputError
from survey.words import season as ws


def panel_text(
    judged: RoomJudgement | None, d: words.Display, month: season.DesignMonth | None = None
) -> Text:
    if judged is None:
        return Text(
            "Give the room's air temperature and RH to see its dew point, the "
            "highest safe RH and what to do."
        )
    f, advice = judged.finding, judged.advice
    air = f.moist_air()
    frost = air.frost_point_c is not None
    out = Text()
    out.append("Room air\n", style="bold")
    out.append(f"{d.temperature(air.dry_bulb_c)}, {air.rh_pct:.0f} % RH\n")
    out.append(
        f"{'Frost' if frost else 'Dew'} point {d.temperature(f.air.condensation_point_c)}"
        f" ± {d.difference(f.condensation_point_uncertainty_k)}\n"
    )
    out.append(f"Humidity ratio {d('humidity_ratio', air.humidity_ratio_kg_per_kg)}\n")
    out.append(f"Vapour pressure {d('vapour_pressure', air.vapour_pressure_pa)}\n")
    limit = words.rh_limit_text(f)
    if limit is not None and f.coldest is not None:
        out.append("Highest safe room RH: ")
        out.append(f"{limit}, set by ")
        out.append(plain(f.coldest.label))
        out.append("\n")
    elif f.surfaces:
        out.append("No wall, ceiling or floor measured: no highest safe room RH.\n")
    else:
        out.append("No surface measured yet.\n")
    if month is not None:
        lines = ws.panel_lines(season.project_room(f, month, with_lowest=False), d)
        if lines:
            out.append(f"\n{lines[0]}\n", style="bold")
            for line in lines[1:]:
                out.append(plain(line))
                out.append("\n")
    out.append("\nWhat to do\n", style="bold")
    if not advice.actions:
        out.append("Nothing to do from these readings.\n")
    for n, action in enumerate(advice.actions, 1):
        out.append(f"{n}. ")
        out.append(plain(words.action_title(action), "bold"))
        numbers = words.action_numbers(action, d)
        if numbers:
            out.append(f" — {numbers}")
        out.append("\n")
        out.append(plain(words.action_reason(action, f, advice, d), "dim"))
        out.append("\n")
    if judged.cautions:
        out.append("\nCautions\n", style="bold")
        for caution in judged.cautions:
            out.append("• ")
            out.append(plain(words.caution_text(caution, d)))
            out.append("\n")
    return out


class LivePanel(Static):
    DEFAULT_CLASSES = "live-panel"

    def show(self, judged: RoomJudgement | None, d: words.Display) -> None:
        self.update(panel_text(judged, d, self._design_month()))

    def _design_month(self) -> season.DesignMonth:
        """The survey site's design month (our default where it gives none or one that
        cannot be used)."""
        editor = getattr(self.app, "editor", None)
        if editor is None:
            return season.default_design_month()
        try:
            return season.site_design_month(editor.survey.site)
        except InputError:
            return season.default_design_month()
