"""A limit as a record: its value and unit, where it comes from, how sure we are of it."""

from __future__ import annotations

from dataclasses import dataclass
from typing import Literal

Mark = Literal["R", "M", "C", "common practice", "choice"]

MARK_TEXT: dict[str, str] = {
    "R": "read in the source",
    "M": "from memory, not verified against the original",
    "C": "computed from the named formula",
    "common practice": "common practice, no single source",
    "choice": "our choice of a value (inside the range the source gives, where one does)",
}

#: The marks in words for a client's report: the same facts, in plain terms.


@dataclass(frozen=True, slots=True)
class Threshold:
    """One limit: its value and unit, where it comes from, and how sure we are of it."""

    key: str
    title: str  #: a short name for people, e.g. "Mould limit, surface RH"
    value: float
    unit: str
    source: str
    note: str
    mark: Mark

    @property
    def value_text(self) -> str:
        """The value with its unit, e.g. ``'80 %'``; a temperature to 0.1 °C at most (a limit
        defined in °F, 80 °F = 26.666… °C, reads 26.7 °C)."""
        value = round(self.value, 1) if self.unit == "°C" else self.value
        return f"{value:g} {self.unit}" if self.unit else f"{value:g}"

    def citation(self) -> str:
        """One line for a report's method section: value, source, mark and note."""
        return f"{self.value_text}: {self.source}; {MARK_TEXT[self.mark]}. {self.note}"
