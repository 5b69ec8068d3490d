"""A drop-down list in a form behaves as the text fields do: a choice made by Enter is saved
and moves on to the next field (the next Enter does not open the list again); Escape closes
the list, keeps the value and stays."""

from __future__ import annotations

import json
import shutil
from pathlib import Path

from survey.app import make_app
from survey.app.fields import Choice

EXAMPLE = Path(__file__).resolve().parents[1] / "example_sites" / "winter-flat-bedroom-mould.json"


async def test_a_choice_made_by_enter_is_saved_and_moves_on(tmp_path):
    path = tmp_path / EXAMPLE.name
    shutil.copyfile(EXAMPLE, path)
    app = make_app(path, data_dir=tmp_path / "data")
    async with app.run_test(size=(100, 30)) as pilot:
        await pilot.pause()
        room_id = app.editor.survey.rooms[0].id
        app.open_room(room_id)
        await pilot.pause()
        use = app.screen.query_one("#room-use", Choice)
        assert use.value == "bedroom"
        use.focus()
        await pilot.pause()

        await pilot.press("enter")  # opens the list
        await pilot.pause()
        assert use.expanded
        await pilot.press("escape")  # closes it: nothing chosen, the focus stays
        await pilot.pause()
        assert not use.expanded and app.focused is use and use.value == "bedroom"

        await pilot.press("enter", "down", "enter")
        await pilot.pause()
        await pilot.pause()
        assert not use.expanded
        assert app.focused is not use and app.focused.id == "room-volume-input"
        chosen = use.value
        assert chosen != "bedroom"
        saved = json.loads(path.read_text(encoding="utf-8"))
        assert next(r for r in saved["rooms"] if r["id"] == room_id)["use"] == chosen

        await pilot.press("enter")  # from the next field on, not back into the list
        await pilot.pause()
        assert not use.expanded
