"""The help screen: every key of every screen, read from the bindings themselves."""

from __future__ import annotations

from pathlib import Path

from rich.console import Group
from rich.table import Table
from rich.text import Text
from textual.binding import Binding
from textual.containers import VerticalScroll
from textual.screen import Screen
from textual.widgets import Static

from survey.app.footer import KeysFooter

WALK = (
    "Walk: site (F2) → visit (F3) → rooms (F4) → each room → findings (F5) → report "
    "(F8). Enter "
    "commits a field and moves to the next, Tab / Shift+Tab move, Escape goes back. "
    "Every committed field is saved at once; the bottom line says when. A value that "
    "is not accepted shows a message under its field and is not saved. Ctrl+P opens "
    "the command palette. A drop-down list opens with Enter (or Space); Enter chooses and "
    "moves on, Escape closes it. Shift+↓ / Shift+↑ scroll the live panel (the actions and "
    "cautions at its foot) from any field."
)


def key_text(binding: Binding) -> str:
    from textual.keys import format_key

    return " / ".join(format_key(k) for k in binding.key.split(","))


def sections() -> list[tuple[str, list[Binding]]]:
    """Each screen's (or widget's) title and its bindings, as the help screen lists them."""
    from survey.app import chart, main, quick, report_view, room, rooms, start, tables, walk
    from survey.app.fields import Tick

    return [
        ("Everywhere", main.SurveyApp.BINDINGS),
        ("Start screen", start.StartScreen.BINDINGS),
        ("Walk screens", walk.WalkScreen.BINDINGS),
        ("Room list", rooms.RoomListScreen.BINDINGS + tables.RoomTable.BINDINGS),
        ("Room", room.RoomScreen.BINDINGS),
        ("Quick check", quick.QuickScreen.BINDINGS),
        ("Surface table", tables.SurfaceTable.BINDINGS),
        ("Material table", tables.MaterialTable.BINDINGS),
        ("Equipment table", tables.EquipmentTable.BINDINGS),
        ("Instruments (site)", tables.InstrumentTable.BINDINGS),
        ("Tick boxes", Tick.BINDINGS),
        ("Report", report_view.ReportScreen.BINDINGS),
        ("Chart", chart.ChartScreen.BINDINGS),
    ]


def help_text(keymap: dict[str, str] | None = None, folder: Path | None = None) -> Group:
    """The keys of every screen (with the user's own keys from ``keymap``); ``folder`` is
    where the keys file is read from. Each key's words wrap in their own column."""
    from survey.app.keymap import FILE

    keymap = keymap or {}
    where = str(folder / FILE) if folder is not None else f"{FILE} in the app's data folder"
    from survey.app.judging import SYMBOL_LEGEND

    parts: list = [
        Text(WALK + "\n"),
        Text(
            "Symbols in the tables: "
            + SYMBOL_LEGEND.replace("  ", ", ")
            + " room; · not judged yet. In the material table ! is a reading above its dry"
            " standard or timber in its mould or decay range, ✓ one at its standard (or timber"
            " below its mould range), and · a"
            " dry-standard reading itself or one with nothing to judge it against; – is a point"
            " of an earlier visit left out of this one. The line under the surface and material"
            " tables says the highlighted row in full."
        ),
    ]
    for title, bindings in sections():
        parts.append(Text(f"\n{title}", style="bold"))
        keys = Table.grid(padding=(0, 1))
        keys.add_column(width=20, no_wrap=True)
        keys.add_column(ratio=1)
        for b in bindings:
            key = key_text(b) if b.id not in keymap else key_text(Binding(keymap[b.id], ""))
            keys.add_row(Text(f"  {key}"), Text(f"{b.tooltip or b.description}  ({b.id})"))
        parts.append(keys)
    parts.append(
        Text(
            "\nKeys can be remapped by binding id (shown in brackets): write them in "
            f'{where}, e.g. {{"go_report": "f9"}}, and start the app again.'
        )
    )
    return Group(*parts)


class HelpScreen(Screen):
    BINDINGS = [Binding("escape,f1", "app.pop_screen", "Back", id="help_close")]

    def compose(self):
        yield Static(Text("Keys", style="bold"), classes="screen-title")
        with VerticalScroll(id="help-scroll", can_focus=True):
            yield Static(help_text(self.app.user_keys, self.app.data_dir))
        yield KeysFooter()

    def on_mount(self) -> None:
        self.query_one("#help-scroll").focus()
