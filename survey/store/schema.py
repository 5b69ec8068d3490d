"""The JSON Schema of a survey file, generated from :mod:`survey.model`.

The descriptions are the records' docstrings and the field metadata, which are written as
plain text (a test holds them free of markup); wrapped lines are joined here so each
paragraph is one line, as a reader of the schema sees it.
"""

from __future__ import annotations

import re
from typing import Any

import msgspec

from survey.model import SCHEMA_VERSION, Survey

_WRAPPED = re.compile(r"(?<!\n)\n(?!\n)")


def _plain(node: Any) -> Any:
    if isinstance(node, dict):
        return {
            key: (
                _WRAPPED.sub(" ", value)
                if key == "description" and isinstance(value, str)
                else _plain(value)
            )
            for key, value in node.items()
        }
    if isinstance(node, list):
        return [_plain(item) for item in node]
    return node


def survey_schema() -> dict[str, Any]:
    """The JSON Schema of a survey file, generated from :mod:`survey.model`."""
    schema = _plain(msgspec.json.schema(Survey))
    return {
        "$schema": "https://json-schema.org/draft/2020-12/schema",
        "title": "condition-survey survey file",
        "description": f"One site survey, schema version {SCHEMA_VERSION}. Numbers are SI with "
        "the unit in the field name; derived values are not stored.",
        **schema,
    }
