"""CSV export of a survey holding 1.2 million logger samples, against ``json.loads``.

The survey: one of the example sites with four logger series (three rooms and outdoors) of
300 000 one-minute samples each, at the 0.1 °C and 0.1 % resolution loggers record, with
a daily swing and noise (invented numbers; the content only matters for timing). It is
written as JSON with the usual ", " and ": " separators, about 45 MB.

* time: ``survey export FILE --csv OUT`` run as a command (load, checks, every derived
  value, the atomic write), against a process that only runs ``json.loads`` on the same
  bytes (no checks, no output);
* peak memory: the largest resident set of each of those processes (``os.wait4``'s
  ``ru_maxrss``; the survey is made by a third process, so that neither inherits its
  memory), as a ratio too.

The goals for this case on a 2-core machine: under 10 s and under 300 MB.
"""

from __future__ import annotations

import datetime as dt
import json
import math
import os
import random
import subprocess
import sys
import tempfile
import time
from pathlib import Path

import msgspec
from common import Result

from survey import model, store

ROOT = Path(__file__).resolve().parents[1]
SAMPLES_PER_SERIES = 300_000
SERIES = 4


def logger_survey() -> model.Survey:
    """An example site with ``SERIES`` logger series of ``SAMPLES_PER_SERIES`` samples."""
    base = store.load_survey(ROOT / "example_sites" / "winter-flat-bedroom-mould.json")
    rng = random.Random(20250115)
    start = dt.datetime(2024, 10, 1)
    rooms: list[str | None] = [room.id for room in base.rooms[: SERIES - 1]] + [None]
    logs = []
    for k, room in enumerate(rooms):
        outdoors = room is None
        samples = []
        for i in range(SAMPLES_PER_SERIES):
            day = math.sin(2 * math.pi * (i % 1440) / 1440)
            season = math.sin(2 * math.pi * i / SAMPLES_PER_SERIES)
            temp = (6.0 if outdoors else 18.0) + 3 * day + 4 * season + rng.gauss(0, 0.3)
            rh = (85.0 if outdoors else 62.0) - 8 * day - 5 * season + rng.gauss(0, 1.5)
            samples.append(
                model.LogSample(
                    at=start + dt.timedelta(minutes=i),
                    dry_bulb_c=round(temp, 1),
                    rh_pct=round(min(99.0, max(20.0, rh)), 1),
                )
            )
        logs.append(model.LogSeries(room=room, source=f"logger-{k + 1}.csv", samples=samples))
    return msgspec.structs.replace(base, logs=logs)


def write_file(path: Path) -> None:
    """The benchmark's survey, as JSON with the usual separators."""
    doc = msgspec.to_builtins(logger_survey())
    path.write_text(json.dumps(doc, ensure_ascii=False), encoding="utf-8")


def _measure(argv: list[str]) -> tuple[float, float]:
    """Wall time (s) and peak resident memory (MB) of one process running ``argv``."""
    start = time.perf_counter()
    process = subprocess.Popen(argv, cwd=ROOT, stdout=subprocess.DEVNULL)
    _pid, status, usage = os.wait4(process.pid, 0)
    elapsed = time.perf_counter() - start
    process.returncode = os.waitstatus_to_exitcode(status)
    if process.returncode != 0:
        raise RuntimeError(f"{argv[:4]} exited with {process.returncode}")
    return elapsed, usage.ru_maxrss / 1024  # Linux reports kilobytes


def run(repeat: int = 2) -> list[Result]:
    with tempfile.TemporaryDirectory() as folder:
        path = Path(folder) / "logged.json"
        # Made by another process: a child's peak memory counts what it inherited at fork,
        # so this one must stay small.
        subprocess.run([sys.executable, __file__, "--write", str(path)], check=True)
        size_mb = path.stat().st_size / 1e6
        out = Path(folder) / "logged.csv"
        ours = [sys.executable, "-m", "survey", "export", str(path), "--csv", str(out)]
        base = [sys.executable, "-c", f"import json; json.loads(open({str(path)!r}, 'rb').read())"]
        best_ours = best_base = (float("inf"), float("inf"))
        for _ in range(repeat):  # interleaved, best of each
            best_base = min(best_base, _measure(base))
            best_ours = min(best_ours, _measure(ours))
    samples = SERIES * SAMPLES_PER_SERIES
    name = f"export {samples / 1e6:.1f} M logger samples ({size_mb:.0f} MB) to CSV"
    return [
        Result(
            f"{name}, time vs json.loads (goal < 10 s)",
            best_ours[0],
            "s",
            best_ours[0] / best_base[0],
        ),
        Result(
            f"{name}, peak memory vs json.loads (goal < 300 MB)",
            best_ours[1],
            "MB",
            best_ours[1] / best_base[1],
        ),
    ]


if __name__ == "__main__":
    if sys.argv[1:2] == ["--write"]:
        write_file(Path(sys.argv[2]))
    else:
        for result in run():
            print(result.line())
