"""The quick check in the core: every input the faces accept can be judged."""

from __future__ import annotations

from hypothesis import given, settings
from hypothesis import strategies as st

from survey import assess, domain, psychro, quick
from survey.advise import ActionKind


def test_load_beyond_what_the_air_can_carry_is_a_finding():
    """65 people in 1 m³ at 0 °C: the practical airflow (2 air changes an hour, 2 m³/h)
    would have to carry 65 × 40 g/h = 2600 g/h (the asleep rate, a choice inside BS 5250's
    40-60 g/h), far more than air at 0 °C can hold (saturation about 3.8 g/kg, ASHRAE
    Table 2 at 0 °C [R]): the room would saturate. That is said, not raised as an error."""
    result = quick.judge(
        quick.QuickInput(
            air_temp_c=0.0,
            rh_pct=41.0,
            surfaces=(assess.SurfaceInput("wall", -8.0),),
            outdoor=assess.OutdoorInput(0.0, 14.0),
            use="bedroom",
            volume_m3=1.0,
            occupants=65,
        )
    )
    vent = next(a for a in result.advice.actions if a.kind is ActionKind.VENTILATE)
    assert vent.numbers.saturates is True
    assert vent.numbers.rh_at_practical_ventilation_pct == 100.0
    assert result.advice.moisture.used_g_per_h == 2600.0


def test_cli_case_exits_zero(check):
    """The same case on the command line exits 0 (it exited 2 naming a humidity ratio the
    user never typed)."""
    status, _, err = check(
        "--air-temp",
        "0",
        "--rh",
        "41",
        "--surface-temp=-8",
        "--outdoor-temp",
        "0",
        "--outdoor-rh",
        "14",
        "--use",
        "bedroom",
        "--room-volume",
        "1",
        "--occupants",
        "65",
        "--json",
    )
    assert status == 0, err


_temps = st.floats(psychro.DRY_BULB_MIN_C, psychro.DRY_BULB_MAX_C)
_rh = st.floats(psychro.RH_MIN_PCT, 100.0)


@settings(max_examples=200, deadline=None)
@given(
    air=_temps,
    rh=_rh,
    out_t=_temps,
    out_rh=_rh,
    surface=st.floats(psychro.SURFACE_TEMP_MIN_C, psychro.SURFACE_TEMP_MAX_C),
    use=st.sampled_from(
        ["bedroom", "bathroom", "kitchen", "basement", "loft", "other", "crawlspace", "storage"]
    ),
    volume=st.none() | st.floats(domain.ROOM_VOLUME_MIN_M3, domain.ROOM_VOLUME_MAX_M3),
    occupants=st.none() | st.integers(0, domain.OCCUPANTS_MAX),
    target=st.none() | st.floats(25.0, 80.0),
)
def test_every_accepted_input_is_judged(
    air, rh, out_t, out_rh, surface, use, volume, occupants, target
):
    """Any readings inside the input domain give a result with its words, never an error."""
    from survey import words

    result = quick.judge(
        quick.QuickInput(
            air_temp_c=air,
            rh_pct=rh,
            surfaces=(assess.SurfaceInput("s", surface),),
            outdoor=assess.OutdoorInput(out_t, out_rh),
            use=use,
            volume_m3=volume,
            occupants=occupants,
            target_rh_pct=target,
        )
    )
    for action in result.advice.actions:
        assert words.action_reason(action, result.finding, result.advice, words.SI)
        assert words.action_reason(action, result.finding, result.advice, words.IP)
