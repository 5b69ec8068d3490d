"""The help screen: every key of every screen, read from the bindings themselves."""

from __future__ import annotations

from rich.text import Text
from textual.binding import Binding
from textual.containers import VerticalScroll
from textual.screen import Screen
from textual.widgets import Footer, Static

WALK = (
    "Walk: site (F2) → visit (F3) → rooms (F4) → each room → findings (F5). Enter "
    "commits a field and moves to the next, Tab / Shift+Tab move, Escape goes back. "
    "Every committed field is saved at once; the bottom line says when. A value that "
    "is not accepted shows a message under its field and is not saved. Ctrl+P opens "
    "the command palette."
)


def key_text(binding: Binding) -> str:
    from textual.keys import format_key

    return " / ".join(format_key(k) for k in binding.key.split(","))


def help_text() -> Text:
    from survey.app import main, room, rooms, start, tables, visit, walk

    sections = [
        ("Everywhere", main.SurveyApp.BINDINGS),
        ("Start screen", start.StartScreen.BINDINGS),
        ("Walk screens", walk.WalkScreen.BINDINGS),
        ("Visit", visit.VisitScreen.BINDINGS),
        ("Room list", rooms.RoomListScreen.BINDINGS + tables.RoomTable.BINDINGS),
        ("Room", room.RoomScreen.BINDINGS),
        ("Surface table", tables.SurfaceTable.BINDINGS),
        ("Material table", tables.MaterialTable.BINDINGS),
        ("Equipment table", tables.EquipmentTable.BINDINGS),
        ("Instruments (site)", tables.InstrumentTable.BINDINGS),
    ]
    out = Text(WALK + "\n")
    for title, bindings in sections:
        out.append(f"\n{title}\n", "bold")
        for b in bindings:
            out.append(f"  {key_text(b):<18} {b.description}  ({b.id})\n")
    out.append("\nKeys can be remapped by binding id (shown in brackets).\n")
    return out


class HelpScreen(Screen):
    BINDINGS = [Binding("escape,f1", "app.pop_screen", "Back", id="help_close")]

    def compose(self):
        yield Static(Text("Keys", style="bold"), classes="screen-title")
        with VerticalScroll(id="help-scroll", can_focus=True):
            yield Static(help_text())
        yield Footer()

    def on_mount(self) -> None:
        self.query_one("#help-scroll").focus()
