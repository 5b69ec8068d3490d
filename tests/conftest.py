"""Shared fixtures."""

from __future__ import annotations

import pytest

from survey.cli import main


@pytest.fixture
def check(capsys, monkeypatch):
    """Run `survey check ARGS` in-process at a fixed terminal width; returns
    (status, stdout, stderr). argparse reports its own errors by SystemExit; both paths
    give a status here."""
    monkeypatch.setenv("COLUMNS", "100")

    def _run(*args):
        try:
            status = main(["check", *args])
        except SystemExit as exc:
            status = exc.code
        captured = capsys.readouterr()
        return status, captured.out, captured.err
    return _run
