"""The room screen's tables worked by keys: surfaces, materials and equipment added, edited,
deleted and undone (a mixin of :class:`~survey.app.room.RoomScreen`)."""

from __future__ import annotations

import msgspec
from rich.text import Text
from textual.widgets.data_table import RowDoesNotExist

from survey import evaluate, model
from survey.app import equipment, judging, walk
from survey.app.air import AirPair
from survey.app.dialogs import PromptDialog
from survey.app.fields import plain
from survey.app.room_dialogs import MaterialDialog, SurfaceDialog
from survey.app.tables import EquipmentTable, MaterialTable, SurfaceTable
from survey.safe_text import visible
from survey.words import screens


class RoomTables:
    """Adding, editing and deleting the room's surface, material and equipment rows."""

    def _row(self, table) -> str | None:
        if not table.row_count:
            return None
        return table.coordinate_to_cell_key((table.cursor_row, 0)).row_key.value

    def _surface_preview(self, index: int | None):
        def preview(candidate: model.SurfaceReading) -> Text:
            record = self.record() or model.RoomVisit(room=self.room_id)
            surfaces = list(record.surfaces)
            if index is None:
                surfaces.append(candidate)
                at = len(surfaces) - 1
            else:
                surfaces[index] = candidate
                at = index
            judged = evaluate.assess_room(
                self.editor.survey,
                self.editor.visit_index,
                self.room_id,
                msgspec.structs.replace(record, surfaces=surfaces),
            )
            if judged is None:
                return Text(screens.NO_AIR_FOR_SURFACE)
            d = self.app.display_units
            f = judged.finding.surfaces[at]
            text = Text(screens.surface_line(f, d))
            if screens.safe_rh_line(judged.finding) is not None:
                # the room's limit, said as the room's: the surface that sets it is named
                text.append("\n")
                text.append(plain(screens.safe_rh_set_by(judged.finding)))
            return text

        return preview

    def action_add_surface(self) -> None:
        self._edit_surface(None, None)

    def action_edit_surface(self) -> None:
        key = self._row(self.query_one(SurfaceTable))
        if key is None:
            return self.action_add_surface()
        index = int(key[1:])
        if key[0] in "px":
            point = (
                judging.pending_surfaces(self.editor.survey, self.editor.visit_index, self.room_id)
                if key[0] == "p"
                else self._left_point("surface", index)
            )[index if key[0] == "p" else 0]
            template = msgspec.structs.replace(
                point,
                surface_temp_c=None,
                taken_at=None,
                notes="",
                condensation_seen=False,
                mould_visible=False,
            )
            d = self.app.display_units
            previous = f"last {d.temperature(point.surface_temp_c)}"
            self._edit_surface(None, template, previous, pending=index if key[0] == "p" else None)
        else:
            reading = self.record().surfaces[index]
            last = judging.last_visits_point(self.offered("surface"), reading)
            d = self.app.display_units
            previous = "" if last is None else f"last {d.temperature(last.surface_temp_c)}"
            self._edit_surface(index, reading, previous)

    def _edit_surface(self, index, reading, previous: str = "", pending: int | None = None) -> None:
        """Add (``index`` None), edit, or read again the ``pending`` point of last visit."""
        if self.refuse_if_read_only():
            return
        record = self.record()
        air = record.air.dry_bulb_c if record and record.air else None

        def done(result) -> None:
            if result is None:
                return
            surfaces = list(self.record(create=True).surfaces)
            if index is None:
                result, _ = walk.stamped(
                    result, self.app.clock(), self.visit, self.editor.survey, "surface"
                )
                surfaces.append(result)
            else:
                surfaces[index] = result
            left_out = judging.without_left_out(self.record(), "surface", result)
            self._replace_record("surface", surfaces=surfaces, left_out=left_out)
            self._changed()
            if pending is not None:
                self._to_next_pending(SurfaceTable, "p", pending, f"s{len(surfaces) - 1}")

        title = (
            "Edit the surface"
            if index is not None
            else "Add a surface"
            if pending is None
            else "Read the surface measured last visit"
        )
        self.app.push_screen(
            SurfaceDialog(
                title, self.editor.unit_system, reading, self._surface_preview(index), previous, air
            ),
            done,
        )

    def action_add_material(self) -> None:
        self._edit_material(None, None)

    def action_edit_material(self) -> None:
        key = self._row(self.query_one(MaterialTable))
        if key is None:
            return self.action_add_material()
        index = int(key[1:])
        if key[0] in "qy":
            point = (
                judging.pending_materials(self.editor.survey, self.editor.visit_index, self.room_id)
                if key[0] == "q"
                else self._left_point("material", index)
            )[index if key[0] == "q" else 0]
            template = msgspec.structs.replace(point, value=None, taken_at=None, notes="")
            self._edit_material(
                None, template, f"last {point.value:g}", pending=index if key[0] == "q" else None
            )
        else:
            reading = self.record().materials[index]
            last = judging.last_visits_point(self.offered("material"), reading)
            previous = "" if last is None or last.value is None else f"last {last.value:g}"
            self._edit_material(index, reading, previous)

    def _edit_material(
        self, index, reading, previous: str = "", pending: int | None = None
    ) -> None:
        """Add (``index`` None), edit, or read again the ``pending`` point of last visit."""
        if self.refuse_if_read_only():
            return

        def done(result) -> None:
            if result is None:
                return
            materials = list(self.record(create=True).materials)
            if index is None:
                result, _ = walk.stamped(
                    result, self.app.clock(), self.visit, self.editor.survey, "material"
                )
                materials.append(result)
            else:
                materials[index] = result
            left_out = judging.without_left_out(self.record(), "material", result)
            self._replace_record("material reading", materials=materials, left_out=left_out)
            self._changed()
            if pending is not None:
                self._to_next_pending(MaterialTable, "q", pending, f"m{len(materials) - 1}")

        title = (
            "Edit the material reading"
            if index is not None
            else "Add a material reading"
            if pending is None
            else "Read the point measured last visit"
        )
        self.app.push_screen(MaterialDialog(title, reading, previous), done)

    def _to_next_pending(self, table_type, prefix: str, read: int, read_key: str) -> None:
        """After a point of last visit is read, the cursor goes to the next one still to
        read: the next in this table (the one read has left the list, so the next has its
        number), else the first left above it, else the first in the other table of points
        (which takes the focus); with none left anywhere it stays on the row just read
        (``read_key``)."""
        table = self.query_one(table_type)
        for key in (f"{prefix}{read}", f"{prefix}0"):
            if self._move_to(table, key):
                return
        other, other_prefix = (
            (MaterialTable, "q") if table_type is SurfaceTable else (SurfaceTable, "p")
        )
        other_table = self.query_one(other)
        if self._move_to(other_table, f"{other_prefix}0"):
            other_table.focus()
            return
        self._move_to(table, read_key)

    @staticmethod
    def _move_to(table, key: str) -> bool:
        try:
            row = table.get_row_index(key)
        except RowDoesNotExist:  # no such row (nothing left to read there)
            return False
        table.move_cursor(row=row)
        return True

    def _edit_equipment(self, index: int | None) -> None:
        if self.refuse_if_read_only():
            return
        record = self.record()
        current = None if index is None else record.equipment[index]

        def done(result: model.Equipment) -> None:
            items = list(self.record(create=True).equipment)
            if index is None:
                items.append(result)
            else:
                items[index] = result
            self._replace_record("equipment", equipment=items)
            self._changed()

        title = "Add equipment" if index is None else "Edit the equipment"
        self.app.push_screen(*equipment.dialog(title, current, done, self, index))

    def action_add_equipment(self) -> None:
        self._edit_equipment(None)

    def action_edit_equipment(self) -> None:
        key = self._row(self.query_one(EquipmentTable))
        self._edit_equipment(None if key is None else int(key[1:]))

    def action_delete_equipment(self) -> None:
        self._delete("equipment")

    def _left_point(self, kind: model.PointKind, index: int) -> list:
        """The point the record's ``index``-th point left out stands for, as last read
        (a one-item list; empty if no earlier visit read it)."""
        found = judging.last_visits_point(self.offered(kind), self.record().left_out[index])
        return [] if found is None else [found]

    def _leave_out(self, kind: model.PointKind, point, pending: int) -> None:
        """Ask why a point of last visit is not read on this one, and record it left out;
        the cursor goes on to the next point to read, as after a reading."""

        def done(values: list[str] | None) -> None:
            if values is None:
                return
            gone, reason = values
            record = self.record(create=True)
            mark = model.LeftOut(
                kind=kind,
                location=point.location,
                material=getattr(point, "material", "") if kind == "material" else "",
                reason=reason.strip(),
                for_good=gone == "yes",
            )
            left_out = [*judging.without_left_out(record, kind, point), mark]
            self._replace_record("point left out", left_out=left_out)
            self._changed()
            table, prefix = (SurfaceTable, "p") if kind == "surface" else (MaterialTable, "q")
            self._to_next_pending(
                table, prefix, pending, f"{'xy'[prefix == 'q']}{len(left_out) - 1}"
            )
            self.app.show_status(f"Left out {visible(point.location)} — d on it puts it back.")

        what = "surface" if kind == "surface" else f"{point.material} reading"
        self.app.push_screen(
            PromptDialog(
                f"Leave out the {what} at {visible(point.location)}",
                [
                    (
                        "What became of it",
                        "no",
                        [(w, "yes" if gone else "no") for w, gone in screens.LEFT_OUT_CHOICES],
                    ),
                    ("Why (e.g. plaster stripped out, behind a wardrobe today)", ""),
                ],
                note=screens.LEAVE_OUT_NOTE,
            ),
            done,
        )

    def _delete(self, kind: str) -> None:
        table = self.query_one(
            {"surfaces": SurfaceTable, "materials": MaterialTable, "equipment": EquipmentTable}[
                kind
            ]
        )
        key = self._row(table)
        if key is None or self.refuse_if_read_only():
            return
        index = int(key[1:])
        if key[0] in "pq":
            point_kind: model.PointKind = "surface" if key[0] == "p" else "material"
            pending = judging.pending_points(
                self.editor.survey, self.editor.visit_index, self.room_id, point_kind
            )
            self._leave_out(point_kind, pending[index], index)
            return
        if key[0] in "xy":
            record = self.record()
            left_out = list(record.left_out)
            removed = left_out.pop(index)
            self._replace_record("point left out", left_out=left_out)
            self.undo_stack.append(("left_out", index, removed))
            self._changed()
            self.app.show_status(
                f"{visible(removed.location)} is to read again — u leaves it out again."
            )
            return
        items = list(getattr(self.record(), kind))
        removed = items.pop(index)
        self._replace_record(kind, **{kind: items})
        self.undo_stack.append((kind, index, removed))
        self._changed()
        label = getattr(removed, "location", "") or getattr(removed, "kind", "")
        self.app.show_status(f"Deleted {label} — u puts it back.")

    def action_delete_surface(self) -> None:
        self._delete("surfaces")

    def action_delete_material(self) -> None:
        self._delete("materials")

    def action_undo(self) -> None:
        if not self.undo_stack or self.refuse_if_read_only():
            self.app.show_status("Nothing to undo.")
            return
        kind, index, removed = self.undo_stack.pop()
        if kind == "air":
            self._replace_record("air reading", air=removed)
            self._changed()
            self.query_one(AirPair).show_reading(removed)
            self.app.show_status("Put back the air reading.")
            return
        items = list(getattr(self.record(create=True), kind))
        items.insert(min(index, len(items)), removed)
        self._replace_record(kind, **{kind: items})
        self._changed()
        if kind == "left_out":
            self.app.show_status(f"Left out {visible(removed.location)} again.")
            return
        self.app.show_status(f"Put back {visible(getattr(removed, 'location', ''))}.")
