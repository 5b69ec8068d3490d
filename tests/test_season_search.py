"""The search for the lowest month a surface bears (:func:`survey.season_math.refine` and
:func:`~survey.season_math.lowest_meeting`): it finds the change of sign to its tolerance
whatever the shape inside the step, and a full search agrees with a brute-force scan.

Check values: the roots below are closed forms (the cube root of 2, the kink of a piecewise
line), worked by hand; the brute-force reference is a plain scan at 0.001 K steps, so it is
independent of the search's own scan and refinement.
"""

from __future__ import annotations

import math

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from survey import season_math
from survey.season_math import SEARCH_TOLERANCE_K, InverseOutcome

#: What bisection of a 1 K step to the tolerance takes: ceil(log2(1 / tolerance)) tries.
BISECTION_TRIES = math.ceil(math.log2(1.0 / SEARCH_TOLERANCE_K))


def _counted(f):
    calls = []

    def wrapped(x):
        calls.append(x)
        return f(x)

    return wrapped, calls


def _refine(f, meets, fails):
    wrapped, calls = _counted(f)
    root = season_math.refine(wrapped, meets, fails, f(meets), f(fails))
    return root, calls


def test_smooth_root_in_a_few_tries():
    """f(t) = 2 − t³ falls through zero at t = ∛2 = 1.259921…, meeting (≤ 0) on the warm side
    as the surface RH does; a smooth step takes well under half of bisection's 14 tries."""
    root, calls = _refine(lambda t: 2.0 - t**3, 2.0, 1.0)
    assert root == pytest.approx(2.0 ** (1.0 / 3.0), abs=SEARCH_TOLERANCE_K)
    assert len(calls) <= BISECTION_TRIES // 2


def test_kinked_step_still_converges_within_twice_bisection():
    """A corner in the step (as where the room's air reaches saturation): f = 0.001·(t₀ − t)
    above t₀ = 0.3 and 50·(t₀ − t) below, so the secant keeps landing on one side. The root
    is the corner itself, 0.3; the bisection steps keep the count within twice bisection's."""

    def f(t):
        return 0.001 * (0.3 - t) if t > 0.3 else 50.0 * (0.3 - t)

    root, calls = _refine(f, 1.0, 0.0)
    assert root == pytest.approx(0.3, abs=SEARCH_TOLERANCE_K)
    assert len(calls) <= 2 * BISECTION_TRIES


def test_a_jump_is_found_as_bisection_finds_it():
    """A jump in the step (0 above 0.5, 1 below): no interpolation helps, and the search
    falls back to halving, with no more tries than twice bisection's."""
    root, calls = _refine(lambda t: 0.0 if t > 0.5 else 1.0, 1.0, 0.0)
    assert root == pytest.approx(0.5, abs=SEARCH_TOLERANCE_K)
    assert len(calls) <= 2 * BISECTION_TRIES


def test_meeting_end_exactly_on_the_limit():
    """At exactly the limit a surface meets it (≤ 0), so a root at the warm end is the warm
    end itself: f = 1 − t on [1, 0] gives 1."""
    root, _ = _refine(lambda t: 1.0 - t if t < 1.0 else 0.0, 1.0, 0.0)
    assert root == pytest.approx(1.0, abs=SEARCH_TOLERANCE_K)


def _brute_lowest(f, low_c, high_c, step=1e-3):
    """The first temperature, going down from ``high_c`` in ``step``, at which f > 0."""
    n = 0
    while True:
        t = high_c - n * step
        if t < low_c:
            return None
        if f(t) > 0.0:
            return t
        n += 1


@settings(max_examples=60, deadline=None)
@given(
    peak_c=st.floats(-28.0, 18.0),
    height=st.one_of(st.floats(0.05, 0.45), st.floats(1.0, 5.0)),
    width=st.floats(1.5, 20.0),
)
def test_lowest_meeting_agrees_with_a_fine_scan(peak_c, height, width):
    """A surface RH that rises to a peak and falls away again colder (as with a small excess
    below the class line's knee), a hump of the given height and half-width, less the limit:
    the search's answer is where a 0.001 K scan first finds the limit passed, to within that
    scan's step and the search's tolerance. A hump either stays below the limit (height
    under 0.5) or passes it over more than 2 K (height 1 or more, half-width 1.5 K or more),
    so the 1 K scan cannot step over it (the search's stated resolution)."""

    def f(t):
        return height * (1.0 - ((t - peak_c) / width) ** 2) - 0.5

    low_c, high_c = -30.0, 20.0
    outcome, found = season_math.lowest_meeting(f, low_c, high_c)
    expected = _brute_lowest(f, low_c, high_c)
    if f(high_c) > 0.0:
        assert outcome is InverseOutcome.FAILS_AT_WARM_END
    elif expected is None:
        assert outcome is InverseOutcome.MEETS_THROUGHOUT
    else:
        assert outcome is InverseOutcome.SOLVED
        assert found == pytest.approx(expected, abs=1e-3 + SEARCH_TOLERANCE_K)
