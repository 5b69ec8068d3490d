"""The core never loads textual; the quick-check path loads neither pint nor Rich."""

from __future__ import annotations

import subprocess
import sys
from pathlib import Path

import pytest

PACKAGE = Path(__file__).resolve().parents[1] / "survey"
FACES = {"cli", "__main__"}
CORE_MODULES = sorted(
    f"survey.{path.stem}" for path in PACKAGE.glob("*.py")
    if path.stem not in FACES and path.stem != "__init__"
)


def _loaded_after(code: str) -> set[str]:
    result = subprocess.run(
        [sys.executable, "-c", code + "\nimport sys\nprint('\\n'.join(sys.modules))"],
        capture_output=True, text=True, timeout=60, cwd=PACKAGE.parent,
    )
    assert result.returncode == 0, result.stderr
    return set(result.stdout.split())


def test_core_module_list_is_not_empty():
    """The core modules are found (so the next test cannot pass by testing nothing)."""
    assert {"survey.units", "survey.psychro", "survey.errors"} <= set(CORE_MODULES)


@pytest.mark.parametrize("module", CORE_MODULES)
def test_core_module_does_not_import_textual(module):
    """Importing a core module in a fresh interpreter leaves textual unloaded."""
    loaded = _loaded_after(f"import {module}")
    assert module in loaded
    assert not any(name == "textual" or name.startswith("textual.") for name in loaded)


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
