"""Dialogs for one surface reading and one material reading of a room. The surface dialog
previews the surface's judgement while its temperature is typed."""

from __future__ import annotations

from collections.abc import Callable

import msgspec
from rich.text import Text
from textual import on
from textual.binding import Binding
from textual.containers import Vertical
from textual.screen import ModalScreen
from textual.widgets import Checkbox, Select, Static

from survey import model, psychro, store, words
from survey.app import walk
from survey.app.fields import Choice, Field, Tick, plain
from survey.errors import InputError
from survey.words import screens

ELEMENTS = [
    (words.ELEMENT_WORDS.get(e, e.replace("_", " ")), e)
    for e in (
        "external_wall",
        "internal_wall",
        "ceiling",
        "floor",
        "window_frame",
        "glazing",
        "pipe",
        "other",
    )
]
SCALES = [
    ("timber moisture content, % (pin meter on wood)", "mc_pct"),
    ("wood moisture equivalent, %", "wme_pct"),
    ("meter's relative scale", "relative"),
]


class _ReadingDialog(ModalScreen[msgspec.Struct | None]):
    BINDINGS = [Binding("escape", "cancel", "Cancel", id="reading_cancel")]

    def __init__(self, title: str, previous: str = "") -> None:
        super().__init__()
        self.title_text = title
        self.previous = previous
        self.values: dict[str, object] = {}

    def keep(self, name: str) -> Callable[[object], str]:
        def commit(value: object) -> str:
            self.values[name] = value
            return ""

        return commit

    def action_cancel(self) -> None:
        self.dismiss(None)

    def finish(self) -> None:
        """Save, unless a field refuses its text. A value taken with a warning (possible
        but unlikely) is shown first, and saved on the next Enter: a dialog that closed at
        once would hide the warning with it."""
        warned = []
        for field in self.query(Field):
            if not field.try_commit(force=True):
                field.input.focus()
                return
            if field.warning:  # shown under the field
                warned.append((field.id, field.committed_text))
        message = self.query_one("#dialog-message", Static)
        try:
            record = self.build()
            store.check_record(record)
        except InputError as exc:
            self._say(message, f"Not saved — {exc}", "-error")
            return
        if warned and warned != self._warned:
            self._warned = warned
            self._say(message, screens.CHECK_BEFORE_SAVING)
            return
        self.dismiss(record)

    #: The values last warned about (field and text); the same values again do not stop
    #: the save twice, a value changed since does.
    _warned: list[tuple[str | None, str]] = []

    @staticmethod
    def _say(message: Static, text: str, kind: str = "-warning") -> None:
        message.update(plain(text))
        message.set_class(kind == "-error", "-error")
        message.set_class(kind == "-warning", "-warning")
        message.display = True

    def build(self) -> msgspec.Struct:
        raise NotImplementedError


class SurfaceDialog(_ReadingDialog):
    """Location, element, material, what was seen, and the temperature (Enter saves)."""

    def __init__(
        self,
        title: str,
        system: str,
        reading: model.SurfaceReading | None,
        preview: Callable[[model.SurfaceReading], Text],
        previous: str = "",
        air_c: float | None = None,
    ) -> None:
        super().__init__(title, previous)
        self.system = system
        self.reading = reading
        self.preview_fn = preview
        self.air_c = air_c

    def compose(self):
        r = self.reading
        unit = "°F" if self.system == "ip" else "°C"
        with Vertical(classes="dialog"):
            yield Static(Text(self.title_text, style="bold"))
            yield Field(
                "Location",
                r.location if r else "",
                walk.text_parser("Location", need=True),
                self.keep("location"),
                id="surface-location",
                placeholder="e.g. NE corner, 0.2 m up",
            )
            yield walk.labelled(
                "Element",
                Choice(
                    ELEMENTS,
                    value=r.element if r else "external_wall",
                    allow_blank=False,
                    compact=True,
                    id="surface-element",
                ),
            )
            yield Field(
                "Material",
                r.material if r else "",
                walk.text_parser("Material"),
                self.keep("material"),
                id="surface-material",
            )
            yield Tick(
                "Condensation seen here",
                r.condensation_seen if r else False,
                compact=True,
                id="surface-condensation",
            )
            yield Tick(
                "Mould seen here", r.mould_visible if r else False, compact=True, id="surface-mould"
            )
            yield Field(
                f"Temperature {unit}",
                ""
                if r is None or r.surface_temp_c is None
                else walk.shown("temperature", r.surface_temp_c, self.system),
                walk.required(
                    "Surface temperature",
                    walk.temperature(
                        "Surface temperature", self.system, psychro.check_surface_temp
                    ),
                ),
                self._temperature,
                id="surface-temp",
                live=True,
                previous=self.previous,
                on_enter=self.finish,
            )
            yield Static("", id="dialog-message", classes="field-message -error")
            yield Static(id="surface-preview", classes="preview")
            yield Static(
                Text("Enter in Temperature saves · Tab moves · Escape cancels", style="dim")
            )

    def on_mount(self) -> None:
        if self.reading is not None and self.reading.location:
            self.query_one("#surface-temp-input").focus()
        else:
            self.query_one("#surface-location-input").focus()
        known = None if self.reading is None else self.reading.surface_temp_c
        if known is not None:
            self.values["surface_temp_c"] = known
        self._show_preview(known)

    def _temperature(self, value: float) -> str:
        walk.checked(
            model.SurfaceReading(location="-", element="other", surface_temp_c=0.0),
            "Surface temperature",
            surface_temp_c=value,
        )
        self.values["surface_temp_c"] = value
        return screens.surface_temp_warning(value, self.air_c, words.Display(self.system))

    def build(self) -> model.SurfaceReading:
        base = {
            "location": self.values.get("location", ""),
            "element": self.query_one("#surface-element", Select).value,
            "surface_temp_c": self.values["surface_temp_c"],
            "material": self.values.get("material", ""),
            "condensation_seen": self.query_one("#surface-condensation", Checkbox).value,
            "mould_visible": self.query_one("#surface-mould", Checkbox).value,
        }
        if self.reading is not None:
            return msgspec.structs.replace(self.reading, **base)
        return model.SurfaceReading(**base)

    @on(Field.Preview, "#surface-temp")
    def _preview(self, event: Field.Preview) -> None:
        event.stop()
        self._show_preview(event.value)

    def _show_preview(self, temp_c: float | None) -> None:
        target = self.query_one("#surface-preview", Static)
        if temp_c is None:
            target.update(Text("Type a temperature to see what it means here."))
            return
        location = self.query_one("#surface-location-input").value.strip() or "this surface"
        element = self.query_one("#surface-element", Select).value
        try:
            candidate = model.SurfaceReading(
                location=location, element=element, surface_temp_c=temp_c
            )
            store.check_record(candidate)
        except InputError as exc:
            target.update(plain(str(exc)))
            return
        target.update(self.preview_fn(candidate))


class MaterialDialog(_ReadingDialog):
    """Location, material, scale, dry standard, and the value (Enter saves)."""

    def __init__(
        self, title: str, reading: model.MaterialReading | None, previous: str = ""
    ) -> None:
        super().__init__(title, previous)
        self.reading = reading

    def compose(self):
        r = self.reading
        with Vertical(classes="dialog"):
            yield Static(Text(self.title_text, style="bold"))
            yield Field(
                "Location",
                r.location if r else "",
                walk.text_parser("Location", need=True),
                self.keep("location"),
                id="material-location",
            )
            yield Field(
                "Material",
                r.material if r else "",
                walk.text_parser("Material", need=True),
                self.keep("material"),
                id="material-material",
                placeholder="e.g. gypsum plaster",
            )
            yield walk.labelled(
                "Scale",
                Choice(
                    SCALES,
                    value=r.scale if r else "wme_pct",
                    allow_blank=False,
                    compact=True,
                    id="material-scale",
                ),
            )
            yield Tick(
                "Dry standard (an unaffected spot of the same material)",
                r.dry_standard if r else False,
                compact=True,
                id="material-dry",
            )
            yield Field(
                "Reading",
                "" if r is None or r.value is None else f"{r.value:g}",
                walk.required("Moisture reading", walk.number("Moisture reading")),
                self._value,
                id="material-value",
                previous=self.previous,
                on_enter=self.finish,
            )
            yield Static("", id="dialog-message", classes="field-message -error")
            yield Static(Text("Enter in Reading saves · Tab moves · Escape cancels", style="dim"))

    def _value(self, value: float) -> str:
        walk.checked(
            model.MaterialReading(location="-", material="-", value=0.0, scale="relative"),
            "Moisture reading",
            value=value,
        )
        self.values["value"] = value
        return ""

    def on_mount(self) -> None:
        target = (
            "#material-value-input"
            if self.reading and self.reading.location
            else "#material-location-input"
        )
        self.query_one(target).focus()
        if self.reading is not None and self.reading.value is not None:
            self.values["value"] = self.reading.value

    def build(self) -> model.MaterialReading:
        base = {
            "location": self.values.get("location", ""),
            "material": self.values.get("material", ""),
            "value": self.values["value"],
            "scale": self.query_one("#material-scale", Select).value,
            "dry_standard": self.query_one("#material-dry", Checkbox).value,
        }
        if self.reading is not None:
            return msgspec.structs.replace(self.reading, **base)
        return model.MaterialReading(**base)
