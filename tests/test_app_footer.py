"""The key footer follows the focus: the keys it shows are those of the focused widget and
its screen, redrawn when they change and kept when they do not; a key shown is a key that
works (a click on it does what pressing it does), and at any width the command palette's
key stays in sight."""

from __future__ import annotations

import shutil
from pathlib import Path

from survey.app import make_app
from survey.app.footer import KeysFooter

EXAMPLE = Path(__file__).resolve().parents[1] / "example_sites" / "winter-flat-bedroom-mould.json"


def shown(app) -> list[tuple[str, str]]:
    footer = app.screen.query_one(KeysFooter)
    return [(key.action, key.description) for key in footer.shown_keys()]


def line(app) -> str:
    return app.screen.query_one(KeysFooter).render().plain


async def test_the_footer_shows_the_focused_widgets_keys_and_keeps_them_when_unchanged(tmp_path):
    path = tmp_path / EXAMPLE.name
    shutil.copyfile(EXAMPLE, path)
    data = tmp_path / "data"
    data.mkdir()
    (data / "keys.json").write_text('{"surface_undo": "z"}', encoding="utf-8")
    app = make_app(path, data_dir=data)
    async with app.run_test(size=(100, 30)) as pilot:
        await pilot.pause()
        app.open_room(app.editor.survey.rooms[0].id)
        await pilot.pause()
        screen = app.screen
        screen.query_one("#surfaces").focus()
        await pilot.pause()
        keys = shown(app)
        assert ("screen.edit_surface", "Edit/read") in keys
        assert ("screen.edit_material", "Edit/read") not in keys
        footer = screen.query_one(KeysFooter)
        undo = next(k for k in footer.shown_keys() if k.action == "screen.undo")
        assert undo.key == "z"  # the user's own key, shown
        assert " z Undo" in line(app)

        screen.query_one("#materials").focus()
        await pilot.pause()
        keys = shown(app)
        assert ("screen.edit_material", "Edit/read") in keys
        assert ("screen.edit_surface", "Edit/read") not in keys

        # From one field to the next the keys on show stay the same: the footer keeps the
        # line it drew rather than drawing it again.
        screen.query_one("#room-temp-input").focus()
        await pilot.pause()
        before = footer.render()
        assert ("screen.edit_material", "Edit/read") not in shown(app)
        screen.query_one("#room-volume-input").focus()
        await pilot.pause()
        assert footer.render() is before


async def test_a_click_on_a_key_does_what_the_key_does(tmp_path):
    path = tmp_path / EXAMPLE.name
    shutil.copyfile(EXAMPLE, path)
    app = make_app(path, data_dir=tmp_path / "data")
    async with app.run_test(size=(120, 30)) as pilot:
        await pilot.pause()
        assert type(app.screen).__name__ == "RoomListScreen"
        text = line(app)
        column = text.index(" Back ")
        await pilot.click(KeysFooter, offset=(column + 2, 0))
        await pilot.pause()
        assert type(app.screen).__name__ == "VisitScreen"  # as Escape goes back


async def test_at_80_columns_whole_keys_fit_and_the_palette_key_stays(tmp_path):
    path = tmp_path / EXAMPLE.name
    shutil.copyfile(EXAMPLE, path)
    app = make_app(path, data_dir=tmp_path / "data")
    async with app.run_test(size=(80, 24)) as pilot:
        await pilot.pause()
        footer = app.screen.query_one(KeysFooter)
        text = line(app)
        assert len(text) == 80
        assert text.endswith(" ^p palette ")
        # the left part is keys whole, in their order, passing over one too long for the room
        # left; not all of them fit at this width
        keys = [k for k in footer.shown_keys() if k.key != app.COMMAND_PALETTE_BINDING]
        pieces = [footer._piece(k).plain for k in keys]
        left = text[: text.rindex(" ^p ")]
        drawn, rest = [], left
        for piece in pieces:
            if rest.startswith(piece):
                drawn.append(piece)
                rest = rest[len(piece) :]
        assert rest.strip() == ""  # nothing but whole keys, then the gap
        assert 3 <= len(drawn) < len(pieces)
        assert " f1 Help " in left  # the app's own help key is among them at 80 columns


async def test_the_rooms_live_panel_scrolls_by_keys_from_a_field(tmp_path):
    """At 80×24 the room's actions and cautions lie below the panel's fold: Shift+↓ from a
    field brings them up, the focus staying in the field."""
    from textual.containers import VerticalScroll

    path = tmp_path / EXAMPLE.name
    shutil.copyfile(EXAMPLE, path)
    app = make_app(path, data_dir=tmp_path / "data")
    async with app.run_test(size=(80, 24)) as pilot:
        await pilot.pause()
        app.open_room(app.editor.survey.rooms[0].id)
        await pilot.pause()
        app.screen.query_one("#room-temp-input").focus()
        await pilot.pause()
        panel = app.screen.query_one("#live-scroll", VerticalScroll)
        assert panel.max_scroll_y > 10 and panel.scroll_y == 0
        await pilot.press("shift+pagedown", "shift+down")
        await pilot.pause()
        assert panel.scroll_y == 15
        assert app.focused.id == "room-temp-input"


async def test_a_new_visit_starts_from_the_room_list_too(tmp_path):
    """F7 is a key of every walk screen, not of the visit screen alone: on the room list it
    asks, n changes nothing, y starts visit 2 with the rooms offered to read again."""
    from survey import store
    from survey.app.dialogs import ConfirmDialog

    path = tmp_path / EXAMPLE.name
    shutil.copyfile(EXAMPLE, path)
    app = make_app(path, data_dir=tmp_path / "data")
    async with app.run_test(size=(100, 30)) as pilot:
        await pilot.pause()
        assert type(app.screen).__name__ == "RoomListScreen"
        assert "New visit" in line(app)
        await pilot.press("f7")
        await pilot.pause()
        assert isinstance(app.screen, ConfirmDialog)
        await pilot.press("n")
        await pilot.pause()
        assert len(app.editor.survey.visits) == 1
        await pilot.press("f7")
        await pilot.pause()
        await pilot.press("y")
        await pilot.pause()
        await app.workers.wait_for_complete()
        assert type(app.screen).__name__ == "VisitScreen"
        assert len(app.editor.survey.visits) == 2 and app.editor.visit_index == 1
    assert len(store.load_survey(path).visits) == 2
