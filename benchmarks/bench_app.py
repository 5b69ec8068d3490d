"""The app: start-up, a keystroke's way to the live result, memory with a large survey.

* first paint: ``survey demo`` in a fresh interpreter, headless, until its first screen is
  painted and idle, against a minimal Textual app showing one Label (goal <= 1.25x);
* keystroke: in the surface dialog of a room with 30 surfaces, one digit typed into the
  temperature field until the dialog's live result shows the new judgement, against the
  same digit typed into a plain Input with nothing listening (the goal is absolute: a median
  <= 16 ms, one frame at 60 Hz);
* memory: peak resident memory of the app with a 1 000-room survey open on its room list,
  against the minimal Textual app (the goal is absolute: <= 150 MB).
"""

from __future__ import annotations

import asyncio
import statistics
import subprocess
import sys
import tempfile
import time
from pathlib import Path

from common import CHILD_ENV, Result

HERE = Path(__file__).resolve().parent
ROOT = HERE.parent

_MINIMAL = """
from textual.app import App
from textual.widgets import Label

class Minimal(App):
    def compose(self):
        yield Label("condition-survey")

async def auto(pilot):
    await pilot.pause()
    pilot.app.exit()

Minimal().run(headless=True, auto_pilot=auto)
"""

_DEMO = """
import sys
from pathlib import Path
from survey.app import make_app

async def auto(pilot):
    await pilot.pause()
    pilot.app.exit()

make_app(demo=True, data_dir=Path(sys.argv[1])).run(headless=True, auto_pilot=auto)
"""

_LARGE = """
import sys
from pathlib import Path
from survey.app import make_app

async def auto(pilot):
    await pilot.pause()
    assert type(pilot.app.screen).__name__ == "RoomListScreen", pilot.app.screen
    pilot.app.exit()

make_app(Path(sys.argv[1]), data_dir=Path(sys.argv[2])).run(headless=True, auto_pilot=auto)
"""

# Peak resident memory of this interpreter, kB. /proc's VmHWM belongs to the process image
# (ru_maxrss keeps the parent's peak across fork and exec, so it would report ours).
_PEAK = """
import resource
try:
    with open("/proc/self/status") as status:
        print(next(int(line.split()[1]) for line in status if line.startswith("VmHWM:")))
except OSError:
    print(resource.getrusage(resource.RUSAGE_SELF).ru_maxrss)
"""


def _python(code: str, *args: str) -> tuple[float, str]:
    start = time.perf_counter()
    done = subprocess.run(
        [sys.executable, "-c", code, *args],
        cwd=ROOT,
        check=True,
        capture_output=True,
        text=True,
        env=CHILD_ENV,
    )
    return time.perf_counter() - start, done.stdout


def first_paint(repeat: int = 5) -> Result:
    ours = base = float("inf")
    with tempfile.TemporaryDirectory() as data:
        _python(_DEMO, data)  # the demo copy made once; warm the file and module caches
        _python(_MINIMAL)
        for _ in range(repeat):
            base = min(base, _python(_MINIMAL)[0])
            ours = min(ours, _python(_DEMO, data)[0])
    return Result("app first paint (survey demo)", ours * 1000, "ms", ours / base, 1.25)


async def _keystrokes(count: int = 25) -> tuple[list[float], list[float]]:
    from textual import events
    from textual.app import App
    from textual.widgets import Input, Static

    sys.path.insert(0, str(HERE))
    from bench_store import synthetic_survey

    from survey import model, store
    from survey.app import make_app

    survey = synthetic_survey(1)
    room = survey.visits[0].rooms[0]
    room.surfaces = [
        model.SurfaceReading(
            location=f"spot {n}", element="external_wall", surface_temp_c=10.0 + n / 10
        )
        for n in range(30)
    ]
    ours: list[float] = []
    base: list[float] = []
    with tempfile.TemporaryDirectory() as folder:
        path = Path(folder) / "thirty.json"
        store.save_survey(survey, path)
        app = make_app(path, data_dir=Path(folder) / "data")
        async with app.run_test(size=(120, 40)) as pilot:
            await pilot.pause()
            app.open_room("r0")
            await pilot.pause()
            app.screen.query_one("#surfaces").focus()
            await pilot.press("e")
            await pilot.pause()
            preview = app.screen.query_one("#surface-preview", Static)
            field = app.screen.query_one("#surface-temp-input", Input)
            field.focus()
            for n in range(count):
                before = str(preview.render())
                digit = str(n % 10)
                start = time.perf_counter()
                app.post_message(events.Key(digit, digit))
                while str(preview.render()) == before:
                    await asyncio.sleep(0)
                ours.append(time.perf_counter() - start)
                await pilot.press("backspace")
                await pilot.pause()

        class Plain(App):
            def compose(self):
                yield Input()

        plain = Plain()
        async with plain.run_test(size=(120, 40)) as pilot:
            box = plain.query_one(Input)
            box.focus()
            await pilot.pause()
            for n in range(count):
                before = box.value
                digit = str(n % 10)
                start = time.perf_counter()
                plain.post_message(events.Key(digit, digit))
                while box.value == before:
                    await asyncio.sleep(0)
                base.append(time.perf_counter() - start)
                await pilot.press("backspace")
                await pilot.pause()
    return ours, base


def keystroke() -> Result:
    ours, base = asyncio.run(_keystrokes())
    median, median_base = statistics.median(ours), statistics.median(base)
    return Result(
        "app keystroke to live result, 30 surfaces (median; goal <= 16 ms)",
        median * 1000,
        "ms",
        median / median_base,
    )


def memory() -> Result:
    sys.path.insert(0, str(HERE))
    from bench_store import synthetic_survey

    from survey import store

    with tempfile.TemporaryDirectory() as folder:
        path = Path(folder) / "large.json"
        store.save_survey(synthetic_survey(1000), path)
        ours_kb = int(_python(_LARGE + _PEAK, str(path), str(Path(folder) / "data"))[1].split()[-1])
        base_kb = int(_python(_MINIMAL + _PEAK)[1].split()[-1])
    return Result(
        "app peak memory, 1 000 rooms open (goal <= 150 MB)",
        ours_kb / 1024,
        "MB",
        ours_kb / base_kb,
    )


def run() -> list[Result]:
    return [first_paint(), keystroke(), memory()]
