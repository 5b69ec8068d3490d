"""Tables whose rows are added, edited and deleted by keys (shown in the footer while the
table has focus). Every cell is given as ``Text``, never as a markup string."""

from __future__ import annotations

from rich.text import Text
from textual.binding import Binding
from textual.widgets import DataTable


class RowTable(DataTable):
    """A row-cursor table; the keys call the screen's actions named in ``BINDINGS``."""

    def __init__(self, **kwargs) -> None:
        super().__init__(cursor_type="row", zebra_stripes=True, **kwargs)

    def add_headings(self, *labels: str) -> None:
        """The column headings, as plain text: a heading is never read as markup (and a
        string heading would be, which also loads Rich's emoji table at start-up)."""
        self.add_columns(*(Text(label) for label in labels))


class InstrumentTable(RowTable):
    BINDINGS = [
        Binding("a", "screen.add_instrument", "Add", id="instrument_add"),
        Binding("e,enter", "screen.edit_instrument", "Edit", id="instrument_edit"),
        Binding("d,delete", "screen.delete_instrument", "Delete", id="instrument_delete"),
    ]


class RoomTable(RowTable):
    BINDINGS = [
        Binding("enter", "screen.open_room", "Open", id="rooms_open"),
        Binding("a", "screen.add_room", "Add", id="rooms_add"),
        Binding("r", "screen.rename_room", "Rename", id="rooms_rename"),
        Binding("d,delete", "screen.delete_room", "Delete", id="rooms_delete"),
        Binding("u", "screen.undo", "Undo", id="rooms_undo", tooltip="Undo the last deletion"),
        # In the help screen and the hint line, not the footer (it has no room for them).
        Binding("[", "screen.move(-1)", "Move up", id="rooms_up", show=False),
        Binding("]", "screen.move(1)", "Move down", id="rooms_down", show=False),
        Binding("f", "screen.reference", "Reference room", id="rooms_reference", show=False),
    ]


LEAVE_OUT_TIP = (
    "Delete a reading; on a point still to read, leave it out (why, and whether for good); "
    "on one left out, put it back to read"
)


class SurfaceTable(RowTable):
    BINDINGS = [
        Binding("a", "screen.add_surface", "Add", id="surface_add"),
        Binding("e,enter", "screen.edit_surface", "Edit/read", id="surface_edit"),
        Binding(
            "d,delete",
            "screen.delete_surface",
            "Delete",
            id="surface_delete",
            tooltip=LEAVE_OUT_TIP,
        ),
        Binding(
            "u",
            "screen.undo",
            "Undo",
            id="surface_undo",
            tooltip="Undo the last deletion, leaving out or putting back to read",
        ),
    ]


class MaterialTable(RowTable):
    BINDINGS = [
        Binding("a", "screen.add_material", "Add", id="material_add"),
        Binding("e,enter", "screen.edit_material", "Edit/read", id="material_edit"),
        Binding(
            "d,delete",
            "screen.delete_material",
            "Delete",
            id="material_delete",
            tooltip=LEAVE_OUT_TIP,
        ),
        Binding(
            "u",
            "screen.undo",
            "Undo",
            id="material_undo",
            tooltip="Undo the last deletion, leaving out or putting back to read",
        ),
    ]


class EquipmentTable(RowTable):
    BINDINGS = [
        Binding("a", "screen.add_equipment", "Add", id="equipment_add"),
        Binding("e,enter", "screen.edit_equipment", "Edit", id="equipment_edit"),
        Binding("d,delete", "screen.delete_equipment", "Delete", id="equipment_delete"),
        Binding("u", "screen.undo", "Undo", id="equipment_undo", tooltip="Undo the last deletion"),
    ]
