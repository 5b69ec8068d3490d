"""The user's own keys: ``keys.json`` in the app's data folder maps binding ids (listed on
the help screen, in brackets) to keys, e.g. ``{"go_report": "f9", "add_surface": "n"}``.

A file that cannot be read or names an unknown id changes nothing it cannot apply: the
good entries are used and the status line says what was skipped and why.
"""

from __future__ import annotations

import json
from pathlib import Path

from survey.safe_text import shorten

FILE = "keys.json"


def known_ids() -> set[str]:
    """Every binding id of the app, as the help screen lists them."""
    from survey.app.help import sections

    return {b.id for _, bindings in sections() for b in bindings if b.id}


def load(folder: Path | None) -> tuple[dict[str, str], list[str]]:
    """The keymap in ``folder``'s ``keys.json`` (empty when there is none), and the
    problems found, one sentence each."""
    if folder is None:
        return {}, []
    path = folder / FILE
    try:
        raw = path.read_text(encoding="utf-8")
    except FileNotFoundError:
        return {}, []
    except (OSError, UnicodeDecodeError) as exc:
        return {}, [f"{path} could not be read ({shorten(exc, 80)}); the usual keys are used"]
    try:
        data = json.loads(raw)
    except ValueError as exc:
        return {}, [f"{path} is not JSON ({shorten(exc, 80)}); the usual keys are used"]
    if not isinstance(data, dict):
        return {}, [f"{path} must hold an object of binding id to key; the usual keys are used"]
    ids = known_ids()
    keymap: dict[str, str] = {}
    problems: list[str] = []
    for binding_id, key in data.items():
        if binding_id not in ids:
            problems.append(f"no binding has the id {shorten(binding_id, 40)} (see F1)")
        elif not isinstance(key, str) or not key.strip() or any(ord(c) < 32 for c in key):
            problems.append(f"{binding_id}: the key must be a key name such as f9 or ctrl+r")
        else:
            keymap[binding_id] = key.strip()
    return keymap, problems
