"""The room's material table: a symbol and the state in brief in each row, and the highlighted
row's words in full under the table, so that at 80 columns nothing a technician needs is off
to the right. Locations and materials typed by a person are shown as text."""

from __future__ import annotations

import json
import shutil
from pathlib import Path

from textual.widgets import DataTable, Static

from survey import thresholds as th
from survey.app import make_app

DEMO = Path(__file__).resolve().parents[1] / "survey" / "app" / "demo_site.json"


def _cells(table: DataTable) -> list[list[str]]:
    return [[str(c) for c in table.get_row_at(r)] for r in range(table.row_count)]


def _detail(app) -> str:
    return str(app.screen.query_one("#material-detail", Static).render())


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
        line = app.screen.query_one("#material-detail")
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


def _demo_copy(tmp_path: Path) -> Path:
    target = tmp_path / "flat.json"
    shutil.copyfile(DEMO, target)
    return target
