"""Material readings as words: in full for a sentence, in brief for a table cell, and the
rank that picks a table's symbol (on the scale the surfaces use)."""

from __future__ import annotations

from pathlib import Path

from survey import evaluate, store, words
from survey import thresholds as th
from survey.assess import DryStandardState, TimberState

EXAMPLE = Path(__file__).resolve().parents[1] / "example_sites" / "basement-burst-pipe-drying.json"


def _findings():
    survey = store.load_survey(EXAMPLE)
    return [
        m
        for index in range(len(survey.visits))
        for room in evaluate.assess_visit(survey, index).findings.rooms
        for m in room.materials
    ]


def test_every_state_has_words_in_full_and_in_brief():
    assert set(words.states.DRY_STANDARD_BRIEF) == set(DryStandardState)
    assert set(words.states.TIMBER_BRIEF) == set(TimberState)


def test_a_reading_above_a_standard_read_on_an_earlier_visit():
    """The full words carry the standard's value and the visit it was read on; the brief
    ones the visit; the rank is 2 (the surfaces' "over a limit")."""
    m = _findings()[0]._replace(
        dry_standard=20.0,
        dry_standard_state=DryStandardState.ABOVE,
        dry_standard_visit=0,
        timber_state=None,
    )
    assert words.material_state_words(m) == "above the dry standard of 20, read on visit 1"
    assert words.material_state_brief(m) == "above standard (visit 1's)"
    assert words.material_rank(m) == 2


def test_timber_ranks_by_its_limits_where_there_is_no_standard():
    m = _findings()[0]._replace(dry_standard=None, dry_standard_state=DryStandardState.NO_REFERENCE)
    dry = m._replace(timber_state=TimberState.DRY)
    decay = m._replace(timber_state=TimberState.DECAY_RANGE)
    mould = m._replace(timber_state=TimberState.MOULD_RANGE)
    assert [words.material_rank(x) for x in (dry, mould, decay)] == [0, 2, 2]
    assert words.material_rank(m._replace(timber_state=None)) is None
    assert words.material_state_words(decay) == (
        "no dry standard given; in the decay range for timber"
    )
    assert words.material_state_brief(mould) == "no standard; mould range"
    # timber wetter than its limit outranks a reading at its dry standard
    at = decay._replace(dry_standard=18.0, dry_standard_state=DryStandardState.AT)
    assert words.material_rank(at) == 2
    assert words.material_state_words(at) == (
        "at the dry standard of 18; in the decay range for timber"
    )


def test_the_example_readings_rank_by_the_limits():
    """Every judged reading of the drying example, end to end: a timber reading in % MC
    ranks 2 exactly when it is at or over the moisture content at which mould grows on
    timber (``timber_mould_mc_pct``) or above its dry standard; a reading with a dry
    standard ranks 2 exactly when it is over the standard plus its tolerance
    (``dry_standard_tolerance_fraction``), else 0."""
    findings = _findings()
    assert findings
    mould_mc = th.value("timber_mould_mc_pct")
    tolerance = th.value("dry_standard_tolerance_fraction")
    timber = [m for m in findings if m.timber_state is not None and m.scale == "mc_pct"]
    standard = [m for m in findings if m.dry_standard is not None]
    assert timber and standard
    for m in findings:
        over_standard = m.dry_standard is not None and m.value > m.dry_standard * (1 + tolerance)
        over_timber = m in timber and m.value >= mould_mc
        expected = (
            2 if over_standard or over_timber else 0 if m in timber or m in standard else None
        )
        assert words.material_rank(m) == expected, m


def test_the_worst_finding_in_words_names_a_material_where_it_ranks_highest():
    """The basement family room on its third visit: its surfaces are clear of the mould
    limit, but its three material points are above their dry standards (rank 2 against
    the surfaces' lower rank), so the room's words say so, as its symbol does."""
    from survey.app import judging
    from survey.words import screens

    survey = store.load_survey(EXAMPLE)
    judged = evaluate.assess_room(survey, 2, "family")
    assert judging.worst_rank(judged.finding) == 2
    assert screens.worst_state_words(judged.finding, words.SI) == (
        "plasterboard reading above standard (and 2 more)"
    )
    office = evaluate.assess_room(survey, 2, "office")  # dry standards only: the surface's
    assert screens.worst_state_words(office.finding, words.SI) == "below the mould limit"
