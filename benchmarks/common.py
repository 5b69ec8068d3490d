"""Shared helpers for the benchmarks: a result record, a best-of-N timer, and the
environment for timing a fresh interpreter."""

from __future__ import annotations

import atexit
import os
import shutil
import tempfile
import time
from collections.abc import Callable
from dataclasses import dataclass


@dataclass(frozen=True)
class Result:
    name: str
    value: float
    unit: str
    ratio: float  # our time / baseline time, both measured in this run
    goal: float | None = None  # the ratio we aim to stay under, if any

    def line(self) -> str:
        goal = f", goal <= {self.goal:g}x" if self.goal is not None else ""
        return f"{self.name}: {self.value:.4g} {self.unit} ({self.ratio:.2f}x vs baseline{goal})"


def best_time(fn: Callable[[], object], repeat: int = 5) -> float:
    """The fastest of ``repeat`` wall-clock timings of ``fn()``, in seconds."""
    best = float("inf")
    for _ in range(repeat):
        start = time.perf_counter()
        fn()
        best = min(best, time.perf_counter() - start)
    return best


def interleaved_best(ours: Callable[[], object], base: Callable[[], object], repeat: int = 5):
    """Best times of ``ours`` and ``base``, alternating runs so drift hits both alike."""
    best_ours = best_base = float("inf")
    for _ in range(repeat):
        start = time.perf_counter()
        base()
        best_base = min(best_base, time.perf_counter() - start)
        start = time.perf_counter()
        ours()
        best_ours = min(best_ours, time.perf_counter() - start)
    return best_ours, best_base


#: Compiled modules for the child interpreters a benchmark starts, kept for the run only.
#: An installed survey runs from compiled modules, as its dependencies do; with
#: PYTHONDONTWRITEBYTECODE set (some shells and CI set it) our sources would be compiled
#: afresh at every start while the dependencies' came compiled from their wheels, and a
#: start-up ratio would measure the compiler.
_PYCACHE = tempfile.mkdtemp(prefix="bench-pycache-")
atexit.register(shutil.rmtree, _PYCACHE, ignore_errors=True)
CHILD_ENV = {
    **{k: v for k, v in os.environ.items() if k != "PYTHONDONTWRITEBYTECODE"},
    "PYTHONPYCACHEPREFIX": _PYCACHE,
}
