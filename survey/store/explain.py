"""Located errors: what is wrong with a document, where, in plain words.

msgspec reports a failed decode as a terse message with a JSON path (``Expected `float` <=
70.0 - at `$.visits[0].rooms[1].air.dry_bulb_c```). :func:`explain_validation_error` turns it
into ``(where, problem)``: the place as ``visits[0].rooms[1].air.dry_bulb_c`` and the problem
as a sentence naming the value found and what is allowed, with the unit taken from the field
name's suffix ("71 is out of range; allowed: between -50 and 70 °C"). :func:`check_record`
does the same for a record built in memory (a reading typed into a form) and raises
:class:`~survey.errors.InputError`; :func:`new_survey` builds a checked empty survey.

Every value or key quoted from the document is made visible and shortened
(:mod:`survey.safe_text`), so a 1 MB key or a value holding terminal escapes gives a short,
safe line.
"""

from __future__ import annotations

import datetime as dt
import re
from typing import Any

import msgspec
import msgspec.inspect as mi

from survey import model
from survey.errors import InputError
from survey.safe_text import shorten

#: Returned by :func:`value_at` when the document has no value at that place.
MISSING: Any = object()

#: A key of the document quoted in a place (``where``) is cut to this many characters.
KEY_MAX_CHARS = 40
#: A text value quoted in a problem is cut to this many characters.
TEXT_MAX_CHARS = 60
#: Text longer than this is not compared with the allowed names for a "did you mean".
_SUGGEST_MAX_CHARS = 64

_AT = re.compile(r"^(?P<message>.*?)(?: - at `\$(?P<path>[^`]*)`)?$", re.S)
_TOKEN = re.compile(r"\.([^.\[\]]+)|\[(\d+)\]")
_TYPE_WORDS = {
    "float": "a number",
    "int": "a whole number",
    "str": "text",
    "bool": "true or false",
    "array": "a list",
    "object": "an object ({...})",
    "null": "null",
    "datetime": "a date and time",
    "date": "a date",
    "bytes": "bytes",
}
_UNIT_SUFFIXES = (
    ("_l_per_day", " L/day"),
    ("_m3", " m³"),
    ("_m2", " m²"),
    ("_pct", " %"),
    ("_pa", " Pa"),
    ("_c", " °C"),
    ("_k", " K"),
    ("_m", " m"),
    ("_l", " L"),
)
_DATETIME_FORM = "2025-01-14T09:30:00 (ISO 8601; an offset such as +01:00 may follow)"


def tokens_of(where: str) -> list[str | int]:
    """``visits[0].rooms[1].air`` as ``["visits", 0, "rooms", 1, "air"]``."""
    return [
        name if name else int(index)
        for name, index in _TOKEN.findall("." + where if where and where[0] != "[" else where)
    ]


def where_of(tokens: list[str | int]) -> str:
    """The place of ``tokens`` in a document as text; keys are shortened and made visible."""
    text = ""
    for token in tokens:
        if isinstance(token, int):
            text += f"[{token}]"
        else:
            name = shorten(token, KEY_MAX_CHARS)
            text += f".{name}" if text else name
    return text


def quote(text: str, limit: int = TEXT_MAX_CHARS) -> str:
    """``text`` in single quotes for a message: made visible and cut with an ellipsis."""
    return f"'{shorten(text, limit)}'"


def show(value: Any) -> str:
    """A value from a document as a message quotes it: short, and in JSON's words."""
    if isinstance(value, str):
        return quote(value)
    if isinstance(value, bool) or value is None:
        return "true" if value is True else "false" if value is False else "null"
    if isinstance(value, (int, float)):
        text = repr(value)
        return text if len(text) <= 30 else text[:27] + "..."
    if isinstance(value, list):
        return f"a list of {len(value)}"
    if isinstance(value, dict):
        return "an object"
    return type(value).__name__


def _unwrap(info: Any) -> Any:
    while True:
        if isinstance(info, mi.Metadata):
            info = info.type
        elif isinstance(info, mi.UnionType):
            kinds = [t for t in info.types if not isinstance(t, mi.NoneType)]
            if len(kinds) != 1:
                return info
            info = kinds[0]
        else:
            return info


_INFO_CACHE: dict[type, Any] = {}


def _struct_info(cls: type) -> Any:
    cached = _INFO_CACHE.get(cls)
    if cached is None:
        cached = _INFO_CACHE[cls] = mi.type_info(cls)
    return cached


def _type_at(root: type, tokens: list[str | int]) -> Any:
    """The msgspec type info of the value at ``tokens`` inside a ``root`` document."""
    info: Any = _struct_info(root)
    for token in tokens:
        info = _unwrap(info)
        if isinstance(token, int):
            if isinstance(info, mi.ListType):
                info = info.item_type
            elif isinstance(info, mi.StructType) and info.array_like and token < len(info.fields):
                info = info.fields[token].type
            else:
                return None
        elif isinstance(info, mi.StructType):
            for fld in info.fields:
                if fld.encode_name == token:
                    info = fld.type
                    break
            else:
                return None
        else:
            return None
    return info


def value_at(data: bytes | Any, where: str, default: Any = MISSING) -> Any:
    """The value at ``where`` in a document (JSON bytes or decoded builtins), else ``default``."""
    if isinstance(data, (bytes, bytearray, memoryview)):
        try:
            data = msgspec.json.decode(data)
        except (msgspec.DecodeError, RecursionError, MemoryError):
            return default
    node = data
    for token in tokens_of(where):
        try:
            node = node[token]
        except (KeyError, IndexError, TypeError):
            return default
    return node


def _unit_for(root: type, tokens: list[str | int]) -> str:
    name = next((t for t in reversed(tokens) if isinstance(t, str)), "")
    if tokens and isinstance(tokens[-1], int):  # an item of a record stored as a list
        parent = _unwrap(_type_at(root, tokens[:-1]))
        if isinstance(parent, mi.StructType) and parent.array_like:
            name = parent.fields[tokens[-1]].name
    for suffix, unit in _UNIT_SUFFIXES:
        if name.endswith(suffix):
            return unit
    return ""


def _number(value: float) -> str:
    return f"{value:g}"


def _range_text(info: Any, unit: str) -> str:
    low = (
        f"above {_number(info.gt)}"
        if info.gt is not None
        else f"at least {_number(info.ge)}"
        if info.ge is not None
        else ""
    )
    high = (
        f"below {_number(info.lt)}"
        if info.lt is not None
        else f"at most {_number(info.le)}"
        if info.le is not None
        else ""
    )
    if info.ge is not None and info.le is not None:
        return f"between {_number(info.ge)} and {_number(info.le)}{unit}"
    return " and ".join(part for part in (low, high) if part) + unit


def _type_words(spec: str) -> str:
    return " or ".join(_TYPE_WORDS.get(part.strip(), part.strip()) for part in spec.split("|"))


def _field_names(info: Any) -> list[str]:
    info = _unwrap(info)
    if isinstance(info, mi.StructType):
        return [fld.encode_name for fld in info.fields]
    return []


def _close_match(text: str, allowed: list[str]) -> str | None:
    """The allowed name ``text`` was probably meant to be, if any (short text only)."""
    if len(text) > _SUGGEST_MAX_CHARS:
        return None
    import difflib

    close = difflib.get_close_matches(text, allowed, n=1, cutoff=0.6)
    return close[0] if close else None


def _overlong_array_like(doc: Any, info: Any, tokens: list[str | int]) -> Any:
    """Where a record stored as a list has too many items (msgspec gives no path for it)."""
    info = _unwrap(info)
    if isinstance(info, mi.StructType):
        if info.array_like:
            if isinstance(doc, list) and len(doc) > len(info.fields):
                return where_of(tokens), info, len(doc)
            return None
        if isinstance(doc, dict):
            for fld in info.fields:
                if fld.encode_name in doc:
                    found = _overlong_array_like(
                        doc[fld.encode_name], fld.type, [*tokens, fld.encode_name]
                    )
                    if found is not None:
                        return found
    elif isinstance(info, mi.ListType) and isinstance(doc, list):
        for i, item in enumerate(doc):
            found = _overlong_array_like(item, info.item_type, [*tokens, i])
            if found is not None:
                return found
    return None


def explain_validation_error(
    exc: msgspec.ValidationError, root: type, data: bytes | Any
) -> tuple[str, str]:
    """``(where, problem)`` in plain words for a msgspec error decoding ``data`` as ``root``."""
    match = _AT.match(str(exc))
    message = match.group("message") if match else str(exc)
    tokens = tokens_of((match.group("path") or "").lstrip(".") if match else "")
    info = _unwrap(_type_at(root, tokens))
    unit = _unit_for(root, tokens)

    m = re.fullmatch(r"Object contains unknown field `(.*)`", message, re.S)
    if m:
        name = m.group(1)
        allowed = _field_names(info)
        prefixed = [a for a in allowed if a.startswith(name + "_")]
        close = prefixed[0] if prefixed else _close_match(name, allowed)
        hint = (
            f"; did you mean '{close}'?"
            if close
            else f"; allowed here: {', '.join(allowed)}"
            if allowed
            else ""
        )
        return where_of([*tokens, name]), f"unknown field {quote(name, KEY_MAX_CHARS)}{hint}"
    m = re.fullmatch(r"Object missing required field `(.*)`", message)
    if m:
        return where_of([*tokens, m.group(1)]), f"the required field '{m.group(1)}' is missing"
    where = where_of(tokens)
    value = value_at(data, where)
    shown = show(value) if value is not MISSING else "the value"
    m = re.fullmatch(r"Expected `(?:float|int)` (?:<=|>=|<|>) \S+", message)
    if m and isinstance(info, (mi.FloatType, mi.IntType)):
        if info.ge is not None and info.ge == info.le:  # one value allowed, e.g. a version
            name = next((t for t in reversed(tokens) if isinstance(t, str)), "the value")
            return where, f"{name} must be {_number(info.ge)}{unit}, not {shown}"
        return where, f"{shown} is out of range; allowed: {_range_text(info, unit)}"
    if message == "Number out of range":
        return where, "the number is too large to be read"
    m = re.fullmatch(r"Expected `(.*?)`, got `(.*?)`", message)
    if m:
        expected, got = _type_words(m.group(1)), _TYPE_WORDS.get(m.group(2), m.group(2))
        found = f"{got} {shown}" if got not in ("a list", "an object ({...})", "null") else got
        return where, f"expected {expected}, found {found}"
    m = re.fullmatch(r"Invalid enum value (.*)", message, re.S)
    if m and isinstance(info, mi.LiteralType):
        choices = [str(v) for v in info.values]
        close = _close_match(str(value), choices)
        hint = f" (did you mean '{close}'?)" if close else ""
        return where, f"{shown} is not allowed{hint}; choose one of: {', '.join(choices)}"
    m = re.fullmatch(r"Expected `str` of length (<=|>=) (\d+)", message)
    if m:
        if m.group(1) == ">=":
            return where, "must not be empty"
        length = len(value) if isinstance(value, str) else "too many"
        return where, f"text too long ({length} characters; at most {m.group(2)})"
    if message.startswith("Expected `str` matching regex"):
        if tokens and tokens[-1] in ("id", "room", "instrument"):
            return where, (
                f"{shown} is not a valid id: use letters, digits, '-', '_' or '.', "
                "starting with a letter or digit, up to 40 characters"
            )
        if tokens and tokens[-1] == "source_sha256":
            return where, f"{shown} is not a SHA-256 digest (64 lowercase hex digits)"
        if len(tokens) >= 2 and tokens[-2] == "photos" and isinstance(value, str):
            problem = model.photo_name_problem(value)
            if problem:
                return where, f"photo file name {shown} {problem}"
        return where, f"{shown} contains characters that are not allowed (control characters)"
    if message == "Invalid RFC3339 encoded datetime":
        return where, f"{shown} is not a date and time; write it as {_DATETIME_FORM}"
    if message == "Invalid RFC3339 encoded date":
        return where, f"{shown} is not a date; write it as 2025-01-14"
    m = re.fullmatch(r"Expected `array` of (?:at least|at most) length (\d+), got (\d+)", message)
    if m and isinstance(info, mi.StructType) and info.array_like:
        names = ", ".join(fld.name for fld in info.fields)
        return where, f"expected a list of {m.group(1)} items [{names}], found {m.group(2)}"
    if message.startswith("Expected `array` of at most length") and not tokens:
        found = _overlong_array_like(value_at(data, ""), _struct_info(root), [])
        if found is not None:
            where, info, count = found
            names = ", ".join(fld.name for fld in info.fields)
            return where, (f"expected a list of {len(info.fields)} items [{names}], found {count}")
    if not message:
        return where, "invalid value"
    return where, shorten(message[0].lower() + message[1:], 200)


# --- records built in memory -------------------------------------------------------------


def check_record(record: msgspec.Struct, field_name: str = "") -> None:
    """Check a record's types and ranges (which constructing a Struct does not do).

    Raises :class:`~survey.errors.InputError` naming the field (``field_name`` plus the
    path inside the record), the value and what is allowed. For a
    :class:`~survey.model.Survey` the cross-record :func:`~survey.model.problems` are
    checked too.
    """
    data = msgspec.json.encode(record)
    try:
        msgspec.json.decode(data, type=type(record))
    except msgspec.ValidationError as exc:
        where, problem = explain_validation_error(exc, type(record), data)
        value = value_at(data, where)
        name = ".".join(part for part in (field_name, where) if part) or type(record).__name__
        raise InputError(name, "" if value is MISSING else value, problem) from None
    if isinstance(record, model.Survey):
        for where, problem in model.problems(record):
            name = ".".join(part for part in (field_name, where) if part)
            raise InputError(name, value_at(data, where, default=""), problem)


def new_survey(reference: str, **site_fields: object) -> model.Survey:
    """A valid empty survey for the site ``reference`` (created now, local time).

    Raises :class:`~survey.errors.InputError` naming the site field (``site.purpose``) when
    a value is not allowed.
    """
    site = model.Site(reference=reference, **site_fields)  # type: ignore[arg-type]
    survey = model.Survey(site=site, created_at=dt.datetime.now().replace(microsecond=0))
    check_record(survey)
    return survey
