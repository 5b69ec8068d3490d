"""Survey files: load and save of a synthetic 1000-room survey against plain ``json``.

* load: ``store.load_survey`` (read, typed decode with every range checked, the check for
  keys given twice, cross-record checks) against ``json.loads`` of the same bytes (no checks
  at all);
* the duplicate-key check alone (a second parse by the C JSON scanner with a hook that
  builds nothing) against the same ``json.loads``;
* load of a survey holding one logger series of 200 000 samples against ``json.loads`` (the
  duplicate-key check skips the samples, which cannot hold keys);
* save: ``store.save_survey`` (encode, re-check, indent, temp file, backup link, rename)
  with ``os.fsync`` stubbed out, against ``json.dumps(..., indent=2)`` of the same data plus
  a plain ``open``/``write`` of the result;
* save over a file this process did not read or write (so the store first checks that the
  file there loads, and never rotates a damaged one into the backup), without fsync;
* save with fsync: the real thing, against the same baseline (no goal: the disk decides).
"""

from __future__ import annotations

import datetime as dt
import json
import os
import tempfile
from pathlib import Path
from unittest import mock

from common import Result, interleaved_best

from survey import model, store
from survey.store import decoding, survey_file

ROOMS = 1000
SAMPLES = 200_000


def synthetic_survey(rooms: int = ROOMS) -> model.Survey:
    """A survey with ``rooms`` rooms, each seen on one visit with air, four surfaces and two
    material readings (plausible numbers; the content does not matter for timing)."""
    start = dt.datetime(2025, 1, 15, 9, 0)
    instruments = [
        model.Instrument(
            id="th",
            kind="thermo_hygrometer",
            name="Thermo-hygrometer",
            air_temp_accuracy_k=0.3,
            rh_accuracy_pct=2.0,
        ),
        model.Instrument(
            id="ir",
            kind="surface_thermometer",
            name="IR thermometer",
            surface_temp_accuracy_k=1.0,
            emissivity=0.95,
        ),
        model.Instrument(id="mm", kind="moisture_meter", name="Moisture meter"),
    ]
    uses = ("bedroom", "bathroom", "kitchen", "living", "office", "storage")
    elements = ("external_wall", "internal_wall", "ceiling", "glazing")
    room_list, visits = [], []
    for i in range(rooms):
        room_list.append(
            model.Room(
                id=f"r{i}",
                name=f"Room {i}",
                level=i // 50,
                use=uses[i % len(uses)],
                floor_area_m2=10.0 + i % 7,
                height_m=2.4,
                occupants=i % 3,
            )
        )
        at = start + dt.timedelta(seconds=30 * i)
        visits.append(
            model.RoomVisit(
                room=f"r{i}",
                air=model.AirReading(
                    dry_bulb_c=18.0 + (i % 40) / 10,
                    rh_pct=55.0 + i % 20,
                    taken_at=at,
                    instrument="th",
                ),
                surfaces=[
                    model.SurfaceReading(
                        location=f"{element} spot {i}",
                        element=element,
                        surface_temp_c=12.0 + (i + k) % 60 / 10,
                        taken_at=at,
                        instrument="ir",
                        mould_visible=(i + k) % 9 == 0,
                    )
                    for k, element in enumerate(elements)
                ],
                materials=[
                    model.MaterialReading(
                        location=f"skirting {i}",
                        material="softwood",
                        value=12.0 + i % 15,
                        scale="mc_pct",
                        method="pin",
                        taken_at=at,
                        instrument="mm",
                    ),
                    model.MaterialReading(
                        location=f"plaster {i}",
                        material="plaster",
                        value=20.0 + i % 50,
                        scale="relative",
                        method="pinless",
                        taken_at=at,
                        instrument="mm",
                    ),
                ],
                observations=model.Observations(odour="none"),
            )
        )
    visit = model.Visit(
        started_at=start,
        label="Benchmark visit",
        outdoor=model.AirReading(dry_bulb_c=4.0, rh_pct=85.0),
        rooms=visits,
    )
    return model.Survey(
        site=model.Site(reference="Benchmark site"),
        instruments=instruments,
        rooms=room_list,
        visits=[visit],
    )


def logged_survey(samples: int = SAMPLES) -> model.Survey:
    """A small survey with one room logger of ``samples`` one-minute samples."""
    start = dt.datetime(2025, 1, 15, 9, 0)
    survey = synthetic_survey(rooms=5)
    survey.logs.append(
        model.LogSeries(
            room="r0",
            source="logger.csv",
            samples=[
                model.LogSample(
                    at=start + dt.timedelta(minutes=i),
                    dry_bulb_c=18.0 + i % 50 / 10,
                    rh_pct=50.0 + i % 300 / 10,
                )
                for i in range(samples)
            ],
        )
    )
    return survey


def run() -> list[Result]:
    survey = synthetic_survey()
    with tempfile.TemporaryDirectory() as folder:
        path = Path(folder) / "bench.json"
        store.save_survey(survey, path)
        data = path.read_bytes()
        builtins = json.loads(data)
        size_mb = len(data) / 1e6

        def our_load() -> object:
            return store.load_survey(path)

        def json_load() -> object:
            with open(path, "rb") as handle:
                return json.loads(handle.read())

        load_ours, load_base = interleaved_best(our_load, json_load, repeat=7)
        dup_ours, dup_base = interleaved_best(
            lambda: decoding.duplicate_key(data), json_load, repeat=7
        )

        logged = Path(folder) / "logged.json"
        store.save_survey(logged_survey(), logged)
        logged_mb = logged.stat().st_size / 1e6

        def json_load_logged() -> object:
            with open(logged, "rb") as handle:
                return json.loads(handle.read())

        logged_ours, logged_base = interleaved_best(
            lambda: store.load_survey(logged), json_load_logged, repeat=3
        )

        plain = Path(folder) / "plain.json"

        def json_save() -> None:
            text = json.dumps(builtins, indent=2)
            with open(plain, "w", encoding="utf-8") as handle:
                handle.write(text)

        def our_save() -> None:
            store.save_survey(survey, path)

        def our_save_unknown() -> None:
            survey_file.forget_known_good()  # as if another program had written the file
            store.save_survey(survey, path)

        with mock.patch.object(os, "fsync", return_value=None):
            save_ours, save_base = interleaved_best(our_save, json_save, repeat=7)
            checked_ours, checked_base = interleaved_best(our_save_unknown, json_save, repeat=7)
        synced_ours, synced_base = interleaved_best(our_save, json_save, repeat=5)

    return [
        Result(
            f"store load, {ROOMS} rooms ({size_mb:.1f} MB) vs json.loads",
            load_ours * 1e3,
            "ms",
            load_ours / load_base,
            goal=3.0,
        ),
        Result(
            f"store duplicate-key check alone, {ROOMS} rooms vs json.loads",
            dup_ours * 1e3,
            "ms",
            dup_ours / dup_base,
        ),
        Result(
            f"store load, {SAMPLES} logger samples ({logged_mb:.1f} MB) vs json.loads",
            logged_ours * 1e3,
            "ms",
            logged_ours / logged_base,
            goal=3.0,
        ),
        Result(
            f"store save without fsync, {ROOMS} rooms vs json.dumps + write",
            save_ours * 1e3,
            "ms",
            save_ours / save_base,
            goal=2.0,
        ),
        Result(
            f"store save over a file not read first (load check), no fsync, {ROOMS} rooms "
            "vs json.dumps + write",
            checked_ours * 1e3,
            "ms",
            checked_ours / checked_base,
        ),
        Result(
            f"store save with fsync, {ROOMS} rooms vs json.dumps + write",
            synced_ours * 1e3,
            "ms",
            synced_ours / synced_base,
        ),
    ]
