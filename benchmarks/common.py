"""Shared helpers for the benchmarks: a result record and a best-of-N timer."""

from __future__ import annotations

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
