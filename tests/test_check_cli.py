"""``survey check``: its JSON against psychrolib and CoolProp, and its handling of bad input."""

from __future__ import annotations

import json
import subprocess
import sys
from pathlib import Path

import psychrolib
import pytest
from CoolProp.HumidAirProp import HAPropsSI


def test_json_dew_point_agrees_with_psychrolib_and_coolprop(check):
    """25 °C / 80 %: --json dew point equals psychrolib's and is within 0.05 K of CoolProp."""
    status, out, err = check("--air-temp", "25", "--rh", "80", "--json")
    assert status == 0 and err == ""
    data = json.loads(out)
    psychrolib.SetUnitSystem(psychrolib.SI)
    assert data["dew_point_c"] == pytest.approx(
        psychrolib.GetTDewPointFromRelHum(25, 0.8), abs=1e-6
    )
    assert data["dew_point_c"] == pytest.approx(
        HAPropsSI("D", "T", 298.15, "P", 101325, "R", 0.8) - 273.15, abs=0.05
    )
    assert data["frost_point_c"] is None
    assert data["pressure_pa"] == 101325.0
    # grains per pound = 7000 × W (7000 grains = 1 lb).
    assert data["grains_per_pound"] == pytest.approx(7.0 * data["humidity_ratio_g_per_kg"])
    for key in (
        "humidity_ratio_g_per_kg",
        "vapour_pressure_pa",
        "enthalpy_kj_per_kg",
        "wet_bulb_c",
        "absolute_humidity_g_per_m3",
        "surfaces",
        "outdoor",
    ):
        assert key in data


def test_json_surfaces_and_outdoor(check):
    """Each surface gets surface RH, margin and condensing; outdoor gets the state keys."""
    status, out, _ = check(
        "--air-temp",
        "21",
        "--rh",
        "65",
        "--surface-temp",
        "12.5",
        "--surface-temp",
        "16",
        "--outdoor-temp",
        "4",
        "--outdoor-rh",
        "85",
        "--altitude",
        "350",
        "--json",
    )
    assert status == 0
    data = json.loads(out)
    # Standard atmosphere at 350 m: 101325 (1 − 2.25577e−5 · 350)^5.2559 = 97 190 Pa
    # (ASHRAE ch. 1 eqn 3, computed).
    assert data["pressure_pa"] == pytest.approx(101325 * (1 - 2.25577e-5 * 350) ** 5.2559, abs=1)
    cold, warm = data["surfaces"]
    # Dew point of 21 °C / 65 % is 14.2 °C (CoolProp, checked below): 12.5 °C condenses.
    coolprop_dew = HAPropsSI("D", "T", 294.15, "P", data["pressure_pa"], "R", 0.65) - 273.15
    assert data["dew_point_c"] == pytest.approx(coolprop_dew, abs=0.05)
    assert cold["condensing"] is True and cold["surface_rh_pct"] > 100
    assert cold["dew_point_margin_k"] == pytest.approx(12.5 - coolprop_dew, abs=0.05)
    assert warm["condensing"] is False and warm["dew_point_margin_k"] > 0
    assert data["outdoor"]["dew_point_c"] == pytest.approx(
        HAPropsSI("D", "T", 277.15, "P", data["pressure_pa"], "R", 0.85) - 273.15, abs=0.05
    )
    assert data["outdoor"]["frost_point_c"] is None


def test_unit_suffixes_work_in_every_option(check):
    """70F / 65% / 1013.25hPa give the same state as 21.11 / 65 / default pressure."""
    _, out_units, _ = check(
        "--air-temp",
        "70F",
        "--rh",
        "65%",
        "--pressure",
        "1013.25hPa",
        "--surface-temp",
        "55 °F",
        "--json",
    )
    _, out_plain, _ = check(
        "--air-temp",
        str((70 - 32) / 1.8),
        "--rh",
        "65",
        "--surface-temp",
        str((55 - 32) / 1.8),
        "--json",
    )
    with_units, plain = json.loads(out_units), json.loads(out_plain)
    assert with_units["dew_point_c"] == pytest.approx(plain["dew_point_c"], abs=1e-9)
    for a, b in zip(with_units["surfaces"], plain["surfaces"], strict=True):
        assert a["surface_rh_pct"] == pytest.approx(b["surface_rh_pct"])
        assert a["dew_point_margin_k"] == pytest.approx(b["dew_point_margin_k"])


def test_ip_bare_numbers_are_fahrenheit(check):
    """--units ip reads a bare 70 as °F."""
    _, out, _ = check("--air-temp", "70", "--rh", "50", "--units", "ip", "--json")
    assert json.loads(out)["dry_bulb_c"] == pytest.approx(21.1111111)


def test_table_output_shows_the_numbers(check):
    """Without --json a table shows dew point and each surface in the chosen units."""
    status, out, _ = check("--air-temp", "21", "--rh", "65", "--surface-temp", "12.5")
    assert status == 0
    assert "Dew point" in out and "14.2 °C" in out and "12.5 °C" in out


@pytest.mark.parametrize(
    ("args", "message"),
    [
        (
            ["--air-temp", "21", "--rh", "120"],
            "--rh 120: relative humidity must be above 0 and at most 100 %",
        ),
        (["--air-temp", "21", "--rh", "0"], "--rh 0: relative humidity must be above 0"),
        (["--air-temp", "21", "--rh", "-5"], "--rh -5: relative humidity must be above 0"),
        (["--air-temp", "21", "--rh", "wet"], "--rh wet: expected a percentage"),
        (["--air-temp", "95", "--rh", "50"], "--air-temp 95: air temperature must be between -50"),
        (["--air-temp", "-60", "--rh", "50"], "--air-temp -60: air temperature must be between"),
        (
            ["--air-temp", "21 hPa", "--rh", "50"],
            "--air-temp 21 hPa: unit 'hPa' is not a temperature",
        ),
        (["--air-temp", "warm", "--rh", "50"], "--air-temp warm: expected a number"),
        (
            ["--air-temp", "21", "--rh", "50", "--pressure", "300hPa"],
            "--pressure 300hPa: pressure must be between 500 and 1100 hPa",
        ),
        (
            ["--air-temp", "21", "--rh", "50", "--altitude", "12000"],
            "--altitude 12000: altitude must be between -500 and 5000 m",
        ),
        (
            ["--air-temp", "21", "--rh", "50", "--surface-temp", "200"],
            "--surface-temp 200: surface temperature must be between -60 and 90 °C",
        ),
        (
            ["--air-temp", "21", "--rh", "50", "--outdoor-temp", "4"],
            "--outdoor-temp 4: give --outdoor-rh as well",
        ),
        (
            ["--air-temp", "21", "--rh", "50", "--outdoor-temp", "4", "--outdoor-rh", "101"],
            "--outdoor-rh 101: relative humidity must be above 0 and at most 100 %",
        ),
        (["--air-temp", "nan", "--rh", "50"], "--air-temp nan:"),
        (["--air-temp", "21 °C)", "--rh", "50"], "--air-temp 21 °C): unit '°C)' is not"),
        (["--air-temp", "21", "--rh", "0.65"], "--rh 0.65: looks like a fraction"),
        (["--air-temp", "21", "--rh", "0.01 %"], "--rh 0.01 %: relative humidity below 0.1 %"),
        (["--air-temp", "", "--rh", "50"], "--air-temp '': expected a number"),
        (
            ["--air-temp", "21", "--rh", "50", "--pressure", "1,013.25 hPa"],
            "the number was not understood",
        ),
        (["--rh", "50"], "the following arguments are required: --air-temp"),
        (["--air-temp", "21", "--rh", "50", "--units", "metric"], "invalid choice: 'metric'"),
        (
            ["--air-temp", "21", "--rh", "50", "--altitude", "10", "--pressure", "1000"],
            "not allowed with argument",
        ),
        (["--air-tmp", "21", "--rh", "50"], "unknown option --air-tmp; did you mean --air-temp?"),
        (["--air-temp", "21", "--rh", "50", "--frobnicate"], "unknown option --frobnicate"),
    ],
)
def test_bad_input_exits_2_with_one_line(check, args, message):
    """Bad input: status 2, one line on stderr naming the option and value, no traceback."""
    status, out, err = check(*args)
    assert status == 2
    assert out == ""
    assert message in err
    assert len(err.strip().splitlines()) == 1
    assert "Traceback" not in err


@pytest.mark.parametrize(
    ("args", "key", "expected"),
    [
        (["--air-temp", "-23F", "--rh", "60"], "dry_bulb_c", (-23 - 32) / 1.8),
        (["--air-temp", "21", "--rh", "60", "--surface-temp", "-2,5"], None, -2.5),
        (
            ["--air-temp", "21", "--rh", "60", "--outdoor-temp", "-3C", "--outdoor-rh", "90"],
            "outdoor",
            -3.0,
        ),
        (["--air-temp", "\u22125", "--rh", "60"], "dry_bulb_c", -5.0),
    ],
)
def test_negative_values_with_units_or_commas_are_read(check, args, key, expected):
    """Winter readings like -3C, -2,5 and -23F are values, not unknown options."""
    status, out, err = check(*args, "--json")
    assert status == 0, err
    data = json.loads(out)
    if key is None:
        assert data["surfaces"][0]["surface_temp_c"] == pytest.approx(expected)
    elif key == "outdoor":
        assert data["outdoor"]["dry_bulb_c"] == pytest.approx(expected)
    else:
        assert data[key] == pytest.approx(expected)


def test_python_dash_m_and_console_script_agree():
    """`python -m survey check` and the installed `survey` script give the same answer."""
    args = ["check", "--air-temp", "20", "--rh", "50", "--json"]
    by_module = subprocess.run(
        [sys.executable, "-m", "survey", *args], capture_output=True, text=True, timeout=60
    )
    assert by_module.returncode == 0, by_module.stderr
    # CoolProp HAPropsSI at 20 °C / 50 %: dew point 9.274 °C.
    assert json.loads(by_module.stdout)["dew_point_c"] == pytest.approx(9.274, abs=0.02)
    script = Path(sys.executable).with_name("survey")
    if not script.exists():
        pytest.skip("the console script is not installed beside this interpreter")
    by_script = subprocess.run([str(script), *args], capture_output=True, text=True, timeout=60)
    assert by_script.returncode == 0, by_script.stderr
    assert json.loads(by_script.stdout) == json.loads(by_module.stdout)


def test_closed_pipe_is_not_a_traceback():
    """`survey check --json | (reader that closes at once)` exits quietly."""
    process = subprocess.Popen(
        [sys.executable, "-m", "survey", "check", "--air-temp", "21", "--rh", "65", "--json"]
        + ["--surface-temp", "10"] * 2000,
        stdout=subprocess.PIPE,
        stderr=subprocess.PIPE,
    )
    process.stdout.close()  # the reader goes away before the output is written
    _, err = process.communicate(timeout=60)
    assert b"Traceback" not in err
    assert process.returncode == 0


def test_bad_input_in_a_real_process_has_no_traceback():
    """A real process given bad input prints one line and exits 2."""
    result = subprocess.run(
        [sys.executable, "-m", "survey", "check", "--air-temp", "21", "--rh", "120"],
        capture_output=True,
        text=True,
        timeout=60,
    )
    assert result.returncode == 2
    assert result.stderr.strip() == (
        "survey: --rh 120: relative humidity must be above 0 and at most 100 %"
    )


def test_a_converted_value_out_of_range_says_what_it_was_read_as(check):
    """30 ft³ is 0.85 m³ (1 ft = 0.3048 m exactly) and 21 K is −252.15 °C: the refusal says
    so, so a unit typo is plain."""
    status, _, err = check("--air-temp", "20", "--rh", "50", "--room-volume", "30 ft3")
    assert status == 2 and "(read as 0.85 m³)" in err
    status, _, err = check("--air-temp", "21 K", "--rh", "50")
    assert status == 2 and "(read as −252.15 °C)" in err


def test_an_instrument_accuracy_of_zero_is_refused(check):
    """No instrument reads exactly: an accuracy of 0 is refused as it is in survey files."""
    for option in ("--air-temp-accuracy", "--rh-accuracy", "--surface-temp-accuracy"):
        status, _, err = check("--air-temp", "20", "--rh", "50", option, "0")
        assert status == 2 and f"{option} 0" in err


def test_rh_accuracy_below_one_is_an_accuracy_not_a_fraction(check):
    """A hygrometer rated ±0.8 %RH is read as 0.8 %RH, not as a fraction."""
    import json

    status, out, err = check("--air-temp", "20", "--rh", "50", "--rh-accuracy", "0.8", "--json")
    assert status == 0, err
    assert json.loads(out)["accuracy"]["rh_pct"] == 0.8


@pytest.mark.parametrize(
    ("given", "units", "m3"),
    [
        ("4.2 x 3.1 x 2.4", "si", 4.2 * 3.1 * 2.4),  # 31.248 m³, multiplied out
        ("4,2×3,1×2,4", "si", 4.2 * 3.1 * 2.4),  # decimal commas and the times sign
        ("12 x 10 x 8", "ip", 12 * 10 * 8 * 0.3048**3),  # 960 ft³ = 27.18 m³ (exact foot)
        ("4.2m x 10ft x 2.4 m", "si", 4.2 * 3.048 * 2.4),  # each side with its own unit
    ],
)
def test_room_volume_as_dimensions(check, given, units, m3):
    """--room-volume takes the room's dimensions, as the app's volume field does."""
    code, out, _ = check(
        "--air-temp", "20", "--rh", "60", "--room-volume", given, "--units", units, "--json"
    )
    assert code == 0
    assert json.loads(out)["room_volume_m3"] == pytest.approx(m3, rel=1e-12)


@pytest.mark.parametrize(
    ("given", "said"),
    [
        ("4.2 x 3.1", "three dimensions"),
        ("0.1x0.1x0.1", "read as 0.001 m³"),
        ("4 x a x 2", "a"),
        ("-2 x -3 x 4", "each above 0"),  # two negative sides would multiply out to 24 m³
    ],
)
def test_bad_room_dimensions_exit_2_with_one_line(check, given, said):
    code, _, err = check("--air-temp", "20", "--rh", "60", "--room-volume", given)
    assert code == 2 and said in err and len(err.strip().splitlines()) == 1
