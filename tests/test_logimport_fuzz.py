"""The logger reader on random input: a result or an InputError, never another exception.

Random bytes, random text, and — to get past the header search — random rows under logger-like
headers with random cells drawn from what logger files hold (numbers with decimal commas,
dates in several orders, offsets, AM/PM, quotes, separators, empty cells, long cells).
Every sample the reader returns must be one a survey file accepts.
"""

from __future__ import annotations

import msgspec
import pytest
from hypothesis import HealthCheck, given, settings
from hypothesis import strategies as st

from survey import logimport, model
from survey.errors import InputError

_SETTINGS = settings(
    max_examples=int(__import__("os").environ.get("FUZZ_N", "150")),
    deadline=None,
    suppress_health_check=[HealthCheck.too_slow, HealthCheck.data_too_large],
)

_HEADERS = [
    "Time,Temperature (°C),RH (%)",
    '"No.","Sample time, local","Air temp, °F","Rel. humidity, %"',
    "Datum/Zeit;Lufttemperatur [°C];rel. Feuchte [%]",
    "Date\tTime\tReading °C\tHumidity %",
    "timestamp,temp,rh",
    "Time,Temperature,Humidity",
]
_CELLS = st.one_of(
    st.sampled_from(
        [
            "",
            " ",
            "Err",
            "-",
            "NaN",
            "inf",
            "1e400",
            "0",
            "0,81",
            "0.65",
            "101",
            "-3,5",
            "68.0",
            "\u221212",
            "12/13/2025 10:00",
            "13/15/2025 10:00",
            "03/04/2025 10:00",
            "01/15/25 11:30:00 PM",
            "2025-01-15T10:00:00+01:00",
            "2025-01-15 10:00",
            "2025-01-15T10:00+05:30:30",
            "15.01.2025 22:00",
            "0001-01-01T00:00",
            "9999-12-31T23:59:59.999999",
            "2025-02-30 10:00",
            '"',
            '""',
            "°F",
            "%RH",
            "00/00/0000 25:61",
            "١٢/٠١/٢٠٢٥ 10:00",
        ]
    ),
    st.floats(allow_nan=True, allow_infinity=True).map(repr),
    st.integers(-(10**6), 10**6).map(str),
    st.text(max_size=12),
)


@st.composite
def _logger_files(draw) -> bytes:
    header = draw(st.sampled_from(_HEADERS))
    sep = {",": ",", ";": ";", "\t": "\t"}[next(c for c in (";", "\t", ",") if c in header)]
    rows = draw(st.lists(st.lists(_CELLS, min_size=0, max_size=6).map(sep.join), max_size=12))
    preamble = draw(st.lists(st.text(max_size=20), max_size=2))
    newline = draw(st.sampled_from(["\n", "\r\n", "\r"]))
    text = newline.join([*preamble, header, *rows])
    encoding = draw(st.sampled_from(["utf-8", "utf-16", "cp1252", "latin-1"]))
    return text.encode(encoding, errors="replace")


def _read(data: bytes, **options) -> None:
    try:
        result = logimport.read_logger_csv(data, **options)
    except InputError as exc:  # any refusal must name its quantity and say what is allowed
        assert (  # noqa: PT017
            exc.field in (logimport.FILE_FIELD, logimport.UNIT_FIELD, logimport.ORDER_FIELD)
            and exc.allowed
        )
        return
    assert result.samples
    for sample in result.samples:
        msgspec.json.decode(msgspec.json.encode(sample), type=model.LogSample)
    assert all(row.reason for row in result.skipped)


@_SETTINGS
@given(st.binary(max_size=2000))
def test_random_bytes_never_raise_anything_but_input_error(data):
    """Arbitrary bytes: a result or InputError."""
    _read(data)


@_SETTINGS
@given(
    _logger_files(), st.sampled_from([None, "c", "f"]), st.sampled_from([None, "dmy", "mdy", "ymd"])
)
def test_random_rows_under_logger_headers_never_raise_anything_but_input_error(
    data, temp_unit, date_order
):
    """Random cells under logger-like headers, with any options: a result or InputError,
    and every sample returned is valid for a survey file."""
    _read(data, temp_unit=temp_unit, date_order=date_order)


@pytest.mark.parametrize("tail", ["", '"'])
def test_a_line_too_long_for_the_csv_module_is_a_skipped_row(tail):
    """A 200 000-character field (over the csv module's 131 072 limit) is reported as a
    skipped line, and the other rows are imported."""
    data = (
        "Time,Temperature (°C),RH (%)\n2025-01-15 10:00,20.0,55\n"
        f"2025-01-15 10:30,{tail}{'9' * 200_000}{tail},55\n2025-01-15 11:00,20.5,54\n"
    ).encode()
    result = logimport.read_logger_csv(data)
    assert len(result.samples) == 2
    ((line, reason),) = [(s.line, s.reason) for s in result.skipped]
    assert line == 3 and "characters long" in reason


def test_a_quoted_field_spanning_many_lines_beyond_the_limit_is_an_input_error():
    """A quoted field running over many short lines past the csv limit: a clear InputError."""
    data = ('Time,Temperature (°C),RH (%)\n2025-01-15 10:00,20.0,"' + "x" * 5000 + "\n") * 1
    data += ("y" * 5000 + "\n") * 40
    with pytest.raises(InputError) as err:
        logimport.read_logger_csv(data.encode())
    assert err.value.field == "logger file" and "cannot be read as CSV" in err.value.allowed
