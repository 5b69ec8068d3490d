"""Merging a logger's samples into a survey (survey.logseries): what is new, what was there,
which room, and errors that name the quantity. Every survey and logger file here is invented.
"""

from __future__ import annotations

import datetime as dt
from pathlib import Path

import msgspec
import pytest

from survey import logimport, logseries, model, store
from survey.errors import InputError

FLAT = Path(__file__).resolve().parents[1] / "example_sites" / "winter-flat-bedroom-mould.json"


def _logger_file(*times: str) -> logimport.LoggerData:
    text = "Time,Temperature (°C),RH (%)\n" + "".join(f"{t},18.5,70\n" for t in times)
    return logimport.read_logger_csv(text.encode())


def _imported(
    survey: model.Survey,
    data: logimport.LoggerData,
    room: str | None,
    instrument: str | None = None,
) -> model.Survey:
    plan = logseries.plan_import(survey, data, room=room, source="unit.csv", instrument=instrument)
    assert plan.series is not None
    return msgspec.structs.replace(survey, logs=[*survey.logs, plan.series])


def test_a_first_import_keeps_every_sample():
    """Into a survey without logs, every sample of the file becomes the new series."""
    data = _logger_file("2025-01-15 10:00", "2025-01-15 10:30")
    plan = logseries.plan_import(store.load_survey(FLAT), data, room="bed1", source="unit.csv")
    assert plan.series is not None and plan.series.samples == data.samples
    assert plan.repeated == 0 and plan.series.room == "bed1"


def test_samples_already_in_the_room_s_series_are_left_out_and_counted():
    """A later export repeating two times adds only the new one and counts the two."""
    survey = _imported(
        store.load_survey(FLAT), _logger_file("2025-01-15 10:00", "2025-01-15 10:30"), "bed1"
    )
    later = _logger_file("2025-01-15 10:00", "2025-01-15 10:30", "2025-01-15 11:00")
    plan = logseries.plan_import(survey, later, room="bed1", source="unit-later.csv")
    assert [s.at for s in plan.samples] == [dt.datetime(2025, 1, 15, 11, 0)]
    assert plan.repeated == 2 and plan.overlapping_sources == ("unit.csv",)
    assert plan.series is not None and plan.series.skipped_rows == 2


def test_nothing_new_gives_no_series():
    """When every sample is already there the plan holds no series and counts them all."""
    data = _logger_file("2025-01-15 10:00")
    survey = _imported(store.load_survey(FLAT), data, "bed1")
    copy = _logger_file("2025-01-15 10:00", "")
    plan = logseries.plan_import(survey, copy, room="bed1", source="copy.csv")
    assert plan.series is None and plan.repeated == 1 and plan.samples == []


def test_samples_of_another_room_are_not_duplicates():
    """The same times logged in another room are new samples there."""
    data = _logger_file("2025-01-15 10:00")
    survey = _imported(store.load_survey(FLAT), data, "bed1")
    other = _logger_file("2025-01-15 10:00", "")
    plan = logseries.plan_import(survey, other, room="living", source="other.csv")
    assert plan.repeated == 0 and len(plan.samples) == 1


def test_a_second_instrument_in_the_same_room_keeps_its_own_samples():
    """Two loggers with different instrument ids in one room do not de-duplicate each other."""
    survey = store.load_survey(FLAT)
    survey.instruments.append(model.Instrument(id="lg2", kind="data_logger", name="Logger 2"))
    survey.instruments.append(model.Instrument(id="lg3", kind="data_logger", name="Logger 3"))
    survey = _imported(survey, _logger_file("2025-01-15 10:00"), "bed1", "lg2")
    plan = logseries.plan_import(
        survey, _logger_file("2025-01-15 10:00", ""), room="bed1", source="b.csv", instrument="lg3"
    )
    assert plan.repeated == 0 and len(plan.samples) == 1


def test_the_same_file_twice_is_refused_naming_the_logger_file():
    """A file whose SHA-256 is already in the survey raises InputError("logger file")."""
    data = _logger_file("2025-01-15 10:00")
    survey = _imported(store.load_survey(FLAT), data, "bed1")
    with pytest.raises(InputError) as err:
        logseries.plan_import(survey, data, room="bed1", source="unit.csv")
    assert err.value.field == "logger file" and err.value.value == "unit.csv"
    assert "already imported into Main bedroom (bed1)" in err.value.allowed


def test_an_unknown_room_names_the_quantity_and_lists_the_rooms():
    """room_id_for raises InputError("room") listing the survey's rooms."""
    with pytest.raises(InputError) as err:
        logseries.room_id_for(store.load_survey(FLAT), "attic")
    assert err.value.field == "room" and "bed1 (Main bedroom)" in err.value.allowed


def test_a_long_room_list_is_cut_with_a_count():
    """With 30 rooms the message lists 8 and says how many more there are."""
    survey = store.load_survey(FLAT)
    survey.rooms += [model.Room(id=f"r{n}", name=f"Room {n}") for n in range(25)]
    with pytest.raises(InputError) as err:
        logseries.room_id_for(survey, "attic")
    assert err.value.allowed.endswith("and 22 more")  # 5 + 25 rooms, 8 listed


def test_an_unknown_instrument_names_the_quantity():
    """check_instrument raises InputError("instrument") listing the instrument ids."""
    with pytest.raises(InputError) as err:
        logseries.check_instrument(store.load_survey(FLAT), "nope")
    assert err.value.field == "instrument" and "th1" in err.value.allowed


def test_a_room_is_found_by_its_name_ignoring_case():
    """ "main BEDROOM" finds bed1; None means outdoors."""
    survey = store.load_survey(FLAT)
    assert logseries.room_id_for(survey, "main BEDROOM") == "bed1"
    assert logseries.room_id_for(survey, None) is None
