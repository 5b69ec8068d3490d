"""Saving never destroys evidence: damaged or read-only files, backups, the shared writer."""

from __future__ import annotations

import errno
import json
import os
import shutil
from pathlib import Path

import pytest

from survey import model, store
from survey.errors import SurveyFileError
from survey.store import fileio

ROOT = Path(__file__).resolve().parents[1]
FLAT = ROOT / "example_sites" / "winter-flat-bedroom-mould.json"


@pytest.fixture
def saved_twice(tmp_path) -> Path:
    """A survey saved twice, so that NAME.json.bak holds a good previous version."""
    path = tmp_path / "flat.json"
    survey = store.load_survey(FLAT)
    store.save_survey(survey, path)
    survey.site.notes = "second version"
    store.save_survey(survey, path)
    return path


def _names(folder: Path) -> list[str]:
    return sorted(p.name for p in folder.iterdir())


def test_save_over_a_damaged_file_is_refused_and_keeps_the_good_backup(saved_twice):
    """A truncated main file with a good .bak: saving over it is refused, the damaged file
    stays byte for byte, and the .bak is not replaced by the damaged one."""
    path = saved_twice
    bak = store.backup_path(path)
    good_backup = bak.read_bytes()
    damaged = path.read_bytes()[:300]
    path.write_bytes(damaged)
    with pytest.raises(SurveyFileError) as err:
        store.save_survey(store.new_survey("new"), path)
    assert "does not load as a survey" in err.value.problem
    assert "truncated" in err.value.problem and "left as it is" in err.value.problem
    assert path.read_bytes() == damaged
    assert bak.read_bytes() == good_backup
    assert _names(path.parent) == ["flat.json", "flat.json.bak"]


def test_forced_save_over_a_damaged_file_keeps_it_aside(saved_twice):
    """With replace_damaged the new survey is written, the damaged file is kept as
    NAME.json.damaged-<time>, and the good backup is left alone."""
    path = saved_twice
    bak = store.backup_path(path)
    good_backup = bak.read_bytes()
    damaged = path.read_bytes()[:300]
    path.write_bytes(damaged)
    store.save_survey(store.new_survey("new"), path, replace_damaged=True)
    assert store.load_survey(path).site.reference == "new"
    assert bak.read_bytes() == good_backup
    (kept,) = [p for p in path.parent.iterdir() if ".damaged-" in p.name]
    assert kept.name.startswith("flat.json.damaged-") and kept.read_bytes() == damaged


@pytest.mark.parametrize(
    ("content", "words"),
    [
        (b"Meeting notes, not a survey\n", "not valid JSON"),
        (b'{"schema_version": 7, "site": {"reference": "x"}}', "newer condition-survey"),
        (b"", "empty"),
    ],
)
def test_save_over_a_file_that_is_not_a_survey_is_refused(tmp_path, content, words):
    """Some other file, or one from a newer program, under the survey's name is not replaced."""
    path = tmp_path / "s.json"
    path.write_bytes(content)
    with pytest.raises(SurveyFileError) as err:
        store.save_survey(store.new_survey("x"), path)
    assert words in err.value.problem
    assert path.read_bytes() == content
    assert _names(tmp_path) == ["s.json"]


def test_file_damaged_after_this_process_saved_it_is_noticed(tmp_path):
    """A file this process wrote and then someone truncated is checked again, not trusted."""
    path = tmp_path / "s.json"
    store.save_survey(store.new_survey("x"), path)
    store.save_survey(store.new_survey("y"), path)  # over a file known to load: allowed
    path.write_bytes(path.read_bytes()[:-10])
    with pytest.raises(SurveyFileError, match="does not load"):
        store.save_survey(store.new_survey("z"), path)


def test_read_only_survey_file_is_not_replaced(tmp_path):
    """A survey made read-only (mode 0444) is neither saved over nor opened for editing —
    also for root, whom the permission check alone would let through."""
    path = tmp_path / "s.json"
    shutil.copy(FLAT, path)
    os.chmod(path, 0o444)
    before = path.read_bytes()
    with pytest.raises(SurveyFileError) as err:
        store.save_survey(store.load_survey(path), path)
    assert "read-only (mode 0444)" in err.value.problem and "chmod u+w s.json" in err.value.problem
    with pytest.raises(SurveyFileError, match="cannot open for editing: the file is read-only"):
        store.open_for_editing(path)
    assert path.read_bytes() == before and (path.stat().st_mode & 0o777) == 0o444
    assert _names(tmp_path) == ["s.json"]


def test_failed_first_save_does_not_say_the_file_is_unchanged(tmp_path, monkeypatch):
    """When no file existed, a failed save says no file was created (there is no 'file on
    disk' to be unchanged)."""
    path = tmp_path / "new.json"

    def full(*args, **kwargs):
        raise OSError(errno.ENOSPC, os.strerror(errno.ENOSPC))

    monkeypatch.setattr(os, "replace", full)
    with pytest.raises(SurveyFileError) as err:
        store.save_survey(store.new_survey("x"), path)
    assert "disk is full" in err.value.problem and "no file was created" in err.value.problem
    assert "unchanged" not in err.value.problem
    assert _names(tmp_path) == []


def test_write_file_atomically_never_follows_a_planted_temporary_name(tmp_path):
    """The temporary file is created exclusively under an unpredictable name: a symlink
    planted at a guessable temporary name is not written through."""
    victim = tmp_path / "victim.txt"
    victim.write_text("keep me")
    out = tmp_path / "out.csv"
    for guess in (f".{out.name}.{os.getpid()}.tmp", f".{out.name}.tmp", f"{out.name}.tmp"):
        (tmp_path / guess).symlink_to(victim)
    store.write_file_atomically(out, b"a,b\r\n")
    assert out.read_bytes() == b"a,b\r\n" and victim.read_text() == "keep me"
    assert not [p for p in tmp_path.iterdir() if p.name.endswith(".tmp") and not p.is_symlink()]


def test_write_file_atomically_syncs_the_folder_and_keeps_permissions(tmp_path, monkeypatch):
    """The folder is fsynced after the rename; an existing file keeps its mode."""
    synced = []
    real = fileio.fsync_dir
    monkeypatch.setattr(fileio, "fsync_dir", lambda folder: (synced.append(folder), real(folder)))
    out = tmp_path / "out.csv"
    out.write_bytes(b"old")
    os.chmod(out, 0o640)
    store.write_file_atomically(out, b"new")
    assert out.read_bytes() == b"new" and (out.stat().st_mode & 0o777) == 0o640
    assert synced == [tmp_path]


def test_write_file_atomically_refuses_a_read_only_file(tmp_path):
    """An existing read-only file is not replaced."""
    out = tmp_path / "out.csv"
    out.write_bytes(b"old")
    os.chmod(out, 0o444)
    with pytest.raises(SurveyFileError, match="not written: the file is read-only"):
        store.write_file_atomically(out, b"new")
    assert out.read_bytes() == b"old"


def test_duplicate_schema_version_keys_are_named_plainly(tmp_path):
    """Two schema_version keys give a message saying so, not 'between 2 and 2'."""
    doc = FLAT.read_text().replace(
        '"schema_version": 4', '"schema_version": 5, "schema_version": 4', 1
    )
    path = tmp_path / "dup.json"
    path.write_text(doc)
    with pytest.raises(SurveyFileError) as err:
        store.load_survey(path)
    assert err.value.where == "schema_version"
    assert "given 2 times (5 and 4)" in err.value.problem
    assert "between 4 and 4" not in str(err.value)


def test_a_value_with_one_allowed_number_says_which(tmp_path):
    """A range that allows one value reads 'must be 4', not 'between 4 and 4'."""
    survey = store.new_survey("x")
    survey.schema_version = 0
    with pytest.raises(SurveyFileError) as err:
        store.save_survey(survey, tmp_path / "s.json")
    assert err.value.problem == f"not saved: schema_version must be {model.SCHEMA_VERSION}, not 0"


def test_photo_outside_the_survey_folder_is_refused_on_load(tmp_path):
    """A file naming a photo by an absolute path or with '..' is refused, naming the place."""
    doc = json.loads(FLAT.read_text())
    doc["visits"][0]["rooms"][0]["photos"] = ["photos/bed1.jpg", "../../etc/passwd"]
    path = tmp_path / "s.json"
    path.write_text(json.dumps(doc))
    with pytest.raises(SurveyFileError) as err:
        store.load_survey(path)
    assert err.value.where == "visits[0].rooms[0].photos[1]"
    assert "steps out of the survey file's folder with '..'" in err.value.problem
