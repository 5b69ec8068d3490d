"""Schema versions: upgrading older survey documents, one version at a time.

``MIGRATIONS[n]`` turns a version-``n`` document (plain dicts and lists, as decoded from
JSON) into version ``n + 1``. Files older than :data:`~survey.model.SCHEMA_VERSION` are
upgraded in memory on load and written in the current version on the next save (the old
version stays in the ``.bak``). A file from a newer version is refused (see
:mod:`survey.store.decoding`).

To change the format: raise ``SCHEMA_VERSION`` in :mod:`survey.model`, register a function
with ``@migration(old_version)``, and add a fixture of the old layout under ``tests/data/``.
"""

from __future__ import annotations

from collections.abc import Callable, Iterable
from typing import Any, cast

from survey.errors import SurveyFileError
from survey.model import SCHEMA_VERSION
from survey.safe_text import shorten

Migration = Callable[[dict[str, Any]], dict[str, Any]]
#: ``MIGRATIONS[n]`` upgrades a version-``n`` document to version ``n + 1``.
MIGRATIONS: dict[int, Migration] = {}


def migration(from_version: int) -> Callable[[Migration], Migration]:
    """Register a function that upgrades a document from ``from_version`` to the next."""

    def register(fn: Migration) -> Migration:
        MIGRATIONS[from_version] = fn
        return fn

    return register


def migrate(doc: Any, version: int, path: object = "<survey>") -> dict[str, Any]:
    """Apply the migrations from ``version`` up to :data:`SCHEMA_VERSION`."""
    while version < SCHEMA_VERSION:
        step = MIGRATIONS.get(version)
        if step is None:
            raise SurveyFileError(
                path, "schema_version", f"cannot upgrade from schema version {version}"
            )
        try:
            doc = step(doc)
        except (KeyError, TypeError, AttributeError, ValueError, IndexError) as exc:
            detail = shorten(f"missing {exc}" if isinstance(exc, KeyError) else str(exc), 120)
            raise SurveyFileError(
                path,
                "",
                f"cannot upgrade from schema version {version}: the file does not "
                f"have that version's layout ({detail})",
            ) from None
        version += 1
        doc["schema_version"] = version
    return cast(dict[str, Any], doc)


def _copy_keys(
    source: dict[str, Any], target: dict[str, Any], names: Iterable[str]
) -> dict[str, Any]:
    for name in names:
        if name in source:
            target[name] = source[name]
    return target


@migration(0)
def _upgrade_0_to_1(doc: dict[str, Any]) -> dict[str, Any]:
    """Schema 0, the pre-release layout, to schema 1.

    Schema 0 kept the site's fields at the top level (``reference``, ``address``,
    ``client``, ``inspector``, ``purpose``, ``units``: ``"metric"``/``"imperial"``,
    ``altitude_m``, ``notes``); instrument accuracies in an ``accuracy`` object
    (``temp_k``, ``rh_pct``, ``surface_k``); ``reference: bool`` on rooms; and per visit a
    ``date``, an ``outdoor`` of ``temp_c``/``rh_pct`` and ``readings`` holding, per room,
    ``temp_c``, ``rh_pct``, ``surfaces`` (``label``, ``element``, ``temp_c``) and
    ``moisture`` (``label``, ``material``, ``value``, ``scale``: ``"wme"``/``"relative"``).
    """
    if not isinstance(doc, dict):
        raise TypeError("the top level is not an object")
    units = {"metric": "si", "imperial": "ip"}
    site = _copy_keys(
        doc, {}, ("reference", "address", "client", "inspector", "purpose", "altitude_m", "notes")
    )
    if "units" in doc:
        site["unit_system"] = units.get(doc["units"], doc["units"])
    instruments = []
    for old in doc.get("instruments", []):
        new = _copy_keys(old, {}, ("id", "kind", "name", "serial"))
        accuracy = old.get("accuracy") or {}
        for old_key, new_key in (
            ("temp_k", "air_temp_accuracy_k"),
            ("rh_pct", "rh_accuracy_pct"),
            ("surface_k", "surface_temp_accuracy_k"),
        ):
            if old_key in accuracy:
                new[new_key] = accuracy[old_key]
        instruments.append(new)
    rooms = []
    for old in doc.get("rooms", []):
        new = _copy_keys(old, {}, ("id", "name", "use", "volume_m3", "occupants", "notes"))
        if "reference" in old:
            new["is_reference"] = old["reference"]
        rooms.append(new)

    def air(old: dict[str, Any] | None) -> dict[str, Any] | None:
        if old is None:
            return None
        return {"dry_bulb_c": old["temp_c"], "rh_pct": old["rh_pct"]}

    visits = []
    for old in doc.get("visits", []):
        new = {"started_at": old["date"]}
        _copy_keys(old, new, ("weather", "notes"))
        if old.get("outdoor") is not None:
            new["outdoor"] = air(old["outdoor"])
        new["rooms"] = []
        for reading in old.get("readings", []):
            room = {"room": reading["room"]}
            if "temp_c" in reading or "rh_pct" in reading:
                room["air"] = air(reading)
            room["surfaces"] = [
                {"location": s["label"], "element": s["element"], "surface_temp_c": s["temp_c"]}
                for s in reading.get("surfaces", [])
            ]
            room["materials"] = [
                {
                    "location": m["label"],
                    "material": m["material"],
                    "value": m["value"],
                    "scale": {"wme": "wme_pct"}.get(m["scale"], m["scale"]),
                }
                for m in reading.get("moisture", [])
            ]
            _copy_keys(reading, room, ("notes",))
            new["rooms"].append(room)
        visits.append(new)
    return {
        "schema_version": 0,
        "site": site,
        "instruments": instruments,
        "rooms": rooms,
        "visits": visits,
        "logs": [],
        "created_at": doc.get("created_at"),
    }


@migration(1)
def _upgrade_1_to_2(doc: dict[str, Any]) -> dict[str, Any]:
    """Version 2 added optional fields only (the site's design month, a dehumidifier's
    inlet, run time, power, energy and rating, a logger's surface); nothing to convert."""
    if not isinstance(doc, dict):
        raise TypeError("the document is not an object")
    return doc


@migration(2)
def _upgrade_2_to_3(doc: dict[str, Any]) -> dict[str, Any]:
    """Version 3 lets a room's occupants be unrecorded: a room without ``occupants`` now
    means "not recorded", where in version 2 it meant none. Rooms of a version-2 file that
    left it out are given ``0``, which is what the file meant."""
    if not isinstance(doc, dict):
        raise TypeError("the document is not an object")
    for room in doc.get("rooms", []):
        if isinstance(room, dict):
            room.setdefault("occupants", 0)
    return doc


@migration(3)
def _upgrade_3_to_4(doc: dict[str, Any]) -> dict[str, Any]:
    """Version 4 lets a room's storey be unrecorded: a room without ``level`` now means
    "not recorded", where in version 3 it meant the ground floor. Rooms of a version-3 file
    that left it out are given ``0``, which is what the file meant. Version 4 also adds a
    room record's ``left_out`` points (optional; nothing to convert)."""
    if not isinstance(doc, dict):
        raise TypeError("the document is not an object")
    for room in doc.get("rooms", []):
        if isinstance(room, dict):
            room.setdefault("level", 0)
    return doc
