"""The room's material table: a symbol and the state in brief in each row, and the highlighted
row's words in full under the table, so that at 80 columns nothing a technician needs is off
to the right. Locations and materials typed by a person are shown as text."""

from __future__ import annotations

import json
import shutil
from pathlib import Path

from textual.widgets import DataTable, Static

from survey import store
from survey import thresholds as th
from survey.app import make_app, room_rows, walk

DEMO = Path(__file__).resolve().parents[1] / "survey" / "app" / "demo_site.json"


def _cells(table: DataTable) -> list[list[str]]:
    return [[str(c) for c in table.get_row_at(r)] for r in range(table.row_count)]


def _detail(app, table: str = "materials") -> str:
    return str(app.screen.query_one(f"#{table}-detail", Static).render())


async def _open_bedroom(pilot, app) -> DataTable:
    await pilot.pause()
    await pilot.press("enter")  # the room list's first room: Main bedroom
    await pilot.pause()
    table = app.screen.query_one("#materials", DataTable)
    table.focus()
    await pilot.pause()
    return table


async def test_rows_in_brief_and_the_highlighted_one_in_full(tmp_path):
    """The demo's main bedroom has three points: the NE corner at 68 on the meter's relative
    scale against the dry standard of 14 read on the hallway wall (above it), that wall
    itself (the dry standard), and a softwood sill at 24 % MC with no dry standard, which is
    at or above the moisture content at which decay fungi grow (``timber_decay_mc_pct``)."""
    assert th.value("timber_decay_mc_pct") <= 24.0
    app = make_app(_demo_copy(tmp_path), data_dir=tmp_path / "data")
    async with app.run_test(size=(80, 24)) as pilot:
        table = await _open_bedroom(pilot, app)
        rows = _cells(table)
        assert [r[0] for r in rows] == ["!", "·", "!"]
        assert [r[3] for r in rows] == [
            "above standard",
            "dry standard",
            "no standard; decay range",
        ]
        assert _detail(app) == (
            "NE corner behind wardrobe (painted plaster): above the dry standard of 14"
        )
        await pilot.press("down")
        assert _detail(app) == (
            "Internal wall to hallway (painted plaster): the dry standard for this material"
        )
        await pilot.press("down")
        assert _detail(app) == (
            "Window sill, left end (softwood): no dry standard given; in the decay range for timber"
        )
        # kept in sight with the table at 24 lines
        line = app.screen.query_one("#materials-detail")
        assert line.region.height >= 1 and app.screen.region.contains_region(line.region)


async def test_typed_location_and_material_are_shown_as_text(tmp_path):
    """A location and a material that look like markup are shown as typed, in the cell and
    in the line under the table (the material no longer matches the dry standard's, so the
    point has none)."""
    path = _demo_copy(tmp_path)
    data = json.loads(path.read_text(encoding="utf-8"))
    point = data["visits"][0]["rooms"][0]["materials"][0]
    point["location"], point["material"] = "[b]Corner[/b]", "[red]plaster"
    path.write_text(json.dumps(data), encoding="utf-8")
    app = make_app(path, data_dir=tmp_path / "data")
    async with app.run_test(size=(120, 40)) as pilot:
        table = await _open_bedroom(pilot, app)
        assert _cells(table)[0][1] == "[b]Corner[/b]"
        assert _detail(app) == "[b]Corner[/b] ([red]plaster): no dry standard given"


async def _second_visit_in(pilot, app, room_id: str) -> None:
    """A new visit started by keys (F7, y), and the room opened on it."""
    await pilot.pause()
    await pilot.press("f7")
    await pilot.pause()
    await pilot.press("y")
    await app.workers.wait_for_complete()
    await pilot.pause()
    app.open_room(room_id)
    await pilot.pause()


def _demo_copy(tmp_path: Path) -> Path:
    target = tmp_path / "flat.json"
    shutil.copyfile(DEMO, target)
    return target


async def test_points_read_again_keep_last_visits_order(tmp_path):
    """On a second visit every surface and material point of the first is listed to read,
    in the first visit's order. A point read stays where it was (it once moved to the top,
    so a technician pressing Down after a reading skipped a point and put the next reading
    against the wrong location), and the cursor moves on to the next point still to read;
    the line under the table names the highlighted point and last visit's value."""
    path = _demo_copy(tmp_path)
    first = store.load_survey(path).visits[0].rooms[0]
    app = make_app(path, data_dir=tmp_path / "data")
    async with app.run_test(size=(100, 30)) as pilot:
        await _second_visit_in(pilot, app, first.room)
        table = app.screen.query_one("#surfaces", DataTable)
        table.focus()
        await pilot.pause()
        locations = [s.location for s in first.surfaces]
        cut = [walk.cut(x, room_rows.LOCATION_CELL) for x in locations]
        assert [r[1] for r in _cells(table)] == cut
        assert [r[2] for r in _cells(table)] == ["to read"] * len(locations)
        await pilot.press("down")
        assert _detail(app, "surfaces").startswith(f"{locations[1]} (")
        assert "to read this visit; last read " in _detail(app, "surfaces")
        await pilot.press("enter")  # read the second point
        await pilot.pause()
        app.focused.value = "11.5"
        await pilot.press("enter")
        await app.workers.wait_for_complete()
        await pilot.pause()
        rows = _cells(table)
        assert [r[1] for r in rows] == cut  # nothing moved
        assert rows[1][2] == "11.5 °C" and rows[0][2] == "to read"
        assert table.cursor_row == 2  # on to the next point still to read
        assert _detail(app, "surfaces").startswith(f"{locations[2]} (")
        table.move_cursor(row=1)  # the point read, opened again: last visit's value beside it
        await pilot.press("enter")
        await pilot.pause()
        last = f"last {first.surfaces[1].surface_temp_c:.1f} °C"
        assert last in [str(w.render()) for w in app.screen.query(".field-previous")]
        await pilot.press("escape")
        await pilot.pause()

        materials = app.screen.query_one("#materials", DataTable)
        materials.focus()
        await pilot.pause()
        assert [r[1] for r in _cells(materials)] == [
            walk.cut(m.location, room_rows.MATERIAL_LOCATION_CELL) for m in first.materials
        ]
        assert _detail(app, "materials") == (
            f"{first.materials[0].location} ({first.materials[0].material}): to read this "
            f"visit; last read {first.materials[0].value:g} (meter's relative scale)"
        )
    saved = store.load_survey(path).visits[1].room_visit(first.room)
    assert [(s.location, s.surface_temp_c) for s in saved.surfaces] == [(locations[1], 11.5)]


def test_walk_order_keeps_last_visits_order_with_repeated_and_new_points():
    """Rows by last visit's order, whether read yet or not; a location written twice last
    visit keeps both its places (its readings take them in turn); new points at the end in
    the order they were added."""
    from survey.app.judging import walk_order

    last = ["a", "b", "a", "c"]
    assert walk_order(last, [], last) == [("pending", n) for n in range(4)]
    assert walk_order(last, ["c", "new", "b"], ["a", "a"]) == [
        ("pending", 0),
        ("read", 2),
        ("pending", 1),
        ("read", 0),
        ("read", 1),
    ]
    assert walk_order(last, ["a", "a", "a"], ["b", "c"]) == [
        ("read", 0),
        ("pending", 0),
        ("read", 1),
        ("pending", 1),
        ("read", 2),
    ]
    assert walk_order([], ["x", "y"], []) == [("read", 0), ("read", 1)]


def test_the_kinds_offered_are_the_models():
    """The instrument and equipment dialogs offer every kind the survey file takes, each
    in words, and nothing else (a kind missing from the list could not be shown)."""
    from typing import get_args

    from survey import model
    from survey.app.equipment import KINDS
    from survey.app.site import INSTRUMENT_KINDS

    assert [k for _, k in INSTRUMENT_KINDS] == list(get_args(model.InstrumentKind))
    assert [k for _, k in KINDS] == list(get_args(model.EquipmentKind))
    for words_shown, kind in (*INSTRUMENT_KINDS, *KINDS):
        assert words_shown and "_" not in words_shown, kind


async def test_after_the_last_point_the_cursor_goes_to_what_is_left_to_read(tmp_path):
    """Read last in its table, a point sends the cursor back to the first one left above it;
    with every surface read, on to the material points still to read (that table takes the
    focus); with nothing left, it stays on the point just read."""
    path = _demo_copy(tmp_path)
    first = store.load_survey(path).visits[0].rooms[0]
    app = make_app(path, data_dir=tmp_path / "data")

    async def read(value: str) -> None:
        await pilot.press("enter")
        await pilot.pause()
        app.focused.value = value
        await pilot.press("enter")
        await app.workers.wait_for_complete()
        await pilot.pause()

    async with app.run_test(size=(100, 30)) as pilot:
        await _second_visit_in(pilot, app, first.room)
        surfaces = app.screen.query_one("#surfaces", DataTable)
        materials = app.screen.query_one("#materials", DataTable)
        surfaces.focus()
        surfaces.move_cursor(row=surfaces.row_count - 1)
        await pilot.pause()
        await read("15")
        assert surfaces.cursor_row == 0  # back to the first left to read
        for _ in range(len(first.surfaces) - 1):
            await read("15")
        assert all(r[2] == "15.0 °C" for r in _cells(surfaces))
        assert app.focused is materials and materials.cursor_row == 0
        for _ in range(len(first.materials)):
            await read("10")
        assert app.focused is materials
        assert materials.cursor_row == len(first.materials) - 1  # stays on the last read


async def test_a_point_of_last_visit_left_out_by_keys_then_put_back_and_read(tmp_path):
    """On a second visit, d on a surface still to read asks what became of it and why (a
    reason longer than the file takes is refused in the dialog); the point is kept as left
    out (saved at once) and the cursor goes on to the next point to read. d on the point
    left out puts it back to read, u leaves it out again, and Enter on it reads it after
    all, which takes the mark away; u then does not put the mark back on the point read.
    A material point is left out the same way, and u takes that mark away."""
    from survey import model
    from survey.app import judging

    path = _demo_copy(tmp_path)
    first = store.load_survey(path).visits[0].rooms[0]
    location = first.surfaces[0].location
    app = make_app(path, data_dir=tmp_path / "data")

    async def settle() -> None:
        await app.workers.wait_for_complete()
        await pilot.pause()

    async with app.run_test(size=(100, 30)) as pilot:
        await _second_visit_in(pilot, app, first.room)
        missing = judging.readings_missing(app.editor.survey, 1, first.room)
        table = app.screen.query_one("#surfaces", DataTable)
        table.focus()
        await pilot.pause()
        await pilot.press("d")
        await pilot.pause()
        await pilot.press("enter", "up", "enter")  # the drop-down: gone for good
        await pilot.pause()
        app.focused.value = "x" * 201  # longer than a reason may be (200)
        await pilot.press("enter")
        await pilot.pause()
        assert type(app.screen).__name__ == "PromptDialog"
        assert "Not saved" in str(app.screen.query_one("#prompt-message").render())
        app.focused.value = ""
        await pilot.press(*"plaster hacked off", "enter")
        await settle()
        saved = store.load_survey(path).visits[1].room_visit(first.room)
        assert saved.left_out == [
            model.LeftOut(
                kind="surface", location=location, reason="plaster hacked off", for_good=True
            )
        ]
        assert _cells(table)[0][2] == "left out" and table.cursor_row == 1
        assert judging.readings_missing(app.editor.survey, 1, first.room) == missing - 1
        table.move_cursor(row=0)
        await pilot.pause()
        assert _detail(app, "surfaces").endswith(
            "left out (plaster hacked off); gone for good, not offered again"
        )
        await pilot.press("d")  # back to read
        await settle()
        assert _cells(table)[0][2] == "to read"
        assert store.load_survey(path).visits[1].room_visit(first.room).left_out == []
        await pilot.press("u")  # left out again
        await settle()
        assert _cells(table)[0][2] == "left out"
        await pilot.press("enter")  # read it after all
        await pilot.pause()
        assert app.screen.title_text.startswith("Read again")
        await pilot.press("escape")
        await pilot.pause()
        await pilot.press("d")  # back to read, then read, then u: the mark stays off
        await settle()
        await pilot.press("enter")
        await pilot.pause()
        app.focused.value = "12"
        await pilot.press("enter")
        await settle()
        assert _cells(table)[0][2] == "12.0 °C"
        await pilot.press("u")
        await settle()
        assert _cells(table)[0][2] == "12.0 °C"  # read since: not left out again
        assert store.load_survey(path).visits[1].room_visit(first.room).left_out == []

        materials = app.screen.query_one("#materials", DataTable)
        materials.focus()
        await pilot.pause()
        await pilot.press("d")
        await pilot.pause()
        await pilot.press("tab", *"behind the bed", "enter")  # not read this visit (default)
        await settle()
        point = first.materials[0]
        assert store.load_survey(path).visits[1].room_visit(first.room).left_out == [
            model.LeftOut(
                kind="material",
                location=point.location,
                material=point.material,
                reason="behind the bed",
            )
        ]
        assert _cells(materials)[0][2] == "left out"
        await pilot.press("u")  # the mark made goes
        await settle()
        assert _cells(materials)[0][2] == "to read"
    saved = store.load_survey(path).visits[1].room_visit(first.room)
    assert saved.left_out == [] and [s.location for s in saved.surfaces] == [location]


async def test_a_point_added_has_the_cursor_and_the_line_under_the_table(tmp_path):
    """A surface added by keys (a, location, Enter through the fields, a temperature) is
    the highlighted row, with its line under the table, and typed far from the visit's
    start it is kept without a time, said on the status line; back on the room list the
    status line says the last save, not a message from before."""
    app = make_app(_demo_copy(tmp_path), data_dir=tmp_path / "data")
    async with app.run_test(size=(100, 30)) as pilot:
        await pilot.pause()
        app.open_room(app.editor.survey.rooms[0].id)
        await pilot.pause()
        table = app.screen.query_one("#surfaces", DataTable)
        table.focus()
        await pilot.pause()
        await pilot.press("a")
        await pilot.pause()
        app.focused.value = "Door reveal, hinge side"
        app.screen.query_one("#surface-temp-input").value = "15"
        await pilot.press("enter")  # location committed, on to the next field
        app.screen.query_one("#surface-temp-input").focus()
        await pilot.press("enter")
        await app.workers.wait_for_complete()
        await pilot.pause()
        assert type(app.screen).__name__ == "RoomScreen"
        assert table.cursor_row == table.row_count - 1
        assert _detail(app, "surfaces").startswith("Door reveal, hinge side (")
        # the clock (today) is far from the demo visit (January 2025): no time kept, said
        assert app.status_text.startswith("No time kept: the clock is")
        reading = app.editor.survey.visits[0].rooms[0].surfaces[-1]
        assert reading.location == "Door reveal, hinge side" and reading.taken_at is None
        await pilot.press("escape")  # to the room list
        await pilot.pause()
        await pilot.press("enter")  # into a room again
        await pilot.pause()
        app.show_status("Saved 10:00:00.", "saved")  # said while the room list is hidden
        await pilot.press("escape")  # back to the room list, shown before
        await pilot.pause()
        assert type(app.screen).__name__ == "RoomListScreen"
        assert str(app.screen.query_one(".status-bar").render()) == "Saved 10:00:00."


async def test_undo_never_puts_back_a_reading_of_a_point_read_again_since(tmp_path):
    """On a second visit a material point is read (10), deleted, left out, then read after
    all (30). u then finds the mark gone with the reading (and says so), and u again does
    not put the deleted 10 back beside the 30: one point, one reading."""
    path = _demo_copy(tmp_path)
    first = store.load_survey(path).visits[0].rooms[0]
    point = first.materials[0]
    app = make_app(path, data_dir=tmp_path / "data")

    async def settle() -> None:
        await app.workers.wait_for_complete()
        await pilot.pause()

    async def read(value: str) -> None:
        await pilot.press("enter")
        await pilot.pause()
        app.focused.value = value
        await pilot.press("enter")
        await settle()

    async with app.run_test(size=(100, 30)) as pilot:
        await _second_visit_in(pilot, app, first.room)
        table = app.screen.query_one("#materials", DataTable)
        table.focus()
        await pilot.pause()
        await read("10")
        table.move_cursor(row=0)
        await pilot.press("d")  # the reading deleted: the point is to read again
        await settle()
        assert _cells(table)[0][2] == "to read"
        await pilot.press("d", "tab", *"boxes", "enter")  # left out
        await settle()
        assert _cells(table)[0][2] == "left out"
        table.move_cursor(row=0)  # (the cursor went on to the next point to read)
        await pilot.pause()
        await read("30")  # read after all
        await pilot.press("u")
        await settle()
        assert "was read since" in app.status_text
        await pilot.press("u")
        await settle()
        assert "is not put back" in app.status_text
    saved = store.load_survey(path).visits[1].room_visit(first.room)
    same = [m.value for m in saved.materials if m.location == point.location]
    assert same == [30.0] and saved.left_out == []
