"""A limit defined in whole degrees Fahrenheit (the US dehumidifier rating points) is stored as
its exact conversion and reads the same in the limits as in the sentences: 80 °F and 65 °F in
IP, 26.7 °C and 18.3 °C in SI.

The conversion is t/°C = (t/°F − 32)/1.8 (NIST SP 811, 2008, B.8, "degree Fahrenheit").
"""

from __future__ import annotations

import json

import pytest

from survey import thresholds as th
from survey import words

RATINGS = (
    # AHAM DH-1 rating point 80 °F; the current US test 65 °F (the records' sources)
    ("dehumidifier_rating_old_dry_bulb_c", 80.0, "26.7 °C"),
    ("dehumidifier_rating_current_dry_bulb_c", 65.0, "18.3 °C"),
)


@pytest.mark.parametrize(("key", "fahrenheit", "si_text"), RATINGS)
def test_a_rating_point_is_its_exact_conversion(key, fahrenheit, si_text):
    """Stored as (°F − 32)/1.8, it reads whole °F in IP and to 0.1 °C in SI, in the client's
    limits and in the method's citation alike."""
    t = th.get(key)
    assert t.value == (fahrenheit - 32.0) / 1.8
    assert words.limit_value_text(t, words.IP) == f"{fahrenheit:.0f} °F"
    assert words.client_citation(t, words.IP).startswith(f"{t.title} {fahrenheit:.0f} °F")
    assert words.limit_value_text(t, words.SI) == si_text
    assert t.value_text == si_text and t.citation().startswith(si_text + ":")


def test_a_limit_defined_in_celsius_reads_as_before_in_ip():
    """A limit defined in °C keeps its conversion to 0.1 °F: the default month's 0 °C is
    32.0 °F (0 × 1.8 + 32), the class lines' 20 °C is 68.0 °F (20 × 1.8 + 32)."""
    for key, text in (
        ("design_month_outdoor_temp_default_c", "32.0 °F"),
        ("humidity_class_zero_at_c", "68.0 °F"),
    ):
        assert words.limit_value_text(th.get(key), words.IP) == text


def test_the_sentence_and_the_limit_say_the_same_in_ip(check):
    """`survey check --units ip` on a cool damp basement (63 °F, as the golden humid-basement
    case in °F): the dehumidifying action's sentence names the rating points as 80 °F and
    65 °F, the same as the limits list of its keys."""
    status, out, err = check(
        "--units", "ip", "--air-temp", "63", "--rh", "78", "--surface-temp", "55",
        "--outdoor-temp", "75", "--outdoor-rh", "75", "--use", "basement",
        "--room-volume", "3000", "--json",
    )  # fmt: skip
    assert status == 0, err
    data = json.loads(out)
    text = json.dumps(data, ensure_ascii=False)
    assert "80 °F and 60 % RH for older ratings" in text
    assert "65 °F and 60 % RH for the current US test" in text
    for key, fahrenheit, _ in RATINGS:
        assert key in text
        shown = words.limit_value_text(th.get(key), words.IP)
        assert shown == f"{fahrenheit:.0f} °F"
    assert "80.1 °F" not in text and "64.9 °F" not in text
