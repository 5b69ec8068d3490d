"""The small set of exceptions the core raises; the faces turn them into messages."""

from __future__ import annotations


class SurveyError(Exception):
    """Base class for every error the core reports to a person."""


class InputError(SurveyError, ValueError):
    """A value a person entered is not acceptable.

    ``field`` names what was being entered (an option such as ``--rh`` or a form field),
    ``value`` is the text or number as given, ``allowed`` says what would be accepted.
    """

    def __init__(self, field: str, value: object, allowed: str) -> None:
        self.field = field
        self.value = value
        self.allowed = allowed
        shown = repr(value) if isinstance(value, str) and not value.strip() else value
        super().__init__(f"{field} {shown}: {allowed}")

    def with_field(self, field: str) -> "InputError":
        """The same error reported under another field name (e.g. the CLI option)."""
        return InputError(field, self.value, self.allowed)


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
