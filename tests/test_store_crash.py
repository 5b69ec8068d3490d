"""Crash safety: a writer killed with SIGKILL at random moments never leaves a broken file."""

from __future__ import annotations

import os
import random
import shutil
import signal
import time
from pathlib import Path

import pytest

from survey import store

ROOT = Path(__file__).resolve().parents[1]
EXAMPLE = ROOT / "example_sites" / "basement-burst-pipe-drying.json"


def _version_on_disk(path: Path) -> int:
    notes = store.load_survey(path).site.notes
    return int(notes.split()[1]) if notes.startswith("version ") else 0


def _writer(path: Path, report: int) -> None:
    """Save new versions of the survey for ever, writing each finished version to ``report``.

    Each save writes its version number into the site notes and pads the file by a varying
    amount, so a half-written or mixed file could not pass for a whole one.
    """
    session = store.open_for_editing(path)
    survey = session.survey
    notes = survey.site.notes
    version = int(notes.split()[1]) if notes.startswith("version ") else 0
    os.write(report, b"ready\n")
    while True:
        version += 1
        survey.site.notes = f"version {version} " + "#" * (version * 7919 % 15000)
        session.save()
        os.write(report, f"{version}\n".encode())


def _start_writer(path: Path) -> tuple[int, int]:
    """Fork a writer process (already holding the imported modules, so it starts at once)."""
    read_end, write_end = os.pipe()
    pid = os.fork()
    if pid == 0:  # the child: never returns into the test runner
        try:
            os.close(read_end)
            _writer(path, write_end)
        finally:
            os._exit(1)
    os.close(write_end)
    return pid, read_end


def _read_all(fd: int) -> str:
    chunks = []
    while True:
        chunk = os.read(fd, 65536)
        if not chunk:
            return b"".join(chunks).decode()
        chunks.append(chunk)


@pytest.mark.skipif(
    not hasattr(os, "fork") or not hasattr(signal, "SIGKILL"), reason="needs fork and SIGKILL"
)
@pytest.mark.slow
def test_writer_killed_at_random_moments_leaves_old_or_new_version(tmp_path):
    """Over at least 200 saves and 40 SIGKILLs at random moments, the survey always loads and
    holds either the last version the writer reported or the one it was writing; the backup
    always loads too, and the next editing session cleans up what the killed writers left."""
    path = tmp_path / "survey.json"
    shutil.copy(EXAMPLE, path)
    rng = random.Random(20250203)
    saves = kills = confirmed = 0
    deadline = time.monotonic() + 60
    while (saves < 200 or kills < 40) and time.monotonic() < deadline:
        pid, fd = _start_writer(path)
        first = b""
        while not first.endswith(b"\n"):
            first += os.read(fd, 1)
        assert first == b"ready\n"
        time.sleep(rng.uniform(0.0, 0.03))
        os.kill(pid, signal.SIGKILL)
        _, status = os.waitpid(pid, 0)
        assert os.WIFSIGNALED(status) and os.WTERMSIG(status) == signal.SIGKILL
        reported = [int(line) for line in _read_all(fd).split()]
        os.close(fd)
        kills += 1
        saves += len(reported)
        # The writer resumes from the version on disk, so its reports run on from there.
        assert reported == list(range(confirmed + 1, confirmed + 1 + len(reported)))
        last = reported[-1] if reported else confirmed
        on_disk = _version_on_disk(path)
        assert on_disk in (last, last + 1), (on_disk, last)
        if store.backup_path(path).exists():
            assert _version_on_disk(store.backup_path(path)) <= on_disk
        confirmed = on_disk
    assert saves >= 200 and kills >= 40, (saves, kills)
    # Every killed writer left its lock behind: the next session recognises it as stale,
    # takes it over and removes the temporary files of killed saves.
    with store.open_for_editing(path) as session:
        assert session.took_over is not None and store.lock_is_stale(session.took_over)
    assert sorted(p.name for p in tmp_path.iterdir()) == ["survey.json", "survey.json.bak"]
