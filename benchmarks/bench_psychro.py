"""Psychrometric core speed, and start-up time of ``survey check --json``.

1. States per second of ``survey.psychro.state_from_rh`` for 10 000 random indoor readings
   (0.5-40 °C, 5-100 % RH, 80-105 kPa) against the bare psychrolib calls that give the same
   outputs (vapour pressure, humidity ratio, dew point, enthalpy, wet bulb, volume; absolute
   humidity and density from those). Goal: ours ≤ 1.3× the bare time.
2. Wall time of ``survey check --json`` (bare numbers, two surfaces, outdoor air) against
   ``python -c "import psychrolib"``, both from compiled modules (``common.CHILD_ENV``).
   Goal ≤ 4×.
"""

from __future__ import annotations

import random
import shutil
import subprocess
import sys

from common import CHILD_ENV, Result, interleaved_best

N_READINGS = 10_000


def _readings(n: int = N_READINGS, seed: int = 20261201):
    rng = random.Random(seed)
    return [
        (rng.uniform(0.5, 40.0), rng.uniform(5.0, 100.0), rng.uniform(80_000.0, 105_000.0))
        for _ in range(n)
    ]


def _bare(readings):
    import psychrolib

    psychrolib.SetUnitSystem(psychrolib.SI)
    out = []
    for t, rh, p in readings:
        pw = psychrolib.GetVapPresFromRelHum(t, rh / 100.0)
        w = psychrolib.GetHumRatioFromVapPres(pw, p)
        td = psychrolib.GetTDewPointFromVapPres(t, pw)
        h = psychrolib.GetMoistAirEnthalpy(t, w)
        twb = psychrolib.GetTWetBulbFromHumRatio(t, w, p)
        v = psychrolib.GetMoistAirVolume(t, w, p)
        out.append((pw, w, td, h, twb, v, 1000.0 * w / v, (1.0 + w) / v))
    return out


def _ours(readings):
    from survey import psychro

    return [psychro.state_from_rh(t, rh, p) for t, rh, p in readings]


def _check_command():
    script = shutil.which("survey")
    prefix = [script] if script else [sys.executable, "-m", "survey"]
    return [
        *prefix,
        "check",
        "--air-temp",
        "21",
        "--rh",
        "65",
        "--surface-temp",
        "12.5",
        "--surface-temp",
        "16",
        "--outdoor-temp",
        "4",
        "--outdoor-rh",
        "85",
        "--json",
    ]


def run() -> list[Result]:
    readings = _readings()
    ours, bare = interleaved_best(lambda: _ours(readings), lambda: _bare(readings), repeat=5)
    results = [Result("psychro states", N_READINGS / ours, "states/s", ours / bare, goal=1.3)]

    command = _check_command()
    baseline = [sys.executable, "-c", "import psychrolib"]
    run_check = lambda: subprocess.run(command, check=True, capture_output=True, env=CHILD_ENV)  # noqa: E731
    run_base = lambda: subprocess.run(baseline, check=True, capture_output=True, env=CHILD_ENV)  # noqa: E731
    run_check()  # compiles our modules once, into the run's own cache
    ours_s, base_s = interleaved_best(run_check, run_base, repeat=10)
    results.append(
        Result("survey check --json wall time", ours_s * 1000.0, "ms", ours_s / base_s, goal=4.0)
    )
    return results
