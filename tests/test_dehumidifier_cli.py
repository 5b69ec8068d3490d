"""``survey check-dehumidifier``: its JSON keys and values, IP input, bad input, start-up."""

from __future__ import annotations

import json
import subprocess
import sys
import typing
from pathlib import Path

import pytest

from survey import equipment as eq
from survey import model
from survey.cli import main
from survey.commands.dehumidifier import RATING_KEYS

ROOT = Path(__file__).resolve().parents[1]
EXAMPLE = (
    "--inlet-temp",
    "24",
    "--inlet-rh",
    "70",
    "--outlet-temp",
    "33",
    "--outlet-rh",
    "30",
    "--water",
    "1.2kg",
    "--hours",
    "3",
    "--power",
    "250W",
)
#: The keys issue 11 lists for --json.
ISSUE_KEYS = {
    "removal_l_per_day",
    "removal_pints_per_day",
    "energy_factor_l_per_kwh",
    "humidity_ratio_drop_g_per_kg",
    "grain_depression_gr_per_lb",
    "air_mass_flow_kg_per_s",
    "cooling_capacity_kw",
    "cop",
}


@pytest.fixture
def run(capsys, monkeypatch):
    monkeypatch.setenv("COLUMNS", "100")

    def _run(*args):
        try:
            status = main(["check-dehumidifier", *args])
        except SystemExit as exc:
            status = exc.code
        captured = capsys.readouterr()
        return status, captured.out, captured.err

    return _run


def test_json_keys_and_values_match_the_core(run):
    """The issue's example: every listed key, equal to survey.equipment.check's numbers
    (themselves checked by hand in test_equipment.py: 9.6 L/day, EF 1.60, COP 2.473)."""
    status, out, err = run(*EXAMPLE, "--json")
    assert status == 0 and err == ""
    data = json.loads(out)
    assert set(data) >= ISSUE_KEYS
    assert data["removal_l_per_day"] == pytest.approx(9.6)
    assert data["removal_pints_per_day"] == pytest.approx(9.6 / 0.473176473)
    assert data["energy_factor_l_per_kwh"] == pytest.approx(1.6)
    assert data["humidity_ratio_drop_g_per_kg"] == pytest.approx(3.6855, rel=1e-3)
    assert data["grain_depression_gr_per_lb"] == pytest.approx(7 * 3.6855, rel=1e-3)
    assert data["air_mass_flow_kg_per_s"] == pytest.approx(0.030148, rel=1e-3)
    assert data["cooling_capacity_kw"] == pytest.approx(0.6183, rel=1e-3)
    assert data["cop"] == pytest.approx(2.473, rel=1e-3)
    assert data["water_weighed"] is True
    assert data["rated"] is None and data["findings"] == []
    # Electricity near water, and the deferral to local codes and professionals.
    assert "RCD / GFCI" in data["cautions"][0] and "licensed professionals" in data["cautions"][-1]


def test_json_rated_comparison(run):
    """With a rating and its condition: the rated block, scaled to the site air."""
    status, out, _ = run(
        *EXAMPLE,
        "--rated-capacity",
        "20L/day",
        "--rated-energy-factor",
        "1.8",
        "--rating-condition",
        "18.3c_60",
        "--json",
    )
    assert status == 0
    rated = json.loads(out)["rated"]
    assert rated["rating_condition"] == "18.3c_60"
    # 65 °F, the current US test, as (65 − 32)/1.8 °C
    assert rated["rating_condition_dry_bulb_c"] == pytest.approx((65 - 32) / 1.8)
    assert rated["rated_capacity_l_per_day"] == 20.0
    assert rated["rated_capacity_pints_per_day"] == pytest.approx(20 / 0.473176473)
    assert rated["removal_of_rated"] == pytest.approx(0.48)
    assert rated["energy_factor_of_rated"] == pytest.approx(1.6 / 1.8)
    # Scaling by hand in test_equipment.test_site_scaling_by_hand: s = 2.2808.
    assert rated["site_scale"] == pytest.approx(2.2808, rel=1e-4)
    assert "DOE" in rated["rating_condition_text"] and rated["caution"]
    kinds = [f["kind"] for f in json.loads(out)["findings"]]
    assert kinds == ["below_expected"]


def test_ip_input_equals_si_input(run):
    """75.2 °F = 24 °C, 91.4 °F = 33 °C, 2.6455 lb = 1.2 kg (1 lb = 0.45359237 kg),
    42.2675 pints/day = 20 L/day (1 pint = 0.473176473 L): the same JSON numbers."""
    _, si_out, _ = run(
        *EXAMPLE, "--rated-capacity", "20", "--rating-condition", "26.7c_60", "--json"
    )
    status, ip_out, err = run(
        "--units",
        "ip",
        "--inlet-temp",
        "75.2",
        "--inlet-rh",
        "70",
        "--outlet-temp",
        "91.4F",
        "--outlet-rh",
        "30 %",
        "--water",
        f"{1.2 / 0.45359237} lb",
        "--hours",
        "180 min",
        "--power",
        "0.25 kW",
        "--rated-capacity",
        f"{20 / 0.473176473}",
        "--rating-condition",
        "26.7c_60",
        "--json",
    )
    assert status == 0 and err == ""
    si, ip = json.loads(si_out), json.loads(ip_out)
    for key in (*ISSUE_KEYS, "air_volume_flow_m3_per_h"):
        assert ip[key] == pytest.approx(si[key], rel=1e-9), key
    assert ip["rated"]["removal_of_expected"] == pytest.approx(si["rated"]["removal_of_expected"])


def test_altitude_and_pressure(run):
    """--altitude 1500 gives the standard atmosphere there (psychrolib, ASHRAE ch. 1 eqn 3);
    --pressure 850hPa is 85 000 Pa; the humidity ratios follow the pressure."""
    import psychrolib

    psychrolib.SetUnitSystem(psychrolib.SI)
    _, out, _ = run(*EXAMPLE, "--altitude", "1500", "--json")
    data = json.loads(out)
    pressure = psychrolib.GetStandardAtmPressure(1500.0)
    assert data["pressure_pa"] == pytest.approx(pressure)
    w_in = psychrolib.GetHumRatioFromRelHum(24.0, 0.70, pressure)
    assert data["inlet"]["humidity_ratio_g_per_kg"] == pytest.approx(1000 * w_in, rel=1e-9)
    _, out, _ = run(*EXAMPLE, "--pressure", "850hPa", "--json")
    assert json.loads(out)["pressure_pa"] == pytest.approx(85_000.0)


def test_water_in_pints_and_gallons(run):
    """2.5 US pints = 1.18294 L; 0.25 gal = 0.946353 L (exact definitions)."""
    for text, litres in (("2.5pt", 2.5 * 0.473176473), ("0.25 gal", 0.25 * 3.785411784)):
        _, out, _ = run(*EXAMPLE[:8], "--water", text, "--hours", "24", "--json")
        data = json.loads(out)
        assert data["water_l"] == pytest.approx(litres) and data["water_weighed"] is False


def test_energy_instead_of_power(run):
    """--energy 0.9kWh over 3 h: EF 1.2 / 0.9, mean power 300 W."""
    _, out, _ = run(*EXAMPLE[:12], "--energy", "0.9kWh", "--json")
    data = json.loads(out)
    assert data["energy_factor_l_per_kwh"] == pytest.approx(1.2 / 0.9)
    assert data["mean_power_w"] == pytest.approx(300.0)


def test_a_series_of_readings(run):
    """Two sets of readings with their times: a mean drop over the run."""
    status, out, err = run(
        "--inlet-temp", "24", "--inlet-temp", "23",
        "--inlet-rh", "70", "--inlet-rh", "65",
        "--outlet-temp", "33", "--outlet-temp", "32",
        "--outlet-rh", "30", "--outlet-rh", "30",
        "--reading-at", "0", "--reading-at", "3h",
        "--water", "1.2", "--hours", "3", "--json",
    )  # fmt: skip
    assert status == 0, err
    data = json.loads(out)
    assert data["readings"] == 2
    one = eq.check(eq.DehumidifierInput((eq.AirPair(24, 70, 33, 30),)))
    two = eq.check(eq.DehumidifierInput((eq.AirPair(23, 65, 32, 30),)))
    mean = (one.humidity_ratio_drop_g_per_kg + two.humidity_ratio_drop_g_per_kg) / 2
    assert data["humidity_ratio_drop_g_per_kg"] == pytest.approx(mean, rel=1e-9)


def test_text_output(run):
    """The text lists the summary, the measured figures, the rating and its caution."""
    status, out, err = run(
        *EXAMPLE, "--rated-capacity", "20L/day", "--rating-condition", "18.3c_60"
    )
    assert status == 0 and err == ""
    assert "9.6 L/day (20.3 US pints/day)" in out
    assert "Against its rating:" in out and "Limits used:" in out
    assert "A rating is the water removed in 24 h" in out


@pytest.mark.parametrize(
    ("args", "option"),
    [
        (("--water", "1.2x"), "--water"),
        (("--water", "-1"), "--water"),
        (("--hours", "0"), "--hours"),
        (("--power", "250V"), "--power"),
        (("--rated-capacity", "20 gal"), "--rated-capacity"),
        (("--rated-energy-factor", "30"), "--rated-energy-factor"),
        (("--rating-condition", "80f"), "--rating-condition"),
        (("--pressure", "2000"), "--pressure"),
        (("--inlet-temp", "24"), "--inlet-temp"),
        (("--reading-at", "1", "--reading-at", "2"), "--reading-at"),
    ],
)
def test_bad_input_is_one_line_and_status_2(run, args, option):
    """Each bad value: exit status 2, one line naming the option and the value."""
    status, out, err = run(*EXAMPLE, *args, "--json")
    assert status == 2 and out == ""
    lines = err.strip().splitlines()
    assert len(lines) == 1
    assert option in lines[0] and args[-1] in lines[0]


@pytest.mark.parametrize(
    ("args", "option"),
    [
        (("--inlet-temp", "90"), "--inlet-temp"),
        (("--outlet-rh", "120"), "--outlet-rh"),
    ],
)
def test_bad_readings_name_their_option(run, args, option):
    """A reading out of the psychrometric domain names its own option, not another."""
    base = list(EXAMPLE)
    at = base.index(args[0])
    base[at + 1] = args[1]
    status, _, err = run(*base, "--json")
    assert status == 2 and err.startswith(f"survey: {option} {args[1]}")


def test_power_and_energy_are_exclusive(run):
    """Power and energy together are refused by the parser (status 2)."""
    status, _, err = run(*EXAMPLE, "--energy", "1kWh")
    assert status == 2 and "--energy" in err


def test_rating_keys_are_the_file_models():
    """The parser's list of rating conditions is model.RatingCondition's."""
    assert typing.get_args(model.RatingCondition) == RATING_KEYS


def test_json_path_loads_neither_pint_nor_rich():
    """`survey check-dehumidifier --json` with its amounts starts without pint or Rich."""
    code = (
        "import contextlib, io, sys\nfrom survey.cli import main\n"
        "with contextlib.redirect_stdout(io.StringIO()):\n"
        f"    main(['check-dehumidifier', *{list(EXAMPLE)!r}, '--json'])\n"
        "print('\\n'.join(sys.modules))"
    )
    result = subprocess.run(
        [sys.executable, "-c", code], capture_output=True, text=True, timeout=60, cwd=ROOT
    )
    assert result.returncode == 0, result.stderr
    loaded = set(result.stdout.split())
    assert "survey.equipment" in loaded
    assert not any(m == p or m.startswith(p + ".") for m in loaded for p in ("pint", "rich"))
    assert "textual" not in loaded
