"""The room list: each room's worst finding as a word and a symbol, readings done or still
missing on this visit, the reference room marked; add, rename, reorder, delete, undo."""

from __future__ import annotations

import msgspec
from rich.text import Text
from textual.binding import Binding
from textual.widgets import Static

from survey import evaluate, model, store
from survey.app import judging, walk
from survey.app.dialogs import ConfirmDialog, PromptDialog
from survey.app.fields import plain
from survey.app.tables import RoomTable
from survey.errors import InputError
from survey.words import screens


class RoomListScreen(walk.WalkScreen):
    TITLE_TEXT = "Rooms"
    PARENT = "visit"
    #: Kept when shown again (``SurveyApp.go``): the cursor stays, and the undo of a deletion.
    KEPT = True
    BINDINGS = [
        Binding("ctrl+n", "next_room", "Next room to read", id="next_room"),
        Binding("c", "chart", "Chart", id="rooms_chart"),
        Binding("g", "drying", "Drying progress", id="rooms_drying"),
    ]

    def __init__(self) -> None:
        super().__init__()
        self.undo_stack: list[tuple[int, model.Room, list[tuple[int, model.RoomVisit]]]] = []

    def compose(self):
        yield self.header()
        yield Static(id="rooms-visit", classes="hint")
        yield RoomTable(id="rooms")
        yield Static(
            Text(
                judging.SYMBOL_LEGEND + "\nEnter opens a room · Ctrl+N the next room to read"
                " · g drying progress · c chart · [ ] move · f reference room · F1 all keys"
            ),
            classes="hint",
        )
        yield from self.footer_widgets()

    def on_mount(self) -> None:
        table = self.query_one(RoomTable)
        table.add_headings(" ", "room", "use", "this visit", "worst finding")
        self.refresh_view()
        table.focus()

    def on_screen_resume(self) -> None:
        # (the walk screen's own handler then redraws, keeping the row chosen here)
        last = self.app.last_room_id
        ids = [r.id for r in self.editor.survey.rooms]
        if last in ids:
            self.query_one(RoomTable).move_cursor(row=ids.index(last))

    def refresh_view(self) -> None:
        survey, editor = self.editor.survey, self.editor
        d = self.app.display_units
        table = self.query_one(RoomTable)
        row = table.cursor_row
        table.clear()
        visit_index = editor.visit_index
        if survey.visits:
            visit = survey.visits[visit_index]
            line = Text(
                f"Visit {visit_index % len(survey.visits) + 1} of {len(survey.visits)}"
                f", started {visit.started_at:%Y-%m-%d %H:%M} "
            )
            line.append(plain(visit.label))
            if not survey.rooms:
                line.append("\nNo rooms yet: press a to add the first one.", style="bold")
            self.query_one("#rooms-visit", Static).update(line)
        for room in survey.rooms:
            missing = judging.readings_missing(survey, visit_index, room.id)
            judged = evaluate.assess_room(survey, visit_index, room.id) if survey.visits else None
            if judged is None:
                symbol, worst = "·", "no air reading yet"
            else:
                symbol = judging.RANK_SYMBOLS[judging.worst_rank(judged.finding)]
                worst = screens.worst_state_words(judged.finding, d)
            name = plain(room.name)
            if room.is_reference:
                name.append(" ★")
            status = "done" if missing == 0 else f"{missing} to read"
            table.add_row(
                Text(symbol), name, Text(room.use), Text(status), Text(worst), key=room.id
            )
        if survey.rooms:
            table.move_cursor(row=min(row, len(survey.rooms) - 1))

    def _current(self) -> model.Room | None:
        rooms = self.editor.survey.rooms
        if not rooms:
            return None
        return rooms[self.query_one(RoomTable).cursor_row]

    def action_open_room(self) -> None:
        room = self._current()
        if room is not None:
            self.app.open_room(room.id)

    def action_chart(self) -> None:
        """The visit's psychrometric chart (its module and plotext load only now)."""
        from survey.app.chart import ChartScreen

        self.app.push_screen(ChartScreen())

    def action_drying(self) -> None:
        from survey.app.drying import DryingScreen

        self.app.push_screen(DryingScreen())

    def action_next_room(self) -> None:
        target = judging.next_room_needing(self.editor.survey, self.editor.visit_index, None)
        if target is None:
            self.app.show_status("Every room has its readings for this visit.")
        else:
            self.app.open_room(target)

    def _name_check(self, exclude: str | None):
        def check(values: list[str]) -> str:
            name = values[0].strip()
            try:
                walk.text_parser("Room name", need=True)(values[0])
                store.check_record(model.Room(id="x", name=name))
            except InputError as exc:
                return f"Not saved — {exc}"
            if any(
                r.name.casefold() == name.casefold() and r.id != exclude
                for r in self.editor.survey.rooms
            ):
                return f"Not saved — room name {name}: another room has this name"
            return ""

        return check

    def action_add_room(self) -> None:
        if self.refuse_if_read_only():
            return

        def done(values: list[str] | None) -> None:
            if not values:
                return
            survey = self.editor.survey
            name = values[0].strip()
            room = model.Room(id=judging.new_room_id(survey, name), name=name)
            survey.rooms.append(room)
            self.committed()
            self.refresh_view()
            self.query_one(RoomTable).move_cursor(row=len(survey.rooms) - 1)
            self.app.open_room(room.id)

        self.app.push_screen(
            PromptDialog("Add a room", [("Room name", "")], self._name_check(None)), done
        )

    def action_rename_room(self) -> None:
        room = self._current()
        if room is None or self.refuse_if_read_only():
            return

        def done(values: list[str] | None) -> None:
            if values:
                rooms = self.editor.survey.rooms
                index = rooms.index(room)
                rooms[index] = msgspec.structs.replace(room, name=values[0].strip())
                self.committed()
                self.refresh_view()

        self.app.push_screen(
            PromptDialog("Rename the room", [("Room name", room.name)], self._name_check(room.id)),
            done,
        )

    def action_move(self, step: int) -> None:
        room = self._current()
        if room is None or self.refuse_if_read_only():
            return
        rooms = self.editor.survey.rooms
        index = rooms.index(room)
        target = index + step
        if 0 <= target < len(rooms):
            rooms[index], rooms[target] = rooms[target], rooms[index]
            self.committed()
            self.refresh_view()
            self.query_one(RoomTable).move_cursor(row=target)

    def action_reference(self) -> None:
        room = self._current()
        if room is None or self.refuse_if_read_only():
            return
        rooms = self.editor.survey.rooms
        rooms[rooms.index(room)] = msgspec.structs.replace(room, is_reference=not room.is_reference)
        self.committed()
        self.refresh_view()

    def action_delete_room(self) -> None:
        room = self._current()
        if room is None or self.refuse_if_read_only():
            return

        def done(yes: bool) -> None:
            if not yes:
                return
            survey = self.editor.survey
            index = survey.rooms.index(room)
            removed = []
            for v, visit in enumerate(survey.visits):
                for r, record in enumerate(visit.rooms):
                    if record.room == room.id:
                        removed.append((v, r, record))
                visit.rooms = [rv for rv in visit.rooms if rv.room != room.id]
            del survey.rooms[index]
            self.undo_stack.append((index, room, removed))
            self.committed()
            self.refresh_view()
            self.app.show_status(f"Room {room.name} deleted — u puts it back.")

        self.app.push_screen(
            ConfirmDialog(
                f"Delete the room {room.name} and its readings on every visit? (u undoes it)"
            ),
            done,
        )

    def action_undo(self) -> None:
        if not self.undo_stack or self.refuse_if_read_only():
            self.app.show_status("Nothing to undo.")
            return
        index, room, removed = self.undo_stack.pop()
        survey = self.editor.survey
        survey.rooms.insert(index, room)
        for v, r, record in removed:
            survey.visits[v].rooms.insert(r, record)
        self.committed()
        self.refresh_view()
        self.app.show_status(f"Room {room.name} put back.")
