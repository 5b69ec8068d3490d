"""`survey check` with the assessment and advice: the cold damp bedroom, a humid summer,
the new options, their bad input, and the table a client reads."""

from __future__ import annotations

import json
import subprocess
import sys

import pytest
from CoolProp.HumidAirProp import HAPropsSI

P = 101_325.0
BEDROOM = [
    "--air-temp",
    "18",
    "--rh",
    "72",
    "--surface-temp",
    "11",
    "--surface-temp",
    "15.5",
    "--outdoor-temp",
    "3",
    "--outdoor-rh",
    "88",
    "--room-volume",
    "30",
    "--occupants",
    "2",
    "--use",
    "bedroom",
]
SUMMER = [
    "--air-temp",
    "22",
    "--rh",
    "75",
    "--surface-temp",
    "17",
    "--outdoor-temp",
    "28",
    "--outdoor-rh",
    "75",
    "--room-volume",
    "60",
    "--occupants",
    "0",
    "--use",
    "basement",
]


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
        cp("P_w", 18.0, 72.0) - cp("P_w", 3.0, 88.0), rel=0.01
    )
    assert data["humidity_class"] == 4
    kinds = [a["kind"] for a in data["actions"]]
    assert kinds[0] == "ventilate" and "dehumidify" not in kinds
    assert "raise_surface_temperature" in kinds
    vent = data["actions"][0]
    w_t, w_o = cp("W", 18.0, vent["target_rh_pct"]), cp("W", 3.0, 88.0)
    g = vent["moisture_generation_g_per_h"] / 1000.0
    # ṁ_da = G / (W_t − W_o) (handbook moisture balance), volume = ṁ_da · v of the room air
    # the fan moves, CoolProp W and v.
    assert vent["airflow_m3_per_h"] == pytest.approx(
        g / (w_t - w_o) * cp("Vda", 18.0, 72.0), rel=0.015
    )
    assert vent["air_changes_per_h"] == pytest.approx(vent["airflow_m3_per_h"] / 30.0)
    raise_ = next(a for a in data["actions"] if a["kind"] == "raise_surface_temperature")
    assert raise_["surface"] == "Surface 1"
    assert raise_["target_surface_temp_c"] == pytest.approx(3 + 0.75 * 15, abs=1e-9)
    assert data["cautions"][-1].startswith("These findings come from spot readings")
    assert "licensed professionals" in data["cautions"][-1]
    assert data["accuracy"]["given"] == {
        "air_temp_k": False,
        "rh_pct": False,
        "surface_temp_k": False,
    }
    cited = {t["key"] for t in data["thresholds"]}
    assert {"dew_point_margin_k", "surface_rh_mould_limit_pct", "frsi_dwelling"} <= cited


def test_cold_damp_bedroom_table(check, monkeypatch):
    """The table names every state in words, says what cannot be told apart, gives the
    highest safe RH, the actions with numbers and the safety notes."""
    monkeypatch.setenv("COLUMNS", "400")  # wide enough that no table cell wraps
    status, out, _ = check(*BEDROOM)
    assert status == 0
    flat = " ".join(out.split())
    for words in (
        "condensing now",
        "above the mould limit",
        "under the limit",
        "unclear at this accuracy: clear of the dew point or close to the dew point",
        "unclear at this accuracy: approaching the mould limit or above the mould limit",
        '"Unclear at this accuracy": the reading\'s range',
        "Highest room RH the coldest wall, ceiling or floor (Surface 1, 11.0 °C) can bear: 50 %",
        "class 4",
        "1. Ventilate",
        "m³/h",
        "air changes an hour",
        "2. Raise the surface temperature: Surface 1",
        # 3 + 0.75 × (18 − 3) = 14.25 °C (fRsi 0.75, BRE IP1/06, from memory),
        # a minimum, so shown rounded up:
        "at least 14.3 °C (the factor limit",
        "Safety",
        "unflued gas or paraffin heaters",
        "asbestos",
        "Follow local building codes",
        (
            "Instrument accuracy: air ±0.5 K, RH ±3 %, "
            "surface ±1.0 K (typical specifications, none entered)"
        ),
        "Limits used",
        "BS 5250:2002 Annex D",
    ):
        assert words in flat, words


def test_table_at_80_columns_keeps_the_words(check, monkeypatch):
    """In an 80-column terminal the explanation and cautions still read as whole sentences."""
    monkeypatch.setenv("COLUMNS", "80")
    _, out, _ = check(*BEDROOM)
    flat = " ".join(out.split())
    assert '"Unclear at this accuracy"' in flat
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
        dehum["removal_l_per_day"] / 0.473176
    )  # 1 US pint = 0.473176 L [R]
    # No occupants: the daily load is outdoor air leaking in at 0.5 ACH (common practice)
    # bringing W_o − W_t, 24 h × 0.5 × 60 m³ / v_i × (W_o − W_t) (air changes counted in
    # room volumes of room air), W and v from CoolProp.
    w_o, w_t = cp("W", 28.0, 75.0), cp("W", 22.0, dehum["target_rh_pct"])
    load = 24 * 0.5 * 60.0 / cp("Vda", 22.0, 75.0) * (w_o - w_t)
    assert dehum["removal_l_per_day"] == pytest.approx(load, rel=0.02)
    # The one-off pull-down of the room air, 60 m³ / v_i × (W_i − W_t), is apart, in litres.
    pull_down = 60.0 / cp("Vda", 22.0, 75.0) * (cp("W", 22.0, 75.0) - w_t)
    assert dehum["pull_down_l"] == pytest.approx(pull_down, rel=0.02)
    assert dehum["suggest_desiccant"] is False
    assert any("confined" in c for c in data["cautions"])
    assert any("RCD" in c for c in data["cautions"])
    status, table, _ = check(*SUMMER)
    flat = " ".join(table.split())
    assert "1. Dehumidify" in flat and "US pints/day" in flat and "26.7 °C" in flat


def test_accuracies_entered_are_used_and_stated(check):
    """Fine accuracies (0.01 K, 0.5 %RH; 0 is refused: no instrument reads exactly) leave a
    band too narrow to matter: the warm wall is plainly near the dew point."""
    status, _, err = check(*BEDROOM, "--rh-accuracy", "0")
    assert status == 2 and "--rh-accuracy 0" in err
    status, out, _ = check(
        *BEDROOM,
        "--air-temp-accuracy",
        "0.01",
        "--rh-accuracy",
        "0.5",
        "--surface-temp-accuracy",
        "0.01",
        "--json",
    )
    assert status == 0
    data = json.loads(out)
    warm = data["surfaces"][1]
    assert warm["margin_uncertainty_k"] < 0.2
    assert warm["condensation"] == "near_dew_point"
    assert data["accuracy"]["given"]["rh_pct"] is True
    _, out, _ = check(
        *BEDROOM,
        "--air-temp-accuracy",
        "0.2",
        "--rh-accuracy",
        "1.5",
        "--surface-temp-accuracy",
        "0.3",
    )
    assert "air ±0.2 K, RH ±1.5 %, surface ±0.3 K (as entered)" in " ".join(out.split())


def test_ip_units_for_volume_and_accuracy(check):
    """--units ip reads the volume in ft³ and accuracies in °F; a unit suffix works too."""
    _, out_ip, _ = check(
        *BEDROOM[:-6],
        "--room-volume",
        "1059.44",
        "--occupants",
        "2",
        "--use",
        "bedroom",
        "--units",
        "ip",
        "--air-temp",
        "64.4",
        "--rh",
        "72",
        "--surface-temp-accuracy",
        "1.8",
        "--json",
    )
    data = json.loads(out_ip)
    assert data["room_volume_m3"] == pytest.approx(1059.44 * 0.3048**3)  # 1 ft = 0.3048 m
    assert data["accuracy"]["surface_temp_k"] == pytest.approx(1.0)
    _, out_m3, _ = check(*BEDROOM[:-6], "--room-volume", "30 m3", "--json")
    assert json.loads(out_m3)["room_volume_m3"] == 30.0


@pytest.mark.parametrize(
    ("args", "message"),
    [
        (["--room-volume", "-5"], "--room-volume -5: room volume must be between 1 and 100000 m³"),
        (["--room-volume", "30 kg"], "--room-volume 30 kg: unit 'kg' is not a volume unit"),
        (["--room-volume", "big"], "--room-volume big: expected a number in m³"),
        (
            ["--occupants", "2.5"],
            "--occupants 2.5: expected a whole number of people from 0 to 500",
        ),
        (["--occupants", "-1"], "--occupants -1: expected a whole number"),
        (["--occupants", "two"], "--occupants two: expected a whole number"),
        (["--target-rh", "95"], "--target-rh 95: target RH must be between 25 and 80 %"),
        (["--use", "garage"], "argument --use: invalid choice: 'garage'"),
        (["--rh-accuracy", "50"], "--rh-accuracy 50: accuracy must be between 0.1 and 20 %RH"),
        (["--air-temp-accuracy", "abc"], "--air-temp-accuracy abc: expected a number"),
        (
            ["--surface-temp-accuracy", "-1"],
            "--surface-temp-accuracy -1: accuracy must be between 0",
        ),
    ],
)
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
    code = (
        "import contextlib, io, sys\nfrom survey.cli import main\n"
        "with contextlib.redirect_stdout(io.StringIO()):\n"
        f"    main(['check', *{BEDROOM!r}, '--target-rh', '55', '--rh-accuracy', '2',"
        " '--air-temp-accuracy', '0.3', '--surface-temp-accuracy', '0.5',"
        " '--glazing-temp', '5', '--pipe-temp', '9', '--surface', 'floor:14:slab',"
        " '--json'])\n"
        "print(' '.join(sys.modules))"
    )
    result = subprocess.run(
        [sys.executable, "-c", code], capture_output=True, text=True, timeout=60
    )
    assert result.returncode == 0, result.stderr
    loaded = set(result.stdout.split())
    assert "survey.assess" in loaded and "survey.advise" in loaded
    assert "pint" not in loaded and "rich" not in loaded and "textual" not in loaded


# --- what each surface is -----------------------------------------------------------------

WINTER = [
    "--air-temp",
    "16",
    "--rh",
    "75",
    "--surface-temp",
    "9.5",
    "--surface-temp",
    "12",
    "--surface-temp",
    "5",
    "--outdoor-temp",
    "2",
    "--outdoor-rh",
    "90",
    "--room-volume",
    "30",
    "--occupants",
    "2",
    "--use",
    "bedroom",
]


def test_the_winter_repro_leads_with_warming_the_wall(check):
    """16 °C / 75 % with a 5 °C wall and 2 °C / 90 % outdoors (far drier, CoolProp W): no
    practical room RH keeps the 5 °C wall under 80 % surface RH (it needs the room below
    38 %, under the 40 % floor, common practice), so a dehumidifier cannot cure it: the
    advice leads with warming the wall, still ventilates (outdoor air is drier), and gives
    no dehumidifier."""
    assert cp("W", 2.0, 90.0) < cp("W", 16.0, 75.0) - 0.004
    status, out, err = check(*WINTER, "--json")
    assert status == 0, err
    data = json.loads(out)
    kinds = [a["kind"] for a in data["actions"]]
    assert kinds[0] == "raise_surface_temperature"
    assert data["actions"][0]["dehumidifier_cannot_cure"] is True
    assert "ventilate" in kinds and "dehumidify" not in kinds
    titles = [a["title"] for a in data["actions"]]
    assert len(titles) == len(set(titles))


def test_glazing_and_pipes_are_named_and_judged_apart(check):
    """--glazing-temp, --pipe-temp and --surface ELEMENT:T:LABEL say what a surface is; the
    highest safe room RH refers to the coldest wall, ceiling or floor and says so, with its
    label and element: for the 11 °C wall, 80 × p_ws(11)/p_ws(18) (CoolProp, BS 5250 limit
    [R]); glazing and pipes are reported apart."""
    status, out, err = check(
        "--air-temp",
        "18",
        "--rh",
        "72",
        "--glazing-temp",
        "4",
        "--surface",
        "external_wall:11:north wall",
        "--pipe-temp",
        "8",
        "--surface",
        "internal_wall:15.5",
        "--json",
    )
    assert status == 0, err
    data = json.loads(out)
    assert [(s["label"], s["element"]) for s in data["surfaces"]] == [
        ("Glazing 1", "glazing"),
        ("north wall", "external_wall"),
        ("Pipe 1", "pipe"),
        ("Internal wall 1", "internal_wall"),
    ]
    assert data["coldest_surface"] == "north wall"
    assert data["coldest_surface_element"] == "external_wall"
    assert "coldest wall, ceiling or floor" in data["max_room_rh_basis"]
    allowed = 80.0 * cp("P_w", 11.0, 100.0) / cp("P_w", 18.0, 100.0)
    assert data["max_room_rh_pct_for_coldest_surface"] == pytest.approx(allowed, rel=0.003)
    assert data["coldest_glazing_or_pipe"] == "Glazing 1"
    assert data["max_room_rh_pct_dry_glazing_or_pipe"] == pytest.approx(
        100.0 * cp("P_w", 4.0, 100.0) / cp("P_w", 18.0, 100.0), rel=0.003
    )
    glass, _, _pipe, _ = data["surfaces"]
    assert glass["judged_as"] == "glazing" and glass["mould"] == "not_judged"
    assert glass["temperature_factor_state"] == "not_for_element"
    kinds = [a["kind"] for a in data["actions"]]
    assert "reduce_glazing_condensation" in kinds and "insulate_pipe" in kinds


@pytest.mark.parametrize(
    ("args", "message"),
    [
        (["--surface", "roof:5"], "--surface roof:5: element expected one of external_wall"),
        (["--surface", "glazing"], "--surface glazing: expected ELEMENT:TEMPERATURE"),
        (["--surface", "glazing:warm"], "--surface glazing:warm: expected a number"),
        (["--glazing-temp", "200"], "--glazing-temp 200: surface temperature must be between"),
    ],
)
def test_bad_surface_options(check, args, message):
    """Bad surface options: status 2, one line naming the option, the text and the fix."""
    status, out, err = check("--air-temp", "18", "--rh", "72", *args)
    assert status == 2 and out == ""
    assert message in err, err
    assert len(err.strip().splitlines()) == 1


def test_help_explains_the_surface_options(check):
    """--help tells how to say which surface is glass or pipe."""
    status, out, _ = check("--help")
    assert status == 0
    flat = " ".join(out.split())
    for words in (
        "--glazing-temp",
        "--pipe-temp",
        "--frame-temp",
        "ELEMENT:T[:LABEL]",
        "external_wall:11.2:NE corner",
        "never set the room's RH target",
    ):
        assert words in flat, words
    # The defaults quoted are the thresholds table's (typical specifications, common
    # practice): air ±0.5 K, RH ±3 %, surface ±1 K.
    assert "(air ±0.5 K, RH ±3 %, surface ±1 K)" in flat


# --- words for a client -------------------------------------------------------------------


def test_summary_comes_first(check, monkeypatch):
    """A short summary (3 to 6 lines: surfaces, highest safe RH, first action) opens the
    table, before the moist-air table, and its highest safe RH is the Room section's."""
    monkeypatch.setenv("COLUMNS", "400")
    status, out, _ = check(*WINTER)
    assert status == 0
    lines = out.splitlines()
    assert lines[0].strip() == "Summary"
    end = lines.index("")
    summary = [line.strip() for line in lines[1:end]]
    assert 3 <= len(summary) <= 6
    assert out.index("Summary") < out.index("Moist air")
    assert summary[0].startswith("Surface 3, 5.0 °C: water forming; above the mould limit")
    assert any(line.startswith("Highest safe room RH: 38 %") for line in summary)
    assert summary[-1].startswith("First: Raise the surface temperature: Surface 3")
    assert "can bear: 38 %" in " ".join(out.split())


def test_surface_rh_over_100_and_degenerate_bands(check, monkeypatch):
    """100 % surface RH or more reads "100 % or more (water forming)" (frost below 0 °C); the
    JSON keeps the number; a surface warmer than the air shows no "100 to 100" band."""
    monkeypatch.setenv("COLUMNS", "400")
    _, out, _ = check(
        "--air-temp", "18", "--rh", "72", "--surface-temp", "5", "--surface-temp", "-4"
    )
    flat = " ".join(out.split())
    assert "100 % or more (water forming)" in flat and "100 % or more (frost forming)" in flat
    assert "frost forming now" in flat
    _, out, _ = check("--air-temp", "18", "--rh", "72", "--surface-temp", "5", "--json")
    assert json.loads(out)["surfaces"][0]["surface_rh_pct"] > 100.0
    _, out, _ = check("--air-temp", "18", "--rh", "50", "--surface-temp", "25")
    flat = " ".join(out.split())
    assert "100 to 100" not in flat
    # warmer than the air: heated or sunlit, so it neither sets a safe RH nor gets a factor
    assert "warmer than the room air" in flat and "no highest safe room RH" in flat


def test_frost_point_is_called_so(check, monkeypatch):
    """At 2 °C / 60 % the condensation point is the frost point, −4.4 °C by the WMO ice
    formula (−4.38 °C, Guide No. 8 Annex 4.B [R, secondary]); the Room section names it a
    frost point, and gives the dew point over water beside it."""
    monkeypatch.setenv("COLUMNS", "400")
    _, out, _ = check("--air-temp", "2", "--rh", "60", "--surface-temp", "-6")
    flat = " ".join(out.split())
    assert "Condensation point (frost point) -4.4 °C" in flat
    assert "Dew point -4.4" not in flat
    _, out, _ = check("--air-temp", "2", "--rh", "60", "--surface-temp", "-6", "--json")
    data = json.loads(out)
    assert data["condensation_point_is_frost_point"] is True
    assert data["surfaces"][0]["frost"] is True
    assert data["surfaces"][0]["condensation"] == "condensing"


@pytest.mark.parametrize(
    ("extra", "reason"),
    [
        ([], "no outdoor reading"),
        (
            ["--outdoor-temp", "12", "--outdoor-rh", "80"],
            "the inside-outside difference is 6.0 K, under the 10 K needed",
        ),
    ],
)
def test_factor_not_judged_says_why(check, monkeypatch, extra, reason):
    """ "Cannot be judged today" always says why: no outdoor reading, or an inside-outside
    difference under the 10 K needed (common practice, no source)."""
    monkeypatch.setenv("COLUMNS", "400")
    _, out, _ = check(
        "--air-temp", "18", "--rh", "72", "--surface-temp", "11", "--use", "bedroom", *extra
    )
    flat = " ".join(out.split())
    assert f"cannot be judged today: {reason}" in flat
    assert f"Temperature factor: cannot be judged today — {reason}" in flat


def test_use_not_given_reads_neutrally(check, monkeypatch):
    """No --use: "not given", the general limit 0.70 (IEA Annex 14 [M]), never "use not
    listed" or "a room of this kind"."""
    monkeypatch.setenv("COLUMNS", "400")
    _, out, _ = check(*BEDROOM[:-2])
    flat = " ".join(out.split())
    assert "Use: not given (--use); the general temperature-factor limit 0.70 applies" in flat
    assert "use not listed" not in flat and "of this kind" not in flat


def test_ip_limits_and_rating_points(check, monkeypatch):
    """In IP the 3 K margin reads 5.4 °F (3 × 1.8) and the dehumidifier rating points read
    80 °F and 65 °F (AHAM DH-1, current US test [R, secondary]); the marks read for a client."""
    monkeypatch.setenv("COLUMNS", "400")
    _, out, _ = check(
        "--units",
        "ip",
        "--air-temp",
        "71.6",
        "--rh",
        "75",
        "--surface-temp",
        "62.6",
        "--outdoor-temp",
        "82.4",
        "--outdoor-rh",
        "75",
        "--room-volume",
        "2119",
        "--occupants",
        "0",
        "--use",
        "basement",
    )
    flat = " ".join(out.split())
    assert "Dew-point margin 5.4 °F: ISO 8502-4" in flat
    assert "Dew-point margin 3 K" not in flat
    assert "80 °F and 60 % RH" in flat and "65 °F and 60 % RH" in flat
    assert "80.1 °F" not in flat and "64.9 °F" not in flat
    assert "from memory" not in flat.split("Limits used")[1]
    assert ("* value not checked here against the original text of the source named") in flat


def test_units_upper_case_and_plausibility_warning(check):
    """--units IP is accepted; a bare SI air temperature above 40 °C gets one warning line on
    stderr and the check goes on; 70F or --units ip give none."""
    status, out, err = check("--air-temp", "70", "--rh", "55", "--json")
    assert status == 0
    assert err.strip() == (
        "survey: warning: --air-temp 70: read as 70 °C; for °F use --units ip or 70F"
    )
    assert json.loads(out)["dry_bulb_c"] == 70.0
    for args in (
        ["--air-temp", "70F", "--rh", "55"],
        ["--air-temp", "70", "--rh", "55", "--units", "IP"],
    ):
        status, out, err = check(*args, "--json")
        assert status == 0 and err == ""
        # 70 °F = (70 − 32)/1.8 °C, exact by definition of the scales.
        assert json.loads(out)["dry_bulb_c"] == pytest.approx((70 - 32) / 1.8)


def test_dehumidifier_numbers_read_once(check, monkeypatch):
    """The daily total and the size are one number in the table, and a load that cannot be
    worked out gives no "at least" sentence (null in JSON)."""
    monkeypatch.setenv("COLUMNS", "400")
    no_people = [a for a in SUMMER if a not in ("--occupants", "0")]
    no_people[no_people.index("basement")] = "bedroom"  # an occupied room: no guess at people
    _, out, _ = check(*no_people, "--json")
    dehum = json.loads(out)["actions"][0]
    assert dehum["kind"] == "dehumidify" and dehum["removal_l_per_day"] is None
    assert "at least" not in dehum["reason"] and "room volume" not in dehum["reason"]


def test_mould_area_option_feeds_the_mould_caution(check):
    """--mould-area 2 (m²) is a medium area: between the small and large area guidance
    limits of thresholds (common practice, no source); the caution says so."""
    _, out, _ = check(
        "--air-temp", "18", "--rh", "72", "--surface-temp", "12", "--mould-area", "2", "--json"
    )
    cautions = json.loads(out)["cautions"]
    medium = [c for c in cautions if c.startswith("Visible mould, about 2 m²: a medium area")]
    assert medium and "FFP2 / N95" in medium[0]


def test_mould_seen_without_area_is_treated_as_medium(check):
    _, out, _ = check("--air-temp", "18", "--rh", "72", "--mould-seen", "--json")
    assert any(
        c.startswith("Visible mould, area not measured") for c in json.loads(out)["cautions"]
    )


def test_surface_above_mould_limit_without_mould_options_adds_if_visible_caution(check):
    """18 °C / 72 % on a 12 °C wall: the wall is below the room's dew point (about 12.9 °C
    by CoolProp), so its surface RH is far above 80 % (BS 5250 Annex D); no mould option
    given, so the 'if mould is visible' caution shows."""
    _, out, _ = check("--air-temp", "18", "--rh", "72", "--surface-temp", "12", "--json")
    data = json.loads(out)
    assert data["surfaces"][0]["mould"] == "above_limit"
    assert any(
        c.startswith("A surface is above the mould limit: if mould is visible")
        for c in data["cautions"]
    )


@pytest.mark.parametrize("area", ["0", "-1", "abc"])
def test_bad_mould_area_is_refused(check, area):
    code, _, err = check("--air-temp", "18", "--rh", "72", "--mould-area", area)
    assert code == 2 and "--mould-area" in err


def test_lowered_target_rh_says_why(check):
    """--target-rh 65 on a wall that bears only 50 % (mould limit 80 %, BS 5250 Annex D):
    the target is lowered, and the text says from what and why."""
    _, out, _ = check(*BEDROOM, "--target-rh", "65", "--json")
    reasons = " ".join(a["reason"] for a in json.loads(out)["actions"])
    assert "the 65 % given was lowered to" in reasons


def test_factor_above_limit_with_band_touching_it_needs_no_action(check, monkeypatch):
    """Wall 15.2 °C, room 20 °C, outdoors 0 °C: fRsi = 15.2 / 20 = 0.76 (EN ISO 13788
    definition, from memory), above the 0.75 bedroom limit (BRE IP1/06, from memory), with
    the ±1 K surface accuracy band reaching below: the summary gives the value and says no
    action is needed, with no 'may be under' beside 'Nothing to do'."""
    monkeypatch.setenv("COLUMNS", "400")
    _, out, _ = check(
        "--air-temp",
        "20",
        "--rh",
        "50",
        "--surface",
        "external_wall:15.2",
        "--outdoor-temp",
        "0",
        "--outdoor-rh",
        "80",
        "--use",
        "bedroom",
    )
    flat = " ".join(out.split())
    assert "temperature factor 0.76, meets the 0.75 limit" in flat
    assert "no action needed" in flat and "may be under the limit" not in flat


def test_factor_just_under_limit_inside_band_is_not_nothing_to_do(check, monkeypatch):
    """Wall 14.5 °C: fRsi 0.725, under 0.75 but inside the band: not 'Nothing to do'."""
    monkeypatch.setenv("COLUMNS", "400")
    _, out, _ = check(
        "--air-temp",
        "20",
        "--rh",
        "50",
        "--surface",
        "external_wall:14.5",
        "--outdoor-temp",
        "0",
        "--outdoor-rh",
        "80",
        "--use",
        "bedroom",
    )
    flat = " ".join(out.split())
    assert "Nothing to do" not in flat and "No action is certain" in flat
