"""A logger's samples merged into a survey: where they go, what is new, what was there.

:func:`plan_import` takes what :func:`survey.logimport.read_logger_csv` read and the survey it
is for, and returns the new :class:`~survey.model.LogSeries` with only the samples the
survey does not hold yet. A logger exported again later repeats its earlier samples: those
already in a series of the same room (and the same instrument, when both name one) are left
out and counted. A file imported before (same SHA-256) is refused. Nothing here changes the
survey; the caller saves the survey with the series added.

Errors name the quantity (``room``, ``instrument``, ``logger file``); a face re-labels them
with its own field names (:meth:`~survey.errors.InputError.with_field`).
"""

from __future__ import annotations

import datetime as dt
from dataclasses import dataclass

from survey.errors import InputError
from survey.logimport import LoggerData
from survey.model import LogSample, LogSeries, Survey
from survey.safe_text import count_cut

#: Longest text kept in a series' ``source`` (the file name) and ``notes``.
SOURCE_MAX_CHARS = 200
NOTES_MAX_CHARS = 20_000


@dataclass(frozen=True)
class LogImport:
    """What importing one logger file into a survey would add."""

    room: str | None  #: ``Room.id``, ``None`` for outdoors
    #: Samples not yet in the survey, in time order (empty: nothing to import).
    samples: list[LogSample]
    #: Samples of the file that the survey already holds, left out.
    repeated: int
    #: ``source`` of each series that already held some of the file's samples.
    overlapping_sources: tuple[str, ...]
    #: The series to add to ``survey.logs``; ``None`` when there is nothing new.
    series: LogSeries | None


def room_id_for(survey: Survey, key: str | None) -> str | None:
    """The id of the room ``key`` names (its id, or its name ignoring case); ``None``
    (outdoors) for ``None``. Raises :class:`InputError` ("room") listing the rooms."""
    if key is None:
        return None
    room = survey.find_room(key)
    if room is None:
        known = count_cut([f"{r.id} ({r.name})" for r in survey.rooms]) or "none yet"
        raise InputError("room", key, f"no such room in the survey; rooms: {known}")
    return room.id


def check_instrument(survey: Survey, instrument: str | None) -> None:
    """Raise :class:`InputError` ("instrument") unless ``instrument`` is ``None`` or the id
    of one of the survey's instruments."""
    if instrument is None:
        return
    ids = [i.id for i in survey.instruments]
    if instrument not in ids:
        raise InputError(
            "instrument",
            instrument,
            f"no such instrument in the survey; instruments: {count_cut(ids) or 'none yet'}",
        )


def where(survey: Survey, room_id: str | None) -> str:
    """Where a series was logged, for a message: "Main bedroom (bed1)" or "outdoors"."""
    if room_id is None:
        return "outdoors"
    room = next((r for r in survey.rooms if r.id == room_id), None)
    return f"{room.name} ({room.id})" if room is not None else room_id


def span(samples: list[LogSample]) -> str:
    """The time span of ``samples`` (at least one): "2025-01-15 10:00 to 12:00",
    "2025-01-15 10:00 to 2025-01-16 09:00" or "at 2025-01-15 10:00"."""
    first, last = samples[0].at, samples[-1].at
    if first == last:
        return f"at {first:%Y-%m-%d %H:%M}"
    if first.date() == last.date():
        return f"{first:%Y-%m-%d %H:%M} to {last:%H:%M}"
    return f"{first:%Y-%m-%d %H:%M} to {last:%Y-%m-%d %H:%M}"


def _plural(n: int, word: str) -> str:
    return f"{n} {word}{'' if n == 1 else 's'}"


def plan_import(
    survey: Survey,
    data: LoggerData,
    *,
    room: str | None,
    source: str,
    instrument: str | None = None,
    imported_at: dt.datetime | None = None,
    surface: str | None = None,
) -> LogImport:
    """The series that importing ``data`` (read from the file named ``source``) into
    ``survey`` for ``room`` (a ``Room.id``; ``None`` for outdoors) would add; ``surface``
    is the location label of the surface the logger sat on (``None``: the air), and only
    series of the same room and surface hold repeats of its samples.

    Raises :class:`InputError` ("logger file") when a series of the survey came from the
    very same file (same SHA-256); nothing is changed.
    """
    for log in survey.logs:
        if log.source_sha256 == data.sha256:
            when = f", imported {log.imported_at:%Y-%m-%d %H:%M}" if log.imported_at else ""
            held = f", {span(log.samples)}" if log.samples else ""
            raise InputError(
                "logger file",
                source,
                f"this logger file was already imported into {where(survey, log.room)} "
                f"({_plural(len(log.samples), 'sample')}{held}, from {log.source}{when}); "
                "nothing was changed",
            )
    known: set[dt.datetime] = set()
    overlapping: list[str] = []
    for log in survey.logs:
        if log.room != room or log.surface != surface:
            continue
        if instrument and log.instrument and log.instrument != instrument:
            continue
        times = {sample.at for sample in log.samples}
        if any(sample.at in times for sample in data.samples):
            overlapping.append(log.source)
            known |= times
    samples = [sample for sample in data.samples if sample.at not in known]
    repeated = len(data.samples) - len(samples)
    sources = tuple(dict.fromkeys(overlapping))
    if not samples:
        return LogImport(room, [], repeated, sources, None)
    notes = [f"Times as written in the file (time column {' + '.join(data.time_columns)!r})."]
    notes += data.notes
    if repeated:
        notes.append(
            f"{_plural(repeated, 'sample')} of the file already in the survey "
            f"(from {', '.join(sources)}) left out."
        )
    series = LogSeries(
        room=room,
        source=source[:SOURCE_MAX_CHARS] or "logger.csv",
        samples=samples,
        surface=surface,
        instrument=instrument,
        source_sha256=data.sha256,
        imported_at=imported_at or dt.datetime.now().replace(microsecond=0),
        skipped_rows=len(data.skipped) + repeated,
        notes=" ".join(notes)[:NOTES_MAX_CHARS],
    )
    return LogImport(room, samples, repeated, sources, series)
