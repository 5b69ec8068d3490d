"""A survey's readings as CSV for spreadsheets: one row per reading, with derived values.

Rows, in file order: per visit the outdoor air, then per room its air, surfaces, material
readings and dehumidifier outlets; then every logger sample. Derived values (dew and frost
point, humidity ratio, vapour pressure, absolute humidity, surface RH, the margin to the dew
or frost point, the humidity-ratio drop across a dehumidifier) are worked out from the
readings as :mod:`survey.psychro` does for every other part of the tool.

Columns carry their unit in their name, and where ``survey check --json`` reports the same
quantity the column has the same key (``dew_point_c``, ``humidity_ratio_g_per_kg``,
``grains_per_pound``, ``pressure_pa``, ``dew_point_margin_k`` …). Numbers are written with a
fixed number of decimals per quantity (:data:`DECIMALS`), never as a float's full repr.

The export streams: rows are written as they are made, and the moist-air values of a
logger sample are cached by reading (loggers repeat the same few thousand temperature and
RH pairs), so a series of a million samples is written in seconds and in little memory.

Text from the survey (labels, names, locations) is made safe for spreadsheets by
:func:`spreadsheet_safe`; numbers this module formats are never touched. No NUL byte is
ever written. For a terminal, :func:`write_csv` can also make control characters visible.
"""

from __future__ import annotations

import datetime as dt
import os
import re
from collections.abc import Iterator
from typing import TYPE_CHECKING, Literal, TextIO

import msgspec

from survey import psychro
from survey.errors import InputError
from survey.safe_text import visible

if TYPE_CHECKING:
    from survey.model import AirReading, LogSeries, Room, Survey

UnitSystem = Literal["si", "ip"]

#: Column roles in file order, with the column name in SI and in IP units.
_COLUMNS: tuple[tuple[str, str, str], ...] = (
    ("visit", "visit", "visit"),
    ("visit_label", "visit_label", "visit_label"),
    ("visit_started_at", "visit_started_at", "visit_started_at"),
    ("room_id", "room_id", "room_id"),
    ("room_name", "room_name", "room_name"),
    ("room_use", "room_use", "room_use"),
    ("reference_room", "reference_room", "reference_room"),
    ("kind", "kind", "kind"),
    ("location", "location", "location"),
    ("element", "element", "element"),
    ("material", "material", "material"),
    ("taken_at", "taken_at", "taken_at"),
    ("instrument", "instrument", "instrument"),
    ("dry_bulb", "dry_bulb_c", "dry_bulb_f"),
    ("rh", "rh_pct", "rh_pct"),
    ("pressure", "pressure_pa", "pressure_inhg"),
    ("dew_point", "dew_point_c", "dew_point_f"),
    ("frost_point", "frost_point_c", "frost_point_f"),
    ("humidity_ratio", "humidity_ratio_g_per_kg", "grains_per_pound"),
    ("vapour_pressure", "vapour_pressure_pa", "vapour_pressure_inhg"),
    ("absolute_humidity", "absolute_humidity_g_per_m3", "absolute_humidity_gr_per_ft3"),
    ("surface_temp", "surface_temp_c", "surface_temp_f"),
    ("surface_rh", "surface_rh_pct", "surface_rh_pct"),
    ("margin", "dew_point_margin_k", "dew_point_margin_f"),
    ("moisture_value", "moisture_value", "moisture_value"),
    ("moisture_scale", "moisture_scale", "moisture_scale"),
    ("moisture_method", "moisture_method", "moisture_method"),
    ("dry_standard", "dry_standard", "dry_standard"),
    ("condensation_seen", "condensation_seen", "condensation_seen"),
    ("mould_visible", "mould_visible", "mould_visible"),
    ("humidity_ratio_drop", "humidity_ratio_drop_g_per_kg", "grain_depression_gr_per_lb"),
)
_ROLES = tuple(role for role, _si, _ip in _COLUMNS)
_INDEX = {role: n for n, role in enumerate(_ROLES)}

#: Decimal places per quantity and unit system: finer than any instrument reads, coarse
#: enough that no float noise shows (a reading of 15.8 °C is written ``15.80``).
#: Temperatures 0.01 °C / °F; RH 0.1 %; humidity ratio 0.01 g/kg or 0.1 gr/lb; pressure
#: 1 Pa or 0.001 inHg; vapour pressure 1 Pa or 0.0001 inHg; absolute humidity 0.01 g/m³ or
#: 0.001 gr/ft³; moisture readings 0.1 on their own scale.
DECIMALS: dict[tuple[str, UnitSystem], int] = {
    ("temperature", "si"): 2,
    ("temperature", "ip"): 2,
    ("temperature_difference", "si"): 2,
    ("temperature_difference", "ip"): 2,
    ("rh", "si"): 1,
    ("rh", "ip"): 1,
    ("humidity_ratio", "si"): 2,
    ("humidity_ratio", "ip"): 1,
    ("pressure", "si"): 0,
    ("pressure", "ip"): 3,
    ("vapour_pressure", "si"): 0,
    ("vapour_pressure", "ip"): 4,
    ("absolute_humidity", "si"): 2,
    ("absolute_humidity", "ip"): 3,
    ("moisture", "si"): 1,
    ("moisture", "ip"): 1,
}

#: Quantities written as they are in every unit system (the others are converted by
#: :func:`survey.units.to_display` in IP units; in SI every column is the core's own unit,
#: except the humidity ratio, kg/kg written as g/kg).
_SAME_IN_EVERY_SYSTEM = frozenset({"rh", "moisture"})


def column_names(system: UnitSystem = "si") -> list[str]:
    """The CSV header in ``system``'s units, in file order."""
    _check_system(system)
    return [si if system == "si" else ip for _role, si, ip in _COLUMNS]


def _check_system(system: str) -> None:
    if system not in ("si", "ip"):
        raise InputError("unit system", system, "si or ip")


# --- cells -------------------------------------------------------------------------------

#: A text cell whose first character other than white space is one of these is taken by
#: spreadsheet programs as a formula; full-width forms are folded to them by some programs
#: (OWASP, "CSV Injection"). A cell starting with a tab or CR may be shifted into one.
_FORMULA_CHARS = "=+-@\uff1d\uff0b\uff0d\uff20"
_PLAIN_NUMBER = re.compile(r"[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?")


def spreadsheet_safe(cell: str) -> str:
    """``cell`` as text a spreadsheet will not run.

    A text cell that starts, after any white space or line breaks, with ``=``, ``+``,
    ``-``, ``@`` or their full-width forms, or that starts with a tab or CR, gets a leading
    apostrophe. A cell that is a plain number (``-5``, ``+0.25``) is left as it is.
    """
    if not cell:
        return cell
    start = cell.lstrip()
    if (
        cell[0] in "\t\r" or (start and start[0] in _FORMULA_CHARS)
    ) and not _PLAIN_NUMBER.fullmatch(cell):
        return "'" + cell
    return cell


def _text_cell(value: object, for_terminal: bool) -> str:
    """A CSV field for text from the survey: spreadsheet-safe, no NUL, quoted as needed."""
    text = "" if value is None else str(value)
    if for_terminal:
        text = visible(text, keep_newlines=True)
    elif not text.isprintable():  # kept as data, but never a NUL nor a lone surrogate
        text = "".join(map(_writable, text))
    return _quote(spreadsheet_safe(text))


def _writable(char: str) -> str:
    """``char``, or a visible escape for the two that cannot go into the file: NUL (which
    spreadsheets and many tools cut text at) and a lone surrogate (not encodable)."""
    if char == "\x00":
        return "\\x00"
    if "\ud800" <= char <= "\udfff":
        return f"\\u{ord(char):04x}"
    return char


def _quote(cell: str) -> str:
    """``cell`` quoted the way the ``csv`` module's minimal quoting does."""
    if any(char in cell for char in ',"\r\n'):
        return '"' + cell.replace('"', '""') + '"'
    return cell


def _time(value: dt.datetime | None) -> str:
    return "" if value is None else value.isoformat(sep=" ")


_MINUTE = dt.timedelta(minutes=1)
_NO_OFFSET = dt.timedelta(0)


def _times(values: list[dt.datetime]) -> list[str]:
    """``[_time(v) for v in values]``, ten times faster: msgspec writes the same ISO 8601
    text in C, with ``T`` between date and time and ``Z`` for a zero UTC offset."""
    if not values:
        return []
    if any(v.tzinfo is not None and (v.utcoffset() or _NO_OFFSET) % _MINUTE for v in values):
        return [_time(v) for v in values]  # msgspec rounds an offset to whole minutes
    text = msgspec.json.encode(values).decode()
    return text[2:-2].replace("T", " ").replace("Z", "+00:00").split('","')


def _flag(value: bool) -> str:
    return "yes" if value else "no"


class _Numbers:
    """Formats core SI values in one unit system with the fixed decimals of each quantity."""

    def __init__(self, system: UnitSystem) -> None:
        self.system = system
        self._linear: dict[str, tuple[float, float, str]] = {}
        for quantity in (
            "temperature",
            "temperature_difference",
            "rh",
            "humidity_ratio",
            "pressure",
            "vapour_pressure",
            "absolute_humidity",
            "moisture",
        ):
            factor, offset = self._conversion(quantity)
            places = DECIMALS[(quantity, system)]
            self._linear[quantity] = (factor, offset, f"{{:.{places}f}}")

    def _conversion(self, quantity: str) -> tuple[float, float]:
        if quantity == "humidity_ratio" and self.system == "si":
            return 1000.0, 0.0  # kg/kg -> g/kg
        if self.system == "si" or quantity in _SAME_IN_EVERY_SYSTEM:
            return 1.0, 0.0
        from survey import units

        zero = units.to_display(quantity, 0.0, "ip")
        one = units.to_display(quantity, 1.0, "ip")
        return one - zero, zero

    def format(self, quantity: str, value_si: float | None) -> str:
        if value_si is None:
            return ""
        factor, offset, pattern = self._linear[quantity]
        text = pattern.format(factor * value_si + offset)
        if text[0] == "-" and not text.strip("-0."):
            return text[1:]  # no "-0.00"
        return text


_TRIPLE_POINT_PRESSURE_PA = psychro.sat_vapour_pressure_pa(psychro.TRIPLE_POINT_C)
#: Distinct logger readings whose air cells are kept while a series is written (loggers
#: repeat the same few thousand pairs of temperature and RH); past this the cache starts
#: afresh, so its memory stays small (a few MB) whatever the series.
_CACHE_LIMIT = 50_000


class _AirCells:
    """The eight air columns (dry bulb … absolute humidity) of a reading, as text.

    :func:`psychro.vapour_state` gives the same numbers as :func:`psychro.state_from_rh`
    without the wet bulb (an iterative solve the export does not show); ``state_from_rh``
    is used whenever the dew point lies below the triple point (it is then over supercooled
    water, and the frost point is shown too).
    """

    def __init__(self, numbers: _Numbers) -> None:
        self.numbers = numbers

    def joined(self, dry_bulb_c: float, rh_pct: float, pressure_pa: float) -> str:
        """The air cells of one reading, joined with commas (numbers need no quoting)."""
        return ",".join(self.cells(dry_bulb_c, rh_pct, pressure_pa))

    def cells(self, dry_bulb_c: float, rh_pct: float, pressure_pa: float) -> list[str]:
        n = self.numbers.format
        light = psychro.vapour_state(dry_bulb_c, rh_pct, pressure_pa)
        if light.vapour_pressure_pa >= _TRIPLE_POINT_PRESSURE_PA:
            dew, frost = light.condensation_point_c, None
            ratio, vapour = light.humidity_ratio_kg_per_kg, light.vapour_pressure_pa
            absolute = 1000.0 * ratio / light.specific_volume_m3_per_kg
        else:
            state = psychro.state_from_rh(dry_bulb_c, rh_pct, pressure_pa)
            dew, frost = state.dew_point_c, state.frost_point_c
            ratio, vapour = state.humidity_ratio_kg_per_kg, state.vapour_pressure_pa
            absolute = state.absolute_humidity_g_per_m3
        return [
            n("temperature", dry_bulb_c),
            n("rh", rh_pct),
            n("pressure", pressure_pa),
            n("temperature", dew),
            n("temperature", frost),
            n("humidity_ratio", ratio),
            n("vapour_pressure", vapour),
            n("absolute_humidity", absolute),
        ]


# --- rows --------------------------------------------------------------------------------


class _Rows:
    """Builds the CSV lines of one survey."""

    def __init__(self, survey: Survey, system: UnitSystem, for_terminal: bool) -> None:
        self.survey = survey
        self.numbers = _Numbers(system)
        self.air = _AirCells(self.numbers)
        self.for_terminal = for_terminal
        self.rooms = {room.id: room for room in survey.rooms}

    def text(self, value: object) -> str:
        return _text_cell(value, self.for_terminal)

    def row(self, cells: dict[str, str]) -> list[str]:
        """The fields of one row from cells by role (already CSV fields), the rest empty."""
        row = [""] * len(_ROLES)
        for role, cell in cells.items():
            row[_INDEX[role]] = cell
        return row

    def line(self, cells: dict[str, str]) -> str:
        """One CSV line from cells by role, the rest empty."""
        return ",".join(self.row(cells)) + "\r\n"

    def room_cells(self, room: Room | None) -> dict[str, str]:
        if room is None:
            return {}
        return {
            "room_id": self.text(room.id),
            "room_name": self.text(room.name),
            "room_use": self.text(room.use),
            "reference_room": _flag(room.is_reference),
        }

    def air_reading(self, reading: AirReading, pressure_pa: float) -> dict[str, str]:
        cells = dict(
            zip(
                _ROLES[_INDEX["dry_bulb"] : _INDEX["absolute_humidity"] + 1],
                self.air.cells(reading.dry_bulb_c, reading.rh_pct, pressure_pa),
                strict=False,
            )
        )
        cells["taken_at"] = _time(reading.taken_at)
        cells["instrument"] = self.text(reading.instrument or "")
        return cells

    def visit_lines(self) -> Iterator[str]:
        from survey.model import pressure_pa_for

        n = self.numbers.format
        for number, visit in enumerate(self.survey.visits, 1):
            pressure = pressure_pa_for(self.survey, visit)
            base = {
                "visit": str(number),
                "visit_label": self.text(visit.label),
                "visit_started_at": _time(visit.started_at),
            }
            if visit.outdoor is not None:
                yield self.line(
                    {
                        **base,
                        "kind": "outdoor_air",
                        "location": "outdoors",
                        **self.air_reading(visit.outdoor, pressure),
                    }
                )
            for room_visit in visit.rooms:
                here = {**base, **self.room_cells(self.rooms.get(room_visit.room))}
                state = None
                if room_visit.air is not None:
                    state = psychro.state_from_rh(
                        room_visit.air.dry_bulb_c, room_visit.air.rh_pct, pressure
                    )
                    yield self.line(
                        {**here, "kind": "room_air", **self.air_reading(room_visit.air, pressure)}
                    )
                for surface in room_visit.surfaces:
                    cells = {
                        **here,
                        "kind": "surface",
                        "location": self.text(surface.location),
                        "element": self.text(surface.element),
                        "material": self.text(surface.material),
                        "taken_at": _time(surface.taken_at),
                        "instrument": self.text(surface.instrument or ""),
                        "surface_temp": n("temperature", surface.surface_temp_c),
                        "condensation_seen": _flag(surface.condensation_seen),
                        "mould_visible": _flag(surface.mould_visible),
                    }
                    if state is not None:
                        cells["surface_rh"] = n(
                            "rh", psychro.surface_rh_pct(state, surface.surface_temp_c)
                        )
                        cells["margin"] = n(
                            "temperature_difference",
                            surface.surface_temp_c - state.condensation_point_c,
                        )
                    yield self.line(cells)
                for material in room_visit.materials:
                    yield self.line(
                        {
                            **here,
                            "kind": "material",
                            "location": self.text(material.location),
                            "material": self.text(material.material),
                            "taken_at": _time(material.taken_at),
                            "instrument": self.text(material.instrument or ""),
                            "moisture_value": n("moisture", material.value),
                            "moisture_scale": self.text(material.scale),
                            "moisture_method": self.text(material.method or ""),
                            "dry_standard": _flag(material.dry_standard),
                        }
                    )
                for equipment in room_visit.equipment:
                    if equipment.outlet is None:
                        continue
                    cells = {
                        **here,
                        "kind": "dehumidifier_outlet",
                        "location": self.text(equipment.label or equipment.kind),
                        **self.air_reading(equipment.outlet, pressure),
                    }
                    if state is not None:
                        outlet = psychro.vapour_state(
                            equipment.outlet.dry_bulb_c, equipment.outlet.rh_pct, pressure
                        )
                        cells["humidity_ratio_drop"] = n(
                            "humidity_ratio",
                            state.humidity_ratio_kg_per_kg - outlet.humidity_ratio_kg_per_kg,
                        )
                    yield self.line(cells)

    def log_blocks(self, log: LogSeries, pressure_pa: float) -> Iterator[tuple[str, int]]:
        """Every sample of ``log``, as blocks of lines; the cells that do not change are made
        once, and the air cells once per distinct reading."""
        room = self.rooms.get(log.room) if log.room is not None else None
        fixed = {
            **self.room_cells(room),
            "kind": "logger" if room else "outdoor_logger",
            "location": self.text(log.source),
        }
        row = self.row(fixed)
        # taken_at, instrument and the air cells are consecutive columns: the rest is fixed.
        taken, last_air = _INDEX["taken_at"], _INDEX["absolute_humidity"]
        head = ",".join(row[:taken]) + ","
        middle = "," + self.text(log.instrument or "") + ","
        tail = "," * (len(_ROLES) - last_air - 1) + "\r\n"
        cells = self.air.joined
        cache: dict[tuple[float, float], str] = {}
        samples = log.samples
        for first in range(0, len(samples), _BLOCK_ROWS):
            block = samples[first : first + _BLOCK_ROWS]
            if len(cache) > _CACHE_LIMIT:
                cache.clear()
            lines = []
            for sample, when in zip(block, _times([sample.at for sample in block]), strict=False):
                key = (sample.dry_bulb_c, sample.rh_pct)
                air = cache.get(key)
                if air is None:
                    air = cache[key] = cells(sample.dry_bulb_c, sample.rh_pct, pressure_pa)
                lines.append(f"{head}{when}{middle}{air}{tail}")
            yield "".join(lines), len(block)

    def blocks(self, include_logs: bool) -> Iterator[tuple[str, int]]:
        from survey.model import pressure_pa_for

        visit_lines = list(self.visit_lines())
        yield "".join(visit_lines), len(visit_lines)
        if include_logs:
            pressure = pressure_pa_for(self.survey)
            for log in self.survey.logs:
                yield from self.log_blocks(log, pressure)


#: Logger samples turned into text at a time.
_BLOCK_ROWS = 4096


def csv_blocks(
    survey: Survey,
    system: UnitSystem | None = None,
    include_logs: bool = True,
    *,
    for_terminal: bool = False,
) -> Iterator[tuple[str, int]]:
    """The CSV as blocks of whole lines (each line ending in CR LF) with the number of rows
    in each, the header (0 rows) first; made as they are consumed, so a large survey is never
    held as text. See :func:`write_csv` for ``for_terminal``."""
    chosen: UnitSystem = system or survey.site.unit_system
    _check_system(chosen)
    yield ",".join(column_names(chosen)) + "\r\n", 0
    yield from _Rows(survey, chosen, for_terminal).blocks(include_logs)


def write_csv(
    survey: Survey,
    out: TextIO,
    system: UnitSystem | None = None,
    include_logs: bool = True,
    *,
    for_terminal: bool = False,
) -> int:
    """Write the survey's readings as CSV to the text stream ``out``; return the row count
    (the header not counted).

    Text from the survey is made spreadsheet-safe and never carries a NUL byte. With
    ``for_terminal`` every control character in it is written as a visible escape
    (``\\x1b``), for CSV shown on a terminal rather than saved."""
    count = 0
    for text, rows in csv_blocks(survey, system, include_logs, for_terminal=for_terminal):
        out.write(text)
        count += rows
    return count


# --- writing a file ----------------------------------------------------------------------


def save_csv(
    survey: Survey,
    path: str | os.PathLike[str],
    system: UnitSystem | None = None,
    include_logs: bool = True,
) -> int:
    """Write the CSV to ``path`` the way survey files are saved, streaming; return the row
    count.

    UTF-8 with a byte-order mark, so that spreadsheet programs read names correctly. The
    blocks go through :func:`survey.store.write_file_atomically` as they are made (a
    temporary file in the same folder, fsynced, renamed over ``path``): a crash leaves the
    old file or the new one. Raises :class:`~survey.errors.SurveyFileError` ("not written:
    …") on any failure.
    """
    from survey import store

    count = 0

    def chunks() -> Iterator[bytes]:
        nonlocal count
        yield "\ufeff".encode()
        for text, rows in csv_blocks(survey, system, include_logs):
            count += rows
            yield text.encode("utf-8")

    store.write_file_atomically(path, chunks())
    return count
