"""Reading a data logger's CSV export: time, air temperature and relative humidity.

Loggers write CSV in many layouts; the reader finds its columns by what the header says,
not by where one maker puts them:

* the header may follow title, serial-number or settings lines (it is looked for in the
  first :data:`HEADER_SEARCH_LINES` lines); other columns (row number, dew point, battery …)
  are ignored, in any order;
* commas, semicolons or tabs; decimal commas (``21,5``) and minus signs (``−3``); UTF-8
  (with or without a byte-order mark), UTF-16 or Windows-1252 text;
* the time: one column whose name says date or time (in English and a few other languages),
  or a date column and a clock column side by side;
* the temperature: the column whose name says temperature or only carries a temperature
  unit, never a dew point, wet bulb or surface; its unit (°C, C, degC, Celsius, °F, F, degF,
  Fahrenheit) from the name or a row of units under the header; °F is converted with
  t_C = (t_F − 32) × 5/9, the definition of the scale. Without a unit the caller must state
  it; a unit stated against the header's wins, and the notes say so;
* RH: the column whose name says relative humidity, humidity or RH, never a dew point or an
  absolute or specific humidity. When every value is at most 1 they are fractions, × 100
  (the notes say so); a few values below 1 % among percentages are skipped as fractions;
* times in ISO 8601 (with or without a UTC offset), day or month first with slashes, dots
  or dashes (``15/01/2025 10:00``, ``15.01.2025``, ``01/15/2025 10:00:00 AM``), two-digit
  years, AM/PM, or with the month as a word (``15 Jan 2025 10:00``, ``Jan 15, 2025``).
  Whether ``03/04/2025`` is day or month first is settled by any day above 12, counting only
  dates real in one of the orders (``13/15/2025`` is skipped, not taken as evidence); if no
  date settles it, or dates contradict each other, the caller must say. Times with and
  without a UTC offset are not mixed: the kind most rows have is kept.

Every data row that cannot be used is reported with its line number and the reason (empty
value, not a number, out of the reading range, a repeated time, no time, a line far too
long to be a logger row); nothing is silently dropped. Whatever the bytes, the reader
returns a result or raises :class:`~survey.errors.InputError` — for what the caller asked
for and for a file that cannot be used at all — and nothing else. The error names the
quantity (:data:`FILE_FIELD`, :data:`UNIT_FIELD`, :data:`ORDER_FIELD`), never an option of
one face.
"""

from __future__ import annotations

import csv
import datetime as dt
import hashlib
import io
import itertools
import math
import re
from dataclasses import dataclass, field
from typing import Literal

from survey.errors import InputError
from survey.logtime import (
    _ORDER_WORDS,
    DateOrder,
    _clean,
    _date_fields,
    _detect_date_order,
    _orders_possible,
    _parse_time,
)
from survey.model import LogSample
from survey.psychro import DRY_BULB_MAX_C, DRY_BULB_MIN_C, RH_MIN_PCT

TempUnit = Literal["c", "f"]

#: The quantities an :class:`InputError` from :func:`read_logger_csv` names.
FILE_FIELD = "logger file"
UNIT_FIELD = "temperature unit"
ORDER_FIELD = "date order"

#: How far into the file the column header is looked for.
HEADER_SEARCH_LINES = 40
_DELIMITERS = (",", ";", "\t")


@dataclass(frozen=True)
class SkippedRow:
    """A data row that was not imported: its line number in the file and why."""

    line: int
    reason: str


@dataclass
class LoggerData:
    """What was read from a logger file."""

    samples: list[LogSample]
    skipped: list[SkippedRow]
    time_columns: tuple[str, ...]
    temperature_column: str
    rh_column: str
    temperature_unit: TempUnit
    #: Where the unit came from: "header", "units row" (agreeing with the stated unit if
    #: one was given) or "stated" (the caller's unit alone, or against the header: see
    #: ``notes``).
    unit_source: str
    date_order: DateOrder | None
    delimiter: str
    encoding: str
    header_line: int
    sha256: str
    reordered: bool = False  #: rows were not in time order and have been sorted
    rh_as_fraction: bool = False  #: every RH was at most 1, read as a fraction × 100
    #: Things the person importing should know (a unit given against the header's, RH read
    #: as fractions), one sentence each.
    notes: list[str] = field(default_factory=list)

    @property
    def interval(self) -> dt.timedelta | None:
        """The most common step between samples."""
        if len(self.samples) < 2:
            return None
        steps: dict[dt.timedelta, int] = {}
        for a, b in zip(self.samples, self.samples[1:], strict=False):
            step = b.at - a.at
            steps[step] = steps.get(step, 0) + 1
        return max(steps, key=steps.__getitem__)


# --- text and header ---------------------------------------------------------------------


def _decode_text(data: bytes) -> tuple[str, str]:
    if data.startswith((b"\xff\xfe", b"\xfe\xff")):
        return data.decode("utf-16", errors="replace"), "UTF-16"
    if data.startswith(b"\xef\xbb\xbf"):
        return data[3:].decode("utf-8", errors="replace"), "UTF-8"
    try:
        return data.decode("utf-8"), "UTF-8"
    except UnicodeDecodeError:
        return data.decode("cp1252", errors="replace"), "Windows-1252"


def _norm(cell: str) -> str:
    text = cell.strip().strip('"').strip().lower().replace("º", "°")
    return re.sub(r"\s+", " ", text)


def _is_time(name: str) -> bool:
    return (
        bool(
            re.search(r"\b(date|time|timestamp|datetime|zeit|datum|heure|fecha)\b", name)
            or name.startswith(("date", "time"))
        )
        and not _is_rh(name)
        and "temp" not in name
    )


def _is_date_only(name: str) -> bool:
    return bool(re.search(r"\b(date|datum|fecha)\b", name)) and "time" not in name


def _is_time_only(name: str) -> bool:
    return bool(re.search(r"\btime\b|\bzeit\b|\bheure\b", name)) and "date" not in name


def _temperature_rank(name: str, surface: bool = False) -> int | None:
    """0 for a name that says temperature, 1 for one that only carries a temperature unit
    ("Sensor 2 (°C)", "degF"), ``None`` for any other (a dew point, a surface …). For a
    logger on a surface (``surface``) a surface temperature comes first (−1)."""
    if surface and "surface" in name and re.search(r"temp|°\s*[cf]\b|\bdeg\s?[cf]\b", name):
        return -1
    if any(word in name for word in ("dew", "wet bulb", "wetbulb", "surface", "heat index")):
        return None
    if re.search(r"temp|celsius|fahrenheit|^t\b|^t\s*[\(\[]|^air\b", name):
        return 0
    if re.search(r"°\s*[cf]\b|\bdeg\s?[cf]\b", name) and not _is_rh(name):
        return 1
    return None


def _is_rh(name: str) -> bool:
    if any(word in name for word in ("dew", "abs", "g/m", "specific")):
        return False
    return bool(re.search(r"\brh\b|%\s*rh|humid|feuchte|hum\b|r\.h\.|rel\.? ?hum", name))


_F_UNIT = re.compile(r"°\s*f\b|\bdeg\s?f\b|fahrenheit|[\(\[,]\s*f\s*[\)\]]?\s*$|\bf$|^f$")
_C_UNIT = re.compile(r"°\s*c\b|\bdeg\s?c\b|celsius|[\(\[,]\s*c\s*[\)\]]?\s*$|\bc$|^c$")


def _unit_in(text: str) -> TempUnit | None:
    text = _norm(text)
    is_f, is_c = bool(_F_UNIT.search(text)), bool(_C_UNIT.search(text))
    if is_f and not is_c:
        return "f"
    if is_c and not is_f:
        return "c"
    return None


@dataclass
class _Layout:
    delimiter: str
    header_index: int  # index into the rows list
    time_cols: tuple[int, ...]
    temp_col: int
    rh_col: int
    names: list[str]


def _find_layout(text: str, surface: bool = False) -> tuple[_Layout, list[list[str]]] | None:
    """The header's layout and every row, for the separator whose header comes first.

    Raises :class:`_CsvProblem` when no separator finds a header and some could not read
    the file as CSV at all."""
    best = None
    problem: _CsvProblem | None = None
    for delimiter in _DELIMITERS:
        try:
            rows = _parse_rows(text, delimiter)
        except _CsvProblem as exc:
            problem = problem or exc
            continue
        for index, row in enumerate(rows[:HEADER_SEARCH_LINES]):
            names = [_norm(cell) for cell in row]
            if len(names) < 3:
                continue
            ranks = {i: _temperature_rank(n, surface) for i, n in enumerate(names)}
            temp = sorted(
                (i for i, rank in ranks.items() if rank is not None), key=lambda i: (ranks[i], i)
            )
            rh = [i for i, n in enumerate(names) if _is_rh(n)]
            times = [i for i, n in enumerate(names) if _is_time(n) and i not in temp + rh]
            if not (temp and rh and times):
                continue
            dates = [i for i in times if _is_date_only(names[i])]
            clocks = [i for i in times if _is_time_only(names[i])]
            if dates and clocks and len(times) >= 2:
                time_cols: tuple[int, ...] = (dates[0], clocks[0])
            else:
                time_cols = (times[0],)
            layout = _Layout(delimiter, index, time_cols, temp[0], rh[0], row)
            if best is None or index < best[0].header_index:
                best = (layout, rows)
            break
    if best is None and problem is not None:
        raise problem
    return best


# --- values ------------------------------------------------------------------------------


def _parse_number(text: str) -> float | None:
    text = _clean(text).replace("\u2212", "-").replace(" ", "")
    if text.count(",") == 1 and "." not in text:
        text = text.replace(",", ".")
    try:
        value = float(text)
    except ValueError:
        return None
    return value if math.isfinite(value) else None


def _show(text: str) -> str:
    text = _clean(text)
    return repr(text if len(text) <= 30 else text[:27] + "...")


#: A physical line longer than this is no logger row (a logger's row is well under 200
#: characters); it is set aside before the CSV is parsed, which also keeps every field under
#: the csv module's own limit of 131 072 characters.
MAX_LINE_CHARS = 10_000


def _set_aside_long_lines(text: str) -> tuple[str, list[tuple[int, int]]]:
    """``text`` with over-long lines emptied (line numbers kept), and ``(line, length)``
    of each."""
    if len(text) <= MAX_LINE_CHARS:
        return text, []
    lines = text.split("\n")
    long_lines = []
    for index, line in enumerate(lines):
        if len(line) > MAX_LINE_CHARS:
            long_lines.append((index + 1, len(line)))
            lines[index] = ""
    return ("\n".join(lines), long_lines) if long_lines else (text, [])


class _CsvProblem(Exception):
    def __init__(self, line: int, detail: str) -> None:
        super().__init__(detail)
        self.line = line
        self.detail = detail


def _parse_rows(text: str, delimiter: str) -> list[list[str]]:
    reader = csv.reader(io.StringIO(text), delimiter=delimiter)
    try:
        return list(reader)
    except csv.Error as exc:
        raise _CsvProblem(reader.line_num, str(exc)) from None


@dataclass
class _Candidate:
    line: int
    when: dt.datetime
    t_c: float
    t_shown: str
    rh: float


# --- the reader --------------------------------------------------------------------------


def read_logger_csv(
    data: bytes,
    *,
    temp_unit: TempUnit | None = None,
    date_order: DateOrder | None = None,
    surface: bool = False,
) -> LoggerData:
    """Read a logger's CSV export (the file's bytes) into samples and skipped rows.

    ``temp_unit`` ("c" or "f") is needed when the header does not state the unit and
    overrides it when it does (the result's notes say so); ``date_order`` is needed when
    the dates are ambiguous; ``surface`` says the logger sat on a surface, so a column of
    surface temperature is its temperature (and is preferred to any other). Raises
    :class:`~survey.errors.InputError` (field
    :data:`FILE_FIELD`, :data:`UNIT_FIELD` or :data:`ORDER_FIELD`: the quantity, which a
    face re-labels with its own option name) when the file cannot be read as CSV, no usable
    header is found, the unit or date order is unknown, or no row at all can be used.
    Nothing else escapes, whatever the bytes.
    """
    if temp_unit not in (None, "c", "f"):
        raise InputError(UNIT_FIELD, temp_unit, "c (°C) or f (°F)")
    if date_order not in (None, "dmy", "mdy", "ymd"):
        raise InputError(ORDER_FIELD, date_order, "dmy, mdy or ymd")
    digest = hashlib.sha256(data).hexdigest()
    text, encoding = _decode_text(data)
    # CR LF and a lone CR (old Mac exports) end lines as LF does.
    text = text.replace("\r\n", "\n").replace("\r", "\n")
    text, long_lines = _set_aside_long_lines(text)
    try:
        found = _find_layout(text, surface)
    except _CsvProblem as exc:
        raise InputError(
            FILE_FIELD, f"(line {exc.line})", f"cannot be read as CSV: {exc.detail}"
        ) from None
    if found is None:
        first = next((line for line in text.splitlines() if line.strip()), "")
        raise InputError(
            FILE_FIELD,
            _show(first) if first else "(empty file)",
            "no header row with a time, a temperature and a relative-humidity column was found "
            f"in the first {HEADER_SEARCH_LINES} lines (e.g. 'Time,Temperature (°C),RH (%)')",
        )
    layout, rows = found
    names = layout.names
    data_rows = rows[layout.header_index + 1 :]
    first_line = _line_numbers(text, layout.delimiter)
    notes: list[str] = []
    header_unit = _unit_in(names[layout.temp_col])
    unit_row = False
    if data_rows and len(data_rows[0]) > layout.temp_col:
        below = data_rows[0][layout.temp_col]
        if _parse_number(below) is None and _unit_in(below) is not None and header_unit is None:
            header_unit = _unit_in(below)
            unit_row = True
    where_unit = "units row" if unit_row else "header"
    if temp_unit is None:
        if header_unit is None:
            raise InputError(
                UNIT_FIELD,
                "(not given)",
                f"the temperature column {names[layout.temp_col].strip()!r} does not say its "
                "unit; state it: c (°C) or f (°F)",
            )
        temp_unit, unit_source = header_unit, where_unit
    elif header_unit is None:
        unit_source = "stated"
    elif header_unit == temp_unit:
        unit_source = where_unit
    else:
        unit_source = "stated"
        said, given = ("°F", "°C") if header_unit == "f" else ("°C", "°F")
        notes.append(
            f"The {where_unit} says {said}; {given} was stated: the temperatures "
            f"are read as {given}."
        )
    if unit_row:
        data_rows = data_rows[1:]
    row_offset = layout.header_index + 1 + (1 if unit_row else 0)

    def line_of(n: int) -> int:
        index = row_offset + n
        return first_line[index] if index < len(first_line) else 0

    def time_text(row: list[str]) -> str:
        return " ".join(_clean(row[i]) for i in layout.time_cols if i < len(row))

    order: DateOrder | None = date_order
    if date_order is None:
        detected, examples = _detect_date_order(
            [(line_of(n), time_text(r)) for n, r in enumerate(data_rows) if r]
        )
        if detected == "ambiguous":
            ((line, sample),) = examples
            raise InputError(
                ORDER_FIELD,
                "(not given)",
                f"dates such as {_show(sample)} (line {line}) could be day/month/year or "
                "month/day/year and no day above 12 settles it; state the order: dmy "
                "(day/month/year) or mdy (month/day/year)",
            )
        if detected == "conflict":
            (dmy_line, dmy_text), (mdy_line, mdy_text) = examples
            raise InputError(
                ORDER_FIELD,
                "(not given)",
                f"the dates contradict each other: {_show(dmy_text)} (line {dmy_line}) is "
                f"only possible as day/month/year, {_show(mdy_text)} (line {mdy_line}) only "
                "as month/day/year; state the order: dmy (day/month/year) or mdy "
                "(month/day/year)",
            )
        if detected in ("dmy", "mdy"):
            order = detected

    skipped: list[SkippedRow] = [
        SkippedRow(line, f"the line is {length} characters long, longer than any logger row")
        for line, length in long_lines
        if line > first_line[layout.header_index]
    ]
    candidates: list[_Candidate] = []
    need = max(layout.temp_col, layout.rh_col, *layout.time_cols) + 1
    for n, row in enumerate(data_rows):
        line = line_of(n)
        if not any(cell.strip() for cell in row):
            continue  # blank line
        if len(row) < need:
            skipped.append(SkippedRow(line, f"only {len(row)} columns, {need} needed"))
            continue
        when_text = time_text(row)
        if not when_text.strip():
            skipped.append(SkippedRow(line, "no time given"))
            continue
        when, why = _parse_time_or_reason(when_text, order)
        if when is None:
            skipped.append(SkippedRow(line, why))
            continue
        raw_t, raw_rh = row[layout.temp_col], row[layout.rh_col]
        if not _clean(raw_t):
            skipped.append(SkippedRow(line, "temperature is empty"))
            continue
        if not _clean(raw_rh):
            skipped.append(SkippedRow(line, "RH is empty"))
            continue
        t = _parse_number(raw_t)
        if t is None:
            skipped.append(SkippedRow(line, f"temperature {_show(raw_t)} is not a number"))
            continue
        rh = _parse_number(raw_rh.replace("%", ""))
        if rh is None:
            skipped.append(SkippedRow(line, f"RH {_show(raw_rh)} is not a number"))
            continue
        t_c = (t - 32.0) * 5.0 / 9.0 if temp_unit == "f" else t
        unit = "°F" if temp_unit == "f" else "°C"
        candidates.append(_Candidate(line, when, round(t_c, 4), f"{t:g} {unit}", rh))

    # RH written as fractions (0.65 for 65 %): all of them, or a few rows among percentages.
    as_fraction = bool(candidates) and all(c.rh <= 1.0 for c in candidates)
    if as_fraction:
        notes.append(
            "Every RH value is at most 1: they were read as fractions and "
            "multiplied by 100 (0.65 → 65 %)."
        )
    # Times with and without a UTC offset cannot be put in one order: the kind most rows
    # have wins and the others are skipped.
    aware = sum(c.when.utcoffset() is not None for c in candidates)
    keep_aware = aware * 2 > len(candidates)

    samples: list[LogSample] = []
    seen: dict[dt.datetime, int] = {}
    for c in candidates:
        rh = round(c.rh * 100.0, 6) if as_fraction else c.rh
        offset = c.when.utcoffset()
        if (offset is not None) != keep_aware:
            skipped.append(
                SkippedRow(
                    c.line,
                    (
                        "the time has no UTC offset, unlike most rows"
                        if offset is None
                        else "the time carries a UTC offset, unlike most rows"
                    ),
                )
            )
            continue
        if offset is not None and offset % dt.timedelta(minutes=1):
            skipped.append(
                SkippedRow(c.line, "the time's UTC offset is not a whole number of minutes")
            )
            continue
        if not DRY_BULB_MIN_C <= c.t_c <= DRY_BULB_MAX_C:
            skipped.append(
                SkippedRow(
                    c.line,
                    f"temperature {c.t_shown} is outside {DRY_BULB_MIN_C:g}…{DRY_BULB_MAX_C:g} °C",
                )
            )
            continue
        if 0.0 < rh < 1.0 and not as_fraction:
            skipped.append(
                SkippedRow(
                    c.line, f"RH {rh:g}: RH below 1 % looks like a fraction (other rows are in %)"
                )
            )
            continue
        if not RH_MIN_PCT <= rh <= 100.0:
            skipped.append(
                SkippedRow(c.line, f"RH {rh:g} % is outside the range {RH_MIN_PCT:g} to 100 %")
            )
            continue
        if c.when in seen:
            skipped.append(SkippedRow(c.line, f"same time as line {seen[c.when]}"))
            continue
        seen[c.when] = c.line
        samples.append(LogSample(at=c.when, dry_bulb_c=c.t_c, rh_pct=rh))
    skipped.sort(key=lambda row: row.line)
    if not samples:
        reasons = "; ".join(f"line {s.line}: {s.reason}" for s in skipped[:3])
        raise InputError(
            FILE_FIELD,
            f"({len(data_rows)} data rows)",
            "no row could be imported" + (f" ({reasons})" if reasons else ""),
        )
    reordered = any(b.at < a.at for a, b in itertools.pairwise(samples))
    if reordered:
        samples.sort(key=lambda s: s.at)
    return LoggerData(
        samples=samples,
        skipped=skipped,
        time_columns=tuple(names[i].strip() for i in layout.time_cols),
        temperature_column=names[layout.temp_col].strip(),
        rh_column=names[layout.rh_col].strip(),
        temperature_unit=temp_unit,
        unit_source=unit_source,
        date_order=order,
        delimiter=layout.delimiter,
        encoding=encoding,
        header_line=first_line[layout.header_index],
        sha256=digest,
        reordered=reordered,
        rh_as_fraction=as_fraction,
        notes=notes,
    )


def _parse_time_or_reason(text: str, order: DateOrder | None) -> tuple[dt.datetime | None, str]:
    """The time in ``text``, or ``None`` and why it is not one."""
    when = _parse_time(text, order)
    if when is not None:
        return when, ""
    m = _date_fields(_clean(text))
    if m is not None and len(m["a"]) != 4:
        if order is None and not _orders_possible(m):
            return None, (
                f"time {_show(text)} is not a real date as day/month/year nor as month/day/year"
            )
        if order is not None:
            return None, f"time {_show(text)} is not a real date read as {_ORDER_WORDS[order]}"
    return None, f"time {_show(text)} is not a date and time"


def _line_numbers(text: str, delimiter: str) -> list[int]:
    """The 1-based line on which each CSV record starts (quoted fields may span lines)."""
    starts = []
    reader = csv.reader(io.StringIO(text), delimiter=delimiter)
    line = 1
    try:
        for _row in reader:
            starts.append(line)
            line = reader.line_num + 1
    except csv.Error:  # the rows were read with the same reader settings: cannot happen
        pass
    return starts
