"""Site findings: every room of the visit, worst first, then the site's actions and
cautions — judged through :func:`survey.evaluate.assess_visit`, worded by :mod:`survey.words`."""

from __future__ import annotations

from rich.console import Group
from rich.table import Table
from rich.text import Text
from textual.containers import VerticalScroll
from textual.widgets import Static

from survey import evaluate, words
from survey.app import judging, walk
from survey.app.fields import plain
from survey.words import screens
from survey.words.report_end import applies_to


def _rank(finding) -> int:
    """The room's worst rank for ordering, worst first; nothing judged comes last."""
    rank = judging.worst_rank(finding)
    return -1 if rank is None else rank


def _hanging(lead: str, body: Text, lead_style: str = "") -> Table:
    """``lead`` (a symbol, an indent, a number) with ``body`` beside it: wrapped lines of
    the body keep under its first word, not under the lead."""
    grid = Table.grid(expand=True)
    grid.add_column(width=len(lead), no_wrap=True)
    grid.add_column(ratio=1)
    grid.add_row(Text(lead, style=lead_style), body)
    return grid


def findings_view(survey, visit_index: int, d: words.Display) -> Group:
    """The findings of a visit, worst room first, as the screen lays them out."""
    if not survey.visits:
        return Group(Text("No visit yet."))
    parts: list[Text | Table] = []
    judged = evaluate.assess_visit(survey, visit_index)
    visit = judged.visit
    head = Text(f"Visit {judged.visit_index + 1}, {visit.started_at:%Y-%m-%d %H:%M} ", "bold")
    head.append(plain(visit.label))
    parts.append(head)
    pairs = list(zip(judged.findings.rooms, judged.advice.rooms, judged.room_ids, strict=False))
    pairs.sort(key=lambda p: -_rank(p[0]))
    unread = [r for r in survey.rooms if r.id not in judged.room_ids]
    for finding, advice, room_id in pairs:
        rank = judging.worst_rank(finding)  # None: nothing judged, shown as "·"
        parts.append(Text(""))
        line = plain(survey.room(room_id).name, "bold")
        line.append(f" — {screens.worst_state_words(finding, d)}")
        parts.append(_hanging(f"{judging.RANK_SYMBOLS[rank]} ", line, "bold"))
        for s in words.worst_first(finding.surfaces)[:3]:
            line = plain(s.label)
            line.append(f", {d.temperature(s.surface_temp_c)}: {words.short_verdict(s, d)}")
            parts.append(_hanging("   ", line))
        limit = screens.safe_rh_against_room(finding)
        if limit is not None:
            parts.append(_hanging("   ", Text(limit)))
        for n, action in enumerate(advice.actions, 1):
            line = plain(words.action_title(action), "bold")
            numbers = words.action_numbers(action, d)
            if numbers:
                line.append(f" — {numbers}")
            parts.append(_hanging(f"   {n}. ", line))
    for room in unread:
        parts.append(Text(""))
        line = plain(room.name, "bold")
        line.append(f" — {screens.NO_AIR_THIS_VISIT}")
        parts.append(_hanging("· ", line))
    if judged.advice.cautions:
        parts += [Text(""), Text(screens.HEADINGS["cautions"], "bold")]
        for caution in judged.advice.cautions:
            rooms = [
                survey.room(room_id).name
                for advice, room_id in zip(judged.advice.rooms, judged.room_ids, strict=False)
                if caution in advice.cautions
            ]
            parts.append(_hanging("• ", plain(applies_to(words.caution_text(caution, d), rooms))))
    return Group(*parts)


class FindingsScreen(walk.WalkScreen):
    TITLE_TEXT = "Site findings"
    PARENT = "rooms"

    def compose(self):
        yield self.header()
        with VerticalScroll(id="findings-scroll", can_focus=True):
            yield Static(id="findings")
        yield from self.footer_widgets()

    def on_mount(self) -> None:
        self.refresh_view()
        self.query_one("#findings-scroll").focus()

    def refresh_view(self) -> None:
        self.query_one("#findings", Static).update(
            findings_view(self.editor.survey, self.editor.visit_index, self.app.display_units)
        )
