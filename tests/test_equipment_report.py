"""The report's dehumidifier block: on the basement example each visit's room shows the
unit's measured removal, energy factor and COP beside its rating, the findings, and the
limits the block used are cited in the method section."""

from __future__ import annotations

from pathlib import Path

import msgspec
import pytest

from survey import equipment as eq
from survey import report, store
from survey.report.markdown import Items, Table
from survey.words import SI
from survey.words import equipment as we

ROOT = Path(__file__).resolve().parents[1]
BASEMENT = ROOT / "example_sites" / "basement-burst-pipe-drying.json"


@pytest.fixture(scope="module")
def basement():
    return store.load_survey(BASEMENT)


def _doc(survey, units="si"):
    return report.build(survey, report.ReportOptions(visit="all", units=units))


def _tables(doc, visit):
    return [
        b
        for b in doc.blocks
        if isinstance(b, Table) and b.name == "dehumidifiers" and b.visit == visit
    ]


@pytest.mark.parametrize("visit", [1, 2, 3])
def test_each_visit_shows_the_unit_beside_its_rating(basement, visit):
    """One table per visit, in the family room, whose cells hold the core's numbers."""
    (table,) = _tables(_doc(basement), visit)
    assert table.room == "family" and table.header == we.REPORT_HEADER
    (row,) = table.rows
    r = eq.judge_visit(basement, visit - 1)[0].result
    by_key = {c.key: c.value for c in row if c.key}
    assert by_key["removal_l_per_day"] == r.removal_l_per_day
    assert by_key["energy_factor_l_per_kwh"] == r.energy_factor_l_per_kwh
    assert by_key["cop"] == r.cop
    assert by_key["comparison.rated_capacity_l_per_day"] == 50.0
    assert row[-1].text == we.found_text(r)


def test_day_2_cells_as_shown(basement):
    """Day 2: 18 L in 24 h is 18.0 L/day; EF 18 / 18.0 = 1.00 L/kWh (by hand, 750 W × 24 h)."""
    (row,) = _tables(_doc(basement), 2)[0].rows
    assert row[1].text == "18.0 L/day (38.0 US pints/day)"
    assert row[2].text == "1.00 L/kWh"
    assert "26.7 °C, 60 % RH" in row[4].text
    ip_row = _tables(_doc(basement, "ip"), 2)[0].rows[0]
    assert ip_row[1].text == "38.0 US pints/day (18.0 L/day)"
    assert "80 °F, 60 % RH" in ip_row[4].text


def test_the_sentences_and_the_limits_are_in_the_report(basement):
    """The unit's sentences follow its table, and the method section cites the rating
    condition and the scaling."""
    doc = _doc(basement)
    items = [b for b in doc.blocks if isinstance(b, Items) and b.name == "dehumidifier"]
    assert len(items) == 3
    r = items[1].values[0]
    assert [text for _, text in items[1].items] == we.unit_lines(r, SI)
    limits = next(b for b in doc.blocks if isinstance(b, Items) and b.name == "limits")
    cited = {t.key for t in limits.values}
    assert {"dehumidifier_rating_old_dry_bulb_c", "dehumidifier_nominal_coil_c"} <= cited
    assert "dehumidifier_shortfall_fraction" in cited  # day 3 is below what the air allows
    text = report.render(doc)
    assert we.REPORT_HEADING in text and we.COOLING_BASIS.split(":")[0] in text


def test_a_room_without_a_dehumidifier_has_no_block(basement):
    """The store and the office have no dehumidifier: no table for them."""
    rooms = {
        t.room for t in _doc(basement).blocks if isinstance(t, Table) and t.name == "dehumidifiers"
    }
    assert rooms == {"family"}


def test_a_unit_missing_its_outlet_is_listed_as_not_checked(basement):
    """Without an outlet reading the row says not checked and a sentence says why."""
    visits = list(basement.visits)
    rooms = list(visits[1].rooms)
    family = next(i for i, rv in enumerate(rooms) if rv.room == "family")
    items = list(rooms[family].equipment)
    items[0] = msgspec.structs.replace(items[0], outlet=None)
    rooms[family] = msgspec.structs.replace(rooms[family], equipment=items)
    visits[1] = msgspec.structs.replace(visits[1], rooms=rooms)
    survey = msgspec.structs.replace(basement, visits=visits)
    (row,) = _tables(_doc(survey), 2)[0].rows
    assert row[-1].text == we.NOT_CHECKED
    assert "cannot be checked without the air leaving it" in report.render(_doc(survey))


def test_user_text_in_a_label_is_escaped(basement):
    """A label with Markdown in it shows as typed, never as markup."""
    visits = list(basement.visits)
    rooms = list(visits[1].rooms)
    family = next(i for i, rv in enumerate(rooms) if rv.room == "family")
    items = list(rooms[family].equipment)
    items[0] = msgspec.structs.replace(items[0], label="**D1** | <b>")
    rooms[family] = msgspec.structs.replace(rooms[family], equipment=items)
    visits[1] = msgspec.structs.replace(visits[1], rooms=rooms)
    text = report.render(_doc(msgspec.structs.replace(basement, visits=visits)))
    assert r"\*\*D1\*\* \| \<b\>" in text


def test_inconsistent_stored_readings_print_no_absurd_number(basement):
    """99999 L over 0.01 h on day 2 would be 99999 × 24 / 0.01 = 239997600 L/day and a COP
    in the tens of millions: the row shows dashes and 'the readings are inconsistent', and
    the report prints neither number."""
    visits = list(basement.visits)
    rooms = list(visits[1].rooms)
    family = next(i for i, rv in enumerate(rooms) if rv.room == "family")
    items = list(rooms[family].equipment)
    items[0] = msgspec.structs.replace(items[0], water_removed_l=99999.0, run_hours=0.01)
    rooms[family] = msgspec.structs.replace(rooms[family], equipment=items)
    visits[1] = msgspec.structs.replace(visits[1], rooms=rooms)
    survey = msgspec.structs.replace(basement, visits=visits)
    (row,) = _tables(_doc(survey), 2)[0].rows
    assert [c.text for c in row[1:4]] == ["–", "–", "–"]
    assert we.FINDING_SHORT[eq.FindingKind.INCONSISTENT] in row[-1].text
    doc = _doc(survey)
    (items,) = [b for b in doc.blocks if isinstance(b, Items) and b.name == "dehumidifier"][1:2]
    text = "\n".join(line for _, line in items.items)
    for absurd in ("239997600", "507205775", "49170574"):
        assert absurd not in text
    assert "The readings are inconsistent" in text
    limits = next(b for b in doc.blocks if isinstance(b, Items) and b.name == "limits")
    assert "dehumidifier_removal_max_l_per_day" in {t.key for t in limits.values}
