"""What every screen of the walk shares: a title line, the status line, the footer, and the
parsers that turn typed text into stored values through :mod:`survey.units`."""

from __future__ import annotations

import datetime as dt
from collections.abc import Callable
from typing import Any

import msgspec
from rich.text import Text
from textual.binding import Binding
from textual.containers import Horizontal, VerticalScroll
from textual.screen import Screen
from textual.widgets import Label, Static

from survey import logtime, model, store, units
from survey.app.editing import Editor
from survey.app.fields import plain
from survey.app.footer import KeysFooter
from survey.app.status import StatusBar
from survey.errors import InputError
from survey.words import screens


class Form(VerticalScroll, can_focus=False):
    """A scrolling column of fields; focus goes to the fields, never to the column."""

    DEFAULT_CLASSES = "form"


def labelled(label: str, widget) -> Horizontal:
    """A label and a widget (a Select, a Checkbox) on one line, like a Field."""
    return Horizontal(
        Label(label, classes="field-label", markup=False), widget, classes="field-row"
    )


def cut(text: str, width: int = 28) -> str:
    """A long label cut for a table cell (shown whole where it is edited)."""
    return text if len(text) <= width else text[: width - 1] + "…"


class WalkScreen(Screen):
    """A screen of the walk over an open survey."""

    TITLE_TEXT = ""
    #: The screen Escape goes back to ("" for the start screen).
    PARENT = ""
    BINDINGS = [
        Binding("escape", "back", "Back", id="back"),
        Binding("f7", "new_visit", "New visit", id="new_visit"),
    ]

    @property
    def editor(self) -> Editor:
        editor = self.app.editor
        assert editor is not None
        return editor

    @property
    def read_only(self) -> bool:
        return self.editor.read_only

    def title_line(self) -> Text:
        site = self.editor.survey.site.reference
        text = Text(f"{self.TITLE_TEXT} — ", style="bold")
        text.append(plain(site))
        if self.read_only:
            text.append("  [read-only]", style="bold")
        return text

    def header(self) -> Static:
        return Static(self.title_line(), classes="screen-title")

    def footer_widgets(self):
        yield StatusBar()
        yield KeysFooter()

    def on_screen_resume(self) -> None:
        if getattr(self, "_shown_once", False):
            self.refresh_view()  # back from another screen: the survey may have changed
            for bar in self.query(StatusBar):  # and saved since: the line says when
                bar.show(self.app.status_text, self.app.status_kind)
        self._shown_once = True

    def on_screen_suspend(self) -> None:
        self.commit_pending()

    def commit_pending(self) -> None:
        """Commit text typed but not yet committed (leaving the screen, quitting): a good
        value is saved, a bad one shows its message and is not."""
        from survey.app.fields import Field

        for field in self.query(Field):
            if not field.read_only and field.input.value != field.committed_text:
                field.try_commit()

    def refresh_view(self) -> None:
        """Redraw what depends on the survey (after a change on another screen)."""

    def action_back(self) -> None:
        if self.PARENT:
            self.app.go(self.PARENT)
        else:
            self.app.show_start()

    def committed(self) -> None:
        self.app.committed()

    def action_new_visit(self) -> None:
        """Start a new visit (from any screen of the walk), after asking."""
        from survey.app import judging
        from survey.app.dialogs import ConfirmDialog

        if self.refuse_if_read_only() or not self.app.may_leave(self.action_new_visit):
            return

        def done(yes: bool) -> None:
            if yes:
                survey = self.editor.survey
                last = survey.visits[-1] if survey.visits else None
                survey.visits.append(judging.new_visit(self.app.clock(), last))
                self.editor.visit_index = len(survey.visits) - 1
                self.committed()
                self.app.go("visit")
                self.app.show_status(
                    "New visit started: the rooms and the points measured "
                    "last time are listed to read again."
                )

        self.app.push_screen(
            ConfirmDialog(
                "Start a new visit now? The rooms, surface locations and material points "
                "measured before are offered again (without their values; not those left out "
                "for good), with last time's values shown beside them; the equipment in the "
                "rooms stays (without its readings)."
            ),
            done,
        )

    def refuse_if_read_only(self) -> bool:
        if self.read_only:
            self.app.show_status(self.editor.read_only_reason, "error")
            return True
        return False


#: Hours after a visit began past which a new reading gets a warning (another day's visit?).
LATE_READING_H = 4.0


#: The instrument kinds that take each kind of reading, in the order one is chosen.
READING_INSTRUMENTS = {
    "air": ("thermo_hygrometer", "combined_meter", "data_logger"),
    "surface": ("surface_thermometer", "combined_meter"),
    "material": ("moisture_meter", "combined_meter"),
}


def default_instrument(survey: model.Survey, reading_kind: str) -> str | None:
    """The site's first instrument that takes this kind of reading (so its accuracy is
    the one the judgement uses), else None (typical accuracies are used)."""
    for kind in READING_INSTRUMENTS[reading_kind]:
        for instrument in survey.instruments:
            if instrument.kind == kind:
                return instrument.id
    return None


def stamped(
    reading,
    now: dt.datetime,
    visit: model.Visit,
    survey: model.Survey | None = None,
    reading_kind: str = "air",
    replacing=None,
):
    """``reading`` taken now (with the site's instrument for it when none is named), and a
    warning when that is long after the visit began. A reading ``replacing`` one that has a
    time is a correction of it: it keeps that reading's time and instrument (correcting
    yesterday's typing slip must not move yesterday's reading to today)."""
    if replacing is not None and replacing.taken_at is not None:
        return (
            msgspec.structs.replace(
                reading, taken_at=replacing.taken_at, instrument=replacing.instrument
            ),
            "",
        )
    now = now.replace(microsecond=0)
    if survey is not None and reading.instrument is None:
        reading = msgspec.structs.replace(
            reading, instrument=default_instrument(survey, reading_kind)
        )
    # (a visit time with a time zone against the clock without: as the wall clocks read)
    hours = logtime.between(visit.started_at, now).total_seconds() / 3600.0
    if -LATE_READING_H <= hours <= LATE_READING_H:
        return msgspec.structs.replace(reading, taken_at=now), ""
    # The clock is far from the visit (a visit written up later, or a start mistyped): the
    # reading gets no time, so it counts as taken at the visit's start; stamping the clock
    # would put it days off and skew the drying rates.
    return reading, screens.untimed_reading_warning(hours, visit.started_at)


# --- parsers: text -> stored value (raise InputError) ----------------------------------------


def optional(parse: Callable[[str], Any]) -> Callable[[str], Any]:
    """Empty text clears the value (None); anything else goes to ``parse``."""

    def run(text: str) -> Any:
        return None if not text.strip() else parse(text)

    return run


def required(name: str, parse: Callable[[str], Any]) -> Callable[[str], Any]:
    def run(text: str) -> Any:
        if not text.strip():
            raise InputError(name, text, "a value is needed here")
        return parse(text)

    return run


def text_parser(name: str, need: bool = False, multi_line: bool = False) -> Callable[[str], str]:
    def run(text: str) -> str:
        if need and not text.strip():
            raise InputError(name, text, "cannot be empty")
        if not multi_line and ("\n" in text or "\r" in text):
            raise InputError(name, text.replace("\n", "\\n"), "one line only")
        return text.strip()

    return run


def temperature(name: str, system: str, check=None) -> Callable[[str], float]:
    """A temperature; with ``check`` (a core domain check such as
    :func:`survey.psychro.check_dry_bulb`) held to it, the message naming the text typed."""
    if check is None:
        return lambda text: units.parse_temperature(text, name, system)
    return lambda text: units.read("temperature", text, name, system).checked(check)


def difference(name: str, system: str) -> Callable[[str], float]:
    return lambda text: units.parse_temperature_difference(text, name, system)


def rh(name: str) -> Callable[[str], float]:
    """An RH, held to the core's domain (the message names the text typed, not a float)."""
    from survey import psychro

    return lambda text: units.read("relative_humidity", text, name).checked(psychro.check_rh)


def number(name: str) -> Callable[[str], float]:
    return lambda text: units.parse_number(text, name)


def whole(name: str) -> Callable[[str], int]:
    def run(text: str) -> int:
        value = units.parse_number(text, name)
        if value != int(value):
            raise InputError(name, text, "a whole number such as 0, 1 or 2")
        return int(value)

    return run


def pressure(name: str, system: str) -> Callable[[str], float]:
    """A barometric pressure, range-checked as the psychrometrics need it."""
    from survey import psychro

    return lambda text: units.read("pressure", text, name, system).checked(psychro.check_pressure)


def length(name: str, system: str) -> Callable[[str], float]:
    return lambda text: units.parse_length(text, name, system)


def area(name: str, system: str) -> Callable[[str], float]:
    """An area in m² from ``0.6``, ``0.6 m2``, ``6 sq ft`` (a bare number in the survey's
    unit)."""
    return lambda text: units.read("area", text, name, system).value


def photo_names(name: str) -> Callable[[str], list[str]]:
    """File names separated by commas, each checked as a photo name the survey may hold."""

    def run(text: str) -> list[str]:
        names = [p.strip() for p in text_parser(name)(text).split(",") if p.strip()]
        for photo in names:
            problem = model.photo_name_problem(photo)
            if problem:
                raise InputError(name, photo, problem)
        return names

    return run


#: A yes / no / not recorded choice, for a Select (``None``: not recorded).
YES_NO = [("not recorded", ""), ("yes", "yes"), ("no", "no")]


def yes_no_value(choice: object) -> bool | None:
    return None if choice in ("", None) else choice == "yes"


def yes_no_choice(value: bool | None) -> str:
    return "" if value is None else ("yes" if value else "no")


def volume_or_dimensions(name: str, system: str) -> Callable[[str], float]:
    """A volume (``30``, ``30 m3``) or dimensions multiplied out (``4.2 x 3.1 x 2.4``)."""
    return lambda text: units.parse_volume_or_dimensions(text, name, system)


def timestamp(name: str) -> Callable[[str], dt.datetime]:
    def run(text: str) -> dt.datetime:
        try:
            return dt.datetime.fromisoformat(text.strip().replace("T", " "))
        except ValueError:
            raise InputError(name, text, "a date and time such as 2026-12-02 09:30") from None

    return run


def date(name: str) -> Callable[[str], dt.date]:
    def run(text: str) -> dt.date:
        try:
            return dt.date.fromisoformat(text.strip())
        except ValueError:
            raise InputError(name, text, "a date such as 2026-03-14") from None

    return run


def checked(record: msgspec.Struct, label: str, /, **changes: Any) -> msgspec.Struct:
    """``record`` with ``changes``, checked by the model (InputError naming ``label``)."""
    new = msgspec.structs.replace(record, **changes)
    try:
        store.check_record(new)
    except InputError as exc:
        raise InputError(label, exc.value, exc.allowed) from None
    return new


# --- showing stored numbers in an input -----------------------------------------------------


def shown(quantity: str, value_si: float | None, system: str) -> str:
    """A stored SI value as the text an input starts with, in the survey's units."""
    if value_si is None:
        return ""
    if quantity in ("rh", "number"):
        return f"{round(value_si, 2):g}"
    return f"{round(units.to_display(quantity, value_si, system), 2):g}"
