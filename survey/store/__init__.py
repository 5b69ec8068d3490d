"""Survey files: load with located errors, crash-safe save with a backup, an editing lock,
schema versions and migrations.

One survey is one UTF-8 JSON file carrying ``schema_version`` (see :mod:`survey.model`).
Every name below is importable from ``survey.store``; each lives in one module of the
package, loaded on first use, so importing ``survey.store`` costs next to nothing and a
program that only loads surveys never loads the lock or the schema code.

``survey.store.explain``
    Located errors: a msgspec validation error turned into ``(where, problem)`` in plain
    words (``visits[1].rooms[3].surfaces[0].surface_temp_c``: "500 is out of range;
    allowed: between -60 and 90 °C"), :func:`value_at`, and :func:`check_record` /
    :func:`new_survey`, which raise :class:`~survey.errors.InputError` for a record before
    it is committed.
``survey.store.decoding``
    JSON bytes to a checked :class:`~survey.model.Survey` and back (:func:`loads_survey`,
    :func:`dumps_survey`): the file's kind (binary, UTF-16, empty, truncated), broken JSON
    with a line and column, the schema version, keys given twice in one object, types and
    ranges, cross-record checks.
``survey.store.migrations``
    ``MIGRATIONS[n]`` turns a version-``n`` document into version ``n + 1``.
``survey.store.fileio``
    Files on disk, knowing nothing of surveys: the bounded reader (:func:`read_input_file`,
    at most :data:`MAX_FILE_BYTES`, refusing folders, named pipes, devices and sockets
    without ever blocking) and the atomic writer (:func:`write_file_atomically`).
``survey.store.survey_file``
    :func:`load_survey` and :func:`save_survey`: the backup, damaged files kept aside, a
    file changed on disk since it was read.
``survey.store.lock``
    ``NAME.json.lock``: who holds a survey open, stale locks and their takeover.
``survey.store.session``
    :func:`open_for_editing` and :class:`EditSession`.
``survey.store.schema``
    :func:`survey_schema`, the JSON Schema printed by ``survey schema``.

Every message quoting the file (a key, a value, a list of ids) is bounded and made visible
with :mod:`survey.safe_text`, so an error line stays short and never carries control
characters to a terminal.
"""

from __future__ import annotations

import importlib
from typing import TYPE_CHECKING, Any

#: Each public name and the module of the package it lives in.
_HOMES = {
    "MISSING": "explain",
    "value_at": "explain",
    "explain_validation_error": "explain",
    "check_record": "explain",
    "new_survey": "explain",
    "loads_survey": "decoding",
    "dumps_survey": "decoding",
    "MIGRATIONS": "migrations",
    "Migration": "migrations",
    "migration": "migrations",
    "migrate": "migrations",
    "MAX_FILE_BYTES": "fileio",
    "read_input_file": "fileio",
    "FileStamp": "fileio",
    "file_stamp": "fileio",
    "write_file_atomically": "fileio",
    "load_survey": "survey_file",
    "save_survey": "survey_file",
    "backup_path": "survey_file",
    "damaged_copy_path": "survey_file",
    "read_schema_version": "survey_file",
    "LockInfo": "lock",
    "SurveyLocked": "lock",
    "lock_path": "lock",
    "read_lock": "lock",
    "lock_is_stale": "lock",
    "describe_lock": "lock",
    "acquire_lock": "lock",
    "release_lock": "lock",
    "EditSession": "session",
    "open_for_editing": "session",
    "remove_stale_temp_files": "session",
    "survey_schema": "schema",
}

__all__ = [
    "MAX_FILE_BYTES",
    "MIGRATIONS",
    "MISSING",
    "EditSession",
    "FileStamp",
    "LockInfo",
    "Migration",
    "SurveyLocked",
    "acquire_lock",
    "backup_path",
    "check_record",
    "damaged_copy_path",
    "describe_lock",
    "dumps_survey",
    "explain_validation_error",
    "file_stamp",
    "load_survey",
    "loads_survey",
    "lock_is_stale",
    "lock_path",
    "migrate",
    "migration",
    "new_survey",
    "open_for_editing",
    "read_input_file",
    "read_lock",
    "read_schema_version",
    "release_lock",
    "remove_stale_temp_files",
    "save_survey",
    "survey_schema",
    "value_at",
    "write_file_atomically",
]


def __getattr__(name: str) -> Any:
    home = _HOMES.get(name)
    if home is None:
        raise AttributeError(f"module {__name__!r} has no attribute {name!r}")
    value = getattr(importlib.import_module(f"{__name__}.{home}"), name)
    globals()[name] = value
    return value


def __dir__() -> list[str]:
    return sorted(set(globals()) | set(_HOMES))


if TYPE_CHECKING:  # the same names, for type checkers and editors
    from survey.store.decoding import dumps_survey, loads_survey
    from survey.store.explain import (
        MISSING,
        check_record,
        explain_validation_error,
        new_survey,
        value_at,
    )
    from survey.store.fileio import (
        MAX_FILE_BYTES,
        FileStamp,
        file_stamp,
        read_input_file,
        write_file_atomically,
    )
    from survey.store.lock import (
        LockInfo,
        SurveyLocked,
        acquire_lock,
        describe_lock,
        lock_is_stale,
        lock_path,
        read_lock,
        release_lock,
    )
    from survey.store.migrations import MIGRATIONS, Migration, migrate, migration
    from survey.store.schema import survey_schema
    from survey.store.session import (
        EditSession,
        open_for_editing,
        remove_stale_temp_files,
    )
    from survey.store.survey_file import (
        backup_path,
        damaged_copy_path,
        load_survey,
        read_schema_version,
        save_survey,
    )
