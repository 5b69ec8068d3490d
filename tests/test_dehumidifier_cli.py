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
    (themselves checked by hand in test_equipment.py: 9.6 L/day, EF 1.60, COP 2.449)."""
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
    assert data["cooling_capacity_kw"] == pytest.approx(0.6122, rel=1e-3)
    assert data["cop"] == pytest.approx(2.449, rel=1e-3)
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


def test_the_text_frame_comes_from_the_words_module(run):
    """The heading and the section titles the command prints are survey.words.equipment's
    (one voice for the command, the app and the report)."""
    from survey.words import equipment as we

    status, out, _ = run(*EXAMPLE, "--rated-capacity", "20L/day")
    assert status == 0
    given = eq.DehumidifierInput((eq.AirPair(24, 70, 33, 30),), water_l=1.2, duration_h=3.0)
    assert out.splitlines()[0] == we.check_title(eq.check(given))
    for key in ("measured", "rating", "found", "safety", "limits"):
        assert f"\n{we.CHECK_SECTIONS[key]}:\n" in out, key


def test_no_sentence_is_built_in_the_faces():
    """The command's and the app's dehumidifier sentences live in survey.words.equipment:
    neither face's source spells them out."""
    from survey.words import equipment as we

    faces = [
        ROOT / "survey" / "commands" / "dehumidifier.py",
        ROOT / "survey" / "app" / "equipment.py",
    ]
    sources = "".join(path.read_text(encoding="utf-8") for path in faces)
    for sentence in ("Dehumidifier check (", we.NO_AIR_YET, we.CHECK_FOLLOWS, "Not yet:"):
        assert sentence not in sources, sentence


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
        (
            # a second set of readings, 4 h into the 3 h run of EXAMPLE
            (
                *("--inlet-temp", "24", "--inlet-rh", "70", "--outlet-temp", "33", "--outlet-rh"),
                *("30", "--reading-at", "0", "--reading-at", "4"),
            ),
            "--reading-at",
        ),
    ],
)
def test_bad_input_is_one_line_and_status_2(run, args, option):
    """Each bad value: exit status 2, one line naming the option and the value."""
    status, out, err = run(*EXAMPLE, *args, "--json")
    assert status == 2 and out == ""
    lines = err.strip().splitlines()
    assert len(lines) == 1
    assert option in lines[0] and args[-1] in lines[0]


def test_inconsistent_readings_print_no_absurd_number(run):
    """--water 1000 --hours 0.01 --power 1W would give 2.4e6 L/day, EF 1e8 L/kWh and
    2.3e7 m³/h (arithmetic in test_equipment.test_implausible_figures_are_inconsistent_readings):
    the JSON keeps its keys as null and names the finding; the text says the readings are
    inconsistent and prints none of those numbers."""
    args = (*EXAMPLE[:8], "--water", "1000", "--hours", "0.01", "--power", "1W")
    status, out, _ = run(*args, "--json")
    assert status == 0
    data = json.loads(out)
    for key in (*ISSUE_KEYS - {"humidity_ratio_drop_g_per_kg", "grain_depression_gr_per_lb"},
                "air_volume_flow_m3_per_h"):  # fmt: skip
        assert key in data and data[key] is None, key
    assert "readings_inconsistent" in [f["kind"] for f in data["findings"]]
    status, out, _ = run(*args)
    assert status == 0 and "The readings are inconsistent" in out
    for absurd in ("2400000", "1e+08", "100000000", "2.3e+07", "23000000", "1.5e+08"):
        assert absurd not in out, absurd


def test_an_outlet_wetter_than_the_inlet_is_a_rise(run):
    """24 °C / 60 % in, 26 °C / 70 % out: W rises from 11.2 to 14.7 g/kg (psychrolib, ASHRAE
    ch. 1 eqn 20), so the text says the humidity ratio rises by a positive amount; no
    negative 'fall' is printed."""
    import psychrolib

    psychrolib.SetUnitSystem(psychrolib.SI)
    rise = 1000 * (
        psychrolib.GetHumRatioFromRelHum(26.0, 0.70, 101325)
        - psychrolib.GetHumRatioFromRelHum(24.0, 0.60, 101325)
    )
    status, out, _ = run(
        "--inlet-temp", "24", "--inlet-rh", "60", "--outlet-temp", "26", "--outlet-rh", "70",
        "--water", "1", "--hours", "3",
    )  # fmt: skip
    assert status == 0
    assert f"The humidity ratio rises by {rise:.2f} g/kg ({7 * rise:.1f} gr/lb)" in out
    assert "falls by -" not in out and "falls by −" not in out


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


#: EXAMPLE with bare numbers (1.2 kg of water is 1.2 L at 1 kg/L; 250 W; 3 h).
BARE = (*EXAMPLE[:8], "--water", "1.2", "--hours", "3", "--power", "250")


def test_bare_numbers_give_the_same_result(run):
    """EXAMPLE with bare numbers (1.2 L, 3 h, 250 W) gives its numbers (the 1.2 kg weighed
    are 1.2 L at 1 kg/L, our choice)."""
    _, out, _ = run(*EXAMPLE, "--json")
    _, bare, _ = run(*BARE, "--json")
    for key in ISSUE_KEYS:
        assert json.loads(bare)[key] == pytest.approx(json.loads(out)[key], rel=1e-12), key


def test_json_path_loads_neither_pint_nor_rich():
    """`survey check-dehumidifier --json` with bare numbers starts without pint or Rich (as
    `survey check` does; a typed unit loads pint, which converts it)."""
    code = (
        "import contextlib, io, sys\nfrom survey.cli import main\n"
        "with contextlib.redirect_stdout(io.StringIO()):\n"
        f"    main(['check-dehumidifier', *{list(BARE)!r}, '--json'])\n"
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
