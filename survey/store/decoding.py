"""Survey documents: JSON bytes to a checked :class:`~survey.model.Survey` and back.

:func:`loads_survey` refuses, with one :class:`~survey.errors.SurveyFileError` naming the
place and the problem in plain words:

* what is not a survey at all: empty, UTF-16, binary (NUL bytes, a ZIP, PDF or image),
  a top level that is not an object, no ``schema_version``;
* broken JSON, with its line and column: truncated, a stray character, text after the
  end, invalid UTF-8, half a surrogate pair, nesting too deep to be a survey;
* a ``schema_version`` from a newer program, or given twice;
* a wrong type or an out-of-range value, at its place (``visits[1].rooms[3].air.rh_pct``);
  the wording is :mod:`survey.store.explain`'s;
* a key given twice in one object (``"rh_pct": 72, "rh_pct": 99``): JSON readers keep one
  of the two silently, so such a file has been damaged or badly edited and is refused at
  the place of the second key;
* what spans records (:func:`survey.model.problems`): unique ids, rooms and instruments
  that exist.

Older schema versions are upgraded on the way (:mod:`survey.store.migrations`).

The duplicate-key check is a second parse by the standard library's C JSON scanner with a
hook that only compares each object's key count with its distinct keys and builds nothing:
it takes about as long as ``json.loads`` of the same file (``benchmarks/bench_store.py``
prints both), and logger samples, which cannot hold keys, are cut out before it. Only when it
finds a duplicate does a slower pass work out where.
"""

from __future__ import annotations

import re
from typing import Any, cast

import msgspec

from survey import model
from survey.errors import SurveyFileError
from survey.model import SCHEMA_VERSION, Survey
from survey.safe_text import shorten
from survey.store import migrations

_ENCODER = msgspec.json.Encoder()
_DECODERS: dict[type, msgspec.json.Decoder[Any]] = {}


class _Head(msgspec.Struct):
    """Only the version of a document (every other key is skipped unread)."""

    schema_version: Any = msgspec.UNSET


def _decoder(cls: type) -> msgspec.json.Decoder[Any]:
    """The decoder of ``cls``, built on first use (building the survey's costs a few ms)."""
    decoder = _DECODERS.get(cls)
    if decoder is None:
        decoder = _DECODERS[cls] = msgspec.json.Decoder(cls)
    return decoder


def _explain(exc: msgspec.ValidationError, root: type, data: Any) -> tuple[str, str]:
    from survey.store.explain import explain_validation_error

    return explain_validation_error(exc, root, data)


def _show(value: Any) -> str:
    from survey.store.explain import show

    return show(value)


# --- what kind of file -------------------------------------------------------------------

_MAGIC = (
    (b"PK\x03\x04", "a ZIP archive (or an Office document)"),
    (b"\x1f\x8b", "a gzip-compressed file"),
    (b"%PDF", "a PDF document"),
    (b"\x89PNG", "a PNG image"),
    (b"\xff\xd8\xff", "a JPEG image"),
    (b"\xd0\xcf\x11\xe0", "an old-style Office document"),
    (b"SQLite format 3", "an SQLite database"),
)


def check_bytes(data: bytes, path: object) -> bytes:
    """``data`` without a UTF-8 byte-order mark, after refusing what cannot be a survey."""
    if data.startswith(b"\xef\xbb\xbf"):  # a UTF-8 byte-order mark some editors add
        data = data[3:]
    if not data.strip():
        raise SurveyFileError(path, "", "the file is empty")
    if data.startswith((b"\xff\xfe", b"\xfe\xff")):
        raise SurveyFileError(path, "", "the file is UTF-16 text; save it as UTF-8")
    for magic, what in _MAGIC:
        if data.startswith(magic):
            raise SurveyFileError(path, "", f"not a survey file: this is {what}")
    if b"\x00" in data[:65536]:
        zeros = data.count(b"\x00") == len(data)
        raise SurveyFileError(
            path,
            "",
            "the file is all zero bytes (damaged by a crash or disk fault)"
            if zeros
            else "the file contains NUL bytes: it is binary or damaged",
        )
    return data


# --- broken JSON -------------------------------------------------------------------------


def _line_column(data: bytes, offset: int) -> str:
    offset = max(0, min(offset, len(data)))
    line = data.count(b"\n", 0, offset) + 1
    column = offset - (data.rfind(b"\n", 0, offset) + 1) + 1
    return f"line {line}, column {column}"


_LONE_SURROGATE = re.compile(rb"\\u[dD][89abAB][0-9a-fA-F]{2}(?!\\u[dD][c-fC-F][0-9a-fA-F]{2})")


def _decode_error(path: object, exc: Exception, data: bytes) -> SurveyFileError:
    message = str(exc)
    if isinstance(exc, RecursionError):
        return SurveyFileError(path, "", "lists or objects are nested too deeply to be a survey")
    if "truncated" in message or "escape" in message or "surrogate" in message:
        lone = _LONE_SURROGATE.search(data)
        if lone is not None:
            return SurveyFileError(
                path,
                _line_column(data, lone.start()),
                "not valid JSON: a \\u escape names half of a UTF-16 surrogate pair",
            )
    if "truncated" in message:
        return SurveyFileError(
            path,
            _line_column(data, len(data)),
            "the file ends too early: it has been cut off (truncated)",
        )
    m = re.search(r"\(byte (\d+)\)", message)
    where = _line_column(data, int(m.group(1))) if m else ""
    if m:
        try:
            data[: int(m.group(1)) + 4].decode("utf-8")
        except UnicodeDecodeError as bad:
            if bad.start <= int(m.group(1)):
                return SurveyFileError(
                    path,
                    _line_column(data, bad.start),
                    "the file is not UTF-8 text; save it as UTF-8",
                )
    if "UTF-8" in message:
        try:
            data.decode("utf-8")
        except UnicodeDecodeError as bad:
            return SurveyFileError(
                path, _line_column(data, bad.start), "the file is not UTF-8 text; save it as UTF-8"
            )
    detail = message.replace("JSON is malformed: ", "")
    detail = re.sub(r"\s*\(byte \d+\)", "", detail)
    if detail == "trailing characters":
        return SurveyFileError(
            path, where, "there is more text after the end of the survey's JSON object"
        )
    return SurveyFileError(path, where, f"not valid JSON ({shorten(detail, 120)})")


# --- the version -------------------------------------------------------------------------


def schema_version(data: bytes, path: object) -> int:
    """The ``schema_version`` of a document, after refusing a newer or unknown one."""
    try:
        head = _decoder(_Head).decode(data)
    except msgspec.ValidationError:
        raise SurveyFileError(
            path, "", "not a survey file: the top level is not a JSON object"
        ) from None
    except (msgspec.DecodeError, RecursionError) as exc:
        raise _decode_error(path, exc, data) from None
    version = head.schema_version
    if version is msgspec.UNSET:
        raise SurveyFileError(
            path, "", "this is not a condition-survey file (it has no schema_version)"
        )
    if data.count(b'"schema_version"') > 1:
        versions = _top_level_values(data, "schema_version")
        if len(versions) > 1:
            shown = " and ".join(_show(v) for v in versions[:4])
            raise SurveyFileError(
                path,
                "schema_version",
                f"given {len(versions)} times ({shown}); a survey file states its version "
                f'once: keep the one line "schema_version": {SCHEMA_VERSION}',
            )
    if type(version) is not int:
        raise SurveyFileError(
            path, "schema_version", f"expected a whole number, found {_show(version)}"
        )
    if version > SCHEMA_VERSION:
        raise SurveyFileError(
            path,
            "schema_version",
            f"the file is schema version {version}, written by a newer condition-survey; this "
            f"one reads versions up to {SCHEMA_VERSION}. Update condition-survey to open it",
        )
    if version < min(migrations.MIGRATIONS, default=SCHEMA_VERSION):
        raise SurveyFileError(path, "schema_version", f"unknown schema version {version}")
    return version


def _top_level_values(data: bytes, key: str) -> list[Any]:
    """Every value given for ``key`` in the top-level object (JSON keeps only the last)."""
    import json

    pairs: list[list[tuple[str, Any]]] = []

    def keep(items: list[tuple[str, Any]]) -> dict[str, Any]:
        pairs.append(items)
        return {}

    try:
        json.loads(data, object_pairs_hook=keep)
    except (ValueError, RecursionError):
        return []
    return [value for name, value in pairs[-1] if name == key] if pairs else []


# --- keys given twice --------------------------------------------------------------------


class _Duplicate(Exception):
    """Raised by the fast check at the first object holding a key twice."""


def _unique_pairs(pairs: list[tuple[str, Any]]) -> None:
    if len(pairs) > 1 and len(dict(pairs)) != len(pairs):
        raise _Duplicate
    return None  # the objects themselves are not needed: build nothing


class _Found:
    """A key given twice, found while parsing; ``tokens`` grow outward as parsing returns."""

    def __init__(self, key: str, values: list[Any]) -> None:
        self.key = key
        self.values = values
        self.tokens: list[str | int] = [key]


_AN_OBJECT: dict[str, Any] = {}


def _found_in(value: Any) -> _Found | None:
    if isinstance(value, _Found):
        return value
    if isinstance(value, list):
        for index, item in enumerate(value):
            found = _found_in(item)
            if found is not None:
                found.tokens.append(index)
                return found
    return None


def _locating_pairs(pairs: list[tuple[str, Any]]) -> Any:
    """The first duplicate in document order: a key seen before in this object, or one
    found inside a value, whichever comes first."""
    seen: set[str] = set()
    for key, value in pairs:
        if key in seen:
            return _Found(key, [v for k, v in pairs if k == key])
        seen.add(key)
        found = _found_in(value)
        if found is not None:
            found.tokens.append(key)
            return found
    return _AN_OBJECT


_SAMPLES_KEY = re.compile(rb'"samples"\s*:\s*\[')
_SAMPLES_END = re.compile(rb"\]\s*\]")


def _without_samples(data: bytes) -> bytes:
    """``data`` with every logger series' ``samples`` array emptied.

    Only for a document that decoded as a current :class:`~survey.model.Survey`: then every
    key is a field name (unknown ones are refused), so ``"samples":`` is a log series' key,
    and its array holds only ``[time, number, number]`` items whose times contain no
    brackets, so the first ``]]`` after it closes it. A million samples then cost the
    duplicate-key check nothing, neither time nor memory.
    """
    parts = []
    start = 0
    for key in _SAMPLES_KEY.finditer(data):
        if key.start() < start:
            continue
        body = key.end()
        close = data.find(b"]", body)
        if data[body:close].strip():  # not already empty
            end = _SAMPLES_END.search(data, body)
            if end is None:  # pragma: no cover - the document decoded
                return data
            close = end.end() - 1
        parts.append(data[start:body])
        start = close
    if not parts:
        return data
    parts.append(data[start:])
    return b"".join(parts)


def duplicate_key(data: bytes, *, decoded_as_survey: bool = True) -> tuple[str, str] | None:
    """``(where, problem)`` for the first key given twice in one object, else ``None``.

    ``data`` is JSON that msgspec has already decoded (as a current survey, when
    ``decoded_as_survey``, which lets the logger samples be skipped); should the standard
    library's parser refuse it nonetheless, there is nothing to report here.
    """
    import json

    if decoded_as_survey and b'"samples"' in data:
        data = _without_samples(data)
    try:
        json.loads(data, object_pairs_hook=_unique_pairs)
        return None
    except _Duplicate:
        pass
    except (ValueError, RecursionError):
        return None
    found = _found_in(json.loads(data, object_pairs_hook=_locating_pairs))
    if found is None:  # pragma: no cover - the two passes read the same text
        return None
    from survey.store.explain import quote, where_of

    values = [_show(_AN_OBJECT if isinstance(v, _Found) else v) for v in found.values]
    count = len(values)
    if count <= 3:
        listed = ", ".join(values[:-1]) + " and " + values[-1]
    else:
        listed = ", ".join(values[:3]) + f" and {count - 3} more"
    times = "twice" if count == 2 else f"{count} times"
    return where_of(found.tokens[::-1]), (
        f"the key {quote(found.key, 40)} is given {times} in one object ({listed}); a JSON "
        "reader keeps only one of them silently, so the file has been damaged or badly "
        "edited: keep the line that is right and delete the other"
    )


# --- in and out --------------------------------------------------------------------------


def _upgraded(data: bytes, version: int, path: object) -> Survey:
    doc = migrations.migrate(msgspec.json.decode(data), version, path)
    try:
        return msgspec.convert(doc, Survey)
    except msgspec.ValidationError as exc:
        where, problem = _explain(exc, Survey, doc)
        raise SurveyFileError(
            path, where, f"{problem} (after upgrading from schema version {version})"
        ) from None


def loads_survey(data: bytes, path: object = "<survey>") -> Survey:
    """Decode and check a survey from JSON bytes; ``path`` names it in errors.

    The checked decode runs first: a current file needs nothing else read twice. Only when
    it fails is the version looked at, to tell a newer or older file from a damaged one.
    """
    data = check_bytes(bytes(data), path)
    version = SCHEMA_VERSION
    try:
        try:
            survey = _decoder(Survey).decode(data)
        except msgspec.ValidationError as exc:
            version = schema_version(data, path)  # refuses a newer or unknown version
            if version == SCHEMA_VERSION:
                where, problem = _explain(exc, Survey, data)
                raise SurveyFileError(path, where, problem) from None
            survey = _upgraded(data, version, path)
        else:
            # It decoded, so every key is a field and "schema_version" can only be the top
            # level's; once is right (the default would hide a file that has none).
            if data.count(b'"schema_version"') != 1:
                schema_version(data, path)
    except (msgspec.DecodeError, RecursionError) as exc:
        raise _decode_error(path, exc, data) from None
    except MemoryError:
        raise SurveyFileError(path, "", "the file is too large to read into memory") from None
    duplicate = duplicate_key(data, decoded_as_survey=version == SCHEMA_VERSION)
    if duplicate is not None:
        raise SurveyFileError(path, *duplicate)
    found = model.problems(survey)
    if found:
        where, problem = found[0]
        others = len(found) - 1
        more = f" (and {others} more problem{'s' * (others > 1)})" if others else ""
        raise SurveyFileError(path, where, problem + more)
    return cast(Survey, survey)


def dumps_survey(survey: Survey, path: object = "<survey>") -> bytes:
    """The survey as indented JSON bytes, after checking every type, range and reference.

    Raises :class:`~survey.errors.SurveyFileError` ("not saved: …") if the survey in memory
    holds a value its own records do not allow (a reading set to NaN, say).
    """
    if not isinstance(survey, Survey):
        raise TypeError(f"expected a Survey, got {type(survey).__name__}")
    try:
        raw = _ENCODER.encode(survey)
    except (TypeError, ValueError, OverflowError, UnicodeError) as exc:
        raise SurveyFileError(
            path,
            "",
            f"not saved: the survey holds a value that cannot be written ({shorten(exc, 120)})",
        ) from None
    try:
        checked = _decoder(Survey).decode(raw)
    except msgspec.ValidationError as exc:
        where, problem = _explain(exc, Survey, raw)
        raise SurveyFileError(path, where, f"not saved: {problem}") from None
    found = model.problems(checked)
    if found:
        raise SurveyFileError(path, found[0][0], f"not saved: {found[0][1]}")
    # Written from the checked copy, so a whole number held in a float field is written as
    # 68.0 and the file is the same whichever way the survey was built.
    return msgspec.json.format(_ENCODER.encode(checked), indent=2) + b"\n"
