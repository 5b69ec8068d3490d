"""The small set of exceptions the core raises; the faces turn them into messages."""

from __future__ import annotations

from survey.safe_text import shorten

#: "No new value given" for :meth:`InputError.with_field`.
_SAME: object = object()


class SurveyError(Exception):
    """Base class for every error the core reports to a person."""


class InputError(SurveyError, ValueError):
    """A value a person entered is not acceptable.

    ``field`` names what was being entered (an option such as ``--rh`` or a form field),
    ``value`` is the text or number as given, ``allowed`` says what would be accepted.
    ``read_as`` is, when a unit or the unit system changed the number, the value it was read
    as in the unit ``allowed`` speaks of (``"0.85 m³"`` for ``30 ft3``), else ``""``; see
    :class:`survey.units.Reading`.

    The message quotes ``value`` through :func:`survey.safe_text.shorten`, so it stays one
    short line and shows control characters as escapes; ``value`` itself is kept as given.
    """

    def __init__(self, field: str, value: object, allowed: str, *, read_as: str = "") -> None:
        self.field = field
        self.value = value
        self.allowed = allowed
        self.read_as = read_as
        shown = repr(value) if isinstance(value, str) and not value.strip() else shorten(value)
        said = f"{field} {shown} (read as {read_as})" if read_as else f"{field} {shown}"
        super().__init__(f"{said}: {allowed}")

    def with_field(self, field: str, value: object = _SAME) -> InputError:
        """The same error reported under another field name (e.g. the CLI option), and for
        another ``value`` (the whole text typed) when one is given; ``read_as`` is kept."""
        return InputError(
            field, self.value if value is _SAME else value, self.allowed, read_as=self.read_as
        )


class SurveyFileError(SurveyError):
    """A survey file could not be read or written.

    ``path`` is the file, ``where`` the location inside the document (for example
    ``visits[1].rooms[3].surfaces[0].surface_temp_c``) or ``""`` when the problem is
    with the file as a whole, ``problem`` says what is wrong.
    """

    def __init__(self, path: object, where: str, problem: str) -> None:
        self.path = str(path)
        self.where = where
        self.problem = problem
        location = f" at {where}" if where else ""
        super().__init__(f"{self.path}{location}: {problem}")
