"""Drying and ventilation equipment in a room on a visit: its table rows and its dialogs.

The first dialog holds what every piece of equipment has (kind, label, running, rated
capacity, water collected). For a dehumidifier a second one follows, the performance check:
the air going in (blank: the room's air) and coming out, the run hours, the power or energy,
the rated energy factor and its test condition, with the results (removal, energy factor,
COP against the rating, findings) shown live as they are typed and on the status line once
saved. The sentences are :mod:`survey.words.equipment`'s; the judgement is
:func:`survey.equipment.judge_record`'s.
"""

from __future__ import annotations

from collections.abc import Callable

import msgspec
from rich.text import Text
from textual import on
from textual.containers import Horizontal, Vertical
from textual.widgets import Input, Label, Static

from survey import equipment as eq
from survey import model, units
from survey.app import walk
from survey.app.dialogs import PromptDialog
from survey.app.fields import plain
from survey.equipment import read_power_or_energy
from survey.errors import InputError
from survey.words.report_room import EQUIPMENT_WORDS

#: The kinds as the dialog offers them: (words, stored value).
KIND_WORDS = {k: "other" if k == "other" else w for k, w in EQUIPMENT_WORDS.items()}
KINDS = [(words, kind) for kind, words in KIND_WORDS.items()]
#: Whether it is running, as the dialog offers it.
RUNNING = [("yes", "yes"), ("no", "no")]
DEHUMIDIFIERS = frozenset({"refrigerant_dehumidifier", "desiccant_dehumidifier"})
COLUMNS = ("kind", "label", "running", "L/day rated", "water removed")


def _judged(screen, index: int | None, record: model.Equipment | None = None):
    """The unit at ``index`` of the screen's room visit judged (``record`` in its place)."""
    if screen is None:
        return None
    room_visit = screen.record()
    if room_visit is None:
        return None
    if index is None or index >= len(room_visit.equipment):
        if record is None:
            return None
        room_visit = msgspec.structs.replace(room_visit, equipment=[*room_visit.equipment, record])
        index = len(room_visit.equipment) - 1
    return eq.judge_record(
        screen.editor.survey, screen.editor.visit_index, room_visit, index, record
    )


def row(e: model.Equipment, screen=None, index: int | None = None) -> tuple[Text, ...]:
    """A table row; a dehumidifier's water cell adds its check's results when the screen
    (a room screen) and the record's index are given."""
    water = "" if e.water_removed_l is None else f"{e.water_removed_l:g} L"
    unit = _judged(screen, index) if e.kind in DEHUMIDIFIERS else None
    if unit is not None:
        from survey.words import equipment as we

        d = screen.app.display_units
        if unit.result is None:
            water = " · ".join(p for p in (water, "no outlet reading") if p)
        else:
            water = " · ".join(
                p for p in (water, we.summary(unit.result, d), we.found_text(unit.result)) if p
            )
    return (
        Text(KIND_WORDS.get(e.kind, e.kind)),
        plain(walk.cut(e.label, 20)),
        Text("yes" if e.running else "no"),
        Text("" if e.capacity_l_per_day is None else f"{e.capacity_l_per_day:g}"),
        Text(water),
    )


def dialog(
    title: str,
    current: model.Equipment | None,
    done: Callable[[model.Equipment], None],
    screen=None,
    index: int | None = None,
) -> tuple[PromptDialog, Callable]:
    """A dialog and its answer callback: a record the model accepts goes to ``done``. With
    the room ``screen`` (and the record's ``index``, None for a new one), a dehumidifier
    goes on to its performance check."""
    e = current
    system = "si" if screen is None else screen.editor.unit_system
    fields = [
        ("Kind", e.kind if e else "refrigerant_dehumidifier", KINDS),
        ("Label", e.label if e else ""),
        ("Running now", "no" if e and not e.running else "yes", RUNNING),
        (
            "Rated capacity, L/day (a dehumidifier; else blank)",
            "" if e is None or e.capacity_l_per_day is None else f"{e.capacity_l_per_day:g}",
        ),
        (
            "Water removed since the last visit, L (a dehumidifier)",
            "" if e is None or e.water_removed_l is None else f"{e.water_removed_l:g}",
        ),
    ]
    found: dict[str, model.Equipment] = {}

    def check(v: list[str]) -> str:
        try:
            kind, running = v[0], v[2]
            base = e or model.Equipment(kind=kind)
            capacity = walk.optional(lambda t: eq.read_capacity(t, "Rated capacity", "si"))
            water = walk.optional(lambda t: eq.read_water(t, "Water removed", "si")[0])
            found["record"] = walk.checked(
                base,
                "equipment",
                kind=kind,
                label=walk.text_parser("Label")(v[1]),
                running=running == "yes",
                capacity_l_per_day=capacity(v[3]),
                water_removed_l=water(v[4]),
            )
        except InputError as exc:
            return f"Not saved — {exc}"
        return ""

    def answered(values: list[str] | None) -> None:
        if values is None or "record" not in found:
            return
        record = found["record"]
        done(record)
        if screen is None or record.kind not in DEHUMIDIFIERS:
            return
        room_visit = screen.record()
        at = index if index is not None else len(room_visit.equipment) - 1
        check_dialog = CheckDialog(screen, at, record, system)

        def saved(values: list[str] | None) -> None:
            if values is None or check_dialog.built is None:
                return
            items = list(screen.record(create=True).equipment)
            items[at] = check_dialog.built
            screen._replace_record("equipment", equipment=items)
            screen._changed()
            title, text = result_note(screen, at)
            screen.app.notify(text, title=title, timeout=12, markup=False)

        screen.app.push_screen(check_dialog, saved)

    from survey.words import equipment as we

    note = we.CHECK_FOLLOWS if screen is not None else ""
    return PromptDialog(title, fields, check, note), answered


def result_note(screen, index: int) -> tuple[str, str]:
    """The saved unit's results for a notification: its name, and the summary with the
    findings in a few words."""
    from survey.words import equipment as we

    unit = _judged(screen, index)
    if unit is None:
        return "Saved", ""
    name = we.unit_name(unit.label)
    if unit.result is None:
        return name, we.missing_text(unit)
    summary = we.summary(unit.result, screen.app.display_units)
    return name, f"{summary}. Found: {we.found_text(unit.result)}."


# --- the dehumidifier's performance check ---------------------------------------------------

RATING_HELP = ", ".join(eq.RATING_CONDITIONS)


def _air_text(reading: model.AirReading | None, system: str) -> str:
    if reading is None:
        return ""
    return f"{walk.shown('temperature', reading.dry_bulb_c, system)}, {reading.rh_pct:g}"


def read_air(text: str, name: str, system: str) -> tuple[float, float]:
    """'24, 70', '24 70', '75F 70%' or '24 °C, 70 %': a temperature and an RH."""
    from survey import psychro

    allowed = "a temperature and an RH, e.g. 24, 70 or 75F 70%"
    parts = [p.strip() for p in text.replace(";", ",").split(",") if p.strip()]
    tokens = parts if len(parts) == 2 else text.split()
    for cut in range(1, len(tokens)):
        try:
            temp = units.parse_temperature(" ".join(tokens[:cut]), name, system)
            rh = units.parse_rh(" ".join(tokens[cut:]), name)
        except InputError:
            continue
        try:
            psychro.check_dry_bulb(temp, name)
            psychro.check_rh(rh, name)
        except InputError as exc:
            raise InputError(name, text, exc.allowed) from None
        return temp, rh
    raise InputError(name, text, allowed)


class CheckDialog(PromptDialog):
    """The readings of a dehumidifier's performance check, with its results live."""

    DEFAULT_CSS = """
    CheckDialog .check-row { height: 1; }
    CheckDialog .check-label { width: 36; }
    CheckDialog Input { width: 1fr; }
    CheckDialog #check-preview { margin-top: 1; }
    """

    def __init__(self, screen, index: int, record: model.Equipment, system: str) -> None:
        from survey.words import equipment as we

        e = record
        t = "°F" if system == "ip" else "°C"
        fields = [
            (f"Air in: {t}, RH % (blank: room air)", _air_text(e.inlet, system)),
            (f"Air out: {t}, RH %", _air_text(e.outlet, system)),
            ("Run hours (blank: since last)", f"{e.run_hours:g}" if e.run_hours else ""),
            (
                "Power W / kW, or energy kWh",
                f"{e.power_w:g}W"
                if e.power_w
                else (f"{e.energy_kwh:g}kWh" if e.energy_kwh else ""),
            ),
            (
                "Rated energy factor, L/kWh",
                f"{e.rated_energy_factor_l_per_kwh:g}" if e.rated_energy_factor_l_per_kwh else "",
            ),
            (we.rating_condition_prompt(), e.rating_condition or ""),
        ]
        name = e.label or KIND_WORDS.get(e.kind, e.kind)
        super().__init__(f"Performance check — {name}", fields, self._check)
        self.room_screen = screen
        self.index = index
        self.base = record
        self.system = system
        self.built: model.Equipment | None = None

    def compose(self):
        room = self.room_screen.record()
        air = None if room is None else room.air
        hints = [
            "" if air is None else f"room air: {_air_text(air, self.system)}",
            "e.g. 27.5, 28",
            "",
            "540W or 12.9kWh",
            "from the label",
            RATING_HELP,
        ]
        with Vertical(classes="dialog"):
            yield Static(Text(self.title_text, style="bold"))
            for n, (label, value) in enumerate(self.fields):
                with Horizontal(classes="check-row"):
                    yield Label(label, markup=False, classes="check-label")
                    yield Input(value, id=f"prompt-{n}", compact=True, placeholder=hints[n])
            yield Static("", id="check-preview")
            yield Static("", id="prompt-message", classes="field-message")
            yield Static(Text("Enter: next / save    Escape: keep without these", style="dim"))

    def on_mount(self) -> None:
        self._preview()

    def build(self, values: list[str]) -> model.Equipment:
        """The record with these readings (InputError naming the field for a bad one)."""
        inlet_text, outlet_text, hours, energy, ef, condition = (v.strip() for v in values)
        base = self.base
        changes: dict[str, object] = {}
        for field, text, name in (
            ("inlet", inlet_text, "Air in"),
            ("outlet", outlet_text, "Air out"),
        ):
            old = getattr(base, field)
            if not text:
                changes[field] = None
                continue
            if old is not None and text == _air_text(old, self.system):
                continue  # as offered: the stored reading, its time and instrument, stays
            temp, rh = read_air(text, name, self.system)
            reading = model.AirReading(dry_bulb_c=temp, rh_pct=rh)
            visit = self.room_screen.visit
            changes[field], _ = walk.stamped(
                reading, self.app.clock(), visit, self.room_screen.editor.survey, "air", old
            )
        changes["run_hours"] = eq.read_hours(hours, "Run hours") if hours else None
        power, kwh = read_power_or_energy(energy, "Power or energy") if energy else (None, None)
        changes["power_w"], changes["energy_kwh"] = power, kwh
        changes["rated_energy_factor_l_per_kwh"] = (
            eq.read_energy_factor(ef, "Rated energy factor") if ef else None
        )
        changes["rating_condition"] = (
            eq.rating_point(condition.lower(), "Rating condition").key if condition else None
        )
        return walk.checked(base, "equipment", **changes)

    def _check(self, values: list[str]) -> str:
        try:
            self.built = self.build(values)
        except InputError as exc:
            return f"Not saved — {exc}"
        return ""

    @on(Input.Changed)
    def _changed(self, event: Input.Changed) -> None:
        event.stop()
        self._preview()

    def _preview(self) -> None:
        from survey.words import equipment as we

        preview = self.query_one("#check-preview", Static)
        values = [i.value for i in self.query(Input)]
        try:
            record = self.build(values)
        except InputError as exc:
            preview.update(plain(we.not_yet_text(exc)))
            return
        unit = _judged(self.room_screen, self.index, record)
        d = self.app.display_units
        if unit is None:
            preview.update(plain(we.NO_AIR_YET))
        elif unit.result is None:
            preview.update(plain(we.missing_text(unit)))
        else:
            lines = [we.summary(unit.result, d), *we.finding_lines(unit.result, d)]
            c = unit.result.comparison
            if c is not None and c.site_scale is not None:
                lines.append(we.rating_caution(unit.result, d))
            preview.update(Text("\n").join(plain(line) for line in lines))
