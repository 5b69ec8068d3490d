"""`survey check` with the assessment and advice: the cold damp bedroom, a humid summer,
the new options, their bad input, and the table a client reads."""

from __future__ import annotations

import json
import subprocess
import sys

import pytest
from CoolProp.HumidAirProp import HAPropsSI

from survey.cli import main

P = 101_325.0
BEDROOM = ["--air-temp", "18", "--rh", "72", "--surface-temp", "11", "--surface-temp", "15.5",
           "--outdoor-temp", "3", "--outdoor-rh", "88", "--room-volume", "30", "--occupants",
           "2", "--use", "bedroom"]
SUMMER = ["--air-temp", "22", "--rh", "75", "--surface-temp", "17", "--outdoor-temp", "28",
          "--outdoor-rh", "75", "--room-volume", "60", "--occupants", "0", "--use", "basement"]


@pytest.fixture
def check(capsys, monkeypatch):
    """Run `survey check ARGS` in-process at a fixed terminal width."""
    monkeypatch.setenv("COLUMNS", "100")

    def _run(*args):
        try:
            status = main(["check", *args])
        except SystemExit as exc:
            status = exc.code
        captured = capsys.readouterr()
        return status, captured.out, captured.err
    return _run


def cp(output: str, temp_c: float, rh_pct: float) -> float:
    return HAPropsSI(output, "T", temp_c + 273.15, "P", P, "R", rh_pct / 100.0)


def test_cold_damp_bedroom_json(check):
    """The bedroom case: which surfaces are at risk and why, the highest safe RH, the class
    and a ventilate action with its numbers, each against an outside source."""
    status, out, err = check(*BEDROOM, "--json")
    assert status == 0, err
    data = json.loads(out)
    cold, warm = data["surfaces"]
    # Keys of the first release stay.
    for key in ("surface_temp_c", "surface_rh_pct", "dew_point_margin_k", "condensing"):
        assert key in cold
    # Dew point of 18 °C / 72 %: 12.9 °C (CoolProp); the 11 °C wall is below it.
    dew = cp("D", 18.0, 72.0) - 273.15
    assert data["dew_point_c"] == pytest.approx(dew, abs=0.05)
    assert cold["condensation"] == "condensing" and cold["mould"] == "above_limit"
    assert cold["dew_point_margin_k"] == pytest.approx(11.0 - dew, abs=0.05)
    # 2.6 K above the dew point, ±1.5 K: cannot be told apart from the 3 K margin (ISO
    # 8502-4 practice); surface RH 84 % (77-93 %) straddles BS 5250's 80 %.
    assert warm["condensation"] == "cannot_tell"
    assert warm["condensation_possible"] == ["clear", "near_dew_point"]
    assert warm["mould"] == "cannot_tell"
    assert warm["margin_uncertainty_k"] == pytest.approx(1.48, abs=0.05)
    low, high = warm["surface_rh_range_pct"]
    assert low < 80.0 < high
    # fRsi = (11 − 3)/(18 − 3) = 0.53 < 0.75 (BRE IP1/06 dwellings [M]).
    assert cold["temperature_factor"] == pytest.approx(8 / 15)
    assert cold["temperature_factor_state"] == "under_limit"
    assert data["temperature_factor_limit"] == 0.75
    # Highest room RH for the 11 °C wall: 80 × p_ws(11)/p_ws(18) (CoolProp) = 50.9 %.
    allowed = 80.0 * cp("P_w", 11.0, 100.0) / cp("P_w", 18.0, 100.0)
    assert data["max_room_rh_pct_for_coldest_surface"] == pytest.approx(allowed, rel=0.003)
    # Δp = p_w(18/72) − p_w(3/88) = 819 Pa at 3 °C outside: class 4 (limits × 17/20: 688.5
    # < Δp <= 918, ISO 13788 [M]); CoolProp's partial pressures within 1 %.
    assert data["vapour_pressure_excess_pa"] == pytest.approx(
        cp("P_w", 18.0, 72.0) - cp("P_w", 3.0, 88.0), rel=0.01)
    assert data["humidity_class"] == 4
    kinds = [a["kind"] for a in data["actions"]]
    assert kinds[0] == "ventilate" and "dehumidify" not in kinds
    assert "raise_surface_temperature" in kinds
    vent = data["actions"][0]
    w_t, w_o = cp("W", 18.0, vent["target_rh_pct"]), cp("W", 3.0, 88.0)
    g = vent["moisture_generation_g_per_h"] / 1000.0
    # ṁ_da = G / (W_t − W_o), volume = ṁ_da · v_o (handbook moisture balance), CoolProp W, v.
    assert vent["airflow_m3_per_h"] == pytest.approx(g / (w_t - w_o) * cp("Vda", 3.0, 88.0),
                                                     rel=0.015)
    assert vent["air_changes_per_h"] == pytest.approx(vent["airflow_m3_per_h"] / 30.0)
    raise_ = next(a for a in data["actions"] if a["kind"] == "raise_surface_temperature")
    assert raise_["surface"] == "Surface 1"
    assert raise_["target_surface_temp_c"] == pytest.approx(3 + 0.75 * 15, abs=1e-9)
    assert data["cautions"][-1].startswith("These findings come from spot readings")
    assert "licensed professionals" in data["cautions"][-1]
    assert data["accuracy"]["given"] == {"air_temp_k": False, "rh_pct": False,
                                         "surface_temp_k": False}
    cited = {t["key"] for t in data["thresholds"]}
    assert {"dew_point_margin_k", "surface_rh_mould_limit_pct", "frsi_dwelling"} <= cited


def test_cold_damp_bedroom_table(check, monkeypatch):
    """The table names every state in words, says what cannot be told apart, gives the
    highest safe RH, the actions with numbers and the safety notes."""
    monkeypatch.setenv("COLUMNS", "400")  # wide enough that no table cell wraps
    status, out, _ = check(*BEDROOM)
    assert status == 0
    flat = " ".join(out.split())
    for words in ("condensing now", "above the mould limit", "under the limit",
                  "cannot be told apart at this instrument accuracy: clear of the dew point "
                  "or close to the dew point",
                  "cannot be told apart at this instrument accuracy: approaching the mould "
                  "limit or above the mould limit",
                  '"Cannot be told apart at this instrument accuracy": the reading\'s range',
                  "Highest room RH the coldest surface (Surface 1) can bear: 50 %",
                  "class 4", "1. Ventilate", "m³/h", "air changes an hour",
                  "2. Raise the surface temperature", "14.2 °C", "Safety",
                  "unflued gas or paraffin heaters", "asbestos",
                  "Follow local building codes", "Instrument accuracy: air ±0.5 K, RH ±3 %, "
                  "surface ±1.0 K (typical specifications, none entered)", "Limits used",
                  "BS 5250:2002 Annex D"):
        assert words in flat, words


def test_table_at_80_columns_keeps_the_words(check, monkeypatch):
    """In an 80-column terminal the explanation and cautions still read as whole sentences."""
    monkeypatch.setenv("COLUMNS", "80")
    _, out, _ = check(*BEDROOM)
    flat = " ".join(out.split())
    assert '"Cannot be told apart at this instrument accuracy"' in flat
    assert "Follow local building codes and regulations" in flat
    assert max(len(line) for line in out.splitlines()) <= 80


def test_humid_summer_dehumidify(check):
    """Outdoor air wetter than the room: dehumidify, in L/day and US pints/day, with the
    rating conditions; the basement gets the confined-space caution."""
    status, out, _ = check(*SUMMER, "--json")
    assert status == 0
    data = json.loads(out)
    kinds = [a["kind"] for a in data["actions"]]
    assert kinds[0] == "dehumidify" and "ventilate" not in kinds
    dehum = data["actions"][0]
    assert dehum["removal_us_pints_per_day"] == pytest.approx(
        dehum["removal_l_per_day"] / 0.473176)  # 1 US pint = 0.473176 L [R]
    assert dehum["removal_l_per_day"] > 5.0
    assert dehum["suggest_desiccant"] is False
    assert any("confined" in c for c in data["cautions"])
    assert any("RCD" in c for c in data["cautions"])
    status, table, _ = check(*SUMMER)
    flat = " ".join(table.split())
    assert "1. Dehumidify" in flat and "US pints/day" in flat and "26.7 °C" in flat


def test_accuracies_entered_are_used_and_stated(check):
    """Zero-accuracy instruments leave no band: the warm wall is plainly near the dew point."""
    status, out, _ = check(*BEDROOM, "--air-temp-accuracy", "0", "--rh-accuracy", "0",
                           "--surface-temp-accuracy", "0", "--json")
    assert status == 0
    data = json.loads(out)
    warm = data["surfaces"][1]
    assert warm["margin_uncertainty_k"] == 0.0
    assert warm["condensation"] == "near_dew_point"
    assert data["accuracy"]["given"]["rh_pct"] is True
    _, out, _ = check(*BEDROOM, "--air-temp-accuracy", "0.2", "--rh-accuracy", "1.5",
                      "--surface-temp-accuracy", "0.3")
    assert "air ±0.2 K, RH ±1.5 %, surface ±0.3 K (as entered)" in " ".join(out.split())


def test_ip_units_for_volume_and_accuracy(check):
    """--units ip reads the volume in ft³ and accuracies in °F; a unit suffix works too."""
    _, out_ip, _ = check(*BEDROOM[:-6], "--room-volume", "1059.44", "--occupants", "2", "--use",
                         "bedroom", "--units", "ip", "--air-temp", "64.4", "--rh", "72",
                         "--surface-temp-accuracy", "1.8", "--json")
    data = json.loads(out_ip)
    assert data["room_volume_m3"] == pytest.approx(1059.44 * 0.3048 ** 3)  # 1 ft = 0.3048 m
    assert data["accuracy"]["surface_temp_k"] == pytest.approx(1.0)
    _, out_m3, _ = check(*BEDROOM[:-6], "--room-volume", "30 m3", "--json")
    assert json.loads(out_m3)["room_volume_m3"] == 30.0


@pytest.mark.parametrize(("args", "message"), [
    (["--room-volume", "-5"], "--room-volume -5: room volume must be between 1 and 100000 m³"),
    (["--room-volume", "30 kg"], "--room-volume 30 kg: unit 'kg' is not a volume unit"),
    (["--room-volume", "big"], "--room-volume big: expected a number in m³"),
    (["--occupants", "2.5"], "--occupants 2.5: expected a whole number of people from 0 to 500"),
    (["--occupants", "-1"], "--occupants -1: expected a whole number"),
    (["--occupants", "two"], "--occupants two: expected a whole number"),
    (["--target-rh", "95"], "--target-rh 95: target RH must be between 25 and 80 %"),
    (["--use", "garage"], "argument --use: invalid choice: 'garage'"),
    (["--rh-accuracy", "50"], "--rh-accuracy 50: accuracy must be between 0 and 20 %RH"),
    (["--air-temp-accuracy", "abc"], "--air-temp-accuracy abc: expected a number"),
    (["--surface-temp-accuracy", "-1"], "--surface-temp-accuracy -1: accuracy must be between 0"),
])
def test_bad_new_options_exit_2_with_one_line(check, args, message):
    """Bad input to the new options: status 2, one line naming option, value and what is
    allowed, nothing on stdout."""
    status, out, err = check("--air-temp", "18", "--rh", "72", *args)
    assert status == 2
    assert out == ""
    assert message in err
    assert len(err.strip().splitlines()) == 1


def test_use_is_case_insensitive_and_defaults_to_other(check):
    """--use Bedroom is a bedroom; no --use gives 'other' (IEA Annex 14, 0.70 [M])."""
    _, out, _ = check(*BEDROOM[:-1], "Bedroom", "--json")
    assert json.loads(out)["room_use"] == "bedroom"
    _, out, _ = check(*BEDROOM[:-2], "--json")
    data = json.loads(out)
    assert data["room_use"] == "other" and data["temperature_factor_limit"] == 0.70
    assert data["room_use_given"] is False


def test_new_options_keep_the_fast_json_path():
    """With every new option given as a bare number, --json loads neither pint nor Rich."""
    code = ("import contextlib, io, sys\nfrom survey.cli import main\n"
            "with contextlib.redirect_stdout(io.StringIO()):\n"
            f"    main(['check', *{BEDROOM!r}, '--target-rh', '55', '--rh-accuracy', '2',"
            " '--air-temp-accuracy', '0.3', '--surface-temp-accuracy', '0.5', '--json'])\n"
            "print(' '.join(sys.modules))")
    result = subprocess.run([sys.executable, "-c", code], capture_output=True, text=True,
                            timeout=60)
    assert result.returncode == 0, result.stderr
    loaded = set(result.stdout.split())
    assert "survey.assess" in loaded and "survey.advise" in loaded
    assert "pint" not in loaded and "rich" not in loaded and "textual" not in loaded
