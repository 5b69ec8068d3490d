"""The key footer follows the focus: the keys it shows are those of the focused widget and
its screen, rebuilt when they change and kept when they do not."""

from __future__ import annotations

import shutil
from pathlib import Path

from textual.widgets._footer import FooterKey

from survey.app import make_app
from survey.app.footer import KeysFooter

EXAMPLE = Path(__file__).resolve().parents[1] / "example_sites" / "winter-flat-bedroom-mould.json"


def shown(app) -> list[tuple[str, str]]:
    footer = app.screen.query_one(KeysFooter)
    return [(key.action, key.description) for key in footer.query(FooterKey)]


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
        undo = next(k for k in footer.query(FooterKey) if k.action == "screen.undo")
        assert undo.key == "z"  # the user's own key, shown

        screen.query_one("#materials").focus()
        await pilot.pause()
        keys = shown(app)
        assert ("screen.edit_material", "Edit/read") in keys
        assert ("screen.edit_surface", "Edit/read") not in keys

        # From one field to the next the keys on show stay the same: the footer keeps its
        # widgets rather than building them again.
        screen.query_one("#room-temp-input").focus()
        await pilot.pause()
        before = list(footer.query(FooterKey))
        assert ("screen.edit_material", "Edit/read") not in shown(app)
        screen.query_one("#room-volume-input").focus()
        await pilot.pause()
        assert list(footer.query(FooterKey)) == before
