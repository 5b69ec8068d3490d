"""Drying and ventilation equipment in a room on a visit: its table rows and its dialog."""

from __future__ import annotations

from collections.abc import Callable

from rich.text import Text

from survey import model
from survey.app import walk
from survey.app.dialogs import PromptDialog
from survey.app.fields import plain
from survey.errors import InputError

KINDS = (
    "refrigerant_dehumidifier",
    "desiccant_dehumidifier",
    "air_mover",
    "heater",
    "extract_fan",
    "air_scrubber",
    "other",
)
COLUMNS = ("kind", "label", "running", "L/day rated", "water removed")


def row(e: model.Equipment) -> tuple[Text, ...]:
    return (
        Text(e.kind.replace("_", " ")),
        plain(walk.cut(e.label, 20)),
        Text("yes" if e.running else "no"),
        Text("" if e.capacity_l_per_day is None else f"{e.capacity_l_per_day:g}"),
        Text("" if e.water_removed_l is None else f"{e.water_removed_l:g} L"),
    )


def dialog(
    title: str, current: model.Equipment | None, done: Callable[[model.Equipment], None]
) -> tuple[PromptDialog, Callable]:
    """A dialog and its answer callback: a record the model accepts goes to ``done``."""
    e = current
    fields = [
        ("Kind: " + ", ".join(KINDS), e.kind if e else "refrigerant_dehumidifier"),
        ("Label", e.label if e else ""),
        ("Running now (yes or no)", "no" if e and not e.running else "yes"),
        (
            "Rated capacity, L/day",
            "" if e is None or e.capacity_l_per_day is None else f"{e.capacity_l_per_day:g}",
        ),
        (
            "Water removed since the last visit, L",
            "" if e is None or e.water_removed_l is None else f"{e.water_removed_l:g}",
        ),
    ]
    found: dict[str, model.Equipment] = {}

    def check(v: list[str]) -> str:
        try:
            kind = v[0].strip()
            if kind not in KINDS:
                raise InputError("Kind", kind, "one of " + ", ".join(KINDS))
            running = v[2].strip().lower()
            if running not in ("yes", "no", "y", "n"):
                raise InputError("Running now", v[2], "yes or no")
            base = e or model.Equipment(kind=kind)
            found["record"] = walk.checked(
                base,
                "equipment",
                kind=kind,
                label=walk.text_parser("Label")(v[1]),
                running=running.startswith("y"),
                capacity_l_per_day=walk.optional(walk.number("Rated capacity"))(v[3]),
                water_removed_l=walk.optional(walk.number("Water removed"))(v[4]),
            )
        except InputError as exc:
            return f"Not saved — {exc}"
        return ""

    def answered(values: list[str] | None) -> None:
        if values is not None and "record" in found:
            done(found["record"])

    return PromptDialog(title, fields, check), answered
