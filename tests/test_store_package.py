"""The store package: its public names, its layering, what it loads, and the schema's text."""

from __future__ import annotations

import ast
import re
import subprocess
import sys
from pathlib import Path

import pytest

from survey import store

ROOT = Path(__file__).resolve().parents[1]
PACKAGE = ROOT / "survey" / "store"
MODULES = sorted(f"survey.store.{p.stem}" for p in PACKAGE.glob("*.py") if p.stem != "__init__")
EXAMPLE = ROOT / "example_sites" / "winter-flat-bedroom-mould.json"

#: Every name importable from the single-module store before it became a package.
NAMES_BEFORE_THE_SPLIT = (
    "MAX_FILE_BYTES",
    "MISSING",
    "MIGRATIONS",
    "Migration",
    "migration",
    "migrate",
    "value_at",
    "explain_validation_error",
    "loads_survey",
    "dumps_survey",
    "read_input_file",
    "backup_path",
    "load_survey",
    "FileStamp",
    "file_stamp",
    "write_file_atomically",
    "damaged_copy_path",
    "save_survey",
    "remove_stale_temp_files",
    "LockInfo",
    "SurveyLocked",
    "lock_path",
    "read_lock",
    "lock_is_stale",
    "describe_lock",
    "acquire_lock",
    "release_lock",
    "EditSession",
    "open_for_editing",
    "survey_schema",
    "read_schema_version",
)


def _loaded_after(code: str) -> set[str]:
    result = subprocess.run(
        [sys.executable, "-c", code + "\nimport sys\nprint('\\n'.join(sys.modules))"],
        capture_output=True,
        text=True,
        timeout=60,
        cwd=ROOT,
    )
    assert result.returncode == 0, result.stderr
    return set(result.stdout.split())


@pytest.mark.parametrize("name", NAMES_BEFORE_THE_SPLIT)
def test_every_earlier_public_name_is_importable_from_survey_store(name):
    """A name other code imported from survey.store before the split still resolves there."""
    assert getattr(store, name) is not None
    exec(f"from survey.store import {name}", {})


def test_every_listed_name_resolves_and_is_listed_once():
    """Each name in survey.store.__all__ resolves, and each lives in exactly one module."""
    for name in store.__all__:
        value = getattr(store, name)
        home = store._HOMES[name]
        assert getattr(sys.modules[f"survey.store.{home}"], name) is value
    assert len(store.__all__) == len(set(store.__all__)) == len(store._HOMES)


def test_unknown_name_raises_attribute_error():
    """A name the store does not have is an AttributeError, as for any module."""
    with pytest.raises(AttributeError):
        store.no_such_name  # noqa: B018


@pytest.mark.parametrize("module", MODULES)
def test_no_store_module_is_large(module):
    """Each module of the package stays well under the ~600-line mark."""
    path = PACKAGE / f"{module.rsplit('.', 1)[1]}.py"
    assert len(path.read_text().splitlines()) <= 450


def test_model_imports_nothing_of_the_store():
    """survey/model.py has no import of survey.store."""
    tree = ast.parse((ROOT / "survey" / "model.py").read_text())
    for node in ast.walk(tree):
        if isinstance(node, ast.ImportFrom):
            names = [node.module or ""] + [f"{node.module}.{a.name}" for a in node.names]
        elif isinstance(node, ast.Import):
            names = [a.name for a in node.names]
        else:
            continue
        assert not any(n == "survey.store" or n.startswith("survey.store.") for n in names), (
            ast.unparse(node)
        )


def test_importing_the_model_loads_no_store():
    """In a fresh interpreter, importing survey.model loads nothing of survey.store."""
    loaded = _loaded_after("import survey.model")
    assert not any(name == "survey.store" or name.startswith("survey.store.") for name in loaded)


def test_importing_the_store_loads_none_of_its_modules():
    """`import survey.store` alone costs next to nothing: no module of it is loaded yet."""
    loaded = _loaded_after("import survey.store")
    assert not any(name.startswith("survey.store.") for name in loaded)
    assert "survey.model" not in loaded


def test_loading_a_good_survey_loads_only_what_it_needs():
    """Loading a good file loads neither the lock, the session, the schema nor the error
    wording (nor difflib, socket, secrets)."""
    loaded = _loaded_after(f"from survey import store\nstore.load_survey({str(EXAMPLE)!r})")
    assert "survey.store.survey_file" in loaded
    unwanted = {
        "survey.store.lock",
        "survey.store.session",
        "survey.store.schema",
        "survey.store.explain",
        "difflib",
        "socket",
        "secrets",
    }
    assert not unwanted & loaded


@pytest.mark.parametrize("module", MODULES)
def test_store_module_loads_no_face_library(module):
    """Each store module imports neither textual, Rich nor pint."""
    loaded = _loaded_after(f"import {module}")
    assert module in loaded
    assert not {n.split(".")[0] for n in loaded} & {"textual", "rich", "pint"}


# --- the schema's text -------------------------------------------------------------------


def _descriptions(node) -> list[str]:
    found = []
    if isinstance(node, dict):
        for key, value in node.items():
            if key == "description" and isinstance(value, str):
                found.append(value)
            else:
                found += _descriptions(value)
    elif isinstance(node, list):
        for item in node:
            found += _descriptions(item)
    return found


def test_schema_descriptions_are_plain_text():
    """`survey schema` descriptions carry no reST markup (``code``, :role:`x`)."""
    descriptions = _descriptions(store.survey_schema())
    assert len(descriptions) > 20
    for text in descriptions:
        assert "``" not in text and not re.search(r":[a-z]+:`", text), text


def test_schema_descriptions_keep_paragraphs_on_one_line():
    """A docstring's wrapped lines are joined; only paragraph breaks remain."""
    for text in _descriptions(store.survey_schema()):
        assert "\n" not in text.replace("\n\n", ""), text
