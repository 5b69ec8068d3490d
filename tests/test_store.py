"""Survey files: round trip, damaged and hostile files, failed saves, backups, migrations."""

from __future__ import annotations

import copy
import datetime as dt
import errno
import json
import os
import shutil
import subprocess
import sys
import tempfile
import textwrap
from pathlib import Path

import msgspec
import pytest
from hypothesis import HealthCheck, given, settings
from hypothesis import strategies as st

from survey import domain, model, model_checks, psychro, store
from survey.errors import SurveyFileError
from survey.store import fileio

ROOT = Path(__file__).resolve().parents[1]
EXAMPLES = ROOT / "example_sites"
BASEMENT = EXAMPLES / "basement-burst-pipe-drying.json"
DATA = Path(__file__).resolve().parent / "data"


def _example_bytes() -> bytes:
    return BASEMENT.read_bytes()


def _example_doc() -> dict:
    return json.loads(_example_bytes())


# --- strategies for any valid survey ---------------------------------------------------------


def _floats(low: float, high: float, *, exclude_low: bool = False) -> st.SearchStrategy[float]:
    return st.floats(low, high, exclude_min=exclude_low, allow_nan=False, allow_infinity=False)


_text = st.text(max_size=20)
_name = st.text(min_size=1, max_size=20)
_ids = st.from_regex(r"\A[A-Za-z0-9][A-Za-z0-9_.-]{0,8}\Z")
_file_names = st.text(
    st.characters(min_codepoint=0x20, blacklist_categories=("Cs",)), min_size=1, max_size=20
).filter(lambda n: not model.photo_name_problem(n))
_times = st.one_of(
    st.none(),
    st.datetimes(dt.datetime(1990, 1, 1), dt.datetime(2100, 1, 1)),
    st.builds(
        lambda d, minutes: d.replace(tzinfo=dt.timezone(dt.timedelta(minutes=minutes))),
        st.datetimes(dt.datetime(1990, 1, 1), dt.datetime(2100, 1, 1)),
        st.integers(-12 * 60, 14 * 60),
    ),
)


def _maybe(strategy):
    return st.one_of(st.none(), strategy)


def _room(**fields) -> model.Room:
    """A room whose floor area × height, when it gives the volume, lies in the domain."""
    room = model.Room(**fields)
    if model_checks._volume_problem(room):
        room.height_m = None
    return room


@st.composite
def surveys(draw) -> model.Survey:
    instrument_ids = draw(st.lists(_ids, max_size=3, unique=True))
    room_ids = draw(st.lists(_ids, min_size=1, max_size=4, unique=True))
    instrument_ref = _maybe(st.sampled_from(instrument_ids)) if instrument_ids else st.none()

    def air():
        return st.builds(
            model.AirReading,
            dry_bulb_c=_floats(-50, 70),
            rh_pct=_floats(psychro.RH_MIN_PCT, 100),
            taken_at=_times,
            instrument=instrument_ref,
        )

    instruments = [
        draw(
            st.builds(
                model.Instrument,
                id=st.just(i),
                kind=st.sampled_from(model.InstrumentKind.__args__),
                name=_name,
                serial=_text,
                calibrated_on=_maybe(st.dates(dt.date(1990, 1, 1))),
                air_temp_accuracy_k=_maybe(
                    _floats(domain.AIR_TEMP_ACCURACY_MIN_K, domain.AIR_TEMP_ACCURACY_MAX_K)
                ),
                rh_accuracy_pct=_maybe(
                    _floats(domain.RH_ACCURACY_MIN_PCT, domain.RH_ACCURACY_MAX_PCT)
                ),
                surface_temp_accuracy_k=_maybe(
                    _floats(domain.SURFACE_TEMP_ACCURACY_MIN_K, domain.SURFACE_TEMP_ACCURACY_MAX_K)
                ),
                emissivity=_maybe(_floats(0, 1, exclude_low=True)),
                notes=_text,
            )
        )
        for i in instrument_ids
    ]
    rooms = [
        draw(
            st.builds(
                _room,
                id=st.just(r),
                name=_name,
                level=st.integers(-10, 200),
                use=st.sampled_from(model.RoomUse.__args__),
                volume_m3=_maybe(_floats(domain.ROOM_VOLUME_MIN_M3, domain.ROOM_VOLUME_MAX_M3)),
                floor_area_m2=_maybe(_floats(domain.FLOOR_AREA_MIN_M2, domain.FLOOR_AREA_MAX_M2)),
                height_m=_maybe(_floats(domain.ROOM_HEIGHT_MIN_M, domain.ROOM_HEIGHT_MAX_M)),
                occupants=st.integers(0, domain.OCCUPANTS_MAX),
                is_reference=st.booleans(),
                notes=_text,
            )
        )
        for r in room_ids
    ]
    surface = st.builds(
        model.SurfaceReading,
        location=_name,
        element=st.sampled_from(model.Element.__args__),
        surface_temp_c=_floats(-60, 90),
        material=_text,
        taken_at=_times,
        instrument=instrument_ref,
        condensation_seen=st.booleans(),
        mould_visible=st.booleans(),
    )
    material = st.builds(
        model.MaterialReading,
        location=_name,
        material=_name,
        value=_floats(0, 1000),
        scale=st.sampled_from(model.MoistureScale.__args__),
        dry_standard=st.booleans(),
        method=_maybe(st.sampled_from(("pin", "pinless"))),
        taken_at=_times,
        instrument=instrument_ref,
    )
    observations = st.builds(
        lambda visible, area, **kw: model.Observations(
            mould_visible=visible, mould_area_m2=area if visible else None, **kw
        ),
        st.booleans(),
        _maybe(_floats(0, domain.MOULD_AREA_MAX_M2)),
        staining=st.booleans(),
        condensation_seen=st.booleans(),
        odour=_maybe(st.sampled_from(model.Odour.__args__)),
        water_category=_maybe(st.sampled_from((1, 2, 3))),
        notes=_text,
    )
    equipment = st.builds(
        model.Equipment,
        kind=st.sampled_from(model.EquipmentKind.__args__),
        label=_text,
        running=st.booleans(),
        capacity_l_per_day=_maybe(_floats(0, 1e4, exclude_low=True)),
        water_removed_l=_maybe(_floats(0, 1e5)),
        outlet=_maybe(air()),
    )
    visits = []
    for _ in range(draw(st.integers(0, 3))):
        seen = draw(st.lists(st.sampled_from(room_ids), unique=True, max_size=len(room_ids)))
        room_visits = [
            draw(
                st.builds(
                    model.RoomVisit,
                    room=st.just(r),
                    air=_maybe(air()),
                    surfaces=st.lists(surface, max_size=3),
                    materials=st.lists(material, max_size=2),
                    observations=observations,
                    equipment=st.lists(equipment, max_size=2),
                    heating_on=_maybe(st.booleans()),
                    windows_open=_maybe(st.booleans()),
                    notes=_text,
                    photos=st.lists(_file_names, max_size=2),
                )
            )
            for r in seen
        ]
        visits.append(
            draw(
                st.builds(
                    model.Visit,
                    started_at=st.datetimes(dt.datetime(1990, 1, 1), dt.datetime(2100, 1, 1)),
                    label=_text,
                    weather=_text,
                    outdoor=_maybe(air()),
                    pressure_pa=_maybe(_floats(50_000, 110_000)),
                    rooms=st.just(room_visits),
                )
            )
        )
    sample = st.builds(
        model.LogSample,
        at=st.datetimes(dt.datetime(1990, 1, 1), dt.datetime(2100, 1, 1)),
        dry_bulb_c=_floats(-50, 70),
        rh_pct=_floats(psychro.RH_MIN_PCT, 100),
    )
    logs = draw(
        st.lists(
            st.builds(
                model.LogSeries,
                room=_maybe(st.sampled_from(room_ids)),
                source=_name,
                samples=st.lists(sample, max_size=5),
                instrument=instrument_ref,
                source_sha256=_maybe(st.from_regex(r"\A[0-9a-f]{64}\Z")),
                imported_at=_times,
                skipped_rows=st.integers(0, 10**6),
            ),
            max_size=2,
        )
    )
    site = draw(
        st.builds(
            model.Site,
            reference=_name,
            address=_text,
            client=_text,
            purpose=st.sampled_from(model.Purpose.__args__),
            inspector=_text,
            unit_system=st.sampled_from(("si", "ip")),
            altitude_m=_maybe(_floats(-500, 5000)),
            pressure_pa=_maybe(_floats(50_000, 110_000)),
            construction=_text,
            year_built=_maybe(st.integers(1000, 2200)),
            notes=_text,
        )
    )
    return model.Survey(
        site=site,
        instruments=instruments,
        rooms=rooms,
        visits=visits,
        logs=logs,
        created_at=draw(_times),
    )


@settings(max_examples=60, deadline=None, suppress_health_check=[HealthCheck.too_slow])
@given(surveys())
@pytest.mark.slow
def test_any_valid_survey_saves_and_loads_equal(survey):
    """Round trip: any valid survey saved to a file loads back equal, and saving is stable."""
    with tempfile.TemporaryDirectory() as folder:
        path = Path(folder) / "s.json"
        store.save_survey(survey, path)
        loaded = store.load_survey(path)
        assert loaded == survey
        first = path.read_bytes()
        store.save_survey(loaded, path)
        assert path.read_bytes() == first


# --- saving ------------------------------------------------------------------------------


def test_save_keeps_the_previous_version_as_bak(tmp_path):
    """The second save leaves the first version in NAME.json.bak and no temporary files."""
    path = tmp_path / "site.json"
    first = store.new_survey("First")
    second = msgspec.structs.replace(first, site=model.Site(reference="Second"))
    store.save_survey(first, path)
    assert not store.backup_path(path).exists()
    store.save_survey(second, path)
    assert store.load_survey(path).site.reference == "Second"
    assert store.load_survey(store.backup_path(path)).site.reference == "First"
    assert sorted(p.name for p in tmp_path.iterdir()) == ["site.json", "site.json.bak"]


def test_save_preserves_file_permissions(tmp_path):
    """A file made private (0600) stays private after a save."""
    path = tmp_path / "site.json"
    store.save_survey(store.new_survey("x"), path)
    os.chmod(path, 0o600)
    store.save_survey(store.new_survey("y"), path)
    assert (path.stat().st_mode & 0o777) == 0o600


def test_save_through_a_symlink_writes_the_real_file(tmp_path):
    """Saving to a symlinked survey updates the file it points to and keeps the link."""
    real = tmp_path / "real.json"
    link = tmp_path / "link.json"
    store.save_survey(store.new_survey("x"), real)
    link.symlink_to(real)
    store.save_survey(store.new_survey("y"), link)
    assert link.is_symlink()
    assert store.load_survey(real).site.reference == "y"


def test_exclusive_save_refuses_an_existing_file(tmp_path):
    """exclusive=True (used by `survey new`) never replaces an existing file."""
    path = tmp_path / "site.json"
    path.write_text("not mine")
    with pytest.raises(SurveyFileError, match="already exists"):
        store.save_survey(store.new_survey("x"), path, exclusive=True)
    assert path.read_text() == "not mine"


def test_invalid_survey_in_memory_is_not_saved(tmp_path):
    """A reading set to NaN in memory is refused on save, naming the field; the file stays."""
    path = tmp_path / "s.json"
    shutil.copy(BASEMENT, path)
    before = path.read_bytes()
    survey = store.load_survey(path)
    survey.visits[1].rooms[0].air.dry_bulb_c = float("nan")
    with pytest.raises(SurveyFileError) as err:
        store.save_survey(survey, path)
    assert err.value.where == "visits[1].rooms[0].air.dry_bulb_c"
    assert err.value.problem.startswith("not saved")
    assert path.read_bytes() == before


def test_survey_with_unwritable_value_is_not_saved(tmp_path):
    """A value msgspec cannot encode (an object, a lone surrogate) gives SurveyFileError."""
    survey = store.new_survey("x")
    survey.site.notes = "\ud800"
    with pytest.raises(SurveyFileError, match="not saved"):
        store.save_survey(survey, tmp_path / "s.json")
    survey.site.notes = object()  # type: ignore[assignment]
    with pytest.raises(SurveyFileError, match="not saved"):
        store.save_survey(survey, tmp_path / "s.json")
    assert list(tmp_path.iterdir()) == []


def _assert_failed_save_left_everything(tmp_path, path, before, survey, snapshot, err):
    assert "not saved" in err.value.problem
    assert path.read_bytes() == before
    assert survey == snapshot
    leftovers = [p.name for p in tmp_path.iterdir() if p.name.endswith(".tmp")]
    assert leftovers == []


@pytest.mark.parametrize(
    ("stage", "code", "words"),
    [
        ("replace", errno.EROFS, "read-only file system"),
        ("fsync", errno.ENOSPC, "disk is full"),
        ("write", errno.ENOSPC, "disk is full"),
        ("open", errno.EACCES, "permission denied"),
    ],
)
def test_failed_save_leaves_old_file_and_survey(tmp_path, monkeypatch, stage, code, words):
    """A save failing at any step raises a clear error; the old file, the survey in memory
    and the folder (no temporary file) are as before."""
    path = tmp_path / "s.json"
    shutil.copy(BASEMENT, path)
    before = path.read_bytes()
    survey = store.load_survey(path)
    survey.visits[0].notes = "edited"
    snapshot = copy.deepcopy(survey)
    real = getattr(os, stage)

    def failing(*args, **kwargs):
        if (
            stage in ("write", "fsync")
            or (stage == "open" and str(args[0]).endswith(".tmp"))
            or (stage == "replace" and str(args[1]) == str(path))
        ):
            raise OSError(code, os.strerror(code))
        return real(*args, **kwargs)

    monkeypatch.setattr(os, stage, failing)
    with pytest.raises(SurveyFileError) as err:
        store.save_survey(survey, path)
    monkeypatch.undo()
    assert words in err.value.problem
    _assert_failed_save_left_everything(tmp_path, path, before, survey, snapshot, err)


def test_save_where_the_folder_is_a_file(tmp_path):
    """Saving under a path whose 'folder' is a file fails clearly and creates nothing."""
    blocker = tmp_path / "notafolder"
    blocker.write_text("x")
    with pytest.raises(SurveyFileError) as err:
        store.save_survey(store.new_survey("x"), blocker / "s.json")
    assert "not a folder" in err.value.problem
    assert sorted(p.name for p in tmp_path.iterdir()) == ["notafolder"]


def test_save_into_a_missing_folder(tmp_path):
    """Saving into a folder that does not exist says so."""
    with pytest.raises(SurveyFileError, match="folder does not exist"):
        store.save_survey(store.new_survey("x"), tmp_path / "nope" / "s.json")


_CHILD_PRELUDE = textwrap.dedent("""
    import copy, hashlib, json, os, sys
    from pathlib import Path
    from survey import store
    from survey.errors import SurveyFileError

    def attempt(path):
        survey = store.load_survey(path)
        survey.site.notes = "x" * 20000
        for visit in survey.visits:
            visit.notes = "y" * 20000
        snapshot = copy.deepcopy(survey)
        before = hashlib.sha256(path.read_bytes()).hexdigest()
        try:
            store.save_survey(survey, path)
            problem = None
        except SurveyFileError as exc:
            problem = exc.problem
        print(json.dumps({
            "problem": problem,
            "unchanged": hashlib.sha256(path.read_bytes()).hexdigest() == before,
            "survey_intact": survey == snapshot,
            "leftovers": [p.name for p in path.parent.iterdir() if p.name.endswith(".tmp")],
        }))
""")


def test_save_beyond_the_file_size_limit_fails_cleanly(tmp_path):
    """With a real kernel write failure (RLIMIT_FSIZE, EFBIG) the save fails, the old file and
    the survey are intact and no temporary file remains."""
    path = tmp_path / "s.json"
    shutil.copy(BASEMENT, path)
    code = _CHILD_PRELUDE + textwrap.dedent("""
        import resource, signal
        signal.signal(signal.SIGXFSZ, signal.SIG_IGN)
        limit = path_size = Path(sys.argv[1]).stat().st_size + 1000
        resource.setrlimit(resource.RLIMIT_FSIZE, (limit, limit))
        attempt(Path(sys.argv[1]))
    """)
    result = subprocess.run(
        [sys.executable, "-c", code, str(path)],
        capture_output=True,
        text=True,
        timeout=60,
        cwd=ROOT,
    )
    assert result.returncode == 0, result.stderr
    outcome = json.loads(result.stdout)
    assert outcome["problem"] and "largest size" in outcome["problem"]
    assert outcome["unchanged"] and outcome["survey_intact"] and outcome["leftovers"] == []


def test_save_into_a_read_only_folder_fails_cleanly(tmp_path):
    """In a really read-only folder (a tmpfs remounted read-only in a private mount
    namespace, which stops root too) the save fails clearly and changes nothing."""
    if shutil.which("unshare") is None or shutil.which("mount") is None:
        pytest.skip("needs unshare and mount")
    folder = tmp_path / "ro"
    folder.mkdir()
    code = _CHILD_PRELUDE + textwrap.dedent("""
        import subprocess
        folder, example = Path(sys.argv[1]), Path(sys.argv[2])
        subprocess.run(["mount", "-t", "tmpfs", "-o", "size=4m", "tmpfs", str(folder)], check=True)
        (folder / "s.json").write_bytes(example.read_bytes())
        subprocess.run(["mount", "-o", "remount,ro", str(folder)], check=True)
        attempt(folder / "s.json")
        try:
            store.open_for_editing(folder / "s.json")
        except SurveyFileError as exc:
            print(json.dumps({"lock_problem": exc.problem}))
    """)
    result = subprocess.run(
        [
            "unshare",
            "--user",
            "--map-root-user",
            "--mount",
            sys.executable,
            "-c",
            code,
            str(folder),
            str(BASEMENT),
        ],
        capture_output=True,
        text=True,
        timeout=60,
        cwd=ROOT,
    )
    if result.returncode != 0 and ("mount" in result.stderr or "unshare" in result.stderr):
        pytest.skip(f"cannot make a read-only mount here: {result.stderr.strip()[-200:]}")
    assert result.returncode == 0, result.stderr
    outcome, lock = (json.loads(line) for line in result.stdout.splitlines())
    assert "read-only file system" in outcome["problem"]
    assert outcome["unchanged"] and outcome["survey_intact"] and outcome["leftovers"] == []
    assert "lock file" in lock["lock_problem"] and "read-only" in lock["lock_problem"]


# --- loading damaged and hostile files --------------------------------------------------------


def _with(doc_change) -> bytes:
    doc = _example_doc()
    doc_change(doc)
    return json.dumps(doc).encode()


def _set(path: list, value):
    def change(doc):
        node = doc
        for key in path[:-1]:
            node = node[key]
        node[path[-1]] = value

    return change


def _nested(depth: int) -> bytes:
    return b"[" * depth + b"]" * depth


GOOD = _example_bytes()

HOSTILE = {
    "empty": (b"", "", "empty"),
    "only whitespace": (b" \n\t\n", "", "empty"),
    "random garbage": (bytes(range(1, 256)) * 40, "line 1, column 1", "not valid JSON"),
    "all zero bytes": (b"\x00" * 4096, "", "zero bytes"),
    "nul byte inside": (GOOD[:100] + b"\x00" + GOOD[100:], "", "NUL"),
    "truncated in half": (GOOD[: len(GOOD) // 2], "line", "truncated"),
    "last byte missing": (GOOD.rstrip()[:-1], "line", "truncated"),
    "utf-16": (GOOD.decode().encode("utf-16"), "", "UTF-16"),
    "invalid utf-8": (GOOD.replace(b"Example Row", b"Example \xff\xfe Row", 1), "line", "UTF-8"),
    "zip archive": (b"PK\x03\x04" + b"\x00" * 50, "", "ZIP"),
    "top level array": (b"[1, 2, 3]", "", "top level is not a JSON object"),
    "top level number": (b"42", "", "top level is not a JSON object"),
    "trailing text": (GOOD + b"\nEND OF MESSAGE\n", "line", "more text after"),
    "missing schema_version": (
        _with(lambda d: d.pop("schema_version")),
        "",
        "this is not a condition-survey file (it has no schema_version)",
    ),
    "schema_version as text": (
        _with(_set(["schema_version"], "1")),
        "schema_version",
        "whole number",
    ),
    "newer schema_version": (
        _with(_set(["schema_version"], 99)),
        "schema_version",
        "newer condition-survey",
    ),
    "negative schema_version": (
        _with(_set(["schema_version"], -1)),
        "schema_version",
        "unknown schema version",
    ),
    "wrong type": (
        _with(_set(["visits", 1, "rooms", 0, "air", "dry_bulb_c"], "20")),
        "visits[1].rooms[0].air.dry_bulb_c",
        "expected a number, found text '20'",
    ),
    "surface out of range": (
        _with(_set(["visits", 1, "rooms", 2, "surfaces", 0, "surface_temp_c"], 500)),
        "visits[1].rooms[2].surfaces[0].surface_temp_c",
        "500 is out of range; allowed: between -60 and 90 °C",
    ),
    "rh above 100": (
        _with(_set(["visits", 0, "outdoor", "rh_pct"], 101)),
        "visits[0].outdoor.rh_pct",
        "between 0.1 and 100 %",
    ),
    "huge number": (
        GOOD.replace(b'"altitude_m": 62.0', b'"altitude_m": 1e400'),
        "site.altitude_m",
        "too large",
    ),
    "huge integer": (
        _with(_set(["rooms", 0, "occupants"], 10**40)),
        "rooms[0].occupants",
        "out of range",
    ),
    "NaN literal": (
        GOOD.replace(b'"altitude_m": 62.0', b'"altitude_m": NaN'),
        "line",
        "not valid JSON",
    ),
    "Infinity literal": (
        GOOD.replace(b'"altitude_m": 62.0', b'"altitude_m": Infinity'),
        "line",
        "not valid JSON",
    ),
    "deeply nested value": (
        GOOD.replace(b'"notes": "Burst', b'"notes": ' + _nested(200_000) + b', "x": "Burst', 1),
        "",
        "nested too deeply",
    ),
    "deeply nested document": (_nested(500_000), "", "top level is not a JSON object"),
    "deeply nested object": (
        b'{"schema_version": 1, "site": ' + b'{"a": ' * 200_000 + b"1" + b"}" * 200_000 + b"}",
        "",
        "nested too deeply",
    ),
    "50 MB string": (
        _with(_set(["site", "notes"], "m" * 50_000_000)),
        "site.notes",
        "text too long (50000000 characters; at most 20000)",
    ),
    "unknown field": (
        _with(lambda d: d["visits"][0]["rooms"][0]["air"].update(rh=50)),
        "visits[0].rooms[0].air.rh",
        "did you mean 'rh_pct'",
    ),
    "misspelt choice": (
        _with(_set(["rooms", 0, "use"], "basment")),
        "rooms[0].use",
        "did you mean 'basement'",
    ),
    "missing required field": (
        _with(lambda d: d["rooms"][1].pop("name")),
        "rooms[1].name",
        "required field 'name' is missing",
    ),
    "bad date and time": (
        _with(_set(["visits", 2, "started_at"], "5 Feb 2025")),
        "visits[2].started_at",
        "not a date and time",
    ),
    "null where an object belongs": (_with(_set(["site"], None)), "site", "expected an object"),
    "dangling room reference": (
        _with(_set(["visits", 2, "rooms", 1, "room"], "garage")),
        "visits[2].rooms[1].room",
        "no room with id 'garage'",
    ),
    "duplicate room id": (
        _with(lambda d: d["rooms"][1].update(id="family")),
        "rooms[1].id",
        "used twice",
    ),
    "short logger sample": (
        _with(
            _set(
                ["logs"],
                [{"room": "family", "source": "a.csv", "samples": [["2025-02-03T10:00:00", 18.0]]}],
            )
        ),
        "logs[0].samples[0]",
        "expected a list of 3 items",
    ),
    "long logger sample": (
        _with(
            _set(
                ["logs"],
                [
                    {
                        "room": "family",
                        "source": "a.csv",
                        "samples": [["2025-02-03T10:00:00", 18.0, 50, 1]],
                    }
                ],
            )
        ),
        "logs[0].samples[0]",
        "expected a list of 3 items",
    ),
    "lone surrogate escape": (
        GOOD.replace(b"Example Row", b"Example \\ud800 Row", 1),
        "line",
        "surrogate",
    ),
}


@pytest.mark.parametrize("name", sorted(HOSTILE))
def test_damaged_or_hostile_file_gives_survey_file_error(tmp_path, name):
    """Each kind of damaged or hostile file raises SurveyFileError naming the path, the place
    in the document and the problem (never another exception)."""
    content, where, words = HOSTILE[name]
    path = tmp_path / "bad.json"
    path.write_bytes(content)
    with pytest.raises(SurveyFileError) as err:
        store.load_survey(path)
    assert err.value.path == str(path)
    if where:
        assert err.value.where.startswith(where), err.value
    assert words in err.value.problem, err.value
    assert path.read_bytes() == content


def test_there_are_at_least_twenty_kinds_of_bad_file():
    """The hostile-file list holds at least 20 kinds, among them garbage, NaN and a 50 MB string."""
    assert len(HOSTILE) >= 20
    for kind in (
        "random garbage",
        "truncated in half",
        "wrong type",
        "huge number",
        "NaN literal",
        "deeply nested document",
        "50 MB string",
        "newer schema_version",
    ):
        assert kind in HOSTILE


def test_missing_file_and_folder_are_reported(tmp_path):
    """A missing file and a folder given as the file both raise SurveyFileError."""
    with pytest.raises(SurveyFileError, match="no such file"):
        store.load_survey(tmp_path / "nothing.json")
    with pytest.raises(SurveyFileError, match="folder, not a survey file"):
        store.load_survey(tmp_path)


def test_oversized_file_is_refused_before_reading(tmp_path, monkeypatch):
    """A file above MAX_FILE_BYTES is refused with its size, without reading it into memory."""
    path = tmp_path / "big.json"
    path.write_bytes(GOOD)
    monkeypatch.setattr(fileio, "MAX_FILE_BYTES", 1000)
    with pytest.raises(SurveyFileError, match="too large"):
        store.load_survey(path)


def test_utf8_byte_order_mark_is_accepted(tmp_path):
    """A file saved by an editor with a UTF-8 byte-order mark still loads."""
    path = tmp_path / "bom.json"
    path.write_bytes(b"\xef\xbb\xbf" + GOOD)
    assert store.load_survey(path) == store.load_survey(BASEMENT)


def test_damaged_file_offers_a_backup_that_loads(tmp_path):
    """When the main file is damaged and NAME.json.bak loads, the error says so and how to
    recover."""
    path = tmp_path / "s.json"
    survey = store.load_survey(BASEMENT)
    store.save_survey(survey, path)
    store.save_survey(survey, path)
    path.write_bytes(GOOD[:500])
    with pytest.raises(SurveyFileError) as err:
        store.load_survey(path)
    assert "s.json.bak" in err.value.problem and "loads cleanly" in err.value.problem
    assert "copy it over s.json" in err.value.problem


def test_damaged_backup_is_reported_as_damaged(tmp_path):
    """When the backup is damaged too, the error says that rather than offering it."""
    path = tmp_path / "s.json"
    path.write_bytes(b"{")
    store.backup_path(path).write_bytes(b"")
    with pytest.raises(SurveyFileError) as err:
        store.load_survey(path)
    assert "damaged too" in err.value.problem


def test_newer_version_does_not_offer_the_backup(tmp_path):
    """A file from a newer program is not damaged, so the backup is not suggested."""
    path = tmp_path / "s.json"
    store.save_survey(store.new_survey("x"), path)
    store.save_survey(store.new_survey("x"), path)
    path.write_bytes(_with(_set(["schema_version"], model.SCHEMA_VERSION + 1)))
    with pytest.raises(SurveyFileError) as err:
        store.load_survey(path)
    assert "newer" in err.value.problem and ".bak" not in err.value.problem


def test_file_that_failed_to_load_is_never_overwritten(tmp_path):
    """Opening a damaged file for editing fails, leaves it byte-for-byte and no lock behind."""
    path = tmp_path / "s.json"
    damaged = GOOD[:-40]
    path.write_bytes(damaged)
    with pytest.raises(SurveyFileError):
        store.open_for_editing(path)
    assert path.read_bytes() == damaged
    assert not store.lock_path(path).exists()
    assert sorted(p.name for p in tmp_path.iterdir()) == ["s.json"]


def test_session_refuses_to_save_over_a_file_changed_on_disk(tmp_path):
    """If another program rewrites the file during an editing session, save refuses and
    keeps the other program's version."""
    path = tmp_path / "s.json"
    store.save_survey(store.new_survey("mine"), path)
    with store.open_for_editing(path) as session:
        other = path.read_bytes().replace(b'"mine"', b'"theirs"')
        path.write_bytes(other)
        with pytest.raises(SurveyFileError, match="changed on disk"):
            session.save()
        assert path.read_bytes() == other


def test_session_saves_repeatedly(tmp_path):
    """An editing session can save many times in a row (its own saves are not 'changes')."""
    path = tmp_path / "s.json"
    with store.open_for_editing(path, create=store.new_survey("x")) as session:
        for n in range(5):
            session.survey.site.notes = f"edit {n}"
            session.save()
    assert store.load_survey(path).site.notes == "edit 4"
    assert not store.lock_path(path).exists()


# --- versions ----------------------------------------------------------------------------


def test_prerelease_schema_0_file_loads_upgraded():
    """A schema-0 file (the pre-release layout) loads as schema 1 with every value moved."""
    survey = store.load_survey(DATA / "schema0-prerelease.json")
    assert survey.schema_version == model.SCHEMA_VERSION
    assert survey.site.reference == "CS-24-099 Test flat"
    assert survey.site.unit_system == "ip" and survey.site.altitude_m == 120.0
    assert survey.instrument("th").rh_accuracy_pct == 2.0
    assert survey.instrument("ir").surface_temp_accuracy_k == 1.0
    assert survey.room("hall").is_reference
    visit = survey.visits[0]
    assert visit.started_at == dt.datetime(2024, 12, 2, 10)
    assert visit.outdoor == model.AirReading(dry_bulb_c=3.5, rh_pct=80.0)
    bed = visit.room_visit("bed1")
    assert bed.air == model.AirReading(dry_bulb_c=18.0, rh_pct=70.0)
    assert bed.surfaces[0].surface_temp_c == 12.5 and bed.surfaces[0].location == "Corner by window"
    assert bed.materials[0].scale == "wme_pct" and bed.materials[0].value == 18.0
    assert bed.notes == "Mould spotting in the corner."


def test_upgraded_file_is_saved_in_the_current_version(tmp_path):
    """Saving an upgraded survey writes the current version; the .bak keeps the old file."""
    path = tmp_path / "old.json"
    shutil.copy(DATA / "schema0-prerelease.json", path)
    with store.open_for_editing(path) as session:
        session.save()
    assert store.read_schema_version(path) == model.SCHEMA_VERSION
    assert store.read_schema_version(store.backup_path(path)) == 0


def test_every_older_version_has_a_migration():
    """There is a migration from each version below the current one to the next."""
    assert sorted(store.MIGRATIONS) == list(range(model.SCHEMA_VERSION))


def test_schema_0_file_with_a_broken_layout_is_reported(tmp_path):
    """A schema-0 file missing what that layout requires gives SurveyFileError, not KeyError."""
    path = tmp_path / "old.json"
    doc = json.loads((DATA / "schema0-prerelease.json").read_text())
    del doc["visits"][0]["date"]
    path.write_text(json.dumps(doc))
    with pytest.raises(SurveyFileError, match="cannot upgrade from schema version 0"):
        store.load_survey(path)


def test_schema_0_file_with_a_bad_value_names_the_place(tmp_path):
    """A bad value in an old file is reported at its place in the upgraded document."""
    path = tmp_path / "old.json"
    doc = json.loads((DATA / "schema0-prerelease.json").read_text())
    doc["visits"][0]["readings"][0]["temp_c"] = 99
    path.write_text(json.dumps(doc))
    with pytest.raises(SurveyFileError) as err:
        store.load_survey(path)
    assert err.value.where == "visits[0].rooms[0].air.dry_bulb_c"
    assert "after upgrading from schema version 0" in err.value.problem


@pytest.mark.parametrize("name", ["basement-burst-pipe-drying", "winter-flat-bedroom-mould"])
def test_a_version_1_file_loads_unchanged_as_the_current_version(tmp_path, name):
    """Version 2 only added optional fields, and version 3 reads a room's missing occupants
    as not recorded where versions 1 and 2 read none: a version-1 file (which left out a
    room's 0 occupants) gives the same records."""
    source = Path("example_sites") / f"{name}.json"
    doc = json.loads(source.read_text())
    doc["schema_version"] = 1
    for room in doc["rooms"]:
        if room.get("occupants") == 0:
            del room["occupants"]
    for visit in doc["visits"]:
        for room in visit["rooms"]:
            for unit in room.get("equipment", []):
                for key in ("rated_energy_factor_l_per_kwh", "rating_condition", "run_hours"):
                    unit.pop(key, None)
                unit.pop("power_w", None)
    path = tmp_path / "v1.json"
    path.write_text(json.dumps(doc))
    upgraded = store.load_survey(path)
    assert upgraded.schema_version == model.SCHEMA_VERSION == 4
    expected = store.load_survey(source)
    for visit in expected.visits:
        for room in visit.rooms:
            room.equipment = [
                msgspec.structs.replace(
                    e,
                    rated_energy_factor_l_per_kwh=None,
                    rating_condition=None,
                    run_hours=None,
                    power_w=None,
                )
                for e in room.equipment
            ]
    assert upgraded == expected


@pytest.mark.parametrize(
    ("example", "field", "old"),
    [
        # version 2 left out a room's 0 occupants; version 3 leaves out occupants not
        # recorded
        ("winter-flat-bedroom-mould", "occupants", 2),
        # version 3 left out a ground-floor room's storey (0 was the default); version 4
        # leaves out a storey not recorded
        ("coastal-cottage-summer", "level", 3),
    ],
)
def test_a_field_left_out_meant_0_before_and_means_not_recorded_after(
    tmp_path, example, field, old
):
    """A room's field whose missing value meant 0 in version ``old`` and means "not
    recorded" in the next: the upgrade writes the 0 in, so the old file keeps its meaning;
    a file of the next version without it reads None, and is saved without it."""
    source = Path("example_sites") / f"{example}.json"
    doc = json.loads(source.read_text())
    kitchen = next(room for room in doc["rooms"] if room["id"] == "kitchen")
    assert kitchen.pop(field) == 0
    path = tmp_path / f"v{old}.json"

    def kitchen_of(version: int) -> model.Room:
        doc["schema_version"] = version
        path.write_text(json.dumps(doc))
        return next(r for r in store.load_survey(path).rooms if r.id == "kitchen")

    assert getattr(kitchen_of(old), field) == 0
    if field == "level":  # a storey that was given is kept as it was
        assert next(r for r in store.load_survey(path).rooms if r.id == "bed1").level == 1
    assert getattr(kitchen_of(old + 1), field) is None
    loaded = store.load_survey(path)
    saved = tmp_path / "saved.json"
    store.save_survey(loaded, saved)
    assert field not in next(
        r for r in json.loads(saved.read_text())["rooms"] if r["id"] == "kitchen"
    )
