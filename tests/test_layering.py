"""The core loads neither textual nor Rich, and pint only when a unit is read; the
quick-check path loads neither pint nor Rich; the import-linter contract holds."""

from __future__ import annotations

import subprocess
import sys
from pathlib import Path

import pytest

ROOT = Path(__file__).resolve().parents[1]
PACKAGE = ROOT / "survey"
#: The faces: the `survey` command (cli, __main__, commands) and the app. Everything else in
#: survey/ is the core.
FACES = {"cli", "__main__", "commands", "app"}


def _core_modules() -> list[str]:
    """Every module and package of survey/ below the faces, packages such as survey.store
    and their modules included, found from the files so that a new module is covered."""
    names = set()
    for path in PACKAGE.rglob("*.py"):
        parts = path.relative_to(PACKAGE).with_suffix("").parts
        if parts[0] in FACES:
            continue
        if parts[-1] == "__init__":
            parts = parts[:-1]
        if parts:
            names.add(".".join(("survey", *parts)))
    return sorted(names)


CORE_MODULES = _core_modules()


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


def _has(loaded: set[str], package: str) -> bool:
    return any(name == package or name.startswith(package + ".") for name in loaded)


def test_core_module_list_is_not_empty():
    """The core modules are found (so the next test cannot pass by testing nothing), and no
    face is among them."""
    assert {"survey.units", "survey.psychro", "survey.errors", "survey.model"} <= set(CORE_MODULES)
    assert not any(name.split(".")[1] in FACES for name in CORE_MODULES)


_FORBIDDEN = ("textual", "rich", "pint")

#: Imports each core module in turn in one fresh interpreter and prints, per module, any
#: forbidden package that its import loaded (a module imported earlier that had loaded one
#: would be reported there first), then the modules loaded in all.
_EACH = """
import importlib, sys
forbidden = {forbidden!r}
for name in {modules!r}:
    before = set(sys.modules)
    importlib.import_module(name)
    new = set(sys.modules) - before
    bad = sorted(m for m in new if m.split(".")[0] in forbidden)
    if bad:
        print("BAD", name, ",".join(bad[:5]))
print("LOADED", " ".join(sys.modules))
"""


def test_core_modules_load_neither_textual_nor_rich_nor_pint():
    """Importing the core modules, one after another in a fresh interpreter, loads neither
    textual nor Rich, nor pint: only survey.units uses pint, and only once a unit is read.
    Each module's own new imports are checked, so the one that loads a forbidden package is
    named."""
    result = subprocess.run(
        [sys.executable, "-c", _EACH.format(forbidden=_FORBIDDEN, modules=CORE_MODULES)],
        capture_output=True,
        text=True,
        timeout=120,
        cwd=ROOT,
    )
    assert result.returncode == 0, result.stderr
    bad = [line for line in result.stdout.splitlines() if line.startswith("BAD ")]
    assert bad == []
    loaded = set(result.stdout.split("LOADED", 1)[1].split())
    assert set(CORE_MODULES) <= loaded
    for package in _FORBIDDEN:
        assert not _has(loaded, package)


def test_pint_is_loaded_by_units_only_when_a_unit_is_read():
    """A bare number is read without pint; '21 °C' loads it, through survey.units."""
    bare = _loaded_after("from survey import units\nunits.parse_temperature('21', 't')")
    assert not _has(bare, "pint")
    with_unit = _loaded_after("from survey import units\nunits.parse_temperature('21 °C', 't')")
    assert _has(with_unit, "pint")


def test_psychro_does_not_import_pint_or_rich():
    """The psychrometric core computes in SI floats: no pint, no Rich."""
    loaded = _loaded_after("import survey.psychro")
    assert "pint" not in loaded and "rich" not in loaded


def test_quick_check_json_path_loads_neither_pint_nor_rich():
    """`survey check --json` with bare numbers starts without pint or Rich (start-up time)."""
    loaded = _loaded_after(
        "import contextlib, io\nfrom survey.cli import main\n"
        "with contextlib.redirect_stdout(io.StringIO()):\n"
        "    main(['check', '--air-temp', '21', '--rh', '65', '--surface-temp', '12',"
        " '--outdoor-temp', '4', '--outdoor-rh', '85', '--json'])"
    )
    assert "survey.psychro" in loaded
    assert "pint" not in loaded and "rich" not in loaded and "textual" not in loaded


def test_import_linter_contract_holds():
    """`lint-imports` (contracts in pyproject.toml: the layers, textual and Rich only in the
    faces, pint only in units, psychrolib only in psychro) finds nothing broken."""
    pytest.importorskip("importlinter")
    code = (
        "import sys\nfrom importlinter.cli import lint_imports_command\n"
        "sys.argv = ['lint-imports', '--no-cache']\nlint_imports_command()"
    )
    result = subprocess.run(
        [sys.executable, "-c", code], capture_output=True, text=True, timeout=120, cwd=ROOT
    )
    assert result.returncode == 0, result.stdout[-3000:] + result.stderr[-2000:]
