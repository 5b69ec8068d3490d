"""The uncertainty bands against a seeded Monte Carlo, and monotonic properties.

The Monte Carlo follows the propagation of distributions of GUM Supplement 1 (JCGM 101:2008,
from memory): each instrument reading is drawn uniformly within its ± accuracy (the
rectangular reading of a specification, GUM 4.3.7, from memory), the outputs are computed
with psychro's full state (not the assessment's light path), and their standard deviation
and the share inside ±U are compared with the first-order propagation.
"""

from __future__ import annotations

import math
import random
import statistics

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from survey import assess, psychro
from survey.assess import Accuracy, OutdoorInput, RoomInput, SurfaceInput

P = 101_325.0
SAMPLES = 20_000
# With 20 000 samples a standard deviation is known to about 0.5 % (1/sqrt(2N)); first-order
# propagation of these smooth functions over ±1 K is good to well under 1 %.
STD_TOLERANCE = 0.03

CASES = [
    # air °C, RH %, surface °C, outdoor °C, outdoor RH %, accuracy
    (18.0, 72.0, 15.5, 3.0, 88.0, Accuracy(0.5, 3.0, 1.0, shared_thermometer=False)),
    (21.0, 45.0, 5.0, -4.0, 90.0, Accuracy(0.3, 2.0, 0.5, shared_thermometer=False)),
    # frost point, ice side
    (2.0, 80.0, -6.0, -12.0, 85.0, Accuracy(0.5, 3.0, 1.0, shared_thermometer=False)),
    (28.0, 85.0, 25.0, 8.0, 70.0, Accuracy(1.0, 5.0, 2.0, shared_thermometer=False)),
]


def _draws(rng, centre, half):
    return centre + rng.uniform(-half, half)


def _monte_carlo(air_c, rh, ts, out_c, out_rh, acc, seed=20240517):
    rng = random.Random(seed)
    margin, ln_rh_s, factor, excess = [], [], [], []
    for _ in range(SAMPLES):
        a = _draws(rng, air_c, acc.air_temp_k)
        h = min(100.0, _draws(rng, rh, acc.rh_pct))
        s = _draws(rng, ts, acc.surface_temp_k)
        o = _draws(rng, out_c, acc.air_temp_k)
        oh = min(100.0, _draws(rng, out_rh, acc.rh_pct))
        room = psychro.state_from_rh(a, h, P)
        outdoor = psychro.state_from_rh(o, oh, P)
        margin.append(s - room.condensation_point_c)
        ln_rh_s.append(math.log(psychro.surface_rh_pct(room, s)))
        factor.append((s - o) / (a - o))
        excess.append(room.vapour_pressure_pa - outdoor.vapour_pressure_pa)
    return margin, ln_rh_s, factor, excess


def _inside(values, centre, half_width):
    return sum(abs(v - centre) <= half_width for v in values) / len(values)


@pytest.mark.parametrize("case", CASES, ids=[f"{c[0]}C-{c[1]}pct-on-{c[2]}C" for c in CASES])
@pytest.mark.slow
def test_bands_match_monte_carlo(case):
    """Standard uncertainties agree with the Monte Carlo spread within 3 %, and ±U (k = 2)
    holds 94-99.5 % of the draws, for margin, surface RH, fRsi and vapour-pressure excess."""
    air_c, rh, ts, out_c, out_rh, acc = case
    finding = assess.assess_room(
        RoomInput("R", "bedroom", air_c, rh, (SurfaceInput("S", ts),)),
        OutdoorInput(out_c, out_rh),
        P,
        acc,
    )
    s = finding.surfaces[0]
    margin, ln_rh_s, factor, excess = _monte_carlo(*case)
    k = 2.0
    ln_half = math.log(s.surface_rh_high_pct / s.surface_rh_pct)
    checks = [
        (margin, s.dew_point_margin_k, s.margin_uncertainty_k),
        (ln_rh_s, math.log(s.surface_rh_pct), ln_half),
        (factor, s.temperature_factor, s.temperature_factor_uncertainty),
        (excess, finding.vapour_pressure_excess_pa, finding.vapour_pressure_excess_uncertainty_pa),
    ]
    for values, centre, big_u in checks:
        assert statistics.pstdev(values) == pytest.approx(big_u / k, rel=STD_TOLERANCE)
        assert 0.94 <= _inside(values, centre, big_u) <= 0.995
    # The log band is symmetric: the low end is the same factor below.
    assert math.log(s.surface_rh_pct / s.surface_rh_low_pct) == pytest.approx(ln_half)


@pytest.mark.parametrize("case", CASES, ids=[f"{c[0]}C-on-{c[2]}C" for c in CASES])
@pytest.mark.slow
def test_shared_thermometer_factor_band_matches_monte_carlo(case):
    """One thermometer read indoors and out: its error is the same draw in both readings
    (fully correlated, GUM 5.2), and the fRsi band follows u² = (u_ts² + u_ti²)/Δ²."""
    air_c, rh, ts, out_c, out_rh, acc = case
    shared = Accuracy(acc.air_temp_k, acc.rh_pct, acc.surface_temp_k, shared_thermometer=True)
    s = assess.assess_room(
        RoomInput("R", "bedroom", air_c, rh, (SurfaceInput("S", ts),)),
        OutdoorInput(out_c, out_rh),
        P,
        shared,
    ).surfaces[0]
    rng = random.Random(99)
    factor = []
    for _ in range(SAMPLES):
        offset = rng.uniform(-acc.air_temp_k, acc.air_temp_k)
        surface = _draws(rng, ts, acc.surface_temp_k)
        factor.append((surface - (out_c + offset)) / ((air_c + offset) - (out_c + offset)))
    assert statistics.pstdev(factor) == pytest.approx(
        s.temperature_factor_uncertainty / 2.0, rel=STD_TOLERANCE
    )
    assert 0.94 <= _inside(factor, s.temperature_factor, s.temperature_factor_uncertainty) <= 0.995


def test_condensation_point_band_matches_monte_carlo():
    """The condensation point's U/2 equals the spread of psychro's dew point over the draws."""
    acc = Accuracy(0.5, 3.0, 1.0)
    finding = assess.assess_room(RoomInput("R", "bedroom", 18.0, 72.0), None, P, acc)
    rng = random.Random(7)
    dews = [
        psychro.state_from_rh(
            _draws(rng, 18.0, 0.5), _draws(rng, 72.0, 3.0), P
        ).condensation_point_c
        for _ in range(SAMPLES)
    ]
    assert statistics.pstdev(dews) == pytest.approx(
        finding.condensation_point_uncertainty_k / 2.0, rel=STD_TOLERANCE
    )


@pytest.mark.slow
def test_monte_carlo_would_catch_a_wrong_band():
    """The check has teeth: a band a fifth too narrow fails the coverage test."""
    case = CASES[0]
    room = RoomInput("R", "bedroom", case[0], case[1], (SurfaceInput("S", case[2]),))
    finding = assess.assess_room(room, OutdoorInput(*case[3:5]), P, case[5])
    margin = _monte_carlo(*case)[0]
    s = finding.surfaces[0]
    assert _inside(margin, s.dew_point_margin_k, 0.8 * s.margin_uncertainty_k) < 0.94


# --- properties --------------------------------------------------------------------------------

rooms = st.tuples(st.floats(5.0, 30.0), st.floats(20.0, 95.0))
accuracies = st.builds(Accuracy, st.floats(0.0, 1.0), st.floats(0.0, 5.0), st.floats(0.0, 2.0))


#: Mould states for a surface outside the 5-40 °C range of the 80 % criterion
#: (ASHRAE Standard 160-2009, secondary source).
_OUT_OF_RANGE = (assess.MouldState.TOO_COLD, assess.MouldState.TOO_HOT)


@settings(max_examples=150, deadline=None)
@given(rooms, st.floats(-10.0, 30.0), st.floats(0.01, 10.0), accuracies, st.floats(-15.0, -5.0))
def test_a_colder_surface_is_never_safer(room, warm_c, drop, accuracy, outdoor_c):
    """Lowering a surface's temperature never improves any of its states, best or worst end
    of the band, and never lowers its surface RH or raises its margin or factor."""
    air_c, rh = room
    cold_c = warm_c - drop
    finding = assess.assess_room(
        RoomInput(
            "R", "bedroom", air_c, rh, (SurfaceInput("warm", warm_c), SurfaceInput("cold", cold_c))
        ),
        OutdoorInput(outdoor_c, 80.0),
        P,
        accuracy,
    )
    warm, cold = finding.surfaces
    assert cold.surface_rh_pct > warm.surface_rh_pct
    assert cold.dew_point_margin_k < warm.dew_point_margin_k
    for attr in ("condensation_possible", "mould_possible"):
        w, c = getattr(warm, attr), getattr(cold, attr)
        if c[0] in _OUT_OF_RANGE or w[0] in _OUT_OF_RANGE:
            continue  # mould not judged outside 5-40 °C surface temperature
        assert c[0].rank >= w[0].rank and c[-1].rank >= w[-1].rank
    if warm.temperature_factor is not None:
        assert cold.temperature_factor < warm.temperature_factor
        w, c = warm.temperature_factor_possible, cold.temperature_factor_possible
        assert c[0].rank >= w[0].rank and c[-1].rank >= w[-1].rank
    if cold_c <= air_c:
        assert finding.coldest.label == "cold"
    else:  # both warmer than the air (heated or sunlit): neither sets the safe room RH
        assert finding.coldest is None and finding.max_room_rh_pct is None


@settings(max_examples=100, deadline=None)
@given(rooms, st.floats(-10.0, 30.0), accuracies)
def test_states_are_consistent_with_their_bands(room, ts, accuracy):
    """A decided state holds at both ends of the band; 'cannot tell' lists at least two."""
    air_c, rh = room
    s = assess.assess_room(
        RoomInput("R", "other", air_c, rh, (SurfaceInput("S", ts),)), None, P, accuracy
    ).surfaces[0]
    for state, possible in ((s.condensation, s.condensation_possible), (s.mould, s.mould_possible)):
        if state in _OUT_OF_RANGE:
            assert possible == (state,) and not 5.0 <= ts <= 40.0
            continue
        if state.rank is None:
            assert len(possible) >= 2
        else:
            assert possible == (state,)
    if s.condensation is assess.CondensationState.CONDENSING:
        assert s.dew_point_margin_k + s.margin_uncertainty_k <= 0.0
    if s.mould is assess.MouldState.BELOW:
        assert s.surface_rh_high_pct < 70.0
