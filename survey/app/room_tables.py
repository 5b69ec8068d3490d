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
from survey.errors import InputError
from survey.safe_text import visible
from survey.words import screens


def _same_point(readings, reading) -> int:
    """How many of ``readings`` are of ``reading``'s point."""
    key = judging.point_key(reading)
    return sum(judging.point_key(r) == key for r in readings)


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

    def _point_to_read(self, kind: model.PointKind, key: str):
        """The point a row to read (``p``/``q``) or left out (``x``/``y``) stands for, as
        last read, and whether an earlier reading of it is offered (a mark whose reading
        was deleted since gives a blank point of its location, with no last value)."""
        index = int(key[1:])
        survey, visit_index = self.editor.survey, self.editor.visit_index
        if key[0] in "pq":
            return judging.pending_points(survey, visit_index, self.room_id, kind)[index], True
        mark = self.record().left_out[index]
        offered = self.offered(kind)
        return judging.left_point(offered, mark), judging.last_visits_point(
            offered, mark
        ) is not None

    def action_edit_surface(self) -> None:
        key = self._row(self.query_one(SurfaceTable))
        if key is None:
            return self.action_add_surface()
        d = self.app.display_units
        if key[0] in "px":
            point, was_read = self._point_to_read("surface", key)
            template = msgspec.structs.replace(
                point,
                surface_temp_c=None,
                taken_at=None,
                notes="",
                condensation_seen=False,
                mould_visible=False,
            )
            previous = f"last {d.temperature(point.surface_temp_c)}" if was_read else ""
            pending = int(key[1:]) if key[0] == "p" else None
            self._edit_surface(None, template, previous, pending=pending, again=True)
            return
        reading = self.record().surfaces[int(key[1:])]
        last = judging.last_visits_point(self.offered("surface"), reading)
        previous = "" if last is None else f"last {d.temperature(last.surface_temp_c)}"
        self._edit_surface(int(key[1:]), reading, previous)

    def _edit_surface(
        self, index, reading, previous: str = "", pending: int | None = None, again=False
    ) -> None:
        """Add (``index`` None), edit, or read ``again`` a point measured before (the
        ``pending`` one of those still to read, or one left out)."""
        if self.refuse_if_read_only():
            return
        record = self.record()
        air = record.air.dry_bulb_c if record and record.air else None

        def done(result) -> None:
            if result is None:
                return
            surfaces = list(self.record(create=True).surfaces)
            warning = ""
            if index is None:
                result, warning = walk.stamped(
                    result, self.app.clock(), self.visit, self.editor.survey, "surface"
                )
                surfaces.append(result)
            else:
                surfaces[index] = result
            left_out = judging.without_left_out(self.record(), "surface", result)
            self._replace_record("surface", surfaces=surfaces, left_out=left_out)
            self._changed()
            if index is None and warning:
                self.app.show_status(screens.as_sentence(warning))
            if pending is not None:
                self._to_next_pending(SurfaceTable, "p", pending, f"s{len(surfaces) - 1}")
            elif index is None:  # a new point: the cursor on it, its line under the table
                self._move_to(self.query_one(SurfaceTable), f"s{len(surfaces) - 1}")

        title = (
            "Edit the surface"
            if index is not None
            else screens.read_again_title("surface")
            if again
            else "Add a surface"
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
        if key[0] in "qy":
            point, was_read = self._point_to_read("material", key)
            template = msgspec.structs.replace(point, value=None, taken_at=None, notes="")
            previous = f"last {point.value:g}" if was_read else ""
            pending = int(key[1:]) if key[0] == "q" else None
            self._edit_material(None, template, previous, pending=pending, again=True)
            return
        reading = self.record().materials[int(key[1:])]
        last = judging.last_visits_point(self.offered("material"), reading)
        previous = "" if last is None else f"last {last.value:g}"
        self._edit_material(int(key[1:]), reading, previous)

    def _edit_material(
        self, index, reading, previous: str = "", pending: int | None = None, again=False
    ) -> None:
        """Add (``index`` None), edit, or read ``again`` a point measured before (the
        ``pending`` one of those still to read, or one left out)."""
        if self.refuse_if_read_only():
            return

        def done(result) -> None:
            if result is None:
                return
            materials = list(self.record(create=True).materials)
            warning = ""
            if index is None:
                result, warning = walk.stamped(
                    result, self.app.clock(), self.visit, self.editor.survey, "material"
                )
                materials.append(result)
            else:
                materials[index] = result
            left_out = judging.without_left_out(self.record(), "material", result)
            self._replace_record("material reading", materials=materials, left_out=left_out)
            self._changed()
            if index is None and warning:
                self.app.show_status(screens.as_sentence(warning))
            if pending is not None:
                self._to_next_pending(MaterialTable, "q", pending, f"m{len(materials) - 1}")
            elif index is None:
                self._move_to(self.query_one(MaterialTable), f"m{len(materials) - 1}")

        title = (
            "Edit the material reading"
            if index is not None
            else screens.read_again_title("material")
            if again
            else "Add a material reading"
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

    def _leave_out(self, kind: model.PointKind, point, pending: int) -> None:
        """Ask why a point measured before is not read on this visit, and record it left
        out (u takes the mark away again); the cursor goes on to the next point to read, as
        after a reading."""
        material = point.material if kind == "material" else ""
        blank = model.LeftOut(kind=kind, location=point.location, material=material)

        def mark_of(values: list[str]) -> model.LeftOut:
            gone, reason = values
            return walk.checked(  # type: ignore[return-value]
                blank, "Why", reason=reason.strip(), for_good=gone == "yes"
            )

        def check(values: list[str]) -> str:
            try:
                mark_of(values)
            except InputError as exc:
                return f"Not saved — {exc}"
            return ""

        def done(values: list[str] | None) -> None:
            if values is None:
                return
            mark = mark_of(values)
            record = self.record(create=True)
            left_out = [*judging.without_left_out(record, kind, point), mark]
            self._replace_record("point left out", left_out=left_out)
            self.undo_stack.append(("leave_out", len(left_out) - 1, mark, 0))
            self._changed()
            table, prefix = (SurfaceTable, "p") if kind == "surface" else (MaterialTable, "q")
            self._to_next_pending(
                table, prefix, pending, f"{'xy'[prefix == 'q']}{len(left_out) - 1}"
            )
            self.app.show_status(screens.left_out_status(visible(point.location)))

        self.app.push_screen(
            PromptDialog(
                screens.leave_out_title(kind, visible(point.location), visible(material)),
                [
                    (
                        screens.LEAVE_OUT_WHAT,
                        "no",
                        [(w, "yes" if gone else "no") for w, gone in screens.LEFT_OUT_CHOICES],
                    ),
                    (screens.LEAVE_OUT_WHY, ""),
                ],
                check,
                note=screens.LEAVE_OUT_NOTE,
            ),
            done,
        )

    def _put_back_to_read(self, index: int) -> None:
        """Take the mark off a point left out: it is to read again (u leaves it out again)."""
        left_out = list(self.record().left_out)
        removed = left_out.pop(index)
        self._replace_record("point left out", left_out=left_out)
        self.undo_stack.append(("left_out", index, removed, 0))
        self._changed()
        self.app.show_status(screens.back_to_read_status(visible(removed.location)))

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
            point, _ = self._point_to_read(point_kind, key)
            self._leave_out(point_kind, point, index)
            return
        if key[0] in "xy":
            self._put_back_to_read(index)
            return
        items = list(getattr(self.record(), kind))
        removed = items.pop(index)
        self._replace_record(kind, **{kind: items})
        same = _same_point(items, removed) if kind in ("surfaces", "materials") else 0
        self.undo_stack.append((kind, index, removed, same))
        self._changed()
        label = getattr(removed, "location", "") or getattr(removed, "kind", "")
        self.app.show_status(f"Deleted {visible(label)} — u puts it back.")

    def action_delete_surface(self) -> None:
        self._delete("surfaces")

    def action_delete_material(self) -> None:
        self._delete("materials")

    def action_undo(self) -> None:
        """Undo the last deletion, leaving out, or putting back to read. A reading put
        back takes away a mark of its point made since; a mark is not put back on a point
        read since."""
        if self.refuse_if_read_only():
            return
        if not self.undo_stack:
            self.app.show_status("Nothing to undo.")
            return
        kind, index, removed, same = self.undo_stack.pop()
        if kind == "air":
            self._replace_record("air reading", air=removed)
            self._changed()
            self.query_one(AirPair).show_reading(removed)
            self.app.show_status("Put back the air reading.")
            return
        record = self.record(create=True)
        if kind == "leave_out":  # the mark made goes
            key = judging.point_key(removed)
            if not any(judging.point_key(x) == key for x in record.left_out):
                self.app.show_status(screens.read_since_status(visible(removed.location)))
                return  # read since: the mark went with the reading
            left_out = [x for x in record.left_out if judging.point_key(x) != key]
            self._replace_record("point left out", left_out=left_out)
            self._changed()
            self.app.show_status(screens.back_to_read_status(visible(removed.location)))
            return
        if kind == "left_out":  # the mark taken off comes back, unless the point was read
            key = judging.point_key(removed)
            if any(judging.point_key(p) == key for p in (*record.surfaces, *record.materials)):
                self.app.show_status(screens.read_since_status(visible(removed.location)))
                return
            left_out = [x for x in record.left_out if judging.point_key(x) != key]
            left_out.insert(min(index, len(left_out)), removed)
            self._replace_record("point left out", left_out=left_out)
            self._changed()
            self.app.show_status(screens.left_again_status(visible(removed.location)))
            return
        items = list(getattr(record, kind))
        if kind in ("surfaces", "materials") and _same_point(items, removed) > same:
            # read again since: putting the old reading back would read it twice
            self.app.show_status(screens.read_again_since_status(visible(removed.location)))
            return
        items.insert(min(index, len(items)), removed)
        point_kind = "surface" if kind == "surfaces" else "material"
        changes = {kind: items}
        if kind in ("surfaces", "materials"):
            changes["left_out"] = judging.without_left_out(record, point_kind, removed)
        self._replace_record(kind, **changes)
        self._changed()
        self.app.show_status(f"Put back {visible(getattr(removed, 'location', ''))}.")
