"""Odd and hostile files: special files, size limits, keys given twice, bounded messages."""

from __future__ import annotations

import contextlib
import json
import os
import shutil
import socket
import stat
import threading
from pathlib import Path

import msgspec
import pytest
from hypothesis import HealthCheck, given, settings
from test_store import surveys

from survey import model, store
from survey.cli import main
from survey.errors import SurveyFileError
from survey.store import decoding, fileio

ROOT = Path(__file__).resolve().parents[1]
FLAT = ROOT / "example_sites" / "winter-flat-bedroom-mould.json"

#: "A few hundred characters": the longest error line these tests accept.
LINE_MAX = 400


def _doc() -> dict:
    return json.loads(FLAT.read_text())


def _no_control_characters(text: str) -> bool:
    return not any(ord(c) < 0x20 or 0x7F <= ord(c) < 0xA0 or c in "\u202e\u2066" for c in text)


def _within(seconds: float, fn, *args):
    """Run ``fn(*args)`` in a thread; its result or exception, failing if it blocks."""
    outcome: dict = {}

    def run():
        try:
            outcome["value"] = fn(*args)
        except BaseException as exc:  # handed to the test
            outcome["error"] = exc

    thread = threading.Thread(target=run, daemon=True)
    thread.start()
    thread.join(seconds)
    assert not thread.is_alive(), f"{fn.__name__} blocked for {seconds} s"
    if "error" in outcome:
        raise outcome["error"]
    return outcome.get("value")


@pytest.fixture
def fifo(tmp_path) -> Path:
    path = tmp_path / "pipe.json"
    os.mkfifo(path)
    yield path
    with contextlib.suppress(OSError):  # release a reader that blocked despite everything
        os.close(os.open(path, os.O_WRONLY | os.O_NONBLOCK))


# --- special files and size ------------------------------------------------------------------


def test_fifo_is_refused_without_blocking(fifo):
    """A named pipe given as the survey is refused at once (no writer is waited for)."""
    with pytest.raises(SurveyFileError) as err:
        _within(10, store.load_survey, fifo)
    assert err.value.problem == "this is a named pipe (FIFO), not a survey file"


def test_fifo_as_logger_file_names_the_logger_file(fifo):
    """The shared reader names what it was reading: a logger file."""
    with pytest.raises(SurveyFileError, match="named pipe \\(FIFO\\), not a logger file"):
        _within(10, store.read_input_file, fifo, "logger file")


@pytest.mark.parametrize("device", ["/dev/zero", "/dev/null", "/dev/urandom"])
def test_device_is_refused_without_reading(device):
    """A device is refused before it is opened: /dev/zero no longer reads 256 MB first."""
    if not os.path.exists(device):
        pytest.skip(f"no {device} here")
    with pytest.raises(SurveyFileError) as err:
        _within(10, store.read_input_file, device)
    assert err.value.problem == "this is a device, not a survey file"


def test_socket_is_refused(tmp_path):
    """A Unix socket given as the survey is refused in words, not with ENXIO."""
    path = tmp_path / "s.sock"
    server = socket.socket(socket.AF_UNIX)
    try:
        server.bind(str(path))
        with pytest.raises(SurveyFileError) as err:
            store.load_survey(path)
    finally:
        server.close()
    assert err.value.problem == "this is a socket, not a survey file"


@pytest.mark.parametrize("name", [".", "/", ""])
def test_a_path_that_names_a_folder_is_refused(name):
    """`.`, `/` and an empty path are refused as folders, with no traceback."""
    with pytest.raises(SurveyFileError, match="this is a folder"):
        store.load_survey(name)


def test_opening_a_folder_for_editing_leaves_no_lock_beside_it(tmp_path):
    """open_for_editing('.') is refused before any lock file is made next to the folder."""
    before = sorted(os.listdir(tmp_path.parent))
    with pytest.raises(SurveyFileError, match="this is a folder"):
        store.open_for_editing(Path(os.path.relpath(tmp_path)) / ".")
    assert sorted(os.listdir(tmp_path.parent)) == before


def test_a_file_swapped_for_a_pipe_after_the_check_is_not_read(fifo, tmp_path, monkeypatch):
    """If the path becomes a pipe between the check and the open, the open does not block
    and the handle's own fstat refuses it."""
    regular = tmp_path / "regular.json"
    regular.write_text("{}")
    real_stat = os.stat
    monkeypatch.setattr(
        fileio.os,
        "stat",
        lambda path, *a, **k: real_stat(regular if Path(path) == fifo else path, *a, **k),
    )
    with pytest.raises(SurveyFileError) as err:
        _within(10, store.read_input_file, fifo)
    assert err.value.problem == "this is a named pipe (FIFO), not a survey file"


def test_validate_of_a_fifo_prints_one_line_and_exits_1(fifo, capsys):
    """`survey validate PIPE` answers with one line and exit status 1, without hanging."""
    assert _within(20, main, ["validate", str(fifo)]) == 1
    err = capsys.readouterr().err
    assert err.count("\n") == 1 and "named pipe" in err and "Traceback" not in err


def test_file_without_a_size_is_read_only_up_to_the_limit(monkeypatch):
    """A file that reports size 0 (/proc) is read no further than the limit and refused."""
    proc = Path("/proc/self/maps")
    if not proc.exists():
        pytest.skip("no /proc here")
    monkeypatch.setattr(fileio, "MAX_FILE_BYTES", 100)
    reads = []
    real_read = os.read
    monkeypatch.setattr(fileio.os, "read", lambda fd, n: (reads.append(n), real_read(fd, n))[1])
    with pytest.raises(SurveyFileError, match="too large"):
        store.read_input_file(proc)
    assert sum(reads) <= 101


def test_regular_file_is_read_whole_in_one_go(tmp_path, monkeypatch):
    """A regular file is read with its fstat size plus the one byte that proves its end."""
    path = tmp_path / "s.json"
    shutil.copy(FLAT, path)
    reads = []
    real_read = os.read
    monkeypatch.setattr(fileio.os, "read", lambda fd, n: (reads.append(n), real_read(fd, n))[1])
    assert store.read_input_file(path) == FLAT.read_bytes()
    assert reads[0] == path.stat().st_size + 1


def test_unreadable_file_says_no_permission_to_read(tmp_path, monkeypatch):
    """A file the user may not read says so, not that it is read-only."""
    path = tmp_path / "s.json"
    shutil.copy(FLAT, path)
    real_open = os.open

    def refusing(name, flags, *args):
        if Path(name) == path:
            raise PermissionError(13, "Permission denied")
        return real_open(name, flags, *args)

    monkeypatch.setattr(fileio.os, "open", refusing)
    with pytest.raises(SurveyFileError) as err:
        store.load_survey(path)
    assert err.value.problem.startswith("no permission to read the file")
    assert "read-only" not in err.value.problem


@pytest.mark.skipif(
    not hasattr(os, "geteuid") or os.geteuid() == 0,
    reason="root reads every file; the test above covers it with a stub",
)
def test_a_really_unreadable_file_says_no_permission_to_read(tmp_path):
    """The kernel's own refusal (a file of mode 0000) reads as "no permission to read"."""
    path = tmp_path / "s.json"
    shutil.copy(FLAT, path)
    os.chmod(path, 0)
    with pytest.raises(SurveyFileError) as err:
        store.load_survey(path)
    assert err.value.problem.startswith("no permission to read the file")


def test_export_target_that_is_a_pipe_is_refused(fifo):
    """The atomic writer never replaces something that is not a regular file."""
    with pytest.raises(SurveyFileError, match="not written: the name is a named pipe"):
        store.write_file_atomically(fifo, b"a,b\r\n")
    assert stat.S_ISFIFO(os.stat(fifo).st_mode)


# --- keys given twice --------------------------------------------------------------------


def _with_text(change, marker: str, replacement: str) -> bytes:
    doc = _doc()
    change(doc, marker)
    text = json.dumps(doc, indent=2)
    assert text.count(json.dumps(marker)) == 1
    return text.replace(json.dumps(marker), replacement).encode()


def test_a_reading_given_twice_is_refused_at_its_place():
    """`"rh_pct": 72, "rh_pct": 99` is a damaged file, named at the key's place."""
    data = _with_text(
        lambda d, m: d["visits"][0]["rooms"][1]["air"].update(rh_pct=m), "@dup@", '72, "rh_pct": 99'
    )
    with pytest.raises(SurveyFileError) as err:
        store.loads_survey(data, "dup.json")
    assert err.value.where == "visits[0].rooms[1].air.rh_pct"
    assert "'rh_pct' is given twice in one object (72 and 99)" in err.value.problem


def test_a_key_given_three_times_at_the_top_level_is_counted():
    """A site given three times is reported once, with the count and what each was."""
    data = _with_text(
        lambda d, m: d.update(site=m),
        "@dup@",
        '{"reference": "a"}, "site": {"reference": "b"}, "site": {"reference": "c"}',
    )
    with pytest.raises(SurveyFileError) as err:
        store.loads_survey(data)
    assert err.value.where == "site"
    assert "given 3 times in one object (an object, an object and an object)" in err.value.problem


def test_the_first_duplicate_in_the_file_is_named():
    """Of two duplicates, the one that comes first in the file is reported."""
    doc = _doc()
    doc["site"]["client"] = "@first@"
    doc["visits"][0]["rooms"][0]["air"]["rh_pct"] = "@second@"
    text = json.dumps(doc).replace('"@first@"', '"x", "client": "y"')
    text = text.replace('"@second@"', '1, "rh_pct": 2')
    with pytest.raises(SurveyFileError) as err:
        store.loads_survey(text.encode())
    assert err.value.where == "site.client"


def test_a_duplicate_after_logger_samples_keeps_its_place():
    """Skipping logger samples for speed does not move the place of a later duplicate."""
    doc = _doc()
    doc["logs"] = [
        {
            "room": "bed1",
            "source": "a.csv",
            "samples": [["2025-01-15T10:00:00", 18.0, 60.0], ["2025-01-15T10:10:00", 18.1, 61.0]],
        },
        {"room": "bed2", "source": "b.csv", "samples": [], "skipped_rows": "@dup@"},
    ]
    text = json.dumps(doc, indent=1).replace('"@dup@"', '1, "skipped_rows": 2')
    with pytest.raises(SurveyFileError) as err:
        store.loads_survey(text.encode())
    assert err.value.where == "logs[1].skipped_rows"


def test_key_text_inside_a_note_is_not_a_duplicate():
    """A note quoting `"rh_pct": 1, "rh_pct": 2` is text, not keys: the file loads."""
    doc = _doc()
    doc["site"]["notes"] = '{"rh_pct": 1, "rh_pct": 2} and "samples": [1]] ]'
    survey = store.loads_survey(json.dumps(doc).encode())
    assert survey.site.notes.startswith('{"rh_pct": 1')


def test_a_survey_with_logger_samples_loads():
    """A valid survey with several logger series passes the duplicate check."""
    doc = _doc()
    doc["logs"] = [
        {
            "room": room,
            "source": f"{room}.csv",
            "samples": [[f"2025-01-15T10:{m:02d}:00", 18.0, 60.0] for m in range(50)],
        }
        for room in ("bed1", "bed2")
    ] + [{"room": None, "source": "out.csv", "samples": []}]
    survey = store.loads_survey(json.dumps(doc, indent=3).encode())
    assert [len(log.samples) for log in survey.logs] == [50, 50, 0]


@settings(max_examples=60, deadline=None, suppress_health_check=[HealthCheck.too_slow])
@given(surveys())
@pytest.mark.slow
def test_cutting_out_logger_samples_keeps_everything_else(survey):
    """The duplicate-key check's shortcut empties exactly the samples arrays of any valid
    survey file, whatever its texts hold, so it never hides a key nor invents one."""
    data = store.dumps_survey(survey)
    expected = json.loads(data)
    for log in expected["logs"]:
        log["samples"] = []
    assert json.loads(decoding._without_samples(data)) == expected
    assert decoding.duplicate_key(data) is None


def test_duplicate_in_an_old_schema_file_is_refused():
    """A file of an older schema version is checked for duplicate keys too."""
    text = (ROOT / "tests" / "data" / "schema0-prerelease.json").read_text()
    text = text.replace(
        '"reference": "CS-24-099 Test flat"',
        '"reference": "CS-24-099 Test flat", "reference": "other"',
        1,
    )
    with pytest.raises(SurveyFileError) as err:
        store.loads_survey(text.encode())
    assert err.value.where == "reference" and "given twice" in err.value.problem


# --- bounded, visible messages -----------------------------------------------------------


def _error_line(data: bytes) -> str:
    with pytest.raises(SurveyFileError) as err:
        store.loads_survey(data, "s.json")
    return str(err.value)


def test_a_megabyte_key_gives_a_short_line():
    """An unknown 1 MB key is quoted shortened with an ellipsis: a short line."""
    doc = _doc()
    doc["visits"][0]["rooms"][0]["air"]["k" * 1_000_000] = 1
    line = _error_line(json.dumps(doc).encode())
    assert len(line) < LINE_MAX and "unknown field 'kkk" in line and "…" in line


def test_a_megabyte_value_gives_a_short_line():
    """A 1 MB value where a choice belongs is quoted shortened."""
    doc = _doc()
    doc["rooms"][0]["use"] = "b" * 1_000_000
    line = _error_line(json.dumps(doc).encode())
    assert len(line) < LINE_MAX and "is not allowed" in line and "…" in line


def test_a_damaged_file_with_a_damaged_backup_gives_a_short_line(tmp_path):
    """Both messages together, the file's and its backup's, stay a few hundred characters."""
    doc = _doc()
    doc["visits"][0]["rooms"][0]["air"]["x" * 100_000] = 1
    path = tmp_path / "s.json"
    path.write_text(json.dumps(doc))
    doc["site"]["y" * 100_000] = 1
    store.backup_path(path).write_text(json.dumps(doc))
    with pytest.raises(SurveyFileError) as err:
        store.load_survey(path)
    assert "damaged too" in err.value.problem and len(err.value.problem) < 600


def test_a_bad_room_reference_in_a_large_survey_lists_a_few_ids():
    """A reference to a missing room among 5000 names a few ids and counts the rest."""
    doc = _doc()
    doc["rooms"] += [{"id": f"room{i}", "name": f"Room {i}"} for i in range(5000)]
    doc["visits"][0]["rooms"][0]["room"] = "garage"
    line = _error_line(json.dumps(doc).encode())
    assert len(line) < LINE_MAX and "no room with id 'garage'" in line
    assert "and 4997 more" in line


def test_a_bad_instrument_reference_lists_a_few_ids():
    """The same holds for instruments."""
    survey = store.new_survey("x")
    survey.instruments = [
        model.Instrument(id=f"i{n}", kind="other", name="meter") for n in range(300)
    ]
    survey.rooms = [model.Room(id="r", name="R")]
    survey.visits = [
        model.Visit(
            started_at=survey.created_at,
            rooms=[
                model.RoomVisit(
                    room="r", air=model.AirReading(dry_bulb_c=20, rh_pct=50, instrument="nope")
                )
            ],
        )
    ]
    with pytest.raises(SurveyFileError) as err:
        store.dumps_survey(survey)
    assert len(str(err.value)) < LINE_MAX and "and 292 more" in err.value.problem


@pytest.mark.parametrize(
    ("where", "value"),
    [
        (("rooms", 0, "use"), "\x1b]8;;http://x\x07link\x1b]8;;\x07"),
        (("visits", 0, "rooms", 0, "air", "dry_bulb_c"), "\x1b[2J\x1b[H"),
        (("visits", 0, "started_at"), "2025\u202e-01-15"),
    ],
)
def test_control_characters_in_a_value_are_shown_escaped(where, value):
    """A value with terminal escapes or a bidi override is quoted with them made visible."""
    doc = _doc()
    node = doc
    for key in where[:-1]:
        node = node[key]
    node[where[-1]] = value
    line = _error_line(json.dumps(doc).encode())
    assert _no_control_characters(line)
    assert "\\x1b" in line or "\\u202e" in line


def test_control_characters_in_a_key_are_shown_escaped():
    """An unknown key holding ESC sequences is named with them escaped, in place and problem."""
    doc = _doc()
    doc["site"]["\x1b[31mred\x1b[0m"] = 1
    with pytest.raises(SurveyFileError) as err:
        store.loads_survey(json.dumps(doc).encode())
    assert _no_control_characters(err.value.where) and _no_control_characters(err.value.problem)
    assert err.value.where == "site.\\x1b[31mred\\x1b[0m"


def test_a_hostile_lock_file_is_described_safely(tmp_path):
    """What a lock file says of its holder reaches a message shortened and escaped."""
    path = tmp_path / "s.json"
    shutil.copy(FLAT, path)
    info = store.LockInfo(
        pid=1,
        host="far-away-host",
        user="\x1b]0;owned\x07" + "u" * 5000,
        started_at="2025-01-15T09:30:00\x1b[2J",
        token="t",
    )
    store.lock_path(path).write_bytes(msgspec.json.encode(info))
    with pytest.raises(store.SurveyLocked) as err:
        store.open_for_editing(path)
    assert _no_control_characters(err.value.problem) and len(err.value.problem) < 600


def test_a_lock_file_that_is_a_pipe_does_not_block_opening(tmp_path):
    """A named pipe planted as NAME.json.lock reads as a damaged lock and is replaced."""
    path = tmp_path / "s.json"
    shutil.copy(FLAT, path)
    os.mkfifo(store.lock_path(path))
    session = _within(20, store.open_for_editing, path)
    try:
        assert session.took_over is not None and session.took_over.pid == 0
        assert store.lock_path(path).is_file()
    finally:
        session.close()


# --- tidy edges --------------------------------------------------------------------------


def test_save_with_a_backup_linked_to_the_survey_leaves_no_temp_file(tmp_path):
    """A .bak that is a hard link to the survey itself: the save leaves no temporary file,
    the new version in the survey and the old one in the .bak."""
    path = tmp_path / "s.json"
    shutil.copy(FLAT, path)
    os.link(path, store.backup_path(path))
    before = path.read_bytes()
    survey = store.load_survey(path)
    survey.site.notes = "changed"
    store.save_survey(survey, path)
    assert sorted(p.name for p in tmp_path.iterdir()) == ["s.json", "s.json.bak"]
    assert store.backup_path(path).read_bytes() == before
    assert store.load_survey(path).site.notes == "changed"
