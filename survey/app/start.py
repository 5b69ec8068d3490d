"""The start screen: the demo, a new survey, a file to open, the quick check, recent
surveys."""

from __future__ import annotations

from pathlib import Path

from rich.text import Text
from textual import on
from textual.binding import Binding
from textual.screen import Screen
from textual.widgets import OptionList, Static
from textual.widgets.option_list import Option

from survey.app.dialogs import PromptDialog
from survey.app.fields import plain
from survey.app.footer import KeysFooter
from survey.app.status import StatusBar


class StartScreen(Screen):
    """What to do first."""

    #: The mark the app finds it by in the screen stack (see ``SurveyApp._walk_base``).
    IS_START = True

    BINDINGS = [
        Binding("d", "demo", "Demo", id="start_demo"),
        Binding("n", "new", "New survey", id="start_new"),
        Binding("o", "open", "Open file", id="start_open"),
        Binding("q", "quick", "Quick check", id="start_quick"),
    ]

    def compose(self):
        yield Static(
            Text("condition-survey — damp and mould surveys, room by room", style="bold"),
            classes="screen-title",
        )
        yield Static(
            Text("Choose with ↑ ↓ and Enter, or press the letter shown below."), classes="hint"
        )
        yield OptionList(id="start-menu")
        yield StatusBar()
        yield KeysFooter()

    def on_mount(self) -> None:
        self.fill()

    def on_screen_resume(self) -> None:
        self.fill()
        for bar in self.query(StatusBar):
            bar.show(self.app.status_text, self.app.status_kind)

    def fill(self) -> None:
        menu = self.query_one(OptionList)
        menu.clear_options()
        editor = self.app.editor
        if editor is not None and editor.path is not None:
            line = Text("Back to the open survey: ")
            line.append(plain(editor.survey.site.reference))
            menu.add_option(Option(line, id="back"))
        menu.add_option(
            Option(Text("d  Open the demo survey (an invented flat with mould)"), id="demo")
        )
        menu.add_option(Option(Text("n  New survey…"), id="new"))
        menu.add_option(Option(Text("o  Open a survey file…"), id="open"))
        menu.add_option(Option(Text("q  Quick check of one room (no file)"), id="quick"))
        entries = self.app.recents.entries()
        if entries:
            menu.add_option(None)
            for index, entry in enumerate(entries):
                line = Text("   Recent: ")
                line.append(plain(entry.reference or Path(entry.path).name))
                line.append("  ")
                line.append(plain(entry.path, "dim"))
                menu.add_option(Option(line, id=f"recent-{index}"))
        menu.highlighted = 0
        menu.focus()

    @on(OptionList.OptionSelected)
    def _chosen(self, event: OptionList.OptionSelected) -> None:
        choice = event.option.id or ""
        if choice == "back":
            self.app.go("rooms")
        elif choice.startswith("recent-"):
            entries = self.app.recents.entries()
            index = int(choice.split("-", 1)[1])
            if index < len(entries):
                self.app.open_survey(Path(entries[index].path))
        else:
            getattr(self, f"action_{choice}")()

    def action_demo(self) -> None:
        self.app.open_demo()

    def action_quick(self) -> None:
        self.app.action_quick_check()

    def action_new(self) -> None:
        def check(values: list[str]) -> str:
            path, reference = values[0].strip(), values[1].strip()
            if not path:
                return "File: give a file name, such as flat-7.json"
            if not reference:
                return "Site reference: give a job reference or short site name"
            if Path(path).expanduser().exists():
                return f"File {path}: it exists already; open it instead"
            return ""

        def done(values: list[str] | None) -> None:
            if values:
                path = Path(values[0].strip()).expanduser()
                if path.suffix != ".json":
                    path = path.with_name(path.name + ".json")
                self.app.create_survey(path, values[1].strip())

        self.app.push_screen(
            PromptDialog(
                "New survey",
                [
                    ("File name, e.g. flat-7.json", ""),
                    ("Site reference, e.g. job number and short address", ""),
                ],
                check,
                note=f"The file is made in {Path.cwd()} unless you give a path.",
            ),
            done,
        )

    def action_open(self) -> None:
        def check(values: list[str]) -> str:
            path = Path(values[0].strip()).expanduser()
            return "" if path.is_file() else f"File {values[0]}: no such file"

        def done(values: list[str] | None) -> None:
            if values:
                self.app.open_survey(Path(values[0].strip()).expanduser())

        self.app.push_screen(PromptDialog("Open a survey file", [("File", "")], check), done)
