"""An air reading typed as two fields (temperature, RH) and stored once both are good."""

from __future__ import annotations

from textual.containers import Vertical
from textual.message import Message

from survey import model, psychro
from survey.app import walk
from survey.app.fields import Field
from survey.errors import InputError
from survey.words import Display

#: RH at or above which a reading gets a warning (saturated sensors read high).
RH_WARNING_PCT = 98.0


class AirPair(Vertical):
    """Temperature and RH of one reading; ``save(AirReading) -> warning`` is called once
    both parse. With ``clear(AirReading) -> message`` given, a field emptied and committed
    asks whether to delete the stored reading (the room's undo puts it back)."""

    class Preview(Message):
        def __init__(self, pair: AirPair, reading: model.AirReading | None) -> None:
            super().__init__()
            self.pair = pair
            self.reading = reading

    def __init__(
        self,
        name: str,
        reading: model.AirReading | None,
        system: str,
        save,
        *,
        disabled: bool = False,
        previous: model.AirReading | None = None,
        clear=None,
    ) -> None:
        super().__init__(id=f"{name}-air", classes="air-pair")
        self.clear = clear
        self.key_name = name
        self.system = system
        self.save = save
        self.temp_c = None if reading is None else reading.dry_bulb_c
        self.rh_pct = None if reading is None else reading.rh_pct
        self.reading = reading
        self.read_only = disabled
        self.previous = previous

    def compose(self):
        d = Display(self.system)
        unit = "°F" if self.system == "ip" else "°C"
        prev = self.previous
        yield Field(
            f"Air temp. {unit}",
            walk.shown("temperature", self.temp_c, self.system),
            self._emptiable(
                "air temperature",
                walk.temperature("air temperature", self.system, psychro.check_dry_bulb),
            ),
            self._commit("temp"),
            id=f"{self.key_name}-temp",
            live=True,
            disabled=self.read_only,
            previous="" if prev is None else f"last {d.temperature(prev.dry_bulb_c)}",
        )
        yield Field(
            "RH %",
            walk.shown("rh", self.rh_pct, self.system),
            self._emptiable("relative humidity", walk.rh("relative humidity")),
            self._commit("rh"),
            id=f"{self.key_name}-rh",
            live=True,
            disabled=self.read_only,
            previous="" if prev is None else f"last {prev.rh_pct:.0f} %",
        )

    def _emptiable(self, name: str, parse):
        """A field's parser: a value is needed, unless the reading may be cleared (empty
        text is then None, and the commit asks)."""
        return walk.optional(parse) if self.clear is not None else walk.required(name, parse)

    def show_reading(self, reading: model.AirReading | None) -> None:
        """Show ``reading`` (stored elsewhere, as by an undo) in both fields."""
        self.reading = reading
        self.temp_c = None if reading is None else reading.dry_bulb_c
        self.rh_pct = None if reading is None else reading.rh_pct
        self.query_one(f"#{self.key_name}-temp", Field).set_text(
            walk.shown("temperature", self.temp_c, self.system)
        )
        self.query_one(f"#{self.key_name}-rh", Field).set_text(
            walk.shown("rh", self.rh_pct, self.system)
        )

    def _ask_clear(self) -> None:
        from survey.app.dialogs import ConfirmDialog

        reading = self.reading
        assert reading is not None and self.clear is not None
        shown = (
            f"{walk.shown('temperature', reading.dry_bulb_c, self.system)} "
            f"{'°C' if self.system == 'si' else '°F'}, {reading.rh_pct:g} %"
        )

        def answered(yes: bool | None) -> None:
            if yes:
                message = self.clear(reading)
                self.show_reading(None)
                self.app.show_status(message)
            else:
                self.show_reading(reading)

        self.app.push_screen(
            ConfirmDialog(f"Delete this air reading ({shown})? u puts it back."), answered
        )

    def unsaved_half(self) -> str | None:
        """Half a reading kept on screen but not saved (a temperature with no RH, or an RH
        with no temperature), in words; None when there is none."""
        if self.reading is not None or (self.temp_c is None) == (self.rh_pct is None):
            return None
        if self.temp_c is not None:
            unit = "°C" if self.system == "si" else "°F"
            shown = walk.shown("temperature", self.temp_c, self.system)
            return f"an air temperature of {shown} {unit} with no RH"
        return f"an RH of {walk.shown('rh', self.rh_pct, self.system)} % with no air temperature"

    def _build(self, temp_c: float | None, rh_pct: float | None) -> model.AirReading | None:
        if temp_c is None or rh_pct is None:
            return None
        base = self.reading or model.AirReading(dry_bulb_c=temp_c, rh_pct=rh_pct)
        return walk.checked(base, "air reading", dry_bulb_c=temp_c, rh_pct=rh_pct)

    def _commit(self, which: str):
        def commit(value: float | None) -> str:
            if value is None:  # emptied, where the reading may be cleared
                if self.reading is not None:
                    self._ask_clear()
                    return "asked whether to delete the reading; it stays until you answer y"
                if which == "temp":
                    self.temp_c = None
                else:
                    self.rh_pct = None
                return ""
            temp = value if which == "temp" else self.temp_c
            rh = value if which == "rh" else self.rh_pct
            try:
                reading = self._build(temp, rh)
            except InputError as exc:
                label = "air temperature" if which == "temp" else "relative humidity"
                raise InputError(label, exc.value, exc.allowed) from None
            if which == "temp":
                self.temp_c = value
            else:
                self.rh_pct = value
            if reading is None:
                return (
                    "kept here; the reading is saved once "
                    + ("the RH" if which == "temp" else "the temperature")
                    + " is given"
                )
            self.reading = reading
            warnings = [w for w in (self.save(reading),) if w]
            other = self.query_one(f"#{self.key_name}-{'rh' if which == 'temp' else 'temp'}", Field)
            if not other.has_class("-invalid"):
                other.show_message("")
            if which == "rh" and value >= RH_WARNING_PCT:
                warnings.append(
                    f"{value:g} % is close to saturation: check that the sensor "
                    "is dry and has settled"
                )
            return "saved; " + "; ".join(warnings) if warnings else ""

        return commit

    def on_field_preview(self, event: Field.Preview) -> None:
        event.stop()
        if event.value is None:  # not a value (yet): the panel shows the last good reading
            self.post_message(self.Preview(self, self.reading))
            return
        temp = event.value if event.field.id.endswith("-temp") else self.temp_c
        rh = event.value if event.field.id.endswith("-rh") else self.rh_pct
        try:
            reading = self._build(temp, rh)
        except InputError:
            self.post_message(self.Preview(self, self.reading))
            return
        if reading is not None:
            self.post_message(self.Preview(self, reading))
