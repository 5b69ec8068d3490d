"""Site findings: every room of the visit, worst first, then the site's actions and
cautions — judged through :func:`survey.evaluate.assess_visit`, worded by :mod:`survey.words`."""

from __future__ import annotations

from rich.text import Text
from textual.containers import VerticalScroll
from textual.widgets import Static

from survey import evaluate, words
from survey.app import judging, walk
from survey.app.fields import plain
from survey.words import screens
from survey.words.report_end import applies_to


def findings_text(survey, visit_index: int, d: words.Display) -> Text:
    out = Text()
    if not survey.visits:
        return Text("No visit yet.")
    judged = evaluate.assess_visit(survey, visit_index)
    visit = judged.visit
    out.append(f"Visit {judged.visit_index + 1}, {visit.started_at:%Y-%m-%d %H:%M} ", "bold")
    out.append(plain(visit.label))
    out.append("\n")
    pairs = list(zip(judged.findings.rooms, judged.advice.rooms, judged.room_ids, strict=False))
    pairs.sort(key=lambda p: -judging.worst_rank(p[0]))
    unread = [r for r in survey.rooms if r.id not in judged.room_ids]
    for finding, advice, room_id in pairs:
        rank = judging.worst_rank(finding)
        out.append(f"\n{judging.RANK_SYMBOLS[rank]} ", "bold")
        out.append(plain(survey.room(room_id).name, "bold"))
        out.append(f" — {screens.worst_state_words(finding, d)}\n")
        for s in words.worst_first(finding.surfaces)[:3]:
            out.append("   ")
            out.append(plain(s.label))
            out.append(f", {d.temperature(s.surface_temp_c)}: {words.short_verdict(s, d)}\n")
        limit = screens.safe_rh_against_room(finding)
        if limit is not None:
            out.append(f"   {limit}\n")
        for n, action in enumerate(advice.actions, 1):
            out.append(f"   {n}. ")
            out.append(plain(words.action_title(action), "bold"))
            numbers = words.action_numbers(action, d)
            out.append(f" — {numbers}\n" if numbers else "\n")
    for room in unread:
        out.append("\n· ")
        out.append(plain(room.name, "bold"))
        out.append(f" — {screens.NO_AIR_THIS_VISIT}\n")
    if judged.advice.cautions:
        out.append(f"\n{screens.HEADINGS['cautions']}\n", "bold")
        for caution in judged.advice.cautions:
            rooms = [
                survey.room(room_id).name
                for advice, room_id in zip(judged.advice.rooms, judged.room_ids, strict=False)
                if caution in advice.cautions
            ]
            out.append("• ")
            out.append(plain(applies_to(words.caution_text(caution, d), rooms)))
            out.append("\n")
    return out


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
            findings_text(self.editor.survey, self.editor.visit_index, self.app.display_units)
        )
