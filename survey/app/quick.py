"""The quick check as a screen: one room's readings that belong to no survey, judged by
:func:`survey.quick.judge` as ``survey check`` does, shown as the words module words them."""

from __future__ import annotations

from rich.text import Text
from textual import on
from textual.binding import Binding
from textual.containers import Horizontal, VerticalScroll
from textual.screen import Screen
from textual.widgets import Input, Label, Select, Static

from survey import assess, psychro, quick, words
from survey.app import walk
from survey.app.fields import Choice, plain
from survey.app.footer import KeysFooter
from survey.app.panel import PANEL_KEYS, scroll_panel
from survey.app.room import USES
from survey.errors import InputError
from survey.words import screens

#: (id, label, parser, needed; a label with a unit ends with it)
FIELDS = [
    (
        "air",
        "Air temp. °C",
        walk.temperature("air temperature", "si", psychro.check_dry_bulb),
        True,
    ),
    ("rh", "RH %", walk.rh("relative humidity"), True),
    (
        "surface",
        "Surface temp. °C",
        walk.temperature("surface temperature", "si", psychro.check_surface_temp),
        False,
    ),
    (
        "surface2",
        "2nd surface °C",
        walk.temperature("second surface temperature", "si", psychro.check_surface_temp),
        False,
    ),
    ("volume", "Volume m³", quick.read_room_volume, False),
    ("occupants", "Occupants", quick.read_occupants, False),
    (
        "outdoor",
        "Outdoor temp. °C",
        walk.temperature("outdoor temperature", "si", psychro.check_dry_bulb),
        False,
    ),
    (
        "outdoor_rh",
        "Outdoor RH %",
        walk.rh("outdoor RH"),
        False,
    ),
]


class QuickScreen(Screen):
    """Type readings; the result follows every keystroke. Nothing is saved."""

    BINDINGS = [Binding("escape", "app.pop_screen", "Back", id="quick_back"), *PANEL_KEYS]

    def action_scroll_panel(self, lines: int) -> None:
        scroll_panel(self, lines)

    def compose(self):
        yield Static(
            Text("Quick check — one room, no survey file, nothing saved", style="bold"),
            classes="screen-title",
        )
        with Horizontal(classes="split"):
            with walk.Form():
                for key, label, _parse, _need in FIELDS:
                    with Horizontal(classes="field-row"):
                        yield Label(label, classes="field-label")
                        yield Input(id=f"quick-{key}", compact=True)
                yield walk.labelled(
                    "Use",
                    Choice(USES, value="other", allow_blank=False, compact=True, id="quick-use"),
                )
                yield Static("", id="quick-message", classes="field-message -error")
            yield VerticalScroll(Static(id="quick-result"), classes="live-panel-scroll")
        yield KeysFooter()

    def on_mount(self) -> None:
        #: The last value each field read, kept while its text does not read.
        self._good: dict[str, float] = {}
        #: Whether the result panel shows a judged result (kept when the next is refused).
        self._shown_result = False
        self.query_one("#quick-air").focus()
        self.update_result()

    @on(Input.Submitted)
    def _next(self, event: Input.Submitted) -> None:
        self.focus_next()

    @on(Input.Changed)
    @on(Select.Changed)
    def _changed(self, event) -> None:
        self.update_result()

    def gather(self) -> quick.QuickInput | None:
        """The readings as typed. A field that does not read keeps the last value that did
        (or is left out), and the message under the form says which value is in use, so one
        slip (or a half-typed "-") does not blank the result."""
        values: dict[str, float | None] = {}
        problems: list[str] = []
        good = self._good
        for key, label, parse, _need in FIELDS:
            text = self.query_one(f"#quick-{key}", Input).value
            if not text.strip():
                good.pop(key, None)
                values[key] = None
                continue
            try:
                values[key] = good[key] = parse(text)
            except InputError as exc:
                kept = good.get(key)
                values[key] = kept
                unit = label.rsplit(" ", 1)[1] if label.endswith(("°C", "%", "m³")) else ""
                used = (
                    "it is left out"
                    if kept is None
                    else f"the result uses the last value that read, {kept:g} {unit}".rstrip()
                )
                problems.append(f"Not read: {exc}; {used}.")
        self.query_one("#quick-message", Static).update(plain(" ".join(problems)))
        if any(values[key] is None for key, _label, _parse, need in FIELDS if need):
            return None
        use = self.query_one("#quick-use", Select).value
        surfaces = tuple(
            assess.SurfaceInput(name, values[key], "external_wall")
            for key, name in (("surface", "surface"), ("surface2", "second surface"))
            if values[key] is not None
        )
        outdoor = None
        if values["outdoor"] is not None and values["outdoor_rh"] is not None:
            outdoor = assess.OutdoorInput(values["outdoor"], values["outdoor_rh"])
        return quick.QuickInput(
            air_temp_c=values["air"],
            rh_pct=values["rh"],
            surfaces=surfaces,
            outdoor=outdoor,
            use=None if use == "other" else use,
            volume_m3=values["volume"],
            occupants=None if values["occupants"] is None else int(values["occupants"]),
        )

    def update_result(self) -> None:
        target = self.query_one("#quick-result", Static)
        given = self.gather()
        if given is None:
            self._shown_result = False
            target.update(
                Text(
                    "Type the air temperature and RH (a surface temperature and "
                    "an outdoor reading add more)."
                )
            )
            return
        try:
            result = quick.judge(given)
        except InputError as exc:  # the fields are held to the core's domain: a safety net
            message = self.query_one("#quick-message", Static)
            if self._shown_result:
                earlier = str(message.render()).strip()  # what gather() said of the fields
                said = f"Not judged: {exc}; the result below is for the last readings judged."
                message.update(plain(f"{earlier} {said}".strip()))
            else:
                target.update(plain(f"Not judged: {exc}."))
            return
        self._shown_result = True
        target.update(result_text(result, words.SI))


def result_text(result: quick.QuickResult, d: words.Display) -> Text:
    f, advice, air = result.finding, result.advice, result.room
    out = Text()
    for line in screens.air_state_lines(air, d, f.condensation_point_uncertainty_k)[1:]:
        out.append(line + "\n")
    for s in f.surfaces:
        out.append(screens.quick_surface_line(s, d) + "\n")
    limit = screens.safe_rh_line(f)
    if limit is not None:
        out.append(limit + "\n")
    out.append(f"\n{screens.HEADINGS['actions']}\n", "bold")
    if not advice.actions:
        out.append(screens.NOTHING_TO_DO + "\n")
    for n, action in enumerate(advice.actions, 1):
        out.append(f"{n}. ")
        out.append(words.action_title(action), "bold")
        numbers = words.action_numbers(action, d)
        out.append(f" — {numbers}\n" if numbers else "\n")
        out.append(words.action_reason(action, f, advice, d) + "\n", "dim")
    if result.cautions:
        out.append(f"\n{screens.HEADINGS['cautions']}\n", "bold")
        for caution in result.cautions:
            out.append(f"• {words.caution_text(caution, d)}\n")
    return out
