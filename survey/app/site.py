"""The site: reference, address, client, purpose, inspector, unit system, instruments."""

from __future__ import annotations

from rich.text import Text
from textual import on
from textual.widgets import Button, DataTable, Label, Select, Static

from survey import model, season, store, units, words
from survey.app import walk
from survey.app.dialogs import ConfirmDialog, PromptDialog
from survey.app.fields import Choice, Field, plain
from survey.app.tables import InstrumentTable
from survey.errors import InputError
from survey.words import season as ws
from survey.words.report import INSTRUMENT_KIND_WORDS

PURPOSES = [
    ("damp or mould complaint", "damp_complaint"),
    ("drying check", "drying_check"),
    ("before a purchase or lease", "pre_purchase"),
    ("before coating or flooring", "pre_coating"),
    ("routine inspection", "routine"),
    ("other", "other"),
]
UNIT_SYSTEMS = [("SI (°C, m, g/kg)", "si"), ("IP (°F, ft, gr/lb)", "ip")]
#: The instrument kinds as the dialog offers them: (words, stored value).
INSTRUMENT_KINDS = [(words, kind) for kind, words in INSTRUMENT_KIND_WORDS.items()]


class SiteScreen(walk.WalkScreen):
    TITLE_TEXT = "Site"

    def compose(self):
        site = self.editor.survey.site
        ro = self.read_only
        yield self.header()
        with walk.Form():
            for name, label in (
                ("reference", "Reference"),
                ("address", "Address"),
                ("client", "Client"),
                ("inspector", "Inspector"),
            ):
                yield Field(
                    label,
                    getattr(site, name),
                    walk.text_parser(label, need=name == "reference"),
                    self._setter(name, label),
                    id=f"site-{name}",
                    disabled=ro,
                )
            yield walk.labelled(
                "Purpose",
                Choice(
                    PURPOSES,
                    value=site.purpose,
                    allow_blank=False,
                    compact=True,
                    id="site-purpose",
                    disabled=ro,
                ),
            )
            yield walk.labelled(
                "Units shown",
                Choice(
                    UNIT_SYSTEMS,
                    value=site.unit_system,
                    allow_blank=False,
                    compact=True,
                    id="site-unit_system",
                    disabled=ro,
                ),
            )
            system = site.unit_system
            yield Field(
                f"Altitude {'ft' if system == 'ip' else 'm'}",
                walk.shown("length", site.altitude_m, system),
                walk.optional(lambda t: units.parse_length(t, "Altitude", system)),
                self._setter("altitude_m", "Altitude"),
                id="site-altitude",
                placeholder="for the air pressure; 350 m, 1150 ft",
                disabled=ro,
            )
            yield Field(
                "Construction",
                site.construction,
                walk.text_parser("Construction"),
                self._setter("construction", "Construction"),
                id="site-construction",
                disabled=ro,
            )
            yield Field(
                "Year built",
                "" if site.year_built is None else str(site.year_built),
                walk.optional(walk.whole("Year built")),
                self._year_setter(),
                id="site-year",
                disabled=ro,
            )
            yield Field(
                "Notes",
                site.notes,
                walk.text_parser("Notes"),
                self._setter("notes", "Notes"),
                id="site-notes",
                disabled=ro,
            )
            yield Label(Text("Instruments", style="bold"))
            yield Static(
                Text("On the table: a adds an instrument, Enter edits, d deletes."), classes="hint"
            )
            yield InstrumentTable(id="instruments")
            yield Label(Text(ws.SITE_GROUP, style="bold"))
            yield Static(Text(ws.SITE_GROUP_HINT), classes="hint")
            hints = ws.site_field_hints(words.Display(system))
            unit = "°F" if system == "ip" else "°C"
            for name, label, quantity, parse, hint in (
                (
                    "design_outdoor_temp_c",
                    f"Month outdoor {unit}",
                    "temperature",
                    walk.temperature("Design month outdoor", system),
                    hints["outdoor_temp"],
                ),
                (
                    "design_outdoor_rh_pct",
                    "Month outdoor RH",
                    "rh",
                    walk.rh("Design month outdoor RH"),
                    hints["outdoor_rh"],
                ),
                (
                    "design_indoor_temp_c",
                    f"Month indoor {unit}",
                    "temperature",
                    walk.temperature("Design month indoor", system),
                    hints["indoor_temp"],
                ),
            ):
                yield Field(
                    label,
                    walk.shown(quantity, getattr(site, name), system),
                    walk.optional(parse),
                    self._design_setter(name, label),
                    id=f"site-{name.replace('_', '-')}",
                    placeholder=hint,
                    disabled=ro,
                )
            yield Button("Continue to the visit ▸", id="to-visit", compact=True)
        yield from self.footer_widgets()

    def on_mount(self) -> None:
        table = self.query_one("#instruments", DataTable)
        # the accuracies and the calibration before the free-text name, so that at 80 columns
        # what the readings' uncertainty rests on is in sight
        table.add_headings("id", "kind", "± air K", "± RH %", "± surface K", "calibrated", "name")
        self.fill_instruments()

    def fill_instruments(self) -> None:
        table = self.query_one("#instruments", DataTable)
        table.clear()
        for i, inst in enumerate(self.editor.survey.instruments):
            table.add_row(
                plain(inst.id),
                Text(INSTRUMENT_KIND_WORDS.get(inst.kind, inst.kind)),
                Text(_g(inst.air_temp_accuracy_k)),
                Text(_g(inst.rh_accuracy_pct)),
                Text(_g(inst.surface_temp_accuracy_k)),
                Text(str(inst.calibrated_on or "–")),
                plain(inst.name),
                key=str(i),
            )

    def _setter(self, name: str, label: str):
        def commit(value):
            survey = self.editor.survey
            survey.site = walk.checked(survey.site, label, **{name: value})
            self.committed()
            return ""

        return commit

    def _year_setter(self):
        """The year built: not after this year (a typed 2090 for 1990 would drop the
        cautions that go by the building's age)."""
        setter = self._setter("year_built", "Year built")

        def commit(value):
            this_year = self.app.clock().year
            if value is not None and value > this_year:
                raise InputError("Year built", str(value), f"a year up to {this_year}")
            return setter(value)

        return commit

    def _design_setter(self, name: str, label: str):
        """A design-month field: the site must still give a month the colder-month
        projection can use (in the psychrometric range, indoor warmer than outdoor)."""

        def commit(value):
            survey = self.editor.survey
            site = walk.checked(survey.site, label, **{name: value})
            try:
                season.site_design_month(site)
            except InputError as exc:
                raise InputError(label, exc.value, exc.allowed) from None
            survey.site = site
            self.committed()
            return ""

        return commit

    @on(Select.Changed)
    def _select(self, event: Select.Changed) -> None:
        name = (event.select.id or "").removeprefix("site-")
        site = self.editor.survey.site
        if self.read_only or getattr(site, name) == event.value:
            return
        self.editor.survey.site = walk.checked(site, name, **{name: event.value})
        self.committed()
        if name == "unit_system":
            self.app.go("site")  # the numbers shown change units

    @on(Button.Pressed, "#to-visit")
    def _continue(self) -> None:
        self.app.go("visit")

    # --- instruments ----------------------------------------------------------------------

    def _instrument_dialog(
        self, title: str, inst: model.Instrument | None, index: int | None
    ) -> None:
        system = self.editor.unit_system
        values = [
            ("Id (short, e.g. th1)", inst.id if inst else ""),
            ("Kind", inst.kind if inst else "thermo_hygrometer", INSTRUMENT_KINDS),
            ("Name (make and model)", inst.name if inst else ""),
            ("± air temperature, K", _g(inst.air_temp_accuracy_k, "") if inst else ""),
            ("± RH, percentage points", _g(inst.rh_accuracy_pct, "") if inst else ""),
            ("± surface temperature, K", _g(inst.surface_temp_accuracy_k, "") if inst else ""),
            ("Calibrated on (YYYY-MM-DD)", str(inst.calibrated_on or "") if inst else ""),
        ]
        result: dict = {}

        def check(v: list[str]) -> str:
            try:
                kind = v[1]
                record = model.Instrument(
                    id=v[0].strip(),
                    kind=kind,
                    name=v[2].strip(),
                    air_temp_accuracy_k=walk.optional(walk.difference("± air", system))(v[3]),
                    rh_accuracy_pct=walk.optional(walk.number("± RH"))(v[4]),
                    surface_temp_accuracy_k=walk.optional(walk.difference("± surface", system))(
                        v[5]
                    ),
                    calibrated_on=walk.optional(walk.date("Calibrated on"))(v[6]),
                )
                store.check_record(record, "instrument")
                ids = [i.id for n, i in enumerate(self.editor.survey.instruments) if n != index]
                if record.id in ids:
                    raise InputError("Id", record.id, "is used by another instrument")
            except InputError as exc:
                return f"Not saved — {exc}"
            result["record"] = record
            return ""

        def done(answer) -> None:
            if answer is None or "record" not in result:
                return
            items = self.editor.survey.instruments
            if index is None:
                items.append(result["record"])
            else:
                items[index] = result["record"]
            self.committed()
            self.fill_instruments()
            # the cursor on the instrument just saved (a new one is the last row)
            table = self.query_one("#instruments", DataTable)
            table.move_cursor(row=len(items) - 1 if index is None else index)

        self.app.push_screen(PromptDialog(title, values, check), done)

    def _current(self) -> int | None:
        table = self.query_one("#instruments", DataTable)
        if not self.editor.survey.instruments:
            return None
        return table.cursor_row

    def action_add_instrument(self) -> None:
        if not self.refuse_if_read_only():
            self._instrument_dialog("Add an instrument", None, None)

    def action_edit_instrument(self) -> None:
        index = self._current()
        if index is not None and not self.refuse_if_read_only():
            self._instrument_dialog(
                "Edit the instrument", self.editor.survey.instruments[index], index
            )

    def action_delete_instrument(self) -> None:
        index = self._current()
        if index is None or self.refuse_if_read_only():
            return
        inst = self.editor.survey.instruments[index]
        if any(
            r.instrument == inst.id
            for v in self.editor.survey.visits
            for rv in v.rooms
            for r in (rv.air, *rv.surfaces, *rv.materials)
            if r
        ):
            self.app.show_status(f"Instrument {inst.id} is used by readings; it stays.", "error")
            return

        def done(yes: bool) -> None:
            if yes:
                del self.editor.survey.instruments[index]
                self.committed()
                self.fill_instruments()

        self.app.push_screen(ConfirmDialog(f"Delete the instrument {inst.id}?"), done)


def _g(value: float | None, empty: str = "–") -> str:
    return empty if value is None else f"{value:g}"
