"""Logger times as people's software writes them: ISO 8601 with or without an offset, day or
month first with slashes, dots or dashes, two-digit years, AM/PM, a month as a word; and
which of day/month/year or month/day/year a file uses, settled by the dates themselves; and
the time between two such times (:func:`between`).
"""

from __future__ import annotations

import datetime as dt
import re
from typing import Literal

DateOrder = Literal["dmy", "mdy", "ymd"]


def between(start: dt.datetime, end: dt.datetime) -> dt.timedelta:
    """``end - start``; when only one of them has a time zone, both are read as the
    wall-clock times written (a survey may mix them: a logger's times with an offset, the
    visits typed without)."""
    if (start.tzinfo is None) != (end.tzinfo is None):
        start, end = start.replace(tzinfo=None), end.replace(tzinfo=None)
    return end - start


_CLOCK = (
    r"(?:[ T,]+(?P<h>\d{1,2}):(?P<mi>\d{2})(?::(?P<s>\d{2})(?:[.,](?P<frac>\d{1,6}))?)?"
    r"\s*(?P<ampm>[ap]\.?m\.?)?)?$"
)
#: A date with the month as an English word or its abbreviation, month first or day first:
#: ``Jan 15, 2025``, ``January 15 2025``, ``15 Jan 2025``, ``15-Jan-25``.
_YEAR = r"(?P<year>\d{4}|\d{2})"
_NAMED_MONTH = (
    re.compile(
        r"^(?P<month>[a-z]{3,9})\.?[ \-]+(?P<day>\d{1,2}),?[ \-]+" + _YEAR + _CLOCK, re.IGNORECASE
    ),
    re.compile(
        r"^(?P<day>\d{1,2})[ \-./]+(?P<month>[a-z]{3,9})\.?[ \-./,]+" + _YEAR + _CLOCK,
        re.IGNORECASE,
    ),
)
_MONTH_NAMES = (
    "january",
    "february",
    "march",
    "april",
    "may",
    "june",
    "july",
    "august",
    "september",
    "october",
    "november",
    "december",
)
_DATE_TIME = re.compile(
    r"^(?P<a>\d{1,4})[/.\-](?P<b>\d{1,2})[/.\-](?P<c>\d{1,4})" + _CLOCK, re.IGNORECASE
)


def _clean(cell: str) -> str:
    return cell.strip().strip('"').strip()


def _date_fields(text: str) -> re.Match[str] | None:
    return _DATE_TIME.match(_clean(text))


def _build_time(m: re.Match[str], order: DateOrder | None) -> dt.datetime:
    a, b, c = int(m["a"]), int(m["b"]), int(m["c"])
    if len(m["a"]) == 4:
        year, month, day = a, b, c
    elif order == "mdy":
        month, day, year = a, b, c
    elif order == "ymd":
        year, month, day = a, b, c
    else:
        day, month, year = a, b, c
    if year < 100:
        year += 2000
    return dt.datetime(year, month, day, *_clock(m))


def _clock(m: re.Match[str]) -> tuple[int, int, int, int]:
    """Hour, minute, second and microsecond of a matched clock (midnight when absent)."""
    hour = int(m["h"] or 0)
    minute = int(m["mi"] or 0)
    second = int(m["s"] or 0)
    micro = int((m["frac"] or "0").ljust(6, "0")[:6])
    if m["ampm"]:
        if not 1 <= hour <= 12:
            raise ValueError("hour out of range for AM/PM")
        hour = hour % 12 + (12 if m["ampm"][0].lower() == "p" else 0)
    return hour, minute, second, micro


def _named_month_time(m: re.Match[str]) -> dt.datetime | None:
    word, year = m["month"].lower(), int(m["year"])
    month = next((n for n, name in enumerate(_MONTH_NAMES, 1) if name.startswith(word)), None)
    try:
        return dt.datetime(
            year + 2000 if year < 100 else year, month or 0, int(m["day"]), *_clock(m)
        )
    except ValueError:
        return None


def _parse_time(text: str, order: DateOrder | None) -> dt.datetime | None:
    text = _clean(text)
    if not text:
        return None
    m = _date_fields(text)
    if m is not None:
        try:
            return _build_time(m, order)
        except ValueError:
            return None
    named = _NAMED_MONTH[0].match(text) or _NAMED_MONTH[1].match(text)
    if named is not None and len(named["month"]) >= 3:
        return _named_month_time(named)
    try:
        return dt.datetime.fromisoformat(text)
    except ValueError:
        return None


def _orders_possible(m: re.Match[str]) -> set[DateOrder]:
    """The orders in which a short date such as ``03/04/2025`` is a real calendar date."""
    possible: set[DateOrder] = set()
    for order in ("dmy", "mdy"):
        try:
            _build_time(m, order)
        except ValueError:
            continue
        possible.add(order)
    return possible


_ORDER_WORDS = {"dmy": "day/month/year", "mdy": "month/day/year", "ymd": "year/month/day"}


def _detect_date_order(
    values: list[tuple[int, str]],
) -> tuple[DateOrder | Literal["ambiguous", "conflict"] | None, list[tuple[int, str]]]:
    """The date order the rows show, from the rows whose date is possible in some order.

    Returns ``(order, examples)``: ``None`` when every time is year-first (or ISO);
    ``"dmy"``/``"mdy"`` when some row settles it and none contradicts it; ``"ambiguous"``
    when every date could be either (``examples`` holds one); ``"conflict"`` when some dates
    are only possible day first and others only month first (``examples`` holds one of
    each). A date impossible in both orders (``13/15/2025``) is left out; its row is
    skipped later with a reason.
    """
    only: dict[str, tuple[int, str] | None] = {"dmy": None, "mdy": None}
    first_short: tuple[int, str] | None = None
    for line, text in values:
        m = _date_fields(text)
        if m is None or len(m["a"]) == 4:
            continue
        possible = _orders_possible(m)
        if not possible:
            continue
        if first_short is None:
            first_short = (line, text)
        if len(possible) == 1:
            (order,) = possible
            if only[order] is None:
                only[order] = (line, text)
    if first_short is None:
        return None, []
    if only["dmy"] and only["mdy"]:
        return "conflict", [only["dmy"], only["mdy"]]
    if only["dmy"]:
        return "dmy", []
    if only["mdy"]:
        return "mdy", []
    return "ambiguous", [first_short]
