"""Reading data-logger CSV files: header spellings, units, dates, separators, skipped rows.

Fahrenheit is converted by the scale's definition, t_C = (t_F − 32) × 5/9 (so 68 °F is
exactly 20 °C and 50 °F exactly 10 °C). Every sample file here is written by the test, in
layouts of our own invention that vary what real exports vary: title lines above the header,
the separator, the decimal mark, the date layout, the spelling of the column names, where
the temperature unit is written, extra columns.
"""

from __future__ import annotations

import datetime as dt

import pytest

from survey import logimport
from survey.errors import InputError

D = dt.datetime


def _csv(*lines: str, encoding: str = "utf-8", newline: str = "\r\n") -> bytes:
    return (newline.join(lines) + newline).encode(encoding)


def test_fahrenheit_file_with_preamble_and_bad_rows():
    """A °F export with a title line, an index column, US dates with AM/PM, an error value, an
    empty RH and a footer: good rows converted exactly, each bad row reported by line."""
    data = _csv(
        '"Unit 7 - back bedroom"',
        '"No.","Sample time, local","Air temp, °F","Rel. humidity, %","Dew point, °F"',
        "1,01/15/25 11:30:00 PM,68.00,70.5,57.9",
        "2,01/16/25 12:00:00 AM,50.00,72.0,41.4",
        "3,01/16/25 12:30:00 AM,Err,72.0,",
        "4,01/16/25 01:00:00 AM,49.1,,",
        "5,01/16/25 01:30:00 PM,48.2,73.5,40.3",
        '"End of data","","","",""',
        encoding="cp1252",
    )
    result = logimport.read_logger_csv(data)
    assert [s.at for s in result.samples] == [
        D(2025, 1, 15, 23, 30),
        D(2025, 1, 16, 0, 0),
        D(2025, 1, 16, 13, 30),
    ]
    assert result.samples[0].dry_bulb_c == 20.0 and result.samples[1].dry_bulb_c == 10.0
    assert result.samples[2].dry_bulb_c == pytest.approx((48.2 - 32) * 5 / 9, abs=1e-4)
    assert [s.rh_pct for s in result.samples] == [70.5, 72.0, 73.5]
    assert result.temperature_unit == "f" and result.unit_source == "header"
    assert result.temperature_column == "Air temp, °F"
    assert result.rh_column == "Rel. humidity, %"
    assert result.header_line == 2 and result.encoding == "Windows-1252"
    assert [(s.line, s.reason) for s in result.skipped] == [
        (5, "temperature 'Err' is not a number"),
        (6, "RH is empty"),
        (8, "no time given"),
    ]


def test_semicolon_file_with_decimal_comma_and_day_first_dates():
    """A European export: semicolons, decimal commas, dd.mm.yyyy dates, German headers."""
    data = _csv(
        "Datum/Zeit;Lufttemperatur [°C];rel. Feuchte [%]",
        "14.01.2025 22:00;19,5;64,0",
        "14.01.2025 22:15;19,25;64,5",
        "15.01.2025 09:00;-1,5;80",
    )
    result = logimport.read_logger_csv(data)
    assert result.delimiter == ";" and result.temperature_unit == "c"
    assert [(s.at, s.dry_bulb_c, s.rh_pct) for s in result.samples] == [
        (D(2025, 1, 14, 22, 0), 19.5, 64.0),
        (D(2025, 1, 14, 22, 15), 19.25, 64.5),
        (D(2025, 1, 15, 9, 0), -1.5, 80.0),
    ]
    assert result.date_order == "dmy"
    assert result.interval == dt.timedelta(minutes=15)


def test_separate_date_and_time_columns_tab_separated():
    """Separate date and clock columns, tabs and a unit-only temperature name are read."""
    data = _csv(
        "Date\tTime\tReading °C\tHumidity %\tDew point °C",
        "2025-02-03\t10:00:00\t17.5\t82.0\t14.4",
        "2025-02-03\t10:05:00\t17.6\t81.5\t14.3",
    )
    result = logimport.read_logger_csv(data)
    assert result.time_columns == ("Date", "Time")
    assert [s.at for s in result.samples] == [D(2025, 2, 3, 10, 0), D(2025, 2, 3, 10, 5)]
    assert result.samples[0].dry_bulb_c == 17.5 and result.rh_column == "Humidity %"


def test_dew_point_column_is_not_taken_for_the_temperature():
    """A dew-point column before the air temperature is ignored."""
    data = _csv(
        "timestamp,dew point (°C),temperature (°C),relative humidity (%)",
        "2025-02-03T10:00:00,14.4,17.5,82",
    )
    result = logimport.read_logger_csv(data)
    assert result.temperature_column == "temperature (°C)"
    assert result.samples[0].dry_bulb_c == 17.5


def test_units_row_under_the_header():
    """A second header row holding the units ('°F', '%RH') gives the temperature unit."""
    data = _csv("Time,Temperature,Humidity", ",°F,%RH", "2025-07-22 14:00,72.5,82.0")
    result = logimport.read_logger_csv(data)
    assert result.unit_source == "units row"
    assert result.samples[0].dry_bulb_c == pytest.approx(22.5)


def test_header_without_unit_needs_the_unit_stated():
    """Without a unit in the header the import stops and asks for the unit, then works."""
    data = _csv("time,temp,rh", "2025-07-22 14:00,22.5,82")
    with pytest.raises(InputError) as err:
        logimport.read_logger_csv(data)
    assert err.value.field == "temperature unit"
    assert "state it: c (°C) or f (°F)" in err.value.allowed
    result = logimport.read_logger_csv(data, temp_unit="c")
    assert result.samples[0].dry_bulb_c == 22.5 and result.unit_source == "stated"


def test_ambiguous_dates_need_the_order_stated():
    """Dates like 03/02/2025 with no day above 12 stop the import until the order is given."""
    data = _csv("Date/Time,Temp (C),RH (%)", "03/02/2025 10:00,17.5,82", "04/02/2025 10:00,20.5,55")
    with pytest.raises(InputError) as err:
        logimport.read_logger_csv(data)
    assert err.value.field == "date order"
    dmy = logimport.read_logger_csv(data, date_order="dmy")
    mdy = logimport.read_logger_csv(data, date_order="mdy")
    assert dmy.samples[0].at == D(2025, 2, 3, 10) and mdy.samples[0].at == D(2025, 3, 2, 10)


def test_month_first_is_detected_from_a_day_above_twelve():
    """A date such as 01/13/2025 shows the file is month first."""
    data = _csv("Time,Temp (F),RH", "01/12/2025 23:00,65,60", "01/13/2025 00:00,64,61")
    result = logimport.read_logger_csv(data)
    assert result.date_order == "mdy"
    assert [s.at.day for s in result.samples] == [12, 13]


def test_out_of_range_and_repeated_rows_are_skipped_with_reasons():
    """RH above 100 %, an air temperature beyond 70 °C and a repeated time are each reported."""
    data = _csv(
        "time,temperature (°C),RH (%)",
        "2025-02-03 10:00,17.5,82",
        "2025-02-03 10:05,17.5,101.2",
        "2025-02-03 10:10,85.0,40",
        "2025-02-03 10:00,17.4,82",
        "2025-02-03 10:15,17.3,0",
        "2025-02-03 10:20,17.3",
        "2025-02-03 10:25,17.2,81",
    )
    result = logimport.read_logger_csv(data)
    assert len(result.samples) == 2
    reasons = {s.line: s.reason for s in result.skipped}
    assert "RH 101.2 % is outside" in reasons[3]
    assert "temperature 85 °C is outside" in reasons[4]
    assert reasons[5] == "same time as line 2"
    assert len(result.skipped) == 5
    assert "RH 0 % is outside" in reasons[6]
    assert reasons[7] == "only 2 columns, 3 needed"


def test_rows_out_of_time_order_are_sorted():
    """Rows not in time order are sorted and the result says so."""
    data = _csv("time,temperature (°C),RH (%)", "2025-02-03 10:10,17,80", "2025-02-03 10:00,18,79")
    result = logimport.read_logger_csv(data)
    assert result.reordered and [s.dry_bulb_c for s in result.samples] == [18.0, 17.0]


def test_utf16_and_byte_order_mark_files_are_read():
    """UTF-16 and UTF-8-with-BOM exports read the same as plain UTF-8."""
    lines = ("Time,Temperature (°C),RH (%)", "2025-02-03 10:00,17.5,82")
    plain = logimport.read_logger_csv(_csv(*lines))
    utf16 = logimport.read_logger_csv(_csv(*lines, encoding="utf-16"))
    bom = logimport.read_logger_csv(b"\xef\xbb\xbf" + _csv(*lines))
    assert plain.samples == utf16.samples == bom.samples
    assert utf16.encoding == "UTF-16"


def test_file_without_a_usable_header_is_refused():
    """A file with no time/temperature/RH header raises InputError quoting its first line."""
    with pytest.raises(InputError) as err:
        logimport.read_logger_csv(_csv("a,b,c", "1,2,3"))
    assert err.value.field == "logger file" and "no header row" in err.value.allowed
    with pytest.raises(InputError, match="empty file"):
        logimport.read_logger_csv(b"")


def test_file_with_no_usable_row_is_refused():
    """When every data row is bad the import stops with the first reasons."""
    data = _csv("time,temperature (°C),RH (%)", "yesterday,17,80", "2025-02-03 10:00,hot,80")
    with pytest.raises(InputError) as err:
        logimport.read_logger_csv(data)
    assert "no row could be imported" in err.value.allowed
    assert "line 2: time 'yesterday' is not a date and time" in err.value.allowed


def test_digest_identifies_the_file():
    """The SHA-256 of the file's bytes is kept, to recognise a repeated import."""
    data = _csv("time,temperature (°C),RH (%)", "2025-02-03 10:00,17,80")
    import hashlib

    assert logimport.read_logger_csv(data).sha256 == hashlib.sha256(data).hexdigest()


def test_rh_written_as_fractions_is_read_as_percent_and_said_so():
    """When every RH in the file is at most 1 (0.65, 0,81 with a decimal comma) the values
    are fractions: × 100, and the notes say so."""
    data = _csv(
        "Time;Temperatur [°C];RH",
        "2025-01-15 10:00;18,0;0,65",
        "2025-01-15 10:30;18,2;0,81",
        "2025-01-15 11:00;18,1;1",
    )
    result = logimport.read_logger_csv(data)
    assert [s.rh_pct for s in result.samples] == [65.0, 81.0, 100.0]
    assert result.rh_as_fraction
    assert any("fractions" in note and "100" in note for note in result.notes)


def test_a_few_fraction_like_rh_values_among_percentages_are_skipped():
    """Among percentages, an RH below 1 % looks like a fraction: that row is skipped with
    the reason, the others imported as percent."""
    data = _csv(
        "Time,Temperature (°C),RH (%)",
        "2025-01-15 10:00,18.0,65",
        "2025-01-15 10:30,18.2,0.81",
        "2025-01-15 11:00,18.1,70",
    )
    result = logimport.read_logger_csv(data)
    assert [s.rh_pct for s in result.samples] == [65.0, 70.0]
    assert not result.rh_as_fraction
    ((line, reason),) = [(s.line, s.reason) for s in result.skipped]
    assert line == 3 and "RH below 1 % looks like a fraction" in reason


def test_one_impossible_date_does_not_stop_the_date_order_detection():
    """13/15/2025 is no date in either order: that row is skipped with a reason and the
    order is found from the others (01/13/2025: month first)."""
    data = _csv(
        "Time,Temp (F),RH",
        "01/12/2025 23:00,65,60",
        "13/15/2025 00:00,64,61",
        "01/13/2025 00:30,64,61",
    )
    result = logimport.read_logger_csv(data)
    assert result.date_order == "mdy"
    assert [s.at for s in result.samples] == [D(2025, 1, 12, 23), D(2025, 1, 13, 0, 30)]
    ((line, reason),) = [(s.line, s.reason) for s in result.skipped]
    assert line == 3 and "'13/15/2025 00:00' is not a real date" in reason


def test_the_date_order_message_does_not_pass_a_date_off_as_the_option():
    """The ambiguous-date message quotes the date as an example, not as the date order
    given."""
    data = _csv("Time,Temp (C),RH", "03/02/2025 10:00,17.5,82", "04/02/2025 10:00,20.5,55")
    with pytest.raises(InputError) as err:
        logimport.read_logger_csv(data)
    assert err.value.value == "(not given)"
    assert "dates such as '03/02/2025 10:00' (line 2)" in err.value.allowed


def test_dates_only_possible_in_opposite_orders_need_the_order_stated():
    """13/01/2025 (day first only) and 01/13/2025 (month first only) in one file contradict
    each other: the import asks for the date order, naming both lines."""
    data = _csv("Time,Temp (C),RH", "13/01/2025 10:00,17.5,82", "01/13/2025 11:00,17.5,82")
    with pytest.raises(InputError) as err:
        logimport.read_logger_csv(data)
    assert err.value.field == "date order"
    assert "(line 2)" in err.value.allowed and "(line 3)" in err.value.allowed


def test_times_with_and_without_utc_offset_do_not_crash():
    """A file mixing '2025-01-15T10:00:00+01:00' with '2025-01-15 09:30' (unorderable in
    Python) keeps the kind most rows have and skips the others with a reason."""
    data = _csv(
        "Time,Temperature (°C),RH (%)",
        "2025-01-15T10:30:00+01:00,18.0,65",
        "2025-01-15 09:30,18.2,66",
        "2025-01-15T10:00:00+01:00,18.3,67",
    )
    result = logimport.read_logger_csv(data)
    assert [s.at.isoformat() for s in result.samples] == [
        "2025-01-15T10:00:00+01:00",
        "2025-01-15T10:30:00+01:00",
    ]
    assert result.reordered
    ((line, reason),) = [(s.line, s.reason) for s in result.skipped]
    assert line == 3 and "no UTC offset" in reason


def test_temp_unit_against_the_header_is_obeyed_with_a_warning():
    """A unit stated as c on a °F header reads °C, and the notes say the header disagreed."""
    data = _csv("Time,Temp (°F),RH (%)", "2025-07-22 14:00,22.5,82")
    result = logimport.read_logger_csv(data, temp_unit="c")
    assert result.samples[0].dry_bulb_c == 22.5
    assert result.unit_source == "stated"
    assert result.notes == [("The header says °F; °C was stated: the temperatures are read as °C.")]
    agreeing = logimport.read_logger_csv(data, temp_unit="f")
    assert agreeing.unit_source == "header" and agreeing.notes == []


# --- layouts found by what the header says -----------------------------------------------


def test_columns_are_found_in_any_order_with_extra_columns_between():
    """Columns in an unusual order among extra columns are found by their names."""
    data = _csv(
        "Humidity (%),Battery (V),Air temperature (°C),Sample index,Timestamp",
        "55.5,3.01,21.25,1,2025-03-04 08:00:00",
        "56.0,3.01,21.00,2,2025-03-04 08:05:00",
    )
    result = logimport.read_logger_csv(data)
    assert result.time_columns == ("Timestamp",) and result.rh_column == "Humidity (%)"
    assert [(s.dry_bulb_c, s.rh_pct) for s in result.samples] == [(21.25, 55.5), (21.0, 56.0)]


def test_several_title_and_settings_lines_above_the_header_are_passed_over():
    """Five title and settings lines above the header are passed over."""
    data = _csv(
        "Export of unit 12",
        "Interval;60 s",
        "Start;2025-03-04 08:00",
        "",
        "Channels;2",
        "Date and time;T (°C);RH (%)",
        "14.03.2025 08:00:00;20,5;61,0",
    )
    result = logimport.read_logger_csv(data)
    assert result.header_line == 6 and result.delimiter == ";"
    assert result.samples[0].at == D(2025, 3, 14, 8) and result.samples[0].dry_bulb_c == 20.5


def test_a_temperature_column_named_only_by_its_unit_is_found():
    """A column called 'Probe 1 [°F]' is the temperature, in °F."""
    data = _csv("Time,Probe 1 [°F],RH [%]", "2025-07-22 14:00,77.0,60")
    result = logimport.read_logger_csv(data)
    assert result.temperature_column == "Probe 1 [°F]" and result.temperature_unit == "f"
    assert result.samples[0].dry_bulb_c == 25.0  # (77 − 32) × 5/9, exact


@pytest.mark.parametrize(
    "when",
    [
        "15 Jan 2025 10:00",
        "15-Jan-25 10:00",
        "Jan 15, 2025 10:00",
        "January 15 2025 10:00:00",
        "15 jan 2025 10:00 AM",
    ],
)
def test_dates_with_the_month_as_a_word_are_read(when):
    """Dates with an English month name, day or month first, read as 15 January 2025 10:00."""
    data = _csv("Time;Temperature (°C);RH (%)", f"{when};18,0;65")
    assert logimport.read_logger_csv(data).samples[0].at == D(2025, 1, 15, 10, 0)


def test_a_month_word_that_is_no_month_is_a_skipped_row():
    """'15 Foo 2025' is not a date: that row is skipped with the reason."""
    data = _csv(
        "Time,Temperature (°C),RH (%)", "15 Foo 2025 10:00,18,65", "15 Jan 2025 10:30,18,65"
    )
    result = logimport.read_logger_csv(data)
    assert len(result.samples) == 1
    assert result.skipped[0].line == 2 and "is not a date and time" in result.skipped[0].reason


def test_tab_separated_with_decimal_commas_and_two_digit_years():
    """Tabs, decimal commas and dd/mm/yy dates (a day above 12 settles the order)."""
    data = _csv(
        "Date/time\tTemperature °C\tRel. humidity %",
        "13/02/25 09:00\t-2,5\t88,5",
        "13/02/25 09:15\t-2,0\t87,0",
    )
    result = logimport.read_logger_csv(data)
    assert result.delimiter == "\t" and result.date_order == "dmy"
    assert [(s.at, s.dry_bulb_c, s.rh_pct) for s in result.samples] == [
        (D(2025, 2, 13, 9, 0), -2.5, 88.5),
        (D(2025, 2, 13, 9, 15), -2.0, 87.0),
    ]


def test_errors_name_the_quantity_not_an_option():
    """No error or note of the reader names a command-line option."""
    cases = [
        _csv("a,b,c"),
        _csv("time,temp,rh", "2025-07-22 14:00,22.5,82"),
        _csv("Time,Temp (C),RH", "03/02/2025 10:00,17.5,82"),
    ]
    for data in cases:
        with pytest.raises(InputError) as err:
            logimport.read_logger_csv(data)
        assert "--" not in str(err.value)
    note = logimport.read_logger_csv(
        _csv("Time,Temp (°F),RH", "2025-07-22 14:00,22.5,82"), temp_unit="c"
    ).notes
    assert note and "--" not in note[0]


def test_a_column_that_says_temperature_wins_over_one_with_only_a_unit():
    """With 'Probe (°C)' before 'Air temperature (°C)', the one that says temperature is read."""
    data = _csv("Time,Probe (°C),Air temperature (°C),RH (%)", "2025-07-22 14:00,5.0,21.5,60")
    result = logimport.read_logger_csv(data)
    assert result.temperature_column == "Air temperature (°C)"
    assert result.samples[0].dry_bulb_c == 21.5


def test_an_rh_column_naming_a_reference_temperature_is_not_the_temperature():
    """'RH at 20 °C (%)' is the RH column, not a temperature column."""
    data = _csv("Time,RH at 20 °C (%),Reading (°C)", "2025-07-22 14:00,60,21.5")
    result = logimport.read_logger_csv(data)
    assert result.rh_column == "RH at 20 °C (%)" and result.temperature_column == "Reading (°C)"
