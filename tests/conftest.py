"""Shared fixtures."""

from __future__ import annotations

import os

import pytest
from hypothesis import settings

from survey.cli import main

# CI runs the property tests with a fixed sequence of examples, so a submission's result does
# not depend on luck; a developer's run explores new examples each time (HYPOTHESIS_PROFILE=ci
# reproduces CI locally).
settings.register_profile("ci", derandomize=True, print_blob=True)
settings.register_profile("dev", print_blob=True)
settings.load_profile(os.environ.get("HYPOTHESIS_PROFILE", "ci" if os.environ.get("CI") else "dev"))


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
