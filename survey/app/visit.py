"""The visit: when, the weather, the outdoor reading with its state shown live; a new visit
to the same site."""

from __future__ import annotations

import datetime as dt

from rich.text import Text
from textual import on
from textual.containers import Horizontal
from textual.widgets import Button, Select, Static

from survey import logtime, model, psychro, store
from survey.app import walk
from survey.app.air import AirPair
from survey.app.dialogs import ConfirmDialog
from survey.app.fields import Choice, Field, plain
from survey.errors import InputError
from survey.words import screens


def _start_text(at: dt.datetime) -> str:
    """A start as the field shows it: with its offset from UTC when it has one, so that
    editing it keeps the time zone."""
    text = f"{at:%Y-%m-%d %H:%M}"
    if at.tzinfo is None:
        return text
    zone = at.strftime("%z")  # "+0100"
    return f"{text}{zone[:3]}:{zone[3:5]}"


def _choices(survey: model.Survey) -> list[tuple[Text, int]]:
    """The visits as the drop-down lists them: number, start and label."""
    return [
        (Text(f"{n + 1}: {v.started_at:%Y-%m-%d %H:%M} ") + plain(v.label), n)
        for n, v in enumerate(survey.visits)
    ]


class VisitScreen(walk.WalkScreen):
    TITLE_TEXT = "Visit"
    PARENT = "site"

    @property
    def visit(self) -> model.Visit:
        return self.editor.survey.visits[self.editor.visit_index]

    def compose(self):
        editor, visit, ro = self.editor, self.visit, self.read_only
        system = editor.unit_system
        yield self.header()
        with Horizontal(classes="split"):
            with walk.Form():
                choices = _choices(editor.survey)
                yield walk.labelled(
                    "Visit shown",
                    Choice(
                        choices,
                        value=editor.visit_index % len(editor.survey.visits),
                        allow_blank=False,
                        compact=True,
                        id="visit-choice",
                    ),
                )
                yield Field(
                    "Started at",
                    _start_text(visit.started_at),
                    walk.timestamp("Started at"),
                    self._setter("started_at", "Started at"),
                    id="visit-started",
                    disabled=ro,
                )
                for name, label in (
                    ("label", "Label"),
                    ("inspector", "Inspector"),
                    ("weather", "Weather"),
                ):
                    yield Field(
                        label,
                        getattr(visit, name),
                        walk.text_parser(label),
                        self._setter(name, label),
                        id=f"visit-{name}",
                        disabled=ro,
                    )
                yield Field(
                    "Pressure",
                    walk.shown("pressure", visit.pressure_pa, system),
                    walk.optional(walk.pressure("Barometric pressure", system)),
                    self._setter("pressure_pa", "Barometric pressure"),
                    id="visit-pressure",
                    placeholder="blank: from the altitude",
                    disabled=ro,
                )
                yield Field(
                    "Notes",
                    visit.notes,
                    walk.text_parser("Notes"),
                    self._setter("notes", "Notes"),
                    id="visit-notes",
                    disabled=ro,
                )
                yield Field(
                    "Photos",
                    ", ".join(visit.photos),
                    walk.photo_names("Photos"),
                    self._setter("photos", "Photos"),
                    id="visit-photos",
                    placeholder="e.g. p1.jpg, p2.jpg",
                    disabled=ro,
                )
                yield Static(Text("Outdoor reading", style="bold"))
                yield AirPair(
                    "outdoor",
                    visit.outdoor,
                    system,
                    self._set_outdoor,
                    disabled=ro,
                    previous=self._previous_outdoor(),
                )
                yield Button("Continue to the rooms ▸", id="to-rooms", compact=True)
            yield Static(id="outdoor-state", classes="live-panel")
        yield from self.footer_widgets()

    def on_mount(self) -> None:
        self.show_state(self.visit.outdoor)
        self.query_one("#visit-started-input").focus()

    def _previous_outdoor(self) -> model.AirReading | None:
        index = self.editor.visit_index % len(self.editor.survey.visits)
        return self.editor.survey.visits[index - 1].outdoor if index > 0 else None

    def _setter(self, name: str, label: str):
        def commit(value):
            visits = self.editor.survey.visits
            before = self.visit
            visits[self.editor.visit_index] = walk.checked(before, label, **{name: value})
            self.committed()
            if name == "pressure_pa":
                self.show_state(self.visit.outdoor)
            if name in ("started_at", "label"):
                self._visit_choices()
            if name == "started_at":
                self._offer_move(logtime.between(before.started_at, value))
            return ""

        return commit

    def _visit_choices(self) -> None:
        """The visits as the drop-down lists them (a start or label changed)."""
        survey = self.editor.survey
        choice = self.query_one("#visit-choice", Choice)
        options = _choices(survey)
        index = self.editor.visit_index % len(survey.visits)
        with choice.prevent(Select.Changed):
            choice.set_options(options)
            choice.value = index
        # the value may be the one it was, which draws nothing anew: the words shown are set
        choice.query_one("SelectCurrent").update(options[index][0])  # type: ignore[attr-defined]

    def _offer_move(self, by: dt.timedelta) -> None:
        """With the start moved, ask whether the readings' times move with it."""
        count = self.visit.readings_timed()
        if abs(by) < dt.timedelta(minutes=1) or not count:
            return  # (a start shown to the minute and typed again loses only its seconds)
        index = self.editor.visit_index

        def done(yes: bool | None) -> None:
            if not yes:
                return
            visits = self.editor.survey.visits
            try:  # (the start was set already)
                moved = visits[index].readings_moved(by)
                store.check_record(moved)
            except (InputError, OverflowError) as exc:
                self.app.show_status(screens.readings_not_moved_status(str(exc)), "error")
                return
            visits[index] = moved
            self.committed()
            self.app.show_status(screens.readings_moved_status(count, by))

        question = ConfirmDialog(screens.move_readings_question(count, by))
        question.leave_question = True  # answered before the walk moves on
        self.app.push_screen(question, done)

    def _set_outdoor(self, reading: model.AirReading) -> str:
        reading, warning = walk.stamped(
            reading, self.app.clock(), self.visit, self.editor.survey, replacing=self.visit.outdoor
        )
        visits = self.editor.survey.visits
        visits[self.editor.visit_index] = walk.checked(self.visit, "outdoor", outdoor=reading)
        self.committed()
        self.show_state(reading)
        return warning

    @on(AirPair.Preview)
    def _preview(self, event: AirPair.Preview) -> None:
        self.show_state(event.reading)

    def show_state(self, reading: model.AirReading | None) -> None:
        panel = self.query_one("#outdoor-state", Static)
        d = self.app.display_units
        if reading is None:
            panel.update(Text(screens.NO_OUTDOOR_READING))
            return
        pressure = model.pressure_pa_for(self.editor.survey, self.visit)
        state = psychro.state_from_rh(reading.dry_bulb_c, reading.rh_pct, pressure)
        lines = [Text(screens.HEADINGS["outdoor_air"], style="bold")] + [
            Text(line) for line in screens.air_state_lines(state, d, pressure_pa=pressure)
        ]
        panel.update(Text("\n").join(lines))

    @on(Select.Changed, "#visit-choice")
    def _choose(self, event: Select.Changed) -> None:
        if isinstance(event.value, int) and event.value != self.editor.visit_index % len(
            self.editor.survey.visits
        ):
            self.editor.visit_index = event.value
            self.app.go("visit")

    @on(Button.Pressed, "#to-rooms")
    def _continue(self) -> None:
        self.app.go("rooms")
