"""Every limit the assessment and the advice use, once, as data, with its source.

Each limit is a :class:`Threshold` with a stable ``key``. Findings and actions carry the keys
they used; the report and the app turn a key into a citation with :func:`citation`. To add a
limit: add one ``Threshold(...)`` to the table (:mod:`survey.thresholds.table` for surfaces
and materials, :mod:`survey.thresholds.limits_room` for the rest; key in snake_case with the
unit last, e.g. ``..._pct``, ``..._k``, ``..._g_per_h``), write its source and mark, and use it
through :func:`value` — never repeat the number in code.

Marks say how sure the number is:

* ``"R"`` — read in the named source (or the named secondary source);
* ``"M"`` — from memory, not verified against the original;
* ``"C"`` — computed from the named formula;
* ``"common practice"`` — a trade rule of thumb with no single source;
* ``"choice"`` — our own pick of one value inside a range the named source gives (the note
  says which range and why this value).

The package imports nothing but the standard library and :mod:`survey.errors`.


The package: :mod:`~survey.thresholds.record` (the record), :mod:`~survey.thresholds.table`
(every limit, with :mod:`~survey.thresholds.limits_room`, and the look-ups),
:mod:`~survey.thresholds.policy` (room uses and surface elements, timber and porous words),
:mod:`~survey.thresholds.classes` (ISO 13788 humidity classes).
"""

from __future__ import annotations

from survey.thresholds.classes import (
    BEYOND_CLASS_5,
    HUMIDITY_CLASS_KEYS,
    humidity_class,
    humidity_class_in,
    humidity_class_limits_pa,
)
from survey.thresholds.policy import (
    ACTIVITY_RATE,
    CONFINED_USES,
    ELEMENT_POLICY,
    FRSI_LIMIT_BY_USE,
    OCCUPANT_RATE_BY_USE,
    POROUS_WORDS,
    ROOM_USE_FLAG_REASONS,
    ROOM_USE_POLICY,
    ROOM_USES,
    SURFACE_ELEMENTS,
    TIMBER_WORDS,
    ElementPolicy,
    RoomUse,
    UseLimit,
    check_element,
    check_use,
    frsi_limit,
    is_porous,
    is_timber,
    room_use,
)
from survey.thresholds.record import (
    MARK_TEXT,
    Mark,
    Threshold,
)
from survey.thresholds.table import (
    _THRESHOLDS,
    all_thresholds,
    citation,
    cited,
    get,
    value,
)

__all__ = [
    "ACTIVITY_RATE",
    "BEYOND_CLASS_5",
    "CONFINED_USES",
    "ELEMENT_POLICY",
    "FRSI_LIMIT_BY_USE",
    "HUMIDITY_CLASS_KEYS",
    "MARK_TEXT",
    "OCCUPANT_RATE_BY_USE",
    "POROUS_WORDS",
    "ROOM_USES",
    "ROOM_USE_FLAG_REASONS",
    "ROOM_USE_POLICY",
    "SURFACE_ELEMENTS",
    "TIMBER_WORDS",
    "_THRESHOLDS",
    "ElementPolicy",
    "Mark",
    "RoomUse",
    "Threshold",
    "UseLimit",
    "all_thresholds",
    "check_element",
    "check_use",
    "citation",
    "cited",
    "frsi_limit",
    "get",
    "humidity_class",
    "humidity_class_in",
    "humidity_class_limits_pa",
    "is_porous",
    "is_timber",
    "room_use",
    "value",
]
