"""The live panel of a room: dew point, humidity ratio, vapour pressure, the highest safe
room RH, the room's actions and cautions — every sentence from :mod:`survey.words`."""

from __future__ import annotations

from rich.text import Text
from textual.binding import Binding
from textual.screen import Screen
from textual.widgets import Static

from survey import evaluate, season, words
from survey.app.fields import plain
from survey.words import screens
from survey.words import season as ws

#: Keys that scroll a screen's live panel (or the quick check's result) from any field: the
#: panel's lower lines (the actions, the safety cautions) are reached without a mouse.
PANEL_KEYS = [
    Binding("shift+down", "scroll_panel(3)", "Panel down", id="panel_down", show=False),
    Binding("shift+up", "scroll_panel(-3)", "Panel up", id="panel_up", show=False),
    Binding("shift+pagedown", "scroll_panel(12)", "Panel page down", id="panel_pgdn", show=False),
    Binding("shift+pageup", "scroll_panel(-12)", "Panel page up", id="panel_pgup", show=False),
]


def scroll_panel(screen: Screen, lines: int) -> None:
    """Scroll the screen's live panel by ``lines`` (down when positive)."""
    for panel in screen.query("#live-scroll, .live-panel-scroll"):
        panel.scroll_relative(y=lines, animate=False)


def panel_text(
    judged: evaluate.RoomAssessment | None,
    d: words.Display,
    month: season.DesignMonth | None = None,
    month_problem: str | None = None,
) -> Text:
    """The panel's text; ``month_problem`` is why the site's design month was refused (our
    default ``month`` is then projected to, and the panel says why in one line)."""
    if judged is None:
        return Text(screens.NO_ROOM_READING)
    f, advice = judged.finding, judged.advice
    out = Text()
    out.append(screens.HEADINGS["room_air"] + "\n", style="bold")
    for line in screens.air_state_lines(f.moist_air(), d, f.condensation_point_uncertainty_k):
        out.append(line + "\n")
    out.append(plain(screens.safe_rh_set_by(f)))
    out.append("\n")
    if month is not None:
        room = season.project_room(f, month, with_lowest=False)
        lines = ws.panel_lines(room, d, month_problem)
        if lines:
            out.append(f"\n{lines[0]}\n", style="bold")
            for line in lines[1:]:
                out.append(plain(line))
                out.append("\n")
    out.append(f"\n{screens.HEADINGS['actions']}\n", style="bold")
    if not advice.actions:
        out.append(screens.NOTHING_TO_DO + "\n")
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
        out.append(f"\n{screens.HEADINGS['cautions']}\n", style="bold")
        for caution in judged.cautions:
            out.append("• ")
            out.append(plain(words.caution_text(caution, d)))
            out.append("\n")
    return out


class LivePanel(Static):
    DEFAULT_CLASSES = "live-panel"

    def show(self, judged: evaluate.RoomAssessment | None, d: words.Display) -> None:
        month, problem = self._design_month()
        self.update(panel_text(judged, d, month, problem))

    def _design_month(self) -> tuple[season.DesignMonth, str | None]:
        """The survey site's design month (our default where it gives none), or our default
        and why the site's cannot be used."""
        editor = getattr(self.app, "editor", None)
        if editor is None:
            return season.default_design_month(), None
        month, refused = season.usable_site_month(editor.survey.site)
        return month, None if refused is None else str(refused)
