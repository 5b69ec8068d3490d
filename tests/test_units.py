"""Parsing what a person types and formatting for display, in SI and IP.

Conversion factors checked here are definitions: °F = °C × 1.8 + 32; 1 inHg = 3386.389 Pa
(conventional, at 0 °C; NIST SP 811 Appendix B); 1 ft = 0.3048 m (exact, international foot);
7000 grains = 1 lb (exact); 1 US pint = 0.473176 L (NIST SP 811).
"""

from __future__ import annotations

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from survey import units
from survey.errors import InputError


@pytest.mark.parametrize(("text", "expected_c"), [
    ("21", 21.0), ("21.5", 21.5), ("21,5", 21.5), ("21 °C", 21.0), ("21C", 21.0),
    ("21 c", 21.0), ("21degC", 21.0), ("70F", 21.1111111), ("70 °F", 21.1111111),
    ("294.15 K", 21.0), ("-5", -5.0), ("\u22125,5", -5.5), (" 18.0 ", 18.0), (21, 21.0),
])
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


@pytest.mark.parametrize(("text", "system", "expected_pa"), [
    ("1013 hPa", "si", 101_300.0), ("1002hPa", "si", 100_200.0), ("101.3 kPa", "si", 101_300.0),
    ("29.92 inHg", "si", 101_320.8), ("1013", "si", 101_300.0), ("29.92", "ip", 101_320.8),
    ("1013 mbar", "ip", 101_300.0),
])
def test_parse_pressure(text, system, expected_pa):
    """Pressure in hPa, kPa, mbar or inHg (29.92 inHg × 3386.389 Pa = 101 320.8 Pa)."""
    assert units.parse_pressure(text, "--pressure", system) == pytest.approx(expected_pa, rel=1e-5)


@pytest.mark.parametrize(("text", "system", "expected_m"), [
    ("350 m", "si", 350.0), ("1150 ft", "si", 350.52), ("350", "si", 350.0),
    ("1150", "ip", 350.52),
])
def test_parse_length(text, system, expected_m):
    """Altitude in metres or feet (1 ft = 0.3048 m exactly)."""
    assert units.parse_length(text, "--altitude", system) == pytest.approx(expected_m)


@pytest.mark.parametrize(("parse", "text", "fragment"), [
    (units.parse_temperature, "warm", "expected a number"),
    (units.parse_temperature, "", "expected a number"),
    (units.parse_temperature, "21 hPa", "not a temperature unit"),
    (units.parse_temperature, "21 parsecs", "not a temperature unit"),
    (units.parse_rh, "65 g", "percentage"),
    (units.parse_pressure, "1013 m", "not a pressure unit"),
    (units.parse_length, "350 °C", "not a length unit"),
    (units.parse_temperature, "inf", "expected a number"),
    (units.parse_number, "2 m", "no unit"),
])
def test_parse_failures_name_field_text_and_what_is_accepted(parse, text, fragment):
    """Every parse failure is an InputError with the field, the text and what is accepted."""
    with pytest.raises(InputError) as info:
        parse(text, "the field")
    assert info.value.field == "the field"
    assert fragment in info.value.allowed
    assert "the field" in str(info.value)


@pytest.mark.parametrize("text", ["21 °C)", "21 (", "21 C/0", "21 %**0", "21 °C,",
                                  "21 °C °C", "21 degC*2", "1e400", "21 kelvin**2"])
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
    lb, ft3 = 0.45359237, 0.3048 ** 3
    assert units.to_display("density", 1.2, "ip") == pytest.approx(1.2 * ft3 / lb)
    assert units.to_display("specific_volume", 0.85, "ip") == pytest.approx(0.85 / ft3 * lb)
    grains_per_g = 7000.0 / 453.59237
    assert units.to_display("absolute_humidity", 10.0, "ip") == pytest.approx(
        10.0 * grains_per_g * ft3)
    assert units.to_display("humidity_ratio", 0.010, "ip") == pytest.approx(70.0)


def test_unknown_unit_system_is_refused():
    """Only si and ip are unit systems."""
    with pytest.raises(InputError):
        units.parse_temperature("21", "t", "metric")


@pytest.mark.parametrize(("quantity", "value", "system", "expected"), [
    ("temperature", 21.0, "si", "21.0 °C"),
    ("temperature", 21.0, "ip", "69.8 °F"),          # 21 × 1.8 + 32
    ("temperature_difference", 3.0, "ip", "5.4 °F"),  # a 3 K difference is 5.4 °F
    ("humidity_ratio", 0.01, "si", "10.00 g/kg"),
    ("humidity_ratio", 0.01, "ip", "70.0 gr/lb"),     # 7000 grains per pound
    ("pressure", 101_330.0, "si", "1013.3 hPa"),
    ("pressure", 101_325.0, "ip", "29.92 inHg"),
    ("length", 350.0, "ip", "1148 ft"),
    ("water_rate", 10.0, "ip", "21.1 pt/day"),        # 10 L / 0.473176 L
    ("airflow", 100.0, "ip", "59 cfm"),                # 100 m³/h / 1.69901 (m³/h per cfm)
    ("temperature", None, "si", "–"),
])
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
@given(st.sampled_from(["temperature", "humidity_ratio", "absolute_humidity", "enthalpy",
                        "airflow", "water_rate", "length"]),
       st.floats(min_value=0.001, max_value=1000.0), st.sampled_from(["si", "ip"]))
def test_display_conversion_round_trip(quantity, value, system):
    """to_display and from_display are inverses for every display quantity."""
    shown = units.to_display(quantity, value, system)
    assert units.from_display(quantity, shown, system) == pytest.approx(value, rel=1e-9)


@pytest.mark.parametrize(("text", "system", "expected_m3"), [
    ("30", "si", 30.0), ("30 m3", "si", 30.0), ("30 m³", "ip", 30.0),
    ("1060", "ip", 1060 * 0.3048 ** 3), ("1060 ft3", "si", 1060 * 0.3048 ** 3),
    ("30000 L", "si", 30.0),
])
def test_parse_volume(text, system, expected_m3):
    """Room volume in m³, ft³ (1 ft = 0.3048 m exactly) or litres."""
    assert units.parse_volume(text, "--room-volume", system) == pytest.approx(expected_m3)
