"""Parsing what a person types and formatting for display, in SI and IP.

Conversion factors checked here are definitions: °F = °C × 1.8 + 32; 1 inHg = 3386.389 Pa
(conventional, at 0 °C; NIST SP 811 Appendix B); 1 ft = 0.3048 m (exact, international foot);
7000 grains = 1 lb (exact); 1 US pint = 0.473176 L (NIST SP 811).
"""

from __future__ import annotations

import math
import unicodedata

import pytest
from hypothesis import example, given, settings
from hypothesis import strategies as st

from survey import units
from survey.errors import InputError


@pytest.mark.parametrize(
    ("text", "expected_c"),
    [
        ("21", 21.0),
        ("21.5", 21.5),
        ("21,5", 21.5),
        ("21 °C", 21.0),
        ("21C", 21.0),
        ("21 c", 21.0),
        ("21degC", 21.0),
        ("70F", 21.1111111),
        ("70 °F", 21.1111111),
        ("294.15 K", 21.0),
        ("-5", -5.0),
        ("\u22125,5", -5.5),
        (" 18.0 ", 18.0),
        (21, 21.0),
    ],
)
def test_parse_temperature_si(text, expected_c):
    """Temperatures in the forms a person types, bare numbers read as °C."""
    assert units.parse_temperature(text, "--air-temp", "si") == pytest.approx(expected_c)


def test_bare_number_is_fahrenheit_in_ip():
    """In an IP survey a bare 70 is 70 °F (21.11 °C); a typed unit still wins."""
    assert units.parse_temperature("70", "t", "ip") == pytest.approx(21.1111111)
    assert units.parse_temperature("21 °C", "t", "ip") == pytest.approx(21.0)


@pytest.mark.parametrize("text", ["65", "65 %", "65%", "65,0 %"])
def test_parse_rh(text):
    """RH as a percentage, with or without the sign."""
    assert units.parse_rh(text, "--rh") == pytest.approx(65.0)


@pytest.mark.parametrize(
    ("text", "system", "expected_pa"),
    [
        ("1013 hPa", "si", 101_300.0),
        ("1002hPa", "si", 100_200.0),
        ("101.3 kPa", "si", 101_300.0),
        ("29.92 inHg", "si", 101_320.8),
        ("1013", "si", 101_300.0),
        ("29.92", "ip", 101_320.8),
        ("1013 mbar", "ip", 101_300.0),
    ],
)
def test_parse_pressure(text, system, expected_pa):
    """Pressure in hPa, kPa, mbar or inHg (29.92 inHg × 3386.389 Pa = 101 320.8 Pa)."""
    assert units.parse_pressure(text, "--pressure", system) == pytest.approx(expected_pa, rel=1e-5)


@pytest.mark.parametrize(
    ("text", "system", "expected_m"),
    [
        ("350 m", "si", 350.0),
        ("1150 ft", "si", 350.52),
        ("350", "si", 350.0),
        ("1150", "ip", 350.52),
    ],
)
def test_parse_length(text, system, expected_m):
    """Altitude in metres or feet (1 ft = 0.3048 m exactly)."""
    assert units.parse_length(text, "--altitude", system) == pytest.approx(expected_m)


@pytest.mark.parametrize(
    ("parse", "text", "fragment"),
    [
        (units.parse_temperature, "warm", "expected a number"),
        (units.parse_temperature, "", "expected a number"),
        (units.parse_temperature, "21 hPa", "not a temperature unit"),
        (units.parse_temperature, "21 parsecs", "not a temperature unit"),
        (units.parse_rh, "65 g", "percentage"),
        (units.parse_pressure, "1013 m", "not a pressure unit"),
        (units.parse_length, "350 °C", "not a length unit"),
        (units.parse_temperature, "inf", "expected a number"),
        (units.parse_number, "2 m", "no unit"),
    ],
)
def test_parse_failures_name_field_text_and_what_is_accepted(parse, text, fragment):
    """Every parse failure is an InputError with the field, the text and what is accepted."""
    with pytest.raises(InputError) as info:
        parse(text, "the field")
    assert info.value.field == "the field"
    assert fragment in info.value.allowed
    assert "the field" in str(info.value)


@pytest.mark.parametrize(
    "text",
    [
        "21 °C)",
        "21 (",
        "21 C/0",
        "21 %**0",
        "21 °C,",
        "21 °C °C",
        "21 degC*2",
        "1e400",
        "21 kelvin**2",
    ],
)
def test_unit_text_is_never_evaluated_as_an_expression(text):
    """Junk after the number is refused with InputError, never passed to pint's parser."""
    with pytest.raises(InputError):
        units.parse_temperature(text, "t")


@pytest.mark.parametrize("text", ["1013 (hPa", "1013 hPa/1", "1,013.25 hPa", "1013 hPa hPa"])
def test_pressure_junk_is_refused(text):
    """Malformed pressures (including thousands separators) are refused, not guessed."""
    with pytest.raises(InputError):
        units.parse_pressure(text, "p")


def test_bare_degree_sign_follows_the_unit_system():
    """'70°' is 70 °F in an IP survey and 70 °C in an SI one; ℃ and ℉ are understood."""
    assert units.parse_temperature("70°", "t", "ip") == pytest.approx(21.1111111)
    assert units.parse_temperature("21°", "t", "si") == pytest.approx(21.0)
    assert units.parse_temperature("21 ℃", "t", "ip") == pytest.approx(21.0)
    assert units.parse_temperature("70℉", "t", "si") == pytest.approx(21.1111111)


def test_rh_typed_as_a_fraction_is_refused():
    """0.65 typed for 65 % is refused with a hint; '0.65 %' is taken as meant."""
    with pytest.raises(InputError) as info:
        units.parse_rh("0.65", "--rh")
    assert "fraction" in info.value.allowed
    assert units.parse_rh("0.65 %", "--rh") == pytest.approx(0.65)


def test_ip_enthalpy_uses_the_ip_datum():
    """IP enthalpy counts from dry air at 0 °F: at 70 °F / 50 % it is 25.30 Btu/lb by ASHRAE
    Fundamentals 2017 ch. 1 IP eqn 30, h = 0.240 t + W (1061 + 0.444 t) (computed)."""
    from survey import psychro

    state = psychro.state_from_rh((70 - 32) / 1.8, 50.0)
    w = state.humidity_ratio_kg_per_kg
    ashrae_ip = 0.240 * 70 + w * (1061 + 0.444 * 70)
    shown = units.to_display("enthalpy", state.enthalpy_j_per_kg, "ip")
    assert shown == pytest.approx(ashrae_ip, abs=0.05)
    assert shown == pytest.approx(25.30, abs=0.05)


def test_ip_density_volume_and_absolute_humidity_factors():
    """IP conversions against definitions: 1 lb = 0.45359237 kg, 1 ft = 0.3048 m,
    7000 grains = 1 lb (NIST SP 811 Appendix B)."""
    lb, ft3 = 0.45359237, 0.3048**3
    assert units.to_display("density", 1.2, "ip") == pytest.approx(1.2 * ft3 / lb)
    assert units.to_display("specific_volume", 0.85, "ip") == pytest.approx(0.85 / ft3 * lb)
    grains_per_g = 7000.0 / 453.59237
    assert units.to_display("absolute_humidity", 10.0, "ip") == pytest.approx(
        10.0 * grains_per_g * ft3
    )
    assert units.to_display("humidity_ratio", 0.010, "ip") == pytest.approx(70.0)


def test_unknown_unit_system_is_refused():
    """Only si and ip are unit systems."""
    with pytest.raises(InputError):
        units.parse_temperature("21", "t", "metric")


@pytest.mark.parametrize(
    ("quantity", "value", "system", "expected"),
    [
        ("temperature", 21.0, "si", "21.0 °C"),
        ("temperature", 21.0, "ip", "69.8 °F"),  # 21 × 1.8 + 32
        ("temperature_difference", 3.0, "ip", "5.4 °F"),  # a 3 K difference is 5.4 °F
        ("humidity_ratio", 0.01, "si", "10.00 g/kg"),
        ("humidity_ratio", 0.01, "ip", "70.0 gr/lb"),  # 7000 grains per pound
        ("pressure", 101_330.0, "si", "1013.3 hPa"),
        ("pressure", 101_325.0, "ip", "29.92 inHg"),
        ("length", 350.0, "ip", "1148 ft"),
        ("water_rate", 10.0, "ip", "21.1 pt/day"),  # 10 L / 0.473176 L
        ("airflow", 100.0, "ip", "59 cfm"),  # 100 m³/h / 1.69901 (m³/h per cfm)
        ("temperature", None, "si", "–"),
    ],
)
def test_format_value(quantity, value, system, expected):
    """Display formatting in SI and IP with the right unit text."""
    assert units.format_value(quantity, value, system) == expected


@settings(max_examples=100, deadline=None)
@given(st.floats(min_value=-50.0, max_value=70.0), st.sampled_from(["si", "ip"]))
def test_temperature_format_parse_round_trip(temp_c, system):
    """Formatting a temperature and typing it back gives the same value to display precision."""
    text = units.format_value("temperature", temp_c, system, decimals=3)
    tolerance = 0.0005 if system == "si" else 0.0005 / 1.8
    assert units.parse_temperature(text, "t", system) == pytest.approx(temp_c, abs=tolerance + 1e-9)


@settings(max_examples=100, deadline=None)
@given(st.floats(min_value=50_000.0, max_value=110_000.0), st.sampled_from(["si", "ip"]))
def test_pressure_format_parse_round_trip(pressure_pa, system):
    """Formatting a pressure and typing it back (with its unit) round-trips."""
    text = units.format_value("pressure", pressure_pa, system, decimals=6)
    assert units.parse_pressure(text, "p", system) == pytest.approx(pressure_pa, rel=1e-6)


@settings(max_examples=100, deadline=None)
@given(
    st.sampled_from(
        [
            "temperature",
            "humidity_ratio",
            "absolute_humidity",
            "enthalpy",
            "airflow",
            "water_rate",
            "length",
        ]
    ),
    st.floats(min_value=0.001, max_value=1000.0),
    st.sampled_from(["si", "ip"]),
)
# Found by exploring: 0.0033 J/kg came back as 0.0033407199626 (3.4e-12 J/kg off).
@example("enthalpy", 0.003340719959137196, "ip")
def test_display_conversion_round_trip(quantity, value, system):
    """to_display and from_display are inverses for every display quantity.

    Both are x -> f·(x + s) + o. Where the display unit counts from another zero (°F; IP
    enthalpy from dry air at 0 °F, s = 17 884 J/kg) the intermediate sum is rounded to the
    float spacing near the datum, not near x: 17 884 J/kg carries 3.6e-12 J/kg (2^-38), which
    is 1e-9 of a value of 0.0036 J/kg. No arithmetic can return what that rounding dropped, so
    the 1e-9 relative tolerance is taken of |x| + |datum|, the datum being the core value
    shown as 0 (from_display(q, 0)): 17 884 J/kg for IP enthalpy, 17.8 °C for °F, 0 else."""
    shown = units.to_display(quantity, value, system)
    datum = abs(units.from_display(quantity, 0.0, system))
    back = units.from_display(quantity, shown, system)
    assert back == pytest.approx(value, rel=1e-9, abs=1e-9 * datum)


def test_round_trip_error_near_the_ip_enthalpy_datum_is_float_spacing():
    """The round trip's error near 0 J/kg is a few float spacings of the 17 884 J/kg datum
    (math.ulp), the bound the tolerance above rests on; the display shows 0.1 Btu/lb."""
    datum = 1006.0 * 32.0 / 1.8  # cp_da × 17.78 K, the shift in units_display._DATUM_SHIFT
    for value in (0.001, 0.003340719959137196, 0.5, 1.0):
        back = units.from_display("enthalpy", units.to_display("enthalpy", value, "ip"), "ip")
        assert abs(back - value) <= 4 * math.ulp(datum)


@pytest.mark.parametrize(
    ("text", "system", "expected_m3"),
    [
        ("30", "si", 30.0),
        ("30 m3", "si", 30.0),
        ("30 m³", "ip", 30.0),
        ("1060", "ip", 1060 * 0.3048**3),
        ("1060 ft3", "si", 1060 * 0.3048**3),
        ("30000 L", "si", 30.0),
    ],
)
def test_parse_volume(text, system, expected_m3):
    """Room volume in m³, ft³ (1 ft = 0.3048 m exactly) or litres."""
    assert units.parse_volume(text, "--room-volume", system) == pytest.approx(expected_m3)


# --- numbers as people type them, and only those -------------------------------------------


def _raw_controls(text: str) -> list[str]:
    """Characters that must not reach a terminal raw (survey.safe_text's categories: control,
    format, surrogate, line and paragraph separators; tab is harmless and kept)."""
    return [
        c for c in text if c != "\t" and unicodedata.category(c) in ("Cc", "Cf", "Cs", "Zl", "Zp")
    ]


@pytest.mark.parametrize(
    ("text", "fragment"),
    [
        ("２１", "digits other than 0-9"),  # full-width digits
        ("\u0662\u0661", "digits other than 0-9"),  # Arabic-Indic 21
        ("\u0968\u0967", "digits other than 0-9"),  # Devanagari 21
        (",5", "starts with a decimal comma"),
        ("-,5", "starts with a decimal comma"),
        ("1e-400", "too small to compute with (read as 0)"),
        ("1e-310", "too small to compute with"),  # below the smallest normal float
        ("1e309", "too large to compute with"),
        ("nan", "not a number to compute with"),
        ("NaN", "not a number to compute with"),
        ("inf", "not a number to compute with"),
        ("-Infinity", "not a number to compute with"),
        ("2\n1", "line break"),
        ("21\r\n°C", "line break"),
        ("21\x1b[2J", "control character"),
        ("21\u202e", "control character"),  # a bidi override
        ("0x15", "'0x15' is not a decimal number (hexadecimal"),
        ("0X1F", "'0X1F' is not a decimal number"),
        ("0b101", "'0b101' is not a decimal number"),
        ("1_000", "'1_000' has an underscore"),
        ("21_5", "'21_5' has an underscore"),
        ("1,013.25", "'1,013.25' has a thousands separator"),
        ("1 013", "'1 013' has a thousands separator or a space inside"),
        ("21,", "'21,' has a thousands separator"),
        ("9" * 101, "101 characters is too long for a number"),
    ],
)
def test_numbers_people_do_not_type_are_refused_saying_what_was_read(text, fragment):
    """Each odd number is refused with the field, the text as read (control characters made
    visible) and what was wrong with it; nothing is guessed."""
    with pytest.raises(InputError) as info:
        units.parse_temperature(text, "--air-temp")
    message = str(info.value)
    assert fragment in info.value.allowed
    assert message.startswith("--air-temp ")
    assert not _raw_controls(message) and len(message) < 400


@pytest.mark.parametrize(
    ("text", "expected"),
    [
        (".5", 0.5),
        ("-.5", -0.5),
        ("\u2212.5", -0.5),
        ("21.", 21.0),
        ("0,5", 0.5),
        ("1.2e1", 12.0),
        ("1,5E1", 15.0),
        (" 21 \n", 21.0),
        ("21\u00a0°C", 21.0),
        ("21\u202f°C", 21.0),
        ("21\t°C", 21.0),
        ("0e5", 0.0),
        ("0x", None),
    ],
)
def test_numbers_people_type(text, expected):
    """A leading decimal point (".5", as IP practice and data sheets write it), a trailing
    one, a decimal comma with a digit before it, an exponent, surrounding whitespace and a
    no-break or thin space before the unit are read; "0x" is refused as an unknown unit."""
    if expected is None:
        with pytest.raises(InputError, match="not a temperature unit"):
            units.parse_temperature(text, "t")
    else:
        assert units.parse_temperature(text, "t") == pytest.approx(expected)


def test_a_unit_like_typo_is_named_as_the_whole_text():
    """'0x15' and '1_000' are mistyped numbers, not a number and the unit 'x15' or '_000'."""
    for text in ("0x15", "1_000"):
        with pytest.raises(InputError) as info:
            units.parse_volume(text, "--room-volume")
        assert f"'{text}'" in info.value.allowed
        assert "unit '" not in info.value.allowed


def test_a_number_beyond_the_float_range_is_refused():
    """An int too large for a float, or a conversion that overflows, is an InputError."""
    with pytest.raises(InputError, match="too large"):
        units.parse_temperature(10**400, "t")
    with pytest.raises(InputError, match="too large"):
        units.parse_pressure("1e308", "p", "ip")  # × 3386.389 Pa per inHg overflows
    with pytest.raises(InputError, match="too large"):
        units.parse_pressure("1e308 inHg", "p")


@settings(max_examples=300, deadline=None)
@given(
    st.text(max_size=30),
    st.sampled_from(
        [
            "temperature",
            "temperature_difference",
            "relative_humidity",
            "pressure",
            "length",
            "volume",
            "area",
            "water_volume",
            "water_mass",
            "power",
            "energy",
            "duration",
            "water_rate",
            "energy_factor",
            "number",
        ]
    ),
    st.sampled_from(["si", "ip"]),
)
def test_any_text_reads_as_a_finite_number_or_is_refused_in_one_short_line(text, quantity, system):
    """Whatever is typed, read() gives a finite float from ASCII digits or an InputError whose
    message is one printable line of bounded length."""
    try:
        reading = units.read(quantity, text, "field", system)
    except InputError as exc:
        message = str(exc)
        assert not _raw_controls(message) and len(message) < 400
    else:
        assert math.isfinite(reading.value)
        assert all("0" <= c <= "9" for c in text if unicodedata.category(c) == "Nd")


# --- what a value was read as ----------------------------------------------------------------


@pytest.mark.parametrize(
    ("quantity", "text", "system", "read_as"),
    [
        ("volume", "30 ft3", "si", "0.85 m³"),  # 30 × 0.3048³ = 0.8495 m³ (exact foot)
        ("volume", "30000 L", "si", "30 m³"),  # 1 L = 0.001 m³ (definition)
        ("temperature", "21 K", "si", "\u2212252.15 °C"),  # 21 − 273.15 (definition of °C)
        ("temperature", "200", "ip", "93.33 °C"),  # (200 − 32) / 1.8
        ("temperature", "70F", "si", "21.11 °C"),  # (70 − 32) / 1.8
        ("temperature_difference", "10F", "si", "5.56 K"),  # 10 / 1.8
        ("pressure", "29.92 inHg", "si", "1013.21 hPa"),  # × 33.86389 hPa per inHg (NIST SP 811)
        ("length", "1150 ft", "si", "350.52 m"),  # × 0.3048 m per ft
        ("area", "6 sq ft", "si", "0.557 m²"),  # 6 × 0.3048² = 0.5574 m² (exact foot)
        ("area", "6", "ip", "0.557 m²"),  # a bare number is ft² in IP
        ("area", "500 cm2", "si", "0.05 m²"),  # 1 cm² = 1e-4 m² (definition)
        ("water_volume", "2.5 pt", "si", "1.18 L"),  # 1 US pint = 0.473176473 L (NIST)
        ("water_volume", "2.5", "ip", "1.18 L"),  # a bare number is US pints in IP
        ("water_volume", "0.5 gal", "si", "1.89 L"),  # 1 US gallon = 3.785411784 L (NIST)
        ("water_volume", "1200 mL", "si", "1.2 L"),  # 1 mL = 0.001 L (definition)
        ("water_mass", "2.6 lb", "si", "1.18 kg"),  # 1 lb = 0.45359237 kg exactly
        ("water_mass", "2.6", "ip", "1.18 kg"),  # a bare number is lb in IP
        ("power", "0.54 kW", "si", "540 W"),  # 1 kW = 1000 W
        ("power", "1000 Btu/h", "si", "293.07 W"),  # 1 Btu/h = 0.29307 W (IT Btu, NIST SP 811)
        ("power", "540", "ip", ""),  # watts in both systems
        ("energy", "750 Wh", "si", "0.75 kWh"),
        ("duration", "180 min", "si", "3 h"),
        ("duration", "2 days", "si", "48 h"),
        ("water_rate", "42 pints/day", "si", "19.87 L/day"),  # 42 × 0.473176473
        ("water_rate", "42", "ip", "19.87 L/day"),  # a bare number is US pints/day in IP
        ("water_rate", "20 L / day", "si", ""),  # spaces inside the unit
        ("energy_factor", "1.8 L/kWh", "si", ""),
        ("temperature", "21", "si", ""),  # nothing converted: nothing to say
        ("temperature", "21 °C", "ip", ""),
        ("temperature", "-40", "ip", ""),  # −40 °F is −40 °C
        ("pressure", "1013", "si", ""),  # bare hPa in SI, limits in hPa
        ("relative_humidity", "65 %", "si", ""),
    ],
)
def test_read_as_says_what_a_converted_value_became(quantity, text, system, read_as):
    """read_as gives the value in the unit the limits are written in, only when a unit or the
    IP system changed the number typed."""
    assert units.read(quantity, text, "f", system).read_as == read_as


def test_a_range_error_after_a_conversion_says_what_it_was_read_as():
    """`--room-volume '30 ft3'` and `--air-temp '21 K'` fail their ranges naming the text and
    what it was read as; a value typed in the limits' own unit says nothing more."""
    from survey import psychro

    volume = units.read("volume", "30 ft3", "--room-volume", "si")
    error = volume.error("room volume must be between 1 and 100000 m³")
    assert str(error) == (
        "--room-volume 30 ft3 (read as 0.85 m³): room volume must be between 1 and 100000 m³"
    )
    assert error.read_as == "0.85 m³" and error.value == "30 ft3"
    with pytest.raises(InputError) as info:
        units.read("temperature", "21 K", "--air-temp").checked(psychro.check_dry_bulb)
    assert str(info.value).startswith(
        "--air-temp 21 K (read as \u2212252.15 °C): air temperature must be between -50 and 70 °C"
    )
    with pytest.raises(InputError) as info:
        units.read("temperature", "80", "--air-temp").checked(psychro.check_dry_bulb)
    assert str(info.value).startswith("--air-temp 80: air temperature must be")
    assert units.read("temperature", "70F", "--air-temp").checked(
        psychro.check_dry_bulb
    ) == pytest.approx(21.1111111)


def test_input_error_quotes_the_value_short_and_visible():
    """A long or hostile value is quoted shortened with its control characters escaped; the
    error keeps the value as given, and with_field keeps what it was read as."""
    from survey.safe_text import QUOTE_MAX_CHARS

    error = InputError("--rh", "\x1b]0;title\x07" + "9" * 500, "expected a percentage")
    assert not _raw_controls(str(error)) and "\\x1b" in str(error)
    assert len(str(error)) < QUOTE_MAX_CHARS + 40
    assert error.value.startswith("\x1b")
    moved = InputError("volume", "30 ft3", "too small", read_as="0.85 m³").with_field(
        "--surface", "wall:30 ft3"
    )
    assert str(moved) == "--surface wall:30 ft3 (read as 0.85 m³): too small"
    assert moved.with_field("x").value == "wall:30 ft3"


def test_instrument_accuracy_minimums_lie_above_zero_and_below_the_defaults():
    """An accuracy of 0 is outside the domain; every default accuracy is inside it."""
    from survey import domain
    from survey import thresholds as th

    for low, high, default in (
        (
            domain.AIR_TEMP_ACCURACY_MIN_K,
            domain.AIR_TEMP_ACCURACY_MAX_K,
            th.value("accuracy_air_temp_k"),
        ),
        (domain.RH_ACCURACY_MIN_PCT, domain.RH_ACCURACY_MAX_PCT, th.value("accuracy_rh_pct")),
        (
            domain.SURFACE_TEMP_ACCURACY_MIN_K,
            domain.SURFACE_TEMP_ACCURACY_MAX_K,
            th.value("accuracy_surface_temp_k"),
        ),
    ):
        assert 0.0 < low < default <= high


def test_read_any_takes_the_quantity_whose_unit_was_typed():
    """Water collected may be a volume or a mass, what a unit used a power or an energy:
    the unit typed picks the quantity; a bare number is the first; another unit is refused
    naming both kinds."""
    assert units.read_any(("water_volume", "water_mass"), "1.2 kg", "w").quantity == "water_mass"
    assert units.read_any(("water_volume", "water_mass"), "11 L", "w").quantity == "water_volume"
    assert units.read_any(("water_volume", "water_mass"), "11", "w").quantity == "water_volume"
    reading = units.read_any(("power", "energy"), "12.9kWh", "p")
    assert (reading.quantity, reading.value) == ("energy", 12.9)
    with pytest.raises(InputError, match="not a power or energy unit"):
        units.read_any(("power", "energy"), "12 V", "p")


def test_a_volume_refused_says_dimensions_are_taken_too():
    """Where dimensions are read (a room's volume), a refused volume says so: the message
    once offered only ``30, 30 m3, 1060 ft3``."""
    from survey import quick
    from survey.errors import InputError

    for read in (units.parse_volume_or_dimensions, quick.read_room_volume):
        with pytest.raises(InputError) as caught:
            read("abc", "Room volume")
        assert str(caught.value).endswith("or three dimensions: 4.2 x 3.1 x 2.4")
        assert caught.value.value == "abc"
