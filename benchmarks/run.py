"""Run every benchmark and print ``name: value unit (ratio x vs baseline)``.

Each ``benchmarks/bench_*.py`` module defines ``run() -> list[Result]``. A result's ratio is
our time divided by a baseline timed in the same run (these machines are noisy, so a
ratio measured side by side means more than an absolute number). Benchmarks are never
asserted in the tests.

    python benchmarks/run.py            # all
    python benchmarks/run.py psychro    # only modules whose name contains "psychro"
"""

from __future__ import annotations

import importlib.util
import sys
from pathlib import Path

HERE = Path(__file__).resolve().parent
sys.path.insert(0, str(HERE))
sys.path.insert(0, str(HERE.parent))

from common import Result  # noqa: E402


def _modules(selected: list[str]):
    for path in sorted(HERE.glob("bench_*.py")):
        if selected and not any(word in path.stem for word in selected):
            continue
        spec = importlib.util.spec_from_file_location(path.stem, path)
        module = importlib.util.module_from_spec(spec)
        spec.loader.exec_module(module)
        yield module


def main(argv: list[str]) -> int:
    for module in _modules(argv):
        for result in module.run():
            assert isinstance(result, Result)
            print(result.line(), flush=True)
    return 0


if __name__ == "__main__":
    sys.exit(main(sys.argv[1:]))
