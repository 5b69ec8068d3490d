"""The editing lock: a second opener is told who holds the survey; stale locks are taken over."""

from __future__ import annotations

import multiprocessing
import os
import random
import shutil
import socket
import subprocess
import sys
import textwrap
import time
from pathlib import Path

import msgspec
import pytest

from survey import store
from survey.errors import SurveyFileError
from survey.store import lock as store_lock

ROOT = Path(__file__).resolve().parents[1]
EXAMPLE = ROOT / "example_sites" / "winter-flat-bedroom-mould.json"


@pytest.fixture
def survey_path(tmp_path) -> Path:
    path = tmp_path / "flat.json"
    shutil.copy(EXAMPLE, path)
    return path


def _write_lock(path: Path, **fields) -> store.LockInfo:
    info = store.LockInfo(
        **{
            "pid": 1,
            "host": socket.gethostname(),
            "user": "avery",
            "started_at": "2025-01-15T09:30:00",
            "token": "t0",
            **fields,
        }
    )
    store.lock_path(path).write_bytes(msgspec.json.encode(info))
    return info


def _dead_pid() -> int:
    """A process id that is certainly not running: a child that has exited and been reaped."""
    proc = subprocess.Popen([sys.executable, "-c", "pass"])
    proc.wait()
    return proc.pid


def test_lock_records_who_holds_the_survey(survey_path):
    """Opening for editing writes NAME.json.lock with this process, host, user and time."""
    with store.open_for_editing(survey_path) as session:
        holder = store.read_lock(survey_path)
        assert holder == session.lock
        assert holder.pid == os.getpid() and holder.host == socket.gethostname()
        assert holder.user and holder.started_at and holder.program.startswith("condition-survey")
    assert not store.lock_path(survey_path).exists()


def test_second_opener_in_another_process_is_told_who_holds_it(survey_path):
    """A second process opening the survey gets SurveyLocked naming the first's process."""
    code = textwrap.dedent("""
        import sys
        from survey import store
        session = store.open_for_editing(sys.argv[1])
        print(session.lock.pid, flush=True)
        sys.stdin.read()
        session.close()
    """)
    holder = subprocess.Popen(
        [sys.executable, "-c", code, str(survey_path)],
        cwd=ROOT,
        stdin=subprocess.PIPE,
        stdout=subprocess.PIPE,
        text=True,
    )
    try:
        pid = int(holder.stdout.readline())
        with pytest.raises(store.SurveyLocked) as err:
            store.open_for_editing(survey_path)
        assert err.value.holder.pid == pid
        assert f"process {pid}" in err.value.problem and "open for editing by" in err.value.problem
        assert isinstance(err.value, SurveyFileError)
    finally:
        holder.stdin.close()
        holder.wait(timeout=30)
    assert not store.lock_path(survey_path).exists()
    store.open_for_editing(survey_path).close()


def test_second_session_in_the_same_process_is_refused(survey_path):
    """Even this process cannot open the same survey twice for editing."""
    with (
        store.open_for_editing(survey_path),
        pytest.raises(store.SurveyLocked, match="open for editing by"),
    ):
        store.open_for_editing(survey_path)


def test_stale_lock_of_a_dead_process_is_taken_over(survey_path):
    """A lock whose process is gone (same host) is stale; opening takes it over and says whose."""
    stale = _write_lock(survey_path, pid=_dead_pid())
    assert store.lock_is_stale(stale)
    with store.open_for_editing(survey_path) as session:
        assert session.took_over == stale
        assert store.read_lock(survey_path).pid == os.getpid()


def test_stale_lock_is_refused_when_takeover_is_off(survey_path):
    """With take_over_stale=False a stale lock is reported as stale, not silently removed."""
    _write_lock(survey_path, pid=_dead_pid())
    with pytest.raises(store.SurveyLocked, match="stale lock"):
        store.open_for_editing(survey_path, take_over_stale=False)
    assert store.lock_path(survey_path).exists()


def test_lock_from_before_a_reboot_is_stale(survey_path):
    """A lock whose boot id differs from this host's was left before a reboot: stale, even
    if its process id is now in use (here: this very process)."""
    here = store_lock.boot_id()
    if not here:
        pytest.skip("no boot id on this system")
    info = _write_lock(survey_path, pid=os.getpid(), boot_id="0" * len(here))
    assert store.lock_is_stale(info)


def test_live_lock_of_this_host_is_not_stale(survey_path):
    """A lock held by a running process on this host is not stale."""
    info = _write_lock(survey_path, pid=os.getpid(), boot_id=store_lock.boot_id())
    assert not store.lock_is_stale(info)
    with pytest.raises(store.SurveyLocked):
        store.open_for_editing(survey_path)


def test_lock_from_another_host_is_respected(survey_path):
    """A lock from another computer cannot be checked: it is respected and the message says
    how to clear it; force=True takes it over."""
    other = _write_lock(survey_path, host="surveyor-laptop-2", pid=4242)
    with pytest.raises(store.SurveyLocked) as err:
        store.open_for_editing(survey_path)
    assert "avery on surveyor-laptop-2 (process 4242" in err.value.problem
    assert "delete flat.json.lock" in err.value.problem
    with store.open_for_editing(survey_path, force=True) as session:
        assert session.took_over == other


@pytest.mark.parametrize("content", [b"", b"{not json", b'{"pid": "x"}'])
def test_damaged_lock_file_is_stale(survey_path, content):
    """An empty or unreadable lock file (a crash while writing it) counts as stale."""
    store.lock_path(survey_path).write_bytes(content)
    with store.open_for_editing(survey_path) as session:
        assert session.took_over is not None and session.took_over.pid == 0


def test_release_never_removes_someone_elses_lock(survey_path):
    """Closing a session whose lock file now belongs to another holder leaves that lock alone."""
    session = store.open_for_editing(survey_path)
    intruder = _write_lock(survey_path, pid=os.getpid(), token="someone-else")
    session.close()
    assert store.read_lock(survey_path) == intruder


def test_closed_session_cannot_save(survey_path):
    """After close, save raises instead of writing without the lock."""
    session = store.open_for_editing(survey_path)
    session.close()
    with pytest.raises(SurveyFileError, match="session is closed"):
        session.save()


def test_session_create_refuses_an_existing_file(survey_path):
    """open_for_editing(create=...) never replaces an existing survey and releases its lock."""
    before = survey_path.read_bytes()
    with pytest.raises(SurveyFileError, match="already exists"):
        store.open_for_editing(survey_path, create=store.new_survey("x"))
    assert survey_path.read_bytes() == before
    assert not store.lock_path(survey_path).exists()


def test_stale_temporary_files_are_removed_on_open(survey_path):
    """Temporary files of a killed save (dead process id) are removed; live ones are kept."""
    gone = _dead_pid()
    dead = [
        survey_path.with_name(f".{survey_path.name}{kind}.{gone}-0123abcd.tmp")
        for kind in ("", ".bak", ".lock")
    ]
    mine = survey_path.with_name(f".{survey_path.name}.{os.getpid()}-0123abcd.tmp")
    unrelated = survey_path.with_name(".other.json.1-0123abcd.tmp")
    for path in (*dead, mine, unrelated):
        path.write_text("partial")
    with store.open_for_editing(survey_path):
        pass
    assert not any(path.exists() for path in dead)
    assert mine.exists() and unrelated.exists()


ROUNDS = 6


def _jittered(fn, rng, most_s=0.002):
    """``fn`` with a random pause before and after: a busy, slow machine."""

    def call(*args, **kwargs):
        time.sleep(rng.uniform(0, most_s))
        try:
            return fn(*args, **kwargs)
        finally:
            time.sleep(rng.uniform(0, most_s))

    return call


def _racer(path, seed, barrier, results, release):
    """One process trying to open the survey whose lock is stale, at the same moment as the
    others; a winner keeps the lock until the test has looked."""
    rng = random.Random(seed)
    for name in ("rename", "replace", "link", "unlink", "open"):
        setattr(os, name, _jittered(getattr(os, name), rng))
    # Above all, time passes between looking at a lock and acting on what was seen.
    store.lock_is_stale = _jittered(store.lock_is_stale, rng, 0.02)
    barrier.wait(timeout=30)
    try:
        ours, _previous = store.acquire_lock(path)
    except store.SurveyLocked as exc:
        results.put(("locked", exc.holder.token if exc.holder else ""))
        return
    except Exception as exc:
        results.put(("error", repr(exc)))
        return
    results.put(("won", ours.token))
    release.wait(timeout=30)
    store.release_lock(path, ours)


@pytest.mark.skipif(not hasattr(os, "fork"), reason="needs fork")
@pytest.mark.slow
def test_stale_lock_taken_over_by_several_processes_at_once_has_one_winner(survey_path):
    """Six processes find the same stale lock at once, with random pauses around every file
    operation and the staleness check: exactly one gets the lock, every other is told that
    one holds it, and the lock on disk is the winner's (a takeover never removes a live
    lock)."""
    ctx = multiprocessing.get_context("fork")
    racers = 6
    for round_ in range(ROUNDS):
        _write_lock(survey_path, pid=_dead_pid(), token=f"stale{round_}")
        barrier, results, release = ctx.Barrier(racers), ctx.Queue(), ctx.Event()
        procs = [
            ctx.Process(
                target=_racer, args=(survey_path, 1000 * round_ + i, barrier, results, release)
            )
            for i in range(racers)
        ]
        for proc in procs:
            proc.start()
        try:
            outcomes = [results.get(timeout=30) for _ in procs]
            winners = [token for kind, token in outcomes if kind == "won"]
            assert not [o for o in outcomes if o[0] == "error"], outcomes
            assert len(winners) == 1, outcomes
            assert store.read_lock(survey_path).token == winners[0]
            assert all(token == winners[0] for kind, token in outcomes if kind == "locked")
        finally:
            release.set()
            for proc in procs:
                proc.join(timeout=30)
        assert not store.lock_path(survey_path).exists()
    assert sorted(p.name for p in survey_path.parent.iterdir()) == ["flat.json"]
