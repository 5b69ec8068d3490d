"""The room: use, volume, occupants, the air reading, the surfaces and material readings,
what was seen, notes and photos, and the live panel with the room's actions."""

from __future__ import annotations

import msgspec
from rich.text import Text
from textual import events, on
from textual.binding import Binding
from textual.containers import Horizontal, VerticalScroll
from textual.widgets import Checkbox, DataTable, Input, Select, Static

from survey import evaluate, model, units, words
from survey import thresholds as th
from survey.app import equipment, judging, panel, room_details, room_rows, walk
from survey.app.air import AirPair
from survey.app.fields import Choice, Field, Tick, plain
from survey.app.panel import LivePanel
from survey.app.room_tables import RoomTables
from survey.app.tables import EquipmentTable, MaterialTable, SurfaceTable
from survey.errors import InputError

USES = [(u.replace("_", " "), u) for u in th.ROOM_USES]
#: A volume more than this many times above or below the floor area × height given is saved
#: with a warning (our choice: a loft or a stairwell can differ, a unit mix-up is ~35×).
VOLUME_WARN_RATIO = 2.0
ODOURS = [
    ("not recorded", ""),
    ("none", "none"),
    ("musty", "musty"),
    ("earthy", "earthy"),
    ("sewage", "sewage"),
    ("chemical", "chemical"),
    ("other", "other"),
]
WATER = [
    ("not recorded", 0),
    ("1: clean water", 1),
    ("2: significantly contaminated", 2),
    ("3: grossly contaminated (sewage, flood water)", 3),
]


class RoomScreen(RoomTables, walk.WalkScreen):
    TITLE_TEXT = "Room"
    PARENT = "rooms"
    BINDINGS = [
        Binding("ctrl+n", "next_room", "Next room to read", id="room_next"),
        *panel.PANEL_KEYS,
    ]

    def action_scroll_panel(self, lines: int) -> None:
        panel.scroll_panel(self, lines)

    def __init__(self, room_id: str) -> None:
        super().__init__()
        self.room_id = room_id
        #: (what, where, the record taken away, for a reading: how many readings of its
        #: point were left when it was deleted).
        self.undo_stack: list[tuple[str, int, msgspec.Struct, int]] = []
        #: Each table's rows in full (table id to one Text a row), for the line under it.
        self._details: dict[str, list[Text]] = {"surfaces": [], "materials": []}

    # --- records --------------------------------------------------------------------------

    @property
    def room(self) -> model.Room:
        return self.editor.survey.room(self.room_id)

    @property
    def visit(self) -> model.Visit:
        return self.editor.survey.visits[self.editor.visit_index]

    def record(self, create: bool = False) -> model.RoomVisit | None:
        found = self.visit.room_visit(self.room_id)
        if found is None and create:
            found = model.RoomVisit(room=self.room_id)
            self.visit.rooms.append(found)
        return found

    def previous(self) -> model.RoomVisit | None:
        return judging.previous_room_visit(
            self.editor.survey, self.editor.visit_index, self.room_id
        )

    def offered(self, kind: model.PointKind) -> list:
        """The points of ``kind`` this visit is asked to read, as last read."""
        return judging.offered_points(
            self.editor.survey, self.editor.visit_index, self.room_id, kind
        )

    @staticmethod
    def _volume_placeholder(room: model.Room, system: str) -> str:
        """What an empty volume field stands for: the floor area × height the advice uses,
        or an example (said so, so that it is not read as a value)."""
        estimate = room.volume_estimate_m3()
        if estimate is None:
            volume = "30" if system == "si" else "1060"
            return f"not given; e.g. {volume}, or {units.DIMENSIONS_EXAMPLE[system]}"
        return f"area × height: {words.Display(system)('volume', estimate)}"

    def title_line(self) -> Text:
        line = Text("Room — ", style="bold")
        line.append(plain(self.room.name))
        line.append(
            f"  ({self.editor.survey.rooms.index(self.room) + 1} of "
            f"{len(self.editor.survey.rooms)})"
        )
        if self.read_only:
            line.append("  [read-only]", style="bold")
        return line

    # --- layout ---------------------------------------------------------------------------

    def compose(self):
        room, ro, system = self.room, self.read_only, self.editor.unit_system
        record = self.record()
        seen = record.observations if record else model.Observations()
        before = self.previous()
        yield self.header()
        with Horizontal(classes="split"):
            with walk.Form(id="room-form"):
                yield Field(
                    "Name",
                    room.name,
                    walk.text_parser("Room name", need=True),
                    self._set_room("name", "Room name"),
                    id="room-name",
                    disabled=ro,
                )
                yield walk.labelled(
                    "Use",
                    Choice(
                        USES,
                        value=room.use,
                        allow_blank=False,
                        compact=True,
                        id="room-use",
                        disabled=ro,
                    ),
                )
                yield Field(
                    "Volume",
                    walk.shown("volume", room.volume_m3, system),
                    walk.optional(walk.volume_or_dimensions("Room volume", system)),
                    self._set_volume(),
                    id="room-volume",
                    placeholder=self._volume_placeholder(room, system),
                    disabled=ro,
                )
                yield Field(
                    "Occupants",
                    "" if room.occupants is None else str(room.occupants),
                    walk.optional(walk.whole("Occupants")),
                    self._set_room("occupants", "Occupants"),
                    id="room-occupants",
                    placeholder="not recorded",
                    disabled=ro,
                )
                yield from room_details.room_fields(self, room, system, ro)
                yield Static(Text("Air", style="bold"))
                yield from room_details.visit_fields(record, ro)
                yield AirPair(
                    "room",
                    record.air if record else None,
                    system,
                    self._set_air,
                    disabled=ro,
                    previous=before.air if before else None,
                    clear=self._clear_air,
                )
                yield Static(Text("Surfaces", style="bold"))
                yield SurfaceTable(id="surfaces")
                yield Static("", id="surfaces-detail", classes="row-detail")
                yield Static(Text("Material readings", style="bold"))
                yield MaterialTable(id="materials")
                yield Static("", id="materials-detail", classes="row-detail")
                yield Static(Text("What was seen", style="bold"))
                yield Tick(
                    "Mould seen",
                    seen.mould_visible,
                    compact=True,
                    id="seen-mould_visible",
                    disabled=ro,
                )
                yield Field(
                    "Mould area",
                    walk.shown("area", seen.mould_area_m2, system),
                    walk.optional(walk.area("Mould area", system)),
                    self._set_seen("mould_area_m2", "Mould area"),
                    id="seen-area",
                    placeholder="m²" if system == "si" else "ft²",
                    disabled=ro,
                )
                yield Tick(
                    "Condensation seen",
                    seen.condensation_seen,
                    compact=True,
                    id="seen-condensation_seen",
                    disabled=ro,
                )
                yield walk.labelled(
                    "Water category",
                    Choice(
                        WATER,
                        value=seen.water_category or 0,
                        allow_blank=False,
                        compact=True,
                        id="seen-water",
                        disabled=ro,
                    ),
                )
                yield walk.labelled(
                    "Odour",
                    Choice(
                        ODOURS,
                        value=seen.odour or "",
                        allow_blank=False,
                        compact=True,
                        id="seen-odour",
                        disabled=ro,
                    ),
                )
                yield Static(Text("Equipment in the room", style="bold"))
                yield EquipmentTable(id="equipment")
                yield Field(
                    "Notes",
                    record.notes if record else "",
                    walk.text_parser("Notes"),
                    self._set_record("notes", "Notes"),
                    id="room-notes",
                    disabled=ro,
                )
                yield Field(
                    "Photos",
                    ", ".join(record.photos) if record else "",
                    walk.photo_names("Photos"),
                    self._set_record("photos", "Photos"),
                    id="room-photos",
                    placeholder="e.g. p1.jpg, p2.jpg",
                    disabled=ro,
                )
            yield VerticalScroll(LivePanel(id="live"), id="live-scroll")
        yield from self.footer_widgets()

    def on_mount(self) -> None:
        surfaces = self.query_one(SurfaceTable)
        surfaces.add_headings(
            " ", "location", "temp.", "surface RH", "state", "margin ± U", "element", "last visit"
        )
        materials = self.query_one(MaterialTable)
        materials.add_headings(" ", "location", "reading", "state", "material", "last visit")
        self.query_one(EquipmentTable).add_headings(*equipment.COLUMNS)
        self.refresh_view()
        record = self.record()
        if self.read_only or (record is not None and record.air is not None):
            surfaces.focus()
        else:
            self.query_one("#room-temp-input").focus()

    # --- showing --------------------------------------------------------------------------

    def refresh_view(self) -> None:
        survey, d = self.editor.survey, self.app.display_units
        judged = evaluate.assess_room(survey, self.editor.visit_index, self.room_id)
        self.query_one(LivePanel).show(judged, d)
        record = self.record()
        finding = judged.finding if judged else None
        at = (survey, self.editor.visit_index, self.room_id)
        self._fill(SurfaceTable, "surfaces", room_rows.surface_rows(*at, finding, d))
        self._fill(MaterialTable, "materials", room_rows.material_rows(*at, finding))
        table = self.query_one(EquipmentTable)
        row = table.cursor_row
        table.clear()
        for n, e in enumerate(record.equipment if record else ()):
            table.add_row(*equipment.row(e, self, n), key=f"e{n}")
        if table.row_count:
            table.move_cursor(row=min(row, table.row_count - 1))
        self.query_one(".screen-title", Static).update(self.title_line())
        self.query_one("#room-volume-input", Input).placeholder = self._volume_placeholder(
            self.room, self.editor.unit_system
        )

    def _fill(self, table_type, name: str, rows: list[room_rows.Row]) -> None:
        """Refill a table of points, keeping the cursor's row, and its line in full."""
        table = self.query_one(table_type)
        row = table.cursor_row
        table.clear()
        for cells, key, _ in rows:
            table.add_row(*cells, key=key)
        self._details[name] = [line for _, _, line in rows]
        if table.row_count:
            table.move_cursor(row=min(row, table.row_count - 1))
        self._show_detail(table)

    def _show_detail(self, table: DataTable, row: int | None = None) -> None:
        """The line under ``table`` for its highlighted row (``row``, else the cursor's)."""
        if row is None:
            row = table.cursor_row if table.row_count else None
        details = self._details.get(table.id or "", [])
        shown = details[row] if row is not None and 0 <= row < len(details) else Text("")
        line = self.query_one(f"#{table.id}-detail", Static)
        line.update(shown)
        line.set_class(not shown.plain, "-empty")

    def on_data_table_row_highlighted(self, event: DataTable.RowHighlighted) -> None:
        table = event.data_table
        if table.id in self._details:
            self._show_detail(table, event.cursor_row)
            if table.has_focus:
                self._detail_in_sight(table)

    def on_descendant_focus(self, event: events.DescendantFocus) -> None:
        if isinstance(event.widget, DataTable) and event.widget.id in self._details:
            self._detail_in_sight(event.widget)

    def _detail_in_sight(self, table: DataTable) -> None:
        """The line under a table says what its brief cells leave out: scrolled into sight
        with the table."""
        line = self.query_one(f"#{table.id}-detail")
        self.call_after_refresh(line.scroll_visible, animate=False)

    # --- committing -----------------------------------------------------------------------

    def _changed(self) -> None:
        self.committed()
        self.refresh_view()

    def _set_volume(self):
        """The room's volume: saved, with a warning where it is far from the floor area ×
        height given (dimensions typed in the other unit system read as 1120 m³ for a
        50 m³ room, and the advice's litres a day with them)."""
        setter = self._set_room("volume_m3", "Room volume")

        def commit(value) -> str:
            setter(value)
            room = self.room
            if value is None or room.floor_area_m2 is None or room.height_m is None:
                return ""
            estimate = room.floor_area_m2 * room.height_m
            if estimate / VOLUME_WARN_RATIO <= value <= estimate * VOLUME_WARN_RATIO:
                return ""
            d = words.Display(self.editor.unit_system)
            return (
                f"Saved as {d('volume', value)}, far from the floor area × height given "
                f"({d('volume', estimate)}): check the figures and their units."
            )

        return commit

    def _set_room(self, name: str, label: str):
        def commit(value) -> str:
            rooms = self.editor.survey.rooms
            index = rooms.index(self.room)
            rooms[index] = walk.checked(rooms[index], label, **{name: value})
            self._changed()
            return ""

        return commit

    def _replace_record(self, label: str, **changes) -> None:
        record = self.record(create=True)
        new = walk.checked(record, label, **changes)
        rooms = self.visit.rooms
        rooms[rooms.index(record)] = new

    def _set_record(self, name: str, label: str):
        def commit(value) -> str:
            self._replace_record(label, **{name: value})
            self._changed()
            return ""

        return commit

    def _set_seen(self, name: str, label: str):
        def commit(value) -> str:
            record = self.record(create=True)
            seen = msgspec.structs.replace(record.observations, **{name: value})
            self._replace_record(label, observations=seen)
            self._changed()
            return ""

        return commit

    def _set_air(self, reading: model.AirReading) -> str:
        record = self.record()
        reading, warning = walk.stamped(
            reading,
            self.app.clock(),
            self.visit,
            self.editor.survey,
            replacing=record.air if record else None,
        )
        self._replace_record("air reading", air=reading)
        self._changed()
        return warning

    def _clear_air(self, reading: model.AirReading) -> str:
        """Delete the room's air reading on this visit (asked first; u puts it back)."""
        self._replace_record("air reading", air=None)
        self.undo_stack.append(("air", 0, reading, 0))
        self._changed()
        return "Deleted the air reading — u puts it back."

    @on(AirPair.Preview)
    def _preview_air(self, event: AirPair.Preview) -> None:
        record = self.record() or model.RoomVisit(room=self.room_id)
        candidate = msgspec.structs.replace(record, air=event.reading)
        judged = evaluate.assess_room(
            self.editor.survey, self.editor.visit_index, self.room_id, candidate
        )
        self.query_one(LivePanel).show(judged, self.app.display_units)

    @on(Select.Changed)
    def _select(self, event: Select.Changed) -> None:
        if self.read_only:
            return
        if event.select.id in room_details.FLAG_SELECTS:
            room_details.flag_changed(self, event.select.id, event.value)
        elif event.select.id == "room-use" and event.value != self.room.use:
            self._set_room("use", "Use")(event.value)
        elif event.select.id == "seen-odour":
            value = event.value or None
            record = self.record()
            if (record.observations.odour if record else None) != value:
                self._set_seen("odour", "Odour")(value)
        elif event.select.id == "seen-water":
            value = event.value or None
            record = self.record()
            if (record.observations.water_category if record else None) != value:
                self._set_seen("water_category", "Water category")(value)

    @on(Checkbox.Changed)
    def _check(self, event: Checkbox.Changed) -> None:
        name = (event.checkbox.id or "").removeprefix("seen-")
        record = self.record()
        current = getattr(record.observations, name) if record else False
        if not self.read_only and event.value != current:
            try:
                self._set_seen(name, name.replace("_", " "))(event.value)
            except InputError as exc:  # the model refuses (e.g. an area with no mould)
                self.app.show_status(f"Not saved — {exc}", "error")
                event.checkbox.value = current

    # --- surfaces and materials -----------------------------------------------------------

    def action_next_room(self) -> None:
        target = judging.next_room_needing(
            self.editor.survey, self.editor.visit_index, self.room_id
        )
        if target is None:
            self.app.show_status("Every room has its readings for this visit (F5: findings).")
        else:
            self.app.open_room(target)
